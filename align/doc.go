// Package align is the translation prior: IBM Model 1 with a NULL word
// (Brown, Della Pietra, Della Pietra & Mercer 1993, "The mathematics of
// statistical machine translation: parameter estimation", section 4.1;
// section numbers of outside sources in this package are from memory)
// scoring how well the words of a segmented utterance explain the free
// translation written beside it.
//
// The data flow is one-way: ReadTranslations (or ReadTSV) turns text into
// token lists, one per transcript line; NewModel interns the tokens; Estimate
// fits the translation table to a segmentation given as word type ids;
// LogProb, or a Sums for the sampler's incremental moves, scores a
// segmentation; Glosses reads the table for the lexicon. The package knows
// nothing of units or corpora: a word is any non-negative int32 id, such as a
// segment.WordType.
//
// Decisions not obvious from the code:
//
//   - Direction: the transcript words are the source and generate the
//     translation tokens, P(e | w). A segmentation changes the source side,
//     and the translation stays fixed, so the probabilities of different
//     segmentations of one utterance are comparable. Reverse is Brown et
//     al.'s direction, P(w | e), kept for measurement: on the UDHR corpora
//     (scripts/aligneval -direction) it lowered mean token F at every weight
//     tried, as did its ratio to the background and its product with Model.
//   - No length term: Brown et al.'s epsilon = P(m | k) is left out (taken
//     as 1), so LogProb is the probability of the tokens given their number
//     m, normalised over all vocabulary sequences of length m. The translation
//     is fixed, so a constant epsilon would cancel in every ratio the sampler
//     takes; one that depends on k would be a second length prior on top of
//     the segmentation model's.
//   - The 1/(k+1) per token penalises every extra word: splitting a word
//     multiplies P(e | w) by ((k+1)/(k+2))^m unless the parts explain the
//     tokens better than the whole did. That is Model 1, kept as published;
//     the sampler decides how much weight the factor gets.
//   - Smoothing: t(e|w) = (n(e,w) + Beta p(e)) / (n(w) + Beta) with p(e) the
//     frequency of e among all translation tokens. A word seen rarely, or
//     never (a fresh candidate word in the sampler), predicts translation
//     tokens at their background rate instead of claiming rare ones; with
//     uniform p(e) every unseen word would make each token about 1/|V|
//     likely, favouring rare tokens and penalising frequent ones.
package align
