/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-review.c: bw_project_diff tags each change with its process unit (issue #8). */
#include "config.h"

#include <string.h>

#include "bw-test.h"
#include "engine/bw-review.h"

/* One train: a rapid mix and a rectangular basin; maximum day 0.4 m3/s, 5 and 25 degC (values
 * arbitrary but valid: derived, no source needed). */
static BwProject *
plant (void)
{
  BwProject *p = bw_project_new ();
  BwTrain *t = bw_train_new ("t1", "Train 1");

  p->name = g_strdup ("review plant");
  p->basis.flow_m3_s[BW_FLOW_MAXIMUM_DAY] = 0.4;
  p->basis.flows_given = 1u << BW_FLOW_MAXIMUM_DAY;
  p->basis.temperature_K[BW_TEMP_COLDEST] = 278.15;
  p->basis.temperature_K[BW_TEMP_WARMEST] = 298.15;
  g_ptr_array_add (t->units, bw_process_unit_new (BW_PROCESS_RAPID_MIX, "rm", "Mix"));
  g_ptr_array_add (t->units, bw_process_unit_new (BW_PROCESS_RECTANGULAR_BASIN, "sed", "Basin"));
  g_ptr_array_add (p->trains, t);
  bw_project_generate_cases (p);
  ck_assert (bw_project_validate (p, NULL));
  return p;
}

START_TEST (test_diff_tags_unit_changes)
{
  g_autoptr (GPtrArray) changes = NULL;
  BwProject *a = plant ();
  BwProject *b = bw_project_copy (a);
  BwProcessUnit *sed = bw_project_find_unit (b, "sed", NULL);
  const int iw = bw_param_index (BW_PROCESS_RECTANGULAR_BASIN, "width");
  guint n_sed = 0, n_basis = 0;

  ck_assert (sed != NULL && iw >= 0);
  sed->values[iw] = 15.0;            /* was 12.0, the default (bw-params.c) */
  b->basis.temperature_K[BW_TEMP_COLDEST] = 280.15;
  changes = bw_project_diff (a, b, NULL, NULL, NULL, NULL);
  for (guint i = 0; i < changes->len; i++)
    {
      const BwChange *c = g_ptr_array_index (changes, i);
      ck_assert_int_eq (c->kind, BW_CHANGE_INPUT);
      if (strcmp (c->where, "sed") == 0)
        {
          n_sed++;
          ck_assert_str_eq (c->what, "width");
          ck_assert_str_eq (c->unit_id, "sed");
          ck_assert_int_eq (c->unit_type, BW_PROCESS_RECTANGULAR_BASIN);
          ck_assert (c->numeric);
          ck_assert_int_eq (c->quantity_kind, BW_KIND_LENGTH); /* bw-params.c table */
        }
      else
        {
          n_basis++;
          ck_assert_str_eq (c->where, "design basis");
          ck_assert_ptr_null (c->unit_id);
          ck_assert_int_eq (c->quantity_kind, BW_KIND_TEMPERATURE);
        }
    }
  ck_assert_uint_eq (n_sed, 1);   /* derived: one parameter changed */
  ck_assert_uint_eq (n_basis, 1); /* derived: one temperature changed */
  bw_project_free (a);
  bw_project_free (b);
}
END_TEST

START_TEST (test_diff_tags_added_and_retyped_units)
{
  g_autoptr (GPtrArray) changes = NULL;
  BwProject *a = plant ();
  BwProject *b = bw_project_copy (a);
  BwTrain *t = g_ptr_array_index (b->trains, 0);
  guint seen = 0;

  g_ptr_array_add (t->units, bw_process_unit_new (BW_PROCESS_PLATE_SETTLER, "plates", "Plates"));
  changes = bw_project_diff (a, b, NULL, NULL, NULL, NULL);
  for (guint i = 0; i < changes->len; i++)
    {
      const BwChange *c = g_ptr_array_index (changes, i);
      if (strcmp (c->where, "plates") == 0)
        {
          seen++;
          ck_assert_str_eq (c->unit_id, "plates");
          ck_assert_int_eq (c->unit_type, BW_PROCESS_PLATE_SETTLER);
          ck_assert (!c->has_old && c->has_new && !c->numeric);
        }
    }
  ck_assert_uint_eq (seen, 1); /* derived: one unit added */
  bw_project_free (a);
  bw_project_free (b);
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("review");
  TCase *tc = tcase_create ("diff");

  tcase_add_test (tc, test_diff_tags_unit_changes);
  tcase_add_test (tc, test_diff_tags_added_and_retyped_units);
  suite_add_tcase (s, tc);
  return s;
}
