import { binomial } from "./binomial";
import { nextUint32, seedSfc32 } from "./prng";

/** A pattern seen at least this often gets its own binomial draw; rarer ones are drawn item by item. */
export const BINOMIAL_FROM = 16;

/**
 * Draws how often each pattern occurs in a bootstrap resample: as many items as there are, uniformly with
 * replacement. Exact, in two steps: frequent patterns by conditional binomials X_p ~ Bin(left, c_p / mass)
 * (a multinomial); the draws left over fall on the rare patterns' items, which are then picked one by one.
 */
export class PatternResampler {
  private readonly state: Int32Array;
  private readonly random: () => number;
  private readonly frequent: Int32Array;
  private readonly rareItems: Int32Array;
  private readonly rareDrawn: Int32Array;

  constructor(
    private readonly count: Float64Array,
    seed: number,
  ) {
    this.state = seedSfc32(seed);
    const state = this.state;
    this.random = () => nextUint32(state) / 4294967296;
    const frequent: number[] = [];
    let rare = 0;
    count.forEach((c, p) => {
      if (c >= BINOMIAL_FROM) frequent.push(p);
      else rare += c;
    });
    frequent.sort((x, y) => count[y] - count[x] || x - y);
    this.frequent = Int32Array.from(frequent);
    this.rareItems = new Int32Array(rare);
    let at = 0;
    count.forEach((c, p) => {
      if (c < BINOMIAL_FROM) this.rareItems.fill(p, at, (at += c));
    });
    this.rareDrawn = new Int32Array(count.length);
  }

  draw(weights: Float64Array): void {
    const { count, frequent, rareItems, rareDrawn } = this;
    weights.fill(0);
    let mass = 0;
    for (let p = 0; p < count.length; p += 1) mass += count[p];
    let left = mass;
    for (let i = 0; i < frequent.length && left > 0; i += 1) {
      const p = frequent[i];
      const x = count[p] >= mass ? left : binomial(left, count[p] / mass, this.random);
      weights[p] = x;
      left -= x;
      mass -= count[p];
    }
    if (left === 0) return;
    const n = rareItems.length;
    const scale = n / 4294967296;
    const state = this.state;
    let s0 = state[0];
    let s1 = state[1];
    let s2 = state[2];
    let s3 = state[3];
    rareDrawn.fill(0);
    for (let j = 0; j < left; j += 1) {
      // sfc32 inlined: t is the next uint32.
      const t = (((s0 + s1) | 0) + s3) | 0;
      s3 = (s3 + 1) | 0;
      s0 = s1 ^ (s1 >>> 9);
      s1 = (s2 + (s2 << 3)) | 0;
      s2 = (((s2 << 21) | (s2 >>> 11)) + t) | 0;
      rareDrawn[rareItems[((t >>> 0) * scale) | 0]] += 1;
    }
    state[0] = s0;
    state[1] = s1;
    state[2] = s2;
    state[3] = s3;
    for (let p = 0; p < rareDrawn.length; p += 1) if (rareDrawn[p] > 0) weights[p] = rareDrawn[p];
  }
}
