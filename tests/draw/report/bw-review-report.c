/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-review-report.c: test driver that writes the findings report of a review
 *   bw-review-report PROJECT STATED.csv OUT.pdf [a4|letter] [si|us]
 * (the same steps `review -o` takes: load, evaluate, check, bw_review at 1 %, write). */
#include "config.h"

#include <stdio.h>

#include "draw/bw-report.h"
#include "engine/bw-review.h"
#include "io/bw-criteria-xml.h"
#include "io/bw-csv.h"
#include "io/bw-project-xml.h"

int
main (int argc, char **argv)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) p = NULL;
  g_autoptr (BwResults) r = NULL;
  g_autoptr (BwCriteriaSet) set = NULL;
  g_autoptr (GArray) checks = NULL;
  g_autoptr (GPtrArray) stated = NULL;
  g_autoptr (GArray) findings = NULL;
  BwReportPaper paper = BW_REPORT_PAPER_A4;
  BwUnitSystem units = BW_UNIT_SYSTEM_SI;

  if (argc < 4 || (argc > 4 && !bw_report_paper_from_name (argv[4], &paper))
      || (argc > 5 && !bw_unit_system_from_name (argv[5], &units)))
    {
      fprintf (stderr, "usage: %s PROJECT STATED.csv OUT.pdf [a4|letter] [si|us]\n", argv[0]);
      return 2;
    }
  if ((p = bw_project_load (argv[1], &error)) == NULL || (r = bw_project_evaluate (p, &error)) == NULL
      || (set = bw_criteria_set_open (p->criteria ? p->criteria : "textbook-ranges", &error)) == NULL
      || (stated = bw_stated_load_csv (argv[2], &error)) == NULL)
    {
      fprintf (stderr, "%s\n", error->message);
      return 2;
    }
  checks = bw_check_results (r, set);
  findings = bw_review (r, stated, checks, 0.01);
  if (!bw_review_report_write_pdf (p, r, findings, set, 0.01, paper, units, argv[3], &error))
    {
      fprintf (stderr, "%s\n", error->message);
      return 2;
    }
  return 0;
}
