import { execFileSync } from 'node:child_process';
import { existsSync, readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The project's root folder. */
export const projectRoot = resolve(fileURLToPath(new URL('../..', import.meta.url)));

/**
 * The shared corpora: TREEBRIDGE_CORPORA, or ../shared/corpora beside the
 * project. A missing folder fails the test run; corpus tests never skip.
 */
export function corporaRoot(): string {
  const root = process.env.TREEBRIDGE_CORPORA ?? resolve(projectRoot, '../shared/corpora');
  if (!existsSync(root)) throw new Error(`shared corpora not found at ${root} (set TREEBRIDGE_CORPORA)`);
  return root;
}

/** Files of one corpus folder with an extension, sorted; fails when there are none. */
export function corpusFiles(folder: string, extension: string): string[] {
  const dir = join(corporaRoot(), folder);
  if (!existsSync(dir)) throw new Error(`corpus folder missing: ${dir}`);
  const files = readdirSync(dir)
    .filter((name) => name.endsWith(extension))
    .sort()
    .map((name) => join(dir, name));
  if (files.length === 0) throw new Error(`no ${extension} files in ${dir}`);
  return files;
}

/** The Python interpreter that has Debian's python3-nltk: TREEBRIDGE_PYTHON, else /usr/bin/python3. */
export const python = process.env.TREEBRIDGE_PYTHON ?? '/usr/bin/python3';

/** Trees of bracketed files as NLTK's reader sees them: one JSON outline line per tree (see nltk-trees.py). */
export function nltkOutlines(files: string[]): string[] {
  const script = join(projectRoot, 'test/support/nltk-trees.py');
  const out = execFileSync(python, [script, 'dump', ...files], { encoding: 'utf8', maxBuffer: 1 << 30 });
  return out.split('\n').filter((line) => line.length > 0);
}

/** Heads of every sentence of CoNLL-U files as NLTK's DependencyGraph reads them, one JSON array per sentence. */
export function nltkHeads(files: string[]): string[] {
  const script = join(projectRoot, 'test/support/nltk-trees.py');
  const out = execFileSync(python, [script, 'deps', ...files], { encoding: 'utf8', maxBuffer: 1 << 30 });
  return out.split('\n').filter((line) => line.length > 0);
}
