import { Option, type Command } from 'commander';
import { headWordOf, type ConversionNode } from '../../convert/conversion-tree.js';
import { findHeads } from '../../convert/find-heads.js';
import { prepareTree } from '../../convert/prepare-tree.js';
import type { Diagnostic } from '../../diagnostics/diagnostic.js';
import { formatDiagnostic } from '../../diagnostics/format-diagnostic.js';
import { addBracketedReadOptions, bracketedReadOptions } from '../bracketed-options.js';
import { addConversionOptions, conversionSettings } from '../conversion-options.js';
import { ExitCode, type CommandResult } from '../exit-codes.js';
import { openInputs, Output, type CliIO } from '../io.js';
import { readTreesOf } from '../read-trees.js';

export function registerHeads(program: Command, io: CliIO, done: (result: CommandResult) => void): void {
  const heads = program.command('heads').description('look into head tables: why a head was chosen');
  const explain = heads
    .command('explain')
    .description('for each phrase, the head chosen and the step of the table that chose it')
    .argument('<file>', 'a bracketed file, or - for standard input')
    .addOption(new Option('--sentence <n>', 'only the nth tree of the file (from 1)').argParser((value) => Number.parseInt(value, 10)))
    .option('-o, --output <file>', 'write the explanation to a file (default: standard output)');
  addConversionOptions(explain);
  addBracketedReadOptions(explain).action(async (file: string, options: Record<string, unknown>) => done(await explainHeads(file, options, io)));
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
  if (failures.length > 0) return { code: ExitCode.UsageOrIO, messages: failures };
  const output = Output.to(options.output as string | undefined, io);
  let errors = 0;
  const report = (d: Diagnostic) => {
    if (d.severity === 'error') errors++;
    io.stderr.write(formatDiagnostic(d) + '\n');
  };
  let number = 0;
  try {
    for await (const tree of readTreesOf(inputs, bracketedReadOptions(options), report, io)) {
      number++;
      if (wanted !== undefined && number !== wanted) continue;
      const prepared = prepareTree(tree, settings.traces);
      const where = tree.position && tree.source ? `${tree.file}:${tree.source.pointAt(tree.position.start).line}` : tree.file;
      if (!prepared) {
        await output.write(`${tree.id ?? `tree ${number}`} (${where}): no words\n\n`);
        continue;
      }
      findHeads(prepared.root, settings.heads, settings.coordination);
      const lines: string[] = [`${tree.id ?? `tree ${number}`} (${where}), heads by ${settings.heads.name}`];
      const visit = (node: ConversionNode, depth: number) => {
        if (node.kind !== 'phrase') return;
        const head = node.children[node.head!.child]!;
        const headLabel = head.kind === 'word' ? head.pos : head.label;
        lines.push(`${'  '.repeat(depth + 1)}${node.label || '(top)'} → ${headLabel} "${headWordOf(node).form}": ${node.head!.reason}`);
        for (const child of node.children) visit(child, depth + 1);
      };
      visit(prepared.root, 0);
      await output.write(lines.join('\n') + '\n\n');
      if (wanted !== undefined) break;
    }
    await output.commit();
  } catch (error) {
    await output.abandon();
    throw error;
  }
  if (wanted !== undefined && number < wanted) return { code: ExitCode.UsageOrIO, messages: [`${file} has ${number} trees; there is no tree ${wanted}`] };
  return { code: errors > 0 ? ExitCode.Findings : ExitCode.Ok };
}
