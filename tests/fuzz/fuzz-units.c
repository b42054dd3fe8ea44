/* SPDX-License-Identifier: GPL-3.0-or-later */
/* fuzz-units.c: libFuzzer harness for the unit parser: every kind, and what parses must be
 * finite and format back into text that parses. See tests/fuzz/README. */
#include "config.h"

#include <math.h>
#include <stdint.h>
#include <string.h>

#include "engine/bw-units.h"

int LLVMFuzzerTestOneInput (const uint8_t *data, size_t size);

int
LLVMFuzzerTestOneInput (const uint8_t *data, size_t size)
{
  char *text = g_strndup ((const char *) data, size);

  for (int k = 0; k < BW_N_KINDS; k++)
    {
      GError *error = NULL;
      double v;
      if (bw_units_parse (text, (BwQuantityKind) k, NULL, "x", &v, &error))
        {
          char *shown;
          double back;
          if (!isfinite (v))
            __builtin_trap ();
          shown = bw_units_format (v, (BwQuantityKind) k, BW_UNIT_SYSTEM_US);
          if (!bw_units_parse (shown, (BwQuantityKind) k, NULL, "x", &back, NULL) || !isfinite (back))
            __builtin_trap ();
          g_free (shown);
        }
      else
        {
          if (error == NULL || strncmp (error->message, "x:", 2) != 0)
            __builtin_trap (); /* every error names the field */
          g_error_free (error);
        }
    }
  g_free (text);
  return 0;
}
