/** The result of removing a person from a JSON document. */
export interface JsonRemoval {
  value: unknown;
  /** Array elements and object keys removed. */
  removed: number;
  /** True when the document as a whole is about the person (a top-level object whose `person` is one of the ids). */
  wholeDocument: boolean;
}

/**
 * Removes a person from a JSON document such as a summary, a sidecar or a manifest, wherever a
 * person value names them: objects whose `person` is one of `ids` (dropped from their array or,
 * as a member, from their object), and, inside a member named `persons`, string elements of a list
 * and keys of an object. A key or string anywhere else is not a person value (a column, a stage,
 * a file name) and is kept even when it equals the id. Everything else is kept as it was.
 */
export function removePersonFromJson(value: unknown, ids: ReadonlySet<string>): JsonRemoval {
  let removed = 0;
  const visit = (node: unknown, persons: boolean): unknown => {
    if (Array.isArray(node)) {
      const kept: unknown[] = [];
      for (const element of node) {
        if (persons && typeof element === 'string' && ids.has(element)) removed++;
        else if (isPersonObject(element, ids)) removed++;
        else kept.push(visit(element, false));
      }
      return kept;
    }
    if (node !== null && typeof node === 'object') {
      const out: Record<string, unknown> = {};
      for (const [key, child] of Object.entries(node as Record<string, unknown>)) {
        if ((persons && ids.has(key)) || isPersonObject(child, ids)) removed++;
        else out[key] = visit(child, key === 'persons');
      }
      return out;
    }
    return node;
  };
  if (isPersonObject(value, ids)) return { value, removed: 1, wholeDocument: true };
  return { value: visit(value, false), removed, wholeDocument: false };
}

function isPersonObject(node: unknown, ids: ReadonlySet<string>): boolean {
  if (node === null || typeof node !== 'object' || Array.isArray(node)) return false;
  const person = (node as { person?: unknown }).person;
  return typeof person === 'string' && ids.has(person);
}
