import { describe, expect, it } from 'vitest';
import { bracketScores, emptyTotals, scoreBrackets, type Span } from '../../src/evaluate/parseval.js';

const spans = (...pairs: Array<[number, number]>): Span[] => pairs.map(([start, end]) => ({ label: 'X', start, end }));

// Black et al. (1991), worked example as spans over 6 words (CHECK-VALUES §7).
describe('PARSEVAL', () => {
  it('gives recall 3/4, precision 3/5 and one crossing bracket on the worked example', () => {
    const totals = emptyTotals();
    scoreBrackets(totals, spans([0, 2], [3, 6], [2, 6], [0, 6]), spans([3, 5], [3, 6], [2, 6], [1, 6], [0, 6]));
    const scores = bracketScores(totals);
    expect([totals.matched, scores.recall, scores.precision, scores.crossing]).toEqual([3, 3 / 4, 3 / 5, 1]);
    expect(scores.f1).toBeCloseTo((2 * (3 / 5) * (3 / 4)) / (3 / 5 + 3 / 4));
  });

  it('counts a bracket as labelled-right only with the same label (Magerman 1995)', () => {
    const totals = emptyTotals();
    scoreBrackets(totals, [{ label: 'NP', start: 0, end: 2 }, { label: 'VP', start: 2, end: 4 }], [{ label: 'NP', start: 0, end: 2 }, { label: 'S', start: 2, end: 4 }]);
    expect(bracketScores(totals)).toMatchObject({ f1: 1, labelledF1: 0.5 });
    expect(totals.exact).toBe(0);
  });
});
