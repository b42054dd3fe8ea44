# SPDX-License-Identifier: GPL-3.0-or-later
"""clitest.py: a tiny TAP harness that runs basinwright-cli as a user would and checks its output."""
import json
import math
import os
import subprocess
import sys

CLI = os.environ.get("BW_CLI") or (sys.argv[1] if len(sys.argv) > 1 else "basinwright-cli")


def run(*args, stdin=None):
    """Runs the CLI; returns (exit code, stdout, stderr)."""
    p = subprocess.run([CLI, *args], capture_output=True, text=True, errors="replace", input=stdin, timeout=60)
    return p.returncode, p.stdout, p.stderr


def run_json(*args):
    code, out, err = run(*args, "--json")
    if code != 0:
        raise AssertionError(f"exit {code}: {err.strip()}")
    return json.loads(out)


class Tap:
    def __init__(self):
        self.n = 0
        self.failed = 0

    def ok(self, cond, name, detail=""):
        self.n += 1
        if cond:
            print(f"ok {self.n} - {name}")
        else:
            self.failed += 1
            print(f"not ok {self.n} - {name}")
            for line in str(detail).splitlines():
                print(f"# {line}")
        sys.stdout.flush()

    def rel(self, got, want, tol, name):
        good = isinstance(got, (int, float)) and math.isfinite(got) and abs(got - want) <= tol * abs(want)
        self.ok(good, name, f"got {got!r}, want {want!r} within {tol:g} relative")

    def check(self, name, fn):
        """Runs fn(); an exception is a failure with its message."""
        try:
            fn()
            self.ok(True, name)
        except Exception as e:  # noqa: BLE001 - every failure is reported, none hidden
            self.ok(False, name, f"{type(e).__name__}: {e}")

    def done(self):
        print(f"1..{self.n}")
        return 1 if self.failed else 0


def expect_usage_error(tap, args, needle, name=None):
    """A usage or input error: exit 2, nothing on stdout, one stderr line containing NEEDLE."""
    code, out, err = run(*args)
    lines = [l for l in err.splitlines() if l.strip()]
    good = code == 2 and out == "" and len(lines) == 1 and needle in lines[0]
    tap.ok(good, name or ("rejects " + " ".join(args)),
           f"exit {code}, stdout {out!r}, stderr {err!r}, wanted '{needle}'")
