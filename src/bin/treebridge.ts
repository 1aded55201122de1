#!/usr/bin/env -S node --min-semi-space-size=16
import { runCli } from '../cli/run-cli.js';

// A reader that closes the pipe early (`| head`) is not an error: stop quietly.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw error;
  });
}

// A thin shell around runCli: real streams in, exit code out.
process.exitCode = await runCli(process.argv.slice(2), {
  stdin: process.stdin,
  stdout: process.stdout,
  stderr: process.stderr,
});
