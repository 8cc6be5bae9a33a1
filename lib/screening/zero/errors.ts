/** Raised by a term source when a precondition fails at the sample point (e.g. a h = 0, nls.md §0). */
export class SingularPointError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "SingularPointError";
  }
}
