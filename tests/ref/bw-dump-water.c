/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-dump-water.c: prints the engine's water properties for the temperatures (K) read from stdin,
 * one per line, so that check-water.py can compare them with python3-iapws.
 * Output, one line per input: "ok T rho mu nu eps" (SI, %.12g) or "error CODE_NAME MESSAGE". */
#include "config.h"

#include <stdio.h>
#include <stdlib.h>

#include "bw-dump.h"
#include "engine/bw-error.h"
#include "engine/bw-water.h"

int
main (void)
{
  char line[256];

  while (fgets (line, sizeof line, stdin) != NULL)
    {
      char *end = NULL;
      double T = g_ascii_strtod (line, &end);
      BwWater w;
      GError *error = NULL;

      if (end == line)
        {
          fprintf (stderr, "bw-dump-water: cannot parse '%s'\n", g_strchomp (line));
          return EXIT_FAILURE;
        }
      if (bw_water_properties (T, &w, &error))
        printf ("ok %.12g %.12g %.12g %.12g %.12g\n", w.temperature_K, w.density_kg_m3,
                w.dynamic_viscosity_Pa_s, w.kinematic_viscosity_m2_s, w.relative_permittivity);
      else
        {
          printf ("error %s %s\n", bw_dump_error_name (error->code), error->message);
          g_error_free (error);
        }
    }
  /* The IAPWS 2008 helper alone at its published check point, for the script to compare. */
  printf ("iapws2008 298.15 998 %.12g\n", bw_water_viscosity_iapws2008 (298.15, 998.0));
  return EXIT_SUCCESS;
}
