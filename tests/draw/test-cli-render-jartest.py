#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""basinwright-cli render --view jartest: the demo's jar-test record drawn in every format (files
read back), --json naming what was written, and an id that names no jar-test record refused."""
import os
import struct
import subprocess
import tempfile

from clitest import Tap, expect_usage_error, run, run_json

tap = Tap()
root = os.environ.get("BW_SOURCE_ROOT", os.path.join(os.path.dirname(__file__), "..", ".."))
demo = os.path.join(root, "data", "examples", "marrowby-demo.bwproj")
tmp = tempfile.mkdtemp(prefix="bw-render-jt-")


def png_size(path):
    with open(path, "rb") as f:
        head = f.read(24)
    assert head[:8] == b"\x89PNG\r\n\x1a\n", head[:8]
    return struct.unpack(">II", head[16:24])  # IHDR width, height (PNG spec, 11.2.2)


def render_png():
    out = os.path.join(tmp, "jt.png")
    code, so, se = run("render", demo, "--unit", "jt-2026-11", "--view", "jartest", "--format",
                       "png", "-o", out, "--size", "900x600")
    assert code == 0 and so == "" and se == "", (code, so, se)
    assert png_size(out) == (900, 600), png_size(out)
    assert os.path.getsize(out) > 20000, os.path.getsize(out)  # a blank canvas is ~3 kB
tap.check("render jartest png: exit 0, a 900x600 PNG with a drawing in it", render_png)


def render_vector():
    svg = os.path.join(tmp, "jt.svg")
    pdf = os.path.join(tmp, "jt.pdf")
    for fmt, path in (("svg", svg), ("pdf", pdf)):
        code, so, se = run("render", demo, "--unit", "jt-2026-11", "--view", "jartest",
                           "--format", fmt, "-o", path, "--style", "dark", "--units", "us")
        assert code == 0, (fmt, code, se)
    back = os.path.join(tmp, "back.png")
    p = subprocess.run(["rsvg-convert", "--dpi-x", "72", "--dpi-y", "72", "-o", back, svg],
                       capture_output=True, timeout=60)
    assert p.returncode == 0, p.stderr
    assert png_size(back) == (842, 595), png_size(back)  # 842 x 595 pt at 72 dpi
    with open(pdf, "rb") as f:
        assert f.read(5) == b"%PDF-"
tap.check("render jartest svg and pdf (dark, US units): rsvg-convert reads the SVG back",
          render_vector)


def render_target_line():
    # The demo project's target settled turbidity (2 NTU, its <target-turbidity>) is drawn and
    # labelled, as on the Chemistry page; the PDF's text is read back with pdftotext.
    pdf = os.path.join(tmp, "jt-target.pdf")
    code, so, se = run("render", demo, "--unit", "jt-2026-11", "--view", "jartest", "--format",
                       "pdf", "-o", pdf)
    assert code == 0, (code, se)
    p = subprocess.run(["pdftotext", pdf, "-"], capture_output=True, text=True, timeout=60)
    assert p.returncode == 0, p.stderr
    text = " ".join(p.stdout.split())
    assert "target 2.000 NTU: reached at" in text, text
tap.check("render jartest: the project's target turbidity is drawn and labelled", render_target_line)


def render_json():
    out = os.path.join(tmp, "jt2.png")
    j = run_json("render", demo, "--unit", "jt-2026-11", "--view", "jartest", "--format", "png",
                 "-o", out)
    assert j == {"file": out, "unit": "jt-2026-11", "view": "jartest", "format": "png",
                 "width": 1600, "height": 1000}, j
tap.check("render jartest --json names the file, the record and the view", render_json)

missing = os.path.join(tmp, "none.png")
expect_usage_error(tap, ["render", demo, "--unit", "north-rm", "--view", "jartest", "--format",
                         "png", "-o", missing], "--unit: no jar-test record 'north-rm'",
                   "render jartest of a process unit: exit 2 naming --unit")
tap.ok(not os.path.exists(missing), "no file for the refused render")
expect_usage_error(tap, ["render", demo, "--unit", "jt-nope", "--view", "jartest", "--format",
                         "svg", "-o", missing], "jt-nope", "render jartest of an unknown id: exit 2")

for name in os.listdir(tmp):
    os.unlink(os.path.join(tmp, name))
os.rmdir(tmp)
raise SystemExit(tap.done())
