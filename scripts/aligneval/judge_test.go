package main

import (
	"slices"
	"testing"
)

func TestEnglishForms(t *testing.T) {
	// Expected stems follow the rules in englishForms's documentation
	// (common practice for crude suffix stripping, not a published
	// algorithm).
	for _, tc := range []struct {
		in   string
		want []string
	}{
		{"right", []string{"right"}},
		{"rights", []string{"rights", "right"}},
		{"countries", []string{"countries", "country"}},
		{"states", []string{"states", "stat", "state"}},
		{"based", []string{"based", "bas", "base"}},
		{"protected", []string{"protected", "protect", "protecte"}},
		{"teaching", []string{"teaching", "teach", "teache"}},
		{"has", []string{"has"}},
		{"this", []string{"this"}},
		{"thing", []string{"thing"}},
		{"need", []string{"need"}},
		{"class", []string{"class"}},
		{"status", []string{"status"}},
		{"analysis", []string{"analysis"}},
		{"as", []string{"as"}},
	} {
		if got := englishForms(tc.in); !slices.Equal(got, tc.want) {
			t.Errorf("englishForms(%q) = %q, want %q", tc.in, got, tc.want)
		}
	}
}

func testJudge(minStem int) *Judge {
	j := NewJudge(minStem)
	forward := &Dictionary{Name: "fwd"}
	reverse := &Dictionary{Name: "rev"}
	add := func(d *Dictionary, head, article string) {
		d.Index = append(d.Index, IndexEntry{Headword: head, Offset: len(d.Data), Length: len(article)})
		d.Data = append(d.Data, article...)
	}
	add(forward, "00databaseinfo", "de\nof\n")
	add(forward, "derecho", "derecho /deɾˈetʃo/\n1. claim, presumption\n2. right\n")
	add(forward, "tener", "tener /tenˈeɾ/\nto have, to own\n")
	add(forward, "casa", "casa\nthe house (building)\n")
	add(reverse, "freedom", "freedom <n>\nvapaus 2.\nstate of not being imprisoned\n")
	add(reverse, "in", "in <prep>\n1. di dalam, di\ncontained by\n")
	add(reverse, "right", "right\n1. hak: adalete uygun şekilde\n2. adalete uygun şekilde\n")
	add(reverse, "the thing is", "the thing is\nasia on\n")
	j.AddDictionary(forward, false)
	j.AddDictionary(reverse, true)
	return j
}

func TestJudge(t *testing.T) {
	for _, tc := range []struct {
		minStem   int
		spellings []string
		gloss     string
		known     bool
		correct   bool
	}{
		{0, []string{"derecho"}, "right", true, true},
		{0, []string{"derecho"}, "rights", true, true},   // English ending
		{0, []string{"derecho"}, "claims", true, true},   // any item
		{0, []string{"derecho"}, "the", true, false},     // not a translation
		{0, []string{"derechos"}, "right", false, false}, // no stems
		{4, []string{"derechos"}, "right", true, true},   // stem "derecho"
		{4, []string{"dere"}, "right", false, false},     // no shorter entry
		{0, []string{"tener"}, "have", true, true},       // "to " dropped
		{0, []string{"tener"}, "to", true, false},
		{0, []string{"casa"}, "house", true, true},
		{0, []string{"casa"}, "the", true, false},      // article dropped
		{0, []string{"casa"}, "building", true, false}, // brackets dropped
		{0, []string{"vapaus"}, "freedom", true, true}, // reverse
		{0, []string{"vapaus"}, "state", true, false},  // definition line
		{0, []string{"dalam"}, "in", true, true},       // two-word item
		{0, []string{"hak"}, "right", true, true},      // text after ":" dropped
		{0, []string{"şekilde"}, "right", false, false},
		{0, []string{"on"}, "thing", false, false}, // phrase headword
		{0, []string{"de"}, "of", false, false},    // metadata entry
		{0, []string{"x", "derecho"}, "right", true, true},
		{0, []string{"DERECHO"}, "Right", true, true}, // case folded
	} {
		j := testJudge(tc.minStem)
		if got := j.Known(tc.spellings); got != tc.known {
			t.Errorf("min-stem %d: Known(%q) = %v", tc.minStem, tc.spellings, got)
		}
		if got := j.Correct(tc.spellings, tc.gloss); got != tc.correct {
			t.Errorf("min-stem %d: Correct(%q, %q) = %v", tc.minStem, tc.spellings, tc.gloss, got)
		}
	}
}
