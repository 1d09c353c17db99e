import type { WordNetPointer, WordNetPos, WordNetSynset } from './wordnet-types.js';

/**
 * Parses one line of a WordNet `data.<pos>` file (Princeton wndb(5WN) format):
 * `synset_offset lex_filenum ss_type w_cnt word lex_id [word lex_id…] p_cnt [ptr…] [frames…] | gloss`,
 * where `w_cnt` and `lex_id` are hexadecimal and each pointer is
 * `pointer_symbol synset_offset pos source/target` (source and target as two 2-digit hex numbers).
 * Adjective position markers (`(a)`, `(p)`, `(ip)`) are removed from words.
 * Returns undefined for license lines and malformed lines.
 */
export function parseWordnetDataLine(line: string): WordNetSynset | undefined {
  if (line.startsWith(' ')) return undefined;
  const bar = line.indexOf(' | ');
  const head = (bar >= 0 ? line.slice(0, bar) : line).trim().split(/\s+/);
  const gloss = bar >= 0 ? line.slice(bar + 3).trim() : '';
  const offset = Number(head[0]);
  const type = head[2] as WordNetSynset['type'];
  const wordCount = parseInt(head[3] ?? '', 16);
  if (!Number.isInteger(offset) || !['n', 'v', 'a', 's', 'r'].includes(type) || !Number.isInteger(wordCount)) return undefined;
  const words: string[] = [];
  let i = 4;
  for (let w = 0; w < wordCount; w++, i += 2) {
    const word = head[i];
    if (word === undefined) return undefined;
    words.push(word.replace(/\((a|p|ip)\)$/, ''));
  }
  const pointerCount = Number(head[i]);
  if (!Number.isInteger(pointerCount)) return undefined;
  i++;
  const pointers: WordNetPointer[] = [];
  for (let p = 0; p < pointerCount; p++, i += 4) {
    const [symbol, off, pos, st] = [head[i], head[i + 1], head[i + 2], head[i + 3]];
    if (symbol === undefined || off === undefined || pos === undefined || st === undefined || st.length !== 4) return undefined;
    pointers.push({
      symbol,
      offset: Number(off),
      pos: (pos === 's' ? 'a' : pos) as WordNetPos,
      source: parseInt(st.slice(0, 2), 16),
      target: parseInt(st.slice(2), 16),
    });
  }
  return { offset, type, words, pointers, gloss };
}
