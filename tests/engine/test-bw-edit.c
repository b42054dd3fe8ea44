/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-edit.c: edit commands (apply/revert) and the undo/redo stack with its saved marker. */
#include "config.h"

#include <string.h>

#include "bw-test.h"
#include "engine/bw-edit.h"
#include "engine/bw-error.h"

/* One train: rapid mix, a flocculator with one paddle stage, a rectangular basin.
 * Flows (m3/s): maximum day 0.4 only; 5 and 25 degC (values are arbitrary but valid). */
static BwProject *
plant (void)
{
  BwProject *p = bw_project_new ();
  BwTrain *t = bw_train_new ("t1", "Train 1");
  BwProcessUnit *floc = bw_process_unit_new (BW_PROCESS_FLOCCULATOR, "floc", "Floc");

  p->name = g_strdup ("edit plant");
  p->basis.flow_m3_s[BW_FLOW_MAXIMUM_DAY] = 0.4;
  p->basis.flows_given = 1u << BW_FLOW_MAXIMUM_DAY;
  p->basis.temperature_K[BW_TEMP_COLDEST] = 278.15;
  p->basis.temperature_K[BW_TEMP_WARMEST] = 298.15;
  g_ptr_array_add (t->units, bw_process_unit_new (BW_PROCESS_RAPID_MIX, "rm", "Mix"));
  g_ptr_array_add (floc->stages, bw_process_unit_new (BW_STAGE_PADDLE, "floc-s1", "Stage 1"));
  g_ptr_array_add (t->units, floc);
  g_ptr_array_add (t->units, bw_process_unit_new (BW_PROCESS_RECTANGULAR_BASIN, "sed", "Basin"));
  g_ptr_array_add (p->trains, t);
  bw_project_generate_cases (p);
  ck_assert (bw_project_validate (p, NULL));
  return p;
}

static const char *
unit_id_at (const BwProject *p, guint k)
{
  const BwTrain *t = g_ptr_array_index (p->trains, 0);
  return ((BwProcessUnit *) g_ptr_array_index (t->units, k))->id;
}

START_TEST (test_edit_set_param_apply_revert)
{
  g_autoptr (BwProject) p = plant ();
  g_autoptr (BwProject) before = bw_project_copy (p);
  g_autoptr (BwEdit) e = bw_edit_set_param ("sed", "length", 18.288);

  ck_assert (bw_edit_apply (e, p, NULL));
  ck_assert_double_eq (bw_process_unit_get (bw_project_find_unit (p, "sed", NULL), "length"), 18.288);
  ck_assert_str_eq (bw_edit_get_label (e), "Set length of Basin");
  ck_assert (!bw_edit_changes_layout (e));
  bw_edit_revert (e, p);
  ck_assert (bw_project_equal (p, before));
}
END_TEST

START_TEST (test_edit_invalid_not_applied)
{
  g_autoptr (BwProject) p = plant ();
  g_autoptr (BwProject) before = bw_project_copy (p);
  g_autoptr (GError) error = NULL;
  g_autoptr (BwEdit) e = bw_edit_set_param ("sed", "length", -3);
  g_autoptr (BwEdit) s = bw_edit_set_counts ("rm", 2, 2);

  ck_assert (!bw_edit_apply (e, p, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "length");
  ck_assert (bw_project_equal (p, before));
  g_clear_error (&error);
  /* standby must stay below parallel: the validation refuses and the edit is undone. */
  ck_assert (!bw_edit_apply (s, p, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "standby");
  ck_assert (bw_project_equal (p, before));
}
END_TEST

/* A snapshot changes several things at once, undoes and redoes them as one edit, and an
 * invalid snapshot leaves the project as it was. */
START_TEST (test_edit_snapshot)
{
  g_autoptr (BwProject) p = plant ();
  g_autoptr (BwProject) before = bw_project_copy (p);
  g_autoptr (BwProject) after = bw_project_copy (p);
  g_autoptr (BwProject) bad = bw_project_copy (p);
  g_autoptr (GError) error = NULL;
  BwEditStack *stack = bw_edit_stack_new ();

  ck_assert (bw_process_unit_set (bw_project_find_unit (after, "sed", NULL), "length", 40, NULL));
  ck_assert (bw_process_unit_set (bw_project_find_unit (after, "sed", NULL), "width", 9, NULL));
  g_free (after->name);
  after->name = g_strdup ("renamed plant");
  ck_assert (bw_edit_stack_do (stack, p, bw_edit_snapshot (after, "Apply a design", "sed"),
                               NULL, NULL, NULL));
  ck_assert (bw_project_equal (p, after));
  ck_assert_str_eq (bw_edit_get_label (bw_edit_stack_peek_undo (stack)), "Apply a design");
  ck_assert_str_eq (bw_edit_get_unit_id (bw_edit_stack_peek_undo (stack)), "sed");
  ck_assert (bw_edit_stack_undo (stack, p));
  ck_assert (bw_project_equal (p, before));
  ck_assert (bw_edit_stack_redo (stack, p));
  ck_assert (bw_project_equal (p, after));
  ck_assert (bw_edit_stack_undo (stack, p));

  /* Standby equal to parallel is refused by validation: nothing changes. */
  bw_project_find_unit (bad, "rm", NULL)->n_standby = bw_project_find_unit (bad, "rm", NULL)->n_parallel;
  ck_assert (!bw_edit_stack_do (stack, p, bw_edit_snapshot (bad, "Bad", NULL), NULL, NULL, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "standby");
  ck_assert (bw_project_equal (p, before));
  bw_edit_stack_free (stack);
}
END_TEST

START_TEST (test_edit_counts_regenerates_firm_cases)
{
  g_autoptr (BwProject) p = plant ();
  g_autoptr (BwEdit) e = bw_edit_set_counts ("rm", 2, 1);

  /* One flow x two temperatures; with a standby, x two service states. */
  ck_assert_uint_eq (p->cases->len, 2);
  ck_assert (bw_edit_apply (e, p, NULL));
  ck_assert_uint_eq (p->cases->len, 4);
  bw_edit_revert (e, p);
  ck_assert_uint_eq (p->cases->len, 2);
  ck_assert_uint_eq (bw_project_find_unit (p, "rm", NULL)->n_parallel, 1);
}
END_TEST

START_TEST (test_edit_add_remove_move_duplicate)
{
  g_autoptr (BwProject) p = plant ();
  g_autoptr (BwProject) before = bw_project_copy (p);
  g_autoptr (BwEditStack) st = bw_edit_stack_new ();
  g_autoptr (GError) error = NULL;
  const BwTrain *t = g_ptr_array_index (p->trains, 0);
  const BwProcessUnit *floc;

  ck_assert (bw_edit_stack_do (st, p, bw_edit_add_unit ("t1", NULL, 1, BW_PROCESS_INLINE_MIXER),
                               NULL, NULL, &error));
  ck_assert_uint_eq (t->units->len, 4);
  ck_assert_str_eq (unit_id_at (p, 1), "inline-mixer-1");
  ck_assert_str_eq (bw_edit_get_unit_id (bw_edit_stack_peek_undo (st)), "inline-mixer-1");
  ck_assert (bw_edit_changes_layout (bw_edit_stack_peek_undo (st)));
  ck_assert (bw_edit_stack_do (st, p, bw_edit_move_unit ("inline-mixer-1", -1), NULL, NULL, NULL));
  ck_assert_str_eq (unit_id_at (p, 0), "inline-mixer-1");
  /* already first: refused with a reason, nothing changed */
  ck_assert (!bw_edit_stack_do (st, p, bw_edit_move_unit ("inline-mixer-1", -1), NULL, NULL, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "already first");
  g_clear_error (&error);
  ck_assert (bw_edit_stack_do (st, p, bw_edit_duplicate_unit ("floc"), NULL, NULL, NULL));
  ck_assert_uint_eq (t->units->len, 5);
  floc = bw_project_find_unit (p, "floc-1", NULL);
  ck_assert_ptr_nonnull (floc);
  ck_assert_str_eq (floc->name, "Floc (copy)");
  ck_assert_uint_eq (floc->stages->len, 1);
  ck_assert_str_ne (((BwProcessUnit *) g_ptr_array_index (floc->stages, 0))->id, "floc-s1");
  ck_assert (bw_project_validate (p, NULL));
  ck_assert (bw_edit_stack_do (st, p, bw_edit_add_unit (NULL, "floc", 5, BW_STAGE_TURBINE),
                               NULL, NULL, NULL));
  ck_assert_uint_eq (bw_project_find_unit (p, "floc", NULL)->stages->len, 2);
  ck_assert (bw_edit_stack_do (st, p, bw_edit_remove_unit ("sed"), NULL, NULL, NULL));
  ck_assert_ptr_null (bw_project_find_unit (p, "sed", NULL));
  /* the last stage of a flocculator cannot go */
  ck_assert (!bw_edit_stack_do (st, p, bw_edit_remove_unit ("floc-1-1"), NULL, NULL, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "at least one stage");
  /* undo everything: the model is back value for value */
  while (bw_edit_stack_undo (st, p))
    ;
  ck_assert (bw_project_equal (p, before));
  while (bw_edit_stack_redo (st, p))
    ;
  ck_assert_ptr_null (bw_project_find_unit (p, "sed", NULL));
  ck_assert_uint_eq (t->units->len, 4);
}
END_TEST

START_TEST (test_edit_basis_and_cases)
{
  g_autoptr (BwProject) p = plant ();
  g_autoptr (BwProject) before = bw_project_copy (p);
  g_autoptr (BwEditStack) st = bw_edit_stack_new ();
  g_autoptr (GError) error = NULL;

  ck_assert (bw_edit_stack_do (st, p, bw_edit_set_case_enabled (1, FALSE), NULL, NULL, NULL));
  ck_assert (!g_array_index (p->cases, BwLoadCase, 1).enabled);
  /* a new flow adds its cases and keeps the disabled one disabled */
  ck_assert (bw_edit_stack_do (st, p, bw_edit_set_flow (BW_FLOW_PEAK_HOUR, TRUE, 0.6), NULL, NULL, NULL));
  ck_assert_uint_eq (p->cases->len, 4);
  ck_assert (!g_array_index (p->cases, BwLoadCase, 1).enabled);
  /* peak below maximum day is refused by validation */
  ck_assert (!bw_edit_stack_do (st, p, bw_edit_set_flow (BW_FLOW_PEAK_HOUR, TRUE, 0.2), NULL, NULL, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "peak hour flow");
  g_clear_error (&error);
  ck_assert (!bw_edit_stack_do (st, p, bw_edit_set_flow (BW_FLOW_MAXIMUM_DAY, FALSE, 0), NULL, NULL, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "maximum-day");
  g_clear_error (&error);
  ck_assert (!bw_edit_stack_do (st, p, bw_edit_set_temperature (BW_TEMP_COLDEST, 273.15 + 30),
                                NULL, NULL, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "coldest");
  ck_assert (bw_edit_stack_do (st, p, bw_edit_set_raw_water (BW_RAW_PH, 6.5), NULL, NULL, NULL));
  ck_assert (bw_edit_stack_do (st, p, bw_edit_set_criteria ("recommended-standards-2018"), NULL, NULL, NULL));
  ck_assert (bw_edit_stack_do (st, p, bw_edit_rename_unit ("floc-s1", "First stage"), NULL, NULL, NULL));
  ck_assert (bw_edit_stack_do (st, p, bw_edit_set_project_name ("Renamed"), NULL, NULL, NULL));
  ck_assert_str_eq (bw_project_find_unit (p, "floc-s1", NULL)->name, "First stage");
  while (bw_edit_stack_undo (st, p))
    ;
  ck_assert (bw_project_equal (p, before));
}
END_TEST

static gboolean
refuse_all (const BwProject *p, gpointer user_data, GError **error)
{
  (void) p;
  *(int *) user_data += 1;
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY, "refused by the check");
  return FALSE;
}

START_TEST (test_stack_check_func_reverts)
{
  g_autoptr (BwProject) p = plant ();
  g_autoptr (BwProject) before = bw_project_copy (p);
  g_autoptr (BwEditStack) st = bw_edit_stack_new ();
  g_autoptr (GError) error = NULL;
  int calls = 0;

  ck_assert (!bw_edit_stack_do (st, p, bw_edit_set_param ("rm", "width", 3), refuse_all, &calls, &error));
  ck_assert_int_eq (calls, 1);
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY, "refused");
  ck_assert (bw_project_equal (p, before));
  ck_assert (!bw_edit_stack_can_undo (st));
}
END_TEST

START_TEST (test_stack_saved_marker)
{
  g_autoptr (BwProject) p = plant ();
  g_autoptr (BwEditStack) st = bw_edit_stack_new ();

  ck_assert (!bw_edit_stack_is_modified (st));
  ck_assert (bw_edit_stack_do (st, p, bw_edit_set_param ("rm", "width", 1.5), NULL, NULL, NULL));
  ck_assert (bw_edit_stack_is_modified (st));
  ck_assert (bw_edit_stack_undo (st, p));
  ck_assert (!bw_edit_stack_is_modified (st));
  ck_assert (bw_edit_stack_redo (st, p));
  bw_edit_stack_mark_saved (st);
  ck_assert (!bw_edit_stack_is_modified (st));
  ck_assert (bw_edit_stack_undo (st, p));
  ck_assert (bw_edit_stack_is_modified (st));
  /* a new edit replaces the redo branch that held the saved state: modified for good */
  ck_assert (bw_edit_stack_do (st, p, bw_edit_set_param ("rm", "width", 1.7), NULL, NULL, NULL));
  ck_assert (bw_edit_stack_is_modified (st));
  ck_assert (bw_edit_stack_undo (st, p));
  ck_assert (bw_edit_stack_is_modified (st));
  ck_assert (!bw_edit_stack_can_undo (st));
  ck_assert (bw_edit_stack_can_redo (st));
  ck_assert_str_eq (bw_edit_get_label (bw_edit_stack_peek_redo (st)), "Set width or diameter of Mix");
  bw_edit_stack_clear (st, TRUE);
  ck_assert (!bw_edit_stack_is_modified (st));
  ck_assert (!bw_edit_stack_can_redo (st));
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("edit");
  TCase *tc = tcase_create ("commands");

  tcase_add_test (tc, test_edit_set_param_apply_revert);
  tcase_add_test (tc, test_edit_invalid_not_applied);
  tcase_add_test (tc, test_edit_snapshot);
  tcase_add_test (tc, test_edit_counts_regenerates_firm_cases);
  tcase_add_test (tc, test_edit_add_remove_move_duplicate);
  tcase_add_test (tc, test_edit_basis_and_cases);
  suite_add_tcase (s, tc);
  tc = tcase_create ("stack");
  tcase_add_test (tc, test_stack_check_func_reverts);
  tcase_add_test (tc, test_stack_saved_marker);
  suite_add_tcase (s, tc);
  return s;
}
