/**
 * Design mode: given all coefficients of a class but one, the coefficient that makes the model
 * integrable (invariant ≡ 0, ../shared/math/README.md), with its integration constants; a closed
 * form where the algebra is elementary, else a table from the ODE integrator. Every design is
 * screened before it is returned: closed forms by the ordinary pipeline (screenVariant on the
 * designed family, parsed back from its YAML), tables by the invariant statistic from the
 * tabulated states ("numerical design").
 */
import { exprToString, num, parseExpression, substitute, toLatex } from "../expr";
import type { Expr } from "../expr";
import { screenVariant } from "../pipeline";
import { INVARIANTS, algebriteText, scanCoefficients } from "../reducibility";
import type { SymbolicHook } from "../reducibility";
import { parseFamilies } from "../spec";
import { CLASS_COEFFICIENTS } from "../spec/types";
import type { EquationClass, Variant } from "../spec/types";
import { SYMBOLIC_TIMEOUT_MS } from "../tolerances";
import { ENGINE_VERSION } from "../version";
import { Ops, makeContext } from "./context";
import { validateRequest } from "./request";
import type { ValidRequest } from "./request";
import { interiorPoints, sameFunction, simplifyVerified, valueAt } from "./sampling";
import type { WindowContext } from "./sampling";
import { numericalScreening, pipelineScreening, sampleNodes, transformationSummary } from "./screen";
import type { ClosedForm, SolverDefinition } from "./solvers";
import { tabulate } from "./tabulate";
import type { DesignConstant, DesignCurve, DesignError, DesignOutcome, DesignPole, DesignResult, DesignSolution } from "./types";
import { familyYaml } from "./yaml";

export interface DesignOptions {
  /** Seed of the screen's sample points (default 1). */
  seed?: number;
  /** Symbolic simplification for display and for the screen's residual display; omitted → none. */
  symbolic?: SymbolicHook;
  symbolicTimeoutMs?: number;
  /** Build the map of the designed model (closed forms; default true). */
  transformation?: boolean;
  signal?: AbortSignal;
}

const CLASS_TITLE: Record<EquationClass, string> = { nls: "vc-NLS", kdv: "vc-KdV", mkdv: "vc-mKdV" };
const NONZERO: Record<EquationClass, readonly string[]> = { nls: ["a", "h"], kdv: ["p", "q"], mkdv: ["p", "q"] };
const PLOT_POINTS = 201;

const fail = (...errors: DesignError[]): DesignOutcome => ({ ok: false, errors });

/** A symbol for each constant that no user parameter already uses. */
function constantNames(solver: SolverDefinition, parameters: Record<string, unknown>): Record<string, string> {
  const names: Record<string, string> = {};
  for (const c of solver.constants) {
    let name = c.name;
    for (let i = 1; name in parameters; i++) name = `${c.name}_${i}`;
    names[c.name] = name;
  }
  return names;
}

function sampleCurve(name: string, expr: Expr, win: WindowContext, role: DesignCurve["role"]): DesignCurve {
  const [t0, t1] = win.window;
  const t = Array.from({ length: PLOT_POINTS }, (_, i) => (i === PLOT_POINTS - 1 ? t1 : t0 + ((t1 - t0) * i) / (PLOT_POINTS - 1)));
  const values = t.map((x) => {
    const v = valueAt(expr, win, x);
    return Number.isFinite(v) ? v : null;
  });
  return { name, latex: toLatex(expr), role, t, values };
}

/** Plot values beside a pole would dominate any axis: leave a gap of two cells. */
function gapAtPoles(curve: DesignCurve, poles: DesignPole[]): DesignCurve {
  if (poles.length === 0) return curve;
  const cell = (curve.t[curve.t.length - 1] - curve.t[0]) / (curve.t.length - 1);
  return { ...curve, values: curve.values.map((v, i) => (poles.some((p) => Math.abs(p.t - curve.t[i]) < 2 * cell) ? null : v)) };
}

async function displayLatex(expr: Expr, win: WindowContext, symbols: string[], options: DesignOptions): Promise<string | undefined> {
  if (!options.symbolic) return undefined;
  try {
    const answer = await options.symbolic({ kind: "simplify", expression: algebriteText(expr), timeoutMs: options.symbolicTimeoutMs ?? SYMBOLIC_TIMEOUT_MS });
    if (!answer || /stop|nil|undefined/i.test(answer)) return undefined;
    const parsed = parseExpression(answer.trim(), { symbols: new Set(symbols) });
    if (!parsed.ok || !sameFunction(expr, parsed.expr, win)) return undefined;
    const latex = toLatex(parsed.expr);
    return latex.length < toLatex(expr).length ? latex : undefined;
  } catch {
    return undefined;
  }
}

interface Prepared {
  req: ValidRequest;
  ops: Ops;
  constants: DesignConstant[];
  names: Record<string, string>;
}

function prepare(req: ValidRequest): Prepared | DesignError[] {
  const { solver } = req;
  const names = constantNames(solver, req.parameters);
  const pre = new Ops(makeContext(req.cls, req.unknown, req.coefficients, req.window, names, {}));
  const values: Record<string, number> = {};
  const constants: DesignConstant[] = [];
  const errors: DesignError[] = [];
  for (const spec of solver.constants) {
    const defaultValue = spec.defaultValue(pre);
    const value = req.constants[spec.name] ?? defaultValue;
    if (!Number.isFinite(value) || (spec.nonzero && value === 0)) {
      errors.push({ code: "constant", field: `constants.${spec.name}`, message: `the default of ${spec.name} is not usable here (${String(value)}); give a value` });
      continue;
    }
    values[spec.name] = value;
    constants.push({ name: names[spec.name], latex: spec.latex, value, defaultValue, meaning: spec.meaning, nonzero: Boolean(spec.nonzero) });
  }
  if (errors.length) return errors;
  const ops = new Ops(makeContext(req.cls, req.unknown, req.coefficients, req.window, names, values));
  return { req, ops, constants, names };
}

function designId(req: ValidRequest): string {
  return req.id ?? `designed-${req.cls}-${req.unknown}`;
}

function designTitle(req: ValidRequest): string {
  return req.title ?? `${CLASS_TITLE[req.cls]} with ${req.unknown} designed for ${INVARIANTS[req.cls].symbol} ≡ 0`;
}

function yamlFor(p: Prepared, closed: ClosedForm, text: string, method: string): string {
  const { req } = p;
  const coefficients = CLASS_COEFFICIENTS[req.cls]
    .filter((n) => n in req.texts || n === req.unknown)
    .map((n) => (n === req.unknown ? { name: n, text, comment: "designed" } : { name: n, text: req.texts[n] }));
  const parameters = [
    ...Object.entries(req.parameters).map(([name, v]) => ({ name, value: v.value })),
    ...p.constants.map((c) => ({ name: c.name, value: c.value, comment: "integration constant of the design" })),
  ];
  const notes = [
    `Designed with Wavesieve design mode (engine ${ENGINE_VERSION}): ${req.unknown} makes ${INVARIANTS[req.cls].symbol} vanish.`,
    method,
    ...p.constants.map((c) => `${c.name} = ${c.value}: ${c.meaning}`),
    ...closed.notes,
  ];
  return familyYaml({ id: designId(req), title: designTitle(req), cls: req.cls, parameters, coefficients, window: req.window, tags: ["designed"], notes });
}

/** The designed member built from the trees (constants substituted), for formulas the YAML cannot carry. */
function directVariant(p: Prepared, solved: Expr): Variant {
  const values: Record<string, Expr> = {};
  for (const c of p.constants) values[c.name] = num(c.value);
  const coefficients: Record<string, Expr> = { ...p.req.coefficients, [p.req.unknown]: substitute(solved, values) };
  return { familyId: designId(p.req), index: 0, class: p.req.cls, parameters: {}, free: [], coefficients, window: p.req.window };
}

/** Solve, screen and describe one design request. */
export async function designModel(body: unknown, options: DesignOptions = {}): Promise<DesignOutcome> {
  const valid = validateRequest(body);
  if (!valid.ok) return valid;
  const prepared = prepare(valid.request);
  if (Array.isArray(prepared)) return fail(...prepared);
  const { req, ops, constants } = prepared;
  const { solver } = req;
  const seed = options.seed ?? 1;
  const condition = solver.condition(ops);
  const notes: string[] = [];
  const win = ops.dc.win;

  let closed: ClosedForm | null = null;
  try {
    closed = solver.closed(ops);
  } catch (err) {
    notes.push(`the closed form could not be built (${err instanceof Error ? err.message : String(err)})`);
  }
  if (closed && !interiorPoints(req.window, 9).some((t) => Number.isFinite(valueAt(closed!.expr, win, t)))) closed = null;
  if (closed) closed = { ...closed, expr: simplifyVerified(closed.expr, win, ops.dc.normal).expr };

  const fixedCurves = Object.keys(req.texts).map((n) => sampleCurve(n, req.coefficients[n], win, "fixed"));
  const fixed = Object.entries(req.texts).map(([name, text]) => ({ name, text, latex: toLatex(req.coefficients[name]) }));
  const parameters = Object.fromEntries(Object.entries(req.parameters).map(([k, v]) => [k, v.value]));
  const base = {
    class: req.cls,
    solve: req.unknown,
    window: req.window,
    condition: { ...condition, invariant: INVARIANTS[req.cls].symbol },
    fixed,
    parameters,
    constants,
    engine: ENGINE_VERSION,
  };

  if (closed) {
    notes.push(...closed.notes);
    const text = exprToString(closed.expr);
    const yaml = yamlFor(prepared, closed, text, condition.method);
    const parsed = parseFamilies(yaml, { file: `${designId(req)}.yaml` });
    const parsedBack = parsed.errors.length === 0 && parsed.families.length === 1;
    // A formula the family format refuses (e.g. longer than its 2000-character limit) is still
    // screened, on the variant built from the trees; it cannot be submitted.
    const variant: Variant = parsedBack ? parsed.families[0].variants[0] : directVariant(prepared, closed.expr);
    const refusal = parsedBack ? null : parsed.errors.map((e) => e.message).join("; ");
    options.signal?.throwIfAborted();
    const screenOptions = { seed, accepted: false, symbolic: options.symbolic, symbolicTimeoutMs: options.symbolicTimeoutMs, signal: options.signal };
    const report = await screenVariant(variant, screenOptions);
    let screening = pipelineScreening(report);
    const windows = report.reducibility.evidence.windows.map((w) => w.window);
    if (report.reducibility.verdict === "reducible" && report.painleve.verdict !== "passes" && windows.length > 1) {
      // The reducibility stage splits the window at singular points (poles of the designed
      // coefficient, README "Preconditions"); the Painlevé stage samples the whole window, where
      // sign(h/a) may differ between points. Screen each sub-window on its own.
      const parts = await Promise.all(windows.map((w) => screenVariant({ ...variant, window: w }, screenOptions)));
      if (parts.every((r) => r.reducibility.verdict === "reducible" && r.painleve.verdict === "passes")) {
        screening = {
          ...screening,
          painleve: "passes",
          painleveReason: `passes on each of the ${windows.length} sub-windows between the singular points (${windows.map((w) => `[${w[0].toPrecision(4)}, ${w[1].toPrecision(4)}]`).join(", ")}), screened one by one; on the whole window the stage reported "${report.painleve.verdict}" (${"reason" in report.painleve ? report.painleve.reason : ""})`,
        };
        notes.push("the designed coefficient is singular inside the window; the Painlevé test was run per sub-window");
      }
    }
    if (screening.reducibility !== "reducible" || screening.painleve !== "passes") {
      return fail({
        code: "check-failed",
        message: `the designed ${req.unknown} did not pass the screen (reducibility: ${report.reducibility.verdict}, rho_inv ≤ ${screening.rhoMax.toExponential(2)}; Painlevé: ${report.painleve.verdict}); it is not shown — this is an engine error, please report it with the request`,
      });
    }
    const solved = variant.coefficients[req.unknown];
    const scan = scanCoefficients({ [req.unknown]: solved }, [req.unknown], NONZERO[req.cls].includes(req.unknown) ? [req.unknown] : [], req.window);
    const poles: DesignPole[] = [...scan.points, ...scan.endpoints]
      .filter((p) => p.kind === "pole" || p.kind === "zero" || p.kind === "non-finite")
      .map((p) => ({
        t: p.t,
        kind: p.kind === "zero" ? "zero" : "pole",
        detail: req.cls === "nls" && req.unknown === "h" && p.kind !== "zero" ? "h has a pole here: a focusing time of the map (nls.md §7)" : `${req.unknown} is ${p.kind === "zero" ? "zero" : "singular"} here`,
      }));
    const solution: DesignSolution = {
      form: "closed",
      text,
      latex: toLatex(closed.expr),
      displayLatex: await displayLatex(closed.expr, win, ["t", ...constants.map((c) => c.name)], options),
    };
    const result: DesignResult = {
      ...base,
      solution,
      poles,
      screening,
      plot: [gapAtPoles(sampleCurve(req.unknown, closed.expr, win, "solved"), poles), ...fixedCurves],
      yaml: refusal ? null : yaml,
      submittable: !refusal,
      submitNote: refusal
        ? `closed form, but the family format refuses it (${refusal}), so it cannot be submitted`
        : "closed form: the designed model can be submitted as a family (its YAML is included).",
      transformation: options.transformation === false ? undefined : transformationSummary(variant),
      notes,
    };
    return { ok: true, result };
  }

  if (!solver.numeric) return fail({ code: "no-solution", message: `no closed form of ${req.unknown} could be built for these coefficients` });
  const system = solver.numeric(ops);
  notes.push(`no closed form: ${system.reason}; tabulated with the ODE integrator`);
  const table = tabulate(system, req.coefficients, req.window, []);
  if (table.t.length < 3) {
    return fail({ code: "no-solution", message: `the integration of ${req.unknown} stopped at once${table.stopped ? `: ${table.stopped.message}` : ""}` });
  }
  if (table.stopped) notes.push(`the integration stopped near t = ${table.stopped.t.toPrecision(6)} (${table.stopped.message}); the table covers [${table.reached[0]}, ${table.reached[1]}]`);
  const nodes = sampleNodes(table.t, table.poles, seed, `${req.cls}:${req.unknown}`);
  const screening = numericalScreening(req, system, table.t, table.states, nodes);
  if (screening.reducibility !== "reducible") {
    return fail({ code: "check-failed", message: `the tabulated ${req.unknown} did not pass the numerical check (rho_inv ≤ ${screening.rhoMax.toExponential(2)}); it is not shown — this is an engine error` });
  }
  const solution: DesignSolution = {
    form: "tabulated",
    reason: system.reason,
    t: table.t,
    values: table.values,
    reached: table.reached,
    stopped: table.stopped,
    accuracy: table.accuracy,
  };
  const solvedCurve: DesignCurve = { name: req.unknown, latex: req.unknown, role: "solved", t: table.t, values: table.values };
  const result: DesignResult = {
    ...base,
    solution,
    poles: table.poles,
    screening,
    plot: [solvedCurve, ...fixedCurves.map((c) => gapAtPoles(c, []))],
    yaml: null,
    submittable: false,
    submitNote: "numerical design: the solved coefficient exists only as a table, and the family format has expressions, not tables, so it cannot be submitted. Fixed coefficients with an elementary solution (see the method) give a closed form that can.",
    notes,
  };
  return { ok: true, result };
}
