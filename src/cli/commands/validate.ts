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
import { readSentencesOf, readTreesOf } from '../read-trees.js';
import { plural } from '../print-problems.js';

export function registerValidate(program: Command, io: CliIO, done: (result: CommandResult) => void): void {
  const command = program
    .command('validate')
    .description('check bracketed treebanks or CoNLL-U files: one line per problem, then a summary')
    .argument('<files...>', 'input files, or - for standard input')
    .addOption(new Option('--from <format>', 'input format (default: by extension, .conllu is CoNLL-U)').choices([...inputFormats]))
    .option('--json', 'print a JSON report instead of lines')
    .option('--source', 'show the source line with a caret, and notes, under each problem')
    .option('--relations <labels>', 'CoNLL-U: the relation set, comma-separated or a file with one per line (default: the 37 universal relations)')
    .option('-o, --output <file>', 'write the report to a file (default: standard output)');
  addBracketedReadOptions(command).action(async (files: string[], options: Record<string, unknown>, self: Command) => {
    done(await validate(files, options, io, self));
  });
}

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
      : refuseIgnored(self, ['relations'], 'it declares the relations of CoNLL-U input, and the input holds constituency trees');
  if (ignored) return { code: ExitCode.UsageOrIO, messages: [ignored] };
  let relations: string[] | undefined;
  if (typeof options.relations === 'string') {
    const declared = readRelations(options.relations, io);
    if (typeof declared === 'string') return { code: ExitCode.UsageOrIO, messages: [declared] };
    relations = declared;
  }
  const output = Output.to(options.output as string | undefined, io, (message) => io.stderr.write(`treebridge: ${message}\n`));
  const json = options.json === true;
  const problems: Diagnostic[] = [];
  // A reader reports a stretch of input before its trees are checked, so a
  // file's problems are held until the next file starts, then printed in file order.
  let current: Diagnostic[] = [];
  const finished: Diagnostic[][] = [];
  const collect: Report = (diagnostic) => current.push(diagnostic);
  const flush = async () => {
    for (const batch of finished.splice(0)) {
      batch.sort((a, b) => a.offset - b.offset);
      if (json) problems.push(...batch);
      else if (batch.length > 0) {
        await output.write(batch.map((d) => formatDiagnostic(d, { source: options.source === true })).join('\n') + '\n');
      }
    }
  };
  const nextInput = (startFile: () => void) => () => {
    finished.push(current);
    current = [];
    startFile();
  };
  let run: Run;
  try {
    if (format === 'conllu') {
      const validator = new ConlluValidator(collect, relations);
      for await (const sentence of readSentencesOf(inputs, validator.report, io, nextInput(() => validator.startFile()))) {
        if (finished.length > 0) await flush();
        validator.check(sentence);
      }
      run = validator;
    } else {
      const validator = new BracketedValidator(collect);
      const trees = readTreesOf(inputs, bracketedReadOptions(options), validator.report, io, nextInput(() => validator.startFile()));
      for await (const tree of trees) {
        if (finished.length > 0) await flush();
        validator.check(tree);
      }
      run = validator;
    }
    finished.push(current);
    await flush();
    const summary = run.summary;
    if (json) {
      const report = {
        ...summary,
        problems: problems.map(({ file, line, column, severity, code, message }) => ({ file, line, col: column, severity, code, message })),
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
