// Package evalcorpus loads the evaluation corpora the benchmark scripts
// run on: the English child-directed corpus outside the repository
// (../shared/corpora/cds-english/gold.txt, never copied in) and the UDHR
// corpora in data/eval/udhr. Each utterance keeps its unsegmented text (the
// learner's input) beside its reference words, so a decoded segmentation
// can be scored line by line.
package evalcorpus

import (
	"bytes"
	"errors"
	"fmt"
	"math/rand/v2"
	"os"
	"path/filepath"
	"slices"
	"strings"

	"github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/score"
)

// EnglishName is the name of the English corpus.
const EnglishName = "cds-english"

// englishGold is the English corpus's path relative to the repository root.
var englishGold = filepath.Join("..", "shared", "corpora", "cds-english", "gold.txt")

// Root returns the repository root: the nearest directory at or above dir
// holding go.mod.
func Root(dir string) (string, error) {
	for d := dir; ; d = filepath.Dir(d) {
		if _, err := os.Stat(filepath.Join(d, "go.mod")); err == nil {
			return d, nil
		}
		if filepath.Dir(d) == d {
			return "", fmt.Errorf("no go.mod at or above %s (give -root)", dir)
		}
	}
}

// Source names a corpus and its files.
type Source struct {
	// Name is how tables and flags refer to the corpus: "cds-english" or
	// "udhr/LANG".
	Name string `json:"name"`
	// Gold is the reference segmentation, words separated by spaces.
	Gold string `json:"gold"`
	// Input is the unsegmented text, line-aligned with Gold; empty means
	// Gold with its spaces removed.
	Input string `json:"input,omitempty"`
}

// Utterance is one line: the learner's input and the reference words.
type Utterance struct {
	Text string
	Ref  []string
}

// Find lists the corpora under the repository root: the English corpus
// first when present, then every data/eval/udhr/LANG holding input.txt and
// gold.txt, by name. missing describes corpora that were looked for and
// not found.
func Find(root string) (sources []Source, missing []string, err error) {
	gold := filepath.Join(root, englishGold)
	if _, err := os.Stat(gold); err == nil {
		sources = append(sources, Source{Name: EnglishName, Gold: gold})
	} else {
		missing = append(missing, fmt.Sprintf("%s: %s not found, skipped", EnglishName, gold))
	}
	dirs, err := filepath.Glob(filepath.Join(root, "data", "eval", "udhr", "*"))
	if err != nil {
		return nil, nil, err
	}
	slices.Sort(dirs)
	for _, dir := range dirs {
		in, gold := filepath.Join(dir, "input.txt"), filepath.Join(dir, "gold.txt")
		if _, err := os.Stat(in); err != nil {
			continue
		}
		if _, err := os.Stat(gold); err != nil {
			continue
		}
		sources = append(sources, Source{Name: "udhr/" + filepath.Base(dir), Gold: gold, Input: in})
	}
	return sources, missing, nil
}

// Select returns the sources named in the comma-separated list names
// ("all" or "" for every source). A name that is not among sources is an
// error, except the English corpus, which is reported in skipped when
// absent so that scripts run the same way on a machine without it.
func Select(sources []Source, names string) (selected []Source, skipped []string, err error) {
	if names == "" || names == "all" {
		return sources, nil, nil
	}
	for name := range strings.SplitSeq(names, ",") {
		name = strings.TrimSpace(name)
		i := slices.IndexFunc(sources, func(s Source) bool { return s.Name == name })
		switch {
		case i >= 0:
			selected = append(selected, sources[i])
		case name == EnglishName:
			skipped = append(skipped, name)
		default:
			known := make([]string, len(sources))
			for k, s := range sources {
				known[k] = s.Name
			}
			return nil, nil, fmt.Errorf("unknown corpus %q (have %s)", name, strings.Join(known, ", "))
		}
	}
	return selected, skipped, nil
}

// Load reads the first lines utterances of src (all when lines <= 0).
// Empty lines are skipped in both files, as segment.ReadCorpus skips them;
// an input line that does not spell its reference line is an error.
func Load(src Source, lines int) ([]Utterance, error) {
	ref, err := readSegmented(src.Gold)
	if err != nil {
		return nil, err
	}
	var in [][]string
	if src.Input != "" {
		if in, err = readSegmented(src.Input); err != nil {
			return nil, err
		}
		if len(in) != len(ref) {
			return nil, fmt.Errorf("%s: %d utterances, but %s has %d", src.Input, len(in), src.Gold, len(ref))
		}
	}
	if lines > 0 && lines < len(ref) {
		ref = ref[:lines]
	}
	utts := make([]Utterance, len(ref))
	for i, words := range ref {
		text := strings.Join(words, "")
		if in != nil {
			if got := strings.Join(in[i], ""); got != text {
				return nil, fmt.Errorf("%s: utterance %d does not spell the reference line in %s", src.Input, i+1, src.Gold)
			}
		}
		utts[i] = Utterance{Text: text, Ref: words}
	}
	return utts, nil
}

// readSegmented reads a file of segmented lines.
func readSegmented(path string) ([][]string, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	utts, _, err := score.ReadSegmented(f, path)
	return utts, err
}

// Scale returns k copies of utts in an order shuffled by rng (a
// Fisher-Yates shuffle), so that a corpus k times the size has the same
// distribution of utterances. The copies share their reference slices.
// Scale panics if k < 1.
func Scale(utts []Utterance, k int, rng *rand.Rand) []Utterance {
	if k < 1 {
		panic(fmt.Sprintf("evalcorpus: Scale by %d", k))
	}
	out := make([]Utterance, 0, k*len(utts))
	for range k {
		out = append(out, utts...)
	}
	rng.Shuffle(len(out), func(i, j int) { out[i], out[j] = out[j], out[i] })
	return out
}

// Corpus builds the learner's corpus from the utterances' texts, split
// into units as `juncture learn` splits its input (default options).
func Corpus(name string, utts []Utterance) (*segment.Corpus, error) {
	var buf bytes.Buffer
	for _, u := range utts {
		buf.WriteString(u.Text)
		buf.WriteByte('\n')
	}
	c, err := segment.ReadCorpus(&buf, name, segment.ReadOptions{})
	if err != nil {
		return nil, err
	}
	if c.Len() != len(utts) {
		return nil, fmt.Errorf("%s: %d utterances read back from %d", name, c.Len(), len(utts))
	}
	return c, nil
}

// GoldBoundaries returns the reference segmentation of the corpus that
// Corpus builds from utts, as a boundary before each unit (true at
// utterance starts).
func GoldBoundaries(name string, utts []Utterance) ([]bool, error) {
	var buf bytes.Buffer
	for _, u := range utts {
		buf.WriteString(strings.Join(u.Ref, " "))
		buf.WriteByte('\n')
	}
	c, err := segment.ReadCorpus(&buf, name, segment.ReadOptions{SpacesAreBoundaries: true})
	if err != nil {
		return nil, err
	}
	if c.Len() != len(utts) {
		return nil, fmt.Errorf("%s: %d reference utterances read back from %d", name, c.Len(), len(utts))
	}
	return segment.NewSegmentation(c).Boundary, nil
}

// Score compares the segmentation seg of the corpus built from utts with
// their reference words.
func Score(seg *segment.Segmentation, utts []Utterance) (score.Scores, error) {
	if seg.Corpus.Len() != len(utts) {
		return score.Scores{}, errors.New("evalcorpus: segmentation and utterances differ in length")
	}
	ref := make([][]string, len(utts))
	pred := make([][]string, len(utts))
	for i, u := range utts {
		ref[i] = u.Ref
		pred[i] = seg.WordStrings(i)
	}
	return score.Compare(ref, pred)
}
