/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-criteria.h: design criteria sets (limits with their citations) and load-case filters. */
#pragma once

#include <glib.h>

#include "engine/bw-quantity.h"

G_BEGIN_DECLS

/* --- load cases: flows x temperatures x service states --- */

typedef enum
{
  BW_FLOW_MINIMUM,
  BW_FLOW_AVERAGE_DAY,
  BW_FLOW_MAXIMUM_DAY,
  BW_FLOW_PEAK_HOUR,
  BW_FLOW_FUTURE,
  BW_N_FLOW_KINDS
} BwFlowKind;

typedef enum
{
  BW_TEMP_COLDEST,
  BW_TEMP_WARMEST,
  BW_N_TEMP_KINDS
} BwTempKind;

typedef enum
{
  BW_SERVICE_ALL_IN_SERVICE, /* every parallel unit running */
  BW_SERVICE_FIRM,           /* the standby units out of service (firm capacity) */
  BW_N_SERVICE_STATES
} BwServiceState;

const char *bw_flow_kind_name (BwFlowKind k);          /* "minimum", "average-day", ... */
const char *bw_flow_kind_label (BwFlowKind k);         /* "minimum", "average day", ... */
const char *bw_temp_kind_name (BwTempKind k);          /* "coldest", "warmest" */
const char *bw_service_state_name (BwServiceState s);  /* "all-in-service", "firm" */
gboolean bw_flow_kind_from_name (const char *name, BwFlowKind *out);
gboolean bw_temp_kind_from_name (const char *name, BwTempKind *out);
gboolean bw_service_state_from_name (const char *name, BwServiceState *out);

/* Which load cases a criterion applies to: a bit per flow kind, temperature and service state.
 * A zero mask in a field means "all". */
typedef struct
{
  guint flows;    /* 1 << BwFlowKind */
  guint temps;    /* 1 << BwTempKind */
  guint services; /* 1 << BwServiceState */
} BwCaseFilter;

gboolean bw_case_filter_matches (const BwCaseFilter *f, BwFlowKind flow, BwTempKind temp,
                                 BwServiceState service);

/* --- criteria --- */

/* What a criterion applies to: one kind of evaluated element. */
typedef enum
{
  BW_ELEMENT_RAPID_MIX,
  BW_ELEMENT_FLOCCULATOR,       /* a whole flocculator (all its stages in series) */
  BW_ELEMENT_FLOCCULATOR_STAGE, /* one stage of a flocculator */
  BW_ELEMENT_RECTANGULAR_BASIN,
  BW_ELEMENT_CIRCULAR_CLARIFIER,
  BW_ELEMENT_PLATE_SETTLER,     /* inclined plates */
  BW_ELEMENT_TUBE_SETTLER,      /* inclined tubes */
  BW_N_ELEMENT_TYPES
} BwElementType;

const char *bw_element_type_name (BwElementType t); /* "rapid-mix", "flocculator-stage", ... */
const char *bw_element_type_label (BwElementType t);
gboolean bw_element_type_from_name (const char *name, BwElementType *out);

typedef enum
{
  BW_PROVENANCE_SEEN,   /* read in the cited document (or a regulation quoting it) */
  BW_PROVENANCE_MEMORY, /* recalled: verify against the edition in force */
} BwProvenance;

typedef struct
{
  gboolean has_min, has_max;
  double min, max; /* SI, in the quantity's kind */
} BwLimits;

typedef struct
{
  char *id;             /* unique within its set */
  char *title;          /* "Rapid-mix velocity gradient" */
  guint applies_to;     /* 1 << BwElementType */
  BwQuantity quantity;
  BwLimits required;    /* outside: fail */
  BwLimits preferred;   /* outside (but within required): warn */
  BwCaseFilter cases;
  char *document;       /* "Recommended Standards for Water Works" */
  char *edition;        /* "2018" */
  char *clause;         /* "4.2.1" or "Table 6-7" */
  BwProvenance provenance;
  char *note;           /* optional remark, NULL when none */
} BwCriterion;

typedef struct
{
  char *id;          /* "textbook-ranges" */
  char *name;        /* "Typical ranges from textbooks" */
  char *description; /* may be NULL */
  char *origin;      /* the file it was read from, or NULL */
  GPtrArray *criteria; /* BwCriterion*, owned */
} BwCriteriaSet;

BwCriteriaSet *bw_criteria_set_new (const char *id, const char *name);
void bw_criteria_set_free (BwCriteriaSet *set);
/* Takes ownership of C. Fails (and frees C) when its id is already used or it is incoherent
 * (no limit at all, min above max, preferred range outside the required one, no document). */
gboolean bw_criteria_set_add (BwCriteriaSet *set, BwCriterion *c, GError **error);
const BwCriterion *bw_criteria_set_find (const BwCriteriaSet *set, const char *id);

BwCriterion *bw_criterion_new (void);
void bw_criterion_free (BwCriterion *c);

/* Outcome of one criterion on one element. */
typedef enum
{
  BW_CHECK_PASS,
  BW_CHECK_WARN,           /* within the required limits, outside the preferred ones */
  BW_CHECK_FAIL,           /* outside a required limit */
  BW_CHECK_NOT_APPLICABLE, /* no element of that type, or no load case matches */
} BwCheckStatus;

const char *bw_check_status_name (BwCheckStatus s); /* "pass", "warn", "fail", "n/a" */

/* Grades VALUE against C's limits. */
BwCheckStatus bw_criterion_grade (const BwCriterion *c, double value);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (BwCriteriaSet, bw_criteria_set_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (BwCriterion, bw_criterion_free)

G_END_DECLS
