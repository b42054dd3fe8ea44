/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bench-draw.c: time to paint each view and each chart of a project at 1600 x 1000 (run by hand;
 * prints figures, asserts nothing about speed).   bench-draw [PROJECT] */
#include "config.h"

#include <cairo.h>
#include <stdio.h>
#include <stdlib.h>
#include <time.h>

#include <glib/gstdio.h>

#include "draw/bw-charts.h"
#include "draw/bw-report.h"
#include "draw/bw-chart.h"
#include "draw/bw-sketch.h"
#include "draw/bw-style.h"
#include "engine/bw-evaluate.h"
#include "io/bw-criteria-xml.h"
#include "io/bw-project-xml.h"

#define W 1600
#define H 1000
#define RUNS 15

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

static void
report (const char *what, double *t)
{
  qsort (t, RUNS, sizeof (double), cmp_double);
  printf ("  %-44s median %7.2f ms   (min %7.2f)\n", what, t[RUNS / 2] * 1e3, t[0] * 1e3);
}

static void
bench_sketch (const BwProject *p, const BwProcessUnit *u, BwSketchView view, const BwStyle *style)
{
  double t[RUNS];
  g_autofree char *what = g_strdup_printf ("%s %s", u->id, bw_sketch_view_name (view));

  for (int i = 0; i < RUNS; i++)
    {
      cairo_surface_t *s = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, W, H);
      cairo_t *cr = cairo_create (s);
      const double t0 = now_s ();
      gboolean ok = bw_sketch_paint (p, u, view, BW_UNIT_SYSTEM_SI, style, cr, W, H, NULL);
      cairo_surface_flush (s);
      t[i] = now_s () - t0;
      cairo_destroy (cr);
      cairo_surface_destroy (s);
      if (!ok)
        return;
    }
  report (what, t);
}

static void
bench_chart (const char *what, BwChart *chart, const BwStyle *style)
{
  double t[RUNS];

  if (chart == NULL)
    return;
  for (int i = 0; i < RUNS; i++)
    {
      cairo_surface_t *s = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, W, H);
      cairo_t *cr = cairo_create (s);
      const double t0 = now_s ();
      bw_chart_paint (chart, style, cr, W, H);
      cairo_surface_flush (s);
      t[i] = now_s () - t0;
      cairo_destroy (cr);
      cairo_surface_destroy (s);
    }
  report (what, t);
  bw_chart_free (chart);
}

int
main (int argc, char **argv)
{
  const char *path = argc > 1 ? argv[1] : BW_SOURCE_DATADIR "/examples/marrowby-demo.bwproj";
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) p = bw_project_load (path, &error);
  g_autoptr (BwResults) r = NULL;
  g_autoptr (BwCriteriaSet) set = NULL;
  g_autoptr (GArray) checks = NULL;
  const BwStyle *style = bw_style_light ();

  if (p == NULL)
    {
      fprintf (stderr, "%s\n", error->message);
      return 1;
    }
  r = bw_project_evaluate (p, NULL);
  set = bw_criteria_set_open (p->criteria ? p->criteria : "textbook-ranges", NULL);
  checks = set && r ? bw_check_results (r, set) : NULL;
  printf ("basinwright %s drawing benchmark, %d x %d, median of %d (run by hand; figures only)\n",
          PACKAGE_VERSION, W, H, RUNS);
  for (guint i = 0; i < p->trains->len; i++)
    {
      const BwTrain *t = g_ptr_array_index (p->trains, i);
      for (guint k = 0; k < t->units->len; k++)
        {
          const BwProcessUnit *u = g_ptr_array_index (t->units, k);
          const char *views[] = { "plan", "section", "schematic" };
          for (guint v = 0; v < G_N_ELEMENTS (views); v++)
            {
              BwSketchView view;
              if (bw_sketch_view_from_name (views[v], &view) && bw_sketch_supports (u->type, view))
                bench_sketch (p, u, view, style);
            }
        }
    }
  if (r)
    {
      bench_chart ("chart: north-floc taper", bw_chart_floc_taper (p, r, checks, "north-floc", BW_UNIT_SYSTEM_SI, NULL), style);
      bench_chart ("chart: north-sed settling curves", bw_chart_settling_curves (p, r, "north-sed", 0, BW_UNIT_SYSTEM_SI, NULL), style);
      bench_chart ("chart: north-sed removal", bw_chart_removal_curves (p, r, "north-sed", BW_UNIT_SYSTEM_SI, NULL), style);
      bench_chart ("chart: north-rm impeller power", bw_chart_impeller_power (p, r, checks, "north-rm", BW_UNIT_SYSTEM_SI, NULL), style);
      if (checks)
        bench_chart ("chart: check matrix", bw_chart_check_matrix (p, r, checks, NULL, NULL), style);
      if (checks && set)
        {
          /* The whole submittal report, written to a scratch file. */
          g_autofree char *tmp = g_build_filename (g_get_tmp_dir (), "bw-bench-report.pdf", NULL);
          double t[3];
          for (int i = 0; i < 3; i++)
            {
              const double t0 = now_s ();
              bw_report_write_pdf (p, r, checks, set, BW_REPORT_PAPER_A4, BW_UNIT_SYSTEM_SI, tmp, NULL);
              t[i] = now_s () - t0;
            }
          qsort (t, 3, sizeof (double), cmp_double);
          printf ("  %-44s median %7.2f ms\n", "submittal report (PDF, every page)", t[1] * 1e3);
          g_unlink (tmp);
        }
    }
  return 0;
}
