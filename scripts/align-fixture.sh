#!/usr/bin/env bash
# align-fixture.sh regenerates align/testdata/ibm1_nltk.json, the IBM Model 1
# translation tables that NLTK's nltk.translate.IBMModel1 learns from a few
# small parallel corpora. The Go tests of align read the committed fixture
# and need no Python.
#
# It installs Debian's python3-nltk with apt-get (run as root, or set
# SKIP_APT=1 if it is already installed) and runs scripts/align_fixture.py
# with /usr/bin/python3, the interpreter Debian's package serves, not
# whatever python3 comes first on PATH.
#
# Usage, from anywhere in the checkout:
#
#	scripts/align-fixture.sh
set -euo pipefail

root=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
out=$root/align/testdata/ibm1_nltk.json

if [[ ${SKIP_APT:-} != 1 ]]; then
	apt-get update -q
	DEBIAN_FRONTEND=noninteractive apt-get install -y -q --no-install-recommends python3-nltk
fi

mkdir -p "$(dirname "$out")"
/usr/bin/python3 "$root/scripts/align_fixture.py" "$out"
