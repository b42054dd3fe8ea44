/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-jartest.c: dose-response curves, optimum and target doses, destabilised window. */
#include "config.h"

#include <string.h>

#include "bw-test.h"
#include "engine/bw-error.h"
#include "engine/bw-jartest.h"

/* A fictional jar series (Alder Creek raw water, invented): alum dose (mg/L), settled turbidity
 * (NTU), zeta potential (mV), given out of order on purpose. */
static BwJarSeries
series (void)
{
  const double dose[] = { 30, 10, 20, 40, 50, 60 };
  const double ntu[] = { 1.9, 8.5, 4.1, 1.2, 1.6, 3.0 };
  const double zeta[] = { -6, -18, -11, -1, 4, 12 };
  BwJarSeries s = { 0 };

  for (guint i = 0; i < G_N_ELEMENTS (dose); i++)
    {
      s.jars[i].dose_kg_m3 = dose[i] * 1e-3;
      s.jars[i].turbidity_NTU = ntu[i];
      s.jars[i].zeta_V = zeta[i] * 1e-3;
    }
  s.n_jars = G_N_ELEMENTS (dose);
  s.has_zeta = TRUE;
  return s;
}

START_TEST (test_curve_through_jars_without_overshoot)
{
  BwJarSeries s = series ();

  ck_assert (bw_jar_series_prepare (&s, NULL));
  bw_assert_rel (s.jars[0].dose_kg_m3, 10e-3, 1e-12); /* sorted */
  for (guint i = 0; i < s.n_jars; i++)
    bw_assert_rel (bw_jar_curve (&s, s.jars[i].dose_kg_m3), s.jars[i].turbidity_NTU, 1e-12);
  /* Fritsch-Carlson: between two jars the curve stays between their values. */
  for (guint i = 0; i + 1 < s.n_jars; i++)
    for (int k = 1; k < 20; k++)
      {
        const double a = s.jars[i].turbidity_NTU, b = s.jars[i + 1].turbidity_NTU;
        const double x = s.jars[i].dose_kg_m3 + k / 20.0 * (s.jars[i + 1].dose_kg_m3 - s.jars[i].dose_kg_m3);
        const double y = bw_jar_curve (&s, x);
        ck_assert_msg (y >= MIN (a, b) - 1e-12 && y <= MAX (a, b) + 1e-12, "overshoot %g at %g", y, x);
      }
}
END_TEST

START_TEST (test_optimum_target_window)
{
  BwJarSeries s = series ();
  BwJarResult r;

  ck_assert (bw_jar_series_prepare (&s, NULL));
  ck_assert (bw_jar_analyse (&s, 2.0, BW_ZETA_DESTABILISED_DEFAULT_V, &r, NULL));
  /* Least turbidity: 1.2 NTU at 40 mg/L (the data). */
  bw_assert_rel (r.optimum_dose_kg_m3, 40e-3, 1e-12);
  bw_assert_rel (r.optimum_turbidity_NTU, 1.2, 1e-12);
  /* 2.0 NTU is first reached between 20 (4.1) and 30 mg/L (1.9): the curve value there is the
   * target, and no smaller dose reaches it. */
  ck_assert (r.has_target);
  ck_assert (r.target_dose_kg_m3 > 20e-3 && r.target_dose_kg_m3 < 30e-3);
  bw_assert_rel (bw_jar_curve (&s, r.target_dose_kg_m3), 2.0, 1e-6);
  ck_assert (bw_jar_curve (&s, r.target_dose_kg_m3 * 0.999) > 2.0);
  /* |zeta| <= 10 mV, zeta linear between jars (derived by hand): from -11 mV at 20 to -6 at 30,
   * -10 mV at 22 mg/L; from 4 mV at 50 to 12 at 60, 10 mV at 57.5 mg/L. */
  ck_assert (r.has_window);
  bw_assert_rel (r.window_low_kg_m3, 22e-3, 1e-9);
  bw_assert_rel (r.window_high_kg_m3, 57.5e-3, 1e-9);
}
END_TEST

START_TEST (test_unreachable_target_and_no_window)
{
  BwJarSeries s = series ();
  BwJarResult r;

  ck_assert (bw_jar_series_prepare (&s, NULL));
  ck_assert (bw_jar_analyse (&s, 0.5, 0.0005, &r, NULL));
  ck_assert (!r.has_target);  /* 0.5 NTU is never reached */
  ck_assert (!r.has_window);  /* no jar within 0.5 mV */
}
END_TEST

START_TEST (test_series_errors)
{
  BwJarSeries s = series ();
  g_autoptr (GError) error = NULL;

  s.jars[2].dose_kg_m3 = s.jars[0].dose_kg_m3;
  ck_assert (!bw_jar_series_prepare (&s, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "two jars");
  g_clear_error (&error);
  s = series ();
  s.jars[3].turbidity_NTU = -1;
  ck_assert (!bw_jar_series_prepare (&s, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "jar 4 turbidity");
  g_clear_error (&error);
  s = series ();
  s.n_jars = 2;
  ck_assert (!bw_jar_series_prepare (&s, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "3 to");
}
END_TEST

START_TEST (test_mobility_column)
{
  BwJarSeries s = series ();
  BwWater w;
  BwJarResult r;

  /* The same series measured as mobility: -1 um cm/(V s) is about -12.8 mV at 20 degC by
   * Smoluchowski (eta U / eps), so the window moves but the conversion is consistent. */
  s.has_zeta = FALSE;
  s.has_mobility = TRUE;
  for (guint i = 0; i < s.n_jars; i++)
    s.jars[i].mobility_m2_V_s = s.jars[i].zeta_V / 0.0128 * 1e-8;
  ck_assert (bw_water_properties (293.15, &w, NULL));
  ck_assert (bw_jar_series_prepare (&s, NULL));
  ck_assert (bw_jar_series_zeta_from_mobility (&s, BW_ZETA_SMOLUCHOWSKI, 0, 0, &w, NULL));
  ck_assert (s.has_zeta);
  bw_assert_rel (s.jars[0].zeta_V,
                 w.dynamic_viscosity_Pa_s * s.jars[0].mobility_m2_V_s / (w.relative_permittivity * 8.8541878128e-12),
                 1e-12);
  ck_assert (bw_jar_analyse (&s, -1, BW_ZETA_DESTABILISED_DEFAULT_V, &r, NULL));
  ck_assert (r.has_window && !r.has_target);
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("jartest");
  TCase *tc = tcase_create ("jartest");

  tcase_add_test (tc, test_curve_through_jars_without_overshoot);
  tcase_add_test (tc, test_optimum_target_window);
  tcase_add_test (tc, test_unreachable_target_and_no_window);
  tcase_add_test (tc, test_series_errors);
  tcase_add_test (tc, test_mobility_column);
  suite_add_tcase (s, tc);
  return s;
}
