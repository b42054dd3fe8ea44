/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-flocmodel.h: the Argaman-Kaufman aggregation-breakup model for compartments in series. */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* Default kinetic constants (from memory: the values usually quoted with Argaman & Kaufman 1970
 * and Argaman 1971 for an alum floc; treat them as inputs, fitted to jar or pilot tests). */
#define BW_FLOCMODEL_DEFAULT_KA 4.5e-5  /* aggregation constant K_A, dimensionless */
#define BW_FLOCMODEL_DEFAULT_KB_S 1.0e-7 /* breakup constant K_B, s */

/* Most compartments accepted (a sanity bound, not a storage limit: nothing is allocated). */
#define BW_FLOCMODEL_MAX_COMPARTMENTS 1000

typedef struct
{
  double aggregation_constant; /* K_A, dimensionless, > 0 */
  double breakup_constant_s;   /* K_B, s, >= 0 */
} BwFlocKinetics;

typedef struct
{
  double remaining_fraction; /* n_m / n_0: primary particles leaving the last compartment */
  double n0_over_nm;         /* its inverse, the "performance ratio" of the papers */
  guint n_compartments;
  double total_time_s;       /* sum of the compartment detention times, s */
  double Gt;                 /* sum of G_i t_i */
} BwFlocModelResult;

/* Fills KINETICS with the defaults above. */
void bw_floc_kinetics_init (BwFlocKinetics *kinetics);

/* M equal compartments in series, each at G_PER_S, TOTAL_TIME_S in all (closed form). */
gboolean bw_flocmodel_equal (const BwFlocKinetics *kinetics, double G_per_s, double total_time_s,
                             guint n_compartments, BwFlocModelResult *out, GError **error);

/* N compartments in series with their own G (1/s) and detention time (s): a tapered train.
 * FRACTIONS_OUT, when not NULL, receives n_i / n_0 after each compartment (N values). */
gboolean bw_flocmodel_series (const BwFlocKinetics *kinetics, guint n_compartments,
                              const double *G_per_s, const double *time_s, double *fractions_out,
                              BwFlocModelResult *out, GError **error);

/* The G of M equal compartments, TOTAL_TIME_S in all, that leaves the fewest primary particles,
 * and the result there. Needs K_B > 0: without breakup more G is always better. */
gboolean bw_flocmodel_best_gradient (const BwFlocKinetics *kinetics, double total_time_s,
                                     guint n_compartments, double *out_G_per_s,
                                     BwFlocModelResult *out, GError **error);

G_END_DECLS
