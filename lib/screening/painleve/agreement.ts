/**
 * Agreement of the two stages (../shared/math/README.md: for the product classes the nontrivial
 * compatibility condition and the reducibility residual have the same zero set, so
 * reducible ⟺ the Painlevé test passes).
 */
import type { PainleveVerdict } from "./types";

export type ReducibilityVerdict = "reducible" | "not-reducible" | "undecided";
export type Agreement = "agree" | "conflict" | "inconclusive";

/** conflict = reducible & fails, or not-reducible & passes; agree = the matching pairs. */
export function agreement(reducibility: ReducibilityVerdict, painleve: PainleveVerdict): Agreement {
  if ((reducibility === "reducible" && painleve === "fails") || (reducibility === "not-reducible" && painleve === "passes")) {
    return "conflict";
  }
  if ((reducibility === "reducible" && painleve === "passes") || (reducibility === "not-reducible" && painleve === "fails")) {
    return "agree";
  }
  return "inconclusive";
}
