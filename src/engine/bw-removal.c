/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-removal.c: ideal and Hazen basins, Type I removal of a size distribution, Type II removal
 * from settling-column data. */
#include "config.h"

#include "engine/bw-removal.h"

#include <math.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"

/* Largest settling velocity accepted, m/s (a 5 mm grain of SG 3 settles at about 0.6 m/s). */
#define MAX_SETTLING_VELOCITY_M_S 100.0

/* Settling-column limits: a column is a few metres deep and read over hours to days. */
#define MAX_COLUMN_DEPTH_M 1000.0
#define MAX_COLUMN_TIME_S 1.0e7
#define MAX_SCALE_FACTOR 3.0
#define MAX_ISO_BANDS 64u

/* --- one settling velocity --- */

/* Range check for a dimensionless value (bw_check_range would print an empty unit). */
static gboolean
check_plain_range (double value, double lo, double hi, const char *field, GError **error)
{
  if (!bw_check_finite (value, field, error))
    return FALSE;
  if (value >= lo && value <= hi)
    return TRUE;
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
               BW_ ("%s: %g is outside the accepted range %g to %g"), field, value, lo, hi);
  return FALSE;
}

static gboolean
check_velocities (double vs_m_s, double v0_m_s, GError **error)
{
  return bw_check_nonnegative (vs_m_s, BW_ ("settling velocity"), error)
         && bw_check_range (vs_m_s, 0.0, MAX_SETTLING_VELOCITY_M_S, BW_ ("settling velocity"), "m/s",
                            error)
         && bw_check_positive (v0_m_s, BW_ ("overflow rate"), error);
}

/* A ratio vs / v0 that overflowed (v0 near the smallest double) stands for "very large": both
 * removal formulas then give 1, never NaN. */
static double
velocity_ratio (double vs_m_s, double v0_m_s)
{
  double r = vs_m_s / v0_m_s;
  return isfinite (r) ? r : G_MAXDOUBLE;
}

/* Camp (1946), Trans. ASCE 111:895, the ideal horizontal-flow basin: a particle settling at vs
 * (m/s) is removed in the proportion vs / v0 (v0 = Q / A, m/s), and entirely when vs >= v0. */
gboolean
bw_removal_ideal (double settling_velocity_m_s, double overflow_rate_m_s, double *out,
                  GError **error)
{
  g_return_val_if_fail (out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!check_velocities (settling_velocity_m_s, overflow_rate_m_s, error))
    return FALSE;
  *out = MIN (1.0, velocity_ratio (settling_velocity_m_s, overflow_rate_m_s));
  return TRUE;
}

static gboolean
check_hazen_n (double n, GError **error)
{
  /* Hazen's classes run from n = 1 (very poor) upward (Hazen 1904; from memory); below 1 the
   * index has no meaning in his model. */
  return bw_check_finite (n, BW_ ("Hazen n"), error)
         && check_plain_range (n, BW_HAZEN_N_MIN, BW_HAZEN_N_MAX, BW_ ("Hazen n"), error);
}

/*
 * Hazen (1904), "On sedimentation", Trans. ASCE 53:45: fraction removed
 *   y / y0 = 1 - [1 + (1/n) (vs / v0)]^(-n)
 * vs settling velocity (m/s), v0 = Q / A (m/s), n basin performance index (dimensionless).
 * Evaluated as -expm1 (-n log1p (r / n)), r = vs / v0, which keeps its digits for small r and
 * large n. For n -> infinity it tends to 1 - exp (-r) (derived), below min (1, r).
 */
gboolean
bw_removal_hazen (double settling_velocity_m_s, double overflow_rate_m_s, double hazen_n,
                  double *out, GError **error)
{
  double r, y;

  g_return_val_if_fail (out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!check_velocities (settling_velocity_m_s, overflow_rate_m_s, error)
      || !check_hazen_n (hazen_n, error))
    return FALSE;
  r = velocity_ratio (settling_velocity_m_s, overflow_rate_m_s);
  y = -expm1 (-hazen_n * log1p (r / hazen_n));
  *out = CLAMP (y, 0.0, 1.0); /* round-off only: the exact value lies in [0, 1) */
  return TRUE;
}

gboolean
bw_removal_fraction (const BwBasinModel *model, double settling_velocity_m_s,
                     double overflow_rate_m_s, double *out, GError **error)
{
  g_return_val_if_fail (model != NULL && out != NULL, FALSE);

  switch (model->kind)
    {
    case BW_BASIN_MODEL_IDEAL:
      return bw_removal_ideal (settling_velocity_m_s, overflow_rate_m_s, out, error);
    case BW_BASIN_MODEL_HAZEN:
      return bw_removal_hazen (settling_velocity_m_s, overflow_rate_m_s, model->hazen_n, out,
                               error);
    default:
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("basin model: unknown value %d"), (int) model->kind);
      return FALSE;
    }
}

const char *
bw_basin_model_name (BwBasinModelKind kind)
{
  switch (kind)
    {
    case BW_BASIN_MODEL_IDEAL:
      return "ideal";
    case BW_BASIN_MODEL_HAZEN:
      return "hazen";
    default:
      return "unknown";
    }
}

/* --- Type I: a particle size distribution --- */

gboolean
bw_psd_check (const BwPsd *psd, GError **error)
{
  double sum = 0.0;

  g_return_val_if_fail (psd != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (psd->n_fractions < 1 || psd->n_fractions > BW_PSD_MAX_FRACTIONS)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("fractions: %u given; 1 to %d are accepted"), psd->n_fractions,
                   BW_PSD_MAX_FRACTIONS);
      return FALSE;
    }
  for (guint i = 0; i < psd->n_fractions; i++)
    {
      const BwPsdFraction *f = &psd->fraction[i];

      if (!isfinite (f->diameter_m) || !(f->diameter_m > 0.0))
        {
          g_set_error (error, BW_ENGINE_ERROR,
                       isfinite (f->diameter_m) ? BW_ENGINE_ERROR_OUT_OF_RANGE
                                                : BW_ENGINE_ERROR_NOT_FINITE,
                       BW_ ("diameter: fraction %u: must be a positive finite number (got %g)"), i + 1,
                       f->diameter_m);
          return FALSE;
        }
      if (!isfinite (f->specific_gravity) || !(f->specific_gravity > 1.0))
        {
          g_set_error (error, BW_ENGINE_ERROR,
                       isfinite (f->specific_gravity) ? BW_ENGINE_ERROR_OUT_OF_RANGE
                                                      : BW_ENGINE_ERROR_NOT_FINITE,
                       BW_ ("specific gravity: fraction %u: %g is not above 1; a particle no denser "
                       "than water does not settle"), i + 1, f->specific_gravity);
          return FALSE;
        }
      if (!isfinite (f->mass_fraction))
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE,
                       BW_ ("mass fraction: fraction %u is not a finite number"), i + 1);
          return FALSE;
        }
      if (f->mass_fraction < 0.0 || f->mass_fraction > 1.0)
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                       BW_ ("mass fraction: fraction %u is %s (%g); each must lie in 0 to 1"), i + 1,
                       f->mass_fraction < 0.0 ? "negative" : "above 1", f->mass_fraction);
          return FALSE;
        }
      sum += f->mass_fraction;
    }
  if (fabs (sum - 1.0) > BW_PSD_SUM_TOLERANCE)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("mass fraction: the %u fractions sum to %.9g, not 1 (within %g); they are not "
                   "renormalised"), psd->n_fractions, sum, BW_PSD_SUM_TOLERANCE);
      return FALSE;
    }
  return TRUE;
}

/* Re-issues a settling error for fraction INDEX (1-based) as "field: fraction N: reason", so the
 * message still starts with the field name. */
static void
set_fraction_error (GError **error, const GError *inner, guint index)
{
  const char *colon = strstr (inner->message, ": ");

  if (colon != NULL)
    g_set_error (error, inner->domain, inner->code, BW_ ("%.*s: fraction %u: %s"),
                 (int) (colon - inner->message), inner->message, index, colon + 2);
  else
    g_set_error (error, inner->domain, inner->code, BW_ ("fraction %u: %s"), index, inner->message);
}

/* Each fraction's terminal velocity: particle density = SG x water density, in WATER, at
 * standard gravity (bw-settling.c documents the drag correlations). */
gboolean
bw_psd_settling_velocities (const BwPsd *psd, const BwWater *water, BwDragCorrelation drag,
                            double *velocities_m_s, GError **error)
{
  g_return_val_if_fail (psd != NULL && water != NULL && velocities_m_s != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!bw_psd_check (psd, error) || !bw_water_check (water, error))
    return FALSE;
  for (guint i = 0; i < psd->n_fractions; i++)
    {
      const BwPsdFraction *f = &psd->fraction[i];
      g_autoptr (GError) inner = NULL;
      BwSettlingResult s;

      if (!bw_settling_velocity_in_fluid (f->diameter_m, f->specific_gravity * water->density_kg_m3,
                                          water->density_kg_m3, water->dynamic_viscosity_Pa_s,
                                          BW_GRAVITY_M_S2, drag, &s, &inner))
        {
          set_fraction_error (error, inner, i + 1);
          return FALSE;
        }
      velocities_m_s[i] = s.velocity_m_s;
    }
  return TRUE;
}

/* Camp (1946): a discrete suspension removed fraction by fraction, R = sum f_i R(vs_i, v0), each
 * R by the basin MODEL (ideal or Hazen). Units: velocities in m/s. */
gboolean
bw_psd_removal_from_velocities (const BwPsd *psd, const double *velocities_m_s,
                                const BwBasinModel *model, double overflow_rate_m_s,
                                BwPsdRemoval *out, GError **error)
{
  BwPsdRemoval r = { 0 };
  double total = 0.0;

  g_return_val_if_fail (psd != NULL && velocities_m_s != NULL && model != NULL && out != NULL,
                        FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!bw_psd_check (psd, error))
    return FALSE;
  r.n_fractions = psd->n_fractions;
  for (guint i = 0; i < psd->n_fractions; i++)
    {
      g_autoptr (GError) inner = NULL;

      if (!bw_removal_fraction (model, velocities_m_s[i], overflow_rate_m_s,
                                &r.fraction_removed[i], &inner))
        {
          /* The overflow rate and the model are the same for every fraction: report them
           * plainly; a bad velocity is the fraction's own. */
          if (g_str_has_prefix (inner->message, "settling velocity:"))
            set_fraction_error (error, inner, i + 1);
          else
            g_propagate_error (error, g_steal_pointer (&inner));
          return FALSE;
        }
      r.settling_velocity_m_s[i] = velocities_m_s[i];
      total += psd->fraction[i].mass_fraction * r.fraction_removed[i];
    }
  /* The fractions sum to 1 within 1e-6, so the total may exceed 1 by as much; removal cannot. */
  r.removal_fraction = CLAMP (total, 0.0, 1.0);
  *out = r;
  return TRUE;
}

gboolean
bw_psd_removal (const BwPsd *psd, const BwWater *water, BwDragCorrelation drag,
                const BwBasinModel *model, double overflow_rate_m_s, BwPsdRemoval *out,
                GError **error)
{
  double v[BW_PSD_MAX_FRACTIONS];

  g_return_val_if_fail (psd != NULL && water != NULL && model != NULL && out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!bw_psd_settling_velocities (psd, water, drag, v, error))
    return FALSE;
  return bw_psd_removal_from_velocities (psd, v, model, overflow_rate_m_s, out, error);
}

/* --- Type II: flocculent settling from column data --- */

void
bw_type2_options_init (BwType2Options *opts)
{
  g_return_if_fail (opts != NULL);
  opts->depth_m = 0.0;
  opts->surface = BW_COLUMN_SURFACE_HOLD;
  opts->overflow_scale = 1.0;
  opts->detention_scale = 1.0;
}

gboolean
bw_settling_column_check (const BwSettlingColumn *c, GError **error)
{
  g_return_val_if_fail (c != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (c->n_depths < 1 || c->n_depths > BW_COLUMN_MAX_DEPTHS)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("depths: %u sampling ports given; 1 to %d are accepted"), c->n_depths,
                   BW_COLUMN_MAX_DEPTHS);
      return FALSE;
    }
  if (c->n_times < 1 || c->n_times > BW_COLUMN_MAX_TIMES)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("times: %u sampling times given; 1 to %d are accepted"), c->n_times,
                   BW_COLUMN_MAX_TIMES);
      return FALSE;
    }
  for (guint j = 0; j < c->n_depths; j++)
    {
      if (!bw_check_positive (c->depth_m[j], BW_ ("depths"), error)
          || !bw_check_range (c->depth_m[j], 0.0, MAX_COLUMN_DEPTH_M, BW_ ("depths"), "m", error))
        return FALSE;
      if (j > 0 && !(c->depth_m[j] > c->depth_m[j - 1]))
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
                       BW_ ("depths: port %u at %g m is not below port %u at %g m; list the ports "
                       "from the surface down"), j + 1, c->depth_m[j], j, c->depth_m[j - 1]);
          return FALSE;
        }
    }
  for (guint k = 0; k < c->n_times; k++)
    {
      if (!bw_check_positive (c->time_s[k], BW_ ("times"), error)
          || !bw_check_range (c->time_s[k], 0.0, MAX_COLUMN_TIME_S, BW_ ("times"), "s", error))
        return FALSE;
      if (k > 0 && !(c->time_s[k] > c->time_s[k - 1]))
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                       BW_ ("times: reading %u at %g min does not follow reading %u at %g min"), k + 1,
                       c->time_s[k] / 60.0, k, c->time_s[k - 1] / 60.0);
          return FALSE;
        }
    }
  for (guint j = 0; j < c->n_depths; j++)
    for (guint k = 0; k < c->n_times; k++)
      {
        const double v = c->removal[j][k];

        if (!bw_check_finite (v, BW_ ("removal"), error))
          return FALSE;
        if (v < 0.0 || v > 1.0)
          {
            g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                         BW_ ("removal: %g at depth %g m and %g min is outside 0 to 1"), v,
                         c->depth_m[j], c->time_s[k] / 60.0);
            return FALSE;
          }
        /* In a batch column the solids passing a depth only accumulate, so a reading below the
         * one before it is a sampling error, and the removal-time curve would not be monotone.
         * It is refused rather than smoothed. */
        if (k > 0 && v < c->removal[j][k - 1])
          {
            g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                         BW_ ("removal: at depth %g m it falls from %g %% at %g min to %g %% at %g "
                         "min; column readings cannot fall with time"), c->depth_m[j],
                         100.0 * c->removal[j][k - 1], c->time_s[k - 1] / 60.0, 100.0 * v,
                         c->time_s[k] / 60.0);
            return FALSE;
          }
      }
  return TRUE;
}

static gboolean
check_type2_options (const BwSettlingColumn *c, const BwType2Options *o, double *depth_m,
                     GError **error)
{
  const double deepest = c->depth_m[c->n_depths - 1];

  if (!bw_check_nonnegative (o->depth_m, BW_ ("column depth"), error))
    return FALSE;
  if (o->depth_m > deepest)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
                   BW_ ("column depth: %g m is below the deepest port (%g m); the column has no "
                   "readings there"), o->depth_m, deepest);
      return FALSE;
    }
  if (o->surface != BW_COLUMN_SURFACE_HOLD && o->surface != BW_COLUMN_SURFACE_FULL)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("surface: unknown value %d"), (int) o->surface);
      return FALSE;
    }
  /* Scale-up only ever makes the design more cautious than the column: the overflow rate is
   * divided by a factor of 1 or more, the detention time multiplied by one. */
  if (!bw_check_finite (o->overflow_scale, BW_ ("overflow scale-up"), error)
      || !bw_check_finite (o->detention_scale, BW_ ("detention scale-up"), error))
    return FALSE;
  if (o->overflow_scale < 1.0 || o->overflow_scale > MAX_SCALE_FACTOR)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("overflow scale-up: %g is outside 1 to %g; it divides the column overflow "
                   "rate (a multiplier such as 0.65 is the divisor 1/0.65 = 1.54)"),
                   o->overflow_scale, MAX_SCALE_FACTOR);
      return FALSE;
    }
  if (o->detention_scale < 1.0 || o->detention_scale > MAX_SCALE_FACTOR)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("detention scale-up: %g is outside 1 to %g; it multiplies the column "
                   "detention time"), o->detention_scale, MAX_SCALE_FACTOR);
      return FALSE;
    }
  *depth_m = o->depth_m > 0.0 ? o->depth_m : deepest;
  return TRUE;
}

/* Removal at every port at time T (s, 0 <= T <= last reading): linear interpolation in time
 * between readings, and from R = 0 at T = 0 (nothing has settled yet) to the first reading. */
static void
profile_at (const BwSettlingColumn *c, double t, double *p)
{
  guint k = 0;
  double t0, w;

  while (k < c->n_times - 1 && t > c->time_s[k])
    k++;
  t0 = k > 0 ? c->time_s[k - 1] : 0.0;
  w = (t - t0) / (c->time_s[k] - t0);
  w = CLAMP (w, 0.0, 1.0);
  for (guint j = 0; j < c->n_depths; j++)
    {
      const double r0 = k > 0 ? c->removal[j][k - 1] : 0.0;
      p[j] = r0 + w * (c->removal[j][k] - r0);
    }
}

/*
 * Total removal over depth H from the port profile P at one time: the average over the depth of
 * the removal profile R(h),
 *   R_T = (1 / H) integral_0^H R(h) dh,
 * with R linear in depth between ports, and between the surface and the shallowest port either
 * held at that port's value or rising linearly to 1 at the surface (SURFACE). This is the
 * iso-removal method (Davis 2010 Eq. 10-22: R_T = R_a + sum (H_i / H)(R_{i+1} - R_i)) in the limit
 * of iso-removal curves drawn through every value the profile takes: integrating by parts,
 * integral R dh = H R(H) + integral over R of the depth h(R) at which the profile reaches R, and
 * the sum is that second integral by the midpoint rule on the bands between curves. It needs no
 * curves drawn, and no monotone profile. The trapezoid rule below is exact for the piecewise
 * linear profile. Depths in m; removals 0-1. BOTTOM receives R(H).
 */
static double
depth_average (const BwSettlingColumn *c, const double *p, double depth_m, BwColumnSurface surface,
               double *bottom)
{
  double area = 0.0;
  double h_prev = 0.0;
  double r_prev = surface == BW_COLUMN_SURFACE_FULL ? 1.0 : p[0];

  for (guint j = 0; j < c->n_depths; j++)
    {
      const double h = c->depth_m[j], r = p[j];

      if (h >= depth_m)
        {
          /* h_prev < depth_m <= h, so h > h_prev. */
          const double r_h = r_prev + (r - r_prev) * (depth_m - h_prev) / (h - h_prev);
          area += (depth_m - h_prev) * (r_prev + r_h) / 2.0;
          *bottom = r_h;
          return area / depth_m;
        }
      area += (h - h_prev) * (r_prev + r) / 2.0;
      h_prev = h;
      r_prev = r;
    }
  /* Unreachable: check_type2_options keeps H within the ports. */
  *bottom = r_prev;
  return area / h_prev;
}

static void
fill_result (const BwType2Options *o, double depth_m, double t, double removal, double bottom,
             BwType2Result *out)
{
  out->removal_fraction = CLAMP (removal, 0.0, 1.0);
  out->bottom_removal = CLAMP (bottom, 0.0, 1.0);
  out->depth_m = depth_m;
  out->detention_s = t;
  out->overflow_rate_m_s = depth_m / t;
  out->design_overflow_rate_m_s = out->overflow_rate_m_s / o->overflow_scale;
  out->design_detention_s = t * o->detention_scale;
}

gboolean
bw_type2_removal_at_time (const BwSettlingColumn *c, const BwType2Options *o, double time_s,
                          BwType2Result *out, GError **error)
{
  double p[BW_COLUMN_MAX_DEPTHS];
  double depth_m, removal, bottom;
  double last;

  g_return_val_if_fail (c != NULL && o != NULL && out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!bw_settling_column_check (c, error) || !check_type2_options (c, o, &depth_m, error)
      || !bw_check_positive (time_s, BW_ ("detention time"), error))
    return FALSE;
  last = c->time_s[c->n_times - 1];
  if (time_s > last)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("detention time: %g min is beyond the last column reading (%g min)"),
                   time_s / 60.0, last / 60.0);
      return FALSE;
    }
  profile_at (c, time_s, p);
  removal = depth_average (c, p, depth_m, o->surface, &bottom);
  fill_result (o, depth_m, time_s, removal, bottom, out);
  return TRUE;
}

gboolean
bw_type2_removal_at_overflow (const BwSettlingColumn *c, const BwType2Options *o,
                              double overflow_rate_m_s, BwType2Result *out, GError **error)
{
  double depth_m, t, last;

  g_return_val_if_fail (c != NULL && o != NULL && out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!bw_settling_column_check (c, error) || !check_type2_options (c, o, &depth_m, error)
      || !bw_check_positive (overflow_rate_m_s, BW_ ("overflow rate"), error))
    return FALSE;
  t = depth_m / overflow_rate_m_s;
  last = c->time_s[c->n_times - 1];
  if (!(t <= last))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("overflow rate: %g m/h over %g m needs a column time of %g min, beyond the "
                   "last reading (%g min)"), overflow_rate_m_s * 3600.0, depth_m, t / 60.0,
                   last / 60.0);
      return FALSE;
    }
  return bw_type2_removal_at_time (c, o, t, out, error);
}

/* The port profile is linear in time between readings and the depth average is linear in the
 * profile, so R_T(t) is piecewise linear with nodes at the readings (and t = 0): the first
 * interval whose end reaches the target holds the answer, found by one linear interpolation. */
gboolean
bw_type2_time_for_removal (const BwSettlingColumn *c, const BwType2Options *o,
                           double target_removal, BwType2Result *out, GError **error)
{
  double p[BW_COLUMN_MAX_DEPTHS];
  double depth_m, bottom, t_prev, r_prev;

  g_return_val_if_fail (c != NULL && o != NULL && out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!bw_settling_column_check (c, error) || !check_type2_options (c, o, &depth_m, error)
      || !bw_check_positive (target_removal, BW_ ("target removal"), error)
      || !check_plain_range (target_removal, 0.0, 1.0, BW_ ("target removal"), error))
    return FALSE;

  for (guint j = 0; j < c->n_depths; j++)
    p[j] = 0.0;
  t_prev = 0.0;
  r_prev = depth_average (c, p, depth_m, o->surface, &bottom);
  if (r_prev >= target_removal)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("target removal: %g %% is credited at time zero by the assumed complete "
                   "removal at the surface; choose a larger target"), 100.0 * target_removal);
      return FALSE;
    }
  for (guint k = 0; k < c->n_times; k++)
    {
      const double t = c->time_s[k];
      double r;

      profile_at (c, t, p);
      r = depth_average (c, p, depth_m, o->surface, &bottom);
      if (r >= target_removal)
        {
          /* r_prev < target <= r, so r > r_prev. */
          const double tt = t_prev + (target_removal - r_prev) / (r - r_prev) * (t - t_prev);
          return bw_type2_removal_at_time (c, o, tt, out, error);
        }
      t_prev = t;
      r_prev = r;
    }
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
               BW_ ("target removal: %g %% is not reached by the last column reading (%.4g %% at %g "
               "min)"), 100.0 * target_removal, 100.0 * r_prev, t_prev / 60.0);
  return FALSE;
}

/* Davis (2010) Eq. 10-22, the iso-removal sum; see bw-removal.h for the arguments. */
gboolean
bw_isoremoval_sum (guint n_bands, const double *levels, const double *mid_depths_m,
                   double depth_m, double *out, GError **error)
{
  double total;

  g_return_val_if_fail (levels != NULL && mid_depths_m != NULL && out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (n_bands < 1 || n_bands > MAX_ISO_BANDS)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("bands: %u given; 1 to %u are accepted"), n_bands, MAX_ISO_BANDS);
      return FALSE;
    }
  if (!bw_check_positive (depth_m, BW_ ("column depth"), error)
      || !bw_check_range (depth_m, 0.0, MAX_COLUMN_DEPTH_M, BW_ ("column depth"), "m", error))
    return FALSE;
  for (guint i = 0; i <= n_bands; i++)
    {
      if (!check_plain_range (levels[i], 0.0, 1.0, BW_ ("levels"), error))
        return FALSE;
      if (i > 0 && levels[i] < levels[i - 1])
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                       BW_ ("levels: curve %u (%g) is below curve %u (%g); list them rising"), i + 1,
                       levels[i], i, levels[i - 1]);
          return FALSE;
        }
    }
  for (guint i = 0; i < n_bands; i++)
    {
      if (!bw_check_range (mid_depths_m[i], 0.0, depth_m, BW_ ("mid depths"), "m", error))
        return FALSE;
      if (i > 0 && mid_depths_m[i] > mid_depths_m[i - 1])
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
                       BW_ ("mid depths: band %u at %g m lies below band %u at %g m; higher removal "
                       "is read nearer the surface"), i + 1, mid_depths_m[i], i,
                       mid_depths_m[i - 1]);
          return FALSE;
        }
    }
  total = levels[0];
  for (guint i = 0; i < n_bands; i++)
    total += mid_depths_m[i] / depth_m * (levels[i + 1] - levels[i]);
  *out = CLAMP (total, 0.0, 1.0);
  return TRUE;
}
