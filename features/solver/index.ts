/**
 * The optics solver: grating monochromator and spectrograph physics as pure functions. No React,
 * no I/O, no side effects at import; the same code runs in the client, the server and the CLI.
 *
 * Conventions (see grating.ts for the full note):
 * - angles from the grating normal, positive on the same side: `mλ = d(sin α + sin β)`;
 * - `K` = deviation / 2, `φ` the grating rotation, `α = φ + K`, `β = φ − K`,
 *   so `mλ = 2d cos K sin φ`;
 * - `d = 1e6 / grooveDensityPerMm` nm, `N = grooveDensityPerMm × ruledWidthMm`;
 * - reciprocal linear dispersion at the exit plane `d cos β / (|m| f_cam)`;
 * - dispersion, bandpass, resolving power and scan sensitivity are magnitudes (the sign of the
 *   order only says which way the grating turns); angles keep their sign;
 * - f-numbers: collimator focal / (ruled width × cos α) and collimator focal / ruled height;
 * - an unreachable wavelength is `reachable: false` with a `reason`, and null (never NaN) for every
 *   figure that needs an angle.
 */

export * from './math';
export * from './grating';
export * from './mount';
export * from './dispersion';
export * from './bandpass';
export * from './resolving-power';
export * from './blaze';
export * from './orders';
export * from './order-sorting';
export * from './scan';
export * from './detector';
export * from './aberrations';
export * from './warnings';
export * from './results';
export * from './evaluate';
export * from './units';
export * from './fabry-perot';
export * from './absorption';
export * from './sellmeier';
export * from './prism';
export * from './selectors';
export * from './trade-study';
export * from './circle-in-rectangle';
export * from './etendue';
export * from './curve-interpolation';
export * from './input-fill';
export * from './throughput';
export * from './light-budget';
export * from './light-budget-warnings';
export * from './air-index';
export * from './polynomial-fit';
export * from './calibration-lines';
