/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-cli-water.c: the `water` and `settle` quick calculators. */
#include "config.h"

#include "cli/bw-cli.h"
#include "engine/bw-settling.h"
#include "engine/bw-water.h"

/* --- water --- */

static const BwOptSpec water_specs[] = {
  { "temp", BW_OPT_QUANTITY, BW_KIND_TEMPERATURE, "degC", NULL, TRUE, "T",
    "water temperature, 0-40 °C", "temperature" },
};

static int
run_water (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  BwWater w;

  if (!bw_water_properties (bw_cli_get (args, "temp")->value, &w, &error))
    return bw_cli_fail (args, error);

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_number (j, "temperature_C", w.temperature_K - 273.15);
      bw_json_number (j, "density_kg_m3", w.density_kg_m3);
      bw_json_number (j, "dynamic_viscosity_Pa_s", w.dynamic_viscosity_Pa_s);
      bw_json_number (j, "kinematic_viscosity_m2_s", w.kinematic_viscosity_m2_s);
      bw_json_number (j, "relative_permittivity", w.relative_permittivity);
      bw_json_print_free (j);
    }
  else
    {
      BwTable *t = bw_table_new ("Liquid water at 101.325 kPa");
      bw_table_quantity (t, "temperature", w.temperature_K, BW_KIND_TEMPERATURE, args->units);
      bw_table_quantity (t, "density", w.density_kg_m3, BW_KIND_DENSITY, args->units);
      bw_table_quantity (t, "dynamic viscosity", w.dynamic_viscosity_Pa_s,
                         BW_KIND_DYNAMIC_VISCOSITY, args->units);
      bw_table_quantity (t, "kinematic viscosity", w.kinematic_viscosity_m2_s,
                         BW_KIND_KINEMATIC_VISCOSITY, args->units);
      bw_table_number (t, "relative permittivity", w.relative_permittivity, 5);
      bw_table_print_free (t);
    }
  return BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_water = {
  "water", "Density, viscosity and relative permittivity of liquid water (0-40 °C).",
  NULL, 0, 0, water_specs, G_N_ELEMENTS (water_specs), run_water,
  "Density: Tanaka et al. (2001); viscosity: IAPWS 2008 (R12-08); permittivity: Malmberg &\n"
  "Maryott (1956).",
};

/* --- settle --- */

static const BwOptSpec settle_specs[] = {
  { "diameter", BW_OPT_QUANTITY, BW_KIND_LENGTH, NULL, NULL, TRUE, "D",
    "particle diameter, 0.5 µm-5 mm", "diameter" },
  { "sg", BW_OPT_NUMBER, 0, NULL, NULL, TRUE, "S",
    "particle specific gravity (> 1)", "specific gravity" },
  { "temp", BW_OPT_QUANTITY, BW_KIND_TEMPERATURE, "degC", NULL, TRUE, "T",
    "water temperature, 0-40 °C", "temperature" },
  { "drag", BW_OPT_CHOICE, 0, NULL, "clift-gauvin|davis", FALSE, "NAME",
    "drag correlation beyond Stokes' law (default clift-gauvin)", NULL },
};

static int
run_settle (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  BwDragCorrelation drag = BW_DRAG_CLIFT_GAUVIN;
  const BwOptValue *dv = bw_cli_get (args, "drag");
  const double d = bw_cli_get (args, "diameter")->value;
  const double sg = bw_cli_get (args, "sg")->value;
  const double t = bw_cli_get (args, "temp")->value;
  BwSettlingResult r;

  if (dv->given)
    bw_drag_correlation_from_name (dv->text, &drag);
  if (!bw_settling_velocity (d, sg, t, drag, &r, &error))
    return bw_cli_fail (args, error);

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_number (j, "settling_velocity_m_s", r.velocity_m_s);
      bw_json_number (j, "reynolds", r.reynolds);
      bw_json_number (j, "drag_coefficient", r.drag_coefficient);
      bw_json_string (j, "regime", bw_settling_regime_name (r.regime));
      bw_json_number (j, "stokes_velocity_m_s", r.stokes_velocity_m_s);
      bw_json_string (j, "drag_correlation", bw_drag_correlation_name (drag));
      bw_json_number (j, "diameter_m", d);
      bw_json_number (j, "specific_gravity", sg);
      bw_json_number (j, "temperature_C", t - 273.15);
      bw_json_print_free (j);
    }
  else
    {
      BwTable *tb = bw_table_new ("Terminal settling of a discrete sphere");
      bw_table_quantity (tb, "diameter", d, BW_KIND_LENGTH, args->units);
      bw_table_number (tb, "specific gravity", sg, 4);
      bw_table_quantity (tb, "temperature", t, BW_KIND_TEMPERATURE, args->units);
      bw_table_quantity (tb, "settling velocity", r.velocity_m_s, BW_KIND_VELOCITY, args->units);
      bw_table_quantity (tb, "  as a surface loading", r.velocity_m_s, BW_KIND_SURFACE_LOADING,
                         args->units);
      bw_table_number (tb, "Reynolds number", r.reynolds, 4);
      bw_table_number (tb, "drag coefficient", r.drag_coefficient, 4);
      bw_table_text (tb, "regime", bw_settling_regime_name (r.regime));
      bw_table_text (tb, "drag correlation", bw_drag_correlation_name (drag));
      bw_table_quantity (tb, "Stokes' law velocity", r.stokes_velocity_m_s, BW_KIND_VELOCITY,
                         args->units);
      bw_table_print_free (tb);
    }
  return BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_settle = {
  "settle", "Terminal settling velocity of a discrete sphere in still water (Type I settling).",
  NULL, 0, 0, settle_specs, G_N_ELEMENTS (settle_specs), run_settle,
  "Stokes' law where its Reynolds number is below 0.01; beyond, the drag correlation is solved\n"
  "iteratively: clift-gauvin (Clift & Gauvin 1970) or davis (Cd = 24/Re + 3/sqrt(Re) + 0.34,\n"
  "Davis 2010 Eq. 10-11). Regime by the final Re: stokes < 1 <= transitional < 1000 <= newton.",
};
