/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bench-core.c: median time per call of the water properties, the unit parser and the settling
 * solver. Run by hand (build/tests/bench/bench-core); it prints figures for later comparison and
 * asserts nothing about speed. */
#include "config.h"

#include <stdio.h>
#include <stdlib.h>
#include <time.h>

#include "engine/bw-settling.h"
#include "engine/bw-units.h"
#include "engine/bw-water.h"

#define BATCHES 31

static double
now_s (void)
{
  struct timespec ts;
  clock_gettime (CLOCK_MONOTONIC, &ts);
  return (double) ts.tv_sec + 1e-9 * (double) ts.tv_nsec;
}

static int
cmp_double (const void *a, const void *b)
{
  const double x = *(const double *) a, y = *(const double *) b;
  return (x > y) - (x < y);
}

static volatile double sink;

typedef void (*BenchFn) (int i);

static void
bench_water (int i)
{
  BwWater w;
  bw_water_properties (273.15 + (i % 400) * 0.1, &w, NULL);
  sink += w.dynamic_viscosity_Pa_s;
}

static const char *const typed[] = { "10 MGD", "0.44 m3/s", "700gpm", "50 µm", "12 °C", "1200 gpd/ft2" };
static const BwQuantityKind typed_kind[] = { BW_KIND_FLOW, BW_KIND_FLOW, BW_KIND_FLOW, BW_KIND_LENGTH,
                                             BW_KIND_TEMPERATURE, BW_KIND_SURFACE_LOADING };

static void
bench_parse (int i)
{
  double v = 0;
  const int k = i % (int) G_N_ELEMENTS (typed);
  bw_units_parse (typed[k], typed_kind[k], NULL, "x", &v, NULL);
  sink += v;
}

static void
bench_settle (int i)
{
  BwSettlingResult r;
  const double d = 1e-6 * (1.0 + (i % 1000) * 2.0); /* 1 um - 2 mm */
  bw_settling_velocity (d, 2.65, 283.15, BW_DRAG_CLIFT_GAUVIN, &r, NULL);
  sink += r.velocity_m_s;
}

static void
run (const char *name, BenchFn fn, int calls)
{
  double per_call[BATCHES];

  for (int b = 0; b < BATCHES; b++)
    {
      const double t0 = now_s ();
      for (int i = 0; i < calls; i++)
        fn (i);
      per_call[b] = (now_s () - t0) / calls;
    }
  qsort (per_call, BATCHES, sizeof (double), cmp_double);
  printf ("%-28s median %9.1f ns/call   (min %9.1f, max %9.1f; %d batches of %d)\n", name,
          per_call[BATCHES / 2] * 1e9, per_call[0] * 1e9, per_call[BATCHES - 1] * 1e9, BATCHES,
          calls);
}

int
main (void)
{
  printf ("basinwright %s core benchmark\n", PACKAGE_VERSION);
  run ("water properties", bench_water, 200000);
  run ("unit parser", bench_parse, 100000);
  run ("settling solver", bench_settle, 20000);
  return 0;
}
