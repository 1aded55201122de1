import type { ConstituentNode, Phrase, Preterminal, Tree } from '../model/constituency.js';
import { formatLabel } from '../model/label.js';
import { writeNode } from '../formats/bracketed/write-bracketed.js';
import { findHeads } from '../convert/find-heads.js';
import { prepareTree } from '../convert/prepare-tree.js';
import type { ConversionSettings } from '../convert/convert-tree.js';
import type { ConversionNode } from '../convert/conversion-tree.js';
import { nodesTopDown, preOrder } from '../model/traverse.js';

/**
 * Lossless mode: what a bracketing needs to come back exactly, carried in
 * the MISC column of each word (key `Brackets`), in the spirit of the
 * head-ordered encoding of Fernández-González & Martins (2015). A word's value
 * lists the phrases it heads, lowest first, separated by `>`; each is its label
 * and its children in order: `h` the head child (the lower phrase, or the
 * word's own bracket), `dN` the phrase (or bracket) headed by word N, and `n`
 * followed by a bracket written out for nodes without words (empty elements,
 * notes). The sentence-level comment `# brackets = …` gives the outer bracket,
 * whether the tree had an identifier, and the top nodes in the same notation.
 * Special characters are percent-escaped.
 */
export const BRACKETS_KEY = 'Brackets';

const escape = (text: string) => text.replace(/[%|,{}>= \t;]/g, (c) => `%${c.charCodeAt(0).toString(16).padStart(2, '0')}`);

/** Encodes a tree's bracketing: a value per word (1-based), and the sentence-level comment. */
export function encodeBrackets(tree: Tree, settings: ConversionSettings): { words: string[]; sentence: string } | undefined {
  // Heads with traces kept: every phrase is then headed by one of its own words.
  const prepared = prepareTree(tree, 'keep');
  if (!prepared) return undefined;
  findHeads(prepared.root, settings.heads, settings.coordination);
  const headOfPhrase = new Map<Phrase, number>();
  const indexOfWord = new Map<Preterminal, number>();
  for (const node of preOrder<ConversionNode>([prepared.root], (n) => (n.kind === 'phrase' ? n.children : undefined))) {
    if (node.kind === 'word') indexOfWord.set(node.source, node.index);
    else if (node.source) headOfPhrase.set(node.source, node.headWord!.index);
  }
  const headOf = (node: ConstituentNode): number | undefined =>
    node.type === 'preterminal' ? indexOfWord.get(node) : node.type === 'phrase' ? headOfPhrase.get(node) : undefined;
  const chains: string[][] = prepared.words.map(() => []);
  const item = (child: ConstituentNode, head: number | undefined) => {
    const index = headOf(child);
    if (index === undefined) return `n${escape(writeNode(child))}`;
    return index === head ? 'h' : `d${index}`;
  };
  for (const node of nodesTopDown(tree.children)) {
    if (node.type !== 'phrase') continue;
    const head = headOfPhrase.get(node);
    if (head === undefined) continue;
    const children = node.children.map((child) => item(child, head));
    chains[head - 1]!.push(`${escape(formatLabel(node.label))}{${children.join(',')}}`);
  }
  const top = tree.children.map((child) => item(child, undefined)).join(',');
  const wrapper = tree.wrapper ? `wrapper=${escape(tree.wrapper.label)}` : 'wrapper';
  const id = tree.id === undefined ? 'id=no' : 'id=yes';
  // The walk meets a word's phrases top down; the chain lists them lowest first.
  return { words: chains.map((chain) => chain.reverse().join('>')), sentence: `${wrapper}; ${id}; top=${top}` };
}
