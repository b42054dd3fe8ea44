/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-criteria.c: criteria sets, their coherence rules, and grading a value against a criterion. */
#include "config.h"

#include "engine/bw-criteria.h"

#include <math.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"

static const char *const flow_names[BW_N_FLOW_KINDS] = {
  "minimum", "average-day", "maximum-day", "peak-hour", "future",
};
/* Labels are marked for the template only (the engine stays locale-free); the workbench and the
 * report translate them where they show them. */
#define N_(s) (s)
#define NC_(context, s) (s)

static const char *const flow_labels[BW_N_FLOW_KINDS] = {
  NC_("flow", "minimum"), NC_("flow", "average day"), NC_("flow", "maximum day"),
  NC_("flow", "peak hour"), NC_("flow", "future"),
};
static const char *const temp_names[BW_N_TEMP_KINDS] = { "coldest", "warmest" };
static const char *const service_names[BW_N_SERVICE_STATES] = { "all-in-service", "firm" };
static const char *const element_names[BW_N_ELEMENT_TYPES] = {
  "rapid-mix", "flocculator", "flocculator-stage", "rectangular-basin", "circular-clarifier",
  "plate-settler", "tube-settler",
};
static const char *const element_labels[BW_N_ELEMENT_TYPES] = {
  N_("rapid mix"), N_("flocculator"), N_("flocculator stage"), N_("rectangular basin"),
  N_("circular clarifier"), N_("plate settler"), N_("tube settler"),
};

static gboolean
name_lookup (const char *const *names, int n, const char *name, int *out)
{
  if (name == NULL)
    return FALSE;
  for (int i = 0; i < n; i++)
    if (strcmp (names[i], name) == 0)
      {
        *out = i;
        return TRUE;
      }
  return FALSE;
}

const char *
bw_flow_kind_name (BwFlowKind k)
{
  g_return_val_if_fail (k < BW_N_FLOW_KINDS, "unknown");
  return flow_names[k];
}

const char *
bw_flow_kind_label (BwFlowKind k)
{
  g_return_val_if_fail (k < BW_N_FLOW_KINDS, "unknown");
  return flow_labels[k];
}

const char *
bw_temp_kind_name (BwTempKind k)
{
  g_return_val_if_fail (k < BW_N_TEMP_KINDS, "unknown");
  return temp_names[k];
}

const char *
bw_service_state_name (BwServiceState s)
{
  g_return_val_if_fail (s < BW_N_SERVICE_STATES, "unknown");
  return service_names[s];
}

gboolean
bw_flow_kind_from_name (const char *name, BwFlowKind *out)
{
  int i;
  if (!name_lookup (flow_names, BW_N_FLOW_KINDS, name, &i))
    return FALSE;
  *out = (BwFlowKind) i;
  return TRUE;
}

gboolean
bw_temp_kind_from_name (const char *name, BwTempKind *out)
{
  int i;
  if (!name_lookup (temp_names, BW_N_TEMP_KINDS, name, &i))
    return FALSE;
  *out = (BwTempKind) i;
  return TRUE;
}

gboolean
bw_service_state_from_name (const char *name, BwServiceState *out)
{
  int i;
  if (!name_lookup (service_names, BW_N_SERVICE_STATES, name, &i))
    return FALSE;
  *out = (BwServiceState) i;
  return TRUE;
}

const char *
bw_element_type_name (BwElementType t)
{
  g_return_val_if_fail (t < BW_N_ELEMENT_TYPES, "unknown");
  return element_names[t];
}

const char *
bw_element_type_label (BwElementType t)
{
  g_return_val_if_fail (t < BW_N_ELEMENT_TYPES, "unknown");
  return element_labels[t];
}

gboolean
bw_element_type_from_name (const char *name, BwElementType *out)
{
  int i;
  if (!name_lookup (element_names, BW_N_ELEMENT_TYPES, name, &i))
    return FALSE;
  *out = (BwElementType) i;
  return TRUE;
}

gboolean
bw_case_filter_matches (const BwCaseFilter *f, BwFlowKind flow, BwTempKind temp,
                        BwServiceState service)
{
  g_return_val_if_fail (f != NULL, FALSE);
  return (f->flows == 0 || (f->flows >> flow) & 1) && (f->temps == 0 || (f->temps >> temp) & 1)
         && (f->services == 0 || (f->services >> service) & 1);
}

BwCriteriaSet *
bw_criteria_set_new (const char *id, const char *name)
{
  BwCriteriaSet *set = g_new0 (BwCriteriaSet, 1);

  set->id = g_strdup (id);
  set->name = g_strdup (name);
  set->criteria = g_ptr_array_new_with_free_func ((GDestroyNotify) bw_criterion_free);
  return set;
}

void
bw_criteria_set_free (BwCriteriaSet *set)
{
  if (set == NULL)
    return;
  g_free (set->id);
  g_free (set->name);
  g_free (set->description);
  g_free (set->origin);
  g_ptr_array_unref (set->criteria);
  g_free (set);
}

BwCriterion *
bw_criterion_new (void)
{
  return g_new0 (BwCriterion, 1);
}

void
bw_criterion_free (BwCriterion *c)
{
  if (c == NULL)
    return;
  g_free (c->id);
  g_free (c->title);
  g_free (c->document);
  g_free (c->edition);
  g_free (c->clause);
  g_free (c->note);
  g_free (c);
}

const BwCriterion *
bw_criteria_set_find (const BwCriteriaSet *set, const char *id)
{
  g_return_val_if_fail (set != NULL, NULL);
  for (guint i = 0; i < set->criteria->len; i++)
    {
      const BwCriterion *c = g_ptr_array_index (set->criteria, i);
      if (g_strcmp0 (c->id, id) == 0)
        return c;
    }
  return NULL;
}

static gboolean
limits_coherent (const BwLimits *l, const char *id, const char *which, GError **error)
{
  if ((l->has_min && !isfinite (l->min)) || (l->has_max && !isfinite (l->max)))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE,
                   BW_ ("criterion %s: a %s limit is not a finite number"), id, which);
      return FALSE;
    }
  if (l->has_min && l->has_max && l->min > l->max)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("criterion %s: the %s minimum %g is above its maximum %g"), id, which, l->min,
                   l->max);
      return FALSE;
    }
  return TRUE;
}

gboolean
bw_criteria_set_add (BwCriteriaSet *set, BwCriterion *c, GError **error)
{
  g_autoptr (BwCriterion) owned = c;
  const char *id;

  g_return_val_if_fail (set != NULL && c != NULL, FALSE);
  id = c->id ? c->id : "(no id)";
  if (c->id == NULL || c->id[0] == '\0')
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, BW_ ("criterion: it has no id"));
      return FALSE;
    }
  if (bw_criteria_set_find (set, c->id))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("criterion %s: the id is used twice in set %s"), id, set->id);
      return FALSE;
    }
  if (c->applies_to == 0)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("criterion %s: it applies to no unit type"), id);
      return FALSE;
    }
  if (!c->required.has_min && !c->required.has_max && !c->preferred.has_min
      && !c->preferred.has_max)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("criterion %s: it has neither a required nor a preferred limit"), id);
      return FALSE;
    }
  if (!limits_coherent (&c->required, id, BW_ ("required"), error)
      || !limits_coherent (&c->preferred, id, BW_ ("preferred"), error))
    return FALSE;
  /* A preferred range must lie within the required one, or a value could warn and fail at once
   * for the same reason. */
  if ((c->required.has_min && c->preferred.has_min && c->preferred.min < c->required.min)
      || (c->required.has_max && c->preferred.has_max && c->preferred.max > c->required.max))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("criterion %s: the preferred range reaches outside the required one"), id);
      return FALSE;
    }
  if (c->document == NULL || c->document[0] == '\0')
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("criterion %s: it cites no document"), id);
      return FALSE;
    }
  g_ptr_array_add (set->criteria, g_steal_pointer (&owned));
  return TRUE;
}

static gboolean
outside (const BwLimits *l, double v)
{
  return (l->has_min && v < l->min) || (l->has_max && v > l->max);
}

BwCheckStatus
bw_criterion_grade (const BwCriterion *c, double value)
{
  g_return_val_if_fail (c != NULL, BW_CHECK_NOT_APPLICABLE);
  if (!isfinite (value))
    return BW_CHECK_FAIL; /* never reached by design; a value we cannot trust never passes */
  if (outside (&c->required, value))
    return BW_CHECK_FAIL;
  if (outside (&c->preferred, value))
    return BW_CHECK_WARN;
  return BW_CHECK_PASS;
}

const char *
bw_check_status_name (BwCheckStatus s)
{
  switch (s)
    {
    /* TRANSLATORS: the status chip of a criterion check; keep it short. */
    case BW_CHECK_PASS: return NC_("check", "pass");
    case BW_CHECK_WARN: return NC_("check", "warn");
    case BW_CHECK_FAIL: return NC_("check", "fail");
    case BW_CHECK_NOT_APPLICABLE: return NC_("check", "n/a");
    default: return "unknown";
    }
}
