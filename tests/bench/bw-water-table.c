/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-water-table.c: the engine's kinematic viscosity at 2 and 24 degC, for bench-sweep.py. */
#include "config.h"

#include <stdio.h>

#include "engine/bw-water.h"

int
main (void)
{
  const double t[] = { 2, 24 };
  for (int i = 0; i < 2; i++)
    {
      BwWater w;
      bw_water_properties (273.15 + t[i], &w, NULL);
      printf ("%g %.17g\n", t[i], w.kinematic_viscosity_m2_s);
    }
  return 0;
}
