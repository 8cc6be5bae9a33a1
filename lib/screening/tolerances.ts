/**
 * Every numerical threshold of the engine, with where it comes from.
 * Stages import from here; no stage hard-codes a tolerance.
 */

/** Invariant statistic rho_inv: at or below → reducible (../shared/math/README.md, "Verdict vocabulary"). */
export const RHO_INV_PASS = 1e-12;
/** Invariant statistic rho_inv: at or above → not-reducible (../shared/math/README.md). */
export const RHO_INV_FAIL = 1e-9;

/** Painlevé jet statistic rho_P: below → pass (../shared/math/painleve.md §6 Step 6). */
export const RHO_P_PASS = 1e-10;
/** Painlevé jet statistic rho_P: above → fail (../shared/math/painleve.md §6 Step 6). */
export const RHO_P_FAIL = 1e-7;

/** Input limits for one expression (../shared/ENGINE-NOTES.md: mathjs overflows its stack near 1000 nested parentheses). */
export const MAX_EXPRESSION_LENGTH = 2000;
export const MAX_EXPRESSION_DEPTH = 200;

// ---- Reducibility stage and the high-precision zero test (lib/screening/zero, reducibility) ----

/** Unit roundoff of IEEE double used to scale thresholds to other precisions (../shared/math/painleve.md §7). */
export const UNIT_ROUNDOFF_DOUBLE = 1.1e-16;
/** Precisions of the confirmation pass, in significant digits (issue: decimalField(40) and (80); ENGINE-NOTES §4 harness). */
export const CONFIRM_DIGITS: readonly [number, number] = [40, 80];
/** Sample points per (sub-)window and Taylor orders 0..2 (../shared/math/README.md "Verdict vocabulary"). */
export const INVARIANT_SAMPLE_POINTS = 3;
export const INVARIANT_TAYLOR_ORDERS = 3;
/** A nonzero value is genuine when its 40- and 80-digit values agree to this relative size (ENGINE-NOTES §4: "agree to 15 digits"). */
export const CONFIRM_AGREEMENT = 1e-15;
/**
 * A value that shrinks by at least this factor from 40 to 80 digits is rounding noise, not a
 * residual (design rule: noise scales with the unit roundoff, 10^-40 here; a true value does not
 * change). Catches coefficients that cancel internally, e.g. cosh²−sinh²−1 (ENGINE-NOTES §4, A5/A6).
 */
export const CONFIRM_NOISE_SHRINK = 1e-30;
/** Redraws allowed per sample point that hits a singular value (painleve.md §9: redraw before escalating). */
export const SAMPLE_REDRAWS = 4;
/** Sample points are drawn from the inner part of a window, away from its ends (painleve.md §9: points near a singularity inflate rounding). */
export const SAMPLE_MARGIN = 0.05;

/** Grid for the coefficient scan (zeros of a, h / p, q; poles; non-finite values). Design choice: 256 cells. */
export const SCAN_GRID_CELLS = 256;
/** Bisection stops when the bracket is below this fraction of the window (≈ double resolution). */
export const SCAN_BISECT_RELATIVE = 1e-13;
/** A touching zero (no sign change) counts when min|f| falls below this fraction of max|f| on the grid. Design choice. */
export const SCAN_TOUCH_ZERO = 1e-9;
/** Sub-windows shorter than this fraction of the window are not screened. Design choice. */
export const SCAN_MIN_SUBWINDOW = 1e-6;

/** Free-parameter solve: random points, Levenberg–Marquardt starts and iterations (ENGINE-NOTES §6: ~20 points). */
export const FREE_SOLVE_POINTS = 20;
export const FREE_SOLVE_STARTS = 8;
export const FREE_SOLVE_MAX_ITERATIONS = 200;
/** A least-squares minimum counts as a solution when max weighted residual (≈ rho_inv) is below this (design: 100× above the reducible threshold's double noise). */
export const FREE_SOLVE_ACCEPT = 1e-10;
/** Singular values below this fraction of the largest mark a rank-deficient Jacobian (design choice, ≈ sqrt of double precision squared margin). */
export const FREE_SOLVE_RANK = 1e-7;
/** Two solutions closer than this (relative) are the same (design choice). */
export const FREE_SOLVE_DEDUPE = 1e-6;
/** Digits used to refine a solution before confirming it at 40/80 digits (must exceed the highest confirmation precision). */
export const FREE_REFINE_DIGITS = 100;

/** Time limit for one symbolic (algebrite) call through the injectable hook (ENGINE-NOTES §2: hangs are unbounded). */
export const SYMBOLIC_TIMEOUT_MS = 3000;

// ── transform / solutions / verify (numeric stages) ─────────────────────────────────────────
/** odex relative tolerance for the map ODEs (../shared/math/nls.md §5 asks ≤ 1e-10; ENGINE-NOTES §7: ~1e-11 reached at 1e-12). */
export const ODE_REL_TOL = 1e-12;
/** odex absolute tolerance (ENGINE-NOTES §7 measured rtol = atol = 1e-13 → 6e-13 error). */
export const ODE_ABS_TOL = 1e-13;
/** Steps allowed between two output nodes (odex default 10000; ENGINE-NOTES §7 needed < 5000 over 50 time units). */
export const ODE_MAX_STEPS_PER_SEGMENT = 20000;
/** A map state above this is treated as blow-up (guards the poles of nls.md §7; engine choice). */
export const ODE_BLOW_UP_LIMIT = 1e12;
/** A local maximum of |f| that grows by this factor over its grid neighbours under refinement is a pole. Design choice (a pole at grid spacing 4e-3 grows by > 1e15). */
export const SCAN_POLE_GROWTH = 1e8;
/** A map window ends this fraction of the requested window before a singular time (nls.md §7: β ~ 1/(t − t*); engine choice, keeps |β| ≲ 50/(window·|μ'|)). */
export const SINGULAR_MARGIN_FRACTION = 0.02;
/** Closed-form map formula accepted when it matches the integrated table to this relative accuracy (ODE tolerance ~1e-11 plus rounding; engine choice). */
export const CLOSED_FORM_TABLE_AGREEMENT = 1e-8;
/** Mapped-back solution residual in the original equation, relative to Σ|terms| (issue text: ≤ 1e-8; nls.md §12 measured ≤ 1e-8 with FD, jets are far tighter). */
export const SOLUTION_RESIDUAL_MAX = 1e-8;
/** Canonical solution residual in the canonical equation via jets (issue text: 1e-12). */
export const CANONICAL_RESIDUAL_MAX = 1e-12;
/** Split-step Fourier vs mapped-back solution, max relative error over check times (issue text: ≤ 1e-4). */
export const SPLIT_STEP_MAX_REL_ERROR = 1e-4;
