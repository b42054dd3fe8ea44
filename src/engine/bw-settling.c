/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-settling.c: terminal settling velocity of a discrete sphere (Type I settling). */
#include "config.h"

#include "engine/bw-settling.h"

#include <math.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"

/* Largest diameter accepted, m. Beyond 0.1 m a "particle" is no longer a settling solid in a
 * treatment basin, and the drag correlations leave their range long before. */
#define MAX_DIAMETER_M 0.1

/* Stokes' law is used directly below this Stokes Reynolds number; both correlations are then
 * within ~1.3 % of Stokes drag (Davis: 3/sqrt(Re) against 24/Re gives 1.25 % at Re = 0.01;
 * Clift-Gauvin: 0.15 Re^0.687 gives 0.6 %). The same cut-off as fluids.drag.v_terminal. */
#define STOKES_RE_LIMIT 0.01

/* Below this Stokes Reynolds number the inputs are refused: 24/Re would overflow a double.
 * (A 1 nm sphere in water still has Re ~ 1e-12.) */
#define MIN_STOKES_RE 1e-300

/* Root finding in x = ln Re: stop when the step is below this (a relative change in Re of
 * about 1e-12), or give up after MAX_ITERATIONS. */
#define X_TOLERANCE 1e-12
#define MAX_ITERATIONS 100

/* Halvings of the lower bracket end before giving up. A solve needs at most ~26 (its upper end is
 * at most 2e5 and its root above 0.005); only the Re quoted in an out-of-range message, where the
 * upper end can be huge, may run out, and that message then omits the Re. */
#define MAX_BRACKET_STEPS 200

/* Upper limit of validity of each correlation, as a particle Reynolds number.
 * Clift-Gauvin: stated up to 3e5 (Clift, Grace & Weber 1978, Ch. 5); we stop at 2e5, below the
 * drag crisis of a smooth sphere. Davis (2010) Eq. 10-11: stated for 0.5 < Re < 1e4. */
static double
correlation_re_max (BwDragCorrelation drag)
{
  return drag == BW_DRAG_DAVIS ? 1.0e4 : 2.0e5;
}

static gboolean
correlation_is_valid (BwDragCorrelation drag)
{
  return drag == BW_DRAG_CLIFT_GAUVIN || drag == BW_DRAG_DAVIS;
}

/*
 * F(Re) = Cd(Re) Re^2, dimensionless, and its logarithmic slope S = dlnF/dlnRe (between 1 and
 * about 3).
 * Multiplying Cd by Re^2 removes the 1/Re poles, so F is finite for every finite Re >= 0.
 * Clift & Gauvin (1970), in Clift, Grace & Weber (1978) "Bubbles, Drops and Particles", Ch. 5:
 *   Cd = 24/Re (1 + 0.15 Re^0.687) + 0.42 / (1 + 42500 Re^-1.16)
 *   F  = 24 Re + 3.6 Re^1.687 + 0.42 Re^2 / (1 + 42500 Re^-1.16)
 * Davis (2010) "Water and Wastewater Engineering", Eq. 10-11:
 *   Cd = 24/Re + 3/sqrt(Re) + 0.34
 *   F  = 24 Re + 3 Re^1.5 + 0.34 Re^2
 * Every term of F rises with Re, so F is strictly increasing: one root, found by bracketing.
 */
static double
drag_force_group (BwDragCorrelation drag, double re, double *slope)
{
  double f, re_dfdre;

  if (drag == BW_DRAG_DAVIS)
    {
      double s = sqrt (re);

      f = 24.0 * re + 3.0 * re * s + 0.34 * re * re;
      re_dfdre = 24.0 * re + 4.5 * re * s + 0.68 * re * re;
    }
  else
    {
      double p = pow (re, 1.687);
      double h = 1.0 + 42500.0 * pow (re, -1.16);  /* >= 1 */
      double newton_part = 0.42 * re * re / h;

      f = 24.0 * re + 3.6 * p + newton_part;
      /* Re d/dRe [Re^2 / h] = (Re^2 / h) (2 + 1.16 (h - 1) / h) */
      re_dfdre = 24.0 * re + 1.687 * 3.6 * p + newton_part * (2.0 + 1.16 * (h - 1.0) / h);
    }

  if (slope != NULL)
    *slope = f > 0.0 ? re_dfdre / f : 1.0;
  return f;
}

/*
 * Drag coefficient of a smooth sphere, dimensionless, at particle Reynolds number RE (> 0),
 * by the correlations quoted at drag_force_group. A RE that is not a positive finite number has
 * no drag coefficient: the function then returns 0 rather than NaN; results too large for a
 * double (RE below ~1e-307) are capped at G_MAXDOUBLE.
 */
double
bw_drag_coefficient (BwDragCorrelation drag, double re)
{
  double cd;

  if (!(re > 0.0) || !isfinite (re))
    return 0.0;
  if (drag == BW_DRAG_DAVIS)
    cd = 24.0 / re + 3.0 / sqrt (re) + 0.34;
  else
    cd = 24.0 / re * (1.0 + 0.15 * pow (re, 0.687)) + 0.42 / (1.0 + 42500.0 * pow (re, -1.16));
  return isfinite (cd) ? cd : G_MAXDOUBLE;
}

/* Regime by the particle Reynolds number (common practice; e.g. Perry's Chemical Engineers'
 * Handbook gives the Newton range as 1000 < Re < 2e5, from memory). */
static BwSettlingRegime
regime_for (double re)
{
  if (re < 1.0)
    return BW_SETTLING_REGIME_STOKES;
  if (re < 1000.0)
    return BW_SETTLING_REGIME_TRANSITIONAL;
  return BW_SETTLING_REGIME_NEWTON;
}

/*
 * Solves F(Re) = TARGET for Re, with F increasing (drag_force_group). The root lies in
 * (0, RE_HI] because F(RE_HI) >= TARGET is known to the caller. Newton's method on
 * g(x) = ln F(e^x) - ln TARGET, x = ln Re, kept inside a shrinking bracket [a, b] with
 * g(a) < 0 <= g(b); a step that would leave the bracket is replaced by bisection. g is smooth with
 * slope 1..3, so Newton usually ends in 3-5 steps; bisection guarantees convergence.
 * Returns FALSE when no root was found within the iteration budget.
 */
static gboolean
solve_reynolds (BwDragCorrelation drag, double target, double re_hi, double *re_out,
                int *iterations)
{
  double ln_target = log (target);
  double a, b, x, gx, slope;
  int steps;

  /* Lower bracket end: halve Re until F(Re) < TARGET (F -> 0 as Re -> 0); the last point
   * that was not below becomes the upper end, so the bracket spans a factor of 2 in Re. */
  b = log (re_hi);
  a = b;
  for (steps = 0; steps < MAX_BRACKET_STEPS; steps++)
    {
      a -= G_LN2;
      if (log (drag_force_group (drag, exp (a), NULL)) < ln_target)
        break;
      b = a;
    }
  if (steps == MAX_BRACKET_STEPS)
    return FALSE;

  x = b;
  gx = log (drag_force_group (drag, exp (x), &slope)) - ln_target;
  for (int it = 1; it <= MAX_ITERATIONS; it++)
    {
      double step;

      if (gx < 0.0)
        a = x;
      else
        b = x;

      /* Converged when the Newton correction from here is negligible (this also ends the search
       * when round-off leaves x on a bracket end). */
      step = -gx / slope;
      if (fabs (step) < X_TOLERANCE || b - a < X_TOLERANCE)
        {
          *re_out = exp (fabs (step) < X_TOLERANCE ? x + step : x);
          *iterations = it;
          return isfinite (*re_out) && *re_out > 0.0;
        }

      x += step;
      if (!(x > a && x < b))
        x = 0.5 * (a + b);
      gx = log (drag_force_group (drag, exp (x), &slope)) - ln_target;
    }
  return FALSE;
}

static gboolean
check_diameter (double diameter_m, GError **error)
{
  if (!bw_check_positive (diameter_m, BW_ ("diameter"), error))
    return FALSE;
  if (diameter_m > MAX_DIAMETER_M)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("diameter: %g m is larger than the %g m this settling model accepts "
                   "(a discrete particle in a treatment basin)"), diameter_m, MAX_DIAMETER_M);
      return FALSE;
    }
  return TRUE;
}

/*
 * Terminal velocity of a sphere from the steady force balance, drag = weight - buoyancy:
 *   Cd (pi d^2/4) rho_f v^2 / 2 = (pi d^3/6) (rho_p - rho_f) g
 * (Clift, Grace & Weber 1978, Ch. 5; Davis 2010 Eq. 10-10: v = sqrt(4 g (rho_p - rho_f) d /
 * (3 Cd rho_f))). With Re = rho_f v d / mu this has no unknown on the right:
 *   Cd Re^2 = 4 g d^3 rho_f (rho_p - rho_f) / (3 mu^2) = 24 Re_s,
 * Re_s being the Reynolds number of the Stokes velocity (Stokes 1851, Cd = 24/Re):
 *   v_s = g (rho_p - rho_f) d^2 / (18 mu).
 * Since Cd Re^2 >= 24 Re for both correlations, the solution satisfies Re <= Re_s.
 * Units: d in m, densities in kg/m3, mu in Pa s, g in m/s2; v in m/s.
 */
gboolean
bw_settling_velocity_in_fluid (double diameter_m, double particle_density_kg_m3,
                               double fluid_density_kg_m3, double viscosity_Pa_s,
                               double gravity_m_s2, BwDragCorrelation drag,
                               BwSettlingResult *out, GError **error)
{
  BwSettlingResult r = { 0 };
  double delta_rho, re_s, target, re_max, re;
  int iterations = 0;

  g_return_val_if_fail (out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!correlation_is_valid (drag))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("drag correlation: unknown value %d"), (int) drag);
      return FALSE;
    }
  if (!check_diameter (diameter_m, error)
      || !bw_check_positive (particle_density_kg_m3, BW_ ("particle density"), error)
      || !bw_check_positive (fluid_density_kg_m3, BW_ ("fluid density"), error)
      || !bw_check_positive (viscosity_Pa_s, BW_ ("viscosity"), error)
      || !bw_check_positive (gravity_m_s2, BW_ ("gravity"), error))
    return FALSE;
  if (!(particle_density_kg_m3 > fluid_density_kg_m3))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("particle density: %g kg/m3 does not exceed the fluid density %g kg/m3 "
                   "(specific gravity %g); the particle does not settle"),
                   particle_density_kg_m3, fluid_density_kg_m3,
                   particle_density_kg_m3 / fluid_density_kg_m3);
      return FALSE;
    }

  delta_rho = particle_density_kg_m3 - fluid_density_kg_m3;
  r.stokes_velocity_m_s = gravity_m_s2 * delta_rho * diameter_m * diameter_m
                          / (18.0 * viscosity_Pa_s);
  re_s = fluid_density_kg_m3 * r.stokes_velocity_m_s * diameter_m / viscosity_Pa_s;
  target = 24.0 * re_s;
  re_max = correlation_re_max (drag);

  if (!(re_s >= MIN_STOKES_RE))
    {
      /* d^2 or d^3 (nearly) underflowed: the inputs are far outside any physical scale, and
       * Cd = 24/Re would overflow. */
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("diameter: %g m is too small to evaluate (the Stokes Reynolds number "
                   "underflows)"), diameter_m);
      return FALSE;
    }

  if (re_s < STOKES_RE_LIMIT)
    {
      /* Stokes' law directly (Stokes 1851); its drag is Cd = 24/Re by construction. */
      r.velocity_m_s = r.stokes_velocity_m_s;
      r.reynolds = re_s;
      r.drag_coefficient = 24.0 / re_s;
      r.regime = regime_for (re_s);
      r.iterations = 0;
      *out = r;
      return TRUE;
    }

  /* F is increasing, so the solution exceeds the correlation's range exactly when the target
   * exceeds F(Re_max). The test also catches a target that overflowed to infinity. */
  if (!(target <= drag_force_group (drag, re_max, NULL)))
    {
      if (isfinite (target)
          && solve_reynolds (drag, target, re_s, &re, &iterations))
        g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                     BW_ ("diameter: %g m settles at Re = %.3g, beyond the %s correlation's "
                     "validity (Re < %g)"), diameter_m, re, bw_drag_correlation_name (drag),
                     re_max);
      else
        g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                     BW_ ("diameter: %g m settles beyond the %s correlation's validity (Re < %g)"),
                     diameter_m, bw_drag_correlation_name (drag), re_max);
      return FALSE;
    }

  if (!solve_reynolds (drag, target, MIN (re_s, re_max), &re, &iterations))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NO_CONVERGENCE,
                   BW_ ("diameter: the settling velocity of a %g m sphere did not converge "
                   "within %d iterations (%s correlation)"), diameter_m, MAX_ITERATIONS,
                   bw_drag_correlation_name (drag));
      return FALSE;
    }

  r.reynolds = re;
  r.velocity_m_s = re * viscosity_Pa_s / (fluid_density_kg_m3 * diameter_m);
  r.drag_coefficient = bw_drag_coefficient (drag, re);
  r.regime = regime_for (re);
  r.iterations = iterations;

  if (!isfinite (r.velocity_m_s) || !(r.drag_coefficient > 0.0))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE,
                   BW_ ("diameter: the settling velocity of a %g m sphere is not a finite number"),
                   diameter_m);
      return FALSE;
    }
  *out = r;
  return TRUE;
}

gboolean
bw_settling_velocity (double diameter_m, double specific_gravity, double temperature_K,
                      BwDragCorrelation drag, BwSettlingResult *out, GError **error)
{
  BwWater water;

  g_return_val_if_fail (out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!check_diameter (diameter_m, error)
      || !bw_check_finite (specific_gravity, BW_ ("specific gravity"), error))
    return FALSE;
  if (!(specific_gravity > 1.0))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("specific gravity: %g is not above 1; a particle no denser than water "
                   "does not settle"), specific_gravity);
      return FALSE;
    }
  if (!bw_water_properties (temperature_K, &water, error))
    return FALSE;

  return bw_settling_velocity_in_fluid (diameter_m, specific_gravity * water.density_kg_m3,
                                        water.density_kg_m3, water.dynamic_viscosity_Pa_s,
                                        BW_GRAVITY_M_S2, drag, out, error);
}

const char *
bw_settling_regime_name (BwSettlingRegime regime)
{
  switch (regime)
    {
    case BW_SETTLING_REGIME_STOKES:
      return "stokes";
    case BW_SETTLING_REGIME_TRANSITIONAL:
      return "transitional";
    case BW_SETTLING_REGIME_NEWTON:
      return "newton";
    default:
      return "unknown";
    }
}

const char *
bw_drag_correlation_name (BwDragCorrelation drag)
{
  switch (drag)
    {
    case BW_DRAG_CLIFT_GAUVIN:
      return "clift-gauvin";
    case BW_DRAG_DAVIS:
      return "davis";
    default:
      return "unknown";
    }
}

/* Parses the names bw_drag_correlation_name gives, ignoring ASCII case. */
gboolean
bw_drag_correlation_from_name (const char *name, BwDragCorrelation *out)
{
  static const BwDragCorrelation all[] = { BW_DRAG_CLIFT_GAUVIN, BW_DRAG_DAVIS };

  if (name == NULL)
    return FALSE;
  for (gsize i = 0; i < G_N_ELEMENTS (all); i++)
    if (g_ascii_strcasecmp (name, bw_drag_correlation_name (all[i])) == 0)
      {
        if (out != NULL)
          *out = all[i];
        return TRUE;
      }
  return FALSE;
}
