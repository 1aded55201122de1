import { diagnose, type Report } from '../../diagnostics/diagnostic.js';
import type { DiagnosticCode } from '../../diagnostics/codes.js';
import type { ConstituentNode, Tree, Word } from '../../model/constituency.js';
import { parseLabel } from '../../model/label.js';
import type { LineIndex } from '../../model/line-index.js';
import type { Position } from '../../model/position.js';
import { literalTagTest, readEmptyLeaf, splitLemma, unescapeLeaf } from './leaves.js';
import type { RawBracket, TreeTokens } from './raw-syntax.js';
import type { ResolvedReadOptions } from './read-options.js';

/** One tree's text as the reader cut it: where it stands in its file, and its tokens. */
export interface TreeSource {
  file: string;
  /** The tree's text, from its opening to its closing bracket. */
  text: string;
  /** File offset of the text's first character. */
  offset: number;
  lines: LineIndex;
  tokens: TreeTokens;
}

/** What the builder keeps across the trees of one file. */
export class BuildContext {
  readonly metaLabels: Set<string>;
  readonly wrapperLabels: Set<string>;
  readonly isLiteralTag: (tag: string) => boolean;
  /** A word without a lemma part has been reported; one report per file is enough to show the problem. */
  lemmaWarned = false;

  constructor(
    readonly options: ResolvedReadOptions,
    readonly report: Report,
  ) {
    this.metaLabels = new Set(options.metaLabels);
    this.wrapperLabels = new Set(options.wrapperLabels);
    this.isLiteralTag = literalTagTest(options.literalTags);
  }
}

/**
 * Turns one raw top-level bracket into a {@link Tree}. Every problem that keeps
 * the tree from being read is reported, not just the first; the tree is then
 * not returned. Problems that do not stop reading are left to the validator.
 */
export function buildTree(raw: RawBracket, source: TreeSource, context: BuildContext): Tree | undefined {
  return new TreeBuilder(source, context).build(raw);
}

class TreeBuilder {
  private failed = false;
  private readonly starts: Int32Array;
  private readonly ends: Int32Array;
  private readonly base: number;

  constructor(
    private readonly source: TreeSource,
    private readonly context: BuildContext,
  ) {
    this.starts = source.tokens.starts;
    this.ends = source.tokens.ends;
    this.base = source.offset;
  }

  build(raw: RawBracket): Tree | undefined {
    const tree: Tree = {
      type: 'tree',
      children: [],
      position: this.span(raw),
      file: this.source.file,
      source: this.source.lines,
    };
    const options = this.context.options;
    const label = raw.label === null ? '' : this.text(raw.label);
    if (raw.label === null && raw.children.length === 0) {
      this.fail('empty-brackets', this.starts[raw.open]!, 'empty brackets "()" where a tree should be');
      return undefined;
    }
    if (this.context.wrapperLabels.has(label)) {
      tree.wrapper = { label };
      for (const child of raw.children) {
        if (typeof child === 'number') {
          this.fail('word-outside-preterminal', this.starts[child]!, `word "${this.text(child)}" directly under the outer bracket`);
        } else if (child.label !== null && this.text(child.label) === options.idLabel) {
          this.readId(child, tree);
        } else {
          const node = this.node(child);
          if (node) tree.children.push(node);
        }
      }
      if (!this.failed && tree.children.length === 0) {
        this.fail('empty-tree', this.starts[raw.open]!, tree.id ? `tree ${tree.id} holds no sentence` : 'outer bracket holds no sentence');
      }
    } else {
      const node = this.node(raw);
      if (node) tree.children.push(node);
    }
    return this.failed ? undefined : tree;
  }

  private readId(raw: RawBracket, tree: Tree): void {
    const idLabel = this.context.options.idLabel;
    const only = raw.children[0];
    if (raw.children.length !== 1 || typeof only !== 'number') {
      this.fail('misplaced-id', this.starts[raw.open]!, `the ${idLabel} node must hold exactly one leaf`);
      return;
    }
    if (tree.id !== undefined) {
      this.fail('misplaced-id', this.starts[raw.open]!, `a second ${idLabel} node in one tree`);
      return;
    }
    tree.id = unescapeLeaf(this.text(only));
    tree.idPosition = this.tokenSpan(only);
  }

  private node(raw: RawBracket): ConstituentNode | undefined {
    const children = raw.children;
    if (raw.label === null) {
      if (children.length === 0) this.fail('empty-brackets', this.starts[raw.open]!, 'empty brackets "()"');
      else this.fail('empty-label', this.starts[raw.open]!, 'bracket without a label inside a tree');
      for (const child of children) if (typeof child !== 'number') this.node(child);
      return undefined;
    }
    const label = this.text(raw.label);
    if (children.length === 0) {
      this.fail('childless-node', this.starts[raw.open]!, `"(${label})" has nothing inside`);
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
    if (this.context.metaLabels.has(label)) return this.meta(raw, label, words, firstWord);
    if (words === children.length) {
      if (words > 1) {
        this.fail('several-words', this.starts[children[1] as number]!, `"${label}" holds ${words} words; a tag holds one`, [
          'brackets inside a word must be escaped as \\( and \\)',
        ]);
        return undefined;
      }
      return this.leafNode(raw, label, firstWord);
    }
    if (words > 0) {
      this.fail('word-outside-preterminal', this.starts[firstWord]!, `word "${this.text(firstWord)}" stands beside brackets under "${label}"`, [
        'every word needs its own part-of-speech bracket, as in (N word)',
      ]);
    }
    const built: ConstituentNode[] = [];
    const keepMeta = this.context.options.keepMeta;
    for (const child of children) {
      if (typeof child === 'number') continue;
      const node = this.node(child);
      if (node && (keepMeta || node.type !== 'meta')) built.push(node);
    }
    if (built.length === 0) return undefined;
    return { type: 'phrase', label: parseLabel(label), children: built, position: this.span(raw) };
  }

  private leafNode(raw: RawBracket, tag: string, token: number): ConstituentNode {
    const text = this.text(token);
    const empty = readEmptyLeaf(text, tag, this.context.isLiteralTag);
    if (empty) {
      const node: ConstituentNode = { type: 'empty', label: parseLabel(tag), text, kind: empty.kind, position: this.span(raw) };
      if (empty.refIndex !== undefined) node.refIndex = empty.refIndex;
      return node;
    }
    return { type: 'preterminal', pos: tag, word: this.word(token, text), position: this.span(raw) };
  }

  private word(token: number, text: string): Word {
    const position = this.tokenSpan(token);
    if (this.context.options.splitLemmas) {
      const parts = splitLemma(text);
      if (parts) return { type: 'word', form: unescapeLeaf(parts.form), lemma: unescapeLeaf(parts.lemma), position };
      if (!this.context.lemmaWarned) {
        this.context.lemmaWarned = true;
        this.context.report(
          diagnose('missing-lemma', `word "${text}" has no "-lemma" part`, this.where(this.starts[token]!), [
            'later words of this file without a lemma are not reported; read without lemma splitting if the file has none',
          ]),
        );
      }
    }
    return { type: 'word', form: unescapeLeaf(text), position };
  }

  private meta(raw: RawBracket, label: string, words: number, firstWord: number): ConstituentNode | undefined {
    const position = this.span(raw);
    if (words === raw.children.length) {
      const text = raw.children.map((token) => unescapeLeaf(this.text(token as number))).join(' ');
      return { type: 'meta', label, text, children: [], position };
    }
    if (words > 0) {
      this.fail('word-outside-preterminal', this.starts[firstWord]!, `word "${this.text(firstWord)}" stands beside brackets under "${label}"`);
      return undefined;
    }
    const children: ConstituentNode[] = [];
    for (const child of raw.children) {
      const node = this.node(child as RawBracket);
      if (node) children.push(node);
    }
    return { type: 'meta', label, children, position };
  }

  private text(token: number): string {
    return this.source.text.slice(this.starts[token], this.ends[token]);
  }

  private span(raw: RawBracket): Position {
    return { start: this.base + this.starts[raw.open]!, end: this.base + this.ends[raw.close]! };
  }

  private tokenSpan(token: number): Position {
    return { start: this.base + this.starts[token]!, end: this.base + this.ends[token]! };
  }

  private where(relative: number) {
    return { file: this.source.file, offset: this.base + relative, lines: this.source.lines };
  }

  private fail(code: DiagnosticCode, relative: number, message: string, notes?: string[]): void {
    this.failed = true;
    this.context.report(diagnose(code, message, this.where(relative), notes));
  }
}
