// Hardening, part 2: head tables that build on themselves, unknown table names, and progress bars
// that kept a finished run alive.
import { spawn } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { compileHeadTable, loadHeadTable, TableError } from '../../src/tables/load-table.js';
import { bin } from '../support/bin.js';
import { cli } from '../support/cli.js';
import { projectRoot } from '../support/corpora.js';

const folder = mkdtempSync(join(tmpdir(), 'treebridge-tables-'));
const table = (name: string, text: string) => {
  const path = join(folder, name);
  writeFileSync(path, text);
  return path;
};
const problemsOf = (load: () => unknown): string[] => {
  try {
    load();
  } catch (error) {
    if (error instanceof TableError) return error.plain !== undefined ? [error.plain] : error.diagnostics.map((d) => `${d.file}:${d.line}:${d.column}: ${d.message}`);
    throw error;
  }
  return [];
};

describe('item 4: tables that build on themselves', () => {
  it('reports a table that builds on itself at its builds-on line', () => {
    const self = table('self.heads', 'table self\nbuilds-on self.heads\nhead NP\n  left first\n');
    expect(problemsOf(() => loadHeadTable(self))).toEqual([`${self}:2:11: the tables build on each other in a circle: ${self} → ${self}`]);
  });

  it('reports two tables that build on each other, naming the circle', () => {
    const a = table('a.heads', 'table a\nbuilds-on b.heads\n');
    const b = table('b.heads', 'table b\n\nbuilds-on a.heads\n');
    expect(problemsOf(() => loadHeadTable(a))).toEqual([`${b}:3:11: the tables build on each other in a circle: ${a} → ${b} → ${a}`]);
  });

  it('refuses a chain of 3,000 tables with a clear message instead of exhausting the stack', () => {
    for (let i = 0; i < 3000; i++) table(`chain${i}.heads`, `table chain${i}\nbuilds-on ${i + 1 < 3000 ? `chain${i + 1}.heads` : 'generic'}\n`);
    const problems = problemsOf(() => loadHeadTable(join(folder, 'chain0.heads')));
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatch(/chain63\.heads:2:11: more than 64 tables build on each other here/);
  });

  it('loads a chain within the limit, the nearest table winning', () => {
    table('base.heads', 'table base\nbuilds-on generic\nhead NP\n  right first\n');
    const top = table('top.heads', 'table top\nbuilds-on base.heads\nhead VP\n  left first\n');
    const loaded = loadHeadTable(top);
    expect(loaded.name).toBe('top');
    expect(loaded.blocks.get('NP')?.steps[0]?.end).toBe('right');
    expect(loaded.blocks.get('VP')?.steps[0]?.end).toBe('left');
  });
});

describe('item 15: table size and many bad lines', () => {
  it('refuses a table larger than 1 MiB, or an endless one, without reading it all', () => {
    const big = table('big.heads', '# ' + 'x'.repeat(1024 * 1024 + 10) + '\n');
    expect(problemsOf(() => loadHeadTable(big))[0]).toMatch(/is larger than 1024 KiB, more than any table needs; not read/);
    expect(problemsOf(() => loadHeadTable('/dev/zero'))[0]).toMatch(/is larger than 1024 KiB/);
  });

  it('reports 10,000 bad lines by listing the first 200 and counting the rest', () => {
    const text = 'table bad\nhead NP\n' + '  left sideways NP\n'.repeat(10_000);
    const problems = problemsOf(() => compileHeadTable(text));
    expect(problems).toHaveLength(201);
    expect(problems[200]).toMatch(/and 9800 more problems in this table, not listed/);
  });
});

describe('item 21: an unknown table name', () => {
  it('lists the shipped tables and suggests the nearest, with no made-up file position', async () => {
    const { code, stderr } = await cli(['to-deps', '--heads', 'en_content', join(projectRoot, 'demo-data/harbour.psd')]);
    expect(code).toBe(2);
    expect(stderr).toBe(
      'treebridge: no head table "en_content": no such file, and no shipped one by that name; shipped head tables: en-content, en-function, generic, generic-right, penn-historical, ud; did you mean "en-content"?\n',
    );
  });
});

describe('item 5: a progress bar never keeps a finished run alive', () => {
  // `script` gives the command a terminal, where the bar is drawn; the run must still end.
  it('heads score on a terminal draws its bar and exits', async () => {
    const trees = join(projectRoot, 'test/fixtures/gold/harbour-1-8.psd');
    const gold = join(projectRoot, 'test/fixtures/gold/harbour-1-8.gold.conllu');
    const command = `${process.execPath} ${bin} heads score --heads en-content ${trees} --gold ${gold}`;
    const result = await new Promise<{ code: number | null; output: string; timedOut: boolean }>((resolve) => {
      const child = spawn('script', ['-qec', command, '/dev/null'], { env: { ...process.env, TREEBRIDGE_PROGRESS_BYTES: '0' } });
      let output = '';
      let timedOut = false;
      child.stdout.on('data', (chunk) => (output += chunk));
      const timer = setTimeout(() => {
        timedOut = true;
        child.kill('SIGKILL');
      }, 60_000);
      child.on('close', (code) => {
        clearTimeout(timer);
        resolve({ code, output, timedOut });
      });
    });
    expect(result.timedOut).toBe(false);
    expect(result.code).toBe(0);
    expect(result.output).toMatch(/reading \[/);
    expect(result.output).toMatch(/UAS \d/);
  });
});
