/* Expected values for test/stats/random.test.ts.
 * next() is the reference xoshiro128** 1.1 of Blackman & Vigna (2018),
 * https://prng.di.unimi.it/xoshiro128starstar.c (public domain), unchanged.
 * The state is seeded as lexichron's random(seed) does: four outputs of a SplitMix32-style
 * generator (increment 0x9e3779b9, murmur3 finaliser).
 * Build and run:  gcc -O2 -o /tmp/x xoshiro128starstar.c && /tmp/x > expected.txt */
#include <stdint.h>
#include <stdio.h>

static inline uint32_t rotl(const uint32_t x, int k) { return (x << k) | (x >> (32 - k)); }
static uint32_t s[4];
uint32_t next(void) {
  const uint32_t result = rotl(s[1] * 5, 7) * 9;
  const uint32_t t = s[1] << 9;
  s[2] ^= s[0];
  s[3] ^= s[1];
  s[1] ^= s[2];
  s[0] ^= s[3];
  s[2] ^= t;
  s[3] = rotl(s[3], 11);
  return result;
}
static uint32_t sm;
static uint32_t splitmix(void) {
  sm += 0x9e3779b9u;
  uint32_t z = sm;
  z = (z ^ (z >> 16)) * 0x85ebca6bu;
  z = (z ^ (z >> 13)) * 0xc2b2ae35u;
  return z ^ (z >> 16);
}
int main(void) {
  uint32_t seeds[] = {0u, 1u, 42u, 20260329u};
  for (int k = 0; k < 4; k++) {
    sm = seeds[k];
    for (int i = 0; i < 4; i++) s[i] = splitmix();
    printf("%u", seeds[k]);
    for (int i = 0; i < 5; i++) printf(" %u", next());
    printf("\n");
  }
  return 0;
}
