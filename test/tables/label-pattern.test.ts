import { describe, expect, it } from 'vitest';
import { categoryCouldMatch, compileAnyOf, compilePattern } from '../../src/tables/label-pattern.js';

const candidate = (category: string, ...functions: string[]) => ({ category, functions });

describe('label patterns', () => {
  it('`NP-` is NP without function tags; `NP` is NP with any', () => {
    const tagless = compilePattern({ label: 'NP-', test: null });
    expect(tagless(candidate('NP'))).toBe(true);
    expect(tagless(candidate('NP', 'SBJ'))).toBe(false);
    expect(compilePattern({ label: 'NP', test: null })(candidate('NP', 'SBJ'))).toBe(true);
    expect(compileAnyOf([{ label: 'NP-', test: null }, { label: 'VB', test: null }])(candidate('NP', 'TMP'))).toBe(false);
  });

  it('a bracket token such as `-LRB-` stays a category of its own, not a tagless pattern', () => {
    const bracket = compileAnyOf([{ label: '-LRB-', test: null }]);
    expect(bracket(candidate('-LRB-'))).toBe(true);
    expect(bracket(candidate('-LRB'))).toBe(false);
  });

  it('`[form!=…]` holds for a head word with none of the forms (without case), and never for a child without a head word', () => {
    const other = compilePattern({ label: 'NNP', test: { key: 'form', values: ['Dr.', 'Capt.'], negated: true } });
    const word = (form: string) => ({ category: 'NNP', functions: [], headWord: { pos: 'NNP', form, lemma: undefined } });
    expect([other(word('Mira')), other(word('dr.')), other(word('Capt.'))]).toEqual([true, false, false]);
    expect(other(candidate('NNP'))).toBe(false);
  });

  it('tells which categories a pattern could match whatever the function tags and head word, so rules can be set aside', () => {
    const could = (label: string, category: string) => categoryCouldMatch({ label, test: null })(category);
    expect([could('*-PRD', 'VP'), could('NP-PRD', 'NP'), could('NP-PRD', 'VP'), could('VB*', 'VBD'), could('VB*', 'MD'), could('NP-', 'NP'), could('-LRB-', '-LRB-')]).toEqual([
      true, true, false, true, false, true, true,
    ]);
  });
});
