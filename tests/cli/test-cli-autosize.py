#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""autosize: the designs it returns pass `check`, in rank order, for every kind of unit."""
import json
import os
import sys
import tempfile

from clitest import Tap, expect_usage_error, run, run_json

tap = Tap()
root = os.environ.get("BW_SOURCE_ROOT", os.path.join(os.path.dirname(__file__), "..", ".."))
demo = os.path.join(root, "data", "examples", "marrowby-demo.bwproj")
units = ["north-sed", "south-sed", "east-sed", "north-rm", "south-mix", "north-floc", "south-floc"]

with tempfile.TemporaryDirectory() as tmp:
    for unit in units:
        for objective in ("volume", "footprint", "power"):
            def one(unit=unit, objective=objective):
                d = run_json("autosize", demo, "--unit", unit, "--objective", objective)
                designs = d["designs"]
                assert 1 <= len(designs) <= 5 and d["passing"] >= len(designs), d
                key = next(k for k in designs[0] if k.startswith("objective_"))
                objs = [x[key] for x in designs]
                assert objs == sorted(objs), objs
                assert all(m["margin_fraction"] >= 0 for x in designs for m in x["margins"]), designs
                if unit == "north-rm":
                    # An impeller from 0.2 to 0.5 of the tank width (common practice, no source).
                    ratios = [x["values"]["impeller-diameter"] / x["values"]["width"] for x in designs]
                    assert all(0.2 - 1e-9 <= r <= 0.5 + 1e-9 for r in ratios), ratios
                # The best and the last design, applied, pass every required criterion (`check`).
                for rank in (1, len(designs)):
                    out = os.path.join(tmp, f"{unit}-{objective}-{rank}.bwproj")
                    code, _, err = run("autosize", demo, "--unit", unit, "--objective", objective,
                                       "--apply", str(rank), "--output", out)
                    assert code == 0, err
                    code, text, err = run("check", out, "--json")
                    c = json.loads(text)
                    fails = [x for x in c["checks"] if x["status"] == "fail"]
                    assert code == 0 and not fails, (unit, rank, fails)
            tap.check(f"autosize {unit} by {objective}: ranked designs that check confirms", one)

expect_usage_error(tap, ["autosize", demo, "--unit", "no-such-unit"], "--unit")
expect_usage_error(tap, ["autosize", demo, "--unit", "north-floc-2"], "sized with its flocculator")
expect_usage_error(tap, ["autosize", demo, "--unit", "north-sed", "--objective", "cost"], "--objective")
expect_usage_error(tap, ["autosize", demo, "--unit", "north-sed", "--apply", "1"], "--apply and --output")
expect_usage_error(tap, ["autosize", demo], "--unit is required")

sys.exit(tap.done())
