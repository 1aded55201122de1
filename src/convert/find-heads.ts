import type { Candidate } from '../tables/label-pattern.js';
import type { HeadBlock, HeadTable } from '../tables/table-model.js';
import { headWordOf, type ConversionNode, type HeadChoice, type PhraseNode } from './conversion-tree.js';
import { coordinationHead, findCoordination, type CoordinationStyle } from './handle-coordination.js';

/** A node as head-table patterns see it: its label and its head word (heads below it already found). */
export function candidateOf(node: ConversionNode): Candidate {
  const word = headWordOf(node);
  return { category: node.category, functions: node.functions, headWord: { pos: word.pos, form: word.form, lemma: word.lemma } };
}

/**
 * Finds the head child of every phrase, innermost first, with a head table:
 * the phrase's block (or the default block) is tried step by step; when no
 * step chooses, the default block is tried; when nothing chooses, the first
 * child that is not punctuation. A coordinated phrase then takes the head its
 * coordination style gives (handle-coordination). Fills `head` on every phrase.
 */
export function findHeads(
  root: ConversionNode,
  table: HeadTable,
  style: CoordinationStyle = 'table',
  oracle?: (phrase: PhraseNode) => number | undefined,
): void {
  if (root.kind !== 'phrase') return;
  for (const child of root.children) findHeads(child, table, style, oracle);
  const chosen = oracle?.(root);
  if (chosen !== undefined && chosen >= 0) {
    // The oracle knows the head; coordination still attaches coordinators and separators by the style.
    root.head = { child: chosen, reason: 'oracle: the child holding the gold head' };
    const coordination = style === 'table' ? undefined : findCoordination(root, root.children.map(candidateOf), table);
    if (coordination && style !== 'table' && coordinationHead(coordination, style) === chosen) root.coordination = coordination;
    return;
  }
  root.head = chooseHead(root, table);
  if (style === 'table') return;
  const coordination = findCoordination(root, root.children.map(candidateOf), table);
  if (!coordination) return;
  root.coordination = coordination;
  // A head outside the conjuncts means the coordination is among its dependents: the head stays.
  const tableHead = root.head.child;
  const low = coordination.conjuncts[0]!;
  const high = coordination.conjuncts[coordination.conjuncts.length - 1]!;
  if (tableHead < low || tableHead > high) return;
  const child = coordinationHead(coordination, style);
  const conjuncts = coordination.conjuncts.map((i) => i + 1).join(', ');
  root.head = { child, reason: `coordination, ${style} style: conjuncts are children ${conjuncts}` };
}

export function chooseHead(phrase: PhraseNode, table: HeadTable): HeadChoice {
  const candidates = phrase.children.map(candidateOf);
  const own = table.blocks.get(phrase.category);
  const blocks = own ? [own, table.fallback] : [table.fallback];
  for (const block of blocks) {
    const found = searchBlock(block, candidates, table);
    if (found) return adjustForCoordination(found, candidates, table);
  }
  const index = firstContent(candidates, table, 'left');
  return { child: index, reason: 'no step chose: first child that is not punctuation' };
}

function searchBlock(block: HeadBlock, candidates: Candidate[], table: HeadTable): HeadChoice | undefined {
  const n = candidates.length;
  const blockName = block.categories.join(' ');
  for (const step of block.steps) {
    if (step.guards.length > 0 && !candidates.some((c) => step.guards.some((guard) => guard(c)))) continue;
    const order = step.end === 'left' ? [...Array(n).keys()] : [...Array(n).keys()].reverse();
    const reason = `${blockName} (line ${step.line}): ${step.end} ${step.mode}${step.written.length ? ' ' + step.written.join(' ') : ''}${step.guards.length ? ' (if a child matches)' : ''}`;
    if (step.mode === 'first') return { child: firstContent(candidates, table, step.end), reason, line: step.line };
    if (step.mode === 'only') {
      const i = order[0]!;
      const p = step.patterns.findIndex((pattern) => pattern(candidates[i]!));
      if (p !== -1) return { child: i, reason: `${reason} [matched ${step.written[p]}]`, line: step.line };
      continue;
    }
    if (step.mode === 'each') {
      for (let p = 0; p < step.patterns.length; p++) {
        const pattern = step.patterns[p]!;
        for (const i of order) if (pattern(candidates[i]!)) return { child: i, reason: `${reason} [matched ${step.written[p]}]`, line: step.line };
      }
    } else {
      for (const i of order) {
        const p = step.patterns.findIndex((pattern) => pattern(candidates[i]!));
        if (p !== -1) return { child: i, reason: `${reason} [matched ${step.written[p]}]`, line: step.line };
      }
    }
  }
  return undefined;
}

/** The first child from an end that is not punctuation, or the first child when all are. */
function firstContent(candidates: Candidate[], table: HeadTable, end: 'left' | 'right'): number {
  const n = candidates.length;
  for (let k = 0; k < n; k++) {
    const i = end === 'left' ? k : n - 1 - k;
    if (!table.punctuation(candidates[i]!)) return i;
  }
  return end === 'left' ? 0 : n - 1;
}

/**
 * Collins (1999), as in Bikel (2004) §4.12 (CHECK-VALUES §5): when the chosen
 * head follows a coordinator that is not the first child, the child just
 * before the coordinator heads instead. Only for tables that ask for it.
 */
function adjustForCoordination(choice: HeadChoice, candidates: Candidate[], table: HeadTable): HeadChoice {
  if (table.coordinationRule !== 'collins') return choice;
  const before = choice.child - 1;
  if (before >= 1 && table.coordinators(candidates[before]!)) {
    return { child: before - 1, reason: `${choice.reason}; then the coordination rule: the child before the coordinator`, line: choice.line };
  }
  return choice;
}
