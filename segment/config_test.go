package segment_test

import (
	"math"
	"strings"
	"testing"

	. "github.com/juncture-project/juncture/segment"
)

// TestConfigValidate checks that each out-of-range setting is named in
// the error, and that the defaults pass.
func TestConfigValidate(t *testing.T) {
	if err := DefaultConfig().Validate(); err != nil {
		t.Fatalf("defaults: %v", err)
	}
	cases := []struct {
		change func(*Config)
		want   string
	}{
		{func(c *Config) { c.Model = "trigram" }, "unknown model"},
		{func(c *Config) { c.Base = "zipf" }, "unknown base"},
		{func(c *Config) { c.Sampler = "slice" }, "unknown sampler"},
		{func(c *Config) { c.Proposal = "word" }, "unknown proposal"},
		{func(c *Config) { c.MaxWordLength = -1 }, "maximum word length"},
		{func(c *Config) { c.Iterations = 0 }, "iterations"},
		{func(c *Config) { c.Burnin = c.Iterations }, "burn-in"},
		{func(c *Config) { c.Chains = 0 }, "chains"},
		{func(c *Config) { c.Discount1 = 1 }, "discounts"},
		{func(c *Config) { c.Alpha0 = 0 }, "concentrations"},
		{func(c *Config) { c.Alpha1 = math.Inf(1) }, "concentrations"},
		{func(c *Config) { c.NgramOrder = -1 }, "n-gram order"},
		{func(c *Config) { c.TranslationMinCount = -1 }, "translation min-count"},
		{func(c *Config) { c.WordEnd = 1 }, "word-end"},
		{func(c *Config) { c.Converge = 0.9 }, "convergence"},
		{func(c *Config) { c.TranslationWeight = -1 }, "translation weight"},
		{func(c *Config) { c.Phonotactics = true }, "phonotactics need the syllable nuclei"},
		{func(c *Config) { c.PhonotacticsBeta = -1 }, "phonotactics beta"},
		{func(c *Config) { c.PhonotacticsBeta = math.NaN() }, "phonotactics beta"},
	}
	for _, tc := range cases {
		cfg := DefaultConfig()
		tc.change(&cfg)
		err := cfg.Validate()
		if err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s: got error %v", tc.want, err)
		}
	}
	for _, p := range []string{"", "unigram", "bigram"} {
		cfg := DefaultConfig()
		cfg.Proposal = p
		if err := cfg.Validate(); err != nil {
			t.Errorf("proposal %q: %v", p, err)
		}
	}
}

// TestSamplerFor checks the "auto" choice on corpora of short and long
// utterances.
func TestSamplerFor(t *testing.T) {
	short := tinyCorpus(t, "abcab", "abcabcabcab")                // mean 8 units
	long := tinyCorpus(t, strings.Repeat("ab", 7), "abcabcabcab") // mean 12.5 units
	cases := []struct {
		sampler, model string
		c              *Corpus
		want           string
	}{
		{"auto", "unigram", short, "blocked"},
		{"auto", "unigram", long, "blocked"},
		{"auto", "bigram", short, "blocked"},
		{"auto", "bigram", long, "boundary"},
		{"boundary", "unigram", short, "boundary"},
		{"blocked", "bigram", long, "blocked"},
	}
	for _, tc := range cases {
		cfg := DefaultConfig()
		cfg.Sampler, cfg.Model = tc.sampler, tc.model
		if got := cfg.SamplerFor(tc.c); got != tc.want {
			t.Errorf("%s sampler, %s model, %d units in %d utterances: got %s, want %s",
				tc.sampler, tc.model, len(tc.c.Units), tc.c.Len(), got, tc.want)
		}
	}
}
