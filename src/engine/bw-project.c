/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-project.c: the plant model: design basis, trains, process units and load cases. */
#include "config.h"

#include "engine/bw-project.h"

#include <math.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"
#include "engine/bw-water.h"

BwProject *
bw_project_new (void)
{
  BwProject *p = g_new0 (BwProject, 1);

  p->trains = g_ptr_array_new_with_free_func ((GDestroyNotify) bw_train_free);
  p->cases = g_array_new (FALSE, TRUE, sizeof (BwLoadCase));
  p->foreign = g_ptr_array_new_with_free_func (g_free);
  p->jar_tests = g_ptr_array_new_with_free_func ((GDestroyNotify) bw_jar_test_record_free);
  p->column_tests = g_ptr_array_new_with_free_func ((GDestroyNotify) bw_column_test_record_free);
  p->stated = g_ptr_array_new_with_free_func ((GDestroyNotify) bw_stated_free);
  p->review_tolerance = BW_REVIEW_TOLERANCE_DEFAULT;
  p->chemistry.kind = BW_COAGULANT_ALUM;
  p->chemistry.hydrate_waters = 14;
  p->chemistry.ss_factor = 1.3;
  p->basis.temperature_K[BW_TEMP_COLDEST] = 273.15 + 5.0;
  p->basis.temperature_K[BW_TEMP_WARMEST] = 273.15 + 25.0;
  p->basis.ph = 7.0;
  return p;
}

void
bw_project_free (BwProject *p)
{
  if (p == NULL)
    return;
  g_free (p->name);
  g_free (p->preparer);
  g_free (p->revision);
  g_free (p->date);
  g_free (p->description);
  g_free (p->criteria);
  g_ptr_array_unref (p->trains);
  g_array_unref (p->cases);
  g_ptr_array_unref (p->foreign);
  g_ptr_array_unref (p->jar_tests);
  g_ptr_array_unref (p->column_tests);
  g_ptr_array_unref (p->stated);
  g_free (p->chemistry.jar_test);
  g_free (p);
}

BwJarTestRecord *
bw_jar_test_record_new (const char *id, const char *name)
{
  BwJarTestRecord *r = g_new0 (BwJarTestRecord, 1);

  r->id = g_strdup (id);
  r->name = g_strdup (name);
  r->temperature_K = 293.15;
  return r;
}

void
bw_jar_test_record_free (BwJarTestRecord *r)
{
  if (r == NULL)
    return;
  g_free (r->id);
  g_free (r->name);
  g_free (r);
}

BwStated *
bw_stated_copy (const BwStated *s)
{
  BwStated *c;

  g_return_val_if_fail (s != NULL, NULL);
  c = g_new (BwStated, 1);
  *c = *s;
  c->element = g_strdup (s->element);
  c->comment = g_strdup (s->comment);
  return c;
}

void
bw_stated_free (BwStated *s)
{
  if (s == NULL)
    return;
  g_free (s->element);
  g_free (s->comment);
  g_free (s);
}

/* Same statement and comment; where it was read (line) does not count. */
static gboolean
stated_equal (const BwStated *a, const BwStated *b)
{
  if (g_strcmp0 (a->element, b->element) || a->quantity != b->quantity || a->which != b->which
      || a->value != b->value || g_strcmp0 (a->comment, b->comment))
    return FALSE;
  return a->which != BW_STATED_CASE
         || (a->load_case.flow == b->load_case.flow && a->load_case.temp == b->load_case.temp
             && a->load_case.service == b->load_case.service);
}

BwColumnTestRecord *
bw_column_test_record_new (const char *id, const char *name)
{
  BwColumnTestRecord *r = g_new0 (BwColumnTestRecord, 1);

  r->id = g_strdup (id);
  r->name = g_strdup (name);
  r->kind = BW_COLUMN_READING_REMOVAL;
  r->units = g_ptr_array_new_with_free_func (g_free);
  return r;
}

void
bw_column_test_record_free (BwColumnTestRecord *r)
{
  if (r == NULL)
    return;
  g_free (r->id);
  g_free (r->name);
  g_ptr_array_unref (r->units);
  g_free (r);
}

static GPtrArray *copy_strings (GPtrArray *a);
static gboolean strings_equal (GPtrArray *a, GPtrArray *b);

BwColumnTestRecord *
bw_column_test_record_copy (const BwColumnTestRecord *r)
{
  BwColumnTestRecord *c;

  g_return_val_if_fail (r != NULL, NULL);
  c = g_new (BwColumnTestRecord, 1);
  *c = *r;
  c->id = g_strdup (r->id);
  c->name = g_strdup (r->name);
  c->units = copy_strings (r->units);
  return c;
}

gboolean
bw_column_test_record_equal (const BwColumnTestRecord *a, const BwColumnTestRecord *b)
{
  g_return_val_if_fail (a != NULL && b != NULL, FALSE);
  if (g_strcmp0 (a->id, b->id) || g_strcmp0 (a->name, b->name) || a->initial_kg_m3 != b->initial_kg_m3
      || a->kind != b->kind || a->n_depths != b->n_depths || a->n_times != b->n_times
      || !strings_equal (a->units, b->units))
    return FALSE;
  if (a->n_depths > BW_COLUMN_MAX_DEPTHS || a->n_times > BW_COLUMN_MAX_TIMES)
    return FALSE;
  for (guint j = 0; j < a->n_depths; j++)
    {
      if (a->depth_m[j] != b->depth_m[j])
        return FALSE;
      for (guint k = 0; k < a->n_times; k++)
        if (a->reading[j][k] != b->reading[j][k])
          return FALSE;
    }
  for (guint k = 0; k < a->n_times; k++)
    if (a->time_s[k] != b->time_s[k])
      return FALSE;
  return TRUE;
}

gboolean
bw_column_test_record_column (const BwColumnTestRecord *r, BwSettlingColumn *out, GError **error)
{
  g_autoptr (GError) local = NULL;
  const char *id;

  g_return_val_if_fail (r != NULL && out != NULL, FALSE);
  id = r->id ? r->id : "";
  memset (out, 0, sizeof *out);
  if (r->n_depths < 1 || r->n_depths > BW_COLUMN_MAX_DEPTHS || r->n_times < 1
      || r->n_times > BW_COLUMN_MAX_TIMES)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("column test %s: %u ports and %u sampling times; 1 to %d ports and 1 to %d "
                   "times are accepted"), id, r->n_depths, r->n_times, BW_COLUMN_MAX_DEPTHS,
                   BW_COLUMN_MAX_TIMES);
      return FALSE;
    }
  if (!bw_check_finite (r->initial_kg_m3, BW_ ("initial concentration"), &local)
      || !bw_check_nonnegative (r->initial_kg_m3, BW_ ("initial concentration"), &local))
    {
      g_set_error (error, BW_ENGINE_ERROR, local->code, BW_ ("column test %s: %s"), id, local->message);
      return FALSE;
    }
  if (r->kind == BW_COLUMN_READING_CONCENTRATION && !(r->initial_kg_m3 > 0))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("column test %s: initial concentration: concentration readings need the "
                   "initial concentration C0 (greater than zero)"), id);
      return FALSE;
    }
  out->n_depths = r->n_depths;
  out->n_times = r->n_times;
  memcpy (out->depth_m, r->depth_m, sizeof out->depth_m);
  memcpy (out->time_s, r->time_s, sizeof out->time_s);
  for (guint j = 0; j < r->n_depths; j++)
    for (guint k = 0; k < r->n_times; k++)
      {
        const double v = r->reading[j][k];
        if (r->kind == BW_COLUMN_READING_CONCENTRATION)
          {
            if (!isfinite (v) || v < 0 || v > r->initial_kg_m3)
              {
                g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                             BW_ ("column test %s: concentration: %g mg/L at depth %g m and %g min is "
                             "not between 0 and the initial %g mg/L"), id, v * 1000.0,
                             r->depth_m[j], r->time_s[k] / 60.0, r->initial_kg_m3 * 1000.0);
                return FALSE;
              }
            /* Removal fraction R = 1 - C / C0 (the definition of the column's readings;
             * concentrations in kg/m3). */
            out->removal[j][k] = 1.0 - v / r->initial_kg_m3;
          }
        else
          out->removal[j][k] = v;
      }
  if (!bw_settling_column_check (out, &local))
    {
      g_set_error (error, BW_ENGINE_ERROR, local->code, BW_ ("column test %s: %s"), id, local->message);
      return FALSE;
    }
  return TRUE;
}

const BwColumnTestRecord *
bw_project_column_test_for (const BwProject *p, const char *unit_id)
{
  g_return_val_if_fail (p != NULL, NULL);
  for (guint i = 0; unit_id && i < p->column_tests->len; i++)
    {
      const BwColumnTestRecord *r = g_ptr_array_index (p->column_tests, i);
      for (guint k = 0; k < r->units->len; k++)
        if (g_strcmp0 (g_ptr_array_index (r->units, k), unit_id) == 0)
          return r;
    }
  return NULL;
}

static const char *const alkali_names[BW_N_ALKALIS] = { "lime", "soda-ash" };

const char *
bw_alkali_kind_name (BwAlkaliKind k)
{
  g_return_val_if_fail ((guint) k < BW_N_ALKALIS, "unknown");
  return alkali_names[k];
}

gboolean
bw_alkali_kind_from_name (const char *name, BwAlkaliKind *out)
{
  for (int i = 0; i < BW_N_ALKALIS; i++)
    if (g_strcmp0 (alkali_names[i], name) == 0)
      {
        *out = (BwAlkaliKind) i;
        return TRUE;
      }
  return FALSE;
}

gboolean
bw_project_coagulant (const BwProject *p, BwCoagulant *out, GError **error)
{
  const BwChemistryBasis *c = &p->chemistry;

  switch (c->kind)
    {
    case BW_COAGULANT_ALUM:
      return bw_coagulant_alum (c->hydrate_waters, out, error);
    case BW_COAGULANT_FERRIC_CHLORIDE:
      bw_coagulant_ferric_chloride (out);
      return TRUE;
    case BW_COAGULANT_FERRIC_SULFATE:
      bw_coagulant_ferric_sulfate (out);
      return TRUE;
    case BW_COAGULANT_PACL:
      return bw_coagulant_pacl (c->al2o3_fraction, c->basicity, out, error);
    default:
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("coagulant: a project takes alum, ferric chloride, ferric sulfate or PACl"));
      return FALSE;
    }
}

static GPtrArray *
copy_strings (GPtrArray *a)
{
  GPtrArray *c = g_ptr_array_new_with_free_func (g_free);
  for (guint i = 0; i < a->len; i++)
    g_ptr_array_add (c, g_strdup (g_ptr_array_index (a, i)));
  return c;
}

BwProject *
bw_project_copy (const BwProject *p)
{
  BwProject *c;

  g_return_val_if_fail (p != NULL, NULL);
  c = bw_project_new ();
  c->name = g_strdup (p->name);
  c->preparer = g_strdup (p->preparer);
  c->revision = g_strdup (p->revision);
  c->date = g_strdup (p->date);
  c->description = g_strdup (p->description);
  c->criteria = g_strdup (p->criteria);
  c->basis = p->basis;
  c->chemistry = p->chemistry;
  c->chemistry.jar_test = g_strdup (p->chemistry.jar_test);
  for (guint i = 0; i < p->jar_tests->len; i++)
    {
      const BwJarTestRecord *r = g_ptr_array_index (p->jar_tests, i);
      BwJarTestRecord *rc = bw_jar_test_record_new (r->id, r->name);
      rc->temperature_K = r->temperature_K;
      rc->series = r->series;
      g_ptr_array_add (c->jar_tests, rc);
    }
  for (guint i = 0; i < p->trains->len; i++)
    {
      const BwTrain *t = g_ptr_array_index (p->trains, i);
      BwTrain *tc = bw_train_new (t->id, t->name);
      for (guint k = 0; k < t->units->len; k++)
        g_ptr_array_add (tc->units, bw_process_unit_copy (g_ptr_array_index (t->units, k)));
      g_ptr_array_add (c->trains, tc);
    }
  for (guint i = 0; i < p->column_tests->len; i++)
    g_ptr_array_add (c->column_tests, bw_column_test_record_copy (g_ptr_array_index (p->column_tests, i)));
  for (guint i = 0; i < p->stated->len; i++)
    g_ptr_array_add (c->stated, bw_stated_copy (g_ptr_array_index (p->stated, i)));
  c->review_tolerance = p->review_tolerance;
  g_array_append_vals (c->cases, p->cases->data, p->cases->len);
  g_ptr_array_unref (c->foreign);
  c->foreign = copy_strings (p->foreign);
  return c;
}

BwTrain *
bw_train_new (const char *id, const char *name)
{
  BwTrain *t = g_new0 (BwTrain, 1);

  t->id = g_strdup (id);
  t->name = g_strdup (name);
  t->units = g_ptr_array_new_with_free_func ((GDestroyNotify) bw_process_unit_free);
  return t;
}

void
bw_train_free (BwTrain *t)
{
  if (t == NULL)
    return;
  g_free (t->id);
  g_free (t->name);
  g_ptr_array_unref (t->units);
  g_free (t);
}

BwProcessUnit *
bw_process_unit_new (BwProcessType type, const char *id, const char *name)
{
  BwProcessUnit *u;
  const BwParamSpec *specs;
  guint n;

  g_return_val_if_fail (type < BW_N_PROCESS_TYPES, NULL);
  u = g_new0 (BwProcessUnit, 1);
  u->type = type;
  u->id = g_strdup (id);
  u->name = g_strdup (name ? name : bw_process_type_label (type));
  u->n_parallel = 1;
  u->stages = g_ptr_array_new_with_free_func ((GDestroyNotify) bw_process_unit_free);
  u->foreign = g_ptr_array_new_with_free_func (g_free);
  specs = bw_params_of (type, &n);
  for (guint i = 0; i < n; i++)
    u->values[i] = specs[i].def;
  return u;
}

void
bw_process_unit_free (BwProcessUnit *u)
{
  if (u == NULL)
    return;
  g_free (u->id);
  g_free (u->name);
  g_ptr_array_unref (u->stages);
  g_ptr_array_unref (u->foreign);
  g_free (u);
}

BwProcessUnit *
bw_process_unit_copy (const BwProcessUnit *u)
{
  BwProcessUnit *c;

  g_return_val_if_fail (u != NULL, NULL);
  c = bw_process_unit_new (u->type, u->id, u->name);
  c->n_parallel = u->n_parallel;
  c->n_standby = u->n_standby;
  memcpy (c->values, u->values, sizeof c->values);
  for (guint i = 0; i < u->stages->len; i++)
    g_ptr_array_add (c->stages, bw_process_unit_copy (g_ptr_array_index (u->stages, i)));
  g_ptr_array_unref (c->foreign);
  c->foreign = copy_strings (u->foreign);
  return c;
}

gboolean
bw_process_unit_set (BwProcessUnit *u, const char *param_id, double value, GError **error)
{
  const int i = bw_param_index (u->type, param_id);

  g_return_val_if_fail (u != NULL, FALSE);
  if (i < 0)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("%s: a %s has no parameter of that name"), param_id,
                   BW_ (bw_process_type_label (u->type)));
      return FALSE;
    }
  if (!bw_param_check (&bw_params_of (u->type, NULL)[i], value, error))
    return FALSE;
  u->values[i] = value;
  return TRUE;
}

double
bw_process_unit_get (const BwProcessUnit *u, const char *param_id)
{
  const int i = bw_param_index (u->type, param_id);

  g_return_val_if_fail (i >= 0, 0.0);
  return u->values[i];
}

double
bw_project_unit_flow (const BwProject *p, const BwProcessUnit *u, BwFlowKind flow,
                      BwServiceState service)
{
  guint running;
  double train_flow;

  g_return_val_if_fail (p != NULL && u != NULL && flow < BW_N_FLOW_KINDS, 0.0);
  train_flow = p->basis.flow_m3_s[flow] / MAX (1u, p->trains->len);
  running = u->n_parallel;
  if (service == BW_SERVICE_FIRM && u->n_standby < u->n_parallel)
    running -= u->n_standby;
  return train_flow / MAX (1u, running);
}

static gboolean
any_standby (const BwProject *p)
{
  for (guint i = 0; i < p->trains->len; i++)
    {
      const BwTrain *t = g_ptr_array_index (p->trains, i);
      for (guint k = 0; k < t->units->len; k++)
        if (((BwProcessUnit *) g_ptr_array_index (t->units, k))->n_standby > 0)
          return TRUE;
    }
  return FALSE;
}

void
bw_project_generate_cases (BwProject *p)
{
  const int services = any_standby (p) ? BW_N_SERVICE_STATES : 1;

  g_return_if_fail (p != NULL);
  g_array_set_size (p->cases, 0);
  for (int f = 0; f < BW_N_FLOW_KINDS; f++)
    {
      if (!((p->basis.flows_given >> f) & 1))
        continue;
      for (int t = 0; t < BW_N_TEMP_KINDS; t++)
        for (int s = 0; s < services; s++)
          {
            BwLoadCase c = { (BwFlowKind) f, (BwTempKind) t, (BwServiceState) s, TRUE };
            g_array_append_val (p->cases, c);
          }
    }
}

char *
bw_load_case_label (const BwLoadCase *c)
{
  return g_strdup_printf ("%s, %s, %s", bw_flow_kind_label (c->flow), bw_temp_kind_name (c->temp),
                          c->service == BW_SERVICE_FIRM ? "firm capacity" : "all in service");
}

char *
bw_load_case_id (const BwLoadCase *c)
{
  return g_strdup_printf ("%s/%s/%s", bw_flow_kind_name (c->flow), bw_temp_kind_name (c->temp),
                          bw_service_state_name (c->service));
}

gboolean
bw_load_case_parse_id (const char *id, BwLoadCase *out)
{
  g_auto (GStrv) parts = NULL;

  if (id == NULL)
    return FALSE;
  parts = g_strsplit (id, "/", -1);
  if (g_strv_length (parts) != 3)
    return FALSE;
  out->enabled = TRUE;
  return bw_flow_kind_from_name (parts[0], &out->flow) && bw_temp_kind_from_name (parts[1], &out->temp)
         && bw_service_state_from_name (parts[2], &out->service);
}

static gboolean
check_unit (const BwProcessUnit *u, GHashTable *ids, gboolean is_stage, GError **error)
{
  const BwParamSpec *specs;
  guint n;

  if (u->id == NULL || u->id[0] == '\0')
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, BW_ ("unit id: a unit has no id"));
      return FALSE;
    }
  if (!g_hash_table_add (ids, u->id))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("unit id: '%s' is used twice"), u->id);
      return FALSE;
    }
  if (bw_process_type_is_stage (u->type) != is_stage)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("%s: a %s cannot stand %s"), u->id, BW_ (bw_process_type_label (u->type)),
                   is_stage ? BW_ ("as a flocculator stage") : BW_ ("on its own in a train"));
      return FALSE;
    }
  if (u->n_parallel < 1 || u->n_parallel > 100)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("%s: units in parallel must be from 1 to 100 (got %u)"), u->id, u->n_parallel);
      return FALSE;
    }
  if (u->n_standby >= u->n_parallel)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("%s: %u standby of %u in parallel leaves none in service"), u->id, u->n_standby,
                   u->n_parallel);
      return FALSE;
    }
  specs = bw_params_of (u->type, &n);
  for (guint i = 0; i < n; i++)
    {
      g_autoptr (GError) local = NULL;
      if (!bw_param_check (&specs[i], u->values[i], &local))
        {
          g_set_error (error, BW_ENGINE_ERROR, local->code, BW_ ("%s: %s"), u->id, local->message);
          return FALSE;
        }
    }
  if (u->type == BW_PROCESS_FLOCCULATOR && u->stages->len == 0)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("%s: a flocculator needs at least one stage"), u->id);
      return FALSE;
    }
  if (u->type != BW_PROCESS_FLOCCULATOR && u->stages->len > 0)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("%s: only a flocculator has stages"), u->id);
      return FALSE;
    }
  for (guint i = 0; i < u->stages->len; i++)
    if (!check_unit (g_ptr_array_index (u->stages, i), ids, TRUE, error))
      return FALSE;
  return TRUE;
}

/* A reviewer's comment: text a person types, kept exact in the project file, so no control
 * character XML 1.0 cannot hold (a tab and line breaks are fine). */
static gboolean
check_comment (const char *text, guint index, GError **error)
{
  if (text == NULL)
    return TRUE;
  if (strlen (text) > 65536 || !g_utf8_validate (text, -1, NULL))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("stated value %u: comment: not UTF-8 text of at most 65536 bytes"), index);
      return FALSE;
    }
  for (const char *c = text; *c; c++)
    if ((guchar) *c < 0x20 && *c != '\t' && *c != '\n' && *c != '\r')
      {
        g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                     BW_ ("stated value %u: comment: holds the control character 0x%02x"), index,
                     (guint) (guchar) *c);
        return FALSE;
      }
  return TRUE;
}

static gboolean
validate_review (const BwProject *p, GError **error)
{
  if (!isfinite (p->review_tolerance) || !(p->review_tolerance > 0) || p->review_tolerance > 1)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("review tolerance: must lie above 0 and at most 1 (100 %%) (got %g)"),
                   p->review_tolerance);
      return FALSE;
    }
  for (guint i = 0; i < p->stated->len; i++)
    {
      const BwStated *s = g_ptr_array_index (p->stated, i);
      if (s->element == NULL || s->element[0] == '\0')
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                       BW_ ("stated value %u: element: empty"), i + 1);
          return FALSE;
        }
      if ((guint) s->quantity >= BW_N_QUANTITIES || (guint) s->which > BW_STATED_MINIMUM)
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                       BW_ ("stated value %u (%s): quantity: not one Basinwright computes"), i + 1, s->element);
          return FALSE;
        }
      if (!isfinite (s->value))
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                       BW_ ("stated value %u (%s %s): value: not a finite number"), i + 1, s->element,
                       bw_quantity_name (s->quantity));
          return FALSE;
        }
      if (!check_comment (s->comment, i + 1, error))
        return FALSE;
    }
  return TRUE;
}

static gboolean
validate_column_tests (const BwProject *p, GError **error)
{
  g_autoptr (GHashTable) ids = g_hash_table_new (g_str_hash, g_str_equal);

  for (guint i = 0; i < p->column_tests->len; i++)
    {
      const BwColumnTestRecord *r = g_ptr_array_index (p->column_tests, i);
      BwSettlingColumn col;
      if (r->id == NULL || r->id[0] == '\0' || !g_hash_table_add (ids, r->id))
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                       BW_ ("column test id: '%s' is missing or used twice"), r->id ? r->id : "");
          return FALSE;
        }
      if (!bw_column_test_record_column (r, &col, error))
        return FALSE;
      for (guint k = 0; k < r->units->len; k++)
        {
          const char *uid = g_ptr_array_index (r->units, k);
          const BwProcessUnit *u = bw_project_find_unit (p, uid, NULL);
          /* An id that names no unit (a basin removed since) is kept but applies to nothing,
           * so removing a basin is never refused for the column test that named it. */
          if (u == NULL)
            continue;
          if (u->type != BW_PROCESS_RECTANGULAR_BASIN && u->type != BW_PROCESS_CIRCULAR_CLARIFIER)
            {
              g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                           BW_ ("column test %s: applies to: '%s' is a %s, not a settling basin "
                           "(a rectangular basin or circular clarifier)"), r->id, uid,
                           BW_ (bw_process_type_label (u->type)));
              return FALSE;
            }
        }
    }
  return TRUE;
}

/* An optional input: 0 means not given, anything else must lie in LO..HI. */
static gboolean
check_optional (double value, double lo, double hi, const char *field, const char *unit,
                GError **error)
{
  return value == 0 || bw_check_range (value, lo, hi, field, unit, error);
}

gboolean
bw_project_validate (const BwProject *p, GError **error)
{
  g_autoptr (GHashTable) ids = g_hash_table_new (g_str_hash, g_str_equal);
  g_autoptr (GHashTable) train_ids = g_hash_table_new (g_str_hash, g_str_equal);
  const BwDesignBasis *b;
  double last = 0.0;
  const BwFlowKind order[] = { BW_FLOW_MINIMUM, BW_FLOW_AVERAGE_DAY, BW_FLOW_MAXIMUM_DAY,
                               BW_FLOW_PEAK_HOUR };

  g_return_val_if_fail (p != NULL, FALSE);
  b = &p->basis;
  if (!((b->flows_given >> BW_FLOW_MAXIMUM_DAY) & 1))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("maximum-day flow: the design basis needs it"));
      return FALSE;
    }
  for (int f = 0; f < BW_N_FLOW_KINDS; f++)
    if ((b->flows_given >> f) & 1)
      {
        g_autofree char *field = g_strdup_printf (BW_ ("%s flow"), BW_ (bw_flow_kind_label ((BwFlowKind) f)));
        if (!bw_check_positive (b->flow_m3_s[f], field, error)
            || !bw_check_range (b->flow_m3_s[f], 0, 1000, field, "m³/s", error))
          return FALSE;
      }
  for (guint i = 0; i < G_N_ELEMENTS (order); i++)
    if ((b->flows_given >> order[i]) & 1)
      {
        if (b->flow_m3_s[order[i]] < last)
          {
            g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                         BW_ ("%s flow: it is below a flow listed before it (minimum <= average day <= "
                         "maximum day <= peak hour)"), BW_ (bw_flow_kind_label (order[i])));
            return FALSE;
          }
        last = b->flow_m3_s[order[i]];
      }
  for (int t = 0; t < BW_N_TEMP_KINDS; t++)
    {
      g_autofree char *field = g_strdup_printf ("%s temperature", bw_temp_kind_name ((BwTempKind) t));
      if (!bw_check_finite (b->temperature_K[t], field, error))
        return FALSE;
      if (b->temperature_K[t] < BW_WATER_T_MIN_K - 1e-9 || b->temperature_K[t] > BW_WATER_T_MAX_K + 1e-9)
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                       BW_ ("%s: %.2f °C is outside 0 to 40 °C"), field, b->temperature_K[t] - 273.15);
          return FALSE;
        }
    }
  if (b->temperature_K[BW_TEMP_COLDEST] > b->temperature_K[BW_TEMP_WARMEST])
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("coldest temperature: it is above the warmest"));
      return FALSE;
    }
  if (!bw_check_nonnegative (b->turbidity_NTU, BW_ ("raw-water turbidity"), error)
      || !bw_check_nonnegative (b->alkalinity_kg_m3, BW_ ("raw-water alkalinity"), error)
      || !bw_check_range (b->ph, 0, 14, BW_ ("raw-water pH"), "", error))
    return FALSE;
  if (p->chemistry.enabled)
    {
      const BwChemistryBasis *c = &p->chemistry;
      BwCoagulant co;
      if (!bw_check_range (c->dose_min_kg_m3, 0, 1, BW_ ("minimum dose"), "kg/m³", error)
          || !bw_check_range (c->dose_design_kg_m3, 0, 1, BW_ ("design dose"), "kg/m³", error)
          || !bw_check_range (c->dose_max_kg_m3, 0, 1, BW_ ("maximum dose"), "kg/m³", error)
          || !bw_check_range (c->ss_factor, 0, 10, BW_ ("suspended solids factor"), "mg/L per NTU", error)
          || !bw_check_range (c->residual_target_kg_m3, 0, 2, BW_ ("residual alkalinity target"), "kg/m³", error)
          || !check_optional (c->stock_fraction, 1e-4, 1, BW_ ("stock solution strength"), "g/g",
                              error)
          || !check_optional (c->stock_density_kg_m3, 500, 3000, BW_ ("stock solution density"),
                              "kg/m³", error)
          || !check_optional (c->sludge_solids_fraction, 1e-4, 0.6, BW_ ("sludge solids content"), "g/g",
                              error)
          || !check_optional (c->target_NTU, 0, 1e4, BW_ ("target settled turbidity"), "NTU", error)
          || !bw_project_coagulant (p, &co, error))
        return FALSE;
      if ((guint) c->alkali >= BW_N_ALKALIS)
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                       BW_ ("alkali supplement: must be lime or soda ash"));
          return FALSE;
        }
      if (c->dose_min_kg_m3 > c->dose_design_kg_m3 || c->dose_design_kg_m3 > c->dose_max_kg_m3)
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                       BW_ ("design dose: the doses must run minimum <= design <= maximum"));
          return FALSE;
        }
      if (c->jar_test)
        {
          gboolean found = FALSE;
          for (guint i = 0; i < p->jar_tests->len && !found; i++)
            found = g_strcmp0 (((BwJarTestRecord *) g_ptr_array_index (p->jar_tests, i))->id, c->jar_test) == 0;
          if (!found)
            {
              g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                           BW_ ("jar test: the chemistry names '%s', which the project does not hold"),
                           c->jar_test);
              return FALSE;
            }
        }
    }
  for (guint i = 0; i < p->jar_tests->len; i++)
    {
      BwJarTestRecord *r = g_ptr_array_index (p->jar_tests, i);
      BwJarSeries s = r->series;
      g_autoptr (GError) local = NULL;
      if (!bw_jar_series_prepare (&s, &local))
        {
          g_set_error (error, BW_ENGINE_ERROR, local->code, BW_ ("jar test %s: %s"), r->id, local->message);
          return FALSE;
        }
    }
  if (p->trains->len == 0)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, BW_ ("trains: the plant has none"));
      return FALSE;
    }
  for (guint i = 0; i < p->trains->len; i++)
    {
      const BwTrain *t = g_ptr_array_index (p->trains, i);
      if (t->id == NULL || !g_hash_table_add (train_ids, t->id))
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                       BW_ ("train id: '%s' is missing or used twice"), t->id ? t->id : "");
          return FALSE;
        }
      for (guint k = 0; k < t->units->len; k++)
        if (!check_unit (g_ptr_array_index (t->units, k), ids, FALSE, error))
          return FALSE;
    }
  for (guint i = 0; i < p->cases->len; i++)
    {
      const BwLoadCase *c = &g_array_index (p->cases, BwLoadCase, i);
      if (!((b->flows_given >> c->flow) & 1))
        {
          g_autofree char *label = bw_load_case_label (c);
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                       BW_ ("load case %s: the design basis has no %s flow"), label,
                       BW_ (bw_flow_kind_label (c->flow)));
          return FALSE;
        }
    }
  return validate_review (p, error) && validate_column_tests (p, error);
}

static BwProcessUnit *
find_in (GPtrArray *units, const char *id)
{
  for (guint k = 0; k < units->len; k++)
    {
      BwProcessUnit *u = g_ptr_array_index (units, k), *s;
      if (g_strcmp0 (u->id, id) == 0)
        return u;
      if ((s = find_in (u->stages, id)))
        return s;
    }
  return NULL;
}

BwProcessUnit *
bw_project_find_unit (const BwProject *p, const char *id, BwTrain **train)
{
  g_return_val_if_fail (p != NULL, NULL);
  for (guint i = 0; i < p->trains->len; i++)
    {
      BwTrain *t = g_ptr_array_index (p->trains, i);
      BwProcessUnit *u = find_in (t->units, id);
      if (u)
        {
          if (train)
            *train = t;
          return u;
        }
    }
  return NULL;
}

static gboolean
strings_equal (GPtrArray *a, GPtrArray *b)
{
  if (a->len != b->len)
    return FALSE;
  for (guint i = 0; i < a->len; i++)
    if (g_strcmp0 (g_ptr_array_index (a, i), g_ptr_array_index (b, i)) != 0)
      return FALSE;
  return TRUE;
}

static gboolean
unit_equal (const BwProcessUnit *a, const BwProcessUnit *b)
{
  guint n;

  bw_params_of (a->type, &n);
  if (a->type != b->type || g_strcmp0 (a->id, b->id) || g_strcmp0 (a->name, b->name)
      || a->n_parallel != b->n_parallel || a->n_standby != b->n_standby
      || a->stages->len != b->stages->len || !strings_equal (a->foreign, b->foreign))
    return FALSE;
  for (guint i = 0; i < n; i++)
    if (a->values[i] != b->values[i])
      return FALSE;
  for (guint i = 0; i < a->stages->len; i++)
    if (!unit_equal (g_ptr_array_index (a->stages, i), g_ptr_array_index (b->stages, i)))
      return FALSE;
  return TRUE;
}

gboolean
bw_project_equal (const BwProject *a, const BwProject *b)
{
  const BwDesignBasis *x = &a->basis, *y = &b->basis;

  if (g_strcmp0 (a->name, b->name) || g_strcmp0 (a->preparer, b->preparer)
      || g_strcmp0 (a->revision, b->revision) || g_strcmp0 (a->date, b->date)
      || g_strcmp0 (a->description, b->description) || g_strcmp0 (a->criteria, b->criteria))
    return FALSE;
  if (x->flows_given != y->flows_given || x->turbidity_NTU != y->turbidity_NTU
      || x->alkalinity_kg_m3 != y->alkalinity_kg_m3 || x->ph != y->ph)
    return FALSE;
  for (int f = 0; f < BW_N_FLOW_KINDS; f++)
    if (((x->flows_given >> f) & 1) && x->flow_m3_s[f] != y->flow_m3_s[f])
      return FALSE;
  for (int t = 0; t < BW_N_TEMP_KINDS; t++)
    if (x->temperature_K[t] != y->temperature_K[t])
      return FALSE;
  {
    const BwChemistryBasis *c = &a->chemistry, *d = &b->chemistry;
    if (c->enabled != d->enabled || c->kind != d->kind || c->hydrate_waters != d->hydrate_waters
        || c->al2o3_fraction != d->al2o3_fraction || c->basicity != d->basicity
        || c->dose_min_kg_m3 != d->dose_min_kg_m3 || c->dose_design_kg_m3 != d->dose_design_kg_m3
        || c->dose_max_kg_m3 != d->dose_max_kg_m3 || c->ss_factor != d->ss_factor
        || c->residual_target_kg_m3 != d->residual_target_kg_m3 || g_strcmp0 (c->jar_test, d->jar_test)
        || c->stock_fraction != d->stock_fraction || c->stock_density_kg_m3 != d->stock_density_kg_m3
        || c->alkali != d->alkali || c->sludge_solids_fraction != d->sludge_solids_fraction
        || c->target_NTU != d->target_NTU)
      return FALSE;
  }
  if (a->jar_tests->len != b->jar_tests->len)
    return FALSE;
  for (guint i = 0; i < a->jar_tests->len; i++)
    {
      const BwJarTestRecord *r = g_ptr_array_index (a->jar_tests, i), *s = g_ptr_array_index (b->jar_tests, i);
      if (g_strcmp0 (r->id, s->id) || g_strcmp0 (r->name, s->name) || r->temperature_K != s->temperature_K
          || r->series.n_jars != s->series.n_jars || r->series.has_ph != s->series.has_ph
          || r->series.has_zeta != s->series.has_zeta || r->series.has_mobility != s->series.has_mobility)
        return FALSE;
      for (guint k = 0; k < r->series.n_jars; k++)
        {
          const BwJar *u = &r->series.jars[k], *v = &s->series.jars[k];
          if (u->dose_kg_m3 != v->dose_kg_m3 || u->turbidity_NTU != v->turbidity_NTU
              || (r->series.has_ph && u->ph != v->ph) || (r->series.has_zeta && u->zeta_V != v->zeta_V)
              || (r->series.has_mobility && u->mobility_m2_V_s != v->mobility_m2_V_s))
            return FALSE;
        }
    }
  if (a->column_tests->len != b->column_tests->len || a->stated->len != b->stated->len
      || a->review_tolerance != b->review_tolerance)
    return FALSE;
  for (guint i = 0; i < a->column_tests->len; i++)
    if (!bw_column_test_record_equal (g_ptr_array_index (a->column_tests, i),
                                      g_ptr_array_index (b->column_tests, i)))
      return FALSE;
  for (guint i = 0; i < a->stated->len; i++)
    if (!stated_equal (g_ptr_array_index (a->stated, i), g_ptr_array_index (b->stated, i)))
      return FALSE;
  if (a->trains->len != b->trains->len || a->cases->len != b->cases->len
      || !strings_equal (a->foreign, b->foreign))
    return FALSE;
  for (guint i = 0; i < a->cases->len; i++)
    {
      const BwLoadCase *c = &g_array_index (a->cases, BwLoadCase, i);
      const BwLoadCase *d = &g_array_index (b->cases, BwLoadCase, i);
      if (c->flow != d->flow || c->temp != d->temp || c->service != d->service
          || c->enabled != d->enabled)
        return FALSE;
    }
  for (guint i = 0; i < a->trains->len; i++)
    {
      const BwTrain *t = g_ptr_array_index (a->trains, i), *u = g_ptr_array_index (b->trains, i);
      if (g_strcmp0 (t->id, u->id) || g_strcmp0 (t->name, u->name) || t->units->len != u->units->len)
        return FALSE;
      for (guint k = 0; k < t->units->len; k++)
        if (!unit_equal (g_ptr_array_index (t->units, k), g_ptr_array_index (u->units, k)))
          return FALSE;
    }
  return TRUE;
}
