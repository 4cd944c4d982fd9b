package main

import (
	"fmt"
	"slices"
	"strings"
)

// consonants is the invented consonant inventory of Kelaru, written in IPA.
// Aspirated and labialised stops carry a spacing modifier letter (U+02B0,
// U+02B7) and the affricate a tie bar (U+0361), so several characters make
// one phoneme. The voiced velar stop is written with ASCII g, which the IPA
// accepts as a form of its letter.
var consonants = []string{
	"p", "pʰ", "t", "tʰ", "k", "kʷ", "ʔ",
	"b", "d", "g",
	"m", "n", "ŋ",
	"s", "ʃ", "h", "t͡ʃ",
	"l", "r", "w", "j",
}

// vowels is the vowel inventory: five short vowels and one long vowel,
// marked with the length sign U+02D0.
var vowels = []string{"i", "e", "a", "o", "u", "aː"}

// codas are the consonants that may close a syllable: plain voiceless stops,
// nasals, sibilants and liquids, never an aspirated, labialised, voiced or
// glottal stop, the affricate or a glide.
var codas = []string{"p", "t", "k", "m", "n", "ŋ", "s", "ʃ", "l", "r"}

// units splits an IPA form into phonemes of the inventory, matching the
// longest unit first so that "pʰ" is one unit, not "p" and "ʰ".
func units(form string) ([]string, error) {
	var out []string
	for i := 0; i < len(form); {
		best := ""
		for _, u := range consonants {
			if len(u) > len(best) && strings.HasPrefix(form[i:], u) {
				best = u
			}
		}
		for _, u := range vowels {
			if len(u) > len(best) && strings.HasPrefix(form[i:], u) {
				best = u
			}
		}
		if best == "" {
			return nil, fmt.Errorf("%q: byte %d: not a unit of the inventory", form, i)
		}
		out = append(out, best)
		i += len(best)
	}
	return out, nil
}

// syllables checks form against the CV(C) template and returns its
// syllables. Every syllable has a consonant onset and one vowel; a consonant
// between two vowels is the onset of the second, so a coda appears only
// before another consonant or at the end of the word.
func syllables(form string) ([]string, error) {
	us, err := units(form)
	if err != nil {
		return nil, err
	}
	var out []string
	for i := 0; i < len(us); {
		if !slices.Contains(consonants, us[i]) {
			return nil, fmt.Errorf("%q: unit %d %q: syllable without an onset", form, i+1, us[i])
		}
		if i+1 >= len(us) || !slices.Contains(vowels, us[i+1]) {
			return nil, fmt.Errorf("%q: unit %d %q: onset without a vowel", form, i+1, us[i])
		}
		syl := us[i] + us[i+1]
		i += 2
		if i < len(us) && slices.Contains(consonants, us[i]) && (i+1 == len(us) || !slices.Contains(vowels, us[i+1])) {
			if !slices.Contains(codas, us[i]) {
				return nil, fmt.Errorf("%q: unit %d %q: not allowed as a coda", form, i+1, us[i])
			}
			syl += us[i]
			i++
		}
		out = append(out, syl)
	}
	if len(out) == 0 {
		return nil, fmt.Errorf("empty form")
	}
	return out, nil
}
