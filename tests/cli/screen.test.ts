/**
 * The command-line screen: `tsx scripts/screen.ts <file.yaml>... [--json]`, its JSON shape,
 * table output and exit status (0: every file parsed; 2: any file had errors).
 */
import { describe, it, expect } from "vitest";
import { execFile } from "node:child_process";
import { fileURLToPath } from "node:url";

const ROOT = fileURLToPath(new URL("../../", import.meta.url));

function screen(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile(process.execPath, ["--import", "tsx", "scripts/screen.ts", ...args], { cwd: ROOT, timeout: 120_000, maxBuffer: 64 << 20 }, (err, stdout, stderr) => {
      const code = err && typeof err.code === "number" ? err.code : err ? 1 : 0;
      resolve({ code, stdout, stderr });
    });
  });
}

interface Output {
  engine: string;
  families: {
    id: string;
    class: string | null;
    errors: { file?: string; path: string; line?: number; column?: number; message: string; document?: number }[];
    variants: {
      parameters: Record<string, number>;
      reducibility: { verdict: string; constraints: { parameter: string; value: number }[]; evidence: Record<string, unknown> };
      painleve: { verdict: string };
    }[];
  }[];
  errors: { file?: string; line?: number; message: string }[];
}

describe("npm run screen", () => {
  it("--json: one object with the stable field names; classic verdicts; exit 0", async () => {
    // Verdicts: nls.md §10 (expulsive trap with e^{λt} interaction passes), §11 (c1) fails, kdv.md §2 cylindrical passes.
    const r = await screen(["tests/fixtures/screen/classic.yaml", "--json", "--no-symbolic"]);
    expect(r.code, r.stderr).toBe(0);
    const out = JSON.parse(r.stdout) as Output;
    expect(out.engine).toMatch(/^\d+\.\d+\.\d+/);
    expect(out.families.map((f) => [f.id, f.class])).toEqual([
      ["trap-and-ramp", "nls"],
      ["damped-constant", "nls"],
      ["ring-wave", "kdv"],
    ]);
    const verdicts = out.families.map((f) => f.variants.map((v) => [v.reducibility.verdict, v.painleve.verdict]));
    expect(verdicts).toEqual([
      [["reducible", "passes"], ["reducible", "passes"]],
      [["not-reducible", "fails"]],
      [["reducible", "passes"]],
    ]);
    expect(out.families[0].variants[1].parameters).toEqual({ lam: 1 });
    const ev = out.families[0].variants[0].reducibility.evidence;
    for (const key of ["formula", "engine", "windows", "precision", "singularities", "display"]) expect(ev).toHaveProperty(key);
  });

  it("free parameter: the constraint b0 = λ²/2 in the JSON (nls.md §10, a = 1/2, h = e^{0.6t})", async () => {
    const r = await screen(["tests/fixtures/screen/free-parameter.yaml", "--json", "--no-symbolic", "--no-painleve"]);
    expect(r.code, r.stderr).toBe(0);
    const out = JSON.parse(r.stdout) as Output;
    const red = out.families[0].variants[0].reducibility;
    expect(red.verdict).toBe("reducible");
    expect(red.constraints.map((c) => [c.parameter, c.value])).toEqual([["b0", 0.18]]);
    expect(out.families[0].variants[0].painleve.verdict).toBe("not-run");
  });

  it("files with errors: errors with file, path, line, column and message; exit 2", async () => {
    const r = await screen(["tests/fixtures/screen/with-errors.yaml", "tests/fixtures/screen/broken.yaml", "--json", "--no-symbolic", "--no-painleve"]);
    expect(r.code, r.stderr).toBe(2);
    const out = JSON.parse(r.stdout) as Output;
    const good = out.families.find((f) => f.id === "fibre-good");
    expect(good?.variants[0].reducibility.verdict).toBe("reducible");
    const typo = out.families.find((f) => f.id === "fibre-typo");
    expect(typo?.variants).toEqual([]);
    expect(typo?.errors[0]).toMatchObject({ file: "tests/fixtures/screen/with-errors.yaml", path: "families[1].coefficients.h", line: 17 });
    expect(typo?.errors[0].message).toMatch(/gamma0/);
    expect(typeof typo?.errors[0].column).toBe("number");
    expect(out.errors[0]).toMatchObject({ file: "tests/fixtures/screen/broken.yaml" });
    expect(out.errors[0].line).toBeGreaterThan(0);
  });

  it("a readable table without --json; a missing file is an error (exit 2); no file is a usage error (exit 1)", async () => {
    const table = await screen(["tests/fixtures/screen/classic.yaml", "--no-symbolic", "--no-painleve"]);
    expect(table.code, table.stderr).toBe(0);
    expect(table.stdout).toMatch(/trap-and-ramp \(nls\)/);
    expect(table.stdout).toMatch(/lam=1\s+reducible/);
    expect(table.stdout).toMatch(/summary: all 2 variants are reducible/);
    const missing = await screen(["tests/fixtures/screen/does-not-exist.yaml", "--json"]);
    expect(missing.code).toBe(2);
    expect((JSON.parse(missing.stdout) as Output).errors[0].message).toMatch(/cannot read/);
    const usage = await screen([]);
    expect(usage.code).toBe(1);
    expect(usage.stderr).toMatch(/usage/);
  });

  it("with the symbolic worker: simplified residual and a closed form for the constraint", async () => {
    const r = await screen(["tests/fixtures/screen/free-parameter.yaml", "--json", "--no-painleve", "--timeout", "10000"]);
    expect(r.code, r.stderr).toBe(0);
    const out = JSON.parse(r.stdout) as Output;
    const ev = out.families[0].variants[0].reducibility.evidence as {
      display: { source: string; latex: string };
      freeParameters: { solutions: { closedForm?: string }[] };
    };
    // algebrite: R = 9/25 - 2 b0 (a = 1/2, W = -0.6; derived from nls.md §3), root 9/50.
    expect(ev.display.source).toBe("symbolic-hook");
    expect(ev.freeParameters.solutions[0].closedForm).toBe("b0 = \\frac{9}{50}");
  });
});
