import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readConllu, readConlluText } from '../../../src/formats/conllu/read-conllu.js';
import { writeSentence } from '../../../src/formats/conllu/write-conllu.js';
import type { DependencySentence } from '../../../src/model/dependency.js';
import { projectRoot } from '../../support/corpora.js';

// Our own sentences written after the examples of the UD v2 format specification
// (CHECK-VALUES §6): a multiword token, an empty node, SpaceAfter=No.
const fixture = readFileSync(join(projectRoot, 'test/fixtures/conllu/harbour.conllu'), 'utf8');

describe('reading CoNLL-U', () => {
  const problems: unknown[] = [];
  const sentences = readConlluText(fixture, { file: 'harbour.conllu' }, (d) => problems.push(d));

  it('reads every sentence with its comments in order and its sent_id', () => {
    expect(problems).toEqual([]);
    expect(sentences.map((s) => s.id)).toEqual(['harbour-c1', 'harbour-c2', 'harbour-c3']);
    expect(sentences[0]!.comments.map((c) => c.text)).toEqual([' sent_id = harbour-c1', " text = The gulls don't leave."]);
  });

  it('tells words, multiword tokens and empty nodes apart, keeping every column as written', () => {
    expect(sentences[0]!.lines.map((l) => `${l.type}:${l.id}`)).toEqual([
      'word:1', 'word:2', 'multiword:3-4', 'word:3', 'word:4', 'word:5', 'word:6',
    ]);
    const empty = sentences[1]!.lines.find((l) => l.type === 'empty-node')!;
    expect(empty).toMatchObject({ id: '5.1', form: 'sailed', head: '_', deprel: '_', deps: '2:conj:and', misc: 'CopyOf=2' });
  });

  it('writes back the same bytes', () => {
    expect(sentences.map(writeSentence).join('')).toBe(fixture);
  });

  it('gives the same sentences however the input is cut into pieces', async () => {
    for (const size of [1, 3, 17]) {
      const pieces: string[] = [];
      for (let i = 0; i < fixture.length; i += size) pieces.push(fixture.slice(i, i + size));
      const again: DependencySentence[] = [];
      for await (const sentence of readConllu(pieces, { file: 'harbour.conllu' }, () => undefined)) again.push(sentence);
      expect(again.map(writeSentence).join('')).toBe(fixture);
      expect(again.map((s) => s.position)).toEqual(sentences.map((s) => s.position));
    }
  });

  it('locates every line: the empty node of the second sentence is on line 18', () => {
    const empty = sentences[1]!.lines.find((l) => l.type === 'empty-node')!;
    expect(sentences[1]!.source!.pointAt(empty.position!.start)).toMatchObject({ line: 18, column: 1 });
  });
});
