/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-keys.c: the workbench driven by real key presses (xdotool through the X server under
 * Xvfb), drag-and-drop reordering, typing undone before model edits, F1 help, and the
 * preferences kept in GSettings. */
#include "config.h"

#include <check.h>
#include <gdk/x11/gdkx.h>
#include <string.h>
#include <sys/wait.h>

#include "bw-gui-test.h"
#include "draw/bw-sketch.h"
#include "draw/bw-style.h"
#include "engine/bw-project.h"
#include "gui/bw-help.h"

static BwApplication *app;
static char *tmpdir;
static char *xdotool;

/* The ids of train TRAIN's units in flow order, joined with spaces. */
static char *
order_of (BwWindow *w, guint train)
{
  const BwTrain *t = g_ptr_array_index (bw_window_get_project (w)->trains, train);
  GString *s = g_string_new (NULL);

  for (guint i = 0; i < t->units->len; i++)
    g_string_append_printf (s, "%s%s", i ? " " : "", ((BwProcessUnit *) g_ptr_array_index (t->units, i))->id);
  return g_string_free (s, FALSE);
}

/* Sends KEYS (xdotool key names) to W's X window and lets GTK handle them. */
static void
press (BwWindow *w, const char *keys)
{
  GdkSurface *surface = gtk_native_get_surface (GTK_NATIVE (w));
  g_autofree char *xid = g_strdup_printf ("%lu", (unsigned long) gdk_x11_surface_get_xid (surface));
  g_auto (GStrv) split = g_strsplit (keys, " ", -1);
  g_autoptr (GPtrArray) argv = g_ptr_array_new ();
  g_autoptr (GError) error = NULL;
  GPid pid;
  int status = -1;
  gboolean done = FALSE;

  g_ptr_array_add (argv, xdotool);
  g_ptr_array_add (argv, (char *) "key");
  g_ptr_array_add (argv, (char *) "--window");
  g_ptr_array_add (argv, xid);
  g_ptr_array_add (argv, (char *) "--delay");
  g_ptr_array_add (argv, (char *) "60");
  for (guint i = 0; split[i]; i++)
    g_ptr_array_add (argv, split[i]);
  g_ptr_array_add (argv, NULL);
  ck_assert_msg (g_spawn_async (NULL, (char **) argv->pdata, NULL, G_SPAWN_DO_NOT_REAP_CHILD, NULL, NULL,
                                &pid, &error), "xdotool: %s", error ? error->message : "");
  /* GTK must keep reading X events while xdotool sends them */
  for (int i = 0; i < 500 && !done; i++)
    {
      bw_gui_test_pump (10);
      done = waitpid (pid, &status, WNOHANG) == pid;
    }
  ck_assert_msg (done && WIFEXITED (status) && WEXITSTATUS (status) == 0, "xdotool key %s failed", keys);
  g_spawn_close_pid (pid);
  bw_gui_test_pump (150);
}

/* Puts the X input focus on W (there is no window manager under Xvfb to do it). */
static void
focus_window (BwWindow *w)
{
  GdkSurface *surface = gtk_native_get_surface (GTK_NATIVE (w));
  g_autofree char *xid = g_strdup_printf ("%lu", (unsigned long) gdk_x11_surface_get_xid (surface));
  const char *argv[] = { xdotool, "windowfocus", "--sync", xid, NULL };
  int status = -1;

  ck_assert (g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_DEFAULT, NULL, NULL, NULL, NULL, &status, NULL));
  bw_gui_test_pump (100);
}

/* Runs the main loop until COND holds or 5 s have passed (the machine may be busy). */
#define WAIT_UNTIL(cond)                                         \
  G_STMT_START                                                   \
  {                                                              \
    for (int wait_i_ = 0; wait_i_ < 250 && !(cond); wait_i_++)   \
      bw_gui_test_pump (20);                                     \
  }                                                              \
  G_STMT_END

/* Waits (up to 5 s: the machine may be busy) until train TRAIN's order is WANT; returns it. */
static char *
wait_order (BwWindow *w, guint train, const char *want)
{
  char *now = order_of (w, train);

  for (int i = 0; i < 250 && strcmp (now, want) != 0; i++)
    {
      bw_gui_test_pump (20);
      g_free (now);
      now = order_of (w, train);
    }
  return now;
}

static GtkWidget *
nav_row_of (BwWindow *w, const char *id)
{
  GtkWidget *list = bw_window_get_navigator (w);

  for (GtkWidget *r = gtk_widget_get_first_child (list); r; r = gtk_widget_get_next_sibling (r))
    if (g_strcmp0 (g_object_get_data (G_OBJECT (r), "bw-id"), id) == 0)
      return r;
  return NULL;
}

/* The navigator's keys, pressed for real: Alt+Down moves the selected unit down the flow,
 * Alt+Up back, Delete removes it, Ctrl+Z brings it back, Alt+2 shows the checks page. */
START_TEST (test_navigator_keys)
{
  BwWindow *w;
  g_autofree char *before = NULL, *after = NULL, *removed = NULL, *back = NULL;

  if (xdotool == NULL)
    {
      /* deps.sh installs it; without it, say so loudly and fail rather than pass silently */
      ck_abort_msg ("xdotool not found: install it (build-aux/deps.sh) to run the key tests");
    }
  w = bw_gui_test_demo_window (app, 150);
  focus_window (w);
  ck_assert (bw_window_select_unit (w, "north-rm"));
  gtk_widget_grab_focus (nav_row_of (w, "north-rm"));
  bw_gui_test_pump (50);
  before = order_of (w, 0);
  ck_assert_str_eq (before, "north-rm north-floc north-sed"); /* the demo file's order */

  press (w, "alt+Down");
  after = wait_order (w, 0, "north-floc north-rm north-sed");
  ck_assert_str_eq (after, "north-floc north-rm north-sed");
  ck_assert_str_eq (bw_window_get_selected_id (w), "north-rm");

  press (w, "alt+Up");
  g_free (after);
  after = wait_order (w, 0, before);
  ck_assert_str_eq (after, before);

  gtk_widget_grab_focus (nav_row_of (w, "north-rm"));
  press (w, "Delete");
  removed = wait_order (w, 0, "north-floc north-sed");
  ck_assert_str_eq (removed, "north-floc north-sed");
  ck_assert_ptr_null (bw_project_find_unit (bw_window_get_project (w), "north-rm", NULL));

  press (w, "ctrl+z");
  back = wait_order (w, 0, before);
  ck_assert_str_eq (back, before);

  press (w, "alt+2");
  {
    GtkWidget *checks = bw_window_get_checks_list (w);
    for (int i = 0; i < 250 && !gtk_widget_get_mapped (checks); i++)
      bw_gui_test_pump (20);
    ck_assert (gtk_widget_get_mapped (checks));
  }
  bw_gui_test_close_window (w);
}
END_TEST

/* Ctrl+Z typed inside an entry with unapplied typing undoes the typing, not the last edit. */
START_TEST (test_ctrl_z_in_entry_undoes_typing)
{
  BwWindow *w;
  GtkWidget *e;
  g_autofree char *shown = NULL;

  if (xdotool == NULL)
    ck_abort_msg ("xdotool not found: install it (build-aux/deps.sh) to run the key tests");
  w = bw_gui_test_demo_window (app, 150);
  focus_window (w);
  bw_window_select_unit (w, "north-sed");
  /* one model edit to have something the window could undo */
  e = bw_window_get_field_widget (w, "length");
  gtk_editable_set_text (GTK_EDITABLE (e), "60 m");
  g_signal_emit_by_name (e, "activate");
  bw_gui_test_pump (20);
  ck_assert_double_eq_tol (bw_process_unit_get (bw_project_find_unit (bw_window_get_project (w), "north-sed", NULL), "length"),
                           60.0, 1e-12);
  shown = g_strdup (gtk_editable_get_text (GTK_EDITABLE (e)));

  /* type into the width entry for real, then Ctrl+Z */
  e = bw_window_get_field_widget (w, "width");
  gtk_widget_grab_focus (e);
  bw_gui_test_pump (30);
  press (w, "End BackSpace BackSpace 9");
  WAIT_UNTIL (g_str_has_suffix (gtk_editable_get_text (GTK_EDITABLE (e)), "9"));
  ck_assert (g_str_has_suffix (gtk_editable_get_text (GTK_EDITABLE (e)), "9"));
  press (w, "ctrl+z");
  WAIT_UNTIL (!g_str_has_suffix (gtk_editable_get_text (GTK_EDITABLE (e)), "9"));
  /* the typing went back; the model edit of the length is still there */
  ck_assert_double_eq_tol (bw_process_unit_get (bw_project_find_unit (bw_window_get_project (w), "north-sed", NULL), "length"),
                           60.0, 1e-12);
  ck_assert (!g_str_has_suffix (gtk_editable_get_text (GTK_EDITABLE (e)), "9"));
  /* once the entry shows the model's value again, Ctrl+Z undoes the model edit */
  for (int i = 0; i < 4 && g_str_has_suffix (gtk_editable_get_text (GTK_EDITABLE (e)), "m") == FALSE; i++)
    press (w, "ctrl+z");
  press (w, "ctrl+z");
  WAIT_UNTIL (bw_process_unit_get (bw_project_find_unit (bw_window_get_project (w), "north-sed", NULL), "length") < 59);
  ck_assert_double_eq_tol (bw_process_unit_get (bw_project_find_unit (bw_window_get_project (w), "north-sed", NULL), "length"),
                           56.0, 1e-12); /* the demo file's length */
  bw_gui_test_close_window (w);
}
END_TEST

/* Dropping a dragged row on another moves the unit there, within its train only, undoably. */
START_TEST (test_drop_reorders_within_train)
{
  BwWindow *w = bw_gui_test_demo_window (app, 150);
  g_autoptr (GError) error = NULL;
  g_autofree char *a = NULL, *b = NULL;
  GtkWidget *row = nav_row_of (w, "north-sed");
  gboolean has_source = FALSE, has_target = FALSE;

  /* the rows carry a drag source and a drop target */
  for (guint i = 0; i < g_list_model_get_n_items (gtk_widget_observe_controllers (row)); i++)
    {
      g_autoptr (GObject) c = g_list_model_get_item (gtk_widget_observe_controllers (row), i);
      has_source |= GTK_IS_DRAG_SOURCE (c);
      has_target |= GTK_IS_DROP_TARGET (c);
    }
  ck_assert (has_source && has_target);

  ck_assert (bw_window_move_unit_to (w, "north-sed", "north-rm", &error));
  a = order_of (w, 0);
  ck_assert_str_eq (a, "north-sed north-rm north-floc");
  /* a unit cannot be dropped into another train: refused with the reason, nothing moves */
  ck_assert (!bw_window_move_unit_to (w, "north-sed", "south-sed", &error));
  ck_assert (strstr (error->message, "within its train") != NULL);
  g_clear_error (&error);
  b = order_of (w, 0);
  ck_assert_str_eq (b, a);
  gtk_widget_activate_action (GTK_WIDGET (w), "win.undo", NULL);
  g_free (a);
  a = order_of (w, 0);
  ck_assert_str_eq (a, "north-rm north-floc north-sed");
  bw_gui_test_close_window (w);
}
END_TEST

/* A real click on a block of the train schematic selects that unit. */
START_TEST (test_schematic_click_selects)
{
  BwWindow *w;
  GtkWidget *area, *view;
  BwSketchGeometry g;
  const BwProject *p;
  const BwTrain *t;
  double cx = -1, cy, ax, ay, sx, sy;
  graphene_point_t in_window;

  if (xdotool == NULL)
    ck_abort_msg ("xdotool not found: install it (build-aux/deps.sh) to run the key tests");
  w = bw_gui_test_demo_window (app, 150);
  focus_window (w);
  p = bw_window_get_project (w);
  t = g_ptr_array_index (p->trains, 0);
  bw_window_select_unit (w, "north-rm");
  bw_window_show_page (w, "sketch");
  view = bw_window_get_field_widget (w, "sketch-view");
  area = bw_window_get_field_widget (w, "sketch-area");
  gtk_drop_down_set_selected (GTK_DROP_DOWN (view), 2); /* "Train schematic" */
  bw_gui_test_pump (200);
  ck_assert (gtk_widget_get_mapped (area));
  /* the centre of the third block (the basin), from the painter's own layout at zoom 1 */
  ck_assert (bw_sketch_layout (p, g_ptr_array_index (t->units, 0), BW_SKETCH_SCHEMATIC, BW_UNIT_SYSTEM_SI,
                               bw_style_light (), gtk_widget_get_width (area), gtk_widget_get_height (area),
                               &g, NULL));
  cy = -(g.world_y0 + g.world_y1) / 2;
  for (double x = g.world_x1; x > g.world_x0; x -= 2)
    if (bw_sketch_schematic_block_at (&g, t->units->len, x, cy) == 2)
      {
        double x_end = x;
        while (bw_sketch_schematic_block_at (&g, t->units->len, x, cy) == 2)
          x -= 1;
        cx = (x + x_end) / 2;
        break;
      }
  ck_assert (cx > 0);
  ck_assert (gtk_widget_compute_point (area, GTK_WIDGET (w), &GRAPHENE_POINT_INIT (cx, cy), &in_window));
  gtk_native_get_surface_transform (GTK_NATIVE (w), &sx, &sy);
  ax = in_window.x + sx;
  ay = in_window.y + sy;
  {
    GdkSurface *surface = gtk_native_get_surface (GTK_NATIVE (w));
    g_autofree char *xid = g_strdup_printf ("%lu", (unsigned long) gdk_x11_surface_get_xid (surface));
    g_autofree char *xs = g_strdup_printf ("%d", (int) ax);
    g_autofree char *ys = g_strdup_printf ("%d", (int) ay);
    const char *argv[] = { xdotool, "mousemove", "--window", xid, xs, ys, "click", "1", NULL };
    GPid pid;
    int status = -1;
    gboolean done = FALSE;
    ck_assert (g_spawn_async (NULL, (char **) argv, NULL, G_SPAWN_DO_NOT_REAP_CHILD, NULL, NULL, &pid, NULL));
    for (int i = 0; i < 500 && !done; i++)
      {
        bw_gui_test_pump (10);
        done = waitpid (pid, &status, WNOHANG) == pid;
      }
    ck_assert (done && WIFEXITED (status) && WEXITSTATUS (status) == 0);
    g_spawn_close_pid (pid);
  }
  for (int i = 0; i < 250 && g_strcmp0 (bw_window_get_selected_id (w), "north-sed") != 0; i++)
    bw_gui_test_pump (20);
  ck_assert_str_eq (bw_window_get_selected_id (w), "north-sed");
  /* the schematic stays in view, now with the basin highlighted */
  ck_assert_uint_eq (gtk_drop_down_get_selected (GTK_DROP_DOWN (view)), 2);
  bw_gui_test_close_window (w);
}
END_TEST

/* F1 opens the manual, from the local docs, at the part for the page in view. */
START_TEST (test_f1_opens_manual_at_page)
{
  BwWindow *w = bw_gui_test_demo_window (app, 150);
  g_auto (GStrv) accels = gtk_application_get_accels_for_action (GTK_APPLICATION (app), "win.help");
  GtkWindow *help;
  g_autoptr (GError) error = NULL;
  g_autofree char *manual = bw_help_find_manual (&error);

  ck_assert_ptr_nonnull (manual);
  ck_assert (accels && accels[0] && g_strcmp0 (accels[0], "F1") == 0);
  bw_window_show_page (w, "sketch");
  gtk_widget_activate_action (GTK_WIDGET (w), "win.help", NULL);
  bw_gui_test_pump (100);
  help = g_object_get_data (G_OBJECT (w), "bw-help-window");
  ck_assert_ptr_nonnull (help);
  ck_assert (gtk_widget_get_visible (GTK_WIDGET (help)));
  ck_assert_str_eq (bw_help_get_current_heading (help), "The Sketch page");
  bw_window_show_page (w, "checks");
  gtk_widget_activate_action (GTK_WIDGET (w), "win.help", NULL);
  bw_gui_test_pump (50);
  ck_assert_ptr_eq (g_object_get_data (G_OBJECT (w), "bw-help-window"), help); /* one window, reused */
  ck_assert_str_eq (bw_help_get_current_heading (help), "The Checks page");
  /* a missing manual is said in the help window, with the places looked in */
  g_setenv ("BASINWRIGHT_DOCDIR", "/nonexistent-bw-docs", TRUE);
  ck_assert_str_eq (bw_help_topic_for_page ("unit"), "unit page");
  ck_assert_ptr_null (bw_help_topic_for_page ("no-such-page"));
  g_unsetenv ("BASINWRIGHT_DOCDIR");
  bw_gui_test_close_window (w);
  bw_gui_test_pump (50);
}
END_TEST

/* The unit system, the dark style and the last criteria set live in GSettings; a new window
 * starts with the criteria set chosen last. */
START_TEST (test_preferences_in_gsettings)
{
  GSettings *settings = bw_application_get_settings (app);
  BwWindow *w;
  g_autofree char *last = NULL;

  ck_assert_msg (settings != NULL, "the schema compiled into the build tree was not found");
  bw_application_set_unit_system (app, BW_UNIT_SYSTEM_US);
  ck_assert_int_eq (g_settings_get_enum (settings, "unit-system"), 1);
  bw_application_set_unit_system (app, BW_UNIT_SYSTEM_SI);
  ck_assert_int_eq (g_settings_get_enum (settings, "unit-system"), 0);
  bw_application_set_paper (app, BW_REPORT_PAPER_LETTER);
  ck_assert_int_eq (g_settings_get_enum (settings, "paper"), 1);
  ck_assert_int_eq (bw_application_get_paper (app), BW_REPORT_PAPER_LETTER);
  bw_application_set_paper (app, BW_REPORT_PAPER_A4);

  w = bw_gui_test_demo_window (app, 150);
  {
    GtkWidget *dd = bw_window_get_field_widget (w, "criteria");
    GListModel *m = gtk_drop_down_get_model (GTK_DROP_DOWN (dd));
    guint now = gtk_drop_down_get_selected (GTK_DROP_DOWN (dd));
    ck_assert_uint_ge (g_list_model_get_n_items (m), 2);
    gtk_drop_down_set_selected (GTK_DROP_DOWN (dd), now == 0 ? 1 : 0);
    bw_gui_test_pump (20);
  }
  last = g_settings_get_string (settings, "last-criteria-set");
  ck_assert_str_eq (last, bw_window_get_project (w)->criteria);
  bw_gui_test_close_window (w);
  w = bw_window_new (app);
  ck_assert_str_eq (bw_window_get_project (w)->criteria, last);
  ck_assert (bw_window_is_pristine (w));
  bw_gui_test_close_window (w);
}
END_TEST

static Suite *
keys_suite (void)
{
  Suite *s = suite_create ("gui-keys");
  TCase *tc = tcase_create ("keys");

  tcase_set_timeout (tc, 60);
  tcase_add_test (tc, test_navigator_keys);
  tcase_add_test (tc, test_ctrl_z_in_entry_undoes_typing);
  tcase_add_test (tc, test_drop_reorders_within_train);
  tcase_add_test (tc, test_schematic_click_selects);
  tcase_add_test (tc, test_f1_opens_manual_at_page);
  tcase_add_test (tc, test_preferences_in_gsettings);
  suite_add_tcase (s, tc);
  return s;
}

int
main (void)
{
  SRunner *sr;
  int failed;

  tmpdir = bw_gui_test_private_env ();
  if (!gtk_init_check ())
    {
      g_printerr ("no display: skipping the GUI tests\n");
      return 77;
    }
  if (!GDK_IS_X11_DISPLAY (gdk_display_get_default ()))
    {
      g_printerr ("not an X11 display: the key tests need one (GDK_BACKEND=x11)\n");
      return 77;
    }
  xdotool = g_find_program_in_path ("xdotool");
  app = bw_gui_test_app ();
  sr = srunner_create (keys_suite ());
  srunner_set_fork_status (sr, CK_NOFORK);
  srunner_run_all (sr, CK_NORMAL);
  failed = srunner_ntests_failed (sr);
  srunner_free (sr);
  g_object_unref (app);
  g_free (xdotool);
  return failed == 0 ? 0 : 1;
}
