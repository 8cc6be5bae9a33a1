/** Queue and worker settings, read from the environment once per call (tests change them). */

function intFromEnv(name: string, fallback: number, min = 1): number {
  const raw = process.env[name];
  if (!raw) return fallback;
  const n = Number(raw);
  return Number.isFinite(n) && n >= min ? Math.floor(n) : fallback;
}

export interface QueueSettings {
  /** Hard wall-clock limit of one run in its thread (SCREEN_TIME_LIMIT_MS). */
  timeLimitMs: number;
  /** Old-generation heap limit of an engine thread (SCREEN_MEMORY_MB). */
  memoryMb: number;
  /** Engine threads per worker process (WORKER_THREADS). */
  threads: number;
  /** How long a claim holds without renewal (SCREEN_LEASE_MS); a dead worker's runs return after it. */
  leaseMs: number;
  /** First retry delay after a failure that is not the input's fault (SCREEN_RETRY_BASE_MS); doubles each attempt. */
  retryBaseMs: number;
  /** Idle poll interval of the worker loop (SCREEN_POLL_MS). */
  pollMs: number;
}

export function queueSettings(): QueueSettings {
  return {
    timeLimitMs: intFromEnv("SCREEN_TIME_LIMIT_MS", 60_000),
    memoryMb: intFromEnv("SCREEN_MEMORY_MB", 512, 32),
    threads: intFromEnv("WORKER_THREADS", 1),
    leaseMs: intFromEnv("SCREEN_LEASE_MS", 30_000, 200),
    retryBaseMs: intFromEnv("SCREEN_RETRY_BASE_MS", 2_000, 0),
    pollMs: intFromEnv("SCREEN_POLL_MS", 500, 20),
  };
}

/** Test-only switches are honoured only under vitest (NODE_ENV=test) or the e2e harness (E2E=1). */
export function testHooksEnabled(): boolean {
  return process.env.NODE_ENV === "test" || process.env.E2E === "1";
}
