/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-chart-gallery.c: writes every chart of a project to PNG files, to look at by hand.
 *   bw-chart-gallery PROJECT OUTDIR [WIDTH HEIGHT] */
#include "config.h"

#include <cairo.h>
#include <stdio.h>
#include <stdlib.h>

#include "draw/bw-chart.h"
#include "draw/bw-charts.h"
#include "engine/bw-evaluate.h"
#include "io/bw-criteria-xml.h"
#include "io/bw-project-xml.h"

static void
write_png (const BwChart *ch, const BwStyle *style, const char *dir, const char *name, int w,
           int h)
{
  cairo_surface_t *s = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, w, h);
  cairo_t *cr = cairo_create (s);
  g_autofree char *file = g_strdup_printf ("%s/%s-%s-%dx%d.png", dir, name, style->name, w, h);

  bw_chart_paint (ch, style, cr, w, h);
  cairo_destroy (cr);
  if (cairo_surface_write_to_png (s, file) != CAIRO_STATUS_SUCCESS)
    fprintf (stderr, "cannot write %s\n", file);
  else
    printf ("%s\n", file);
  cairo_surface_destroy (s);
}

int
main (int argc, char **argv)
{
  GError *error = NULL;
  g_autoptr (BwProject) p = NULL;
  g_autoptr (BwResults) r = NULL;
  g_autoptr (BwCriteriaSet) set = NULL;
  g_autoptr (GArray) checks = NULL;
  int w = argc > 4 ? atoi (argv[3]) : 1000, h = argc > 4 ? atoi (argv[4]) : 680;
  struct
  {
    const char *name;
    BwChart *chart;
  } charts[8];
  guint n = 0;

  if (argc < 3)
    {
      fprintf (stderr, "usage: %s PROJECT OUTDIR [WIDTH HEIGHT]\n", argv[0]);
      return 2;
    }
  if (!(p = bw_project_load (argv[1], &error)) || !(r = bw_project_evaluate (p, &error))
      || !(set = bw_criteria_set_open (p->criteria ? p->criteria : "textbook-ranges", &error)))
    {
      fprintf (stderr, "%s\n", error->message);
      return 1;
    }
  checks = bw_check_results (r, set);
  g_mkdir_with_parents (argv[2], 0755);

#define ADD(nm, expr)                                                                        \
  do                                                                                         \
    {                                                                                        \
      BwChart *c_ = (expr);                                                                  \
      if (!c_)                                                                               \
        {                                                                                    \
          fprintf (stderr, "%s: %s\n", nm, error->message);                                  \
          g_clear_error (&error);                                                            \
        }                                                                                    \
      else                                                                                   \
        {                                                                                    \
          charts[n].name = nm;                                                               \
          charts[n++].chart = c_;                                                            \
        }                                                                                    \
    }                                                                                        \
  while (0)

  ADD ("taper-north", bw_chart_floc_taper (p, r, checks, "north-floc", BW_UNIT_SYSTEM_SI, &error));
  ADD ("taper-south", bw_chart_floc_taper (p, r, checks, "south-floc", BW_UNIT_SYSTEM_SI, &error));
  ADD ("settling", bw_chart_settling_curves (p, r, "north-sed", 0, BW_UNIT_SYSTEM_SI, &error));
  ADD ("removal", bw_chart_removal_curves (p, r, "north-sed", BW_UNIT_SYSTEM_SI, &error));
  ADD ("impeller", bw_chart_impeller_power (p, r, checks, "north-rm", BW_UNIT_SYSTEM_SI, &error));
  ADD ("matrix-north", bw_chart_check_matrix (p, r, checks, "north", &error));
  ADD ("matrix-all", bw_chart_check_matrix (p, r, checks, NULL, &error));

  for (guint i = 0; i < n; i++)
    {
      write_png (charts[i].chart, bw_style_light (), argv[2], charts[i].name, w, h);
      write_png (charts[i].chart, bw_style_dark (), argv[2], charts[i].name, w, h);
      bw_chart_free (charts[i].chart);
    }
  return 0;
}
