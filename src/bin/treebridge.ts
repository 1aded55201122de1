#!/usr/bin/env -S node --min-semi-space-size=16 --heap-growing-percent=100
import { runCli } from '../cli/index.js';

// A reader that closes the pipe early (`| head`) is not an error of ours: what is written after it
// is dropped (the command's Output does so), and the command runs on to its exit code.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') return;
    throw error;
  });
}

// A thin shell around runCli: real streams in, exit code out.
process.exitCode = await runCli(process.argv.slice(2), {
  stdin: process.stdin,
  stdout: process.stdout,
  stderr: process.stderr,
});
