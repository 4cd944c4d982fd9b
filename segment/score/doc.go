// Package score compares a predicted word segmentation with a reference one.
//
// Both segmentations are lists of utterances (lines), each a list of words.
// Line i of the prediction must spell the same text as line i of the
// reference once its words are concatenated. All positions are character
// offsets (Unicode code points, Go runes) into that concatenated text, so the
// scorer needs no unit inventory: a boundary is an offset between two
// characters, a token is a (line, start, end) span. A combining mark or a
// spacing modifier letter such as the ʰ of tʰ is a character of its own.
//
// Compare reports, as DESIGN.md section 6 specifies:
//
//   - Boundary precision, recall and F over word boundaries inside
//     utterances; utterance edges are not counted. Counts are pooled over
//     the whole corpus (micro-averaged), not averaged per line.
//   - Token precision, recall and F: a predicted token is correct when a
//     reference token has the same line, start and end.
//   - Lexicon precision, recall and F over the sets of word types (distinct
//     word strings) of the whole corpus.
//
// F is the harmonic mean 2PR/(P+R). When a denominator is zero (no
// predicted or no reference items, or P+R = 0) the quotient is defined as
// 0. This is the convention of scikit-learn's precision_recall_fscore_support
// with zero_division=0, and the value NLTK's nltk.metrics.scores functions
// give as None is mapped to 0 as well. A consequence worth knowing: a corpus
// whose reference has no word-internal boundary at all scores boundary
// P = R = F = 0 even against an identical prediction.
//
// Compare also reports WindowDiff (Pevzner & Hearst 2002) and Pk (Beeferman,
// Berger & Lafferty 1999). For these the corpus is one sequence of N
// characters with N-1 gaps between them; a gap is a boundary if it is a
// word boundary inside an utterance or the edge between two utterances.
// Utterance edges are boundaries in both segmentations, so they never add
// a WindowDiff error, and a Pk window that spans one never counts as an
// error. The window k is half the mean reference word length, rounded half
// up: k = floor((N + W) / (2W)) for W reference words (common practice
// after Pevzner & Hearst 2002, who take half the mean reference segment
// length). Each of the N-k windows covers k consecutive gaps, which is the
// boundary-indicator encoding NLTK's nltk.metrics.segmentation uses. A
// corpus of a single character has no gaps; then Window, WindowDiff and Pk
// are all 0.
//
// ReadSegmented reads segmented text files: one utterance per line, words
// separated by spaces.
//
// The reference fixture testdata/reference.json is computed with Debian's
// python3-sklearn and python3-nltk by scripts/score-fixture.sh.
package score
