/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-window.c: the real window, built from the real .ui resources, driven through its
 * widgets: typed values with units, refused input, unit systems, unit edits, undo, files. */
#include "config.h"

#include <check.h>
#include <math.h>
#include <string.h>

#include <glib/gi18n.h>

#include "bw-gui-test.h"
#include "engine/bw-error.h"
#include "engine/bw-project.h"
#include "io/bw-criteria-xml.h"
#include "io/bw-project-xml.h"

static BwApplication *app;
static char *tmpdir;

static double
param (BwWindow *w, const char *unit, const char *id)
{
  const BwProcessUnit *u = bw_project_find_unit (bw_window_get_project (w), unit, NULL);

  ck_assert_ptr_nonnull (u);
  return bw_process_unit_get (u, id);
}

/* Types TEXT into the entry of FIELD and presses Enter. */
static GtkWidget *
type_into (BwWindow *w, const char *field, const char *text)
{
  GtkWidget *e = bw_window_get_field_widget (w, field);

  ck_assert_msg (GTK_IS_ENTRY (e), "field %s is not an entry", field);
  gtk_editable_set_text (GTK_EDITABLE (e), text);
  g_signal_emit_by_name (e, "activate");
  bw_gui_test_pump (5);
  return e;
}

static const char *
text_of (GtkWidget *w)
{
  return gtk_editable_get_text (GTK_EDITABLE (w));
}

START_TEST (test_window_shows_demo)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  const BwProject *p = bw_window_get_project (w);
  GtkWidget *e;

  ck_assert_uint_eq (p->trains->len, 3);
  ck_assert_str_eq (gtk_window_get_title (GTK_WINDOW (w)), "Alder Creek WTP, Marrowby (demo) — Basinwright");
  ck_assert (!bw_window_is_modified (w));
  {
    /* the caution banner: a label carrying BW_CAUTION_TEXT is on screen (pages may repeat it;
     * the window's banner is the one mapped whatever page is shown) */
    GtkWidget *found = NULL;
    GtkWidget *stack[64];
    int top = 0;
    stack[top++] = GTK_WIDGET (w);
    while (top > 0 && !found)
      {
        GtkWidget *x = stack[--top];
        if (GTK_IS_LABEL (x) && g_strcmp0 (gtk_label_get_text (GTK_LABEL (x)), _(BW_CAUTION_TEXT)) == 0
            && gtk_widget_get_mapped (x))
          found = x;
        for (GtkWidget *c = gtk_widget_get_first_child (x); c && top < 63; c = gtk_widget_get_next_sibling (c))
          stack[top++] = c;
      }
    ck_assert_ptr_nonnull (found);
    ck_assert (gtk_widget_get_mapped (found));
  }
  ck_assert (bw_window_select_unit (w, "north-sed"));
  ck_assert_str_eq (bw_window_get_selected_id (w), "north-sed");
  e = bw_window_get_field_widget (w, "length");
  /* 56 m from the demo file, formatted by the engine (four significant figures). */
  ck_assert_str_eq (text_of (e), "56.00 m");
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_typed_feet_are_applied)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkWidget *e;

  bw_window_select_unit (w, "north-sed");
  e = type_into (w, "length", "60 ft");
  /* 60 ft x 0.3048 m/ft = 18.288 m exactly (international foot, by definition). */
  ck_assert_double_eq_tol (param (w, "north-sed", "length"), 18.288, 1e-12);
  ck_assert_str_eq (text_of (e), "18.29 m");
  ck_assert (!gtk_widget_has_css_class (e, "error"));
  ck_assert (bw_window_is_modified (w));
  ck_assert (g_str_has_prefix (gtk_window_get_title (GTK_WINDOW (w)), "• "));
  bw_gui_test_close_window (w);
}
END_TEST

/* The label showing a value in the results table, row ROW_TEXT (a substring of the quantity's
 * name in column 0), column COL; NULL when there is none. */
static GtkLabel *
results_value_label (BwWindow *w, const char *row_text, int col)
{
  for (int r = 1; r < 200; r++)
    {
      GtkWidget *ql = bw_window_get_results_cell (w, 0, r), *v;
      if (ql == NULL || strstr (gtk_label_get_text (GTK_LABEL (ql)), row_text) == NULL)
        continue;
      v = bw_window_get_results_cell (w, col, r);
      return v ? GTK_LABEL (v) : NULL;
    }
  return NULL;
}

/* An edit that keeps the table's shape updates its labels in place (the same widgets, the new
 * values); another unit, or the every-case columns, build a new table. */
START_TEST (test_results_update_in_place)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkLabel *before, *after, *other;
  double v0, v1;

  bw_window_select_unit (w, "north-sed");
  bw_gui_test_pump (3);
  before = results_value_label (w, "volume", 1);
  ck_assert_ptr_nonnull (before);
  v0 = g_ascii_strtod (gtk_label_get_text (before), NULL);
  ck_assert_double_gt (v0, 0);
  g_object_ref (before);
  type_into (w, "length", "50 m");
  after = results_value_label (w, "volume", 1);
  ck_assert_ptr_eq (after, before);
  /* The volume follows the length: 50/56 of what it was (derived; four significant figures). */
  v1 = g_ascii_strtod (gtk_label_get_text (after), NULL);
  ck_assert_double_eq_tol (v1 / v0, 50.0 / 56.0, 1e-3);
  /* Undo puts the old value back in the same label. */
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.undo", NULL));
  bw_gui_test_pump (3);
  ck_assert_ptr_eq (results_value_label (w, "volume", 1), before);
  ck_assert_double_eq (g_ascii_strtod (gtk_label_get_text (before), NULL), v0);

  /* Every load case: another shape, new labels (16 value columns). */
  gtk_toggle_button_set_active (GTK_TOGGLE_BUTTON (bw_window_get_field_widget (w, "every-case")), TRUE);
  bw_gui_test_pump (3);
  other = results_value_label (w, "volume", 1);
  ck_assert_ptr_nonnull (other);
  ck_assert_ptr_ne (other, before);
  ck_assert_ptr_nonnull (results_value_label (w, "volume", 16));
  gtk_toggle_button_set_active (GTK_TOGGLE_BUTTON (bw_window_get_field_widget (w, "every-case")), FALSE);
  /* Another unit: a table of its own. */
  bw_window_select_unit (w, "north-rm");
  bw_gui_test_pump (3);
  other = results_value_label (w, "volume", 1);
  ck_assert_ptr_nonnull (other);
  ck_assert_ptr_ne (other, before);
  g_object_unref (before);
  bw_gui_test_close_window (w);
}
END_TEST

/* The renderer choice: a user's GSK_RENDERER stands; without one, cairo exactly when the machine
 * has no GPU render node. */
START_TEST (test_renderer_choice)
{
  g_autofree char *old = g_strdup (g_getenv ("GSK_RENDERER"));
  g_autoptr (GDir) dri = g_dir_open ("/dev/dri", 0, NULL);
  gboolean gpu = FALSE;
  const char *name;

  while (dri && (name = g_dir_read_name (dri)))
    gpu |= g_str_has_prefix (name, "renderD");
  g_setenv ("GSK_RENDERER", "gl", TRUE);
  ck_assert (!bw_application_choose_renderer ());
  ck_assert_str_eq (g_getenv ("GSK_RENDERER"), "gl");
  g_unsetenv ("GSK_RENDERER");
  ck_assert (bw_application_choose_renderer () == !gpu);
  if (gpu)
    ck_assert_ptr_null (g_getenv ("GSK_RENDERER"));
  else
    ck_assert_str_eq (g_getenv ("GSK_RENDERER"), "cairo");
  if (old)
    g_setenv ("GSK_RENDERER", old, TRUE);
  else
    g_unsetenv ("GSK_RENDERER");
}
END_TEST

START_TEST (test_wrong_kind_is_flagged_not_applied)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  g_autoptr (GError) expect = NULL;
  GtkWidget *e, *err;
  double v;

  bw_window_select_unit (w, "north-sed");
  e = type_into (w, "length", "12 kg");
  ck_assert_double_eq (param (w, "north-sed", "length"), 56.0);
  ck_assert (gtk_widget_has_css_class (e, "error"));
  ck_assert_str_eq (text_of (e), "12 kg"); /* the typed text stays for correcting */
  err = bw_window_get_field_error (w, "length");
  ck_assert (gtk_widget_get_visible (err));
  /* The reason shown is the engine's own message for that input. */
  ck_assert (!bw_units_parse ("12 kg", BW_KIND_LENGTH, "m", "length", &v, &expect));
  ck_assert (g_str_has_prefix (gtk_label_get_text (GTK_LABEL (err)), expect->message));
  ck_assert_str_eq (gtk_widget_get_tooltip_text (e), expect->message);
  /* ... and under it, that the results on screen are still for the model's 56 m (derived). */
  ck_assert_msg (strstr (gtk_label_get_text (GTK_LABEL (err)), "Not applied: the results are for 56.00 m.") != NULL,
                 "%s", gtk_label_get_text (GTK_LABEL (err)));
  ck_assert (!bw_window_is_modified (w));
  /* Correcting it clears the flag. */
  type_into (w, "length", "50 m");
  ck_assert (!gtk_widget_has_css_class (e, "error"));
  ck_assert (!gtk_widget_get_visible (err));
  ck_assert_double_eq (param (w, "north-sed", "length"), 50.0);
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_out_of_range_and_garbage_flagged)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkWidget *e, *err;
  g_autofree char *results = NULL;

  bw_window_select_unit (w, "north-sed");
  e = type_into (w, "length", "-5 m");
  err = bw_window_get_field_error (w, "length");
  ck_assert (gtk_widget_has_css_class (e, "error"));
  ck_assert_msg (strstr (gtk_label_get_text (GTK_LABEL (err)), "valid range") != NULL, "%s",
                 gtk_label_get_text (GTK_LABEL (err)));
  ck_assert_double_eq (param (w, "north-sed", "length"), 56.0);
  type_into (w, "length", "nan");
  ck_assert (gtk_widget_has_css_class (e, "error"));
  ck_assert_double_eq (param (w, "north-sed", "length"), 56.0);
  type_into (w, "width", "");
  ck_assert (gtk_widget_has_css_class (bw_window_get_field_widget (w, "width"), "error"));
  ck_assert_double_eq (param (w, "north-sed", "width"), 2.8);
  results = bw_window_dup_results_text (w);
  ck_assert (strstr (results, "overflow rate") != NULL);
  ck_assert (strstr (results, "nan") == NULL && strstr (results, "inf") == NULL);
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_unit_system_reformats)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkWidget *e;
  g_autofree char *us = bw_units_format (56.0, BW_KIND_LENGTH, BW_UNIT_SYSTEM_US);
  g_autofree char *flow_us = bw_units_format (0.35, BW_KIND_FLOW, BW_UNIT_SYSTEM_US);

  bw_window_select_unit (w, "north-sed");
  e = bw_window_get_field_widget (w, "length");
  bw_application_set_unit_system (app, BW_UNIT_SYSTEM_US);
  bw_gui_test_pump (5);
  /* 56 m = 183.727 ft: the engine's US formatting */
  ck_assert_str_eq (us, "183.7 ft");
  ck_assert_str_eq (text_of (e), us);
  ck_assert_str_eq (text_of (bw_window_get_field_widget (w, "flow:maximum-day")), flow_us);
  /* A bare number is read in the unit shown: 100 (ft) */
  type_into (w, "length", "100");
  ck_assert_double_eq_tol (param (w, "north-sed", "length"), 30.48, 1e-12);
  bw_application_set_unit_system (app, BW_UNIT_SYSTEM_SI);
  bw_gui_test_pump (5);
  ck_assert_str_eq (text_of (e), "30.48 m");
  bw_gui_test_close_window (w);
}
END_TEST

static guint
index_in_train (BwWindow *w, const char *train, const char *id)
{
  const BwProject *p = bw_window_get_project (w);

  for (guint i = 0; i < p->trains->len; i++)
    {
      const BwTrain *t = g_ptr_array_index (p->trains, i);
      if (g_strcmp0 (t->id, train) != 0)
        continue;
      for (guint k = 0; k < t->units->len; k++)
        if (g_strcmp0 (((BwProcessUnit *) g_ptr_array_index (t->units, k))->id, id) == 0)
          return k;
    }
  return G_MAXUINT;
}

START_TEST (test_add_move_remove_and_undo)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  const BwTrain *north = g_ptr_array_index (bw_window_get_project (w)->trains, 0);
  const char *added;

  bw_window_select_unit (w, "north-rm");
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.add-unit", "s", "inline-mixer"));
  ck_assert_uint_eq (north->units->len, 4);
  added = bw_window_get_selected_id (w);
  ck_assert_str_eq (added, "inline-mixer-1");
  ck_assert_uint_eq (index_in_train (w, "north", "inline-mixer-1"), 1);
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.move-up", NULL));
  ck_assert_uint_eq (index_in_train (w, "north", "inline-mixer-1"), 0);
  ck_assert_uint_eq (index_in_train (w, "north", "north-rm"), 1);
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.move-down", NULL));
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.move-down", NULL));
  ck_assert_uint_eq (index_in_train (w, "north", "inline-mixer-1"), 2);
  /* a stage for the selected flocculator */
  bw_window_select_unit (w, "north-floc-3");
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.add-unit", "s", "turbine-stage"));
  ck_assert_uint_eq (bw_project_find_unit (bw_window_get_project (w), "north-floc", NULL)->stages->len, 4);
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.duplicate-unit", NULL));
  ck_assert_uint_eq (bw_project_find_unit (bw_window_get_project (w), "north-floc", NULL)->stages->len, 5);
  bw_window_select_unit (w, "north-sed");
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.remove-unit", NULL));
  ck_assert_ptr_null (bw_project_find_unit (bw_window_get_project (w), "north-sed", NULL));
  /* undo all seven edits (add, up, down, down, add stage, duplicate, remove): the file again */
  for (int i = 0; i < 7; i++)
    ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.undo", NULL));
  {
    g_autofree char *demo = bw_gui_test_demo_path ();
    g_autoptr (BwProject) file = bw_project_load (demo, NULL);
    ck_assert (bw_project_equal (bw_window_get_project (w), file));
  }
  ck_assert (!bw_window_is_modified (w));
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_undo_redo_restore_value)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkWidget *e;

  bw_window_select_unit (w, "north-sed");
  e = type_into (w, "length", "60 ft");
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.undo", NULL));
  bw_gui_test_pump (5);
  e = bw_window_get_field_widget (w, "length");
  ck_assert_double_eq (param (w, "north-sed", "length"), 56.0);
  ck_assert_str_eq (text_of (e), "56.00 m");
  ck_assert (!bw_window_is_modified (w));
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.redo", NULL));
  ck_assert_double_eq_tol (param (w, "north-sed", "length"), 18.288, 1e-12);
  ck_assert_str_eq (text_of (bw_window_get_field_widget (w, "length")), "18.29 m");
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_choice_count_and_stage_fields)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkWidget *dd, *spin;

  bw_window_select_unit (w, "north-rm");
  dd = bw_window_get_field_widget (w, "impeller");
  ck_assert (GTK_IS_DROP_DOWN (dd));
  gtk_drop_down_set_selected (GTK_DROP_DOWN (dd), 2); /* hydrofoil */
  ck_assert_double_eq (param (w, "north-rm", "impeller"), 2.0);
  bw_window_select_unit (w, "north-floc-2");
  spin = bw_window_get_field_widget (w, "wheels");
  ck_assert (GTK_IS_SPIN_BUTTON (spin));
  /* three 2.2 m wheels do not fit across the 5 m basin: the engine refuses, the spin is flagged */
  gtk_spin_button_set_value (GTK_SPIN_BUTTON (spin), 3);
  ck_assert_double_eq (param (w, "north-floc-2", "wheels"), 2.0);
  ck_assert (gtk_widget_has_css_class (spin, "error"));
  ck_assert (gtk_widget_get_visible (bw_window_get_field_error (w, "wheels")));
  gtk_spin_button_set_value (GTK_SPIN_BUTTON (spin), 1);
  ck_assert_double_eq (param (w, "north-floc-2", "wheels"), 1.0);
  ck_assert (!gtk_widget_has_css_class (spin, "error"));
  type_into (w, "speed", "4 rpm");
  /* 4 rev/min = 4/60 rev/s */
  ck_assert_double_eq_tol (param (w, "north-floc-2", "speed"), 4.0 / 60.0, 1e-15);
  type_into (w, "name", "Second stage");
  ck_assert_str_eq (bw_project_find_unit (bw_window_get_project (w), "north-floc-2", NULL)->name, "Second stage");
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_design_basis_fields)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  g_autoptr (GError) expect = NULL;
  double mgd;
  GtkWidget *e;

  ck_assert (bw_units_parse ("10 MGD", BW_KIND_FLOW, NULL, "x", &mgd, NULL));
  type_into (w, "flow:future", "10 MGD");
  ck_assert (bw_window_get_project (w)->basis.flows_given & (1u << BW_FLOW_FUTURE));
  ck_assert_double_eq (bw_window_get_project (w)->basis.flow_m3_s[BW_FLOW_FUTURE], mgd);
  type_into (w, "flow:future", "");
  ck_assert (!(bw_window_get_project (w)->basis.flows_given & (1u << BW_FLOW_FUTURE)));
  /* a minimum above the average day is refused by the engine's validation */
  e = type_into (w, "flow:minimum", "0.3 m3/s");
  ck_assert (gtk_widget_has_css_class (e, "error"));
  ck_assert_double_eq (bw_window_get_project (w)->basis.flow_m3_s[BW_FLOW_MINIMUM], 0.10);
  type_into (w, "temperature:coldest", "41 F");
  /* (41 - 32) x 5/9 = 5 degC = 278.15 K */
  ck_assert_double_eq_tol (bw_window_get_project (w)->basis.temperature_K[BW_TEMP_COLDEST], 278.15, 1e-9);
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_check_activation_selects_unit)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkWidget *list = bw_window_get_checks_list (w);
  GtkWidget *row;
  int n = 0;

  for (row = gtk_widget_get_first_child (list); row; row = gtk_widget_get_next_sibling (row))
    if (g_strcmp0 (g_object_get_data (G_OBJECT (row), "bw-id"), "south-sed") == 0)
      break;
  for (GtkWidget *r = gtk_widget_get_first_child (list); r; r = gtk_widget_get_next_sibling (r))
    n++;
  ck_assert_int_gt (n, 10);
  ck_assert_ptr_nonnull (row);
  bw_window_show_page (w, "checks");
  g_signal_emit_by_name (list, "row-activated", row);
  ck_assert_str_eq (bw_window_get_selected_id (w), "south-sed");
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_save_and_reopen_equal)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  BwWindow *again;
  g_autoptr (GError) error = NULL;
  g_autofree char *path = g_build_filename (tmpdir, "saved.bwproj", NULL);

  bw_window_select_unit (w, "north-sed");
  type_into (w, "length", "60 ft");
  ck_assert (bw_window_is_modified (w));
  ck_assert_msg (bw_window_save_to (w, path, &error), "%s", error ? error->message : "");
  ck_assert (!bw_window_is_modified (w));
  ck_assert_str_eq (bw_window_get_path (w), path);
  ck_assert (!g_str_has_prefix (gtk_window_get_title (GTK_WINDOW (w)), "• "));
  {
    /* saved files join the recent projects (kept under the test's private XDG_DATA_HOME) */
    g_autofree char *uri = g_filename_to_uri (path, NULL, NULL);
    GtkRecentManager *rm = gtk_recent_manager_get_default ();
    for (int i = 0; i < 40 && !gtk_recent_manager_has_item (rm, uri); i++)
      bw_gui_test_pump (50); /* the manager adds after an asynchronous look at the file */
    ck_assert (gtk_recent_manager_has_item (rm, uri));
  }
  again = bw_window_new (app);
  ck_assert (bw_window_open_path (again, path, &error));
  ck_assert (bw_project_equal (bw_window_get_project (w), bw_window_get_project (again)));
  bw_gui_test_close_window (again);
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_autosave_written_and_recoverable)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  BwWindow *other;
  g_autofree char *path = NULL;
  g_autoptr (BwProject) copy = NULL;
  g_autofree char *dir = bw_application_dup_autosave_dir ();

  ck_assert_ptr_null (bw_window_autosave_now (w)); /* nothing to keep yet */
  bw_window_select_unit (w, "north-sed");
  type_into (w, "length", "60 ft");
  path = bw_window_autosave_now (w);
  ck_assert_ptr_nonnull (path);
  ck_assert (g_str_has_prefix (path, dir));
  ck_assert (g_str_has_prefix (dir, g_getenv ("XDG_STATE_HOME")));
  copy = bw_project_load (path, NULL);
  ck_assert_ptr_nonnull (copy);
  ck_assert (bw_project_equal (copy, bw_window_get_project (w)));
  /* another window offered the file recovers the same model, as unsaved work */
  other = bw_window_new (app);
  bw_window_offer_recovery (other, path);
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (other), "win.recover", NULL));
  ck_assert (bw_project_equal (copy, bw_window_get_project (other)));
  ck_assert (bw_window_is_modified (other));
  ck_assert (!g_file_test (path, G_FILE_TEST_EXISTS));
  bw_gui_test_close_window (other);
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_parallel_standby_spins)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkWidget *par = bw_window_get_field_widget (w, "parallel");
  GtkWidget *sb = bw_window_get_field_widget (w, "standby");
  const BwProcessUnit *u = bw_project_find_unit (bw_window_get_project (w), "east-rm", NULL);
  guint cases = bw_window_get_project (w)->cases->len;

  bw_window_select_unit (w, "east-rm");
  ck_assert_int_eq (gtk_spin_button_get_value_as_int (GTK_SPIN_BUTTON (par)), 1);
  gtk_spin_button_set_value (GTK_SPIN_BUTTON (par), 3);
  ck_assert_uint_eq (u->n_parallel, 3);
  gtk_spin_button_set_value (GTK_SPIN_BUTTON (sb), 3); /* all three on standby: refused */
  ck_assert_uint_eq (u->n_standby, 0);
  ck_assert (gtk_widget_has_css_class (sb, "error"));
  ck_assert (strstr (gtk_widget_get_tooltip_text (sb), "leaves none in service") != NULL);
  gtk_spin_button_set_value (GTK_SPIN_BUTTON (sb), 1);
  ck_assert_uint_eq (u->n_standby, 1);
  ck_assert_uint_eq (bw_window_get_project (w)->cases->len, cases); /* the demo has firm cases already */
  /* a stage has no parallel units: the spins are insensitive there */
  bw_window_select_unit (w, "east-floc-1");
  ck_assert (!gtk_widget_is_sensitive (par));
  bw_gui_test_close_window (w);
}
END_TEST

static GtkWindow *
find_toplevel (GType type, GtkWindow *not)
{
  GListModel *tops = gtk_window_get_toplevels (); /* transfer none */

  for (guint i = 0; i < g_list_model_get_n_items (tops); i++)
    {
      g_autoptr (GObject) o = g_list_model_get_item (tops, i);
      if (G_TYPE_CHECK_INSTANCE_TYPE (o, type) && (GtkWindow *) o != not)
        return GTK_WINDOW (o);
    }
  return NULL;
}

START_TEST (test_close_prompts_when_modified)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  g_autoptr (GtkWidget) keep = g_object_ref (GTK_WIDGET (w));
  GtkWindow *prompt;

  bw_window_select_unit (w, "north-sed");
  type_into (w, "length", "60 ft");
  gtk_window_close (GTK_WINDOW (w));
  bw_gui_test_pump (20);
  /* still open, asking */
  ck_assert (gtk_widget_get_visible (GTK_WIDGET (w)));
  prompt = find_toplevel (GTK_TYPE_MESSAGE_DIALOG, NULL);
  ck_assert_ptr_nonnull (prompt);
  ck_assert (gtk_window_get_transient_for (prompt) == GTK_WINDOW (w));
  gtk_dialog_response (GTK_DIALOG (prompt), GTK_RESPONSE_CANCEL);
  bw_gui_test_pump (20);
  ck_assert (gtk_widget_get_visible (GTK_WIDGET (w)));
  ck_assert (bw_window_is_modified (w));
  gtk_window_close (GTK_WINDOW (w));
  bw_gui_test_pump (20);
  prompt = find_toplevel (GTK_TYPE_MESSAGE_DIALOG, NULL);
  ck_assert_ptr_nonnull (prompt);
  gtk_dialog_response (GTK_DIALOG (prompt), 1); /* close without saving */
  bw_gui_test_pump (20);
  ck_assert (!gtk_widget_get_visible (GTK_WIDGET (w)));
}
END_TEST

START_TEST (test_about_repeats_caution)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkWindow *about;

  ck_assert (strstr (BW_CAUTION_TEXT, "licensed professional engineer") != NULL);
  g_action_group_activate_action (G_ACTION_GROUP (app), "about", NULL);
  bw_gui_test_pump (50);
  about = find_toplevel (GTK_TYPE_ABOUT_DIALOG, NULL);
  ck_assert_ptr_nonnull (about);
  ck_assert (strstr (gtk_about_dialog_get_comments (GTK_ABOUT_DIALOG (about)), BW_CAUTION_TEXT) != NULL);
  gtk_window_destroy (about);
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_every_case_table)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  g_autofree char *minmax = NULL;
  g_autofree char *every = NULL;
  const BwProject *p = bw_window_get_project (w);
  guint enabled = 0, columns = 0;

  bw_window_select_unit (w, "north-sed");
  minmax = bw_window_dup_results_text (w);
  gtk_toggle_button_set_active (GTK_TOGGLE_BUTTON (bw_window_get_field_widget (w, "every-case")), TRUE);
  every = bw_window_dup_results_text (w);
  for (guint i = 0; i < p->cases->len; i++)
    enabled += g_array_index (p->cases, BwLoadCase, i).enabled;
  /* the header row of the every-case table: the quantity column and one per enabled case */
  for (const char *c = every; *c && *c != '\n'; c++)
    columns += *c == '\t';
  ck_assert_uint_eq (columns, enabled);
  ck_assert_str_ne (minmax, every);
  /* disabling a load case removes its column */
  ck_assert (bw_window_do_edit (w, bw_edit_set_case_enabled (0, FALSE), NULL));
  g_free (every);
  every = bw_window_dup_results_text (w);
  columns = 0;
  for (const char *c = every; *c && *c != '\n'; c++)
    columns += *c == '\t';
  ck_assert_uint_eq (columns, enabled - 1);
  bw_gui_test_close_window (w);
}
END_TEST

/* The grid child that holds results cell COL, ROW (the label, or the box it sits in). */
static GtkWidget *
results_cell_box (BwWindow *w, int col, int row)
{
  GtkWidget *c = bw_window_get_results_cell (w, col, row);

  while (c && !GTK_IS_GRID (gtk_widget_get_parent (c)))
    c = gtk_widget_get_parent (c);
  return c;
}

/* Every load case at 1024 px: the load-case columns scroll sideways under a quantity column
 * that stays in view, and each row of values stays level with its quantity. */
START_TEST (test_every_case_quantity_column_stays)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkWidget *name, *sideways;
  GtkAdjustment *adj;
  graphene_rect_t before, after, r;
  int rows = 0, cols = 0;

  gtk_window_set_default_size (GTK_WINDOW (w), 1024, 700);
  bw_window_select_unit (w, "north-floc-2");
  gtk_toggle_button_set_active (GTK_TOGGLE_BUTTON (bw_window_get_field_widget (w, "every-case")), TRUE);
  bw_gui_test_pump (100);
  ck_assert_int_le (gtk_widget_get_width (GTK_WIDGET (w)), 1024);
  while (bw_window_get_results_cell (w, 0, rows))
    rows++;
  while (bw_window_get_results_cell (w, cols, 0))
    cols++;
  ck_assert_int_gt (rows, 5);
  ck_assert_int_gt (cols, 10);
  for (int row = 0; row < rows; row++)
    {
      graphene_rect_t q;
      ck_assert (gtk_widget_compute_bounds (results_cell_box (w, 0, row), GTK_WIDGET (w), &q));
      for (int col = 1; col < cols; col++)
        {
          GtkWidget *v = results_cell_box (w, col, row);
          if (v == NULL)
            continue;
          ck_assert (gtk_widget_compute_bounds (v, GTK_WIDGET (w), &r));
          ck_assert_msg (fabs (r.origin.y - q.origin.y) < 1.0 && fabs (r.size.height - q.size.height) < 1.0,
                         "row %d column %d: value at y %g h %g, quantity at y %g h %g", row, col,
                         r.origin.y, r.size.height, q.origin.y, q.size.height);
        }
    }
  /* The table is wider than its pane, so the case columns scroll; the quantities do not. */
  name = results_cell_box (w, 0, 1);
  sideways = gtk_widget_get_ancestor (results_cell_box (w, 1, 1), GTK_TYPE_SCROLLED_WINDOW);
  ck_assert (!gtk_widget_is_ancestor (name, sideways));
  adj = gtk_scrolled_window_get_hadjustment (GTK_SCROLLED_WINDOW (sideways));
  ck_assert_double_gt (gtk_adjustment_get_upper (adj), gtk_adjustment_get_page_size (adj));
  ck_assert (gtk_widget_compute_bounds (name, GTK_WIDGET (w), &before));
  gtk_adjustment_set_value (adj, gtk_adjustment_get_upper (adj) - gtk_adjustment_get_page_size (adj));
  bw_gui_test_pump (50);
  ck_assert (gtk_widget_compute_bounds (name, GTK_WIDGET (w), &after));
  ck_assert_double_eq (after.origin.x, before.origin.x);
  ck_assert_double_le (after.origin.x + after.size.width, gtk_widget_get_width (GTK_WIDGET (w)));
  /* The last case's column has come into view, right of the quantity column. */
  ck_assert (gtk_widget_compute_bounds (results_cell_box (w, cols - 1, 1), GTK_WIDGET (w), &r));
  ck_assert_double_ge (r.origin.x, after.origin.x + after.size.width);
  ck_assert_double_le (r.origin.x + r.size.width, gtk_widget_get_width (GTK_WIDGET (w)));
  bw_gui_test_close_window (w);
}
END_TEST

/* Every cell of the smallest/largest table, in US units at 1024 px (captions that wrap, columns
 * wider than the pane), has the height its content needs at the width it was given: no value
 * or caption runs into the next row. */
START_TEST (test_results_cells_hold_their_text)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  guint cells = 0;

  gtk_window_set_default_size (GTK_WINDOW (w), 1024, 700);
  bw_application_set_unit_system (app, BW_UNIT_SYSTEM_US);
  bw_window_select_unit (w, "south-sed");
  bw_gui_test_pump (100);
  for (int row = 0; bw_window_get_results_cell (w, 0, row); row++)
    for (int col = 0; col < 3; col++)
      {
        GtkWidget *cell = results_cell_box (w, col, row);
        GtkWidget *content = cell ? gtk_widget_get_first_child (cell) : NULL;
        int need = 0;
        if (content == NULL)
          continue;
        gtk_widget_measure (content, GTK_ORIENTATION_VERTICAL, gtk_widget_get_width (cell), &need, NULL,
                            NULL, NULL);
        ck_assert_msg (need <= gtk_widget_get_height (cell), "row %d column %d needs %d px, has %d", row,
                       col, need, gtk_widget_get_height (cell));
        cells++;
      }
  ck_assert_uint_gt (cells, 20);
  bw_application_set_unit_system (app, BW_UNIT_SYSTEM_SI);
  bw_gui_test_close_window (w);
}
END_TEST

/* The unit after the last space of TEXT ("89.36 min" -> "min"). */
static const char *
unit_of (const char *text)
{
  const char *sp = strrchr (text, ' ');

  return sp ? sp + 1 : "";
}

/* One row reads in one unit: the south clarifier's detention time is 89 min at the smallest and
 * 6.7 h at the largest (the engine's results for the demo), and both columns read in hours, the
 * unit of the largest: 89.36 min is 1.489 h (derived, 89.36 / 60). */
START_TEST (test_results_row_in_one_unit)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkLabel *lo, *hi;

  bw_window_select_unit (w, "south-sed");
  bw_gui_test_pump (20);
  lo = results_value_label (w, "detention time", 1);
  hi = results_value_label (w, "detention time", 2);
  ck_assert_ptr_nonnull (lo);
  ck_assert_ptr_nonnull (hi);
  ck_assert_str_eq (unit_of (gtk_label_get_text (hi)), "h");
  ck_assert_str_eq (unit_of (gtk_label_get_text (lo)), "h");
  ck_assert_msg (g_str_has_prefix (gtk_label_get_text (lo), "1.489 "), "%s", gtk_label_get_text (lo));
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_new_from_demo)
{
  g_autofree char *demo = bw_gui_test_demo_path ();
  g_autoptr (BwProject) file = bw_project_load (demo, NULL);
  GList *before = gtk_application_get_windows (GTK_APPLICATION (app));
  guint n = g_list_length (before);
  BwWindow *found = NULL;

  g_action_group_activate_action (G_ACTION_GROUP (app), "new-demo", NULL);
  bw_gui_test_pump (50);
  for (GList *l = gtk_application_get_windows (GTK_APPLICATION (app)); l; l = l->next)
    if (BW_IS_WINDOW (l->data) && bw_project_equal (bw_window_get_project (l->data), file)
        && bw_window_get_path (l->data) == NULL)
      found = l->data;
  ck_assert_ptr_nonnull (found);                 /* the demo, as a new project with no file */
  ck_assert_uint_ge (g_list_length (gtk_application_get_windows (GTK_APPLICATION (app))), n);
  bw_gui_test_close_window (found);
}
END_TEST

START_TEST (test_criteria_and_case_widgets)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkWidget *list = bw_window_get_checks_list (w);
  GtkWidget *cases = NULL;
  GtkDropDown *dd = NULL;
  GtkStringList *names;
  guint want = G_MAXUINT, after = 0;
  const BwProject *p = bw_window_get_project (w);

  /* the criteria chooser lists every set found (bw_criteria_find_all) by name and id */
  {
    g_autoptr (GPtrArray) sets = bw_criteria_find_all (NULL);
    GtkWidget *x = bw_window_get_field_widget (w, "criteria");
    ck_assert (GTK_IS_DROP_DOWN (x));
    dd = GTK_DROP_DOWN (x);
    names = GTK_STRING_LIST (gtk_drop_down_get_model (dd));
    ck_assert_uint_eq (g_list_model_get_n_items (G_LIST_MODEL (names)), sets->len);
    for (guint i = 0; i < sets->len; i++)
      if (g_strcmp0 (((BwCriteriaSet *) g_ptr_array_index (sets, i))->id, "recommended-standards-2018") == 0)
        want = i;
  }
  ck_assert_uint_ne (want, G_MAXUINT);
  gtk_drop_down_set_selected (dd, want);
  ck_assert_str_eq (p->criteria, "recommended-standards-2018");
  /* asking for the list builds rows that waited while the checks page was out of sight */
  list = bw_window_get_checks_list (w);
  for (GtkWidget *r = gtk_widget_get_first_child (list); r; r = gtk_widget_get_next_sibling (r))
    after++;
  ck_assert_uint_gt (after, 0);
  ck_assert (bw_window_is_modified (w));
  /* the load-case check buttons */
  cases = bw_window_get_field_widget (w, "case:0");
  ck_assert (GTK_IS_CHECK_BUTTON (cases));
  ck_assert (g_array_index (p->cases, BwLoadCase, 0).enabled);
  gtk_check_button_set_active (GTK_CHECK_BUTTON (cases), FALSE);
  ck_assert (!g_array_index (p->cases, BwLoadCase, 0).enabled);
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.undo", NULL));
  ck_assert (g_array_index (p->cases, BwLoadCase, 0).enabled);
  ck_assert (gtk_check_button_get_active (GTK_CHECK_BUTTON (bw_window_get_field_widget (w, "case:0"))));
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_save_as_chooser)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  g_autofree char *want = g_build_filename (tmpdir, "chosen.bwproj", NULL);
  g_autoptr (GFile) folder = g_file_new_for_path (tmpdir);
  GtkWindow *chooser;

  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.save-as", NULL));
  bw_gui_test_pump (100);
  chooser = find_toplevel (GTK_TYPE_FILE_CHOOSER_DIALOG, NULL);
  ck_assert_ptr_nonnull (chooser);
  ck_assert_str_eq (gtk_file_filter_get_name (gtk_file_chooser_get_filter (GTK_FILE_CHOOSER (chooser))),
                    "Basinwright projects (*.bwproj)");
  ck_assert (gtk_file_chooser_set_current_folder (GTK_FILE_CHOOSER (chooser), folder, NULL));
  gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (chooser), "chosen"); /* suffix added */
  gtk_dialog_response (GTK_DIALOG (chooser), GTK_RESPONSE_ACCEPT);
  /* the save-mode chooser checks the name asynchronously before it answers */
  for (int i = 0; i < 40 && !g_file_test (want, G_FILE_TEST_EXISTS); i++)
    bw_gui_test_pump (50);
  ck_assert (g_file_test (want, G_FILE_TEST_EXISTS));
  ck_assert_str_eq (bw_window_get_path (w), want);
  {
    g_autoptr (BwProject) back = bw_project_load (want, NULL);
    ck_assert (bw_project_equal (back, bw_window_get_project (w)));
  }
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_no_nan_anywhere_and_bad_file_refused)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  const BwProject *p = bw_window_get_project (w);
  g_autofree char *bad = g_build_filename (tmpdir, "bad.bwproj", NULL);
  g_autoptr (GError) error = NULL;
  guint seen = 0;

  for (guint i = 0; i < p->trains->len; i++)
    {
      const BwTrain *t = g_ptr_array_index (p->trains, i);
      for (guint k = 0; k < t->units->len; k++)
        {
          const BwProcessUnit *u = g_ptr_array_index (t->units, k);
          for (int s = -1; s < (int) u->stages->len; s++)
            {
              const char *id = s < 0 ? u->id : ((BwProcessUnit *) g_ptr_array_index (u->stages, s))->id;
              g_autofree char *text = NULL;
              g_autofree char *lower = NULL;
              g_auto (GStrv) lines = NULL;
              ck_assert (bw_window_select_unit (w, id));
              text = bw_window_dup_results_text (w);
              lower = g_ascii_strdown (text, -1);
              ck_assert_msg (strstr (lower, "nan") == NULL && strstr (lower, "inf") == NULL, "%s: %s", id, text);
              lines = g_strsplit (text, "\n", -1);
              /* a header and at least two quantity rows (the split leaves a last empty string) */
              ck_assert_msg (g_strv_length (lines) >= 4, "%s has no results: %s", id, text);
              seen++;
            }
        }
    }
  ck_assert_uint_eq (seen, 18); /* every unit and stage of the demo */
  /* a malformed file is refused with the io layer's message, and the window keeps its project */
  ck_assert (g_file_set_contents (bad, "<project xmlns='urn:x-basinwright:project:1'", -1, NULL));
  ck_assert (!bw_window_open_path (w, bad, &error));
  ck_assert (strstr (error->message, "bad.bwproj") != NULL);
  ck_assert_str_eq (bw_window_get_project (w)->name, "Alder Creek WTP, Marrowby (demo)");
  bw_gui_test_close_window (w);
}
END_TEST

static Suite *
window_suite (void)
{
  Suite *s = suite_create ("gui-window");
  TCase *tc = tcase_create ("window");

  tcase_set_timeout (tc, 60);
  tcase_add_test (tc, test_window_shows_demo);
  tcase_add_test (tc, test_typed_feet_are_applied);
  tcase_add_test (tc, test_results_update_in_place);
  tcase_add_test (tc, test_renderer_choice);
  tcase_add_test (tc, test_wrong_kind_is_flagged_not_applied);
  tcase_add_test (tc, test_out_of_range_and_garbage_flagged);
  tcase_add_test (tc, test_unit_system_reformats);
  tcase_add_test (tc, test_add_move_remove_and_undo);
  tcase_add_test (tc, test_undo_redo_restore_value);
  tcase_add_test (tc, test_choice_count_and_stage_fields);
  tcase_add_test (tc, test_design_basis_fields);
  tcase_add_test (tc, test_check_activation_selects_unit);
  tcase_add_test (tc, test_save_and_reopen_equal);
  tcase_add_test (tc, test_autosave_written_and_recoverable);
  tcase_add_test (tc, test_parallel_standby_spins);
  tcase_add_test (tc, test_close_prompts_when_modified);
  tcase_add_test (tc, test_about_repeats_caution);
  tcase_add_test (tc, test_every_case_table);
  tcase_add_test (tc, test_every_case_quantity_column_stays);
  tcase_add_test (tc, test_results_cells_hold_their_text);
  tcase_add_test (tc, test_results_row_in_one_unit);
  tcase_add_test (tc, test_new_from_demo);
  tcase_add_test (tc, test_criteria_and_case_widgets);
  tcase_add_test (tc, test_save_as_chooser);
  tcase_add_test (tc, test_no_nan_anywhere_and_bad_file_refused);
  suite_add_tcase (s, tc);
  return s;
}

int
main (void)
{
  SRunner *sr;
  int failed;

  tmpdir = bw_gui_test_private_env ();
  if (!gtk_init_check ())
    {
      g_printerr ("no display: skipping the GUI tests\n");
      return 77;
    }
  app = bw_gui_test_app ();
  sr = srunner_create (window_suite ());
  srunner_set_fork_status (sr, CK_NOFORK); /* one GTK, one display for every test */
  srunner_run_all (sr, CK_NORMAL);
  failed = srunner_ntests_failed (sr);
  srunner_free (sr);
  g_object_unref (app);
  return failed == 0 ? 0 : 1;
}
