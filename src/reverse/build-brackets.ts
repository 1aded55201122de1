import { treeHeads, wordsOf } from '../analysis/heads.js';
import type { ConstituentNode, EmptyElement, Phrase, Preterminal, Tree } from '../model/constituency.js';
import type { DependencySentence, DependencyWord } from '../model/dependency.js';
import { parseLabel } from '../model/label.js';
import { sortTreeByFirstTerminal } from '../model/terminal-order.js';
import { categoryOf, type CategoryTable } from '../tables/load-category-table.js';
import { liftNonProjectiveArcs, type Lift } from './lift-nonprojective-arcs.js';

/**
 * How phrases are built from a dependency tree:
 * - `flat`: one phrase per word with dependents, over the word and all its dependents;
 * - `layered`: one phrase level per dependent, the nearest dependents attached first.
 */
export type BracketShape = 'flat' | 'layered';

export interface BracketSettings {
  categories: CategoryTable;
  shape: BracketShape;
  /** Which column gives the part-of-speech brackets. */
  pos: 'upos' | 'xpos';
  /** Build discontinuous phrases for non-projective subtrees instead of lifting arcs (for the XML graph encoding). */
  discontinuous?: boolean;
}

/** A rebuilt bracketing, with the lifts that made it projective. */
export interface Bracketing {
  tree: Tree;
  lifts: Lift[];
}

/**
 * Rebuilds a bracketed tree from a dependency tree. Non-projective arcs are
 * lifted first (lift-nonprojective-arcs); a lifted dependent's phrase gets a
 * coindex n, and `(-NONE- *ICH*-n)` stands inside the phrase of its real head,
 * where the dependent would be, following the bracketing convention for
 * "interpret constituent here" (Bies et al. 1995, from memory). Each
 * dependent's phrase carries its relation as a function tag (`NP-nsubj`), and
 * a word without dependents still gets a phrase when it is a dependent, so
 * that no relation is lost. Every node is generated (no position). Undefined
 * when the sentence's heads are not a tree.
 *
 * With `discontinuous`, nothing is lifted: the phrase of a word covers
 * exactly its subtree, gaps and all, and the tree is a discontinuous one (see
 * the tree contract) whose words carry their place in the sentence.
 */
export function buildBrackets(sentence: DependencySentence, settings: BracketSettings): Bracketing | undefined {
  const words = wordsOf(sentence);
  const n = words.length;
  const checked = treeHeads(sentence);
  if ('problem' in checked) return undefined;
  const original = checked.heads;
  const { heads, lifts } = settings.discontinuous ? { heads: original, lifts: [] } : liftNonProjectiveArcs(original);
  // A lifted dependent's coindex, and the trace inside the phrase of its real head.
  const coindex = new Map<number, number>();
  const traces = new Map<number, Array<{ at: number; index: number }>>();
  for (const lift of lifts) {
    if (coindex.has(lift.dependent)) continue;
    const index = coindex.size + 1;
    coindex.set(lift.dependent, index);
    const realHead = original[lift.dependent]!;
    traces.set(realHead, [...(traces.get(realHead) ?? []), { at: lift.dependent, index }]);
  }
  const dependents: number[][] = Array.from({ length: n + 1 }, () => []);
  let root = 0;
  for (let w = 1; w <= n; w++) {
    if (heads[w] === 0) root = w;
    else dependents[heads[w]!]!.push(w);
  }
  const relations = (w: number) => new Set(dependents[w]!.map((d) => words[d - 1]!.deprel.split(':')[0]!));

  const preterminal = (w: number): Preterminal => {
    const word = words[w - 1]!;
    const tag = settings.pos === 'xpos' && word.xpos !== '_' ? word.xpos : word.upos !== '_' ? word.upos : 'X';
    // Round brackets in forms are written -LRB- and -RRB-, as bracketing conventions have it (Bies et al.
    // 1995, from memory), so that readers without escapes read them; a space becomes a no-break space.
    // The XML graph encoding holds any form as it is, and has a place for the lemma (a bracketing would need --lemmas to read it back).
    if (settings.discontinuous) return { type: 'preterminal', pos: tag, word: { type: 'word', form: word.form, lemma: word.lemma === '_' ? undefined : word.lemma, order: w } };
    const form = word.form.replace(/\(/g, '-LRB-').replace(/\)/g, '-RRB-').replace(/ /g, '\u00a0');
    return { type: 'preterminal', pos: tag, word: { type: 'word', form, lemma: undefined } };
  };
  const trace = (index: number): EmptyElement => ({
    type: 'empty',
    label: parseLabel('-NONE-'),
    text: `*ICH*-${index}`,
    kind: '*ICH*',
    refIndex: index,
  });
  const categoryFor = (w: number) => {
    const word: DependencyWord = words[w - 1]!;
    return categoryOf(settings.categories, { upos: word.upos, xpos: word.xpos, relation: word.deprel, dependents: relations(w) });
  };
  const label = (w: number, withRelation: boolean) => {
    const parts = [categoryFor(w)];
    if (withRelation && w !== root) parts.push(words[w - 1]!.deprel);
    const index = coindex.get(w);
    if (withRelation && index !== undefined) parts.push(String(index));
    return parseLabel(parts.join('-'));
  };

  // Phrases are built bottom-up, dependents before their heads, with an explicit stack: a chain of
  // dependents thousands deep must not exhaust the call stack.
  const built: Array<ConstituentNode | undefined> = new Array(n + 1);
  const build = (w: number): ConstituentNode => {
    // The word's own bracket, its dependents and the traces of dependents lifted away from it, by position.
    const items: Array<{ at: number; node: ConstituentNode }> = [{ at: w, node: preterminal(w) }];
    for (const d of dependents[w]!) items.push({ at: d, node: built[d]! });
    for (const t of traces.get(w) ?? []) items.push({ at: t.at, node: trace(t.index) });
    items.sort((a, b) => a.at - b.at);
    if (settings.shape === 'flat' || items.length === 1) {
      return { type: 'phrase', label: label(w, true), children: items.map((i) => i.node) } satisfies Phrase;
    }
    // Layered: nearest dependents first; every level but the outermost carries the bare category.
    const others = items.filter((i) => i.at !== w || i.node.type !== 'preterminal');
    others.sort((a, b) => Math.abs(a.at - w) - Math.abs(b.at - w) || a.at - b.at);
    let current: { from: number; node: ConstituentNode } = { from: w, node: items.find((i) => i.at === w && i.node.type === 'preterminal')!.node };
    others.forEach((item, k) => {
      const outermost = k === others.length - 1;
      const children = item.at < current.from ? [item.node, current.node] : [current.node, item.node];
      current = {
        from: Math.min(current.from, item.at),
        node: { type: 'phrase', label: outermost ? label(w, true) : label(w, false), children } satisfies Phrase,
      };
    });
    return current.node;
  };
  const pending: Array<{ word: number; expanded: boolean }> = [{ word: root, expanded: false }];
  while (pending.length > 0) {
    const entry = pending.pop()!;
    if (entry.expanded) {
      built[entry.word] = build(entry.word);
      continue;
    }
    pending.push({ word: entry.word, expanded: true });
    for (const d of dependents[entry.word]!) pending.push({ word: d, expanded: false });
  }

  const top = built[root]!;
  const tree: Tree = { type: 'tree', wrapper: { label: '' }, children: [top], id: sentence.id, idPosition: undefined, position: undefined, file: sentence.file, source: undefined };
  if (settings.discontinuous) {
    tree.discontinuous = true;
    // A dependent's phrase may begin before the dependent itself: order children by their first word.
    sortTreeByFirstTerminal(tree);
  }
  return { tree, lifts };
}
