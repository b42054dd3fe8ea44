/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-quantity.c: names, labels and kinds of the result quantities. */
#include "config.h"

#include "engine/bw-quantity.h"

#include <string.h>

/* Labels are marked for the template only (the engine stays locale-free); the workbench and
 * the report translate them where they show them. */
#define N_(s) (s)

static const BwQuantityInfo quantities[BW_N_QUANTITIES] = {
  [BW_Q_VOLUME] = { "volume", N_("volume"), BW_KIND_VOLUME },
  [BW_Q_SURFACE_AREA] = { "surface_area", N_("surface area"), BW_KIND_AREA },
  [BW_Q_FLOW] = { "flow", N_("flow per unit"), BW_KIND_FLOW },
  [BW_Q_DETENTION] = { "detention", N_("detention time"), BW_KIND_TIME },
  [BW_Q_G] = { "G", N_("velocity gradient G"), BW_KIND_RATE },
  [BW_Q_GT] = { "Gt", N_("Gt (Camp number)"), BW_KIND_NUMBER },
  [BW_Q_POWER] = { "power", N_("power to water"), BW_KIND_POWER },
  [BW_Q_MOTOR_POWER] = { "motor_power", N_("motor power"), BW_KIND_POWER },
  [BW_Q_IMPELLER_REYNOLDS] = { "impeller_reynolds", N_("impeller Reynolds number"),
                               BW_KIND_NUMBER },
  [BW_Q_TIP_SPEED] = { "tip_speed", N_("peripheral (tip) speed"), BW_KIND_VELOCITY },
  [BW_Q_CHANNEL_VELOCITY] = { "flow_through_velocity", N_("flow-through velocity"),
                              BW_KIND_VELOCITY },
  [BW_Q_HEADLOSS] = { "headloss", N_("head loss"), BW_KIND_HEAD },
  [BW_Q_OVERFLOW_RATE] = { "overflow_rate", N_("surface overflow rate"), BW_KIND_SURFACE_LOADING },
  [BW_Q_WEIR_LOADING] = { "weir_loading", N_("weir loading"), BW_KIND_WEIR_LOADING },
  [BW_Q_HORIZONTAL_VELOCITY] = { "horizontal_velocity", N_("mean horizontal velocity"),
                                 BW_KIND_VELOCITY },
  [BW_Q_LENGTH_WIDTH_RATIO] = { "length_width_ratio", N_("length/width ratio"), BW_KIND_NUMBER },
  [BW_Q_WIDTH_DEPTH_RATIO] = { "width_depth_ratio", N_("width/depth ratio"), BW_KIND_NUMBER },
  [BW_Q_SIDE_WATER_DEPTH] = { "side_water_depth", N_("side water depth"), BW_KIND_LENGTH },
  [BW_Q_REYNOLDS] = { "reynolds", N_("Reynolds number"), BW_KIND_NUMBER },
  [BW_Q_FROUDE] = { "froude", N_("Froude number"), BW_KIND_NUMBER },
  [BW_Q_SCOUR_VELOCITY] = { "scour_velocity", N_("scour velocity"), BW_KIND_VELOCITY },
  [BW_Q_SCOUR_MARGIN] = { "scour_margin", N_("scour velocity / horizontal velocity"),
                          BW_KIND_NUMBER },
  [BW_Q_PROJECTED_LOADING] = { "projected_area_loading", N_("loading on projected area"),
                               BW_KIND_SURFACE_LOADING },
  [BW_Q_CRITICAL_VELOCITY] = { "critical_velocity", N_("critical settling velocity"),
                               BW_KIND_VELOCITY },
  [BW_Q_CHANNEL_REYNOLDS] = { "channel_reynolds", N_("channel Reynolds number"), BW_KIND_NUMBER },
  [BW_Q_REMOVAL] = { "removal", N_("predicted removal"), BW_KIND_FRACTION },
  [BW_Q_COAGULANT_FEED] = { "coagulant_feed", N_("coagulant feed (maximum dose)"),
                            BW_KIND_MASS_FLOW },
  [BW_Q_RESIDUAL_ALKALINITY] = { "residual_alkalinity",
                                 N_("residual alkalinity as CaCO3 (maximum dose)"),
                                 BW_KIND_CONCENTRATION },
  [BW_Q_SLUDGE] = { "sludge", N_("dry sludge (design dose)"), BW_KIND_MASS_FLOW },
  [BW_Q_COAGULANT_SOLUTION] = { "coagulant_solution_feed",
                                N_("coagulant stock solution feed (maximum dose)"), BW_KIND_FLOW },
  [BW_Q_SLUDGE_VOLUME] = { "sludge_volume", N_("sludge volume (design dose)"), BW_KIND_FLOW },
};

G_STATIC_ASSERT (BW_N_QUANTITIES <= 64); /* BwQuantitySet.present is a 64-bit mask */

const BwQuantityInfo *
bw_quantity_info (BwQuantity q)
{
  g_return_val_if_fail (q < BW_N_QUANTITIES, NULL);
  return &quantities[q];
}

const char *
bw_quantity_name (BwQuantity q)
{
  g_return_val_if_fail (q < BW_N_QUANTITIES, "unknown");
  return quantities[q].name;
}

gboolean
bw_quantity_from_name (const char *name, BwQuantity *out)
{
  g_return_val_if_fail (out != NULL, FALSE);
  if (name == NULL)
    return FALSE;
  for (int i = 0; i < BW_N_QUANTITIES; i++)
    if (strcmp (quantities[i].name, name) == 0)
      {
        *out = (BwQuantity) i;
        return TRUE;
      }
  return FALSE;
}
