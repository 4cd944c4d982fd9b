package state

import (
	"bytes"
	"context"
	"errors"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"github.com/juncture-project/juncture/segment"
)

func testCorpus(t *testing.T) *segment.Corpus {
	c, err := segment.ReadCorpus(strings.NewReader("tʰabak a\n\nkiti ba\nt͡ʃaː"), "in.txt",
		segment.ReadOptions{SpacesAreBoundaries: true})
	if err != nil {
		t.Fatal(err)
	}
	return c
}

// TestCorpusRoundTrip: the corpus read back from a state directory is the
// corpus that was saved, units, lines and locks included.
func TestCorpusRoundTrip(t *testing.T) {
	c := testCorpus(t)
	got, err := decodeCorpus(encodeCorpus(c), "corpus.tsv")
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(got.Units, c.Units) || !reflect.DeepEqual(got.Inventory, c.Inventory) ||
		!reflect.DeepEqual(got.Lines, c.Lines) || !reflect.DeepEqual(got.Locks, c.Locks) || !reflect.DeepEqual(got.Starts, c.Starts) {
		t.Errorf("round trip changed the corpus:\n got %+v\nwant %+v", got, c)
	}
}

// TestCreateOpenResume: a state directory written by a run opens to the
// same corpus, settings and chain states.
func TestCreateOpenResume(t *testing.T) {
	dir := t.TempDir()
	c := testCorpus(t)
	cfg := segment.DefaultConfig()
	cfg.Iterations, cfg.Burnin, cfg.Block, cfg.Chains = 12, 6, 5, 2
	if err := Create(dir, c, cfg, "in.txt", nil); err != nil {
		t.Fatal(err)
	}
	if err := Create(dir, c, cfg, "in.txt", nil); !errors.Is(err, ErrExists) {
		t.Fatalf("second Create: err = %v, want ErrExists", err)
	}
	res, err := segment.Run(context.Background(), c, cfg, nil, segment.RunOptions{Checkpoint: func(st *segment.ChainState) error { return SaveChain(dir, st) }})
	if err != nil {
		t.Fatal(err)
	}
	if err := SaveResult(dir, res); err != nil {
		t.Fatal(err)
	}
	c2, s, states, err := Open(dir)
	if err != nil {
		t.Fatal(err)
	}
	if s.Config.Iterations != 12 || s.Input != "in.txt" || c2.Len() != c.Len() {
		t.Errorf("settings %+v", s)
	}
	for i, st := range states {
		if !reflect.DeepEqual(st, res.Chains[i]) {
			t.Errorf("chain %d differs after reading back", i)
		}
	}
	var out bytes.Buffer
	if err := res.Decoded.Write(&out); err != nil {
		t.Fatal(err)
	}
	if b, _ := os.ReadFile(filepath.Join(dir, "segmentation.txt")); !bytes.Equal(b, out.Bytes()) {
		t.Error("segmentation.txt differs from the decoded segmentation")
	}
}

// TestOpenRejectsTamperedCorpus: a corpus that does not match its digest
// is an error, not a silent change of data.
func TestOpenRejectsTamperedCorpus(t *testing.T) {
	dir := t.TempDir()
	c := testCorpus(t)
	if err := Create(dir, c, segment.DefaultConfig(), "in.txt", nil); err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(dir, corpusFile)
	b, _ := os.ReadFile(path)
	os.WriteFile(path, bytes.Replace(b, []byte("k"), []byte("g"), 1), 0o644)
	if _, _, _, err := Open(dir); err == nil || !strings.Contains(err.Error(), "digest") {
		t.Errorf("tampered corpus: err = %v", err)
	}
}

func TestWritePosteriors(t *testing.T) {
	c := testCorpus(t)
	post := make([]float64, len(c.Units))
	for i := range post {
		post[i] = float64(i) / 100
	}
	var b bytes.Buffer
	if err := WritePosteriors(&b, c, post); err != nil {
		t.Fatal(err)
	}
	lines := strings.Split(strings.TrimSpace(b.String()), "\n")
	// Units: tʰ a b a k | a (locked) ; k i t i | b a (locked) ; t͡ʃ aː
	// Free gaps: 4 + 0 in "tʰabak a" minus none... count them.
	if lines[0] != "line\toffset\tunit\tleft\tright\tprobability" {
		t.Errorf("header %q", lines[0])
	}
	if lines[1] != "1\t2\t1\ttʰ\ta\t0.0100" {
		t.Errorf("first row %q", lines[1])
	}
	last := lines[len(lines)-1]
	if !strings.HasPrefix(last, "4\t3\t1\tt͡ʃ\taː\t") {
		t.Errorf("last row %q", last)
	}
	for _, l := range lines[1:] {
		if strings.Contains(l, "\tk\ta\t") && strings.HasPrefix(l, "1\t") {
			t.Errorf("locked gap listed: %q", l)
		}
	}
}
