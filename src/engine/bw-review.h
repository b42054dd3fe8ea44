/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-review.h: a reviewer's tools: stated-versus-computed findings and revision compare. */
#pragma once

#include <glib.h>

#include "engine/bw-evaluate.h"

G_BEGIN_DECLS

/* BwStated, BwStatedWhich and bw_stated_free/copy live in engine/bw-project.h (the project
 * stores them); bw-evaluate.h includes it. */

typedef enum
{
  BW_FINDING_DISCREPANCY,   /* the stated value differs from the computed one beyond the tolerance */
  BW_FINDING_AGREES,        /* within the tolerance */
  BW_FINDING_NOT_COMPUTED,  /* no such element, quantity or case in the computed results */
  BW_FINDING_CRITERION,     /* a criterion fails or warns */
} BwFindingKind;

typedef struct
{
  BwFindingKind kind;
  const BwStated *stated;    /* for the first three kinds; borrowed */
  const BwCheck *check;      /* for BW_FINDING_CRITERION; borrowed from the checks array */
  double computed;           /* SI, when there is one */
  double relative_difference;/* (stated - computed) / |computed| */
  int load_case;             /* index into the results' cases, -1 if none */
  int element;               /* index into the results' elements, -1 if none */
} BwFinding;

/* Compares every STATED value (BwStated*) with RESULTS within the relative TOLERANCE (> 0), then
 * lists every failing or warning check of CHECKS. Returns a GArray of BwFinding. */
GArray *bw_review (const BwResults *results, GPtrArray *stated, GArray *checks, double tolerance);

const char *bw_finding_kind_name (BwFindingKind k); /* "discrepancy", "agrees", ... */

/* --- revision compare --- */

typedef enum
{
  BW_CHANGE_INPUT,   /* a design-basis value, unit parameter, count, unit added or removed */
  BW_CHANGE_RESULT,  /* a computed value */
  BW_CHANGE_CHECK,   /* a check's status */
} BwChangeKind;

typedef struct
{
  BwChangeKind kind;
  char *where;       /* "north-sed", "design basis", "north-sed / maximum-day/coldest/firm" */
  char *what;        /* "length", "overflow_rate", "sed-overflow" */
  char *old_text;    /* formatted in SI for reading, or "—" when absent */
  char *new_text;
  double old_value, new_value; /* SI; NAN-free: 0 when absent (see has_old/has_new) */
  gboolean has_old, has_new;
  char *unit_id;     /* the process unit the change belongs to; NULL for project-level changes
                      * (design basis, chemistry) */
  BwProcessType unit_type; /* that unit's type; meaningful only when unit_id is set */
  gboolean numeric;  /* old_value/new_value carry the change, in quantity_kind */
  BwQuantityKind quantity_kind;
} BwChange;

void bw_change_free (BwChange *c);

/* What changed from OLD to NEW: inputs, then results (relative change above 1e-9) in load cases
 * both share, then check outcomes (when both checks arrays are given). */
GPtrArray *bw_project_diff (const BwProject *old_p, const BwProject *new_p, const BwResults *old_r,
                            const BwResults *new_r, GArray *old_checks, GArray *new_checks);

G_END_DECLS
