/** Physics library for fropa: constants, thermodynamics, pressure, wind, Sun, geodesy. Pure functions. */
export * from './constants.js';
export * from './vapor.js';
export * from './dewpoint.js';
export * from './humidity.js';
export * from './theta.js';
export * from './wetbulb.js';
export * from './pressure.js';
export * from './wind.js';
export * from './sun.js';
export * from './geo.js';
