/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-i18n.c: the real window in Spanish (es_ES.UTF-8, catalogue from the build tree):
 * labels from the .ui and from C code translated, results with a decimal comma, and a decimal
 * comma typed into an entry read as the engine's point. */
#include "config.h"

#include <check.h>
#include <glib/gi18n.h>
#include <locale.h>
#include <math.h>
#include <string.h>

#include "bw-gui-test.h"
#include "engine/bw-project.h"
#include "gui/bw-chem-view.h"
#include "draw/bw-chart-jartest.h"
#include "draw/bw-report.h"
#include "gui/bw-locale.h"
#include "gui/bw-review-view.h"

static BwApplication *app;
static char *tmpdir;

/* Hides W: the windows are destroyed with the application at the end. */
static void
close_window (BwWindow *w)
{
  gtk_widget_set_visible (GTK_WIDGET (w), FALSE);
  bw_gui_test_pump (10);
}

/* The first label under ROOT whose text is TEXT (or starts with it when PREFIX). */
static GtkWidget *
find_label (GtkWidget *root, const char *text, gboolean prefix)
{
  if (GTK_IS_LABEL (root))
    {
      const char *t = gtk_label_get_text (GTK_LABEL (root));
      if (prefix ? g_str_has_prefix (t, text) : g_strcmp0 (t, text) == 0)
        return root;
    }
  for (GtkWidget *c = gtk_widget_get_first_child (root); c; c = gtk_widget_get_next_sibling (c))
    {
      GtkWidget *found = find_label (c, text, prefix);
      if (found)
        return found;
    }
  return NULL;
}

static GtkStack *
find_stack (GtkWidget *root)
{
  if (GTK_IS_STACK (root) && gtk_stack_get_child_by_name (GTK_STACK (root), "unit"))
    return GTK_STACK (root);
  for (GtkWidget *c = gtk_widget_get_first_child (root); c; c = gtk_widget_get_next_sibling (c))
    {
      GtkStack *s = find_stack (c);
      if (s)
        return s;
    }
  return NULL;
}

/* How many labels under ROOT carry the CSS class "bw-status" (a check's chip) and read TEXT. */
static guint
count_chips (GtkWidget *root, const char *text)
{
  guint n = 0;

  if (GTK_IS_LABEL (root) && gtk_widget_has_css_class (root, "bw-status")
      && g_strcmp0 (gtk_label_get_text (GTK_LABEL (root)), text) == 0)
    n++;
  for (GtkWidget *c = gtk_widget_get_first_child (root); c; c = gtk_widget_get_next_sibling (c))
    n += count_chips (c, text);
  return n;
}

/* TRUE when TEXT holds a digit, a comma and a digit in a row ("56,00"). */
static gboolean
has_decimal_comma (const char *text)
{
  for (const char *p = text; p[0] && p[1] && p[2]; p++)
    if (g_ascii_isdigit (p[0]) && p[1] == ',' && g_ascii_isdigit (p[2]))
      return TRUE;
  return FALSE;
}

START_TEST (test_spanish_strings_show)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkStack *stack = find_stack (GTK_WIDGET (w));
  GtkWidget *caution;

  /* A label from ui/bw-window.ui, through the template's translation domain (po/es.po). */
  ck_assert_ptr_nonnull (find_label (GTK_WIDGET (w), "Planta, en el orden del flujo", FALSE));
  ck_assert_ptr_null (find_label (GTK_WIDGET (w), "Plant, in flow order", FALSE));
  /* The Unit page title (a .ui string) and the Results heading (set from C code). */
  ck_assert_ptr_nonnull (stack);
  ck_assert_str_eq (gtk_stack_page_get_title (gtk_stack_get_page (stack,
                                                                  gtk_stack_get_child_by_name (stack, "unit"))),
                    "Unidad");
  bw_window_select_unit (w, "north-sed");
  bw_gui_test_pump (5);
  ck_assert_ptr_nonnull (find_label (GTK_WIDGET (w), "Resultados: ", TRUE));
  /* The status line, with ngettext's plural (po/es.po). */
  {
    GtkWidget *s = NULL;
    for (int n = 1; n < 200 && s == NULL; n++)
      {
        g_autofree char *want = g_strdup_printf ("%d casos de carga calculados · ", n);
        s = find_label (GTK_WIDGET (w), want, TRUE);
      }
    ck_assert_msg (s != NULL, "no status line in Spanish");
  }
  /* The caution, translated faithfully and on screen (po/es.po). */
  caution = find_label (GTK_WIDGET (w), "Ayuda preliminar de diseño. Todo resultado debe ser revisado "
                        "y verificado por un ingeniero colegiado", TRUE);
  ck_assert_ptr_nonnull (caution);
  ck_assert (gtk_widget_get_mapped (caution));
  ck_assert_str_eq (gtk_label_get_text (GTK_LABEL (caution)), _(BW_CAUTION_TEXT));
  close_window (w);
}
END_TEST

/* Text the engine supplies (parameter tables, quantity names, check status words) is marked
 * N_() there and translated where the workbench shows it; so are the newer pages and dialogs. */
START_TEST (test_engine_text_in_spanish)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkStack *stack = find_stack (GTK_WIDGET (w));
  GtkWidget *review;
  guint chips;

  bw_window_select_unit (w, "north-sed");
  bw_gui_test_pump (5);
  /* A parameter label of the rectangular basin's table (bw-params.c, po/es.po). */
  ck_assert_ptr_nonnull (find_label (GTK_WIDGET (w), "profundidad de la zona de lodos", FALSE));
  ck_assert_ptr_null (find_label (GTK_WIDGET (w), "sludge zone depth", FALSE));
  /* A quantity name in the results table (bw-quantity.c, po/es.po). */
  ck_assert_ptr_nonnull (find_label (GTK_WIDGET (w), "carga superficial", FALSE));
  ck_assert_ptr_null (find_label (GTK_WIDGET (w), "surface overflow rate", FALSE));
  /* The status chips of the checks (bw-criteria.c, context "check"): Spanish, never English. */
  chips = count_chips (GTK_WIDGET (w), "cumple") + count_chips (GTK_WIDGET (w), "aviso")
          + count_chips (GTK_WIDGET (w), "falla");
  ck_assert_uint_gt (chips, 0);
  ck_assert_uint_eq (count_chips (GTK_WIDGET (w), "pass") + count_chips (GTK_WIDGET (w), "warn")
                     + count_chips (GTK_WIDGET (w), "fail"), 0);
  /* The Review page title (bw-window.c) and the auto-size button (ui/bw-window.ui). */
  ck_assert_ptr_nonnull (stack);
  review = gtk_stack_get_child_by_name (stack, "review");
  ck_assert_ptr_nonnull (review);
  ck_assert_str_eq (gtk_stack_page_get_title (gtk_stack_get_page (stack, review)), "Revisión");
  ck_assert_ptr_nonnull (bw_gui_test_find_button (GTK_WIDGET (w), "_Autodimensionar…"));
  ck_assert_ptr_null (bw_gui_test_find_button (GTK_WIDGET (w), "Auto-_size…"));
  close_window (w);
}
END_TEST

START_TEST (test_numbers_use_the_decimal_comma)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkWidget *e;
  g_autofree char *results = NULL;
  const BwProcessUnit *u;

  ck_assert_str_eq (bw_locale_decimal_point (), ",");
  bw_window_select_unit (w, "north-sed");
  e = bw_window_get_field_widget (w, "length");
  /* 56 m from the demo file, four significant figures (the engine's format), decimal comma. */
  ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (e)), "56,00 m");
  results = bw_window_dup_results_text (w);
  ck_assert_msg (has_decimal_comma (results), "no decimal comma in the results: %s", results);
  ck_assert_msg (strstr (results, "NaN") == NULL && strstr (results, "nan") == NULL, "%s", results);

  /* Typed with the locale's comma: read as 1.5 m (derived: 1,5 in es_ES is one and a half). */
  gtk_editable_set_text (GTK_EDITABLE (e), "1,5 m");
  g_signal_emit_by_name (e, "activate");
  bw_gui_test_pump (5);
  u = bw_project_find_unit (bw_window_get_project (w), "north-sed", NULL);
  ck_assert_ptr_nonnull (u);
  ck_assert_double_eq_tol (bw_process_unit_get (u, "length"), 1.5, 1e-12);
  ck_assert (!gtk_widget_has_css_class (e, "error"));
  ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (e)), "1,500 m");
  /* A point still reads as a decimal point there: 2.25 m (derived). */
  gtk_editable_set_text (GTK_EDITABLE (e), "2.25 m");
  g_signal_emit_by_name (e, "activate");
  bw_gui_test_pump (5);
  ck_assert_double_eq_tol (bw_process_unit_get (u, "length"), 2.25, 1e-12);

  /* The Chemistry page's tables read with the comma too: the demo's minimum dose, 15 mg/L, is
   * "15,00 mg/L" there (derived), with the flow kind in Spanish. */
  {
    GtkStack *stack = find_stack (GTK_WIDGET (w));
    GtkWidget *chem = gtk_stack_get_child_by_name (stack, "chemistry");
    g_autofree char *chem_text = NULL;
    ck_assert (BW_IS_CHEM_VIEW (chem));
    gtk_stack_set_visible_child (stack, chem);
    bw_gui_test_pump (5);
    chem_text = bw_chem_view_dup_results_text (BW_CHEM_VIEW (chem));
    ck_assert_msg (strstr (chem_text, "15,00 mg/L") != NULL, "%s", chem_text);
    ck_assert_msg (strstr (chem_text, "15.00 mg/L") == NULL, "%s", chem_text);
    ck_assert_msg (strstr (chem_text, "peak hour") == NULL, "%s", chem_text);
    /* Its entries too: the demo's 30 mg/L design dose reads "30,00 mg/L", and "32,5 mg/L"
     * typed there is 32.5 mg/L = 0.0325 kg/m³ (derived). */
    e = bw_chem_view_get_field_widget (BW_CHEM_VIEW (chem), "dose:design");
    ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (e)), "30,00 mg/L");
    gtk_editable_set_text (GTK_EDITABLE (e), "32,5 mg/L");
    g_signal_emit_by_name (e, "activate");
    bw_gui_test_pump (5);
    ck_assert (!gtk_widget_has_css_class (e, "error"));
    ck_assert_double_eq_tol (bw_window_get_project (w)->chemistry.dose_design_kg_m3, 0.0325, 1e-12);
    ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (e)), "32,50 mg/L");
  }
  close_window (w);
}
END_TEST

/* The engine's own messages (bw-units.c, bw-error.c, through bw-i18n.h) reach the field's
 * in-place error in Spanish, the quantity kinds with them. */
START_TEST (test_engine_messages_in_spanish)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkWidget *e, *err;
  const char *shown;

  bw_window_select_unit (w, "north-sed");
  e = bw_window_get_field_widget (w, "length");
  gtk_editable_set_text (GTK_EDITABLE (e), "12 kg");
  g_signal_emit_by_name (e, "activate");
  bw_gui_test_pump (5);
  err = bw_window_get_field_error (w, "length");
  ck_assert (gtk_widget_get_visible (err));
  shown = gtk_label_get_text (GTK_LABEL (err));
  ck_assert_msg (strstr (shown, "«kg» es una unidad de masa, pero se espera una longitud") != NULL,
                 "not the Spanish message: %s", shown);
  ck_assert_msg (strstr (shown, "is a unit of") == NULL, "English left in: %s", shown);
  /* A number the parser refuses, in Spanish too. */
  gtk_editable_set_text (GTK_EDITABLE (e), "abc");
  g_signal_emit_by_name (e, "activate");
  bw_gui_test_pump (5);
  shown = gtk_label_get_text (GTK_LABEL (err));
  ck_assert_msg (strstr (shown, "«abc» no empieza por un número") != NULL, "%s", shown);
  ck_assert_double_eq (bw_process_unit_get (bw_project_find_unit (bw_window_get_project (w), "north-sed", NULL),
                                            "length"), 56.0);
  close_window (w);
}
END_TEST

/* The models' and the file loader's messages are Spanish too: a geometry the paddle model
 * refuses, shown under the field, and a project file the loader refuses, as open reports it. */
START_TEST (test_model_and_loader_messages_in_spanish)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  g_autofree char *demo = bw_gui_test_demo_path ();
  g_autofree char *text = NULL;
  g_autofree char *bad = g_build_filename (tmpdir, "malo.bwproj", NULL);
  g_autoptr (GError) error = NULL;
  GtkWidget *e, *err;
  const char *shown;
  char *at;

  /* Two wheels of 50 m blades along a 3 m shaft (bw-floc.c, the paddle geometry check). */
  bw_window_select_unit (w, "north-floc-2");
  e = bw_window_get_field_widget (w, "blade-length");
  gtk_editable_set_text (GTK_EDITABLE (e), "50 m");
  g_signal_emit_by_name (e, "activate");
  bw_gui_test_pump (5);
  err = bw_window_get_field_error (w, "blade-length");
  ck_assert (gtk_widget_get_visible (err));
  shown = gtk_label_get_text (GTK_LABEL (err));
  ck_assert_msg (strstr (shown, "a lo largo del eje") != NULL, "not the Spanish message: %s", shown);
  ck_assert_msg (strstr (shown, "along the shaft") == NULL, "English left in: %s", shown);
  ck_assert_double_eq (bw_process_unit_get (bw_project_find_unit (bw_window_get_project (w), "north-floc-2", NULL),
                                            "blade-length"), 2.2);

  /* The demo with a stage type no version of the program has (bw-project-xml.c). */
  ck_assert (g_file_get_contents (demo, &text, NULL, NULL));
  at = strstr (text, "type=\"paddle-stage\"");
  ck_assert_ptr_nonnull (at);
  memcpy (at, "type=\"puddle-stage\"", strlen ("type=\"puddle-stage\""));
  ck_assert (g_file_set_contents (bad, text, -1, NULL));
  ck_assert (!bw_window_open_path (w, bad, &error));
  ck_assert_ptr_nonnull (error);
  ck_assert_msg (strstr (error->message, "no es un tipo de etapa de floculador que Basinwright conozca") != NULL,
                 "not the Spanish message: %s", error->message);
  close_window (w);
}
END_TEST

/* The whole text of the labels under WIDGET, in tree order, separated by " | ". */
static void
append_labels (GtkWidget *widget, GString *out)
{
  if (GTK_IS_LABEL (widget))
    g_string_append_printf (out, "%s | ", gtk_label_get_text (GTK_LABEL (widget)));
  for (GtkWidget *c = gtk_widget_get_first_child (widget); c; c = gtk_widget_get_next_sibling (c))
    append_labels (c, out);
}

/* The review page shows its numbers with the decimal comma, and reads one typed that way: the
 * tolerance "1,000" % is one per cent, not a thousand. */
START_TEST (test_review_numbers_in_spanish)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  GtkWidget *v = bw_gui_test_find_widget (GTK_WIDGET (w), BW_TYPE_REVIEW_VIEW);
  GtkWidget *tol;
  g_autoptr (GString) shown = g_string_new (NULL);

  ck_assert_ptr_nonnull (v);
  bw_window_show_page (w, "review");
  bw_gui_test_pump (20);
  bw_review_view_refresh (BW_REVIEW_VIEW (v));
  tol = bw_review_view_get_tolerance_entry (BW_REVIEW_VIEW (v));
  ck_assert_double_eq (bw_window_get_project (w)->review_tolerance, 0.01);
  ck_assert_str_eq (gtk_editable_get_text (GTK_EDITABLE (tol)), "1,000");
  gtk_editable_set_text (GTK_EDITABLE (tol), "2,5");
  g_signal_emit_by_name (tol, "activate");
  bw_gui_test_pump (10);
  ck_assert (!gtk_widget_has_css_class (tol, "error"));
  ck_assert_double_eq_tol (bw_window_get_project (w)->review_tolerance, 0.025, 1e-12);
  /* A criterion finding's value and limit: the demo's north rapid mix warns on detention against
   * the textbook set's preferred 7 s (data/criteria/textbook-ranges.xml, which cites its source). */
  bw_review_view_refresh (BW_REVIEW_VIEW (v));
  append_labels (bw_review_view_get_findings_list (BW_REVIEW_VIEW (v)), shown);
  ck_assert_msg (strstr (shown->str, "7,000 s") != NULL, "no decimal comma in: %s", shown->str);
  ck_assert_msg (strstr (shown->str, "7.000 s") == NULL, "decimal point left in: %s", shown->str);
  close_window (w);
}
END_TEST

/* The design report written from a Spanish workbench reads with the decimal comma, in its
 * tables and in the text of its drawings and charts, and names the coagulant in Spanish. */
START_TEST (test_report_in_spanish)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  g_autofree char *pdf = g_build_filename (tmpdir, "informe.pdf", NULL);
  g_autofree char *text = NULL;
  g_autofree char *err = NULL;
  g_autoptr (GError) error = NULL;
  const char *argv[] = { "pdftotext", pdf, "-", NULL };
  int status = 0;
  g_autofree char *tool = g_find_program_in_path ("pdftotext");

  if (tool == NULL)
    {
      g_printerr ("no pdftotext: the report text is not read back\n");
      close_window (w);
      return;
    }
  ck_assert_msg (bw_report_write_pdf (bw_window_get_project (w), bw_window_get_results (w),
                                      bw_window_get_checks (w), bw_window_get_criteria (w),
                                      BW_REPORT_PAPER_A4, BW_UNIT_SYSTEM_SI, pdf, &error),
                 "%s", error ? error->message : "");
  ck_assert (g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_SEARCH_PATH, NULL, NULL, &text, &err,
                           &status, NULL));
  ck_assert_int_eq (status, 0);
  /* The demo's minimum dose, 15 mg/L, in the design basis table (derived). */
  ck_assert_msg (strstr (text, "15,00 mg/L") != NULL, "no decimal comma in the report");
  ck_assert_msg (strstr (text, "15.00 mg/L") == NULL, "a decimal point left in the report");
  ck_assert_msg (strstr (text, "alumbre") != NULL, "the coagulant is not named in Spanish");
  /* No number anywhere (tables, sketch dimensions, chart ticks, help text) keeps the point: the
   * only "digit.digit" left are the program's version and a citation's clause ("Table 6.6"). */
  {
    g_autoptr (GRegex) re = g_regex_new ("(\\S+)\\s+(\\S*[0-9]\\.[0-9]\\S*)", 0, 0, NULL);
    g_autoptr (GMatchInfo) m = NULL;
    guint checked = 0;
    for (g_regex_match (re, text, 0, &m); g_match_info_matches (m); g_match_info_next (m, NULL))
      {
        g_autofree char *before = g_match_info_fetch (m, 1);
        g_autofree char *token = g_match_info_fetch (m, 2);
        ck_assert_msg (strstr (token, PACKAGE_VERSION) != NULL || strcmp (before, "Table") == 0,
                       "a decimal point left in the report: '%s %s'", before, token);
        checked++;
      }
    ck_assert_uint_gt (checked, 0); /* the version at least: the scan did run */
  }
  close_window (w);
}
END_TEST

/* The jar-test chart of the Chemistry page is titled, captioned and refused in Spanish (the demo
 * record has six jars at 12 °C). */
START_TEST (test_jar_chart_in_spanish)
{
  BwWindow *w = bw_gui_test_demo_window (app, 50);
  const BwProject *p = bw_window_get_project (w);
  g_autoptr (GError) error = NULL;
  g_autoptr (BwChart) ch = bw_chart_jartest_of_project (p, "jt-2026-11", 2.0, BW_UNIT_SYSTEM_SI, &error);

  ck_assert_msg (ch != NULL, "%s", error ? error->message : "");
  ck_assert_str_eq (ch->title, "Ensayo de jarras: Alder Creek raw water, November (fictional)");
  /* (the chart's numbers take the decimal comma where they are drawn: bw_label_number) */
  ck_assert_msg (g_str_has_prefix (ch->subtitle, "6 jarras a 12"), "%s", ch->subtitle);
  ck_assert_msg (strstr (ch->footnote, "ingeniero colegiado") != NULL, "%s", ch->footnote);
  ck_assert_ptr_null (bw_chart_jartest_of_project (p, "jt-none", 0, BW_UNIT_SYSTEM_SI, &error));
  ck_assert_msg (strstr (error->message, "no tiene ningún ensayo de jarras con el id «jt-none»") != NULL,
                 "%s", error->message);
  close_window (w);
}
END_TEST

START_TEST (test_locale_helpers)
{
  char *s;

  /* es_ES: only a point between digits changes; unit symbols and other text do not. */
  s = bw_locale_localize_number ("1.2e-05 m²/s · 3.5 ft. 12");
  ck_assert_str_eq (s, "1,2e-05 m²/s · 3,5 ft. 12");
  g_free (s);
  s = bw_locale_delocalize_number ("1,5 m");
  ck_assert_str_eq (s, "1.5 m");
  g_free (s);
  s = bw_locale_delocalize_number ("12 kg, x,");
  ck_assert_str_eq (s, "12 kg, x,");
  g_free (s);
  s = bw_locale_format (18.288, BW_KIND_LENGTH, BW_UNIT_SYSTEM_SI);
  /* 60 ft = 18.288 m exactly (international foot), four significant figures. */
  ck_assert_str_eq (s, "18,29 m");
  g_free (s);

  /* In the C locale nothing changes, in either direction. */
  setlocale (LC_NUMERIC, "C");
  s = bw_locale_localize_number ("1.5 m");
  ck_assert_str_eq (s, "1.5 m");
  g_free (s);
  s = bw_locale_delocalize_number ("1,5 m");
  ck_assert_str_eq (s, "1,5 m");
  g_free (s);
  setlocale (LC_NUMERIC, "");
}
END_TEST

static Suite *
i18n_suite (void)
{
  Suite *s = suite_create ("gui-i18n");
  TCase *tc = tcase_create ("spanish");

  tcase_set_timeout (tc, 60);
  tcase_add_test (tc, test_spanish_strings_show);
  tcase_add_test (tc, test_engine_text_in_spanish);
  tcase_add_test (tc, test_numbers_use_the_decimal_comma);
  tcase_add_test (tc, test_engine_messages_in_spanish);
  tcase_add_test (tc, test_model_and_loader_messages_in_spanish);
  tcase_add_test (tc, test_review_numbers_in_spanish);
  tcase_add_test (tc, test_report_in_spanish);
  tcase_add_test (tc, test_jar_chart_in_spanish);
  tcase_add_test (tc, test_locale_helpers);
  suite_add_tcase (s, tc);
  return s;
}

int
main (void)
{
  SRunner *sr;
  int failed;

  tmpdir = bw_gui_test_private_env ();
  /* The workbench's own start-up: locale from the environment (meson sets es_ES.UTF-8, LOCPATH
   * and BASINWRIGHT_LOCALEDIR to the build tree), then the gettext domain. */
  bw_locale_init ();
  if (g_strcmp0 (_("Untitled plant"), "Planta sin título") != 0)
    {
      g_printerr ("the Spanish catalogue is not found (LANGUAGE=%s LC_ALL=%s LOCPATH=%s "
                  "BASINWRIGHT_LOCALEDIR=%s)\n", g_getenv ("LANGUAGE"), g_getenv ("LC_ALL"),
                  g_getenv ("LOCPATH"), g_getenv ("BASINWRIGHT_LOCALEDIR"));
      return 1;
    }
  if (!gtk_init_check ())
    {
      g_printerr ("no display: skipping the GUI tests\n");
      return 77;
    }
  app = bw_gui_test_app ();
  sr = srunner_create (i18n_suite ());
  srunner_set_fork_status (sr, CK_NOFORK);
  srunner_run_all (sr, CK_NORMAL);
  failed = srunner_ntests_failed (sr);
  srunner_free (sr);
  g_object_unref (app);
  return failed == 0 ? 0 : 1;
}
