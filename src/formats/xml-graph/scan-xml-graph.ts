import { MAX_TREE_LENGTH } from '../../model/limits.js';
import type { SAXParser } from 'sax';
import xml2js from 'xml2js';
import { diagnose, type Report } from '../../diagnostics/diagnostic.js';
import type { DiagnosticCode } from '../../diagnostics/codes.js';
import { LineIndex } from '../../model/line-index.js';
import type { Point } from '../../model/position.js';
import type { EdgeRecord, NodeRecord, SentenceRecord } from './graph-records.js';

/** Limits that keep a hostile or broken file from exhausting memory. */
export interface XmlLimits {
  /** Deepest element nesting accepted; the encoding itself needs six levels. Default 64. */
  maxDepth: number;
  /** Longest sentence (`<s>` to `</s>`) accepted, in characters. Default 16 Mi. */
  maxSentenceLength: number;
  /** Longest stretch outside sentences (the header, say) accepted, in characters. Default 16 Mi. */
  maxOutsideLength: number;
}

export const defaultXmlLimits: XmlLimits = { maxDepth: 64, maxSentenceLength: MAX_TREE_LENGTH, maxOutsideLength: MAX_TREE_LENGTH };

/** Elements of the encoding and where each may stand; anything else inside a sentence is reported. */
const PARENTS: ReadonlyMap<string, readonly string[]> = new Map([
  ['graph', ['s']],
  ['terminals', ['graph']],
  ['nonterminals', ['graph']],
  ['t', ['terminals']],
  ['nt', ['nonterminals']],
  ['edge', ['nt']],
  ['secedge', ['t', 'nt']],
]);

/** Names of properties every JavaScript object has, which code keying objects by name would trip over. */
const OBJECT_NAMES: ReadonlySet<string> = new Set(['__proto__', 'constructor', 'prototype']);

/**
 * The strict sax parser an xml2js parser sets up (text neither trimmed nor
 * normalised, no namespace processing), with xml2js's own handlers taken off:
 * they would build objects keyed by element and attribute names. Ours are
 * set by the scanner.
 */
function xml2jsSaxParser(): SAXParser {
  const host = new xml2js.Parser({ strict: true, xmlns: false }) as unknown as { saxParser: SAXParser };
  const parser = host.saxParser;
  for (const handler of ['oncdata', 'onclosetag', 'onend', 'onerror', 'onopentag', 'ontext'] as const) {
    (parser as unknown as Record<string, unknown>)[handler] = undefined;
  }
  return parser;
}

/** Thrown inside sax handlers to stop reading a file after a fatal problem; never leaves this module. */
class StopFile extends Error {}

/**
 * Reads the XML graph encoding with the sax parser that xml2js is built on,
 * driven by its events, one sentence at a time: memory holds the sentence
 * being read. Positions come from the parser (offset of each element's `<`).
 *
 * Safety: the parser runs in strict mode, expands only the five predefined
 * entities and character references, and fetches nothing. A document type
 * declaration (which is where entity definitions and external DTDs live) is
 * refused outright, and the file is not read further. Attributes are
 * collected one by one into Maps, as the parser's own attribute objects are
 * plain objects in which a `__proto__` attribute would vanish.
 */
export class XmlGraphScanner {
  private readonly parser: SAXParser;
  private readonly sentences: SentenceRecord[] = [];
  private readonly stack: string[] = [];
  private attributes = new Map<string, string>();
  private sentence: SentenceRecord | undefined;
  private node: NodeRecord | undefined;
  /** Text not yet dropped, for line numbers and excerpts, and the point where it begins. */
  private kept = '';
  private keptStart: Point = { offset: 0, line: 1, column: 1 };
  private received = 0;
  private stopped = false;
  private first = true;

  constructor(
    private readonly file: string,
    private readonly report: Report,
    private readonly limits: XmlLimits = defaultXmlLimits,
  ) {
    const parser = xml2jsSaxParser();
    parser.onattribute = ({ name, value }) => {
      this.attributes.set(name, value);
    };
    parser.onopentag = (tag) => this.open(tag.name, tag.isSelfClosing);
    parser.onclosetag = (name) => this.close(name);
    parser.ondoctype = (declaration) =>
      // The event comes at the closing `>`, after `<!DOCTYPE` and the declaration's text.
      this.fail('xml-doctype', 'a document type declaration: treebridge reads no DTD and expands no entity it declares', this.parser.position - 1 - declaration.length - '<!DOCTYPE'.length, [
        'remove the <!DOCTYPE …> declaration; the graph encoding needs none',
      ]);
    parser.ontext = parser.oncdata = (text) => {
      if (this.sentence && text.trim() !== '') this.warn('xml-unexpected-content', `text ${JSON.stringify(text.trim().slice(0, 20))} inside a sentence is ignored`, this.parser.position - text.length);
    };
    parser.onerror = (error) => {
      const message = error.message.split('\n')[0]!;
      // The parser stops at the character that broke the rule; an entity or a closing tag is better shown from its start.
      let offset = Math.max(0, this.parser.position - 1);
      const notes: string[] = [];
      if (/entity/i.test(message)) {
        notes.push('only &lt; &gt; &amp; &quot; &apos; and character references (&#…;) are expanded');
        const ampersand = this.kept.lastIndexOf('&', offset - this.keptStart.offset);
        if (ampersand !== -1) offset = this.keptStart.offset + ampersand;
      } else if (/close tag|unencoded </i.test(message)) offset = this.tagStart();
      else if (/before first tag/i.test(message) && this.kept.trimStart().startsWith('(')) {
        notes.push('this looks like a bracketed file: read it with --from bracketed, or give it another extension than .xml');
      }
      this.fail('xml-malformed', `not well-formed XML: ${message.charAt(0).toLowerCase()}${message.slice(1)}`, offset, notes);
    };
    this.parser = parser;
  }

  /** Reads the next piece of text; returns false once the file is not read further. */
  push(piece: string): boolean {
    if (this.stopped) return false;
    if (this.first) {
      this.first = false;
      if (piece.charCodeAt(0) === 0xfeff) piece = piece.slice(1);
    }
    this.kept += piece;
    this.received += piece.length;
    try {
      this.parser.write(piece);
    } catch (error) {
      if (!(error instanceof StopFile)) throw error;
    }
    if (!this.stopped) this.checkLength();
    return !this.stopped;
  }

  /** Ends the file: reports an unclosed sentence or element. */
  end(): void {
    if (this.stopped) return;
    try {
      this.parser.close();
      if (this.stack.length > 0) this.fail('xml-malformed', `the file ends inside <${this.stack[this.stack.length - 1]}>`, this.received);
    } catch (error) {
      if (!(error instanceof StopFile)) throw error;
    }
  }

  /** The sentences completed since the last call. */
  take(): SentenceRecord[] {
    return this.sentences.splice(0);
  }

  /** Lines and columns for a stretch of the text still kept. */
  linesFor(start: number, end: number): LineIndex {
    const from = Math.max(start, this.keptStart.offset);
    return new LineIndex(this.kept.slice(from - this.keptStart.offset, end - this.keptStart.offset), this.pointAt(from));
  }

  /** The line and column of an offset in the kept text, counting only the text before it (not the whole kept stretch). */
  private pointAt(offset: number): Point {
    const length = offset - this.keptStart.offset;
    let line = this.keptStart.line;
    let lastBreak = -1;
    for (let at = this.kept.indexOf('\n'); at !== -1 && at < length; at = this.kept.indexOf('\n', at + 1)) {
      line++;
      lastBreak = at;
    }
    const column = lastBreak === -1 ? this.keptStart.column + length : length - lastBreak;
    return { offset, line, column };
  }

  private open(name: string, selfClosing: boolean): void {
    const attributes = this.attributes;
    this.attributes = new Map();
    const start = this.tagStart();
    this.checkRepeatedAttributes(name, start, attributes.size);
    this.noteObjectNames(name, start, attributes);
    const parent = this.stack[this.stack.length - 1];
    if (!selfClosing) this.stack.push(name);
    if (this.stack.length > this.limits.maxDepth) {
      this.fail('xml-too-deep', `elements nested more than ${this.limits.maxDepth} deep`, start, ['the graph encoding nests six levels; a deeper file is not one']);
    }
    if (name === 's') {
      if (this.sentence) this.fail('xml-malformed', `a sentence inside sentence ${this.sentence.attributes.get('id') ?? '(no id)'}`, start);
      this.dropKeptBefore(start);
      const record: SentenceRecord = { attributes, root: undefined, graphAttributes: new Map(), graphStart: start, terminals: [], nonterminals: [], start, end: start, lines: undefined };
      this.sentence = record;
      if (selfClosing) this.finishSentence(this.parser.position);
      return;
    }
    const sentence = this.sentence;
    if (!sentence) return; // corpus, head, body and whatever the header holds
    const allowed = PARENTS.get(name);
    if (!allowed || parent === undefined || !allowed.includes(parent)) {
      this.warn('xml-unexpected-element', `<${name}> ${allowed ? `inside <${parent}>` : 'is not part of the graph encoding'} is ignored (sentence ${sentence.attributes.get('id') ?? '(no id)'})`, start);
      return;
    }
    switch (name) {
      case 'graph':
        sentence.root = attributes.get('root');
        attributes.delete('root');
        sentence.graphAttributes = attributes;
        sentence.graphStart = start;
        break;
      case 't':
      case 'nt': {
        const record: NodeRecord = { element: name, attributes, start, end: this.parser.position, edges: [], secondaryEdges: [] };
        (name === 't' ? sentence.terminals : sentence.nonterminals).push(record);
        if (!selfClosing) this.node = record;
        break;
      }
      case 'edge':
      case 'secedge': {
        const edge: EdgeRecord = { label: attributes.get('label'), idref: attributes.get('idref'), start };
        if (this.node) (name === 'edge' ? this.node.edges : this.node.secondaryEdges).push(edge);
        break;
      }
    }
  }

  private close(name: string): void {
    // sax reports a self-closing element as opened and closed; only elements we pushed are popped.
    if (this.stack[this.stack.length - 1] !== name) return;
    this.stack.pop();
    if (name === 's' && this.sentence) this.finishSentence(this.parser.position);
    else if ((name === 't' || name === 'nt') && this.node) {
      this.node.end = this.parser.position;
      this.node = undefined;
    }
  }

  /**
   * The parser keeps the first of two attributes with one name and drops the
   * second without a word; XML forbids the repetition (Extensible Markup
   * Language 1.0, §3.1), so the tag's own text is checked.
   */
  private checkRepeatedAttributes(name: string, start: number, kept: number): void {
    const tag = this.kept.slice(start - this.keptStart.offset, this.parser.position - this.keptStart.offset);
    let written = 0;
    for (let at = tag.indexOf('='); at !== -1; at = tag.indexOf('=', at + 1)) written++;
    if (written <= kept) return;
    const names = [...tag.matchAll(/([^\s=<>"'/]+)\s*=\s*(?:"[^"]*"|'[^']*')/g)].map((match) => match[1]!);
    const repeated = names.find((attribute, i) => names.indexOf(attribute) !== i);
    if (repeated !== undefined) this.fail('xml-malformed', `attribute ${repeated} is given twice in <${name}>`, start);
  }

  /**
   * Names such as `__proto__` are legal XML and harmless here (attributes live
   * in Maps), but in a corpus they are a mistake or an attack on readers that
   * key objects by name: they are reported, and kept as plain data.
   */
  private noteObjectNames(name: string, start: number, attributes: Map<string, string>): void {
    for (const [attribute, value] of attributes) {
      // Every such name is 9 or 11 characters long: most attributes and values are settled by length.
      if (attribute.length !== 9 && attribute.length !== 11 && value.length !== 9 && value.length !== 11) continue;
      if (OBJECT_NAMES.has(attribute)) this.warn('xml-object-name', `attribute ${attribute} of <${name}> is kept as plain data`, start);
      else if ((attribute === 'id' || attribute === 'idref' || attribute === 'root') && OBJECT_NAMES.has(value)) {
        this.warn('xml-object-name', `${attribute}="${value}" of <${name}> is kept as plain data`, start);
      }
    }
  }

  private finishSentence(end: number): void {
    const sentence = this.sentence!;
    if (end - sentence.start > this.limits.maxSentenceLength) {
      this.fail('xml-too-large', `sentence ${sentence.attributes.get('id') ?? '(no id)'} runs past ${this.limits.maxSentenceLength} characters`, sentence.start);
    }
    sentence.end = end;
    sentence.lines = this.linesFor(sentence.start, end);
    this.sentence = undefined;
    // The decoder stands U+FFFD where bytes were not UTF-8: such a sentence is reported and skipped, as in the other formats.
    const replaced = sentence.lines.text.indexOf('\uFFFD');
    if (replaced !== -1) {
      const offset = sentence.lines.start.offset + replaced;
      this.report(diagnose('invalid-encoding', `sentence ${sentence.attributes.get('id') ?? '(no id)'}: bytes that are not valid UTF-8 (shown as U+FFFD); the sentence is skipped`, { file: this.file, offset, lines: sentence.lines }));
      return;
    }
    this.sentences.push(sentence);
  }

  /** Offset of the `<` of the tag just read. */
  private tagStart(): number {
    return Math.max(0, this.parser.startTagPosition - 1);
  }

  /** Drops kept text before an offset, so that memory holds one sentence at a time. */
  private dropKeptBefore(offset: number): void {
    if (offset <= this.keptStart.offset) return;
    const point = this.pointAt(offset);
    this.kept = this.kept.slice(offset - this.keptStart.offset);
    this.keptStart = point;
  }

  private checkLength(): void {
    if (this.sentence) {
      if (this.received - this.sentence.start > this.limits.maxSentenceLength) {
        this.stopQuietly(() =>
          this.fail('xml-too-large', `sentence ${this.sentence!.attributes.get('id') ?? '(no id)'} runs past ${this.limits.maxSentenceLength} characters`, this.sentence!.start),
        );
      }
      return;
    }
    // Outside sentences only the current line is needed for excerpts.
    const lastBreak = this.kept.lastIndexOf('\n');
    if (lastBreak > 0) this.dropKeptBefore(this.keptStart.offset + lastBreak + 1);
    if (this.kept.length > this.limits.maxOutsideLength) {
      this.stopQuietly(() => this.fail('xml-too-large', `more than ${this.limits.maxOutsideLength} characters on one line outside any sentence`, this.keptStart.offset));
    }
  }

  private stopQuietly(stop: () => void): void {
    try {
      stop();
    } catch (error) {
      if (!(error instanceof StopFile)) throw error;
    }
  }

  private warn(code: DiagnosticCode, message: string, offset: number): void {
    this.report(diagnose(code, message, { file: this.file, offset, lines: this.linesFor(offset, this.received) }));
  }

  /** Reports a problem after which the file is not read further, and stops. */
  private fail(code: DiagnosticCode, message: string, offset: number, notes: string[] = []): never {
    const element = this.node ? `, element <${this.node.element} id="${this.node.attributes.get('id') ?? ''}">` : '';
    const within = this.sentence ? [`in sentence ${this.sentence.attributes.get('id') ?? '(no id)'}${element}; the rest of the file is not read`] : ['the rest of the file is not read'];
    this.report(diagnose(code, message, { file: this.file, offset, lines: this.linesFor(offset, this.received) }, [...notes, ...within]));
    this.stopped = true;
    this.sentence = undefined;
    this.node = undefined;
    throw new StopFile();
  }
}
