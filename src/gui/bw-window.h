/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-window.h: a workbench window: one project, its navigator, editors and live results. */
#pragma once

#include <gtk/gtk.h>

#include "engine/bw-criteria.h"
#include "engine/bw-edit.h"
#include "engine/bw-evaluate.h"
#include "engine/bw-units.h"
#include "engine/bw-project.h"
#include "gui/bw-application.h"

G_BEGIN_DECLS

#define BW_TYPE_WINDOW (bw_window_get_type ())
G_DECLARE_FINAL_TYPE (BwWindow, bw_window, BW, WINDOW, GtkApplicationWindow)

/* A window holding a blank project (one empty train, a maximum-day flow). */
BwWindow *bw_window_new (BwApplication *app);

/* Replaces the window's project with the file at PATH. */
gboolean bw_window_open_path (BwWindow *self, const char *path, GError **error);
/* Takes P (owned) as an unsaved project with no file. */
void bw_window_take_project (BwWindow *self, BwProject *p);
/* Saves to PATH (atomic) and makes it the window's file. */
gboolean bw_window_save_to (BwWindow *self, const char *path, GError **error);

/* TRUE when the window has no file and no edits (a fresh blank window). */
gboolean bw_window_is_pristine (BwWindow *self);
gboolean bw_window_is_modified (BwWindow *self);
const char *bw_window_get_path (BwWindow *self);

/* The model (borrowed; edit it only through bw_window_do_edit). */
const BwProject *bw_window_get_project (BwWindow *self);
/* Applies EDIT (owned) through the undo stack; the project must still evaluate. */
gboolean bw_window_do_edit (BwWindow *self, BwEdit *edit, GError **error);

/* Moves unit (or stage) ID to the place of TARGET_ID in the same train (or flocculator), as
 * one undoable edit: what dropping a dragged navigator row on another does. */
gboolean bw_window_move_unit_to (BwWindow *self, const char *id, const char *target_id, GError **error);
/* Selects a unit or stage in the navigator (and the editor follows). */
gboolean bw_window_select_unit (BwWindow *self, const char *id);
const char *bw_window_get_selected_id (BwWindow *self);
/* Shows one page: "unit", "checks", "basis" or "sketch". */
void bw_window_show_page (BwWindow *self, const char *name);

/* The editor widget of parameter PARAM_ID of the selected unit (an entry, a dropdown or a spin
 * button) and the label that shows its error; "name" is the unit's name entry. Basis fields are
 * "flow:maximum-day", "temperature:coldest", "raw:turbidity", "raw:alkalinity", "raw:ph";
 * "parallel" and "standby" are the navigator's spin buttons, "every-case" the results toggle,
 * "criteria" the criteria-set dropdown, "case:N" the check button of load case N,
 * "sketch-view" the sketch page's view dropdown and "sketch-area" its drawing area. */
GtkWidget *bw_window_get_field_widget (BwWindow *self, const char *field_id);
GtkWidget *bw_window_get_field_error (BwWindow *self, const char *field_id);

/* The checks list (a GtkListBox, one row per check) and the navigator list. */
GtkWidget *bw_window_get_checks_list (BwWindow *self);
GtkWidget *bw_window_get_navigator (BwWindow *self);
/* The label at column COL, row ROW of the selected unit's results table (row 0 holds the
 * headings, column 0 the quantities and their criteria, the columns after it the values);
 * NULL where there is none. */
GtkWidget *bw_window_get_results_cell (BwWindow *self, int col, int row);
/* The text of the results table for the selected unit, row by row (for tests). */
char *bw_window_dup_results_text (BwWindow *self);

/* Writes the autosave copy now when there are unsaved edits; returns its path or NULL. */
char *bw_window_autosave_now (BwWindow *self);
/* Shows the offer to recover the autosave at PATH (from an earlier session). */
void bw_window_offer_recovery (BwWindow *self, const char *path);

/* --- for pages beyond the built-in four --- */

/* Adds CHILD as a page NAME titled TITLE to the window's page stack (bw_window_show_page and
 * win.page('NAME') then reach it). The page listens to ::project-changed to refresh. */
void bw_window_add_page (BwWindow *self, const char *name, const char *title, GtkWidget *child);

/* The results of the project as it is now (NULL when it does not evaluate), the checks against
 * the chosen criteria set (NULL when there is none), that set, and the unit system shown. All
 * borrowed and valid until the next ::project-changed. */
const BwResults *bw_window_get_results (BwWindow *self);
GArray *bw_window_get_checks (BwWindow *self);
const BwCriteriaSet *bw_window_get_criteria (BwWindow *self);
BwUnitSystem bw_window_get_unit_system (BwWindow *self);

G_END_DECLS
