// Loaded with --import into a command measured by the bench: when the process
// ends, its peak resident memory (all threads) and its wall time go to the
// file named by TREEBRIDGE_BENCH_RECORD, as JSON.
import { writeFileSync } from 'node:fs';

const started = process.hrtime.bigint();
process.on('exit', () => {
  const record = process.env.TREEBRIDGE_BENCH_RECORD;
  if (!record) return;
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  writeFileSync(record, JSON.stringify({ seconds, peakMB: process.resourceUsage().maxRSS / 1024 }));
});
