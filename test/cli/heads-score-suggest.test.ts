import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { loadHeadTable } from '../../src/tables/load-table.js';
import { cli } from '../support/cli.js';
import { projectRoot } from '../support/corpora.js';

// Gold dependencies for the demo trees, made by converting them with en-content:
// a table learned from generic should find those heads again.
const demo = join(projectRoot, 'demo-data/harbour.psd');
const dir = mkdtempSync(join(tmpdir(), 'treebridge-heads-'));
const gold = join(dir, 'harbour-gold.conllu');

beforeAll(async () => {
  const converted = await cli(['to-deps', '--heads', 'en-content', '--labels', 'en-ud', '-o', gold, demo]);
  expect(converted.code).toBe(0);
});

describe('treebridge heads score', () => {
  it('reports trees without words and pairs the rest with the gold sentences in order', async () => {
    const log = join(projectRoot, 'demo-data/ferry-log.psd');
    const logGold = join(dir, 'ferry-log-gold.conllu');
    expect((await cli(['to-deps', '--heads', 'penn-historical', '--lemmas', '-o', logGold, log])).code).toBe(0);
    const scored = await cli(['heads', 'score', '--json', '--heads', 'penn-historical', '--lemmas', log, '--gold', logGold]);
    expect(JSON.parse(scored.stdout)).toMatchObject({ sentences: 7, uas: 1 });
    expect(scored.stderr.match(/\[nothing-to-convert\]/g)).toHaveLength(2);
    expect(scored.stderr).not.toContain('[misaligned]');
    const suggested = await cli(['heads', 'suggest', '--from', 'penn-historical', '--lemmas', '-o', join(dir, 'log.heads'), log, '--gold', logGold]);
    expect(suggested.stderr).toMatch(/learned from 7 sentences:/);
    expect(suggested.stderr.match(/\[nothing-to-convert\]/g)).toHaveLength(2);
  });

  it('scores a table against gold dependencies with the agreed JSON keys', async () => {
    const { code, stdout } = await cli(['heads', 'score', '--json', '--heads', 'generic', demo, '--gold', gold]);
    expect(code).toBe(0);
    const score = JSON.parse(stdout);
    expect(Object.keys(score)).toEqual(expect.arrayContaining(['sentences', 'words', 'uas', 'las', 'byParent']));
    expect(score.sentences).toBe(25);
    expect(score.uas).toBeLessThan(0.8);
    expect(Object.keys(score.byParent[0])).toEqual(['category', 'words', 'errors', 'examples']);
  });

  it('gives a table its own conversion as gold a perfect score', async () => {
    const { stdout } = await cli(['heads', 'score', '--json', '--heads', 'en-content', '--labels', 'en-ud', demo, '--gold', gold]);
    expect(JSON.parse(stdout)).toMatchObject({ uas: 1, las: 1 });
  });

  it('reports a tree whose words do not line up with its gold sentence, and leaves it out', async () => {
    const shifted = join(dir, 'shifted.conllu');
    const text = readFileSync(gold, 'utf8').replace('\t_\tThe\t', '\t_\tThe\t').replace(/^1\tThe\t/m, '1\tA\t');
    writeFileSync(shifted, text);
    const { stdout, stderr } = await cli(['heads', 'score', '--json', '--heads', 'en-content', demo, '--gold', shifted]);
    expect(stderr).toMatch(/harbour\.psd:1:1: warning: tree harbour\.1 and gold sentence harbour\.1 do not have the same words; left out \[misaligned\]/);
    expect(JSON.parse(stdout)).toMatchObject({ sentences: 24, misaligned: 1 });
  });
});

describe('treebridge heads suggest', () => {
  it('writes a valid, commented table that finds the gold heads better than its base', async () => {
    const table = join(dir, 'learned.heads');
    const suggested = await cli(['heads', 'suggest', demo, '--gold', gold, '--from', 'generic', '--min-phrases', '3', '-o', table]);
    expect(suggested.code).toBe(0);
    expect(suggested.stderr).toMatch(/learned from 25 sentences: \d+ blocks changed, \d+ kept from generic; wrote /);
    const text = readFileSync(table, 'utf8');
    expect(text).toMatch(/^table learned\nbuilds-on generic$/m);
    expect(text).toMatch(/^# NP: \d+ phrases; generic right in \d+ \(\d+\.\d%\), this block in \d+ \(\d+\.\d%\)\.\nhead NP$/m);
    loadHeadTable(table);
    const before = JSON.parse((await cli(['heads', 'score', '--json', '--heads', 'generic', demo, '--gold', gold])).stdout);
    const after = JSON.parse((await cli(['heads', 'score', '--json', '--heads', table, demo, '--gold', gold])).stdout);
    expect(after.uas).toBeGreaterThan(before.uas + 0.3);
  });
});
