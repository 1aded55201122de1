import { describe, expect, it } from 'vitest';
import { convertText, convertTrees, TreeConverter } from '../../src/api/convert.js';
import { conversionDefaults, OptionsError, resolveConversionOptions } from '../../src/api/options.js';
import type { Diagnostic } from '../../src/diagnostics/diagnostic.js';
import { readBracketedText } from '../../src/formats/bracketed/read-bracketed.js';

// Invented sentences of the harbour scenario.
const fog = '(S (NP-SBJ (N Fog)) (VP (V lifted)))';
const gulls = '(S (NP-SBJ (N Gulls)) (VP (V circled)))';
const ids = (conllu: string) => [...conllu.matchAll(/^# sent_id = (.*)$/gm)].map((match) => match[1]);

describe('convertText', () => {
  it('names trees without identifier by the source and their number, and words by the source in MISC', async () => {
    const conllu = await convertText(`${fog}\n${gulls}\n`, { heads: 'en-content', source: 'quay.psd' });
    expect(ids(conllu)).toEqual(['quay.psd-1', 'quay.psd-2']);
    expect(conllu).toContain('\tFrom=quay.psd#2\n');
  });

  it('leaves the origin out of MISC when no source is given, never naming a fake file', async () => {
    const conllu = await convertText(`${fog}\n`, { heads: 'en-content' });
    expect(ids(conllu)).toEqual(['1']);
    expect(conllu).not.toContain('From=');
  });

  it('numbers a piece of a split corpus from --first-number with the prefix given', async () => {
    const conllu = await convertText(`${fog}\n${gulls}\n`, { heads: 'en-content', idPrefix: 'quay-', firstNumber: 41 });
    expect(ids(conllu)).toEqual(['quay-41', 'quay-42']);
  });

  it('keeps the number of every tree after one that cannot be read, which is reported', async () => {
    const problems: Diagnostic[] = [];
    const conllu = await convertText(`${fog}\n(S (NP-SBJ (N Rain) (VP (V fell)))\n${gulls}\n`, { heads: 'en-content', source: 'quay.psd' }, (d) => problems.push(d));
    expect(problems.map((d) => d.code)).toContain('unclosed-bracket');
    expect(ids(conllu)).toEqual(['quay.psd-1', 'quay.psd-3']);
  });
});

describe('conversion options', () => {
  it('are checked, each problem naming its option', () => {
    expect(() => resolveConversionOptions({ heads: 'en-content', coordination: 'middle' as 'first' })).toThrow(OptionsError);
    let problems: string[] = [];
    try {
      resolveConversionOptions({ heads: '', punctuation: 'nowhere' as 'root' });
    } catch (error) {
      problems = (error as OptionsError).problems;
    }
    expect(problems.map((problem) => problem.split(':')[0])).toEqual(['heads', 'punctuation']);
  });

  it('default to the command line defaults, defined once', () => {
    const { settings, lossless } = resolveConversionOptions({ heads: 'en-content' });
    expect({ traces: settings.traces, coordination: settings.coordination, punctuation: settings.punctuation, lossless }).toEqual(conversionDefaults);
  });
});

describe('TreeConverter', () => {
  it('gives the same sentences tree by tree as convertTrees over the stream', async () => {
    const trees = readBracketedText(`${fog}\n( (CODE {a note}))\n${gulls}\n`, {}, () => undefined);
    const options = { heads: 'en-content', lossless: true, source: 'quay.psd' };
    const streamed = [];
    for await (const sentence of convertTrees(trees, options)) streamed.push(sentence);
    const converter = new TreeConverter(options);
    const stepped = [...trees.flatMap((tree) => converter.convert(tree)), ...converter.finish()];
    expect(stepped).toEqual(streamed);
    // In lossless mode the tree without words rides on the sentence after it.
    expect(stepped.map((sentence) => sentence.comments.some((comment) => comment.text.includes('a note')))).toEqual([false, true]);
    expect(converter.tally).toEqual({ read: 3, converted: 2, carried: 1, skipped: 0 });
  });
});
