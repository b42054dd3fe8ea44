/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-params.h: the editable inputs of each kind of process unit, described once for the file
 * format, the editor and the CLI. */
#pragma once

#include <glib.h>

#include "engine/bw-units.h"

G_BEGIN_DECLS

/* What a process unit (or a flocculator stage) is. */
typedef enum
{
  BW_PROCESS_RAPID_MIX,          /* mechanical back-mix tank */
  BW_PROCESS_INLINE_MIXER,       /* in-line / hydraulic mixer, from its head loss */
  BW_PROCESS_FLOCCULATOR,        /* a chain of stages (below) in one basin */
  BW_PROCESS_RECTANGULAR_BASIN,  /* horizontal-flow settling basin */
  BW_PROCESS_CIRCULAR_CLARIFIER,
  BW_PROCESS_PLATE_SETTLER,      /* inclined plates or tubes */
  BW_STAGE_PADDLE,               /* flocculator stage: paddle wheels */
  BW_STAGE_TURBINE,              /* flocculator stage: vertical turbine */
  BW_STAGE_BAFFLED,              /* flocculator stage: hydraulic baffled channel */
  BW_N_PROCESS_TYPES
} BwProcessType;

const char *bw_process_type_name (BwProcessType t);  /* "rapid-mix", "paddle-stage", ... */
const char *bw_process_type_label (BwProcessType t); /* "rapid-mix tank", ... */
gboolean bw_process_type_from_name (const char *name, BwProcessType *out);
gboolean bw_process_type_is_stage (BwProcessType t);

typedef enum
{
  BW_PARAM_QUANTITY, /* a value of a BwQuantityKind, SI */
  BW_PARAM_COUNT,    /* a whole number */
  BW_PARAM_CHOICE,   /* one of CHOICES, stored as its index */
} BwParamType;

typedef struct
{
  const char *id;         /* "liquid-depth": file element names and CLI keys */
  const char *label;      /* "liquid depth" */
  BwParamType type;
  BwQuantityKind kind;    /* for quantities */
  double def;             /* default (SI, count, or choice index) */
  double min, max;        /* valid range (inclusive), SI; for choices unused */
  gboolean min_exclusive; /* TRUE: the value must exceed MIN */
  const char *const *choices; /* NULL-terminated: { "square", "cylindrical", NULL } */
  gboolean optional;      /* may be absent (0 = not given) */
  const char *help;       /* one line for the editor's tooltip */
} BwParamSpec;

#define BW_MAX_PARAMS 24

/* The parameter table of TYPE. */
const BwParamSpec *bw_params_of (BwProcessType type, guint *n);
/* Index of parameter ID in TYPE's table, or -1. */
int bw_param_index (BwProcessType type, const char *id);

/* Checks VALUE for parameter SPEC; the error names the parameter's label. */
gboolean bw_param_check (const BwParamSpec *spec, double value, GError **error);

/* Choice helpers. */
const char *bw_param_choice_name (const BwParamSpec *spec, int index);
gboolean bw_param_choice_index (const BwParamSpec *spec, const char *name, int *out);
char *bw_param_choices_joined (const BwParamSpec *spec); /* "square|cylindrical" */

G_END_DECLS
