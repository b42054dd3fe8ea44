/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-gui-test.h: helpers shared by the GUI tests: a private environment, the application, and
 * running the main loop until the window has settled. */
#pragma once

#include <check.h>
#include <gtk/gtk.h>
#include <stdlib.h>

#include "gui/bw-application.h"
#include "gui/bw-window.h"

/* Points every per-user folder at a fresh temporary directory, so tests never touch (or read)
 * the real autosaves, settings or recent files. Returns the directory. */
static inline char *
bw_gui_test_private_env (void)
{
  char *tmp = g_dir_make_tmp ("bw-gui-XXXXXX", NULL);
  const char *subdirs[] = { "state", "config", "data", "cache" };
  const char *vars[] = { "XDG_STATE_HOME", "XDG_CONFIG_HOME", "XDG_DATA_HOME", "XDG_CACHE_HOME" };

  g_assert (tmp != NULL);
  for (guint i = 0; i < G_N_ELEMENTS (vars); i++)
    {
      g_autofree char *d = g_build_filename (tmp, subdirs[i], NULL);
      g_mkdir_with_parents (d, 0700);
      g_setenv (vars[i], d, TRUE);
    }
  g_unsetenv ("BW_CRITERIA_PATH");
  g_setenv ("GSETTINGS_BACKEND", "memory", TRUE);
  g_setenv ("NO_AT_BRIDGE", "1", TRUE);
  return tmp;
}

/* Runs the main loop for about MS milliseconds. */
static inline void
bw_gui_test_pump (guint ms)
{
  gint64 end = g_get_monotonic_time () + (gint64) ms * 1000;

  while (g_get_monotonic_time () < end)
    if (!g_main_context_iteration (NULL, FALSE))
      g_usleep (2000);
}

static inline char *
bw_gui_test_demo_path (void)
{
  const char *root = g_getenv ("BW_SOURCE_ROOT");

  return g_build_filename (root ? root : ".", "data", "examples", "marrowby-demo.bwproj", NULL);
}

/* The application, registered (so windows can join it) but not run. */
static inline BwApplication *
bw_gui_test_app (void)
{
  BwApplication *app = bw_application_new ();
  g_autoptr (GError) error = NULL;

  if (!g_application_register (G_APPLICATION (app), NULL, &error))
    g_error ("register: %s", error->message);
  return app;
}

/* The first widget of TYPE in TOP's tree (TOP included), depth first; NULL when there is none. */
static inline GtkWidget *
bw_gui_test_find_widget (GtkWidget *top, GType type)
{
  if (G_TYPE_CHECK_INSTANCE_TYPE (top, type))
    return top;
  for (GtkWidget *c = gtk_widget_get_first_child (top); c; c = gtk_widget_get_next_sibling (c))
    {
      GtkWidget *found = bw_gui_test_find_widget (c, type);
      if (found)
        return found;
    }
  return NULL;
}

/* The first button under ROOT (ROOT included) whose label is LABEL; NULL when there is none. */
static inline GtkWidget *
bw_gui_test_find_button (GtkWidget *root, const char *label)
{
  if (GTK_IS_BUTTON (root) && g_strcmp0 (gtk_button_get_label (GTK_BUTTON (root)), label) == 0)
    return root;
  for (GtkWidget *c = gtk_widget_get_first_child (root); c; c = gtk_widget_get_next_sibling (c))
    {
      GtkWidget *found = bw_gui_test_find_button (c, label);
      if (found)
        return found;
    }
  return NULL;
}

/* A window of APP on the demo project, presented, after about PUMP_MS of the main loop. */
static inline BwWindow *
bw_gui_test_demo_window (BwApplication *app, guint pump_ms)
{
  g_autofree char *demo = bw_gui_test_demo_path ();
  g_autoptr (GError) error = NULL;
  BwWindow *w = bw_window_new (app);

  ck_assert_msg (bw_window_open_path (w, demo, &error), "%s", error ? error->message : "");
  gtk_window_present (GTK_WINDOW (w));
  bw_gui_test_pump (pump_ms);
  return w;
}

/* Destroys W and lets the main loop settle. */
static inline void
bw_gui_test_close_window (BwWindow *w)
{
  gtk_window_destroy (GTK_WINDOW (w));
  bw_gui_test_pump (10);
}
