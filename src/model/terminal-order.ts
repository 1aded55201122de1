import type { ConstituentNode, EmptyElement, MetaNode, Preterminal, Tree } from './constituency.js';
import { nodesBottomUp, nodesTopDown, postOrder, rebuildBottomUp } from './traverse.js';

/** A node that takes a place in the sentence: a word, an empty element, or a note. */
export type Terminal = Preterminal | EmptyElement | MetaNode;

/** The terminals of a tree in tree order (left to right through the brackets); notes are not entered. */
export function terminalsOf(tree: Tree): Terminal[] {
  const found: Terminal[] = [];
  for (const node of nodesTopDown(tree.children)) if (node.type !== 'phrase') found.push(node);
  return found;
}

/** A terminal's place in the sentence, from 1; undefined in a tree whose leaves are in sentence order. */
export function orderOf(terminal: Terminal): number | undefined {
  return terminal.type === 'preterminal' ? terminal.word.order : terminal.order;
}

/** The terminals in sentence order: by `order` in a discontinuous tree, else as they stand. */
export function terminalsInOrder(tree: Tree): Terminal[] {
  const terminals = terminalsOf(tree);
  if (tree.discontinuous) terminals.sort((a, b) => orderOf(a)! - orderOf(b)!);
  return terminals;
}

/**
 * A copy of the tree whose terminals all carry `order`: their place in the
 * sentence (their leaf order, or, for a discontinuous tree, the order they
 * already had, renumbered from 1 without holes). Phrases and terminals are
 * copied; words too, labels are shared.
 */
export function numberTerminals(tree: Tree): Tree {
  // Secondary edges point at the copies.
  const copies = tree.secondaryEdges ? new Map<ConstituentNode, ConstituentNode>() : undefined;
  const children = rebuildBottomUp<ConstituentNode, ConstituentNode>(
    tree.children,
    (node) => (node.type === 'phrase' || node.type === 'meta' ? node.children : undefined),
    (node, copiedChildren) => {
      let copied: ConstituentNode;
      switch (node.type) {
        case 'phrase':
        case 'meta':
          copied = { ...node, children: copiedChildren };
          break;
        case 'preterminal':
          copied = { ...node, word: { ...node.word } };
          break;
        case 'empty':
          copied = { ...node };
          break;
      }
      copies?.set(node, copied);
      return copied;
    },
  );
  const copy: Tree = { ...tree, children };
  if (tree.secondaryEdges && copies) {
    copy.secondaryEdges = tree.secondaryEdges.map((edge) => ({ ...edge, from: copies.get(edge.from) ?? edge.from, to: copies.get(edge.to) ?? edge.to }));
  }
  renumberTerminals(copy);
  return copy;
}

/** Gives the terminals of a tree (in place: call it on a copy) the orders 1, 2, 3 … in sentence order. */
export function renumberTerminals(tree: Tree): void {
  const terminals = terminalsInOrder(tree);
  terminals.forEach((terminal, i) => {
    if (terminal.type === 'preterminal') terminal.word.order = i + 1;
    else terminal.order = i + 1;
  });
}

/** The smallest `order` under a node. */
export function firstOrder(node: ConstituentNode): number {
  if (node.type === 'preterminal') return node.word.order ?? Infinity;
  if (node.type === 'empty' || (node.type === 'meta' && node.order !== undefined)) return node.order ?? Infinity;
  let first = Infinity;
  for (const below of nodesTopDown(node.children)) {
    if (below.type === 'preterminal') first = Math.min(first, below.word.order ?? Infinity);
    else if (below.type === 'empty' || below.type === 'meta') first = Math.min(first, below.order ?? Infinity);
  }
  return first;
}

/** Sorts sibling nodes, in place, by their first terminal. */
export function sortByFirstTerminal(nodes: ConstituentNode[]): void {
  if (nodes.length < 2) return;
  const keyed = nodes.map((node) => ({ node, first: firstOrder(node) }));
  keyed.sort((a, b) => a.first - b.first);
  keyed.forEach((entry, i) => (nodes[i] = entry.node));
}

/** Sorts the children of every phrase of a tree, in place, by their first terminal. */
export function sortTreeByFirstTerminal(tree: Tree): void {
  // Bottom-up, each phrase's first terminal is the first of its first child once its children are sorted.
  const first = new Map<ConstituentNode, number>();
  const firstOf = (node: ConstituentNode) => first.get(node) ?? terminalFirst(node);
  for (const node of nodesBottomUp(tree.children)) {
    if (node.type !== 'phrase') continue;
    sortKeyed(node.children, firstOf);
    first.set(node, node.children.length > 0 ? firstOf(node.children[0]!) : Infinity);
  }
  sortKeyed(tree.children, firstOf);
}

/** The order of a terminal; a note that holds brackets has none of its own. */
function terminalFirst(node: ConstituentNode): number {
  if (node.type === 'preterminal') return node.word.order ?? Infinity;
  if (node.type === 'empty' || node.type === 'meta') return node.order ?? Infinity;
  return Infinity;
}

function sortKeyed(nodes: ConstituentNode[], key: (node: ConstituentNode) => number): void {
  if (nodes.length < 2) return;
  const keyed = nodes.map((node) => ({ node, first: key(node) }));
  keyed.sort((a, b) => a.first - b.first);
  keyed.forEach((entry, i) => (nodes[i] = entry.node));
}

/** How many phrases of a tree have gaps: their terminals are not one unbroken stretch of the sentence. */
export function countDiscontinuousPhrases(tree: Tree): number {
  if (!tree.discontinuous) return 0;
  let count = 0;
  // Bottom-up: the smallest and largest order under each phrase, and how many terminals it holds.
  const spans = new Map<ConstituentNode, { low: number; high: number; size: number }>();
  for (const node of postOrder<ConstituentNode>(tree.children, (n) => (n.type === 'phrase' ? n.children : undefined))) {
    if (node.type !== 'phrase') {
      const order = terminalFirst(node);
      spans.set(node, { low: order, high: order, size: 1 });
      continue;
    }
    const span = { low: Infinity, high: -Infinity, size: 0 };
    for (const child of node.children) {
      const below = spans.get(child)!;
      span.low = Math.min(span.low, below.low);
      span.high = Math.max(span.high, below.high);
      span.size += below.size;
      spans.delete(child);
    }
    if (span.high - span.low + 1 !== span.size) count++;
    spans.set(node, span);
  }
  return count;
}
