/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-evaluate.c: the project model, load cases, evaluation and criteria checks. */
#include "config.h"

#include <string.h>

#include "bw-test.h"
#include "engine/bw-error.h"
#include "engine/bw-evaluate.h"

/* A one-train plant: a rectangular basin, two in parallel with one on standby.
 * Flows (m3/s): minimum 0.1, maximum day 0.4, peak hour 0.6; 5 and 25 degC. */
static BwProject *
small_plant (void)
{
  BwProject *p = bw_project_new ();
  BwTrain *t = bw_train_new ("t1", "Train 1");
  BwProcessUnit *b = bw_process_unit_new (BW_PROCESS_RECTANGULAR_BASIN, "sed", "Basin");

  p->name = g_strdup ("test plant");
  p->basis.flow_m3_s[BW_FLOW_MINIMUM] = 0.1;
  p->basis.flow_m3_s[BW_FLOW_MAXIMUM_DAY] = 0.4;
  p->basis.flow_m3_s[BW_FLOW_PEAK_HOUR] = 0.6;
  p->basis.flows_given = (1u << BW_FLOW_MINIMUM) | (1u << BW_FLOW_MAXIMUM_DAY) | (1u << BW_FLOW_PEAK_HOUR);
  p->basis.temperature_K[BW_TEMP_COLDEST] = 278.15;
  p->basis.temperature_K[BW_TEMP_WARMEST] = 298.15;
  b->n_parallel = 2;
  b->n_standby = 1;
  ck_assert (bw_process_unit_set (b, "length", 40, NULL));
  ck_assert (bw_process_unit_set (b, "width", 10, NULL));
  ck_assert (bw_process_unit_set (b, "side-water-depth", 4, NULL));
  ck_assert (bw_process_unit_set (b, "weir-length", 50, NULL));
  g_ptr_array_add (t->units, b);
  g_ptr_array_add (p->trains, t);
  bw_project_generate_cases (p);
  return p;
}

static int
case_index (const BwResults *r, BwFlowKind f, BwTempKind t, BwServiceState s)
{
  for (guint i = 0; i < r->n_cases; i++)
    if (r->cases[i].flow == f && r->cases[i].temp == t && r->cases[i].service == s)
      return (int) i;
  return -1;
}

START_TEST (test_cases_generated)
{
  g_autoptr (BwProject) p = small_plant ();

  /* 3 flows x 2 temperatures x 2 service states (there is a standby). */
  ck_assert_uint_eq (p->cases->len, 12);
  ((BwProcessUnit *) g_ptr_array_index (((BwTrain *) g_ptr_array_index (p->trains, 0))->units, 0))->n_standby = 0;
  bw_project_generate_cases (p);
  ck_assert_uint_eq (p->cases->len, 6);
}
END_TEST

START_TEST (test_firm_capacity_flow)
{
  g_autoptr (BwProject) p = small_plant ();
  const BwProcessUnit *b = bw_project_find_unit (p, "sed", NULL);

  /* Two basins share 0.4 m3/s; with one out of service the other takes all of it. */
  bw_assert_rel (bw_project_unit_flow (p, b, BW_FLOW_MAXIMUM_DAY, BW_SERVICE_ALL_IN_SERVICE), 0.2, 1e-15);
  bw_assert_rel (bw_project_unit_flow (p, b, BW_FLOW_MAXIMUM_DAY, BW_SERVICE_FIRM), 0.4, 1e-15);
}
END_TEST

START_TEST (test_evaluate_basin_by_hand)
{
  g_autoptr (BwProject) p = small_plant ();
  g_autoptr (GError) error = NULL;
  g_autoptr (BwResults) r = bw_project_evaluate (p, &error);
  const BwElementResult *e;
  int c;

  ck_assert_msg (r != NULL, "%s", error ? error->message : "");
  ck_assert_uint_eq (r->elements->len, 1);
  e = g_ptr_array_index (r->elements, 0);
  ck_assert_int_eq (e->type, BW_ELEMENT_RECTANGULAR_BASIN);
  /* Hand-worked (derived): maximum day, firm: Q = 0.4 m3/s through one 40 x 10 x 4 m basin.
   * A = 400 m2, overflow 0.4/400 = 1e-3 m/s (3.6 m/h), V = 1600 m3, t = 4000 s,
   * v_h = 0.4/(10 x 4) = 0.01 m/s, weir 0.4/50 = 8e-3 m2/s, L/W 4, W/D 2.5. */
  c = case_index (r, BW_FLOW_MAXIMUM_DAY, BW_TEMP_COLDEST, BW_SERVICE_FIRM);
  ck_assert_int_ge (c, 0);
  bw_assert_rel (e->values[c].values[BW_Q_SURFACE_AREA], 400, 1e-12);
  bw_assert_rel (e->values[c].values[BW_Q_OVERFLOW_RATE], 1e-3, 1e-12);
  bw_assert_rel (e->values[c].values[BW_Q_DETENTION], 4000, 1e-12);
  bw_assert_rel (e->values[c].values[BW_Q_HORIZONTAL_VELOCITY], 0.01, 1e-12);
  bw_assert_rel (e->values[c].values[BW_Q_WEIR_LOADING], 8e-3, 1e-12);
  bw_assert_rel (e->values[c].values[BW_Q_LENGTH_WIDTH_RATIO], 4, 1e-12);
  bw_assert_rel (e->values[c].values[BW_Q_WIDTH_DEPTH_RATIO], 2.5, 1e-12);
  /* All in service the same flow is shared: overflow halves. */
  c = case_index (r, BW_FLOW_MAXIMUM_DAY, BW_TEMP_COLDEST, BW_SERVICE_ALL_IN_SERVICE);
  bw_assert_rel (e->values[c].values[BW_Q_OVERFLOW_RATE], 0.5e-3, 1e-12);
  /* The governing (largest) overflow rate is at peak hour with the standby out. */
  c = bw_results_extreme_case (r, 0, BW_Q_OVERFLOW_RATE, TRUE);
  ck_assert_int_eq (r->cases[c].flow, BW_FLOW_PEAK_HOUR);
  ck_assert_int_eq (r->cases[c].service, BW_SERVICE_FIRM);
  /* Colder water is more viscous: a lower Reynolds number at the same flow. */
  ck_assert (e->values[case_index (r, BW_FLOW_PEAK_HOUR, BW_TEMP_COLDEST, BW_SERVICE_FIRM)].values[BW_Q_REYNOLDS]
             < e->values[case_index (r, BW_FLOW_PEAK_HOUR, BW_TEMP_WARMEST, BW_SERVICE_FIRM)].values[BW_Q_REYNOLDS]);
}
END_TEST

START_TEST (test_evaluate_liquid_feed_and_sludge_volume)
{
  g_autoptr (BwProject) p = small_plant ();
  BwTrain *t = g_ptr_array_index (p->trains, 0);
  g_autoptr (GError) error = NULL;
  g_autoptr (BwResults) r = NULL;
  const BwElementResult *rm, *sed;
  BwCoagulant alum;
  double rho, dry;
  int c;

  g_ptr_array_insert (t->units, 0, bw_process_unit_new (BW_PROCESS_RAPID_MIX, "rm", "Rapid mix"));
  p->basis.turbidity_NTU = 10;
  p->chemistry.enabled = TRUE;
  p->chemistry.dose_min_kg_m3 = 0.010;
  p->chemistry.dose_design_kg_m3 = 0.030;
  p->chemistry.dose_max_kg_m3 = 0.045;
  p->chemistry.stock_fraction = 0.485;
  p->chemistry.stock_density_kg_m3 = 1330;
  p->chemistry.sludge_solids_fraction = 0.01;
  ck_assert (bw_coagulant_alum (14, &alum, NULL));
  r = bw_project_evaluate (p, &error);
  ck_assert_msg (r != NULL, "%s", error ? error->message : "");
  rm = g_ptr_array_index (r->elements, 0);
  sed = g_ptr_array_index (r->elements, 1);
  c = case_index (r, BW_FLOW_MAXIMUM_DAY, BW_TEMP_COLDEST, BW_SERVICE_FIRM);
  /* By hand (derived): the rapid mix takes all 0.4 m3/s; liquid stock = Q D_max / (w rho) =
   * 0.4 x 0.045 / (0.485 x 1330) m3/s. */
  bw_assert_rel (rm->values[c].values[BW_Q_COAGULANT_SOLUTION], 0.4 * 0.045 / (0.485 * 1330), 1e-12);
  ck_assert (!bw_quantity_set_has (&rm->values[c], BW_Q_SLUDGE_VOLUME));
  /* The firm basin takes 0.4 m3/s: dry solids Q (k D + 1.3 T) and a sludge of 1 % solids whose
   * density follows 1/rho = (1 - P)/1000 + P/(1.4 x 1000) (derived, the mass-volume relation of
   * bw-chemistry.c). */
  dry = 0.4 * (alum.sludge_factor * 0.030 + 1.3 * 10 * 1e-3);
  rho = 1000.0 / (0.99 + 0.01 / 1.4);
  bw_assert_rel (sed->values[c].values[BW_Q_SLUDGE], dry, 1e-12);
  bw_assert_rel (sed->values[c].values[BW_Q_SLUDGE_VOLUME], dry / (0.01 * rho), 1e-12);
  ck_assert (!bw_quantity_set_has (&sed->values[c], BW_Q_COAGULANT_SOLUTION));
  g_clear_pointer (&r, bw_results_free);

  /* Without a density there is no liquid feed, without a solids content no volume: absent,
   * never NaN. */
  p->chemistry.stock_density_kg_m3 = 0;
  p->chemistry.sludge_solids_fraction = 0;
  r = bw_project_evaluate (p, &error);
  ck_assert_msg (r != NULL, "%s", error ? error->message : "");
  rm = g_ptr_array_index (r->elements, 0);
  sed = g_ptr_array_index (r->elements, 1);
  for (guint k = 0; k < r->n_cases; k++)
    {
      ck_assert (bw_quantity_set_has (&rm->values[k], BW_Q_COAGULANT_FEED));
      ck_assert (!bw_quantity_set_has (&rm->values[k], BW_Q_COAGULANT_SOLUTION));
      ck_assert (bw_quantity_set_has (&sed->values[k], BW_Q_SLUDGE));
      ck_assert (!bw_quantity_set_has (&sed->values[k], BW_Q_SLUDGE_VOLUME));
    }
  g_clear_pointer (&r, bw_results_free);

  /* A solids content out of range is refused by name before anything is evaluated. */
  p->chemistry.sludge_solids_fraction = 0.9;
  r = bw_project_evaluate (p, &error);
  ck_assert_ptr_null (r);
  ck_assert_msg (error && strstr (error->message, "sludge solids content"), "%s",
                 error ? error->message : "");
}
END_TEST

static BwCriterion *
criterion (const char *id, BwQuantity q, guint applies, gboolean rmin, double lo, gboolean rmax,
           double hi)
{
  BwCriterion *c = bw_criterion_new ();
  c->id = g_strdup (id);
  c->title = g_strdup (id);
  c->quantity = q;
  c->applies_to = applies;
  c->required.has_min = rmin;
  c->required.min = lo;
  c->required.has_max = rmax;
  c->required.max = hi;
  c->document = g_strdup ("test document (derived)");
  return c;
}

START_TEST (test_grade)
{
  g_autoptr (BwCriterion) c = criterion ("g", BW_Q_G, 1u << BW_ELEMENT_RAPID_MIX, TRUE, 10, TRUE, 60);

  c->preferred.has_min = TRUE;
  c->preferred.min = 20;
  c->preferred.has_max = TRUE;
  c->preferred.max = 40;
  ck_assert_int_eq (bw_criterion_grade (c, 5), BW_CHECK_FAIL);
  ck_assert_int_eq (bw_criterion_grade (c, 10), BW_CHECK_WARN); /* limits are inclusive */
  ck_assert_int_eq (bw_criterion_grade (c, 15), BW_CHECK_WARN);
  ck_assert_int_eq (bw_criterion_grade (c, 30), BW_CHECK_PASS);
  ck_assert_int_eq (bw_criterion_grade (c, 60), BW_CHECK_WARN);
  ck_assert_int_eq (bw_criterion_grade (c, 60.0001), BW_CHECK_FAIL);
}
END_TEST

START_TEST (test_criteria_set_coherence)
{
  g_autoptr (BwCriteriaSet) set = bw_criteria_set_new ("t", "t");
  g_autoptr (GError) error = NULL;
  BwCriterion *c;

  ck_assert (bw_criteria_set_add (set, criterion ("a", BW_Q_G, 1, TRUE, 1, FALSE, 0), &error));
  ck_assert (!bw_criteria_set_add (set, criterion ("a", BW_Q_G, 1, TRUE, 1, FALSE, 0), &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "used twice");
  g_clear_error (&error);
  ck_assert (!bw_criteria_set_add (set, criterion ("b", BW_Q_G, 1, TRUE, 9, TRUE, 3), &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "above its maximum");
  g_clear_error (&error);
  c = criterion ("c", BW_Q_G, 1, TRUE, 10, TRUE, 20);
  c->preferred.has_max = TRUE;
  c->preferred.max = 30; /* reaches outside the required range */
  ck_assert (!bw_criteria_set_add (set, c, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "outside the required");
  g_clear_error (&error);
  ck_assert (!bw_criteria_set_add (set, criterion ("d", BW_Q_G, 1, FALSE, 0, FALSE, 0), &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "neither");
  ck_assert_uint_eq (set->criteria->len, 1);
}
END_TEST

START_TEST (test_check_governing_and_filters)
{
  g_autoptr (BwProject) p = small_plant ();
  g_autoptr (BwResults) r = bw_project_evaluate (p, NULL);
  g_autoptr (BwCriteriaSet) set = bw_criteria_set_new ("t", "t");
  g_autoptr (GArray) checks = NULL;
  const guint basin = 1u << BW_ELEMENT_RECTANGULAR_BASIN;
  BwCriterion *c;
  const BwCheck *k;
  guint counts[4];

  ck_assert_ptr_nonnull (r);
  /* Overflow <= 2 m/h (5.556e-4 m/s): fails at maximum day with the standby out (3.6 m/h). */
  c = criterion ("sor", BW_Q_OVERFLOW_RATE, basin, FALSE, 0, TRUE, 2.0 / 3600);
  c->cases.flows = 1u << BW_FLOW_MAXIMUM_DAY;
  ck_assert (bw_criteria_set_add (set, c, NULL));
  /* The same limit all in service only: 1.8 m/h passes. */
  c = criterion ("sor-all", BW_Q_OVERFLOW_RATE, basin, FALSE, 0, TRUE, 2.0 / 3600);
  c->cases.flows = 1u << BW_FLOW_MAXIMUM_DAY;
  c->cases.services = 1u << BW_SERVICE_ALL_IN_SERVICE;
  ck_assert (bw_criteria_set_add (set, c, NULL));
  /* Detention >= 1 h: the governing case is the shortest time, peak hour with the standby out. */
  c = criterion ("t", BW_Q_DETENTION, basin, TRUE, 3600, FALSE, 0);
  ck_assert (bw_criteria_set_add (set, c, NULL));
  /* A criterion for a unit type the plant lacks. */
  ck_assert (bw_criteria_set_add (set, criterion ("rm", BW_Q_G, 1u << BW_ELEMENT_RAPID_MIX, TRUE, 1, FALSE, 0), NULL));

  checks = bw_check_results (r, set);
  ck_assert_uint_eq (checks->len, 4);
  k = &g_array_index (checks, BwCheck, 0);
  ck_assert_int_eq (k->status, BW_CHECK_FAIL);
  bw_assert_rel (k->value, 1e-3, 1e-12);
  ck_assert (k->limit_is_max && k->limit_is_required);
  ck_assert_int_eq (r->cases[k->governing_case].service, BW_SERVICE_FIRM);
  k = &g_array_index (checks, BwCheck, 1);
  ck_assert_int_eq (k->status, BW_CHECK_PASS);
  bw_assert_rel (k->value, 0.5e-3, 1e-12);
  k = &g_array_index (checks, BwCheck, 2);
  ck_assert_int_eq (k->status, BW_CHECK_FAIL); /* 0.6 m3/s through 1600 m3: 2667 s < 3600 s */
  bw_assert_rel (k->value, 1600.0 / 0.6, 1e-12);
  ck_assert_int_eq (r->cases[k->governing_case].flow, BW_FLOW_PEAK_HOUR);
  k = &g_array_index (checks, BwCheck, 3);
  ck_assert_int_eq (k->status, BW_CHECK_NOT_APPLICABLE);
  ck_assert_int_eq (k->element, -1);
  bw_checks_count (checks, counts);
  ck_assert_uint_eq (counts[BW_CHECK_FAIL], 2);
  ck_assert_uint_eq (counts[BW_CHECK_PASS], 1);
  ck_assert_uint_eq (counts[BW_CHECK_NOT_APPLICABLE], 1);
}
END_TEST

START_TEST (test_validate_errors)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) p = small_plant ();
  BwProcessUnit *b = bw_project_find_unit (p, "sed", NULL);
  BwProcessUnit *f;

  ck_assert (bw_project_validate (p, NULL));
  b->n_standby = 2;
  ck_assert (!bw_project_validate (p, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "leaves none");
  g_clear_error (&error);
  b->n_standby = 1;
  p->basis.flow_m3_s[BW_FLOW_PEAK_HOUR] = 0.3;
  ck_assert (!bw_project_validate (p, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "peak hour flow");
  g_clear_error (&error);
  p->basis.flow_m3_s[BW_FLOW_PEAK_HOUR] = 0.6;
  p->basis.temperature_K[BW_TEMP_COLDEST] = 300;
  ck_assert (!bw_project_validate (p, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "coldest temperature");
  g_clear_error (&error);
  p->basis.temperature_K[BW_TEMP_COLDEST] = 278.15;
  f = bw_process_unit_new (BW_PROCESS_FLOCCULATOR, "floc", NULL);
  g_ptr_array_add (((BwTrain *) g_ptr_array_index (p->trains, 0))->units, f);
  ck_assert (!bw_project_validate (p, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "at least one stage");
  g_clear_error (&error);
  g_ptr_array_add (f->stages, bw_process_unit_new (BW_STAGE_PADDLE, "sed", NULL));
  ck_assert (!bw_project_validate (p, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "used twice");
  g_clear_error (&error);
  ck_assert (!bw_process_unit_set (b, "length", -3, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "length");
  g_clear_error (&error);
  ck_assert (!bw_process_unit_set (b, "length", NAN, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE, "length");
  ck_assert (bw_process_unit_get (b, "length") == 40); /* refused values are not applied */
}
END_TEST

START_TEST (test_load_case_ids)
{
  BwLoadCase c = { BW_FLOW_PEAK_HOUR, BW_TEMP_COLDEST, BW_SERVICE_FIRM, TRUE }, d;
  g_autofree char *id = bw_load_case_id (&c);

  ck_assert_str_eq (id, "peak-hour/coldest/firm");
  ck_assert (bw_load_case_parse_id (id, &d));
  ck_assert (d.flow == c.flow && d.temp == c.temp && d.service == c.service);
  ck_assert (!bw_load_case_parse_id ("peak-hour/tepid/firm", &d));
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("evaluate");
  TCase *tc = tcase_create ("project");

  tcase_add_test (tc, test_cases_generated);
  tcase_add_test (tc, test_firm_capacity_flow);
  tcase_add_test (tc, test_evaluate_basin_by_hand);
  tcase_add_test (tc, test_evaluate_liquid_feed_and_sludge_volume);
  tcase_add_test (tc, test_validate_errors);
  tcase_add_test (tc, test_load_case_ids);
  suite_add_tcase (s, tc);
  tc = tcase_create ("checks");
  tcase_add_test (tc, test_grade);
  tcase_add_test (tc, test_criteria_set_coherence);
  tcase_add_test (tc, test_check_governing_and_filters);
  suite_add_tcase (s, tc);
  return s;
}
