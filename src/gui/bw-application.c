/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-application.c: process lifetime, app.* actions, preferences and crash recovery. */
#include "config.h"

#include "gui/bw-application.h"

#include <glib/gi18n.h>
#include <glib/gstdio.h>
#include <signal.h>
#include <string.h>
#include <unistd.h>

#include "bw-resources.h"
#include "gui/bw-window-private.h"
#include "gui/bw-window.h"
#include "io/bw-project-xml.h"
#include "io/bw-xml.h"

struct _BwApplication
{
  GtkApplication parent_instance;

  BwUnitSystem units;
  gboolean dark;
  gboolean recovery_checked;
  GSettings *settings;   /* NULL when the schema cannot be found */
  char *last_criteria;   /* the session's choice when there is no schema */
  BwReportPaper paper;   /* likewise */
};

G_DEFINE_FINAL_TYPE (BwApplication, bw_application, GTK_TYPE_APPLICATION)

/* --- settings: GSettings (org.basinwright.Basinwright) ---
 *
 * The schema is installed with the program. An uninstalled build finds the copy compiled into
 * the build tree; when neither exists the preferences still work for the session, they are
 * only not kept (a debug message says so). */

#define BW_SETTINGS_SCHEMA "org.basinwright.Basinwright"

static GSettings *
settings_open (void)
{
  GSettingsSchemaSource *source = g_settings_schema_source_get_default ();
  g_autoptr (GSettingsSchema) schema = NULL;
  g_autoptr (GSettingsSchemaSource) build_source = NULL;

  if (source)
    schema = g_settings_schema_source_lookup (source, BW_SETTINGS_SCHEMA, TRUE);
  if (schema == NULL)
    {
      build_source = g_settings_schema_source_new_from_directory (BW_BUILD_SCHEMADIR, source, FALSE, NULL);
      if (build_source)
        schema = g_settings_schema_source_lookup (build_source, BW_SETTINGS_SCHEMA, FALSE);
    }
  if (schema == NULL)
    {
      g_debug ("settings schema %s not found: preferences last for this session only", BW_SETTINGS_SCHEMA);
      return NULL;
    }
  return g_settings_new_full (schema, NULL, NULL);
}

static void
settings_load (BwApplication *self)
{
  if (self->settings == NULL)
    return;
  self->units = g_settings_get_enum (self->settings, "unit-system") == 1 ? BW_UNIT_SYSTEM_US
                                                                          : BW_UNIT_SYSTEM_SI;
  self->dark = g_settings_get_boolean (self->settings, "prefer-dark");
}

static void
settings_save (BwApplication *self)
{
  if (self->settings == NULL)
    return;
  g_settings_set_enum (self->settings, "unit-system", self->units == BW_UNIT_SYSTEM_US ? 1 : 0);
  g_settings_set_boolean (self->settings, "prefer-dark", self->dark);
}

GSettings *
bw_application_get_settings (BwApplication *self)
{
  g_return_val_if_fail (BW_IS_APPLICATION (self), NULL);
  return self->settings;
}

char *
bw_application_dup_last_criteria (BwApplication *self)
{
  g_return_val_if_fail (BW_IS_APPLICATION (self), NULL);
  if (self->settings == NULL)
    return g_strdup (self->last_criteria ? self->last_criteria : "textbook-ranges");
  return g_settings_get_string (self->settings, "last-criteria-set");
}

void
bw_application_remember_criteria (BwApplication *self, const char *criteria)
{
  g_return_if_fail (BW_IS_APPLICATION (self));
  g_return_if_fail (criteria != NULL && criteria[0] != '\0');
  g_free (self->last_criteria);
  self->last_criteria = g_strdup (criteria);
  if (self->settings)
    g_settings_set_string (self->settings, "last-criteria-set", criteria);
}

BwReportPaper
bw_application_get_paper (BwApplication *self)
{
  g_return_val_if_fail (BW_IS_APPLICATION (self), BW_REPORT_PAPER_A4);
  if (self->settings == NULL)
    return self->paper;
  return g_settings_get_enum (self->settings, "paper") == 1 ? BW_REPORT_PAPER_LETTER : BW_REPORT_PAPER_A4;
}

void
bw_application_set_paper (BwApplication *self, BwReportPaper paper)
{
  g_return_if_fail (BW_IS_APPLICATION (self));
  self->paper = paper;
  if (self->settings)
    g_settings_set_enum (self->settings, "paper", paper == BW_REPORT_PAPER_LETTER ? 1 : 0);
}

static void
apply_dark (BwApplication *self)
{
  GtkSettings *s = gtk_settings_get_default ();

  if (s)
    g_object_set (s, "gtk-application-prefer-dark-theme", self->dark, NULL);
}

BwUnitSystem
bw_application_get_unit_system (BwApplication *self)
{
  g_return_val_if_fail (BW_IS_APPLICATION (self), BW_UNIT_SYSTEM_SI);
  return self->units;
}

void
bw_application_set_unit_system (BwApplication *self, BwUnitSystem system)
{
  g_return_if_fail (BW_IS_APPLICATION (self));
  g_action_group_change_action_state (G_ACTION_GROUP (self), "unit-system",
                                      g_variant_new_string (system == BW_UNIT_SYSTEM_US ? "us" : "si"));
}

char *
bw_application_dup_autosave_dir (void)
{
  const char *state = g_getenv ("XDG_STATE_HOME");

  if (state && state[0])
    return g_build_filename (state, "basinwright", "autosave", NULL);
  return g_build_filename (g_get_user_cache_dir (), "basinwright", "autosave", NULL);
}

gboolean
bw_application_choose_renderer (void)
{
  const char *chosen = g_getenv ("GSK_RENDERER");
  g_autoptr (GDir) dri = NULL;
  const char *name;

  if (chosen && chosen[0])
    return FALSE;
  dri = g_dir_open ("/dev/dri", 0, NULL);
  while (dri && (name = g_dir_read_name (dri)))
    if (g_str_has_prefix (name, "renderD"))
      return FALSE;
  /* Measured with tests/bench/bench-gui on a 2-core machine without a GPU (DEVELOPERS.md):
   * an edit's redraw paints in about 2 ms with cairo, about 50 ms with GL in llvmpipe. */
  g_setenv ("GSK_RENDERER", "cairo", TRUE);
  return TRUE;
}

char *
bw_application_dup_demo_path (void)
{
  char *p = bw_data_find ("examples" G_DIR_SEPARATOR_S "marrowby-demo.bwproj");

  return p ? p : g_build_filename (BW_DATADIR, "examples", "marrowby-demo.bwproj", NULL);
}

/* --- windows --- */

static BwWindow *
active_bw_window (BwApplication *self)
{
  GtkWindow *w = gtk_application_get_active_window (GTK_APPLICATION (self));
  return BW_IS_WINDOW (w) ? BW_WINDOW (w) : NULL;
}

/* A window to put a project in: the active one when it is still blank and untouched. */
static BwWindow *
window_for_project (BwApplication *self)
{
  BwWindow *w = active_bw_window (self);

  if (w && bw_window_is_pristine (w))
    return w;
  return bw_window_new (self);
}

static void
open_path (BwApplication *self, const char *path)
{
  g_autoptr (GError) error = NULL;
  BwWindow *w = window_for_project (self);

  if (!bw_window_open_path (w, path, &error))
    {
      GtkWidget *d = gtk_message_dialog_new (GTK_WINDOW (w), GTK_DIALOG_MODAL | GTK_DIALOG_DESTROY_WITH_PARENT,
                                             GTK_MESSAGE_ERROR, GTK_BUTTONS_CLOSE,
                                             "%s", _("The project could not be opened"));
      gtk_message_dialog_format_secondary_text (GTK_MESSAGE_DIALOG (d), "%s", error->message);
      g_signal_connect (d, "response", G_CALLBACK (gtk_window_destroy), NULL);
      gtk_window_present (GTK_WINDOW (w));
      gtk_window_present (GTK_WINDOW (d));
      return;
    }
  gtk_window_present (GTK_WINDOW (w));
}

/* Autosaves are named PID-N.bwproj; TRUE when that process still runs. */
static gboolean
session_alive (const char *name)
{
  guint64 pid;
  g_autofree char *head = g_strndup (name, strcspn (name, "-"));

  if (!g_ascii_string_to_unsigned (head, 10, 1, G_MAXINT, &pid, NULL))
    return FALSE;
  return kill ((pid_t) pid, 0) == 0;
}

/* Offers, once per run, the newest autosave left by another (ended) session. */
static void
check_recovery (BwApplication *self, BwWindow *w)
{
  g_autofree char *dir = bw_application_dup_autosave_dir ();
  g_autoptr (GDir) d = NULL;
  g_autofree char *own = g_strdup_printf ("%d-", (int) getpid ());
  g_autofree char *best = NULL;
  gint64 best_time = 0;
  const char *name;

  if (self->recovery_checked)
    return;
  self->recovery_checked = TRUE;
  d = g_dir_open (dir, 0, NULL);
  if (d == NULL)
    return;
  while ((name = g_dir_read_name (d)))
    {
      g_autofree char *path = NULL;
      GStatBuf st;
      if (!g_str_has_suffix (name, ".bwproj") || g_str_has_prefix (name, own))
        continue;
      if (session_alive (name))
        continue; /* another running workbench's autosave, not an abandoned one */
      path = g_build_filename (dir, name, NULL);
      if (g_stat (path, &st) == 0 && (gint64) st.st_mtime >= best_time)
        {
          best_time = st.st_mtime;
          g_free (best);
          best = g_steal_pointer (&path);
        }
    }
  if (best)
    bw_window_offer_recovery (w, best);
}

/* --- actions --- */

static void
action_new (GSimpleAction *a, GVariant *v, gpointer data)
{
  (void) a;
  (void) v;
  gtk_window_present (GTK_WINDOW (bw_window_new (BW_APPLICATION (data))));
}

static void
action_new_demo (GSimpleAction *a, GVariant *v, gpointer data)
{
  BwApplication *self = data;
  g_autofree char *demo = bw_application_dup_demo_path ();
  g_autoptr (GError) error = NULL;
  BwProject *p = NULL;
  BwWindow *w;

  (void) a;
  (void) v;
  w = window_for_project (self);
  p = bw_project_load (demo, &error);
  if (p == NULL)
    {
      g_warning ("demo project: %s", error->message);
      gtk_window_present (GTK_WINDOW (w));
      return;
    }
  bw_window_take_project (w, p);
  gtk_window_present (GTK_WINDOW (w));
}

static void
open_response (GtkNativeDialog *dialog, int response, gpointer data)
{
  BwApplication *self = data;

  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr (GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      g_autofree char *path = file ? g_file_get_path (file) : NULL;
      if (path)
        open_path (self, path);
    }
  g_object_unref (dialog);
}

GtkFileFilter *
_bw_project_file_filter (void)
{
  GtkFileFilter *f = gtk_file_filter_new ();

  gtk_file_filter_set_name (f, _("Basinwright projects (*.bwproj)"));
  gtk_file_filter_add_pattern (f, "*.bwproj");
  return f;
}

static void
action_open (GSimpleAction *a, GVariant *v, gpointer data)
{
  BwApplication *self = data;
  GtkFileChooserNative *d;

  (void) a;
  (void) v;
  d = gtk_file_chooser_native_new (_("Open a Project"), GTK_WINDOW (active_bw_window (self)),
                                   GTK_FILE_CHOOSER_ACTION_OPEN, _("_Open"), _("_Cancel"));
  {
    g_autoptr (GtkFileFilter) filter = _bw_project_file_filter ();
    gtk_file_chooser_add_filter (GTK_FILE_CHOOSER (d), filter); /* the chooser takes its own ref */
  }
  g_signal_connect (d, "response", G_CALLBACK (open_response), self);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (d));
}

static void
action_open_recent (GSimpleAction *a, GVariant *v, gpointer data)
{
  (void) a;
  open_path (BW_APPLICATION (data), g_variant_get_string (v, NULL));
}

static void
action_quit (GSimpleAction *a, GVariant *v, gpointer data)
{
  GList *windows = gtk_application_get_windows (GTK_APPLICATION (data));
  g_autoptr (GList) copy = g_list_copy (windows);

  (void) a;
  (void) v;
  /* Each window asks about its own unsaved changes; the application ends with the last. */
  for (GList *l = copy; l; l = l->next)
    gtk_window_close (GTK_WINDOW (l->data));
}

static void
action_about (GSimpleAction *a, GVariant *v, gpointer data)
{
  const char *authors[] = { _("The Basinwright developers"), NULL };
  g_autofree char *comments = g_strdup_printf ("%s\n\n%s %s",
                                               _("A workbench for sizing the coagulation, "
                                                 "flocculation and sedimentation train of a "
                                                 "water treatment plant."),
                                               _("Caution."), _(BW_CAUTION_TEXT));

  (void) a;
  (void) v;
  gtk_show_about_dialog (GTK_WINDOW (active_bw_window (data)),
                         "program-name", "Basinwright",
                         "version", PACKAGE_VERSION,
                         "comments", comments,
                         "license-type", GTK_LICENSE_GPL_3_0,
                         "authors", authors,
                         "logo-icon-name", "applications-science",
                         NULL);
}

static void
action_shortcuts (GSimpleAction *a, GVariant *v, gpointer data)
{
  BwWindow *w = active_bw_window (data);

  (void) a;
  (void) v;
  if (w)
    gtk_widget_activate_action (GTK_WIDGET (w), "win.show-help-overlay", NULL);
}

static void
prefs_units_changed (GtkDropDown *dd, GParamSpec *pspec, gpointer data)
{
  (void) pspec;
  bw_application_set_unit_system (data, gtk_drop_down_get_selected (dd) == 1 ? BW_UNIT_SYSTEM_US
                                                                             : BW_UNIT_SYSTEM_SI);
}

static void
prefs_dark_changed (GtkSwitch *sw, GParamSpec *pspec, gpointer data)
{
  (void) pspec;
  g_action_group_change_action_state (G_ACTION_GROUP (data), "dark",
                                      g_variant_new_boolean (gtk_switch_get_active (sw)));
}

static void
action_preferences (GSimpleAction *a, GVariant *v, gpointer data)
{
  BwApplication *self = data;
  g_autoptr (GtkBuilder) b = gtk_builder_new_from_resource ("/org/basinwright/Workbench/bw-preferences.ui");
  GtkWindow *w = GTK_WINDOW (gtk_builder_get_object (b, "preferences"));
  GtkDropDown *units = GTK_DROP_DOWN (gtk_builder_get_object (b, "units_dropdown"));
  GtkSwitch *dark = GTK_SWITCH (gtk_builder_get_object (b, "dark_switch"));

  (void) a;
  (void) v;
  gtk_drop_down_set_selected (units, self->units == BW_UNIT_SYSTEM_US ? 1 : 0);
  gtk_switch_set_active (dark, self->dark);
  g_signal_connect (units, "notify::selected", G_CALLBACK (prefs_units_changed), self);
  g_signal_connect (dark, "notify::active", G_CALLBACK (prefs_dark_changed), self);
  /* Escape and Ctrl+W close it, as a dialog's keys do, with or without a window manager. */
  {
    GtkEventController *keys = gtk_shortcut_controller_new ();
    gtk_shortcut_controller_add_shortcut (GTK_SHORTCUT_CONTROLLER (keys),
                                          gtk_shortcut_new (gtk_alternative_trigger_new (
                                                              gtk_keyval_trigger_new (GDK_KEY_Escape, 0),
                                                              gtk_keyval_trigger_new (GDK_KEY_w, GDK_CONTROL_MASK)),
                                                            gtk_named_action_new ("window.close")));
    gtk_widget_add_controller (GTK_WIDGET (w), keys);
  }
  gtk_window_set_transient_for (w, GTK_WINDOW (active_bw_window (self)));
  gtk_window_present (w);
}

static void
change_unit_system (GSimpleAction *a, GVariant *v, gpointer data)
{
  BwApplication *self = data;
  BwUnitSystem s;

  if (!bw_unit_system_from_name (g_variant_get_string (v, NULL), &s))
    return;
  self->units = s;
  g_simple_action_set_state (a, v);
  settings_save (self);
}

static void
change_dark (GSimpleAction *a, GVariant *v, gpointer data)
{
  BwApplication *self = data;

  self->dark = g_variant_get_boolean (v);
  g_simple_action_set_state (a, v);
  apply_dark (self);
  settings_save (self);
}

static const GActionEntry app_actions[] = {
  { "new", action_new, NULL, NULL, NULL, { 0 } },
  { "new-demo", action_new_demo, NULL, NULL, NULL, { 0 } },
  { "open", action_open, NULL, NULL, NULL, { 0 } },
  { "open-recent", action_open_recent, "s", NULL, NULL, { 0 } },
  { "quit", action_quit, NULL, NULL, NULL, { 0 } },
  { "about", action_about, NULL, NULL, NULL, { 0 } },
  { "shortcuts", action_shortcuts, NULL, NULL, NULL, { 0 } },
  { "preferences", action_preferences, NULL, NULL, NULL, { 0 } },
  { "unit-system", NULL, "s", "'si'", change_unit_system, { 0 } },
  { "dark", NULL, NULL, "false", change_dark, { 0 } },
};

/* --- GApplication --- */

static void
bw_application_startup (GApplication *app)
{
  BwApplication *self = BW_APPLICATION (app);
  g_autoptr (GtkCssProvider) css = gtk_css_provider_new ();
  static const struct { const char *action; const char *accels[3]; } accels[] = {
    { "app.new", { "<Primary>n", NULL } },
    { "app.open", { "<Primary>o", NULL } },
    { "app.quit", { "<Primary>q", NULL } },
    { "app.preferences", { "<Primary>comma", NULL } },
    { "win.save", { "<Primary>s", NULL } },
    { "win.save-as", { "<Primary><Shift>s", NULL } },
    { "win.undo", { "<Primary>z", NULL } },
    { "win.redo", { "<Primary><Shift>z", "<Primary>y", NULL } },
    { "win.duplicate-unit", { "<Primary>d", NULL } },
    { "win.autosize", { "<Primary><Shift>a", "F7", NULL } },
    { "win.close", { "<Primary>w", NULL } },
    { "win.page('unit')", { "<Alt>1", NULL } },
    { "win.page('checks')", { "<Alt>2", NULL } },
    { "win.page('basis')", { "<Alt>3", NULL } },
    { "win.page('sketch')", { "<Alt>4", NULL } },
    { "win.page('chemistry')", { "<Alt>5", NULL } },
    { "win.page('review')", { "<Alt>6", NULL } },
    { "win.export-report", { "<Primary>p", NULL } },
    { "win.help", { "F1", NULL } },
  };

  G_APPLICATION_CLASS (bw_application_parent_class)->startup (app);
  if (g_get_prgname () == NULL)
    g_set_prgname ("basinwright");
  if (g_get_application_name () == NULL)
    g_set_application_name ("Basinwright");
  g_action_map_add_action_entries (G_ACTION_MAP (self), app_actions, G_N_ELEMENTS (app_actions), self);
  for (guint i = 0; i < G_N_ELEMENTS (accels); i++)
    gtk_application_set_accels_for_action (GTK_APPLICATION (self), accels[i].action, accels[i].accels);

  self->settings = settings_open ();
  settings_load (self);
  g_action_group_change_action_state (G_ACTION_GROUP (self), "unit-system",
                                      g_variant_new_string (self->units == BW_UNIT_SYSTEM_US ? "us" : "si"));
  g_action_group_change_action_state (G_ACTION_GROUP (self), "dark", g_variant_new_boolean (self->dark));
  apply_dark (self);

  gtk_css_provider_load_from_resource (css, "/org/basinwright/Workbench/bw-style.css");
  gtk_style_context_add_provider_for_display (gdk_display_get_default (), GTK_STYLE_PROVIDER (css),
                                              GTK_STYLE_PROVIDER_PRIORITY_APPLICATION);
}

static void
bw_application_activate (GApplication *app)
{
  BwApplication *self = BW_APPLICATION (app);
  BwWindow *w = active_bw_window (self);

  if (w == NULL)
    w = bw_window_new (self);
  gtk_window_present (GTK_WINDOW (w));
  check_recovery (self, w);
}

static void
bw_application_open (GApplication *app, GFile **files, int n_files, const char *hint)
{
  BwApplication *self = BW_APPLICATION (app);

  (void) hint;
  for (int i = 0; i < n_files; i++)
    {
      g_autofree char *path = g_file_get_path (files[i]);
      if (path)
        open_path (self, path);
    }
  if (active_bw_window (self))
    check_recovery (self, active_bw_window (self));
}

static void
bw_application_finalize (GObject *object)
{
  BwApplication *self = BW_APPLICATION (object);

  g_clear_object (&self->settings);
  g_free (self->last_criteria);
  G_OBJECT_CLASS (bw_application_parent_class)->finalize (object);
}

static void
bw_application_class_init (BwApplicationClass *klass)
{
  GApplicationClass *app_class = G_APPLICATION_CLASS (klass);

  G_OBJECT_CLASS (klass)->finalize = bw_application_finalize;

  /* The resources live in this static library; referencing them links them in (their
   * constructor registers them). */
  (void) bw_get_resource ();
  app_class->startup = bw_application_startup;
  app_class->activate = bw_application_activate;
  app_class->open = bw_application_open;
}

static void
bw_application_init (BwApplication *self)
{
  self->units = BW_UNIT_SYSTEM_SI;
  self->paper = BW_REPORT_PAPER_A4;
}

BwApplication *
bw_application_new (void)
{
  return g_object_new (BW_TYPE_APPLICATION,
                       "application-id", BW_APPLICATION_ID,
                       "flags", G_APPLICATION_HANDLES_OPEN | G_APPLICATION_NON_UNIQUE,
                       "resource-base-path", "/org/basinwright/Workbench",
                       NULL);
}
