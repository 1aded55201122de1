// What to-deps writes for the shared corpora (GUM CC BY 4.0, IcePaHC CC BY 4.0)
// passes our own CoNLL-U validator, and NLTK's DependencyGraph (Debian
// python3-nltk, a reference library) reads every sentence with the same heads
// (UD v2 format specification, CHECK-VALUES §6).
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readConlluText } from '../../src/formats/conllu/read-conllu.js';
import { cli } from '../support/cli.js';
import { corpusFiles, nltkHeads } from '../support/corpora.js';

describe.each([
  ['GUM with en-content and en-ud', 'gum/const', '.ptb', ['--heads', 'en-content', '--labels', 'en-ud', '--pos-map', 'en-ptb']],
  ['IcePaHC with penn-historical, traces restored', 'icepahc', '.psd', ['--heads', 'penn-historical', '--traces', 'resolve', '--lemmas']],
])('to-deps on %s', (_name, folder, extension, options) => {
  it('writes CoNLL-U that validates and that NLTK reads with the same heads', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'treebridge-deps-'));
    const out = join(dir, 'out.conllu');
    const files = corpusFiles(folder, extension);
    const converted = await cli(['to-deps', ...options, '-o', out, ...files]);
    expect(converted.code).toBe(0);
    const summary = /([\d,]+) trees? read: ([\d,]+) converted, ([\d,]+) skipped/.exec(converted.stderr)!;
    expect(Number(summary[2]!.replace(/,/g, '')) + Number(summary[3]!.replace(/,/g, ''))).toBe(Number(summary[1]!.replace(/,/g, '')));
    // Relations from function tags (IcePaHC) are not UD relations: those warnings are expected; errors are not.
    const checked = await cli(['validate', out]);
    const last = checked.stdout.trimEnd().split('\n').pop()!;
    expect(last).toMatch(new RegExp(`^1 file, ${summary[2]} sentences, [\\d,]+ words: 0 errors, [\\d,]+ warnings?$`));
    const ours = readConlluText(readFileSync(out, 'utf8'), {}, () => undefined).map((s) =>
      JSON.stringify(s.lines.map((l) => Number(l.head))),
    );
    expect(nltkHeads([out])).toEqual(ours);
  });
});
