/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-chart.c: every chart of the demo project painted on image and recording surfaces:
 * ink inside the canvas, data where the axes say, a legend clear of the data, both presets,
 * thumbnail to poster sizes, the hit-test, and builders that carry the engine's numbers. */
#include "config.h"

#include <cairo.h>
#include <string.h>

#include "bw-test.h"
#include "draw/bw-chart.h"
#include "draw/bw-charts.h"
#include "engine/bw-error.h"
#include "engine/bw-evaluate.h"
#include "engine/bw-mixing.h"
#include "engine/bw-settling.h"
#include "io/bw-criteria-xml.h"
#include "io/bw-project-xml.h"

/* The demo project, its results and checks, loaded once per test (Check forks each). */
static BwProject *demo;
static BwResults *results;
static BwCriteriaSet *criteria;
static GArray *checks;

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
  criteria = bw_criteria_set_open (demo->criteria, &error);
  ck_assert_msg (criteria != NULL, "%s", error ? error->message : "");
  checks = bw_check_results (results, criteria);
}

static void
demo_teardown (void)
{
  g_clear_pointer (&checks, g_array_unref);
  g_clear_pointer (&criteria, bw_criteria_set_free);
  g_clear_pointer (&results, bw_results_free);
  g_clear_pointer (&demo, bw_project_free);
}

enum
{
  CH_TAPER_NORTH,
  CH_TAPER_SOUTH,
  CH_SETTLING,
  CH_REMOVAL,
  CH_IMPELLER,
  CH_MATRIX,
  N_CHARTS
};

static BwChart *
build (int which)
{
  GError *error = NULL;
  BwChart *c = NULL;

  switch (which)
    {
    case CH_TAPER_NORTH:
      c = bw_chart_floc_taper (demo, results, checks, "north-floc", BW_UNIT_SYSTEM_SI, &error);
      break;
    case CH_TAPER_SOUTH:
      c = bw_chart_floc_taper (demo, results, checks, "south-floc", BW_UNIT_SYSTEM_SI, &error);
      break;
    case CH_SETTLING:
      c = bw_chart_settling_curves (demo, results, "north-sed", 0, BW_UNIT_SYSTEM_SI, &error);
      break;
    case CH_REMOVAL:
      c = bw_chart_removal_curves (demo, results, "south-sed", BW_UNIT_SYSTEM_SI, &error);
      break;
    case CH_IMPELLER:
      c = bw_chart_impeller_power (demo, results, checks, "north-rm", BW_UNIT_SYSTEM_SI, &error);
      break;
    case CH_MATRIX:
      c = bw_chart_check_matrix (demo, results, checks, "north", &error);
      break;
    default:
      g_assert_not_reached ();
    }
  ck_assert_msg (c != NULL, "chart %d: %s", which, error ? error->message : "");
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
  ck_assert_int_eq (cairo_surface_status (s), CAIRO_STATUS_SUCCESS);
  return s;
}

static void
pixel (cairo_surface_t *s, int x, int y, double rgb[3])
{
  const unsigned char *data = cairo_image_surface_get_data (s);
  const int stride = cairo_image_surface_get_stride (s);
  guint32 v = *(const guint32 *) (data + y * stride + 4 * x);
  const double a = ((v >> 24) & 0xff) / 255.0;

  /* Premultiplied ARGB32; the painter fills the paper, so alpha is 1 wherever it painted. */
  rgb[0] = a > 0 ? ((v >> 16) & 0xff) / 255.0 / a : 0;
  rgb[1] = a > 0 ? ((v >> 8) & 0xff) / 255.0 / a : 0;
  rgb[2] = a > 0 ? (v & 0xff) / 255.0 / a : 0;
}

static double
rgb_distance (const double a[3], BwRgb b)
{
  return MAX (fabs (a[0] - b.r), MAX (fabs (a[1] - b.g), fabs (a[2] - b.b)));
}

/* 8-bit channels and antialiasing at the edge of a shape: a pixel inside one reads within 2/255
 * of its colour; 0.03 also allows the paper rim of a marker's neighbour, no more. */
#define COLOUR_TOL 0.03

/* TRUE when some pixel within +-1 px of (X, Y) has colour WANT. */
static gboolean
colour_near (cairo_surface_t *s, double x, double y, BwRgb want)
{
  const int w = cairo_image_surface_get_width (s), h = cairo_image_surface_get_height (s);
  const int cx = (int) floor (x), cy = (int) floor (y);

  for (int dy = -1; dy <= 1; dy++)
    for (int dx = -1; dx <= 1; dx++)
      {
        double rgb[3];
        if (cx + dx < 0 || cy + dy < 0 || cx + dx >= w || cy + dy >= h)
          continue;
        pixel (s, cx + dx, cy + dy, rgb);
        if (rgb_distance (rgb, want) <= COLOUR_TOL)
          return TRUE;
      }
  return FALSE;
}

/* The centroid of the pixels of colour WANT within +-R px of (X, Y); FALSE when there are none. */
static gboolean
colour_centroid (cairo_surface_t *s, double x, double y, int r, BwRgb want, double *cx,
                 double *cy)
{
  const int w = cairo_image_surface_get_width (s), h = cairo_image_surface_get_height (s);
  double sx = 0, sy = 0;
  guint n = 0;

  for (int py = (int) floor (y) - r; py <= (int) floor (y) + r; py++)
    for (int px = (int) floor (x) - r; px <= (int) floor (x) + r; px++)
      {
        double rgb[3];
        if (px < 0 || py < 0 || px >= w || py >= h)
          continue;
        pixel (s, px, py, rgb);
        if (rgb_distance (rgb, want) <= COLOUR_TOL)
          {
            sx += px + 0.5; /* pixel centres */
            sy += py + 0.5;
            n++;
          }
      }
  if (n == 0)
    return FALSE;
  *cx = sx / n;
  *cy = sy / n;
  return TRUE;
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

/* --- painting --- */

/* Every chart, both presets: a good share of the canvas carries ink that is not paper. */
START_TEST (test_chart_not_blank)
{
  const BwStyle *styles[] = { bw_style_light (), bw_style_dark () };

  for (int which = 0; which < N_CHARTS; which++)
    for (guint k = 0; k < G_N_ELEMENTS (styles); k++)
      {
        g_autoptr (BwChart) c = build (which);
        cairo_surface_t *s = paint_image (c, styles[k], 800, 560);
        guint inked = 0, total = 0;
        double corner[3];
        for (int y = 0; y < 560; y += 2)
          for (int x = 0; x < 800; x += 2)
            {
              double rgb[3];
              pixel (s, x, y, rgb);
              inked += rgb_distance (rgb, styles[k]->paper) > 0.05;
              total++;
            }
        /* The corner is paper: the painter fills the whole canvas. */
        pixel (s, 0, 0, corner);
        ck_assert_double_le (rgb_distance (corner, styles[k]->paper), 1.0 / 255);
        /* Text, grid and data cover well over 3 % of any of these charts (the sparsest, the
         * removal curves, is about 10 %); an empty frame with titles stays below 2 %. */
        ck_assert_msg (inked > total * 0.03, "chart %d (%s): only %u of %u pixels inked", which,
                       styles[k]->name, inked, total);
        cairo_surface_destroy (s);
      }
}
END_TEST

/* On an unbounded recording surface, nothing the painter draws (text included) leaves the
 * canvas, at a thumbnail, the reference size and a poster; and the drawing fills most of it. */
START_TEST (test_chart_ink_inside_canvas)
{
  const double sizes[][2] = { { 400, 300 }, { 800, 560 }, { 3000, 2000 }, { 1200, 400 } };

  for (int which = 0; which < N_CHARTS; which++)
    for (guint k = 0; k < G_N_ELEMENTS (sizes); k++)
      {
        g_autoptr (BwChart) c = build (which);
        cairo_surface_t *rec = cairo_recording_surface_create (CAIRO_CONTENT_COLOR_ALPHA, NULL);
        cairo_t *cr = cairo_create (rec);
        const double w = sizes[k][0], h = sizes[k][1];
        double x0, y0, iw, ih;

        c->transparent = TRUE; /* so the ink is what was drawn, not the paper */
        bw_chart_paint (c, bw_style_light (), cr, w, h);
        ck_assert_int_eq (cairo_status (cr), CAIRO_STATUS_SUCCESS);
        cairo_destroy (cr);
        cairo_recording_surface_ink_extents (rec, &x0, &y0, &iw, &ih);
        /* Half a unit of slack: antialiasing of a line on the canvas edge. */
        ck_assert_msg (x0 >= -0.5 && y0 >= -0.5 && x0 + iw <= w + 0.5 && y0 + ih <= h + 0.5,
                       "chart %d at %gx%g: ink %g,%g %gx%g spills off the canvas", which, w, h,
                       x0, y0, iw, ih);
        ck_assert_msg (iw > 0.8 * w && ih > 0.8 * h, "chart %d at %gx%g: ink only %gx%g",
                       which, w, h, iw, ih);
        cairo_surface_destroy (rec);
      }
}
END_TEST

/* A data point lands on the pixel the axis mapping predicts, in its series' colour: a marker
 * on a categorical axis (the taper), a line on log-log axes (settling), a marker on linear axes
 * (the removal chart's load cases), on both presets. */
START_TEST (test_chart_point_at_mapped_pixel)
{
  const BwStyle *styles[] = { bw_style_light (), bw_style_dark () };
  struct
  {
    int chart;
    const char *series;
    guint index;
  } cases[] = {
    { CH_TAPER_NORTH, "G at 2", 1 },
    { CH_SETTLING, "Water at 2", 30 },
    { CH_SETTLING, "Water at 24", 70 },
    { CH_REMOVAL, "Load cases", 3 },
    { CH_IMPELLER, "Power at 2", 60 },
  };

  for (guint k = 0; k < G_N_ELEMENTS (styles); k++)
    for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
      {
        g_autoptr (BwChart) c = build (cases[i].chart);
        BwChartSeries *s = series_named (c, cases[i].series);
        cairo_surface_t *img = paint_image (c, styles[k], 900, 600);
        cairo_t *cr = cairo_create (img);
        BwChartFrame f;
        double x, y, px, py;

        ck_assert (bw_chart_layout (c, styles[k], cr, 900, 600, &f));
        cairo_destroy (cr);
        ck_assert_uint_lt (cases[i].index, s->x->len);
        x = g_array_index (s->x, double, cases[i].index);
        y = g_array_index (s->y, double, cases[i].index);
        /* The mapping straight from the axes, not through bw_chart_frame_to_page. */
        px = bw_axis_to_page (&f.x, x, f.plot.x, f.plot.x + f.plot.width);
        py = bw_axis_to_page (s->y2 ? &f.y2 : &f.y, y, f.plot.y + f.plot.height, f.plot.y);
        ck_assert (px > f.plot.x && px < f.plot.x + f.plot.width);
        ck_assert (py > f.plot.y && py < f.plot.y + f.plot.height);
        ck_assert_msg (colour_near (img, px, py, bw_chart_colour (styles[k], s->colour)),
                       "%s[%u] (%s): no pixel of its colour within 1 px of %.1f, %.1f",
                       cases[i].series, cases[i].index, styles[k]->name, px, py);
        if (s->marker != BW_MARKER_NONE)
          {
            /* A marker is centred on the point: the centroid of its colour within its own
             * radius (3.6 x the scale, about 4 px here) is within 1 px of the mapped point. */
            double mx, my;
            ck_assert (colour_centroid (img, px, py, 4, bw_chart_colour (styles[k], s->colour),
                                        &mx, &my));
            ck_assert_msg (fabs (mx - px) <= 1.0 && fabs (my - py) <= 1.0,
                           "%s[%u] (%s): marker centred at %.2f, %.2f, mapped to %.2f, %.2f",
                           cases[i].series, cases[i].index, styles[k]->name, mx, my, px, py);
          }
        cairo_surface_destroy (img);
      }
}
END_TEST

/* The legend covers no data point (nor any line between two) at any size. */
START_TEST (test_chart_legend_clear_of_data)
{
  const double sizes[][2] = { { 400, 300 }, { 800, 560 }, { 3000, 2000 } };

  for (int which = 0; which < N_CHARTS; which++)
    for (guint k = 0; k < G_N_ELEMENTS (sizes); k++)
      {
        g_autoptr (BwChart) c = build (which);
        BwChartFrame f;
        if (c->kind != BW_CHART_XY)
          continue;
        ck_assert (bw_chart_layout (c, bw_style_light (), NULL, sizes[k][0], sizes[k][1], &f));
        ck_assert (f.has_legend);
        ck_assert_msg (f.legend_clear, "chart %d at %gx%g: legend not clear", which,
                       sizes[k][0], sizes[k][1]);
        ck_assert (f.legend.x >= 0 && f.legend.y >= 0
                   && f.legend.x + f.legend.width <= sizes[k][0]
                   && f.legend.y + f.legend.height <= sizes[k][1]);
        for (guint i = 0; i < c->series->len; i++)
          {
            const BwChartSeries *s = g_ptr_array_index (c->series, i);
            for (guint j = 0; j < s->x->len; j++)
              {
                double px, py;
                bw_chart_frame_to_page (&f, s->y2, g_array_index (s->x, double, j),
                                        g_array_index (s->y, double, j), &px, &py);
                ck_assert_msg (!(px > f.legend.x && px < f.legend.x + f.legend.width
                                 && py > f.legend.y && py < f.legend.y + f.legend.height),
                               "chart %d at %gx%g: point %u of '%s' under the legend", which,
                               sizes[k][0], sizes[k][1], j, s->label ? s->label : "");
              }
          }
      }
}
END_TEST

/* A legend that cannot find a clear corner moves outside the plot rather than cover data. */
START_TEST (test_chart_legend_moves_out)
{
  g_autoptr (BwChart) c = bw_chart_new (BW_CHART_XY, "Dense");
  BwChartSeries *s;
  BwChartFrame f;

  bw_chart_axis_set (&c->x, BW_AXIS_LINEAR, "x", NULL);
  bw_chart_axis_set (&c->y, BW_AXIS_LINEAR, "y", NULL);
  s = bw_chart_add_series (c, "everywhere", BW_SERIES_LINE, 0, BW_MARKER_CIRCLE, BW_DASH_SOLID,
                           FALSE);
  for (int i = 0; i <= 40; i++)
    for (int j = 0; j <= 40; j++)
      bw_chart_series_add (s, i, j);
  ck_assert (bw_chart_layout (c, bw_style_light (), NULL, 800, 560, &f));
  ck_assert (f.has_legend);
  ck_assert (f.legend_clear);
  ck_assert (f.legend.x >= f.plot.x + f.plot.width || f.legend.y >= f.plot.y + f.plot.height);
}
END_TEST

/* Light and dark both draw, each on its own paper, and differently. */
START_TEST (test_chart_light_and_dark)
{
  for (int which = 0; which < N_CHARTS; which++)
    {
      g_autoptr (BwChart) c = build (which);
      cairo_surface_t *a = paint_image (c, bw_style_light (), 500, 350);
      cairo_surface_t *b = paint_image (c, bw_style_dark (), 500, 350);
      double pa[3], pb[3];
      guint differ = 0;

      pixel (a, 2, 348, pa);
      pixel (b, 2, 348, pb);
      ck_assert_double_le (rgb_distance (pa, bw_style_light ()->paper), 1.0 / 255);
      ck_assert_double_le (rgb_distance (pb, bw_style_dark ()->paper), 1.0 / 255);
      for (int y = 0; y < 350; y += 5)
        for (int x = 0; x < 500; x += 5)
          {
            pixel (a, x, y, pa);
            pixel (b, x, y, pb);
            differ += MAX (fabs (pa[0] - pb[0]), fabs (pa[1] - pb[1])) > 0.2;
          }
      ck_assert_uint_gt (differ, 500u);
      cairo_surface_destroy (a);
      cairo_surface_destroy (b);
    }
}
END_TEST

/* Thumbnail and poster: the painter succeeds, lays out, and keeps the tick labels apart
 * (no two x labels closer than their own width allows). */
START_TEST (test_chart_extreme_sizes)
{
  const double sizes[][2] = { { 400, 300 }, { 3000, 2000 } };

  for (int which = 0; which < N_CHARTS; which++)
    for (guint k = 0; k < G_N_ELEMENTS (sizes); k++)
      {
        g_autoptr (BwChart) c = build (which);
        cairo_surface_t *img = paint_image (c, bw_style_light (), (int) sizes[k][0],
                                            (int) sizes[k][1]);
        BwChartFrame f;
        ck_assert (bw_chart_layout (c, bw_style_light (), NULL, sizes[k][0], sizes[k][1], &f));
        ck_assert (f.plot.width > 0.35 * sizes[k][0] && f.plot.height > 0.35 * sizes[k][1]);
        if (c->kind == BW_CHART_XY)
          {
            ck_assert_uint_ge (f.x.n_major, 2);
            ck_assert_uint_le (f.x.n_major, 12);
            ck_assert_uint_ge (f.y.n_major, 2);
          }
        else
          {
            /* The north train's 14 checks fit even the thumbnail. */
            ck_assert_uint_eq (f.rows_shown, c->matrix.n_rows);
          }
        cairo_surface_destroy (img);
      }
}
END_TEST

/* --- hit-test --- */

START_TEST (test_chart_pick_point_and_cell)
{
  g_autoptr (BwChart) taper = build (CH_TAPER_NORTH);
  g_autoptr (BwChart) matrix = build (CH_MATRIX);
  BwChartSeries *s = series_named (taper, "G at 2");
  BwChartFrame f;
  BwChartPick pick;
  double px, py;
  guint si = 0;

  for (guint i = 0; i < taper->series->len; i++)
    if (g_ptr_array_index (taper->series, i) == s)
      si = i;
  ck_assert (bw_chart_layout (taper, bw_style_light (), NULL, 800, 560, &f));
  bw_chart_frame_to_page (&f, FALSE, g_array_index (s->x, double, 2),
                          g_array_index (s->y, double, 2), &px, &py);
  ck_assert (bw_chart_pick (taper, bw_style_light (), 800, 560, px + 2, py - 2, &pick));
  ck_assert_int_eq (pick.kind, BW_CHART_PICK_POINT);
  ck_assert_uint_eq (pick.series, si);
  ck_assert_uint_eq (pick.index, 2);
  ck_assert_double_eq (pick.y, g_array_index (s->y, double, 2));
  /* Far from every point: the plot position, mapped back through the axes. */
  ck_assert (bw_chart_pick (taper, bw_style_light (), 800, 560, f.plot.x + 3,
                            f.plot.y + 3, &pick));
  ck_assert_int_eq (pick.kind, BW_CHART_PICK_PLOT);
  ck_assert_double_eq_tol (pick.y, bw_axis_from_page (&f.y, f.plot.y + 3,
                                                      f.plot.y + f.plot.height, f.plot.y), 1e-9);
  /* Outside the plot: nothing. */
  ck_assert (!bw_chart_pick (taper, bw_style_light (), 800, 560, 1, 1, &pick));
  ck_assert_int_eq (pick.kind, BW_CHART_PICK_NONE);

  /* The matrix: a point in the middle of the grid names its cell. */
  ck_assert (bw_chart_layout (matrix, bw_style_light (), NULL, 800, 560, &f));
  ck_assert (bw_chart_pick (matrix, bw_style_light (), 800, 560,
                            f.plot.x + 10.5 * f.cell_width, f.plot.y + f.plot.height - 2, &pick));
  ck_assert_int_eq (pick.kind, BW_CHART_PICK_CELL);
  ck_assert_uint_eq (pick.col, 10);
  ck_assert_uint_eq (pick.row, matrix->matrix.n_rows - 1);
}
END_TEST

/* --- builders carry the engine's numbers --- */

static const BwElementResult *
element (const char *id, int *index)
{
  for (guint i = 0; i < results->elements->len; i++)
    {
      const BwElementResult *e = g_ptr_array_index (results->elements, i);
      if (strcmp (e->id, id) == 0)
        {
          if (index)
            *index = (int) i;
          return e;
        }
    }
  ck_abort_msg ("no element %s", id);
  return NULL;
}

/* The taper's points are the results' G and Gt of each stage at maximum day (G in 1/s: the
 * display unit, so the numbers are equal to the bit). */
START_TEST (test_charts_taper_values)
{
  g_autoptr (BwChart) c = build (CH_TAPER_NORTH);
  const int cold = bw_charts_design_case (results, BW_TEMP_COLDEST);
  const BwChartSeries *g = series_named (c, "G at 2");
  const BwChartSeries *gt = series_named (c, "Gt at 24");
  const int warm = bw_charts_design_case (results, BW_TEMP_WARMEST);
  const char *stages[] = { "north-floc-1", "north-floc-2", "north-floc-3" };

  ck_assert_int_ge (cold, 0);
  ck_assert_int_eq (results->cases[cold].flow, BW_FLOW_MAXIMUM_DAY);
  ck_assert_uint_eq (c->x.categories->len, 3);
  ck_assert_uint_eq (g->y->len, 3);
  for (guint i = 0; i < 3; i++)
    {
      const BwElementResult *e = element (stages[i], NULL);
      ck_assert_double_eq (g_array_index (g->y, double, i), e->values[cold].values[BW_Q_G]);
      ck_assert_double_eq (g_array_index (gt->y, double, i), e->values[warm].values[BW_Q_GT]);
    }
  /* The stage-G limits of the criteria set are drawn: 10 and 60 s^-1 (textbook-ranges). */
  ck_assert_uint_ge (c->rules->len, 2);
}
END_TEST

/* Settling curves come from bw_settling_velocity; the overflow line is the largest overflow rate
 * of the results (peak hour), in m/h. */
START_TEST (test_charts_settling_values)
{
  g_autoptr (BwChart) c = build (CH_SETTLING);
  const BwChartSeries *cold = series_named (c, "Water at 2");
  const BwElementResult *e = element ("north-sed", NULL);
  BwSettlingResult res;
  double ov_max = 0;
  gboolean found = FALSE;

  ck_assert_int_eq (c->x.scale, BW_AXIS_LOG);
  ck_assert_int_eq (c->y.scale, BW_AXIS_LOG);
  /* Point 30: its diameter (mm) back to m, evaluated again: the same velocity (m/h). */
  ck_assert (bw_settling_velocity (g_array_index (cold->x, double, 30) * 1e-3, 1.25,
                                   demo->basis.temperature_K[BW_TEMP_COLDEST],
                                   BW_DRAG_CLIFT_GAUVIN, &res, NULL));
  bw_assert_rel (g_array_index (cold->y, double, 30), res.velocity_m_s * 3600.0, 1e-9);
  for (guint k = 0; k < results->n_cases; k++)
    ov_max = MAX (ov_max, e->values[k].values[BW_Q_OVERFLOW_RATE]);
  for (guint i = 0; i < c->rules->len; i++)
    {
      const BwChartRule *r = g_ptr_array_index (c->rules, i);
      if (r->label && strstr (r->label, "overflow rate"))
        {
          bw_assert_rel (r->value, ov_max * 3600.0, 1e-12);
          found = TRUE;
        }
    }
  ck_assert (found);
  /* The regime bands follow the engine: Stokes first, and at least one more. */
  ck_assert_uint_ge (c->bands->len, 2);
  ck_assert (g_str_has_prefix (((BwChartBand *) g_ptr_array_index (c->bands, 0))->label,
                               "Stokes"));
}
END_TEST

/* The removal chart's design points are the results' overflow rate and removal per flow. */
START_TEST (test_charts_removal_values)
{
  g_autoptr (BwChart) c = build (CH_REMOVAL);
  const BwChartSeries *pts = series_named (c, "Load cases");
  const BwElementResult *e = element ("south-sed", NULL);
  guint n = 0;

  for (guint k = 0; k < results->n_cases; k++)
    {
      const BwLoadCase *lc = &results->cases[k];
      if (lc->temp != BW_TEMP_COLDEST || lc->service != BW_SERVICE_ALL_IN_SERVICE)
        continue;
      bw_assert_rel (g_array_index (pts->x, double, n),
                     e->values[k].values[BW_Q_OVERFLOW_RATE] * 3600.0, 1e-12);
      ck_assert_double_eq (g_array_index (pts->y, double, n),
                           100 * e->values[k].values[BW_Q_REMOVAL]);
      n++;
    }
  ck_assert_uint_eq (n, pts->x->len);
  ck_assert_uint_eq (n, 4);
}
END_TEST

/* The power curve brackets the design point of the results, and the design point is the
 * results' power (W: under 10 kW at twice the speed, so the chart is in kW for 1.3 kW... the
 * builder picks kW when 8 x P reaches 10 kW: 8 x 1328 W = 10.6 kW). */
START_TEST (test_charts_impeller_values)
{
  g_autoptr (BwChart) c = build (CH_IMPELLER);
  const BwChartSeries *pw = series_named (c, "Power at 2");
  const BwChartSeries *dp = series_named (c, "Design point");
  const int cold = bw_charts_design_case (results, BW_TEMP_COLDEST);
  const BwElementResult *e = element ("north-rm", NULL);
  const double p_kw = e->values[cold].values[BW_Q_POWER] / 1e3;
  const double n_rpm = g_array_index (dp->x, double, 0);
  gboolean bracketed = FALSE;

  ck_assert_str_eq (c->y.unit, "kW");
  ck_assert_double_eq_tol (n_rpm, 170.0, 1e-9); /* the project's 170 rpm */
  bw_assert_rel (g_array_index (dp->y, double, 0), p_kw, 1e-12);
  for (guint i = 1; i < pw->x->len; i++)
    {
      double x0 = g_array_index (pw->x, double, i - 1), x1 = g_array_index (pw->x, double, i);
      double y0 = g_array_index (pw->y, double, i - 1), y1 = g_array_index (pw->y, double, i);
      ck_assert (x1 > x0 && y1 > y0); /* P grows with N */
      if (x0 <= n_rpm && n_rpm <= x1)
        bracketed = y0 <= p_kw && p_kw <= y1;
    }
  ck_assert (bracketed);
}
END_TEST

/* The matrix grades each check in each load case; its worst cell in a row is the status the
 * engine's bw_check_results gave that check (pass < warn < fail, n/a lowest). */
static int
severity (BwCheckStatus s)
{
  return s == BW_CHECK_FAIL ? 3 : s == BW_CHECK_WARN ? 2 : s == BW_CHECK_PASS ? 1 : 0;
}

START_TEST (test_charts_matrix_agrees_with_checks)
{
  g_autoptr (BwChart) c = build (CH_MATRIX);
  guint want[4] = { 0 }, got[4] = { 0 };

  ck_assert_uint_eq (c->matrix.n_cols, results->n_cases);
  for (guint i = 0; i < checks->len; i++)
    {
      const BwCheck *k = &g_array_index (checks, BwCheck, i);
      const BwElementResult *e;
      if (k->element < 0)
        continue;
      e = g_ptr_array_index (results->elements, k->element);
      if (strcmp (e->train->id, "north") == 0)
        want[severity (k->status)]++;
    }
  for (guint r = 0; r < c->matrix.n_rows; r++)
    {
      int worst = 0;
      for (guint col = 0; col < c->matrix.n_cols; col++)
        worst = MAX (worst, severity (c->matrix.cells[r * c->matrix.n_cols + col]));
      got[worst]++;
    }
  for (guint s = 0; s < 4; s++)
    ck_assert_msg (got[s] == want[s], "severity %u: %u rows, %u checks", s, got[s], want[s]);
  /* The demo has warnings (rapid-mix detention, basin length/width): the matrix shows them. */
  ck_assert_uint_gt (got[2], 0);
}
END_TEST

/* A matrix cell is filled in its status colour (sampled by a corner, clear of the glyph). */
START_TEST (test_charts_matrix_cell_colour)
{
  g_autoptr (BwChart) c = build (CH_MATRIX);
  cairo_surface_t *img = paint_image (c, bw_style_light (), 900, 600);
  BwChartColours cc;
  guint checked = 0;

  bw_chart_colours (bw_style_light (), &cc);
  for (double y = 0; y < 600; y += 1)
    {
      BwChartPick pick;
      double x = 0;
      BwChartFrame f;
      ck_assert (bw_chart_layout (c, bw_style_light (), NULL, 900, 600, &f));
      x = f.plot.x + 15 * f.cell_width + 2.5; /* the last column, just inside its left edge */
      if (!bw_chart_pick (c, bw_style_light (), 900, 600, x, y, &pick)
          || pick.kind != BW_CHART_PICK_CELL)
        continue;
      {
        BwCheckStatus st = c->matrix.cells[pick.row * c->matrix.n_cols + pick.col];
        double rgb[3];
        /* Two pixels into the cell's top: clear of the glyph at its centre. */
        double top = y;
        while (top > 0)
          {
            BwChartPick up;
            if (!bw_chart_pick (c, bw_style_light (), 900, 600, x, top - 1, &up)
                || up.kind != BW_CHART_PICK_CELL || up.row != pick.row)
              break;
            top -= 1;
          }
        if (st == BW_CHECK_NOT_APPLICABLE)
          continue;
        pixel (img, (int) x, (int) top + 2, rgb);
        ck_assert_double_le (rgb_distance (rgb, st == BW_CHECK_PASS ? cc.pass
                                                : st == BW_CHECK_WARN ? cc.warn : cc.fail),
                             COLOUR_TOL);
        checked++;
        y = top + f.cell_height; /* next row */
      }
    }
  ck_assert_uint_ge (checked, 10);
  cairo_surface_destroy (img);
}
END_TEST

/* The check states stay apart in greyscale: pairwise CIE L* differences of at least 10 on
 * either preset (our own rule; see bw_chart_colours), and n/a stays near the paper. */
START_TEST (test_chart_status_colours_greyscale)
{
  const BwStyle *styles[] = { bw_style_light (), bw_style_dark () };

  for (guint k = 0; k < G_N_ELEMENTS (styles); k++)
    {
      BwChartColours cc;
      double l[3];
      bw_chart_colours (styles[k], &cc);
      l[0] = bw_rgb_lightness (cc.pass);
      l[1] = bw_rgb_lightness (cc.warn);
      l[2] = bw_rgb_lightness (cc.fail);
      for (guint i = 0; i < 3; i++)
        for (guint j = i + 1; j < 3; j++)
          ck_assert_msg (fabs (l[i] - l[j]) >= 10, "%s: states %u and %u at L* %.1f and %.1f",
                         styles[k]->name, i, j, l[i], l[j]);
      ck_assert_double_le (fabs (bw_rgb_lightness (cc.not_applicable)
                                 - bw_rgb_lightness (styles[k]->paper)), 10);
      /* Fail is the reddest of the three, pass the bluest (hue as a second cue). */
      ck_assert (cc.fail.r - cc.fail.b > cc.pass.r - cc.pass.b);
    }
}
END_TEST

START_TEST (test_charts_errors)
{
  GError *error = NULL;

  ck_assert_ptr_null (bw_chart_floc_taper (demo, results, NULL, "nope", BW_UNIT_SYSTEM_SI,
                                           &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "nope");
  g_clear_error (&error);
  ck_assert_ptr_null (bw_chart_floc_taper (demo, results, NULL, "north-sed", BW_UNIT_SYSTEM_SI,
                                           &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "not a flocculator");
  g_clear_error (&error);
  /* The plate settler has no overflow rate in the demo (no module area given). */
  ck_assert_ptr_null (bw_chart_removal_curves (demo, results, "east-sed", BW_UNIT_SYSTEM_SI,
                                               &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "overflow rate");
  g_clear_error (&error);
  ck_assert_ptr_null (bw_chart_impeller_power (demo, results, NULL, "north-floc-2",
                                               BW_UNIT_SYSTEM_SI, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "no impeller");
  g_clear_error (&error);
  ck_assert_ptr_null (bw_chart_check_matrix (demo, results, checks, "no-such-train", &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "no-such-train");
  g_clear_error (&error);
}
END_TEST

/* A chart with no data lays out as nothing and paints a notice, not a crash. */
START_TEST (test_chart_empty)
{
  g_autoptr (BwChart) c = bw_chart_new (BW_CHART_XY, "Nothing yet");
  BwChartFrame f;
  cairo_surface_t *img;

  bw_chart_axis_set (&c->x, BW_AXIS_LOG, "x", NULL);
  bw_chart_axis_set (&c->y, BW_AXIS_LINEAR, "y", NULL);
  bw_chart_series_add (bw_chart_add_series (c, "s", BW_SERIES_LINE, 0, BW_MARKER_NONE,
                                            BW_DASH_SOLID, TRUE),
                       -1.0, 2.0); /* not on a log axis */
  ck_assert (!bw_chart_layout (c, bw_style_light (), NULL, 640, 480, &f));
  img = paint_image (c, bw_style_light (), 640, 480);
  cairo_surface_destroy (img);
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("chart");
  TCase *tc;

  tc = tcase_create ("paint");
  tcase_add_checked_fixture (tc, demo_setup, demo_teardown);
  tcase_add_test (tc, test_chart_not_blank);
  tcase_add_test (tc, test_chart_ink_inside_canvas);
  tcase_add_test (tc, test_chart_point_at_mapped_pixel);
  tcase_add_test (tc, test_chart_legend_clear_of_data);
  tcase_add_test (tc, test_chart_light_and_dark);
  tcase_add_test (tc, test_chart_extreme_sizes);
  tcase_set_timeout (tc, 120);
  suite_add_tcase (s, tc);

  tc = tcase_create ("layout");
  tcase_add_test (tc, test_chart_legend_moves_out);
  tcase_add_test (tc, test_chart_empty);
  tcase_add_test (tc, test_chart_status_colours_greyscale);
  suite_add_tcase (s, tc);

  tc = tcase_create ("pick");
  tcase_add_checked_fixture (tc, demo_setup, demo_teardown);
  tcase_add_test (tc, test_chart_pick_point_and_cell);
  suite_add_tcase (s, tc);

  tc = tcase_create ("builders");
  tcase_add_checked_fixture (tc, demo_setup, demo_teardown);
  tcase_add_test (tc, test_charts_taper_values);
  tcase_add_test (tc, test_charts_settling_values);
  tcase_add_test (tc, test_charts_removal_values);
  tcase_add_test (tc, test_charts_impeller_values);
  tcase_add_test (tc, test_charts_matrix_agrees_with_checks);
  tcase_add_test (tc, test_charts_matrix_cell_colour);
  tcase_add_test (tc, test_charts_errors);
  tcase_set_timeout (tc, 120);
  suite_add_tcase (s, tc);
  return s;
}
