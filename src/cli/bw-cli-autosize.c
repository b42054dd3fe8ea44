/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-cli-autosize.c: the `autosize` command. */
#include "config.h"

#include <stdio.h>

#include "cli/bw-cli.h"
#include "engine/bw-autosize.h"
#include "io/bw-criteria-xml.h"
#include "io/bw-project-xml.h"

static const BwOptSpec autosize_specs[] = {
  { "unit", BW_OPT_STRING, 0, NULL, NULL, TRUE, "ID", "the unit to size (a flocculator sizes its stages)", NULL },
  { "objective", BW_OPT_CHOICE, 0, NULL, "volume|footprint|power", FALSE, "NAME",
    "what to minimise (default volume)", NULL },
  { "criteria", BW_OPT_STRING, 0, NULL, NULL, FALSE, "NAME|FILE", "criteria set (default the project's)", NULL },
  { "apply", BW_OPT_INT, 0, NULL, NULL, FALSE, "K", "write design K (1 = best) into the project (with -o)", NULL },
  { "output", BW_OPT_STRING, 0, NULL, NULL, FALSE, "FILE", "where --apply writes the project", NULL },
};

static void
print_values (const BwProcessUnit *u, const double *values, BwUnitSystem units, GString *s)
{
  guint n;
  const BwParamSpec *specs = bw_params_of (u->type, &n);

  for (guint i = 0; i < n; i++)
    if (values[i] != u->values[i])
      {
        g_autofree char *v = specs[i].type == BW_PARAM_QUANTITY
                               ? bw_units_format (values[i], specs[i].kind, units)
                               : g_strdup_printf ("%g", values[i]);
        g_string_append_printf (s, "%s%s %s", s->len ? ", " : "", specs[i].label, v);
      }
}

static int
run_autosize (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) p = bw_project_load (args->positional[0], &error);
  g_autoptr (BwCriteriaSet) set = NULL;
  const BwOptValue *cv = bw_cli_get (args, "criteria"), *ov = bw_cli_get (args, "objective");
  const BwOptValue *av = bw_cli_get (args, "apply"), *outv = bw_cli_get (args, "output");
  const char *unit_id = bw_cli_get (args, "unit")->text;
  BwObjective obj = BW_OBJECTIVE_VOLUME;
  BwAutosizeResult r;
  const BwProcessUnit *u;

  if (p == NULL)
    return bw_cli_usage_error (args->command, "%s", error->message);
  if (av->given != outv->given)
    return bw_cli_usage_error (args->command, "--apply and --output go together");
  if (ov->given)
    bw_objective_from_name (ov->text, &obj);
  set = bw_criteria_set_open (cv->given ? cv->text : p->criteria ? p->criteria : "textbook-ranges", &error);
  if (set == NULL)
    return bw_cli_usage_error (args->command, "--criteria: %s", error->message);
  u = bw_project_find_unit (p, unit_id, NULL);
  if (!bw_autosize (p, unit_id, set, obj, NULL, NULL, &r, &error))
    {
      bw_autosize_result_clear (&r);
      return bw_cli_usage_error (args->command, "--unit: %s", error->message);
    }
  if (av->given)
    {
      if (av->value < 1 || av->value > r.n_best)
        {
          bw_autosize_result_clear (&r);
          return bw_cli_usage_error (args->command, "--apply: choose 1 to %u", r.n_best);
        }
      if (!bw_autosize_apply (p, unit_id, &r.best[(guint) av->value - 1], &error)
          || !bw_project_save (p, outv->text, &error))
        {
          bw_autosize_result_clear (&r);
          return bw_cli_usage_error (args->command, "--output: %s", error->message);
        }
    }

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_string (j, "unit", unit_id);
      bw_json_string (j, "objective", bw_objective_name (obj));
      bw_json_string (j, "criteria_set", set->id);
      bw_json_string (j, "searched", r.searched);
      bw_json_int (j, "candidates", (gint64) r.candidates);
      bw_json_int (j, "evaluations", (gint64) r.evaluations);
      bw_json_int (j, "passing", (gint64) r.passing);
      bw_json_begin_array (j, "designs");
      for (guint i = 0; i < r.n_best; i++)
        {
          const BwCandidate *c = &r.best[i];
          guint n;
          const BwParamSpec *specs = bw_params_of (u->type, &n);
          bw_json_begin_object (j, NULL);
          bw_json_int (j, "rank", i + 1);
          bw_json_number (j, obj == BW_OBJECTIVE_VOLUME ? "objective_m3" : obj == BW_OBJECTIVE_FOOTPRINT
                                                                         ? "objective_m2" : "objective_W",
                          c->objective);
          bw_json_number (j, "volume_m3", c->volume_m3);
          bw_json_int (j, "parallel", c->n_parallel);
          bw_json_begin_object (j, "values");
          for (guint k = 0; k < n; k++)
            bw_json_number (j, specs[k].id, c->values[k]);
          bw_json_end_object (j);
          if (c->n_stages)
            {
              bw_json_begin_array (j, "stages");
              for (guint s = 0; s < c->n_stages; s++)
                {
                  const BwProcessUnit *st = g_ptr_array_index (u->stages, s);
                  guint sn;
                  const BwParamSpec *ss = bw_params_of (st->type, &sn);
                  bw_json_begin_object (j, NULL);
                  bw_json_string (j, "id", st->id);
                  for (guint k = 0; k < sn; k++)
                    bw_json_number (j, ss[k].id, c->stage_values[s][k]);
                  bw_json_end_object (j);
                }
              bw_json_end_array (j);
            }
          bw_json_begin_array (j, "margins");
          for (guint k = 0; k < c->n_margins; k++)
            {
              bw_json_begin_object (j, NULL);
              bw_json_string (j, "criterion", c->margin_criteria[k]->id);
              bw_json_number (j, "margin_fraction", c->margins[k]);
              bw_json_end_object (j);
            }
          bw_json_end_array (j);
          bw_json_end_object (j);
        }
      bw_json_end_array (j);
      if (av->given)
        bw_json_string (j, "written", outv->text);
      bw_json_print_free (j);
    }
  else
    {
      printf ("Auto-size %s (%s) against %s, objective: %s\nSearched: %s\n", unit_id,
              bw_process_type_label (u->type), set->id, bw_objective_name (obj), r.searched);
      printf ("%" G_GUINT64_FORMAT " designs tried, %" G_GUINT64_FORMAT " pass every required "
              "criterion in every load case.\n", r.candidates, r.passing);
      printf ("Preliminary design aid: verify with a licensed professional engineer; local codes govern.\n\n");
      for (guint i = 0; i < r.n_best; i++)
        {
          const BwCandidate *c = &r.best[i];
          g_autoptr (GString) s = g_string_new (NULL);
          g_autofree char *objv = bw_units_format (c->objective, obj == BW_OBJECTIVE_VOLUME ? BW_KIND_VOLUME
                                                                  : obj == BW_OBJECTIVE_FOOTPRINT ? BW_KIND_AREA
                                                                  : BW_KIND_POWER, args->units);
          double worst = G_MAXDOUBLE;
          const BwCriterion *wc = NULL;
          print_values (u, c->values, args->units, s);
          for (guint st = 0; st < c->n_stages; st++)
            {
              g_autoptr (GString) t = g_string_new (NULL);
              print_values (g_ptr_array_index (u->stages, st), c->stage_values[st], args->units, t);
              if (t->len)
                g_string_append_printf (s, "%sstage %u: %s", s->len ? "; " : "", st + 1, t->str);
            }
          for (guint k = 0; k < c->n_margins; k++)
            if (c->margins[k] < worst)
              worst = c->margins[k], wc = c->margin_criteria[k];
          printf ("%u. %s %s, %u in parallel: %s\n", i + 1, bw_objective_name (obj), objv, c->n_parallel,
                  s->len ? s->str : "as the project has it");
          if (wc)
            printf ("   tightest margin %.1f %% on %s\n", worst * 100, wc->title);
        }
      if (av->given)
        printf ("\nWrote design %d into %s\n", (int) av->value, outv->text);
    }
  bw_autosize_result_clear (&r);
  return BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_autosize = {
  "autosize", "The best few passing designs of one unit across every load case.", "PROJECT", 1, 1,
  autosize_specs, G_N_ELEMENTS (autosize_specs), run_autosize,
  "Searches construction increments of the unit's size (basins: count, width, length, depth;\n"
  "rapid mix: tank, impeller diameter and speed; flocculator stages: paddle speed and blade\n"
  "length, turbine speed and diameter, baffle spacing and passes; plates: angle, spacing, length,\n"
  "count) for designs that pass every required criterion in every enabled load case.",
};
