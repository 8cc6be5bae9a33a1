/** Turns a quantity into a MapFormula, checked against the integrated table. */
import { compileExpression, freeSymbols } from "../../expr";
import { CLOSED_FORM_TABLE_AGREEMENT } from "../../tolerances";
import { maxRelDiff, fmt } from "../common";
import type { MapFormula, MapTable } from "../types";
import type { PlaceholderBook, Quantity } from "./quantity";

export function finishFormula(name: string, latexName: string, q: Quantity, book: PlaceholderBook, table: MapTable, definition: string): MapFormula {
  const latex = `${latexName}(t) = ${book.latex(q.expr)}`;
  const symbols = [...freeSymbols(q.expr)];
  if (!q.closed || symbols.some((s) => s !== "t")) return { name, latex, closedForm: false };
  const f = compileExpression(q.expr, ["t"]);
  const values = table.t.map((t) => f(t));
  // absolute floor 1e-6: a function that is 0 up to rounding (|table| ~ 1e-17) compares absolutely
  const diff = maxRelDiff(values, table.values[name], 1e-6);
  if (!(diff <= CLOSED_FORM_TABLE_AGREEMENT)) {
    return {
      name, latex: `${latexName}(t) = ${definition}`, closedForm: false, maxRelDiffToTable: diff,
      note: `a closed form was derived but differs from the integrated table by ${fmt(diff)} (relative); the definition is shown and the table is authoritative`,
    };
  }
  return { name, latex, closedForm: true, maxRelDiffToTable: diff };
}
