#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""basinwright-cli render: files in each format, sizes, and every bad option named (exit 2)."""
import os
import struct
import sys
import tempfile

from clitest import Tap, expect_usage_error, run

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

base = [demo, "--view", "plan", "--format", "png", "-o", os.path.join(tmp, "x.png")]
expect_usage_error(tap, ["render", demo, "--unit", "nope", "--view", "plan", "--format", "png",
                         "-o", os.path.join(tmp, "x.png")], "--unit", "unknown unit id names --unit")
expect_usage_error(tap, ["render", demo, "--unit", "south-sed", "--view", "plan", "--format", "png",
                         "-o", os.path.join(tmp, "x.png")], "--unit", "an undrawn unit type names --unit")
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

for name in os.listdir(tmp):
    os.unlink(os.path.join(tmp, name))
os.rmdir(tmp)
sys.exit(tap.done())
