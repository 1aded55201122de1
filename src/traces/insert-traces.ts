import type { ConstituentNode, EmptyElement, Phrase, Tree } from '../model/constituency.js';
import { parseLabel } from '../model/label.js';
import { numberTerminals, orderOf, renumberTerminals, sortTreeByFirstTerminal, terminalsOf } from '../model/terminal-order.js';
import { nodesBottomUp, nodesTopDown, rebuildBottomUp } from '../model/traverse.js';

/** What insert-traces did to one tree. */
export interface TraceInsertion {
  /** A tree whose phrases are all continuous, leaves in sentence order; `order` is gone. */
  tree: Tree;
  /** How many `*ICH*` traces were put in. */
  traces: number;
}

/**
 * Turns a discontinuous tree into a bracketing, the opposite of
 * resolve-traces: in every discontinuous phrase, lowest first, one unbroken
 * run of children stays (the one holding a word of the phrase's own, where
 * heads usually are, else the longest); each other child moves up to the phrase's
 * parent, gets a fresh coindex n, and leaves `(-NONE- *ICH*-n)` beside the run
 * it was cut from (before it or after it, as the child stood), following the
 * convention for "interpret constituent here" (Bies et al. 1995, from
 * memory). A phrase that carries a coindex already (because other traces
 * still point to it) keeps it, and its trace takes that index. A child that
 * already moved once moves on without a second trace, so each moved phrase
 * has exactly one. A word moved on its own is wrapped in a phrase named after
 * its tag, as only phrases carry coindices. Resolving the traces of the
 * result gives the discontinuous tree back.
 *
 * A tree that is not discontinuous comes back as it is.
 */
export function insertTraces(tree: Tree): TraceInsertion {
  if (!tree.discontinuous) return { tree, traces: 0 };
  const copy = numberTerminals(tree);
  let nextIndex = largestIndex(copy) + 1;
  const moved = new Set<ConstituentNode>();
  let traces = 0;

  // Phrases are mended lowest first; a child that leaves a phrase goes to that phrase's parent, which
  // is mended later and may send it further up. Parents are taken before anything moves.
  const parentOf = new Map<ConstituentNode, ConstituentNode[]>();
  for (const child of copy.children) parentOf.set(child, copy.children);
  const phrases = nodesBottomUp(copy.children).filter((node): node is Phrase => node.type === 'phrase');
  for (const node of phrases) for (const child of node.children) parentOf.set(child, node.children);
  for (const node of phrases) {
    const parentChildren = parentOf.get(node)!;
    const runs = runsOf(node.children);
    if (runs.length < 2) continue;
    const kept = runs.reduce((best, run) => (keepScore(run) > keepScore(best) ? run : best));
    const first = kept.from;
    const last = kept.to;
    const leaving = node.children.filter((child) => !kept.children.includes(child));
    const before = leaving.filter((child) => firstOf(child) < first);
    const after = leaving.filter((child) => firstOf(child) > last);
    node.children = [...kept.children];
    for (const child of leaving) {
      let outgoing = child;
      if (!moved.has(child)) {
        const antecedent = coindexed(child, nextIndex);
        outgoing = antecedent;
        // The trace stands just outside the kept run, on the side the child came from.
        const side = before.includes(child) ? before : after;
        const k = side.indexOf(child);
        const order = side === before ? first - 1 + (k + 1) / (before.length + 1) : last + (k + 1) / (after.length + 1);
        const index = antecedent.label.coindex!;
        node.children.push(traceTo(index, order));
        if (index === nextIndex) nextIndex++;
        traces++;
      }
      moved.add(outgoing);
      parentChildren.push(outgoing);
      parentOf.set(outgoing, parentChildren);
    }
    // The kept children now stand in the phrase's new list of children.
    for (const child of node.children) parentOf.set(child, node.children);
    renumberTerminals(copy);
    sortTreeByFirstTerminal(copy);
  }
  const mended: Tree = { ...copy, children: withoutOrder(copy.children) };
  delete mended.discontinuous;
  return { tree: mended, traces };
}

/** Maximal runs of children whose terminals follow each other without a gap. */
function runsOf(children: ConstituentNode[]): Array<{ children: ConstituentNode[]; from: number; to: number; size: number }> {
  const spans = children.map((child) => ({ child, ...spanOf(child) })).sort((a, b) => a.from - b.from);
  const runs: Array<{ children: ConstituentNode[]; from: number; to: number; size: number }> = [];
  for (const span of spans) {
    const run = runs[runs.length - 1];
    if (run && span.from === run.to + 1) {
      run.children.push(span.child);
      run.to = span.to;
      run.size += span.size;
    } else runs.push({ children: [span.child], from: span.from, to: span.to, size: span.size });
  }
  return runs;
}

/** Runs with a word directly under the phrase win; among the rest, and among those, the longest. */
function keepScore(run: { children: ConstituentNode[]; size: number }): number {
  return (run.children.some((child) => child.type === 'preterminal') ? 1e9 : 0) + run.size;
}

/** First and last order under a continuous node, and how many terminals it holds. */
function spanOf(node: ConstituentNode): { from: number; to: number; size: number } {
  const orders = terminalsOf({ type: 'tree', children: [node] }).map((terminal) => orderOf(terminal)!);
  return { from: Math.min(...orders), to: Math.max(...orders), size: orders.length };
}

function firstOf(node: ConstituentNode): number {
  return spanOf(node).from;
}

/**
 * The node with a coindex: a phrase that has one keeps it, another phrase
 * gets n on its label, and anything else is wrapped in a phrase that carries n.
 */
function coindexed(node: ConstituentNode, index: number): Phrase {
  if (node.type === 'phrase') return node.label.coindex === undefined ? { ...node, label: { ...node.label, coindex: index } } : node;
  let category = 'X';
  if (node.type === 'preterminal') category = parseLabel(node.pos).category;
  else if (node.type === 'empty') category = node.label.category;
  return { type: 'phrase', label: { category, functions: [], coindex: index }, children: [node] };
}

function traceTo(index: number, order: number): EmptyElement {
  return { type: 'empty', label: parseLabel('-NONE-'), text: `*ICH*-${index}`, kind: '*ICH*', refIndex: index, order };
}

/** The largest coindex, gapping index or trace index in the tree, so that new ones do not clash. */
function largestIndex(tree: Tree): number {
  let largest = 0;
  for (const node of nodesTopDown(tree.children)) {
    if (node.type === 'phrase') largest = Math.max(largest, node.label.coindex ?? 0, node.label.gapIndex ?? 0);
    else if (node.type === 'empty') largest = Math.max(largest, node.refIndex ?? 0, node.label.coindex ?? 0);
  }
  return largest;
}

/** Copies of the nodes without `order` on their terminals. */
function withoutOrder(nodes: ConstituentNode[]): ConstituentNode[] {
  return rebuildBottomUp<ConstituentNode, ConstituentNode>(
    nodes,
    (node) => (node.type === 'phrase' ? node.children : undefined),
    (node, children) => {
      switch (node.type) {
        case 'phrase':
          return { ...node, children };
        case 'preterminal': {
          const { order: _order, ...word } = node.word;
          return { ...node, word };
        }
        case 'empty':
        case 'meta': {
          const { order: _order, ...rest } = node;
          return rest as ConstituentNode;
        }
      }
    },
  );
}
