/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-dump-settling.c: prints the engine's settling results for the cases read from stdin, so that
 * check-settling.py can compare them with python3-fluids.
 * Input lines: "DIAMETER_M SPECIFIC_GRAVITY TEMPERATURE_K CORRELATION" (correlation by name).
 * Output, one line per input:
 *   "ok d sg T rho_f mu v re cd iterations regime v_stokes" (SI, %.12g), or
 *   "error CODE_NAME MESSAGE". */
#include "config.h"

#include <stdio.h>
#include <stdlib.h>

#include "bw-dump.h"
#include "engine/bw-error.h"
#include "engine/bw-settling.h"

int
main (void)
{
  char line[256];

  while (fgets (line, sizeof line, stdin) != NULL)
    {
      g_auto (GStrv) fields = g_strsplit_set (g_strstrip (line), " \t", -1);
      BwDragCorrelation drag;
      BwSettlingResult r;
      BwWater w;
      GError *error = NULL;
      double d, sg, T;

      if (g_strv_length (fields) != 4 || !bw_drag_correlation_from_name (fields[3], &drag))
        {
          fprintf (stderr, "bw-dump-settling: cannot parse '%s'\n", line);
          return EXIT_FAILURE;
        }
      d = g_ascii_strtod (fields[0], NULL);
      sg = g_ascii_strtod (fields[1], NULL);
      T = g_ascii_strtod (fields[2], NULL);

      if (bw_settling_velocity (d, sg, T, drag, &r, &error))
        {
          /* The same water properties the engine used, for the reference solver. */
          if (!bw_water_properties (T, &w, &error))
            g_assert_not_reached ();
          printf ("ok %.12g %.12g %.12g %.12g %.12g %.12g %.12g %.12g %d %s %.12g\n", d, sg, T,
                  w.density_kg_m3, w.dynamic_viscosity_Pa_s, r.velocity_m_s, r.reynolds,
                  r.drag_coefficient, r.iterations, bw_settling_regime_name (r.regime),
                  r.stokes_velocity_m_s);
        }
      else
        {
          printf ("error %s %s\n", bw_dump_error_name (error->code), error->message);
          g_error_free (error);
        }
    }
  return EXIT_SUCCESS;
}
