/** Words R does not accept as a bare name. */
const R_RESERVED = new Set(['if', 'else', 'repeat', 'while', 'function', 'for', 'next', 'break', 'TRUE', 'FALSE', 'NULL', 'Inf', 'NaN', 'NA', 'NA_integer_', 'NA_real_', 'NA_character_', 'in']);

/**
 * Column names that R and pandas accept unquoted (letters, digits and `_`, starting with a
 * letter, no R reserved word): every other character becomes `_` (`afinn-165.valence` →
 * `afinn_165_valence`, `vader.compound@3` → `vader_compound_3`), a name that does not start with
 * a letter gets an `x` in front, a reserved word gets a trailing `_`, and a name that would repeat
 * an earlier one gets `_2`, `_3`, …. Returns the new names in the order given.
 */
export function syntacticNames(names: readonly string[]): string[] {
  const used = new Set<string>();
  return names.map((name) => {
    let base = name.replace(/[^A-Za-z0-9_]+/g, '_').replace(/_+$/g, '');
    if (!/^[A-Za-z]/.test(base)) base = `x${base}`;
    if (R_RESERVED.has(base)) base = `${base}_`;
    let out = base;
    for (let k = 2; used.has(out); k++) out = `${base}_${k}`;
    used.add(out);
    return out;
  });
}
