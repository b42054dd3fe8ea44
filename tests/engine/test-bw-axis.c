/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-axis.c: nice ticks on linear and log axes, world <-> page mapping, tick labels.
 *
 * Every golden number here was derived by hand from the rules at the top of bw-axis.c (the
 * working is in the comment above each case): "derived". The property tests check, over many
 * pseudo-random ranges, what must hold whatever the rules pick. */
#include "config.h"

#include <string.h>

#include "bw-test.h"
#include "engine/bw-axis.h"
#include "engine/bw-error.h"

/* Tick values are built from integers (i x m / 10^k), so they match their decimal spelling to
 * the last bit or two; 1e-12 relative leaves room for that and nothing more. */
#define TICK_REL 1e-12

static void
assert_ticks (const double *got, guint n_got, const double *want, guint n_want)
{
  guint i;

  ck_assert_uint_eq (n_got, n_want);
  for (i = 0; i < n_want; i++)
    {
      if (want[i] == 0)
        ck_assert_double_eq (got[i], 0.0);
      else
        bw_assert_rel (got[i], want[i], TICK_REL);
    }
}

static void
assert_label (const BwAxis *a, double v, const char *want)
{
  g_autofree char *got = bw_axis_format_tick (a, v);
  ck_assert_str_eq (got, want);
}

/* --- the 1-2-5 step --- */

/* Derived: the smallest m x 10^k in {1, 2, 5} at or above the raw step. */
START_TEST (test_axis_nice_step)
{
  int k = 99;

  ck_assert_double_eq_tol (bw_axis_nice_step (0.07, &k), 0.1, 1e-15);
  ck_assert_int_eq (k, -1);
  ck_assert_double_eq (bw_axis_nice_step (1.0, &k), 1.0);
  ck_assert_int_eq (k, 0);
  ck_assert_double_eq (bw_axis_nice_step (1.0000001, NULL), 2.0);
  ck_assert_double_eq (bw_axis_nice_step (3.0, NULL), 5.0);
  ck_assert_double_eq (bw_axis_nice_step (7.0, &k), 10.0);
  ck_assert_int_eq (k, 1);
  ck_assert_double_eq (bw_axis_nice_step (2.0, NULL), 2.0);
  ck_assert_double_eq_tol (bw_axis_nice_step (0.00021, &k), 0.0005, 1e-18);
  ck_assert_int_eq (k, -4);
  bw_assert_rel (bw_axis_nice_step (3.3e11, &k), 5e11, TICK_REL);
  ck_assert_int_eq (k, 11);
}
END_TEST

/* --- linear axes: golden cases --- */

/*
 * 0 .. 0.35, target 6: raw step 0.35 / 5 = 0.07, nice 0.1. Candidates: 0.05 gives 8 ticks (off
 * by 2), 0.1 gives 5 (off by 1), 0.2 gives 3, 0.5 gives 2: 0.1 wins. Range 0 .. 0.4; labels with
 * one decimal (the step's), no factor.
 */
START_TEST (test_axis_linear_zero_based)
{
  BwAxis a;
  GError *error = NULL;
  const double want[] = { 0, 0.1, 0.2, 0.3, 0.4 };

  ck_assert (bw_axis_linear (0.0, 0.35, 6, FALSE, &a, &error));
  ck_assert_ptr_null (error);
  assert_ticks (a.major, a.n_major, want, G_N_ELEMENTS (want));
  ck_assert_double_eq (a.lo, 0.0);
  bw_assert_rel (a.hi, 0.4, TICK_REL);
  bw_assert_rel (a.step, 0.1, TICK_REL);
  ck_assert_int_eq (a.decimals, 1);
  ck_assert_int_eq (a.label_exponent, 0);
  assert_label (&a, 0.0, "0.0");
  assert_label (&a, a.major[3], "0.3");
  ck_assert_ptr_null (bw_axis_format_factor (&a));
  /* Minor ticks: fifths of a 1 x 10^k step, 4 between each pair of majors. */
  ck_assert_uint_eq (a.n_minor, 16);
  bw_assert_rel (a.minor[0], 0.02, TICK_REL);
  bw_assert_rel (a.minor[4], 0.12, TICK_REL);
}
END_TEST

/*
 * 13 .. 87, target 5: raw 74 / 4 = 18.5, nice 20. 10 would give 9 ticks (over target + 2 = 7,
 * refused); 20 gives 0..100, 6 ticks (off by 1); 50 gives 3; 100 gives 2. 20 wins.
 */
START_TEST (test_axis_linear_offset_range)
{
  BwAxis a;
  const double want[] = { 0, 20, 40, 60, 80, 100 };

  ck_assert (bw_axis_linear (13, 87, 5, FALSE, &a, NULL));
  assert_ticks (a.major, a.n_major, want, G_N_ELEMENTS (want));
  ck_assert_int_eq (a.decimals, 0);
  assert_label (&a, 60, "60");
  /* Quarters of a 2 x 10^k step: 3 minors between majors. */
  ck_assert_uint_eq (a.n_minor, 15);
  ck_assert_double_eq (a.minor[0], 5.0);
}
END_TEST

/*
 * 3 .. 7, target 5. Without zero: raw 1, nice 1: 3, 4, 5, 6, 7 (0.5 would give 9). With zero:
 * 0 .. 7, raw 1.75, nice 2: 0 .. 8 in 5 ticks (1 would give 8, over 7).
 */
START_TEST (test_axis_linear_include_zero)
{
  BwAxis a;
  const double plain[] = { 3, 4, 5, 6, 7 };
  const double zero[] = { 0, 2, 4, 6, 8 };

  ck_assert (bw_axis_linear (3, 7, 5, FALSE, &a, NULL));
  assert_ticks (a.major, a.n_major, plain, G_N_ELEMENTS (plain));
  ck_assert (bw_axis_linear (7, 3, 5, TRUE, &a, NULL)); /* either order */
  assert_ticks (a.major, a.n_major, zero, G_N_ELEMENTS (zero));
  /* Below zero, zero is reached from the other side. */
  ck_assert (bw_axis_linear (-7, -3, 5, TRUE, &a, NULL));
  ck_assert_double_eq (a.hi, 0.0);
  ck_assert_double_eq (a.lo, -8.0);
}
END_TEST

/*
 * -4.2 .. 1.3, target 6: raw 1.1, nice 2. 1 gives -5..2, 8 ticks (off 2); 2 gives -6..2, 5
 * ticks (off 1); 5 gives 3. Labels carry a real minus sign; zero has none.
 */
START_TEST (test_axis_linear_negative)
{
  BwAxis a;
  const double want[] = { -6, -4, -2, 0, 2 };

  ck_assert (bw_axis_linear (-4.2, 1.3, 6, FALSE, &a, NULL));
  assert_ticks (a.major, a.n_major, want, G_N_ELEMENTS (want));
  assert_label (&a, -6, "−6");
  assert_label (&a, 0, "0");
  assert_label (&a, -1e-17, "0"); /* no "-0" */
  ck_assert (!signbit (a.major[3]));
}
END_TEST

/*
 * Tiny: 0 .. 4.6e-6, target 5: raw 1.15e-6, nice 2e-6. 1e-6 gives 6 ticks (off 1), 2e-6 gives
 * 0..6e-6, 4 ticks (off 1): the tie goes to the larger step. Labels: largest magnitude 6e-6, so
 * the factor is 10^-6 and the labels are 0, 2, 4, 6 with no decimals.
 * Huge: 1.2e9 .. 3.1e9, target 5: raw 4.75e8, nice 5e8 gives 1e9..3.5e9, 6 ticks (off 1); 1e9
 * gives 1e9..4e9, 4 ticks (off 1): tie, 1e9 wins. Factor 10^9, labels 1 .. 4.
 */
START_TEST (test_axis_linear_magnitudes)
{
  BwAxis a;
  const double tiny[] = { 0, 2e-6, 4e-6, 6e-6 };
  const double huge[] = { 1e9, 2e9, 3e9, 4e9 };
  g_autofree char *f1 = NULL, *f2 = NULL;

  ck_assert (bw_axis_linear (0, 4.6e-6, 5, FALSE, &a, NULL));
  assert_ticks (a.major, a.n_major, tiny, G_N_ELEMENTS (tiny));
  ck_assert_int_eq (a.label_exponent, -6);
  ck_assert_int_eq (a.decimals, 0);
  assert_label (&a, 4e-6, "4");
  f1 = bw_axis_format_factor (&a);
  ck_assert_str_eq (f1, "×10⁻⁶");

  ck_assert (bw_axis_linear (1.2e9, 3.1e9, 5, FALSE, &a, NULL));
  assert_ticks (a.major, a.n_major, huge, G_N_ELEMENTS (huge));
  ck_assert_int_eq (a.label_exponent, 9);
  assert_label (&a, 3e9, "3");
  f2 = bw_axis_format_factor (&a);
  ck_assert_str_eq (f2, "×10⁹");

  /* A 5e8 step under a 10^9 factor needs one decimal: 0.0, 0.5, ... (0 .. 2.2e9, target 6:
   * raw 4.4e8, nice 5e8 gives 6 ticks, exactly the target). */
  ck_assert (bw_axis_linear (0, 2.2e9, 6, FALSE, &a, NULL));
  bw_assert_rel (a.step, 5e8, TICK_REL);
  ck_assert_int_eq (a.decimals, 1);
  assert_label (&a, 1.5e9, "1.5");
  assert_label (&a, 0, "0.0");
}
END_TEST

/*
 * Degenerate ranges. 5 .. 5 opens to 4.5 .. 5.5 (+-10 %): raw 0.25, nice 0.5 gives 3 ticks (off
 * 2), 0.2 gives 7 (off 2): the tie takes the larger step: 4.5, 5, 5.5. 0 .. 0 opens to -1 .. 1:
 * raw 0.5, nice 0.5, 5 ticks, the target.
 */
START_TEST (test_axis_linear_degenerate)
{
  BwAxis a;
  const double five[] = { 4.5, 5.0, 5.5 };
  const double zero[] = { -1, -0.5, 0, 0.5, 1 };

  ck_assert (bw_axis_linear (5, 5, 5, FALSE, &a, NULL));
  assert_ticks (a.major, a.n_major, five, G_N_ELEMENTS (five));
  assert_label (&a, 5.0, "5.0");
  ck_assert (bw_axis_linear (0, 0, 5, FALSE, &a, NULL));
  assert_ticks (a.major, a.n_major, zero, G_N_ELEMENTS (zero));
  ck_assert (bw_axis_linear (-3e-9, -3e-9, 4, FALSE, &a, NULL));
  ck_assert (a.lo <= -3.3e-9 && a.hi >= -2.7e-9 && a.n_major >= 2);
}
END_TEST

START_TEST (test_axis_linear_errors)
{
  BwAxis a;
  GError *error = NULL;

  ck_assert (!bw_axis_linear (NAN, 1, 5, FALSE, &a, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE, "axis minimum");
  g_clear_error (&error);
  ck_assert (!bw_axis_linear (0, INFINITY, 5, FALSE, &a, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE, "axis maximum");
  g_clear_error (&error);
  ck_assert (!bw_axis_linear (0, 1, 1, FALSE, &a, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "target ticks");
  g_clear_error (&error);
  ck_assert (!bw_axis_linear (-1.7e308, 1.7e308, 5, FALSE, &a, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "axis range");
  g_clear_error (&error);
}
END_TEST

/* 0 .. 1 fixed, target 6: raw 0.2, nice 0.2, 6 ticks inside (0.1 would give 11). */
START_TEST (test_axis_fixed_linear)
{
  BwAxis a;
  const double want[] = { 0, 0.2, 0.4, 0.6, 0.8, 1.0 };
  const double inner[] = { 0.5, 1.0, 1.5 };

  ck_assert (bw_axis_fixed (BW_AXIS_LINEAR, 0, 1, 6, BW_LOG_MINOR_NONE, &a, NULL));
  assert_ticks (a.major, a.n_major, want, G_N_ELEMENTS (want));
  ck_assert_double_eq (a.hi, 1.0);
  /* 0.3 .. 1.7, target 4: raw 0.467, nice 0.5: 0.5, 1, 1.5 inside; the range stays as given. */
  ck_assert (bw_axis_fixed (BW_AXIS_LINEAR, 0.3, 1.7, 4, BW_LOG_MINOR_NONE, &a, NULL));
  assert_ticks (a.major, a.n_major, inner, G_N_ELEMENTS (inner));
  ck_assert_double_eq (a.lo, 0.3);
  ck_assert_double_eq (a.hi, 1.7);
}
END_TEST

/* --- log axes --- */

/*
 * 1e-7 .. 1e3 is 10 decades. Target 6: one major per decade would be 11 (> 8); every 2nd decade
 * from 1e-7 gives 6: 1e-7, 1e-5, 1e-3, 0.1, 10, 1000; the 5 skipped decades are the minors.
 * Target 12: every decade (11 majors), minors at 2 and 5 in each of the 10 decades: 20.
 */
START_TEST (test_axis_log_wide)
{
  BwAxis a;
  const double major2[] = { 1e-7, 1e-5, 1e-3, 1e-1, 1e1, 1e3 };
  const double minor2[] = { 1e-6, 1e-4, 1e-2, 1e0, 1e2 };

  ck_assert (bw_axis_log (1e-7, 1e3, 6, BW_LOG_MINOR_2_5, &a, NULL));
  assert_ticks (a.major, a.n_major, major2, G_N_ELEMENTS (major2));
  assert_ticks (a.minor, a.n_minor, minor2, G_N_ELEMENTS (minor2));
  ck_assert_double_eq (a.step, 2.0);
  bw_assert_rel (a.lo, 1e-7, TICK_REL);
  bw_assert_rel (a.hi, 1e3, TICK_REL);

  ck_assert (bw_axis_log (1e-7, 1e3, 12, BW_LOG_MINOR_2_5, &a, NULL));
  ck_assert_uint_eq (a.n_major, 11);
  ck_assert_uint_eq (a.n_minor, 20);
  bw_assert_rel (a.minor[0], 2e-7, TICK_REL);
  bw_assert_rel (a.minor[1], 5e-7, TICK_REL);
  bw_assert_rel (a.minor[19], 500, TICK_REL);
}
END_TEST

/*
 * 3e-5 .. 0.04 widens to 1e-5 .. 0.1 (4 decades, 5 majors, within target 6 + 2). Minors: 2 and 5
 * per decade (8), or 2..9 per decade (32).
 */
START_TEST (test_axis_log_minor)
{
  BwAxis a;
  const double major[] = { 1e-5, 1e-4, 1e-3, 1e-2, 1e-1 };
  const double minor[] = { 2e-5, 5e-5, 2e-4, 5e-4, 2e-3, 5e-3, 2e-2, 5e-2 };

  ck_assert (bw_axis_log (0.04, 3e-5, 6, BW_LOG_MINOR_2_5, &a, NULL));
  assert_ticks (a.major, a.n_major, major, G_N_ELEMENTS (major));
  assert_ticks (a.minor, a.n_minor, minor, G_N_ELEMENTS (minor));
  ck_assert (bw_axis_log (3e-5, 0.04, 6, BW_LOG_MINOR_ALL, &a, NULL));
  ck_assert_uint_eq (a.n_minor, 32);
  bw_assert_rel (a.minor[7], 9e-5, TICK_REL);
  ck_assert (bw_axis_log (3e-5, 0.04, 6, BW_LOG_MINOR_NONE, &a, NULL));
  ck_assert_uint_eq (a.n_minor, 0);
  /* Degenerate: one value opens to its decade. */
  ck_assert (bw_axis_log (0.3, 0.3, 6, BW_LOG_MINOR_NONE, &a, NULL));
  bw_assert_rel (a.lo, 0.1, TICK_REL);
  bw_assert_rel (a.hi, 1.0, TICK_REL);
}
END_TEST

/* A fixed 0.5 .. 300 log axis: majors 1, 10, 100 inside; minors at 2 and 5 from 0.5 to 200. */
START_TEST (test_axis_log_fixed)
{
  BwAxis a;
  const double major[] = { 1, 10, 100 };
  const double minor[] = { 0.5, 2, 5, 20, 50, 200 };

  ck_assert (bw_axis_fixed (BW_AXIS_LOG, 0.5, 300, 6, BW_LOG_MINOR_2_5, &a, NULL));
  assert_ticks (a.major, a.n_major, major, G_N_ELEMENTS (major));
  assert_ticks (a.minor, a.n_minor, minor, G_N_ELEMENTS (minor));
}
END_TEST

START_TEST (test_axis_log_errors)
{
  BwAxis a;
  GError *error = NULL;

  ck_assert (!bw_axis_log (0, 1, 5, BW_LOG_MINOR_NONE, &a, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "above zero");
  g_clear_error (&error);
  ck_assert (!bw_axis_log (1e-100, 1e100, 5, BW_LOG_MINOR_NONE, &a, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "decades");
  g_clear_error (&error);
  ck_assert (!bw_axis_fixed (BW_AXIS_LOG, 2, 1, 5, BW_LOG_MINOR_NONE, &a, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "below maximum");
  g_clear_error (&error);
}
END_TEST

/* Derived: an axis whose majors all lie in 0.001 .. 10000 reads in plain digits; one that reaches
 * beyond writes every label as a power of ten, so no axis mixes the two. */
START_TEST (test_axis_log_labels)
{
  BwAxis a;
  g_autofree char *p0 = bw_format_power_of_ten (0);
  g_autofree char *p12 = bw_format_power_of_ten (-12);

  ck_assert (bw_axis_log (1e-7, 1e5, 12, BW_LOG_MINOR_2_5, &a, NULL));
  ck_assert (a.log_powers);
  assert_label (&a, 1e-7, "10⁻⁷");
  assert_label (&a, 1e-3, "10⁻³");
  assert_label (&a, 1.0, "10⁰");
  assert_label (&a, 1e5, "10⁵");
  assert_label (&a, 2e-7, "2×10⁻⁷");
  assert_label (&a, 0.02, "2×10⁻²");

  ck_assert (bw_axis_log (1e-3, 10, 8, BW_LOG_MINOR_2_5, &a, NULL));
  ck_assert (!a.log_powers);
  assert_label (&a, 1e-3, "0.001");
  assert_label (&a, 0.02, "0.02");
  assert_label (&a, 1.0, "1");
  assert_label (&a, 5.0, "5");
  assert_label (&a, 10.0, "10");
  ck_assert (bw_axis_log (1, 1e4, 8, BW_LOG_MINOR_NONE, &a, NULL));
  assert_label (&a, 1e4, "10000");
  ck_assert_str_eq (p0, "10⁰");
  ck_assert_str_eq (p12, "10⁻¹²");
}
END_TEST

/* --- mapping --- */

/* Derived: 0.1 on 0 .. 0.4 is a quarter of the way; 1e-2 on 1e-7 .. 1e3 is half the decades. */
START_TEST (test_axis_mapping_golden)
{
  BwAxis a;

  ck_assert (bw_axis_linear (0, 0.35, 6, FALSE, &a, NULL));
  ck_assert_double_eq_tol (bw_axis_to_page (&a, 0.1, 50, 450), 150, 1e-9);
  /* A y axis running up a page whose y runs down. */
  ck_assert_double_eq_tol (bw_axis_to_page (&a, 0.1, 300, 20), 230, 1e-9);
  ck_assert_double_eq_tol (bw_axis_from_page (&a, 230, 300, 20), 0.1, 1e-12);
  /* Outside the range it extrapolates. */
  ck_assert_double_eq_tol (bw_axis_to_page (&a, -0.1, 50, 450), -50, 1e-9);

  ck_assert (bw_axis_log (1e-7, 1e3, 6, BW_LOG_MINOR_NONE, &a, NULL));
  ck_assert_double_eq_tol (bw_axis_to_page (&a, 1e-2, 0, 1000), 500, 1e-9);
  ck_assert_double_eq_tol (bw_axis_to_page (&a, 1e-6, 0, 1000), 100, 1e-9);
  bw_assert_rel (bw_axis_from_page (&a, 100, 0, 1000), 1e-6, 1e-12);
  /* Non-positive values stay finite and far outside the page. */
  ck_assert (isfinite (bw_axis_to_page (&a, 0.0, 0, 1000)));
  ck_assert (bw_axis_to_page (&a, -1.0, 0, 1000) < -1e5);
  ck_assert (isfinite (bw_axis_from_page (&a, 1e12, 0, 1000)));
  ck_assert (bw_axis_contains (&a, 1e-7));
  ck_assert (bw_axis_contains (&a, 1e3));
  ck_assert (!bw_axis_contains (&a, 2e3));
  ck_assert (!bw_axis_contains (&a, 0.0));
  ck_assert (!bw_axis_contains (&a, NAN));
}
END_TEST

/* --- properties over many ranges --- */

static void
check_properties (const BwAxis *a, double lo, double hi, guint target, gboolean linear)
{
  guint i;

  /* Ticks cover the data. */
  ck_assert_msg (a->lo <= lo && a->hi >= hi, "axis %g..%g does not cover %g..%g", a->lo, a->hi,
                 lo, hi);
  ck_assert (a->lo < a->hi);
  ck_assert_uint_ge (a->n_major, 2);
  if (linear)
    {
      ck_assert_msg (a->n_major <= target + 2, "%u ticks for target %u over %g..%g", a->n_major,
                     target, lo, hi);
      /* The first and last tick are the range's ends. */
      ck_assert_double_eq (a->major[0], a->lo);
      ck_assert_double_eq (a->major[a->n_major - 1], a->hi);
    }
  else
    ck_assert_msg (a->n_major <= target + 2, "%u log ticks for target %u", a->n_major, target);
  for (i = 1; i < a->n_major; i++)
    ck_assert_msg (a->major[i] > a->major[i - 1], "ticks not increasing at %u", i);
  for (i = 1; i < a->n_minor; i++)
    ck_assert (a->minor[i] > a->minor[i - 1]);
  for (i = 0; i < a->n_minor; i++)
    {
      guint j;
      ck_assert (bw_axis_contains (a, a->minor[i]));
      for (j = 0; j < a->n_major; j++)
        ck_assert_msg (fabs (a->minor[i] - a->major[j]) > 1e-9 * fabs (a->major[j]),
                       "minor %g on a major", a->minor[i]);
    }
  /* Mapping inverts. */
  for (i = 0; i < a->n_major; i++)
    {
      double p = bw_axis_to_page (a, a->major[i], 480.5, 12.25);
      double back = bw_axis_from_page (a, p, 480.5, 12.25);
      ck_assert (p <= 480.5 + 1e-6 && p >= 12.25 - 1e-6);
      if (a->major[i] == 0)
        ck_assert_double_eq_tol (back, 0, 1e-9 * (a->hi - a->lo));
      else
        bw_assert_rel (back, a->major[i], 1e-9);
    }
  /* Labels: same decimals throughout (a linear axis). */
  if (linear && a->n_major >= 2)
    {
      g_autofree char *l0 = bw_axis_format_tick (a, a->major[0]);
      g_autofree char *l1 = bw_axis_format_tick (a, a->major[a->n_major - 1]);
      const char *d0 = strchr (l0, '.'), *d1 = strchr (l1, '.');
      ck_assert ((d0 == NULL) == (d1 == NULL));
      if (d0)
        ck_assert_uint_eq (strlen (d0), strlen (d1));
      ck_assert_uint_le (strlen (l1), 16); /* a factor is taken out, never 20 digits */
    }
}

START_TEST (test_axis_linear_properties)
{
  g_autoptr (GRand) rand = g_rand_new_with_seed (20261202);
  int n;

  for (n = 0; n < 1000; n++)
    {
      BwAxis a;
      double mag = pow (10.0, g_rand_double_range (rand, -12, 12));
      double x = g_rand_double_range (rand, -1, 1) * mag;
      double y = x + g_rand_double_range (rand, 0, 2) * mag * (n % 7 == 0 ? 1e-3 : 1);
      guint target = (guint) g_rand_int_range (rand, 2, BW_AXIS_MAX_TARGET + 1);
      gboolean zero = n % 3 == 0;
      double lo, hi;

      if (n % 50 == 0)
        y = x; /* degenerate */
      lo = MIN (x, y);
      hi = MAX (x, y);
      ck_assert (bw_axis_linear (x, y, target, zero, &a, NULL));
      if (zero)
        {
          lo = MIN (lo, 0);
          hi = MAX (hi, 0);
        }
      check_properties (&a, lo, hi, target, TRUE);
    }
}
END_TEST

START_TEST (test_axis_log_properties)
{
  g_autoptr (GRand) rand = g_rand_new_with_seed (7);
  int n;

  for (n = 0; n < 800; n++)
    {
      BwAxis a;
      double x = pow (10.0, g_rand_double_range (rand, -15, 15));
      double y = x * pow (10.0, g_rand_double_range (rand, 0, 14));
      guint target = (guint) g_rand_int_range (rand, 2, BW_AXIS_MAX_TARGET + 1);
      BwLogMinor minor = (BwLogMinor) (n % 3);

      ck_assert (bw_axis_log (x, y, target, minor, &a, NULL));
      check_properties (&a, x, y, target, FALSE);
    }
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("axis");
  TCase *tc;

  tc = tcase_create ("linear");
  tcase_add_test (tc, test_axis_nice_step);
  tcase_add_test (tc, test_axis_linear_zero_based);
  tcase_add_test (tc, test_axis_linear_offset_range);
  tcase_add_test (tc, test_axis_linear_include_zero);
  tcase_add_test (tc, test_axis_linear_negative);
  tcase_add_test (tc, test_axis_linear_magnitudes);
  tcase_add_test (tc, test_axis_linear_degenerate);
  tcase_add_test (tc, test_axis_linear_errors);
  tcase_add_test (tc, test_axis_fixed_linear);
  suite_add_tcase (s, tc);

  tc = tcase_create ("log");
  tcase_add_test (tc, test_axis_log_wide);
  tcase_add_test (tc, test_axis_log_minor);
  tcase_add_test (tc, test_axis_log_fixed);
  tcase_add_test (tc, test_axis_log_errors);
  tcase_add_test (tc, test_axis_log_labels);
  suite_add_tcase (s, tc);

  tc = tcase_create ("mapping");
  tcase_add_test (tc, test_axis_mapping_golden);
  suite_add_tcase (s, tc);

  tc = tcase_create ("properties");
  tcase_add_test (tc, test_axis_linear_properties);
  tcase_add_test (tc, test_axis_log_properties);
  suite_add_tcase (s, tc);
  return s;
}
