/**
 * Literal text of the constants a user may write (`pi`, `e`), 62 significant digits, so that a
 * decimal field of up to ~60 digits reads them correctly. Checked against mpmath 1.2.1
 * (`mp.dps = 62; mp.pi, mp.e`) and decimal.js `acos(-1)`, `exp(1)` at 62 digits.
 */
export const PI_TEXT = "3.1415926535897932384626433832795028841971693993751058209749446";
export const E_TEXT = "2.7182818284590452353602874713526624977572470936999595749669676";
