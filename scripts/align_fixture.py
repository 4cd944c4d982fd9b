"""align_fixture.py writes align/testdata/ibm1_nltk.json.

The fixture holds small parallel corpora with the IBM Model 1 translation
tables that NLTK's nltk.translate.IBMModel1 learns from them, so that the Go
package align can be checked against NLTK without Python.

Direction. In juncture the transcript words generate the translation
tokens: t(token | word). NLTK's IBMModel1 translates from AlignedSent.mots
(source, with NULL added) to AlignedSent.words (target), and its
translation_table[target][source] is t(target | source). So each pair is
built as AlignedSent(words=tokens, mots=words), and the fixture records
t(token | word) = translation_table[token][word], word None being NULL.

What NLTK does, from nltk/translate/ibm1.py and ibm_model.py (3.8):
  - initial table 1 / |target vocabulary| for every pair;
  - E-step: each target token is aligned to each source position, NULL
    included, in proportion to the current table;
  - M-step: t(e|w) = count(e, w) / count(w), floored at MIN_PROB = 1e-12.
The Go package starts from t(e|w) = p(e) instead of the uniform table;
both make every alignment equally likely in the first E-step, so the
tables agree from the first iteration on. The script checks that no value
came near MIN_PROB, so the floor never acted.

NLTK quirk avoided: prob_all_alignments keys its normaliser by token
string, so a token repeated within one target sentence gets its
normaliser counted twice and its occurrences add up to one token's
count instead of two. Brown et al.'s Model 1, and the Go package, count
every occurrence. Random pairs therefore never repeat a token within a
translation (repeated source words are fine and are included).

Each corpus also has "logprobs": for short pairs, log P(tokens | words)
= log( sum over all alignments a of prod_j t(e_j | w_a_j) / (k+1)^m ),
the sum enumerated with NLTK's IBMModel1.prob_t_a_given_s on every
AlignmentInfo, checking the Go package's product-of-sums form.

Run it with Debian's /usr/bin/python3 through scripts/align-fixture.sh:

    /usr/bin/python3 scripts/align_fixture.py OUT.json
"""

import itertools
import json
import math
import platform
import random
import sys

import nltk
from nltk.translate import AlignedSent, IBMModel1
from nltk.translate.ibm_model import AlignmentInfo, IBMModel

from fixture_common import package_version, write_atomic

SEED = 20250214


def nltk_doc_corpus():
    """The corpus of the IBMModel1 docstring (nltk/translate/ibm1.py).

    There the German side is AlignedSent.words, the target, so here it is
    the translation and English the transcript words.
    """
    german_english = [
        ("klein ist das haus", "the house is small"),
        ("das haus ist ja groß", "the house is big"),
        ("das buch ist ja klein", "the book is small"),
        ("das haus", "the house"),
        ("das buch", "the book"),
        ("ein buch", "a book"),
    ]
    return [(en.split(), de.split()) for de, en in german_english]


def textbook_corpus():
    """The three pairs of the EM example in Koehn, Statistical Machine
    Translation (2010), section 4.2 (recalled from memory): German words,
    English translation."""
    return [
        ("das Haus".split(), "the house".split()),
        ("das Buch".split(), "the book".split()),
        ("ein Buch".split(), "a book".split()),
    ]


def random_corpus(rng, n_pairs, n_words, n_tokens, max_words):
    """Pairs generated from a hidden word-to-token dictionary with noise.

    Words are drawn with Zipf-like weights and may repeat within a pair;
    tokens never repeat within a translation (see the module doc).
    """
    words = ["w%02d" % i for i in range(n_words)]
    tokens = ["t%02d" % i for i in range(n_tokens)]
    gloss = {w: rng.choice(tokens) for w in words}
    weights = [1.0 / (i + 1) for i in range(n_words)]
    pairs = []
    for _ in range(n_pairs):
        ws = rng.choices(words, weights, k=rng.randint(1, max_words))
        ts = []
        for w in ws:
            if rng.random() < 0.7 and gloss[w] not in ts:
                ts.append(gloss[w])
        for _ in range(rng.randint(0, 2)):
            t = rng.choice(tokens)
            if t not in ts:
                ts.append(t)
        if not ts:
            ts.append(rng.choice(tokens))
        rng.shuffle(ts)
        pairs.append((ws, ts))
    return pairs


def train(pairs, iterations):
    """Train IBMModel1 one iteration at a time, checking after each that
    the MIN_PROB floor did not act (no co-occurring cell within a factor 10
    of it), so NLTK's table is the plain EM table."""
    bitext = [AlignedSent(ts, ws) for ws, ts in pairs]
    for _, ts in pairs:
        assert len(set(ts)) == len(ts), "repeated token in a translation"
    model = IBMModel1(bitext, 0)
    for _ in range(iterations):
        model.train(bitext)
        for t, w in cells(pairs):
            p = model.translation_table[t][w]
            assert p > 10 * IBMModel.MIN_PROB, "MIN_PROB floor reached: %r %r %r" % (t, w, p)
    return model


def cells(pairs):
    """The co-occurring (token, word) cells, NULL as None, in a fixed order."""
    out = set()
    for ws, ts in pairs:
        for t in ts:
            for w in [None] + ws:
                out.add((t, w))
    return sorted(out, key=lambda c: (c[0], "" if c[1] is None else "~" + c[1]))


def table(model, pairs):
    """t(token | word) for every co-occurring pair, NULL as None."""
    return [[t, w, model.translation_table[t][w]] for t, w in cells(pairs)]


def logprobs(model, pairs, limit=5000):
    """log P(tokens | words) by enumerating alignments with NLTK, for the
    pairs with at most limit alignments."""
    out = []
    for i, (ws, ts) in enumerate(pairs):
        k, m = len(ws), len(ts)
        if (k + 1) ** m > limit:
            continue
        src = tuple([None] + ws)
        trg = tuple(["UNUSED"] + ts)
        total = 0.0
        floored = 0
        for a in itertools.product(range(k + 1), repeat=m):
            info = AlignmentInfo((0,) + a, src, trg, None)
            p = model.prob_t_a_given_s(info)
            if p <= IBMModel.MIN_PROB:
                floored += 1
            total += p
        # prob_t_a_given_s floors each alignment's product at MIN_PROB;
        # keep only pairs where that moves the sum by less than 1e-11 of
        # itself.
        if floored * IBMModel.MIN_PROB >= 1e-11 * total:
            continue
        out.append({"pair": i, "logprob": math.log(total) - m * math.log(k + 1)})
    return out


def corpus(name, pairs, iterations):
    model = train(pairs, iterations)
    lps = logprobs(model, pairs)
    assert len(lps) >= min(5, len(pairs)), "too few pairs for logprobs"
    return {
        "name": name,
        "iterations": iterations,
        "pairs": [{"words": ws, "tokens": ts} for ws, ts in pairs],
        "table": table(model, pairs),
        "logprobs": lps,
    }



def dump(fixture):
    """Return fixture as JSON text with one pair or table row per line."""
    lines = ["{"]
    head = [k for k in fixture if k != "corpora"]
    for k in head:
        lines.append(" %s: %s," % (json.dumps(k), json.dumps(fixture[k], ensure_ascii=False)))
    lines.append(' "corpora": [')
    for ci, c in enumerate(fixture["corpora"]):
        lines.append("  {")
        lines.append('   "name": %s,' % json.dumps(c["name"]))
        lines.append('   "iterations": %d,' % c["iterations"])
        for key in ["pairs", "table", "logprobs"]:
            items = ",\n    ".join(json.dumps(x, ensure_ascii=False) for x in c[key])
            comma = "," if key != "logprobs" else ""
            lines.append('   "%s": [\n    %s\n   ]%s' % (key, items, comma))
        lines.append("  }" + ("," if ci + 1 < len(fixture["corpora"]) else ""))
    lines.append(" ]")
    lines.append("}")
    return "\n".join(lines) + "\n"


def main():
    if len(sys.argv) != 2:
        sys.exit("usage: align_fixture.py OUT.json")
    out = sys.argv[1]
    rng = random.Random(SEED)
    corpora = [
        corpus("nltk-docstring", nltk_doc_corpus(), 5),
        corpus("textbook", textbook_corpus(), 3),
        corpus("random-small", random_corpus(rng, 30, 10, 12, 4), 10),
        corpus("random-large", random_corpus(rng, 300, 60, 50, 7), 5),
    ]
    fixture = {
        "description": "IBM Model 1 tables t(token|word) learned by "
                       "nltk.translate.IBMModel1, NULL word as null; "
                       "regenerate with scripts/align-fixture.sh. "
                       "Conventions: see scripts/align_fixture.py.",
        "versions": {
            "python": platform.python_version(),
            "nltk": nltk.__version__,
            "debian": {"python3-nltk": package_version("python3-nltk")},
        },
        "seed": SEED,
        "corpora": corpora,
    }
    write_atomic(out, dump(fixture), prefix=".ibm1_nltk-")
    print("wrote %d corpora to %s" % (len(corpora), out))


if __name__ == "__main__":
    main()
