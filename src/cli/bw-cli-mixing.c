/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-cli-mixing.c: the `gvalue`, `impeller`, `paddle`, `baffled` and `flocmodel` calculators. */
#include "config.h"

#include <string.h>

#include "cli/bw-cli.h"
#include "engine/bw-error.h"
#include "engine/bw-floc.h"
#include "engine/bw-flocmodel.h"
#include "engine/bw-mixing.h"
#include "engine/bw-water.h"

#define CELSIUS_ZERO_K 273.15

/* Water at the --temp option; on failure reports it and sets *CODE. */
static gboolean
water_at (const BwCliArgs *args, BwWater *w, int *code)
{
  g_autoptr (GError) error = NULL;

  if (bw_water_properties (bw_cli_get (args, "temp")->value, w, &error))
    return TRUE;
  *code = bw_cli_fail (args, error);
  return FALSE;
}

/* A whole-number option within LO..HI (the parser already took it as an integer). */
static gboolean
get_count (const BwCliArgs *args, const char *name, guint lo, guint hi, guint *out, int *code)
{
  const double v = bw_cli_get (args, name)->value;

  if (v >= lo && v <= hi)
    {
      *out = (guint) v;
      return TRUE;
    }
  *code = bw_cli_usage_error (args->command, "--%s: %.0f is outside the valid range %u to %u",
                              name, v, lo, hi);
  return FALSE;
}

/* An optional positive number option: FALSE (and *CODE) when given but not positive. Options
 * whose engine field uses 0 as "not given" must refuse a typed 0. */
static gboolean
get_positive (const BwCliArgs *args, const char *name, const char *field, double *out, int *code)
{
  g_autoptr (GError) error = NULL;
  const BwOptValue *v = bw_cli_get (args, name);

  if (!v->given)
    return TRUE;
  if (!bw_check_positive (v->value, field, &error))
    {
      *code = bw_cli_fail (args, error);
      return FALSE;
    }
  *out = v->value;
  return TRUE;
}

/* A whole number in the readable table. */
static void
table_count (BwTable *t, const char *label, guint n)
{
  g_autofree char *text = g_strdup_printf ("%u", n);

  bw_table_text (t, label, text);
}

static void
table_water (BwTable *t, const BwWater *w, BwUnitSystem units)
{
  bw_table_quantity (t, "water temperature", w->temperature_K, BW_KIND_TEMPERATURE, units);
  bw_table_quantity (t, "dynamic viscosity", w->dynamic_viscosity_Pa_s, BW_KIND_DYNAMIC_VISCOSITY,
                     units);
}

/* --- gvalue --- */

static const BwOptSpec gvalue_specs[] = {
  { "power", BW_OPT_QUANTITY, BW_KIND_POWER, NULL, NULL, TRUE, "P",
    "power dissipated in the water", "power" },
  { "volume", BW_OPT_QUANTITY, BW_KIND_VOLUME, NULL, NULL, TRUE, "V",
    "volume it is dissipated in", "volume" },
  { "temp", BW_OPT_QUANTITY, BW_KIND_TEMPERATURE, "degC", NULL, TRUE, "T",
    "water temperature, 0-40 °C", "temperature" },
  { "time", BW_OPT_QUANTITY, BW_KIND_TIME, NULL, NULL, FALSE, "t",
    "detention time, for Gt", "time" },
};

static int
run_gvalue (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  const double p = bw_cli_get (args, "power")->value;
  const double v = bw_cli_get (args, "volume")->value;
  const BwOptValue *tv = bw_cli_get (args, "time");
  BwWater w;
  double g = 0;
  int code;

  if (!water_at (args, &w, &code))
    return code;
  if (!bw_velocity_gradient (p, v, &w, &g, &error))
    return bw_cli_fail (args, error);
  if (tv->given && !bw_check_positive (tv->value, "time", &error))
    return bw_cli_fail (args, error);

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_number (j, "G_per_s", g);
      if (tv->given)
        bw_json_number (j, "Gt", g * tv->value);
      bw_json_number (j, "power_W", p);
      bw_json_number (j, "volume_m3", v);
      if (tv->given)
        bw_json_number (j, "time_s", tv->value);
      bw_json_number (j, "temperature_C", w.temperature_K - CELSIUS_ZERO_K);
      bw_json_number (j, "dynamic_viscosity_Pa_s", w.dynamic_viscosity_Pa_s);
      bw_json_print_free (j);
    }
  else
    {
      BwTable *t = bw_table_new ("Velocity gradient G = sqrt (P / (mu V)) (Camp & Stein 1943)");
      bw_table_quantity (t, "power", p, BW_KIND_POWER, args->units);
      bw_table_quantity (t, "volume", v, BW_KIND_VOLUME, args->units);
      table_water (t, &w, args->units);
      bw_table_quantity (t, "velocity gradient G", g, BW_KIND_RATE, args->units);
      if (tv->given)
        {
          bw_table_quantity (t, "time", tv->value, BW_KIND_TIME, args->units);
          bw_table_number (t, "Gt", g * tv->value, 4);
        }
      bw_table_print_free (t);
    }
  return BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_gvalue = {
  "gvalue", "Velocity gradient G (and Gt) from the power dissipated in a volume of water.",
  NULL, 0, 0, gvalue_specs, G_N_ELEMENTS (gvalue_specs), run_gvalue,
  "G = sqrt (P / (mu V)), Camp & Stein (1943); mu is the water's viscosity at --temp.\n"
  "Gt (JSON key Gt) is given only with --time.",
};

/* --- impeller --- */

static const BwOptSpec impeller_specs[] = {
  { "kind", BW_OPT_CHOICE, 0, NULL, "rushton|pitched-blade-45|hydrofoil", TRUE, "NAME",
    "impeller: library power number 5.7, 1.27 or 0.30 (turbulent, baffled)", "impeller kind" },
  { "diameter", BW_OPT_QUANTITY, BW_KIND_LENGTH, NULL, NULL, TRUE, "D",
    "impeller diameter", "impeller diameter" },
  { "speed", BW_OPT_QUANTITY, BW_KIND_ROTATIONAL_SPEED, "rpm", NULL, TRUE, "N",
    "rotational speed", "rotational speed" },
  { "volume", BW_OPT_QUANTITY, BW_KIND_VOLUME, NULL, NULL, TRUE, "V",
    "liquid volume of the tank", "volume" },
  { "temp", BW_OPT_QUANTITY, BW_KIND_TEMPERATURE, "degC", NULL, TRUE, "T",
    "water temperature, 0-40 °C", "temperature" },
  { "power-number", BW_OPT_NUMBER, 0, NULL, NULL, FALSE, "Np",
    "power number replacing the library value (> 0)", "power number" },
  { "unbaffled", BW_OPT_FLAG, 0, NULL, NULL, FALSE, NULL,
    "the tank has no wall baffles (then --power-number is required)", NULL },
  { "flow", BW_OPT_QUANTITY, BW_KIND_FLOW, NULL, NULL, FALSE, "Q",
    "flow through the tank, for detention and Gt", "flow" },
  { "efficiency", BW_OPT_NUMBER, 0, NULL, NULL, FALSE, "E",
    "drive efficiency, water power / motor power (0-1], for the motor power", "drive efficiency" },
};

static int
run_impeller (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  BwImpeller imp = { 0 };
  BwImpellerResult r;
  const gboolean baffled = !bw_cli_get (args, "unbaffled")->given;
  const double v = bw_cli_get (args, "volume")->value;
  const BwOptValue *qv = bw_cli_get (args, "flow");
  const BwOptValue *ev = bw_cli_get (args, "efficiency");
  BwWater w;
  double g = 0, t = 0;
  int code;

  bw_impeller_kind_from_name (bw_cli_get (args, "kind")->text, &imp.kind);
  imp.diameter_m = bw_cli_get (args, "diameter")->value;
  imp.speed_rev_s = bw_cli_get (args, "speed")->value;
  if (!water_at (args, &w, &code)
      || !get_positive (args, "power-number", "power number", &imp.power_number, &code))
    return code;
  if (!bw_impeller_evaluate (&imp, baffled, &w, &r, &error)
      || !bw_velocity_gradient (r.power_W, v, &w, &g, &error))
    return bw_cli_fail (args, error);
  if (qv->given)
    {
      if (!bw_check_positive (qv->value, "flow", &error))
        return bw_cli_fail (args, error);
      t = v / qv->value;
    }
  if (ev->given && !(ev->value > 0.0 && ev->value <= 1.0))
    return bw_cli_usage_error (args->command, "--efficiency: must be above 0 and at most 1 "
                               "(got %g)", ev->value);

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_number (j, "power_number", r.power_number);
      bw_json_number (j, "power_W", r.power_W);
      bw_json_number (j, "reynolds", r.reynolds);
      bw_json_number (j, "G_per_s", g);
      bw_json_number (j, "tip_speed_m_s", r.tip_speed_m_s);
      bw_json_bool (j, "low_reynolds", (r.warnings & BW_MIX_WARNING_LOW_REYNOLDS) != 0);
      bw_json_bool (j, "baffled", baffled);
      bw_json_string (j, "kind", bw_impeller_kind_name (imp.kind));
      if (qv->given)
        {
          bw_json_number (j, "detention_s", t);
          bw_json_number (j, "Gt", g * t);
        }
      if (ev->given)
        bw_json_number (j, "motor_power_W", r.power_W / ev->value);
      bw_json_number (j, "volume_m3", v);
      bw_json_number (j, "temperature_C", w.temperature_K - CELSIUS_ZERO_K);
      bw_json_print_free (j);
    }
  else
    {
      BwTable *tb = bw_table_new ("Impeller in a back-mix tank, P = Np rho N^3 D^5");
      bw_table_text (tb, "impeller", bw_impeller_kind_name (imp.kind));
      bw_table_quantity (tb, "diameter", imp.diameter_m, BW_KIND_LENGTH, args->units);
      bw_table_quantity (tb, "rotational speed", imp.speed_rev_s, BW_KIND_ROTATIONAL_SPEED,
                         args->units);
      bw_table_number (tb, "power number", r.power_number, 4);
      bw_table_quantity (tb, "volume", v, BW_KIND_VOLUME, args->units);
      table_water (tb, &w, args->units);
      bw_table_quantity (tb, "water power", r.power_W, BW_KIND_POWER, args->units);
      if (ev->given)
        bw_table_quantity (tb, "motor power", r.power_W / ev->value, BW_KIND_POWER, args->units);
      bw_table_number (tb, "impeller Reynolds number", r.reynolds, 4);
      bw_table_quantity (tb, "tip speed", r.tip_speed_m_s, BW_KIND_VELOCITY, args->units);
      bw_table_quantity (tb, "velocity gradient G", g, BW_KIND_RATE, args->units);
      if (qv->given)
        {
          bw_table_quantity (tb, "detention time", t, BW_KIND_TIME, args->units);
          bw_table_number (tb, "Gt", g * t, 4);
        }
      if (r.warnings & BW_MIX_WARNING_LOW_REYNOLDS)
        bw_table_text (tb, "caution", "Re below 10 000: the turbulent power number may not apply");
      bw_table_print_free (tb);
    }
  return BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_impeller = {
  "impeller", "Power, Reynolds number and G of an impeller in a back-mix tank.",
  NULL, 0, 0, impeller_specs, G_N_ELEMENTS (impeller_specs), run_impeller,
  "Power numbers (turbulent, fully baffled): rushton 5.7 (Davis 2010; published values span\n"
  "about 4.6-6.3), pitched-blade-45 1.27, hydrofoil 0.30. An unbaffled tank vortexes and needs\n"
  "a --power-number of its own. JSON low_reynolds is true below Re = 10 000, where the\n"
  "turbulent power number may not hold. detention_s and Gt come with --flow, motor_power_W with\n"
  "--efficiency.",
};

/* --- paddle --- */

static const BwOptSpec paddle_specs[] = {
  { "blade-length", BW_OPT_QUANTITY, BW_KIND_LENGTH, NULL, NULL, TRUE, "L",
    "length of each blade (along the shaft)", "blade length" },
  { "blade-width", BW_OPT_QUANTITY, BW_KIND_LENGTH, NULL, NULL, TRUE, "W",
    "width of each blade (radially)", "blade width" },
  { "blades", BW_OPT_INT, 0, NULL, NULL, TRUE, "N",
    "number of blades at that radius (1-1000)", "arms per wheel" },
  { "radius", BW_OPT_QUANTITY, BW_KIND_LENGTH, NULL, NULL, TRUE, "R",
    "shaft axis to blade centreline", "blade radius" },
  { "speed", BW_OPT_QUANTITY, BW_KIND_ROTATIONAL_SPEED, "rpm", NULL, TRUE, "N",
    "rotational speed", "rotational speed" },
  { "volume", BW_OPT_QUANTITY, BW_KIND_VOLUME, NULL, NULL, TRUE, "V",
    "compartment volume", "volume" },
  { "temp", BW_OPT_QUANTITY, BW_KIND_TEMPERATURE, "degC", NULL, TRUE, "T",
    "water temperature, 0-40 °C", "temperature" },
  { "drag-coefficient", BW_OPT_NUMBER, 0, NULL, NULL, FALSE, "Cd",
    "blade drag coefficient (default from L/W, Davis Table 6-7)", "drag coefficient" },
  { "relative-velocity-factor", BW_OPT_NUMBER, 0, NULL, NULL, FALSE, "k",
    "blade speed relative to the water / blade speed, (0-1] (default 0.75)",
    "relative velocity factor" },
  { "flow", BW_OPT_QUANTITY, BW_KIND_FLOW, NULL, NULL, FALSE, "Q",
    "flow through the compartment, for detention and Gt", "flow" },
};

static int
run_paddle (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  BwPaddle p;
  BwPaddleResult r;
  const double v = bw_cli_get (args, "volume")->value;
  const BwOptValue *qv = bw_cli_get (args, "flow");
  const BwOptValue *kv = bw_cli_get (args, "relative-velocity-factor");
  BwWater w;
  double g = 0, t = 0;
  int code;

  bw_paddle_init (&p);
  p.n_rings = 1;
  p.ring_radius_m[0] = bw_cli_get (args, "radius")->value;
  p.blade_length_m = bw_cli_get (args, "blade-length")->value;
  p.blade_width_m = bw_cli_get (args, "blade-width")->value;
  p.speed_rev_s = bw_cli_get (args, "speed")->value;
  if (kv->given)
    p.relative_velocity_factor = kv->value;
  if (!get_count (args, "blades", 1, 1000, &p.arms_per_wheel, &code)
      || !water_at (args, &w, &code)
      || !get_positive (args, "drag-coefficient", "drag coefficient", &p.drag_coefficient, &code))
    return code;
  if (!bw_paddle_evaluate (&p, &w, &r, &error)
      || !bw_velocity_gradient (r.power_W, v, &w, &g, &error))
    return bw_cli_fail (args, error);
  if (qv->given)
    {
      if (!bw_check_positive (qv->value, "flow", &error))
        return bw_cli_fail (args, error);
      t = v / qv->value;
    }

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_number (j, "drag_coefficient", r.drag_coefficient);
      bw_json_number (j, "tip_speed_m_s", r.tip_speed_m_s);
      bw_json_number (j, "relative_velocity_m_s", r.relative_velocity_m_s);
      bw_json_number (j, "power_W", r.power_W);
      bw_json_number (j, "G_per_s", g);
      bw_json_bool (j, "drag_from_aspect_ratio", !bw_cli_get (args, "drag-coefficient")->given);
      bw_json_number (j, "relative_velocity_factor", p.relative_velocity_factor);
      bw_json_number (j, "blade_area_m2", r.blade_area_m2);
      bw_json_number (j, "edge_speed_m_s", r.edge_speed_m_s);
      if (qv->given)
        {
          bw_json_number (j, "detention_s", t);
          bw_json_number (j, "Gt", g * t);
        }
      bw_json_number (j, "volume_m3", v);
      bw_json_number (j, "temperature_C", w.temperature_K - CELSIUS_ZERO_K);
      bw_json_print_free (j);
    }
  else
    {
      BwTable *tb = bw_table_new ("Paddle blades, P = sum Cd A rho v_r^3 / 2 (Davis Eq. 6-20)");
      table_count (tb, "blades", p.arms_per_wheel);
      bw_table_quantity (tb, "blade length", p.blade_length_m, BW_KIND_LENGTH, args->units);
      bw_table_quantity (tb, "blade width", p.blade_width_m, BW_KIND_LENGTH, args->units);
      bw_table_quantity (tb, "radius to blade centreline", p.ring_radius_m[0], BW_KIND_LENGTH,
                         args->units);
      bw_table_quantity (tb, "rotational speed", p.speed_rev_s, BW_KIND_ROTATIONAL_SPEED,
                         args->units);
      bw_table_number (tb, "drag coefficient", r.drag_coefficient, 4);
      bw_table_number (tb, "relative velocity factor", p.relative_velocity_factor, 4);
      bw_table_quantity (tb, "blade (tip) speed", r.tip_speed_m_s, BW_KIND_VELOCITY, args->units);
      bw_table_quantity (tb, "velocity relative to water", r.relative_velocity_m_s,
                         BW_KIND_VELOCITY, args->units);
      bw_table_quantity (tb, "volume", v, BW_KIND_VOLUME, args->units);
      table_water (tb, &w, args->units);
      bw_table_quantity (tb, "water power", r.power_W, BW_KIND_POWER, args->units);
      bw_table_quantity (tb, "velocity gradient G", g, BW_KIND_RATE, args->units);
      if (qv->given)
        {
          bw_table_quantity (tb, "detention time", t, BW_KIND_TIME, args->units);
          bw_table_number (tb, "Gt", g * t, 4);
        }
      bw_table_print_free (tb);
    }
  return BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_paddle = {
  "paddle", "Power and G of paddle blades turning at one radius (a paddle wheel's ring).",
  NULL, 0, 0, paddle_specs, G_N_ELEMENTS (paddle_specs), run_paddle,
  "P = N Cd A rho v_r^3 / 2 with v_r = k 2 pi R n (Davis 2010 Eq. 6-20). Without\n"
  "--drag-coefficient, Cd comes from the blade's length/width ratio: 1.20 up to 5, rising\n"
  "linearly to 1.50 at 20, then towards 1.90 for very long blades (Davis Table 6-7; the joins\n"
  "between its points are ours). tip_speed_m_s is the blade centreline's speed 2 pi R n;\n"
  "edge_speed_m_s that of its outer edge. detention_s and Gt come with --flow.",
};

/* --- baffled --- */

static const BwOptSpec baffled_specs[] = {
  { "headloss", BW_OPT_QUANTITY, BW_KIND_HEAD, NULL, NULL, FALSE, "h",
    "head lost through the mixer or channel (or give the channel geometry)", "head loss" },
  { "flow", BW_OPT_QUANTITY, BW_KIND_FLOW, NULL, NULL, TRUE, "Q", "flow", "flow" },
  { "volume", BW_OPT_QUANTITY, BW_KIND_VOLUME, NULL, NULL, FALSE, "V",
    "volume of water the head is lost in (with --headloss)", "volume" },
  { "temp", BW_OPT_QUANTITY, BW_KIND_TEMPERATURE, "degC", NULL, TRUE, "T",
    "water temperature, 0-40 °C", "temperature" },
  { "passes", BW_OPT_INT, 0, NULL, NULL, FALSE, "n",
    "geometry: number of passes (channels between baffles)", "passes" },
  { "spacing", BW_OPT_QUANTITY, BW_KIND_LENGTH, NULL, NULL, FALSE, "s",
    "geometry: baffle spacing (clear channel width)", "baffle spacing" },
  { "depth", BW_OPT_QUANTITY, BW_KIND_LENGTH, NULL, NULL, FALSE, "d",
    "geometry: water depth", "water depth" },
  { "pass-length", BW_OPT_QUANTITY, BW_KIND_LENGTH, NULL, NULL, FALSE, "l",
    "geometry: length of a pass (over-and-under: baffle length across the basin)", "pass length" },
  { "layout", BW_OPT_CHOICE, 0, NULL, "around-the-end|over-and-under", FALSE, "NAME",
    "geometry: baffle layout (default around-the-end)", NULL },
  { "turn-k", BW_OPT_NUMBER, 0, NULL, NULL, FALSE, "K",
    "geometry: velocity heads lost per 180° turn (default 3.2)", "turn loss coefficient" },
  { "manning-n", BW_OPT_NUMBER, 0, NULL, NULL, FALSE, "n",
    "geometry: Manning's n, s/m^(1/3) (default 0.013, concrete)", "manning n" },
};

static const char *const geometry_options[] = { "passes", "spacing", "depth", "pass-length",
                                                "layout", "turn-k", "manning-n" };

static int
run_baffled (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  const BwOptValue *hv = bw_cli_get (args, "headloss");
  const BwOptValue *vv = bw_cli_get (args, "volume");
  const double q = bw_cli_get (args, "flow")->value;
  gboolean geometry = FALSE;
  BwBaffledChannel c;
  BwBaffledResult cr = { 0 };
  BwHydraulicResult hr;
  double h, v;
  BwWater w;
  int code;

  for (guint i = 0; i < G_N_ELEMENTS (geometry_options); i++)
    geometry |= bw_cli_get (args, geometry_options[i])->given;
  if (hv->given && geometry)
    return bw_cli_usage_error (args->command, "--headloss and the channel geometry (--passes, "
                               "--spacing, ...) exclude each other: give one or the other");
  if (!hv->given && !geometry)
    return bw_cli_usage_error (args->command, "--headloss is required (or describe the channel "
                               "with --passes, --spacing, --depth and --pass-length)");
  if (hv->given && !vv->given)
    return bw_cli_usage_error (args->command, "--volume is required with --headloss");
  if (geometry && vv->given)
    return bw_cli_usage_error (args->command, "--volume: the channel geometry gives the volume; "
                               "leave --volume out");
  if (!water_at (args, &w, &code))
    return code;

  if (geometry)
    {
      static const char *const needed[] = { "passes", "spacing", "depth", "pass-length" };
      const BwOptValue *lv = bw_cli_get (args, "layout");
      BwBaffleLayout layout = BW_BAFFLE_AROUND_THE_END;

      for (guint i = 0; i < G_N_ELEMENTS (needed); i++)
        if (!bw_cli_get (args, needed[i])->given)
          return bw_cli_usage_error (args->command, "--%s is required with the channel geometry",
                                     needed[i]);
      if (lv->given)
        bw_baffle_layout_from_name (lv->text, &layout);
      bw_baffled_channel_init (&c, layout);
      if (!get_count (args, "passes", 1, 10000, &c.n_passes, &code))
        return code;
      c.spacing_m = bw_cli_get (args, "spacing")->value;
      c.water_depth_m = bw_cli_get (args, "depth")->value;
      c.pass_length_m = bw_cli_get (args, "pass-length")->value;
      c.turn_loss_k = bw_cli_get_double (args, "turn-k", c.turn_loss_k);
      c.manning_n = bw_cli_get_double (args, "manning-n", c.manning_n);
      if (!bw_baffled_channel_evaluate (&c, q, &w, &cr, &error))
        return bw_cli_fail (args, error);
      h = cr.headloss_m;
      v = cr.volume_m3;
    }
  else
    {
      h = hv->value;
      v = vv->value;
    }
  if (!bw_hydraulic_mixer_evaluate (h, q, v, &w, &hr, &error))
    return bw_cli_fail (args, error);

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_number (j, "detention_s", hr.detention_s);
      bw_json_number (j, "G_per_s", hr.G_per_s);
      bw_json_number (j, "Gt", hr.Gt);
      bw_json_number (j, "power_W", hr.power_W);
      bw_json_number (j, "headloss_m", h);
      bw_json_number (j, "volume_m3", v);
      if (geometry)
        {
          bw_json_string (j, "layout", bw_baffle_layout_name (c.layout));
          bw_json_number (j, "velocity_m_s", cr.velocity_m_s);
          bw_json_number (j, "hydraulic_radius_m", cr.hydraulic_radius_m);
          bw_json_number (j, "path_length_m", cr.path_length_m);
          bw_json_int (j, "turns", cr.n_turns);
          bw_json_number (j, "friction_loss_m", cr.friction_loss_m);
          bw_json_number (j, "turn_loss_m", cr.turn_loss_m);
          bw_json_number (j, "turn_loss_coefficient", c.turn_loss_k);
          bw_json_number (j, "manning_n", c.manning_n);
        }
      bw_json_number (j, "temperature_C", w.temperature_K - CELSIUS_ZERO_K);
      bw_json_print_free (j);
    }
  else
    {
      BwTable *tb = bw_table_new ("Hydraulic mixing, G = sqrt (g h / (nu t)) (Camp & Stein 1943)");
      bw_table_quantity (tb, "flow", q, BW_KIND_FLOW, args->units);
      if (geometry)
        {
          bw_table_text (tb, "layout", bw_baffle_layout_name (c.layout));
          table_count (tb, "passes", c.n_passes);
          bw_table_quantity (tb, "baffle spacing", c.spacing_m, BW_KIND_LENGTH, args->units);
          bw_table_quantity (tb, "channel velocity", cr.velocity_m_s, BW_KIND_VELOCITY,
                             args->units);
          bw_table_quantity (tb, "friction loss (Manning)", cr.friction_loss_m, BW_KIND_HEAD,
                             args->units);
          bw_table_quantity (tb, "turn losses", cr.turn_loss_m, BW_KIND_HEAD, args->units);
        }
      bw_table_quantity (tb, "head loss", h, BW_KIND_HEAD, args->units);
      bw_table_quantity (tb, "volume", v, BW_KIND_VOLUME, args->units);
      table_water (tb, &w, args->units);
      bw_table_quantity (tb, "power dissipated", hr.power_W, BW_KIND_POWER, args->units);
      bw_table_quantity (tb, "detention time", hr.detention_s, BW_KIND_TIME, args->units);
      bw_table_quantity (tb, "velocity gradient G", hr.G_per_s, BW_KIND_RATE, args->units);
      bw_table_number (tb, "Gt", hr.Gt, 4);
      bw_table_print_free (tb);
    }
  return BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_baffled = {
  "baffled", "G and Gt of hydraulic mixing from a head loss, or of a baffled channel.",
  NULL, 0, 0, baffled_specs, G_N_ELEMENTS (baffled_specs), run_baffled,
  "Give --headloss and --volume, or the channel geometry instead (--passes, --spacing,\n"
  "--depth, --pass-length, optionally --layout, --turn-k, --manning-n): then the head loss is\n"
  "Manning friction along the passes plus (passes - 1) K v^2/2g at the turns, and the volume\n"
  "is passes x spacing x depth x pass length. Turn K default 3.2 per 180° turn (Haarhoff 1998;\n"
  "the same for over-and-under: no published value at hand). JSON keys for the geometry\n"
  "(velocity_m_s, friction_loss_m, ...) appear only with it.",
};

/* --- flocmodel --- */

static const BwOptSpec flocmodel_specs[] = {
  { "g", BW_OPT_QUANTITY, BW_KIND_RATE, NULL, NULL, TRUE, "G",
    "velocity gradient in every compartment", "velocity gradient" },
  { "time", BW_OPT_QUANTITY, BW_KIND_TIME, NULL, NULL, TRUE, "t",
    "total detention time of the compartments", "time" },
  { "compartments", BW_OPT_INT, 0, NULL, NULL, TRUE, "m",
    "number of equal compartments in series (1-1000)", "compartments" },
  { "ka", BW_OPT_NUMBER, 0, NULL, NULL, FALSE, "KA",
    "aggregation constant K_A (default 4.5e-5)", "aggregation constant" },
  { "kb", BW_OPT_QUANTITY, BW_KIND_TIME, NULL, NULL, FALSE, "KB",
    "breakup constant K_B (default 1.0e-7 s)", "breakup constant" },
};

static int
run_flocmodel (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  BwFlocKinetics k;
  BwFlocModelResult r, best_r;
  const double g = bw_cli_get (args, "g")->value;
  const double t = bw_cli_get (args, "time")->value;
  gboolean have_best = FALSE;
  double best_g = 0;
  guint m;
  int code;

  bw_floc_kinetics_init (&k);
  k.aggregation_constant = bw_cli_get_double (args, "ka", k.aggregation_constant);
  k.breakup_constant_s = bw_cli_get_double (args, "kb", k.breakup_constant_s);
  if (!get_count (args, "compartments", 1, BW_FLOCMODEL_MAX_COMPARTMENTS, &m, &code))
    return code;
  if (!bw_flocmodel_equal (&k, g, t, m, &r, &error))
    return bw_cli_fail (args, error);
  if (k.breakup_constant_s > 0.0)
    have_best = bw_flocmodel_best_gradient (&k, t, m, &best_g, &best_r, NULL);

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_number (j, "remaining_fraction", r.remaining_fraction);
      bw_json_number (j, "n0_over_nm", r.n0_over_nm);
      bw_json_number (j, "Gt", r.Gt);
      bw_json_number (j, "G_per_s", g);
      bw_json_number (j, "time_s", t);
      bw_json_number (j, "compartment_time_s", t / m);
      bw_json_int (j, "compartments", m);
      bw_json_number (j, "ka", k.aggregation_constant);
      bw_json_number (j, "kb_s", k.breakup_constant_s);
      if (have_best)
        {
          bw_json_number (j, "optimum_G_per_s", best_g);
          bw_json_number (j, "optimum_remaining_fraction", best_r.remaining_fraction);
        }
      bw_json_print_free (j);
    }
  else
    {
      BwTable *tb = bw_table_new ("Argaman-Kaufman flocculation, equal compartments in series");
      bw_table_quantity (tb, "velocity gradient G", g, BW_KIND_RATE, args->units);
      bw_table_quantity (tb, "total time", t, BW_KIND_TIME, args->units);
      table_count (tb, "compartments", m);
      bw_table_number (tb, "K_A", k.aggregation_constant, 4);
      bw_table_quantity (tb, "K_B", k.breakup_constant_s, BW_KIND_TIME, args->units);
      bw_table_number (tb, "Gt", r.Gt, 4);
      bw_table_number (tb, "remaining fraction n_m/n_0", r.remaining_fraction, 4);
      bw_table_number (tb, "n_0/n_m", r.n0_over_nm, 5);
      if (have_best)
        {
          bw_table_quantity (tb, "best G for this time", best_g, BW_KIND_RATE, args->units);
          bw_table_number (tb, "  remaining fraction there", best_r.remaining_fraction, 4);
        }
      bw_table_print_free (tb);
    }
  return BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_flocmodel = {
  "flocmodel", "Primary particles left after flocculation (Argaman-Kaufman model).",
  NULL, 0, 0, flocmodel_specs, G_N_ELEMENTS (flocmodel_specs), run_flocmodel,
  "m equal completely mixed compartments at one G (Argaman & Kaufman 1970; Argaman 1971).\n"
  "Default K_A = 4.5e-5 and K_B = 1.0e-7 s are the values commonly quoted with the model, from\n"
  "memory: fit them to your own jar or pilot tests. G above K_A/K_B is refused (the model's\n"
  "breakup would exceed its aggregation). optimum_G_per_s: the G that leaves the fewest\n"
  "primary particles for the same time and compartments (absent when K_B = 0).",
};
