// The public library interface of treebridge. test/index.test.ts pins this list.
export type { ConstituentNode, EmptyElement, MetaNode, Phrase, Preterminal, SecondaryEdge, Tree, Word } from './model/constituency.js';
export type { Terminal } from './model/terminal-order.js';
export { countDiscontinuousPhrases, terminalsInOrder } from './model/terminal-order.js';
export type { Comment, ConlluColumns, DependencySentence, DependencyWord, EmptyNode, MultiwordToken } from './model/dependency.js';
export type { Label } from './model/label.js';
export { formatLabel, parseLabel } from './model/label.js';
export { LineIndex } from './model/line-index.js';
export type { Point, Position } from './model/position.js';
export { childrenOf, isMetaOnly, nodesOf, preterminalsOf } from './model/traverse.js';
export type { DiagnosticCode } from './diagnostics/codes.js';
export { diagnosticCodes } from './diagnostics/codes.js';
export type { Diagnostic, Report, Severity } from './diagnostics/diagnostic.js';
export { formatDiagnostic } from './diagnostics/format-diagnostic.js';
export type { BracketedReadOptions } from './formats/bracketed/read-options.js';
export {
  readBracketed,
  readBracketedBatches,
  readBracketedFile,
  readBracketedFileBatches,
  readBracketedText,
} from './formats/bracketed/read-bracketed.js';
export type { TreeBreaks } from './formats/bracketed/split-trees.js';
export type { Layout, WriteOptions } from './formats/bracketed/write-bracketed.js';
export { writeNode } from './formats/bracketed/write-bracketed.js';
export { writeTree } from './traces/write-tree.js';
export type { XmlReadOptions } from './formats/xml-graph/read-xml-graph.js';
export { readXmlGraphFile, readXmlGraphs, readXmlGraphText } from './formats/xml-graph/read-xml-graph.js';
export { writeXmlSentence, xmlDocumentEnd, xmlDocumentStart } from './formats/xml-graph/write-xml-graph.js';
export type { Resolution } from './traces/resolve-traces.js';
export { resolveTraces } from './traces/resolve-traces.js';
export type { TraceInsertion } from './traces/insert-traces.js';
export { insertTraces } from './traces/insert-traces.js';
export type { ValidationSummary } from './validate/validate-bracketed.js';
export { BracketedValidator } from './validate/validate-bracketed.js';
export type { CliIO } from './cli/io.js';
export { runCli } from './cli/run-cli.js';
