#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""The CLI contract for --help, --version, `water` and `settle`, and a table of bad inputs."""
import json
import sys

from clitest import Tap, expect_usage_error, run, run_json

tap = Tap()

# --- top level
code, out, err = run("--version")
tap.ok(code == 0 and out.startswith("basinwright-cli "), "--version", out + err)
code, out, err = run("--help")
tap.ok(code == 0 and "water" in out and "settle" in out and "licensed professional" in out,
       "--help lists the commands and the caution", out)
code, out, err = run()
tap.ok(code == 2 and out == "" and "Usage" in err, "no command: usage on stderr, exit 2", err)
expect_usage_error(tap, ["frobnicate"], "unknown command 'frobnicate'")
for cmd in ("water", "settle"):
    code, out, err = run(cmd, "--help")
    tap.ok(code == 0 and "--json" in out and "bare number" in out, f"{cmd} --help", out)

# --- water: the keys of the contract, in SI
def water_keys():
    d = run_json("water", "--temp", "20")
    want = {"temperature_C", "density_kg_m3", "dynamic_viscosity_Pa_s",
            "kinematic_viscosity_m2_s", "relative_permittivity"}
    assert want <= d.keys(), d.keys()
    assert abs(d["temperature_C"] - 20) < 1e-12
    # IAPWS-95 998.2072 kg/m3 and IAPWS 2008 1.00160 mPa s at 20 degC (docs/references.md table).
    assert abs(d["density_kg_m3"] - 998.2072) < 0.05, d
    assert abs(d["dynamic_viscosity_Pa_s"] - 1.00160e-3) < 0.005e-3, d
    assert abs(d["kinematic_viscosity_m2_s"] - d["dynamic_viscosity_Pa_s"] / d["density_kg_m3"]) < 1e-15
tap.check("water --temp 20 --json: contract keys and values", water_keys)

def water_units():
    # The same state typed four ways: 12 degC = 53.6 degF = 285.15 K.
    ref = run_json("water", "--temp", "12")
    for typed in ("12C", "12 °C", "53.6F", "285.15K"):
        d = run_json("water", "--temp", typed)
        assert abs(d["temperature_C"] - 12) < 1e-9, (typed, d)
        assert abs(d["density_kg_m3"] - ref["density_kg_m3"]) < 1e-9
    d = run_json("water", "--temp", "12", "°C")      # the unit as a word of its own
    assert abs(d["temperature_C"] - 12) < 1e-9
    d = run_json("water", "--temp=12C")
    assert abs(d["temperature_C"] - 12) < 1e-9
tap.check("water: temperature with unit suffixes", water_units)

code, out, err = run("water", "--temp", "10")
tap.ok(code == 0 and "density" in out and "999.7" in out and "kg/m³" in out, "water readable SI table", out)
code, out, err = run("water", "--temp", "50F", "--units", "us")
tap.ok(code == 0 and "°F" in out and "lb/ft³" in out, "water readable US table", out)

# --- settle
def settle_keys():
    d = run_json("settle", "--diameter", "0.2mm", "--sg", "2.65", "--temp", "22")
    assert {"settling_velocity_m_s", "reynolds", "drag_coefficient", "regime"} <= d.keys()
    assert d["regime"] in ("stokes", "transitional", "newton")
    # Davis (2010) Example 10-1 conditions give about 0.027 m/s with the Davis correlation (seen,
    # docs/references.md); the engine's own water at 22 degC differs slightly from the rounded 1000/0.955.
    dv = run_json("settle", "--diameter", "0.2mm", "--sg", "2.65", "--temp", "22", "--drag", "davis")
    assert abs(dv["settling_velocity_m_s"] - 0.02726) / 0.02726 < 0.02, dv
    assert dv["regime"] == "transitional"
tap.check("settle --json: contract keys; Davis Example 10-1 scale", settle_keys)

def settle_stokes():
    # 10 um silt, SG 2.65, 20 degC: Stokes' law by hand (derived): g (rho_p - rho) d^2 / (18 mu)
    # with rho 998.2072, mu 1.0016e-3 (docs/references.md): 9.80665*1.65*998.2072*1e-10/(18*1.0016e-3)
    d = run_json("settle", "--diameter", "10um", "--sg", "2.65", "--temp", "20")
    want = 9.80665 * 1.65 * 998.2072 * 1e-10 / (18 * 1.0016e-3)
    assert abs(d["settling_velocity_m_s"] - want) / want < 2e-3, (d, want)
    assert d["regime"] == "stokes"
tap.check("settle: 10 um silt follows Stokes' law", settle_stokes)

def settle_newton():
    d = run_json("settle", "--diameter", "5mm", "--sg", "3", "--temp", "0")
    assert d["regime"] == "newton", d
tap.check("settle: 5 mm SG 3 grain is in Newton's regime", settle_newton)

code, out, err = run("settle", "--diameter", "0.0002", "--sg", "2.65", "--temp", "72F", "--units", "us")
tap.ok(code == 0 and "ft/s" in out and "gpm/ft²" in out, "settle readable US table", out)

# --- bad input: exit 2, one line on stderr naming the option and the reason, nothing on stdout
bad = [
    (["water"], "--temp is required"),
    (["water", "--temp"], "--temp needs a value"),
    (["water", "--temp", ""], "--temp: no value"),
    (["water", "--temp", "45"], "--temp"),
    (["water", "--temp", "-1C"], "outside the valid range"),
    (["water", "--temp", "120F"], "--temp"),
    (["water", "--temp", "nan"], "not a finite number"),
    (["water", "--temp", "inf"], "not a finite number"),
    (["water", "--temp", "1e999"], "too large"),
    (["water", "--temp", "12 kg"], "unit of mass"),
    (["water", "--temp", "12 parsecs"], "unknown unit"),
    (["water", "--temp", "12", "--temp", "13"], "more than once"),
    (["water", "--temp", "12", "--colour", "red"], "unknown option --colour"),
    (["water", "--temp", "12", "--units", "imperial"], "--units"),
    (["water", "--temp", "12", "extra"], "unknown unit"),
    (["water", "--temp", "1,5"], "decimal point"),
    (["water", "--temp", "0x14"], "not a decimal"),
    (["water", "--json=yes", "--temp", "12"], "--json takes no value"),
    (["settle", "--sg", "2.65", "--temp", "20"], "--diameter is required"),
    (["settle", "--diameter", "0", "--sg", "2.65", "--temp", "20"], "--diameter"),
    (["settle", "--diameter", "-1mm", "--sg", "2.65", "--temp", "20"], "--diameter"),
    (["settle", "--diameter", "50 gpm", "--sg", "2.65", "--temp", "20"], "unit of flow"),
    (["settle", "--diameter", "50um", "--sg", "1.0", "--temp", "20"], "--sg"),
    (["settle", "--diameter", "50um", "--sg", "0.8", "--temp", "20"], "--sg"),
    (["settle", "--diameter", "50um", "--sg", "abc", "--temp", "20"], "--sg"),
    (["settle", "--diameter", "50um", "--sg", "2.65 m", "--temp", "20"], "--sg"),
    (["settle", "--diameter", "50um", "--sg", "nan", "--temp", "20"], "--sg"),
    (["settle", "--diameter", "50um", "--sg", "2.65", "--temp", "41"], "--temp"),
    (["settle", "--diameter", "50um", "--sg", "2.65", "--temp", "20", "--drag", "magic"], "--drag"),
    (["settle", "--diameter", "2m", "--sg", "2.65", "--temp", "20"], "--diameter"),
    (["settle", "--diameter", "\udcff", "--sg", "2.65", "--temp", "20"], "UTF-8"),
]
# Results that overflow are refused, never printed as null or inf (the contract: no NaN/inf).
bad += [
    (["gvalue", "--power", "1e300", "--volume", "1", "--temp", "12", "--time", "1e300", "--json"],
     "not a finite number"),
    (["gvalue", "--power", "1e300", "--volume", "1", "--temp", "12", "--time", "1e300"],
     "not a finite number"),
    (["impeller", "--kind", "rushton", "--diameter", "0.4", "--speed", "100", "--volume", "1e300",
      "--flow", "1e-300", "--temp", "10", "--json"], "not a finite number"),
]
for args, needle in bad:
    try:
        expect_usage_error(tap, args, needle)
    except UnicodeEncodeError:
        # A non-UTF-8 argument: hand the raw bytes to the process.
        import subprocess
        from clitest import CLI
        raw = [a.encode("utf-8", "surrogateescape") for a in args]
        p = subprocess.run([CLI.encode(), *raw], capture_output=True)
        tap.ok(p.returncode == 2 and p.stdout == b"" and b"UTF-8" in p.stderr,
               "rejects a non-UTF-8 argument", repr(p.stderr))

sys.exit(tap.done())
