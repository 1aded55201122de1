// POS maps on the shared IcePaHC files (CC BY 4.0): converted with the
// penn-historical map, every word gets one of the 17 Universal POS tags of UD v2
// (universaldependencies.org/u/pos/); the shares go into the issue note.
import { describe, expect, it } from 'vitest';
import { convertTree } from '../../src/convert/convert-tree.js';
import { readBracketedFile } from '../../src/formats/bracketed/read-bracketed.js';
import { loadHeadTable } from '../../src/tables/load-table.js';
import { loadPosMap } from '../../src/tables/load-pos-map.js';
import { corpusFiles } from '../support/corpora.js';

const universal = new Set(['ADJ', 'ADP', 'ADV', 'AUX', 'CCONJ', 'DET', 'INTJ', 'NOUN', 'NUM', 'PART', 'PRON', 'PROPN', 'PUNCT', 'SCONJ', 'SYM', 'VERB', 'X']);

describe('the penn-historical POS map on IcePaHC', () => {
  it('gives every word a Universal POS tag', async () => {
    const settings = { heads: loadHeadTable('penn-historical'), traces: 'keep', coordination: 'first', punctuation: 'phrase', upos: loadPosMap('penn-historical') } as const;
    const counts = new Map<string, number>();
    let words = 0;
    for (const file of corpusFiles('icepahc', '.psd')) {
      for await (const tree of readBracketedFile(file, { splitLemmas: true }, () => undefined)) {
        const converted = convertTree(tree, settings, tree.id ?? '', '');
        for (const line of converted?.sentence.lines ?? []) {
          if (line.type !== 'word') continue; // multiword ranges carry no tag
          words++;
          counts.set(line.upos, (counts.get(line.upos) ?? 0) + 1);
        }
      }
    }
    const shares = [...counts].sort((a, b) => b[1] - a[1]).map(([tag, n]) => `${tag} ${((100 * n) / words).toFixed(2)}%`);
    console.log(`IcePaHC, ${words} words: ${shares.join(', ')}`);
    expect(words).toBeGreaterThan(0);
    expect([...counts.keys()].filter((tag) => !universal.has(tag))).toEqual([]);
  });
});
