/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-autosize.h: search the practical design space of one unit for designs that pass every
 * required criterion in every load case, ranked by an objective. */
#pragma once

#include <glib.h>

#include "engine/bw-evaluate.h"

G_BEGIN_DECLS

typedef enum
{
  BW_OBJECTIVE_VOLUME,    /* smallest total volume (all parallel units) */
  BW_OBJECTIVE_FOOTPRINT, /* smallest total plan area */
  BW_OBJECTIVE_POWER,     /* lowest total mixing power at the worst case; then volume */
} BwObjective;

const char *bw_objective_name (BwObjective o); /* "volume", "footprint", "power" */
gboolean bw_objective_from_name (const char *name, BwObjective *out);

#define BW_AUTOSIZE_BEST 5
#define BW_AUTOSIZE_MAX_MARGINS 24

/* One passing design: the unit's (and its stages') parameter values and parallel count. */
typedef struct
{
  guint n_parallel;
  double values[BW_MAX_PARAMS];
  guint n_stages;
  double stage_values[8][BW_MAX_PARAMS];
  double objective;    /* m3, m2 or W */
  double volume_m3;    /* for ties and display */
  guint n_margins;
  const BwCriterion *margin_criteria[BW_AUTOSIZE_MAX_MARGINS];
  double margins[BW_AUTOSIZE_MAX_MARGINS]; /* worst relative margin to the required limit */
} BwCandidate;

typedef struct
{
  BwObjective objective;
  guint n_best;
  BwCandidate best[BW_AUTOSIZE_BEST];
  guint64 candidates;      /* designs tried */
  guint64 evaluations;     /* candidate x load case evaluations */
  guint64 passing;         /* designs that passed */
  char *searched;          /* what was varied, for reading: "width 2-20 m by 0.5 m, ..." */
} BwAutosizeResult;

/* Progress and cancel: called now and then with the fraction done; return FALSE to stop (the
 * search then fails with G_IO_ERROR_CANCELLED-like BW_ENGINE_ERROR_INVALID "cancelled"). */
typedef gboolean (*BwAutosizeProgress) (double fraction, gpointer user_data);

/* Searches the design space of unit UNIT_ID of P against SET in every enabled load case. */
gboolean bw_autosize (const BwProject *p, const char *unit_id, const BwCriteriaSet *set,
                      BwObjective objective, BwAutosizeProgress progress, gpointer user_data,
                      BwAutosizeResult *out, GError **error);
void bw_autosize_result_clear (BwAutosizeResult *r);

/* Writes candidate C into the unit UNIT_ID of P (its values, stages and parallel count). */
gboolean bw_autosize_apply (BwProject *p, const char *unit_id, const BwCandidate *c, GError **error);

G_END_DECLS
