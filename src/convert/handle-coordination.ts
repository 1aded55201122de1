import type { Candidate } from '../tables/label-pattern.js';
import type { HeadTable } from '../tables/table-model.js';
import type { Coordination, PhraseNode } from './conversion-tree.js';

export type { Coordination } from './conversion-tree.js';

/**
 * How coordination is drawn:
 * - `first`: the first conjunct heads; further conjuncts hang from it; a
 *   coordinator and the punctuation before a conjunct hang from that conjunct
 *   (as in Universal Dependencies);
 * - `last`: the last conjunct heads; the rest hang from it;
 * - `conjunction`: the (last) coordinator heads; conjuncts and the rest hang from it;
 * - `table`: no special treatment: the head table decides, every other child hangs from the head.
 * Shared dependents (children that are neither conjuncts, coordinators nor
 * punctuation) hang from the head in every style.
 */
export type CoordinationStyle = 'first' | 'last' | 'conjunction' | 'table';

/**
 * Finds coordination in a phrase: a coordinator with a conjunct before and
 * after it. Conjuncts are the child just before the first coordinator, those
 * before it separated by punctuation only, and the child just after each
 * coordinator (with the punctuation-separated ones after that, up to the next
 * coordinator).
 */
export function findCoordination(phrase: PhraseNode, candidates: Candidate[], table: HeadTable): Coordination | undefined {
  const n = candidates.length;
  const isCoordinator = (i: number) => table.coordinators(candidates[i]!);
  const isPunctuation = (i: number) => table.punctuation(candidates[i]!);
  const coordinators: number[] = [];
  for (let i = 1; i < n - 1; i++) if (isCoordinator(i)) coordinators.push(i);
  if (coordinators.length === 0) return undefined;
  const content = (i: number) => i >= 0 && i < n && !isCoordinator(i) && !isPunctuation(i);
  const first = coordinators[0]!;
  // The conjunct before the first coordinator, skipping punctuation.
  let before = first - 1;
  while (before >= 0 && isPunctuation(before)) before--;
  if (!content(before)) return undefined;
  const conjuncts = [before];
  // Further back, conjuncts separated by punctuation only.
  for (let i = before - 1; i >= 1 && isPunctuation(i) && content(i - 1); i -= 2) conjuncts.unshift(i - 1);
  // After each coordinator: the next content child, and punctuation-separated ones up to the next coordinator.
  // An adverbial may stand between ("but rather the legitimacy"): a child of the first conjunct's
  // category, or of the phrase's own, before the next coordinator is the conjunct then.
  const kinds = [candidates[before]!.category, phrase.category];
  for (const c of coordinators) {
    let after = c + 1;
    while (after < n && isPunctuation(after)) after++;
    if (content(after) && !kinds.includes(candidates[after]!.category)) {
      let alike = after + 1;
      while (alike < n && !isCoordinator(alike) && !kinds.includes(candidates[alike]!.category)) alike++;
      if (alike < n && !isCoordinator(alike)) after = alike;
    }
    if (!content(after) || conjuncts.includes(after)) continue;
    conjuncts.push(after);
    for (let i = after + 1; i + 1 < n && isPunctuation(i) && content(i + 1) && !isCoordinator(i + 1); i += 2) {
      if (coordinators.some((k) => k > i)) conjuncts.push(i + 1);
      else break;
    }
  }
  conjuncts.sort((a, b) => a - b);
  // A clause coordinates clauses: what stands before "but" in "Uh, but it was" or "In 2010, and
  // then again …" (an interjection, an adverbial) is not a conjunct but a dependent of the clause.
  const phraseCategory = phrase.category;
  const afterFirst = conjuncts.find((i) => i > first);
  if (afterFirst !== undefined && candidates[afterFirst]!.category === phraseCategory) {
    while (conjuncts.length > 0 && conjuncts[0]! < first && candidates[conjuncts[0]!]!.category !== phraseCategory) conjuncts.shift();
  }
  if (conjuncts.length < 2) return undefined;
  const low = conjuncts[0]!;
  const high = conjuncts[conjuncts.length - 1]!;
  const separators: number[] = [];
  for (let i = low + 1; i < high; i++) if (isPunctuation(i)) separators.push(i);
  return { conjuncts, coordinators: coordinators.filter((k) => k > low && k < high), separators };
}

/** The head child of a coordinated phrase in a style. */
export function coordinationHead(coordination: Coordination, style: Exclude<CoordinationStyle, 'table'>): number {
  if (style === 'first') return coordination.conjuncts[0]!;
  if (style === 'last') return coordination.conjuncts[coordination.conjuncts.length - 1]!;
  return coordination.coordinators[coordination.coordinators.length - 1] ?? coordination.conjuncts[0]!;
}

/**
 * Where each child of a coordinated phrase attaches, by child index (the head
 * child maps to itself), with its part in the coordination.
 */
export function coordinationAttachments(
  childCount: number,
  coordination: Coordination,
  style: Exclude<CoordinationStyle, 'table'>,
  phraseHead: number = coordinationHead(coordination, style),
): Array<{ to: number; role: 'conjunct' | 'coordinator' | 'other' }> {
  // When the phrase's head is not a conjunct, the coordination is among its
  // dependents (`museum and gallery practice`): the coordination's own head
  // hangs from the phrase's head, and the rest from it as usual.
  const groupHead = coordinationHead(coordination, style);
  const inside = (i: number) => i >= coordination.conjuncts[0]! && i <= coordination.conjuncts[coordination.conjuncts.length - 1]!;
  const head = groupHead;
  const { conjuncts, coordinators, separators } = coordination;
  /** Children between a coordinator and the conjunct after it ("but rather the legitimacy …"): they hang from that conjunct. */
  const leading = new Set<number>();
  for (const c of coordinators) {
    const after = conjuncts.find((k) => k > c);
    if (after !== undefined) for (let i = c + 1; i < after; i++) leading.add(i);
  }
  // A coordinator or separator hangs from the conjunct after it when only such children stand between
  // (so that no arc crosses a dependent of the head); else from the head.
  const between = (i: number) => separators.includes(i) || coordinators.includes(i) || leading.has(i);
  const nextConjunct = (i: number) => {
    let next = i + 1;
    while (next < childCount && between(next) && !conjuncts.includes(next)) next++;
    return conjuncts.includes(next) ? next : head;
  };
  return Array.from({ length: childCount }, (_, i) => {
    const role = conjuncts.includes(i) ? 'conjunct' : coordinators.includes(i) ? 'coordinator' : 'other';
    if (phraseHead !== groupHead) {
      if (i === phraseHead) return { to: i, role: 'other' as const };
      if (i === groupHead || !inside(i)) return { to: phraseHead, role: i === groupHead ? ('other' as const) : role };
    }
    if (i === head) return { to: i, role };
    if (style === 'first' && (coordinators.includes(i) || separators.includes(i) || leading.has(i))) return { to: nextConjunct(i), role };
    return { to: head, role };
  });
}
