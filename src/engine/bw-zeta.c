/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-zeta.c: zeta potential from electrophoretic mobility (Smoluchowski, Hückel, Henry with
 * Ohshima's approximation) and the Debye length. */
#include "config.h"

#include "engine/bw-zeta.h"

#include <math.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"

static const char *const model_names[] = { "smoluchowski", "huckel", "henry" };

const char *
bw_zeta_model_name (BwZetaModel m)
{
  g_return_val_if_fail (m <= BW_ZETA_HENRY, "unknown");
  return model_names[m];
}

gboolean
bw_zeta_model_from_name (const char *name, BwZetaModel *out)
{
  for (int i = 0; i < 3; i++)
    if (g_strcmp0 (model_names[i], name) == 0)
      {
        *out = (BwZetaModel) i;
        return TRUE;
      }
  return FALSE;
}

gboolean
bw_debye_length (double ionic_strength_mol_m3, const BwWater *water, double *out_m, GError **error)
{
  double num, den;

  g_return_val_if_fail (water != NULL && out_m != NULL, FALSE);
  if (!bw_check_positive (ionic_strength_mol_m3, BW_ ("ionic strength"), error)
      || !bw_check_range (ionic_strength_mol_m3, 0, 5000, BW_ ("ionic strength"), "mol/m³", error)
      || !bw_water_check (water, error))
    return FALSE;
  /* eps_r eps_0 k T (J/m . F/J...) over 2 N_A e^2 I: SI throughout, I in mol/m3. */
  num = water->relative_permittivity * BW_EPSILON_0 * BW_BOLTZMANN * water->temperature_K;
  den = 2.0 * BW_AVOGADRO * BW_ELEMENTARY_CHARGE * BW_ELEMENTARY_CHARGE * ionic_strength_mol_m3;
  *out_m = sqrt (num / den);
  return TRUE;
}

double
bw_henry_function (double kappa_a)
{
  double inner;

  if (!(kappa_a > 0) || !isfinite (kappa_a))
    return kappa_a > 0 ? 1.5 : 1.0; /* the limits: infinite ka -> Smoluchowski, 0 -> Hückel */
  inner = 1.0 + 2.5 / (kappa_a * (1.0 + 2.0 * exp (-kappa_a)));
  return 1.0 + 1.0 / (2.0 * inner * inner * inner);
}

gboolean
bw_zeta_from_mobility (double mobility_m2_V_s, BwZetaModel model, double radius_m,
                       double ionic_strength_mol_m3, const BwWater *water, BwZetaResult *out,
                       GError **error)
{
  BwZetaResult r = { 0 };
  double f;

  g_return_val_if_fail (water != NULL && out != NULL, FALSE);
  if (!bw_check_finite (mobility_m2_V_s, BW_ ("mobility"), error)
      || !bw_check_range (fabs (mobility_m2_V_s), 0, 1e-6, BW_ ("mobility"), "m²/(V·s)", error)
      || !bw_water_check (water, error) || !bw_check_nonnegative (radius_m, BW_ ("radius"), error)
      || !bw_check_nonnegative (ionic_strength_mol_m3, BW_ ("ionic strength"), error))
    return FALSE;
  if (radius_m > 0.01)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("radius: %g m is not a colloid (at most 1 cm)"), radius_m);
      return FALSE;
    }
  if (ionic_strength_mol_m3 > 0)
    {
      if (!bw_debye_length (ionic_strength_mol_m3, water, &r.debye_length_m, error))
        return FALSE;
      r.has_debye = TRUE;
      if (radius_m > 0)
        r.kappa_a = radius_m / r.debye_length_m;
    }
  switch (model)
    {
    case BW_ZETA_SMOLUCHOWSKI:
      f = 1.5;
      break;
    case BW_ZETA_HUCKEL:
      f = 1.0;
      break;
    case BW_ZETA_HENRY:
      if (radius_m <= 0 || ionic_strength_mol_m3 <= 0)
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                       BW_ ("%s: Henry's function needs the particle radius and the ionic strength"),
                       radius_m <= 0 ? BW_ ("radius") : BW_ ("ionic strength"));
          return FALSE;
        }
      f = bw_henry_function (r.kappa_a);
      break;
    default:
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, BW_ ("model: unknown"));
      return FALSE;
    }
  /* Henry (1931): U = 2 eps_r eps_0 zeta f / (3 eta) -> zeta = 3 eta U / (2 eps_r eps_0 f); with
   * f = 1.5 this is Smoluchowski's zeta = eta U / (eps_r eps_0). U m2/(V s), eta Pa s -> zeta V. */
  r.henry_function = f;
  r.zeta_V = 3.0 * water->dynamic_viscosity_Pa_s * mobility_m2_V_s
             / (2.0 * water->relative_permittivity * BW_EPSILON_0 * f);
  if (!bw_check_result (r.zeta_V, BW_ ("mobility"), BW_ ("zeta potential"), error))
    return FALSE;
  *out = r;
  return TRUE;
}
