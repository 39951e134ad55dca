/**
 * Display functions a notebook cell calls to put something in the report. Each turns its argument into a plain
 * output record (see records.ts) and hands it to the cell process; nothing returns a value, so a display call as a
 * cell's last line is not shown twice. Available in every cell as globals and as `import { ... } from "tristim"`.
 */
import { inspect } from "node:util";
import { roundedPair } from "../lib/uncertainty/rounded-pair.ts";
import { describeValue as describe } from "./describe-value.ts";
import { CAUTION_KEY, emitCautionsOf } from "./cautions.ts";
import { checkDigits, formatNumber } from "./format-number.ts";
import { emitRecord as emit } from "./emit.ts";
import { toPlainData } from "./plain-data.ts";
import { swatchRecords } from "./swatch-record.ts";
import type { OutputRecord, PlotSpec, SwatchRecord, TableColumnRecord } from "./records.ts";

/** How many table rows a report shows before it truncates (the note says how many there were). */
export const MAX_TABLE_ROWS = 2000;

/** One column of `showTable`: the row key, and optionally its header label, unit and decimals. */
export interface TableColumn {
  readonly key: string;
  readonly label?: string;
  readonly unit?: string;
  readonly digits?: number;
}

/** Options of `showTable`. */
export interface TableOptions {
  /** Column order and headers; plain strings are keys. Default: every key, in order of first appearance. */
  readonly columns?: ReadonlyArray<string | TableColumn>;
  /** Decimals for every numeric column that does not set its own; default: up to 6 significant digits. */
  readonly digits?: number;
  /** Units by key, e.g. { Y: "cd/m²" }, shown in the header (a column's own `unit` wins). */
  readonly units?: Readonly<Record<string, string>>;
  readonly caption?: string;
}

/** A Plotly figure as `showFigure` accepts it: a spec, optionally with the caption the plot functions attach. */
export type FigureInput = PlotSpec & { readonly caption?: string };

/** Options of `showMarkdown` and `showHtml`. */
export interface TrustOptions {
  /** Render raw HTML as HTML. Only for text your own code generated from data you trust; default false (escaped). */
  readonly trusted?: boolean;
}

/** Shows any value: tables for arrays of objects, figures for Plotly specs and spectra, text for the rest. */
export function show(value: unknown): void {
  if (typeof value === "string") return emit({ kind: "value", text: value });
  if (isPlotSpec(value)) return showFigure(value);
  if (isSpectrumLike(value)) return showSpectrum(value);
  if (isSwatchList(value)) return showSwatches(value);
  if (isRowList(value)) return showTable(value);
  emit({ kind: "value", text: inspectValue(value) });
  emitCautionsOf(value, "value");
}

/** The text form of a value as the report shows it (Node's inspect, without colours, 4 levels deep). */
export function inspectValue(value: unknown): string {
  return inspect(value, {
    depth: 4,
    colors: false,
    maxArrayLength: 200,
    maxStringLength: 20_000,
    breakLength: 100,
  });
}

/** Shows an array of objects as a table, with column order, units in the headers and number formatting. */
export function showTable(rows: readonly object[], options: TableOptions = {}): void {
  if (!Array.isArray(rows))
    throw new TypeError(`showTable: rows must be an array of objects, got ${describe(rows)}`);
  rows.forEach((row, i) => {
    if (row === null || typeof row !== "object") {
      throw new TypeError(`showTable: row ${i + 1} is ${describe(row)}, not an object`);
    }
  });
  const defaultDigits = checkDigits(options.digits, "showTable");
  const columns = tableColumns(rows as readonly Record<string, unknown>[], options);
  const shown = rows.slice(0, MAX_TABLE_ROWS) as readonly Record<string, unknown>[];
  const numeric = columns.map(
    (c) =>
      shown.some((r) => typeof r[c.key] === "number") &&
      shown.every((r) => r[c.key] === undefined || r[c.key] === null || typeof r[c.key] === "number"),
  );
  // A column of uncertainty results states its coverage factor once, in its header, not in every cell.
  const uncertain = columns.map(
    (c) =>
      shown.some((r) => isUncertainValue(r[c.key])) &&
      shown.every((r) => r[c.key] === undefined || r[c.key] === null || isUncertainValue(r[c.key])),
  );
  const formatted = shown.map((row) =>
    columns.map((c, i) =>
      uncertain[i]
        ? formatUncertain(row[c.key], false)
        : formatCell(row[c.key], checkDigits(c.digits, `showTable column "${c.key}"`) ?? defaultDigits),
    ),
  );
  const headers: TableColumnRecord[] = columns.map((c, i) => {
    const unit = c.unit ?? options.units?.[c.key];
    const given = c.label ?? c.key;
    const label = uncertain[i] && !/k\s*=\s*2/.test(given) ? `${given} (k = 2)` : given;
    return unit ? { label, unit, numeric: numeric[i]! } : { label, numeric: numeric[i]! };
  });
  emit({
    kind: "table",
    caption: options.caption,
    columns: headers,
    rows: formatted,
    totalRows: rows.length,
  });
  emitCautionsOf(rows, "table");
}

/** Shows a Plotly figure ({ data, layout?, config? }); the caption goes under it, numbered. */
export function showFigure(figure: FigureInput, caption?: string): void {
  if (!isPlotSpec(figure)) {
    throw new TypeError(
      `showFigure: expected a Plotly figure { data: [...], layout?: {...} }, got ${describe(figure)}`,
    );
  }
  const spec = toPlainData(
    { data: figure.data, layout: figure.layout ?? {}, config: figure.config ?? {} },
    "the figure",
  ) as PlotSpec;
  const text = caption ?? figure.caption;
  emit({ kind: "figure", caption: typeof text === "string" && text !== "" ? text : undefined, spec });
  emitCautionsOf(figure, "figure");
}

/**
 * Shows colour swatches: sRGB hex (drawn everywhere), optional wide-gamut CSS colour, label, gamut marks, and
 * reference/sample pairs drawn side by side with their ΔE00 (see cells/swatch-record.ts for the accepted shapes).
 */
export function showSwatches(swatches: readonly SwatchRecord[], caption?: string): void {
  if (!Array.isArray(swatches)) {
    throw new TypeError(`showSwatches: expected an array of { label, hex }, got ${describe(swatches)}`);
  }
  emit({ kind: "swatches", caption, swatches: swatchRecords(swatches) });
  emitCautionsOf(swatches, "swatches");
}

/** Shows Markdown generated by code; raw HTML in it is escaped unless `{ trusted: true }`. */
export function showMarkdown(text: string, options: TrustOptions = {}): void {
  if (typeof text !== "string") throw new TypeError(`showMarkdown: expected a string, got ${describe(text)}`);
  emit({ kind: "markdown", text, trusted: options.trusted === true });
}

/** Shows HTML generated by code: as escaped text, or rendered when marked `{ trusted: true }`. */
export function showHtml(html: string, options: TrustOptions = {}): void {
  if (typeof html !== "string") throw new TypeError(`showHtml: expected a string, got ${describe(html)}`);
  emit({ kind: "html", html, trusted: options.trusted === true });
}

/** Puts a caution in the report where it was raised and in the summary at the top (e.g. "informative only"). */
export function showCaution(text: string, title = "Caution"): void {
  if (typeof text !== "string" || text.trim() === "") {
    throw new TypeError(`showCaution: expected a non-empty string, got ${describe(text)}`);
  }
  emit({ kind: "caution", title: String(title), text });
}

/** A spectrum as a small line plot of value against wavelength. */
function showSpectrum(s: SpectrumLike): void {
  const quantity = typeof s.quantity === "string" ? s.quantity : "value";
  const unit = typeof s.unit === "string" && s.unit !== "" ? ` (${s.unit})` : "";
  const name = typeof s.name === "string" ? s.name : "spectrum";
  showFigure(
    {
      data: [{ type: "scatter", mode: "lines", x: [...s.wavelengths], y: [...s.values], name }],
      layout: {
        height: 320,
        xaxis: { title: { text: "Wavelength (nm)" } },
        yaxis: { title: { text: `${quantity}${unit}` } },
      },
    },
    `${name}: ${quantity}, ${s.wavelengths.length} samples from ${s.wavelengths[0]} to ${s.wavelengths.at(-1)} nm.`,
  );
  emitCautionsOf({ ...s, wavelengths: [], values: [] }, "figure");
}

interface SpectrumLike {
  readonly name?: unknown;
  readonly quantity?: unknown;
  readonly unit?: unknown;
  readonly wavelengths: readonly number[];
  readonly values: readonly number[];
}

function isPlotSpec(value: unknown): value is FigureInput {
  return (
    typeof value === "object" &&
    value !== null &&
    Array.isArray((value as { data?: unknown }).data) &&
    (value as { data: unknown[] }).data.every((t) => typeof t === "object" && t !== null)
  );
}

function isSpectrumLike(value: unknown): value is SpectrumLike {
  if (typeof value !== "object" || value === null) return false;
  const { wavelengths, values } = value as { wavelengths?: unknown; values?: unknown };
  return (
    Array.isArray(wavelengths) &&
    Array.isArray(values) &&
    wavelengths.length === values.length &&
    wavelengths.length > 1 &&
    wavelengths.every((w) => typeof w === "number") &&
    values.every((v) => typeof v === "number")
  );
}

function isSwatchList(value: unknown): value is SwatchRecord[] {
  return (
    Array.isArray(value) &&
    value.length > 0 &&
    value.every(
      (s) =>
        typeof s === "object" &&
        s !== null &&
        typeof (s as { hex?: unknown }).hex === "string" &&
        typeof (s as { label?: unknown }).label === "string",
    )
  );
}

function isRowList(value: unknown): value is Record<string, unknown>[] {
  return (
    Array.isArray(value) &&
    value.length > 0 &&
    value.every((r) => {
      if (typeof r !== "object" || r === null || Array.isArray(r)) return false;
      const proto = Object.getPrototypeOf(r);
      return proto === Object.prototype || proto === null;
    })
  );
}

/** The columns of a table: the requested ones (checked against the rows) or every key in order of appearance. */
function tableColumns(rows: readonly Record<string, unknown>[], options: TableOptions): TableColumn[] {
  const keys: string[] = [];
  const seen = new Set<string>();
  for (const row of rows)
    for (const key of Object.keys(row)) if (!seen.has(key)) (seen.add(key), keys.push(key));
  if (options.columns === undefined) {
    // A `caution` text is shown as a caution beside the table (once), not repeated in a column on every row.
    const cautionText = rows.every(
      (r) => r[CAUTION_KEY] === undefined || r[CAUTION_KEY] === null || typeof r[CAUTION_KEY] === "string",
    );
    return keys.filter((key) => !(key === CAUTION_KEY && cautionText)).map((key) => ({ key }));
  }
  if (!Array.isArray(options.columns)) {
    throw new TypeError(
      `showTable: columns must be an array of keys or { key, label, unit, digits }, got ${describe(options.columns)}`,
    );
  }
  return options.columns.map((c) => {
    const column = typeof c === "string" ? { key: c } : c;
    if (typeof column !== "object" || column === null || typeof column.key !== "string") {
      throw new TypeError(
        `showTable: a column must be a key or { key, label, unit, digits }, got ${describe(c)}`,
      );
    }
    if (rows.length > 0 && !seen.has(column.key)) {
      throw new RangeError(
        `showTable: column "${column.key}" is in none of the rows (their keys: ${keys.join(", ") || "none"})`,
      );
    }
    return column;
  });
}

function formatCell(value: unknown, digits: number | undefined): string {
  if (value === undefined || value === null) return "";
  if (typeof value === "number") return formatNumber(value, digits);
  if (typeof value === "string") return value;
  if (typeof value === "boolean" || typeof value === "bigint") return String(value);
  if (value instanceof Date) return value.toISOString();
  if (isUncertainValue(value)) return formatUncertain(value, true);
  return inspect(value, { depth: 1, colors: false, breakLength: Infinity, maxArrayLength: 12 });
}

/** An uncertainty result's output: "value ± U", U to two significant digits (JCGM 100 §7.2.6), then "(k = 2)" when asked. */
function formatUncertain(value: unknown, withCoverage: boolean): string {
  if (!isUncertainValue(value)) return "";
  const [v, U] = roundedPair(value.estimate, value.expandedUncertainty);
  return withCoverage ? `${v} ± ${U} (k = 2)` : `${v} ± ${U}`;
}

function isUncertainValue(value: unknown): value is { estimate: number; expandedUncertainty: number } {
  if (typeof value !== "object" || value === null) return false;
  const v = value as { estimate?: unknown; expandedUncertainty?: unknown };
  return (
    typeof v.estimate === "number" &&
    Number.isFinite(v.estimate) &&
    typeof v.expandedUncertainty === "number" &&
    Number.isFinite(v.expandedUncertainty)
  );
}
