#!/usr/bin/env bash
# bench.sh measures juncture's speed, memory and accuracy at full size:
#
#   table   scripts/benchtable: token/boundary/lexicon F, seconds and peak
#           memory of each model/sampler on every corpus (the English corpus
#           ../shared/corpora/cds-english when present, data/eval/udhr/*),
#           mean±sd over seeds                    -> table.txt, table.log
#   scale   scripts/benchtable -scale: seconds per sweep and peak memory at
#           1x, 4x and 16x the corpus, with the per-unit cost relative to 1x
#           (linear cost: ratio within 1.3)      -> scale.txt, scale.log
#   mix     scripts/mixplot: log joint probability against wall-clock
#           seconds, boundary vs blocked sampler -> mixing-bigram.png,
#           mixing-unigram.png (+ .tsv with the traces)
#   gotest  go test -run XXX -bench . -benchmem -count COUNT ./segment/
#           (sweep benchmarks on the English corpus, else UDHR Spanish), raw
#           output for benchstat                 -> segment-bench.txt
#
# Usage: scripts/bench.sh [STAGE...]      (from anywhere; default: all four)
#
# Settings come from the environment; the defaults are the full-size runs:
#   OUT=DIR            results (default: tmp/bench in the checkout, ignored by git)
#   CONFIGS=...        table configurations (default: every model x sampler,
#                      unigram/boundary,unigram/blocked,bigram/boundary,bigram/blocked)
#   ITERATIONS=200     sweeps per table run (the default of `juncture learn`)
#   SEEDS=1,2,3        seeds per table configuration
#   LINES=0            first N utterances of each corpus in the table (0: all)
#   CORPORA=all        table corpora (cds-english, udhr/fin, ...)
#   SCALES=1,4,16  SCALE_LINES=2000  SCALE_ITERATIONS=50
#   SCALE_START=random (or gold: chains start from the reference segmentation
#                      at temperature 1, the cost per sweep near the posterior;
#                      a random start's lexicon grows with the copies)
#   SCALE_CORPORA      (default: cds-english when present, else udhr/spa)
#   MIX_LINES=2000  MIX_SWEEPS=300  MIX_CORPUS (default like SCALE_CORPORA)
#   COUNT=6            go test -count (benchstat wants at least 6 per side)
#   BENCHTIME          go test -benchtime (default: go test's own, 1s)
#
# Expected run time on an idle 2-core machine, from the sweep benchmarks on
# the whole English corpus at temperature 1 (about 0.75, 0.27, 1.9 and 1.3
# microseconds per unit per sweep for unigram/boundary, unigram/blocked,
# bigram/boundary and bigram/blocked; annealed sweeps from a random start
# cost 2-4 times more) and from short runs on UDHR, whose paragraph-long
# utterances make the blocked bigram sampler dearer:
#   table   about 1.5 hours: English about 1 h (294,000 units x 200 sweeps
#           x 3 seeds x four configurations), UDHR about 0.5 h. SEEDS=1
#           takes a third of that.
#   scale   about 5 minutes at the defaults (2,000 lines, 50 sweeps); the
#           whole English corpus (SCALE_LINES=0 SCALE_ITERATIONS=10) about
#           25 minutes, most of it the bigram samplers at 16x.
#   mix     about 2 minutes;  gotest  about 20 minutes (BenchmarkScale builds
#           16 copies of the English corpus for each of its 16x cases).
# Runs are sequential, one process at a time, so that times and memory are
# not disturbed by one another; other load on the machine disturbs them.
#
# Compare two benchmark runs with benchstat (golang.org/x/perf/cmd/benchstat):
#   benchstat old/segment-bench.txt new/segment-bench.txt
set -euo pipefail

root=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
cd "$root"

OUT=${OUT:-$root/tmp/bench}
CONFIGS=${CONFIGS:-unigram/boundary,unigram/blocked,bigram/boundary,bigram/blocked}
ITERATIONS=${ITERATIONS:-200}
SEEDS=${SEEDS:-1,2,3}
LINES=${LINES:-0}
CORPORA=${CORPORA:-all}
SCALES=${SCALES:-1,4,16}
SCALE_LINES=${SCALE_LINES:-2000}
SCALE_ITERATIONS=${SCALE_ITERATIONS:-50}
SCALE_START=${SCALE_START:-random}
MIX_LINES=${MIX_LINES:-2000}
MIX_SWEEPS=${MIX_SWEEPS:-300}
COUNT=${COUNT:-6}
BENCHTIME=${BENCHTIME:-}

# The English corpus lives beside the checkout and is never copied into it.
if [[ -f ../shared/corpora/cds-english/gold.txt ]]; then
	default_corpus=cds-english
else
	echo "bench: ../shared/corpora/cds-english/gold.txt not found; scale and mix use udhr/spa" >&2
	default_corpus=udhr/spa
fi
SCALE_CORPORA=${SCALE_CORPORA:-$default_corpus}
MIX_CORPUS=${MIX_CORPUS:-$default_corpus}

stages=("$@")
if [[ ${#stages[@]} -eq 0 ]]; then
	stages=(table scale mix gotest)
fi
for s in "${stages[@]}"; do
	case $s in
	table | scale | mix | gotest) ;;
	*)
		echo "bench: unknown stage $s (want table, scale, mix or gotest)" >&2
		exit 2
		;;
	esac
done

mkdir -p "$OUT"
bin=$(mktemp -d)
trap 'rm -rf "$bin"' EXIT
go build -o "$bin/benchtable" ./scripts/benchtable
go build -o "$bin/mixplot" ./scripts/mixplot

{
	echo "date: $(date -u +%Y-%m-%dT%H:%M:%SZ)"
	echo "commit: $(git rev-parse HEAD 2>/dev/null || echo unknown)$(git diff --quiet 2>/dev/null || echo ' (modified)')"
	go version
	echo "cpus: $(nproc)"
	echo "stages: ${stages[*]}"
} >"$OUT/env.txt"

for s in "${stages[@]}"; do
	echo "bench: $s (results in $OUT)" >&2
	case $s in
	table)
		"$bin/benchtable" -configs "$CONFIGS" -iterations "$ITERATIONS" -seeds "$SEEDS" \
			-lines "$LINES" -corpora "$CORPORA" -out "$OUT/table.txt" 2>&1 | tee "$OUT/table.log"
		cat "$OUT/table.txt"
		;;
	scale)
		"$bin/benchtable" -scale "$SCALES" -configs "$CONFIGS" -iterations "$SCALE_ITERATIONS" \
			-start "$SCALE_START" -seeds 1 -lines "$SCALE_LINES" -corpora "$SCALE_CORPORA" -out "$OUT/scale.txt" 2>&1 | tee "$OUT/scale.log"
		cat "$OUT/scale.txt"
		;;
	mix)
		for model in bigram unigram; do
			"$bin/mixplot" -corpus "$MIX_CORPUS" -lines "$MIX_LINES" -model "$model" -sweeps "$MIX_SWEEPS" \
				-out "$OUT/mixing-$model.png" -tsv "$OUT/mixing-$model.tsv" 2>&1 | tee -a "$OUT/mix.log"
		done
		;;
	gotest)
		# Written to a temporary file first, so that a failed run leaves
		# the previous results alone.
		go test -run XXX -bench . -benchmem -count "$COUNT" ${BENCHTIME:+-benchtime "$BENCHTIME"} ./segment/ >"$OUT/.segment-bench.txt.tmp"
		mv "$OUT/.segment-bench.txt.tmp" "$OUT/segment-bench.txt"
		cat "$OUT/segment-bench.txt"
		;;
	esac
done
