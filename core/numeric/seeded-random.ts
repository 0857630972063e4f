/**
 * A small seeded generator of uniform numbers in [0, 1) (mulberry32, a 32-bit multiply–xorshift
 * generator): the same seed always gives the same sequence, on every platform, so that a
 * generated road can be named by its seed and rebuilt exactly.
 * @example const next = seededRandom(7); next(); // same value every run
 */
export function seededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 15), z | 1);
    z ^= z + Math.imul(z ^ (z >>> 7), z | 61);
    return ((z ^ (z >>> 14)) >>> 0) / 4294967296;
  };
}
