import { analyseTree } from '../analysis/structure.js';

/** One lift: the dependent, the head it had, and the head it was given. */
export interface Lift {
  dependent: number;
  from: number;
  to: number;
}

/**
 * Makes a tree projective by lifting (Nivre & Nilsson 2005, CHECK-VALUES §1):
 * LIFT(wj→wk) = wi→wk where wi→wj, applied to the shortest non-projective
 * arc first, ties left to right, until no arc is non-projective. Returns the
 * projective head vector and the lifts in the order they were made.
 */
export function liftNonProjectiveArcs(heads: readonly number[]): { heads: number[]; lifts: Lift[] } {
  const lifted = [...heads];
  const lifts: Lift[] = [];
  for (;;) {
    const arcs = analyseTree(lifted).nonProjectiveArcs;
    if (arcs.length === 0) return { heads: lifted, lifts };
    let best = arcs[0]!;
    const length = (a: { head: number; dependent: number }) => Math.abs(a.head - a.dependent);
    const left = (a: { head: number; dependent: number }) => Math.min(a.head, a.dependent);
    for (const arc of arcs) {
      if (length(arc) < length(best) || (length(arc) === length(best) && left(arc) < left(best))) best = arc;
    }
    const to = lifted[best.head]!;
    lifts.push({ dependent: best.dependent, from: best.head, to });
    lifted[best.dependent] = to;
  }
}
