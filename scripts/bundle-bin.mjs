#!/usr/bin/env node
// Bundles the command and its worker thread into one module each, in dist/src/bin/, after tsc:
// a command that loads one file instead of some two hundred starts in about half the time. The
// bundles sit where the command's own module sat, at the depth of every compiled module, so that
// what the code finds beside itself (headrules/, package.json) is found the same way. The
// library (dist/src/index.js) stays unbundled. piscina stays outside: it starts its threads from a
// file of its own, found next to its module.
import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'rolldown';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const bin = join(root, 'dist/src/bin');
const shebang = readFileSync(join(bin, 'treebridge.js'), 'utf8').split('\n', 1)[0];
if (!shebang.startsWith('#!')) throw new Error(`dist/src/bin/treebridge.js does not start with a #! line: run tsc first`);

for (const [entry, name] of [
  ['dist/src/bin/treebridge.js', 'treebridge.js'],
  // The worker the command's pool starts: beside the command, as the pool looks for it.
  ['dist/src/api/parallel/worker.js', 'worker.js'],
]) {
  await build({
    input: join(root, entry),
    platform: 'node',
    external: [/^node:/, 'piscina'],
    logLevel: 'warn',
    output: { file: join(bin, `${name}.bundle`), format: 'esm', sourcemap: true, codeSplitting: false },
  });
}
// The command keeps its first line (node's flags); the bundles replace the modules they were built from
// only now, once both are built.
for (const name of ['treebridge.js', 'worker.js']) {
  const text = readFileSync(join(bin, `${name}.bundle`), 'utf8').replace(/^#![^\n]*\n/, '');
  writeFileSync(join(bin, name), (name === 'treebridge.js' ? `${shebang}\n` : '') + text.replaceAll(`${name}.bundle.map`, `${name}.map`));
  writeFileSync(join(bin, `${name}.map`), readFileSync(join(bin, `${name}.bundle.map`)));
  rmSync(join(bin, `${name}.bundle`));
  rmSync(join(bin, `${name}.bundle.map`));
}
