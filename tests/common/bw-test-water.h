/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-test-water.h: water states for the model tests. */
#pragma once

#include "bw-test.h"
#include "engine/bw-water.h"

/* Rounded textbook water, for checks against a book's own arithmetic. The temperature and
 * permittivity are placeholders the mixing models do not read. */
static inline BwWater
bw_test_rounded_water (double density_kg_m3, double viscosity_Pa_s)
{
  BwWater w = { 0 };

  w.temperature_K = 293.15;
  w.density_kg_m3 = density_kg_m3;
  w.dynamic_viscosity_Pa_s = viscosity_Pa_s;
  w.kinematic_viscosity_m2_s = viscosity_Pa_s / density_kg_m3;
  w.relative_permittivity = 80.0;
  return w;
}

/* The engine's own water at CELSIUS. */
static inline BwWater
bw_test_real_water (double celsius)
{
  BwWater w;
  g_autoptr (GError) error = NULL;

  ck_assert_msg (bw_water_properties (celsius + 273.15, &w, &error), "%s",
                 error ? error->message : "");
  return w;
}
