package main

import (
	"bytes"
	"compress/gzip"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"
	"unicode"
)

func TestDecodeIndexNumber(t *testing.T) {
	// Values worked by hand: digits A-Z = 0-25, a-z = 26-51, 0-9 = 52-61,
	// + = 62, / = 63, most significant first. "Bl" = 1*64 + 37.
	for _, tc := range []struct {
		in   string
		want int
		ok   bool
	}{
		{"A", 0, true},
		{"B", 1, true},
		{"c", 28, true},
		{"/", 63, true},
		{"BA", 64, true},
		{"Bl", 101, true},
		{"vOT", 47*64*64 + 14*64 + 19, true},
		{"//////////", 1<<60 - 1, true},
		{"", 0, false},
		{"B=", 0, false},
		{"AAAAAAAAAAA", 0, false}, // 11 digits
	} {
		got, err := decodeIndexNumber(tc.in)
		if (err == nil) != tc.ok || got != tc.want {
			t.Errorf("decodeIndexNumber(%q) = %d, %v; want %d, ok %v", tc.in, got, err, tc.want, tc.ok)
		}
	}
}

func TestReadIndex(t *testing.T) {
	rows, err := ReadIndex(strings.NewReader("00databaseinfo\tc\tnU\nal fin\tFaX\tv\textra\n\nde\tRyg\tf\r\n"), "x.index")
	if err != nil {
		t.Fatal(err)
	}
	want := []IndexEntry{{"00databaseinfo", 28, 39*64 + 20}, {"al fin", 5*64*64 + 26*64 + 23, 47}, {"de", 17*64*64 + 50*64 + 32, 31}}
	if !slices.Equal(rows, want) {
		t.Errorf("got %v, want %v", rows, want)
	}
	for _, tc := range []struct{ in, msg string }{
		{"a\tB\n", "x.index:1: want headword, offset and length"},
		{"a\tB\tB\nb\tB\t*\n", "x.index:2: length: number \"*\""},
		{"a\t\tB\n", "x.index:1: offset: empty number"},
	} {
		_, err := ReadIndex(strings.NewReader(tc.in), "x.index")
		if err == nil || !strings.HasPrefix(err.Error(), tc.msg) {
			t.Errorf("ReadIndex(%q) error %v, want prefix %q", tc.in, err, tc.msg)
		}
	}
}

// writeDictd writes a dictd database of the given articles (headword ->
// text) to dir/base.index and dir/base.dict.dz.
func writeDictd(t testing.TB, dir, base string, heads []string, articles []string) {
	t.Helper()
	var data bytes.Buffer
	var index strings.Builder
	enc := func(n int) string {
		if n == 0 {
			return "A"
		}
		var b []byte
		for ; n > 0; n /= 64 {
			b = append([]byte{dictdDigits[n%64]}, b...)
		}
		return string(b)
	}
	for i, h := range heads {
		index.WriteString(h + "\t" + enc(data.Len()) + "\t" + enc(len(articles[i])) + "\n")
		data.WriteString(articles[i])
	}
	if err := os.WriteFile(filepath.Join(dir, base+".index"), []byte(index.String()), 0o644); err != nil {
		t.Fatal(err)
	}
	var z bytes.Buffer
	zw := gzip.NewWriter(&z)
	zw.Write(data.Bytes())
	zw.Close()
	if err := os.WriteFile(filepath.Join(dir, base+".dict.dz"), z.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
}

func TestOpenDictionary(t *testing.T) {
	dir := t.TempDir()
	writeDictd(t, dir, "d", []string{"00databaseinfo", "de", "la"}, []string{"info\n", "de /dˈe/\n1. from, of\n2. outof\n", "la /lˈa/\nthe\n"})
	d, err := OpenDictionary(filepath.Join(dir, "d"))
	if err != nil {
		t.Fatal(err)
	}
	if got := d.Article(2); got != "la /lˈa/\nthe\n" {
		t.Errorf("article 2 = %q", got)
	}
	// An index row past the end of the data is an error.
	os.WriteFile(filepath.Join(dir, "d.index"), []byte("de\tB\tBA\n"), 0o644)
	if _, err := OpenDictionary(filepath.Join(dir, "d")); err == nil || !strings.Contains(err.Error(), `row 1 ("de") points at bytes 1..65`) {
		t.Errorf("got error %v", err)
	}
}

// TestInstalledDictionaries checks the reader against Debian's FreeDict
// packages where installed: nearly every article must start with its
// headword, which fails at once if offsets or lengths are misdecoded.
// dictfmt indexes headwords without punctuation ("100-meter dash" under
// "100meter dash"), so only letters and digits are compared.
func TestInstalledDictionaries(t *testing.T) {
	names, _ := filepath.Glob("/usr/share/dictd/freedict-*.index")
	if len(names) == 0 {
		t.Skip("no FreeDict dictionaries in /usr/share/dictd (scripts/align-eval.sh installs them)")
	}
	for _, name := range names {
		d, err := OpenDictionary(strings.TrimSuffix(name, ".index"))
		if err != nil {
			t.Fatal(err)
		}
		match, total := 0, 0
		for i, e := range d.Index {
			if IsMetadata(e.Headword) {
				continue
			}
			total++
			if strings.HasPrefix(alnum(d.Article(i)), alnum(e.Headword)) {
				match++
			}
		}
		if total < 500 || float64(match) < 0.99*float64(total) {
			t.Errorf("%s: %d of %d articles start with their headword", name, match, total)
		}
	}
}

// alnum returns the letters and digits of s, lower-cased.
func alnum(s string) string {
	return strings.Map(func(r rune) rune {
		if unicode.IsLetter(r) || unicode.IsDigit(r) {
			return unicode.ToLower(r)
		}
		return -1
	}, s)
}

func TestTranslationLines(t *testing.T) {
	// Articles quoted from Debian's FreeDict packages (2022 releases).
	for _, tc := range []struct {
		name, article string
		want          []string
	}{
		{"spa-eng numbered", "de /dˈe/\n1. from, of\n2. outof\n", []string{"from, of", "outof"}},
		{"spa-eng single", "la /lˈa/\nthe\n", []string{"the"}},
		{"swh-eng blank line", "haki /hˈaki/ <n> [sg=pl]\n\nrighteousness\n", []string{"righteousness"}},
		{"swh-eng number then line", "kwa /kwˈa/ <prep>\n1.\nwith\n2.\nto\n3.\nfor\n", []string{"with", "to", "for"}},
		{"eng-fin single with definition", "everyone //ˈɛv.ɹi.wʌn// <pronoun>\njokainen, kaikki\nevery person\n", []string{"jokainen, kaikki"}},
		{"eng-fin senses", "freedom //ˈfɹidəm// <n>\nvapaus 2.\nstate of not being imprisoned or enslaved\n 3.\nlack of a specific constraint\n",
			[]string{"vapaus"}},
		{"eng-ind numbered with definitions", "in //ɪn// <preposition>\n1. di dalam, di\ncontained by\n2. di 2.\nindicating a state\n 3.\ninto\n",
			[]string{"di dalam, di", "di"}},
		{"eng-ind no definition", "right //ˈɹaɪt// <adj>\n1. benar, betul\n2. kanan 2.\nof direction, opposite of left\n",
			[]string{"benar, betul", "kanan"}},
		{"headword only", "x /x/\n", nil},
	} {
		if got := TranslationLines(tc.article); !slices.Equal(got, tc.want) {
			t.Errorf("%s: got %q, want %q", tc.name, got, tc.want)
		}
	}
}

func TestTranslationItems(t *testing.T) {
	for _, tc := range []struct {
		in   string
		want []string
	}{
		{"claim, presumption, pretence", []string{"claim", "presumption", "pretence"}},
		{"(intransitive) to return to normal upright position", []string{"to return to normal upright position"}},
		{"sağ (taraf)", []string{"sağ"}},
		{"her bir, -de, -ne: twice a year senede iki  defa", []string{"her bir", "-de", "-ne"}},
		{"doğru, düz; dik", []string{"doğru", "düz", "dik"}},
		{"a (b, c), d", []string{"a", "d"}},
		{" , ;", nil},
		{"unbalanced ) paren, x", []string{"unbalanced  paren", "x"}},
	} {
		if got := TranslationItems(tc.in); !slices.Equal(got, tc.want) {
			t.Errorf("TranslationItems(%q) = %q, want %q", tc.in, got, tc.want)
		}
	}
}

func FuzzReadIndex(f *testing.F) {
	f.Add("00databaseinfo\tc\tnU\nal fin\tFaX\tv\n")
	f.Add("a\tB\n\t\t\n")
	f.Fuzz(func(t *testing.T, s string) {
		rows, err := ReadIndex(strings.NewReader(s), "fuzz")
		if err != nil {
			return
		}
		for _, r := range rows {
			if r.Offset < 0 || r.Length < 0 {
				t.Fatalf("negative number in %v", r)
			}
		}
	})
}

func FuzzTranslationLines(f *testing.F) {
	f.Add("kwa /kwˈa/ <prep>\n1.\nwith\n2.\nto\n")
	f.Add("freedom <n>\nvapaus 2.\nstate of\n 3.\nlack\n")
	f.Add("x\n12345. y\n1.z\n")
	f.Fuzz(func(t *testing.T, article string) {
		for _, line := range TranslationLines(article) {
			if line == "" || strings.TrimSpace(line) != line {
				t.Fatalf("line %q is empty or not trimmed", line)
			}
			for _, item := range TranslationItems(line) {
				if item == "" || strings.TrimSpace(item) != item || strings.ContainsAny(item, ",;:()[]{}<>") {
					t.Fatalf("item %q of %q is empty, not trimmed or holds a separator", item, line)
				}
			}
		}
	})
}

// TestIsMetadata covers dictfmt's two spellings of its own entries.
func TestIsMetadata(t *testing.T) {
	for h, want := range map[string]bool{"00databaseinfo": true, "00-database-url": true, "00s": false, "de": false} {
		if IsMetadata(h) != want {
			t.Errorf("IsMetadata(%q) = %v", h, !want)
		}
	}
}
