import type { Diagnostic } from '../diagnostics/diagnostic.js';
import type { DiagnosticCode } from '../diagnostics/codes.js';
import { diagnoseLine, lineOffsets } from '../diagnostics/diagnostic.js';
import { z } from 'zod';
import { parse, SyntaxError as GrammarError } from '../generated/tables-parser.js';
import { categoryCouldMatch, compileAnyOf, compilePattern, valueTest, type Matcher } from './label-pattern.js';
import type { FixedExpressions, HeadBlock, HeadStep, HeadTable, LabelCondition, LabelRule, LabelTable } from './table-model.js';
import type { PatternSyntax, StatementSyntax, WordSyntax } from './table-syntax.js';
import { findTable, readTableText, requireTable, TableError, type TableKind } from './table-source.js';

export { headrulesFolder, TableError } from './table-source.js';

/** Finds a table by path, or by name among the shipped tables. */
export function resolveTable(nameOrPath: string, kind: TableKind, from?: string): string | undefined {
  return findTable(nameOrPath, kind, from);
}

/**
 * Loads a head table by shipped name or path, with the tables it builds on;
 * or, given `text`, compiles that text (named `nameOrPath` in problems, its
 * `builds-on` found beside it or among the shipped tables).
 */
export function loadHeadTable(nameOrPath: string, text?: string): HeadTable {
  return text === undefined ? new TableLoader().head(requireTable(nameOrPath, 'heads')) : new TableLoader().head(nameOrPath, text);
}

/** Loads a label table by shipped name or path, or compiles `text`; see {@link loadHeadTable}. */
export function loadLabelTable(nameOrPath: string, text?: string): LabelTable {
  return text === undefined ? new TableLoader().labels(requireTable(nameOrPath, 'labels')) : new TableLoader().labels(nameOrPath, text);
}

/**
 * Compiles head-table text, for tests and tables made in code; `builds-on`
 * names shipped tables or paths relative to `file`.
 */
export function compileHeadTable(text: string, file = 'table.heads'): HeadTable {
  return new TableLoader().head(file, text);
}

/** Compiles label-table text; see {@link compileHeadTable}. */
export function compileLabelTable(text: string, file = 'table.labels'): LabelTable {
  return new TableLoader().labels(file, text);
}

/** Longest chain of tables building on each other. */
export const MAX_TABLE_CHAIN = 64;

/** Problems kept per table load; the rest are counted in one last diagnostic. */
const MAX_PROBLEMS = 200;

// What each statement must look like; checked with zod, problems mapped back to their line and column.
const word = z.object({ text: z.string(), line: z.number(), column: z.number() });
const name = word.extend({ text: z.string().regex(/^[A-Za-z0-9._/-]+$/, 'a table name is letters, digits, dots, hyphens and slashes') });
const statementShapes = z.discriminatedUnion('keyword', [
  z.object({ keyword: z.literal('table'), words: z.tuple([name]) }),
  z.object({ keyword: z.literal('builds-on'), words: z.tuple([word]) }),
  z.object({ keyword: z.literal('punctuation'), words: z.array(word).min(1, 'name at least one label') }),
  z.object({ keyword: z.literal('coordinators'), words: z.array(word).min(1, 'name at least one label') }),
  z.object({ keyword: z.literal('coordination-rule'), words: z.tuple([word.extend({ text: z.literal('collins') })]) }),
  z.object({ keyword: z.literal('raise-subject'), words: z.array(word).min(7, 'write raise-subject CATEGORY... under CATEGORY... with PATTERN... without PATTERN...') }),
  z.object({ keyword: z.literal('head'), words: z.array(word).min(1, 'name the parent categories, or * for the default block') }),
  z.object({
    keyword: z.literal('words'),
    words: z.tuple([word.extend({ text: z.string().regex(/^[a-z][a-z0-9-]*$/, 'a word list is named in lower-case letters, digits and hyphens') })], word).refine((w) => w.length >= 2, 'name the list, then its words'),
  }),
  z.object({ keyword: z.literal('late-conjuncts'), words: z.array(word).min(1, 'name the phrase categories, or write late-conjuncts off') }),
  z.object({ keyword: z.literal('fixed'), words: z.array(word).min(1, 'name the words of the expression, at least two, or write fixed off') }),
  z.object({ keyword: z.enum(['left', 'right']), words: z.array(word).min(1, 'say how: each, any or first') }),
  z.object({ keyword: z.literal('label'), words: z.array(word).min(1, 'name the relation') }),
  z.object({ keyword: z.literal('otherwise'), words: z.tuple([word]) }),
]);
const relation = /^[a-z]+(:[a-z]+)?$/;
const conditionKeys = ['dependent', 'head', 'parent', 'child', 'previous', 'next', 'pos', 'form', 'lemma', 'side', 'role'] as const;

function noFixedExpressions(): FixedExpressions {
  return { byText: new Map(), firstWords: new Set(), longest: 0 };
}

function copyFixedExpressions(fixed: FixedExpressions): FixedExpressions {
  return { byText: new Map(fixed.byText), firstWords: new Set(fixed.firstWords), longest: fixed.longest };
}

/** One table file of a chain: its statements, and where problems in it are placed. */
interface Link {
  file: string;
  /** The file's lines, split once, for excerpts. */
  lines: string[];
  /** Where each line starts, found when a problem needs it. */
  offsets?: number[];
  statements: StatementSyntax[];
}

class TableLoader {
  private problems: Diagnostic[] = [];
  private dropped = 0;
  /** The file whose statements are being compiled. */
  private link: Link = { file: '', lines: [], statements: [] };
  /** Named word lists (`words titles Mr. Mrs.`) of the tables compiled so far in a chain, used as `@titles`. */
  private lists = new Map<string, string[]>();

  /**
   * Takes in a file's word lists before its other statements, so that a list
   * may be used above the line that defines it; a list named again grows.
   */
  private collectLists(link: Link): void {
    for (const statement of link.statements) {
      if (statement.keyword !== 'words') continue;
      const [name, ...values] = statement.words.map((w) => w.text);
      this.lists.set(name!, [...(this.lists.get(name!) ?? []), ...values]);
    }
  }

  /** Values with `@name` replaced by the words of that list; an unknown list is reported. */
  private expand(values: string[], at: { line: number; column: number }): string[] {
    if (!values.some((value) => value.startsWith('@'))) return values;
    return values.flatMap((value) => {
      if (!value.startsWith('@')) return [value];
      const list = this.lists.get(value.slice(1));
      if (!list) this.problem('table-invalid', at, `no word list "${value.slice(1)}": define it with words ${value.slice(1)} WORD…`);
      return list ?? [];
    });
  }

  /**
   * The table and every table under it, base first. `builds-on` chains are
   * followed without recursion; a loop, a chain longer than
   * {@link MAX_TABLE_CHAIN} or a second `builds-on` in one table is reported at
   * its line.
   */
  private chain(path: string, kind: TableKind, text?: string): Link[] {
    const links: Link[] = [];
    const seen: string[] = [];
    let current: { path: string; text?: string } | undefined = { path, text };
    while (current) {
      const link = this.read(current.path, kind, current.text);
      links.push(link);
      seen.push(current.path);
      current = undefined;
      const builds = link.statements.filter((statement) => statement.keyword === 'builds-on');
      for (const extra of builds.slice(1)) this.problem('table-invalid', extra, 'a table builds on one table only');
      const target = builds[0]?.words[0];
      if (!target) break;
      const base = findTable(target.text, kind, link.file);
      if (!base) {
        this.problem('table-not-found', target, `cannot build on "${target.text}": no such file, and no shipped table by that name`);
        break;
      }
      if (seen.includes(base)) {
        const circle = [...seen.slice(seen.indexOf(base)), base].join(' → ');
        this.problem('table-invalid', target, `the tables build on each other in a circle: ${circle}`);
        break;
      }
      if (links.length >= MAX_TABLE_CHAIN) {
        this.problem('table-invalid', target, `more than ${MAX_TABLE_CHAIN} tables build on each other here; a chain that long is a mistake`);
        break;
      }
      current = { path: base };
    }
    return links.reverse();
  }

  head(path: string, text?: string): HeadTable {
    const links = this.chain(path, 'heads', text);
    let table: HeadTable = {
      kind: 'heads',
      name: path,
      blocks: new Map(),
      fallback: { categories: ['*'], steps: [{ end: 'left', mode: 'first', patterns: [], guards: [], vetoes: [], phrases: [], written: [], file: 'built in', line: 0 }] },
      punctuation: () => false,
      coordinators: () => false,
      coordinationRule: undefined,
      raising: undefined,
      fixed: noFixedExpressions(),
      lateConjuncts: undefined,
    };
    this.lists = new Map();
    for (const link of links) {
      this.link = link;
      this.collectLists(link);
      table = this.headLink(link, { ...table, name: link.file, blocks: new Map(table.blocks), fixed: copyFixedExpressions(table.fixed) });
    }
    this.finish();
    return table;
  }

  /** Compiles one table's statements over the table it builds on. */
  private headLink(link: Link, table: HeadTable): HeadTable {
    let block: HeadBlock | undefined;
    // Blocks with no step line at all, by where their head statement stands.
    const stepless = new Map<HeadBlock, StatementSyntax>();
    for (const statement of link.statements) {
      const words = statement.words;
      switch (statement.keyword) {
        case 'table':
          table.name = words[0]!.text;
          break;
        case 'builds-on':
        case 'words':
          break;
        case 'punctuation':
          table.punctuation = this.anyOf(words);
          break;
        case 'coordinators':
          table.coordinators = this.anyOf(words);
          break;
        case 'coordination-rule':
          table.coordinationRule = 'collins';
          break;
        case 'fixed':
          // `fixed off` switches the step off: the expressions of the tables built on are forgotten.
          if (words.length === 1 && words[0]!.text === 'off') table.fixed = noFixedExpressions();
          else if (words.length === 1) this.problem('table-invalid', words[0]!, 'fixed names the words of an expression, at least two (fixed because of), or is fixed off');
          else {
            const forms = words.map((w) => w.text.toLowerCase());
            table.fixed.byText.set(forms.join(' '), { file: link.file, line: statement.line });
            table.fixed.firstWords.add(forms[0]!);
            table.fixed.longest = Math.max(table.fixed.longest, forms.length);
          }
          break;
        case 'late-conjuncts':
          table.lateConjuncts = words.length === 1 && words[0]!.text === 'off' ? undefined : { phrases: this.anyOf(words), file: link.file, line: statement.line };
          break;
        case 'raise-subject': {
          const at = (word: string) => words.findIndex((w) => w.text === word);
          const [under, withAt, without] = [at('under'), at('with'), at('without')];
          if (!(under >= 1 && withAt > under + 1 && without > withAt + 1 && without < words.length - 1)) {
            this.problem('table-invalid', statement, 'write raise-subject CATEGORY... under CATEGORY... with PATTERN... without PATTERN...');
            break;
          }
          table.raising = {
            clause: this.anyOf(words.slice(0, under)),
            under: this.anyOf(words.slice(under + 1, withAt)),
            subject: this.anyOf(words.slice(withAt + 1, without)),
            without: this.anyOf(words.slice(without + 1)),
          };
          break;
        }
        case 'head':
          block = { categories: words.map((w) => w.text), steps: [] };
          stepless.set(block, statement);
          for (const category of block.categories) {
            if (category === '*') table.fallback = block;
            else table.blocks.set(category, block);
          }
          break;
        case 'left':
        case 'right': {
          if (!block) {
            this.problem('table-invalid', statement, 'a step outside any block; start a block with "head CATEGORY"');
            break;
          }
          stepless.delete(block);
          const step = this.step(statement);
          if (step) block.steps.push(step);
          break;
        }
        default:
          this.problem('table-invalid', statement, `"${statement.keyword}" does not belong in a head table`);
      }
    }
    for (const [b, statement] of stepless) this.problem('table-invalid', statement, `the block for ${b.categories.join(' ')} has no step`);
    return table;
  }

  labels(path: string, text?: string): LabelTable {
    const links = this.chain(path, 'labels', text);
    let table: LabelTable = { kind: 'labels', name: path, rules: [], otherwise: 'dep' };
    this.lists = new Map();
    for (const link of links) {
      this.link = link;
      this.collectLists(link);
      const own: LabelRule[] = [];
      table = { ...table, name: link.file };
      for (const statement of link.statements) {
        const words = statement.words;
        switch (statement.keyword) {
          case 'table':
            table.name = words[0]!.text;
            break;
          case 'builds-on':
          case 'words':
            break;
          case 'label': {
            const rule = this.rule(statement);
            if (rule) own.push(rule);
            break;
          }
          case 'otherwise':
            if (!relation.test(words[0]!.text)) this.problem('table-invalid', words[0]!, `"${words[0]!.text}" is not a relation`);
            table.otherwise = words[0]!.text;
            break;
          default:
            this.problem('table-invalid', statement, `"${statement.keyword}" does not belong in a label table`);
        }
      }
      // A table's own rules come before those it builds on, so that it can refine them.
      table.rules = [...own, ...table.rules];
    }
    this.finish();
    return table;
  }

  /** Reads and parses one file (or the text given for it); statements that do not parse are reported. */
  private read(path: string, kind: TableKind, text?: string): Link {
    const source = text ?? readTableText(path, kind);
    const link: Link = { file: path, lines: source.split('\n'), statements: [] };
    this.link = link;
    let statements: StatementSyntax[];
    try {
      statements = parse(source);
    } catch (error) {
      if (!(error instanceof GrammarError)) throw error;
      const start = error.location.start;
      this.problem('table-syntax', { line: start.line, column: start.column }, 'this line is not a statement: a statement starts with a lower-case keyword such as head, left, right or label');
      return link;
    }
    for (const statement of statements) {
      const checked = statementShapes.safeParse(statement);
      if (checked.success) link.statements.push(statement);
      else {
        const issue = checked.error.issues[0]!;
        const index = issue.path[0] === 'words' && typeof issue.path[1] === 'number' ? issue.path[1] : -1;
        const at = index >= 0 && statement.words[index] ? statement.words[index]! : statement;
        const message = issue.code === 'invalid_union' ? `"${statement.keyword}" is not a statement of a table` : `${statement.keyword}: ${issue.message}`;
        this.problem(issue.code === 'invalid_union' ? 'table-syntax' : 'table-invalid', at, message);
      }
    }
    return link;
  }

  private step(statement: StatementSyntax): HeadStep | undefined {
    const [how, ...rest] = statement.words;
    const mode = how!.text;
    // Patterns, then optionally `if PATTERN...`, `unless PATTERN...` and `for PATTERN...`, in any order.
    const clauseAt = (keyword: string) => rest.findIndex((w) => w.text === keyword);
    const starts = ['if', 'unless', 'for'].map(clauseAt);
    const patternsEnd = starts.filter((i) => i !== -1).reduce((a, b) => Math.min(a, b), rest.length);
    const patternWords = rest.slice(0, patternsEnd);
    const clause = (at: number) => (at === -1 ? [] : rest.slice(at + 1, starts.filter((i) => i > at).reduce((a, b) => Math.min(a, b), rest.length)));
    const [guardWords, vetoWords, phraseWords] = starts.map(clause) as [WordSyntax[], WordSyntax[], WordSyntax[]];
    for (const at of starts) {
      if (at !== -1 && clause(at).length === 0) {
        this.problem('table-invalid', rest[at]!, `"${rest[at]!.text}" needs at least one pattern after it`);
        return undefined;
      }
    }
    const tested = phraseWords.find((w) => w.text.includes('['));
    if (tested) {
      this.problem('table-invalid', tested, '"for" patterns name the labels of the phrase itself, whose head word is not known yet: no [key=value] test');
      return undefined;
    }
    if (mode !== 'each' && mode !== 'any' && mode !== 'only' && mode !== 'first') {
      this.problem('table-invalid', how!, `"${mode}" is not a way to look: each, any, only or first`);
      return undefined;
    }
    if (mode === 'first' && patternWords.length > 0) {
      this.problem('table-invalid', patternWords[0]!, '"first" takes no patterns');
      return undefined;
    }
    if (mode !== 'first' && patternWords.length === 0) {
      this.problem('table-invalid', how!, `"${mode}" needs at least one pattern`);
      return undefined;
    }
    const patterns = patternWords.map((w) => this.pattern(w));
    const guards = guardWords.map((w) => this.pattern(w));
    const vetoes = vetoWords.map((w) => this.pattern(w));
    const phrases = phraseWords.map((w) => this.pattern(w));
    if ([...patterns, ...guards, ...vetoes, ...phrases].some((p) => p === undefined)) return undefined;
    return {
      end: statement.keyword as 'left' | 'right',
      mode,
      patterns: patterns as Matcher[],
      guards: guards as Matcher[],
      vetoes: vetoes as Matcher[],
      phrases: phrases as Matcher[],
      written: patternWords.map((w) => w.text),
      file: this.link.file,
      line: statement.line,
    };
  }

  private pattern(w: WordSyntax): Matcher | undefined {
    const syntax = this.patternSyntax(w);
    return syntax && compilePattern(syntax);
  }

  private patternSyntax(w: WordSyntax): PatternSyntax | undefined {
    try {
      const syntax = parse(w.text, { startRule: 'Pattern' }) as PatternSyntax;
      if (syntax.test && !['pos', 'form', 'lemma'].includes(syntax.test.key)) {
        this.problem('table-invalid', w, `"${syntax.test.key}" is not a test of a head word: pos, form or lemma`);
        return undefined;
      }
      if (syntax.test) syntax.test.values = this.expand(syntax.test.values, w);
      return syntax;
    } catch (error) {
      if (!(error instanceof GrammarError)) throw error;
      this.problem('table-syntax', { line: w.line, column: w.column + error.location.start.offset }, `"${w.text}" is not a pattern such as NP, VB*, *-PRD or VB*[lemma=be]`);
      return undefined;
    }
  }

  private rule(statement: StatementSyntax): LabelRule | undefined {
    const [relationWord, ...conditionWords] = statement.words;
    if (!relation.test(relationWord!.text)) {
      this.problem('table-invalid', relationWord!, `"${relationWord!.text}" is not a relation such as nsubj or obl:tmod`);
      return undefined;
    }
    const conditions: LabelCondition[] = [];
    for (const w of conditionWords) {
      let syntax;
      try {
        syntax = parse(w.text, { startRule: 'Condition' });
      } catch (error) {
        if (!(error instanceof GrammarError)) throw error;
        this.problem('table-syntax', w, `"${w.text}" is not a condition such as dependent=NP or side=left`);
        return undefined;
      }
      const key = syntax.key as LabelCondition['key'];
      if (!conditionKeys.includes(key)) {
        this.problem('table-invalid', w, `"${syntax.key}" is not a condition: ${conditionKeys.join(', ')}`);
        return undefined;
      }
      const test = this.condition(key, syntax.values, w);
      if (key !== 'dependent') conditions.push({ key, test });
      else {
        conditions.push({ key, test, dependentCategory: categoryFilter(syntax.values) });
      }
    }
    return { relation: relationWord!.text, conditions, file: this.link.file, line: statement.line };
  }

  private condition(key: LabelCondition['key'], values: string[], w: WordSyntax): LabelCondition['test'] {
    if (key === 'dependent' || key === 'head' || key === 'parent') {
      const matcher = this.anyOf(values.map((text) => ({ ...w, text })));
      return (context) => matcher(context[key]);
    }
    if (key === 'child') {
      const matcher = this.anyOf(values.map((text) => ({ ...w, text })));
      return (context) => context.children.some(matcher);
    }
    if (key === 'previous' || key === 'next') {
      const matcher = this.anyOf(values.map((text) => ({ ...w, text })));
      return (context) => context[key] !== undefined && matcher(context[key]!);
    }
    if (key === 'side' || key === 'role') {
      const allowed = key === 'side' ? ['left', 'right'] : ['conjunct', 'coordinator', 'punctuation', 'raised', 'fixed', 'other'];
      const wrong = values.find((value) => !allowed.includes(value));
      if (wrong) this.problem('table-invalid', w, `${key} is ${allowed.join(' or ')}, not "${wrong}"`);
      return (context) => values.includes(context[key]);
    }
    const test = valueTest(this.expand(values, w), key !== 'pos');
    if (key === 'pos') return (context) => test(context.word.pos);
    if (key === 'form') return (context) => test(context.word.form);
    return (context) => test(context.word.lemma ?? context.word.form);
  }

  private anyOf(words: WordSyntax[]): Matcher {
    return compileAnyOf(words.map((w) => this.patternSyntax(w)).filter((p): p is PatternSyntax => p !== undefined));
  }

  private problem(code: DiagnosticCode, at: { line: number; column: number }, message: string): void {
    if (this.problems.length >= MAX_PROBLEMS) {
      this.dropped++;
      return;
    }
    const { file, lines } = this.link;
    this.link.offsets ??= lineOffsets(lines);
    const text = lines[at.line - 1] ?? '';
    this.problems.push(diagnoseLine(code, message, { file, text, line: at.line, lineOffset: this.link.offsets[at.line - 1] ?? 0, column: at.column }));
  }

  private finish(): void {
    if (this.problems.length === 0) return;
    const problems = this.problems;
    if (this.dropped > 0) {
      const last = problems[problems.length - 1]!;
      problems.push({ ...last, message: `and ${this.dropped} more problem${this.dropped === 1 ? '' : 's'} in this table, not listed`, excerpt: undefined });
    }
    this.problems = [];
    this.dropped = 0;
    throw new TableError(problems);
  }
}

/** Whether any of a condition's patterns could hold for a category; a pattern that does not parse (reported already) rules nothing out. */
function categoryFilter(values: string[]): (category: string) => boolean {
  const tests = values.map((text) => {
    try {
      return categoryCouldMatch(parse(text, { startRule: 'Pattern' }) as PatternSyntax);
    } catch {
      return () => true;
    }
  });
  return (category) => tests.some((could) => could(category));
}
