import { diagnose, itemName, type Report } from '../diagnostics/diagnostic.js';
import type { Layout } from '../formats/bracketed/write-bracketed.js';
import { writeXmlSentence, xmlDocumentEnd, xmlDocumentStart } from '../formats/xml-graph/write-xml-graph.js';
import { TreeRewriter } from '../api/rewrite.js';
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
  private readonly rewriter: TreeRewriter;

  constructor(
    private readonly output: Output,
    private readonly format: TreeOutputFormat,
    layout: Layout,
    private readonly report: Report,
  ) {
    this.rewriter = new TreeRewriter({ traces: 'keep', layout }, report);
  }

  /** `*ICH*` traces put in to write discontinuous trees as bracketings. */
  get tracesInserted(): number {
    return this.rewriter.tally.inserted;
  }

  /** Writes a tree; false when it could not be written (and was reported). */
  async write(tree: Tree): Promise<boolean> {
    if (this.format === 'bracketed') {
      const text = this.rewriter.toBrackets(tree);
      if (text === '') return false;
      await this.output.write(text);
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

  /** Text already written as bracketings elsewhere (by worker threads), in order. */
  async writeText(text: string): Promise<void> {
    await this.output.write(text);
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
