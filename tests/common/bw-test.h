/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-test.h: shared helpers for the Check suites. */
#pragma once

#include <check.h>
#include <glib.h>
#include <math.h>

/* Every test file defines this; bw-test-main.c runs it. */
Suite *bw_test_suite (void);

/* Relative tolerance comparison: |got - want| <= rel * |want|. Reports both values on failure. */
#define bw_assert_rel(got, want, rel)                                                    \
  do                                                                                     \
    {                                                                                    \
      double _g = (got), _w = (want), _r = (rel);                                        \
      ck_assert_msg (isfinite (_g) && fabs (_g - _w) <= _r * fabs (_w),                  \
                     "%s = %.10g, expected %.10g within %.3g relative (off by %.3g)",    \
                     #got, _g, _w, _r, _w != 0 ? fabs (_g - _w) / fabs (_w) : fabs (_g)); \
    }                                                                                    \
  while (0)

/* Asserts that ERR is set, in DOMAIN with CODE, and that its message contains NEEDLE. */
#define bw_assert_error(err, domain, ecode, needle)                                       \
  do                                                                                     \
    {                                                                                    \
      ck_assert_msg ((err) != NULL, "expected an error, got none");                      \
      ck_assert_msg (g_error_matches ((err), (domain), (ecode)),                          \
                     "wrong error code %d: %s", (err)->code, (err)->message);            \
      ck_assert_msg (strstr ((err)->message, (needle)) != NULL,                          \
                     "error message '%s' lacks '%s'", (err)->message, (needle));         \
    }                                                                                    \
  while (0)
