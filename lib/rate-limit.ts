/**
 * A fixed-window counter per key, in process memory: enough for one app process. Behind several
 * processes, put the limit in the proxy in front (documented in the README).
 */
const windows = new Map<string, { start: number; count: number }>();

export function allow(key: string, limit: number, windowMs: number, now = Date.now()): boolean {
  const w = windows.get(key);
  if (!w || now - w.start >= windowMs) {
    windows.set(key, { start: now, count: 1 });
    if (windows.size > 10_000) prune(now, windowMs);
    return true;
  }
  w.count += 1;
  return w.count <= limit;
}

/** How many hits `key` has in its current window, without adding one. */
export function peek(key: string, windowMs: number, now = Date.now()): number {
  const w = windows.get(key);
  return !w || now - w.start >= windowMs ? 0 : w.count;
}

function prune(now: number, windowMs: number) {
  for (const [k, w] of windows) if (now - w.start >= windowMs) windows.delete(k);
}

export function clientKey(headers: Headers): string {
  return headers.get("x-forwarded-for")?.split(",")[0].trim() || headers.get("x-real-ip") || "local";
}
