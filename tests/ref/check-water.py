#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""check-water.py: compares the engine's water properties with python3-iapws, live.

Every 0.5 degC over 0-40 degC at 101.325 kPa:
  density    Tanaka et al. (2001) in the engine   vs  IAPWS-95 (iapws.IAPWS95(T=..., P=0.101325))
             within 0.05 % (the engine's promise) and 0.002 kg/m3 (Tanaka's stated agreement);
  viscosity  IAPWS 2008 at the engine's density   vs  iapws._iapws._Viscosity(rho_IAPWS95, T)
             within 0.5 %, and vs _Viscosity(rho_engine, T) within 1e-9 (same formulation, same
             arguments: only round-off may differ);
  permittivity Malmberg & Maryott (1956)          vs  IAPWS R8-97 (iapws._iapws._Dielectric):
             the engine documents that it reads 0-0.25 % below R8-97.
Usage: check-water.py PATH/TO/bw-dump-water
"""

import sys

sys.path.insert(0, __import__("os").path.dirname(__file__))
from reflib import Tap, rel, run_dump, skip_all  # noqa: E402

try:
    import iapws
    from iapws._iapws import _Dielectric, _Viscosity
except ImportError as exc:
    skip_all("python3-iapws not available (%s)" % exc)

P_ATM_MPA = 0.101325


def main():
    tap = Tap()
    temps_C = [0.5 * k for k in range(81)]
    outside_C = [-0.5, 40.5, 45.0]
    out = run_dump(sys.argv[1], ["%.12g" % (273.15 + t) for t in temps_C + outside_C])

    worst = {"rho_rel": (0, None), "rho_abs": (0, None), "mu_rel": (0, None),
             "mu_same_rho": (0, None), "eps_below": (0, None), "eps_min_below": (1, None),
             "nu": (0, None)}

    def track(key, value, t, larger=True):
        if (value > worst[key][0]) == larger:
            worst[key] = (value, t)

    for t, line in zip(temps_C, out):
        fields = line.split()
        if fields[0] != "ok":
            tap.check(False, "water at %g degC evaluates" % t, line)
            continue
        T, rho, mu, nu, eps = (float(x) for x in fields[1:6])
        ref = iapws.IAPWS95(T=T, P=P_ATM_MPA)
        mu_ref = _Viscosity(ref.rho, T)
        eps_ref = _Dielectric(ref.rho, T)

        track("rho_rel", rel(rho, ref.rho), t)
        track("rho_abs", abs(rho - ref.rho), t)
        track("mu_rel", rel(mu, mu_ref), t)
        track("mu_same_rho", rel(mu, _Viscosity(rho, T)), t)
        below = (eps_ref - eps) / eps_ref
        track("eps_below", below, t)
        track("eps_min_below", below, t, larger=False)
        track("nu", rel(nu, mu / rho), t)

    tap.note("max |rho - IAPWS-95|   = %.3e kg/m3 (%.2e relative) at %g degC"
             % (worst["rho_abs"][0], worst["rho_rel"][0], worst["rho_abs"][1]))
    tap.note("max |mu - IAPWS 2008 at IAPWS-95 rho| = %.2e relative at %g degC"
             % worst["mu_rel"])
    tap.note("max |mu - IAPWS 2008 at our rho|      = %.2e relative at %g degC"
             % worst["mu_same_rho"])
    tap.note("permittivity below IAPWS R8-97: %.3f %% (at %g degC) to %.3f %% (at %g degC)"
             % (100 * worst["eps_min_below"][0], worst["eps_min_below"][1],
                100 * worst["eps_below"][0], worst["eps_below"][1]))

    tap.check(len(out) == len(temps_C) + len(outside_C) + 1, "one output line per input")
    tap.check(worst["rho_rel"][0] <= 5e-4, "density within 0.05 % of IAPWS-95", worst["rho_rel"])
    tap.check(worst["rho_abs"][0] <= 0.002, "density within 0.002 kg/m3 of IAPWS-95",
              worst["rho_abs"])
    tap.check(worst["mu_rel"][0] <= 5e-3, "viscosity within 0.5 % of IAPWS 2008 / IAPWS-95",
              worst["mu_rel"])
    # nu is computed from the 12-digit mu and rho printed, so round-off up to ~1e-12.
    tap.check(worst["nu"][0] <= 1e-11, "kinematic viscosity = mu / rho", worst["nu"])
    tap.check(worst["mu_same_rho"][0] <= 1e-9, "IAPWS 2008 transcribed exactly",
              worst["mu_same_rho"])
    tap.check(0 <= worst["eps_min_below"][0] and worst["eps_below"][0] <= 2.5e-3,
              "Malmberg-Maryott 0-0.25 % below IAPWS R8-97",
              (worst["eps_min_below"], worst["eps_below"]))

    for t, line in zip(outside_C, out[len(temps_C):]):
        tap.check(line.startswith("error OUT_OF_RANGE temperature: ") and ("%g °C" % t) in line,
                  "%g degC refused as out of range, naming the temperature" % t, line)

    check = out[-1].split()
    tap.check(check[0] == "iapws2008" and abs(float(check[3]) * 1e6 - 889.735100) < 5e-7,
              "IAPWS R12-08 check value 889.735100 uPa s at 298.15 K, 998 kg/m3", out[-1])
    return tap.finish()


if __name__ == "__main__":
    sys.exit(main())
