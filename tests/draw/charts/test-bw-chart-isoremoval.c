/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-chart-isoremoval.c: the iso-removal chart of the demo's settling-column test: ink on the
 * canvas and inside it, the design point and an iso-removal curve where the column's numbers put
 * them, the Type II removal it reports, the error without column data, and the three file
 * formats read back. */
#include "config.h"

#include <cairo.h>
#include <glib/gstdio.h>
#include <libxml/parser.h>
#include <math.h>
#include <string.h>

#include "bw-test.h"
#include "draw/bw-chart.h"
#include "draw/bw-charts.h"
#include "draw/bw-export.h"
#include "engine/bw-error.h"
#include "engine/bw-evaluate.h"
#include "io/bw-project-xml.h"

static BwProject *demo;
static BwResults *results;

static void
demo_setup (void)
{
  GError *error = NULL;
  const char *root = g_getenv ("BW_SOURCE_ROOT");
  g_autofree char *path = g_build_filename (root ? root : ".", "data", "examples",
                                            "marrowby-demo.bwproj", NULL);

  demo = bw_project_load (path, &error);
  ck_assert_msg (demo != NULL, "%s", error ? error->message : "");
  results = bw_project_evaluate (demo, &error);
  ck_assert_msg (results != NULL, "%s", error ? error->message : "");
}

static void
demo_teardown (void)
{
  g_clear_pointer (&results, bw_results_free);
  g_clear_pointer (&demo, bw_project_free);
}

static BwChart *
build (void)
{
  g_autoptr (GError) error = NULL;
  BwChart *c = bw_chart_iso_removal (demo, results, "north-sed", BW_UNIT_SYSTEM_SI, &error);
  ck_assert_msg (c != NULL, "%s", error ? error->message : "");
  return c;
}

static cairo_surface_t *
paint_image (const BwChart *c, const BwStyle *style, int w, int h)
{
  cairo_surface_t *s = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, w, h);
  cairo_t *cr = cairo_create (s);

  bw_chart_paint (c, style, cr, w, h);
  ck_assert_int_eq (cairo_status (cr), CAIRO_STATUS_SUCCESS);
  cairo_destroy (cr);
  cairo_surface_flush (s);
  return s;
}

static void
pixel (cairo_surface_t *s, int x, int y, double rgb[3])
{
  const unsigned char *data = cairo_image_surface_get_data (s);
  const guint32 v = *(const guint32 *) (data + y * cairo_image_surface_get_stride (s) + 4 * x);
  const double a = ((v >> 24) & 0xff) / 255.0;

  /* Premultiplied ARGB32; the painter fills the paper, so alpha is 1 where it painted. */
  rgb[0] = a > 0 ? ((v >> 16) & 0xff) / 255.0 / a : 0;
  rgb[1] = a > 0 ? ((v >> 8) & 0xff) / 255.0 / a : 0;
  rgb[2] = a > 0 ? (v & 0xff) / 255.0 / a : 0;
}

/* 8-bit channels: a pixel inside a stroke or a marker reads within 2/255 of its colour; 0.03 also
 * allows a neighbour's antialiased edge, no more. */
#define COLOUR_TOL 0.03

static gboolean
colour_near (cairo_surface_t *s, double x, double y, BwRgb want)
{
  const int w = cairo_image_surface_get_width (s), h = cairo_image_surface_get_height (s);

  for (int dy = -1; dy <= 1; dy++)
    for (int dx = -1; dx <= 1; dx++)
      {
        const int px = (int) floor (x) + dx, py = (int) floor (y) + dy;
        double rgb[3];
        if (px < 0 || py < 0 || px >= w || py >= h)
          continue;
        pixel (s, px, py, rgb);
        if (MAX (fabs (rgb[0] - want.r), MAX (fabs (rgb[1] - want.g), fabs (rgb[2] - want.b)))
            <= COLOUR_TOL)
          return TRUE;
      }
  return FALSE;
}

static BwChartSeries *
series_named (const BwChart *c, const char *prefix)
{
  for (guint i = 0; i < c->series->len; i++)
    {
      BwChartSeries *s = g_ptr_array_index (c->series, i);
      if (s->label && g_str_has_prefix (s->label, prefix))
        return s;
    }
  ck_abort_msg ("no series '%s…'", prefix);
  return NULL;
}

/* The chart y of DEPTH_M (SI axis, m): categories are depths in their labels, i at value i. */
static double
depth_to_y (const BwChart *c, double depth_m)
{
  const GPtrArray *cat = c->y.categories;
  double d0, d1;

  ck_assert_ptr_nonnull (cat);
  ck_assert_uint_ge (cat->len, 2);
  d0 = g_ascii_strtod (g_ptr_array_index (cat, 0), NULL);
  d1 = g_ascii_strtod (g_ptr_array_index (cat, 1), NULL);
  ck_assert (d0 > d1); /* depth falls up the axis: the surface is at the top */
  return (depth_m - d0) / (d1 - d0);
}

static void
page_of (const BwChart *c, const BwStyle *st, double x, double y, int w, int h, double *px,
         double *py)
{
  BwChartFrame f;

  ck_assert (bw_chart_layout (c, st, NULL, w, h, &f));
  bw_chart_frame_to_page (&f, FALSE, x, y, px, py);
  ck_assert (*px > f.plot.x && *px < f.plot.x + f.plot.width);
  ck_assert (*py > f.plot.y && *py < f.plot.y + f.plot.height);
}

START_TEST (test_iso_not_blank_and_inside)
{
  const BwStyle *styles[] = { bw_style_light (), bw_style_dark () };

  for (guint k = 0; k < G_N_ELEMENTS (styles); k++)
    {
      g_autoptr (BwChart) c = build ();
      cairo_surface_t *img = paint_image (c, styles[k], 900, 600);
      cairo_surface_t *rec = cairo_recording_surface_create (CAIRO_CONTENT_COLOR_ALPHA, NULL);
      cairo_t *cr = cairo_create (rec);
      const BwRgb paper = styles[k]->paper;
      guint inked = 0;
      double x0, y0, w, h;

      for (int y = 0; y < 600; y += 2)
        for (int x = 0; x < 900; x += 2)
          {
            double rgb[3];
            pixel (img, x, y, rgb);
            inked += fabs (rgb[0] - paper.r) + fabs (rgb[1] - paper.g) + fabs (rgb[2] - paper.b) > 0.1;
          }
      /* Curves, marks, grid and text: well over 2 % of the canvas (common practice, no source). */
      ck_assert_msg (inked > 0.02 * 450 * 300, "%s: only %u inked samples", styles[k]->name, inked);
      bw_chart_paint (c, styles[k], cr, 900, 600);
      cairo_destroy (cr);
      cairo_recording_surface_ink_extents (rec, &x0, &y0, &w, &h);
      ck_assert_msg (x0 >= -0.5 && y0 >= -0.5 && x0 + w <= 900.5 && y0 + h <= 600.5,
                     "ink %.1f,%.1f %.1fx%.1f leaves the 900x600 canvas", x0, y0, w, h);
      cairo_surface_destroy (rec);
      cairo_surface_destroy (img);
    }
}
END_TEST

START_TEST (test_iso_design_point)
{
  g_autoptr (BwChart) c = build ();
  const BwStyle *st = bw_style_light ();
  BwChartSeries *s = series_named (c, "Design point");
  cairo_surface_t *img;
  double px, py;

  /* North-sed: 0.35 m3/s over 3 trains on 56 m x 2.8 m gives v0 = 7.4405e-4 m/s; the basin is
   * 4 m deep, the column's deepest port 3.0 m, so t = 3 m / v0 = 4032 s = 67.2 min (derived). */
  ck_assert_uint_eq (s->x->len, 1);
  bw_assert_rel (g_array_index (s->x, double, 0), 67.2, 1e-9);
  ck_assert_double_eq_tol (g_array_index (s->y, double, 0), depth_to_y (c, 3.0), 1e-9);
  /* Type II removal at 67.2 min over 3 m: the port profile interpolated from 60 to 90 min
   * (w = 0.24) is 0.8244, 0.7492, 0.6916, 0.6340, 0.5764, held at 0.8244 up to the surface; its
   * depth average by the trapezoid rule is 2.15976 / 3 = 0.71992 (derived by hand). */
  ck_assert_msg (strstr (s->label, "Type II removal 72 %") != NULL, "%s", s->label);
  ck_assert_msg (strstr (c->subtitle, "deepest port") != NULL, "%s", c->subtitle);
  /* The marker's colour at its mapped pixel. */
  img = paint_image (c, st, 900, 600);
  page_of (c, st, 67.2, depth_to_y (c, 3.0), 900, 600, &px, &py);
  ck_assert_msg (colour_near (img, px, py, bw_chart_colour (st, s->colour)),
                 "no design-point colour within 1 px of %.1f, %.1f", px, py);
  cairo_surface_destroy (img);
}
END_TEST

START_TEST (test_iso_curve_at_grid_point)
{
  g_autoptr (BwChart) c = build ();
  const BwStyle *st = bw_style_light ();
  BwChartSeries *first = series_named (c, "Iso-removal");
  BwChartSeries *s = NULL;
  cairo_surface_t *img;
  guint idx = 0, curves = 0;
  double px, py, t50;

  /* The curves come first, one per 10 %; 10 to 50 % are reached at every port, so the fifth is
   * 50 %. Its note says so. */
  for (guint i = 0; i < c->series->len; i++)
    if (g_ptr_array_index (c->series, i) == first)
      idx = i;
  s = g_ptr_array_index (c->series, idx + 4);
  for (guint i = 0; i < c->notes->len; i++)
    curves += g_str_has_suffix (((BwChartNote *) g_ptr_array_index (c->notes, i))->text, " %");
  /* 10-80 %: 90 % is reached only at the 0.6 m port (0.90 at 120 min), so it has no curve. */
  ck_assert_uint_eq (curves, 8);
  ck_assert_str_eq (((BwChartNote *) g_ptr_array_index (c->notes, 4))->text, "50 %");
  /* At the 1.2 m port R is 0.42 at 20 min and 0.55 at 30 min: 50 % at
   * 20 + (0.50 - 0.42) / (0.55 - 0.42) x 10 = 26.1538 min (derived, linear in time). */
  t50 = 20.0 + (0.50 - 0.42) / (0.55 - 0.42) * 10.0;
  ck_assert_uint_eq (s->x->len, 5);
  bw_assert_rel (g_array_index (s->x, double, 1), t50, 1e-12);
  ck_assert_double_eq_tol (g_array_index (s->y, double, 1), depth_to_y (c, 1.2), 1e-12);
  /* And the readings: 35 marks, one per port and time. */
  ck_assert_uint_eq (series_named (c, "Column readings")->x->len, 35);
  img = paint_image (c, st, 900, 600);
  page_of (c, st, t50, depth_to_y (c, 1.2), 900, 600, &px, &py);
  ck_assert_msg (colour_near (img, px, py, bw_chart_colour (st, s->colour)),
                 "no 50 %% curve within 1 px of %.1f, %.1f", px, py);
  cairo_surface_destroy (img);
}
END_TEST

START_TEST (test_iso_overflow_line)
{
  g_autoptr (BwChart) c = build ();
  BwChartSeries *s = series_named (c, "Overflow rate");
  double t1, y1, depth1;

  /* From the surface at t = 0 ... */
  ck_assert_double_eq_tol (g_array_index (s->x, double, 0), 0.0, 1e-12);
  ck_assert_double_eq_tol (g_array_index (s->y, double, 0), depth_to_y (c, 0.0), 1e-12);
  /* ... along depth = v0 t, v0 = 0.35 / 3 / 156.8 m/s (derived). */
  t1 = g_array_index (s->x, double, 1);
  y1 = g_array_index (s->y, double, 1);
  depth1 = 0.35 / 3.0 / 156.8 * t1 * 60.0;
  ck_assert_double_eq_tol (y1, depth_to_y (c, depth1), 1e-9);
}
END_TEST

START_TEST (test_iso_errors)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (BwChart) c = bw_chart_iso_removal (demo, results, "south-sed", BW_UNIT_SYSTEM_SI, &error);

  ck_assert_ptr_null (c);
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   "no settling-column test applies to 'south-sed'");
  g_clear_error (&error);
  c = bw_chart_iso_removal (demo, results, "north-rm", BW_UNIT_SYSTEM_SI, &error);
  ck_assert_ptr_null (c);
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "not a settling basin");
}
END_TEST

START_TEST (test_iso_us_units)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (BwChart) c = bw_chart_iso_removal (demo, results, "north-sed", BW_UNIT_SYSTEM_US, &error);

  ck_assert_msg (c != NULL, "%s", error ? error->message : "");
  ck_assert_str_eq (c->y.unit, "ft");
  /* 3.0 m = 9.8425 ft (GNU units: 3 m -> ft). */
  ck_assert_double_eq_tol (g_array_index (series_named (c, "Design point")->y, double, 0),
                           depth_to_y (c, 3.0 / 0.3048), 1e-9);
}
END_TEST

START_TEST (test_iso_files)
{
  g_autoptr (BwChart) c = build ();
  g_autofree char *dir = g_dir_make_tmp ("bw-iso-XXXXXX", NULL);
  const BwExportFormat formats[] = { BW_EXPORT_PNG, BW_EXPORT_SVG, BW_EXPORT_PDF };
  const char *names[] = { "iso.png", "iso.svg", "iso.pdf" };

  ck_assert_ptr_nonnull (dir);
  for (guint i = 0; i < G_N_ELEMENTS (formats); i++)
    {
      g_autofree char *path = g_build_filename (dir, names[i], NULL);
      g_autoptr (GError) error = NULL;
      g_autofree char *data = NULL;
      gsize len = 0;

      ck_assert_msg (bw_export_chart (c, bw_style_light (), formats[i], path, 800, 500, &error), "%s: %s",
                     names[i], error ? error->message : "");
      ck_assert (g_file_get_contents (path, &data, &len, NULL));
      if (formats[i] == BW_EXPORT_PNG)
        {
          cairo_surface_t *s = cairo_image_surface_create_from_png (path);
          ck_assert_int_eq (cairo_surface_status (s), CAIRO_STATUS_SUCCESS);
          ck_assert_int_eq (cairo_image_surface_get_width (s), 800);
          ck_assert_int_eq (cairo_image_surface_get_height (s), 500);
          cairo_surface_destroy (s);
        }
      else if (formats[i] == BW_EXPORT_SVG)
        {
          xmlDoc *doc = xmlReadMemory (data, (int) len, "iso.svg", NULL, XML_PARSE_NONET | XML_PARSE_NOERROR
                                       | XML_PARSE_NOWARNING | XML_PARSE_HUGE);
          ck_assert_ptr_nonnull (doc);
          ck_assert_str_eq ((const char *) xmlDocGetRootElement (doc)->name, "svg");
          xmlFreeDoc (doc);
        }
      else
        {
          ck_assert (len > 8 && memcmp (data, "%PDF-", 5) == 0);
          /* The trailer ends the file (binary streams before it may hold NUL bytes). */
          {
            gboolean eof = FALSE;
            for (gsize k = len > 32 ? len - 32 : 0; k + 5 <= len && !eof; k++)
              eof = memcmp (data + k, "%%EOF", 5) == 0;
            ck_assert_msg (eof, "iso.pdf: no %%%%EOF trailer");
          }
        }
      g_unlink (path);
    }
  g_rmdir (dir);
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("chart-isoremoval");
  TCase *tc = tcase_create ("iso-removal");

  tcase_add_checked_fixture (tc, demo_setup, demo_teardown);
  tcase_add_test (tc, test_iso_not_blank_and_inside);
  tcase_add_test (tc, test_iso_design_point);
  tcase_add_test (tc, test_iso_curve_at_grid_point);
  tcase_add_test (tc, test_iso_overflow_line);
  tcase_add_test (tc, test_iso_errors);
  tcase_add_test (tc, test_iso_us_units);
  tcase_add_test (tc, test_iso_files);
  suite_add_tcase (s, tc);
  return s;
}
