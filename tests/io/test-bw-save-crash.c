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

  ck_assert_ptr_nonnull (a);
  /* Version B differs in a value and is a little larger, so a torn write would show. */
  b = bw_project_copy (a);
  g_free (b->revision);
  b->revision = g_strdup ("B, with a longer revision text so that the two files differ in size");
  ck_assert (bw_process_unit_set (bw_project_find_unit (b, "north-sed", NULL), "length", 58, NULL));
  ck_assert (bw_project_save (a, path, NULL));

  for (int it = 0; it < 150; it++)
    {
      const pid_t pid = fork ();
      int status;
      ck_assert_int_ge (pid, 0);
      if (pid == 0)
        {
          /* The child saves the two versions in turn until it is killed. */
          for (guint n = 0;; n++)
            if (!bw_project_save (n % 2 ? a : b, path, NULL))
              _exit (3);
        }
      g_usleep (g_rand_int_range (rng, 200, 30000));
      kill (pid, SIGKILL);
      ck_assert_int_eq (waitpid (pid, &status, 0), pid);
      ck_assert_msg (WIFSIGNALED (status), "the saver stopped by itself (status %d)", status);
      {
        g_autoptr (GError) error = NULL;
        g_autoptr (BwProject) got = bw_project_load (path, &error);
        ck_assert_msg (got != NULL, "iteration %d: the file does not load: %s", it, error->message);
        if (bw_project_equal (got, a))
          as_a++;
        else if (bw_project_equal (got, b))
          as_b++;
        else
          ck_abort_msg ("iteration %d: the file is neither version", it);
      }
    }
  /* The kills landed in both phases (the seed is fixed, so this is not luck from run to run). */
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
