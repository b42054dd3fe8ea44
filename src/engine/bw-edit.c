/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-edit.c: undoable edit commands on a project (apply/revert), and the undo/redo stack. */
#include "config.h"

#include "engine/bw-edit.h"

#include <math.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"

typedef enum
{
  EDIT_PARAM,
  EDIT_COUNTS,
  EDIT_RENAME,
  EDIT_PROJECT_NAME,
  EDIT_ADD,
  EDIT_REMOVE,
  EDIT_DUPLICATE,
  EDIT_MOVE,
  EDIT_FLOW,
  EDIT_TEMPERATURE,
  EDIT_RAW_WATER,
  EDIT_CASE,
  EDIT_CRITERIA,
  EDIT_SNAPSHOT,
} EditKind;

struct _BwEdit
{
  EditKind kind;
  char *label;
  char *unit_id;        /* the target; for add/duplicate the new item's id after apply */
  char *source_id;      /* duplicate: the unit copied */
  char *param_id;
  char *train_id;       /* add, and remove's container */
  char *parent_id;      /* add, and remove's container (a flocculator), or NULL */
  BwProcessType type;   /* add */
  double value, old_value;
  guint a, b, old_a, old_b; /* counts, position, case index */
  int delta;
  gboolean given, old_given;
  char *text, *old_text;
  BwProcessUnit *held;  /* remove: the unit taken out, while applied */
  guint held_index;
  GArray *old_cases;    /* the load cases before apply, restored on revert */
  BwProject *other;     /* snapshot: the state not in the project (after before apply, before after) */
  gboolean applied;
};

static BwEdit *
edit_new (EditKind kind, const char *unit_id)
{
  BwEdit *e = g_new0 (BwEdit, 1);

  e->kind = kind;
  e->unit_id = g_strdup (unit_id);
  return e;
}

void
bw_edit_free (BwEdit *edit)
{
  if (edit == NULL)
    return;
  g_free (edit->label);
  g_free (edit->unit_id);
  g_free (edit->source_id);
  g_free (edit->param_id);
  g_free (edit->train_id);
  g_free (edit->parent_id);
  g_free (edit->text);
  g_free (edit->old_text);
  g_clear_pointer (&edit->held, bw_process_unit_free);
  g_clear_pointer (&edit->old_cases, g_array_unref);
  g_clear_pointer (&edit->other, bw_project_free);
  g_free (edit);
}

BwEdit *
bw_edit_set_param (const char *unit_id, const char *param_id, double value)
{
  BwEdit *e;

  g_return_val_if_fail (unit_id != NULL && param_id != NULL, NULL);
  e = edit_new (EDIT_PARAM, unit_id);
  e->param_id = g_strdup (param_id);
  e->value = value;
  return e;
}

BwEdit *
bw_edit_set_counts (const char *unit_id, guint n_parallel, guint n_standby)
{
  BwEdit *e;

  g_return_val_if_fail (unit_id != NULL, NULL);
  e = edit_new (EDIT_COUNTS, unit_id);
  e->a = n_parallel;
  e->b = n_standby;
  return e;
}

BwEdit *
bw_edit_rename_unit (const char *unit_id, const char *name)
{
  BwEdit *e;

  g_return_val_if_fail (unit_id != NULL && name != NULL, NULL);
  e = edit_new (EDIT_RENAME, unit_id);
  e->text = g_strdup (name);
  return e;
}

BwEdit *
bw_edit_set_project_name (const char *name)
{
  BwEdit *e;

  g_return_val_if_fail (name != NULL, NULL);
  e = edit_new (EDIT_PROJECT_NAME, NULL);
  e->text = g_strdup (name);
  return e;
}

BwEdit *
bw_edit_add_unit (const char *train_id, const char *parent_id, guint position, BwProcessType type)
{
  BwEdit *e;

  g_return_val_if_fail (train_id != NULL || parent_id != NULL, NULL);
  g_return_val_if_fail (type < BW_N_PROCESS_TYPES, NULL);
  e = edit_new (EDIT_ADD, NULL);
  e->train_id = g_strdup (train_id);
  e->parent_id = g_strdup (parent_id);
  e->a = position;
  e->type = type;
  return e;
}

BwEdit *
bw_edit_remove_unit (const char *unit_id)
{
  g_return_val_if_fail (unit_id != NULL, NULL);
  return edit_new (EDIT_REMOVE, unit_id);
}

BwEdit *
bw_edit_duplicate_unit (const char *unit_id)
{
  BwEdit *e;

  g_return_val_if_fail (unit_id != NULL, NULL);
  e = edit_new (EDIT_DUPLICATE, NULL);
  e->source_id = g_strdup (unit_id);
  return e;
}

BwEdit *
bw_edit_move_unit (const char *unit_id, int delta)
{
  BwEdit *e;

  g_return_val_if_fail (unit_id != NULL, NULL);
  e = edit_new (EDIT_MOVE, unit_id);
  e->delta = delta;
  return e;
}

BwEdit *
bw_edit_set_flow (BwFlowKind kind, gboolean given, double flow_m3_s)
{
  BwEdit *e;

  g_return_val_if_fail (kind < BW_N_FLOW_KINDS, NULL);
  e = edit_new (EDIT_FLOW, NULL);
  e->a = kind;
  e->given = given;
  e->value = flow_m3_s;
  return e;
}

BwEdit *
bw_edit_set_temperature (BwTempKind kind, double temperature_K)
{
  BwEdit *e;

  g_return_val_if_fail (kind < BW_N_TEMP_KINDS, NULL);
  e = edit_new (EDIT_TEMPERATURE, NULL);
  e->a = kind;
  e->value = temperature_K;
  return e;
}

BwEdit *
bw_edit_set_raw_water (BwRawWaterField field, double value)
{
  BwEdit *e;

  g_return_val_if_fail (field <= BW_RAW_PH, NULL);
  e = edit_new (EDIT_RAW_WATER, NULL);
  e->a = field;
  e->value = value;
  return e;
}

BwEdit *
bw_edit_set_case_enabled (guint index, gboolean enabled)
{
  BwEdit *e = edit_new (EDIT_CASE, NULL);

  e->a = index;
  e->given = enabled;
  return e;
}

BwEdit *
bw_edit_set_criteria (const char *criteria)
{
  BwEdit *e;

  g_return_val_if_fail (criteria != NULL, NULL);
  e = edit_new (EDIT_CRITERIA, NULL);
  e->text = g_strdup (criteria);
  return e;
}

BwEdit *
bw_edit_snapshot (const BwProject *after, const char *label, const char *unit_id)
{
  BwEdit *e;

  g_return_val_if_fail (after != NULL && label != NULL, NULL);
  e = edit_new (EDIT_SNAPSHOT, unit_id);
  e->other = bw_project_copy (after);
  e->label = g_strdup (label);
  return e;
}

/* Exchanges the contents of two projects (both keep their addresses). */
static void
swap_projects (BwProject *a, BwProject *b)
{
  BwProject tmp = *a;

  *a = *b;
  *b = tmp;
}

const char *
bw_edit_get_label (const BwEdit *edit)
{
  g_return_val_if_fail (edit != NULL, NULL);
  return edit->label ? edit->label : "edit";
}

const char *
bw_edit_get_unit_id (const BwEdit *edit)
{
  g_return_val_if_fail (edit != NULL, NULL);
  return edit->unit_id;
}

gboolean
bw_edit_changes_layout (const BwEdit *edit)
{
  g_return_val_if_fail (edit != NULL, FALSE);
  switch (edit->kind)
    {
    case EDIT_COUNTS:
    case EDIT_RENAME:
    case EDIT_ADD:
    case EDIT_REMOVE:
    case EDIT_DUPLICATE:
    case EDIT_MOVE:
    case EDIT_SNAPSHOT: /* it may change anything */
      return TRUE;
    default:
      return FALSE;
    }
}

/* --- finding things --- */

typedef struct
{
  BwTrain *train;
  BwProcessUnit *parent; /* the flocculator holding a stage, or NULL */
  GPtrArray *list;       /* the array holding the unit */
  guint index;
  BwProcessUnit *unit;
} Place;

static gboolean
locate (BwProject *p, const char *id, Place *out)
{
  for (guint i = 0; i < p->trains->len; i++)
    {
      BwTrain *t = g_ptr_array_index (p->trains, i);
      for (guint k = 0; k < t->units->len; k++)
        {
          BwProcessUnit *u = g_ptr_array_index (t->units, k);
          if (g_strcmp0 (u->id, id) == 0)
            {
              *out = (Place) { t, NULL, t->units, k, u };
              return TRUE;
            }
          for (guint s = 0; s < u->stages->len; s++)
            {
              BwProcessUnit *st = g_ptr_array_index (u->stages, s);
              if (g_strcmp0 (st->id, id) == 0)
                {
                  *out = (Place) { t, u, u->stages, s, st };
                  return TRUE;
                }
            }
        }
    }
  return FALSE;
}

static BwTrain *
find_train (BwProject *p, const char *id)
{
  for (guint i = 0; i < p->trains->len; i++)
    {
      BwTrain *t = g_ptr_array_index (p->trains, i);
      if (g_strcmp0 (t->id, id) == 0)
        return t;
    }
  return NULL;
}

/* The array a new item goes into: the stages of PARENT_ID, or the units of TRAIN_ID. */
static GPtrArray *
container (BwProject *p, const char *train_id, const char *parent_id, GError **error)
{
  if (parent_id != NULL)
    {
      Place at;
      if (!locate (p, parent_id, &at) || at.parent != NULL)
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                       BW_ ("%s: no such unit in the project"), parent_id);
          return NULL;
        }
      return at.unit->stages;
    }
  BwTrain *t = find_train (p, train_id);
  if (t == NULL)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("%s: no such train in the project"), train_id ? train_id : "");
      return NULL;
    }
  return t->units;
}

static gboolean
id_used (BwProject *p, const char *id)
{
  return bw_project_find_unit (p, id, NULL) != NULL;
}

/* BASE-1, BASE-2, ...: the first id not used in P (nor in TAKEN). */
static char *
fresh_id (BwProject *p, const char *base, GHashTable *taken)
{
  for (guint n = 1;; n++)
    {
      char *id = g_strdup_printf ("%s-%u", base, n);
      if (!id_used (p, id) && (taken == NULL || !g_hash_table_contains (taken, id)))
        return id;
      g_free (id);
    }
}

static const char *
unit_label (const BwProcessUnit *u)
{
  return u->name && u->name[0] ? u->name : u->id;
}

static gboolean
not_found (const char *id, GError **error)
{
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, BW_ ("%s: no such unit in the project"),
               id ? id : "");
  return FALSE;
}

/* --- load cases --- */

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

/* Regenerates the cases, keeping the enabled flag of every case that was there before. */
static void
regenerate_cases (BwProject *p)
{
  g_autoptr (GArray) old = g_array_copy (p->cases);

  bw_project_generate_cases (p);
  for (guint i = 0; i < p->cases->len; i++)
    {
      BwLoadCase *c = &g_array_index (p->cases, BwLoadCase, i);
      for (guint k = 0; k < old->len; k++)
        {
          const BwLoadCase *o = &g_array_index (old, BwLoadCase, k);
          if (o->flow == c->flow && o->temp == c->temp && o->service == c->service)
            c->enabled = o->enabled;
        }
    }
}

/* --- apply and revert --- */

static double *
raw_field (BwProject *p, guint field)
{
  switch (field)
    {
    case BW_RAW_TURBIDITY:
      return &p->basis.turbidity_NTU;
    case BW_RAW_ALKALINITY:
      return &p->basis.alkalinity_kg_m3;
    default:
      return &p->basis.ph;
    }
}

static const char *const raw_names[] = { "raw-water turbidity", "raw-water alkalinity", "raw-water pH" };

static BwProcessUnit *
duplicate (BwProject *p, const BwProcessUnit *src, const char *new_id)
{
  BwProcessUnit *c = bw_process_unit_copy (src);
  g_autoptr (GHashTable) taken = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, NULL);

  g_free (c->id);
  c->id = g_strdup (new_id);
  g_hash_table_add (taken, g_strdup (new_id));
  g_free (c->name);
  c->name = g_strdup_printf ("%s (copy)", unit_label (src));
  for (guint i = 0; i < c->stages->len; i++)
    {
      BwProcessUnit *s = g_ptr_array_index (c->stages, i);
      g_free (s->id);
      s->id = fresh_id (p, new_id, taken);
      g_hash_table_add (taken, g_strdup (s->id));
    }
  return c;
}

static gboolean
apply_change (BwEdit *e, BwProject *p, GError **error)
{
  Place at;

  switch (e->kind)
    {
    case EDIT_PARAM:
      {
        int i;
        if (!locate (p, e->unit_id, &at))
          return not_found (e->unit_id, error);
        i = bw_param_index (at.unit->type, e->param_id);
        e->old_value = i >= 0 ? at.unit->values[i] : 0.0;
        if (!bw_process_unit_set (at.unit, e->param_id, e->value, error))
          return FALSE;
        g_free (e->label);
        e->label = g_strdup_printf ("Set %s of %s", bw_params_of (at.unit->type, NULL)[i].label,
                                    unit_label (at.unit));
        return TRUE;
      }
    case EDIT_COUNTS:
      {
        gboolean had_standby;
        if (!locate (p, e->unit_id, &at))
          return not_found (e->unit_id, error);
        if (at.parent != NULL && (e->a != 1 || e->b != 0))
          {
            g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                         BW_ ("%s: a flocculator stage has no parallel or standby units"), e->unit_id);
            return FALSE;
          }
        had_standby = any_standby (p);
        e->old_a = at.unit->n_parallel;
        e->old_b = at.unit->n_standby;
        at.unit->n_parallel = e->a;
        at.unit->n_standby = e->b;
        if (any_standby (p) != had_standby)
          regenerate_cases (p);
        g_free (e->label);
        e->label = g_strdup_printf ("Set units in parallel of %s", unit_label (at.unit));
        return TRUE;
      }
    case EDIT_RENAME:
      if (!locate (p, e->unit_id, &at))
        return not_found (e->unit_id, error);
      g_free (e->old_text);
      e->old_text = g_strdup (at.unit->name);
      g_free (e->label);
      e->label = g_strdup_printf ("Rename %s", unit_label (at.unit));
      g_free (at.unit->name);
      at.unit->name = g_strdup (e->text);
      return TRUE;
    case EDIT_PROJECT_NAME:
      g_free (e->old_text);
      e->old_text = g_strdup (p->name);
      g_free (p->name);
      p->name = g_strdup (e->text);
      g_free (e->label);
      e->label = g_strdup ("Rename the project");
      return TRUE;
    case EDIT_ADD:
      {
        GPtrArray *list = container (p, e->train_id, e->parent_id, error);
        BwProcessUnit *u;
        g_autofree char *id = NULL;
        if (list == NULL)
          return FALSE;
        id = fresh_id (p, bw_process_type_name (e->type), NULL);
        u = bw_process_unit_new (e->type, id, NULL);
        if (e->type == BW_PROCESS_FLOCCULATOR)
          {
            g_autofree char *sid = g_strdup_printf ("%s-1", id);
            g_ptr_array_add (u->stages, bw_process_unit_new (BW_STAGE_PADDLE, sid, NULL));
          }
        g_ptr_array_insert (list, (int) MIN (e->a, list->len), u);
        g_free (e->unit_id);
        e->unit_id = g_strdup (id);
        g_free (e->label);
        e->label = g_strdup_printf ("Add %s", bw_process_type_label (e->type));
        return TRUE;
      }
    case EDIT_DUPLICATE:
      {
        g_autofree char *id = NULL;
        if (!locate (p, e->source_id, &at))
          return not_found (e->source_id, error);
        id = fresh_id (p, at.unit->id, NULL);
        g_ptr_array_insert (at.list, (int) at.index + 1, duplicate (p, at.unit, id));
        g_free (e->unit_id);
        e->unit_id = g_strdup (id);
        g_free (e->label);
        e->label = g_strdup_printf ("Duplicate %s", unit_label (at.unit));
        return TRUE;
      }
    case EDIT_REMOVE:
      if (!locate (p, e->unit_id, &at))
        return not_found (e->unit_id, error);
      g_free (e->train_id);
      g_free (e->parent_id);
      e->train_id = g_strdup (at.train->id);
      e->parent_id = at.parent ? g_strdup (at.parent->id) : NULL;
      e->held_index = at.index;
      g_free (e->label);
      e->label = g_strdup_printf ("Remove %s", unit_label (at.unit));
      e->held = g_ptr_array_steal_index (at.list, at.index);
      return TRUE;
    case EDIT_MOVE:
      {
        int to;
        if (!locate (p, e->unit_id, &at))
          return not_found (e->unit_id, error);
        to = (int) at.index + e->delta;
        if (e->delta == 0 || to < 0 || to >= (int) at.list->len)
          {
            g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                         BW_ ("%s: it is already %s in its %s"), e->unit_id,
                         e->delta < 0 ? BW_ ("first") : BW_ ("last"), at.parent ? BW_ ("flocculator") : BW_ ("train"));
            return FALSE;
          }
        g_ptr_array_steal_index (at.list, at.index);
        g_ptr_array_insert (at.list, to, at.unit);
        e->old_a = at.index;
        e->a = (guint) to;
        g_free (e->label);
        e->label = g_strdup_printf ("Move %s %s", unit_label (at.unit), e->delta < 0 ? "up" : "down");
        return TRUE;
      }
    case EDIT_FLOW:
      {
        const guint bit = 1u << e->a;
        e->old_given = (p->basis.flows_given & bit) != 0;
        e->old_value = p->basis.flow_m3_s[e->a];
        if (e->given)
          {
            g_autofree char *field = g_strdup_printf ("%s flow", bw_flow_kind_label ((BwFlowKind) e->a));
            if (!bw_check_positive (e->value, field, error))
              return FALSE;
            p->basis.flows_given |= bit;
            p->basis.flow_m3_s[e->a] = e->value;
          }
        else
          {
            p->basis.flows_given &= ~bit;
            p->basis.flow_m3_s[e->a] = 0.0;
          }
        if (e->given != e->old_given)
          regenerate_cases (p);
        g_free (e->label);
        e->label = g_strdup_printf ("Set %s flow", bw_flow_kind_label ((BwFlowKind) e->a));
        return TRUE;
      }
    case EDIT_TEMPERATURE:
      e->old_value = p->basis.temperature_K[e->a];
      p->basis.temperature_K[e->a] = e->value;
      g_free (e->label);
      e->label = g_strdup_printf ("Set %s temperature", bw_temp_kind_name ((BwTempKind) e->a));
      return TRUE;
    case EDIT_RAW_WATER:
      e->old_value = *raw_field (p, e->a);
      if (!bw_check_finite (e->value, raw_names[e->a], error))
        return FALSE;
      *raw_field (p, e->a) = e->value;
      g_free (e->label);
      e->label = g_strdup_printf ("Set %s", raw_names[e->a]);
      return TRUE;
    case EDIT_CASE:
      {
        BwLoadCase *c;
        g_autofree char *name = NULL;
        if (e->a >= p->cases->len)
          {
            g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                         BW_ ("load case: there is no case %u"), e->a + 1);
            return FALSE;
          }
        c = &g_array_index (p->cases, BwLoadCase, e->a);
        e->old_given = c->enabled;
        c->enabled = e->given;
        name = bw_load_case_label (c);
        g_free (e->label);
        e->label = g_strdup_printf ("%s load case %s", e->given ? "Enable" : "Disable", name);
        return TRUE;
      }
    case EDIT_SNAPSHOT:
      swap_projects (p, e->other);
      return TRUE;
    case EDIT_CRITERIA:
      g_free (e->old_text);
      e->old_text = g_strdup (p->criteria);
      g_free (p->criteria);
      p->criteria = g_strdup (e->text);
      g_free (e->label);
      e->label = g_strdup ("Choose the criteria set");
      return TRUE;
    default:
      g_assert_not_reached ();
      return FALSE;
    }
}

static void
revert_change (BwEdit *e, BwProject *p)
{
  Place at;

  switch (e->kind)
    {
    case EDIT_PARAM:
      if (locate (p, e->unit_id, &at))
        {
          int i = bw_param_index (at.unit->type, e->param_id);
          if (i >= 0)
            at.unit->values[i] = e->old_value;
        }
      break;
    case EDIT_COUNTS:
      if (locate (p, e->unit_id, &at))
        {
          at.unit->n_parallel = e->old_a;
          at.unit->n_standby = e->old_b;
        }
      break;
    case EDIT_RENAME:
      if (locate (p, e->unit_id, &at))
        {
          g_free (at.unit->name);
          at.unit->name = g_steal_pointer (&e->old_text);
        }
      break;
    case EDIT_PROJECT_NAME:
      g_free (p->name);
      p->name = g_steal_pointer (&e->old_text);
      break;
    case EDIT_ADD:
    case EDIT_DUPLICATE:
      if (locate (p, e->unit_id, &at))
        g_ptr_array_remove_index (at.list, at.index);
      break;
    case EDIT_REMOVE:
      {
        GPtrArray *list = container (p, e->train_id, e->parent_id, NULL);
        g_assert (list != NULL && e->held != NULL);
        g_ptr_array_insert (list, (int) MIN (e->held_index, list->len), g_steal_pointer (&e->held));
        break;
      }
    case EDIT_MOVE:
      if (locate (p, e->unit_id, &at))
        {
          g_ptr_array_steal_index (at.list, at.index);
          g_ptr_array_insert (at.list, (int) e->old_a, at.unit);
        }
      break;
    case EDIT_FLOW:
      if (e->old_given)
        p->basis.flows_given |= 1u << e->a;
      else
        p->basis.flows_given &= ~(1u << e->a);
      p->basis.flow_m3_s[e->a] = e->old_value;
      break;
    case EDIT_TEMPERATURE:
      p->basis.temperature_K[e->a] = e->old_value;
      break;
    case EDIT_RAW_WATER:
      *raw_field (p, e->a) = e->old_value;
      break;
    case EDIT_CASE:
      if (e->a < p->cases->len)
        g_array_index (p->cases, BwLoadCase, e->a).enabled = e->old_given;
      break;
    case EDIT_CRITERIA:
      g_free (p->criteria);
      p->criteria = g_steal_pointer (&e->old_text);
      break;
    case EDIT_SNAPSHOT:
      swap_projects (p, e->other);
      break;
    default:
      g_assert_not_reached ();
    }
  if (e->old_cases != NULL)
    {
      g_array_set_size (p->cases, 0);
      g_array_append_vals (p->cases, e->old_cases->data, e->old_cases->len);
    }
}

gboolean
bw_edit_apply (BwEdit *edit, BwProject *p, GError **error)
{
  GError *local = NULL;

  g_return_val_if_fail (edit != NULL && p != NULL, FALSE);
  g_return_val_if_fail (!edit->applied, FALSE);
  g_clear_pointer (&edit->old_cases, g_array_unref);
  edit->old_cases = g_array_copy (p->cases);
  if (!apply_change (edit, p, &local))
    {
      /* Nothing was changed except, perhaps, what the kind saved before failing. */
      g_clear_pointer (&edit->old_cases, g_array_unref);
      g_propagate_error (error, local);
      return FALSE;
    }
  edit->applied = TRUE;
  if (!bw_project_validate (p, &local))
    {
      bw_edit_revert (edit, p);
      g_propagate_error (error, local);
      return FALSE;
    }
  return TRUE;
}

void
bw_edit_revert (BwEdit *edit, BwProject *p)
{
  g_return_if_fail (edit != NULL && p != NULL);
  g_return_if_fail (edit->applied);
  revert_change (edit, p);
  edit->applied = FALSE;
}

/* --- the stack --- */

struct _BwEditStack
{
  GPtrArray *done;   /* BwEdit*, applied, oldest first */
  GPtrArray *undone; /* BwEdit*, reverted, the next redo last */
  int saved_at;      /* done->len at the last save; -1 when that state can no longer be reached */
};

BwEditStack *
bw_edit_stack_new (void)
{
  BwEditStack *s = g_new0 (BwEditStack, 1);

  s->done = g_ptr_array_new_with_free_func ((GDestroyNotify) bw_edit_free);
  s->undone = g_ptr_array_new_with_free_func ((GDestroyNotify) bw_edit_free);
  return s;
}

void
bw_edit_stack_free (BwEditStack *stack)
{
  if (stack == NULL)
    return;
  g_ptr_array_unref (stack->done);
  g_ptr_array_unref (stack->undone);
  g_free (stack);
}

gboolean
bw_edit_stack_do (BwEditStack *stack, BwProject *p, BwEdit *edit, BwEditCheckFunc check,
                  gpointer user_data, GError **error)
{
  g_return_val_if_fail (stack != NULL && p != NULL && edit != NULL, FALSE);
  if (!bw_edit_apply (edit, p, error))
    {
      bw_edit_free (edit);
      return FALSE;
    }
  if (check != NULL && !check (p, user_data, error))
    {
      bw_edit_revert (edit, p);
      bw_edit_free (edit);
      return FALSE;
    }
  g_ptr_array_set_size (stack->undone, 0);
  if (stack->saved_at > (int) stack->done->len)
    stack->saved_at = -1;
  g_ptr_array_add (stack->done, edit);
  return TRUE;
}

gboolean
bw_edit_stack_undo (BwEditStack *stack, BwProject *p)
{
  BwEdit *e;

  g_return_val_if_fail (stack != NULL && p != NULL, FALSE);
  if (stack->done->len == 0)
    return FALSE;
  e = g_ptr_array_steal_index (stack->done, stack->done->len - 1);
  bw_edit_revert (e, p);
  g_ptr_array_add (stack->undone, e);
  return TRUE;
}

gboolean
bw_edit_stack_redo (BwEditStack *stack, BwProject *p)
{
  BwEdit *e;
  g_autoptr (GError) error = NULL;

  g_return_val_if_fail (stack != NULL && p != NULL, FALSE);
  if (stack->undone->len == 0)
    return FALSE;
  e = g_ptr_array_steal_index (stack->undone, stack->undone->len - 1);
  if (!bw_edit_apply (e, p, &error))
    {
      /* Cannot happen: the edit applied to this very state before. Drop the redo history. */
      g_warning ("redo of '%s' failed: %s", bw_edit_get_label (e), error->message);
      bw_edit_free (e);
      g_ptr_array_set_size (stack->undone, 0);
      return FALSE;
    }
  g_ptr_array_add (stack->done, e);
  return TRUE;
}

gboolean
bw_edit_stack_can_undo (const BwEditStack *stack)
{
  g_return_val_if_fail (stack != NULL, FALSE);
  return stack->done->len > 0;
}

gboolean
bw_edit_stack_can_redo (const BwEditStack *stack)
{
  g_return_val_if_fail (stack != NULL, FALSE);
  return stack->undone->len > 0;
}

const BwEdit *
bw_edit_stack_peek_undo (const BwEditStack *stack)
{
  g_return_val_if_fail (stack != NULL, NULL);
  return stack->done->len ? g_ptr_array_index (stack->done, stack->done->len - 1) : NULL;
}

const BwEdit *
bw_edit_stack_peek_redo (const BwEditStack *stack)
{
  g_return_val_if_fail (stack != NULL, NULL);
  return stack->undone->len ? g_ptr_array_index (stack->undone, stack->undone->len - 1) : NULL;
}

void
bw_edit_stack_mark_saved (BwEditStack *stack)
{
  g_return_if_fail (stack != NULL);
  stack->saved_at = (int) stack->done->len;
}

gboolean
bw_edit_stack_is_modified (const BwEditStack *stack)
{
  g_return_val_if_fail (stack != NULL, FALSE);
  return stack->saved_at != (int) stack->done->len;
}

void
bw_edit_stack_clear (BwEditStack *stack, gboolean saved)
{
  g_return_if_fail (stack != NULL);
  g_ptr_array_set_size (stack->done, 0);
  g_ptr_array_set_size (stack->undone, 0);
  stack->saved_at = saved ? 0 : -1;
}
