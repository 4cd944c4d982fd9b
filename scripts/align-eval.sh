#!/usr/bin/env bash
# align-eval.sh measures the translation prior and the glossed lexicon on the
# UDHR corpora in data/eval/udhr: it installs Debian's FreeDict dictionaries
# the glosses are judged with (if missing) and runs scripts/aligneval, which
# learns every language with and without the prior over several seeds and
# writes a markdown report. Arguments are passed to aligneval; see
#
#     go run ./scripts/aligneval -h
#
# Examples:
#     scripts/align-eval.sh -langs spa -seeds 1 -iterations 50
#     scripts/align-eval.sh -model unigram,bigram -weights 0,0.3,1 -min-count 3,10 -out /tmp/align-eval.md
#
# Needs Go and, unless the dictionaries are installed already, root and
# apt-get. Nothing is downloaded but the Debian packages below.
set -euo pipefail

root=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
export LC_ALL=C.UTF-8

die() {
	echo "align-eval: $*" >&2
	exit 1
}

# One package per database aligneval reads (see dictionaries in
# scripts/aligneval/judge.go): target->English where Debian has it, and
# English->target, read in reverse.
packages=(
	dict-freedict-spa-eng dict-freedict-eng-spa
	dict-freedict-tur-eng dict-freedict-eng-tur
	dict-freedict-swh-eng dict-freedict-eng-swh
	dict-freedict-fin-eng dict-freedict-eng-fin
	dict-freedict-eng-ind
)

command -v go >/dev/null || die "go not found"

missing=()
for p in "${packages[@]}"; do
	if ! dpkg-query -W -f='${Status}\n' "$p" 2>/dev/null | grep -q ' installed$'; then
		missing+=("$p")
	fi
done
if [ ${#missing[@]} -gt 0 ]; then
	if [ "$(id -u)" = 0 ] && command -v apt-get >/dev/null; then
		echo "align-eval: installing ${missing[*]} with apt-get" >&2
		apt-get update
		DEBIAN_FRONTEND=noninteractive apt-get install -y "${missing[@]}"
	else
		die "missing ${missing[*]} (Debian: sudo apt-get update && sudo apt-get install -y ${missing[*]})"
	fi
fi
dpkg-query -W -f='align-eval: ${Package} ${Version}\n' "${packages[@]}" >&2

cd "$root"
exec go run ./scripts/aligneval "$@"
