/**
 * Exponential back-off with jitter for retries that are not the input's fault:
 * delay = base · 2^(attempt−1), capped at `capMs`, then scaled by a factor in [0.75, 1.25)
 * so workers that failed together do not retry together.
 */
export function backoffMs(attempt: number, baseMs: number, capMs = 5 * 60_000, random: () => number = Math.random): number {
  const exp = baseMs * 2 ** Math.max(0, attempt - 1);
  return Math.round(Math.min(exp, capMs) * (0.75 + 0.5 * random()));
}
