/**
 * Structure of a dependency tree, after Kuhlmann & Nivre (2006), Nivre &
 * Nilsson (2005) and Havelka (2007); definitions in ../shared/CHECK-VALUES.md §1
 * and the glossary in DEVELOPERS.md.
 *
 * A tree is a head vector: `heads[i]` is the head of word i (1-based, index 0
 * unused), 0 for the root. The arcs are the non-root ones.
 */

/** A non-projective arc: its head does not dominate every word between it and its dependent. */
export interface NonProjectiveArc {
  head: number;
  dependent: number;
  /** The gap of the arc (Havelka 2007): words strictly between the two not dominated by the head, in order. */
  gap: number[];
}

/** What the analysis finds in one tree. */
export interface TreeStructure {
  /** Number of words. */
  words: number;
  /** Arcs other than root arcs. */
  arcs: number;
  /** Non-projective arcs (Nivre & Nilsson 2005), in order of their dependents. */
  nonProjectiveArcs: NonProjectiveArc[];
  /** Gap degree of the tree: the most gaps in any word's yield (Kuhlmann & Nivre 2006, Defs. 6–7). */
  gapDegree: number;
  /** Words of gap degree 1 or more: their yield has a gap, so their phrase is discontinuous. */
  gappedWords: number;
  /** Edge degree of the tree: the highest edge degree of any arc (Kuhlmann & Nivre 2006, Def. 9). */
  edgeDegree: number;
  /** No two disjoint subtrees interleave (Kuhlmann & Nivre 2006, Def. 8). */
  wellNested: boolean;
  /** Length |head − dependent| of every arc, in order of dependents. */
  arcLengths: number[];
}

/** Shape of a head vector: order of visit and subtree of each word. */
interface Layout {
  /** Pre-order number of each word. */
  pre: Int32Array;
  /** Subtree size of each word (itself included). */
  size: Int32Array;
  /** Words in pre-order. */
  order: Int32Array;
}

/**
 * Analyses a tree. Projectivity and gap degree take O(n log n); edge degree
 * and well-nestedness look only at non-projective arcs and at words whose
 * yield has gaps, so they stay fast on long sentences, which have few.
 */
export function analyseTree(heads: readonly number[]): TreeStructure {
  const n = heads.length - 1;
  const layout = layOut(heads);
  const nonProjectiveArcs = findNonProjectiveArcs(heads, layout);
  const gaps = gapDegrees(heads, layout);
  let gapDegree = 0;
  let gappedWords = 0;
  for (let word = 1; word <= n; word++) {
    gapDegree = Math.max(gapDegree, gaps[word]!);
    if (gaps[word]! > 0) gappedWords++;
  }
  let edgeDegree = 0;
  for (const arc of nonProjectiveArcs) edgeDegree = Math.max(edgeDegree, degreeOfEdge(heads, layout, arc.head, arc.dependent));
  const arcLengths: number[] = [];
  let arcs = 0;
  for (let word = 1; word <= n; word++) {
    if (heads[word] === 0) continue;
    arcs++;
    arcLengths.push(Math.abs(heads[word]! - word));
  }
  const wellNested = gapDegree === 0 || isWellNested(layout, gaps);
  return { words: n, arcs, nonProjectiveArcs, gapDegree, gappedWords, edgeDegree, wellNested, arcLengths };
}

/** Does `ancestor` dominate `word` (reflexively)? */
function dominates(layout: Layout, ancestor: number, word: number): boolean {
  const start = layout.pre[ancestor]!;
  return layout.pre[word]! >= start && layout.pre[word]! < start + layout.size[ancestor]!;
}

function layOut(heads: readonly number[]): Layout {
  const n = heads.length - 1;
  const firstChild = new Int32Array(n + 1).fill(-1);
  const nextSibling = new Int32Array(n + 1).fill(-1);
  const roots: number[] = [];
  // Children linked in reverse so that the stack visits them left to right.
  for (let word = n; word >= 1; word--) {
    const head = heads[word]!;
    if (head === 0) roots.push(word);
    else {
      nextSibling[word] = firstChild[head]!;
      firstChild[head] = word;
    }
  }
  const pre = new Int32Array(n + 1);
  const size = new Int32Array(n + 1);
  const order = new Int32Array(n + 1);
  let counter = 0;
  const stack: number[] = roots.reverse();
  while (stack.length > 0) {
    const word = stack.pop()!;
    pre[word] = ++counter;
    order[counter] = word;
    const children: number[] = [];
    for (let child = firstChild[word]!; child !== -1; child = nextSibling[child]!) children.push(child);
    for (let k = children.length - 1; k >= 0; k--) stack.push(children[k]!);
  }
  for (let k = n; k >= 1; k--) {
    const word = order[k]!;
    size[word] = (size[word] ?? 0) + 1;
    const head = heads[word]!;
    if (head !== 0) size[head] = size[head]! + size[word]!;
  }
  return { pre, size, order };
}

/**
 * An arc h→d is non-projective when some word strictly between them is not in
 * h's subtree. Counted for all arcs at once: sweeping positions left to right,
 * a Fenwick tree over pre-order numbers counts the words so far that fall in
 * h's subtree.
 */
function findNonProjectiveArcs(heads: readonly number[], layout: Layout): NonProjectiveArc[] {
  const n = heads.length - 1;
  // For each position x, the arcs that need the count of subtree words at positions ≤ x.
  const asks: number[][] = Array.from({ length: n + 1 }, () => []);
  for (let d = 1; d <= n; d++) {
    const h = heads[d]!;
    if (h === 0 || Math.abs(h - d) < 2) continue;
    asks[Math.min(h, d)]!.push(d);
    asks[Math.max(h, d) - 1]!.push(d);
  }
  const tree = new Int32Array(n + 2);
  const add = (index: number) => {
    for (let i = index; i <= n; i += i & -i) tree[i]!++;
  };
  const sum = (index: number) => {
    let total = 0;
    for (let i = index; i > 0; i -= i & -i) total += tree[i]!;
    return total;
  };
  const inSubtree = (h: number) => sum(layout.pre[h]! + layout.size[h]! - 1) - sum(layout.pre[h]! - 1);
  const before = new Int32Array(n + 1); // count at min(h, d), per dependent
  const inside = new Int32Array(n + 1);
  for (let x = 1; x <= n; x++) {
    add(layout.pre[x]!);
    for (const d of asks[x]!) {
      const h = heads[d]!;
      if (x === Math.min(h, d)) before[d] = inSubtree(h);
      else inside[d] = inSubtree(h) - before[d]!;
    }
  }
  const arcs: NonProjectiveArc[] = [];
  for (let d = 1; d <= n; d++) {
    const h = heads[d]!;
    if (h === 0 || Math.abs(h - d) < 2) continue;
    const between = Math.abs(h - d) - 1;
    if (inside[d] === between) continue;
    const gap: number[] = [];
    for (let k = Math.min(h, d) + 1; k < Math.max(h, d); k++) if (!dominates(layout, h, k)) gap.push(k);
    arcs.push({ head: h, dependent: d, gap });
  }
  return arcs;
}

/**
 * Gaps in each word's yield. A yield of s words with p adjacent pairs
 * (k, k+1) inside it falls into s − p blocks, so s − p − 1 gaps; a pair lies
 * inside the yield of u exactly when u dominates the pair's lowest common
 * ancestor, found by binary lifting.
 */
function gapDegrees(heads: readonly number[], layout: Layout): Int32Array {
  const n = heads.length - 1;
  const gaps = new Int32Array(n + 1);
  if (n === 0) return gaps;
  const depth = new Int32Array(n + 1);
  for (let k = 1; k <= n; k++) {
    const word = layout.order[k]!;
    const head = heads[word]!;
    depth[word] = head === 0 ? 0 : depth[head]! + 1;
  }
  const levels = Math.max(1, Math.ceil(Math.log2(n + 1)));
  const up: Int32Array[] = [Int32Array.from(heads)];
  for (let j = 1; j < levels; j++) {
    const previous = up[j - 1]!;
    const next = new Int32Array(n + 1);
    for (let word = 1; word <= n; word++) next[word] = previous[previous[word]!]!;
    up.push(next);
  }
  const lca = (a: number, b: number): number => {
    if (depth[a]! < depth[b]!) [a, b] = [b, a];
    let lift = depth[a]! - depth[b]!;
    for (let j = 0; lift > 0; j++, lift >>= 1) if (lift & 1) a = up[j]![a]!;
    if (a === b) return a;
    for (let j = levels - 1; j >= 0; j--) {
      if (up[j]![a] !== up[j]![b]) {
        a = up[j]![a]!;
        b = up[j]![b]!;
      }
    }
    // Different roots (a forest) share no ancestor.
    return heads[a] === heads[b] ? heads[a]! : 0;
  };
  const pairs = new Int32Array(n + 1);
  for (let k = 1; k < n; k++) {
    const ancestor = lca(k, k + 1);
    if (ancestor !== 0) pairs[ancestor]!++;
  }
  for (let k = n; k >= 1; k--) {
    const word = layout.order[k]!;
    const head = heads[word]!;
    if (head !== 0) pairs[head] = pairs[head]! + pairs[word]!;
  }
  for (let word = 1; word <= n; word++) gaps[word] = layout.size[word]! - pairs[word]! - 1;
  return gaps;
}

/**
 * Edge degree of the arc h→d: the connected pieces of the subgraph the words
 * of the span [min, max] induce, counting those whose root h does not dominate.
 */
function degreeOfEdge(heads: readonly number[], layout: Layout, h: number, d: number): number {
  const low = Math.min(h, d);
  const high = Math.max(h, d);
  let degree = 0;
  for (let k = low; k <= high; k++) {
    const head = heads[k]!;
    const isRootOfPiece = head === 0 || head < low || head > high;
    if (isRootOfPiece && !dominates(layout, h, k)) degree++;
  }
  return degree;
}

/**
 * Kuhlmann & Nivre (2006), Def. 8: no two disjoint subtrees interleave. Two
 * yields can interleave only if both have gaps, so only those words are
 * compared: merged in order, disjoint yields interleave when their words
 * alternate in four or more runs.
 */
function isWellNested(layout: Layout, gaps: Int32Array): boolean {
  const gapped: number[] = [];
  for (let word = 1; word < gaps.length; word++) if (gaps[word]! > 0) gapped.push(word);
  const yieldOf = (word: number): number[] => {
    const positions: number[] = [];
    const start = layout.pre[word]!;
    for (let k = start; k < start + layout.size[word]!; k++) positions.push(layout.order[k]!);
    return positions.sort((a, b) => a - b);
  };
  const yields = new Map(gapped.map((word) => [word, yieldOf(word)]));
  for (let i = 0; i < gapped.length; i++) {
    for (let j = i + 1; j < gapped.length; j++) {
      const a = gapped[i]!;
      const b = gapped[j]!;
      if (dominates(layout, a, b) || dominates(layout, b, a)) continue;
      const ya = yields.get(a)!;
      const yb = yields.get(b)!;
      let runs = 0;
      let last = -1;
      for (let p = 0, q = 0; p < ya.length || q < yb.length; ) {
        const fromA = q >= yb.length || (p < ya.length && ya[p]! < yb[q]!);
        const owner = fromA ? 0 : 1;
        if (fromA) p++;
        else q++;
        if (owner !== last) {
          runs++;
          last = owner;
          if (runs >= 4) return false;
        }
      }
    }
  }
  return true;
}
