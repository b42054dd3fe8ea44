/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-chemistry.c: coagulant stoichiometry, feed, alkalinity and sludge. */
#include "config.h"

#include <string.h>

#include "bw-test.h"
#include "engine/bw-chemistry.h"
#include "engine/bw-error.h"

/* Molar masses from IUPAC standard atomic weights, recomputed by hand (derived):
 * Al2(SO4)3.14H2O = 2(26.9815385) + 3(32.06 + 4 x 15.999) + 14(18.015) = 594.341 g/mol, which is
 * the 594.3 of docs/references.md. */
START_TEST (test_alum_stoichiometry)
{
  BwCoagulant c;
  g_autoptr (GError) error = NULL;

  ck_assert (bw_coagulant_alum (14, &c, &error));
  bw_assert_rel (c.molar_mass_g_mol, 594.341, 2e-6);
  /* docs/references.md (derived from molar masses): 0.505 mg/L alkalinity as CaCO3 per mg/L,
   * Al(OH)3 0.2625 mg/mg, with bound water Al(OH)3.3H2O 0.444 mg/mg (Cornwell's 0.44). */
  bw_assert_rel (c.alkalinity_factor, 3 * 100.0869 / 594.341, 1e-5);
  bw_assert_rel (c.alkalinity_factor, 0.505, 2e-3);
  bw_assert_rel (c.hydroxide_factor, 0.2625, 1e-3);
  bw_assert_rel (c.sludge_factor, 0.444, 1e-3);
  bw_assert_rel (c.sludge_factor, 0.44, 1.5e-2); /* Cornwell et al. 1987 (from memory) */
  /* The 18-hydrate is heavier, so each mg carries less aluminium. */
  {
    BwCoagulant c18;
    ck_assert (bw_coagulant_alum (18, &c18, NULL));
    ck_assert (c18.metal_fraction < c.metal_fraction);
  }
  ck_assert (!bw_coagulant_alum (-1, &c, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "hydrate");
}
END_TEST

START_TEST (test_ferric_stoichiometry)
{
  BwCoagulant c;

  bw_coagulant_ferric_chloride (&c);
  /* docs/references.md (derived): FeCl3 0.926 mg/L as CaCO3 per mg/L; Fe(OH)3.3H2O 2.88 per mg
   * of Fe (Cornwell's 2.9, from memory). */
  bw_assert_rel (c.alkalinity_factor, 0.926, 1e-3);
  bw_assert_rel (c.sludge_factor / c.metal_fraction, 2.88, 2e-3);
  bw_coagulant_ferric_sulfate (&c);
  /* Fe2(SO4)3 = 399.858 g/mol, 3 CaCO3 per mole: 300.26 / 399.858 = 0.7509 (derived). */
  bw_assert_rel (c.molar_mass_g_mol, 399.858, 1e-5);
  bw_assert_rel (c.alkalinity_factor, 0.7509, 2e-4);
}
END_TEST

START_TEST (test_pacl)
{
  BwCoagulant c, c0;
  g_autoptr (GError) error = NULL;

  /* A solution of 10 % Al2O3 at 70 % basicity (fictional product). Al = 0.10 x 2 x 26.98 /
   * 101.96 = 0.05293 g/g; alkalinity 0.10 x 2/101.96 x 1.5 x 0.3 x 100.087 = 0.08834 (derived). */
  ck_assert (bw_coagulant_pacl (0.10, 0.70, &c, &error));
  bw_assert_rel (c.metal_fraction, 0.052927, 1e-4);
  bw_assert_rel (c.alkalinity_factor, 0.088344, 1e-4);
  /* Basicity zero is plain aluminium chloride: the full 3 equivalents per Al. */
  ck_assert (bw_coagulant_pacl (0.10, 0.0, &c0, NULL));
  bw_assert_rel (c0.alkalinity_factor, c.alkalinity_factor / 0.3, 1e-12);
  ck_assert (!bw_coagulant_pacl (0.10, 1.2, &c, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "basicity");
}
END_TEST

START_TEST (test_dosing_cornwell_example)
{
  /* docs/references.md (derived from Cornwell's formula, from memory):
   * S (lb/d) = 8.34 Q (MGD) (0.44 Al + SS + A); 10 MGD, 30 mg/L alum, SS = 1.3 x 10 NTU
   * -> 2185 lb/d. Ours uses 0.4444 for 0.44, i.e. 8.34 x 10 x (13.33 + 13) = 2196 lb/d. */
  BwCoagulant c;
  BwDosing d;
  BwDosingResult r;
  const double q = 10 * 0.0438126364;        /* 10 MGD in m3/s */
  const double lb_per_day = 0.45359237 / 86400;

  ck_assert (bw_coagulant_alum (14, &c, NULL));
  bw_dosing_init (&d, 30e-3, q);
  d.turbidity_NTU = 10;
  d.ss_factor = 1.3;
  ck_assert (bw_dosing_evaluate (&c, &d, &r, NULL));
  ck_assert (r.has_sludge);
  bw_assert_rel (r.sludge_kg_s / lb_per_day, 2185, 1e-2);
  bw_assert_rel (r.sludge_kg_s / lb_per_day, 8.3454 * 10 * (0.44435 * 30 + 13), 2e-3);
  /* Feed: 30 mg/L x 10 MGD = 2502 lb/d (8.34 lb per MG per mg/L, common practice). */
  bw_assert_rel (r.feed_kg_s / lb_per_day, 8.3454 * 10 * 30, 1e-3);
}
END_TEST

START_TEST (test_dosing_alkalinity_and_lime)
{
  BwCoagulant c;
  BwDosing d;
  BwDosingResult r;

  ck_assert (bw_coagulant_alum (14, &c, NULL));
  /* 60 mg/L alum consumes 30.3 mg/L as CaCO3; 40 mg/L raw leaves 9.7; keeping 30 needs
   * 20.3 mg/L as CaCO3: 15.0 mg/L Ca(OH)2 (x 74.09/100.09) or 21.5 mg/L Na2CO3 (x 105.99/100.09). */
  bw_dosing_init (&d, 60e-3, 0.5);
  d.raw_alkalinity_kg_m3 = 40e-3;
  d.residual_target_kg_m3 = 30e-3;
  ck_assert (bw_dosing_evaluate (&c, &d, &r, NULL));
  bw_assert_rel (r.alkalinity_consumed_kg_m3, 60e-3 * c.alkalinity_factor, 1e-12);
  bw_assert_rel (r.residual_alkalinity_kg_m3, 40e-3 - 60e-3 * c.alkalinity_factor, 1e-12);
  ck_assert (r.cautions & BW_CHEM_CAUTION_LOW_RESIDUAL);
  ck_assert (!(r.cautions & BW_CHEM_CAUTION_ALKALINITY_EXHAUSTED));
  bw_assert_rel (r.lime_kg_m3, (30e-3 - r.residual_alkalinity_kg_m3) * 74.0927 / 100.0869, 1e-5);
  bw_assert_rel (r.soda_ash_kg_m3, (30e-3 - r.residual_alkalinity_kg_m3) * 105.9884 / 100.0869, 1e-5);
  /* 0.374 mg Ca(OH)2 per mg alum when the raw water has none to spare (docs/references.md). */
  bw_assert_rel (c.alkalinity_factor * 74.0927 / 100.0869, 0.374, 1e-3);
  /* More coagulant never leaves more alkalinity. */
  {
    BwDosingResult r2;
    d.dose_kg_m3 = 80e-3;
    ck_assert (bw_dosing_evaluate (&c, &d, &r2, NULL));
    ck_assert (r2.residual_alkalinity_kg_m3 < r.residual_alkalinity_kg_m3);
    ck_assert (r2.lime_kg_m3 > r.lime_kg_m3);
  }
}
END_TEST

START_TEST (test_dosing_solution_and_sludge_volume)
{
  BwCoagulant c;
  BwDosing d;
  BwDosingResult r;

  ck_assert (bw_coagulant_alum (14, &c, NULL));
  /* Liquid alum of 48.5 % strength and 1330 kg/m3 (fictional supplier sheet): 25 mg/L at
   * 0.35 m3/s is 8.75e-3 kg/s, i.e. 8.75e-3 / (0.485 x 1330) m3/s = 48.8 L/h (derived). */
  bw_dosing_init (&d, 25e-3, 0.35);
  d.solution_fraction = 0.485;
  d.solution_density_kg_m3 = 1330;
  d.turbidity_NTU = 18;
  d.solids_fraction = 0.01;
  d.solids_sg = 1.4;
  ck_assert (bw_dosing_evaluate (&c, &d, &r, NULL));
  bw_assert_rel (r.solution_m3_s * 3.6e6, 8.75e-3 / (0.485 * 1330) * 3.6e6, 1e-12);
  bw_assert_rel (r.solution_m3_s * 3.6e6, 48.83, 1e-3);
  /* 1 % solids of SG 1.4: rho = 1000 / (0.99 + 0.01/1.4) = 1002.87 kg/m3 (derived). */
  bw_assert_rel (r.sludge_m3_s, r.sludge_kg_s / (0.01 * 1000 / (0.99 + 0.01 / 1.4)), 1e-12);
}
END_TEST

START_TEST (test_dosing_errors)
{
  BwCoagulant c;
  BwDosing d;
  BwDosingResult r;
  g_autoptr (GError) error = NULL;

  bw_coagulant_ferric_chloride (&c);
  bw_dosing_init (&d, -1e-3, 0.3);
  ck_assert (!bw_dosing_evaluate (&c, &d, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "dose");
  g_clear_error (&error);
  bw_dosing_init (&d, 30e-3, 0);
  ck_assert (!bw_dosing_evaluate (&c, &d, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "flow");
  g_clear_error (&error);
  bw_dosing_init (&d, 30e-3, 0.3);
  d.solution_fraction = 0.4; /* strength without density */
  ck_assert (!bw_dosing_evaluate (&c, &d, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "solution density");
  g_clear_error (&error);
  bw_dosing_init (&d, NAN, 0.3);
  ck_assert (!bw_dosing_evaluate (&c, &d, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE, "dose");
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("chemistry");
  TCase *tc = tcase_create ("coagulants");

  tcase_add_test (tc, test_alum_stoichiometry);
  tcase_add_test (tc, test_ferric_stoichiometry);
  tcase_add_test (tc, test_pacl);
  suite_add_tcase (s, tc);
  tc = tcase_create ("dosing");
  tcase_add_test (tc, test_dosing_cornwell_example);
  tcase_add_test (tc, test_dosing_alkalinity_and_lime);
  tcase_add_test (tc, test_dosing_solution_and_sludge_volume);
  tcase_add_test (tc, test_dosing_errors);
  suite_add_tcase (s, tc);
  return s;
}
