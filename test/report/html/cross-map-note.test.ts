import { describe, expect, it } from 'vitest';
import { crossMapNote } from '../../../src/report/html/cross-map-note.js';

describe('crossMapNote', () => {
  it('counts the directions with evidence of driving against those tested, and the same-bin ones', () => {
    const note = crossMapNote({
      tables: [
        { title: 'dynamics/dynamics-ccm.csv', columns: ['person', 'verdict'], rows: [['a', 'drives'], ['a', 'no_evidence'], ['b', 'same_bin'], ['c', '']] },
      ],
    });
    expect(note).toContain('Cross mapping: 1 of 3 tested directions show evidence');
    expect(note).toContain('1 more peak at lag 0 or later');
  });

  it('says nothing when cross mapping did not run', () => {
    expect(crossMapNote({ tables: [{ title: 'dynamics-persons.csv', columns: ['person'], rows: [['a']] }] })).toBeUndefined();
  });
});
