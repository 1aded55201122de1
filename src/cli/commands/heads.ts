import { Option, type Command } from 'commander';
import { explainHeads as explainHeadsOf } from '../../api/explain.js';
import { itemName } from '../../diagnostics/diagnostic.js';
import { addBracketedReadOptions, addTreeFormatOption, bracketedReadOptions } from '../bracketed-options.js';
import { addConversionOptions, conversionOptionsOf, conversionSettings } from '../conversion-options.js';
import { addListingOptions, listingOf, plural, ProblemPrinter } from '../print-problems.js';
import { ExitCode, type CommandResult } from '../exit-codes.js';
import { checkInputs, openInputs, Output, type CliIO } from '../io.js';
import { formatOf, type InputFormat } from '../input-format.js';
import { readSentencesOf, readTreesOf } from '../read-trees.js';
import type { ConversionScore } from '../../evaluate/score-conversion.js';
import { scoreHeads as scoreHeadsOf, suggestHeads as suggestHeadsOf, suggestLabels as suggestLabelsOf, unscoredTest, type HeadScore } from '../../api/evaluate.js';
import { ConversionScorer } from '../../evaluate/score-conversion.js';
import { scorePairsOnThreads } from '../../api/parallel/parallel-pairs.js';
import { addJobsOption, jobsOf } from '../jobs-option.js';
import { namedConversion } from '../converted-text.js';
import { compileHeadTable } from '../../tables/load-table.js';
import { describePairing, emptyTally, pairingIncomplete, pairWithGold, type PairingTally } from '../../evaluate/pair-with-gold.js';
import { basename, dirname, relative, resolve } from 'node:path';
import { findTable, headrulesFolder, readTableText } from '../../tables/table-source.js';
import { wholeNumber } from '../whole-number.js';
import { writeScoreReport } from '../../report/write-score-report.js';

export function registerHeads(program: Command, io: CliIO, done: (result: CommandResult) => void): void {
  const heads = program.command('heads').description('look into head tables: why a head was chosen');
  const explain = heads
    .command('explain')
    .description('for each phrase, the head chosen and the step of the table that chose it')
    .argument('<file>', 'a bracketed file, or - for standard input')
    .addOption(new Option('--sentence <n>', 'only the nth tree of the file (from 1)').argParser(wholeNumber(1)))
    .option('-o, --output <file>', 'write the explanation to a file (default: standard output)');
  addConversionOptions(explain);
  addListingOptions(explain);
  addTreeFormatOption(explain);
  addBracketedReadOptions(explain).action(async (file: string, options: Record<string, unknown>) => done(await explainHeads(file, options, io)));
  const score = heads
    .command('score')
    .description('convert bracketed trees and score them against gold dependencies: UAS, LAS and where the head table goes wrong')
    .argument('<files...>', 'bracketed files, in the order of the gold sentences')
    .requiredOption('--gold <files...>', 'CoNLL-U files with gold dependencies of the same sentences, in the same order (several after one --gold, or --gold repeated)')
    .addOption(new Option('--score-punctuation <mode>', 'count punctuation in the scores, or ignore it (words attached as punct or tagged PUNCT in the gold)').choices(['count', 'ignore']).default('ignore'))
    .option('--strict', 'exit 1 when any tree or gold sentence is left unpaired or misaligned')
    .option('--unscored <key=values>', 'gold words not to score, by a MISC key and its values: Align=absorbed,extra')
    .option('--json', 'print the scores as JSON')
    .option('--report <file>', 'also write an HTML page for tuning: the errors by phrase and by table step, linked to sentences drawn with the wrong choices marked')
    .addOption(new Option('--report-limit <n>', 'sentences with wrong heads drawn in the page, chosen evenly from the whole input').default(40).argParser(wholeNumber(1)))
    .addOption(new Option('--report-seed <n>', 'the seed of that choice: the same seed draws the same sentences').default(1).argParser(wholeNumber(0)))
    .option('-o, --output <file>', 'write the report to a file (default: standard output)');
  addConversionOptions(score);
  addListingOptions(score);
  addJobsOption(score);
  addTreeFormatOption(score);
  addBracketedReadOptions(score).action(async (files: string[], options: Record<string, unknown>) => done(await scoreHeads(files, options, io)));
  const suggest = heads
    .command('suggest')
    .description('learn from gold dependencies which child heads each phrase, and write a head table that improves on a base table')
    .argument('<files...>', 'bracketed files, in the order of the gold sentences')
    .requiredOption('--gold <files...>', 'CoNLL-U files with gold dependencies of the same sentences, in the same order (several after one --gold, or --gold repeated)')
    .option('--base <table>', 'the base table to build on and keep where it is right', 'generic')
    .option('--strict', 'exit 1 when any tree or gold sentence is left unpaired or misaligned')
    .requiredOption('-o, --output <file>', 'the new table file')
    .option('--name <name>', 'the new table\'s name (default: from the output file)')
    .option('--labels <file>', 'also learn a label table (UD relations) for the new head table, and write it to this file; reads the input twice, so files only')
    .option('--unscored <key=values>', 'gold words not to learn labels from, by a MISC key and its values: Align=absorbed,extra')
    .addOption(new Option('--min-phrases <n>', 'fewest phrases of a category to change its block').default(30).argParser(wholeNumber(1)))
    .addOption(new Option('--min-gain <share>', 'least gain, as a share of the phrases, to change a block').default(0.01).argParser(Number.parseFloat))
    .addOption(new Option('--coordination <style>', 'coordination style (its phrases are left out of learning)').choices(['first', 'last', 'conjunction', 'table']).default('first'))
    .addOption(new Option('--traces <mode>', 'keep: phrases attach where they stand; resolve: antecedents attach where their traces stand').choices(['keep', 'resolve']).default('keep'));
  addListingOptions(suggest);
  addTreeFormatOption(suggest);
  addBracketedReadOptions(suggest).action(async (files: string[], options: Record<string, unknown>) => done(await suggestHeads(files, options, io)));
  for (const command of heads.commands) {
    command.exitOverride().configureOutput({ writeOut: (text) => io.stdout.write(text), writeErr: (text) => io.stderr.write(text) });
  }
  heads.exitOverride().configureOutput({ writeOut: (text) => io.stdout.write(text), writeErr: (text) => io.stderr.write(text) });
}

async function explainHeads(file: string, options: Record<string, unknown>, io: CliIO): Promise<CommandResult> {
  const settings = conversionSettings(options);
  if ('problems' in settings) return { code: ExitCode.UsageOrIO, messages: settings.problems };
  const wanted = options.sentence as number | undefined;
  if (wanted !== undefined && !(wanted >= 1)) return { code: ExitCode.UsageOrIO, messages: ['--sentence counts trees from 1'] };
  const { inputs, failures } = await openInputs([file], io);
  const wrong = checkInputs(inputs, failures, 'heads explain', ['bracketed', 'xml'], options.from as InputFormat | undefined, [options.output as string | undefined], io);
  if (wrong.length > 0) return { code: ExitCode.UsageOrIO, messages: wrong };
  const output = Output.to(options.output as string | undefined, io, (message) => io.stderr.write(`treebridge: ${message}\n`));
  const problems = new ProblemPrinter(io, listingOf(options));
  const report = problems.report;
  let number = 0;
  try {
    for await (const tree of readTreesOf(inputs, bracketedReadOptions(options), report, io)) {
      number++;
      if (wanted !== undefined && number !== wanted) continue;
      const explanations = explainHeadsOf(tree, { settings, lossless: false });
      const where = tree.position && tree.source ? `${tree.file}:${tree.source.pointAt(tree.position.start).line}` : tree.file;
      if (!explanations) {
        await output.write(`${itemName(tree, number)} (${where}): no words\n\n`);
        continue;
      }
      const lines: string[] = [`${itemName(tree, number)} (${where}), heads by ${settings.heads.name}`];
      for (const step of explanations) {
        lines.push(`${'  '.repeat(step.depth + 1)}${step.label || '(top)'} → ${step.headLabel} "${step.headWord}": ${step.reason}`);
        for (const note of step.restructured ?? []) lines.push(`${'  '.repeat(step.depth + 2)}then ${note}`);
      }
      await output.write(lines.join('\n') + '\n\n');
      if (wanted !== undefined) break;
    }
    await output.commit();
  } catch (error) {
    await output.abandon();
    throw error;
  }
  problems.printSummary();
  if (wanted !== undefined && number < wanted) return { code: ExitCode.UsageOrIO, messages: [`${file} has ${number} trees; there is no tree ${wanted}`] };
  return { code: problems.errors > 0 ? ExitCode.Findings : ExitCode.Ok };
}

async function scoreHeads(files: string[], options: Record<string, unknown>, io: CliIO): Promise<CommandResult> {
  const settings = conversionSettings(options);
  if ('problems' in settings) return { code: ExitCode.UsageOrIO, messages: settings.problems };
  if ((options.gold as string[]).length === 0) return { code: ExitCode.UsageOrIO, messages: ['name the gold dependencies with --gold FILE (repeat it for several files)'] };
  const trees = await openInputs(files, io);
  const gold = await openInputs(options.gold as string[], io);
  const outputs = [options.output as string | undefined, options.report as string | undefined];
  const wrong = [
    ...checkInputs(trees.inputs, trees.failures, 'heads score', ['bracketed', 'xml'], options.from as InputFormat | undefined, outputs, io),
    ...checkInputs(gold.inputs, gold.failures, 'heads score --gold', ['conllu'], undefined, outputs, io),
  ];
  if (wrong.length > 0) return { code: ExitCode.UsageOrIO, messages: wrong };
  const unscored = unscoredOption(options.unscored);
  if (typeof unscored === 'string') return { code: ExitCode.UsageOrIO, messages: [unscored] };
  const output = Output.to(options.output as string | undefined, io, (message) => io.stderr.write(`treebridge: ${message}\n`));
  const problems = new ProblemPrinter(io, listingOf(options));
  const report = problems.report;
  let tally = emptyTally();
  try {
    const treeStream = readTreesOf(trees.inputs, bracketedReadOptions(options), report, io);
    const goldStream = readSentencesOf(gold.inputs, report, io);
    const countPunctuation = options.scorePunctuation === 'count';
    const jobs = jobsOf(options);
    let result: HeadScore;
    // A tree travels to a thread as its bracketed text: trees of XML graphs are scored here.
    const bracketed = trees.inputs.every((input) => formatOf(input, options.from as InputFormat | undefined) === 'bracketed');
    if (jobs > 1 && bracketed && typeof options.report !== 'string') {
      // Trees and gold are read and paired here, in order; the pairs are converted and scored on threads.
      const pairing = emptyTally();
      const skip = unscored ? unscoredTest(unscored.key, unscored.values) : undefined;
      const scorer = new ConversionScorer(settings, countPunctuation, skip);
      const pairs = pairWithGold(treeStream, goldStream, settings.traces, report, pairing, skip);
      await scorePairsOnThreads(pairs, scorer, { conversion: namedConversion(options), countPunctuation, read: bracketedReadOptions(options), ...(unscored ? { unscored } : {}) }, jobs);
      result = { ...scorer.result(), pairing };
    } else {
      result = await scoreHeadsOf(
        treeStream,
        goldStream,
        {
          ...conversionOptionsOf(options),
          heads: settings.heads,
          labels: settings.labels,
          posMap: settings.upos,
          lossless: false,
          countPunctuation,
          unscored,
          samples: typeof options.report === 'string' ? (options.reportLimit as number) : 0,
          seed: options.reportSeed as number,
        },
        report,
      );
    }
    tally = result.pairing;
    if (tally.paired === 0) {
      await output.abandon();
      return { code: ExitCode.Findings, messages: [`nothing to score: no tree paired with a gold sentence (${describePairing(tally)})`] };
    }
    const { scorer, oracle, byParent } = result;
    if (options.json === true) {
      const json = {
        sentences: scorer.score.sentences,
        words: scorer.score.words,
        uas: round(scorer.uas),
        las: round(scorer.las),
        oracleUas: round(oracle.uas),
        pairing: tally,
        byParent: byParent.map(({ category, words, errors: wrong, examples }) => ({ category, words, errors: wrong, examples })),
      };
      await output.write(JSON.stringify(json, null, 2) + '\n');
    } else {
      await output.write(formatScore(result, settings.heads.name, tally));
    }
    await output.commit();
    if (typeof options.report === 'string') {
      const page = Output.to(options.report, io, (message) => io.stderr.write(`treebridge: ${message}\n`));
      try {
        await page.write(writeScoreReport(result, settings.heads.name, tally));
        await page.commit();
      } catch (error) {
        await page.abandon();
        throw error;
      }
    }
  } catch (error) {
    await output.abandon();
    throw error;
  }
  problems.printSummary();
  io.stderr.write(`treebridge: ${describePairing(tally)}${typeof options.report === 'string' ? `; report written to ${options.report}` : ''}\n`);
  const strictFailure = options.strict === true && pairingIncomplete(tally);
  return { code: problems.errors > 0 || strictFailure ? ExitCode.Findings : ExitCode.Ok };
}

/** `--unscored KEY=V1,V2`: gold words whose MISC has KEY with one of the values. */
function unscoredOption(value: unknown): { key: string; values: string[] } | undefined | string {
  if (value === undefined) return undefined;
  const match = /^([^=|\s]+)=([^|\s]+)$/.exec(String(value));
  if (!match) return `--unscored takes KEY=VALUE[,VALUE…], a MISC key and its values; got "${String(value)}"`;
  return { key: match[1]!, values: match[2]!.split(',') };
}

function round(value: number): number {
  return Math.round(value * 10000) / 10000;
}

function formatScore(result: ConversionScore, table: string, tally: PairingTally): string {
  const { scorer, oracle, byParent, errors } = result;
  const percent = (n: number) => (100 * n).toFixed(2) + '%';
  const lines = [
    `${plural(scorer.score.sentences, 'sentence')}, ${plural(scorer.score.words, 'word')} scored${pairingIncomplete(tally) ? ` (${describePairing(tally)})` : ''}`,
    `UAS ${percent(scorer.uas)}   LAS ${percent(scorer.las)}   (oracle of head percolation: UAS ${percent(oracle.uas)})`,
    '',
    'wrong heads by the phrase where the word attaches',
    `  ${'category'.padEnd(10)} ${'words'.padStart(8)} ${'wrong'.padStart(7)} ${'share'.padStart(7)}  examples`,
  ];
  for (const tally of byParent.slice(0, 15)) {
    const share = tally.words ? ((100 * tally.errors) / tally.words).toFixed(1) + '%' : '';
    lines.push(`  ${tally.category.padEnd(10)} ${tally.words.toLocaleString('en-US').padStart(8)} ${tally.errors.toLocaleString('en-US').padStart(7)} ${share.padStart(7)}  ${tally.examples.join(' ')}`);
  }
  const bySteps = new Map<string, number>();
  for (const error of errors) {
    const key = error.stepLine === undefined ? `${error.parent}: no step (coordination, oracle or default)` : `${error.parent}: ${table} line ${error.stepLine}`;
    bySteps.set(key, (bySteps.get(key) ?? 0) + 1);
  }
  lines.push('', 'wrong heads by the step of the table that chose the head');
  for (const [key, n] of [...bySteps].sort((a, b) => b[1] - a[1]).slice(0, 10)) lines.push(`  ${n.toLocaleString('en-US').padStart(7)}  ${key}`);
  return lines.join('\n') + '\n';
}

/** Writes a whole text to a file in one go: the file appears complete or not at all. */
async function writeWhole(path: string, text: string, io: CliIO): Promise<void> {
  const output = Output.to(path, io, (message) => io.stderr.write(`treebridge: ${message}\n`));
  try {
    await output.write(text);
    await output.commit();
  } catch (error) {
    await output.abandon();
    throw error;
  }
}

async function suggestHeads(files: string[], options: Record<string, unknown>, io: CliIO): Promise<CommandResult> {
  const base = options.base as string;
  // Here --labels names the label table to learn and write, not one to convert with.
  const settings = conversionSettings({ ...options, labels: undefined, heads: base, punctuation: 'phrase' });
  if ('problems' in settings) return { code: ExitCode.UsageOrIO, messages: settings.problems };
  if ((options.gold as string[]).length === 0) return { code: ExitCode.UsageOrIO, messages: ['name the gold dependencies with --gold FILE (repeat it for several files)'] };
  const labelsPath = options.labels as string | undefined;
  const unscored = unscoredOption(options.unscored);
  if (typeof unscored === 'string') return { code: ExitCode.UsageOrIO, messages: [unscored] };
  if (labelsPath !== undefined && [...files, ...(options.gold as string[])].includes('-')) {
    return { code: ExitCode.UsageOrIO, messages: ['--labels reads the trees and the gold twice (once for the heads, once for the labels): name files, not standard input'] };
  }
  const trees = await openInputs(files, io);
  const gold = await openInputs(options.gold as string[], io);
  const outputs = [options.output as string | undefined, labelsPath];
  const wrong = [
    ...checkInputs(trees.inputs, trees.failures, 'heads suggest', ['bracketed', 'xml'], options.from as InputFormat | undefined, outputs, io),
    ...checkInputs(gold.inputs, gold.failures, 'heads suggest --gold', ['conllu'], undefined, outputs, io),
  ];
  if (wrong.length > 0) return { code: ExitCode.UsageOrIO, messages: wrong };
  const problems = new ProblemPrinter(io, listingOf(options));
  const report = problems.report;
  const path = options.output as string;
  const name = (options.name as string | undefined) ?? basename(path).replace(/\.heads$/, '');
  // The new table names its base as it will find it from its own folder; a table never builds on itself.
  const basePath = findTable(base, 'heads');
  const target = resolve(io.cwd ?? '.', path);
  const shippedBase = basePath !== undefined && dirname(basePath) === headrulesFolder();
  const written = shippedBase ? basename(basePath!).replace(/\.heads$/, '') : basePath ? relative(dirname(target), basePath) || basename(basePath) : base;
  const inline = basePath !== undefined && resolve(basePath) === target ? readTableText(basePath, 'heads') : undefined;
  const suggested = await suggestHeadsOf(
    readTreesOf(trees.inputs, bracketedReadOptions(options), report, io),
    readSentencesOf(gold.inputs, report, io),
    {
      base,
      name,
      baseReference: written,
      inlineBase: inline,
      minimumPhrases: options.minPhrases as number,
      minimumGain: options.minGain as number,
      traces: options.traces as 'keep' | 'resolve',
      coordination: options.coordination as 'first' | 'last' | 'conjunction' | 'table',
    },
    report,
  );
  const tally = suggested.pairing;
  const { changed, kept } = suggested;
  const collected = { sentences: suggested.sentences };
  if (tally.paired === 0) return { code: ExitCode.Findings, messages: [`nothing to learn from: no tree paired with a gold sentence (${describePairing(tally)})`] };
  await writeWhole(path, suggested.text, io);
  let labelNote = '';
  if (labelsPath !== undefined) {
    // The labels are learned on the attachments the new head table makes.
    const learnedHeads = compileHeadTable(suggested.text, target);
    const again = { trees: await openInputs(files, io), gold: await openInputs(options.gold as string[], io) };
    const quiet = () => undefined;
    const labels = await suggestLabelsOf(
      readTreesOf(again.trees.inputs, bracketedReadOptions(options), quiet, io),
      readSentencesOf(again.gold.inputs, quiet, io),
      {
        heads: learnedHeads,
        name: basename(labelsPath).replace(/\.labels$/, '').replace(/[^A-Za-z0-9._-]/g, '-') || 'suggested',
        traces: options.traces as 'keep' | 'resolve',
        coordination: options.coordination as 'first' | 'last' | 'conjunction' | 'table',
        ...(unscored ? { unscored } : {}),
      },
    );
    await writeWhole(labelsPath, labels.text, io);
    const { rules, right, attachments } = labels.learned;
    labelNote = `; ${plural(rules.length, 'label rule')} (${((100 * right) / Math.max(1, attachments)).toFixed(1)}% of the learned attachments labelled as the gold) written to ${labelsPath}`;
  }
  problems.printSummary();
  const left = pairingIncomplete(tally) ? ` (${describePairing(tally)})` : '';
  io.stderr.write(`treebridge: learned from ${plural(collected.sentences, 'sentence')}${left}: ${plural(changed.length, 'block')} changed, ${kept.length} kept from ${base}; wrote ${path}${labelNote}\n`);
  const strictFailure = options.strict === true && pairingIncomplete(tally);
  return { code: problems.errors > 0 || strictFailure ? ExitCode.Findings : ExitCode.Ok };
}
