/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-chart.c: the chart painter (x-y charts and status matrices), its layout and hit-test.
 *
 * Layout in brief: the style's lengths are for an 800 x 560 canvas and scale with the canvas
 * (never below 0.8, so a 400 x 300 thumbnail keeps legible type). Margins come from the measured
 * tick labels and titles; the axes come from engine/bw-axis with a tick target that suits the
 * plot's size; the legend goes in the first plot corner that covers no data, else outside. */
#include "config.h"

#include "draw/bw-chart.h"
#include "draw/bw-labels.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <pango/pangocairo.h>
#include <string.h>

/* Reference canvas of the style's lengths (see bw-style.h) and the smallest scale used. */
#define REF_WIDTH 800.0
#define REF_HEIGHT 560.0
#define MIN_SCALE 0.8

/* --- building --- */

static void
axis_clear (BwChartAxis *a)
{
  g_clear_pointer (&a->title, g_free);
  g_clear_pointer (&a->unit, g_free);
  g_clear_pointer (&a->categories, g_ptr_array_unref);
}

static void
series_free (BwChartSeries *s)
{
  g_free (s->label);
  g_array_unref (s->x);
  g_array_unref (s->y);
  g_free (s);
}

static void
band_free (BwChartBand *b)
{
  g_free (b->label);
  g_free (b);
}

static void
rule_free (BwChartRule *r)
{
  g_free (r->label);
  g_free (r);
}

static void
note_free (BwChartNote *n)
{
  g_free (n->text);
  g_free (n);
}

BwChart *
bw_chart_new (BwChartKind kind, const char *title)
{
  BwChart *c = g_new0 (BwChart, 1);

  c->kind = kind;
  c->title = g_strdup (title);
  c->show_legend = TRUE;
  c->series = g_ptr_array_new_with_free_func ((GDestroyNotify) series_free);
  c->bands = g_ptr_array_new_with_free_func ((GDestroyNotify) band_free);
  c->rules = g_ptr_array_new_with_free_func ((GDestroyNotify) rule_free);
  c->notes = g_ptr_array_new_with_free_func ((GDestroyNotify) note_free);
  return c;
}

void
bw_chart_free (BwChart *c)
{
  if (c == NULL)
    return;
  g_free (c->title);
  g_free (c->subtitle);
  g_free (c->footnote);
  axis_clear (&c->x);
  axis_clear (&c->y);
  axis_clear (&c->y2);
  g_ptr_array_unref (c->series);
  g_ptr_array_unref (c->bands);
  g_ptr_array_unref (c->rules);
  g_ptr_array_unref (c->notes);
  g_clear_pointer (&c->matrix.row_labels, g_ptr_array_unref);
  g_clear_pointer (&c->matrix.row_groups, g_ptr_array_unref);
  g_clear_pointer (&c->matrix.col_levels, g_ptr_array_unref);
  g_free (c->matrix.cells);
  g_free (c);
}

void
bw_chart_axis_set (BwChartAxis *axis, BwAxisScale scale, const char *title, const char *unit)
{
  g_return_if_fail (axis != NULL);
  axis->scale = scale;
  g_free (axis->title);
  axis->title = g_strdup (title);
  g_free (axis->unit);
  axis->unit = g_strdup (unit);
  axis->log_minor = BW_LOG_MINOR_2_5;
}

void
bw_chart_axis_add_category (BwChartAxis *axis, const char *label)
{
  g_return_if_fail (axis != NULL && label != NULL);
  if (axis->categories == NULL)
    axis->categories = g_ptr_array_new_with_free_func (g_free);
  g_ptr_array_add (axis->categories, g_strdup (label));
}

BwChartSeries *
bw_chart_add_series (BwChart *chart, const char *label, BwSeriesKind kind, guint colour,
                     BwMarker marker, BwDash dash, gboolean line)
{
  BwChartSeries *s;

  g_return_val_if_fail (chart != NULL, NULL);
  s = g_new0 (BwChartSeries, 1);
  s->label = g_strdup (label);
  s->kind = kind;
  s->colour = colour;
  s->marker = marker;
  s->dash = dash;
  s->line = line;
  s->x = g_array_new (FALSE, FALSE, sizeof (double));
  s->y = g_array_new (FALSE, FALSE, sizeof (double));
  g_ptr_array_add (chart->series, s);
  return s;
}

void
bw_chart_series_add (BwChartSeries *s, double x, double y)
{
  g_return_if_fail (s != NULL);
  g_array_append_val (s->x, x);
  g_array_append_val (s->y, y);
}

BwChartBand *
bw_chart_add_band (BwChart *chart, gboolean vertical, double from, double to, const char *label,
                   guint colour)
{
  BwChartBand *b = g_new0 (BwChartBand, 1);

  b->vertical = vertical;
  b->from = MIN (from, to);
  b->to = MAX (from, to);
  b->label = g_strdup (label);
  b->colour = colour;
  g_ptr_array_add (chart->bands, b);
  return b;
}

BwChartRule *
bw_chart_add_rule (BwChart *chart, gboolean vertical, double value, const char *label,
                   guint colour, BwDash dash)
{
  BwChartRule *r = g_new0 (BwChartRule, 1);

  r->vertical = vertical;
  r->value = value;
  r->label = g_strdup (label);
  r->colour = colour;
  r->dash = dash;
  g_ptr_array_add (chart->rules, r);
  return r;
}

BwChartNote *
bw_chart_add_note (BwChart *chart, double x, double y, const char *text)
{
  BwChartNote *n = g_new0 (BwChartNote, 1);

  n->x = x;
  n->y = y;
  n->text = g_strdup (text);
  n->ring = TRUE;
  g_ptr_array_add (chart->notes, n);
  return n;
}

void
bw_chart_matrix_init (BwChart *chart, guint n_rows, guint n_cols)
{
  BwChartMatrix *m = &chart->matrix;

  g_return_if_fail (chart != NULL);
  m->n_rows = n_rows;
  m->n_cols = n_cols;
  g_free (m->cells);
  m->cells = g_new (BwCheckStatus, MAX (1u, n_rows * n_cols));
  for (guint i = 0; i < n_rows * n_cols; i++)
    m->cells[i] = BW_CHECK_NOT_APPLICABLE;
  g_clear_pointer (&m->row_labels, g_ptr_array_unref);
  g_clear_pointer (&m->row_groups, g_ptr_array_unref);
  g_clear_pointer (&m->col_levels, g_ptr_array_unref);
  m->row_labels = g_ptr_array_new_with_free_func (g_free);
  m->col_levels = g_ptr_array_new_with_free_func ((GDestroyNotify) g_ptr_array_unref);
}

void
bw_chart_matrix_set (BwChart *chart, guint row, guint col, BwCheckStatus status)
{
  g_return_if_fail (chart != NULL && row < chart->matrix.n_rows && col < chart->matrix.n_cols);
  chart->matrix.cells[row * chart->matrix.n_cols + col] = status;
}

/* --- colours --- */

static BwRgb
mix (BwRgb a, BwRgb b, double t)
{
  BwRgb c = { a.r + (b.r - a.r) * t, a.g + (b.g - a.g) * t, a.b + (b.b - a.b) * t };
  return c;
}

/* Series colour I is the style's palette entry with the I-th largest lightness difference from
 * the paper: 0 is always the strongest line on either preset, the last ones suit fills. (The
 * light preset's palette is already in that order; the dark one's is the reverse.) */
BwRgb
bw_chart_colour (const BwStyle *style, guint index)
{
  guint order[BW_STYLE_N_SERIES];
  const double lp = bw_rgb_lightness (style->paper);

  if (index == BW_CHART_INK)
    return style->ink;
  if (index == BW_CHART_MUTED)
    return style->ink_muted;
  for (guint i = 0; i < BW_STYLE_N_SERIES; i++)
    order[i] = i;
  for (guint i = 1; i < BW_STYLE_N_SERIES; i++)
    for (guint j = i; j > 0; j--)
      {
        double a = fabs (bw_rgb_lightness (style->series[order[j]]) - lp);
        double b = fabs (bw_rgb_lightness (style->series[order[j - 1]]) - lp);
        if (a > b)
          {
            guint t = order[j];
            order[j] = order[j - 1];
            order[j - 1] = t;
          }
      }
  return style->series[order[index % BW_STYLE_N_SERIES]];
}

/* The palette entry that scores highest on SCORE: the status colours are picked by hue from
 * whatever palette the preset has (blue for pass, yellow for warn, orange-red for fail), so a
 * new preset needs no table here. */
static BwRgb
pick_hue (const BwStyle *style, double (*score) (BwRgb))
{
  guint best = 0;
  for (guint i = 1; i < BW_STYLE_N_SERIES; i++)
    if (score (style->series[i]) > score (style->series[best]))
      best = i;
  return style->series[best];
}

static double
score_blue (BwRgb c)
{
  return c.b - c.r;
}

static double
score_yellow (BwRgb c)
{
  return MIN (c.r, c.g) - c.b;
}

static double
score_red (BwRgb c)
{
  return c.r - 0.5 * (c.g + c.b);
}

void
bw_chart_colours (const BwStyle *style, BwChartColours *out)
{
  g_return_if_fail (style != NULL && out != NULL);
  out->grid = mix (style->paper, style->ink, 0.17);
  out->grid_minor = mix (style->paper, style->ink, 0.07);
  /* The three states differ in CIE L* by at least 10 on either preset (tests/draw checks), so a
   * greyscale copy keeps them apart; each cell also carries its own glyph (check, triangle,
   * cross; hatching for n/a). Pass stays quiet, nearest the paper. */
  if (bw_rgb_lightness (style->paper) > 50)
    {
      out->pass = mix (style->paper, pick_hue (style, score_blue), 0.25);
      out->warn = pick_hue (style, score_yellow);
      out->fail = pick_hue (style, score_red);
    }
  else
    {
      out->pass = mix (style->paper, pick_hue (style, score_blue), 0.3);
      out->warn = mix (style->paper, pick_hue (style, score_yellow), 0.85);
      out->fail = mix (pick_hue (style, score_red), style->ink, 0.3);
    }
  out->not_applicable = mix (style->paper, style->ink_muted, 0.08);
}

static void
set_rgb (cairo_t *cr, BwRgb c)
{
  cairo_set_source_rgb (cr, c.r, c.g, c.b);
}

static void
set_rgba (cairo_t *cr, BwRgb c, double a)
{
  cairo_set_source_rgba (cr, c.r, c.g, c.b, a);
}

/* --- text --- */

typedef struct
{
  cairo_t *cr;
  const BwStyle *style;
  double s;      /* scale */
  double body;   /* font sizes, page units */
  double small;
  double title;
} Ctx;

static PangoLayout *
text_layout (const Ctx *c, const char *text, double size, gboolean bold)
{
  PangoLayout *l = pango_cairo_create_layout (c->cr);
  PangoFontDescription *fd = pango_font_description_from_string (c->style->font_family);
  cairo_font_options_t *fo = cairo_font_options_create ();

  /* Unhinted metrics: text measures the same on every surface and at every size. */
  cairo_font_options_set_hint_metrics (fo, CAIRO_HINT_METRICS_OFF);
  cairo_font_options_set_hint_style (fo, CAIRO_HINT_STYLE_NONE);
  pango_cairo_context_set_font_options (pango_layout_get_context (l), fo);
  pango_layout_context_changed (l);
  cairo_font_options_destroy (fo);
  pango_font_description_set_absolute_size (fd, size * PANGO_SCALE);
  if (bold)
    pango_font_description_set_weight (fd, PANGO_WEIGHT_BOLD);
  pango_layout_set_font_description (l, fd);
  pango_font_description_free (fd);
  {
    /* The chart's numbers with the reader's decimal separator (bw_label_number). */
    g_autofree char *shown = bw_label_number (text ? text : "");
    pango_layout_set_text (l, shown, -1);
  }
  return l;
}

static void
layout_size (PangoLayout *l, double *w, double *h)
{
  PangoRectangle ink, logical;
  pango_layout_get_extents (l, &ink, &logical);
  if (w && pango_layout_get_width (l) > 0 && pango_layout_get_alignment (l) == PANGO_ALIGN_CENTER)
    *w = pango_layout_get_width (l) / (double) PANGO_SCALE; /* centred in its set width */
  else if (w)
    *w = MAX (logical.width, ink.x + ink.width) / (double) PANGO_SCALE;
  if (h)
    *h = logical.height / (double) PANGO_SCALE;
}

static double
text_width (const Ctx *c, const char *text, double size, gboolean bold)
{
  double w;
  PangoLayout *l = text_layout (c, text, size, bold);
  layout_size (l, &w, NULL);
  g_object_unref (l);
  return w;
}

static double
line_height (const Ctx *c, double size)
{
  double h;
  PangoLayout *l = text_layout (c, "Mg", size, FALSE);
  layout_size (l, NULL, &h);
  g_object_unref (l);
  return h;
}

/* Limits L to MAX_W, ending in an ellipsis. */
static void
layout_limit (PangoLayout *l, double max_w)
{
  pango_layout_set_width (l, (int) (MAX (1.0, max_w) * PANGO_SCALE));
  pango_layout_set_ellipsize (l, PANGO_ELLIPSIZE_END);
}

/* Draws L with its box's anchor point at X, Y: AX, AY in 0 (left/top) .. 1 (right/bottom). The
 * box is kept inside BOUNDS when given. A HALO of paper behind it when > 0 (its opacity). */
static void
draw_layout (const Ctx *c, PangoLayout *l, double x, double y, double ax, double ay,
             const BwRect *bounds, double halo, BwRgb colour)
{
  double w, h, x0, y0;

  layout_size (l, &w, &h);
  x0 = x - ax * w;
  y0 = y - ay * h;
  if (bounds)
    {
      x0 = CLAMP (x0, bounds->x, MAX (bounds->x, bounds->x + bounds->width - w));
      y0 = CLAMP (y0, bounds->y, MAX (bounds->y, bounds->y + bounds->height - h));
    }
  if (halo > 0)
    {
      double m = 1.5 * c->s;
      set_rgba (c->cr, c->style->paper, halo);
      cairo_rectangle (c->cr, x0 - m, y0, w + 2 * m, h);
      cairo_fill (c->cr);
    }
  set_rgb (c->cr, colour);
  cairo_move_to (c->cr, x0, y0);
  pango_cairo_show_layout (c->cr, l);
}

static void
draw_text (const Ctx *c, const char *text, double size, gboolean bold, double x, double y,
           double ax, double ay, const BwRect *bounds, double halo, BwRgb colour)
{
  PangoLayout *l = text_layout (c, text, size, bold);
  if (bounds)
    layout_limit (l, bounds->width);
  draw_layout (c, l, x, y, ax, ay, bounds, halo, colour);
  g_object_unref (l);
}

/* --- x-y layout --- */

static double
chart_scale (double w, double h)
{
  return MAX (MIN_SCALE, MIN (w / REF_WIDTH, h / REF_HEIGHT));
}

static gboolean
usable (const BwChartAxis *a, double v)
{
  return isfinite (v) && (a->scale != BW_AXIS_LOG || v > 0);
}

typedef struct
{
  gboolean any;
  double lo, hi;
} Extent;

static void
extent_add (Extent *e, const BwChartAxis *a, double v)
{
  if (!usable (a, v))
    return;
  if (!e->any)
    {
      e->lo = e->hi = v;
      e->any = TRUE;
    }
  else
    {
      e->lo = MIN (e->lo, v);
      e->hi = MAX (e->hi, v);
    }
}

static void
chart_extents (const BwChart *ch, Extent *ex, Extent *ey, Extent *ey2)
{
  memset (ex, 0, sizeof *ex);
  memset (ey, 0, sizeof *ey);
  memset (ey2, 0, sizeof *ey2);
  for (guint i = 0; i < ch->series->len; i++)
    {
      const BwChartSeries *s = g_ptr_array_index (ch->series, i);
      const BwChartAxis *ya = s->y2 ? &ch->y2 : &ch->y;
      Extent *e = s->y2 ? ey2 : ey;
      for (guint j = 0; j < s->x->len; j++)
        {
          double x = g_array_index (s->x, double, j), y = g_array_index (s->y, double, j);
          if (!usable (&ch->x, x) || !usable (ya, y))
            continue;
          extent_add (ex, &ch->x, x);
          extent_add (e, ya, y);
          if (s->kind == BW_SERIES_BARS && ya->scale == BW_AXIS_LINEAR)
            extent_add (e, ya, 0.0);
        }
    }
  for (guint i = 0; i < ch->bands->len; i++)
    {
      const BwChartBand *b = g_ptr_array_index (ch->bands, i);
      if (b->vertical)
        {
          extent_add (ex, &ch->x, b->from);
          extent_add (ex, &ch->x, b->to);
        }
      else
        {
          extent_add (b->y2 ? ey2 : ey, b->y2 ? &ch->y2 : &ch->y, b->from);
          extent_add (b->y2 ? ey2 : ey, b->y2 ? &ch->y2 : &ch->y, b->to);
        }
    }
  for (guint i = 0; i < ch->rules->len; i++)
    {
      const BwChartRule *r = g_ptr_array_index (ch->rules, i);
      const BwChartAxis *a = r->vertical ? &ch->x : r->y2 ? &ch->y2 : &ch->y;
      Extent *e = r->vertical ? ex : r->y2 ? ey2 : ey;
      /* A little room either side, so a rule never lies on the frame. */
      if (a->scale == BW_AXIS_LOG)
        {
          extent_add (e, a, r->value / 1.1);
          extent_add (e, a, r->value * 1.1);
        }
      else
        {
          extent_add (e, a, r->value - 0.04 * fabs (r->value));
          extent_add (e, a, r->value + 0.04 * fabs (r->value));
        }
    }
  for (guint i = 0; i < ch->notes->len; i++)
    {
      const BwChartNote *n = g_ptr_array_index (ch->notes, i);
      extent_add (ex, &ch->x, n->x);
      extent_add (n->y2 ? ey2 : ey, n->y2 ? &ch->y2 : &ch->y, n->y);
    }
}

static gboolean
resolve_axis (const BwChartAxis *a, const Extent *e, guint target, BwAxis *out)
{
  target = CLAMP (target, 2u, (guint) BW_AXIS_MAX_TARGET);
  if (a->categories && a->categories->len > 0)
    {
      memset (out, 0, sizeof *out);
      out->scale = BW_AXIS_LINEAR;
      out->lo = -0.5;
      out->hi = a->categories->len - 0.5;
      out->step = 1;
      for (guint i = 0; i < a->categories->len && i < BW_AXIS_MAX_TICKS; i++)
        out->major[out->n_major++] = i;
      return TRUE;
    }
  if (a->fixed)
    return bw_axis_fixed (a->scale, a->min, a->max, target, a->log_minor, out, NULL);
  if (!e->any)
    return FALSE;
  if (a->scale == BW_AXIS_LOG)
    return bw_axis_log (e->lo, e->hi, target, a->log_minor, out, NULL);
  return bw_axis_linear (e->lo, e->hi, target, a->include_zero, out, NULL);
}

static char *
tick_label (const BwChartAxis *spec, const BwAxis *a, guint i)
{
  if (spec->categories && i < spec->categories->len)
    return g_strdup (g_ptr_array_index (spec->categories, i));
  return bw_axis_format_tick (a, a->major[i]);
}

static char *
axis_title (const BwChartAxis *spec, const BwAxis *a)
{
  g_autofree char *factor = bw_axis_format_factor (a);
  GString *s = g_string_new (spec->title ? spec->title : "");

  if (spec->unit || factor)
    {
      g_string_append (s, s->len ? " (" : "(");
      if (factor)
        g_string_append (s, factor);
      if (factor && spec->unit)
        g_string_append (s, " ");
      if (spec->unit)
        g_string_append (s, spec->unit);
      g_string_append (s, ")");
    }
  return g_string_free (s, FALSE);
}

/* Widest and tallest major tick label of A. */
static void
labels_size (const Ctx *c, const BwChartAxis *spec, const BwAxis *a, double *w, double *h)
{
  *w = *h = 0;
  for (guint i = 0; i < a->n_major; i++)
    {
      g_autofree char *t = tick_label (spec, a, i);
      PangoLayout *l = text_layout (c, t, c->body, FALSE);
      double lw, lh;
      layout_size (l, &lw, &lh);
      g_object_unref (l);
      *w = MAX (*w, lw);
      *h = MAX (*h, lh);
    }
}

typedef struct
{
  double top, left, right, bottom; /* margins */
  double title_h, sub_h;
} Margins;

static double
tick_len (const Ctx *c)
{
  return 4.5 * c->s;
}

static double
pad (const Ctx *c)
{
  return 12 * c->s;
}

/* Legend entry metrics. */
static double
legend_swatch (const Ctx *c)
{
  return 24 * c->s;
}

static guint
legend_entries (const BwChart *ch)
{
  guint n = 0;
  for (guint i = 0; i < ch->series->len; i++)
    if (((BwChartSeries *) g_ptr_array_index (ch->series, i))->label)
      n++;
  return n;
}

static void
legend_size (const Ctx *c, const BwChart *ch, double max_text_w, double *w, double *h)
{
  double tw = 0, lh = line_height (c, c->small) * 1.15;
  guint n = 0;

  for (guint i = 0; i < ch->series->len; i++)
    {
      const BwChartSeries *s = g_ptr_array_index (ch->series, i);
      if (!s->label)
        continue;
      tw = MAX (tw, MIN (max_text_w, text_width (c, s->label, c->small, FALSE)));
      n++;
    }
  *w = 6 * c->s + legend_swatch (c) + 5 * c->s + tw + 6 * c->s;
  *h = n * lh + 8 * c->s;
}

/* Page points of series S through FRAME, for collision tests and the hit-test; gaps skipped. */
typedef struct
{
  double x, y;
  guint index;
} PagePoint;

static GArray *
series_page_points (const BwChart *ch, const BwChartFrame *f, const BwChartSeries *s)
{
  GArray *pts = g_array_new (FALSE, FALSE, sizeof (PagePoint));
  const BwChartAxis *ya = s->y2 ? &ch->y2 : &ch->y;

  for (guint j = 0; j < s->x->len; j++)
    {
      double x = g_array_index (s->x, double, j), y = g_array_index (s->y, double, j);
      PagePoint p;
      if (!usable (&ch->x, x) || !usable (ya, y))
        continue;
      bw_chart_frame_to_page (f, s->y2, x, y, &p.x, &p.y);
      p.index = j;
      g_array_append_val (pts, p);
    }
  return pts;
}

static gboolean
in_rect (const BwRect *r, double x, double y, double grow)
{
  return x >= r->x - grow && x <= r->x + r->width + grow && y >= r->y - grow
         && y <= r->y + r->height + grow;
}

/* The bar drawn for point P of bar series SERIES_I: bars of all bar series share 70 % of one
 * category (or one x step), side by side in series order, from the axis base. */
static void
bar_rect (const BwChart *ch, const BwChartFrame *f, guint series_i, const PagePoint *p,
          BwRect *out)
{
  const BwChartSeries *s = g_ptr_array_index (ch->series, series_i);
  const BwAxis *ya = s->y2 && f->has_y2 ? &f->y2 : &f->y;
  guint n_bars = 0, bar_i = 0;
  double unit, slot, base;

  for (guint i = 0; i < ch->series->len; i++)
    if (((BwChartSeries *) g_ptr_array_index (ch->series, i))->kind == BW_SERIES_BARS)
      {
        if (i < series_i)
          bar_i++;
        n_bars++;
      }
  unit = ch->x.categories ? 1.0 : (f->x.n_major > 1 ? f->x.major[1] - f->x.major[0] : 1);
  slot = fabs (bw_axis_to_page (&f->x, f->x.lo + unit, 0, f->plot.width)
               - bw_axis_to_page (&f->x, f->x.lo, 0, f->plot.width))
         * 0.7 / MAX (1u, n_bars);
  base = bw_axis_to_page (ya, ya->scale == BW_AXIS_LINEAR ? MAX (ya->lo, MIN (0.0, ya->hi))
                                                          : ya->lo,
                          f->plot.y + f->plot.height, f->plot.y);
  out->x = p->x - 0.5 * n_bars * slot + bar_i * slot + 0.5 * f->scale;
  out->width = slot - 1.0 * f->scale;
  out->y = MIN (p->y, base);
  out->height = fabs (base - p->y);
}

static gboolean
rects_meet (const BwRect *a, const BwRect *b, double grow)
{
  return a->x - grow < b->x + b->width && b->x < a->x + a->width + grow
         && a->y - grow < b->y + b->height && b->y < a->y + a->height + grow;
}

/* TRUE when any data of CH (points, the lines between them, bars, notes) falls in BOX. */
static gboolean
covers_data (const BwChart *ch, const BwChartFrame *f, const BwRect *box, double grow)
{
  for (guint i = 0; i < ch->series->len; i++)
    {
      const BwChartSeries *s = g_ptr_array_index (ch->series, i);
      g_autoptr (GArray) pts = series_page_points (ch, f, s);
      for (guint j = 0; j < pts->len; j++)
        {
          const PagePoint *p = &g_array_index (pts, PagePoint, j);
          if (in_rect (box, p->x, p->y, grow))
            return TRUE;
          if (s->kind == BW_SERIES_BARS)
            {
              BwRect bar;
              bar_rect (ch, f, i, p, &bar);
              if (rects_meet (&bar, box, grow))
                return TRUE;
            }
          if (s->line && j > 0)
            {
              const PagePoint *q = &g_array_index (pts, PagePoint, j - 1);
              double len = hypot (p->x - q->x, p->y - q->y);
              int n = (int) ceil (len / 3.0);
              for (int k = 1; k < n; k++)
                {
                  double t = (double) k / n;
                  if (in_rect (box, q->x + t * (p->x - q->x), q->y + t * (p->y - q->y), grow))
                    return TRUE;
                }
            }
        }
    }
  for (guint i = 0; i < ch->notes->len; i++)
    {
      const BwChartNote *n = g_ptr_array_index (ch->notes, i);
      double px, py;
      bw_chart_frame_to_page (f, n->y2, n->x, n->y, &px, &py);
      if (in_rect (box, px, py, grow + 30 * f->scale))
        return TRUE;
    }
  /* Band labels: a strip along the top of each labelled vertical band, the left of a horizontal
   * one. */
  for (guint i = 0; i < ch->bands->len; i++)
    {
      const BwChartBand *b = g_ptr_array_index (ch->bands, i);
      BwRect strip;
      if (!b->label)
        continue;
      if (b->vertical)
        {
          double a0 = bw_axis_to_page (&f->x, b->from, f->plot.x, f->plot.x + f->plot.width);
          double a1 = bw_axis_to_page (&f->x, b->to, f->plot.x, f->plot.x + f->plot.width);
          strip.x = MAX (f->plot.x, MIN (a0, a1));
          strip.width = MIN (f->plot.x + f->plot.width, MAX (a0, a1)) - strip.x;
          strip.y = f->plot.y;
          strip.height = 18 * f->scale;
        }
      else
        {
          const BwAxis *ya = b->y2 && f->has_y2 ? &f->y2 : &f->y;
          double a1 = bw_axis_to_page (ya, b->to, f->plot.y + f->plot.height, f->plot.y);
          strip.x = f->plot.x;
          strip.width = 0.4 * f->plot.width;
          strip.y = MAX (f->plot.y, a1);
          strip.height = 16 * f->scale;
        }
      if (strip.width > 0 && rects_meet (&strip, box, 0))
        return TRUE;
    }
  /* Rule labels: a strip along the labelled end of each line (its text is not measured here;
   * 45 % of the plot's width, or 160 units tall, covers every label the builders write). */
  for (guint i = 0; i < ch->rules->len; i++)
    {
      const BwChartRule *r = g_ptr_array_index (ch->rules, i);
      double px, py;
      BwRect strip;
      if (!r->label)
        continue;
      bw_chart_frame_to_page (f, r->y2, r->value, r->value, &px, &py);
      if (r->vertical)
        {
          strip.x = px - 2 * f->scale;
          strip.width = MIN (0.45 * f->plot.width, 200 * f->scale);
          strip.height = 16 * f->scale;
          strip.y = r->label_start ? f->plot.y + f->plot.height - strip.height : f->plot.y;
        }
      else
        {
          strip.width = 0.45 * f->plot.width;
          strip.height = 16 * f->scale;
          /* The label is kept inside the plot, so near the top it drops below its line. */
          strip.y = CLAMP (r->label_below ? py : py - strip.height, f->plot.y,
                           f->plot.y + f->plot.height);
          strip.x = r->label_start ? f->plot.x : f->plot.x + f->plot.width - strip.width;
        }
      if (box->x < strip.x + strip.width && strip.x < box->x + box->width
          && box->y < strip.y + strip.height && strip.y < box->y + box->height)
        return TRUE;
    }
  return FALSE;
}

static guint
target_ticks (double length, double per_tick)
{
  return (guint) CLAMP (floor (length / per_tick), 3.0, 10.0);
}

static gboolean
layout_xy (const Ctx *c, const BwChart *ch, double w, double h, BwChartFrame *f)
{
  Extent ex, ey, ey2;
  double lw, lh, l2w = 0, l2h = 0, xw, xh, body_h, legend_w = 0, legend_h = 0;
  double reserve_right = 0, reserve_bottom = 0;
  guint tx, ty;
  Margins m = { 0 };

  memset (f, 0, sizeof *f);
  f->scale = c->s;
  f->has_y2 = ch->has_y2;
  chart_extents (ch, &ex, &ey, &ey2);
  body_h = line_height (c, c->body);
  m.title_h = ch->title ? line_height (c, c->title) : 0;
  m.sub_h = ch->subtitle ? line_height (c, c->small) : 0;
  f->has_legend = ch->show_legend && legend_entries (ch) > 0;
  if (f->has_legend)
    legend_size (c, ch, 0.4 * w, &legend_w, &legend_h);

  for (int pass_out = 0; pass_out < 2; pass_out++)
    {
      /* A first guess, then two passes of measuring the labels. */
      f->plot.x = 60 * c->s;
      f->plot.y = pad (c) + m.title_h + m.sub_h + 8 * c->s;
      f->plot.width = w - f->plot.x - pad (c) - reserve_right;
      f->plot.height = h - f->plot.y - 50 * c->s - reserve_bottom;
      for (int it = 0; it < 3; it++)
        {
          tx = target_ticks (f->plot.width, 85 * c->s);
          ty = target_ticks (f->plot.height, 48 * c->s);
          if (!resolve_axis (&ch->x, &ex, tx, &f->x) || !resolve_axis (&ch->y, &ey, ty, &f->y))
            return FALSE;
          if (ch->has_y2 && !resolve_axis (&ch->y2, &ey2, ty, &f->y2))
            return FALSE;
          labels_size (c, &ch->x, &f->x, &xw, &xh);
          /* Fewer x ticks while their labels would touch. */
          while (!ch->x.categories && f->x.n_major > 2
                 && f->x.n_major * (xw + 10 * c->s) > f->plot.width && tx > 2)
            {
              tx--;
              if (!resolve_axis (&ch->x, &ex, tx, &f->x))
                return FALSE;
              labels_size (c, &ch->x, &f->x, &xw, &xh);
            }
          labels_size (c, &ch->y, &f->y, &lw, &lh);
          if (ch->has_y2)
            labels_size (c, &ch->y2, &f->y2, &l2w, &l2h);
          m.top = pad (c) + m.title_h + m.sub_h + (m.title_h > 0 ? 10 * c->s : 0);
          m.left = pad (c) + (ch->y.title ? body_h + 6 * c->s : 0) + lw + tick_len (c)
                   + 4 * c->s;
          m.right = ch->has_y2 ? pad (c) + (ch->y2.title ? body_h + 6 * c->s : 0) + l2w
                                   + tick_len (c) + 4 * c->s
                               : pad (c) + (ch->x.categories ? 0 : 0.5 * xw);
          m.right += reserve_right;
          m.bottom = pad (c) + (ch->x.title ? body_h + 4 * c->s : 0) + xh + tick_len (c)
                     + 3 * c->s + (ch->footnote ? line_height (c, c->small) + 4 * c->s : 0)
                     + reserve_bottom;
          f->plot.x = m.left;
          f->plot.y = m.top;
          f->plot.width = w - m.left - m.right;
          f->plot.height = h - m.top - m.bottom;
          if (f->plot.width < 20 || f->plot.height < 20)
            return FALSE;
        }

      if (!f->has_legend)
        return TRUE;
      if (pass_out == 1)
        break;
      {
        /* Corners first, then the middles of the edges. */
        const double ins = 6 * c->s;
        const double cx[] = { 1, 0, 1, 0, 0.5, 0.5, 1, 0 };
        const double cy[] = { 0, 0, 1, 1, 0, 1, 0.5, 0.5 };
        for (guint k = 0; k < G_N_ELEMENTS (cx); k++)
          {
            BwRect box;
            box.width = legend_w;
            box.height = legend_h;
            box.x = f->plot.x + ins + cx[k] * (f->plot.width - legend_w - 2 * ins);
            box.y = f->plot.y + ins + cy[k] * (f->plot.height - legend_h - 2 * ins);
            if (legend_w + 2 * ins > f->plot.width || legend_h + 2 * ins > f->plot.height)
              break;
            if (!covers_data (ch, f, &box, 3 * c->s))
              {
                f->legend = box;
                f->legend_clear = TRUE;
                return TRUE;
              }
          }
      }
      /* No clear corner: beside the plot when the canvas is wide, else below it. */
      if (w - legend_w > 0.6 * w && w >= 1.6 * h * 0.8)
        reserve_right = legend_w + 8 * c->s;
      else
        reserve_bottom = legend_h + 6 * c->s;
    }
  if (reserve_right > 0)
    {
      f->legend.x = w - pad (c) - legend_w;
      f->legend.y = f->plot.y;
    }
  else
    {
      f->legend.x = f->plot.x + 0.5 * (f->plot.width - legend_w);
      f->legend.y = h - pad (c) - legend_h
                    - (ch->footnote ? line_height (c, c->small) + 4 * c->s : 0);
    }
  f->legend.width = legend_w;
  f->legend.height = legend_h;
  f->legend_clear = !covers_data (ch, f, &f->legend, 0);
  return TRUE;
}

void
bw_chart_frame_to_page (const BwChartFrame *f, gboolean y2, double x, double y, double *px,
                        double *py)
{
  const BwAxis *ya = y2 && f->has_y2 ? &f->y2 : &f->y;
  *px = bw_axis_to_page (&f->x, x, f->plot.x, f->plot.x + f->plot.width);
  *py = bw_axis_to_page (ya, y, f->plot.y + f->plot.height, f->plot.y);
}

/* --- matrix layout --- */

typedef struct
{
  guint n_lines;      /* header lines */
  double label_w;     /* row label column */
  double header_h;
  double legend_h;
} MatrixGeom;

/* Whether row I opens a group (and so, unless COMPACT, gets a heading row above it). */
static gboolean
row_is_heading (const BwChartMatrix *m, gboolean compact, guint i)
{
  return !compact && m->row_groups
         && (i == 0 || g_strcmp0 (g_ptr_array_index (m->row_groups, i),
                                  g_ptr_array_index (m->row_groups, i - 1)));
}

/* The last '|' alternative of a group label: its short form. */
static const char *
group_short (const char *g)
{
  const char *bar = g ? strrchr (g, '|') : NULL;
  return bar ? bar + 1 : g;
}

/* Row label I as painted: in compact mode prefixed by its group's short form. */
static char *
row_label (const BwChartMatrix *m, gboolean compact, guint i)
{
  const char *t = g_ptr_array_index (m->row_labels, i);
  if (compact && m->row_groups)
    return g_strdup_printf ("%s: %s", group_short (g_ptr_array_index (m->row_groups, i)), t);
  return g_strdup (t);
}

/* Top of row I in the grid (group headings take a row's height of their own). */
static double
row_top (const BwChartFrame *f, const BwChartMatrix *m, guint row)
{
  double y = f->plot.y;
  for (guint i = 0; i <= row; i++)
    {
      if (row_is_heading (m, f->compact_rows, i))
        y += f->cell_height;
      if (i < row)
        y += f->cell_height;
    }
  return y;
}

/* Height of the first N rows with their headings, at row height RH. */
static double
rows_height (const BwChartMatrix *m, gboolean compact, guint n, double rh)
{
  double used = 0;
  for (guint i = 0; i < n; i++)
    used += rh * (row_is_heading (m, compact, i) ? 2 : 1);
  return used;
}

static gboolean
layout_matrix (const Ctx *c, const BwChart *ch, double w, double h, BwChartFrame *f,
               MatrixGeom *g)
{
  const BwChartMatrix *m = &ch->matrix;
  double title_h = ch->title ? line_height (c, c->title) : 0;
  double sub_h = ch->subtitle ? line_height (c, c->small) : 0;
  double small_h = line_height (c, c->small);
  double top, avail_h, min_row;

  memset (f, 0, sizeof *f);
  memset (g, 0, sizeof *g);
  f->scale = c->s;
  if (m->n_rows == 0 || m->n_cols == 0 || !m->row_labels || m->row_labels->len < m->n_rows)
    return FALSE;
  g->n_lines = m->col_levels ? m->col_levels->len : 0;
  g->header_h = g->n_lines * small_h * 1.1 + 4 * c->s;
  g->legend_h = small_h * 1.6 + 6 * c->s;
  top = pad (c) + title_h + sub_h + (title_h > 0 ? 8 * c->s : 0);
  avail_h = h - top - g->header_h - g->legend_h - pad (c)
            - (ch->footnote ? small_h + 4 * c->s : 0);
  min_row = small_h * 1.25;
  /* Group headings on rows of their own when everything fits so; else each row label carries
   * its group's short name. */
  f->compact_rows = rows_height (m, FALSE, m->n_rows, min_row) > avail_h;
  for (guint i = 0; i < m->n_rows; i++)
    {
      g_autofree char *t = row_label (m, f->compact_rows, i);
      g->label_w = MAX (g->label_w, text_width (c, t, c->small, FALSE) + 12 * c->s);
    }
  g->label_w = MIN (g->label_w, 0.42 * w);
  f->plot.x = pad (c) + g->label_w;
  f->plot.y = top + g->header_h;
  f->plot.width = w - f->plot.x - pad (c);
  f->cell_width = f->plot.width / m->n_cols;
  f->rows_shown = m->n_rows;
  f->cell_height = MIN (small_h * 2.0, avail_h / rows_height (m, f->compact_rows, m->n_rows, 1));
  if (f->cell_height < min_row)
    {
      /* Not all fit even so: show what does, and say how many are left out. */
      f->cell_height = min_row;
      avail_h -= small_h + 2 * c->s;
      for (f->rows_shown = 0; f->rows_shown < m->n_rows; f->rows_shown++)
        if (rows_height (m, f->compact_rows, f->rows_shown + 1, min_row) > avail_h)
          break;
    }
  if (f->plot.width < 20 || f->rows_shown == 0)
    return FALSE;
  f->plot.height = rows_height (m, f->compact_rows, f->rows_shown, f->cell_height);
  f->has_legend = TRUE;
  f->legend.x = pad (c);
  f->legend.y = f->plot.y + f->plot.height + (f->rows_shown < m->n_rows ? small_h + 2 * c->s : 0)
                + 4 * c->s;
  f->legend.width = w - 2 * pad (c);
  f->legend.height = g->legend_h - 4 * c->s;
  f->legend_clear = TRUE;
  return TRUE;
}

/* --- public layout --- */

static cairo_t *
scratch_cr (void)
{
  cairo_surface_t *s = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, 1, 1);
  cairo_t *cr = cairo_create (s);
  cairo_surface_destroy (s);
  return cr;
}

static gboolean
do_layout (const Ctx *c, const BwChart *ch, double w, double h, BwChartFrame *f, MatrixGeom *g)
{
  if (ch->kind == BW_CHART_MATRIX)
    return layout_matrix (c, ch, w, h, f, g);
  return layout_xy (c, ch, w, h, f);
}

static void
ctx_init (Ctx *c, const BwStyle *style, cairo_t *cr, double w, double h)
{
  c->cr = cr;
  c->style = style;
  c->s = chart_scale (w, h);
  /* Floors keep a thumbnail's text legible (page units: pixels on screen and in PNG). */
  c->body = MAX (9.0, style->font_size * c->s);
  c->small = MAX (8.0, style->small_size * c->s);
  c->title = MAX (11.5, style->title_size * c->s);
}

gboolean
bw_chart_layout (const BwChart *chart, const BwStyle *style, cairo_t *cr, double width,
                 double height, BwChartFrame *out)
{
  Ctx c;
  MatrixGeom g;
  gboolean ok;
  cairo_t *own = NULL;

  g_return_val_if_fail (chart != NULL && style != NULL && out != NULL, FALSE);
  if (!(width > 0 && height > 0) || !isfinite (width) || !isfinite (height))
    return FALSE;
  if (cr == NULL)
    cr = own = scratch_cr ();
  ctx_init (&c, style, cr, width, height);
  ok = do_layout (&c, chart, width, height, out, &g);
  if (own)
    cairo_destroy (own);
  return ok;
}

/* --- painting: x-y --- */

static void
set_dash (cairo_t *cr, BwDash dash, double s)
{
  const double dashed[] = { 6 * s, 3.5 * s };
  const double dotted[] = { 1.2 * s, 2.6 * s };

  switch (dash)
    {
    case BW_DASH_DASHED:
      cairo_set_dash (cr, dashed, 2, 0);
      break;
    case BW_DASH_DOTTED:
      cairo_set_dash (cr, dotted, 2, 0);
      cairo_set_line_cap (cr, CAIRO_LINE_CAP_ROUND);
      break;
    default:
      cairo_set_dash (cr, NULL, 0, 0);
    }
}

static void
marker_path (cairo_t *cr, BwMarker m, double x, double y, double r)
{
  switch (m)
    {
    case BW_MARKER_CIRCLE:
      cairo_new_sub_path (cr);
      cairo_arc (cr, x, y, r, 0, 2 * G_PI);
      break;
    case BW_MARKER_SQUARE:
      cairo_rectangle (cr, x - 0.88 * r, y - 0.88 * r, 1.76 * r, 1.76 * r);
      break;
    case BW_MARKER_TRIANGLE:
      cairo_move_to (cr, x, y - 1.15 * r);
      cairo_line_to (cr, x + r, y + 0.7 * r);
      cairo_line_to (cr, x - r, y + 0.7 * r);
      cairo_close_path (cr);
      break;
    case BW_MARKER_DIAMOND:
      cairo_move_to (cr, x, y - 1.2 * r);
      cairo_line_to (cr, x + 1.0 * r, y);
      cairo_line_to (cr, x, y + 1.2 * r);
      cairo_line_to (cr, x - 1.0 * r, y);
      cairo_close_path (cr);
      break;
    case BW_MARKER_CROSS:
      cairo_move_to (cr, x - r, y - r);
      cairo_line_to (cr, x + r, y + r);
      cairo_move_to (cr, x + r, y - r);
      cairo_line_to (cr, x - r, y + r);
      break;
    default:
      break;
    }
}

static void
draw_marker (const Ctx *c, BwMarker m, double x, double y, BwRgb colour)
{
  const double r = 3.6 * c->s;

  if (m == BW_MARKER_NONE)
    return;
  cairo_set_dash (c->cr, NULL, 0, 0);
  marker_path (c->cr, m, x, y, r);
  if (m == BW_MARKER_CROSS)
    {
      set_rgb (c->cr, colour);
      cairo_set_line_width (c->cr, 1.6 * c->s);
      cairo_stroke (c->cr);
      return;
    }
  set_rgb (c->cr, colour);
  cairo_fill_preserve (c->cr);
  /* A paper rim keeps overlapping markers apart. */
  set_rgb (c->cr, c->style->paper);
  cairo_set_line_width (c->cr, 0.8 * c->s);
  cairo_stroke (c->cr);
}

static void
draw_grid (const Ctx *c, const BwChartFrame *f, const BwChartColours *cc, const BwChart *ch)
{
  cairo_t *cr = c->cr;
  const BwRect *p = &f->plot;

  cairo_set_dash (cr, NULL, 0, 0);
  cairo_set_line_width (cr, 0.6 * c->s);
  set_rgb (cr, cc->grid_minor);
  for (guint i = 0; i < f->x.n_minor; i++)
    {
      double x = bw_axis_to_page (&f->x, f->x.minor[i], p->x, p->x + p->width);
      cairo_move_to (cr, x, p->y);
      cairo_line_to (cr, x, p->y + p->height);
    }
  for (guint i = 0; i < f->y.n_minor; i++)
    {
      double y = bw_axis_to_page (&f->y, f->y.minor[i], p->y + p->height, p->y);
      cairo_move_to (cr, p->x, y);
      cairo_line_to (cr, p->x + p->width, y);
    }
  cairo_stroke (cr);
  cairo_set_line_width (cr, 0.8 * c->s);
  set_rgb (cr, cc->grid);
  if (!ch->x.categories)
    for (guint i = 0; i < f->x.n_major; i++)
      {
        double x = bw_axis_to_page (&f->x, f->x.major[i], p->x, p->x + p->width);
        cairo_move_to (cr, x, p->y);
        cairo_line_to (cr, x, p->y + p->height);
      }
  for (guint i = 0; i < f->y.n_major; i++)
    {
      double y = bw_axis_to_page (&f->y, f->y.major[i], p->y + p->height, p->y);
      cairo_move_to (cr, p->x, y);
      cairo_line_to (cr, p->x + p->width, y);
    }
  cairo_stroke (cr);
}

static void
draw_bands (const Ctx *c, const BwChart *ch, const BwChartFrame *f)
{
  cairo_t *cr = c->cr;
  const BwRect *p = &f->plot;
  const double alpha = bw_rgb_lightness (c->style->paper) > 50 ? 0.13 : 0.24;

  for (guint i = 0; i < ch->bands->len; i++)
    {
      const BwChartBand *b = g_ptr_array_index (ch->bands, i);
      BwRgb col = bw_chart_colour (c->style, b->colour);
      double a0, a1;
      BwRect r;
      if (b->vertical)
        {
          a0 = bw_axis_to_page (&f->x, b->from, p->x, p->x + p->width);
          a1 = bw_axis_to_page (&f->x, b->to, p->x, p->x + p->width);
          r.x = MAX (p->x, MIN (a0, a1));
          r.width = MIN (p->x + p->width, MAX (a0, a1)) - r.x;
          r.y = p->y;
          r.height = p->height;
        }
      else
        {
          const BwAxis *ya = b->y2 && f->has_y2 ? &f->y2 : &f->y;
          a0 = bw_axis_to_page (ya, b->from, p->y + p->height, p->y);
          a1 = bw_axis_to_page (ya, b->to, p->y + p->height, p->y);
          r.y = MAX (p->y, MIN (a0, a1));
          r.height = MIN (p->y + p->height, MAX (a0, a1)) - r.y;
          r.x = p->x;
          r.width = p->width;
        }
      if (r.width <= 0 || r.height <= 0)
        continue;
      set_rgba (cr, col, alpha);
      cairo_rectangle (cr, r.x, r.y, r.width, r.height);
      cairo_fill (cr);
      if (b->label && (b->vertical ? r.width : r.height) > 14 * c->s)
        {
          BwRect inner = { r.x + 2 * c->s, r.y + 3 * c->s, r.width - 4 * c->s,
                           r.height - 6 * c->s };
          if (b->vertical)
            draw_text (c, b->label, c->small, FALSE, r.x + 0.5 * r.width, r.y + 3 * c->s, 0.5,
                       0, &inner, 0, c->style->ink_muted);
          else
            draw_text (c, b->label, c->small, FALSE, r.x + 4 * c->s, r.y + 2 * c->s, 0, 0,
                       &inner, 0, c->style->ink_muted);
        }
    }
}

static void
draw_series (const Ctx *c, const BwChart *ch, const BwChartFrame *f)
{
  cairo_t *cr = c->cr;

  /* Bars first, under the lines. */
  for (guint i = 0; i < ch->series->len; i++)
    {
      const BwChartSeries *s = g_ptr_array_index (ch->series, i);
      g_autoptr (GArray) pts = NULL;
      BwRgb col = bw_chart_colour (c->style, s->colour);
      if (s->kind != BW_SERIES_BARS)
        continue;
      pts = series_page_points (ch, f, s);
      for (guint j = 0; j < pts->len; j++)
        {
          BwRect bar;
          bar_rect (ch, f, i, &g_array_index (pts, PagePoint, j), &bar);
          cairo_rectangle (cr, bar.x, bar.y, bar.width, bar.height);
        }
      set_rgba (cr, col, 0.55);
      cairo_fill_preserve (cr);
      set_rgb (cr, col);
      cairo_set_dash (cr, NULL, 0, 0);
      cairo_set_line_width (cr, 1.0 * c->s);
      cairo_stroke (cr);
    }

  for (guint i = 0; i < ch->series->len; i++)
    {
      const BwChartSeries *s = g_ptr_array_index (ch->series, i);
      g_autoptr (GArray) pts = NULL;
      BwRgb col = bw_chart_colour (c->style, s->colour);
      if (s->kind != BW_SERIES_LINE || !s->line)
        continue;
      pts = series_page_points (ch, f, s);
      for (guint j = 0; j < pts->len; j++)
        {
          const PagePoint *p = &g_array_index (pts, PagePoint, j);
          /* A gap (an unusable point between two usable ones) breaks the line. */
          if (j == 0 || p->index != g_array_index (pts, PagePoint, j - 1).index + 1)
            cairo_move_to (cr, p->x, p->y);
          else
            cairo_line_to (cr, p->x, p->y);
        }
      set_rgb (cr, col);
      cairo_set_line_width (cr, 2.0 * c->s);
      cairo_set_line_join (cr, CAIRO_LINE_JOIN_ROUND);
      cairo_set_line_cap (cr, CAIRO_LINE_CAP_BUTT);
      set_dash (cr, s->dash, c->s);
      cairo_stroke (cr);
    }
  cairo_set_dash (cr, NULL, 0, 0);
  for (guint i = 0; i < ch->series->len; i++)
    {
      const BwChartSeries *s = g_ptr_array_index (ch->series, i);
      g_autoptr (GArray) pts = NULL;
      if (s->kind != BW_SERIES_LINE || s->marker == BW_MARKER_NONE)
        continue;
      pts = series_page_points (ch, f, s);
      for (guint j = 0; j < pts->len; j++)
        draw_marker (c, s->marker, g_array_index (pts, PagePoint, j).x,
                     g_array_index (pts, PagePoint, j).y, bw_chart_colour (c->style, s->colour));
    }
}

static void
draw_rules (const Ctx *c, const BwChart *ch, const BwChartFrame *f)
{
  cairo_t *cr = c->cr;
  const BwRect *p = &f->plot;
  BwRect inner = { p->x + 3 * c->s, p->y + 2 * c->s, p->width - 6 * c->s, p->height - 4 * c->s };

  for (guint i = 0; i < ch->rules->len; i++)
    {
      const BwChartRule *r = g_ptr_array_index (ch->rules, i);
      BwRgb col = bw_chart_colour (c->style, r->colour);
      double px, py;
      bw_chart_frame_to_page (f, r->y2, r->value, r->value, &px, &py);
      if (r->vertical ? (px < p->x - 0.5 || px > p->x + p->width + 0.5)
                      : (py < p->y - 0.5 || py > p->y + p->height + 0.5))
        continue;
      set_rgb (cr, col);
      cairo_set_line_width (cr, 1.4 * c->s);
      set_dash (cr, r->dash, c->s);
      if (r->vertical)
        {
          cairo_move_to (cr, px, p->y);
          cairo_line_to (cr, px, p->y + p->height);
        }
      else
        {
          cairo_move_to (cr, p->x, py);
          cairo_line_to (cr, p->x + p->width, py);
        }
      cairo_stroke (cr);
      cairo_set_dash (cr, NULL, 0, 0);
      if (!r->label)
        continue;
      if (r->vertical)
        draw_text (c, r->label, c->small, FALSE, px + 3 * c->s,
                   r->label_start ? p->y + p->height - 3 * c->s : p->y + 3 * c->s, 0,
                   r->label_start ? 1 : 0, &inner, 0.85, col);
      else
        draw_text (c, r->label, c->small, FALSE,
                   r->label_start ? p->x + 4 * c->s : p->x + p->width - 4 * c->s,
                   r->label_below ? py + 1.5 * c->s : py - 1.5 * c->s, r->label_start ? 0 : 1,
                   r->label_below ? 0 : 1, &inner, 0.85, col);
    }
}

static void
draw_notes (const Ctx *c, const BwChart *ch, const BwChartFrame *f)
{
  cairo_t *cr = c->cr;
  const BwRect *p = &f->plot;
  BwRect inner = { p->x + 2 * c->s, p->y + 2 * c->s, p->width - 4 * c->s, p->height - 4 * c->s };

  for (guint i = 0; i < ch->notes->len; i++)
    {
      const BwChartNote *n = g_ptr_array_index (ch->notes, i);
      double px, py, ax;
      bw_chart_frame_to_page (f, n->y2, n->x, n->y, &px, &py);
      if (!in_rect (p, px, py, 0.5))
        continue;
      if (n->ring)
        {
          cairo_set_dash (cr, NULL, 0, 0);
          set_rgb (cr, c->style->ink);
          cairo_set_line_width (cr, 1.2 * c->s);
          cairo_new_sub_path (cr);
          cairo_arc (cr, px, py, 6.5 * c->s, 0, 2 * G_PI);
          cairo_stroke (cr);
        }
      /* Text to the right of the point, or to the left in the right third of the plot. */
      ax = px > p->x + 0.66 * p->width ? 1 : 0;
      draw_text (c, n->text, c->small, FALSE, px + (ax > 0 ? -9 : 9) * c->s, py - 7 * c->s, ax,
                 1, &inner, 0.85, c->style->ink);
    }
}

static void
draw_axis_y (const Ctx *c, const BwChart *ch, const BwChartFrame *f, const BwChartAxis *spec,
             const BwAxis *a, gboolean right, double w)
{
  cairo_t *cr = c->cr;
  const BwRect *p = &f->plot;
  const double x = right ? p->x + p->width : p->x;
  const double dir = right ? 1 : -1;
  double max_lw = 0;

  (void) ch;
  (void) w;
  set_rgb (cr, c->style->ink_muted);
  cairo_set_line_width (cr, 1.0 * c->s);
  cairo_set_dash (cr, NULL, 0, 0);
  for (guint i = 0; i < a->n_major; i++)
    {
      double y = bw_axis_to_page (a, a->major[i], p->y + p->height, p->y);
      cairo_move_to (cr, x, y);
      cairo_line_to (cr, x + dir * tick_len (c), y);
    }
  for (guint i = 0; i < a->n_minor; i++)
    {
      double y = bw_axis_to_page (a, a->minor[i], p->y + p->height, p->y);
      cairo_move_to (cr, x, y);
      cairo_line_to (cr, x + dir * 0.55 * tick_len (c), y);
    }
  cairo_stroke (cr);
  for (guint i = 0; i < a->n_major; i++)
    {
      g_autofree char *t = tick_label (spec, a, i);
      double y = bw_axis_to_page (a, a->major[i], p->y + p->height, p->y);
      max_lw = MAX (max_lw, text_width (c, t, c->body, FALSE));
      draw_text (c, t, c->body, FALSE, x + dir * (tick_len (c) + 3 * c->s), y, right ? 0 : 1,
                 0.5, NULL, 0, c->style->ink);
    }
  if (spec->title)
    {
      g_autofree char *t = axis_title (spec, a);
      PangoLayout *l = text_layout (c, t, c->body, FALSE);
      double tw, th, cx = x + dir * (tick_len (c) + 3 * c->s + max_lw + 6 * c->s);
      layout_limit (l, p->height);
      layout_size (l, &tw, &th);
      cairo_save (cr);
      /* Rotated so that it reads upward on the left and downward on the right. */
      cairo_translate (cr, right ? cx : cx - th, p->y + 0.5 * p->height);
      cairo_rotate (cr, right ? G_PI / 2 : -G_PI / 2);
      set_rgb (cr, c->style->ink);
      cairo_move_to (cr, -0.5 * MIN (tw, p->height), right ? -th : 0);
      pango_cairo_show_layout (cr, l);
      cairo_restore (cr);
      g_object_unref (l);
    }
}

static void
draw_axis_x (const Ctx *c, const BwChart *ch, const BwChartFrame *f, double w)
{
  cairo_t *cr = c->cr;
  const BwRect *p = &f->plot;
  const double y = p->y + p->height;
  double xh = 0;
  BwRect canvas = { 0, 0, w, 1e9 };

  set_rgb (cr, c->style->ink_muted);
  cairo_set_line_width (cr, 1.0 * c->s);
  cairo_set_dash (cr, NULL, 0, 0);
  for (guint i = 0; i < f->x.n_major; i++)
    {
      double x = bw_axis_to_page (&f->x, f->x.major[i], p->x, p->x + p->width);
      cairo_move_to (cr, x, y);
      cairo_line_to (cr, x, y + tick_len (c));
    }
  for (guint i = 0; i < f->x.n_minor; i++)
    {
      double x = bw_axis_to_page (&f->x, f->x.minor[i], p->x, p->x + p->width);
      cairo_move_to (cr, x, y);
      cairo_line_to (cr, x, y + 0.55 * tick_len (c));
    }
  cairo_stroke (cr);
  for (guint i = 0; i < f->x.n_major; i++)
    {
      g_autofree char *t = tick_label (&ch->x, &f->x, i);
      double x = bw_axis_to_page (&f->x, f->x.major[i], p->x, p->x + p->width);
      PangoLayout *l = text_layout (c, t, c->body, FALSE);
      double lh;
      pango_layout_set_alignment (l, PANGO_ALIGN_CENTER);
      if (ch->x.categories)
        layout_limit (l, p->width / MAX (1u, f->x.n_major) - 4 * c->s);
      layout_size (l, NULL, &lh);
      xh = MAX (xh, lh);
      draw_layout (c, l, x, y + tick_len (c) + 2 * c->s, 0.5, 0, &canvas, 0, c->style->ink);
      g_object_unref (l);
    }
  if (ch->x.title)
    {
      g_autofree char *t = axis_title (&ch->x, &f->x);
      BwRect row = { p->x, 0, p->width, 1e9 };
      draw_text (c, t, c->body, FALSE, p->x + 0.5 * p->width,
                 y + tick_len (c) + 2 * c->s + xh + 4 * c->s, 0.5, 0, &row, 0, c->style->ink);
    }
}

static void
draw_legend (const Ctx *c, const BwChart *ch, const BwChartFrame *f, const BwChartColours *cc)
{
  cairo_t *cr = c->cr;
  const BwRect *b = &f->legend;
  const double lh = line_height (c, c->small) * 1.15;
  double y = b->y + 4 * c->s;
  const double sw = legend_swatch (c);

  set_rgba (cr, c->style->paper, 0.92);
  cairo_rectangle (cr, b->x, b->y, b->width, b->height);
  cairo_fill_preserve (cr);
  set_rgb (cr, cc->grid);
  cairo_set_line_width (cr, 0.8 * c->s);
  cairo_set_dash (cr, NULL, 0, 0);
  cairo_stroke (cr);
  for (guint i = 0; i < ch->series->len; i++)
    {
      const BwChartSeries *s = g_ptr_array_index (ch->series, i);
      BwRgb col = bw_chart_colour (c->style, s->colour);
      double cy = y + 0.5 * lh, x0 = b->x + 6 * c->s;
      if (!s->label)
        continue;
      if (s->kind == BW_SERIES_BARS)
        {
          cairo_rectangle (cr, x0 + 0.2 * sw, cy - 0.3 * lh, 0.6 * sw, 0.6 * lh);
          set_rgba (cr, col, 0.55);
          cairo_fill_preserve (cr);
          set_rgb (cr, col);
          cairo_set_line_width (cr, 1.0 * c->s);
          cairo_stroke (cr);
        }
      else
        {
          if (s->line)
            {
              set_rgb (cr, col);
              cairo_set_line_width (cr, 2.0 * c->s);
              set_dash (cr, s->dash, c->s);
              cairo_move_to (cr, x0, cy);
              cairo_line_to (cr, x0 + sw, cy);
              cairo_stroke (cr);
              cairo_set_dash (cr, NULL, 0, 0);
            }
          draw_marker (c, s->marker, x0 + 0.5 * sw, cy, col);
        }
      {
        BwRect tb = { x0 + sw + 5 * c->s, y, b->x + b->width - (x0 + sw + 5 * c->s) - 4 * c->s,
                      lh };
        draw_text (c, s->label, c->small, FALSE, tb.x, cy, 0, 0.5, &tb, 0, c->style->ink);
      }
      y += lh;
    }
}

static void
draw_titles (const Ctx *c, const BwChart *ch, double w, double h)
{
  BwRect line = { pad (c), 0, w - 2 * pad (c), h };
  double y = pad (c);

  if (ch->title)
    {
      draw_text (c, ch->title, c->title, TRUE, pad (c), y, 0, 0, &line, 0, c->style->ink);
      y += line_height (c, c->title);
    }
  if (ch->subtitle)
    draw_text (c, ch->subtitle, c->small, FALSE, pad (c), y, 0, 0, &line, 0,
               c->style->ink_muted);
  if (ch->footnote)
    draw_text (c, ch->footnote, c->small, FALSE, pad (c), h - pad (c), 0, 1, &line, 0,
               c->style->ink_muted);
}

static void
paint_xy (const Ctx *c, const BwChart *ch, const BwChartFrame *f, double w, double h)
{
  cairo_t *cr = c->cr;
  BwChartColours cc;

  bw_chart_colours (c->style, &cc);
  cairo_save (cr);
  cairo_rectangle (cr, f->plot.x, f->plot.y, f->plot.width, f->plot.height);
  cairo_clip (cr);
  draw_bands (c, ch, f);
  draw_grid (c, f, &cc, ch);
  draw_series (c, ch, f);
  draw_rules (c, ch, f);
  draw_notes (c, ch, f);
  cairo_restore (cr);

  /* The frame. */
  set_rgb (cr, c->style->ink_muted);
  cairo_set_line_width (cr, 1.0 * c->s);
  cairo_set_dash (cr, NULL, 0, 0);
  cairo_rectangle (cr, f->plot.x, f->plot.y, f->plot.width, f->plot.height);
  cairo_stroke (cr);
  draw_axis_x (c, ch, f, w);
  draw_axis_y (c, ch, f, &ch->y, &f->y, FALSE, w);
  if (f->has_y2)
    draw_axis_y (c, ch, f, &ch->y2, &f->y2, TRUE, w);
  if (f->has_legend)
    draw_legend (c, ch, f, &cc);
  draw_titles (c, ch, w, h);
}

/* --- painting: matrix --- */

/* A label that may hold alternatives, longest first, split by '|': the first that fits W. */
static void
draw_fitting (const Ctx *c, const char *text, double size, gboolean bold, double cx, double y,
              double w, BwRgb colour)
{
  g_auto (GStrv) alts = g_strsplit (text ? text : "", "|", -1);
  guint n = g_strv_length (alts);

  for (guint i = 0; i < n; i++)
    if (text_width (c, alts[i], size, bold) <= w || i + 1 == n)
      {
        BwRect box = { cx - 0.5 * w, y, w, 1e9 };
        if (text_width (c, alts[i], size, bold) > w && w < 3 * size)
          return; /* nothing legible fits */
        draw_text (c, alts[i], size, bold, cx, y, 0.5, 0, &box, 0, colour);
        return;
      }
}

static void
status_glyph (const Ctx *c, const BwChartColours *cc, BwCheckStatus st, double x, double y,
              double w, double h)
{
  cairo_t *cr = c->cr;
  const double r = 0.32 * MIN (w, h);
  const double cx = x + 0.5 * w, cy = y + 0.5 * h;
  BwRgb fill = st == BW_CHECK_PASS ? cc->pass : st == BW_CHECK_WARN ? cc->warn
               : st == BW_CHECK_FAIL ? cc->fail : cc->not_applicable;

  cairo_set_dash (cr, NULL, 0, 0);
  set_rgb (cr, fill);
  cairo_rectangle (cr, x, y, w, h);
  cairo_fill (cr);
  cairo_set_line_cap (cr, CAIRO_LINE_CAP_ROUND);
  cairo_set_line_join (cr, CAIRO_LINE_JOIN_ROUND);
  switch (st)
    {
    case BW_CHECK_PASS: /* a check mark */
      set_rgb (cr, c->style->ink);
      cairo_set_line_width (cr, MAX (1.0, 0.16 * r + 0.6 * c->s));
      cairo_move_to (cr, cx - 0.8 * r, cy);
      cairo_line_to (cr, cx - 0.25 * r, cy + 0.6 * r);
      cairo_line_to (cr, cx + 0.85 * r, cy - 0.7 * r);
      cairo_stroke (cr);
      break;
    case BW_CHECK_WARN: /* an open triangle with a bar */
      set_rgb (cr, c->style->ink);
      cairo_set_line_width (cr, MAX (1.0, 0.14 * r + 0.5 * c->s));
      cairo_move_to (cr, cx, cy - r);
      cairo_line_to (cr, cx + r, cy + 0.8 * r);
      cairo_line_to (cr, cx - r, cy + 0.8 * r);
      cairo_close_path (cr);
      cairo_move_to (cr, cx, cy - 0.35 * r);
      cairo_line_to (cr, cx, cy + 0.3 * r);
      cairo_stroke (cr);
      break;
    case BW_CHECK_FAIL: /* a bold cross in paper colour */
      set_rgb (cr, c->style->paper);
      cairo_set_line_width (cr, MAX (1.2, 0.26 * r + 0.6 * c->s));
      cairo_move_to (cr, cx - 0.7 * r, cy - 0.7 * r);
      cairo_line_to (cr, cx + 0.7 * r, cy + 0.7 * r);
      cairo_move_to (cr, cx + 0.7 * r, cy - 0.7 * r);
      cairo_line_to (cr, cx - 0.7 * r, cy + 0.7 * r);
      cairo_stroke (cr);
      break;
    default: /* not applicable: light hatching */
      cairo_save (cr);
      cairo_rectangle (cr, x, y, w, h);
      cairo_clip (cr);
      set_rgb (cr, mix (c->style->paper, c->style->ink_muted, 0.35));
      cairo_set_line_width (cr, 0.6 * c->s);
      for (double d = -h; d < w; d += 4.5 * c->s)
        {
          cairo_move_to (cr, x + d, y + h);
          cairo_line_to (cr, x + d + h, y);
        }
      cairo_stroke (cr);
      cairo_restore (cr);
      break;
    }
  cairo_set_line_cap (cr, CAIRO_LINE_CAP_BUTT);
}

static void
paint_matrix (const Ctx *c, const BwChart *ch, const BwChartFrame *f, const MatrixGeom *g,
              double w, double h)
{
  cairo_t *cr = c->cr;
  const BwChartMatrix *m = &ch->matrix;
  const BwRect *p = &f->plot;
  const double small_h = line_height (c, c->small);
  BwChartColours cc;

  bw_chart_colours (c->style, &cc);
  draw_titles (c, ch, w, h);

  /* Header levels: equal neighbours merge into one heading over their span. */
  for (guint lv = 0; lv < g->n_lines; lv++)
    {
      GPtrArray *level = g_ptr_array_index (m->col_levels, lv);
      double y = p->y - g->header_h + lv * small_h * 1.1;
      guint start = 0;
      for (guint col = 1; col <= m->n_cols; col++)
        {
          if (col < m->n_cols && g_strcmp0 (g_ptr_array_index (level, col),
                                            g_ptr_array_index (level, start)) == 0)
            continue;
          {
            double x0 = p->x + start * f->cell_width, x1 = p->x + col * f->cell_width;
            draw_fitting (c, g_ptr_array_index (level, start), c->small, lv == 0, 0.5 * (x0 + x1),
                          y, x1 - x0 - 2 * c->s, lv == 0 ? c->style->ink : c->style->ink_muted);
            if (lv + 1 < g->n_lines && col < m->n_cols)
              {
                /* A divider between spans of the upper levels. */
                set_rgb (cr, cc.grid);
                cairo_set_line_width (cr, 1.0 * c->s);
                cairo_move_to (cr, x1, y);
                cairo_line_to (cr, x1, p->y + p->height);
                cairo_stroke (cr);
              }
          }
          start = col;
        }
    }

  for (guint i = 0; i < f->rows_shown; i++)
    {
      double y = row_top (f, m, i);
      if (row_is_heading (m, f->compact_rows, i))
        {
          BwRect box = { pad (c), y - f->cell_height, w - 2 * pad (c), f->cell_height };
          g_auto (GStrv) alts = g_strsplit (g_ptr_array_index (m->row_groups, i), "|", 2);
          draw_text (c, alts[0], c->small, TRUE, pad (c),
                     y - 0.5 * f->cell_height + 0.5 * c->s, 0, 0.5, &box, 0, c->style->ink);
        }
      {
        BwRect box = { pad (c) + (f->compact_rows ? 0 : 6 * c->s), y,
                       g->label_w - (f->compact_rows ? 4 : 10) * c->s, f->cell_height };
        g_autofree char *label = row_label (m, f->compact_rows, i);
        draw_text (c, label, c->small, FALSE, box.x,
                   y + 0.5 * f->cell_height, 0, 0.5, &box, 0, c->style->ink);
      }
      for (guint col = 0; col < m->n_cols; col++)
        status_glyph (c, &cc, m->cells[i * m->n_cols + col], p->x + col * f->cell_width + 0.5 * c->s,
                      y + 0.5 * c->s, f->cell_width - 1.0 * c->s, f->cell_height - 1.0 * c->s);
    }
  if (f->rows_shown < m->n_rows)
    {
      const guint more = m->n_rows - f->rows_shown;
      g_autofree char *t = g_strdup_printf (ngettext ("… %u more row not shown at this size",
                                                      "… %u more rows not shown at this size", more),
                                            more);
      BwRect box = { pad (c), 0, w - 2 * pad (c), h };
      draw_text (c, t, c->small, FALSE, pad (c), p->y + p->height + 2 * c->s, 0, 0, &box, 0,
                 c->style->ink_muted);
    }

  /* Legend: one row of the four states. */
  {
    const BwCheckStatus st[] = { BW_CHECK_PASS, BW_CHECK_WARN, BW_CHECK_FAIL,
                                 BW_CHECK_NOT_APPLICABLE };
    const char *names[] = { C_("check", "pass"), _("warn: outside preferred"),
                            _("fail: outside required"), _("not applicable") };
    const char *short_names[] = { C_("check", "pass"), C_("check", "warn"), C_("check", "fail"),
                                  C_("check", "n/a") };
    double sw = small_h * 1.3, x = f->legend.x, total = 0;
    gboolean use_short = FALSE;
    for (guint k = 0; k < 4; k++)
      total += sw + 5 * c->s + text_width (c, names[k], c->small, FALSE) + 14 * c->s;
    if (total > f->legend.width)
      use_short = TRUE;
    for (guint k = 0; k < 4; k++)
      {
        const char *t = use_short ? short_names[k] : names[k];
        status_glyph (c, &cc, st[k], x, f->legend.y, sw, sw);
        set_rgb (cr, cc.grid);
        cairo_set_line_width (cr, 0.6 * c->s);
        cairo_rectangle (cr, x, f->legend.y, sw, sw);
        cairo_stroke (cr);
        draw_text (c, t, c->small, FALSE, x + sw + 5 * c->s, f->legend.y + 0.5 * sw, 0, 0.5,
                   NULL, 0, c->style->ink);
        x += sw + 5 * c->s + text_width (c, t, c->small, FALSE) + 14 * c->s;
      }
  }
}

void
bw_chart_paint (const BwChart *chart, const BwStyle *style, cairo_t *cr, double width,
                double height)
{
  Ctx c;
  BwChartFrame f;
  MatrixGeom g;

  g_return_if_fail (chart != NULL && style != NULL && cr != NULL);
  if (!(width > 0 && height > 0) || !isfinite (width) || !isfinite (height))
    return;
  /* No clip to the canvas: the layout keeps everything inside it, and tests/draw checks that on
   * a recording surface, which a clip here would blind. */
  cairo_save (cr);
  ctx_init (&c, style, cr, width, height);
  if (!chart->transparent)
    {
      set_rgb (cr, style->paper);
      cairo_rectangle (cr, 0, 0, width, height);
      cairo_fill (cr);
    }
  if (!do_layout (&c, chart, width, height, &f, &g))
    {
      BwRect box = { 0, 0, width, height };
      draw_titles (&c, chart, width, height);
      draw_text (&c, _("No data to chart"), c.body, FALSE, 0.5 * width, 0.5 * height, 0.5, 0.5,
                 &box, 0, style->ink_muted);
    }
  else if (chart->kind == BW_CHART_MATRIX)
    paint_matrix (&c, chart, &f, &g, width, height);
  else
    paint_xy (&c, chart, &f, width, height);
  cairo_restore (cr);
}

/* --- hit-test --- */

gboolean
bw_chart_pick (const BwChart *chart, const BwStyle *style, double width, double height,
               double px, double py, BwChartPick *out)
{
  BwChartFrame f;
  MatrixGeom g;
  Ctx c;
  cairo_t *cr;
  gboolean ok;

  g_return_val_if_fail (chart != NULL && style != NULL && out != NULL, FALSE);
  memset (out, 0, sizeof *out);
  out->kind = BW_CHART_PICK_NONE;
  if (!(width > 0 && height > 0))
    return FALSE;
  cr = scratch_cr ();
  ctx_init (&c, style, cr, width, height);
  ok = do_layout (&c, chart, width, height, &f, &g);
  cairo_destroy (cr);
  if (!ok)
    return FALSE;

  if (chart->kind == BW_CHART_MATRIX)
    {
      const BwChartMatrix *m = &chart->matrix;
      if (px < f.plot.x || px >= f.plot.x + f.plot.width)
        return FALSE;
      for (guint i = 0; i < f.rows_shown; i++)
        {
          double y = row_top (&f, m, i);
          if (py >= y && py < y + f.cell_height)
            {
              out->kind = BW_CHART_PICK_CELL;
              out->row = i;
              out->col = MIN ((guint) ((px - f.plot.x) / f.cell_width), m->n_cols - 1);
              return TRUE;
            }
        }
      return FALSE;
    }

  {
    const double radius = 8.0 * f.scale;
    double best = radius;
    for (guint i = 0; i < chart->series->len; i++)
      {
        const BwChartSeries *s = g_ptr_array_index (chart->series, i);
        g_autoptr (GArray) pts = series_page_points (chart, &f, s);
        for (guint j = 0; j < pts->len; j++)
          {
            const PagePoint *p = &g_array_index (pts, PagePoint, j);
            double d = hypot (p->x - px, p->y - py);
            if (s->kind == BW_SERIES_BARS)
              {
                /* A bar is hit anywhere on it, a little less eagerly than a point. */
                BwRect bar;
                bar_rect (chart, &f, i, p, &bar);
                d = in_rect (&bar, px, py, 0) ? 0.5 * radius + 1e-9 * j : radius * 2;
              }
            if (d <= best && in_rect (&f.plot, p->x, p->y, 0.5))
              {
                best = d;
                out->kind = BW_CHART_PICK_POINT;
                out->series = i;
                out->index = p->index;
                out->x = g_array_index (s->x, double, p->index);
                out->y = g_array_index (s->y, double, p->index);
              }
          }
      }
    if (out->kind == BW_CHART_PICK_POINT)
      return TRUE;
    if (in_rect (&f.plot, px, py, 0))
      {
        out->kind = BW_CHART_PICK_PLOT;
        out->x = bw_axis_from_page (&f.x, px, f.plot.x, f.plot.x + f.plot.width);
        out->y = bw_axis_from_page (&f.y, py, f.plot.y + f.plot.height, f.plot.y);
        return TRUE;
      }
  }
  return FALSE;
}
