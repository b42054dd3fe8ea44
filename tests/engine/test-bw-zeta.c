/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-zeta.c: zeta potential from mobility, Henry's function, the Debye length. */
#include "config.h"

#include <string.h>

#include "bw-test.h"
#include "engine/bw-error.h"
#include "engine/bw-zeta.h"

static BwWater
water_at (double celsius)
{
  BwWater w;
  ck_assert (bw_water_properties (273.15 + celsius, &w, NULL));
  return w;
}

START_TEST (test_smoluchowski_25C)
{
  /* docs/references.md (derived): 2 um cm/(V s) at 25 degC -> 25.6-25.7 mV by Smoluchowski,
   * zeta = eta U / (eps_r eps_0); Hückel is 1.5 times that. */
  BwWater w = water_at (25);
  BwZetaResult r, h;

  ck_assert (bw_zeta_from_mobility (2e-8, BW_ZETA_SMOLUCHOWSKI, 0, 0, &w, &r, NULL));
  ck_assert_msg (r.zeta_V > 0.0256 && r.zeta_V < 0.0257, "zeta %g V", r.zeta_V);
  bw_assert_rel (r.zeta_V, w.dynamic_viscosity_Pa_s * 2e-8 / (w.relative_permittivity * 8.8541878128e-12), 1e-12);
  ck_assert (bw_zeta_from_mobility (2e-8, BW_ZETA_HUCKEL, 0, 0, &w, &h, NULL));
  bw_assert_rel (h.zeta_V, 1.5 * r.zeta_V, 1e-12);
  /* A negative mobility gives a negative potential of the same size. */
  ck_assert (bw_zeta_from_mobility (-2e-8, BW_ZETA_SMOLUCHOWSKI, 0, 0, &w, &h, NULL));
  bw_assert_rel (h.zeta_V, -r.zeta_V, 1e-12);
}
END_TEST

START_TEST (test_henry_function)
{
  /* Ohshima (1994) Eq. 8 by hand at ka = 1 (derived): 1 + 2.5/(1 + 2/e) = 2.44026;
   * f = 1 + 1/(2 x 2.44026^3) = 1.03441. Henry's exact value there is about 1.027 (Ohshima 1994,
   * Table 1, from memory): the approximation is within 1 %. */
  bw_assert_rel (bw_henry_function (1.0), 1.03441, 1e-5);
  bw_assert_rel (bw_henry_function (1.0), 1.027, 1e-2);
  /* The limits: Hückel (1) for thick double layers, Smoluchowski (1.5) for thin ones. */
  bw_assert_rel (bw_henry_function (1e-6), 1.0, 1e-6);
  bw_assert_rel (bw_henry_function (1e6), 1.5, 1e-5);
  /* Monotone in between. */
  for (double ka = 0.01; ka < 1000; ka *= 1.5)
    ck_assert (bw_henry_function (ka * 1.5) > bw_henry_function (ka));
}
END_TEST

START_TEST (test_debye_length)
{
  /* Israelachvili (from memory): 1/kappa = 0.304 / sqrt (I) nm for a 1:1 electrolyte at 25 degC
   * (I in mol/L). I = 1 mmol/L (1 mol/m3) -> 9.61 nm; 0.1 mol/L -> 0.961 nm. */
  BwWater w = water_at (25);
  double d;
  g_autoptr (GError) error = NULL;

  ck_assert (bw_debye_length (1.0, &w, &d, NULL));
  bw_assert_rel (d, 0.304e-9 / sqrt (1e-3), 5e-3);
  ck_assert (bw_debye_length (100.0, &w, &d, NULL));
  bw_assert_rel (d, 0.304e-9 / sqrt (0.1), 5e-3);
  ck_assert (!bw_debye_length (0, &w, &d, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "ionic strength");
}
END_TEST

START_TEST (test_henry_model)
{
  BwWater w = water_at (20);
  BwZetaResult s, hm;
  g_autoptr (GError) error = NULL;

  /* A 1 um particle in 1 mmol/L: ka about 100, so Henry lies just below Smoluchowski's f = 1.5
   * and the potential just above his. */
  ck_assert (bw_zeta_from_mobility (-2.5e-8, BW_ZETA_SMOLUCHOWSKI, 1e-6, 1.0, &w, &s, NULL));
  ck_assert (bw_zeta_from_mobility (-2.5e-8, BW_ZETA_HENRY, 1e-6, 1.0, &w, &hm, &error));
  ck_assert (hm.has_debye);
  ck_assert_msg (hm.kappa_a > 90 && hm.kappa_a < 120, "ka %g", hm.kappa_a);
  ck_assert (hm.henry_function < 1.5 && hm.henry_function > 1.4);
  bw_assert_rel (hm.zeta_V, s.zeta_V * 1.5 / hm.henry_function, 1e-12);
  /* Henry's model needs both the radius and the ionic strength. */
  ck_assert (!bw_zeta_from_mobility (-2.5e-8, BW_ZETA_HENRY, 0, 1.0, &w, &hm, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "radius");
  g_clear_error (&error);
  ck_assert (!bw_zeta_from_mobility (NAN, BW_ZETA_SMOLUCHOWSKI, 0, 0, &w, &hm, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE, "mobility");
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("zeta");
  TCase *tc = tcase_create ("zeta");

  tcase_add_test (tc, test_smoluchowski_25C);
  tcase_add_test (tc, test_henry_function);
  tcase_add_test (tc, test_debye_length);
  tcase_add_test (tc, test_henry_model);
  suite_add_tcase (s, tc);
  return s;
}
