/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-faults.c: the workbench under faults: a save into a read-only folder keeps the edits
 * and says why; a workbench killed after an autosave is recovered at the next start-up; an
 * autosave that cannot be written says so and keeps the project. */
#include "config.h"

#include <check.h>
#include <errno.h>
#include <glib/gstdio.h>
#include <signal.h>
#include <string.h>
#include <sys/wait.h>
#include <unistd.h>

#include "bw-gui-test.h"
#include "engine/bw-project.h"
#include "io/bw-project-xml.h"

/* The unprivileged user and group a root run takes on for permission checks ("nobody"). */
#define NOBODY 65534

static BwApplication *app;
static char *tmpdir;
static char *self_exe;

static BwWindow *
open_window (const char *path)
{
  g_autoptr (GError) error = NULL;
  BwWindow *w = bw_window_new (app);

  ck_assert_msg (bw_window_open_path (w, path, &error), "%s", error ? error->message : "");
  gtk_window_present (GTK_WINDOW (w));
  bw_gui_test_pump (50);
  return w;
}

static double
length_of (BwWindow *w)
{
  const BwProcessUnit *u = bw_project_find_unit (bw_window_get_project (w), "north-sed", NULL);

  ck_assert_ptr_nonnull (u);
  return bw_process_unit_get (u, "length");
}

/* Types 60 ft into the north basin's length, as a user would, and presses Enter. */
static void
edit_length (BwWindow *w)
{
  GtkWidget *e;

  ck_assert (bw_window_select_unit (w, "north-sed"));
  e = bw_window_get_field_widget (w, "length");
  ck_assert_msg (GTK_IS_ENTRY (e), "the length field is not an entry");
  gtk_editable_set_text (GTK_EDITABLE (e), "60 ft");
  g_signal_emit_by_name (e, "activate");
  bw_gui_test_pump (5);
  /* 60 ft x 0.3048 m/ft = 18.288 m exactly (international foot, by definition). */
  ck_assert_double_eq_tol (length_of (w), 18.288, 1e-12);
}

/* Whether any label in the window's widget tree shows text holding NEEDLE. */
static gboolean
tree_has_label (GtkWidget *widget, const char *needle)
{
  if (GTK_IS_LABEL (widget) && strstr (gtk_label_get_text (GTK_LABEL (widget)), needle))
    return TRUE;
  for (GtkWidget *c = gtk_widget_get_first_child (widget); c; c = gtk_widget_get_next_sibling (c))
    if (tree_has_label (c, needle))
      return TRUE;
  return FALSE;
}

/* As root, permission bits do not bind: take on NOBODY's effective ids (the real and saved ids
 * stay root, so drop_back can return). FALSE when that is not possible. */
static gboolean
become_nobody (void)
{
  if (getuid () != 0)
    return TRUE;
  return setegid (NOBODY) == 0 && seteuid (NOBODY) == 0;
}

static void
drop_back (void)
{
  if (getuid () != 0)
    return;
  ck_assert_int_eq (seteuid (0), 0);
  ck_assert_int_eq (setegid (0), 0);
}

#define SKIP_UNLESS_NOBODY()                                                                 \
  do                                                                                         \
    if (!become_nobody ())                                                                   \
      {                                                                                      \
        drop_back ();                                                                        \
        g_printerr ("SKIP: running as root, the test could not take uid %d, so folder "      \
                    "permissions cannot be tested here (%s)\n", NOBODY, g_strerror (errno)); \
        return;                                                                              \
      }                                                                                      \
  while (0)

/* --- a workbench killed after its autosave --- */

/* The child: opens COPY, types the edit, autosaves, prints the autosave's path, and waits to be
 * killed. Runs as its own process (spawned, not forked, so it has its own display connection),
 * outside Check: it reports by its exit status, and the parent checks what it left. */
static int
crash_child (const char *copy)
{
  BwWindow *w;
  GtkWidget *e;
  g_autofree char *path = NULL;

  if (!gtk_init_check ())
    return 77;
  app = bw_gui_test_app ();
  w = bw_window_new (app);
  if (!bw_window_open_path (w, copy, NULL))
    return 3;
  gtk_window_present (GTK_WINDOW (w));
  bw_gui_test_pump (50);
  if (!bw_window_select_unit (w, "north-sed"))
    return 4;
  e = bw_window_get_field_widget (w, "length");
  if (!GTK_IS_ENTRY (e))
    return 5;
  gtk_editable_set_text (GTK_EDITABLE (e), "60 ft");
  g_signal_emit_by_name (e, "activate");
  bw_gui_test_pump (5);
  path = bw_window_autosave_now (w);
  if (path == NULL)
    return 6;
  g_print ("%s\n", path);
  fflush (stdout);
  for (;;)
    g_main_context_iteration (NULL, TRUE);
  return 0;
}

START_TEST (test_recovery_after_kill)
{
  g_autofree char *demo = bw_gui_test_demo_path ();
  g_autofree char *copy = g_build_filename (tmpdir, "crash-copy.bwproj", NULL);
  g_autofree char *contents = NULL;
  g_autofree char *line = NULL;
  g_autoptr (GError) error = NULL;
  g_autoptr (GIOChannel) out = NULL;
  g_autoptr (BwProject) autosaved = NULL;
  const char *argv[] = { self_exe, "--crash-child", copy, NULL };
  GPid pid;
  int out_fd, status;
  gsize len;
  BwWindow *w;
  GList *windows;

  ck_assert (g_file_get_contents (demo, &contents, &len, NULL));
  ck_assert (g_file_set_contents (copy, contents, len, NULL));
  ck_assert_msg (g_spawn_async_with_pipes (NULL, (char **) argv, NULL, G_SPAWN_DO_NOT_REAP_CHILD,
                                           NULL, NULL, &pid, NULL, &out_fd, NULL, &error),
                 "%s", error ? error->message : "");
  out = g_io_channel_unix_new (out_fd);
  g_io_channel_set_close_on_unref (out, TRUE);
  ck_assert_msg (g_io_channel_read_line (out, &line, NULL, NULL, &error) == G_IO_STATUS_NORMAL,
                 "the child wrote no autosave path");
  g_strchomp (line);
  /* No clean exit: the child dies with its window open and its edit unsaved. */
  ck_assert_int_eq (kill (pid, SIGKILL), 0);
  ck_assert_int_eq (waitpid (pid, &status, 0), pid);
  ck_assert (WIFSIGNALED (status) && WTERMSIG (status) == SIGKILL);
  g_spawn_close_pid (pid);

  ck_assert_msg (g_file_test (line, G_FILE_TEST_EXISTS), "no autosave at %s", line);
  autosaved = bw_project_load (line, &error);
  ck_assert_msg (autosaved != NULL, "%s", error ? error->message : "");
  ck_assert_double_eq_tol (bw_process_unit_get (bw_project_find_unit (autosaved, "north-sed",
                                                                      NULL), "length"),
                           18.288, 1e-12);

  /* The next start-up: activating the application opens a window and offers the recovery. */
  g_application_activate (G_APPLICATION (app));
  bw_gui_test_pump (50);
  windows = gtk_application_get_windows (GTK_APPLICATION (app));
  ck_assert_msg (windows && BW_IS_WINDOW (windows->data), "start-up opened no window");
  w = BW_WINDOW (windows->data);
  ck_assert_msg (tree_has_label (GTK_WIDGET (w), "from an earlier session"),
                 "the recovery is not offered");
  ck_assert (bw_window_is_pristine (w));
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.recover", NULL));
  bw_gui_test_pump (20);
  /* The edit is back in the model and in the field, as unsaved work on the copy. */
  ck_assert (bw_project_equal (bw_window_get_project (w), autosaved));
  ck_assert_double_eq_tol (length_of (w), 18.288, 1e-12);
  ck_assert (bw_window_is_modified (w));
  ck_assert_str_eq (bw_window_get_path (w), copy);
  ck_assert (bw_window_select_unit (w, "north-sed"));
  bw_gui_test_pump (5);
  ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (bw_window_get_field_widget (w, "length"))),
                    "18.29 m");
  /* The recovered file is consumed. */
  ck_assert (!g_file_test (line, G_FILE_TEST_EXISTS));
  bw_gui_test_close_window (w);
}
END_TEST

/* --- saving into a read-only folder --- */

START_TEST (test_save_to_read_only_folder_keeps_edits)
{
  g_autofree char *demo = bw_gui_test_demo_path ();
  g_autofree char *ro = g_build_filename (tmpdir, "read-only", NULL);
  g_autofree char *bad = g_build_filename (ro, "plant.bwproj", NULL);
  g_autofree char *good = g_build_filename (tmpdir, "plant.bwproj", NULL);
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) before = NULL;
  g_autoptr (BwProject) again = NULL;
  BwWindow *w = open_window (demo);
  gboolean ok;

  edit_length (w);
  before = bw_project_copy (bw_window_get_project (w));
  ck_assert_int_eq (g_mkdir (ro, 0555), 0);

  SKIP_UNLESS_NOBODY ();
  ok = bw_window_save_to (w, bad, &error);
  drop_back ();
  ck_assert_msg (!ok, "the save into a read-only folder succeeded");
  ck_assert_msg (strstr (error->message, bad) != NULL, "no file named: %s", error->message);
  ck_assert_msg (strstr (error->message, g_strerror (EACCES)) != NULL, "no reason given: %s",
                 error->message);
  g_clear_error (&error);
  ck_assert (!g_file_test (bad, G_FILE_TEST_EXISTS));
  /* Nothing was taken as saved. */
  ck_assert (bw_window_is_modified (w));
  ck_assert (g_str_has_prefix (gtk_window_get_title (GTK_WINDOW (w)), "• "));
  ck_assert_str_eq (bw_window_get_path (w), demo);
  ck_assert (bw_project_equal (bw_window_get_project (w), before));
  ck_assert_double_eq_tol (length_of (w), 18.288, 1e-12);

  /* A writable folder then takes the same work. */
  ck_assert_msg (bw_window_save_to (w, good, &error), "%s", error ? error->message : "");
  ck_assert (!bw_window_is_modified (w));
  ck_assert (!g_str_has_prefix (gtk_window_get_title (GTK_WINDOW (w)), "• "));
  again = bw_project_load (good, &error);
  ck_assert_msg (again != NULL, "%s", error ? error->message : "");
  ck_assert (bw_project_equal (again, bw_window_get_project (w)));
  ck_assert (bw_project_equal (again, before));
  bw_gui_test_close_window (w);
}
END_TEST

/* --- an autosave that cannot be written --- */

START_TEST (test_autosave_into_read_only_folder)
{
  g_autofree char *demo = bw_gui_test_demo_path ();
  g_autofree char *dir = bw_application_dup_autosave_dir ();
  g_autofree char *path = NULL;
  g_autoptr (BwProject) before = NULL;
  BwWindow *w = open_window (demo);

  edit_length (w);
  before = bw_project_copy (bw_window_get_project (w));
  ck_assert_int_eq (g_mkdir_with_parents (dir, 0755), 0);
  {
    /* Only the autosave folder itself is read-only: its parent stays open to NOBODY. */
    g_autofree char *parent = g_path_get_dirname (dir);
    ck_assert_int_eq (g_chmod (parent, 0755), 0);
  }
  ck_assert_int_eq (g_chmod (dir, 0555), 0);

  SKIP_UNLESS_NOBODY ();
  path = bw_window_autosave_now (w);
  drop_back ();
  ck_assert_msg (path == NULL, "the autosave into a read-only folder gave %s", path);
  bw_gui_test_pump (5);
  /* The status line says what failed and why. */
  ck_assert_msg (tree_has_label (GTK_WIDGET (w), "autosave failed"), "no status message");
  ck_assert_msg (tree_has_label (GTK_WIDGET (w), g_strerror (EACCES)),
                 "the status gives no reason");
  ck_assert (bw_window_is_modified (w));
  ck_assert (bw_project_equal (bw_window_get_project (w), before));
  {
    /* Nothing half-written is left in the folder. */
    g_autoptr (GDir) d = g_dir_open (dir, 0, NULL);
    const char *n;
    ck_assert_ptr_nonnull (d);
    while ((n = g_dir_read_name (d)))
      ck_assert_msg (!g_str_has_prefix (n, "."), "a temporary file %s was left", n);
  }

  /* Once the folder is writable again the next autosave succeeds. */
  ck_assert_int_eq (g_chmod (dir, 0755), 0);
  path = bw_window_autosave_now (w);
  ck_assert_ptr_nonnull (path);
  {
    g_autoptr (BwProject) got = bw_project_load (path, NULL);
    ck_assert (got != NULL && bw_project_equal (got, before));
  }
  g_unlink (path);
  bw_gui_test_close_window (w);
}
END_TEST

static Suite *
faults_suite (void)
{
  Suite *s = suite_create ("gui-faults");
  TCase *tc = tcase_create ("faults");

  tcase_set_timeout (tc, 60);
  /* First: the application's start-up recovery check runs once per process. */
  tcase_add_test (tc, test_recovery_after_kill);
  tcase_add_test (tc, test_save_to_read_only_folder_keeps_edits);
  tcase_add_test (tc, test_autosave_into_read_only_folder);
  suite_add_tcase (s, tc);
  return s;
}

/* Lets NOBODY reach the private folders (bw_gui_test_private_env makes them 0700). */
static void
open_private_folders (void)
{
  const char *vars[] = { "XDG_STATE_HOME", "XDG_CONFIG_HOME", "XDG_DATA_HOME", "XDG_CACHE_HOME" };

  g_chmod (tmpdir, 0755);
  for (guint i = 0; i < G_N_ELEMENTS (vars); i++)
    g_chmod (g_getenv (vars[i]), 0755);
}

int
main (int argc, char **argv)
{
  SRunner *sr;
  int failed;

  if (argc == 3 && strcmp (argv[1], "--crash-child") == 0)
    return crash_child (argv[2]); /* the environment is the parent's private one */
  self_exe = g_file_read_link ("/proc/self/exe", NULL);
  if (self_exe == NULL)
    self_exe = argv[0];
  tmpdir = bw_gui_test_private_env ();
  open_private_folders ();
  if (!gtk_init_check ())
    {
      g_printerr ("no display: skipping the GUI tests\n");
      return 77;
    }
  app = bw_gui_test_app ();
  sr = srunner_create (faults_suite ());
  srunner_set_fork_status (sr, CK_NOFORK); /* one GTK, one display for every test */
  srunner_run_all (sr, CK_NORMAL);
  failed = srunner_ntests_failed (sr);
  srunner_free (sr);
  g_object_unref (app);
  return failed == 0 ? 0 : 1;
}
