#!/usr/bin/env bash
# score-fixture.sh regenerates segment/score/testdata/reference.json, the
# scores that scikit-learn and NLTK give for a set of segmentation pairs.
# The Go tests of segment/score read the committed fixture and need no Python.
#
# It installs Debian's python3-sklearn and python3-nltk with apt-get (run as
# root, or set SKIP_APT=1 if they are already installed) and runs
# scripts/score_fixture.py with /usr/bin/python3, the interpreter those
# packages serve, not whatever python3 comes first on PATH.
#
# Usage, from anywhere in the checkout:
#
#	scripts/score-fixture.sh
set -euo pipefail

root=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
out=$root/segment/score/testdata/reference.json

if [[ ${SKIP_APT:-} != 1 ]]; then
	apt-get update -q
	DEBIAN_FRONTEND=noninteractive apt-get install -y -q --no-install-recommends \
		python3-sklearn python3-nltk
fi

mkdir -p "$(dirname "$out")"
/usr/bin/python3 "$root/scripts/score_fixture.py" "$out"
