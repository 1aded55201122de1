import { PassThrough, Readable } from 'node:stream';
import { runCli } from '../../src/cli/run-cli.js';

/** Runs the CLI in-process with captured streams; `stdin` is what standard input holds. */
export async function cli(args: string[], options: { stdin?: string; cwd?: string } = {}) {
  const stdout = new PassThrough();
  const stderr = new PassThrough();
  let out = '';
  let err = '';
  stdout.on('data', (chunk) => (out += chunk));
  stderr.on('data', (chunk) => (err += chunk));
  const code = await runCli(args, {
    stdin: Readable.from(options.stdin === undefined ? [] : [Buffer.from(options.stdin)]),
    stdout,
    stderr,
    cwd: options.cwd,
  });
  return { code, stdout: out, stderr: err };
}
