// Dependency → brackets → dependency on the shared CoNLL-U files (UD EWT and CAC
// dev, CC BY-SA 4.0; GUM dep, CC BY 4.0): heads and relations come back exactly,
// non-projective sentences included (Nivre & Nilsson 2005 lifting, *ICH* traces
// after Bies et al. 1995, from memory). Every bracketing validates, and NLTK's
// tree reader (Debian python3-nltk) reads every one.
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readConlluText } from '../../src/formats/conllu/read-conllu.js';
import { cli } from '../support/cli.js';
import { corpusFiles, nltkOutlines } from '../support/corpora.js';

const arcs = (path: string) =>
  readConlluText(readFileSync(path, 'utf8'), {}, () => undefined).map((s) =>
    s.lines.filter((l) => l.type === 'word').map((l) => `${l.head}:${l.deprel}`).join(' '),
  );

describe.each([
  ['UD', 'ud'],
  ['GUM', 'gum/dep'],
])('the %s files', (_name, folder) => {
  it.each(['flat', 'layered'])('go to %s brackets and back to the same heads and relations', async (shape) => {
    const dir = mkdtempSync(join(tmpdir(), 'treebridge-round-'));
    const files = corpusFiles(folder, '.conllu');
    const brackets = join(dir, 'out.psd');
    const back = join(dir, 'back.conllu');
    const built = await cli(['to-brackets', '--shape', shape, '-o', brackets, ...files]);
    expect(built.code).toBe(0);
    const [, read, written, lifted] = /([\d,]+) sentences read: ([\d,]+) written, 0 skipped; ([\d,]+) arcs? lifted/.exec(built.stderr)!;
    expect(written).toBe(read);
    console.log(`${folder}, ${shape}: ${read} sentences, ${lifted} arcs lifted`);
    const checked = await cli(['validate', brackets]);
    expect(checked.stdout.trimEnd().split('\n').pop()).toMatch(new RegExp(`^1 file, ${read} trees, [\\d,]+ words: 0 errors, 0 warnings$`));
    expect((await cli(['to-deps', '--heads', 'ud', '--traces', 'resolve', '-o', back, brackets])).code).toBe(0);
    const original = files.flatMap(arcs);
    const again = arcs(back);
    expect(again.length).toBe(original.length);
    const differing = again.findIndex((line, i) => line !== original[i]);
    expect(differing).toBe(-1);
    expect(nltkOutlines([brackets])).toHaveLength(Number(read!.replace(/,/g, '')));
  });
});
