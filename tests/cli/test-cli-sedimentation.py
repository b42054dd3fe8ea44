#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""The CLI contract for `basin`, `scour`, `plates` and `removal`: keys, worked examples, US units
and a table of bad inputs. Every check value names its source beside it."""
import math
import sys

from clitest import Tap, expect_usage_error, run, run_json

tap = Tap()

# Exact conversions (NIST SP 811; docs/references.md): 1 ft = 0.3048 m, 1 gal = 3.785411784 L.
FT = 0.3048
GAL = 3.785411784e-3
DAY = 86400.0


def per_day(x):
    return x / DAY


def close(got, want, rel, what=""):
    """The JSON carries 12 significant digits, so 1e-11 is the tightest useful tolerance."""
    assert isinstance(got, (int, float)) and math.isfinite(got), (what, got)
    assert abs(got - want) <= rel * abs(want), f"{what}: got {got!r}, want {want!r} within {rel:g}"


# --- help: each command documents its keys' conditions and the default temperature
for cmd, needles in (("basin", ["--weir-length", "20 °C", "weir_loading_m2_s appears only"]),
                     ("scour", ["0.05", "0.025", "scour_margin"]),
                     ("plates", ["circular-tubes", "d/4", "20 °C"]),
                     ("removal", ["--hazen-n", "min(1, vs/v0)"])):
    code, out, err = run(cmd, "--help")
    tap.ok(code == 0 and "--json" in out and "bare number" in out and all(n in out for n in needles)
           and "licensed professional" in out, f"{cmd} --help", out + err)
code, out, err = run("--help")
tap.ok(code == 0 and all(c in out for c in ("basin", "scour", "plates", "removal")),
       "top-level --help lists the four calculators", out)

BASIN_KEYS = {"surface_area_m2", "overflow_rate_m_s", "detention_s", "horizontal_velocity_m_s",
              "length_width_ratio", "reynolds", "froude"}


# --- basin: contract keys, and weir_loading_m2_s only with --weir-length
def basin_keys():
    d = run_json("basin", "--flow", "0.3", "--length", "40", "--width", "8", "--depth", "3.5")
    assert BASIN_KEYS <= d.keys(), d.keys()
    assert "weir_loading_m2_s" not in d, d
    assert "scour_velocity_m_s" not in d, d
    assert d["temperature_C"] == 20, d          # the stated default
    d = run_json("basin", "--flow", "0.3", "--length", "40", "--width", "8", "--depth", "3.5",
                 "--weir-length", "60")
    assert BASIN_KEYS | {"weir_loading_m2_s"} <= d.keys(), d.keys()
    # Hand arithmetic (derived): 0.3/(40 x 8), 40 x 8 x 3.5/0.3, 0.3/(8 x 3.5), 0.3/60; R = 28/15.
    close(d["surface_area_m2"], 320.0, 1e-11)
    close(d["overflow_rate_m_s"], 0.3 / 320.0, 1e-11)
    close(d["detention_s"], 1120.0 / 0.3, 1e-11)
    close(d["horizontal_velocity_m_s"], 0.3 / 28.0, 1e-11)
    close(d["weir_loading_m2_s"], 0.005, 1e-11)
    close(d["length_width_ratio"], 5.0, 1e-11)
    close(d["hydraulic_radius_m"], 28.0 / 15.0, 1e-11)
    v = 0.3 / 28.0
    close(d["froude"], v * v / (9.80665 * 28.0 / 15.0), 1e-10)
    close(d["reynolds"], v * 28.0 / 15.0 / d["kinematic_viscosity_m2_s"], 1e-10)
tap.check("basin --json: contract keys; weir loading only with --weir-length", basin_keys)


def basin_davis_10_4():
    # Davis (2010) Example 10-4 (seen): 0.5 m3/s on six basins 4 m x 55.5 m, SWD 3.0 m, 10 degC,
    # designed at 32.5 m3/(d m2) (the built 222 m2 gives 32.43, 0.3 % under); L/W printed 13.8.
    # Derived (hand): Rh 1.2 m, vh 6.9444e-3 m/s, Fr 4.0980e-6, Re 6379.4 with nu(10 degC) =
    # 1.3062886e-6 m2/s (docs/references.md water table).
    d = run_json("basin", "--flow", "0.5", "--basins", "6", "--length", "55.5", "--width", "4",
                 "--depth", "3", "--temp", "10")
    close(d["overflow_rate_m_s"], per_day(32.5), 3e-3, "overflow vs Davis")
    close(d["overflow_rate_m_s"], 0.5 / 6 / 222.0, 1e-11, "overflow")
    close(d["length_width_ratio"], 13.8, 1e-2, "L/W vs Davis")
    close(d["froude"], 4.0980108e-6, 1e-7, "Fr")
    close(d["reynolds"], 6379.397, 2e-4, "Re")
    assert d["froude_below_limit"] is True and d["reynolds_above_limit"] is False, d
    assert d["basins"] == 6
tap.check("basin: Davis Example 10-4 through the CLI", basin_davis_10_4)


def basin_davis_launders():
    # Davis (2010) tube-settler example p. 10-37 (seen): 43 200 m3/d on two tanks 6 m wide, 3.6 m
    # deep: approach velocity 0.0116 m/s; 3 launders x 24 m x 2 sides a tank: 150 m3/(d m).
    d = run_json("basin", "--flow", "43200 m3/d", "--basins", "2", "--length", "24m",
                 "--width", "6 m", "--depth", "3.6m", "--weir-length", "144")
    close(d["horizontal_velocity_m_s"], 0.0116, 3e-3, "approach velocity")
    close(d["weir_loading_m2_s"], per_day(150.0), 1e-11, "weir loading")
tap.check("basin: Davis tube-settler tank velocity and weir loading", basin_davis_launders)


def basin_us_units():
    # 10 MGD through 200 ft x 50 ft x 12 ft with 400 ft of weir (derived, exact conversions):
    # overflow 1e7 gal/d / 1e4 ft2 = 1000 gpd/ft2; detention 120 000 ft3 = 897 662 gal over
    # 1e7 gal/d = 0.0897662 d; vh = Q / 600 ft2; weir 1e7 / 400 = 25 000 gpd/ft.
    d = run_json("basin", "--flow", "10MGD", "--length", "200ft", "--width", "50ft",
                 "--depth", "12ft", "--weir-length", "400ft")
    q = 1e7 * GAL / DAY
    close(d["surface_area_m2"], 1e4 * FT ** 2, 1e-11, "area")
    close(d["overflow_rate_m_s"], 1000 * GAL / DAY / FT ** 2, 1e-9, "overflow")
    close(d["overflow_rate_m_s"], per_day(40.7458), 2e-6, "overflow vs docs/references.md 0.0407458 m/d")
    close(d["detention_s"], 120000 * FT ** 3 / q, 1e-9, "detention")
    close(d["detention_s"], 0.0897662 * DAY, 1e-6, "detention")
    close(d["horizontal_velocity_m_s"], q / (600 * FT ** 2), 1e-9, "vh")
    close(d["weir_loading_m2_s"], 25000 * GAL / DAY / FT, 1e-9, "weir")
    close(d["length_width_ratio"], 4.0, 1e-11)
tap.check("basin: a US-unit basin (10 MGD, 200 ft) in SI JSON", basin_us_units)

code, out, err = run("basin", "--flow", "10MGD", "--length", "200ft", "--width", "50ft",
                     "--depth", "12ft", "--weir-length", "400ft", "--units", "us")
tap.ok(code == 0 and "gpm/ft²" in out and "gpd/ft" in out and "MGD" in out and "25000" in out
       and "0.6944" in out, "basin readable US table (1000 gpd/ft2 = 0.6944 gpm/ft2)", out + err)
code, out, err = run("basin", "--flow", "0.3", "--length", "40", "--width", "8", "--depth", "3.5")
tap.ok(code == 0 and "m/h" in out and "Reynolds number" in out and "weir loading" not in out,
       "basin readable SI table", out + err)


def basin_properties():
    # More area, lower overflow rate; more basins, lower overflow rate and weir loading.
    prev = None
    for length in (10, 20, 40, 80, 160):
        d = run_json("basin", "--flow", "0.4", "--length", str(length), "--width", "6",
                     "--depth", "3")
        assert prev is None or d["overflow_rate_m_s"] < prev, (length, d)
        prev = d["overflow_rate_m_s"]
    prev = None
    for n in (1, 2, 3, 5, 8):
        d = run_json("basin", "--flow", "0.4", "--length", "40", "--width", "6", "--depth", "3",
                     "--weir-length", "30", "--basins", str(n))
        assert prev is None or (d["overflow_rate_m_s"] < prev[0]
                                and d["weir_loading_m2_s"] < prev[1]), (n, d)
        prev = (d["overflow_rate_m_s"], d["weir_loading_m2_s"])
tap.check("basin: more area or more basins lower the loadings", basin_properties)


def basin_scour():
    # Camp (1946) with k 0.05, f 0.025, g 9.80665 for 100 um at SG 1.25 (derived):
    # sqrt(8 x 0.05 x 0.25 x 9.80665 x 1e-4 / 0.025) = 0.0626311424 m/s.
    d = run_json("basin", "--flow", "0.15", "--length", "40", "--width", "5", "--depth", "3",
                 "--particle-diameter", "100um", "--particle-sg", "1.25")
    close(d["scour_velocity_m_s"], 0.0626311424, 1e-9)
    close(d["scour_margin"], 6.26311424, 1e-9)
    assert d["scour_risk"] is False
tap.check("basin: scour check with --particle-diameter", basin_scour)


# --- scour
def scour_values():
    d = run_json("scour", "--diameter", "100um", "--sg", "1.25")
    assert "scour_velocity_m_s" in d and "scour_margin" not in d, d
    # 0.0626 m/s at g 9.81 (docs/references.md: from memory, Metcalf & Eddy); the CLI uses 9.80665,
    # 0.017 % lower: derived 0.0626311424.
    close(d["scour_velocity_m_s"], 0.0626, 1e-3, "memory value")
    close(d["scour_velocity_m_s"], 0.0626311424, 1e-9, "derived")
    assert d["cohesion"] == 0.05 and d["friction_factor"] == 0.025, d
    d2 = run_json("scour", "--diameter", "0.4mm", "--sg", "1.25", "--cohesion", "0.05",
                  "--friction", "0.1")
    close(d2["scour_velocity_m_s"], d["scour_velocity_m_s"], 1e-11, "4 d and 4 f cancel")
    d3 = run_json("scour", "--diameter", "100um", "--sg", "1.25", "--velocity", "0.5 ft/min")
    close(d3["scour_margin"], 0.0626311424 / 0.00254, 1e-9, "margin over 0.5 ft/min")
tap.check("scour: Camp's check value, defaults and margin", scour_values)


# --- plates
def plates_values():
    # Yao (1970), closed form (memory of the paper); derived by hand for v0 2 mm/s, 60 deg,
    # w 50 mm, l 1 m (L = 20): v_sc = S 0.002 / (sin 60 + 20 cos 60) = S 1.8405994e-4 m/s.
    for shape, s in (("plates", 1.0), ("circular-tubes", 4 / 3), ("square-tubes", 11 / 8)):
        d = run_json("plates", "--velocity", "2mm/s", "--angle", "60", "--spacing", "50mm",
                     "--length", "1m", "--shape", shape)
        assert {"critical_velocity_m_s", "shape_factor", "relative_length"} <= d.keys(), d.keys()
        close(d["shape_factor"], s, 1e-11, shape)
        close(d["relative_length"], 20.0, 1e-11, shape)
        close(d["critical_velocity_m_s"], s * 1.8405994148545e-4, 1e-10, shape)
    d = run_json("plates", "--velocity", "2mm/s", "--angle", "60deg", "--spacing", "50mm",
                 "--length", "1m")
    assert d["shape"] == "plates" and d["temperature_C"] == 20, d
    d2 = run_json("plates", "--velocity", "2mm/s", "--angle", str(math.pi / 3) + "rad",
                  "--spacing", "50mm", "--length", "1m")
    close(d2["critical_velocity_m_s"], d["critical_velocity_m_s"], 1e-11, "angle in rad")
tap.check("plates: Yao's critical velocity for the three shapes", plates_values)


def plates_davis_tube():
    # Davis (2010) p. 10-37 (seen): v = 0.0020 m/s in 50 mm tubes at 60 deg, 10 degC (nu
    # 1.307e-6): R_h = d/4 = 0.0125 m, Re = "19.112 or 19" (< 50), Fr = 3.26e-5. Derived with the
    # engine's nu(10 degC) = 1.3062886e-6: Re 19.138, Fr 3.2631e-5.
    d = run_json("plates", "--velocity", "0.0020", "--angle", "60", "--spacing", "50mm",
                 "--length", "0.6m", "--shape", "circular-tubes", "--temp", "10")
    close(d["hydraulic_radius_m"], 0.0125, 1e-11, "R_h")
    close(d["reynolds"], 19.112, 2e-3, "Re vs Davis")
    close(d["froude"], 3.26e-5, 2e-3, "Fr vs Davis")
    close(d["reynolds"], 19.138, 2e-4, "Re derived")
    assert d["reynolds_above_limit"] is False and d["froude_below_limit"] is False, d
tap.check("plates: Davis tube-settler Re and Fr on R_h = d/4", plates_davis_tube)


def plates_width():
    # Between plates of width b at spacing w: R_h = w b / (2 (w + b)) (derived: area over wetted
    # perimeter); w 50 mm, b 1.2 m: 0.024 m; without --plate-width, w/2.
    d = run_json("plates", "--velocity", "5mm/s", "--angle", "55", "--spacing", "50mm",
                 "--length", "2.4m", "--plate-width", "1.2m")
    close(d["hydraulic_radius_m"], 0.024, 1e-11)
    d = run_json("plates", "--velocity", "5mm/s", "--angle", "55", "--spacing", "50mm",
                 "--length", "2.4m")
    close(d["hydraulic_radius_m"], 0.025, 1e-11)
tap.check("plates: hydraulic radius between plates", plates_width)

code, out, err = run("plates", "--velocity", "0.4 ft/min", "--angle", "60", "--spacing", "2in",
                     "--length", "4ft", "--units", "us")
tap.ok(code == 0 and "gpm/ft²" in out and "ft/s" in out, "plates readable US table", out + err)


# --- removal
def removal_values():
    d = run_json("removal", "--settling-velocity", "0.5mm/s", "--overflow-rate", "3.6m/h")
    assert "removal_fraction" in d and "hazen_n" not in d, d
    close(d["removal_fraction"], 0.5, 1e-11, "Camp 0.5")         # Camp (1946): vs/v0
    d = run_json("removal", "--settling-velocity", "2mm/s", "--overflow-rate", "3.6m/h")
    assert d["removal_fraction"] == 1, d
    # Hazen (1904), n = 3, vs/v0 = 1: 1 - (4/3)^-3 = 0.578125 (derived; docs/references.md 0.5781).
    d = run_json("removal", "--settling-velocity", "1mm/s", "--overflow-rate", "3.6m/h",
                 "--hazen-n", "3")
    close(d["removal_fraction"], 0.578125, 1e-11, "Hazen n 3")
    assert d["model"] == "hazen" and d["hazen_n"] == 3 and d["ideal_removal_fraction"] == 1, d
    # US units: 1 gpm/ft2 = 2.44475 m/h (docs/references.md), so 0.5 gpm/ft2 against 1.222375 m/h.
    d = run_json("removal", "--settling-velocity", "0.611 m/h", "--overflow-rate", "0.5gpm/ft2")
    close(d["removal_fraction"], 0.611 / 1.222375, 1e-5, "gpm/ft2")
tap.check("removal: Camp and Hazen", removal_values)


def removal_monotone():
    # Removal never rises with the overflow rate, in either model.
    for extra in ([], ["--hazen-n", "2"]):
        prev = 2.0
        for v0 in ("0.5", "1", "2", "3", "5", "8", "13"):
            d = run_json("removal", "--settling-velocity", "2 m/h", "--overflow-rate", v0 + "m/h",
                         *extra)
            assert d["removal_fraction"] <= prev, (extra, v0, d)
            prev = d["removal_fraction"]
tap.check("removal never rises with the overflow rate", removal_monotone)

code, out, err = run("removal", "--settling-velocity", "1mm/s", "--overflow-rate", "3.6m/h",
                     "--hazen-n", "3")
tap.ok(code == 0 and "0.5781" in out and "Hazen" in out, "removal readable table", out + err)

# --- bad input: exit 2, one stderr line naming the option, nothing on stdout
B = ["basin", "--flow", "0.3", "--length", "40", "--width", "8", "--depth", "3.5"]
S = ["scour", "--diameter", "100um", "--sg", "2.65"]
P = ["plates", "--velocity", "2mm/s", "--spacing", "50mm", "--length", "1m"]
R = ["removal", "--settling-velocity", "1mm/s"]
bad = [
    (["basin", "--length", "40", "--width", "8", "--depth", "3.5"], "--flow is required"),
    (["basin", "--flow", "0.3", "--length", "40", "--width", "8"], "--depth is required"),
    (B[:-1] + ["0"], "--depth"),
    (B[:-1] + ["-3"], "--depth"),
    (["basin", "--flow", "-0.3", "--length", "40", "--width", "8", "--depth", "3.5"], "--flow"),
    (["basin", "--flow", "0", "--length", "40", "--width", "8", "--depth", "3.5"], "--flow"),
    (["basin", "--flow", "0.3", "--length", "40", "--width", "nan", "--depth", "3.5"], "--width"),
    (["basin", "--flow", "0.3", "--length", "inf", "--width", "8", "--depth", "3.5"], "--length"),
    (["basin", "--flow", "0.3", "--length", "40 gpm", "--width", "8", "--depth", "3.5"],
     "unit of flow"),
    (["basin", "--flow", "0.3 m", "--length", "40", "--width", "8", "--depth", "3.5"], "--flow"),
    (["basin", "--flow", "0.3", "--length", "1e5", "--width", "8", "--depth", "3.5"], "--length"),
    (B + ["--temp", "45"], "--temp"),
    (B + ["--temp", "12 kg"], "--temp"),
    (B + ["--basins", "0"], "--basins"),
    (B + ["--basins", "-2"], "--basins"),
    (B + ["--basins", "2.5"], "--basins"),
    (B + ["--weir-length", "0"], "--weir-length"),
    (B + ["--weir-length", "-10"], "--weir-length"),
    (B + ["--particle-diameter", "100um"], "--particle-sg"),
    (B + ["--particle-sg", "2.65"], "--particle-diameter"),
    (B + ["--cohesion", "0.05"], "--cohesion"),
    (B + ["--particle-diameter", "100um", "--particle-sg", "1"], "--particle-sg"),
    (B + ["--particle-diameter", "100um", "--particle-sg", "2", "--friction", "0"], "--friction"),
    (B + ["--colour", "red"], "unknown option --colour"),
    (["scour", "--sg", "2.65"], "--diameter is required"),
    (["scour", "--diameter", "100um"], "--sg is required"),
    (["scour", "--diameter", "0", "--sg", "2.65"], "--diameter"),
    (["scour", "--diameter", "-1mm", "--sg", "2.65"], "--diameter"),
    (["scour", "--diameter", "100 kg", "--sg", "2.65"], "unit of mass"),
    (["scour", "--diameter", "100um", "--sg", "1"], "--sg"),
    (["scour", "--diameter", "100um", "--sg", "nan"], "--sg"),
    (S + ["--cohesion", "0"], "--cohesion"),
    (S + ["--cohesion", "2"], "--cohesion"),
    (S + ["--friction", "-0.02"], "--friction"),
    (S + ["--velocity", "0"], "--velocity"),
    (P + ["--angle", "95"], "--angle"),
    (P + ["--angle", "95deg"], "not an incline"),
    (P + ["--angle", "0"], "--angle"),
    (P + ["--angle", "90"], "--angle"),
    (P + ["--angle", "-30"], "--angle"),
    (P + ["--angle", "1.6rad"], "--angle"),
    (P + ["--angle", "60 m"], "--angle"),
    (P + ["--angle", "nan"], "--angle"),
    (["plates", "--velocity", "2mm/s", "--angle", "60", "--spacing", "50mm"],
     "--length is required"),
    (["plates", "--velocity", "0", "--angle", "60", "--spacing", "50mm", "--length", "1m"],
     "--velocity"),
    (["plates", "--velocity", "nan", "--angle", "60", "--spacing", "50mm", "--length", "1m"],
     "--velocity"),
    (["plates", "--velocity", "2 gpm", "--angle", "60", "--spacing", "50mm", "--length", "1m"],
     "unit of flow"),
    (["plates", "--velocity", "2mm/s", "--angle", "60", "--spacing", "0", "--length", "1m"],
     "--spacing"),
    (["plates", "--velocity", "2mm/s", "--angle", "60", "--spacing", "50mm", "--length", "-1m"],
     "--length"),
    (P + ["--angle", "60", "--shape", "hexagons"], "--shape"),
    (P + ["--angle", "60", "--shape", "circular-tubes", "--plate-width", "1m"], "--plate-width"),
    (P + ["--angle", "60", "--plate-width", "0"], "--plate-width"),
    (P + ["--angle", "60", "--temp", "-5"], "--temp"),
    (R, "--overflow-rate is required"),
    (["removal", "--overflow-rate", "1m/h"], "--settling-velocity is required"),
    (R + ["--overflow-rate", "0"], "--overflow-rate"),
    (R + ["--overflow-rate", "-1m/h"], "--overflow-rate"),
    (R + ["--overflow-rate", "nan"], "--overflow-rate"),
    (R + ["--overflow-rate", "5 gpm"], "unit of flow"),
    (["removal", "--settling-velocity", "-1mm/s", "--overflow-rate", "1m/h"],
     "--settling-velocity"),
    (["removal", "--settling-velocity", "1e3", "--overflow-rate", "1m/h"], "--settling-velocity"),
    (R + ["--overflow-rate", "1m/h", "--hazen-n", "0.5"], "--hazen-n"),
    (R + ["--overflow-rate", "1m/h", "--hazen-n", "inf"], "--hazen-n"),
    (R + ["--overflow-rate", "1m/h", "--hazen-n", "three"], "--hazen-n"),
]
for args, needle in bad:
    expect_usage_error(tap, args, needle)

sys.exit(tap.done())
