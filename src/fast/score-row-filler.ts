import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';
import { writeLocalTime, writeUtcTime } from '../ingest/parse-instant.js';
import { csvField, isFormulaStart } from '../report/csv.js';
import { formatNumber, integerText } from '../report/format-number.js';
import { scoresHeader } from '../report/score-rows.js';
import type { ScoreColumn } from '../score/score-columns.js';
import type { RawEntry } from '../types.js';
import type { BatchScores } from './score-texts.js';
import { writeAscii } from './write-ascii.js';

/** Bytes a numeric or time field of a scores row takes at most (formatNumber and the time formats stay well within it). */
const NUMBER_BYTES = 40;

/** A scores row writer: `most` bounds the row's bytes, `fill` writes it (see AtomicLineWriter.writeWith). */
export interface ScoreRowFiller {
  most(entry: RawEntry, text?: string): number;
  fill(buffer: Buffer, at: number, entry: RawEntry, batch: BatchScores, i: number, text?: string): number;
}

/**
 * A row writer for a scores file, matching scoresHeader: the column layout is worked out once,
 * and a row is written as bytes straight from the entry and the batch's typed arrays (no string
 * per field, no joined string per row). Row `i` of `batch` holds the scores of `entry`; `text`
 * is written when the file keeps text. The bytes are those of scoreRowText's line in UTF-8, and
 * that line is csvRow(scoreRowFields(…)) of the plain scorer (src/score/score-row-fields.ts),
 * tested on the bench corpus.
 */
export function scoreRowFiller(columns: readonly ScoreColumn[], lexicons: readonly CompiledLexicon[], keepText: boolean): ScoreRowFiller {
  const n = columns.length;
  const nl = lexicons.length;
  const indexOf = new Map(columns.map((c, k) => [c.name, k]));
  const scales = columns.map((c) => c.scale ?? 1);
  const layout = lexicons.map((lex, l) => ({
    columns: columns.filter((c) => c.lexicon === lex.ref.name).map((c) => indexOf.get(c.name) as number),
    rules: lex.scoring !== 'vader',
    lexicon: l,
  }));
  const fieldCount = scoresHeader(columns, lexicons, keepText).length;
  // Every field but the id, person, zone and kept text is a number or a time.
  const numericFields = fieldCount - 3 - (keepText ? 1 : 0);
  return {
    most: (entry, text) => NUMBER_BYTES * numericFields + fieldCount + textBytes(entry.id) + textBytes(entry.person) + textBytes(entry.zone) + (keepText ? textBytes(text ?? '') : 0),
    fill(buffer, at, entry, batch, i, text) {
      // Numbers and RFC 3339 times never need quoting: only the id, person, zone and text may.
      at = writeTextField(buffer, at, entry.id);
      buffer[at++] = COMMA;
      at = writeTextField(buffer, at, entry.person);
      buffer[at++] = COMMA;
      at = writeUtcTime(buffer, at, entry.instant);
      buffer[at++] = COMMA;
      at = writeTextField(buffer, at, entry.zone);
      buffer[at++] = COMMA;
      at = writeLocalTime(buffer, at, entry.instant, entry.offsetMinutes);
      buffer[at++] = COMMA;
      at = writeAscii(buffer, at, integerText(batch.words[i] as number));
      const row = i * n;
      for (const { columns: own, rules, lexicon } of layout) {
        for (const c of own) {
          buffer[at++] = COMMA;
          const scale = scales[c] as number;
          at = writeAscii(buffer, at, formatNumber(scale === 1 ? batch.values[row + c] : (batch.values[row + c] as number) * scale));
        }
        if (rules) {
          for (const c of own) {
            buffer[at++] = COMMA;
            at = writeAscii(buffer, at, integerText(batch.matched[row + c] as number));
          }
          buffer[at++] = COMMA;
          at = writeAscii(buffer, at, integerText(batch.negated[i * nl + lexicon] as number));
        }
      }
      if (keepText) {
        buffer[at++] = COMMA;
        at = writeTextField(buffer, at, text ?? '');
      }
      return at;
    },
  };
}

/**
 * A scores row as a string (the line scoreRowFiller writes, decoded): for callers that want
 * lines rather than bytes.
 */
export function scoreRowText(filler: ScoreRowFiller, entry: RawEntry, batch: BatchScores, i: number, text?: string): string {
  const buffer = Buffer.allocUnsafe(filler.most(entry, text));
  return buffer.toString('utf8', 0, filler.fill(buffer, 0, entry, batch, i, text));
}

const COMMA = 0x2c;

/** Bytes csvField(value) takes at most in UTF-8: every code unit doubled (quotes), 3 bytes each, two quotes and a neutralising single quote. */
function textBytes(value: string): number {
  return 6 * value.length + 3;
}

/**
 * Writes csvField(value) in UTF-8 at `at`; returns where it ended. Plain ASCII without a quote,
 * comma or line break (ids, person ids, zone names, mostly) is copied byte by byte; anything else,
 * and a value starting with a character that could open a spreadsheet formula or with a single
 * quote (csvField neutralises those, see neutralizeCell), goes through csvField and Buffer's
 * UTF-8 encoder.
 */
function writeTextField(buffer: Buffer, at: number, value: string): number {
  const start = at;
  const first = value.charCodeAt(0);
  if (first === 0x27 || isFormulaStart(first)) {
    return start + buffer.write(csvField(value), start, 'utf8');
  }
  for (let k = 0; k < value.length; k++) {
    const c = value.charCodeAt(k);
    if (c >= 0x80 || c === 0x22 || c === COMMA || c === 0x0a || c === 0x0d) return start + buffer.write(csvField(value), start, 'utf8');
    buffer[at++] = c;
  }
  return at;
}
