import type { WordNetIndexEntry, WordNetPos } from './wordnet-types.js';

/**
 * Parses one line of a WordNet `index.<pos>` file (Princeton wndb(5WN) format):
 * `lemma pos synset_cnt p_cnt [ptr_symbol…] sense_cnt tagsense_cnt synset_offset…`.
 * Returns undefined for license lines (which start with spaces) and malformed lines.
 */
export function parseWordnetIndexLine(line: string): WordNetIndexEntry | undefined {
  if (line.startsWith(' ')) return undefined;
  const f = line.trim().split(/\s+/);
  if (f.length < 6) return undefined;
  const [lemma, pos, synsetCountText, pointerCountText] = f as [string, string, string, string];
  if (!'nvar'.includes(pos) || pos.length !== 1) return undefined;
  const synsetCount = Number(synsetCountText);
  const pointerCount = Number(pointerCountText);
  if (!Number.isInteger(synsetCount) || !Number.isInteger(pointerCount)) return undefined;
  const pointerSymbols = f.slice(4, 4 + pointerCount);
  const offsets = f.slice(4 + pointerCount + 2, 4 + pointerCount + 2 + synsetCount).map(Number);
  if (offsets.length !== synsetCount || offsets.some((o) => !Number.isInteger(o))) return undefined;
  return { lemma, pos: pos as WordNetPos, pointerSymbols, synsetOffsets: offsets };
}
