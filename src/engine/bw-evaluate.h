/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-evaluate.h: every unit of a project in every load case, and the criteria checks on them. */
#pragma once

#include <glib.h>

#include "engine/bw-criteria.h"
#include "engine/bw-project.h"
#include "engine/bw-quantity.h"

G_BEGIN_DECLS

/* One evaluated element: a unit, or one stage of a flocculator. */
typedef struct
{
  const BwProcessUnit *unit;  /* borrowed from the project */
  const BwProcessUnit *stage; /* the stage, or NULL for a whole unit */
  const BwTrain *train;
  BwElementType type;
  char *id;                   /* "floc-1" or "floc-1/stage-2" (the stage's own id) */
  char *label;                /* "Flocculator, stage 2 (paddle)" */
  BwQuantitySet *values;      /* one per load case of the results */
  guint warnings;             /* cautions of the models, any case (BwMixWarning/BwSedCaution) */
} BwElementResult;

typedef struct
{
  guint n_cases;
  BwLoadCase *cases;  /* the enabled load cases evaluated, in the project's order */
  GPtrArray *elements;/* BwElementResult*, in train and flow order */
} BwResults;

/* Evaluates every unit and stage of P in every enabled load case. P must validate. An input the
 * models refuse (impossible geometry) is an error that names the unit id. */
BwResults *bw_project_evaluate (const BwProject *p, GError **error);
void bw_results_free (BwResults *r);

/* The element type a unit of the train is checked as. FALSE for a stage type. */
gboolean bw_unit_element_type (const BwProcessUnit *u, BwElementType *out);

/* One unit in one load case: FLOW_M3_S through it (see bw_project_unit_flow), WATER at the case's
 * temperature. OUT (cleared by the caller: present = 0) gets the unit's quantities; for a flocculator STAGE_OUT (may be NULL) gets one
 * set per stage. Allocates nothing on success. Chemistry quantities are not added here. */
gboolean bw_evaluate_unit_case (const BwProcessUnit *u, double flow_m3_s, const BwWater *water,
                                BwQuantitySet *out, BwQuantitySet **stage_out, guint *warnings,
                                GError **error);

/* The load case where QUANTITY of ELEMENT is largest (or smallest); -1 when it is never present. */
int bw_results_extreme_case (const BwResults *r, guint element, BwQuantity q, gboolean largest);

typedef struct
{
  const BwCriterion *criterion; /* borrowed from the criteria set */
  int element;                  /* index into the results' elements; -1 when no element applies */
  BwCheckStatus status;
  double value;                 /* at the governing case, SI */
  gboolean has_limit;
  double limit;                 /* the limit that governs (violated, or nearest), SI */
  gboolean limit_is_max;
  gboolean limit_is_required;   /* a required limit (fail) rather than a preferred one (warn) */
  int governing_case;           /* index into the results' cases; -1 when none */
} BwCheck;

/* Grades every criterion of SET on every element it applies to, across the load cases it names.
 * The status is the worst over those cases; the governing case is the one with that status and
 * the smallest margin. */
GArray *bw_check_results (const BwResults *r, const BwCriteriaSet *set);

/* Counts of each status in CHECKS. */
void bw_checks_count (GArray *checks, guint counts[4]);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (BwResults, bw_results_free)

G_END_DECLS
