/** The error every jet operation throws where a jet cannot be formed at the sample point. */

export type JetFailure =
  | "zero-divisor" // division by a jet whose leading coefficient is zero
  | "log-domain" // log of a leading coefficient ≤ 0
  | "sqrt-domain" // sqrt of a negative leading coefficient, or of 0 above order 0
  | "pow-domain" // non-integer power of a leading coefficient ≤ 0 (above order 0)
  | "abs-at-zero" // |u| with u(t_s) = 0 above order 0 (not differentiable there)
  | "non-finite"; // a coefficient came out NaN or infinite

/** Thrown when a jet cannot be formed at this point; callers redraw the sample point. */
export class JetEvaluationError extends Error {
  readonly failure: JetFailure;
  constructor(failure: JetFailure, message: string) {
    super(message);
    this.name = "JetEvaluationError";
    this.failure = failure;
  }
}
