/**
 * parseExpression: user text → validated Expr. mathjs only builds the syntax tree (it never
 * evaluates anything); a whitelist walk then converts it, rejecting every node kind outside
 * numbers, the allowed symbols, + - * / ^, and one-argument calls of the allowed functions.
 * Pattern from ../shared/ENGINE-NOTES.md §3 and Appendix B.
 */
import { create, parseDependencies } from "mathjs";
import type { Expr, ExprError, ParseOptions, ParseResult, UnaryFunction } from "./types";
import { MAX_EXPRESSION_DEPTH, MAX_EXPRESSION_LENGTH, MAX_EXPRESSION_TREE_DEPTH } from "../tolerances";
import { E_TEXT, PI_TEXT } from "./constants";
import { call, div, mul, neg, num, pow, sub, add, substitute, sym, exprDepth } from "./tree";
import {
  BITWISE,
  COMPARISONS,
  FUNCTION_ADVICE,
  INVERSE_FUNCTIONS,
  NODE_ADVICE,
  NODE_MARK,
  NON_SMOOTH,
  OPERATOR_ADVICE,
} from "./parse-messages";

/** A private mathjs instance holding only `parse`, so no configuration elsewhere can affect it. */
const mathjs = create({ parseDependencies }, {});

/** The allowed functions, in the order they are listed in messages. */
export const ALLOWED_FUNCTIONS: readonly UnaryFunction[] = [
  "sin", "cos", "tan", "exp", "log", "sqrt", "sinh", "cosh", "tanh", "sech", "csch", "coth", "abs",
];
const FUNCTION_SET: ReadonlySet<string> = new Set<string>(ALLOWED_FUNCTIONS);

const BINARY: ReadonlyMap<string, (a: Expr, b: Expr) => Expr> = new Map([
  ["add", add],
  ["subtract", sub],
  ["multiply", mul],
  ["divide", div],
  ["pow", pow],
]);

/** The fields of a mathjs node this walk reads (mathjs' own types are too generic to narrow). */
interface RawNode {
  type: string;
  value?: unknown;
  fn?: unknown;
  op?: string;
  name?: string;
  args?: RawNode[];
  implicit?: boolean;
  content?: RawNode;
}

class ExprParseError extends Error {
  readonly char?: number;
  constructor(message: string, char?: number) {
    super(message);
    this.char = char;
  }
}

// ---------------------------------------------------------------------------------------------
// Positions in the text

function escapeRegExp(s: string): string {
  return s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
}
/** 1-based position of the first occurrence of `name` as a whole identifier. */
function identifierPosition(text: string, name: string): number | undefined {
  const re = new RegExp(`(?<![\\w$.\\u00C0-\\uFFFF])${escapeRegExp(name)}(?![\\w$\\u00C0-\\uFFFF])`);
  const m = re.exec(text);
  return m ? m.index + 1 : undefined;
}
function markPosition(text: string, mark: string | undefined): number | undefined {
  if (!mark) return undefined;
  const i = text.indexOf(mark);
  return i >= 0 ? i + 1 : undefined;
}

/** Position of the first ".name" or "[" that follows a name or a closing bracket. */
function accessorPosition(text: string): number | undefined {
  const m = /(?<=[\w$)\]]\s*)(?:\.(?=\s*[A-Za-z_$])|\[)/.exec(text);
  return m ? m.index + 1 : undefined;
}

const TOKEN = /0[xXbBoO][0-9a-fA-F.]*|(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?|[A-Za-z_$\u00C0-\uFFFF][\w$\u00C0-\uFFFF]*|\S/g;
const OPERATOR_WORDS: ReadonlySet<string> = new Set(["and", "or", "xor", "not", "mod", "to", "in"]);
type TokenKind = "num" | "ident" | "open" | "close" | "other";
interface Token {
  kind: TokenKind;
  text: string;
  char: number;
}
function tokenize(text: string): Token[] {
  const out: Token[] = [];
  for (const m of text.matchAll(TOKEN)) {
    const t = m[0];
    const kind: TokenKind = /^[\d.]/.test(t) && t !== "."
      ? "num"
      : /^[A-Za-z_$\u00C0-\uFFFF]/.test(t)
        ? "ident"
        : t === "(" ? "open" : t === ")" ? "close" : "other";
    out.push({ kind, text: t, char: (m.index ?? 0) + 1 });
  }
  return out;
}
/** Where a factor follows another with no operator between them (the start of the second). */
function implicitMultiplicationPosition(tokens: Token[]): number | undefined {
  for (let i = 1; i < tokens.length; i++) {
    const p = tokens[i - 1];
    const c = tokens[i];
    if (OPERATOR_WORDS.has(p.text) || OPERATOR_WORDS.has(c.text)) continue;
    const ends = p.kind === "num" || p.kind === "ident" || p.kind === "close";
    const starts = c.kind === "num" || c.kind === "ident" || c.kind === "open";
    if (ends && starts && !(p.kind === "ident" && c.kind === "open")) return c.char;
  }
  return undefined;
}

function maxParenthesisDepth(text: string, limit: number): { depth: number; char?: number } {
  let depth = 0;
  let max = 0;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (ch === "(" || ch === "[" || ch === "{") {
      depth++;
      if (depth > max) max = depth;
      if (depth > limit) return { depth, char: i + 1 };
    } else if (ch === ")" || ch === "]" || ch === "}") {
      depth = Math.max(0, depth - 1);
    }
  }
  return { depth: max };
}

// ---------------------------------------------------------------------------------------------
// The whitelist walk

interface WalkState {
  text: string;
  tokens: Token[];
  /** Numeric literal tokens in source order; consumed in the (source-ordered) walk. */
  literals: Token[];
  nextLiteral: number;
  symbols: ReadonlySet<string>;
  helpers: ReadonlyMap<string, { variable: string; body: Expr }>;
}

function listSymbols(symbols: ReadonlySet<string>): string {
  const names = [...symbols, ...["pi", "e"].filter((c) => !symbols.has(c))];
  const shown = names.slice(0, 12).join(", ");
  return names.length > 12 ? `${shown}, …` : shown;
}
function listFunctions(helpers: ReadonlyMap<string, unknown>): string {
  return [...ALLOWED_FUNCTIONS, ...helpers.keys()].join(", ");
}

function constantNode(n: RawNode, s: WalkState): Expr {
  const v = n.value;
  if (typeof v === "string") throw new ExprParseError("text in quotes is not allowed: write a number", markPosition(s.text, "\"") ?? markPosition(s.text, "'"));
  if (typeof v === "boolean") throw new ExprParseError(`'${String(v)}' is not a number`, identifierPosition(s.text, String(v)));
  if (typeof v !== "number") throw new ExprParseError("only numbers, symbols and functions are allowed", identifierPosition(s.text, String(v)));
  if (Number.isNaN(v)) throw new ExprParseError("NaN is not allowed: write a number", identifierPosition(s.text, "NaN"));
  const lit = s.literals[s.nextLiteral];
  if (!lit || (!Number.isFinite(v) && Number.isFinite(Number(lit.text)))) {
    // A non-finite constant that is not a written number: mathjs' Infinity.
    throw new ExprParseError("Infinity is not allowed: write a finite number", identifierPosition(s.text, "Infinity"));
  }
  s.nextLiteral++;
  if (/^0[xXbBoO]/.test(lit.text)) throw new ExprParseError("write numbers in decimal notation", lit.char);
  if (!Number.isFinite(v)) throw new ExprParseError(`number out of range: ${lit.text}`, lit.char);
  if (v === 0 && /[1-9]/.test(lit.text.split(/[eE]/)[0])) {
    throw new ExprParseError(`number out of range (too small): ${lit.text}`, lit.char);
  }
  // The text as written keeps every digit for the decimal field; it must agree with mathjs' value.
  return Number(lit.text) === v ? num(v, lit.text) : num(v);
}

function symbolNode(name: string, s: WalkState): Expr {
  if (s.symbols.has(name)) return sym(name);
  if (name === "pi") return num(Math.PI, PI_TEXT);
  if (name === "e") return num(Math.E, E_TEXT);
  const at = identifierPosition(s.text, name);
  if (FUNCTION_SET.has(name) || s.helpers.has(name)) {
    throw new ExprParseError(`'${name}' is a function: write ${name}(…)`, at);
  }
  if (name === "PI") throw new ExprParseError("unknown symbol 'PI': did you mean pi?", at);
  if (name === "E") throw new ExprParseError("unknown symbol 'E': did you mean e?", at);
  if (name === "i") throw new ExprParseError("complex numbers are not allowed (unknown symbol 'i')", at);
  if (name === "Infinity") throw new ExprParseError("Infinity is not allowed: write a finite number", at);
  throw new ExprParseError(`unknown symbol '${name}' (allowed here: ${listSymbols(s.symbols)})`, at);
}

function unknownFunctionMessage(name: string, s: WalkState): string {
  const advice = FUNCTION_ADVICE.get(name);
  if (advice) return `unknown function '${name}': ${advice}`;
  if (INVERSE_FUNCTIONS.has(name)) return `'${name}': inverse trigonometric and hyperbolic functions are not supported`;
  if (NON_SMOOTH.has(name)) return `'${name}' is not supported (coefficients must be smooth functions)`;
  if (s.symbols.has(name)) return `'${name}' is a parameter, not a function: write ${name}*(…) to multiply`;
  return `unknown function '${name}' (allowed: ${listFunctions(s.helpers)})`;
}

function functionNode(n: RawNode, s: WalkState): Expr {
  const fnNode = n.fn as RawNode | undefined;
  if (!fnNode || fnNode.type !== "SymbolNode" || typeof fnNode.name !== "string") {
    throw new ExprParseError("only named functions can be called, e.g. sin(t)");
  }
  const name = fnNode.name;
  const at = identifierPosition(s.text, name);
  const args = n.args ?? [];
  const helper = s.helpers.get(name);
  const builtin = FUNCTION_SET.has(name);
  if (!helper && !builtin) throw new ExprParseError(unknownFunctionMessage(name, s), at);
  if (args.length !== 1) {
    const extra = name === "log" && args.length === 2 ? " (natural log; for base b write log(x)/log(b))" : "";
    throw new ExprParseError(`'${name}' takes exactly one argument${extra}`, at);
  }
  const arg = walk(args[0], s);
  // A declared helper wins over a built-in of the same name (the declaration is explicit).
  if (helper) return substitute(helper.body, { [helper.variable]: arg });
  return call(name as UnaryFunction, arg);
}

function operatorNode(n: RawNode, s: WalkState): Expr {
  const fn = typeof n.fn === "string" ? n.fn : "";
  const args = n.args ?? [];
  if (n.implicit) {
    const first = args[0];
    if (first && first.type === "SymbolNode" && typeof first.name === "string" && (FUNCTION_SET.has(first.name) || s.helpers.has(first.name))) {
      throw new ExprParseError(`'${first.name}' needs parentheses: write ${first.name}(…)`, identifierPosition(s.text, first.name));
    }
    throw new ExprParseError("missing operator: write '*' for multiplication", implicitMultiplicationPosition(s.tokens));
  }
  const at = markPosition(s.text, n.op);
  if (fn === "unaryMinus" && args.length === 1) return neg(walk(args[0], s));
  if (fn === "unaryPlus" && args.length === 1) return walk(args[0], s);
  const binary = BINARY.get(fn);
  if (binary && args.length === 2) {
    const left = walk(args[0], s);
    return binary(left, walk(args[1], s));
  }
  const advice = OPERATOR_ADVICE.get(fn);
  if (advice) throw new ExprParseError(advice, at);
  if (COMPARISONS.has(fn)) throw new ExprParseError("comparisons ('==', '<', …) are not allowed", at);
  if (BITWISE.has(fn)) throw new ExprParseError("bitwise operators are not allowed", at);
  throw new ExprParseError(`operator '${n.op ?? fn}' is not allowed (use + - * / ^)`, at);
}

function walk(n: RawNode, s: WalkState): Expr {
  switch (n.type) {
    case "ConstantNode":
      return constantNode(n, s);
    case "ParenthesisNode":
      if (!n.content) throw new ExprParseError("empty parentheses");
      return walk(n.content, s);
    case "SymbolNode":
      return symbolNode(String(n.name), s);
    case "FunctionNode":
      return functionNode(n, s);
    case "OperatorNode":
      return operatorNode(n, s);
    default: {
      const advice = NODE_ADVICE.get(n.type) ?? "this construct is not allowed in an expression";
      const at = n.type === "AccessorNode" || n.type === "IndexNode"
        ? accessorPosition(s.text)
        : markPosition(s.text, NODE_MARK.get(n.type));
      throw new ExprParseError(advice, at);
    }
  }
}

// ---------------------------------------------------------------------------------------------

function fail(message: string, char?: number): ParseResult {
  const error: ExprError = char === undefined ? { message } : { message, char };
  return { ok: false, error };
}

/**
 * Parse and validate one expression.
 *
 * @example parseExpression("a0*(1 + eps*cos(w*t))", { symbols: new Set(["t", "a0", "eps", "w"]) })
 */
export function parseExpression(text: string, options: ParseOptions): ParseResult {
  const maxLength = options.maxLength ?? MAX_EXPRESSION_LENGTH;
  const maxDepth = options.maxDepth ?? MAX_EXPRESSION_DEPTH;
  if (typeof text !== "string") return fail("the expression must be text");
  if (text.length > maxLength) return fail(`expression too long (${text.length} characters; at most ${maxLength})`);
  if (text.trim() === "") return fail("empty expression");
  const depth = maxParenthesisDepth(text, maxDepth);
  if (depth.char !== undefined) {
    return fail(`too deeply nested (more than ${maxDepth} levels of parentheses)`, depth.char);
  }
  let root: RawNode;
  try {
    root = mathjs.parse(text) as unknown as RawNode;
  } catch (err) {
    if (err instanceof RangeError) return fail("expression too deeply nested");
    const raw = err instanceof Error ? err.message : String(err);
    const char = typeof (err as { char?: unknown }).char === "number" ? (err as { char: number }).char : undefined;
    return fail(raw.replace(/\s*\(char \d+\)\s*$/, ""), char);
  }
  const tokens = tokenize(text);
  const state: WalkState = {
    text,
    tokens,
    literals: tokens.filter((t) => t.kind === "num"),
    nextLiteral: 0,
    symbols: options.symbols,
    helpers: options.helpers ?? new Map(),
  };
  try {
    const expr = walk(root, state);
    const treeDepth = exprDepth(expr);
    if (treeDepth > MAX_EXPRESSION_TREE_DEPTH) {
      return fail(`too deeply nested (the expression tree is ${treeDepth} levels deep${options.helpers?.size ? " with helpers written out" : ""}; at most ${MAX_EXPRESSION_TREE_DEPTH})`);
    }
    return { ok: true, expr };
  } catch (err) {
    if (err instanceof ExprParseError) return fail(err.message, err.char);
    if (err instanceof RangeError) return fail("expression too deeply nested");
    throw err;
  }
}
