import { z } from 'zod';
import type { Diagnostic } from '../diagnostics/diagnostic.js';
import { diagnoseLine, lineOffsets } from '../diagnostics/diagnostic.js';
import { parse, SyntaxError as GrammarError } from '../generated/tables-parser.js';
import { valueTest } from './label-pattern.js';
import { readTableText, requireTable, TableError } from './table-source.js';
import type { StatementSyntax } from './table-syntax.js';

/** What a category rule looks at: a word that heads a phrase. */
export interface CategoryContext {
  upos: string;
  xpos: string;
  /** The word's own relation. */
  relation: string;
  /** Relations of its dependents (universal parts). */
  dependents: ReadonlySet<string>;
}

/** A compiled category table: rules tried in order, the first that matches names the phrase. */
export interface CategoryTable {
  name: string;
  rules: Array<{ category: string; test: (context: CategoryContext) => boolean; line: number }>;
  otherwise: string;
}

const word = z.object({ text: z.string(), line: z.number(), column: z.number() });
const shapes = z.discriminatedUnion('keyword', [
  z.object({ keyword: z.literal('table'), words: z.tuple([word]) }),
  z.object({ keyword: z.literal('category'), words: z.array(word).min(2, 'name the category and at least one condition') }),
  z.object({ keyword: z.literal('otherwise'), words: z.tuple([word]) }),
]);
const keys = ['upos', 'xpos', 'relation', 'has'] as const;

/**
 * Reads a category table (`headrules/NAME.categories`): which phrase a word
 * projects, by its UPOS and XPOS, its own relation and the relations of its
 * dependents. Same statement syntax as head and label tables:
 * `category S upos=VERB,AUX has=nsubj,csubj`, `otherwise X`. By shipped name or
 * path, or, given `text`, from that text.
 */
export function loadCategoryTable(nameOrPath: string, text?: string): CategoryTable {
  const path = text === undefined ? requireTable(nameOrPath, 'categories') : nameOrPath;
  const source = text ?? readTableText(path, 'categories');
  const lines = source.split('\n');
  const offsets = lineOffsets(lines);
  const fail = (line: number, column: number, message: string, code: Diagnostic['code'] = 'table-invalid'): Diagnostic =>
    diagnoseLine(code, message, { file: path, text: lines[line - 1] ?? '', line, lineOffset: offsets[line - 1] ?? 0, column });
  let statements: StatementSyntax[];
  try {
    statements = parse(source);
  } catch (error) {
    if (!(error instanceof GrammarError)) throw error;
    throw new TableError([fail(error.location.start.line, error.location.start.column, 'this line is not a statement', 'table-syntax')]);
  }
  const table: CategoryTable = { name: nameOrPath, rules: [], otherwise: 'X' };
  const problems: Diagnostic[] = [];
  for (const statement of statements) {
    const checked = shapes.safeParse(statement);
    if (!checked.success) {
      problems.push(fail(statement.line, statement.column, `"${statement.keyword}" does not belong in a category table`));
      continue;
    }
    const [first, ...rest] = statement.words;
    if (statement.keyword === 'table') table.name = first!.text;
    else if (statement.keyword === 'otherwise') table.otherwise = first!.text;
    else {
      const tests: Array<(c: CategoryContext) => boolean> = [];
      for (const w of rest) {
        let syntax;
        try {
          syntax = parse(w.text, { startRule: 'Condition' });
        } catch (error) {
          if (!(error instanceof GrammarError)) throw error;
          problems.push(fail(w.line, w.column, `"${w.text}" is not a condition such as upos=VERB`, 'table-syntax'));
          continue;
        }
        const key = syntax.key as (typeof keys)[number];
        if (!keys.includes(key)) {
          problems.push(fail(w.line, w.column, `"${syntax.key}" is not a condition: ${keys.join(', ')}`));
          continue;
        }
        const test = valueTest(syntax.values, false);
        if (key === 'has') tests.push((c) => syntax.values.some((value) => c.dependents.has(value)));
        else tests.push((c) => test(c[key]));
      }
      table.rules.push({ category: first!.text, test: (c) => tests.every((t) => t(c)), line: statement.line });
    }
  }
  if (problems.length > 0) throw new TableError(problems);
  return table;
}

/** The category a word's phrase takes. */
export function categoryOf(table: CategoryTable, context: CategoryContext): string {
  return table.rules.find((rule) => rule.test(context))?.category ?? table.otherwise;
}
