import type { ConstituentNode, Tree } from '../model/constituency.js';
import { formatLabel, parseLabel } from '../model/label.js';
import type { ConversionNode, WordNode } from './conversion-tree.js';
import { resolveTraces } from '../traces/resolve-traces.js';
import { postOrder, rebuildBottomUp } from '../model/traverse.js';

/** How traces are treated: where phrases stand, or where their traces stand. */
export type TraceMode = 'keep' | 'resolve';

/**
 * Builds the tree the passes convert: words numbered in sentence order,
 * empty elements and CODE/META brackets left out, and phrases with no word
 * left out with them (a phrase whose only content was empty disappears). With
 * `restore`, resolve-traces first moves the antecedent of each `*T*`, `*ICH*`,
 * `*EXP*` or `*RNR*` trace to where its trace stands, so it attaches there.
 * In a discontinuous tree (read from the XML graph encoding, or resolved) the
 * words are numbered by their place in the sentence and the children of every
 * phrase are put in the order of their first word, so that head rules scan
 * them in word order. Returns undefined for a tree without words.
 */
export function prepareTree(tree: Tree, traces: TraceMode): { root: ConversionNode; words: WordNode[] } | undefined {
  const source = traces === 'resolve' ? resolveTraces(tree).tree : tree;
  const words: WordNode[] = [];
  const top = build(source.children, words);
  if (top.length === 0) return undefined;
  const root: ConversionNode =
    top.length === 1
      ? top[0]!
      : { kind: 'phrase', category: '', functions: [], label: '', children: top, head: undefined, headWord: undefined, coordination: undefined, source: undefined };
  // Orders count empty elements and notes too; words are numbered among words.
  if (words.length > 0 && words[0]!.source.word.order !== undefined) {
    words.sort((a, b) => a.index - b.index);
    words.forEach((word, i) => (word.index = i + 1));
  }
  if (source.discontinuous) sortByFirstWord(root);
  return { root, words };
}

/**
 * Builds the conversion nodes of tree nodes, bottom-up without recursion;
 * nodes that hold no word are left out. Words are numbered as they come, left to right.
 */
function build(nodes: ConstituentNode[], words: WordNode[]): ConversionNode[] {
  return rebuildBottomUp<ConstituentNode, ConversionNode>(
    nodes,
    (node) => (node.type === 'phrase' ? node.children : undefined),
    (node, children) => {
      switch (node.type) {
        case 'preterminal': {
          const label = parseLabel(node.pos);
          const word: WordNode = {
            kind: 'word',
            // In a discontinuous tree the order stands in until the words are renumbered.
            index: node.word.order ?? words.length + 1,
            category: label.category,
            functions: node.functions ? [...label.functions, ...node.functions] : label.functions,
            pos: node.pos,
            form: node.word.form,
            lemma: node.word.lemma,
            source: node,
          };
          words.push(word);
          return word;
        }
        case 'empty':
        case 'meta':
          return undefined;
        case 'phrase':
          if (children.length === 0) return undefined;
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
          };
      }
    },
  );
}

/** Puts children in the order of their first word, deepest phrases first. */
function sortByFirstWord(root: ConversionNode): void {
  const first = new Map<ConversionNode, number>();
  for (const node of postOrder<ConversionNode>([root], (n) => (n.kind === 'phrase' ? n.children : undefined))) {
    if (node.kind === 'word') {
      first.set(node, node.index);
      continue;
    }
    const keyed = node.children.map((child) => ({ child, first: first.get(child)! }));
    keyed.sort((a, b) => a.first - b.first);
    keyed.forEach((entry, i) => (node.children[i] = entry.child));
    first.set(node, keyed[0]!.first);
  }
}
