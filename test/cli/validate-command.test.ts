import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cli } from '../support/cli.js';
import { projectRoot } from '../support/corpora.js';

const demo = (name: string) => join(projectRoot, 'demo-data', name);

describe('treebridge validate', () => {
  it('exits 0 on a clean file and ends with a summary line', async () => {
    const { code, stdout } = await cli(['validate', demo('harbour.psd')]);
    expect(code).toBe(0);
    expect(stdout).toBe('1 file, 25 trees, 216 words: 0 errors, 0 warnings\n');
  });

  it('prints one line per problem as file:line:col: severity: message [code], and exits 1 on errors', async () => {
    const { code, stdout } = await cli(['validate', demo('broken.psd')]);
    expect(code).toBe(1);
    const lines = stdout.trimEnd().split('\n');
    const summary = lines.pop()!;
    expect(summary).toMatch(/^1 file, \d+ trees, \d+ words: [1-9]\d* errors, \d+ warnings$/);
    for (const line of lines) expect(line).toMatch(/^.+broken\.psd:\d+:\d+: (error|warning): .+ \[[a-z-]+\]$/);
    expect(lines.length).toBeGreaterThanOrEqual(8);
  });

  it('prints the JSON report with the agreed keys', async () => {
    const { code, stdout } = await cli(['validate', '--json', demo('broken.psd'), demo('harbour.psd')]);
    expect(code).toBe(1);
    const report = JSON.parse(stdout);
    expect(Object.keys(report)).toEqual(['files', 'trees', 'words', 'errors', 'warnings', 'problems']);
    expect(report.files).toBe(2);
    expect(report.errors).toBe(report.problems.filter((p: { severity: string }) => p.severity === 'error').length);
    expect(Object.keys(report.problems[0])).toEqual(['file', 'line', 'col', 'severity', 'code', 'message']);
  });

  it('reads standard input when the file is -', async () => {
    const { code, stdout } = await cli(['validate', '-'], { stdin: '(S (NP (N Fog)) (VP (V lifted)))\n' });
    expect(code).toBe(0);
    expect(stdout).toBe('1 file, 1 tree, 2 words: 0 errors, 0 warnings\n');
  });

  it('shows the source line and a caret with --source', async () => {
    const { stdout } = await cli(['validate', '--source', '-'], { stdin: '(S (NP (D the) fog))\n' });
    expect(stdout.split('\n').slice(0, 3)).toEqual([
      '-:1:16: error: word "fog" stands beside brackets under "NP" [word-outside-preterminal]',
      ' 1 | (S (NP (D the) fog))',
      '   |                ^',
    ]);
  });

  it('item 17: exits 2 with a one-line message for a file it cannot read, before checking anything', async () => {
    const { code, stdout, stderr } = await cli(['validate', 'no-such-file.psd', demo('harbour.psd')]);
    expect(code).toBe(2);
    expect(stderr).toBe('treebridge: cannot read "no-such-file.psd": no such file\n');
    expect(stdout).toBe('');
  });

  it('exits 2 on an unknown option or a missing argument', async () => {
    const unknown = await cli(['validate', '--colour', demo('harbour.psd')]);
    expect(unknown.code).toBe(2);
    expect(unknown.stderr).toMatch(/unknown option '--colour'/);
    const missing = await cli(['validate']);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/missing required argument 'files'/);
    const command = await cli(['transmogrify']);
    expect(command.code).toBe(2);
  });

  it('writes the report to -o atomically, leaving no temporary file', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treebridge-'));
    const { code, stdout } = await cli(['validate', '--json', '-o', 'report.json', demo('harbour.psd')], { cwd: dir });
    expect(code).toBe(0);
    expect(stdout).toBe('');
    expect(JSON.parse(readFileSync(join(dir, 'report.json'), 'utf8')).trees).toBe(25);
    expect(readdirSync(dir)).toEqual(['report.json']);
  });

  it('exits 2 with a one-line message when the output cannot be written, leaving the old file alone', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treebridge-'));
    const { code, stderr } = await cli(['validate', '-o', 'missing-folder/report.txt', demo('harbour.psd')], { cwd: dir });
    expect(code).toBe(2);
    expect(stderr).toBe('treebridge: cannot write "missing-folder/report.txt": the folder "missing-folder" does not exist\n');
    writeFileSync(join(dir, 'old.txt'), 'old');
    expect(readdirSync(dir)).toEqual(['old.txt']);
  });

  it('prints help and the version, exiting 0', async () => {
    const help = await cli(['--help']);
    expect(help.code).toBe(0);
    expect(help.stdout).toMatch(/validate/);
    const version = await cli(['--version']);
    expect(version.stdout.trim()).toMatch(/^\d+\.\d+\.\d+$/);
  });
});
