/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-sketch.c: the sketches of the demo project painted on image and recording surfaces
 * (ink, containment, scale), the palettes, and the files the exporter writes. */
#include "config.h"

#include <glib/gstdio.h>
#include <string.h>

#include "bw-test.h"
#include "draw/bw-export.h"
#include "draw/bw-sketch.h"
#include "draw/bw-style.h"
#include "engine/bw-error.h"
#include "engine/bw-evaluate.h"
#include "io/bw-project-xml.h"

typedef struct
{
  const char *unit;
  BwSketchView view;
} Case;

/* Every drawn view of every unit of the demo project: a square and a round rapid-mix tank with
 * two impeller types, the rectangular basin, the three flocculators (turbine and paddles,
 * baffles around the end, paddles), one stage of each kind alone, the circular clarifier, the
 * plate settler (plan and section), and each train's schematic (asked for by a unit, an in-line mixer and a
 * stage). */
static const Case cases[] = {
  { "north-sed", BW_SKETCH_PLAN },      { "north-sed", BW_SKETCH_SECTION },
  { "north-rm", BW_SKETCH_PLAN },       { "north-rm", BW_SKETCH_SECTION },
  { "east-rm", BW_SKETCH_PLAN },        { "east-rm", BW_SKETCH_SECTION },
  { "north-floc", BW_SKETCH_PLAN },     { "north-floc", BW_SKETCH_SECTION },
  { "south-floc", BW_SKETCH_PLAN },     { "south-floc", BW_SKETCH_SECTION },
  { "east-floc", BW_SKETCH_PLAN },      { "east-floc", BW_SKETCH_SECTION },
  { "north-floc-1", BW_SKETCH_PLAN },   { "north-floc-1", BW_SKETCH_SECTION },
  { "north-floc-2", BW_SKETCH_PLAN },   { "north-floc-2", BW_SKETCH_SECTION },
  { "south-floc-3", BW_SKETCH_PLAN },   { "south-floc-3", BW_SKETCH_SECTION },
  { "south-sed", BW_SKETCH_PLAN },      { "south-sed", BW_SKETCH_SECTION },
  { "east-sed", BW_SKETCH_PLAN },       { "east-sed", BW_SKETCH_SECTION },
  { "north-sed", BW_SKETCH_SCHEMATIC }, { "south-mix", BW_SKETCH_SCHEMATIC },
  { "east-floc-2", BW_SKETCH_SCHEMATIC },
};
#define N_CASES ((int) G_N_ELEMENTS (cases))

/* The smallest and largest canvases the sketches promise to be legible on, and one between. */
static const double sizes[][2] = { { 400, 300 }, { 1600, 1000 }, { 3000, 2000 } };
#define N_SIZES ((int) G_N_ELEMENTS (sizes))

static BwProject *demo;

static void
load_demo (void)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *path = g_build_filename (BW_SOURCE_DATADIR, "examples", "marrowby-demo.bwproj",
                                            NULL);
  demo = bw_project_load (path, &error);
  ck_assert_msg (demo != NULL, "demo project: %s", error ? error->message : "?");
}

static void
free_demo (void)
{
  g_clear_pointer (&demo, bw_project_free);
}

static const BwProcessUnit *
unit (const char *id)
{
  const BwProcessUnit *u = bw_project_find_unit (demo, id, NULL);
  ck_assert_msg (u != NULL, "no unit %s in the demo", id);
  return u;
}

static cairo_surface_t *
paint_image (const Case *k, const BwStyle *st, BwUnitSystem units, int w, int h)
{
  g_autoptr (GError) error = NULL;
  cairo_surface_t *s = cairo_image_surface_create (CAIRO_FORMAT_RGB24, w, h);
  cairo_t *cr = cairo_create (s);
  gboolean ok = bw_sketch_paint (demo, unit (k->unit), k->view, units, st, cr, w, h, &error);
  ck_assert_msg (ok, "%s %s: %s", k->unit, bw_sketch_view_name (k->view),
                 error ? error->message : "");
  ck_assert_int_eq (cairo_status (cr), CAIRO_STATUS_SUCCESS);
  cairo_destroy (cr);
  cairo_surface_flush (s);
  return s;
}

static void
pixel (cairo_surface_t *s, int x, int y, int rgb[3])
{
  const unsigned char *d = cairo_image_surface_get_data (s);
  const guint32 v = *(const guint32 *) (d + y * cairo_image_surface_get_stride (s) + 4 * x);
  rgb[0] = (int) (v >> 16 & 0xff);
  rgb[1] = (int) (v >> 8 & 0xff);
  rgb[2] = (int) (v & 0xff);
}

static int
to_byte (double c)
{
  return (int) (c * 255.0 + 0.5);
}

/* Share of pixels that differ clearly from the paper, and the mean L*-like grey level. */
static double
ink_share (cairo_surface_t *s, BwRgb paper, double *mean_grey)
{
  const int w = cairo_image_surface_get_width (s), h = cairo_image_surface_get_height (s);
  const int p[3] = { to_byte (paper.r), to_byte (paper.g), to_byte (paper.b) };
  gint64 inked = 0;
  double sum = 0;
  for (int y = 0; y < h; y++)
    for (int x = 0; x < w; x++)
      {
        int c[3];
        pixel (s, x, y, c);
        if (abs (c[0] - p[0]) + abs (c[1] - p[1]) + abs (c[2] - p[2]) > 24)
          inked++;
        sum += (c[0] + c[1] + c[2]) / 3.0;
      }
  if (mean_grey)
    *mean_grey = sum / ((double) w * h);
  return (double) inked / ((double) w * h);
}

/* --- painting --- */

START_TEST (test_sketch_paint_not_blank)
{
  const Case *k = &cases[_i % N_CASES];
  const double *sz = sizes[_i / N_CASES];
  cairo_surface_t *s =
      paint_image (k, bw_style_light (), BW_UNIT_SYSTEM_SI, (int) sz[0], (int) sz[1]);
  const double share = ink_share (s, bw_style_light ()->paper, NULL);
  /* A real sketch covers a fair part of the sheet with water, structure and text: at least 3 %
   * (a title alone would be well under 1 %), and never the whole page. A schematic is outlines
   * and text with one block filled: at least 1.5 %. Derived from our layout. */
  ck_assert_msg (share > (k->view == BW_SKETCH_SCHEMATIC ? 0.015 : 0.03) && share < 0.9, "%s %s at %gx%g: %.3f of the pixels inked", k->unit,
                 bw_sketch_view_name (k->view), sz[0], sz[1], share);
  cairo_surface_destroy (s);
}
END_TEST

START_TEST (test_sketch_ink_within_canvas)
{
  const Case *k = &cases[_i % N_CASES];
  const double *sz = sizes[_i / N_CASES];
  g_autoptr (GError) error = NULL;
  /* Unbounded, so anything painted off the sheet shows in the ink extents. */
  cairo_surface_t *rec = cairo_recording_surface_create (CAIRO_CONTENT_COLOR_ALPHA, NULL);
  cairo_t *cr = cairo_create (rec);
  double x, y, w, h;

  for (int units = 0; units < 2; units++)
    ck_assert (bw_sketch_paint (demo, unit (k->unit), k->view, (BwUnitSystem) units,
                                bw_style_light (), cr, sz[0], sz[1], &error));
  cairo_destroy (cr);
  cairo_recording_surface_ink_extents (rec, &x, &y, &w, &h);
  /* The paper fills exactly the sheet; the extents may not reach past it (half a pixel of
   * antialiasing slack). */
  ck_assert_msg (x >= -0.5 && y >= -0.5 && x + w <= sz[0] + 0.5 && y + h <= sz[1] + 0.5,
                 "%s %s at %gx%g: ink at %g,%g size %gx%g", k->unit, bw_sketch_view_name (k->view),
                 sz[0], sz[1], x, y, w, h);
  cairo_surface_destroy (rec);
}
END_TEST

/* The scale bar, painted in a colour nothing else uses, measured in pixels along its middle row:
 * its length must be scale x the length its label states, within a pixel. The label is parsed
 * back with the engine's unit parser, so a wrong label fails too. */
START_TEST (test_sketch_scale_bar_matches_label)
{
  const Case *k = &cases[_i % N_CASES];
  const double *sz = sizes[(_i / N_CASES) % N_SIZES];
  const BwUnitSystem units = _i / (N_CASES * N_SIZES) ? BW_UNIT_SYSTEM_US : BW_UNIT_SYSTEM_SI;
  g_autoptr (GError) error = NULL;
  BwStyle st = *bw_style_light ();
  BwSketchGeometry g;
  cairo_surface_t *s;
  double labelled_m, covered = 0, first = -1;
  int row;

  st.scale_bar = (BwRgb) { 1, 0, 1 };
  ck_assert (bw_sketch_layout (demo, unit (k->unit), k->view, units, &st, sz[0], sz[1], &g,
                               &error));
  if (k->view == BW_SKETCH_SCHEMATIC)
    {
      /* not to scale, so no bar at all: nothing in the bar's colour anywhere */
      ck_assert_double_eq (g.bar_length_m, 0.0);
      ck_assert_str_eq (g.bar_label, "");
      int barred = 0;
      s = paint_image (k, &st, units, (int) sz[0], (int) sz[1]);
      /* every pixel is looked at; one assertion at the end (each ck_assert costs a pipe write) */
      for (int y = 0; y < (int) sz[1]; y++)
        for (int x = 0; x < (int) sz[0]; x++)
          {
            int c[3];
            pixel (s, x, y, c);
            barred += c[0] > 200 && c[2] > 200 && c[1] < 60;
          }
      ck_assert_msg (barred == 0, "%d pixels in the bar's colour on a schematic", barred);
      cairo_surface_destroy (s);
      return;
    }
  ck_assert_msg (bw_units_parse (g.bar_label, BW_KIND_LENGTH, NULL, "label", &labelled_m, &error),
                 "scale bar label '%s': %s", g.bar_label, error ? error->message : "");
  ck_assert_str_eq (g.bar_label + strlen (g.bar_label) - (units ? 2 : 1), units ? "ft" : "m");
  /* a round length reads without padding zeros: "10 m", "0.5 m", never "10.00 m" */
  {
    const char *sp = strchr (g.bar_label, ' ');
    ck_assert_ptr_nonnull (sp);
    ck_assert_msg (memchr (g.bar_label, '.', (size_t) (sp - g.bar_label)) == NULL || sp[-1] != '0',
                   "label '%s'", g.bar_label);
    ck_assert_msg (strchr ("125", g.bar_label[0]) != NULL
                       || (g.bar_label[0] == '0' && strchr ("125", sp[-1]) != NULL),
                   "label '%s' is not 1, 2 or 5 times a power of ten", g.bar_label);
  }
  s = paint_image (k, &st, units, (int) sz[0], (int) sz[1]);
  row = (int) floor (g.bar_y + g.bar_height / 2);
  for (int x = 0; x < (int) sz[0]; x++)
    {
      int c[3];
      pixel (s, x, row, c);
      /* magenta over white: red and blue stay full, green falls with the coverage */
      if (c[0] > 200 && c[2] > 200 && c[1] < c[0] - 20)
        {
          covered += (255.0 - c[1]) / 255.0;
          if (first < 0)
            first = x;
        }
    }
  ck_assert_msg (fabs (covered - g.scale * labelled_m) <= 1.0,
                 "%s %s %gx%g: bar %.2f px drawn, label %s x scale %.4f = %.2f px", k->unit,
                 bw_sketch_view_name (k->view), sz[0], sz[1], covered, g.bar_label, g.scale,
                 g.scale * labelled_m);
  ck_assert_msg (fabs (first - g.bar_x) <= 1.0, "bar starts at %g, layout says %g", first, g.bar_x);
  /* A bar a reader can use: the layout aims at 15-25 % of the sheet width and rounds down to
   * 1, 2 or 5 units, which at worst halves it (derived from bw-sketch.c). */
  ck_assert_msg (covered > 0.07 * sz[0] && covered < 0.26 * sz[0], "bar %.1f px on %g", covered,
                 sz[0]);
  cairo_surface_destroy (s);
}
END_TEST

/* The basin section and the square tank plan drawn to the same scale as the bar: the water's
 * width in pixels along a row clear of other parts is scale x the entered length (the demo's
 * 56 m basin, 1.1 m tank). */
static double
water_span (cairo_surface_t *s, int row)
{
  const int w = cairo_image_surface_get_width (s);
  int first = -1, last = -1;
  for (int x = 0; x < w; x++)
    {
      int c[3];
      pixel (s, x, row, c);
      /* pure cyan water; a pixel at least half water counts */
      if (c[0] < 128 && c[1] > 190 && c[2] > 190)
        {
          if (first < 0)
            first = x;
          last = x;
        }
    }
  return first < 0 ? 0 : last - first + 1;
}

/* Width of a structure outline on this canvas: the style's width times the canvas factor, which
 * is the body text size over the style's. */
static double
outline_px (const BwStyle *st, const BwSketchGeometry *g)
{
  return st->line_outline * g->text_size / st->font_size;
}

START_TEST (test_sketch_drawn_to_scale)
{
  const double *sz = sizes[_i];
  g_autoptr (GError) error = NULL;
  BwStyle st = *bw_style_light ();
  BwSketchGeometry g;
  const Case basin = { "north-sed", BW_SKETCH_SECTION }, tank = { "north-rm", BW_SKETCH_PLAN };
  cairo_surface_t *s;
  double got, want;

  st.water = (BwRgb) { 0, 1, 1 };
  ck_assert (bw_sketch_layout (demo, unit ("north-sed"), BW_SKETCH_SECTION, BW_UNIT_SYSTEM_SI, &st,
                               sz[0], sz[1], &g, &error));
  s = paint_image (&basin, &st, BW_UNIT_SYSTEM_SI, (int) sz[0], (int) sz[1]);
  /* a quarter of the 4 m side water depth up: below the inlet port and the launders */
  got = water_span (s, (int) floor (g.origin_y - g.scale * 1.0));
  /* length 56 m, from the demo file, less the wall outlines: each is stroked centred on the
   * inner face, so half its width covers water at either end (derived from bw-sketch.c) */
  want = g.scale * 56.0 - outline_px (&st, &g);
  /* each end is found to the nearest whole pixel, so allow half a pixel more than the bar test */
  ck_assert_msg (fabs (got - want) <= 1.5, "basin water %g px, want %g", got, want);
  cairo_surface_destroy (s);

  ck_assert (bw_sketch_layout (demo, unit ("north-rm"), BW_SKETCH_PLAN, BW_UNIT_SYSTEM_SI, &st,
                               sz[0], sz[1], &g, &error));
  s = paint_image (&tank, &st, BW_UNIT_SYSTEM_SI, (int) sz[0], (int) sz[1]);
  /* a row 0.45 m below the centre of the 1.1 m tank: clear of baffles, impeller and arrows */
  got = water_span (s, (int) floor (g.origin_y + g.scale * 0.45));
  want = g.scale * 1.1 - outline_px (&st, &g);
  ck_assert_msg (fabs (got - want) <= 1.5, "tank water %g px, want %g", got, want);
  cairo_surface_destroy (s);
}
END_TEST

/* Runs of pixels of colour COL along ROW (a pixel at least about half COL counts): the last
 * pixel of the first run and the first pixel of the last run. FALSE when there is none. */
static gboolean
colour_runs (cairo_surface_t *s, int row, BwRgb col, int *first_end, int *last_start)
{
  const int w = cairo_image_surface_get_width (s);
  const int want[3] = { to_byte (col.r), to_byte (col.g), to_byte (col.b) };
  int prev = -2, runs = 0;
  *first_end = *last_start = -1;
  for (int x = 0; x < w; x++)
    {
      int c[3];
      pixel (s, x, row, c);
      if (abs (c[0] - want[0]) + abs (c[1] - want[1]) + abs (c[2] - want[2]) < 120)
        {
          if (x != prev + 1)
            {
              runs++;
              *last_start = x;
            }
          if (runs == 1)
            *first_end = x;
          prev = x;
        }
    }
  return runs >= 2;
}

/* Centres of the runs of pure red along ROW (weighted by coverage), into CENTRES; returns how
 * many. */
static int
run_centres (cairo_surface_t *s, int row, double *centres, int max)
{
  const int w = cairo_image_surface_get_width (s);
  int n = 0;
  double sum = 0, wsum = 0;
  for (int x = 0; x <= w; x++)
    {
      double a = 0;
      if (x < w)
        {
          int c[3];
          pixel (s, x, row, c);
          /* pure red over cyan water: red rises and blue falls with the coverage; greys (the
           * break lines, text) have red and blue alike */
          if (c[0] - c[2] > 40)
            a = CLAMP (c[0] / 255.0, 0.0, 1.0);
        }
      if (a > 0.05)
        {
          sum += a * x;
          wsum += a;
        }
      else if (wsum > 0)
        {
          if (n < max)
            centres[n++] = sum / wsum;
          sum = wsum = 0;
        }
    }
  return n;
}

/* The new views drawn to the scale of their bar, one measure each (all from the demo file):
 * the flocculators' water length in plan and section, a stage drawn alone, the clarifier's
 * inside diameter in plan and in section, and the settler's plate pitch. */
START_TEST (test_sketch_new_views_to_scale)
{
  const double *sz = sizes[_i];
  g_autoptr (GError) error = NULL;
  BwStyle st = *bw_style_light ();
  BwSketchGeometry g;
  cairo_surface_t *s;
  double got, want;

  st.water = (BwRgb) { 0, 1, 1 };
  st.concrete = (BwRgb) { 0, 0.8, 0 };
  st.equipment = (BwRgb) { 1, 0, 0 };

  /* 1. north flocculator, plan: 0.3 m in from the side wall, below the blades' ends and clear
   * of the inlet port; the water is the three 3 m stages long, less the end walls' outlines
   * (half each, as in the basin's check above) */
  {
    const Case k = { "north-floc", BW_SKETCH_PLAN };
    ck_assert (bw_sketch_layout (demo, unit (k.unit), k.view, BW_UNIT_SYSTEM_SI, &st, sz[0], sz[1],
                                 &g, &error));
    s = paint_image (&k, &st, BW_UNIT_SYSTEM_SI, (int) sz[0], (int) sz[1]);
    got = water_span (s, (int) floor (g.origin_y - g.scale * 0.3));
    want = g.scale * 9.0 - outline_px (&st, &g);
    ck_assert_msg (fabs (got - want) <= 1.5, "north-floc plan water %g px, want %g", got, want);
    cairo_surface_destroy (s);
  }
  /* 2. south flocculator, section: 0.25 m above the floor, under the inlet port; 16 x 0.196 +
   * 13 x 0.245 + 9 x 0.345 = 9.426 m of baffled channels */
  {
    const Case k = { "south-floc", BW_SKETCH_SECTION };
    ck_assert (bw_sketch_layout (demo, unit (k.unit), k.view, BW_UNIT_SYSTEM_SI, &st, sz[0], sz[1],
                                 &g, &error));
    s = paint_image (&k, &st, BW_UNIT_SYSTEM_SI, (int) sz[0], (int) sz[1]);
    got = water_span (s, (int) floor (g.origin_y - g.scale * 0.25));
    want = g.scale * (16 * 0.196 + 13 * 0.245 + 9 * 0.345) - outline_px (&st, &g);
    ck_assert_msg (fabs (got - want) <= 1.5, "south-floc section water %g px, want %g", got, want);
    cairo_surface_destroy (s);
  }
  /* 3. stage 1 of the north flocculator alone (section): the inlet wall on the left, the next
   * stage's partition on the right, where the water runs on through the wall's thickness
   * (0.30 m by convention) without an outline: 3 m + 0.3 m less half an outline */
  {
    const Case k = { "north-floc-1", BW_SKETCH_SECTION };
    ck_assert (bw_sketch_layout (demo, unit (k.unit), k.view, BW_UNIT_SYSTEM_SI, &st, sz[0], sz[1],
                                 &g, &error));
    s = paint_image (&k, &st, BW_UNIT_SYSTEM_SI, (int) sz[0], (int) sz[1]);
    got = water_span (s, (int) floor (g.origin_y - g.scale * 0.25));
    want = g.scale * 3.3 - 0.5 * outline_px (&st, &g);
    ck_assert_msg (fabs (got - want) <= 1.5, "north-floc-1 section water %g px, want %g", got, want);
    cairo_surface_destroy (s);
  }
  /* 4. clarifier, plan: along the centre row, the gap between the wall ring's two concrete runs
   * is the 16 m inside diameter plus one outline (half of it on each inner face) */
  {
    const Case k = { "south-sed", BW_SKETCH_PLAN };
    int first_end, last_start;
    ck_assert (bw_sketch_layout (demo, unit (k.unit), k.view, BW_UNIT_SYSTEM_SI, &st, sz[0], sz[1],
                                 &g, &error));
    s = paint_image (&k, &st, BW_UNIT_SYSTEM_SI, (int) sz[0], (int) sz[1]);
    ck_assert (colour_runs (s, (int) floor (g.origin_y), st.concrete, &first_end, &last_start));
    got = last_start - first_end - 1;
    want = g.scale * 16.0 + outline_px (&st, &g);
    ck_assert_msg (fabs (got - want) <= 1.5, "clarifier plan inside %g px, want %g", got, want);
    cairo_surface_destroy (s);
  }
  /* 5. clarifier, section: 0.6 m above the wall foot, below the flow arrows: wall to wall */
  {
    const Case k = { "south-sed", BW_SKETCH_SECTION };
    ck_assert (bw_sketch_layout (demo, unit (k.unit), k.view, BW_UNIT_SYSTEM_SI, &st, sz[0], sz[1],
                                 &g, &error));
    s = paint_image (&k, &st, BW_UNIT_SYSTEM_SI, (int) sz[0], (int) sz[1]);
    got = water_span (s, (int) floor (g.origin_y - g.scale * 0.6));
    want = g.scale * 16.0 - outline_px (&st, &g);
    ck_assert_msg (fabs (got - want) <= 1.5, "clarifier section water %g px, want %g", got, want);
    cairo_surface_destroy (s);
  }
  /* 6. plate settler, section: halfway up the plates, the eight plates drawn cross the row at
   * the horizontal pitch 50 mm / sin 60°; first to last centre is seven pitches */
  {
    const Case k = { "east-sed", BW_SKETCH_SECTION };
    double c[16];
    int nc;
    ck_assert (bw_sketch_layout (demo, unit (k.unit), k.view, BW_UNIT_SYSTEM_SI, &st, sz[0], sz[1],
                                 &g, &error));
    s = paint_image (&k, &st, BW_UNIT_SYSTEM_SI, (int) sz[0], (int) sz[1]);
    nc = run_centres (s, (int) floor (g.origin_y - g.scale * 0.5 * 1.5 * sin (G_PI / 3)), c, 16);
    ck_assert_msg (nc == 8, "%d runs at %gx%g, from %g to %g", nc, sz[0], sz[1], c[0],
                   c[MAX (nc - 1, 0)]);
    got = c[nc - 1] - c[0];
    want = g.scale * 7 * 0.05 / sin (G_PI / 3);
    ck_assert_msg (fabs (got - want) <= 1.5, "settler pitch x 7 = %g px, want %g", got, want);
    cairo_surface_destroy (s);
  }
}
END_TEST

/* Centres of the runs of red over cyan water along ROW between page x X0 and X1 (inside the
 * water, where no grey half-covers white paper), however thin (a line of a fraction of a pixel):
 * a pixel counts when it is a blend of the two, weighted by its red. */
static int
tint_centres (cairo_surface_t *s, int row, int x0, int x1, double *centres, int max)
{
  const int w = cairo_image_surface_get_width (s);
  int n = 0;
  double sum = 0, wsum = 0;
  x0 = MAX (x0, 0);
  x1 = MIN (x1, w);
  for (int x = x0; x <= x1; x++)
    {
      double a = 0;
      if (x < x1)
        {
          int c[3];
          pixel (s, x, row, c);
          /* red at coverage a over cyan is (a, 1 - a, 1 - a): red and green add up to full,
           * green and blue alike; white, greys, ink and the green concrete do not */
          if (c[0] > 20 && abs (c[0] + c[1] - 255) < 40 && abs (c[1] - c[2]) < 30)
            a = c[0] / 255.0;
        }
      if (a > 0)
        {
          sum += a * x;
          wsum += a;
        }
      else if (wsum > 0)
        {
          if (n < max)
            centres[n++] = sum / wsum;
          sum = wsum = 0;
        }
    }
  return n;
}

/* The plate settler's plan drawn to the scale of its bar. The demo's 500 plates (50 mm apart at
 * 60°, 1.5 m long, 1.2 m wide; from the demo file) stand in 3 banks of 167, 167 and 166 rows
 * (the fewest that keep the modules at most 4 x as long as wide, our drafting rule): the
 * modules are 166 x 0.05 m / sin 60° + 1.5 m x cos 60° = 10.334 m long, and the basin 1 m of
 * inlet zone (by convention) longer, 11.334 m inside (derived). */
static const double settler_module_m = 166 * 0.05 / 0.86602540378443865 + 0.75;

START_TEST (test_sketch_settler_plan_to_scale)
{
  const double *sz = sizes[_i];
  const Case k = { "east-sed", BW_SKETCH_PLAN };
  const double pitch_m = 0.05 / sin (G_PI / 3);
  g_autoptr (GError) error = NULL;
  BwStyle st = *bw_style_light ();
  BwSketchGeometry g;
  cairo_surface_t *s;
  double c[4096];
  int first_end, last_start, nc, row;
  double got, want;

  st.water = (BwRgb) { 0, 1, 1 };
  st.concrete = (BwRgb) { 0, 0.8, 0 };
  st.equipment = (BwRgb) { 1, 0, 0 };
  ck_assert (bw_sketch_layout (demo, unit (k.unit), k.view, BW_UNIT_SYSTEM_SI, &st, sz[0], sz[1],
                               &g, &error));
  s = paint_image (&k, &st, BW_UNIT_SYSTEM_SI, (int) sz[0], (int) sz[1]);
  /* halfway across the first bank: clear of the inlet opening (in the middle of the 3.6 m
   * width) and of the bank edges */
  row = (int) floor (g.origin_y - g.scale * 0.6);

  /* 1. the basin: between the end walls' concrete, the inside length plus one outline (half of
   * it on each inner face), as for the clarifier's wall ring */
  ck_assert (colour_runs (s, row, st.concrete, &first_end, &last_start));
  got = last_start - first_end - 1;
  want = g.scale * (1.0 + settler_module_m) + outline_px (&st, &g);
  ck_assert_msg (fabs (got - want) <= 1.5, "settler basin inside %g px, want %g", got, want);

  /* 2. the modules: from the bank's inlet edge to its far edge, centre to centre, in red */
  nc = run_centres (s, row, c, G_N_ELEMENTS (c));
  ck_assert_msg (nc >= 2, "%d red runs", nc);
  got = c[nc - 1] - c[0];
  want = g.scale * settler_module_m;
  ck_assert_msg (fabs (got - want) <= 1.5, "settler modules %g px, want %g", got, want);
  ck_assert_msg (fabs (c[0] - (g.origin_x + g.scale * 1.0)) <= 1.0, "modules start at %g, want %g",
                 c[0], g.origin_x + g.scale * 1.0);

  /* 3. the last rows, drawn one to a pitch where they stand far enough apart on the page (4 px,
   * or 3 line widths on a large canvas; derived from bw-sketch.c), else one in a whole number
   * of pitches: the last gap is that many pitches */
  {
    const double need = MAX (4.0, 3.0 * g.text_size / st.font_size);
    const double every = g.scale * pitch_m >= need ? 1 : ceil (need / (g.scale * pitch_m));
    /* from the inlet zone to the outline of the far wall's inner face, exclusive */
    nc = tint_centres (s, row, (int) (g.origin_x + g.scale * 0.5),
                       (int) floor (g.origin_x + g.scale * (1.0 + settler_module_m)
                                    + 0.5 * outline_px (&st, &g)),
                       c, G_N_ELEMENTS (c));
    ck_assert_msg (nc >= 2, "%d red runs", nc);
    got = c[nc - 1] - c[nc - 2];
    want = g.scale * pitch_m * every;
    ck_assert_msg (fabs (got - want) <= 1.0, "last gap %g px, want %g (%g pitches)", got, want,
                   every);
  }
  cairo_surface_destroy (s);
}
END_TEST

/* Pixels that differ clearly between A and B in the page box X0..X1, Y0..Y1. */
static gint64
region_diff (cairo_surface_t *a, cairo_surface_t *b, int x0, int y0, int x1, int y1)
{
  gint64 n = 0;

  for (int y = MAX (y0, 0); y < MIN (y1, cairo_image_surface_get_height (a)); y++)
    for (int x = MAX (x0, 0); x < MIN (x1, cairo_image_surface_get_width (a)); x++)
      {
        int p[3], q[3];
        pixel (a, x, y, p);
        pixel (b, x, y, q);
        n += abs (p[0] - q[0]) + abs (p[1] - q[1]) + abs (p[2] - q[2]) > 24;
      }
  return n;
}

/* A tube settler's section carries a detail of its cells (circles or squares) in the top left
 * of the tank; a plate settler's does not, and where the canvas has no room the detail is left
 * out rather than drawn over the tubes. The top-left third of the drawn world box holds it
 * (derived from the layout: the box sits under the water line at the tank's left wall). */
START_TEST (test_sketch_tube_cell_detail)
{
  static const int sz[][2] = { { 1600, 1000 }, { 400, 300 } };

  for (guint k = 0; k < G_N_ELEMENTS (sz); k++)
    {
      cairo_surface_t *img[3];
      BwSketchGeometry g;
      int x0, y0, x1, y1;
      gint64 plate_vs_circle, circle_vs_square;

      for (int shape = 0; shape < 3; shape++)
        {
          g_autoptr (BwProcessUnit) u = bw_process_unit_copy (unit ("east-sed"));
          g_autoptr (GError) error = NULL;
          cairo_t *cr;
          ck_assert (bw_process_unit_set (u, "shape", shape, NULL));
          img[shape] = cairo_image_surface_create (CAIRO_FORMAT_RGB24, sz[k][0], sz[k][1]);
          cr = cairo_create (img[shape]);
          ck_assert_msg (bw_sketch_paint (demo, u, BW_SKETCH_SECTION, BW_UNIT_SYSTEM_SI, bw_style_light (),
                                          cr, sz[k][0], sz[k][1], &error),
                         "%s", error ? error->message : "");
          cairo_destroy (cr);
          cairo_surface_flush (img[shape]);
          if (shape == 0)
            ck_assert (bw_sketch_layout (demo, u, BW_SKETCH_SECTION, BW_UNIT_SYSTEM_SI, bw_style_light (),
                                         sz[k][0], sz[k][1], &g, NULL));
        }
      x0 = (int) (g.origin_x + g.scale * g.world_x0);
      y0 = (int) (g.origin_y - g.scale * g.world_y1);
      x1 = x0 + (int) (g.scale * (g.world_x1 - g.world_x0) / 3);
      y1 = y0 + (int) (g.scale * (g.world_y1 - g.world_y0) / 3);
      plate_vs_circle = region_diff (img[0], img[1], x0, y0, x1, y1);
      circle_vs_square = region_diff (img[1], img[2], x0, y0, x1, y1);
      if (k == 0)
        {
          /* The detail's box (a few thousand pixels at this size) and its cells' shapes. */
          ck_assert_msg (plate_vs_circle > 2000, "no cell detail for circular tubes (%" G_GINT64_FORMAT
                         " pixels differ)", plate_vs_circle);
          ck_assert_msg (circle_vs_square > 50, "circles and squares drawn alike (%" G_GINT64_FORMAT
                         " pixels differ)", circle_vs_square);
        }
      else
        {
          /* No room at 400x300: nothing is added (the plates' and tubes' sections are the same
           * there, the title above the box aside). */
          ck_assert_int_eq (plate_vs_circle, 0);
          ck_assert_int_eq (circle_vs_square, 0);
        }
      for (int shape = 0; shape < 3; shape++)
        cairo_surface_destroy (img[shape]);
    }
}
END_TEST

/* How many times NEEDLE occurs in HAY. */
static guint
count_of (const char *hay, const char *needle)
{
  guint n = 0;

  for (const char *p = strstr (hay, needle); p; p = strstr (p + 1, needle))
    n++;
  return n;
}

/* The text of the demo plate settler's section drawn with SHAPE (0 plates, 1 circular tubes,
 * 2 square tubes) at 1600x1000, from a PDF read back with pdftotext; NULL without pdftotext. */
static char *
tube_section_text (const char *dir, int shape)
{
  g_autoptr (BwProcessUnit) u = bw_process_unit_copy (unit ("east-sed"));
  g_autoptr (GError) error = NULL;
  g_autofree char *pdf = g_build_filename (dir, "tubes.pdf", NULL);
  const char *argv[] = { "pdftotext", pdf, "-", NULL };
  char *text = NULL;
  int status = 0;

  ck_assert (bw_process_unit_set (u, "shape", shape, NULL));
  ck_assert_msg (bw_export_sketch (demo, u, BW_SKETCH_SECTION, BW_UNIT_SYSTEM_SI, bw_style_light (),
                                   BW_EXPORT_PDF, pdf, 1600, 1000, &error),
                 "%s", error ? error->message : "");
  ck_assert (g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_SEARCH_PATH, NULL, NULL, &text, NULL,
                           &status, NULL));
  ck_assert_int_eq (status, 0);
  g_unlink (pdf);
  return text;
}

/* The tube-cell detail says what it shows: its caption with an enlargement above one, and one
 * more dimension of the opening at its true size than the plates' section has (the demo's 50 mm
 * channel spacing, a diameter "Ø 50 mm" for circular tubes, "50 mm" across square ones). */
START_TEST (test_sketch_tube_cell_dimension)
{
  g_autofree char *dir = g_dir_make_tmp ("bw-tube-XXXXXX", NULL);
  g_autofree char *plates = NULL;
  guint base;
  g_autofree char *tool = g_find_program_in_path ("pdftotext");

  ck_assert_ptr_nonnull (dir);
  if (tool == NULL)
    {
      g_printerr ("no pdftotext: the detail's text is not read back\n");
      g_rmdir (dir);
      return;
    }
  plates = tube_section_text (dir, 0);
  ck_assert_ptr_null (strstr (plates, "Tube cells"));
  base = count_of (plates, "50 mm");
  for (int shape = 1; shape < 3; shape++)
    {
      g_autofree char *text = tube_section_text (dir, shape);
      const char *cap = strstr (text, "Tube cells, section A–A, ×");
      ck_assert_msg (cap != NULL, "no detail caption in: %s", text);
      ck_assert_double_gt (g_ascii_strtod (cap + strlen ("Tube cells, section A–A, ×"), NULL), 1.0);
      ck_assert_uint_eq (count_of (text, "50 mm"), base + 1);
      /* (circular tubes: every opening dimension is a diameter) */
      if (shape == 1)
        ck_assert_uint_eq (count_of (text, "Ø 50 mm"), base + 1);
    }
  g_rmdir (dir);
}
END_TEST

START_TEST (test_sketch_light_and_dark)
{
  const Case *k = &cases[_i];
  double light_grey, dark_grey;
  cairo_surface_t *a = paint_image (k, bw_style_light (), BW_UNIT_SYSTEM_SI, 800, 560);
  cairo_surface_t *b = paint_image (k, bw_style_dark (), BW_UNIT_SYSTEM_US, 800, 560);
  const double sa = ink_share (a, bw_style_light ()->paper, &light_grey);
  const double sb = ink_share (b, bw_style_dark ()->paper, &dark_grey);
  ck_assert_msg (sa > 0.03 && sb > 0.03, "ink light %.3f dark %.3f", sa, sb);
  /* the dark sheet is dark: its mean grey well under the light one's */
  ck_assert_msg (dark_grey < 0.5 * light_grey, "mean grey dark %.1f, light %.1f", dark_grey,
                 light_grey);
  cairo_surface_destroy (a);
  cairo_surface_destroy (b);
}
END_TEST

START_TEST (test_style_palette_lightness)
{
  const BwStyle *presets[] = { bw_style_light (), bw_style_dark () };
  for (guint p = 0; p < G_N_ELEMENTS (presets); p++)
    {
      const BwStyle *st = presets[p];
      /* every pair of series colours at least 10 L* apart (our rule, bw-style.c) */
      for (int i = 0; i < BW_STYLE_N_SERIES; i++)
        for (int j = i + 1; j < BW_STYLE_N_SERIES; j++)
          {
            const double d =
                fabs (bw_rgb_lightness (st->series[i]) - bw_rgb_lightness (st->series[j]));
            ck_assert_msg (d >= 10.0, "%s: series %d and %d only %.1f L* apart", st->name, i, j, d);
          }
      /* ink reads on paper, and every series colour stands off the paper */
      ck_assert (fabs (bw_rgb_lightness (st->ink) - bw_rgb_lightness (st->paper)) > 70.0);
      for (int i = 0; i < BW_STYLE_N_SERIES; i++)
        ck_assert_msg (fabs (bw_rgb_lightness (st->series[i]) - bw_rgb_lightness (st->paper))
                           >= 10.0,
                       "%s: series %d too close to the paper", st->name, i);
      /* water and sludge fills differ in lightness from the structure and from each other */
      ck_assert (fabs (bw_rgb_lightness (st->water) - bw_rgb_lightness (st->equipment)) > 20.0);
    }
  /* CIE L* of sRGB white is 100, of black 0, of mid grey #777777 about 50 (CIE 15:2004). */
  ck_assert_double_eq_tol (bw_rgb_lightness ((BwRgb) { 1, 1, 1 }), 100.0, 1e-9);
  ck_assert_double_eq_tol (bw_rgb_lightness ((BwRgb) { 0, 0, 0 }), 0.0, 1e-9);
  ck_assert_double_eq_tol (bw_rgb_lightness ((BwRgb) { 0x77 / 255.0, 0x77 / 255.0, 0x77 / 255.0 }),
                           50.0, 0.5);
}
END_TEST

/* Other inputs than the demo's: every inlet, no weir length, a short weir, a wide basin, an
 * unbaffled tank, every impeller. Each variant paints, inks the sheet and stays on it. */
typedef struct
{
  const char *unit;
  const char *param;
  double value;
} Variant;

static const Variant variants[] = {
  { "north-sed", "inlet", 1 },          { "north-sed", "inlet", 2 },
  { "north-sed", "weir-length", 0 },    { "north-sed", "weir-length", 2.0 },
  { "north-sed", "width", 20.0 },       { "north-sed", "sludge-depth", 1.5 },
  { "north-sed", "weir-length", 500.0 },
  { "north-rm", "baffles", 1 },         { "north-rm", "impeller", 2 },
  { "north-rm", "impeller", 3 },        { "east-rm", "impeller", 0 },
  { "east-rm", "liquid-depth", 4.0 },   { "east-rm", "impeller-diameter", 1.0 },
};

START_TEST (test_sketch_variants)
{
  const Variant *v = &variants[_i];
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProcessUnit) u = bw_process_unit_copy (unit (v->unit));

  ck_assert_msg (bw_process_unit_set (u, v->param, v->value, &error), "%s",
                 error ? error->message : "");
  /* a copy is in no train, so no schematic: its plan and section */
  for (int view = 0; view < BW_SKETCH_SCHEMATIC; view++)
    for (int k = 0; k < N_SIZES; k++)
      {
        cairo_surface_t *rec = cairo_recording_surface_create (CAIRO_CONTENT_COLOR_ALPHA, NULL);
        cairo_surface_t *img = cairo_image_surface_create (CAIRO_FORMAT_RGB24, (int) sizes[k][0],
                                                           (int) sizes[k][1]);
        cairo_t *cr = cairo_create (rec);
        cairo_t *ci = cairo_create (img);
        double x, y, w, h;

        ck_assert_msg (bw_sketch_paint (demo, u, (BwSketchView) view, BW_UNIT_SYSTEM_SI,
                                        bw_style_light (), cr, sizes[k][0], sizes[k][1], &error),
                       "%s %s=%g: %s", v->unit, v->param, v->value, error ? error->message : "");
        ck_assert (bw_sketch_paint (demo, u, (BwSketchView) view, BW_UNIT_SYSTEM_US,
                                    bw_style_dark (), ci, sizes[k][0], sizes[k][1], &error));
        cairo_recording_surface_ink_extents (rec, &x, &y, &w, &h);
        ck_assert_msg (x >= -0.5 && y >= -0.5 && x + w <= sizes[k][0] + 0.5
                           && y + h <= sizes[k][1] + 0.5,
                       "%s %s=%g %s at %gx%g: ink at %g,%g size %gx%g", v->unit, v->param, v->value,
                       bw_sketch_view_name ((BwSketchView) view), sizes[k][0], sizes[k][1], x, y, w,
                       h);
        cairo_surface_flush (img);
        ck_assert (ink_share (img, bw_style_dark ()->paper, NULL) > 0.03);
        cairo_destroy (cr);
        cairo_destroy (ci);
        cairo_surface_destroy (rec);
        cairo_surface_destroy (img);
      }
}
END_TEST

/* Inputs of the new views other than the demo's, set on a copy of the project (a stage is drawn
 * through its flocculator): a vertical paddle shaft with three blade radii, every turbine and an
 * unbaffled one, over-and-under baffles and a coarse and a very fine spacing, an inboard launder,
 * no feed well, a thin sludge zone, tubes of both shapes, a shallow and a steep angle, few and
 * many plates. Each paints every view of the unit it changes (and of the stage itself), inks the
 * sheet and stays on it, in light SI and dark US units. Where the engine refuses the changed
 * project (a custom impeller without its power number), the schematic, which shows results,
 * must refuse too, passing the engine's message on. */
static const Variant new_variants[] = {
  { "east-floc-1", "shaft", 1 },            { "east-floc-1", "blade-radius-3", 0.5 },
  { "east-floc-2", "arms", 6 },             { "east-floc-2", "wheels", 1 },
  { "north-floc-1", "impeller", 0 },        { "north-floc-1", "impeller", 1 },
  { "north-floc-1", "impeller", 3 },        { "north-floc-1", "baffles", 1 },
  { "south-floc-2", "style", 1 },           { "south-floc-1", "spacing", 1.5 },
  { "south-floc-3", "passes", 200 },        { "south-sed", "launder", 1 },
  { "south-sed", "feed-well-diameter", 0 }, { "south-sed", "sludge-depth", 0.05 },
  { "east-sed", "shape", 1 },               { "east-sed", "shape", 2 },
  { "east-sed", "angle", G_PI / 4 },        { "east-sed", "angle", 1.5 },
  { "east-sed", "count", 3 },               { "east-sed", "spacing", 0.3 },
  { "east-sed", "count", 1 },               { "east-sed", "count", 1000000 },
  { "east-sed", "module-area", 40.0 },      { "east-sed", "module-area", 2.0 },
  { "east-sed", "plate-width", 0.2 },
};

START_TEST (test_sketch_new_variants)
{
  const Variant *v = &new_variants[_i];
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) p = bw_project_copy (demo);
  BwProcessUnit *u = bw_project_find_unit (p, v->unit, NULL);
  const BwProcessUnit *drawn[2] = { u, NULL };
  g_autoptr (BwResults) results = NULL;

  ck_assert_ptr_nonnull (u);
  ck_assert_msg (bw_process_unit_set (u, v->param, v->value, &error), "%s",
                 error ? error->message : "");
  if (g_str_equal (v->param, "launder"))
    ck_assert (bw_process_unit_set (u, "launder-radius", 6.0, &error));
  results = bw_project_evaluate (p, NULL);
  /* a stage is drawn alone and in its flocculator */
  for (guint t = 0; bw_process_type_is_stage (u->type) && t < p->trains->len; t++)
    {
      const BwTrain *tr = g_ptr_array_index (p->trains, t);
      for (guint i = 0; i < tr->units->len; i++)
        {
          const BwProcessUnit *f = g_ptr_array_index (tr->units, i);
          for (guint j = 0; f->stages && j < f->stages->len; j++)
            if (g_ptr_array_index (f->stages, j) == u)
              drawn[1] = f;
        }
    }
  for (int d = 0; d < 2 && drawn[d]; d++)
    for (int view = 0; view < BW_N_SKETCH_VIEWS; view++)
      for (int k = 0; k < N_SIZES; k++)
        {
          cairo_surface_t *rec, *img;
          cairo_t *cr, *ci;
          double x, y, w, h;

          if (!bw_sketch_supports (drawn[d]->type, (BwSketchView) view))
            continue;
          if (view == BW_SKETCH_SCHEMATIC && results == NULL)
            {
              cairo_surface_t *one = cairo_image_surface_create (CAIRO_FORMAT_RGB24, 400, 300);
              cairo_t *c1 = cairo_create (one);
              ck_assert (!bw_sketch_paint (p, drawn[d], BW_SKETCH_SCHEMATIC, BW_UNIT_SYSTEM_SI,
                                           bw_style_light (), c1, 400, 300, &error));
              ck_assert_msg (g_str_has_prefix (error->message, "schematic: "), "%s",
                             error->message);
              g_clear_error (&error);
              cairo_destroy (c1);
              cairo_surface_destroy (one);
              continue;
            }
          rec = cairo_recording_surface_create (CAIRO_CONTENT_COLOR_ALPHA, NULL);
          img = cairo_image_surface_create (CAIRO_FORMAT_RGB24, (int) sizes[k][0],
                                            (int) sizes[k][1]);
          cr = cairo_create (rec);
          ci = cairo_create (img);
          ck_assert_msg (bw_sketch_paint (p, drawn[d], (BwSketchView) view, BW_UNIT_SYSTEM_SI,
                                          bw_style_light (), cr, sizes[k][0], sizes[k][1], &error),
                         "%s %s=%g %s: %s", drawn[d]->id, v->param, v->value,
                         bw_sketch_view_name ((BwSketchView) view), error ? error->message : "");
          ck_assert (bw_sketch_paint (p, drawn[d], (BwSketchView) view, BW_UNIT_SYSTEM_US,
                                      bw_style_dark (), ci, sizes[k][0], sizes[k][1], &error));
          cairo_recording_surface_ink_extents (rec, &x, &y, &w, &h);
          ck_assert_msg (x >= -0.5 && y >= -0.5 && x + w <= sizes[k][0] + 0.5
                             && y + h <= sizes[k][1] + 0.5,
                         "%s %s=%g %s at %gx%g: ink at %g,%g size %gx%g", drawn[d]->id, v->param,
                         v->value, bw_sketch_view_name ((BwSketchView) view), sizes[k][0],
                         sizes[k][1], x, y, w, h);
          cairo_surface_flush (img);
          ck_assert (ink_share (img, bw_style_dark ()->paper, NULL) > 0.015);
          cairo_destroy (cr);
          cairo_destroy (ci);
          cairo_surface_destroy (rec);
          cairo_surface_destroy (img);
        }
}
END_TEST

/* --- layout and errors --- */

START_TEST (test_sketch_layout_fits_world)
{
  const Case *k = &cases[_i % N_CASES];
  const double *sz = sizes[_i / N_CASES];
  g_autoptr (GError) error = NULL;
  BwSketchGeometry g;
  ck_assert (bw_sketch_layout (demo, unit (k->unit), k->view, BW_UNIT_SYSTEM_SI, bw_style_light (),
                               sz[0], sz[1], &g, &error));
  /* the world box lands inside the sheet, below the title and above the scale bar */
  ck_assert (g.scale > 0);
  ck_assert (g.origin_x + g.scale * g.world_x0 > 0);
  ck_assert (g.origin_x + g.scale * g.world_x1 < sz[0]);
  ck_assert (g.origin_y - g.scale * g.world_y1 > 0);
  ck_assert (g.origin_y - g.scale * g.world_y0 < g.bar_y);
  ck_assert_double_eq_tol (g.bar_width, g.scale * g.bar_length_m, 1e-9);
}
END_TEST

START_TEST (test_sketch_refuses)
{
  g_autoptr (GError) error = NULL;
  BwSketchGeometry g;
  cairo_surface_t *s = cairo_image_surface_create (CAIRO_FORMAT_RGB24, 400, 300);
  cairo_surface_t *bad;
  cairo_t *cr = cairo_create (s);

  /* an in-line mixer has no geometry to draw */
  ck_assert (!bw_sketch_paint (demo, unit ("south-mix"), BW_SKETCH_PLAN, BW_UNIT_SYSTEM_SI,
                               bw_style_light (), cr, 400, 300, &error));
  bw_assert_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_UNSUPPORTED, "south-mix");
  g_clear_error (&error);
  /* a settler's plan needs room for one row of plates in the module area entered (one row of
   * the demo's plates covers 1.2 m x 0.75 m = 0.9 m², derived) */
  {
    g_autoptr (BwProcessUnit) u = bw_process_unit_copy (unit ("east-sed"));
    ck_assert (bw_process_unit_set (u, "module-area", 0.5, &error));
    ck_assert (!bw_sketch_paint (demo, u, BW_SKETCH_PLAN, BW_UNIT_SYSTEM_SI, bw_style_light (), cr,
                                 400, 300, &error));
    bw_assert_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_GEOMETRY, "module-area:");
    g_clear_error (&error);
    /* the section does not use the module area, and still draws */
    ck_assert (bw_sketch_paint (demo, u, BW_SKETCH_SECTION, BW_UNIT_SYSTEM_SI, bw_style_light (),
                                cr, 400, 300, &error));
  }
  ck_assert (!bw_sketch_layout (demo, unit ("north-sed"), BW_SKETCH_PLAN, BW_UNIT_SYSTEM_SI,
                                bw_style_light (), 100, 300, &g, &error));
  bw_assert_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_SIZE, "size:");
  g_clear_error (&error);
  ck_assert (!bw_sketch_layout (demo, unit ("north-sed"), BW_SKETCH_PLAN, BW_UNIT_SYSTEM_SI,
                                bw_style_light (), NAN, 300, &g, &error));
  bw_assert_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_SIZE, "size:");
  g_clear_error (&error);
  cairo_destroy (cr);
  cairo_surface_destroy (s);

  /* a cairo context already in error */
  bad = cairo_image_surface_create (CAIRO_FORMAT_RGB24, -1, -1);
  cr = cairo_create (bad);
  ck_assert (!bw_sketch_paint (demo, unit ("north-sed"), BW_SKETCH_PLAN, BW_UNIT_SYSTEM_SI,
                               bw_style_light (), cr, 400, 300, &error));
  bw_assert_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_CAIRO, "cairo:");
  cairo_destroy (cr);
  cairo_surface_destroy (bad);
}
END_TEST

START_TEST (test_sketch_view_names)
{
  BwSketchView v;
  ck_assert (bw_sketch_view_from_name ("plan", &v) && v == BW_SKETCH_PLAN);
  ck_assert (bw_sketch_view_from_name ("section", &v) && v == BW_SKETCH_SECTION);
  ck_assert (!bw_sketch_view_from_name ("elevation", &v));
  ck_assert (!bw_sketch_view_from_name (NULL, &v));
  ck_assert (bw_sketch_view_from_name ("schematic", &v) && v == BW_SKETCH_SCHEMATIC);
  ck_assert (bw_sketch_supports (BW_PROCESS_RAPID_MIX, BW_SKETCH_SECTION));
  ck_assert (bw_sketch_supports (BW_PROCESS_FLOCCULATOR, BW_SKETCH_PLAN));
  ck_assert (bw_sketch_supports (BW_STAGE_BAFFLED, BW_SKETCH_SECTION));
  ck_assert (bw_sketch_supports (BW_PROCESS_PLATE_SETTLER, BW_SKETCH_PLAN));
  ck_assert (!bw_sketch_supports (BW_PROCESS_INLINE_MIXER, BW_SKETCH_SECTION));
  ck_assert (bw_sketch_supports (BW_PROCESS_INLINE_MIXER, BW_SKETCH_SCHEMATIC));
  {
    g_autofree char *a = bw_sketch_views_of (BW_PROCESS_CIRCULAR_CLARIFIER);
    g_autofree char *b = bw_sketch_views_of (BW_PROCESS_INLINE_MIXER);
    g_autofree char *c = bw_sketch_views_of (BW_PROCESS_PLATE_SETTLER);
    ck_assert_str_eq (a, "plan|section|schematic");
    ck_assert_str_eq (b, "schematic");
    ck_assert_str_eq (c, "plan|section|schematic");
  }
}
END_TEST

/* --- export --- */

/* NEEDLE in the first LEN bytes of DATA, which may hold NUL bytes (a compressed PDF does). */
static gboolean
contains (const char *data, gsize len, const char *needle)
{
  const gsize n = strlen (needle);
  for (gsize i = 0; i + n <= len; i++)
    if (memcmp (data + i, needle, n) == 0)
      return TRUE;
  return FALSE;
}

static char *tmpdir;

static void
make_tmp (void)
{
  tmpdir = g_dir_make_tmp ("bw-draw-XXXXXX", NULL);
  ck_assert_ptr_nonnull (tmpdir);
}

static void
remove_tmp (void)
{
  g_autoptr (GDir) d = g_dir_open (tmpdir, 0, NULL);
  const char *n;
  while (d && (n = g_dir_read_name (d)))
    {
      g_autofree char *p = g_build_filename (tmpdir, n, NULL);
      g_unlink (p);
    }
  g_rmdir (tmpdir);
  g_clear_pointer (&tmpdir, g_free);
}

static guint
count_files (void)
{
  g_autoptr (GDir) d = g_dir_open (tmpdir, 0, NULL);
  guint n = 0;
  while (d && g_dir_read_name (d))
    n++;
  return n;
}

START_TEST (test_export_formats)
{
  static const struct
  {
    BwExportFormat format;
    const char *file;
  } files[] = {
    { BW_EXPORT_PNG, "s.png" }, { BW_EXPORT_SVG, "s.svg" }, { BW_EXPORT_PDF, "s.pdf" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (files); i++)
    {
      g_autoptr (GError) error = NULL;
      g_autofree char *path = g_build_filename (tmpdir, files[i].file, NULL);
      g_autofree char *data = NULL;
      gsize len = 0;
      ck_assert_msg (bw_export_sketch (demo, unit ("north-sed"), BW_SKETCH_SECTION,
                                       BW_UNIT_SYSTEM_SI, bw_style_light (), files[i].format, path,
                                       640, 420, &error),
                     "%s: %s", files[i].file, error ? error->message : "");
      ck_assert (g_file_get_contents (path, &data, &len, NULL));
      switch (files[i].format)
        {
        case BW_EXPORT_PNG:
          ck_assert (len > 8 && memcmp (data, "\x89PNG\r\n\x1a\n", 8) == 0);
          {
            cairo_surface_t *back = cairo_image_surface_create_from_png (path);
            ck_assert_int_eq (cairo_surface_status (back), CAIRO_STATUS_SUCCESS);
            ck_assert_int_eq (cairo_image_surface_get_width (back), 640);
            ck_assert_int_eq (cairo_image_surface_get_height (back), 420);
            cairo_surface_destroy (back);
          }
          break;
        case BW_EXPORT_SVG:
          ck_assert (g_str_has_prefix (data, "<svg") || g_str_has_prefix (data, "<?xml"));
          ck_assert (contains (data, len, "<svg"));
          ck_assert (contains (data, len, "width=\"640pt\""));
          break;
        case BW_EXPORT_PDF:
          ck_assert (len > 5 && memcmp (data, "%PDF-", 5) == 0);
          ck_assert (contains (data, len, "/MediaBox [ 0 0 640 420 ]"));
          break;
        default:
          ck_abort ();
        }
    }
  /* the three files and no leftover temporary */
  ck_assert_uint_eq (count_files (), 3);
}
END_TEST

START_TEST (test_export_errors)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *missing = g_build_filename (tmpdir, "no-such-dir", "s.pdf", NULL);
  g_autofree char *ok = g_build_filename (tmpdir, "s.png", NULL);

  ck_assert (!bw_export_sketch (demo, unit ("north-rm"), BW_SKETCH_PLAN, BW_UNIT_SYSTEM_SI,
                                bw_style_light (), BW_EXPORT_PDF, missing, 400, 300, &error));
  bw_assert_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_WRITE, missing);
  g_clear_error (&error);
  ck_assert (!bw_export_sketch (demo, unit ("south-mix"), BW_SKETCH_PLAN, BW_UNIT_SYSTEM_SI,
                                bw_style_light (), BW_EXPORT_PNG, ok, 400, 300, &error));
  bw_assert_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_UNSUPPORTED, "south-mix");
  g_clear_error (&error);
  ck_assert (!bw_export_sketch (demo, unit ("north-rm"), BW_SKETCH_PLAN, BW_UNIT_SYSTEM_SI,
                                bw_style_light (), BW_EXPORT_PNG, ok, 400.5, 300, &error));
  bw_assert_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_SIZE, "whole pixels");
  /* nothing written, not even a temporary */
  ck_assert_uint_eq (count_files (), 0);
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("draw");
  TCase *tc = tcase_create ("paint");
  tcase_add_unchecked_fixture (tc, load_demo, free_demo);
  tcase_add_loop_test (tc, test_sketch_paint_not_blank, 0, N_CASES * N_SIZES);
  tcase_add_loop_test (tc, test_sketch_ink_within_canvas, 0, N_CASES * N_SIZES);
  tcase_add_loop_test (tc, test_sketch_scale_bar_matches_label, 0, N_CASES * N_SIZES * 2);
  tcase_add_loop_test (tc, test_sketch_drawn_to_scale, 0, N_SIZES);
  tcase_add_loop_test (tc, test_sketch_new_views_to_scale, 0, N_SIZES);
  tcase_add_loop_test (tc, test_sketch_settler_plan_to_scale, 0, N_SIZES);
  tcase_add_test (tc, test_sketch_tube_cell_detail);
  tcase_add_test (tc, test_sketch_tube_cell_dimension);
  tcase_add_loop_test (tc, test_sketch_light_and_dark, 0, N_CASES);
  tcase_add_loop_test (tc, test_sketch_layout_fits_world, 0, N_CASES * N_SIZES);
  tcase_add_loop_test (tc, test_sketch_variants, 0, G_N_ELEMENTS (variants));
  tcase_add_loop_test (tc, test_sketch_new_variants, 0, G_N_ELEMENTS (new_variants));
  tcase_add_test (tc, test_sketch_refuses);
  tcase_add_test (tc, test_sketch_view_names);
  tcase_add_test (tc, test_style_palette_lightness);
  suite_add_tcase (s, tc);

  tc = tcase_create ("export");
  tcase_add_unchecked_fixture (tc, load_demo, free_demo);
  tcase_add_checked_fixture (tc, make_tmp, remove_tmp);
  tcase_add_test (tc, test_export_formats);
  tcase_add_test (tc, test_export_errors);
  suite_add_tcase (s, tc);
  return s;
}
