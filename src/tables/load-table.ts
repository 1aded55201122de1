import { existsSync, readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';
import type { Diagnostic } from '../diagnostics/diagnostic.js';
import { diagnose } from '../diagnostics/diagnostic.js';
import type { DiagnosticCode } from '../diagnostics/codes.js';
import { parse, SyntaxError as GrammarError } from '../generated/tables-parser.js';
import { LineIndex } from '../model/line-index.js';
import { compilePattern, valueTest, type Candidate, type Matcher } from './label-pattern.js';
import type { HeadBlock, HeadStep, HeadTable, LabelCondition, LabelRule, LabelTable } from './table-model.js';
import type { StatementSyntax, WordSyntax } from './table-syntax.js';

/** The shipped tables: headrules/ at the package root (two levels up from src/tables and from dist/src/tables). */
export function headrulesFolder(): string {
  const here = dirname(fileURLToPath(import.meta.url));
  for (const up of ['../..', '../../..']) {
    const folder = resolve(here, up, 'headrules');
    if (existsSync(folder)) return folder;
  }
  return resolve(here, '../../headrules');
}

/** A table that cannot be loaded, with every problem found in it. */
export class TableError extends Error {
  constructor(readonly diagnostics: Diagnostic[]) {
    super(diagnostics.map((d) => `${d.file}:${d.line}:${d.column}: ${d.message}`).join('\n'));
  }
}

/** Finds a table by path, or by name among the shipped tables. */
export function resolveTable(nameOrPath: string, kind: 'heads' | 'labels', from?: string): string | undefined {
  const candidates = [
    ...(from ? [resolve(dirname(from), nameOrPath), resolve(dirname(from), `${nameOrPath}.${kind}`)] : []),
    resolve(nameOrPath),
    join(headrulesFolder(), `${nameOrPath}.${kind}`),
  ];
  return candidates.find((path) => existsSync(path) && !path.endsWith('/'));
}

export function loadHeadTable(nameOrPath: string): HeadTable {
  return new TableLoader().head(nameOrPath);
}

export function loadLabelTable(nameOrPath: string): LabelTable {
  return new TableLoader().labels(nameOrPath);
}

/** Compiles head-table text, for tests and tables made on the fly; `builds-on` names shipped tables. */
export function compileHeadTable(text: string, file = 'table.heads'): HeadTable {
  return new TableLoader().head(file, text);
}

export function compileLabelTable(text: string, file = 'table.labels'): LabelTable {
  return new TableLoader().labels(file, text);
}

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
  z.object({ keyword: z.enum(['left', 'right']), words: z.array(word).min(1, 'say how: each, any or first') }),
  z.object({ keyword: z.literal('label'), words: z.array(word).min(1, 'name the relation') }),
  z.object({ keyword: z.literal('otherwise'), words: z.tuple([word]) }),
]);
const relation = /^[a-z]+(:[a-z]+)?$/;
const conditionKeys = ['dependent', 'head', 'parent', 'pos', 'form', 'lemma', 'side', 'role'] as const;

class TableLoader {
  private readonly loading = new Set<string>();
  private problems: Diagnostic[] = [];
  private file = '';
  private lines: LineIndex | undefined;

  head(nameOrPath: string, text?: string): HeadTable {
    const statements = this.read(nameOrPath, 'heads', text);
    let table: HeadTable = {
      kind: 'heads',
      name: nameOrPath,
      blocks: new Map(),
      fallback: { categories: ['*'], steps: [{ end: 'left', mode: 'first', patterns: [], guards: [], vetoes: [], written: [], file: 'built in', line: 0 }] },
      punctuation: () => false,
      coordinators: () => false,
      coordinationRule: undefined,
      raising: undefined,
    };
    let block: HeadBlock | undefined;
    const file = this.file;
    // Blocks with no step line at all, by where their head statement stands.
    const stepless = new Map<HeadBlock, StatementSyntax>();
    for (const statement of statements) {
      const words = statement.words;
      switch (statement.keyword) {
        case 'table':
          table.name = words[0]!.text;
          break;
        case 'builds-on': {
          const base = this.nested(() => new TableLoader().headFrom(words[0]!.text, file), words[0]!);
          if (base) table = { ...base, name: table.name, blocks: new Map(base.blocks) };
          break;
        }
        case 'punctuation':
          table.punctuation = this.anyOf(words);
          break;
        case 'coordinators':
          table.coordinators = this.anyOf(words);
          break;
        case 'coordination-rule':
          table.coordinationRule = 'collins';
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
    this.finish();
    return table;
  }

  private headFrom(nameOrPath: string, from: string): HeadTable {
    const path = resolveTable(nameOrPath, 'heads', from);
    return this.head(path ?? nameOrPath);
  }

  labels(nameOrPath: string, text?: string): LabelTable {
    const statements = this.read(nameOrPath, 'labels', text);
    let table: LabelTable = { kind: 'labels', name: nameOrPath, rules: [], otherwise: 'dep' };
    const own: LabelRule[] = [];
    const file = this.file;
    for (const statement of statements) {
      const words = statement.words;
      switch (statement.keyword) {
        case 'table':
          table.name = words[0]!.text;
          break;
        case 'builds-on': {
          const base = this.nested(() => new TableLoader().labels(resolveTable(words[0]!.text, 'labels', file) ?? words[0]!.text), words[0]!);
          if (base) table = { ...base, name: table.name };
          break;
        }
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
    this.finish();
    return table;
  }

  private read(nameOrPath: string, kind: 'heads' | 'labels', text?: string): StatementSyntax[] {
    let path = nameOrPath;
    if (text === undefined) {
      const found = resolveTable(nameOrPath, kind);
      if (!found) {
        const shipped = ['heads', 'labels'].includes(kind) ? `shipped tables are in ${headrulesFolder()}` : '';
        throw new TableError([
          { code: 'table-not-found', severity: 'error', message: `no ${kind} table "${nameOrPath}" (${shipped})`, file: nameOrPath, offset: 0, line: 1, column: 1 },
        ]);
      }
      path = found;
      if (this.loading.has(path)) throw new TableError([{ code: 'table-invalid', severity: 'error', message: `${path} builds on itself`, file: path, offset: 0, line: 1, column: 1 }]);
      this.loading.add(path);
      text = readFileSync(path, 'utf8');
    }
    this.file = path;
    this.lines = new LineIndex(text, { offset: 0, line: 1, column: 1 });
    let statements: StatementSyntax[];
    try {
      statements = parse(text);
    } catch (error) {
      if (!(error instanceof GrammarError)) throw error;
      const start = error.location.start;
      this.problem('table-syntax', { line: start.line, column: start.column }, 'this line is not a statement: a statement starts with a lower-case keyword such as head, left, right or label');
      this.finish();
      return [];
    }
    const valid: StatementSyntax[] = [];
    for (const statement of statements) {
      const checked = statementShapes.safeParse(statement);
      if (checked.success) valid.push(statement);
      else {
        const issue = checked.error.issues[0]!;
        const index = issue.path[0] === 'words' && typeof issue.path[1] === 'number' ? issue.path[1] : -1;
        const at = index >= 0 && statement.words[index] ? statement.words[index]! : statement;
        const message = issue.code === 'invalid_union' ? `"${statement.keyword}" is not a statement of a table` : `${statement.keyword}: ${issue.message}`;
        this.problem(issue.code === 'invalid_union' ? 'table-syntax' : 'table-invalid', at, message);
      }
    }
    return valid;
  }

  private step(statement: StatementSyntax): HeadStep | undefined {
    const [how, ...rest] = statement.words;
    const mode = how!.text;
    // Patterns, then optionally `if PATTERN...`, then optionally `unless PATTERN...`.
    const ifAt = rest.findIndex((w) => w.text === 'if');
    const unlessAt = rest.findIndex((w) => w.text === 'unless');
    const patternsEnd = [ifAt, unlessAt].filter((i) => i !== -1).reduce((a, b) => Math.min(a, b), rest.length);
    const patternWords = rest.slice(0, patternsEnd);
    const guardWords = ifAt === -1 ? [] : rest.slice(ifAt + 1, unlessAt > ifAt ? unlessAt : rest.length);
    const vetoWords = unlessAt === -1 ? [] : rest.slice(unlessAt + 1, ifAt > unlessAt ? ifAt : rest.length);
    for (const [at, found] of [[ifAt, guardWords], [unlessAt, vetoWords]] as const) {
      if (at !== -1 && found.length === 0) {
        this.problem('table-invalid', rest[at]!, `"${rest[at]!.text}" needs at least one pattern after it`);
        return undefined;
      }
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
    if ([...patterns, ...guards, ...vetoes].some((p) => p === undefined)) return undefined;
    return {
      end: statement.keyword as 'left' | 'right',
      mode,
      patterns: patterns as Matcher[],
      guards: guards as Matcher[],
      vetoes: vetoes as Matcher[],
      written: patternWords.map((w) => w.text),
      file: this.file,
      line: statement.line,
    };
  }

  private pattern(w: WordSyntax): Matcher | undefined {
    try {
      const syntax = parse(w.text, { startRule: 'Pattern' });
      if (syntax.test && !['pos', 'form', 'lemma'].includes(syntax.test.key)) {
        this.problem('table-invalid', w, `"${syntax.test.key}" is not a test of a head word: pos, form or lemma`);
        return undefined;
      }
      return compilePattern(syntax);
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
      conditions.push({ key, test: this.condition(key, syntax.values, w) });
    }
    return { relation: relationWord!.text, conditions, file: this.file, line: statement.line };
  }

  private condition(key: LabelCondition['key'], values: string[], w: WordSyntax): LabelCondition['test'] {
    if (key === 'dependent' || key === 'head' || key === 'parent') {
      const matcher = this.anyOf(values.map((text) => ({ ...w, text })));
      return (context) => matcher(context[key]);
    }
    if (key === 'side' || key === 'role') {
      const allowed = key === 'side' ? ['left', 'right'] : ['conjunct', 'coordinator', 'punctuation', 'raised', 'other'];
      const wrong = values.find((value) => !allowed.includes(value));
      if (wrong) this.problem('table-invalid', w, `${key} is ${allowed.join(' or ')}, not "${wrong}"`);
      return (context) => values.includes(context[key]);
    }
    const test = valueTest(values, key !== 'pos');
    if (key === 'pos') return (context) => test(context.word.pos);
    if (key === 'form') return (context) => test(context.word.form);
    return (context) => test(context.word.lemma ?? context.word.form);
  }

  private anyOf(words: WordSyntax[]): Matcher {
    const matchers = words.map((w) => this.pattern(w)).filter((m): m is Matcher => m !== undefined);
    return (candidate: Candidate) => matchers.some((m) => m(candidate));
  }

  private nested<T>(load: () => T, at: WordSyntax): T | undefined {
    try {
      return load();
    } catch (error) {
      if (!(error instanceof TableError)) throw error;
      this.problem('table-not-found', at, `cannot build on "${at.text}": ${error.diagnostics[0]?.message ?? 'not found'}`);
      return undefined;
    }
  }

  private problem(code: DiagnosticCode, at: { line: number; column: number }, message: string): void {
    const lines = this.lines ?? new LineIndex('', { offset: 0, line: 1, column: 1 });
    // Offsets are not needed for table problems: place the diagnostic by line and column.
    const diagnostic = diagnose(code, message, { file: this.file, offset: 0, lines });
    const text = lines.text.split('\n')[at.line - 1] ?? '';
    this.problems.push({ ...diagnostic, line: at.line, column: at.column, excerpt: { text, column: 1 } });
  }

  private finish(): void {
    if (this.problems.length > 0) {
      const problems = this.problems;
      this.problems = [];
      throw new TableError(problems);
    }
  }
}
