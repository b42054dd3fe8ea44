/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-chemistry.h: coagulant dosing: feed rates, alkalinity consumed, supplemental alkali, and the
 * sludge the coagulant and the removed solids make. */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* Molar masses from the IUPAC standard atomic weights (conventional values, IUPAC 2021), g/mol. */
#define BW_M_AL 26.9815385
#define BW_M_FE 55.845
#define BW_M_S 32.06
#define BW_M_O 15.999
#define BW_M_H 1.008
#define BW_M_CL 35.45
#define BW_M_CA 40.078
#define BW_M_C 12.011
#define BW_M_NA 22.98976928
#define BW_M_H2O (2 * BW_M_H + BW_M_O)
#define BW_M_CACO3 (BW_M_CA + BW_M_C + 3 * BW_M_O)

typedef enum
{
  BW_COAGULANT_ALUM,            /* Al2(SO4)3 . n H2O (n = 14 unless set) */
  BW_COAGULANT_FERRIC_CHLORIDE, /* FeCl3 */
  BW_COAGULANT_FERRIC_SULFATE,  /* Fe2(SO4)3 */
  BW_COAGULANT_PACL,            /* polyaluminium chloride, by % Al2O3 and basicity */
  BW_COAGULANT_USER,            /* factors given by the user */
  BW_N_COAGULANTS
} BwCoagulantKind;

/* What a coagulant does per unit mass of product dosed (the dose is expressed as the product:
 * alum as Al2(SO4)3 . n H2O, PACl as the solution, a user coagulant as the user says). */
typedef struct
{
  BwCoagulantKind kind;
  double molar_mass_g_mol;     /* of the product as dosed; 0 for PACl and user coagulants */
  double metal_fraction;       /* g of Al or Fe per g of product */
  double alkalinity_factor;    /* g of alkalinity as CaCO3 consumed per g of product */
  double hydroxide_factor;     /* g of Al(OH)3 or Fe(OH)3 formed per g of product */
  double sludge_factor;        /* g of dry sludge (hydroxide with bound water) per g of product */
} BwCoagulant;

/* The stoichiometry of a named coagulant. ALUM_HYDRATE_WATERS is n in Al2(SO4)3 . n H2O (0-18;
 * 14 is the commercial default). */
gboolean bw_coagulant_alum (double hydrate_waters, BwCoagulant *out, GError **error);
void bw_coagulant_ferric_chloride (BwCoagulant *out);
void bw_coagulant_ferric_sulfate (BwCoagulant *out);
/* PACl: AL2O3_FRACTION (g Al2O3 per g of solution, 0-1) and BASICITY (OH / 3 Al, 0-1). */
gboolean bw_coagulant_pacl (double al2o3_fraction, double basicity, BwCoagulant *out,
                            GError **error);
/* A user coagulant from its three factors (g per g of product). */
gboolean bw_coagulant_user (double metal_fraction, double alkalinity_factor,
                            double sludge_factor, BwCoagulant *out, GError **error);

const char *bw_coagulant_kind_name (BwCoagulantKind k); /* "alum", "ferric-chloride", ... */
gboolean bw_coagulant_kind_from_name (const char *name, BwCoagulantKind *out);

typedef struct
{
  double dose_kg_m3;              /* coagulant dose as the product, kg/m3 (1 mg/L = 1e-3) */
  double flow_m3_s;               /* m3/s */
  /* Optional inputs: a negative value means "not given". */
  double raw_alkalinity_kg_m3;    /* as CaCO3 */
  double residual_target_kg_m3;   /* alkalinity as CaCO3 to keep after coagulation */
  double turbidity_NTU;           /* raw water, for the removed suspended solids */
  double ss_factor;               /* mg/L of suspended solids per NTU (default 1.3 when < 0) */
  double polymer_kg_m3;           /* other additives that end up in the sludge */
  double solution_fraction;       /* stock solution strength, g product per g solution */
  double solution_density_kg_m3;  /* stock solution density */
  double solids_fraction;         /* sludge solids content, for its volume */
  double solids_sg;               /* specific gravity of the dry solids (default 1.4 when < 0) */
} BwDosing;

/* Fills D with the "not given" markers and the flow and dose. */
void bw_dosing_init (BwDosing *d, double dose_kg_m3, double flow_m3_s);

typedef enum
{
  BW_CHEM_CAUTION_LOW_RESIDUAL = 1 << 0, /* residual alkalinity below the target: pH will fall */
  BW_CHEM_CAUTION_ALKALINITY_EXHAUSTED = 1 << 1, /* the dose consumes more than the raw water has */
} BwChemCaution;

typedef struct
{
  double feed_kg_s;                 /* dry product fed, kg/s */
  double solution_m3_s;             /* stock solution fed, m3/s (0 unless strength and density given) */
  double alkalinity_consumed_kg_m3; /* as CaCO3 */
  gboolean has_residual;
  double residual_alkalinity_kg_m3; /* as CaCO3: raw - consumed (may be negative) */
  double lime_kg_m3;                /* Ca(OH)2 to restore the residual target; 0 if none needed */
  double soda_ash_kg_m3;            /* Na2CO3 for the same, as the alternative */
  double lime_kg_s, soda_ash_kg_s;  /* the same as feed rates */
  gboolean has_sludge;
  double sludge_coagulant_kg_m3;    /* hydroxide with bound water */
  double sludge_ss_kg_m3;           /* removed suspended solids */
  double sludge_kg_s;               /* dry solids, kg/s */
  gboolean has_sludge_volume;
  double sludge_m3_s;               /* at the given solids content */
  guint cautions;                   /* BwChemCaution */
} BwDosingResult;

/* Feed, alkalinity and sludge for coagulant C at dosing D. Alkali demand: Ca(OH)2 74.09 g and
 * Na2CO3 105.99 g per 100.09 g of alkalinity as CaCO3 (stoichiometry, IUPAC weights). */
gboolean bw_dosing_evaluate (const BwCoagulant *c, const BwDosing *d, BwDosingResult *out,
                             GError **error);

G_END_DECLS
