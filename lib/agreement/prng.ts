/** splitmix32 step, used only to spread a small seed over sfc32's 128-bit state. */
function splitmix32(state: { s: number }): number {
  state.s = (state.s + 0x9e3779b9) | 0;
  let t = state.s ^ (state.s >>> 16);
  t = Math.imul(t, 0x21f0aaad);
  t ^= t >>> 15;
  t = Math.imul(t, 0x735a2d97);
  return (t ^ (t >>> 15)) >>> 0;
}

/** State of sfc32 (Chris Doty-Humphrey's Small Fast Chaotic generator from PractRand), as four int32 words. */
export type Sfc32State = Int32Array;

export function seedSfc32(seed: number): Sfc32State {
  const mix = { s: seed | 0 };
  const state = new Int32Array([splitmix32(mix), splitmix32(mix), splitmix32(mix), 1]);
  for (let i = 0; i < 12; i += 1) nextUint32(state);
  return state;
}

export function nextUint32(state: Sfc32State): number {
  let a = state[0];
  let b = state[1];
  let c = state[2];
  let d = state[3];
  const t = (((a + b) | 0) + d) | 0;
  d = (d + 1) | 0;
  a = b ^ (b >>> 9);
  b = (c + (c << 3)) | 0;
  c = (c << 21) | (c >>> 11);
  c = (c + t) | 0;
  state[0] = a;
  state[1] = b;
  state[2] = c;
  state[3] = d;
  return t >>> 0;
}

/** A seeded generator of floats in [0, 1). */
export function createRandom(seed: number): () => number {
  const state = seedSfc32(seed);
  return () => nextUint32(state) / 4294967296;
}
