/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-cli-project.c: the project commands `compute`, `check` and `criteria`. */
#include "config.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

#include "cli/bw-cli.h"
#include "engine/bw-evaluate.h"
#include "io/bw-criteria-xml.h"
#include "io/bw-project-xml.h"

#define DEFAULT_CRITERIA "textbook-ranges"

/* JSON key of a quantity: its name and its SI unit ("overflow_rate_m_s", "G_per_s"). */
static char *
json_key (BwQuantity q)
{
  static const char *const suffix[BW_N_KINDS] = {
    [BW_KIND_LENGTH] = "_m", [BW_KIND_AREA] = "_m2", [BW_KIND_VOLUME] = "_m3",
    [BW_KIND_FLOW] = "_m3_s", [BW_KIND_VELOCITY] = "_m_s", [BW_KIND_SURFACE_LOADING] = "_m_s",
    [BW_KIND_WEIR_LOADING] = "_m2_s", [BW_KIND_TIME] = "_s", [BW_KIND_POWER] = "_W",
    [BW_KIND_HEAD] = "_m", [BW_KIND_RATE] = "_per_s", [BW_KIND_FRACTION] = "_fraction",
    [BW_KIND_NUMBER] = "", [BW_KIND_MASS_FLOW] = "_kg_s", [BW_KIND_CONCENTRATION] = "_kg_m3",
  };
  const BwQuantityInfo *info = bw_quantity_info (q);
  return g_strconcat (info->name, suffix[info->kind] ? suffix[info->kind] : "", NULL);
}

static BwProject *
load_project (const BwCliArgs *args, GError **error)
{
  return bw_project_load (args->positional[0], error);
}

static int
io_fail (const BwCliArgs *args, const GError *error)
{
  return bw_cli_usage_error (args->command, "%s", error->message);
}

static void
json_cases (BwJson *j, const BwProject *p, const BwResults *r)
{
  bw_json_begin_array (j, "load_cases");
  for (guint c = 0; c < r->n_cases; c++)
    {
      const BwLoadCase *lc = &r->cases[c];
      g_autofree char *id = bw_load_case_id (lc);
      g_autofree char *label = bw_load_case_label (lc);
      bw_json_begin_object (j, NULL);
      bw_json_string (j, "id", id);
      bw_json_string (j, "label", label);
      bw_json_string (j, "flow", bw_flow_kind_name (lc->flow));
      bw_json_number (j, "plant_flow_m3_s", p->basis.flow_m3_s[lc->flow]);
      bw_json_string (j, "temperature", bw_temp_kind_name (lc->temp));
      bw_json_number (j, "temperature_C", p->basis.temperature_K[lc->temp] - 273.15);
      bw_json_string (j, "service", bw_service_state_name (lc->service));
      bw_json_end_object (j);
    }
  bw_json_end_array (j);
}

/* --- compute --- */

static int
run_compute (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) p = load_project (args, &error);
  g_autoptr (BwResults) r = NULL;

  if (p == NULL)
    return io_fail (args, error);
  r = bw_project_evaluate (p, &error);
  if (r == NULL)
    return bw_cli_usage_error (args->command, "%s: %s", args->positional[0], error->message);

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_string (j, "project", p->name);
      json_cases (j, p, r);
      bw_json_begin_array (j, "elements");
      for (guint e = 0; e < r->elements->len; e++)
        {
          const BwElementResult *el = g_ptr_array_index (r->elements, e);
          bw_json_begin_object (j, NULL);
          bw_json_string (j, "id", el->id);
          bw_json_string (j, "label", el->label);
          bw_json_string (j, "type", bw_element_type_name (el->type));
          bw_json_string (j, "train", el->train->id);
          bw_json_int (j, "parallel", el->unit->n_parallel);
          bw_json_int (j, "standby", el->unit->n_standby);
          bw_json_begin_array (j, "results");
          for (guint c = 0; c < r->n_cases; c++)
            {
              g_autofree char *cid = bw_load_case_id (&r->cases[c]);
              bw_json_begin_object (j, NULL);
              bw_json_string (j, "case", cid);
              for (int q = 0; q < BW_N_QUANTITIES; q++)
                if (bw_quantity_set_has (&el->values[c], (BwQuantity) q))
                  {
                    g_autofree char *key = json_key ((BwQuantity) q);
                    bw_json_number (j, key, el->values[c].values[q]);
                  }
              bw_json_end_object (j);
            }
          bw_json_end_array (j);
          bw_json_begin_object (j, "governing");
          for (int q = 0; q < BW_N_QUANTITIES; q++)
            {
              const int lo = bw_results_extreme_case (r, e, (BwQuantity) q, FALSE);
              const int hi = bw_results_extreme_case (r, e, (BwQuantity) q, TRUE);
              g_autofree char *key = NULL;
              g_autofree char *lo_id = NULL;
              g_autofree char *hi_id = NULL;
              if (lo < 0)
                continue;
              key = json_key ((BwQuantity) q);
              lo_id = bw_load_case_id (&r->cases[lo]);
              hi_id = bw_load_case_id (&r->cases[hi]);
              bw_json_begin_object (j, key);
              bw_json_number (j, "min", el->values[lo].values[q]);
              bw_json_string (j, "min_case", lo_id);
              bw_json_number (j, "max", el->values[hi].values[q]);
              bw_json_string (j, "max_case", hi_id);
              bw_json_end_object (j);
            }
          bw_json_end_object (j);
          bw_json_end_object (j);
        }
      bw_json_end_array (j);
      bw_json_print_free (j);
      return BW_CLI_EXIT_OK;
    }

  printf ("%s — %u load cases\n", p->name ? p->name : args->positional[0], r->n_cases);
  printf ("Preliminary design aid: verify with a licensed professional engineer; local codes govern.\n");
  for (guint e = 0; e < r->elements->len; e++)
    {
      const BwElementResult *el = g_ptr_array_index (r->elements, e);
      printf ("\n%s [%s, %s]\n", el->label, el->id, bw_element_type_label (el->type));
      printf ("  %-36s %-16s %-38s %-16s %s\n", "quantity", "smallest", "in case", "largest", "in case");
      for (int q = 0; q < BW_N_QUANTITIES; q++)
        {
          const BwQuantityInfo *info = bw_quantity_info ((BwQuantity) q);
          const int lo = bw_results_extreme_case (r, e, (BwQuantity) q, FALSE);
          const int hi = bw_results_extreme_case (r, e, (BwQuantity) q, TRUE);
          g_autofree char *a = NULL;
          g_autofree char *b = NULL;
          g_autofree char *la = NULL;
          g_autofree char *lb = NULL;
          if (lo < 0)
            continue;
          a = bw_units_format (el->values[lo].values[q], info->kind, args->units);
          b = bw_units_format (el->values[hi].values[q], info->kind, args->units);
          if (fabs (el->values[lo].values[q] - el->values[hi].values[q])
              <= 1e-12 * fabs (el->values[hi].values[q]))
            {
              g_autofree char *c1 = bw_cli_pad (info->label, 36);
              g_autofree char *c2 = bw_cli_pad (a, 16);
              printf ("  %s %s (the same in every case)\n", c1, c2);
              continue;
            }
          la = bw_load_case_label (&r->cases[lo]);
          lb = bw_load_case_label (&r->cases[hi]);
          {
            g_autofree char *c1 = bw_cli_pad (info->label, 36);
            g_autofree char *c2 = bw_cli_pad (a, 16);
            g_autofree char *c3 = bw_cli_pad (la, 38);
            g_autofree char *c4 = bw_cli_pad (b, 16);
            printf ("  %s %s %s %s %s\n", c1, c2, c3, c4, lb);
          }
        }
    }
  return BW_CLI_EXIT_OK;
}

static const BwOptSpec compute_specs[] = { 0 };

const BwCliCommand bw_cli_cmd_compute = {
  "compute", "Every unit's results in every load case of a project, and the governing cases.",
  "PROJECT", 1, 1, compute_specs, 0, run_compute,
  "JSON: load_cases, and per element its results in every case (keys end in their SI unit)\n"
  "and, per quantity, the smallest and largest value with the case where each occurs.",
};

/* --- check --- */

static const BwOptSpec check_specs[] = {
  { "criteria", BW_OPT_STRING, 0, NULL, NULL, FALSE, "NAME|FILE",
    "criteria set id or file (default: the project's, else " DEFAULT_CRITERIA ")", NULL },
};

static void
format_limit (const BwCheck *ck, BwUnitSystem units, char **out)
{
  const BwQuantityInfo *info = bw_quantity_info (ck->criterion->quantity);
  g_autofree char *v = NULL;

  if (!ck->has_limit)
    {
      *out = g_strdup ("");
      return;
    }
  v = bw_units_format (ck->limit, info->kind, units);
  *out = g_strdup_printf ("%s %s%s", ck->limit_is_max ? "≤" : "≥", v,
                          ck->limit_is_required ? "" : " (preferred)");
}

static int
run_check (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) p = load_project (args, &error);
  g_autoptr (BwResults) r = NULL;
  g_autoptr (BwCriteriaSet) set = NULL;
  g_autoptr (GArray) checks = NULL;
  const BwOptValue *cv = bw_cli_get (args, "criteria");
  const char *which;
  guint counts[4];

  if (p == NULL)
    return io_fail (args, error);
  which = cv->given ? cv->text : p->criteria ? p->criteria : DEFAULT_CRITERIA;
  set = bw_criteria_set_open (which, &error);
  if (set == NULL)
    return bw_cli_usage_error (args->command, "--criteria: %s", error->message);
  r = bw_project_evaluate (p, &error);
  if (r == NULL)
    return bw_cli_usage_error (args->command, "%s: %s", args->positional[0], error->message);
  checks = bw_check_results (r, set);
  bw_checks_count (checks, counts);

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_string (j, "project", p->name);
      bw_json_string (j, "criteria_set", set->id);
      bw_json_string (j, "criteria_set_name", set->name);
      bw_json_begin_object (j, "summary");
      bw_json_int (j, "pass", counts[BW_CHECK_PASS]);
      bw_json_int (j, "warn", counts[BW_CHECK_WARN]);
      bw_json_int (j, "fail", counts[BW_CHECK_FAIL]);
      bw_json_int (j, "not_applicable", counts[BW_CHECK_NOT_APPLICABLE]);
      bw_json_end_object (j);
      json_cases (j, p, r);
      bw_json_begin_array (j, "checks");
      for (guint i = 0; i < checks->len; i++)
        {
          const BwCheck *ck = &g_array_index (checks, BwCheck, i);
          const BwCriterion *c = ck->criterion;
          g_autofree char *key = json_key (c->quantity);
          bw_json_begin_object (j, NULL);
          bw_json_string (j, "criterion", c->id);
          bw_json_string (j, "title", c->title);
          bw_json_string (j, "quantity", bw_quantity_name (c->quantity));
          bw_json_string (j, "element", ck->element >= 0
                                          ? ((BwElementResult *) g_ptr_array_index (r->elements, ck->element))->id
                                          : NULL);
          bw_json_string (j, "status", ck->status == BW_CHECK_NOT_APPLICABLE ? "not_applicable"
                                                                             : bw_check_status_name (ck->status));
          if (ck->governing_case >= 0)
            {
              g_autofree char *cid = bw_load_case_id (&r->cases[ck->governing_case]);
              g_autofree char *vkey = g_strconcat ("value", key + strlen (bw_quantity_name (c->quantity)), NULL);
              g_autofree char *lkey = g_strconcat ("limit", key + strlen (bw_quantity_name (c->quantity)), NULL);
              bw_json_number (j, vkey, ck->value);
              if (ck->has_limit)
                {
                  bw_json_number (j, lkey, ck->limit);
                  bw_json_string (j, "limit_type", ck->limit_is_max ? "max" : "min");
                  bw_json_string (j, "limit_level", ck->limit_is_required ? "required" : "preferred");
                }
              bw_json_string (j, "governing_case", cid);
            }
          bw_json_begin_object (j, "citation");
          bw_json_string (j, "document", c->document);
          bw_json_string (j, "edition", c->edition);
          bw_json_string (j, "clause", c->clause);
          bw_json_string (j, "provenance", c->provenance == BW_PROVENANCE_SEEN ? "seen" : "memory");
          bw_json_end_object (j);
          bw_json_end_object (j);
        }
      bw_json_end_array (j);
      bw_json_print_free (j);
    }
  else
    {
      printf ("%s checked against %s (%s)\n", p->name ? p->name : args->positional[0], set->name, set->id);
      printf ("Preliminary design aid: verify with a licensed professional engineer; local codes govern.\n\n");
      printf ("  %-5s %-24s %-42s %-16s %-28s %s\n", "", "element", "criterion", "value", "limit",
              "governing case / citation");
      for (guint i = 0; i < checks->len; i++)
        {
          const BwCheck *ck = &g_array_index (checks, BwCheck, i);
          const BwCriterion *c = ck->criterion;
          const BwQuantityInfo *info = bw_quantity_info (c->quantity);
          g_autofree char *value = ck->governing_case >= 0 ? bw_units_format (ck->value, info->kind, args->units)
                                                           : g_strdup ("—");
          g_autofree char *limit = NULL;
          g_autofree char *cas = ck->governing_case >= 0 ? bw_load_case_label (&r->cases[ck->governing_case])
                                                         : g_strdup ("no matching unit or case");
          const char *el = ck->element >= 0
                             ? ((BwElementResult *) g_ptr_array_index (r->elements, ck->element))->id
                             : "—";
          format_limit (ck, args->units, &limit);
          {
            g_autofree char *c1 = bw_cli_pad (el, 24);
            g_autofree char *c2 = bw_cli_pad (c->title, 42);
            g_autofree char *c3 = bw_cli_pad (value, 16);
            g_autofree char *c4 = bw_cli_pad (limit, 28);
            printf ("  %-5s %s %s %s %s %s\n", bw_check_status_name (ck->status), c1, c2, c3, c4, cas);
          }
          printf ("  %-5s %-24s %s%s%s%s%s%s\n", "", "", c->document, c->edition ? ", " : "",
                  c->edition ? c->edition : "", c->clause ? ", " : "", c->clause ? c->clause : "",
                  c->provenance == BW_PROVENANCE_MEMORY ? " (from memory — verify)" : "");
        }
      printf ("\n%u pass, %u warn, %u fail, %u not applicable\n", counts[BW_CHECK_PASS],
              counts[BW_CHECK_WARN], counts[BW_CHECK_FAIL], counts[BW_CHECK_NOT_APPLICABLE]);
    }
  return counts[BW_CHECK_FAIL] > 0 ? BW_CLI_EXIT_CHECK_FAILED : BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_check = {
  "check", "Check a project against a criteria set, across all its load cases.",
  "PROJECT", 1, 1, check_specs, G_N_ELEMENTS (check_specs), run_check,
  "Exit status: 0 when every required criterion passes, 1 when one fails, 2 on bad input.\n"
  "A check is pass, warn (inside the required limits but outside the preferred ones), fail, or\n"
  "not applicable, with the value and limit at the governing load case and the citation.",
};

/* --- criteria --- */

static const BwOptSpec criteria_specs[] = {
  { "list", BW_OPT_FLAG, 0, NULL, NULL, TRUE, NULL, "list the criteria sets found", NULL },
};

static int
run_criteria (BwCliArgs *args)
{
  GPtrArray *skipped = NULL;
  g_autoptr (GPtrArray) sets = bw_criteria_find_all (&skipped);
  g_autoptr (GPtrArray) dirs = bw_criteria_search_dirs ();

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_begin_array (j, "criteria_sets");
      for (guint i = 0; i < sets->len; i++)
        {
          const BwCriteriaSet *s = g_ptr_array_index (sets, i);
          bw_json_begin_object (j, NULL);
          bw_json_string (j, "id", s->id);
          bw_json_string (j, "name", s->name);
          bw_json_int (j, "criteria", s->criteria->len);
          bw_json_string (j, "file", s->origin);
          bw_json_end_object (j);
        }
      bw_json_end_array (j);
      bw_json_begin_array (j, "search_path");
      for (guint i = 0; i < dirs->len; i++)
        bw_json_string (j, NULL, g_ptr_array_index (dirs, i));
      bw_json_end_array (j);
      bw_json_begin_array (j, "skipped");
      for (guint i = 0; i < skipped->len; i++)
        bw_json_string (j, NULL, g_ptr_array_index (skipped, i));
      bw_json_end_array (j);
      bw_json_print_free (j);
    }
  else
    {
      for (guint i = 0; i < sets->len; i++)
        {
          const BwCriteriaSet *s = g_ptr_array_index (sets, i);
          printf ("%-30s %3u criteria  %s\n  %s\n", s->id, s->criteria->len, s->name, s->origin);
        }
      printf ("\nSearched:");
      for (guint i = 0; i < dirs->len; i++)
        printf (" %s", (const char *) g_ptr_array_index (dirs, i));
      printf ("\n");
      for (guint i = 0; i < skipped->len; i++)
        fprintf (stderr, "skipped: %s\n", (const char *) g_ptr_array_index (skipped, i));
    }
  g_ptr_array_unref (skipped);
  return BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_criteria = {
  "criteria", "The criteria sets found (shipped and user).", NULL, 0, 0, criteria_specs,
  G_N_ELEMENTS (criteria_specs), run_criteria,
  "User sets go in $XDG_DATA_HOME/basinwright/criteria (or a folder in $BW_CRITERIA_PATH);\n"
  "see docs/file-format.md for how to write one.",
};
