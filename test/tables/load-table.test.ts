import { describe, expect, it } from 'vitest';
import { compileHeadTable, compileLabelTable, loadHeadTable, loadLabelTable, TableError } from '../../src/tables/load-table.js';

function problems(compile: () => unknown): string[] {
  try {
    compile();
  } catch (error) {
    if (error instanceof TableError) return error.diagnostics.map((d) => `${d.code}@${d.line}:${d.column}: ${d.message}`);
    throw error;
  }
  return [];
}

describe('the table language', () => {
  it('reads blocks of steps with patterns, wildcards, function tags, head-word tests and guards', () => {
    const table = compileHeadTable(
      ['table test', '# the verb phrase', 'head VP', '  left each VP *-PRD', '  left any S if VB*[form=is,was]', '  left any VB* MD', 'head *', '  right first'].join('\n'),
    );
    expect(table.name).toBe('test');
    expect(table.blocks.get('VP')!.steps.map((s) => [s.end, s.mode, s.written, s.guards.length])).toEqual([
      ['left', 'each', ['VP', '*-PRD'], 0],
      ['left', 'any', ['S'], 1],
      ['left', 'any', ['VB*', 'MD'], 0],
    ]);
    expect(table.fallback.steps[0]).toMatchObject({ end: 'right', mode: 'first' });
  });

  it('skips a step with `unless` when a child matches', async () => {
    const { headOf } = await import('../support/convert.js');
    expect(headOf('(NP (NNP Mira) (NNP Holm))', 'en-content')).toBe('Mira');
    expect(headOf('(NP (DT the) (NNP Holm) (NNP Ferry))', 'en-content')).toBe('Ferry');
  });

  it('applies a step with `for` only to phrases whose own label matches, and explains it', async () => {
    const { chooseFrom, candidateOf } = await import('../../src/convert/find-heads.js');
    const { prepareTree } = await import('../../src/convert/prepare-tree.js');
    const { read } = await import('../support/read.js');
    const table = compileHeadTable(['table t', 'head S', '  left each NP-SBJ for S-SPE *-QUO', '  left any VB*', '  left first'].join('\n'));
    const decide = (text: string) => {
      const root = prepareTree(read(text).trees[0]!, 'keep')!.root;
      if (root.kind !== 'phrase') throw new Error('not a phrase');
      const choice = chooseFrom(root.children.map(candidateOf), root, table);
      return [root.children[choice.child]!.kind === 'phrase' ? 'NP-SBJ' : 'VBD', choice.reason];
    };
    expect(decide('(S-SPE (NP-SBJ (NN keeper)) (VBD said))')).toEqual(['NP-SBJ', 'S (line 3): left each NP-SBJ (for this phrase label) [matched NP-SBJ]']);
    expect(decide('(S-TPC-QUO (NP-SBJ (NN keeper)) (VBD said))')[0]).toBe('NP-SBJ');
    expect(decide('(S (NP-SBJ (NN keeper)) (VBD said))')[0]).toBe('VBD');
  });

  it('refuses a `for` pattern with a head-word test, and a `for` without patterns', () => {
    expect(problems(() => compileHeadTable('table t\nhead S\n  left any VB* for S[pos=VBD]\n'))).toEqual([
      expect.stringMatching(/^table-invalid@3:20: "for" patterns name the labels of the phrase itself/),
    ]);
    expect(problems(() => compileHeadTable('table t\nhead S\n  left any VB* if NP for\n'))).toEqual([expect.stringMatching(/^table-invalid@3:22: "for" needs at least one pattern/)]);
  });

  it('reports a line that is not a statement with its line and column', () => {
    expect(problems(() => compileHeadTable('table t\nhead NP\n  Left any NN\n'))).toEqual([
      expect.stringMatching(/^table-syntax@3:3: /),
    ]);
  });

  it('reports statements that parse but make no sense, each at its word', () => {
    expect(problems(() => compileHeadTable('table t\nhead NP\n  left some NN\n  right first NN\n  left any\n  left each NN[colour=red]\n'))).toEqual([
      'table-invalid@3:8: "some" is not a way to look: each, any, only or first',
      'table-invalid@4:15: "first" takes no patterns',
      'table-invalid@5:8: "any" needs at least one pattern',
      'table-invalid@6:13: "colour" is not a test of a head word: pos, form or lemma',
    ]);
  });

  it('checks the shape of each statement with its schema', () => {
    expect(problems(() => compileHeadTable('table two names\ncoordination-rule other\n'))).toEqual([
      expect.stringMatching(/^table-invalid@1:1: table: /),
      expect.stringMatching(/^table-invalid@2:19: coordination-rule: /),
    ]);
  });

  it('reports a step outside a block and a table it cannot build on', () => {
    expect(problems(() => compileHeadTable('builds-on no-such-table\nleft first\n'))).toEqual([
      expect.stringMatching(/^table-not-found@1:11: cannot build on "no-such-table"/),
      'table-invalid@2:1: a step outside any block; start a block with "head CATEGORY"',
    ]);
  });

  it('builds on another table, replacing only the blocks it gives', () => {
    const table = compileHeadTable('table mine\nbuilds-on en-function\nhead PP\n  left each NP\n');
    expect(table.blocks.get('PP')!.steps[0]!.written).toEqual(['NP']);
    expect(table.blocks.get('VP')!.steps[0]!.written[0]).toBe('TO');
    expect(table.coordinationRule).toBe('collins');
  });

  it('reads label rules with conditions, and checks their keys and values', () => {
    const table = compileLabelTable('table l\nlabel nsubj dependent=*-SBJ side=left\notherwise dep\n');
    expect(table.rules.map((r) => [r.relation, r.conditions.map((c) => c.key)])).toEqual([['nsubj', ['dependent', 'side']]]);
    expect(problems(() => compileLabelTable('label Subject dependent=NP\nlabel obj colour=red\nlabel obj side=up\n'))).toEqual([
      'table-invalid@1:7: "Subject" is not a relation such as nsubj or obl:tmod',
      'table-invalid@2:11: "colour" is not a condition: dependent, head, parent, child, previous, next, pos, form, lemma, side, role',
      'table-invalid@3:11: side is left or right, not "up"',
    ]);
  });

  it('tests a phrase by its children and its neighbours (child=, previous=, next=), head-word tests with commas included', async () => {
    const { convertTree } = await import('../../src/convert/convert-tree.js');
    const { read } = await import('../support/read.js');
    const labels = compileLabelTable(
      'table l\nlabel advcl dependent=SBAR child=IN[form=because,unless]\nlabel ccomp dependent=SBAR\nlabel iobj dependent=NP next=NP\nlabel obj dependent=NP side=right\notherwise dep\n',
    );
    const convert = (text: string) =>
      convertTree(read(text).trees[0]!, { heads: loadHeadTable('en-content'), labels, traces: 'keep', coordination: 'first', punctuation: 'phrase' }, 't', 't')!
        .sentence.lines.map((l) => `${l.form}/${l.deprel}`);
    expect(convert('(S (NP-SBJ (NN keeper)) (VP (VBD gave) (NP (NNS gulls)) (NP (NN bread))))')).toEqual(['keeper/dep', 'gave/root', 'gulls/iobj', 'bread/obj']);
    expect(convert('(S (NP-SBJ (NN keeper)) (VP (VBD stayed) (SBAR (IN because) (S (NP-SBJ (NN fog)) (VP (VBD fell))))))')[4]).toBe('fell/advcl');
    expect(convert('(S (NP-SBJ (NN keeper)) (VP (VBD said) (SBAR (IN that) (S (NP-SBJ (NN fog)) (VP (VBD fell))))))')[4]).toBe('fell/ccomp');
  });

  it('names word lists once (`words NAME …`, growing line by line) and uses them as @NAME in tests and conditions', async () => {
    const { headOf } = await import('../support/convert.js');
    const table = compileHeadTable(['table t', 'words titles Capt. Dr.', 'words titles Skipper', 'head NP', '  left any NNP[form!=@titles] if NNP[form=@titles]', '  left first'].join('\n'));
    const step = table.blocks.get('NP')!.steps[0]!;
    const candidate = (form: string) => ({ category: 'NNP', functions: [], headWord: { pos: 'NNP', form, lemma: undefined } });
    expect([step.patterns[0]!(candidate('Mira')), step.patterns[0]!(candidate('skipper')), step.guards[0]!(candidate('Dr.'))]).toEqual([true, false, true]);
    // The shipped English table: a title's name heads ("Capt. Mira Holm"), a describing word gives way to the last word.
    expect(headOf('(NP (NNP Capt.) (NNP Mira) (NNP Holm))', 'en-content')).toBe('Mira');
    expect(headOf('(NP (NNP North) (NNP Harbour))', 'en-content')).toBe('Harbour');
    const labels = compileLabelTable('table l\nwords ranks Capt.\nlabel nmod:desc form=@ranks\notherwise dep\n');
    expect(labels.rules).toHaveLength(1);
  });

  it('reports an unknown word list and a badly named one at their words', () => {
    expect(problems(() => compileHeadTable('table t\nhead NP\n  left any NNP[form=@nope]\n'))).toEqual([
      'table-invalid@3:12: no word list "nope": define it with words nope WORD…',
    ]);
    expect(problems(() => compileHeadTable('table t\nwords Ranks Capt.\nhead NP\n  left first\n'))).toEqual([
      'table-invalid@2:7: words: a word list is named in lower-case letters, digits and hyphens',
    ]);
    expect(problems(() => compileLabelTable('table t\nwords ranks\notherwise dep\n'))).toEqual(['table-invalid@2:1: words: name the list, then its words']);
  });

  it('switches late conjuncts on for some phrase categories, and off again in a table built on it', () => {
    const on = compileHeadTable('table t\nlate-conjuncts S SINV\nhead S\n  left first\n');
    expect(on.lateConjuncts).toMatchObject({ file: 'table.heads', line: 2 });
    expect(on.lateConjuncts!.phrases({ category: 'SINV', functions: [] })).toBe(true);
    expect(on.lateConjuncts!.phrases({ category: 'NP', functions: [] })).toBe(false);
    expect(compileHeadTable('table u\nbuilds-on en-content\nlate-conjuncts off\n').lateConjuncts).toBeUndefined();
    expect(loadHeadTable('en-content').lateConjuncts).toBeDefined();
  });

  it('loads every shipped table, and documents each block with a comment', async () => {
    const { readdirSync, readFileSync } = await import('node:fs');
    const { headrulesFolder } = await import('../../src/tables/load-table.js');
    for (const name of readdirSync(headrulesFolder())) {
      if (name.endsWith('.heads')) loadHeadTable(name.replace(/\.heads$/, ''));
      if (name.endsWith('.labels')) loadLabelTable(name.replace(/\.labels$/, ''));
      if (!name.endsWith('.heads')) continue;
      const lines = readFileSync(`${headrulesFolder()}/${name}`, 'utf8').split('\n');
      lines.forEach((line, i) => {
        if (line.startsWith('head ')) expect(lines[i - 1], `${name}:${i + 1}`).toMatch(/^#/);
      });
    }
  });
});
