/** "value ± U (k = 2)": a result with its expanded uncertainty, rounded as JCGM 100 §7.2.6 advises. */
import { checkFields } from "../arguments/check-fields.ts";
import { checkString } from "../arguments/check-text.ts";
import { roundedPair } from "./rounded-pair.ts";

/**
 * A value with its expanded uncertainty as text, "0.6421 ± 0.0084 (k = 2)": U to two significant digits and the value to the same decimal place.
 *
 * @param output An output of an uncertainty result ({ estimate, expandedUncertainty }).
 * @param unit A unit written after both numbers; default none.
 * @returns The text, with a true minus sign.
 * @source JCGM 100:2008 §7.2.2, §7.2.6 (two significant digits at most for an uncertainty).
 * @example uncertaintyText({ estimate: 0.64213, expandedUncertainty: 0.00838 })
 */
export function uncertaintyText(
  output: { readonly estimate: number; readonly expandedUncertainty: number },
  unit?: string,
): string {
  checkFields("uncertaintyText", "output", output, {
    what: "an output { estimate, expandedUncertainty } of an uncertainty result",
    keys: ["estimate", "expandedUncertainty"],
  });
  checkString("uncertaintyText", "unit", unit, { optional: true });
  const [v, u] = roundedPair(output.estimate, output.expandedUncertainty);
  const suffix = unit ? ` ${unit}` : "";
  return `${v.replace(/^-/, "−")}${suffix} ± ${u}${suffix} (k = 2)`;
}
