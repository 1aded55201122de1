import { describe, expect, it } from 'vitest';
import { scoreHeads } from '../../src/api/evaluate.js';
import { readConlluText } from '../../src/formats/conllu/read-conllu.js';
import { writeScoreReport } from '../../src/report/write-score-report.js';
import { read } from '../support/read.js';

// Invented sentences. The gold makes "keeper" head of the subject phrase; a table whose noun
// phrase block takes the determiner gets it wrong.
const trees = read('( (S (NP-SBJ (DT The) (NN keeper)) (VP (VBD slept))) (ID k.1))\n( (S (NP-SBJ (NNS Gulls)) (VP (VBD circled))) (ID k.2))\n').trees;
const gold = readConlluText(
  [
    '# sent_id = k.1',
    '1\tThe\tthe\tDET\tDT\t_\t2\tdet\t_\t_',
    '2\tkeeper\tkeeper\tNOUN\tNN\t_\t3\tnsubj\t_\t_',
    '3\tslept\tsleep\tVERB\tVBD\t_\t0\troot\t_\t_',
    '',
    '# sent_id = k.2',
    '1\tGulls\tgull\tNOUN\tNNS\t_\t2\tnsubj\t_\t_',
    '2\tcircled\tcircle\tVERB\tVBD\t_\t0\troot\t_\t_',
    '',
    '',
  ].join('\n'),
  { file: 'k.conllu' },
  () => undefined,
);

describe('the head table tuning page', () => {
  it('draws each sentence with wrong heads once, the wrong choice marked in the bracketing, wrong and missed arcs marked', async () => {
    const { loadHeadTable } = await import('../../src/tables/load-table.js');
    const heads = loadHeadTable('determiners-first.heads', 'table determiners-first\nbuilds-on en-content\n\n# Noun phrase: the determiner.\nhead NP\n  left any DT\n');
    const score = await scoreHeads(trees, gold, { heads, samples: 10 });
    expect(score.samples.map((sample) => sample.id)).toEqual(['k.1']);
    const [sample] = score.samples;
    expect(sample!.choices).toEqual([expect.objectContaining({ label: 'NP-SBJ', start: 0, end: 2, chosen: 'DT "The"', better: 'NN "keeper"' })]);
    const page = writeScoreReport(score, heads.name, score.pairing);
    expect(page.match(/<rect class="bar wrong"/g)).toHaveLength(1);
    expect(page.match(/<path class="arc changed"/g)?.length).toBeGreaterThan(0);
    expect(page.match(/<path class="arc missed"/g)?.length).toBe(page.match(/<path class="arc changed"/g)?.length);
    // The step that chose is shown as the table writes it.
    expect(page).toContain('<td class="step">NP (line 6): left any DT</td>');
    // Every link inside the page has its target.
    const targets = new Set([...page.matchAll(/ id="([^"]+)"/g)].map((m) => m[1]));
    const links = [...page.matchAll(/href="#([^"]+)"/g)].map((m) => m[1]);
    expect(links.length).toBeGreaterThan(0);
    expect(links.filter((link) => !targets.has(link))).toEqual([]);
    expect(page).not.toMatch(/<script|<link|src=/);
  });
});
