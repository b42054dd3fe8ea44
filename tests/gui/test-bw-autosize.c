/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-autosize.c: the auto-size dialog on the real window: win.autosize, a search off the
 * main thread that lists what the engine finds, Apply as one undoable edit, Cancel, closing the
 * dialog during a search, and a search that finds nothing. */
#include "config.h"

#include <check.h>
#include <string.h>

#include "bw-gui-test.h"
#include "engine/bw-autosize.h"
#include "engine/bw-evaluate.h"
#include "engine/bw-project.h"
#include "gui/bw-autosize-dialog.h"

static BwApplication *app;
static char *tmpdir;

/* A guard against a hang, not a timing check: a search of the demo takes well under a second. */
#define WAIT_LIMIT_MS 120000

/* The auto-size dialog open over W, or NULL. */
static BwAutosizeDialog *
find_dialog (BwWindow *w)
{
  GListModel *tops = gtk_window_get_toplevels (); /* borrowed */

  for (guint i = 0; i < g_list_model_get_n_items (tops); i++)
    {
      g_autoptr (GObject) o = g_list_model_get_item (tops, i);
      if (BW_IS_AUTOSIZE_DIALOG (o) && gtk_window_get_transient_for (GTK_WINDOW (o)) == GTK_WINDOW (w))
        return BW_AUTOSIZE_DIALOG (o);
    }
  return NULL;
}

/* Opens the dialog through the action, as Ctrl+Shift+A or the Auto-size button does. */
static BwAutosizeDialog *
open_dialog (BwWindow *w, const char *select)
{
  BwAutosizeDialog *d;

  ck_assert (bw_window_select_unit (w, select));
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.autosize", NULL));
  bw_gui_test_pump (20);
  d = find_dialog (w);
  ck_assert_ptr_nonnull (d);
  ck_assert (gtk_widget_get_mapped (GTK_WIDGET (d)));
  ck_assert (gtk_window_get_modal (GTK_WINDOW (d)));
  return d;
}

static void
wait_finished (BwAutosizeDialog *d)
{
  gint64 end = g_get_monotonic_time () + (gint64) WAIT_LIMIT_MS * 1000;

  while (bw_autosize_dialog_is_searching (d) && g_get_monotonic_time () < end)
    if (!g_main_context_iteration (NULL, FALSE))
      g_usleep (1000);
  ck_assert_msg (!bw_autosize_dialog_is_searching (d), "the search did not finish");
}

/* Renders the dialog to BW_SHOT_DIR/NAME.png for people to look at; checks it is an image. */
static void
shoot (GtkWidget *w, const char *name)
{
  const char *dir = g_getenv ("BW_SHOT_DIR");
  g_autofree char *path = g_strdup_printf ("%s/%s.png", dir ? dir : ".", name);
  g_autoptr (GdkPaintable) paintable = gtk_widget_paintable_new (w);
  g_autoptr (GskRenderNode) node = NULL;
  g_autoptr (GdkTexture) tex = NULL;
  int width = 0, height = 0;

  for (int tries = 0; tries < 20 && node == NULL; tries++)
    {
      g_autoptr (GtkSnapshot) snap = gtk_snapshot_new ();
      bw_gui_test_pump (50);
      width = gtk_widget_get_width (w);
      height = gtk_widget_get_height (w);
      gdk_paintable_snapshot (paintable, GDK_SNAPSHOT (snap), width, height);
      node = gtk_snapshot_free_to_node (g_steal_pointer (&snap));
    }
  ck_assert_ptr_nonnull (node);
  tex = gsk_renderer_render_texture (gtk_native_get_renderer (GTK_NATIVE (w)), node,
                                     &GRAPHENE_RECT_INIT (0, 0, width, height));
  ck_assert (gdk_texture_save_to_png (tex, path));
  g_printerr ("wrote %s (%dx%d)\n", path, width, height);
}

static int
element_index (const BwResults *r, const char *id)
{
  for (guint i = 0; i < r->elements->len; i++)
    {
      const BwElementResult *e = g_ptr_array_index (r->elements, i);
      if (e->stage == NULL && g_strcmp0 (e->id, id) == 0)
        return (int) i;
    }
  return -1;
}

START_TEST (test_action_follows_selection)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  BwAutosizeDialog *d;
  GtkWidget *button;

  /* A stage is sized with its flocculator. */
  ck_assert_str_eq (_bw_autosize_target (bw_window_get_project (w), "north-floc-2"), "north-floc");
  ck_assert_str_eq (_bw_autosize_target (bw_window_get_project (w), "north-sed"), "north-sed");
  ck_assert_ptr_null (_bw_autosize_target (bw_window_get_project (w), "no-such-unit"));
  ck_assert_ptr_null (_bw_autosize_target (bw_window_get_project (w), NULL));

  d = open_dialog (w, "north-floc-2");
  ck_assert_str_eq (bw_autosize_dialog_get_unit_id (d), "north-floc");
  /* Paddle flocculators report a mixing power: all three objectives are offered. */
  ck_assert (bw_autosize_dialog_set_objective (d, BW_OBJECTIVE_POWER));
  ck_assert_int_eq (bw_autosize_dialog_get_objective (d), BW_OBJECTIVE_POWER);
  gtk_window_destroy (GTK_WINDOW (d));
  bw_gui_test_pump (10);

  /* A settling basin has no mixing power to rank by. */
  d = open_dialog (w, "north-sed");
  ck_assert (!bw_autosize_dialog_set_objective (d, BW_OBJECTIVE_POWER));
  ck_assert (bw_autosize_dialog_set_objective (d, BW_OBJECTIVE_FOOTPRINT));
  ck_assert (bw_autosize_dialog_set_objective (d, BW_OBJECTIVE_VOLUME));
  gtk_window_destroy (GTK_WINDOW (d));
  bw_gui_test_pump (10);

  /* The editor's Auto-size button follows the action: on with a unit selected, off with a
   * train row (no unit) selected; activating it then opens nothing. */
  button = bw_gui_test_find_button (GTK_WIDGET (w), "Auto-_size…");
  ck_assert_ptr_nonnull (button);
  ck_assert (gtk_widget_get_sensitive (button));
  ck_assert (bw_window_select_unit (w, NULL));
  ck_assert_ptr_null (bw_window_get_selected_id (w));
  bw_gui_test_pump (10);
  ck_assert (!gtk_widget_get_sensitive (button));
  gtk_widget_activate_action (GTK_WIDGET (w), "win.autosize", NULL);
  bw_gui_test_pump (20);
  ck_assert_ptr_null (find_dialog (w));
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_search_lists_engine_designs_and_applies_once)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  BwAutosizeDialog *d = open_dialog (w, "north-sed");
  const BwAutosizeResult *got;
  BwAutosizeResult want;
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) before = bw_project_copy (bw_window_get_project (w));
  g_autofree char *text = NULL;
  g_autofree char *table_before = NULL;
  g_autofree char *table_after = NULL;
  const BwProcessUnit *u;
  const BwCandidate *best;
  GtkWidget *apply;
  GArray *checks;
  int e;
  guint n_checked = 0;

  ck_assert_ptr_null (bw_autosize_dialog_get_result (d));
  bw_autosize_dialog_search (d);
  ck_assert (bw_autosize_dialog_is_searching (d));
  wait_finished (d);
  got = bw_autosize_dialog_get_result (d);
  ck_assert_msg (got != NULL, "%s", bw_autosize_dialog_get_message (d));

  /* derived: the engine run directly on the same project, criteria set and objective. */
  ck_assert (bw_autosize (bw_window_get_project (w), "north-sed", bw_window_get_criteria (w),
                          BW_OBJECTIVE_VOLUME, NULL, NULL, &want, &error));
  ck_assert_uint_eq (got->n_best, want.n_best);
  ck_assert_uint_gt (got->n_best, 0);
  ck_assert_uint_eq (got->candidates, want.candidates);
  ck_assert_uint_eq (got->passing, want.passing);
  ck_assert_str_eq (got->searched, want.searched);
  for (guint i = 0; i < want.n_best; i++)
    {
      const BwCandidate *a = &got->best[i], *b = &want.best[i];
      ck_assert_uint_eq (a->n_parallel, b->n_parallel);
      ck_assert (memcmp (a->values, b->values, sizeof a->values) == 0);
      ck_assert_double_eq (a->objective, b->objective);
      ck_assert_uint_eq (a->n_margins, b->n_margins);
      for (guint k = 0; k < a->n_margins; k++)
        {
          ck_assert_str_eq (a->margin_criteria[k]->id, b->margin_criteria[k]->id);
          ck_assert_double_eq (a->margins[k], b->margins[k]);
        }
    }

  /* The list shows one row per design, each headed by its total volume in the window's units. */
  text = bw_autosize_dialog_dup_results_text (d);
  for (guint i = 0; i < want.n_best; i++)
    {
      g_autofree char *vol = bw_units_format (want.best[i].objective, BW_KIND_VOLUME,
                                              bw_window_get_unit_system (w));
      g_autofree char *head = g_strdup_printf ("Design %u: total volume %s, %u in parallel", i + 1, vol,
                                               want.best[i].n_parallel);
      ck_assert_msg (strstr (text, head) != NULL, "'%s' not in:\n%s", head, text);
    }
  ck_assert_ptr_nonnull (strstr (text, want.best[0].margin_criteria[0]->title));
  ck_assert_ptr_nonnull (gtk_list_box_get_selected_row (GTK_LIST_BOX (bw_autosize_dialog_get_results_list (d))));
  ck_assert (bw_project_equal (bw_window_get_project (w), before)); /* searching changes nothing */
  shoot (GTK_WIDGET (d), "shot-autosize-dialog");

  /* Apply the first (selected) design through the Apply button. */
  table_before = bw_window_dup_results_text (w);
  apply = bw_gui_test_find_button (GTK_WIDGET (d), "_Apply");
  ck_assert_ptr_nonnull (apply);
  ck_assert (gtk_widget_get_sensitive (apply));
  g_signal_emit_by_name (apply, "clicked");
  bw_gui_test_pump (20);
  best = &want.best[0];
  u = bw_project_find_unit (bw_window_get_project (w), "north-sed", NULL);
  ck_assert_uint_eq (u->n_parallel, best->n_parallel);
  ck_assert (memcmp (u->values, best->values, sizeof u->values) == 0);
  ck_assert (bw_window_is_modified (w));
  ck_assert_ptr_nonnull (strstr (bw_autosize_dialog_get_message (d), "Applied design 1"));
  /* The project is no longer what was searched: Apply is off until an undo or a new search. */
  ck_assert (!gtk_widget_get_sensitive (apply));

  /* Every check of the unit now meets its required limits (the design passed them all). */
  e = element_index (bw_window_get_results (w), "north-sed");
  ck_assert_int_ge (e, 0);
  checks = bw_check_results (bw_window_get_results (w), bw_window_get_criteria (w));
  for (guint i = 0; i < checks->len; i++)
    {
      const BwCheck *ck = &g_array_index (checks, BwCheck, i);
      if (ck->element != e || ck->status == BW_CHECK_NOT_APPLICABLE)
        continue;
      n_checked++;
      ck_assert_msg (ck->status != BW_CHECK_FAIL, "%s fails", ck->criterion->id);
    }
  g_array_unref (checks);
  ck_assert_uint_gt (n_checked, 0);

  /* The results table shows the new unit: its volume per unit (derived: the total over the
   * parallel count) and the editor's length entry. */
  table_after = bw_window_dup_results_text (w);
  ck_assert_str_ne (table_before, table_after);
  {
    g_autofree char *vol = bw_units_format (best->volume_m3 / best->n_parallel, BW_KIND_VOLUME,
                                            bw_window_get_unit_system (w));
    g_autofree char *len = bw_units_format (best->values[bw_param_index (u->type, "length")], BW_KIND_LENGTH,
                                            bw_window_get_unit_system (w));
    ck_assert_msg (strstr (table_after, vol) != NULL, "'%s' not in:\n%s", vol, table_after);
    ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (bw_window_get_field_widget (w, "length"))), len);
  }

  /* One undo restores the whole earlier state. */
  ck_assert (gtk_widget_activate_action (GTK_WIDGET (w), "win.undo", NULL));
  bw_gui_test_pump (20);
  ck_assert (bw_project_equal (bw_window_get_project (w), before));
  ck_assert (!bw_window_is_modified (w));
  {
    g_autofree char *table = bw_window_dup_results_text (w);
    ck_assert_str_eq (table, table_before);
  }
  ck_assert (gtk_widget_get_sensitive (apply)); /* the listed designs are current again */

  bw_autosize_result_clear (&want);
  gtk_window_destroy (GTK_WINDOW (d));
  bw_gui_test_close_window (w);
}
END_TEST

typedef struct
{
  BwAutosizeDialog *dialog;
  guint reports;
  double first;
} CancelProbe;

static void
cancel_on_first_report (BwAutosizeDialog *d, double fraction, gpointer data)
{
  CancelProbe *probe = data;

  if (probe->reports++ == 0)
    {
      probe->first = fraction;
      bw_autosize_dialog_cancel (d);
    }
}

START_TEST (test_cancel_stops_and_changes_nothing)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  /* The basin has the largest grid of the demo (231 176 designs; derived from the engine's
   * ranges: 37 widths x 71 lengths x 11 depths x 8 parallel counts, reported every 16 384). */
  BwAutosizeDialog *d = open_dialog (w, "north-sed");
  g_autoptr (BwProject) before = bw_project_copy (bw_window_get_project (w));
  CancelProbe probe = { d, 0, -1 };

  g_signal_connect (d, "search-progress", G_CALLBACK (cancel_on_first_report), &probe);
  bw_autosize_dialog_search (d);
  wait_finished (d);
  ck_assert_uint_ge (probe.reports, 1);
  ck_assert (probe.first > 0 && probe.first < 1);
  ck_assert_msg (strstr (bw_autosize_dialog_get_message (d), "cancelled") != NULL, "%s",
                 bw_autosize_dialog_get_message (d));
  ck_assert_ptr_null (bw_autosize_dialog_get_result (d));
  ck_assert_ptr_null (gtk_widget_get_first_child (bw_autosize_dialog_get_results_list (d)));
  ck_assert (bw_project_equal (bw_window_get_project (w), before));
  ck_assert (!bw_window_is_modified (w));
  {
    g_autoptr (GError) error = NULL;
    ck_assert (!bw_autosize_dialog_apply (d, 0, &error));
    ck_assert (g_str_has_prefix (error->message, "design: "));
  }
  /* A new search after a cancel runs to the end. */
  g_signal_handlers_disconnect_by_func (d, cancel_on_first_report, &probe);
  bw_autosize_dialog_search (d);
  wait_finished (d);
  ck_assert_ptr_nonnull (bw_autosize_dialog_get_result (d));
  gtk_window_destroy (GTK_WINDOW (d));
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_close_during_search_is_safe)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  BwAutosizeDialog *d = open_dialog (w, "north-sed");
  g_autoptr (BwProject) before = bw_project_copy (bw_window_get_project (w));
  gpointer alive = d;
  gint64 end = g_get_monotonic_time () + (gint64) WAIT_LIMIT_MS * 1000;

  g_object_add_weak_pointer (G_OBJECT (d), &alive);
  bw_autosize_dialog_search (d);
  ck_assert (bw_autosize_dialog_is_searching (d));
  gtk_window_close (GTK_WINDOW (d)); /* as the window manager's close button does */
  /* The search holds the dialog until it has stopped; then the dialog is freed. */
  while (alive && g_get_monotonic_time () < end)
    if (!g_main_context_iteration (NULL, FALSE))
      g_usleep (1000);
  ck_assert_ptr_null (alive);
  ck_assert_ptr_null (find_dialog (w));
  ck_assert (bw_project_equal (bw_window_get_project (w), before));
  /* The window goes on working. */
  d = open_dialog (w, "north-rm");
  bw_autosize_dialog_search (d);
  wait_finished (d);
  ck_assert_ptr_nonnull (bw_autosize_dialog_get_result (d));
  /* Closing the window takes the dialog with it. */
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_no_design_says_why)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  BwProject *big = bw_project_copy (bw_window_get_project (w));
  BwAutosizeDialog *d;
  BwAutosizeResult r;
  g_autoptr (GError) expect = NULL;
  const char *msg;

  /* A hundred times the demo's flows: no basin up to 8 x 20 m x 150 m keeps the overflow rate
   * within the textbook range (derived; the CLI says the same). */
  for (guint f = 0; f < BW_N_FLOW_KINDS; f++)
    big->basis.flow_m3_s[f] *= 100;
  bw_window_take_project (w, big);
  bw_gui_test_pump (20);
  d = open_dialog (w, "north-sed");
  bw_autosize_dialog_search (d);
  wait_finished (d);
  ck_assert_ptr_null (bw_autosize_dialog_get_result (d));
  /* derived: the engine's own reason, shown as it is. */
  ck_assert (!bw_autosize (bw_window_get_project (w), "north-sed", bw_window_get_criteria (w),
                           BW_OBJECTIVE_VOLUME, NULL, NULL, &r, &expect));
  bw_autosize_result_clear (&r);
  msg = bw_autosize_dialog_get_message (d);
  ck_assert_msg (strstr (msg, expect->message) != NULL, "'%s' lacks '%s'", msg, expect->message);
  ck_assert_ptr_nonnull (strstr (msg, "no design in the searched space"));
  ck_assert (!gtk_widget_get_sensitive (bw_gui_test_find_button (GTK_WIDGET (d), "_Apply")));
  gtk_window_destroy (GTK_WINDOW (d));
  bw_gui_test_close_window (w);
}
END_TEST

static Suite *
autosize_suite (void)
{
  Suite *s = suite_create ("gui-autosize");
  TCase *tc = tcase_create ("autosize");

  tcase_set_timeout (tc, 120);
  tcase_add_test (tc, test_action_follows_selection);
  tcase_add_test (tc, test_search_lists_engine_designs_and_applies_once);
  tcase_add_test (tc, test_cancel_stops_and_changes_nothing);
  tcase_add_test (tc, test_close_during_search_is_safe);
  tcase_add_test (tc, test_no_design_says_why);
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
  sr = srunner_create (autosize_suite ());
  srunner_set_fork_status (sr, CK_NOFORK); /* one GTK, one display for every test */
  srunner_run_all (sr, CK_NORMAL);
  failed = srunner_ntests_failed (sr);
  srunner_free (sr);
  g_object_unref (app);
  return failed == 0 ? 0 : 1;
}
