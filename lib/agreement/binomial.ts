const LN_SQRT_2PI = 0.9189385332046728;

/** fc(k) = ln k! − [(k + ½) ln(k + 1) − (k + 1) + ln √(2π)], the Stirling remainder used by BTRD. */
const FC_TABLE = Array.from({ length: 10 }, (_, k) => {
  let lnFactorial = 0;
  for (let i = 2; i <= k; i += 1) lnFactorial += Math.log(i);
  return lnFactorial - ((k + 0.5) * Math.log(k + 1) - (k + 1) + LN_SQRT_2PI);
});

function fc(k: number): number {
  if (k < 10) return FC_TABLE[k];
  const r = 1 / (k + 1);
  const r2 = r * r;
  return (1 / 12 - (1 / 360 - r2 / 1260) * r2) * r;
}

/** Inversion (sequential search from 0) for a small mean; p ≤ 0.5. */
function binomialInversion(n: number, p: number, random: () => number): number {
  const q = 1 - p;
  const s = p / q;
  const a = (n + 1) * s;
  const start = Math.pow(q, n);
  for (;;) {
    let r = start;
    let u = random();
    let x = 0;
    while (u > r && x <= n) {
      u -= r;
      x += 1;
      r *= a / x - s;
    }
    if (x <= n) return x;
  }
}

/**
 * BTRD: Hörmann (1993), "The generation of binomial random variates", J. Statist. Comput. Simul. 46:101–110
 * (transformed rejection with decomposition), for p ≤ 0.5 and mode ≥ 11.
 */
function binomialBtrd(n: number, p: number, random: () => number): number {
  const m = Math.floor((n + 1) * p);
  const r = p / (1 - p);
  const nr = (n + 1) * r;
  const npq = n * p * (1 - p);
  const sqrtNpq = Math.sqrt(npq);
  const b = 1.15 + 2.53 * sqrtNpq;
  const a = -0.0873 + 0.0248 * b + 0.01 * p;
  const c = n * p + 0.5;
  const alpha = (2.83 + 5.1 / b) * sqrtNpq;
  const vr = 0.92 - 4.2 / b;
  const urvr = 0.86 * vr;
  for (;;) {
    let v = random();
    let u: number;
    if (v <= urvr) {
      u = v / vr - 0.43;
      return Math.floor(((2 * a) / (0.5 - Math.abs(u)) + b) * u + c);
    }
    if (v >= vr) {
      u = random() - 0.5;
    } else {
      u = v / vr - 0.93;
      u = (u < 0 ? -0.5 : 0.5) - u;
      v = random() * vr;
    }
    const us = 0.5 - Math.abs(u);
    const k = Math.floor(((2 * a) / us + b) * u + c);
    if (k < 0 || k > n) continue;
    v = (v * alpha) / (a / (us * us) + b);
    const km = Math.abs(k - m);
    if (km <= 15) {
      let f = 1;
      if (m < k) {
        for (let i = m + 1; i <= k; i += 1) f *= nr / i - r;
      } else if (m > k) {
        for (let i = k + 1; i <= m; i += 1) v *= nr / i - r;
      }
      if (v <= f) return k;
      continue;
    }
    v = Math.log(v);
    const rho = (km / npq) * (((km / 3 + 0.625) * km + 1 / 6) * km + 0.5);
    const t = (-km * km) / (2 * npq);
    if (v < t - rho) return k;
    if (v > t + rho) continue;
    const nm = n - m + 1;
    const h = (m + 0.5) * Math.log((m + 1) / (r * nm)) + fc(m) + fc(n - m);
    const nk = n - k + 1;
    if (v <= h + (n + 1) * Math.log(nm / nk) + (k + 0.5) * Math.log((nk * r) / (k + 1)) - fc(k) - fc(n - k)) return k;
  }
}

/** An exact Binomial(n, p) variate from uniform [0, 1) numbers. */
export function binomial(n: number, p: number, random: () => number): number {
  if (n <= 0 || p <= 0) return 0;
  if (p >= 1) return n;
  if (p > 0.5) return n - binomial(n, 1 - p, random);
  return (n + 1) * p < 11 ? binomialInversion(n, p, random) : binomialBtrd(n, p, random);
}
