"""Expected values for test/reference/cluster-bootstrap.test.ts.

Run from this folder:  /usr/bin/python3 make-expected.py
An independent re-implementation, in plain Python, of a percentile cluster bootstrap
(Davison & Hinkley 1997, Bootstrap Methods and their Application, section 3.8): persons are drawn
with replacement, k draws per resample, each draw an index floor(u * k) from the same seeded
xoshiro128** 1.1 stream that lexichron uses (Blackman & Vigna 2018, prng.di.unimi.it; seeded with
four SplitMix32-style outputs, string seeds hashed with 32-bit FNV-1a). The generator is checked
against the reference C program's output in ../xoshiro/expected.txt before anything is written.
Percentiles use type-7 interpolation (R's default quantile, numpy's 'linear').

Writes clusters.csv (the data: 9 persons, the last with extreme values, so a bootstrap that never
draws the last person gives a visibly different interval) and expected.csv.
"""
import csv
import math
import statistics

M32 = 0xFFFFFFFF


def fnv1a(text):
    h = 0x811C9DC5
    for ch in text:
        h ^= ord(ch)
        h = (h * 0x01000193) & M32
    return h


def rotl(x, k):
    return ((x << k) | (x >> (32 - k))) & M32


class Xoshiro128StarStar:
    def __init__(self, seed):
        if isinstance(seed, str):
            s = fnv1a(seed)
        else:
            s = (seed & M32) ^ ((seed // 4294967296) & M32)
        state = []
        for _ in range(4):
            s = (s + 0x9E3779B9) & M32
            z = s
            z = ((z ^ (z >> 16)) * 0x85EBCA6B) & M32
            z = ((z ^ (z >> 13)) * 0xC2B2AE35) & M32
            state.append((z ^ (z >> 16)) & M32)
        if not any(state):
            state[0] = 1
        self.s = state

    def next_u32(self):
        a, b, c, d = self.s
        result = (rotl((b * 5) & M32, 7) * 9) & M32
        t = (b << 9) & M32
        c ^= a
        d ^= b
        b ^= c
        a ^= d
        c ^= t
        d = rotl(d, 11)
        self.s = [a, b, c, d]
        return result

    def uniform(self):
        return self.next_u32() / 4294967296.0


def check_generator():
    with open('../xoshiro/expected.txt') as f:
        for line in f:
            fields = [int(v) for v in line.split()]
            g = Xoshiro128StarStar(fields[0])
            got = [g.next_u32() for _ in range(5)]
            assert got == fields[1:], (fields[0], got, fields[1:])


def quantile7(sorted_values, p):
    h = (len(sorted_values) - 1) * p
    lo = math.floor(h)
    hi = min(lo + 1, len(sorted_values) - 1)
    return sorted_values[lo] + (h - lo) * (sorted_values[hi] - sorted_values[lo])


def bootstrap(clusters, statistic, seed, replicates, level):
    g = Xoshiro128StarStar(seed)
    k = len(clusters)
    draws = []
    first = None
    for b in range(replicates):
        idx = [min(k - 1, math.floor(g.uniform() * k)) for _ in range(k)]
        if first is None:
            first = idx
        draws.append(statistic([clusters[i] for i in idx]))
    draws.sort()
    return {
        'ci_low': quantile7(draws, (1 - level) / 2),
        'ci_high': quantile7(draws, (1 + level) / 2),
        'se': statistics.stdev(draws),
        'first_draw': first,
    }


def mean_of_means(sample):
    return sum(sum(c) / len(c) for c in sample) / len(sample)


def pooled_mean(sample):
    # Every observation of a person drawn twice counts twice.
    return sum(sum(c) for c in sample) / sum(len(c) for c in sample)


def main():
    check_generator()
    clusters = [
        [1.0, 2.0], [3.0], [4.0, 5.0, 6.0], [2.5, 2.0], [0.5, 1.5, 1.0, 2.0],
        [3.5], [2.0, 4.0], [1.0, 1.0, 3.0], [12.0, 15.0],
    ]
    with open('clusters.csv', 'w', newline='') as f:
        w = csv.writer(f, lineterminator='\n')
        w.writerow(['person', 'value'])
        for i, c in enumerate(clusters):
            for v in c:
                w.writerow([f'p{i + 1}', repr(v)])
    rows = []
    for name, stat in [('mean_of_means', mean_of_means), ('pooled_mean', pooled_mean)]:
        for seed, replicates, level in [(1, 2000, 0.95), ('cluster-reference', 999, 0.9)]:
            r = bootstrap(clusters, stat, seed, replicates, level)
            rows.append([name, str(seed), replicates, level, '%.15g' % r['ci_low'], '%.15g' % r['ci_high'], '%.15g' % r['se'], ' '.join(str(i) for i in r['first_draw'])])
    with open('expected.csv', 'w', newline='') as f:
        w = csv.writer(f, lineterminator='\n')
        w.writerow(['statistic', 'seed', 'replicates', 'level', 'ci_low', 'ci_high', 'se', 'first_draw'])
        w.writerows(rows)
    import sys
    with open('versions.txt', 'w') as f:
        f.write('Python %s (standard library only)\n' % sys.version.split()[0])


if __name__ == '__main__':
    main()
