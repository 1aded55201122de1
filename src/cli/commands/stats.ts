import { Option, type Command } from 'commander';
import { convertTrees, emptyConversionTally } from '../../api/convert.js';
import type { ResolvedConversion } from '../../api/options.js';
import { analyseStructure, type StructureAnalysis } from '../../api/structure.js';
import type { TreeStructure } from '../../analysis/structure.js';
import { formatCorpusStructure } from '../../analysis/format-structure.js';
import { itemName } from '../../diagnostics/diagnostic.js';
import { ExitCode, type CommandResult } from '../exit-codes.js';
import { commonFormat, inputFormats, type InputFormat } from '../input-format.js';
import { checkInputs, openInputs, Output, type CliIO } from '../io.js';
import { readTreesOf } from '../read-trees.js';
import { sentenceEvents } from '../sentence-events.js';
import { CorpusStructureCounter } from '../../analysis/corpus-structure.js';
import { addBracketedReadOptions, bracketedReadOptions, conversionOptionNames, refuseIgnored, treeReadingOptions } from '../bracketed-options.js';
import { addConversionOptions, conversionOptionsOf, resolveConversion } from '../conversion-options.js';
import { addListingOptions, closingLine, listingOf, ProblemPrinter } from '../print-problems.js';
import { addJobsOption, jobsOf } from '../jobs-option.js';
import { convertedText } from '../converted-text.js';
import { readConllu } from '../../formats/conllu/read-conllu.js';

export function registerStats(program: Command, io: CliIO, done: (result: CommandResult) => void): void {
  const command = program
    .command('stats')
    .description('measure the structure of dependency trees: projectivity, gap and edge degree, well-nestedness, arc lengths')
    .argument('<files...>', 'CoNLL-U files, or bracketed files with --heads (converted first), or - for standard input')
    .addOption(new Option('--from <format>', 'input format (default: by extension)').choices([...inputFormats]))
    .option('--json', 'print the figures as JSON')
    .option('--arcs', 'list each sentence with non-projective arcs, with the gap of each arc')
    .option('-o, --output <file>', 'write the report to a file (default: standard output)');
  addConversionOptions(command, false);
  addJobsOption(command);
  addListingOptions(command);
  addBracketedReadOptions(command).action(async (files: string[], options: Record<string, unknown>, self: Command) => done(await stats(files, options, io, self)));
}

async function stats(files: string[], options: Record<string, unknown>, io: CliIO, self: Command): Promise<CommandResult> {
  const { inputs, failures } = await openInputs(files, io);
  const wrong = checkInputs(inputs, failures, 'stats', inputFormats, options.from as InputFormat | undefined, [options.output as string | undefined], io);
  if (wrong.length > 0) return { code: ExitCode.UsageOrIO, messages: wrong };
  const format = commonFormat(inputs, options.from as InputFormat | undefined);
  if (typeof format !== 'string') return { code: ExitCode.UsageOrIO, messages: [format.mixed] };
  const ignored = format === 'conllu' ? refuseIgnored(self, [...conversionOptionNames, ...treeReadingOptions], 'CoNLL-U input is measured as it stands, with no conversion') : undefined;
  if (ignored) return { code: ExitCode.UsageOrIO, messages: [ignored] };
  let conversion: ResolvedConversion | undefined;
  if (format !== 'conllu') {
    if (typeof options.heads !== 'string') return { code: ExitCode.UsageOrIO, messages: ['constituency trees (bracketed or XML graphs) need a head table to convert them first: --heads NAME'] };
    const loaded = resolveConversion({ ...options, lossless: false });
    if ('problems' in loaded) return { code: ExitCode.UsageOrIO, messages: loaded.problems };
    conversion = loaded;
  }
  const output = Output.to(options.output as string | undefined, io, (message) => io.stderr.write(`treebridge: ${message}\n`));
  const problems = new ProblemPrinter(io, listingOf(options));
  const tally = emptyConversionTally();
  let read = 0;
  let analysis: StructureAnalysis;
  try {
    const listArcs = async (name: string, structure: TreeStructure) => {
      if (options.arcs !== true || options.json === true || structure.nonProjectiveArcs.length === 0) return;
      const arcs = structure.nonProjectiveArcs.map((arc) => `${arc.head}→${arc.dependent} (gap ${arc.gap.join(' ')})`);
      await output.write(`${name}: ${arcs.join(', ')}\n`);
    };
    if (conversion === undefined) {
      // CoNLL-U: sentences read and measured on worker threads, figures summed here in input order.
      const counter = new CorpusStructureCounter();
      let notTrees = 0;
      for await (const event of sentenceEvents(inputs, { kind: 'structure' }, jobsOf(options), io)) {
        if (event.kind === 'problem') {
          problems.report(event.diagnostic);
          continue;
        }
        read++;
        const { structure, name } = event.result;
        for (const diagnostic of event.result.problems) problems.report(diagnostic);
        if (!structure) {
          notTrees++;
          continue;
        }
        counter.add(structure);
        await listArcs(name, structure);
      }
      analysis = { figures: counter.result(), notTrees };
    } else {
      // Constituency trees, converted first. With several jobs they are converted on worker threads, as
      // to-deps does, and their CoNLL-U read back.
      const jobs = jobsOf(options);
      const sentences =
        jobs > 1
          ? readConllu(convertedText(inputs, options, conversion, {}, jobs, problems.report, tally, io), { file: 'converted' }, problems.report)
          : convertTrees(readTreesOf(inputs, bracketedReadOptions(options), problems.report, io), { ...conversionOptionsOf(options), heads: conversion.settings.heads, labels: conversion.settings.labels, posMap: conversion.settings.upos, lossless: false }, problems.report, tally);
      const counted = async function* () {
        for await (const sentence of sentences) {
          read++;
          yield sentence;
        }
      };
      analysis = await analyseStructure(counted(), problems.report, (sentence, structure) => listArcs(itemName(sentence, read), structure));
    }
    const result = analysis.figures;
    await output.write(options.json === true ? JSON.stringify(result, null, 2) + '\n' : (options.arcs === true ? '\n' : '') + formatCorpusStructure(result));
    await output.commit();
  } catch (error) {
    await output.abandon();
    throw error;
  }
  problems.printSummary();
  const unit = format === 'conllu' ? 'sentence' : 'tree';
  const outcomes: Array<[number, string]> = [[read - analysis.notTrees, 'measured'], [analysis.notTrees, 'left out (not trees)']];
  if (tally.skipped > 0) outcomes.push([tally.skipped, 'without words skipped']);
  io.stderr.write(closingLine(read + tally.skipped, unit, outcomes, [], problems));
  return { code: problems.errors > 0 ? ExitCode.Findings : ExitCode.Ok };
}
