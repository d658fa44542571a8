/**
 * Seeded pseudo-random numbers for the simulator, so every generated log can be made again
 * from its seed. Uniforms from the engine's one seeded generator (mulberry32, fit/prng.ts) on the
 * seed mixed with 0x9e3779b9, Box–Muller for normals. Not for cryptography.
 */
import { seededUniform } from "../fit/prng";

export interface Rng {
  /** Uniform in [0, 1). */
  next(): number;
  /** Uniform in [lo, hi). */
  uniform(lo: number, hi: number): number;
  /** Log-uniform in [lo, hi): equal odds per decade (lo, hi > 0). */
  logUniform(lo: number, hi: number): number;
  /** Standard normal. */
  normal(): number;
  /** Integer in [lo, hi] inclusive. */
  int(lo: number, hi: number): number;
  /** True with probability p. */
  chance(p: number): boolean;
  pick<T>(items: readonly T[]): T;
}

export function makeRng(seed: number): Rng {
  const next = seededUniform((Math.floor(seed) ^ 0x9e3779b9) >>> 0);
  let spare: number | null = null;
  const rng: Rng = {
    next,
    uniform: (lo, hi) => lo + (hi - lo) * next(),
    logUniform: (lo, hi) => Math.exp(Math.log(lo) + (Math.log(hi) - Math.log(lo)) * next()),
    normal: () => {
      if (spare !== null) {
        const s = spare;
        spare = null;
        return s;
      }
      const u = Math.max(next(), 1e-12);
      const v = next();
      const r = Math.sqrt(-2 * Math.log(u));
      spare = r * Math.sin(2 * Math.PI * v);
      return r * Math.cos(2 * Math.PI * v);
    },
    int: (lo, hi) => lo + Math.floor(next() * (hi - lo + 1)),
    chance: (p) => next() < p,
    pick: (items) => items[Math.floor(next() * items.length)],
  };
  return rng;
}
