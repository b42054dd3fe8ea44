/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-chart-jartest.c: the jar-test chart. Every curve point comes from bw_jar_curve and every
 * optimum, target dose and window from bw_jar_analyse; values turn from SI into the reader's
 * units here, at the edge. */
#include "config.h"

#include "draw/bw-chart-jartest.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-water.h"

void
bw_jar_chart_options_init (BwJarChartOptions *o)
{
  g_return_if_fail (o != NULL);
  memset (o, 0, sizeof *o);
  o->target_NTU = -1;
  o->threshold_V = BW_ZETA_DESTABILISED_DEFAULT_V;
}

void
bw_jar_chart_options_from_project (BwJarChartOptions *o, const BwProject *p)
{
  g_return_if_fail (o != NULL && p != NULL);
  o->has_chosen = p->chemistry.enabled;
  o->chosen_min_kg_m3 = p->chemistry.dose_min_kg_m3;
  o->chosen_design_kg_m3 = p->chemistry.dose_design_kg_m3;
  o->chosen_max_kg_m3 = p->chemistry.dose_max_kg_m3;
}

const BwJarTestRecord *
bw_chart_jartest_find_record (const BwProject *p, const char *id)
{
  g_return_val_if_fail (p != NULL, NULL);
  for (guint i = 0; id && i < p->jar_tests->len; i++)
    {
      const BwJarTestRecord *r = g_ptr_array_index (p->jar_tests, i);
      if (g_strcmp0 (r->id, id) == 0)
        return r;
    }
  return NULL;
}

static char *
fmt_dose (double kg_m3, BwUnitSystem system)
{
  return bw_units_format (kg_m3, BW_KIND_CONCENTRATION, system);
}

BwChart *
bw_chart_jartest (const BwJarTestRecord *rec, const BwJarChartOptions *opt, BwUnitSystem system,
                  GError **error)
{
  const BwUnit *ud = bw_units_display_unit (BW_KIND_CONCENTRATION, system);
  const BwUnit *uz = bw_units_display_unit (BW_KIND_POTENTIAL, system);
  BwJarChartOptions defaults;
  g_autoptr (BwChart) ch = NULL;
  g_autoptr (GError) local = NULL;
  BwJarSeries s;
  BwJarResult res;
  BwChartSeries *jars, *curve, *zeta = NULL;
  double lo, hi, threshold;

  g_return_val_if_fail (rec != NULL, NULL);
  if (opt == NULL)
    {
      bw_jar_chart_options_init (&defaults);
      opt = &defaults;
    }
  threshold = opt->threshold_V > 0 ? opt->threshold_V : BW_ZETA_DESTABILISED_DEFAULT_V;

  /* The engine's own checks first: a copy, prepared (sorted), zeta from mobility if need be. */
  s = rec->series;
  if (!bw_jar_series_prepare (&s, &local))
    {
      g_set_error (error, BW_ENGINE_ERROR, local->code, _("jar test %s: %s"), rec->id, local->message);
      return NULL;
    }
  if (s.has_mobility && !s.has_zeta)
    {
      BwWater w;
      if (!bw_water_properties (rec->temperature_K, &w, &local)
          || !bw_jar_series_zeta_from_mobility (&s, BW_ZETA_SMOLUCHOWSKI, 0, 0, &w, &local))
        {
          g_set_error (error, BW_ENGINE_ERROR, local->code, _("jar test %s: %s"), rec->id,
                       local->message);
          return NULL;
        }
    }
  if (!bw_jar_analyse (&s, opt->target_NTU, threshold, &res, &local))
    {
      g_set_error (error, BW_ENGINE_ERROR, local->code, _("jar test %s: %s"), rec->id, local->message);
      return NULL;
    }

  ch = bw_chart_new (BW_CHART_XY, NULL);
  ch->title = g_strdup_printf (_("Jar test: %s"), rec->name && *rec->name ? rec->name : rec->id);
  {
    g_autofree char *t = bw_units_format (rec->temperature_K, BW_KIND_TEMPERATURE, system);
    if (s.has_zeta)
      ch->subtitle = g_strdup_printf (ngettext ("%u jar at %s; settled turbidity and zeta potential "
                                                "against coagulant dose",
                                                "%u jars at %s; settled turbidity and zeta potential "
                                                "against coagulant dose", s.n_jars),
                                      s.n_jars, t);
    else
      ch->subtitle = g_strdup_printf (ngettext ("%u jar at %s; settled turbidity against coagulant dose",
                                                "%u jars at %s; settled turbidity against coagulant dose",
                                                s.n_jars),
                                      s.n_jars, t);
  }
  bw_chart_axis_set (&ch->x, BW_AXIS_LINEAR, _("Coagulant dose"), ud->symbol);
  ch->x.include_zero = TRUE;
  bw_chart_axis_set (&ch->y, BW_AXIS_LINEAR, _("Settled turbidity"), "NTU");
  ch->y.include_zero = TRUE;
  ch->show_legend = TRUE;

  lo = s.jars[0].dose_kg_m3;
  hi = s.jars[s.n_jars - 1].dose_kg_m3;

  /* Shading first, so the data lies over it. */
  if (res.has_window)
    {
      g_autofree char *lim = bw_units_format (threshold, BW_KIND_POTENTIAL, system);
      g_autofree char *label = g_strdup_printf (_("destabilised: |ζ| ≤ %s"), lim);
      BwChartBand *zb;
      /* The doses of the window across the plot, and the |zeta| band on the right axis that
       * defines it (labelled there, clear of the chosen dose's label at the top). */
      bw_chart_add_band (ch, TRUE, bw_unit_from_si (ud, res.window_low_kg_m3),
                         bw_unit_from_si (ud, res.window_high_kg_m3), NULL, BW_JARTEST_C_WINDOW);
      zb = bw_chart_add_band (ch, FALSE, -bw_unit_from_si (uz, threshold),
                              bw_unit_from_si (uz, threshold), label, BW_JARTEST_C_WINDOW);
      zb->y2 = TRUE;
    }
  if (opt->has_chosen && opt->chosen_max_kg_m3 > opt->chosen_min_kg_m3)
    bw_chart_add_band (ch, TRUE, bw_unit_from_si (ud, opt->chosen_min_kg_m3),
                       bw_unit_from_si (ud, opt->chosen_max_kg_m3), NULL, BW_JARTEST_C_CHOSEN);

  curve = bw_chart_add_series (ch, _("Smooth fit (monotone cubic)"), BW_SERIES_LINE,
                               BW_JARTEST_C_TURBIDITY, BW_MARKER_NONE, BW_DASH_SOLID, TRUE);
  for (guint i = 0; i < BW_JARTEST_CURVE_POINTS; i++)
    {
      const double d = lo + (hi - lo) * i / (BW_JARTEST_CURVE_POINTS - 1);
      bw_chart_series_add (curve, bw_unit_from_si (ud, d), bw_jar_curve (&s, d));
    }
  jars = bw_chart_add_series (ch, _("Settled turbidity (jars)"), BW_SERIES_LINE,
                              BW_JARTEST_C_TURBIDITY, BW_MARKER_CIRCLE, BW_DASH_SOLID, FALSE);
  for (guint i = 0; i < s.n_jars; i++)
    bw_chart_series_add (jars, bw_unit_from_si (ud, s.jars[i].dose_kg_m3), s.jars[i].turbidity_NTU);

  if (s.has_zeta)
    {
      bw_chart_axis_set (&ch->y2, BW_AXIS_LINEAR, _("Zeta potential"), uz->symbol);
      ch->y2.include_zero = TRUE;
      ch->has_y2 = TRUE;
      zeta = bw_chart_add_series (ch, _("Zeta potential (right axis)"), BW_SERIES_LINE,
                                  BW_JARTEST_C_ZETA, BW_MARKER_SQUARE, BW_DASH_DASHED, TRUE);
      zeta->y2 = TRUE;
      for (guint i = 0; i < s.n_jars; i++)
        bw_chart_series_add (zeta, bw_unit_from_si (ud, s.jars[i].dose_kg_m3),
                             bw_unit_from_si (uz, s.jars[i].zeta_V));
      /* Zero charge: the centre of the window. */
      {
        BwChartRule *z0 = bw_chart_add_rule (ch, FALSE, 0.0, NULL, BW_CHART_MUTED, BW_DASH_DOTTED);
        z0->y2 = TRUE;
      }
    }

  if (opt->target_NTU >= 0)
    {
      g_autofree char *label = NULL;
      g_autofree char *tt = bw_units_format (opt->target_NTU, BW_KIND_TURBIDITY, system);
      BwChartRule *t;
      if (res.has_target)
        {
          g_autofree char *d = fmt_dose (res.target_dose_kg_m3, system);
          label = g_strdup_printf (_("target %s: reached at %s"), tt, d);
        }
      else
        label = g_strdup_printf (_("target %s: not reached in the doses tested"), tt);
      t = bw_chart_add_rule (ch, FALSE, opt->target_NTU, label, BW_JARTEST_C_TARGET,
                             BW_DASH_DASHED);
      t->label_start = TRUE;
    }

  {
    g_autofree char *d = fmt_dose (res.optimum_dose_kg_m3, system);
    g_autofree char *t = bw_units_format (res.optimum_turbidity_NTU, BW_KIND_TURBIDITY, system);
    g_autofree char *text = g_strdup_printf (_("optimum %s (%s)"), d, t);
    BwChartNote *n = bw_chart_add_note (ch, bw_unit_from_si (ud, res.optimum_dose_kg_m3),
                                        res.optimum_turbidity_NTU, text);
    n->ring = TRUE;
  }

  if (opt->has_chosen)
    {
      g_autofree char *d = fmt_dose (opt->chosen_design_kg_m3, system);
      g_autofree char *label = NULL;
      if (opt->chosen_max_kg_m3 > opt->chosen_min_kg_m3)
        {
          g_autofree char *a = fmt_dose (opt->chosen_min_kg_m3, system);
          g_autofree char *b = fmt_dose (opt->chosen_max_kg_m3, system);
          label = g_strdup_printf (_("chosen %s (range %s to %s)"), d, a, b);
        }
      else
        label = g_strdup_printf (_("chosen %s"), d);
      BwChartRule *rule = bw_chart_add_rule (ch, TRUE, bw_unit_from_si (ud, opt->chosen_design_kg_m3),
                                             label, BW_JARTEST_C_CHOSEN, BW_DASH_SOLID);
      rule->label_start = FALSE; /* at the top, clear of the curve's low point */
    }

  ch->footnote = g_strdup (_("Curve through the jars (Fritsch & Carlson 1980). Preliminary: verify "
                           "with a licensed engineer and the approving authority."));
  return g_steal_pointer (&ch);
}

BwChart *
bw_chart_jartest_of_project (const BwProject *p, const char *jar_test_id, double target_NTU,
                             BwUnitSystem system, GError **error)
{
  const BwJarTestRecord *r;
  BwJarChartOptions o;

  g_return_val_if_fail (p != NULL, NULL);
  r = bw_chart_jartest_find_record (p, jar_test_id);
  if (r == NULL)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   _("jar test: no jar-test record with id '%s' in the project"),
                   jar_test_id ? jar_test_id : "(none)");
      return NULL;
    }
  bw_jar_chart_options_init (&o);
  bw_jar_chart_options_from_project (&o, p);
  o.target_NTU = target_NTU;
  return bw_chart_jartest (r, &o, system, error);
}
