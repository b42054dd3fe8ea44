/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-autosize-dialog.h: the auto-size dialog: searches one unit's design space off the main
 * thread, lists the best passing designs and applies the chosen one as one undoable edit. */
#pragma once

#include <gtk/gtk.h>

#include "engine/bw-autosize.h"
#include "gui/bw-window.h"

G_BEGIN_DECLS

#define BW_TYPE_AUTOSIZE_DIALOG (bw_autosize_dialog_get_type ())
G_DECLARE_FINAL_TYPE (BwAutosizeDialog, bw_autosize_dialog, BW, AUTOSIZE_DIALOG, GtkWindow)

/* A dialog, transient for and modal to WINDOW, sizing unit UNIT_ID of its project (a
 * flocculator for a stage: see _bw_autosize_target). Not shown yet. */
BwAutosizeDialog *bw_autosize_dialog_new (BwWindow *window, const char *unit_id);

/* The unit being sized (borrowed). */
const char *bw_autosize_dialog_get_unit_id (BwAutosizeDialog *self);

/* The objective chosen in the dropdown; setting one not offered for the unit returns FALSE. */
BwObjective bw_autosize_dialog_get_objective (BwAutosizeDialog *self);
gboolean bw_autosize_dialog_set_objective (BwAutosizeDialog *self, BwObjective objective);

/* Starts a search of a copy of the window's project, as the Search button does. Nothing happens
 * while a search runs. The result arrives on the main loop (::search-finished). */
void bw_autosize_dialog_search (BwAutosizeDialog *self);
/* Stops the running search at its next progress report, as the Cancel button does. */
void bw_autosize_dialog_cancel (BwAutosizeDialog *self);
gboolean bw_autosize_dialog_is_searching (BwAutosizeDialog *self);

/* The designs of the last finished search (borrowed; NULL when there are none). Their
 * margin_criteria point into a copy of the criteria set the dialog holds, not the window's. */
const BwAutosizeResult *bw_autosize_dialog_get_result (BwAutosizeDialog *self);
/* The status line: "Searching…", what the search found, why it found nothing, "cancelled". */
const char *bw_autosize_dialog_get_message (BwAutosizeDialog *self);

/* Applies design K (0 = best) to the window's project as one undoable edit. Fails when there is
 * no such design or the project changed since the search. */
gboolean bw_autosize_dialog_apply (BwAutosizeDialog *self, guint k, GError **error);

/* The list of designs (a GtkListBox, one row per design) and its text, row by row. */
GtkWidget *bw_autosize_dialog_get_results_list (BwAutosizeDialog *self);
char *bw_autosize_dialog_dup_results_text (BwAutosizeDialog *self);

/* --- for the window --- */

/* The unit win.autosize sizes when SELECTED_ID is selected in P: the unit itself, a stage's
 * flocculator; NULL when bw_autosize cannot size it (or nothing is selected). Borrowed from P. */
const char *_bw_autosize_target (const BwProject *p, const char *selected_id);
/* Installs win.autosize on the window class. */
void _bw_autosize_class_init (GtkWidgetClass *widget_class);

G_END_DECLS
