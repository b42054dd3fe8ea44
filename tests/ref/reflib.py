# SPDX-License-Identifier: GPL-3.0-or-later
"""reflib.py: shared helpers for the live cross-checks in tests/ref (TAP output, dump runner)."""

import subprocess
import sys


class Tap:
    """Collects TAP results; stdout carries TAP only, diagnostics go out as '#' comments."""

    def __init__(self):
        self.results = []

    def check(self, ok, description, detail=None):
        self.results.append((bool(ok), description, detail))

    def note(self, text):
        print("# " + text)

    def finish(self):
        print("1..%d" % len(self.results))
        failed = 0
        for number, (ok, description, detail) in enumerate(self.results, 1):
            print("%s %d - %s" % ("ok" if ok else "not ok", number, description))
            if not ok:
                failed += 1
                if detail:
                    for line in str(detail).splitlines():
                        print("#   " + line)
        sys.stdout.flush()
        return 1 if failed else 0


def skip_all(reason):
    print("1..0 # SKIP " + reason)
    sys.exit(0)


def run_dump(program, lines):
    """Feeds LINES to the dump PROGRAM and returns its output lines (split on whitespace for
    'ok' lines, kept whole for 'error' lines)."""
    proc = subprocess.run([program], input="".join(line + "\n" for line in lines),
                          capture_output=True, text=True, check=False)
    if proc.returncode != 0:
        raise RuntimeError("%s exited with %d: %s" % (program, proc.returncode, proc.stderr))
    return proc.stdout.splitlines()


def rel(got, want):
    return abs(got - want) / abs(want)
