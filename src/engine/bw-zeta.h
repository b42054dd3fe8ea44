/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-zeta.h: zeta potential from electrophoretic mobility, and the Debye length. */
#pragma once

#include <glib.h>

#include "engine/bw-water.h"

G_BEGIN_DECLS

/* Vacuum permittivity, F/m (CODATA 2018); Boltzmann constant, J/K; elementary charge, C;
 * Avogadro constant, 1/mol (SI 2019 exact values). */
#define BW_EPSILON_0 8.8541878128e-12
#define BW_BOLTZMANN 1.380649e-23
#define BW_ELEMENTARY_CHARGE 1.602176634e-19
#define BW_AVOGADRO 6.02214076e23

typedef enum
{
  BW_ZETA_SMOLUCHOWSKI, /* thin double layer, kappa a >> 1: f(kappa a) = 1.5 */
  BW_ZETA_HUCKEL,       /* thick double layer, kappa a << 1: f(kappa a) = 1 */
  BW_ZETA_HENRY,        /* Henry's function by Ohshima's (1994) approximation */
} BwZetaModel;

const char *bw_zeta_model_name (BwZetaModel m); /* "smoluchowski", "huckel", "henry" */
gboolean bw_zeta_model_from_name (const char *name, BwZetaModel *out);

/* Debye length of a symmetric 1:1 electrolyte of ionic strength IONIC_STRENGTH_MOL_M3 (mol/m3)
 * in WATER: 1/kappa = sqrt (eps_r eps_0 k T / (2 N_A e^2 I)), m (e.g. Israelachvili,
 * Intermolecular and Surface Forces, 3rd ed., Ch. 14). */
gboolean bw_debye_length (double ionic_strength_mol_m3, const BwWater *water, double *out_m,
                          GError **error);

/* Ohshima (1994), J. Colloid Interface Sci. 168:269, Eq. 8: Henry's function
 * f(ka) = 1 + 1 / (2 [1 + 2.5 / (ka (1 + 2 e^-ka))]^3), in Henry's form U = 2 eps zeta f / (3 eta),
 * rising from 1 (Hückel) to 1.5 (Smoluchowski). */
double bw_henry_function (double kappa_a);

typedef struct
{
  double zeta_V;           /* V */
  double henry_function;   /* the f(kappa a) used: 1 (Hückel) ... 1.5 (Smoluchowski) */
  gboolean has_debye;
  double debye_length_m;   /* m, when an ionic strength was given */
  double kappa_a;          /* when a radius and an ionic strength were given */
} BwZetaResult;

/* Zeta potential from MOBILITY (m2/(V s)) in WATER: U = 2 eps_r eps_0 zeta f(kappa a) / (3 eta)
 * (Henry 1931). Henry's model needs RADIUS_M (> 0) and IONIC_STRENGTH_MOL_M3 (> 0); for the other
 * two they may be 0 (not given) and, if given, only report kappa and kappa a. */
gboolean bw_zeta_from_mobility (double mobility_m2_V_s, BwZetaModel model, double radius_m,
                                double ionic_strength_mol_m3, const BwWater *water,
                                BwZetaResult *out, GError **error);

G_END_DECLS
