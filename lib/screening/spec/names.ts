/** Rules for the names a family declares: parameters, helper functions, variables, the class. */
import type { EquationClass } from "./types";
import { BUILTIN_FUNCTIONS } from "./expressions";
import { closest } from "./suggest";
import { MAX_NAME_LENGTH } from "./limits";

export const SLUG = /^[a-z0-9][a-z0-9-]{0,63}$/;
export const CLASSES: readonly EquationClass[] = ["nls", "kdv", "mkdv"];
/** Coefficients a family must give (README preconditions: a h ≠ 0, p q ≠ 0). */
export const REQUIRED_COEFFICIENTS: Readonly<Record<EquationClass, readonly string[]>> = {
  nls: ["a", "h"],
  kdv: ["p", "q"],
  mkdv: ["p", "q"],
};

const IDENT = /^[A-Za-z][A-Za-z0-9_]*$/;
const VARIABLE = /^[A-Za-z][A-Za-z0-9]*$/;
/** Names with a fixed meaning in every expression. */
const CONSTANTS = new Set(["pi", "e", "i"]);

/** Why `name` cannot be a parameter or helper name, or null if it can. */
export function nameProblem(name: string): string | null {
  if (!IDENT.test(name)) return "names start with a letter and contain only letters, digits and '_'";
  if (name.length > MAX_NAME_LENGTH) return `names have at most ${MAX_NAME_LENGTH} characters`;
  if (name === "t" || name === "x") return `'${name}' is reserved for the engine's variables; choose another name`;
  if (CONSTANTS.has(name)) return `'${name}' is a constant (pi, e) or the imaginary unit (i); choose another name`;
  if (BUILTIN_FUNCTIONS.has(name)) return `'${name}' is a built-in function; choose another name`;
  if (name === "free") return "'free' is a keyword; choose another name";
  return null;
}

/** Why `name` cannot be a variable name, or null. */
export function variableProblem(name: string): string | null {
  if (!VARIABLE.test(name)) return "variable names start with a letter and contain only letters and digits";
  if (name.length > MAX_NAME_LENGTH) return `names have at most ${MAX_NAME_LENGTH} characters`;
  if (CONSTANTS.has(name)) return `'${name}' is a constant (pi, e) or the imaginary unit (i)`;
  if (BUILTIN_FUNCTIONS.has(name)) return `'${name}' is a built-in function`;
  return null;
}

const CLASS_ALIASES: ReadonlyArray<[string, EquationClass]> = [
  ["nls", "nls"], ["vcnls", "nls"], ["schrodinger", "nls"], ["schroedinger", "nls"],
  ["nonlinearschrodinger", "nls"], ["nonlinearschroedinger", "nls"], ["grosspitaevskii", "nls"], ["gp", "nls"], ["gpe", "nls"],
  ["kdv", "kdv"], ["vckdv", "kdv"], ["kortewegdevries", "kdv"],
  ["mkdv", "mkdv"], ["vcmkdv", "mkdv"], ["modifiedkdv", "mkdv"], ["modifiedkortewegdevries", "mkdv"],
];

/** The class a misspelt or long-form class name most likely means. */
export function suggestClass(text: string): EquationClass | null {
  const key = text.normalize("NFD").replace(/[\u0300-\u036f]/g, "").toLowerCase().replace(/[^a-z]/g, "");
  if (key === "") return null;
  for (const [alias, cls] of CLASS_ALIASES) if (alias === key) return cls;
  const near = closest(key, CLASS_ALIASES.map(([a]) => a));
  return near === null ? null : (CLASS_ALIASES.find(([a]) => a === near)?.[1] ?? null);
}

/** A slug close to what the user wrote, for the message. */
export function slugify(text: string): string {
  const s = text
    .normalize("NFD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 64);
  return s === "" ? "family-1" : s;
}
