/**
 * Every numerical tolerance and limit the engine uses, named, in one place.
 * Each area of the engine owns one section; solvers read their defaults from
 * here through their own `resolve…Options` function.
 */

// ── Special functions (complex-degree Legendre, digamma) ─────────────────────

/** Digamma: shift Re z up to this before the asymptotic series (7 Bernoulli terms give ~1e-16). */
export const DIGAMMA_ASYMPTOTIC_MIN = 12;
/** Trigamma: shift x up to this before the asymptotic series (7 Bernoulli terms give ~1e-16). */
export const TRIGAMMA_ASYMPTOTIC_MIN = 12;
/** Legendre series: stop when the next term is below this fraction of the running sum. */
export const LEGENDRE_SERIES_REL_TOL = 1e-17;
/** Legendre series: hard cap on the number of terms (never reached for |nu| < 100 and z or w <= 1/2). */
export const LEGENDRE_MAX_TERMS = 4000;

// ── Kernel tables and interpolation ──────────────────────────────────────────

/** Kernel tables: theta grid step, degrees (quintic Hermite in log power; see kernel-table.ts). */
export const KERNEL_GRID_STEP_DEG = 0.1;
/** Kernel tables: smallest tabulated distance, degrees; closer sources are clamped to it. */
export const KERNEL_MIN_THETA_DEG = 0.1;
/** Kernel tables: promised relative accuracy of interpolated power vs direct evaluation for theta >= 0.5 deg. */
export const KERNEL_INTERP_REL_TOL = 1e-4;
/** Kernel tables: smallest distance (degrees) at which the accuracy above is promised. */
export const KERNEL_ACCURATE_FROM_DEG = 0.5;
/** Kernel tables: how many (cavity, band) tables the in-process cache keeps. */
export const KERNEL_CACHE_SIZE = 6;
/** Kernel tables: memory budget of the cache, bytes (a 141-bin band on the 0.1 deg grid takes about 12 MB). */
export const KERNEL_CACHE_BYTES = 256e6;

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
/** Looser LM stopping for spectrum inversions: a chi-square change of 1e-9 relative is far below one unit of chi-square. */
export const INVERSION_LM_MISFIT_TOL = 1e-9;
export const INVERSION_LM_STEP_TOL = 1e-8;
/** Step (degrees) of the central difference for the derivative of the misfit with respect to a region's spread. */
export const SPREAD_DIFF_STEP_DEG = 1e-4;
/**
 * Mode misfit (predicted-modes.ts): Newton steps (full Hessian) after each pass of the mode fit of a predicted
 * spectrum, which stops at the pipeline's own tolerances; quadratic convergence then takes the fitted modes to full
 * precision, so that they follow the source parameters smoothly (central differences agree).
 */
export const PREDICTED_MODE_NEWTON_STEPS = 4;
/** Mode misfit: the predicted peak (amplitude plus background) is floored smoothly (C1) at this fraction of the median fitted power, so ln(peak) stays finite where the predicted spectrum shows no peak. */
export const PREDICTED_PEAK_FLOOR = 1e-3;
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
/** Welch segment length in seconds (10–20 s is common practice for Schumann-resonance spectra). */
export const SIGNAL_SEGMENT_SECONDS = 10;
/** Length of one processing interval in seconds (10 minutes, common practice). */
export const SIGNAL_INTERVAL_SECONDS = 600;
/** Band (Hz) of the spectrum kept for each interval by default (covers the first seven modes). */
export const SPECTRUM_BAND_MIN_HZ = 3;
export const SPECTRUM_BAND_MAX_HZ = 48;
/** Default number of modes fitted per interval. */
export const DEFAULT_MODE_COUNT = 5;
/** Transient screen: a segment is rejected when ln(variance) exceeds the median by this many robust sigmas (1.4826 MAD)… */
export const TRANSIENT_MAD_FACTOR = 5;
/** …and also by at least ln of this ratio, so that very steady records do not lose segments to tiny scatter. */
export const TRANSIENT_MIN_RATIO = 2.5;
/** Half-width (Hz) of the notch around the mains line and each harmonic (covers grid-frequency wander and the Hann main lobe). */
export const MAINS_LINE_HALF_WIDTH_HZ = 0.5;
/** Default half-width (Hz) of the notch around a listed interference line. */
export const INTERFERENCE_LINE_HALF_WIDTH_HZ = 0.3;
/** Slack (Hz) at the ends of a stored excluded range when another fit on the same grid leaves out its bins (grids agree far closer; bins are 0.1 Hz apart). */
export const EXCLUDED_RANGE_SLACK_HZ = 1e-6;
/** Bins on each side of a notch averaged to anchor the interpolation across it. */
export const LINE_ANCHOR_BINS = 3;
/** Flag 'too-much-rejected' when more than this share of an interval's segments was rejected or missing. */
export const REJECTED_SHARE_LIMIT = 0.5;
/** Flag 'clipping' when this share of samples sits at the recorder's full scale (or at the interval's extreme value). */
export const CLIPPING_SHARE_LIMIT = 1e-3;
/** Lowest frequency (Hz) used by a mode fit by default. */
export const MODE_FIT_MIN_HZ = 3;
/** A mode fit's band reaches this far (Hz) past the usual frequency of its highest mode. */
export const MODE_FIT_TOP_MARGIN_HZ = 3.5;
/** A fitted mode may move at most this far (Hz) from its initial guess (bound in the fit). */
export const MODE_FREQUENCY_WINDOW_HZ = 2.5;
/** Bounds on a fitted half-width g_n (Hz). */
export const MODE_HALF_WIDTH_MIN_HZ = 0.2;
export const MODE_HALF_WIDTH_MAX_HZ = 8;
/** 'implausible-modes' when a Q-factor lies outside this range (observed Q are about 3–8, common practice). */
export const MODE_Q_MIN = 1.5;
export const MODE_Q_MAX = 20;
/** 'implausible-modes' when a mode's relative amplitude error exceeds this. */
export const MODE_AMPLITUDE_REL_ERROR_MAX = 1;
/** Mode fits stop when chi2 changes by less than this fraction (far below the data's scatter; looser than the inverter's). */
export const MODE_FIT_MISFIT_REL_TOL = 1e-9;
/** Mode fits stop when the scaled step is below this fraction of the parameters. */
export const MODE_FIT_STEP_REL_TOL = 1e-8;
/** Mode fits: limit on optimiser iterations per pass. */
export const MODE_FIT_MAX_ITERATIONS = 200;
/**
 * Overlap correlation of a Hann window at 50 % overlap, sum w_t w_{t+N/2} / sum w_t^2 = 1/6
 * (Harris 1978, Proc. IEEE 66, 51, Table 1: 16.7 %); the power of two neighbouring segments is
 * correlated by its square, which sets the equivalent number of averages (modes/bin-scatter.ts).
 */
export const HANN_HALF_OVERLAP_CORRELATION = 1 / 6;
/**
 * Correlation of the power in bins k and k+1, k+2 of a Hann-windowed spectrum (smooth spectrum,
 * Gaussian data): |W2(1)/W2(0)|^2 = (2/3)^2 and |W2(2)/W2(0)|^2 = (1/6)^2, W2 being the DFT of
 * w^2 = 3/8 - cos/2 + cos2/8 (the squared correlation of two DFT bins of a tapered series; Percival &
 * Walden 1993, Spectral Analysis for Physical Applications, ch. 6, from memory). Measured on simulated
 * 50 %-overlap Welch spectra of white noise (40 x 119 segments): 0.456 and 0.032.
 */
export const HANN_BIN_POWER_CORRELATION: readonly number[] = [4 / 9, 1 / 36];
/** Samples of the periodic Hann window on which a Welch spectrum's bin correlation is evaluated (stats/welch-bin-correlation.ts; the values change by under 1e-4 from 128 samples up). */
export const WELCH_CORRELATION_WINDOW_SAMPLES = 1024;
/**
 * Clustering multi-start (clustering.ts): starts run in waves of this many (in start order, whatever the thread
 * count); a start of a later wave that comes within CLUSTER_JOIN_DIST of a minimum found by an earlier wave (largest
 * parameter difference as a fraction of its range, as in grouping) after at least CLUSTER_MIN_ITERATIONS iterations
 * is stopped and counted in that minimum.
 */
export const CLUSTER_WAVE = 8;
export const CLUSTER_JOIN_DIST = 0.02;
export const CLUSTER_MIN_ITERATIONS = 2;

// ── Studies (station siting, recovery) ───────────────────────────────────────
/** A fixed coordinate of an unknown and the study's source must agree to this, degrees. */
export const STUDY_PLACE_TOL_DEG = 1e-6;
/** A candidate closer than this (great-circle degrees) to a station stands on that station's own site. */
export const SITING_SAME_SITE_DEG = 0.1;
/** A candidate closer than this to a source is refused: the kernels are not trusted nearer (KERNEL_ACCURATE_FROM_DEG). */
export const SITING_SOURCE_CLEARANCE_DEG = 0.5;
/** Welch noise of a recovery study: the sample rate is at least this multiple of the band's top frequency. */
export const RECOVERY_SAMPLE_RATE_OVER_TOP = 2.5;
