"""Helpers shared by the scripts that regenerate reference fixtures.

They run under /usr/bin/python3 with Debian's packages (see score-fixture.sh
and align-fixture.sh); the fixtures record the package versions they came
from and are written atomically, so an interrupted run leaves the previous
fixture whole.
"""

import os
import subprocess
import tempfile


def package_version(name):
    """Return the installed version of Debian package name."""
    out = subprocess.run(["dpkg-query", "-W", "-f=${Version}", name],
                         capture_output=True, text=True, check=True)
    return out.stdout


def write_atomic(path, text, prefix):
    """Write text to path through a temporary file in the same directory
    and a rename."""
    directory = os.path.dirname(os.path.abspath(path))
    fd, tmp = tempfile.mkstemp(prefix=prefix, suffix=".json", dir=directory)
    try:
        with os.fdopen(fd, "w", encoding="utf-8") as f:
            f.write(text)
        os.chmod(tmp, 0o644)
        os.replace(tmp, path)
    except BaseException:
        os.unlink(tmp)
        raise
