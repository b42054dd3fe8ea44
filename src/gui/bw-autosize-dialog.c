/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-autosize-dialog.c: the auto-size dialog and win.autosize. The search runs in a GTask thread
 * on copies of the project and of the criteria set; the worker touches no widget: its progress
 * reports are marshalled to the main context, and Cancel sets an atomic flag that the engine's
 * progress callback reads. Apply is one snapshot edit through the window's undo stack. */
#include "config.h"

#include "gui/bw-autosize-dialog.h"
#include "gui/bw-locale.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

#include "draw/bw-labels.h"
#include "engine/bw-edit.h"
#include "engine/bw-error.h"
#include "engine/bw-units.h"

/* One search. Reference-counted (g_atomic_rc_box): the dialog, the task and every pending
 * progress report hold a reference, so none outlives what it reads. Only plain memory inside:
 * the last reference may drop in the worker thread. */
typedef struct
{
  BwProject *project;    /* the copy searched (read-only while the worker runs) */
  BwCriteriaSet *set;    /* the copy the candidates' margins point into */
  char *unit_id;
  BwObjective objective;
  BwAutosizeResult result;
  GMainContext *context; /* where progress reports go */
  GWeakRef dialog;
  gint cancel;           /* atomic: set by Cancel, read by the progress callback */
  gint report_pending;   /* atomic: a progress report is queued */
  gint fraction_ppm;     /* atomic: the latest fraction done, in millionths */
} Job;

struct _BwAutosizeDialog
{
  GtkWindow parent_instance;

  /* Template widgets */
  GtkLabel *heading_label;
  GtkLabel *unit_label;
  GtkLabel *criteria_label;
  GtkDropDown *objective_dropdown;
  GtkLabel *searched_label;
  GtkProgressBar *progress_bar;
  GtkLabel *status_label;
  GtkListBox *results_list;
  GtkLabel *caution_label;
  GtkButton *cancel_button;
  GtkButton *search_button;
  GtkButton *apply_button;

  /* Owned references */
  BwWindow *window;
  char *unit_id;
  BwObjective objectives[3]; /* what the dropdown offers, in its order */
  guint n_objectives;
  Job *job;                  /* the running search, or NULL */
  gboolean has_result;
  BwAutosizeResult result;   /* of the last finished search */
  BwProject *searched;       /* the project state that result is for */
  BwCriteriaSet *set;        /* the criteria the result's margins point into */
  char *message;
  gboolean stale;            /* the project changed since the search */
  gboolean disposed;
  gulong changed_handler;
};

G_DEFINE_FINAL_TYPE (BwAutosizeDialog, bw_autosize_dialog, GTK_TYPE_WINDOW)

enum
{
  SIGNAL_SEARCH_PROGRESS,
  SIGNAL_SEARCH_FINISHED,
  N_SIGNALS
};
static guint dialog_signals[N_SIGNALS];

/* --- what can be sized --- */

const char *
_bw_autosize_target (const BwProject *p, const char *selected_id)
{
  const BwProcessUnit *u;

  if (p == NULL || selected_id == NULL)
    return NULL;
  u = bw_project_find_unit (p, selected_id, NULL);
  if (u == NULL)
    return NULL;
  if (bw_process_type_is_stage (u->type))
    {
      /* A stage is sized with its flocculator (bw_autosize refuses a stage on its own). */
      for (guint i = 0; i < p->trains->len; i++)
        {
          const BwTrain *t = g_ptr_array_index (p->trains, i);
          for (guint k = 0; k < t->units->len; k++)
            {
              const BwProcessUnit *f = g_ptr_array_index (t->units, k);
              for (guint s = 0; s < f->stages->len; s++)
                if (g_ptr_array_index (f->stages, s) == u)
                  return f->type == BW_PROCESS_FLOCCULATOR ? f->id : NULL;
            }
        }
      return NULL;
    }
  switch (u->type)
    {
    case BW_PROCESS_RAPID_MIX:
    case BW_PROCESS_INLINE_MIXER:
    case BW_PROCESS_FLOCCULATOR:
    case BW_PROCESS_RECTANGULAR_BASIN:
    case BW_PROCESS_CIRCULAR_CLARIFIER:
    case BW_PROCESS_PLATE_SETTLER:
      return u->id;
    default:
      return NULL;
    }
}

/* --- the search job --- */

static void
job_clear (gpointer data)
{
  Job *job = data;

  g_clear_pointer (&job->project, bw_project_free);
  g_clear_pointer (&job->set, bw_criteria_set_free);
  g_free (job->unit_id);
  bw_autosize_result_clear (&job->result);
  g_main_context_unref (job->context);
  g_weak_ref_clear (&job->dialog);
}

static void
job_release (gpointer job)
{
  g_atomic_rc_box_release_full (job, job_clear);
}

/* A deep copy of SET: the worker must not read the window's set, which an edit may replace. */
static BwCriteriaSet *
criteria_copy (const BwCriteriaSet *set)
{
  BwCriteriaSet *c = bw_criteria_set_new (set->id, set->name);

  c->description = g_strdup (set->description);
  c->origin = g_strdup (set->origin);
  for (guint i = 0; i < set->criteria->len; i++)
    {
      const BwCriterion *s = g_ptr_array_index (set->criteria, i);
      BwCriterion *d = bw_criterion_new ();
      *d = *s;
      d->id = g_strdup (s->id);
      d->title = g_strdup (s->title);
      d->document = g_strdup (s->document);
      d->edition = g_strdup (s->edition);
      d->clause = g_strdup (s->clause);
      d->note = g_strdup (s->note);
      g_ptr_array_add (c->criteria, d);
    }
  return c;
}

static void update_progress (BwAutosizeDialog *self, double fraction);

/* Main thread: shows the latest fraction when the dialog is still there and still waiting for
 * this job. */
static gboolean
report_progress (gpointer data)
{
  Job *job = data;
  g_autoptr (BwAutosizeDialog) self = g_weak_ref_get (&job->dialog);

  g_atomic_int_set (&job->report_pending, 0);
  if (self && !self->disposed && self->job == job && !g_atomic_int_get (&job->cancel))
    update_progress (self, g_atomic_int_get (&job->fraction_ppm) / 1e6);
  return G_SOURCE_REMOVE;
}

/* Worker thread: the engine's progress callback. Queues at most one report at a time. */
static gboolean
job_progress (double fraction, gpointer data)
{
  Job *job = data;

  if (g_atomic_int_get (&job->cancel))
    return FALSE;
  g_atomic_int_set (&job->fraction_ppm, (gint) lround (CLAMP (fraction, 0.0, 1.0) * 1e6));
  if (g_atomic_int_compare_and_exchange (&job->report_pending, 0, 1))
    g_main_context_invoke_full (job->context, G_PRIORITY_DEFAULT, report_progress,
                                g_atomic_rc_box_acquire (job), job_release);
  return !g_atomic_int_get (&job->cancel);
}

static void
search_thread (GTask *task, gpointer source, gpointer data, GCancellable *cancellable)
{
  Job *job = data;
  GError *error = NULL;

  (void) source;
  (void) cancellable;
  if (bw_autosize (job->project, job->unit_id, job->set, job->objective, job_progress, job,
                   &job->result, &error))
    g_task_return_boolean (task, TRUE);
  else
    g_task_return_error (task, error);
}

/* --- showing designs --- */

static const char *
objective_label (BwObjective o)
{
  switch (o)
    {
    case BW_OBJECTIVE_VOLUME:
      return _("smallest volume");
    case BW_OBJECTIVE_FOOTPRINT:
      return _("smallest footprint");
    default:
      return _("lowest mixing power");
    }
}

static BwQuantityKind
objective_kind (BwObjective o)
{
  return o == BW_OBJECTIVE_VOLUME ? BW_KIND_VOLUME : o == BW_OBJECTIVE_FOOTPRINT ? BW_KIND_AREA : BW_KIND_POWER;
}

static char *
format_param (const BwParamSpec *spec, double v, BwUnitSystem units)
{
  if (spec->type == BW_PARAM_QUANTITY)
    return bw_locale_format (v, spec->kind, units);
  if (spec->type == BW_PARAM_CHOICE && spec->choices)
    {
      guint n = 0;
      while (spec->choices[n])
        n++;
      if (v >= 0 && v < n)
        return g_strdup (bw_label_choice (spec, (int) v));
    }
  return g_strdup_printf ("%.0f", v);
}

/* Which parameters of U (and of stage S, when S >= 0) to show: those any design changes. */
static gboolean
param_shown (const BwAutosizeResult *r, const BwProcessUnit *u, int s, guint k)
{
  for (guint i = 0; i < r->n_best; i++)
    {
      const BwCandidate *c = &r->best[i];
      const double v = s < 0 ? c->values[k] : c->stage_values[s][k];
      if (v != u->values[k])
        return TRUE;
    }
  return FALSE;
}

static void
append_values (GString *s, const BwAutosizeResult *r, const BwProcessUnit *u, int stage,
               const double *values, BwUnitSystem units)
{
  guint n;
  const BwParamSpec *specs = bw_params_of (u->type, &n);
  gboolean first = TRUE;

  for (guint k = 0; k < n; k++)
    {
      g_autofree char *v = NULL;
      if (!param_shown (r, u, stage, k))
        continue;
      v = format_param (&specs[k], values[k], units);
      if (first && stage >= 0)
        g_string_append_printf (s, s->len ? _("; stage %d: ") : _("stage %d: "), stage + 1);
      else if (!first || s->len)
        g_string_append (s, ", ");
      g_string_append_printf (s, "%s %s", bw_label_text (specs[k].label), v);
      first = FALSE;
    }
}

/* A relative margin as a percentage to 0.1 % (a margin at the limit reads 0.0 %, not a
 * rounding residue such as 1e-14 %); with the locale's decimal separator, like the other numbers
 * the dialog shows. */
static char *
format_percent (double fraction)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE];
  double pct = round (fraction * 1000) / 10;

  if (pct == 0)
    pct = 0; /* no "-0.0" */
  return bw_locale_localize_number (g_ascii_formatd (buf, sizeof buf, "%.1f", pct));
}

static void
add_line (GtkWidget *box, const char *text, const char *css)
{
  GtkWidget *l = gtk_label_new (text);

  gtk_label_set_xalign (GTK_LABEL (l), 0);
  gtk_label_set_wrap (GTK_LABEL (l), TRUE);
  gtk_label_set_wrap_mode (GTK_LABEL (l), PANGO_WRAP_WORD_CHAR);
  if (css)
    gtk_widget_add_css_class (l, css);
  gtk_box_append (GTK_BOX (box), l);
}

static void
results_clear (BwAutosizeDialog *self)
{
  GtkWidget *child;

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->results_list))))
    gtk_list_box_remove (self->results_list, child);
}

/* Fills the list from self->result, in the window's unit system. */
static void
results_rebuild (BwAutosizeDialog *self)
{
  const BwAutosizeResult *r = &self->result;
  const BwUnitSystem units = bw_window_get_unit_system (self->window);
  const BwProcessUnit *u;

  results_clear (self);
  if (!self->has_result)
    return;
  u = bw_project_find_unit (self->searched, self->unit_id, NULL);
  g_assert (u != NULL);
  for (guint i = 0; i < r->n_best; i++)
    {
      const BwCandidate *c = &r->best[i];
      GtkWidget *row = gtk_list_box_row_new ();
      GtkWidget *box = gtk_box_new (GTK_ORIENTATION_VERTICAL, 2);
      g_autofree char *obj = bw_locale_format (c->objective, objective_kind (r->objective), units);
      g_autofree char *vol = bw_locale_format (c->volume_m3, BW_KIND_VOLUME, units);
      g_autofree char *head = NULL;
      g_autoptr (GString) values = g_string_new (NULL);
      g_autoptr (GString) margins = g_string_new (NULL);
      g_autofree char *text = NULL;
      double worst = G_MAXDOUBLE;
      const BwCriterion *tight = NULL;

      if (r->objective == BW_OBJECTIVE_VOLUME)
        head = g_strdup_printf (_("Design %u: total volume %s, %u in parallel"), i + 1, obj, c->n_parallel);
      else
        head = g_strdup_printf (_("Design %u: total %s %s (total volume %s), %u in parallel"), i + 1,
                                r->objective == BW_OBJECTIVE_FOOTPRINT ? _("footprint") : _("mixing power"),
                                obj, vol, c->n_parallel);
      append_values (values, r, u, -1, c->values, units);
      for (guint s = 0; s < c->n_stages && s < u->stages->len; s++)
        append_values (values, r, g_ptr_array_index (u->stages, s), (int) s, c->stage_values[s], units);
      if (values->len == 0)
        g_string_append (values, _("the unit's own dimensions"));
      for (guint k = 0; k < c->n_margins; k++)
        {
          g_autofree char *pct = format_percent (c->margins[k]);
          g_string_append_printf (margins, "%s%s %s %%", margins->len ? ", " : "",
                                  c->margin_criteria[k]->title, pct);
          if (c->margins[k] < worst)
            worst = c->margins[k], tight = c->margin_criteria[k];
        }
      if (tight)
        {
          g_autofree char *pct = format_percent (worst);
          g_autofree char *m = g_strdup_printf (_("Margin to each required limit (tightest: %s, %s %%): %s"),
                                                tight->title, pct, margins->str);
          g_string_assign (margins, m);
        }
      else
        g_string_assign (margins, _("No required limit applies to this unit."));

      gtk_widget_set_margin_top (box, 6);
      gtk_widget_set_margin_bottom (box, 6);
      gtk_widget_set_margin_start (box, 8);
      gtk_widget_set_margin_end (box, 8);
      add_line (box, head, "heading");
      add_line (box, values->str, NULL);
      add_line (box, margins->str, "caption");
      gtk_list_box_row_set_child (GTK_LIST_BOX_ROW (row), box);
      text = g_strdup_printf ("%s\n%s\n%s", head, values->str, margins->str);
      gtk_accessible_update_property (GTK_ACCESSIBLE (row), GTK_ACCESSIBLE_PROPERTY_LABEL, text, -1);
      g_object_set_data_full (G_OBJECT (row), "bw-text", g_steal_pointer (&text), g_free);
      gtk_list_box_append (self->results_list, row);
      if (i == 0)
        gtk_list_box_select_row (self->results_list, GTK_LIST_BOX_ROW (row));
    }
}

/* --- state of the controls --- */

static void
set_message (BwAutosizeDialog *self, const char *message)
{
  g_free (self->message);
  self->message = g_strdup (message ? message : "");
  gtk_label_set_text (self->status_label, self->message);
}

static void
update_sensitivity (BwAutosizeDialog *self)
{
  gboolean searching, unit_there, can_search;

  if (self->disposed || self->window == NULL)
    return;
  searching = self->job != NULL;
  unit_there = bw_project_find_unit (bw_window_get_project (self->window), self->unit_id, NULL) != NULL;
  can_search = !searching && unit_there && bw_window_get_criteria (self->window) != NULL;

  gtk_widget_set_sensitive (GTK_WIDGET (self->search_button), can_search);
  gtk_widget_set_sensitive (GTK_WIDGET (self->objective_dropdown), !searching);
  gtk_widget_set_sensitive (GTK_WIDGET (self->cancel_button), searching);
  gtk_widget_set_sensitive (GTK_WIDGET (self->apply_button),
                            !searching && self->has_result && !self->stale
                              && gtk_list_box_get_selected_row (self->results_list) != NULL);
}

static void
update_progress (BwAutosizeDialog *self, double fraction)
{
  g_autofree char *text = g_strdup_printf (_("%d %% searched"), (int) floor (fraction * 100));

  gtk_progress_bar_set_fraction (self->progress_bar, fraction);
  gtk_progress_bar_set_text (self->progress_bar, text);
  g_signal_emit (self, dialog_signals[SIGNAL_SEARCH_PROGRESS], 0, fraction);
}

/* The unit's name, the criteria set and the objectives offered, from the window as it is. */
static void
refresh_labels (BwAutosizeDialog *self)
{
  const BwProject *p = bw_window_get_project (self->window);
  const BwProcessUnit *u = bw_project_find_unit (p, self->unit_id, NULL);
  const BwCriteriaSet *set = bw_window_get_criteria (self->window);
  g_autofree char *heading = NULL;
  g_autofree char *unit = NULL;

  if (u)
    {
      heading = g_strdup_printf (_("Auto-size %s"), u->name ? u->name : u->id);
      unit = g_strdup_printf ("%s (%s, %s)", u->name ? u->name : u->id, bw_label_process_type (u->type), u->id);
    }
  else
    {
      heading = g_strdup (_("Auto-size"));
      unit = g_strdup_printf (_("%s is no longer in the project"), self->unit_id);
    }
  gtk_label_set_text (self->heading_label, heading);
  gtk_label_set_text (self->unit_label, unit);
  if (set)
    {
      g_autofree char *c = g_strdup_printf ("%s (%s)", set->name, set->id);
      gtk_label_set_text (self->criteria_label, c);
    }
  else
    gtk_label_set_text (self->criteria_label, _("none: choose a criteria set on the design basis page"));
}

/* TRUE when the unit's evaluated results carry a mixing power (so that ranking by it means
 * something). */
static gboolean
unit_has_power (BwAutosizeDialog *self)
{
  const BwResults *r = bw_window_get_results (self->window);

  if (r == NULL)
    return FALSE;
  for (guint i = 0; i < r->elements->len; i++)
    {
      const BwElementResult *e = g_ptr_array_index (r->elements, i);
      if (e->stage != NULL || g_strcmp0 (e->id, self->unit_id) != 0)
        continue;
      for (guint c = 0; c < r->n_cases; c++)
        if (bw_quantity_set_has (&e->values[c], BW_Q_POWER))
          return TRUE;
    }
  return FALSE;
}

static void
build_objectives (BwAutosizeDialog *self)
{
  const BwProcessUnit *u = bw_project_find_unit (bw_window_get_project (self->window), self->unit_id, NULL);
  g_autoptr (GtkStringList) list = gtk_string_list_new (NULL);

  self->n_objectives = 0;
  self->objectives[self->n_objectives++] = BW_OBJECTIVE_VOLUME;
  /* The engine has no plan area for an in-line mixer (a pipe fitting). */
  if (u && u->type != BW_PROCESS_INLINE_MIXER)
    self->objectives[self->n_objectives++] = BW_OBJECTIVE_FOOTPRINT;
  if (unit_has_power (self))
    self->objectives[self->n_objectives++] = BW_OBJECTIVE_POWER;
  for (guint i = 0; i < self->n_objectives; i++)
    gtk_string_list_append (list, objective_label (self->objectives[i]));
  gtk_drop_down_set_model (self->objective_dropdown, G_LIST_MODEL (list));
  gtk_drop_down_set_selected (self->objective_dropdown, 0);
}

/* After an edit, undo or unit switch in the window: the results are stale when the project is
 * no longer the state they were searched for. */
static void
window_project_changed (BwWindow *window, gboolean structure, gpointer data)
{
  BwAutosizeDialog *self = data;
  gboolean was_stale = self->stale;

  (void) window;
  (void) structure;
  refresh_labels (self);
  if (self->has_result)
    {
      self->stale = !bw_project_equal (bw_window_get_project (self->window), self->searched);
      results_rebuild (self);
      if (self->stale && !was_stale)
        set_message (self, _("The project changed since the search: the designs listed are for the "
                             "earlier state. Search again to size the unit as it is now."));
    }
  update_sensitivity (self);
}

/* --- search --- */

static void
search_done (GObject *source, GAsyncResult *res, gpointer data)
{
  BwAutosizeDialog *self = data; /* the reference taken when the search started */
  Job *job = g_task_get_task_data (G_TASK (res));
  g_autoptr (GError) error = NULL;
  const gboolean ok = g_task_propagate_boolean (G_TASK (res), &error);

  (void) source;
  if (self->disposed || self->job != job)
    {
      g_object_unref (self);
      return;
    }
  if (g_atomic_int_get (&job->cancel))
    {
      gtk_progress_bar_set_text (self->progress_bar, _("cancelled"));
      set_message (self, _("The search was cancelled. The project is unchanged."));
    }
  else if (!ok)
    {
      g_autofree char *m = g_strdup_printf (_("No design passes: %s"), error->message);
      gtk_progress_bar_set_fraction (self->progress_bar, 0);
      gtk_progress_bar_set_text (self->progress_bar, _("nothing found"));
      set_message (self, m);
      if (job->result.searched)
        {
          g_autofree char *shown = bw_locale_localize_number (job->result.searched);
          gtk_label_set_text (self->searched_label, shown);
        }
    }
  else
    {
      g_autofree char *m = NULL;
      /* The dialog takes the result and the copies its pointers refer to. */
      self->result = job->result;
      memset (&job->result, 0, sizeof job->result);
      self->searched = g_steal_pointer (&job->project);
      self->set = g_steal_pointer (&job->set);
      self->has_result = TRUE;
      self->stale = !bw_project_equal (bw_window_get_project (self->window), self->searched);
      gtk_progress_bar_set_fraction (self->progress_bar, 1);
      gtk_progress_bar_set_text (self->progress_bar, _("done"));
      {
        g_autofree char *searched = g_strdup_printf (_("Searched: %s"), self->result.searched);
        gtk_label_set_text (self->searched_label, searched);
      }
      if (self->stale)
        m = g_strdup (_("The project changed during the search: the designs listed are for the earlier "
                        "state. Search again to size the unit as it is now."));
      else
        {
          /* The counts as text first: a G_GUINT64_FORMAT inside the message would cut the msgid
           * short for xgettext. */
          g_autofree char *tried = g_strdup_printf ("%" G_GUINT64_FORMAT, self->result.candidates);
          g_autofree char *passing = g_strdup_printf ("%" G_GUINT64_FORMAT, self->result.passing);
          m = g_strdup_printf (_("%s designs tried, %s pass every required criterion in every load "
                                 "case; the best %u are listed. Choose one and apply it."),
                               tried, passing, self->result.n_best);
        }
      set_message (self, m);
      results_rebuild (self);
    }
  g_clear_pointer (&self->job, job_release);
  update_sensitivity (self);
  g_signal_emit (self, dialog_signals[SIGNAL_SEARCH_FINISHED], 0);
  g_object_unref (self);
}

static void
forget_result (BwAutosizeDialog *self)
{
  bw_autosize_result_clear (&self->result);
  memset (&self->result, 0, sizeof self->result);
  g_clear_pointer (&self->searched, bw_project_free);
  g_clear_pointer (&self->set, bw_criteria_set_free);
  self->has_result = FALSE;
  self->stale = FALSE;
  if (!self->disposed)
    results_clear (self);
}

void
bw_autosize_dialog_search (BwAutosizeDialog *self)
{
  const BwCriteriaSet *set;
  g_autoptr (GTask) task = NULL;
  Job *job;

  g_return_if_fail (BW_IS_AUTOSIZE_DIALOG (self));
  if (self->job || self->disposed)
    return;
  set = bw_window_get_criteria (self->window);
  if (set == NULL)
    {
      set_message (self, _("criteria set: none is in use, so nothing can be checked; choose one on "
                           "the design basis page"));
      return;
    }
  if (bw_project_find_unit (bw_window_get_project (self->window), self->unit_id, NULL) == NULL)
    {
      g_autofree char *m = g_strdup_printf (_("unit: '%s' is no longer in the project"), self->unit_id);
      set_message (self, m);
      return;
    }
  forget_result (self);
  job = g_atomic_rc_box_new0 (Job);
  job->project = bw_project_copy (bw_window_get_project (self->window));
  job->set = criteria_copy (set);
  job->unit_id = g_strdup (self->unit_id);
  job->objective = bw_autosize_dialog_get_objective (self);
  job->context = g_main_context_ref_thread_default ();
  g_weak_ref_init (&job->dialog, self);
  self->job = job;

  task = g_task_new (NULL, NULL, search_done, g_object_ref (self));
  g_task_set_task_data (task, g_atomic_rc_box_acquire (job), job_release);
  g_task_set_name (task, "bw-autosize");
  gtk_progress_bar_set_fraction (self->progress_bar, 0);
  /* xgettext:no-c-format */
  gtk_progress_bar_set_text (self->progress_bar, _("0 % searched"));
  {
    g_autofree char *m = g_strdup_printf (_("Searching for the %s against %s, on a copy of the project…"),
                                          objective_label (job->objective), set->name);
    set_message (self, m);
  }
  gtk_label_set_text (self->searched_label, "");
  update_sensitivity (self);
  g_task_run_in_thread (task, search_thread);
}

void
bw_autosize_dialog_cancel (BwAutosizeDialog *self)
{
  g_return_if_fail (BW_IS_AUTOSIZE_DIALOG (self));
  if (self->job == NULL)
    return;
  g_atomic_int_set (&self->job->cancel, 1);
  gtk_widget_set_sensitive (GTK_WIDGET (self->cancel_button), FALSE);
  set_message (self, _("Cancelling…"));
}

gboolean
bw_autosize_dialog_is_searching (BwAutosizeDialog *self)
{
  g_return_val_if_fail (BW_IS_AUTOSIZE_DIALOG (self), FALSE);
  return self->job != NULL;
}

/* --- apply --- */

gboolean
bw_autosize_dialog_apply (BwAutosizeDialog *self, guint k, GError **error)
{
  g_autoptr (BwProject) copy = NULL;
  g_autofree char *m = NULL;

  g_return_val_if_fail (BW_IS_AUTOSIZE_DIALOG (self), FALSE);
  if (self->job)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   "%s", _("design: a search is running; wait for it or cancel it"));
      return FALSE;
    }
  if (!self->has_result || k >= self->result.n_best)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, _("design: there is no design %u"), k + 1);
      return FALSE;
    }
  if (!bw_project_equal (bw_window_get_project (self->window), self->searched))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "%s",
                   _("design: the project changed since the search; search again"));
      return FALSE;
    }
  copy = bw_project_copy (bw_window_get_project (self->window));
  if (!bw_autosize_apply (copy, self->unit_id, &self->result.best[k], error))
    return FALSE;
  if (!bw_window_do_edit (self->window, bw_edit_snapshot (copy, _("Apply the auto-sized design"), self->unit_id),
                          error))
    return FALSE;
  m = g_strdup_printf (_("Applied design %u. Undo (Ctrl+Z in the workbench) restores the earlier "
                         "values in one step."), k + 1);
  set_message (self, m);
  update_sensitivity (self);
  return TRUE;
}

/* --- signals of the controls --- */

static void
search_clicked (GtkButton *button, gpointer data)
{
  (void) button;
  bw_autosize_dialog_search (data);
}

static void
cancel_clicked (GtkButton *button, gpointer data)
{
  (void) button;
  bw_autosize_dialog_cancel (data);
}

static void
apply_clicked (GtkButton *button, gpointer data)
{
  BwAutosizeDialog *self = data;
  GtkListBoxRow *row = gtk_list_box_get_selected_row (self->results_list);
  g_autoptr (GError) error = NULL;

  (void) button;
  if (row == NULL)
    return;
  if (!bw_autosize_dialog_apply (self, (guint) gtk_list_box_row_get_index (row), &error))
    set_message (self, error->message);
}

static void
row_selected (GtkListBox *list, GtkListBoxRow *row, gpointer data)
{
  (void) list;
  (void) row;
  update_sensitivity (data);
}

static void
row_activated (GtkListBox *list, GtkListBoxRow *row, gpointer data)
{
  (void) list;
  (void) row;
  if (gtk_widget_get_sensitive (GTK_WIDGET (BW_AUTOSIZE_DIALOG (data)->apply_button)))
    apply_clicked (NULL, data);
}

/* --- accessors --- */

const char *
bw_autosize_dialog_get_unit_id (BwAutosizeDialog *self)
{
  g_return_val_if_fail (BW_IS_AUTOSIZE_DIALOG (self), NULL);
  return self->unit_id;
}

BwObjective
bw_autosize_dialog_get_objective (BwAutosizeDialog *self)
{
  guint i;

  g_return_val_if_fail (BW_IS_AUTOSIZE_DIALOG (self), BW_OBJECTIVE_VOLUME);
  i = gtk_drop_down_get_selected (self->objective_dropdown);
  return i < self->n_objectives ? self->objectives[i] : BW_OBJECTIVE_VOLUME;
}

gboolean
bw_autosize_dialog_set_objective (BwAutosizeDialog *self, BwObjective objective)
{
  g_return_val_if_fail (BW_IS_AUTOSIZE_DIALOG (self), FALSE);
  for (guint i = 0; i < self->n_objectives; i++)
    if (self->objectives[i] == objective)
      {
        gtk_drop_down_set_selected (self->objective_dropdown, i);
        return TRUE;
      }
  return FALSE;
}

const BwAutosizeResult *
bw_autosize_dialog_get_result (BwAutosizeDialog *self)
{
  g_return_val_if_fail (BW_IS_AUTOSIZE_DIALOG (self), NULL);
  return self->has_result ? &self->result : NULL;
}

const char *
bw_autosize_dialog_get_message (BwAutosizeDialog *self)
{
  g_return_val_if_fail (BW_IS_AUTOSIZE_DIALOG (self), NULL);
  return self->message ? self->message : "";
}

GtkWidget *
bw_autosize_dialog_get_results_list (BwAutosizeDialog *self)
{
  g_return_val_if_fail (BW_IS_AUTOSIZE_DIALOG (self), NULL);
  return GTK_WIDGET (self->results_list);
}

char *
bw_autosize_dialog_dup_results_text (BwAutosizeDialog *self)
{
  GString *s = g_string_new (NULL);

  g_return_val_if_fail (BW_IS_AUTOSIZE_DIALOG (self), NULL);
  for (GtkWidget *row = gtk_widget_get_first_child (GTK_WIDGET (self->results_list)); row;
       row = gtk_widget_get_next_sibling (row))
    {
      const char *t = g_object_get_data (G_OBJECT (row), "bw-text");
      if (t)
        g_string_append_printf (s, "%s\n", t);
    }
  return g_string_free (s, FALSE);
}

/* --- GObject --- */

static void
bw_autosize_dialog_dispose (GObject *object)
{
  BwAutosizeDialog *self = BW_AUTOSIZE_DIALOG (object);

  self->disposed = TRUE;
  if (self->job)
    {
      /* Closing the dialog stops the search; the worker keeps its own reference to the job. */
      g_atomic_int_set (&self->job->cancel, 1);
      g_clear_pointer (&self->job, job_release);
    }
  if (self->window)
    {
      g_clear_signal_handler (&self->changed_handler, self->window);
      g_clear_object (&self->window);
    }
  gtk_widget_dispose_template (GTK_WIDGET (self), BW_TYPE_AUTOSIZE_DIALOG);
  G_OBJECT_CLASS (bw_autosize_dialog_parent_class)->dispose (object);
}

static void
bw_autosize_dialog_finalize (GObject *object)
{
  BwAutosizeDialog *self = BW_AUTOSIZE_DIALOG (object);

  forget_result (self);
  g_free (self->unit_id);
  g_free (self->message);
  G_OBJECT_CLASS (bw_autosize_dialog_parent_class)->finalize (object);
}

static void
bw_autosize_dialog_class_init (BwAutosizeDialogClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = bw_autosize_dialog_dispose;
  object_class->finalize = bw_autosize_dialog_finalize;

  gtk_widget_class_set_template_from_resource (widget_class, "/org/basinwright/Workbench/bw-autosize-dialog.ui");
#define BIND(name) gtk_widget_class_bind_template_child (widget_class, BwAutosizeDialog, name)
  BIND (heading_label);
  BIND (unit_label);
  BIND (criteria_label);
  BIND (objective_dropdown);
  BIND (searched_label);
  BIND (progress_bar);
  BIND (status_label);
  BIND (results_list);
  BIND (caution_label);
  BIND (cancel_button);
  BIND (search_button);
  BIND (apply_button);
#undef BIND
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Escape, 0, "window.close", NULL);

  /* BwAutosizeDialog::search-progress (double fraction): on the main loop, each time the
   * progress bar takes a report of the running search. */
  dialog_signals[SIGNAL_SEARCH_PROGRESS] =
    g_signal_new ("search-progress", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0, NULL, NULL,
                  NULL, G_TYPE_NONE, 1, G_TYPE_DOUBLE);
  /* BwAutosizeDialog::search-finished: a search ended (designs, none, or cancelled). */
  dialog_signals[SIGNAL_SEARCH_FINISHED] =
    g_signal_new ("search-finished", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0, NULL, NULL,
                  NULL, G_TYPE_NONE, 0);
}

static void
bw_autosize_dialog_init (BwAutosizeDialog *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  gtk_label_set_text (self->caution_label, _(BW_CAUTION_TEXT));
  g_signal_connect (self->search_button, "clicked", G_CALLBACK (search_clicked), self);
  g_signal_connect (self->cancel_button, "clicked", G_CALLBACK (cancel_clicked), self);
  g_signal_connect (self->apply_button, "clicked", G_CALLBACK (apply_clicked), self);
  g_signal_connect (self->results_list, "row-selected", G_CALLBACK (row_selected), self);
  g_signal_connect (self->results_list, "row-activated", G_CALLBACK (row_activated), self);
}

BwAutosizeDialog *
bw_autosize_dialog_new (BwWindow *window, const char *unit_id)
{
  BwAutosizeDialog *self;

  g_return_val_if_fail (BW_IS_WINDOW (window), NULL);
  g_return_val_if_fail (unit_id != NULL, NULL);
  self = g_object_new (BW_TYPE_AUTOSIZE_DIALOG, "transient-for", window, "modal", TRUE, NULL);
  self->window = g_object_ref (window);
  self->unit_id = g_strdup (unit_id);
  self->changed_handler = g_signal_connect (window, "project-changed", G_CALLBACK (window_project_changed), self);
  refresh_labels (self);
  build_objectives (self);
  gtk_label_set_text (self->searched_label, _("Search varies the unit's size in construction increments "
                                              "and checks each design in every enabled load case."));
  set_message (self, _("Choose the objective and press Search. The project is not changed until you "
                       "apply a design."));
  update_sensitivity (self);
  gtk_widget_grab_focus (GTK_WIDGET (self->search_button));
  return self;
}

/* --- win.autosize --- */

static void
action_autosize (GtkWidget *widget, const char *name, GVariant *v)
{
  BwWindow *window = BW_WINDOW (widget);
  const char *id = _bw_autosize_target (bw_window_get_project (window), bw_window_get_selected_id (window));
  BwAutosizeDialog *dialog;

  (void) name;
  (void) v;
  if (id == NULL)
    return;
  dialog = bw_autosize_dialog_new (window, id);
  gtk_window_present (GTK_WINDOW (dialog));
}

void
_bw_autosize_class_init (GtkWidgetClass *widget_class)
{
  gtk_widget_class_install_action (widget_class, "win.autosize", NULL, action_autosize);
}
