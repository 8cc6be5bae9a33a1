/**
 * The displayed residual (never used for the verdict) and the text handed to the symbolic hook.
 */
import { describe, it, expect } from "vitest";
import { create, all } from "mathjs";
import { DoubleField, evalNumber, exprToString } from "../../../lib/screening/expr";
import { INVARIANTS, algebriteText, invariantExpr, invariantJet, runReducibility } from "../../../lib/screening/reducibility";
import type { SymbolicTask } from "../../../lib/screening/reducibility";
import { buildVariant, parse } from "./build-variant";

const math = create(all);

describe("residual as an expression tree", () => {
  for (const [cls, c, window] of [
    ["nls", { a: "1 + 0.3*sin(t)", h: "2/(1+t^2)", b: "0.1", k: "0.05", c: "0.2" }, [0, 2]],
    ["kdv", { p: "t", q: "t^2", r: "0.3*cos(t)", s: "0.1", m: "1/(1+t)" }, [0.5, 2]],
    ["mkdv", { p: "6*exp(t)", q: "1 + t", r: "0.2", s: "0.1*t" }, [0, 2]],
  ] as const) {
    it(`${cls}: the tree (symbolic d/dt) evaluates to the jet invariant`, () => {
      // Source: explicit forms nls.md §3, kdv.md §2, mkdv.md §2; the jet value is checked against mathjs in invariants.test.ts.
      const v = buildVariant(cls, c, [window[0], window[1]]);
      const tree = invariantExpr(cls, v.coefficients);
      for (const t of [0.6, 1.3]) {
        const jet = invariantJet(INVARIANTS[cls], v.coefficients, t, {}, 1, DoubleField)[0];
        expect(evalNumber(tree, { t })).toBeCloseTo(jet, 10);
      }
    });
  }

  it("hands algebrite exact rationals and no sech (ENGINE-NOTES §2 parse traps)", () => {
    const text = algebriteText(parse("1e-3*sech(2.5*t) + 0.25"));
    expect(text).not.toMatch(/e-|sech|\d\.\d/);
    // Same value as the original (mathjs as the reference evaluator).
    expect(math.evaluate(text, { t: 0.7 })).toBeCloseTo(1e-3 / Math.cosh(1.75) + 0.25, 14);
  });
});

describe("display in the report", () => {
  it("without a hook: the unsimplified tree in LaTeX", async () => {
    const r = await runReducibility(buildVariant("nls", { a: "1/2", k: "0.1", h: "1" }, [0, 1]));
    expect(r.evidence.display.source).toBe("expression-tree");
    expect(r.evidence.display.simplified).toBe(false);
    expect(r.evidence.display.latex.length).toBeGreaterThan(0);
  });

  it("with a hook: its answer is parsed back and shown; the verdict does not depend on it", async () => {
    const tasks: SymbolicTask[] = [];
    // A hook that answers with the known simplified residual of nls.md §11 (c1): R = 1/25.
    const hook = async (task: SymbolicTask): Promise<string | null> => {
      tasks.push(task);
      return task.kind === "simplify" ? "1/25" : null;
    };
    const r = await runReducibility(buildVariant("nls", { a: "1/2", k: "0.1", h: "1" }, [0, 1]), { symbolic: hook });
    expect(tasks[0].kind).toBe("simplify");
    expect(tasks[0].expression).toBe(exprToString(parse(tasks[0].expression))); // engine-printed, re-parseable
    expect(r.evidence.display).toEqual({ latex: "\\frac{1}{25}", simplified: true, source: "symbolic-hook" });
    expect(r.verdict).toBe("not-reducible");
  });

  it("a hook that times out (null) or throws falls back to the tree", async () => {
    const v = buildVariant("nls", { a: "1/2", h: "1" }, [0, 1]);
    const silent = await runReducibility(v, { symbolic: async () => null });
    expect(silent.evidence.display.source).toBe("expression-tree");
    const broken = await runReducibility(v, { symbolic: async () => { throw new Error("worker died"); } });
    expect(broken.evidence.display.source).toBe("expression-tree");
    expect(broken.verdict).toBe("reducible");
  });
});
