import { diagnose } from '../diagnostics/diagnostic.js';
import { LineIndex } from '../model/line-index.js';
import { readTableText, requireTable, TableError } from './table-source.js';

/**
 * Tag → UPOS. A tag written with a final `*` stands for every tag that starts
 * with the rest (`NS-* NOUN` covers `NS-N`, `NS-G`, …); a tag written out whole
 * wins over a pattern, and a longer pattern over a shorter one.
 */
export class PosMap {
  private readonly exact = new Map<string, string>();
  private readonly prefixes: Array<[string, string]> = [];

  add(tag: string, upos: string): void {
    if (tag.endsWith('*')) {
      this.prefixes.push([tag.slice(0, -1), upos]);
      this.prefixes.sort((a, b) => b[0].length - a[0].length);
    } else this.exact.set(tag, upos);
  }

  get(tag: string): string | undefined {
    return this.exact.get(tag) ?? this.prefixes.find(([prefix]) => tag.startsWith(prefix))?.[1];
  }
}

/**
 * Reads a POS map (`headrules/NAME.pos`): one tag (or `PREFIX*`) and its
 * Universal POS tag per line, `#` lines are comments.
 */
export function loadPosMap(nameOrPath: string): PosMap {
  const path = requireTable(nameOrPath, 'pos');
  const text = readTableText(path, 'pos');
  const map = new PosMap();
  const lines = new LineIndex(text, { offset: 0, line: 1, column: 1 });
  let offset = 0;
  const problems = [];
  for (const line of text.split('\n')) {
    const trimmed = line.trim();
    if (trimmed && !trimmed.startsWith('# ') && trimmed !== '#') {
      const parts = trimmed.split(/\s+/);
      if (parts.length !== 2 || !/^[A-Z]+$/.test(parts[1]!)) {
        problems.push(diagnose('table-invalid', 'a POS map line is a tag and a Universal POS tag', { file: path, offset, lines }));
      } else map.add(parts[0]!, parts[1]!);
    }
    offset += line.length + 1;
  }
  if (problems.length > 0) throw new TableError(problems);
  return map;
}
