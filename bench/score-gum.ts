// Development tool: converts the shared GUM trees (CC BY 4.0) and scores them
// against the gold dependencies, with the oracle, and prints the commonest errors.
// node dist/bench/score-gum.js HEADS [LABELS]
import { readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { readBracketedFile } from '../src/formats/bracketed/read-bracketed.js';
import { readConlluFile } from '../src/formats/conllu/read-conllu.js';
import { scoreConversion } from '../src/evaluate/score-conversion.js';
import { loadHeadTable, loadLabelTable } from '../src/tables/load-table.js';

const corpora = process.env.TREEBRIDGE_CORPORA ?? resolve(process.cwd(), '../shared/corpora');
const names = readdirSync(join(corpora, 'gum/const')).filter((n) => n.endsWith('.ptb')).map((n) => n.slice(0, -4)).sort();
const settings = {
  heads: loadHeadTable(process.argv[2] ?? 'en-content'),
  labels: process.argv[3] ? loadLabelTable(process.argv[3]) : undefined,
  traces: 'keep' as const,
  coordination: 'first' as const,
  punctuation: 'phrase' as const,
};
async function* trees() {
  for (const name of names) yield* readBracketedFile(join(corpora, 'gum/const', `${name}.ptb`), {}, () => undefined);
}
async function* gold() {
  for (const name of names) yield* readConlluFile(join(corpora, 'gum/dep', `${name}.conllu`), {}, () => undefined);
}
const result = await scoreConversion(trees(), gold(), settings, (d) => console.error(d.message));
console.log(`UAS ${result.scorer.uas.toFixed(4)} LAS ${result.scorer.las.toFixed(4)} oracle UAS ${result.oracle.uas.toFixed(4)} LAS ${result.oracle.las.toFixed(4)} skipped ${result.skipped} words ${result.scorer.score.words}`);
const counts = new Map<string, number>();
const fixable = result.errors.filter((e) => e.oracleRight);
console.log(`errors ${result.errors.length}, of which the oracle gets right ${fixable.length}`);
for (const e of fixable) counts.set(`${e.parent} ${e.goldRelation} line ${e.stepLine}`, (counts.get(`${e.parent} ${e.goldRelation} line ${e.stepLine}`) ?? 0) + 1);
for (const [key, n] of [...counts].sort((a, b) => b[1] - a[1]).slice(0, 25)) console.log(String(n).padStart(6), key);
if (process.env.LABELS) for (const [key, n] of [...result.scorer.confusions].sort((a, b) => b[1] - a[1]).slice(0, 25)) console.log(String(n).padStart(6), key);
const show = process.env.SHOW;
if (show) {
  for (const e of fixable.filter((e) => `${e.parent} ${e.goldRelation} line ${e.stepLine}` === show).slice(0, 8)) {
    console.log(`${e.sentence} word ${e.word} "${e.form}" head ${e.head} gold ${e.goldHead}`);
  }
}
