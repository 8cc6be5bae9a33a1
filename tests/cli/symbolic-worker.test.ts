/**
 * The worker-thread symbolic hook (lib/symbolic-worker.ts): answers, timeouts, recovery.
 */
import { describe, it, expect } from "vitest";
import { createSymbolicWorker } from "../../lib/symbolic-worker";

describe("symbolic worker", () => {
  it("simplifies and solves with algebrite (d/dt e^{t/5} / e^{t/5} = 1/5; roots of 4k0² - 4b0)", async () => {
    // Source: elementary calculus and algebra (from memory); algebrite 1.4 output format.
    const w = createSymbolicWorker();
    try {
      expect(await w.hook({ kind: "simplify", expression: "d(exp(t / 5),t) / exp(t / 5) - 1 / 5", timeoutMs: 20_000 })).toBe("0");
      expect(await w.hook({ kind: "solve", expression: "4 * k0^2 - 4 * b0", unknown: "b0", timeoutMs: 20_000 })).toBe("k0^2");
      expect(await w.hook({ kind: "solve", expression: "x^2 - 2", unknown: "x", timeoutMs: 20_000 })).toBe("[-2^(1/2),2^(1/2)]");
    } finally {
      await w.close();
    }
  });

  it("a job that hangs is cut off at its timeout, and the next job still runs (ENGINE-NOTES §2 hangs)", async () => {
    const w = createSymbolicWorker();
    try {
      const start = Date.now();
      // expand((a+b+c+d+e1+f)^40) ran for > 60 s in ENGINE-NOTES §2.
      expect(await w.hook({ kind: "simplify", expression: "expand((a + b + c + d + e1 + f)^40)", timeoutMs: 500 })).toBeNull();
      expect(Date.now() - start).toBeLessThan(10_000);
      expect(await w.hook({ kind: "simplify", expression: "1 / 2 + 1 / 3", timeoutMs: 20_000 })).toBe("5/6");
    } finally {
      await w.close();
    }
  });

  it("refuses text outside the engine printer's alphabet and starts each job from a clean state", async () => {
    const w = createSymbolicWorker();
    try {
      expect(await w.hook({ kind: "simplify", expression: "k=2; exp(k*t)", timeoutMs: 20_000 })).toBeNull();
      // No assignment can leak between jobs: 'k' stays a symbol.
      expect(await w.hook({ kind: "simplify", expression: "k * 1", timeoutMs: 20_000 })).toBe("k");
      expect(await w.hook({ kind: "solve", expression: "x - 1", unknown: "x; y", timeoutMs: 20_000 })).toBeNull();
    } finally {
      await w.close();
    }
  });
});
