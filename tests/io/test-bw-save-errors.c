/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-save-errors.c: a save into a read-only folder, onto a full disk or over a file whose
 * permission is denied fails with an error that names the file and the reason, leaves the old
 * file byte for byte (or absent, as it was), leaves no temporary file, and keeps the project. */
#include "config.h"

#include <errno.h>
#include <glib/gstdio.h>
#include <grp.h>
#include <signal.h>
#include <string.h>
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

#include "bw-test.h"
#include "io/bw-project-xml.h"
#include "io/bw-xml.h"

/* The unprivileged user and group a root test drops to ("nobody" on Debian). */
#define NOBODY 65534

/* What the child that saves reports (its exit status). */
#define CHILD_SAVED 1       /* the save succeeded */
#define CHILD_CHANGED 2     /* the project in memory differs from its copy taken before */
#define CHILD_NO_DROP 77    /* running as root, it could not become an unprivileged user */

typedef struct
{
  gboolean drop_privileges; /* become NOBODY first when running as root */
  rlim_t file_size_limit;   /* RLIMIT_FSIZE in bytes, 0 for none */
} SaveFault;

static char *
example (const char *name)
{
  return g_build_filename (g_getenv ("BW_SOURCE_ROOT"), "data", "examples", name, NULL);
}

/* Saves P to PATH in a child process under FAULT. Returns the child's status bits (CHILD_*),
 * MESSAGE receives the error message of a failed save ("" when it saved). */
static int
save_in_child (const BwProject *p, const char *path, const SaveFault *fault, char **message)
{
  int fds[2];
  pid_t pid;
  int status;
  GString *text = g_string_new (NULL);
  char buf[512];
  ssize_t n;

  ck_assert_int_eq (pipe (fds), 0);
  pid = fork ();
  ck_assert_int_ge (pid, 0);
  if (pid == 0)
    {
      g_autoptr (BwProject) before = bw_project_copy (p);
      g_autoptr (GError) error = NULL;
      int code = 0;
      gboolean ok;

      close (fds[0]);
      if (fault->drop_privileges && geteuid () == 0
          && (setgroups (0, NULL) != 0 || setgid (NOBODY) != 0 || setuid (NOBODY) != 0
              || geteuid () == 0))
        _exit (CHILD_NO_DROP);
      if (fault->file_size_limit > 0)
        {
          struct rlimit rl = { fault->file_size_limit, fault->file_size_limit };
          /* Past the limit write () fails with EFBIG instead of killing the process. */
          signal (SIGXFSZ, SIG_IGN);
          if (setrlimit (RLIMIT_FSIZE, &rl) != 0)
            _exit (CHILD_NO_DROP);
        }
      ok = bw_project_save (p, path, &error);
      if (!ok)
        {
          const char *m = error ? error->message : "(failed without an error)";
          if (write (fds[1], m, strlen (m)) < 0)
            _exit (4);
        }
      close (fds[1]);
      if (ok)
        code |= CHILD_SAVED;
      if (!bw_project_equal (p, before))
        code |= CHILD_CHANGED;
      _exit (code);
    }
  close (fds[1]);
  while ((n = read (fds[0], buf, sizeof buf)) > 0 || (n < 0 && errno == EINTR))
    if (n > 0)
      g_string_append_len (text, buf, n);
  close (fds[0]);
  ck_assert_int_eq (waitpid (pid, &status, 0), pid);
  ck_assert_msg (WIFEXITED (status), "the saving child died (status %d)", status);
  *message = g_string_free (text, FALSE);
  return WEXITSTATUS (status);
}

/* The names in DIR, sorted, joined by ",". */
static char *
listing (const char *dir)
{
  g_autoptr (GDir) d = g_dir_open (dir, 0, NULL);
  g_autoptr (GPtrArray) names = g_ptr_array_new_with_free_func (g_free);
  const char *n;

  ck_assert_ptr_nonnull (d);
  while ((n = g_dir_read_name (d)))
    g_ptr_array_add (names, g_strdup (n));
  g_ptr_array_sort (names, (GCompareFunc) g_strcmp0);
  g_ptr_array_add (names, NULL);
  return g_strjoinv (",", (char **) names->pdata);
}

/* Makes PATH belong to the unprivileged user when running as root (so that it can write what
 * the test means it to write, and nothing more). */
static void
give_to_nobody (const char *path)
{
  if (geteuid () == 0)
    ck_assert_int_eq (chown (path, NOBODY, NOBODY), 0);
}

typedef struct
{
  BwProject *old;   /* the version on disk before */
  BwProject *edited; /* the version being saved */
  char *old_bytes;
  gsize old_len;
  char *root;       /* a temporary folder, removed afterwards */
} Fixture;

static Fixture fx;

static void
setup (void)
{
  g_autofree char *demo = example ("marrowby-demo.bwproj");
  g_autoptr (GError) error = NULL;

  fx.old = bw_project_load (demo, &error);
  ck_assert_msg (fx.old != NULL, "%s", error ? error->message : "");
  fx.edited = bw_project_copy (fx.old);
  g_free (fx.edited->revision);
  fx.edited->revision = g_strdup ("edited after the last save");
  ck_assert (bw_process_unit_set (bw_project_find_unit (fx.edited, "north-sed", NULL), "length",
                                  58.0, NULL));
  ck_assert (!bw_project_equal (fx.old, fx.edited));
  fx.old_bytes = bw_project_to_xml (fx.old);
  fx.old_len = strlen (fx.old_bytes);
  fx.root = g_dir_make_tmp ("bw-save-errors-XXXXXX", NULL);
  ck_assert_ptr_nonnull (fx.root);
  /* The unprivileged child must reach the folders inside. */
  ck_assert_int_eq (g_chmod (fx.root, 0755), 0);
}

static void
remove_tree (const char *path)
{
  if (g_file_test (path, G_FILE_TEST_IS_DIR) && !g_file_test (path, G_FILE_TEST_IS_SYMLINK))
    {
      g_autoptr (GDir) d = NULL;
      const char *n;

      g_chmod (path, 0700);
      d = g_dir_open (path, 0, NULL);
      while (d && (n = g_dir_read_name (d)))
        {
          g_autofree char *child = g_build_filename (path, n, NULL);
          remove_tree (child);
        }
      g_rmdir (path);
    }
  else
    g_unlink (path);
}

static void
teardown (void)
{
  remove_tree (fx.root);
  g_clear_pointer (&fx.root, g_free);
  g_clear_pointer (&fx.old, bw_project_free);
  g_clear_pointer (&fx.edited, bw_project_free);
  g_clear_pointer (&fx.old_bytes, g_free);
}

/* A folder DIR under the test's root holding the old version as NAME (when NAME is not NULL). */
static char *
folder_with_old_file (const char *dir, const char *name)
{
  char *d = g_build_filename (fx.root, dir, NULL);

  ck_assert_int_eq (g_mkdir (d, 0755), 0);
  give_to_nobody (d);
  if (name)
    {
      g_autofree char *p = g_build_filename (d, name, NULL);
      ck_assert (g_file_set_contents (p, fx.old_bytes, fx.old_len, NULL));
      give_to_nobody (p);
    }
  return d;
}

/* The save failed, said why and where, and changed nothing: the old file has its bytes (or is
 * still absent), the folder lists what it did before, the project in memory is as it was. */
static void
assert_failed_cleanly (int code, const char *message, const char *path, const char *reason,
                       const char *dir, const char *listing_before, gboolean had_old)
{
  g_autofree char *after = NULL;

  ck_assert_msg (!(code & CHILD_SAVED), "the save into %s succeeded", path);
  ck_assert_msg (!(code & CHILD_CHANGED), "the failed save changed the project in memory");
  ck_assert_msg (strstr (message, path) != NULL, "the error does not name the file: %s", message);
  ck_assert_msg (strstr (message, reason) != NULL, "the error does not say '%s': %s", reason,
                 message);
  g_chmod (dir, 0755); /* root reads it anyway; a non-root run needs this to look inside */
  if (had_old)
    {
      g_autofree char *now = NULL;
      gsize len = 0;
      ck_assert (g_file_get_contents (path, &now, &len, NULL));
      ck_assert_msg (len == fx.old_len && memcmp (now, fx.old_bytes, len) == 0,
                     "the old file %s changed", path);
    }
  else
    ck_assert_msg (!g_file_test (path, G_FILE_TEST_EXISTS), "%s appeared", path);
  after = listing (dir);
  ck_assert_msg (g_strcmp0 (after, listing_before) == 0,
                 "the folder held '%s' and now holds '%s' (a temporary file left?)",
                 listing_before, after);
}

/* Skips (with a message on stderr, stdout being TAP) when a root run cannot drop its rights. */
#define SKIP_IF_NO_DROP(code)                                                                 \
  do                                                                                          \
    if ((code) == CHILD_NO_DROP)                                                              \
      {                                                                                       \
        g_printerr ("# SKIP: running as root, the test could not become uid %d, so file "     \
                    "permissions cannot be tested here\n", NOBODY);                           \
        return;                                                                               \
      }                                                                                       \
  while (0)

START_TEST (test_save_into_read_only_folder)
{
  const SaveFault fault = { TRUE, 0 };
  g_autofree char *dir = folder_with_old_file ("read-only", "plant.bwproj");
  g_autofree char *old = g_build_filename (dir, "plant.bwproj", NULL);
  g_autofree char *fresh = g_build_filename (dir, "new.bwproj", NULL);
  g_autofree char *before = listing (dir);
  g_autofree char *msg = NULL;
  int code;

  ck_assert_int_eq (g_chmod (dir, 0555), 0);
  /* Over an existing file, and as a new file. */
  code = save_in_child (fx.edited, old, &fault, &msg);
  SKIP_IF_NO_DROP (code);
  assert_failed_cleanly (code, msg, old, g_strerror (EACCES), dir, before, TRUE);
  g_clear_pointer (&msg, g_free);
  ck_assert_int_eq (g_chmod (dir, 0555), 0);
  code = save_in_child (fx.edited, fresh, &fault, &msg);
  assert_failed_cleanly (code, msg, fresh, g_strerror (EACCES), dir, before, FALSE);
  g_clear_pointer (&msg, g_free);

  /* Control: the same child saves once the folder is writable again. */
  ck_assert_int_eq (g_chmod (dir, 0755), 0);
  code = save_in_child (fx.edited, old, &fault, &msg);
  ck_assert_msg (code == CHILD_SAVED, "the control save failed: %s", msg);
  {
    g_autoptr (BwProject) got = bw_project_load (old, NULL);
    ck_assert (got != NULL && bw_project_equal (got, fx.edited));
  }
}
END_TEST

START_TEST (test_save_on_full_disk)
{
  /* RLIMIT_FSIZE stands for a full disk: write () fails part way, as with ENOSPC. The demo is
   * about 9 kB of XML, so a 2 kB limit stops the save in the middle of the file. */
  const SaveFault full = { FALSE, 2048 };
  const SaveFault roomy = { FALSE, 1024 * 1024 };
  g_autofree char *dir = folder_with_old_file ("full", "plant.bwproj");
  g_autofree char *old = g_build_filename (dir, "plant.bwproj", NULL);
  g_autofree char *fresh = g_build_filename (dir, "new.bwproj", NULL);
  g_autofree char *before = listing (dir);
  g_autofree char *msg = NULL;
  int code;

  ck_assert_uint_gt (fx.old_len, 2 * 2048);
  code = save_in_child (fx.edited, old, &full, &msg);
  assert_failed_cleanly (code, msg, old, g_strerror (EFBIG), dir, before, TRUE);
  ck_assert_msg (strstr (msg, "untouched") != NULL, "the error does not say the old file is "
                 "kept: %s", msg);
  g_clear_pointer (&msg, g_free);
  code = save_in_child (fx.edited, fresh, &full, &msg);
  assert_failed_cleanly (code, msg, fresh, g_strerror (EFBIG), dir, before, FALSE);
  g_clear_pointer (&msg, g_free);

  /* Control: with room for the file the same save succeeds. */
  code = save_in_child (fx.edited, old, &roomy, &msg);
  ck_assert_msg (code == CHILD_SAVED, "the control save failed: %s", msg);
}
END_TEST

START_TEST (test_save_permission_denied_folder)
{
  /* The folder of the target denies everything (mode 000). */
  const SaveFault fault = { TRUE, 0 };
  g_autofree char *dir = folder_with_old_file ("denied", "plant.bwproj");
  g_autofree char *old = g_build_filename (dir, "plant.bwproj", NULL);
  g_autofree char *before = listing (dir);
  g_autofree char *msg = NULL;
  int code;

  ck_assert_int_eq (g_chmod (dir, 0), 0);
  code = save_in_child (fx.edited, old, &fault, &msg);
  SKIP_IF_NO_DROP (code);
  assert_failed_cleanly (code, msg, old, g_strerror (EACCES), dir, before, TRUE);
}
END_TEST

START_TEST (test_save_permission_denied_file)
{
  /* The target itself is write-protected (0444, and 000) in a folder the user may write. The
   * atomic save replaces the file by a rename, which the folder's permission alone would allow:
   * the save must still refuse, as the owner protected the file, and leave it as it was. */
  const SaveFault fault = { TRUE, 0 };
  const int modes[] = { 0444, 0 };

  for (guint i = 0; i < G_N_ELEMENTS (modes); i++)
    {
      g_autofree char *sub = g_strdup_printf ("protected-%o", modes[i]);
      g_autofree char *dir = folder_with_old_file (sub, "plant.bwproj");
      g_autofree char *old = g_build_filename (dir, "plant.bwproj", NULL);
      g_autofree char *before = listing (dir);
      g_autofree char *msg = NULL;
      GStatBuf st;
      int code;

      ck_assert_int_eq (g_chmod (old, modes[i]), 0);
      code = save_in_child (fx.edited, old, &fault, &msg);
      SKIP_IF_NO_DROP (code);
      if (modes[i] == 0)
        ck_assert_int_eq (g_chmod (old, 0444), 0); /* let the parent compare the bytes */
      assert_failed_cleanly (code, msg, old, g_strerror (EACCES), dir, before, TRUE);
      ck_assert_int_eq (g_stat (old, &st), 0);
      ck_assert_int_eq (st.st_mode & 0777, modes[i] == 0 ? 0444 : modes[i]);
    }
}
END_TEST

START_TEST (test_save_error_message_direct)
{
  /* In this process (no fork): a folder that does not exist gives a BW_IO_ERROR_WRITE error
   * naming the file and the reason, and the project is unchanged. */
  g_autofree char *path = g_build_filename (fx.root, "no-such-folder", "plant.bwproj", NULL);
  g_autoptr (BwProject) before = bw_project_copy (fx.edited);
  g_autoptr (GError) error = NULL;

  ck_assert (!bw_project_save (fx.edited, path, &error));
  ck_assert_msg (g_error_matches (error, BW_IO_ERROR, BW_IO_ERROR_WRITE), "%s", error->message);
  ck_assert_msg (strstr (error->message, path) != NULL, "%s", error->message);
  ck_assert_msg (strstr (error->message, g_strerror (ENOENT)) != NULL, "%s", error->message);
  ck_assert (bw_project_equal (before, fx.edited));
  ck_assert (!g_file_test (path, G_FILE_TEST_EXISTS));
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("save-errors");
  TCase *tc = tcase_create ("faults");

  tcase_add_checked_fixture (tc, setup, teardown);
  tcase_set_timeout (tc, 60);
  tcase_add_test (tc, test_save_into_read_only_folder);
  tcase_add_test (tc, test_save_on_full_disk);
  tcase_add_test (tc, test_save_permission_denied_folder);
  tcase_add_test (tc, test_save_permission_denied_file);
  tcase_add_test (tc, test_save_error_message_direct);
  suite_add_tcase (s, tc);
  return s;
}
