import { Option, type Command } from 'commander';
import { conversionDefaults, OptionsError, resolveConversionOptions, type ConversionOptions, type ResolvedConversion } from '../api/options.js';
import { TableError } from '../tables/load-table.js';
import { shippedTables } from '../tables/table-source.js';
import { tableErrorLines } from './print-problems.js';

/** The options of every command that converts bracketed trees to dependencies; defaults are the library's. */
export function addConversionOptions(command: Command, headsRequired = true): Command {
  const heads = new Option('--heads <table>', `head table: a shipped one (${shippedTables('heads').join(', ')}) or a path`);
  return command
    .addOption(headsRequired ? heads.makeOptionMandatory() : heads)
    .option('--labels <table>', `label table: a shipped one (${shippedTables('labels').join(', ')}) or a path; without one, function tags give the labels`)
    .addOption(new Option('--traces <mode>', 'keep: traces stay empty elements and phrases attach where they stand; resolve: antecedents of *T* *ICH* *EXP* *RNR* move to their traces and attach there').choices(['keep', 'resolve']).default(conversionDefaults.traces))
    .addOption(new Option('--coordination <style>', 'which conjunct heads a coordination: first (as in UD), last, conjunction, or table (the head table decides)').choices(['first', 'last', 'conjunction', 'table']).default(conversionDefaults.coordination))
    .addOption(new Option('--punctuation <policy>', 'where punctuation attaches: phrase (to the head of its phrase) or root').choices(['phrase', 'root']).default(conversionDefaults.punctuation))
    .option('--pos-map <map>', `word table giving UPOS, features and forms: a shipped one (${shippedTables('pos').join(', ')}) or a path`)
    .option('--lossless', 'carry each tree\'s bracketing in MISC (key Brackets) and a "# brackets" comment, so that to-brackets --lossless gives it back exactly');
}

/** The library's conversion options from the parsed command line. */
export function conversionOptionsOf(options: Record<string, unknown>): ConversionOptions {
  return {
    heads: options.heads as string,
    labels: options.labels as string | undefined,
    posMap: options.posMap as string | undefined,
    traces: options.traces as ConversionOptions['traces'],
    coordination: options.coordination as ConversionOptions['coordination'],
    punctuation: options.punctuation as ConversionOptions['punctuation'],
    lossless: options.lossless === true,
  };
}

/** The resolved conversion (tables loaded), or the problems as printable lines. */
export function resolveConversion(options: Record<string, unknown>): ResolvedConversion | { problems: string[] } {
  try {
    return resolveConversionOptions(conversionOptionsOf(options));
  } catch (error) {
    if (error instanceof TableError) return { problems: tableErrorLines(error) };
    if (error instanceof OptionsError) return { problems: error.problems };
    throw error;
  }
}

/** The conversion settings alone (tables loaded), for commands that do not carry brackets. */
export function conversionSettings(options: Record<string, unknown>): ResolvedConversion['settings'] | { problems: string[] } {
  const resolved = resolveConversion(options);
  return 'problems' in resolved ? resolved : resolved.settings;
}
