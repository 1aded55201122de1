import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cli } from '../support/cli.js';
import { projectRoot } from '../support/corpora.js';

const demo = (name: string) => join(projectRoot, 'demo-data', name);

describe('treebridge to-deps', () => {
  it('converts the demo trees into CoNLL-U that validates, and counts trees read, converted and skipped', async () => {
    const converted = await cli(['to-deps', '--heads', 'en-content', '--labels', 'en-ud', '--pos-map', 'en-ptb', demo('harbour.psd')]);
    expect(converted.code).toBe(0);
    expect(converted.stderr).toBe('treebridge: 25 trees read: 25 converted, 0 skipped\n');
    expect(converted.stdout).toMatch(/^# sent_id = harbour\.1\n# text = The ferry left the harbour at dawn \.\n1\tThe\t_\tDET\tDT\tDefinite=Def|PronType=Art\t2\tdet\t_\tFrom=/);
    const checked = await cli(['validate', '--from', 'conllu', '-'], { stdin: converted.stdout });
    expect(checked.stdout.trimEnd().split('\n').pop()).toBe('1 file, 25 sentences, 216 words: 0 errors, 0 warnings');
  });

  it('reports a tree without words and skips it, and the counts still add up', async () => {
    const { code, stderr, stdout } = await cli(['to-deps', '--heads', 'penn-historical', '--lemmas', demo('ferry-log.psd')]);
    expect(code).toBe(0);
    expect(stderr).toMatch(/ferry-log\.psd:1:1: warning: tree has no words .* \[nothing-to-convert\]/);
    expect(stderr).toMatch(/9 trees read: 7 converted, 2 skipped; 0 errors, 2 warnings\n$/);
    expect(stdout.match(/^# sent_id/gm)).toHaveLength(7);
  });

  it('makes sent_ids from the file name and number when trees have no identifier', async () => {
    const { stdout } = await cli(['to-deps', '--heads', 'generic', '-'], { stdin: '(S (N Fog) (V lifted))\n(S (N Rain) (V fell))\n' });
    expect(stdout.match(/^# sent_id = .*$/gm)).toEqual(['# sent_id = --1', '# sent_id = --2']);
  });

  it('stops with exit 2 and file:line:col when a table has a mistake', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treebridge-table-'));
    writeFileSync(join(dir, 'mine.heads'), 'table mine\nhead NP\n  left sometimes NN\n');
    const { code, stderr } = await cli(['to-deps', '--heads', join(dir, 'mine.heads'), demo('harbour.psd')]);
    expect(code).toBe(2);
    expect(stderr).toMatch(/mine\.heads:3:8: error: "sometimes" is not a way to look: each, any, only or first \[table-invalid\]/);
  });

  it('needs a head table', async () => {
    const { code, stderr } = await cli(['to-deps', demo('harbour.psd')]);
    expect(code).toBe(2);
    expect(stderr).toMatch(/required option '--heads <table>' not specified/);
  });
});

describe('treebridge heads explain', () => {
  it('names, for each phrase, the step and pattern that chose its head', async () => {
    const { code, stdout } = await cli(['heads', 'explain', '--heads', 'en-content', '--sentence', '1', demo('harbour.psd')]);
    expect(code).toBe(0);
    expect(stdout.split('\n')[1]).toMatch(/^ {2}S → VP "left": S SQ \(line \d+\): left each VP \*-PRD S SINV SQ \[matched VP\]$/);
  });
});
