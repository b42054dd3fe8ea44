/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-water.h: properties of liquid water at atmospheric pressure, 0-40 degC. */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* Standard acceleration of gravity, m/s2 (CGPM 1901; NIST SP 811 Appendix B). */
#define BW_GRAVITY_M_S2 9.80665

/* Valid temperature domain of every water correlation here, kelvin (0-40 degC). */
#define BW_WATER_T_MIN_K 273.15
#define BW_WATER_T_MAX_K 313.15

typedef struct
{
  double temperature_K;           /* K */
  double density_kg_m3;           /* kg/m3 */
  double dynamic_viscosity_Pa_s;  /* Pa s */
  double kinematic_viscosity_m2_s;/* m2/s */
  double relative_permittivity;   /* dimensionless */
} BwWater;

/* Fills OUT for liquid water at TEMPERATURE_K (kelvin) and 101.325 kPa. Outside 0-40 degC it sets a
 * BW_ENGINE_ERROR_OUT_OF_RANGE error naming "temperature" and leaves OUT untouched. */
gboolean bw_water_properties (double temperature_K, BwWater *out, GError **error);

/* The single correlations, for tests and for callers that need only one. Each assumes its argument
 * was already range-checked (0-40 degC). */
double bw_water_density (double temperature_K);               /* kg/m3 */
double bw_water_dynamic_viscosity (double temperature_K);     /* Pa s */
double bw_water_relative_permittivity (double temperature_K); /* dimensionless */

/* IAPWS 2008 viscosity (R12-08, mu0 * mu1, critical enhancement mu2 = 1) at TEMPERATURE_K (K) and
 * DENSITY_KG_M3 (kg/m3), Pa s; bw_water_dynamic_viscosity evaluates it at the Tanaka density.
 * Arguments outside 253.15-1173.15 K and 0-1200 kg/m3 are clamped, so the result is finite. */
double bw_water_viscosity_iapws2008 (double temperature_K, double density_kg_m3);

/* The water must be a real liquid: positive, finite density and viscosity. Models call it on
 * what they are given (bw_water_properties output, or rounded textbook properties in tests). */
gboolean bw_water_check (const BwWater *w, GError **error);

G_END_DECLS
