import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { type Layout } from '../../../src/formats/bracketed/write-bracketed.js';
import { writeTree } from '../../../src/traces/write-tree.js';
import type { ConstituentNode, Tree } from '../../../src/model/constituency.js';
import { projectRoot } from '../../support/corpora.js';
import { read } from '../../support/read.js';
import { expectFixture } from '../../support/fixtures.js';

const fixtures = join(projectRoot, 'test/fixtures/bracketed');
const inputs = readdirSync(fixtures).filter((name) => /^[^.]+\.psd$/.test(name));
const demo = ['harbour.psd', 'ferry-log.psd'].map((name) => join(projectRoot, 'demo-data', name));

/** A tree without source details, for comparing what was read with what was read back. */
function bare(tree: Tree): unknown {
  const strip = (node: ConstituentNode): unknown => {
    const { position: _position, ...rest } = node;
    if (rest.type === 'preterminal') {
      const { position: _wordPosition, ...word } = rest.word;
      return { ...rest, word };
    }
    if (rest.type === 'phrase' || rest.type === 'meta') return { ...rest, children: rest.children.map(strip) };
    return rest;
  };
  return { wrapper: tree.wrapper, id: tree.id, children: tree.children.map(strip) };
}

function writeAll(trees: Tree[], layout: Layout): string {
  return trees.map((tree) => writeTree(tree, { layout })).join('');
}

describe('writing bracketed trees', () => {
  const sources = [...inputs.map((name) => join(fixtures, name)), ...demo];
  describe.each(['line', 'indented'] as const)('in the %s layout', (layout) => {
    it.each(sources)('reads back as the same trees: %s', (path) => {
      for (const splitLemmas of [false, true]) {
        const first = read(readFileSync(path, 'utf8'), { splitLemmas });
        expect(first.problems.filter((p) => p.severity === 'error')).toEqual([]);
        const again = read(writeAll(first.trees, layout), { splitLemmas });
        expect(again.problems.filter((p) => p.severity === 'error')).toEqual([]);
        expect(again.trees.map(bare)).toEqual(first.trees.map(bare));
      }
    });
  });

  it('writes one tree per line in the line layout', () => {
    const { trees } = read('( (S (NP-SBJ (N Fog))\n   (VP (V lifted))) (ID a.1))\n\n(ROOT (S (N Rain)))');
    expect(writeAll(trees, 'line')).toBe('( (S (NP-SBJ (N Fog)) (VP (V lifted))) (ID a.1))\n(ROOT (S (N Rain)))\n');
  });

  it('breaks a bracket over lines only when it does not fit, indenting children by two', () => {
    const { trees } = read('( (S (NP-SBJ (D The) (J old) (N harbour) (N master)) (VP (V counted) (NP (D the) (N crates) (P in) (N rain))) (. .)) (ID a.1))');
    // (NP (D the) (N crates) (P in) (N rain)) is 38 characters: at indent 6 it passes the width of 40.
    expect(writeTree(trees[0]!, { layout: 'indented', width: 40 })).toBe(
      [
        '( (S',
        '    (NP-SBJ',
        '      (D The)',
        '      (J old)',
        '      (N harbour)',
        '      (N master))',
        '    (VP',
        '      (V counted)',
        '      (NP',
        '        (D the)',
        '        (N crates)',
        '        (P in)',
        '        (N rain)))',
        '    (. .))',
        '  (ID a.1))',
        '',
        '',
      ].join('\n'),
    );
  });

  // Fixture pairs: each input has its expected line and indented output beside it.
  // UPDATE=1 rewrites them after an intended change, and fails with the diff to review.
  it.each(inputs)('matches the expected output files for %s', (name) => {
    const { trees } = read(readFileSync(join(fixtures, name), 'utf8'));
    for (const layout of ['line', 'indented'] as const) {
      const expectedPath = join(fixtures, 'expected', name.replace(/\.psd$/, `.${layout}.psd`));
      const written = writeAll(trees, layout);
      expectFixture(expectedPath, written);
    }
  });
});
