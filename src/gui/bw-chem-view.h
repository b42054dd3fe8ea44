/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-chem-view.h: the chemistry page of a workbench window: the coagulant and its dose range, the
 * feed, alkalinity and sludge they imply, and the project's jar tests with their chart. */
#pragma once

#include <gtk/gtk.h>

#include "gui/bw-window.h"

G_BEGIN_DECLS

#define BW_TYPE_CHEM_VIEW (bw_chem_view_get_type ())
G_DECLARE_FINAL_TYPE (BwChemView, bw_chem_view, BW, CHEM_VIEW, GtkBox)

/* The page for WINDOW (it follows the window's ::project-changed). */
GtkWidget *bw_chem_view_new (BwWindow *window);

/* The entry (or dropdown, or check button) of a chemistry field and the label that shows its
 * error: "enabled", "kind", "hydrate", "al2o3", "basicity", "dose:minimum", "dose:design",
 * "dose:maximum", "ss-factor", "residual-target"; "target" is the jar-test target turbidity. */
GtkWidget *bw_chem_view_get_field_widget (BwChemView *self, const char *field_id);
GtkWidget *bw_chem_view_get_field_error (BwChemView *self, const char *field_id);

/* Reads the jar-test sheet at PATH and adds it to the project as one undoable edit (what the
 * "Import jar test…" chooser does with the file picked). On failure the reader's message is
 * also shown on the page. */
gboolean bw_chem_view_import_path (BwChemView *self, const char *path, GError **error);

/* Selects the jar-test record ID in the list; FALSE when there is none. */
gboolean bw_chem_view_select_jar_test (BwChemView *self, const char *id);
const char *bw_chem_view_get_selected_jar_test (BwChemView *self);

/* "Use this dose" for the selected record (the button's action). */
gboolean bw_chem_view_use_dose (BwChemView *self, GError **error);

/* The widgets a test drives: "import", "remove", "use", "chart", "jar-list", "results". */
GtkWidget *bw_chem_view_get_widget (BwChemView *self, const char *name);

/* Paints the selected record's chart on CR (what the chart area's draw function does); FALSE
 * with the reason when there is nothing to draw. PAINTS counts the chart area's draws so far. */
gboolean bw_chem_view_paint_chart (BwChemView *self, cairo_t *cr, int width, int height,
                                   gboolean dark, GError **error);
guint bw_chem_view_get_paint_count (BwChemView *self);

/* The text of the results grid, row by row, cells separated by tabs (for tests). */
char *bw_chem_view_dup_results_text (BwChemView *self);

G_END_DECLS
