/** Turns one column of a published table into a spectrum. */
import { spectrumOnGrid, type Spectrum, type SpectrumLabel } from "../spectrum/spectrum.ts";
import type { TabulatedData } from "./tabulated-data.ts";

/** The named column of a tabulated dataset as a spectrum on the table's grid. */
export function tableColumn(table: TabulatedData, column: string, label: SpectrumLabel = {}): Spectrum {
  const values = table.columns[column];
  if (!values)
    throw new Error(`table has no column "${column}"; it has ${Object.keys(table.columns).join(", ")}`);
  return spectrumOnGrid(table.start, table.step, values, { name: column, ...label });
}
