import { diagnose, type Report } from '../../diagnostics/diagnostic.js';
import type { DiagnosticCode } from '../../diagnostics/codes.js';
import type { Comment, DependencySentence, DependencyWord, EmptyNode, MultiwordToken } from '../../model/dependency.js';
import { LineIndex } from '../../model/line-index.js';
import { COLUMNS, fieldColumn, type SourceLine } from './conllu-line.js';

const WORD_ID = /^[1-9]\d*$/;
const RANGE_ID = /^([1-9]\d*)-([1-9]\d*)$/;
const EMPTY_ID = /^(0|[1-9]\d*)\.([1-9]\d*)$/;
const HEAD = /^(0|[1-9]\d*)$/;
const DEPREL = /^[a-z]+(:[a-z]+)?$/;
// The s flag: a value may hold U+2028 or U+2029, which `.` would not match otherwise.
const SENT_ID = /^#\s*sent_id\s*=\s*(.*)$/s;
const TEXT = /^#\s*text\s*=\s?(.*)$/s;
/** Columns where the specification allows spaces: FORM, LEMMA, MISC. */
const SPACES_ALLOWED = new Set([1, 2, 9]);
/** Columns a multiword token line leaves `_`: all but ID, FORM and MISC. */
const MULTIWORD_BLANK = [2, 3, 4, 5, 6, 7, 8];

/**
 * Builds a sentence from its lines (comments and word lines, no blank line),
 * checking the format as it goes (Universal Dependencies v2 format
 * specification; ../shared/CHECK-VALUES.md §6). A sentence whose word lines
 * can all be placed is returned even when it has other problems, so that the
 * tree checks can run; one with a line that cannot be placed (wrong column
 * count, bad ID, a gap in the IDs, a bad range) is reported and not returned.
 */
export function buildSentence(lines: SourceLine[], file: string, report: Report): DependencySentence | undefined {
  return new SentenceBuilder(lines, file, report).build();
}

class SentenceBuilder {
  private readonly source: LineIndex;

  constructor(
    private readonly lines: SourceLine[],
    private readonly file: string,
    private readonly report: Report,
  ) {
    const first = lines[0]!;
    this.source = new LineIndex(lines.map((line) => line.text).join('\n'), { offset: first.offset, line: first.line, column: 1 });
  }

  build(): DependencySentence | undefined {
    const comments: Comment[] = [];
    const tokens: DependencySentence['lines'] = [];
    let sentIds = 0;
    let texts = 0;
    let id: string | undefined;
    let wordsSeen = false;
    let expectedWord = 1;
    let rangeEnd = 0;
    let lastEmpty = { word: -1, index: 0 };
    let lastRange: { line: SourceLine; end: number } | undefined;
    // A line that cannot be placed (wrong column count, bad ID, gap in IDs, bad range) leaves the tree unreadable: it is reported, not handed on.
    let unreadable = false;

    for (const line of this.lines) {
      const text = line.text.endsWith('\r') ? line.text.slice(0, -1) : line.text;
      if (text.startsWith('#')) {
        if (wordsSeen) this.problem('comment-after-words', line, 1, 'comment line after the word lines began; comments go before them');
        comments.push({ type: 'comment', text: text.slice(1), position: this.span(line) });
        const sentId = SENT_ID.exec(text);
        if (sentId) {
          if (++sentIds === 2) this.problem('repeated-comment', line, 1, 'a second "# sent_id" in one sentence');
          else id = sentId[1]!.trim();
        }
        if (TEXT.test(text) && ++texts === 2) this.problem('repeated-comment', line, 1, 'a second "# text" in one sentence');
        continue;
      }
      wordsSeen = true;
      const fields = text.split('\t');
      if (fields.length !== 10) {
        const column = fields.length > 10 ? fieldColumn(fields, 10) : text.length + 1;
        this.problem('wrong-column-count', line, column, `${fields.length} column${fields.length === 1 ? '' : 's'} where ten are needed`);
        unreadable = true;
        if (WORD_ID.test(fields[0]!)) expectedWord = Number(fields[0]) + 1;
        continue;
      }
      this.checkFields(line, fields);
      this.checkColumnSyntax(line, fields);
      const [idText, form, lemma, upos, xpos, feats, head, deprel, deps, misc] = fields as [string, string, string, string, string, string, string, string, string, string];
      const columns = { id: idText, form, lemma, upos, xpos, feats, head, deprel, deps, misc, position: this.span(line) };
      if (WORD_ID.test(idText)) {
        const number = Number(idText);
        // Once the sentence is unreadable, a gap left by the line that made it so is not news.
        if (number !== expectedWord && !unreadable) this.problem('id-sequence', line, 1, `word ${idText} where word ${expectedWord} comes next`);
        if (number !== expectedWord) unreadable = true;
        if (lastRange && number === lastRange.end) lastRange = undefined;
        expectedWord = number + 1;
        lastEmpty = { word: number, index: 0 };
        if (!HEAD.test(head)) this.problem('head-not-word', line, fieldColumn(fields, 6), `HEAD "${head}" is not 0 or a word number`);
        if (!DEPREL.test(deprel)) this.problem('relation-shape', line, fieldColumn(fields, 7), `DEPREL "${deprel}" is not a relation such as "nsubj" or "obl:tmod"`);
        tokens.push({ type: 'word', ...columns } satisfies DependencyWord);
        continue;
      }
      const range = RANGE_ID.exec(idText);
      if (range) {
        const from = Number(range[1]);
        const to = Number(range[2]);
        const rangeProblem =
          to <= from ? `range ${idText} covers ${to < from ? 'no word' : 'a single word'}`
          : from <= rangeEnd ? `range ${idText} overlaps the range before it`
          : from !== expectedWord ? `range ${idText} must stand just before word ${from}`
          : undefined;
        if (rangeProblem) {
          this.problem('bad-range', line, 1, rangeProblem);
          unreadable = true;
        }
        rangeEnd = Math.max(rangeEnd, to);
        lastRange = { line, end: to };
        const blank = MULTIWORD_BLANK.find((index) => fields[index] !== '_');
        if (blank !== undefined) this.problem('multiword-fields', line, fieldColumn(fields, blank), 'a multiword token fills only ID, FORM and MISC; the other columns are "_"');
        tokens.push({ type: 'multiword', ...columns } satisfies MultiwordToken);
        continue;
      }
      const empty = EMPTY_ID.exec(idText);
      if (empty) {
        const word = Number(empty[1]);
        const index = Number(empty[2]);
        const after = expectedWord - 1;
        if (word !== after || (lastEmpty.word === word ? index !== lastEmpty.index + 1 : index !== 1)) {
          const next = lastEmpty.word === after ? lastEmpty.index + 1 : 1;
          this.problem('empty-node-sequence', line, 1, `empty node ${idText} where ${after}.${next} comes next`);
        }
        lastEmpty = { word, index };
        if (head !== '_' || deprel !== '_') {
          this.problem('empty-node-fields', line, fieldColumn(fields, head !== '_' ? 6 : 7), 'an empty node has HEAD and DEPREL "_"; its relations go in DEPS');
        } else if (deps === '_') {
          this.problem('empty-node-fields', line, fieldColumn(fields, 8), 'an empty node needs DEPS');
        }
        tokens.push({ type: 'empty-node', ...columns } satisfies EmptyNode);
        continue;
      }
      this.problem('invalid-id', line, 1, `ID "${idText}" is not a word number, a range like 1-2 or an empty node like 3.1`);
      unreadable = true;
    }

    const first = this.lines[0]!;
    if (tokens.length === 0) {
      if (wordsSeen) return undefined; // every word line was reported already
      this.problem('empty-sentence', first, 1, 'comment lines with no word line after them');
      return undefined;
    }
    if (lastRange && lastRange.end >= expectedWord) {
      this.problem('bad-range', lastRange.line, 1, `range runs past the last word, ${expectedWord - 1}`);
      unreadable = true;
    }
    if (sentIds === 0) this.problem('no-sentence-id', first, 1, 'sentence without a "# sent_id" comment');
    if (texts === 0) this.problem('no-text-comment', first, 1, 'sentence without a "# text" comment');
    if (unreadable) return undefined;
    const sentence: DependencySentence = {
      type: 'dependency-sentence',
      comments,
      lines: tokens,
      id,
      position: { start: first.offset, end: this.lines[this.lines.length - 1]!.offset + this.lines[this.lines.length - 1]!.text.length },
      file: this.file,
      source: this.source,
    };
    return sentence;
  }

  private checkFields(line: SourceLine, fields: string[]): void {
    fields.forEach((field, index) => {
      if (field === '') this.problem('empty-field', line, fieldColumn(fields, index), `empty ${columnName(index)} column; write "_" for unspecified`);
      else if (!SPACES_ALLOWED.has(index) && field.includes(' ')) {
        this.problem('space-in-field', line, fieldColumn(fields, index) + field.indexOf(' '), `space in the ${columnName(index)} column`);
      }
    });
    if (!isNfc(line.text)) {
      const index = fields.findIndex((field) => !isNfc(field));
      this.problem('not-nfc', line, fieldColumn(fields, Math.max(index, 0)), `${columnName(Math.max(index, 0))} is not in Unicode normalization form C`);
    }
  }

  /**
   * The inner syntax of FEATS, DEPS and MISC (UD v2 format specification,
   * CHECK-VALUES §6): FEATS `_` or `Name=Value` pairs sorted by name (case
   * aside), each name once, several values sorted and joined by commas; DEPS
   * `_` or `head:relation` pairs sorted by head; MISC `_` or items joined by
   * `|`, none empty.
   */
  private checkColumnSyntax(line: SourceLine, fields: string[]): void {
    const feats = fields[5]!;
    if (feats !== '_' && feats !== '') {
      const problem = featsProblem(feats);
      if (problem) this.problem('feats-shape', line, fieldColumn(fields, 5), problem);
    }
    const deps = fields[8]!;
    if (deps !== '_' && deps !== '') {
      const problem = depsProblem(deps);
      if (problem) this.problem('deps-shape', line, fieldColumn(fields, 8), problem);
    }
    const misc = fields[9]!;
    if (misc !== '_' && misc !== '' && misc.split('|').some((item) => item === '')) {
      this.problem('misc-shape', line, fieldColumn(fields, 9), `MISC "${misc}" has an empty item between its bars`);
    }
  }

  private span(line: SourceLine) {
    return { start: line.offset, end: line.offset + line.text.length };
  }

  private problem(code: DiagnosticCode, line: SourceLine, column: number, message: string): void {
    const lines = new LineIndex(line.text, { offset: line.offset, line: line.line, column: 1 });
    this.report(diagnose(code, message, { file: this.file, offset: line.offset + column - 1, lines }));
  }
}

function columnName(index: number): string {
  return COLUMNS[index] ?? 'extra';
}

/** ASCII text is always NFC; only other text needs normalizing to tell. */
function isNfc(text: string): boolean {
  // eslint-disable-next-line no-control-regex
  return /^[\x00-\x7f]*$/.test(text) || text.normalize('NFC') === text;
}

const FEATURE_PAIR = /^([A-Z0-9][A-Za-z0-9]*(?:\[[a-z0-9]+\])?)=([A-Z0-9][A-Za-z0-9]*(?:,[A-Z0-9][A-Za-z0-9]*)*)$/;

/**
 * FEATS values checked already, and what was wrong with each: a treebank uses
 * a few thousand distinct values millions of times, and the check compares
 * names as people sort them (localeCompare), which costs. Bounded, so that a
 * file of ever new values does not hold them all.
 */
const checkedFeats = new Map<string, string | undefined>();

/** Why a FEATS value is not well formed, or undefined. */
export function featsProblem(feats: string): string | undefined {
  if (checkedFeats.has(feats)) return checkedFeats.get(feats);
  const problem = checkFeats(feats);
  if (checkedFeats.size >= 20_000) checkedFeats.clear();
  checkedFeats.set(feats, problem);
  return problem;
}

function checkFeats(feats: string): string | undefined {
  let previous: string | undefined;
  for (const pair of feats.split('|')) {
    const match = FEATURE_PAIR.exec(pair);
    if (!match) return `FEATS item "${pair}" is not Name=Value (a capitalised name, values of letters and digits)`;
    const [, name, values] = match as unknown as [string, string, string];
    if (previous !== undefined) {
      const order = previous.toLowerCase().localeCompare(name.toLowerCase());
      if (order === 0 && previous === name) return `feature ${name} is given twice`;
      if (order > 0) return `features are not sorted by name: ${previous} before ${name}`;
    }
    const list = values.split(',');
    for (let k = 1; k < list.length; k++) {
      if (list[k - 1]!.toLowerCase().localeCompare(list[k]!.toLowerCase()) >= 0) return `the values of ${name} are not sorted, or repeat: ${values}`;
    }
    previous = name;
  }
  return undefined;
}

// Enhanced relations may carry subtypes in lower-case letters of any script and underscores (obl:v_průběhu).
const DEPS_PAIR = /^(0|[1-9]\d*(?:\.[1-9]\d*)?):([a-z]+(?::[\p{Ll}\p{Lm}\p{Lo}\p{M}_]+)*)$/u;

/** Why a DEPS value is not well formed, or undefined. */
export function depsProblem(deps: string): string | undefined {
  let previous = -1;
  for (const pair of deps.split('|')) {
    const match = DEPS_PAIR.exec(pair);
    if (!match) return `DEPS item "${pair}" is not head:relation (a word number, or an empty node such as 3.1, then a relation)`;
    const head = Number(match[1]);
    if (head < previous) return `DEPS items are not sorted by head: ${pair} after head ${previous}`;
    previous = head;
  }
  return undefined;
}
