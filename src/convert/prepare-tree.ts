import type { ConstituentNode, Tree } from '../model/constituency.js';
import { formatLabel, parseLabel } from '../model/label.js';
import type { ConversionNode, PhraseNode, WordNode } from './conversion-tree.js';

/** How traces are treated: where phrases stand, or where their traces stand. */
export type TraceMode = 'surface' | 'restore';

/** Empty elements whose antecedent is interpreted where they stand (bracketing conventions, Bies et al. 1995, from memory). */
const MOVING_TRACES = new Set(['*T*', '*ICH*', '*EXP*', '*RNR*']);

/** A node of the working copy: a conversion node or, until they are resolved, a trace. */
type Working = WordNode | WorkingPhrase | { kind: 'trace'; type: string; refIndex: number | undefined };
interface WorkingPhrase extends Omit<PhraseNode, 'children'> {
  children: Working[];
  coindex: number | undefined;
}

/**
 * Builds the tree the passes convert: words numbered in sentence order,
 * empty elements and CODE/META brackets left out, and phrases with no word
 * left out with them (a phrase whose only content was empty disappears). With
 * `restore`, the antecedent of a `*T*`, `*ICH*`, `*EXP*` or `*RNR*` trace is
 * moved to where its (first) trace stands, so it attaches there.
 * Returns undefined for a tree without words.
 */
export function prepareTree(tree: Tree, traces: TraceMode): { root: ConversionNode; words: WordNode[] } | undefined {
  const words: WordNode[] = [];
  const top = tree.children.filter((child) => child.type !== 'meta');
  const built = top.map((child) => build(child, words)).filter((node): node is Working => node !== undefined);
  let root: Working;
  if (built.length === 1) root = built[0]!;
  else {
    root = { kind: 'phrase', category: '', functions: [], label: '', children: built, head: undefined, headWord: undefined, coordination: undefined, source: undefined, coindex: undefined };
  }
  if (traces === 'restore') restore(root);
  const pruned = prune(root);
  return pruned ? { root: pruned, words } : undefined;
}

function build(node: ConstituentNode, words: WordNode[]): Working | undefined {
  switch (node.type) {
    case 'preterminal': {
      const label = parseLabel(node.pos);
      const word: WordNode = {
        kind: 'word',
        index: words.length + 1,
        category: label.category,
        functions: label.functions,
        pos: node.pos,
        form: node.word.form,
        lemma: node.word.lemma,
        source: node,
      };
      words.push(word);
      return word;
    }
    case 'empty':
      return { kind: 'trace', type: node.kind.toUpperCase(), refIndex: node.refIndex };
    case 'meta':
      return undefined;
    case 'phrase': {
      const children = node.children.map((child) => build(child, words)).filter((c): c is Working => c !== undefined);
      // Every field find-heads fills is there from the start, so that phrases keep one shape.
      return {
        kind: 'phrase',
        category: node.label.category,
        functions: node.label.functions,
        label: formatLabel(node.label),
        children,
        head: undefined,
        headWord: undefined,
        coordination: undefined,
        source: node,
        coindex: node.label.coindex,
      };
    }
  }
}

/** Moves each antecedent to the place of its first moving trace. */
function restore(root: Working): void {
  const antecedents = new Map<number, { node: WorkingPhrase; parent: WorkingPhrase }>();
  const traces: Array<{ trace: Working; parent: WorkingPhrase; refIndex: number }> = [];
  const visit = (node: Working, parent: WorkingPhrase | undefined) => {
    if (node.kind === 'phrase') {
      if (node.coindex !== undefined && parent && hasWords(node) && !antecedents.has(node.coindex)) antecedents.set(node.coindex, { node, parent });
      for (const child of node.children) visit(child, node);
    } else if (node.kind === 'trace' && node.refIndex !== undefined && MOVING_TRACES.has(node.type) && parent) {
      traces.push({ trace: node, parent, refIndex: node.refIndex });
    }
  };
  visit(root, undefined);
  const moved = new Set<number>();
  for (const { trace, parent, refIndex } of traces) {
    const antecedent = antecedents.get(refIndex);
    if (!antecedent || moved.has(refIndex) || contains(antecedent.node, trace)) continue;
    moved.add(refIndex);
    const from = antecedent.parent.children;
    from.splice(from.indexOf(antecedent.node), 1);
    parent.children[parent.children.indexOf(trace)] = antecedent.node;
  }
}

function contains(node: Working, target: Working): boolean {
  if (node === target) return true;
  return node.kind === 'phrase' && node.children.some((child) => contains(child, target));
}

function hasWords(node: Working): boolean {
  return node.kind === 'word' || (node.kind === 'phrase' && node.children.some(hasWords));
}

/** Drops traces and phrases left without words, in place: the working phrases become the conversion tree's. */
function prune(node: Working): ConversionNode | undefined {
  if (node.kind === 'word') return node;
  if (node.kind === 'trace') return undefined;
  let kept = 0;
  const children = node.children;
  for (const child of children) {
    const pruned = prune(child);
    if (pruned) children[kept++] = pruned as Working;
  }
  children.length = kept;
  return kept === 0 ? undefined : (node as PhraseNode);
}
