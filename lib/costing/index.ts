/** Costing: pure (no framework imports). Pages, the API, the seed, the bench and the tests share it. */
export * from './types';
export * from './money';
export * from './price-history';
export * from './cost';
export * from './formula';
