/** ΔE ITP of ITU-R BT.2124-0 (01/2019): a colour difference for HDR and wide-gamut signals, from PQ ICtCp. */
import { checkFields } from "../arguments/check-fields.ts";
import { noteMethod } from "../methods/method-log.ts";
import { ICTCP_FIELDS } from "./check-values.ts";
import type { Ictcp } from "./ictcp.ts";

const STATEMENT =
  "Colour differences ΔE ITP were computed per ITU-R BT.2124-0 (720·√(ΔI² + ΔT² + ΔP²), T = Ct/2, P = Cp, from PQ ICtCp of absolute display light).";

/**
 * ΔE ITP: 720·√(ΔI² + ΔT² + ΔP²) with T = 0.5·Ct and P = Cp; 1 is about one just-noticeable difference.
 *
 * Both colours must be PQ ICtCp of absolute light (`ictcpFromXYZ`, or `ictcpFromLinearRgb` with transfer "PQ").
 *
 * @param reference The reference colour, PQ ICtCp { I, Ct, Cp }.
 * @param sample The sample colour, PQ ICtCp { I, Ct, Cp }.
 * @returns ΔE ITP (dimensionless).
 * @source ITU-R BT.2124-0 (01/2019) eq. 1.
 * @example deltaEItp(ictcpFromXYZ({ X: 95, Y: 100, Z: 109 }), ictcpFromXYZ({ X: 96, Y: 100, Z: 107 }))
 */
export function deltaEItp(reference: Ictcp, sample: Ictcp): number {
  checkFields("deltaEItp", "reference", reference, ICTCP_FIELDS);
  checkFields("deltaEItp", "sample", sample, ICTCP_FIELDS);
  noteMethod("colour difference", STATEMENT);
  const dI = reference.I - sample.I,
    dT = 0.5 * (reference.Ct - sample.Ct),
    dP = reference.Cp - sample.Cp;
  return 720 * Math.sqrt(dI * dI + dT * dT + dP * dP);
}
