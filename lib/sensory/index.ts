/** Sensory-design module: blinding codes, serving orders, scales and the attribute library. */
export * from './random';
export * from './blinding-codes';
export * from './williams';
export * from './triangle';
export * from './scales';
export * from './attribute-library';
