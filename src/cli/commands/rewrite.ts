import { Option, type Command } from 'commander';
import type { Layout } from '../../formats/bracketed/write-bracketed.js';
import { emptyRewriteTally, TreeRewriter } from '../../api/rewrite.js';
import { ParallelBatches } from '../../api/parallel/parallel-batches.js';
import { readXmlGraphs } from '../../formats/xml-graph/read-xml-graph.js';
import type { Tree } from '../../model/constituency.js';
import { TreeSink, treeOutputFormat } from '../tree-output.js';
import { addJobsOption, jobsOf } from '../jobs-option.js';
import { addBracketedReadOptions, addTreeFormatOption, bracketedReadOptions } from '../bracketed-options.js';
import { ExitCode, type CommandResult } from '../exit-codes.js';
import { checkInputs, openInputs, Output, type CliIO } from '../io.js';
import type { InputFormat } from '../input-format.js';
import { bracketedOnThreads, readInputs, readTreeBatchesOf } from '../read-trees.js';
import { addListingOptions, closingLine, listingOf, plural, ProblemPrinter } from '../print-problems.js';

export function registerRewrite(program: Command, io: CliIO, done: (result: CommandResult) => void): void {
  const command = program
    .command('rewrite')
    .description('read constituency trees (bracketed or XML graphs) and write them again, in a chosen layout or the other format; problems go to standard error')
    .argument('<files...>', 'input files, or - for standard input')
    .addOption(new Option('--layout <layout>', 'line: one tree per line; indented: one bracket per line where it does not fit').choices(['line', 'indented']).default('line'))
    .addOption(new Option('--to <format>', 'output format (default: by the output file\'s extension, .xml is the XML graph encoding; else bracketed)').choices(['bracketed', 'xml']))
    .addOption(new Option('--traces <mode>', 'keep: traces stay empty elements; resolve: antecedents of *T* *ICH* *EXP* *RNR* become discontinuous children where their traces stood').choices(['keep', 'resolve']).default('keep'))
    .option('-o, --output <file>', 'write the trees to a file (default: standard output)');
  addJobsOption(command);
  addTreeFormatOption(command);
  addListingOptions(command);
  addBracketedReadOptions(command).action(async (files: string[], options: Record<string, unknown>) => {
    done(await rewrite(files, options, io));
  });
}

async function rewrite(files: string[], options: Record<string, unknown>, io: CliIO): Promise<CommandResult> {
  const { inputs, failures } = await openInputs(files, io);
  const wrong = checkInputs(inputs, failures, 'rewrite', ['bracketed', 'xml'], options.from as InputFormat | undefined, [options.output as string | undefined], io);
  if (wrong.length > 0) return { code: ExitCode.UsageOrIO, messages: wrong };
  const output = Output.to(options.output as string | undefined, io, (message) => io.stderr.write(`treebridge: ${message}\n`));
  const layout = options.layout as Layout;
  const problems = new ProblemPrinter(io, listingOf(options));
  const report = problems.report;
  const format = treeOutputFormat(options.to, options.output);
  const sink = new TreeSink(output, format, layout, report);
  const traces = options.traces === 'resolve' ? 'resolve' : 'keep';
  const tally = emptyRewriteTally();
  // Traces are resolved here; the sink puts *ICH* traces in where a bracketing needs them.
  const rewriter = new TreeRewriter({ traces, layout }, report, tally);
  const writeOne = async (tree: Tree) => {
    if (await sink.write(rewriter.resolve(tree))) tally.written++;
  };
  try {
    const jobs = jobsOf(options);
    // An XML graph document numbers its sentences as they are written: it is written on one thread.
    if (jobs > 1 && format === 'bracketed') {
      const parallel = new ParallelBatches(jobs, bracketedReadOptions(options), { kind: 'rewrite', traces, layout }, report, tally);
      try {
        // An XML input is rewritten here, after everything before it.
        const read = bracketedOnThreads(parallel, inputs, options.from as InputFormat | undefined, (pieces, name) => readXmlGraphs(pieces, { file: name }, report));
        for await (const item of readInputs(inputs, read, io)) {
          if (typeof item === 'string') await sink.writeText(item);
          else await writeOne(item);
        }
        for await (const text of parallel.drain()) await sink.writeText(text);
      } finally {
        await parallel.close();
      }
    } else {
      for await (const trees of readTreeBatchesOf(inputs, bracketedReadOptions(options), report, io)) for (const tree of trees) await writeOne(tree);
    }
    await sink.finish();
    await output.commit();
  } catch (error) {
    await output.abandon();
    throw error;
  }
  const { read, written, moved, leftover } = tally;
  const inserted = tally.inserted + sink.tracesInserted;
  const notes = [
    options.traces === 'resolve' ? `${plural(moved, 'antecedent')} moved to their traces` : '',
    leftover > 0 ? `${plural(leftover, 'further trace')} of an antecedent that had moved already left as empty element${leftover === 1 ? '' : 's'}` : '',
    inserted > 0 ? `${plural(inserted, '*ICH* trace')} put in for discontinuous phrases` : '',
  ].filter(Boolean);
  problems.printSummary();
  io.stderr.write(closingLine(read, 'tree', [[written, 'written'], [read - written, 'skipped']], notes, problems));
  return { code: problems.errors > 0 ? ExitCode.Findings : ExitCode.Ok };
}
