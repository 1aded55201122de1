import type { HeadTable, LabelContext, LabelTable } from '../tables/table-model.js';
import type { Attachment } from './attach-dependents.js';
import { candidateOf } from './find-heads.js';

/**
 * The relation of every attachment: `root` for the root; with a label table,
 * the relation of its first rule whose conditions all hold (else its
 * `otherwise`); without one, `conj` and `cc` in coordinations, else the first
 * function tag of the dependent's phrase (lower-cased letters and a subtype
 * colon), else `dep`.
 */
export function assignLabels(
  attachments: Attachment[],
  table: LabelTable | undefined,
  heads: HeadTable,
  contexts: Array<LabelContext | undefined> = labelContexts(attachments, heads),
): string[] {
  return attachments.map((attachment, i) => {
    const context = contexts[i];
    if (!context) return 'root';
    // A word of a multiword function word (join-fixed-expressions) is `fixed`, whatever the table says.
    if (attachment.role === 'fixed') return 'fixed';
    if (!table) return untabled(attachment);
    for (const rule of table.rules) if (rule.conditions.every((condition) => condition.test(context))) return rule.relation;
    return table.otherwise;
  });
}

/** What label rules (and word-class rules) see of each attachment; undefined for the root. */
export function labelContexts(attachments: Attachment[], heads: HeadTable): Array<LabelContext | undefined> {
  return attachments.map((attachment) => {
    if (!attachment.governor || !attachment.parent || !attachment.headNode) return undefined;
    const word = attachment.dependent;
    const siblings = attachment.parent.children;
    const at = siblings.indexOf(attachment.node);
    return {
      dependent: candidateOf(attachment.node),
      head: candidateOf(attachment.headNode),
      parent: candidateOf(attachment.parent),
      children: attachment.node.kind === 'phrase' ? attachment.node.children.map(candidateOf) : [],
      previous: at > 0 ? candidateOf(siblings[at - 1]!) : undefined,
      next: at >= 0 && at + 1 < siblings.length ? candidateOf(siblings[at + 1]!) : undefined,
      word: { pos: word.pos, form: word.form, lemma: word.lemma },
      side: word.index < attachment.governor.index ? 'left' : 'right',
      role: attachment.role === 'other' && heads.punctuation(candidateOf(word)) ? 'punctuation' : attachment.role,
    };
  });
}

function untabled(attachment: Attachment): string {
  if (attachment.role === 'conjunct') return 'conj';
  if (attachment.role === 'coordinator') return 'cc';
  if (attachment.role === 'raised') return 'obj';
  const tag = attachment.node.kind === 'phrase' ? attachment.node.functions[0] : undefined;
  // Letters and a subtype colon survive: `SBJ` gives `sbj`, `obl:tmod` stays as it is.
  const relation = tag?.toLowerCase().replace(/[^a-z:]/g, '').replace(/^:+|:+$/g, '');
  return relation && /^[a-z]+(:[a-z]+)?$/.test(relation) ? relation : 'dep';
}
