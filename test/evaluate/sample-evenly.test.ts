import { describe, expect, it } from 'vitest';
import { EvenSample } from '../../src/evaluate/sample-evenly.js';

function draw(size: number, items: number, seed: number): number[] {
  const sample = new EvenSample<number>(size, seed);
  for (let i = 0; i < items; i++) sample.offer(() => i);
  return sample.items();
}

describe('drawing a sample evenly from a stream', () => {
  it('keeps everything when the stream is shorter than the sample', () => {
    expect(draw(10, 4, 1)).toEqual([0, 1, 2, 3]);
  });

  it('draws the same items for the same seed, other items for another, in stream order', () => {
    const once = draw(20, 10_000, 7);
    expect(draw(20, 10_000, 7)).toEqual(once);
    expect(draw(20, 10_000, 8)).not.toEqual(once);
    expect([...once].sort((a, b) => a - b)).toEqual(once);
  });

  it('draws from the whole stream, not from its beginning', () => {
    // Every item is kept with probability size/n (Vitter's algorithm R): with 40 of 10,000, about
    // 4 fall in each tenth; all 40 in the first tenth would mean the sample is not even.
    const kept = draw(40, 10_000, 3);
    const tenths = new Set(kept.map((item) => Math.floor(item / 1000)));
    expect(tenths.size).toBeGreaterThanOrEqual(7);
    expect(kept.filter((item) => item >= 5000).length).toBeGreaterThan(8);
  });

  it('builds only the items it keeps', () => {
    let built = 0;
    const sample = new EvenSample<number>(5, 1);
    for (let i = 0; i < 1000; i++) sample.offer(() => ++built);
    expect(built).toBeLessThan(100);
    expect(sample.items()).toHaveLength(5);
  });
});
