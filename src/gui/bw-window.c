/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-window.c: the workbench window: navigator, live results, checks, and the edit plumbing. */
#include "config.h"

#include "gui/bw-window.h"
#include "gui/bw-help.h"
#include "gui/bw-level-cell.h"

#include <glib/gi18n.h>
#include <math.h>

#include "draw/bw-labels.h"
#include "engine/bw-error.h"
#include "engine/bw-evaluate.h"
#include "gui/bw-autosize-dialog.h"
#include "gui/bw-chem-view.h"
#include "gui/bw-locale.h"
#include "gui/bw-report-dialog.h"
#include "gui/bw-review-view.h"
#include "gui/bw-wheel.h"
#include "gui/bw-window-private.h"
#include "io/bw-criteria-xml.h"
#include "io/bw-project-xml.h"

#define DEFAULT_CRITERIA "textbook-ranges"

G_DEFINE_FINAL_TYPE (BwWindow, bw_window, GTK_TYPE_APPLICATION_WINDOW)

enum
{
  SIGNAL_PROJECT_CHANGED,
  N_SIGNALS
};
static guint window_signals[N_SIGNALS];

static void nav_rebuild (BwWindow *self);
static void nav_refresh (BwWindow *self);
static void results_rebuild (BwWindow *self);
static void checks_rebuild (BwWindow *self);
static void update_actions (BwWindow *self);
static void counts_refresh (BwWindow *self);

/* --- finding things in the model --- */

/* The train, the flocculator (for a stage) and the index of unit or stage ID. */
static BwProcessUnit *
locate (const BwProject *p, const char *id, BwTrain **train, BwProcessUnit **parent, guint *index)
{
  if (id == NULL)
    return NULL;
  for (guint i = 0; i < p->trains->len; i++)
    {
      BwTrain *t = g_ptr_array_index (p->trains, i);
      for (guint k = 0; k < t->units->len; k++)
        {
          BwProcessUnit *u = g_ptr_array_index (t->units, k);
          if (g_strcmp0 (u->id, id) == 0)
            {
              *train = t;
              *parent = NULL;
              *index = k;
              return u;
            }
          for (guint s = 0; s < u->stages->len; s++)
            {
              BwProcessUnit *st = g_ptr_array_index (u->stages, s);
              if (g_strcmp0 (st->id, id) == 0)
                {
                  *train = t;
                  *parent = u;
                  *index = s;
                  return st;
                }
            }
        }
    }
  return NULL;
}

static int
element_of (BwWindow *self, const char *id)
{
  if (self->results == NULL || id == NULL)
    return -1;
  for (guint i = 0; i < self->results->elements->len; i++)
    {
      const BwElementResult *e = g_ptr_array_index (self->results->elements, i);
      if (g_strcmp0 (e->id, id) == 0)
        return (int) i;
    }
  return -1;
}

static const char *
status_class (BwCheckStatus s)
{
  switch (s)
    {
    case BW_CHECK_PASS:
      return "bw-status-pass";
    case BW_CHECK_WARN:
      return "bw-status-warn";
    case BW_CHECK_FAIL:
      return "bw-status-fail";
    default:
      return "bw-status-na";
    }
}

/* Worse first: fail, warn, pass, not applicable. */
static int
status_rank (BwCheckStatus s)
{
  return s == BW_CHECK_FAIL ? 3 : s == BW_CHECK_WARN ? 2 : s == BW_CHECK_PASS ? 1 : 0;
}

/* The worst status of the checks on element ID; -1 when none applies. */
static int
worst_status (BwWindow *self, const char *id)
{
  int e = element_of (self, id), worst = -1;

  if (e < 0 || self->checks == NULL)
    return -1;
  for (guint i = 0; i < self->checks->len; i++)
    {
      const BwCheck *ck = &g_array_index (self->checks, BwCheck, i);
      if (ck->element == e && ck->status != BW_CHECK_NOT_APPLICABLE
          && (worst < 0 || status_rank (ck->status) > status_rank ((BwCheckStatus) worst)))
        worst = ck->status;
    }
  return worst;
}

/* --- evaluation --- */

static void
load_criteria (BwWindow *self)
{
  const char *want = self->project->criteria ? self->project->criteria : DEFAULT_CRITERIA;
  g_autoptr (GError) error = NULL;

  if (self->criteria && g_strcmp0 (self->criteria_id, want) == 0)
    return;
  g_clear_pointer (&self->criteria, bw_criteria_set_free);
  g_clear_pointer (&self->criteria_error, g_free);
  g_free (self->criteria_id);
  self->criteria_id = g_strdup (want);
  self->criteria = bw_criteria_set_open (want, &error);
  if (self->criteria == NULL)
    self->criteria_error = g_strdup (error->message);
}

static void
grade (BwWindow *self)
{
  g_clear_pointer (&self->checks, g_array_unref);
  load_criteria (self);
  if (self->results && self->criteria)
    self->checks = bw_check_results (self->results, self->criteria);
}

/* Re-evaluates from scratch (after undo, redo, open). */
static void
evaluate (BwWindow *self)
{
  g_autoptr (GError) error = NULL;

  g_clear_pointer (&self->results, bw_results_free);
  self->results = bw_project_evaluate (self->project, &error);
  if (self->results == NULL)
    _bw_window_set_status (self, error->message);
  else
    _bw_window_set_status (self, NULL);
  grade (self);
}

/* The check every edit must pass: the project still evaluates. Keeps the results. */
static gboolean
edit_check (const BwProject *p, gpointer data, GError **error)
{
  BwWindow *self = data;

  g_clear_pointer (&self->pending, bw_results_free);
  self->pending = bw_project_evaluate (p, error);
  return self->pending != NULL;
}

gboolean
bw_window_do_edit (BwWindow *self, BwEdit *edit, GError **error)
{
  const BwEdit *done;
  gboolean structure;

  g_return_val_if_fail (BW_IS_WINDOW (self), FALSE);
  g_return_val_if_fail (edit != NULL, FALSE);
  if (!bw_edit_stack_do (self->stack, self->project, edit, edit_check, self, error))
    {
      g_clear_pointer (&self->pending, bw_results_free);
      return FALSE;
    }
  g_clear_pointer (&self->results, bw_results_free);
  self->results = g_steal_pointer (&self->pending);
  _bw_window_set_status (self, NULL);
  grade (self);
  done = bw_edit_stack_peek_undo (self->stack);
  structure = bw_edit_changes_layout (done);
  self->autosave_dirty = TRUE;
  _bw_window_model_changed (self, structure);
  return TRUE;
}

void
_bw_window_model_changed (BwWindow *self, gboolean structure)
{
  if (structure)
    nav_rebuild (self);
  else
    nav_refresh (self);
  _bw_window_refresh_editor (self);
  _bw_window_refresh_basis (self);
  counts_refresh (self);
  results_rebuild (self);
  checks_rebuild (self);
  _bw_window_update_title (self);
  update_actions (self);
  if (self->sketch_area)
    gtk_widget_queue_draw (GTK_WIDGET (self->sketch_area));
  g_signal_emit (self, window_signals[SIGNAL_PROJECT_CHANGED], 0, structure);
}

void
_bw_window_set_status (BwWindow *self, const char *message)
{
  GtkWidget *bar = gtk_widget_get_parent (GTK_WIDGET (self->status_label));

  if (message)
    {
      gtk_label_set_text (self->status_label, message);
      gtk_widget_set_tooltip_text (GTK_WIDGET (self->status_label), message);
      gtk_widget_add_css_class (bar, "bw-eval-error");
    }
  else
    {
      g_autofree char *text = NULL;
      if (self->results)
        {
          const guint nc = self->results->n_cases, ne = self->results->elements->len;
          g_autofree char *cases = g_strdup_printf (ngettext ("%u load case evaluated",
                                                              "%u load cases evaluated", nc), nc);
          g_autofree char *elements = g_strdup_printf (ngettext ("%u element", "%u elements", ne), ne);
          /* TRANSLATORS: the status line: "16 load cases evaluated · 9 elements · ..." */
          text = g_strdup_printf (_("%s · %s · results update as you type"), cases, elements);
        }
      gtk_label_set_text (self->status_label, text ? text : "");
      gtk_widget_set_tooltip_text (GTK_WIDGET (self->status_label), NULL);
      gtk_widget_remove_css_class (bar, "bw-eval-error");
    }
}

void
_bw_window_update_title (BwWindow *self)
{
  const gboolean modified = bw_edit_stack_is_modified (self->stack);
  const char *name = self->project->name && self->project->name[0] ? self->project->name : _("Untitled plant");
  g_autofree char *title = g_strdup_printf ("%s%s", modified ? "• " : "", name);
  g_autofree char *wtitle = g_strdup_printf ("%s — Basinwright", title);
  g_autofree char *sub = NULL;

  gtk_label_set_text (self->title_label, title);
  gtk_window_set_title (GTK_WINDOW (self), wtitle);
  if (self->path)
    sub = g_strdup_printf ("%s%s", self->path, modified ? _(" (modified)") : "");
  else
    sub = g_strdup (modified ? _("not saved yet (modified)") : _("not saved yet"));
  gtk_label_set_text (self->subtitle_label, sub);
  gtk_widget_set_tooltip_text (GTK_WIDGET (self->subtitle_label), sub);
}

/* --- the navigator --- */

/* A short name of the kind for the navigator's narrow column (the editor shows the full one). */
static const char *
type_short (BwProcessType t)
{
  switch (t)
    {
    case BW_PROCESS_RAPID_MIX:
      return _("rapid mix");
    case BW_PROCESS_INLINE_MIXER:
      return _("in-line mixer");
    case BW_PROCESS_FLOCCULATOR:
      return _("flocculator");
    case BW_PROCESS_RECTANGULAR_BASIN:
      return _("basin");
    case BW_PROCESS_CIRCULAR_CLARIFIER:
      return _("clarifier");
    case BW_PROCESS_PLATE_SETTLER:
      return _("plates/tubes");
    case BW_STAGE_PADDLE:
      return _("paddles");
    case BW_STAGE_TURBINE:
      return _("turbine");
    case BW_STAGE_BAFFLED:
      return _("baffled");
    default:
      return bw_label_process_type (t);
    }
}

static GtkWidget *
nav_row (const char *id, const char *train_id, const char *name, const char *kind, int depth,
         gboolean is_train)
{
  GtkWidget *row = gtk_list_box_row_new ();
  GtkWidget *box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 6);
  GtkWidget *dot = gtk_label_new ("");
  GtkWidget *label = gtk_label_new (name);
  GtkWidget *type = gtk_label_new (kind);
  g_autofree char *acc = g_strdup_printf ("%s, %s", name, kind);
  gtk_widget_set_margin_start (box, 4 + 16 * depth);
  gtk_label_set_xalign (GTK_LABEL (label), 0);
  gtk_label_set_ellipsize (GTK_LABEL (label), PANGO_ELLIPSIZE_END);
  gtk_widget_set_hexpand (label, TRUE);
  gtk_widget_add_css_class (type, "dim-label");
  gtk_widget_add_css_class (type, "caption");
  gtk_label_set_ellipsize (GTK_LABEL (type), PANGO_ELLIPSIZE_END);
  gtk_label_set_max_width_chars (GTK_LABEL (type), 12);
  gtk_widget_set_tooltip_text (row, acc);
  gtk_label_set_width_chars (GTK_LABEL (dot), 1);
  gtk_box_append (GTK_BOX (box), dot);
  gtk_box_append (GTK_BOX (box), label);
  gtk_box_append (GTK_BOX (box), type);
  gtk_list_box_row_set_child (GTK_LIST_BOX_ROW (row), box);
  if (is_train)
    gtk_widget_add_css_class (row, "bw-train-row");
  g_object_set_data_full (G_OBJECT (row), "bw-id", g_strdup (id), g_free);
  g_object_set_data_full (G_OBJECT (row), "bw-train", g_strdup (train_id), g_free);
  g_object_set_data (G_OBJECT (row), "bw-dot", dot);
  g_object_set_data (G_OBJECT (row), "bw-name", label);
  gtk_accessible_update_property (GTK_ACCESSIBLE (row), GTK_ACCESSIBLE_PROPERTY_LABEL, acc, -1);
  return row;
}

/* Sets TEXT on LABEL only when it differs: an unchanged label keeps its layout, so a refresh
 * after an edit re-measures only what changed. */
void
_bw_label_update (GtkLabel *label, const char *text)
{
  if (g_strcmp0 (gtk_label_get_text (label), text) != 0)
    gtk_label_set_text (label, text);
}

void
_bw_widget_class_exclusive (GtkWidget *widget, const char *want, const char *const *classes, guint n)
{
  for (guint i = 0; i < n; i++)
    if (g_strcmp0 (classes[i], want) != 0 && gtk_widget_has_css_class (widget, classes[i]))
      gtk_widget_remove_css_class (widget, classes[i]);
  if (want && !gtk_widget_has_css_class (widget, want))
    gtk_widget_add_css_class (widget, want);
}

void
_bw_widget_tooltip_update (GtkWidget *widget, const char *tip)
{
  if (g_strcmp0 (gtk_widget_get_tooltip_text (widget), tip) != 0)
    gtk_widget_set_tooltip_text (widget, tip);
}

static void
set_dot (BwWindow *self, GtkWidget *row)
{
  GtkWidget *dot = g_object_get_data (G_OBJECT (row), "bw-dot");
  const char *id = g_object_get_data (G_OBJECT (row), "bw-id");
  int s = id ? worst_status (self, id) : -1;
  static const char *const classes[] = { "bw-dot-pass", "bw-dot-warn", "bw-dot-fail" };
  const char *want = s < 0 ? NULL : classes[s == BW_CHECK_FAIL ? 2 : s == BW_CHECK_WARN ? 1 : 0];
  const char *tip = s < 0                ? NULL
                    : s == BW_CHECK_FAIL ? _("a required criterion fails")
                    : s == BW_CHECK_WARN ? _("outside a preferred range")
                                         : _("every check passes");

  /* Only what changed: a CSS class added or removed restyles the row, which after every edit
   * of every row was most of the plant list's cost. */
  _bw_widget_class_exclusive (dot, want, classes, G_N_ELEMENTS (classes));
  _bw_label_update (GTK_LABEL (dot), s < 0 ? "" : "●");
  if (tip)
    _bw_widget_tooltip_update (dot, tip);
}

static void
nav_refresh (BwWindow *self)
{
  for (GtkWidget *row = gtk_widget_get_first_child (GTK_WIDGET (self->nav_list)); row;
       row = gtk_widget_get_next_sibling (row))
    {
      const char *id = g_object_get_data (G_OBJECT (row), "bw-id");
      BwTrain *t;
      BwProcessUnit *parent, *u;
      guint idx;
      if (!GTK_IS_LIST_BOX_ROW (row))
        continue;
      if (id && (u = locate (self->project, id, &t, &parent, &idx)))
        _bw_label_update (g_object_get_data (G_OBJECT (row), "bw-name"), u->name ? u->name : u->id);
      set_dot (self, row);
    }
}

/* --- reordering by drag and drop: a unit row dropped on another row of the same train (or a
 * stage on a stage of the same flocculator) takes that row's place, as one undoable move --- */

gboolean
bw_window_move_unit_to (BwWindow *self, const char *id, const char *target_id, GError **error)
{
  BwTrain *t1, *t2;
  BwProcessUnit *p1, *p2;
  guint i1, i2;

  g_return_val_if_fail (BW_IS_WINDOW (self), FALSE);
  if (locate (self->project, id, &t1, &p1, &i1) == NULL
      || locate (self->project, target_id, &t2, &p2, &i2) == NULL)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, _("move: no unit “%s”"),
                   locate (self->project, id, &t1, &p1, &i1) == NULL ? id : target_id);
      return FALSE;
    }
  if (t1 != t2 || p1 != p2)
    {
      g_set_error_literal (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                           p1 ? _("move: a stage moves only within its flocculator")
                              : _("move: a unit moves only within its train"));
      return FALSE;
    }
  if (i1 == i2)
    return TRUE;
  return bw_window_do_edit (self, bw_edit_move_unit (id, (int) i2 - (int) i1), error);
}

static GdkContentProvider *
nav_drag_prepare (GtkDragSource *source, double x, double y, gpointer data)
{
  GtkWidget *row = gtk_event_controller_get_widget (GTK_EVENT_CONTROLLER (source));
  const char *id = g_object_get_data (G_OBJECT (row), "bw-id");

  (void) x;
  (void) y;
  (void) data;
  if (id == NULL)
    return NULL;
  return gdk_content_provider_new_typed (G_TYPE_STRING, id);
}

static void
nav_drag_begin (GtkDragSource *source, GdkDrag *drag, gpointer data)
{
  GtkWidget *row = gtk_event_controller_get_widget (GTK_EVENT_CONTROLLER (source));
  g_autoptr (GdkPaintable) icon = gtk_widget_paintable_new (row);

  (void) drag;
  (void) data;
  gtk_drag_source_set_icon (source, icon, 12, 12);
}

static gboolean
nav_drop (GtkDropTarget *target, const GValue *value, double x, double y, gpointer data)
{
  BwWindow *self = data;
  GtkWidget *row = gtk_event_controller_get_widget (GTK_EVENT_CONTROLLER (target));
  const char *target_id = g_object_get_data (G_OBJECT (row), "bw-id");
  g_autoptr (GError) error = NULL;
  g_autofree char *id = NULL;

  (void) x;
  (void) y;
  if (!G_VALUE_HOLDS_STRING (value) || target_id == NULL)
    return FALSE;
  id = g_value_dup_string (value);
  if (!bw_window_move_unit_to (self, id, target_id, &error))
    {
      _bw_window_set_status (self, error->message);
      return FALSE;
    }
  bw_window_select_unit (self, id);
  return TRUE;
}

static void
nav_row_enable_dnd (BwWindow *self, GtkWidget *row)
{
  GtkDragSource *source = gtk_drag_source_new ();
  GtkDropTarget *target = gtk_drop_target_new (G_TYPE_STRING, GDK_ACTION_MOVE);

  gtk_drag_source_set_actions (source, GDK_ACTION_MOVE);
  g_signal_connect (source, "prepare", G_CALLBACK (nav_drag_prepare), self);
  g_signal_connect (source, "drag-begin", G_CALLBACK (nav_drag_begin), self);
  gtk_widget_add_controller (row, GTK_EVENT_CONTROLLER (source));
  g_signal_connect (target, "drop", G_CALLBACK (nav_drop), self);
  gtk_widget_add_controller (row, GTK_EVENT_CONTROLLER (target));
}

static void
nav_rebuild (BwWindow *self)
{
  GtkWidget *child, *select = NULL;
  GtkWidget *focus = gtk_root_get_focus (GTK_ROOT (self));
  /* keyboard work in the list (Delete, Alt+Up/Down) goes on after the rows are rebuilt */
  gboolean had_focus = focus && (focus == GTK_WIDGET (self->nav_list)
                                 || gtk_widget_is_ancestor (focus, GTK_WIDGET (self->nav_list)));

  self->updating = TRUE;
  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->nav_list))))
    gtk_list_box_remove (self->nav_list, child);
  for (guint i = 0; i < self->project->trains->len; i++)
    {
      const BwTrain *t = g_ptr_array_index (self->project->trains, i);
      GtkWidget *row = nav_row (NULL, t->id, t->name ? t->name : t->id, _("train"), 0, TRUE);
      gtk_list_box_append (self->nav_list, row);
      if (self->selected_id == NULL && g_strcmp0 (self->selected_train, t->id) == 0)
        select = row;
      for (guint k = 0; k < t->units->len; k++)
        {
          const BwProcessUnit *u = g_ptr_array_index (t->units, k);
          g_autofree char *kind = u->n_parallel > 1
                                    /* TRANSLATORS: a unit's short type and how many are in parallel,
                                     * "rapid mix ×2"; a long type may go second ("×%2$u %1$s") so
                                     * the count stays in view when the column cuts it short */
                                    ? g_strdup_printf (_("%s ×%u"), type_short (u->type), u->n_parallel)
                                    : g_strdup (type_short (u->type));
          row = nav_row (u->id, t->id, u->name ? u->name : u->id, kind, 1, FALSE);
          nav_row_enable_dnd (self, row);
          gtk_list_box_append (self->nav_list, row);
          if (g_strcmp0 (self->selected_id, u->id) == 0)
            select = row;
          for (guint s = 0; s < u->stages->len; s++)
            {
              const BwProcessUnit *st = g_ptr_array_index (u->stages, s);
              row = nav_row (st->id, t->id, st->name ? st->name : st->id, type_short (st->type), 2, FALSE);
              nav_row_enable_dnd (self, row);
              gtk_list_box_append (self->nav_list, row);
              if (g_strcmp0 (self->selected_id, st->id) == 0)
                select = row;
            }
        }
    }
  self->updating = FALSE;
  nav_refresh (self);
  if (select == NULL)
    {
      /* The selection went away (removed, undone): take the first unit. */
      select = gtk_widget_get_first_child (GTK_WIDGET (self->nav_list));
      if (select && gtk_widget_get_next_sibling (select))
        select = gtk_widget_get_next_sibling (select);
    }
  if (select)
    {
      gtk_list_box_select_row (self->nav_list, GTK_LIST_BOX_ROW (select));
      if (had_focus)
        gtk_widget_grab_focus (select);
    }
  else
    {
      g_clear_pointer (&self->selected_id, g_free);
      _bw_window_build_editor (self);
    }
}

static void
nav_row_selected (GtkListBox *list, GtkListBoxRow *row, gpointer data)
{
  BwWindow *self = data;
  const char *id, *train;

  (void) list;
  if (self->updating || row == NULL)
    return;
  id = g_object_get_data (G_OBJECT (row), "bw-id");
  train = g_object_get_data (G_OBJECT (row), "bw-train");
  g_free (self->selected_id);
  self->selected_id = g_strdup (id);
  g_free (self->selected_train);
  self->selected_train = g_strdup (train);
  if (id == NULL)
    _bw_window_build_editor (self);
  else
    _bw_window_refresh_editor (self);
  counts_refresh (self);
  results_rebuild (self);
  update_actions (self);
  if (self->sketch_area)
    gtk_widget_queue_draw (GTK_WIDGET (self->sketch_area));
}

gboolean
bw_window_select_unit (BwWindow *self, const char *id)
{
  g_return_val_if_fail (BW_IS_WINDOW (self), FALSE);
  for (GtkWidget *row = gtk_widget_get_first_child (GTK_WIDGET (self->nav_list)); row;
       row = gtk_widget_get_next_sibling (row))
    if (GTK_IS_LIST_BOX_ROW (row) && g_strcmp0 (g_object_get_data (G_OBJECT (row), "bw-id"), id) == 0)
      {
        gtk_list_box_select_row (self->nav_list, GTK_LIST_BOX_ROW (row));
        return TRUE;
      }
  return FALSE;
}

const char *
bw_window_get_selected_id (BwWindow *self)
{
  g_return_val_if_fail (BW_IS_WINDOW (self), NULL);
  return self->selected_id;
}

/* --- parallel and standby --- */

static void
counts_refresh (BwWindow *self)
{
  BwTrain *t;
  BwProcessUnit *parent = NULL, *u;
  guint idx;

  u = locate (self->project, self->selected_id, &t, &parent, &idx);
  self->updating = TRUE;
  gtk_widget_set_sensitive (self->counts_grid, u != NULL && parent == NULL);
  gtk_widget_remove_css_class (GTK_WIDGET (self->parallel_spin), "error");
  gtk_widget_remove_css_class (GTK_WIDGET (self->standby_spin), "error");
  gtk_widget_set_tooltip_text (GTK_WIDGET (self->parallel_spin), _("identical units side by side"));
  gtk_widget_set_tooltip_text (GTK_WIDGET (self->standby_spin),
                               _("of those, how many may be out of service (firm capacity)"));
  gtk_spin_button_set_value (self->parallel_spin, u ? u->n_parallel : 1);
  gtk_spin_button_set_value (self->standby_spin, u ? u->n_standby : 0);
  self->updating = FALSE;
}

static void
counts_changed (GtkSpinButton *spin, gpointer data)
{
  BwWindow *self = data;
  g_autoptr (GError) error = NULL;
  g_autofree char *id = g_strdup (self->selected_id);
  guint par = (guint) gtk_spin_button_get_value_as_int (self->parallel_spin);
  guint sb = (guint) gtk_spin_button_get_value_as_int (self->standby_spin);

  if (self->updating || id == NULL)
    return;
  if (!bw_window_do_edit (self, bw_edit_set_counts (id, par, sb), &error))
    {
      gtk_widget_add_css_class (GTK_WIDGET (spin), "error");
      gtk_widget_set_tooltip_text (GTK_WIDGET (spin), error->message);
      _bw_window_set_status (self, error->message);
    }
}

/* --- results of the selected unit --- */

static void
grid_clear (GtkGrid *grid)
{
  GtkWidget *child;

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (grid))))
    gtk_grid_remove (grid, child);
}

/* The results table is built once per shape and then updated in place: each label is made
 * through a ResultsPass, which in a rebuild creates it (and records it), and in an update takes
 * the next recorded one and changes only what differs. A text or class that did not change
 * leaves the label's layout alone, so an edit re-measures only the values that moved. */
typedef struct
{
  BwWindow *self;
  gboolean reuse;
  guint next;
} ResultsPass;

static const char *const status_classes[] = { "bw-status-pass", "bw-status-warn", "bw-status-fail",
                                              "bw-status-na" };

/* The next label of the table, with TEXT: new (recorded) in a rebuild, the recorded one in an
 * update. Returns NULL in an update (the caller attaches only new labels). */
static GtkLabel *
pass_label (ResultsPass *p, const char *text, GtkLabel **existing)
{
  GtkLabel *l;

  if (p->reuse)
    {
      g_assert (p->next < p->self->results_labels->len);
      l = g_ptr_array_index (p->self->results_labels, p->next++);
      _bw_label_update (l, text);
      *existing = l;
      return NULL;
    }
  l = GTK_LABEL (gtk_label_new (text));
  g_ptr_array_add (p->self->results_labels, l);
  *existing = l;
  return l;
}

/* Places W, a new cell of the table, at column COL and row ROW: column 0 in the quantity grid,
 * the rest in the sideways-scrolling grid; the row's size group keeps both grids' rows level. */
static void
attach_cell (ResultsPass *p, GtkWidget *w, int col, int row)
{
  BwWindow *self = p->self;
  GtkWidget *level = bw_level_cell_new (w);

  while (self->results_rows->len <= (guint) row)
    g_ptr_array_add (self->results_rows, gtk_size_group_new (GTK_SIZE_GROUP_VERTICAL));
  gtk_size_group_add_widget (g_ptr_array_index (self->results_rows, row), level);
  if (col == 0)
    gtk_grid_attach (self->results_names, level, 0, row, 1, 1);
  else
    gtk_grid_attach (self->results_grid, level, col - 1, row, 1, 1);
}

static GtkWidget *
cell (ResultsPass *p, int col, int row, const char *text, const char *css, double xalign)
{
  static const char *const governing[] = { "bw-governing" };
  GtkLabel *l, *made = pass_label (p, text, &l);

  if (made)
    {
      gtk_label_set_xalign (made, (float) xalign);
      gtk_label_set_selectable (made, FALSE);
      if (css && strcmp (css, "bw-governing") != 0)
        gtk_widget_add_css_class (GTK_WIDGET (made), css);
      attach_cell (p, GTK_WIDGET (made), col, row);
    }
  /* Only the governing mark changes from one edit to the next. */
  if (css == NULL || strcmp (css, "bw-governing") == 0)
    _bw_widget_class_exclusive (GTK_WIDGET (l), css, governing, 1);
  return GTK_WIDGET (l);
}

/* A value with its load case in small print beneath it. */
static void
value_cell (ResultsPass *p, int col, int row, const char *value, const char *case_label, gboolean governs)
{
  static const char *const governing[] = { "bw-governing" };
  GtkLabel *v, *c;
  GtkLabel *made_v = pass_label (p, value, &v);
  GtkLabel *made_c = pass_label (p, case_label, &c);

  if (made_v)
    {
      GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 0);
      gtk_label_set_xalign (made_v, 1);
      gtk_label_set_xalign (made_c, 1);
      gtk_label_set_justify (made_c, GTK_JUSTIFY_RIGHT);
      gtk_label_set_wrap (made_c, TRUE);
      gtk_label_set_max_width_chars (made_c, 10);
      gtk_widget_add_css_class (GTK_WIDGET (made_c), "dim-label");
      gtk_widget_add_css_class (GTK_WIDGET (made_c), "caption");
      gtk_box_append (GTK_BOX (box), GTK_WIDGET (made_v));
      gtk_box_append (GTK_BOX (box), GTK_WIDGET (made_c));
      g_object_set_data (G_OBJECT (box), "bw-text", made_v);
      attach_cell (p, box, col, row);
    }
  _bw_widget_class_exclusive (GTK_WIDGET (v), governs ? "bw-governing" : NULL, governing, 1);
}

static char *
case_compact (const BwLoadCase *c)
{
  return g_strdup_printf ("%s, %s%s", bw_label_flow_kind (c->flow), bw_label_temp_kind (c->temp),
                          c->service == BW_SERVICE_FIRM ? _(", firm") : "");
}

static char *
case_short (const BwLoadCase *c)
{
  return g_strdup_printf ("%s\n%s\n%s", bw_label_flow_kind (c->flow), bw_label_temp_kind (c->temp),
                          c->service == BW_SERVICE_FIRM ? _("firm") : _("all in service"));
}

static char *
limit_text (const BwCheck *ck, BwUnitSystem units)
{
  g_autofree char *v = NULL;

  if (!ck->has_limit)
    return g_strdup ("");
  v = bw_locale_format (ck->limit, bw_quantity_info (ck->criterion->quantity)->kind, units);
  return g_strdup_printf ("%s %s%s", ck->limit_is_max ? "≤" : "≥", v,
                          ck->limit_is_required ? "" : _(" (preferred)"));
}

/* TRUE when the value of quantity Q in case C is the one that governs a check: the governing
 * case itself, or a case with exactly the same value (G does not depend on the flow, say). */
static gboolean
governs (GArray *gov, const BwElementResult *el, int q, int c)
{
  for (guint i = 0; i < gov->len; i++)
    {
      const int g = g_array_index (gov, int, i);
      if (g == c || (g >= 0 && el->values[g].values[q] == el->values[c].values[q]))
        return TRUE;
    }
  return FALSE;
}

/* The unit a row of the table reads in: the one its largest value reads in, so that one row
 * does not mix minutes with hours, or mm with m. */
static const BwUnit *
row_unit (const BwResults *r, const BwElementResult *el, int q, BwQuantityKind kind, BwUnitSystem units)
{
  double big = 0;

  for (guint c = 0; c < r->n_cases; c++)
    if (bw_quantity_set_has (&el->values[c], (BwQuantity) q) && isfinite (el->values[c].values[q]))
      big = MAX (big, fabs (el->values[c].values[q]));
  return bw_units_reading_unit (big, kind, units);
}

/* VALUE_SI in UNIT, with the locale's decimal separator. */
static char *
format_in (double value_si, const BwUnit *unit)
{
  g_autofree char *c = bw_units_format_in (value_si, unit);

  return bw_locale_localize_number (c);
}

/* What decides which widgets the table has: the element, the columns, and per row the
 * quantity, its checks (with or without a governing case) and, in the two-column view,
 * whether both extremes are the same. Equal shapes have the same labels in the same order. */
static char *
results_shape (BwWindow *self, int e, gboolean every)
{
  GString *k = g_string_new (NULL);
  const BwElementResult *el;

  if (e < 0)
    return g_string_free (k, FALSE);
  g_string_append_printf (k, "%d/%d/%u", e, every, self->results->n_cases);
  el = g_ptr_array_index (self->results->elements, e);
  for (int q = 0; q < BW_N_QUANTITIES; q++)
    {
      const int lo = bw_results_extreme_case (self->results, (guint) e, (BwQuantity) q, FALSE);
      const int hi = bw_results_extreme_case (self->results, (guint) e, (BwQuantity) q, TRUE);
      if (lo < 0)
        continue;
      g_string_append_printf (k, "|%d", q);
      for (guint i = 0; self->checks && i < self->checks->len; i++)
        {
          const BwCheck *ck = &g_array_index (self->checks, BwCheck, i);
          if (ck->element == e && ck->criterion->quantity == (BwQuantity) q)
            g_string_append_printf (k, ",%p%c", (const void *) ck->criterion,
                                    ck->governing_case >= 0 ? 'g' : 'n');
        }
      if (!every)
        g_string_append_c (k, el->values[lo].values[q] == el->values[hi].values[q] ? '=' : '<');
    }
  return g_string_free (k, FALSE);
}

static void
results_rebuild (BwWindow *self)
{
  const int e = element_of (self, self->selected_id);
  const gboolean every = gtk_toggle_button_get_active (self->every_case_toggle);
  const BwElementResult *el;
  g_autofree char *shape = results_shape (self, e, every);
  ResultsPass pass = { self, FALSE, 0 };
  GtkLabel *l;
  int row = 1;

  if (e >= 0 && self->results_shape && strcmp (shape, self->results_shape) == 0)
    pass.reuse = TRUE;
  else
    {
      grid_clear (self->results_names);
      grid_clear (self->results_grid);
      /* A new table starts at its first column, not where the last one was scrolled to. */
      gtk_adjustment_set_value (gtk_scrolled_window_get_hadjustment (self->results_sideways), 0);
      g_ptr_array_set_size (self->results_rows, 0);
      g_ptr_array_set_size (self->results_labels, 0);
      g_free (self->results_shape);
      self->results_shape = g_steal_pointer (&shape);
    }
  if (e < 0)
    {
      gtk_label_set_text (self->results_heading, _("Results"));
      cell (&pass, 0, 0, self->results ? _("Select a unit or stage to see its results.")
                                       : _("No results: the project does not evaluate (see the status bar)."),
            "dim-label", 0);
      /* Nothing to update in place next time: the next unit builds its table. */
      g_clear_pointer (&self->results_shape, g_free);
      return;
    }
  el = g_ptr_array_index (self->results->elements, e);
  {
    g_autofree char *h = g_strdup_printf (_("Results: %s"), el->label);
    _bw_label_update (self->results_heading, h);
    _bw_widget_tooltip_update (GTK_WIDGET (self->results_heading),
                    _("Every enabled load case, from the engine. A value that governs a "
                      "criterion is underlined; hover a criterion for its governing case."));
  }
  cell (&pass, 0, 0, _("quantity and criteria"), "bw-col-head", 0);
  if (every)
    for (guint c = 0; c < self->results->n_cases; c++)
      {
        g_autofree char *h = case_short (&self->results->cases[c]);
        cell (&pass, 1 + (int) c, 0, h, "bw-col-head", 1);
      }
  else
    {
      cell (&pass, 1, 0, _("smallest"), "bw-col-head", 1);
      cell (&pass, 2, 0, _("largest"), "bw-col-head", 1);
    }
  for (int q = 0; q < BW_N_QUANTITIES; q++)
    {
      const BwQuantityInfo *info = bw_quantity_info ((BwQuantity) q);
      const int lo = bw_results_extreme_case (self->results, (guint) e, (BwQuantity) q, FALSE);
      const int hi = bw_results_extreme_case (self->results, (guint) e, (BwQuantity) q, TRUE);
      GArray *gov;
      GtkWidget *qbox = NULL;
      GtkLabel *qlabel;
      const BwUnit *ru;

      if (lo < 0)
        continue;
      ru = row_unit (self->results, el, q, info->kind, self->units);
      gov = g_array_new (FALSE, FALSE, sizeof (int));
      /* The quantity, with the criteria that judge it beneath. */
      if ((qlabel = pass_label (&pass, bw_label_text (info->label), &l)))
        {
          qbox = gtk_box_new (GTK_ORIENTATION_VERTICAL, 2);
          gtk_label_set_xalign (qlabel, 0);
          gtk_label_set_wrap (qlabel, TRUE);
          gtk_label_set_max_width_chars (qlabel, 24);
          gtk_box_append (GTK_BOX (qbox), GTK_WIDGET (qlabel));
          g_object_set_data (G_OBJECT (qbox), "bw-text", qlabel);
          attach_cell (&pass, qbox, 0, row);
        }
      for (guint i = 0; self->checks && i < self->checks->len; i++)
        {
          const BwCheck *ck = &g_array_index (self->checks, BwCheck, i);
          GtkLabel *chip, *lim_l, *made_chip, *made_lim;
          g_autofree char *lim = NULL;
          g_autofree char *tip = NULL;
          if (ck->element != e || ck->criterion->quantity != (BwQuantity) q)
            continue;
          g_array_append_val (gov, ck->governing_case);
          lim = limit_text (ck, self->units);
          made_chip = pass_label (&pass, bw_label_check_status (ck->status), &chip);
          made_lim = pass_label (&pass, lim, &lim_l);
          _bw_widget_class_exclusive (GTK_WIDGET (chip), status_class (ck->status), status_classes,
                           G_N_ELEMENTS (status_classes));
          if (made_chip)
            {
              GtkWidget *box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 6);
              gtk_widget_add_css_class (GTK_WIDGET (made_lim), "caption");
              gtk_widget_add_css_class (GTK_WIDGET (made_chip), "bw-status");
              gtk_box_append (GTK_BOX (box), GTK_WIDGET (made_chip));
              gtk_box_append (GTK_BOX (box), GTK_WIDGET (made_lim));
              gtk_widget_set_margin_start (box, 10);
              gtk_box_append (GTK_BOX (qbox), box);
            }
          if (ck->governing_case >= 0)
            {
              g_autofree char *cl = bw_label_load_case (&self->results->cases[ck->governing_case]);
              g_autofree char *gv = format_in (ck->value, ru);
              g_autofree char *cc = case_compact (&self->results->cases[ck->governing_case]);
              g_autofree char *line = g_strdup_printf (_("governs: %s, %s"), gv, cc);
              GtkLabel *gl, *made_gl = pass_label (&pass, line, &gl);
              /* TRANSLATORS: criterion (status): value in load case */
              tip = g_strdup_printf (_("%s (%s): %s in %s"), ck->criterion->title,
                                     bw_label_check_status (ck->status), gv, cl);
              if (made_gl)
                {
                  gtk_label_set_xalign (made_gl, 0);
                  gtk_label_set_wrap (made_gl, TRUE);
                  gtk_label_set_max_width_chars (made_gl, 24);
                  gtk_widget_add_css_class (GTK_WIDGET (made_gl), "caption");
                  gtk_widget_add_css_class (GTK_WIDGET (made_gl), "dim-label");
                  gtk_widget_set_margin_start (GTK_WIDGET (made_gl), 10);
                  gtk_box_append (GTK_BOX (qbox), GTK_WIDGET (made_gl));
                }
              _bw_widget_tooltip_update (GTK_WIDGET (gl), tip);
            }
          else
            tip = g_strdup (ck->criterion->title);
          _bw_widget_tooltip_update (gtk_widget_get_parent (GTK_WIDGET (chip)), tip);
        }
#define GOVERNS(c) governs (gov, el, q, (c))
      if (every)
        for (guint c = 0; c < self->results->n_cases; c++)
          {
            const BwQuantitySet *s = &el->values[c];
            g_autofree char *v = bw_quantity_set_has (s, (BwQuantity) q)
                                   ? format_in (s->values[q], ru)
                                   : g_strdup ("—");
            cell (&pass, 1 + (int) c, row, v, GOVERNS ((int) c) ? "bw-governing" : NULL, 1);
          }
      else
        {
          const double vlo = el->values[lo].values[q], vhi = el->values[hi].values[q];
          g_autofree char *a = format_in (vlo, ru);
          g_autofree char *b = format_in (vhi, ru);
          g_autofree char *ca = case_compact (&self->results->cases[lo]);
          g_autofree char *cb = case_compact (&self->results->cases[hi]);
          gboolean same = vlo == vhi;
          value_cell (&pass, 1, row, a, same ? _("the same in every case") : ca, GOVERNS (lo));
          if (!same)
            value_cell (&pass, 2, row, b, cb, GOVERNS (hi));
        }
#undef GOVERNS
      g_array_unref (gov);
      row++;
    }
  g_assert (!pass.reuse || pass.next == self->results_labels->len);
}

/* The widget at column COL, row ROW of the results table (column 0 is the quantity). */
static GtkWidget *
results_child_at (BwWindow *self, int col, int row)
{
  GtkWidget *level = col == 0 ? gtk_grid_get_child_at (self->results_names, 0, row)
                               : gtk_grid_get_child_at (self->results_grid, col - 1, row);

  return level ? bw_level_cell_get_child (BW_LEVEL_CELL (level)) : NULL;
}

GtkWidget *
bw_window_get_results_cell (BwWindow *self, int col, int row)
{
  GtkWidget *w;

  g_return_val_if_fail (BW_IS_WINDOW (self), NULL);
  w = results_child_at (self, col, row);
  if (w && !GTK_IS_LABEL (w))
    w = g_object_get_data (G_OBJECT (w), "bw-text");
  return w;
}

char *
bw_window_dup_results_text (BwWindow *self)
{
  GString *s = g_string_new (NULL);
  int rows = 0, cols = 1;

  g_return_val_if_fail (BW_IS_WINDOW (self), NULL);
  for (GtkWidget *c = gtk_widget_get_first_child (GTK_WIDGET (self->results_names)); c;
       c = gtk_widget_get_next_sibling (c))
    {
      int row;
      gtk_grid_query_child (self->results_names, c, NULL, &row, NULL, NULL);
      rows = MAX (rows, row + 1);
    }
  for (GtkWidget *c = gtk_widget_get_first_child (GTK_WIDGET (self->results_grid)); c;
       c = gtk_widget_get_next_sibling (c))
    {
      int col, row;
      gtk_grid_query_child (self->results_grid, c, &col, &row, NULL, NULL);
      rows = MAX (rows, row + 1);
      cols = MAX (cols, col + 2);
    }
  for (int r = 0; r < rows; r++)
    {
      for (int c = 0; c < cols; c++)
        {
          GtkWidget *w = bw_window_get_results_cell (self, c, r);
          if (c)
            g_string_append_c (s, '\t');
          if (GTK_IS_LABEL (w))
            {
              g_autofree char *t = g_strdup (gtk_label_get_text (GTK_LABEL (w)));
              g_string_append (s, g_strdelimit (t, "\n\t", ' '));
            }
        }
      g_string_append_c (s, '\n');
    }
  return g_string_free (s, FALSE);
}

/* --- checks --- */

static void
checks_rebuild (BwWindow *self)
{
  GtkWidget *child;
  guint counts[4] = { 0 };
  g_autofree char *summary = NULL;

  /* The rows are many wrapped labels: while the checks page is out of sight they wait, and are
   * built when it is shown (or asked for). The summary and the counts are kept current. */
  self->checks_stale = FALSE;
  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->checks_list))))
    gtk_list_box_remove (self->checks_list, child);
  if (self->criteria == NULL)
    {
      summary = g_strdup_printf (_("No criteria set: %s"), self->criteria_error ? self->criteria_error : _("none chosen"));
      gtk_label_set_text (self->checks_summary, summary);
      gtk_label_set_text (self->counts_label, _("no checks"));
      return;
    }
  if (self->checks == NULL)
    {
      gtk_label_set_text (self->checks_summary, _("No checks: the project does not evaluate."));
      gtk_label_set_text (self->counts_label, _("no checks"));
      return;
    }
  bw_checks_count (self->checks, counts);
  summary = g_strdup_printf (_("Checked against %s: %u pass, %u warn, %u fail, %u not applicable"),
                             self->criteria->name, counts[BW_CHECK_PASS], counts[BW_CHECK_WARN],
                             counts[BW_CHECK_FAIL], counts[BW_CHECK_NOT_APPLICABLE]);
  gtk_label_set_text (self->checks_summary, summary);
  {
    g_autofree char *c = g_strdup_printf (_("%u pass · %u warn · %u fail"), counts[BW_CHECK_PASS],
                                          counts[BW_CHECK_WARN], counts[BW_CHECK_FAIL]);
    gtk_label_set_text (self->counts_label, c);
  }
  if (!self->checks_forced && g_strcmp0 (gtk_stack_get_visible_child_name (self->page_stack), "checks") != 0)
    {
      self->checks_stale = TRUE;
      return;
    }
  for (guint i = 0; i < self->checks->len; i++)
    {
      const BwCheck *ck = &g_array_index (self->checks, BwCheck, i);
      const BwCriterion *cr = ck->criterion;
      const BwElementResult *el = ck->element >= 0 ? g_ptr_array_index (self->results->elements, ck->element) : NULL;
      GtkWidget *row = gtk_list_box_row_new ();
      GtkWidget *box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 10);
      GtkWidget *text = gtk_box_new (GTK_ORIENTATION_VERTICAL, 1);
      GtkWidget *chip = gtk_label_new (bw_label_check_status (ck->status));
      g_autofree char *head = g_strdup_printf ("%s — %s", cr->title, el ? el->label : _("no element of that kind"));
      g_autofree char *value = ck->status != BW_CHECK_NOT_APPLICABLE && el
                                 ? bw_locale_format (ck->value, bw_quantity_info (cr->quantity)->kind, self->units)
                                 : g_strdup ("—");
      g_autofree char *lim = limit_text (ck, self->units);
      g_autofree char *cl = ck->governing_case >= 0 ? bw_label_load_case (&self->results->cases[ck->governing_case])
                                                    : g_strdup (_("no load case"));
      g_autofree char *detail = g_strdup_printf (_("value %s   limit %s   governing case: %s"), value,
                                                 lim[0] ? lim : "—", cl);
      g_autofree char *cite = g_strdup_printf ("%s, %s, %s%s", cr->document ? cr->document : "",
                                               cr->edition ? cr->edition : "", cr->clause ? cr->clause : "",
                                               cr->provenance == BW_PROVENANCE_MEMORY ? _(" (from memory — verify)") : "");
      g_autofree char *acc = g_strdup_printf ("%s: %s. %s", bw_label_check_status (ck->status), head, detail);
      GtkWidget *l;

      gtk_widget_add_css_class (chip, "bw-status");
      gtk_widget_add_css_class (chip, status_class (ck->status));
      gtk_label_set_width_chars (GTK_LABEL (chip), 4);
      gtk_widget_set_valign (chip, GTK_ALIGN_START);
      gtk_box_append (GTK_BOX (box), chip);
      l = gtk_label_new (head);
      gtk_label_set_xalign (GTK_LABEL (l), 0);
      gtk_label_set_wrap (GTK_LABEL (l), TRUE);
      gtk_widget_add_css_class (l, "heading");
      gtk_box_append (GTK_BOX (text), l);
      l = gtk_label_new (detail);
      gtk_label_set_xalign (GTK_LABEL (l), 0);
      gtk_label_set_wrap (GTK_LABEL (l), TRUE);
      gtk_box_append (GTK_BOX (text), l);
      l = gtk_label_new (cite);
      gtk_label_set_xalign (GTK_LABEL (l), 0);
      gtk_label_set_wrap (GTK_LABEL (l), TRUE);
      gtk_widget_add_css_class (l, "bw-citation");
      gtk_box_append (GTK_BOX (text), l);
      gtk_widget_set_hexpand (text, TRUE);
      gtk_box_append (GTK_BOX (box), text);
      gtk_widget_set_margin_top (box, 4);
      gtk_widget_set_margin_bottom (box, 4);
      gtk_widget_set_margin_start (box, 6);
      gtk_list_box_row_set_child (GTK_LIST_BOX_ROW (row), box);
      if (el)
        g_object_set_data_full (G_OBJECT (row), "bw-id",
                                g_strdup (el->stage ? el->stage->id : el->unit->id), g_free);
      gtk_accessible_update_property (GTK_ACCESSIBLE (row), GTK_ACCESSIBLE_PROPERTY_LABEL, acc, -1);
      gtk_list_box_append (self->checks_list, row);
    }
}

static void
check_activated (GtkListBox *list, GtkListBoxRow *row, gpointer data)
{
  BwWindow *self = data;
  const char *id = g_object_get_data (G_OBJECT (row), "bw-id");

  (void) list;
  if (id && bw_window_select_unit (self, id))
    bw_window_show_page (self, "unit");
}

/* --- actions --- */

static void
update_actions (BwWindow *self)
{
  BwTrain *t;
  BwProcessUnit *parent = NULL, *u;
  guint idx = 0;
  gboolean has = FALSE;

  u = locate (self->project, self->selected_id, &t, &parent, &idx);
  has = u != NULL;
#define ENABLE(name, on) gtk_widget_action_set_enabled (GTK_WIDGET (self), "win." name, on)
  ENABLE ("undo", bw_edit_stack_can_undo (self->stack));
  ENABLE ("redo", bw_edit_stack_can_redo (self->stack));
  ENABLE ("remove-unit", has);
  ENABLE ("duplicate-unit", has);
  ENABLE ("move-up", has && idx > 0);
  ENABLE ("move-down", has && idx + 1 < (parent ? parent->stages->len : t->units->len));
  ENABLE ("autosize", _bw_autosize_target (self->project, self->selected_id) != NULL);
#undef ENABLE
}

static void
report (BwWindow *self, GError *error)
{
  if (error)
    _bw_window_set_status (self, error->message);
}

static void
action_undo (GtkWidget *w, const char *name, GVariant *v)
{
  BwWindow *self = BW_WINDOW (w);
  GtkWidget *focus = gtk_root_get_focus (GTK_ROOT (self));

  (void) name;
  (void) v;
  /* Typing not yet applied is undone first, in the entry itself; the model is left alone. */
  if (focus && GTK_IS_TEXT (focus) && _bw_window_entry_has_typing (self, focus))
    {
      gtk_widget_activate_action (focus, "text.undo", NULL);
      return;
    }
  if (bw_edit_stack_undo (self->stack, self->project))
    {
      evaluate (self);
      self->autosave_dirty = TRUE;
      _bw_window_build_editor (self);
      _bw_window_model_changed (self, TRUE);
    }
}

static void
action_redo (GtkWidget *w, const char *name, GVariant *v)
{
  BwWindow *self = BW_WINDOW (w);

  (void) name;
  (void) v;
  if (bw_edit_stack_redo (self->stack, self->project))
    {
      evaluate (self);
      self->autosave_dirty = TRUE;
      _bw_window_build_editor (self);
      _bw_window_model_changed (self, TRUE);
    }
}

static void
select_after_edit (BwWindow *self)
{
  const BwEdit *e = bw_edit_stack_peek_undo (self->stack);
  const char *id = e ? bw_edit_get_unit_id (e) : NULL;

  if (id)
    bw_window_select_unit (self, id);
}

static void
action_add_unit (GtkWidget *w, const char *name, GVariant *v)
{
  BwWindow *self = BW_WINDOW (w);
  g_autoptr (GError) error = NULL;
  BwProcessType type;
  BwTrain *t = NULL;
  BwProcessUnit *parent = NULL, *u;
  guint idx = 0;

  (void) name;
  if (!bw_process_type_from_name (g_variant_get_string (v, NULL), &type))
    return;
  u = locate (self->project, self->selected_id, &t, &parent, &idx);
  if (bw_process_type_is_stage (type))
    {
      const BwProcessUnit *floc = parent ? parent : u;
      if (floc == NULL || floc->type != BW_PROCESS_FLOCCULATOR)
        {
          _bw_window_set_status (self, _("add a stage: select a flocculator or one of its stages first"));
          return;
        }
      if (!bw_window_do_edit (self, bw_edit_add_unit (NULL, floc->id, parent ? idx + 1 : floc->stages->len, type),
                              &error))
        report (self, error);
    }
  else
    {
      const char *train = t ? t->id : self->selected_train;
      guint pos = G_MAXUINT;
      if (train == NULL && self->project->trains->len > 0)
        train = ((BwTrain *) g_ptr_array_index (self->project->trains, 0))->id;
      if (u)
        {
          if (parent)
            {
              BwTrain *t2;
              BwProcessUnit *p2;
              locate (self->project, parent->id, &t2, &p2, &idx);
            }
          pos = idx + 1;
        }
      else if (train == NULL)
        {
          _bw_window_set_status (self, _("add a unit: the project has no train"));
          return;
        }
      if (!bw_window_do_edit (self, bw_edit_add_unit (train, NULL, pos, type), &error))
        report (self, error);
    }
  if (error == NULL)
    select_after_edit (self);
}

static void
action_remove_unit (GtkWidget *w, const char *name, GVariant *v)
{
  BwWindow *self = BW_WINDOW (w);
  g_autoptr (GError) error = NULL;

  (void) name;
  (void) v;
  if (self->selected_id && !bw_window_do_edit (self, bw_edit_remove_unit (self->selected_id), &error))
    report (self, error);
}

static void
action_duplicate_unit (GtkWidget *w, const char *name, GVariant *v)
{
  BwWindow *self = BW_WINDOW (w);
  g_autoptr (GError) error = NULL;

  (void) name;
  (void) v;
  if (self->selected_id == NULL)
    return;
  if (!bw_window_do_edit (self, bw_edit_duplicate_unit (self->selected_id), &error))
    report (self, error);
  else
    select_after_edit (self);
}

static void
action_move (GtkWidget *w, const char *name, GVariant *v)
{
  BwWindow *self = BW_WINDOW (w);
  g_autoptr (GError) error = NULL;

  (void) v;
  if (self->selected_id == NULL)
    return;
  if (!bw_window_do_edit (self, bw_edit_move_unit (self->selected_id, g_str_has_suffix (name, "move-up") ? -1 : 1),
                          &error))
    report (self, error);
}

static void
action_page (GtkWidget *w, const char *name, GVariant *v)
{
  (void) name;
  bw_window_show_page (BW_WINDOW (w), g_variant_get_string (v, NULL));
}

static void
action_save (GtkWidget *w, const char *name, GVariant *v)
{
  (void) name;
  (void) v;
  _bw_window_save (BW_WINDOW (w));
}

static void
action_save_as (GtkWidget *w, const char *name, GVariant *v)
{
  (void) name;
  (void) v;
  _bw_window_save_as (BW_WINDOW (w));
}

static void
action_close (GtkWidget *w, const char *name, GVariant *v)
{
  (void) name;
  (void) v;
  gtk_window_close (GTK_WINDOW (w));
}

/* F1: the manual at the part for the page in view. */
static void
action_help (GtkWidget *w, const char *name, GVariant *v)
{
  BwWindow *self = BW_WINDOW (w);

  (void) name;
  (void) v;
  bw_help_show (GTK_WINDOW (self), bw_help_topic_for_page (gtk_stack_get_visible_child_name (self->page_stack)));
}

void
bw_window_show_page (BwWindow *self, const char *name)
{
  g_return_if_fail (BW_IS_WINDOW (self));
  if (gtk_stack_get_child_by_name (self->page_stack, name))
    gtk_stack_set_visible_child_name (self->page_stack, name);
}

/* Tabs as wide as their titles, not all stretched alike: six of them fit at 1024 px. */
static void
compact_switcher (BwWindow *self)
{
  GtkLayoutManager *lm = gtk_widget_get_layout_manager (self->page_switcher);

  if (GTK_IS_BOX_LAYOUT (lm))
    gtk_box_layout_set_homogeneous (GTK_BOX_LAYOUT (lm), FALSE);
  for (GtkWidget *b = gtk_widget_get_first_child (self->page_switcher); b; b = gtk_widget_get_next_sibling (b))
    gtk_widget_set_hexpand (b, FALSE);
}

void
bw_window_add_page (BwWindow *self, const char *name, const char *title, GtkWidget *child)
{
  g_return_if_fail (BW_IS_WINDOW (self));
  g_return_if_fail (name != NULL && title != NULL && GTK_IS_WIDGET (child));
  gtk_stack_add_titled (self->page_stack, child, name, title);
  compact_switcher (self);
}

const BwResults *
bw_window_get_results (BwWindow *self)
{
  g_return_val_if_fail (BW_IS_WINDOW (self), NULL);
  return self->results;
}

GArray *
bw_window_get_checks (BwWindow *self)
{
  g_return_val_if_fail (BW_IS_WINDOW (self), NULL);
  return self->checks;
}

const BwCriteriaSet *
bw_window_get_criteria (BwWindow *self)
{
  g_return_val_if_fail (BW_IS_WINDOW (self), NULL);
  return self->criteria;
}

BwUnitSystem
bw_window_get_unit_system (BwWindow *self)
{
  g_return_val_if_fail (BW_IS_WINDOW (self), BW_UNIT_SYSTEM_SI);
  return self->units;
}

/* --- unit system --- */

static void
unit_system_changed (GActionGroup *group, const char *name, GVariant *state, gpointer data)
{
  BwWindow *self = data;
  BwUnitSystem s;

  (void) group;
  (void) name;
  if (!bw_unit_system_from_name (g_variant_get_string (state, NULL), &s) || s == self->units)
    return;
  self->units = s;
  _bw_window_refresh_editor (self);
  _bw_window_refresh_basis (self);
  results_rebuild (self);
  checks_rebuild (self);
  g_signal_emit (self, window_signals[SIGNAL_PROJECT_CHANGED], 0, FALSE);
}

/* --- recent files --- */

static void
recent_rebuild (BwWindow *self)
{
  GtkRecentManager *rm = gtk_recent_manager_get_default ();
  GList *items = gtk_recent_manager_get_items (rm);
  guint n = 0;

  g_menu_remove_all (self->recent_menu);
  for (GList *l = items; l && n < 8; l = l->next)
    {
      GtkRecentInfo *info = l->data;
      const char *uri = gtk_recent_info_get_uri (info);
      g_autofree char *path = NULL;
      g_autofree char *detailed = NULL;
      g_autofree char *base = NULL;
      if (!g_str_has_suffix (uri, ".bwproj") || !gtk_recent_info_exists (info))
        continue;
      path = g_filename_from_uri (uri, NULL, NULL);
      if (path == NULL)
        continue;
      base = g_path_get_basename (path);
      detailed = g_action_print_detailed_name ("app.open-recent", g_variant_new_string (path));
      g_menu_append (self->recent_menu, base, detailed);
      n++;
    }
  if (n == 0)
    g_menu_append (self->recent_menu, _("(no recent projects)"), "app.open-recent-none");
  g_list_free_full (items, (GDestroyNotify) gtk_recent_info_unref);
}

static void
recent_changed (GtkRecentManager *rm, gpointer data)
{
  (void) rm;
  recent_rebuild (data);
}

/* --- model replacement --- */

void
_bw_window_replace_project (BwWindow *self, BwProject *p, const char *path, gboolean saved)
{
  g_clear_pointer (&self->results, bw_results_free);
  g_clear_pointer (&self->checks, g_array_unref);
  bw_project_free (self->project);
  self->project = p;
  g_free (self->path);
  self->path = g_strdup (path);
  bw_edit_stack_clear (self->stack, saved);
  g_clear_pointer (&self->selected_id, g_free);
  g_clear_pointer (&self->selected_train, g_free);
  evaluate (self);
  _bw_window_build_basis (self);
  _bw_window_model_changed (self, TRUE);
  if (path)
    {
      g_autofree char *uri = g_filename_to_uri (path, NULL, NULL);
      if (uri)
        gtk_recent_manager_add_item (gtk_recent_manager_get_default (), uri);
    }
}

gboolean
bw_window_open_path (BwWindow *self, const char *path, GError **error)
{
  BwProject *p;

  g_return_val_if_fail (BW_IS_WINDOW (self), FALSE);
  g_return_val_if_fail (path != NULL, FALSE);
  p = bw_project_load (path, error);
  if (p == NULL)
    return FALSE;
  _bw_window_forget_autosave (self);
  _bw_window_replace_project (self, p, path, TRUE);
  return TRUE;
}

void
bw_window_take_project (BwWindow *self, BwProject *p)
{
  g_return_if_fail (BW_IS_WINDOW (self));
  g_return_if_fail (p != NULL);
  _bw_window_replace_project (self, p, NULL, TRUE);
}

gboolean
bw_window_is_pristine (BwWindow *self)
{
  g_return_val_if_fail (BW_IS_WINDOW (self), FALSE);
  return self->path == NULL && !bw_edit_stack_can_undo (self->stack) && !bw_edit_stack_is_modified (self->stack)
         && g_strcmp0 (self->project->name, _("Untitled plant")) == 0;
}

gboolean
bw_window_is_modified (BwWindow *self)
{
  g_return_val_if_fail (BW_IS_WINDOW (self), FALSE);
  return bw_edit_stack_is_modified (self->stack);
}

const char *
bw_window_get_path (BwWindow *self)
{
  g_return_val_if_fail (BW_IS_WINDOW (self), NULL);
  return self->path;
}

const BwProject *
bw_window_get_project (BwWindow *self)
{
  g_return_val_if_fail (BW_IS_WINDOW (self), NULL);
  return self->project;
}

/* Builds the check rows now if they waited while the page was out of sight. */
static void
checks_flush (BwWindow *self)
{
  if (!self->checks_stale)
    return;
  self->checks_forced = TRUE;
  checks_rebuild (self);
  self->checks_forced = FALSE;
}

static void
page_shown (GtkStack *stack, GParamSpec *pspec, gpointer data)
{
  (void) pspec;
  if (g_strcmp0 (gtk_stack_get_visible_child_name (stack), "checks") == 0)
    checks_flush (data);
}

GtkWidget *
bw_window_get_checks_list (BwWindow *self)
{
  checks_flush (self);
  g_return_val_if_fail (BW_IS_WINDOW (self), NULL);
  return GTK_WIDGET (self->checks_list);
}

GtkWidget *
bw_window_get_navigator (BwWindow *self)
{
  g_return_val_if_fail (BW_IS_WINDOW (self), NULL);
  return GTK_WIDGET (self->nav_list);
}

/* A blank plant: one empty train and the one flow the design basis needs. */
static BwProject *
blank_project (void)
{
  BwProject *p = bw_project_new ();

  p->name = g_strdup (_("Untitled plant"));
  p->criteria = g_strdup (DEFAULT_CRITERIA);
  p->basis.flow_m3_s[BW_FLOW_MAXIMUM_DAY] = 0.1;
  p->basis.flows_given = 1u << BW_FLOW_MAXIMUM_DAY;
  g_ptr_array_add (p->trains, bw_train_new ("train-1", _("Train 1")));
  bw_project_generate_cases (p);
  return p;
}

/* --- GObject --- */

static void
bw_window_dispose (GObject *object)
{
  BwWindow *self = BW_WINDOW (object);

  _bw_window_files_dispose (self);
  g_signal_handlers_disconnect_by_data (gtk_recent_manager_get_default (), self);
  gtk_widget_dispose_template (GTK_WIDGET (self), BW_TYPE_WINDOW);
  G_OBJECT_CLASS (bw_window_parent_class)->dispose (object);
}

static void
bw_window_finalize (GObject *object)
{
  BwWindow *self = BW_WINDOW (object);

  g_clear_pointer (&self->fields, g_ptr_array_unref);
  g_clear_pointer (&self->basis_fields, g_ptr_array_unref);
  g_clear_pointer (&self->results_labels, g_ptr_array_unref);
  g_clear_pointer (&self->results_rows, g_ptr_array_unref);
  g_clear_pointer (&self->results_shape, g_free);
  g_clear_pointer (&self->results, bw_results_free);
  g_clear_pointer (&self->pending, bw_results_free);
  g_clear_pointer (&self->checks, g_array_unref);
  g_clear_pointer (&self->criteria, bw_criteria_set_free);
  g_clear_pointer (&self->criteria_sets, g_ptr_array_unref);
  g_clear_pointer (&self->stack, bw_edit_stack_free);
  g_clear_pointer (&self->project, bw_project_free);
  g_free (self->criteria_error);
  g_free (self->criteria_id);
  g_free (self->path);
  g_free (self->selected_id);
  g_free (self->selected_train);
  g_free (self->autosave_path);
  g_free (self->recovery_path);
  g_free (self->editor_id);
  G_OBJECT_CLASS (bw_window_parent_class)->finalize (object);
}

static void
bw_window_class_init (BwWindowClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);
  GtkWindowClass *window_class = GTK_WINDOW_CLASS (klass);

  object_class->dispose = bw_window_dispose;
  object_class->finalize = bw_window_finalize;
  window_class->close_request = _bw_window_close_request;

  gtk_widget_class_set_template_from_resource (widget_class, "/org/basinwright/Workbench/bw-window.ui");
#define BIND(name) gtk_widget_class_bind_template_child (widget_class, BwWindow, name)
  BIND (title_label);
  BIND (subtitle_label);
  BIND (caution_label);
  BIND (recent_menu);
  BIND (add_button);
  BIND (recovery_revealer);
  BIND (recovery_label);
  BIND (nav_list);
  BIND (parallel_spin);
  BIND (standby_spin);
  BIND (counts_grid);
  BIND (page_stack);
  BIND (page_switcher);
  BIND (unit_heading);
  BIND (unit_type_label);
  BIND (editor_grid);
  BIND (results_heading);
  BIND (every_case_toggle);
  BIND (results_scroller);
  BIND (results_sideways);
  BIND (results_names);
  BIND (results_grid);
  BIND (checks_summary);
  BIND (checks_list);
  BIND (basis_grid);
  BIND (cases_list);
  BIND (criteria_dropdown);
  BIND (criteria_note);
  BIND (sketch_area);
  BIND (status_label);
  BIND (counts_label);
#undef BIND

  gtk_widget_class_install_action (widget_class, "win.undo", NULL, action_undo);
  gtk_widget_class_install_action (widget_class, "win.redo", NULL, action_redo);
  gtk_widget_class_install_action (widget_class, "win.save", NULL, action_save);
  gtk_widget_class_install_action (widget_class, "win.save-as", NULL, action_save_as);
  gtk_widget_class_install_action (widget_class, "win.close", NULL, action_close);
  gtk_widget_class_install_action (widget_class, "win.add-unit", "s", action_add_unit);
  gtk_widget_class_install_action (widget_class, "win.remove-unit", NULL, action_remove_unit);
  gtk_widget_class_install_action (widget_class, "win.duplicate-unit", NULL, action_duplicate_unit);
  gtk_widget_class_install_action (widget_class, "win.move-up", NULL, action_move);
  gtk_widget_class_install_action (widget_class, "win.move-down", NULL, action_move);
  gtk_widget_class_install_action (widget_class, "win.page", "s", action_page);
  gtk_widget_class_install_action (widget_class, "win.export-report", NULL, bw_report_dialog_action);
  gtk_widget_class_install_action (widget_class, "win.help", NULL, action_help);
  _bw_window_files_class_init (widget_class);
  _bw_autosize_class_init (widget_class);

  /* BwWindow::project-changed (gboolean structure): after every edit, undo, redo, open, new and
   * unit-system switch, once the results and checks are current. Pages added with
   * bw_window_add_page listen to it to refresh themselves. */
  window_signals[SIGNAL_PROJECT_CHANGED] =
    g_signal_new ("project-changed", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0, NULL, NULL,
                  NULL, G_TYPE_NONE, 1, G_TYPE_BOOLEAN);
}

static gboolean
popup_add_menu (GtkWidget *widget, GVariant *args, gpointer data)
{
  (void) widget;
  (void) args;
  gtk_menu_button_popup (BW_WINDOW (data)->add_button);
  return TRUE;
}

static void
bw_window_init (BwWindow *self)
{
  GtkShortcutController *sc;
  static const struct { guint key; GdkModifierType mods; const char *action; } nav_keys[] = {
    { GDK_KEY_Delete, 0, "win.remove-unit" },
    { GDK_KEY_KP_Delete, 0, "win.remove-unit" },
    { GDK_KEY_Up, GDK_ALT_MASK, "win.move-up" },
    { GDK_KEY_Down, GDK_ALT_MASK, "win.move-down" },
  };

  gtk_widget_init_template (GTK_WIDGET (self));
  self->project = blank_project ();
  self->stack = bw_edit_stack_new ();
  self->results_labels = g_ptr_array_new ();
  self->results_rows = g_ptr_array_new_with_free_func (g_object_unref);
  bw_wheel_forward_vertical (self->results_sideways, self->results_scroller);
  self->fields = g_ptr_array_new_with_free_func ((GDestroyNotify) _bw_field_free);
  self->basis_fields = g_ptr_array_new_with_free_func ((GDestroyNotify) _bw_field_free);
  self->units = BW_UNIT_SYSTEM_SI;
  gtk_label_set_text (self->caution_label, _(BW_CAUTION_TEXT));

  sc = GTK_SHORTCUT_CONTROLLER (gtk_shortcut_controller_new ());
  for (guint i = 0; i < G_N_ELEMENTS (nav_keys); i++)
    gtk_shortcut_controller_add_shortcut (sc, gtk_shortcut_new (gtk_keyval_trigger_new (nav_keys[i].key, nav_keys[i].mods),
                                                                gtk_named_action_new (nav_keys[i].action)));
  gtk_shortcut_controller_add_shortcut (sc, gtk_shortcut_new (gtk_keyval_trigger_new (GDK_KEY_Insert, 0),
                                                              gtk_callback_action_new (popup_add_menu, self, NULL)));
  gtk_widget_add_controller (GTK_WIDGET (self->nav_list), GTK_EVENT_CONTROLLER (sc));

  g_signal_connect (self->nav_list, "row-selected", G_CALLBACK (nav_row_selected), self);
  g_signal_connect (self->parallel_spin, "value-changed", G_CALLBACK (counts_changed), self);
  g_signal_connect (self->standby_spin, "value-changed", G_CALLBACK (counts_changed), self);
  g_signal_connect_swapped (self->every_case_toggle, "toggled", G_CALLBACK (results_rebuild), self);
  g_signal_connect (self->checks_list, "row-activated", G_CALLBACK (check_activated), self);
  g_signal_connect (self->page_stack, "notify::visible-child", G_CALLBACK (page_shown), self);
  _bw_window_sketch_init (self);
  bw_window_add_page (self, "chemistry", _("Chemistry"), bw_chem_view_new (self));
  bw_window_add_page (self, "review", _("Review"), bw_review_view_new (self));
  compact_switcher (self); /* the sketch page was re-added by _bw_window_sketch_init */
  g_signal_connect (gtk_recent_manager_get_default (), "changed", G_CALLBACK (recent_changed), self);
  recent_rebuild (self);

  self->criteria_sets = bw_criteria_find_all (NULL);
  _bw_window_files_init (self);
  evaluate (self);
  _bw_window_build_basis (self);
  _bw_window_model_changed (self, TRUE);
}

BwWindow *
bw_window_new (BwApplication *app)
{
  BwWindow *self;

  g_return_val_if_fail (BW_IS_APPLICATION (app), NULL);
  self = g_object_new (BW_TYPE_WINDOW, "application", app, "show-menubar", FALSE, NULL);
  self->units = bw_application_get_unit_system (app);
  g_signal_connect_object (app, "action-state-changed::unit-system", G_CALLBACK (unit_system_changed),
                           self, 0);
  /* A new project is checked against the criteria set chosen last (when it is still found). */
  {
    g_autofree char *last = bw_application_dup_last_criteria (app);
    g_autoptr (BwCriteriaSet) found = NULL;
    if (last && g_strcmp0 (last, self->project->criteria) != 0
        && (found = bw_criteria_set_open (last, NULL)) != NULL)
      {
        BwProject *p = blank_project ();
        g_free (p->criteria);
        p->criteria = g_steal_pointer (&last);
        _bw_window_replace_project (self, p, NULL, TRUE);
      }
  }
  _bw_window_refresh_editor (self);
  _bw_window_refresh_basis (self);
  results_rebuild (self);
  checks_rebuild (self);
  return self;
}
