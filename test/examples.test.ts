import { execFile } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { describe, expect, it } from 'vitest';
import { runBin } from './support/bin.js';
import { projectRoot } from './support/corpora.js';

// The README's library examples are these files, built by `npm run build` into
// dist/examples/ and run here as a user would run them: with node, importing
// only from 'treebridge' (the package resolves itself by name).
const run = promisify(execFile);

async function runExample(name: string, args: string[] = []): Promise<string> {
  const built = join(projectRoot, 'dist/examples', `${name}.js`);
  if (!existsSync(built)) throw new Error(`${built} is missing: run npm run build`);
  const { stdout } = await run(process.execPath, [built, ...args], { cwd: projectRoot });
  return stdout;
}

function exampleSource(name: string): string {
  return readFileSync(join(projectRoot, 'examples', `${name}.ts`), 'utf8');
}

/** The one string literal assigned to `name` in an example, as the example holds it. */
function quotedConstant(source: string, name: string): string {
  const match = new RegExp(`const ${name} = '((?:[^'\\\\]|\\\\.)*)';`).exec(source);
  if (!match) throw new Error(`no constant ${name} in the example`);
  return JSON.parse(`"${match[1]!.replace(/"/g, '\\"')}"`) as string;
}

describe('the library examples', () => {
  it('imports only from treebridge', () => {
    for (const name of ['convert-a-string', 'tweak-a-head-table', 'validate-a-string', 'stats-of-a-file']) {
      const imports = [...exampleSource(name).matchAll(/from '([^']+)'/g)].map((match) => match[1]);
      expect(imports, name).toEqual(['treebridge']);
    }
  });

  it('converts a string to the same CoNLL-U as to-deps converts the same trees in a file, in at most 10 lines', async () => {
    const source = exampleSource('convert-a-string');
    expect(source.trimEnd().split('\n').length).toBeLessThanOrEqual(10);
    const folder = mkdtempSync(join(tmpdir(), 'treebridge-example-'));
    writeFileSync(join(folder, 'ferry.psd'), quotedConstant(source, 'trees'));
    const command = await runBin(['to-deps', '--heads', 'en-content', '--labels', 'en-ud', '--pos-map', 'en-ptb', 'ferry.psd'], { cwd: folder });
    expect(command.code).toBe(0);
    const library = await runExample('convert-a-string');
    expect(library).toBe(command.stdout);
    expect(library).toContain('\tnsubj\t');
  });

  it('builds a variant of a head table in code and shows that it chooses another head', async () => {
    expect(await runExample('tweak-a-head-table')).toMatch(/^en-content: NP-SBJ is headed by "keeper" .*\ndeterminers-first: NP-SBJ is headed by "The" .*\n$/);
  });

  it('validates a CoNLL-U string and prints the problem as validate prints it for a file', async () => {
    const source = exampleSource('validate-a-string');
    const folder = mkdtempSync(join(tmpdir(), 'treebridge-example-'));
    writeFileSync(join(folder, 'gulls.conllu'), quotedConstant(source, 'text'));
    const command = await runBin(['validate', 'gulls.conllu'], { cwd: folder });
    const problems = command.stdout + command.stderr;
    const [first, summary] = (await runExample('validate-a-string')).split('\n');
    expect(first).toContain('[unknown-upos]');
    expect(problems).toContain(first);
    expect(summary).toBe('1 sentence, 1 error, 0 warnings');
  });

  it('gives the figures of a file that stats gives', async () => {
    const command = await runBin(['stats', 'demo-data/crossing.conllu', '--json']);
    const figures = JSON.parse(command.stdout) as { sentences: number; nonProjectiveSentences: number; gapDegree: Record<string, number> };
    expect(await runExample('stats-of-a-file')).toBe(
      `${figures.sentences} sentences, ${figures.nonProjectiveSentences} non-projective, gap degrees ${JSON.stringify(figures.gapDegree)}, 0 not trees\n`,
    );
  });
});

describe('the README', () => {
  it('shows each library example as the file that is run', () => {
    const readme = readFileSync(join(projectRoot, 'README.md'), 'utf8');
    const shown = [...readme.matchAll(/<!-- example: ([a-z-]+) -->\n```ts\n([\s\S]*?)```\n/g)];
    expect(shown.map((match) => match[1])).toEqual(['convert-a-string', 'tweak-a-head-table', 'validate-a-string', 'stats-of-a-file']);
    for (const [, name, code] of shown) expect(code, name).toBe(exampleSource(name!));
  });
});
