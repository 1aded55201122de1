import { z } from 'zod';
import type { ConversionSettings } from '../convert/convert-tree.js';
import { loadHeadTable, loadLabelTable } from '../tables/load-table.js';
import { loadPosMap, PosMap } from '../tables/load-pos-map.js';
import type { HeadTable, LabelTable } from '../tables/table-model.js';

/**
 * The defaults of a conversion, defined once: the library applies them and
 * the command line shows them. Traces kept (phrases attach where they stand),
 * the first conjunct heads a coordination (as in UD), punctuation hangs from
 * the head of its phrase, no lossless carrying.
 */
export const conversionDefaults = {
  traces: 'keep',
  coordination: 'first',
  punctuation: 'phrase',
  lossless: false,
} as const;

const headTable = z.custom<HeadTable>((value) => typeof value === 'object' && value !== null && (value as HeadTable).kind === 'heads', 'a head table (loadHeadTable)');
const labelTable = z.custom<LabelTable>((value) => typeof value === 'object' && value !== null && (value as LabelTable).kind === 'labels', 'a label table (loadLabelTable)');
const name = z.string().min(1, 'a table name or path');

/** How trees are converted: the tables (by shipped name, path, or loaded), and the choices of the conversion. */
export const conversionOptionsSchema = z.strictObject({
  /** The head table: `en-content`, a path, or a loaded table. */
  heads: z.union([name, headTable]),
  /** The label table giving UD relations; without one, function tags give the relations. */
  labels: z.union([name, labelTable]).optional(),
  /** The word table giving UPOS, features and forms (`en-ptb`, `penn-historical`). */
  posMap: z.union([name, z.instanceof(PosMap)]).optional(),
  /** `keep`: phrases attach where they stand; `resolve`: antecedents attach where their traces stand. */
  traces: z.enum(['keep', 'resolve']).default(conversionDefaults.traces),
  /** Which part of a coordination heads it: the first conjunct, the last, the conjunction, or the head table's choice. */
  coordination: z.enum(['first', 'last', 'conjunction', 'table']).default(conversionDefaults.coordination),
  /** Where punctuation attaches: to the head of its phrase, or to the root. */
  punctuation: z.enum(['phrase', 'root']).default(conversionDefaults.punctuation),
  /** Carry each tree's bracketing in MISC and comments, so that toBrackets gives it back exactly. */
  lossless: z.boolean().default(conversionDefaults.lossless),
});

/** The options of a conversion as a caller writes them (defaults may be left out). */
export type ConversionOptions = z.input<typeof conversionOptionsSchema>;

/** Options that are not valid: each problem with the option it concerns. */
export class OptionsError extends Error {
  constructor(readonly problems: string[]) {
    super(problems.join('; '));
  }
}

/** Checks options against a schema; throws {@link OptionsError} with every problem. */
export function checkOptions<S extends z.ZodType>(schema: S, options: unknown): z.output<S> {
  const checked = schema.safeParse(options);
  if (checked.success) return checked.data;
  throw new OptionsError(checked.error.issues.map((issue) => `${issue.path.join('.') || 'options'}: ${issue.message}`));
}

/** The settings of a conversion, tables loaded (a TableError when one cannot be), and whether to carry brackets. */
export interface ResolvedConversion {
  settings: ConversionSettings;
  lossless: boolean;
}

/** Validates conversion options and loads the tables they name. */
export function resolveConversionOptions(options: ConversionOptions): ResolvedConversion {
  const checked = checkOptions(conversionOptionsSchema, options);
  const settings: ConversionSettings = {
    heads: typeof checked.heads === 'string' ? loadHeadTable(checked.heads) : checked.heads,
    labels: checked.labels === undefined ? undefined : typeof checked.labels === 'string' ? loadLabelTable(checked.labels) : checked.labels,
    upos: checked.posMap === undefined ? undefined : typeof checked.posMap === 'string' ? loadPosMap(checked.posMap) : checked.posMap,
    traces: checked.traces,
    coordination: checked.coordination,
    punctuation: checked.punctuation,
  };
  return { settings, lossless: checked.lossless };
}
