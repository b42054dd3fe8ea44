/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-floc.c: paddle wheels, turbine and baffled-channel stages, tapered trains and solves. */
#include "config.h"

#include <string.h>

#include "bw-test.h"
#include "bw-test-water.h"
#include "engine/bw-error.h"
#include "engine/bw-floc.h"
#include "engine/bw-water.h"

/* --- drag coefficient --- */

START_TEST (test_floc_drag_table_points)
{
  /* Davis (2010) Table 6-7 (seen): 1.20 below L/W = 5, 1.50 at L/W = 20, 1.90 beyond. */
  ck_assert_double_eq_tol (bw_paddle_drag_coefficient (2.0, 1.0), 1.20, 1e-15);
  ck_assert_double_eq_tol (bw_paddle_drag_coefficient (1.0, 1.0), 1.20, 1e-15);
  ck_assert_double_eq_tol (bw_paddle_drag_coefficient (5.0, 1.0), 1.20, 1e-15);
  ck_assert_double_eq_tol (bw_paddle_drag_coefficient (20.0, 1.0), 1.50, 1e-15);
  ck_assert_double_eq_tol (bw_paddle_drag_coefficient (1e9, 1.0), 1.90, 1e-8);
  /* Our joins between the points (derived from the rule in bw-floc.c): midway in L/W between 5
   * and 20 is midway in Cd; at L/W = 40 the 1/a blend is halfway from 1.50 to 1.90. */
  ck_assert_double_eq_tol (bw_paddle_drag_coefficient (12.5, 1.0), 1.35, 1e-14);
  ck_assert_double_eq_tol (bw_paddle_drag_coefficient (40.0, 1.0), 1.70, 1e-14);
  /* Length and width are interchangeable: a flat plate broadside on. */
  ck_assert_double_eq_tol (bw_paddle_drag_coefficient (0.1, 1.5),
                           bw_paddle_drag_coefficient (1.5, 0.1), 1e-15);
  /* Not a blade: 0 rather than NaN. */
  ck_assert_double_eq (bw_paddle_drag_coefficient (0.0, 1.0), 0.0);
  ck_assert_double_eq (bw_paddle_drag_coefficient (NAN, 1.0), 0.0);
}
END_TEST

START_TEST (test_floc_drag_continuous_and_rising)
{
  double prev = 0.0;

  for (double a = 1.0; a < 1e4; a *= 1.01)
    {
      double cd = bw_paddle_drag_coefficient (a, 1.0);
      ck_assert_msg (cd >= prev, "Cd falls at L/W = %g", a);
      ck_assert (cd >= 1.20 && cd < 1.90);
      prev = cd;
    }
  /* No jump at the table's break points. */
  ck_assert_double_eq_tol (bw_paddle_drag_coefficient (5.0 - 1e-9, 1.0),
                           bw_paddle_drag_coefficient (5.0 + 1e-9, 1.0), 1e-9);
  ck_assert_double_eq_tol (bw_paddle_drag_coefficient (20.0 - 1e-9, 1.0),
                           bw_paddle_drag_coefficient (20.0 + 1e-9, 1.0), 1e-9);
}
END_TEST

/* --- paddles --- */

/* A reel after Davis (2010) Table 6-7 (seen): 3 m wheels, three boards per arm at the 1/3 points,
 * boards 2.5 m x 0.15 m; two wheels of four arms on a horizontal shaft at 2 rpm in a compartment
 * 4 m long, 6 m wide and 4 m deep. */
static BwFlocStage
paddle_stage (void)
{
  BwFlocStage s;

  memset (&s, 0, sizeof s);
  s.kind = BW_FLOC_STAGE_PADDLE;
  s.compartment = (BwCompartment) { 4.0, 6.0, 4.0 };
  bw_paddle_init (&s.paddle);
  s.paddle.n_wheels = 2;
  s.paddle.arms_per_wheel = 4;
  s.paddle.n_rings = 3;
  s.paddle.ring_radius_m[0] = 0.5;
  s.paddle.ring_radius_m[1] = 1.0;
  s.paddle.ring_radius_m[2] = 1.5;
  s.paddle.blade_length_m = 2.5;
  s.paddle.blade_width_m = 0.15;
  s.paddle.speed_rev_s = 2.0 / 60.0;
  return s;
}

START_TEST (test_floc_paddle_hand_example)
{
  /* Derived by hand from Davis (2010) Eq. 6-20 with rho = 1000 kg/m3, mu = 1.139e-3 Pa s
   * (rounded 15 degC water): L/W = 16.67 gives Cd = 1.4333 by our join; 8 boards per ring,
   * v_r = 0.75 x 2 pi r N = 0.07854, 0.15708, 0.23562 m/s; P = 8 x Cd x 0.375 x 1000 / 2 x
   * sum v_r^3 = 37.4982 W; V = 96 m3, G = sqrt (P / (mu V)) = 18.5186 1/s; Q = 0.2 m3/s gives
   * t = 480 s. Tip speed 2 pi 1.5 N = 0.31416 m/s, relative 0.23562 m/s. */
  BwWater w = bw_test_rounded_water (1000.0, 1.139e-3);
  BwFlocStage s = paddle_stage ();
  BwFlocStageResult r;
  g_autoptr (GError) error = NULL;

  ck_assert_msg (bw_floc_stage_evaluate (&s, 0.2, &w, &r, &error), "%s",
                 error ? error->message : "");
  bw_assert_rel (r.paddle.drag_coefficient, 1.433333333, 1e-9);
  ck_assert_uint_eq (r.paddle.n_blades, 24);
  bw_assert_rel (r.paddle.blade_area_m2, 24 * 0.375, 1e-15);
  bw_assert_rel (r.paddle.power_W, 37.4982159, 1e-8);
  bw_assert_rel (r.power_W, 37.4982159, 1e-8);
  bw_assert_rel (r.volume_m3, 96.0, 1e-15);
  bw_assert_rel (r.G_per_s, 18.5185860, 1e-8);
  bw_assert_rel (r.detention_s, 480.0, 1e-15);
  bw_assert_rel (r.Gt, 18.5185860 * 480.0, 1e-8);
  bw_assert_rel (r.paddle.tip_speed_m_s, 0.314159265, 1e-8);
  bw_assert_rel (r.paddle.relative_velocity_m_s, 0.235619449, 1e-8);
  bw_assert_rel (r.paddle.swept_radius_m, 1.575, 1e-15);
  bw_assert_rel (r.paddle.edge_speed_m_s, 2 * G_PI * 1.575 / 30.0, 1e-12);

  /* A given drag coefficient replaces the table (Hendricks 2011 uses 1.8). */
  s.paddle.drag_coefficient = 1.8;
  ck_assert (bw_floc_stage_evaluate (&s, 0.2, &w, &r, &error));
  bw_assert_rel (r.paddle.power_W, 37.4982159 * 1.8 / 1.433333333, 1e-8);
}
END_TEST

START_TEST (test_floc_paddle_cube_law)
{
  /* P is proportional to N^3 and to k^3 (Eq. 6-20): exact ratios, round-off only. */
  BwWater w = bw_test_real_water (10.0);
  BwFlocStage s = paddle_stage ();
  BwPaddleResult a, b;
  g_autoptr (GError) error = NULL;

  ck_assert (bw_paddle_evaluate (&s.paddle, &w, &a, &error));
  s.paddle.speed_rev_s *= 2.0;
  ck_assert (bw_paddle_evaluate (&s.paddle, &w, &b, &error));
  bw_assert_rel (b.power_W, 8.0 * a.power_W, 1e-12);
  s.paddle.relative_velocity_factor = 0.375;
  ck_assert (bw_paddle_evaluate (&s.paddle, &w, &b, &error));
  bw_assert_rel (b.power_W, a.power_W, 1e-12);
}
END_TEST

START_TEST (test_floc_faster_paddle_higher_g)
{
  BwWater w = bw_test_real_water (5.0);
  BwFlocStage s = paddle_stage ();
  double prev = 0.0;

  for (double rpm = 0.5; rpm < 12.0; rpm += 0.25)
    {
      BwFlocStageResult r;
      g_autoptr (GError) error = NULL;
      s.paddle.speed_rev_s = rpm / 60.0;
      ck_assert (bw_floc_stage_evaluate (&s, 0.2, &w, &r, &error));
      ck_assert_msg (r.G_per_s > prev, "G at %g rpm not above %g", rpm, prev);
      prev = r.G_per_s;
    }
}
END_TEST

START_TEST (test_floc_colder_water_lower_g_same_power)
{
  /* A paddle's power barely moves with temperature (only rho enters P); G = sqrt (P/(mu V))
   * falls in cold water because mu rises more than rho. */
  BwFlocStage s = paddle_stage ();
  double prev = G_MAXDOUBLE;

  for (double c = 40.0; c >= 0.0; c -= 5.0)
    {
      BwWater w = bw_test_real_water (c);
      BwFlocStageResult r;
      g_autoptr (GError) error = NULL;
      ck_assert (bw_floc_stage_evaluate (&s, 0.2, &w, &r, &error));
      ck_assert (r.G_per_s < prev);
      prev = r.G_per_s;
    }
}
END_TEST

/* --- geometry --- */

typedef struct
{
  const char *what;
  void (*spoil) (BwFlocStage *s);
  int code;
  const char *field;
} StageCase;

static void beyond_depth (BwFlocStage *s) { s->compartment.depth_m = 3.1; } /* 1.575 > 1.55 */
static void beyond_length (BwFlocStage *s) { s->compartment.length_m = 3.0; }
static void vertical_beyond_width (BwFlocStage *s)
{
  s->paddle.shaft = BW_SHAFT_VERTICAL;
  s->paddle.n_wheels = 1;
  s->compartment.width_m = 3.0;
}
static void across_shaft (BwFlocStage *s) { s->paddle.ring_radius_m[0] = 0.07; }
static void overlapping (BwFlocStage *s) { s->paddle.ring_radius_m[1] = 0.6; }
static void too_long (BwFlocStage *s) { s->paddle.blade_length_m = 3.1; } /* 2 x 3.1 > 6 */
static void vertical_too_long (BwFlocStage *s)
{
  s->paddle.shaft = BW_SHAFT_VERTICAL;
  s->paddle.n_wheels = 1;
  s->compartment.width_m = 4.0;
  s->paddle.blade_length_m = 4.5; /* deeper than the water */
}
static void no_rings (BwFlocStage *s) { s->paddle.n_rings = 0; }
static void many_rings (BwFlocStage *s) { s->paddle.n_rings = BW_PADDLE_MAX_RINGS + 1; }
static void no_arms (BwFlocStage *s) { s->paddle.arms_per_wheel = 0; }
static void no_wheels (BwFlocStage *s) { s->paddle.n_wheels = 0; }
static void zero_radius (BwFlocStage *s) { s->paddle.ring_radius_m[2] = 0.0; }
static void nan_width (BwFlocStage *s) { s->paddle.blade_width_m = NAN; }
static void neg_cd (BwFlocStage *s) { s->paddle.drag_coefficient = -1.0; }
static void k_above_one (BwFlocStage *s) { s->paddle.relative_velocity_factor = 1.5; }
static void k_zero (BwFlocStage *s) { s->paddle.relative_velocity_factor = 0.0; }
static void zero_speed (BwFlocStage *s) { s->paddle.speed_rev_s = 0.0; }
static void bad_shaft (BwFlocStage *s) { s->paddle.shaft = (BwShaftOrientation) 5; }
static void zero_compartment (BwFlocStage *s) { s->compartment.width_m = 0.0; }
static void bad_kind (BwFlocStage *s) { s->kind = (BwFlocStageKind) 11; }
static void turbine_too_big (BwFlocStage *s)
{
  s->kind = BW_FLOC_STAGE_TURBINE;
  s->turbine = (BwImpeller) { BW_IMPELLER_HYDROFOIL, 0.0, 4.0, 0.5 }; /* 4 m in a 4 m x 6 m plan */
  s->turbine_baffled = TRUE;
}
static void turbine_unbaffled (BwFlocStage *s)
{
  s->kind = BW_FLOC_STAGE_TURBINE;
  s->turbine = (BwImpeller) { BW_IMPELLER_HYDROFOIL, 0.0, 2.0, 0.5 };
  s->turbine_baffled = FALSE;
}

static const StageCase stage_cases[] = {
  { "blade beyond the depth", beyond_depth, BW_ENGINE_ERROR_GEOMETRY, "blade radius:" },
  { "blade beyond the length", beyond_length, BW_ENGINE_ERROR_GEOMETRY, "blade radius:" },
  { "vertical beyond the width", vertical_beyond_width, BW_ENGINE_ERROR_GEOMETRY, "blade radius:" },
  { "blade across the shaft", across_shaft, BW_ENGINE_ERROR_GEOMETRY, "blade radius:" },
  { "blades overlap", overlapping, BW_ENGINE_ERROR_GEOMETRY, "blade radius:" },
  { "wheels longer than the width", too_long, BW_ENGINE_ERROR_GEOMETRY, "blade length:" },
  { "vertical blades too deep", vertical_too_long, BW_ENGINE_ERROR_GEOMETRY, "blade length:" },
  { "no rings", no_rings, BW_ENGINE_ERROR_OUT_OF_RANGE, "blades per arm:" },
  { "too many rings", many_rings, BW_ENGINE_ERROR_OUT_OF_RANGE, "blades per arm:" },
  { "no arms", no_arms, BW_ENGINE_ERROR_OUT_OF_RANGE, "arms per wheel:" },
  { "no wheels", no_wheels, BW_ENGINE_ERROR_OUT_OF_RANGE, "paddle wheels:" },
  { "zero radius", zero_radius, BW_ENGINE_ERROR_OUT_OF_RANGE, "blade radius:" },
  { "NaN width", nan_width, BW_ENGINE_ERROR_NOT_FINITE, "blade width:" },
  { "negative Cd", neg_cd, BW_ENGINE_ERROR_OUT_OF_RANGE, "drag coefficient:" },
  { "k above 1", k_above_one, BW_ENGINE_ERROR_OUT_OF_RANGE, "relative velocity factor:" },
  { "k zero", k_zero, BW_ENGINE_ERROR_OUT_OF_RANGE, "relative velocity factor:" },
  { "zero speed", zero_speed, BW_ENGINE_ERROR_OUT_OF_RANGE, "rotational speed:" },
  { "bad shaft", bad_shaft, BW_ENGINE_ERROR_INVALID, "shaft orientation:" },
  { "zero compartment width", zero_compartment, BW_ENGINE_ERROR_OUT_OF_RANGE,
    "compartment width:" },
  { "bad stage kind", bad_kind, BW_ENGINE_ERROR_INVALID, "stage kind:" },
  { "turbine too big", turbine_too_big, BW_ENGINE_ERROR_GEOMETRY, "impeller diameter:" },
  { "unbaffled turbine", turbine_unbaffled, BW_ENGINE_ERROR_OUT_OF_RANGE, "power number:" },
};

START_TEST (test_floc_stage_errors)
{
  const StageCase *c = &stage_cases[_i];
  BwWater w = bw_test_real_water (15.0);
  BwFlocStage s = paddle_stage ();
  BwFlocStageResult r;
  g_autoptr (GError) error = NULL;

  /* The unspoiled stage is valid, so each case tests one thing. */
  ck_assert (bw_floc_stage_evaluate (&s, 0.2, &w, &r, &error));
  c->spoil (&s);
  ck_assert_msg (!bw_floc_stage_evaluate (&s, 0.2, &w, &r, &error), "%s accepted", c->what);
  ck_assert_msg (g_error_matches (error, BW_ENGINE_ERROR, c->code), "%s: code %d, %s", c->what,
                 error->code, error->message);
  ck_assert_msg (g_str_has_prefix (error->message, c->field), "%s: '%s'", c->what,
                 error->message);
}
END_TEST

START_TEST (test_floc_blade_fit_boundary)
{
  /* Exactly touching half the depth is accepted (the brief's rule: an error only beyond). */
  BwWater w = bw_test_real_water (15.0);
  BwFlocStage s = paddle_stage ();
  BwFlocStageResult r;
  g_autoptr (GError) error = NULL;

  s.compartment.depth_m = 2.0 * 1.575;
  s.compartment.length_m = 2.0 * 1.575;
  ck_assert_msg (bw_floc_stage_evaluate (&s, 0.2, &w, &r, &error), "%s",
                 error ? error->message : "");
  s.compartment.depth_m = 2.0 * 1.575 * (1.0 - 1e-9);
  ck_assert (!bw_floc_stage_evaluate (&s, 0.2, &w, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY, "half its");
}
END_TEST

/* --- turbine stages --- */

START_TEST (test_floc_turbine_stage)
{
  /* A 2 m hydrofoil (Np 0.30) at 30 rpm in a 5 m cube: P = 0.30 rho 0.125 x 32 (derived). */
  BwWater w = bw_test_real_water (10.0);
  BwFlocStage s;
  BwFlocStageResult r;
  g_autoptr (GError) error = NULL;

  memset (&s, 0, sizeof s);
  s.kind = BW_FLOC_STAGE_TURBINE;
  s.compartment = (BwCompartment) { 5.0, 5.0, 5.0 };
  s.turbine = (BwImpeller) { BW_IMPELLER_HYDROFOIL, 0.0, 2.0, 0.5 };
  s.turbine_baffled = TRUE;
  ck_assert (bw_floc_stage_evaluate (&s, 0.25, &w, &r, &error));
  bw_assert_rel (r.power_W, 0.30 * w.density_kg_m3 * 0.125 * 32.0, 1e-12);
  bw_assert_rel (r.G_per_s, sqrt (r.power_W / (w.dynamic_viscosity_Pa_s * 125.0)), 1e-12);
  bw_assert_rel (r.detention_s, 500.0, 1e-15);
  ck_assert_uint_eq (r.warnings, 0);
}
END_TEST

/* --- baffled channels --- */

START_TEST (test_floc_baffled_around_the_end)
{
  /* Derived by hand: 10 passes 1.0 m apart, 2.0 m deep, 10 m long, Q = 0.3 m3/s, K = 3.2,
   * n = 0.013, 20 degC water (998.2072 kg/m3, 1.00160 mPa s, docs/references.md), g = 9.80665:
   * v = 0.15 m/s, R = 2 / 5 = 0.4 m, path 100 m, h_f = 100 (0.013 x 0.15)^2 / 0.4^(4/3) =
   * 1.290197e-3 m, h_t = 9 x 3.2 x 0.0225 / 19.6133 = 0.03303881 m, t = 666.67 s,
   * G = sqrt (g h / (nu t)) = 22.43364 1/s, Gt = 14955.76. */
  BwWater w = bw_test_rounded_water (998.2072, 1.0016e-3);
  BwBaffledChannel c;
  BwBaffledResult r;
  g_autoptr (GError) error = NULL;

  bw_baffled_channel_init (&c, BW_BAFFLE_AROUND_THE_END);
  ck_assert_double_eq (c.turn_loss_k, 3.2);    /* Haarhoff 1998 via Hendricks 2011 (seen) */
  ck_assert_double_eq (c.manning_n, 0.013);    /* concrete (common practice) */
  c.n_passes = 10;
  c.spacing_m = 1.0;
  c.water_depth_m = 2.0;
  c.pass_length_m = 10.0;
  ck_assert (bw_baffled_channel_evaluate (&c, 0.3, &w, &r, &error));
  bw_assert_rel (r.velocity_m_s, 0.15, 1e-15);
  bw_assert_rel (r.hydraulic_radius_m, 0.4, 1e-15);
  bw_assert_rel (r.path_length_m, 100.0, 1e-15);
  ck_assert_uint_eq (r.n_turns, 9);
  bw_assert_rel (r.friction_loss_m, 1.290196623e-3, 1e-8);
  bw_assert_rel (r.turn_loss_m, 0.0330388053, 1e-8);
  bw_assert_rel (r.headloss_m, 0.0343290019, 1e-8);
  bw_assert_rel (r.volume_m3, 200.0, 1e-15);
  bw_assert_rel (r.detention_s, 666.666667, 1e-8);
  bw_assert_rel (r.G_per_s, 22.4336400, 1e-8);
  bw_assert_rel (r.Gt, 14955.7600, 1e-8);
  bw_assert_rel (r.power_W, 998.2072 * 9.80665 * 0.3 * 0.0343290019, 1e-8);
}
END_TEST

START_TEST (test_floc_baffled_over_and_under)
{
  /* Derived by hand: 12 passes 0.8 m apart, baffles 5 m long across the basin, 3 m deep,
   * Q = 0.3 m3/s, K = 3.2, n = 0.013, same water: section 0.8 x 5 = 4 m2, v = 0.075 m/s,
   * R = 4 / 11.6 = 0.344828 m, path 12 x 3 = 36 m, h_f = 1.415280e-4 m, h_t = 11 x 3.2 x
   * 0.075^2 / 19.6133 = 0.01009519 m, t = 480 s, G = 14.43721 1/s. */
  BwWater w = bw_test_rounded_water (998.2072, 1.0016e-3);
  BwBaffledChannel c;
  BwBaffledResult r;
  g_autoptr (GError) error = NULL;

  bw_baffled_channel_init (&c, BW_BAFFLE_OVER_AND_UNDER);
  c.n_passes = 12;
  c.spacing_m = 0.8;
  c.water_depth_m = 3.0;
  c.pass_length_m = 5.0;
  ck_assert (bw_baffled_channel_evaluate (&c, 0.3, &w, &r, &error));
  bw_assert_rel (r.velocity_m_s, 0.075, 1e-14);
  bw_assert_rel (r.hydraulic_radius_m, 4.0 / 11.6, 1e-14);
  bw_assert_rel (r.path_length_m, 36.0, 1e-15);
  bw_assert_rel (r.friction_loss_m, 1.415280086e-4, 1e-8);
  bw_assert_rel (r.turn_loss_m, 0.0100951905, 1e-8);
  bw_assert_rel (r.detention_s, 480.0, 1e-12);
  bw_assert_rel (r.G_per_s, 14.4372106, 1e-8);
}
END_TEST

START_TEST (test_floc_baffled_properties)
{
  /* Wider spacing: slower water, less loss, longer stay: lower G. More flow: higher G. */
  BwWater w = bw_test_real_water (12.0);
  BwBaffledChannel c;
  double prev = G_MAXDOUBLE;

  for (guint layout = 0; layout < BW_N_BAFFLE_LAYOUTS; layout++)
    {
      bw_baffled_channel_init (&c, (BwBaffleLayout) layout);
      c.n_passes = 15;
      c.water_depth_m = 2.5;
      c.pass_length_m = 8.0;
      prev = G_MAXDOUBLE;
      for (double s = 0.05; s < 20.0; s *= 1.2)
        {
          BwBaffledResult r;
          g_autoptr (GError) error = NULL;
          c.spacing_m = s;
          ck_assert (bw_baffled_channel_evaluate (&c, 0.2, &w, &r, &error));
          ck_assert_msg (r.G_per_s < prev, "G rose at spacing %g", s);
          prev = r.G_per_s;
        }
      c.spacing_m = 1.0;
      prev = 0.0;
      for (double q = 0.01; q < 5.0; q *= 1.5)
        {
          BwBaffledResult r;
          g_autoptr (GError) error = NULL;
          ck_assert (bw_baffled_channel_evaluate (&c, q, &w, &r, &error));
          ck_assert (r.G_per_s > prev);
          prev = r.G_per_s;
        }
    }
}
END_TEST

START_TEST (test_floc_baffled_errors)
{
  BwWater w = bw_test_real_water (12.0);
  BwBaffledChannel c;
  BwBaffledResult r;
  g_autoptr (GError) error = NULL;

  bw_baffled_channel_init (&c, BW_BAFFLE_AROUND_THE_END);
  c.n_passes = 1;
  c.spacing_m = 1.0;
  c.water_depth_m = 2.0;
  c.pass_length_m = 10.0;
  c.manning_n = 0.0; /* one pass, no turns, no friction: no head lost */
  ck_assert (!bw_baffled_channel_evaluate (&c, 0.2, &w, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "manning n");
  g_clear_error (&error);
  c.manning_n = 0.013;
  ck_assert (bw_baffled_channel_evaluate (&c, 0.2, &w, &r, &error)); /* friction alone will do */

  c.spacing_m = -1.0;
  ck_assert (!bw_baffled_channel_evaluate (&c, 0.2, &w, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "baffle spacing:");
  g_clear_error (&error);
  c.spacing_m = 1.0;
  c.n_passes = 0;
  ck_assert (!bw_baffled_channel_evaluate (&c, 0.2, &w, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "passes:");
  g_clear_error (&error);
  c.n_passes = 4;
  c.turn_loss_k = NAN;
  ck_assert (!bw_baffled_channel_evaluate (&c, 0.2, &w, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE, "turn loss coefficient:");
  g_clear_error (&error);
  c.turn_loss_k = 3.2;
  c.layout = (BwBaffleLayout) 3;
  ck_assert (!bw_baffled_channel_evaluate (&c, 0.2, &w, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "baffle layout:");
  g_clear_error (&error);
  c.layout = BW_BAFFLE_OVER_AND_UNDER;
  ck_assert (!bw_baffled_channel_evaluate (&c, 0.0, &w, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "flow:");
  g_clear_error (&error);
  /* A slot so thin the velocity overflows: an error, not inf. */
  c.spacing_m = 1e-310;
  ck_assert (!bw_baffled_channel_evaluate (&c, 0.2, &w, &r, &error));
  ck_assert (g_str_has_prefix (error->message, "baffle spacing:"));
}
END_TEST

START_TEST (test_floc_layout_names)
{
  BwBaffleLayout l;

  for (guint i = 0; i < BW_N_BAFFLE_LAYOUTS; i++)
    {
      ck_assert (bw_baffle_layout_from_name (bw_baffle_layout_name ((BwBaffleLayout) i), &l));
      ck_assert_int_eq (l, (int) i);
    }
  ck_assert (!bw_baffle_layout_from_name ("zigzag", &l));
  ck_assert_str_eq (bw_floc_stage_kind_name (BW_FLOC_STAGE_BAFFLED), "baffled");
  ck_assert_str_eq (bw_floc_stage_kind_name ((BwFlocStageKind) 9), "unknown");
}
END_TEST

/* --- trains --- */

/* Three paddle stages tapered 2.8, 2.0, 1.4 rpm. */
static BwFlocculator
tapered_train (void)
{
  BwFlocculator f;
  const double rpm[] = { 2.8, 2.0, 1.4 };

  memset (&f, 0, sizeof f);
  f.flow_m3_s = 0.2;
  f.n_stages = 3;
  for (guint i = 0; i < 3; i++)
    {
      f.stages[i] = paddle_stage ();
      f.stages[i].paddle.speed_rev_s = rpm[i] / 60.0;
    }
  return f;
}

START_TEST (test_floc_train_totals)
{
  BwWater w = bw_test_real_water (15.0);
  BwFlocculator f = tapered_train ();
  BwFlocResult r;
  g_autoptr (GError) error = NULL;
  double p = 0, v = 0, t = 0, gt = 0;

  ck_assert (bw_flocculator_evaluate (&f, &w, &r, &error));
  ck_assert_uint_eq (r.n_stages, 3);
  for (guint i = 0; i < 3; i++)
    {
      BwFlocStageResult one;
      ck_assert (bw_floc_stage_evaluate (&f.stages[i], f.flow_m3_s, &w, &one, &error));
      bw_assert_rel (r.stages[i].G_per_s, one.G_per_s, 1e-15);
      if (i > 0)
        ck_assert (r.stages[i].G_per_s < r.stages[i - 1].G_per_s); /* tapered */
      p += one.power_W;
      v += one.volume_m3;
      t += one.detention_s;
      gt += one.G_per_s * one.detention_s;
    }
  bw_assert_rel (r.power_W, p, 1e-14);
  bw_assert_rel (r.volume_m3, v, 1e-14);
  bw_assert_rel (r.detention_s, t, 1e-14);
  bw_assert_rel (r.Gt, gt, 1e-14);
  bw_assert_rel (r.G_time_mean_per_s, gt / t, 1e-14);
  bw_assert_rel (r.G_power_mean_per_s, sqrt (p / (w.dynamic_viscosity_Pa_s * v)), 1e-14);
  /* A tapered train: the RMS (power) mean lies strictly above the time mean. */
  ck_assert (r.G_power_mean_per_s > r.G_time_mean_per_s);

  /* Equal stages: the two overall G agree. */
  for (guint i = 0; i < 3; i++)
    f.stages[i].paddle.speed_rev_s = 2.0 / 60.0;
  ck_assert (bw_flocculator_evaluate (&f, &w, &r, &error));
  bw_assert_rel (r.G_power_mean_per_s, r.G_time_mean_per_s, 1e-12);
}
END_TEST

START_TEST (test_floc_mixed_train)
{
  /* A train may mix kinds: paddle, turbine, then a baffled channel. */
  BwWater w = bw_test_real_water (15.0);
  BwFlocculator f = tapered_train ();
  BwFlocResult r;
  g_autoptr (GError) error = NULL;

  f.stages[1].kind = BW_FLOC_STAGE_TURBINE;
  f.stages[1].turbine = (BwImpeller) { BW_IMPELLER_HYDROFOIL, 0.0, 2.0, 0.25 };
  f.stages[1].turbine_baffled = TRUE;
  f.stages[2].kind = BW_FLOC_STAGE_BAFFLED;
  bw_baffled_channel_init (&f.stages[2].channel, BW_BAFFLE_AROUND_THE_END);
  f.stages[2].channel.n_passes = 8;
  f.stages[2].channel.spacing_m = 1.2;
  f.stages[2].channel.water_depth_m = 3.0;
  f.stages[2].channel.pass_length_m = 6.0;
  ck_assert_msg (bw_flocculator_evaluate (&f, &w, &r, &error), "%s", error ? error->message : "");
  ck_assert_int_eq (r.stages[1].kind, BW_FLOC_STAGE_TURBINE);
  ck_assert_int_eq (r.stages[2].kind, BW_FLOC_STAGE_BAFFLED);
  bw_assert_rel (r.stages[2].volume_m3, 8 * 1.2 * 3.0 * 6.0, 1e-14);
  bw_assert_rel (r.stages[2].G_per_s, r.stages[2].channel.G_per_s, 1e-12);
  bw_assert_rel (r.volume_m3, 96.0 + 96.0 + 172.8, 1e-14);
}
END_TEST

START_TEST (test_floc_train_errors)
{
  BwWater w = bw_test_real_water (15.0);
  BwFlocculator f = tapered_train ();
  BwFlocResult r;
  g_autoptr (GError) error = NULL;

  f.stages[1].compartment.depth_m = 2.0; /* the 1.575 m reel no longer fits stage 2 */
  ck_assert (!bw_flocculator_evaluate (&f, &w, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY, "blade radius");
  ck_assert_msg (g_str_has_prefix (error->message, "stage 2 blade radius:"), "%s", error->message);
  g_clear_error (&error);

  f = tapered_train ();
  f.n_stages = 0;
  ck_assert (!bw_flocculator_evaluate (&f, &w, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "stages:");
  g_clear_error (&error);
  f.n_stages = BW_FLOC_MAX_STAGES + 1;
  ck_assert (!bw_flocculator_evaluate (&f, &w, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "stages:");
  g_clear_error (&error);
  f.n_stages = 3;
  f.flow_m3_s = -0.2;
  ck_assert (!bw_flocculator_evaluate (&f, &w, &r, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "flow:");
}
END_TEST

/* --- design solves --- */

START_TEST (test_floc_solve_paddle_speed)
{
  for (double c = 0.0; c <= 40.0; c += 10.0)
    for (double target = 10.0; target <= 60.0; target += 10.0)
      {
        BwWater w = bw_test_real_water (c);
        BwFlocStage s = paddle_stage ();
        BwFlocStageResult r;
        g_autoptr (GError) error = NULL;
        double n = 0;

        ck_assert (bw_floc_stage_paddle_speed_for_gradient (&s, 0.2, &w, target, &n, &error));
        s.paddle.speed_rev_s = n;
        ck_assert (bw_floc_stage_evaluate (&s, 0.2, &w, &r, &error));
        bw_assert_rel (r.G_per_s, target, 1e-9);
      }
}
END_TEST

START_TEST (test_floc_solve_blade_length)
{
  /* With Cd from the aspect ratio (so P is not simply proportional to the length) and with a
   * fixed Cd; targets spanning every segment of the Cd rule (L/W from below 5 to above 20). */
  for (int fixed = 0; fixed <= 1; fixed++)
    for (double target = 2.0; target <= 40.0; target *= 1.4)
      {
        BwWater w = bw_test_real_water (15.0);
        BwFlocStage s = paddle_stage ();
        BwFlocStageResult r;
        g_autoptr (GError) error = NULL;
        double len = 0;

        s.compartment.width_m = 40.0;
        s.paddle.blade_width_m = 0.1;
        s.paddle.drag_coefficient = fixed ? 1.8 : BW_PADDLE_CD_FROM_ASPECT;
        s.paddle.speed_rev_s = 4.0 / 60.0;
        ck_assert_msg (bw_floc_stage_blade_length_for_gradient (&s, 0.2, &w, target, &len, &error),
                       "G %g: %s", target, error ? error->message : "");
        s.paddle.blade_length_m = len;
        ck_assert (bw_floc_stage_evaluate (&s, 0.2, &w, &r, &error));
        bw_assert_rel (r.G_per_s, target, 1e-9);
      }
}
END_TEST

START_TEST (test_floc_solve_blade_length_too_long)
{
  /* G = 60 1/s at 2 rpm needs blades far longer than the 6 m compartment takes. */
  BwWater w = bw_test_real_water (15.0);
  BwFlocStage s = paddle_stage ();
  g_autoptr (GError) error = NULL;
  double len = -1;

  ck_assert (!bw_floc_stage_blade_length_for_gradient (&s, 0.2, &w, 60.0, &len, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "blade length:");
  ck_assert (len == -1);
}
END_TEST

START_TEST (test_floc_solve_turbine_speed)
{
  for (guint kind = 0; kind < BW_N_IMPELLER_KINDS; kind++)
    for (double target = 10.0; target <= 80.0; target += 10.0)
      {
        BwWater w = bw_test_real_water (5.0);
        BwFlocStage s;
        BwFlocStageResult r;
        g_autoptr (GError) error = NULL;
        double n = 0;

        memset (&s, 0, sizeof s);
        s.kind = BW_FLOC_STAGE_TURBINE;
        s.compartment = (BwCompartment) { 4.0, 4.0, 4.0 };
        s.turbine = (BwImpeller) { (BwImpellerKind) kind, 0.0, 1.5, 0.0 };
        s.turbine_baffled = TRUE;
        ck_assert (bw_floc_stage_turbine_speed_for_gradient (&s, 0.1, &w, target, &n, &error));
        s.turbine.speed_rev_s = n;
        ck_assert (bw_floc_stage_evaluate (&s, 0.1, &w, &r, &error));
        bw_assert_rel (r.G_per_s, target, 1e-9);
      }
}
END_TEST

START_TEST (test_floc_solve_baffle_spacing)
{
  for (guint layout = 0; layout < BW_N_BAFFLE_LAYOUTS; layout++)
    for (double target = 10.0; target <= 100.0; target += 15.0)
      {
        BwWater w = bw_test_real_water (8.0);
        BwFlocStage s;
        BwFlocStageResult r;
        g_autoptr (GError) error = NULL;
        double sp = 0;

        memset (&s, 0, sizeof s);
        s.kind = BW_FLOC_STAGE_BAFFLED;
        bw_baffled_channel_init (&s.channel, (BwBaffleLayout) layout);
        s.channel.n_passes = 20;
        s.channel.water_depth_m = 2.5;
        s.channel.pass_length_m = 8.0;
        ck_assert_msg (bw_floc_stage_baffle_spacing_for_gradient (&s, 0.3, &w, target, &sp, &error),
                       "%s", error ? error->message : "");
        s.channel.spacing_m = sp;
        ck_assert (bw_floc_stage_evaluate (&s, 0.3, &w, &r, &error));
        bw_assert_rel (r.G_per_s, target, 1e-9);
      }
}
END_TEST

START_TEST (test_floc_solve_errors)
{
  BwWater w = bw_test_real_water (8.0);
  BwFlocStage s = paddle_stage ();
  g_autoptr (GError) error = NULL;
  double x = 0;

  /* A solve for another kind of stage. */
  ck_assert (!bw_floc_stage_baffle_spacing_for_gradient (&s, 0.3, &w, 30.0, &x, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "stage kind:");
  g_clear_error (&error);
  ck_assert (!bw_floc_stage_turbine_speed_for_gradient (&s, 0.3, &w, 30.0, &x, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "stage kind:");
  g_clear_error (&error);
  ck_assert (!bw_floc_stage_paddle_speed_for_gradient (&s, 0.3, &w, 0.0, &x, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "velocity gradient:");
  g_clear_error (&error);

  /* A G that no baffle spacing reaches: 3 passes, a trickle of flow. */
  memset (&s, 0, sizeof s);
  s.kind = BW_FLOC_STAGE_BAFFLED;
  bw_baffled_channel_init (&s.channel, BW_BAFFLE_AROUND_THE_END);
  s.channel.n_passes = 3;
  s.channel.water_depth_m = 2.0;
  s.channel.pass_length_m = 5.0;
  ck_assert (!bw_floc_stage_baffle_spacing_for_gradient (&s, 1e-9, &w, 5000.0, &x, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "baffle spacing:");
  g_clear_error (&error);
  /* A G too low for any spacing up to 1 km with a river's flow. */
  ck_assert (!bw_floc_stage_baffle_spacing_for_gradient (&s, 1e4, &w, 1e-6, &x, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE, "baffle spacing:");
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("floc");
  TCase *tc;

  tc = tcase_create ("drag");
  tcase_add_test (tc, test_floc_drag_table_points);
  tcase_add_test (tc, test_floc_drag_continuous_and_rising);
  suite_add_tcase (s, tc);

  tc = tcase_create ("paddle");
  tcase_add_test (tc, test_floc_paddle_hand_example);
  tcase_add_test (tc, test_floc_paddle_cube_law);
  tcase_add_test (tc, test_floc_faster_paddle_higher_g);
  tcase_add_test (tc, test_floc_colder_water_lower_g_same_power);
  tcase_add_loop_test (tc, test_floc_stage_errors, 0, G_N_ELEMENTS (stage_cases));
  tcase_add_test (tc, test_floc_blade_fit_boundary);
  tcase_add_test (tc, test_floc_turbine_stage);
  suite_add_tcase (s, tc);

  tc = tcase_create ("baffled");
  tcase_add_test (tc, test_floc_baffled_around_the_end);
  tcase_add_test (tc, test_floc_baffled_over_and_under);
  tcase_add_test (tc, test_floc_baffled_properties);
  tcase_add_test (tc, test_floc_baffled_errors);
  tcase_add_test (tc, test_floc_layout_names);
  suite_add_tcase (s, tc);

  tc = tcase_create ("train");
  tcase_add_test (tc, test_floc_train_totals);
  tcase_add_test (tc, test_floc_mixed_train);
  tcase_add_test (tc, test_floc_train_errors);
  suite_add_tcase (s, tc);

  tc = tcase_create ("solves");
  tcase_add_test (tc, test_floc_solve_paddle_speed);
  tcase_add_test (tc, test_floc_solve_blade_length);
  tcase_add_test (tc, test_floc_solve_blade_length_too_long);
  tcase_add_test (tc, test_floc_solve_turbine_speed);
  tcase_add_test (tc, test_floc_solve_baffle_spacing);
  tcase_add_test (tc, test_floc_solve_errors);
  suite_add_tcase (s, tc);

  return s;
}
