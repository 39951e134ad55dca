/**
 * CAM16-UCS (Li et al., Color Res. Appl. 42:703–718, 2017, Part 3): J′ = 1.7J/(1 + 0.007J), M′ = ln(1 + 0.0228M)/0.0228,
 * a′ = M′·cos h, b′ = M′·sin h, and the colour difference ΔE′ = √(ΔJ′² + Δa′² + Δb′²).
 */
import { checkFields } from "../arguments/check-fields.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkWith } from "../arguments/check-with.ts";
import { noteMethod } from "../methods/method-log.ts";
import { UCS_FIELDS } from "./check-values.ts";
import type { ColourAppearance } from "./cam16.ts";

/** CAM16-UCS coordinates J′, a′, b′. */
export interface Cam16Ucs {
  readonly J: number;
  readonly a: number;
  readonly b: number;
}

const C1 = 0.007;
const C2 = 0.0228;
const STATEMENT =
  "Colour differences ΔE′ were computed in CAM16-UCS (Li et al. 2017: J′ = 1.7J/(1 + 0.007J), M′ = ln(1 + 0.0228M)/0.0228, KL = 1).";

/**
 * CAM16-UCS coordinates of appearance correlates: J′ = 1.7J ÷ (1 + 0.007J), M′ = ln(1 + 0.0228M) ÷ 0.0228, a′ = M′·cos h, b′ = M′·sin h.
 *
 * @param appearance Appearance correlates with J, M and h (from `colourAppearance`).
 * @returns { J, a, b } (J′, a′, b′).
 * @source Li et al., Color Res. Appl. 42:703–718 (2017), eq. of CAM16-UCS (c1 = 0.007, c2 = 0.0228).
 * @example cam16Ucs({ J: 50, M: 22, h: 120 })
 */
export function cam16Ucs(appearance: Pick<ColourAppearance, "J" | "M" | "h">): Cam16Ucs {
  checkWith(
    "cam16Ucs",
    "appearance",
    appearance,
    "appearance correlates { J, M, h } (from colourAppearance)",
    (v) => typeof v === "object" && v !== null && !Array.isArray(v),
  );
  checkNumber("cam16Ucs", "appearance.J", appearance.J, { min: 0 });
  checkNumber("cam16Ucs", "appearance.M", appearance.M, { min: 0 });
  checkNumber("cam16Ucs", "appearance.h", appearance.h, { unit: "degrees" });
  const J = (1.7 * appearance.J) / (1 + C1 * appearance.J);
  const M = Math.log(1 + C2 * appearance.M) / C2;
  const hr = (appearance.h * Math.PI) / 180;
  return { J, a: M * Math.cos(hr), b: M * Math.sin(hr) };
}

/**
 * The CAM16-UCS colour difference ΔE′ = √(ΔJ′² + Δa′² + Δb′²) of two colours.
 *
 * @param reference The reference, CAM16-UCS { J, a, b } (from `cam16Ucs`).
 * @param sample The sample, CAM16-UCS { J, a, b }.
 * @returns ΔE′ (CAM16-UCS units).
 * @source Li et al., Color Res. Appl. 42:703–718 (2017), CAM16-UCS colour difference (KL = 1).
 * @example deltaECam16Ucs({ J: 60, a: 10, b: 5 }, { J: 61, a: 9, b: 6 })
 */
export function deltaECam16Ucs(reference: Cam16Ucs, sample: Cam16Ucs): number {
  checkFields("deltaECam16Ucs", "reference", reference, UCS_FIELDS);
  checkFields("deltaECam16Ucs", "sample", sample, UCS_FIELDS);
  noteMethod("colour difference", STATEMENT);
  return Math.hypot(reference.J - sample.J, reference.a - sample.a, reference.b - sample.b);
}
