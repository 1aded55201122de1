// npm run profile -- COMMAND ARGS…: runs one treebridge command under V8's sampling profiler
// (node --cpu-prof) and prints where its time goes, self time by source file and by function,
// for the main thread and each worker thread. The command runs from the compiled modules, not
// the bundle the `treebridge` command is, so that time is told by the source file it is spent
// in; the profiles stay in a folder printed at the end, for Chrome's DevTools.
//   npm run profile -- to-deps --heads penn-historical --lemmas --jobs 1 all.psd -o /dev/null
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

interface ProfileNode {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number };
}
interface Profile {
  nodes: ProfileNode[];
  samples: number[];
  timeDeltas: number[];
}

const here = dirname(fileURLToPath(import.meta.url));
const root = resolve(here, '../..');
const args = process.argv.slice(2);
if (args.length === 0) {
  console.error('usage: npm run profile -- COMMAND ARGS… (a treebridge command line)');
  process.exit(2);
}
const folder = mkdtempSync(join(tmpdir(), 'treebridge-profile-'));
const flags = readFileSync(join(root, 'dist/src/bin/treebridge.js'), 'utf8').split('\n', 1)[0]!.split(/\s+/).filter((word) => word.startsWith('--'));
const run = spawnSync(process.execPath, [...flags, '--cpu-prof', '--cpu-prof-dir', folder, join(here, 'run-command.js'), ...args], { stdio: ['inherit', 'ignore', 'inherit'] });
console.log(`treebridge ${args.join(' ')}: exit code ${run.status}\n`);

const top = Number(process.env.TREEBRIDGE_PROFILE_TOP ?? 25);
const name = (url: string) => (url.startsWith('file://') ? relative(root, fileURLToPath(url)) : url || '(V8 and Node)');
for (const file of readdirSync(folder).filter((f) => f.endsWith('.cpuprofile')).sort()) {
  const profile = JSON.parse(readFileSync(join(folder, file), 'utf8')) as Profile;
  const selfTime = new Map<number, number>();
  profile.samples.forEach((id, k) => selfTime.set(id, (selfTime.get(id) ?? 0) + (profile.timeDeltas[k] ?? 0) / 1000));
  const byFile = new Map<string, number>();
  const byFunction = new Map<string, number>();
  let total = 0;
  for (const node of profile.nodes) {
    const ms = selfTime.get(node.id) ?? 0;
    total += ms;
    const where = name(node.callFrame.url);
    byFile.set(where, (byFile.get(where) ?? 0) + ms);
    const fn = `${node.callFrame.functionName || '(anonymous)'}  ${where}:${node.callFrame.lineNumber + 1}`;
    byFunction.set(fn, (byFunction.get(fn) ?? 0) + ms);
  }
  const table = (title: string, entries: Map<string, number>) => {
    console.log(`  ${title}`);
    for (const [key, ms] of [...entries].sort((a, b) => b[1] - a[1]).slice(0, top)) console.log(`  ${ms.toFixed(0).padStart(7)} ms ${((100 * ms) / total).toFixed(1).padStart(5)}%  ${key}`);
  };
  console.log(`${file.includes('.0.001.') ? 'main thread' : 'worker thread'} (${file}): ${total.toFixed(0)} ms sampled`);
  table('self time by file', byFile);
  table('self time by function', byFunction);
  console.log('');
}
console.log(`profiles: ${folder}`);
