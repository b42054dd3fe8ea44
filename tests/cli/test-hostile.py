#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""A table of hostile and nonsensical inputs across the command line and files. Each must end in
exit 2 with one stderr line that names the option or file and says why: no crash, no output on
stdout, no NaN or inf anywhere."""
import os
import subprocess
import sys
import tempfile

from clitest import CLI, Tap

tap = Tap()
root = os.environ.get("BW_SOURCE_ROOT", os.path.join(os.path.dirname(__file__), "..", ".."))
demo_path = os.path.join(root, "data", "examples", "marrowby-demo.bwproj")
demo = open(demo_path, encoding="utf-8").read()
tmp = tempfile.mkdtemp(prefix="bw-hostile-")


def file_with(name, content):
    path = os.path.join(tmp, name)
    mode = "wb" if isinstance(content, bytes) else "w"
    with open(path, mode) as f:
        f.write(content)
    return path


def spoil(find, repl):
    assert find in demo, find
    return demo.replace(find, repl, 1)


NAN = ["nan", "NaN", "-nan", "inf", "-inf", "Infinity", "1e999", "-1e999", "1e-400"]
rows = []
# Quick calculators: every kind of bad number in a length, a flow and a temperature.
for v in NAN:
    rows.append((["basin", "--flow", v, "--length", "40", "--width", "10", "--depth", "4"], "--flow"))
for v in ["", " ", "m", "12 kg", "12 parsecs", "0x10", "1,5", "--", "10 m m", "½", "٣"]:
    rows.append((["settle", "--diameter", v, "--sg", "2.65", "--temp", "20"], "--diameter"))
rows += [
    (["water", "--temp", "-273.15C"], "--temp"),
    (["water", "--temp", "1e6K"], "--temp"),
    (["water", "--temp", "40.0001"], "--temp"),
    (["water", "--temp", "12 kg/m3"], "--temp"),
    (["gvalue", "--power", "-5", "--volume", "1", "--temp", "20"], "--power"),
    (["gvalue", "--power", "5", "--volume", "0", "--temp", "20"], "--volume"),
    (["gvalue", "--power", "1e300", "--volume", "1e-300", "--temp", "20"], "finite"),
    (["impeller", "--kind", "propeller", "--diameter", "0.4", "--speed", "100", "--volume", "1", "--temp", "20"], "--kind"),
    (["impeller", "--kind", "rushton", "--diameter", "-0.4", "--speed", "100", "--volume", "1", "--temp", "20"], "--diameter"),
    (["paddle", "--blade-length", "2", "--blade-width", "0.2", "--blades", "-4", "--radius", "1", "--speed", "3", "--volume", "50", "--temp", "10"], "--blades"),
    (["paddle", "--blade-length", "2", "--blade-width", "0.2", "--blades", "99999999999", "--radius", "1", "--speed", "3", "--volume", "50", "--temp", "10"], "--blades"),
    (["plates", "--velocity", "0.002", "--angle", "95", "--spacing", "0.05", "--length", "1"], "--angle"),
    (["plates", "--velocity", "0.002", "--angle", "0", "--spacing", "0.05", "--length", "1"], "--angle"),
    (["plates", "--velocity", "0.002", "--angle", "60", "--spacing", "0.05m3", "--length", "1"], "--spacing"),
    (["removal", "--settling-velocity", "1", "--overflow-rate", "-1"], "--overflow-rate"),
    (["flocmodel", "--g", "50", "--time", "1200", "--compartments", "0"], "--compartments"),
    (["scour", "--diameter", "100um", "--sg", "0.99"], "--sg"),
    (["coagulant", "--kind", "alum", "--dose", "1e9", "--flow", "1"], "--dose"),
    (["zeta", "--mobility", "1e300", "--temp", "20"], "--mobility"),
    (["basin", "--flow", "1", "--length", "40", "--width", "10", "--depth", "4", "--units", "klingon"], "--units"),
    (["basin", "--flow", "1", "--length", "40", "--width", "10", "--depth", "4", "--length", "50"], "more than once"),
    (["basin", "--flow", "1", "--length", "40", "--width", "10"], "--depth is required"),
    (["render"], "--unit is required"),
]
# Files: the project loader.
x = "x" * (10 * 1024 * 1024)
files = [
    ("empty.bwproj", "", "empty.bwproj"),
    ("binary.bwproj", b"\x00\x01\x02\xff" * 100, "binary.bwproj"),
    ("latin1.bwproj", spoil("Demo Engineer", "D\xe9mo").encode("latin-1"), "UTF-8"),
    ("truncated.bwproj", demo[: len(demo) // 2], "truncated.bwproj:"),
    ("xxe.bwproj", spoil('<?xml version="1.0" encoding="UTF-8"?>', '<?xml version="1.0"?><!DOCTYPE p [<!ENTITY x SYSTEM "file:///etc/passwd">]>'), "not allowed"),
    ("laughs.bwproj", spoil('<?xml version="1.0" encoding="UTF-8"?>', '<?xml version="1.0"?><!DOCTYPE p [<!ENTITY a "aaaa"><!ENTITY b "&a;&a;&a;&a;">]>'), "not allowed"),
    ("deep.bwproj", "<a>" * 100000 + "</a>" * 100000, "deep.bwproj"),
    ("longline.bwproj", spoil("<revision>A</revision>", "<revision>" + x + "</revision>"), "revision: longer than"),
    ("huge.bwproj", "<p>" + "y" * (17 * 1024 * 1024) + "</p>", "limit"),
    ("nan.bwproj", spoil('<value param="length" unit="m">56</value>', '<value param="length" unit="m">nan</value>'), "north-sed" if False else "length"),
    ("inf.bwproj", spoil('<value param="width" unit="m">2.8</value>', '<value param="width" unit="m">1e400</value>'), "width"),
    ("neg-flow.bwproj", spoil('<flow case="minimum" unit="m3/s">0.10</flow>', '<flow case="minimum" unit="m3/s">-0.10</flow>'), "minimum flow"),
    ("zero-depth.bwproj", spoil('<value param="liquid-depth" unit="m">1.3</value>', '<value param="liquid-depth" unit="m">0</value>'), "liquid depth"),
    ("wrong-kind.bwproj", spoil('<flow case="maximum-day" unit="m3/s">0.35</flow>', '<flow case="maximum-day" unit="m">0.35</flow>'), "unit of length"),
    ("hot.bwproj", spoil('<temperature case="warmest" unit="degC">24</temperature>', '<temperature case="warmest" unit="degC">95</temperature>'), "warmest temperature"),
    ("future.bwproj", spoil('format-version="1"', 'format-version="99"'), "newer"),
    ("bad-root.bwproj", demo.replace("urn:x-basinwright:project:1", "urn:other"), "not a Basinwright project"),
    ("count.bwproj", spoil('<value param="count">500</value>', '<value param="count">2.5</value>'), "plates or tubes"),
    ("standby.bwproj", spoil('parallel="2" standby="1"', 'parallel="2" standby="7"'), "leaves none"),
    ("blade.bwproj", spoil('<value param="blade-radius-1" unit="m">1.3</value>', '<value param="blade-radius-1" unit="m">2.9</value>'), "blade radius"),
]
for name, content, needle in files:
    rows.append((["check", file_with(name, content)], needle))
# CSV sheets.
rows += [
    (["jartest", file_with("j1.csv", "dose (mg/L),turbidity (NTU)\n" + "10,1\n" * 100)], "more than 64 jars"),
    (["jartest", file_with("j2.csv", b"dose (mg/L),turbidity (NTU)\n10,\xff\n")], "UTF-8"),
    (["jartest", file_with("j3.csv", "dose (mg/L),turbidity (NTU)\n10,inf\n20,1\n30,2\n")], ":2:"),
    (["jartest", file_with("j4.csv", "dose (mg/L),turbidity (NTU)\n" + "1" * (5 * 1024 * 1024) + ",1\n")], "limit"),
    (["review", demo_path, "--stated", file_with("s1.csv", "element,quantity,case,value,unit\nnorth-sed,G,max,1e999,1/s\n")], "s1.csv:2:"),
    (["review", demo_path, "--stated", file_with("s2.csv", "element,quantity,case,value,unit\n,G,max,1,1/s\n")], "element"),
]
# Saves that cannot be written (these hold as root too, unlike permission bits).
os.mkdir(os.path.join(tmp, "a-folder.bwproj"))
rows += [
    (["autosize", demo_path, "--unit", "north-sed", "--apply", "1", "--output",
      os.path.join(tmp, "no-such-folder", "out.bwproj")], "No such file or directory"),
    (["autosize", demo_path, "--unit", "north-sed", "--apply", "1", "--output",
      os.path.join(tmp, "a-folder.bwproj")], "Is a directory"),
]

for args, needle in rows:
    p = subprocess.run([CLI, *args], capture_output=True, timeout=120)
    err = p.stderr.decode("utf-8", "replace")
    lines = [l for l in err.splitlines() if l.strip()]
    bad_number = any(w in (p.stdout + p.stderr).decode("utf-8", "replace").lower().split()
                     for w in ("nan", "inf", "-nan", "-inf"))
    good = p.returncode == 2 and p.stdout == b"" and len(lines) == 1 and needle in lines[0] and not bad_number
    label = " ".join(a if len(a) < 40 else a[:20] + "…" for a in args)
    tap.ok(good, f"hostile: {label}", f"exit {p.returncode}, stdout {p.stdout[:200]!r}, stderr {err[:300]!r}, want '{needle}'")

assert len(rows) >= 60, len(rows)
sys.exit(tap.done())
