import type { Report } from '../diagnostics/diagnostic.js';
import type { ConversionSettings } from '../convert/convert-tree.js';
import { findHeads, candidateOf, chooseFrom, type ParentLabel } from '../convert/find-heads.js';
import { phrasesBottomUp } from '../convert/conversion-tree.js';
import { emptyTally, pairWithGold, type PairingTally } from './pair-with-gold.js';
import { oracleChooser } from '../convert/oracle-heads.js';
import { prepareTree } from '../convert/prepare-tree.js';
import { headVector } from '../analysis/heads.js';
import type { Tree } from '../model/constituency.js';
import type { DependencySentence } from '../model/dependency.js';
import type { Candidate } from '../tables/label-pattern.js';
import type { HeadTable } from '../tables/table-model.js';

/** One phrase of the training data: its children and which of them holds the gold head. */
interface Sample {
  /** The phrase's own label (`for` steps of the base table look at it). */
  parent: ParentLabel;
  candidates: Candidate[];
  gold: number;
}

/** A learned block: categories to look for, each from an end, then a last resort. */
export interface LearnedBlock {
  category: string;
  steps: Array<{ category: string; end: 'left' | 'right'; hits: number; misses: number }>;
  fallback: 'left' | 'right';
  phrases: number;
  /** Phrases whose gold head child the base table chooses, and the learned block. */
  baseRight: number;
  learnedRight: number;
}

/** How much better a block must be, and on how many phrases, before it replaces the base table's. */
export interface SuggestOptions {
  minimumPhrases: number;
  minimumGain: number;
}

/**
 * Collects, for every phrase of the trees whose words line up with gold
 * sentences, which child holds the gold head (with the heads below it taken
 * from the gold too). Coordinated phrases are left out: their head follows the
 * coordination style, not the table.
 */
export async function collectPhrases(
  trees: AsyncIterable<Tree>,
  gold: AsyncIterable<DependencySentence>,
  settings: ConversionSettings,
  report: Report = () => undefined,
  tally: PairingTally = emptyTally(),
): Promise<{ samples: Map<string, Sample[]>; sentences: number; misaligned: number }> {
  const samples = new Map<string, Sample[]>();
  let sentences = 0;
  for await (const pair of pairWithGold(trees, gold, settings.traces, report, tally)) {
    const prepared = prepareTree(pair.tree, settings.traces);
    const heads = headVector(pair.gold);
    if (!prepared || !heads) continue;
    sentences++;
    const oracle = oracleChooser(heads);
    findHeads(prepared.root, settings.heads, settings.coordination, oracle);
    for (const node of phrasesBottomUp(prepared.root)) {
      if (node.coordination || !node.head || node.head.reason.startsWith('coordination')) continue;
      const goldChild = oracle(node);
      if (goldChild === undefined || goldChild < 0) continue;
      const list = samples.get(node.category) ?? [];
      list.push({ parent: { category: node.category, functions: node.functions }, candidates: node.children.map(candidateOf), gold: goldChild });
      samples.set(node.category, list);
    }
  }
  return { samples, sentences, misaligned: tally.misaligned };
}

/** The index a learned block chooses among candidates. */
function predict(block: LearnedBlock, candidates: Candidate[], isPunctuation: (c: Candidate) => boolean): number {
  for (const step of block.steps) {
    const index = findFrom(candidates, step.category, step.end);
    if (index !== -1) return index;
  }
  return firstContent(candidates, block.fallback, isPunctuation);
}

/** What a learned step can look for: a category (`NP`), a category with a function tag (`NP-PRD`), or a function tag (`*-PRD`). */
function featuresOf(candidate: Candidate): string[] {
  return [candidate.category, ...candidate.functions.flatMap((tag) => [`${candidate.category}-${tag}`, `*-${tag}`])];
}

function hasFeature(candidate: Candidate, feature: string): boolean {
  if (feature === candidate.category) return true;
  if (feature.startsWith('*-')) return candidate.functions.includes(feature.slice(2));
  return candidate.functions.some((tag) => feature === `${candidate.category}-${tag}`);
}

function findFrom(candidates: Candidate[], feature: string, end: 'left' | 'right'): number {
  const n = candidates.length;
  for (let k = 0; k < n; k++) {
    const i = end === 'left' ? k : n - 1 - k;
    if (hasFeature(candidates[i]!, feature)) return i;
  }
  return -1;
}

function firstContent(candidates: Candidate[], end: 'left' | 'right', isPunctuation: (c: Candidate) => boolean): number {
  const n = candidates.length;
  for (let k = 0; k < n; k++) {
    const i = end === 'left' ? k : n - 1 - k;
    if (!isPunctuation(candidates[i]!)) return i;
  }
  return end === 'left' ? 0 : n - 1;
}

/**
 * Learns a priority list for one parent category, greedily: the category
 * (and end) that decides the most remaining phrases rightly, net of those it
 * decides wrongly, goes next; the phrases it decides leave the pool.
 */
export function learnBlock(category: string, samples: Sample[], table: HeadTable, minimumSupport = 3): LearnedBlock {
  const punctuation = table.punctuation;
  let pool = samples;
  const steps: LearnedBlock['steps'] = [];
  for (;;) {
    const counts = new Map<string, { left: [number, number]; right: [number, number] }>();
    for (const sample of pool) {
      const seen = new Set<string>();
      for (const candidate of sample.candidates) {
        if (punctuation(candidate)) continue;
        for (const feature of featuresOf(candidate)) {
          if (seen.has(feature)) continue;
          seen.add(feature);
          const entry = counts.get(feature) ?? { left: [0, 0], right: [0, 0] };
          for (const end of ['left', 'right'] as const) {
            const chosen = findFrom(sample.candidates, feature, end);
            entry[end][chosen === sample.gold ? 0 : 1]++;
          }
          counts.set(feature, entry);
        }
      }
    }
    // The most precise feature with enough support goes next: a rarer but surer sign (a copula's
    // predicate) must come before a commoner, less sure one (any verb).
    const support = Math.max(minimumSupport, Math.ceil(pool.length * 0.002));
    let best: { category: string; end: 'left' | 'right'; hits: number; misses: number } | undefined;
    const precision = (x: { hits: number; misses: number }) => x.hits / (x.hits + x.misses);
    for (const [name, entry] of counts) {
      for (const end of ['left', 'right'] as const) {
        const [hits, misses] = entry[end];
        if (hits < support || hits <= misses) continue;
        const candidate = { category: name, end, hits, misses };
        if (!best || precision(candidate) > precision(best) || (precision(candidate) === precision(best) && hits > best.hits)) best = candidate;
      }
    }
    if (!best) break;
    steps.push(best);
    pool = pool.filter((sample) => !sample.candidates.some((c) => hasFeature(c, best!.category)));
  }
  const leftRight = (end: 'left' | 'right') => pool.filter((s) => firstContent(s.candidates, end, punctuation) === s.gold).length;
  const block: LearnedBlock = { category, steps, fallback: leftRight('left') >= leftRight('right') ? 'left' : 'right', phrases: samples.length, baseRight: 0, learnedRight: 0 };
  for (const sample of samples) {
    if (chooseFrom(sample.candidates, sample.parent, table).child === sample.gold) block.baseRight++;
    if (predict(block, sample.candidates, punctuation) === sample.gold) block.learnedRight++;
  }
  return block;
}

/** The blocks that beat the base table by enough, most phrases first. */
export function suggestBlocks(samples: Map<string, Sample[]>, table: HeadTable, options: SuggestOptions): { changed: LearnedBlock[]; kept: LearnedBlock[] } {
  const changed: LearnedBlock[] = [];
  const kept: LearnedBlock[] = [];
  for (const [category, list] of [...samples].sort((a, b) => b[1].length - a[1].length)) {
    if (category === '') continue;
    const block = learnBlock(category, list, table);
    const gain = (block.learnedRight - block.baseRight) / block.phrases;
    if (block.phrases >= options.minimumPhrases && gain >= options.minimumGain) changed.push(block);
    else kept.push(block);
  }
  return { changed, kept };
}

/**
 * Writes the suggestion as a table that builds on the base and replaces the
 * changed blocks. `base` is how the new table names its base (a shipped name,
 * or a path from the new table's folder). When the new table replaces its own
 * base file, it cannot build on itself: `inlineBase` then holds the base's text,
 * which the new table repeats (its own `table` line left out) before the
 * changed blocks, which replace the base's blocks of the same categories.
 */
export function writeSuggestedTable(name: string, base: string, sentences: number, changed: LearnedBlock[], kept: LearnedBlock[], inlineBase?: string): string {
  const share = (n: number, of: number) => `${n.toLocaleString('en-US')} (${((100 * n) / of).toFixed(1)}%)`;
  const lines = [
    `# ${name}: suggested by treebridge heads suggest from ${sentences.toLocaleString('en-US')} sentences with gold`,
    `# dependencies, building on ${base}. Each block below replaces the base table's block for its`,
    `# categories; its comment gives its support: of the phrases of that category in the data, how`,
    `# many the base table headed by the child holding the gold head, and how many this block does.`,
    `# Review and edit it like any table: the steps are a starting point, not a verdict.`,
  ];
  if (kept.length > 0) {
    lines.push('#', `# Kept from ${base} (too few phrases, or no clear gain):`);
    for (const block of kept.slice(0, 40)) lines.push(`#   ${block.category}: ${block.phrases} phrases, base right in ${share(block.baseRight, block.phrases)}`);
  }
  if (inlineBase === undefined) lines.push('', `table ${name}`, `builds-on ${base}`, '');
  else {
    lines.push('', `table ${name}`, '', `# The base table, as it was (this file replaces it):`);
    for (const line of inlineBase.split('\n')) if (!/^\s*table\s/.test(line)) lines.push(line);
    lines.push('', '# The learned blocks, replacing those above for their categories:', '');
  }
  for (const block of changed) {
    lines.push(`# ${block.category}: ${block.phrases.toLocaleString('en-US')} phrases; ${base} right in ${share(block.baseRight, block.phrases)}, this block in ${share(block.learnedRight, block.phrases)}.`);
    lines.push(`head ${block.category}`);
    // Consecutive categories looked for from the same end make one step.
    let current: { end: string; categories: string[] } | undefined;
    const flush = () => current && lines.push(`  ${current.end} each ${current.categories.join(' ')}`);
    for (const step of block.steps) {
      if (current && current.end === step.end) current.categories.push(step.category);
      else {
        flush();
        current = { end: step.end, categories: [step.category] };
      }
    }
    flush();
    lines.push(`  ${block.fallback} first`, '');
  }
  return lines.join('\n');
}

