/**
 * Every numerical tolerance and limit the engine uses, named, in one place.
 * Each area of the engine owns one section; solvers read their defaults from
 * here through their own `resolve…Options` function.
 */

// ── Special functions (complex-degree Legendre, digamma) ─────────────────────

// ── Kernel tables and interpolation ──────────────────────────────────────────

// ── Inverse problem (Levenberg–Marquardt, multi-start, minima) ───────────────

/** LM stops when an accepted step lowers chi-square by less than this fraction (and predicts no more). */
export const LM_MISFIT_REL_TOL = 1e-12;
/** LM stops when the scaled step is below this fraction of the scaled parameter vector. */
export const LM_STEP_REL_TOL = 1e-10;
/** LM stops when every |cosine| between the residual vector and a Jacobian column is below this (MINPACK gtol). */
export const LM_GRADIENT_TOL = 1e-10;
/** Default iteration and residual-evaluation limits of one LM run. */
export const LM_MAX_ITERATIONS = 300;
export const LM_MAX_EVALUATIONS = 2000;
/** Starting damping, relative to the largest diagonal element of J^T J; and its hard limits. */
export const LM_INITIAL_DAMPING = 1e-3;
export const LM_DAMPING_MIN = 1e-15;
export const LM_DAMPING_MAX = 1e16;
/** Eigenvalues of the scaled J^T J below this fraction of the largest count as unresolved (singular covariance). */
export const COVARIANCE_RCOND = 1e-10;
/** Two converged starts belong to one minimum when every parameter differs by less than this fraction of its range… */
export const MINIMA_PARAM_TOL = 0.01;
/** …and their chi-square values differ by less than this fraction (plus MINIMA_MISFIT_ABS). */
export const MINIMA_MISFIT_REL_TOL = 1e-3;
export const MINIMA_MISFIT_ABS_TOL = 1e-6;
/** Parameter scale used for the minima distance when a bound is infinite. */
export const MINIMA_UNBOUNDED_SCALE = 1;

// ── Signal processing and mode fits ──────────────────────────────────────────
