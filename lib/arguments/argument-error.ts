/**
 * The error a public library function throws for a wrong argument: it names the function and the argument, says what
 * was expected (with its unit) and what came, and where the caller probably meant another function, names that one.
 */
export class ArgumentError extends Error {
  override readonly name = "ArgumentError";
  /** The public function that refused the argument, e.g. "opticalDensity". */
  readonly functionName: string;
  /** The argument (or option) refused, e.g. "transmittance" or "options.interval". */
  readonly argument: string;
  /** What was expected, e.g. "a number (a fraction from 0 to 1)". */
  readonly expected: string;
  /** What came, described by its kind, e.g. "a spectrum (\"filter\", transmittance, 380–780 nm)". */
  readonly received: string;

  constructor(functionName: string, argument: string, expected: string, received: string, hint?: string) {
    const advice = hint ? ` ${hint.charAt(0).toUpperCase()}${hint.slice(1)}.` : "";
    super(`${functionName}: ${argument} should be ${expected}, but got ${received}.${advice}`);
    this.functionName = functionName;
    this.argument = argument;
    this.expected = expected;
    this.received = received;
  }
}

/**
 * True for an ArgumentError, also across copies of the library loaded twice (the name is the marker).
 *
 * @param error Anything caught.
 * @returns true when it is an ArgumentError.
 * @source none: a tristim helper.
 * @example isArgumentError(new ArgumentError("deltaE2000", "first", "a CIELAB colour", "undefined"))
 */
export function isArgumentError(error: unknown): error is ArgumentError {
  return error instanceof ArgumentError || (error instanceof Error && error.name === "ArgumentError");
}
