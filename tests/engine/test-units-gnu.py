#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""Cross-checks every factor of the engine's unit table against GNU units (Debian package
`units`), which implements the NIST SP 811 definitions independently. TAP on stdout."""
import shutil
import subprocess
import sys

dump = sys.argv[1]

# Our ASCII spelling -> (GNU units expression, SI expression in GNU units). None: units has no
# name for it and the factor is checked through a composite expression instead.
GNU = {
    "m": "m", "mm": "mm", "cm": "cm", "km": "km", "um": "micrometer", "nm": "nm", "ft": "ft",
    "in": "inch", "yd": "yard",
    "m2": "m^2", "mm2": "mm^2", "cm2": "cm^2", "km2": "km^2", "ha": "hectare", "ft2": "ft^2",
    "in2": "inch^2", "acre": "acre",
    "m3": "m^3", "L": "liter", "mL": "milliliter", "ML": "megaliter", "gal": "gallon",
    "kgal": "1000 gallon", "Mgal": "1e6 gallon", "ft3": "ft^3", "yd3": "yard^3",
    "m3/s": "m^3/s", "m3/min": "m^3/min", "m3/h": "m^3/hour", "m3/d": "m^3/day", "L/s": "liter/s",
    "L/min": "liter/min", "L/h": "liter/hour", "ML/d": "megaliter/day", "gpm": "gallon/min",
    "gph": "gallon/hour", "gpd": "gallon/day", "MGD": "1e6 gallon/day", "cfs": "ft^3/s",
    "cfm": "ft^3/min",
    "m/s": "m/s", "m/min": "m/min", "m/h": "m/hour", "m/d": "m/day", "cm/s": "cm/s",
    "mm/s": "mm/s", "ft/s": "ft/s", "ft/min": "ft/min", "ft/h": "ft/hour", "ft/d": "ft/day",
    "m3/(m2*s)": "m^3/m^2 s", "gpm/ft2": "gallon/min ft^2", "gpd/ft2": "gallon/day ft^2",
    "m3/(m*s)": "m^3/m s", "m3/(m*h)": "m^3/m hour", "m3/(m*d)": "m^3/m day",
    "L/(m*s)": "liter/m s", "gpd/ft": "gallon/day ft", "gpm/ft": "gallon/min ft",
    "s": "s", "ms": "ms", "min": "min", "h": "hour", "d": "day",
    "W": "W", "kW": "kW", "MW": "MW", "hp": "hp", "ft*lbf/s": "ft lbf/s",
    "kg/m3": "kg/m^3", "g/cm3": "g/cm^3", "lb/ft3": "lb/ft^3", "lb/gal": "lb/gallon",
    "mg/L": "mg/liter", "ug/L": "microgram/liter", "g/L": "g/liter", "lb/Mgal": "lb/1e6 gallon",
    "Pa*s": "Pa s", "mPa*s": "millipascal s", "P": "poise", "lbf*s/ft2": "lbf s/ft^2",
    "lb/(ft*s)": "lb/ft s",
    "m2/s": "m^2/s", "mm2/s": "mm^2/s", "St": "stokes", "ft2/s": "ft^2/s",
    "rpm": "1/min", "rps": "1/s", "rad/s": "radian/s 1/(2 pi radian)",
    "deg": "degree", "rad": "radian",
    "kg": "kg", "g": "g", "mg": "mg", "t": "tonne", "lb": "lb", "ton": "shortton",
    "kg/s": "kg/s", "kg/h": "kg/hour", "kg/d": "kg/day", "t/d": "tonne/day", "g/s": "g/s",
    "lb/h": "lb/hour", "lb/d": "lb/day",
    "1/s": "1/s", "1/min": "1/min", "%": "percent",
    "m2/(V*s)": "m^2/V s", "um*cm/(V*s)": "micrometer cm/V s", "V": "V", "mV": "mV",
    "mol/m3": "mol/m^3", "mol/L": "mol/liter", "umol/L": "micromol/liter",
}
SI_OF_KIND = {
    "length": "m", "area": "m^2", "volume": "m^3", "flow": "m^3/s", "velocity": "m/s",
    "surface loading": "m/s", "weir loading": "m^2/s", "time": "s", "power": "W",
    "density": "kg/m^3", "concentration": "kg/m^3", "dynamic viscosity": "Pa s",
    "kinematic viscosity": "m^2/s", "rotational speed": "1/s", "angle": "radian", "mass": "kg",
    "mass flow": "kg/s", "rate": "1/s", "fraction": "1", "electrophoretic mobility": "m^2/V s",
    "electric potential": "V", "molar concentration": "mol/m^3",
}
# Temperatures: checked as two points each through units' tempC()/tempF() functions.
TEMPS = {"degC": ("tempC(0)", "tempC(100)"), "degF": ("tempF(32)", "tempF(212)"), "K": ("0 K", "100 K")}


def gnu(expr, to):
    out = subprocess.run(["units", "-t", "-d", "15", expr, to], capture_output=True, text=True)
    if out.returncode != 0:
        raise RuntimeError(out.stdout + out.stderr)
    return float(out.stdout.split()[0])


n = failed = 0


def ok(cond, name, detail=""):
    global n, failed
    n += 1
    print(("ok" if cond else "not ok") + f" {n} - {name}")
    if not cond:
        failed += 1
        print("# " + detail)


if shutil.which("units") is None:
    print("1..0 # SKIP GNU units is not installed")
    sys.exit(0)

rows = subprocess.run([dump], capture_output=True, text=True, check=True).stdout.splitlines()
for row in rows:
    kind, ascii_, factor, offset = row.split("\t")
    factor, offset = float(factor), float(offset)
    if kind == "turbidity":
        continue  # NTU is not a physical unit; it stays NTU
    if kind == "temperature":
        lo, hi = TEMPS[ascii_]
        xs = (0.0, 100.0) if ascii_ != "degF" else (32.0, 212.0)
        k0, k1 = gnu(lo, "K"), gnu(hi, "K")
        ours0, ours1 = xs[0] * factor + offset, xs[1] * factor + offset
        ok(abs(ours0 - k0) < 1e-9 and abs(ours1 - k1) < 1e-9, f"{ascii_} against units",
           f"ours {ours0} {ours1}, units {k0} {k1}")
        continue
    if ascii_ not in GNU:
        ok(False, f"{ascii_} has a GNU units expression", "add it to the GNU table in this test")
        continue
    want = gnu(GNU[ascii_], SI_OF_KIND[kind])
    ok(abs(factor - want) <= 1e-12 * abs(want) + 1e-300, f"{ascii_} ({kind}) = {want:.15g} SI",
       f"ours {factor:.17g}, GNU units {want:.17g}")

print(f"1..{n}")
sys.exit(1 if failed else 0)
