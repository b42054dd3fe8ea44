/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-water.c: density, viscosity and permittivity of liquid water at 101.325 kPa, 0-40 degC. */
#include "config.h"

#include "engine/bw-water.h"

#include <math.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"

/* Offset between the kelvin and the degree Celsius scales (ITS-90 definition), K. */
#define CELSIUS_ZERO_K 273.15

/* Round-off allowance on the domain ends, K: 0 degC typed in another unit may arrive as
 * 273.14999999999998 K. */
#define DOMAIN_SLACK_K 1e-9

/* Clamps TEMPERATURE_K (K) into the 0-40 degC domain. NaN maps to the lower end. The single
 * correlations use it so that they never return NaN or infinity; bw_water_properties refuses
 * out-of-range input before it gets here. */
static double
clamp_domain_K (double temperature_K)
{
  if (!(temperature_K >= BW_WATER_T_MIN_K))
    return BW_WATER_T_MIN_K;
  if (temperature_K > BW_WATER_T_MAX_K)
    return BW_WATER_T_MAX_K;
  return temperature_K;
}

/*
 * Density of air-free Standard Mean Ocean Water at 101.325 kPa, kg/m3.
 * Tanaka, M., Girard, G., Davis, R., Peuto, A. and Bignell, N. (2001), "Recommended table for the
 * density of water between 0 C and 40 C based on recent experimental reports", Metrologia 38,
 * 301-309: the recommended formula for SMOW, with the paper's coefficients a1..a5:
 *   rho = a5 [1 - (t + a1)^2 (t + a2) / (a3 (t + a4))],   t in degC (ITS-90).
 * Checked against IAPWS-95 at 101.325 kPa: within 0.0012 kg/m3 over 0-40 degC (tests/ref).
 */
double
bw_water_density (double temperature_K)
{
  const double a1 = -3.983035;   /* degC */
  const double a2 = 301.797;     /* degC */
  const double a3 = 522528.9;    /* degC^2 */
  const double a4 = 69.34881;    /* degC */
  const double a5 = 999.974950;  /* kg/m3 */
  double t = clamp_domain_K (temperature_K) - CELSIUS_ZERO_K;

  return a5 * (1.0 - (t + a1) * (t + a1) * (t + a2) / (a3 * (t + a4)));
}

/* Clamps X into [LO, HI]; NaN maps to LO. */
static double
clamp (double x, double lo, double hi)
{
  if (!(x >= lo))
    return lo;
  if (x > hi)
    return hi;
  return x;
}

/*
 * Dynamic viscosity of water, Pa s, from temperature (K) and density (kg/m3).
 * IAPWS R12-08 (2008), "Release on the IAPWS Formulation 2008 for the Viscosity of Ordinary
 * Water Substance"; Huber, M.L. et al. (2009), J. Phys. Chem. Ref. Data 38, 101-125.
 *   mu/mu* = mu0(Tb) * mu1(Tb, rhob) * mu2                                     (Eq. 10)
 *   mu0 = 100 sqrt(Tb) / sum_{i=0..3} H_i / Tb^i                                (Eq. 11)
 *   mu1 = exp[rhob sum_{i=0..5} (1/Tb - 1)^i sum_{j=0..6} H_ij (rhob - 1)^j]    (Eq. 12)
 * with Tb = T/T*, rhob = rho/rho*, T* = 647.096 K, rho* = 322 kg/m3, mu* = 1e-6 Pa s. The critical
 * enhancement mu2 is set to 1, as the release allows for industrial use away from the critical
 * point (it differs from 1 only near 647 K). Coefficients: the H_i and H_ij tables of R12-08.
 * The arguments are clamped into the formulation's range (253.15-1173.15 K, 0-1200 kg/m3; NaN to
 * the lower end) so that the result is always finite; that is a guard, not an extension.
 * Check value (R12-08, verification points with mu2 = 1): T = 298.15 K, rho = 998 kg/m3
 * -> 889.735100 uPa s.
 */
double
bw_water_viscosity_iapws2008 (double temperature_K, double density_kg_m3)
{
  static const double h0[4] = { 1.67752, 2.20462, 0.6366564, -0.241605 };
  /* H_ij, row i = 0..5, column j = 0..6 (R12-08; entries the release leaves blank are zero). */
  static const double h1[6][7] = {
    { 5.20094e-1, 2.22531e-1, -2.81378e-1, 1.61913e-1, -3.25372e-2, 0.0, 0.0 },
    { 8.50895e-2, 9.99115e-1, -9.06851e-1, 2.57399e-1, 0.0, 0.0, 0.0 },
    { -1.08374, 1.88797, -7.72479e-1, 0.0, 0.0, 0.0, 0.0 },
    { -2.89555e-1, 1.26613, -4.89837e-1, 0.0, 6.98452e-2, 0.0, -4.35673e-3 },
    { 0.0, 0.0, -2.57040e-1, 0.0, 0.0, 8.72102e-3, 0.0 },
    { 0.0, 1.20573e-1, 0.0, 0.0, 0.0, 0.0, -5.93264e-4 },
  };
  const double t_star = 647.096;  /* K */
  const double rho_star = 322.0;  /* kg/m3 */
  const double mu_star = 1.0e-6;  /* Pa s */
  double tb = clamp (temperature_K, 253.15, 1173.15) / t_star;
  double rb = clamp (density_kg_m3, 0.0, 1200.0) / rho_star;
  double inv_tb = 1.0 / tb;
  double denominator = 0.0;
  double outer = 0.0;
  double mu0, mu1;

  /* Eq. 11, Horner in 1/Tb. */
  for (int i = 3; i >= 0; i--)
    denominator = denominator * inv_tb + h0[i];
  mu0 = 100.0 * sqrt (tb) / denominator;

  /* Eq. 12, Horner in (1/Tb - 1) outside and (rhob - 1) inside. */
  for (int i = 5; i >= 0; i--)
    {
      double inner = 0.0;

      for (int j = 6; j >= 0; j--)
        inner = inner * (rb - 1.0) + h1[i][j];
      outer = outer * (inv_tb - 1.0) + inner;
    }
  mu1 = exp (rb * outer);

  return mu0 * mu1 * mu_star;
}

/* Dynamic viscosity at 101.325 kPa, Pa s: IAPWS 2008 (above) at the Tanaka (2001) density. */
double
bw_water_dynamic_viscosity (double temperature_K)
{
  double t = clamp_domain_K (temperature_K);

  return bw_water_viscosity_iapws2008 (t, bw_water_density (t));
}

/*
 * Static relative permittivity (dielectric constant) of water at 101.325 kPa, dimensionless.
 * Malmberg, C.G. and Maryott, A.A. (1956), "Dielectric constant of water from 0 to 100 C",
 * J. Res. Natl. Bur. Stand. 56(1), 1-8, their fitted cubic for 0-100 C:
 *   eps = 87.740 - 0.40008 t + 9.398e-4 t^2 - 1.410e-6 t^3,   t in degC.
 * It reads up to ~0.2 % below IAPWS R8-97 (87.740 against 87.903 at 0 degC, 0.07 % at 40 degC);
 * this engine uses Malmberg-Maryott throughout.
 */
double
bw_water_relative_permittivity (double temperature_K)
{
  double t = clamp_domain_K (temperature_K) - CELSIUS_ZERO_K;

  return 87.740 + t * (-0.40008 + t * (9.398e-4 + t * -1.410e-6));
}

gboolean
bw_water_properties (double temperature_K, BwWater *out, GError **error)
{
  double rho, mu;

  g_return_val_if_fail (out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!bw_check_finite (temperature_K, BW_ ("temperature"), error))
    return FALSE;
  if (temperature_K < BW_WATER_T_MIN_K - DOMAIN_SLACK_K
      || temperature_K > BW_WATER_T_MAX_K + DOMAIN_SLACK_K)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("temperature: %g °C is outside the valid range %g to %g °C "
                   "(liquid water at atmospheric pressure)"),
                   temperature_K - CELSIUS_ZERO_K, BW_WATER_T_MIN_K - CELSIUS_ZERO_K,
                   BW_WATER_T_MAX_K - CELSIUS_ZERO_K);
      return FALSE;
    }

  rho = bw_water_density (temperature_K);
  mu = bw_water_dynamic_viscosity (temperature_K);

  out->temperature_K = temperature_K;
  out->density_kg_m3 = rho;
  out->dynamic_viscosity_Pa_s = mu;
  out->kinematic_viscosity_m2_s = mu / rho;
  out->relative_permittivity = bw_water_relative_permittivity (temperature_K);
  return TRUE;
}

gboolean
bw_water_check (const BwWater *w, GError **error)
{
  g_return_val_if_fail (w != NULL, FALSE);
  if (!bw_check_positive (w->density_kg_m3, BW_ ("water density"), error))
    return FALSE;
  return bw_check_positive (w->dynamic_viscosity_Pa_s, BW_ ("water viscosity"), error);
}
