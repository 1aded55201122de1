import { diagnose, diagnoseItem, itemName, type Report } from '../diagnostics/diagnostic.js';
import { unwritableReason, type Layout } from '../formats/bracketed/write-bracketed.js';
import { writeTree } from '../traces/write-tree.js';
import { writeXmlSentence, xmlDocumentEnd, xmlDocumentStart } from '../formats/xml-graph/write-xml-graph.js';
import { insertTraces } from '../traces/insert-traces.js';
import type { Tree } from '../model/constituency.js';
import { LineIndex } from '../model/line-index.js';
import type { Output } from './io.js';

/** The formats constituency trees are written in. */
export type TreeOutputFormat = 'bracketed' | 'xml';

/** `--to` when given, else by the output file's extension (`.xml`), else bracketed. */
export function treeOutputFormat(to: unknown, path: unknown): TreeOutputFormat {
  if (to === 'bracketed' || to === 'xml') return to;
  return typeof path === 'string' && /\.xml$/i.test(path) ? 'xml' : 'bracketed';
}

/**
 * Writes trees one at a time in either format: a bracketing (discontinuous
 * trees made continuous with *ICH* traces), or sentences of one XML graph
 * document, opened before the first and closed by {@link finish}. A tree the
 * format cannot hold (a character XML forbids) is reported, not written.
 */
export class TreeSink {
  private count = 0;
  private opened = false;
  /** `*ICH*` traces put in to write discontinuous trees as bracketings. */
  tracesInserted = 0;

  constructor(
    private readonly output: Output,
    private readonly format: TreeOutputFormat,
    private readonly layout: Layout,
    private readonly report: Report,
  ) {}

  /** Writes a tree; false when it could not be written (and was reported). */
  async write(tree: Tree): Promise<boolean> {
    if (this.format === 'bracketed') {
      if (tree.secondaryEdges && tree.secondaryEdges.length > 0) reportSecondaryEdges(tree, 'bracketing', this.report);
      const mended = insertTraces(tree);
      // A label or word a bracketing cannot hold would read back as other words: the tree is reported instead.
      const reason = unwritableReason(mended.tree);
      if (reason) {
        this.report(diagnoseItem('unwritable-tree', `tree ${itemName(tree)} cannot be written as a bracketing: ${reason}`, tree));
        return false;
      }
      this.tracesInserted += mended.traces;
      await this.output.write(writeTree(mended.tree, { layout: this.layout }));
      return true;
    }
    await this.open();
    let text: string;
    try {
      text = writeXmlSentence(tree, this.count + 1);
    } catch (error) {
      const lines = tree.source ?? new LineIndex('', { offset: 0, line: 1, column: 1 });
      const reason = error instanceof Error ? error.message.split('\n')[0] : String(error);
      this.report(diagnose('unwritable-tree', `tree ${itemName(tree)} cannot be written as XML: ${reason}`, { file: tree.file ?? '-', offset: tree.position?.start ?? 0, lines }));
      return false;
    }
    this.count++;
    await this.output.write(text);
    return true;
  }

  /** Closes the XML document (an empty one when no tree came). */
  async finish(): Promise<void> {
    if (this.format !== 'xml') return;
    await this.open();
    await this.output.write(xmlDocumentEnd());
  }

  private async open(): Promise<void> {
    if (this.opened) return;
    this.opened = true;
    await this.output.write(xmlDocumentStart());
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
