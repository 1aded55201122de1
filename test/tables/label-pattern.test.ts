import { describe, expect, it } from 'vitest';
import { compileAnyOf, compilePattern } from '../../src/tables/label-pattern.js';

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
});
