import { describe, expect, it } from 'vitest';
import { diagnose } from '../../src/diagnostics/diagnostic.js';
import { formatDiagnostic } from '../../src/diagnostics/format-diagnostic.js';
import { LineIndex } from '../../src/model/line-index.js';

describe('formatting a diagnostic', () => {
  const lines = new LineIndex('( (S (NP (D the) fog)))\n', { offset: 0, line: 1, column: 1 });
  const diagnostic = diagnose('word-outside-preterminal', 'word "fog" stands beside brackets', { file: 'a.psd', offset: 17, lines }, [
    'give it a tag',
  ]);

  it('prints file:line:col, severity, message and code on one line', () => {
    expect(formatDiagnostic(diagnostic)).toBe('a.psd:1:18: error: word "fog" stands beside brackets [word-outside-preterminal]');
  });

  it('adds the source line with a caret under the column, and the notes, on request', () => {
    expect(formatDiagnostic(diagnostic, { source: true }).split('\n')).toEqual([
      'a.psd:1:18: error: word "fog" stands beside brackets [word-outside-preterminal]',
      ' 1 | ( (S (NP (D the) fog)))',
      '   |                  ^',
      '  note: give it a tag',
    ]);
  });
});
