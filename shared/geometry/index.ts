/** Planar geometry in millimetres: small pure functions used by the takeoff and the editor. */
export * from './vector';
export * from './polygon';
export * from './segment';
export * from './transform';
export * from './boolean';
export * from './offset';
export * from './bands';
export * from './clip-convex';
