/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-review-view.h: the review page: a submittal's stated values against the computed ones (with
 * the reviewer's comments and the findings report), and the compare view against another file. */
#pragma once

#include <gtk/gtk.h>

#include "gui/bw-window.h"

G_BEGIN_DECLS

#define BW_TYPE_REVIEW_VIEW (bw_review_view_get_type ())
G_DECLARE_FINAL_TYPE (BwReviewView, bw_review_view, BW, REVIEW_VIEW, GtkBox)

/* The page for WINDOW (it follows ::project-changed). */
GtkWidget *bw_review_view_new (BwWindow *window);

/* Reads the stated values of the CSV file at PATH into the project (one undoable edit), replacing
 * the stored ones. FALSE with the reader's message (which names the line), shown on the page too. */
gboolean bw_review_view_import_path (BwReviewView *self, const char *path, GError **error);
/* Writes the findings report (bw_review_report_write_pdf, atomic) to PATH. */
gboolean bw_review_view_export_findings_to (BwReviewView *self, const char *path, GError **error);
/* Loads the revision at PATH for the compare view. FALSE with the loader's message, shown too. */
gboolean bw_review_view_compare_with (BwReviewView *self, const char *path, GError **error);
/* Rebuilds the lists now instead of at the next idle (for tests). */
void bw_review_view_refresh (BwReviewView *self);

/* For tests: the findings list (rows carry "bw-kind" (BwFindingKind + 1), "bw-id" (element) and,
 * for stated values, "bw-stated" (index + 1) and the comment entry as "bw-comment"); the compare
 * list (change rows carry "bw-change-kind" (BwChangeKind + 1), "bw-where", "bw-what", "bw-old" and
 * "bw-new", the texts shown); the tolerance entry; the summary line. */
GtkWidget *bw_review_view_get_findings_list (BwReviewView *self);
GtkWidget *bw_review_view_get_compare_list (BwReviewView *self);
GtkWidget *bw_review_view_get_tolerance_entry (BwReviewView *self);
const char *bw_review_view_get_summary (BwReviewView *self);
/* The message line of the findings (import errors) and of the compare view. */
const char *bw_review_view_get_findings_note (BwReviewView *self);
const char *bw_review_view_get_compare_note (BwReviewView *self);
/* Shows "findings" or "compare". */
void bw_review_view_show (BwReviewView *self, const char *name);

G_END_DECLS
