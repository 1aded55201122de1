"""Reads bracketed files with NLTK (Debian python3-nltk): its s-expression block
reader and Tree.fromstring, as a reference for reading speed. Prints JSON:
trees, words, seconds spent reading, peak memory."""
import json
import resource
import sys
import time

from nltk import Tree
from nltk.corpus.reader.util import read_sexpr_block
from nltk.data import SeekableUnicodeStreamReader

trees = 0
words = 0
started = time.perf_counter()
for path in sys.argv[1:]:
    stream = SeekableUnicodeStreamReader(open(path, 'rb'), 'utf-8')
    while True:
        blocks = read_sexpr_block(stream)
        if not blocks:
            break
        for block in blocks:
            tree = Tree.fromstring(block)
            trees += 1
            words += len(tree.leaves())
seconds = time.perf_counter() - started
peak = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024
print(json.dumps({'trees': trees, 'words': words, 'seconds': seconds, 'peakMB': peak}))
