import { shippedTables } from '../../tables/table-source.js';
import { Option, type Command } from 'commander';
import { lossKinds, type LossKind, type RoundTripReport } from '../../evaluate/roundtrip.js';
import { roundTrip, type RoundTrip } from '../../api/evaluate.js';
import { writeReport } from '../../report/write-report.js';
import { loadCategoryTable } from '../../tables/load-category-table.js';
import { TableError } from '../../tables/load-table.js';
import { addBracketedReadOptions, bracketedReadOptions, refuseIgnored, treeReadingOptions } from '../bracketed-options.js';
import { addConversionOptions, conversionOptionsOf, resolveConversion } from '../conversion-options.js';
import { ExitCode, type CommandResult } from '../exit-codes.js';
import { commonFormat, inputFormats, type InputFormat } from '../input-format.js';
import { checkInputs, openInputs, Output, type CliIO, type Input } from '../io.js';
import { addListingOptions, closingLine, listingOf, plural, ProblemPrinter, tableErrorLines } from '../print-problems.js';
import { readInputs, readSentencesOf, readTreesOf } from '../read-trees.js';
import { addJobsOption, jobsOf } from '../jobs-option.js';
import { namedConversion } from '../converted-text.js';
import { ParallelBatches } from '../../api/parallel/parallel-batches.js';
import type { DoneBatch, TripWork } from '../../api/parallel/tasks.js';
import { bracketRoundTrip, dependencyRoundTrip } from '../../api/evaluate.js';
import { sentenceEvents } from '../sentence-events.js';
import type { BracketRoundTrip } from '../../evaluate/roundtrip.js';
import type { BracketedReadOptions } from '../../formats/bracketed/read-options.js';
import type { Report } from '../../diagnostics/diagnostic.js';
import { wholeNumber } from '../whole-number.js';

export function registerRoundtrip(program: Command, io: CliIO, done: (result: CommandResult) => void): void {
  const command = program
    .command('roundtrip')
    .description('convert there and back and report what was lost: bracketed input goes to dependencies and back, CoNLL-U to brackets and back')
    .argument('<files...>', 'bracketed or CoNLL-U files, or - for standard input')
    .addOption(new Option('--from <format>', 'input format (default: by extension)').choices([...inputFormats]))
    .option('--categories <table>', `category table for the rebuilt bracketings: a shipped one (${shippedTables('categories').join(', ')}) or a path`, 'ud')
    .addOption(new Option('--shape <shape>', 'shape of the rebuilt bracketings').choices(['flat', 'layered']).default('flat'))
    .addOption(new Option('--score-punctuation <mode>', 'count punctuation in the scores, or ignore it (words the head table calls punctuation, or attached as punct)').choices(['count', 'ignore']).default('count'))
    .option('--json', 'print the report as JSON')
    .addOption(new Option('--examples <n>', 'example sentence ids per kind of loss').default(5).argParser(wholeNumber(0)))
    .option('--fail-above <limit>', 'KIND=PCT: exit 1 when a kind of loss exceeds PCT per 100 gold brackets (or words); repeat it for several kinds; kinds: ' + lossKinds.join(', '), (value: string, previous: string[]) => [...previous, value], [])
    .option('--report <file>', 'also write an HTML page drawing the sentences with losses, original and back side by side')
    .addOption(new Option('--report-limit <n>', 'sentences with losses drawn in the HTML page, chosen evenly from the whole input').default(40).argParser(wholeNumber(1)))
    .addOption(new Option('--report-seed <n>', 'the seed of that choice: the same seed draws the same sentences').default(1).argParser(wholeNumber(0)))
    .option('-o, --output <file>', 'write the report to a file (default: standard output)');
  addConversionOptions(command, false);
  addListingOptions(command);
  addJobsOption(command);
  addBracketedReadOptions(command).action(async (files: string[], options: Record<string, unknown>, self: Command) => done(await roundtrip(files, options, io, self)));
}

async function roundtrip(files: string[], options: Record<string, unknown>, io: CliIO, self: Command): Promise<CommandResult> {
  const limits = parseLimits(options.failAbove as string[] | undefined);
  if (typeof limits === 'string') return { code: ExitCode.UsageOrIO, messages: [limits] };
  const { inputs, failures } = await openInputs(files, io);
  const wrong = checkInputs(inputs, failures, 'roundtrip', inputFormats, options.from as InputFormat | undefined, [options.output as string | undefined, options.report as string | undefined], io);
  if (wrong.length > 0) return { code: ExitCode.UsageOrIO, messages: wrong };
  const format = commonFormat(inputs, options.from as InputFormat | undefined);
  if (typeof format !== 'string') return { code: ExitCode.UsageOrIO, messages: [format.mixed] };
  const ignored =
    format === 'conllu'
      ? refuseIgnored(self, [...treeReadingOptions, 'traces', 'coordination', 'punctuation', 'lossless', 'posMap'], 'CoNLL-U goes to brackets and back with traces resolved and the head table deciding coordination')
      : undefined;
  if (ignored) return { code: ExitCode.UsageOrIO, messages: [ignored] };
  let categories;
  try {
    categories = loadCategoryTable(options.categories as string);
  } catch (error) {
    if (!(error instanceof TableError)) throw error;
    return { code: ExitCode.UsageOrIO, messages: tableErrorLines(error) };
  }
  const problems = new ProblemPrinter(io, listingOf(options));
  let read = 0;
  const counted = async function* <T>(items: AsyncIterable<T>) {
    for await (const item of items) {
      read++;
      yield item;
    }
  };
  const drawn = typeof options.report === 'string' ? (options.reportLimit as number) : 0;
  const tripOptions = {
    categories,
    shape: options.shape as 'flat' | 'layered',
    examples: options.examples as number,
    samples: drawn,
    seed: options.reportSeed as number,
    countPunctuation: options.scorePunctuation !== 'ignore',
  };
  let trip: RoundTrip;
  if (format !== 'conllu') {
    if (typeof options.heads !== 'string') return { code: ExitCode.UsageOrIO, messages: ['constituency trees (bracketed or XML graphs) need a head table to go to dependencies: --heads NAME'] };
    // A graph with discontinuous phrases is compared as its bracketing with *ICH* traces, whose restored reading it is.
    const resolved = resolveConversion(format === 'xml' ? { ...options, traces: 'resolve' } : options);
    if ('problems' in resolved) return { code: ExitCode.UsageOrIO, messages: resolved.problems };
    const conversion = { ...conversionOptionsOf(format === 'xml' ? { ...options, traces: 'resolve' } : options), heads: resolved.settings.heads, labels: resolved.settings.labels, posMap: resolved.settings.upos };
    const jobs = jobsOf(options);
    // The sentences drawn for a page are chosen from the whole input as it streams by: such a run stays on one thread.
    if (format === 'bracketed' && jobs > 1 && drawn === 0) {
      const work: TripWork = {
        kind: 'roundtrip',
        conversion: namedConversion(options),
        lossless: options.lossless === true,
        categories: options.categories as string,
        shape: tripOptions.shape,
        pos: 'xpos',
        examples: tripOptions.examples,
        countPunctuation: tripOptions.countPunctuation,
      };
      const counts = { read: 0 };
      trip = await tripOnThreads(inputs, bracketedReadOptions(options), work, bracketRoundTrip({ ...conversion, categories, shape: tripOptions.shape }, tripOptions.examples, 0, tripOptions.countPunctuation, 1), jobs, problems.report, counts, io);
      read = counts.read;
    } else trip = await roundTrip({ trees: counted(readTreesOf(inputs, bracketedReadOptions(options), problems.report, io)) }, { ...conversion, ...tripOptions }, problems.report);
  } else {
    const resolved = resolveConversion({ heads: options.heads ?? 'ud', labels: options.labels });
    if ('problems' in resolved) return { code: ExitCode.UsageOrIO, messages: resolved.problems };
    const jobs = jobsOf(options);
    if (jobs > 1 && drawn === 0) {
      // Each sentence there and back on a thread; the counts added up here, in order.
      const runner = dependencyRoundTrip({ heads: resolved.settings.heads, labels: resolved.settings.labels, categories, shape: tripOptions.shape }, tripOptions.examples, 0, tripOptions.countPunctuation, 1);
      const work = { kind: 'trip' as const, heads: (options.heads as string | undefined) ?? 'ud', labels: options.labels as string | undefined, categories: options.categories as string, shape: tripOptions.shape, examples: tripOptions.examples, countPunctuation: tripOptions.countPunctuation };
      const leftOut: string[] = [];
      for await (const event of sentenceEvents(inputs, work, jobs, io)) {
        if (event.kind === 'problem') {
          problems.report(event.diagnostic);
          continue;
        }
        read++;
        for (const diagnostic of event.result.problems) problems.report(diagnostic);
        if (event.result.trip) runner.merge(event.result.trip);
        if (event.result.leftOut) leftOut.push(event.result.name);
      }
      trip = { report: runner.report(), samples: [], leftOut };
    } else trip = await roundTrip({ sentences: counted(readSentencesOf(inputs, problems.report, io)) }, { heads: resolved.settings.heads, labels: resolved.settings.labels, ...tripOptions }, problems.report);
  }
  const unit = format === 'conllu' ? 'sentence' : 'tree';
  const leftOut = trip.leftOut.length;
  const report = trip.report;
  const samples = trip.samples;
  const output = Output.to(options.output as string | undefined, io, (message) => io.stderr.write(`treebridge: ${message}\n`));
  try {
    await output.write(options.json === true ? JSON.stringify(jsonOf(report), null, 2) + '\n' : formatReport(report));
    await output.commit();
  } catch (error) {
    await output.abandon();
    throw error;
  }
  if (typeof options.report === 'string') {
    const page = Output.to(options.report, io, (message) => io.stderr.write(`treebridge: ${message}\n`));
    try {
      await page.write(writeReport(report, samples));
      await page.commit();
    } catch (error) {
      await page.abandon();
      throw error;
    }
  }
  problems.printSummary();
  io.stderr.write(closingLine(read, unit, [[read - leftOut, 'round-tripped'], [leftOut, 'left out']], typeof options.report === 'string' ? [`report written to ${options.report}`] : [], problems));
  const exceeded = Object.entries(limits).filter(([kind, limit]) => share(report, kind as LossKind) > limit!);
  for (const [kind, limit] of exceeded) io.stderr.write(`treebridge: ${kind} losses ${share(report, kind as LossKind).toFixed(2)}% exceed ${limit}%\n`);
  return { code: exceeded.length > 0 || problems.errors > 0 ? ExitCode.Findings : ExitCode.Ok };
}

/**
 * Trees there and back on worker threads: each task's trees go through a
 * runner of its own and the parts are added to `runner` here, in input order,
 * which gives the report one runner over all trees gives.
 */
async function tripOnThreads(
  inputs: Input[],
  read: BracketedReadOptions,
  work: TripWork,
  runner: BracketRoundTrip,
  jobs: number,
  report: Report,
  counts: { read: number },
  io: CliIO,
): Promise<RoundTrip> {
  const leftOut: string[] = [];
  const take = (batch: DoneBatch) => {
    if (batch.trip) runner.merge(batch.trip);
    leftOut.push(...(batch.leftOut ?? []));
    return '';
  };
  const parallel = new ParallelBatches(jobs, read, work, report, counts, take);
  try {
    for await (const _ of readInputs(inputs, (pieces, name) => parallel.run(pieces, name), io));
    for await (const _ of parallel.drain());
  } finally {
    await parallel.close();
  }
  return { report: runner.report(), samples: [], leftOut };
}

function share(report: RoundTripReport, kind: LossKind): number {
  return report.base === 0 ? 0 : (100 * report.losses[kind]) / report.base;
}

function parseLimits(values: string[] | undefined): Partial<Record<LossKind, number>> | string {
  const limits: Partial<Record<LossKind, number>> = {};
  for (const value of values ?? []) {
    const match = /^([A-Za-z]+)=(\d+(?:\.\d+)?)%?$/.exec(value);
    if (!match || !lossKinds.includes(match[1] as LossKind)) return `--fail-above takes KIND=PCT with KIND one of ${lossKinds.join(', ')}; got "${value}"`;
    limits[match[1] as LossKind] = Number(match[2]);
  }
  return limits;
}

function jsonOf(report: RoundTripReport) {
  const round = (v: number) => Math.round(v * 10000) / 10000;
  const scores = report.brackets
    ? { brackets: { precision: round(report.brackets.precision), recall: round(report.brackets.recall), f1: round(report.brackets.f1), labelledF1: round(report.brackets.labelledF1), crossing: report.brackets.crossing } }
    : { attachment: { uas: round(report.attachment!.uas), las: round(report.attachment!.las) } };
  return { direction: report.direction, sentences: report.sentences, exactMatch: report.exactMatch, ...scores, losses: report.losses, examples: report.examples };
}

function formatReport(report: RoundTripReport): string {
  const percent = (v: number) => `${(100 * v).toFixed(2)}%`;
  const lines = [`${report.direction === 'brackets' ? 'brackets → dependencies → brackets' : 'dependencies → brackets → dependencies'}: ${plural(report.sentences, 'sentence')}, ${report.exactMatch.toLocaleString('en-US')} come back exactly`];
  if (report.brackets) {
    const b = report.brackets;
    lines.push(`brackets: precision ${percent(b.precision)}, recall ${percent(b.recall)}, F1 ${percent(b.f1)}, labelled F1 ${percent(b.labelledF1)}, crossing ${b.crossing}`);
  } else {
    lines.push(`attachment: UAS ${percent(report.attachment!.uas)}, LAS ${percent(report.attachment!.las)}`);
  }
  lines.push('', `${'loss'.padEnd(14)} ${'count'.padStart(8)} ${'per 100'.padStart(8)}  examples`);
  for (const kind of lossKinds) {
    const count = report.losses[kind];
    lines.push(`${kind.padEnd(14)} ${count.toLocaleString('en-US').padStart(8)} ${share(report, kind).toFixed(2).padStart(8)}  ${report.examples[kind].join(' ')}`);
  }
  lines.push(`(per 100 ${report.direction === 'brackets' ? 'gold brackets' : 'words'}; unary, nesting and punctuation take each lost or added bracket once)`);
  return lines.join('\n') + '\n';
}
