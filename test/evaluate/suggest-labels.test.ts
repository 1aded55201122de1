// The label-table learner on made-up attachments whose relations follow rules we know: a rule per
// dependent label, refined by the phrase and side where the data shows a difference, role rules for
// coordination and punctuation, written most specific first so that the table labels as learned.
import { describe, expect, it } from 'vitest';
import { learnLabels, writeLearnedLabels } from '../../src/evaluate/suggest-labels.js';
import { compileLabelTable } from '../../src/tables/load-table.js';
import type { LabelContext } from '../../src/tables/table-model.js';

type Sample = Parameters<typeof learnLabels>[0][number];
const many = (n: number, sample: Sample): Sample[] => Array.from({ length: n }, () => ({ ...sample }));
const attach = (dependent: string, parent: string, head: string, side: 'left' | 'right', relation: string, role: LabelContext['role'] = 'other'): Sample => ({
  dependent,
  parent,
  head,
  side,
  role,
  relation,
});

const samples = [
  ...many(40, attach('NP-SBJ', 'S', 'VP', 'left', 'nsubj')),
  ...many(60, attach('NP-', 'VP', 'VBD', 'right', 'obj')),
  // A noun phrase inside a noun phrase is a modifier, not an object.
  ...many(20, attach('NP-', 'NP', 'NN', 'right', 'nmod')),
  // A noun phrase before a number is a compound of it.
  ...many(8, attach('NP-', 'VP', 'CD', 'right', 'compound')),
  ...many(30, attach('CC-', 'NP', 'NP', 'left', 'cc', 'coordinator')),
  ...many(25, attach(',-', 'S', 'VP', 'right', 'punct', 'punctuation')),
  ...many(70, attach('DT-', 'NP', 'NN', 'left', 'det')),
];

describe('learning a label table from gold relations', () => {
  const learned = learnLabels(samples, 10);

  it('labels every made-up attachment as its rule says', () => {
    expect(learned.right).toBe(samples.length);
  });

  it('writes role rules, then refinements, then one rule per dependent label, then otherwise', () => {
    const text = writeLearnedLabels('made-up', learned);
    const rules = text.split('\n').filter((line) => line.startsWith('label ') || line.startsWith('otherwise '));
    expect(rules).toEqual([
      'label cc role=coordinator',
      'label punct role=punctuation',
      'label compound dependent=NP- parent=VP side=right head=CD',
      'label nmod dependent=NP- parent=NP side=right',
      'label nsubj dependent=NP-SBJ',
      'label obj dependent=NP-',
      'otherwise det',
    ]);
  });

  it('writes a table that loads and gives each attachment the learned relation (NP- is NP without function tags)', () => {
    const table = compileLabelTable(writeLearnedLabels('made-up', learned));
    const label = (sample: Sample) => {
      const candidate = (text: string) => {
        const [category, ...functions] = text.replace(/-$/, '').split('-');
        return { category: category!, functions: functions.filter(Boolean) };
      };
      const context: LabelContext = {
        dependent: candidate(sample.dependent),
        head: candidate(sample.head),
        parent: candidate(sample.parent),
        children: [],
        word: { pos: 'X', form: 'x', lemma: undefined },
        side: sample.side,
        role: sample.role,
      };
      return table.rules.find((rule) => rule.conditions.every((c) => c.test(context)))?.relation ?? table.otherwise;
    };
    for (const sample of samples) expect(label(sample)).toBe(sample.relation);
    // An NP with a function tag is not caught by the rule for tagless NPs.
    expect(label(attach('NP-TMP', 'VP', 'VBD', 'right', '?'))).toBe('det');
  });
});
