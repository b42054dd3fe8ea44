/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bench-engine.c: engine speed figures (run by hand; asserts nothing about speed).
 *   bench-engine [PROJECT]     candidate-case evaluations per second for a rectangular basin
 *                              sweep, whole-project evaluation time, auto-size times
 *   bench-engine --sweep-json  the basin sweep only, as JSON, for bench-sweep.py */
#include "config.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include <glib/gstdio.h>

#include "engine/bw-autosize.h"
#include "engine/bw-evaluate.h"
#include "engine/bw-sedimentation.h"
#include "engine/bw-water.h"
#include "io/bw-criteria-xml.h"
#include "io/bw-project-xml.h"

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

/* The sweep shared with bench-sweep.py (keep the two in step): one rectangular basin, widths
 * 2-20 m by 0.1 m, lengths 10-150 m by 0.5 m, depths 3-5.5 m by 0.05 m, in 8 load cases
 * (flows 0.0333, 0.0583, 0.1167, 0.15 m3/s x 2 and 24 degC: one demo train), weir 60 m. Limits (textbook set): overflow
 * <= 70 m/d, depth 3-5 m, L/W >= 4, weir <= 250 m2/d, Re <= 20 000 and Fr >= 1e-5 at the maximum
 * day (0.1167 m3/s), scour margin >= 1. Objective: the smallest volume. */
#define N_CASES 8
static const double sweep_flow[N_CASES] = { 0.0333, 0.0583, 0.1167, 0.15, 0.0333, 0.0583, 0.1167, 0.15 };
static const double sweep_temp_C[N_CASES] = { 2, 2, 2, 2, 24, 24, 24, 24 };

typedef struct
{
  double best_volume, best_w, best_l, best_h;
  guint64 evals, passing;
  double seconds;
} Sweep;

static void
sweep (Sweep *out)
{
  BwWater w[N_CASES];
  BwRectBasin b;
  const double t0 = now_s ();

  double scour_v;

  for (int c = 0; c < N_CASES; c++)
    bw_water_properties (273.15 + sweep_temp_C[c], &w[c], NULL);
  bw_rect_basin_init (&b);
  b.weir_length_m = 60;
  b.check_scour = TRUE;
  bw_scour_particle_init (&b.scour, 100e-6, 1.25);
  bw_scour_velocity (&b.scour, BW_GRAVITY_M_S2, &scour_v, NULL);
  memset (out, 0, sizeof *out);
  out->best_volume = G_MAXDOUBLE;
  {
    /* Every input of the grid lies between these two corners, which the models accept. */
    BwRectBasinResult r;
    BwRectBasin lo = b, hi = b;
    lo.width_m = 2.0, lo.length_m = 10.0, lo.depth_m = 3.0;
    hi.width_m = 20.0, hi.length_m = 150.0, hi.depth_m = 5.5;
    for (int c = 0; c < N_CASES; c++)
      if (!bw_rect_basin_evaluate (&lo, sweep_flow[c], &w[c], &r, NULL)
          || !bw_rect_basin_evaluate (&hi, sweep_flow[c], &w[c], &r, NULL))
        {
          fprintf (stderr, "bench-engine: the sweep's corners are refused\n");
          exit (1);
        }
  }
  for (int iw = 0; iw <= 180; iw++)
    for (int il = 0; il <= 280; il++)
      for (int ih = 0; ih <= 50; ih++)
        {
          gboolean ok = TRUE;
          b.width_m = 2.0 + 0.1 * iw;
          b.length_m = 10.0 + 0.5 * il;
          b.depth_m = 3.0 + 0.05 * ih;
          /* The grid's corners were checked with the full entry point below (every candidate lies
           * between them), so each case runs the bare arithmetic. */
          BwRectBasinResult r;
          for (int c = 0; c < N_CASES && ok; c++)
            {
              out->evals++;
              bw_rect_basin_compute (&b, sweep_flow[c], &w[c], scour_v, &r);
              ok = r.overflow_rate_m_s * 86400 <= 70 && b.depth_m <= 5 && r.length_width_ratio >= 4
                   && r.weir_loading_m2_s * 86400 <= 250 && r.scour_margin >= 1
                   && (c % 4 != 2 || (r.reynolds <= 20000 && r.froude >= 1e-5));
            }
          if (ok)
            {
              const double v = b.width_m * b.length_m * b.depth_m;
              out->passing++;
              if (v < out->best_volume - 1e-9)
                {
                  out->best_volume = v;
                  out->best_w = b.width_m;
                  out->best_l = b.length_m;
                  out->best_h = b.depth_m;
                }
            }
        }
  out->seconds = now_s () - t0;
}

int
main (int argc, char **argv)
{
  Sweep s;

  if (argc > 1 && strcmp (argv[1], "--sweep-json") == 0)
    {
      sweep (&s);
      printf ("{\"evaluations\":%" G_GUINT64_FORMAT ",\"seconds\":%.6f,\"passing\":%" G_GUINT64_FORMAT
              ",\"best_volume_m3\":%.6f,\"best_width_m\":%.2f,\"best_length_m\":%.2f,\"best_depth_m\":%.2f}\n",
              s.evals, s.seconds, s.passing, s.best_volume, s.best_w, s.best_l, s.best_h);
      return 0;
    }
  printf ("basinwright %s engine benchmark (run by hand; figures only)\n", PACKAGE_VERSION);
  sweep (&s);
  printf ("rectangular-basin sweep      %" G_GUINT64_FORMAT " candidate-case evaluations in %.3f s: "
          "%.1f million per second on one core\n", s.evals, s.seconds, s.evals / s.seconds / 1e6);
  printf ("  best: %.2f x %.2f x %.2f m, %.1f m3 (%" G_GUINT64_FORMAT " passing)\n", s.best_w, s.best_l,
          s.best_h, s.best_volume, s.passing);

  {
    const char *path = argc > 1 ? argv[1] : BW_SOURCE_DATADIR "/examples/marrowby-demo.bwproj";
    g_autoptr (GError) error = NULL;
    g_autoptr (BwProject) p = bw_project_load (path, &error);
    g_autoptr (BwCriteriaSet) set = NULL;
    double times[101];
    if (p == NULL)
      {
        fprintf (stderr, "%s\n", error->message);
        return 1;
      }
    for (int i = 0; i < 101; i++)
      {
        const double t0 = now_s ();
        BwResults *r = bw_project_evaluate (p, NULL);
        times[i] = now_s () - t0;
        bw_results_free (r);
      }
    qsort (times, 101, sizeof (double), cmp_double);
    printf ("whole-project evaluation     median %.1f us (%u units and stages x %u load cases)\n",
            times[50] * 1e6, 18u, p->cases->len);
    set = bw_criteria_set_open (p->criteria ? p->criteria : "textbook-ranges", NULL);
    {
      /* Scale: 50 trains of 20 units each, cloned from the demo's units in turn. */
      g_autoptr (BwProject) big = bw_project_copy (p);
      g_autoptr (GPtrArray) pool = g_ptr_array_new ();
      g_autofree char *tmp = g_build_filename (g_get_tmp_dir (), "bw-bench-scale.bwproj", NULL);
      double t0;
      for (guint i = 0; i < p->trains->len; i++)
        {
          const BwTrain *t = g_ptr_array_index (p->trains, i);
          for (guint k = 0; k < t->units->len; k++)
            g_ptr_array_add (pool, g_ptr_array_index (t->units, k));
        }
      g_ptr_array_set_size (big->trains, 0);
      for (guint t = 0; t < 50; t++)
        {
          g_autofree char *tid = g_strdup_printf ("train-%02u", t + 1);
          BwTrain *tr = bw_train_new (tid, tid);
          for (guint k = 0; k < 20; k++)
            {
              BwProcessUnit *u = bw_process_unit_copy (g_ptr_array_index (pool, (t + k) % pool->len));
              g_free (u->id);
              u->id = g_strdup_printf ("t%02u-u%02u", t + 1, k + 1);
              for (guint s2 = 0; s2 < u->stages->len; s2++)
                {
                  BwProcessUnit *st = g_ptr_array_index (u->stages, s2);
                  g_free (st->id);
                  st->id = g_strdup_printf ("t%02u-u%02u-s%u", t + 1, k + 1, s2 + 1);
                }
              g_ptr_array_add (tr->units, u);
            }
          g_ptr_array_add (big->trains, tr);
        }
      /* Each train carries 1/50 of the plant flow; scale the flows so each sees the demo's. */
      for (int f = 0; f < BW_N_FLOW_KINDS; f++)
        big->basis.flow_m3_s[f] *= 50.0 / 3.0;
      t0 = now_s ();
      if (!bw_project_save (big, tmp, &error))
        fprintf (stderr, "%s\n", error->message);
      printf ("scale: 50 trains x 20 units  save %.1f ms", (now_s () - t0) * 1e3);
      t0 = now_s ();
      {
        g_autoptr (BwProject) back = bw_project_load (tmp, &error);
        printf (", load %.1f ms", (now_s () - t0) * 1e3);
        if (back)
          {
            BwResults *r = NULL;
            GArray *ck = NULL;
            t0 = now_s ();
            r = bw_project_evaluate (back, &error);
            printf (", evaluate %.1f ms", (now_s () - t0) * 1e3);
            if (r && set)
              {
                t0 = now_s ();
                ck = bw_check_results (r, set);
                printf (", check %.1f ms (%u checks)", (now_s () - t0) * 1e3, ck->len);
                g_array_unref (ck);
              }
            if (r == NULL && error)
              printf (" [%s]", error->message);
            bw_results_free (r);
          }
        else
          printf (" [%s]", error->message);
      }
      printf ("\n");
      g_unlink (tmp);
      g_clear_error (&error);
    }
    if (set)
      {
        const char *units[] = { "north-sed", "north-rm", "north-floc", "south-floc", "east-sed" };
        for (guint i = 0; i < G_N_ELEMENTS (units); i++)
          {
            BwAutosizeResult r;
            const double t0 = now_s ();
            gboolean ok = bw_autosize (p, units[i], set, BW_OBJECTIVE_VOLUME, NULL, NULL, &r, NULL);
            printf ("autosize %-12s        %.3f s, %" G_GUINT64_FORMAT " designs, %" G_GUINT64_FORMAT
                    " evaluations%s\n", units[i], now_s () - t0, r.candidates, r.evaluations,
                    ok ? "" : " (no passing design)");
            bw_autosize_result_clear (&r);
          }
      }
  }
  return 0;
}
