import type { HeadTable } from '../tables/table-model.js';
import { headWordOf, phrasesBottomUp, phrasesTopDown, type ConversionNode, type PhraseNode, type WordNode } from './conversion-tree.js';
import { candidateOf } from './find-heads.js';
import { coordinationAttachments, type CoordinationStyle } from './handle-coordination.js';

/** Where punctuation attaches: as any other dependent in its phrase, or to the root word. */
export type PunctuationPolicy = 'phrase' | 'root';

/**
 * Subject raising (head table `raise-subject …`): the subject of a verbless or
 * non-finite clause under a verb phrase attaches to that verb phrase's head.
 */
function raiseSubjects(root: ConversionNode, attachments: Attachment[], rule: NonNullable<HeadTable['raising']>): void {
  // Lowest clauses first, as a raised subject may raise again from the phrase above.
  for (const phrase of phrasesBottomUp(root)) {
    const conjuncts = phrase.coordination?.conjuncts ?? [];
    for (const [k, child] of phrase.children.entries()) {
      if (child.kind !== 'phrase') continue;
      // A later conjunct hangs from the first, not from the phrase's head: its subject has nowhere to rise to without crossing.
      if (conjuncts.includes(k) && k !== conjuncts[0]) continue;
      const subjectIndex = raisedSubject(phrase, child, rule);
      if (subjectIndex === -1 || subjectIndex === child.head?.child) continue;
      const subject = child.children[subjectIndex]!;
      const word = headWordOf(subject);
      const headNode = phrase.children[phrase.head?.child ?? 0]!;
      attachments[word.index - 1] = { dependent: word, governor: headWordOf(phrase), node: subject, parent: phrase, headNode, role: 'raised' };
    }
  }
}

/**
 * The child of a clause whose subject the rule raises to the phrase above
 * (`phrase` holds `clause`), or -1 when the rule does not apply there.
 */
export function raisedSubject(phrase: PhraseNode, clause: PhraseNode, rule: NonNullable<HeadTable['raising']>): number {
  if (!rule.under(candidateOf(phrase)) || !rule.clause(candidateOf(clause))) return -1;
  const candidates = clause.children.map(candidateOf);
  if (spineHas(clause, rule.without)) return -1;
  return candidates.findIndex((c) => rule.subject(c));
}

/**
 * Whether a child of the clause, or of a phrase on its line of heads, matches:
 * the finite verb of `[the letter] is perhaps the best piece` stands one level
 * down, beside the predicate that heads the verb phrase.
 */
function spineHas(clause: PhraseNode, matcher: (candidate: ReturnType<typeof candidateOf>) => boolean): boolean {
  let node: ConversionNode = clause;
  while (node.kind === 'phrase') {
    if (node.children.some((child) => matcher(candidateOf(child)))) return true;
    node = node.children[node.head?.child ?? 0]!;
  }
  return false;
}

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
  role: 'conjunct' | 'coordinator' | 'raised' | 'fixed' | 'other';
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
  for (const phrase of phrasesTopDown(root)) {
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
    });
  }
  if (table.raising) raiseSubjects(root, attachments, table.raising);
  if (punctuation === 'root') {
    for (const attachment of attachments) {
      if (attachment.governor && attachment.dependent !== top && table.punctuation(candidateOf(attachment.dependent))) {
        attachment.governor = top;
      }
    }
  }
  return attachments;
}
