/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-screenshots.c: renders the main states of the real window to PNG files in the build
 * dir (for people to look at) and checks each is a real, non-empty image. */
#include "config.h"

#include <check.h>
#include <string.h>

#include "bw-gui-test.h"

static BwApplication *app;

/* Renders W as it is on screen to DIR/NAME.png. */
static void
shoot (GtkWidget *w, const char *name)
{
  const char *dir = g_getenv ("BW_SHOT_DIR");
  g_autofree char *path = g_strdup_printf ("%s/%s.png", dir ? dir : ".", name);
  g_autoptr (GdkPaintable) paintable = NULL;
  g_autoptr (GskRenderNode) node = NULL;
  g_autoptr (GdkTexture) tex = NULL;
  g_autofree char *bytes = NULL;
  gsize len = 0;
  int width = 0, height = 0;

  /* Let the window map and draw, then take its current image. */
  bw_gui_test_pump (250);
  ck_assert (gtk_widget_get_mapped (w));
  paintable = gtk_widget_paintable_new (w);
  /* The paintable holds the widget's last drawn image; after a restyle (the dark style) that
   * image is redrawn on the next frame, so wait for frames until there is one. */
  for (int tries = 0; tries < 20 && node == NULL; tries++)
    {
      g_autoptr (GtkSnapshot) snap = gtk_snapshot_new ();
      bw_gui_test_pump (50);
      width = gtk_widget_get_width (w);
      height = gtk_widget_get_height (w);
      ck_assert_int_gt (width, 0);
      ck_assert_int_gt (height, 0);
      gdk_paintable_snapshot (paintable, GDK_SNAPSHOT (snap), width, height);
      node = gtk_snapshot_free_to_node (g_steal_pointer (&snap));
    }
  if (node == NULL)
    g_printerr ("%s: empty snapshot\n", name);
  ck_assert_ptr_nonnull (node);
  tex = gsk_renderer_render_texture (gtk_native_get_renderer (GTK_NATIVE (w)), node,
                                     &GRAPHENE_RECT_INIT (0, 0, width, height));
  ck_assert_ptr_nonnull (tex);
  ck_assert_int_eq (gdk_texture_get_width (tex), width);
  ck_assert (gdk_texture_save_to_png (tex, path));
  ck_assert (g_file_get_contents (path, &bytes, &len, NULL));
  ck_assert_uint_gt (len, 2000); /* a blank window compresses to far less */
  ck_assert (memcmp (bytes, "\x89PNG", 4) == 0);
  g_printerr ("wrote %s (%dx%d)\n", path, width, height);
}

START_TEST (test_screenshots)
{
  g_autofree char *demo = bw_gui_test_demo_path ();
  BwWindow *w = bw_window_new (app);
  GtkWidget *e;

  ck_assert (bw_window_open_path (w, demo, NULL));
  gtk_window_set_default_size (GTK_WINDOW (w), 1024, 700);
  gtk_window_present (GTK_WINDOW (w));
  bw_window_select_unit (w, "north-rm");
  shoot (GTK_WIDGET (w), "shot-unit-rapid-mix");

  bw_window_select_unit (w, "north-sed");
  e = bw_window_get_field_widget (w, "length");
  gtk_editable_set_text (GTK_EDITABLE (e), "12 kg");
  g_signal_emit_by_name (e, "activate");
  shoot (GTK_WIDGET (w), "shot-unit-invalid-entry");

  bw_window_select_unit (w, "north-floc-2");
  shoot (GTK_WIDGET (w), "shot-flocculator-stage");

  gtk_toggle_button_set_active (GTK_TOGGLE_BUTTON (bw_window_get_field_widget (w, "every-case")), TRUE);
  shoot (GTK_WIDGET (w), "shot-every-load-case");
  gtk_toggle_button_set_active (GTK_TOGGLE_BUTTON (bw_window_get_field_widget (w, "every-case")), FALSE);

  bw_window_show_page (w, "checks");
  shoot (GTK_WIDGET (w), "shot-checks");

  bw_window_show_page (w, "basis");
  shoot (GTK_WIDGET (w), "shot-design-basis");

  bw_window_show_page (w, "sketch");
  shoot (GTK_WIDGET (w), "shot-sketch-placeholder");

  bw_window_show_page (w, "unit");
  bw_application_set_unit_system (app, BW_UNIT_SYSTEM_US);
  bw_window_select_unit (w, "south-sed");
  shoot (GTK_WIDGET (w), "shot-us-units");
  bw_application_set_unit_system (app, BW_UNIT_SYSTEM_SI);

  g_action_group_change_action_state (G_ACTION_GROUP (app), "dark", g_variant_new_boolean (TRUE));
  shoot (GTK_WIDGET (w), "shot-dark");
  g_action_group_change_action_state (G_ACTION_GROUP (app), "dark", g_variant_new_boolean (FALSE));

  g_action_group_activate_action (G_ACTION_GROUP (app), "preferences", NULL);
  bw_gui_test_pump (100);
  {
    GtkWindow *prefs = NULL;
    GListModel *tops = gtk_window_get_toplevels (); /* transfer none */
    for (guint i = 0; i < g_list_model_get_n_items (tops); i++)
      {
        g_autoptr (GtkWindow) t = g_list_model_get_item (tops, i);
        if (g_strcmp0 (gtk_window_get_title (t), "Preferences") == 0)
          prefs = t;
      }
    ck_assert_ptr_nonnull (prefs);
    shoot (GTK_WIDGET (prefs), "shot-preferences");
    gtk_window_destroy (prefs);
  }

  gtk_widget_activate_action (GTK_WIDGET (w), "win.show-help-overlay", NULL);
  bw_gui_test_pump (200);
  {
    GtkWindow *overlay = gtk_application_window_get_help_overlay (GTK_APPLICATION_WINDOW (w)) ?
                           GTK_WINDOW (gtk_application_window_get_help_overlay (GTK_APPLICATION_WINDOW (w))) : NULL;
    ck_assert_ptr_nonnull (overlay);
    shoot (GTK_WIDGET (overlay), "shot-shortcuts");
    gtk_window_close (overlay);
  }
  gtk_window_destroy (GTK_WINDOW (w));
  bw_gui_test_pump (10);
}
END_TEST

int
main (void)
{
  SRunner *sr;
  Suite *s;
  TCase *tc;
  int failed;

  g_free (bw_gui_test_private_env ());
  if (!gtk_init_check ())
    {
      g_printerr ("no display: skipping the screenshots\n");
      return 77;
    }
  app = bw_gui_test_app ();
  s = suite_create ("gui-screenshots");
  tc = tcase_create ("screenshots");
  tcase_set_timeout (tc, 90);
  tcase_add_test (tc, test_screenshots);
  suite_add_tcase (s, tc);
  sr = srunner_create (s);
  srunner_set_fork_status (sr, CK_NOFORK);
  srunner_run_all (sr, CK_NORMAL);
  failed = srunner_ntests_failed (sr);
  srunner_free (sr);
  g_object_unref (app);
  return failed == 0 ? 0 : 1;
}
