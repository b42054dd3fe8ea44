/* SPDX-License-Identifier: GPL-3.0-or-later */
/* fuzz-criteria.c: libFuzzer harness for the criteria-set loader. See tests/fuzz/README. */
#include "config.h"

#include <glib/gstdio.h>
#include <stdint.h>
#include <unistd.h>

#include "io/bw-criteria-xml.h"

int LLVMFuzzerTestOneInput (const uint8_t *data, size_t size);

int
LLVMFuzzerTestOneInput (const uint8_t *data, size_t size)
{
  static char *path;
  GError *error = NULL;
  BwCriteriaSet *set;

  /* The loader reads files: one scratch file per process. */
  if (path == NULL)
    path = g_strdup_printf ("%s/bw-fuzz-criteria-%d.xml", g_get_tmp_dir (), (int) getpid ());
  if (!g_file_set_contents (path, (const char *) data, (gssize) size, NULL))
    return 0;
  set = bw_criteria_set_load (path, &error);
  if (set == NULL)
    {
      if (error == NULL || error->message[0] == '\0')
        __builtin_trap ();
      g_error_free (error);
    }
  bw_criteria_set_free (set);
  return 0;
}
