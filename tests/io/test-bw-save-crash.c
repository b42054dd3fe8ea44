/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-save-crash.c: a saver killed at random points always leaves a file that loads as the
 * old or the new version, and no stray temporary file is ever mistaken for the project. */
#include "config.h"

#include <glib/gstdio.h>
#include <signal.h>
#include <string.h>
#include <sys/wait.h>
#include <unistd.h>

#include "bw-test.h"
#include "io/bw-project-xml.h"

static char *
example (const char *name)
{
  return g_build_filename (g_getenv ("BW_SOURCE_ROOT"), "data", "examples", name, NULL);
}

START_TEST (test_killed_saver_leaves_old_or_new)
{
  g_autofree char *demo = example ("marrowby-demo.bwproj");
  g_autoptr (BwProject) a = bw_project_load (demo, NULL);
  g_autoptr (BwProject) b = NULL;
  g_autofree char *dir = g_dir_make_tmp ("bw-crash-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "plant.bwproj", NULL);
  GRand *rng = g_rand_new_with_seed (20261202); /* fixed: the same run every time */
  guint as_a = 0, as_b = 0;
  gint64 save_us;

  ck_assert_ptr_nonnull (a);
  /* Version B differs in a value and is a little larger, so a torn write would show. */
  b = bw_project_copy (a);
  g_free (b->revision);
  b->revision = g_strdup ("B, with a longer revision text so that the two files differ in size");
  ck_assert (bw_process_unit_set (bw_project_find_unit (b, "north-sed", NULL), "length", 58, NULL));
  ck_assert (bw_project_save (a, path, NULL));

  /* How long one save takes here, so the kills can be spread over the whole of one. */
  {
    g_autofree char *scratch = g_build_filename (dir, "timing.bwproj", NULL);
    const gint64 t0 = g_get_monotonic_time ();
    for (int i = 0; i < 5; i++)
      ck_assert (bw_project_save (b, scratch, NULL));
    save_us = MAX ((g_get_monotonic_time () - t0) / 5, 50);
    g_unlink (scratch);
  }

  for (int it = 0; it < 150; it++)
    {
      /* The child reports each finished save by one byte on a pipe, so the parent knows which
       * version is on disk whatever the machine's load: after `done` saves (save n writes b
       * when n is even), then kills it a random fraction of one save's time into the next. */
      const guint done = (guint) g_rand_int_range (rng, 1, 4);
      BwProject *last = (done - 1) % 2 ? a : b, *next = done % 2 ? a : b;
      int fds[2];
      pid_t pid;
      int status;
      char byte;

      ck_assert_int_eq (pipe (fds), 0);
      pid = fork ();
      ck_assert_int_ge (pid, 0);
      if (pid == 0)
        {
          /* The child saves the two versions in turn until it is killed. */
          close (fds[0]);
          for (guint n = 0;; n++)
            {
              if (!bw_project_save (n % 2 ? a : b, path, NULL))
                _exit (3);
              if (write (fds[1], "s", 1) != 1)
                _exit (4);
            }
        }
      close (fds[1]);
      for (guint n = 0; n < done; n++)
        ck_assert_msg (read (fds[0], &byte, 1) == 1, "iteration %d: the saver died after %u saves", it, n);
      g_usleep ((gulong) (g_rand_double_range (rng, 0.0, 1.2) * (double) save_us));
      kill (pid, SIGKILL);
      ck_assert_int_eq (waitpid (pid, &status, 0), pid);
      close (fds[0]);
      ck_assert_msg (WIFSIGNALED (status), "the saver stopped by itself (status %d)", status);
      {
        g_autoptr (GError) error = NULL;
        g_autoptr (BwProject) got = bw_project_load (path, &error);
        ck_assert_msg (got != NULL, "iteration %d: the file does not load: %s", it, error->message);
        /* The last finished save's version, or the next one if its rename had happened. */
        ck_assert_msg (bw_project_equal (got, last) || bw_project_equal (got, next),
                       "iteration %d: after %u finished saves the file is neither version", it, done);
        if (bw_project_equal (got, a))
          as_a++;
        else
          as_b++;
      }
    }
  /* The kills landed in both phases (which version is on disk follows from the count of
   * finished saves, drawn from a fixed seed, not from the machine's speed). */
  ck_assert_uint_gt (as_a, 0);
  ck_assert_uint_gt (as_b, 0);
  g_rand_free (rng);
  {
    g_autoptr (GDir) d = g_dir_open (dir, 0, NULL);
    const char *n;
    while ((n = g_dir_read_name (d)))
      {
        g_autofree char *p = g_build_filename (dir, n, NULL);
        /* Temporary files of killed saves are hidden (".plant.bwproj.XXXXXX"), never the project. */
        ck_assert (strcmp (n, "plant.bwproj") == 0 || g_str_has_prefix (n, ".plant.bwproj."));
        g_unlink (p);
      }
  }
  g_rmdir (dir);
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("save-crash");
  TCase *tc = tcase_create ("kill");

  tcase_set_timeout (tc, 240);
  tcase_add_test (tc, test_killed_saver_leaves_old_or_new);
  suite_add_tcase (s, tc);
  return s;
}
