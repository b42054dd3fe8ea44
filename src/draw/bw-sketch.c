/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-sketch.c: rectangular settling basins and rapid-mix tanks drawn to scale, in plan and in
 * section, from the unit's design inputs. The sketch shows what was entered; it computes no
 * result. A few parts the inputs do not fix (wall thickness, freeboard, baffle widths, the
 * impeller's elevation, the launder layout) are drawn by drafting convention and said so in the
 * note on the sheet. */
#include "config.h"

#include "draw/bw-sketch.h"

#include <math.h>
#include <pango/pangocairo.h>
#include <string.h>

G_DEFINE_QUARK (bw-draw-error-quark, bw_draw_error)

/* --- drafting conventions (common practice, no source; not design values) --- */

#define BASIN_WALL_M 0.30      /* basin wall and floor slab, drawn */
#define BASIN_FREEBOARD_M 0.50 /* wall top above the water, drawn */
#define BAFFLE_THICK_M 0.15    /* inlet baffle wall */
#define LAUNDER_DEPTH_M 0.45   /* effluent trough below the weir crest */
#define LAUNDER_WIDTH_M 0.45
#define LAUNDER_MAX_SHARE 0.30 /* launders reach at most this share of the basin length ... */
#define LAUNDER_MIN_GAP_M 0.6  /* ... and stand at least this far apart */
#define TANK_WALL_M 0.20       /* rapid-mix tank wall and floor */
#define TANK_FREEBOARD_M 0.30
#define TANK_BAFFLES 4         /* wall baffles, each a twelfth of the tank width */
#define TANK_BAFFLE_SHARE (1.0 / 12.0)

/* Reference canvas the style's sizes are given for. */
#define REF_WIDTH 800.0
#define REF_HEIGHT 560.0

static const char *const view_names[BW_N_SKETCH_VIEWS] = { "plan", "section" };

const char *
bw_sketch_view_name (BwSketchView view)
{
  g_return_val_if_fail (view < BW_N_SKETCH_VIEWS, "unknown");
  return view_names[view];
}

gboolean
bw_sketch_view_from_name (const char *name, BwSketchView *out)
{
  g_return_val_if_fail (out != NULL, FALSE);
  for (int i = 0; i < BW_N_SKETCH_VIEWS; i++)
    if (g_strcmp0 (name, view_names[i]) == 0)
      {
        *out = (BwSketchView) i;
        return TRUE;
      }
  return FALSE;
}

gboolean
bw_sketch_supports (BwProcessType type, BwSketchView view)
{
  if (view >= BW_N_SKETCH_VIEWS)
    return FALSE;
  return type == BW_PROCESS_RECTANGULAR_BASIN || type == BW_PROCESS_RAPID_MIX;
}

/* --- the unit's inputs, read once --- */

typedef struct
{
  BwProcessType type;
  /* rectangular basin */
  double length, width, depth, sludge, weir;
  int inlet; /* 0 perforated baffle, 1 inlet baffle, 2 none */
  int n_launders;
  double launder_length;
  gboolean launder_capped; /* the weir length needs more launder than the basin holds */
  /* rapid mix */
  gboolean round, baffled;
  double tank, liquid, impeller_d, clearance;
  int impeller; /* 0 rushton, 1 pitched-blade-45, 2 hydrofoil, 3 custom */
} Unit;

/* The page margins a drawing needs around its world box, in body text heights. */
typedef struct
{
  double x0, y0, x1, y1;
  double left, right, top, bottom;
} Frame;

static double
param (const BwProcessUnit *u, const char *id)
{
  return bw_process_unit_get (u, id);
}

static gboolean
positive (double v, const char *field, const BwProcessUnit *u, GError **error)
{
  if (isfinite (v) && v > 0.0)
    return TRUE;
  g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_GEOMETRY,
               "%s: must be greater than zero to draw unit '%s' (got %g)", field, u->id, v);
  return FALSE;
}

static gboolean
read_unit (const BwProcessUnit *u, BwSketchView view, Unit *out, GError **error)
{
  memset (out, 0, sizeof *out);
  out->type = u->type;
  if (!bw_sketch_supports (u->type, view))
    {
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_UNSUPPORTED,
                   "unit '%s': no %s sketch of a %s yet (drawn: rapid-mix tank, rectangular "
                   "settling basin)",
                   u->id, view < BW_N_SKETCH_VIEWS ? view_names[view] : "such",
                   bw_process_type_label (u->type));
      return FALSE;
    }
  if (u->type == BW_PROCESS_RECTANGULAR_BASIN)
    {
      out->length = param (u, "length");
      out->width = param (u, "width");
      out->depth = param (u, "side-water-depth");
      out->sludge = param (u, "sludge-depth");
      out->weir = param (u, "weir-length");
      out->inlet = (int) param (u, "inlet");
      if (!positive (out->length, "length", u, error) || !positive (out->width, "width", u, error)
          || !positive (out->depth, "side-water-depth", u, error))
        return FALSE;
      if (!isfinite (out->sludge) || out->sludge < 0)
        out->sludge = 0;
      /* Launder layout (schematic): an end weir across the outlet wall, and the rest of the
       * given weir length on launders with a weir each side, as few as keep them within a share
       * of the basin length and a gap apart. */
      if (isfinite (out->weir) && out->weir > out->width * 1.001)
        {
          const double rest = out->weir - out->width;
          const int most = MAX (1, (int) floor (out->width / LAUNDER_MIN_GAP_M));
          int n = (int) ceil (rest / (2.0 * LAUNDER_MAX_SHARE * out->length));
          n = CLAMP (n, 1, most);
          out->n_launders = n;
          out->launder_length = MIN (rest / (2.0 * n), 0.9 * out->length);
          out->launder_capped = rest / (2.0 * n) > 0.9 * out->length;
        }
      return TRUE;
    }
  out->round = param (u, "shape") == 1;
  out->tank = param (u, "width");
  out->liquid = param (u, "liquid-depth");
  out->baffled = param (u, "baffles") == 0;
  out->impeller = (int) param (u, "impeller");
  out->impeller_d = param (u, "impeller-diameter");
  if (!positive (out->tank, "width", u, error) || !positive (out->liquid, "liquid-depth", u, error)
      || !positive (out->impeller_d, "impeller-diameter", u, error))
    return FALSE;
  out->clearance = out->liquid / 3.0; /* drafting: a third of the depth, off the floor */
  return TRUE;
}

static void
frame_of (const Unit *n, BwSketchView view, Frame *f)
{
  if (n->type == BW_PROCESS_RECTANGULAR_BASIN)
    {
      const double t = BASIN_WALL_M;
      f->x0 = -t;
      f->x1 = n->length + t;
      if (view == BW_SKETCH_PLAN)
        {
          f->y0 = -t;
          f->y1 = n->width + t;
          *f = (Frame) { f->x0, f->y0, f->x1, f->y1, 4.0, 9.0, 4.2, 4.4 };
        }
      else
        {
          f->y0 = -n->sludge - t;
          f->y1 = n->depth + BASIN_FREEBOARD_M;
          *f = (Frame) { f->x0, f->y0, f->x1, f->y1, 4.0, 9.0, 4.2, 4.4 };
        }
      return;
    }
  {
    const double r = n->tank / 2.0 + TANK_WALL_M;
    if (view == BW_SKETCH_PLAN)
      *f = (Frame) { -r, -r, r, r, 9.0, 13.0, 1.0, 3.6 };
    else
      *f = (Frame) { -r, -TANK_WALL_M, r, n->liquid + TANK_FREEBOARD_M + 0.12 + 0.45 * n->tank,
                     9.0, 13.0, 1.0, 3.6 };
  }
}

static void trim_zeros (char *s);

/* --- layout --- */

typedef struct
{
  double body, title, small; /* text sizes, page units */
  double pad;
  double title_band, bottom_band;
} Type;

static void
type_for (const BwStyle *st, double w, double h, Type *ty)
{
  const double f = CLAMP (MIN (w / REF_WIDTH, h / REF_HEIGHT), 0.8, 4.0);
  ty->body = st->font_size * f;
  ty->title = st->title_size * f;
  ty->small = MAX (st->small_size * f, 0.8 * ty->body);
  ty->pad = 0.9 * ty->body;
  ty->title_band = ty->pad + 1.35 * ty->title + 1.35 * ty->small + 0.5 * ty->body;
  ty->bottom_band = ty->pad + 4.2 * ty->small;
}

/* The largest 1, 2 or 5 times a power of ten not above X (X > 0). */
static double
nice_below (double x)
{
  const double p = pow (10.0, floor (log10 (x)));
  const double m = x / p;
  return (m >= 5.0 ? 5.0 : m >= 2.0 ? 2.0 : 1.0) * p;
}

static gboolean
check_size (double w, double h, GError **error)
{
  if (!isfinite (w) || !isfinite (h) || w < BW_SKETCH_MIN_SIDE || h < BW_SKETCH_MIN_SIDE
      || w > BW_SKETCH_MAX_SIDE || h > BW_SKETCH_MAX_SIDE)
    {
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_SIZE,
                   "size: each side must be %g to %g (got %g x %g)", BW_SKETCH_MIN_SIDE,
                   BW_SKETCH_MAX_SIDE, w, h);
      return FALSE;
    }
  return TRUE;
}

static void
layout_frame (const Frame *f, const Type *ty, BwUnitSystem units, double w, double h,
              BwSketchGeometry *g)
{
  const double ax0 = ty->pad + f->left * ty->body;
  const double ax1 = w - ty->pad - f->right * ty->body;
  const double ay0 = ty->title_band + f->top * ty->body;
  const double ay1 = h - ty->bottom_band - f->bottom * ty->body;
  const double ww = f->x1 - f->x0, wh = f->y1 - f->y0;
  const double aw = MAX (ax1 - ax0, 10.0), ah = MAX (ay1 - ay0, 10.0);
  const double s = MIN (aw / ww, ah / wh);
  const BwUnit *unit = bw_unit_lookup (units == BW_UNIT_SYSTEM_US ? "ft" : "m", BW_KIND_LENGTH,
                                       NULL, NULL);
  double target, nice;
  g_autofree char *num = NULL;

  memset (g, 0, sizeof *g);
  g->scale = s;
  g->world_x0 = f->x0;
  g->world_y0 = f->y0;
  g->world_x1 = f->x1;
  g->world_y1 = f->y1;
  g->origin_x = (ax0 + ax1) / 2.0 - s * (f->x0 + f->x1) / 2.0;
  g->origin_y = (ay0 + ay1) / 2.0 + s * (f->y0 + f->y1) / 2.0;
  g->text_size = ty->body;

  /* Scale bar: a round length near a quarter of the canvas width (but no wider than a third). */
  target = MIN (0.25 * w, MAX (0.15 * w, 0.5 * s * ww)) / s;
  nice = nice_below (bw_unit_from_si (unit, target));
  g->bar_length_m = bw_unit_to_si (unit, nice);
  num = bw_format_number (nice, 4);
  trim_zeros (num);
  g_snprintf (g->bar_label, sizeof g->bar_label, "%s %s", num, unit->symbol);
  g->bar_width = s * g->bar_length_m;
  g->bar_height = 0.42 * ty->small;
  g->bar_x = ty->pad + 0.3 * ty->small;
  g->bar_y = h - ty->pad - 2.6 * ty->small;
}

gboolean
bw_sketch_layout (const BwProject *p, const BwProcessUnit *u, BwSketchView view,
                  BwUnitSystem units, const BwStyle *style, double width, double height,
                  BwSketchGeometry *out, GError **error)
{
  Unit n;
  Frame f;
  Type ty;

  g_return_val_if_fail (p != NULL && u != NULL && style != NULL && out != NULL, FALSE);
  if (!check_size (width, height, error) || !read_unit (u, view, &n, error))
    return FALSE;
  frame_of (&n, view, &f);
  type_for (style, width, height, &ty);
  layout_frame (&f, &ty, units, width, height, out);
  return TRUE;
}

/* --- painting helpers --- */

typedef struct
{
  cairo_t *cr;
  const BwStyle *st;
  BwUnitSystem units;
  double w, h;
  Type ty;
  BwSketchGeometry g;
  double lw; /* line width factor for this canvas */
} Ctx;

static double
px (const Ctx *c, double x)
{
  return c->g.origin_x + c->g.scale * x;
}

static double
py (const Ctx *c, double y)
{
  return c->g.origin_y - c->g.scale * y;
}

static void
set_rgb (Ctx *c, BwRgb col)
{
  cairo_set_source_rgb (c->cr, col.r, col.g, col.b);
}

static void
set_line (Ctx *c, double width)
{
  cairo_set_line_width (c->cr, width * c->lw);
  cairo_set_dash (c->cr, NULL, 0, 0);
}

static void
set_dash (Ctx *c, double on, double off)
{
  const double d[2] = { on * c->lw, off * c->lw };
  cairo_set_dash (c->cr, d, 2, 0);
}

/* A world rectangle as a page path. */
static void
wrect (Ctx *c, double x0, double y0, double x1, double y1)
{
  cairo_rectangle (c->cr, px (c, MIN (x0, x1)), py (c, MAX (y0, y1)), c->g.scale * fabs (x1 - x0),
                   c->g.scale * fabs (y1 - y0));
}

static void
fill_stroke (Ctx *c, BwRgb fill, BwRgb line, double width)
{
  set_rgb (c, fill);
  cairo_fill_preserve (c->cr);
  set_rgb (c, line);
  set_line (c, width);
  cairo_stroke (c->cr);
}

static void
wline (Ctx *c, double x0, double y0, double x1, double y1)
{
  cairo_move_to (c->cr, px (c, x0), py (c, y0));
  cairo_line_to (c->cr, px (c, x1), py (c, y1));
}

typedef struct
{
  double x, y, w, h;
} Box;

/* Text at (X, Y), the box aligned by AX, AY (0 left/top, 0.5 centre, 1 right/bottom) and kept
 * inside the canvas. Returns the box it took. */
static Box
text (Ctx *c, double x, double y, const char *s, double size, gboolean bold, double ax, double ay,
      BwRgb col)
{
  PangoLayout *layout = pango_cairo_create_layout (c->cr);
  PangoFontDescription *fd = pango_font_description_new ();
  PangoRectangle ink, logical;
  Box b;
  const double inset = 0.25 * c->ty.pad;

  pango_font_description_set_family (fd, c->st->font_family);
  pango_font_description_set_absolute_size (fd, size * PANGO_SCALE);
  pango_font_description_set_weight (fd, bold ? PANGO_WEIGHT_BOLD : PANGO_WEIGHT_NORMAL);
  pango_layout_set_font_description (layout, fd);
  pango_layout_set_text (layout, s, -1);
  pango_layout_get_pixel_extents (layout, &ink, &logical);
  b.w = logical.width;
  b.h = logical.height;
  b.x = CLAMP (x - ax * b.w, inset, MAX (inset, c->w - inset - b.w));
  b.y = CLAMP (y - ay * b.h, inset, MAX (inset, c->h - inset - b.h));
  set_rgb (c, col);
  cairo_move_to (c->cr, b.x, b.y);
  pango_cairo_show_layout (c->cr, layout);
  pango_font_description_free (fd);
  g_object_unref (layout);
  return b;
}

static double
text_width_weight (Ctx *c, const char *s, double size, gboolean bold)
{
  PangoLayout *layout = pango_cairo_create_layout (c->cr);
  PangoFontDescription *fd = pango_font_description_new ();
  int w, h;

  pango_font_description_set_family (fd, c->st->font_family);
  pango_font_description_set_absolute_size (fd, size * PANGO_SCALE);
  pango_font_description_set_weight (fd, bold ? PANGO_WEIGHT_BOLD : PANGO_WEIGHT_NORMAL);
  pango_layout_set_font_description (layout, fd);
  pango_layout_set_text (layout, s, -1);
  pango_layout_get_pixel_size (layout, &w, &h);
  pango_font_description_free (fd);
  g_object_unref (layout);
  return w;
}

static double
text_width (Ctx *c, const char *s, double size)
{
  return text_width_weight (c, s, size, FALSE);
}

/* A filled arrowhead with its tip at (X, Y) pointing along (DX, DY). */
static void
arrowhead (Ctx *c, double x, double y, double dx, double dy, double len)
{
  const double n = hypot (dx, dy);
  const double ux = dx / n, uy = dy / n;
  cairo_move_to (c->cr, x, y);
  cairo_line_to (c->cr, x - len * ux + 0.3 * len * uy, y - len * uy - 0.3 * len * ux);
  cairo_line_to (c->cr, x - len * ux - 0.3 * len * uy, y - len * uy + 0.3 * len * ux);
  cairo_close_path (c->cr);
  cairo_fill (c->cr);
}

/* Drops the trailing zeros a fixed count of significant figures leaves ("56.00 m" -> "56 m",
 * "1.100 m" -> "1.1 m"): a drawing states the entered value, not a precision. */
static void
trim_zeros (char *s)
{
  char *end = s + strcspn (s, " ");
  char *dot = memchr (s, '.', (size_t) (end - s));
  char *cut = end;

  if (dot == NULL || strpbrk (s, "eE") != NULL)
    return;
  while (cut > dot + 1 && cut[-1] == '0')
    cut--;
  if (cut == dot + 1)
    cut = dot;
  memmove (cut, end, strlen (end) + 1);
}

static char *
fmt_len (const Ctx *c, double m)
{
  char *s = bw_units_format (m, BW_KIND_LENGTH, c->units);
  trim_zeros (s);
  return s;
}

/* A horizontal dimension between page x XA and XB, drawn at page y YD, with extension lines
 * from the object at page y YO. */
static void
dim_h (Ctx *c, double xa, double xb, double yo, double yd, const char *label)
{
  const double a = 0.62 * c->ty.body;
  const double gap = 0.25 * c->ty.body, over = 0.35 * c->ty.body;
  const double dir = yd > yo ? 1.0 : -1.0;
  const double tw = text_width (c, label, c->ty.body);
  const gboolean inside = xb - xa > 2.4 * a;

  set_rgb (c, c->st->ink);
  set_line (c, c->st->line_dimension);
  cairo_move_to (c->cr, xa, yo + dir * gap);
  cairo_line_to (c->cr, xa, yd + dir * over);
  cairo_move_to (c->cr, xb, yo + dir * gap);
  cairo_line_to (c->cr, xb, yd + dir * over);
  if (inside)
    {
      cairo_move_to (c->cr, xa, yd);
      cairo_line_to (c->cr, xb, yd);
    }
  else
    {
      cairo_move_to (c->cr, xa - 1.6 * a, yd);
      cairo_line_to (c->cr, xb + 1.6 * a, yd);
    }
  cairo_stroke (c->cr);
  arrowhead (c, xa, yd, inside ? -1 : 1, 0, a);
  arrowhead (c, xb, yd, inside ? 1 : -1, 0, a);
  if (tw < xb - xa - 0.5 * a)
    text (c, (xa + xb) / 2, yd - 0.12 * c->ty.body, label, c->ty.body, FALSE, 0.5, 1.0, c->st->ink);
  else
    text (c, xb + 1.9 * a, yd, label, c->ty.body, FALSE, 0.0, 0.5, c->st->ink);
}

/* A vertical dimension between page y YA (top) and YB, at page x XD, extension lines from XO. */
static void
dim_v (Ctx *c, double ya, double yb, double xo, double xd, const char *label)
{
  const double a = 0.62 * c->ty.body;
  const double gap = 0.25 * c->ty.body, over = 0.35 * c->ty.body;
  const double dir = xd > xo ? 1.0 : -1.0;
  const gboolean inside = yb - ya > 2.4 * a;

  set_rgb (c, c->st->ink);
  set_line (c, c->st->line_dimension);
  cairo_move_to (c->cr, xo + dir * gap, ya);
  cairo_line_to (c->cr, xd + dir * over, ya);
  cairo_move_to (c->cr, xo + dir * gap, yb);
  cairo_line_to (c->cr, xd + dir * over, yb);
  if (inside)
    {
      cairo_move_to (c->cr, xd, ya);
      cairo_line_to (c->cr, xd, yb);
    }
  else
    {
      cairo_move_to (c->cr, xd, ya - 1.6 * a);
      cairo_line_to (c->cr, xd, yb + 1.6 * a);
    }
  cairo_stroke (c->cr);
  arrowhead (c, xd, ya, 0, inside ? -1 : 1, a);
  arrowhead (c, xd, yb, 0, inside ? 1 : -1, a);
  if (inside)
    text (c, xd + dir * 0.45 * c->ty.body, (ya + yb) / 2, label, c->ty.body, FALSE,
          dir > 0 ? 0.0 : 1.0, 0.5, c->st->ink);
  else /* too short for the text beside it: below the lower arrow */
    text (c, xd + dir * 0.45 * c->ty.body, yb + 0.6 * a, label, c->ty.body, FALSE,
          dir > 0 ? 0.0 : 1.0, 0.0, c->st->ink);
}

/* A label at page (TX, TY) with a leader to the point (X, Y), which gets a dot. */
static void
callout (Ctx *c, double x, double y, double tx, double ty, const char *label, double ax, double ay)
{
  Box b = text (c, tx, ty, label, c->ty.body, FALSE, ax, ay, c->st->ink);
  const double lx = CLAMP (x, b.x, b.x + b.w);
  const double ly = y < b.y ? b.y : y > b.y + b.h ? b.y + b.h : b.y + b.h / 2;
  const double ex = fabs (y - ly) < 1e-9 ? (x < b.x ? b.x : b.x + b.w) : lx;

  set_rgb (c, c->st->ink);
  set_line (c, c->st->line_dimension);
  cairo_move_to (c->cr, ex, ly);
  cairo_line_to (c->cr, x, y);
  cairo_stroke (c->cr);
  cairo_arc (c->cr, x, y, 0.16 * c->ty.body, 0, 2 * G_PI);
  cairo_fill (c->cr);
}

/* A callout whose label is LONG where it fits on the sheet beside (TX, TY), else SHORT. */
static void
callout_fit (Ctx *c, double x, double y, double tx, double ty, const char *lng, const char *shrt,
             double ax, double ay)
{
  const double w = text_width (c, lng, c->ty.body);
  const double inset = 0.25 * c->ty.pad;
  const gboolean fits = tx - ax * w >= inset && tx + (1 - ax) * w <= c->w - inset;
  callout (c, x, y, tx, ty, fits ? lng : shrt, ax, ay);
}

/* A flow arrow along page points (X0, Y0) -> (X1, Y1). */
static void
flow_arrow (Ctx *c, double x0, double y0, double x1, double y1)
{
  const double a = 0.8 * c->ty.body;
  const double n = hypot (x1 - x0, y1 - y0);
  set_rgb (c, c->st->flow);
  set_line (c, 1.8 * c->st->line_detail);
  cairo_move_to (c->cr, x0, y0);
  cairo_line_to (c->cr, x1 - 0.7 * a * (x1 - x0) / n, y1 - 0.7 * a * (y1 - y0) / n);
  cairo_stroke (c->cr);
  arrowhead (c, x1, y1, x1 - x0, y1 - y0, a);
}

/* The free-surface mark: an open triangle standing on the water line at page (X, Y). */
static void
water_mark (Ctx *c, double x, double y)
{
  const double s = 0.55 * c->ty.body;
  set_rgb (c, c->st->water_line);
  set_line (c, c->st->line_detail);
  cairo_move_to (c->cr, x, y);
  cairo_line_to (c->cr, x - s, y - 1.1 * s);
  cairo_line_to (c->cr, x + s, y - 1.1 * s);
  cairo_close_path (c->cr);
  cairo_stroke (c->cr);
  cairo_move_to (c->cr, x - 0.7 * s, y + 0.35 * s);
  cairo_line_to (c->cr, x + 0.7 * s, y + 0.35 * s);
  cairo_move_to (c->cr, x - 0.4 * s, y + 0.7 * s);
  cairo_line_to (c->cr, x + 0.4 * s, y + 0.7 * s);
  cairo_stroke (c->cr);
}

/* Diagonal hatching of the world rectangle, in COL. */
static void
hatch (Ctx *c, double x0, double y0, double x1, double y1, BwRgb col)
{
  const double step = MAX (0.45 * c->ty.body, 3.0);
  const double l = px (c, x0), r = px (c, x1), t = py (c, y1), b = py (c, y0);
  cairo_save (c->cr);
  cairo_rectangle (c->cr, l, t, r - l, b - t);
  cairo_clip (c->cr);
  set_rgb (c, col);
  set_line (c, 0.6 * c->st->line_dimension);
  for (double x = l - (b - t); x < r; x += step)
    {
      cairo_move_to (c->cr, x, b);
      cairo_line_to (c->cr, x + (b - t), t);
    }
  cairo_stroke (c->cr);
  cairo_restore (c->cr);
}

/* --- rectangular basin --- */

static const char *
inlet_label (const Unit *n)
{
  return n->inlet == 0   ? "perforated baffle wall"
         : n->inlet == 1 ? "inlet baffle"
                         : "no inlet baffle";
}

static double
baffle_x (const Unit *n)
{
  return CLAMP (0.04 * n->length, 0.8, 2.0);
}

/* The launder callout's short form, for a sheet too narrow for the long one. */
static char *
launder_text_short (const Ctx *c, const Unit *n)
{
  g_autofree char *weir = fmt_len (c, n->weir);
  if (n->weir <= 0)
    return g_strdup ("effluent weir");
  return g_strdup_printf ("weirs %s in all (schematic)", weir);
}

static char *launder_text (const Ctx *c, const Unit *n);

/* The two callouts above a basin view: the inlet's on the left, the outlet's on the right, the
 * outlet's shortened and then lifted a line when the two would collide. */
static void
basin_callouts (Ctx *c, const Unit *n, double inlet_x, double inlet_y, double out_x, double out_y,
                double row)
{
  const double fs = c->ty.body;
  const double left = px (c, 0), right = px (c, n->length + BASIN_WALL_M);
  const double wl = text_width (c, inlet_label (n), fs);
  g_autofree char *lt = launder_text (c, n);
  double wr = text_width (c, lt, fs);
  double lift = 0;

  if (left + wl + 1.5 * fs > right - wr)
    {
      g_free (lt);
      lt = launder_text_short (c, n);
      wr = text_width (c, lt, fs);
    }
  if (left + wl + 1.5 * fs > right - wr)
    lift = 1.3 * fs;
  callout (c, inlet_x, inlet_y, left, row, inlet_label (n), 0.0, 1.0);
  callout (c, out_x, out_y, right, row - lift, lt, 1.0, 1.0);
}

static char *
launder_text (const Ctx *c, const Unit *n)
{
  g_autofree char *weir = fmt_len (c, n->weir);
  g_autofree char *ll = fmt_len (c, n->launder_length);
  if (n->weir <= 0)
    return g_strdup ("effluent weir across the outlet wall (length not given)");
  if (n->n_launders == 0)
    return g_strdup_printf ("effluent weir, %s", weir);
  if (n->launder_capped)
    return g_strdup_printf ("weirs %s in all: more than the %d launders drawn hold (schematic)",
                            weir, n->n_launders);
  return g_strdup_printf ("%d launder%s × %s, weirs both sides, + end weir: %s in all (layout "
                          "schematic)",
                          n->n_launders, n->n_launders > 1 ? "s" : "", ll, weir);
}

static void
basin_section (Ctx *c, const Unit *n)
{
  const double t = BASIN_WALL_M, L = n->length, H = n->depth, s = n->sludge;
  const double top = H + BASIN_FREEBOARD_M;
  const double xb = baffle_x (n);
  const double port_lo = 0.45 * H, port_hi = MIN (0.45 * H + 0.6, 0.9 * H);
  const BwStyle *st = c->st;
  const double fs = c->ty.body;
  double xl = L;

  /* water and sludge */
  wrect (c, 0, -s, L, H);
  set_rgb (c, st->water);
  cairo_fill (c->cr);
  if (s > 0)
    {
      wrect (c, 0, -s, L, 0);
      set_rgb (c, st->sludge);
      cairo_fill (c->cr);
      hatch (c, 0, -s, L, 0, st->sludge_line);
      set_rgb (c, st->sludge_line);
      set_line (c, st->line_detail);
      set_dash (c, 6, 3);
      wline (c, 0, 0, L, 0);
      cairo_stroke (c->cr);
    }

  /* structure: walls with the inlet port and the floor slab */
  wrect (c, -t, port_hi, 0, top);
  wrect (c, -t, -s - t, 0, port_lo);
  wrect (c, L, -s - t, L + t, top);
  wrect (c, 0, -s - t, L, -s);
  fill_stroke (c, st->concrete, st->ink, st->line_outline);
  wrect (c, -t, port_lo, 0, port_hi);
  set_rgb (c, st->water);
  cairo_fill (c->cr);

  /* inlet baffle */
  set_rgb (c, st->equipment);
  if (n->inlet == 0)
    {
      /* solid below and above the perforated band, slots in between */
      const double lo = 0.2 * H, hi = 0.85 * H;
      const int slots = 6;
      const double pitch = (hi - lo) / slots;
      wrect (c, xb, -s, xb + BAFFLE_THICK_M, lo);
      wrect (c, xb, hi, xb + BAFFLE_THICK_M, top - 0.1);
      for (int i = 0; i < slots; i++)
        wrect (c, xb, lo + i * pitch + 0.45 * pitch, xb + BAFFLE_THICK_M, lo + (i + 1) * pitch);
      fill_stroke (c, st->equipment, st->equipment, 0.4 * st->line_detail);
    }
  else if (n->inlet == 1)
    {
      wrect (c, xb, 0.45 * H, xb + BAFFLE_THICK_M, top - 0.1);
      fill_stroke (c, st->equipment, st->equipment, 0.4 * st->line_detail);
    }

  /* launders (or the end weir) at the outlet */
  if (n->n_launders > 0)
    {
      xl = L - n->launder_length;
      wrect (c, xl, H - LAUNDER_DEPTH_M, L, H + 0.08);
      fill_stroke (c, st->paper, st->equipment, st->line_detail);
      /* V-notches along the crest, where the scale lets them show */
      if (0.3 * c->g.scale > 4.0)
        {
          set_rgb (c, st->equipment);
          set_line (c, 0.7 * st->line_detail);
          for (double x = xl + 0.15; x < L - 0.1; x += 0.3)
            {
              cairo_move_to (c->cr, px (c, x - 0.1), py (c, H + 0.08));
              cairo_line_to (c->cr, px (c, x), py (c, H - 0.02));
              cairo_line_to (c->cr, px (c, x + 0.1), py (c, H + 0.08));
            }
          cairo_stroke (c->cr);
        }
    }
  else
    {
      xl = L - 0.25;
      wrect (c, L - 0.08, H - LAUNDER_DEPTH_M, L, H + 0.05);
      fill_stroke (c, st->equipment, st->equipment, 0.4 * st->line_detail);
    }

  /* water surface */
  set_rgb (c, st->water_line);
  set_line (c, 1.2 * st->line_detail);
  wline (c, 0, H, L, H);
  cairo_stroke (c->cr);
  water_mark (c, px (c, 0.25 * L), py (c, H));

  /* flow: in through the port, along the settling zone, out over the weirs */
  flow_arrow (c, px (c, -t) - 3.0 * fs, py (c, (port_lo + port_hi) / 2), px (c, 0) + 0.6 * fs,
              py (c, (port_lo + port_hi) / 2));
  for (int i = 0; i < 3; i++)
    {
      const double x0 = xb + 0.12 * L + i * 0.18 * L;
      if (c->g.scale * 0.1 * L > 2.0 * fs)
        flow_arrow (c, px (c, x0), py (c, 0.3 * H), px (c, x0 + 0.1 * L), py (c, 0.3 * H));
    }
  flow_arrow (c, px (c, L + t) + 0.3 * fs, py (c, H - 0.5 * LAUNDER_DEPTH_M),
              px (c, L + t) + 3.0 * fs, py (c, H - 0.5 * LAUNDER_DEPTH_M));

  /* zone names inside, where they fit */
  if (c->g.scale * H > 1.6 * fs)
    text (c, px (c, 0.5 * L), py (c, 0.62 * H), "settling zone", fs, FALSE, 0.5, 0.5, st->ink);

  /* callouts above and below */
  /* the outlet's leader lands a fifth along the launder, clear of its dimension text */
  basin_callouts (c, n, px (c, xb + BAFFLE_THICK_M / 2), py (c, top - 0.1),
                  px (c, xl + 0.2 * (L - xl)),
                  py (c, H + 0.08), py (c, top) - 2.6 * fs);
  if (s > 0)
    callout (c, px (c, 0.8 * L), py (c, -s / 2), px (c, 0.78 * L), py (c, -s - t) + 2.9 * fs,
             "sludge zone", 1.0, 0.0);

  /* dimensions */
  {
    g_autofree char *lt = fmt_len (c, L);
    g_autofree char *ht = fmt_len (c, H);
    g_autofree char *st_ = fmt_len (c, s);
    const double xr = px (c, L + t);
    dim_h (c, px (c, 0), px (c, L), py (c, -s - t), py (c, -s - t) + 1.7 * fs, lt);
    dim_v (c, py (c, H), py (c, 0), xr, xr + 3.6 * fs, ht);
    if (s > 0)
      dim_v (c, py (c, 0), py (c, -s), xr, xr + 3.6 * fs, st_);
  }
}

static void
basin_plan (Ctx *c, const Unit *n)
{
  const double t = BASIN_WALL_M, L = n->length, W = n->width;
  const double xb = baffle_x (n);
  const BwStyle *st = c->st;
  const double fs = c->ty.body;
  double xl = L;

  wrect (c, 0, 0, L, W);
  set_rgb (c, st->water);
  cairo_fill (c->cr);
  /* walls, the inlet opening left in the middle of the end wall */
  {
    const double o = MIN (0.3 * W, 0.8);
    wrect (c, -t, -t, L + t, 0);
    wrect (c, -t, W, L + t, W + t);
    wrect (c, L, 0, L + t, W);
    wrect (c, -t, 0, 0, W / 2 - o / 2);
    wrect (c, -t, W / 2 + o / 2, 0, W);
    fill_stroke (c, st->concrete, st->ink, st->line_outline);
    wrect (c, -t, W / 2 - o / 2, 0, W / 2 + o / 2);
    set_rgb (c, st->water);
    cairo_fill (c->cr);
  }

  /* inlet baffle across the basin: dashes for the perforated wall */
  if (n->inlet != 2)
    {
      set_rgb (c, st->equipment);
      set_line (c, MAX (c->g.scale * BAFFLE_THICK_M / c->lw, 1.6 * st->line_detail));
      if (n->inlet == 0)
        set_dash (c, 5, 2.5);
      wline (c, xb + BAFFLE_THICK_M / 2, 0, xb + BAFFLE_THICK_M / 2, W);
      cairo_stroke (c->cr);
    }

  /* launders with a weir each side, and the end weir */
  if (n->n_launders > 0)
    {
      const double lw = MIN (LAUNDER_WIDTH_M, 0.5 * W / n->n_launders);
      xl = L - n->launder_length;
      for (int i = 0; i < n->n_launders; i++)
        {
          const double yc = W * (2 * i + 1) / (2.0 * n->n_launders);
          wrect (c, xl, yc - lw / 2, L, yc + lw / 2);
          fill_stroke (c, st->paper, st->equipment, 1.3 * st->line_detail);
        }
    }
  set_rgb (c, st->equipment);
  set_line (c, 2.0 * st->line_detail);
  wline (c, L - 0.06, 0, L - 0.06, W);
  cairo_stroke (c->cr);

  /* flow */
  flow_arrow (c, px (c, -t) - 3.0 * fs, py (c, W / 2), px (c, 0) + 0.6 * fs, py (c, W / 2));
  if (c->g.scale * 0.1 * L > 2.0 * fs)
    for (int i = 0; i < 3; i++)
      {
        const double x0 = xb + 0.12 * L + i * 0.18 * L;
        const double y = n->n_launders % 2 == 1 && x0 + 0.1 * L > xl ? W / 4 : W / 2;
        flow_arrow (c, px (c, x0), py (c, y), px (c, x0 + 0.1 * L), py (c, y));
      }

  if (c->g.scale * W > 3.2 * fs)
    text (c, px (c, 0.42 * L), py (c, W / 2) - 0.2 * fs, "settling zone", fs, FALSE, 0.5, 1.0,
          st->ink);

  {
    /* the outlet callout points at the launder nearest the top edge */
    const int nl = n->n_launders;
    const double yl = nl > 0 ? W * (2 * nl - 1) / (2.0 * nl) : W;
    basin_callouts (c, n, px (c, xb + BAFFLE_THICK_M / 2), py (c, W),
                    px (c, xl + 0.2 * (L - xl)),
                    py (c, yl), py (c, W + t) - 2.6 * fs);
  }

  {
    g_autofree char *lt = fmt_len (c, L);
    g_autofree char *wt = fmt_len (c, W);
    const double xr = px (c, L + t);
    dim_h (c, px (c, 0), px (c, L), py (c, -t), py (c, -t) + 1.7 * fs, lt);
    dim_v (c, py (c, W), py (c, 0), xr, xr + 3.6 * fs, wt);
    if (n->n_launders > 0)
      {
        g_autofree char *ll = fmt_len (c, n->launder_length);
        dim_h (c, px (c, xl), px (c, L), py (c, W + t), py (c, W + t) - 1.0 * fs, ll);
      }
  }
}

/* --- rapid-mix tank --- */

static const char *const impeller_labels[] = {
  "radial flat-blade disc turbine", "45° pitched-blade turbine", "hydrofoil impeller",
  "impeller (custom)",
};

static const char *const impeller_short[] = {
  "disc turbine", "pitched blade", "hydrofoil", "impeller",
};

static const char *
impeller_label (const Unit *n)
{
  return impeller_labels[CLAMP (n->impeller, 0, 3)];
}

static const char *
impeller_label_short (const Unit *n)
{
  return impeller_short[CLAMP (n->impeller, 0, 3)];
}

/* The impeller seen from the side, hub at world (0, C). */
static void
impeller_side (Ctx *c, const Unit *n)
{
  const double d = n->impeller_d, C = n->clearance;
  const BwStyle *st = c->st;

  set_rgb (c, st->equipment);
  wrect (c, -0.05 * d, C - 0.06 * d, 0.05 * d, C + 0.06 * d); /* hub */
  cairo_fill (c->cr);
  switch (n->impeller)
    {
    case 0: /* disc with flat blades at its rim */
      wrect (c, -0.375 * d, C - 0.012 * d, 0.375 * d, C + 0.012 * d);
      cairo_fill (c->cr);
      wrect (c, 0.25 * d, C - 0.1 * d, 0.5 * d, C + 0.1 * d);
      wrect (c, -0.5 * d, C - 0.1 * d, -0.25 * d, C + 0.1 * d);
      wrect (c, -0.05 * d, C - 0.1 * d, 0.05 * d, C + 0.1 * d);
      fill_stroke (c, st->equipment, st->equipment, 0.5 * st->line_detail);
      break;
    case 1: /* blades pitched at 45°: full face at the sides, an inclined edge in the middle */
      wrect (c, 0.05 * d, C - 0.07 * d, 0.5 * d, C + 0.07 * d);
      wrect (c, -0.5 * d, C - 0.07 * d, -0.05 * d, C + 0.07 * d);
      fill_stroke (c, st->equipment, st->equipment, 0.5 * st->line_detail);
      set_line (c, 2.2 * st->line_detail);
      wline (c, -0.1 * d, C - 0.1 * d, 0.1 * d, C + 0.1 * d);
      cairo_stroke (c->cr);
      break;
    case 2: /* thin cambered blades, drooping to the tip */
      for (int side = -1; side <= 1; side += 2)
        {
          cairo_move_to (c->cr, px (c, side * 0.05 * d), py (c, C + 0.05 * d));
          cairo_curve_to (c->cr, px (c, side * 0.25 * d), py (c, C + 0.07 * d),
                          px (c, side * 0.4 * d), py (c, C + 0.02 * d), px (c, side * 0.5 * d),
                          py (c, C - 0.04 * d));
          cairo_curve_to (c->cr, px (c, side * 0.38 * d), py (c, C - 0.01 * d),
                          px (c, side * 0.22 * d), py (c, C - 0.02 * d), px (c, side * 0.05 * d),
                          py (c, C - 0.04 * d));
          cairo_close_path (c->cr);
        }
      fill_stroke (c, st->equipment, st->equipment, 0.5 * st->line_detail);
      break;
    default:
      set_line (c, st->line_detail);
      set_dash (c, 4, 2.5);
      wrect (c, -0.5 * d, C - 0.08 * d, 0.5 * d, C + 0.08 * d);
      cairo_stroke (c->cr);
      break;
    }
}

/* The impeller seen from above, centred on the world origin. Paths are built in metres with
 * y up; the transform is dropped again before stroking, so line widths stay in page units. */
static void
impeller_plan (Ctx *c, const Unit *n)
{
  const double d = n->impeller_d;
  const BwStyle *st = c->st;
  const int blades[] = { 6, 4, 3, 0 };
  const int nb = blades[CLAMP (n->impeller, 0, 3)];
  cairo_matrix_t page;

  cairo_get_matrix (c->cr, &page);
  cairo_translate (c->cr, px (c, 0), py (c, 0));
  cairo_scale (c->cr, c->g.scale, -c->g.scale);
  if (n->impeller == 0 || n->impeller == 3)
    {
      cairo_new_path (c->cr);
      cairo_arc (c->cr, 0, 0, n->impeller == 0 ? 0.375 * d : 0.5 * d, 0, 2 * G_PI);
      cairo_set_matrix (c->cr, &page);
      set_rgb (c, st->equipment);
      set_line (c, st->line_detail);
      if (n->impeller == 3)
        set_dash (c, 4, 2.5);
      cairo_stroke (c->cr);
      cairo_translate (c->cr, px (c, 0), py (c, 0));
      cairo_scale (c->cr, c->g.scale, -c->g.scale);
    }
  for (int i = 0; i < nb; i++)
    {
      const double a = 2 * G_PI * i / nb + G_PI / 2;
      cairo_save (c->cr);
      cairo_rotate (c->cr, a);
      if (n->impeller == 0)
        cairo_rectangle (c->cr, 0.25 * d, -0.015 * d, 0.25 * d, 0.03 * d);
      else if (n->impeller == 1)
        cairo_rectangle (c->cr, 0.05 * d, -0.05 * d, 0.45 * d, 0.1 * d);
      else
        {
          cairo_move_to (c->cr, 0.04 * d, -0.09 * d);
          cairo_curve_to (c->cr, 0.2 * d, -0.12 * d, 0.4 * d, -0.06 * d, 0.5 * d, -0.02 * d);
          cairo_curve_to (c->cr, 0.4 * d, 0.02 * d, 0.2 * d, 0.06 * d, 0.04 * d, 0.09 * d);
          cairo_close_path (c->cr);
        }
      cairo_restore (c->cr);
    }
  cairo_new_sub_path (c->cr);
  cairo_arc (c->cr, 0, 0, 0.07 * d, 0, 2 * G_PI);
  cairo_set_matrix (c->cr, &page);
  set_rgb (c, st->equipment);
  cairo_fill (c->cr);
  /* the shaft, cut */
  set_rgb (c, st->ink);
  cairo_arc (c->cr, px (c, 0), py (c, 0), MAX (0.03 * d * c->g.scale, 1.5), 0, 2 * G_PI);
  cairo_fill (c->cr);
}

static void
rapid_mix_section (Ctx *c, const Unit *n)
{
  const double R = n->tank / 2, H = n->liquid, t = TANK_WALL_M, top = H + TANK_FREEBOARD_M;
  const double bw = TANK_BAFFLE_SHARE * n->tank, beam = 0.12, motor = 0.45 * n->tank;
  const BwStyle *st = c->st;
  const double fs = c->ty.body;
  const double in_lo = 0.08 * H, in_hi = MIN (in_lo + 0.15, 0.3 * H);
  const double out_hi = 0.92 * H, out_lo = MAX (out_hi - 0.15, 0.7 * H);
  const double xr = px (c, R + t);
  const double xl = px (c, -R - t);

  wrect (c, -R, 0, R, H);
  set_rgb (c, st->water);
  cairo_fill (c->cr);

  /* walls with an inlet port low on the left and an outlet high on the right; floor */
  wrect (c, -R - t, -t, R + t, 0);
  wrect (c, -R - t, 0, -R, in_lo);
  wrect (c, -R - t, in_hi, -R, top);
  wrect (c, R, 0, R + t, out_lo);
  wrect (c, R, out_hi, R + t, top);
  fill_stroke (c, st->concrete, st->ink, st->line_outline);
  wrect (c, -R - t, in_lo, -R, in_hi);
  wrect (c, R, out_lo, R + t, out_hi);
  set_rgb (c, st->water);
  cairo_fill (c->cr);

  /* wall baffles: the two the section cuts */
  if (n->baffled)
    {
      wrect (c, -R, 0.03 * H, -R + bw, top);
      wrect (c, R - bw, 0.03 * H, R, top);
      fill_stroke (c, st->paper, st->equipment, st->line_detail);
      hatch (c, -R, 0.03 * H, -R + bw, top, st->equipment);
      hatch (c, R - bw, 0.03 * H, R, top, st->equipment);
    }

  set_rgb (c, st->water_line);
  set_line (c, 1.2 * st->line_detail);
  wline (c, -R + (n->baffled ? bw : 0), H, R - (n->baffled ? bw : 0), H);
  cairo_stroke (c->cr);
  water_mark (c, px (c, -0.5 * R), py (c, H));

  /* drive on a beam across the tank, shaft down to the impeller */
  wrect (c, -R - t, top, R + t, top + beam);
  fill_stroke (c, st->concrete, st->ink, st->line_outline);
  wrect (c, -0.16 * n->tank, top + beam, 0.16 * n->tank, top + beam + 0.45 * motor);
  wrect (c, -0.11 * n->tank, top + beam + 0.45 * motor, 0.11 * n->tank, top + beam + motor);
  fill_stroke (c, st->paper, st->ink, st->line_detail);
  set_rgb (c, st->ink);
  set_line (c, MAX (0.03 * n->impeller_d * c->g.scale / c->lw, st->line_outline));
  wline (c, 0, top, 0, n->clearance);
  cairo_stroke (c->cr);
  set_rgb (c, st->ink_muted);
  set_line (c, 0.6 * st->line_dimension);
  set_dash (c, 9, 2.5);
  cairo_move_to (c->cr, px (c, 0), py (c, -t) + 0.4 * fs);
  cairo_line_to (c->cr, px (c, 0), py (c, top + beam + motor) - 0.4 * fs);
  cairo_stroke (c->cr);
  impeller_side (c, n);

  /* flow in and out */
  flow_arrow (c, xl - 3.2 * fs, py (c, (in_lo + in_hi) / 2), px (c, -R) + 0.4 * fs,
              py (c, (in_lo + in_hi) / 2));
  flow_arrow (c, px (c, R) - 0.2 * fs, py (c, (out_lo + out_hi) / 2), xr + 3.0 * fs,
              py (c, (out_lo + out_hi) / 2));

  /* callouts, right */
  {
    g_autofree char *bt = g_strdup_printf ("wall baffles, %d (one-twelfth of the width)",
                                           TANK_BAFFLES);
    const double tx = xr + 7.0 * fs;
    callout (c, px (c, 0.13 * n->tank), py (c, top + beam + 0.6 * motor), tx,
             py (c, top + beam + 0.6 * motor), "drive", 0.0, 0.5);
    if (n->baffled)
      callout_fit (c, px (c, R - bw / 2), py (c, 0.75 * H), tx, py (c, 0.72 * H) - 1.0 * fs, bt,
                   "wall baffles", 0.0, 0.5);
    callout_fit (c, px (c, 0.45 * n->impeller_d), py (c, n->clearance), tx,
                 py (c, n->clearance) + 1.4 * fs, impeller_label (n), impeller_label_short (n), 0.0,
                 0.5);
    callout (c, px (c, -0.5 * R), py (c, H), xl - 0.5 * fs, py (c, top + beam) - 1.0 * fs,
             "liquid level", 1.0, 0.5);
    if (!n->baffled)
      callout (c, px (c, R), py (c, 0.75 * H), tx, py (c, 0.72 * H) - 1.0 * fs, "no wall baffles",
               0.0, 0.5);
  }

  /* dimensions */
  {
    g_autofree char *dt = fmt_len (c, n->tank);
    g_autofree char *label = g_strdup_printf ("%s%s", n->round ? "Ø " : "", dt);
    g_autofree char *ht = fmt_len (c, H);
    g_autofree char *it = fmt_len (c, n->impeller_d);
    g_autofree char *il = g_strdup_printf ("Ø %s", it);
    const double yi = py (c, n->clearance) + 1.9 * fs;
    dim_h (c, px (c, -R), px (c, R), py (c, -t), py (c, -t) + 1.7 * fs, label);
    dim_v (c, py (c, H), py (c, 0), xr, xr + 2.0 * fs, ht);
    dim_h (c, px (c, -n->impeller_d / 2), px (c, n->impeller_d / 2),
           py (c, n->clearance) + 0.6 * fs, yi, il);
  }
}

static void
rapid_mix_plan (Ctx *c, const Unit *n)
{
  const double R = n->tank / 2, t = TANK_WALL_M;
  const double bw = TANK_BAFFLE_SHARE * n->tank;
  const BwStyle *st = c->st;
  const double fs = c->ty.body;
  const double s = c->g.scale;
  const double cx = px (c, 0), cy = py (c, 0);

  /* water, then the walls, whose outline is centred on the inner face as in every view */
  if (n->round)
    cairo_arc (c->cr, cx, cy, s * R, 0, 2 * G_PI);
  else
    wrect (c, -R, -R, R, R);
  set_rgb (c, st->water);
  cairo_fill (c->cr);
  if (n->round)
    {
      cairo_arc (c->cr, cx, cy, s * (R + t), 0, 2 * G_PI);
      cairo_new_sub_path (c->cr);
      cairo_arc_negative (c->cr, cx, cy, s * R, 2 * G_PI, 0);
    }
  else
    {
      wrect (c, -R - t, -R - t, R + t, R + t);
      cairo_new_sub_path (c->cr);
      cairo_move_to (c->cr, px (c, -R), py (c, -R));
      cairo_line_to (c->cr, px (c, -R), py (c, R));
      cairo_line_to (c->cr, px (c, R), py (c, R));
      cairo_line_to (c->cr, px (c, R), py (c, -R));
      cairo_close_path (c->cr);
    }
  cairo_set_fill_rule (c->cr, CAIRO_FILL_RULE_EVEN_ODD);
  fill_stroke (c, st->concrete, st->ink, st->line_outline);
  cairo_set_fill_rule (c->cr, CAIRO_FILL_RULE_WINDING);

  /* wall baffles at the quarter points */
  if (n->baffled)
    for (int i = 0; i < TANK_BAFFLES; i++)
      {
        cairo_save (c->cr);
        cairo_translate (c->cr, cx, cy);
        cairo_rotate (c->cr, 2 * G_PI * i / TANK_BAFFLES);
        cairo_rectangle (c->cr, s * (R - bw), -MAX (s * 0.012 * n->tank, 1.5),
                         s * bw, 2 * MAX (s * 0.012 * n->tank, 1.5));
        cairo_restore (c->cr);
        fill_stroke (c, st->equipment, st->equipment, 0.5 * st->line_detail);
      }

  /* the drive beam above, hidden lines */
  set_rgb (c, st->ink_muted);
  set_line (c, st->line_dimension);
  set_dash (c, 5, 3);
  wrect (c, -R - t, -0.06 * n->tank, R + t, 0.06 * n->tank);
  cairo_stroke (c->cr);

  impeller_plan (c, n);

  /* inlet and outlet pipes through the wall, and the flow */
  {
    const double y = 0.55 * R, pipe = 0.06 * n->tank;
    const double inner = n->round ? sqrt (R * R - y * y) : R;
    const double outer = n->round ? sqrt ((R + t) * (R + t) - y * y) : R + t;
    /* the pipes stop at the inner face: clip them to everything outside the water */
    cairo_save (c->cr);
    cairo_rectangle (c->cr, 0, 0, c->w, c->h);
    if (n->round)
      cairo_arc (c->cr, cx, cy, s * R, 0, 2 * G_PI);
    else
      wrect (c, -R, -R, R, R);
    cairo_set_fill_rule (c->cr, CAIRO_FILL_RULE_EVEN_ODD);
    cairo_clip (c->cr);
    wrect (c, -outer - 0.02, -y - pipe, -inner + 0.05, -y + pipe);
    wrect (c, inner - 0.05, y - pipe, outer + 0.02, y + pipe);
    fill_stroke (c, st->water, st->ink, st->line_detail);
    cairo_restore (c->cr);
    flow_arrow (c, px (c, -outer) - 3.2 * fs, py (c, -y), px (c, -inner) + 0.5 * fs, py (c, -y));
    flow_arrow (c, px (c, inner) - 0.5 * fs, py (c, y), px (c, outer) + 3.2 * fs, py (c, y));
  }

  {
    const double tx = px (c, R + t) + 6.5 * fs;
    g_autofree char *bt = g_strdup_printf ("wall baffles, %d", TANK_BAFFLES);
    if (n->baffled)
      callout_fit (c, px (c, R - bw / 2), py (c, 0), tx, py (c, 0) + 1.5 * fs, bt, "baffles", 0.0,
                   0.5);
    callout_fit (c, px (c, 0), py (c, 0.4 * n->impeller_d), tx, py (c, 0.85 * R),
                 impeller_label (n), impeller_label_short (n), 0.0, 0.5);
    callout_fit (c, px (c, R + t * 0.3), py (c, 0.05 * n->tank), tx, py (c, 0.3 * R),
                 "drive beam above", "drive beam", 0.0, 0.5);
  }

  {
    g_autofree char *dt = fmt_len (c, n->tank);
    g_autofree char *label = g_strdup_printf ("%s%s", n->round ? "Ø " : "", dt);
    g_autofree char *it = fmt_len (c, n->impeller_d);
    g_autofree char *il = g_strdup_printf ("Ø %s", it);
    dim_h (c, px (c, -R), px (c, R), py (c, -R - t), py (c, -R - t) + 1.7 * fs, label);
    if (!n->round)
      dim_v (c, py (c, R), py (c, -R), px (c, R + t), px (c, R + t) + 2.0 * fs, dt);
    dim_h (c, px (c, -n->impeller_d / 2), px (c, n->impeller_d / 2), py (c, 0),
           py (c, -0.5 * n->impeller_d) + 1.6 * fs, il);
  }
}

/* --- sheet furniture: title, scale bar, note --- */

static void
scale_bar (Ctx *c)
{
  const BwSketchGeometry *g = &c->g;
  const double sub = g->bar_length_m / 5.0;

  cairo_rectangle (c->cr, g->bar_x, g->bar_y, g->bar_width, g->bar_height);
  set_rgb (c, c->st->scale_bar);
  cairo_fill (c->cr);
  /* ticks above the band at fifths, taller at the ends */
  set_rgb (c, c->st->ink);
  set_line (c, c->st->line_dimension);
  for (int i = 0; i <= 5; i++)
    {
      const double x = g->bar_x + g->scale * sub * i;
      const double len = (i == 0 || i == 5) ? 0.75 * c->ty.small : 0.4 * c->ty.small;
      cairo_move_to (c->cr, x, g->bar_y - 0.1 * c->ty.small);
      cairo_line_to (c->cr, x, g->bar_y - 0.1 * c->ty.small - len);
    }
  cairo_stroke (c->cr);
  text (c, g->bar_x, g->bar_y + g->bar_height + 0.15 * c->ty.small, "0", c->ty.small, FALSE, 0.5,
        0.0, c->st->ink);
  text (c, g->bar_x + g->bar_width, g->bar_y + g->bar_height + 0.15 * c->ty.small, g->bar_label,
        c->ty.small, FALSE, 0.5, 0.0, c->st->ink);
}

static const char *
view_title (const Unit *n, BwSketchView view)
{
  if (n->type == BW_PROCESS_RECTANGULAR_BASIN)
    return view == BW_SKETCH_PLAN ? "plan" : "longitudinal section";
  return view == BW_SKETCH_PLAN ? "plan" : "section on the shaft";
}

static void
sheet (Ctx *c, const BwProject *p, const BwProcessUnit *u, const Unit *n, BwSketchView view)
{
  const BwStyle *st = c->st;
  const Type *ty = &c->ty;
  g_autofree char *title = g_strdup_printf ("%s — %s", u->name && *u->name ? u->name : u->id,
                                            view_title (n, view));
  g_autofree char *units = NULL;
  g_autofree char *sub = NULL;
  g_autofree char *right = NULL;
  g_autofree char *drafting = NULL;
  Box b;

  if (u->n_parallel > 1 && u->n_standby > 0)
    units = g_strdup_printf (", one of %u alike (%u standby)", u->n_parallel, u->n_standby);
  else if (u->n_parallel > 1)
    units = g_strdup_printf (", one of %u alike", u->n_parallel);
  sub = g_strdup_printf ("%s · %s%s", u->id, bw_process_type_label (u->type), units ? units : "");
  right = g_strdup_printf ("%s%s%s", p->name ? p->name : "", p->revision ? " · rev. " : "",
                           p->revision ? p->revision : "");

  b = text (c, ty->pad, ty->pad, title, ty->title, TRUE, 0.0, 0.0, st->ink);
  text (c, ty->pad, b.y + b.h + 0.1 * ty->small, sub, ty->small, FALSE, 0.0, 0.0, st->ink_muted);
  if (text_width_weight (c, title, ty->title, TRUE) + text_width (c, right, ty->small) + 3 * ty->pad
      < c->w)
    text (c, c->w - ty->pad, ty->pad + 0.2 * ty->title, right, ty->small, FALSE, 1.0, 0.0,
          st->ink_muted);
  set_rgb (c, st->ink_muted);
  set_line (c, 0.6 * st->line_dimension);
  cairo_move_to (c->cr, ty->pad, ty->title_band - 0.35 * ty->body);
  cairo_line_to (c->cr, c->w - ty->pad, ty->title_band - 0.35 * ty->body);
  cairo_move_to (c->cr, ty->pad, c->h - ty->bottom_band + 0.2 * ty->small);
  cairo_line_to (c->cr, c->w - ty->pad, c->h - ty->bottom_band + 0.2 * ty->small);
  cairo_stroke (c->cr);

  scale_bar (c);

  drafting = g_strdup (n->type == BW_PROCESS_RECTANGULAR_BASIN
                           ? "To scale from the design inputs; walls, freeboard and launder "
                             "layout are drawn by convention."
                           : "To scale from the design inputs; walls, freeboard, drive and "
                             "impeller elevation are drawn by convention.");
  {
    const double x = c->g.bar_x + c->g.bar_width + 0.5 * text_width (c, c->g.bar_label, ty->small)
                     + 2.0 * ty->small;
    const double avail = c->w - ty->pad - x;
    const char *line2 = "Preliminary: verify with a licensed professional engineer.";
    if (text_width (c, drafting, ty->small) <= avail && text_width (c, line2, ty->small) <= avail)
      {
        text (c, c->w - ty->pad, c->h - ty->pad - 2.3 * ty->small, drafting, ty->small, FALSE, 1.0,
              0.0, st->ink_muted);
        text (c, c->w - ty->pad, c->h - ty->pad - 1.05 * ty->small, line2, ty->small, FALSE, 1.0,
              0.0, st->ink_muted);
      }
    else
      text (c, c->w - ty->pad, c->h - ty->pad - 1.6 * ty->small, "Preliminary; drawn by convention "
            "where the inputs are silent.", 0.85 * ty->small, FALSE, 1.0, 0.0, st->ink_muted);
  }
}

gboolean
bw_sketch_paint (const BwProject *p, const BwProcessUnit *u, BwSketchView view,
                 BwUnitSystem units, const BwStyle *style, cairo_t *cr, double width,
                 double height, GError **error)
{
  Ctx c = { 0 };
  Unit n;
  Frame f;
  cairo_status_t status;

  g_return_val_if_fail (p != NULL && u != NULL && style != NULL && cr != NULL, FALSE);
  if (cairo_status (cr) != CAIRO_STATUS_SUCCESS)
    {
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_CAIRO, "cairo: %s",
                   cairo_status_to_string (cairo_status (cr)));
      return FALSE;
    }
  if (!check_size (width, height, error) || !read_unit (u, view, &n, error))
    return FALSE;

  c.cr = cr;
  c.st = style;
  c.units = units;
  c.w = width;
  c.h = height;
  frame_of (&n, view, &f);
  type_for (style, width, height, &c.ty);
  layout_frame (&f, &c.ty, units, width, height, &c.g);
  c.lw = c.ty.body / style->font_size;

  cairo_save (cr);
  cairo_set_line_join (cr, CAIRO_LINE_JOIN_MITER);
  cairo_set_line_cap (cr, CAIRO_LINE_CAP_BUTT);
  cairo_set_fill_rule (cr, CAIRO_FILL_RULE_WINDING);
  cairo_rectangle (cr, 0, 0, width, height);
  set_rgb (&c, style->paper);
  cairo_fill (cr);

  if (n.type == BW_PROCESS_RECTANGULAR_BASIN)
    (view == BW_SKETCH_PLAN ? basin_plan : basin_section) (&c, &n);
  else
    (view == BW_SKETCH_PLAN ? rapid_mix_plan : rapid_mix_section) (&c, &n);
  sheet (&c, p, u, &n, view);
  cairo_restore (cr);

  status = cairo_status (cr);
  if (status != CAIRO_STATUS_SUCCESS)
    {
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_CAIRO, "cairo: %s",
                   cairo_status_to_string (status));
      return FALSE;
    }
  return TRUE;
}
