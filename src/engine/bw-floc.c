/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-floc.c: flocculator stages (paddle, vertical turbine, baffled channel) and tapered trains. */
#include "config.h"

#include "engine/bw-floc.h"

#include <math.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"

/* Monotone one-dimensional solves work on the logarithm of the unknown: stop when the bracket is
 * narrower than this relative width (the target G is then met to a few 1e-14), or give up after
 * MAX_BISECTIONS halvings or MAX_EXPANSIONS doublings of the bracket. */
#define REL_TOLERANCE 1e-14
#define MAX_BISECTIONS 200
#define MAX_EXPANSIONS 200

/* Search range of the baffle spacing solve, m: from a slot a knife could not pass to a channel
 * wider than any basin. */
#define SPACING_MIN_M 1e-4
#define SPACING_MAX_M 1e3

/* Search range of the blade length solve, m. */
#define BLADE_LENGTH_MIN_M 1e-6
#define BLADE_LENGTH_MAX_M 1e4

static gboolean
check_count (guint value, guint lo, guint hi, const char *field, GError **error)
{
  if (value >= lo && value <= hi)
    return TRUE;
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
               BW_ ("%s: %u is outside the valid range %u to %u"), field, value, lo, hi);
  return FALSE;
}

/* --- paddles --- */

void
bw_paddle_init (BwPaddle *paddle)
{
  g_return_if_fail (paddle != NULL);

  memset (paddle, 0, sizeof *paddle);
  paddle->shaft = BW_SHAFT_HORIZONTAL;
  paddle->n_wheels = 1;
  paddle->drag_coefficient = BW_PADDLE_CD_FROM_ASPECT;
  paddle->relative_velocity_factor = BW_PADDLE_DEFAULT_RELATIVE_VELOCITY_FACTOR;
}

/*
 * Drag coefficient of a flat blade moving broadside on, dimensionless, from its aspect ratio
 * a = longer side / shorter side. Davis (2010) "Water and Wastewater Engineering" Table 6-7 (seen;
 * after Kawamura 2000, MWH 2005, Peavy et al. 1985) gives three points: Cd = 1.20 for L/W < 5,
 * 1.50 at L/W = 20 and 1.90 for L/W > 20. The table does not say how to join them. Here:
 *   a <= 5:       1.20 (the table's value below 5)
 *   5 < a <= 20:  linear in a, 1.20 -> 1.50
 *   a > 20:       1.90 - 0.40 (20 / a), linear in 1/a from 1.50 at a = 20 to 1.90 as a -> infinity.
 * The last segment reads the table's "> 20" row as the long-plate limit, which keeps Cd
 * continuous: read literally as a step at 20, Cd would jump by 27 % for a small change in blade
 * length. The function rises with a, and Cd x length rises with the length (the blade length
 * solve needs that).
 */
double
bw_paddle_drag_coefficient (double blade_length_m, double blade_width_m)
{
  double a;

  if (!(blade_length_m > 0.0) || !(blade_width_m > 0.0) || !isfinite (blade_length_m)
      || !isfinite (blade_width_m))
    return 0.0;
  a = blade_length_m > blade_width_m ? blade_length_m / blade_width_m
                                     : blade_width_m / blade_length_m;
  if (a <= 5.0)
    return 1.20;
  if (a <= 20.0)
    return 1.20 + (a - 5.0) * (1.50 - 1.20) / (20.0 - 5.0);
  return 1.90 - (1.90 - 1.50) * (20.0 / a);
}

/* Checks the reel on its own: counts, sizes, and that its blades neither cross the shaft nor
 * overlap one another. */
static gboolean
check_paddle (const BwPaddle *p, GError **error)
{
  if ((guint) p->shaft >= BW_N_SHAFT_ORIENTATIONS)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("shaft orientation: unknown value %d"), (int) p->shaft);
      return FALSE;
    }
  if (!check_count (p->n_wheels, 1, 1000, BW_ ("paddle wheels"), error)
      || !check_count (p->arms_per_wheel, 1, 1000, BW_ ("arms per wheel"), error)
      || !check_count (p->n_rings, 1, BW_PADDLE_MAX_RINGS, BW_ ("blades per arm"), error)
      || !bw_check_positive (p->blade_length_m, BW_ ("blade length"), error)
      || !bw_check_positive (p->blade_width_m, BW_ ("blade width"), error)
      || !bw_check_positive (p->speed_rev_s, BW_ ("rotational speed"), error)
      || !bw_check_nonnegative (p->drag_coefficient, BW_ ("drag coefficient"), error)
      || !bw_check_finite (p->relative_velocity_factor, BW_ ("relative velocity factor"), error))
    return FALSE;
  if (!(p->relative_velocity_factor > 0.0 && p->relative_velocity_factor <= 1.0))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("relative velocity factor: must be above 0 and at most 1 (got %g): a blade "
                   "cannot move faster relative to the water than it moves itself"),
                   p->relative_velocity_factor);
      return FALSE;
    }
  for (guint i = 0; i < p->n_rings; i++)
    {
      const double r = p->ring_radius_m[i];
      if (!bw_check_positive (r, BW_ ("blade radius"), error))
        return FALSE;
      if (r - p->blade_width_m / 2.0 <= 0.0)
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
                       BW_ ("blade radius: %g m with a %g m wide blade reaches across the shaft "
                       "(the radius must exceed half the blade width)"), r, p->blade_width_m);
          return FALSE;
        }
      for (guint k = 0; k < i; k++)
        if (fabs (r - p->ring_radius_m[k]) < p->blade_width_m)
          {
            g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
                         BW_ ("blade radius: blades at %g m and %g m are closer than the blade width "
                         "%g m, so they overlap"), p->ring_radius_m[k], r, p->blade_width_m);
            return FALSE;
          }
    }
  return TRUE;
}

/*
 * Davis (2010) Eq. 6-20 (seen), after Camp (1955): each blade dissipates
 *   P = Cd A rho v_r^3 / 2,   v_r = k v_p = k 2 pi r N
 * P in W, A = length x width in m2, rho in kg/m3, v in m/s, r (shaft to blade centreline) in m,
 * N in rev/s, k the relative velocity factor (the water turns with the reel at (1 - k) v_p).
 */
gboolean
bw_paddle_evaluate (const BwPaddle *paddle, const BwWater *water, BwPaddleResult *out,
                    GError **error)
{
  double cd, area, sum_v3 = 0.0, r_max = 0.0, p, per_ring;
  guint per_radius;

  g_return_val_if_fail (paddle != NULL && water != NULL && out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!bw_water_check (water, error) || !check_paddle (paddle, error))
    return FALSE;

  cd = paddle->drag_coefficient > 0.0
         ? paddle->drag_coefficient
         : bw_paddle_drag_coefficient (paddle->blade_length_m, paddle->blade_width_m);
  area = paddle->blade_length_m * paddle->blade_width_m;
  per_radius = paddle->n_wheels * paddle->arms_per_wheel;
  for (guint i = 0; i < paddle->n_rings; i++)
    {
      const double vr = paddle->relative_velocity_factor * 2.0 * G_PI * paddle->ring_radius_m[i]
                        * paddle->speed_rev_s;
      sum_v3 += vr * vr * vr;
      r_max = MAX (r_max, paddle->ring_radius_m[i]);
    }
  per_ring = cd * area * water->density_kg_m3 / 2.0;
  p = per_radius * per_ring * sum_v3;
  if (!bw_check_result (p, BW_ ("rotational speed"), BW_ ("paddle power"), error))
    return FALSE;

  out->n_blades = per_radius * paddle->n_rings;
  out->blade_area_m2 = out->n_blades * area;
  out->drag_coefficient = cd;
  out->tip_speed_m_s = 2.0 * G_PI * r_max * paddle->speed_rev_s;
  out->edge_speed_m_s = 2.0 * G_PI * (r_max + paddle->blade_width_m / 2.0) * paddle->speed_rev_s;
  out->relative_velocity_m_s = paddle->relative_velocity_factor * out->tip_speed_m_s;
  out->power_W = p;
  out->swept_radius_m = r_max + paddle->blade_width_m / 2.0;
  return bw_check_result (out->blade_area_m2, BW_ ("blade length"), BW_ ("blade area"), error)
         && bw_check_result (out->edge_speed_m_s, BW_ ("rotational speed"), BW_ ("tip speed"), error);
}

/* --- baffled channels --- */

void
bw_baffled_channel_init (BwBaffledChannel *channel, BwBaffleLayout layout)
{
  g_return_if_fail (channel != NULL);

  memset (channel, 0, sizeof *channel);
  channel->layout = layout;
  channel->turn_loss_k = layout == BW_BAFFLE_OVER_AND_UNDER ? BW_BAFFLE_TURN_K_OVER_AND_UNDER
                                                            : BW_BAFFLE_TURN_K_AROUND_THE_END;
  channel->manning_n = BW_MANNING_N_CONCRETE;
}

/*
 * Head loss of a baffled channel and its G (Camp & Stein 1943):
 *   friction (Manning, SI):  h_f = L (n v)^2 / R^(4/3)   (v = R^(2/3) S^(1/2) / n solved for S)
 *   turns:                   h_t = (passes - 1) K v^2 / (2 g)
 *   G = sqrt (g h / (nu t)),  h = h_f + h_t,  t = V / Q
 * with L the path length (m), n Manning's n (s/m^(1/3)), v the mean velocity in a pass (m/s),
 * R the hydraulic radius of a pass (m), K velocity heads per 180 degree turn, g in m/s2.
 * Around-the-end: section s x d with an open top, wetted perimeter s + 2d, path passes x length.
 * Over-and-under: section s x B (B the baffle length), closed on all four sides by the two
 * baffles and the side walls, wetted perimeter 2 (s + B), path passes x depth.
 * The turn loss is charged on the pass velocity; the velocity through a narrower slot is not
 * modelled (give a larger K for narrow slots; Haarhoff 1998 ties K to the slot width).
 */
gboolean
bw_baffled_channel_evaluate (const BwBaffledChannel *channel, double flow_m3_s,
                             const BwWater *water, BwBaffledResult *out, GError **error)
{
  const BwBaffledChannel *c = channel;
  double area, perimeter, r, path, v, hf, ht, volume;
  BwHydraulicResult hyd;

  g_return_val_if_fail (channel != NULL && water != NULL && out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if ((guint) c->layout >= BW_N_BAFFLE_LAYOUTS)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("baffle layout: unknown value %d"), (int) c->layout);
      return FALSE;
    }
  if (!bw_water_check (water, error)
      || !bw_check_positive (flow_m3_s, BW_ ("flow"), error)
      || !check_count (c->n_passes, 1, 10000, BW_ ("passes"), error)
      || !bw_check_positive (c->spacing_m, BW_ ("baffle spacing"), error)
      || !bw_check_positive (c->water_depth_m, BW_ ("water depth"), error)
      || !bw_check_positive (c->pass_length_m, BW_ ("pass length"), error)
      || !bw_check_nonnegative (c->turn_loss_k, BW_ ("turn loss coefficient"), error)
      || !bw_check_nonnegative (c->manning_n, BW_ ("manning n"), error))
    return FALSE;

  if (c->layout == BW_BAFFLE_AROUND_THE_END)
    {
      area = c->spacing_m * c->water_depth_m;
      perimeter = c->spacing_m + 2.0 * c->water_depth_m;
      path = c->n_passes * c->pass_length_m;
    }
  else
    {
      area = c->spacing_m * c->pass_length_m;
      perimeter = 2.0 * (c->spacing_m + c->pass_length_m);
      path = c->n_passes * c->water_depth_m;
    }
  r = area / perimeter;
  v = flow_m3_s / area;
  hf = path * (c->manning_n * v) * (c->manning_n * v) / pow (r, 4.0 / 3.0);
  ht = (c->n_passes - 1) * c->turn_loss_k * v * v / (2.0 * BW_GRAVITY_M_S2);
  volume = c->n_passes * c->spacing_m * c->water_depth_m * c->pass_length_m;
  if (!bw_check_result (v, BW_ ("baffle spacing"), BW_ ("channel velocity"), error)
      || !bw_check_result (hf + ht, BW_ ("baffle spacing"), BW_ ("head loss"), error)
      || !bw_check_result (volume, BW_ ("pass length"), BW_ ("volume"), error))
    return FALSE;
  if (!(hf + ht > 0.0))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("manning n: with no friction and no turn losses the channel loses no head, "
                   "so it does no mixing"));
      return FALSE;
    }
  if (!bw_hydraulic_mixer_evaluate (hf + ht, flow_m3_s, volume, water, &hyd, error))
    return FALSE;

  out->volume_m3 = volume;
  out->detention_s = hyd.detention_s;
  out->velocity_m_s = v;
  out->hydraulic_radius_m = r;
  out->path_length_m = path;
  out->n_turns = c->n_passes - 1;
  out->friction_loss_m = hf;
  out->turn_loss_m = ht;
  out->headloss_m = hf + ht;
  out->power_W = hyd.power_W;
  out->G_per_s = hyd.G_per_s;
  out->Gt = hyd.Gt;
  return TRUE;
}

/* --- stages --- */

static gboolean
compartment_volume (const BwCompartment *c, double *volume_m3, GError **error)
{
  if (!bw_check_positive (c->length_m, BW_ ("compartment length"), error)
      || !bw_check_positive (c->width_m, BW_ ("compartment width"), error)
      || !bw_check_positive (c->depth_m, BW_ ("compartment depth"), error))
    return FALSE;
  *volume_m3 = c->length_m * c->width_m * c->depth_m;
  return bw_check_result (*volume_m3, BW_ ("compartment length"), BW_ ("volume"), error);
}

/* The reel must fit its compartment: the swept circle inside the plane the blades turn in, and
 * the wheels' blade lengths along the shaft. Horizontal shafts lie across the flow: the blades
 * turn in the length x depth plane and the shaft runs along the width. Vertical shafts: the
 * length x width plane, the shaft along the depth. */
static gboolean
check_paddle_fit (const BwPaddle *p, const BwCompartment *c, GError **error)
{
  const gboolean horizontal = p->shaft == BW_SHAFT_HORIZONTAL;
  const double a = c->length_m;
  const double b = horizontal ? c->depth_m : c->width_m;
  const double along = horizontal ? c->width_m : c->depth_m;
  double r_max = 0.0, swept, half;

  for (guint i = 0; i < p->n_rings; i++)
    r_max = MAX (r_max, p->ring_radius_m[i]);
  swept = r_max + p->blade_width_m / 2.0;
  half = MIN (a, b) / 2.0;
  if (swept > half)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
                   BW_ ("blade radius: the outermost blade (%g m + half its %g m width) reaches %g m "
                   "from the shaft, beyond the compartment (half its %s is %g m)"),
                   r_max, p->blade_width_m, swept,
                   a <= b ? BW_ ("length") : (horizontal ? BW_ ("depth") : BW_ ("width")), half);
      return FALSE;
    }
  if (p->n_wheels * p->blade_length_m > along)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
                   BW_ ("blade length: %u wheel(s) of %g m blades need %g m along the shaft; the "
                   "compartment %s is %g m"), p->n_wheels, p->blade_length_m,
                   p->n_wheels * p->blade_length_m, horizontal ? BW_ ("width") : BW_ ("depth"), along);
      return FALSE;
    }
  return TRUE;
}

static gboolean
check_turbine_fit (const BwImpeller *imp, const BwCompartment *c, GError **error)
{
  const double room = MIN (c->length_m, c->width_m);

  if (imp->diameter_m >= room)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
                   BW_ ("impeller diameter: %g m does not fit in a compartment %g m by %g m in plan"),
                   imp->diameter_m, c->length_m, c->width_m);
      return FALSE;
    }
  return TRUE;
}

gboolean
bw_floc_stage_evaluate (const BwFlocStage *stage, double flow_m3_s, const BwWater *water,
                        BwFlocStageResult *out, GError **error)
{
  double v = 0.0;

  g_return_val_if_fail (stage != NULL && water != NULL && out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!bw_water_check (water, error) || !bw_check_positive (flow_m3_s, BW_ ("flow"), error))
    return FALSE;

  memset (out, 0, sizeof *out);
  out->kind = stage->kind;
  switch (stage->kind)
    {
    case BW_FLOC_STAGE_PADDLE:
      if (!compartment_volume (&stage->compartment, &v, error)
          || !bw_paddle_evaluate (&stage->paddle, water, &out->paddle, error)
          || !check_paddle_fit (&stage->paddle, &stage->compartment, error))
        return FALSE;
      out->power_W = out->paddle.power_W;
      break;
    case BW_FLOC_STAGE_TURBINE:
      if (!compartment_volume (&stage->compartment, &v, error)
          || !bw_impeller_evaluate (&stage->turbine, stage->turbine_baffled, water, &out->turbine,
                                    error)
          || !check_turbine_fit (&stage->turbine, &stage->compartment, error))
        return FALSE;
      out->power_W = out->turbine.power_W;
      out->warnings |= out->turbine.warnings;
      break;
    case BW_FLOC_STAGE_BAFFLED:
      if (!bw_baffled_channel_evaluate (&stage->channel, flow_m3_s, water, &out->channel, error))
        return FALSE;
      v = out->channel.volume_m3;
      out->power_W = out->channel.power_W;
      break;
    default:
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("stage kind: unknown value %d"), (int) stage->kind);
      return FALSE;
    }

  out->volume_m3 = v;
  out->detention_s = v / flow_m3_s;
  if (!bw_velocity_gradient (out->power_W, v, water, &out->G_per_s, error))
    return FALSE;
  out->Gt = out->G_per_s * out->detention_s;
  return bw_check_result (out->detention_s, BW_ ("flow"), BW_ ("detention time"), error)
         && bw_check_result (out->Gt, BW_ ("flow"), BW_ ("Gt"), error);
}

gboolean
bw_flocculator_evaluate (const BwFlocculator *floc, const BwWater *water, BwFlocResult *out,
                         GError **error)
{
  double sum_p = 0.0, sum_v = 0.0, sum_t = 0.0, sum_gt = 0.0;
  guint warnings = 0;

  g_return_val_if_fail (floc != NULL && water != NULL && out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!bw_water_check (water, error) || !bw_check_positive (floc->flow_m3_s, BW_ ("flow"), error)
      || !check_count (floc->n_stages, 1, BW_FLOC_MAX_STAGES, BW_ ("stages"), error))
    return FALSE;

  for (guint i = 0; i < floc->n_stages; i++)
    {
      BwFlocStageResult *r = &out->stages[i];
      if (!bw_floc_stage_evaluate (&floc->stages[i], floc->flow_m3_s, water, r, error))
        {
          g_prefix_error (error, BW_ ("stage %u "), i + 1);
          return FALSE;
        }
      sum_p += r->power_W;
      sum_v += r->volume_m3;
      sum_t += r->detention_s;
      sum_gt += r->Gt;
      warnings |= r->warnings;
    }

  out->n_stages = floc->n_stages;
  out->volume_m3 = sum_v;
  out->detention_s = sum_t;
  out->power_W = sum_p;
  /* The Camp number of the train is the sum of the stages' G t (Camp 1955). Two "overall G"
   * values are given, since both are in use: the detention-weighted mean Gt / t, and the G of
   * the total power in the total volume, sqrt (sum P / (mu sum V)). They differ for a tapered
   * train: the second, a volume-weighted root-mean-square, is never below the first, a
   * volume-weighted mean, and equals it only when every stage has the same G. */
  out->Gt = sum_gt;
  out->G_time_mean_per_s = sum_gt / sum_t;
  out->G_power_mean_per_s = sqrt (sum_p / (water->dynamic_viscosity_Pa_s * sum_v));
  out->warnings = warnings;
  return bw_check_result (out->G_time_mean_per_s, BW_ ("flow"), BW_ ("mean velocity gradient"), error)
         && bw_check_result (out->G_power_mean_per_s, BW_ ("flow"), BW_ ("mean velocity gradient"), error);
}

/* --- design solves --- */

static gboolean
require_kind (const BwFlocStage *stage, BwFlocStageKind kind, GError **error)
{
  if (stage->kind == kind)
    return TRUE;
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
               BW_ ("stage kind: this solve needs a %s stage, not a %s stage"),
               bw_floc_stage_kind_name (kind), bw_floc_stage_kind_name (stage->kind));
  return FALSE;
}

/* The power (W) a stage of volume V must deliver for TARGET_G_PER_S: P = mu V G^2. */
static gboolean
target_power (const BwFlocStage *stage, double flow_m3_s, const BwWater *water, double target,
              double *volume_m3, double *power_W, GError **error)
{
  if (!bw_water_check (water, error) || !bw_check_positive (flow_m3_s, BW_ ("flow"), error)
      || !compartment_volume (&stage->compartment, volume_m3, error))
    return FALSE;
  return bw_power_for_velocity_gradient (target, *volume_m3, water, power_W, error);
}

gboolean
bw_floc_stage_paddle_speed_for_gradient (const BwFlocStage *stage, double flow_m3_s,
                                         const BwWater *water, double target_G_per_s,
                                         double *out_speed_rev_s, GError **error)
{
  BwFlocStage trial;
  BwPaddleResult unit;
  BwFlocStageResult check;
  double v, p;

  g_return_val_if_fail (stage != NULL && water != NULL && out_speed_rev_s != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!require_kind (stage, BW_FLOC_STAGE_PADDLE, error)
      || !target_power (stage, flow_m3_s, water, target_G_per_s, &v, &p, error))
    return FALSE;

  /* P = c N^3 (Eq. 6-20 with v_r proportional to N): evaluate at 1 rev/s and scale. */
  trial = *stage;
  trial.paddle.speed_rev_s = 1.0;
  if (!bw_paddle_evaluate (&trial.paddle, water, &unit, error))
    return FALSE;
  trial.paddle.speed_rev_s = cbrt (p / unit.power_W);
  if (!bw_check_result (trial.paddle.speed_rev_s, BW_ ("velocity gradient"), BW_ ("rotational speed"), error)
      || !bw_floc_stage_evaluate (&trial, flow_m3_s, water, &check, error))
    return FALSE;
  *out_speed_rev_s = trial.paddle.speed_rev_s;
  return TRUE;
}

/* Power of STAGE's reel with blades LENGTH_M long, W (its geometry already checked). */
static double
paddle_power_at_length (const BwFlocStage *stage, const BwWater *water, double length_m)
{
  BwPaddle p = stage->paddle;
  BwPaddleResult r;

  p.blade_length_m = length_m;
  if (!bw_paddle_evaluate (&p, water, &r, NULL))
    return NAN;
  return r.power_W;
}

gboolean
bw_floc_stage_blade_length_for_gradient (const BwFlocStage *stage, double flow_m3_s,
                                         const BwWater *water, double target_G_per_s,
                                         double *out_blade_length_m, GError **error)
{
  BwFlocStage trial;
  BwFlocStageResult check;
  double v, p, lo, hi, along;
  const double start = stage->paddle.blade_length_m > 0.0 && isfinite (stage->paddle.blade_length_m)
                         ? stage->paddle.blade_length_m : 1.0;
  int i;

  g_return_val_if_fail (stage != NULL && water != NULL && out_blade_length_m != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!require_kind (stage, BW_FLOC_STAGE_PADDLE, error)
      || !target_power (stage, flow_m3_s, water, target_G_per_s, &v, &p, error))
    return FALSE;
  /* Everything but the length must already be a valid reel. */
  trial = *stage;
  trial.paddle.blade_length_m = start;
  if (!check_paddle (&trial.paddle, error))
    return FALSE;

  /* P rises with the length (bw_paddle_drag_coefficient); bracket the root, then bisect ln L. */
  lo = hi = start;
  for (i = 0; i < MAX_EXPANSIONS && !(paddle_power_at_length (stage, water, lo) < p)
              && lo > BLADE_LENGTH_MIN_M; i++)
    lo /= 2.0;
  for (i = 0; i < MAX_EXPANSIONS && !(paddle_power_at_length (stage, water, hi) >= p)
              && hi < BLADE_LENGTH_MAX_M; i++)
    hi *= 2.0;
  if (!(paddle_power_at_length (stage, water, hi) >= p))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("blade length: G = %g 1/s would need blades longer than %g m"),
                   target_G_per_s, BLADE_LENGTH_MAX_M);
      return FALSE;
    }
  if (!(paddle_power_at_length (stage, water, lo) < p))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("blade length: G = %g 1/s would need blades shorter than %g m"),
                   target_G_per_s, BLADE_LENGTH_MIN_M);
      return FALSE;
    }
  for (i = 0; i < MAX_BISECTIONS && hi - lo > REL_TOLERANCE * hi; i++)
    {
      const double mid = sqrt (lo * hi);
      if (paddle_power_at_length (stage, water, mid) < p)
        lo = mid;
      else
        hi = mid;
    }
  if (hi - lo > REL_TOLERANCE * hi * 10.0)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NO_CONVERGENCE,
                   BW_ ("blade length: the solve did not converge (bracket %g to %g m)"), lo, hi);
      return FALSE;
    }

  trial.paddle.blade_length_m = sqrt (lo * hi);
  along = stage->paddle.shaft == BW_SHAFT_HORIZONTAL ? stage->compartment.width_m
                                                     : stage->compartment.depth_m;
  if (stage->paddle.n_wheels * trial.paddle.blade_length_m > along)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("blade length: G = %g 1/s needs blades %.4g m long, but the compartment "
                   "takes at most %.4g m per wheel along the shaft"), target_G_per_s,
                   trial.paddle.blade_length_m, along / stage->paddle.n_wheels);
      return FALSE;
    }
  if (!bw_floc_stage_evaluate (&trial, flow_m3_s, water, &check, error))
    return FALSE;
  *out_blade_length_m = trial.paddle.blade_length_m;
  return TRUE;
}

gboolean
bw_floc_stage_turbine_speed_for_gradient (const BwFlocStage *stage, double flow_m3_s,
                                          const BwWater *water, double target_G_per_s,
                                          double *out_speed_rev_s, GError **error)
{
  BwFlocStage trial;
  BwFlocStageResult check;
  double v, p;

  g_return_val_if_fail (stage != NULL && water != NULL && out_speed_rev_s != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!require_kind (stage, BW_FLOC_STAGE_TURBINE, error)
      || !target_power (stage, flow_m3_s, water, target_G_per_s, &v, &p, error))
    return FALSE;
  trial = *stage;
  if (!bw_impeller_speed_for_power (&stage->turbine, stage->turbine_baffled, water, p,
                                    &trial.turbine.speed_rev_s, error)
      || !bw_floc_stage_evaluate (&trial, flow_m3_s, water, &check, error))
    return FALSE;
  *out_speed_rev_s = trial.turbine.speed_rev_s;
  return TRUE;
}

/* G of STAGE's channel with baffles SPACING_M apart, 1/s, or NaN if that channel is invalid. */
static double
channel_gradient_at (const BwFlocStage *stage, double flow_m3_s, const BwWater *water,
                     double spacing_m)
{
  BwBaffledChannel c = stage->channel;
  BwBaffledResult r;

  c.spacing_m = spacing_m;
  if (!bw_baffled_channel_evaluate (&c, flow_m3_s, water, &r, NULL))
    return NAN;
  return r.G_per_s;
}

gboolean
bw_floc_stage_baffle_spacing_for_gradient (const BwFlocStage *stage, double flow_m3_s,
                                           const BwWater *water, double target_G_per_s,
                                           double *out_spacing_m, GError **error)
{
  BwFlocStage trial;
  BwBaffledResult check;
  double lo = SPACING_MIN_M, hi = SPACING_MAX_M, g_lo, g_hi;
  int i;

  g_return_val_if_fail (stage != NULL && water != NULL && out_spacing_m != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!require_kind (stage, BW_FLOC_STAGE_BAFFLED, error)
      || !bw_water_check (water, error)
      || !bw_check_positive (target_G_per_s, BW_ ("velocity gradient"), error))
    return FALSE;
  /* Everything but the spacing must already be a valid channel. */
  trial = *stage;
  trial.channel.spacing_m = 1.0;
  if (!bw_baffled_channel_evaluate (&trial.channel, flow_m3_s, water, &check, error))
    return FALSE;

  /* G falls as the spacing widens (lower velocity, larger hydraulic radius, longer detention). */
  g_lo = channel_gradient_at (stage, flow_m3_s, water, lo);
  g_hi = channel_gradient_at (stage, flow_m3_s, water, hi);
  if (!(g_lo >= target_G_per_s))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("baffle spacing: G = %g 1/s is out of reach: even baffles %g mm apart "
                   "give only %.4g 1/s"), target_G_per_s, SPACING_MIN_M * 1e3, g_lo);
      return FALSE;
    }
  if (!(g_hi <= target_G_per_s))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("baffle spacing: G = %g 1/s is out of reach: even baffles %g m apart give "
                   "%.4g 1/s"), target_G_per_s, SPACING_MAX_M, g_hi);
      return FALSE;
    }
  for (i = 0; i < MAX_BISECTIONS && hi - lo > REL_TOLERANCE * hi; i++)
    {
      const double mid = sqrt (lo * hi);
      const double g = channel_gradient_at (stage, flow_m3_s, water, mid);
      if (!isfinite (g))
        break;
      if (g > target_G_per_s)
        lo = mid;
      else
        hi = mid;
    }
  if (hi - lo > REL_TOLERANCE * hi * 10.0)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NO_CONVERGENCE,
                   BW_ ("baffle spacing: the solve did not converge (bracket %g to %g m)"), lo, hi);
      return FALSE;
    }
  trial.channel.spacing_m = sqrt (lo * hi);
  if (!bw_baffled_channel_evaluate (&trial.channel, flow_m3_s, water, &check, error))
    return FALSE;
  *out_spacing_m = trial.channel.spacing_m;
  return TRUE;
}

/* --- names --- */

const char *
bw_floc_stage_kind_name (BwFlocStageKind kind)
{
  switch (kind)
    {
    case BW_FLOC_STAGE_PADDLE: return "paddle";
    case BW_FLOC_STAGE_TURBINE: return "turbine";
    case BW_FLOC_STAGE_BAFFLED: return "baffled";
    default: return "unknown";
    }
}

static const char *const layout_names[BW_N_BAFFLE_LAYOUTS] = {
  [BW_BAFFLE_AROUND_THE_END] = "around-the-end",
  [BW_BAFFLE_OVER_AND_UNDER] = "over-and-under",
};

const char *
bw_baffle_layout_name (BwBaffleLayout layout)
{
  return (guint) layout < BW_N_BAFFLE_LAYOUTS ? layout_names[layout] : "unknown";
}

gboolean
bw_baffle_layout_from_name (const char *name, BwBaffleLayout *out)
{
  g_return_val_if_fail (out != NULL, FALSE);

  if (name == NULL)
    return FALSE;
  for (guint i = 0; i < BW_N_BAFFLE_LAYOUTS; i++)
    if (strcmp (name, layout_names[i]) == 0)
      {
        *out = (BwBaffleLayout) i;
        return TRUE;
      }
  return FALSE;
}
