import { describe, expect, it } from 'vitest';
import { analyseTree } from '../../src/analysis/structure.js';
import { liftNonProjectiveArcs } from '../../src/reverse/lift-nonprojective-arcs.js';

const tree = (...heads: number[]) => [0, ...heads];

// Nivre & Nilsson (2005), CHECK-VALUES §1: LIFT(wj→wk) = wi→wk where wi→wj; the
// shortest non-projective arc first, ties left to right, until projective.
describe('lifting non-projective arcs', () => {
  it('lifts a crossing arc to the head of its head', () => {
    // 2→4 crosses over 3, which hangs from the root word 1: 4 goes up to 1.
    expect(liftNonProjectiveArcs(tree(0, 1, 1, 2))).toEqual({ heads: tree(0, 1, 1, 1), lifts: [{ dependent: 4, from: 2, to: 1 }] });
  });

  it('lifts the shorter arc first, then looks again', () => {
    // Arcs 2→4 (length 2, over 3) and 4→6 (length 2, over 5): the left one first.
    const { lifts, heads } = liftNonProjectiveArcs(tree(0, 1, 1, 2, 1, 4));
    expect(lifts).toEqual([
      { dependent: 4, from: 2, to: 1 },
      { dependent: 6, from: 4, to: 1 },
    ]);
    expect(analyseTree(heads).nonProjectiveArcs).toEqual([]);
  });

  it('lifts an arc more than once when one lift is not enough', () => {
    // 5 hangs from 3 over 4; 3 hangs from 2 over nothing; 4 hangs from 1: 5 is lifted until it is projective.
    const { lifts } = liftNonProjectiveArcs(tree(0, 1, 2, 1, 3));
    expect(lifts.map((l) => l.dependent)).toEqual([5, 5]);
    expect(lifts.at(-1)!.to).toBe(1);
  });

  it('leaves a projective tree alone', () => {
    expect(liftNonProjectiveArcs(tree(2, 0, 2))).toEqual({ heads: tree(2, 0, 2), lifts: [] });
  });
});
