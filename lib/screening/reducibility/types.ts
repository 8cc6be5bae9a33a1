/**
 * Options of the reducibility stage, including the injectable symbolic hook: the engine stays
 * pure (no worker threads here); the CLI and jobs pass an implementation that runs algebrite in
 * a worker with a timeout (lib/symbolic-worker.ts).
 */

/**
 * A symbolic job. `expression` is always printed by the engine from a validated tree (numbers as
 * exact rationals), never user text. The hook returns the result text, or null (timeout, error,
 * no answer).
 *
 * - simplify: simplify the expression (for display only).
 * - solve: roots of the expression's numerator in `unknown` (closed form of a constraint).
 */
export type SymbolicTask =
  | { kind: "simplify"; expression: string; timeoutMs: number }
  | { kind: "solve"; expression: string; unknown: string; timeoutMs: number };

export type SymbolicHook = (task: SymbolicTask) => Promise<string | null>;

export interface ReducibilityOptions {
  /** Seed of the sample points (default 1). */
  seed?: number;
  /** Symbolic simplification and closed forms, time-limited; omitted → none. */
  symbolic?: SymbolicHook;
  /** Time limit passed with each symbolic task (default SYMBOLIC_TIMEOUT_MS). */
  symbolicTimeoutMs?: number;
}
