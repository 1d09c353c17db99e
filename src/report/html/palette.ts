/**
 * Colours of the report. Categorical colours are the Okabe–Ito palette (Okabe & Ito 2008,
 * "Color Universal Design"), distinguishable under the common colour-vision deficiencies; the
 * word-count ramp varies in lightness only (one hue), which every reader can order.
 */
export const PALETTE = {
  ink: '#1f2933',
  muted: '#5f6b76',
  grid: '#d9dee3',
  paper: '#fbfaf7',
  /** Okabe–Ito blue: the text score. */
  score: '#0072B2',
  /** Okabe–Ito vermillion: the self-report. */
  rating: '#D55E00',
  /** Okabe–Ito bluish green: between-person points. */
  between: '#009E73',
  /** Okabe–Ito reddish purple: clock-change days. */
  clock: '#CC79A7',
  /** Okabe–Ito orange: warnings and flags. */
  flag: '#E69F00',
  /** Okabe–Ito sky blue: intervals and bands. */
  band: '#56B4E9',
} as const;

/** Fill of a missing bin per reason (patterns are defined in the heatmap's `<defs>`). */
export const MISSING_STYLE: Record<string, { fill: string; label: string }> = {
  no_text: { fill: '#ffffff', label: 'no text in the bin' },
  too_few_words: { fill: '#E69F00', label: 'fewer words than the minimum' },
  excluded_hours: { fill: '#CC79A7', label: 'inside excluded hours' },
  outside_window: { fill: '#e4e7ea', label: 'outside the person\'s window' },
  before_first_entry: { fill: '#f3d9c4', label: 'in the study window, before the first entry' },
  after_last_entry: { fill: '#9e8a7a', label: 'in the study window, after the last entry (dropout)' },
};

/** Lightness ramp from pale to dark blue for word counts (5 classes). */
export const WORD_RAMP = ['#dbe9f6', '#a9cbe8', '#6fa8d6', '#2f7fbf', '#0b4f85'] as const;
