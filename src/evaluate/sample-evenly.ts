/**
 * Keeps a fixed number of items drawn evenly from a stream of unknown length
 * (reservoir sampling, Vitter's algorithm R), with a seeded generator
 * (mulberry32) so that the same run draws the same items. Memory holds the
 * kept items only; the items come back in stream order.
 */
export class EvenSample<T> {
  private readonly kept: Array<{ at: number; item: T }> = [];
  private seen = 0;
  private state: number;

  constructor(
    readonly size: number,
    seed = 1,
  ) {
    this.state = seed | 0;
  }

  /** Offers the next item; `make` builds it only when it is kept, so that most items cost nothing. */
  offer(make: () => T): void {
    const at = this.seen++;
    if (this.size <= 0) return;
    if (this.kept.length < this.size) {
      this.kept.push({ at, item: make() });
      return;
    }
    const slot = Math.floor(this.random() * (at + 1));
    if (slot < this.size) this.kept[slot] = { at, item: make() };
  }

  /** How many items were offered. */
  get offered(): number {
    return this.seen;
  }

  /** The kept items, in the order they came. */
  items(): T[] {
    return [...this.kept].sort((a, b) => a.at - b.at).map((entry) => entry.item);
  }

  private random(): number {
    this.state = (this.state + 0x6d2b79f5) | 0;
    let t = Math.imul(this.state ^ (this.state >>> 15), 1 | this.state);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  }
}
