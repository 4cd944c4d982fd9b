package align

import (
	"slices"
	"testing"
)

func TestTokenize(t *testing.T) {
	tests := []struct {
		name, in string
		want     []string
		source   string
	}{
		{"plain", "The house is small.", []string{"the", "house", "is", "small"}, "common practice"},
		{"empty", "", nil, "common practice"},
		{"punctuation only", " -- !? ", nil, "common practice"},
		{"sharp s folds to ss", "Straße STRASSE strasse", []string{"strasse", "strasse", "strasse"},
			"Unicode CaseFolding.txt, 00DF; F; 0073 0073"},
		{"final sigma folds to sigma", "ΟΔΥΣΣΕΥΣ Οδυσσεύς", []string{"οδυσσευσ", "οδυσσεύσ"},
			"Unicode CaseFolding.txt, 03A3; C; 03C3 and 03C2; C; 03C3"},
		{"dotted capital I", "İzmir", []string{"i\u0307zmir"}, "Unicode CaseFolding.txt, 0130; F; 0069 0307"},
		{"Kelvin sign", "\u212A", []string{"k"}, "Unicode CaseFolding.txt, 212A; C; 006B"},
		{"titlecase digraph", "ǅemal", []string{"ǆemal"}, "Unicode CaseFolding.txt, 01C5; C; 01C6"},
		{"decomposed input is composed", "e\u0301te\u0301", []string{"été"}, "Unicode NFC"},
		{"apostrophe inside a word", "don't Don’t l'eau rock'n'roll", []string{"don't", "don't", "l'eau", "rock'n'roll"},
			"our decision, see Tokenize"},
		{"quotes at edges", "'quoted' ‘words’ x' ''", []string{"quoted", "words", "x"}, "our decision"},
		{"two apostrophes split", "don''t", []string{"don", "t"}, "our decision"},
		{"modifier letter apostrophe is a letter", "haʼa", []string{"haʼa"}, "Unicode: U+02BC is Lm"},
		{"hyphen splits", "well-known — twenty‐one", []string{"well", "known", "twenty", "one"}, "our decision"},
		{"numbers", "3.5 kg, 1,000 people; 2. ٣ apples", []string{"3.5", "kg", "1,000", "people", "2", "٣", "apples"},
			"our decision; U+0663 is Nd"},
		{"symbols and emoji", "#tag @user $5 I ❤ it 1+1=2", []string{"tag", "user", "5", "i", "it", "1", "1", "2"}, "common practice"},
		{"white space kinds", "a\tb\u00A0c\u2003d\u2028e\r\nf", []string{"a", "b", "c", "d", "e", "f"}, "Unicode Z and Cc"},
		{"zero width space splits", "ab\u200Bcd", []string{"ab", "cd"}, "Unicode: U+200B separates words in Thai and Khmer text"},
		{"soft hyphen is dropped", "co\u00ADoperate", []string{"cooperate"}, "Unicode: U+00AD is an invisible hyphenation hint"},
		{"non-joiner kept", "می\u200cخواهم", []string{"می\u200cخواهم"}, "Unicode: ZWNJ is part of Persian spelling"},
		{"non-joiner at an edge dropped", "\u200cab\u200c", []string{"ab"}, "our decision"},
		{"leading mark dropped", "\u0301abc \u0301", []string{"abc"}, "our decision"},
		{"mark after dropped format char composes", "e\u00AD\u0301", []string{"é"}, "Unicode NFC"},
		{"fullwidth letters fold but stay fullwidth", "ＡＢＣ", []string{"ａｂｃ"}, "Unicode CaseFolding.txt, FF21; C; FF41 (folding is not NFKC)"},
		{"Cherokee folds to capitals", "Ꮳ ꮳ ᏸ Ᏸ", []string{"Ꮳ", "Ꮳ", "Ᏸ", "Ᏸ"},
			"Unicode CaseFolding.txt, AB83; C; 13B3 and 13F8; C; 13F0; Go issue 46101"},
		{"private use is a letter", "a\uE000b", []string{"a\uE000b"}, "our decision"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got := Tokenize(tt.in)
			if !slices.Equal(got, tt.want) {
				t.Errorf("Tokenize(%q) = %q, want %q (%s)", tt.in, got, tt.want, tt.source)
			}
		})
	}
}
