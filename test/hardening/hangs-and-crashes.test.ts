// Hardening, part 1: inputs that used to make commands loop forever or crash. Every command must
// report the sentence and go on, within its own process (a hang is stopped and fails the test).
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runBin } from '../support/bin.js';

const folder = mkdtempSync(join(tmpdir(), 'treebridge-hangs-'));
const file = (name: string, text: string) => {
  const path = join(folder, name);
  writeFileSync(path, text);
  return path;
};

/** A sentence of invented words with the given HEAD column. */
function sentence(id: string, heads: string[]): string {
  const forms = ['gulls', 'circled', 'the', 'pier', 'slowly'].slice(0, heads.length);
  const lines = heads.map((head, i) => `${i + 1}\t${forms[i]}\t_\tX\t_\t_\t${head}\t${head === '0' ? 'root' : 'dep'}\t_\t_`);
  return `# sent_id = ${id}\n# text = ${forms.join(' ')}\n${lines.join('\n')}\n\n`;
}
const good = sentence('fine', ['2', '0', '4', '2']);

describe('item 1: heads that do not form a tree never make a command loop', () => {
  const cases = {
    'two words pointing at each other, a third as root': sentence('loop', ['3', '0', '4', '3']),
    'HEAD 1.0': sentence('decimal', ['1.0', '0', '2', '2']),
    'HEAD +1': sentence('signed', ['+1', '0', '2', '2']),
  };
  for (const [what, text] of Object.entries(cases)) {
    for (const command of [['stats'], ['to-brackets'], ['to-brackets', '--to', 'xml'], ['roundtrip']]) {
      it(`${command.join(' ')} reports "${what}", goes on to the next sentence and exits 1`, async () => {
        const path = file(`${what.replace(/\W+/g, '-')}.conllu`, text + good);
        const run = await runBin([...command, path]);
        expect(run.timedOut).toBe(false);
        expect(run.code).toBe(1);
        expect(run.stderr).toMatch(/error: .*\[(not-a-tree|cycle|head-not-word|several-root-words|no-root)\]/);
        if (command[0] === 'to-brackets') expect(run.stderr).toMatch(/2 sentences read: 1 written, 1 skipped/);
        if (command[0] === 'stats') expect(run.stdout).toMatch(/sentences\s+1\n/);
      });
    }
  }
});

describe('item 2: stats on HEAD -1', () => {
  it('reports the sentence and prints the figures of the others', async () => {
    const path = file('negative.conllu', sentence('negative', ['-1', '0', '2', '2']) + good);
    const run = await runBin(['stats', path]);
    expect(run.code).toBe(1);
    expect(run.stderr).not.toMatch(/Cannot read properties/);
    expect(run.stderr).toMatch(/\[head-not-word\]/);
    expect(run.stdout).toMatch(/sentences\s+1\n/);
  });
});

describe('item 3: no stack overflow at the documented depth limit (2,000)', () => {
  // A bracketing nested as deep as the reader accepts: the outer bracket, 1,998 phrases, the tag.
  const depth = 1998;
  const deepTree = `( ${'(NP '.repeat(depth)}(N keel)${')'.repeat(depth)} (ID keel.1))\n`;
  const deepPsd = file('deep.psd', deepTree);
  // XML graphs of n nonterminals over one word: 1,999 is as deep as the reader accepts (2,000 levels);
  // as a bracketing with its identifier, 1,998 is as deep as fits.
  const graph = (n: number) => {
    const nts: string[] = [];
    for (let i = 0; i < n; i++) nts.push(`<nt id="n${i}" cat="NP"><edge label="--" idref="${i + 1 < n ? `n${i + 1}` : 't1'}"/></nt>`);
    return `<?xml version="1.0" encoding="UTF-8"?>\n<corpus><body><s id="s1"><graph root="n0"><terminals><t id="t1" word="keel" pos="N"/></terminals><nonterminals>${nts.join('')}</nonterminals></graph></s></body></corpus>\n`;
  };
  const deepXml = file('deep.xml', graph(1999));
  const fittingXml = file('fitting.xml', graph(1998));
  // A dependency chain of 2,000 words, and one of 1,998 (whose bracketing is exactly 2,000 deep).
  const chain = (n: number) => {
    const lines = Array.from({ length: n }, (_, i) => `${i + 1}\tkeel\t_\tNOUN\t_\t_\t${i}\t${i === 0 ? 'root' : 'nmod'}\t_\t_`);
    return `# sent_id = chain${n}\n# text = ${Array(n).fill('keel').join(' ')}\n${lines.join('\n')}\n\n`;
  };
  const longChain = file('chain2000.conllu', chain(2000));
  const fittingChain = file('chain1998.conllu', chain(1998));

  const runs: Array<[string, string[], number]> = [
    ['validate a bracketing', ['validate', deepPsd], 0],
    ['rewrite a bracketing', ['rewrite', deepPsd], 0],
    ['rewrite a bracketing indented', ['rewrite', '--layout', 'indented', deepPsd], 0],
    ['rewrite a bracketing as XML', ['rewrite', '--to', 'xml', deepPsd], 0],
    ['rewrite with traces resolved', ['rewrite', '--traces', 'resolve', deepPsd], 0],
    ['convert a bracketing', ['to-deps', '--heads', 'generic', deepPsd], 0],
    ['convert a bracketing losslessly', ['to-deps', '--lossless', '--heads', 'generic', deepPsd], 0],
    ['measure a bracketing', ['stats', '--heads', 'generic', deepPsd], 0],
    ['round-trip a bracketing', ['roundtrip', '--heads', 'generic', deepPsd], 0],
    ['explain the heads of a bracketing', ['heads', 'explain', '--heads', 'generic', deepPsd], 0],
    ['validate an XML graph', ['validate', deepXml], 0],
    ['rewrite an XML graph as deep as a bracketing may be', ['rewrite', fittingXml], 0],
    ['rewrite the deepest XML graph: refused, as too deep for a bracketing', ['rewrite', deepXml], 1],
    ['convert an XML graph', ['to-deps', '--heads', 'generic', deepXml], 0],
    ['bracket a chain of 1,998 words', ['to-brackets', fittingChain], 0],
    ['round-trip a chain of 1,998 words', ['roundtrip', fittingChain], 0],
    ['bracket a chain of 2,000 words: refused, as too deep to read back', ['to-brackets', longChain], 1],
    ['write a chain of 2,000 words as an XML graph', ['to-brackets', '--to', 'xml', longChain], 0],
  ];
  for (const [what, args, code] of runs) {
    it(`can ${what}`, async () => {
      const run = await runBin(args);
      expect(run.stderr).not.toMatch(/Maximum call stack/);
      expect(run.code).toBe(code);
      if (code === 1) expect(run.stderr).toMatch(/deeper than 2000 brackets.*\[unwritable-tree\]/);
    });
  }

  it('reads back a bracketing built from the deepest chain that fits', async () => {
    const built = await runBin(['to-brackets', fittingChain]);
    const back = await runBin(['validate', '--from', 'bracketed', '-'], { stdin: built.stdout });
    expect(back.stdout).toMatch(/1 tree, 1,998 words: 0 errors/);
  });
});
