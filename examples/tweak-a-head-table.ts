// Loads a shipped head table, builds a variant of it in code, and explains what each table chooses.
import { explainHeads, loadHeadTable, readBracketedText } from 'treebridge';

// A table that builds on en-content and makes the determiner, not the noun, head a noun phrase.
const variant = loadHeadTable('determiners-first.heads', 'table determiners-first\nbuilds-on en-content\n\n# Noun phrase: the determiner.\nhead NP\n  left any DT\n  right first\n');
const [tree] = readBracketedText('(S (NP-SBJ (DT The) (NN keeper)) (VP (VBD slept)))', {}, () => undefined);
for (const heads of [loadHeadTable('en-content'), variant]) {
  const np = explainHeads(tree!, { heads })!.find((step) => step.label === 'NP-SBJ')!;
  console.log(`${heads.name}: NP-SBJ is headed by "${np.headWord}" (${np.reason})`);
}
