/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-report-dialog.c: the design report dialog. The preview pages come from
 * bw_report_render_pages, the same layout code as the PDF writer, so the two cannot disagree.
 * Both the layout and the writing run in a worker thread on a copy of the project. */
#include "config.h"

#include "gui/bw-report-dialog.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

#include "draw/bw-report.h"
#include "engine/bw-edit.h"
#include "io/bw-criteria-xml.h"

struct _BwReportDialog
{
  GtkWindow parent_instance;

  /* Template widgets */
  GtkLabel *caution_label;
  GtkDropDown *paper_dropdown;
  GtkEntry *preparer_entry;
  GtkEntry *revision_entry;
  GtkButton *prev_button;
  GtkLabel *page_label;
  GtkButton *next_button;
  GtkButton *zoom_out_button;
  GtkButton *zoom_fit_button;
  GtkButton *zoom_in_button;
  GtkSpinner *spinner;
  GtkLabel *status_label;
  GtkScrolledWindow *preview_scroll;
  GtkDrawingArea *preview_area;
  GtkButton *close_button;
  GtkButton *export_button;

  /* Owned references */
  BwWindow *window;          /* weak pointer */
  GPtrArray *pages;          /* cairo_surface_t* recording pages, or NULL */
  GCancellable *cancellable; /* cancelled on dispose: a late result is dropped */
  char *message;
  guint generation;          /* of the preview job wanted */
  guint n_busy;              /* jobs running */
  guint page;                /* 0-based */
  double zoom;               /* 1: the page fits the view */
  guint rebuild_source;
};

G_DEFINE_FINAL_TYPE (BwReportDialog, bw_report_dialog, GTK_TYPE_WINDOW)

/* What a worker needs: nothing it shares with the main thread. */
typedef struct
{
  BwProject *project; /* a copy */
  char *criteria;     /* the set's id or path, opened afresh in the worker */
  BwReportPaper paper;
  BwUnitSystem units;
  char *path;         /* NULL: lay out the preview; else write the PDF there */
  guint generation;
} Job;

static void
job_free (Job *job)
{
  bw_project_free (job->project);
  g_free (job->criteria);
  g_free (job->path);
  g_free (job);
}

static void
job_run (GTask *task, gpointer source, gpointer data, GCancellable *cancellable)
{
  Job *job = data;
  g_autoptr (GError) error = NULL;
  g_autoptr (BwResults) r = NULL;
  g_autoptr (BwCriteriaSet) set = NULL;
  g_autoptr (GArray) checks = NULL;

  (void) source;
  (void) cancellable;
  r = bw_project_evaluate (job->project, &error);
  if (r == NULL)
    {
      g_task_return_new_error (task, error->domain, error->code, _("The project does not evaluate: %s"),
                               error->message);
      return;
    }
  set = bw_criteria_set_open (job->criteria, &error);
  if (set == NULL)
    {
      g_task_return_new_error (task, error->domain, error->code, _("Criteria set: %s"), error->message);
      return;
    }
  checks = bw_check_results (r, set);
  if (job->path)
    {
      if (bw_report_write_pdf (job->project, r, checks, set, job->paper, job->units, job->path, &error))
        g_task_return_boolean (task, TRUE);
      else
        g_task_return_error (task, g_steal_pointer (&error));
    }
  else
    {
      GPtrArray *pages = bw_report_render_pages (job->project, r, checks, set, job->paper, job->units,
                                                 &error);
      if (pages)
        g_task_return_pointer (task, pages, (GDestroyNotify) g_ptr_array_unref);
      else
        g_task_return_error (task, g_steal_pointer (&error));
    }
}

static void
set_message (BwReportDialog *self, const char *text)
{
  g_free (self->message);
  self->message = g_strdup (text);
  gtk_label_set_text (self->status_label, text);
}

static void
update_controls (BwReportDialog *self)
{
  const guint n = self->pages ? self->pages->len : 0;
  g_autofree char *label = NULL;

  if (n > 0)
    label = g_strdup_printf (_("Page %u of %u"), self->page + 1, n);
  else
    label = g_strdup (_("No pages"));
  gtk_label_set_text (self->page_label, label);
  gtk_widget_set_sensitive (GTK_WIDGET (self->prev_button), n > 0 && self->page > 0);
  gtk_widget_set_sensitive (GTK_WIDGET (self->next_button), n > 0 && self->page + 1 < n);
  gtk_widget_set_sensitive (GTK_WIDGET (self->export_button), self->n_busy == 0 && self->window != NULL);
  gtk_spinner_set_spinning (self->spinner, self->n_busy > 0);
  gtk_widget_set_visible (GTK_WIDGET (self->spinner), self->n_busy > 0);
}

/* The project as the report will show it: the window's, with the preparer and revision typed here. */
static BwProject *
report_project (BwReportDialog *self)
{
  BwProject *p = bw_project_copy (bw_window_get_project (self->window));
  const char *prep = gtk_editable_get_text (GTK_EDITABLE (self->preparer_entry));
  const char *rev = gtk_editable_get_text (GTK_EDITABLE (self->revision_entry));

  g_free (p->preparer);
  p->preparer = *prep ? g_strdup (prep) : NULL;
  g_free (p->revision);
  p->revision = *rev ? g_strdup (rev) : NULL;
  return p;
}

/* A job over the window's project, or NULL with the reason shown. */
static Job *
job_new (BwReportDialog *self, const char *path)
{
  const BwCriteriaSet *set;
  const BwProject *wp;
  Job *job;

  if (self->window == NULL)
    return NULL;
  set = bw_window_get_criteria (self->window);
  wp = bw_window_get_project (self->window);
  if (set == NULL)
    {
      set_message (self, _("The report needs a criteria set: choose one on the design basis page."));
      return NULL;
    }
  job = g_new0 (Job, 1);
  job->project = report_project (self);
  job->criteria = g_strdup (wp->criteria && *wp->criteria ? wp->criteria : set->id);
  job->paper = gtk_drop_down_get_selected (self->paper_dropdown) == 1 ? BW_REPORT_PAPER_LETTER
                                                                       : BW_REPORT_PAPER_A4;
  job->units = bw_window_get_unit_system (self->window);
  job->path = g_strdup (path);
  return job;
}

static void
preview_done (GObject *source, GAsyncResult *res, gpointer data)
{
  BwReportDialog *self = BW_REPORT_DIALOG (source);
  Job *job = g_task_get_task_data (G_TASK (res));
  g_autoptr (GError) error = NULL;
  GPtrArray *pages = g_task_propagate_pointer (G_TASK (res), &error);

  (void) data;
  if (g_error_matches (error, G_IO_ERROR, G_IO_ERROR_CANCELLED))
    return; /* the dialog is gone */
  self->n_busy--;
  if (job->generation != self->generation)
    {
      /* Options changed while this one was laid out: a newer preview is on its way. */
      g_clear_pointer (&pages, g_ptr_array_unref);
      update_controls (self);
      return;
    }
  g_clear_pointer (&self->pages, g_ptr_array_unref);
  self->pages = pages;
  if (pages == NULL)
    set_message (self, error->message);
  else
    {
      g_autofree char *msg = g_strdup_printf (g_dngettext (NULL, "%u page, as the PDF will have it.",
                                                           "%u pages, as the PDF will have them.",
                                                           pages->len),
                                              pages->len);
      self->page = MIN (self->page, pages->len > 0 ? pages->len - 1 : 0);
      set_message (self, msg);
    }
  update_controls (self);
  gtk_widget_queue_draw (GTK_WIDGET (self->preview_area));
}

static void
rebuild_preview (BwReportDialog *self)
{
  Job *job = job_new (self, NULL);
  GTask *task;

  if (job == NULL)
    {
      g_clear_pointer (&self->pages, g_ptr_array_unref);
      update_controls (self);
      gtk_widget_queue_draw (GTK_WIDGET (self->preview_area));
      return;
    }
  job->generation = ++self->generation;
  task = g_task_new (self, self->cancellable, preview_done, NULL);
  g_task_set_task_data (task, job, (GDestroyNotify) job_free);
  self->n_busy++;
  set_message (self, _("Laying out the report…"));
  update_controls (self);
  g_task_run_in_thread (task, job_run);
  g_object_unref (task);
}

static gboolean
rebuild_timeout (gpointer data)
{
  BwReportDialog *self = data;

  self->rebuild_source = 0;
  rebuild_preview (self);
  return G_SOURCE_REMOVE;
}

/* Typing in the entries lays the preview out again once the typing pauses. */
static void
options_changed (BwReportDialog *self)
{
  if (self->rebuild_source)
    g_source_remove (self->rebuild_source);
  self->rebuild_source = g_timeout_add (400, rebuild_timeout, self);
}

static void
paper_changed (GObject *o, GParamSpec *pspec, gpointer data)
{
  (void) o;
  (void) pspec;
  if (data)
    rebuild_preview (data);
}

/* --- the preview --- */

gboolean
bw_report_dialog_paint_preview (BwReportDialog *self, cairo_t *cr, int width, int height)
{
  double pw, ph, scale;
  cairo_surface_t *page;
  cairo_rectangle_t ext;

  g_return_val_if_fail (BW_IS_REPORT_DIALOG (self), FALSE);
  if (self->pages == NULL || self->pages->len == 0 || width < 8 || height < 8)
    return FALSE;
  page = g_ptr_array_index (self->pages, MIN (self->page, self->pages->len - 1));
  if (!cairo_recording_surface_get_extents (page, &ext))
    return FALSE;
  pw = ext.width;
  ph = ext.height;
  scale = MIN ((width - 16) / pw, (height - 16) / ph);
  if (!(scale > 0))
    return FALSE;
  cairo_save (cr);
  cairo_translate (cr, floor ((width - pw * scale) / 2), floor ((height - ph * scale) / 2));
  /* a shadow, then the sheet */
  cairo_set_source_rgba (cr, 0, 0, 0, 0.25);
  cairo_rectangle (cr, 3, 3, pw * scale, ph * scale);
  cairo_fill (cr);
  cairo_rectangle (cr, 0, 0, pw * scale, ph * scale);
  cairo_clip (cr);
  bw_report_paint_page (page, cr, scale);
  cairo_restore (cr);
  return TRUE;
}

static void
preview_draw (GtkDrawingArea *area, cairo_t *cr, int width, int height, gpointer data)
{
  (void) area;
  bw_report_dialog_paint_preview (data, cr, width, height);
}

/* Zoom 1 fits the page into the view; above it the area grows and the view scrolls. */
static void
set_zoom (BwReportDialog *self, double zoom)
{
  const int vw = gtk_widget_get_width (GTK_WIDGET (self->preview_scroll));
  const int vh = gtk_widget_get_height (GTK_WIDGET (self->preview_scroll));

  self->zoom = CLAMP (zoom, 1.0, 6.0); /* a view setting, not a design value */
  if (self->zoom <= 1.0 || vw <= 0 || vh <= 0)
    {
      gtk_drawing_area_set_content_width (self->preview_area, 0);
      gtk_drawing_area_set_content_height (self->preview_area, 0);
    }
  else
    {
      gtk_drawing_area_set_content_width (self->preview_area, (int) (vw * self->zoom));
      gtk_drawing_area_set_content_height (self->preview_area, (int) (vh * self->zoom));
    }
  gtk_widget_set_sensitive (GTK_WIDGET (self->zoom_out_button), self->zoom > 1.0);
  gtk_widget_queue_draw (GTK_WIDGET (self->preview_area));
}

static void
zoom_in (BwReportDialog *self)
{
  set_zoom (self, self->zoom * 1.5);
}

static void
zoom_out (BwReportDialog *self)
{
  set_zoom (self, self->zoom / 1.5);
}

static void
zoom_fit (BwReportDialog *self)
{
  set_zoom (self, 1.0);
}

void
bw_report_dialog_set_page (BwReportDialog *self, guint page)
{
  g_return_if_fail (BW_IS_REPORT_DIALOG (self));
  if (self->pages == NULL || self->pages->len == 0 || page < 1 || page > self->pages->len)
    return;
  self->page = page - 1;
  update_controls (self);
  gtk_widget_queue_draw (GTK_WIDGET (self->preview_area));
}

static void
prev_page (BwReportDialog *self)
{
  if (self->page > 0)
    bw_report_dialog_set_page (self, self->page);
}

static void
next_page (BwReportDialog *self)
{
  bw_report_dialog_set_page (self, self->page + 2);
}

static gboolean
key_pressed (GtkEventControllerKey *c, guint keyval, guint keycode, GdkModifierType state, gpointer data)
{
  (void) c;
  (void) keycode;
  (void) state;
  if (keyval == GDK_KEY_Page_Up)
    prev_page (data);
  else if (keyval == GDK_KEY_Page_Down)
    next_page (data);
  else if (keyval == GDK_KEY_Escape)
    gtk_window_close (GTK_WINDOW (data));
  else
    return FALSE;
  return TRUE;
}

/* --- export --- */

static void
export_done (GObject *source, GAsyncResult *res, gpointer data)
{
  BwReportDialog *self = BW_REPORT_DIALOG (source);
  Job *job = g_task_get_task_data (G_TASK (res));
  g_autoptr (GError) error = NULL;

  (void) data;
  if (!g_task_propagate_boolean (G_TASK (res), &error))
    {
      g_autofree char *msg = NULL;
      if (g_error_matches (error, G_IO_ERROR, G_IO_ERROR_CANCELLED))
        return;
      msg = g_strdup_printf (_("Not exported: %s"), error->message);
      self->n_busy--;
      set_message (self, msg);
    }
  else
    {
      g_autofree char *msg = g_strdup_printf (_("Exported %s"), job->path);
      self->n_busy--;
      set_message (self, msg);
    }
  update_controls (self);
}

/* The preparer and revision typed here go into the project (undoably), so the saved file and the
 * report agree. */
static gboolean
apply_identity (BwReportDialog *self)
{
  const BwProject *wp = bw_window_get_project (self->window);
  g_autoptr (BwProject) p = report_project (self);
  g_autoptr (GError) error = NULL;

  if (g_strcmp0 (p->preparer, wp->preparer) == 0 && g_strcmp0 (p->revision, wp->revision) == 0)
    return TRUE;
  if (!bw_window_do_edit (self->window, bw_edit_snapshot (p, _("Report preparer and revision"), NULL),
                          &error))
    {
      g_autofree char *msg = g_strdup_printf (_("Not exported: %s"), error->message);
      set_message (self, msg);
      return FALSE;
    }
  return TRUE;
}

void
bw_report_dialog_export_to (BwReportDialog *self, const char *path)
{
  Job *job;
  GTask *task;

  g_return_if_fail (BW_IS_REPORT_DIALOG (self));
  g_return_if_fail (path != NULL);
  if (self->window == NULL || !apply_identity (self))
    return;
  job = job_new (self, path);
  if (job == NULL)
    return;
  task = g_task_new (self, self->cancellable, export_done, NULL);
  g_task_set_task_data (task, job, (GDestroyNotify) job_free);
  self->n_busy++;
  {
    g_autofree char *msg = g_strdup_printf (_("Writing %s…"), path);
    set_message (self, msg);
  }
  update_controls (self);
  g_task_run_in_thread (task, job_run);
  g_object_unref (task);
}

static void
chooser_response (GtkNativeDialog *dialog, int response, gpointer data)
{
  BwReportDialog *self = data;

  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr (GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      g_autofree char *path = file ? g_file_get_path (file) : NULL;
      if (path && !g_str_has_suffix (path, ".pdf"))
        {
          char *with = g_strconcat (path, ".pdf", NULL);
          g_free (path);
          path = with;
        }
      if (path)
        bw_report_dialog_export_to (self, path);
      else
        set_message (self, _("Not exported: the chosen place is not a local file."));
    }
  gtk_native_dialog_destroy (dialog);
  g_object_unref (dialog);
  g_object_unref (self);
}

static void
export_clicked (BwReportDialog *self)
{
  GtkFileChooserNative *d = gtk_file_chooser_native_new (_("Export the Design Report"), GTK_WINDOW (self),
                                                         GTK_FILE_CHOOSER_ACTION_SAVE, _("_Export"),
                                                         _("_Cancel"));
  g_autoptr (GtkFileFilter) filter = gtk_file_filter_new ();
  const BwProject *wp = self->window ? bw_window_get_project (self->window) : NULL;
  g_autofree char *name = NULL;

  gtk_file_filter_set_name (filter, _("PDF documents (*.pdf)"));
  gtk_file_filter_add_suffix (filter, "pdf");
  gtk_file_chooser_add_filter (GTK_FILE_CHOOSER (d), filter);
  if (self->window && bw_window_get_path (self->window))
    {
      g_autofree char *base = g_path_get_basename (bw_window_get_path (self->window));
      char *dot = strrchr (base, '.');
      if (dot)
        *dot = '\0';
      name = g_strdup_printf ("%s-report.pdf", base);
    }
  else
    name = g_strdup_printf ("%s.pdf", wp && wp->name ? wp->name : "report");
  gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (d), name);
  g_signal_connect (d, "response", G_CALLBACK (chooser_response), g_object_ref (self));
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (d));
}

/* --- GObject --- */

gboolean
bw_report_dialog_is_busy (BwReportDialog *self)
{
  g_return_val_if_fail (BW_IS_REPORT_DIALOG (self), FALSE);
  return self->n_busy > 0 || self->rebuild_source != 0;
}

guint
bw_report_dialog_get_n_pages (BwReportDialog *self)
{
  g_return_val_if_fail (BW_IS_REPORT_DIALOG (self), 0);
  return self->pages ? self->pages->len : 0;
}

guint
bw_report_dialog_get_page (BwReportDialog *self)
{
  g_return_val_if_fail (BW_IS_REPORT_DIALOG (self), 0);
  return self->pages && self->pages->len ? self->page + 1 : 0;
}

const char *
bw_report_dialog_get_message (BwReportDialog *self)
{
  g_return_val_if_fail (BW_IS_REPORT_DIALOG (self), NULL);
  return self->message ? self->message : "";
}

static void
bw_report_dialog_dispose (GObject *object)
{
  BwReportDialog *self = BW_REPORT_DIALOG (object);

  g_cancellable_cancel (self->cancellable);
  g_clear_handle_id (&self->rebuild_source, g_source_remove);
  if (self->window)
    g_object_remove_weak_pointer (G_OBJECT (self->window), (gpointer *) &self->window);
  self->window = NULL;
  gtk_widget_dispose_template (GTK_WIDGET (self), BW_TYPE_REPORT_DIALOG);
  G_OBJECT_CLASS (bw_report_dialog_parent_class)->dispose (object);
}

static void
bw_report_dialog_finalize (GObject *object)
{
  BwReportDialog *self = BW_REPORT_DIALOG (object);

  g_clear_pointer (&self->pages, g_ptr_array_unref);
  g_clear_object (&self->cancellable);
  g_free (self->message);
  G_OBJECT_CLASS (bw_report_dialog_parent_class)->finalize (object);
}

static void
bw_report_dialog_class_init (BwReportDialogClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = bw_report_dialog_dispose;
  object_class->finalize = bw_report_dialog_finalize;
  gtk_widget_class_set_template_from_resource (widget_class,
                                               "/org/basinwright/Workbench/bw-report-dialog.ui");
#define BIND(name) gtk_widget_class_bind_template_child (widget_class, BwReportDialog, name)
  BIND (caution_label);
  BIND (paper_dropdown);
  BIND (preparer_entry);
  BIND (revision_entry);
  BIND (prev_button);
  BIND (page_label);
  BIND (next_button);
  BIND (zoom_out_button);
  BIND (zoom_fit_button);
  BIND (zoom_in_button);
  BIND (spinner);
  BIND (status_label);
  BIND (preview_scroll);
  BIND (preview_area);
  BIND (close_button);
  BIND (export_button);
#undef BIND
}

static void
bw_report_dialog_init (BwReportDialog *self)
{
  GtkEventController *keys = gtk_event_controller_key_new ();

  gtk_widget_init_template (GTK_WIDGET (self));
  self->cancellable = g_cancellable_new ();
  self->zoom = 1.0;
  gtk_label_set_text (self->caution_label, _(BW_CAUTION_TEXT));
  gtk_drawing_area_set_draw_func (self->preview_area, preview_draw, self, NULL);
  g_signal_connect_swapped (self->prev_button, "clicked", G_CALLBACK (prev_page), self);
  g_signal_connect_swapped (self->next_button, "clicked", G_CALLBACK (next_page), self);
  g_signal_connect_swapped (self->zoom_in_button, "clicked", G_CALLBACK (zoom_in), self);
  g_signal_connect_swapped (self->zoom_out_button, "clicked", G_CALLBACK (zoom_out), self);
  g_signal_connect_swapped (self->zoom_fit_button, "clicked", G_CALLBACK (zoom_fit), self);
  g_signal_connect_swapped (self->export_button, "clicked", G_CALLBACK (export_clicked), self);
  g_signal_connect_swapped (self->close_button, "clicked", G_CALLBACK (gtk_window_close), self);
  g_signal_connect (keys, "key-pressed", G_CALLBACK (key_pressed), self);
  gtk_widget_add_controller (GTK_WIDGET (self), keys);
  gtk_widget_set_sensitive (GTK_WIDGET (self->zoom_out_button), FALSE);
}

BwReportDialog *
bw_report_dialog_new (BwWindow *window)
{
  BwReportDialog *self;
  const BwProject *p;

  g_return_val_if_fail (BW_IS_WINDOW (window), NULL);
  self = g_object_new (BW_TYPE_REPORT_DIALOG, "transient-for", window, NULL);
  self->window = window;
  g_object_add_weak_pointer (G_OBJECT (window), (gpointer *) &self->window);
  p = bw_window_get_project (window);
  gtk_editable_set_text (GTK_EDITABLE (self->preparer_entry), p->preparer ? p->preparer : "");
  gtk_editable_set_text (GTK_EDITABLE (self->revision_entry), p->revision ? p->revision : "");
  g_signal_connect (self->paper_dropdown, "notify::selected", G_CALLBACK (paper_changed), self);
  g_signal_connect_swapped (self->preparer_entry, "changed", G_CALLBACK (options_changed), self);
  g_signal_connect_swapped (self->revision_entry, "changed", G_CALLBACK (options_changed), self);
  rebuild_preview (self);
  return self;
}

void
bw_report_dialog_action (GtkWidget *widget, const char *action_name, GVariant *parameter)
{
  BwReportDialog *d;

  (void) action_name;
  (void) parameter;
  g_return_if_fail (BW_IS_WINDOW (widget));
  d = bw_report_dialog_new (BW_WINDOW (widget));
  gtk_window_present (GTK_WINDOW (d));
}
