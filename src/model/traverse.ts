/**
 * Walks over trees without recursion. Corpora hold trees nested thousands of
 * brackets deep (the readers accept up to 2,000 levels, and a dependency chain
 * is as deep as its sentence is long), deeper than the call stack allows for
 * recursive walks; every walk over tree depth goes through these helpers or an
 * explicit stack of its own.
 */
import type { ConstituentNode, Preterminal, Tree } from './constituency.js';

/** The children of a node: a preterminal's word and an empty element's leaf are not nodes. */
export function childrenOf(node: ConstituentNode): ConstituentNode[] {
  return node.type === 'phrase' || node.type === 'meta' ? node.children : [];
}

/** The children of a constituency node inside the sentence: meta brackets are not entered. */
function sentenceChildrenOf(node: ConstituentNode): readonly ConstituentNode[] | undefined {
  return node.type === 'phrase' ? node.children : undefined;
}

/**
 * Every node under the roots (the roots included), parents before children,
 * left to right. `kids` gives a node's children (undefined or empty for a leaf).
 */
export function preOrder<T>(roots: readonly T[], kids: (node: T) => readonly T[] | undefined): T[] {
  const order: T[] = [];
  const stack: T[] = [];
  for (let i = roots.length - 1; i >= 0; i--) stack.push(roots[i]!);
  while (stack.length > 0) {
    const node = stack.pop()!;
    order.push(node);
    const children = kids(node);
    if (children) for (let i = children.length - 1; i >= 0; i--) stack.push(children[i]!);
  }
  return order;
}

/**
 * Every node under the roots (the roots included), children before parents,
 * left to right: the order in which bottom-up passes (heads, spans) visit.
 */
export function postOrder<T>(roots: readonly T[], kids: (node: T) => readonly T[] | undefined): T[] {
  // A pre-order that takes children right to left, reversed, is the left-to-right post-order.
  const order: T[] = [];
  const stack: T[] = [...roots];
  while (stack.length > 0) {
    const node = stack.pop()!;
    order.push(node);
    const children = kids(node);
    if (children) for (const child of children) stack.push(child);
  }
  return order.reverse();
}

/** Every node of a constituency tree's sentence, children before parents (meta brackets not entered). */
export function nodesBottomUp(nodes: readonly ConstituentNode[]): ConstituentNode[] {
  return postOrder(nodes, sentenceChildrenOf);
}

/** Every node of a constituency tree's sentence, parents before children (meta brackets not entered). */
export function nodesTopDown(nodes: readonly ConstituentNode[]): ConstituentNode[] {
  return preOrder(nodes, sentenceChildrenOf);
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

/**
 * Rebuilds nodes bottom-up: `make` receives each node with its children
 * already rebuilt and returns the new node (or undefined to leave it out).
 * Returns the rebuilt roots. Children are taken from `kids`.
 */
export function rebuildBottomUp<T, U>(
  roots: readonly T[],
  kids: (node: T) => readonly T[] | undefined,
  make: (node: T, children: U[]) => U | undefined,
): U[] {
  // In post-order a node's children are the last nodes made before it, in order: they sit on top of
  // a stack of results (undefined for a node left out), and give way to their parent's.
  const made: Array<U | undefined> = [];
  for (const node of postOrder(roots, kids)) {
    const count = kids(node)?.length ?? 0;
    const first = made.length - count;
    const children: U[] = [];
    for (let i = first; i < made.length; i++) {
      const child = made[i];
      if (child !== undefined) children.push(child);
    }
    made.length = first;
    made.push(make(node, children));
  }
  return made.filter((root): root is U => root !== undefined);
}

/** The words of the sentence, in order, as their preterminals. */
export function preterminalsOf(tree: Tree): Preterminal[] {
  const found: Preterminal[] = [];
  for (const node of nodesTopDown(tree.children)) if (node.type === 'preterminal') found.push(node);
  return found;
}

/** True when the tree holds only notes and markup, as a heading between sentences does. */
export function isMetaOnly(tree: Tree): boolean {
  return tree.children.length > 0 && tree.children.every((child) => child.type === 'meta');
}
