/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-jartest.c: dose-response curves of jar tests, optimum and target doses, and the window of
 * destabilisation from zeta potential. */
#include "config.h"

#include "engine/bw-jartest.h"

#include <math.h>
#include <stdlib.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"

static int
by_dose (const void *a, const void *b)
{
  const double x = ((const BwJar *) a)->dose_kg_m3, y = ((const BwJar *) b)->dose_kg_m3;
  return (x > y) - (x < y);
}

gboolean
bw_jar_series_prepare (BwJarSeries *s, GError **error)
{
  g_return_val_if_fail (s != NULL, FALSE);
  if (s->n_jars < 3 || s->n_jars > BW_JAR_MAX)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("jars: a series needs 3 to %d jars (got %u)"), BW_JAR_MAX, s->n_jars);
      return FALSE;
    }
  for (guint i = 0; i < s->n_jars; i++)
    {
      const BwJar *j = &s->jars[i];
      g_autofree char *fd = g_strdup_printf ("jar %u dose", i + 1);
      g_autofree char *ft = g_strdup_printf ("jar %u turbidity", i + 1);
      if (!bw_check_nonnegative (j->dose_kg_m3, fd, error)
          || !bw_check_range (j->dose_kg_m3, 0, 1, fd, "kg/m³", error)
          || !bw_check_nonnegative (j->turbidity_NTU, ft, error))
        return FALSE;
      if (s->has_ph && !bw_check_range (j->ph, 0, 14, BW_ ("pH"), "", error))
        return FALSE;
      if (s->has_zeta && !bw_check_range (j->zeta_V, -0.5, 0.5, BW_ ("zeta potential"), "V", error))
        return FALSE;
      if (s->has_mobility && !bw_check_finite (j->mobility_m2_V_s, BW_ ("mobility"), error))
        return FALSE;
    }
  qsort (s->jars, s->n_jars, sizeof (BwJar), by_dose);
  for (guint i = 1; i < s->n_jars; i++)
    if (s->jars[i].dose_kg_m3 == s->jars[i - 1].dose_kg_m3)
      {
        g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                     BW_ ("dose: %g mg/L appears in two jars; average them or drop one"),
                     s->jars[i].dose_kg_m3 * 1e3);
        return FALSE;
      }
  return TRUE;
}

gboolean
bw_jar_series_zeta_from_mobility (BwJarSeries *s, BwZetaModel model, double radius_m,
                                  double ionic_strength_mol_m3, const BwWater *water, GError **error)
{
  g_return_val_if_fail (s != NULL && water != NULL, FALSE);
  if (!s->has_mobility)
    return TRUE;
  for (guint i = 0; i < s->n_jars; i++)
    {
      BwZetaResult z;
      if (!bw_zeta_from_mobility (s->jars[i].mobility_m2_V_s, model, radius_m,
                                  ionic_strength_mol_m3, water, &z, error))
        return FALSE;
      s->jars[i].zeta_V = z.zeta_V;
    }
  s->has_zeta = TRUE;
  return TRUE;
}

/* Fritsch-Carlson slopes at the knots: zero at a local extremum, the weighted harmonic mean of
 * the neighbouring secants elsewhere (Fritsch & Butland's form), one-sided at the ends. */
static double
knot_slope (const BwJarSeries *s, guint i)
{
  const BwJar *j = s->jars;
  const guint n = s->n_jars;

  if (i == 0 || i == n - 1)
    {
      const guint a = i == 0 ? 0 : n - 2;
      const double d = (j[a + 1].turbidity_NTU - j[a].turbidity_NTU)
                       / (j[a + 1].dose_kg_m3 - j[a].dose_kg_m3);
      /* An end slope of the adjacent secant keeps the end interval monotone. */
      return d;
    }
  {
    const double h0 = j[i].dose_kg_m3 - j[i - 1].dose_kg_m3, h1 = j[i + 1].dose_kg_m3 - j[i].dose_kg_m3;
    const double d0 = (j[i].turbidity_NTU - j[i - 1].turbidity_NTU) / h0;
    const double d1 = (j[i + 1].turbidity_NTU - j[i].turbidity_NTU) / h1;
    const double w0 = 2 * h1 + h0, w1 = h1 + 2 * h0;
    if (d0 * d1 <= 0)
      return 0.0;
    return (w0 + w1) / (w0 / d0 + w1 / d1);
  }
}

double
bw_jar_curve (const BwJarSeries *s, double dose)
{
  const BwJar *j = s->jars;
  guint i = 0;
  double h, t, m0, m1, t2, t3;

  g_return_val_if_fail (s != NULL && s->n_jars >= 2, 0.0);
  if (dose <= j[0].dose_kg_m3)
    return j[0].turbidity_NTU;
  if (dose >= j[s->n_jars - 1].dose_kg_m3)
    return j[s->n_jars - 1].turbidity_NTU;
  while (i + 1 < s->n_jars && j[i + 1].dose_kg_m3 < dose)
    i++;
  h = j[i + 1].dose_kg_m3 - j[i].dose_kg_m3;
  t = (dose - j[i].dose_kg_m3) / h;
  m0 = knot_slope (s, i);
  m1 = knot_slope (s, i + 1);
  t2 = t * t;
  t3 = t2 * t;
  /* Cubic Hermite basis. */
  return (2 * t3 - 3 * t2 + 1) * j[i].turbidity_NTU + (t3 - 2 * t2 + t) * h * m0
         + (-2 * t3 + 3 * t2) * j[i + 1].turbidity_NTU + (t3 - t2) * h * m1;
}

/* The dose between A and B where |zeta| crosses THRESHOLD (zeta linear between jars). */
static double
crossing (double a_dose, double a_z, double b_dose, double b_z, double threshold)
{
  const double level = (fabs (a_z) > threshold ? a_z : b_z) > 0 ? threshold : -threshold;
  return a_dose + (level - a_z) / (b_z - a_z) * (b_dose - a_dose);
}

gboolean
bw_jar_analyse (const BwJarSeries *s, double target_NTU, double threshold_V, BwJarResult *out,
                GError **error)
{
  BwJarResult r = { 0 };
  const BwJar *j;
  guint best = 0;

  g_return_val_if_fail (s != NULL && out != NULL, FALSE);
  if (s->n_jars < 3)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, BW_ ("jars: prepare the series first"));
      return FALSE;
    }
  j = s->jars;
  /* The curve never overshoots, so its least value is at the jar with the least turbidity
   * (the first such jar, the lower dose, on a tie). */
  for (guint i = 1; i < s->n_jars; i++)
    if (j[i].turbidity_NTU < j[best].turbidity_NTU)
      best = i;
  r.optimum_dose_kg_m3 = j[best].dose_kg_m3;
  r.optimum_turbidity_NTU = j[best].turbidity_NTU;

  if (target_NTU >= 0)
    {
      if (!bw_check_finite (target_NTU, BW_ ("target"), error))
        return FALSE;
      if (j[0].turbidity_NTU <= target_NTU)
        {
          r.has_target = TRUE;
          r.target_dose_kg_m3 = j[0].dose_kg_m3;
        }
      else
        for (guint i = 0; i + 1 < s->n_jars && !r.has_target; i++)
          if (j[i + 1].turbidity_NTU <= target_NTU)
            {
              /* Monotone on this interval: bisect the curve for the crossing. */
              double lo = j[i].dose_kg_m3, hi = j[i + 1].dose_kg_m3;
              for (int it = 0; it < 100 && hi - lo > 1e-12 * (1 + hi); it++)
                {
                  const double mid = 0.5 * (lo + hi);
                  if (bw_jar_curve (s, mid) <= target_NTU)
                    hi = mid;
                  else
                    lo = mid;
                }
              r.has_target = TRUE;
              r.target_dose_kg_m3 = hi;
            }
    }

  if (s->has_zeta)
    {
      guint k = 0;
      if (!(threshold_V > 0) || !isfinite (threshold_V))
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                       BW_ ("threshold: the |zeta| limit must be a positive number"));
          return FALSE;
        }
      /* The window around the jar of least |zeta|, when that jar is inside the limit. */
      for (guint i = 1; i < s->n_jars; i++)
        if (fabs (j[i].zeta_V) < fabs (j[k].zeta_V))
          k = i;
      if (fabs (j[k].zeta_V) <= threshold_V)
        {
          guint lo = k, hi = k;
          while (lo > 0 && fabs (j[lo - 1].zeta_V) <= threshold_V)
            lo--;
          while (hi + 1 < s->n_jars && fabs (j[hi + 1].zeta_V) <= threshold_V)
            hi++;
          r.has_window = TRUE;
          r.window_low_kg_m3 = lo > 0 ? crossing (j[lo - 1].dose_kg_m3, j[lo - 1].zeta_V, j[lo].dose_kg_m3,
                                                  j[lo].zeta_V, threshold_V)
                                      : j[0].dose_kg_m3;
          r.window_high_kg_m3 = hi + 1 < s->n_jars
                                  ? crossing (j[hi].dose_kg_m3, j[hi].zeta_V, j[hi + 1].dose_kg_m3,
                                              j[hi + 1].zeta_V, threshold_V)
                                  : j[s->n_jars - 1].dose_kg_m3;
        }
    }
  *out = r;
  return TRUE;
}
