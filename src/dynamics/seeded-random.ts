/**
 * A source of uniform random numbers in [0, 1). Every random step of the dynamics analyses
 * takes one of these as an argument, so results are reproducible from a seed.
 */
export type RandomSource = () => number;

/**
 * A seeded pseudo-random generator: xoshiro128** (Blackman & Vigna 2018, "Scrambled linear
 * pseudorandom number generators", public-domain reference code), with its 128-bit state
 * filled from the 32-bit seed by SplitMix32 steps. Returns numbers in [0, 1) with 32 random bits.
 *
 * Local to dynamics/ (src/stats/ had no random source when this was written). The same seed
 * always gives the same sequence on every platform (only 32-bit integer arithmetic is used).
 */
export function seededRandom(seed: number): RandomSource {
  let z = seed >>> 0;
  const splitMix = (): number => {
    z = (z + 0x9e3779b9) >>> 0;
    let x = z;
    x = Math.imul(x ^ (x >>> 16), 0x85ebca6b);
    x = Math.imul(x ^ (x >>> 13), 0xc2b2ae35);
    return (x ^ (x >>> 16)) >>> 0;
  };
  let a = splitMix();
  let b = splitMix();
  let c = splitMix();
  let d = splitMix();
  if ((a | b | c | d) === 0) a = 1;
  return () => {
    const result = Math.imul(rotl(Math.imul(b, 5), 7), 9) >>> 0;
    const t = b << 9;
    c ^= a;
    d ^= b;
    b ^= c;
    a ^= d;
    c ^= t;
    d = rotl(d, 11);
    return result / 4294967296;
  };
}

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}

/** A uniform integer in [0, n) from `random` (n ≥ 1). */
export function randomInteger(random: RandomSource, n: number): number {
  return Math.min(n - 1, Math.floor(random() * n));
}
