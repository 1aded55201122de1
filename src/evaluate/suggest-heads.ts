import type { Report } from '../diagnostics/diagnostic.js';
import type { ConversionSettings } from '../convert/convert-tree.js';
import { findHeads, candidateOf, chooseFrom, type ParentLabel } from '../convert/find-heads.js';
import { headWordOf, phrasesBottomUp, type ConversionNode, type PhraseNode } from '../convert/conversion-tree.js';
import { lateConjunctsOf } from '../convert/attach-late-conjuncts.js';
import { observeRaising, writeRaising, type LearnedRaising, type RaisingObservation } from './learn-raising.js';
import { raisedSubject } from '../convert/attach-dependents.js';
import { emptyTally, pairWithGold, type PairingTally } from './pair-with-gold.js';
import { oracleChooser } from '../convert/oracle-heads.js';
import { prepareTree } from '../convert/prepare-tree.js';
import { headVector } from '../analysis/heads.js';
import type { Tree } from '../model/constituency.js';
import type { DependencySentence, DependencyWord } from '../model/dependency.js';
import type { Candidate } from '../tables/label-pattern.js';
import type { HeadTable } from '../tables/table-model.js';

/** One phrase of the training data: its children and which of them holds the gold head. */
interface Sample {
  /** The phrase's own label (`for` steps of the base table look at it). */
  parent: ParentLabel;
  candidates: Candidate[];
  gold: number;
}

/**
 * One learned step: look from an end for a child with a feature (`NP`,
 * `NP-PRD`, `*-PRD`, or a word test such as `WHNP[form=what]`), only in phrases
 * with a child that has the guard feature, when there is one (`if VBZ[form=is]`).
 */
export interface LearnedStep {
  category: string;
  end: 'left' | 'right';
  guard?: string;
  hits: number;
  misses: number;
}

/** A learned priority list: categories to look for, each from an end, then a last resort. */
export interface LearnedList {
  /**
   * The function tags a phrase's own label must carry for this list to apply
   * (written `for IP-SUB-SPE`); empty: the list for every phrase of the category.
   */
  functions: string[];
  steps: LearnedStep[];
  fallback: 'left' | 'right';
  /** Phrases this list decides. */
  phrases: number;
}

/**
 * A learned block: lists for kinds of phrase that the data shows are headed
 * differently (the most specific first: `IP-SUB-SPE` before `IP-SUB`), then
 * the list for all other phrases of the category.
 */
export interface LearnedBlock {
  category: string;
  lists: LearnedList[];
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
): Promise<{ samples: Map<string, Sample[]>; sentences: number; misaligned: number; late: Map<string, LateConjunctTally>; raising: RaisingObservation[] }> {
  const samples = new Map<string, Sample[]>();
  const late = new Map<string, LateConjunctTally>();
  const observations: RaisingObservation[] = [];
  let sentences = 0;
  for await (const pair of pairWithGold(trees, gold, settings.traces, report, tally)) {
    const prepared = prepareTree(pair.tree, settings.traces);
    const heads = headVector(pair.gold);
    if (!prepared || !heads) continue;
    sentences++;
    const oracle = oracleChooser(heads);
    findHeads(prepared.root, settings.heads, settings.coordination, oracle);
    // A clause whose subject the table raises to the verb above holds its gold head in the subject,
    // yet is headed by its predicate: it teaches nothing about head choice.
    const raising = new Set<ConversionNode>();
    const rule = settings.heads.raising;
    if (rule) {
      for (const node of phrasesBottomUp(prepared.root)) {
        for (const child of node.children) if (child.kind === 'phrase' && raisedSubject(node, child, rule) !== -1) raising.add(child);
      }
    }
    const sampleOf = new Map<PhraseNode, Sample>();
    for (const node of phrasesBottomUp(prepared.root)) {
      // Inner clauses first: their samples are known when the phrase above them is looked at.
      if (!rule) observeRaising(node, heads, observations, sampleOf);
      if (node.coordination || !node.head || node.head.reason.startsWith('coordination') || raising.has(node)) continue;
      const goldChild = oracle(node);
      if (goldChild === undefined || goldChild < 0) continue;
      const candidates = node.children.map(candidateOf);
      const list = samples.get(node.category) ?? [];
      const sample = { parent: { category: node.category, functions: node.functions }, candidates, gold: goldChild };
      list.push(sample);
      sampleOf.set(node, sample);
      samples.set(node.category, list);
      if (!settings.heads.lateConjuncts) tallyLateConjuncts(node, candidates, goldChild, pair.gold, settings.heads, late);
    }
  }
  return { samples, sentences, misaligned: tally.misaligned, late, raising: observations };
}

/** For one category of phrase: how often a child after a coordinator after the head looks like a late conjunct, and how often the gold makes it a `conj` of the head. */
export interface LateConjunctTally {
  seen: number;
  conjuncts: number;
}

/** Counts a phrase's would-be late conjuncts, and those the gold draws as conjuncts of its head word. */
function tallyLateConjuncts(node: PhraseNode, candidates: Candidate[], head: number, gold: DependencySentence, table: HeadTable, late: Map<string, LateConjunctTally>): void {
  const found = lateConjunctsOf(node, candidates, head, table);
  if (!found) return;
  const words = gold.lines.filter((line): line is DependencyWord => line.type === 'word');
  const headIndex = headWordOf(node.children[head]!).index;
  let tally = late.get(node.category);
  if (!tally) late.set(node.category, (tally = { seen: 0, conjuncts: 0 }));
  for (const conjunct of found.conjuncts.slice(1)) {
    const word = words[headWordOf(node.children[conjunct]!).index - 1];
    tally.seen++;
    if (word && Number(word.head) === headIndex && word.deprel.split(':')[0] === 'conj') tally.conjuncts++;
  }
}

/**
 * The categories whose would-be late conjuncts the gold mostly draws as conjuncts (at least
 * `minimumPhrases` of them, more than half), for a `late-conjuncts` line; none when the base has one.
 */
export function suggestLateConjuncts(late: Map<string, LateConjunctTally>, minimumPhrases: number): Array<{ category: string } & LateConjunctTally> {
  return [...late]
    .filter(([, tally]) => tally.seen >= minimumPhrases && tally.conjuncts * 2 > tally.seen)
    .sort((a, b) => b[1].seen - a[1].seen)
    .map(([category, tally]) => ({ category, ...tally }));
}

/** The list of a block that decides a phrase: the first whose function tags its label carries. */
function listFor(lists: readonly LearnedList[], parent: ParentLabel): LearnedList | undefined {
  return lists.find((list) => list.functions.every((tag) => parent.functions.includes(tag)));
}

/** The index a learned list chooses among candidates. */
function predict(list: LearnedList, candidates: Candidate[], isPunctuation: (c: Candidate) => boolean): number {
  for (const step of list.steps) {
    if (step.guard !== undefined && !candidates.some((c) => hasFeature(c, step.guard!))) continue;
    const index = findFrom(candidates, step.category, step.end);
    if (index !== -1) return index;
  }
  return firstContent(candidates, list.fallback, isPunctuation);
}

/** What a learned step can look for: a category (`NP`), a category with a function tag (`NP-PRD`), or a function tag (`*-PRD`). */
function featuresOf(candidate: Candidate): string[] {
  return [candidate.category, ...candidate.functions.flatMap((tag) => [`${candidate.category}-${tag}`, `*-${tag}`])];
}

/** The word test of a child by its head word's form (`VBZ[form=is]`), as a table writes it. */
function wordFeature(candidate: Candidate): string | undefined {
  const form = candidate.headWord?.form.toLowerCase();
  // Forms a pattern cannot hold are never tested.
  if (!form || /[\s[\],=*]/.test(form)) return undefined;
  return `${candidate.category}[form=${form}]`;
}

/**
 * The word tests worth learning in some phrases: the forms that make up a
 * good share of their category there (function words: `is` among VBZ,
 * `what` among WHNP), seen often enough; open-class words never qualify.
 */
function frequentWords(samples: readonly Sample[], support: number): Set<string> {
  const byCategory = new Map<string, number>();
  const byWord = new Map<string, number>();
  for (const sample of samples) {
    for (const candidate of sample.candidates) {
      byCategory.set(candidate.category, (byCategory.get(candidate.category) ?? 0) + 1);
      const word = wordFeature(candidate);
      if (word) byWord.set(word, (byWord.get(word) ?? 0) + 1);
    }
  }
  const words = new Set<string>();
  for (const [word, count] of byWord) {
    const category = word.slice(0, word.indexOf('['));
    if (count >= Math.max(support, 20) && count >= 0.03 * byCategory.get(category)!) words.add(word);
  }
  return words;
}

function hasFeature(candidate: Candidate, feature: string): boolean {
  if (feature === candidate.category) return true;
  if (feature.endsWith(']')) return wordFeature(candidate) === feature;
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
 * Learns a priority list from phrases, greedily: the category (and end) that
 * decides the most remaining phrases rightly, net of those it decides
 * wrongly, goes next; the phrases it decides leave the pool.
 */
function learnList(samples: Sample[], functions: string[], table: HeadTable, minimumSupport: number): LearnedList {
  const punctuation = table.punctuation;
  let pool = samples;
  const steps: LearnedStep[] = [];
  const words = frequentWords(samples, minimumSupport);
  for (;;) {
    // Counts of right and wrong choices per step (feature, and guard after a tab), per end.
    const counts = new Map<string, { left: [number, number]; right: [number, number] }>();
    for (const sample of pool) {
      const features = new Set<string>();
      const guards: Array<string | undefined> = [undefined];
      for (const candidate of sample.candidates) {
        if (punctuation(candidate)) continue;
        for (const feature of featuresOf(candidate)) features.add(feature);
        const word = wordFeature(candidate);
        if (word && words.has(word)) {
          features.add(word);
          if (!guards.includes(word)) guards.push(word);
        }
      }
      for (const feature of features) {
        const chosen = { left: findFrom(sample.candidates, feature, 'left'), right: findFrom(sample.candidates, feature, 'right') };
        for (const guard of guards) {
          if (guard === feature) continue;
          const key = guard === undefined ? feature : `${feature}\t${guard}`;
          const entry = counts.get(key) ?? { left: [0, 0], right: [0, 0] };
          for (const end of ['left', 'right'] as const) entry[end][chosen[end] === sample.gold ? 0 : 1]++;
          counts.set(key, entry);
        }
      }
    }
    // The most precise step with enough support goes next: a rarer but surer sign (a copula's
    // predicate) must come before a commoner, less sure one (any verb). A guarded step must be
    // surer than the same step without its guard.
    const support = Math.max(minimumSupport, Math.ceil(pool.length * 0.002));
    let best: LearnedStep | undefined;
    const precision = (x: { hits: number; misses: number }) => x.hits / (x.hits + x.misses);
    for (const [key, entry] of counts) {
      const [category, guard] = key.split('\t') as [string, string | undefined];
      for (const end of ['left', 'right'] as const) {
        const [hits, misses] = entry[end];
        // A step that tests words must be borne out by more phrases than one that tests labels.
        const needed = category.endsWith(']') ? Math.max(support, 30, Math.ceil(pool.length * 0.003)) : support;
        if (hits < needed || hits <= misses) continue;
        const candidate: LearnedStep = guard === undefined ? { category, end, hits, misses } : { category, end, guard, hits, misses };
        if (guard !== undefined) {
          const plain = counts.get(category)![end];
          if (precision(candidate) <= precision({ hits: plain[0], misses: plain[1] }) + 0.05) continue;
        }
        if (!best || precision(candidate) > precision(best) || (precision(candidate) === precision(best) && hits > best.hits)) best = candidate;
      }
    }
    if (!best) break;
    steps.push(best);
    const decided = best;
    pool = pool.filter(
      (sample) =>
        !(sample.candidates.some((c) => hasFeature(c, decided.category)) && (decided.guard === undefined || sample.candidates.some((c) => hasFeature(c, decided.guard!)))),
    );
  }
  const leftRight = (end: 'left' | 'right') => pool.filter((s) => firstContent(s.candidates, end, punctuation) === s.gold).length;
  return { functions, steps, fallback: leftRight('left') >= leftRight('right') ? 'left' : 'right', phrases: samples.length };
}

/** Phrases a list decides rightly. */
function rightBy(list: LearnedList, samples: readonly Sample[], table: HeadTable): number {
  return samples.filter((sample) => predict(list, sample.candidates, table.punctuation) === sample.gold).length;
}

/**
 * Learns the block of one parent category. Where the phrases of one kind
 * (the same function tags on their own label: IP-SUB, IP-MAT-SPE) are headed
 * differently from the rest, that kind gets a list of its own, tried first,
 * when it has enough phrases and its own list decides clearly more of them
 * rightly than the list learned on all phrases; then the list for the rest.
 */
export function learnBlock(category: string, samples: Sample[], table: HeadTable, minimumSupport = 3): LearnedBlock {
  const general = learnList(samples, [], table, minimumSupport);
  const kinds = new Map<string, Sample[]>();
  for (const sample of samples) {
    if (sample.parent.functions.length === 0) continue;
    const key = [...new Set(sample.parent.functions)].sort().join('-');
    const list = kinds.get(key) ?? [];
    list.push(sample);
    kinds.set(key, list);
  }
  const enough = Math.max(100, Math.ceil(samples.length * 0.01));
  // The most specific kinds first (most tags), then the commonest; a phrase goes to the first kind its label carries.
  const candidates = [...kinds]
    .filter(([, list]) => list.length >= enough)
    .map(([key]) => key.split('-'))
    .sort((a, b) => b.length - a.length || (kinds.get(b.join('-'))!.length - kinds.get(a.join('-'))!.length));
  const lists: LearnedList[] = [];
  let rest = samples;
  for (const functions of candidates.slice(0, 8)) {
    const own = rest.filter((sample) => functions.every((tag) => sample.parent.functions.includes(tag)));
    if (own.length < enough) continue;
    const list = learnList(own, functions, table, minimumSupport);
    if (rightBy(list, own, table) - rightBy(general, own, table) < Math.max(10, own.length * 0.02)) continue;
    lists.push(list);
    const taken = new Set(own);
    rest = rest.filter((sample) => !taken.has(sample));
  }
  lists.push(lists.length === 0 ? general : learnList(rest, [], table, minimumSupport));
  const block: LearnedBlock = { category, lists, phrases: samples.length, baseRight: 0, learnedRight: 0 };
  for (const sample of samples) {
    if (chooseFrom(sample.candidates, sample.parent, table).child === sample.gold) block.baseRight++;
    if (predict(listFor(lists, sample.parent)!, sample.candidates, table.punctuation) === sample.gold) block.learnedRight++;
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
 * The steps of a learned list as a table writes them, merged where that
 * changes nothing: consecutive steps for one feature from one end under
 * different guards make one step with all the guards (`if VBZ[form=is]
 * VBD[form=was]`); then consecutive steps from one end under the same guards
 * make one `each` step; word tests of one category join (`VBZ[form=is,'s]`).
 */
export function writtenSteps(steps: readonly LearnedStep[]): string[] {
  const byFeature: Array<{ category: string; end: string; guards: string[] }> = [];
  for (const step of steps) {
    const last = byFeature[byFeature.length - 1];
    if (last && last.category === step.category && last.end === step.end && last.guards.length > 0 && step.guard !== undefined) last.guards.push(step.guard);
    else byFeature.push({ category: step.category, end: step.end, guards: step.guard === undefined ? [] : [step.guard] });
  }
  const written: string[] = [];
  let current: { end: string; guards: string; categories: string[] } | undefined;
  const flush = () => current && written.push(`${current.end} each ${joinWordTests(current.categories).join(' ')}${current.guards ? ` if ${current.guards}` : ''}`);
  for (const step of byFeature) {
    const guards = joinWordTests(step.guards).join(' ');
    if (current && current.end === step.end && current.guards === guards) current.categories.push(step.category);
    else {
      flush();
      current = { end: step.end, guards, categories: [step.category] };
    }
  }
  flush();
  return written;
}

/** Joins consecutive word tests of one category: `VBZ[form=is]`, `VBZ[form='s]` → `VBZ[form=is,'s]`. */
function joinWordTests(patterns: readonly string[]): string[] {
  const joined: string[] = [];
  for (const pattern of patterns) {
    const previous = joined[joined.length - 1];
    const open = pattern.indexOf('[form=');
    if (previous && open > 0 && previous.startsWith(pattern.slice(0, open + 6)) && previous.endsWith(']')) {
      joined[joined.length - 1] = `${previous.slice(0, -1)},${pattern.slice(open + 6)}`;
    } else joined.push(pattern);
  }
  return joined;
}

/**
 * Writes the suggestion as a table that builds on the base and replaces the
 * changed blocks. `base` is how the new table names its base (a shipped name,
 * or a path from the new table's folder). When the new table replaces its own
 * base file, it cannot build on itself: `inlineBase` then holds the base's text,
 * which the new table repeats (its own `table` line left out) before the
 * changed blocks, which replace the base's blocks of the same categories.
 */
export function writeSuggestedTable(
  name: string,
  base: string,
  sentences: number,
  changed: LearnedBlock[],
  kept: LearnedBlock[],
  inlineBase?: string,
  late: ReadonlyArray<{ category: string } & LateConjunctTally> = [],
  raising?: LearnedRaising,
): string {
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
  if (raising) lines.push(...writeRaising(raising), '');
  if (late.length > 0) {
    const support = late.map((l) => `${l.category} ${share(l.conjuncts, l.seen)} of ${l.seen.toLocaleString('en-US')}`).join(', ');
    lines.push(`# A child of the phrase's own category after a coordinator after the head is mostly a`, `# conjunct of the head in the gold (${support}): restructuring step attach-late-conjuncts.`);
    lines.push(`late-conjuncts ${late.map((l) => l.category).join(' ')}`, '');
  }
  for (const block of changed) {
    lines.push(`# ${block.category}: ${block.phrases.toLocaleString('en-US')} phrases; ${base} right in ${share(block.baseRight, block.phrases)}, this block in ${share(block.learnedRight, block.phrases)}.`);
    lines.push(`head ${block.category}`);
    for (const list of block.lists) {
      const kind = list.functions.length === 0 ? '' : ` for ${block.category}-${list.functions.join('-')}`;
      if (block.lists.length > 1) {
        const which = list.functions.length === 0 ? 'the other phrases' : `${block.category}-${list.functions.join('-')}`;
        lines.push(`  # ${which}: ${list.phrases.toLocaleString('en-US')} phrases`);
      }
      for (const step of writtenSteps(list.steps)) lines.push(`  ${step}${kind}`);
      lines.push(`  ${list.fallback} first${kind}`);
    }
    lines.push('');
  }
  return lines.join('\n');
}

