/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-mixing.c: G, impeller power, the rapid-mix tank and hydraulic mixing. */
#include "config.h"

#include <string.h>

#include "bw-test.h"
#include "bw-test-water.h"
#include "engine/bw-error.h"
#include "engine/bw-mixing.h"
#include "engine/bw-water.h"

/*
 * Davis, M.L. (2010) "Water and Wastewater Engineering: Design Principles and Practice",
 * McGraw-Hill, Example 6-7 (seen): a round rapid-mix tank for 11.5e3 m3/d, t = 5 s, G = 600 1/s,
 * 5 degC (mu = 1.519e-3 Pa s from the book's Table A-1, rho = 1000 kg/m3 as the book uses),
 * V = 0.665 m3, water power 363.6 W (rounded to 360 W), motor power 360 / 0.8 = 450 W, radial
 * impeller 0.4 m with Np = 5.7, H/T = 2; the book solves Eq. 6-17 with the 450 W motor power and
 * gets n = 1.976 rev/s.
 */
#define DAVIS_MU 1.519e-3
#define DAVIS_RHO 1000.0
#define DAVIS_V 0.665

START_TEST (test_mixing_davis_6_7_power)
{
  BwWater w = bw_test_rounded_water (DAVIS_RHO, DAVIS_MU);
  g_autoptr (GError) error = NULL;
  double p = 0, g = 0;

  /* P = G^2 mu V = 363.6 W (seen; the book prints four digits, so 2e-4 relative). */
  ck_assert (bw_power_for_velocity_gradient (600.0, DAVIS_V, &w, &p, &error));
  bw_assert_rel (p, 363.6, 2e-4);
  /* And back: the 363.6 W in 0.665 m3 is G = 600 1/s (seen), to the book's digits. */
  ck_assert (bw_velocity_gradient (363.6, DAVIS_V, &w, &g, &error));
  bw_assert_rel (g, 600.0, 2e-4);
}
END_TEST

START_TEST (test_mixing_davis_6_7_speed)
{
  BwWater w = bw_test_rounded_water (DAVIS_RHO, DAVIS_MU);
  BwImpeller imp = { BW_IMPELLER_RUSHTON, 0.0, 0.4, 0.0 };
  g_autoptr (GError) error = NULL;
  double n_motor = 0, n_water = 0;

  ck_assert_double_eq (bw_impeller_library_power_number (BW_IMPELLER_RUSHTON), 5.7);
  /* The book's number, from the 450 W motor power: 1.976 rev/s (seen; +-0.0005 = its digits). */
  ck_assert (bw_impeller_speed_for_power (&imp, TRUE, &w, 450.0, &n_motor, &error));
  ck_assert_double_eq_tol (n_motor, 1.976, 0.0005);
  /* What the engine sizes from, the water power 363.6 W: 1.84 rev/s (docs/references.md, derived by
   * hand from the same Eq. 6-17; +-0.005 = its digits). */
  ck_assert (bw_impeller_speed_for_power (&imp, TRUE, &w, 363.6, &n_water, &error));
  ck_assert_double_eq_tol (n_water, 1.84, 0.005);
}
END_TEST

/* The Davis tank, rebuilt: V = 0.665 m3 at H = 2T gives T = (2V/pi)^(1/3) = 0.7509 m (derived
 * from the example's H/T = 2 and V, seen). The book's D/T = 0.53 for the 0.4 m impeller (seen)
 * checks the width. */
static BwRapidMixTank
davis_tank (void)
{
  BwRapidMixTank t = { 0 };
  const double width = cbrt (2.0 * DAVIS_V / G_PI);

  t.shape = BW_TANK_CYLINDRICAL;
  t.width_m = width;
  t.liquid_depth_m = 2.0 * width;
  t.baffled = TRUE;
  t.flow_m3_s = 11.5e3 / 86400.0;
  t.impeller.kind = BW_IMPELLER_RUSHTON;
  t.impeller.diameter_m = 0.4;
  t.drive_efficiency = 0.8; /* "about 80 %" (seen) */
  return t;
}

START_TEST (test_mixing_davis_6_7_tank)
{
  BwWater w = bw_test_rounded_water (DAVIS_RHO, DAVIS_MU);
  BwRapidMixTank t = davis_tank ();
  BwRapidMixResult r;
  g_autoptr (GError) error = NULL;
  double n = 0;

  ck_assert_double_eq_tol (0.4 / t.width_m, 0.53, 0.005); /* the book's D/T (seen) */

  ck_assert_msg (bw_rapid_mix_speed_for_gradient (&t, &w, 600.0, &n, &error), "%s",
                 error ? error->message : "");
  ck_assert_double_eq_tol (n, 1.84, 0.005); /* as above: sized from the water power */
  t.impeller.speed_rev_s = n;
  ck_assert (bw_rapid_mix_evaluate (&t, &w, &r, &error));
  bw_assert_rel (r.volume_m3, DAVIS_V, 1e-12);                 /* the geometry was built so */
  bw_assert_rel (r.G_per_s, 600.0, 1e-9);                      /* the inverse solve's target */
  ck_assert_double_eq_tol (r.detention_s, 5.0, 0.005);         /* t = 5 s (seen) */
  bw_assert_rel (r.water_power_W, 363.6, 2e-4);                /* seen */
  bw_assert_rel (r.motor_power_W, 363.6 / 0.8, 2e-4);          /* 454.5 W: 450 W in the book */
  bw_assert_rel (r.Gt, 600.0 * r.detention_s, 1e-12);
  ck_assert (r.impeller.reynolds > 1e5);                       /* 1.9e5: turbulent (derived) */
  ck_assert_uint_eq (r.warnings, 0);

  /* At the book's 1.976 rev/s the water takes the full 450 W (within the 4-digit rounding of
   * the speed) and G overshoots 600 by 11 %: the reason the engine sizes from water power. */
  t.impeller.speed_rev_s = 1.976;
  ck_assert (bw_rapid_mix_evaluate (&t, &w, &r, &error));
  bw_assert_rel (r.water_power_W, 450.0, 1e-3);
  ck_assert (r.G_per_s > 660.0 && r.G_per_s < 675.0);        /* 667.7 1/s (derived) */
}
END_TEST

START_TEST (test_mixing_impeller_power_formula)
{
  /* P = Np rho N^3 D^5, Re = rho N D^2 / mu, tip = pi N D (Davis 2010 Eq. 6-17; derived values
   * by hand for a 0.5 m pitched-blade turbine at 90 rpm in 10 degC water, Np 1.27 from memory). */
  BwWater w = bw_test_real_water (10.0);
  BwImpeller imp = { BW_IMPELLER_PITCHED_BLADE_45, 0.0, 0.5, 1.5 };
  BwImpellerResult r;
  g_autoptr (GError) error = NULL;

  ck_assert (bw_impeller_evaluate (&imp, TRUE, &w, &r, &error));
  bw_assert_rel (r.power_number, 1.27, 1e-15);
  bw_assert_rel (r.power_W, 1.27 * w.density_kg_m3 * 3.375 * 0.03125, 1e-12);
  bw_assert_rel (r.reynolds, w.density_kg_m3 * 1.5 * 0.25 / w.dynamic_viscosity_Pa_s, 1e-12);
  bw_assert_rel (r.tip_speed_m_s, G_PI * 0.75, 1e-15);
  /* 999.70 kg/m3 and 1.3059 mPa s at 10 degC (docs/references.md, IAPWS): P = 166.6 W, Re = 2.87e5. */
  bw_assert_rel (r.power_W, 1.27 * 999.7025 * 3.375 * 0.03125, 1e-6);
  bw_assert_rel (r.reynolds, 999.7025 * 0.375 / 1.30590e-3, 1e-4);

  /* A user power number replaces the library's. */
  imp.power_number = 2.0;
  ck_assert (bw_impeller_evaluate (&imp, TRUE, &w, &r, &error));
  bw_assert_rel (r.power_number, 2.0, 1e-15);
  bw_assert_rel (r.power_W, 2.0 * w.density_kg_m3 * 3.375 * 0.03125, 1e-12);
}
END_TEST

START_TEST (test_mixing_impeller_library)
{
  BwImpellerKind k;

  /* Library values (bw-mixing.c names the sources): 5.7 seen, 1.27 memory, 0.30 seen. */
  ck_assert_double_eq (bw_impeller_library_power_number (BW_IMPELLER_RUSHTON), 5.7);
  ck_assert_double_eq (bw_impeller_library_power_number (BW_IMPELLER_PITCHED_BLADE_45), 1.27);
  ck_assert_double_eq (bw_impeller_library_power_number (BW_IMPELLER_HYDROFOIL), 0.30);
  ck_assert_double_eq (bw_impeller_library_power_number ((BwImpellerKind) 42), 0.0);
  for (guint i = 0; i < BW_N_IMPELLER_KINDS; i++)
    {
      ck_assert (bw_impeller_kind_from_name (bw_impeller_kind_name ((BwImpellerKind) i), &k));
      ck_assert_int_eq (k, (int) i);
    }
  ck_assert_str_eq (bw_impeller_kind_name (BW_IMPELLER_PITCHED_BLADE_45), "pitched-blade-45");
  ck_assert (!bw_impeller_kind_from_name ("propeller", &k));
  ck_assert (!bw_impeller_kind_from_name (NULL, &k));
}
END_TEST

START_TEST (test_mixing_unbaffled_needs_power_number)
{
  BwWater w = bw_test_real_water (20.0);
  BwImpeller imp = { BW_IMPELLER_RUSHTON, 0.0, 0.3, 2.0 };
  BwImpellerResult r;
  g_autoptr (GError) error = NULL;

  ck_assert (!bw_impeller_evaluate (&imp, FALSE, &w, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "power number");
  ck_assert (g_str_has_prefix (error->message, "power number:"));
  g_clear_error (&error);
  /* With a measured power number the unbaffled tank is fine. */
  imp.power_number = 1.0;
  ck_assert (bw_impeller_evaluate (&imp, FALSE, &w, &r, &error));
  bw_assert_rel (r.power_number, 1.0, 1e-15);
}
END_TEST

START_TEST (test_mixing_low_reynolds_warning)
{
  BwWater w = bw_test_real_water (20.0);
  /* A 5 cm impeller at 60 rpm: Re = 998 x 1 x 0.0025 / 1.0016e-3 = 2.5e3 < 1e4 (derived). */
  BwImpeller imp = { BW_IMPELLER_HYDROFOIL, 0.0, 0.05, 1.0 };
  BwImpellerResult r;
  g_autoptr (GError) error = NULL;

  ck_assert (bw_impeller_evaluate (&imp, TRUE, &w, &r, &error));
  ck_assert (r.reynolds < BW_IMPELLER_TURBULENT_RE);
  ck_assert (r.warnings & BW_MIX_WARNING_LOW_REYNOLDS);
  /* The same impeller at 600 rpm: Re = 2.5e4, no warning. */
  imp.speed_rev_s = 10.0;
  ck_assert (bw_impeller_evaluate (&imp, TRUE, &w, &r, &error));
  ck_assert (r.reynolds > BW_IMPELLER_TURBULENT_RE);
  ck_assert_uint_eq (r.warnings, 0);
}
END_TEST

START_TEST (test_mixing_hydraulic)
{
  /* Derived: h = 0.5 m, Q = 0.1 m3/s, V = 2 m3 of 20 degC water (998.2072 kg/m3, 1.00160 mPa s,
   * docs/references.md): P = rho g Q h = 489.453 W, G = sqrt (P / (mu V)) = 494.303 1/s, t = 20 s,
   * Gt = 9886.07 (hand evaluation of Camp & Stein 1943). */
  BwWater w = bw_test_rounded_water (998.2072, 1.0016e-3);
  BwHydraulicResult r;
  g_autoptr (GError) error = NULL;
  double h = 0;

  ck_assert (bw_hydraulic_mixer_evaluate (0.5, 0.1, 2.0, &w, &r, &error));
  bw_assert_rel (r.power_W, 489.453432, 1e-8);
  bw_assert_rel (r.G_per_s, 494.303327, 1e-8);
  bw_assert_rel (r.detention_s, 20.0, 1e-15);
  bw_assert_rel (r.Gt, 9886.06653, 1e-8);
  /* The other form of the same law, G = sqrt (g h / (nu t)). */
  bw_assert_rel (r.G_per_s, sqrt (BW_GRAVITY_M_S2 * 0.5 / (w.kinematic_viscosity_m2_s * 20.0)),
                 1e-12);

  /* Inverse: the head loss for a target G reproduces it. */
  ck_assert (bw_hydraulic_headloss_for_gradient (750.0, 0.1, 2.0, &w, &h, &error));
  ck_assert (bw_hydraulic_mixer_evaluate (h, 0.1, 2.0, &w, &r, &error));
  bw_assert_rel (r.G_per_s, 750.0, 1e-9);
}
END_TEST

/* --- properties --- */

START_TEST (test_mixing_more_power_higher_g)
{
  BwWater w = bw_test_real_water (15.0);
  double prev = 0.0;

  for (double p = 1.0; p < 1e6; p *= 1.7)
    {
      g_autoptr (GError) error = NULL;
      double g = 0;
      ck_assert (bw_velocity_gradient (p, 10.0, &w, &g, &error));
      ck_assert_msg (g > prev, "G(%g W) = %g not above %g", p, g, prev);
      prev = g;
    }
}
END_TEST

START_TEST (test_mixing_faster_impeller_higher_g)
{
  BwWater w = bw_test_real_water (15.0);
  BwRapidMixTank t = davis_tank ();
  double prev = 0.0;

  for (double n = 0.1; n < 20.0; n *= 1.3)
    {
      g_autoptr (GError) error = NULL;
      BwRapidMixResult r;
      t.impeller.speed_rev_s = n;
      ck_assert (bw_rapid_mix_evaluate (&t, &w, &r, &error));
      ck_assert (r.G_per_s > prev);
      prev = r.G_per_s;
    }
}
END_TEST

START_TEST (test_mixing_colder_water_lower_g)
{
  /* Same power, same volume: viscosity rises as the water cools, so G falls. */
  double prev = G_MAXDOUBLE;

  for (double c = 40.0; c >= 0.0; c -= 2.5)
    {
      BwWater w = bw_test_real_water (c);
      g_autoptr (GError) error = NULL;
      double g = 0;
      ck_assert (bw_velocity_gradient (500.0, 5.0, &w, &g, &error));
      ck_assert_msg (g < prev, "G at %g degC = %g not below %g", c, g, prev);
      prev = g;
    }
}
END_TEST

START_TEST (test_mixing_inverse_solves)
{
  /* Every inverse solve reproduces its target to 1e-9 relative, across kinds, temperatures and
   * targets. */
  for (guint kind = 0; kind < BW_N_IMPELLER_KINDS; kind++)
    for (double c = 0.0; c <= 40.0; c += 10.0)
      for (double target = 300.0; target <= 1500.0; target += 300.0)
        {
          BwWater w = bw_test_real_water (c);
          BwRapidMixTank t = davis_tank ();
          BwRapidMixResult r;
          g_autoptr (GError) error = NULL;
          double n = 0, p = 0;

          t.impeller.kind = (BwImpellerKind) kind;
          ck_assert (bw_rapid_mix_speed_for_gradient (&t, &w, target, &n, &error));
          t.impeller.speed_rev_s = n;
          ck_assert (bw_rapid_mix_evaluate (&t, &w, &r, &error));
          bw_assert_rel (r.G_per_s, target, 1e-9);

          ck_assert (bw_power_for_velocity_gradient (target, 3.0, &w, &p, &error));
          ck_assert (bw_impeller_speed_for_power (&t.impeller, TRUE, &w, p, &n, &error));
          t.impeller.speed_rev_s = n;
          {
            BwImpellerResult ir;
            ck_assert (bw_impeller_evaluate (&t.impeller, TRUE, &w, &ir, &error));
            bw_assert_rel (ir.power_W, p, 1e-9);
          }
        }
}
END_TEST

/* --- errors --- */

START_TEST (test_mixing_geometry_errors)
{
  BwWater w = bw_test_real_water (20.0);
  BwRapidMixTank t = davis_tank ();
  BwRapidMixResult r;
  g_autoptr (GError) error = NULL;

  t.impeller.speed_rev_s = 2.0;
  t.impeller.diameter_m = 0.8; /* the tank is 0.75 m across */
  ck_assert (!bw_rapid_mix_evaluate (&t, &w, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY, "impeller diameter");
  ck_assert (g_str_has_prefix (error->message, "impeller diameter:"));
  g_clear_error (&error);

  t.shape = BW_TANK_SQUARE;
  t.width_m = 0.8; /* exactly the impeller: no clearance at all */
  ck_assert (!bw_rapid_mix_evaluate (&t, &w, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY, "impeller diameter");
  g_clear_error (&error);

  t.width_m = 1.0; /* fits now */
  ck_assert (bw_rapid_mix_evaluate (&t, &w, &r, &error));
  bw_assert_rel (r.volume_m3, 1.0 * t.liquid_depth_m, 1e-12); /* square: side^2 x depth */

  ck_assert (!bw_rapid_mix_speed_for_gradient (&t, &w, -5.0, &r.G_per_s, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "velocity gradient");
}
END_TEST

typedef struct
{
  const char *what;
  void (*spoil) (BwRapidMixTank *t);
  int code;
  const char *field;
} TankCase;

static void spoil_width (BwRapidMixTank *t) { t->width_m = 0.0; }
static void spoil_depth (BwRapidMixTank *t) { t->liquid_depth_m = -1.0; }
static void spoil_flow (BwRapidMixTank *t) { t->flow_m3_s = NAN; }
static void spoil_diameter (BwRapidMixTank *t) { t->impeller.diameter_m = -0.4; }
static void spoil_speed (BwRapidMixTank *t) { t->impeller.speed_rev_s = 0.0; }
static void spoil_speed_inf (BwRapidMixTank *t) { t->impeller.speed_rev_s = INFINITY; }
static void spoil_speed_huge (BwRapidMixTank *t) { t->impeller.speed_rev_s = 1e120; }
static void spoil_np (BwRapidMixTank *t) { t->impeller.power_number = -1.0; }
static void spoil_kind (BwRapidMixTank *t) { t->impeller.kind = (BwImpellerKind) 17; }
static void spoil_shape (BwRapidMixTank *t) { t->shape = (BwTankShape) 9; }
static void spoil_eff_high (BwRapidMixTank *t) { t->drive_efficiency = 1.2; }
static void spoil_eff_zero (BwRapidMixTank *t) { t->drive_efficiency = 0.0; }
static void spoil_unbaffled (BwRapidMixTank *t) { t->baffled = FALSE; }

static const TankCase tank_cases[] = {
  { "zero width", spoil_width, BW_ENGINE_ERROR_OUT_OF_RANGE, "tank width:" },
  { "negative depth", spoil_depth, BW_ENGINE_ERROR_OUT_OF_RANGE, "liquid depth:" },
  { "NaN flow", spoil_flow, BW_ENGINE_ERROR_NOT_FINITE, "flow:" },
  { "negative impeller", spoil_diameter, BW_ENGINE_ERROR_OUT_OF_RANGE, "impeller diameter:" },
  { "zero speed", spoil_speed, BW_ENGINE_ERROR_OUT_OF_RANGE, "rotational speed:" },
  { "infinite speed", spoil_speed_inf, BW_ENGINE_ERROR_NOT_FINITE, "rotational speed:" },
  { "overflowing speed", spoil_speed_huge, BW_ENGINE_ERROR_OUT_OF_RANGE, "rotational speed:" },
  { "negative Np", spoil_np, BW_ENGINE_ERROR_OUT_OF_RANGE, "power number:" },
  { "bad kind", spoil_kind, BW_ENGINE_ERROR_INVALID, "impeller kind:" },
  { "bad shape", spoil_shape, BW_ENGINE_ERROR_INVALID, "tank shape:" },
  { "efficiency 1.2", spoil_eff_high, BW_ENGINE_ERROR_OUT_OF_RANGE, "drive efficiency:" },
  { "efficiency 0", spoil_eff_zero, BW_ENGINE_ERROR_OUT_OF_RANGE, "drive efficiency:" },
  { "unbaffled, library Np", spoil_unbaffled, BW_ENGINE_ERROR_OUT_OF_RANGE, "power number:" },
};

START_TEST (test_mixing_tank_input_errors)
{
  const TankCase *c = &tank_cases[_i];
  BwWater w = bw_test_real_water (20.0);
  BwRapidMixTank t = davis_tank ();
  BwRapidMixResult r;
  g_autoptr (GError) error = NULL;

  t.impeller.speed_rev_s = 2.0;
  c->spoil (&t);
  ck_assert_msg (!bw_rapid_mix_evaluate (&t, &w, &r, &error), "%s accepted", c->what);
  ck_assert_msg (g_error_matches (error, BW_ENGINE_ERROR, c->code), "%s: code %d, %s", c->what,
                 error->code, error->message);
  ck_assert_msg (g_str_has_prefix (error->message, c->field), "%s: '%s'", c->what,
                 error->message);
}
END_TEST

START_TEST (test_mixing_simple_errors)
{
  BwWater w = bw_test_real_water (20.0);
  BwWater bad = w;
  BwHydraulicResult hr;
  g_autoptr (GError) error = NULL;
  double g = 0;

  ck_assert (!bw_velocity_gradient (0.0, 1.0, &w, &g, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "power:");
  g_clear_error (&error);
  ck_assert (!bw_velocity_gradient (10.0, -1.0, &w, &g, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "volume:");
  g_clear_error (&error);
  ck_assert (!bw_velocity_gradient (NAN, 1.0, &w, &g, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE, "power:");
  g_clear_error (&error);
  ck_assert (!bw_velocity_gradient (1e308, 1e-308, &w, &g, &error)); /* would be inf */
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "power:");
  g_clear_error (&error);
  ck_assert (g == 0); /* a failed call leaves the output alone */

  bad.dynamic_viscosity_Pa_s = 0.0;
  ck_assert (!bw_velocity_gradient (10.0, 1.0, &bad, &g, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "water viscosity:");
  g_clear_error (&error);

  ck_assert (!bw_hydraulic_mixer_evaluate (0.0, 0.1, 1.0, &w, &hr, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "head loss:");
  g_clear_error (&error);
  ck_assert (!bw_hydraulic_mixer_evaluate (0.3, -0.1, 1.0, &w, &hr, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "flow:");
  g_clear_error (&error);
  ck_assert (!bw_hydraulic_mixer_evaluate (0.3, 0.1, INFINITY, &w, &hr, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE, "volume:");
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("mixing");
  TCase *tc;

  tc = tcase_create ("worked-examples");
  tcase_add_test (tc, test_mixing_davis_6_7_power);
  tcase_add_test (tc, test_mixing_davis_6_7_speed);
  tcase_add_test (tc, test_mixing_davis_6_7_tank);
  tcase_add_test (tc, test_mixing_impeller_power_formula);
  tcase_add_test (tc, test_mixing_hydraulic);
  suite_add_tcase (s, tc);

  tc = tcase_create ("impellers");
  tcase_add_test (tc, test_mixing_impeller_library);
  tcase_add_test (tc, test_mixing_unbaffled_needs_power_number);
  tcase_add_test (tc, test_mixing_low_reynolds_warning);
  suite_add_tcase (s, tc);

  tc = tcase_create ("properties");
  tcase_add_test (tc, test_mixing_more_power_higher_g);
  tcase_add_test (tc, test_mixing_faster_impeller_higher_g);
  tcase_add_test (tc, test_mixing_colder_water_lower_g);
  tcase_add_test (tc, test_mixing_inverse_solves);
  suite_add_tcase (s, tc);

  tc = tcase_create ("errors");
  tcase_add_test (tc, test_mixing_geometry_errors);
  tcase_add_loop_test (tc, test_mixing_tank_input_errors, 0, G_N_ELEMENTS (tank_cases));
  tcase_add_test (tc, test_mixing_simple_errors);
  suite_add_tcase (s, tc);

  return s;
}
