import { usageError } from '../errors.js';

/** Help text of `score --file-columns`. */
export const FILE_COLUMNS_HELP = 'the column map of one input file: FILE=person=COL,time=COL,text=COL[,id=COL][,zone=COL], FILE written as among the inputs (repeatable, one per file; other files use --columns or the default names)';

const MAP_KEYS = ['person', 'time', 'text', 'id', 'zone'];

/**
 * The `--file-columns FILE=MAP` values as a map from input path to its column map. FILE must be
 * one of `inputs` exactly as given (the longest such prefix wins, so a path may hold `=`); a
 * value naming no input, a file given two maps or an empty map is a usage error saying what to write.
 */
export function fileColumnsFrom(values: readonly string[] | undefined, inputs: readonly string[]): Map<string, string> {
  const maps = new Map<string, string>();
  for (const value of values ?? []) {
    const file = inputs.filter((p) => value.startsWith(`${p}=`)).sort((a, b) => b.length - a.length)[0];
    if (file === undefined) {
      const head = value.split('=')[0] ?? '';
      if (!value.includes('=') || MAP_KEYS.includes(head.trim())) {
        throw usageError(`--file-columns \`${value}\` does not start with an input file; write FILE=MAP, e.g. --file-columns diary.csv=person=who,time=when,text=note (for every file at once, use --columns MAP).`);
      }
      throw usageError(`--file-columns names \`${head}\`, which is not an input of this command; give it among the inputs, or name one of: ${inputs.map((p) => `\`${p}\``).join(', ')}.`);
    }
    const map = value.slice(file.length + 1);
    if (map.trim() === '') throw usageError(`--file-columns \`${value}\` gives \`${file}\` no map; write FILE=person=COL,time=COL,text=COL.`);
    if (maps.has(file)) throw usageError(`--file-columns gives \`${file}\` two maps; give each file one.`);
    maps.set(file, map);
  }
  return maps;
}
