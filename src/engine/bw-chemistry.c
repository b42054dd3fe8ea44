/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-chemistry.c: coagulant stoichiometry, feed rates, alkalinity and sludge production. */
#include "config.h"

#include "engine/bw-chemistry.h"

#include <math.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"

#define M_AL2SO43 (2 * BW_M_AL + 3 * (BW_M_S + 4 * BW_M_O)) /* 342.15 g/mol */
#define M_ALOH3 (BW_M_AL + 3 * (BW_M_O + BW_M_H))           /* 78.00 g/mol */
#define M_FEOH3 (BW_M_FE + 3 * (BW_M_O + BW_M_H))           /* 106.87 g/mol */
#define M_FECL3 (BW_M_FE + 3 * BW_M_CL)                     /* 162.20 g/mol */
#define M_FE2SO43 (2 * BW_M_FE + 3 * (BW_M_S + 4 * BW_M_O)) /* 399.86 g/mol */
#define M_AL2O3 (2 * BW_M_AL + 3 * BW_M_O)                  /* 101.96 g/mol */
#define M_CAOH2 (BW_M_CA + 2 * (BW_M_O + BW_M_H))           /* 74.09 g/mol */
#define M_NA2CO3 (2 * BW_M_NA + BW_M_C + 3 * BW_M_O)        /* 105.99 g/mol */

/* Bound water carried by the hydroxide floc in the sludge: Al(OH)3 . 3H2O and Fe(OH)3 . 3H2O
 * (Cornwell et al. 1987, Handbook of Practice: Water Treatment Plant Waste Management, AWWARF;
 * from memory: their factors 0.44 per mg alum and 2.9 per mg Fe follow from these). */
#define BOUND_WATERS 3.0

static const char *const names[BW_N_COAGULANTS] = {
  "alum", "ferric-chloride", "ferric-sulfate", "pacl", "user",
};

const char *
bw_coagulant_kind_name (BwCoagulantKind k)
{
  g_return_val_if_fail (k < BW_N_COAGULANTS, "unknown");
  return names[k];
}

gboolean
bw_coagulant_kind_from_name (const char *name, BwCoagulantKind *out)
{
  for (int i = 0; i < BW_N_COAGULANTS; i++)
    if (g_strcmp0 (names[i], name) == 0)
      {
        *out = (BwCoagulantKind) i;
        return TRUE;
      }
  return FALSE;
}

/* Alum: Al2(SO4)3 . nH2O + 3 Ca(HCO3)2 -> 2 Al(OH)3 + 3 CaSO4 + 6 CO2 + n H2O: one mole consumes
 * 3 mol of alkalinity as CaCO3 and forms 2 mol of Al(OH)3 (e.g. Davis 2010, Ch. 6, coagulation
 * chemistry; the reaction is standard stoichiometry). */
gboolean
bw_coagulant_alum (double hydrate_waters, BwCoagulant *out, GError **error)
{
  double m;

  g_return_val_if_fail (out != NULL, FALSE);
  if (!bw_check_range (hydrate_waters, 0, 18, BW_ ("hydrate"), "H2O per formula unit", error))
    return FALSE;
  m = M_AL2SO43 + hydrate_waters * BW_M_H2O;
  memset (out, 0, sizeof *out);
  out->kind = BW_COAGULANT_ALUM;
  out->molar_mass_g_mol = m;
  out->metal_fraction = 2 * BW_M_AL / m;
  out->alkalinity_factor = 3 * BW_M_CACO3 / m;
  out->hydroxide_factor = 2 * M_ALOH3 / m;
  out->sludge_factor = 2 * (M_ALOH3 + BOUND_WATERS * BW_M_H2O) / m;
  return TRUE;
}

/* Ferric chloride: 2 FeCl3 + 3 Ca(HCO3)2 -> 2 Fe(OH)3 + 3 CaCl2 + 6 CO2: 1.5 mol alkalinity as
 * CaCO3 and one Fe(OH)3 per mole. */
void
bw_coagulant_ferric_chloride (BwCoagulant *out)
{
  memset (out, 0, sizeof *out);
  out->kind = BW_COAGULANT_FERRIC_CHLORIDE;
  out->molar_mass_g_mol = M_FECL3;
  out->metal_fraction = BW_M_FE / M_FECL3;
  out->alkalinity_factor = 1.5 * BW_M_CACO3 / M_FECL3;
  out->hydroxide_factor = M_FEOH3 / M_FECL3;
  out->sludge_factor = (M_FEOH3 + BOUND_WATERS * BW_M_H2O) / M_FECL3;
}

/* Ferric sulfate: Fe2(SO4)3 + 3 Ca(HCO3)2 -> 2 Fe(OH)3 + 3 CaSO4 + 6 CO2. */
void
bw_coagulant_ferric_sulfate (BwCoagulant *out)
{
  memset (out, 0, sizeof *out);
  out->kind = BW_COAGULANT_FERRIC_SULFATE;
  out->molar_mass_g_mol = M_FE2SO43;
  out->metal_fraction = 2 * BW_M_FE / M_FE2SO43;
  out->alkalinity_factor = 3 * BW_M_CACO3 / M_FE2SO43;
  out->hydroxide_factor = 2 * M_FEOH3 / M_FE2SO43;
  out->sludge_factor = 2 * (M_FEOH3 + BOUND_WATERS * BW_M_H2O) / M_FE2SO43;
}

/* PACl, Al_n(OH)_m Cl_(3n-m): the basicity B = m / 3n is the share of the aluminium's hydroxide
 * already supplied, so each mole of Al consumes only 3 (1 - B) equivalents of alkalinity, i.e.
 * 1.5 (1 - B) mol as CaCO3 (standard definition of basicity; e.g. Crittenden et al. 2012, from
 * memory). The Al content follows from the Al2O3 assay: 2 Al per Al2O3. */
gboolean
bw_coagulant_pacl (double al2o3_fraction, double basicity, BwCoagulant *out, GError **error)
{
  double al_mol_per_g;

  g_return_val_if_fail (out != NULL, FALSE);
  if (!bw_check_range (al2o3_fraction, 0.01, 0.5, BW_ ("Al2O3 content"), "g/g", error)
      || !bw_check_range (basicity, 0, 0.95, BW_ ("basicity"), "", error))
    return FALSE;
  al_mol_per_g = al2o3_fraction * 2 / M_AL2O3;
  memset (out, 0, sizeof *out);
  out->kind = BW_COAGULANT_PACL;
  out->metal_fraction = al_mol_per_g * BW_M_AL;
  out->alkalinity_factor = al_mol_per_g * 1.5 * (1 - basicity) * BW_M_CACO3;
  out->hydroxide_factor = al_mol_per_g * M_ALOH3;
  out->sludge_factor = al_mol_per_g * (M_ALOH3 + BOUND_WATERS * BW_M_H2O);
  return TRUE;
}

gboolean
bw_coagulant_user (double metal_fraction, double alkalinity_factor, double sludge_factor,
                   BwCoagulant *out, GError **error)
{
  g_return_val_if_fail (out != NULL, FALSE);
  if (!bw_check_range (metal_fraction, 0, 1, BW_ ("metal fraction"), "g/g", error)
      || !bw_check_range (alkalinity_factor, 0, 5, BW_ ("alkalinity factor"), "g CaCO3/g", error)
      || !bw_check_range (sludge_factor, 0, 10, BW_ ("sludge factor"), "g/g", error))
    return FALSE;
  memset (out, 0, sizeof *out);
  out->kind = BW_COAGULANT_USER;
  out->metal_fraction = metal_fraction;
  out->alkalinity_factor = alkalinity_factor;
  out->hydroxide_factor = sludge_factor;
  out->sludge_factor = sludge_factor;
  return TRUE;
}

void
bw_dosing_init (BwDosing *d, double dose_kg_m3, double flow_m3_s)
{
  d->dose_kg_m3 = dose_kg_m3;
  d->flow_m3_s = flow_m3_s;
  d->raw_alkalinity_kg_m3 = -1;
  d->residual_target_kg_m3 = -1;
  d->turbidity_NTU = -1;
  d->ss_factor = -1;
  d->polymer_kg_m3 = -1;
  d->solution_fraction = -1;
  d->solution_density_kg_m3 = -1;
  d->solids_fraction = -1;
  d->solids_sg = -1;
}

static gboolean
given (double v)
{
  return v >= 0;
}

gboolean
bw_dosing_evaluate (const BwCoagulant *c, const BwDosing *d, BwDosingResult *out, GError **error)
{
  BwDosingResult r = { 0 };

  g_return_val_if_fail (c != NULL && d != NULL && out != NULL, FALSE);
  if (!bw_check_range (d->dose_kg_m3, 0, 1.0, BW_ ("dose"), "kg/m³", error)
      || !bw_check_positive (d->flow_m3_s, BW_ ("flow"), error)
      || !bw_check_range (d->flow_m3_s, 0, 1e4, BW_ ("flow"), "m³/s", error))
    return FALSE;
  if ((given (d->raw_alkalinity_kg_m3) && !bw_check_range (d->raw_alkalinity_kg_m3, 0, 2, BW_ ("alkalinity"), "kg/m³", error))
      || (given (d->residual_target_kg_m3) && !bw_check_range (d->residual_target_kg_m3, 0, 2, BW_ ("residual alkalinity target"), "kg/m³", error))
      || (given (d->turbidity_NTU) && !bw_check_range (d->turbidity_NTU, 0, 1e5, BW_ ("turbidity"), "NTU", error))
      || (given (d->ss_factor) && !bw_check_range (d->ss_factor, 0, 10, BW_ ("suspended solids factor"), "mg/L per NTU", error))
      || (given (d->polymer_kg_m3) && !bw_check_range (d->polymer_kg_m3, 0, 1, BW_ ("other additives"), "kg/m³", error)))
    return FALSE;

  /* Feed: mass rate = dose (kg/m3) x flow (m3/s). */
  r.feed_kg_s = d->dose_kg_m3 * d->flow_m3_s;
  if (given (d->solution_fraction) || given (d->solution_density_kg_m3))
    {
      if (!bw_check_range (d->solution_fraction, 1e-4, 1, BW_ ("solution strength"), "g/g", error)
          || !bw_check_range (d->solution_density_kg_m3, 500, 3000, BW_ ("solution density"), "kg/m³", error))
        return FALSE;
      r.solution_m3_s = r.feed_kg_s / (d->solution_fraction * d->solution_density_kg_m3);
    }

  r.alkalinity_consumed_kg_m3 = c->alkalinity_factor * d->dose_kg_m3;
  if (given (d->raw_alkalinity_kg_m3))
    {
      const double target = given (d->residual_target_kg_m3) ? d->residual_target_kg_m3 : 0.0;
      r.has_residual = TRUE;
      r.residual_alkalinity_kg_m3 = d->raw_alkalinity_kg_m3 - r.alkalinity_consumed_kg_m3;
      if (r.residual_alkalinity_kg_m3 < 0)
        r.cautions |= BW_CHEM_CAUTION_ALKALINITY_EXHAUSTED;
      if (r.residual_alkalinity_kg_m3 < target)
        {
          /* Alkali to bring the residual up to the target: Ca(OH)2 and Na2CO3 each supply one
           * mole of alkalinity as CaCO3 per mole (2 equivalents). */
          const double deficit = target - r.residual_alkalinity_kg_m3;
          r.cautions |= BW_CHEM_CAUTION_LOW_RESIDUAL;
          r.lime_kg_m3 = deficit * M_CAOH2 / BW_M_CACO3;
          r.soda_ash_kg_m3 = deficit * M_NA2CO3 / BW_M_CACO3;
          r.lime_kg_s = r.lime_kg_m3 * d->flow_m3_s;
          r.soda_ash_kg_s = r.soda_ash_kg_m3 * d->flow_m3_s;
        }
    }

  if (given (d->turbidity_NTU))
    {
      /* Dry sludge, Cornwell et al. (1987), from memory: S = Q (k_c D + b T + A), with k_c the
       * hydroxide-with-bound-water factor of the coagulant, b the suspended solids per NTU
       * (default 1.3; 0.7-2.2 is the range usually quoted, from memory), A other additives. */
      const double b = given (d->ss_factor) ? d->ss_factor : 1.3;
      const double a = given (d->polymer_kg_m3) ? d->polymer_kg_m3 : 0.0;
      r.has_sludge = TRUE;
      r.sludge_coagulant_kg_m3 = c->sludge_factor * d->dose_kg_m3;
      r.sludge_ss_kg_m3 = b * d->turbidity_NTU * 1e-3; /* mg/L -> kg/m3 */
      r.sludge_kg_s = d->flow_m3_s * (r.sludge_coagulant_kg_m3 + r.sludge_ss_kg_m3 + a);
      if (given (d->solids_fraction))
        {
          const double ss = given (d->solids_sg) ? d->solids_sg : 1.4;
          double rho;
          if (!bw_check_range (d->solids_fraction, 1e-4, 0.6, BW_ ("solids content"), "g/g", error)
              || !bw_check_range (ss, 1.0, 4.0, BW_ ("solids specific gravity"), "", error))
            return FALSE;
          /* Sludge density from its water and solids: 1/rho = (1 - P)/rho_w + P/(S_s rho_w),
           * rho_w = 1000 kg/m3 (mass-volume relation for sludges, e.g. Metcalf & Eddy; from
           * memory). Volume = dry mass / (P rho). */
          rho = 1000.0 / ((1 - d->solids_fraction) + d->solids_fraction / ss);
          r.has_sludge_volume = TRUE;
          r.sludge_m3_s = r.sludge_kg_s / (d->solids_fraction * rho);
        }
    }
  *out = r;
  return TRUE;
}
