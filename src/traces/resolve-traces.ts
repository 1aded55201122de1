import type { ConstituentNode, EmptyElement, Phrase, Tree } from '../model/constituency.js';
import { numberTerminals, renumberTerminals, sortTreeByFirstTerminal } from '../model/terminal-order.js';
import { nodesBottomUp, nodesTopDown } from '../model/traverse.js';

/** Empty elements whose antecedent is interpreted where they stand (bracketing conventions, Bies et al. 1995, from memory). */
export const MOVING_TRACES: ReadonlySet<string> = new Set(['*T*', '*ICH*', '*EXP*', '*RNR*']);

/** What resolve-traces did to one tree. */
export interface Resolution {
  /** The discontinuous tree. */
  tree: Tree;
  /** How many antecedents moved to their trace. */
  moved: number;
  /**
   * Moving traces left in place because their antecedent had already moved to
   * an earlier trace (a word has one parent). Such a trace is not stable:
   * resolving the result again, or its bracketing, may move another phrase to it.
   */
  leftover: number;
}

/**
 * Turns a bracketed tree with `*T*`, `*ICH*`, `*EXP*` and `*RNR*` traces into
 * a discontinuous tree: each antecedent (a coindexed phrase with words)
 * becomes a child of the phrase where its first trace stood, the trace
 * disappears, and the words keep their places in the sentence. A phrase left
 * with no children by a move disappears too. Traces with no antecedent with
 * words, or inside their own antecedent, stay as empty elements, and so do
 * second traces of one antecedent (`*RNR*` shared by two conjuncts): a word can
 * have only one parent.
 *
 * The input is not changed: every phrase is copied, and the copies' terminals
 * carry `order`; a tree without moving traces comes back as it is. A tree
 * that is already discontinuous is resolved the same way.
 */
export function resolveTraces(tree: Tree): Resolution {
  // Most trees have no moving trace: they need no copy.
  if (!tree.children.some(holdsMovingTrace)) return { tree, moved: 0, leftover: 0 };
  const copy = numberTerminals(tree);
  const antecedents = new Map<number, { node: Phrase; parent: Phrase | Tree }>();
  const traces: Array<{ trace: EmptyElement; parent: Phrase }> = [];
  const withWords = phrasesWithWords(copy.children);
  // Parents before children, left to right, as the trees are written.
  const stack: Array<{ node: ConstituentNode; parent: Phrase | Tree }> = copy.children.map((node) => ({ node, parent: copy })).reverse();
  while (stack.length > 0) {
    const { node, parent } = stack.pop()!;
    if (node.type === 'phrase') {
      const coindex = node.label.coindex;
      if (coindex !== undefined && parent.type === 'phrase' && withWords.has(node) && !antecedents.has(coindex)) antecedents.set(coindex, { node, parent });
      for (let i = node.children.length - 1; i >= 0; i--) stack.push({ node: node.children[i]!, parent: node });
    } else if (node.type === 'empty' && node.refIndex !== undefined && parent.type === 'phrase' && MOVING_TRACES.has(node.kind.toUpperCase())) {
      traces.push({ trace: node, parent });
    }
  }
  const moved = new Set<number>();
  for (const { trace, parent } of traces) {
    const refIndex = trace.refIndex!;
    const antecedent = antecedents.get(refIndex);
    if (!antecedent || moved.has(refIndex) || contains(antecedent.node, trace)) continue;
    moved.add(refIndex);
    const from = antecedent.parent.children;
    from.splice(from.indexOf(antecedent.node), 1);
    parent.children[parent.children.indexOf(trace)] = antecedent.node;
    antecedent.parent = parent;
  }
  const leftover = traces.filter(
    ({ trace, parent }) => moved.has(trace.refIndex!) && parent.children.includes(trace) && !contains(antecedents.get(trace.refIndex!)!.node, trace),
  ).length;
  if (moved.size === 0) return { tree: copy, moved: 0, leftover: 0 };
  // A moved antecedent keeps its coindex only while something else still points to it.
  const stillPointed = new Set<number>();
  for (const node of nodesTopDown(copy.children)) {
    if (node.type === 'empty' && node.refIndex !== undefined) stillPointed.add(node.refIndex);
    if (node.type === 'phrase' && node.label.gapIndex !== undefined) stillPointed.add(node.label.gapIndex);
  }
  for (const index of moved) {
    const antecedent = antecedents.get(index)!;
    if (stillPointed.has(index)) continue;
    // The phrase is this function's own copy, so it may change in place.
    const { coindex: _dropped, ...label } = antecedent.node.label;
    antecedent.node.label = label;
  }
  dropChildless(copy.children);
  copy.children = copy.children.filter((child) => child.type !== 'phrase' || child.children.length > 0);
  sortTreeByFirstTerminal(copy);
  copy.discontinuous = true;
  // The traces that moved left holes in the numbering.
  renumberTerminals(copy);
  return { tree: copy, moved: moved.size, leftover };
}

function holdsMovingTrace(node: ConstituentNode): boolean {
  for (const below of nodesTopDown([node])) {
    if (below.type === 'empty' && below.refIndex !== undefined && MOVING_TRACES.has(below.kind.toUpperCase())) return true;
  }
  return false;
}

/** The phrases that hold at least one word, found bottom-up. */
function phrasesWithWords(nodes: ConstituentNode[]): Set<ConstituentNode> {
  const found = new Set<ConstituentNode>();
  for (const node of nodesBottomUp(nodes)) {
    if (node.type === 'phrase' && node.children.some((child) => child.type === 'preterminal' || found.has(child))) found.add(node);
  }
  return found;
}

function contains(node: ConstituentNode, target: ConstituentNode): boolean {
  if (node === target) return true;
  return node.type === 'phrase' && nodesTopDown(node.children).includes(target);
}

/** Removes, in place, phrases a move left without children, lowest first (this function's own copies). */
function dropChildless(nodes: ConstituentNode[]): void {
  for (const node of nodesBottomUp(nodes)) {
    if (node.type === 'phrase') node.children = node.children.filter((child) => child.type !== 'phrase' || child.children.length > 0);
  }
}
