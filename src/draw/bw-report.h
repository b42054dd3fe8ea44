/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-report.h: the submittal report and the reviewer's findings report, as multi-page PDF files
 * (cairo PDF surface, Pango text). They show what the engine returns and recompute nothing. */
#pragma once

#include <glib.h>

#include "engine/bw-criteria.h"
#include "engine/bw-evaluate.h"
#include "engine/bw-project.h"
#include "engine/bw-units.h"

G_BEGIN_DECLS

typedef enum
{
  BW_REPORT_PAPER_A4,     /* 595.28 x 841.89 pt */
  BW_REPORT_PAPER_LETTER, /* 612 x 792 pt */
  BW_N_REPORT_PAPERS
} BwReportPaper;

const char *bw_report_paper_name (BwReportPaper paper); /* "a4", "letter" */
gboolean bw_report_paper_from_name (const char *name, BwReportPaper *out);
/* Page size in points (1/72 in). */
void bw_report_paper_size (BwReportPaper paper, double *width_pt, double *height_pt);

/* Writes the design report of P (results R, CHECKS = bw_check_results (R, SET)) to PATH: cover,
 * contents, design basis, one section per unit (inputs, results in every load case, governing
 * values, sketches, charts), the criteria table, methods and references. Every page carries a
 * running header and "page N of M". The file is written to a temporary name beside PATH and
 * renamed on success; a failure (BW_DRAW_ERROR_WRITE naming the file, or BW_DRAW_ERROR_CAIRO)
 * leaves nothing behind. */
gboolean bw_report_write_pdf (const BwProject *p, const BwResults *r, GArray *checks,
                              const BwCriteriaSet *set, BwReportPaper paper, BwUnitSystem units,
                              const char *path, GError **error);

/* Writes the reviewer's findings report: FINDINGS is the GArray of BwFinding that bw_review
 * returned for R and CHECKS at the relative TOLERANCE. Lists every discrepancy (stated, computed,
 * relative difference, the stated line's comment), every stated value that could not be
 * matched, and every criteria finding with its clause. Same cover caution, headers, page
 * numbering and atomic write as bw_report_write_pdf. */
gboolean bw_review_report_write_pdf (const BwProject *p, const BwResults *r, GArray *findings,
                                     const BwCriteriaSet *set, double tolerance,
                                     BwReportPaper paper, BwUnitSystem units, const char *path,
                                     GError **error);

G_END_DECLS
