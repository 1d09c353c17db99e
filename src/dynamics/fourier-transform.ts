/**
 * A discrete Fourier transform of one length, with its tables worked out once:
 *
 *   X_k = Σ_{t=0}^{n−1} x_t · e^{∓2πi·kt/n}   (− forward, + inverse; the inverse is not divided by n)
 */
export interface FourierPlan {
  n: number;
  /** Transforms `re` + i·`im` (length n) in place. */
  transform(re: Float64Array, im: Float64Array, inverse?: boolean): void;
}

/**
 * Plans the discrete Fourier transform of length `n`. Powers of two use the iterative radix-2
 * Cooley–Tukey algorithm (Cooley & Tukey 1965); other lengths use Bluestein's chirp-z algorithm
 * (Bluestein 1970), which writes the transform as a circular convolution of a power-of-two length
 * m ≥ 2n − 1. O(n log n) either way; the plan keeps the twiddle factors, the chirp and the
 * transformed chirp, so many transforms of one length (surrogates of one series) cost only
 * their arithmetic. Used for phase-randomised surrogates, where series are as long as a study
 * window (2,016 hourly bins for twelve weeks).
 */
export function fourierPlan(n: number): FourierPlan {
  if (!Number.isInteger(n) || n < 1) throw new Error(`fourierPlan: length must be a positive integer, got ${n}`);
  if ((n & (n - 1)) === 0) {
    const radix = radix2Plan(n);
    return { n, transform: (re, im, inverse = false) => radix(re, im, inverse) };
  }
  let m = 1;
  while (m < 2 * n - 1) m <<= 1;
  const radix = radix2Plan(m);
  // Chirp w_t = e^{−πi·t²/n} (forward); t² is reduced mod 2n so the angle stays exact for long series.
  const cr = new Float64Array(n);
  const ci = new Float64Array(n);
  for (let t = 0; t < n; t++) {
    const angle = (-Math.PI * ((t * t) % (2 * n))) / n;
    cr[t] = Math.cos(angle);
    ci[t] = Math.sin(angle);
  }
  // The transformed conjugate chirp, forward (for the inverse transform, everything is conjugated).
  const br = new Float64Array(m);
  const bi = new Float64Array(m);
  br[0] = cr[0] as number;
  bi[0] = -(ci[0] as number);
  for (let t = 1; t < n; t++) {
    br[t] = br[m - t] = cr[t] as number;
    bi[t] = bi[m - t] = -(ci[t] as number);
  }
  radix(br, bi, false);
  const ar = new Float64Array(m);
  const ai = new Float64Array(m);
  const transform = (re: Float64Array, im: Float64Array, inverse = false): void => {
    if (re.length !== n || im.length !== n) throw new Error(`fourierPlan: expected arrays of length ${n}`);
    // The inverse transform is the conjugate of the forward transform of the conjugate.
    const s = inverse ? -1 : 1;
    ar.fill(0);
    ai.fill(0);
    for (let t = 0; t < n; t++) {
      const xr = re[t] as number;
      const xi = s * (im[t] as number);
      ar[t] = xr * (cr[t] as number) - xi * (ci[t] as number);
      ai[t] = xr * (ci[t] as number) + xi * (cr[t] as number);
    }
    radix(ar, ai, false);
    for (let k = 0; k < m; k++) {
      const xr = (ar[k] as number) * (br[k] as number) - (ai[k] as number) * (bi[k] as number);
      const xi = (ar[k] as number) * (bi[k] as number) + (ai[k] as number) * (br[k] as number);
      ar[k] = xr;
      ai[k] = xi;
    }
    radix(ar, ai, true);
    for (let k = 0; k < n; k++) {
      const xr = (ar[k] as number) / m;
      const xi = (ai[k] as number) / m;
      re[k] = xr * (cr[k] as number) - xi * (ci[k] as number);
      im[k] = s * (xr * (ci[k] as number) + xi * (cr[k] as number));
    }
  };
  return { n, transform };
}

/** The discrete Fourier transform of any length, in place ({@link fourierPlan} for one call). */
export function fourierTransform(re: Float64Array, im: Float64Array, inverse = false): void {
  if (re.length !== im.length) throw new Error('fourierTransform: real and imaginary parts must have the same length');
  if (re.length <= 1) return;
  fourierPlan(re.length).transform(re, im, inverse);
}

function radix2Plan(n: number): (re: Float64Array, im: Float64Array, inverse: boolean) => void {
  const cos = new Float64Array(n >> 1);
  const sin = new Float64Array(n >> 1);
  for (let k = 0; k < n >> 1; k++) {
    cos[k] = Math.cos((2 * Math.PI * k) / n);
    sin[k] = Math.sin((2 * Math.PI * k) / n);
  }
  return (re, im, inverse) => {
    for (let i = 1, j = 0; i < n; i++) {
      let bit = n >> 1;
      for (; j & bit; bit >>= 1) j ^= bit;
      j ^= bit;
      if (i < j) {
        let t = re[i] as number;
        re[i] = re[j] as number;
        re[j] = t;
        t = im[i] as number;
        im[i] = im[j] as number;
        im[j] = t;
      }
    }
    const sign = inverse ? 1 : -1;
    for (let size = 2; size <= n; size <<= 1) {
      const half = size >> 1;
      const stride = n / size;
      for (let k = 0; k < half; k++) {
        const wr = cos[k * stride] as number;
        const wi = sign * (sin[k * stride] as number);
        for (let start = 0; start < n; start += size) {
          const a = start + k;
          const b = a + half;
          const xr = (re[b] as number) * wr - (im[b] as number) * wi;
          const xi = (re[b] as number) * wi + (im[b] as number) * wr;
          re[b] = (re[a] as number) - xr;
          im[b] = (im[a] as number) - xi;
          re[a] = (re[a] as number) + xr;
          im[a] = (im[a] as number) + xi;
        }
      }
    }
  };
}
