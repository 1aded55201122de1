import type { DiagnosticCode } from '../diagnostics/codes.js';
import type { Diagnostic } from '../diagnostics/diagnostic.js';
import { diagnoseLine, lineOffsets } from '../diagnostics/diagnostic.js';
import type { Candidate, Matcher } from './label-pattern.js';
import { compilePattern, globTest } from './label-pattern.js';
import { findTable, readTableText, requireTable, TableError } from './table-source.js';

/** The 17 Universal POS tags (UD v2; ../shared/CHECK-VALUES.md §9, from memory). */
export const universalTags: ReadonlySet<string> = new Set([
  'ADJ', 'ADP', 'ADV', 'AUX', 'CCONJ', 'DET', 'INTJ', 'NOUN', 'NUM', 'PART', 'PRON', 'PROPN', 'PUNCT', 'SCONJ', 'SYM', 'VERB', 'X',
]);

/** What a word-class rule looks at: the word, and its place after the conversion. */
export interface WordContext {
  /** The tag as written. */
  pos: string;
  form: string;
  lemma: string | undefined;
  /** The relation the conversion gave the word (`root` for the root). */
  relation: string;
  /** The word's maximal projection, the head child it attaches to, and the phrase they are in (as label patterns see them). */
  dependent?: Candidate;
  head?: Candidate;
  parent?: Candidate;
}

/** A word's universal part of speech and features. */
export interface WordClass {
  upos: string;
  /** Name to value, in no order: written sorted by {@link formatFeatures}. */
  feats: Map<string, string>;
}

interface TagLine {
  test: (tag: string) => boolean;
  /** Exact tags beat patterns; among patterns, the one with more written characters. */
  specificity: number;
  upos: string;
  feats: Map<string, string>;
  line: number;
}

interface FeatureLine {
  test: (tag: string) => boolean;
  feats: Map<string, string>;
}

interface TagEntry {
  upos: string;
  feats: Array<[string, string]>;
  rules: Array<{ rule: ContextRule; conditions: Array<(context: WordContext) => boolean> }>;
  /** The written UPOS and FEATS when no rule holds (index 0) or when rule k - 1 does: each worked out once. */
  written: Array<WrittenClass | undefined>;
}

/** A word's UPOS and FEATS as CoNLL-U writes them. */
export interface WrittenClass {
  upos: string;
  feats: string;
}

type TagTest = ((context: WordContext) => boolean) & { tagTest: (tag: string) => boolean };

function isTagTest(condition: (context: WordContext) => boolean): condition is TagTest {
  return 'tagTest' in condition;
}

/** A rule that decides a word's UPOS (and features) by where the conversion put it. */
export interface ContextRule {
  upos: string;
  feats: Map<string, string>;
  conditions: Array<(context: WordContext) => boolean>;
  line: number;
}

/**
 * A word table (`headrules/NAME.pos`): how a scheme's words become Universal
 * Dependencies words. Tags give a UPOS and features (`tag NS-* NOUN
 * Number=Plur`), patterns add features to every tag they match (`feature *-D
 * Case=Dat`), rules decide by the word's place what a tag alone cannot (`upos
 * AUX pos=VB* relation=aux,cop`), bracket escapes of the scheme become the
 * characters again (`escape -LRB- (`), and a marker joins the pieces of one
 * written word (`join $`). See the syntax in {@link loadPosMap}.
 */
export class PosMap {
  name = '';
  private readonly tags: TagLine[] = [];
  private readonly features: FeatureLine[] = [];
  private readonly rules: ContextRule[] = [];
  /** Written bracket escapes and the characters they stand for: `-LRB-` → `(`. */
  readonly escapes = new Map<string, string>();
  /** The marker at the join of the pieces of one written word (`$` in `tungur$ $nar`), when the scheme has one. */
  joinMarker: string | undefined;
  private readonly cache = new Map<string, TagLine | null>();
  /** Per tag: UPOS and features from tag and feature lines, and the rules its tag leaves open with their other conditions. */
  private readonly entries = new Map<string, TagEntry>();

  /** Adds a tag line: UPOS and features for the tags a pattern matches. */
  addTag(pattern: string, upos: string, feats: Map<string, string> = new Map(), line = 0): void {
    const exact = !pattern.includes('*');
    this.tags.push({ test: exact ? (tag) => tag === pattern : globTest(pattern), specificity: exact ? 1e6 : pattern.replace(/\*/g, '').length, upos, feats, line });
    this.cache.clear();
    this.entries.clear();
  }

  addFeatures(pattern: string, feats: Map<string, string>): void {
    this.features.push({ test: globTest(pattern), feats });
    this.entries.clear();
  }

  addRule(rule: ContextRule): void {
    this.rules.push(rule);
    this.entries.clear();
  }

  /** The tag line that decides a tag's UPOS: the most specific, the first of equals. */
  private lineFor(tag: string): TagLine | undefined {
    let found = this.cache.get(tag);
    if (found === undefined) {
      found = null;
      for (const line of this.tags) if (line.test(tag) && (found === null || line.specificity > found.specificity)) found = line;
      if (this.cache.size > 50_000) this.cache.clear();
      this.cache.set(tag, found);
    }
    return found ?? undefined;
  }

  /** The UPOS of a tag by the tag lines alone (no context). */
  get(tag: string): string | undefined {
    return this.lineFor(tag)?.upos;
  }

  /** UPOS and features of a word: its tag line, the feature lines its tag matches, then the first rule that holds. */
  classify(context: WordContext): WordClass {
    const entry = this.entryFor(context.pos);
    const feats = new Map(entry.feats);
    let upos = entry.upos;
    for (const { rule, conditions } of entry.rules) {
      if (!conditions.every((condition) => condition(context))) continue;
      upos = rule.upos;
      for (const [name, value] of rule.feats) if (value === '_') feats.delete(name);
      else feats.set(name, value);
      break;
    }
    return { upos, feats };
  }

  /** UPOS and FEATS of a word as CoNLL-U writes them: {@link classify}, with the features sorted and joined. */
  classifyWritten(context: WordContext): WrittenClass {
    const entry = this.entryFor(context.pos);
    let chosen = 0;
    for (let k = 0; k < entry.rules.length; k++) {
      if (!entry.rules[k]!.conditions.every((condition) => condition(context))) continue;
      chosen = k + 1;
      break;
    }
    let written = entry.written[chosen];
    if (!written) {
      const { upos, feats } = this.classify(context);
      written = entry.written[chosen] = { upos, feats: formatFeatures(feats) };
    }
    return written;
  }

  /** What a tag alone decides, worked out once per tag: a corpus has a few hundred tags and millions of words. */
  private entryFor(tag: string): TagEntry {
    let entry = this.entries.get(tag);
    if (entry) return entry;
    const line = this.lineFor(tag);
    const feats = new Map(line?.feats ?? []);
    for (const feature of this.features) if (feature.test(tag)) for (const [name, value] of feature.feats) feats.set(name, value);
    const rules: TagEntry['rules'] = [];
    for (const rule of this.rules) {
      const tagTests = rule.conditions.filter(isTagTest);
      if (!tagTests.every((condition) => condition.tagTest(tag))) continue;
      rules.push({ rule, conditions: rule.conditions.filter((condition) => !isTagTest(condition)) });
    }
    entry = { upos: line?.upos ?? '_', feats: [...feats], rules, written: [] };
    if (this.entries.size > 50_000) this.entries.clear();
    this.entries.set(tag, entry);
    return entry;
  }

  /** A form with the scheme's bracket escapes undone: `-LRB-a-RRB-` → `(a)`. */
  unescape(form: string): string {
    if (this.escapes.size === 0 || !form.includes('-')) return form;
    let out = form;
    for (const [written, character] of this.escapes) if (out.includes(written)) out = out.split(written).join(character);
    return out;
  }
}

/** Features written as UD writes them: `Name=Value` pairs sorted by name (case-insensitively), joined by `|`; `_` for none. */
export function formatFeatures(feats: ReadonlyMap<string, string>): string {
  if (feats.size === 0) return '_';
  if (feats.size === 1) for (const [name, value] of feats) return `${name}=${value}`;
  // A corpus repeats a few thousand feature sets: each is sorted once.
  let key = '';
  for (const [name, value] of feats) key += `${name}=${value}|`;
  let written = formatted.get(key);
  if (written === undefined) {
    written = sortFeatures(feats);
    if (formatted.size > 100_000) formatted.clear();
    formatted.set(key, written);
  }
  return written;
}

const formatted = new Map<string, string>();

function sortFeatures(feats: ReadonlyMap<string, string>): string {
  // Names are ASCII letters, digits and brackets: comparing their lower-cased forms is the UD order.
  return [...feats]
    .map(([name, value]) => [name.toLowerCase(), name, value] as const)
    .sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : a[1] < b[1] ? -1 : a[1] > b[1] ? 1 : 0))
    .map(([, name, value]) => `${name}=${value}`)
    .join('|');
}

const FEATURE = /^[A-Z][A-Za-z0-9]*(\[[a-z0-9]+\])?=([A-Z0-9][A-Za-z0-9]*|_)(,[A-Z0-9][A-Za-z0-9]*)*$/;
const KEYWORDS = new Set(['table', 'builds-on', 'tag', 'feature', 'upos', 'escape', 'join']);
const CONDITION_KEYS = ['pos', 'form', 'lemma', 'relation', 'dependent', 'head', 'parent'] as const;

/** One line of a word table, split into words with their columns. */
interface Line {
  number: number;
  /** Where the line starts in its file. */
  offset: number;
  text: string;
  words: Array<{ text: string; column: number }>;
}

/**
 * Reads a word table (`headrules/NAME.pos`, by shipped name or path; or from
 * `text`). One statement per line, `#` lines are comments:
 *
 *     table NAME
 *     builds-on NAME              start from another word table; lines here come after its lines
 *     tag PATTERN,… UPOS [FEATS]  UPOS (and features) of the tags the patterns match; the most
 *                                 specific line wins (a tag written out, then the longest pattern)
 *     feature PATTERN,… FEATS     features added to every tag the patterns match, in order
 *     upos UPOS [FEATS] COND…     after the conversion, the first rule whose conditions hold sets
 *                                 the UPOS (and features; `Name=_` takes one away); conditions are
 *                                 KEY=VALUE,… with KEY pos, form, lemma (values may hold `*`),
 *                                 relation (`aux` matches `aux:pass` too), dependent, head, parent
 *                                 (label patterns, as in label tables)
 *     escape WRITTEN CHARACTER    a bracket escape of the scheme, undone in FORM, LEMMA and # text
 *     join MARKER                 pieces of one written word carry MARKER at their join
 *                                 (`tungur$ $nar`): they stay words, under a multiword token
 *
 * A PATTERN is a tag with `*` standing for any run of characters (`NS-*`,
 * `*-D`, `*`). A line without a keyword, `TAG UPOS [FEATS]`, is a tag line (the
 * older form of these maps).
 */
export function loadPosMap(nameOrPath: string, text?: string): PosMap {
  const map = new PosMap();
  const problems: Diagnostic[] = [];
  // The chain of maps this one builds on, followed without recursion, base first.
  const chain: Array<{ file: string; lines: Line[] }> = [];
  const seen: string[] = [];
  let current: { file: string; text?: string } | undefined = { file: text === undefined ? requireTable(nameOrPath, 'pos') : nameOrPath, text };
  while (current) {
    const source = current.text ?? readTableText(current.file, 'pos');
    const lines = splitLines(source);
    chain.unshift({ file: current.file, lines });
    seen.push(current.file);
    const builds = lines.find((line) => line.words[0]?.text === 'builds-on');
    current = undefined;
    if (!builds) break;
    const target = builds.words[1];
    const base = target && findTable(target.text, 'pos', chain[0]!.file);
    const at = (message: string) => problems.push(problem('table-invalid', chain[0]!.file, builds, target?.column ?? 1, message));
    if (!target) at('builds-on names the map to build on');
    else if (!base) problems.push(problem('table-not-found', chain[0]!.file, builds, target.column, `cannot build on "${target.text}": no such file, and no shipped POS map by that name`));
    else if (seen.includes(base)) at(`the maps build on each other in a circle: ${[...seen.slice(seen.indexOf(base)), base].join(' → ')}`);
    else if (seen.length >= 64) at('more than 64 maps build on each other here');
    else current = { file: base };
  }
  for (const { file, lines } of chain) {
    for (const line of lines) {
      const fail = (column: number, message: string, code: DiagnosticCode = 'table-invalid') => problems.push(problem(code, file, line, column, message));
      const [first, ...rest] = line.words;
      if (!first) continue;
      const keyword = KEYWORDS.has(first.text) ? first.text : 'tag';
      const words = keyword === 'tag' && first.text !== 'tag' ? line.words : rest;
      switch (keyword) {
        case 'table':
          map.name = words[0]?.text ?? map.name;
          break;
        case 'builds-on':
          break;
        case 'tag': {
          const [patterns, upos, feats, extra] = words;
          if (!patterns || !upos) {
            fail(first.column, 'a tag line is: tag PATTERN UPOS [FEATS]');
            break;
          }
          if (extra) {
            fail(extra.column, 'a tag line has a pattern, a UPOS and features, nothing more');
            break;
          }
          if (!universalTags.has(upos.text)) {
            fail(upos.column, `"${upos.text}" is not one of the 17 Universal POS tags`);
            break;
          }
          const parsed = feats ? parseFeatures(feats.text) : new Map<string, string>();
          if (typeof parsed === 'string') {
            fail(feats!.column, parsed);
            break;
          }
          for (const pattern of splitPatterns(patterns.text)) map.addTag(pattern, upos.text, parsed, line.number);
          break;
        }
        case 'feature': {
          const [patterns, feats] = words;
          if (!patterns || !feats || words.length !== 2) {
            fail(first.column, 'a feature line is: feature PATTERN,… Name=Value|…');
            break;
          }
          const parsed = parseFeatures(feats.text);
          if (typeof parsed === 'string') {
            fail(feats.column, parsed);
            break;
          }
          for (const pattern of splitPatterns(patterns.text)) map.addFeatures(pattern, parsed);
          break;
        }
        case 'upos': {
          const [upos, ...others] = words;
          if (!upos || !universalTags.has(upos.text)) {
            fail(upos?.column ?? first.column, `"${upos?.text ?? ''}" is not one of the 17 Universal POS tags`);
            break;
          }
          let feats = new Map<string, string>();
          if (others[0] && /^[A-Z]/.test(others[0].text)) {
            const parsed = parseFeatures(others[0].text);
            if (typeof parsed === 'string') {
              fail(others[0].column, parsed);
              break;
            }
            feats = parsed;
            others.shift();
          }
          const conditions = others.map((word) => compileCondition(word.text));
          const bad = conditions.findIndex((c) => typeof c === 'string');
          if (bad !== -1) {
            fail(others[bad]!.column, conditions[bad] as string);
            break;
          }
          map.addRule({ upos: upos.text, feats, conditions: conditions as Array<(c: WordContext) => boolean>, line: line.number });
          break;
        }
        case 'escape': {
          if (words.length !== 2) {
            fail(first.column, 'an escape line is: escape WRITTEN CHARACTER');
            break;
          }
          map.escapes.set(words[0]!.text, words[1]!.text);
          break;
        }
        case 'join':
          if (words.length !== 1) {
            fail(first.column, 'a join line is: join MARKER');
            break;
          }
          map.joinMarker = words[0]!.text;
          break;
      }
    }
  }
  if (problems.length > 0) throw new TableError(problems.slice(0, 200));
  return map;
}

/** Patterns are separated by commas; a comma alone is the comma tag. */
function splitPatterns(text: string): string[] {
  return text === ',' ? [','] : text.split(',').filter(Boolean);
}

function splitLines(text: string): Line[] {
  const raws = text.split('\n');
  const offsets = lineOffsets(raws);
  return raws.map((raw, i) => {
    const lineText = raw.replace(/\r$/, '');
    const words: Line['words'] = [];
    if (!/^\s*#/.test(lineText)) for (const match of lineText.matchAll(/\S+/g)) words.push({ text: match[0], column: match.index + 1 });
    return { number: i + 1, offset: offsets[i]!, text: lineText, words };
  });
}

function problem(code: DiagnosticCode, file: string, line: Line, column: number, message: string): Diagnostic {
  return diagnoseLine(code, message, { file, text: line.text, line: line.number, lineOffset: line.offset, column });
}

/** `Case=Dat|Number=Plur` (or `_`) as a map; a message when it is not features. */
function parseFeatures(text: string): Map<string, string> | string {
  const feats = new Map<string, string>();
  if (text === '_') return feats;
  for (const pair of text.split('|')) {
    if (!FEATURE.test(pair)) return `"${pair}" is not a feature: Name=Value, the name capitalised (Case=Dat)`;
    const equals = pair.indexOf('=');
    feats.set(pair.slice(0, equals), pair.slice(equals + 1));
  }
  return feats;
}

/** A condition of a word-class rule, or a message when it is not one. */
function compileCondition(text: string): ((context: WordContext) => boolean) | string {
  const equals = text.indexOf('=');
  const key = text.slice(0, equals) as (typeof CONDITION_KEYS)[number];
  if (equals <= 0 || !CONDITION_KEYS.includes(key)) return `"${text}" is not a condition: ${CONDITION_KEYS.join(', ')}, as KEY=VALUE,…`;
  const values = text.slice(equals + 1).split(',').filter(Boolean);
  if (values.length === 0) return `"${text}" names no value`;
  if (key === 'dependent' || key === 'head' || key === 'parent') {
    const matchers: Matcher[] = values.map((value) => compilePattern({ label: value, test: null }));
    return (context) => {
      const candidate = context[key];
      return candidate !== undefined && matchers.some((m) => m(candidate));
    };
  }
  if (key === 'relation') {
    const wanted = new Set(values);
    return (context) => wanted.has(context.relation) || wanted.has(context.relation.split(':')[0]!);
  }
  const tests = values.map((value) => globTest(key === 'pos' ? value : value.toLowerCase()));
  if (key === 'pos') {
    const tagTest = (tag: string) => tests.some((test) => test(tag));
    // Marked as a test of the tag alone, so that a map can decide it once per tag (see PosMap.entryFor).
    return Object.assign((context: WordContext) => tagTest(context.pos), { tagTest });
  }
  if (key === 'form') return (context) => tests.some((test) => test(context.form.toLowerCase()));
  return (context) => tests.some((test) => test((context.lemma ?? context.form).toLowerCase()));
}
