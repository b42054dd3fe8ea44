# SPDX-License-Identifier: GPL-3.0-or-later
"""test-report.py: `report` and the findings report, written as PDF and read back with pdftotext
and pdfinfo (poppler-utils). Arguments: the CLI, then the bw-review-report driver."""
import json
import math
import os
import re
import subprocess
import sys
import tempfile

import clitest
from clitest import Tap, run

DRIVER = sys.argv[2]
DEMO = "data/examples/marrowby-demo.bwproj"
BAD = "data/examples/marrowby-noncompliant.bwproj"
STATED = "data/examples/marrowby-stated.csv"
UNITS = ["north-rm", "north-floc", "north-sed", "south-mix", "south-floc", "south-sed", "east-rm",
         "east-floc", "east-sed"]


def pages_of(pdf):
    """The text of each page (pdftotext separates pages with a form feed)."""
    out = subprocess.run(["pdftotext", "-layout", pdf, "-"], capture_output=True, text=True,
                         check=True).stdout
    pages = out.split("\f")
    if pages and not pages[-1].strip():
        pages.pop()
    return pages


def info_of(pdf):
    out = subprocess.run(["pdfinfo", pdf], capture_output=True, text=True, check=True).stdout
    d = {}
    for line in out.splitlines():
        k, _, v = line.partition(":")
        d[k.strip()] = v.strip()
    return d


def page_size(info):
    m = re.match(r"([\d.]+) x ([\d.]+) pts", info["Page size"])
    return float(m.group(1)), float(m.group(2))


def fmt4(v):
    """Four significant figures the way the report (bw_format_number) writes a value."""
    a = abs(v)
    decimals = max(0, 3 - math.floor(math.log10(a)))
    return f"{v:.{decimals}f}"


def main():
    tap = Tap()
    tmp = tempfile.mkdtemp(prefix="bw-report-test-")
    demo = os.path.join(tmp, "demo.pdf")
    code, out, err = run("report", DEMO, "-o", demo)
    tap.ok(code == 0 and os.path.exists(demo), "report writes the demo", f"exit {code}: {err}")
    if code != 0:
        return tap.done()
    pages = pages_of(demo)
    info = info_of(demo)
    n = len(pages)
    text = "\f".join(pages)

    tap.ok(int(info["Pages"]) == n and n >= 10, "page count agrees with pdfinfo and is plausible",
           f"pdfinfo {info['Pages']}, text pages {n}")
    w, h = page_size(info)
    tap.ok(abs(w - 595.28) < 0.5 and abs(h - 841.89) < 0.5, "A4 by default (595 x 842 pt)", info["Page size"])
    tap.ok(all(f"page {i + 1} of {n}" in p for i, p in enumerate(pages)), "every page carries 'page N of M'",
           [i + 1 for i, p in enumerate(pages) if f"page {i + 1} of {n}" not in p])
    tap.ok(all("Alder Creek WTP, Marrowby (demo)" in p for p in pages), "every page names the project")
    tap.ok(all("rev. A" in p for p in pages[1:]), "every page after the cover carries the revision")
    cover = pages[0]
    for needle in ["Demo Engineer", "2026-12-01", "textbook-ranges", "licensed", "professional engineer",
                   "approving authority", "preliminary design aid"]:
        tap.ok(needle in cover, f"cover holds '{needle}'")
    for u in UNITS:
        tap.ok(f"Unit {u} —" in text, f"a section for unit {u}")

    # Contents: each entry's page number is the page its section begins on.
    toc = {}
    for line in pages[1].splitlines():
        m = re.match(r"^(\S.*?)\s{2,}(\d+)$", line.strip())
        if m:
            toc[m.group(1)] = int(m.group(2))
    want = ["Design basis", "Criteria checks", "Methods and references"] + [f"Unit {u}" for u in UNITS]
    for w_ in want:
        hit = [k for k in toc if k.startswith(w_)]
        tap.ok(len(hit) == 1, f"contents lists '{w_}'", sorted(toc))
        if len(hit) == 1:
            pg = toc[hit[0]]
            first = pages[pg - 1].splitlines()
            header = next((l for l in first if l.strip()), "")
            tap.ok(1 <= pg <= n and hit[0] in header and (pg < 2 or hit[0] not in pages[pg - 2].split("\n", 3)[0]),
                   f"'{hit[0]}' begins on page {pg}", header)

    # A governing value from compute --json, formatted as the report formats it.
    data = clitest.run_json("compute", DEMO)
    sed = next(e for e in data["elements"] if e["id"] == "north-sed")
    q = max(c["overflow_rate_m_s"] for c in sed["results"] if "overflow_rate_m_s" in c)
    s = fmt4(q * 3600) + " m/h"
    sec = [p for p in pages if "Unit north-sed —" in p.split("\n", 3)[0]]
    tap.ok(any(s in p for p in sec), f"north-sed's largest overflow rate {s} is in its section")
    rm = next(e for e in data["elements"] if e["id"] == "north-rm")
    g = max(c["G_per_s"] for c in rm["results"])
    sec = [p for p in pages if "Unit north-rm —" in p.split("\n", 3)[0]]
    tap.ok(any(fmt4(g) + " s⁻¹" in p for p in sec), f"north-rm's largest G {fmt4(g)} s⁻¹ is in its section")
    tap.ok("Camp & Stein (1943)" in text and "IAPWS R12-08" in text, "methods cite their references")
    tap.ok("from memory, verify" in text, "memory provenance is flagged")
    tap.ok("Figure" in text and "to scale" in text, "sketches are placed with captions")

    # Letter, US units.
    letter = os.path.join(tmp, "letter.pdf")
    code, out, err = run("report", DEMO, "--output", letter, "--paper", "letter", "--units", "us")
    tap.ok(code == 0, "report --paper letter --units us", err)
    if code == 0:
        w, h = page_size(info_of(letter))
        tap.ok(abs(w - 612) < 0.5 and abs(h - 792) < 0.5, "letter is 612 x 792 pt", (w, h))
        lp = pages_of(letter)
        tap.ok(all(f"page {i + 1} of {len(lp)}" in p for i, p in enumerate(lp)), "letter: every page numbered")
        tap.ok("gpm" in "".join(lp) or "MGD" in "".join(lp) or "ft" in "".join(lp), "US units are used")

    # The non-compliant variant: a failing criterion with its clause.
    badpdf = os.path.join(tmp, "bad.pdf")
    code, out, err = run("report", BAD, "-o", badpdf)
    tap.ok(code == 0, "report of the non-compliant project is written", err)
    if code == 0:
        bp = pages_of(badpdf)
        crit = "\n".join(p for p in bp if "Criteria checks" in p.split("\n", 3)[0])
        line = next((l for l in crit.splitlines() if l.strip().startswith("FAIL") and "north-rm" in l), "")
        tap.ok("1415 s⁻¹" in line and "≤ 1000 s⁻¹" in line, "north-rm's G fails, value and limit shown", line)
        lines = crit.splitlines()
        i = next((k for k, l in enumerate(lines) if l.strip().startswith("FAIL") and "north-rm" in l), None)
        block = []
        if i is not None:
            block = [lines[i]]
            for l in lines[i + 1:]:
                if re.match(r"^(PASS|WARN|FAIL|n/a)\b", l.strip()):
                    break
                block.append(l)
        block = "\n".join(block)
        tap.ok("Davis" in block and "Ch. 6, rapid" in block and "from memory, verify" in block,
               "the failing criterion cites document, clause and provenance", block)
        tap.ok(sum(1 for l in lines if l.strip().startswith("FAIL")) == 6, "all six planted failures are listed")

    # Bad input: exit 2 naming the option, no file left behind.
    clitest.expect_usage_error(tap, ["report", DEMO, "-o", os.path.join(tmp, "x.pdf"), "--paper", "a5"], "--paper")
    tap.ok(not os.path.exists(os.path.join(tmp, "x.pdf")), "bad paper leaves no file")
    clitest.expect_usage_error(tap, ["report", DEMO, "-o", "/nonexistent-dir/x.pdf"], "-o")
    clitest.expect_usage_error(tap, ["report", DEMO], "-o")
    os.mkdir(os.path.join(tmp, "adir"))
    before = sorted(os.listdir(tmp))
    clitest.expect_usage_error(tap, ["report", DEMO, "-o", os.path.join(tmp, "adir")], "-o",
                               "a directory as output is refused")
    tap.ok(sorted(os.listdir(tmp)) == before and os.listdir(os.path.join(tmp, "adir")) == [],
           "a failed write leaves no partial file", sorted(os.listdir(tmp)))

    # The findings report of the stated values: exactly the three planted discrepancies.
    rev = os.path.join(tmp, "review.pdf")
    p = subprocess.run([DRIVER, DEMO, STATED, rev], capture_output=True, text=True)
    tap.ok(p.returncode == 0, "the findings report is written", p.stderr)
    if p.returncode == 0:
        rp = pages_of(rev)
        tap.ok(all(f"page {i + 1} of {len(rp)}" in pg for i, pg in enumerate(rp)), "findings: every page numbered")
        tap.ok("licensed" in rp[0] and "approving authority" in rp[0], "findings cover carries the caution")
        t = "\n".join(rp)
        disc = t[t.index("\nDiscrepancies"):t.index("Stated values not matched")]
        rows = re.findall(r"^\s*(\d+)\s+((?:north|south|east)-\S+)", disc, re.M)
        tap.ok(sorted(rows) == [("5", "north-sed"), ("7", "north-rm"), ("9", "south-floc")],
               "exactly the three planted discrepancies", rows)
        tap.ok("2.200 m/h" in disc and "2.679 m/h" in disc and "-17.9 %" in disc, "stated, computed and difference",
               disc)
        tap.ok("Table 5-3, p. 14" in disc, "the stated line's comment is shown")
        crit = t[t.index("\nCriteria findings"):]
        tap.ok(crit.count("WARN") == 4 and "Table 10-4" in crit, "criteria findings with their clauses")
    return tap.done()


if __name__ == "__main__":
    sys.exit(main())
