import { readFileSync } from 'node:fs';
import { diagnose } from '../diagnostics/diagnostic.js';
import { LineIndex } from '../model/line-index.js';
import { resolveTable, TableError } from './load-table.js';

/**
 * Reads a POS map (`headrules/NAME.pos`): one tag and its Universal POS tag
 * per line, `#` lines are comments. Returns tag → UPOS.
 */
export function loadPosMap(nameOrPath: string): Map<string, string> {
  const path = resolveTable(nameOrPath, 'pos' as 'heads');
  if (!path) {
    throw new TableError([{ code: 'table-not-found', severity: 'error', message: `no POS map "${nameOrPath}"`, file: nameOrPath, offset: 0, line: 1, column: 1 }]);
  }
  const text = readFileSync(path, 'utf8');
  const map = new Map<string, string>();
  const lines = new LineIndex(text, { offset: 0, line: 1, column: 1 });
  let offset = 0;
  const problems = [];
  for (const line of text.split('\n')) {
    const trimmed = line.trim();
    if (trimmed && !trimmed.startsWith('# ') && trimmed !== '#') {
      const parts = trimmed.split(/\s+/);
      if (parts.length !== 2 || !/^[A-Z]+$/.test(parts[1]!)) {
        problems.push(diagnose('table-invalid', 'a POS map line is a tag and a Universal POS tag', { file: path, offset, lines }));
      } else map.set(parts[0]!, parts[1]!);
    }
    offset += line.length + 1;
  }
  if (problems.length > 0) throw new TableError(problems);
  return map;
}
