/**
 * lib/stats: pure statistics for comparing formula variants. No framework imports;
 * every function returns plain objects and never NaN (undefined values are null,
 * with a `message` or `warnings` saying why).
 */
export * from './numeric';
export * from './least-squares';
export * from './descriptive';
export * from './anova';
export * from './multiple-comparisons';
export * from './friedman';
export * from './discrimination';
export * from './penalty';
export * from './factor-effects';
export * from './correlation';
export * from './run-rules';
