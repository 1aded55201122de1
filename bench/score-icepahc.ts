// Development tool: converts the shared IcePaHC trees (CC BY 4.0) and scores them against the gold
// UD version (../shared/corpora/icepahc-ud, CC BY-SA 4.0) on the words its MISC marks as scored:
// UAS, LAS, UPOS and features, beside the oracle, with the commonest errors.
// node dist/bench/score-icepahc.js [HEADS] [LABELS] [POSMAP]   (HALF=odd|even, TRACES=resolve, LABELS=1, UPOS=1, SHOW="…")
import { readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { readBracketedFile } from '../src/formats/bracketed/read-bracketed.js';
import { readConlluFile } from '../src/formats/conllu/read-conllu.js';
import { scoreConversion } from '../src/evaluate/score-conversion.js';
import { loadHeadTable, loadLabelTable } from '../src/tables/load-table.js';
import { loadPosMap } from '../src/tables/load-pos-map.js';
import type { DependencyWord } from '../src/model/dependency.js';

const corpora = process.env.TREEBRIDGE_CORPORA ?? resolve(process.cwd(), '../shared/corpora');
const half = process.env.HALF;
const names = readdirSync(join(corpora, 'icepahc'))
  .filter((n) => n.endsWith('.psd'))
  .map((n) => n.slice(0, -4))
  .sort()
  .filter((_, i) => (half === 'odd' ? i % 2 === 0 : half === 'even' ? i % 2 === 1 : true));
const arg = (i: number, fallback?: string) => (process.argv[i] && process.argv[i] !== '-' ? process.argv[i] : fallback);
const labels = arg(3, 'penn-historical');
const posMap = arg(4, 'penn-historical');
const settings = {
  heads: loadHeadTable(arg(2, 'penn-historical')!),
  labels: labels === 'none' ? undefined : loadLabelTable(labels!),
  upos: posMap === 'none' ? undefined : loadPosMap(posMap!),
  traces: (process.env.TRACES === 'resolve' ? 'resolve' : 'keep') as 'keep' | 'resolve',
  coordination: 'first' as const,
  punctuation: 'phrase' as const,
};
async function* trees() {
  for (const name of names) yield* readBracketedFile(join(corpora, 'icepahc', `${name}.psd`), { splitLemmas: true }, () => undefined);
}
async function* gold() {
  for (const name of names) yield* readConlluFile(join(corpora, 'icepahc-ud', `${name}.conllu`), {}, () => undefined);
}
const unscored = (word: DependencyWord) => /(^|\|)Align=(absorbed|extra)(\||$)/.test(word.misc);
let misaligned = 0;
const result = await scoreConversion(trees(), gold(), settings, (d) => d.code === 'misaligned' && misaligned++, false, undefined, unscored);
const s = result.scorer;
const f = (x: number) => x.toFixed(4);
console.log(`UAS ${f(s.uas)} LAS ${f(s.las)} UPOS ${f(s.upos)} | oracle UAS ${f(result.oracle.uas)} LAS ${f(result.oracle.las)} | words ${s.score.words} sentences ${s.score.sentences} misaligned ${misaligned}`);
console.log(['Case', 'Number', 'Tense', 'Mood', 'VerbForm', 'Degree', 'Definite', 'Gender', 'Person'].map((name) => `${name} ${f(s.feature(name))} (${s.score.features.get(name)?.scored ?? 0})`).join('  '));
const counts = new Map<string, number>();
const fixable = result.errors.filter((e) => e.oracleRight);
console.log(`errors ${result.errors.length}, of which the oracle gets right ${fixable.length}`);
for (const e of fixable) counts.set(`${e.parent} ${e.goldRelation} line ${e.stepLine}`, (counts.get(`${e.parent} ${e.goldRelation} line ${e.stepLine}`) ?? 0) + 1);
for (const [key, n] of [...counts].sort((a, b) => b[1] - a[1]).slice(0, Number(process.env.TOP ?? 25))) console.log(String(n).padStart(6), key);
if (process.env.LABELS) for (const [key, n] of [...s.confusions].sort((a, b) => b[1] - a[1]).slice(0, 40)) console.log(String(n).padStart(6), key);
const show = process.env.SHOW;
if (show) {
  for (const e of fixable.filter((e) => `${e.parent} ${e.goldRelation} line ${e.stepLine}` === show).slice(0, 12)) {
    console.log(`${e.sentence} word ${e.word} "${e.form}" head ${e.head} gold ${e.goldHead}`);
  }
}
