/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-charts.c: the project's charts from the engine's results. Values are converted from SI to
 * the reader's units here, at the edge; every curve point comes from an engine function and
 * every design point from BwResults. Nothing is re-derived. */
#include "config.h"

#include "draw/bw-charts.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "draw/bw-labels.h"
#include "engine/bw-axis.h"
#include "engine/bw-error.h"
#include "engine/bw-mixing.h"
#include "engine/bw-removal.h"
#include "engine/bw-settling.h"
#include "engine/bw-water.h"

/* Colour roles, as indices into the style's series palette. The first four of each preset are
 * the strongest against the paper; 4 and 5 suit fills. */
#define C_COLD 0
#define C_WARM 2
#define C_THIRD 1
#define C_FOURTH 3
#define C_FILL_A 3
#define C_FILL_B 4

/* --- helpers --- */

static const BwUnit *
unit_of (BwQuantityKind kind, BwUnitSystem system)
{
  return bw_units_display_unit (kind, system);
}

static const BwUnit *
unit_named (const char *ascii, BwQuantityKind kind)
{
  const BwUnit *u = bw_unit_lookup (ascii, kind, "unit", NULL);
  return u ? u : bw_units_si_unit (kind);
}

static double
to_display (const BwUnit *u, double si)
{
  return bw_unit_from_si (u, si);
}

static char *
fmt (double si, BwQuantityKind kind, BwUnitSystem system)
{
  return bw_units_format (si, kind, system);
}

/* "2 °C": temperatures read in whole degrees on charts. */
static char *
fmt_temp (double K, BwUnitSystem system)
{
  const BwUnit *u = unit_of (BW_KIND_TEMPERATURE, system);
  return g_strdup_printf ("%.0f %s", to_display (u, K), u->symbol);
}

static const BwElementResult *
find_element (const BwResults *r, const char *id, int *index, GError **error)
{
  for (guint i = 0; i < r->elements->len; i++)
    {
      const BwElementResult *e = g_ptr_array_index (r->elements, i);
      if (g_strcmp0 (e->id, id) == 0)
        {
          if (index)
            *index = (int) i;
          return e;
        }
    }
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
               _ ("unit: no unit or stage with id '%s' in the results"), id ? id : "(none)");
  return NULL;
}

static int
find_case (const BwResults *r, BwFlowKind flow, BwTempKind temp, BwServiceState service)
{
  for (guint c = 0; c < r->n_cases; c++)
    if (r->cases[c].flow == flow && r->cases[c].temp == temp && r->cases[c].service == service)
      return (int) c;
  return -1;
}

int
bw_charts_design_case (const BwResults *r, BwTempKind temp)
{
  int best = -1;

  g_return_val_if_fail (r != NULL, -1);
  best = find_case (r, BW_FLOW_MAXIMUM_DAY, temp, BW_SERVICE_ALL_IN_SERVICE);
  if (best >= 0)
    return best;
  for (guint c = 0; c < r->n_cases; c++)
    if (r->cases[c].temp == temp && r->cases[c].service == BW_SERVICE_ALL_IN_SERVICE
        && (best < 0 || r->cases[c].flow > r->cases[best].flow))
      best = (int) c;
  return best;
}

static gboolean
value_at (const BwElementResult *e, int c, BwQuantity q, double *out)
{
  if (c < 0 || !bw_quantity_set_has (&e->values[c], q))
    return FALSE;
  *out = e->values[c].values[q];
  return TRUE;
}

static gboolean
need_cases (const BwResults *r, int cold, int warm, GError **error)
{
  if (cold < 0 || warm < 0)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   _ ("load cases: the chart needs the design flow at the coldest and warmest "
                   "temperature with all units in service (%u cases evaluated)"), r->n_cases);
      return FALSE;
    }
  return TRUE;
}

/* Reference lines for the limits of criteria on quantity Q applying to element E (index EI). */
static void
add_limit_rules (BwChart *ch, GArray *checks, int ei, BwQuantity q, const BwUnit *u,
                 gboolean y2, BwUnitSystem system)
{
  double done[8];
  guint n_done = 0;

  if (checks == NULL)
    return;
  for (guint i = 0; i < checks->len; i++)
    {
      const BwCheck *k = &g_array_index (checks, BwCheck, i);
      const BwCriterion *cr = k->criterion;
      const BwLimits *lims[] = { &cr->required, &cr->preferred };
      if (k->element != ei || cr->quantity != q)
        continue;
      for (guint l = 0; l < 2; l++)
        for (int side = 0; side < 2; side++)
          {
            gboolean has = side == 0 ? lims[l]->has_min : lims[l]->has_max;
            double v = side == 0 ? lims[l]->min : lims[l]->max;
            gboolean dup = FALSE;
            if (!has)
              continue;
            for (guint d = 0; d < n_done; d++)
              dup = dup || fabs (done[d] - v) <= 1e-12 * fabs (v);
            if (dup || n_done == G_N_ELEMENTS (done))
              continue;
            done[n_done++] = v;
            {
              g_autofree char *val = fmt (v, bw_quantity_info (q)->kind, system);
              g_autofree char *label = g_strdup_printf ("%s %s %s%s", side == 0 ? _("min") : _("max"),
                                                        side == 0 ? "≥" : "≤", val,
                                                        l == 1 ? _(" (preferred)") : "");
              BwChartRule *rule = bw_chart_add_rule (ch, FALSE, to_display (u, v), label,
                                                     BW_CHART_MUTED,
                                                     l == 0 ? BW_DASH_DASHED : BW_DASH_DOTTED);
              rule->y2 = y2;
              rule->label_start = side == 0;
            }
          }
    }
}

static char *
case_flow_label (const BwResults *r, int c)
{
  return g_strdup (bw_label_flow_kind (r->cases[c].flow));
}

/* --- (a) flocculator taper --- */

static const char *
stage_kind (BwProcessType t)
{
  switch (t)
    {
    case BW_STAGE_PADDLE: return _("paddle");
    case BW_STAGE_TURBINE: return _("turbine");
    case BW_STAGE_BAFFLED: return _("baffled");
    default: return _("stage");
    }
}

BwChart *
bw_chart_floc_taper (const BwProject *p, const BwResults *r, GArray *checks, const char *floc_id,
                     BwUnitSystem system, GError **error)
{
  const BwElementResult *floc;
  const int cold = r ? bw_charts_design_case (r, BW_TEMP_COLDEST) : -1;
  const int warm = r ? bw_charts_design_case (r, BW_TEMP_WARMEST) : -1;
  const BwUnit *ug = unit_of (BW_KIND_RATE, system);
  g_autoptr (BwChart) ch = NULL;
  BwChartSeries *g_cold, *g_warm, *gt_cold, *gt_warm;
  guint n = 0;
  int first_stage = -1;

  g_return_val_if_fail (p != NULL && r != NULL, NULL);
  if (!(floc = find_element (r, floc_id, NULL, error)))
    return NULL;
  if (floc->type != BW_ELEMENT_FLOCCULATOR)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   _ ("unit: '%s' is not a flocculator"), floc_id);
      return NULL;
    }
  if (!need_cases (r, cold, warm, error))
    return NULL;

  ch = bw_chart_new (BW_CHART_XY, NULL);
  ch->title = g_strdup_printf (_("%s: mixing intensity by stage"), floc->unit->name);
  {
    g_autofree char *flow = case_flow_label (r, cold);
    g_autofree char *tc = fmt_temp (p->basis.temperature_K[BW_TEMP_COLDEST], system);
    g_autofree char *tw = fmt_temp (p->basis.temperature_K[BW_TEMP_WARMEST], system);
    ch->subtitle = g_strdup_printf (_("At %s flow, all units in service; water at %s and %s"), flow,
                                    tc, tw);
  }
  bw_chart_axis_set (&ch->x, BW_AXIS_LINEAR, _("Stage (in flow order)"), NULL);
  bw_chart_axis_set (&ch->y, BW_AXIS_LINEAR, _("Velocity gradient G"), ug->symbol);
  ch->y.include_zero = TRUE;
  bw_chart_axis_set (&ch->y2, BW_AXIS_LINEAR, _("Gt of the stage"), NULL);
  ch->y2.include_zero = TRUE;
  ch->has_y2 = TRUE;
  {
    g_autofree char *tc = fmt_temp (p->basis.temperature_K[BW_TEMP_COLDEST], system);
    g_autofree char *tw = fmt_temp (p->basis.temperature_K[BW_TEMP_WARMEST], system);
    g_autofree char *l1 = g_strdup_printf (_("G at %s"), tc);
    g_autofree char *l2 = g_strdup_printf (_("G at %s"), tw);
    g_autofree char *l3 = g_strdup_printf (_("Gt at %s (right axis)"), tc);
    g_autofree char *l4 = g_strdup_printf (_("Gt at %s (right axis)"), tw);
    gt_cold = bw_chart_add_series (ch, l3, BW_SERIES_BARS, C_FILL_A, BW_MARKER_NONE,
                                   BW_DASH_SOLID, FALSE);
    gt_warm = bw_chart_add_series (ch, l4, BW_SERIES_BARS, C_FILL_B, BW_MARKER_NONE,
                                   BW_DASH_SOLID, FALSE);
    gt_cold->y2 = gt_warm->y2 = TRUE;
    g_cold = bw_chart_add_series (ch, l1, BW_SERIES_LINE, C_COLD, BW_MARKER_CIRCLE,
                                  BW_DASH_SOLID, TRUE);
    g_warm = bw_chart_add_series (ch, l2, BW_SERIES_LINE, C_WARM, BW_MARKER_SQUARE,
                                  BW_DASH_DASHED, TRUE);
  }
  for (guint i = 0; i < r->elements->len; i++)
    {
      const BwElementResult *e = g_ptr_array_index (r->elements, i);
      double gc, gw, tc, tw;
      if (e->unit != floc->unit || e->stage == NULL)
        continue;
      if (first_stage < 0)
        first_stage = (int) i;
      {
        g_autofree char *cat = g_strdup_printf ("%s\n%s", e->stage->name ? e->stage->name
                                                                         : e->stage->id,
                                                stage_kind (e->stage->type));
        bw_chart_axis_add_category (&ch->x, cat);
      }
      if (value_at (e, cold, BW_Q_G, &gc) && value_at (e, warm, BW_Q_G, &gw))
        {
          bw_chart_series_add (g_cold, n, to_display (ug, gc));
          bw_chart_series_add (g_warm, n, to_display (ug, gw));
        }
      if (value_at (e, cold, BW_Q_GT, &tc) && value_at (e, warm, BW_Q_GT, &tw))
        {
          bw_chart_series_add (gt_cold, n, tc);
          bw_chart_series_add (gt_warm, n, tw);
        }
      n++;
    }
  if (n == 0)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   _ ("unit: flocculator '%s' has no stages"), floc_id);
      return NULL;
    }
  if (first_stage >= 0)
    add_limit_rules (ch, checks, first_stage, BW_Q_G, ug, FALSE, system);
  {
    double gt_total;
    if (value_at (floc, cold, BW_Q_GT, &gt_total))
      {
        g_autofree char *t = fmt (gt_total, BW_KIND_NUMBER, system);
        g_autofree char *tc = fmt_temp (p->basis.temperature_K[BW_TEMP_COLDEST], system);
        ch->footnote = g_strdup_printf (_("Gt of the whole flocculator at %s: %s. Preliminary: "
                                          "verify with a licensed engineer."), tc, t);
      }
  }
  return g_steal_pointer (&ch);
}

/* --- (b) settling velocity curves --- */

#define SETTLING_POINTS 90
#define SETTLING_D_MIN 1e-6
#define SETTLING_D_MAX 5e-3

static gboolean
is_basin (const BwElementResult *e)
{
  return e->type == BW_ELEMENT_RECTANGULAR_BASIN || e->type == BW_ELEMENT_CIRCULAR_CLARIFIER;
}

static gboolean
overflow_range (const BwResults *r, const BwElementResult *e, double *lo, double *hi, int *c_hi)
{
  gboolean any = FALSE;
  for (guint c = 0; c < r->n_cases; c++)
    {
      double v;
      if (!value_at (e, (int) c, BW_Q_OVERFLOW_RATE, &v))
        continue;
      if (!any || v < *lo)
        *lo = v;
      if (!any || v > *hi)
        {
          *hi = v;
          *c_hi = (int) c;
        }
      any = TRUE;
    }
  return any;
}

BwChart *
bw_chart_settling_curves (const BwProject *p, const BwResults *r, const char *basin_id,
                          double specific_gravity, BwUnitSystem system, GError **error)
{
  const BwElementResult *e;
  const BwUnit *ud = unit_named (system == BW_UNIT_SYSTEM_US ? "in" : "mm", BW_KIND_LENGTH);
  const BwUnit *uv = unit_of (BW_KIND_SURFACE_LOADING, system);
  g_autoptr (BwChart) ch = NULL;
  const BwTempKind temps[] = { BW_TEMP_COLDEST, BW_TEMP_WARMEST };
  BwSettlingRegime regime[SETTLING_POINTS];
  double diam[SETTLING_POINTS];
  double ov_lo = 0, ov_hi = 0;
  int c_hi = -1;

  g_return_val_if_fail (p != NULL && r != NULL, NULL);
  if (!(e = find_element (r, basin_id, NULL, error)))
    return NULL;
  if (!is_basin (e) || !overflow_range (r, e, &ov_lo, &ov_hi, &c_hi))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   _ ("unit: '%s' is not a settling basin with an overflow rate"), basin_id);
      return NULL;
    }
  if (specific_gravity <= 0)
    specific_gravity = bw_param_index (e->unit->type, "particle-sg") >= 0
                         ? bw_process_unit_get (e->unit, "particle-sg")
                         : 2.65;

  ch = bw_chart_new (BW_CHART_XY, NULL);
  ch->title = g_strdup_printf (_("%s: settling velocity of discrete particles"), e->unit->name);
  ch->subtitle = g_strdup_printf (_("Spheres of specific gravity %.3g; drag after Clift and Gauvin; "
                                    "regimes shown for the coldest water"), specific_gravity);
  bw_chart_axis_set (&ch->x, BW_AXIS_LOG, _("Particle diameter"), ud->symbol);
  bw_chart_axis_set (&ch->y, BW_AXIS_LOG, _("Settling velocity"), uv->symbol);

  for (guint t = 0; t < G_N_ELEMENTS (temps); t++)
    {
      const double T = p->basis.temperature_K[temps[t]];
      g_autofree char *tl = fmt_temp (T, system);
      g_autofree char *label = g_strdup_printf (_("Water at %s"), tl);
      BwChartSeries *s = bw_chart_add_series (ch, label, BW_SERIES_LINE, t == 0 ? C_COLD : C_WARM,
                                              BW_MARKER_NONE,
                                              t == 0 ? BW_DASH_SOLID : BW_DASH_DASHED, TRUE);
      for (guint i = 0; i < SETTLING_POINTS; i++)
        {
          BwSettlingResult res;
          double d = SETTLING_D_MIN * pow (SETTLING_D_MAX / SETTLING_D_MIN,
                                           (double) i / (SETTLING_POINTS - 1));
          if (!bw_settling_velocity (d, specific_gravity, T, BW_DRAG_CLIFT_GAUVIN, &res, error))
            {
              g_prefix_error (error, _ ("settling curve: "));
              return NULL;
            }
          bw_chart_series_add (s, to_display (ud, d), to_display (uv, res.velocity_m_s));
          if (t == 0)
            {
              diam[i] = d;
              regime[i] = res.regime;
            }
        }
    }

  /* Regime bands: each runs between the geometric midpoints of the grid points where the
   * engine's regime changes. */
  {
    const char *names[] = { _("Stokes (Re < 1)"), _("transitional"), _("Newton (Re ≥ 1000)") };
    const guint colours[] = { C_FILL_A, C_FILL_B, C_THIRD };
    guint start = 0;
    for (guint i = 1; i <= SETTLING_POINTS; i++)
      if (i == SETTLING_POINTS || regime[i] != regime[start])
        {
          double from = start == 0 ? diam[0] : sqrt (diam[start - 1] * diam[start]);
          double to = i == SETTLING_POINTS ? diam[i - 1] : sqrt (diam[i - 1] * diam[i]);
          bw_chart_add_band (ch, TRUE, to_display (ud, from), to_display (ud, to),
                             names[regime[start]], colours[regime[start]]);
          start = i;
        }
  }

  {
    g_autofree char *hi = fmt (ov_hi, BW_KIND_SURFACE_LOADING, system);
    g_autofree char *flow = case_flow_label (r, c_hi);
    g_autofree char *label = g_strdup_printf (_("overflow rate at %s: %s"), flow, hi);
    bw_chart_add_rule (ch, FALSE, to_display (uv, ov_hi), label, BW_CHART_INK, BW_DASH_SOLID);
    if (ov_hi > ov_lo * 1.0001)
      bw_chart_add_band (ch, FALSE, to_display (uv, ov_lo), to_display (uv, ov_hi), NULL,
                         BW_CHART_MUTED);
  }
  {
    double vs = bw_param_index (e->unit->type, "design-settling-velocity") >= 0
                  ? bw_process_unit_get (e->unit, "design-settling-velocity")
                  : 0;
    if (vs > 0)
      {
        g_autofree char *v = fmt (vs, BW_KIND_SURFACE_LOADING, system);
        g_autofree char *label = g_strdup_printf (_("design settling velocity %s"), v);
        BwChartRule *rule = bw_chart_add_rule (ch, FALSE, to_display (uv, vs), label,
                                               BW_CHART_MUTED, BW_DASH_DASHED);
        rule->label_start = TRUE;
        rule->label_below = vs < ov_hi; /* apart from the overflow rate's label above its line */
      }
  }
  ch->footnote = g_strdup (_("Shaded across: the basin's overflow rates over all load cases. "
                             "Particles above a line settle faster than it."));
  return g_steal_pointer (&ch);
}

/* --- (c) removal against overflow rate --- */

#define REMOVAL_POINTS 120

BwChart *
bw_chart_removal_curves (const BwProject *p, const BwResults *r, const char *basin_id,
                         BwUnitSystem system, GError **error)
{
  const BwElementResult *e;
  const BwUnit *uv = unit_of (BW_KIND_SURFACE_LOADING, system);
  g_autoptr (BwChart) ch = NULL;
  const double hazen_n[] = { 1, 3, 5 };
  const char *hazen_word[] = { _("very poor"), _("good"), _("very good") };
  const BwDash hazen_dash[] = { BW_DASH_DOTTED, BW_DASH_DASHED, BW_DASH_DASHED };
  const guint hazen_colour[] = { C_WARM, C_THIRD, C_FOURTH };
  double vs, ov_lo = 0, ov_hi = 0, x_max;
  int c_hi = -1;
  BwChartSeries *s, *pts;

  g_return_val_if_fail (p != NULL && r != NULL, NULL);
  if (!(e = find_element (r, basin_id, NULL, error)))
    return NULL;
  if (!is_basin (e) || !overflow_range (r, e, &ov_lo, &ov_hi, &c_hi))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   _ ("unit: '%s' is not a settling basin with an overflow rate"), basin_id);
      return NULL;
    }
  vs = bw_process_unit_get (e->unit, "design-settling-velocity");
  if (!(vs > 0))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   _ ("design settling velocity: '%s' has none, so no removal to chart"), basin_id);
      return NULL;
    }
  x_max = MAX (2.0 * vs, 1.25 * ov_hi);

  ch = bw_chart_new (BW_CHART_XY, NULL);
  ch->title = g_strdup_printf (_("%s: removal against overflow rate"), e->unit->name);
  {
    g_autofree char *v = fmt (vs, BW_KIND_SURFACE_LOADING, system);
    ch->subtitle = g_strdup_printf (_("Design particle settling at %s; ideal (Camp) basin and "
                                      "Hazen basins of performance n"), v);
  }
  bw_chart_axis_set (&ch->x, BW_AXIS_LINEAR, _("Surface overflow rate"), uv->symbol);
  ch->x.fixed = TRUE;
  ch->x.min = 0;
  ch->x.max = to_display (uv, x_max);
  bw_chart_axis_set (&ch->y, BW_AXIS_LINEAR, _("Fraction removed"), "%");
  ch->y.fixed = TRUE;
  ch->y.min = 0;
  ch->y.max = 105; /* headroom, so the ideal basin's 100 % does not sit on the frame */

  s = bw_chart_add_series (ch, _("Ideal basin (Camp)"), BW_SERIES_LINE, C_COLD, BW_MARKER_NONE,
                           BW_DASH_SOLID, TRUE);
  for (guint i = 1; i <= REMOVAL_POINTS; i++)
    {
      double v0 = x_max * i / REMOVAL_POINTS, f;
      if (!bw_removal_ideal (vs, v0, &f, error))
        return NULL;
      bw_chart_series_add (s, to_display (uv, v0), 100 * f);
    }
  for (guint k = 0; k < G_N_ELEMENTS (hazen_n); k++)
    {
      g_autofree char *label = g_strdup_printf (_("Hazen n = %g (%s)"), hazen_n[k], hazen_word[k]);
      s = bw_chart_add_series (ch, label, BW_SERIES_LINE, hazen_colour[k], BW_MARKER_NONE,
                               hazen_dash[k], TRUE);
      for (guint i = 1; i <= REMOVAL_POINTS; i++)
        {
          double v0 = x_max * i / REMOVAL_POINTS, f;
          if (!bw_removal_hazen (vs, v0, hazen_n[k], &f, error))
            return NULL;
          bw_chart_series_add (s, to_display (uv, v0), 100 * f);
        }
    }

  /* The load cases: one point per flow (the overflow rate does not depend on temperature),
   * all units in service, with the engine's removal. */
  pts = bw_chart_add_series (ch, _("Load cases (engine results)"), BW_SERIES_LINE, BW_CHART_INK,
                             BW_MARKER_DIAMOND, BW_DASH_SOLID, FALSE);
  for (int f = 0; f < BW_N_FLOW_KINDS; f++)
    {
      int c = find_case (r, (BwFlowKind) f, BW_TEMP_COLDEST, BW_SERVICE_ALL_IN_SERVICE);
      double ov, rem;
      if (c < 0 || !value_at (e, c, BW_Q_OVERFLOW_RATE, &ov) || !value_at (e, c, BW_Q_REMOVAL, &rem))
        continue;
      bw_chart_series_add (pts, to_display (uv, ov), 100 * rem);
      bw_chart_add_note (ch, to_display (uv, ov), 100 * rem, bw_label_flow_kind ((BwFlowKind) f))
        ->ring = FALSE;
    }
  {
    g_autofree char *v = fmt (vs, BW_KIND_SURFACE_LOADING, system);
    g_autofree char *label = g_strdup_printf (_("overflow rate = settling velocity (%s)"), v);
    BwChartRule *rule = bw_chart_add_rule (ch, TRUE, to_display (uv, vs), label, BW_CHART_MUTED,
                                           BW_DASH_DOTTED);
    rule->label_start = TRUE;
  }
  ch->footnote = g_strdup (_("Camp: min(1, vs/v0). Hazen: 1 − (1 + vs/(n v0))^−n. "
                             "Preliminary: verify with a licensed engineer."));
  return g_steal_pointer (&ch);
}

/* --- (f) iso-removal diagram --- */

/* The column time (s) at which port J first reaches removal LEVEL (0-1): linear between readings
 * and from R = 0 at t = 0, as the engine's Type II profile interpolates (bw-removal.c); FALSE
 * when the port never reaches it during the test. */
static gboolean
iso_time (const BwSettlingColumn *c, guint j, double level, double *out)
{
  double t0 = 0.0, r0 = 0.0;

  for (guint k = 0; k < c->n_times; k++)
    {
      const double r1 = c->removal[j][k], t1 = c->time_s[k];
      if (r1 >= level)
        {
          /* r0 < level <= r1, so r1 - r0 > 0. */
          *out = t0 + (level - r0) / (r1 - r0) * (t1 - t0);
          return TRUE;
        }
      t0 = t1;
      r0 = r1;
    }
  return FALSE;
}

BwChart *
bw_chart_iso_removal (const BwProject *p, const BwResults *r, const char *basin_id,
                      BwUnitSystem system, GError **error)
{
  const BwElementResult *e;
  const BwColumnTestRecord *rec;
  const BwUnit *ut = unit_named ("min", BW_KIND_TIME);
  const BwUnit *ud = unit_of (BW_KIND_LENGTH, system);
  const int dc = r ? bw_charts_design_case (r, BW_TEMP_COLDEST) : -1;
  g_autoptr (BwChart) ch = NULL;
  g_autoptr (GError) local = NULL;
  BwSettlingColumn col;
  BwType2Options opts;
  BwType2Result res;
  double v0 = 0, depth_basin = 0, deepest, d_step, d_bottom, t_raw, t_step, t_max, t_end;
  int d_exp, t_exp, decimals;
  guint n_cat, curves = 0;
  BwChartSeries *s;

  g_return_val_if_fail (p != NULL && r != NULL, NULL);
  if (!(e = find_element (r, basin_id, NULL, error)))
    return NULL;
  if (!is_basin (e) || !value_at (e, dc, BW_Q_OVERFLOW_RATE, &v0) || !(v0 > 0))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   _ ("unit: '%s' is not a settling basin with an overflow rate in the design case"),
                   basin_id);
      return NULL;
    }
  rec = bw_project_column_test_for (p, basin_id);
  if (rec == NULL)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   _ ("column test: no settling-column test applies to '%s', so no iso-removal "
                   "chart (add one that names it in applies-to)"), basin_id);
      return NULL;
    }
  if (!bw_column_test_record_column (rec, &col, error))
    return NULL;
  deepest = col.depth_m[col.n_depths - 1];
  if (!value_at (e, dc, BW_Q_SIDE_WATER_DEPTH, &depth_basin))
    depth_basin = bw_process_unit_get (e->unit, "side-water-depth");
  bw_type2_options_init (&opts);
  opts.depth_m = MIN (depth_basin, deepest);
  if (!bw_type2_removal_at_overflow (&col, &opts, v0, &res, &local))
    {
      g_autofree char *v = fmt (v0, BW_KIND_SURFACE_LOADING, system);
      g_set_error (error, BW_ENGINE_ERROR, local->code,
                   _ ("column test %s: at %s's overflow rate of %s: %s"), rec->id, basin_id, v,
                   local->message);
      return NULL;
    }

  /* Depth axis: categories from the bottom (i = 0) up to the surface, on a 1-2-5 step. */
  d_step = bw_axis_nice_step (to_display (ud, deepest) / 6.0, &d_exp);
  n_cat = (guint) ceil (to_display (ud, deepest) / d_step - 1e-9) + 1;
  d_bottom = (n_cat - 1) * d_step; /* display units */
  decimals = MAX (0, -d_exp);
  t_raw = 1.05 * to_display (ut, MAX (col.time_s[col.n_times - 1], res.detention_s));
  t_step = bw_axis_nice_step (t_raw / 6.0, &t_exp);
  t_max = ceil (t_raw / t_step) * t_step;
#define ISO_Y(depth_m) ((double) (n_cat - 1) - to_display (ud, (depth_m)) / d_step)

  ch = bw_chart_new (BW_CHART_XY, NULL);
  ch->title = g_strdup_printf (_("%s: iso-removal curves (Type II settling)"), e->unit->name);
  {
    g_autofree char *h = fmt (res.depth_m, BW_KIND_LENGTH, system);
    g_autofree char *hb = fmt (depth_basin, BW_KIND_LENGTH, system);
    g_autofree char *name = g_strdup (rec->name ? rec->name : rec->id);
    if (depth_basin > deepest)
      ch->subtitle = g_strdup_printf (_("Column test %s; the basin (%s deep) is evaluated at the "
                                        "deepest port, %s"), name, hb, h);
    else
      ch->subtitle = g_strdup_printf (_("Column test %s; evaluated at the basin's depth, %s"), name, h);
  }
  bw_chart_axis_set (&ch->x, BW_AXIS_LINEAR, _("Column time"), ut->symbol);
  ch->x.fixed = TRUE;
  ch->x.min = 0;
  ch->x.max = t_max;
  bw_chart_axis_set (&ch->y, BW_AXIS_LINEAR, _("Depth below the surface"), ud->symbol);
  for (guint i = 0; i < n_cat; i++)
    {
      g_autofree char *label = g_strdup_printf ("%.*f", decimals, d_bottom - i * d_step);
      bw_chart_axis_add_category (&ch->y, label);
    }

  /* One curve per 10 %: the times each port reaches it, surface down; a port that never does
   * breaks the curve. */
  for (int pct = 10; pct <= 90; pct += 10)
    {
      double last_t = 0, last_d = 0;
      guint reached = 0;
      for (guint j = 0; j < col.n_depths; j++)
        {
          double t;
          reached += iso_time (&col, j, pct / 100.0, &t);
        }
      if (reached < 2)
        continue;
      s = bw_chart_add_series (ch, curves == 0 ? _("Iso-removal curves (% removed)") : NULL,
                               BW_SERIES_LINE, C_COLD, BW_MARKER_NONE, BW_DASH_SOLID, TRUE);
      for (guint j = 0; j < col.n_depths; j++)
        {
          double t;
          if (iso_time (&col, j, pct / 100.0, &t))
            {
              bw_chart_series_add (s, to_display (ut, t), ISO_Y (col.depth_m[j]));
              last_t = t;
              last_d = col.depth_m[j];
            }
          else
            bw_chart_series_add (s, NAN, NAN);
        }
      {
        g_autofree char *label = g_strdup_printf ("%d %%", pct);
        bw_chart_add_note (ch, to_display (ut, last_t), ISO_Y (last_d), label)->ring = FALSE;
      }
      curves++;
    }

  s = bw_chart_add_series (ch, _("Column readings"), BW_SERIES_LINE, BW_CHART_MUTED,
                           BW_MARKER_CROSS, BW_DASH_SOLID, FALSE);
  for (guint j = 0; j < col.n_depths; j++)
    for (guint k = 0; k < col.n_times; k++)
      bw_chart_series_add (s, to_display (ut, col.time_s[k]), ISO_Y (col.depth_m[j]));

  /* The overflow-rate line: a particle settling at v0 reaches depth v0 t (m, with v0 in m/s and
   * t in s), down to the axis' bottom or its right end. */
  t_end = MIN (bw_unit_to_si (ut, t_max), bw_unit_to_si (ud, d_bottom) / v0);
  {
    g_autofree char *v = fmt (v0, BW_KIND_SURFACE_LOADING, system);
    g_autofree char *label = g_strdup_printf (_("Overflow rate %s (depth = v0 t)"), v);
    s = bw_chart_add_series (ch, label, BW_SERIES_LINE, C_WARM, BW_MARKER_NONE, BW_DASH_DASHED, TRUE);
    bw_chart_series_add (s, 0, ISO_Y (0.0));
    bw_chart_series_add (s, to_display (ut, t_end), ISO_Y (v0 * t_end));
  }
  {
    g_autofree char *h = fmt (res.depth_m, BW_KIND_LENGTH, system);
    g_autofree char *t = fmt (res.detention_s, BW_KIND_TIME, system);
    g_autofree char *label = g_strdup_printf (_("Design point: %s at %s, Type II removal %.0f %%"),
                                              h, t, 100.0 * res.removal_fraction);
    s = bw_chart_add_series (ch, label, BW_SERIES_LINE, C_WARM, BW_MARKER_DIAMOND, BW_DASH_SOLID,
                             FALSE);
    bw_chart_series_add (s, to_display (ut, res.detention_s), ISO_Y (res.depth_m));
  }
  {
    BwChartRule *rule = bw_chart_add_rule (ch, FALSE, ISO_Y (0.0), _("water surface"), BW_CHART_MUTED,
                                           BW_DASH_DOTTED);
    rule->label_start = TRUE;
  }
#undef ISO_Y
  ch->footnote = g_strdup (_("Removal = depth average of the port profile at the design time "
                             "(iso-removal method); no scale-up applied. Preliminary: verify with "
                             "a licensed engineer."));
  return g_steal_pointer (&ch);
}

/* --- (d) impeller power curve --- */

#define IMPELLER_POINTS 80

/* The impeller of a rapid-mix unit or turbine stage, as bw-evaluate.c reads it (choice 0-2 the
 * library kinds in order, 3 a custom power number). */
static gboolean
unit_impeller (const BwProcessUnit *u, BwImpeller *imp, gboolean *baffled, GError **error)
{
  const int choice = (int) bw_process_unit_get (u, "impeller");

  memset (imp, 0, sizeof *imp);
  imp->diameter_m = bw_process_unit_get (u, "impeller-diameter");
  imp->speed_rev_s = bw_process_unit_get (u, "speed");
  imp->power_number = bw_process_unit_get (u, "power-number");
  imp->kind = choice >= 0 && choice < BW_N_IMPELLER_KINDS ? (BwImpellerKind) choice
                                                          : BW_IMPELLER_RUSHTON;
  if (choice >= BW_N_IMPELLER_KINDS && !(imp->power_number > 0))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   _ ("power number: a custom impeller needs one"));
      return FALSE;
    }
  *baffled = bw_process_unit_get (u, "baffles") == 0;
  return TRUE;
}

static gboolean
choice_custom (const BwProcessUnit *u)
{
  return (int) bw_process_unit_get (u, "impeller") >= BW_N_IMPELLER_KINDS;
}

BwChart *
bw_chart_impeller_power (const BwProject *p, const BwResults *r, GArray *checks,
                         const char *unit_id, BwUnitSystem system, GError **error)
{
  const BwElementResult *e;
  int ei = -1;
  const int cold = r ? bw_charts_design_case (r, BW_TEMP_COLDEST) : -1;
  const int warm = r ? bw_charts_design_case (r, BW_TEMP_WARMEST) : -1;
  const BwUnit *un = unit_of (BW_KIND_ROTATIONAL_SPEED, system);
  const BwUnit *ug = unit_of (BW_KIND_RATE, system);
  const BwUnit *up;
  const BwProcessUnit *u;
  g_autoptr (BwChart) ch = NULL;
  BwImpeller imp;
  gboolean baffled;
  double volume, p_design, n_design;
  const BwTempKind temps[] = { BW_TEMP_COLDEST, BW_TEMP_WARMEST };
  double low_re_to = 0;

  g_return_val_if_fail (p != NULL && r != NULL, NULL);
  if (!(e = find_element (r, unit_id, &ei, error)))
    return NULL;
  u = e->stage ? e->stage : e->unit;
  if (u->type != BW_PROCESS_RAPID_MIX && u->type != BW_STAGE_TURBINE)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   _ ("unit: '%s' has no impeller (a rapid-mix tank or turbine stage has)"), unit_id);
      return NULL;
    }
  if (!need_cases (r, cold, warm, error) || !unit_impeller (u, &imp, &baffled, error))
    return NULL;
  if (!value_at (e, cold, BW_Q_VOLUME, &volume) || !value_at (e, cold, BW_Q_POWER, &p_design))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   _ ("unit: '%s' has no volume or power in the results"), unit_id);
      return NULL;
    }
  n_design = imp.speed_rev_s;
  /* Watts below 10 kW at the top of the curve, else kilowatts (P grows as N^3: 8x at 2N). */
  up = unit_named (system == BW_UNIT_SYSTEM_US ? "hp" : p_design * 8 >= 1e4 ? "kW" : "W",
                   BW_KIND_POWER);

  ch = bw_chart_new (BW_CHART_XY, NULL);
  ch->title = g_strdup_printf (_("%s: impeller power and G against speed"), e->label);
  {
    g_autofree char *d = fmt (imp.diameter_m, BW_KIND_LENGTH, system);
    static const char *const kinds[] = { N_("Rushton turbine"), N_("45° pitched-blade impeller"),
                                         N_("hydrofoil impeller") };
    /* TRANSLATORS: "<impeller>, <D> diameter, <baffled tank>; power number <as given>" */
    ch->subtitle = g_strdup_printf (_("%s, %s diameter, %s; power number %s"),
                                    choice_custom (u) ? _("custom impeller") : _(kinds[imp.kind]), d,
                                    baffled ? _("baffled tank") : _("unbaffled tank"),
                                    imp.power_number > 0 ? _("as given") : _("from the library"));
  }
  bw_chart_axis_set (&ch->x, BW_AXIS_LINEAR, _("Impeller speed"), un->symbol);
  ch->x.include_zero = TRUE;
  bw_chart_axis_set (&ch->y, BW_AXIS_LINEAR, _("Power to the water"), up->symbol);
  ch->y.include_zero = TRUE;
  bw_chart_axis_set (&ch->y2, BW_AXIS_LINEAR, _("Velocity gradient G"), ug->symbol);
  ch->y2.include_zero = TRUE;
  ch->has_y2 = TRUE;

  for (guint t = 0; t < G_N_ELEMENTS (temps); t++)
    {
      const double T = p->basis.temperature_K[temps[t]];
      g_autofree char *tl = fmt_temp (T, system);
      g_autofree char *lp = g_strdup_printf (_("Power at %s"), tl);
      g_autofree char *lg = g_strdup_printf (_("G at %s (right axis)"), tl);
      BwWater w;
      BwChartSeries *sp = NULL, *sg;
      if (!bw_water_properties (T, &w, error))
        return NULL;
      /* Power varies with the water only through its density (0.3 % over 0-40 degC): one power
       * curve, at the coldest water, reads the same as two. */
      if (t == 0)
        sp = bw_chart_add_series (ch, lp, BW_SERIES_LINE, C_COLD, BW_MARKER_NONE, BW_DASH_SOLID,
                                  TRUE);
      sg = bw_chart_add_series (ch, lg, BW_SERIES_LINE, t == 0 ? C_THIRD : C_WARM,
                                BW_MARKER_NONE, t == 0 ? BW_DASH_DASHED : BW_DASH_DOTTED, TRUE);
      sg->y2 = TRUE;
      for (guint i = 0; i < IMPELLER_POINTS; i++)
        {
          BwImpeller at = imp;
          BwImpellerResult res;
          double G;
          at.speed_rev_s = n_design * (0.25 + 1.75 * i / (IMPELLER_POINTS - 1));
          if (!bw_impeller_evaluate (&at, baffled, &w, &res, error)
              || !bw_velocity_gradient (res.power_W, volume, &w, &G, error))
            return NULL;
          if (sp)
            bw_chart_series_add (sp, to_display (un, at.speed_rev_s), to_display (up, res.power_W));
          bw_chart_series_add (sg, to_display (un, at.speed_rev_s), to_display (ug, G));
          if (t == 0 && (res.warnings & BW_MIX_WARNING_LOW_REYNOLDS))
            low_re_to = to_display (un, at.speed_rev_s);
        }
    }
  if (low_re_to > 0)
    bw_chart_add_band (ch, TRUE, to_display (un, 0.25 * n_design), low_re_to,
                       _("Re < 10⁴: power number not constant"), C_FILL_B);

  /* The design point from the results. */
  {
    BwChartSeries *dp = bw_chart_add_series (ch, _("Design point (engine results)"), BW_SERIES_LINE,
                                             BW_CHART_INK, BW_MARKER_DIAMOND, BW_DASH_SOLID,
                                             FALSE);
    BwChartSeries *dg = bw_chart_add_series (ch, NULL, BW_SERIES_LINE, BW_CHART_INK,
                                             BW_MARKER_DIAMOND, BW_DASH_SOLID, FALSE);
    double gc, gw;
    g_autofree char *pw = fmt (p_design, BW_KIND_POWER, system);
    g_autofree char *nd = fmt (n_design, BW_KIND_ROTATIONAL_SPEED, system);
    g_autofree char *label = g_strdup_printf (_("%s at %s"), pw, nd);
    dg->y2 = TRUE;
    bw_chart_series_add (dp, to_display (un, n_design), to_display (up, p_design));
    bw_chart_add_note (ch, to_display (un, n_design), to_display (up, p_design), label);
    if (value_at (e, cold, BW_Q_G, &gc) && value_at (e, warm, BW_Q_G, &gw))
      {
        bw_chart_series_add (dg, to_display (un, n_design), to_display (ug, gc));
        bw_chart_series_add (dg, to_display (un, n_design), to_display (ug, gw));
      }
    bw_chart_add_rule (ch, TRUE, to_display (un, n_design), NULL, BW_CHART_MUTED,
                       BW_DASH_DOTTED);
  }
  add_limit_rules (ch, checks, ei, BW_Q_G, ug, TRUE, system);
  ch->footnote = g_strdup (_("P = Np ρ N³ D⁵; G = √(P / (μ V)). "
                             "Preliminary: verify with a licensed engineer."));
  return g_steal_pointer (&ch);
}

/* --- (e) check matrix --- */

typedef struct
{
  guint check;
  int element;
} RowRef;

static int
row_cmp (gconstpointer a, gconstpointer b)
{
  const RowRef *x = a, *y = b;
  if (x->element != y->element)
    return x->element < y->element ? -1 : 1;
  return x->check < y->check ? -1 : x->check > y->check;
}

BwChart *
bw_chart_check_matrix (const BwProject *p, const BwResults *r, GArray *checks,
                       const char *train_id, GError **error)
{
  g_autoptr (BwChart) ch = NULL;
  g_autoptr (GArray) rows = g_array_new (FALSE, FALSE, sizeof (RowRef));
  gboolean any_firm = FALSE;
  GPtrArray *lv_flow, *lv_temp, *lv_service = NULL;

  g_return_val_if_fail (p != NULL && r != NULL && checks != NULL, NULL);
  for (guint i = 0; i < checks->len; i++)
    {
      const BwCheck *k = &g_array_index (checks, BwCheck, i);
      const BwElementResult *e;
      RowRef ref = { i, k->element };
      if (k->element < 0)
        continue;
      e = g_ptr_array_index (r->elements, k->element);
      if (train_id && (e->train == NULL || g_strcmp0 (e->train->id, train_id) != 0))
        continue;
      g_array_append_val (rows, ref);
    }
  if (rows->len == 0)
    {
      if (train_id)
        g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                     _ ("checks: none applies to train %s"), train_id);
      else
        g_set_error_literal (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                             _ ("checks: none applies to the project"));
      return NULL;
    }
  g_array_sort (rows, row_cmp);

  ch = bw_chart_new (BW_CHART_MATRIX, NULL);
  {
    const BwTrain *t = NULL;
    for (guint i = 0; train_id && i < p->trains->len; i++)
      if (g_strcmp0 (((BwTrain *) g_ptr_array_index (p->trains, i))->id, train_id) == 0)
        t = g_ptr_array_index (p->trains, i);
    ch->title = g_strdup_printf (_("Criteria checks by load case%s%s"), t ? ": " : "",
                                 t ? t->name : "");
  }
  ch->subtitle = g_strdup_printf (_("%u checks in %u load cases; each cell grades the governing "
                                    "value of that case"), rows->len, r->n_cases);
  bw_chart_matrix_init (ch, rows->len, r->n_cases);
  ch->matrix.row_groups = g_ptr_array_new_with_free_func (g_free);
  for (guint c = 0; c < r->n_cases; c++)
    any_firm = any_firm || r->cases[c].service == BW_SERVICE_FIRM;
  lv_flow = g_ptr_array_new_with_free_func (g_free);
  lv_temp = g_ptr_array_new_with_free_func (g_free);
  if (any_firm)
    lv_service = g_ptr_array_new_with_free_func (g_free);
  for (guint c = 0; c < r->n_cases; c++)
    {
      const BwLoadCase *lc = &r->cases[c];
      /* TRANSLATORS: column labels, longest first, separated by '|': the chart takes the
       * longest that fits. */
      static const char *const flow_alts[] = { N_("minimum|min"), N_("average day|avg day|avg"),
                                               N_("maximum day|max day|max"), N_("peak hour|peak"),
                                               N_("future|fut") };
      g_autofree char *tl = fmt_temp (p->basis.temperature_K[lc->temp], BW_UNIT_SYSTEM_SI);
      g_ptr_array_add (lv_flow, g_strdup (_(flow_alts[lc->flow])));
      g_ptr_array_add (lv_temp, g_strdup_printf ("%s|%s", tl,
                                                 lc->temp == BW_TEMP_COLDEST ? _("cold") : _("warm")));
      if (lv_service)
        g_ptr_array_add (lv_service, g_strdup (lc->service == BW_SERVICE_FIRM ? _("firm|f")
                                                                              : _("all|a")));
    }
  g_ptr_array_add (ch->matrix.col_levels, lv_flow);
  g_ptr_array_add (ch->matrix.col_levels, lv_temp);
  if (lv_service)
    g_ptr_array_add (ch->matrix.col_levels, lv_service);

  for (guint i = 0; i < rows->len; i++)
    {
      const RowRef *ref = &g_array_index (rows, RowRef, i);
      const BwCheck *k = &g_array_index (checks, BwCheck, ref->check);
      const BwCriterion *cr = k->criterion;
      const BwElementResult *e = g_ptr_array_index (r->elements, ref->element);
      g_ptr_array_add (ch->matrix.row_labels, g_strdup (cr->title));
      g_ptr_array_add (ch->matrix.row_groups,
                       g_strdup_printf ("%s (%s)|%s", e->label, e->id, e->id));
      for (guint c = 0; c < r->n_cases; c++)
        {
          const BwLoadCase *lc = &r->cases[c];
          double v;
          BwCheckStatus st = BW_CHECK_NOT_APPLICABLE;
          if (bw_case_filter_matches (&cr->cases, lc->flow, lc->temp, lc->service)
              && value_at (e, (int) c, cr->quantity, &v))
            st = bw_criterion_grade (cr, v);
          bw_chart_matrix_set (ch, i, c, st);
        }
    }
  ch->footnote = g_strdup (_("Preliminary design aid: verify with a licensed professional "
                             "engineer; local codes govern."));
  return g_steal_pointer (&ch);
}
