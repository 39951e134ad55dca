/** Internal: the law of propagation of uncertainty on a prepared model (JCGM 100:2008 §5.1.2, §5.2.2). */
import type { PreparedModel } from "./model-evaluation.ts";
import type { OutputUncertainty, UncertaintyResult } from "./uncertainty-result.ts";
import { inverseNormal } from "./normal-quantile.ts";

/** Internal: the first-order result of a prepared model. */
export function firstOrderOf(prepared: PreparedModel, coverage: number): UncertaintyResult {
  const { dims, names } = prepared;
  const m = names.length;
  const theta = new Float64Array(dims);
  const y0 = new Float64Array(m);
  prepared.evaluate(theta, y0);
  // Sensitivities c[j][o] = ∂y_o/∂θ_j by central differences, step 10⁻³ of the parameter's standard uncertainty.
  const c: Float64Array[] = [];
  const std = new Float64Array(dims);
  const plus = new Float64Array(m),
    minus = new Float64Array(m);
  for (let k = 0, j = 0; k < prepared.inputs.length; k++) {
    const input = prepared.inputs[k]!;
    for (let d = 0; d < input.dims; d++, j++) {
      const s = input.std[d]!;
      std[j] = s;
      const row = new Float64Array(m);
      if (s > 0) {
        const h = 1e-3 * s;
        theta[j] = h;
        prepared.evaluate(theta, plus);
        theta[j] = -h;
        prepared.evaluate(theta, minus);
        theta[j] = 0;
        for (let o = 0; o < m; o++) row[o] = (plus[o]! - minus[o]!) / (2 * h);
      }
      c.push(row);
    }
  }
  // Covariance of the outputs: Σ c_j V_jk c_k, V diagonal except within exponentially correlated blocks.
  const cov = Array.from({ length: m }, () => new Float64Array(m));
  for (let j = 0; j < dims; j++)
    for (let a = 0; a < m; a++)
      for (let b = 0; b < m; b++) cov[a]![b]! += c[j]![a]! * c[j]![b]! * std[j]! * std[j]!;
  for (let k = 0; k < prepared.inputs.length; k++) {
    const block = prepared.inputs[k]!.correlated;
    if (!block) continue;
    const base = prepared.offsets[k]! + block.start;
    const wl = block.wavelengths;
    for (let i = 0; i < wl.length; i++)
      for (let l = 0; l < wl.length; l++) {
        if (i === l) continue;
        const r = Math.exp(-Math.abs(wl[i]! - wl[l]!) / block.length);
        const v = r * std[base + i]! * std[base + l]!;
        for (let a = 0; a < m; a++)
          for (let b = 0; b < m; b++) cov[a]![b]! += c[base + i]![a]! * c[base + l]![b]! * v;
      }
  }
  const k = inverseNormal((1 + coverage) / 2);
  const outputs: Record<string, OutputUncertainty> = {};
  const correlations: Record<string, Record<string, number>> = {};
  names.forEach((name, a) => {
    const u = Math.sqrt(cov[a]![a]!);
    outputs[name] = {
      estimate: y0[a]!,
      standardUncertainty: u,
      expandedUncertainty: 2 * u,
      coverageFactor: 2,
      interval: { low: y0[a]! - k * u, high: y0[a]! + k * u, probability: coverage, kind: "normal" },
    };
    correlations[name] = {};
    names.forEach((other, b) => {
      if (a === b) return;
      const d = Math.sqrt(cov[a]![a]! * cov[b]![b]!);
      correlations[name]![other] = d > 0 ? cov[a]![b]! / d : 0;
    });
  });
  return { kind: "uncertainty result", method: "first order", outputs, correlations };
}
