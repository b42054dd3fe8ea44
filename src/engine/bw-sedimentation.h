/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-sedimentation.h: settling basins: rectangular horizontal-flow basins, circular clarifiers,
 * inclined plate and tube settlers, Camp's scour velocity, and the inverse sizing solves. */
#pragma once

#include <glib.h>

#include "engine/bw-water.h"

G_BEGIN_DECLS

/* Recommended limits for the settling zone of a horizontal-flow basin, on the hydraulic radius of
 * the flow-through section: Re < 20 000 and Fr > 1e-5 (Davis 2010, Ch. 10, after Kawamura 2000). */
#define BW_BASIN_REYNOLDS_MAX 20000.0
#define BW_BASIN_FROUDE_MIN 1.0e-5

/* Channel Reynolds number of a tube or plate settler, on the channel's hydraulic radius: below 50
 * (Davis 2010, Ch. 10 tube-settler example, p. 10-37); the Froude limit is the basin's 1e-5. */
#define BW_SETTLER_REYNOLDS_MAX 50.0

/* Camp's scour constants when the user gives none: k = 0.05 (within 0.04 for unigranular sand to
 * 0.06 for sticky material) and Darcy-Weisbach f = 0.025 (0.02-0.03) (Camp 1946, as tabulated in
 * Metcalf & Eddy; from memory). */
#define BW_SCOUR_DEFAULT_COHESION 0.05
#define BW_SCOUR_DEFAULT_FRICTION 0.025

/* Soft cautions: the design is computable but outside a recommended range. Bit flags in the
 * results' `cautions` member. */
typedef enum
{
  BW_SED_CAUTION_REYNOLDS_HIGH = 1 << 0, /* Re at or above the limit above */
  BW_SED_CAUTION_FROUDE_LOW = 1 << 1,    /* Fr at or below 1e-5 */
  BW_SED_CAUTION_SCOUR = 1 << 2,         /* horizontal velocity reaches Camp's scour velocity */
} BwSedCaution;

/* --- Camp's scour velocity --- */

typedef struct
{
  double diameter_m;       /* m, particle resting on the sludge bed */
  double specific_gravity; /* particle density / water density, > 1 */
  double cohesion_k;       /* Camp's k, dimensionless, 0 < k <= 1 */
  double friction_f;       /* Darcy-Weisbach friction factor of the bed, 0 < f <= 1 */
} BwScourParticle;

/* Fills P with the default k and f and the given particle. */
void bw_scour_particle_init (BwScourParticle *p, double diameter_m, double specific_gravity);

/* Horizontal velocity that starts to scour P off the bed, m/s, at GRAVITY_M_S2 (m/s2). */
gboolean bw_scour_velocity (const BwScourParticle *p, double gravity_m_s2, double *out_m_s,
                            GError **error);

/* --- rectangular horizontal-flow basin --- */

typedef enum
{
  BW_INLET_PERFORATED_BAFFLE, /* perforated baffle wall across the inlet end */
  BW_INLET_BAFFLE,            /* solid inlet baffle (target baffle) */
  BW_INLET_NONE,
} BwInletKind;

typedef struct
{
  double length_m;      /* m, settling zone, inlet to outlet */
  double width_m;       /* m */
  double depth_m;       /* m, side water depth */
  guint n_basins;       /* basins in service; the flow splits equally, >= 1 */
  BwInletKind inlet;    /* carried for drawings and criteria; no hydraulics */
  double weir_length_m; /* m, total weir crest length per basin (see bw_launder_weir_length);
                         * 0 = not given, no weir loading */
  gboolean check_scour; /* evaluate Camp's scour velocity for SCOUR */
  BwScourParticle scour;
} BwRectBasin;

typedef struct
{
  double flow_per_basin_m3_s;     /* m3/s */
  double surface_area_m2;         /* m2, L W */
  double volume_m3;               /* m3, L W H */
  double overflow_rate_m_s;       /* m/s, Q / (L W) */
  double detention_s;             /* s, V / Q */
  double horizontal_velocity_m_s; /* m/s, Q / (W H) */
  gboolean has_weir_loading;
  double weir_loading_m2_s;       /* m3/(m s), Q / L_weir; 0 unless has_weir_loading */
  double length_width_ratio;
  double width_depth_ratio;
  double hydraulic_radius_m;      /* m, W H / (W + 2 H) */
  double reynolds;                /* v_h R_h / nu */
  double froude;                  /* v_h^2 / (g R_h) */
  gboolean has_scour;
  double scour_velocity_m_s;      /* m/s; 0 unless has_scour */
  double scour_margin;            /* scour velocity / horizontal velocity; 0 unless has_scour */
  guint cautions;                 /* BwSedCaution flags */
} BwRectBasinResult;

/* One basin in service, perforated baffle inlet, no weir length, no scour check, default k, f. */
void bw_rect_basin_init (BwRectBasin *basin);

/* Evaluates BASIN at the total plant flow FLOW_M3_S (m3/s, split over the basins in service), in
 * WATER (for the kinematic viscosity). Allocates nothing. */
gboolean bw_rect_basin_evaluate (const BwRectBasin *basin, double flow_m3_s, const BwWater *water,
                                 BwRectBasinResult *out, GError **error);

/* The arithmetic of bw_rect_basin_evaluate without its checks, for hot loops (auto-size): B, the
 * flow and WATER must be ones bw_rect_basin_evaluate accepts, and SCOUR_VELOCITY_M_S the value of
 * bw_scour_velocity for B->scour (used when B->check_scour). Allocates nothing. */
void bw_rect_basin_compute (const BwRectBasin *b, double flow_m3_s, const BwWater *water,
                            double scour_velocity_m_s, BwRectBasinResult *out);

/* Total weir crest length of N_LAUNDERS launders of LAUNDER_LENGTH_M (m) each, counting both edges
 * of each launder when DOUBLE_SIDED (water spills in over both), plus END_WEIR_M (m) of weir on the
 * end wall (0 for none). */
gboolean bw_launder_weir_length (guint n_launders, double launder_length_m, gboolean double_sided,
                                 double end_weir_m, double *out_m, GError **error);

const char *bw_inlet_kind_name (BwInletKind kind); /* "perforated-baffle", "inlet-baffle", "none" */
gboolean bw_inlet_kind_from_name (const char *name, BwInletKind *out);

/* --- circular clarifier --- */

typedef enum
{
  BW_LAUNDER_PERIPHERAL, /* single weir on a circle at the wall, or inset from it */
  BW_LAUNDER_INBOARD,    /* ring launder inside the tank with weirs on both edges */
} BwLaunderKind;

typedef struct
{
  double diameter_m;           /* m, inside diameter */
  double depth_m;              /* m, side water depth (a flat floor is assumed) */
  guint n_clarifiers;          /* in service, >= 1 */
  double feed_well_diameter_m; /* m, centre (feed) well; 0 = none */
  double feed_well_depth_m;    /* m, feed-well skirt depth below the surface; 0 = not given */
  BwLaunderKind launder;
  double launder_inset_m;      /* m, peripheral: weir circle's inset from the wall (0 = on it) */
  double launder_radius_m;     /* m, inboard: radius of the ring launder, both weirs taken there */
} BwClarifier;

typedef struct
{
  double flow_per_clarifier_m3_s;  /* m3/s */
  double gross_area_m2;            /* m2, pi D^2 / 4 */
  double surface_area_m2;          /* m2, net of the feed well: the settling surface */
  double volume_m3;                /* m3, gross area x side water depth */
  double overflow_rate_m_s;        /* m/s, Q / net area */
  double gross_overflow_rate_m_s;  /* m/s, Q / gross area, as many texts quote it */
  double detention_s;              /* s, V / Q */
  double weir_length_m;            /* m */
  double weir_loading_m2_s;        /* m3/(m s) */
  gboolean has_skirt_velocity;
  double skirt_velocity_m_s;       /* m/s, outflow beneath the feed-well skirt; 0 unless has_ */
} BwClarifierResult;

/* No feed well, peripheral weir on the wall, one clarifier. */
void bw_clarifier_init (BwClarifier *c);

gboolean bw_clarifier_evaluate (const BwClarifier *c, double flow_m3_s, BwClarifierResult *out,
                                GError **error);

/* --- inclined plate and tube settlers --- */

typedef enum
{
  BW_SETTLER_PLATES,
  BW_SETTLER_CIRCULAR_TUBES,
  BW_SETTLER_SQUARE_TUBES,
} BwSettlerShape;

/* Yao's critical value S_c of the shape: 1 (parallel plates), 4/3 (circular tubes), 11/8 (square
 * tubes) (Yao 1970). Returns 0 for an unknown value. */
double bw_settler_shape_factor (BwSettlerShape shape);
const char *bw_settler_shape_name (BwSettlerShape shape); /* "plates", "circular-tubes", ... */
gboolean bw_settler_shape_from_name (const char *name, BwSettlerShape *out);

typedef struct
{
  double critical_velocity_m_s; /* m/s, the slowest particle fully removed */
  double shape_factor;          /* S_c */
  double relative_length;       /* L = l / w */
} BwYaoResult;

/* Yao's critical settling velocity for channels of SHAPE inclined at ANGLE_RAD (rad, from the
 * horizontal, 0 < angle < pi/2), perpendicular spacing (or tube diameter or side) SPACING_M (m),
 * length along the incline LENGTH_M (m), with mean channel velocity CHANNEL_VELOCITY_M_S (m/s). */
gboolean bw_yao_critical_velocity (BwSettlerShape shape, double channel_velocity_m_s,
                                   double angle_rad, double spacing_m, double length_m,
                                   BwYaoResult *out, GError **error);

/* Hydraulic radius (area / wetted perimeter) of one channel, m: w b / (2 (w + b)) between plates
 * of width PLATE_WIDTH_M closed by side walls, w / 2 when PLATE_WIDTH_M is 0 (plates of unlimited
 * width), d / 4 for a circular tube and w / 4 for a square tube (PLATE_WIDTH_M ignored). */
gboolean bw_settler_hydraulic_radius (BwSettlerShape shape, double spacing_m, double plate_width_m,
                                      double *out_m, GError **error);

typedef struct
{
  BwSettlerShape shape;
  double angle_rad;           /* rad, from the horizontal */
  double spacing_m;           /* m, perpendicular clear spacing; tube inside diameter or side */
  double length_m;            /* m, along the incline */
  double plate_width_m;       /* m, plates: width across the flow; 0 = unlimited (plan mode only) */
  guint count;                /* plates or tubes in service per basin; 0 = use the plan area */
  double module_plan_area_m2; /* m2 per basin covered by the modules, when COUNT is 0 */
  guint n_basins;             /* basins in service, >= 1 */
} BwSettler;

typedef struct
{
  double flow_per_basin_m3_s;  /* m3/s */
  double channel_area_m2;      /* m2, total channel cross-section normal to the incline */
  double channel_velocity_m_s; /* m/s, v0 */
  double projected_area_m2;    /* m2, settling surfaces projected on the horizontal */
  double projected_loading_m_s;/* m/s, Q / projected area */
  double relative_length;      /* l / w */
  double shape_factor;         /* S_c */
  double critical_velocity_m_s;/* m/s, Yao */
  double hydraulic_radius_m;   /* m, of one channel */
  double reynolds;             /* v0 R_h / nu */
  double froude;               /* v0^2 / (g R_h) */
  guint cautions;              /* BwSedCaution flags, settler limits */
} BwSettlerResult;

/* Plates, 60 degrees, no count or area yet, one basin. */
void bw_settler_init (BwSettler *s, BwSettlerShape shape);

gboolean bw_settler_evaluate (const BwSettler *s, double flow_m3_s, const BwWater *water,
                              BwSettlerResult *out, GError **error);

/* --- inverse solves --- */

/* Surface area per basin for a target overflow rate: A = Q / (n v0), m2. */
gboolean bw_basin_area_for_overflow (double flow_m3_s, guint n_basins, double overflow_rate_m_s,
                                     double *area_m2, GError **error);

/* Width and length of each basin with the given length/width ratio for a target overflow rate. */
gboolean bw_basin_size_for_overflow (double flow_m3_s, guint n_basins, double overflow_rate_m_s,
                                     double length_width_ratio, double *width_m, double *length_m,
                                     GError **error);

/* Smallest whole number of basins of AREA_PER_BASIN_M2 each whose overflow rate does not exceed
 * the target. At most 10 000. */
gboolean bw_basin_count_for_overflow (double flow_m3_s, double area_per_basin_m2,
                                      double overflow_rate_m_s, guint *n_basins, GError **error);

/* Weir crest length per basin for a target weir loading (m3/(m s)): L = Q / (n q_w), m. */
gboolean bw_weir_length_for_loading (double flow_m3_s, guint n_basins, double weir_loading_m2_s,
                                     double *length_m, GError **error);

/* Smallest whole count of plates or tubes per basin (S->count is ignored) for which the loading on
 * AREA_FRACTION (0 < f <= 1; e.g. 0.8 where a standard credits 80 % of the projected area) of the
 * projected area does not exceed LOADING_M_S. At most 10 000 000. */
gboolean bw_settler_count_for_loading (const BwSettler *s, double flow_m3_s, double loading_m_s,
                                       double area_fraction, guint *count, GError **error);

G_END_DECLS
