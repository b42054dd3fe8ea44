/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-quantity.c: names, labels and kinds of the result quantities. */
#include "config.h"

#include "engine/bw-quantity.h"

#include <string.h>

static const BwQuantityInfo quantities[BW_N_QUANTITIES] = {
  [BW_Q_VOLUME] = { "volume", "volume", BW_KIND_VOLUME },
  [BW_Q_SURFACE_AREA] = { "surface_area", "surface area", BW_KIND_AREA },
  [BW_Q_FLOW] = { "flow", "flow per unit", BW_KIND_FLOW },
  [BW_Q_DETENTION] = { "detention", "detention time", BW_KIND_TIME },
  [BW_Q_G] = { "G", "velocity gradient G", BW_KIND_RATE },
  [BW_Q_GT] = { "Gt", "Gt (Camp number)", BW_KIND_NUMBER },
  [BW_Q_POWER] = { "power", "power to water", BW_KIND_POWER },
  [BW_Q_MOTOR_POWER] = { "motor_power", "motor power", BW_KIND_POWER },
  [BW_Q_IMPELLER_REYNOLDS] = { "impeller_reynolds", "impeller Reynolds number", BW_KIND_NUMBER },
  [BW_Q_TIP_SPEED] = { "tip_speed", "peripheral (tip) speed", BW_KIND_VELOCITY },
  [BW_Q_CHANNEL_VELOCITY] = { "flow_through_velocity", "flow-through velocity", BW_KIND_VELOCITY },
  [BW_Q_HEADLOSS] = { "headloss", "head loss", BW_KIND_HEAD },
  [BW_Q_OVERFLOW_RATE] = { "overflow_rate", "surface overflow rate", BW_KIND_SURFACE_LOADING },
  [BW_Q_WEIR_LOADING] = { "weir_loading", "weir loading", BW_KIND_WEIR_LOADING },
  [BW_Q_HORIZONTAL_VELOCITY] = { "horizontal_velocity", "mean horizontal velocity", BW_KIND_VELOCITY },
  [BW_Q_LENGTH_WIDTH_RATIO] = { "length_width_ratio", "length/width ratio", BW_KIND_NUMBER },
  [BW_Q_WIDTH_DEPTH_RATIO] = { "width_depth_ratio", "width/depth ratio", BW_KIND_NUMBER },
  [BW_Q_SIDE_WATER_DEPTH] = { "side_water_depth", "side water depth", BW_KIND_LENGTH },
  [BW_Q_REYNOLDS] = { "reynolds", "Reynolds number", BW_KIND_NUMBER },
  [BW_Q_FROUDE] = { "froude", "Froude number", BW_KIND_NUMBER },
  [BW_Q_SCOUR_VELOCITY] = { "scour_velocity", "scour velocity", BW_KIND_VELOCITY },
  [BW_Q_SCOUR_MARGIN] = { "scour_margin", "scour velocity / horizontal velocity", BW_KIND_NUMBER },
  [BW_Q_PROJECTED_LOADING] = { "projected_area_loading", "loading on projected area",
                               BW_KIND_SURFACE_LOADING },
  [BW_Q_CRITICAL_VELOCITY] = { "critical_velocity", "critical settling velocity", BW_KIND_VELOCITY },
  [BW_Q_CHANNEL_REYNOLDS] = { "channel_reynolds", "channel Reynolds number", BW_KIND_NUMBER },
  [BW_Q_REMOVAL] = { "removal", "predicted removal", BW_KIND_FRACTION },
  [BW_Q_COAGULANT_FEED] = { "coagulant_feed", "coagulant feed (maximum dose)", BW_KIND_MASS_FLOW },
  [BW_Q_RESIDUAL_ALKALINITY] = { "residual_alkalinity", "residual alkalinity as CaCO3 (maximum dose)",
                                 BW_KIND_CONCENTRATION },
  [BW_Q_SLUDGE] = { "sludge", "dry sludge (design dose)", BW_KIND_MASS_FLOW },
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
