import { quantile } from '../../stats/quantile.js';
import { WORD_RAMP } from './palette.js';

/** Upper bounds of the word-count colour classes and their colours. */
export interface WordClasses {
  /** Upper bound (inclusive) of each class but the last. */
  bounds: number[];
  colours: readonly string[];
}

/**
 * Five word-count classes for the heatmap, split at the 20/40/60/80% quantiles (Hyndman & Fan
 * type 7) of the words of observed days, rounded to whole words and made strictly increasing, so
 * each class holds about a fifth of the days whatever the study's scale.
 */
export function wordClasses(words: readonly number[]): WordClasses {
  const bounds: number[] = [];
  for (const p of [0.2, 0.4, 0.6, 0.8]) {
    const q = Math.round(quantile(words, p) ?? 0);
    const prev = bounds[bounds.length - 1];
    bounds.push(prev === undefined ? q : Math.max(q, prev + 1));
  }
  return { bounds, colours: WORD_RAMP };
}

/** The colour of a word count under `classes`. */
export function wordColour(words: number, classes: WordClasses): string {
  const i = classes.bounds.findIndex((b) => words <= b);
  return classes.colours[i === -1 ? classes.colours.length - 1 : i] as string;
}
