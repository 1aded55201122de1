import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { formatFeatures, loadPosMap, PosMap } from '../../src/tables/load-pos-map.js';
import { TableError } from '../../src/tables/load-table.js';

// The 17 Universal POS tags of UD v2 (universaldependencies.org/u/pos/).
const universal = ['ADJ', 'ADP', 'ADV', 'AUX', 'CCONJ', 'DET', 'INTJ', 'NOUN', 'NUM', 'PART', 'PRON', 'PROPN', 'PUNCT', 'SCONJ', 'SYM', 'VERB', 'X'];

describe('POS maps', () => {
  it('prefers a whole tag to a pattern, and a longer pattern to a shorter one', () => {
    const map = new PosMap();
    map.addTag('*', 'X');
    map.addTag('N*', 'NOUN');
    map.addTag('NPR*', 'PROPN');
    map.addTag('NUM', 'NUM');
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
    writeFileSync(path, 'tag NN NOUN\nVB verb\n');
    expect(() => loadPosMap(path)).toThrow(TableError);
    try {
      loadPosMap(path);
    } catch (error) {
      expect((error as TableError).diagnostics[0]).toMatchObject({ line: 2, column: 4, message: '"verb" is not one of the 17 Universal POS tags' });
    }
  });

  it('reads the older two-column lines as tag lines', () => {
    const map = loadPosMap('old.pos', 'NN NOUN\nNNS NOUN Number=Plur\n');
    expect(map.classify({ pos: 'NNS', form: 'gulls', lemma: undefined, relation: 'obj' })).toEqual({ upos: 'NOUN', feats: new Map([['Number', 'Plur']]) });
  });

  it('adds the features of every feature line a tag matches to those of its tag line', () => {
    const map = loadPosMap('t.pos', 'tag NS-* NOUN Number=Plur\nfeature *-D Case=Dat\nfeature *-G Case=Gen\n');
    const word = (pos: string) => map.classify({ pos, form: 'x', lemma: undefined, relation: 'obl' });
    expect(word('NS-D')).toEqual({ upos: 'NOUN', feats: new Map([['Number', 'Plur'], ['Case', 'Dat']]) });
    expect(formatFeatures(word('NS-G').feats)).toBe('Case=Gen|Number=Plur');
  });

  it('decides by the relation what the tag alone cannot: an auxiliary, a complementiser, a pronoun (UD v2 English, from memory)', () => {
    const map = loadPosMap('en-ptb');
    const word = (pos: string, form: string, relation: string) => map.classify({ pos, form, lemma: undefined, relation }).upos;
    expect(word('VBZ', 'is', 'cop')).toBe('AUX');
    expect(word('VBZ', 'sails', 'root')).toBe('VERB');
    expect(word('IN', 'because', 'mark')).toBe('SCONJ');
    expect(word('IN', 'in', 'case')).toBe('ADP');
    expect(word('DT', 'that', 'nsubj')).toBe('PRON');
    expect(word('DT', 'the', 'det')).toBe('DET');
    expect(formatFeatures(map.classify({ pos: 'DT', form: 'The', lemma: undefined, relation: 'det' }).feats)).toBe('Definite=Def|PronType=Art');
    expect(word('RB', "n't", 'advmod')).toBe('PART');
  });

  it('undoes the bracket escapes of the scheme, inside words too', () => {
    const map = loadPosMap('en-ptb');
    expect(['-LRB-', '-LRB-a-RRB-', 'well-known', '-RSB-'].map((form) => map.unescape(form))).toEqual(['(', '(a)', 'well-known', ']']);
  });

  it('writes features sorted by name, case aside (UD v2 format, CHECK-VALUES §9)', () => {
    expect(formatFeatures(new Map([['VerbForm', 'Fin'], ['Case', 'Nom'], ['abbr', 'Yes'], ['Number[psor]', 'Sing']]))).toBe('abbr=Yes|Case=Nom|Number[psor]=Sing|VerbForm=Fin');
  });

  it('reports a table that builds on itself', () => {
    const dir = mkdtempSync(join(tmpdir(), 'treebridge-pos-'));
    const path = join(dir, 'loop.pos');
    writeFileSync(path, 'builds-on loop.pos\n');
    expect(() => loadPosMap(path)).toThrow(/build on each other in a circle/);
  });
});
