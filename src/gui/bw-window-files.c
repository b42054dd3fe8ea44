/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-window-files.c: save, save as, the unsaved-changes prompt, autosave and recovery. */
#include "config.h"

#include <errno.h>
#include <glib/gi18n.h>
#include <glib/gstdio.h>
#include <string.h>
#include <unistd.h>

#include "gui/bw-window-private.h"
#include "io/bw-project-xml.h"

static guint window_serial;

static guint
autosave_interval (void)
{
  const char *env = g_getenv ("BW_AUTOSAVE_SECONDS");
  guint64 n;

  if (env && g_ascii_string_to_unsigned (env, 10, 1, 3600, &n, NULL))
    return (guint) n;
  return 30;
}

static char *
info_path (const char *autosave)
{
  g_autofree char *stem = g_strndup (autosave, strlen (autosave) - strlen (".bwproj"));
  return g_strconcat (stem, ".ini", NULL);
}

void
_bw_window_forget_autosave (BwWindow *self)
{
  if (self->autosave_path && g_file_test (self->autosave_path, G_FILE_TEST_EXISTS))
    {
      g_autofree char *info = info_path (self->autosave_path);
      g_unlink (self->autosave_path);
      g_unlink (info);
    }
  self->autosave_dirty = FALSE;
}

char *
bw_window_autosave_now (BwWindow *self)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *dir = NULL;
  g_autoptr (GKeyFile) kf = NULL;
  g_autofree char *info = NULL;

  g_return_val_if_fail (BW_IS_WINDOW (self), NULL);
  if (!bw_edit_stack_is_modified (self->stack))
    return NULL;
  dir = g_path_get_dirname (self->autosave_path);
  if (g_mkdir_with_parents (dir, 0700) != 0
      || !bw_project_save (self->project, self->autosave_path, &error))
    {
      g_autofree char *msg = g_strdup_printf (_("autosave failed: %s"), error ? error->message : g_strerror (errno));
      _bw_window_set_status (self, msg);
      return NULL;
    }
  kf = g_key_file_new ();
  g_key_file_set_string (kf, "autosave", "original", self->path ? self->path : "");
  g_key_file_set_string (kf, "autosave", "name", self->project->name ? self->project->name : "");
  info = info_path (self->autosave_path);
  g_key_file_save_to_file (kf, info, NULL);
  self->autosave_dirty = FALSE;
  return g_strdup (self->autosave_path);
}

static gboolean
autosave_tick (gpointer data)
{
  BwWindow *self = data;

  if (self->autosave_dirty)
    g_free (bw_window_autosave_now (self));
  return G_SOURCE_CONTINUE;
}

void
_bw_window_files_init (BwWindow *self)
{
  g_autofree char *dir = bw_application_dup_autosave_dir ();
  g_autofree char *name = g_strdup_printf ("%d-%u.bwproj", (int) getpid (), ++window_serial);

  self->autosave_path = g_build_filename (dir, name, NULL);
  self->autosave_source = g_timeout_add_seconds (autosave_interval (), autosave_tick, self);
}

void
_bw_window_files_dispose (BwWindow *self)
{
  g_clear_handle_id (&self->autosave_source, g_source_remove);
}

gboolean
bw_window_save_to (BwWindow *self, const char *path, GError **error)
{
  g_autofree char *uri = NULL;

  g_return_val_if_fail (BW_IS_WINDOW (self), FALSE);
  g_return_val_if_fail (path != NULL, FALSE);
  if (!bw_project_save (self->project, path, error))
    return FALSE;
  if (g_strcmp0 (self->path, path) != 0)
    {
      g_free (self->path);
      self->path = g_strdup (path);
    }
  bw_edit_stack_mark_saved (self->stack);
  _bw_window_forget_autosave (self);
  uri = g_filename_to_uri (path, NULL, NULL);
  if (uri)
    gtk_recent_manager_add_item (gtk_recent_manager_get_default (), uri);
  _bw_window_update_title (self);
  {
    g_autofree char *msg = g_strdup_printf (_("Saved %s"), path);
    _bw_window_set_status (self, NULL);
    gtk_label_set_text (self->status_label, msg);
  }
  return TRUE;
}

static void
show_error (BwWindow *self, const char *what, const char *message)
{
  GtkWidget *d = gtk_message_dialog_new (GTK_WINDOW (self), GTK_DIALOG_MODAL | GTK_DIALOG_DESTROY_WITH_PARENT,
                                         GTK_MESSAGE_ERROR, GTK_BUTTONS_CLOSE, "%s", what);

  gtk_message_dialog_format_secondary_text (GTK_MESSAGE_DIALOG (d), "%s", message);
  g_signal_connect (d, "response", G_CALLBACK (gtk_window_destroy), NULL);
  gtk_window_present (GTK_WINDOW (d));
}

/* After a save-as from the close prompt, the window closes once saved. */
static void
save_as_response (GtkNativeDialog *dialog, int response, gpointer data)
{
  BwWindow *self = data;
  const gboolean then_close = GPOINTER_TO_INT (g_object_get_data (G_OBJECT (dialog), "bw-then-close"));

  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr (GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      g_autofree char *path = file ? g_file_get_path (file) : NULL;
      g_autoptr (GError) error = NULL;
      if (path && !g_str_has_suffix (path, ".bwproj"))
        {
          char *with = g_strconcat (path, ".bwproj", NULL);
          g_free (path);
          path = with;
        }
      if (path && !bw_window_save_to (self, path, &error))
        show_error (self, _("The project could not be saved"), error->message);
      else if (path && then_close)
        {
          self->closing = TRUE;
          gtk_window_close (GTK_WINDOW (self));
        }
    }
  g_object_unref (dialog);
  g_object_unref (self);
}

static void
save_as_full (BwWindow *self, gboolean then_close)
{
  GtkFileChooserNative *d = gtk_file_chooser_native_new (_("Save the Project"), GTK_WINDOW (self),
                                                         GTK_FILE_CHOOSER_ACTION_SAVE, _("_Save"), _("_Cancel"));
  g_autofree char *name = NULL;

  {
    g_autoptr (GtkFileFilter) filter = _bw_project_file_filter ();
    gtk_file_chooser_add_filter (GTK_FILE_CHOOSER (d), filter); /* the chooser takes its own ref */
  }
  if (self->path)
    {
      g_autoptr (GFile) f = g_file_new_for_path (self->path);
      gtk_file_chooser_set_file (GTK_FILE_CHOOSER (d), f, NULL);
    }
  else
    {
      name = g_strdup_printf ("%s.bwproj", self->project->name ? self->project->name : _("plant"));
      g_strdelimit (name, "/\\:", '-');
      gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (d), name);
    }
  g_object_set_data (G_OBJECT (d), "bw-then-close", GINT_TO_POINTER (then_close));
  g_signal_connect (d, "response", G_CALLBACK (save_as_response), g_object_ref (self));
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (d));
}

void
_bw_window_save_as (BwWindow *self)
{
  save_as_full (self, FALSE);
}

void
_bw_window_save (BwWindow *self)
{
  g_autoptr (GError) error = NULL;

  if (self->path == NULL)
    {
      save_as_full (self, FALSE);
      return;
    }
  if (!bw_window_save_to (self, self->path, &error))
    show_error (self, _("The project could not be saved"), error->message);
}

/* --- closing with unsaved changes --- */

enum { RESPONSE_DISCARD = 1, RESPONSE_SAVE = 2 };

static void
close_response (GtkDialog *d, int response, gpointer data)
{
  BwWindow *self = data;

  gtk_window_destroy (GTK_WINDOW (d));
  if (response == RESPONSE_DISCARD)
    {
      _bw_window_forget_autosave (self);
      self->closing = TRUE;
      gtk_window_close (GTK_WINDOW (self));
    }
  else if (response == RESPONSE_SAVE)
    {
      g_autoptr (GError) error = NULL;
      if (self->path == NULL)
        save_as_full (self, TRUE);
      else if (!bw_window_save_to (self, self->path, &error))
        show_error (self, _("The project could not be saved"), error->message);
      else
        {
          self->closing = TRUE;
          gtk_window_close (GTK_WINDOW (self));
        }
    }
}

gboolean
_bw_window_close_request (GtkWindow *window)
{
  BwWindow *self = BW_WINDOW (window);
  GtkWidget *d;

  if (self->closing || !bw_edit_stack_is_modified (self->stack))
    {
      _bw_window_forget_autosave (self);
      return FALSE; /* close */
    }
  d = gtk_message_dialog_new (window, GTK_DIALOG_MODAL | GTK_DIALOG_DESTROY_WITH_PARENT,
                              GTK_MESSAGE_QUESTION, GTK_BUTTONS_NONE,
                              _("Save the changes to “%s” before closing?"),
                              self->project->name ? self->project->name : _("Untitled plant"));
  gtk_message_dialog_format_secondary_text (GTK_MESSAGE_DIALOG (d),
                                            "%s", _("If you close without saving, the changes are lost."));
  gtk_dialog_add_buttons (GTK_DIALOG (d), _("Close _without Saving"), RESPONSE_DISCARD, _("_Cancel"),
                          GTK_RESPONSE_CANCEL, _("_Save"), RESPONSE_SAVE, NULL);
  gtk_dialog_set_default_response (GTK_DIALOG (d), RESPONSE_SAVE);
  g_signal_connect (d, "response", G_CALLBACK (close_response), self);
  gtk_window_present (GTK_WINDOW (d));
  return TRUE; /* wait for the answer */
}

/* --- recovery --- */

void
bw_window_offer_recovery (BwWindow *self, const char *path)
{
  g_autofree char *info = NULL;
  g_autoptr (GKeyFile) kf = g_key_file_new ();
  g_autofree char *name = NULL;
  g_autofree char *text = NULL;

  g_return_if_fail (BW_IS_WINDOW (self));
  g_return_if_fail (path != NULL);
  g_free (self->recovery_path);
  self->recovery_path = g_strdup (path);
  info = info_path (path);
  if (g_key_file_load_from_file (kf, info, G_KEY_FILE_NONE, NULL))
    name = g_key_file_get_string (kf, "autosave", "name", NULL);
  text = g_strdup_printf (_("Unsaved changes to “%s” from an earlier session were kept. Recover them?"),
                          name && name[0] ? name : _("a project"));
  gtk_label_set_text (self->recovery_label, text);
  gtk_revealer_set_reveal_child (self->recovery_revealer, TRUE);
}

static void
drop_recovery_file (BwWindow *self)
{
  g_autofree char *info = info_path (self->recovery_path);

  g_unlink (self->recovery_path);
  g_unlink (info);
  g_clear_pointer (&self->recovery_path, g_free);
  gtk_revealer_set_reveal_child (self->recovery_revealer, FALSE);
}

static void
action_recover (GtkWidget *w, const char *name, GVariant *v)
{
  BwWindow *self = BW_WINDOW (w);
  g_autoptr (GError) error = NULL;
  g_autoptr (GKeyFile) kf = g_key_file_new ();
  g_autofree char *info = NULL;
  g_autofree char *original = NULL;
  BwProject *p;

  (void) name;
  (void) v;
  if (self->recovery_path == NULL)
    return;
  p = bw_project_load (self->recovery_path, &error);
  if (p == NULL)
    {
      show_error (self, _("The autosaved project could not be read"), error->message);
      return;
    }
  info = info_path (self->recovery_path);
  if (g_key_file_load_from_file (kf, info, G_KEY_FILE_NONE, NULL))
    original = g_key_file_get_string (kf, "autosave", "original", NULL);
  /* Recovered work is unsaved: it counts as modified until saved again. */
  _bw_window_replace_project (self, p, original && original[0] ? original : NULL, FALSE);
  drop_recovery_file (self);
  self->autosave_dirty = TRUE;
  _bw_window_update_title (self);
}

static void
action_discard_recovery (GtkWidget *w, const char *name, GVariant *v)
{
  BwWindow *self = BW_WINDOW (w);

  (void) name;
  (void) v;
  if (self->recovery_path)
    drop_recovery_file (self);
}

void
_bw_window_files_class_init (GtkWidgetClass *widget_class)
{
  gtk_widget_class_install_action (widget_class, "win.recover", NULL, action_recover);
  gtk_widget_class_install_action (widget_class, "win.discard-recovery", NULL, action_discard_recovery);
}
