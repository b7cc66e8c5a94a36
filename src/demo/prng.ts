/**
 * Small seeded pseudo-random numbers for the demo climate generator.
 *
 * Generator: mulberry32 (Tommy Ettinger, 2017; public domain), a 32-bit state generator with a
 * full 2^32 period. It is not cryptographic and not of research quality, but it is tiny, fast, gives
 * the same sequence on every JavaScript engine (only 32-bit integer operations through Math.imul), and
 * passes the usual quick statistical checks, which is all a demo climate needs.
 *
 * Seeds are derived from text (a global seed and a station id) with FNV-1a (32-bit), so that each
 * station has its own independent stream and adding a station does not change the others.
 */

/** A source of uniform numbers in [0, 1). */
export type Uniform = () => number;

/** mulberry32: returns a generator of uniform numbers in [0, 1) with 32 bits of resolution. */
export function mulberry32(seed: number): Uniform {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** FNV-1a 32-bit hash of a string's UTF-16 code units (Fowler, Noll, Vo), used to derive seeds. */
export { fnv1a as fnv1a32 } from "../plan/random.js";

/**
 * Standard normal deviate by the Box–Muller transform (Box and Muller, 1958). Uses two uniforms and
 * returns one deviate (the second is discarded, which keeps the stream position easy to reason about).
 */
export function standardNormal(uniform: Uniform): number {
  const u1 = 1 - uniform(); // in (0, 1], so the logarithm is finite
  const u2 = uniform();
  return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
}

/** Exponential deviate with the given mean (inverse-transform method). */
export function exponential(uniform: Uniform, mean: number): number {
  return -mean * Math.log(1 - uniform());
}

/** Integer drawn uniformly from lo to hi inclusive. */
export function uniformInt(uniform: Uniform, lo: number, hi: number): number {
  return lo + Math.floor(uniform() * (hi - lo + 1));
}
