// Converts bracketed trees held in a string to CoNLL-U, as `treebridge to-deps --heads en-content
// --labels en-ud --pos-map en-ptb ferry.psd` does for a file named ferry.psd with these trees.
import { convertText } from 'treebridge';

const trees = '( (S (NP-SBJ (DT The) (NN ferry)) (VP (VBD left) (NP (DT the) (NN harbour))) (. .)) (ID ferry.1))\n';
const conllu = await convertText(trees, { heads: 'en-content', labels: 'en-ud', posMap: 'en-ptb', source: 'ferry.psd' });
process.stdout.write(conllu);
