#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""The reviewer's commands export, review and diff."""
import csv
import json
import os
import sys
import tempfile

from clitest import Tap, expect_usage_error, run, run_json

tap = Tap()
root = os.environ.get("BW_SOURCE_ROOT", os.path.join(os.path.dirname(__file__), "..", ".."))
ex = os.path.join(root, "data", "examples")
demo = os.path.join(ex, "marrowby-demo.bwproj")
bad = os.path.join(ex, "marrowby-noncompliant.bwproj")
stated = os.path.join(ex, "marrowby-stated.csv")


def review_planted():
    code, out, err = run("review", demo, "--stated", stated, "--json")
    assert code == 0, (code, err)
    d = json.loads(out)
    found = sorted((f["element"], f["quantity"]) for f in d["findings"] if f["kind"] == "discrepancy")
    # Exactly the three planted in the file's header comment.
    assert found == [("north-rm", "G"), ("north-sed", "overflow_rate"), ("south-floc", "detention")], found
    assert d["summary"]["stated"] == 10 and d["summary"]["not_computed"] == 0, d["summary"]
    agrees = [f for f in d["findings"] if f["kind"] == "agrees"]
    assert len(agrees) == 7, agrees
    sor = next(f for f in d["findings"] if f["quantity"] == "overflow_rate" and f["element"] == "north-sed")
    assert abs(sor["stated_si"] - 2.2 / 3600) < 1e-15 and sor["comment"] == "Table 5-3, p. 14", sor
    assert abs(sor["relative_difference"] - (2.2 / 3600 - 0.35 / 3 / 156.8) / (0.35 / 3 / 156.8)) < 1e-9
    # The demo's warnings are criteria findings too, with their citations.
    crit = [f for f in d["findings"] if f["kind"] == "criterion"]
    assert crit and all(f["status"] in ("warn", "fail") and f["document"] for f in crit), crit
tap.check("review flags exactly the planted discrepancies", review_planted)

def review_pdf():
    import shutil
    with tempfile.TemporaryDirectory() as tmp:
        out = os.path.join(tmp, "findings.pdf")
        code, _, err = run("review", demo, "--stated", stated, "-o", out, "--paper", "letter")
        assert code == 0, err
        assert open(out, "rb").read(4) == b"%PDF"
        if shutil.which("pdftotext"):
            import subprocess
            text = subprocess.run(["pdftotext", out, "-"], capture_output=True, text=True).stdout
            for needle in ("north-sed", "north-rm", "south-floc", "Table 5-3, p. 14", "licensed professional"):
                assert needle in text, needle
        bad_dir = os.path.join(tmp, "missing", "f.pdf")
        code, _, err = run("review", demo, "--stated", stated, "-o", bad_dir)
        assert code == 2 and "-o" in err and not os.path.exists(bad_dir), (code, err)
tap.check("review -o writes the findings report as PDF", review_pdf)

def review_tolerance():
    # At 25 % the 22 % overflow error and the 24 % detention error pass; the 6 % G error too.
    d = json.loads(run("review", demo, "--stated", stated, "--tolerance", "25%", "--json")[1])
    assert d["summary"]["discrepancies"] == 0, d["summary"]
tap.check("review --tolerance", review_tolerance)

def review_failing_project():
    code, out, err = run("review", bad, "--stated", stated)
    assert code == 1, (code, err)   # a required criterion fails
    assert "fail" in out and "discrepancy" in out, out
tap.check("review of the non-compliant revision exits 1", review_failing_project)

def review_stored_record():
    # No --stated: the non-compliant example's own review record (4 values, tolerance 2 %).
    code, out, err = run("review", bad, "--json")
    assert code == 1, (code, err)   # required criteria fail, as with a CSV
    d = json.loads(out)
    assert d["tolerance_fraction"] == 0.02 and d["summary"]["stated"] == 4, d
    found = {(f["element"], f["quantity"]): f for f in d["findings"] if "quantity" in f}
    sor = found[("north-sed", "overflow_rate")]
    # 4.2 m/h stated against 0.35/3 m3/s over 30 m x 2.8 m (derived from the example's inputs).
    assert sor["kind"] == "discrepancy" and abs(sor["stated_si"] / (4.2 / 3600) - 1) < 1e-10, sor
    assert abs(sor["computed_si"] / (0.35 / 3 / 84.0) - 1) < 1e-10, sor  # JSON has 12 digits
    assert sor["comment"].startswith("Sheet S-2 divides by a 36 m basin"), sor
    # 15.43 min against 925.7 s (derived: 3 m x 4 m x 9 m over 0.35/3 m3/s) agrees within 2 %.
    floc = found[("north-floc", "detention")]
    assert floc["kind"] == "agrees" and floc["comment"] == "Agrees with the calculation sheet.", floc
    # A stated value without a comment has no comment key.
    assert "comment" not in found[("north-rm", "G")], found[("north-rm", "G")]
    assert sorted(k for k, f in found.items() if f["kind"] == "discrepancy") == [
        ("north-rm", "G"), ("north-sed", "overflow_rate"), ("south-sed", "side_water_depth")], found
    # --tolerance overrides the stored one: at 25 % the 16 % overflow and 20 % depth errors pass and
    # only the 29 % G error remains (1000 stated against 1415 1/s computed, derived).
    d = json.loads(run("review", bad, "--json", "--tolerance", "25%")[1])
    assert d["tolerance_fraction"] == 0.25, d
    assert [(f["element"], f["quantity"]) for f in d["findings"] if f["kind"] == "discrepancy"] == [
        ("north-rm", "G")], d["findings"]
    # --stated replaces the stored values, and its default tolerance is then still the project's.
    d = json.loads(run("review", bad, "--json", "--stated", stated)[1])
    assert d["summary"]["stated"] == 10, d["summary"]
tap.check("review without --stated uses the project's review record", review_stored_record)

def review_stored_pdf():
    import shutil
    import subprocess
    with tempfile.TemporaryDirectory() as tmp:
        out = os.path.join(tmp, "findings.pdf")
        code, _, err = run("review", bad, "-o", out)
        assert code == 1, (code, err)
        assert open(out, "rb").read(4) == b"%PDF"
        if shutil.which("pdftotext"):
            text = subprocess.run(["pdftotext", out, "-"], capture_output=True, text=True).stdout
            text = " ".join(text.split())
            for needle in ("Reviewer's comment", "Designer to revise", "which governs?", "licensed professional"):
                assert needle in text, needle
tap.check("review -o shows the stored comments in the findings PDF", review_stored_pdf)

def export_roundtrip():
    with tempfile.TemporaryDirectory() as tmp:
        code, out, err = run("export", demo, "--csv", tmp)
        assert code == 0, err
        comp = run_json("compute", demo)
        with open(os.path.join(tmp, "results.csv"), newline="") as f:
            rows = list(csv.DictReader(f))
        assert len(rows) == sum(len(e["results"]) for e in comp["elements"]), len(rows)
        # Every number in the CSV equals the computed one (10 significant digits written).
        for e in comp["elements"]:
            for res in e["results"]:
                row = next(r for r in rows if r["element"] == e["id"] and r["case"] == res["case"])
                for key, v in res.items():
                    if key == "case":
                        continue
                    col = next(c for c in row if c.split(" (")[0] == strip_unit(key))
                    assert abs(float(row[col]) - v) <= 1e-9 * abs(v) + 1e-300, (e["id"], key, row[col], v)
        with open(os.path.join(tmp, "checks.csv"), newline="") as f:
            checks = list(csv.DictReader(f))
        chk = run_json("check", demo)
        assert len(checks) == len(chk["checks"])
        assert all(c["document"] for c in checks)
        assert os.path.exists(os.path.join(tmp, "results-north-sed.csv"))

def strip_unit(key):
    for suffix in ("_kg_m3", "_kg_s", "_m3_s", "_m2_s", "_m_s", "_m3", "_m2", "_per_s", "_fraction", "_W", "_s", "_m"):
        if key.endswith(suffix):
            return key[: -len(suffix)]
    return key
tap.check("export: results.csv equals compute --json, checks.csv equals check", export_roundtrip)

def diff_revisions():
    d = run_json("diff", demo, bad)
    inputs = sorted((c["where"], c["what"]) for c in d["changes"] if c["kind"] == "input")
    # Exactly the changes the non-compliant file's header lists (derived by reading both files).
    assert inputs == sorted([("north-rm", "speed"), ("north-floc", "width"), ("north-floc-1", "impeller-diameter"),
                             ("north-floc-2", "blade-length"), ("north-floc-3", "blade-length"),
                             ("south-floc-1", "spacing"), ("north-sed", "length"),
                             ("south-sed", "side-water-depth")]), inputs
    checks = sorted((c["where"], c["what"], c["old"], c["new"]) for c in d["changes"] if c["kind"] == "check")
    assert ("north-sed", "sed-overflow", "pass", "fail") in checks, checks
    assert len(checks) == 6, checks
    same = run_json("diff", demo, demo)
    assert same["summary"] == {"inputs": 0, "results": 0, "checks": 0}, same["summary"]
tap.check("diff: the planted input changes and the check outcomes they flip", diff_revisions)

with tempfile.TemporaryDirectory() as tmp:
    def f(name, text):
        p = os.path.join(tmp, name)
        with open(p, "w") as h:
            h.write(text)
        return p
    hdr = "element,quantity,case,value,unit\n"
    for name, text, needle in [
        ("no-col.csv", "element,quantity,value,unit\nnorth-sed,G,1,1/s\n", "no case column"),
        ("bad-q.csv", hdr + "north-sed,colour,max,1,\n", "colour"),
        ("bad-case.csv", hdr + "north-sed,G,someday,1,1/s\n", "someday"),
        ("bad-unit.csv", hdr + "north-sed,overflow_rate,max,1,kg\n", "unit of mass"),
        ("bad-val.csv", hdr + "north-sed,G,max,abc,1/s\n", "bad-val.csv:2:"),
        ("quote.csv", hdr + "north-sed,G,max,\"1,1/s\n", "unclosed quote"),
    ]:
        expect_usage_error(tap, ["review", demo, "--stated", f(name, text)], needle, f"review rejects {name}")
    expect_usage_error(tap, ["export", demo, "--csv", "/proc/no-such-dir/x"], "--csv")
expect_usage_error(tap, ["review", demo], "holds no stated values; give --stated FILE.csv")
expect_usage_error(tap, ["review", demo, "--stated", stated, "--tolerance", "0"], "--tolerance")
expect_usage_error(tap, ["diff", demo], "missing OLD NEW")

sys.exit(tap.done())
