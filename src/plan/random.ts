/**
 * The plan's random inputs, all drawn from its seed (docs/methods.md §5): the gas-loss rate of each
 * aircraft and, when `operations.weekdays` is a count, which weekdays are flown. Each draw has its own
 * stream keyed by a label (FNV-1a hash of the label mixed with the seed), so adding an aircraft never
 * changes another aircraft's draw.
 *
 * Generator: SplitMix32 (a 32-bit variant of Steele, Lea & Flood 2014, "Fast splittable pseudorandom
 * number generators"); normal deviates by the Box–Muller transform (Box & Muller 1958).
 */

/** FNV-1a 32-bit hash of a string. */
export function fnv1a(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h >>> 0;
}

/** A uniform generator on (0, 1) for one labelled stream. */
export function stream(seed: number, label: string): () => number {
  let state = (fnv1a(label) ^ Math.imul(seed >>> 0, 0x9e3779b9)) >>> 0;
  return () => {
    state = (state + 0x9e3779b9) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    z = (z ^ (z >>> 16)) >>> 0;
    return (z + 0.5) / 4294967296;
  };
}

/** Standard normal deviate from a uniform stream (Box–Muller, cosine branch). */
export function normalDeviate(u: () => number): number {
  const u1 = u();
  const u2 = u();
  return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
}

/**
 * Gas-loss multiplier of one aircraft: log-normal with median 1 and σ of ln = `spread`
 * (the rate is the profile's nominal times this factor). spread 0 gives exactly 1.
 */
export function gasLossFactor(seed: number, aircraft: string, spread: number): number {
  if (spread === 0) return 1;
  return Math.exp(spread * normalDeviate(stream(seed, `gas-loss:${aircraft}`)));
}

/** `count` distinct ISO weekdays (1 = Monday) drawn from the seed, ascending (Fisher–Yates shuffle). */
export function drawWeekdays(seed: number, count: number): number[] {
  const days = [1, 2, 3, 4, 5, 6, 7];
  const u = stream(seed, "weekdays");
  for (let i = days.length - 1; i > 0; i--) {
    const j = Math.floor(u() * (i + 1));
    [days[i], days[j]] = [days[j]!, days[i]!];
  }
  return days.slice(0, count).sort((a, b) => a - b);
}
