import type { ConstituentNode, Preterminal, Tree } from './constituency.js';

/** The children of a node: a preterminal's word and an empty element's leaf are not nodes. */
export function childrenOf(node: ConstituentNode): ConstituentNode[] {
  return node.type === 'phrase' || node.type === 'meta' ? node.children : [];
}

/**
 * Visits the nodes of a tree depth first, parents before children. Meta
 * brackets are visited but not entered unless `enterMeta` is set: their
 * contents are not part of the sentence.
 */
export function* nodesOf(tree: Tree, enterMeta = false): Generator<ConstituentNode> {
  const stack = [...tree.children].reverse();
  while (stack.length > 0) {
    const node = stack.pop()!;
    yield node;
    if (node.type === 'meta' && !enterMeta) continue;
    const children = childrenOf(node);
    for (let i = children.length - 1; i >= 0; i--) stack.push(children[i]!);
  }
}

/** The words of the sentence, in order, as their preterminals. */
export function preterminalsOf(tree: Tree): Preterminal[] {
  const found: Preterminal[] = [];
  const visit = (nodes: ConstituentNode[]) => {
    for (const node of nodes) {
      if (node.type === 'preterminal') found.push(node);
      else if (node.type === 'phrase') visit(node.children);
    }
  };
  visit(tree.children);
  return found;
}

/** True when the tree holds only notes and markup, as a heading between sentences does. */
export function isMetaOnly(tree: Tree): boolean {
  return tree.children.length > 0 && tree.children.every((child) => child.type === 'meta');
}
