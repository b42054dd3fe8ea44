/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-sketch.c: process units drawn to scale, in plan and in section, from the unit's design
 * inputs: rectangular settling basins, rapid-mix tanks, flocculators (whole or one stage),
 * circular clarifiers and plate or tube settlers; and a train's schematic, whose figures are the
 * engine's results. A sketch shows what was entered; it computes no result. A few parts the
 * inputs do not fix (wall thickness, freeboard, baffle widths, the impeller's elevation, the
 * launder layout, a clarifier's floor) are drawn by drafting convention and said so in the note
 * on the sheet. */
#include "config.h"

#include "draw/bw-sketch.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include "draw/bw-labels.h"
#include "engine/bw-evaluate.h"
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
#define FLOC_PARTITION_M 0.15  /* perforated wall between flocculator stages, centred on the joint */
#define FLOC_DRIVE_M 0.6       /* drive of a vertical shaft, above the wall top */
#define FLOC_TURN_SHARE 1.5    /* around-the-end gap and over-and-under opening, x the spacing */
#define BAFFLE_SHEET_M 0.05    /* a flocculator baffle's thickness, at most a quarter-spacing */
#define BLADE_THICK_M 0.05     /* a paddle blade seen end-on */
#define FEED_WELL_SHARE 0.2    /* feed well diameter / clarifier diameter when none is given */
#define FEED_WELL_DEPTH 0.4    /* feed well skirt, share of the side water depth */
#define SETTLER_DRAWN 8        /* plates or tubes drawn in a settler's representative run */
#define SETTLER_BELOW_M 0.5    /* inflow zone under the plates, drawn */
#define SETTLER_ABOVE_M 0.6    /* clear water over the plates, drawn */
#define SETTLER_INLET_M 1.0    /* settler plan: inlet zone ahead of the modules, drawn */
#define SETTLER_PLAN_RATIO 4.0 /* ... in the fewest banks keeping them <= 4 x as long as wide */
#define SETTLER_MAX_BANKS 64
#define SETTLER_TROUGH_M 0.3   /* collection trough width, drawn (as in the section) */
#define MAX_STAGES_DRAWN 8

/* Reference canvas the style's sizes are given for. */
#define REF_WIDTH 800.0
#define REF_HEIGHT 560.0

static const char *const view_names[BW_N_SKETCH_VIEWS] = { "plan", "section", "schematic" };

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
  if (view >= BW_N_SKETCH_VIEWS || type >= BW_N_PROCESS_TYPES)
    return FALSE;
  if (view == BW_SKETCH_SCHEMATIC)
    return TRUE;
  switch (type)
    {
    case BW_PROCESS_RECTANGULAR_BASIN:
    case BW_PROCESS_RAPID_MIX:
    case BW_PROCESS_FLOCCULATOR:
    case BW_PROCESS_CIRCULAR_CLARIFIER:
    case BW_STAGE_PADDLE:
    case BW_STAGE_TURBINE:
    case BW_STAGE_BAFFLED:
      return TRUE;
    case BW_PROCESS_PLATE_SETTLER:
      return TRUE;
    case BW_PROCESS_INLINE_MIXER: /* no geometry among its inputs: the schematic only */
    default:
      return FALSE;
    }
}

char *
bw_sketch_views_of (BwProcessType type)
{
  GString *s = g_string_new (NULL);
  for (int v = 0; v < BW_N_SKETCH_VIEWS; v++)
    if (bw_sketch_supports (type, (BwSketchView) v))
      g_string_append_printf (s, "%s%s", s->len ? "|" : "", view_names[v]);
  return g_string_free (s, FALSE);
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
  /* flocculator: WIDTH x DEPTH, the stages FIRST .. FIRST + N_STAGES - 1 of FLOC drawn */
  const BwProcessUnit *floc;
  guint first, n_stages;
  double floc_length;     /* of the stages drawn */
  gboolean floc_drive;    /* a stage with a drive above the water (turbine, vertical shaft) */
  /* circular clarifier (depth and sludge as above) */
  double diameter, feed_well, launder_r;
  gboolean feed_well_given, inboard;
  /* plate or tube settler */
  int shape; /* 0 plates, 1 circular tubes, 2 square tubes */
  double angle, spacing, plate_len, plate_width;
  guint count, n_drawn;
  /* ... in plan: ROWS rows of PER_ROW channels (a plate is a row of one) in BANKS banks side by
   * side, each PLATE_WIDTH wide and MODULE_LEN long; at most ROWS_FIT rows fit in a bank */
  guint per_row, rows, banks, rows_fit;
  double module_len, module_area;
  gboolean area_given;
  /* schematic */
  const BwTrain *train;
  BwSketchView view;
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
               _ ("%s: must be greater than zero to draw unit '%s' (got %g)"), field, u->id, v);
  return FALSE;
}

/* Length along the flow of a flocculator stage: entered, or passes x spacing for a baffled one
 * (the engine's own rule, bw-params.c). */
static double
stage_length (const BwProcessUnit *st)
{
  if (st->type == BW_STAGE_BAFFLED)
    return param (st, "passes") * param (st, "spacing");
  return param (st, "length");
}

/* The flocculator of P that holds stage ST, and ST's index in it. */
static const BwProcessUnit *
parent_of (const BwProject *p, const BwProcessUnit *st, guint *index)
{
  for (guint t = 0; p->trains && t < p->trains->len; t++)
    {
      const BwTrain *tr = g_ptr_array_index (p->trains, t);
      for (guint i = 0; i < tr->units->len; i++)
        {
          const BwProcessUnit *f = g_ptr_array_index (tr->units, i);
          for (guint k = 0; f->stages && k < f->stages->len; k++)
            if (g_ptr_array_index (f->stages, k) == st)
              {
                *index = k;
                return f;
              }
        }
    }
  return NULL;
}

/* The train of P that holds unit (or stage) U. */
static const BwTrain *
train_of (const BwProject *p, const BwProcessUnit *u)
{
  guint k;
  const BwProcessUnit *f = bw_process_type_is_stage (u->type) ? parent_of (p, u, &k) : u;
  for (guint t = 0; f && p->trains && t < p->trains->len; t++)
    {
      const BwTrain *tr = g_ptr_array_index (p->trains, t);
      for (guint i = 0; i < tr->units->len; i++)
        if (g_ptr_array_index (tr->units, i) == f)
          return tr;
    }
  return NULL;
}

static const BwProcessUnit *
floc_stage (const Unit *n, guint i)
{
  return g_ptr_array_index (n->floc->stages, n->first + i);
}

static double settler_pitch (const Unit *n);

/* The plan layout of a settler's modules (drafting, not design): its rows of channels in as few
 * banks side by side as keep the modules at most SETTLER_PLAN_RATIO times as long as they are
 * wide. The modules' length is the entered module area over the banks' width when one is given;
 * otherwise a bank's rows at the horizontal pitch plus one plate's run in plan,
 * (rows - 1) x spacing / sin(angle) + length x cos(angle) (derived from the section). */
static gboolean
settler_banks (Unit *n, const BwProcessUnit *u, GError **error)
{
  const double p = settler_pitch (n), run = n->plate_len * cos (n->angle), b = n->plate_width;
  guint k = 1;

  if (!positive (b, "plate-width", u, error))
    return FALSE;
  if (n->count < 1)
    {
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_GEOMETRY,
                   _ ("count: unit '%s' needs at least one plate or tube to be drawn (got 0)"), u->id);
      return FALSE;
    }
  n->per_row = n->shape == 0 ? 1 : (guint) MAX (1.0, floor (b / n->spacing + 1e-9));
  n->rows = (n->count + n->per_row - 1) / n->per_row;
  n->module_area = param (u, "module-area");
  n->area_given = isfinite (n->module_area) && n->module_area > 0;
  if (n->area_given)
    {
      if (n->module_area < b * run * (1.0 - 1e-9))
        {
          g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_GEOMETRY,
                       _ ("module-area: unit '%s' covers less than one row of channels in plan "
                       "(got %g m²; one row is %g m × %g m)"), u->id, n->module_area, b, run);
          return FALSE;
        }
      while (k < SETTLER_MAX_BANKS && n->module_area / (k * b) > SETTLER_PLAN_RATIO * k * b
             && n->module_area / ((k + 1) * b) >= run)
        k++;
      n->module_len = n->module_area / (k * b);
      n->rows_fit = (guint) MIN (floor ((n->module_len - run) / p + 1e-9) + 1.0, 1e7);
    }
  else
    {
      while (k < MIN ((guint) SETTLER_MAX_BANKS, n->rows)
             && ((n->rows + k - 1) / k - 1) * p + run > SETTLER_PLAN_RATIO * k * b)
        k++;
      n->module_len = ((n->rows + k - 1) / k - 1) * p + run;
      n->rows_fit = n->rows;
    }
  n->banks = k;
  return TRUE;
}

static gboolean
read_unit (const BwProject *p, const BwProcessUnit *u, BwSketchView view, Unit *out,
           GError **error)
{
  memset (out, 0, sizeof *out);
  out->type = u->type;
  out->view = view;
  if (!bw_sketch_supports (u->type, view))
    {
      g_autofree char *views = bw_sketch_views_of (u->type);
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_UNSUPPORTED,
                   _ ("unit '%s': no %s drawing of a %s (drawn: %s)"), u->id,
                   view < BW_N_SKETCH_VIEWS ? view_names[view] : "such",
                   bw_label_process_type (u->type), views);
      return FALSE;
    }
  if (view == BW_SKETCH_SCHEMATIC)
    {
      out->train = train_of (p, u);
      if (out->train == NULL || out->train->units->len == 0)
        {
          g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_GEOMETRY,
                       _ ("unit '%s': not in a train of the project"), u->id);
          return FALSE;
        }
      return TRUE;
    }
  if (u->type == BW_PROCESS_FLOCCULATOR || bw_process_type_is_stage (u->type))
    {
      if (u->type == BW_PROCESS_FLOCCULATOR)
        {
          out->floc = u;
          out->first = 0;
          out->n_stages = u->stages ? u->stages->len : 0;
        }
      else
        {
          out->floc = parent_of (p, u, &out->first);
          out->n_stages = 1;
          if (out->floc == NULL)
            {
              g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_GEOMETRY,
                           _ ("stage '%s': in no flocculator of the project"), u->id);
              return FALSE;
            }
        }
      out->width = param (out->floc, "width");
      out->depth = param (out->floc, "water-depth");
      if (!positive (out->width, "width", out->floc, error)
          || !positive (out->depth, "water-depth", out->floc, error))
        return FALSE;
      if (out->n_stages == 0 || out->n_stages > MAX_STAGES_DRAWN)
        {
          g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_GEOMETRY,
                       _ ("stages: flocculator '%s' needs 1 to %d stages to be drawn (has %u)"),
                       out->floc->id, MAX_STAGES_DRAWN, out->n_stages);
          return FALSE;
        }
      for (guint i = 0; i < out->n_stages; i++)
        {
          const BwProcessUnit *st = floc_stage (out, i);
          if (!positive (stage_length (st), "length", st, error))
            return FALSE;
          out->floc_length += stage_length (st);
          if (st->type == BW_STAGE_TURBINE
              || (st->type == BW_STAGE_PADDLE && param (st, "shaft") == 1))
            out->floc_drive = TRUE;
          if (st->type == BW_STAGE_PADDLE
              && (!positive (param (st, "blade-radius-1"), "blade-radius-1", st, error)
                  || !positive (param (st, "blade-length"), "blade-length", st, error)))
            return FALSE;
          if (st->type == BW_STAGE_TURBINE
              && !positive (param (st, "impeller-diameter"), "impeller-diameter", st, error))
            return FALSE;
        }
      return TRUE;
    }
  if (u->type == BW_PROCESS_CIRCULAR_CLARIFIER)
    {
      out->diameter = param (u, "diameter");
      out->depth = param (u, "side-water-depth");
      out->sludge = param (u, "sludge-depth");
      if (!positive (out->diameter, "diameter", u, error)
          || !positive (out->depth, "side-water-depth", u, error))
        return FALSE;
      if (!isfinite (out->sludge) || out->sludge < 0)
        out->sludge = 0;
      out->feed_well = param (u, "feed-well-diameter");
      out->feed_well_given = isfinite (out->feed_well) && out->feed_well > 0
                             && out->feed_well < out->diameter;
      if (!out->feed_well_given)
        out->feed_well = FEED_WELL_SHARE * out->diameter;
      out->inboard = param (u, "launder") == 1;
      out->launder_r = param (u, "launder-radius");
      if (out->inboard
          && !(isfinite (out->launder_r) && out->launder_r > out->feed_well / 2 + LAUNDER_WIDTH_M
               && out->launder_r < out->diameter / 2 - LAUNDER_WIDTH_M / 2))
        {
          g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_GEOMETRY,
                       _ ("launder-radius: an inboard launder of unit '%s' must lie between the "
                       "feed well and the wall (got %g m)"), u->id, out->launder_r);
          return FALSE;
        }
      return TRUE;
    }
  if (u->type == BW_PROCESS_PLATE_SETTLER)
    {
      out->shape = CLAMP ((int) param (u, "shape"), 0, 2);
      out->angle = param (u, "angle");
      out->spacing = param (u, "spacing");
      out->plate_len = param (u, "length");
      out->plate_width = param (u, "plate-width");
      out->count = (guint) param (u, "count");
      if (!positive (out->angle, "angle", u, error) || !positive (out->spacing, "spacing", u, error)
          || !positive (out->plate_len, "length", u, error))
        return FALSE;
      if (out->angle > G_PI / 2 * 0.999 || out->angle < 0.1)
        {
          g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_GEOMETRY,
                       _ ("angle: unit '%s' is drawn for 6° to 89° from horizontal (got %g rad)"),
                       u->id, out->angle);
          return FALSE;
        }
      out->n_drawn = CLAMP (out->count, 2u, (guint) SETTLER_DRAWN);
      return view != BW_SKETCH_PLAN || settler_banks (out, u, error);
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

/* Horizontal pitch of a settler's plates: the perpendicular spacing over sin(angle). */
static double
settler_pitch (const Unit *n)
{
  return n->spacing / sin (n->angle);
}

static void
frame_of (const Unit *n, BwSketchView view, Frame *f)
{
  if (n->floc != NULL)
    {
      const double t = BASIN_WALL_M;
      if (view == BW_SKETCH_PLAN)
        *f = (Frame) { -t, -t, n->floc_length + t, n->width + t, 4.0, 7.5, 3.4, 5.0 };
      else
        *f = (Frame) { -t, -t, n->floc_length + t,
                       n->depth + BASIN_FREEBOARD_M + (n->floc_drive ? FLOC_DRIVE_M : 0.0), 4.0,
                       7.5, 4.6, 5.0 };
      return;
    }
  if (n->type == BW_PROCESS_CIRCULAR_CLARIFIER)
    {
      const double r = n->diameter / 2.0 + BASIN_WALL_M;
      if (view == BW_SKETCH_PLAN)
        *f = (Frame) { -r, -r, r, r, 4.0, 14.0, 1.0, 3.6 };
      else
        *f = (Frame) { -r, -n->sludge - BASIN_WALL_M, r, n->depth + BASIN_FREEBOARD_M, 4.0, 15.0,
                       1.6, 3.6 };
      return;
    }
  if (n->type == BW_PROCESS_PLATE_SETTLER && view == BW_SKETCH_PLAN)
    {
      const double t = BASIN_WALL_M;
      *f = (Frame) { -t, -t, SETTLER_INLET_M + n->module_len + t, n->banks * n->plate_width + t,
                     4.0, 12.0, 4.4, 7.8 };
      return;
    }
  if (n->type == BW_PROCESS_PLATE_SETTLER)
    {
      const double xr = (n->n_drawn - 1) * settler_pitch (n) + n->plate_len * cos (n->angle);
      const double m = MAX (0.35, 0.25 * n->plate_len);
      *f = (Frame) { -m, -SETTLER_BELOW_M, xr + m, n->plate_len * sin (n->angle) + SETTLER_ABOVE_M,
                     5.0, 14.0, 1.2, 3.6 };
      return;
    }
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
                   _ ("size: each side must be %g to %g (got %g x %g)"), BW_SKETCH_MIN_SIDE,
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

/* A schematic is not to scale: page units throughout (scale 1, y up from the page's top edge,
 * so page_y = -y), the world box the band the blocks take, and no scale bar. */
static void
layout_schematic (const Type *ty, double w, double h, BwSketchGeometry *g)
{
  memset (g, 0, sizeof *g);
  g->scale = 1.0;
  g->world_x0 = ty->pad;
  g->world_x1 = w - ty->pad;
  g->world_y0 = -(h - ty->bottom_band - ty->pad);
  g->world_y1 = -(ty->title_band + ty->pad);
  g->text_size = ty->body;
  g->bar_x = ty->pad;
  g->bar_y = h - ty->pad;
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
  if (!check_size (width, height, error) || !read_unit (p, u, view, &n, error))
    return FALSE;
  type_for (style, width, height, &ty);
  if (view == BW_SKETCH_SCHEMATIC)
    {
      layout_schematic (&ty, width, height, out);
      return TRUE;
    }
  frame_of (&n, view, &f);
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
  char case_label[96]; /* the load case a schematic shows */
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
  {
    /* The drawing's numbers with the reader's decimal separator (bw_label_number). */
    g_autofree char *shown = bw_label_number (s);
    pango_layout_set_text (layout, shown, -1);
  }
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
  {
    /* The drawing's numbers with the reader's decimal separator (bw_label_number). */
    g_autofree char *shown = bw_label_number (s);
    pango_layout_set_text (layout, shown, -1);
  }
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
  return n->inlet == 0   ? _("perforated baffle wall")
         : n->inlet == 1 ? _("inlet baffle")
                         : _("no inlet baffle");
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
    return g_strdup (_("effluent weir"));
  return g_strdup_printf (_("weirs %s in all (schematic)"), weir);
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
    return g_strdup (_("effluent weir across the outlet wall (length not given)"));
  if (n->n_launders == 0)
    return g_strdup_printf (_("effluent weir, %s"), weir);
  if (n->launder_capped)
    return g_strdup_printf (_("weirs %s in all: more than the %d launders drawn hold (schematic)"),
                            weir, n->n_launders);
  return g_strdup_printf (ngettext ("%d launder × %s, weirs both sides, + end weir: %s in all "
                                    "(layout schematic)",
                                    "%d launders × %s, weirs both sides, + end weir: %s in all "
                                    "(layout schematic)", n->n_launders),
                          n->n_launders, ll, weir);
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
    text (c, px (c, 0.5 * L), py (c, 0.62 * H), _("settling zone"), fs, FALSE, 0.5, 0.5, st->ink);

  /* callouts above and below */
  /* the outlet's leader lands a fifth along the launder, clear of its dimension text */
  basin_callouts (c, n, px (c, xb + BAFFLE_THICK_M / 2), py (c, top - 0.1),
                  px (c, xl + 0.2 * (L - xl)),
                  py (c, H + 0.08), py (c, top) - 2.6 * fs);
  if (s > 0)
    callout (c, px (c, 0.8 * L), py (c, -s / 2), px (c, 0.78 * L), py (c, -s - t) + 2.9 * fs,
             _("sludge zone"), 1.0, 0.0);

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
    text (c, px (c, 0.42 * L), py (c, W / 2) - 0.2 * fs, _("settling zone"), fs, FALSE, 0.5, 1.0,
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
  N_("radial flat-blade disc turbine"), N_("45° pitched-blade turbine"), N_("hydrofoil impeller"),
  N_("impeller (custom)"),
};

static const char *const impeller_short[] = {
  N_("disc turbine"), N_("pitched blade"), N_("hydrofoil"), N_("impeller"),
};

static const char *
impeller_label (const Unit *n)
{
  return _(impeller_labels[CLAMP (n->impeller, 0, 3)]);
}

static const char *
impeller_label_short (const Unit *n)
{
  return _(impeller_short[CLAMP (n->impeller, 0, 3)]);
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
    g_autofree char *bt = g_strdup_printf (_("wall baffles, %d (one-twelfth of the width)"),
                                           TANK_BAFFLES);
    const double tx = xr + 7.0 * fs;
    callout (c, px (c, 0.13 * n->tank), py (c, top + beam + 0.6 * motor), tx,
             py (c, top + beam + 0.6 * motor), _("drive"), 0.0, 0.5);
    if (n->baffled)
      callout_fit (c, px (c, R - bw / 2), py (c, 0.75 * H), tx, py (c, 0.72 * H) - 1.0 * fs, bt,
                   _("wall baffles"), 0.0, 0.5);
    callout_fit (c, px (c, 0.45 * n->impeller_d), py (c, n->clearance), tx,
                 py (c, n->clearance) + 1.4 * fs, impeller_label (n), impeller_label_short (n), 0.0,
                 0.5);
    callout (c, px (c, -0.5 * R), py (c, H), xl - 0.5 * fs, py (c, top + beam) - 1.0 * fs,
             _("liquid level"), 1.0, 0.5);
    if (!n->baffled)
      callout (c, px (c, R), py (c, 0.75 * H), tx, py (c, 0.72 * H) - 1.0 * fs, _("no wall baffles"),
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
    g_autofree char *bt = g_strdup_printf (_("wall baffles, %d"), TANK_BAFFLES);
    if (n->baffled)
      callout_fit (c, px (c, R - bw / 2), py (c, 0), tx, py (c, 0) + 1.5 * fs, bt, _("baffles"), 0.0,
                   0.5);
    callout_fit (c, px (c, 0), py (c, 0.4 * n->impeller_d), tx, py (c, 0.85 * R),
                 impeller_label (n), impeller_label_short (n), 0.0, 0.5);
    callout_fit (c, px (c, R + t * 0.3), py (c, 0.05 * n->tank), tx, py (c, 0.3 * R),
                 _("drive beam above"), _("drive beam"), 0.0, 0.5);
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

/* --- flocculator: every stage in flow order, or one stage alone --- */

static const char *
stage_kind (const BwProcessUnit *st, gboolean shrt)
{
  switch (st->type)
    {
    case BW_STAGE_PADDLE:
      return shrt ? _("paddles")
                  : param (st, "shaft") == 1 ? _("paddles, vertical shaft")
                                             : _("paddles, horizontal shaft");
    case BW_STAGE_TURBINE:
      return shrt ? _("turbine") : _(impeller_labels[CLAMP ((int) param (st, "impeller"), 0, 3)]);
    case BW_STAGE_BAFFLED:
      return shrt ? _("baffled")
                  : param (st, "style") == 1 ? _("baffles over and under") : _("baffles around the end");
    default:
      return _("stage");
    }
}

/* A paddle stage's blade radii as entered (the first always; the others when given). */
static int
blade_radii (const BwProcessUnit *st, double r[3])
{
  static const char *const ids[] = { "blade-radius-1", "blade-radius-2", "blade-radius-3" };
  int n = 0;
  for (int i = 0; i < 3; i++)
    {
      const double v = param (st, ids[i]);
      if (isfinite (v) && v > 0)
        r[n++] = v;
    }
  return n;
}

/* Moves the world origin to world (X, Y) for the painters that draw about the origin. */
static void
shift_origin (Ctx *c, double x, double y)
{
  c->g.origin_x += c->g.scale * x;
  c->g.origin_y -= c->g.scale * y;
}

/* A paddle wheel seen along its shaft, the shaft at world (WX, WY): the arms, the blades at
 * their radii (the blade's width radial, its thickness by convention) and the circle the outer
 * edge sweeps. */
static void
paddle_end_on (Ctx *c, const BwProcessUnit *st, double wx, double wy)
{
  double r[3];
  const int nr = blade_radii (st, r);
  const int arms = MAX (1, (int) param (st, "arms"));
  const double bw = param (st, "blade-width");
  const double s = c->g.scale;
  const double cx = px (c, wx), cy = py (c, wy);
  double rmax = 0;

  for (int i = 0; i < nr; i++)
    rmax = MAX (rmax, r[i]);
  set_rgb (c, c->st->ink_muted);
  set_line (c, 0.6 * c->st->line_dimension);
  set_dash (c, 4, 3);
  cairo_new_sub_path (c->cr);
  cairo_arc (c->cr, cx, cy, s * (rmax + bw / 2), 0, 2 * G_PI);
  cairo_stroke (c->cr);
  set_rgb (c, c->st->equipment);
  set_line (c, c->st->line_detail);
  for (int j = 0; j < arms; j++)
    {
      const double a = 2 * G_PI * j / arms + G_PI / 4;
      cairo_move_to (c->cr, cx, cy);
      cairo_line_to (c->cr, cx + s * (rmax + bw / 2) * cos (a), cy - s * (rmax + bw / 2) * sin (a));
    }
  cairo_stroke (c->cr);
  for (int j = 0; j < arms; j++)
    for (int i = 0; i < nr; i++)
      {
        const double a = 2 * G_PI * j / arms + G_PI / 4;
        const double th = MAX (s * BLADE_THICK_M, 2.0 * c->lw);
        cairo_save (c->cr);
        cairo_translate (c->cr, cx, cy);
        cairo_rotate (c->cr, -a);
        cairo_rectangle (c->cr, s * (r[i] - bw / 2), -th / 2, MAX (s * bw, 1.0), th);
        cairo_restore (c->cr);
      }
  cairo_fill (c->cr);
  set_rgb (c, c->st->ink);
  cairo_new_sub_path (c->cr);
  cairo_arc (c->cr, cx, cy, MAX (s * 0.08, 1.5 * c->lw), 0, 2 * G_PI);
  cairo_fill (c->cr);
}

/* A paddle stage's wheels seen across their shaft, which runs along world y at x = XC from Y0
 * to Y1 (across the basin in plan, or up from the floor in section): the blades at their
 * radii, each BLADE-LENGTH long, the wheels spread evenly over the shaft. */
static void
paddle_side_on (Ctx *c, const BwProcessUnit *st, double xc, double y0, double y1, double shaft0,
                double shaft1)
{
  double r[3];
  const int nr = blade_radii (st, r);
  const int arms = MAX (1, (int) param (st, "arms"));
  const int wheels = MAX (1, (int) param (st, "wheels"));
  const double bw = param (st, "blade-width"), bl = param (st, "blade-length");
  double rmax = 0;

  for (int i = 0; i < nr; i++)
    rmax = MAX (rmax, r[i]);
  set_rgb (c, c->st->ink);
  set_line (c, MAX (c->g.scale * 0.1 / c->lw, c->st->line_outline));
  wline (c, xc, shaft0, xc, shaft1);
  cairo_stroke (c->cr);
  for (int k = 0; k < wheels; k++)
    {
      const double yw = y0 + (y1 - y0) * (2 * k + 1) / (2.0 * wheels);
      /* arms at both ends of the blades, then the blades, each projected on the view */
      set_rgb (c, c->st->equipment);
      set_line (c, c->st->line_detail);
      for (int j = 0; j < arms; j++)
        {
          const double a = 2 * G_PI * j / arms + G_PI / 4;
          const double xe = xc + (rmax + bw / 2) * cos (a);
          wline (c, xc, yw - 0.45 * bl, xe, yw - 0.45 * bl);
          wline (c, xc, yw + 0.45 * bl, xe, yw + 0.45 * bl);
        }
      cairo_stroke (c->cr);
      for (int j = 0; j < arms; j++)
        for (int i = 0; i < nr; i++)
          {
            const double a = 2 * G_PI * j / arms + G_PI / 4;
            const double half = MAX (0.5 * bw * fabs (cos (a)), 0.5 * BLADE_THICK_M);
            const double x = xc + r[i] * cos (a);
            wrect (c, x - half, yw - bl / 2, x + half, yw + bl / 2);
          }
      fill_stroke (c, c->st->equipment, c->st->equipment, 0.4 * c->st->line_detail);
    }
}

/* Drops a stage's turbine into a Unit the rapid-mix painters draw (clearance a third of the
 * depth, by convention). */
static Unit
turbine_as_unit (const BwProcessUnit *st, double depth)
{
  Unit t = { 0 };
  t.type = BW_PROCESS_RAPID_MIX;
  t.impeller = CLAMP ((int) param (st, "impeller"), 0, 3);
  t.impeller_d = param (st, "impeller-diameter");
  t.clearance = depth / 3.0;
  t.liquid = depth;
  return t;
}

/* Around-the-end baffles in plan, or over-and-under ones in section: channels SPACING wide from
 * X0, each turn opening GAP, and the serpentine flow path with an arrow in every channel that
 * is wide enough for one. Channels run along world y from 0 to SPAN. FIRST_UP: the first channel
 * runs towards +y. HANGING: the odd baffles hang from above the water (section), so the wall
 * ends never show as a gap at the top. */
static void
serpentine (Ctx *c, double x0, double spacing, guint passes, double span, double gap, double top,
            gboolean first_up, gboolean section)
{
  const double s = c->g.scale;
  const double th = MIN (BAFFLE_SHEET_M, 0.25 * spacing);
  const double a = MIN (0.7 * c->ty.body, 0.8 * spacing * s);
  const double lo = gap / 2, hi = span - gap / 2;

  /* the baffles: odd ones leave the turn at the far end (+y) open, even ones the near end */
  set_rgb (c, c->st->equipment);
  set_line (c, MAX (s * th / c->lw, 0.8));
  for (guint i = 1; i < passes; i++)
    {
      const double x = x0 + i * spacing;
      const gboolean far_open = (i % 2 == 1) == first_up;
      if (far_open)
        wline (c, x, section ? 0 : 0, x, span - gap);
      else
        wline (c, x, gap, x, section ? top : span);
    }
  cairo_stroke (c->cr);

  if (spacing * s < 2.5)
    return; /* too fine for a path: the baffles alone */
  set_rgb (c, c->st->flow);
  set_line (c, 0.9 * c->st->line_detail);
  cairo_set_line_join (c->cr, CAIRO_LINE_JOIN_ROUND);
  for (guint k = 0; k < passes; k++)
    {
      const double x = x0 + (k + 0.5) * spacing;
      const gboolean up = (k % 2 == 0) == first_up;
      if (k == 0)
        cairo_move_to (c->cr, px (c, x), py (c, up ? lo : hi));
      cairo_line_to (c->cr, px (c, x), py (c, up ? hi : lo));
      if (k + 1 < passes)
        cairo_line_to (c->cr, px (c, x + spacing), py (c, up ? hi : lo));
    }
  cairo_stroke (c->cr);
  cairo_set_line_join (c->cr, CAIRO_LINE_JOIN_MITER);
  if (a >= 2.5)
    for (guint k = 0; k < passes; k++)
      {
        const double x = x0 + (k + 0.5) * spacing;
        const gboolean up = (k % 2 == 0) == first_up;
        arrowhead (c, px (c, x), py (c, span / 2) + (up ? -a / 2 : a / 2), 0, up ? -1 : 1, a);
      }
}

/* A perforated partition between two stages at world x X: solid in plan (drawn dashed for its
 * ports), or a wall with ports in section. */
static void
floc_partition (Ctx *c, const Unit *n, double x, BwSketchView view)
{
  const double h = FLOC_PARTITION_M / 2;
  if (view == BW_SKETCH_PLAN)
    {
      set_rgb (c, c->st->ink_muted);
      set_line (c, MAX (c->g.scale * FLOC_PARTITION_M / c->lw, 1.2 * c->st->line_detail));
      set_dash (c, 6, 3);
      wline (c, x, 0, x, n->width);
      cairo_stroke (c->cr);
      set_line (c, 1.0);
      return;
    }
  {
    const double H = n->depth, top = H + BASIN_FREEBOARD_M;
    static const double ports[][2] = { { 0.12, 0.27 }, { 0.42, 0.57 }, { 0.72, 0.85 } };
    wrect (c, x - h, 0, x + h, ports[0][0] * H);
    for (guint i = 0; i + 1 < G_N_ELEMENTS (ports); i++)
      wrect (c, x - h, ports[i][1] * H, x + h, ports[i + 1][0] * H);
    wrect (c, x - h, ports[2][1] * H, x + h, top);
    fill_stroke (c, c->st->concrete, c->st->ink, c->st->line_detail);
  }
}

/* A drive over a vertical shaft at world x XC: on a beam across the basin (cut here) at the wall
 * top TOP. */
static void
floc_drive (Ctx *c, double xc, double top)
{
  wrect (c, xc - 0.3, top, xc + 0.3, top + 0.3 * FLOC_DRIVE_M);
  fill_stroke (c, c->st->concrete, c->st->ink, c->st->line_outline);
  wrect (c, xc - 0.22, top + 0.3 * FLOC_DRIVE_M, xc + 0.22, top + FLOC_DRIVE_M);
  fill_stroke (c, c->st->paper, c->st->ink, c->st->line_detail);
}

/* The mechanism of stage ST, which spans world x X0 .. X1, in VIEW. */
static void
floc_stage_body (Ctx *c, const Unit *n, const BwProcessUnit *st, double x0, double x1,
                 BwSketchView view)
{
  const double W = n->width, H = n->depth, xc = (x0 + x1) / 2;
  const double top = H + BASIN_FREEBOARD_M;

  switch (st->type)
    {
    case BW_STAGE_PADDLE:
      {
        const gboolean vertical = param (st, "shaft") == 1;
        if (view == BW_SKETCH_PLAN && !vertical)
          paddle_side_on (c, st, xc, 0, W, -BASIN_WALL_M / 2, W + BASIN_WALL_M / 2);
        else if (view == BW_SKETCH_PLAN)
          paddle_end_on (c, st, xc, W / 2);
        else if (!vertical)
          paddle_end_on (c, st, xc, H / 2);
        else
          {
            paddle_side_on (c, st, xc, 0.05 * H, 0.95 * H, 0.03 * H, top + 0.3 * FLOC_DRIVE_M);
            floc_drive (c, xc, top);
          }
        break;
      }
    case BW_STAGE_TURBINE:
      {
        Unit t = turbine_as_unit (st, H);
        const double bw = TANK_BAFFLE_SHARE * W;
        if (view == BW_SKETCH_PLAN)
          {
            if (param (st, "baffles") == 0)
              {
                wrect (c, xc - 0.06, 0, xc + 0.06, bw);
                wrect (c, xc - 0.06, W - bw, xc + 0.06, W);
                fill_stroke (c, c->st->equipment, c->st->equipment, 0.5 * c->st->line_detail);
              }
            shift_origin (c, xc, W / 2);
            impeller_plan (c, &t);
            shift_origin (c, -xc, -W / 2);
          }
        else
          {
            set_rgb (c, c->st->ink);
            set_line (c, MAX (0.03 * t.impeller_d * c->g.scale / c->lw, c->st->line_outline));
            wline (c, xc, top + 0.3 * FLOC_DRIVE_M, xc, t.clearance);
            cairo_stroke (c->cr);
            floc_drive (c, xc, top);
            shift_origin (c, xc, 0);
            impeller_side (c, &t);
            shift_origin (c, -xc, 0);
          }
        break;
      }
    case BW_STAGE_BAFFLED:
      {
        const guint passes = (guint) param (st, "passes");
        const double sp = param (st, "spacing");
        const gboolean over_under = param (st, "style") == 1;
        if (view == BW_SKETCH_PLAN && !over_under)
          serpentine (c, x0, sp, passes, W, MIN (FLOC_TURN_SHARE * sp, 0.45 * W), W, TRUE, FALSE);
        else if (view == BW_SKETCH_SECTION && over_under)
          serpentine (c, x0, sp, passes, H, MIN (FLOC_TURN_SHARE * sp, 0.45 * H), top, FALSE,
                      TRUE);
        else
          {
            /* the baffles cut square across: full width in plan, full height in section, the
             * flow along the page in plan and into and out of it in section */
            const double s = c->g.scale;
            const double th = MIN (BAFFLE_SHEET_M, 0.25 * sp);
            const double rr = MIN (0.33 * sp * s, 0.4 * c->ty.body);
            set_rgb (c, c->st->equipment);
            for (guint i = 1; i < passes; i++)
              {
                /* in plan, the baffles the water flows over are below the surface: dashed */
                set_line (c, MAX (s * th / c->lw, 0.8));
                if (view == BW_SKETCH_PLAN && i % 2 == 0)
                  set_dash (c, 3, 2);
                wline (c, x0 + i * sp, view == BW_SKETCH_PLAN ? 0 : 0.0,
                       x0 + i * sp, view == BW_SKETCH_PLAN ? W : top - 0.1);
                cairo_stroke (c->cr);
              }
            set_line (c, 1.0);
            if (view == BW_SKETCH_PLAN && s * (x1 - x0) > 3.0 * c->ty.body)
              flow_arrow (c, px (c, x0 + 0.15 * (x1 - x0)), py (c, 0.3 * W),
                          px (c, x1 - 0.15 * (x1 - x0)), py (c, 0.3 * W));
            else if (view == BW_SKETCH_SECTION && rr >= 2.0)
              for (guint k = 0; k < passes; k++)
                {
                  const double cx = px (c, x0 + (k + 0.5) * sp), cy = py (c, 0.5 * H);
                  set_rgb (c, c->st->flow);
                  set_line (c, 0.7 * c->st->line_detail);
                  cairo_new_sub_path (c->cr);
                  cairo_arc (c->cr, cx, cy, rr, 0, 2 * G_PI);
                  cairo_stroke (c->cr);
                  if (k % 2 == 0) /* towards the reader: a dot; away: a cross */
                    {
                      cairo_arc (c->cr, cx, cy, 0.28 * rr, 0, 2 * G_PI);
                      cairo_fill (c->cr);
                    }
                  else
                    {
                      cairo_move_to (c->cr, cx - 0.6 * rr, cy - 0.6 * rr);
                      cairo_line_to (c->cr, cx + 0.6 * rr, cy + 0.6 * rr);
                      cairo_move_to (c->cr, cx + 0.6 * rr, cy - 0.6 * rr);
                      cairo_line_to (c->cr, cx - 0.6 * rr, cy + 0.6 * rr);
                      cairo_stroke (c->cr);
                    }
                }
          }
        break;
      }
    default:
      break;
    }
}

/* What a stage holds, in a few words for the section's second label row. */
static char *
stage_detail (const Ctx *c, const BwProcessUnit *st)
{
  switch (st->type)
    {
    case BW_STAGE_PADDLE:
      {
        double r[3];
        const int nr = blade_radii (st, r);
        GString *g = g_string_new (NULL);
        /* TRANSLATORS: paddle wheels × arms per wheel, then the blade radii */
        g_string_append_printf (g, _("%d × %d arms, r "), (int) param (st, "wheels"),
                                (int) param (st, "arms"));
        for (int i = 0; i < nr; i++)
          {
            g_autofree char *t = fmt_len (c, r[i]);
            g_string_append_printf (g, "%s%s", i ? ", " : "", t);
          }
        return g_string_free (g, FALSE);
      }
    case BW_STAGE_TURBINE:
      {
        g_autofree char *d = fmt_len (c, param (st, "impeller-diameter"));
        return g_strdup_printf (_("impeller Ø %s"), d);
      }
    case BW_STAGE_BAFFLED:
      {
        g_autofree char *d = fmt_len (c, param (st, "spacing"));
        const int passes = (int) param (st, "passes");
        return g_strdup_printf (ngettext ("%d pass at %s", "%d passes at %s", (gulong) passes), passes, d);
      }
    default:
      return g_strdup ("");
    }
}

/* The walls, water and flow of a flocculator drawn as one channel of LENGTH, inlet at the left
 * and outlet at the right (as the basin's). One stage drawn alone is open at an end where another
 * stage adjoins: the water runs on to the partition there. */
static void
floc_shell (Ctx *c, const Unit *n, BwSketchView view)
{
  const double t = BASIN_WALL_M, L = n->floc_length;
  const BwStyle *st = c->st;
  const double fs = c->ty.body;
  const gboolean open_l = n->first > 0;
  const gboolean open_r = n->first + n->n_stages < n->floc->stages->len;
  const double wl = open_l ? -t : 0, wr = open_r ? L + t : L;

  if (view == BW_SKETCH_PLAN)
    {
      const double W = n->width, o = MIN (0.3 * W, 0.8);
      wrect (c, wl, 0, wr, W);
      set_rgb (c, st->water);
      cairo_fill (c->cr);
      wrect (c, -t, -t, L + t, 0);
      wrect (c, -t, W, L + t, W + t);
      if (!open_l)
        {
          wrect (c, -t, 0, 0, W / 2 - o / 2);
          wrect (c, -t, W / 2 + o / 2, 0, W);
        }
      if (!open_r)
        {
          wrect (c, L, 0, L + t, W / 2 - o / 2);
          wrect (c, L, W / 2 + o / 2, L + t, W);
        }
      fill_stroke (c, st->concrete, st->ink, st->line_outline);
      wrect (c, -t, W / 2 - o / 2, 0, W / 2 + o / 2);
      wrect (c, L, W / 2 - o / 2, L + t, W / 2 + o / 2);
      set_rgb (c, st->water);
      cairo_fill (c->cr);
      flow_arrow (c, px (c, -t) - 3.0 * fs, py (c, W / 2), px (c, 0) + 0.6 * fs, py (c, W / 2));
      flow_arrow (c, px (c, L) - 0.2 * fs, py (c, W / 2), px (c, L + t) + 3.0 * fs, py (c, W / 2));
    }
  else
    {
      const double H = n->depth, top = H + BASIN_FREEBOARD_M;
      const double in_lo = 0.1 * H, in_hi = MIN (0.1 * H + 0.6, 0.4 * H);
      const double out_hi = 0.92 * H, out_lo = MAX (out_hi - 0.6, 0.6 * H);
      wrect (c, wl, 0, wr, H);
      set_rgb (c, st->water);
      cairo_fill (c->cr);
      wrect (c, -t, -t, L + t, 0);
      if (!open_l)
        {
          wrect (c, -t, 0, 0, in_lo);
          wrect (c, -t, in_hi, 0, top);
        }
      if (!open_r)
        {
          wrect (c, L, 0, L + t, out_lo);
          wrect (c, L, out_hi, L + t, top);
        }
      fill_stroke (c, st->concrete, st->ink, st->line_outline);
      wrect (c, -t, in_lo, 0, in_hi);
      wrect (c, L, out_lo, L + t, out_hi);
      set_rgb (c, st->water);
      cairo_fill (c->cr);
      set_rgb (c, st->water_line);
      set_line (c, 1.2 * st->line_detail);
      wline (c, wl, H, wr, H);
      cairo_stroke (c->cr);
      flow_arrow (c, px (c, -t) - 3.0 * fs, py (c, (in_lo + in_hi) / 2), px (c, 0) + 0.6 * fs,
                  py (c, (in_lo + in_hi) / 2));
      flow_arrow (c, px (c, L) - 0.2 * fs, py (c, (out_lo + out_hi) / 2), px (c, L + t) + 3.0 * fs,
                  py (c, (out_lo + out_hi) / 2));
    }
}

static void
floc_view (Ctx *c, const Unit *n, BwSketchView view)
{
  const double t = BASIN_WALL_M, L = n->floc_length;
  const double fs = c->ty.body;
  const double across = view == BW_SKETCH_PLAN ? n->width : n->depth;
  const double top = view == BW_SKETCH_PLAN ? n->width + t : n->depth + BASIN_FREEBOARD_M;
  double x = 0;

  floc_shell (c, n, view);
  if (n->first > 0)
    floc_partition (c, n, 0, view);
  if (n->first + n->n_stages < n->floc->stages->len)
    floc_partition (c, n, L, view);
  for (guint i = 0; i < n->n_stages; i++)
    {
      const BwProcessUnit *st = floc_stage (n, i);
      const double len = stage_length (st);
      floc_stage_body (c, n, st, x, x + len, view);
      if (i > 0)
        floc_partition (c, n, x, view);
      x += len;
    }
  if (view == BW_SKETCH_SECTION)
    water_mark (c, px (c, 0.22 * stage_length (floc_stage (n, 0))), py (c, n->depth));

  /* stage names above, with what each holds in section; stage lengths below */
  x = 0;
  for (guint i = 0; i < n->n_stages; i++)
    {
      const BwProcessUnit *st = floc_stage (n, i);
      const double len = stage_length (st), room = c->g.scale * len - 0.4 * fs;
      const guint number = n->first + i + 1;
      g_autofree char *lng = g_strdup_printf (_("stage %u · %s"), number, stage_kind (st, FALSE));
      g_autofree char *mid = g_strdup_printf ("%u · %s", number, stage_kind (st, TRUE));
      g_autofree char *shrt = g_strdup_printf ("%u", number);
      g_autofree char *detail = stage_detail (c, st);
      g_autofree char *lt = fmt_len (c, len);
      const char *label = text_width (c, lng, fs) <= room   ? lng
                          : text_width (c, mid, fs) <= room ? mid
                                                            : shrt;
      const double xm = px (c, x + len / 2);
      double row = py (c, top) - 0.45 * fs;
      if (view == BW_SKETCH_SECTION && n->floc_drive)
        row = py (c, top + FLOC_DRIVE_M) - 0.45 * fs;
      if (view == BW_SKETCH_SECTION && text_width (c, detail, 0.9 * fs) <= room)
        {
          text (c, xm, row, detail, 0.9 * fs, FALSE, 0.5, 1.0, c->st->ink_muted);
          row -= 1.25 * fs;
        }
      text (c, xm, row, label, fs, FALSE, 0.5, 1.0, c->st->ink);
      if (n->n_stages > 1)
        dim_h (c, px (c, x), px (c, x + len), py (c, -t), py (c, -t) + 1.7 * fs, lt);
      x += len;
    }

  {
    g_autofree char *lt = fmt_len (c, L);
    g_autofree char *wt = fmt_len (c, across);
    const double xr = px (c, L + t);
    dim_h (c, px (c, 0), px (c, L), py (c, -t),
           py (c, -t) + (n->n_stages > 1 ? 3.5 : 1.7) * fs, lt);
    dim_v (c, py (c, across), py (c, 0), xr, xr + 3.6 * fs, wt);
  }
}

static void
floc_plan (Ctx *c, const Unit *n)
{
  floc_view (c, n, BW_SKETCH_PLAN);
}

static void
floc_section (Ctx *c, const Unit *n)
{
  floc_view (c, n, BW_SKETCH_SECTION);
}

/* --- circular clarifier --- */

static const char *
launder_kind (const Unit *n)
{
  return n->inboard ? _("inboard launder, weirs both sides") : _("peripheral launder");
}

static void
clarifier_plan (Ctx *c, const Unit *n)
{
  const double R = n->diameter / 2, t = BASIN_WALL_M, s = c->g.scale;
  const double cx = px (c, 0), cy = py (c, 0);
  const double fw = n->feed_well / 2, col = CLAMP (0.03 * n->diameter, 0.2, 0.6);
  const double l_in = n->inboard ? n->launder_r - LAUNDER_WIDTH_M / 2 : R - LAUNDER_WIDTH_M;
  const double l_out = n->inboard ? n->launder_r + LAUNDER_WIDTH_M / 2 : R;
  const BwStyle *st = c->st;
  const double fs = c->ty.body;

  cairo_new_sub_path (c->cr);
  cairo_arc (c->cr, cx, cy, s * R, 0, 2 * G_PI);
  set_rgb (c, st->water);
  cairo_fill (c->cr);
  cairo_new_sub_path (c->cr);
  cairo_arc (c->cr, cx, cy, s * (R + t), 0, 2 * G_PI);
  cairo_new_sub_path (c->cr);
  cairo_arc_negative (c->cr, cx, cy, s * R, 2 * G_PI, 0);
  cairo_set_fill_rule (c->cr, CAIRO_FILL_RULE_EVEN_ODD);
  fill_stroke (c, st->concrete, st->ink, st->line_outline);

  /* the launder: a trough ring, weir edges drawn */
  cairo_new_sub_path (c->cr);
  cairo_arc (c->cr, cx, cy, s * l_out, 0, 2 * G_PI);
  cairo_new_sub_path (c->cr);
  cairo_arc_negative (c->cr, cx, cy, s * l_in, 2 * G_PI, 0);
  fill_stroke (c, st->paper, st->equipment, 1.3 * st->line_detail);
  cairo_set_fill_rule (c->cr, CAIRO_FILL_RULE_WINDING);

  /* feed well and the centre column inside it */
  cairo_new_sub_path (c->cr);
  cairo_arc (c->cr, cx, cy, s * fw, 0, 2 * G_PI);
  set_rgb (c, st->equipment);
  set_line (c, 1.5 * st->line_detail);
  cairo_stroke (c->cr);
  cairo_new_sub_path (c->cr);
  cairo_arc (c->cr, cx, cy, MAX (s * col, 1.5), 0, 2 * G_PI);
  fill_stroke (c, st->concrete, st->ink, st->line_detail);

  /* radial flow from the feed well to the launder, on the diagonals */
  {
    const double r0 = fw + 0.08 * R, r1 = l_in - 0.08 * R;
    if (s * (r1 - r0) > 2.2 * fs)
      for (int k = 0; k < 8; k++)
        {
          const double a = G_PI / 8 + k * G_PI / 4;
          flow_arrow (c, cx + s * r0 * cos (a), cy - s * r0 * sin (a), cx + s * r1 * cos (a),
                      cy - s * r1 * sin (a));
        }
  }

  {
    const double tx = px (c, R + t) + 2.0 * fs;
    g_autofree char *fd = fmt_len (c, n->feed_well);
    g_autofree char *fl = g_strdup_printf (_("feed well Ø %s%s"), fd,
                                           n->feed_well_given ? "" : _(" (drawn; not given)"));
    g_autofree char *lr = fmt_len (c, n->launder_r);
    g_autofree char *ll = n->inboard ? g_strdup_printf (_("%s at r %s"), launder_kind (n), lr)
                                     : g_strdup (launder_kind (n));
    const double a1 = G_PI / 4, a2 = 0.09 * G_PI;
    const double lm = (l_in + l_out) / 2;
    callout_fit (c, cx + s * fw * cos (a1 + 0.3), cy - s * fw * sin (a1 + 0.3), tx,
                 py (c, 0.62 * R), fl, _("feed well"), 0.0, 0.5);
    callout_fit (c, cx + s * lm * cos (a2), cy - s * lm * sin (a2), tx, py (c, 0.25 * R), ll,
                 _("launder"), 0.0, 0.5);
    callout_fit (c, cx + s * 0.55 * (fw + l_in) * cos (-a2), cy - s * 0.55 * (fw + l_in) * sin (-a2),
                 tx, py (c, -0.25 * R), _("flow outward to the weirs"), "flow", 0.0, 0.5);
  }
  {
    g_autofree char *dt = fmt_len (c, n->diameter);
    g_autofree char *label = g_strdup_printf ("Ø %s", dt);
    dim_h (c, px (c, -R), px (c, R), py (c, -R - t), py (c, -R - t) + 1.7 * fs, label);
  }
}

static void
clarifier_section (Ctx *c, const Unit *n)
{
  const double R = n->diameter / 2, t = BASIN_WALL_M, H = n->depth, sl = n->sludge;
  const double top = H + BASIN_FREEBOARD_M, fw = n->feed_well / 2;
  const double skirt = H * (1.0 - FEED_WELL_DEPTH);
  const double col = CLAMP (0.03 * n->diameter, 0.2, 0.6);
  const double lc = n->inboard ? n->launder_r : R - LAUNDER_WIDTH_M / 2;
  const BwStyle *st = c->st;
  const double fs = c->ty.body;

  /* water down to the sloped floor, then the sludge zone below the wall foot */
  cairo_move_to (c->cr, px (c, -R), py (c, H));
  cairo_line_to (c->cr, px (c, R), py (c, H));
  cairo_line_to (c->cr, px (c, R), py (c, 0));
  cairo_line_to (c->cr, px (c, 0), py (c, -sl));
  cairo_line_to (c->cr, px (c, -R), py (c, 0));
  cairo_close_path (c->cr);
  set_rgb (c, st->water);
  cairo_fill (c->cr);
  if (sl > 0)
    {
      cairo_save (c->cr);
      cairo_move_to (c->cr, px (c, -R), py (c, 0));
      cairo_line_to (c->cr, px (c, R), py (c, 0));
      cairo_line_to (c->cr, px (c, 0), py (c, -sl));
      cairo_close_path (c->cr);
      set_rgb (c, st->sludge);
      cairo_fill_preserve (c->cr);
      cairo_clip (c->cr);
      hatch (c, -R, -sl, R, 0, st->sludge_line);
      cairo_restore (c->cr);
      set_rgb (c, st->sludge_line);
      set_line (c, st->line_detail);
      set_dash (c, 6, 3);
      wline (c, -R, 0, R, 0);
      cairo_stroke (c->cr);
    }

  /* walls, the sloped floor slab and the centre column (concrete) */
  wrect (c, -R - t, -t, -R, top);
  wrect (c, R, -t, R + t, top);
  cairo_move_to (c->cr, px (c, -R), py (c, 0));
  cairo_line_to (c->cr, px (c, 0), py (c, -sl));
  cairo_line_to (c->cr, px (c, R), py (c, 0));
  cairo_line_to (c->cr, px (c, R), py (c, -t));
  cairo_line_to (c->cr, px (c, 0), py (c, -sl - t));
  cairo_line_to (c->cr, px (c, -R), py (c, -t));
  cairo_close_path (c->cr);
  wrect (c, -col, -sl, col, 0.7 * H);
  wrect (c, -col, 0.82 * H, col, top);
  fill_stroke (c, st->concrete, st->ink, st->line_outline);

  /* the feed well skirt, from above the water down to the share of the depth */
  set_rgb (c, st->equipment);
  set_line (c, MAX (1.6 * st->line_detail, c->g.scale * 0.01 / c->lw));
  wline (c, -fw, H + 0.2, -fw, skirt);
  wline (c, fw, H + 0.2, fw, skirt);
  cairo_stroke (c->cr);

  set_rgb (c, st->water_line);
  set_line (c, 1.2 * st->line_detail);
  wline (c, -R, H, -col, H);
  wline (c, col, H, R, H);
  cairo_stroke (c->cr);
  water_mark (c, px (c, -(fw + R) / 2), py (c, H));

  /* launders: troughs each side of the cut */
  for (int side = -1; side <= 1; side += 2)
    wrect (c, side * lc - LAUNDER_WIDTH_M / 2, H - LAUNDER_DEPTH_M, side * lc + LAUNDER_WIDTH_M / 2,
           H + 0.08);
  fill_stroke (c, st->paper, st->equipment, st->line_detail);

  /* flow: out of the column ports, down the feed well, outward under the skirt, up to weirs */
  if (c->g.scale * (R - fw) > 4.0 * fs)
    for (int side = -1; side <= 1; side += 2)
      {
        const double xa = side * (fw + 0.08 * R), xb = side * (lc - LAUNDER_WIDTH_M - 0.1 * R);
        flow_arrow (c, px (c, xa), py (c, 0.45 * skirt), px (c, xb), py (c, 0.45 * skirt));
        flow_arrow (c, px (c, xb), py (c, 0.5 * skirt),
                    px (c, xb + side * 0.05 * R), py (c, H - LAUNDER_DEPTH_M - 0.15));
      }
  if (c->g.scale * fw > 1.2 * fs)
    flow_arrow (c, px (c, -(col + fw) / 2), py (c, 0.8 * H), px (c, -(col + fw) / 2),
                py (c, skirt + 0.05 * H));

  {
    const double tx = px (c, R + t) + 4.6 * fs;
    g_autofree char *sd = fmt_len (c, sl);
    g_autofree char *sl_long = g_strdup_printf (_("sludge zone, %s at the centre"), sd);
    g_autofree char *fd = fmt_len (c, n->feed_well);
    callout_fit (c, px (c, lc), py (c, H + 0.08), tx, py (c, top), launder_kind (n), _("launder"),
                 0.0, 0.5);
    callout_fit (c, px (c, fw), py (c, 0.5 * (H + skirt)), tx, py (c, 0.8 * H) + 0.4 * fs,
                 _("feed well skirt"), _("feed well"), 0.0, 0.5);
    if (sl > 0)
      callout_fit (c, px (c, 0.5 * R), py (c, -0.25 * sl), tx, py (c, 0) + 1.0 * fs, sl_long,
                   _("sludge"), 0.0, 0.5);
    g_autofree char *fl = g_strdup_printf ("Ø %s", fd);
    dim_h (c, px (c, -fw), px (c, fw), py (c, H + 0.2), py (c, top) - 0.3 * fs, fl);
  }
  {
    g_autofree char *dt = fmt_len (c, n->diameter);
    g_autofree char *label = g_strdup_printf ("Ø %s", dt);
    g_autofree char *ht = fmt_len (c, H);
    const double xr = px (c, R + t);
    dim_h (c, px (c, -R), px (c, R), py (c, -sl - t), py (c, -sl - t) + 1.7 * fs, label);
    dim_v (c, py (c, H), py (c, 0), xr, xr + 2.2 * fs, ht);
  }
}

/* --- plate or tube settler: a representative run of channels --- */

/* A dimension between page points A and B, drawn offset by page vector (OX, OY) with extension
 * lines, arrows and the label beyond the offset line's middle. */
static void
dim_aligned (Ctx *c, double ax, double ay, double bx, double by, double ox, double oy,
             const char *label)
{
  const double a = 0.62 * c->ty.body;
  const double on = hypot (ox, oy), ux = ox / on, uy = oy / on;
  const double gap = 0.25 * c->ty.body, over = 0.35 * c->ty.body;
  const double len = hypot (bx - ax, by - ay);
  const double dx = (bx - ax) / len, dy = (by - ay) / len;
  const gboolean inside = len > 2.4 * a;
  const double p0x = ax + ox, p0y = ay + oy, p1x = bx + ox, p1y = by + oy;

  set_rgb (c, c->st->ink);
  set_line (c, c->st->line_dimension);
  cairo_move_to (c->cr, ax + gap * ux, ay + gap * uy);
  cairo_line_to (c->cr, p0x + over * ux, p0y + over * uy);
  cairo_move_to (c->cr, bx + gap * ux, by + gap * uy);
  cairo_line_to (c->cr, p1x + over * ux, p1y + over * uy);
  if (inside)
    {
      cairo_move_to (c->cr, p0x, p0y);
      cairo_line_to (c->cr, p1x, p1y);
    }
  else
    {
      cairo_move_to (c->cr, p0x - 1.6 * a * dx, p0y - 1.6 * a * dy);
      cairo_line_to (c->cr, p1x + 1.6 * a * dx, p1y + 1.6 * a * dy);
    }
  cairo_stroke (c->cr);
  arrowhead (c, p0x, p0y, inside ? -dx : dx, inside ? -dy : dy, a);
  arrowhead (c, p1x, p1y, inside ? dx : -dx, inside ? dy : -dy, a);
  {
    /* the label sits beyond the dimension line, on the side the offset points to */
    const double mx = (p0x + p1x) / 2 + 0.5 * c->ty.body * ux;
    const double my = (p0y + p1y) / 2 + 0.5 * c->ty.body * uy;
    text (c, inside ? mx : p1x + 1.9 * a * dx + 0.3 * c->ty.body * ux,
          inside ? my : p1y + 1.9 * a * dy + 0.3 * c->ty.body * uy, label, c->ty.body, FALSE,
          ux >= 0 ? 0.0 : 1.0, uy >= 0 ? 0.0 : 1.0, c->st->ink);
  }
}

/* A break line (the drawing stops here) from page (X0, Y0) to (X1, Y1), with one zigzag. */
static void
break_line (Ctx *c, double x0, double y0, double x1, double y1)
{
  const double len = hypot (x1 - x0, y1 - y0), ux = (x1 - x0) / len, uy = (y1 - y0) / len;
  const double z = 0.5 * c->ty.body, mx = (x0 + x1) / 2, my = (y0 + y1) / 2;
  set_rgb (c, c->st->ink_muted);
  set_line (c, c->st->line_dimension);
  cairo_move_to (c->cr, x0, y0);
  cairo_line_to (c->cr, mx - z * ux, my - z * uy);
  cairo_line_to (c->cr, mx - 0.4 * z * ux - z * uy, my - 0.4 * z * uy + z * ux);
  cairo_line_to (c->cr, mx + 0.4 * z * ux + z * uy, my + 0.4 * z * uy - z * ux);
  cairo_line_to (c->cr, mx + z * ux, my + z * uy);
  cairo_line_to (c->cr, x1, y1);
  cairo_stroke (c->cr);
}

static const char *const settler_names[] = { N_("plates"), N_("circular tubes"), N_("square tubes") };

/* A tube settler's cells cut across their axis, in a box at the top left of the section (above
 * the first tube, below the water line), enlarged by a round factor; skipped without room. */
static void
tube_inset (Ctx *c, const Unit *n, double x0, double ws)
{
  const double fs = c->ty.body, s = c->g.scale, ta = tan (n->angle);
  const double bx = px (c, x0) + 0.4 * fs, by = py (c, ws) + 1.2 * fs, bh = 6.5 * fs;
  /* three cells and their gaps (3.4 cell widths) in a box 11 text heights wide */
  const double cell_max = (11.0 * fs - 1.6 * fs) / 3.4;
  double bw, mag, d, cx0, cy, wx, wy;
  g_autofree char *sp = NULL;
  g_autofree char *lbl = NULL;
  g_autofree char *cap = NULL;

  if (n->shape == 0 || cell_max < 0.8 * fs || !(n->spacing > 0.0))
    return;
  mag = nice_below (cell_max / (s * n->spacing));
  d = mag * s * n->spacing;
  cap = g_strdup_printf (_("Tube cells, section A–A, ×%g"), mag);
  /* wide enough for its caption, whatever the language */
  bw = MAX (11.0 * fs, text_width (c, cap, c->ty.small) + 0.6 * fs);
  /* the box's lower right corner, in world metres, must stay above the first tube */
  wx = (bx + bw - c->g.origin_x) / s;
  wy = (c->g.origin_y - (by + bh)) / s;
  if (by + bh > c->h - c->ty.bottom_band || bx + bw > c->w - c->ty.pad || wy < wx * ta + 0.5 * fs / s)
    return;
  cairo_rectangle (c->cr, bx, by, bw, bh);
  fill_stroke (c, c->st->paper, c->st->ink_muted, c->st->line_dimension);
  text (c, bx + 0.3 * fs, by + 0.2 * fs, cap, c->ty.small, FALSE, 0.0, 0.0, c->st->ink);
  cx0 = bx + (bw - 3.4 * d) / 2 + d / 2;
  cy = by + 1.6 * fs + d / 2;
  set_rgb (c, c->st->equipment);
  set_line (c, 1.6 * c->st->line_detail);
  for (int i = 0; i < 3; i++)
    {
      const double cx = cx0 + i * 1.2 * d;
      cairo_new_sub_path (c->cr);
      if (n->shape == 1)
        cairo_arc (c->cr, cx, cy, d / 2, 0, 2 * G_PI);
      else
        cairo_rectangle (c->cr, cx - d / 2, cy - d / 2, d, d);
    }
  cairo_stroke (c->cr);
  sp = fmt_len (c, n->spacing);
  lbl = g_strdup_printf ("%s%s", n->shape == 1 ? "Ø " : "", sp);
  dim_h (c, cx0 - d / 2, cx0 + d / 2, cy + d / 2, MIN (cy + d / 2 + 1.2 * fs, by + bh - 0.3 * fs),
         lbl);
}

static void
settler_section (Ctx *c, const Unit *n)
{
  const double th = n->angle, L = n->plate_len, pitch = settler_pitch (n);
  const double ca = cos (th), sa = sin (th);
  const guint np = n->n_drawn;
  const double xr = (np - 1) * pitch + L * ca, m = MAX (0.35, 0.25 * L);
  const double x0 = -m, x1 = xr + m, y0 = -SETTLER_BELOW_M;
  const double ws = L * sa + 0.7 * SETTLER_ABOVE_M;
  const double s = c->g.scale, fs = c->ty.body;
  const double chan = n->spacing * s; /* a channel's clear width on the page */
  const BwStyle *st = c->st;

  wrect (c, x0, y0, x1, ws);
  set_rgb (c, st->water);
  cairo_fill (c->cr);
  set_rgb (c, st->water_line);
  set_line (c, 1.2 * st->line_detail);
  wline (c, x0, ws, x1, ws);
  cairo_stroke (c->cr);
  water_mark (c, px (c, x0 + 0.3 * (x1 - x0)), py (c, ws));
  break_line (c, px (c, x0), py (c, ws + 0.15), px (c, x0), py (c, y0));
  break_line (c, px (c, x1), py (c, ws + 0.15), px (c, x1), py (c, y0));
  break_line (c, px (c, x0), py (c, y0), px (c, x1), py (c, y0));

  /* the collection trough above the run, by convention */
  wrect (c, 0.5 * xr - 0.15, ws - 0.3, 0.5 * xr + 0.15, ws + 0.08);
  fill_stroke (c, st->paper, st->equipment, st->line_detail);

  /* the plates (or tube walls) at their angle, pitch and length */
  set_rgb (c, st->equipment);
  set_line (c, MAX (1.6 * st->line_detail, s * 0.004 / c->lw));
  cairo_set_line_cap (c->cr, CAIRO_LINE_CAP_ROUND);
  for (guint i = 0; i < np; i++)
    wline (c, i * pitch, 0, i * pitch + L * ca, L * sa);
  cairo_stroke (c->cr);
  cairo_set_line_cap (c->cr, CAIRO_LINE_CAP_BUTT);

  /* flow: up from below into the run, up each channel; solids on each lower plate, sliding
   * down it */
  flow_arrow (c, px (c, 0.5 * (np - 1) * pitch), py (c, y0 + 0.15 * SETTLER_BELOW_M),
              px (c, 0.5 * (np - 1) * pitch), py (c, -0.12 * SETTLER_BELOW_M));
  flow_arrow (c, px (c, 0.5 * xr + 0.25), py (c, L * sa + 0.05), px (c, 0.5 * xr + 0.25),
              py (c, ws - 0.3));
  if (chan > 5.0)
    for (guint i = 0; i + 1 < np; i++)
      {
        const double bx = i * pitch + pitch / 2;
        const double rd = MIN (0.16 * chan, 0.22 * fs);
        const double ah = MIN (0.8 * fs, 1.1 * chan);
        set_rgb (c, st->flow);
        set_line (c, MIN (1.8 * st->line_detail, 0.12 * chan / c->lw));
        wline (c, bx + 0.35 * L * ca, 0.35 * L * sa, bx + 0.8 * L * ca, 0.8 * L * sa);
        cairo_stroke (c->cr);
        arrowhead (c, px (c, bx + 0.8 * L * ca) + 0.5 * ah * ca, py (c, 0.8 * L * sa) - 0.5 * ah * sa,
                   ca, -sa, ah);
        set_rgb (c, st->sludge_line);
        for (int k = 0; k < 3; k++)
          {
            /* on the upper face of plate i + 1, whose normal points up and to the left */
            const double tt = (0.12 + 0.07 * k) * L;
            const double wx = (i + 1) * pitch + tt * ca, wy = tt * sa;
            cairo_new_sub_path (c->cr);
            cairo_arc (c->cr, px (c, wx) - (rd + 0.6 * c->lw) * sa, py (c, wy) - (rd + 0.6 * c->lw) * ca,
                       rd, 0, 2 * G_PI);
          }
        cairo_fill (c->cr);
        set_rgb (c, st->sludge_line);
        arrowhead (c, px (c, (i + 1) * pitch + 0.06 * L * ca) - (rd + 0.6 * c->lw) * sa,
                   py (c, 0.06 * L * sa) - (rd + 0.6 * c->lw) * ca, -ca, sa,
                   MIN (0.6 * fs, 0.8 * chan));
      }

  /* angle at the last plate's foot, clear of the others */
  {
    const double fx = px (c, (np - 1) * pitch), fy = py (c, 0), r = MAX (0.3 * L * s, 2.5 * fs);
    g_autofree char *deg = g_strdup_printf ("%.3g°", th * 180.0 / G_PI);
    set_rgb (c, st->ink_muted);
    set_line (c, st->line_dimension);
    set_dash (c, 4, 2.5);
    cairo_move_to (c->cr, fx, fy);
    cairo_line_to (c->cr, fx + 1.15 * r, fy);
    cairo_stroke (c->cr);
    set_rgb (c, st->ink);
    set_line (c, st->line_dimension);
    cairo_arc_negative (c->cr, fx, fy, r, 0, -th);
    cairo_stroke (c->cr);
    text (c, fx + (r + 0.4 * fs) * cos (th / 2), fy - (r + 0.4 * fs) * sin (th / 2), deg, fs, FALSE,
          0.0, 0.5, st->ink);
  }

  /* dimensions: the length along the last plate, offset down and to the right; the clear
   * spacing between the last two, at their upper ends */
  {
    g_autofree char *lt = fmt_len (c, L);
    g_autofree char *sp = fmt_len (c, n->spacing);
    g_autofree char *spl = g_strdup_printf ("%s%s", n->shape == 1 ? "Ø " : "", sp);
    const double ax = px (c, (np - 1) * pitch), ay = py (c, 0);
    const double bx = px (c, (np - 1) * pitch + L * ca), by = py (c, L * sa);
    const double off = 2.6 * fs;
    const double tx = px (c, (np - 2) * pitch + L * ca), ty = py (c, L * sa);
    dim_aligned (c, ax, ay, bx, by, off * sa, off * ca, lt);
    /* the foot of the perpendicular from plate np-2's top onto plate np-1 */
    dim_aligned (c, tx, ty, tx + s * n->spacing * sa, ty + s * n->spacing * ca, 1.4 * fs * ca,
                 -1.4 * fs * sa, spl);
  }

  /* callouts on the right */
  {
    const double tx = px (c, x1) + 1.5 * fs;
    g_autofree char *wd = fmt_len (c, n->plate_width);
    g_autofree char *lng = g_strdup_printf (n->shape == 0 ? _("%u %s, %s wide; %u drawn")
                                                          : _("%u %s in rows %s wide; %u drawn"),
                                            n->count, _(settler_names[n->shape]), wd, np);
    g_autofree char *shrt = g_strdup_printf (_("%u %s (%u drawn)"), n->count, _(settler_names[n->shape]),
                                             np);
    callout_fit (c, px (c, 0.55 * L * ca), py (c, 0.55 * L * sa), tx, py (c, L * sa), lng, shrt,
                 0.0, 0.5);
    callout_fit (c, px (c, 0.5 * xr + 0.15), py (c, ws - 0.1), tx, py (c, ws) - 0.6 * fs,
                 _("collection trough"), _("trough"), 0.0, 0.5);
    callout_fit (c, px (c, (np - 1) * pitch * 0.5 + 0.6 * L * ca), py (c, 0.6 * L * sa), tx,
                 py (c, 0.6 * L * sa), _("flow up the channels"), _("flow up"), 0.0, 0.5);
    callout_fit (c, px (c, (np - 1) * pitch * 0.5 + 0.2 * L * ca), py (c, 0.2 * L * sa), tx,
                 py (c, 0.2 * L * sa) , _("settled solids slide down"), _("solids down"), 0.0, 0.5);
  }
  tube_inset (c, n, x0, ws);
}

/* --- plate or tube settler in plan: the basin, its banks of modules and every row --- */

static double text_box (Ctx *c, double x, double y, double width, const char *s, double size,
                        gboolean bold, int max_lines, BwRgb col);

/* Rows of channels in bank J of N's banks (the first banks take one more when they differ). */
static guint
settler_bank_rows (const Unit *n, guint j)
{
  return n->rows / n->banks + (j < n->rows % n->banks ? 1 : 0);
}

/* The paragraph under a settler's plan: what is drawn of the count, and what is assumed. */
static char *
settler_plan_note (const Ctx *c, const Unit *n, guint every)
{
  g_autofree char *pitch = fmt_len (c, settler_pitch (n));
  g_autofree char *run = fmt_len (c, n->plate_len * cos (n->angle));
  g_autofree char *count = NULL, *drawn = NULL, *basis = NULL, *fit = NULL;
  const guint most = settler_bank_rows (n, 0);

  if (n->shape == 0)
    count = g_strdup_printf (ngettext ("%u plates at a pitch of %s in plan, in %u bank",
                                       "%u plates at a pitch of %s in plan, in %u banks", n->banks),
                             n->count, pitch, n->banks);
  else
    count = g_strdup_printf (ngettext ("%u %s, %u to a row, %u rows at a pitch of %s in plan, in "
                                       "%u bank",
                                       "%u %s, %u to a row, %u rows at a pitch of %s in plan, in "
                                       "%u banks", n->banks),
                             n->count, _(settler_names[n->shape]), n->per_row, n->rows, pitch,
                             n->banks);
  drawn = every > 1 ? g_strdup_printf (_("one row in %u drawn at this scale"), every)
                    : g_strdup (_("every row drawn"));
  if (n->area_given)
    {
      g_autofree char *area = bw_units_format (n->module_area, BW_KIND_AREA, c->units);
      trim_zeros (area);
      basis = g_strdup_printf (_("Footprint: the module area entered, %s; the number of banks "
                                 "is assumed."), area);
    }
  else
    basis = g_strdup_printf (_("Footprint derived from the count, the pitch and the %s a row "
                               "covers in plan, length × cos θ (no module area entered); the "
                               "number of banks is assumed."), run);
  if (n->area_given && most > n->rows_fit)
    fit = g_strdup_printf (_(" The count needs %u rows to a bank; the module area holds %u."),
                           most, n->rows_fit);
  return g_strdup_printf ("%s; %s. %s%s", count, drawn, basis, fit ? fit : "");
}

static void
settler_plan (Ctx *c, const Unit *n)
{
  const double t = BASIN_WALL_M, b = n->plate_width, W = n->banks * b;
  const double x0 = SETTLER_INLET_M, Lm = n->module_len, L = x0 + Lm;
  const double pitch = settler_pitch (n), run = n->plate_len * cos (n->angle);
  const double s = c->g.scale, fs = c->ty.body;
  /* rows closer on the page than this are thinned to one in EVERY, counted from the last */
  const double need = MAX (4.0, 3.0 * c->lw);
  const guint every = pitch * s >= need ? 1 : (guint) MIN (ceil (need / (pitch * s)), 1e7);
  const double tw = MIN (SETTLER_TROUGH_M, Lm / 3), xt = x0 + Lm / 2;
  const BwStyle *st = c->st;

  wrect (c, 0, 0, L, W);
  set_rgb (c, st->water);
  cairo_fill (c->cr);
  /* walls, the inlet opening in the middle of the inlet wall */
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

  /* each bank: its outline, and the upper edges of its rows (a plate seen from above covers
   * length x cos(angle) from its foot; the one behind shows from its own upper edge on) */
  for (guint j = 0; j < n->banks; j++)
    {
      const guint rows = MIN (settler_bank_rows (n, j), n->rows_fit);
      const double len = n->area_given ? Lm : (rows - 1) * pitch + run;
      set_rgb (c, st->equipment);
      set_line (c, 0.5 * st->line_detail);
      for (gint64 i = (gint64) rows - 1; rows > 0 && i >= 0; i -= every)
        wline (c, x0 + run + i * pitch, j * b, x0 + run + i * pitch, (j + 1) * b);
      cairo_stroke (c->cr);
      wrect (c, x0, j * b, x0 + len, (j + 1) * b);
      set_line (c, st->line_detail);
      cairo_stroke (c->cr);
    }

  /* the collection trough over the middle of the run, across the banks, by convention */
  wrect (c, xt - tw / 2, 0, xt + tw / 2, W);
  fill_stroke (c, st->paper, st->equipment, 1.3 * st->line_detail);

  /* flow in through the opening and across the inlet zone to the modules */
  flow_arrow (c, px (c, -t) - 3.0 * fs, py (c, W / 2), MAX (px (c, x0) - 0.3 * fs, px (c, 0)),
              py (c, W / 2));

  /* callouts above: the inlet zone on the left, the trough on the right; shortened, then the
   * right one lifted a line, when the two would meet */
  {
    const double row = py (c, W + t) - 2.6 * fs, left = px (c, -t), right = px (c, L + t);
    g_autofree char *it = fmt_len (c, x0);
    g_autofree char *il = g_strdup_printf (_("inlet zone, %s (drawn); flow runs under the "
                                             "modules and up the plates"), it);
    const char *tl = _("collection trough (drawn by convention)");
    double lift = 0;
    if (left + text_width (c, il, fs) + 1.5 * fs > right - text_width (c, tl, fs))
      {
        g_free (il);
        il = g_strdup_printf (_("inlet zone %s"), it);
        tl = _("trough (by convention)");
      }
    if (left + text_width (c, il, fs) + 1.5 * fs > right - text_width (c, tl, fs))
      lift = 1.3 * fs;
    callout (c, px (c, 0.5 * x0), py (c, 0.8 * W), left, row, il, 0.0, 1.0);
    callout (c, px (c, xt), py (c, W - 0.3 * b), right, row - lift, tl, 1.0, 1.0);
  }

  /* dimensions: one plate's run in plan above; the inlet zone and the modules, then the whole
   * length below; a bank's width and the whole width on the right */
  {
    g_autofree char *rt = fmt_len (c, run);
    g_autofree char *rl = g_strdup_printf (_("%s in plan"), rt);
    g_autofree char *it = fmt_len (c, x0);
    g_autofree char *mt = fmt_len (c, Lm);
    g_autofree char *lt = fmt_len (c, L);
    g_autofree char *bt = fmt_len (c, b);
    g_autofree char *wt = fmt_len (c, W);
    const double yb = py (c, -t), xr = px (c, L + t);
    double xw = xr + 1.8 * fs;
    dim_h (c, px (c, x0), px (c, x0 + run), py (c, W + t), py (c, W + t) - 1.0 * fs, rl);
    /* the inlet zone's where its figure fits between the arrows (its callout gives it too) */
    if (text_width (c, it, fs) < c->g.scale * x0 - 0.31 * fs)
      dim_h (c, px (c, 0), px (c, x0), yb, yb + 1.7 * fs, it);
    dim_h (c, px (c, x0), px (c, L), yb, yb + 1.7 * fs, mt);
    dim_h (c, px (c, 0), px (c, L), yb, yb + 3.7 * fs, lt);
    if (n->banks > 1)
      {
        dim_v (c, py (c, W), py (c, W - b), xr, xw, bt);
        xw += text_width (c, bt, fs) + 1.6 * fs;
      }
    dim_v (c, py (c, W), py (c, 0), xr, xw, wt);
  }

  /* the note under the drawing: the count, the rows drawn and what is assumed */
  {
    g_autofree char *note = settler_plan_note (c, n, every);
    const double x = MAX (px (c, -t), c->ty.pad);
    text_box (c, x, py (c, -t) + 4.6 * fs, c->w - c->ty.pad - x, note, c->ty.small, FALSE, 3,
              st->ink);
  }
}

/* --- train schematic: the engine's results, not to scale --- */

/* The schematic's columns: a lead-in and lead-out for the flow arrows, NU blocks of width BW
 * from X0 with GAP between them; all in page units, from the body text size. */
static void
schematic_columns (const BwSketchGeometry *g, guint nu, double *lead, double *gap, double *x0,
                   double *bw)
{
  const double fs = g->text_size;

  *lead = 2.6 * fs;
  *gap = 2.8 * fs;
  *x0 = g->world_x0 + *lead;
  *bw = nu > 0 ? (g->world_x1 - *lead - *x0 - (nu - 1) * *gap) / nu : 0;
}

int
bw_sketch_schematic_block_at (const BwSketchGeometry *g, guint n_units, double x, double y)
{
  double lead, gap, x0, bw;

  g_return_val_if_fail (g != NULL, -1);
  if (n_units == 0 || y < -g->world_y1 || y > -g->world_y0)
    return -1;
  schematic_columns (g, n_units, &lead, &gap, &x0, &bw);
  for (guint i = 0; i < n_units; i++)
    {
      const double bx = x0 + i * (bw + gap);
      if (x >= bx && x <= bx + bw)
        return (int) i;
    }
  return -1;
}


/* The load case the schematic shows: maximum-day flow, coldest water, all units in service;
 * failing that the first maximum-day case; failing that the last case. */
static int
schematic_case (const BwResults *r)
{
  int any = -1;
  for (guint c = 0; c < r->n_cases; c++)
    if (r->cases[c].flow == BW_FLOW_MAXIMUM_DAY)
      {
        if (r->cases[c].temp == BW_TEMP_COLDEST && r->cases[c].service == BW_SERVICE_ALL_IN_SERVICE)
          return (int) c;
        if (any < 0)
          any = (int) c;
      }
  return any >= 0 ? any : (int) r->n_cases - 1;
}

static const BwElementResult *
element_of (const BwResults *r, const BwProcessUnit *u, const BwProcessUnit *stage)
{
  for (guint i = 0; i < r->elements->len; i++)
    {
      const BwElementResult *e = g_ptr_array_index (r->elements, i);
      if (e->unit == u && e->stage == stage)
        return e;
    }
  return NULL;
}

/* "LABEL VALUE" for quantity Q of E in case K, appended to LINES when the engine reported it. */
static void
add_figure (const Ctx *c, GPtrArray *lines, const BwElementResult *e, int k, BwQuantity q,
            const char *label)
{
  g_autofree char *v = NULL;
  if (e == NULL || k < 0 || !bw_quantity_set_has (&e->values[k], q))
    return;
  v = bw_units_format (e->values[k].values[q], bw_quantity_info (q)->kind, c->units);
  g_ptr_array_add (lines, g_strdup_printf ("%s %s", label, v));
}

/* Text wrapped (or ellipsised) to WIDTH page units at (X, Y), top left; returns its height. */
static double
text_box (Ctx *c, double x, double y, double width, const char *s, double size, gboolean bold,
          int max_lines, BwRgb col)
{
  PangoLayout *layout = pango_cairo_create_layout (c->cr);
  PangoFontDescription *fd = pango_font_description_new ();
  int w, h;

  pango_font_description_set_family (fd, c->st->font_family);
  pango_font_description_set_absolute_size (fd, size * PANGO_SCALE);
  pango_font_description_set_weight (fd, bold ? PANGO_WEIGHT_BOLD : PANGO_WEIGHT_NORMAL);
  pango_layout_set_font_description (layout, fd);
  pango_layout_set_width (layout, (int) (MAX (width, 1.0) * PANGO_SCALE));
  pango_layout_set_wrap (layout, PANGO_WRAP_WORD_CHAR);
  pango_layout_set_ellipsize (layout, PANGO_ELLIPSIZE_END);
  pango_layout_set_height (layout, -max_lines);
  {
    /* The drawing's numbers with the reader's decimal separator (bw_label_number). */
    g_autofree char *shown = bw_label_number (s);
    pango_layout_set_text (layout, shown, -1);
  }
  pango_layout_get_pixel_size (layout, &w, &h);
  if (col.r >= 0)
    {
      set_rgb (c, col);
      cairo_move_to (c->cr, x, y);
      pango_cairo_show_layout (c->cr, layout);
    }
  pango_font_description_free (fd);
  g_object_unref (layout);
  return h;
}

/* The lines of one block: the engine's key figures of unit U in case K. */
static GPtrArray *
block_lines (const Ctx *c, const BwResults *r, const BwProcessUnit *u, int k)
{
  GPtrArray *lines = g_ptr_array_new_with_free_func (g_free);
  const BwElementResult *e = element_of (r, u, NULL);

  add_figure (c, lines, e, k, BW_Q_FLOW, _("flow"));
  switch (u->type)
    {
    case BW_PROCESS_RAPID_MIX:
    case BW_PROCESS_INLINE_MIXER:
      add_figure (c, lines, e, k, BW_Q_DETENTION, "t");
      add_figure (c, lines, e, k, BW_Q_G, "G");
      break;
    case BW_PROCESS_FLOCCULATOR:
      add_figure (c, lines, e, k, BW_Q_DETENTION, "t");
      add_figure (c, lines, e, k, BW_Q_G, _("G (mean)"));
      for (guint i = 0; u->stages && i < u->stages->len; i++)
        {
          g_autofree char *label = g_strdup_printf ("G%u", i + 1);
          add_figure (c, lines, element_of (r, u, g_ptr_array_index (u->stages, i)), k, BW_Q_G,
                      label);
        }
      break;
    case BW_PROCESS_RECTANGULAR_BASIN:
    case BW_PROCESS_CIRCULAR_CLARIFIER:
      add_figure (c, lines, e, k, BW_Q_OVERFLOW_RATE, _("overflow"));
      add_figure (c, lines, e, k, BW_Q_DETENTION, "t");
      break;
    case BW_PROCESS_PLATE_SETTLER:
      add_figure (c, lines, e, k, BW_Q_PROJECTED_LOADING, _("loading"));
      add_figure (c, lines, e, k, BW_Q_OVERFLOW_RATE, _("overflow"));
      break;
    default:
      break;
    }
  return lines;
}

static void
schematic (Ctx *c, const Unit *n, const BwProcessUnit *named, const BwResults *r)
{
  const BwTrain *tr = n->train;
  const guint nu = tr->units->len;
  const double fs = c->ty.body;
  double lead, gap, x0, bw;
  double inner;
  const double ytop = -c->g.world_y1, ybot = -c->g.world_y0;
  const int k = schematic_case (r);
  g_autofree char *case_label = k >= 0 ? bw_load_case_label (&r->cases[k]) : g_strdup (_("none"));
  const BwRgb none = { -1, -1, -1 };
  const BwStyle *st = c->st;
  guint highlight = G_MAXUINT;
  double bh = 0, by;

  schematic_columns (&c->g, nu, &lead, &gap, &x0, &bw);
  inner = MAX (bw - 1.2 * fs, 4.0);
  /* the unit the drawing was asked for (a stage's flocculator) stands out */
  for (guint i = 0; i < nu; i++)
    {
      const BwProcessUnit *u = g_ptr_array_index (tr->units, i);
      if (u == named)
        highlight = i;
      for (guint j = 0; u->stages && j < u->stages->len; j++)
        if (g_ptr_array_index (u->stages, j) == named)
          highlight = i;
    }

  /* every block as tall as the tallest */
  for (guint i = 0; i < nu; i++)
    {
      const BwProcessUnit *u = g_ptr_array_index (tr->units, i);
      g_autoptr (GPtrArray) lines = block_lines (c, r, u, k);
      double h = 0.6 * fs;
      h += text_box (c, 0, 0, inner, u->name && *u->name ? u->name : u->id, fs, TRUE, 2, none);
      h += text_box (c, 0, 0, inner, bw_label_process_type (u->type), 0.85 * fs, FALSE, 2, none);
      if (u->n_parallel > 1)
        h += text_box (c, 0, 0, inner, "× 2", 0.85 * fs, FALSE, 1, none);
      h += 0.4 * fs;
      for (guint j = 0; j < lines->len; j++)
        h += text_box (c, 0, 0, inner, g_ptr_array_index (lines, j), fs, FALSE, 2, none);
      bh = MAX (bh, h + 0.6 * fs);
    }
  bh = MIN (bh, ybot - ytop);
  g_strlcpy (c->case_label, case_label, sizeof c->case_label);
  by = (ytop + ybot) / 2 - bh / 2;

  for (guint i = 0; i < nu; i++)
    {
      const BwProcessUnit *u = g_ptr_array_index (tr->units, i);
      g_autoptr (GPtrArray) lines = block_lines (c, r, u, k);
      const double bx = x0 + i * (bw + gap), tx = bx + 0.6 * fs;
      double y = by + 0.6 * fs;

      cairo_rectangle (c->cr, bx, by, bw, bh);
      set_rgb (c, i == highlight ? st->water : st->paper);
      cairo_fill_preserve (c->cr);
      set_rgb (c, st->ink);
      set_line (c, i == highlight ? 2.2 * st->line_outline : st->line_outline);
      cairo_stroke (c->cr);
      y += text_box (c, tx, y, inner, u->name && *u->name ? u->name : u->id, fs, TRUE, 2, st->ink);
      y += text_box (c, tx, y, inner, bw_label_process_type (u->type), 0.85 * fs, FALSE, 2,
                     st->ink_muted);
      if (u->n_parallel > 1)
        {
          g_autofree char *par = u->n_standby > 0
                                     ? g_strdup_printf (_("× %u (%u standby)"), u->n_parallel,
                                                        u->n_standby)
                                     : g_strdup_printf ("× %u", u->n_parallel);
          y += text_box (c, tx, y, inner, par, 0.85 * fs, FALSE, 1, st->ink_muted);
        }
      set_rgb (c, st->ink_muted);
      set_line (c, 0.6 * st->line_dimension);
      cairo_move_to (c->cr, bx + 0.3 * fs, y + 0.2 * fs);
      cairo_line_to (c->cr, bx + bw - 0.3 * fs, y + 0.2 * fs);
      cairo_stroke (c->cr);
      y += 0.4 * fs;
      for (guint j = 0; j < lines->len && y + fs < by + bh; j++)
        y += text_box (c, tx, y, inner, g_ptr_array_index (lines, j), fs, FALSE, 2, st->ink);
      if (i == 0)
        flow_arrow (c, bx - lead + 0.3 * fs, by + bh / 2, bx - 0.15 * fs, by + bh / 2);
      if (i + 1 < nu)
        flow_arrow (c, bx + bw + 0.3 * fs, by + bh / 2, bx + bw + gap - 0.15 * fs, by + bh / 2);
      else
        flow_arrow (c, bx + bw + 0.15 * fs, by + bh / 2, bx + bw + lead - 0.3 * fs, by + bh / 2);
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
  if (view == BW_SKETCH_SCHEMATIC)
    return _("schematic");
  if (n->type == BW_PROCESS_CIRCULAR_CLARIFIER)
    return view == BW_SKETCH_PLAN ? _("plan") : _("section on a diameter");
  if (n->type == BW_PROCESS_PLATE_SETTLER)
    return view == BW_SKETCH_PLAN ? _("plan")
           : n->shape == 0        ? _("section across the plates")
                                  : _("section across the tubes");
  if (n->type == BW_PROCESS_RECTANGULAR_BASIN || n->floc != NULL)
    return view == BW_SKETCH_PLAN ? _("plan") : _("longitudinal section");
  return view == BW_SKETCH_PLAN ? _("plan") : _("section on the shaft");
}

static void
sheet (Ctx *c, const BwProject *p, const BwProcessUnit *u, const Unit *n, BwSketchView view)
{
  const BwStyle *st = c->st;
  const Type *ty = &c->ty;
  g_autofree char *title = NULL;
  g_autofree char *units = NULL;
  g_autofree char *sub = NULL;
  g_autofree char *right = NULL;
  g_autofree char *drafting = NULL;
  Box b;

  if (u->n_parallel > 1 && u->n_standby > 0)
    units = g_strdup_printf (_(", one of %u alike (%u standby)"), u->n_parallel, u->n_standby);
  else if (u->n_parallel > 1)
    units = g_strdup_printf (_(", one of %u alike"), u->n_parallel);
  if (view == BW_SKETCH_SCHEMATIC)
    {
      title = g_strdup_printf ("%s — %s", n->train->name && *n->train->name ? n->train->name
                                                                           : n->train->id,
                               view_title (n, view));
      sub = g_strdup_printf (ngettext ("train %s · %u unit · results at %s",
                                       "train %s · %u units · results at %s", n->train->units->len),
                             n->train->id, n->train->units->len,
                             c->case_label);
    }
  else
    {
      title = g_strdup_printf ("%s — %s", u->name && *u->name ? u->name : u->id,
                               view_title (n, view));
      g_autofree char *wt = n->floc != NULL ? fmt_len (c, n->width) : NULL;
      if (bw_process_type_is_stage (u->type))
        /* TRANSLATORS: "east-floc-2 · paddle stage 2 of East flocculator, 4.2 m wide" */
        sub = g_strdup_printf (_("%s · %s %u of %s, %s wide"), u->id, bw_label_process_type (u->type),
                               n->first + 1, n->floc->name && *n->floc->name ? n->floc->name
                                                                            : n->floc->id,
                               wt);
      else
        sub = g_strdup_printf ("%s · %s%s", u->id, bw_label_process_type (u->type),
                               units ? units : "");
    }
  right = g_strdup_printf ("%s%s%s", p->name ? p->name : "", p->revision ? _(" · rev. ") : "",
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

  if (view != BW_SKETCH_SCHEMATIC)
    scale_bar (c);

  if (view == BW_SKETCH_SCHEMATIC)
    drafting = g_strdup (_("Not to scale; the figures are the engine's results for the case above."));
  else if (n->floc != NULL)
    drafting = g_strdup (_("To scale from the design inputs; walls, partitions, baffle ends, shaft "
                           "and impeller elevations are drawn by convention."));
  else if (n->type == BW_PROCESS_CIRCULAR_CLARIFIER)
    drafting = g_strdup (n->feed_well_given
                             ? _("To scale from the design inputs; walls, floor slope, feed well "
                                 "depth and launder size are drawn by convention.")
                             : _("To scale from the design inputs; walls, floor slope, feed well "
                                 "size and launder size are drawn by convention."));
  else if (n->type == BW_PROCESS_PLATE_SETTLER && view == BW_SKETCH_PLAN)
    drafting = g_strdup (_("To scale from the design inputs; walls, inlet zone, bank layout and "
                           "trough are drawn by convention."));
  else if (n->type == BW_PROCESS_PLATE_SETTLER)
    drafting = g_strdup (_("To scale from the design inputs, a representative run of channels; the "
                           "tank around them is drawn by convention."));
  else
    drafting = g_strdup (n->type == BW_PROCESS_RECTANGULAR_BASIN
                             ? _("To scale from the design inputs; walls, freeboard and launder "
                                 "layout are drawn by convention.")
                             : _("To scale from the design inputs; walls, freeboard, drive and "
                                 "impeller elevation are drawn by convention."));
  {
    const double x = c->g.bar_x + c->g.bar_width + 0.5 * text_width (c, c->g.bar_label, ty->small)
                     + 2.0 * ty->small;
    const double avail = c->w - ty->pad - x;
    const char *line2 = _("Preliminary: verify with a licensed professional engineer.");
    if (text_width (c, drafting, ty->small) <= avail && text_width (c, line2, ty->small) <= avail)
      {
        text (c, c->w - ty->pad, c->h - ty->pad - 2.3 * ty->small, drafting, ty->small, FALSE, 1.0,
              0.0, st->ink_muted);
        text (c, c->w - ty->pad, c->h - ty->pad - 1.05 * ty->small, line2, ty->small, FALSE, 1.0,
              0.0, st->ink_muted);
      }
    else
      text (c, c->w - ty->pad, c->h - ty->pad - 1.6 * ty->small, _("Preliminary; drawn by convention "
              "where the inputs are silent."), 0.85 * ty->small, FALSE, 1.0, 0.0, st->ink_muted);
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
  BwResults *results = NULL;

  g_return_val_if_fail (p != NULL && u != NULL && style != NULL && cr != NULL, FALSE);
  if (cairo_status (cr) != CAIRO_STATUS_SUCCESS)
    {
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_CAIRO, _ ("cairo: %s"),
                   cairo_status_to_string (cairo_status (cr)));
      return FALSE;
    }
  if (!check_size (width, height, error) || !read_unit (p, u, view, &n, error))
    return FALSE;
  if (view == BW_SKETCH_SCHEMATIC)
    {
      results = bw_project_evaluate (p, error);
      if (results == NULL)
        {
          g_prefix_error (error, _ ("schematic: "));
          return FALSE;
        }
    }

  c.cr = cr;
  c.st = style;
  c.units = units;
  c.w = width;
  c.h = height;
  type_for (style, width, height, &c.ty);
  if (view == BW_SKETCH_SCHEMATIC)
    layout_schematic (&c.ty, width, height, &c.g);
  else
    {
      frame_of (&n, view, &f);
      layout_frame (&f, &c.ty, units, width, height, &c.g);
    }
  c.lw = c.ty.body / style->font_size;

  cairo_save (cr);
  cairo_set_line_join (cr, CAIRO_LINE_JOIN_MITER);
  cairo_set_line_cap (cr, CAIRO_LINE_CAP_BUTT);
  cairo_set_fill_rule (cr, CAIRO_FILL_RULE_WINDING);
  cairo_rectangle (cr, 0, 0, width, height);
  set_rgb (&c, style->paper);
  cairo_fill (cr);

  if (view == BW_SKETCH_SCHEMATIC)
    schematic (&c, &n, u, results);
  else if (n.floc != NULL)
    (view == BW_SKETCH_PLAN ? floc_plan : floc_section) (&c, &n);
  else if (n.type == BW_PROCESS_CIRCULAR_CLARIFIER)
    (view == BW_SKETCH_PLAN ? clarifier_plan : clarifier_section) (&c, &n);
  else if (n.type == BW_PROCESS_PLATE_SETTLER)
    (view == BW_SKETCH_PLAN ? settler_plan : settler_section) (&c, &n);
  else if (n.type == BW_PROCESS_RECTANGULAR_BASIN)
    (view == BW_SKETCH_PLAN ? basin_plan : basin_section) (&c, &n);
  else
    (view == BW_SKETCH_PLAN ? rapid_mix_plan : rapid_mix_section) (&c, &n);
  sheet (&c, p, u, &n, view);
  cairo_restore (cr);
  g_clear_pointer (&results, bw_results_free);

  status = cairo_status (cr);
  if (status != CAIRO_STATUS_SUCCESS)
    {
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_CAIRO, _ ("cairo: %s"),
                   cairo_status_to_string (status));
      return FALSE;
    }
  return TRUE;
}
