/** One field of a table resource in datapackage.json. */
interface PackageField {
  name?: unknown;
  title?: unknown;
}

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** `a/./b\\c` → `a/b/c`: a resource path compared as written in the package. */
const normalPath = (path: string): string => path.replace(/\\/g, '/').split('/').filter((p) => p !== '' && p !== '.').join('/');

/**
 * The names lexichron writes by default for the columns of one of its own CSV outputs, given the
 * output folder's data package (parsed datapackage.json) and the file's path relative to the
 * package's folder. When the folder was written with `--names syntactic`, the package says so
 * (`names.style` = `syntactic`) and keeps each renamed field's original name as its `title`
 * (see applySyntacticNames): each header name that is such a field's name becomes its title
 * (`afinn_165_valence` → `afinn-165.valence`). Every other name, and every header when the package
 * does not describe the file or was not written with bare names, is returned unchanged.
 */
export function lexichronColumnNames(dataPackage: unknown, file: string, header: readonly string[]): string[] {
  if (!isObject(dataPackage) || !isObject(dataPackage.names) || dataPackage.names.style !== 'syntactic') return [...header];
  const wanted = normalPath(file);
  const resource = (Array.isArray(dataPackage.resources) ? dataPackage.resources : []).find((r): r is Record<string, unknown> => isObject(r) && typeof r.path === 'string' && normalPath(r.path) === wanted);
  const fields = isObject(resource?.schema) && Array.isArray(resource.schema.fields) ? (resource.schema.fields as PackageField[]) : [];
  const original = new Map<string, string>();
  for (const f of fields) if (isObject(f) && typeof f.name === 'string' && typeof f.title === 'string' && f.title !== '') original.set(f.name, f.title);
  return header.map((name) => original.get(name) ?? name);
}
