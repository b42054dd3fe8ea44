/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-quantity.h: the named result quantities that units report and criteria check. */
#pragma once

#include <glib.h>

#include "engine/bw-units.h"

G_BEGIN_DECLS

/* Every quantity a unit evaluation can report. The names (bw_quantity_name) are the vocabulary of
 * criteria files, CSV headers and JSON keys; never rename one. */
typedef enum
{
  BW_Q_VOLUME,                 /* m3, liquid volume of one unit (or stage) */
  BW_Q_SURFACE_AREA,           /* m2, plan area of one basin */
  BW_Q_FLOW,                   /* m3/s through one unit in the load case */
  BW_Q_DETENTION,              /* s, V/Q */
  BW_Q_G,                      /* 1/s, root-mean-square velocity gradient */
  BW_Q_GT,                     /* dimensionless, G x t (Camp number) */
  BW_Q_POWER,                  /* W, power delivered to the water */
  BW_Q_MOTOR_POWER,            /* W, power drawn by the drive */
  BW_Q_IMPELLER_REYNOLDS,      /* dimensionless */
  BW_Q_TIP_SPEED,              /* m/s, peripheral speed of a paddle or impeller */
  BW_Q_CHANNEL_VELOCITY,       /* m/s, flow-through velocity of a flocculator or channel */
  BW_Q_HEADLOSS,               /* m, head loss across a hydraulic mixer or channel */
  BW_Q_OVERFLOW_RATE,          /* m/s, surface overflow rate Q/A */
  BW_Q_WEIR_LOADING,           /* m2/s, Q per length of weir */
  BW_Q_HORIZONTAL_VELOCITY,    /* m/s, mean velocity through the flow-through section */
  BW_Q_LENGTH_WIDTH_RATIO,     /* dimensionless */
  BW_Q_WIDTH_DEPTH_RATIO,      /* dimensionless */
  BW_Q_SIDE_WATER_DEPTH,       /* m */
  BW_Q_REYNOLDS,               /* dimensionless, on the hydraulic radius */
  BW_Q_FROUDE,                 /* dimensionless, on the hydraulic radius */
  BW_Q_SCOUR_VELOCITY,         /* m/s, Camp's scour velocity for the design particle */
  BW_Q_SCOUR_MARGIN,           /* dimensionless, scour velocity / horizontal velocity */
  BW_Q_PROJECTED_LOADING,      /* m/s, flow per projected plate or tube area */
  BW_Q_CRITICAL_VELOCITY,      /* m/s, Yao's critical settling velocity */
  BW_Q_CHANNEL_REYNOLDS,       /* dimensionless, in a plate or tube channel */
  BW_Q_REMOVAL,                /* fraction of the design particles removed */
  BW_Q_COAGULANT_FEED,         /* kg/s of coagulant product into one unit, at the maximum dose */
  BW_Q_RESIDUAL_ALKALINITY,    /* kg/m3 as CaCO3 left after the maximum dose */
  BW_Q_SLUDGE,                 /* kg/s of dry sludge settling in one basin, at the design dose */
  BW_Q_COAGULANT_SOLUTION,     /* m3/s of liquid stock into one unit, at the maximum dose */
  BW_Q_SLUDGE_VOLUME,          /* m3/s of settled sludge at its solids content, design dose */
  BW_N_QUANTITIES
} BwQuantity;

typedef struct
{
  const char *name;      /* "overflow_rate": criteria files and CSV */
  const char *label;     /* "overflow rate": for reading */
  BwQuantityKind kind;
} BwQuantityInfo;

const BwQuantityInfo *bw_quantity_info (BwQuantity q);
const char *bw_quantity_name (BwQuantity q);
gboolean bw_quantity_from_name (const char *name, BwQuantity *out);

/* The results of one evaluation: a value per quantity, with a mask of those that apply. */
typedef struct
{
  guint64 present; /* bit q set when values[q] is meaningful */
  double values[BW_N_QUANTITIES];
} BwQuantitySet;

static inline void
bw_quantity_set_put (BwQuantitySet *set, BwQuantity q, double value)
{
  set->values[q] = value;
  set->present |= G_GUINT64_CONSTANT (1) << q;
}

static inline gboolean
bw_quantity_set_has (const BwQuantitySet *set, BwQuantity q)
{
  return (set->present >> q) & 1;
}

G_END_DECLS
