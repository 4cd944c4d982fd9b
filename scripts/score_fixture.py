"""score_fixture.py writes segment/score/testdata/reference.json.

The fixture holds pairs of segmentations (reference, predicted) with the
scores that outside libraries give for them, so that the Go package
segment/score can be checked against them without Python:

  boundary P/R/F  sklearn.metrics.precision_recall_fscore_support on the
                  boundary indicator vectors of all word-internal gaps
                  (average="binary", pos_label=1, zero_division=0)
  token P/R/F     nltk.metrics.scores precision, recall, f_measure on the
                  sets of (line, start, end) token spans
  lexicon P/R/F   the same functions on the sets of word types
  WindowDiff, Pk  nltk.metrics.segmentation windowdiff and pk on the
                  corpus's boundary string (see gap_string)

Conventions, the same as the Go package documents:
  - offsets count characters (Python str code points, Go runes);
  - NLTK returns None where a denominator is 0; that is recorded as 0, the
    same value sklearn gives with zero_division=0;
  - the corpus is one sequence of N characters with N-1 gaps; a gap is "1"
    if it is a word boundary inside an utterance or an utterance edge;
  - the window k = floor((N + W) / (2W)) for W reference words (half the
    mean reference word length, rounded half up); with N < 2 there are no
    gaps and window, windowdiff and pk are recorded as 0 (NLTK cannot be
    called on an empty sequence).

Run it with Debian's /usr/bin/python3 through scripts/score-fixture.sh:

    /usr/bin/python3 scripts/score_fixture.py OUT.json
"""

import json
import platform
import random
import sys

import nltk
import numpy
import sklearn
from nltk.metrics import scores as nltk_scores
from nltk.metrics import segmentation as nltk_segmentation
from sklearn.metrics import precision_recall_fscore_support

from fixture_common import package_version, write_atomic

SEED = 20240607
RANDOM_CASES = 220


def ends(words):
    """Return the end offset, in characters, of each word."""
    out, end = [], 0
    for w in words:
        end += len(w)
        out.append(end)
    return out


def boundary_vectors(ref, pred):
    """Return the indicator vectors of the word-internal gaps of all lines."""
    y_true, y_pred = [], []
    for r, p in zip(ref, pred):
        n = len("".join(r))
        rb, pb = set(ends(r)[:-1]), set(ends(p)[:-1])
        for gap in range(1, n):
            y_true.append(1 if gap in rb else 0)
            y_pred.append(1 if gap in pb else 0)
    return y_true, y_pred


def spans(corpus):
    out = set()
    for line, words in enumerate(corpus):
        start = 0
        for end in ends(words):
            out.add((line, start, end))
            start = end
    return out


def types(corpus):
    return {w for words in corpus for w in words}


def gap_string(corpus):
    """Return the corpus's N-1 gaps as a string of "0" and "1"."""
    out, seen = [], False
    for words in corpus:
        n = len("".join(words))
        if n == 0:
            continue  # a line with no words adds no characters
        if seen:
            out.append("1")  # the edge between this utterance and the last
        seen = True
        b = set(ends(words)[:-1])
        out.extend("1" if gap in b else "0" for gap in range(1, n))
    return "".join(out)


def nltk_prf(reference, test):
    p = nltk_scores.precision(reference, test)
    r = nltk_scores.recall(reference, test)
    f = nltk_scores.f_measure(reference, test)
    return {"precision": float(p or 0), "recall": float(r or 0), "f": float(f or 0)}


def score(name, ref, pred):
    assert len(ref) == len(pred), name
    for r, p in zip(ref, pred):
        assert "".join(r) == "".join(p), name
        assert all(w and " " not in w for w in r + p), name

    y_true, y_pred = boundary_vectors(ref, pred)
    bp, br, bf, _ = precision_recall_fscore_support(
        y_true, y_pred, average="binary", pos_label=1, zero_division=0)

    n = sum(len("".join(words)) for words in ref)
    w = sum(len(words) for words in ref)
    gaps_ref, gaps_pred = gap_string(ref), gap_string(pred)
    assert len(gaps_ref) == len(gaps_pred) == max(n - 1, 0), name
    if gaps_ref:
        k = max(1, (n + w) // (2 * w))
        wd = nltk_segmentation.windowdiff(gaps_ref, gaps_pred, k, boundary="1")
        pk = nltk_segmentation.pk(gaps_ref, gaps_pred, k, boundary="1")
    else:
        k, wd, pk = 0, 0.0, 0.0

    return {
        "name": name,
        "reference": ref,
        "predicted": pred,
        "utterances": len(ref),
        "characters": n,
        "boundary": {"precision": float(bp), "recall": float(br), "f": float(bf)},
        "token": nltk_prf(spans(ref), spans(pred)),
        "lexicon": nltk_prf(types(ref), types(pred)),
        "windowdiff": float(wd),
        "pk": float(pk),
        "window": k,
    }


def split(text, boundaries):
    """Split text at the given character offsets."""
    words, start = [], 0
    for b in sorted(boundaries) + [len(text)]:
        words.append(text[start:b])
        start = b
    return words


def hand_cases():
    """Edge cases chosen by hand. Each is (name, reference, predicted)."""
    def every(text):
        return list(text)

    cases = [
        ("empty corpus", [], []),
        ("one character", [["a"]], [["a"]]),
        ("line with no words", [["ab"], [], ["c"]], [["a", "b"], [], ["c"]]),
        ("identical", [["ab", "c", "de"], ["f", "gh"]], [["ab", "c", "de"], ["f", "gh"]]),
        ("identical one word per line", [["abc"], ["de"]], [["abc"], ["de"]]),
        ("single-character lines", [["a"], ["b"], ["a"], ["c"]], [["a"], ["b"], ["a"], ["c"]]),
        ("single-character lines among longer", [["a"], ["b", "c"], ["d"]], [["a"], ["bc"], ["d"]]),
        ("no boundaries vs all boundaries", [["abcdef"], ["ghi"]], [every("abcdef"), every("ghi")]),
        ("all boundaries vs no boundaries", [every("abcdef"), every("ghi")], [["abcdef"], ["ghi"]]),
        ("under-segmented", [["ab", "c", "de"]], [["ab", "cde"]]),
        ("over-segmented", [["ab", "cde"]], [["a", "b", "c", "de"]]),
        ("shifted boundaries", [["the", "dog"]], [["th", "edog"]]),
        ("repeated words", [["a", "a", "a", "a"]], [["aa", "aa"]]),
        ("repeated words across lines", [["ab", "ab"], ["ab"], ["a", "b"]], [["abab"], ["ab"], ["a", "b"]]),
        ("same types different tokens", [["ab", "c"], ["c", "ab"]], [["a", "bc"], ["c", "ab"]]),
        ("multi-line opposite", [["a", "b"], ["cd"]], [["ab"], ["c", "d"]]),
        ("long word window 2", [["abcd"]], [["ab", "cd"]]),
        ("IPA digraphs", [["ʃa", "tʰə"]], [["ʃ", "atʰə"]]),
        ("IPA split inside a unit", [["tʰa", "ŋ"], ["ʃʃ"]], [["t", "ʰaŋ"], ["ʃ", "ʃ"]]),
        ("combining mark", [["e\u0301", "a"]], [["e", "\u0301a"]]),
        ("combining marks identical", [["e\u0301a\u0300", "o\u0303"]], [["e\u0301a\u0300", "o\u0303"]]),
        ("precomposed", [["é", "à"]], [["éà"]]),
        ("astral plane", [["\U0001D44E\U0001D44F", "c"]], [["\U0001D44E", "\U0001D44Fc"]]),
        ("ASCII phoneme symbols", [["@#", "$%&"], ["^~", "*+|!-369"]], [["@", "#$%&"], ["^~*+|", "!-369"]]),
        ("capitals are phonemes", [["Ab", "C"], ["aB", "c"]], [["Ab", "C"], ["a", "Bc"]]),
        ("many short lines", [["a", "b"]] * 30, [["ab"]] * 15 + [["a", "b"]] * 15),
        ("one long line", [split("ab" * 40, range(2, 80, 2))], [split("ab" * 40, range(4, 80, 4))]),
        ("long words", [split("x" * 60, [20, 40])], [split("x" * 60, [19, 41])]),
    ]
    for name, ref, pred in cases:
        for r, p in zip(ref, pred):
            assert "".join(r) == "".join(p), name
    return cases


ALPHABETS = [
    ["a", "b"],
    ["a", "b", "c"],
    ["p", "t", "k", "a", "i", "u"],
    ["ʃ", "tʰ", "a", "ə", "ŋ", "e\u0301"],   # multi-character units, combining mark
    ["a", "\U0001D44E", "ɪ"],               # a character outside the BMP
    ["@", "#", "3", "A"],
]


def random_cases(rng):
    """Random corpora: texts over a small alphabet, split at random gaps."""
    cases = []
    for i in range(RANDOM_CASES):
        alphabet = rng.choice(ALPHABETS)
        n_lines = rng.choice([1, 1, 2, 3, 5, 8, 20])
        max_len = rng.choice([4, 12, 12, 30])
        p_ref = rng.uniform(0.02, 0.8)
        mode = rng.choice(["perturb", "perturb", "independent", "identical", "none", "all"])
        flip = rng.uniform(0.0, 0.5)
        p_pred = rng.uniform(0.0, 1.0)
        ref, pred = [], []
        for _ in range(n_lines):
            text = "".join(rng.choice(alphabet) for _ in range(rng.randint(1, max_len)))
            gaps = range(1, len(text))
            rb = {g for g in gaps if rng.random() < p_ref}
            if mode == "perturb":
                pb = {g for g in gaps if (g in rb) != (rng.random() < flip)}
            elif mode == "independent":
                pb = {g for g in gaps if rng.random() < p_pred}
            elif mode == "identical":
                pb = set(rb)
            elif mode == "none":
                pb = set()
            else:
                pb = set(gaps)
            ref.append(split(text, rb))
            pred.append(split(text, pb))
        cases.append(("random %d (%s)" % (i, mode), ref, pred))
    return cases



def dump(fixture):
    """Return fixture as JSON text with one case per line, for short diffs."""
    head = {k: v for k, v in fixture.items() if k != "cases"}
    text = json.dumps(head, ensure_ascii=False, indent=1)[:-2]
    cases = ",\n  ".join(json.dumps(c, ensure_ascii=False) for c in fixture["cases"])
    return text + ',\n "cases": [\n  ' + cases + "\n ]\n}\n"


def main():
    if len(sys.argv) != 2:
        sys.exit("usage: score_fixture.py OUT.json")
    out = sys.argv[1]
    rng = random.Random(SEED)
    cases = [score(*c) for c in hand_cases() + random_cases(rng)]
    fixture = {
        "description": "Segmentation scores computed by reference libraries; "
                       "regenerate with scripts/score-fixture.sh. "
                       "Conventions: see scripts/score_fixture.py.",
        "versions": {
            "python": platform.python_version(),
            "sklearn": sklearn.__version__,
            "nltk": nltk.__version__,
            "numpy": numpy.__version__,
            "debian": {p: package_version(p) for p in
                       ["python3-sklearn", "python3-nltk", "python3-numpy"]},
        },
        "seed": SEED,
        "cases": cases,
    }
    write_atomic(out, dump(fixture), prefix=".reference-")
    print("wrote %d cases to %s" % (len(cases), out))


if __name__ == "__main__":
    main()
