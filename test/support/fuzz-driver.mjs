// Runs fuzz cases through the built command line in this one process, one after the other, and
// prints one line per case as it finishes: `<index> <exit code>`. The parent watches the lines, so
// that a case that never ends is found and the run goes on from the next one.
// Usage: node fuzz-driver.mjs CASES.json FIRST
import { readFileSync } from 'node:fs';
import { PassThrough, Readable } from 'node:stream';
import { runCli } from '../../dist/src/cli/run-cli.js';

const [casesFile, firstArg] = process.argv.slice(2);
const cases = JSON.parse(readFileSync(casesFile, 'utf8'));
for (let index = Number(firstArg ?? 0); index < cases.length; index++) {
  const { args, input } = cases[index];
  const stdout = new PassThrough();
  const stderr = new PassThrough();
  stdout.resume();
  let err = '';
  stderr.on('data', (chunk) => (err += chunk));
  const stdin = Readable.from([Buffer.from(input, 'base64')]);
  let code;
  try {
    code = await runCli(args, { stdin, stdout, stderr });
  } catch (error) {
    code = `threw ${error instanceof Error ? error.message.replace(/\s+/g, ' ') : String(error)}`;
  }
  const detail = code === 70 ? ` ${err.split('\n')[0].replace(/\s+/g, ' ')}` : '';
  process.stdout.write(`${index} ${code}${detail}\n`);
}
