import { describe, expect, it } from 'vitest';
import type { Diagnostic } from '../../src/diagnostics/diagnostic.js';
import { diagnose } from '../../src/diagnostics/diagnostic.js';
import { LineIndex } from '../../src/model/line-index.js';
import { validateBracketed, validateConllu } from '../../src/api/validate.js';
import { loadHeadTable } from '../../src/tables/load-table.js';
import { TableError } from '../../src/tables/table-source.js';

/** The text a diagnostic covers, from its start offset to its end offset. */
function covered(text: string, diagnostic: Diagnostic): string {
  return text.slice(diagnostic.offset, diagnostic.end.offset);
}

describe('the stretch a diagnostic covers', () => {
  it('is the token at its start when no end is given: up to white space or a bracket', () => {
    const text = '(S (NP (D the) fog))\n';
    const lines = new LineIndex(text, { offset: 0, line: 1, column: 1 });
    const diagnostic = diagnose('word-outside-preterminal', 'beside brackets', { file: 'a.psd', offset: 15, lines });
    expect(covered(text, diagnostic)).toBe('fog');
    expect(diagnostic.end).toEqual({ offset: 18, line: 1, column: 19 });
  });

  it('is a place, not a stretch, at the end of a line', () => {
    const lines = new LineIndex('(S\n', { offset: 0, line: 1, column: 1 });
    const diagnostic = diagnose('unclosed-bracket', 'never closed', { file: 'a.psd', offset: 2, lines });
    expect(diagnostic.end).toEqual({ offset: 2, line: 1, column: 3 });
  });

  it('is the whole phrase for a coindex nothing points to, ending on a later line', () => {
    const text = '( (IP-MAT (NP-SBJ-1 (D the)\n  (N keeper))\n (VBD slept)) (ID k.1))\n';
    const { diagnostics } = validateBracketed(text, { file: 'k.psd' });
    const unreferenced = diagnostics.find((d) => d.code === 'unreferenced-coindex')!;
    expect(covered(text, unreferenced)).toBe('(NP-SBJ-1 (D the)\n  (N keeper))');
    expect([unreferenced.line, unreferenced.end.line]).toEqual([1, 2]);
  });

  it('is the column of a CoNLL-U word that holds the problem', () => {
    const text = '# sent_id = k.1\n# text = Keepers slept\n1\tKeepers\tkeeper\tNOUN\tNNS\tNumber=Plur\t2\tnsubj\t_\t_\n2\tslept\tsleep\tVERBISH\tVBD\t_\t0\troot\t_\t_\n\n';
    const { diagnostics } = validateConllu(text, { file: 'k.conllu' });
    const upos = diagnostics.find((d) => d.code === 'unknown-upos')!;
    expect(covered(text, upos)).toBe('VERBISH');
  });

  it('is the one feature of FEATS that is unknown', () => {
    const text = '# sent_id = k.1\n# text = Keepers\n1\tKeepers\tkeeper\tNOUN\tNNS\tNumber=Plur|Shade=Dark\t0\troot\t_\t_\n\n';
    const { diagnostics } = validateConllu(text, { file: 'k.conllu' });
    expect(diagnostics.filter((d) => d.code === 'unknown-feature').map((d) => covered(text, d))).toEqual(['Shade=Dark']);
  });

  it('is the offending word of a table, with the offset of its line in the table', () => {
    const text = 'table t\n\nhead NP\n  sideways any NN\n';
    let problems: Diagnostic[] = [];
    try {
      loadHeadTable('t.heads', text);
    } catch (error) {
      if (!(error instanceof TableError)) throw error;
      problems = error.diagnostics;
    }
    expect(problems.map((d) => [d.line, d.column, covered(text, d)])).toEqual([
      [4, 3, 'sideways'],
      [3, 1, 'head'],
    ]);
  });
});
