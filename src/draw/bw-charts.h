/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-charts.h: the project's charts, filled from the engine's results (and, for curves, from
 * engine functions evaluated over a grid). Each returns a new BwChart for bw_chart_paint. */
#pragma once

#include <glib.h>

#include "draw/bw-chart.h"
#include "engine/bw-evaluate.h"
#include "engine/bw-project.h"
#include "engine/bw-units.h"

G_BEGIN_DECLS

/* The load case a chart shows as "design": maximum day when the project has it, else its largest
 * flow; at temperature TEMP, all units in service. -1 when R has no such case. */
int bw_charts_design_case (const BwResults *r, BwTempKind temp);

/* (a) The taper of flocculator FLOC_ID: G of each stage at the coldest and warmest water (lines,
 * left axis) and each stage's Gt (bars, right axis), at the design flow. With CHECKS (may be
 * NULL) the limits of the stage-G criteria are drawn as reference lines. */
BwChart *bw_chart_floc_taper (const BwProject *p, const BwResults *r, GArray *checks,
                              const char *floc_id, BwUnitSystem system, GError **error);

/* (b) Settling velocity against particle diameter, log-log, at the coldest and warmest water
 * (bw_settling_velocity over 1 µm .. 5 mm), with the Stokes / transitional / Newton regimes as
 * bands (from the engine's regime at the coldest water) and the overflow rates of basin
 * BASIN_ID across the load cases as a band with the largest as a line. SPECIFIC_GRAVITY <= 0
 * takes the basin's scour-particle specific gravity when it has one, else 2.65. */
BwChart *bw_chart_settling_curves (const BwProject *p, const BwResults *r, const char *basin_id,
                                   double specific_gravity, BwUnitSystem system, GError **error);

/* (c) Fraction removed of the basin's design particle against surface overflow rate: Camp's
 * ideal basin and Hazen's basins of n = 1, 3 and 5 (bw-removal), with the basin's load cases as
 * design points (the engine's overflow rate and removal). */
BwChart *bw_chart_removal_curves (const BwProject *p, const BwResults *r, const char *basin_id,
                                  BwUnitSystem system, GError **error);

/* (d) Power to the water (left) and G (right) against impeller speed for rapid-mix tank or
 * turbine stage UNIT_ID (bw_impeller_evaluate and bw_velocity_gradient over 0.25 - 2 times the
 * design speed), at the coldest and warmest water, with the design point. With CHECKS, the G
 * limits that apply to it as reference lines. */
BwChart *bw_chart_impeller_power (const BwProject *p, const BwResults *r, GArray *checks,
                                  const char *unit_id, BwUnitSystem system, GError **error);

/* (e) Every check of CHECKS (bw_check_results over R) graded in each load case: rows are the
 * criteria, grouped by element; columns the load cases. TRAIN_ID (may be NULL: all) keeps the
 * elements of one train. */
BwChart *bw_chart_check_matrix (const BwProject *p, const BwResults *r, GArray *checks,
                                const char *train_id, GError **error);

/* (f) The iso-removal diagram of settling basin BASIN_ID (a rectangular basin or circular
 * clarifier) from the settling-column test that applies to it (bw_project_column_test_for):
 * column time across, depth down (a categorical y axis: category i is the depth in its label,
 * the water surface at the top), one curve per removal percentage (10 % steps) through the times
 * at which each port reaches it (linear in time between readings, from none removed at t = 0),
 * the port readings as marks, the basin's overflow-rate line depth = v0 t and its design point
 * (H, H / v0) with the Type II removal bw_type2_removal_at_overflow gives at the engine's
 * overflow rate of the design case (bw_charts_design_case, coldest). H is the basin's side water
 * depth, or the column's deepest port when the basin is deeper. Fails, naming the unit, when no
 * column test applies to it. The series, in order: the iso curves (one per percentage, the first
 * labelled), the readings, the overflow-rate line, the design point. */
BwChart *bw_chart_iso_removal (const BwProject *p, const BwResults *r, const char *basin_id,
                               BwUnitSystem system, GError **error);

G_END_DECLS
