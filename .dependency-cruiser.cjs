// Import rules of treebridge, written from the architecture in DEVELOPERS.md: the parts stand in a
// row, and each imports only parts before it (and itself). npm test runs these rules.
//
//   model → diagnostics → formats, tables, analysis → traces → convert, reverse → lossless
//   → validate, evaluate → report → api → index (api and index: the library) → cli → bin
//
// src/generated (parsers built from grammars/) and src/version.ts may be used by any part.

/** Parts in order; parts on one line stand side by side and do not import each other. */
const rows = [['model'], ['diagnostics'], ['formats', 'tables', 'analysis'], ['traces'], ['convert', 'reverse'], ['lossless'], ['validate', 'evaluate'], ['report'], ['api'], ['index'], ['cli'], ['bin']];
const path = (part) => (part === 'index' ? '^src/index\\.ts$' : `^src/${part}/`);
const rowOf = new Map(rows.flatMap((row, i) => row.map((part) => [part, i])));

/** For each part, the parts it may not import: those after it and those beside it. */
const forbidden = [...rowOf].map(([part, row]) => {
  const notAllowed = [...rowOf].filter(([other, otherRow]) => other !== part && otherRow >= row).map(([other]) => path(other));
  return {
    name: `${part}-imports-only-earlier-parts`,
    comment: `${part} may import only the parts before it in the row (DEVELOPERS.md, Layout)`,
    severity: 'error',
    from: { path: path(part) },
    to: { path: notAllowed },
  };
});

module.exports = {
  forbidden: [
    ...forbidden.filter((rule) => rule.to.path.length > 0),
    {
      name: 'no-import-loops',
      comment: 'no loop of imports, type-only ones included',
      severity: 'error',
      from: {},
      to: { circular: true },
    },
    {
      name: 'library-without-command-line',
      comment: 'the library (index and api) never loads the command line, commander or cli-progress',
      severity: 'error',
      from: { path: ['^src/index\\.ts$', '^src/api/'] },
      to: { path: ['^src/cli/', 'node_modules/commander', 'node_modules/cli-progress'] },
    },
    {
      name: 'only-the-command-line-uses-commander',
      comment: 'commander and cli-progress belong to the command line',
      severity: 'error',
      from: { pathNot: ['^src/cli/', '^src/bin/'] },
      to: { path: ['node_modules/commander', 'node_modules/cli-progress'] },
    },
    {
      name: 'formats-never-convert',
      comment: 'readers and writers never import conversion, the way back or lossless mode',
      severity: 'error',
      from: { path: '^src/formats/' },
      to: { path: ['^src/convert/', '^src/reverse/', '^src/lossless/', '^src/traces/'] },
    },
  ],
  options: {
    doNotFollow: { path: 'node_modules' },
    // Type-only imports count: a loop of types is still a loop.
    tsPreCompilationDeps: true,
    tsConfig: { fileName: 'tsconfig.json' },
    exclude: { path: '^src/generated/' },
  },
};
