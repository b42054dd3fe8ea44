/* SPDX-License-Identifier: GPL-3.0-or-later */
/* fuzz-csv.c: libFuzzer harness for the CSV readers (jar-test sheets and stated values). */
#include "config.h"

#include <stdint.h>

#include "io/bw-csv.h"
#include "io/bw-jartest-csv.h"

int LLVMFuzzerTestOneInput (const uint8_t *data, size_t size);

int
LLVMFuzzerTestOneInput (const uint8_t *data, size_t size)
{
  BwJarSeries s;
  GError *error = NULL;
  GPtrArray *stated;

  if (bw_jartest_read_csv ((const char *) data, size, "fuzz.csv", &s, &error))
    {
      BwJarResult r;
      if (!bw_jar_analyse (&s, 1.0, 0.01, &r, NULL))
        __builtin_trap (); /* a prepared series always analyses */
    }
  else
    {
      if (error == NULL || error->message[0] == '\0')
        __builtin_trap ();
      g_clear_error (&error);
    }
  stated = bw_stated_read_csv ((const char *) data, size, "fuzz.csv", &error);
  if (stated == NULL)
    {
      if (error == NULL || error->message[0] == '\0')
        __builtin_trap ();
      g_clear_error (&error);
    }
  else
    g_ptr_array_unref (stated);
  return 0;
}
