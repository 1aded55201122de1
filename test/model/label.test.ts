import { describe, expect, it } from 'vitest';
import { formatLabel, parseLabel } from '../../src/model/label.js';

// Label conventions: Penn Treebank bracketing guidelines (Bies et al. 1995, from
// memory; ../shared/CHECK-VALUES.md §8): -n coindex, =n gapping, function tags after hyphens.
describe('labels', () => {
  it.each([
    ['NP-SBJ-1', { category: 'NP', functions: ['SBJ'], coindex: 1 }],
    ['PP-LOC-PRD', { category: 'PP', functions: ['LOC', 'PRD'] }],
    ['IP-SUB=2', { category: 'IP', functions: ['SUB'], gapIndex: 2 }],
    ['NP-SBJ-1=2', { category: 'NP', functions: ['SBJ'], coindex: 1, gapIndex: 2 }],
    ['-NONE-', { category: '-NONE-', functions: [] }],
    ['-LRB-', { category: '-LRB-', functions: [] }],
    ['.', { category: '.', functions: [] }],
    [',', { category: ',', functions: [] }],
    ['WNP-12', { category: 'WNP', functions: [], coindex: 12 }],
    ['NP-01', { category: 'NP', functions: ['01'] }],
    ['', { category: '', functions: [] }],
  ])('reads %s into its parts', (written, parts) => {
    expect(parseLabel(written)).toEqual(parts);
  });

  it.each(['NP-SBJ-1', 'PP-LOC-PRD', 'IP-SUB=2', '-NONE-', 'NP-01', 'X=07', 'A--B', '-X', 'NP-1-SBJ', 'CP-THT-SPE-PRN', '$', "''"])(
    'writes %s back exactly as read',
    (written) => {
      expect(formatLabel(parseLabel(written))).toBe(written);
    },
  );
});
