package segment_test

import (
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
		{func(c *Config) { c.WordEnd = 1 }, "word-end"},
		{func(c *Config) { c.Converge = 0.9 }, "convergence"},
		{func(c *Config) { c.TranslationWeight = -1 }, "translation weight"},
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
