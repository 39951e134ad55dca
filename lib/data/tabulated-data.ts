/** A published table on a regular wavelength grid: named columns of values from `start` to `end` nm every `step` nm. */
export interface TabulatedData {
  readonly start: number;
  readonly step: number;
  readonly end: number;
  readonly columns: Readonly<Record<string, readonly number[]>>;
}
