/** The result of an uncertainty propagation: plain data, shown as "value ± U (k = 2)" in reports. */

/** One output quantity's uncertainty. */
export interface OutputUncertainty {
  /** The estimate y (Monte Carlo: the average of the model values, JCGM 101 §7.6). */
  readonly estimate: number;
  /** The standard uncertainty u(y). */
  readonly standardUncertainty: number;
  /** The expanded uncertainty U = k·u(y) with k = 2, as reports print it. */
  readonly expandedUncertainty: number;
  /** The coverage factor of `expandedUncertainty`: 2. */
  readonly coverageFactor: 2;
  /** The coverage interval for `probability`. */
  readonly interval: {
    readonly low: number;
    readonly high: number;
    readonly probability: number;
    readonly kind: "symmetric" | "shortest" | "normal";
  };
}

/** Agreement of the law of propagation with Monte Carlo for one output (JCGM 101:2008 §8). */
export interface AgreementCheck {
  readonly agrees: boolean;
  /** The numerical tolerance δ (§7.9.2). */
  readonly tolerance: number;
  /** |y − U_p − y_low| and |y + U_p − y_high| (§8.2). */
  readonly lowDifference: number;
  readonly highDifference: number;
  /** Twice the Monte Carlo standard error of the low and high interval ends, allowed beyond δ. */
  readonly monteCarloAllowance: readonly [number, number];
}

export interface UncertaintyResult {
  readonly kind: "uncertainty result";
  readonly method: "monte carlo" | "first order";
  readonly outputs: Readonly<Record<string, OutputUncertainty>>;
  /** Correlation coefficients between outputs, both ways: correlations.x.y. */
  readonly correlations: Readonly<Record<string, Readonly<Record<string, number>>>>;
  /** Monte Carlo only: trials done and the seed. */
  readonly trials?: number;
  readonly seed?: number;
  readonly adaptive?: boolean;
  /** Monte Carlo only: the first-order result and its agreement with Monte Carlo, output by output. */
  readonly firstOrder?: UncertaintyResult;
  readonly agreement?: Readonly<Record<string, AgreementCheck>>;
  /** Set when the two methods disagree beyond the tolerance, or when the adaptive procedure did not settle. */
  readonly warning?: string;
}
