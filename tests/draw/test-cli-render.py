#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""basinwright-cli render: every view of every demo unit, files in each format read back, the
schematic's figures against the engine's, sizes, and every bad option named (exit 2)."""
import os
import struct
import subprocess
import sys
import tempfile
import xml.etree.ElementTree as ET

from clitest import Tap, expect_usage_error, run, run_json

tap = Tap()
root = os.environ.get("BW_SOURCE_ROOT", os.path.join(os.path.dirname(__file__), "..", ".."))
demo = os.path.join(root, "data", "examples", "marrowby-demo.bwproj")
tmp = tempfile.mkdtemp(prefix="bw-render-")


def png_size(path):
    with open(path, "rb") as f:
        head = f.read(24)
    assert head[:8] == b"\x89PNG\r\n\x1a\n", head[:8]
    return struct.unpack(">II", head[16:24])  # IHDR width, height (PNG spec, 11.2.2)


def render_png_default():
    out = os.path.join(tmp, "sed.png")
    code, so, se = run("render", demo, "--unit", "north-sed", "--view", "section", "--format", "png",
                       "-o", out)
    assert code == 0 and so == "" and se == "", (code, so, se)
    assert png_size(out) == (1600, 1000), png_size(out)
tap.check("render png: exit 0, PNG of the default 1600x1000", render_png_default)


def render_png_sized():
    out = os.path.join(tmp, "rm.png")
    code, so, se = run("render", demo, "-o", out, "--unit", "north-rm", "--view", "plan", "--format",
                       "png", "--size", "640x400", "--units", "us", "--style", "dark")
    assert code == 0, (code, se)
    assert png_size(out) == (640, 400), png_size(out)
tap.check("render png --size 640x400 (dark, US units; -o before the options)", render_png_sized)


def render_vector(fmt, magic):
    def f():
        out = os.path.join(tmp, "east." + fmt)
        code, so, se = run("render", demo, "--unit", "east-rm", "--view", "section", "--format", fmt,
                           "-o", out)
        assert code == 0, (code, se)
        with open(out, "rb") as fh:
            head = fh.read(64)
        assert any(head.startswith(m) for m in magic), head
    return f
tap.check("render svg starts with <svg or <?xml", render_vector("svg", (b"<svg", b"<?xml")))
tap.check("render pdf starts with %PDF", render_vector("pdf", (b"%PDF-",)))

# Every view of every unit and stage of the demo: the ones drawn give a PNG of the size asked
# for; the others exit 2 naming --view. What each type offers (docs/drawings.md):
VIEWS = {
    "rapid-mix": {"plan", "section", "schematic"},
    "inline-mixer": {"schematic"},
    "flocculator": {"plan", "section", "schematic"},
    "paddle-stage": {"plan", "section", "schematic"},
    "turbine-stage": {"plan", "section", "schematic"},
    "baffled-stage": {"plan", "section", "schematic"},
    "rectangular-basin": {"plan", "section", "schematic"},
    "circular-clarifier": {"plan", "section", "schematic"},
    "plate-settler": {"plan", "section", "schematic"},
}
NS = "{urn:x-basinwright:project:1}"
demo_units = [(e.get("id"), e.get("type")) for e in ET.parse(demo).iter()
              if e.tag in (NS + "unit", NS + "stage")]
assert len(demo_units) == 18, demo_units  # 9 units and 9 stages in the demo file
for uid, utype in demo_units:
    for view in ("plan", "section", "schematic"):
        out = os.path.join(tmp, f"{uid}-{view}.png")
        if view in VIEWS[utype]:
            def f(uid=uid, view=view, out=out):
                code, so, se = run("render", demo, "--unit", uid, "--view", view, "--format", "png",
                                   "-o", out, "--size", "400x300")
                assert code == 0 and se == "", (code, se)
                assert png_size(out) == (400, 300), png_size(out)
            tap.check(f"render {uid} --view {view}: a 400x300 PNG", f)
        else:
            expect_usage_error(tap, ["render", demo, "--unit", uid, "--view", view, "--format", "png",
                                     "-o", out], "--view", f"{uid} ({utype}) has no {view}: names --view")
            tap.ok(not os.path.exists(out), f"no file for the refused {uid} {view}")


# The new views in SVG and PDF, parsed back by librsvg and poppler into pixels.
def parse_back(uid, view):
    def f():
        svg = os.path.join(tmp, f"{uid}-{view}.svg")
        pdf = os.path.join(tmp, f"{uid}-{view}.pdf")
        for fmt, path in (("svg", svg), ("pdf", pdf)):
            code, so, se = run("render", demo, "--unit", uid, "--view", view, "--format", fmt,
                               "-o", path, "--style", "dark")
            assert code == 0, (fmt, code, se)
        back = os.path.join(tmp, "back.png")
        p = subprocess.run(["rsvg-convert", "--dpi-x", "72", "--dpi-y", "72", "-o", back, svg],
                           capture_output=True, timeout=60)
        assert p.returncode == 0, p.stderr
        assert png_size(back) == (842, 595), png_size(back)  # 842 x 595 pt at 72 dpi
        p = subprocess.run(["pdftoppm", "-png", "-r", "36", "-singlefile", pdf,
                            os.path.join(tmp, "page")], capture_output=True, timeout=60)
        assert p.returncode == 0, p.stderr
        assert png_size(os.path.join(tmp, "page.png")) == (421, 298), \
            png_size(os.path.join(tmp, "page.png"))  # half of 842 x 595 pt at 36 dpi, rounded up
    return f


for uid, view in (("north-floc", "plan"), ("south-floc", "section"), ("north-floc-2", "section"),
                  ("south-sed", "plan"), ("south-sed", "section"), ("east-sed", "plan"), ("east-sed", "section"),
                  ("east-rm", "schematic")):
    tap.check(f"render {uid} {view} as SVG and PDF: rsvg-convert and pdftoppm read them back",
              parse_back(uid, view))


def render_large():
    out = os.path.join(tmp, "large.png")
    code, so, se = run("render", demo, "--unit", "south-floc-1", "--view", "plan", "--format", "png",
                       "-o", out, "--size", "3000x2000", "--units", "us")
    assert code == 0, (code, se)
    assert png_size(out) == (3000, 2000), png_size(out)
tap.check("render a stage at 3000x2000 in US units", render_large)


# The schematic's figures are the engine's: each train's PDF, read back as text, holds the
# detention, G and overflow rate that `compute --json` reports for its maximum-day, coldest,
# all-in-service case, at the four significant figures both print.
def schematic_figures(train_unit, expect):
    def f():
        pdf = os.path.join(tmp, f"schematic-{train_unit}.pdf")
        code, so, se = run("render", demo, "--unit", train_unit, "--view", "schematic", "--format",
                           "pdf", "-o", pdf, "--size", "1200x700")
        assert code == 0, (code, se)
        p = subprocess.run(["pdftotext", "-layout", pdf, "-"], capture_output=True, text=True,
                           timeout=60)
        assert p.returncode == 0, p.stderr
        text = " ".join(p.stdout.split())
        assert "maximum day, coldest, all in service" in text, text[:300]
        results = {}
        for e in run_json("compute", demo)["elements"]:
            for r in e["results"]:
                if r["case"] == "maximum-day/coldest/all-in-service":
                    results[e["id"]] = r
        for uid, key, scale, fmt in expect:
            want = fmt.format(results[uid][key] * scale)
            assert want in text, f"{uid} {key}: {want!r} not in {text!r}"
    return f


MIN, MH = 1 / 60.0, 3600.0
tap.check("north schematic: the engine's t, G and overflow rate", schematic_figures("north-floc-2", [
    ("north-rm", "detention_s", 1, "t {:#.4g} s"), ("north-rm", "G_per_s", 1, "G {:#.4g} s"),
    ("north-floc", "detention_s", MIN, "t {:#.4g} min"), ("north-floc-1", "G_per_s", 1, "G1 {:#.4g} s"),
    ("north-floc-3", "G_per_s", 1, "G3 {:#.4g} s"),
    ("north-sed", "overflow_rate_m_s", MH, "overflow {:#.4g} m/h"),
    ("north-sed", "detention_s", MIN, "t {:#.4g} min")]))
tap.check("south schematic: the mixer, the baffled stages and the clarifier", schematic_figures(
    "south-mix", [("south-mix", "G_per_s", 1, "G {:#.4g} s"),
                  ("south-floc-2", "G_per_s", 1, "G2 {:#.4g} s"),
                  ("south-sed", "overflow_rate_m_s", MH, "overflow {:#.4g} m/h")]))

base = [demo, "--view", "plan", "--format", "png", "-o", os.path.join(tmp, "x.png")]
expect_usage_error(tap, ["render", demo, "--unit", "nope", "--view", "plan", "--format", "png",
                         "-o", os.path.join(tmp, "x.png")], "--unit", "unknown unit id names --unit")
expect_usage_error(tap, ["render", demo, "--unit", "south-mix", "--view", "plan", "--format", "png",
                         "-o", os.path.join(tmp, "x.png")], "--view", "a view the unit lacks names --view")
expect_usage_error(tap, ["render", demo, "--unit", "north-sed", "--view", "elevation", "--format",
                         "png", "-o", os.path.join(tmp, "x.png")], "--view", "bad view names --view")
expect_usage_error(tap, ["render", demo, "--unit", "north-sed", "--view", "plan", "--format", "gif",
                         "-o", os.path.join(tmp, "x.png")], "--format", "bad format names --format")
for bad in ("640", "640x", "x400", "640x400x2", "-640x400", "64.5x400", "50x50", "99999x400"):
    expect_usage_error(tap, ["render", demo, "--unit", "north-sed", "--view", "plan", "--format", "png",
                             "-o", os.path.join(tmp, "x.png"), "--size", bad], "--size",
                       f"bad size {bad} names --size")
expect_usage_error(tap, ["render", demo, "--unit", "north-sed", "--view", "plan", "--format", "png"],
                   "-o", "missing -o is named")
nowhere = os.path.join(tmp, "missing-dir", "x.pdf")
expect_usage_error(tap, ["render", demo, "--unit", "north-sed", "--view", "plan", "--format", "pdf",
                         "-o", nowhere], nowhere, "unwritable output names the file")
tap.ok(not os.path.exists(os.path.join(tmp, "x.png")), "no file written by a failed render")

# Charts are views too: each for the units it applies to, in every format; others name --view.
charts = [("north-floc", "taper"), ("south-floc", "taper"), ("north-sed", "settling"),
          ("south-sed", "settling"), ("north-sed", "removal"), ("north-rm", "power"),
          ("east-rm", "power"), ("north-rm", "checks"), ("north-sed", "iso-removal")]
for unit, view in charts:
    for fmt, magic in (("png", b"\x89PNG"), ("svg", b"<?xml"), ("pdf", b"%PDF")):
        out = os.path.join(tmp, f"chart-{unit}-{view}.{fmt}")
        code, stdout, err = run("render", demo, "--unit", unit, "--view", view, "--format", fmt, "-o", out)
        good = code == 0 and os.path.exists(out) and open(out, "rb").read(5).startswith(magic[:4])
        tap.ok(good, f"chart {view} of {unit} as {fmt}", f"exit {code}: {err}")
for unit, view in (("north-rm", "taper"), ("north-floc", "settling"), ("north-floc", "power")):
    expect_usage_error(tap, ["render", demo, "--unit", unit, "--view", view, "--format", "png",
                             "-o", os.path.join(tmp, "y.png")], "--view", f"no {view} chart of {unit}")

# The iso-removal chart needs a settling-column test that names the basin: the demo's names
# north-sed only.
for unit in ("south-sed", "north-rm"):
    expect_usage_error(tap, ["render", demo, "--unit", unit, "--view", "iso-removal", "--format", "png",
                             "-o", os.path.join(tmp, "z.png")], "--view", f"no iso-removal chart of {unit}")
tap.ok(not os.path.exists(os.path.join(tmp, "z.png")), "no file for a refused iso-removal chart")
code, _, err = run("render", demo, "--unit", "south-sed", "--view", "iso-removal", "--format", "png",
                   "-o", os.path.join(tmp, "z.png"))
tap.ok("no settling-column test applies to 'south-sed'" in err, "the refusal says why", err)


def iso_parse_back():
    svg = os.path.join(tmp, "iso.svg")
    pdf = os.path.join(tmp, "iso.pdf")
    for fmt, path in (("svg", svg), ("pdf", pdf)):
        code, so, se = run("render", demo, "--unit", "north-sed", "--view", "iso-removal", "--format", fmt,
                           "-o", path)
        assert code == 0, (fmt, code, se)
    ET.parse(svg)  # well-formed XML
    p = subprocess.run(["pdftotext", pdf, "-"], capture_output=True, text=True, timeout=60)
    assert p.returncode == 0, p.stderr
    text = " ".join(p.stdout.split())
    # 71.99 % (derived by hand in tests/draw/charts/test-bw-chart-isoremoval.c) prints as 72 %.
    for needle in ("iso-removal", "Type II removal 72 %", "50 %", "licensed engineer"):
        assert needle in text, (needle, text[:400])
tap.check("render north-sed iso-removal as SVG and PDF, read back", iso_parse_back)

for name in os.listdir(tmp):
    os.unlink(os.path.join(tmp, name))
os.rmdir(tmp)
sys.exit(tap.done())
