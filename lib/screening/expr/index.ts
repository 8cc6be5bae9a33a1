/**
 * Expression layer: the only entry point of lib/screening/expr.
 *
 * Syntax
 *   parseExpression(text, { symbols, helpers?, maxLength?, maxDepth? })  → { ok, expr } | { ok: false, error }
 *   evalJet(expr, env, order, field)        Taylor coefficients c_k = f^(k)(t_s)/k!, k = 0..order
 *   evalJetDouble(expr, env, order), evalJetAt(expr, "t", ts, params, order, field)
 *   evalNumber(expr, values), compileExpression(expr, variables)(...values)
 *   DoubleField, decimalField(digits)       number systems for jets
 *   variableJet, constantJet, jetAdd, jetSub, jetMul, jetDiv, jetScale, jetNeg, jetDerivative,
 *   jetExp, jetLog, jetSin, jetCos, jetSinCos, jetSinh, jetCosh, jetSinhCosh, jetTan, jetTanh,
 *   jetSech, jetCsch, jetCoth, jetPow, jetPowConst, jetPowInt, jetSqrt, jetAbs, jetReciprocal
 *   JetEvaluationError                      thrown where a jet cannot be formed (redraw the point)
 *   toLatex, exprToString, substitute, freeSymbols, differentiate, simplifyConstants, exprDepth,
 *   exprEquals, num, sym, add, sub, mul, div, pow, neg, call
 *
 * Examples
 *   const r = parseExpression("a0*exp(g0*t)", { symbols: new Set(["t", "a0", "g0"]) });
 *   if (r.ok) {
 *     const F = DoubleField;
 *     const jet = evalJet(r.expr, { t: variableJet(0.5, 2, F), a0: constantJet(2, 2, F),
 *                                   g0: constantJet(0.3, 2, F) }, 2, F);
 *     // jet = [a(0.5), a'(0.5), a''(0.5)/2]
 *     toLatex(r.expr);        // "a_{0} e^{g_{0} t}"
 *     exprToString(differentiate(r.expr, "t"));   // "a0 * (exp(g0 * t) * g0)"
 *   }
 *
 * See also
 *   ../shared/math/painleve.md §5 (jets), ../shared/ENGINE-NOTES.md §3 and Appendices B–C.
 */
export type {
  Expr,
  ExprError,
  Field,
  Jet,
  ParseOptions,
  ParseResult,
  UnaryFunction,
  BinaryOperator,
} from "./types";
export { parseExpression, ALLOWED_FUNCTIONS } from "./parse";
export { DoubleField, decimalField } from "./fields";
export {
  JetEvaluationError,
  type JetFailure,
  variableJet,
  constantJet,
  isConstantJet,
  jetAdd,
  jetSub,
  jetNeg,
  jetMul,
  jetDiv,
  jetScale,
  jetReciprocal,
  jetDerivative,
  jetDerivativeValue,
  jetExp,
  jetLog,
  jetSin,
  jetCos,
  jetSinCos,
  jetSinh,
  jetCosh,
  jetSinhCosh,
  jetTan,
  jetTanh,
  jetSech,
  jetCsch,
  jetCoth,
  jetPow,
  jetPowConst,
  jetPowInt,
  jetSqrt,
  jetAbs,
} from "./jets";
export { evalJet, evalJetDouble, evalJetAt, evalNumber } from "./evaluate";
export { compileExpression, compileExpressionClosure } from "./compile";
export {
  num,
  sym,
  add,
  sub,
  mul,
  div,
  pow,
  neg,
  call,
  piNum,
  eNum,
  isBinary,
  exprEquals,
  substitute,
  freeSymbols,
  exprDepth,
} from "./tree";
export { exprToString } from "./to-string";
export { simplifyConstants } from "./simplify";
export { differentiate } from "./differentiate";
export { toLatex } from "./latex";
export { PI_TEXT, E_TEXT } from "./constants";
