/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-chem.c: the chemistry page of the real window (real .ui resources, under a display):
 * typed doses with units reach the model and the rapid mix's results, refused entries are
 * flagged and not applied, undo restores, a jar-test sheet is imported, "Use this dose" sets the
 * dose range and the basins' sludge follows, and the chart paints. */
#include "config.h"

#include <cairo.h>
#include <check.h>
#include <math.h>
#include <string.h>

#include "bw-gui-test.h"
#include "draw/bw-style.h"
#include "engine/bw-chemistry.h"
#include "engine/bw-evaluate.h"
#include "engine/bw-jartest.h"
#include "engine/bw-project.h"
#include "gui/bw-chem-view.h"
#include "io/bw-jartest-csv.h"

static BwApplication *app;
static char *tmpdir;

/* Two evaluations of the same products in another order: agreement to 1e-12 relative. */
#define bw_assert_rel_gui(got, want)                                                        \
  do                                                                                        \
    {                                                                                       \
      const double _g = (got), _w = (want);                                                 \
      ck_assert_msg (isfinite (_g) && fabs (_g - _w) <= 1e-12 * fabs (_w), "%s = %.15g, want %.15g", \
                     #got, _g, _w);                                                         \
    }                                                                                       \
  while (0)

static BwWindow *
demo_window (void)
{
  g_autofree char *demo = bw_gui_test_demo_path ();
  g_autoptr (GError) error = NULL;
  BwWindow *w = bw_window_new (app);

  ck_assert_msg (bw_window_open_path (w, demo, &error), "%s", error ? error->message : "");
  gtk_window_set_default_size (GTK_WINDOW (w), 1024, 700);
  gtk_window_present (GTK_WINDOW (w));
  bw_window_show_page (w, "chemistry");
  bw_gui_test_pump (80);
  return w;
}

/* The chemistry page of W, found in its widget tree. */
static BwChemView *
chem_view (BwWindow *w)
{
  GtkWidget *stack[256];
  int top = 0;

  stack[top++] = GTK_WIDGET (w);
  while (top > 0)
    {
      GtkWidget *x = stack[--top];
      if (BW_IS_CHEM_VIEW (x))
        return BW_CHEM_VIEW (x);
      for (GtkWidget *c = gtk_widget_get_first_child (x); c && top < 255; c = gtk_widget_get_next_sibling (c))
        stack[top++] = c;
    }
  ck_abort_msg ("no chemistry page in the window");
  return NULL;
}

static GtkWidget *
type_into (BwChemView *v, const char *field, const char *text)
{
  GtkWidget *e = bw_chem_view_get_field_widget (v, field);

  ck_assert_msg (GTK_IS_ENTRY (e), "field %s is not an entry", field);
  gtk_editable_set_text (GTK_EDITABLE (e), text);
  g_signal_emit_by_name (e, "activate");
  bw_gui_test_pump (5);
  return e;
}

static const BwElementResult *
element (const BwResults *r, const char *id)
{
  for (guint i = 0; i < r->elements->len; i++)
    {
      const BwElementResult *e = g_ptr_array_index (r->elements, i);
      if (g_strcmp0 (e->id, id) == 0)
        return e;
    }
  ck_abort_msg ("no element %s", id);
  return NULL;
}

/* The maximum-day, coldest, all-in-service case of R. */
static int
design_case (const BwResults *r)
{
  for (guint c = 0; c < r->n_cases; c++)
    if (r->cases[c].flow == BW_FLOW_MAXIMUM_DAY && r->cases[c].temp == BW_TEMP_COLDEST
        && r->cases[c].service == BW_SERVICE_ALL_IN_SERVICE)
      return (int) c;
  ck_abort_msg ("no maximum-day coldest case");
  return -1;
}

static double
result_of (BwWindow *w, const char *id, BwQuantity q)
{
  const BwResults *r = bw_window_get_results (w);
  const int c = design_case (r);
  const BwElementResult *e;

  ck_assert_ptr_nonnull (r);
  e = element (r, id);
  ck_assert_msg (bw_quantity_set_has (&e->values[c], q), "%s lacks quantity %d", id, q);
  return e->values[c].values[q];
}

/* The engine's own figures for the window's project at DOSE through unit UNIT_ID at the
 * maximum-day flow, all in service: what the page and the rapid mix must agree with. */
static BwDosingResult
engine_dosing (BwWindow *w, const char *unit_id, double dose)
{
  const BwProject *p = bw_window_get_project (w);
  const BwProcessUnit *u = bw_project_find_unit (p, unit_id, NULL);
  BwCoagulant co;
  BwDosing d;
  BwDosingResult out;

  ck_assert_ptr_nonnull (u);
  ck_assert (bw_project_coagulant (p, &co, NULL));
  bw_dosing_init (&d, dose, bw_project_unit_flow (p, u, BW_FLOW_MAXIMUM_DAY, BW_SERVICE_ALL_IN_SERVICE));
  d.raw_alkalinity_kg_m3 = p->basis.alkalinity_kg_m3;
  d.turbidity_NTU = p->basis.turbidity_NTU;
  d.ss_factor = p->chemistry.ss_factor;
  if (p->chemistry.stock_fraction > 0 && p->chemistry.stock_density_kg_m3 > 0)
    {
      d.solution_fraction = p->chemistry.stock_fraction;
      d.solution_density_kg_m3 = p->chemistry.stock_density_kg_m3;
    }
  if (p->chemistry.sludge_solids_fraction > 0)
    d.solids_fraction = p->chemistry.sludge_solids_fraction;
  ck_assert (bw_dosing_evaluate (&co, &d, &out, NULL));
  return out;
}

/* The same at the plant's maximum-day flow (what the page's by-flow table shows). */
static BwDosingResult
engine_dosing_plant (BwWindow *w, double dose)
{
  const BwProject *p = bw_window_get_project (w);
  BwCoagulant co;
  BwDosing d;
  BwDosingResult out;

  ck_assert (bw_project_coagulant (p, &co, NULL));
  bw_dosing_init (&d, dose, p->basis.flow_m3_s[BW_FLOW_MAXIMUM_DAY]);
  d.turbidity_NTU = p->basis.turbidity_NTU;
  d.ss_factor = p->chemistry.ss_factor;
  if (p->chemistry.stock_fraction > 0 && p->chemistry.stock_density_kg_m3 > 0)
    {
      d.solution_fraction = p->chemistry.stock_fraction;
      d.solution_density_kg_m3 = p->chemistry.stock_density_kg_m3;
    }
  if (p->chemistry.sludge_solids_fraction > 0)
    d.solids_fraction = p->chemistry.sludge_solids_fraction;
  ck_assert (bw_dosing_evaluate (&co, &d, &out, NULL));
  return out;
}

/* VALUE_SI written as the page writes a flow in UNIT (four significant figures and the symbol). */
static char *
flow_text (double value_si, const char *unit)
{
  const BwUnit *u = bw_unit_lookup (unit, BW_KIND_FLOW, "flow", NULL);
  g_autofree char *n = NULL;

  ck_assert_ptr_nonnull (u);
  n = bw_format_number (bw_unit_from_si (u, value_si), 4);
  return g_strdup_printf ("%s %s", n, u->symbol);
}

START_TEST (test_chem_page_shows_demo)
{
  BwWindow *w = demo_window ();
  BwChemView *v = chem_view (w);
  g_autofree char *text = NULL;

  ck_assert (gtk_widget_get_mapped (GTK_WIDGET (v)));
  /* 30 mg/L from the demo file, formatted by the engine (four significant figures). */
  ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (bw_chem_view_get_field_widget (v, "dose:design"))),
                    "30.00 mg/L");
  ck_assert (gtk_check_button_get_active (GTK_CHECK_BUTTON (bw_chem_view_get_field_widget (v, "enabled"))));
  /* The demo's record is selected (the chemistry names it) and its jars are listed. */
  ck_assert_str_eq (bw_chem_view_get_selected_jar_test (v), "jt-2026-11");
  text = bw_chem_view_dup_results_text (v);
  ck_assert_msg (strstr (text, "north-rm") && strstr (text, "north-sed"), "%s", text);
  ck_assert_msg (strstr (text, "nan") == NULL && strstr (text, "inf") == NULL, "%s", text);
  bw_gui_test_close_window (w);
}
END_TEST

/* The feed and sludge tables are wider than the page's share of a 1024 px window: they scroll
 * sideways on their own, so they no longer set the page's width (its text wraps to the window,
 * the chart fits). */
START_TEST (test_chem_tables_do_not_widen_the_page)
{
  BwWindow *w = demo_window ();
  BwChemView *v = chem_view (w);
  GtkWidget *grid = bw_chem_view_get_widget (v, "results");
  GtkWidget *table_scroller = gtk_widget_get_ancestor (grid, GTK_TYPE_SCROLLED_WINDOW);
  GtkWidget *content;
  int grid_min, grid_nat, page_min, page_nat;

  ck_assert_ptr_nonnull (table_scroller);
  content = gtk_widget_get_parent (table_scroller);
  ck_assert (GTK_IS_BOX (content));
  gtk_widget_measure (grid, GTK_ORIENTATION_HORIZONTAL, -1, &grid_min, &grid_nat, NULL, NULL);
  gtk_widget_measure (content, GTK_ORIENTATION_HORIZONTAL, -1, &page_min, &page_nat, NULL, NULL);
  /* The tables need more than the page's minimum: they would have set it. */
  ck_assert_int_gt (grid_min, page_min);
  /* 740 px: a 1024 px window less the plant list (256 px) and the page margins (derived from
   * the window's 1024x700 screenshot). */
  ck_assert_int_le (page_min, 740);
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_chem_typed_dose_reaches_rapid_mix)
{
  BwWindow *w = demo_window ();
  BwChemView *v = chem_view (w);
  const double before = result_of (w, "north-rm", BW_Q_COAGULANT_FEED);
  GtkWidget *e;
  BwDosingResult d;

  e = type_into (v, "dose:maximum", "0.06 g/L");
  /* 0.06 g/L = 0.06 kg/m3 (1 g/L = 1 kg/m3 by definition). */
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.dose_max_kg_m3, 0.06, 1e-12);
  ck_assert (!gtk_widget_has_css_class (e, "error"));
  ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (e)), "60.00 mg/L");
  /* The rapid mix is fed at the maximum dose: the engine's own dosing function on the same
   * inputs (derived). */
  d = engine_dosing (w, "north-rm", 0.06);
  bw_assert_rel_gui (result_of (w, "north-rm", BW_Q_COAGULANT_FEED), d.feed_kg_s);
  ck_assert (result_of (w, "north-rm", BW_Q_COAGULANT_FEED) > before * 1.3); /* 60 vs 45 mg/L */
  ck_assert (bw_window_is_modified (w));

  /* Undo restores the 45 mg/L of the demo file. */
  gtk_widget_activate_action (GTK_WIDGET (w), "win.undo", NULL);
  bw_gui_test_pump (5);
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.dose_max_kg_m3, 0.045, 1e-12);
  ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (e)), "45.00 mg/L");
  ck_assert_double_eq_tol (result_of (w, "north-rm", BW_Q_COAGULANT_FEED), before, 1e-15);
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_chem_refused_entries_flagged)
{
  BwWindow *w = demo_window ();
  BwChemView *v = chem_view (w);
  GtkWidget *e, *err;

  /* A negative dose: the project's validation refuses it, naming the field. */
  e = type_into (v, "dose:minimum", "-5 mg/L");
  err = bw_chem_view_get_field_error (v, "dose:minimum");
  ck_assert (gtk_widget_has_css_class (e, "error"));
  ck_assert (gtk_widget_get_visible (err));
  ck_assert_msg (strstr (gtk_label_get_text (GTK_LABEL (err)), "minimum dose"), "%s",
                 gtk_label_get_text (GTK_LABEL (err)));
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.dose_min_kg_m3, 0.015, 1e-12);
  ck_assert (!bw_window_is_modified (w));
  /* The refused text stays for correcting. */
  ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (e)), "-5 mg/L");

  /* A length for a dose: the unit parser refuses it, naming the field. */
  e = type_into (v, "dose:design", "5 m");
  err = bw_chem_view_get_field_error (v, "dose:design");
  ck_assert (gtk_widget_has_css_class (e, "error"));
  ck_assert_msg (strstr (gtk_label_get_text (GTK_LABEL (err)), "design dose"), "%s",
                 gtk_label_get_text (GTK_LABEL (err)));
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.dose_design_kg_m3, 0.030, 1e-12);

  /* A design dose above the maximum breaks minimum <= design <= maximum. */
  e = type_into (v, "dose:design", "50 mg/L");
  ck_assert (gtk_widget_has_css_class (e, "error"));
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.dose_design_kg_m3, 0.030, 1e-12);

  /* Typing a good value clears the flag and applies it. */
  e = type_into (v, "dose:design", "25");
  ck_assert (!gtk_widget_has_css_class (e, "error"));
  ck_assert (!gtk_widget_get_visible (bw_chem_view_get_field_error (v, "dose:design")));
  /* A bare number is in the display unit, mg/L: 25 mg/L = 0.025 kg/m3 (definition). */
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.dose_design_kg_m3, 0.025, 1e-12);

  /* The target turbidity (a saved field): refused when negative. */
  e = type_into (v, "target", "-1");
  ck_assert (gtk_widget_has_css_class (e, "error"));
  ck_assert (gtk_widget_get_visible (bw_chem_view_get_field_error (v, "target")));
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_chem_import_use_dose_and_chart)
{
  BwWindow *w = demo_window ();
  BwChemView *v = chem_view (w);
  const char *root = g_getenv ("BW_SOURCE_ROOT");
  g_autofree char *csv = g_build_filename (root ? root : ".", "data", "examples",
                                           "alder-creek-jartest.csv", NULL);
  g_autofree char *bad = g_build_filename (tmpdir, "bad.csv", NULL);
  g_autoptr (GError) error = NULL;
  const double sludge_before = result_of (w, "north-sed", BW_Q_SLUDGE);
  const BwProject *p;
  BwJarSeries s;
  BwJarResult res;
  BwDosingResult d;

  /* A malformed sheet: the reader's message names the file and line; nothing is added. */
  ck_assert (g_file_set_contents (bad, "dose (mg/L),turbidity (NTU)\n10,5\n20,x\n30,2\n", -1, NULL));
  ck_assert (!bw_chem_view_import_path (v, bad, &error));
  ck_assert_msg (error && strstr (error->message, "bad.csv:3"), "%s", error ? error->message : "");
  ck_assert_uint_eq (bw_window_get_project (w)->jar_tests->len, 1);
  g_clear_error (&error);

  /* The example sheet becomes a second record, selected. */
  ck_assert_msg (bw_chem_view_import_path (v, csv, &error), "%s", error ? error->message : "");
  bw_gui_test_pump (20);
  p = bw_window_get_project (w);
  ck_assert_uint_eq (p->jar_tests->len, 2);
  ck_assert_str_eq (bw_chem_view_get_selected_jar_test (v), "jt-alder-creek-jartest");

  /* Use this dose: the design dose is the least dose reaching the project's saved target (2 NTU
   * in the demo file) and the range the destabilised window, both from the engine's analysis of
   * the same sheet (derived); 40 mg/L is the sheet's clearest jar (1.2 NTU, read from the CSV),
   * and 30 mg/L its first jar at or below 2 NTU (1.9 NTU, read from the CSV). */
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.target_NTU, 2.0, 1e-12);
  ck_assert (bw_jartest_load_csv (csv, &s, NULL));
  ck_assert (bw_jar_analyse (&s, 2.0, BW_ZETA_DESTABILISED_DEFAULT_V, &res, NULL));
  ck_assert (res.has_window && res.has_target);
  ck_assert_double_eq_tol (res.optimum_dose_kg_m3, 0.040, 1e-12);
  ck_assert (res.target_dose_kg_m3 > 0.020 && res.target_dose_kg_m3 <= 0.030);
  ck_assert (gtk_widget_is_sensitive (bw_chem_view_get_widget (v, "use")));
  g_signal_emit_by_name (bw_chem_view_get_widget (v, "use"), "clicked");
  bw_gui_test_pump (20);
  ck_assert_msg (strstr (gtk_window_get_title (GTK_WINDOW (w)), "•") != NULL, "%s", gtk_window_get_title (GTK_WINDOW (w)));
  p = bw_window_get_project (w);
  ck_assert_double_eq_tol (p->chemistry.dose_design_kg_m3, res.target_dose_kg_m3, 1e-12);
  ck_assert_double_eq_tol (p->chemistry.dose_min_kg_m3, res.window_low_kg_m3, 1e-12);
  ck_assert_double_eq_tol (p->chemistry.dose_max_kg_m3, res.window_high_kg_m3, 1e-12);
  ck_assert_str_eq (p->chemistry.jar_test, "jt-alder-creek-jartest");
  /* The rapid mix and the basin follow (bw_project_evaluate against bw_dosing_evaluate on the
   * same inputs: derived). */
  d = engine_dosing (w, "north-rm", res.window_high_kg_m3);
  bw_assert_rel_gui (result_of (w, "north-rm", BW_Q_COAGULANT_FEED), d.feed_kg_s);
  d = engine_dosing (w, "north-sed", res.target_dose_kg_m3);
  bw_assert_rel_gui (result_of (w, "north-sed", BW_Q_SLUDGE), d.sludge_kg_s);
  /* 29.2 vs 30 mg/L: a little less sludge. */
  ck_assert (result_of (w, "north-sed", BW_Q_SLUDGE) < sludge_before);

  /* The chart area has painted, and the same painter inks an image. */
  bw_gui_test_pump (150);
  ck_assert_uint_gt (bw_chem_view_get_paint_count (v), 0);
  {
    cairo_surface_t *img = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, 800, 500);
    cairo_t *cr = cairo_create (img);
    const BwRgb paper = bw_style_light ()->paper;
    const unsigned char *data;
    guint inked = 0, total = 0;
    int stride;

    ck_assert_msg (bw_chem_view_paint_chart (v, cr, 800, 500, FALSE, &error), "%s",
                   error ? error->message : "");
    cairo_destroy (cr);
    cairo_surface_flush (img);
    data = cairo_image_surface_get_data (img);
    stride = cairo_image_surface_get_stride (img);
    for (int y = 0; y < 500; y += 2)
      for (int x = 0; x < 800; x += 2)
        {
          guint32 px = *(const guint32 *) (data + y * stride + 4 * x);
          double r = ((px >> 16) & 0xff) / 255.0, g = ((px >> 8) & 0xff) / 255.0, b = (px & 0xff) / 255.0;
          inked += MAX (fabs (r - paper.r), MAX (fabs (g - paper.g), fabs (b - paper.b))) > 0.05;
          total++;
        }
    /* Text, grid, bands and curves: well over 3 % of the canvas (common practice, no source:
     * an empty frame with titles inks under 2 %). */
    ck_assert_msg (inked > total * 0.03, "only %u of %u pixels inked", inked, total);
    cairo_surface_destroy (img);
  }

  /* Undo takes the dose back, then the import. */
  gtk_widget_activate_action (GTK_WIDGET (w), "win.undo", NULL);
  bw_gui_test_pump (5);
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.dose_design_kg_m3, 0.030, 1e-12);
  gtk_widget_activate_action (GTK_WIDGET (w), "win.undo", NULL);
  bw_gui_test_pump (5);
  ck_assert_uint_eq (bw_window_get_project (w)->jar_tests->len, 1);

  /* Remove the demo's record: the chemistry stops naming it, as one edit. */
  ck_assert (bw_chem_view_select_jar_test (v, "jt-2026-11"));
  g_signal_emit_by_name (bw_chem_view_get_widget (v, "remove"), "clicked");
  bw_gui_test_pump (5);
  ck_assert_uint_eq (bw_window_get_project (w)->jar_tests->len, 0);
  ck_assert_ptr_null (bw_window_get_project (w)->chemistry.jar_test);
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_chem_kind_and_units)
{
  BwWindow *w = demo_window ();
  BwChemView *v = chem_view (w);
  GtkWidget *dd = bw_chem_view_get_field_widget (v, "kind");
  GtkWidget *pacl = bw_chem_view_get_field_widget (v, "al2o3");

  ck_assert (!gtk_widget_get_visible (pacl));
  ck_assert (gtk_widget_get_visible (bw_chem_view_get_field_widget (v, "hydrate")));
  gtk_drop_down_set_selected (GTK_DROP_DOWN (dd), 3); /* PACl */
  bw_gui_test_pump (5);
  ck_assert_int_eq (bw_window_get_project (w)->chemistry.kind, BW_COAGULANT_PACL);
  ck_assert (gtk_widget_get_visible (pacl));
  type_into (v, "al2o3", "17 %");
  /* 17 % = 0.17 (definition of the percent). */
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.al2o3_fraction, 0.17, 1e-12);
  type_into (v, "al2o3", "170 %");
  ck_assert (gtk_widget_has_css_class (pacl, "error"));
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.al2o3_fraction, 0.17, 1e-12);

  /* US units: the dose still reads in mg/L, the feed in lb/d (the window's unit system). */
  bw_application_set_unit_system (app, BW_UNIT_SYSTEM_US);
  bw_gui_test_pump (10);
  {
    g_autofree char *text = bw_chem_view_dup_results_text (v);
    ck_assert_msg (strstr (text, "lb/d"), "%s", text);
  }
  bw_application_set_unit_system (app, BW_UNIT_SYSTEM_SI);
  bw_gui_test_pump (10);
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_chem_liquid_feed_and_sludge_volume)
{
  BwWindow *w = demo_window ();
  BwChemView *v = chem_view (w);
  const BwProject *p;
  GtkWidget *e;
  BwDosingResult d;
  double q;

  /* The demo's liquid alum: 48.5 % at 1330 kg/m3, shown as typed in the file. */
  ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (bw_chem_view_get_field_widget (v, "stock-strength"))),
                    "48.50%");

  /* A stock of another strength and density, typed with unit suffixes. */
  e = type_into (v, "stock-strength", "40 %");
  ck_assert (!gtk_widget_has_css_class (e, "error"));
  type_into (v, "stock-density", "1.2 g/mL");
  p = bw_window_get_project (w);
  /* 40 % = 0.40 and 1.2 g/mL = 1200 kg/m3 (definitions of the units). */
  ck_assert_double_eq_tol (p->chemistry.stock_fraction, 0.40, 1e-12);
  ck_assert_double_eq_tol (p->chemistry.stock_density_kg_m3, 1200, 1e-9);
  ck_assert (bw_window_is_modified (w));

  /* The rapid mix's liquid feed at the maximum dose: the engine's dosing function on the same
   * inputs (derived), and the mass balance Q D / (w rho) by hand (derived). */
  q = bw_project_unit_flow (p, bw_project_find_unit (p, "north-rm", NULL), BW_FLOW_MAXIMUM_DAY,
                            BW_SERVICE_ALL_IN_SERVICE);
  d = engine_dosing (w, "north-rm", p->chemistry.dose_max_kg_m3);
  bw_assert_rel_gui (result_of (w, "north-rm", BW_Q_COAGULANT_SOLUTION), d.solution_m3_s);
  ck_assert_double_eq_tol (result_of (w, "north-rm", BW_Q_COAGULANT_SOLUTION),
                           q * 0.045 / (0.40 * 1200), 1e-15);
  /* The page's by-flow table shows the plant's liquid feed in L/h, as the engine computes it. */
  d = engine_dosing_plant (w, p->chemistry.dose_max_kg_m3);
  ck_assert (d.solution_m3_s > 0);
  {
    g_autofree char *want = flow_text (d.solution_m3_s, "L/h");
    g_autofree char *text = bw_chem_view_dup_results_text (v);
    ck_assert_msg (strstr (text, want), "'%s' not in %s", want, text);
    ck_assert_msg (strstr (text, "nan") == NULL && strstr (text, "inf") == NULL, "%s", text);
  }

  /* The sludge solids content: the basin's sludge volume and the page's m3/d follow (derived). */
  type_into (v, "sludge-solids", "2%");
  p = bw_window_get_project (w);
  ck_assert_double_eq_tol (p->chemistry.sludge_solids_fraction, 0.02, 1e-12);
  d = engine_dosing (w, "north-sed", p->chemistry.dose_design_kg_m3);
  ck_assert (d.has_sludge_volume);
  bw_assert_rel_gui (result_of (w, "north-sed", BW_Q_SLUDGE_VOLUME), d.sludge_m3_s);
  {
    g_autofree char *want = NULL;
    g_autofree char *text = bw_chem_view_dup_results_text (v);
    d = engine_dosing_plant (w, p->chemistry.dose_design_kg_m3);
    want = flow_text (d.sludge_m3_s, "m3/d");
    ck_assert_msg (strstr (text, want), "'%s' not in %s", want, text);
  }

  /* Emptied, the strength is not given: no liquid feed anywhere, and the note says why. */
  type_into (v, "stock-strength", "");
  p = bw_window_get_project (w);
  ck_assert (p->chemistry.stock_fraction == 0); /* "not given" */
  {
    const BwResults *r = bw_window_get_results (w);
    const BwElementResult *el = element (r, "north-rm");
    ck_assert (!bw_quantity_set_has (&el->values[design_case (r)], BW_Q_COAGULANT_SOLUTION));
  }
  {
    g_autofree char *text = bw_chem_view_dup_results_text (v);
    ck_assert_msg (strstr (text, " L/h") == NULL, "%s", text);
  }

  /* Undo brings the 40 % back, with its feed. */
  gtk_widget_activate_action (GTK_WIDGET (w), "win.undo", NULL);
  bw_gui_test_pump (5);
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.stock_fraction, 0.40, 1e-12);
  bw_gui_test_close_window (w);
}
END_TEST

START_TEST (test_chem_new_fields_refused)
{
  BwWindow *w = demo_window ();
  BwChemView *v = chem_view (w);
  GtkWidget *e, *err;

  /* Above 100 %: the project's validation refuses it, naming the field. */
  e = type_into (v, "stock-strength", "150 %");
  err = bw_chem_view_get_field_error (v, "stock-strength");
  ck_assert (gtk_widget_has_css_class (e, "error"));
  ck_assert (gtk_widget_get_visible (err));
  ck_assert_msg (strstr (gtk_label_get_text (GTK_LABEL (err)), "stock solution strength"), "%s",
                 gtk_label_get_text (GTK_LABEL (err)));
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.stock_fraction, 0.485, 1e-12);
  ck_assert (!bw_window_is_modified (w));

  /* Zero is not taken for "none" silently. */
  e = type_into (v, "stock-strength", "0");
  ck_assert (gtk_widget_has_css_class (e, "error"));
  ck_assert_msg (strstr (gtk_label_get_text (GTK_LABEL (err)), "above zero"), "%s",
                 gtk_label_get_text (GTK_LABEL (err)));
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.stock_fraction, 0.485, 1e-12);

  /* A length for a density: the unit parser refuses it, naming the field. */
  e = type_into (v, "stock-density", "5 m");
  err = bw_chem_view_get_field_error (v, "stock-density");
  ck_assert (gtk_widget_has_css_class (e, "error"));
  ck_assert_msg (strstr (gtk_label_get_text (GTK_LABEL (err)), "stock solution density"), "%s",
                 gtk_label_get_text (GTK_LABEL (err)));
  /* A density no stock has (engine range 500-3000 kg/m3). */
  e = type_into (v, "stock-density", "50 kg/m3");
  ck_assert (gtk_widget_has_css_class (e, "error"));
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.stock_density_kg_m3, 1330, 1e-9);

  /* A sludge of 90 % solids is not a settled sludge (engine range to 60 %). */
  e = type_into (v, "sludge-solids", "90 %");
  err = bw_chem_view_get_field_error (v, "sludge-solids");
  ck_assert (gtk_widget_has_css_class (e, "error"));
  ck_assert_msg (strstr (gtk_label_get_text (GTK_LABEL (err)), "sludge solids content"), "%s",
                 gtk_label_get_text (GTK_LABEL (err)));
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.sludge_solids_fraction, 0.01, 1e-12);
  ck_assert (!bw_window_is_modified (w));

  /* The target turbidity is project data now: a typed one is one undoable edit ... */
  e = type_into (v, "target", "1.5");
  ck_assert (!gtk_widget_has_css_class (e, "error"));
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.target_NTU, 1.5, 1e-12);
  ck_assert (bw_window_is_modified (w));
  /* ... zero is refused (empty means none) ... */
  e = type_into (v, "target", "0");
  ck_assert (gtk_widget_has_css_class (e, "error"));
  ck_assert_msg (strstr (gtk_label_get_text (GTK_LABEL (bw_chem_view_get_field_error (v, "target"))),
                         "target settled turbidity"), "refused without naming the field");
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.target_NTU, 1.5, 1e-12);
  /* ... and undo restores the demo's 2 NTU in the entry. */
  gtk_widget_activate_action (GTK_WIDGET (w), "win.undo", NULL);
  bw_gui_test_pump (5);
  ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.target_NTU, 2.0, 1e-12);
  ck_assert (!gtk_widget_has_css_class (e, "error"));
  ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (e)), "2.000");

  /* Soda ash instead of lime: the model and the table's heading follow. */
  gtk_drop_down_set_selected (GTK_DROP_DOWN (bw_chem_view_get_field_widget (v, "alkali")), 1);
  bw_gui_test_pump (5);
  ck_assert_int_eq (bw_window_get_project (w)->chemistry.alkali, BW_ALKALI_SODA_ASH);
  {
    g_autofree char *text = bw_chem_view_dup_results_text (v);
    ck_assert_msg (strstr (text, "Soda ash"), "%s", text);
  }
  bw_gui_test_close_window (w);
}
END_TEST

/* Renders W to BW_SHOT_DIR/NAME.png for looking at (asserts only that it was written). */
static void
shoot (GtkWidget *w, const char *name)
{
  const char *dir = g_getenv ("BW_SHOT_DIR");
  g_autofree char *path = g_strdup_printf ("%s/%s.png", dir ? dir : ".", name);
  g_autoptr (GdkPaintable) paintable = NULL;
  g_autoptr (GskRenderNode) node = NULL;
  g_autoptr (GdkTexture) tex = NULL;
  int width = 0, height = 0;

  bw_gui_test_pump (250);
  paintable = gtk_widget_paintable_new (w);
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
  tex = gsk_renderer_render_texture (gtk_native_get_renderer (gtk_widget_get_native (w)), node,
                                     &GRAPHENE_RECT_INIT (0, 0, width, height));
  ck_assert (gdk_texture_save_to_png (tex, path));
  g_printerr ("wrote %s (%dx%d)\n", path, width, height);
}

START_TEST (test_chem_screenshot)
{
  BwWindow *w = demo_window ();
  BwChemView *v = chem_view (w);

  /* Usable at 1024 x 700: the page scrolls instead of growing the window. */
  shoot (GTK_WIDGET (w), "shot-chemistry");
  ck_assert_int_le (gtk_widget_get_width (GTK_WIDGET (w)), 1100);
  ck_assert_int_le (gtk_widget_get_height (GTK_WIDGET (w)), 760);
  /* The feed, alkalinity and sludge tables on their own, for reading them. */
  shoot (bw_chem_view_get_widget (v, "results"), "shot-chemistry-results");
  type_into (v, "dose:minimum", "5 m");
  shoot (GTK_WIDGET (w), "shot-chemistry-invalid");
  bw_gui_test_close_window (w);
}
END_TEST

static Suite *
chem_suite (void)
{
  Suite *s = suite_create ("chemistry page");
  TCase *tc = tcase_create ("page");

  tcase_set_timeout (tc, 60);
  tcase_add_test (tc, test_chem_page_shows_demo);
  tcase_add_test (tc, test_chem_tables_do_not_widen_the_page);
  tcase_add_test (tc, test_chem_typed_dose_reaches_rapid_mix);
  tcase_add_test (tc, test_chem_refused_entries_flagged);
  tcase_add_test (tc, test_chem_import_use_dose_and_chart);
  tcase_add_test (tc, test_chem_kind_and_units);
  tcase_add_test (tc, test_chem_liquid_feed_and_sludge_volume);
  tcase_add_test (tc, test_chem_new_fields_refused);
  tcase_add_test (tc, test_chem_screenshot);
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
  sr = srunner_create (chem_suite ());
  srunner_set_fork_status (sr, CK_NOFORK); /* one GTK, one display for every test */
  srunner_run_all (sr, CK_NORMAL);
  failed = srunner_ntests_failed (sr);
  srunner_free (sr);
  g_object_unref (app);
  return failed == 0 ? 0 : 1;
}
