/**
 * The parts of jstat 1.9.6 that lib/stats uses. The package ships no types;
 * `module.exports` is the jStat object itself.
 */
declare module 'jstat' {
  interface JStatDistribution2 {
    cdf(x: number, a: number, b: number): number;
    inv(p: number, a: number, b: number): number;
  }
  interface JStatDistribution1 {
    cdf(x: number, a: number): number;
    inv(p: number, a: number): number;
  }
  interface JStatStatic {
    /** Studentized range: cdf(q, numberOfMeans, dfError), inv(p, numberOfMeans, dfError). */
    tukey: JStatDistribution2;
    /** F distribution: cdf(x, df1, df2). */
    centralF: JStatDistribution2;
    /** Chi-square: cdf(x, df). */
    chisquare: JStatDistribution1;
    /** Student t: cdf(x, df). */
    studentt: JStatDistribution1;
    /** Normal: cdf(x, mean, sd), inv(p, mean, sd). */
    normal: {
      cdf(x: number, mean: number, sd: number): number;
      inv(p: number, mean: number, sd: number): number;
    };
    /** log Γ(x) (Lanczos), as the studentized range cdf uses it. */
    gammaln(x: number): number;
  }
  const jStat: JStatStatic;
  export default jStat;
}
