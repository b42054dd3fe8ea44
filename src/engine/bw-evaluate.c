/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-evaluate.c: maps each process unit's parameters onto its model, evaluates every unit in
 * every load case, and grades the results against a criteria set. */
#include "config.h"

#include "engine/bw-evaluate.h"

#include <math.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"
#include "engine/bw-floc.h"
#include "engine/bw-mixing.h"
#include "engine/bw-sedimentation.h"
#include "engine/bw-water.h"

#define P(u, id) bw_process_unit_get ((u), (id))

static void
element_free (BwElementResult *e)
{
  g_free (e->id);
  g_free (e->label);
  g_free (e->values);
  g_free (e);
}

void
bw_results_free (BwResults *r)
{
  if (r == NULL)
    return;
  g_free (r->cases);
  g_ptr_array_unref (r->elements);
  g_free (r);
}

static BwElementResult *
element_new (BwResults *r, const BwTrain *t, const BwProcessUnit *u, const BwProcessUnit *stage,
             BwElementType type, guint stage_number)
{
  BwElementResult *e = g_new0 (BwElementResult, 1);

  e->unit = u;
  e->stage = stage;
  e->train = t;
  e->type = type;
  e->id = g_strdup (stage ? stage->id : u->id);
  if (stage)
    /* TRANSLATORS: flocculator name, stage number (stage type) */
    e->label = g_strdup_printf (BW_ ("%s, stage %u (%s)"), u->name, stage_number,
                                BW_ (bw_process_type_label (stage->type)));
  else
    e->label = g_strdup (u->name);
  e->values = g_new0 (BwQuantitySet, r->n_cases);
  g_ptr_array_add (r->elements, e);
  return e;
}

static gboolean
impeller_from (const BwProcessUnit *u, BwImpeller *imp, GError **error)
{
  const int choice = (int) P (u, "impeller");
  const double np = P (u, "power-number");

  memset (imp, 0, sizeof *imp);
  imp->diameter_m = P (u, "impeller-diameter");
  imp->speed_rev_s = P (u, "speed");
  imp->power_number = np;
  if (choice == 3) /* custom */
    {
      if (np <= 0)
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                       BW_ ("power number: a custom impeller needs one"));
          return FALSE;
        }
      imp->kind = BW_IMPELLER_RUSHTON; /* unused: the power number given replaces the library */
    }
  else
    imp->kind = (BwImpellerKind) choice;
  return TRUE;
}

/* --- per unit type: fill the quantity set of one load case --- */

static gboolean
eval_rapid_mix (const BwProcessUnit *u, double q, const BwWater *w, BwQuantitySet *s,
                guint *warnings, GError **error)
{
  BwRapidMixTank tank = { 0 };
  BwRapidMixResult r;

  tank.shape = P (u, "shape") == 0 ? BW_TANK_SQUARE : BW_TANK_CYLINDRICAL;
  tank.width_m = P (u, "width");
  tank.liquid_depth_m = P (u, "liquid-depth");
  tank.baffled = P (u, "baffles") == 0;
  tank.flow_m3_s = q;
  tank.drive_efficiency = P (u, "drive-efficiency");
  if (!impeller_from (u, &tank.impeller, error) || !bw_rapid_mix_evaluate (&tank, w, &r, error))
    return FALSE;
  bw_quantity_set_put (s, BW_Q_VOLUME, r.volume_m3);
  bw_quantity_set_put (s, BW_Q_FLOW, q);
  bw_quantity_set_put (s, BW_Q_DETENTION, r.detention_s);
  bw_quantity_set_put (s, BW_Q_G, r.G_per_s);
  bw_quantity_set_put (s, BW_Q_GT, r.Gt);
  bw_quantity_set_put (s, BW_Q_POWER, r.water_power_W);
  bw_quantity_set_put (s, BW_Q_MOTOR_POWER, r.motor_power_W);
  bw_quantity_set_put (s, BW_Q_IMPELLER_REYNOLDS, r.impeller.reynolds);
  bw_quantity_set_put (s, BW_Q_TIP_SPEED, r.impeller.tip_speed_m_s);
  *warnings |= r.warnings;
  return TRUE;
}

static gboolean
eval_inline_mixer (const BwProcessUnit *u, double q, const BwWater *w, BwQuantitySet *s,
                   GError **error)
{
  BwHydraulicResult r;
  const double h = P (u, "headloss"), v = P (u, "volume");

  if (!bw_hydraulic_mixer_evaluate (h, q, v, w, &r, error))
    return FALSE;
  bw_quantity_set_put (s, BW_Q_VOLUME, v);
  bw_quantity_set_put (s, BW_Q_FLOW, q);
  bw_quantity_set_put (s, BW_Q_DETENTION, r.detention_s);
  bw_quantity_set_put (s, BW_Q_G, r.G_per_s);
  bw_quantity_set_put (s, BW_Q_GT, r.Gt);
  bw_quantity_set_put (s, BW_Q_POWER, r.power_W);
  bw_quantity_set_put (s, BW_Q_HEADLOSS, h);
  return TRUE;
}

static gboolean
stage_from (const BwProcessUnit *floc, const BwProcessUnit *st, BwFlocStage *out, GError **error)
{
  const double width = P (floc, "width"), depth = P (floc, "water-depth");

  memset (out, 0, sizeof *out);
  out->compartment.width_m = width;
  out->compartment.depth_m = depth;
  switch (st->type)
    {
    case BW_STAGE_PADDLE:
      {
        const char *radii[] = { "blade-radius-1", "blade-radius-2", "blade-radius-3" };
        out->kind = BW_FLOC_STAGE_PADDLE;
        out->compartment.length_m = P (st, "length");
        bw_paddle_init (&out->paddle);
        out->paddle.shaft = P (st, "shaft") == 0 ? BW_SHAFT_HORIZONTAL : BW_SHAFT_VERTICAL;
        out->paddle.n_wheels = (guint) P (st, "wheels");
        out->paddle.arms_per_wheel = (guint) P (st, "arms");
        out->paddle.n_rings = 0;
        for (guint i = 0; i < G_N_ELEMENTS (radii); i++)
          if (P (st, radii[i]) > 0)
            out->paddle.ring_radius_m[out->paddle.n_rings++] = P (st, radii[i]);
        out->paddle.blade_length_m = P (st, "blade-length");
        out->paddle.blade_width_m = P (st, "blade-width");
        out->paddle.speed_rev_s = P (st, "speed");
        out->paddle.relative_velocity_factor = P (st, "velocity-factor");
        out->paddle.drag_coefficient = P (st, "drag-coefficient"); /* 0: from the aspect ratio */
        return TRUE;
      }
    case BW_STAGE_TURBINE:
      out->kind = BW_FLOC_STAGE_TURBINE;
      out->compartment.length_m = P (st, "length");
      out->turbine_baffled = P (st, "baffles") == 0;
      return impeller_from (st, &out->turbine, error);
    case BW_STAGE_BAFFLED:
      out->kind = BW_FLOC_STAGE_BAFFLED;
      bw_baffled_channel_init (&out->channel, P (st, "style") == 0 ? BW_BAFFLE_AROUND_THE_END
                                                                  : BW_BAFFLE_OVER_AND_UNDER);
      out->channel.n_passes = (guint) P (st, "passes");
      out->channel.spacing_m = P (st, "spacing");
      out->channel.water_depth_m = depth;
      out->channel.pass_length_m = width; /* each pass spans the basin (see bw-params.c) */
      if (P (st, "turn-coefficient") > 0)
        out->channel.turn_loss_k = P (st, "turn-coefficient");
      out->channel.manning_n = P (st, "manning-n");
      out->compartment.length_m = out->channel.n_passes * out->channel.spacing_m;
      return TRUE;
    default:
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("%s: a %s is not a flocculator stage"), st->id, BW_ (bw_process_type_label (st->type)));
      return FALSE;
    }
}

static gboolean
eval_flocculator (const BwProcessUnit *u, double q, const BwWater *w, BwQuantitySet *s,
                  BwQuantitySet **stage_sets, guint *warnings, GError **error)
{
  BwFlocculator floc = { 0 };
  BwFlocResult r;
  const double width = P (u, "width"), depth = P (u, "water-depth");

  if (u->stages->len > BW_FLOC_MAX_STAGES)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("stages: a flocculator takes at most %d (got %u)"), BW_FLOC_MAX_STAGES,
                   u->stages->len);
      return FALSE;
    }
  floc.flow_m3_s = q;
  floc.n_stages = u->stages->len;
  for (guint i = 0; i < u->stages->len; i++)
    if (!stage_from (u, g_ptr_array_index (u->stages, i), &floc.stages[i], error))
      return FALSE;
  if (!bw_flocculator_evaluate (&floc, w, &r, error))
    return FALSE;
  bw_quantity_set_put (s, BW_Q_VOLUME, r.volume_m3);
  bw_quantity_set_put (s, BW_Q_FLOW, q);
  bw_quantity_set_put (s, BW_Q_DETENTION, r.detention_s);
  bw_quantity_set_put (s, BW_Q_G, r.G_time_mean_per_s);
  bw_quantity_set_put (s, BW_Q_GT, r.Gt);
  bw_quantity_set_put (s, BW_Q_POWER, r.power_W);
  bw_quantity_set_put (s, BW_Q_CHANNEL_VELOCITY, q / (width * depth));
  *warnings |= r.warnings;
  for (guint i = 0; i < r.n_stages; i++)
    {
      const BwFlocStageResult *sr = &r.stages[i];
      BwQuantitySet *ss = stage_sets[i];
      bw_quantity_set_put (ss, BW_Q_VOLUME, sr->volume_m3);
      bw_quantity_set_put (ss, BW_Q_FLOW, q);
      bw_quantity_set_put (ss, BW_Q_DETENTION, sr->detention_s);
      bw_quantity_set_put (ss, BW_Q_G, sr->G_per_s);
      bw_quantity_set_put (ss, BW_Q_GT, sr->Gt);
      bw_quantity_set_put (ss, BW_Q_POWER, sr->power_W);
      switch (sr->kind)
        {
        case BW_FLOC_STAGE_PADDLE:
          bw_quantity_set_put (ss, BW_Q_TIP_SPEED, sr->paddle.tip_speed_m_s);
          bw_quantity_set_put (ss, BW_Q_CHANNEL_VELOCITY, q / (width * depth));
          break;
        case BW_FLOC_STAGE_TURBINE:
          bw_quantity_set_put (ss, BW_Q_TIP_SPEED, sr->turbine.tip_speed_m_s);
          bw_quantity_set_put (ss, BW_Q_IMPELLER_REYNOLDS, sr->turbine.reynolds);
          bw_quantity_set_put (ss, BW_Q_CHANNEL_VELOCITY, q / (width * depth));
          break;
        case BW_FLOC_STAGE_BAFFLED:
          bw_quantity_set_put (ss, BW_Q_CHANNEL_VELOCITY, sr->channel.velocity_m_s);
          bw_quantity_set_put (ss, BW_Q_HEADLOSS, sr->channel.headloss_m);
          break;
        default:
          break;
        }
    }
  return TRUE;
}

static gboolean
eval_rect_basin (const BwProcessUnit *u, double q, const BwWater *w, BwQuantitySet *s,
                 guint *warnings, GError **error)
{
  BwRectBasin b;
  BwRectBasinResult r;

  bw_rect_basin_init (&b);
  b.length_m = P (u, "length");
  b.width_m = P (u, "width");
  b.depth_m = P (u, "side-water-depth");
  b.n_basins = 1; /* the project has already divided the flow over the units in service */
  b.inlet = (BwInletKind) P (u, "inlet");
  b.weir_length_m = P (u, "weir-length");
  b.check_scour = TRUE;
  bw_scour_particle_init (&b.scour, P (u, "particle-diameter"), P (u, "particle-sg"));
  b.scour.cohesion_k = P (u, "cohesion");
  b.scour.friction_f = P (u, "friction");
  if (!bw_rect_basin_evaluate (&b, q, w, &r, error))
    return FALSE;
  bw_quantity_set_put (s, BW_Q_SURFACE_AREA, r.surface_area_m2);
  bw_quantity_set_put (s, BW_Q_VOLUME, r.volume_m3);
  bw_quantity_set_put (s, BW_Q_FLOW, q);
  bw_quantity_set_put (s, BW_Q_OVERFLOW_RATE, r.overflow_rate_m_s);
  bw_quantity_set_put (s, BW_Q_DETENTION, r.detention_s);
  bw_quantity_set_put (s, BW_Q_HORIZONTAL_VELOCITY, r.horizontal_velocity_m_s);
  if (r.has_weir_loading)
    bw_quantity_set_put (s, BW_Q_WEIR_LOADING, r.weir_loading_m2_s);
  bw_quantity_set_put (s, BW_Q_LENGTH_WIDTH_RATIO, r.length_width_ratio);
  bw_quantity_set_put (s, BW_Q_WIDTH_DEPTH_RATIO, r.width_depth_ratio);
  bw_quantity_set_put (s, BW_Q_SIDE_WATER_DEPTH, b.depth_m);
  bw_quantity_set_put (s, BW_Q_REYNOLDS, r.reynolds);
  bw_quantity_set_put (s, BW_Q_FROUDE, r.froude);
  if (r.has_scour)
    {
      bw_quantity_set_put (s, BW_Q_SCOUR_VELOCITY, r.scour_velocity_m_s);
      bw_quantity_set_put (s, BW_Q_SCOUR_MARGIN, r.scour_margin);
    }
  if (P (u, "design-settling-velocity") > 0)
    /* Camp (1946) ideal basin: a particle settling at vs is removed in the fraction
     * min (1, vs / v0) at overflow rate v0 (both m/s). */
    bw_quantity_set_put (s, BW_Q_REMOVAL, MIN (1.0, P (u, "design-settling-velocity")
                                                        / r.overflow_rate_m_s));
  *warnings |= r.cautions;
  return TRUE;
}

static gboolean
eval_clarifier (const BwProcessUnit *u, double q, BwQuantitySet *s, GError **error)
{
  BwClarifier c;
  BwClarifierResult r;

  bw_clarifier_init (&c);
  c.diameter_m = P (u, "diameter");
  c.depth_m = P (u, "side-water-depth");
  c.n_clarifiers = 1;
  c.feed_well_diameter_m = P (u, "feed-well-diameter");
  c.launder = P (u, "launder") == 0 ? BW_LAUNDER_PERIPHERAL : BW_LAUNDER_INBOARD;
  c.launder_radius_m = P (u, "launder-radius");
  if (c.launder == BW_LAUNDER_INBOARD && c.launder_radius_m <= 0)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
                   BW_ ("launder radius: an inboard launder needs its radius"));
      return FALSE;
    }
  if (!bw_clarifier_evaluate (&c, q, &r, error))
    return FALSE;
  bw_quantity_set_put (s, BW_Q_SURFACE_AREA, r.surface_area_m2);
  bw_quantity_set_put (s, BW_Q_VOLUME, r.volume_m3);
  bw_quantity_set_put (s, BW_Q_FLOW, q);
  bw_quantity_set_put (s, BW_Q_OVERFLOW_RATE, r.overflow_rate_m_s);
  bw_quantity_set_put (s, BW_Q_DETENTION, r.detention_s);
  bw_quantity_set_put (s, BW_Q_WEIR_LOADING, r.weir_loading_m2_s);
  bw_quantity_set_put (s, BW_Q_SIDE_WATER_DEPTH, c.depth_m);
  if (P (u, "design-settling-velocity") > 0)
    /* Camp (1946) ideal basin, as for the rectangular basin. */
    bw_quantity_set_put (s, BW_Q_REMOVAL, MIN (1.0, P (u, "design-settling-velocity")
                                                        / r.overflow_rate_m_s));
  return TRUE;
}

static gboolean
eval_settler (const BwProcessUnit *u, double q, const BwWater *w, BwQuantitySet *s,
              guint *warnings, GError **error)
{
  BwSettler st;
  BwSettlerResult r;
  const BwSettlerShape shapes[] = { BW_SETTLER_PLATES, BW_SETTLER_CIRCULAR_TUBES,
                                    BW_SETTLER_SQUARE_TUBES };

  bw_settler_init (&st, shapes[(int) P (u, "shape")]);
  st.angle_rad = P (u, "angle");
  st.spacing_m = P (u, "spacing");
  st.length_m = P (u, "length");
  st.plate_width_m = P (u, "plate-width");
  st.count = (guint) P (u, "count");
  st.n_basins = 1;
  if (!bw_settler_evaluate (&st, q, w, &r, error))
    return FALSE;
  bw_quantity_set_put (s, BW_Q_FLOW, q);
  bw_quantity_set_put (s, BW_Q_PROJECTED_LOADING, r.projected_loading_m_s);
  bw_quantity_set_put (s, BW_Q_CRITICAL_VELOCITY, r.critical_velocity_m_s);
  bw_quantity_set_put (s, BW_Q_CHANNEL_REYNOLDS, r.reynolds);
  bw_quantity_set_put (s, BW_Q_CHANNEL_VELOCITY, r.channel_velocity_m_s);
  if (P (u, "module-area") > 0)
    bw_quantity_set_put (s, BW_Q_OVERFLOW_RATE, q / P (u, "module-area"));
  if (P (u, "design-settling-velocity") > 0)
    /* Yao (1970): particles settling at or above the critical velocity are all removed; slower
     * ones in proportion, as in Camp's ideal basin. */
    bw_quantity_set_put (s, BW_Q_REMOVAL, MIN (1.0, P (u, "design-settling-velocity")
                                                        / r.critical_velocity_m_s));
  *warnings |= r.cautions;
  return TRUE;
}

static gboolean
prefix_error (GError **error, const char *id)
{
  if (error && *error)
    g_prefix_error (error, BW_ ("%s: "), id);
  return FALSE;
}

static gboolean
all_finite (const BwQuantitySet *s)
{
  for (int q = 0; q < BW_N_QUANTITIES; q++)
    if (bw_quantity_set_has (s, (BwQuantity) q) && !isfinite (s->values[q]))
      return FALSE;
  return TRUE;
}

gboolean
bw_unit_element_type (const BwProcessUnit *u, BwElementType *out)
{
  switch (u->type)
    {
    case BW_PROCESS_RAPID_MIX:
    case BW_PROCESS_INLINE_MIXER: *out = BW_ELEMENT_RAPID_MIX; return TRUE;
    case BW_PROCESS_FLOCCULATOR: *out = BW_ELEMENT_FLOCCULATOR; return TRUE;
    case BW_PROCESS_RECTANGULAR_BASIN: *out = BW_ELEMENT_RECTANGULAR_BASIN; return TRUE;
    case BW_PROCESS_CIRCULAR_CLARIFIER: *out = BW_ELEMENT_CIRCULAR_CLARIFIER; return TRUE;
    case BW_PROCESS_PLATE_SETTLER:
      *out = P (u, "shape") == 0 ? BW_ELEMENT_PLATE_SETTLER : BW_ELEMENT_TUBE_SETTLER;
      return TRUE;
    default:
      return FALSE;
    }
}

gboolean
bw_evaluate_unit_case (const BwProcessUnit *u, double q, const BwWater *w, BwQuantitySet *out,
                       BwQuantitySet **stage_out, guint *warnings, GError **error)
{
  guint dummy = 0;

  if (warnings == NULL)
    warnings = &dummy;
  switch (u->type)
    {
    case BW_PROCESS_RAPID_MIX:
      return eval_rapid_mix (u, q, w, out, warnings, error);
    case BW_PROCESS_INLINE_MIXER:
      return eval_inline_mixer (u, q, w, out, error);
    case BW_PROCESS_FLOCCULATOR:
      if (stage_out == NULL)
        {
          BwQuantitySet scratch[BW_FLOC_MAX_STAGES];
          BwQuantitySet *sets[BW_FLOC_MAX_STAGES];
          for (guint i = 0; i < BW_FLOC_MAX_STAGES; i++)
            {
              scratch[i].present = 0;
              sets[i] = &scratch[i];
            }
          return eval_flocculator (u, q, w, out, sets, warnings, error);
        }
      return eval_flocculator (u, q, w, out, stage_out, warnings, error);
    case BW_PROCESS_RECTANGULAR_BASIN:
      return eval_rect_basin (u, q, w, out, warnings, error);
    case BW_PROCESS_CIRCULAR_CLARIFIER:
      return eval_clarifier (u, q, out, error);
    case BW_PROCESS_PLATE_SETTLER:
      return eval_settler (u, q, w, out, warnings, error);
    default:
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("%s: a %s cannot stand on its own in a train"), u->id, BW_ (bw_process_type_label (u->type)));
      return FALSE;
    }
}

/* What the coagulant adds to a unit's results: the rapid mix receives the feed at the maximum
 * dose (what the feed system must deliver), as liquid stock too when its strength and density are
 * given, and the alkalinity it leaves; a settling unit collects the sludge of the design dose
 * (Cornwell et al. 1987, from memory; see bw-chemistry.c), and its volume when the solids content
 * is given. */
static gboolean
add_chemistry (const BwProject *p, const BwCoagulant *co, BwElementType type, double q,
               BwQuantitySet *s, GError **error)
{
  const BwChemistryBasis *c = &p->chemistry;

  if (type == BW_ELEMENT_RAPID_MIX)
    {
      bw_quantity_set_put (s, BW_Q_COAGULANT_FEED, c->dose_max_kg_m3 * q);
      if (p->basis.alkalinity_kg_m3 > 0)
        bw_quantity_set_put (s, BW_Q_RESIDUAL_ALKALINITY,
                             p->basis.alkalinity_kg_m3 - co->alkalinity_factor * c->dose_max_kg_m3);
      if (c->stock_fraction > 0 && c->stock_density_kg_m3 > 0)
        {
          /* Liquid stock, m3/s: dry feed (kg/s) / (strength g/g x density kg/m3), a mass
           * balance (bw_dosing_evaluate). */
          BwDosing d;
          BwDosingResult r;
          bw_dosing_init (&d, c->dose_max_kg_m3, q);
          d.solution_fraction = c->stock_fraction;
          d.solution_density_kg_m3 = c->stock_density_kg_m3;
          if (!bw_dosing_evaluate (co, &d, &r, error))
            return FALSE;
          bw_quantity_set_put (s, BW_Q_COAGULANT_SOLUTION, r.solution_m3_s);
        }
    }
  else if (type == BW_ELEMENT_RECTANGULAR_BASIN || type == BW_ELEMENT_CIRCULAR_CLARIFIER
           || type == BW_ELEMENT_PLATE_SETTLER || type == BW_ELEMENT_TUBE_SETTLER)
    {
      bw_quantity_set_put (s, BW_Q_SLUDGE, q * (co->sludge_factor * c->dose_design_kg_m3
                                                + c->ss_factor * p->basis.turbidity_NTU * 1e-3));
      if (c->sludge_solids_fraction > 0)
        {
          /* Sludge volume, m3/s, at its solids content: dry mass over the sludge's bulk density
           * from its water and solids (bw_dosing_evaluate; Metcalf & Eddy, from memory). */
          BwDosing d;
          BwDosingResult r;
          bw_dosing_init (&d, c->dose_design_kg_m3, q);
          d.turbidity_NTU = p->basis.turbidity_NTU;
          d.ss_factor = c->ss_factor;
          d.solids_fraction = c->sludge_solids_fraction;
          if (!bw_dosing_evaluate (co, &d, &r, error))
            return FALSE;
          if (r.has_sludge_volume)
            bw_quantity_set_put (s, BW_Q_SLUDGE_VOLUME, r.sludge_m3_s);
        }
    }
  return TRUE;
}

BwResults *
bw_project_evaluate (const BwProject *p, GError **error)
{
  g_autoptr (BwResults) r = g_new0 (BwResults, 1);
  guint n = 0;
  BwCoagulant coagulant;

  g_return_val_if_fail (p != NULL, NULL);
  if (!bw_project_validate (p, error))
    return NULL;
  r->cases = g_new0 (BwLoadCase, MAX (1u, p->cases->len));
  for (guint i = 0; i < p->cases->len; i++)
    if (g_array_index (p->cases, BwLoadCase, i).enabled)
      r->cases[n++] = g_array_index (p->cases, BwLoadCase, i);
  r->n_cases = n;
  r->elements = g_ptr_array_new_with_free_func ((GDestroyNotify) element_free);
  if (p->chemistry.enabled && !bw_project_coagulant (p, &coagulant, error))
    return prefix_error (error, "chemistry"), NULL;
  if (n == 0)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("load cases: none is enabled"));
      return NULL;
    }

  for (guint ti = 0; ti < p->trains->len; ti++)
    {
      const BwTrain *t = g_ptr_array_index (p->trains, ti);
      for (guint ui = 0; ui < t->units->len; ui++)
        {
          const BwProcessUnit *u = g_ptr_array_index (t->units, ui);
          BwElementResult *e;
          BwElementResult *stage_el[BW_FLOC_MAX_STAGES] = { 0 };
          BwElementType type;

          if (!bw_unit_element_type (u, &type))
            {
              g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                           BW_ ("%s: a %s cannot stand on its own in a train"), u->id,
                           BW_ (bw_process_type_label (u->type)));
              return NULL;
            }
          e = element_new (r, t, u, NULL, type, 0);
          for (guint si = 0; si < u->stages->len && si < BW_FLOC_MAX_STAGES; si++)
            stage_el[si] = element_new (r, t, u, g_ptr_array_index (u->stages, si),
                                        BW_ELEMENT_FLOCCULATOR_STAGE, si + 1);

          for (guint c = 0; c < n; c++)
            {
              const BwLoadCase *lc = &r->cases[c];
              const double q = bw_project_unit_flow (p, u, lc->flow, lc->service);
              BwWater w;
              gboolean ok;

              if (!bw_water_properties (p->basis.temperature_K[lc->temp], &w, error))
                return prefix_error (error, "design basis"), NULL;
              {
                BwQuantitySet *sets[BW_FLOC_MAX_STAGES];
                for (guint si = 0; si < u->stages->len && si < BW_FLOC_MAX_STAGES; si++)
                  sets[si] = &stage_el[si]->values[c];
                ok = bw_evaluate_unit_case (u, q, &w, &e->values[c], sets, &e->warnings, error);
              }
              if (!ok)
                return prefix_error (error, u->id), NULL;
              if (p->chemistry.enabled
                  && !add_chemistry (p, &coagulant, e->type, q, &e->values[c], error))
                return prefix_error (error, "chemistry"), NULL;
              if (!all_finite (&e->values[c]))
                {
                  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE,
                               BW_ ("%s: a result is not finite; the inputs are out of the models' range"),
                               u->id);
                  return NULL;
                }
            }
        }
    }
  return g_steal_pointer (&r);
}

int
bw_results_extreme_case (const BwResults *r, guint element, BwQuantity q, gboolean largest)
{
  const BwElementResult *e;
  int best = -1;

  g_return_val_if_fail (r != NULL && element < r->elements->len, -1);
  e = g_ptr_array_index (r->elements, element);
  for (guint c = 0; c < r->n_cases; c++)
    {
      if (!bw_quantity_set_has (&e->values[c], q))
        continue;
      {
        /* Strictly better by more than round-off: a flow-independent quantity keeps its first
         * case rather than whichever case the last bit of rounding favours. */
        const double v = e->values[c].values[q];
        const double b = best >= 0 ? e->values[best].values[q] : 0;
        const double tol = 1e-12 * MAX (fabs (v), fabs (b));
        if (best < 0 || (largest ? v > b + tol : v < b - tol))
          best = (int) c;
      }
    }
  return best;
}

/* Relative distance of V inside its nearest limit (negative outside), and which limit that is. */
static double
margin_to (const BwLimits *l, double v, double *limit, gboolean *is_max)
{
  double best = G_MAXDOUBLE;

  if (l->has_min)
    {
      const double m = (v - l->min) / MAX (fabs (l->min), 1e-300);
      if (m < best)
        best = m, *limit = l->min, *is_max = FALSE;
    }
  if (l->has_max)
    {
      const double m = (l->max - v) / MAX (fabs (l->max), 1e-300);
      if (m < best)
        best = m, *limit = l->max, *is_max = TRUE;
    }
  return best;
}

static int
severity (BwCheckStatus s)
{
  return s == BW_CHECK_FAIL ? 2 : s == BW_CHECK_WARN ? 1 : 0;
}

GArray *
bw_check_results (const BwResults *r, const BwCriteriaSet *set)
{
  GArray *checks = g_array_new (FALSE, TRUE, sizeof (BwCheck));

  g_return_val_if_fail (r != NULL && set != NULL, checks);
  for (guint ci = 0; ci < set->criteria->len; ci++)
    {
      const BwCriterion *cr = g_ptr_array_index (set->criteria, ci);
      gboolean any = FALSE;

      for (guint ei = 0; ei < r->elements->len; ei++)
        {
          const BwElementResult *e = g_ptr_array_index (r->elements, ei);
          BwCheck ck = { cr, (int) ei, BW_CHECK_NOT_APPLICABLE, 0, FALSE, 0, FALSE, FALSE, -1 };
          double best_margin = G_MAXDOUBLE;

          if (!((cr->applies_to >> e->type) & 1))
            continue;
          for (guint c = 0; c < r->n_cases; c++)
            {
              const BwLoadCase *lc = &r->cases[c];
              const double v = e->values[c].values[cr->quantity];
              BwCheckStatus st;
              double limit = 0, m;
              gboolean is_max = FALSE, req = TRUE;

              if (!bw_quantity_set_has (&e->values[c], cr->quantity)
                  || !bw_case_filter_matches (&cr->cases, lc->flow, lc->temp, lc->service))
                continue;
              st = bw_criterion_grade (cr, v);
              /* The governing limit: the required one when failing or when it is nearer. */
              m = margin_to (&cr->required, v, &limit, &is_max);
              if (st == BW_CHECK_WARN || (!cr->required.has_min && !cr->required.has_max))
                {
                  m = margin_to (&cr->preferred, v, &limit, &is_max);
                  req = FALSE;
                }
              if (ck.governing_case < 0 || severity (st) > severity (ck.status)
                  || (severity (st) == severity (ck.status) && m < best_margin))
                {
                  ck.status = st;
                  ck.value = v;
                  ck.limit = limit;
                  ck.has_limit = m < G_MAXDOUBLE;
                  ck.limit_is_max = is_max;
                  ck.limit_is_required = req;
                  ck.governing_case = (int) c;
                  best_margin = m;
                }
            }
          /* An element of the right type whose quantity is absent in every matching case (a
           * weir length not given, say) is listed as not applicable. */
          g_array_append_val (checks, ck);
          any = TRUE;
        }
      if (!any)
        {
          BwCheck ck = { cr, -1, BW_CHECK_NOT_APPLICABLE, 0, FALSE, 0, FALSE, FALSE, -1 };
          g_array_append_val (checks, ck);
        }
    }
  return checks;
}

void
bw_checks_count (GArray *checks, guint counts[4])
{
  memset (counts, 0, 4 * sizeof (guint));
  for (guint i = 0; i < checks->len; i++)
    counts[g_array_index (checks, BwCheck, i).status]++;
}
