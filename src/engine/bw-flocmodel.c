/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-flocmodel.c: the Argaman-Kaufman aggregation-breakup model for compartments in series. */
#include "config.h"

#include "engine/bw-flocmodel.h"

#include <float.h>
#include <math.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"

/* Golden-section search for the best G: iterations and the relative width at which it stops. */
#define GOLDEN_MAX_ITERATIONS 300
#define GOLDEN_REL_TOLERANCE 1e-10

/* The best-G search starts this far below K_A / K_B (where breakup equals aggregation). */
#define BEST_G_SPAN 1e-8

/*
 * Argaman & Kaufman (1970), J. San. Eng. Div. ASCE 96(SA2):223; Argaman (1971), JAWWA 63:775
 * (from memory). In a completely mixed compartment at steady state, primary particles are lost
 * to aggregation at K_A G n and released by floc breakup at K_B n_0 G^2:
 *   (n_{i-1} - n_i) / t_i = K_A G_i n_i - K_B n_0 G_i^2
 *   n_i = (n_{i-1} + K_B n_0 G_i^2 t_i) / (1 + K_A G_i t_i)
 * n in particles per volume, G in 1/s, t in s, K_A dimensionless, K_B in s. With
 * x_i = K_A G_i t_i and r_i = K_B G_i / K_A the same recursion reads, for f_i = n_i / n_0,
 *   f_i = f_{i-1} / (1 + x_i) + r_i x_i / (1 + x_i)
 * a weighted mean of f_{i-1} and r_i. So f stays in (0, 1] exactly when every r_i <= 1, that is
 * G_i <= K_A / K_B: above that the model's breakup outruns aggregation and would return more
 * primary particles than entered, and the engine refuses it.
 * For m equal compartments (x = K_A G T / m, q = (1 + x)^-m) the recursion sums to
 *   f_m = q + r (1 - q)
 * which is the papers' closed form
 *   n_0 / n_m = (1 + x)^m / [1 + K_B G^2 (T/m) sum_{i=0}^{m-1} (1 + x)^i]
 * rearranged (sum the geometric series and divide through by (1 + x)^m) so that it cannot
 * overflow for large G T.
 */

void
bw_floc_kinetics_init (BwFlocKinetics *kinetics)
{
  g_return_if_fail (kinetics != NULL);

  kinetics->aggregation_constant = BW_FLOCMODEL_DEFAULT_KA;
  kinetics->breakup_constant_s = BW_FLOCMODEL_DEFAULT_KB_S;
}

static gboolean
check_kinetics (const BwFlocKinetics *k, GError **error)
{
  return bw_check_positive (k->aggregation_constant, BW_ ("aggregation constant"), error)
         && bw_check_nonnegative (k->breakup_constant_s, BW_ ("breakup constant"), error);
}

static gboolean
check_compartments (guint m, GError **error)
{
  if (m >= 1 && m <= BW_FLOCMODEL_MAX_COMPARTMENTS)
    return TRUE;
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
               BW_ ("compartments: %u is outside the valid range 1 to %u"), m,
               BW_FLOCMODEL_MAX_COMPARTMENTS);
  return FALSE;
}

/* G must be positive and at most K_A / K_B (see above). INDEX > 0 names a compartment. */
static gboolean
check_gradient (const BwFlocKinetics *k, double g, guint index, GError **error)
{
  g_autofree char *where = index > 0 ? g_strdup_printf (" in compartment %u", index) : NULL;

  if (!bw_check_positive (g, BW_ ("velocity gradient"), error))
    return FALSE;
  if (k->breakup_constant_s * g > k->aggregation_constant)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("velocity gradient: %g 1/s%s is above K_A/K_B = %g 1/s, where the model's "
                   "breakup outruns aggregation and would return more primary particles than "
                   "entered"), g, where ? where : "",
                   k->aggregation_constant / k->breakup_constant_s);
      return FALSE;
    }
  return TRUE;
}

static gboolean
finish (double fraction, guint m, double total_time_s, double gt, BwFlocModelResult *out,
        GError **error)
{
  if (!(fraction >= DBL_MIN) || !isfinite (gt) || !isfinite (total_time_s))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("time: the model leaves a fraction of primary particles too small to "
                   "represent (G t is far beyond any flocculator)"));
      return FALSE;
    }
  out->remaining_fraction = fraction;
  out->n0_over_nm = 1.0 / fraction;
  out->n_compartments = m;
  out->total_time_s = total_time_s;
  out->Gt = gt;
  return TRUE;
}

/* Remaining fraction of M equal compartments (valid inputs), by the closed form above. */
static double
equal_fraction (const BwFlocKinetics *k, double g, double total_time_s, guint m)
{
  const double x = k->aggregation_constant * g * total_time_s / m;
  const double q = exp (-(double) m * log1p (x));
  const double r = k->breakup_constant_s * g / k->aggregation_constant;

  return q + r * (1.0 - q);
}

gboolean
bw_flocmodel_equal (const BwFlocKinetics *kinetics, double G_per_s, double total_time_s,
                    guint n_compartments, BwFlocModelResult *out, GError **error)
{
  g_return_val_if_fail (kinetics != NULL && out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!check_kinetics (kinetics, error) || !check_compartments (n_compartments, error)
      || !check_gradient (kinetics, G_per_s, 0, error)
      || !bw_check_positive (total_time_s, BW_ ("time"), error))
    return FALSE;
  return finish (equal_fraction (kinetics, G_per_s, total_time_s, n_compartments),
                 n_compartments, total_time_s, G_per_s * total_time_s, out, error);
}

gboolean
bw_flocmodel_series (const BwFlocKinetics *kinetics, guint n_compartments, const double *G_per_s,
                     const double *time_s, double *fractions_out, BwFlocModelResult *out,
                     GError **error)
{
  double f = 1.0, total = 0.0, gt = 0.0;

  g_return_val_if_fail (kinetics != NULL && out != NULL, FALSE);
  g_return_val_if_fail (G_per_s != NULL && time_s != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!check_kinetics (kinetics, error) || !check_compartments (n_compartments, error))
    return FALSE;
  for (guint i = 0; i < n_compartments; i++)
    {
      if (!check_gradient (kinetics, G_per_s[i], i + 1, error))
        return FALSE;
      if (!bw_check_positive (time_s[i], BW_ ("time"), error))
        {
          g_prefix_error (error, BW_ ("compartment %u "), i + 1);
          return FALSE;
        }
    }

  for (guint i = 0; i < n_compartments; i++)
    {
      const double x = kinetics->aggregation_constant * G_per_s[i] * time_s[i];
      const double r = kinetics->breakup_constant_s * G_per_s[i] / kinetics->aggregation_constant;

      f = (f + r * x) / (1.0 + x); /* the recursion in its weighted-mean form */
      total += time_s[i];
      gt += G_per_s[i] * time_s[i];
      if (fractions_out != NULL)
        fractions_out[i] = f;
    }
  return finish (f, n_compartments, total, gt, out, error);
}

gboolean
bw_flocmodel_best_gradient (const BwFlocKinetics *kinetics, double total_time_s,
                            guint n_compartments, double *out_G_per_s, BwFlocModelResult *out,
                            GError **error)
{
  const double inv_phi = (sqrt (5.0) - 1.0) / 2.0;
  double a, b, c, d, fc, fd, g_max;
  int i;

  g_return_val_if_fail (kinetics != NULL && out_G_per_s != NULL && out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!check_kinetics (kinetics, error) || !check_compartments (n_compartments, error)
      || !bw_check_positive (total_time_s, BW_ ("time"), error))
    return FALSE;
  if (!(kinetics->breakup_constant_s > 0.0))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("breakup constant: with no breakup (K_B = 0) more G always leaves fewer "
                   "primary particles, so there is no best G"));
      return FALSE;
    }

  /* f = 1 at G -> 0 and again at G = K_A / K_B, below 1 in between: a golden-section search
   * on ln G between the two finds the minimum (one minimum: checked by scanning in the tests). */
  g_max = kinetics->aggregation_constant / kinetics->breakup_constant_s;
  if (!isfinite (g_max))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("breakup constant: %g s is too small against K_A = %g"),
                   kinetics->breakup_constant_s, kinetics->aggregation_constant);
      return FALSE;
    }
  a = log (g_max * BEST_G_SPAN);
  b = log (g_max);
  c = b - inv_phi * (b - a);
  d = a + inv_phi * (b - a);
  fc = equal_fraction (kinetics, exp (c), total_time_s, n_compartments);
  fd = equal_fraction (kinetics, exp (d), total_time_s, n_compartments);
  for (i = 0; i < GOLDEN_MAX_ITERATIONS && b - a > GOLDEN_REL_TOLERANCE; i++)
    {
      if (fc < fd)
        {
          b = d;
          d = c;
          fd = fc;
          c = b - inv_phi * (b - a);
          fc = equal_fraction (kinetics, exp (c), total_time_s, n_compartments);
        }
      else
        {
          a = c;
          c = d;
          fc = fd;
          d = a + inv_phi * (b - a);
          fd = equal_fraction (kinetics, exp (d), total_time_s, n_compartments);
        }
    }
  if (b - a > GOLDEN_REL_TOLERANCE)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NO_CONVERGENCE,
                   BW_ ("velocity gradient: the search for the best G did not converge"));
      return FALSE;
    }
  *out_G_per_s = exp ((a + b) / 2.0);
  return bw_flocmodel_equal (kinetics, *out_G_per_s, total_time_s, n_compartments, out, error);
}
