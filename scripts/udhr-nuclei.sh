#!/bin/bash
# udhr-nuclei.sh: the README's UDHR table with syllable nuclei. For each
# data/eval/udhr language, the nuclei are the IPA vowel letters (IPA chart,
# International Phonetic Association) that begin a unit of its input, a
# unit being a character with the combining marks and modifier letters
# after it, as juncture splits units by default. Runs each configuration
# for seeds 1-3, 300 sweeps each, and prints one line per run:
#
#   language configuration seed token F, boundary F, lexicon F, seconds
#
# A configuration is NAME:FLAGS; a trailing --nuclei gets the language's
# vowels. Without arguments, the three of the README's nuclei table.
#
# Usage: scripts/udhr-nuclei.sh > scripts/results/udhr-nuclei.txt
#        scripts/udhr-nuclei.sh "colloc-phon:--model collocation --pitman-yor --chains 2 --phonotactics --nuclei"
set -euo pipefail
root=$(cd "$(dirname "$0")/.." && pwd)
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
go build -o "$tmp/juncture" "$root/cmd/juncture"
vowels() {
	python3 - "$1" <<'PY'
import sys, unicodedata
V = set("iyɨʉɯuɪʏʊeøɘɵɤoəɛœɜɞʌɔæɐaɶɑɒɚɝ")
units = set()
for line in open(sys.argv[1], encoding="utf-8"):
    cur = ""
    for ch in unicodedata.normalize("NFC", line.strip()):
        if cur and (unicodedata.category(ch).startswith("M") or unicodedata.category(ch) == "Lm"):
            cur += ch
        else:
            if cur:
                units.add(cur)
            cur = ch
    if cur:
        units.add(cur)
print(" ".join(sorted(u for u in units if u[0] in V)))
PY
}
configs=("$@")
if [[ ${#configs[@]} -eq 0 ]]; then
	configs=("collocation:--model collocation"
		"bigram-py-nuclei:--model bigram --pitman-yor --nuclei"
		"collocation-py-nuclei:--model collocation --pitman-yor --nuclei")
fi
for lang in spa tur ind swh fin; do
	d="$root/data/eval/udhr/$lang"
	v=$(vowels "$d/input.txt")
	echo "# $lang nuclei: $v"
	for seed in 1 2 3; do
		for cfg in "${configs[@]}"; do
			name=${cfg%%:*}
			read -r -a args <<<"${cfg#*:}"
			if [[ ${args[-1]} == --nuclei ]]; then
				args+=("$v")
			fi
			start=$(date +%s.%N)
			"$tmp/juncture" learn -q --seed "$seed" --iterations 300 "${args[@]}" --out "$tmp/out.txt" "$d/input.txt"
			end=$(date +%s.%N)
			"$tmp/juncture" score --json -r "$d/gold.txt" "$tmp/out.txt" | python3 -c "
import json, sys
j = json.load(sys.stdin)
print('$lang $name $seed', ' '.join('%s %.3f' % (k, j[k]['f']) for k in ('token', 'boundary', 'lexicon')), 'seconds %.1f' % ($end - $start))"
		done
	done
done
