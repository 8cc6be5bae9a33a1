/** What running one variant in an engine thread can come to (the runner's answer to the loop). */
export type RunOutcome =
  | { kind: "done"; reportJson: string; engine: string; stage?: string }
  /** The stored variant is not something the engine can screen: never retried. */
  | { kind: "input-error"; message: string; stage?: string }
  /** The engine threw: deterministic for the same input, so not retried. */
  | { kind: "engine-error"; message: string; stage?: string }
  | { kind: "timed-out"; limitMs: number; stage?: string }
  | { kind: "out-of-memory"; limitMb: number; stage?: string }
  /** We stopped it because the owner cancelled. */
  | { kind: "cancelled"; stage?: string }
  /** The thread died or could not start, or the database failed: not the input's fault, retried with back-off. */
  | { kind: "crash"; message: string; stage?: string };
