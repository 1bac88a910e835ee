/** The normal distribution lives in engine/distributions; this path stays for callers outside the engine. */
export { normalCdf, normalDensity, normalQuantile } from '../distributions/normal.js';
