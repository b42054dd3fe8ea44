/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-cli-report.c: `report`, the submittal report of a project as a PDF file. */
#include "config.h"

#include <stdio.h>
#include <string.h>

#include "cli/bw-cli.h"
#include "draw/bw-report.h"
#include "engine/bw-evaluate.h"
#include "io/bw-criteria-xml.h"
#include "io/bw-project-xml.h"

#define DEFAULT_CRITERIA "textbook-ranges"

static const BwOptSpec report_specs[] = {
  { "output", BW_OPT_STRING, 0, NULL, NULL, FALSE, "FILE.pdf", "the PDF to write (same as -o FILE.pdf)",
    NULL },
  { "paper", BW_OPT_CHOICE, 0, NULL, "a4|letter", FALSE, "SIZE", "paper size (default a4)", NULL },
  { "criteria", BW_OPT_STRING, 0, NULL, NULL, FALSE, "NAME|FILE",
    "criteria set id or file (default: the project's, else " DEFAULT_CRITERIA ")", NULL },
};

static int
run_report (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) p = NULL;
  g_autoptr (BwResults) r = NULL;
  g_autoptr (BwCriteriaSet) set = NULL;
  g_autoptr (GArray) checks = NULL;
  const BwOptValue *pv = bw_cli_get (args, "paper");
  const BwOptValue *cv = bw_cli_get (args, "criteria");
  const char *project = NULL, *output = NULL;
  BwReportPaper paper = BW_REPORT_PAPER_A4;
  guint counts[4] = { 0 };

  if (!bw_cli_project_and_output (args, &project, &output))
    return BW_CLI_EXIT_USAGE;
  if (output == NULL || *output == '\0')
    return bw_cli_usage_error (args->command, "-o: the output file is required");
  if (pv->given && !bw_report_paper_from_name (pv->text, &paper))
    return bw_cli_usage_error (args->command, "--paper: '%s' is not a4 or letter", pv->text);

  p = bw_project_load (project, &error);
  if (p == NULL)
    return bw_cli_usage_error (args->command, "%s", error->message);
  r = bw_project_evaluate (p, &error);
  if (r == NULL)
    return bw_cli_usage_error (args->command, "%s: %s", project, error->message);
  set = bw_criteria_set_open (cv->given ? cv->text : p->criteria ? p->criteria : DEFAULT_CRITERIA, &error);
  if (set == NULL)
    return bw_cli_usage_error (args->command, "--criteria: %s", error->message);
  checks = bw_check_results (r, set);

  if (!bw_report_write_pdf (p, r, checks, set, paper, args->units, output, &error))
    return bw_cli_usage_error (args->command, "-o: %s", error->message);

  bw_checks_count (checks, counts);
  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_string (j, "file", output);
      bw_json_string (j, "paper", bw_report_paper_name (paper));
      bw_json_string (j, "criteria_set", set->id);
      bw_json_int (j, "checks_fail", counts[BW_CHECK_FAIL]);
      bw_json_int (j, "checks_warn", counts[BW_CHECK_WARN]);
      bw_json_print_free (j);
    }
  else
    printf ("Wrote %s (%s): %u units evaluated in %u load cases; criteria %u pass, %u warn, %u fail\n",
            output, bw_report_paper_name (paper), r->elements->len, r->n_cases, counts[BW_CHECK_PASS],
            counts[BW_CHECK_WARN], counts[BW_CHECK_FAIL]);
  return BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_report = {
  "report", "The submittal report of a project (calculations, drawings, checks) as a PDF file.",
  "PROJECT -o FILE.pdf", 1, 3, report_specs, G_N_ELEMENTS (report_specs), run_report,
  "Cover, contents, design basis, one section per unit (inputs, results in every load case,\n"
  "governing values, drawings and charts), the criteria table with citations, and the methods\n"
  "used. Values in --units si (default) or us. The file is written only when complete. A failing\n"
  "criterion is reported in the PDF; the exit status is 0 when the report is written.",
};
