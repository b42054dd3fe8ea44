/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-removal.h: what a settling basin removes: ideal (Camp) and Hazen basins for one settling
 * velocity, Type I removal of a particle size distribution, and Type II (flocculent) removal from
 * settling-column data by the iso-removal method. */
#pragma once

#include <glib.h>

#include "engine/bw-settling.h"
#include "engine/bw-water.h"

G_BEGIN_DECLS

/* --- one settling velocity --- */

typedef enum
{
  BW_BASIN_MODEL_IDEAL, /* Camp (1946): min (1, vs / v0) */
  BW_BASIN_MODEL_HAZEN, /* Hazen (1904): 1 - (1 + vs / (n v0))^-n */
} BwBasinModelKind;

/* Accepted range of Hazen's performance index n. */
#define BW_HAZEN_N_MIN 1.0
#define BW_HAZEN_N_MAX 1.0e9

typedef struct
{
  BwBasinModelKind kind;
  double hazen_n; /* Hazen's basin performance index, for BW_BASIN_MODEL_HAZEN */
} BwBasinModel;

/* Fraction removed (0-1) of particles settling at SETTLING_VELOCITY_M_S (m/s, >= 0) in an ideal
 * basin at surface overflow rate OVERFLOW_RATE_M_S (m/s, > 0). */
gboolean bw_removal_ideal (double settling_velocity_m_s, double overflow_rate_m_s, double *out,
                           GError **error);

/* The same in Hazen's basin of performance index HAZEN_N (1 very poor ... larger is better). As n
 * grows the removal rises toward 1 - exp (-vs / v0), which is below Camp's min (1, vs / v0): the
 * ideal basin bounds every Hazen curve from above. */
gboolean bw_removal_hazen (double settling_velocity_m_s, double overflow_rate_m_s, double hazen_n,
                           double *out, GError **error);

/* Either, by MODEL. */
gboolean bw_removal_fraction (const BwBasinModel *model, double settling_velocity_m_s,
                              double overflow_rate_m_s, double *out, GError **error);

const char *bw_basin_model_name (BwBasinModelKind kind); /* "ideal", "hazen" */

/* --- Type I: a particle size distribution --- */

#define BW_PSD_MAX_FRACTIONS 32
/* The mass fractions must sum to 1 within this; they are never renormalised. */
#define BW_PSD_SUM_TOLERANCE 1.0e-6

typedef struct
{
  double diameter_m;       /* m, representative diameter of the fraction */
  double specific_gravity; /* particle density / water density, > 1 */
  double mass_fraction;    /* of the total suspended mass, 0-1 */
} BwPsdFraction;

typedef struct
{
  guint n_fractions; /* 1 to BW_PSD_MAX_FRACTIONS */
  BwPsdFraction fraction[BW_PSD_MAX_FRACTIONS];
} BwPsd;

typedef struct
{
  double removal_fraction; /* mass fraction removed, 0-1 */
  guint n_fractions;
  double settling_velocity_m_s[BW_PSD_MAX_FRACTIONS]; /* m/s, of each fraction */
  double fraction_removed[BW_PSD_MAX_FRACTIONS];      /* removal of each fraction, 0-1 */
} BwPsdRemoval;

/* Checks the count, every diameter, specific gravity and mass fraction, and the sum. */
gboolean bw_psd_check (const BwPsd *psd, GError **error);

/* Terminal settling velocity of every fraction in WATER by DRAG (bw_settling_velocity_in_fluid);
 * VELOCITIES_M_S receives psd->n_fractions values. Depends only on the water, so a caller that
 * evaluates many overflow rates computes these once. */
gboolean bw_psd_settling_velocities (const BwPsd *psd, const BwWater *water, BwDragCorrelation drag,
                                     double *velocities_m_s, GError **error);

/* Removal of PSD at OVERFLOW_RATE_M_S (m/s) in a basin of MODEL: sum of f_i R(vs_i, v0). */
gboolean bw_psd_removal (const BwPsd *psd, const BwWater *water, BwDragCorrelation drag,
                         const BwBasinModel *model, double overflow_rate_m_s, BwPsdRemoval *out,
                         GError **error);

/* The same from settling velocities computed before (bw_psd_settling_velocities). */
gboolean bw_psd_removal_from_velocities (const BwPsd *psd, const double *velocities_m_s,
                                         const BwBasinModel *model, double overflow_rate_m_s,
                                         BwPsdRemoval *out, GError **error);

/* --- Type II: flocculent settling from column data --- */

#define BW_COLUMN_MAX_DEPTHS 16
#define BW_COLUMN_MAX_TIMES 32

/* Settling-column readings: the fraction removed, R = 1 - C(h, t) / C0, at each sampling port
 * depth h and time t. */
typedef struct
{
  guint n_depths;                   /* 1 to BW_COLUMN_MAX_DEPTHS */
  guint n_times;                    /* 1 to BW_COLUMN_MAX_TIMES */
  double depth_m[BW_COLUMN_MAX_DEPTHS]; /* m below the water surface, strictly increasing, > 0 */
  double time_s[BW_COLUMN_MAX_TIMES];   /* s, strictly increasing, > 0 */
  double removal[BW_COLUMN_MAX_DEPTHS][BW_COLUMN_MAX_TIMES]; /* 0-1, [depth][time] */
} BwSettlingColumn;

/* What removal is taken between the water surface and the shallowest port, where the column has
 * no reading. */
typedef enum
{
  BW_COLUMN_SURFACE_HOLD, /* the shallowest port's removal (conservative: removal only rises
                           * toward the surface); the default */
  BW_COLUMN_SURFACE_FULL, /* rising linearly to complete removal at the surface, as hand-drawn
                           * iso-removal curves do (e.g. Davis 2010 Example 10-3) */
} BwColumnSurface;

/* Scale-up from column to basin: the overflow rate is divided by OVERFLOW_SCALE and the detention
 * time multiplied by DETENTION_SCALE. Metcalf & Eddy give 1.25-1.75 and 1.5-2.0 (from memory);
 * Davis (2010) p. 10-13 quotes Eckenfelder (1980): overflow rate x 0.65 (a divisor of 1.54) and
 * detention x 1.75 (seen). */
typedef struct
{
  double depth_m;          /* m, settling depth H evaluated; 0 = the deepest port */
  BwColumnSurface surface;
  double overflow_scale;   /* scale-up divisor of the column overflow rate, 1-3 (1 = none) */
  double detention_scale;  /* scale-up multiplier of the column detention time, 1-3 (1 = none) */
} BwType2Options;

typedef struct
{
  double removal_fraction;         /* total fraction removed in depth H at time t, 0-1 */
  double bottom_removal;           /* removal read at depth H and time t, 0-1 */
  double depth_m;                  /* m, H */
  double detention_s;              /* s, column time t */
  double overflow_rate_m_s;        /* m/s, H / t */
  double design_overflow_rate_m_s; /* m/s, H / t / overflow_scale */
  double design_detention_s;       /* s, t x detention_scale */
} BwType2Result;

/* Deepest port, HOLD, no scale-up. */
void bw_type2_options_init (BwType2Options *opts);

gboolean bw_settling_column_check (const BwSettlingColumn *column, GError **error);

/* Removal at column time TIME_S (s, up to the last reading). */
gboolean bw_type2_removal_at_time (const BwSettlingColumn *column, const BwType2Options *opts,
                                   double time_s, BwType2Result *out, GError **error);

/* Removal at overflow rate OVERFLOW_RATE_M_S (m/s): the time t = H / v0. */
gboolean bw_type2_removal_at_overflow (const BwSettlingColumn *column, const BwType2Options *opts,
                                       double overflow_rate_m_s, BwType2Result *out,
                                       GError **error);

/* The shortest column time whose removal reaches TARGET_REMOVAL (0-1), and the rest at it. */
gboolean bw_type2_time_for_removal (const BwSettlingColumn *column, const BwType2Options *opts,
                                    double target_removal, BwType2Result *out, GError **error);

/* The iso-removal sum from readings off a hand-drawn plot (Davis 2010 Eq. 10-22):
 *   R_T = R_0 + sum_i (h_i / H) (R_{i+1} - R_i),  i = 0 .. N_BANDS - 1
 * LEVELS holds N_BANDS + 1 removals, LEVELS[0] = R_0 the curve through depth H at the chosen time,
 * rising; MID_DEPTHS_M holds N_BANDS depths below the surface (m) of the midpoints between curves
 * i and i + 1, falling; DEPTH_M is H (m). */
gboolean bw_isoremoval_sum (guint n_bands, const double *levels, const double *mid_depths_m,
                            double depth_m, double *out, GError **error);

G_END_DECLS
