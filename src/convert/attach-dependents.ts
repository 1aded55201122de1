import type { HeadTable } from '../tables/table-model.js';
import { headWordOf, type ConversionNode, type PhraseNode, type WordNode } from './conversion-tree.js';
import { candidateOf } from './find-heads.js';
import { coordinationAttachments, type CoordinationStyle } from './handle-coordination.js';

/** Where punctuation attaches: as any other dependent in its phrase, or to the root word. */
export type PunctuationPolicy = 'phrase' | 'root';

/** A word's attachment to its head word, with what the label table looks at. */
export interface Attachment {
  dependent: WordNode;
  /** The head word; null for the root. */
  governor: WordNode | null;
  /** The dependent's maximal projection: the child of `parent` whose head word it is. */
  node: ConversionNode;
  /** The phrase in which it attaches; null for the root. */
  parent: PhraseNode | null;
  /** The child of `parent` it attaches to. */
  headNode: ConversionNode | null;
  role: 'conjunct' | 'coordinator' | 'other';
}

/**
 * Attaches, in every phrase, the head word of each non-head child to the head
 * word of the child it hangs from: the head child, or, in a coordination, the
 * child its style says. The top node's head word is the root. Returns one
 * attachment per word, in word order.
 */
export function attachDependents(
  root: ConversionNode,
  words: WordNode[],
  table: HeadTable,
  style: CoordinationStyle,
  punctuation: PunctuationPolicy,
): Attachment[] {
  const attachments: Attachment[] = new Array(words.length);
  const top = headWordOf(root);
  attachments[top.index - 1] = { dependent: top, governor: null, node: root, parent: null, headNode: null, role: 'other' };
  const visit = (phrase: PhraseNode) => {
    const children = phrase.children;
    const headIndex = phrase.head?.child ?? 0;
    const plan =
      phrase.coordination && style !== 'table'
        ? coordinationAttachments(children.length, phrase.coordination, style, headIndex)
        : children.map((_, i) => ({ to: headIndex, role: 'other' as const }));
    children.forEach((child, i) => {
      if (i !== headIndex) {
        const dependent = headWordOf(child);
        const target = children[plan[i]!.to]!;
        attachments[dependent.index - 1] = { dependent, governor: headWordOf(target), node: child, parent: phrase, headNode: target, role: plan[i]!.role };
      }
      if (child.kind === 'phrase') visit(child);
    });
  };
  if (root.kind === 'phrase') visit(root);
  if (punctuation === 'root') {
    for (const attachment of attachments) {
      if (attachment.governor && attachment.dependent !== top && table.punctuation(candidateOf(attachment.dependent))) {
        attachment.governor = top;
      }
    }
  }
  return attachments;
}
