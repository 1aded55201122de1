// The product of the conversion, measured against gold made by others:
// - IcePaHC (CC BY 4.0) against its UD version, ../shared/corpora/icepahc-ud (UD_Icelandic-IcePaHC,
//   CC BY-SA 4.0), on the words its MISC marks as scored (Align=absorbed|extra left out);
// - GUM constituency trees (CC BY 4.0) against GUM's own gold dependencies (CC BY 4.0).
// Relations are compared by their universal part, punctuation left out of UAS and LAS (common
// practice); UPOS over every scored word; features for the words whose gold has them.
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { scoreConversion } from '../../src/evaluate/score-conversion.js';
import { readBracketedFile } from '../../src/formats/bracketed/read-bracketed.js';
import { readConlluFile, readConlluText } from '../../src/formats/conllu/read-conllu.js';
import { loadHeadTable, loadLabelTable } from '../../src/tables/load-table.js';
import { loadPosMap } from '../../src/tables/load-pos-map.js';
import type { DependencyWord } from '../../src/model/dependency.js';
import { cli } from '../support/cli.js';
import { corpusFiles } from '../support/corpora.js';

const dir = mkdtempSync(join(tmpdir(), 'treebridge-ud-'));
const unscored = (word: DependencyWord) => /(^|\|)Align=(absorbed|extra)(\||$)/.test(word.misc);

async function* trees(folder: string, extension: string, splitLemmas: boolean) {
  for (const file of corpusFiles(folder, extension)) yield* readBracketedFile(file, { splitLemmas }, () => undefined);
}
async function* gold(folder: string) {
  for (const file of corpusFiles(folder, '.conllu')) yield* readConlluFile(file, {}, () => undefined);
}

/**
 * The ceiling of Case against this gold: the share of gold Case values that the tree's own case
 * suffix (-N -A -D -G) gives. The gold's Case comes from a tagger of its own (see the corpus README:
 * an automatic conversion of an earlier release), not from the trees; a conversion from the
 * trees cannot pass this share.
 */
function caseCeiling(): { ceiling: number; withCase: number } {
  const names: Record<string, string> = { N: 'Nom', A: 'Acc', D: 'Dat', G: 'Gen' };
  let withCase = 0;
  let agreeing = 0;
  for (const file of corpusFiles('icepahc-ud', '.conllu')) {
    for (const sentence of readConlluText(readFileSync(file, 'utf8'), {}, () => undefined)) {
      for (const word of sentence.lines) {
        if (word.type !== 'word' || unscored(word)) continue;
        const gold = /(^|\|)Case=([A-Za-z]+)/.exec(word.feats)?.[2];
        if (!gold) continue;
        withCase++;
        const suffix = /-([NADG])$/.exec(word.xpos)?.[1];
        if (suffix && names[suffix] === gold) agreeing++;
      }
    }
  }
  return { ceiling: agreeing / withCase, withCase };
}

describe('IcePaHC against its UD version', () => {
  it('reaches UAS ≥ 0.92, LAS ≥ 0.78 and UPOS ≥ 0.97 with the penn-historical tables, and Case up to what the tags allow', async () => {
    const settings = { heads: loadHeadTable('penn-historical'), labels: loadLabelTable('penn-historical'), upos: loadPosMap('penn-historical'), traces: 'keep' as const, coordination: 'first' as const, punctuation: 'phrase' as const };
    const result = await scoreConversion(trees('icepahc', '.psd', true), gold('icepahc-ud'), settings, () => undefined, false, undefined, unscored);
    const s = result.scorer;
    const features = ['Case', 'Number', 'Tense', 'Mood', 'VerbForm', 'Degree'].map((name) => `${name} ${s.feature(name).toFixed(4)}`).join(', ');
    console.log(`IcePaHC: UAS ${s.uas.toFixed(4)}, LAS ${s.las.toFixed(4)}, UPOS ${s.upos.toFixed(4)}; ${features}; oracle UAS ${result.oracle.uas.toFixed(4)}; ${s.score.words} words`);
    expect(s.uas).toBeGreaterThanOrEqual(0.92);
    expect(s.las).toBeGreaterThanOrEqual(0.78);
    expect(s.upos).toBeGreaterThanOrEqual(0.97);
    const { ceiling, withCase } = caseCeiling();
    console.log(`IcePaHC: gold Case values that the trees' case suffixes give: ${(100 * ceiling).toFixed(2)}% of ${withCase} (the ceiling of Case)`);
    expect(s.feature('Case')).toBeGreaterThanOrEqual(ceiling);
  });
});

describe('GUM against its gold dependencies', () => {
  it('reaches UPOS ≥ 0.97 and LAS ≥ 0.85 with en-content, en-ud and en-ptb', async () => {
    const settings = { heads: loadHeadTable('en-content'), labels: loadLabelTable('en-ud'), upos: loadPosMap('en-ptb'), traces: 'keep' as const, coordination: 'first' as const, punctuation: 'phrase' as const };
    const result = await scoreConversion(trees('gum/const', '.ptb', false), gold('gum/dep'), settings, () => undefined);
    const s = result.scorer;
    console.log(`GUM: UAS ${s.uas.toFixed(4)}, LAS ${s.las.toFixed(4)}, UPOS ${s.upos.toFixed(4)}; oracle UAS ${result.oracle.uas.toFixed(4)}; ${s.score.words} words`);
    expect(s.upos).toBeGreaterThanOrEqual(0.97);
    expect(s.las).toBeGreaterThanOrEqual(0.85);
  });
});

describe.each([
  ['IcePaHC', 'icepahc', '.psd', ['--heads', 'penn-historical', '--labels', 'penn-historical', '--pos-map', 'penn-historical', '--lemmas']],
  ['GUM', 'gum/const', '.ptb', ['--heads', 'en-content', '--labels', 'en-ud', '--pos-map', 'en-ptb']],
])('the converted %s', (name, folder, extension, options) => {
  const out = join(dir, `${name}.conllu`);

  it('validates with 0 errors and 0 warnings (our validator: UD v2 format, relations, tags, features)', async () => {
    const converted = await cli(['to-deps', '--quiet', ...options, '-o', out, ...corpusFiles(folder, extension)]);
    expect(converted.code).toBe(0);
    const checked = await cli(['validate', out]);
    expect(checked.stdout.trimEnd().split('\n').pop()).toMatch(/: 0 errors, 0 warnings$/);
  });

  it('has no empty element among its words and no bracket escape in FORM', () => {
    const sentences = readConlluText(readFileSync(out, 'utf8'), {}, () => undefined);
    const forms = sentences.flatMap((s) => s.lines.filter((l) => l.type === 'word').map((l) => l.form));
    // Empty elements of both schemes (Bies et al. 1995, from memory; the IcePaHC kinds *con* *pro* *exp* *arb*).
    expect(forms.filter((form) => /^\*[^*]*\*(-.*)?$/.test(form))).toEqual([]);
    expect(forms.filter((form) => /-[LR][RSC]B-/.test(form))).toEqual([]);
  });

  it('gives back every bracketing byte for byte in lossless mode, with the word table on', async () => {
    const files = corpusFiles(folder, extension);
    const carried = join(dir, `${name}.lossless.conllu`);
    expect((await cli(['to-deps', '--quiet', '--lossless', ...options, '-o', carried, ...files])).code).toBe(0);
    const back = await cli(['to-brackets', '--quiet', '--lossless', carried]);
    const rewritten = await cli(['rewrite', '--quiet', ...(options.includes('--lemmas') ? ['--lemmas'] : []), ...files]);
    expect(back.stdout === rewritten.stdout).toBe(true);
  });
});
