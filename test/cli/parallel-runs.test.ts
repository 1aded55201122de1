import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runBin } from '../support/bin.js';
import { projectRoot } from '../support/corpora.js';

// Worker threads must not change a byte: the output, every problem in its
// order, and the closing line of --jobs N are those of --jobs 1. The input is
// the demo data (invented sentences) repeated until it spans many tasks,
// broken trees, stray text and trees without identifiers among them.
const demo = (name: string) => readFileSync(join(projectRoot, 'demo-data', name), 'utf8');

function largeInput(folder: string): string[] {
  const harbour = demo('harbour.psd');
  const broken = demo('broken.psd');
  const unnamed = '(S (NP-SBJ (DT A) (NN gull)) (VP (VBD landed)) (. .))\n( (S (NP-SBJ (NNP Mira)) (VP (VBD laughed-laugh)) (. .)))\n';
  const parts: string[] = [];
  for (let k = 0; k < 120; k++) parts.push(harbour, k % 7 === 3 ? broken : unnamed);
  const first = join(folder, 'first.psd');
  const second = join(folder, 'second.psd');
  writeFileSync(first, parts.join(''));
  // A second file ends inside a tree: the unclosed bracket is reported at its end.
  writeFileSync(second, parts.slice(0, 40).join('') + '( (S (NP-SBJ (NN Rain)) (VP (VBD fell');
  return [first, second];
}

describe('commands on worker threads', () => {
  it('writes what --jobs 1 writes, problems and closing line included, byte for byte', { timeout: 120_000 }, async () => {
    const folder = mkdtempSync(join(tmpdir(), 'treebridge-jobs-'));
    const files = largeInput(folder);
    const xml = join(projectRoot, 'demo-data', 'ferry-graphs.xml');
    const args = ['to-deps', '--heads', 'en-content', '--labels', 'en-ud', '--pos-map', 'en-ptb', '--lemmas', '--verbose', files[0]!, xml, files[1]!];
    const one = await runBin([...args, '--jobs', '1'], { limitMs: 100_000 });
    const three = await runBin([...args, '--jobs', '3'], { limitMs: 100_000 });
    expect(one.code).toBe(1);
    expect(one.stdout.length).toBeGreaterThan(500_000);
    expect(one.stderr).toContain('[unclosed-bracket]');
    expect(one.stderr).toContain('[missing-lemma]');
    expect(three.code).toBe(one.code);
    expect(three.stderr).toBe(one.stderr);
    expect(three.stdout === one.stdout).toBe(true);
  });

  it('rewrites as --jobs 1 does, traces resolved and put back, byte for byte', { timeout: 120_000 }, async () => {
    const folder = mkdtempSync(join(tmpdir(), 'treebridge-jobs-'));
    const files = largeInput(folder);
    const xml = join(projectRoot, 'demo-data', 'ferry-graphs.xml');
    const args = ['rewrite', '--traces', 'resolve', '--layout', 'indented', '--lemmas', '--verbose', files[0]!, xml, files[1]!];
    const one = await runBin([...args, '--jobs', '1'], { limitMs: 100_000 });
    const two = await runBin([...args, '--jobs', '2'], { limitMs: 100_000 });
    expect(one.code).toBe(1);
    expect(one.stderr).toMatch(/\*ICH\* traces? put in/);
    expect(two.code).toBe(one.code);
    expect(two.stderr).toBe(one.stderr);
    expect(two.stdout === one.stdout).toBe(true);
  });

  it('validates bracketed input as --jobs 1 does: problems sorted by place, duplicates across files, summary', { timeout: 120_000 }, async () => {
    const folder = mkdtempSync(join(tmpdir(), 'treebridge-jobs-'));
    const files = largeInput(folder);
    const xml = join(projectRoot, 'demo-data', 'ferry-graphs.xml');
    for (const extra of [['--source'], ['--json']]) {
      const args = ['validate', '--lemmas', ...extra, files[0]!, xml, files[1]!];
      const one = await runBin([...args, '--jobs', '1'], { limitMs: 100_000 });
      const three = await runBin([...args, '--jobs', '3'], { limitMs: 100_000 });
      expect(one.code).toBe(1);
      // The repeated demo trees give duplicate identifiers, the unnamed ones missing identifiers.
      expect(one.stdout).toContain('duplicate-id');
      expect(one.stdout).toContain('missing-id');
      expect(one.stdout).toContain('unclosed-bracket');
      expect(three.code).toBe(one.code);
      expect(three.stderr).toBe(one.stderr);
      expect(three.stdout === one.stdout).toBe(true);
    }
  });

  it('takes trees there and back as --jobs 1 does: scores, losses, examples and closing line', { timeout: 120_000 }, async () => {
    const folder = mkdtempSync(join(tmpdir(), 'treebridge-jobs-'));
    const files = largeInput(folder);
    for (const extra of [['--json'], ['--lossless', '--examples', '3']]) {
      const args = ['roundtrip', '--heads', 'en-content', '--labels', 'en-ud', '--lemmas', '--verbose', ...extra, ...files];
      const one = await runBin([...args, '--jobs', '1'], { limitMs: 100_000 });
      const two = await runBin([...args, '--jobs', '2'], { limitMs: 100_000 });
      expect(one.code).toBe(1);
      expect(one.stderr).toMatch(/round-tripped/);
      expect(two.code).toBe(one.code);
      expect(two.stderr).toBe(one.stderr);
      expect(two.stdout).toBe(one.stdout);
    }
  });

  it('measures converted trees as --jobs 1 does: figures, listed arcs, problems and closing line', { timeout: 120_000 }, async () => {
    const folder = mkdtempSync(join(tmpdir(), 'treebridge-jobs-'));
    const files = largeInput(folder);
    const xml = join(projectRoot, 'demo-data', 'ferry-graphs.xml');
    for (const extra of [['--arcs'], ['--json']]) {
      const args = ['stats', '--heads', 'en-content', '--traces', 'resolve', '--lemmas', '--verbose', ...extra, files[0]!, xml, files[1]!];
      const one = await runBin([...args, '--jobs', '1'], { limitMs: 100_000 });
      const three = await runBin([...args, '--jobs', '3'], { limitMs: 100_000 });
      expect(one.code).toBe(1);
      expect(one.stdout).toMatch(/non-?projective/i);
      expect(three.code).toBe(one.code);
      expect(three.stderr).toBe(one.stderr);
      expect(three.stdout).toBe(one.stdout);
    }
  });
});

// Trees and their gold: the demo trees and their gold sentences repeated past many tasks, a tree
// without words (it takes no gold sentence) after each copy, one copy whose gold has a word changed
// (that pair is misaligned and left out), and more gold than trees at the end.
function scoredPairs(folder: string): { trees: string; gold: string } {
  const harbour = demo('harbour.psd');
  const gold = demo('harbour-gold.conllu');
  const trees: string[] = [];
  const golds: string[] = [];
  for (let k = 0; k < 120; k++) {
    trees.push(harbour, '( (NP-SBJ (-NONE- *pro*)))\n');
    const copy = gold.replace(/sent_id = (\S+)/g, `sent_id = $1.${k}`);
    golds.push(k === 50 ? copy.replace(/\tharbour\t/, '\tharbor\t') : copy);
  }
  golds.push(gold.replace(/sent_id = (\S+)/g, 'sent_id = $1.extra'));
  writeFileSync(join(folder, 'pairs.psd'), trees.join(''));
  writeFileSync(join(folder, 'pairs.conllu'), golds.join(''));
  return { trees: join(folder, 'pairs.psd'), gold: join(folder, 'pairs.conllu') };
}

describe('heads score on worker threads', () => {
  it('scores as --jobs 1 does: figures, error tables, pairing problems and closing line', { timeout: 120_000 }, async () => {
    const folder = mkdtempSync(join(tmpdir(), 'treebridge-jobs-'));
    const { trees, gold } = scoredPairs(folder);
    for (const extra of [[], ['--json'], ['--unscored', 'Align=extra', '--score-punctuation', 'count']]) {
      // A head table far from the gold's choices, so that there are errors to add up.
      const args = ['heads', 'score', trees, '--gold', gold, '--heads', 'generic-right', '--labels', 'en-ud', '--verbose', '--strict', ...extra];
      const one = await runBin([...args, '--jobs', '1'], { limitMs: 100_000 });
      const three = await runBin([...args, '--jobs', '3'], { limitMs: 100_000 });
      expect(one.code).toBe(1);
      expect(one.stderr).toContain('[misaligned]');
      expect(one.stderr).toContain('[nothing-to-convert]');
      expect(one.stdout).toMatch(/UAS [1-8]\d\.\d\d%|"uas": 0\.[1-8]/);
      expect(three.code).toBe(one.code);
      expect(three.stderr).toBe(one.stderr);
      expect(three.stdout).toBe(one.stdout);
    }
  });
});

// CoNLL-U input: the gold of the demo data repeated past many stretches, with renumbered sent_ids,
// a duplicate, a sentence that is not a tree, crossing arcs, a second file without a final blank line.
function largeConllu(folder: string): string[] {
  const gold = demo('harbour-gold.conllu');
  const crossing = demo('crossing.conllu');
  const bad = demo('bad.conllu');
  const parts: string[] = [];
  for (let k = 0; k < 150; k++) parts.push(gold.replace(/sent_id = (\S+)/g, `sent_id = $1.${k}`), crossing.replace(/sent_id = (\S+)/g, `sent_id = $1.${k}`), k % 9 === 4 ? bad + '\n' : '');
  parts.push(gold);
  const first = join(folder, 'first.conllu');
  const second = join(folder, 'second.conllu');
  writeFileSync(first, parts.join(''));
  writeFileSync(second, gold.replace(/sent_id = (\S+)/g, 'sent_id = $1.again') + crossing.trimEnd() + '\n');
  return [first, second];
}

describe('CoNLL-U commands on worker threads', () => {
  it.each([
    ['validate', ['--source']],
    ['validate', ['--json']],
    ['stats', ['--arcs']],
    ['to-brackets', ['--lifts', '--shape', 'layered']],
    // Read back with a head table other than the one the brackets were built for, a third of the words come back: losses to add up.
    ['roundtrip', ['--json', '--heads', 'generic-right']],
    ['roundtrip', ['--examples', '2', '--shape', 'layered', '--heads', 'generic-right']],
  ])('%s %j writes what --jobs 1 writes, problems and closing line included', { timeout: 120_000 }, async (command, extra) => {
    const folder = mkdtempSync(join(tmpdir(), 'treebridge-jobs-'));
    const files = largeConllu(folder);
    expect(readFileSync(files[0]!, 'utf8').length).toBeGreaterThan(300_000);
    const args = [command, ...extra, ...(command === 'validate' ? [] : ['--verbose']), ...files];
    const one = await runBin([...args, '--jobs', '1'], { limitMs: 100_000 });
    const three = await runBin([...args, '--jobs', '3'], { limitMs: 100_000 });
    expect(one.code).toBe(1);
    expect(one.stdout.length + one.stderr.length).toBeGreaterThan(1_000);
    if (command === 'validate' && extra[0] === '--source') expect(one.stdout).toContain('[duplicate-sent-id]');
    if (command === 'roundtrip') expect(one.stdout).toMatch(/"other": [1-9]|other +[1-9]/);
    expect(three.code).toBe(one.code);
    expect(three.stderr).toBe(one.stderr);
    expect(three.stdout === one.stdout).toBe(true);
  });
});
