import { isNumber } from '../stats/is-number.js';
import type { RandomSource } from '../stats/random.js';
import { fourierPlan } from './fourier-transform.js';

/** One segment ready for surrogates: its bins, which are observed, its mean and SD and its Fourier amplitudes. */
interface PreparedSegment {
  positions: number[];
  observed: boolean[];
  mean: number;
  sd: number;
  amplitude: Float64Array;
  transform: (re: Float64Array, im: Float64Array, inverse?: boolean) => void;
}

function prepareSegment(values: readonly (number | undefined)[], positions: number[]): PreparedSegment | undefined {
  const observed = positions.map((t) => isNumber(values[t]));
  const count = observed.filter(Boolean).length;
  if (count < 3) return undefined;
  let mean = 0;
  for (const t of positions) if (isNumber(values[t])) mean += values[t];
  mean /= count;
  let ss = 0;
  for (const t of positions) if (isNumber(values[t])) ss += (values[t] - mean) ** 2;
  const n = positions.length;
  const plan = fourierPlan(n);
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  positions.forEach((t, i) => (re[i] = isNumber(values[t]) ? values[t] - mean : 0));
  plan.transform(re, im);
  const amplitude = new Float64Array(n);
  for (let k = 0; k < n; k++) amplitude[k] = Math.hypot(re[k] as number, im[k] as number);
  return { positions, observed, mean, sd: Math.sqrt(ss / (count - 1)), amplitude, transform: plan.transform };
}

function drawSegment(segment: PreparedSegment, random: RandomSource, out: (number | undefined)[]): void {
  const { positions, observed, amplitude } = segment;
  const n = positions.length;
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  for (let k = 1; 2 * k < n; k++) {
    const theta = 2 * Math.PI * random();
    re[k] = (amplitude[k] as number) * Math.cos(theta);
    im[k] = (amplitude[k] as number) * Math.sin(theta);
    re[n - k] = re[k] as number;
    im[n - k] = -(im[k] as number);
  }
  if (n % 2 === 0) re[n / 2] = Math.SQRT2 * (amplitude[n / 2] as number) * Math.cos(2 * Math.PI * random());
  segment.transform(re, im, true);
  // Rescale over the observed bins (the filled ones are dropped again) to their mean and SD.
  let m = 0;
  let count = 0;
  for (let i = 0; i < n; i++)
    if (observed[i]) {
      m += re[i] as number;
      count++;
    }
  m /= count;
  let s2 = 0;
  for (let i = 0; i < n; i++) if (observed[i]) s2 += ((re[i] as number) - m) ** 2;
  const scale = s2 > 0 ? segment.sd / Math.sqrt(s2 / (count - 1)) : 0;
  for (let i = 0; i < n; i++) if (observed[i]) out[positions[i] as number] = segment.mean + ((re[i] as number) - m) * scale;
}

/**
 * `count` phase-randomised surrogates (Ebisuzaki 1997, "A method to estimate the statistical
 * significance of a correlation when the data are serially correlated", Journal of Climate
 * 10:2147–2153): the series' Fourier amplitudes are kept and every phase is replaced by an
 * independent uniform one, so a surrogate has the series' power spectrum, hence its
 * autocorrelation, but no relation to any other series. For an even length the Nyquist term,
 * which must stay real, becomes √2·A·cos θ, as in Ebisuzaki's method; the result is rescaled to
 * the mean and standard deviation of the observed values.
 *
 * Drawn within segments: `segment[t]` names the person (or stretch) bin t belongs to, and each
 * segment is randomised on its own, so a surrogate never moves values between persons and keeps
 * each person's mean and spread (bins with a negative segment id, such as the gaps between
 * stacked persons, stay as they are). Without `segment` the whole series is one segment. Missing
 * bins are filled with the segment's mean for the transform and are missing again in the result;
 * a segment with fewer than 3 observed values is copied unchanged. The amplitudes are computed
 * once for all surrogates. Randomness from `random`, surrogate by surrogate, segment by segment.
 */
export function phaseRandomisedSurrogates(
  values: readonly (number | undefined)[],
  count: number,
  random: RandomSource,
  segment?: readonly number[],
): (number | undefined)[][] {
  const prepared = segmentPositions(values.length, segment).map((positions) => prepareSegment(values, positions));
  return Array.from({ length: count }, () => {
    const out = values.slice();
    for (const s of prepared) if (s) drawSegment(s, random, out);
    return out;
  });
}

/** The bins of each segment, in order of first appearance (one segment of every bin when `segment` is absent). */
export function segmentPositions(length: number, segment?: readonly number[]): number[][] {
  if (!segment) return [Array.from({ length }, (_, t) => t)];
  const groups = new Map<number, number[]>();
  for (let t = 0; t < length; t++) {
    const id = segment[t] ?? -1;
    if (id < 0) continue;
    const list = groups.get(id);
    if (list) list.push(t);
    else groups.set(id, [t]);
  }
  return [...groups.values()];
}
