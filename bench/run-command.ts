// Runs a treebridge command line from the compiled modules (not the bundle), for bench/profile.ts.
import { runCli } from '../src/cli/index.js';

process.exitCode = await runCli(process.argv.slice(2), { stdin: process.stdin, stdout: process.stdout, stderr: process.stderr });
