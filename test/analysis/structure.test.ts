import { describe, expect, it } from 'vitest';
import { random, randomTree } from '../support/random-trees.js';
import { analyseTree } from '../../src/analysis/structure.js';

/** Head vectors are written 1-based: `tree(0, 1, 1)` is word 1 the root with words 2 and 3 under it. */
const tree = (...heads: number[]) => [0, ...heads];

// ---------------------------------------------------------------------------
// A reference written straight from the definitions (CHECK-VALUES §1), with no
// care for speed: all words, all pairs, all spans.
// ---------------------------------------------------------------------------
function dominatesByDefinition(heads: number[], ancestor: number, word: number): boolean {
  for (let w = word; w !== 0; w = heads[w]!) if (w === ancestor) return true;
  return false;
}
function yieldByDefinition(heads: number[], word: number): number[] {
  const n = heads.length - 1;
  return Array.from({ length: n }, (_, i) => i + 1).filter((k) => dominatesByDefinition(heads, word, k));
}
/** Nivre & Nilsson (2005): h→d is projective iff h dominates every word between them. */
function nonProjectiveByDefinition(heads: number[]): string[] {
  const arcs: string[] = [];
  for (let d = 1; d < heads.length; d++) {
    const h = heads[d]!;
    if (h === 0) continue;
    for (let k = Math.min(h, d) + 1; k < Math.max(h, d); k++) {
      if (!dominatesByDefinition(heads, h, k)) {
        arcs.push(`${h}->${d}`);
        break;
      }
    }
  }
  return arcs;
}
/** Kuhlmann & Nivre (2006), Defs. 6–7: gaps between neighbours of the sorted yield, per word. */
function gapsByDefinition(heads: number[]): number[] {
  const degrees: number[] = [];
  for (let word = 1; word < heads.length; word++) {
    const y = yieldByDefinition(heads, word);
    let gaps = 0;
    for (let i = 1; i < y.length; i++) if (y[i]! - y[i - 1]! > 1) gaps++;
    degrees.push(gaps);
  }
  return degrees;
}
/** The tree's gap degree is the maximum over its words. */
function gapDegreeByDefinition(heads: number[]): number {
  return Math.max(0, ...gapsByDefinition(heads));
}
/** Kuhlmann & Nivre (2006), Def. 9: components of the span's induced subgraph whose root the head does not dominate. */
function edgeDegreeByDefinition(heads: number[]): number {
  let most = 0;
  for (let d = 1; d < heads.length; d++) {
    const h = heads[d]!;
    if (h === 0) continue;
    const low = Math.min(h, d);
    const high = Math.max(h, d);
    const span = new Set(Array.from({ length: high - low + 1 }, (_, i) => low + i));
    // Union the words of the span joined by an arc inside the span.
    const parent = new Map([...span].map((w) => [w, w]));
    const find = (w: number): number => (parent.get(w) === w ? w : find(parent.get(w)!));
    for (const w of span) if (span.has(heads[w]!)) parent.set(find(w), find(heads[w]!));
    const components = new Map<number, number[]>();
    for (const w of span) components.set(find(w), [...(components.get(find(w)) ?? []), w]);
    let degree = 0;
    for (const members of components.values()) {
      const root = members.find((w) => !span.has(heads[w]!))!;
      if (!dominatesByDefinition(heads, h, root)) degree++;
    }
    most = Math.max(most, degree);
  }
  return most;
}
/** Kuhlmann & Nivre (2006), Def. 8: no l1 < l2 < r1 < r2 with l1, r1 in one yield and l2, r2 in a disjoint other. */
function wellNestedByDefinition(heads: number[]): boolean {
  for (let a = 1; a < heads.length; a++) {
    for (let b = 1; b < heads.length; b++) {
      if (a === b || dominatesByDefinition(heads, a, b) || dominatesByDefinition(heads, b, a)) continue;
      const ya = yieldByDefinition(heads, a);
      const yb = yieldByDefinition(heads, b);
      for (const l1 of ya) for (const r1 of ya) for (const l2 of yb) for (const r2 of yb) {
        if (l1 < l2 && l2 < r1 && r1 < r2) return false;
      }
    }
  }
  return true;
}

describe('structure of a dependency tree', () => {
  // Kuhlmann & Nivre (2006), Fig. 3 (CHECK-VALUES §1): yields {2,3,4}, {2,3,6}, {2,4,6} have gap degree 0, 1, 2.
  it.each([
    [[2, 3, 4], tree(0, 1, 2, 2, 1, 1), 0],
    [[2, 3, 6], tree(0, 1, 2, 1, 1, 2), 1],
    [[2, 4, 6], tree(0, 1, 1, 2, 1, 2), 2],
  ])('gives the yield %j gap degree as in Kuhlmann & Nivre (2006), Fig. 3', (yieldOf2, heads, degree) => {
    expect(yieldByDefinition(heads, 2)).toEqual(yieldOf2);
    expect(analyseTree(heads).gapDegree).toBe(degree);
  });

  it('tells gap degree and edge degree apart: gap degree 2 with edge degree 1 (Kuhlmann & Nivre 2006, Defs. 6–9)', () => {
    // Word 2 heads 4, which heads 6: the yield of 2 is {2, 4, 6}, but each arc spans one gap only.
    const result = analyseTree(tree(0, 1, 1, 2, 1, 4));
    expect([result.gapDegree, result.edgeDegree]).toEqual([2, 1]);
  });

  it('tells gap degree and edge degree apart: gap degree 1 with edge degree 2 (Kuhlmann & Nivre 2006, Defs. 6–9)', () => {
    // Word 1 heads 2 and 5, leaving one gap {3, 4}; words 3 and 4 hang separately from 6, so the arc 1→5 spans two pieces.
    const result = analyseTree(tree(6, 1, 6, 6, 1, 0));
    expect([result.gapDegree, result.edgeDegree]).toEqual([1, 2]);
  });

  it('finds an ill-nested tree (Kuhlmann & Nivre 2006, Def. 8)', () => {
    // The yields {1, 3} and {2, 4} interleave.
    expect(analyseTree(tree(5, 5, 1, 2, 0)).wellNested).toBe(false);
    expect(analyseTree(tree(0, 1, 1, 2, 1, 4)).wellNested).toBe(true);
  });

  it("lists a non-projective arc with its gap, the words between not under its head (Havelka 2007)", () => {
    expect(analyseTree(tree(0, 1, 1, 2, 1, 4)).nonProjectiveArcs).toEqual([
      { head: 2, dependent: 4, gap: [3] },
      { head: 4, dependent: 6, gap: [5] },
    ]);
  });

  it('measures arc lengths, root arcs left out', () => {
    const result = analyseTree(tree(2, 0, 2, 3));
    expect([result.arcs, result.arcLengths]).toEqual([3, [1, 1, 1]]);
  });

  it('agrees with the definitions on thousands of random trees', () => {
    const next = random(20061217);
    for (let round = 0; round < 3000; round++) {
      const heads = randomTree(next, 1 + Math.floor(next() * 12));
      const fast = analyseTree(heads);
      const label = JSON.stringify(heads);
      expect(fast.nonProjectiveArcs.map((a) => `${a.head}->${a.dependent}`), label).toEqual(nonProjectiveByDefinition(heads));
      expect(fast.gapDegree, label).toBe(gapDegreeByDefinition(heads));
      expect(fast.gappedWords, label).toBe(gapsByDefinition(heads).filter((gaps) => gaps > 0).length);
      expect(fast.edgeDegree, label).toBe(edgeDegreeByDefinition(heads));
      expect(fast.wellNested, label).toBe(wellNestedByDefinition(heads));
    }
    // A long test gets its own time budget: the default 5 s is for unit tests on a loaded machine.
  }, 120_000);

  it('handles a 600-word tree with many crossing arcs', () => {
    const next = random(7);
    const heads = randomTree(next, 600);
    const result = analyseTree(heads);
    expect(result.gapDegree).toBe(gapDegreeByDefinition(heads));
  }, 60_000);
});
