import { describe, expect, it } from 'vitest';
import { TreeSplitter, type TreeChunk } from '../../../src/formats/bracketed/split-trees.js';

describe('cutting input into trees', () => {
  it('holds the trees of one piece at most, however long the input', () => {
    const tree = '( (IP-MAT (NP-SBJ (D-N the-the) (N-N keeper-keeper)) (VBD rowed-row) (. .-.)) (ID log.1))\n';
    const chunks: TreeChunk[] = [];
    const splitter = new TreeSplitter('t.psd', (batch) => chunks.push(...batch.trees), () => undefined);
    let largest = 0;
    for (let i = 0; i < 20_000; i++) {
      splitter.push(tree.slice(0, 40));
      largest = Math.max(largest, splitter.buffered);
      splitter.push(tree.slice(40));
      largest = Math.max(largest, splitter.buffered);
    }
    splitter.end();
    expect(chunks).toHaveLength(20_000);
    expect(largest).toBeLessThanOrEqual(tree.length);
  });

  it('hands out each tree with its offset and a line index starting at its line', () => {
    const chunks: TreeChunk[] = [];
    const splitter = new TreeSplitter('t.psd', (batch) => chunks.push(...batch.trees), () => undefined);
    splitter.push('(A (B c))  (D (E f))\n\n  (G\n (H i))');
    splitter.end();
    expect(chunks.map((c) => [c.text, c.offset, c.lines.pointAt(c.offset).line, c.lines.pointAt(c.offset).column])).toEqual([
      ['(A (B c))', 0, 1, 1],
      ['(D (E f))', 11, 1, 12],
      ['(G\n (H i))', 24, 3, 3],
    ]);
  });
});
