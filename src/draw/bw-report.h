/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-report.h: the submittal report and the reviewer's findings report, as multi-page PDF files
 * (cairo PDF surface, Pango text). They show what the engine returns and recompute nothing. */
#pragma once

#include <cairo.h>
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

/* The pages of the same design report as bw_report_write_pdf, laid out by the same code with the
 * same text measurement, as cairo recording surfaces (one per page, the page size in points,
 * origin at the top left; cairo_surface_destroy frees each). For a preview: the page count and
 * every page agree with the PDF. NULL with BW_DRAW_ERROR_CAIRO (or _SIZE for a bad paper). */
GPtrArray *bw_report_render_pages (const BwProject *p, const BwResults *r, GArray *checks,
                                   const BwCriteriaSet *set, BwReportPaper paper, BwUnitSystem units,
                                   GError **error);

/* Paints PAGE (from bw_report_render_pages) on white paper onto CR, SCALE device units per point. */
void bw_report_paint_page (cairo_surface_t *page, cairo_t *cr, double scale);

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
