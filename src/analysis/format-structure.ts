import type { CorpusStructure, Distribution } from './corpus-structure.js';

/** The corpus figures as an aligned plain-text report. */
export function formatCorpusStructure(s: CorpusStructure): string {
  const number = (n: number) => n.toLocaleString('en-US');
  const share = (n: number, of: number) => (of === 0 ? '' : ` (${((100 * n) / of).toFixed(2)}%)`);
  const rows: Array<[string, string]> = [
    ['sentences', number(s.sentences)],
    ['words', number(s.words)],
    ['arcs (root arcs left out)', number(s.arcs)],
    ['non-projective arcs', number(s.nonProjectiveArcs) + share(s.nonProjectiveArcs, s.arcs)],
    ['non-projective sentences', number(s.nonProjectiveSentences) + share(s.nonProjectiveSentences, s.sentences)],
    ['words whose yield has a gap', number(s.gappedWords) + share(s.gappedWords, s.words)],
    ['well-nested sentences', number(s.wellNestedSentences) + share(s.wellNestedSentences, s.sentences)],
  ];
  const width = Math.max(...rows.map(([name]) => name.length));
  const lines = rows.map(([name, value]) => `${name.padEnd(width)}  ${value}`);
  lines.push('', 'sentences by gap degree', ...distribution(s.gapDegree, s.sentences));
  lines.push('', 'sentences by edge degree', ...distribution(s.edgeDegree, s.sentences));
  const lengths = Object.entries(s.arcLength);
  const within = (limit: number) => lengths.filter(([length]) => Number(length) <= limit).reduce((sum, [, n]) => sum + n, 0);
  lines.push('', 'arcs by length');
  lines.push(...distribution(Object.fromEntries(lengths.slice(0, 10)), s.arcs));
  if (lengths.length > 10) {
    const longer = s.arcs - within(Number(lengths[9]![0]));
    lines.push(`  longer: ${number(longer)}${share(longer, s.arcs)}`);
  }
  const percent = (n: number) => (s.arcs === 0 ? '0%' : `${((100 * n) / s.arcs).toFixed(2)}%`);
  lines.push(`  length 1: ${percent(within(1))} of arcs; length 3 or less: ${percent(within(3))}`);
  return lines.join('\n') + '\n';
}

function distribution(values: Distribution, of: number): string[] {
  const entries = Object.entries(values);
  const width = Math.max(1, ...entries.map(([value]) => value.length));
  return entries.map(([value, n]) => `  ${value.padStart(width)}: ${n.toLocaleString('en-US').padStart(8)}${of ? ` (${((100 * n) / of).toFixed(2)}%)` : ''}`);
}
