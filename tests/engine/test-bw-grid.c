/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-grid.c: grid property tests of every solver and inversion in the engine: over the whole
 * valid domain of each input (and just outside it), each point either succeeds with a finite
 * result that gives back the solver's defining equation within its stated tolerance, or fails
 * with a GError in BW_ENGINE_ERROR whose message starts with the field it names. */
#include "config.h"

#include <string.h>

#include "bw-test.h"
#include "engine/bw-error.h"
#include "engine/bw-floc.h"
#include "engine/bw-flocmodel.h"
#include "engine/bw-jartest.h"
#include "engine/bw-mixing.h"
#include "engine/bw-removal.h"
#include "engine/bw-sedimentation.h"
#include "engine/bw-settling.h"
#include "engine/bw-water.h"
#include "engine/bw-zeta.h"

#define CELSIUS(c) ((c) + 273.15)

/* Point I of N log-spaced from LO to HI, both ends included. */
static double
log_point (double lo, double hi, int i, int n)
{
  if (i == 0)
    return lo;
  if (i == n - 1)
    return hi;
  return exp (log (lo) + (log (hi) - log (lo)) * i / (n - 1));
}

static double
lin_point (double lo, double hi, int i, int n)
{
  return i == n - 1 ? hi : lo + (hi - lo) * i / (n - 1);
}

/* TRUE when TEXT holds "nan" or "inf" as a word (what printf makes of a NaN or an infinity). */
static gboolean
mentions_non_finite (const char *text)
{
  g_auto (GStrv) words = g_regex_split_simple ("[^A-Za-z]+", text, 0, 0);

  for (guint i = 0; words[i]; i++)
    if (g_ascii_strcasecmp (words[i], "nan") == 0 || g_ascii_strcasecmp (words[i], "inf") == 0
        || g_ascii_strcasecmp (words[i], "infinity") == 0)
      return TRUE;
  return FALSE;
}

/* A failed point: ERR is set, in BW_ENGINE_ERROR, shows no NaN or infinity, and its message
 * starts with one of FIELDS (a NULL-terminated list) followed by ':'. WHERE describes the point.
 * Clears ERR. */
static void
check_failure (GError **err, const char *const *fields, const char *where)
{
  gboolean named = FALSE;

  ck_assert_msg (*err != NULL, "%s: failed without an error", where);
  ck_assert_msg ((*err)->domain == BW_ENGINE_ERROR, "%s: error outside BW_ENGINE_ERROR: %s", where,
                 (*err)->message);
  ck_assert_msg (!mentions_non_finite ((*err)->message), "%s: the message shows a non-number: %s",
                 where, (*err)->message);
  for (guint i = 0; fields[i] && !named; i++)
    {
      const gsize n = strlen (fields[i]);
      named = strncmp ((*err)->message, fields[i], n) == 0 && (*err)->message[n] == ':';
    }
  ck_assert_msg (named, "%s: the message does not start with an expected field: %s", where,
                 (*err)->message);
  g_clear_error (err);
}

/* A point that must fail naming exactly FIELD. */
#define check_fails_naming(ok, err, field, ...)                                     \
  do                                                                                \
    {                                                                               \
      const char *const _f[] = { (field), NULL };                                   \
      g_autofree char *_w = g_strdup_printf (__VA_ARGS__);                          \
      ck_assert_msg (!(ok), "%s: succeeded, but is outside the domain", _w);        \
      check_failure (&(err), _f, _w);                                               \
    }                                                                               \
  while (0)

/* Relative residual |got - want| / |want|. */
static double
rel_residual (double got, double want)
{
  return fabs (got - want) / fabs (want);
}

#define check_residual(got, want, tol, ...)                                              \
  do                                                                                     \
    {                                                                                    \
      const double _g = (got), _t = (want);                                              \
      g_autofree char *_w = g_strdup_printf (__VA_ARGS__);                               \
      ck_assert_msg (isfinite (_g) && rel_residual (_g, _t) <= (tol),                     \
                     "%s: %s = %.17g gives back %.17g, off by %.3g (tolerance %.3g)", _w, \
                     #got, _g, _t, rel_residual (_g, _t), (double) (tol));               \
    }                                                                                    \
  while (0)

static BwWater
water_at (double celsius)
{
  BwWater w;

  ck_assert (bw_water_properties (CELSIUS (celsius), &w, NULL));
  return w;
}

/* --- water properties --- */

START_TEST (test_grid_water_properties)
{
  /* 0-40 degC is the documented domain (bw-water.h); the properties are closed-form
   * correlations, so every point must succeed, finite and positive. */
  for (int i = 0; i < 401; i++)
    {
      const double t = CELSIUS (lin_point (0.0, 40.0, i, 401));
      BwWater w;
      g_autoptr (GError) error = NULL;

      ck_assert_msg (bw_water_properties (t, &w, &error), "%g K: %s", t, error->message);
      ck_assert (isfinite (w.density_kg_m3) && w.density_kg_m3 > 990 && w.density_kg_m3 < 1001);
      ck_assert (isfinite (w.dynamic_viscosity_Pa_s) && w.dynamic_viscosity_Pa_s > 6e-4
                 && w.dynamic_viscosity_Pa_s < 1.8e-3); /* 0.653-1.792 mPa s over 0-40 degC,
                                                         * IAPWS 2008 (from memory) */
      check_residual (w.kinematic_viscosity_m2_s * w.density_kg_m3, w.dynamic_viscosity_Pa_s,
                      1e-15, "%g K", t); /* nu = mu / rho (definition) */
      ck_assert (isfinite (w.relative_permittivity) && w.relative_permittivity > 70);
    }
  {
    const double outside[] = { CELSIUS (-0.01), CELSIUS (40.01), -1.0, 0.0, 1e300, NAN,
                               INFINITY, -INFINITY };
    for (guint i = 0; i < G_N_ELEMENTS (outside); i++)
      {
        BwWater w;
        g_autoptr (GError) error = NULL;
        const gboolean ok = bw_water_properties (outside[i], &w, &error);
        check_fails_naming (ok, error, "temperature", "water at %g K", outside[i]);
      }
  }
}
END_TEST

/* --- settling velocity: the drag iteration --- */

/* Drag on a sphere against its weight in water (Clift, Grace & Weber 1978, Ch. 5):
 *   Cd (pi d^2 / 4) rho_f v^2 / 2 = (pi d^3 / 6) (rho_p - rho_f) g
 * returned as drag / (weight - buoyancy) - 1, for Cd given. */
static double
force_balance (double cd, double d, double v, double rho_p, double rho_f)
{
  const double drag = cd * G_PI * d * d / 4.0 * rho_f * v * v / 2.0;
  const double weight = G_PI * d * d * d / 6.0 * (rho_p - rho_f) * BW_GRAVITY_M_S2;
  return drag / weight - 1.0;
}

START_TEST (test_grid_settling_drag_balance)
{
  /* Diameter 0.1 um to 0.1 m (the largest accepted) log-spaced; SG - 1 from 0.001 to 10
   * log-spaced; 0-40 degC; both correlations. bw-settling.h documents 0.5 um - 5 mm and
   * SG 1.005-3 as the domain: there every point must succeed. Beyond it a point may also fail
   * when the Reynolds number leaves the correlation's range, naming "diameter". */
  const int nd = 48, ns = 16, nt = 5;
  static const char *const fields[] = { "diameter", NULL };
  guint solved = 0, iterated = 0, refused = 0;

  for (int c = 0; c < 2; c++)
    for (int it = 0; it < nt; it++)
      {
        const double celsius = lin_point (0.0, 40.0, it, nt);
        const BwWater w = water_at (celsius);
        for (int is = 0; is < ns; is++)
          for (int id = 0; id < nd; id++)
            {
              const BwDragCorrelation drag = c == 0 ? BW_DRAG_CLIFT_GAUVIN : BW_DRAG_DAVIS;
              const double d = log_point (1e-7, 0.1, id, nd);
              const double sg = 1.0 + log_point (1e-3, 10.0, is, ns);
              const gboolean documented = d >= 0.5e-6 && d <= 5e-3 && sg >= 1.005 && sg <= 3.0;
              BwSettlingResult r;
              g_autoptr (GError) error = NULL;
              g_autofree char *where = g_strdup_printf (
                "%s d = %g m, SG = %.6g, %g degC", bw_drag_correlation_name (drag), d, sg,
                celsius);

              if (!bw_settling_velocity (d, sg, CELSIUS (celsius), drag, &r, &error))
                {
                  ck_assert_msg (!documented, "%s: inside the documented domain: %s", where,
                                 error->message);
                  check_failure (&error, fields, where);
                  refused++;
                  continue;
                }
              solved++;
              ck_assert_msg (isfinite (r.velocity_m_s) && r.velocity_m_s > 0, "%s: v = %g", where,
                             r.velocity_m_s);
              ck_assert_msg (isfinite (r.reynolds) && r.reynolds > 0, "%s", where);
              check_residual (r.reynolds, w.density_kg_m3 * r.velocity_m_s * d
                                            / w.dynamic_viscosity_Pa_s, 1e-13,
                              "%s (Re = rho v d / mu)", where);
              /* Stokes' law is always an upper bound (Cd Re^2 >= 24 Re for both correlations). */
              ck_assert_msg (r.velocity_m_s <= r.stokes_velocity_m_s * (1 + 1e-12), "%s", where);
              if (r.iterations == 0)
                {
                  /* Stokes' law directly: exact for Cd = 24/Re, and within the 1.3 % that
                   * bw-settling.c states of either correlation (Re < 0.01). */
                  ck_assert_msg (r.reynolds < 0.01, "%s", where);
                  ck_assert_msg (fabs (force_balance (24.0 / r.reynolds, d, r.velocity_m_s,
                                                      sg * w.density_kg_m3, w.density_kg_m3))
                                   <= 1e-12, "%s: Stokes balance", where);
                  ck_assert_msg (fabs (force_balance (bw_drag_coefficient (drag, r.reynolds), d,
                                                      r.velocity_m_s, sg * w.density_kg_m3,
                                                      w.density_kg_m3))
                                   <= 0.013, "%s: correlation within 1.3 %%", where);
                }
              else
                {
                  /* The iteration stops at a step below 1e-12 in ln Re; F = Cd Re^2 has a log
                   * slope of at most 3, so the balance holds to a few 1e-12 plus round-off. */
                  double bal;
                  iterated++;
                  ck_assert_msg (r.iterations <= 100, "%s: %d iterations", where, r.iterations);
                  check_residual (r.drag_coefficient, bw_drag_coefficient (drag, r.reynolds),
                                  1e-15, "%s (Cd at Re)", where);
                  bal = force_balance (r.drag_coefficient, d, r.velocity_m_s,
                                       sg * w.density_kg_m3, w.density_kg_m3);
                  ck_assert_msg (fabs (bal) <= 1e-10, "%s: drag/weight - 1 = %.3g after %d "
                                 "iterations", where, bal, r.iterations);
                }
            }
      }
  /* The grid reaches every branch: Stokes' law, the iteration, and refusals beyond range. */
  ck_assert_uint_gt (solved - iterated, 0);
  ck_assert_uint_gt (iterated, 0);
  ck_assert_uint_gt (refused, 0);
}
END_TEST

START_TEST (test_grid_settling_outside)
{
  /* Just outside every edge: each fails and names its field. */
  const struct
  {
    double d, sg, celsius;
    const char *field;
  } pts[] = {
    { 0.0, 2.65, 10, "diameter" },
    { -1e-6, 2.65, 10, "diameter" },
    { 0.1 * (1 + 1e-12), 2.65, 10, "diameter" },
    { NAN, 2.65, 10, "diameter" },
    { INFINITY, 2.65, 10, "diameter" },
    { 1e-5, 1.0, 10, "specific gravity" },
    { 1e-5, 1.0 - 1e-12, 10, "specific gravity" },
    { 1e-5, 0.5, 10, "specific gravity" },
    { 1e-5, NAN, 10, "specific gravity" },
    { 1e-5, INFINITY, 10, "specific gravity" },
    { 1e-5, 2.65, -0.01, "temperature" },
    { 1e-5, 2.65, 40.01, "temperature" },
    { 1e-5, 2.65, NAN, "temperature" },
  };

  for (int c = 0; c < 2; c++)
    for (guint i = 0; i < G_N_ELEMENTS (pts); i++)
      {
        BwSettlingResult r;
        g_autoptr (GError) error = NULL;
        const gboolean ok = bw_settling_velocity (pts[i].d, pts[i].sg, CELSIUS (pts[i].celsius),
                                                  c ? BW_DRAG_DAVIS : BW_DRAG_CLIFT_GAUVIN, &r,
                                                  &error);
        check_fails_naming (ok, error, pts[i].field, "d = %g, SG = %g, %g degC", pts[i].d,
                            pts[i].sg, pts[i].celsius);
      }
}
END_TEST

/* --- flocculation: the design solves --- */

/* The paddle reel of test-bw-floc.c (after Davis 2010 Table 6-7, seen), with SHAFT and WHEELS. */
static BwFlocStage
paddle_stage (BwShaftOrientation shaft, guint wheels)
{
  BwFlocStage s;

  memset (&s, 0, sizeof s);
  s.kind = BW_FLOC_STAGE_PADDLE;
  s.compartment = (BwCompartment) { 4.0, 6.0, 4.0 };
  bw_paddle_init (&s.paddle);
  s.paddle.shaft = shaft;
  s.paddle.n_wheels = wheels;
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

static double
stage_gradient (const BwFlocStage *s, double flow, const BwWater *w, const char *where)
{
  BwFlocStageResult r;
  g_autoptr (GError) error = NULL;

  ck_assert_msg (bw_floc_stage_evaluate (s, flow, w, &r, &error), "%s: the solved stage does "
                 "not evaluate: %s", where, error->message);
  return r.G_per_s;
}

START_TEST (test_grid_floc_paddle_solves)
{
  /* Target G 0.1-1000 1/s log-spaced (flocculation uses 10-80), 0-40 degC, both shafts, one and
   * two wheels, blade-length start values 0.05, 2.5 and 5 m. Blade length: bisection to a relative
   * bracket of 1e-14 (bw-floc.c), so G comes back to 1e-12; paddle speed: the closed form
   * N = cbrt (P / P(1 rev/s)), to round-off. */
  static const char *const length_fields[] = { "blade length", "blade radius", NULL };
  static const char *const speed_fields[] = { "rotational speed", "blade radius", "blade length",
                                              NULL };
  const int ng = 40;
  guint solved = 0, refused = 0;

  for (int it = 0; it < 3; it++)
    for (int sh = 0; sh < 2; sh++)
      for (guint wheels = 1; wheels <= 2; wheels++)
        for (int st = 0; st < 3; st++)
          for (int ig = 0; ig < ng; ig++)
            {
              const double celsius = it * 20.0;
              const BwWater w = water_at (celsius);
              const double g = log_point (0.1, 1000.0, ig, ng);
              const double starts[] = { 0.05, 2.5, 5.0 };
              BwFlocStage s = paddle_stage (sh ? BW_SHAFT_VERTICAL : BW_SHAFT_HORIZONTAL, wheels);
              double len = -1, n = -1;
              g_autoptr (GError) error = NULL;
              g_autofree char *where = NULL;

              s.paddle.blade_length_m = starts[st];
              where = g_strdup_printf ("G = %g, %s shaft, %u wheel(s), start %g m, %g degC", g,
                                       sh ? "vertical" : "horizontal", wheels, starts[st],
                                       celsius);
              if (bw_floc_stage_blade_length_for_gradient (&s, 0.2, &w, g, &len, &error))
                {
                  BwFlocStage t = s;
                  ck_assert_msg (isfinite (len) && len > 0, "%s: length %g", where, len);
                  t.paddle.blade_length_m = len;
                  check_residual (stage_gradient (&t, 0.2, &w, where), g, 1e-12,
                                  "%s (blade length)", where);
                  solved++;
                }
              else
                {
                  check_failure (&error, length_fields, where);
                  refused++;
                }
              if (bw_floc_stage_paddle_speed_for_gradient (&s, 0.2, &w, g, &n, &error))
                {
                  BwFlocStage t = s;
                  ck_assert_msg (isfinite (n) && n > 0, "%s: speed %g", where, n);
                  t.paddle.speed_rev_s = n;
                  check_residual (stage_gradient (&t, 0.2, &w, where), g, 1e-13,
                                  "%s (paddle speed)", where);
                }
              else
                check_failure (&error, speed_fields, where);
            }
  ck_assert_uint_gt (solved, 0);
  ck_assert_uint_gt (refused, 0); /* G = 1000 needs blades that do not fit */
}
END_TEST

START_TEST (test_grid_floc_baffle_spacing)
{
  /* Target G 1e-4-1e6 1/s (far past 10-100 in use, to reach both ends of the spacing search),
   * flow 1e-3-10 m3/s, both layouts, 2-40 passes, 0 and 40 degC. The
   * bisection stops at a relative bracket of 1e-14 in the spacing; G falls about as s^-1.5 to
   * s^-3, so it comes back to 1e-12. */
  static const char *const fields[] = { "baffle spacing", NULL };
  const int ng = 30, nq = 9;
  const guint passes[] = { 2, 10, 40 };
  guint solved = 0, refused = 0;

  for (int lay = 0; lay < 2; lay++)
    for (int it = 0; it < 2; it++)
      for (guint ip = 0; ip < G_N_ELEMENTS (passes); ip++)
        for (int iq = 0; iq < nq; iq++)
          for (int ig = 0; ig < ng; ig++)
            {
              const double celsius = it * 40.0;
              const BwWater w = water_at (celsius);
              const double g = log_point (1e-4, 1e6, ig, ng);
              const double q = log_point (1e-3, 10.0, iq, nq);
              BwFlocStage s;
              double sp = -1;
              g_autoptr (GError) error = NULL;
              g_autofree char *where = NULL;

              memset (&s, 0, sizeof s);
              s.kind = BW_FLOC_STAGE_BAFFLED;
              bw_baffled_channel_init (&s.channel, lay ? BW_BAFFLE_OVER_AND_UNDER
                                                       : BW_BAFFLE_AROUND_THE_END);
              s.channel.n_passes = passes[ip];
              s.channel.spacing_m = 1.0;
              s.channel.water_depth_m = 3.0;
              s.channel.pass_length_m = 10.0;
              where = g_strdup_printf ("%s, %u passes, Q = %g m3/s, G = %g, %g degC",
                                       bw_baffle_layout_name (s.channel.layout), passes[ip], q, g,
                                       celsius);
              if (bw_floc_stage_baffle_spacing_for_gradient (&s, q, &w, g, &sp, &error))
                {
                  BwBaffledResult r;
                  ck_assert_msg (isfinite (sp) && sp > 0, "%s: spacing %g", where, sp);
                  s.channel.spacing_m = sp;
                  ck_assert (bw_baffled_channel_evaluate (&s.channel, q, &w, &r, NULL));
                  check_residual (r.G_per_s, g, 1e-12, "%s", where);
                  solved++;
                }
              else
                {
                  check_failure (&error, fields, where);
                  refused++;
                }
            }
  ck_assert_uint_gt (solved, 0);
  ck_assert_uint_gt (refused, 0);
}
END_TEST

START_TEST (test_grid_floc_turbine_speed)
{
  /* Turbine flocculator: the closed-form speed from P = Np rho N^3 D^5 gives back the target G
   * to round-off, over G 0.1-1000 1/s and impeller diameters 0.1-3.5 m in a 4 m compartment. */
  static const char *const fields[] = { "rotational speed", "power", NULL };
  const int ng = 30, nd = 12;

  for (int k = 0; k < BW_N_IMPELLER_KINDS; k++)
    for (int id = 0; id < nd; id++)
      for (int ig = 0; ig < ng; ig++)
        {
          const BwWater w = water_at (5.0);
          const double g = log_point (0.1, 1000.0, ig, ng);
          BwFlocStage s;
          double n = -1;
          g_autoptr (GError) error = NULL;
          g_autofree char *where = NULL;

          memset (&s, 0, sizeof s);
          s.kind = BW_FLOC_STAGE_TURBINE;
          s.compartment = (BwCompartment) { 4.0, 4.0, 4.0 };
          s.turbine.kind = (BwImpellerKind) k;
          s.turbine.diameter_m = log_point (0.1, 3.5, id, nd);
          s.turbine.speed_rev_s = 1.0;
          s.turbine_baffled = TRUE;
          where = g_strdup_printf ("%s D = %g m, G = %g", bw_impeller_kind_name (s.turbine.kind),
                                   s.turbine.diameter_m, g);
          if (bw_floc_stage_turbine_speed_for_gradient (&s, 0.2, &w, g, &n, &error))
            {
              s.turbine.speed_rev_s = n;
              check_residual (stage_gradient (&s, 0.2, &w, where), g, 1e-13, "%s", where);
            }
          else
            check_failure (&error, fields, where);
        }
}
END_TEST

START_TEST (test_grid_floc_solves_outside)
{
  /* A target G that is zero, negative or not a number fails naming "velocity gradient" in every
   * solve; a flow of zero names "flow". */
  const double bad_g[] = { 0.0, -1.0, NAN, INFINITY };
  const BwWater w = water_at (10.0);
  BwFlocStage p = paddle_stage (BW_SHAFT_HORIZONTAL, 2), b, t;
  double out;

  memset (&b, 0, sizeof b);
  b.kind = BW_FLOC_STAGE_BAFFLED;
  bw_baffled_channel_init (&b.channel, BW_BAFFLE_AROUND_THE_END);
  b.channel.n_passes = 10;
  b.channel.spacing_m = 1.0;
  b.channel.water_depth_m = 3.0;
  b.channel.pass_length_m = 10.0;
  memset (&t, 0, sizeof t);
  t.kind = BW_FLOC_STAGE_TURBINE;
  t.compartment = (BwCompartment) { 4.0, 4.0, 4.0 };
  t.turbine.kind = BW_IMPELLER_HYDROFOIL;
  t.turbine.diameter_m = 1.5;
  t.turbine_baffled = TRUE;
  for (guint i = 0; i < G_N_ELEMENTS (bad_g); i++)
    {
      g_autoptr (GError) e = NULL;
      gboolean ok;

      ok = bw_floc_stage_blade_length_for_gradient (&p, 0.2, &w, bad_g[i], &out, &e);
      check_fails_naming (ok, e, "velocity gradient", "blade length, G = %g", bad_g[i]);
      ok = bw_floc_stage_paddle_speed_for_gradient (&p, 0.2, &w, bad_g[i], &out, &e);
      check_fails_naming (ok, e, "velocity gradient", "paddle speed, G = %g", bad_g[i]);
      ok = bw_floc_stage_turbine_speed_for_gradient (&t, 0.2, &w, bad_g[i], &out, &e);
      check_fails_naming (ok, e, "velocity gradient", "turbine speed, G = %g", bad_g[i]);
      ok = bw_floc_stage_baffle_spacing_for_gradient (&b, 0.2, &w, bad_g[i], &out, &e);
      check_fails_naming (ok, e, "velocity gradient", "baffle spacing, G = %g", bad_g[i]);
    }
  {
    g_autoptr (GError) e = NULL;
    gboolean ok = bw_floc_stage_baffle_spacing_for_gradient (&b, 0.0, &w, 30.0, &out, &e);
    check_fails_naming (ok, e, "flow", "baffle spacing, Q = 0");
    ok = bw_floc_stage_blade_length_for_gradient (&p, -1.0, &w, 30.0, &out, &e);
    check_fails_naming (ok, e, "flow", "blade length, Q = -1");
  }
}
END_TEST

/* --- rapid mix and hydraulic mixing: the inversions --- */

START_TEST (test_grid_mixing_inversions)
{
  /* Target G 1e-2-1e5 1/s, tank volumes 0.1-1000 m3 (a round tank, depth = 1.2 width), flows
   * 1e-4-10 m3/s, 0-40 degC. Closed forms: G comes back to round-off (1e-13). */
  static const char *const speed_fields[] = { "velocity gradient", "power", NULL };
  static const char *const head_fields[] = { "velocity gradient", "flow", "head loss", NULL };
  const int ng = 36, nv = 10, nt = 3;

  for (int it = 0; it < nt; it++)
    for (int iv = 0; iv < nv; iv++)
      for (int ig = 0; ig < ng; ig++)
        {
          const double celsius = lin_point (0.0, 40.0, it, nt);
          const BwWater w = water_at (celsius);
          const double g = log_point (1e-2, 1e5, ig, ng);
          const double vol = log_point (0.1, 1000.0, iv, nv);
          const double q = log_point (1e-4, 10.0, iv, nv);
          BwRapidMixTank tank = { 0 };
          double n = -1, h = -1;
          g_autoptr (GError) error = NULL;
          g_autofree char *where = g_strdup_printf ("G = %g, V = %g m3, Q = %g m3/s, %g degC", g,
                                                    vol, q, celsius);

          tank.shape = BW_TANK_CYLINDRICAL;
          tank.width_m = cbrt (vol / (G_PI / 4.0 * 1.2));
          tank.liquid_depth_m = 1.2 * tank.width_m;
          tank.baffled = TRUE;
          tank.flow_m3_s = q;
          tank.impeller.kind = BW_IMPELLER_RUSHTON;
          tank.impeller.diameter_m = tank.width_m / 3.0;
          tank.drive_efficiency = 0.8;
          if (bw_rapid_mix_speed_for_gradient (&tank, &w, g, &n, &error))
            {
              BwRapidMixResult r;
              tank.impeller.speed_rev_s = n;
              ck_assert_msg (bw_rapid_mix_evaluate (&tank, &w, &r, &error), "%s: %s", where,
                             error->message);
              check_residual (r.G_per_s, g, 1e-13, "%s (impeller speed)", where);
            }
          else
            check_failure (&error, speed_fields, where);

          if (bw_hydraulic_headloss_for_gradient (g, q, vol, &w, &h, &error))
            {
              BwHydraulicResult r;
              ck_assert_msg (bw_hydraulic_mixer_evaluate (h, q, vol, &w, &r, &error), "%s: %s",
                             where, error->message);
              check_residual (r.G_per_s, g, 1e-13, "%s (head loss)", where);
            }
          else
            check_failure (&error, head_fields, where);
        }
  {
    const double bad[] = { 0.0, -5.0, NAN, INFINITY };
    const BwWater w = water_at (10.0);
    for (guint i = 0; i < G_N_ELEMENTS (bad); i++)
      {
        BwRapidMixTank tank = { 0 };
        double out;
        g_autoptr (GError) e = NULL;
        gboolean ok;

        tank.shape = BW_TANK_SQUARE;
        tank.width_m = 2.0;
        tank.liquid_depth_m = 2.0;
        tank.baffled = TRUE;
        tank.flow_m3_s = 0.1;
        tank.impeller.kind = BW_IMPELLER_PITCHED_BLADE_45;
        tank.impeller.diameter_m = 0.7;
        tank.drive_efficiency = 0.8;
        ok = bw_rapid_mix_speed_for_gradient (&tank, &w, bad[i], &out, &e);
        check_fails_naming (ok, e, "velocity gradient", "rapid mix, G = %g", bad[i]);
        ok = bw_hydraulic_headloss_for_gradient (bad[i], 0.1, 10.0, &w, &out, &e);
        check_fails_naming (ok, e, "velocity gradient", "head loss, G = %g", bad[i]);
        ok = bw_hydraulic_headloss_for_gradient (600.0, bad[i], 10.0, &w, &out, &e);
        check_fails_naming (ok, e, "flow", "head loss, Q = %g", bad[i]);
      }
  }
}
END_TEST

/* --- sedimentation: the sizing inversions --- */

START_TEST (test_grid_sedimentation_inversions)
{
  /* Flow 1e-9-1e4 m3/s (the accepted range, bw-sedimentation.c), 1-10000 basins, target overflow
   * rate 1e-6-1 m/s, area per basin 1-1e8 m2, L/W 1-10, weir loading 1e-6-10 m2/s. */
  static const char *const fields[] = { "overflow rate", "flow", "weir loading", NULL };
  const int nq = 30, nv = 20;
  const guint basins[] = { 1, 3, 10000 };

  for (int iq = 0; iq < nq; iq++)
    for (int iv = 0; iv < nv; iv++)
      for (guint ib = 0; ib < G_N_ELEMENTS (basins); ib++)
        {
          const double q = log_point (1e-9, 1e4, iq, nq);
          const double v0 = log_point (1e-6, 1.0, iv, nv);
          const double area = log_point (1.0, 1e8, iv, nv);
          const double wl = log_point (1e-6, 10.0, iv, nv);
          const guint n = basins[ib];
          double a = -1, wid = -1, len = -1, weir = -1;
          guint count = 0;
          g_autoptr (GError) error = NULL;
          g_autofree char *where = g_strdup_printf ("Q = %g m3/s, %u basins, v0 = %g m/s", q, n,
                                                    v0);

          if (bw_basin_area_for_overflow (q, n, v0, &a, &error))
            check_residual (q / (n * a), v0, 1e-15, "%s (area)", where);
          else
            check_failure (&error, fields, where);
          if (bw_basin_size_for_overflow (q, n, v0, 1.0 + 9.0 * iv / (nv - 1), &wid, &len,
                                          &error))
            {
              check_residual (q / (n * wid * len), v0, 1e-14, "%s (size)", where);
              check_residual (len / wid, 1.0 + 9.0 * iv / (nv - 1), 1e-14, "%s (L/W)", where);
            }
          else
            check_failure (&error, fields, where);
          if (bw_weir_length_for_loading (q, n, wl, &weir, &error))
            check_residual (q / (n * weir), wl, 1e-15, "%s, weir loading %g (weir)", where, wl);
          else
            check_failure (&error, fields, where);
          if (bw_basin_count_for_overflow (q, area, v0, &count, &error))
            {
              /* The smallest whole count that meets the target: n basins do, n - 1 do not. */
              ck_assert_msg (count >= 1 && count <= 10000, "%s: %u basins", where, count);
              ck_assert_msg (q / (count * area) <= v0 * (1 + 1e-15), "%s, A = %g: %u basins give "
                             "%g m/s", where, area, count, q / (count * area));
              ck_assert_msg (count == 1 || q / ((count - 1) * area) > v0 * (1 - 1e-15),
                             "%s, A = %g: %u basins are more than needed", where, area, count);
            }
          else
            check_failure (&error, fields, where);
        }
  {
    double a;
    guint count;
    const struct
    {
      double q, v0;
      const char *field;
    } bad[] = {
      { 0.0, 1e-3, "flow" }, { 0.99e-9, 1e-3, "flow" }, { 1.01e4, 1e-3, "flow" },
      { NAN, 1e-3, "flow" }, { 1.0, 0.0, "overflow rate" }, { 1.0, 1.0001, "overflow rate" },
      { 1.0, -1e-3, "overflow rate" }, { 1.0, INFINITY, "overflow rate" },
    };
    for (guint i = 0; i < G_N_ELEMENTS (bad); i++)
      {
        g_autoptr (GError) e = NULL;
        gboolean ok = bw_basin_area_for_overflow (bad[i].q, 2, bad[i].v0, &a, &e);
        check_fails_naming (ok, e, bad[i].field, "area, Q = %g, v0 = %g", bad[i].q, bad[i].v0);
        ok = bw_basin_count_for_overflow (bad[i].q, 100.0, bad[i].v0, &count, &e);
        check_fails_naming (ok, e, bad[i].field, "count, Q = %g, v0 = %g", bad[i].q, bad[i].v0);
      }
  }
}
END_TEST

/* --- Type II settling: the time for a removal --- */

/* Davis (2010) Example 10-3 (seen), as in test-bw-removal.c. */
static BwSettlingColumn
column (void)
{
  static const double times_min[] = { 5, 10, 20, 40, 60, 90, 120 };
  static const double pct[3][7] = {
    { 41, 50, 60, 67, 72, 73, 76 },
    { 19, 33, 45, 58, 62, 70, 74 },
    { 15, 31, 38, 54, 59, 63, 71 },
  };
  BwSettlingColumn c = { 0 };

  c.n_depths = 3;
  c.n_times = 7;
  c.depth_m[0] = 0.5;
  c.depth_m[1] = 1.0;
  c.depth_m[2] = 2.0;
  for (guint k = 0; k < 7; k++)
    {
      c.time_s[k] = times_min[k] * 60.0;
      for (guint j = 0; j < 3; j++)
        c.removal[j][k] = pct[j][k] / 100.0;
    }
  return c;
}

START_TEST (test_grid_type2_time_for_removal)
{
  /* Target removal 0.001-1 (log-spaced), both surface rules, depths 0.25-2 m, scale-ups 1-3: the
   * removal at the time found equals the target (the curve is piecewise linear, one
   * interpolation: round-off), and no earlier reading already reached it. */
  static const char *const fields[] = { "target removal", NULL };
  const BwSettlingColumn c = column ();
  const double depths[] = { 0.0, 0.25, 0.75, 1.5, 2.0 };
  const int nr = 50;
  guint solved = 0, refused = 0;

  for (int surf = 0; surf < 2; surf++)
    for (guint id = 0; id < G_N_ELEMENTS (depths); id++)
      for (int sc = 0; sc < 2; sc++)
        for (int ir = 0; ir < nr; ir++)
          {
            const double target = log_point (1e-3, 1.0, ir, nr);
            BwType2Options o;
            BwType2Result r, back;
            g_autoptr (GError) error = NULL;
            g_autofree char *where = NULL;

            bw_type2_options_init (&o);
            o.surface = surf ? BW_COLUMN_SURFACE_FULL : BW_COLUMN_SURFACE_HOLD;
            o.depth_m = depths[id];
            o.overflow_scale = o.detention_scale = sc ? 3.0 : 1.0;
            where = g_strdup_printf ("target %g, %s surface, H = %g m, scale %g", target,
                                     surf ? "full" : "hold", depths[id], o.overflow_scale);
            if (!bw_type2_time_for_removal (&c, &o, target, &r, &error))
              {
                check_failure (&error, fields, where);
                refused++;
                continue;
              }
            solved++;
            ck_assert_msg (isfinite (r.detention_s) && r.detention_s > 0
                             && r.detention_s <= c.time_s[c.n_times - 1], "%s: t = %g", where,
                           r.detention_s);
            check_residual (r.removal_fraction, target, 1e-12, "%s", where);
            ck_assert (isfinite (r.overflow_rate_m_s) && isfinite (r.design_overflow_rate_m_s)
                       && isfinite (r.design_detention_s));
            /* The shortest such time: a little earlier the removal is still below the target. */
            if (r.detention_s > 1.0)
              {
                ck_assert (bw_type2_removal_at_time (&c, &o, r.detention_s * (1 - 1e-6), &back,
                                                     NULL));
                ck_assert_msg (back.removal_fraction < target, "%s: not the shortest time",
                               where);
              }
          }
  ck_assert_uint_gt (solved, 0);
  ck_assert_uint_gt (refused, 0); /* 100 % is never reached by this column */
  {
    const double bad[] = { 0.0, -0.1, 1.0 + 1e-12, NAN };
    BwType2Options o;
    BwType2Result r;

    bw_type2_options_init (&o);
    for (guint i = 0; i < G_N_ELEMENTS (bad); i++)
      {
        g_autoptr (GError) e = NULL;
        gboolean ok = bw_type2_time_for_removal (&c, &o, bad[i], &r, &e);
        check_fails_naming (ok, e, "target removal", "target %g", bad[i]);
      }
  }
}
END_TEST

/* --- jar tests: the target-dose search --- */

START_TEST (test_grid_jar_target_dose)
{
  /* Seeded random series of 3-12 jars (doses 0-100 mg/L, turbidities 0.2-40 NTU), targets from
   * 0 to above the largest turbidity: the dose found is the least whose curve value reaches the
   * target (bisection to 1e-12 of the dose), and the curve there meets the target. */
  GRand *rng = g_rand_new_with_seed (10); /* fixed: the same series every run */
  guint found = 0, none = 0;

  for (int series = 0; series < 60; series++)
    {
      BwJarSeries s = { 0 };
      double tmax = 0;

      s.n_jars = 3 + series % 10;
      for (guint i = 0; i < s.n_jars; i++)
        {
          s.jars[i].dose_kg_m3 = (i * 10.0 + g_rand_double_range (rng, 0.0, 9.0)) * 1e-3 / 1.2;
          s.jars[i].turbidity_NTU = g_rand_double_range (rng, 0.2, 40.0);
          tmax = MAX (tmax, s.jars[i].turbidity_NTU);
        }
      ck_assert (bw_jar_series_prepare (&s, NULL));
      for (int it = 0; it < 30; it++)
        {
          const double target = lin_point (0.0, tmax * 1.1, it, 30);
          BwJarResult r;
          g_autoptr (GError) error = NULL;
          g_autofree char *where = g_strdup_printf ("series %d (%u jars), target %g NTU", series,
                                                    s.n_jars, target);

          ck_assert_msg (bw_jar_analyse (&s, target, 0.01, &r, &error), "%s: %s", where,
                         error->message);
          ck_assert (isfinite (r.optimum_dose_kg_m3) && isfinite (r.optimum_turbidity_NTU));
          if (!r.has_target)
            {
              /* Only when no jar reaches the target. */
              for (guint i = 0; i < s.n_jars; i++)
                ck_assert_msg (s.jars[i].turbidity_NTU > target, "%s: missed jar %u", where, i);
              none++;
              continue;
            }
          found++;
          ck_assert (isfinite (r.target_dose_kg_m3));
          ck_assert_msg (bw_jar_curve (&s, r.target_dose_kg_m3) <= target, "%s: curve %g at %g",
                         where, bw_jar_curve (&s, r.target_dose_kg_m3), r.target_dose_kg_m3);
          if (r.target_dose_kg_m3 > s.jars[0].dose_kg_m3)
            {
              /* The least such dose: the curve is above the target everywhere before it (sampled
               * at 400 points), and meets it at the dose found (a continuous curve, bisected to
               * 1e-12 of the dose: its value is the target within slope x 1e-12). */
              const double d0 = s.jars[0].dose_kg_m3, d1 = r.target_dose_kg_m3;
              for (int k = 0; k < 400; k++)
                {
                  const double d = d0 + (d1 - d0) * k / 400.0 * (1 - 1e-9);
                  ck_assert_msg (bw_jar_curve (&s, d) > target, "%s: %g NTU already at %g",
                                 where, bw_jar_curve (&s, d), d);
                }
              ck_assert_msg (fabs (bw_jar_curve (&s, d1) - target) <= 1e-6 * (1 + target),
                             "%s: %g NTU at the dose found", where, bw_jar_curve (&s, d1));
            }
        }
    }
  g_rand_free (rng);
  ck_assert_uint_gt (found, 0);
  ck_assert_uint_gt (none, 0);
}
END_TEST

/* --- zeta potential: inverting Henry's equation --- */

START_TEST (test_grid_zeta_inversion)
{
  /* Mobility -1e-6 to 1e-6 m2/(V s) (the accepted range; log-spaced magnitudes 1e-12-1e-6 of
   * both signs, and 0), radius 1 nm-1 cm, ionic strength 1e-3-5000 mol/m3, 0-40 degC, all three
   * models. The zeta found, put back into Henry (1931) U = 2 eps zeta f / (3 eta), gives the
   * mobility to round-off. */
  static const char *const fields[] = { "mobility", NULL };
  const int nu = 13, na = 8, ni = 8;

  for (int m = 0; m <= BW_ZETA_HENRY; m++)
    for (int t = 0; t < 2; t++)
      for (int iu = 0; iu < 2 * nu + 1; iu++)
        for (int ia = 0; ia < na; ia++)
          for (int ii = 0; ii < ni; ii++)
            {
              const BwWater w = water_at (t * 40.0);
              const double mob = iu == nu ? 0.0
                                          : (iu < nu ? -1 : 1)
                                              * log_point (1e-12, 1e-6, abs (iu - nu) - 1, nu);
              const double a = log_point (1e-9, 1e-2, ia, na);
              const double ion = log_point (1e-3, 5000.0, ii, ni);
              BwZetaResult r;
              g_autoptr (GError) error = NULL;
              g_autofree char *where = g_strdup_printf ("%s U = %g, a = %g m, I = %g mol/m3",
                                                        bw_zeta_model_name ((BwZetaModel) m), mob,
                                                        a, ion);

              if (!bw_zeta_from_mobility (mob, (BwZetaModel) m, a, ion, &w, &r, &error))
                {
                  check_failure (&error, fields, where);
                  ck_abort_msg ("%s: refused inside the accepted range", where);
                }
              ck_assert_msg (isfinite (r.zeta_V) && isfinite (r.kappa_a)
                               && isfinite (r.debye_length_m) && r.debye_length_m > 0,
                             "%s", where);
              ck_assert_msg (r.henry_function >= 1.0 && r.henry_function <= 1.5, "%s: f = %g",
                             where, r.henry_function);
              {
                const double back = 2.0 * w.relative_permittivity * BW_EPSILON_0 * r.zeta_V
                                    * r.henry_function / (3.0 * w.dynamic_viscosity_Pa_s);
                if (mob == 0.0)
                  ck_assert (r.zeta_V == 0.0);
                else
                  check_residual (back, mob, 1e-14, "%s", where);
              }
            }
  {
    const struct
    {
      double mob, a, ion;
      const char *field;
    } bad[] = {
      { 1.000001e-6, 1e-6, 1.0, "mobility" }, { -1.000001e-6, 1e-6, 1.0, "mobility" },
      { NAN, 1e-6, 1.0, "mobility" },          { 1e-8, -1e-9, 1.0, "radius" },
      { 1e-8, 0.0100001, 1.0, "radius" },      { 1e-8, 1e-6, -1.0, "ionic strength" },
      { 1e-8, 1e-6, 5000.01, "ionic strength" }, { 1e-8, 0.0, 1.0, "radius" },
      { 1e-8, 1e-6, 0.0, "ionic strength" },
    };
    const BwWater w = water_at (20.0);
    for (guint i = 0; i < G_N_ELEMENTS (bad); i++)
      {
        BwZetaResult r;
        g_autoptr (GError) e = NULL;
        /* Henry's model, which needs both the radius and the ionic strength. */
        gboolean ok = bw_zeta_from_mobility (bad[i].mob, BW_ZETA_HENRY, bad[i].a, bad[i].ion, &w,
                                             &r, &e);
        check_fails_naming (ok, e, bad[i].field, "U = %g, a = %g, I = %g", bad[i].mob, bad[i].a,
                            bad[i].ion);
      }
  }
}
END_TEST

/* --- the Argaman-Kaufman best G (golden-section search) --- */

START_TEST (test_grid_flocmodel_best_gradient)
{
  /* K_A 1e-6-1e-3, K_B 1e-9-1e-5 s, total time 60 s-2 h, 1-1000 compartments. The search stops
   * at a width of 1e-10 in ln G (bw-flocmodel.c), so 1e-4 either side of the G found the
   * remaining fraction is no lower (a minimum), allowing 1e-14 of round-off. */
  static const char *const fields[] = { "velocity gradient", "breakup constant", NULL };
  const int nk = 8, nt = 6;
  const guint comps[] = { 1, 3, 30, 1000 };

  for (int ia = 0; ia < nk; ia++)
    for (int ib = 0; ib < nk; ib++)
      for (int it = 0; it < nt; it++)
        for (guint ic = 0; ic < G_N_ELEMENTS (comps); ic++)
          {
            BwFlocKinetics k;
            BwFlocModelResult r, lo, hi;
            double g = -1;
            const double t = log_point (60.0, 7200.0, it, nt);
            g_autoptr (GError) error = NULL;
            g_autofree char *where = NULL;

            k.aggregation_constant = log_point (1e-6, 1e-3, ia, nk);
            k.breakup_constant_s = log_point (1e-9, 1e-5, ib, nk);
            where = g_strdup_printf ("K_A = %g, K_B = %g s, t = %g s, %u compartments",
                                     k.aggregation_constant, k.breakup_constant_s, t, comps[ic]);
            if (!bw_flocmodel_best_gradient (&k, t, comps[ic], &g, &r, &error))
              {
                check_failure (&error, fields, where);
                continue;
              }
            ck_assert_msg (isfinite (g) && g > 0
                             && g <= k.aggregation_constant / k.breakup_constant_s,
                           "%s: G = %g", where, g);
            ck_assert_msg (isfinite (r.remaining_fraction) && r.remaining_fraction > 0
                             && r.remaining_fraction <= 1, "%s: %g", where, r.remaining_fraction);
            ck_assert (bw_flocmodel_equal (&k, g * (1 - 1e-4), t, comps[ic], &lo, NULL));
            ck_assert (bw_flocmodel_equal (&k, g * (1 + 1e-4), t, comps[ic], &hi, NULL)
                       || g * (1 + 1e-4) > k.aggregation_constant / k.breakup_constant_s);
            ck_assert_msg (lo.remaining_fraction >= r.remaining_fraction * (1 - 1e-14),
                           "%s: lower G leaves fewer (%.17g < %.17g)", where,
                           lo.remaining_fraction, r.remaining_fraction);
            ck_assert_msg (g * (1 + 1e-4) > k.aggregation_constant / k.breakup_constant_s
                             || hi.remaining_fraction >= r.remaining_fraction * (1 - 1e-14),
                           "%s: higher G leaves fewer (%.17g < %.17g)", where,
                           hi.remaining_fraction, r.remaining_fraction);
          }
  {
    BwFlocKinetics k;
    BwFlocModelResult r;
    double g;
    g_autoptr (GError) e = NULL;
    gboolean ok;

    bw_floc_kinetics_init (&k);
    k.breakup_constant_s = 0.0;
    ok = bw_flocmodel_best_gradient (&k, 1800.0, 3, &g, &r, &e);
    check_fails_naming (ok, e, "breakup constant", "K_B = 0");
    bw_floc_kinetics_init (&k);
    ok = bw_flocmodel_best_gradient (&k, 0.0, 3, &g, &r, &e);
    check_fails_naming (ok, e, "time", "t = 0");
    ok = bw_flocmodel_best_gradient (&k, 1800.0, 0, &g, &r, &e);
    check_fails_naming (ok, e, "compartments", "0 compartments");
    ok = bw_flocmodel_best_gradient (&k, 1800.0, BW_FLOCMODEL_MAX_COMPARTMENTS + 1, &g, &r, &e);
    check_fails_naming (ok, e, "compartments", "too many compartments");
    k.aggregation_constant = 0.0;
    ok = bw_flocmodel_best_gradient (&k, 1800.0, 3, &g, &r, &e);
    check_fails_naming (ok, e, "aggregation constant", "K_A = 0");
  }
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("grid");
  TCase *tc = tcase_create ("solvers");

  tcase_set_timeout (tc, 60);
  tcase_add_test (tc, test_grid_water_properties);
  tcase_add_test (tc, test_grid_settling_drag_balance);
  tcase_add_test (tc, test_grid_settling_outside);
  tcase_add_test (tc, test_grid_floc_paddle_solves);
  tcase_add_test (tc, test_grid_floc_baffle_spacing);
  tcase_add_test (tc, test_grid_floc_turbine_speed);
  tcase_add_test (tc, test_grid_floc_solves_outside);
  tcase_add_test (tc, test_grid_mixing_inversions);
  tcase_add_test (tc, test_grid_sedimentation_inversions);
  tcase_add_test (tc, test_grid_type2_time_for_removal);
  tcase_add_test (tc, test_grid_jar_target_dose);
  tcase_add_test (tc, test_grid_zeta_inversion);
  tcase_add_test (tc, test_grid_flocmodel_best_gradient);
  suite_add_tcase (s, tc);
  return s;
}
