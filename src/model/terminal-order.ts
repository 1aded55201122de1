import type { ConstituentNode, EmptyElement, MetaNode, Preterminal, Tree } from './constituency.js';

/** A node that takes a place in the sentence: a word, an empty element, or a note. */
export type Terminal = Preterminal | EmptyElement | MetaNode;

/** The terminals of a tree in tree order (left to right through the brackets); notes are not entered. */
export function terminalsOf(tree: Tree): Terminal[] {
  const found: Terminal[] = [];
  const visit = (node: ConstituentNode) => {
    if (node.type === 'phrase') node.children.forEach(visit);
    else found.push(node);
  };
  tree.children.forEach(visit);
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
  const copy: Tree = { ...tree, children: tree.children.map(copyNode) };
  if (tree.secondaryEdges) {
    // Secondary edges point at the copies.
    const copies = new Map<ConstituentNode, ConstituentNode>();
    const pair = (a: ConstituentNode, b: ConstituentNode) => {
      copies.set(a, b);
      if (a.type === 'phrase' && b.type === 'phrase') a.children.forEach((child, i) => pair(child, b.children[i]!));
    };
    tree.children.forEach((child, i) => pair(child, copy.children[i]!));
    copy.secondaryEdges = tree.secondaryEdges.map((edge) => ({ ...edge, from: copies.get(edge.from) ?? edge.from, to: copies.get(edge.to) ?? edge.to }));
  }
  renumberTerminals(copy);
  return copy;
}

function copyNode(node: ConstituentNode): ConstituentNode {
  switch (node.type) {
    case 'phrase':
      return { ...node, children: node.children.map(copyNode) };
    case 'preterminal':
      return { ...node, word: { ...node.word } };
    case 'empty':
      return { ...node };
    case 'meta':
      return { ...node, children: node.children.map(copyNode) };
  }
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
  for (const child of node.children) first = Math.min(first, firstOrder(child));
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
  const visit = (node: ConstituentNode): number => {
    if (node.type !== 'phrase') return firstOrder(node);
    const keyed = node.children.map((child) => ({ node: child, first: visit(child) }));
    keyed.sort((a, b) => a.first - b.first);
    keyed.forEach((entry, i) => (node.children[i] = entry.node));
    return keyed.length > 0 ? keyed[0]!.first : Infinity;
  };
  const keyed = tree.children.map((child) => ({ node: child, first: visit(child) }));
  keyed.sort((a, b) => a.first - b.first);
  keyed.forEach((entry, i) => (tree.children[i] = entry.node));
}

/** How many phrases of a tree have gaps: their terminals are not one unbroken stretch of the sentence. */
export function countDiscontinuousPhrases(tree: Tree): number {
  if (!tree.discontinuous) return 0;
  let count = 0;
  const visit = (node: ConstituentNode): number[] => {
    if (node.type !== 'phrase') return [firstOrder(node)];
    const orders = node.children.flatMap(visit);
    if (Math.max(...orders) - Math.min(...orders) + 1 !== orders.length) count++;
    return orders;
  };
  tree.children.forEach(visit);
  return count;
}
