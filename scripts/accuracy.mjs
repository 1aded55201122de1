#!/usr/bin/env node
// npm run accuracy: the README's accuracy table, measured on the shared corpora (../shared/corpora,
// or TREEBRIDGE_CORPORA): every shipped head table on GUM and IcePaHC against their gold dependencies,
// and tables learned by heads suggest from generic on one half of the documents, scored on the other
// half. Punctuation is left out, as in heads score. Prints a Markdown table.
import { readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { compileHeadTable, readBracketedFile, readConlluFile, scoreHeads, suggestHeads } from '../dist/src/index.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const corpora = process.env.TREEBRIDGE_CORPORA ?? join(root, '..', 'shared', 'corpora');
const list = (folder, extension) =>
  readdirSync(join(corpora, folder))
    .filter((name) => name.endsWith(extension))
    .sort()
    .map((name) => join(corpora, folder, name));

const gum = list('gum/const', '.ptb').map((file) => ({ trees: file, gold: file.replace('/const/', '/dep/').replace(/\.ptb$/, '.conllu') }));
const icepahc = list('icepahc', '.psd').map((file) => ({ trees: file, gold: file.replace('/icepahc/', '/icepahc-ud/').replace(/\.psd$/, '.conllu') }));
const corpusOf = {
  GUM: { pairs: gum, read: {}, unscored: undefined },
  IcePaHC: { pairs: icepahc, read: { splitLemmas: true }, unscored: { key: 'Align', values: ['absorbed', 'extra'] } },
};

async function* trees(pairs, read) {
  for (const { trees: file } of pairs) yield* readBracketedFile(file, { ...read, file }, () => undefined);
}
async function* gold(pairs) {
  for (const { gold: file } of pairs) yield* readConlluFile(file, {}, () => undefined);
}

async function score(corpus, pairs, options) {
  const { read, unscored } = corpusOf[corpus];
  const result = await scoreHeads(trees(pairs, read), gold(pairs), { ...options, ...(unscored ? { unscored } : {}) });
  return { uas: result.scorer.uas, las: result.scorer.las, oracle: result.oracle.uas, words: result.scorer.score.words };
}

const rows = [];
const fixed = (x) => x.toFixed(3);
const add = (corpus, table, s, note = '') => {
  rows.push(`| ${corpus} | ${table} | ${fixed(s.uas)} | ${note ? '–' : fixed(s.las)} | ${fixed(s.oracle)} | ${s.words.toLocaleString('en-US')} | ${note} |`);
  process.stderr.write(`${corpus} ${table}: UAS ${fixed(s.uas)}\n`);
};

for (const heads of ['en-content', 'en-function', 'generic']) {
  const labels = heads === 'en-content' ? { labels: 'en-ud', posMap: 'en-ptb' } : {};
  const note = heads === 'en-function' ? 'function words head (Collins 1999), not UD\'s content heads' : heads === 'generic' ? 'the first child heads: the starting point of heads suggest' : '';
  add('GUM', `\`${heads}\`${labels.labels ? ' + `en-ud`' : ''}`, await score('GUM', gum, { heads, ...labels }), note);
}
for (const heads of ['penn-historical', 'generic']) {
  const labels = heads === 'penn-historical' ? { labels: 'penn-historical', posMap: 'penn-historical' } : {};
  add('IcePaHC', `\`${heads}\`${labels.labels ? ' + labels' : ''}`, await score('IcePaHC', icepahc, { heads, ...labels }), labels.labels ? '' : 'the first child heads: the starting point of heads suggest');
}

// Learned from generic on the odd-numbered documents, scored on the even-numbered ones and back.
for (const corpus of ['GUM', 'IcePaHC']) {
  const { pairs, read } = corpusOf[corpus];
  const halves = [pairs.filter((_, i) => i % 2 === 0), pairs.filter((_, i) => i % 2 === 1)];
  for (const [train, test, name] of [
    [halves[0], halves[1], 'odd → even'],
    [halves[1], halves[0], 'even → odd'],
  ]) {
    const learned = await suggestHeads(trees(train, read), gold(train), { base: 'generic', name: 'learned' });
    const table = compileHeadTable(learned.text);
    const s = await score(corpus, test, { heads: table });
    add(corpus, `learned from \`generic\`, ${name} half`, s, 'heads suggest on one half, scored on the other (no label table)');
  }
}

console.log('| corpus | head table | UAS | LAS | oracle UAS | words scored | note |');
console.log('|---|---|---|---|---|---|---|');
for (const row of rows) console.log(row);
