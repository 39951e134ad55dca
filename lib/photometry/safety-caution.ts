/**
 * The caution a result carries when it could feed a safety decision (eye protection, signal lights, optical
 * radiation hazards). A result object that carries it in a `caution` field has it shown beside the value in the
 * report, automatically (cells/cautions.ts); the Methods section stays a factual record of what was computed.
 */

/** Shown beside any result that could be used for a safety decision. */
export const SAFETY_DECISION_CAUTION =
  "Informative only: for eye protection, signal lights or other safety decisions, this computation does not decide; the applicable standard, local codes and testing by an accredited laboratory do.";
