/** Signal-processing layer: resampling, noise level, change points (PELT, local steps), diurnal cycle. */
export * from './noise.js';
export * from './median.js';
export * from './resample.js';
export * from './pelt.js';
export * from './stepfit.js';
export * from './diurnal.js';
