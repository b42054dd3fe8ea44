/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-settling.h: terminal settling velocity of a discrete sphere in water (Type I settling). */
#pragma once

#include <glib.h>

#include "engine/bw-water.h"

G_BEGIN_DECLS

typedef enum
{
  BW_DRAG_CLIFT_GAUVIN, /* Clift & Gauvin (1970), in Clift, Grace & Weber (1978) Table 5.2; default */
  BW_DRAG_DAVIS,        /* Cd = 24/Re + 3/sqrt(Re) + 0.34 (Davis 2010 Eq. 10-11) */
} BwDragCorrelation;

typedef enum
{
  BW_SETTLING_REGIME_STOKES,       /* Re < 1 */
  BW_SETTLING_REGIME_TRANSITIONAL, /* 1 <= Re < 1000 */
  BW_SETTLING_REGIME_NEWTON,       /* Re >= 1000 */
} BwSettlingRegime;

typedef struct
{
  double velocity_m_s;        /* terminal settling velocity, m/s */
  double reynolds;            /* particle Reynolds number rho_f v d / mu */
  double drag_coefficient;    /* Cd at that Reynolds number */
  BwSettlingRegime regime;
  double stokes_velocity_m_s; /* Stokes' law velocity, for comparison, m/s */
  int iterations;             /* solver iterations used (0 when Stokes' law was used directly) */
} BwSettlingResult;

/* Settling of a sphere of DIAMETER_M (m) and SPECIFIC_GRAVITY (particle density / water density at
 * the same temperature) in water at TEMPERATURE_K. Domain: 0.5 um - 5 mm, SG 1.005 - 3 (wider values
 * are accepted while the correlation stays valid), 0-40 degC. */
gboolean bw_settling_velocity (double diameter_m, double specific_gravity, double temperature_K,
                               BwDragCorrelation drag, BwSettlingResult *out, GError **error);

/* The same in an arbitrary Newtonian fluid: particle and fluid densities (kg/m3), dynamic viscosity
 * (Pa s) and gravity (m/s2) given directly. Used for textbook examples with rounded properties. */
gboolean bw_settling_velocity_in_fluid (double diameter_m, double particle_density_kg_m3,
                                        double fluid_density_kg_m3, double viscosity_Pa_s,
                                        double gravity_m_s2, BwDragCorrelation drag,
                                        BwSettlingResult *out, GError **error);

/* Drag coefficient of a sphere at Reynolds number RE (> 0) by correlation DRAG. */
double bw_drag_coefficient (BwDragCorrelation drag, double re);

const char *bw_settling_regime_name (BwSettlingRegime regime);  /* "stokes", "transitional", "newton" */
const char *bw_drag_correlation_name (BwDragCorrelation drag);  /* "clift-gauvin", "davis" */
gboolean bw_drag_correlation_from_name (const char *name, BwDragCorrelation *out);

G_END_DECLS
