#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""The CLI contract for gvalue, impeller, paddle, baffled and flocmodel: keys, worked examples,
unit suffixes, python3-fluids cross-checks and a table of bad inputs."""
import math
import sys

from clitest import Tap, expect_usage_error, run, run_json

tap = Tap()


def water(celsius):
    """The engine's own water properties (checked against IAPWS in test-cli-core and tests/ref)."""
    return run_json("water", "--temp", str(celsius))


def close(got, want, rel, what=""):
    # The CLI prints 12 significant digits (%.12g), so no comparison is finer than 1e-10.
    rel = max(rel, 1e-10)
    assert isinstance(got, (int, float)) and math.isfinite(got), (what, got)
    assert abs(got - want) <= rel * abs(want), f"{what}: got {got!r}, want {want!r} within {rel:g}"


for cmd in ("gvalue", "impeller", "paddle", "baffled", "flocmodel"):
    code, out, err = run(cmd, "--help")
    tap.ok(code == 0 and "--json" in out and "bare number" in out
           and "licensed professional" in out, f"{cmd} --help", out + err)
code, out, err = run("--help")
tap.ok(code == 0 and all(c in out for c in ("gvalue", "impeller", "paddle", "baffled",
                                           "flocmodel")), "--help lists the mixing commands", out)


# --- gvalue
def gvalue_davis():
    # Davis (2010) Example 6-7 (seen): 363.6 W in 0.665 m3 at 5 degC is G = 600 1/s with the book's
    # mu = 1.519e-3 Pa s; the engine's IAPWS viscosity at 5 degC is 1.5182e-3 (0.05 % lower), so
    # 0.1 % tolerance.
    d = run_json("gvalue", "--power", "363.6", "--volume", "0.665", "--temp", "5", "--time", "5")
    assert {"G_per_s", "Gt", "power_W", "volume_m3"} <= d.keys(), d.keys()
    close(d["G_per_s"], 600.0, 1e-3, "G")
    close(d["Gt"], d["G_per_s"] * 5.0, 1e-12, "Gt")
    close(d["power_W"], 363.6, 1e-12, "power")
    close(d["volume_m3"], 0.665, 1e-12, "volume")
    # Gt only with --time (contract).
    d = run_json("gvalue", "--power", "363.6", "--volume", "0.665", "--temp", "5")
    assert "Gt" not in d, d
tap.check("gvalue: contract keys; Davis Example 6-7", gvalue_davis)


def gvalue_units():
    # The same 1 hp in 1000 US gallons at 10 degC typed four ways (NIST SP 811: 1 hp =
    # 745.69987 W, 1 gal = 3.785411784 L).
    ref = run_json("gvalue", "--power", "745.69987158", "--volume", "3.785411784", "--temp", "10")
    for p, v, t in (("1hp", "1000gal", "10C"), ("1 hp", "1000 gal", "50F"),
                    ("0.74569987158kW", "3785.411784L", "283.15K")):
        d = run_json("gvalue", "--power", p, "--volume", v, "--temp", t)
        close(d["G_per_s"], ref["G_per_s"], 1e-9, f"{p} {v} {t}")
    w = water(10)
    close(ref["G_per_s"], math.sqrt(745.69987158 / (w["dynamic_viscosity_Pa_s"] * 3.785411784)),
          1e-9, "G by hand")  # derived
    d = run_json("gvalue", "--power", "100", "--volume", "2", "--temp", "20", "--time", "20min")
    close(d["Gt"], d["G_per_s"] * 1200, 1e-12, "Gt with minutes")
tap.check("gvalue: unit suffixes", gvalue_units)


def gvalue_colder_lower():
    gs = [run_json("gvalue", "--power", "500", "--volume", "5", "--temp", str(c))["G_per_s"]
          for c in (40, 30, 20, 10, 0)]
    assert all(a > b for a, b in zip(gs, gs[1:])), gs
tap.check("gvalue: colder water, lower G at the same power", gvalue_colder_lower)

code, out, err = run("gvalue", "--power", "0.5hp", "--volume", "1000gal", "--temp", "50F",
                     "--time", "2min", "--units", "us")
tap.ok(code == 0 and "hp" in out and "gal" in out and "°F" in out and "Gt" in out,
       "gvalue US table", out)


# --- impeller
def impeller_davis():
    # Davis (2010) Example 6-7 (seen): 0.4 m radial impeller, Np 5.7, 1.976 rev/s, rho 1000:
    # P = 450 W (the book's motor power, which it used to size the speed). At 5 degC the engine's
    # rho is 999.97 kg/m3; 1.976 is rounded to 4 digits: 0.2 %.
    d = run_json("impeller", "--kind", "rushton", "--diameter", "0.4m", "--speed", "1.976rps",
                 "--volume", "0.665m3", "--temp", "5")
    assert {"power_number", "power_W", "reynolds", "G_per_s"} <= d.keys(), d.keys()
    close(d["power_number"], 5.7, 1e-12, "Np")
    close(d["power_W"], 450.0, 2e-3, "power")
    w = water(5)
    close(d["reynolds"], w["density_kg_m3"] * 1.976 * 0.16 / w["dynamic_viscosity_Pa_s"], 1e-9,
          "Re")
    close(d["G_per_s"], math.sqrt(d["power_W"] / (w["dynamic_viscosity_Pa_s"] * 0.665)), 1e-9, "G")
    assert d["low_reynolds"] is False
    # From the water power instead (363.6 W -> 1.84 rev/s, docs/references.md derived), G = 600.
    d = run_json("impeller", "--kind", "rushton", "--diameter", "0.4", "--speed", "1.84rps",
                 "--volume", "0.665", "--temp", "5", "--flow", "11.5e3m3/d", "--efficiency", "0.8")
    close(d["G_per_s"], 600.0, 5e-3, "G at 1.84 rev/s")
    close(d["detention_s"], 5.0, 1e-3, "t = 5 s (seen)")
    close(d["motor_power_W"], d["power_W"] / 0.8, 1e-12, "motor power")
tap.check("impeller: contract keys; Davis Example 6-7", impeller_davis)


def impeller_speed_units():
    ref = run_json("impeller", "--kind", "hydrofoil", "--diameter", "1.2", "--speed", "30",
                   "--volume", "60", "--temp", "12")
    for speed in ("30rpm", "0.5rps", "0.5 rev/s", "3.14159265359rad/s"):
        d = run_json("impeller", "--kind", "hydrofoil", "--diameter", "1.2", "--speed", speed,
                     "--volume", "60", "--temp", "12")
        close(d["power_W"], ref["power_W"], 1e-9, speed)
    d = run_json("impeller", "--kind", "hydrofoil", "--diameter", "47.244094488in", "--speed", "30",
                 "--volume", "15850.3231414gal", "--temp", "53.6F")
    close(d["G_per_s"], ref["G_per_s"], 1e-9, "US units")
    # Library power numbers (bw-mixing.c cites them): 0.30, 1.27; a given Np replaces them.
    close(ref["power_number"], 0.30, 1e-12, "hydrofoil Np")
    d = run_json("impeller", "--kind", "pitched-blade-45", "--diameter", "1.2", "--speed", "30",
                 "--volume", "60", "--temp", "12")
    close(d["power_number"], 1.27, 1e-12, "pitched Np")
    close(d["power_W"], ref["power_W"] * 1.27 / 0.30, 1e-12, "P proportional to Np")
    d = run_json("impeller", "--kind", "hydrofoil", "--diameter", "1.2", "--speed", "30",
                 "--volume", "60", "--temp", "12", "--power-number", "0.6")
    close(d["power_W"], ref["power_W"] * 2, 1e-12, "given Np")
tap.check("impeller: unit suffixes and power numbers", impeller_speed_units)


def impeller_properties():
    prev = 0.0
    for rpm in (10, 20, 40, 80, 160):
        d = run_json("impeller", "--kind", "rushton", "--diameter", "0.5", "--speed", str(rpm),
                     "--volume", "2", "--temp", "15")
        assert d["G_per_s"] > prev
        prev = d["G_per_s"]
    d = run_json("impeller", "--kind", "rushton", "--diameter", "0.05", "--speed", "60",
                 "--volume", "0.01", "--temp", "15")
    assert d["low_reynolds"] is True and d["reynolds"] < 1e4, d
    d = run_json("impeller", "--kind", "rushton", "--diameter", "0.4", "--speed", "60",
                 "--volume", "1", "--temp", "15", "--unbaffled", "--power-number", "1.1")
    assert d["baffled"] is False and d["power_number"] == 1.1, d
tap.check("impeller: faster -> higher G; low-Re caution; unbaffled with Np", impeller_properties)


def impeller_fluids():
    # python3-fluids cross-check: the impeller Reynolds number is fluids.core.Reynolds with the
    # velocity N D and the length D.
    from fluids.core import Reynolds
    w = water(25)
    d = run_json("impeller", "--kind", "rushton", "--diameter", "0.6", "--speed", "45",
                 "--volume", "3", "--temp", "25")
    n = 45 / 60
    close(d["reynolds"], Reynolds(V=n * 0.6, D=0.6, rho=w["density_kg_m3"],
                                  mu=w["dynamic_viscosity_Pa_s"]), 1e-9, "Re vs fluids")
tap.check("impeller: Reynolds number against python3-fluids", impeller_fluids)

code, out, err = run("impeller", "--kind", "rushton", "--diameter", "2ft", "--speed", "60rpm",
                     "--volume", "500gal", "--temp", "60F", "--units", "us")
tap.ok(code == 0 and "ft" in out and "hp" in out and "rpm" in out, "impeller US table", out)


# --- paddle
def paddle_example():
    # Derived: 8 blades 2.5 m x 0.15 m at 1.5 m, 2 rpm, 96 m3, 15 degC. L/W = 16.67 -> Cd = 1.4333
    # (our join of Davis Table 6-7, seen); v_r = 0.75 x 2 pi 1.5 / 30 = 0.2356 m/s;
    # P = 8 Cd (2.5 x 0.15) rho v_r^3 / 2 (Davis Eq. 6-20).
    d = run_json("paddle", "--blade-length", "2.5", "--blade-width", "0.15", "--blades", "8",
                 "--radius", "1.5", "--speed", "2", "--volume", "96", "--temp", "15")
    assert {"drag_coefficient", "tip_speed_m_s", "relative_velocity_m_s", "power_W",
            "G_per_s"} <= d.keys()
    w = water(15)
    cd = 1.2 + (2.5 / 0.15 - 5) * 0.3 / 15
    vr = 0.75 * 2 * math.pi * 1.5 * 2 / 60
    p = 8 * cd * 2.5 * 0.15 * w["density_kg_m3"] * vr ** 3 / 2
    close(d["drag_coefficient"], cd, 1e-12, "Cd")
    close(d["tip_speed_m_s"], 2 * math.pi * 1.5 * 2 / 60, 1e-12, "tip speed")
    close(d["relative_velocity_m_s"], vr, 1e-12, "v_r")
    close(d["power_W"], p, 1e-12, "power")
    close(d["G_per_s"], math.sqrt(p / (w["dynamic_viscosity_Pa_s"] * 96)), 1e-12, "G")
    assert d["drag_from_aspect_ratio"] is True
    # Options: a given Cd and k (Hendricks 2011: Cd 1.8, slip 0.24-0.32 -> k 0.68-0.76).
    e = run_json("paddle", "--blade-length", "2.5", "--blade-width", "0.15", "--blades", "8",
                 "--radius", "1.5", "--speed", "2", "--volume", "96", "--temp", "15",
                 "--drag-coefficient", "1.8", "--relative-velocity-factor", "0.7", "--flow", "0.2")
    close(e["power_W"], p * 1.8 / cd * (0.7 / 0.75) ** 3, 1e-12, "Cd and k given")
    close(e["detention_s"], 480.0, 1e-12, "t")
    close(e["Gt"], e["G_per_s"] * 480.0, 1e-12, "Gt")
    # Davis Table 6-7 points through the CLI (seen): L/W 4 -> 1.20, L/W 20 -> 1.50.
    for length, cd_want in (("0.6", 1.20), ("3.0", 1.50)):
        f = run_json("paddle", "--blade-length", length, "--blade-width", "0.15", "--blades", "4",
                     "--radius", "1", "--speed", "3", "--volume", "50", "--temp", "10")
        close(f["drag_coefficient"], cd_want, 1e-12, f"Cd at L = {length}")
tap.check("paddle: contract keys; worked example by hand", paddle_example)


def paddle_units_and_properties():
    ref = run_json("paddle", "--blade-length", "2.5", "--blade-width", "0.15", "--blades", "8",
                   "--radius", "1.5", "--speed", "2", "--volume", "96", "--temp", "15")
    d = run_json("paddle", "--blade-length", "98.4251968504in", "--blade-width", "15cm",
                 "--blades", "8", "--radius", "4.92125984252ft", "--speed", "0.0333333333333rps",
                 "--volume", "96m3", "--temp", "59F")
    close(d["power_W"], ref["power_W"], 1e-9, "US and metric suffixes")
    prev = 0.0
    for rpm in ("1", "2", "3", "4", "5"):
        g = run_json("paddle", "--blade-length", "2.5", "--blade-width", "0.15", "--blades", "8",
                     "--radius", "1.5", "--speed", rpm, "--volume", "96", "--temp", "15")["G_per_s"]
        assert g > prev, (rpm, g, prev)
        prev = g
tap.check("paddle: unit suffixes; faster paddle -> higher G", paddle_units_and_properties)

code, out, err = run("paddle", "--blade-length", "8ft", "--blade-width", "6in", "--blades", "8",
                     "--radius", "5ft", "--speed", "2rpm", "--volume", "20000gal", "--temp", "45F",
                     "--units", "us")
tap.ok(code == 0 and "ft/s" in out and "rpm" in out, "paddle US table", out)


# --- baffled
def baffled_headloss():
    # Derived: h = 0.5 m, Q = 0.1 m3/s, V = 2 m3, 20 degC: G = sqrt (rho g Q h / (mu V)).
    d = run_json("baffled", "--headloss", "0.5", "--flow", "0.1", "--volume", "2", "--temp", "20")
    assert {"detention_s", "G_per_s", "Gt"} <= d.keys(), d.keys()
    w = water(20)
    g = math.sqrt(w["density_kg_m3"] * 9.80665 * 0.1 * 0.5 / (w["dynamic_viscosity_Pa_s"] * 2))
    close(d["G_per_s"], g, 1e-12, "G")
    close(d["detention_s"], 20.0, 1e-12, "t")
    close(d["Gt"], g * 20, 1e-12, "Gt")
    # Camp & Stein's other form, sqrt (g h / (nu t)).
    close(d["G_per_s"], math.sqrt(9.80665 * 0.5 / (w["kinematic_viscosity_m2_s"] * 20)), 1e-9,
          "G alt")
    e = run_json("baffled", "--headloss", "1.64042ft", "--flow", "1585.0323gpm",
                 "--volume", "528.34410gal", "--temp", "68F")
    close(e["G_per_s"], d["G_per_s"], 1e-6, "US units")
tap.check("baffled: contract keys; G from a head loss", baffled_headloss)


def baffled_geometry_fluids():
    # A channel of our own (derived in test-bw-floc.c: 10 passes, 1 m spacing, 2 m deep, 10 m
    # long, 0.3 m3/s, K 3.2, n 0.013) checked against python3-fluids: Manning's velocity
    # fluids.open_flow.V_Manning(Rh, S, n) at the slope S = h_f / L must be the channel velocity,
    # and each turn must lose fluids.core.head_from_K(K, v).
    from fluids.core import head_from_K
    from fluids.open_flow import V_Manning
    for layout in ("around-the-end", "over-and-under"):
        d = run_json("baffled", "--passes", "10", "--spacing", "1", "--depth", "2",
                     "--pass-length", "10", "--flow", "0.3", "--temp", "20", "--layout", layout)
        assert {"detention_s", "G_per_s", "Gt"} <= d.keys()
        s = d["friction_loss_m"] / d["path_length_m"]
        close(V_Manning(d["hydraulic_radius_m"], s, 0.013), d["velocity_m_s"], 1e-9,
              f"{layout} Manning")
        close(d["turn_loss_m"], 9 * head_from_K(3.2, d["velocity_m_s"]), 1e-9, f"{layout} turns")
        close(d["headloss_m"], d["friction_loss_m"] + d["turn_loss_m"], 1e-12, "sum")
        close(d["volume_m3"], 200.0, 1e-12, "volume")
        w = water(20)
        close(d["G_per_s"], math.sqrt(9.80665 * d["headloss_m"] / (w["kinematic_viscosity_m2_s"]
                                                                  * d["detention_s"])), 1e-9, "G")
    ate = run_json("baffled", "--passes", "10", "--spacing", "1", "--depth", "2",
                   "--pass-length", "10", "--flow", "0.3", "--temp", "20")
    close(ate["velocity_m_s"], 0.15, 1e-12, "v = Q / (s d)")
    close(ate["hydraulic_radius_m"], 0.4, 1e-12, "R = s d / (s + 2 d)")
    assert ate["layout"] == "around-the-end" and ate["turns"] == 9
    k = run_json("baffled", "--passes", "10", "--spacing", "1", "--depth", "2",
                 "--pass-length", "10", "--flow", "0.3", "--temp", "20", "--turn-k", "2.5",
                 "--manning-n", "0.015")
    close(k["turn_loss_m"], 9 * head_from_K(2.5, 0.15), 1e-9, "given K")
    close(V_Manning(k["hydraulic_radius_m"], k["friction_loss_m"] / 100, 0.015), 0.15, 1e-9,
          "given n")
tap.check("baffled: channel geometry against python3-fluids (Manning, K heads)",
          baffled_geometry_fluids)


# --- flocmodel
def flocmodel_reference():
    # docs/references.md (derived): T = 1200 s, KA 4.5e-5, KB 1e-7 s, G 50, m = 3 -> n0/n = 4.1545.
    d = run_json("flocmodel", "--g", "50", "--time", "20min", "--compartments", "3")
    assert "remaining_fraction" in d, d.keys()
    close(d["remaining_fraction"], 1 / 4.1545, 2e-5, "remaining")
    close(d["n0_over_nm"], 4.1545, 2e-5, "ratio")
    e = run_json("flocmodel", "--g", "3000/min", "--time", "1200s", "--compartments", "3",
                 "--ka", "4.5e-5", "--kb", "1e-7s")
    close(e["remaining_fraction"], d["remaining_fraction"], 1e-12, "suffixes and explicit defaults")
    # For m = 1 the best G is near 70 1/s (docs/references.md); ours, analytically, 74.63 (derived).
    f = run_json("flocmodel", "--g", "50", "--time", "1200", "--compartments", "1")
    close(f["optimum_G_per_s"], 74.628, 1e-4, "best G, m = 1")
    assert f["optimum_remaining_fraction"] < f["remaining_fraction"]
    # More compartments never worse at the same G and time.
    fr = [run_json("flocmodel", "--g", "50", "--time", "1200",
                   "--compartments", str(m))["remaining_fraction"] for m in (1, 2, 3, 4, 6, 10)]
    assert all(a >= b for a, b in zip(fr, fr[1:])), fr
    # No breakup: pure aggregation (1 + KA G T/m)^-m, and no best G.
    g = run_json("flocmodel", "--g", "60", "--time", "1500", "--compartments", "4", "--kb", "0")
    close(g["remaining_fraction"], (1 + 4.5e-5 * 60 * 1500 / 4) ** -4, 1e-12, "KB = 0")
    assert "optimum_G_per_s" not in g
tap.check("flocmodel: contract key; Argaman-Kaufman values", flocmodel_reference)

code, out, err = run("flocmodel", "--g", "50", "--time", "20min", "--compartments", "3")
tap.ok(code == 0 and "4.154" in out and "0.2407" in out, "flocmodel readable table", out)


# --- bad input: exit 2, one line on stderr naming the option and the reason, nothing on stdout
G = ["gvalue", "--power", "100", "--volume", "2", "--temp", "20"]
I = ["impeller", "--kind", "rushton", "--diameter", "0.4", "--speed", "110", "--volume", "0.7",
     "--temp", "5"]
P = ["paddle", "--blade-length", "2.5", "--blade-width", "0.15", "--blades", "8", "--radius", "1.5",
     "--speed", "2", "--volume", "96", "--temp", "15"]
B = ["baffled", "--headloss", "0.5", "--flow", "0.1", "--volume", "2", "--temp", "20"]
BG = ["baffled", "--passes", "10", "--spacing", "1", "--depth", "2", "--pass-length", "10",
      "--flow", "0.3", "--temp", "20"]
F = ["flocmodel", "--g", "50", "--time", "1200", "--compartments", "3"]


def without(args, opt):
    i = args.index(opt)
    return args[:i] + args[i + 2:]


def with_value(args, opt, value):
    i = args.index(opt)
    return args[:i + 1] + [value] + args[i + 2:]


bad = [
    (without(G, "--power"), "--power is required"),
    (without(G, "--volume"), "--volume is required"),
    (without(G, "--temp"), "--temp is required"),
    (with_value(G, "--power", "0"), "--power"),
    (with_value(G, "--power", "-5W"), "--power"),
    (with_value(G, "--power", "nan"), "not a finite number"),
    (with_value(G, "--power", "5 m"), "unit of length"),
    (with_value(G, "--volume", "0"), "--volume"),
    (with_value(G, "--volume", "2 gpm"), "unit of flow"),
    (with_value(G, "--temp", "45"), "--temp"),
    (G + ["--time", "-1s"], "--time"),
    (G + ["--time", "5 m"], "unit of length"),
    (without(I, "--kind"), "--kind is required"),
    (with_value(I, "--kind", "propeller"), "--kind"),
    (with_value(I, "--diameter", "0"), "--diameter"),
    (with_value(I, "--diameter", "inf"), "not a finite number"),
    (with_value(I, "--diameter", "0.4 kg"), "unit of mass"),
    (with_value(I, "--speed", "-10"), "--speed"),
    (with_value(I, "--speed", "10 m/s"), "--speed"),
    (with_value(I, "--volume", "-1"), "--volume"),
    (I + ["--power-number", "0"], "--power-number"),
    (I + ["--power-number", "-2"], "--power-number"),
    (I + ["--power-number", "abc"], "--power-number"),
    (I + ["--unbaffled"], "--power-number"),
    (I + ["--unbaffled=yes"], "--unbaffled takes no value"),
    (I + ["--efficiency", "1.5"], "--efficiency"),
    (I + ["--flow", "0"], "--flow"),
    (with_value(I, "--speed", "1e200rps"), "--speed"),
    (without(P, "--radius"), "--radius is required"),
    (with_value(P, "--blades", "0"), "--blades"),
    (with_value(P, "--blades", "2.5"), "--blades"),
    (with_value(P, "--blades", "-4"), "--blades"),
    (with_value(P, "--blade-length", "0"), "--blade-length"),
    (with_value(P, "--blade-width", "-1cm"), "--blade-width"),
    (with_value(P, "--blade-width", "NaN"), "not a finite number"),
    (with_value(P, "--radius", "0.05"), "--radius"),           # blade crosses the shaft
    (with_value(P, "--radius", "2 L"), "unit of volume"),
    (with_value(P, "--speed", "0"), "--speed"),
    (with_value(P, "--volume", "0"), "--volume"),
    (P + ["--drag-coefficient", "0"], "--drag-coefficient"),
    (P + ["--relative-velocity-factor", "1.2"], "--relative-velocity-factor"),
    (P + ["--relative-velocity-factor", "0"], "--relative-velocity-factor"),
    (without(B, "--flow"), "--flow is required"),
    (without(B, "--headloss"), "--headloss is required"),
    (without(B, "--volume"), "--volume is required"),
    (with_value(B, "--headloss", "0"), "--headloss"),
    (with_value(B, "--headloss", "-0.2"), "--headloss"),
    (with_value(B, "--headloss", "0.2 s"), "unit of time"),
    (with_value(B, "--flow", "-1"), "--flow"),
    (with_value(B, "--volume", "nan"), "not a finite number"),
    (B + ["--passes", "4"], "exclude each other"),
    (without(BG, "--depth"), "--depth is required"),
    (BG + ["--volume", "20"], "--volume"),
    (with_value(BG, "--passes", "0"), "--passes"),
    (with_value(BG, "--spacing", "0"), "--spacing"),
    (with_value(BG, "--pass-length", "-3"), "--pass-length"),
    (BG + ["--layout", "zigzag"], "--layout"),
    (BG + ["--turn-k", "-1"], "--turn-k"),
    (BG + ["--manning-n", "nan"], "--manning-n"),
    (without(F, "--g"), "--g is required"),
    (without(F, "--compartments"), "--compartments is required"),
    (with_value(F, "--g", "0"), "--g"),
    (with_value(F, "--g", "500"), "--g"),                       # above KA/KB = 450 1/s
    (with_value(F, "--g", "50 m"), "unit of length"),
    (with_value(F, "--time", "0"), "--time"),
    (with_value(F, "--time", "nan"), "not a finite number"),
    (with_value(F, "--compartments", "0"), "--compartments"),
    (with_value(F, "--compartments", "1001"), "--compartments"),
    (with_value(F, "--compartments", "three"), "--compartments"),
    (F + ["--ka", "0"], "--ka"),
    (F + ["--ka", "-1e-5"], "--ka"),
    (F + ["--kb", "-1e-7"], "--kb"),
    (F + ["--kb", "1e-7 m"], "unit of length"),
]
for args, needle in bad:
    expect_usage_error(tap, args, needle)

sys.exit(tap.done())
