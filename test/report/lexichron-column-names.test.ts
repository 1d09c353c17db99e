import { describe, expect, it } from 'vitest';
import { lexichronColumnNames } from '../../src/report/lexichron-column-names.js';
import { syntacticNames } from '../../src/report/syntactic-names.js';

const pkg = (style: string | undefined, path = 'series-long.csv') => ({
  ...(style ? { names: { style } } : {}),
  resources: [{ path, schema: { fields: [{ name: 'person' }, { name: 'afinn_165_valence', title: 'afinn-165.valence' }, { name: 'vader_compound_within_lag1', title: 'vader.compound.within_lag1' }] } }],
});

describe('lexichronColumnNames', () => {
  it('maps each renamed column back to the original name the data package keeps as its title', () => {
    expect(lexichronColumnNames(pkg('syntactic'), 'series-long.csv', ['person', 'afinn_165_valence', 'vader_compound_within_lag1'])).toEqual(['person', 'afinn-165.valence', 'vader.compound.within_lag1']);
  });

  it('finds the file by its path in the package, written with ./ or not', () => {
    expect(lexichronColumnNames(pkg('syntactic', './validation/validation-pairs.csv'), 'validation/validation-pairs.csv', ['afinn_165_valence'])).toEqual(['afinn-165.valence']);
  });

  it('leaves the header as it is when the package was not written with bare names, or does not describe the file', () => {
    const header = ['person', 'afinn_165_valence'];
    expect(lexichronColumnNames(pkg(undefined), 'series-long.csv', header)).toEqual(header);
    expect(lexichronColumnNames(pkg('syntactic'), 'scores.csv', header)).toEqual(header);
    expect(lexichronColumnNames(undefined, 'series-long.csv', header)).toEqual(header);
    expect(lexichronColumnNames({ names: { style: 'syntactic' }, resources: 'none' }, 'series-long.csv', header)).toEqual(header);
  });

  it('undoes syntacticNames for any list of names, repeats and reserved words included (fuzz, seeded)', () => {
    let seed = 7;
    const next = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    const alphabet = 'ab.-_1@ ';
    for (let round = 0; round < 300; round++) {
      const names = [...new Set(Array.from({ length: 1 + Math.floor(next() * 6) }, () => Array.from({ length: 1 + Math.floor(next() * 6) }, () => alphabet[Math.floor(next() * alphabet.length)]).join('')))];
      const bare = syntacticNames(names);
      const fields = names.map((n, k) => (bare[k] === n ? { name: n } : { name: bare[k], title: n }));
      expect(lexichronColumnNames({ names: { style: 'syntactic' }, resources: [{ path: 'x.csv', schema: { fields } }] }, 'x.csv', bare), names.join('|')).toEqual(names);
    }
  });
});
