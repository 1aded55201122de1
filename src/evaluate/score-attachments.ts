import type { DependencySentence, DependencyWord } from '../model/dependency.js';

/** Attachment scores of predicted sentences against gold ones. */
export interface AttachmentScore {
  /** Sentence pairs scored. */
  sentences: number;
  /** Sentence pairs left out because their words do not line up (reported by the caller). */
  misaligned: number;
  /** Words scored (punctuation left out unless asked). */
  words: number;
  /** Words with the gold head. */
  headsRight: number;
  /** Words with the gold head and the gold relation (universal part, before any colon). */
  labelsRight: number;
  /** Words whose gold UPOS is given, and those whose UPOS matches it (punctuation included, as UPOS covers it). */
  uposScored: number;
  uposRight: number;
  /** Per feature of the gold (Case, Number …): words whose gold has it, and those that have the same value. */
  features: Map<string, { scored: number; right: number }>;
}

/**
 * Forms are the same when equal once the bracket tokens of bracketed corpora
 * (`-LRB-`, `-RSB-` …, also inside words) are read as brackets; the kind of
 * bracket is not compared, as corpora write round ones for all kinds.
 */
export function sameForm(a: string, b: string): boolean {
  const plain = (form: string) =>
    form.replace(/-L[RSC]B-/g, '(').replace(/-R[RSC]B-/g, ')').replace(/[[{]/g, '(').replace(/[\]}]/g, ')');
  return a === b || plain(a) === plain(b);
}

/** A relation's universal part: `obl:tmod` → `obl`. */
export function universalPart(relation: string): string {
  const colon = relation.indexOf(':');
  return colon === -1 ? relation : relation.slice(0, colon);
}

/** Gold punctuation: relation `punct` or UPOS PUNCT. */
export function isPunctuation(word: DependencyWord): boolean {
  return universalPart(word.deprel) === 'punct' || word.upos === 'PUNCT';
}

/**
 * Adds up attachment scores sentence pair by sentence pair. Words line up by
 * position among the syntactic words (multiword-token lines and empty nodes
 * left out); a pair whose words differ in number or form does not line up.
 */
export class AttachmentScorer {
  readonly score: AttachmentScore = { sentences: 0, misaligned: 0, words: 0, headsRight: 0, labelsRight: 0, uposScored: 0, uposRight: 0, features: new Map() };
  /** Words with the right head and the wrong relation, by `gold → ours` (universal parts). */
  readonly confusions = new Map<string, number>();

  constructor(
    private readonly withPunctuation = false,
    /** Gold words not to score (a gold file may mark words it could not align, say). */
    private readonly unscored?: (word: DependencyWord) => boolean,
  ) {}

  /**
   * Scores one pair; returns false (and counts it) when the words do not line
   * up. `paired`: the caller has lined the words up already (by the forms of
   * the source, which the output may have changed: escapes undone, clitic
   * markers taken off), so only their number is checked.
   */
  add(predicted: DependencySentence, gold: DependencySentence, paired = false): boolean {
    const p = predicted.lines.filter((l): l is DependencyWord => l.type === 'word');
    const g = gold.lines.filter((l): l is DependencyWord => l.type === 'word');
    if (p.length !== g.length || (!paired && p.some((word, i) => !sameForm(word.form, g[i]!.form)))) {
      this.score.misaligned++;
      return false;
    }
    this.score.sentences++;
    g.forEach((goldWord, i) => {
      if (this.unscored?.(goldWord)) return;
      const word = p[i]!;
      this.scoreWord(word, goldWord);
      if (!this.withPunctuation && isPunctuation(goldWord)) return;
      this.score.words++;
      if (word.head !== goldWord.head) return;
      this.score.headsRight++;
      if (universalPart(word.deprel) === universalPart(goldWord.deprel)) this.score.labelsRight++;
      else {
        const key = `${universalPart(goldWord.deprel)} → ${universalPart(word.deprel)}`;
        this.confusions.set(key, (this.confusions.get(key) ?? 0) + 1);
      }
    });
    return true;
  }

  /** Adds the counts of another scorer (of the sentences after these), as if it had scored them here. */
  merge(other: { score: AttachmentScore; confusions: Map<string, number> }): void {
    const { features, ...counts } = other.score;
    for (const key of Object.keys(counts) as Array<Exclude<keyof AttachmentScore, 'features'>>) this.score[key] += counts[key];
    for (const [name, tally] of features) {
      const ours = this.score.features.get(name);
      if (ours) {
        ours.scored += tally.scored;
        ours.right += tally.right;
      } else this.score.features.set(name, { ...tally });
    }
    for (const [key, count] of other.confusions) this.confusions.set(key, (this.confusions.get(key) ?? 0) + count);
  }

  /** UPOS and features of one word against its gold. */
  private scoreWord(word: DependencyWord, gold: DependencyWord): void {
    if (gold.upos !== '_') {
      this.score.uposScored++;
      if (word.upos === gold.upos) this.score.uposRight++;
    }
    if (gold.feats === '_') return;
    const ours = featureMap(word.feats);
    for (const [name, value] of featureMap(gold.feats)) {
      let tally = this.score.features.get(name);
      if (!tally) this.score.features.set(name, (tally = { scored: 0, right: 0 }));
      tally.scored++;
      if (ours.get(name) === value) tally.right++;
    }
  }

  get upos(): number {
    return this.score.uposScored === 0 ? 0 : this.score.uposRight / this.score.uposScored;
  }

  /** Accuracy of one feature over the words whose gold has it. */
  feature(name: string): number {
    const tally = this.score.features.get(name);
    return !tally || tally.scored === 0 ? 0 : tally.right / tally.scored;
  }

  get uas(): number {
    return this.score.words === 0 ? 0 : this.score.headsRight / this.score.words;
  }

  get las(): number {
    return this.score.words === 0 ? 0 : this.score.labelsRight / this.score.words;
  }
}

/** FEATS as a map from name to value (`_` gives none). */
export function featureMap(feats: string): ReadonlyMap<string, string> {
  let map = featureMaps.get(feats);
  if (map) return map;
  map = splitFeatures(feats);
  if (featureMaps.size >= 20_000) featureMaps.clear();
  featureMaps.set(feats, map);
  return map;
}

/** The features of FEATS values seen already: scoring reads the same few thousand values again and again. Bounded. */
const featureMaps = new Map<string, Map<string, string>>();

function splitFeatures(feats: string): Map<string, string> {
  const map = new Map<string, string>();
  if (feats === '_' || feats === '') return map;
  for (const pair of feats.split('|')) {
    const equals = pair.indexOf('=');
    if (equals > 0) map.set(pair.slice(0, equals), pair.slice(equals + 1));
  }
  return map;
}
