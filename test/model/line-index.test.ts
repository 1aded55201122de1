import { describe, expect, it } from 'vitest';
import { LineIndex } from '../../src/model/line-index.js';

describe('line index', () => {
  const text = 'ab\ncde\r\n\nf';
  const index = new LineIndex(text, { offset: 0, line: 1, column: 1 });

  it('turns offsets into 1-based lines and columns', () => {
    expect([0, 1, 3, 5, 6, 8, 9].map((offset) => index.pointAt(offset)).map((p) => `${p.line}:${p.column}`)).toEqual([
      '1:1', '1:2', '2:1', '2:3', '2:4', '3:1', '4:1',
    ]);
  });

  it('counts from where a stretch starts in its file', () => {
    const stretch = new LineIndex('(S\n (N x))', { offset: 100, line: 7, column: 5 });
    expect(stretch.pointAt(101)).toEqual({ offset: 101, line: 7, column: 6 });
    expect(stretch.pointAt(104)).toEqual({ offset: 104, line: 8, column: 2 });
  });

  it('gives the text of the line holding an offset, without its line end', () => {
    expect(index.lineAt(4)).toEqual({ text: 'cde', column: 1 });
    expect(index.lineAt(9)).toEqual({ text: 'f', column: 1 });
  });
});
