export * from './money';
export * from './tax';
export * from './totals';
export * from './build-lines';
export * from './cautions';
export * from './extras';
export * from './from-takeoff';
