/* SPDX-License-Identifier: GPL-3.0-or-later */
/* fuzz-project.c: libFuzzer harness for the project loader (and, when a file loads, the whole
 * evaluation and a save-to-text round trip). See tests/fuzz/README. */
#include "config.h"

#include <stdint.h>
#include <string.h>

#include "engine/bw-evaluate.h"
#include "io/bw-project-xml.h"

int LLVMFuzzerTestOneInput (const uint8_t *data, size_t size);

int
LLVMFuzzerTestOneInput (const uint8_t *data, size_t size)
{
  GError *error = NULL;
  BwProject *p = bw_project_load_memory ((const char *) data, size, "fuzz.bwproj", &error);

  if (p == NULL)
    {
      /* Every refusal must say why. */
      if (error == NULL || error->message == NULL || error->message[0] == '\0')
        __builtin_trap ();
      g_error_free (error);
      return 0;
    }
  {
    BwResults *r = bw_project_evaluate (p, NULL);
    char *xml = bw_project_to_xml (p);
    BwProject *q = bw_project_load_memory (xml, strlen (xml), "again.bwproj", NULL);
    /* What loads must save and load back to the same model. */
    if (q == NULL || !bw_project_equal (p, q))
      __builtin_trap ();
    bw_project_free (q);
    g_free (xml);
    bw_results_free (r);
  }
  bw_project_free (p);
  return 0;
}
