// Package segment reads unsegmented transcripts, splits them into units
// (phonemes), and finds word boundaries with Bayesian nonparametric models
// sampled by Gibbs sampling.
//
// The data flow is one-way: ReadCorpus turns text into a Corpus of interned
// units; a Segmentation marks the word boundaries of a Corpus; models keep
// word counts for a Segmentation; samplers change the Segmentation and keep the
// model's counts in step; decoding turns boundary posteriors into words.
//
// Positions are unit offsets into Corpus.Units, which holds all utterances
// end to end. Position i of a Segmentation is the gap before unit i; the gap
// before the first unit of an utterance is always a boundary and is never
// sampled.
package segment
