import { Option, type Command } from 'commander';
import { defaultJobs } from '../api/parallel/pool.js';
import { wholeNumber } from './whole-number.js';

/** `--jobs N`: how many worker threads share the work; 1 runs everything on the main thread. */
export function addJobsOption(command: Command): Command {
  return command.addOption(
    new Option('--jobs <n>', 'worker threads sharing the work (output identical for any number; 1: no workers)').default(defaultJobs(), `${defaultJobs()}: TREEBRIDGE_JOBS, else one per core`).argParser(wholeNumber(1)),
  );
}

export function jobsOf(options: Record<string, unknown>): number {
  return (options.jobs as number | undefined) ?? defaultJobs();
}
