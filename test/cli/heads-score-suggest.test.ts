import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadHeadTable, loadLabelTable } from '../../src/tables/load-table.js';
import { cli } from '../support/cli.js';
import { projectRoot } from '../support/corpora.js';

// Trees and gold dependencies written by hand for them (test/fixtures/gold/README.md): the
// conversion is scored against an analysis it did not produce.
const trees = join(projectRoot, 'test/fixtures/gold/harbour-1-8.psd');
const gold = join(projectRoot, 'test/fixtures/gold/harbour-1-8.gold.conllu');
const dir = mkdtempSync(join(tmpdir(), 'treebridge-heads-'));

describe('treebridge heads score', () => {
  it('scores en-content against hand-written gold: most heads right, the extraposed clause only with traces restored', async () => {
    const surface = JSON.parse((await cli(['heads', 'score', '--json', '--heads', 'en-content', trees, '--gold', gold])).stdout);
    const restored = JSON.parse((await cli(['heads', 'score', '--json', '--heads', 'en-content', '--traces', 'resolve', trees, '--gold', gold])).stdout);
    expect(surface.sentences).toBe(8);
    expect(surface.uas).toBeGreaterThan(0.85);
    // "sail" hangs from "rumour" in the gold: restoring the *ICH* trace finds it, the surface cannot.
    expect(restored.uas).toBeGreaterThan(surface.uas);
  });

  it('scores a table against gold dependencies with the agreed JSON keys', async () => {
    const { code, stdout } = await cli(['heads', 'score', '--json', '--heads', 'generic', trees, '--gold', gold]);
    expect(code).toBe(0);
    const score = JSON.parse(stdout);
    expect(Object.keys(score)).toEqual(['sentences', 'words', 'uas', 'las', 'oracleUas', 'pairing', 'byParent']);
    expect(score.uas).toBeLessThan(score.oracleUas);
    expect(Object.keys(score.byParent[0])).toEqual(['category', 'words', 'errors', 'examples']);
  });

  it('reports a tree whose words do not line up with its gold sentence, naming both, and leaves it out', async () => {
    const shifted = join(dir, 'shifted.conllu');
    writeFileSync(shifted, readFileSync(gold, 'utf8').replace(/^1\tThe\t/m, '1\tA\t'));
    const { stdout, stderr } = await cli(['heads', 'score', '--json', '--heads', 'en-content', trees, '--gold', shifted]);
    expect(stderr).toMatch(/harbour-1-8\.psd:1:1: warning: tree harbour\.1 and gold sentence harbour\.1 do not line up: word 1 is "The" against "A"; left out \[misaligned\]/);
    expect(JSON.parse(stdout)).toMatchObject({ sentences: 7, pairing: { paired: 7, misaligned: 1 } });
  });

  it('item 9: counts and reports trees left without gold, and fails with --strict', async () => {
    const demo = join(projectRoot, 'demo-data/harbour.psd');
    const loose = await cli(['heads', 'score', '--heads', 'en-content', demo, '--gold', gold]);
    expect(loose.code).toBe(0);
    expect(loose.stderr).toMatch(/warning: the gold ran out: tree harbour\.9 and 16 more trees after it have no gold sentence; left out \[unpaired\]/);
    expect(loose.stderr).toMatch(/8 sentence pairs, 17 trees without gold/);
    const strict = await cli(['heads', 'score', '--strict', '--heads', 'en-content', demo, '--gold', gold]);
    expect(strict.code).toBe(1);
  });

  it('item 9: with an empty gold file nothing is paired, which is an error', async () => {
    const empty = join(dir, 'empty.conllu');
    writeFileSync(empty, '');
    const { code, stdout, stderr } = await cli(['heads', 'score', '--heads', 'en-content', trees, '--gold', empty]);
    expect(code).toBe(1);
    expect(stdout).toBe('');
    expect(stderr).toMatch(/nothing to score: no tree paired with a gold sentence \(0 sentence pairs, 8 trees without gold\)/);
  });

  it('item 18: --gold takes one file and may be repeated, so that the trees stay arguments', async () => {
    const { code, stdout } = await cli(['heads', 'score', '--json', '--gold', gold, '--heads', 'en-content', trees]);
    expect(code).toBe(0);
    expect(JSON.parse(stdout).sentences).toBe(8);
  });

  it('reports trees without words and pairs the rest with the gold sentences in order', async () => {
    // The trees without words of a historical-style log take no gold sentence.
    const withNotes = join(dir, 'with-notes.psd');
    writeFileSync(withNotes, `( (CODE {COM:start}) (ID note.1))\n${readFileSync(trees, 'utf8')}`);
    const scored = await cli(['heads', 'score', '--json', '--heads', 'en-content', withNotes, '--gold', gold]);
    expect(JSON.parse(scored.stdout)).toMatchObject({ sentences: 8, pairing: { paired: 8, wordless: 1 } });
    expect(scored.stderr.match(/\[nothing-to-convert\]/g)).toHaveLength(1);
    expect(scored.stderr).not.toContain('[misaligned]');
  });
});

describe('treebridge heads suggest', () => {
  it('writes a valid, commented table that finds the gold heads better than its base', async () => {
    const table = join(dir, 'learned.heads');
    const suggested = await cli(['heads', 'suggest', trees, '--gold', gold, '--base', 'generic', '--min-phrases', '3', '-o', table]);
    expect(suggested.code).toBe(0);
    expect(suggested.stderr).toMatch(/learned from 8 sentences: \d+ blocks changed, \d+ kept from generic; wrote /);
    const text = readFileSync(table, 'utf8');
    expect(text).toMatch(/^table learned\nbuilds-on generic$/m);
    expect(text).toMatch(/^# NP: \d+ phrases; generic right in \d+ \(\d+\.\d%\), this block in \d+ \(\d+\.\d%\)\.\nhead NP$/m);
    loadHeadTable(table);
    const before = JSON.parse((await cli(['heads', 'score', '--json', '--heads', 'generic', trees, '--gold', gold])).stdout);
    const after = JSON.parse((await cli(['heads', 'score', '--json', '--heads', table, trees, '--gold', gold])).stdout);
    expect(after.uas).toBeGreaterThan(before.uas + 0.2);
  });

  it('item 4: overwriting its own base writes a table that does not build on itself', async () => {
    const table = join(dir, 'mine.heads');
    writeFileSync(table, 'table mine\nbuilds-on generic\n\n# Verb phrases: the verb.\nhead VP\n  left each VB*\n  left first\n');
    const suggested = await cli(['heads', 'suggest', trees, '--gold', gold, '--base', table, '--min-phrases', '3', '-o', table]);
    expect(suggested.code).toBe(0);
    const text = readFileSync(table, 'utf8');
    expect(text).not.toMatch(/builds-on .*mine/);
    expect(text).toMatch(/^builds-on generic$/m);
    expect(() => loadHeadTable(table)).not.toThrow();
  });

  it('with --labels also learns a label table for the new head table, which labels as the gold does', async () => {
    const table = join(dir, 'with-labels.heads');
    const labels = join(dir, 'harbour.labels');
    const suggested = await cli(['heads', 'suggest', trees, '--gold', gold, '--base', 'en-content', '-o', table, '--labels', labels]);
    expect(suggested.code).toBe(0);
    expect(suggested.stderr).toMatch(/; \d+ label rules \(\d+\.\d% of the learned attachments labelled as the gold\) written to .*harbour\.labels\n$/);
    const text = readFileSync(labels, 'utf8');
    expect(text).toMatch(/^table harbour$/m);
    expect(text).toMatch(/^label punct role=punctuation$/m);
    expect(text).toMatch(/^otherwise \S+$/m);
    loadLabelTable(labels);
    const scored = JSON.parse((await cli(['heads', 'score', '--json', '--heads', table, '--labels', labels, trees, '--gold', gold])).stdout);
    const unlabelled = JSON.parse((await cli(['heads', 'score', '--json', '--heads', table, trees, '--gold', gold])).stdout);
    expect(scored.las).toBeGreaterThan(unlabelled.las + 0.3);
  });

  it('refuses --labels on standard input, which cannot be read twice', async () => {
    const result = await cli(['heads', 'suggest', '-', '--gold', gold, '-o', join(dir, 'x.heads'), '--labels', join(dir, 'x.labels')], { stdin: '' });
    expect(result.code).toBe(2);
    expect(result.stderr).toMatch(/--labels reads the trees and the gold twice/);
  });
});
