/** Exit codes of every treebridge command. */
export const ExitCode = {
  /** Done, nothing to report. */
  Ok: 0,
  /** Done, and the input has errors (or a gate failed). */
  Findings: 1,
  /** Bad usage, or a file could not be read or written. */
  UsageOrIO: 2,
  /** A fault of treebridge itself (a bug): never the input's doing. */
  Internal: 70,
} as const;

export type ExitCodeValue = (typeof ExitCode)[keyof typeof ExitCode];

/** What a command hands back to the frame: its exit code and one-line messages for standard error. */
export interface CommandResult {
  code: ExitCodeValue;
  messages?: string[];
}
