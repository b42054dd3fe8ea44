/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-flocmodel.c: the Argaman-Kaufman aggregation-breakup model. */
#include "config.h"

#include <string.h>

#include "bw-test.h"
#include "engine/bw-error.h"
#include "engine/bw-flocmodel.h"

/* The papers' closed form for m equal compartments, written out literally (docs/references.md, from
 * memory: Argaman & Kaufman 1970; Argaman 1971), independent of the engine's rearranged form:
 *   n0/nm = (1 + KA G T/m)^m / [1 + KB G^2 (T/m) sum_{i=0}^{m-1} (1 + KA G T/m)^i] */
static double
literal_closed_form (double ka, double kb, double g, double t, guint m)
{
  const double base = 1.0 + ka * g * t / m;
  double sum = 0.0;

  for (guint i = 0; i < m; i++)
    sum += pow (base, (double) i);
  return pow (base, (double) m) / (1.0 + kb * g * g * (t / m) * sum);
}

/* The compartment recursion, literally: n_i = (n_{i-1} + KB n0 G^2 t) / (1 + KA G t). */
static double
literal_recursion (double ka, double kb, guint m, const double *g, const double *t)
{
  const double n0 = 1.0;
  double n = n0;

  for (guint i = 0; i < m; i++)
    n = (n + kb * n0 * g[i] * g[i] * t[i]) / (1.0 + ka * g[i] * t[i]);
  return n / n0;
}

static BwFlocKinetics
defaults (void)
{
  BwFlocKinetics k;

  bw_floc_kinetics_init (&k);
  return k;
}

START_TEST (test_flocmodel_reference_value)
{
  /* docs/references.md (derived): T = 1200 s, KA 4.5e-5, KB 1e-7 s, G = 50 1/s, m = 3 ->
   * n0/n = 4.1545, remaining 0.2407. Our own hand evaluation gives 4.154452 (x = 0.9,
   * 1.9^3 = 6.859, denominator 1 + 0.1 x 6.51 = 1.651). */
  BwFlocKinetics k = defaults ();
  BwFlocModelResult r;
  g_autoptr (GError) error = NULL;

  ck_assert_double_eq (k.aggregation_constant, 4.5e-5);
  ck_assert_double_eq (k.breakup_constant_s, 1.0e-7);
  ck_assert (bw_flocmodel_equal (&k, 50.0, 1200.0, 3, &r, &error));
  ck_assert_double_eq_tol (r.n0_over_nm, 4.1545, 0.00005);
  bw_assert_rel (r.n0_over_nm, 6.859 / 1.651, 1e-12);
  ck_assert_double_eq_tol (r.remaining_fraction, 0.2407, 0.00005);
  bw_assert_rel (r.remaining_fraction * r.n0_over_nm, 1.0, 1e-15);
  ck_assert_uint_eq (r.n_compartments, 3);
  bw_assert_rel (r.total_time_s, 1200.0, 1e-15);
  bw_assert_rel (r.Gt, 60000.0, 1e-15);
}
END_TEST

START_TEST (test_flocmodel_closed_form_equals_recursion)
{
  /* Over a grid of G, T and m: engine closed form == engine recursion == the literal formulas. */
  const BwFlocKinetics k = defaults ();
  double g_arr[50], t_arr[50], fr[50];

  for (double g = 5.0; g <= 450.0; g *= 1.6)
    for (double t = 60.0; t <= 7200.0; t *= 2.5)
      for (guint m = 1; m <= 50; m += 7)
        {
          BwFlocModelResult a, b;
          g_autoptr (GError) error = NULL;

          for (guint i = 0; i < m; i++)
            {
              g_arr[i] = g;
              t_arr[i] = t / m;
            }
          ck_assert (bw_flocmodel_equal (&k, g, t, m, &a, &error));
          ck_assert (bw_flocmodel_series (&k, m, g_arr, t_arr, fr, &b, &error));
          bw_assert_rel (b.remaining_fraction, a.remaining_fraction, 1e-12);
          bw_assert_rel (fr[m - 1], a.remaining_fraction, 1e-12);
          bw_assert_rel (a.n0_over_nm, literal_closed_form (k.aggregation_constant,
                                                            k.breakup_constant_s, g, t, m), 1e-11);
          bw_assert_rel (a.remaining_fraction, literal_recursion (k.aggregation_constant,
                                                                  k.breakup_constant_s, m, g_arr,
                                                                  t_arr), 1e-12);
        }
}
END_TEST

START_TEST (test_flocmodel_tapered_series)
{
  /* A tapered train 70 / 50 / 30 1/s, 400 s each: the engine's per-compartment fractions match
   * the literal recursion step by step, and every fraction lies in (0, 1]. */
  const BwFlocKinetics k = defaults ();
  const double g[] = { 70.0, 50.0, 30.0 };
  const double t[] = { 400.0, 400.0, 400.0 };
  double fr[3];
  BwFlocModelResult r;
  g_autoptr (GError) error = NULL;

  ck_assert (bw_flocmodel_series (&k, 3, g, t, fr, &r, &error));
  for (guint i = 0; i < 3; i++)
    {
      bw_assert_rel (fr[i], literal_recursion (k.aggregation_constant, k.breakup_constant_s, i + 1,
                                               g, t), 1e-13);
      ck_assert (fr[i] > 0.0 && fr[i] <= 1.0);
      if (i > 0)
        ck_assert (fr[i] < fr[i - 1]);
    }
  bw_assert_rel (r.Gt, 400.0 * (70.0 + 50.0 + 30.0), 1e-15);
  bw_assert_rel (r.total_time_s, 1200.0, 1e-15);
  /* NULL for the per-compartment output is allowed. */
  ck_assert (bw_flocmodel_series (&k, 3, g, t, NULL, &r, &error));
  bw_assert_rel (r.remaining_fraction, fr[2], 1e-15);
}
END_TEST

START_TEST (test_flocmodel_no_breakup)
{
  /* K_B = 0: pure aggregation, n_m/n_0 = (1 + KA G T/m)^-m (derived from the recursion). */
  BwFlocKinetics k = defaults ();
  BwFlocModelResult r;
  g_autoptr (GError) error = NULL;

  k.breakup_constant_s = 0.0;
  ck_assert (bw_flocmodel_equal (&k, 60.0, 1500.0, 4, &r, &error));
  bw_assert_rel (r.remaining_fraction, pow (1.0 + 4.5e-5 * 60.0 * 1500.0 / 4.0, -4.0), 1e-13);
}
END_TEST

START_TEST (test_flocmodel_optimum_m1_by_scan)
{
  /* docs/references.md (derived): for m = 1 the optimum G is "near 70 1/s". Scanning at 0.01 1/s finds
   * it at 74.63 1/s; setting d(n0/n)/dG = 0 gives KA KB T G^2 + 2 KB G - KA = 0, so
   * G* = (-KB + sqrt (KB^2 + KA^2 KB T)) / (KA KB T) = 74.628 1/s (our derivation). */
  const BwFlocKinetics k = defaults ();
  const double ka = k.aggregation_constant, kb = k.breakup_constant_s, t = 1200.0;
  const double g_star = (-kb + sqrt (kb * kb + ka * ka * kb * t)) / (ka * kb * t);
  double best_g = 0.0, best_ratio = 0.0, g_engine = 0;
  BwFlocModelResult r;
  g_autoptr (GError) error = NULL;

  for (double g = 1.0; g <= 450.0; g += 0.01)
    {
      ck_assert (bw_flocmodel_equal (&k, g, t, 1, &r, &error));
      if (r.n0_over_nm > best_ratio)
        {
          best_ratio = r.n0_over_nm;
          best_g = g;
        }
    }
  ck_assert_double_eq_tol (best_g, g_star, 0.01);
  ck_assert_double_eq_tol (g_star, 74.628, 0.001);
  ck_assert (best_g > 60.0 && best_g < 90.0); /* "near 70" */

  ck_assert (bw_flocmodel_best_gradient (&k, t, 1, &g_engine, &r, &error));
  bw_assert_rel (g_engine, g_star, 1e-6);
  bw_assert_rel (r.n0_over_nm, best_ratio, 1e-8);
}
END_TEST

START_TEST (test_flocmodel_best_gradient_by_scan)
{
  /* For m = 2..8 the engine's golden-section optimum matches a fine scan, and the scanned curve
   * has a single maximum (it rises, then falls), which the search relies on. */
  const BwFlocKinetics k = defaults ();

  for (guint m = 2; m <= 8; m++)
    {
      double best_g = 0.0, best = 0.0, prev = 0.0, g_engine = 0;
      int turns = 0, rising = 1;
      BwFlocModelResult r;
      g_autoptr (GError) error = NULL;

      for (double g = 1.0; g <= 450.0; g += 0.01)
        {
          ck_assert (bw_flocmodel_equal (&k, g, 1800.0, m, &r, &error));
          if (r.n0_over_nm > best)
            {
              best = r.n0_over_nm;
              best_g = g;
            }
          if (rising && r.n0_over_nm < prev)
            {
              rising = 0;
              turns++;
            }
          else if (!rising && r.n0_over_nm > prev)
            {
              rising = 1;
              turns++;
            }
          prev = r.n0_over_nm;
        }
      ck_assert_int_eq (turns, 1);
      ck_assert (bw_flocmodel_best_gradient (&k, 1800.0, m, &g_engine, &r, &error));
      ck_assert_double_eq_tol (g_engine, best_g, 0.01);
      ck_assert (r.n0_over_nm >= best * (1.0 - 1e-12));
    }
}
END_TEST

START_TEST (test_flocmodel_more_compartments_never_worse)
{
  /* At fixed G and total T, adding compartments never leaves more primary particles. It holds
   * for every valid G (not only where aggregation dominates): with q = (1 + KA G T/m)^-m and
   * r = KB G / KA <= 1 the fraction is q + r (1 - q), and q falls as m grows because
   * (1 + a/m)^m rises with m (derived). */
  const BwFlocKinetics k = defaults ();

  for (double g = 2.0; g <= 450.0; g *= 1.3)
    for (double t = 30.0; t <= 10000.0; t *= 1.8)
      {
        double prev = 2.0;
        for (guint m = 1; m <= 40; m++)
          {
            BwFlocModelResult r;
            g_autoptr (GError) error = NULL;
            ck_assert (bw_flocmodel_equal (&k, g, t, m, &r, &error));
            ck_assert_msg (r.remaining_fraction <= prev * (1.0 + 1e-14),
                           "G %g T %g: m = %u worse than m - 1", g, t, m);
            ck_assert (r.remaining_fraction > 0.0 && r.remaining_fraction <= 1.0);
            prev = r.remaining_fraction;
          }
      }
}
END_TEST

START_TEST (test_flocmodel_longer_time_never_worse)
{
  /* More time at the same G never leaves more primary particles (q falls with T). */
  const BwFlocKinetics k = defaults ();

  for (double g = 5.0; g <= 400.0; g *= 1.5)
    {
      double prev = 2.0;
      for (double t = 10.0; t <= 1e5; t *= 1.4)
        {
          BwFlocModelResult r;
          g_autoptr (GError) error = NULL;
          ck_assert (bw_flocmodel_equal (&k, g, t, 3, &r, &error));
          ck_assert (r.remaining_fraction <= prev);
          prev = r.remaining_fraction;
        }
    }
}
END_TEST

START_TEST (test_flocmodel_large_gt_stays_finite)
{
  /* The rearranged closed form cannot overflow: at G T = 4.5e7 the literal form's (1 + x)^m is
   * 1e877, beyond a double, but the fraction tends to KB G / KA (derived). */
  const BwFlocKinetics k = defaults ();
  BwFlocModelResult r;
  g_autoptr (GError) error = NULL;

  ck_assert (bw_flocmodel_equal (&k, 450.0, 1e5, 100, &r, &error));
  ck_assert (isfinite (r.n0_over_nm));
  bw_assert_rel (r.remaining_fraction, 1e-7 * 450.0 / 4.5e-5, 1e-12);
}
END_TEST

START_TEST (test_flocmodel_errors)
{
  BwFlocKinetics k = defaults ();
  BwFlocModelResult r;
  g_autoptr (GError) error = NULL;
  const double g[] = { 50.0, 600.0 }, t[] = { 300.0, 300.0 }, bad_t[] = { 300.0, -1.0 };
  double x = 0;

  /* Above KA/KB = 450 1/s the model's breakup would return more particles than entered. */
  ck_assert (!bw_flocmodel_equal (&k, 451.0, 1200.0, 3, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "velocity gradient:");
  ck_assert (strstr (error->message, "450") != NULL);
  g_clear_error (&error);
  ck_assert (bw_flocmodel_equal (&k, 450.0, 1200.0, 3, &r, &error)); /* the edge: fraction 1 */
  bw_assert_rel (r.remaining_fraction, 1.0, 1e-12);

  ck_assert (!bw_flocmodel_series (&k, 2, g, t, NULL, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "compartment 2");
  g_clear_error (&error);
  ck_assert (!bw_flocmodel_series (&k, 2, t, bad_t, NULL, &r, &error)); /* G 300, 300: fine */
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "compartment 2 time:");
  g_clear_error (&error);

  ck_assert (!bw_flocmodel_equal (&k, 0.0, 1200.0, 3, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "velocity gradient:");
  g_clear_error (&error);
  ck_assert (!bw_flocmodel_equal (&k, NAN, 1200.0, 3, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE, "velocity gradient:");
  g_clear_error (&error);
  ck_assert (!bw_flocmodel_equal (&k, 50.0, -5.0, 3, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "time:");
  g_clear_error (&error);
  ck_assert (!bw_flocmodel_equal (&k, 50.0, 1200.0, 0, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "compartments:");
  g_clear_error (&error);
  ck_assert (!bw_flocmodel_equal (&k, 50.0, 1200.0, BW_FLOCMODEL_MAX_COMPARTMENTS + 1, &r,
                                  &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "compartments:");
  g_clear_error (&error);

  k.aggregation_constant = 0.0;
  ck_assert (!bw_flocmodel_equal (&k, 50.0, 1200.0, 3, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "aggregation constant:");
  g_clear_error (&error);
  k = defaults ();
  k.breakup_constant_s = -1e-7;
  ck_assert (!bw_flocmodel_equal (&k, 50.0, 1200.0, 3, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "breakup constant:");
  g_clear_error (&error);

  k.breakup_constant_s = 0.0;
  ck_assert (!bw_flocmodel_best_gradient (&k, 1200.0, 3, &x, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "breakup constant:");
  g_clear_error (&error);

  /* K_B = 0 and an enormous G T: the fraction underflows; an error, never 0 or inf. */
  ck_assert (!bw_flocmodel_equal (&k, 1e6, 1e10, 1000, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "time:");
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("flocmodel");
  TCase *tc;

  tc = tcase_create ("values");
  tcase_add_test (tc, test_flocmodel_reference_value);
  tcase_add_test (tc, test_flocmodel_closed_form_equals_recursion);
  tcase_add_test (tc, test_flocmodel_tapered_series);
  tcase_add_test (tc, test_flocmodel_no_breakup);
  tcase_add_test (tc, test_flocmodel_large_gt_stays_finite);
  suite_add_tcase (s, tc);

  tc = tcase_create ("optimum");
  tcase_add_test (tc, test_flocmodel_optimum_m1_by_scan);
  tcase_add_test (tc, test_flocmodel_best_gradient_by_scan);
  suite_add_tcase (s, tc);

  tc = tcase_create ("properties");
  tcase_add_test (tc, test_flocmodel_more_compartments_never_worse);
  tcase_add_test (tc, test_flocmodel_longer_time_never_worse);
  suite_add_tcase (s, tc);

  tc = tcase_create ("errors");
  tcase_add_test (tc, test_flocmodel_errors);
  suite_add_tcase (s, tc);

  return s;
}
