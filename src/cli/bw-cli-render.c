/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-cli-render.c: the project command `render`: one sketch of one unit (or a train's schematic)
 * to a PNG, SVG or PDF. */
#include "config.h"

#include <errno.h>
#include <stdio.h>
#include <string.h>

#include "cli/bw-cli.h"
#include "draw/bw-chart-jartest.h"
#include "draw/bw-charts.h"
#include "engine/bw-evaluate.h"
#include "io/bw-criteria-xml.h"
#include "draw/bw-export.h"
#include "draw/bw-sketch.h"
#include "draw/bw-style.h"
#include "io/bw-project-xml.h"

/* Default canvas: a wide screen image for PNG (pixels), an A4 landscape page for SVG and PDF
 * (points). */
#define PNG_WIDTH 1600
#define PNG_HEIGHT 1000
#define PAGE_WIDTH 842
#define PAGE_HEIGHT 595

static const BwOptSpec render_specs[] = {
  { "unit", BW_OPT_STRING, 0, NULL, NULL, TRUE, "ID", "id of the unit to draw", NULL },
  { "view", BW_OPT_CHOICE, 0, NULL, "plan|section|schematic|taper|settling|removal|iso-removal|power|checks|jartest",
    TRUE, "NAME", "which view (schematic: the unit's train with its results; taper, settling, "
    "removal, iso-removal, power, checks: charts; jartest: the jar-test record named by --unit)",
    NULL },
  { "format", BW_OPT_CHOICE, 0, NULL, "png|svg|pdf", TRUE, "FORMAT", "file format", NULL },
  { "size", BW_OPT_STRING, 0, NULL, NULL, FALSE, "WxH",
    "canvas in pixels (png) or points (svg, pdf); default 1600x1000 or 842x595", NULL },
  { "style", BW_OPT_CHOICE, 0, NULL, "light|dark", FALSE, "NAME", "colour scheme (default light)",
    NULL },
  { "output", BW_OPT_STRING, 0, NULL, NULL, FALSE, "FILE", "the file to write (same as -o FILE)",
    NULL },
};

/* "1600x1000" into two whole numbers within the sketch's limits. */
static gboolean
parse_size (const char *text, double *w, double *h, const char *command)
{
  g_auto (GStrv) parts = g_strsplit_set (text, "xX", -1);
  gint64 v[2];

  if (g_strv_length (parts) != 2)
    {
      bw_cli_usage_error (command, "--size: '%s' is not WIDTHxHEIGHT (e.g. 1600x1000)", text);
      return FALSE;
    }
  for (int i = 0; i < 2; i++)
    {
      char *end = NULL;
      errno = 0;
      v[i] = g_ascii_strtoll (parts[i], &end, 10);
      if (*parts[i] == '\0' || !g_ascii_isdigit (*parts[i]) || *end != '\0' || errno == ERANGE)
        {
          bw_cli_usage_error (command, "--size: '%s' is not WIDTHxHEIGHT (e.g. 1600x1000)", text);
          return FALSE;
        }
      if (v[i] < BW_SKETCH_MIN_SIDE || v[i] > BW_SKETCH_MAX_SIDE)
        {
          bw_cli_usage_error (command, "--size: each side must be %g to %g (got %s)",
                              BW_SKETCH_MIN_SIDE, BW_SKETCH_MAX_SIDE, text);
          return FALSE;
        }
    }
  *w = (double) v[0];
  *h = (double) v[1];
  return TRUE;
}

static int
run_render (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) p = NULL;
  const char *project = NULL, *output = NULL;
  const BwOptValue *size = bw_cli_get (args, "size");
  const BwOptValue *style_opt = bw_cli_get (args, "style");
  BwProcessUnit *u;
  BwSketchView view;
  BwExportFormat format;
  double w, h;

  if (!bw_cli_project_and_output (args, &project, &output))
    return BW_CLI_EXIT_USAGE;
  if (output == NULL || *output == '\0')
    return bw_cli_usage_error (args->command, "-o: the output file is required");

  /* The parser already held both to their choices. */
  if (!bw_export_format_from_name (bw_cli_get (args, "format")->text, &format))
    g_assert_not_reached ();
  if (size->given)
    {
      if (!parse_size (size->text, &w, &h, args->command))
        return BW_CLI_EXIT_USAGE;
    }
  else if (format == BW_EXPORT_PNG)
    w = PNG_WIDTH, h = PNG_HEIGHT;
  else
    w = PAGE_WIDTH, h = PAGE_HEIGHT;

  p = bw_project_load (project, &error);
  if (p == NULL)
    return bw_cli_usage_error (args->command, "%s", error->message);
  if (strcmp (bw_cli_get (args, "view")->text, "jartest") == 0)
    {
      /* The jar-test chart: --unit names a jar-test record, not a process unit. */
      const char *id = bw_cli_get (args, "unit")->text;
      g_autoptr (BwChart) chart = NULL;
      if (bw_chart_jartest_find_record (p, id) == NULL)
        return bw_cli_usage_error (args->command, "--unit: no jar-test record '%s' in %s (--view "
                                   "jartest draws a jar test)", id, project);
      /* The project's target settled turbidity, drawn as a line as on the Chemistry page. */
      chart = bw_chart_jartest_of_project (p, id, p->chemistry.target_NTU > 0 ? p->chemistry.target_NTU : -1,
                                           args->units, &error);
      if (chart == NULL)
        return bw_cli_usage_error (args->command, "--unit: %s", error->message);
      if (!bw_export_chart (chart, style_opt->given && strcmp (style_opt->text, "dark") == 0
                                       ? bw_style_dark () : bw_style_light (),
                            format, output, w, h, &error))
        return bw_cli_usage_error (args->command, "%s", error->message);
      if (args->json)
        {
          BwJson *j = bw_json_new ();
          bw_json_string (j, "file", output);
          bw_json_string (j, "unit", id);
          bw_json_string (j, "view", "jartest");
          bw_json_string (j, "format", bw_export_format_name (format));
          bw_json_number (j, "width", w);
          bw_json_number (j, "height", h);
          bw_json_print_free (j);
        }
      return BW_CLI_EXIT_OK;
    }
  u = bw_project_find_unit (p, bw_cli_get (args, "unit")->text, NULL);
  if (u == NULL)
    return bw_cli_usage_error (args->command, "--unit: no unit '%s' in %s",
                               bw_cli_get (args, "unit")->text, project);
  if (!bw_sketch_view_from_name (bw_cli_get (args, "view")->text, &view))
    {
      /* A chart: built from the engine's results (and the checks) of the project. */
      const char *name = bw_cli_get (args, "view")->text;
      g_autoptr (BwResults) r = bw_project_evaluate (p, &error);
      g_autoptr (BwCriteriaSet) set = NULL;
      g_autoptr (GArray) checks = NULL;
      g_autoptr (BwChart) chart = NULL;
      if (r == NULL)
        return bw_cli_usage_error (args->command, "%s: %s", project, error->message);
      set = bw_criteria_set_open (p->criteria ? p->criteria : "textbook-ranges", NULL);
      if (set)
        checks = bw_check_results (r, set);
      if (strcmp (name, "taper") == 0)
        chart = bw_chart_floc_taper (p, r, checks, u->id, args->units, &error);
      else if (strcmp (name, "settling") == 0)
        chart = bw_chart_settling_curves (p, r, u->id, 0, args->units, &error);
      else if (strcmp (name, "removal") == 0)
        chart = bw_chart_removal_curves (p, r, u->id, args->units, &error);
      else if (strcmp (name, "iso-removal") == 0)
        chart = bw_chart_iso_removal (p, r, u->id, args->units, &error);
      else if (strcmp (name, "power") == 0)
        chart = bw_chart_impeller_power (p, r, checks, u->id, args->units, &error);
      else if (checks)
        chart = bw_chart_check_matrix (p, r, checks, NULL, &error);
      else
        return bw_cli_usage_error (args->command, "--view: checks needs a criteria set the project names");
      if (chart == NULL)
        return bw_cli_usage_error (args->command, "--view: %s", error->message);
      if (!bw_export_chart (chart, style_opt->given && strcmp (style_opt->text, "dark") == 0
                                       ? bw_style_dark () : bw_style_light (),
                            format, output, w, h, &error))
        return bw_cli_usage_error (args->command, "%s", error->message);
      if (args->json)
        {
          BwJson *j = bw_json_new ();
          bw_json_string (j, "file", output);
          bw_json_string (j, "unit", u->id);
          bw_json_string (j, "view", name);
          bw_json_string (j, "format", bw_export_format_name (format));
          bw_json_number (j, "width", w);
          bw_json_number (j, "height", h);
          bw_json_print_free (j);
        }
      return BW_CLI_EXIT_OK;
    }
  if (!bw_sketch_supports (u->type, view))
    {
      g_autofree char *views = bw_sketch_views_of (u->type);
      return bw_cli_usage_error (args->command, "--view: no %s drawing of '%s', a %s (its views: "
                                 "%s)", bw_sketch_view_name (view), u->id,
                                 bw_process_type_label (u->type), views);
    }

  if (!bw_export_sketch (p, u, view, args->units,
                         style_opt->given && strcmp (style_opt->text, "dark") == 0
                             ? bw_style_dark () : bw_style_light (),
                         format, output, w, h, &error))
    return bw_cli_usage_error (args->command, "%s", error->message);

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_string (j, "file", output);
      bw_json_string (j, "unit", u->id);
      bw_json_string (j, "view", bw_sketch_view_name (view));
      bw_json_string (j, "format", bw_export_format_name (format));
      bw_json_number (j, "width", w);
      bw_json_number (j, "height", h);
      bw_json_print_free (j);
    }
  return BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_render = {
  "render", "Draw one unit of a project to scale (plan or section), or its train, as PNG, SVG or PDF.",
  "PROJECT -o FILE", 1, 3, render_specs, G_N_ELEMENTS (render_specs), run_render,
  "plan and section: rapid-mix tanks, flocculators (or one stage, by its id), rectangular\n"
  "basins and circular clarifiers; section: plate and tube settlers. schematic: any unit's train,\n"
  "with the engine's results at the maximum-day flow (coldest, all in service).\n"
  "Charts: taper (a flocculator's G and Gt by stage), settling (velocity against diameter with a\n"
  "basin's overflow rate), removal (against overflow rate), power (a rapid mix's or turbine's\n"
  "power and G against speed), checks (the checks across the load cases; any unit).\n"
  "jartest: a jar-test record of the project (its id as --unit): turbidity and zeta against dose,\n"
  "with the chosen dose range.\n"
  "--units us labels dimensions and the scale bar in feet. --json reports what was written.",
};
