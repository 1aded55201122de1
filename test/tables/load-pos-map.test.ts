import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadPosMap, PosMap } from '../../src/tables/load-pos-map.js';
import { TableError } from '../../src/tables/load-table.js';

// The 17 Universal POS tags of UD v2 (universaldependencies.org/u/pos/).
const universal = ['ADJ', 'ADP', 'ADV', 'AUX', 'CCONJ', 'DET', 'INTJ', 'NOUN', 'NUM', 'PART', 'PRON', 'PROPN', 'PUNCT', 'SCONJ', 'SYM', 'VERB', 'X'];

describe('POS maps', () => {
  it('prefers a whole tag to a pattern, and a longer pattern to a shorter one', () => {
    const map = new PosMap();
    map.add('*', 'X');
    map.add('N*', 'NOUN');
    map.add('NPR*', 'PROPN');
    map.add('NUM', 'NUM');
    expect(['N-A', 'NPR-G', 'NUM', 'NUMP', 'VBD'].map((tag) => map.get(tag))).toEqual(['NOUN', 'PROPN', 'NUM', 'NOUN', 'X']);
  });

  it('gives a Universal POS tag for the tags of both shipped maps', () => {
    for (const [name, tags] of [
      ['en-ptb', ['NN', 'VBD', 'IN', '.']],
      ['penn-historical', ['N-N', 'NS-G', 'VBDI', 'BEPI', 'ONE+Q', 'C', 'CONJ', 'N21', '.']],
    ] as const) {
      const map = loadPosMap(name);
      for (const tag of tags) expect(universal, `${name}: ${tag}`).toContain(map.get(tag));
    }
    expect(loadPosMap('penn-historical').get('C')).toBe('SCONJ');
    expect(loadPosMap('penn-historical').get('CONJ')).toBe('CCONJ');
  });

  it('reports a malformed line with its position', () => {
    const dir = mkdtempSync(join(tmpdir(), 'treebridge-pos-'));
    const path = join(dir, 'bad.pos');
    writeFileSync(path, 'NN NOUN\nVB verb\n');
    expect(() => loadPosMap(path)).toThrow(TableError);
    try {
      loadPosMap(path);
    } catch (error) {
      expect((error as TableError).diagnostics[0]).toMatchObject({ line: 2, column: 1 });
    }
  });
});
