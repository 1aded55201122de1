import { diagnose, type Report } from '../../diagnostics/diagnostic.js';
import type { DiagnosticCode } from '../../diagnostics/codes.js';
import type { ConstituentNode, Tree, Word } from '../../model/constituency.js';
import { parseLabel } from '../../model/label.js';
import type { LineIndex } from '../../model/line-index.js';
import type { Position } from '../../model/position.js';
import { literalTagTest, readEmptyLeaf, splitLemma, unescapeLeaf } from './leaves.js';
import { LABELLED } from './token-table.js';
import type { TreeBatch } from './split-trees.js';
import type { Assembled, IdentifierNode, TreeAssembler, TreeTokens } from './tree-assembly.js';
import type { ResolvedReadOptions } from './read-options.js';


/** What the builder keeps across the trees of one file. */
export class BuildContext {
  private readonly metaLabels: Set<string>;
  /** First characters of the meta labels, so that most tags are ruled out without hashing them. */
  private readonly metaInitials = new Set<number>();
  readonly wrapperLabels: Set<string>;
  readonly isLiteralTag: (tag: string) => boolean;
  /** A word without a lemma part has been reported; one report per file is enough to show the problem. */
  lemmaWarned = false;

  constructor(
    readonly options: ResolvedReadOptions,
    readonly report: Report,
  ) {
    this.metaLabels = new Set(options.metaLabels);
    for (const label of options.metaLabels) this.metaInitials.add(label.charCodeAt(0));
    this.wrapperLabels = new Set(options.wrapperLabels);
    this.isLiteralTag = literalTagTest(options.literalTags);
  }

  /** True for the labels of brackets that hold notes and markup (`CODE`, `META`). */
  isMetaLabel(label: string): boolean {
    return this.metaInitials.has(label.charCodeAt(0)) && this.metaLabels.has(label);
  }
}

/**
 * Assembles the model of a batch of trees from their brackets, innermost
 * first, as the grammar's actions hand them over; the trees come in the
 * batch's order, each ending with `top`. Every problem that keeps a tree from
 * being read is reported, not just the first; `top` then returns nothing.
 * Problems that do not stop reading are left to the validator.
 */
export class TreeBuilder implements TreeAssembler {
  private failed = false;
  private readonly tokens: TreeTokens;
  private readonly starts: Int32Array;
  private readonly ends: Int32Array;
  /** Which tree of the batch is being assembled, and its text, file offset and lines. */
  private current = 0;
  private treeText = '';
  private base = 0;
  private lines: LineIndex | undefined;

  constructor(
    private readonly batch: TreeBatch,
    private readonly file: string,
    private readonly context: BuildContext,
  ) {
    this.tokens = batch.tokens;
    this.starts = batch.tokens.starts;
    this.ends = batch.tokens.ends;
    this.enter(0);
  }

  private enter(index: number): void {
    const chunk = this.batch.trees[index];
    this.current = index;
    this.failed = false;
    if (!chunk) return;
    this.treeText = chunk.text;
    this.base = chunk.offset;
    this.lines = chunk.lines;
  }

  top(open: number, children: Array<Assembled | number>, close: number): Tree | undefined {
    const tree = this.topOf(open, children, close);
    this.enter(this.current + 1);
    return tree;
  }

  private topOf(open: number, children: Array<Assembled | number>, close: number): Tree | undefined {
    const labelText = this.labelOf(open) ?? '';
    if (!this.context.wrapperLabels.has(labelText)) {
      const node = this.bracket(open, children, close);
      if (node?.type === 'identifier') this.fail('misplaced-id', open, 'an identifier node where a sentence should be');
      return this.failed || node === undefined || node.type === 'identifier' ? undefined : this.tree(open, close, [node]);
    }
    if (labelText === '' && children.length === 0) {
      this.fail('empty-brackets', open, 'empty brackets "()" where a tree should be');
      return undefined;
    }
    const nodes: ConstituentNode[] = [];
    let identifier: IdentifierNode | undefined;
    for (const child of children) {
      if (typeof child === 'number') {
        this.fail('word-outside-preterminal', child, `word "${this.text(child)}" directly under the outer bracket`);
      } else if (child?.type === 'identifier') {
        if (identifier) this.fail('misplaced-id', child.open, `a second ${this.context.options.idLabel} node in one tree`);
        identifier = child;
      } else if (child) {
        nodes.push(child);
      }
    }
    if (!this.failed && nodes.length === 0) {
      const id = identifier ? ` ${this.treeText.slice(identifier.start, identifier.end)}` : '';
      this.fail('empty-tree', open, `tree${id} holds no sentence`);
    }
    if (this.failed) return undefined;
    const tree = this.tree(open, close, nodes);
    tree.wrapper = { label: labelText };
    if (identifier) {
      tree.id = unescapeLeaf(this.treeText.slice(identifier.start, identifier.end));
      tree.idPosition = { start: this.base + identifier.start, end: this.base + identifier.end };
    }
    return tree;
  }

  leaf(token: number): Assembled {
    const tokens = this.tokens;
    const text = this.treeText;
    const tag = text.slice(tokens.tagStarts[token], tokens.tagEnds[token]);
    const wordStart = tokens.wordStarts[token]!;
    const wordEnd = tokens.wordEnds[token]!;
    const word = text.slice(wordStart, wordEnd);
    const position = this.span(token, token);
    if (this.context.isMetaLabel(tag)) return { type: 'meta', label: tag, text: unescapeLeaf(word), children: [], position };

    if (tag === this.context.options.idLabel) return { type: 'identifier', start: wordStart, end: wordEnd, open: token };
    const empty = readEmptyLeaf(word, tag, this.context.isLiteralTag);
    // refIndex is always set, if only to undefined, so that every empty element has one shape.
    if (empty) return { type: 'empty', label: parseLabel(tag), text: word, kind: empty.kind, refIndex: empty.refIndex, position };
    return { type: 'preterminal', pos: tag, word: this.word(word, wordStart, wordEnd), position };
  }

  bracket(open: number, children: Array<Assembled | number>, close: number): Assembled {
    const labelText = this.labelOf(open);
    if (labelText === undefined) {
      if (children.length === 0) this.fail('empty-brackets', open, 'empty brackets "()"');
      else this.fail('empty-label', open, 'bracket without a label inside a tree');
      return undefined;
    }
    if (children.length === 0) {
      this.fail('childless-node', open, `"(${labelText})" has nothing inside`);
      return undefined;
    }
    let words = 0;
    let firstWord = -1;
    for (const child of children) {
      if (typeof child === 'number') {
        if (words === 0) firstWord = child;
        words++;
      }
    }
    if (this.context.isMetaLabel(labelText)) return this.meta(labelText, children, words, firstWord, open, close);
    if (words === children.length) {
      if (labelText === this.context.options.idLabel && words === 1) {
        return { type: 'identifier', start: this.starts[firstWord]!, end: this.ends[firstWord]!, open };
      }
      if (words > 1) {
        this.fail('several-words', children[1] as number, `"${labelText}" holds ${words} words; a tag holds one`, [
          'brackets inside a word must be escaped as \\( and \\)',
        ]);
        return undefined;
      }
      return this.tagged(labelText, firstWord, open, close);
    }
    if (words > 0) {
      this.fail('word-outside-preterminal', firstWord, `word "${this.text(firstWord)}" stands beside brackets under "${labelText}"`, [
        'every word needs its own part-of-speech bracket, as in (N word)',
      ]);
    }
    if (labelText === this.context.options.idLabel) {
      this.fail('misplaced-id', open, `the ${labelText} node must hold exactly one leaf`);
    }
    if (this.failed) return undefined;
    const keepMeta = this.context.options.keepMeta;
    let dropped = 0;
    for (const child of children) {
      const node = child as ConstituentNode | IdentifierNode;
      if (node.type === 'identifier') {
        this.fail('misplaced-id', node.open, `an ${this.context.options.idLabel} node inside a sentence`);
        return undefined;
      }
      if (!keepMeta && node.type === 'meta') dropped++;
    }
    // The grammar's own list becomes the children, unless meta brackets are to be left out.
    const nodes = (dropped === 0 ? children : children.filter((child) => (child as ConstituentNode).type !== 'meta')) as ConstituentNode[];
    if (nodes.length === 0) return undefined;
    return { type: 'phrase', label: parseLabel(labelText), children: nodes, position: this.span(open, close) };
  }

  private tree(open: number, close: number, children: ConstituentNode[]): Tree {
    // Every field is set here, if only to undefined, so that all trees share one shape.
    return {
      type: 'tree',
      wrapper: undefined,
      children,
      id: undefined,
      idPosition: undefined,
      position: this.span(open, close),
      file: this.file,
      number: this.batch.trees[this.current]!.number,
      source: this.lines,
    };
  }

  private tagged(tag: string, token: number, open: number, close: number): ConstituentNode {
    const text = this.text(token);
    const empty = readEmptyLeaf(text, tag, this.context.isLiteralTag);
    if (empty) return { type: 'empty', label: parseLabel(tag), text, kind: empty.kind, refIndex: empty.refIndex, position: this.span(open, close) };
    return { type: 'preterminal', pos: tag, word: this.word(text, this.starts[token]!, this.ends[token]!), position: this.span(open, close) };
  }

  /** A word from its text and its span in the tree's text. */
  private word(text: string, start: number, end: number): Word {
    const position = { start: this.base + start, end: this.base + end };
    if (this.context.options.splitLemmas) {
      const parts = splitLemma(text);
      if (parts) return { type: 'word', form: unescapeLeaf(parts.form), lemma: unescapeLeaf(parts.lemma), position };
      if (!this.context.lemmaWarned) {
        this.context.lemmaWarned = true;
        this.context.report(
          diagnose('missing-lemma', `word "${text}" has no "-lemma" part`, this.at(start), [
            'later words of this file without a lemma are not reported; read without lemma splitting if the file has none',
          ]),
        );
      }
    }
    return { type: 'word', form: unescapeLeaf(text), lemma: undefined, position };
  }

  private meta(
    label: string,
    children: Array<Assembled | number>,
    words: number,
    firstWord: number,
    open: number,
    close: number,
  ): Assembled {
    const position = this.span(open, close);
    if (words === children.length) {
      const text = children.map((token) => unescapeLeaf(this.text(token as number))).join(' ');
      return { type: 'meta', label, text, children: [], position };
    }
    if (words > 0) {
      this.fail('word-outside-preterminal', firstWord, `word "${this.text(firstWord)}" stands beside brackets under "${label}"`);
    }
    if (this.failed) return undefined;
    const nodes: ConstituentNode[] = [];
    for (const child of children) {
      const node = child as ConstituentNode | IdentifierNode;
      if (node.type === 'identifier') {
        this.fail('misplaced-id', node.open, `an ${this.context.options.idLabel} node inside ${label}`);
        return undefined;
      }
      nodes.push(node);
    }
    return { type: 'meta', label, text: undefined, children: nodes, position };
  }

  /** The label carried by an opening-bracket token, if it has one. */
  private labelOf(open: number): string | undefined {
    const tokens = this.tokens;
    if (tokens.kinds.charCodeAt(open) !== LABELLED) return undefined;
    return this.treeText.slice(tokens.tagStarts[open], tokens.tagEnds[open]);
  }

  private text(token: number): string {
    return this.treeText.slice(this.starts[token], this.ends[token]);
  }

  private span(open: number, close: number): Position {
    return { start: this.base + this.starts[open]!, end: this.base + this.ends[close]! };
  }



  private where(token: number) {
    return { ...this.at(this.starts[token]!), end: this.base + this.ends[token]! };
  }

  private at(relative: number) {
    return { file: this.file, offset: this.base + relative, lines: this.lines! };
  }

  private fail(code: DiagnosticCode, token: number, message: string, notes?: string[]): void {
    this.failed = true;
    this.context.report(diagnose(code, message, this.where(token), notes));
  }
}
