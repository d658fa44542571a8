/**
 * A tiny seeded pseudo-random generator for reproducible tests and generated curves (not for security).
 */

/**
 * mulberry32: 32-bit state, returns uniform numbers in [0, 1). Public-domain generator by T. Ettinger
 * (2017), period 2³²; good enough for test noise, not for statistics at scale (from memory).
 */
export function seededUniform(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let z = s;
    z = Math.imul(z ^ (z >>> 15), z | 1);
    z ^= z + Math.imul(z ^ (z >>> 7), z | 61);
    return ((z ^ (z >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviates from a seeded uniform source by the Box–Muller transform (Box & Muller, 1958). */
export function seededNormal(seed: number): () => number {
  const u = seededUniform(seed);
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const s = spare;
      spare = null;
      return s;
    }
    const r = Math.sqrt(-2 * Math.log(1 - u()));
    const theta = 2 * Math.PI * u();
    spare = r * Math.sin(theta);
    return r * Math.cos(theta);
  };
}
