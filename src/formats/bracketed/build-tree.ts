import { diagnose, type Report } from '../../diagnostics/diagnostic.js';
import type { DiagnosticCode } from '../../diagnostics/codes.js';
import type { ConstituentNode, Tree, Word } from '../../model/constituency.js';
import { parseLabel } from '../../model/label.js';
import type { LineIndex } from '../../model/line-index.js';
import { literalTagTest, readEmptyLeaf, splitLemma, unescapeLeaf } from './leaves.js';
import type { RawBracket, RawToken } from './raw-syntax.js';
import type { ResolvedReadOptions } from './read-options.js';

/** Where the raw bracket came from: its text's file offset and line index. */
export interface ChunkPlace {
  file: string;
  offset: number;
  lines: LineIndex;
}

/**
 * Turns one raw top-level bracket into a {@link Tree}. Every problem that keeps
 * the tree from being read is reported, not just the first; the tree is then
 * not returned. Problems that do not stop reading are left to the validator.
 */
export function buildTree(
  raw: RawBracket,
  place: ChunkPlace,
  options: ResolvedReadOptions,
  report: Report,
  fileState: FileState = { lemmaWarned: false },
): Tree | undefined {
  return new TreeBuilder(place, options, report, fileState).build(raw);
}

/** What the builder remembers across the trees of one file. */
export interface FileState {
  /** A word without a lemma part has been reported; one report per file is enough to show the problem. */
  lemmaWarned: boolean;
}

class TreeBuilder {
  private failed = false;
  private readonly metaLabels: Set<string>;
  private readonly isLiteralTag: (tag: string) => boolean;

  constructor(
    private readonly place: ChunkPlace,
    private readonly options: ResolvedReadOptions,
    private readonly report: Report,
    private readonly fileState: FileState,
  ) {
    this.metaLabels = new Set(options.metaLabels);
    this.isLiteralTag = literalTagTest(options.literalTags);
  }

  build(raw: RawBracket): Tree | undefined {
    const tree: Tree = {
      type: 'tree',
      children: [],
      position: this.span(raw),
      file: this.place.file,
      source: this.place.lines,
    };
    const label = raw.label?.text ?? '';
    if (raw.label === null && raw.children.length === 0) {
      this.fail('empty-brackets', raw.start, 'empty brackets "()" where a tree should be');
      return undefined;
    }
    if (this.options.wrapperLabels.includes(label)) {
      tree.wrapper = { label };
      for (const child of raw.children) {
        if (child.kind === 'token') {
          this.fail('word-outside-preterminal', child.start, `word "${child.text}" directly under the outer bracket`);
        } else if (child.label?.text === this.options.idLabel) {
          this.readId(child, tree);
        } else {
          const node = this.node(child, 1);
          if (node) tree.children.push(node);
        }
      }
      if (!this.failed && tree.children.length === 0) {
        this.fail('empty-tree', raw.start, tree.id ? `tree ${tree.id} holds no sentence` : 'outer bracket holds no sentence');
      }
    } else {
      const node = this.node(raw, 0);
      if (node) tree.children.push(node);
    }
    return this.failed ? undefined : tree;
  }

  private readId(raw: RawBracket, tree: Tree): void {
    const only = raw.children[0];
    if (raw.children.length !== 1 || only?.kind !== 'token') {
      this.fail('misplaced-id', raw.start, `the ${this.options.idLabel} node must hold exactly one leaf`);
      return;
    }
    if (tree.id !== undefined) {
      this.fail('misplaced-id', raw.start, `a second ${this.options.idLabel} node in one tree`);
      return;
    }
    tree.id = unescapeLeaf(only.text);
    tree.idPosition = this.span(only);
  }

  private node(raw: RawBracket, depth: number): ConstituentNode | undefined {
    const position = this.span(raw);
    if (raw.label === null) {
      if (raw.children.length === 0) this.fail('empty-brackets', raw.start, 'empty brackets "()"');
      else this.fail('empty-label', raw.start, 'bracket without a label inside a tree');
      for (const child of raw.children) if (child.kind === 'bracket') this.node(child, depth + 1);
      return undefined;
    }
    const label = raw.label.text;
    if (raw.children.length === 0) {
      this.fail('childless-node', raw.start, `"(${label})" has nothing inside`);
      return undefined;
    }
    const tokens = raw.children.filter((child): child is RawToken => child.kind === 'token');
    if (this.metaLabels.has(label)) return this.meta(raw, label, tokens, depth);
    if (tokens.length === raw.children.length) {
      if (tokens.length > 1) {
        this.fail('several-words', tokens[1]!.start, `"${label}" holds ${tokens.length} words; a tag holds one`, [
          'brackets inside a word must be escaped as \\( and \\)',
        ]);
        return undefined;
      }
      return this.leafNode(raw, label, tokens[0]!);
    }
    if (tokens.length > 0) {
      this.fail('word-outside-preterminal', tokens[0]!.start, `word "${tokens[0]!.text}" stands beside brackets under "${label}"`, [
        'every word needs its own part-of-speech bracket, as in (N word)',
      ]);
    }
    const children: ConstituentNode[] = [];
    for (const child of raw.children) {
      if (child.kind !== 'bracket') continue;
      const node = this.node(child, depth + 1);
      if (node && (node.type !== 'meta' || this.options.keepMeta)) children.push(node);
    }
    if (children.length === 0) return undefined;
    return { type: 'phrase', label: parseLabel(label), children, position };
  }

  private leafNode(raw: RawBracket, tag: string, token: RawToken): ConstituentNode {
    const position = this.span(raw);
    const empty = readEmptyLeaf(token.text, tag, this.isLiteralTag);
    if (empty) {
      const node: ConstituentNode = { type: 'empty', label: parseLabel(tag), text: token.text, kind: empty.kind, position };
      if (empty.refIndex !== undefined) node.refIndex = empty.refIndex;
      return node;
    }
    return { type: 'preterminal', pos: tag, word: this.word(token), position };
  }

  private word(token: RawToken): Word {
    const position = this.span(token);
    if (this.options.splitLemmas) {
      const parts = splitLemma(token.text);
      if (parts) return { type: 'word', form: unescapeLeaf(parts.form), lemma: unescapeLeaf(parts.lemma), position };
      if (!this.fileState.lemmaWarned) {
        this.fileState.lemmaWarned = true;
        this.report(
          diagnose('missing-lemma', `word "${token.text}" has no "-lemma" part`, this.where(token.start), [
            'later words of this file without a lemma are not reported; read without lemma splitting if the file has none',
          ]),
        );
      }
    }
    return { type: 'word', form: unescapeLeaf(token.text), position };
  }

  private meta(raw: RawBracket, label: string, tokens: RawToken[], depth: number): ConstituentNode | undefined {
    const position = this.span(raw);
    if (tokens.length === raw.children.length) {
      return { type: 'meta', label, text: tokens.map((token) => unescapeLeaf(token.text)).join(' '), children: [], position };
    }
    if (tokens.length > 0) {
      this.fail('word-outside-preterminal', tokens[0]!.start, `word "${tokens[0]!.text}" stands beside brackets under "${label}"`);
      return undefined;
    }
    const children: ConstituentNode[] = [];
    for (const child of raw.children) {
      const node = this.node(child as RawBracket, depth + 1);
      if (node) children.push(node);
    }
    return { type: 'meta', label, children, position };
  }

  private span(raw: { start: number; end: number }) {
    return { start: this.place.offset + raw.start, end: this.place.offset + raw.end };
  }

  private where(relative: number) {
    return { file: this.place.file, offset: this.place.offset + relative, lines: this.place.lines };
  }

  private fail(code: DiagnosticCode, relative: number, message: string, notes?: string[]): void {
    this.failed = true;
    this.report(diagnose(code, message, this.where(relative), notes));
  }
}
