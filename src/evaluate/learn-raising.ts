import { headWordOf, type ConversionNode, type PhraseNode } from '../convert/conversion-tree.js';

/**
 * A clause with a function-tagged child standing under another phrase, seen in
 * training data: whether the gold hangs that child's head word from the head
 * of the phrase above (a raised subject, as UD draws `make [it difficult]`),
 * and the word tags along the clause's line of heads (where a finite verb
 * would show that the clause has a subject of its own).
 */
export interface RaisingObservation {
  under: string;
  clause: string;
  /** The child's function-tag pattern, `*-SBJ`. */
  subject: string;
  raised: boolean;
  tags: string[];
  /** The clause's own head sample, so that head learning can leave out the clauses a learned rule raises. */
  sample: object | undefined;
}

/** A learned raise-subject line and its support in the training data. */
export interface LearnedRaising {
  clauses: string[];
  under: string[];
  subject: string;
  without: string[];
  /** Clauses the rule raises whose gold raises them, and those whose gold does not. */
  right: number;
  wrong: number;
}

/** The word tags of the children of a clause and of the phrases on its line of heads, from its predicate child down. */
function spineTags(clause: PhraseNode, predicate: number): string[] {
  const tags = new Set<string>();
  for (const child of clause.children) if (child.kind === 'word') tags.add(child.category);
  let node: ConversionNode = clause.children[predicate]!;
  while (node.kind === 'phrase') {
    for (const child of node.children) if (child.kind === 'word') tags.add(child.category);
    node = node.children[node.head?.child ?? 0]!;
  }
  return [...tags];
}

/**
 * Records, for each non-head child clause of a phrase (heads chosen by the
 * oracle), each of its function-tagged children that the gold hangs from the
 * phrase's head word beside another child of the clause (raised: subject and
 * predicate both hang from the verb above), or inside the clause (not raised).
 */
export function observeRaising(phrase: PhraseNode, goldHeads: readonly number[], out: RaisingObservation[], sampleOf: ReadonlyMap<PhraseNode, object>): void {
  if (!phrase.head) return;
  const governor = headWordOf(phrase.children[phrase.head.child]!).index;
  phrase.children.forEach((clause, k) => {
    if (k === phrase.head!.child || clause.kind !== 'phrase' || !clause.head) return;
    const outward = clause.children.map((child) => goldHeads[headWordOf(child).index] === governor);
    clause.children.forEach((child, i) => {
      if (child.kind !== 'phrase' || child.functions.length === 0) return;
      // Raised: another child (the predicate) hangs from the verb above too; else the child hangs inside the clause.
      const predicate = outward[i] ? outward.findIndex((out, j) => out && j !== i) : clause.head!.child;
      if (predicate === -1 || predicate === i) return;
      const tags = spineTags(clause, predicate);
      for (const tag of child.functions) out.push({ under: phrase.category, clause: clause.category, subject: `*-${tag}`, raised: outward[i]!, tags, sample: sampleOf.get(clause) });
    });
  });
}

/**
 * The raise-subject line the observations support, if any: the function tag
 * most often raised; as `without` tags, the word tags with which a clause (of
 * those with that child) is raised at most 1 time in 20, seen at least
 * `minimum` times; as clause and `under` categories, those where, without such
 * a tag, raised children outnumber the others. Kept only when the rule raises
 * at least `minimum` more children rightly than wrongly.
 */
export function learnRaising(observations: readonly RaisingObservation[], minimum: number): LearnedRaising | undefined {
  const raisedBy = new Map<string, number>();
  for (const o of observations) if (o.raised) raisedBy.set(o.subject, (raisedBy.get(o.subject) ?? 0) + 1);
  const [subject] = [...raisedBy].sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : 1))[0] ?? [];
  if (subject === undefined) return undefined;
  const seen = observations.filter((o) => o.subject === subject);
  const byTag = new Map<string, { seen: number; raised: number }>();
  for (const o of seen) {
    for (const tag of o.tags) {
      const t = byTag.get(tag) ?? { seen: 0, raised: 0 };
      t.seen++;
      if (o.raised) t.raised++;
      byTag.set(tag, t);
    }
  }
  const without = [...byTag].filter(([, t]) => t.seen >= minimum && t.raised * 20 <= t.seen).map(([tag]) => tag).sort();
  const open = seen.filter((o) => !o.tags.some((tag) => without.includes(tag)));
  const majority = (key: 'clause' | 'under') => {
    const balance = new Map<string, number>();
    for (const o of open) balance.set(o[key], (balance.get(o[key]) ?? 0) + (o.raised ? 1 : -1));
    return [...balance].filter(([, b]) => b > 0).map(([category]) => category).sort();
  };
  const clauses = majority('clause');
  const under = majority('under');
  const applies = open.filter((o) => clauses.includes(o.clause) && under.includes(o.under));
  const right = applies.filter((o) => o.raised).length;
  const wrong = applies.length - right;
  if (clauses.length === 0 || under.length === 0 || without.length === 0 || right - wrong < minimum) return undefined;
  return { clauses, under, subject, without, right, wrong };
}

/** Whether a learned rule raises a child of this observation's clause (so the clause teaches nothing about its own head). */
export function raisesObservation(rule: LearnedRaising, o: RaisingObservation): boolean {
  return o.subject === rule.subject && rule.clauses.includes(o.clause) && rule.under.includes(o.under) && !o.tags.some((tag) => rule.without.includes(tag));
}

/** The table line of a learned rule, with a comment giving its support. */
export function writeRaising(rule: LearnedRaising): string[] {
  return [
    `# A ${rule.subject} child of a clause with none of ${rule.without.join(' ')} on its line of heads hangs in the gold`,
    `# from the head above in ${rule.right.toLocaleString('en-US')} of ${(rule.right + rule.wrong).toLocaleString('en-US')} cases: raised (as UD draws "make it difficult").`,
    `raise-subject ${rule.clauses.join(' ')} under ${rule.under.join(' ')} with ${rule.subject} without ${rule.without.join(' ')}`,
  ];
}

