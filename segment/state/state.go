// Package state keeps a learning run on disk so that it can be resumed,
// and later applied, reviewed and reported on (DESIGN section 8).
//
// A state directory holds:
//
//	settings.json      format version, the run's Config, input name, corpus digest
//	corpus.tsv         the corpus as read: source line, units, locks
//	translations.txt   each utterance's translation tokens, if the run has them
//	chain-N.json.gz    chain N: iteration, hyperparameters, sample, counts, trace
//	posteriors.tsv     every free gap's boundary probability (when finished)
//	segmentation.txt   the decoded segmentation (when finished)
//
// Every file is written atomically (temporary file and rename), so a run
// killed at any moment leaves each file either as it was or complete.
package state

import (
	"bufio"
	"bytes"
	"compress/gzip"
	"crypto/sha256"
	"encoding/hex"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strconv"
	"strings"

	"github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/atomicfile"
)

// Version is the format version written to settings.json.
const Version = 1

// Settings is the content of settings.json.
type Settings struct {
	Version int            `json:"version"`
	Input   string         `json:"input"`
	Digest  string         `json:"corpus_sha256"`
	Config  segment.Config `json:"config"`
}

// ErrExists is returned by Create when dir already holds a run.
var ErrExists = errors.New("already holds a run (use --resume to continue it, or another directory)")

const (
	settingsFile     = "settings.json"
	corpusFile       = "corpus.tsv"
	translationsFile = "translations.txt"
)

// Create starts a state directory for a new run on c. translations, when
// not nil, holds each utterance's translation tokens.
func Create(dir string, c *segment.Corpus, cfg segment.Config, input string, translations [][]string) error {
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return err
	}
	if _, err := os.Stat(filepath.Join(dir, settingsFile)); err == nil {
		return fmt.Errorf("%s: %w", dir, ErrExists)
	}
	corpus := encodeCorpus(c)
	if err := atomicfile.WriteBytes(filepath.Join(dir, corpusFile), corpus); err != nil {
		return err
	}
	if translations != nil {
		var b bytes.Buffer
		for _, toks := range translations {
			b.WriteString(strings.Join(toks, " "))
			b.WriteByte('\n')
		}
		if err := atomicfile.WriteBytes(filepath.Join(dir, translationsFile), b.Bytes()); err != nil {
			return err
		}
	}
	sum := sha256.Sum256(corpus)
	s := Settings{Version: Version, Input: input, Digest: hex.EncodeToString(sum[:]), Config: cfg}
	data, err := json.MarshalIndent(s, "", "  ")
	if err != nil {
		return err
	}
	return atomicfile.WriteBytes(filepath.Join(dir, settingsFile), append(data, '\n'))
}

// encodeCorpus writes one utterance per line: source line, units separated
// by spaces (a unit never contains one), and a lock per unit ('.' free,
// '|' boundary, '=' joined).
func encodeCorpus(c *segment.Corpus) []byte {
	var b bytes.Buffer
	for u := 0; u < c.Len(); u++ {
		start, end := c.Utterance(u)
		b.WriteString(strconv.Itoa(c.Lines[u]))
		b.WriteByte('\t')
		for i := start; i < end; i++ {
			if i > start {
				b.WriteByte(' ')
			}
			b.WriteString(c.Inventory[c.Units[i]])
		}
		b.WriteByte('\t')
		for i := start; i < end; i++ {
			b.WriteByte(".|="[c.LockAt(i)])
		}
		b.WriteByte('\n')
	}
	return b.Bytes()
}

// decodeCorpus reads what encodeCorpus wrote.
func decodeCorpus(data []byte, name string) (*segment.Corpus, error) {
	c := segment.NewCorpus(name)
	var locks []segment.Lock
	for n, line := range strings.Split(strings.TrimSuffix(string(data), "\n"), "\n") {
		fields := strings.Split(line, "\t")
		if len(fields) != 3 {
			return nil, fmt.Errorf("%s:%d: want 3 tab-separated fields, got %d", name, n+1, len(fields))
		}
		src, err := strconv.Atoi(fields[0])
		if err != nil {
			return nil, fmt.Errorf("%s:%d: %w", name, n+1, err)
		}
		units := strings.Split(fields[1], " ")
		if len(units) != len(fields[2]) {
			return nil, fmt.Errorf("%s:%d: %d units but %d locks", name, n+1, len(units), len(fields[2]))
		}
		if err := c.AddUtterance(units, src); err != nil {
			return nil, err
		}
		for _, l := range []byte(fields[2]) {
			k := strings.IndexByte(".|=", l)
			if k < 0 {
				return nil, fmt.Errorf("%s:%d: bad lock %q", name, n+1, l)
			}
			locks = append(locks, segment.Lock(k))
		}
	}
	for _, l := range locks {
		if l != segment.Free {
			c.Locks = locks
			break
		}
	}
	return c, nil
}

// Translations returns the translation tokens kept in dir, one list per
// utterance, or nil if the run has none.
func Translations(dir string, c *segment.Corpus) ([][]string, error) {
	path := filepath.Join(dir, translationsFile)
	data, err := os.ReadFile(path)
	if errors.Is(err, os.ErrNotExist) {
		return nil, nil
	}
	if err != nil {
		return nil, err
	}
	lines := strings.Split(strings.TrimSuffix(string(data), "\n"), "\n")
	if len(lines) != c.Len() {
		return nil, fmt.Errorf("%s: %d lines for %d utterances", path, len(lines), c.Len())
	}
	out := make([][]string, len(lines))
	for i, l := range lines {
		out[i] = strings.Fields(l)
	}
	return out, nil
}

// Open reads a state directory: its settings, corpus and chain states
// (nil for a chain that has no checkpoint yet).
func Open(dir string) (*segment.Corpus, Settings, []*segment.ChainState, error) {
	var s Settings
	data, err := os.ReadFile(filepath.Join(dir, settingsFile))
	if err != nil {
		return nil, s, nil, err
	}
	if err := json.Unmarshal(data, &s); err != nil {
		return nil, s, nil, fmt.Errorf("%s: %w", filepath.Join(dir, settingsFile), err)
	}
	if s.Version != Version {
		return nil, s, nil, fmt.Errorf("%s: format version %d, this juncture reads %d", dir, s.Version, Version)
	}
	cpath := filepath.Join(dir, corpusFile)
	corpus, err := os.ReadFile(cpath)
	if err != nil {
		return nil, s, nil, err
	}
	sum := sha256.Sum256(corpus)
	if hex.EncodeToString(sum[:]) != s.Digest {
		return nil, s, nil, fmt.Errorf("%s: does not match the digest in settings.json", cpath)
	}
	c, err := decodeCorpus(corpus, cpath)
	if err != nil {
		return nil, s, nil, err
	}
	states := make([]*segment.ChainState, s.Config.Chains)
	for i := range states {
		st, err := loadChain(dir, i, c)
		if err != nil && !errors.Is(err, os.ErrNotExist) {
			return nil, s, nil, err
		}
		states[i] = st
	}
	return c, s, states, nil
}

// chainWire is the JSON form of a ChainState.
type chainWire struct {
	*segment.ChainState
	// Boundary has one byte per unit: '0' no boundary, '1' a word
	// boundary, '2' a word boundary that starts a collocation (collocation
	// model only).
	Boundary string   `json:"boundary"`
	Counts   []uint32 `json:"boundary_counts"`
}

func chainPath(dir string, i int) string {
	return filepath.Join(dir, fmt.Sprintf("chain-%d.json.gz", i))
}

// SaveChain writes a chain's checkpoint atomically.
func SaveChain(dir string, st *segment.ChainState) error {
	b := make([]byte, len(st.Boundary))
	for i, v := range st.Boundary {
		switch {
		case st.Groups != nil && st.Groups[i]:
			b[i] = '2'
		case v:
			b[i] = '1'
		default:
			b[i] = '0'
		}
	}
	return atomicfile.Write(chainPath(dir, st.Index), func(w io.Writer) error {
		zw, _ := gzip.NewWriterLevel(w, gzip.BestSpeed)
		enc := json.NewEncoder(zw)
		if err := enc.Encode(chainWire{ChainState: st, Boundary: string(b), Counts: st.BoundaryCounts}); err != nil {
			return err
		}
		return zw.Close()
	})
}

func loadChain(dir string, i int, c *segment.Corpus) (*segment.ChainState, error) {
	path := chainPath(dir, i)
	f, err := os.Open(path)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	zr, err := gzip.NewReader(bufio.NewReader(f))
	if err != nil {
		return nil, fmt.Errorf("%s: %w", path, err)
	}
	w := chainWire{ChainState: &segment.ChainState{}}
	if err := json.NewDecoder(zr).Decode(&w); err != nil {
		return nil, fmt.Errorf("%s: %w", path, err)
	}
	st := w.ChainState
	if st.Index != i || len(w.Boundary) != len(c.Units) || len(w.Counts) != len(c.Units) {
		return nil, fmt.Errorf("%s: does not fit the corpus", path)
	}
	st.Boundary = make([]bool, len(w.Boundary))
	if strings.IndexByte(w.Boundary, '2') >= 0 {
		st.Groups = make([]bool, len(w.Boundary))
	}
	for k := range w.Boundary {
		switch w.Boundary[k] {
		case '2':
			st.Groups[k] = true
			st.Boundary[k] = true
		case '1':
			st.Boundary[k] = true
		case '0':
		default:
			return nil, fmt.Errorf("%s: unit %d: boundary code %q is not 0, 1 or 2", path, k, w.Boundary[k])
		}
	}
	st.BoundaryCounts = w.Counts
	return st, nil
}

// WritePosteriors writes a TSV with a header and one row per free gap:
// source line, character offset of the gap in the line as read (spaces
// and ignored characters removed; the offset scorer positions use), unit
// offset, the units on either side, and the boundary probability.
func WritePosteriors(w io.Writer, c *segment.Corpus, post []float64) error {
	bw := bufio.NewWriter(w)
	fmt.Fprintln(bw, "line\toffset\tunit\tleft\tright\tprobability")
	for u := 0; u < c.Len(); u++ {
		start, end := c.Utterance(u)
		chars := 0
		for i := start; i < end; i++ {
			if i > start && c.LockAt(i) == segment.Free {
				fmt.Fprintf(bw, "%d\t%d\t%d\t%s\t%s\t%s\n", c.Lines[u], chars, i-start,
					c.Inventory[c.Units[i-1]], c.Inventory[c.Units[i]],
					strconv.FormatFloat(post[i], 'f', 4, 64))
			}
			chars += len([]rune(c.Inventory[c.Units[i]]))
		}
	}
	return bw.Flush()
}

// SaveResult writes the posteriors and decoded segmentation of a finished
// run.
func SaveResult(dir string, res *segment.Result) error {
	c := res.Decoded.Corpus
	if err := atomicfile.Write(filepath.Join(dir, "posteriors.tsv"), func(w io.Writer) error {
		return WritePosteriors(w, c, res.Posterior)
	}); err != nil {
		return err
	}
	return atomicfile.Write(filepath.Join(dir, "segmentation.txt"), res.Decoded.Write)
}
