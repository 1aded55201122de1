import type { Candidate } from '../tables/label-pattern.js';
import type { HeadTable } from '../tables/table-model.js';
import type { Coordination, PhraseNode } from './conversion-tree.js';

/** The name of the step, as explanations give it. */
export const attachLateConjunctsStep = 'attach-late-conjuncts';

/**
 * Restructuring step attach-late-conjuncts (head table `late-conjuncts S …`):
 * a bracketing often coordinates a clause with the clause it ends
 * (`(S (NP It) (VP rained) , (CC but) (S we went out))`), so no two children
 * are conjuncts and no head choice makes the later clause a conjunct or hangs
 * the coordinator from it, as Universal Dependencies does. In a phrase the
 * table names that holds no coordination of its own children, the first
 * child of the phrase's own category after a coordinator standing after the
 * head child is a late conjunct: it and the head child are drawn as a
 * coordination (so the coordinator, the punctuation before it and the words
 * between hang from the late conjunct). Returns the coordination, or undefined.
 */
export function findLateConjuncts(phrase: PhraseNode, candidates: Candidate[], head: number, table: HeadTable): Coordination | undefined {
  const late = table.lateConjuncts;
  if (!late || !late.phrases(phrase)) return undefined;
  const found = lateConjunctsOf(phrase, candidates, head, table);
  return found && { ...found, late: { file: late.file, line: late.line } };
}

/** The late conjuncts a phrase would have, whether or not the table switches the step on for it (heads suggest asks). */
export function lateConjunctsOf(phrase: Pick<PhraseNode, 'category'>, candidates: Candidate[], head: number, table: Pick<HeadTable, 'coordinators' | 'punctuation'>): Coordination | undefined {
  const conjuncts = [head];
  const coordinators: number[] = [];
  for (let k = head + 1; k + 1 < candidates.length; k++) {
    if (!table.coordinators(candidates[k]!)) continue;
    // The first child of the phrase's category before the next coordinator ("but rather we went out").
    let after = k + 1;
    while (after < candidates.length && !table.coordinators(candidates[after]!) && candidates[after]!.category !== phrase.category) after++;
    const conjunct = candidates[after];
    if (!conjunct || conjunct.category !== phrase.category || table.coordinators(conjunct)) continue;
    coordinators.push(k);
    conjuncts.push(after);
    k = after;
  }
  if (conjuncts.length < 2) return undefined;
  const high = conjuncts[conjuncts.length - 1]!;
  const separators: number[] = [];
  for (let i = head + 1; i < high; i++) if (table.punctuation(candidates[i]!)) separators.push(i);
  return { conjuncts, coordinators, separators };
}
