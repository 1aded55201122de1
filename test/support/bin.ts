import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { projectRoot } from './corpora.js';

/** The built command (npm test and npm run test:corpora build it first). */
export const bin = join(projectRoot, 'dist/src/bin/treebridge.js');

/** What a run of the built command gave. `timedOut` is set when it had to be stopped. */
export interface BinRun {
  code: number | null;
  stdout: string;
  stderr: string;
  timedOut: boolean;
}

/**
 * Runs the built `treebridge` in a process of its own, so that a run that
 * never ends (an endless loop) is stopped and reported as such instead of
 * stopping the test run. The bound is generous: it tells a hang from a slow
 * machine, it does not measure speed.
 */
export function runBin(args: string[], options: { stdin?: string | Buffer; cwd?: string; limitMs?: number; env?: NodeJS.ProcessEnv } = {}): Promise<BinRun> {
  if (!existsSync(bin)) throw new Error(`${bin} is missing: run npm run build`);
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [bin, ...args], { cwd: options.cwd ?? projectRoot, env: options.env ?? process.env });
    let stdout = '';
    let stderr = '';
    let timedOut = false;
    child.stdout.setEncoding('utf8').on('data', (chunk: string) => (stdout += chunk));
    child.stderr.setEncoding('utf8').on('data', (chunk: string) => (stderr += chunk));
    const timer = setTimeout(() => {
      timedOut = true;
      child.kill('SIGKILL');
    }, options.limitMs ?? 60_000);
    child.on('error', reject);
    child.on('close', (code) => {
      clearTimeout(timer);
      resolve({ code, stdout, stderr, timedOut });
    });
    child.stdin.on('error', () => undefined);
    child.stdin.end(options.stdin ?? '');
  });
}
