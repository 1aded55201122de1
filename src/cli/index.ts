/**
 * The command line of treebridge as a module (`treebridge/cli`): run it with
 * your own streams, as the `treebridge` command does with the process's.
 */
export type { CliIO } from './io.js';
export { runCli } from './run-cli.js';
export { ExitCode } from './exit-codes.js';
