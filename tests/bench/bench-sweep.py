#!/usr/bin/python3
# SPDX-License-Identifier: GPL-3.0-or-later
"""The rectangular-basin sweep of bench-engine.c written with numpy (Debian's python3-numpy): the
same grid, cases, limits and formulas (Davis 2010 Ch. 10 for the basin quantities; Camp 1946 for
scour; IAPWS via the engine's own water table printed below). Prints both throughputs and their
ratio and fails if the two pick different best designs. Run by hand:
    /usr/bin/python3 tests/bench/bench-sweep.py build/tests/bench/bench-engine build/tests/bench/bw-water-table
"""
import json
import subprocess
import sys
import time

import numpy as np

engine, water_table = sys.argv[1], sys.argv[2]
flows = np.array([0.0333, 0.0583, 0.1167, 0.15, 0.0333, 0.0583, 0.1167, 0.15])
temps = [2, 2, 2, 2, 24, 24, 24, 24]
# Kinematic viscosity from the engine's own water functions, so only the sweep is compared.
nu_of = {float(t): float(n) for t, n in (l.split() for l in subprocess.run(
    [water_table], capture_output=True, text=True, check=True).stdout.split("\n") if l.strip())}
nu = np.array([nu_of[float(t)] for t in temps])
g = 9.80665
scour_v = np.sqrt(8 * 0.05 * (1.25 - 1) * g * 100e-6 / 0.025)  # Camp (1946), k 0.05, f 0.025

c = json.loads(subprocess.run([engine, "--sweep-json"], capture_output=True, text=True, check=True).stdout)

t0 = time.perf_counter()
W, L, H = np.meshgrid(2.0 + 0.1 * np.arange(181), 10.0 + 0.5 * np.arange(281), 3.0 + 0.05 * np.arange(51),
                      indexing="ij")
ok = (H <= 5) & (L / W >= 4)
for q, n in zip(flows, nu):
    sor = q / (L * W)
    vh = q / (W * H)
    rh = W * H / (W + 2 * H)
    re = vh * rh / n
    fr = vh ** 2 / (g * rh)
    ok &= (sor * 86400 <= 70) & (q / 60 * 86400 <= 250) & (scour_v / vh >= 1)
    if q == 0.1167:
        ok &= (re <= 20000) & (fr >= 1e-5)
vol = np.where(ok, W * L * H, np.inf)
i = np.unravel_index(np.argmin(vol), vol.shape)
seconds = time.perf_counter() - t0
evals = W.size * len(flows)

print(f"engine (C):  {c['evaluations'] / c['seconds'] / 1e6:8.2f} million candidate-case evaluations/s "
      f"({c['evaluations']} in {c['seconds']:.3f} s, with early exit)")
print(f"numpy:       {evals / seconds / 1e6:8.2f} million candidate-case evaluations/s "
      f"({evals} in {seconds:.3f} s, every case of every candidate)")
print(f"ratio:       {(c['evaluations'] / c['seconds']) / (evals / seconds):.2f} x per evaluation; "
      f"whole sweep {seconds / c['seconds']:.2f} x faster in C")
best = (round(float(W[i]), 2), round(float(L[i]), 2), round(float(H[i]), 2))
print(f"best design: engine {c['best_width_m']:.2f} x {c['best_length_m']:.2f} x {c['best_depth_m']:.2f} m, "
      f"numpy {best[0]:.2f} x {best[1]:.2f} x {best[2]:.2f} m")
assert (c["best_width_m"], c["best_length_m"], c["best_depth_m"]) == best, "the two sweeps disagree"
assert abs(c["best_volume_m3"] - float(vol[i])) < 1e-6
print("both pick the same best design")
