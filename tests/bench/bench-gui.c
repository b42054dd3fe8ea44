/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bench-gui.c: the workbench's time to first frame and its edit -> recompute -> redraw round
 * trip on the demo project. Run by hand under a display (xvfb-run -a build/tests/bench/bench-gui;
 * --round-trip for (b) alone); prints figures and asserts nothing about time.
 *
 * (a) Time to first frame, two ways:
 *     - cold: this program re-runs itself (fork/exec through g_spawn_sync) as a child that starts
 *       the real application (bw_application_new + g_application_run, as main.c does) on the demo
 *       file; the child reports the CLOCK_MONOTONIC time of the first "after-paint" of the
 *       window's frame clock, and the parent subtracts the time it took just before the spawn.
 *       So the figure holds exec, dynamic linking, GTK start-up, the theme, the window, loading
 *       and evaluating the demo, and the first paint.
 *     - warm: in this process, from bw_window_new to the first after-paint of a new window on
 *       the demo, after GTK is up.
 * (b) Round trip: on the demo window, type a new length into the North settling basin's entry
 *     and activate it, as the GUI tests do; "work" is the time until activate returns (edit,
 *     re-evaluation, checks, results table and navigator rebuilt, redraw queued); "frame" is until
 *     the after-paint of the next frame (the rebuilt page painted); "paint" is that frame's own
 *     before-paint -> after-paint time. Once with the unit page shown (the results table on
 *     screen) and once with the sketch page shown (the sketch redrawn). */
#include "config.h"

#include <gtk/gtk.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>

#include "gui/bw-application.h"
#include "gui/bw-locale.h"
#include "gui/bw-window.h"

#define COLD_RUNS 5
#define WARM_RUNS 10
#define EDITS 100
#define FRAME_60HZ_US 16667.0

typedef struct
{
  gint64 before;  /* the latest before-paint */
  gint64 after;   /* the latest after-paint */
  gint64 paint;   /* after - before of the latest frame */
  guint frames;
} Probe;

static void
on_before_paint (GdkFrameClock *clock, gpointer data)
{
  Probe *p = data;

  (void) clock;
  p->before = g_get_monotonic_time ();
}

static void
on_after_paint (GdkFrameClock *clock, gpointer data)
{
  Probe *p = data;

  (void) clock;
  p->after = g_get_monotonic_time ();
  p->paint = p->after - p->before;
  p->frames++;
}

static GdkFrameClock *
window_clock (GtkWidget *w)
{
  GdkSurface *s = gtk_native_get_surface (GTK_NATIVE (w));

  return s ? gdk_surface_get_frame_clock (s) : NULL;
}

static void
probe_attach (GtkWidget *w, Probe *p)
{
  GdkFrameClock *clock = window_clock (w);

  g_assert (clock != NULL);
  g_signal_connect (clock, "before-paint", G_CALLBACK (on_before_paint), p);
  g_signal_connect (clock, "after-paint", G_CALLBACK (on_after_paint), p);
}

static void
probe_detach (GtkWidget *w, Probe *p)
{
  GdkFrameClock *clock = window_clock (w);

  if (clock)
    g_signal_handlers_disconnect_by_data (clock, p);
}

/* Waits (main loop) for the next after-paint; FALSE when none came within 5 s (no display
 * activity: the figure is then left out, not made up). */
static gboolean
wait_frame (Probe *p, guint frames_before)
{
  gint64 end = g_get_monotonic_time () + 5 * G_USEC_PER_SEC;

  while (p->frames == frames_before && g_get_monotonic_time () < end)
    if (!g_main_context_iteration (NULL, FALSE))
      g_usleep (100);
  return p->frames != frames_before;
}

static void
settle (guint ms)
{
  gint64 end = g_get_monotonic_time () + (gint64) ms * 1000;

  while (g_get_monotonic_time () < end)
    if (!g_main_context_iteration (NULL, FALSE))
      g_usleep (500);
}

static int
cmp_double (const void *a, const void *b)
{
  const double x = *(const double *) a, y = *(const double *) b;

  return x < y ? -1 : x > y ? 1 : 0;
}

/* The Q-quantile (0..1) of N sorted values, nearest rank. */
static double
quantile (const double *sorted, guint n, double q)
{
  guint k = (guint) ceil (q * n);

  return sorted[k > 0 ? k - 1 : 0];
}

static char *
demo_path (void)
{
  return g_build_filename (BW_SOURCE_DATADIR, "examples", "marrowby-demo.bwproj", NULL);
}

/* Per-user folders in a temporary directory: the benchmark never touches the real recent
 * files, settings or autosaves. */
static void
private_env (void)
{
  char *tmp = g_dir_make_tmp ("bw-bench-gui-XXXXXX", NULL);
  const char *vars[] = { "XDG_STATE_HOME", "XDG_CONFIG_HOME", "XDG_DATA_HOME", "XDG_CACHE_HOME" };

  g_assert (tmp != NULL);
  for (guint i = 0; i < G_N_ELEMENTS (vars); i++)
    {
      g_autofree char *d = g_build_filename (tmp, vars[i], NULL);
      g_mkdir_with_parents (d, 0700);
      g_setenv (vars[i], d, TRUE);
    }
  g_setenv ("GSETTINGS_BACKEND", "memory", TRUE);
  g_setenv ("NO_AT_BRIDGE", "1", TRUE);
  g_free (tmp);
}

/* --- (a) cold: the child --- */

static Probe child_probe;

static void
child_after_paint (GdkFrameClock *clock, gpointer data)
{
  GApplication *app = data;

  (void) clock;
  if (child_probe.frames++ == 0)
    {
      printf ("%" G_GINT64_FORMAT "\n", g_get_monotonic_time ());
      fflush (stdout);
      g_application_quit (app);
    }
}

static void
child_window_realized (GtkWidget *w, gpointer app)
{
  g_signal_connect (window_clock (w), "after-paint", G_CALLBACK (child_after_paint), app);
}

static void
child_window_added (GtkApplication *app, GtkWindow *w, gpointer data)
{
  (void) data;
  if (gtk_widget_get_realized (GTK_WIDGET (w)))
    child_window_realized (GTK_WIDGET (w), app);
  else
    g_signal_connect (w, "realize", G_CALLBACK (child_window_realized), app);
}

static int
run_child (const char *demo)
{
  g_autoptr (BwApplication) app = NULL;
  char *argv[] = { (char *) "basinwright", (char *) demo, NULL };

  bw_locale_init ();
  app = bw_application_new ();
  g_set_application_name ("Basinwright");
  g_signal_connect (app, "window-added", G_CALLBACK (child_window_added), NULL);
  return g_application_run (G_APPLICATION (app), 2, argv);
}

static void
bench_cold (const char *self_path, const char *demo)
{
  double t[COLD_RUNS];
  guint n = 0;

  for (guint i = 0; i < COLD_RUNS; i++)
    {
      g_autofree char *out = NULL;
      g_autoptr (GError) error = NULL;
      int status = 0;
      const char *argv[] = { self_path, "--first-frame-child", demo, NULL };
      const gint64 t0 = g_get_monotonic_time ();
      gint64 t1;

      if (!g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_STDERR_TO_DEV_NULL, NULL, NULL, &out, NULL,
                         &status, &error))
        {
          printf ("  cold run %u: %s\n", i + 1, error->message);
          continue;
        }
      if (!g_spawn_check_wait_status (status, NULL) || out == NULL
          || !g_ascii_string_to_signed (g_strstrip (out), 10, 0, G_MAXINT64, &t1, NULL))
        {
          printf ("  cold run %u: the child reported no frame\n", i + 1);
          continue;
        }
      t[n++] = (double) (t1 - t0);
    }
  if (n == 0)
    return;
  qsort (t, n, sizeof t[0], cmp_double);
  printf ("time to first frame, cold (fork/exec of this program running the application on the demo, "
          "%u runs): median %.0f ms, min %.0f ms, max %.0f ms\n",
          n, quantile (t, n, 0.5) / 1000, t[0] / 1000, t[n - 1] / 1000);
}

/* --- (a) warm --- */

static void
bench_warm (BwApplication *app, const char *demo)
{
  double t[WARM_RUNS];
  guint n = 0;

  for (guint i = 0; i < WARM_RUNS; i++)
    {
      Probe p = { 0 };
      const gint64 t0 = g_get_monotonic_time ();
      BwWindow *w = bw_window_new (app);
      g_autoptr (GError) error = NULL;

      if (!bw_window_open_path (w, demo, &error))
        {
          printf ("  warm run: %s\n", error->message);
          gtk_window_destroy (GTK_WINDOW (w));
          return;
        }
      gtk_widget_realize (GTK_WIDGET (w));
      probe_attach (GTK_WIDGET (w), &p);
      gtk_window_present (GTK_WINDOW (w));
      if (wait_frame (&p, 0))
        t[n++] = (double) (p.after - t0);
      probe_detach (GTK_WIDGET (w), &p);
      gtk_window_destroy (GTK_WINDOW (w));
      settle (50);
    }
  if (n == 0)
    {
      printf ("time to first frame, warm: no frame was painted (is there a display?)\n");
      return;
    }
  qsort (t, n, sizeof t[0], cmp_double);
  printf ("time to first frame, warm (in-process, bw_window_new to the first after-paint, %u runs): "
          "median %.1f ms, min %.1f ms, max %.1f ms\n",
          n, quantile (t, n, 0.5) / 1000, t[0] / 1000, t[n - 1] / 1000);
}

/* --- (b) round trip --- */

static void
report (const char *what, double *v, guint n)
{
  qsort (v, n, sizeof v[0], cmp_double);
  printf ("    %-6s median %7.2f ms   p95 %7.2f ms   max %7.2f ms\n", what, quantile (v, n, 0.5) / 1000,
          quantile (v, n, 0.95) / 1000, v[n - 1] / 1000);
}

static void
bench_round_trip (BwApplication *app, const char *demo, const char *page)
{
  BwWindow *w = bw_window_new (app);
  Probe p = { 0 };
  double work[EDITS], frame[EDITS], paint[EDITS], cpu[EDITS];
  guint n = 0;
  GtkWidget *entry;
  g_autoptr (GError) error = NULL;

  if (!bw_window_open_path (w, demo, &error))
    {
      printf ("  round trip: %s\n", error->message);
      return;
    }
  gtk_window_set_default_size (GTK_WINDOW (w), 1400, 900);
  gtk_window_present (GTK_WINDOW (w));
  settle (300);
  bw_window_select_unit (w, "north-sed");
  bw_window_show_page (w, page);
  settle (200);
  probe_attach (GTK_WIDGET (w), &p);
  entry = bw_window_get_field_widget (w, "length");
  g_assert (GTK_IS_ENTRY (entry));
  for (guint i = 0; i < EDITS; i++)
    {
      /* 50 m to 59.5 m: every value is valid and changes the results and the sketch. */
      g_autofree char *text = g_strdup_printf ("%u.%u m", 50 + (i % 20) / 2, (i % 2) * 5);
      guint f0;
      gint64 t0, t1;

      settle (20); /* the previous frame is done and nothing is pending */
      f0 = p.frames;
      t0 = g_get_monotonic_time ();
      gtk_editable_set_text (GTK_EDITABLE (entry), text);
      g_signal_emit_by_name (entry, "activate");
      t1 = g_get_monotonic_time ();
      if (!wait_frame (&p, f0))
        continue;
      work[n] = (double) (t1 - t0);
      frame[n] = (double) (p.after - t0);
      paint[n] = (double) p.paint;
      cpu[n] = work[n] + paint[n];
      n++;
    }
  probe_detach (GTK_WIDGET (w), &p);
  if (n == 0)
    printf ("round trip (%s page): no frame was painted (is there a display?)\n", page);
  else
    {
      double cpu_p95;
      printf ("round trip, edit -> recompute -> redraw, %s page shown (%u edits of the North settling "
              "basin's length):\n", page, n);
      report ("work", work, n);
      report ("paint", paint, n);
      report ("w+p", cpu, n);
      report ("frame", frame, n);
      cpu_p95 = quantile (cpu, n, 0.95);
      printf ("    work + paint within one 60 Hz frame (16.7 ms) at the 95th percentile: %s; "
              "\"frame\" also holds the wait for the frame clock's next slot\n",
              cpu_p95 <= FRAME_60HZ_US ? "yes" : "no");
    }
  gtk_window_destroy (GTK_WINDOW (w));
  settle (50);
}

int
main (int argc, char *argv[])
{
  g_autofree char *demo = NULL;
  g_autoptr (BwApplication) app = NULL;
  g_autoptr (GError) error = NULL;
  g_autofree char *self_path = NULL;
  const gboolean only_round_trip = argc == 2 && g_strcmp0 (argv[1], "--round-trip") == 0;

  if (argc == 3 && g_strcmp0 (argv[1], "--first-frame-child") == 0)
    return run_child (argv[2]);

  setvbuf (stdout, NULL, _IOLBF, 0); /* figures appear as they come */
  private_env ();
  demo = demo_path ();
  /* The renderer the workbench itself would use here (GSK_RENDERER, else cairo without a GPU);
   * the child of the cold start inherits it. */
  bw_application_choose_renderer ();
  if (!gtk_init_check ())
    {
      fprintf (stderr, "bench-gui: no display (run it under xvfb-run -a)\n");
      return 77;
    }
  printf ("bench-gui: GTK %u.%u.%u, display %s, renderer %s, demo %s\n", gtk_get_major_version (),
          gtk_get_minor_version (), gtk_get_micro_version (),
          gdk_display_get_name (gdk_display_get_default ()),
          g_getenv ("GSK_RENDERER") ? g_getenv ("GSK_RENDERER") : "GTK's default", demo);
  self_path = g_file_read_link ("/proc/self/exe", NULL);
  if (!only_round_trip)
    bench_cold (self_path ? self_path : argv[0], demo);

  bw_locale_init ();
  app = bw_application_new ();
  if (!g_application_register (G_APPLICATION (app), NULL, &error))
    {
      fprintf (stderr, "bench-gui: %s\n", error->message);
      return 1;
    }
  if (!only_round_trip)
    bench_warm (app, demo);
  bench_round_trip (app, demo, "unit");
  bench_round_trip (app, demo, "sketch");
  return 0;
}
