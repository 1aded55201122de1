import { readFileSync } from 'node:fs';
import { Option, type Command } from 'commander';
import type { Diagnostic, Report } from '../../diagnostics/diagnostic.js';
import { formatDiagnostic } from '../../diagnostics/format-diagnostic.js';
import { BracketedValidator, type ValidationSummary } from '../../validate/validate-bracketed.js';
import { ConlluValidator, type ConlluSummary } from '../../validate/validate-conllu.js';
import { addBracketedReadOptions, bracketedReadOptions, refuseIgnored, treeReadingOptions } from '../bracketed-options.js';
import { ExitCode, type CommandResult } from '../exit-codes.js';
import { commonFormat, inputFormats, type InputFormat } from '../input-format.js';
import { checkInputs, describeError, openInputs, Output, type CliIO } from '../io.js';
import { bracketedOnThreads, readInputs, readTreesOf } from '../read-trees.js';
import { ParallelBatches } from '../../api/parallel/parallel-batches.js';
import type { DoneBatch } from '../../api/parallel/tasks.js';
import { readXmlGraphs } from '../../formats/xml-graph/read-xml-graph.js';
import { plural, tableErrorLines } from '../print-problems.js';
import { loadFeatureInventory, type FeatureInventory } from '../../tables/load-feature-inventory.js';
import { TableError } from '../../tables/table-source.js';
import { resolve } from 'node:path';
import { addJobsOption, jobsOf } from '../jobs-option.js';
import { sentenceEvents } from '../sentence-events.js';

export function registerValidate(program: Command, io: CliIO, done: (result: CommandResult) => void): void {
  const command = program
    .command('validate')
    .description('check bracketed treebanks or CoNLL-U files: one line per problem, then a summary')
    .argument('<files...>', 'input files, or - for standard input')
    .addOption(new Option('--from <format>', 'input format (default: by extension, .conllu is CoNLL-U)').choices([...inputFormats]))
    .option('--json', 'print a JSON report instead of lines')
    .option('--source', 'show the source line with a caret, and notes, under each problem')
    .option('--relations <labels>', 'CoNLL-U: the relation set, comma-separated or a file with one per line (default: the 37 universal relations)')
    .option('--features <file>', "CoNLL-U: a file declaring a treebank's own features and values (one feature per line, its name then its values), added to the universal ones; repeat it for several", (value: string, previous: string[]) => [...previous, value], [])
    .option('-o, --output <file>', 'write the report to a file (default: standard output)');
  addJobsOption(command);
  addBracketedReadOptions(command).action(async (files: string[], options: Record<string, unknown>, self: Command) => {
    done(await validate(files, options, io, self));
  });
}

/** Problems a JSON report lists one by one; the rest are counted in `problemsLeftOut`. */
const MAX_JSON_PROBLEMS = 10_000;

/** What one run of the validator over one format gives back. */
interface Run {
  summary: ConlluSummary | ValidationSummary;
}

async function validate(files: string[], options: Record<string, unknown>, io: CliIO, self: Command): Promise<CommandResult> {
  const { inputs, failures } = await openInputs(files, io);
  const wrong = checkInputs(inputs, failures, 'validate', inputFormats, options.from as InputFormat | undefined, [options.output as string | undefined], io);
  if (wrong.length > 0) return { code: ExitCode.UsageOrIO, messages: wrong };
  const format = commonFormat(inputs, options.from as InputFormat | undefined);
  if (typeof format !== 'string') return { code: ExitCode.UsageOrIO, messages: [format.mixed] };
  const ignored =
    format === 'conllu'
      ? refuseIgnored(self, treeReadingOptions, 'they are for reading bracketed trees, and the input is CoNLL-U')
      : refuseIgnored(self, ['relations', 'features'], 'they declare what CoNLL-U input may use, and the input holds constituency trees');
  if (ignored) return { code: ExitCode.UsageOrIO, messages: [ignored] };
  let relations: string[] | undefined;
  if (typeof options.relations === 'string') {
    const declared = readRelations(options.relations, io);
    if (typeof declared === 'string') return { code: ExitCode.UsageOrIO, messages: [declared] };
    relations = declared;
  }
  let features: FeatureInventory | undefined;
  const featureFiles = (options.features as string[]).map((file) => resolve(io.cwd ?? process.cwd(), file));
  if (format === 'conllu') {
    try {
      features = loadFeatureInventory('ud');
      for (const file of featureFiles) loadFeatureInventory(file, features);
    } catch (error) {
      if (!(error instanceof TableError)) throw error;
      return { code: ExitCode.UsageOrIO, messages: tableErrorLines(error) };
    }
  }
  const output = Output.to(options.output as string | undefined, io, (message) => io.stderr.write(`treebridge: ${message}\n`));
  const json = options.json === true;
  // JSON holds the first problems; all are counted. Lines are written as they become final, so
  // memory holds the problems of one stretch of input, not of the run.
  const kept: Array<{ file: string; line: number; col: number; severity: string; code: string; message: string }> = [];
  let leftOut = 0;
  // A reader reports a stretch of input before its trees are checked: a problem is final, and
  // printed in offset order, once the item after it begins (or its file ends).
  let current: Diagnostic[] = [];
  const collect: Report = (diagnostic) => current.push(diagnostic);
  /** Lines printed and not yet written: problems become lines in order, and are written in large pieces. */
  let pending = '';
  const emit = (batch: Diagnostic[]) => {
    if (batch.length === 0) return;
    if (json) {
      for (const diagnostic of batch) {
        // Only the printed fields are kept: an excerpt could hold on to a whole stretch of the input.
        const { file, line, column, severity, code, message } = diagnostic;
        if (kept.length < MAX_JSON_PROBLEMS) kept.push({ file, line, col: column, severity, code, message });
        else leftOut++;
      }
      return;
    }
    pending += batch.map((d) => formatDiagnostic(d, { source: options.source === true })).join('\n') + '\n';
  };
  const flush = async (least = 0) => {
    if (pending.length <= least) return;
    const text = pending;
    pending = '';
    await output.write(text);
  };
  /** Where each earlier file's problems end in `current`: a file's problems are all final once the next file starts. */
  const boundaries: number[] = [];
  const nextInput = (startFile: () => void) => () => {
    boundaries.push(current.length);
    startFile();
  };
  const byOffset = (a: Diagnostic, b: Diagnostic) => a.offset - b.offset;
  /** Prints the problems of ended files, then those of the current file before an offset (all of them, without one). */
  const drain = (offset = Infinity) => {
    let from = 0;
    for (const boundary of boundaries.splice(0)) {
      emit(current.slice(from, boundary).sort(byOffset));
      from = boundary;
    }
    const rest = current.slice(from).sort(byOffset);
    let cut = 0;
    while (cut < rest.length && rest[cut]!.offset < offset) cut++;
    current = rest.slice(cut);
    emit(rest.slice(0, cut));
  };
  /** Lines are written once this much is waiting. */
  const PIECE = 64 * 1024;
  let run: Run;
  try {
    if (format === 'conllu') {
      const validator = new ConlluValidator(collect, relations, features);
      // Sentences are checked on their own on worker threads; counts and sent_ids across them here, in order.
      const work = { kind: 'validate' as const, ...(relations ? { relations } : {}), features: featureFiles };
      for await (const event of sentenceEvents(inputs, work, jobsOf(options), io, nextInput(() => validator.startFile()))) {
        if (event.kind === 'problem') {
          validator.report(event.diagnostic);
          continue;
        }
        const result = event.result;
        drain(result.start);
        for (const diagnostic of result.problems) validator.report(diagnostic);
        validator.count(result.words ?? 0);
        validator.checkSentId(result.sentId);
        await flush(PIECE);
      }
      run = validator;
    } else {
      const validator = new BracketedValidator(collect);
      const jobs = jobsOf(options);
      if (jobs > 1) {
        // Trees are checked on their own on worker threads (bracketed input; XML graphs here, in turn);
        // identifiers across trees here, in order.
        const take = (batch: DoneBatch) => {
          for (const tree of batch.checked ?? []) {
            drain(tree.start);
            for (const diagnostic of tree.problems) validator.report(diagnostic);
            validator.count(tree.words);
            validator.checkId(tree.id);
          }
          return '';
        };
        const parallel = new ParallelBatches(jobs, bracketedReadOptions(options), { kind: 'validate' }, validator.report, {}, take, nextInput(() => validator.startFile()));
        try {
          const read = bracketedOnThreads(parallel, inputs, options.from as InputFormat | undefined, async function* (pieces, name) {
            nextInput(() => validator.startFile())();
            for await (const tree of readXmlGraphs(pieces, { file: name }, validator.report)) {
              drain(tree.position?.start ?? 0);
              validator.check(tree);
              await flush(PIECE);
            }
          });
          for await (const _ of readInputs(inputs, read, io)) await flush(PIECE);
          for await (const _ of parallel.drain()) await flush(PIECE);
        } finally {
          await parallel.close();
        }
      } else {
        const trees = readTreesOf(inputs, bracketedReadOptions(options), validator.report, io, nextInput(() => validator.startFile()));
        for await (const tree of trees) {
          drain(tree.position?.start ?? 0);
          validator.check(tree);
          await flush(PIECE);
        }
      }
      run = validator;
    }
    drain();
    await flush();
    const summary = run.summary;
    if (json) {
      const report = {
        ...summary,
        problems: kept,
        ...(leftOut > 0 ? { problemsLeftOut: leftOut } : {}),
      };
      await output.write(JSON.stringify(report, null, 2) + '\n');
    } else {
      await output.write(summaryLine(summary) + '\n');
    }
    await output.commit();
  } catch (error) {
    await output.abandon();
    throw error;
  }
  return { code: run.summary.errors > 0 ? ExitCode.Findings : ExitCode.Ok };
}

/** A relation list given inline (`nsubj,obj`) or as a file with one relation per line. */
function readRelations(value: string, io: CliIO): string[] | string {
  if (value.includes(',') || /^[a-z]+(:[a-z]+)?$/.test(value)) return value.split(',').map((r) => r.trim()).filter(Boolean);
  try {
    const path = io.cwd ? `${io.cwd}/${value}` : value;
    return readFileSync(path, 'utf8').split('\n').map((r) => r.trim()).filter((r) => r && !r.startsWith('#'));
  } catch (error) {
    return `cannot read "${value}": ${describeError(error)}`;
  }
}

function summaryLine(summary: ConlluSummary | ValidationSummary): string {
  const unit = 'sentences' in summary ? plural(summary.sentences, 'sentence') : plural(summary.trees, 'tree');
  return `${plural(summary.files, 'file')}, ${unit}, ${plural(summary.words, 'word')}: ${plural(summary.errors, 'error')}, ${plural(summary.warnings, 'warning')}`;
}
