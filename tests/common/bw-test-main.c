/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-test-main.c: runs one Check suite and reports in TAP on stdout. */
#include "config.h"

#include <stdlib.h>

#include "bw-test.h"

int
main (void)
{
  SRunner *sr = srunner_create (bw_test_suite ());
  int failed;

  srunner_set_tap (sr, "-");
  srunner_run_all (sr, CK_SILENT);
  failed = srunner_ntests_failed (sr);
  srunner_free (sr);
  return failed == 0 ? EXIT_SUCCESS : EXIT_FAILURE;
}
