/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-cli-chemistry.c: the `coagulant`, `zeta` and `jartest` commands. */
#include "config.h"

#include <math.h>
#include <stdio.h>

#include "cli/bw-cli.h"
#include "engine/bw-chemistry.h"
#include "engine/bw-jartest.h"
#include "engine/bw-water.h"
#include "engine/bw-zeta.h"
#include "io/bw-jartest-csv.h"

#define PER_DAY 86400.0

/* --- coagulant --- */

static const BwOptSpec coagulant_specs[] = {
  { "kind", BW_OPT_CHOICE, 0, NULL, "alum|ferric-chloride|ferric-sulfate|pacl", TRUE, "NAME",
    "coagulant (pacl: give --al2o3 and --basicity)", NULL },
  { "dose", BW_OPT_QUANTITY, BW_KIND_CONCENTRATION, "mg/L", NULL, TRUE, "D",
    "dose as the product (alum as the hydrate)", "dose" },
  { "flow", BW_OPT_QUANTITY, BW_KIND_FLOW, NULL, NULL, TRUE, "Q", "plant flow", "flow" },
  { "turbidity", BW_OPT_QUANTITY, BW_KIND_TURBIDITY, NULL, NULL, FALSE, "NTU",
    "raw-water turbidity, for the sludge", "turbidity" },
  { "ss-factor", BW_OPT_NUMBER, 0, NULL, NULL, FALSE, "b",
    "mg/L of suspended solids per NTU (default 1.3)", "suspended solids factor" },
  { "alkalinity", BW_OPT_QUANTITY, BW_KIND_CONCENTRATION, "mg/L", NULL, FALSE, "A",
    "raw-water alkalinity as CaCO3", "alkalinity" },
  { "hydrate", BW_OPT_NUMBER, 0, NULL, NULL, FALSE, "N",
    "waters of hydration of alum, Al2(SO4)3.N H2O (default 14)", "hydrate" },
  { "residual", BW_OPT_QUANTITY, BW_KIND_CONCENTRATION, "mg/L", NULL, FALSE, "A",
    "alkalinity as CaCO3 to keep (with --alkalinity): lime or soda ash to add", "residual alkalinity target" },
  { "strength", BW_OPT_QUANTITY, BW_KIND_FRACTION, NULL, NULL, FALSE, "W",
    "stock solution strength, product per solution by mass (e.g. 48.5%)", "solution strength" },
  { "solution-density", BW_OPT_QUANTITY, BW_KIND_DENSITY, NULL, NULL, FALSE, "RHO",
    "stock solution density (with --strength)", "solution density" },
  { "solids", BW_OPT_QUANTITY, BW_KIND_FRACTION, NULL, NULL, FALSE, "P",
    "sludge solids content, for its volume (e.g. 1%)", "solids content" },
  { "al2o3", BW_OPT_QUANTITY, BW_KIND_FRACTION, NULL, NULL, FALSE, "W",
    "PACl: Al2O3 content by mass (e.g. 10%)", "Al2O3 content" },
  { "basicity", BW_OPT_QUANTITY, BW_KIND_FRACTION, NULL, NULL, FALSE, "B",
    "PACl: basicity OH/(3 Al) (e.g. 70%)", "basicity" },
};

static int
run_coagulant (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  BwCoagulantKind kind = BW_COAGULANT_ALUM;
  BwCoagulant c;
  BwDosing d;
  BwDosingResult r;
  const double q = bw_cli_get (args, "flow")->value;

  bw_coagulant_kind_from_name (bw_cli_get (args, "kind")->text, &kind);
  switch (kind)
    {
    case BW_COAGULANT_ALUM:
      if (!bw_coagulant_alum (bw_cli_get_double (args, "hydrate", 14), &c, &error))
        return bw_cli_fail (args, error);
      break;
    case BW_COAGULANT_FERRIC_CHLORIDE:
      bw_coagulant_ferric_chloride (&c);
      break;
    case BW_COAGULANT_FERRIC_SULFATE:
      bw_coagulant_ferric_sulfate (&c);
      break;
    case BW_COAGULANT_PACL:
      if (!bw_cli_get (args, "al2o3")->given || !bw_cli_get (args, "basicity")->given)
        return bw_cli_usage_error (args->command, "--al2o3 and --basicity: PACl needs both");
      if (!bw_coagulant_pacl (bw_cli_get (args, "al2o3")->value, bw_cli_get (args, "basicity")->value,
                              &c, &error))
        return bw_cli_fail (args, error);
      break;
    default:
      return bw_cli_usage_error (args->command, "--kind: not supported here");
    }
  if (kind != BW_COAGULANT_ALUM && bw_cli_get (args, "hydrate")->given)
    return bw_cli_usage_error (args->command, "--hydrate: only alum has a hydrate to choose");

  bw_dosing_init (&d, bw_cli_get (args, "dose")->value, q);
  d.turbidity_NTU = bw_cli_get_double (args, "turbidity", -1);
  d.ss_factor = bw_cli_get_double (args, "ss-factor", -1);
  d.raw_alkalinity_kg_m3 = bw_cli_get_double (args, "alkalinity", -1);
  d.residual_target_kg_m3 = bw_cli_get_double (args, "residual", -1);
  d.solution_fraction = bw_cli_get_double (args, "strength", -1);
  d.solution_density_kg_m3 = bw_cli_get_double (args, "solution-density", -1);
  d.solids_fraction = bw_cli_get_double (args, "solids", -1);
  if (d.residual_target_kg_m3 >= 0 && d.raw_alkalinity_kg_m3 < 0)
    return bw_cli_usage_error (args->command, "--residual: give --alkalinity too");
  if (d.solids_fraction >= 0 && d.turbidity_NTU < 0)
    return bw_cli_usage_error (args->command, "--solids: give --turbidity too (the sludge needs it)");
  if (!bw_dosing_evaluate (&c, &d, &r, &error))
    return bw_cli_fail (args, error);

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_number (j, "feed_kg_per_day", r.feed_kg_s * PER_DAY);
      bw_json_number (j, "alkalinity_consumed_mg_L_as_CaCO3", r.alkalinity_consumed_kg_m3 * 1e3);
      if (r.has_sludge)
        bw_json_number (j, "sludge_kg_per_day", r.sludge_kg_s * PER_DAY);
      if (r.has_residual)
        bw_json_number (j, "residual_alkalinity_mg_L_as_CaCO3", r.residual_alkalinity_kg_m3 * 1e3);
      bw_json_string (j, "coagulant", bw_coagulant_kind_name (kind));
      if (c.molar_mass_g_mol > 0)
        bw_json_number (j, "molar_mass_g_mol", c.molar_mass_g_mol);
      bw_json_number (j, "metal_fraction", c.metal_fraction);
      bw_json_number (j, "alkalinity_factor_mg_per_mg", c.alkalinity_factor);
      bw_json_number (j, "sludge_factor_mg_per_mg", c.sludge_factor);
      if (r.solution_m3_s > 0)
        bw_json_number (j, "solution_L_per_h", r.solution_m3_s * 3.6e6);
      if (r.lime_kg_m3 > 0)
        {
          bw_json_number (j, "lime_mg_L_as_CaOH2", r.lime_kg_m3 * 1e3);
          bw_json_number (j, "lime_kg_per_day", r.lime_kg_s * PER_DAY);
          bw_json_number (j, "soda_ash_mg_L", r.soda_ash_kg_m3 * 1e3);
          bw_json_number (j, "soda_ash_kg_per_day", r.soda_ash_kg_s * PER_DAY);
        }
      if (r.has_sludge_volume)
        bw_json_number (j, "sludge_m3_per_day", r.sludge_m3_s * PER_DAY);
      bw_json_bool (j, "low_residual_alkalinity", (r.cautions & BW_CHEM_CAUTION_LOW_RESIDUAL) != 0);
      bw_json_print_free (j);
    }
  else
    {
      BwTable *t = bw_table_new ("Coagulant feed, alkalinity and sludge");
      bw_table_text (t, "coagulant", bw_coagulant_kind_name (kind));
      bw_table_quantity (t, "dose", d.dose_kg_m3, BW_KIND_CONCENTRATION, args->units);
      bw_table_quantity (t, "flow", q, BW_KIND_FLOW, args->units);
      bw_table_quantity (t, "dry feed", r.feed_kg_s, BW_KIND_MASS_FLOW, args->units);
      if (r.solution_m3_s > 0)
        bw_table_quantity (t, "solution feed", r.solution_m3_s, BW_KIND_FLOW, args->units);
      bw_table_quantity (t, "alkalinity used (as CaCO3)", r.alkalinity_consumed_kg_m3,
                         BW_KIND_CONCENTRATION, args->units);
      if (r.has_residual)
        bw_table_quantity (t, "residual alkalinity", r.residual_alkalinity_kg_m3,
                           BW_KIND_CONCENTRATION, args->units);
      if (r.lime_kg_m3 > 0)
        {
          bw_table_quantity (t, "lime Ca(OH)2 to add", r.lime_kg_m3, BW_KIND_CONCENTRATION, args->units);
          bw_table_quantity (t, "  or soda ash Na2CO3", r.soda_ash_kg_m3, BW_KIND_CONCENTRATION, args->units);
        }
      if (r.has_sludge)
        bw_table_quantity (t, "dry sludge", r.sludge_kg_s, BW_KIND_MASS_FLOW, args->units);
      if (r.has_sludge_volume)
        bw_table_quantity (t, "sludge volume", r.sludge_m3_s, BW_KIND_FLOW, args->units);
      bw_table_print_free (t);
      if (r.cautions & BW_CHEM_CAUTION_LOW_RESIDUAL)
        printf ("Caution: the residual alkalinity is below %s; expect the pH to fall and "
                "coagulation to suffer.\n", d.residual_target_kg_m3 >= 0 ? "the target" : "zero");
    }
  return BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_coagulant = {
  "coagulant", "Coagulant feed rates, alkalinity consumed, supplemental alkali and sludge.",
  NULL, 0, 0, coagulant_specs, G_N_ELEMENTS (coagulant_specs), run_coagulant,
  "Doses and alkalinities are in mg/L when bare (alkalinity as CaCO3). Stoichiometry from IUPAC\n"
  "atomic weights: alum Al2(SO4)3.14H2O (594.3 g/mol) uses 0.505 mg/L alkalinity per mg/L;\n"
  "FeCl3 0.926. Sludge (Cornwell et al. 1987, from memory): hydroxide with three bound waters\n"
  "plus b x turbidity of removed solids. sludge_kg_per_day appears with --turbidity,\n"
  "residual_alkalinity_mg_L_as_CaCO3 with --alkalinity.",
};

/* --- zeta --- */

static const BwOptSpec zeta_specs[] = {
  { "mobility", BW_OPT_QUANTITY, BW_KIND_MOBILITY, "um*cm/(V*s)", NULL, TRUE, "U",
    "electrophoretic mobility", "mobility" },
  { "temp", BW_OPT_QUANTITY, BW_KIND_TEMPERATURE, "degC", NULL, TRUE, "T",
    "water temperature, 0-40 °C", "temperature" },
  { "model", BW_OPT_CHOICE, 0, NULL, "smoluchowski|huckel|henry", FALSE, "NAME",
    "conversion (default smoluchowski; henry needs --radius and --ionic-strength)", NULL },
  { "radius", BW_OPT_QUANTITY, BW_KIND_LENGTH, NULL, NULL, FALSE, "a", "particle radius", "radius" },
  { "ionic-strength", BW_OPT_QUANTITY, BW_KIND_MOLAR_CONCENTRATION, NULL, NULL, FALSE, "I",
    "ionic strength of a 1:1 electrolyte (a bare number is mmol/L = mol/m³)", "ionic strength" },
};

static int
run_zeta (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  BwZetaModel model = BW_ZETA_SMOLUCHOWSKI;
  BwWater w;
  BwZetaResult r;
  const BwOptValue *mv = bw_cli_get (args, "model");

  if (mv->given)
    bw_zeta_model_from_name (mv->text, &model);
  if (!bw_water_properties (bw_cli_get (args, "temp")->value, &w, &error))
    return bw_cli_fail (args, error);
  if (!bw_zeta_from_mobility (bw_cli_get (args, "mobility")->value, model,
                              bw_cli_get_double (args, "radius", 0),
                              bw_cli_get_double (args, "ionic-strength", 0), &w, &r, &error))
    return bw_cli_fail (args, error);

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_number (j, "zeta_mV", r.zeta_V * 1e3);
      if (r.has_debye)
        bw_json_number (j, "debye_length_m", r.debye_length_m);
      if (r.kappa_a > 0)
        bw_json_number (j, "kappa_a", r.kappa_a);
      bw_json_number (j, "henry_function", r.henry_function);
      bw_json_string (j, "model", bw_zeta_model_name (model));
      bw_json_number (j, "viscosity_Pa_s", w.dynamic_viscosity_Pa_s);
      bw_json_number (j, "relative_permittivity", w.relative_permittivity);
      bw_json_print_free (j);
    }
  else
    {
      BwTable *t = bw_table_new ("Zeta potential from electrophoretic mobility");
      bw_table_text (t, "model", bw_zeta_model_name (model));
      bw_table_quantity (t, "zeta potential", r.zeta_V, BW_KIND_POTENTIAL, args->units);
      bw_table_number (t, "Henry's function f(κa)", r.henry_function, 4);
      if (r.has_debye)
        bw_table_quantity (t, "Debye length", r.debye_length_m, BW_KIND_LENGTH, args->units);
      if (r.kappa_a > 0)
        bw_table_number (t, "κa", r.kappa_a, 4);
      bw_table_print_free (t);
    }
  return BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_zeta = {
  "zeta", "Zeta potential from electrophoretic mobility (Smoluchowski, Hückel or Henry).",
  NULL, 0, 0, zeta_specs, G_N_ELEMENTS (zeta_specs), run_zeta,
  "A bare mobility is in um*cm/(V*s). Henry (1931): U = 2 eps zeta f(ka) / (3 eta), with f from\n"
  "Ohshima (1994); f = 1.5 is Smoluchowski's limit and f = 1 Hückel's. Water viscosity (IAPWS 2008)\n"
  "and permittivity (Malmberg & Maryott 1956) at the test temperature; Debye length of a 1:1\n"
  "electrolyte. debye_length_m appears with --ionic-strength, kappa_a with --radius too.",
};

/* --- jartest --- */

static const BwOptSpec jartest_specs[] = {
  { "target", BW_OPT_QUANTITY, BW_KIND_TURBIDITY, NULL, NULL, FALSE, "NTU",
    "settled turbidity to reach: the least dose that reaches it", "target" },
  { "threshold", BW_OPT_QUANTITY, BW_KIND_POTENTIAL, "mV", NULL, FALSE, "Z",
    "|zeta| limit of the destabilised window (default 10 mV, common practice)", "threshold" },
  { "temp", BW_OPT_QUANTITY, BW_KIND_TEMPERATURE, "degC", NULL, FALSE, "T",
    "test temperature, for a mobility column (default 20 °C)", "temperature" },
  { "model", BW_OPT_CHOICE, 0, NULL, "smoluchowski|huckel|henry", FALSE, "NAME",
    "mobility to zeta conversion (default smoluchowski)", NULL },
  { "radius", BW_OPT_QUANTITY, BW_KIND_LENGTH, NULL, NULL, FALSE, "a", "particle radius (henry)", "radius" },
  { "ionic-strength", BW_OPT_QUANTITY, BW_KIND_MOLAR_CONCENTRATION, NULL, NULL, FALSE, "I",
    "ionic strength (henry; a bare number is mmol/L)", "ionic strength" },
};

static int
run_jartest (BwCliArgs *args)
{
  g_autoptr (GError) error = NULL;
  BwJarSeries s;
  BwJarResult r;
  BwZetaModel model = BW_ZETA_SMOLUCHOWSKI;
  const BwOptValue *mv = bw_cli_get (args, "model");
  const double target = bw_cli_get_double (args, "target", -1);

  if (!bw_jartest_load_csv (args->positional[0], &s, &error))
    return bw_cli_usage_error (args->command, "%s", error->message);
  if (mv->given)
    bw_zeta_model_from_name (mv->text, &model);
  if (s.has_mobility)
    {
      BwWater w;
      if (!bw_water_properties (bw_cli_get_double (args, "temp", 293.15), &w, &error)
          || !bw_jar_series_zeta_from_mobility (&s, model, bw_cli_get_double (args, "radius", 0),
                                                bw_cli_get_double (args, "ionic-strength", 0), &w,
                                                &error))
        return bw_cli_fail (args, error);
    }
  if (!bw_jar_analyse (&s, target, bw_cli_get_double (args, "threshold", BW_ZETA_DESTABILISED_DEFAULT_V),
                       &r, &error))
    return bw_cli_fail (args, error);

  if (args->json)
    {
      BwJson *j = bw_json_new ();
      bw_json_number (j, "optimum_dose_mg_L", r.optimum_dose_kg_m3 * 1e3);
      if (r.has_target)
        bw_json_number (j, "target_dose_mg_L", r.target_dose_kg_m3 * 1e3);
      if (r.has_window)
        {
          bw_json_begin_array (j, "destabilized_dose_range_mg_L");
          bw_json_array_number (j, r.window_low_kg_m3 * 1e3);
          bw_json_array_number (j, r.window_high_kg_m3 * 1e3);
          bw_json_end_array (j);
        }
      bw_json_number (j, "optimum_turbidity_NTU", r.optimum_turbidity_NTU);
      if (target >= 0)
        bw_json_bool (j, "target_reached", r.has_target);
      bw_json_int (j, "jars", s.n_jars);
      bw_json_print_free (j);
    }
  else
    {
      BwTable *t = bw_table_new ("Jar test");
      {
        g_autofree char *n = g_strdup_printf ("%u", s.n_jars);
        bw_table_text (t, "jars", n);
      }
      bw_table_quantity (t, "optimum dose (least turbidity)", r.optimum_dose_kg_m3,
                         BW_KIND_CONCENTRATION, args->units);
      bw_table_quantity (t, "  settled turbidity there", r.optimum_turbidity_NTU, BW_KIND_TURBIDITY,
                         args->units);
      if (target >= 0)
        {
          if (r.has_target)
            bw_table_quantity (t, "least dose reaching the target", r.target_dose_kg_m3,
                               BW_KIND_CONCENTRATION, args->units);
          else
            bw_table_text (t, "least dose reaching the target", "not reached in the doses tested");
        }
      if (s.has_zeta)
        {
          if (r.has_window)
            {
              g_autofree char *lo = bw_units_format (r.window_low_kg_m3, BW_KIND_CONCENTRATION, args->units);
              g_autofree char *hi = bw_units_format (r.window_high_kg_m3, BW_KIND_CONCENTRATION, args->units);
              g_autofree char *txt = g_strdup_printf ("%s to %s", lo, hi);
              bw_table_text (t, "destabilised (|ζ| within the limit)", txt);
            }
          else
            bw_table_text (t, "destabilised (|ζ| within the limit)", "no jar within the limit");
        }
      bw_table_print_free (t);
    }
  return BW_CLI_EXIT_OK;
}

const BwCliCommand bw_cli_cmd_jartest = {
  "jartest", "Dose-response of a jar-test sheet: optimum and target doses, destabilised window.",
  "FILE.csv", 1, 1, jartest_specs, G_N_ELEMENTS (jartest_specs), run_jartest,
  "CSV header: dose (mg/L),turbidity (NTU)[,pH][,zeta (mV) | mobility (um*cm/(V*s))], any order.\n"
  "The curve is a monotone cubic through the jars (Fritsch & Carlson 1980): it never invents a\n"
  "turbidity below the measured ones, so the optimum is the best jar. target_dose_mg_L appears\n"
  "when --target is reached; destabilized_dose_range_mg_L with a zeta or mobility column.",
};
