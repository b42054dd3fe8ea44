#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""The CLI speaks the contract's English with a decimal point in a Spanish locale, although the
Spanish catalogue is there (meson.build runs this with LANG, LANGUAGE and LC_ALL for es_ES.UTF-8,
LOCPATH and BASINWRIGHT_LOCALEDIR pointing into the build tree)."""
import os

from clitest import Tap, run

tap = Tap()
tap.ok(os.environ.get("LC_ALL") == "es_ES.UTF-8" and os.environ.get("BASINWRIGHT_LOCALEDIR"),
       "run in es_ES.UTF-8 with the build tree's catalogue", repr(os.environ.get("LC_ALL")))

# An input error from the engine (bw-error.c): English words, and 45.5 with a point (derived:
# the value typed), never the catalogue's "está fuera del intervalo" nor "45,5".
code, out, err = run("water", "--temp", "45.5")
tap.ok(code == 2 and "45.5 °C is outside the valid range 0 to 40 °C" in err, "range error in English", err)
tap.ok("45,5" not in err and "fuera" not in err, "no Spanish word or decimal comma in it", err)

# A unit of the wrong kind (bw-units.c): the English kind names.
code, out, err = run("settle", "--diameter", "2.5kg", "--sg", "2.65", "--temp", "10")
tap.ok(code == 2 and "'kg' is a unit of mass, but a length is wanted" in err, "unit error in English", err)

# A table: a decimal point in the numbers, English labels. 999.7 kg/m3 at 10 degC: IAPWS-95
# (python3-iapws gives 999.70), as in test-cli-core.py.
code, out, err = run("water", "--temp", "10")
tap.ok(code == 0 and "density" in out and "999.7" in out and "999,7" not in out, "table in English", out)
tap.done()
