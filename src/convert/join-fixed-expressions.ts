import type { HeadTable } from '../tables/table-model.js';
import type { Attachment } from './attach-dependents.js';
import { phrasesTopDown, type ConversionNode, type PhraseNode, type WordNode } from './conversion-tree.js';

/** The name of the step, as explanations give it. */
export const joinFixedExpressionsStep = 'join-fixed-expressions';

/** A multiword function word found in a tree, for explanations: its words (from 1) and the table line naming it. */
export interface JoinedExpression {
  /** The phrase whose children the words are. */
  phrase: PhraseNode;
  words: number[];
  text: string;
  file: string;
  line: number;
}

/**
 * Restructuring step join-fixed-expressions: a multiword function word
 * (`because of`, `such as`, `according to`) is one word to Universal
 * Dependencies, which draws it with its first word as head and the others
 * hanging from it as `fixed`; no head choice can give that, as the
 * bracketing makes both words dependents of the noun. Where the words of an
 * expression the head table names (`fixed because of`) stand side by side as
 * words of one phrase, the first takes over the attachment of the expression
 * (that of its word whose head lies outside it, the last such one: the
 * function word that marks the relation, `as` of `such as`), the others
 * hang from it as `fixed`, and what hung from them hangs from it. Returns
 * what it joined.
 */
export function joinFixedExpressions(root: ConversionNode, attachments: Attachment[], table: HeadTable): JoinedExpression[] {
  const { byText, firstWords, longest } = table.fixed;
  if (longest === 0) return [];
  const joined: JoinedExpression[] = [];
  for (const phrase of phrasesTopDown(root)) {
    const children = phrase.children;
    for (let start = 0; start + 1 < children.length; start++) {
      const first = children[start]!;
      if (first.kind !== 'word' || !firstWords.has(first.form.toLowerCase())) continue;
      for (let length = Math.min(longest, children.length - start); length >= 2; length--) {
        const run = children.slice(start, start + length);
        if (!run.every((child): child is WordNode => child.kind === 'word')) continue;
        const text = run.map((word) => word.form.toLowerCase()).join(' ');
        const named = byText.get(text);
        if (!named) continue;
        join(run, phrase, attachments);
        joined.push({ phrase, words: run.map((word) => word.index), text, ...named });
        start += length - 1;
        break;
      }
    }
  }
  return joined;
}

function join(run: WordNode[], phrase: PhraseNode, attachments: Attachment[]): void {
  const inRun = new Set(run);
  const first = run[0]!;
  const outward = run.filter((word) => !inRun.has(attachments[word.index - 1]!.governor!));
  const carrier = attachments[outward[outward.length - 1]!.index - 1]!;
  attachments[first.index - 1] = { ...carrier, dependent: first };
  for (const word of run.slice(1)) {
    attachments[word.index - 1] = { dependent: word, governor: first, node: word, parent: phrase, headNode: first, role: 'fixed' };
  }
  // A fixed word has no dependents of its own: what hung from the others hangs from the first.
  for (const attachment of attachments) {
    if (attachment.governor && attachment.governor !== first && inRun.has(attachment.governor) && !inRun.has(attachment.dependent)) attachment.governor = first;
  }
}
