/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-review.c: the review page (stated values, findings, comments, tolerance, findings
 * report), the compare view and the design report dialog, on the real window under a display. */
#include "config.h"

#include <check.h>
#include <math.h>
#include <string.h>

#include "bw-gui-test.h"
#include "draw/bw-report.h"
#include "engine/bw-review.h"
#include "gui/bw-report-dialog.h"
#include "gui/bw-review-view.h"
#include "io/bw-criteria-xml.h"
#include "io/bw-csv.h"
#include "io/bw-project-xml.h"

static BwApplication *app;
static char *tmpdir;

static char *
example (const char *name)
{
  const char *root = g_getenv ("BW_SOURCE_ROOT");

  return g_build_filename (root ? root : ".", "data", "examples", name, NULL);
}

static BwWindow *
open_window (const char *name)
{
  g_autofree char *path = example (name);
  g_autoptr (GError) error = NULL;
  BwWindow *w = bw_window_new (app);

  ck_assert_msg (bw_window_open_path (w, path, &error), "%s", error ? error->message : "");
  gtk_window_set_default_size (GTK_WINDOW (w), 1024, 700);
  gtk_window_present (GTK_WINDOW (w));
  bw_gui_test_pump (50);
  return w;
}

static BwReviewView *
review_of (BwWindow *w)
{
  GtkWidget *v = bw_gui_test_find_widget (GTK_WIDGET (w), BW_TYPE_REVIEW_VIEW);

  ck_assert_ptr_nonnull (v);
  bw_window_show_page (w, "review");
  bw_gui_test_pump (20);
  bw_review_view_refresh (BW_REVIEW_VIEW (v));
  return BW_REVIEW_VIEW (v);
}

/* The engine's own findings for the window's project at TOL: the expected set ("derived"). */
static GArray *
engine_findings (BwWindow *w, double tol)
{
  return bw_review (bw_window_get_results (w), bw_window_get_project (w)->stated, bw_window_get_checks (w), tol);
}

/* Rows of the findings list of kind KIND, as "element|quantity-or-stated-index" keys. */
static GPtrArray *
rows_of_kind (BwReviewView *v, BwFindingKind kind)
{
  GPtrArray *out = g_ptr_array_new ();
  GtkWidget *list = bw_review_view_get_findings_list (v);

  for (GtkWidget *r = gtk_widget_get_first_child (list); r; r = gtk_widget_get_next_sibling (r))
    if (GPOINTER_TO_INT (g_object_get_data (G_OBJECT (r), "bw-kind")) == (int) kind + 1)
      g_ptr_array_add (out, r);
  return out;
}

static GtkWidget *
row_of_stated (BwReviewView *v, guint index)
{
  GtkWidget *list = bw_review_view_get_findings_list (v);

  for (GtkWidget *r = gtk_widget_get_first_child (list); r; r = gtk_widget_get_next_sibling (r))
    if (GPOINTER_TO_UINT (g_object_get_data (G_OBJECT (r), "bw-stated")) == index + 1)
      return r;
  return NULL;
}

static void
import_demo_stated (BwWindow *w, BwReviewView *v)
{
  g_autofree char *csv = example ("marrowby-stated.csv");
  g_autoptr (GError) error = NULL;

  ck_assert_msg (bw_review_view_import_path (v, csv, &error), "%s", error ? error->message : "");
  bw_review_view_refresh (v);
  ck_assert_uint_eq (bw_window_get_project (w)->stated->len, 10); /* the ten rows of the CSV */
}

START_TEST (test_findings_match_engine)
{
  BwWindow *w = open_window ("marrowby-demo.bwproj");
  BwReviewView *v = review_of (w);
  g_autoptr (GArray) want = NULL;
  g_autoptr (GPtrArray) got = NULL;
  guint n_disc = 0, n_crit = 0;

  ck_assert_uint_eq (bw_window_get_project (w)->stated->len, 0); /* the demo carries none */
  import_demo_stated (w, v);
  ck_assert (bw_window_is_modified (w));
  want = engine_findings (w, 0.01);
  got = rows_of_kind (v, BW_FINDING_DISCREPANCY);
  for (guint i = 0; i < want->len; i++)
    {
      const BwFinding *f = &g_array_index (want, BwFinding, i);
      GtkWidget *row;
      if (f->kind == BW_FINDING_CRITERION)
        n_crit++;
      if (f->kind != BW_FINDING_DISCREPANCY)
        continue;
      n_disc++;
      /* each discrepancy the engine finds is a discrepancy row for the same stated value */
      row = row_of_stated (v, i);
      ck_assert_ptr_nonnull (row);
      ck_assert_int_eq (GPOINTER_TO_INT (g_object_get_data (G_OBJECT (row), "bw-kind")), BW_FINDING_DISCREPANCY + 1);
      ck_assert_str_eq (g_object_get_data (G_OBJECT (row), "bw-id"), f->stated->element);
      ck_assert (gtk_widget_has_css_class (row, "bw-finding-discrepancy"));
    }
  /* the CSV's header says three values are wrong on purpose (the fixture's own statement) */
  ck_assert_uint_eq (n_disc, 3);
  ck_assert_uint_eq (got->len, n_disc);
  {
    g_autoptr (GPtrArray) crit = rows_of_kind (v, BW_FINDING_CRITERION);
    ck_assert_uint_eq (crit->len, n_crit);
  }
  {
    g_autofree char *expect = g_strdup_printf ("%u discrepancies, %u agree", n_disc, 10 - n_disc);
    ck_assert_msg (strstr (bw_review_view_get_summary (v), expect) != NULL, "%s", bw_review_view_get_summary (v));
  }
  /* no NaN or infinity anywhere in the list */
  for (GtkWidget *r = gtk_widget_get_first_child (bw_review_view_get_findings_list (v)); r;
       r = gtk_widget_get_next_sibling (r))
    for (GtkWidget *c = gtk_widget_get_first_child (gtk_widget_get_first_child (r)); c;
         c = gtk_widget_get_next_sibling (c))
      if (GTK_IS_LABEL (c))
        {
          g_autofree char *lower = g_ascii_strdown (gtk_label_get_text (GTK_LABEL (c)), -1);
          ck_assert_msg (strstr (lower, "nan") == NULL && strstr (lower, "inf") == NULL, "%s", lower);
        }
  /* activating a finding selects its unit in the navigator */
  {
    GtkWidget *row = g_ptr_array_index (got, 0);
    g_signal_emit_by_name (bw_review_view_get_findings_list (v), "row-activated", row);
    ck_assert_str_eq (bw_window_get_selected_id (w), g_object_get_data (G_OBJECT (row), "bw-id"));
  }
  /* undo takes the import back */
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.undo", NULL));
  bw_review_view_refresh (v);
  ck_assert_uint_eq (bw_window_get_project (w)->stated->len, 0);
  {
    g_autoptr (GPtrArray) after = rows_of_kind (v, BW_FINDING_DISCREPANCY);
    ck_assert_uint_eq (after->len, 0);
  }
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_comment_saved_and_undone)
{
  BwWindow *w = open_window ("marrowby-demo.bwproj");
  BwReviewView *v = review_of (w);
  g_autofree char *saved = g_build_filename (tmpdir, "commented.bwproj", NULL);
  g_autoptr (GError) error = NULL;
  GtkWidget *row, *entry;
  const char *note = "Checked against sheet 12: the submittal used the average-day flow";

  import_demo_stated (w, v);
  /* line 6 of the CSV (index 1, north-sed weir loading) has no comment */
  ck_assert_ptr_null (((BwStated *) g_ptr_array_index (bw_window_get_project (w)->stated, 1))->comment);
  row = row_of_stated (v, 1);
  ck_assert_ptr_nonnull (row);
  entry = g_object_get_data (G_OBJECT (row), "bw-comment");
  ck_assert (GTK_IS_ENTRY (entry));
  gtk_editable_set_text (GTK_EDITABLE (entry), note);
  g_signal_emit_by_name (entry, "activate");
  bw_gui_test_pump (20);
  ck_assert_str_eq (((BwStated *) g_ptr_array_index (bw_window_get_project (w)->stated, 1))->comment, note);
  ck_assert (bw_window_save_to (w, saved, &error));
  {
    g_autoptr (BwProject) back = bw_project_load (saved, &error);
    ck_assert_msg (back != NULL, "%s", error ? error->message : "");
    ck_assert_uint_eq (back->stated->len, 10);
    ck_assert_str_eq (((BwStated *) g_ptr_array_index (back->stated, 1))->comment, note);
  }
  /* the list shows the comment again after its own refresh */
  bw_review_view_refresh (v);
  entry = g_object_get_data (G_OBJECT (row_of_stated (v, 1)), "bw-comment");
  ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (entry)), note);
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.undo", NULL));
  bw_review_view_refresh (v);
  ck_assert_ptr_null (((BwStated *) g_ptr_array_index (bw_window_get_project (w)->stated, 1))->comment);
  entry = g_object_get_data (G_OBJECT (row_of_stated (v, 1)), "bw-comment");
  ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (entry)), "");
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_tolerance_flagged_and_applied)
{
  BwWindow *w = open_window ("marrowby-demo.bwproj");
  BwReviewView *v = review_of (w);
  GtkWidget *e = bw_review_view_get_tolerance_entry (v);
  const char *bad[] = { "0", "150", "abc", "-2" };

  import_demo_stated (w, v);
  ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (e)), "1.000"); /* the 1 % default, four figures */
  for (guint i = 0; i < G_N_ELEMENTS (bad); i++)
    {
      gtk_editable_set_text (GTK_EDITABLE (e), bad[i]);
      g_signal_emit_by_name (e, "activate");
      bw_gui_test_pump (5);
      ck_assert_msg (gtk_widget_has_css_class (e, "error"), "%s not flagged", bad[i]);
      ck_assert (strstr (gtk_widget_get_tooltip_text (e), "tolerance") != NULL);
      ck_assert_double_eq (bw_window_get_project (w)->review_tolerance, 0.01);
    }
  /* 25 %: the south-floc detention (35 vs 28.28 min, +23.8 %) agrees within it; the other two
   * (−17.9 % and −6.4 %) too. The expected findings are the engine's at 0.25 (derived). */
  gtk_editable_set_text (GTK_EDITABLE (e), "25 %");
  g_signal_emit_by_name (e, "activate");
  bw_gui_test_pump (20);
  bw_review_view_refresh (v);
  ck_assert (!gtk_widget_has_css_class (e, "error"));
  ck_assert_double_eq_tol (bw_window_get_project (w)->review_tolerance, 0.25, 1e-12);
  {
    g_autoptr (GArray) want = engine_findings (w, 0.25);
    g_autoptr (GPtrArray) got = rows_of_kind (v, BW_FINDING_DISCREPANCY);
    guint n = 0;
    for (guint i = 0; i < want->len; i++)
      n += g_array_index (want, BwFinding, i).kind == BW_FINDING_DISCREPANCY;
    ck_assert_uint_eq (got->len, n);
    ck_assert_uint_eq (n, 0);
  }
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.undo", NULL));
  bw_review_view_refresh (v);
  ck_assert_double_eq (bw_window_get_project (w)->review_tolerance, 0.01);
  ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (e)), "1.000");
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_bad_csv_names_the_line)
{
  BwWindow *w = open_window ("marrowby-demo.bwproj");
  BwReviewView *v = review_of (w);
  g_autofree char *bad = g_build_filename (tmpdir, "bad-stated.csv", NULL);
  g_autoptr (GError) error = NULL;
  g_autoptr (GError) expect = NULL;
  g_autoptr (GPtrArray) none = NULL;

  ck_assert (g_file_set_contents (bad, "element,quantity,case,value,unit\n"
                                  "north-sed,overflow_rate,maximum-day/coldest/all-in-service,2.2,m/h\n"
                                  "north-sed,bogus,max,1,\n", -1, NULL));
  ck_assert (!bw_review_view_import_path (v, bad, &error));
  /* the message shown is the io reader's own, which names the file and line 3 */
  none = bw_stated_load_csv (bad, &expect);
  ck_assert_ptr_null (none);
  ck_assert_str_eq (error->message, expect->message);
  ck_assert (strstr (error->message, ":3:") != NULL);
  ck_assert_str_eq (bw_review_view_get_findings_note (v), expect->message);
  ck_assert_uint_eq (bw_window_get_project (w)->stated->len, 0);
  ck_assert (!bw_window_is_modified (w));
  bw_gui_test_close_window (w);
}
END_TEST

static double
rel_size (const BwChange *c)
{
  if (!c->numeric || !c->has_old || !c->has_new)
    return -1.0;
  if (c->old_value == 0.0)
    return c->new_value == 0.0 ? 0.0 : G_MAXDOUBLE;
  return fabs (c->new_value - c->old_value) / fabs (c->old_value);
}

/* A reviewer's order: check outcomes first, then inputs, each under a heading per unit, largest
 * relative change first; the results collapsed, their rows built only when expanded. */
START_TEST (test_compare_reviewer_order)
{
  BwWindow *w = open_window ("marrowby-demo.bwproj");
  BwReviewView *v = review_of (w);
  g_autofree char *demo = example ("marrowby-demo.bwproj");
  g_autofree char *other = g_build_filename (tmpdir, "revision-b.bwproj", NULL);
  g_autoptr (BwProject) op = bw_project_load (demo, NULL);
  g_autoptr (BwResults) orr = NULL;
  g_autoptr (GPtrArray) want = NULL;
  g_autoptr (GArray) oc = NULL;
  g_autoptr (GPtrArray) sed = g_ptr_array_new ();
  BwProcessUnit *ns;

  /* The other revision: the north basin a little shorter (56 -> 50 m), much wider (2.8 -> 5.0 m)
   * and deeper than the 5 m limit (4.0 -> 5.5 m, a check outcome that changes). Relative sizes
   * 0.107, 0.786, 0.375 (derived): listed width, depth, length, not in the file's order. */
  ck_assert_ptr_nonnull (op);
  ns = bw_project_find_unit (op, "north-sed", NULL);
  ck_assert (bw_process_unit_set (ns, "length", 50.0, NULL));
  ck_assert (bw_process_unit_set (ns, "width", 5.0, NULL));
  ck_assert (bw_process_unit_set (ns, "side-water-depth", 5.5, NULL));
  ck_assert (bw_project_save (op, other, NULL));
  GtkWidget *list, *expander = NULL;
  guint n_results = 0, n_checks = 0, rows_results = 0, i_sed = 0;
  int pos = 0, last_check = -1, first_input = -1, first_result = -1;
  const char *heading = NULL;
  g_autofree char *want_title = NULL;
  g_autofree char *busiest = NULL;

  ck_assert (bw_review_view_compare_with (v, other, NULL));
  bw_review_view_show (v, "compare");
  bw_review_view_refresh (v);
  orr = bw_project_evaluate (op, NULL);
  oc = bw_check_results (orr, bw_window_get_criteria (w));
  want = bw_project_diff (op, bw_window_get_project (w), orr, bw_window_get_results (w), oc,
                          bw_window_get_checks (w));
  /* The unit with the most changed inputs is the one whose order is checked. */
  {
    g_autoptr (GHashTable) per = g_hash_table_new (g_str_hash, g_str_equal);
    guint most = 0;
    for (guint i = 0; i < want->len; i++)
      {
        BwChange *c = g_ptr_array_index (want, i);
        n_results += c->kind == BW_CHANGE_RESULT;
        n_checks += c->kind == BW_CHANGE_CHECK;
        if (c->kind == BW_CHANGE_INPUT && c->unit_id)
          {
            guint n = GPOINTER_TO_UINT (g_hash_table_lookup (per, c->unit_id)) + 1;
            g_hash_table_insert (per, c->unit_id, GUINT_TO_POINTER (n));
            if (n > most)
              {
                most = n;
                g_free (busiest);
                busiest = g_strdup (c->unit_id);
              }
          }
      }
    for (guint i = 0; i < want->len; i++)
      {
        BwChange *c = g_ptr_array_index (want, i);
        if (c->kind == BW_CHANGE_INPUT && g_strcmp0 (c->unit_id, busiest) == 0)
          g_ptr_array_add (sed, c);
      }
  }
  ck_assert_uint_gt (n_checks, 0);
  ck_assert_uint_gt (n_results, 0);
  ck_assert_str_eq (busiest, "north-sed");
  ck_assert_uint_eq (sed->len, 3);
  list = bw_review_view_get_compare_list (v);
  for (GtkWidget *r = gtk_widget_get_first_child (list); r; r = gtk_widget_get_next_sibling (r), pos++)
    {
      const int k = GPOINTER_TO_INT (g_object_get_data (G_OBJECT (r), "bw-change-kind")) - 1;
      if (g_object_get_data (G_OBJECT (r), "bw-unit-heading"))
        heading = g_object_get_data (G_OBJECT (r), "bw-unit-heading");
      if (g_object_get_data (G_OBJECT (r), "bw-results-expander"))
        expander = g_object_get_data (G_OBJECT (r), "bw-results-expander");
      if (k == BW_CHANGE_CHECK)
        last_check = pos;
      if (k == BW_CHANGE_INPUT && first_input < 0)
        first_input = pos;
      if (k == BW_CHANGE_RESULT && first_result < 0)
        first_result = pos;
      if (k >= 0)
        {
          /* every change sits under the heading of its own unit ("" for the plant) */
          const char *u = g_object_get_data (G_OBJECT (r), "bw-unit");
          ck_assert_ptr_nonnull (heading);
          ck_assert_str_eq (heading, u ? u : "");
        }
      if (k == BW_CHANGE_INPUT && g_strcmp0 (g_object_get_data (G_OBJECT (r), "bw-unit"), busiest) == 0)
        {
          /* that unit's inputs in the order of their relative change, largest first */
          const BwChange *c = g_ptr_array_index (sed, i_sed);
          if (i_sed > 0)
            ck_assert (rel_size (g_ptr_array_index (sed, i_sed - 1)) >= 0 || rel_size (c) < 0);
          i_sed++;
        }
    }
  ck_assert_int_ge (last_check, 0);
  ck_assert_int_gt (first_input, last_check);
  ck_assert_int_eq (first_result, -1); /* collapsed: no result row built */
  ck_assert_uint_eq (i_sed, sed->len);
  ck_assert_ptr_nonnull (expander);
  want_title = g_strdup_printf ("%u results changed", n_results);
  ck_assert_str_eq (gtk_expander_get_label (GTK_EXPANDER (expander)), want_title);
  ck_assert (!gtk_expander_get_expanded (GTK_EXPANDER (expander)));

  /* That unit's rows as listed, against the engine's changes sorted by relative change. */
  {
    g_autoptr (GPtrArray) sorted = g_ptr_array_copy (sed, NULL, NULL);
    guint j = 0;
    for (guint a = 1; a < sorted->len; a++) /* stable insertion sort, largest first */
      for (guint b = a; b > 0 && rel_size (g_ptr_array_index (sorted, b)) > rel_size (g_ptr_array_index (sorted, b - 1)); b--)
        {
          gpointer t = sorted->pdata[b];
          sorted->pdata[b] = sorted->pdata[b - 1];
          sorted->pdata[b - 1] = t;
        }
    for (GtkWidget *r = gtk_widget_get_first_child (list); r; r = gtk_widget_get_next_sibling (r))
      if (GPOINTER_TO_INT (g_object_get_data (G_OBJECT (r), "bw-change-kind")) == BW_CHANGE_INPUT + 1
          && g_strcmp0 (g_object_get_data (G_OBJECT (r), "bw-unit"), busiest) == 0)
        {
          const BwChange *c = g_ptr_array_index (sorted, j++);
          ck_assert_str_eq (g_object_get_data (G_OBJECT (r), "bw-what"), c->what);
          if (j == 1) /* the widening, the largest change (its label names the width) */
            ck_assert_msg (strstr (c->what, "width") != NULL, "first: %s", c->what);
        }
    ck_assert_uint_eq (j, sorted->len);
  }

  /* Expanded, the result rows are built: every one of them, after the inputs. */
  gtk_expander_set_expanded (GTK_EXPANDER (expander), TRUE);
  bw_gui_test_pump (3);
  pos = 0;
  first_result = -1;
  for (GtkWidget *r = gtk_widget_get_first_child (list); r; r = gtk_widget_get_next_sibling (r), pos++)
    if (GPOINTER_TO_INT (g_object_get_data (G_OBJECT (r), "bw-change-kind")) == BW_CHANGE_RESULT + 1)
      {
        rows_results++;
        if (first_result < 0)
          first_result = pos;
      }
  ck_assert_uint_eq (rows_results, n_results);
  ck_assert_int_gt (first_result, first_input);
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_compare_lists_input_changes)
{
  BwWindow *w = open_window ("marrowby-demo.bwproj");
  BwReviewView *v = review_of (w);
  g_autofree char *other = example ("marrowby-noncompliant.bwproj");
  g_autofree char *missing = g_build_filename (tmpdir, "no-such.bwproj", NULL);
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) op = NULL;
  g_autoptr (BwResults) orr = NULL;
  g_autoptr (GPtrArray) want = NULL;
  const BwChange *first = NULL;
  gboolean seen = FALSE;
  guint n_inputs = 0, rows_inputs = 0;

  ck_assert_msg (bw_review_view_compare_with (v, other, &error), "%s", error ? error->message : "");
  bw_review_view_show (v, "compare");
  bw_review_view_refresh (v);
  /* the expected changes: the engine's diff, old = the chosen file, new = the window (derived) */
  op = bw_project_load (other, NULL);
  orr = bw_project_evaluate (op, NULL);
  ck_assert_ptr_nonnull (orr);
  want = bw_project_diff (op, bw_window_get_project (w), orr, bw_window_get_results (w), NULL, NULL);
  for (guint i = 0; i < want->len; i++)
    {
      const BwChange *c = g_ptr_array_index (want, i);
      if (c->kind == BW_CHANGE_INPUT)
        {
          n_inputs++;
          if (first == NULL)
            first = c;
        }
    }
  ck_assert_ptr_nonnull (first);
  for (GtkWidget *r = gtk_widget_get_first_child (bw_review_view_get_compare_list (v)); r;
       r = gtk_widget_get_next_sibling (r))
    if (GPOINTER_TO_INT (g_object_get_data (G_OBJECT (r), "bw-change-kind")) == BW_CHANGE_INPUT + 1)
      {
        rows_inputs++;
        if (g_strcmp0 (g_object_get_data (G_OBJECT (r), "bw-where"), first->where) == 0
            && g_strcmp0 (g_object_get_data (G_OBJECT (r), "bw-what"), first->what) == 0)
          seen = TRUE;
      }
  ck_assert_msg (seen, "%s %s not listed", first->where, first->what);
  ck_assert_uint_eq (rows_inputs, n_inputs);
  ck_assert (strstr (bw_review_view_get_compare_note (v), "marrowby-noncompliant.bwproj") != NULL);
  /* north-sed's length: 30 m in the other file, 56 m here (the files' own values), in SI */
  seen = FALSE;
  for (GtkWidget *r = gtk_widget_get_first_child (bw_review_view_get_compare_list (v)); r;
       r = gtk_widget_get_next_sibling (r))
    if (g_strcmp0 (g_object_get_data (G_OBJECT (r), "bw-where"), "north-sed") == 0
        && g_strcmp0 (g_object_get_data (G_OBJECT (r), "bw-what"), "length") == 0)
      {
        ck_assert_str_eq (g_object_get_data (G_OBJECT (r), "bw-old"), "30.00 m");
        ck_assert_str_eq (g_object_get_data (G_OBJECT (r), "bw-new"), "56.00 m");
        seen = TRUE;
      }
  ck_assert (seen);
  /* a file that does not load: the loader's message */
  g_clear_error (&error);
  ck_assert (!bw_review_view_compare_with (v, missing, &error));
  ck_assert_str_eq (bw_review_view_get_compare_note (v), error->message);
  ck_assert (strstr (error->message, "no-such.bwproj") != NULL);
  bw_gui_test_close_window (w);
}
END_TEST

/* Runs pdfinfo PATH, or pdftotext -q PATH - (TO_TEXT), and returns what it printed. */
static char *
run_tool (const char *tool, gboolean to_text, const char *path)
{
  const char *info_argv[] = { tool, path, NULL };
  const char *text_argv[] = { tool, "-q", path, "-", NULL };
  const char **argv = to_text ? text_argv : info_argv;
  g_autoptr (GError) error = NULL;
  char *out = NULL;
  int status = 0;

  ck_assert_msg (g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_SEARCH_PATH | G_SPAWN_STDERR_TO_DEV_NULL,
                               NULL, NULL, &out, NULL, &status, &error),
                 "%s: %s", tool, error ? error->message : "");
  ck_assert_msg (g_spawn_check_wait_status (status, NULL), "%s failed on %s", tool, path);
  return out;
}

static guint
pdf_pages (const char *path)
{
  g_autofree char *info = run_tool ("pdfinfo", FALSE, path);
  const char *p = strstr (info, "Pages:");

  ck_assert_ptr_nonnull (p);
  return (guint) g_ascii_strtoull (p + 6, NULL, 10);
}

static BwReportDialog *
wait_dialog (BwWindow *w)
{
  GListModel *tops = gtk_window_get_toplevels ();
  BwReportDialog *d = NULL;

  for (guint i = 0; i < g_list_model_get_n_items (tops) && d == NULL; i++)
    {
      g_autoptr (GObject) o = g_list_model_get_item (tops, i);
      if (BW_IS_REPORT_DIALOG (o) && gtk_window_get_transient_for (GTK_WINDOW (o)) == GTK_WINDOW (w))
        d = BW_REPORT_DIALOG (o);
    }
  ck_assert_ptr_nonnull (d);
  for (int i = 0; i < 600 && bw_report_dialog_is_busy (d); i++)
    bw_gui_test_pump (50);
  ck_assert_msg (!bw_report_dialog_is_busy (d), "the report took more than 30 s");
  return d;
}

START_TEST (test_report_preview_and_export)
{
  BwWindow *w = open_window ("marrowby-demo.bwproj");
  g_autofree char *pdf = g_build_filename (tmpdir, "report.pdf", NULL);
  g_autofree char *nowhere = g_build_filename (tmpdir, "no-such-dir", "report.pdf", NULL);
  BwReportDialog *d;
  cairo_surface_t *img;
  cairo_t *cr;
  guint n, inked = 0;

  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.export-report", NULL));
  d = wait_dialog (w);
  n = bw_report_dialog_get_n_pages (d);
  ck_assert_msg (n > 3, "%s", bw_report_dialog_get_message (d)); /* cover, contents, basis, units... */
  ck_assert_uint_eq (bw_report_dialog_get_page (d), 1);
  /* page 1 paints: a fair share of the sheet carries ink (the title, the table, the caution) */
  img = cairo_image_surface_create (CAIRO_FORMAT_RGB24, 300, 400);
  cr = cairo_create (img);
  cairo_set_source_rgb (cr, 0.5, 0.5, 0.5);
  cairo_paint (cr);
  ck_assert (bw_report_dialog_paint_preview (d, cr, 300, 400));
  cairo_destroy (cr);
  cairo_surface_flush (img);
  {
    const unsigned char *px = cairo_image_surface_get_data (img);
    const int stride = cairo_image_surface_get_stride (img);
    guint white = 0;
    for (int y = 0; y < 400; y++)
      for (int x = 0; x < 300; x++)
        {
          const guint32 v = *(const guint32 *) (px + y * stride + x * 4) & 0xffffff;
          white += v == 0xffffff;
          inked += v != 0xffffff && v != 0x808080 && v != 0x7f7f7f;
        }
    ck_assert_uint_gt (white, 20000); /* the paper */
    ck_assert_uint_gt (inked, 500);   /* what is printed on it */
  }
  cairo_surface_destroy (img);
  bw_report_dialog_set_page (d, n);
  ck_assert_uint_eq (bw_report_dialog_get_page (d), n);
  bw_report_dialog_set_page (d, n + 1); /* out of range: ignored */
  ck_assert_uint_eq (bw_report_dialog_get_page (d), n);

  /* a folder that does not exist: the reason, and no file */
  bw_report_dialog_export_to (d, nowhere);
  wait_dialog (w);
  ck_assert_msg (g_str_has_prefix (bw_report_dialog_get_message (d), "Not exported: "), "%s",
                 bw_report_dialog_get_message (d));
  ck_assert (strstr (bw_report_dialog_get_message (d), "no-such-dir") != NULL);
  ck_assert (!g_file_test (nowhere, G_FILE_TEST_EXISTS));

  bw_report_dialog_export_to (d, pdf);
  wait_dialog (w);
  ck_assert_msg (g_file_test (pdf, G_FILE_TEST_EXISTS), "%s", bw_report_dialog_get_message (d));
  /* the preview has exactly the PDF's pages (pdfinfo, poppler-utils) */
  ck_assert_uint_eq (pdf_pages (pdf), n);
  {
    g_autofree char *text = run_tool ("pdftotext", TRUE, pdf);
    ck_assert (strstr (text, bw_window_get_project (w)->name) != NULL);
    ck_assert (strstr (text, "licensed") != NULL); /* the caution is in the file */
  }
  /* no temporary file is left beside it */
  {
    g_autoptr (GDir) dir = g_dir_open (tmpdir, 0, NULL);
    const char *name;
    while ((name = g_dir_read_name (dir)) != NULL)
      ck_assert_msg (!g_str_has_prefix (name, "report.pdf."), "left behind: %s", name);
  }
  gtk_window_destroy (GTK_WINDOW (d));
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_report_letter_and_preparer)
{
  BwWindow *w = open_window ("marrowby-demo.bwproj");
  g_autofree char *pdf = g_build_filename (tmpdir, "letter.pdf", NULL);
  BwReportDialog *d;
  GtkWidget *prep;

  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.export-report", NULL));
  d = wait_dialog (w);
  gtk_drop_down_set_selected (GTK_DROP_DOWN (bw_gui_test_find_widget (GTK_WIDGET (d), GTK_TYPE_DROP_DOWN)), 1);
  prep = bw_gui_test_find_widget (GTK_WIDGET (d), GTK_TYPE_ENTRY);
  gtk_editable_set_text (GTK_EDITABLE (prep), "R. Okonkwo-Hale, P.Eng. (fictional)");
  wait_dialog (w);
  bw_report_dialog_export_to (d, pdf);
  wait_dialog (w);
  ck_assert_msg (g_file_test (pdf, G_FILE_TEST_EXISTS), "%s", bw_report_dialog_get_message (d));
  ck_assert_uint_eq (pdf_pages (pdf), bw_report_dialog_get_n_pages (d));
  {
    g_autofree char *info = run_tool ("pdfinfo", FALSE, pdf);
    /* US letter is 612 x 792 pt (ANSI/ASME Y14.1) */
    ck_assert_msg (strstr (info, "612 x 792 pts") != NULL, "%s", info);
    ck_assert (strstr (info, "Okonkwo-Hale") != NULL); /* the author field */
  }
  /* the preparer typed here went into the project, undoably */
  ck_assert_str_eq (bw_window_get_project (w)->preparer, "R. Okonkwo-Hale, P.Eng. (fictional)");
  gtk_window_destroy (GTK_WINDOW (d));
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.undo", NULL));
  ck_assert (g_strcmp0 (bw_window_get_project (w)->preparer, "R. Okonkwo-Hale, P.Eng. (fictional)") != 0);
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_findings_report_export)
{
  BwWindow *w = open_window ("marrowby-noncompliant.bwproj");
  BwReviewView *v = review_of (w);
  g_autofree char *pdf = g_build_filename (tmpdir, "findings.pdf", NULL);
  g_autoptr (GError) error = NULL;

  /* this example keeps its stated values in the file */
  ck_assert_uint_gt (bw_window_get_project (w)->stated->len, 0);
  ck_assert (bw_review_view_export_findings_to (v, pdf, &error));
  ck_assert_uint_gt (pdf_pages (pdf), 1);
  {
    g_autofree char *text = run_tool ("pdftotext", TRUE, pdf);
    ck_assert (strstr (text, bw_window_get_project (w)->name) != NULL);
    ck_assert (strstr (text, "Discrepancies") != NULL);
  }
  bw_gui_test_close_window (w);
}
END_TEST

/* Renders W to BW_SHOT_DIR/NAME.png, to look at. */
static void
shoot (GtkWidget *w, const char *name)
{
  const char *dir = g_getenv ("BW_SHOT_DIR");
  g_autofree char *path = g_strdup_printf ("%s/%s.png", dir ? dir : ".", name);
  g_autoptr (GdkPaintable) paintable = NULL;
  g_autoptr (GskRenderNode) node = NULL;
  g_autoptr (GdkTexture) tex = NULL;

  bw_gui_test_pump (300);
  paintable = gtk_widget_paintable_new (w);
  for (int tries = 0; tries < 20 && node == NULL; tries++)
    {
      g_autoptr (GtkSnapshot) snap = gtk_snapshot_new ();
      bw_gui_test_pump (50);
      gdk_paintable_snapshot (paintable, GDK_SNAPSHOT (snap), gtk_widget_get_width (w), gtk_widget_get_height (w));
      node = gtk_snapshot_free_to_node (g_steal_pointer (&snap));
    }
  ck_assert_ptr_nonnull (node);
  tex = gsk_renderer_render_texture (gtk_native_get_renderer (GTK_NATIVE (w)), node,
                                     &GRAPHENE_RECT_INIT (0, 0, gtk_widget_get_width (w), gtk_widget_get_height (w)));
  ck_assert (gdk_texture_save_to_png (tex, path));
  g_printerr ("wrote %s\n", path);
}

START_TEST (test_screenshots)
{
  BwWindow *w = open_window ("marrowby-demo.bwproj");
  BwReviewView *v = review_of (w);
  g_autofree char *other = example ("marrowby-noncompliant.bwproj");
  BwReportDialog *d;

  int view_min = 0, nav_w = 0;

  gtk_window_set_default_size (GTK_WINDOW (w), 1024, 700);
  import_demo_stated (w, v);
  shoot (GTK_WIDGET (w), "review-findings");
  /* usable at 1024 x 700: the page's narrowest layout fits beside the navigator (our own layout
   * budget, common practice, no source) */
  gtk_widget_measure (GTK_WIDGET (v), GTK_ORIENTATION_HORIZONTAL, -1, &view_min, NULL, NULL, NULL);
  nav_w = gtk_widget_get_width (bw_window_get_navigator (w));
  g_printerr ("review page minimum width %d px, navigator %d px\n", view_min, nav_w);
  {
    GtkWidget *sw = bw_gui_test_find_widget (GTK_WIDGET (w), GTK_TYPE_STACK_SWITCHER);
    int m = 0, wm = 0;
    gtk_widget_measure (sw, GTK_ORIENTATION_HORIZONTAL, -1, &m, NULL, NULL, NULL);
    gtk_widget_measure (GTK_WIDGET (w), GTK_ORIENTATION_HORIZONTAL, -1, &wm, NULL, NULL, NULL);
    g_printerr ("window page switcher minimum %d px, window minimum %d px\n", m, wm);
  }
  ck_assert_int_le (view_min + nav_w + 40, 1024);
  ck_assert (bw_review_view_compare_with (v, other, NULL));
  bw_review_view_show (v, "compare");
  shoot (GTK_WIDGET (w), "review-compare");
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.export-report", NULL));
  d = wait_dialog (w);
  shoot (GTK_WIDGET (d), "report-dialog");
  gtk_window_destroy (GTK_WINDOW (d));
  bw_gui_test_close_window (w);
}
END_TEST

static Suite *
review_suite (void)
{
  Suite *s = suite_create ("gui-review");
  TCase *tc = tcase_create ("review");

  tcase_set_timeout (tc, 120);
  tcase_add_test (tc, test_findings_match_engine);
  tcase_add_test (tc, test_comment_saved_and_undone);
  tcase_add_test (tc, test_tolerance_flagged_and_applied);
  tcase_add_test (tc, test_bad_csv_names_the_line);
  tcase_add_test (tc, test_compare_lists_input_changes);
  tcase_add_test (tc, test_compare_reviewer_order);
  tcase_add_test (tc, test_report_preview_and_export);
  tcase_add_test (tc, test_report_letter_and_preparer);
  tcase_add_test (tc, test_findings_report_export);
  tcase_add_test (tc, test_screenshots);
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
  sr = srunner_create (review_suite ());
  srunner_set_fork_status (sr, CK_NOFORK); /* one GTK, one display for every test */
  srunner_run_all (sr, CK_NORMAL);
  failed = srunner_ntests_failed (sr);
  srunner_free (sr);
  g_object_unref (app);
  return failed == 0 ? 0 : 1;
}
