import type { Candidate } from '../tables/label-pattern.js';
import type { HeadBlock, HeadStep, HeadTable } from '../tables/table-model.js';
import { headWordOf, phrasesBottomUp, type ConversionNode, type HeadChoice, type PhraseNode } from './conversion-tree.js';
import { coordinationHead, findCoordination, type CoordinationStyle } from './handle-coordination.js';
import { findLateConjuncts } from './attach-late-conjuncts.js';

/** A node as head-table patterns see it: its label and its head word (heads below it already found). */
export function candidateOf(node: ConversionNode): Candidate {
  // The word itself stands for its pos, form and lemma: patterns only read them, and a copy per look costs.
  return { category: node.category, functions: node.functions, headWord: headWordOf(node) };
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
  // Innermost first, so that every child's head word is known when its phrase is decided.
  for (const phrase of phrasesBottomUp(root)) {
    phrase.head = decideHead(phrase, table, style, oracle);
    phrase.headWord = headWordOf(phrase.children[phrase.head.child]!);
  }
}

function decideHead(
  phrase: PhraseNode,
  table: HeadTable,
  style: CoordinationStyle,
  oracle: ((phrase: PhraseNode) => number | undefined) | undefined,
): HeadChoice {
  const candidates = phrase.children.map(candidateOf);
  const chosen = oracle?.(phrase);
  if (chosen !== undefined && chosen >= 0) {
    // The oracle knows the head; coordination still attaches coordinators and separators by the style.
    const coordination = style === 'table' ? undefined : findCoordination(phrase, candidates, table);
    if (coordination && style !== 'table' && coordinationHead(coordination, style) === chosen) phrase.coordination = coordination;
    else if (!coordination && style === 'first') phrase.coordination = findLateConjuncts(phrase, candidates, chosen, table);
    return { child: chosen, reason: 'oracle: the child holding the gold head' };
  }
  const choice = chooseFrom(candidates, phrase, table);
  if (style === 'table') return choice;
  const coordination = findCoordination(phrase, candidates, table);
  if (!coordination) {
    // The first conjunct may be the head child with what hangs from it: `It rained, but we went out`.
    if (style === 'first') phrase.coordination = findLateConjuncts(phrase, candidates, choice.child, table);
    return choice;
  }
  phrase.coordination = coordination;
  // A head outside the conjuncts means the coordination is among its dependents: the head stays.
  const low = coordination.conjuncts[0]!;
  const high = coordination.conjuncts[coordination.conjuncts.length - 1]!;
  if (choice.child < low || choice.child > high) return choice;
  const child = coordinationHead(coordination, style);
  const conjuncts = coordination.conjuncts.map((i) => i + 1).join(', ');
  return { child, reason: `coordination, ${style} style: conjuncts are children ${conjuncts}` };
}

export function chooseHead(phrase: PhraseNode, table: HeadTable): HeadChoice {
  return chooseFrom(phrase.children.map(candidateOf), phrase, table);
}

/** The label of the phrase being decided, as `for` patterns see it (its head word is not known yet). */
export type ParentLabel = Pick<Candidate, 'category' | 'functions'>;

/** The head a table chooses among candidates for a parent phrase (no coordination styling). */
export function chooseFrom(candidates: Candidate[], parent: ParentLabel, table: HeadTable): HeadChoice {
  const own = table.blocks.get(parent.category);
  for (const block of own ? [own, table.fallback] : [table.fallback]) {
    const found = searchBlock(block, candidates, parent, table);
    if (found) return adjustForCoordination(found, candidates, table);
  }
  return { child: firstContent(candidates, table, 'left'), reason: 'no step chose: first child that is not punctuation' };
}

/** A choice by a step, whose reason is put into words only when asked for (explanations are rare, choices are not). */
class StepChoice implements HeadChoice {
  readonly line: number;

  constructor(
    readonly child: number,
    private readonly block: HeadBlock,
    private readonly step: HeadStep,
    private readonly pattern: number | undefined,
    private readonly then = '',
  ) {
    this.line = step.line;
  }

  get reason(): string {
    const { block, step, pattern } = this;
    const written = step.written.length ? ' ' + step.written.join(' ') : '';
    const guard =
      (step.guards.length ? ' (if a child matches)' : '') + (step.vetoes.length ? ' (unless a child matches)' : '') + (step.phrases.length ? ' (for this phrase label)' : '');
    const matched = pattern === undefined ? '' : ` [matched ${step.written[pattern]}]`;
    return `${block.categories.join(' ')} (line ${step.line}): ${step.end} ${step.mode}${written}${guard}${matched}${this.then}`;
  }

  /** The same step's choice, moved by the coordination rule. */
  moved(child: number): StepChoice {
    return new StepChoice(child, this.block, this.step, this.pattern, '; then the coordination rule: the child before the coordinator');
  }
}

function chosen(child: number, block: HeadBlock, step: HeadStep, pattern: number | undefined): StepChoice {
  return new StepChoice(child, block, step, pattern);
}

function searchBlock(block: HeadBlock, candidates: Candidate[], parent: ParentLabel, table: HeadTable): StepChoice | undefined {
  const n = candidates.length;
  for (const step of block.steps) {
    if (step.phrases.length > 0 && !step.phrases.some((pattern) => pattern(parent))) continue;
    if (step.guards.length > 0 && !candidates.some((c) => step.guards.some((guard) => guard(c)))) continue;
    if (step.vetoes.length > 0 && candidates.some((c) => step.vetoes.some((veto) => veto(c)))) continue;
    const fromLeft = step.end === 'left';
    if (step.mode === 'first') return chosen(firstContent(candidates, table, step.end), block, step, undefined);
    if (step.mode === 'only') {
      const i = fromLeft ? 0 : n - 1;
      const p = step.patterns.findIndex((pattern) => pattern(candidates[i]!));
      if (p !== -1) return chosen(i, block, step, p);
      continue;
    }
    if (step.mode === 'each') {
      for (let p = 0; p < step.patterns.length; p++) {
        const pattern = step.patterns[p]!;
        for (let k = 0; k < n; k++) {
          const i = fromLeft ? k : n - 1 - k;
          if (pattern(candidates[i]!)) return chosen(i, block, step, p);
        }
      }
    } else {
      for (let k = 0; k < n; k++) {
        const i = fromLeft ? k : n - 1 - k;
        const p = step.patterns.findIndex((pattern) => pattern(candidates[i]!));
        if (p !== -1) return chosen(i, block, step, p);
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
function adjustForCoordination(choice: StepChoice, candidates: Candidate[], table: HeadTable): HeadChoice {
  if (table.coordinationRule !== 'collins') return choice;
  const before = choice.child - 1;
  if (before >= 1 && table.coordinators(candidates[before]!)) return choice.moved(before - 1);
  return choice;
}
