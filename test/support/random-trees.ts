/** A seeded generator (mulberry32), so that a failure can be replayed. */
export function random(seed: number): () => number {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
/** A random tree over n words: words join, in a random order, under a word already placed. */
export function randomTree(next: () => number, n: number): number[] {
  const order = Array.from({ length: n }, (_, i) => i + 1).sort(() => next() - 0.5);
  const heads = new Array<number>(n + 1).fill(0);
  order.forEach((word, i) => (heads[word] = i === 0 ? 0 : order[Math.floor(next() * i)]!));
  return heads;
}

