#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""The project commands compute, check and criteria, run as a reviewer would."""
import json
import os
import sys
import tempfile

from clitest import Tap, expect_usage_error, run, run_json

tap = Tap()
root = os.environ.get("BW_SOURCE_ROOT", os.path.join(os.path.dirname(__file__), "..", ".."))
demo = os.path.join(root, "data", "examples", "marrowby-demo.bwproj")
bad = os.path.join(root, "data", "examples", "marrowby-noncompliant.bwproj")


def compute_keys():
    d = run_json("compute", demo)
    assert d["project"] == "Alder Creek WTP, Marrowby (demo)"
    assert len(d["load_cases"]) == 16, len(d["load_cases"])
    ids = [e["id"] for e in d["elements"]]
    for want in ("north-rm", "north-floc", "north-floc-1", "south-mix", "south-floc-3", "south-sed",
                 "east-sed", "north-sed"):
        assert want in ids, (want, ids)
    sed = next(e for e in d["elements"] if e["id"] == "north-sed")
    r = next(x for x in sed["results"] if x["case"] == "maximum-day/coldest/all-in-service")
    # Hand check (derived): 0.35 m3/s over 3 trains through one 56 x 2.8 m basin:
    # overflow = 0.116667 / 156.8 = 7.4405e-4 m/s; weir 0.116667/48 = 2.4306e-3 m2/s.
    assert abs(r["overflow_rate_m_s"] - 0.35 / 3 / 156.8) < 1e-12, r
    assert abs(r["weir_loading_m2_s"] - 0.35 / 3 / 48) < 1e-12, r
    assert abs(r["detention_s"] - 156.8 * 4 / (0.35 / 3)) < 1e-6, r
    g = sed["governing"]["overflow_rate_m_s"]
    assert g["max_case"].startswith("peak-hour/"), g
    # Sludge collected by the basin (derived, Cornwell's form): 0.15 m3/s at peak hour x
    # (0.44435 x 30 mg/L alum + 1.3 x 18 NTU) = 0.15 x 36.73 g/m3 = 5.510 g/s.
    peak = next(x for x in sed["results"] if x["case"] == "peak-hour/coldest/all-in-service")
    alum14 = 2 * (26.9815385 + 3 * 17.007 + 3 * 18.015) / (2 * 26.9815385 + 3 * 96.056 + 14 * 18.015)
    assert abs(peak["sludge_kg_s"] - 0.15 * (alum14 * 0.030 + 1.3 * 18e-3)) < 1e-12, peak
    rm = next(e for e in d["elements"] if e["id"] == "north-rm")
    firm = next(x for x in rm["results"] if x["case"] == "maximum-day/coldest/firm")
    alls = next(x for x in rm["results"] if x["case"] == "maximum-day/coldest/all-in-service")
    # Two tanks, one standby: with it out the other takes twice the flow, half the detention.
    assert abs(firm["detention_s"] * 2 - alls["detention_s"]) < 1e-9, (firm, alls)
tap.check("compute --json: elements, cases, hand-checked basin numbers, firm capacity", compute_keys)

code, out, err = run("compute", demo)
tap.ok(code == 0 and "North settling basin" in out and "licensed professional engineer" in out,
       "compute readable table", out[:400] + err)
code, out, err = run("compute", demo, "--units", "us")
tap.ok(code == 0 and "gpm/ft²" in out and "MGD" in out, "compute in US units", out[:300])

def check_demo():
    code, out, err = run("check", demo, "--json")
    assert code == 0, (code, err)
    d = json.loads(out)
    assert d["criteria_set"] == "textbook-ranges"
    assert d["summary"]["fail"] == 0, d["summary"]
    for c in d["checks"]:
        assert c["citation"]["document"], c
        assert c["status"] in ("pass", "warn", "fail", "not_applicable")
tap.check("check demo: exit 0, no failing criterion, every check cited", check_demo)

def check_bad():
    code, out, err = run("check", bad, "--json")
    assert code == 1, (code, err)
    d = json.loads(out)
    failing = sorted((c["criterion"], c["element"]) for c in d["checks"] if c["status"] == "fail")
    # Exactly the failures planted in the file (its header comment lists them).
    want = sorted([("rapid-mix-g", "north-rm"), ("floc-stage-g", "south-floc-1"),
                   ("floc-detention", "north-floc"), ("floc-gt", "north-floc"),
                   ("sed-overflow", "north-sed"), ("sed-depth", "south-sed")])
    assert failing == want, failing
    f = next(c for c in d["checks"] if c["criterion"] == "sed-overflow" and c["element"] == "north-sed")
    # 0.116667 m3/s over 30 x 2.8 m = 84 m2 -> 1.3889e-3 m/s; limit 70 m3/(m2 d) = 8.102e-4 m/s.
    assert abs(f["value_m_s"] - 0.35 / 3 / 84) < 1e-12, f
    assert abs(f["limit_m_s"] - 70 / 86400) < 1e-15, f
    assert f["governing_case"].startswith("maximum-day/"), f
tap.check("check non-compliant: exit 1 and exactly the planted failures", check_bad)

code, out, err = run("check", bad)
tap.ok(code == 1 and "fail" in out and "Table 10-4" in out, "check readable: failures with citations", out[-600:])

def check_rsww():
    code, out, err = run("check", demo, "--criteria", "recommended-standards-2018", "--json")
    assert code in (0, 1), err
    d = json.loads(out)
    assert d["criteria_set"] == "recommended-standards-2018"
    assert len(d["checks"]) > 5
    assert all(c["citation"]["provenance"] == "memory" for c in d["checks"])
tap.check("check against the Recommended Standards set, all marked from memory", check_rsww)

def criteria_list():
    d = run_json("criteria", "--list")
    ids = [s["id"] for s in d["criteria_sets"]]
    assert "textbook-ranges" in ids and "recommended-standards-2018" in ids, ids
    assert d["skipped"] == [], d["skipped"]
tap.check("criteria --list --json", criteria_list)

def user_set():
    with tempfile.TemporaryDirectory() as tmp:
        with open(os.path.join(tmp, "mine.xml"), "w") as f:
            f.write('<criteria-set xmlns="urn:x-basinwright:criteria:1" format-version="1" id="firm-rules">'
                    '<name>Our firm rules</name><criterion id="sor" quantity="overflow_rate" '
                    'applies-to="rectangular-basin"><required max="1" unit="m/h"/>'
                    '<citation document="In-house guide (fictional)" provenance="seen"/></criterion>'
                    '</criteria-set>')
        os.environ["BW_CRITERIA_PATH"] = tmp
        try:
            d = run_json("criteria", "--list")
            assert "firm-rules" in [s["id"] for s in d["criteria_sets"]], d
            code, out, err = run("check", demo, "--criteria", "firm-rules")
            assert code == 1 and "fail" in out, (code, out, err)
        finally:
            del os.environ["BW_CRITERIA_PATH"]
tap.check("a user criteria set from BW_CRITERIA_PATH is found and used", user_set)

with tempfile.TemporaryDirectory() as tmp:
    broken = os.path.join(tmp, "broken.bwproj")
    with open(broken, "w") as f:
        f.write(open(demo).read().replace("</project>", ""))
    expect_usage_error(tap, ["compute", broken], "broken.bwproj:")
    expect_usage_error(tap, ["check", broken], "broken.bwproj:")
expect_usage_error(tap, ["compute"], "missing PROJECT")
expect_usage_error(tap, ["compute", "/no/such/file.bwproj"], "/no/such/file.bwproj")
expect_usage_error(tap, ["check", demo, "--criteria", "no-such-set"], "no criteria set named")
expect_usage_error(tap, ["check", demo, "--criteria"], "--criteria needs a value")
expect_usage_error(tap, ["criteria"], "--list is required")
expect_usage_error(tap, ["compute", demo, demo], "unexpected argument")

sys.exit(tap.done())
