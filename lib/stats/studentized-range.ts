/**
 * The studentized range cdf P(Q ≤ q), the probability behind Tukey's HSD p-values. PURE.
 *
 * This is jstat's `tukey.cdf` (jstat 1.9.6, MIT; its port of R's ptukey, Copenhaver & Holland 1988,
 * with jstat's Chebyshev erf) computed with the same operations in the same order, so it returns
 * jstat's values to the last bit (tests/unit/stats/studentized-range.test.ts compares them). The
 * difference is speed: jstat builds its constant tables (the 28 erf coefficients, the Legendre
 * nodes and weights) as new arrays on every call, and a large tasting calls the inner integral some
 * hundred thousand times, so those allocations were most of its analysis time. Here they are built once.
 */
import jStat from 'jstat';

const ERF_COEFFICIENTS = Float64Array.from([
  -1.3026537197817094, 6.4196979235649026e-1, 1.9476473204185836e-2,
  -9.561514786808631e-3, -9.46595344482036e-4, 3.66839497852761e-4,
  4.2523324806907e-5, -2.0278578112534e-5, -1.624290004647e-6,
  1.303655835580e-6, 1.5626441722e-8, -8.5238095915e-8,
  6.529054439e-9, 5.059343495e-9, -9.91364156e-10,
  -2.27365122e-10, 9.6467911e-11, 2.394038e-12,
  -6.886027e-12, 8.94487e-13, 3.13092e-13,
  -1.12708e-13, 3.81e-16, 7.106e-15,
  -1.523e-15, -9.4e-17, 1.21e-16,
  -2.8e-17,
]);

/** jStat.erf. */
function erf(input: number): number {
  let x = input;
  let negative = false;
  if (x < 0) {
    x = -x;
    negative = true;
  }
  const t = 2 / (2 + x);
  const ty = 4 * t - 2;
  let d = 0;
  let dd = 0;
  for (let j = ERF_COEFFICIENTS.length - 1; j > 0; j--) {
    const tmp = d;
    d = ty * d - dd + ERF_COEFFICIENTS[j];
    dd = tmp;
  }
  const res = t * Math.exp(-x * x + 0.5 * (ERF_COEFFICIENTS[0] + ty * d) - dd);
  return negative ? res - 1 : 1 - res;
}

// jStat.normal.cdf(x, mean, 1) divides by Math.sqrt(2 * std * std) with std = 1.
const SQRT_2 = Math.sqrt(2 * 1 * 1);

/** jStat.normal.cdf(x, mean, 1). */
function normalCdf(x: number, mean: number): number {
  return 0.5 * (1 + erf((x - mean) / SQRT_2));
}

// The inner integral (wprob): 12-point Gauss–Legendre, by half.
const W_NODES = Float64Array.from([
  0.981560634246719250690549090149, 0.904117256370474856678465866119, 0.769902674194304687036893833213,
  0.587317954286617447296702418941, 0.367831498998180193752691536644, 0.125233408511468915472441369464,
]);
const W_WEIGHTS = Float64Array.from([
  0.047175336386511827194615961485, 0.106939325995318430960254718194, 0.160078328543346226334652529543,
  0.203167426723065921749064455810, 0.233492536538354808760849898925, 0.249147045813402785000562436043,
]);

/** jstat's tukeyWprob(w, rr, cc) with rr = 1: the range of `cc` standard normals is at most w. */
function rangeProbability(w: number, cc: number): number {
  const nleg = 12;
  const ihalf = 6;
  const C1 = -30;
  const C2 = -50;
  const C3 = 60;
  const bb = 8;
  const wlar = 3;
  const rr = 1;
  const qsqz = w * 0.5;
  if (qsqz >= bb) return 1.0;
  let prW = 2 * normalCdf(qsqz, 0) - 1;
  if (prW >= Math.exp(C2 / cc)) prW = Math.pow(prW, cc);
  else prW = 0.0;
  const wincr = w > wlar ? 2 : 3;
  let blb = qsqz;
  const binc = (bb - qsqz) / wincr;
  let bub = blb + binc;
  let einsum = 0.0;
  const cc1 = cc - 1.0;
  const floor = Math.exp(C1 / cc1);
  for (let wi = 1; wi <= wincr; wi++) {
    let elsum = 0.0;
    const a = 0.5 * (bub + blb);
    const b = 0.5 * (bub - blb);
    for (let jj = 1; jj <= nleg; jj++) {
      let j: number;
      let xx: number;
      if (ihalf < jj) {
        j = nleg - jj + 1;
        xx = W_NODES[j - 1];
      } else {
        j = jj;
        xx = -W_NODES[j - 1];
      }
      const c = b * xx;
      const ac = a + c;
      const qexpo = ac * ac;
      if (qexpo > C3) break;
      const pplus = 2 * normalCdf(ac, 0);
      const pminus = 2 * normalCdf(ac, w);
      let rinsum = pplus * 0.5 - pminus * 0.5;
      if (rinsum >= floor) {
        rinsum = W_WEIGHTS[j - 1] * Math.exp(-(0.5 * qexpo)) * Math.pow(rinsum, cc1);
        elsum += rinsum;
      }
    }
    elsum *= (2.0 * b * cc) / Math.sqrt(2 * Math.PI);
    einsum += elsum;
    blb = bub;
    bub += binc;
  }
  prW += einsum;
  if (prW <= Math.exp(C1 / rr)) return 0;
  prW = Math.pow(prW, rr);
  if (prW >= 1) return 1;
  return prW;
}

// The outer integral over the error df's chi distribution: 16-point Gauss–Legendre, by half.
const Q_NODES = Float64Array.from([
  0.989400934991649932596154173450, 0.944575023073232576077988415535, 0.865631202387831743880467897712,
  0.755404408355003033895101194847, 0.617876244402643748446671764049, 0.458016777657227386342419442984,
  0.281603550779258913230460501460, 0.950125098376374401853193354250e-1,
]);
const Q_WEIGHTS = Float64Array.from([
  0.271524594117540948517805724560e-1, 0.622535239386478928628438369944e-1, 0.951585116824927848099251076022e-1,
  0.124628971255533872052476282192, 0.149595988816576732081501730547, 0.169156519395002538189312079030,
  0.182603415044923588866763667969, 0.189450610455068496285396723208,
]);

/**
 * jStat.tukey.cdf(q, numberOfMeans, df): NaN for df < 2 or fewer than two means; throws when the
 * outer integral does not converge, as jstat does.
 */
export function studentizedRangeCdfExact(q: number, numberOfMeans: number, df: number): number {
  const rr = 1;
  const cc = numberOfMeans;
  const nlegq = 16;
  const ihalfq = 8;
  const eps1 = -30.0;
  const eps2 = 1.0e-14;
  if (q <= 0) return 0;
  if (df < 2 || rr < 1 || cc < 2) return Number.NaN;
  if (!Number.isFinite(q)) return 1;
  if (df > 25000.0) return rangeProbability(q, cc);
  const f2 = df * 0.5;
  let f2lf = f2 * Math.log(df) - df * Math.log(2) - jStat.gammaln(f2);
  const f21 = f2 - 1.0;
  const ff4 = df * 0.25;
  const ulen = df <= 100.0 ? 1.0 : df <= 800.0 ? 0.5 : df <= 5000.0 ? 0.25 : 0.125;
  f2lf += Math.log(ulen);
  let ans = 0.0;
  let otsum = 0.0;
  for (let i = 1; i <= 50; i++) {
    otsum = 0.0;
    const twa1 = (2 * i - 1) * ulen;
    for (let jj = 1; jj <= nlegq; jj++) {
      let j: number;
      let t1: number;
      if (ihalfq < jj) {
        j = jj - ihalfq - 1;
        t1 = f2lf + f21 * Math.log(twa1 + Q_NODES[j] * ulen) - (Q_NODES[j] * ulen + twa1) * ff4;
      } else {
        j = jj - 1;
        t1 = f2lf + f21 * Math.log(twa1 - Q_NODES[j] * ulen) + (Q_NODES[j] * ulen - twa1) * ff4;
      }
      if (t1 >= eps1) {
        const qsqz = ihalfq < jj ? q * Math.sqrt((Q_NODES[j] * ulen + twa1) * 0.5) : q * Math.sqrt((-(Q_NODES[j] * ulen) + twa1) * 0.5);
        const wprb = rangeProbability(qsqz, cc);
        otsum += wprb * Q_WEIGHTS[j] * Math.exp(t1);
      }
    }
    if (i * ulen >= 1.0 && otsum <= eps2) break;
    ans += otsum;
  }
  if (otsum > eps2) throw new Error('tukey.cdf failed to converge');
  if (ans > 1) ans = 1;
  return ans;
}
