/**
 * Verification scores for the benchmarks: the functions live in src/verify/ (shared with `fropa verify`);
 * this module re-exports them for the bench scripts and tests that import from here.
 */
export * from '../src/verify/contingency.js';
export { quantile } from '../src/verify/quantile.js';
