import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Diagnostic } from '../../../src/diagnostics/diagnostic.js';
import { readBracketedText } from '../../../src/formats/bracketed/read-bracketed.js';
import { writeTree } from '../../../src/traces/write-tree.js';
import { readXmlGraphText } from '../../../src/formats/xml-graph/read-xml-graph.js';
import { writeXmlSentence, xmlDocumentEnd, xmlDocumentStart } from '../../../src/formats/xml-graph/write-xml-graph.js';
import { resolveTraces } from '../../../src/traces/resolve-traces.js';
import type { Phrase, Preterminal, Tree } from '../../../src/model/constituency.js';
import { countDiscontinuousPhrases, terminalsInOrder } from '../../../src/model/terminal-order.js';
import { projectRoot } from '../../support/corpora.js';
import { expectFixture } from '../../support/fixtures.js';

const fixtures = join(projectRoot, 'test/fixtures');

function read(text: string): { trees: Tree[]; problems: Diagnostic[] } {
  const problems: Diagnostic[] = [];
  const trees = readXmlGraphText(text, { file: 'graphs.xml' }, (d) => problems.push(d));
  return { trees, problems };
}

function writeAll(trees: Tree[]): string {
  return xmlDocumentStart() + trees.map((tree, i) => writeXmlSentence(tree, i + 1)).join('') + xmlDocumentEnd();
}

const words = (tree: Tree) => terminalsInOrder(tree).map((t) => (t.type === 'preterminal' ? t.word.form : `[${t.type}]`)).join(' ');

describe('reading the XML graph encoding', () => {
  const { trees, problems } = read(readFileSync(join(fixtures, 'xml-graph/ferry-graphs.xml'), 'utf8'));

  it('reads every sentence of the hand-written fixture, noting the names that look like object properties', () => {
    expect(problems.map((p) => `${p.code} ${p.line}:${p.column}`)).toEqual([
      'xml-object-name 12:7',
      'xml-object-name 44:3',
      'xml-object-name 46:7',
      'xml-object-name 50:7',
      'xml-object-name 51:9',
    ]);
    expect(trees.map((t) => t.id)).toEqual(['ferry.1', 'ferry.2']);
    expect(words(trees[0]!)).toBe('A ferry arrived that nobody expected .');
  });

  it('holds an extraposed relative clause as one discontinuous noun phrase', () => {
    const tree = trees[0]!;
    expect(tree.discontinuous).toBe(true);
    const s = tree.children[0] as Phrase;
    const np = s.children[0] as Phrase;
    expect(np.label).toMatchObject({ category: 'NP', functions: ['SBJ'] });
    expect(np.children.map((c) => (c.type === 'phrase' ? c.label.category : (c as Preterminal).word.form))).toEqual(['A', 'ferry', 'SBAR']);
    expect(countDiscontinuousPhrases(tree)).toBe(1);
  });

  it('keeps attributes, lemmas and secondary edges', () => {
    const tree = trees[0]!;
    const ferry = terminalsInOrder(tree)[1] as Preterminal;
    expect(ferry.word.lemma).toBe('ferry');
    expect([...ferry.attributes!]).toEqual([['morph', 'sg'], ['__proto__', 'polluted']]);
    expect(tree.attributes && [...tree.attributes]).toEqual([['source', 'log']]);
    expect(tree.graphAttributes && [...tree.graphAttributes]).toEqual([['discontinuous', 'true']]);
    expect(tree.secondaryEdges).toHaveLength(1);
    const edge = tree.secondaryEdges![0]!;
    expect(edge.label).toBe('OB');
    expect((edge.from as Preterminal).word.form).toBe('expected');
    expect((edge.to as Phrase).label.category).toBe('NP');
  });

  it('lets ids and attribute names such as __proto__ and constructor change no prototype', () => {
    expect(words(trees[1]!)).toBe('Gulls circled');
    expect((trees[1]!.children[0] as Phrase).xmlId).toBe('constructor');
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(Object.getPrototypeOf(trees[0]!.attributes)).toBe(Map.prototype);
  });

  it('writes what it read, and reads what it wrote, the same (read → write identity)', () => {
    const written = writeAll(trees);
    const again = read(written);
    expect(again.problems.filter((p) => p.code !== 'xml-object-name')).toEqual([]);
    expect(writeAll(again.trees)).toBe(written);
    expect(written).toContain('__proto__="polluted"');
    expect(written).toContain('<graph root="f1_p1" discontinuous="true">');
    expect(written).toContain('<secedge label="OB" idref="f1_p2"/>');
    expect(written).toContain('<t id="__proto__" word="Gulls" pos="NNS"/>');
  });

  it('writes a discontinuous tree as a bracketing with an *ICH* trace, and reads the trace back to the same graph', () => {
    const bracketed = writeTree(trees[0]!);
    expect(bracketed).toBe(
      '( (S (NP-SBJ (DT A-a) (NN ferry-ferry) (-NONE- *ICH*-1)) (VP (VBD arrived-arrive)) (SBAR-1 (WDT that-that) (NN-SBJ nobody-nobody) (VBD expected-expect)) (. .-.)) (ID ferry.1))\n',
    );
    const [back] = readBracketedText(bracketed, { splitLemmas: true }, () => undefined);
    const resolved = resolveTraces(back!).tree;
    expect(countDiscontinuousPhrases(resolved)).toBe(1);
    expect(words(resolved)).toBe(words(trees[0]!));
  });
});

describe('writing the XML graph encoding', () => {
  // Fixture pair: UPDATE=1 rewrites it after an intended change, and fails with the diff to review.
  it('matches the expected file for the historical-style fixture with traces resolved', () => {
    const trees = readBracketedText(readFileSync(join(fixtures, 'bracketed/historical-style.psd'), 'utf8'), { splitLemmas: true }, () => undefined);
    const written = writeAll(trees.map((tree) => resolveTraces(tree).tree));
    const expectedPath = join(fixtures, 'xml-graph/historical-style.resolved.xml');
    expectFixture(expectedPath, written);
    const again = read(written);
    expect(again.problems.filter((p) => p.severity === 'error')).toEqual([]);
    expect(again.trees).toHaveLength(trees.length);
    expect(writeAll(again.trees)).toBe(written);
  });

  it('keeps empty elements, notes and the outer wrapper through a bracketed → XML → bracketed trip', () => {
    const text = readFileSync(join(fixtures, 'bracketed/historical-style.psd'), 'utf8');
    const trees = readBracketedText(text, { splitLemmas: true }, () => undefined);
    const back = read(writeAll(trees)).trees;
    expect(back.map((t) => writeTree(t))).toEqual(trees.map((t) => writeTree(t)));
  });
});
