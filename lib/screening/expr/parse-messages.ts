/** Physicist-readable messages for what parseExpression rejects (tables only). */

/** Advice for functions people commonly write that are not offered. */
export const FUNCTION_ADVICE: ReadonlyMap<string, string> = new Map([
  ["sec", "did you mean 1/cos(…)?"],
  ["csc", "did you mean 1/sin(…)?"],
  ["cosec", "did you mean 1/sin(…)?"],
  ["cot", "did you mean 1/tan(…)?"],
  ["ln", "did you mean log? (log is the natural logarithm)"],
  ["log10", "write log(…)/log(10)"],
  ["log2", "write log(…)/log(2)"],
  ["log1p", "write log(1 + …)"],
  ["exp2", "write 2^(…)"],
  ["expm1", "write exp(…) - 1"],
  ["pow", "write a^b"],
  ["square", "write (…)^2"],
  ["cube", "write (…)^3"],
  ["cbrt", "write (…)^(1/3)"],
  ["nthRoot", "write (…)^(1/n)"],
  ["sign", "write (…)/abs(…)"],
  ["sgn", "write (…)/abs(…)"],
  ["fabs", "did you mean abs?"],
  ["Sin", "function names are lower case: sin"],
  ["Cos", "function names are lower case: cos"],
  ["Exp", "function names are lower case: exp"],
  ["Log", "function names are lower case: log"],
]);
export const INVERSE_FUNCTIONS: ReadonlySet<string> = new Set([
  "asin", "acos", "atan", "atan2", "arcsin", "arccos", "arctan", "asinh", "acosh", "atanh",
  "arcsinh", "arccosh", "arctanh", "arsinh", "arcosh", "artanh", "asec", "acsc", "acot",
  "asech", "acsch", "acoth",
]);
export const NON_SMOOTH: ReadonlySet<string> = new Set(["min", "max", "floor", "ceil", "round", "fix", "mod", "heaviside", "step"]);

export const OPERATOR_ADVICE: ReadonlyMap<string, string> = new Map([
  ["mod", "'mod' and '%' are not allowed (use + - * / ^)"],
  ["factorial", "'!' (factorial) is not supported"],
  ["ctranspose", "the quote ' is not allowed here (a coefficient is a plain function of t)"],
  ["transpose", "the quote ' is not allowed here (a coefficient is a plain function of t)"],
  ["to", "unit conversion ('to', 'in') is not allowed: coefficients are plain numbers"],
  ["and", "logical operators (and, or, xor, not) are not allowed"],
  ["or", "logical operators (and, or, xor, not) are not allowed"],
  ["xor", "logical operators (and, or, xor, not) are not allowed"],
  ["not", "logical operators (and, or, xor, not) are not allowed"],
  ["dotMultiply", "element-wise '.*' is not allowed: write '*'"],
  ["dotDivide", "element-wise './' is not allowed: write '/'"],
  ["dotPow", "element-wise '.^' is not allowed: write '^'"],
]);
export const COMPARISONS: ReadonlySet<string> = new Set(["equal", "unequal", "smaller", "larger", "smallerEq", "largerEq"]);
export const BITWISE: ReadonlySet<string> = new Set(["bitAnd", "bitOr", "bitXor", "bitNot", "leftShift", "rightArithShift", "rightLogShift"]);

export const NODE_ADVICE: ReadonlyMap<string, string> = new Map([
  ["AssignmentNode", "assignments ('=') are not allowed: write only the expression"],
  ["FunctionAssignmentNode", "function definitions are not allowed in an expression"],
  ["AccessorNode", "property access (a.b) and indexing (a[1]) are not allowed"],
  ["IndexNode", "property access (a.b) and indexing (a[1]) are not allowed"],
  ["ArrayNode", "lists and matrices ([…]) are not allowed"],
  ["ObjectNode", "objects ({…}) are not allowed"],
  ["RangeNode", "ranges (a:b) are not allowed"],
  ["ConditionalNode", "conditionals (a ? b : c) are not allowed"],
  ["BlockNode", "write a single expression (no ';' or line breaks)"],
  ["RelationalNode", "comparisons ('==', '<', …) are not allowed"],
]);
export const NODE_MARK: ReadonlyMap<string, string> = new Map([
  ["AssignmentNode", "="],
  ["FunctionAssignmentNode", "="],
  ["ArrayNode", "["],
  ["ObjectNode", "{"],
  ["RangeNode", ":"],
  ["ConditionalNode", "?"],
  ["BlockNode", ";"],
]);
