/** A source of uniform random numbers in [0, 1), like `Math.random` but seeded and reproducible. */
export type RandomSource = () => number;

/**
 * A seeded pseudo-random generator: xoshiro128** 1.1 (Blackman & Vigna 2018, "Scrambled linear
 * pseudorandom number generators", https://prng.di.unimi.it/xoshiro128starstar.c), 32-bit state
 * words seeded from `seed` with SplitMix32. Returns doubles in [0, 1) with 32 bits of randomness.
 *
 * The same seed always gives the same sequence on every platform; string seeds are hashed
 * (FNV-1a, 32 bit) first. Pass the returned function to anything that needs randomness.
 */
export function random(seed: number | string): RandomSource {
  let s = typeof seed === 'string' ? fnv1a(seed) : seed >>> 0 ^ Math.floor(seed / 4294967296) >>> 0;
  const splitmix = (): number => {
    s = (s + 0x9e3779b9) >>> 0;
    let z = s;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    return (z ^ (z >>> 16)) >>> 0;
  };
  let a = splitmix();
  let b = splitmix();
  let c = splitmix();
  let d = splitmix();
  if ((a | b | c | d) === 0) a = 1;
  return () => {
    const result = Math.imul(rotl(Math.imul(b, 5) >>> 0, 7), 9) >>> 0;
    const t = (b << 9) >>> 0;
    c ^= a;
    d ^= b;
    b ^= c;
    a ^= d;
    c ^= t;
    d = rotl(d >>> 0, 11);
    a >>>= 0;
    b >>>= 0;
    c >>>= 0;
    return result / 4294967296;
  };
}

/** A uniform integer in [0, n) drawn from `source`. */
export function randomInteger(source: RandomSource, n: number): number {
  return Math.min(n - 1, Math.floor(source() * n));
}

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}

function fnv1a(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h >>> 0;
}
