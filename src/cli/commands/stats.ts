import { Option, type Command } from 'commander';
import { CorpusStructureCounter } from '../../analysis/corpus-structure.js';
import { formatCorpusStructure } from '../../analysis/format-structure.js';
import { treeHeads } from '../../analysis/heads.js';
import { checkHeads } from '../../validate/check-dependency-tree.js';
import { analyseTree } from '../../analysis/structure.js';
import { diagnoseItem, itemName } from '../../diagnostics/diagnostic.js';
import { addListingOptions, closingLine, listingOf, ProblemPrinter } from '../print-problems.js';
import { ExitCode, type CommandResult } from '../exit-codes.js';
import { commonFormat, inputFormats, type InputFormat } from '../input-format.js';
import { checkInputs, openInputs, Output, type CliIO, type Input } from '../io.js';
import { readSentencesOf, readTreesOf } from '../read-trees.js';
import { addBracketedReadOptions, bracketedReadOptions, conversionOptionNames, refuseIgnored, treeReadingOptions } from '../bracketed-options.js';
import { addConversionOptions, conversionSettings } from '../conversion-options.js';
import { convertTree, type ConversionSettings } from '../../convert/convert-tree.js';
import { reportWordlessTree } from '../../convert/report-wordless-tree.js';
import type { DependencySentence } from '../../model/dependency.js';
import type { Report } from '../../diagnostics/diagnostic.js';

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
  addListingOptions(command);
  addBracketedReadOptions(command).action(async (files: string[], options: Record<string, unknown>, self: Command) => done(await stats(files, options, io, self)));
}

/** Dependency sentences of the inputs: read as CoNLL-U, or converted from bracketed trees. */
async function* sentencesOf(
  format: InputFormat,
  inputs: Input[],
  options: Record<string, unknown>,
  settings: ConversionSettings | undefined,
  report: Report,
  io: CliIO,
  onWordless: () => void,
): AsyncGenerator<DependencySentence> {
  if (format === 'conllu') {
    yield* readSentencesOf(inputs, report, io);
    return;
  }
  let number = 0;
  for await (const tree of readTreesOf(inputs, bracketedReadOptions(options), report, io)) {
    number++;
    const id = tree.id ?? `${tree.file}-${number}`;
    const conversion = convertTree(tree, settings!, id, id);
    if (conversion) yield conversion.sentence;
    else {
      onWordless();
      reportWordlessTree(tree, report);
    }
  }
}

async function stats(files: string[], options: Record<string, unknown>, io: CliIO, self: Command): Promise<CommandResult> {
  const { inputs, failures } = await openInputs(files, io);
  const wrong = checkInputs(inputs, failures, 'stats', inputFormats, options.from as InputFormat | undefined, [options.output as string | undefined], io);
  if (wrong.length > 0) return { code: ExitCode.UsageOrIO, messages: wrong };
  const format = commonFormat(inputs, options.from as InputFormat | undefined);
  if (typeof format !== 'string') return { code: ExitCode.UsageOrIO, messages: [format.mixed] };
  const ignored = format === 'conllu' ? refuseIgnored(self, [...conversionOptionNames, ...treeReadingOptions], 'CoNLL-U input is measured as it stands, with no conversion') : undefined;
  if (ignored) return { code: ExitCode.UsageOrIO, messages: [ignored] };
  let settings: ConversionSettings | undefined;
  if (format !== 'conllu') {
    if (typeof options.heads !== 'string') return { code: ExitCode.UsageOrIO, messages: ['constituency trees (bracketed or XML graphs) need a head table to convert them first: --heads NAME'] };
    const loaded = conversionSettings(options);
    if ('problems' in loaded) return { code: ExitCode.UsageOrIO, messages: loaded.problems };
    settings = loaded;
  }
  const output = Output.to(options.output as string | undefined, io, (message) => io.stderr.write(`treebridge: ${message}\n`));
  const counter = new CorpusStructureCounter();
  const problems = new ProblemPrinter(io, listingOf(options));
  const problem = problems.report;
  let skipped = 0;
  let read = 0;
  let wordless = 0;
  try {
    for await (const sentence of sentencesOf(format, inputs, options, settings, problem, io, () => wordless++)) {
      read++;
      // Only a tree can be measured: a sentence that is not one is reported and left out. Other
      // problems (a # text that does not match, an unknown relation) are validate's business.
      const before = problems.errors;
      checkHeads(sentence, problem);
      const checked = treeHeads(sentence);
      if ('problem' in checked) {
        if (problems.errors === before) problem(diagnoseItem('not-a-tree', `sentence ${itemName(sentence)}: ${checked.problem}; left out`, sentence));
        skipped++;
        continue;
      }
      const structure = analyseTree(checked.heads);
      counter.add(structure);
      if (options.arcs === true && structure.nonProjectiveArcs.length > 0) {
        const arcs = structure.nonProjectiveArcs.map((arc) => `${arc.head}→${arc.dependent} (gap ${arc.gap.join(' ')})`);
        if (options.json !== true) await output.write(`${itemName(sentence, read)}: ${arcs.join(', ')}\n`);
      }
    }
    const result = counter.result();
    await output.write(options.json === true ? JSON.stringify(result, null, 2) + '\n' : (options.arcs === true ? '\n' : '') + formatCorpusStructure(result));
    await output.commit();
  } catch (error) {
    await output.abandon();
    throw error;
  }
  problems.printSummary();
  const unit = format === 'conllu' ? 'sentence' : 'tree';
  const outcomes: Array<[number, string]> = [[read - skipped, 'measured'], [skipped, 'left out (not trees)']];
  if (wordless > 0) outcomes.push([wordless, 'without words skipped']);
  io.stderr.write(closingLine(read + wordless, unit, outcomes, [], problems));
  return { code: problems.errors > 0 ? ExitCode.Findings : ExitCode.Ok };
}
