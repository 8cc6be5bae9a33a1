/**
 * A stored family's coefficients as expression trees, read back from families.spec_json (the
 * texts the user wrote, or derived from their equation string): for the "as submitted" display,
 * and for the canonical coefficient key that finds duplicates across owners.
 */
import { parseExpression, substitute, sym, type Expr } from "@/lib/screening/expr";
import { canonicalCoefficient, sha256Hex, type EquationClass } from "@/lib/screening/spec";

/** What of a FamilySpec is kept in families.spec_json (see lib/batches/store.ts). */
export interface StoredSpec {
  id?: string;
  title?: string;
  class?: EquationClass;
  variables?: { evolution?: string; space?: string; field?: string };
  parameters?: Record<string, unknown>;
  coefficients?: Record<string, string>;
  equation?: string;
  functions?: Record<string, string>;
  window?: [number, number];
  tags?: string[];
  notes?: string;
}

export function readStoredSpec(specJson: string): StoredSpec {
  try {
    const v: unknown = JSON.parse(specJson);
    return v && typeof v === "object" ? (v as StoredSpec) : {};
  } catch {
    return {};
  }
}

const IDENT = /[A-Za-z_][A-Za-z0-9_]*/g;

/** Every identifier of a text that is not a call (parameters, variables). */
function symbolsOf(text: string): Set<string> {
  const out = new Set<string>();
  for (const m of text.matchAll(IDENT)) {
    const at = m.index ?? 0;
    if (at > 0 && /[0-9.]/.test(text.charAt(at - 1))) continue; // exponent of a number, e.g. 1e5
    if (/^\s*\(/.test(text.slice(at + m[0].length))) continue;
    out.add(m[0]);
  }
  return out;
}

export interface ParsedCoefficients {
  /** In the family's own variables (for "as submitted"). */
  submitted: Map<string, Expr>;
  /** Renamed to the engine's t and x, helpers inlined (for the canonical key). */
  engine: Map<string, Expr>;
  /** Coefficients that could not be read back (shown as text). */
  unreadable: string[];
}

/** Parse helpers (in dependency order, by repeated passes) and coefficients of a stored spec. */
export function parseStoredCoefficients(spec: StoredSpec): ParsedCoefficients {
  const evolution = spec.variables?.evolution ?? "t";
  const space = spec.variables?.space ?? "x";
  const helpers = new Map<string, { variable: string; body: Expr }>();
  const pending = new Map(Object.entries(spec.functions ?? {}));
  for (let pass = 0; pass < 20 && pending.size; pass++) {
    for (const [name, body] of [...pending]) {
      const r = parseExpression(body, { symbols: symbolsOf(body), helpers });
      if (r.ok) {
        helpers.set(name, { variable: evolution, body: r.expr });
        pending.delete(name);
      }
    }
  }
  const submitted = new Map<string, Expr>();
  const engine = new Map<string, Expr>();
  const unreadable: string[] = [];
  const rename: Record<string, Expr> = Object.create(null) as Record<string, Expr>;
  rename[evolution] = sym("t");
  rename[space] = sym("x");
  for (const [name, text] of Object.entries(spec.coefficients ?? {})) {
    const plain = parseExpression(text, { symbols: symbolsOf(text) });
    const inlined = parseExpression(text, { symbols: symbolsOf(text), helpers });
    if (plain.ok) submitted.set(name, plain.expr);
    if (inlined.ok) engine.set(name, evolution === "t" && space === "x" ? inlined.expr : substitute(inlined.expr, rename));
    if (!plain.ok && !inlined.ok) unreadable.push(name);
    else if (!plain.ok && inlined.ok) submitted.set(name, inlined.expr);
  }
  return { submitted, engine, unreadable };
}

/**
 * sha256 of class + sorted "name=canonical text" of the nonzero coefficients. Two families with the
 * same coefficients (however written) share it, whatever their parameter sweep, window or owner.
 * Null when a coefficient cannot be read back (no key is better than a wrong one).
 */
export function coefficientsKey(cls: EquationClass, spec: StoredSpec): string | null {
  const parsed = parseStoredCoefficients(spec);
  if (parsed.unreadable.length || parsed.engine.size === 0) return null;
  const parts = [...parsed.engine.entries()]
    .map(([name, e]) => `${name}=${canonicalCoefficient(e)}`)
    .filter((p) => !p.endsWith("=0"))
    .sort();
  return sha256Hex(JSON.stringify(["wavesieve-coefficients", 1, cls, parts]));
}
