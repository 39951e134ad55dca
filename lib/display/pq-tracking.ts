/** PQ tracking: measured luminance of PQ-coded levels against the SMPTE ST 2084 target, with a tolerance. */
import { checkList } from "../arguments/check-list.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkWith } from "../arguments/check-with.ts";
import { noteMethod } from "../methods/method-log.ts";
import { pqDecode } from "../rgb/transfer-functions.ts";
import { codeValueRange, codeValueSignal, type CodeValueFormat } from "../video/code-values.ts";

/** One PQ level: its code value and the luminance measured (cd/m²). */
export interface PqReading {
  readonly code: number;
  readonly luminance: number;
}

/** Options of `pqTracking`. */
export interface PqTrackingOptions {
  /** The code-value format of the levels, e.g. { bits: 10, range: "narrow" } (required). */
  format: CodeValueFormat;
  /** The allowed relative error |L − Lt| ÷ Lt, a fraction (e.g. 0.05; required). */
  tolerance: number;
  /** An absolute allowance in cd/m² for dark levels, where a relative limit is too tight; default 0. */
  absoluteTolerance?: number;
  /** The display's peak luminance in cd/m²: targets above it are taken as the peak (clipping); default none (10 000). */
  peakLuminance?: number;
}

/** One level compared with its target. */
export interface PqLevel {
  readonly code: number;
  readonly signal: number;
  readonly target: number;
  readonly measured: number;
  /** (measured − target) ÷ target, a fraction (0 when the target is 0). */
  readonly relative: number;
  readonly withinTolerance: boolean;
}

/** The tracking of all levels. */
export interface PqTracking {
  readonly levels: readonly PqLevel[];
  readonly tolerance: number;
  readonly absoluteTolerance: number;
  readonly peakLuminance: number;
  readonly allWithinTolerance: boolean;
  /** The largest relative error by size, with its sign, and its code value. */
  readonly worstRelative: number;
  readonly worstCode: number;
}

const isPqReading = (v: unknown) =>
  typeof v === "object" &&
  v !== null &&
  Number.isInteger((v as PqReading).code) &&
  Number.isFinite((v as PqReading).luminance) &&
  (v as PqReading).luminance >= 0;

/**
 * PQ tracking: per code value the PQ target luminance (SMPTE ST 2084 EOTF of the code's signal, clipped at the peak), the measured luminance, the relative error and whether it is within the tolerance.
 *
 * A level passes when |L − Lt| ≤ max(tolerance·Lt, absoluteTolerance).
 *
 * @param readings The levels [{ code, luminance in cd/m² }].
 * @param options Format, tolerance and optional absolute tolerance and peak (see `PqTrackingOptions`).
 * @returns A `PqTracking`: the levels, whether all pass, and the worst level.
 * @source SMPTE ST 2084:2014 eq. 5.1; ITU-R BT.2100-2 Tables 4 and 9; the tolerance is the caller's QA limit.
 * @example pqTracking([{ code: 64, luminance: 0.004 }, { code: 520, luminance: 101 }, { code: 668, luminance: 396 }], { format: { bits: 10, range: "narrow" }, tolerance: 0.05, absoluteTolerance: 0.01 })
 */
export function pqTracking(readings: readonly PqReading[], options: PqTrackingOptions): PqTracking {
  const fn = "pqTracking";
  checkList(fn, "readings", readings, "PQ levels { code, luminance ≥ 0 in cd/m² }", isPqReading, {
    minLength: 1,
  });
  checkWith(
    fn,
    "options",
    options,
    "options { format, tolerance, absoluteTolerance?, peakLuminance? }",
    (o) => typeof o === "object" && o !== null && !Array.isArray(o),
  );
  checkOptions(fn, "options", options, ["format", "tolerance", "absoluteTolerance", "peakLuminance"]);
  codeValueRange(options.format);
  checkNumber(fn, "options.tolerance", options.tolerance, { unit: "fraction" });
  checkNumber(fn, "options.absoluteTolerance", options.absoluteTolerance, {
    unit: "cd/m²",
    min: 0,
    optional: true,
  });
  checkNumber(fn, "options.peakLuminance", options.peakLuminance, {
    unit: "cd/m²",
    above: 0,
    optional: true,
  });
  const peak = options.peakLuminance ?? 10000;
  const abs = options.absoluteTolerance ?? 0;
  noteMethod(
    "other",
    `PQ tracking was assessed by comparing each level's luminance with the SMPTE ST 2084 EOTF of its ${options.format.bits}-bit ${options.format.range}-range code value${options.peakLuminance ? `, clipped at the display peak of ${peak} cd/m²` : ""}.`,
  );
  const levels = readings.map((r) => {
    const signal = Math.min(Math.max(codeValueSignal(r.code, options.format), 0), 1);
    const target = Math.min(pqDecode(signal), peak);
    const d = r.luminance - target;
    return {
      code: r.code,
      signal,
      target,
      measured: r.luminance,
      relative: target > 0 ? d / target : 0,
      withinTolerance: Math.abs(d) <= Math.max(options.tolerance * target, abs),
    };
  });
  const worst = levels.reduce((w, l) => (Math.abs(l.relative) > Math.abs(w.relative) ? l : w), levels[0]!);
  return {
    levels,
    tolerance: options.tolerance,
    absoluteTolerance: abs,
    peakLuminance: peak,
    allWithinTolerance: levels.every((l) => l.withinTolerance),
    worstRelative: worst.relative,
    worstCode: worst.code,
  };
}
