import { describe, expect, it } from 'vitest';
import type { Diagnostic } from '../../src/diagnostics/diagnostic.js';
import { readBracketedText } from '../../src/formats/bracketed/read-bracketed.js';
import { SentenceIdCheck, treeIdOf } from '../../src/validate/check-sentence-ids.js';

// Invented trees of a harbour logbook; each file is checked as the validator checks a run of files.
// Columns counted by hand on the input: the identifier's value starts at column 19 after "( (S (N Fog)) (ID ";
// a problem's end is the column just past the tree.
function check(files: Array<[name: string, text: string]>): Diagnostic[] {
  const problems: Diagnostic[] = [];
  const ids = new SentenceIdCheck((diagnostic) => problems.push(diagnostic));
  for (const [file, text] of files) for (const tree of readBracketedText(text, { file }, () => undefined)) ids.checkAt(treeIdOf(tree));
  return problems;
}

const tree = (word: string, id?: string) => `( (S (N ${word}))${id === undefined ? '' : ` (ID ${id})`})\n`;

describe('the identifier check across trees', () => {
  it('reports a reused identifier where it is reused, its note naming the first use by file, line and column', () => {
    const problems = check([
      ['log-a.psd', tree('Gulls', 'log.1') + tree('Terns', 'log.2')],
      ['log-b.psd', '\n' + tree('Fog', 'log.2')],
    ]);
    expect(problems.map((p) => [p.code, `${p.file}:${p.line}:${p.column}`, p.notes])).toEqual([
      ['duplicate-id', 'log-b.psd:2:19', ['first used at log-a.psd:2:21']],
    ]);
    expect(problems[0]!.message).toBe('identifier "log.2" was already used');
    expect(problems[0]!.excerpt?.text).toBe('( (S (N Fog)) (ID log.2))');
  });

  it('reports a tree without an identifier once its file turns out to have them, the earlier ones included, in order', () => {
    const problems = check([['log.psd', tree('Gulls') + tree('Terns', 'log.1') + tree('Fog')]]);
    expect(problems.map((p) => [p.code, p.line, p.column, p.end.line, p.end.column])).toEqual([
      ['missing-id', 1, 1, 1, 17],
      ['missing-id', 3, 1, 3, 15],
    ]);
  });

  it('says nothing of trees without identifiers in a file that has none, nor of the same identifier starting over in a new run', () => {
    expect(check([['plain.psd', tree('Gulls') + tree('Terns')]])).toEqual([]);
    expect(check([['log.psd', tree('Gulls', 'log.1')]])).toEqual([]);
  });

  it('passes over a tree without a place in a source (built in memory)', () => {
    const [built] = readBracketedText(tree('Gulls', 'log.1'), { file: 'log.psd' }, () => undefined);
    const { source: _source, position: _position, ...inMemory } = built!;
    expect(treeIdOf(inMemory)).toEqual({ file: 'log.psd' });
  });
});
