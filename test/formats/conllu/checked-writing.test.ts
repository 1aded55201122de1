import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { unwritableSentenceReason, writeCheckedSentence } from '../../../src/formats/conllu/write-conllu.js';
import type { DependencySentence } from '../../../src/model/dependency.js';

// Column values drawn from the characters that matter to the format: tabs, line breaks, spaces, empties.
const value = fc.string({ unit: fc.constantFrom('a', 'B', '_', '1', ' ', '\t', '\n', '\r', '='), maxLength: 4 });
const line = fc.record({ id: value, form: value, lemma: value, upos: value, xpos: value, feats: value, head: value, deprel: value, deps: value, misc: value });
const sentence = fc.record({ comments: fc.array(value, { maxLength: 2 }), lines: fc.array(line, { minLength: 1, maxLength: 3 }) }).map(
  ({ comments, lines }): DependencySentence => ({
    type: 'dependency-sentence',
    comments: comments.map((text) => ({ type: 'comment', text })),
    lines: lines.map((columns) => ({ type: 'word', ...columns })) as DependencySentence['lines'],
  }),
);

describe('writing a sentence with its check', () => {
  it('refuses exactly the sentences the column by column check refuses, with its reason', () => {
    fc.assert(
      fc.property(sentence, (s) => {
        const checked = writeCheckedSentence(s);
        const reason = unwritableSentenceReason(s);
        expect('problem' in checked ? checked.problem : undefined).toBe(reason);
      }),
      { numRuns: 3000 },
    );
  });
});
