import type { HeadTable, LabelContext, LabelRule, LabelTable } from '../tables/table-model.js';
import type { Candidate } from '../tables/label-pattern.js';
import type { WordNode } from './conversion-tree.js';
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
    for (const rule of rulesFor(table, context.dependent.category)) if (rule.conditions.every((condition) => condition.test(context))) return rule.relation;
    return table.otherwise;
  });
}

/** Per rule list and category of dependent, the rules that could hold, in order: most rules ask for a few categories only. */
const rulesByCategory = new WeakMap<readonly LabelRule[], Map<string, LabelRule[]>>();

function rulesFor(table: LabelTable, category: string): LabelRule[] {
  let byCategory = rulesByCategory.get(table.rules);
  if (!byCategory) rulesByCategory.set(table.rules, (byCategory = new Map()));
  let rules = byCategory.get(category);
  if (!rules) {
    rules = table.rules.filter((rule) => rule.conditions.every((condition) => !condition.dependentCategory || condition.dependentCategory(category)));
    if (byCategory.size > 10_000) byCategory.clear();
    byCategory.set(category, rules);
  }
  return rules;
}

/** What label rules (and word-class rules) see of each attachment; undefined for the root. */
export function labelContexts(attachments: Attachment[], heads: HeadTable): Array<LabelContext | undefined> {
  return attachments.map((attachment) => (attachment.governor && attachment.parent && attachment.headNode ? new AttachmentContext(attachment, heads) : undefined));
}

/**
 * The context of one attachment. Rules ask about a few of its parts, mostly the
 * dependent: the others (children, neighbours) are worked out when first asked for.
 */
class AttachmentContext implements LabelContext {
  readonly dependent: Candidate;
  readonly word: WordNode;
  readonly side: 'left' | 'right';
  readonly role: LabelContext['role'];
  private cached: { head?: Candidate; parent?: Candidate; children?: Candidate[]; previous?: Candidate | undefined; next?: Candidate | undefined } = {};

  constructor(
    private readonly attachment: Attachment,
    heads: HeadTable,
  ) {
    const word = attachment.dependent;
    this.dependent = candidateOf(attachment.node);
    this.word = word;
    this.side = word.index < attachment.governor!.index ? 'left' : 'right';
    this.role = attachment.role === 'other' && heads.punctuation(candidateOf(word)) ? 'punctuation' : attachment.role;
  }

  get head(): Candidate {
    return (this.cached.head ??= candidateOf(this.attachment.headNode!));
  }

  get parent(): Candidate {
    return (this.cached.parent ??= candidateOf(this.attachment.parent!));
  }

  get children(): Candidate[] {
    const node = this.attachment.node;
    return (this.cached.children ??= node.kind === 'phrase' ? node.children.map(candidateOf) : []);
  }

  get previous(): Candidate | undefined {
    if (!('previous' in this.cached)) {
      const at = this.attachment.parent!.children.indexOf(this.attachment.node);
      this.cached.previous = at > 0 ? candidateOf(this.attachment.parent!.children[at - 1]!) : undefined;
    }
    return this.cached.previous;
  }

  get next(): Candidate | undefined {
    if (!('next' in this.cached)) {
      const siblings = this.attachment.parent!.children;
      const at = siblings.indexOf(this.attachment.node);
      this.cached.next = at >= 0 && at + 1 < siblings.length ? candidateOf(siblings[at + 1]!) : undefined;
    }
    return this.cached.next;
  }
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
