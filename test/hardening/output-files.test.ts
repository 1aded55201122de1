// Hardening, part 3: where output goes. Inputs are never overwritten, links and special files are
// written through, permissions kept, temporary files never left behind, and a closed pipe keeps the
// exit code of what was found.
import { spawn, spawnSync } from 'node:child_process';
import { chmodSync, existsSync, lstatSync, mkdtempSync, readFileSync, readdirSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bin, runBin } from '../support/bin.js';
import { projectRoot } from '../support/corpora.js';

const harbour = join(projectRoot, 'demo-data/harbour.psd');
const fresh = () => mkdtempSync(join(tmpdir(), 'treebridge-out-'));

describe('item 10: -o never replaces an input, and writes through links and special files', () => {
  it('refuses -o naming one of the inputs, leaving it untouched', async () => {
    const dir = fresh();
    const input = join(dir, 'h.psd');
    writeFileSync(input, readFileSync(harbour));
    const run = await runBin(['to-deps', '--heads', 'en-content', '-o', input, input]);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(/the output ".*h\.psd" is the input ".*h\.psd": writing it would destroy what is being read/);
    expect(readFileSync(input, 'utf8')).toBe(readFileSync(harbour, 'utf8'));
  });

  it('refuses -o naming a link to one of the inputs', async () => {
    const dir = fresh();
    const input = join(dir, 'h.psd');
    writeFileSync(input, readFileSync(harbour));
    symlinkSync(input, join(dir, 'link.conllu'));
    const run = await runBin(['to-deps', '--heads', 'en-content', '-o', join(dir, 'link.conllu'), input]);
    expect(run.code).toBe(2);
  });

  it('writes through a symbolic link: the file it names is replaced, the link stays a link', async () => {
    const dir = fresh();
    const real = join(dir, 'real.conllu');
    writeFileSync(real, 'old\n');
    symlinkSync(real, join(dir, 'link.conllu'));
    const run = await runBin(['to-deps', '--heads', 'en-content', '-o', join(dir, 'link.conllu'), harbour]);
    expect(run.code).toBe(0);
    expect(lstatSync(join(dir, 'link.conllu')).isSymbolicLink()).toBe(true);
    expect(readFileSync(real, 'utf8')).toMatch(/^# sent_id = harbour\.1/);
  });

  it('keeps the permissions of the file it replaces', async () => {
    const dir = fresh();
    const target = join(dir, 'out.conllu');
    writeFileSync(target, 'old\n');
    chmodSync(target, 0o640);
    expect((await runBin(['to-deps', '--heads', 'en-content', '-o', target, harbour])).code).toBe(0);
    expect(statSync(target).mode & 0o777).toBe(0o640);
  });

  it('writes to a device such as /dev/null without trying to replace it', async () => {
    const run = await runBin(['to-deps', '--heads', 'en-content', '-o', '/dev/null', harbour]);
    expect(run.code).toBe(0);
    expect(existsSync('/dev/null')).toBe(true);
    expect(statSync('/dev/null').isCharacterDevice()).toBe(true);
  });

  it('writes into a FIFO that a reader drains', async () => {
    const dir = fresh();
    const fifo = join(dir, 'pipe');
    expect(spawnSync('mkfifo', [fifo]).status).toBe(0);
    const reader = spawn('cat', [fifo]);
    let got = '';
    reader.stdout.on('data', (chunk) => (got += chunk));
    const drained = new Promise((resolve) => reader.on('close', resolve));
    const run = await runBin(['to-deps', '--heads', 'en-content', '-o', fifo, harbour]);
    await drained;
    expect(run.code).toBe(0);
    expect(got).toMatch(/^# sent_id = harbour\.1/);
  });
});

describe('item 11: an interrupted run leaves no temporary file', () => {
  it('removes its temporary file on SIGTERM, and the next run names a stale one', async () => {
    const dir = fresh();
    // Enough input to be still running when the signal comes: the demo trees many times over.
    const big = join(dir, 'big.psd');
    const text = readFileSync(harbour, 'utf8');
    writeFileSync(big, Array.from({ length: 400 }, () => text).join(''));
    const child = spawn(process.execPath, [bin, 'to-deps', '--heads', 'en-content', '-o', join(dir, 'out.conllu'), big]);
    // Wait until the temporary file exists, then stop the run.
    for (let i = 0; i < 600 && !readdirSync(dir).some((name) => name.includes('.tmp-')); i++) await new Promise((r) => setTimeout(r, 10));
    child.kill('SIGTERM');
    const code = await new Promise<number | null>((resolve) => child.on('close', resolve));
    expect([143, 0]).toContain(code ?? 143);
    expect(readdirSync(dir).filter((name) => name.includes('.tmp-'))).toEqual([]);
    // A stale temporary file of a killed run (its process gone) is named by the next run.
    writeFileSync(join(dir, '.out.conllu.tmp-999999999-1'), 'half');
    const next = await runBin(['to-deps', '--heads', 'en-content', '-o', join(dir, 'out.conllu'), harbour]);
    expect(next.stderr).toMatch(/a temporary file left by an interrupted run is still there: .*\.out\.conllu\.tmp-999999999-1 \(remove it\)/);
  });
});

describe('item 12: a closed pipe keeps the exit code', () => {
  it('validate of a file with errors, piped into head -1, still exits 1', () => {
    const broken = join(projectRoot, 'demo-data/broken.psd');
    const piped = spawnSync('bash', ['-c', `set -o pipefail; "${process.execPath}" "${bin}" validate "${broken}" "${broken}" "${broken}" | head -1; echo "exit \${PIPESTATUS[0]}"`], { encoding: 'utf8' });
    expect(piped.stdout.trim().split('\n').pop()).toBe('exit 1');
  });
});
