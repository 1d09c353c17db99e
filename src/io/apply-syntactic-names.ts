import { createReadStream, createWriteStream } from 'node:fs';
import { readFile, rename, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { once } from 'node:events';
import Papa from 'papaparse';
import { csvRow } from '../report/csv.js';
import { syntacticNames } from '../report/syntactic-names.js';
import { writeFileAtomic } from './atomic-write.js';

interface PackageField {
  name: string;
  title?: string;
}

interface PackageResource {
  path?: string;
  schema?: { fields?: PackageField[] };
}

/** Rewrites the header line of a CSV file (the rest is copied byte for byte). */
async function rewriteHeader(path: string, header: (old: string[]) => string[]): Promise<void> {
  const tmp = `${path}.names-${process.pid}.tmp`;
  const out = createWriteStream(tmp);
  let pending: Buffer | undefined = Buffer.alloc(0);
  for await (const chunk of createReadStream(path) as AsyncIterable<Buffer>) {
    let data = chunk;
    if (pending !== undefined) {
      const joined: Buffer = Buffer.concat([pending, chunk]);
      const end = joined.indexOf(0x0a);
      if (end < 0) {
        pending = joined;
        continue;
      }
      const old = Papa.parse<string[]>(joined.subarray(0, end).toString('utf8').replace(/\r$/, ''), { header: false }).data[0] ?? [];
      if (!out.write(csvRow(header(old)) + '\n')) await once(out, 'drain');
      data = joined.subarray(end + 1);
      pending = undefined;
    }
    if (!out.write(data)) await once(out, 'drain');
  }
  if (pending !== undefined && pending.length > 0) out.write(csvRow(header(Papa.parse<string[]>(pending.toString('utf8'), { header: false }).data[0] ?? [])));
  out.end();
  await once(out, 'close');
  await rename(tmp, path);
}

/**
 * Gives every CSV described in `dir/datapackage.json` column names that R and pandas accept
 * unquoted (see syntacticNames): the header lines and the package's field names are rewritten, and
 * each renamed field keeps its original name as its `title`. Returns the paths of the files changed
 * (relative to `dir`), datapackage.json included.
 */
export async function applySyntacticNames(dir: string): Promise<string[]> {
  const pkgPath = join(dir, 'datapackage.json');
  const pkg = JSON.parse(await readFile(pkgPath, 'utf8')) as { resources?: PackageResource[]; [key: string]: unknown };
  const changed: string[] = [];
  for (const resource of pkg.resources ?? []) {
    const fields = resource.schema?.fields;
    if (!resource.path || !fields || !resource.path.endsWith('.csv')) continue;
    const file = join(dir, resource.path);
    if (!(await stat(file).catch(() => undefined))?.isFile()) continue;
    const renamed = syntacticNames(fields.map((f) => f.name));
    if (renamed.every((n, k) => n === fields[k]?.name)) continue;
    const byOld = new Map(fields.map((f, k) => [f.name, renamed[k] as string]));
    await rewriteHeader(file, (old) => {
      const fresh = syntacticNames(old);
      return old.map((name, k) => byOld.get(name) ?? (fresh[k] as string));
    });
    fields.forEach((f, k) => {
      const name = renamed[k] as string;
      if (name !== f.name) {
        f.title = f.name;
        f.name = name;
      }
    });
    changed.push(resource.path);
  }
  pkg.names = { style: 'syntactic', note: 'Column names were rewritten so that R and pandas accept them unquoted (letters, digits and _); each renamed field keeps the name lexichron writes by default as its title.' };
  await writeFileAtomic(pkgPath, JSON.stringify(pkg, null, 2) + '\n');
  changed.push('datapackage.json');
  return changed;
}
