/** The result of removing a person from a JSON document. */
export interface JsonRemoval {
  value: unknown;
  /** Array elements and object keys removed. */
  removed: number;
  /** True when the document as a whole is about the person (a top-level object whose `person` is one of the ids). */
  wholeDocument: boolean;
}

/**
 * Removes a person from a JSON document such as a summary, a sidecar or a manifest, wherever it is listed:
 * array elements that are one of `ids` or objects whose `person` is one of them, and object keys that
 * are one of them (objects keyed by person). Everything else is kept as it was.
 */
export function removePersonFromJson(value: unknown, ids: ReadonlySet<string>): JsonRemoval {
  let removed = 0;
  const visit = (node: unknown): unknown => {
    if (Array.isArray(node)) {
      const kept: unknown[] = [];
      for (const element of node) {
        if (typeof element === 'string' && ids.has(element)) removed++;
        else if (isPersonObject(element, ids)) removed++;
        else kept.push(visit(element));
      }
      return kept;
    }
    if (node !== null && typeof node === 'object') {
      const out: Record<string, unknown> = {};
      for (const [key, child] of Object.entries(node as Record<string, unknown>)) {
        if (ids.has(key)) removed++;
        else out[key] = visit(child);
      }
      return out;
    }
    return node;
  };
  if (isPersonObject(value, ids)) return { value, removed: 1, wholeDocument: true };
  return { value: visit(value), removed, wholeDocument: false };
}

function isPersonObject(node: unknown, ids: ReadonlySet<string>): boolean {
  if (node === null || typeof node !== 'object' || Array.isArray(node)) return false;
  const person = (node as { person?: unknown }).person;
  return typeof person === 'string' && ids.has(person);
}
