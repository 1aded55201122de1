import type { TreeStructure } from './structure.js';

/** A distribution: value → how many times it occurs. */
export type Distribution = Record<string, number>;

/** Structure figures of a whole corpus; the names are those of `treebridge stats --json`. */
export interface CorpusStructure {
  sentences: number;
  words: number;
  /** Arcs other than root arcs. */
  arcs: number;
  nonProjectiveSentences: number;
  nonProjectiveArcs: number;
  /** Sentences by gap degree. */
  gapDegree: Distribution;
  /** Words of gap degree 1 or more (their yield has a gap), over all sentences. */
  gappedWords: number;
  /** Sentences by edge degree. */
  edgeDegree: Distribution;
  wellNestedSentences: number;
  /** Arcs by length. */
  arcLength: Distribution;
}

/** Adds up the structure of sentence after sentence, holding only counts. */
export class CorpusStructureCounter {
  private readonly totals: CorpusStructure = {
    sentences: 0,
    words: 0,
    arcs: 0,
    nonProjectiveSentences: 0,
    nonProjectiveArcs: 0,
    gapDegree: {},
    gappedWords: 0,
    edgeDegree: {},
    wellNestedSentences: 0,
    arcLength: {},
  };

  add(structure: TreeStructure): void {
    const t = this.totals;
    t.sentences++;
    t.words += structure.words;
    t.arcs += structure.arcs;
    if (structure.nonProjectiveArcs.length > 0) t.nonProjectiveSentences++;
    t.nonProjectiveArcs += structure.nonProjectiveArcs.length;
    count(t.gapDegree, structure.gapDegree);
    t.gappedWords += structure.gappedWords;
    count(t.edgeDegree, structure.edgeDegree);
    if (structure.wellNested) t.wellNestedSentences++;
    for (const length of structure.arcLengths) count(t.arcLength, length);
  }

  /** The totals, distributions in ascending order of value. */
  result(): CorpusStructure {
    const t = this.totals;
    return { ...t, gapDegree: sorted(t.gapDegree), edgeDegree: sorted(t.edgeDegree), arcLength: sorted(t.arcLength) };
  }
}

function count(distribution: Distribution, value: number): void {
  distribution[value] = (distribution[value] ?? 0) + 1;
}

function sorted(distribution: Distribution): Distribution {
  return Object.fromEntries(Object.entries(distribution).sort(([a], [b]) => Number(a) - Number(b)));
}
