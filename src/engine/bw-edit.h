/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-edit.h: undoable edit commands on a BwProject, and the undo/redo stack that holds them. */
#pragma once

#include <glib.h>

#include "engine/bw-project.h"

G_BEGIN_DECLS

/* One change to a project. An edit names what it changes by id (unit, stage, train), never by
 * pointer, so it stays valid while other edits come and go. bw_edit_apply changes the project
 * and validates the result: an edit that would leave an invalid model is undone before apply
 * returns FALSE, so the project is always valid. bw_edit_revert undoes an applied edit. */
typedef struct _BwEdit BwEdit;

/* Which raw-water value bw_edit_set_raw_water sets. */
typedef enum
{
  BW_RAW_TURBIDITY,  /* NTU */
  BW_RAW_ALKALINITY, /* kg/m3 as CaCO3 */
  BW_RAW_PH,
} BwRawWaterField;

/* Sets parameter PARAM_ID of unit (or stage) UNIT_ID to VALUE (SI, count, or choice index). */
BwEdit *bw_edit_set_param (const char *unit_id, const char *param_id, double value);
/* Sets the units in parallel and, of those, on standby. */
BwEdit *bw_edit_set_counts (const char *unit_id, guint n_parallel, guint n_standby);
/* Renames a unit or stage. */
BwEdit *bw_edit_rename_unit (const char *unit_id, const char *name);
/* Renames the project. */
BwEdit *bw_edit_set_project_name (const char *name);
/* Adds a new unit of TYPE with default parameters at POSITION (clamped to the end) of train
 * TRAIN_ID, or, when PARENT_ID names a flocculator, a new stage of that flocculator. The new
 * item gets a fresh id; a new flocculator gets one paddle stage. */
BwEdit *bw_edit_add_unit (const char *train_id, const char *parent_id, guint position,
                          BwProcessType type);
/* Removes a unit or stage (a flocculator keeps at least one stage: validation refuses). */
BwEdit *bw_edit_remove_unit (const char *unit_id);
/* Inserts a copy of a unit or stage right after it, with fresh ids. */
BwEdit *bw_edit_duplicate_unit (const char *unit_id);
/* Moves a unit or stage DELTA places along the flow within its train or flocculator. */
BwEdit *bw_edit_move_unit (const char *unit_id, int delta);
/* Sets a plant flow; GIVEN FALSE removes it (the maximum-day flow is required). Load cases are
 * regenerated when the set of flows changes (the enabled flag of a surviving case is kept). */
BwEdit *bw_edit_set_flow (BwFlowKind kind, gboolean given, double flow_m3_s);
BwEdit *bw_edit_set_temperature (BwTempKind kind, double temperature_K);
BwEdit *bw_edit_set_raw_water (BwRawWaterField field, double value);
/* Enables or disables load case INDEX of the project's list. */
BwEdit *bw_edit_set_case_enabled (guint index, gboolean enabled);
/* Chooses the criteria set (an id or a path). */
BwEdit *bw_edit_set_criteria (const char *criteria);

/* Replaces the whole project with a copy of AFTER (taken now), labelled LABEL ("Apply the
 * auto-sized design"); revert restores the project as it was. For compound edits (several
 * parameters at once, the chemistry basis, review records) that a single command does not
 * cover. UNIT_ID (may be NULL) is what bw_edit_get_unit_id reports. */
BwEdit *bw_edit_snapshot (const BwProject *after, const char *label, const char *unit_id);
void bw_edit_free (BwEdit *edit);

/* "Set length of North settling basin". */
const char *bw_edit_get_label (const BwEdit *edit);

/* The id of the unit or stage the edit made or changed (for a duplicate or add: the new one;
 * NULL for project-wide edits). Valid after a successful apply. */
const char *bw_edit_get_unit_id (const BwEdit *edit);

/* TRUE when the edit changes what a list of the plant shows: units or stages added, removed,
 * moved or renamed, or their parallel counts. */
gboolean bw_edit_changes_layout (const BwEdit *edit);

gboolean bw_edit_apply (BwEdit *edit, BwProject *p, GError **error);
void bw_edit_revert (BwEdit *edit, BwProject *p);

/* An extra test an edit must pass before it is kept (e.g. that the project still evaluates). */
typedef gboolean (*BwEditCheckFunc) (const BwProject *p, gpointer user_data, GError **error);

typedef struct _BwEditStack BwEditStack;

BwEditStack *bw_edit_stack_new (void);
void bw_edit_stack_free (BwEditStack *stack);

/* Applies EDIT (taking ownership) to P; when it applies and CHECK (may be NULL) accepts the
 * result, it is pushed on the undo stack and the redo stack is cleared. Otherwise the project is
 * left as it was, EDIT is freed and ERROR says why. */
gboolean bw_edit_stack_do (BwEditStack *stack, BwProject *p, BwEdit *edit, BwEditCheckFunc check,
                           gpointer user_data, GError **error);
gboolean bw_edit_stack_undo (BwEditStack *stack, BwProject *p);
gboolean bw_edit_stack_redo (BwEditStack *stack, BwProject *p);
gboolean bw_edit_stack_can_undo (const BwEditStack *stack);
gboolean bw_edit_stack_can_redo (const BwEditStack *stack);
/* The edit undo (redo) would revert (re-apply), or NULL. */
const BwEdit *bw_edit_stack_peek_undo (const BwEditStack *stack);
const BwEdit *bw_edit_stack_peek_redo (const BwEditStack *stack);

/* The "modified since save" marker: mark_saved records the current point; the project is
 * modified whenever undo/redo/do moves away from it (and stays modified if that point is lost
 * because new edits replaced the redo stack). */
void bw_edit_stack_mark_saved (BwEditStack *stack);
gboolean bw_edit_stack_is_modified (const BwEditStack *stack);
/* Forgets every edit; the current state counts as saved when SAVED, else as modified. */
void bw_edit_stack_clear (BwEditStack *stack, gboolean saved);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (BwEdit, bw_edit_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (BwEditStack, bw_edit_stack_free)

G_END_DECLS
