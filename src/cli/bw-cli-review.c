/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-cli-review.c: the reviewer's commands `export`, `review` and `diff`. */
#include "config.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

#include "cli/bw-cli.h"
#include "draw/bw-report.h"
#include "engine/bw-review.h"
#include "io/bw-criteria-xml.h"
#include "io/bw-csv.h"
#include "io/bw-project-xml.h"

#define DEFAULT_CRITERIA "textbook-ranges"

/* Loads PATH, evaluates it and grades it against CRITERIA (or the project's, or the default). */
static gboolean
load_evaluated (const char *command, const char *path, const char *criteria, BwProject **p,
                BwResults **r, BwCriteriaSet **set, GArray **checks)
{
  g_autoptr (GError) error = NULL;

  *p = bw_project_load (path, &error);
  if (*p == NULL)
    return bw_cli_usage_error (command, "%s", error->message), FALSE;
  *r = bw_project_evaluate (*p, &error);
  if (*r == NULL)
    return bw_cli_usage_error (command, "%s: %s", path, error->message), FALSE;
  *set = bw_criteria_set_open (criteria ? criteria : (*p)->criteria ? (*p)->criteria : DEFAULT_CRITERIA,
                               &error);
  if (*set == NULL)
    return bw_cli_usage_error (command, "--criteria: %s", error->message), FALSE;
  *checks = bw_check_results (*r, *set);
  return TRUE;
}

/* --- export --- */

static const BwOptSpec export_specs[] = {
  { "csv", BW_OPT_STRING, 0, NULL, NULL, TRUE, "DIR", "folder to write the CSV files into", NULL },
  { "criteria", BW_OPT_STRING, 0, NULL, NULL, FALSE, "NAME|FILE", "criteria set for checks.csv", NULL },
};

static int
run_export (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) p = NULL;
  g_autoptr (BwResults) r = NULL;
  g_autoptr (BwCriteriaSet) set = NULL;
  g_autoptr (GArray) checks = NULL;
  const BwOptValue *cv = bw_cli_get (args, "criteria");
  const char *dir = bw_cli_get (args, "csv")->text;

  if (!load_evaluated (args->command, args->positional[0], cv->given ? cv->text : NULL, &p, &r, &set,
                       &checks))
    return BW_CLI_EXIT_USAGE;
  if (!bw_export_csv (p, r, checks, dir, &error))
    return bw_cli_usage_error (args->command, "--csv: %s", error->message);
  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_string (j, "folder", dir);
      bw_json_int (j, "elements", r->elements->len);
      bw_json_int (j, "load_cases", r->n_cases);
      bw_json_int (j, "checks", checks->len);
      bw_json_print_free (j);
    }
  else
    printf ("Wrote results.csv, checks.csv and %u results-<unit>.csv files to %s\n", r->elements->len, dir);
  return BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_export = {
  "export", "Results and checks as CSV, SI units in the headers.", "PROJECT", 1, 1, export_specs,
  G_N_ELEMENTS (export_specs), run_export,
  "results.csv: one row per unit (or stage) and load case, one column per quantity; results-<id>.csv\n"
  "the same for one unit; checks.csv: every check with its value, limit, governing case and citation.",
};

/* --- review --- */

static const BwOptSpec review_specs[] = {
  { "stated", BW_OPT_STRING, 0, NULL, NULL, FALSE, "FILE.csv",
    "the values the submittal states (element,quantity,case,value,unit[,comment]); default the "
    "project's review record", NULL },
  { "tolerance", BW_OPT_QUANTITY, BW_KIND_FRACTION, NULL, NULL, FALSE, "TOL",
    "relative difference flagged as a discrepancy (default the project's, else 1%)", "tolerance" },
  { "criteria", BW_OPT_STRING, 0, NULL, NULL, FALSE, "NAME|FILE", "criteria set (default the project's)", NULL },
  { "output", BW_OPT_STRING, 0, NULL, NULL, FALSE, "FILE.pdf", "write the findings report as PDF (same as -o FILE.pdf)", NULL },
  { "paper", BW_OPT_CHOICE, 0, NULL, "a4|letter", FALSE, "SIZE", "paper of the findings report (default a4)", NULL },
};

static int
run_review (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) p = NULL;
  g_autoptr (BwResults) r = NULL;
  g_autoptr (BwCriteriaSet) set = NULL;
  g_autoptr (GArray) checks = NULL;
  g_autoptr (GPtrArray) stated_csv = NULL;
  GPtrArray *stated = NULL; /* the CSV's, or borrowed from the project */
  g_autoptr (GArray) findings = NULL;
  const BwOptValue *cv = bw_cli_get (args, "criteria");
  const BwOptValue *stated_opt = bw_cli_get (args, "stated");
  const gboolean tol_given = bw_cli_get (args, "tolerance")->given;
  double tol = bw_cli_get_double (args, "tolerance", BW_REVIEW_TOLERANCE_DEFAULT);
  guint discrepancies = 0, unmatched = 0, fails = 0, warns = 0;
  const BwOptValue *pv = bw_cli_get (args, "paper");
  const char *project = NULL, *output = NULL;
  BwReportPaper paper = BW_REPORT_PAPER_A4;

  if (!bw_cli_project_and_output (args, &project, &output))
    return BW_CLI_EXIT_USAGE;
  if (pv->given)
    bw_report_paper_from_name (pv->text, &paper);
  if (!(tol > 0) || tol > 1)
    return bw_cli_usage_error (args->command, "--tolerance: must lie between 0 and 100%%");
  if (stated_opt->given)
    {
      stated_csv = bw_stated_load_csv (stated_opt->text, &error);
      if (stated_csv == NULL)
        return bw_cli_usage_error (args->command, "--stated: %s", error->message);
      stated = stated_csv;
    }
  if (!load_evaluated (args->command, project, cv->given ? cv->text : NULL, &p, &r, &set, &checks))
    return BW_CLI_EXIT_USAGE;
  if (stated == NULL)
    {
      /* No CSV: the review record kept in the project, at its tolerance unless one is given. */
      if (p->stated->len == 0)
        return bw_cli_usage_error (args->command, "--stated: %s holds no stated values; give "
                                   "--stated FILE.csv", project);
      stated = p->stated;
      if (!tol_given)
        tol = p->review_tolerance;
    }
  findings = bw_review (r, stated, checks, tol);
  for (guint i = 0; i < findings->len; i++)
    {
      const BwFinding *f = &g_array_index (findings, BwFinding, i);
      discrepancies += f->kind == BW_FINDING_DISCREPANCY;
      unmatched += f->kind == BW_FINDING_NOT_COMPUTED;
      if (f->kind == BW_FINDING_CRITERION)
        {
          fails += f->check->status == BW_CHECK_FAIL;
          warns += f->check->status == BW_CHECK_WARN;
        }
    }

  if (output != NULL)
    {
      if (*output == '\0')
        return bw_cli_usage_error (args->command, "-o: the output file is required");
      if (!bw_review_report_write_pdf (p, r, findings, set, tol, paper, args->units, output, &error))
        return bw_cli_usage_error (args->command, "-o: %s", error->message);
    }

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_string (j, "project", p->name);
      bw_json_string (j, "criteria_set", set->id);
      bw_json_number (j, "tolerance_fraction", tol);
      bw_json_begin_object (j, "summary");
      bw_json_int (j, "stated", stated->len);
      bw_json_int (j, "discrepancies", discrepancies);
      bw_json_int (j, "not_computed", unmatched);
      bw_json_int (j, "criteria_fail", fails);
      bw_json_int (j, "criteria_warn", warns);
      bw_json_end_object (j);
      bw_json_begin_array (j, "findings");
      for (guint i = 0; i < findings->len; i++)
        {
          const BwFinding *f = &g_array_index (findings, BwFinding, i);
          bw_json_begin_object (j, NULL);
          bw_json_string (j, "kind", bw_finding_kind_name (f->kind));
          if (f->stated)
            {
              bw_json_string (j, "element", f->stated->element);
              bw_json_string (j, "quantity", bw_quantity_name (f->stated->quantity));
              bw_json_number (j, "stated_si", f->stated->value);
              bw_json_int (j, "line", f->stated->line);
              if (f->stated->comment)
                bw_json_string (j, "comment", f->stated->comment);
              if (f->kind != BW_FINDING_NOT_COMPUTED)
                {
                  bw_json_number (j, "computed_si", f->computed);
                  bw_json_number (j, "relative_difference", f->relative_difference);
                }
            }
          else
            {
              const BwCriterion *c = f->check->criterion;
              bw_json_string (j, "element", f->element >= 0
                                              ? ((BwElementResult *) g_ptr_array_index (r->elements, f->element))->id
                                              : NULL);
              bw_json_string (j, "criterion", c->id);
              bw_json_string (j, "status", bw_check_status_name (f->check->status));
              bw_json_number (j, "value_si", f->check->value);
              if (f->check->has_limit)
                bw_json_number (j, "limit_si", f->check->limit);
              bw_json_string (j, "document", c->document);
              bw_json_string (j, "clause", c->clause);
            }
          if (f->load_case >= 0)
            {
              g_autofree char *cid = bw_load_case_id (&r->cases[f->load_case]);
              bw_json_string (j, "case", cid);
            }
          bw_json_end_object (j);
        }
      bw_json_end_array (j);
      bw_json_print_free (j);
    }
  else
    {
      printf ("Review of %s against %s; stated values compared within %g %%\n",
              p->name ? p->name : project, set->id, tol * 100);
      printf ("Preliminary design aid: verify with a licensed professional engineer; local codes govern.\n\n");
      for (guint i = 0; i < findings->len; i++)
        {
          const BwFinding *f = &g_array_index (findings, BwFinding, i);
          if (f->stated)
            {
              const BwQuantityInfo *info = bw_quantity_info (f->stated->quantity);
              g_autofree char *stv = bw_units_format (f->stated->value, info->kind, args->units);
              g_autofree char *cvs = f->kind != BW_FINDING_NOT_COMPUTED
                                       ? bw_units_format (f->computed, info->kind, args->units)
                                       : g_strdup ("—");
              if (f->kind == BW_FINDING_AGREES)
                continue;
              printf ("  %-13s line %-4u %-16s %-26s stated %-14s computed %-14s%s%s\n",
                      bw_finding_kind_name (f->kind), f->stated->line, f->stated->element,
                      info->label, stv, cvs, f->stated->comment ? "  # " : "",
                      f->stated->comment ? f->stated->comment : "");
            }
          else
            {
              const BwCriterion *c = f->check->criterion;
              printf ("  %-13s %-26s %-42s %s, %s%s\n", bw_check_status_name (f->check->status),
                      f->element >= 0 ? ((BwElementResult *) g_ptr_array_index (r->elements, f->element))->id : "—",
                      c->title, c->document, c->clause ? c->clause : "",
                      c->provenance == BW_PROVENANCE_MEMORY ? " (from memory — verify)" : "");
            }
        }
      printf ("\n%u stated values: %u discrepancies, %u not computed; criteria: %u fail, %u warn\n",
              stated->len, discrepancies, unmatched, fails, warns);
    }
  return fails > 0 ? BW_CLI_EXIT_CHECK_FAILED : BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_review = {
  "review", "Stated-versus-computed discrepancies and criteria findings of a submittal.",
  "PROJECT [-o FILE.pdf]", 1, 3, review_specs, G_N_ELEMENTS (review_specs), run_review,
  "The stated CSV names each value's element, quantity, case (a load-case id, max or min), value\n"
  "and unit. Without --stated, the stated values, comments and tolerance kept in the project's\n"
  "review record are used. Exit 1 when a required criterion fails, 0 otherwise (discrepancies are listed and\n"
  "counted either way).",
};

/* --- diff --- */

static const BwOptSpec diff_specs[] = {
  { "criteria", BW_OPT_STRING, 0, NULL, NULL, FALSE, "NAME|FILE", "criteria set for both revisions", NULL },
};

static const char *
change_kind_name (BwChangeKind k)
{
  return k == BW_CHANGE_INPUT ? "input" : k == BW_CHANGE_RESULT ? "result" : "check";
}

static int
run_diff (BwCliArgs *args)
{
  g_autoptr (BwProject) pa = NULL;
  g_autoptr (BwProject) pb = NULL;
  g_autoptr (BwResults) ra = NULL;
  g_autoptr (BwResults) rb = NULL;
  g_autoptr (BwCriteriaSet) sa = NULL;
  g_autoptr (BwCriteriaSet) sb = NULL;
  g_autoptr (GArray) ca = NULL;
  g_autoptr (GArray) cb = NULL;
  g_autoptr (GPtrArray) changes = NULL;
  const BwOptValue *cv = bw_cli_get (args, "criteria");
  const char *crit = cv->given ? cv->text : NULL;
  guint counts[3] = { 0 };

  if (!load_evaluated (args->command, args->positional[0], crit, &pa, &ra, &sa, &ca)
      || !load_evaluated (args->command, args->positional[1], crit ? crit : pa->criteria, &pb, &rb, &sb, &cb))
    return BW_CLI_EXIT_USAGE;
  changes = bw_project_diff (pa, pb, ra, rb, ca, cb);
  for (guint i = 0; i < changes->len; i++)
    counts[((BwChange *) g_ptr_array_index (changes, i))->kind]++;

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_string (j, "old", args->positional[0]);
      bw_json_string (j, "new", args->positional[1]);
      bw_json_begin_object (j, "summary");
      bw_json_int (j, "inputs", counts[BW_CHANGE_INPUT]);
      bw_json_int (j, "results", counts[BW_CHANGE_RESULT]);
      bw_json_int (j, "checks", counts[BW_CHANGE_CHECK]);
      bw_json_end_object (j);
      bw_json_begin_array (j, "changes");
      for (guint i = 0; i < changes->len; i++)
        {
          const BwChange *c = g_ptr_array_index (changes, i);
          bw_json_begin_object (j, NULL);
          bw_json_string (j, "kind", change_kind_name (c->kind));
          bw_json_string (j, "where", c->where);
          bw_json_string (j, "what", c->what);
          bw_json_string (j, "old", c->has_old ? c->old_text : NULL);
          bw_json_string (j, "new", c->has_new ? c->new_text : NULL);
          if (c->kind != BW_CHANGE_CHECK && c->has_old && c->has_new && c->old_text[0] && c->old_value != c->new_value)
            {
              bw_json_number (j, "old_si", c->old_value);
              bw_json_number (j, "new_si", c->new_value);
            }
          bw_json_end_object (j);
        }
      bw_json_end_array (j);
      bw_json_print_free (j);
    }
  else
    {
      const gboolean many = counts[BW_CHANGE_RESULT] > 40;
      for (guint i = 0; i < changes->len; i++)
        {
          const BwChange *c = g_ptr_array_index (changes, i);
          g_autofree char *w = bw_cli_pad (c->where, 44);
          g_autofree char *t = bw_cli_pad (c->what, 24);
          g_autofree char *o = bw_cli_pad (c->old_text, 16);
          if (c->kind == BW_CHANGE_RESULT && many)
            continue;
          printf ("  %-6s %s %s %s -> %s\n", change_kind_name (c->kind), w, t, o, c->new_text);
        }
      if (many)
        printf ("  (%u result changes: --json lists them all)\n", counts[BW_CHANGE_RESULT]);
      printf ("\n%u inputs, %u results and %u check outcomes changed\n", counts[BW_CHANGE_INPUT],
              counts[BW_CHANGE_RESULT], counts[BW_CHANGE_CHECK]);
    }
  return BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_diff = {
  "diff", "What inputs, results and check outcomes changed between two revisions.", "OLD NEW", 2, 2,
  diff_specs, G_N_ELEMENTS (diff_specs), run_diff,
  "Results are compared in the load cases both revisions evaluate (a relative change above 1e-9).\n"
  "The readable list shows every input and check change; with many result changes it shows the\n"
  "first (--json lists them all).",
};
