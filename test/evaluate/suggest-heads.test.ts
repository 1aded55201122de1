// The head-table learner on made-up phrases whose gold heads follow rules we know, so that what it
// learns can be checked: lists for kinds of phrase (function tags of the phrase's own label),
// guards on function words, and the table text it writes, which must decide as the learner predicted.
import { describe, expect, it } from 'vitest';
import { learnBlock, writtenSteps, writeSuggestedTable } from '../../src/evaluate/suggest-heads.js';
import { chooseFrom } from '../../src/convert/find-heads.js';
import { compileHeadTable, loadHeadTable } from '../../src/tables/load-table.js';
import type { Candidate } from '../../src/tables/label-pattern.js';

const child = (label: string, form = 'x'): Candidate => {
  const [category, ...functions] = label.split('-');
  return { category: category!, functions, headWord: { pos: category!, form, lemma: undefined } };
};
const phrase = (label: string, children: Candidate[], gold: number) => {
  const [category, ...functions] = label.split('-');
  return { parent: { category: category!, functions }, candidates: children, gold };
};
const generic = loadHeadTable('generic');

describe('learning a head block from gold', () => {
  it('gives a kind of phrase that is headed differently a list of its own, written with `for`', () => {
    // Clauses with a subject and a copula: main clauses are headed by the predicate, clauses of
    // direct speech by the subject (as a scheme's UD version may draw them).
    const samples = [
      ...Array.from({ length: 300 }, () => phrase('IP-MAT', [child('NP-SBJ'), child('BE'), child('NP-PRD')], 2)),
      ...Array.from({ length: 200 }, () => phrase('IP-MAT-SPE', [child('NP-SBJ'), child('BE'), child('NP-PRD')], 0)),
      ...Array.from({ length: 300 }, () => phrase('IP-SUB', [child('NP-SBJ'), child('VB'), child('NP-OB1')], 1)),
    ];
    const block = learnBlock('IP', samples, generic);
    expect(block.lists.map((list) => list.functions)).toEqual([['MAT', 'SPE'], []]);
    expect(block.learnedRight).toBe(samples.length);
    const text = writeSuggestedTable('learned', 'generic', 800, [block], []);
    expect(text).toContain('  # IP-MAT-SPE: 200 phrases\n  left each NP for IP-MAT-SPE\n  left first for IP-MAT-SPE\n');
    // The written table decides every phrase as the learner did.
    const table = compileHeadTable(text);
    for (const sample of samples) expect(chooseFrom(sample.candidates, sample.parent, table).child).toBe(sample.gold);
  });

  it('learns a guard on a function word when the word decides the head (a copula before its predicate)', () => {
    const samples = [
      ...Array.from({ length: 200 }, () => phrase('VP', [child('VBZ', 'is'), child('ADJP', 'calm')], 1)),
      ...Array.from({ length: 200 }, () => phrase('VP', [child('VBZ', 'seems'), child('ADJP', 'calm')], 0)),
      ...Array.from({ length: 200 }, (_, i) => phrase('VP', [child('VBZ', `sails${i % 7}`), child('NP', 'boats')], 0)),
    ];
    const block = learnBlock('VP', samples, generic);
    expect(block.learnedRight).toBe(samples.length);
    const steps = writtenSteps(block.lists[0]!.steps);
    expect(steps[0]).toBe('left each ADJP if VBZ[form=is]');
    const table = compileHeadTable(writeSuggestedTable('learned', 'generic', 600, [block], []));
    for (const sample of samples) expect(chooseFrom(sample.candidates, sample.parent, table).child).toBe(sample.gold);
  });

  it('writes steps merged only where that changes nothing', () => {
    expect(
      writtenSteps([
        { category: '*-PRD', end: 'left', guard: 'VBZ[form=is]', hits: 9, misses: 0 },
        { category: '*-PRD', end: 'left', guard: "VBZ[form='s]", hits: 9, misses: 0 },
        { category: '*-PRD', end: 'left', guard: 'VBD[form=was]', hits: 9, misses: 0 },
        { category: 'VP', end: 'left', hits: 9, misses: 0 },
        { category: 'VB', end: 'left', hits: 9, misses: 0 },
        { category: 'NN', end: 'right', hits: 9, misses: 0 },
      ]),
    ).toEqual(["left each *-PRD if VBZ[form=is,'s] VBD[form=was]", 'left each VP VB', 'right each NN']);
  });
});

describe('learning restructuring steps from gold', () => {
  it('switches late conjuncts on for a category whose later clause the gold makes a conjunct of the head', async () => {
    const { suggestHeads } = await import('../../src/api/evaluate.js');
    const { readBracketedText } = await import('../../src/formats/bracketed/read-bracketed.js');
    const { readConlluText } = await import('../../src/formats/conllu/read-conllu.js');
    const clauses = [
      ['ferry', 'waited', 'fog', 'lifted'],
      ['keeper', 'slept', 'gulls', 'cried'],
      ['crew', 'rowed', 'tide', 'turned'],
    ];
    const trees = clauses.map(([a, b, c, d], i) => `( (S (NP-SBJ (NN ${a})) (VP (VBD ${b})) (, ,) (CC but) (S (NP-SBJ (NN ${c})) (VP (VBD ${d})))) (ID late.${i + 1}))`).join('\n');
    const gold = clauses
      .map(([a, b, c, d], i) => [`# sent_id = late.${i + 1}`, `1\t${a}\t_\tNOUN\tNN\t_\t2\tnsubj\t_\t_`, `2\t${b}\t_\tVERB\tVBD\t_\t0\troot\t_\t_`, '3\t,\t_\tPUNCT\t,\t_\t6\tpunct\t_\t_', '4\tbut\t_\tCCONJ\tCC\t_\t6\tcc\t_\t_', `5\t${c}\t_\tNOUN\tNN\t_\t6\tnsubj\t_\t_`, `6\t${d}\t_\tVERB\tVBD\t_\t2\tconj\t_\t_`, ''].join('\n'))
      .join('\n');
    const learned = await suggestHeads(readBracketedText(trees, {}, () => undefined), readConlluText(gold, {}, () => undefined), { base: 'generic', minimumPhrases: 2 });
    expect(learned.text).toContain('\nlate-conjuncts S\n');
    expect(learned.text).toContain('(S 3 (100.0%) of 3)');
    expect(compileHeadTable(learned.text).lateConjuncts).toBeDefined();
  });
});

describe('learning subject raising from gold', () => {
  // UD v2 (from memory): the subject of a small clause under a verb is that verb's object
  // ("made [the ferry wait]"), while a clause with a finite verb keeps its subject.
  it('writes a raise-subject line: the clause and phrase categories, the subject tag, and the finite tags that block it', async () => {
    const { suggestHeads } = await import('../../src/api/evaluate.js');
    const { readBracketedText } = await import('../../src/formats/bracketed/read-bracketed.js');
    const { readConlluText } = await import('../../src/formats/conllu/read-conllu.js');
    const nouns = ['ferry', 'keeper', 'crew', 'gull', 'tide', 'boat'];
    const small = nouns.map((noun, i) => ({
      tree: `( (S (NP-SBJ (NNP Mira)) (VP (VBD made) (S (NP-SBJ (DT the) (NN ${noun})) (VP (VB wait))))) (ID small.${i + 1}))`,
      gold: [`# sent_id = small.${i + 1}`, '1\tMira\t_\tPROPN\tNNP\t_\t2\tnsubj\t_\t_', '2\tmade\t_\tVERB\tVBD\t_\t0\troot\t_\t_', '3\tthe\t_\tDET\tDT\t_\t4\tdet\t_\t_', `4\t${noun}\t_\tNOUN\tNN\t_\t2\tobj\t_\t_`, '5\twait\t_\tVERB\tVB\t_\t2\txcomp\t_\t_', ''].join('\n'),
    }));
    const finite = nouns.map((noun, i) => ({
      tree: `( (S (NP-SBJ (NNP Mira)) (VP (VBD said) (S (NP-SBJ (DT the) (NN ${noun})) (VP (VBD waited))))) (ID finite.${i + 1}))`,
      gold: [`# sent_id = finite.${i + 1}`, '1\tMira\t_\tPROPN\tNNP\t_\t2\tnsubj\t_\t_', '2\tsaid\t_\tVERB\tVBD\t_\t0\troot\t_\t_', '3\tthe\t_\tDET\tDT\t_\t4\tdet\t_\t_', `4\t${noun}\t_\tNOUN\tNN\t_\t5\tnsubj\t_\t_`, '5\twaited\t_\tVERB\tVBD\t_\t2\tccomp\t_\t_', ''].join('\n'),
    }));
    const all = [...small, ...finite];
    const learned = await suggestHeads(
      readBracketedText(all.map((s) => s.tree).join('\n'), {}, () => undefined),
      readConlluText(all.map((s) => s.gold).join('\n'), {}, () => undefined),
      { base: 'generic', minimumPhrases: 3 },
    );
    expect(learned.text).toContain('\nraise-subject S under VP with *-SBJ without VBD\n');
    expect(learned.text).toContain('in 6 of 6 cases');
    // The written table raises the small clause's subject and leaves the finite clause's alone.
    const { arcs } = await import('../support/convert.js');
    const { mkdtempSync, writeFileSync } = await import('node:fs');
    const { join } = await import('node:path');
    const { tmpdir } = await import('node:os');
    const path = join(mkdtempSync(join(tmpdir(), 'treebridge-raise-')), 'learned.heads');
    writeFileSync(path, learned.text);
    expect(arcs(small[0]!.tree, path)).toContain('ferry→made/obj');
    expect(arcs(finite[0]!.tree, path)).not.toContain('ferry→said/obj');
  });
});
