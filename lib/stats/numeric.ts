/**
 * Numerical building blocks for lib/stats: stable sums, special functions and
 * distribution tails.
 *
 * How upper tails are computed (why: `1 − cdf` loses every digit of a small p):
 * - F, t: the regularized incomplete beta I_x(a, b) is evaluated by its continued
 *   fraction (modified Lentz, relative tolerance 1e-15) on whichever side converges;
 *   the tail we need is taken from the complementary form I_{1−x}(b, a) with 1 − x
 *   passed in exactly, so a small upper tail is computed directly, never as 1 − cdf.
 * - chi-square, normal: the regularized upper incomplete gamma Q(a, x) by series or
 *   continued fraction, again directly for the small side.
 * - binomial: the exact sum of probability terms P(X = i) for i ≥ k in log space.
 * - studentized range: jstat's `tukey.cdf` (a port of R's ptukey), recomputed without its per-call
 *   allocations in ./studentized-range.ts, gives only the
 *   lower tail, so the upper tail is 1 − cdf there; its absolute accuracy is about
 *   1e-8, adequate for adjusted p-values reported to 4 decimals. Quantiles are
 *   refined by bisection on that cdf because `tukey.inv` stops at 1e-4.
 * jstat is used for the studentized range and as the starting guess for quantiles.
 *
 * simple-statistics gives the compensated sum (its `sum` is the same Neumaier algorithm) and, in
 * descriptive.ts, medians and quartiles. The mean and the centred sum of squares stay ours: its
 * `mean` is one compensated pass without the residual correction, and its variance squares the
 * deviations in a plain loop with no (Σd)²/n term, so it loses digits on data with a large
 * offset (Montgomery's 160 W group shifted by 1e12: sampleVariance 400.700000003, ours 400.7 as
 * by hand). Its distributions are tables or one-sided approximations, hence jstat and the tails below.
 */
import { studentizedRangeCdfExact } from './studentized-range';
import jStat from 'jstat';
import { sum } from 'simple-statistics';

const RELATIVE_TOLERANCE = 1e-15;
const TINY = 1e-300;

/** Sum with Neumaier compensation, so long lists of mixed magnitudes keep their digits. */
export function compensatedSum(values: readonly number[]): number {
  return sum(values);
}

/** Mean computed in two passes: a first estimate, then the mean residual added back. */
export function stableMean(values: readonly number[]): number {
  const n = values.length;
  if (n === 0) return 0;
  const first = compensatedSum(values) / n;
  const correction = compensatedSum(values.map((v) => v - first)) / n;
  return first + correction;
}

/**
 * Sum of squared deviations from the mean, two-pass with the Chan–Golub–LeVeque
 * correction term (Σd)²/n, which removes the rounding left in the mean.
 */
export function centredSumOfSquares(values: readonly number[]): number {
  const n = values.length;
  if (n < 2) return 0;
  const mean = stableMean(values);
  const deviations = values.map((v) => v - mean);
  const sumSquares = compensatedSum(deviations.map((d) => d * d));
  const sumDeviations = compensatedSum(deviations);
  return Math.max(0, sumSquares - (sumDeviations * sumDeviations) / n);
}

const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313,
  -176.61502916214059, 12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6,
  1.5056327351493116e-7,
];

/** Natural log of the gamma function for x > 0 (Lanczos g = 7, n = 9). */
export function logGamma(x: number): number {
  if (x < 0.5) {
    // Reflection keeps small arguments accurate.
    return Math.log(Math.PI / Math.abs(Math.sin(Math.PI * x))) - logGamma(1 - x);
  }
  const z = x - 1;
  let series = LANCZOS[0];
  for (let i = 1; i < LANCZOS.length; i++) series += LANCZOS[i] / (z + i);
  const t = z + 7.5;
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(series);
}

/** Natural log of the binomial coefficient C(n, k). */
export function logChoose(n: number, k: number): number {
  return logGamma(n + 1) - logGamma(k + 1) - logGamma(n - k + 1);
}

/** Continued fraction for I_x(a, b) (modified Lentz); converges well for x < (a+1)/(a+b+2). */
function betaContinuedFraction(x: number, a: number, b: number): number {
  const qab = a + b;
  const qap = a + 1;
  const qam = a - 1;
  let c = 1;
  let d = 1 - (qab * x) / qap;
  if (Math.abs(d) < TINY) d = TINY;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 2000; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((qam + m2) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (qab + m) * x) / ((a + m2) * (qap + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < RELATIVE_TOLERANCE) break;
  }
  return h;
}

/**
 * Both tails of the regularized incomplete beta: lower = I_x(a, b), upper = 1 − I_x(a, b).
 * `complementOfX` must equal 1 − x; pass it exactly when you have it (e.g. d2/(d1·F + d2)).
 * The side that the continued fraction evaluates is exact; the other is 1 minus it,
 * which is harmless because that side is the large one.
 */
export function incompleteBetaTails(
  x: number,
  a: number,
  b: number,
  complementOfX: number = 1 - x,
): { lower: number; upper: number } {
  if (x <= 0) return { lower: 0, upper: 1 };
  if (complementOfX <= 0) return { lower: 1, upper: 0 };
  const logFront =
    logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log(complementOfX);
  const front = Math.exp(logFront);
  if (x < (a + 1) / (a + b + 2)) {
    const lower = (front * betaContinuedFraction(x, a, b)) / a;
    return { lower, upper: 1 - lower };
  }
  const upper = (front * betaContinuedFraction(complementOfX, b, a)) / b;
  return { lower: 1 - upper, upper };
}

/** Both tails of the regularized incomplete gamma: lower = P(a, x), upper = Q(a, x). */
export function incompleteGammaTails(a: number, x: number): { lower: number; upper: number } {
  if (x <= 0) return { lower: 0, upper: 1 };
  const logFront = -x + a * Math.log(x) - logGamma(a);
  if (x < a + 1) {
    // Series for P.
    let term = 1 / a;
    let sum = term;
    for (let n = 1; n < 5000; n++) {
      term *= x / (a + n);
      sum += term;
      if (Math.abs(term) < Math.abs(sum) * RELATIVE_TOLERANCE) break;
    }
    const lower = sum * Math.exp(logFront);
    return { lower, upper: 1 - lower };
  }
  // Continued fraction for Q (Lentz).
  let b = x + 1 - a;
  let c = 1 / TINY;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < 5000; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < TINY) d = TINY;
    c = b + an / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < RELATIVE_TOLERANCE) break;
  }
  const upper = Math.exp(logFront) * h;
  return { lower: 1 - upper, upper };
}

/** P(Z > z) for the standard normal, computed directly in the far tail. */
export function normalUpperTail(z: number): number {
  if (z === 0) return 0.5;
  const half = incompleteGammaTails(0.5, (z * z) / 2);
  return z > 0 ? half.upper / 2 : 1 - half.upper / 2;
}

/** P(Z ≤ z) for the standard normal. */
export function normalCdf(z: number): number {
  return normalUpperTail(-z);
}

/** Standard normal quantile: Newton steps on the accurate cdf from jstat's estimate. */
export function normalQuantile(p: number): number {
  if (p <= 0) return -Infinity;
  if (p >= 1) return Infinity;
  if (p > 0.5) return -normalQuantile(1 - p);
  // Lower half: solve P(Z ≤ x) = p, where the lower tail is computed directly.
  let x = jStat.normal.inv(p, 0, 1);
  if (!Number.isFinite(x)) x = -8;
  for (let i = 0; i < 50; i++) {
    const density = Math.exp(-0.5 * x * x) / Math.sqrt(2 * Math.PI);
    if (density === 0) break;
    const step = (normalCdf(x) - p) / density;
    x -= step;
    if (Math.abs(step) < 1e-14 * Math.max(1, Math.abs(x))) break;
  }
  return x;
}

/** P(T > t) for Student's t with `df` degrees of freedom. */
export function studentTUpperTail(t: number, df: number): number {
  if (!Number.isFinite(t)) return t > 0 ? 0 : 1;
  const tSquared = t * t;
  const tails = incompleteBetaTails(df / (df + tSquared), df / 2, 0.5, tSquared / (df + tSquared));
  // tails.lower = P(|T| > |t|)
  return t >= 0 ? tails.lower / 2 : 1 - tails.lower / 2;
}

/** Two-sided p-value P(|T| ≥ |t|). */
export function studentTTwoSided(t: number, df: number): number {
  if (!Number.isFinite(t)) return 0;
  const tSquared = t * t;
  return incompleteBetaTails(df / (df + tSquared), df / 2, 0.5, tSquared / (df + tSquared)).lower;
}

/** Generic bisection for a decreasing function of x on [low, high]. */
function solveDecreasing(f: (x: number) => number, target: number, low: number, high: number): number {
  let lo = low;
  let hi = high;
  while (f(hi) > target) hi *= 2;
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (f(mid) > target) lo = mid;
    else hi = mid;
    if (hi - lo <= 1e-13 * Math.max(1, hi)) break;
  }
  return 0.5 * (lo + hi);
}

/** Quantile of Student's t: the t with P(T ≤ t) = p. */
export function studentTQuantile(p: number, df: number): number {
  if (p <= 0) return -Infinity;
  if (p >= 1) return Infinity;
  if (p < 0.5) return -studentTQuantile(1 - p, df);
  if (p === 0.5) return 0;
  const upper = 1 - p;
  const guess = Math.abs(jStat.studentt.inv(p, df));
  const high = Number.isFinite(guess) && guess > 0 ? guess * 2 + 1 : 10;
  return solveDecreasing((t) => studentTUpperTail(t, df), upper, 0, high);
}

/** P(F > f) for the F distribution with (df1, df2) degrees of freedom. */
export function fUpperTail(f: number, df1: number, df2: number): number {
  if (f <= 0) return 1;
  if (!Number.isFinite(f)) return 0;
  const denominator = df1 * f + df2;
  // Upper tail = I_{d2/(d1 f + d2)}(d2/2, d1/2), its complementary argument passed exactly.
  return incompleteBetaTails(df2 / denominator, df2 / 2, df1 / 2, (df1 * f) / denominator).lower;
}

/** P(X² > x) for chi-square with `df` degrees of freedom. */
export function chiSquareUpperTail(x: number, df: number): number {
  if (x <= 0) return 1;
  return incompleteGammaTails(df / 2, x / 2).upper;
}

/** Exact P(X ≥ k) for X ~ Binomial(n, p), summed term by term in log space. */
export function binomialUpperTail(k: number, n: number, p: number): number {
  if (k <= 0) return 1;
  if (k > n) return 0;
  if (p <= 0) return 0;
  if (p >= 1) return 1;
  const logP = Math.log(p);
  const logQ = Math.log1p(-p);
  const terms: number[] = [];
  for (let i = k; i <= n; i++) terms.push(Math.exp(logChoose(n, i) + i * logP + (n - i) * logQ));
  return Math.min(1, compensatedSum(terms));
}

/** Exact P(X ≤ k) for X ~ Binomial(n, p). */
export function binomialLowerTail(k: number, n: number, p: number): number {
  if (k < 0) return 0;
  if (k >= n) return 1;
  if (p <= 0) return 1;
  if (p >= 1) return 0;
  const logP = Math.log(p);
  const logQ = Math.log1p(-p);
  const terms: number[] = [];
  for (let i = 0; i <= k; i++) terms.push(Math.exp(logChoose(n, i) + i * logP + (n - i) * logQ));
  return Math.min(1, compensatedSum(terms));
}

/** Studentized-range cdf P(Q ≤ q) for `numberOfMeans` means and `df` error df (jstat's ptukey port, ./studentized-range.ts). */
export function studentizedRangeCdf(q: number, numberOfMeans: number, df: number): number {
  if (q <= 0) return 0;
  if (!Number.isFinite(q)) return 1;
  try {
    const value = studentizedRangeCdfExact(q, numberOfMeans, df);
    return Number.isFinite(value) ? Math.min(1, Math.max(0, value)) : 1;
  } catch {
    // The port throws when its integral does not converge, which happens only far in the tail.
    return 1;
  }
}

/** P(Q > q): 1 − cdf, see the module note on accuracy. */
export function studentizedRangeUpperTail(q: number, numberOfMeans: number, df: number): number {
  return Math.max(0, 1 - studentizedRangeCdf(q, numberOfMeans, df));
}

/**
 * Quantiles already computed, by (p, means, df). Each one costs about 40 cdf integrals (~35 ms),
 * and a results page asks for the same one for every attribute (same α, samples and error df) on
 * every request. The function is pure, so a remembered value is the value itself. Bounded.
 */
const studentizedRangeQuantiles = new Map<string, number>();
const REMEMBERED_QUANTILES = 512;

/** Studentized-range quantile, refined by bisection to about 1e-10. */
export function studentizedRangeQuantile(p: number, numberOfMeans: number, df: number): number {
  const key = `${p}|${numberOfMeans}|${df}`;
  const known = studentizedRangeQuantiles.get(key);
  if (known !== undefined) return known;
  const value = refineStudentizedRangeQuantile(p, numberOfMeans, df);
  if (studentizedRangeQuantiles.size >= REMEMBERED_QUANTILES) studentizedRangeQuantiles.clear();
  studentizedRangeQuantiles.set(key, value);
  return value;
}

function refineStudentizedRangeQuantile(p: number, numberOfMeans: number, df: number): number {
  let guess = 5;
  try {
    const value = jStat.tukey.inv(p, numberOfMeans, df);
    if (Number.isFinite(value) && value > 0) guess = value;
  } catch {
    // keep the default bracket
  }
  let low = Math.max(0, guess - 0.01);
  let high = guess + 0.01;
  while (low > 0 && studentizedRangeCdf(low, numberOfMeans, df) > p) low = Math.max(0, low - 0.5);
  while (studentizedRangeCdf(high, numberOfMeans, df) < p) high += 0.5;
  for (let i = 0; i < 100; i++) {
    const mid = 0.5 * (low + high);
    if (studentizedRangeCdf(mid, numberOfMeans, df) < p) low = mid;
    else high = mid;
    if (high - low < 1e-11) break;
  }
  return 0.5 * (low + high);
}
