/**
 * Validation of a design request: the class, the unknown, the fixed coefficients (parsed with
 * the parameters in scope), the window, the parameter values and the preconditions of the class
 * on the window (README "Preconditions": a h ≠ 0, p q ≠ 0). Every problem is a DesignError
 * naming the field it is about.
 */
import { ALLOWED_FUNCTIONS, num, parseExpression, substitute } from "../expr";
import type { Expr } from "../expr";
import { scanCoefficients } from "../reducibility";
import { INVARIANTS } from "../reducibility/invariants";
import { CLASS_COEFFICIENTS } from "../spec/types";
import type { EquationClass } from "../spec/types";
import { fromDecimalText } from "./rational";
import { solvableCoefficients, solverFor } from "./solvers";
import type { SolverDefinition } from "./solvers";
import type { DesignError, DesignRequest } from "./types";

const CLASSES: readonly EquationClass[] = ["nls", "kdv", "mkdv"];
/** README "Preconditions": these may not vanish on the window. */
const NONZERO: Record<EquationClass, readonly string[]> = { nls: ["a", "h"], kdv: ["p", "q"], mkdv: ["p", "q"] };
const NAME = /^[A-Za-z][A-Za-z0-9_]{0,31}$/;
const RESERVED = new Set(["t", "x", "pi", "e", "i", "free", ...ALLOWED_FUNCTIONS]);
/** Coefficients that never enter the invariant (nls.md §3, kdv.md §2, mkdv.md §2). */
const NEVER_ENTER: Record<EquationClass, readonly string[]> = { nls: ["e", "f", "g"], kdv: ["g", "l"], mkdv: ["g"] };

export interface ValidRequest {
  cls: EquationClass;
  unknown: string;
  solver: SolverDefinition;
  /** Fixed coefficient texts as given (trimmed). */
  texts: Record<string, string>;
  /** Fixed coefficient trees with the parameter values substituted (exact decimals); unset ones are 0. */
  coefficients: Record<string, Expr>;
  window: [number, number];
  /** Parameter values and their exact decimal text. */
  parameters: Record<string, { value: number; text: string }>;
  constants: Record<string, number>;
  id?: string;
  title?: string;
}

const isRecord = (x: unknown): x is Record<string, unknown> => typeof x === "object" && x !== null && !Array.isArray(x);

function parameterValue(name: string, raw: unknown, errors: DesignError[]): { value: number; text: string } | null {
  const field = `parameters.${name}`;
  if (!NAME.test(name) || RESERVED.has(name)) {
    errors.push({ code: "parameter", field, message: `'${name}' cannot be a parameter name: names start with a letter, use letters, digits and '_', and are not t, x, pi, e, i or a function name` });
    return null;
  }
  const text = typeof raw === "number" ? String(raw) : typeof raw === "string" ? raw.trim() : "";
  const exact = fromDecimalText(text);
  const value = Number(text);
  if (!exact || !Number.isFinite(value) || text === "") {
    errors.push({ code: "parameter", field, message: `parameter ${name} needs a finite number (a decimal such as 0.25 or -3e-2), not '${String(raw)}'` });
    return null;
  }
  return { value, text };
}

/** Parse and check a request; `errors` is empty exactly when the request is usable. */
export function validateRequest(body: unknown): { ok: true; request: ValidRequest } | { ok: false; errors: DesignError[] } {
  const errors: DesignError[] = [];
  if (!isRecord(body)) return { ok: false, errors: [{ code: "bad-request", message: "the request must be an object { class, solve, set, window, parameters?, constants? }" }] };
  const r = body as Partial<DesignRequest> & Record<string, unknown>;
  const cls = typeof r.class === "string" ? (r.class.trim().toLowerCase() as EquationClass) : undefined;
  if (!cls || !CLASSES.includes(cls)) {
    return { ok: false, errors: [{ code: "unknown-class", field: "class", message: `unknown class '${String(r.class ?? "")}'; choose nls, kdv or mkdv` }] };
  }
  const all = CLASS_COEFFICIENTS[cls];
  const offered = solvableCoefficients(cls);
  const set = isRecord(r.set) ? r.set : null;
  if (r.set !== undefined && !set) errors.push({ code: "bad-request", field: "set", message: "set must be an object { coefficient: expression }" });
  const setNames = set ? Object.keys(set).filter((k) => String(set[k] ?? "").trim() !== "") : [];

  const unknown = typeof r.solve === "string" ? r.solve.trim() : "";
  if (unknown === "") {
    errors.push({
      code: setNames.length >= all.length ? "all-fixed" : "bad-request",
      field: "solve",
      message: setNames.length >= all.length
        ? `every coefficient is fixed, so there is nothing to solve for; leave one out and name it in solve (one of ${offered.join(", ")})`
        : `name the coefficient to solve for in solve (one of ${offered.join(", ")})`,
    });
  } else if (!all.includes(unknown)) {
    errors.push({ code: "unknown-coefficient", field: "solve", message: `'${unknown}' is not a coefficient of the ${cls} class; its coefficients are ${all.join(", ")} and design mode solves for ${offered.join(", ")}` });
  } else if (!offered.includes(unknown)) {
    const never = NEVER_ENTER[cls].includes(unknown);
    errors.push({
      code: "not-solvable",
      field: "solve",
      message: never
        ? `${unknown} never enters the invariant ${INVARIANTS[cls].symbol} of the ${cls} class, so no value of it makes a model integrable or not; solve for one of ${offered.join(", ")}`
        : `design mode does not solve for ${unknown} in the ${cls} class; it solves for ${offered.join(", ")}`,
    });
  } else if (setNames.includes(unknown)) {
    errors.push({ code: "all-fixed", field: `set.${unknown}`, message: `${unknown} is both fixed in set and the unknown; remove it from set (its start value is an integration constant you can edit)` });
  }
  for (const name of setNames) {
    if (!all.includes(name)) errors.push({ code: "unknown-coefficient", field: `set.${name}`, message: `'${name}' is not a coefficient of the ${cls} class; its coefficients are ${all.join(", ")}` });
  }
  if (set && setNames.length === 0) errors.push({ code: "none-fixed", field: "set", message: "no coefficient is fixed; give the coefficients you know (all but the unknown; unset ones count as 0)" });
  if (!set) errors.push({ code: "none-fixed", field: "set", message: "no coefficient is fixed; give the coefficients you know in set" });

  // Window.
  let window: [number, number] = [0, 1];
  const w = r.window;
  if (!Array.isArray(w) || w.length !== 2 || !w.every((x) => typeof x === "number" && Number.isFinite(x)) || !((w[1] as number) > (w[0] as number))) {
    errors.push({ code: "window", field: "window", message: "window must be [t0, t1] with finite numbers t0 < t1" });
  } else window = [w[0] as number, w[1] as number];

  // Parameters.
  const parameters: Record<string, { value: number; text: string }> = {};
  if (r.parameters !== undefined && !isRecord(r.parameters)) errors.push({ code: "bad-request", field: "parameters", message: "parameters must be an object { name: number }" });
  else if (r.parameters) {
    for (const [name, raw] of Object.entries(r.parameters)) {
      const v = parameterValue(name, raw, errors);
      if (v) parameters[name] = v;
    }
  }

  // Expressions.
  const symbols = new Set(["t", ...Object.keys(parameters)]);
  const texts: Record<string, string> = {};
  const coefficients: Record<string, Expr> = {};
  const values: Record<string, Expr> = {};
  for (const [name, p] of Object.entries(parameters)) values[name] = num(p.value, p.text);
  for (const name of setNames) {
    if (!all.includes(name) || name === unknown) continue;
    const raw = set?.[name];
    const text = typeof raw === "number" ? String(raw) : typeof raw === "string" ? raw.trim() : "";
    if (typeof raw !== "string" && typeof raw !== "number") {
      errors.push({ code: "expression", field: `set.${name}`, message: `coefficient ${name} must be an expression text` });
      continue;
    }
    const parsed = parseExpression(text, { symbols });
    if (!parsed.ok) {
      const hint = /unknown symbol/.test(parsed.error.message) ? "; give its value under parameters (coefficients are functions of t only)" : "";
      errors.push({ code: "expression", field: `set.${name}`, char: parsed.error.char, message: `coefficient ${name}: ${parsed.error.message}${hint}` });
      continue;
    }
    texts[name] = text;
    coefficients[name] = substitute(parsed.expr, values);
  }
  if (unknown && all.includes(unknown)) {
    for (const name of NONZERO[cls]) {
      if (name !== unknown && !(name in texts) && !errors.some((e) => e.field === `set.${name}`)) {
        errors.push({ code: "missing-required", field: `set.${name}`, message: `${name} must be fixed: ${NONZERO[cls].join(" and ")} may not vanish on the window (README "Preconditions")` });
      }
    }
  }

  // Constants (checked against the solver's list).
  const solver = unknown ? solverFor(cls, unknown) : null;
  const constants: Record<string, number> = {};
  if (r.constants !== undefined && !isRecord(r.constants)) errors.push({ code: "bad-request", field: "constants", message: "constants must be an object { name: number }" });
  else if (r.constants && solver) {
    const allowed = solver.constants.map((c) => c.name);
    for (const [name, v] of Object.entries(r.constants)) {
      const spec = solver.constants.find((c) => c.name === name);
      if (!spec) {
        errors.push({ code: "constant", field: `constants.${name}`, message: allowed.length ? `'${name}' is not a constant of this design; its constants are ${allowed.join(", ")}` : `this design has no integration constants ('${name}' given)` });
      } else if (typeof v !== "number" || !Number.isFinite(v)) {
        errors.push({ code: "constant", field: `constants.${name}`, message: `constant ${name} needs a finite number` });
      } else if (spec.nonzero && v === 0) {
        errors.push({ code: "constant", field: `constants.${name}`, message: `constant ${name} may not be 0 (${spec.meaning.split(";")[0]})` });
      } else constants[name] = v;
    }
  }

  const id = typeof r.id === "string" && r.id.trim() ? r.id.trim() : undefined;
  if (id && !/^[a-z0-9][a-z0-9-]{0,63}$/.test(id)) errors.push({ code: "bad-request", field: "id", message: "id must be a slug: lower-case letters, digits and '-', at most 64 characters" });
  const title = typeof r.title === "string" && r.title.trim() ? r.title.trim().slice(0, 200) : undefined;

  if (errors.length > 0 || !solver) return { ok: false, errors: errors.length ? errors : [{ code: "bad-request", field: "solve", message: "no solve given" }] };

  // Preconditions on the window, for the coefficients that are fixed.
  for (const name of all) if (!(name in coefficients) && name !== unknown) coefficients[name] = num(0);
  const fixedNames = Object.keys(texts);
  const scan = scanCoefficients(coefficients, fixedNames, NONZERO[cls].filter((n) => n !== unknown), window);
  for (const name of scan.vanishing) errors.push({ code: "vanishes", field: `set.${name}`, message: `${name} vanishes on the whole window; ${NONZERO[cls].join(" and ")} must be nonzero (README "Preconditions")` });
  // A singular end at t1 is harmless; at t0 the integration constants would not exist.
  const atStart = scan.endpoints.filter((p) => Math.abs(p.t - window[0]) < Math.abs(p.t - window[1]));
  for (const p of [...scan.points, ...atStart]) {
    if (p.kind === "zero") errors.push({ code: "vanishes", field: `set.${p.coefficient}`, message: `${p.coefficient} vanishes at t = ${p.t.toPrecision(6)} in the window [${window.join(", ")}]; ${NONZERO[cls].join(" and ")} must be nonzero there — shorten the window or change ${p.coefficient}` });
    else errors.push({ code: "singular", field: `set.${p.coefficient}`, message: `${p.coefficient} is singular (${p.kind}) at t = ${p.t.toPrecision(6)} in the window; shorten the window` });
  }
  for (const u of scan.undefinedRegions) errors.push({ code: "singular", field: `set.${u.coefficient}`, message: `${u.coefficient} is not a finite real number on [${u.from.toPrecision(4)}, ${u.to.toPrecision(4)}]` });
  if (errors.length > 0) return { ok: false, errors: dedupe(errors) };
  return { ok: true, request: { cls, unknown, solver, texts, coefficients, window, parameters, constants, id, title } };
}

function dedupe(errors: DesignError[]): DesignError[] {
  const seen = new Set<string>();
  return errors.filter((e) => {
    const k = `${e.code}|${e.field}|${e.message}`;
    if (seen.has(k)) return false;
    seen.add(k);
    return true;
  });
}
