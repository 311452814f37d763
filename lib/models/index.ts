/**
 * lib/models: response-surface models from the workspace's own trials. PURE: no framework imports.
 * terms.ts (coding and model terms) · regression.ts (least squares, diagnostics, predictions) ·
 * surface.ts (a fitted model over named factors, its region, the stationary point) ·
 * hull.ts (convex-hull membership) · linear-algebra.ts (symmetric eigenvalues) ·
 * desirability.ts (Derringer–Suich) · optimise.ts (proposals inside the data's region) · designs.ts.
 * Fits and predictions return plain objects; undefined values are null, with warnings saying why.
 */
export * from './terms';
export * from './regression';
export * from './curvature';
export * from './linear-algebra';
export * from './surface';
export * from './desirability';
export * from './optimise';
export * from './designs';
export * from './hull';
