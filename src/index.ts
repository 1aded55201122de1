/**
 * treebridge as a library: read, write, convert, check and measure
 * syntactically annotated corpora, bracketed constituency trees, the XML graph
 * encoding and Universal Dependencies CoNLL-U, without the command line. The
 * command line is a thin shell over these functions (`treebridge/cli`).
 *
 * Layers, simplest first: functions on strings and files (`convertText`,
 * `validateConllu`), streams of trees and sentences (`convertTrees`,
 * `toBrackets`, `analyseStructure`), and the parts they are made of (readers,
 * writers, tables, trace resolution, lifting). test/index.test.ts pins this list.
 *
 * @packageDocumentation
 */

// The data model: constituency trees, dependency sentences, labels, positions.
export type { ConstituentNode, EmptyElement, MetaNode, Phrase, Preterminal, SecondaryEdge, Tree, Word } from './model/constituency.js';
export type { Comment, ConlluColumns, DependencySentence, DependencyWord, EmptyNode, MultiwordToken } from './model/dependency.js';
export type { Label } from './model/label.js';
export { formatLabel, parseLabel } from './model/label.js';
export { LineIndex } from './model/line-index.js';
export type { Point, Position } from './model/position.js';
export type { Terminal } from './model/terminal-order.js';
export { countDiscontinuousPhrases, terminalsInOrder } from './model/terminal-order.js';
export { childrenOf, isMetaOnly, nodesOf, preterminalsOf } from './model/traverse.js';
export { MAX_TREE_DEPTH, MAX_TREE_LENGTH } from './model/limits.js';

// Diagnostics as data, and the one formatter.
export type { DiagnosticCode } from './diagnostics/codes.js';
export { diagnosticCodes } from './diagnostics/codes.js';
export type { Diagnostic, Report, Severity } from './diagnostics/diagnostic.js';
export { formatDiagnostic } from './diagnostics/format-diagnostic.js';
export type { FormatOptions } from './diagnostics/format-diagnostic.js';

// Bracketed trees: reading (streaming over pieces of text, files, or a string) and writing.
export type { BracketedReadOptions } from './formats/bracketed/read-options.js';
export { defaultLiteralTags } from './formats/bracketed/read-options.js';
export { readBracketed, readBracketedBatches, readBracketedFile, readBracketedFileBatches, readBracketedText } from './formats/bracketed/read-bracketed.js';
export type { TreeBreaks } from './formats/bracketed/split-trees.js';
export type { Layout, WriteOptions } from './formats/bracketed/write-bracketed.js';
export { unwritableReason, writeBracketing, writeNode } from './formats/bracketed/write-bracketed.js';
export { writeTree } from './traces/write-tree.js';

// The XML graph encoding.
export type { XmlReadOptions } from './formats/xml-graph/read-xml-graph.js';
export type { XmlLimits } from './formats/xml-graph/scan-xml-graph.js';
export { readXmlGraphFile, readXmlGraphText, readXmlGraphs } from './formats/xml-graph/read-xml-graph.js';
export { writeXmlSentence, xmlDocumentEnd, xmlDocumentStart } from './formats/xml-graph/write-xml-graph.js';

// CoNLL-U.
export type { ConlluReadOptions } from './formats/conllu/read-conllu.js';
export { readConllu, readConlluFile, readConlluText } from './formats/conllu/read-conllu.js';
export { unwritableSentenceReason, writeSentence } from './formats/conllu/write-conllu.js';

// Tables: head, label, word (POS map) and category tables, by shipped name, path, or text.
export type { FixedExpressions, HeadBlock, HeadStep, HeadTable, LabelCondition, LabelContext, LabelRule, LabelTable } from './tables/table-model.js';
export type { Candidate, Matcher } from './tables/label-pattern.js';
export { compileHeadTable, compileLabelTable, loadHeadTable, loadLabelTable } from './tables/load-table.js';
export { formatFeatures, loadPosMap, PosMap, universalTags } from './tables/load-pos-map.js';
export type { ContextRule, WordClass, WordContext, WrittenClass } from './tables/load-pos-map.js';
export type { CategoryContext, CategoryTable } from './tables/load-category-table.js';
export { loadCategoryTable } from './tables/load-category-table.js';
export type { FeatureInventory } from './tables/load-feature-inventory.js';
export { loadFeatureInventory } from './tables/load-feature-inventory.js';
export { shippedTables, TableError } from './tables/table-source.js';
export type { TableKind } from './tables/table-source.js';

// Structure of dependency trees.
export type { NonProjectiveArc, TreeStructure } from './analysis/structure.js';
export { analyseTree } from './analysis/structure.js';
export type { CorpusStructure, Distribution } from './analysis/corpus-structure.js';
export { headVector, treeHeads } from './analysis/heads.js';

// Traces: discontinuous trees and back.
export type { Resolution } from './traces/resolve-traces.js';
export { resolveTraces } from './traces/resolve-traces.js';
export type { TraceInsertion } from './traces/insert-traces.js';
export { insertTraces } from './traces/insert-traces.js';

// Bracketings from dependency trees.
export type { BracketSettings, BracketShape, Bracketing } from './reverse/build-brackets.js';
export { buildBrackets } from './reverse/build-brackets.js';
export type { Lift } from './reverse/lift-nonprojective-arcs.js';
export { liftNonProjectiveArcs as liftNonProjective } from './reverse/lift-nonprojective-arcs.js';

// Checking whole files and streams.
export type { ConlluSummary, SentIdAt } from './validate/validate-conllu.js';
export { ConlluValidator, sentIdOf, universalRelations } from './validate/validate-conllu.js';
export type { ValidationSummary } from './validate/validate-bracketed.js';
export { BracketedValidator } from './validate/validate-bracketed.js';

// Evaluation types.
export type { BracketSample, DependencySample, LossKind, RoundTripReport, RoundTripSample } from './evaluate/roundtrip.js';
export type { AttachmentScore } from './evaluate/score-attachments.js';
export { AttachmentScorer } from './evaluate/score-attachments.js';
export type { LearnedBlock, LearnedList, LearnedStep } from './evaluate/suggest-heads.js';
export type { LearnedLabelRule, LearnedLabels } from './evaluate/suggest-labels.js';
export { lossKinds } from './evaluate/roundtrip.js';
export type { ConversionScore, AttachmentError, HeadSample, ParentTally, WrongChoice } from './evaluate/score-conversion.js';
export type { PairingTally } from './evaluate/pair-with-gold.js';
export type { Conversion, ConversionSettings } from './convert/convert-tree.js';
export type { ConversionNode, Coordination, HeadChoice, PhraseNode, WordNode } from './convert/conversion-tree.js';
export type { CoordinationStyle } from './convert/handle-coordination.js';
export type { PunctuationPolicy } from './convert/attach-dependents.js';
export type { TraceMode } from './convert/prepare-tree.js';

// The whole job, one function each.
export type { ConversionOptions, ResolvedConversion } from './api/options.js';
export { checkOptions, conversionDefaults, conversionOptionsSchema, OptionsError, resolveConversionOptions } from './api/options.js';
export type { ConversionTally, NamingOptions } from './api/convert.js';
export { convertText, convertTree, convertTrees, namingSchema } from './api/convert.js';
export type { BracketOptions, BracketTally, RebuiltTree } from './api/brackets.js';
export { bracketOptionsSchema, toBrackets } from './api/brackets.js';
export type { StructureAnalysis } from './api/structure.js';
export { analyseStructure } from './api/structure.js';
export type { Validation } from './api/validate.js';
export { validateBracketed, validateConllu } from './api/validate.js';
export type { HeadScore, RoundTrip, Stream, SuggestedLabels, SuggestedTable } from './api/evaluate.js';
export { roundTrip, scoreHeads, suggestHeads, suggestLabels } from './api/evaluate.js';
export type { HeadExplanation } from './api/explain.js';
export { explainHeads } from './api/explain.js';
export { writeReport as writeRoundTripReport } from './report/write-report.js';
export { version } from './version.js';
