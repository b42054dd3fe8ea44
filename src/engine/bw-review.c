/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-review.c: stated-versus-computed findings, and what changed between two revisions. */
#include "config.h"

#include "engine/bw-review.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

const char *
bw_finding_kind_name (BwFindingKind k)
{
  switch (k)
    {
    case BW_FINDING_DISCREPANCY: return "discrepancy";
    case BW_FINDING_AGREES: return "agrees";
    case BW_FINDING_NOT_COMPUTED: return "not-computed";
    case BW_FINDING_CRITERION: return "criterion";
    default: return "unknown";
    }
}

static int
find_element (const BwResults *r, const char *id)
{
  for (guint i = 0; i < r->elements->len; i++)
    if (g_strcmp0 (((BwElementResult *) g_ptr_array_index (r->elements, i))->id, id) == 0)
      return (int) i;
  return -1;
}

static int
find_case (const BwResults *r, const BwLoadCase *c)
{
  for (guint i = 0; i < r->n_cases; i++)
    if (r->cases[i].flow == c->flow && r->cases[i].temp == c->temp && r->cases[i].service == c->service)
      return (int) i;
  return -1;
}

GArray *
bw_review (const BwResults *results, GPtrArray *stated, GArray *checks, double tolerance)
{
  GArray *findings = g_array_new (FALSE, TRUE, sizeof (BwFinding));

  g_return_val_if_fail (results != NULL && tolerance > 0, findings);
  for (guint i = 0; stated && i < stated->len; i++)
    {
      const BwStated *s = g_ptr_array_index (stated, i);
      BwFinding f = { BW_FINDING_NOT_COMPUTED, s, NULL, 0, 0, -1, -1 };
      const int e = find_element (results, s->element);
      int c = -1;

      f.element = e;
      if (e >= 0)
        {
          if (s->which == BW_STATED_CASE)
            c = find_case (results, &s->load_case);
          else
            c = bw_results_extreme_case (results, (guint) e, s->quantity, s->which == BW_STATED_MAXIMUM);
        }
      if (e >= 0 && c >= 0)
        {
          const BwElementResult *el = g_ptr_array_index (results->elements, e);
          if (bw_quantity_set_has (&el->values[c], s->quantity))
            {
              const double v = el->values[c].values[s->quantity];
              f.computed = v;
              f.load_case = c;
              /* Relative to the computed value; an exact zero compares absolutely. */
              f.relative_difference = v != 0 ? (s->value - v) / fabs (v) : s->value;
              f.kind = fabs (f.relative_difference) > tolerance ? BW_FINDING_DISCREPANCY : BW_FINDING_AGREES;
            }
        }
      g_array_append_val (findings, f);
    }
  for (guint i = 0; checks && i < checks->len; i++)
    {
      const BwCheck *ck = &g_array_index (checks, BwCheck, i);
      if (ck->status == BW_CHECK_FAIL || ck->status == BW_CHECK_WARN)
        {
          BwFinding f = { BW_FINDING_CRITERION, NULL, ck, ck->value, 0, ck->governing_case, ck->element };
          g_array_append_val (findings, f);
        }
    }
  return findings;
}

/* --- revision compare --- */

void
bw_change_free (BwChange *c)
{
  if (c == NULL)
    return;
  g_free (c->where);
  g_free (c->what);
  g_free (c->old_text);
  g_free (c->new_text);
  g_free (c->unit_id);
  g_free (c);
}

static char *
fmt_si (double v, BwQuantityKind kind)
{
  return bw_units_format (v, kind, BW_UNIT_SYSTEM_SI);
}

static void
add_change (GPtrArray *out, BwChangeKind kind, const char *where, const char *what, gboolean has_old,
            double old_v, gboolean has_new, double new_v, BwQuantityKind unit_kind)
{
  BwChange *c = g_new0 (BwChange, 1);

  c->kind = kind;
  c->where = g_strdup (where);
  c->what = g_strdup (what);
  c->has_old = has_old;
  c->has_new = has_new;
  c->old_value = has_old ? old_v : 0;
  c->new_value = has_new ? new_v : 0;
  c->old_text = has_old ? fmt_si (old_v, unit_kind) : g_strdup ("—");
  c->new_text = has_new ? fmt_si (new_v, unit_kind) : g_strdup ("—");
  c->numeric = TRUE;
  c->quantity_kind = unit_kind;
  g_ptr_array_add (out, c);
}

static void
add_text_change (GPtrArray *out, BwChangeKind kind, const char *where, const char *what,
                 const char *old_t, const char *new_t)
{
  BwChange *c = g_new0 (BwChange, 1);

  c->kind = kind;
  c->where = g_strdup (where);
  c->what = g_strdup (what);
  c->has_old = old_t != NULL;
  c->has_new = new_t != NULL;
  c->old_text = g_strdup (old_t ? old_t : "—");
  c->new_text = g_strdup (new_t ? new_t : "—");
  g_ptr_array_add (out, c);
}

/* Marks the changes from index FROM on as belonging to unit ID of TYPE. */
static void
tag_unit (GPtrArray *out, guint from, const char *id, BwProcessType type)
{
  for (guint i = from; i < out->len; i++)
    {
      BwChange *c = g_ptr_array_index (out, i);
      g_free (c->unit_id);
      c->unit_id = g_strdup (id);
      c->unit_type = type;
    }
}

static void
collect_units (GPtrArray *units, GHashTable *into)
{
  for (guint i = 0; i < units->len; i++)
    {
      BwProcessUnit *u = g_ptr_array_index (units, i);
      g_hash_table_insert (into, u->id, u);
      collect_units (u->stages, into);
    }
}

static GHashTable *
unit_table (const BwProject *p)
{
  GHashTable *t = g_hash_table_new (g_str_hash, g_str_equal);
  for (guint i = 0; i < p->trains->len; i++)
    collect_units (((BwTrain *) g_ptr_array_index (p->trains, i))->units, t);
  return t;
}

static void
diff_unit (GPtrArray *out, const BwProcessUnit *a, const BwProcessUnit *b)
{
  guint n;
  const BwParamSpec *specs;

  if (a->type != b->type)
    {
      add_text_change (out, BW_CHANGE_INPUT, a->id, "type", bw_process_type_name (a->type),
                       bw_process_type_name (b->type));
      return;
    }
  if (a->n_parallel != b->n_parallel)
    add_change (out, BW_CHANGE_INPUT, a->id, "parallel", TRUE, a->n_parallel, TRUE, b->n_parallel,
                BW_KIND_NUMBER);
  if (a->n_standby != b->n_standby)
    add_change (out, BW_CHANGE_INPUT, a->id, "standby", TRUE, a->n_standby, TRUE, b->n_standby,
                BW_KIND_NUMBER);
  if (g_strcmp0 (a->name, b->name) != 0)
    add_text_change (out, BW_CHANGE_INPUT, a->id, "name", a->name, b->name);
  specs = bw_params_of (a->type, &n);
  for (guint i = 0; i < n; i++)
    if (a->values[i] != b->values[i])
      {
        if (specs[i].type == BW_PARAM_CHOICE)
          add_text_change (out, BW_CHANGE_INPUT, a->id, specs[i].id,
                           bw_param_choice_name (&specs[i], (int) a->values[i]),
                           bw_param_choice_name (&specs[i], (int) b->values[i]));
        else
          add_change (out, BW_CHANGE_INPUT, a->id, specs[i].id, !(specs[i].optional && a->values[i] == 0),
                      a->values[i], !(specs[i].optional && b->values[i] == 0), b->values[i], specs[i].kind);
      }
}

static int
compare_ids (const void *a, const void *b)
{
  return strcmp (*(const char *const *) a, *(const char *const *) b);
}

GPtrArray *
bw_project_diff (const BwProject *a, const BwProject *b, const BwResults *ra, const BwResults *rb,
                 GArray *ca, GArray *cb)
{
  GPtrArray *out = g_ptr_array_new_with_free_func ((GDestroyNotify) bw_change_free);
  g_autoptr (GHashTable) ua = NULL;
  g_autoptr (GHashTable) ub = NULL;

  g_return_val_if_fail (a != NULL && b != NULL, out);
  /* The design basis. */
  for (int f = 0; f < BW_N_FLOW_KINDS; f++)
    {
      const gboolean ha = (a->basis.flows_given >> f) & 1, hb = (b->basis.flows_given >> f) & 1;
      if (ha != hb || (ha && a->basis.flow_m3_s[f] != b->basis.flow_m3_s[f]))
        {
          g_autofree char *what = g_strdup_printf ("%s flow", bw_flow_kind_label ((BwFlowKind) f));
          add_change (out, BW_CHANGE_INPUT, "design basis", what, ha, a->basis.flow_m3_s[f], hb,
                      b->basis.flow_m3_s[f], BW_KIND_FLOW);
        }
    }
  for (int t = 0; t < BW_N_TEMP_KINDS; t++)
    if (a->basis.temperature_K[t] != b->basis.temperature_K[t])
      {
        g_autofree char *what = g_strdup_printf ("%s temperature", bw_temp_kind_name ((BwTempKind) t));
        add_change (out, BW_CHANGE_INPUT, "design basis", what, TRUE, a->basis.temperature_K[t], TRUE,
                    b->basis.temperature_K[t], BW_KIND_TEMPERATURE);
      }
  if (a->basis.turbidity_NTU != b->basis.turbidity_NTU)
    add_change (out, BW_CHANGE_INPUT, "design basis", "turbidity", TRUE, a->basis.turbidity_NTU, TRUE,
                b->basis.turbidity_NTU, BW_KIND_TURBIDITY);
  if (a->basis.alkalinity_kg_m3 != b->basis.alkalinity_kg_m3)
    add_change (out, BW_CHANGE_INPUT, "design basis", "alkalinity", TRUE, a->basis.alkalinity_kg_m3,
                TRUE, b->basis.alkalinity_kg_m3, BW_KIND_CONCENTRATION);
  if (a->basis.ph != b->basis.ph)
    add_change (out, BW_CHANGE_INPUT, "design basis", "pH", TRUE, a->basis.ph, TRUE, b->basis.ph,
                BW_KIND_NUMBER);
  {
    const BwChemistryBasis *x = &a->chemistry, *y = &b->chemistry;
    const struct { const char *what; double u, v; } d[] = {
      { "minimum dose", x->dose_min_kg_m3, y->dose_min_kg_m3 },
      { "design dose", x->dose_design_kg_m3, y->dose_design_kg_m3 },
      { "maximum dose", x->dose_max_kg_m3, y->dose_max_kg_m3 },
    };
    if (x->enabled != y->enabled || x->kind != y->kind)
      add_text_change (out, BW_CHANGE_INPUT, "chemistry", "coagulant",
                       x->enabled ? bw_coagulant_kind_name (x->kind) : NULL,
                       y->enabled ? bw_coagulant_kind_name (y->kind) : NULL);
    else if (x->enabled)
      for (guint i = 0; i < G_N_ELEMENTS (d); i++)
        if (d[i].u != d[i].v)
          add_change (out, BW_CHANGE_INPUT, "chemistry", d[i].what, TRUE, d[i].u, TRUE, d[i].v,
                      BW_KIND_CONCENTRATION);
  }
  /* Units: changed, removed, added. */
  ua = unit_table (a);
  ub = unit_table (b);
  {
    g_autofree gpointer *ka = (gpointer *) g_hash_table_get_keys_as_array (ua, NULL);
    g_autofree gpointer *kb = (gpointer *) g_hash_table_get_keys_as_array (ub, NULL);
    const guint na = g_hash_table_size (ua), nb = g_hash_table_size (ub);
    /* Sorted ids: the same output for the same files, every time. */
    qsort (ka, na, sizeof (gpointer), compare_ids);
    qsort (kb, nb, sizeof (gpointer), compare_ids);
    for (guint i = 0; i < na; i++)
      {
        const BwProcessUnit *u = g_hash_table_lookup (ua, ka[i]), *v = g_hash_table_lookup (ub, ka[i]);
        const guint from = out->len;
        if (v)
          diff_unit (out, u, v);
        else
          add_text_change (out, BW_CHANGE_INPUT, u->id, "unit", bw_process_type_label (u->type), NULL);
        /* A unit whose type changed is tagged with its new type. */
        tag_unit (out, from, u->id, v ? v->type : u->type);
      }
    for (guint i = 0; i < nb; i++)
      if (!g_hash_table_contains (ua, kb[i]))
        {
          const BwProcessUnit *v = g_hash_table_lookup (ub, kb[i]);
          add_text_change (out, BW_CHANGE_INPUT, v->id, "unit", NULL, bw_process_type_label (v->type));
          tag_unit (out, out->len - 1, v->id, v->type);
        }
  }

  /* Results in the load cases both revisions evaluate. */
  if (ra && rb)
    for (guint e = 0; e < ra->elements->len; e++)
      {
        const BwElementResult *x = g_ptr_array_index (ra->elements, e);
        const int f = find_element (rb, x->id);
        const BwElementResult *y;
        const BwProcessUnit *eu;
        const guint from = out->len;
        if (f < 0)
          continue;
        y = g_ptr_array_index (rb->elements, f);
        eu = g_hash_table_lookup (ub, x->id);
        for (guint c = 0; c < ra->n_cases; c++)
          {
            const int d = find_case (rb, &ra->cases[c]);
            g_autofree char *cid = NULL;
            g_autofree char *where = NULL;
            if (d < 0)
              continue;
            cid = bw_load_case_id (&ra->cases[c]);
            where = g_strdup_printf ("%s / %s", x->id, cid);
            for (int q = 0; q < BW_N_QUANTITIES; q++)
              {
                const gboolean ha = bw_quantity_set_has (&x->values[c], (BwQuantity) q);
                const gboolean hb = bw_quantity_set_has (&y->values[d], (BwQuantity) q);
                const double va = x->values[c].values[q], vb = y->values[d].values[q];
                if (!ha && !hb)
                  continue;
                if (ha != hb || fabs (va - vb) > 1e-9 * MAX (fabs (va), fabs (vb)))
                  add_change (out, BW_CHANGE_RESULT, where, bw_quantity_name ((BwQuantity) q), ha, va,
                              hb, vb, bw_quantity_info ((BwQuantity) q)->kind);
              }
          }
        if (eu)
          tag_unit (out, from, eu->id, eu->type);
      }

  /* Check outcomes, matched by criterion id and element id. */
  if (ca && cb && ra && rb)
    for (guint i = 0; i < ca->len; i++)
      {
        const BwCheck *x = &g_array_index (ca, BwCheck, i);
        const char *ex = x->element >= 0 ? ((BwElementResult *) g_ptr_array_index (ra->elements, x->element))->id : "";
        for (guint k = 0; k < cb->len; k++)
          {
            const BwCheck *y = &g_array_index (cb, BwCheck, k);
            const char *ey = y->element >= 0 ? ((BwElementResult *) g_ptr_array_index (rb->elements, y->element))->id : "";
            if (g_strcmp0 (x->criterion->id, y->criterion->id) == 0 && g_strcmp0 (ex, ey) == 0)
              {
                const BwProcessUnit *eu = ex[0] ? g_hash_table_lookup (ub, ex) : NULL;
                if (x->status != y->status)
                  {
                    add_text_change (out, BW_CHANGE_CHECK, ex[0] ? ex : "project", x->criterion->id,
                                     bw_check_status_name (x->status), bw_check_status_name (y->status));
                    if (eu)
                      tag_unit (out, out->len - 1, eu->id, eu->type);
                  }
                break;
              }
          }
      }
  return out;
}
