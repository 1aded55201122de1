import { diagnose, diagnoseItem, itemName, type Report } from '../diagnostics/diagnostic.js';
import { unwritableReason, type Layout } from '../formats/bracketed/write-bracketed.js';
import type { Tree } from '../model/constituency.js';
import { LineIndex } from '../model/line-index.js';
import { insertTraces } from '../traces/insert-traces.js';
import { resolveTraces } from '../traces/resolve-traces.js';
import { writeTree } from '../traces/write-tree.js';
import type { TraceMode } from '../convert/prepare-tree.js';

/** What became of the trees of a rewrite: read = written + skipped; traces moved and put in. */
export interface RewriteTally {
  read: number;
  written: number;
  /** Antecedents moved to their traces (`traces: 'resolve'`), and further traces of one left as they were. */
  moved: number;
  leftover: number;
  /** `*ICH*` traces put in to write discontinuous trees as bracketings. */
  inserted: number;
}

export function emptyRewriteTally(): RewriteTally {
  return { read: 0, written: 0, moved: 0, leftover: 0, inserted: 0 };
}

/**
 * Writes trees again as bracketings, one at a time, as `treebridge rewrite`
 * does: traces resolved first when asked, discontinuous trees made
 * continuous with *ICH* traces, a tree a bracketing cannot hold reported and
 * left out, secondary edges reported as left out.
 */
export class TreeRewriter {
  constructor(
    private readonly options: { traces: TraceMode; layout: Layout },
    private readonly report: Report = () => undefined,
    readonly tally: RewriteTally = emptyRewriteTally(),
  ) {}

  /** The tree after trace resolution, when asked for; counts what moved. */
  resolve(tree: Tree): Tree {
    this.tally.read++;
    if (this.options.traces !== 'resolve') return tree;
    const resolution = resolveTraces(tree);
    this.tally.moved += resolution.moved;
    this.tally.leftover += resolution.leftover;
    return resolution.tree;
  }

  /** A resolved tree as a bracketing, or '' when it cannot be written (and was reported). */
  toBrackets(tree: Tree): string {
    if (tree.secondaryEdges && tree.secondaryEdges.length > 0) reportSecondaryEdges(tree, 'bracketing', this.report);
    const mended = insertTraces(tree);
    // A label or word a bracketing cannot hold would read back as other words: the tree is reported instead.
    const reason = unwritableReason(mended.tree);
    if (reason) {
      this.report(diagnoseItem('unwritable-tree', `tree ${itemName(tree)} cannot be written as a bracketing: ${reason}`, tree));
      return '';
    }
    this.tally.inserted += mended.traces;
    this.tally.written++;
    return writeTree(mended.tree, { layout: this.options.layout });
  }

  /** Both steps: a tree read to its bracketing. */
  rewrite(tree: Tree): string {
    return this.toBrackets(this.resolve(tree));
  }
}

/** A bracketing or a basic dependency tree has no place for secondary edges: each sentence that has some says how many are left out. */
export function reportSecondaryEdges(tree: Tree, into: string, report: Report): void {
  const edges = tree.secondaryEdges!;
  const lines = tree.source ?? new LineIndex('', { offset: 0, line: 1, column: 1 });
  const labels = [...new Set(edges.map((edge) => edge.label))].join(', ');
  const offset = edges[0]!.position?.start ?? tree.position?.start ?? 0;
  report(diagnose('secondary-edges-dropped', `sentence ${itemName(tree)}: ${edges.length} secondary edge${edges.length === 1 ? '' : 's'} (${labels}) left out of the ${into}`, { file: tree.file ?? '-', offset, lines }));
}
