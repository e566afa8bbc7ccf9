/**
 * Every numerical tolerance and limit the engine uses, named, in one place.
 * Each area of the engine owns one section; solvers read their defaults from
 * here through their own `resolve…Options` function.
 */

// ── Special functions (complex-degree Legendre, digamma) ─────────────────────

// ── Kernel tables and interpolation ──────────────────────────────────────────

// ── Inverse problem (Levenberg–Marquardt, multi-start, minima) ───────────────

// ── Signal processing and mode fits ──────────────────────────────────────────
