// Structure figures of UD English EWT dev and UD Czech CAC dev (CC BY-SA 4.0,
// ../shared/corpora/ud) against the values measured by an independent
// brute-force script, CHECK-VALUES §4, which must match exactly.
import { describe, expect, it } from 'vitest';
import { cli } from '../support/cli.js';
import { corpusFiles } from '../support/corpora.js';

const file = (name: string) => corpusFiles('ud', '.conllu').find((path) => path.endsWith(name))!;

async function figures(name: string) {
  const { code, stdout } = await cli(['stats', '--json', file(name)]);
  expect(code).toBe(0);
  return JSON.parse(stdout);
}

const share = (part: number, whole: number) => Number(((100 * part) / whole).toFixed(1));

describe.each([
  ['cs_cac-ud-dev.conllu', { sentences: 603, words: 10_912, arcs: 10_309, nonProjectiveSentences: 52, nonProjectiveArcs: 63, gapDegree: { 0: 551, 1: 51, 2: 1 }, wellNestedSentences: 603 }, 43.7, 76.8],
  ['en_ewt-ud-dev.conllu', { sentences: 2_001, words: 25_147, arcs: 23_146, nonProjectiveSentences: 31, nonProjectiveArcs: 36, gapDegree: { 0: 1_970, 1: 31 }, wellNestedSentences: 2_001 }, 40.4, 76.9],
])('stats --json on %s', (name, expected, lengthOne, lengthThree) => {
  it('matches CHECK-VALUES §4 exactly', async () => {
    const f = await figures(name);
    expect({
      sentences: f.sentences,
      words: f.words,
      arcs: f.arcs,
      nonProjectiveSentences: f.nonProjectiveSentences,
      nonProjectiveArcs: f.nonProjectiveArcs,
      gapDegree: f.gapDegree,
      wellNestedSentences: f.wellNestedSentences,
    }).toEqual(expected);
    const lengths = Object.entries(f.arcLength as Record<string, number>);
    const within = (limit: number) => lengths.filter(([length]) => Number(length) <= limit).reduce((sum, [, n]) => sum + n, 0);
    expect([share(within(1), f.arcs), share(within(3), f.arcs)]).toEqual([lengthOne, lengthThree]);
  });
});

describe('the Czech sentences', () => {
  it('have gap degree at most 1 in at least 99% of cases (common practice, CHECK-VALUES §3)', async () => {
    const f = await figures('cs_cac-ud-dev.conllu');
    expect(((f.gapDegree[0] ?? 0) + (f.gapDegree[1] ?? 0)) / f.sentences).toBeGreaterThanOrEqual(0.99);
  });
});
