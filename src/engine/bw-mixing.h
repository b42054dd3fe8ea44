/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-mixing.h: rapid mix: velocity gradient G, impeller power, mechanical and hydraulic mixers. */
#pragma once

#include <glib.h>

#include "engine/bw-water.h"

G_BEGIN_DECLS

/* Impeller Reynolds number below which the turbulent power numbers are no longer constant
 * (common practice, no source: the usual "fully turbulent above 10^4"). */
#define BW_IMPELLER_TURBULENT_RE 1.0e4

/* Impellers whose turbulent, fully baffled power number the engine knows. */
typedef enum
{
  BW_IMPELLER_RUSHTON,          /* radial-flow disc turbine, six flat blades */
  BW_IMPELLER_PITCHED_BLADE_45, /* four flat blades pitched at 45 degrees, axial flow */
  BW_IMPELLER_HYDROFOIL,        /* three-blade hydrofoil, axial flow */
  BW_N_IMPELLER_KINDS
} BwImpellerKind;

/* Soft cautions: the result is computed, but a reviewer should look. Bit flags. */
typedef enum
{
  BW_MIX_WARNING_NONE = 0,
  BW_MIX_WARNING_LOW_REYNOLDS = 1 << 0, /* impeller Re < BW_IMPELLER_TURBULENT_RE */
} BwMixWarning;

typedef struct
{
  BwImpellerKind kind;
  double power_number; /* > 0 replaces the library value; 0 takes the library value of KIND */
  double diameter_m;   /* m */
  double speed_rev_s;  /* rev/s */
} BwImpeller;

typedef struct
{
  double power_number;  /* the power number used */
  double power_W;       /* power delivered to the water, W */
  double reynolds;      /* impeller Reynolds number rho N D^2 / mu */
  double tip_speed_m_s; /* pi N D, m/s */
  guint warnings;       /* BwMixWarning flags */
} BwImpellerResult;

/* The library's turbulent, fully baffled power number of KIND (see bw-mixing.c for sources), or
 * 0 for a value outside the enumeration. */
double bw_impeller_library_power_number (BwImpellerKind kind);
/* "rushton", "pitched-blade-45", "hydrofoil" */
const char *bw_impeller_kind_name (BwImpellerKind kind);
gboolean bw_impeller_kind_from_name (const char *name, BwImpellerKind *out);

/* Power P = Np rho N^3 D^5, Reynolds number and tip speed of IMPELLER in WATER. BAFFLED says
 * whether the tank has wall baffles: without them the water swirls and vortexes, the library's
 * power numbers do not apply, and IMPELLER->power_number must be given (error naming "power
 * number"). */
gboolean bw_impeller_evaluate (const BwImpeller *impeller, gboolean baffled, const BwWater *water,
                               BwImpellerResult *out, GError **error);

/* The rotational speed (rev/s) at which IMPELLER delivers POWER_W to the water (closed form,
 * N = (P / (Np rho D^5))^(1/3)). IMPELLER->speed_rev_s is ignored. */
gboolean bw_impeller_speed_for_power (const BwImpeller *impeller, gboolean baffled,
                                      const BwWater *water, double power_W,
                                      double *out_speed_rev_s, GError **error);

/* Camp & Stein (1943): G = sqrt (P / (mu V)), 1/s, for POWER_W (W) dissipated in VOLUME_M3 (m3). */
gboolean bw_velocity_gradient (double power_W, double volume_m3, const BwWater *water,
                               double *out_G_per_s, GError **error);

/* The inverse: P = mu V G^2, W. */
gboolean bw_power_for_velocity_gradient (double G_per_s, double volume_m3, const BwWater *water,
                                         double *out_power_W, GError **error);

/* --- mechanical back-mix (rapid-mix) tank --- */

typedef enum
{
  BW_TANK_SQUARE,      /* square in plan: WIDTH_M is the side */
  BW_TANK_CYLINDRICAL, /* round: WIDTH_M is the diameter */
  BW_N_TANK_SHAPES
} BwTankShape;

typedef struct
{
  BwTankShape shape;
  double width_m;          /* side of a square tank or diameter of a round one, m */
  double liquid_depth_m;   /* m */
  gboolean baffled;        /* wall baffles fitted (the library power numbers need them) */
  double flow_m3_s;        /* flow through this one tank, m3/s */
  BwImpeller impeller;
  double drive_efficiency; /* water power / motor power, 0 < e <= 1 */
} BwRapidMixTank;

typedef struct
{
  double volume_m3;     /* liquid volume (the impeller's own volume neglected), m3 */
  double detention_s;   /* V / Q, s */
  BwImpellerResult impeller;
  double water_power_W; /* power delivered to the water, W */
  double motor_power_W; /* water power / drive efficiency, W */
  double G_per_s;       /* from the water power, 1/s */
  double Gt;            /* G x detention, dimensionless */
  guint warnings;       /* BwMixWarning flags */
} BwRapidMixResult;

gboolean bw_rapid_mix_evaluate (const BwRapidMixTank *tank, const BwWater *water,
                                BwRapidMixResult *out, GError **error);

/* The impeller speed (rev/s) giving TARGET_G_PER_S from the water power P = mu V G^2 (closed
 * form). TANK->impeller.speed_rev_s is ignored. */
gboolean bw_rapid_mix_speed_for_gradient (const BwRapidMixTank *tank, const BwWater *water,
                                          double target_G_per_s, double *out_speed_rev_s,
                                          GError **error);

/* --- hydraulic (in-line, weir, baffled) mixing from a head loss --- */

typedef struct
{
  double power_W;     /* rho g Q h, W */
  double detention_s; /* V / Q, s */
  double G_per_s;     /* sqrt (rho g h Q / (mu V)), 1/s */
  double Gt;          /* dimensionless */
} BwHydraulicResult;

/* Camp & Stein (1943): HEADLOSS_M (m of water) lost by FLOW_M3_S (m3/s) while it passes through
 * VOLUME_M3 (m3) of water gives G = sqrt (rho g h Q / (mu V)) = sqrt (g h / (nu t)). */
gboolean bw_hydraulic_mixer_evaluate (double headloss_m, double flow_m3_s, double volume_m3,
                                      const BwWater *water, BwHydraulicResult *out,
                                      GError **error);

/* The inverse: the head loss (m) giving TARGET_G_PER_S, h = mu V G^2 / (rho g Q). */
gboolean bw_hydraulic_headloss_for_gradient (double target_G_per_s, double flow_m3_s,
                                             double volume_m3, const BwWater *water,
                                             double *out_headloss_m, GError **error);

G_END_DECLS
