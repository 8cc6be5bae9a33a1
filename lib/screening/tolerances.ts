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
/**
 * Deepest expression tree (operators and calls on the longest path, helpers inlined). Parentheses
 * alone do not bound it: `t^t^…^t` or a long sum nests without any. 500 leaves room for the
 * deepest parenthesised input (about two nodes per level). Common practice, not a measured limit.
 */
export const MAX_EXPRESSION_TREE_DEPTH = 500;

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
 * A value no larger than this many times its running rounding-error bound is rounding noise, not
 * a residual (running error analysis: N. J. Higham, "Accuracy and Stability of Numerical
 * Algorithms", 2nd ed. 2002, §3.3; the bound is first-order, hence the margin of 4). Catches
 * coefficients that cancel internally, e.g. cosh²−sinh²−1 (ENGINE-NOTES §4, cases A5/A6).
 */
export const ERROR_BOUND_FACTOR = 4;
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
/**
 * …and below this absolute size (per unit relative change of the parameters, scaled by sqrt of
 * the number of points) a direction does not move rho_inv at all: the weighted residual is a
 * rho-like O(1) quantity, so 1e-8 is 10× below the not-reducible threshold (design choice).
 */
export const FREE_SOLVE_RANK_ABSOLUTE = 1e-8;
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
/** A map state above this stops the table (guards the poles of nls.md §7; engine choice — residuals stayed ~1e-16 with γ ~ 1e12 in case (e3) on [0, 20]). */
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

// ── Painlevé stage (lib/screening/painleve) ────────────────────────────────────────────────
/** Leading-order consistency of the second equation of a system: ratio above → fails (../shared/math/painleve.md §6 Step 3, §7: CGL control fails far above). */
export const LEADING_CONSISTENCY = 1e-8;
/** τ^0 coefficients of the leading-order polynomial below this × their term scale are zero (painleve.md §6 Step 3.3). */
export const LEADING_COEFFICIENT_ZERO = 1e-12;
/** Leading roots with |z| ≤ this × max(1, max|roots|) are dropped, not branches (painleve.md §6 Step 3.5). */
export const LEADING_ROOT_ZERO = 1e-8;
/** A resonance root farther than this × max(1, max|root|) from an integer is non-integer (painleve.md §6 Step 4, §7). */
export const RESONANCE_INTEGRALITY = 1e-6;
/** A top coefficient of the interpolated det M(j) below this × its largest coefficient is interpolation noise (design choice; det samples are O(1) sums, so noise is ~1e-15). */
export const RESONANCE_LEADING_ZERO = 1e-12;
/** Closed-form oracle: |C_rep - C_pred| above this × scale_0 is an engine error (painleve.md §6 Step 7, §7: observed ≤ 3e-15). */
export const PAINLEVE_ORACLE_AGREEMENT = 1e-9;
/** Taylor orders 0..2 enter rho_P (painleve.md §6 Step 6, §7). */
export const PAINLEVE_TAYLOR_ORDERS = 3;
/** Sample points of the jet test (painleve.md §6 Step 1). */
export const PAINLEVE_SAMPLE_POINTS = 3;
/** Redraws per sample point on a non-finite coefficient or a zero pivot (painleve.md §6 Step 1). */
export const PAINLEVE_REDRAWS = 20;
/** Largest jet length N when doubling for valid < 3 (painleve.md §6 Step 6; design cap: 4× the class defaults). */
export const PAINLEVE_MAX_JET_LENGTH = 36;
/** Significant digits of the extended-precision jet recheck (painleve.md §7: 34–40 digits; 40 = the first confirmation precision of CONFIRM_DIGITS). */
export const PAINLEVE_RECHECK_DIGITS = 40;

// ── Design mode (lib/screening/design) ─────────────────────────────────────────────────────
/** A rewritten tree is the same function when it agrees to this relative size at 14 check points (double rounding of trees of a few hundred nodes is ≲ 1e-13; design choice with a 10^4 margin). */
export const DESIGN_SAME_FUNCTION = 1e-9;
/** odex relative (and absolute) tolerance of a tabulated design (../shared/math/nls.md §5 asks ≤ 1e-10 for map ODEs). */
export const DESIGN_REL_TOL = 1e-10;
/** The accuracy of a tabulated design is measured against a second run this many times tighter (issue text: "a second run at 100× tighter tolerance"). */
export const DESIGN_ACCURACY_RATIO = 100;
/** Cells of the output grid of a tabulated design and of the plotted curves (design choice: 200 cells resolve the window for a chart). */
export const DESIGN_GRID_CELLS = 200;
/** A designed coefficient whose linearised solution m changes sign has a pole there; the zero is located to this fraction of the window (≈ double resolution × 10^3). */
export const DESIGN_POLE_LOCATION = 1e-12;
/** Two characteristic roots whose discriminant is below this relative size are a double root (exact decimal input makes a true double root exactly 0; design choice). */
export const DESIGN_DOUBLE_ROOT = 1e-14;

/** Split-step step refinement: factor and how often (verify.ts; common practice: refine until the error falls below the tolerance). */
export const SPLIT_STEP_REFINE = 4;
export const SPLIT_STEP_MAX_REFINEMENTS = 1;
