#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""The chemistry commands coagulant, zeta and jartest, run as a user would."""
import os
import sys
import tempfile

from clitest import Tap, expect_usage_error, run, run_json

tap = Tap()
root = os.environ.get("BW_SOURCE_ROOT", os.path.join(os.path.dirname(__file__), "..", ".."))
sheet = os.path.join(root, "data", "examples", "alder-creek-jartest.csv")
LB_PER_DAY = 0.45359237  # kg per lb


def coagulant_cornwell():
    # docs/references.md (derived from Cornwell's formula, from memory): 10 MGD, 30 mg/L alum,
    # SS = 1.3 x 10 NTU -> about 2185 lb/d with Cornwell's 0.44 (ours 0.444 -> 2196 lb/d).
    d = run_json("coagulant", "--kind", "alum", "--dose", "30", "--flow", "10MGD", "--turbidity", "10",
                 "--ss-factor", "1.3", "--alkalinity", "60")
    for k in ("feed_kg_per_day", "alkalinity_consumed_mg_L_as_CaCO3", "sludge_kg_per_day",
              "residual_alkalinity_mg_L_as_CaCO3"):
        assert k in d, (k, d)
    assert abs(d["sludge_kg_per_day"] / LB_PER_DAY - 2185) / 2185 < 0.01, d
    # 0.505 mg/L as CaCO3 per mg/L of alum (docs/references.md, derived): 30 -> 15.16.
    assert abs(d["alkalinity_consumed_mg_L_as_CaCO3"] - 30 * 0.5052) < 0.01, d
    assert abs(d["residual_alkalinity_mg_L_as_CaCO3"] - (60 - d["alkalinity_consumed_mg_L_as_CaCO3"])) < 1e-9
    # Feed: 30 mg/L x 0.438126 m3/s x 86400 s = 1135.6 kg/d (derived).
    assert abs(d["feed_kg_per_day"] - 30e-3 * 10 * 0.0438126364 * 86400) < 1e-6, d
tap.check("coagulant alum: contract keys; Cornwell sludge; 0.505 alkalinity", coagulant_cornwell)

def coagulant_keys_absent():
    d = run_json("coagulant", "--kind", "ferric-chloride", "--dose", "20mg/L", "--flow", "0.35m3/s")
    assert "sludge_kg_per_day" not in d and "residual_alkalinity_mg_L_as_CaCO3" not in d, d
    assert abs(d["alkalinity_consumed_mg_L_as_CaCO3"] - 20 * 0.9256) < 0.01, d
tap.check("coagulant ferric chloride: optional keys absent without their options", coagulant_keys_absent)

def coagulant_lime():
    d = run_json("coagulant", "--kind", "alum", "--dose", "60", "--flow", "0.5", "--alkalinity", "40",
                 "--residual", "30")
    deficit = 30 - d["residual_alkalinity_mg_L_as_CaCO3"]
    assert abs(d["lime_mg_L_as_CaOH2"] - deficit * 74.0927 / 100.0869) < 1e-3, d
    assert d["low_residual_alkalinity"] is True
tap.check("coagulant: lime to keep a residual alkalinity", coagulant_lime)

def coagulant_hydrate_and_pacl():
    a14 = run_json("coagulant", "--kind", "alum", "--dose", "30", "--flow", "0.3")
    a18 = run_json("coagulant", "--kind", "alum", "--hydrate", "18", "--dose", "30", "--flow", "0.3")
    assert a18["molar_mass_g_mol"] > a14["molar_mass_g_mol"]
    assert a18["alkalinity_consumed_mg_L_as_CaCO3"] < a14["alkalinity_consumed_mg_L_as_CaCO3"]
    p = run_json("coagulant", "--kind", "pacl", "--al2o3", "10%", "--basicity", "70%", "--dose", "30",
                 "--flow", "0.3")
    # 10 % Al2O3 at 70 % basicity: 0.08834 mg CaCO3 per mg (derived in test-bw-chemistry.c).
    assert abs(p["alkalinity_consumed_mg_L_as_CaCO3"] - 30 * 0.088344) < 0.01, p
tap.check("coagulant: alum hydrate and PACl", coagulant_hydrate_and_pacl)

def zeta_smoluchowski():
    # docs/references.md (derived): 2 um cm/(V s) at 25 degC -> 25.6-25.7 mV.
    d = run_json("zeta", "--mobility", "2", "--temp", "25")
    assert 25.6 < d["zeta_mV"] < 25.7, d
    assert abs(d["henry_function"] - 1.5) < 1e-12
    d = run_json("zeta", "--mobility", "2 um*cm/(V*s)", "--temp", "25", "--ionic-strength", "1")
    # Israelachvili (from memory): 0.304/sqrt(I) nm, I = 1e-3 mol/L -> 9.61 nm.
    assert abs(d["debye_length_m"] - 9.61e-9) / 9.61e-9 < 0.005, d
    h = run_json("zeta", "--mobility", "2", "--temp", "25", "--model", "henry", "--radius", "0.5um",
                 "--ionic-strength", "1")
    assert "kappa_a" in h and 1.0 < h["henry_function"] < 1.5, h
    assert h["zeta_mV"] > d["zeta_mV"], (h, d)
tap.check("zeta: Smoluchowski, Debye length, Henry", zeta_smoluchowski)

def jartest_sheet():
    d = run_json("jartest", sheet, "--target", "2")
    assert d["optimum_dose_mg_L"] == 40, d
    assert 20 < d["target_dose_mg_L"] < 30, d
    # Derived by hand (zeta linear between jars): -10 mV at 22 mg/L, +10 mV at 57.5 mg/L.
    lo, hi = d["destabilized_dose_range_mg_L"]
    assert abs(lo - 22) < 1e-9 and abs(hi - 57.5) < 1e-9, d
    d = run_json("jartest", sheet, "--target", "0.5")
    assert "target_dose_mg_L" not in d and d["target_reached"] is False, d
tap.check("jartest: optimum, target, destabilised window of the demo sheet", jartest_sheet)

code, out, err = run("jartest", sheet, "--target", "2")
tap.ok(code == 0 and "optimum dose" in out and "mg/L" in out, "jartest readable table", out + err)

with tempfile.TemporaryDirectory() as tmp:
    def sheet_with(name, text):
        p = os.path.join(tmp, name)
        with open(p, "w") as f:
            f.write(text)
        return p
    cases = [
        ("no-dose.csv", "turbidity (NTU)\n1\n2\n3\n", "needs a dose and a turbidity column"),
        ("bad-row.csv", "dose (mg/L),turbidity (NTU)\n10,5\n20,abc\n30,1\n", "bad-row.csv:3:"),
        ("short-row.csv", "dose (mg/L),turbidity (NTU)\n10,5\n20\n30,1\n", "short-row.csv:3:"),
        ("bad-unit.csv", "dose (m),turbidity (NTU)\n10,5\n20,3\n30,1\n", "unit of length"),
        ("no-unit.csv", "dose,turbidity (NTU)\n10,5\n20,3\n30,1\n", "needs its unit"),
        ("two-jars.csv", "dose (mg/L),turbidity (NTU)\n10,5\n20,3\n", "3 to"),
        ("dup-dose.csv", "dose (mg/L),turbidity (NTU)\n10,5\n10,3\n30,1\n", "two jars"),
        ("unknown.csv", "dose (mg/L),colour (Hazen)\n10,5\n20,3\n30,1\n", "not dose, turbidity"),
        ("neg.csv", "dose (mg/L),turbidity (NTU)\n10,5\n20,-3\n30,1\n", "turbidity"),
        ("nan.csv", "dose (mg/L),turbidity (NTU)\n10,5\n20,nan\n30,1\n", ":3:"),
    ]
    for name, text, needle in cases:
        expect_usage_error(tap, ["jartest", sheet_with(name, text)], needle, f"jartest rejects {name}")
    expect_usage_error(tap, ["jartest", os.path.join(tmp, "missing.csv")], "missing.csv")

bad = [
    (["coagulant", "--kind", "alum", "--dose", "-5", "--flow", "1"], "--dose"),
    (["coagulant", "--kind", "alum", "--dose", "30", "--flow", "0"], "--flow"),
    (["coagulant", "--kind", "lime", "--dose", "30", "--flow", "1"], "--kind"),
    (["coagulant", "--kind", "alum", "--dose", "30 m", "--flow", "1"], "unit of length"),
    (["coagulant", "--kind", "pacl", "--dose", "30", "--flow", "1"], "--al2o3 and --basicity"),
    (["coagulant", "--kind", "ferric-chloride", "--hydrate", "6", "--dose", "30", "--flow", "1"], "--hydrate"),
    (["coagulant", "--kind", "alum", "--dose", "30", "--flow", "1", "--residual", "30"], "--alkalinity"),
    (["coagulant", "--kind", "alum", "--dose", "30", "--flow", "1", "--strength", "48%"], "--solution-density"),
    (["zeta", "--mobility", "nan", "--temp", "20"], "--mobility"),
    (["zeta", "--mobility", "2", "--temp", "60"], "--temp"),
    (["zeta", "--mobility", "2", "--temp", "20", "--model", "henry"], "--radius"),
    (["zeta", "--mobility", "2", "--temp", "20", "--ionic-strength", "-1"], "--ionic-strength"),
    (["jartest"], "missing FILE.csv"),
]
for args, needle in bad:
    expect_usage_error(tap, args, needle)

sys.exit(tap.done())
