/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-chart-jartest.c: the jar-test chart of the demo project: not blank in either preset,
 * ink inside the canvas, the chosen dose's line in its colour at the x pixel its axis gives, the
 * engine's numbers carried over, and an unknown record refused by name. */
#include "config.h"

#include <cairo.h>
#include <string.h>

#include "bw-test.h"
#include "draw/bw-chart-jartest.h"
#include "engine/bw-error.h"
#include "io/bw-project-xml.h"

static BwProject *demo;

static void
demo_setup (void)
{
  GError *error = NULL;
  const char *root = g_getenv ("BW_SOURCE_ROOT");
  g_autofree char *path = g_build_filename (root ? root : ".", "data", "examples",
                                            "marrowby-demo.bwproj", NULL);

  demo = bw_project_load (path, &error);
  ck_assert_msg (demo != NULL, "%s", error ? error->message : "");
}

static void
demo_teardown (void)
{
  g_clear_pointer (&demo, bw_project_free);
}

static BwChart *
build (double target)
{
  GError *error = NULL;
  BwChart *c = bw_chart_jartest_of_project (demo, "jt-2026-11", target, BW_UNIT_SYSTEM_SI, &error);

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
  const int stride = cairo_image_surface_get_stride (s);
  guint32 v = *(const guint32 *) (data + y * stride + 4 * x);
  const double a = ((v >> 24) & 0xff) / 255.0;

  rgb[0] = a > 0 ? ((v >> 16) & 0xff) / 255.0 / a : 0;
  rgb[1] = a > 0 ? ((v >> 8) & 0xff) / 255.0 / a : 0;
  rgb[2] = a > 0 ? (v & 0xff) / 255.0 / a : 0;
}

static double
rgb_distance (const double a[3], BwRgb b)
{
  return MAX (fabs (a[0] - b.r), MAX (fabs (a[1] - b.g), fabs (a[2] - b.b)));
}

static BwChartRule *
vertical_rule (const BwChart *c)
{
  for (guint i = 0; i < c->rules->len; i++)
    {
      BwChartRule *r = g_ptr_array_index (c->rules, i);
      if (r->vertical)
        return r;
    }
  ck_abort_msg ("no vertical rule");
  return NULL;
}

START_TEST (test_jartest_not_blank)
{
  const BwStyle *styles[] = { bw_style_light (), bw_style_dark () };

  for (guint k = 0; k < G_N_ELEMENTS (styles); k++)
    {
      g_autoptr (BwChart) c = build (2.0);
      cairo_surface_t *s = paint_image (c, styles[k], 800, 560);
      guint inked = 0, total = 0;
      for (int y = 0; y < 560; y += 2)
        for (int x = 0; x < 800; x += 2)
          {
            double rgb[3];
            pixel (s, x, y, rgb);
            inked += rgb_distance (rgb, styles[k]->paper) > 0.05;
            total++;
          }
      /* Bands, curves, grid and text cover well over 5 % (about 40 % here, with the bands); an
       * empty frame with titles stays below 2 % (common practice, no source). */
      ck_assert_msg (inked > total * 0.05, "%s: only %u of %u pixels inked", styles[k]->name,
                     inked, total);
      cairo_surface_destroy (s);
    }
}
END_TEST

START_TEST (test_jartest_ink_inside_canvas)
{
  const double sizes[][2] = { { 400, 300 }, { 800, 560 }, { 2400, 1500 } };

  for (guint k = 0; k < G_N_ELEMENTS (sizes); k++)
    {
      g_autoptr (BwChart) c = build (2.0);
      cairo_surface_t *rec = cairo_recording_surface_create (CAIRO_CONTENT_COLOR_ALPHA, NULL);
      cairo_t *cr = cairo_create (rec);
      const double w = sizes[k][0], h = sizes[k][1];
      double x0, y0, iw, ih;

      c->transparent = TRUE;
      bw_chart_paint (c, bw_style_light (), cr, w, h);
      ck_assert_int_eq (cairo_status (cr), CAIRO_STATUS_SUCCESS);
      cairo_destroy (cr);
      cairo_recording_surface_ink_extents (rec, &x0, &y0, &iw, &ih);
      /* Half a unit of slack: antialiasing at the canvas edge. */
      ck_assert_msg (x0 >= -0.5 && y0 >= -0.5 && x0 + iw <= w + 0.5 && y0 + ih <= h + 0.5,
                     "at %gx%g: ink %g,%g %gx%g spills off the canvas", w, h, x0, y0, iw, ih);
      ck_assert_msg (iw > 0.8 * w && ih > 0.8 * h, "at %gx%g: ink only %gx%g", w, h, iw, ih);
      cairo_surface_destroy (rec);
    }
}
END_TEST

/* The chosen dose's line: at the x pixel the axis puts 30 mg/L, in the chosen colour, halfway
 * down the plot, on both presets. */
START_TEST (test_jartest_chosen_line_at_its_pixel)
{
  const BwStyle *styles[] = { bw_style_light (), bw_style_dark () };

  for (guint k = 0; k < G_N_ELEMENTS (styles); k++)
    {
      g_autoptr (BwChart) c = build (-1);
      BwChartRule *rule = vertical_rule (c);
      /* Large enough (scale about 2.2) that the 1.4-unit line covers whole pixels, so their
       * colour is the rule's, not a blend with the bands under it. */
      cairo_surface_t *img = paint_image (c, styles[k], 1800, 1200);
      cairo_t *cr = cairo_create (img);
      const BwRgb want = bw_chart_colour (styles[k], BW_JARTEST_C_CHOSEN);
      BwChartFrame f;
      double px, best = 1;
      int found_x = -1;

      /* 30 mg/L: the demo's design dose (data/examples/marrowby-demo.bwproj). */
      ck_assert_double_eq_tol (rule->value, 30.0, 1e-9);
      ck_assert (bw_chart_layout (c, styles[k], cr, 1800, 1200, &f));
      cairo_destroy (cr);
      px = bw_axis_to_page (&f.x, rule->value, f.plot.x, f.plot.x + f.plot.width);
      ck_assert (px > f.plot.x && px < f.plot.x + f.plot.width);
      /* Below the label at the top, between the curves: the nearest pixel of the rule's colour
       * along that row lies within 1 px of the computed x. */
      {
        const int y = (int) (f.plot.y + 0.55 * f.plot.height);
        for (int x = (int) px - 6; x <= (int) px + 6; x++)
          {
            double rgb[3];
            pixel (img, x, y, rgb);
            if (rgb_distance (rgb, want) < best)
              {
                best = rgb_distance (rgb, want);
                found_x = x;
              }
          }
      }
      /* 0.03: 8-bit channels and antialiasing at a 1-2 px line (common practice, no source). */
      ck_assert_msg (best <= 0.03, "%s: no pixel of the chosen colour near x = %.1f (best %.3f)",
                     styles[k]->name, px, best);
      ck_assert_msg (fabs (found_x + 0.5 - px) <= 1.5, "%s: line at %d, axis says %.1f",
                     styles[k]->name, found_x, px);
      cairo_surface_destroy (img);
    }
}
END_TEST

/* The chart carries the engine's numbers: the jars as given, the curve through them, the optimum
 * at the clearest jar, the window from bw_jar_analyse, the target dose in its label. */
START_TEST (test_jartest_values)
{
  g_autoptr (BwChart) c = build (2.0);
  const BwJarTestRecord *r = bw_chart_jartest_find_record (demo, "jt-2026-11");
  BwJarSeries s = r->series;
  BwJarResult res;
  BwChartSeries *jars = NULL, *curve = NULL, *zeta = NULL;
  gboolean window = FALSE;

  ck_assert (bw_jar_series_prepare (&s, NULL));
  ck_assert (bw_jar_analyse (&s, 2.0, BW_ZETA_DESTABILISED_DEFAULT_V, &res, NULL));
  for (guint i = 0; i < c->series->len; i++)
    {
      BwChartSeries *x = g_ptr_array_index (c->series, i);
      if (g_str_has_prefix (x->label, "Settled"))
        jars = x;
      else if (g_str_has_prefix (x->label, "Smooth"))
        curve = x;
      else if (g_str_has_prefix (x->label, "Zeta"))
        zeta = x;
    }
  ck_assert (jars && curve && zeta && zeta->y2 && c->has_y2);
  ck_assert_uint_eq (jars->x->len, 6); /* six jars in the demo file */
  /* Jar 4: 40 mg/L, 1.2 NTU, -1 mV (the demo file). */
  ck_assert_double_eq_tol (g_array_index (jars->x, double, 3), 40.0, 1e-9);
  ck_assert_double_eq_tol (g_array_index (jars->y, double, 3), 1.2, 1e-12);
  ck_assert_double_eq_tol (g_array_index (zeta->y, double, 3), -1.0, 1e-9);
  ck_assert_uint_eq (curve->x->len, BW_JARTEST_CURVE_POINTS);
  for (guint i = 0; i < curve->x->len; i++)
    ck_assert_double_eq_tol (g_array_index (curve->y, double, i),
                             bw_jar_curve (&s, g_array_index (curve->x, double, i) * 1e-3), 1e-12);
  for (guint i = 0; i < c->bands->len; i++)
    {
      const BwChartBand *b = g_ptr_array_index (c->bands, i);
      if (b->vertical && b->colour == BW_JARTEST_C_WINDOW)
        {
          /* derived: bw_jar_analyse on the same series */
          ck_assert_double_eq_tol (b->from, res.window_low_kg_m3 * 1e3, 1e-9);
          ck_assert_double_eq_tol (b->to, res.window_high_kg_m3 * 1e3, 1e-9);
          window = TRUE;
        }
    }
  ck_assert (window);
  ck_assert (res.has_target);
  {
    gboolean target = FALSE, optimum = FALSE;
    for (guint i = 0; i < c->rules->len; i++)
      {
        const BwChartRule *rule = g_ptr_array_index (c->rules, i);
        if (!rule->vertical && rule->label && g_str_has_prefix (rule->label, "target"))
          target = rule->value == 2.0 && strstr (rule->label, "reached at") != NULL;
      }
    for (guint i = 0; i < c->notes->len; i++)
      {
        const BwChartNote *n = g_ptr_array_index (c->notes, i);
        optimum = optimum || (fabs (n->x - 40.0) < 1e-9 && strstr (n->text, "optimum 40.00 mg/L"));
      }
    ck_assert (target && optimum);
  }
}
END_TEST

START_TEST (test_jartest_errors)
{
  g_autoptr (GError) error = NULL;
  BwJarTestRecord *r = bw_jar_test_record_new ("short", "two jars");
  BwChart *c = bw_chart_jartest_of_project (demo, "nope", -1, BW_UNIT_SYSTEM_SI, &error);

  ck_assert_ptr_null (c);
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "'nope'");
  g_clear_error (&error);
  /* Two jars are too few for a curve: the engine's reason, with the record's id. */
  r->series.n_jars = 2;
  r->series.jars[0].dose_kg_m3 = 0.01;
  r->series.jars[0].turbidity_NTU = 5;
  r->series.jars[1].dose_kg_m3 = 0.02;
  r->series.jars[1].turbidity_NTU = 3;
  c = bw_chart_jartest (r, NULL, BW_UNIT_SYSTEM_SI, &error);
  ck_assert_ptr_null (c);
  ck_assert_msg (error && strstr (error->message, "jar test short"), "%s", error ? error->message : "");
  bw_jar_test_record_free (r);
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("jar-test chart");
  TCase *tc = tcase_create ("chart");

  tcase_add_checked_fixture (tc, demo_setup, demo_teardown);
  tcase_add_test (tc, test_jartest_not_blank);
  tcase_add_test (tc, test_jartest_ink_inside_canvas);
  tcase_add_test (tc, test_jartest_chosen_line_at_its_pixel);
  tcase_add_test (tc, test_jartest_values);
  tcase_add_test (tc, test_jartest_errors);
  suite_add_tcase (s, tc);
  return s;
}
