/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-report-dialog.h: the design report: paper, preparer and revision, a page preview drawn by
 * the report's own layout, and the PDF export (win.export-report). */
#pragma once

#include <gtk/gtk.h>

#include "gui/bw-window.h"

G_BEGIN_DECLS

#define BW_TYPE_REPORT_DIALOG (bw_report_dialog_get_type ())
G_DECLARE_FINAL_TYPE (BwReportDialog, bw_report_dialog, BW, REPORT_DIALOG, GtkWindow)

/* A dialog over WINDOW's project; it starts laying out the preview at once (off the main thread). */
BwReportDialog *bw_report_dialog_new (BwWindow *window);

/* The win.export-report action: opens the dialog over the window WIDGET. */
void bw_report_dialog_action (GtkWidget *widget, const char *action_name, GVariant *parameter);

/* TRUE while the preview is laid out or the PDF written. */
gboolean bw_report_dialog_is_busy (BwReportDialog *self);
/* Pages of the preview (0 until it is laid out, or when it cannot be) and the one shown (1-based). */
guint bw_report_dialog_get_n_pages (BwReportDialog *self);
guint bw_report_dialog_get_page (BwReportDialog *self);
void bw_report_dialog_set_page (BwReportDialog *self, guint page);
/* Paints the page shown, fitted into WIDTH x HEIGHT, as the preview does; FALSE when there is none. */
gboolean bw_report_dialog_paint_preview (BwReportDialog *self, cairo_t *cr, int width, int height);
/* Writes the report to PATH (atomically, off the main thread); the status line says how it went. */
void bw_report_dialog_export_to (BwReportDialog *self, const char *path);
/* The status line: what is being done, the last export, or why there is no preview. */
const char *bw_report_dialog_get_message (BwReportDialog *self);

G_END_DECLS
