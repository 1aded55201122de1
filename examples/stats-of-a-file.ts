// Measures the dependency trees of a CoNLL-U file: non-projectivity, gap degree, arc lengths.
import { analyseStructure, readConlluFile } from 'treebridge';

const file = process.argv[2] ?? 'demo-data/crossing.conllu';
const { figures, notTrees } = await analyseStructure(readConlluFile(file, {}, () => undefined));
console.log(`${figures.sentences} sentences, ${figures.nonProjectiveSentences} non-projective, gap degrees ${JSON.stringify(figures.gapDegree)}, ${notTrees} not trees`);
