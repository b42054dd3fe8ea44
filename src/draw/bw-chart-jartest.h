/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-chart-jartest.h: the jar-test chart: settled turbidity against coagulant dose (the jars and
 * the engine's smooth curve), zeta potential on a right axis with the destabilised window, and the
 * chosen dose range. Plain data in; a BwChart for bw_chart_paint out. */
#pragma once

#include <glib.h>

#include "draw/bw-chart.h"
#include "engine/bw-jartest.h"
#include "engine/bw-project.h"
#include "engine/bw-units.h"

G_BEGIN_DECLS

/* Colour roles of the chart (indices into the style's series palette), for tests and the GUI. */
#define BW_JARTEST_C_TURBIDITY 0
#define BW_JARTEST_C_ZETA 2
#define BW_JARTEST_C_WINDOW 4
#define BW_JARTEST_C_CHOSEN 1
#define BW_JARTEST_C_TARGET 3

/* Points of the smooth curve between the least and the greatest dose tested. */
#define BW_JARTEST_CURVE_POINTS 121

typedef struct
{
  double target_NTU;      /* settled turbidity to reach, drawn as a line; < 0: none */
  double threshold_V;     /* |zeta| limit of the destabilised window; <= 0: the engine default */
  gboolean has_chosen;    /* mark the chosen dose range below */
  double chosen_min_kg_m3, chosen_design_kg_m3, chosen_max_kg_m3;
} BwJarChartOptions;

/* Fills O with no target, the default threshold and no chosen dose. */
void bw_jar_chart_options_init (BwJarChartOptions *o);

/* Takes the chosen dose range of P's chemistry basis (when enabled) into O. */
void bw_jar_chart_options_from_project (BwJarChartOptions *o, const BwProject *p);

/* The chart of record R: the jars as markers, bw_jar_curve over the doses tested, the target
 * turbidity as a line, the optimum (least turbidity) as a note; with zeta potential (measured, or
 * from mobility at the record's temperature, Smoluchowski) on the right axis and the destabilised
 * window (bw_jar_analyse) as a shaded band; the chosen dose as a line labelled with its value and
 * its range as a band. Fails (naming the field) when the series does not analyse. */
BwChart *bw_chart_jartest (const BwJarTestRecord *r, const BwJarChartOptions *o,
                           BwUnitSystem system, GError **error);

/* The same as above, for the record of P with id JAR_TEST_ID (its chosen dose from P); an error
 * naming the id when P holds no such record. */
BwChart *bw_chart_jartest_of_project (const BwProject *p, const char *jar_test_id,
                                      double target_NTU, BwUnitSystem system, GError **error);

/* The record of P with id ID, or NULL. */
const BwJarTestRecord *bw_chart_jartest_find_record (const BwProject *p, const char *id);

G_END_DECLS
