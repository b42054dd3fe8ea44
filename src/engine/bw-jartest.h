/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-jartest.h: jar-test series: a smooth dose-response curve, the optimum and target doses, and
 * the destabilised window from zeta potential. */
#pragma once

#include <glib.h>

#include "engine/bw-water.h"
#include "engine/bw-zeta.h"

G_BEGIN_DECLS

#define BW_JAR_MAX 64

/* |zeta| below which particles count as destabilised, V: 10 mV (common practice, no source; many
 * texts give a band of about +-5 to +-10 mV around zero for good coagulation). */
#define BW_ZETA_DESTABILISED_DEFAULT_V 0.010

typedef struct
{
  double dose_kg_m3;      /* coagulant dose, kg/m3 */
  double turbidity_NTU;   /* settled turbidity */
  double ph;              /* when the series has pH */
  double zeta_V;          /* V, measured or converted from the mobility */
  double mobility_m2_V_s; /* when the series has mobility */
} BwJar;

typedef struct
{
  guint n_jars;
  BwJar jars[BW_JAR_MAX];
  gboolean has_ph, has_zeta, has_mobility;
} BwJarSeries;

typedef struct
{
  double optimum_dose_kg_m3;     /* least settled turbidity on the curve */
  double optimum_turbidity_NTU;
  gboolean has_target;
  double target_dose_kg_m3;      /* least dose whose curve value reaches the target */
  gboolean has_window;
  double window_low_kg_m3, window_high_kg_m3; /* where |zeta| <= threshold */
} BwJarResult;

/* Checks the series: at least three jars, doses non-negative and distinct, turbidities finite and
 * non-negative; sorts the jars by dose. */
gboolean bw_jar_series_prepare (BwJarSeries *s, GError **error);

/* Converts a mobility column to zeta potential in WATER with MODEL (Henry needs radius and ionic
 * strength; see bw_zeta_from_mobility). */
gboolean bw_jar_series_zeta_from_mobility (BwJarSeries *s, BwZetaModel model, double radius_m,
                                           double ionic_strength_mol_m3, const BwWater *water,
                                           GError **error);

/* The smooth dose-response curve at DOSE_KG_M3: a monotone piecewise cubic Hermite interpolant
 * through the jars (Fritsch & Carlson 1980, SIAM J. Numer. Anal. 17:238). It passes through every
 * jar and never overshoots between them, so it invents no turbidity lower than measured. Outside
 * the doses tested it is held at the end values. S must be prepared. */
double bw_jar_curve (const BwJarSeries *s, double dose_kg_m3);

/* TARGET_NTU < 0: no target. THRESHOLD_V: |zeta| limit for the window (> 0). */
gboolean bw_jar_analyse (const BwJarSeries *s, double target_NTU, double threshold_V,
                         BwJarResult *out, GError **error);

G_END_DECLS
