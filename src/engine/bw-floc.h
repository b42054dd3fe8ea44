/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-floc.h: flocculator stages (paddle, vertical turbine, baffled channel) and tapered trains. */
#pragma once

#include <glib.h>

#include "engine/bw-mixing.h"
#include "engine/bw-water.h"

G_BEGIN_DECLS

/* Most stages in one flocculator train, and most blade rings on a paddle arm. */
#define BW_FLOC_MAX_STAGES 8
#define BW_PADDLE_MAX_RINGS 6

/* Velocity of a paddle blade relative to the water, as a fraction of the blade's own speed
 * (Davis 2010, Eq. 6-20 and text, seen; Hendricks 2011 measures a slip of 0.24-0.32 instead,
 * i.e. a factor of 0.68-0.76). */
#define BW_PADDLE_DEFAULT_RELATIVE_VELOCITY_FACTOR 0.75

/* drag_coefficient value meaning "from the blade's length/width ratio"
 * (bw_paddle_drag_coefficient). */
#define BW_PADDLE_CD_FROM_ASPECT 0.0

/* Loss coefficient per 180 degree turn, in velocity heads of the channel velocity.
 * Around-the-end: 3.2, Haarhoff (1998) Aqua 47(3):142 for a slot as wide as the channel, as
 * tabulated by Hendricks (2011) "Fundamentals of Water Treatment Unit Processes" Table 11.11
 * (seen). Over-and-under: the same 3.2 (common practice, no source; give your own). */
#define BW_BAFFLE_TURN_K_AROUND_THE_END 3.2
#define BW_BAFFLE_TURN_K_OVER_AND_UNDER 3.2

/* Manning's n of finished concrete, s/m^(1/3) (common practice, no source). */
#define BW_MANNING_N_CONCRETE 0.013

typedef enum
{
  BW_SHAFT_HORIZONTAL, /* lies across the flow; the blades sweep the length x depth plane */
  BW_SHAFT_VERTICAL,   /* the blades sweep the length x width plane */
  BW_N_SHAFT_ORIENTATIONS
} BwShaftOrientation;

/* A paddle reel: N_WHEELS wheels on one shaft, each with ARMS_PER_WHEEL arms, each arm carrying
 * N_RINGS blades ("boards") at the ring radii. Every blade is BLADE_LENGTH_M long (parallel to
 * the shaft) and BLADE_WIDTH_M wide (radially). */
typedef struct
{
  BwShaftOrientation shaft;
  guint n_wheels;
  guint arms_per_wheel;
  guint n_rings;                             /* blades per arm, 1..BW_PADDLE_MAX_RINGS */
  double ring_radius_m[BW_PADDLE_MAX_RINGS]; /* shaft axis to blade centreline, m */
  double blade_length_m;                     /* m */
  double blade_width_m;                      /* m */
  double speed_rev_s;                        /* rev/s */
  double drag_coefficient;                   /* > 0, or BW_PADDLE_CD_FROM_ASPECT */
  double relative_velocity_factor;           /* k, 0 < k <= 1 */
} BwPaddle;

typedef struct
{
  guint n_blades;
  double blade_area_m2;         /* all blades, m2 */
  double drag_coefficient;      /* used */
  double tip_speed_m_s;         /* centreline speed of the outermost ring, 2 pi r N, m/s */
  double edge_speed_m_s;        /* speed of the outer edge of the outermost blade, m/s */
  double relative_velocity_m_s; /* k x tip speed: the outermost blade relative to the water */
  double power_W;               /* W */
  double swept_radius_m;        /* outermost ring radius + half the blade width, m */
} BwPaddleResult;

/* Zeroes PADDLE and sets the defaults: one wheel, Cd from the aspect ratio, k = 0.75. */
void bw_paddle_init (BwPaddle *paddle);

/* Drag coefficient of a flat blade from its length/width ratio, after Davis (2010) Table 6-7
 * (seen): 1.20 for L/W below 5, 1.50 at L/W = 20, 1.90 for very long blades. See bw-floc.c for
 * how the engine joins those points. */
double bw_paddle_drag_coefficient (double blade_length_m, double blade_width_m);

/* Power of PADDLE in WATER (Davis 2010 Eq. 6-20): P = sum over the blades of Cd A rho v_r^3 / 2,
 * v_r = k 2 pi r N. Checks the reel's own geometry (blades crossing the shaft or overlapping). */
gboolean bw_paddle_evaluate (const BwPaddle *paddle, const BwWater *water, BwPaddleResult *out,
                             GError **error);

/* --- baffled (hydraulic) channel flocculator --- */

typedef enum
{
  BW_BAFFLE_AROUND_THE_END, /* horizontal flow, turning around the ends of the baffles */
  BW_BAFFLE_OVER_AND_UNDER, /* vertical flow, over and under the baffles */
  BW_N_BAFFLE_LAYOUTS
} BwBaffleLayout;

/*
 * N_PASSES channels in series separated by baffles SPACING_M apart, N_PASSES - 1 turns.
 * Around-the-end: each pass is a channel SPACING_M wide, WATER_DEPTH_M deep and PASS_LENGTH_M
 * long; the flow section is spacing x depth.
 * Over-and-under: each pass is a vertical channel SPACING_M wide between two baffles that span
 * the basin, PASS_LENGTH_M being the baffle length across the basin; the flow runs the water
 * depth in each pass through a section of spacing x baffle length.
 * Both: volume = passes x spacing x depth x pass length (the turns' extra water neglected).
 */
typedef struct
{
  BwBaffleLayout layout;
  guint n_passes;
  double spacing_m;     /* clear distance between baffles, m */
  double water_depth_m; /* m */
  double pass_length_m; /* m, see above */
  double turn_loss_k;   /* velocity heads lost per 180 degree turn */
  double manning_n;     /* s/m^(1/3) */
} BwBaffledChannel;

typedef struct
{
  double volume_m3;
  double detention_s;
  double velocity_m_s;       /* mean velocity in a pass, m/s */
  double hydraulic_radius_m; /* of a pass's flow section, m */
  double path_length_m;      /* total length travelled along the passes, m */
  guint n_turns;
  double friction_loss_m;    /* Manning, m */
  double turn_loss_m;        /* m */
  double headloss_m;         /* total, m */
  double power_W;            /* rho g Q h, W */
  double G_per_s;
  double Gt;
} BwBaffledResult;

/* Fills CHANNEL with LAYOUT's turn loss coefficient, concrete's Manning n and zero geometry. */
void bw_baffled_channel_init (BwBaffledChannel *channel, BwBaffleLayout layout);

gboolean bw_baffled_channel_evaluate (const BwBaffledChannel *channel, double flow_m3_s,
                                      const BwWater *water, BwBaffledResult *out, GError **error);

/* --- stages and trains --- */

typedef enum
{
  BW_FLOC_STAGE_PADDLE,  /* paddle reel in a compartment */
  BW_FLOC_STAGE_TURBINE, /* vertical turbine (impeller) in a compartment */
  BW_FLOC_STAGE_BAFFLED, /* baffled channel */
  BW_N_FLOC_STAGE_KINDS
} BwFlocStageKind;

typedef struct
{
  double length_m; /* along the flow, m */
  double width_m;  /* across the flow, m */
  double depth_m;  /* water depth, m */
} BwCompartment;

/* One stage. Only the member that KIND names is read (all are kept, so that an editor can switch
 * the kind without losing what was typed). */
typedef struct
{
  BwFlocStageKind kind;
  BwCompartment compartment; /* paddle and turbine stages; volume = L x W x D */
  BwPaddle paddle;
  BwImpeller turbine;
  gboolean turbine_baffled;  /* the turbine compartment has wall baffles */
  BwBaffledChannel channel;  /* baffled stages: the volume comes from the channel */
} BwFlocStage;

typedef struct
{
  BwFlocStageKind kind;
  double volume_m3;
  double detention_s;
  double power_W;  /* power delivered to the water, W */
  double G_per_s;
  double Gt;
  BwPaddleResult paddle;     /* paddle stages */
  BwImpellerResult turbine;  /* turbine stages */
  BwBaffledResult channel;   /* baffled stages */
  guint warnings;            /* BwMixWarning flags */
} BwFlocStageResult;

/* The train: FLOW_M3_S passes through every stage in turn. */
typedef struct
{
  double flow_m3_s;
  guint n_stages;
  BwFlocStage stages[BW_FLOC_MAX_STAGES];
} BwFlocculator;

typedef struct
{
  guint n_stages;
  BwFlocStageResult stages[BW_FLOC_MAX_STAGES];
  double volume_m3;
  double detention_s;
  double power_W;
  double Gt;                 /* sum of G_i t_i, the train's Camp number */
  double G_time_mean_per_s;  /* Gt / t: the detention-weighted mean G */
  double G_power_mean_per_s; /* sqrt (sum P_i / (mu sum V_i)): G of the train as one volume */
  guint warnings;            /* every stage's BwMixWarning flags together */
} BwFlocResult;

gboolean bw_floc_stage_evaluate (const BwFlocStage *stage, double flow_m3_s, const BwWater *water,
                                 BwFlocStageResult *out, GError **error);

/* Errors of stage i carry the prefix "stage i " before the field name:
 * "stage 2 blade radius: ...". */
gboolean bw_flocculator_evaluate (const BwFlocculator *floc, const BwWater *water,
                                  BwFlocResult *out, GError **error);

/* Design solves for one stage: the value that gives TARGET_G_PER_S, everything else held.
 * Paddle speed and turbine speed are closed forms (P proportional to N^3); blade length and baffle
 * spacing are monotone one-dimensional solves, OUT_OF_RANGE when the target cannot be met. */
gboolean bw_floc_stage_paddle_speed_for_gradient (const BwFlocStage *stage, double flow_m3_s,
                                                  const BwWater *water, double target_G_per_s,
                                                  double *out_speed_rev_s, GError **error);
gboolean bw_floc_stage_blade_length_for_gradient (const BwFlocStage *stage, double flow_m3_s,
                                                  const BwWater *water, double target_G_per_s,
                                                  double *out_blade_length_m, GError **error);
gboolean bw_floc_stage_turbine_speed_for_gradient (const BwFlocStage *stage, double flow_m3_s,
                                                   const BwWater *water, double target_G_per_s,
                                                   double *out_speed_rev_s, GError **error);
gboolean bw_floc_stage_baffle_spacing_for_gradient (const BwFlocStage *stage, double flow_m3_s,
                                                    const BwWater *water, double target_G_per_s,
                                                    double *out_spacing_m, GError **error);

const char *bw_floc_stage_kind_name (BwFlocStageKind kind);  /* "paddle", "turbine", "baffled" */
/* "around-the-end", "over-and-under" */
const char *bw_baffle_layout_name (BwBaffleLayout layout);
gboolean bw_baffle_layout_from_name (const char *name, BwBaffleLayout *out);

G_END_DECLS
