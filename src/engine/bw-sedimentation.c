/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-sedimentation.c: basins, clarifiers, plate and tube settlers, scour, inverse solves. */
#include "config.h"

#include "engine/bw-sedimentation.h"

#include <math.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"

/* Accepted magnitudes. They are generous (a bench model to the largest plant), and they keep every
 * derived quantity finite, so an error can name the input at fault instead of a result. */
#define MIN_LENGTH_M 1.0e-3
#define MAX_LENGTH_M 1.0e4
#define MIN_FLOW_M3_S 1.0e-9
#define MAX_FLOW_M3_S 1.0e4
#define MAX_AREA_M2 1.0e8
#define MAX_BASINS 10000u
#define MAX_SETTLER_COUNT 10000000u

/* Scour particle limits: the settling model's largest particle; SG up to that of the densest
 * minerals (common practice, no source). */
#define MAX_SCOUR_DIAMETER_M 0.1
#define MAX_SPECIFIC_GRAVITY 25.0

#define RAD_TO_DEG (180.0 / G_PI)

/* --- shared input checks --- */

/* Range check for a dimensionless value (bw_check_range would print an empty unit). */
static gboolean
check_plain_range (double value, double lo, double hi, const char *field, GError **error)
{
  if (!bw_check_finite (value, field, error))
    return FALSE;
  if (value >= lo && value <= hi)
    return TRUE;
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
               BW_ ("%s: %g is outside the accepted range %g to %g"), field, value, lo, hi);
  return FALSE;
}

static gboolean
check_length (double value_m, const char *field, GError **error)
{
  return bw_check_positive (value_m, field, error)
         && bw_check_range (value_m, MIN_LENGTH_M, MAX_LENGTH_M, field, "m", error);
}

/* A length where 0 means "not given". */
static gboolean
check_optional_length (double value_m, const char *field, GError **error)
{
  if (!bw_check_nonnegative (value_m, field, error))
    return FALSE;
  return value_m == 0.0 || bw_check_range (value_m, MIN_LENGTH_M, MAX_LENGTH_M, field, "m", error);
}

static gboolean
check_flow (double flow_m3_s, GError **error)
{
  return bw_check_positive (flow_m3_s, BW_ ("flow"), error)
         && bw_check_range (flow_m3_s, MIN_FLOW_M3_S, MAX_FLOW_M3_S, BW_ ("flow"), "m3/s", error);
}

static gboolean
check_count (guint n, guint max, const char *field, const char *what, GError **error)
{
  if (n >= 1 && n <= max)
    return TRUE;
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
               BW_ ("%s: %u %s is outside the accepted 1 to %u"), field, n, what, max);
  return FALSE;
}

static gboolean
check_water (const BwWater *water, GError **error)
{
  if (isfinite (water->kinematic_viscosity_m2_s) && water->kinematic_viscosity_m2_s > 0.0)
    return TRUE;
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
               BW_ ("water: the kinematic viscosity is not a positive finite number (use "
               "bw_water_properties)"));
  return FALSE;
}

/* The last line of defence: every result must be finite. The bounds above make this hold; should
 * one slip through, the caller gets an error naming FIELD rather than a NaN. */
static gboolean
check_results_finite (const double *values, gsize n, const char *field, GError **error)
{
  for (gsize i = 0; i < n; i++)
    if (!isfinite (values[i]))
      {
        g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE,
                     BW_ ("%s: the inputs give a result that is not a finite number"), field);
        return FALSE;
      }
  return TRUE;
}

/* Inclination from the horizontal: strictly between 0 and 90 degrees. A horizontal plate cannot
 * shed its sludge and a vertical or overhanging one is not an inclined settler, so either is
 * impossible geometry for this model. */
static gboolean
check_angle (double angle_rad, GError **error)
{
  if (!bw_check_finite (angle_rad, BW_ ("angle"), error))
    return FALSE;
  if (angle_rad > 0.0 && angle_rad < G_PI / 2.0)
    return TRUE;
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
               BW_ ("angle: %g° is not an incline; it must lie strictly between 0° and 90° from the "
               "horizontal"), angle_rad * RAD_TO_DEG);
  return FALSE;
}

/* --- Camp's scour velocity --- */

void
bw_scour_particle_init (BwScourParticle *p, double diameter_m, double specific_gravity)
{
  g_return_if_fail (p != NULL);
  p->diameter_m = diameter_m;
  p->specific_gravity = specific_gravity;
  p->cohesion_k = BW_SCOUR_DEFAULT_COHESION;
  p->friction_f = BW_SCOUR_DEFAULT_FRICTION;
}

static gboolean
check_scour_particle (const BwScourParticle *p, GError **error)
{
  if (!bw_check_positive (p->diameter_m, BW_ ("diameter"), error)
      || !bw_check_range (p->diameter_m, 0.0, MAX_SCOUR_DIAMETER_M, BW_ ("diameter"), "m", error)
      || !bw_check_finite (p->specific_gravity, BW_ ("specific gravity"), error)
      || !bw_check_positive (p->cohesion_k, BW_ ("cohesion"), error)
      || !check_plain_range (p->cohesion_k, 0.0, 1.0, BW_ ("cohesion"), error)
      || !bw_check_positive (p->friction_f, BW_ ("friction factor"), error)
      || !check_plain_range (p->friction_f, 0.0, 1.0, BW_ ("friction factor"), error))
    return FALSE;
  if (!(p->specific_gravity > 1.0) || p->specific_gravity > MAX_SPECIFIC_GRAVITY)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("specific gravity: %g is outside the accepted range above 1 up to %g (a "
                   "particle no denser than water is never on the bed)"), p->specific_gravity,
                   MAX_SPECIFIC_GRAVITY);
      return FALSE;
    }
  return TRUE;
}

/*
 * Camp (1946), "Sedimentation and the design of settling tanks", Trans. ASCE 111:895, after
 * Shields' threshold of motion: the horizontal velocity that begins to move a settled particle is
 *   V = sqrt (8 k (s - 1) g d / f)
 * k: Camp's cohesion constant (dimensionless), s: particle specific gravity, g: gravity (m/s2),
 * d: particle diameter (m), f: Darcy-Weisbach friction factor (dimensionless); V in m/s.
 */
gboolean
bw_scour_velocity (const BwScourParticle *p, double gravity_m_s2, double *out_m_s, GError **error)
{
  double v;

  g_return_val_if_fail (p != NULL && out_m_s != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!check_scour_particle (p, error)
      || !bw_check_positive (gravity_m_s2, BW_ ("gravity"), error)
      || !bw_check_range (gravity_m_s2, 0.0, 100.0, BW_ ("gravity"), "m/s2", error))
    return FALSE;
  v = sqrt (8.0 * p->cohesion_k * (p->specific_gravity - 1.0) * gravity_m_s2 * p->diameter_m
            / p->friction_f);
  if (!check_results_finite (&v, 1, BW_ ("diameter"), error))
    return FALSE;
  *out_m_s = v;
  return TRUE;
}

/* --- rectangular horizontal-flow basin --- */

void
bw_rect_basin_init (BwRectBasin *basin)
{
  g_return_if_fail (basin != NULL);
  memset (basin, 0, sizeof *basin);
  basin->n_basins = 1;
  basin->inlet = BW_INLET_PERFORATED_BAFFLE;
  basin->check_scour = FALSE;
  bw_scour_particle_init (&basin->scour, 0.0, 0.0);
}

static gboolean
inlet_is_valid (BwInletKind kind)
{
  return kind == BW_INLET_PERFORATED_BAFFLE || kind == BW_INLET_BAFFLE || kind == BW_INLET_NONE;
}

/*
 * Per basin, with q = Q / n (m3/s) and the settling zone L x W x H (m):
 *   surface overflow rate v0 = q / (L W)          (Camp 1946; Davis 2010 Eq. 10-18)    m/s
 *   detention time        t  = L W H / q          (Davis 2010 Eq. 10-15)                s
 *   horizontal velocity   vh = q / (W H)                                                m/s
 *   weir loading          qw = q / L_weir                                               m2/s
 *   hydraulic radius      Rh = W H / (W + 2 H)    (open channel: floor and two walls)   m
 *   Reynolds number       Re = vh Rh / nu         (Davis 2010 Eq. 10-32)
 *   Froude number         Fr = vh^2 / (g Rh)      (Davis 2010 Eq. 10-33)
 * with nu the kinematic viscosity (m2/s) and g standard gravity (m/s2).
 */
/* The arithmetic alone (Davis 2010 Ch. 10 for every quantity; see the header). */
void
bw_rect_basin_compute (const BwRectBasin *b, double flow_m3_s, const BwWater *water,
                       double scour_velocity_m_s, BwRectBasinResult *out)
{
  BwRectBasinResult r = { 0 };
  const double q = flow_m3_s / b->n_basins;

  r.flow_per_basin_m3_s = q;
  r.surface_area_m2 = b->length_m * b->width_m;
  r.volume_m3 = r.surface_area_m2 * b->depth_m;
  r.overflow_rate_m_s = q / r.surface_area_m2;
  r.detention_s = r.volume_m3 / q;
  r.horizontal_velocity_m_s = q / (b->width_m * b->depth_m);
  r.length_width_ratio = b->length_m / b->width_m;
  r.width_depth_ratio = b->width_m / b->depth_m;
  r.hydraulic_radius_m = b->width_m * b->depth_m / (b->width_m + 2.0 * b->depth_m);
  r.reynolds = r.horizontal_velocity_m_s * r.hydraulic_radius_m / water->kinematic_viscosity_m2_s;
  r.froude = r.horizontal_velocity_m_s * r.horizontal_velocity_m_s
             / (BW_GRAVITY_M_S2 * r.hydraulic_radius_m);
  if (b->weir_length_m > 0.0)
    {
      r.has_weir_loading = TRUE;
      r.weir_loading_m2_s = q / b->weir_length_m;
    }
  if (b->check_scour)
    {
      r.has_scour = TRUE;
      r.scour_velocity_m_s = scour_velocity_m_s;
      r.scour_margin = scour_velocity_m_s / r.horizontal_velocity_m_s;
      if (r.scour_margin <= 1.0)
        r.cautions |= BW_SED_CAUTION_SCOUR;
    }
  if (r.reynolds >= BW_BASIN_REYNOLDS_MAX)
    r.cautions |= BW_SED_CAUTION_REYNOLDS_HIGH;
  if (r.froude <= BW_BASIN_FROUDE_MIN)
    r.cautions |= BW_SED_CAUTION_FROUDE_LOW;
  *out = r;
}

gboolean
bw_rect_basin_evaluate (const BwRectBasin *b, double flow_m3_s, const BwWater *water,
                        BwRectBasinResult *out, GError **error)
{
  BwRectBasinResult r;
  double scour_v = 0.0;

  g_return_val_if_fail (b != NULL && water != NULL && out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!check_flow (flow_m3_s, error)
      || !check_count (b->n_basins, MAX_BASINS, BW_ ("basins"), BW_ ("basins in service"), error)
      || !check_length (b->length_m, BW_ ("length"), error)
      || !check_length (b->width_m, BW_ ("width"), error)
      || !check_length (b->depth_m, BW_ ("depth"), error)
      || !check_optional_length (b->weir_length_m, BW_ ("weir length"), error)
      || !check_water (water, error))
    return FALSE;
  if (!inlet_is_valid (b->inlet))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, BW_ ("inlet: unknown value %d"),
                   (int) b->inlet);
      return FALSE;
    }

  if (b->check_scour && !bw_scour_velocity (&b->scour, BW_GRAVITY_M_S2, &scour_v, error))
    return FALSE;
  bw_rect_basin_compute (b, flow_m3_s, water, scour_v, &r);
  {
    const double all[] = { r.surface_area_m2, r.volume_m3, r.overflow_rate_m_s, r.detention_s,
                           r.horizontal_velocity_m_s, r.weir_loading_m2_s, r.length_width_ratio,
                           r.width_depth_ratio, r.hydraulic_radius_m, r.reynolds, r.froude,
                           r.scour_margin };
    if (!check_results_finite (all, G_N_ELEMENTS (all), BW_ ("flow"), error))
      return FALSE;
  }
  *out = r;
  return TRUE;
}

/* Weir crest length: each launder contributes its length once, or twice when water spills in over
 * both of its edges (common practice, no source; e.g. Davis 2010 p. 10-37 counts "2 sides"). */
gboolean
bw_launder_weir_length (guint n_launders, double launder_length_m, gboolean double_sided,
                        double end_weir_m, double *out_m, GError **error)
{
  double total;

  g_return_val_if_fail (out_m != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (n_launders > MAX_BASINS)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("launders: %u is more than the accepted %u"), n_launders, MAX_BASINS);
      return FALSE;
    }
  if (n_launders > 0 && !check_length (launder_length_m, BW_ ("launder length"), error))
    return FALSE;
  if (!check_optional_length (end_weir_m, BW_ ("end weir length"), error))
    return FALSE;
  total = (n_launders > 0 ? n_launders * launder_length_m * (double_sided ? 2.0 : 1.0) : 0.0)
          + end_weir_m;
  if (!(total > 0.0))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("launders: no launder and no end weir gives no weir length"));
      return FALSE;
    }
  *out_m = total;
  return TRUE;
}

const char *
bw_inlet_kind_name (BwInletKind kind)
{
  switch (kind)
    {
    case BW_INLET_PERFORATED_BAFFLE:
      return "perforated-baffle";
    case BW_INLET_BAFFLE:
      return "inlet-baffle";
    case BW_INLET_NONE:
      return "none";
    default:
      return "unknown";
    }
}

gboolean
bw_inlet_kind_from_name (const char *name, BwInletKind *out)
{
  static const BwInletKind all[] = { BW_INLET_PERFORATED_BAFFLE, BW_INLET_BAFFLE, BW_INLET_NONE };

  if (name == NULL)
    return FALSE;
  for (gsize i = 0; i < G_N_ELEMENTS (all); i++)
    if (g_ascii_strcasecmp (name, bw_inlet_kind_name (all[i])) == 0)
      {
        if (out != NULL)
          *out = all[i];
        return TRUE;
      }
  return FALSE;
}

/* --- circular clarifier --- */

void
bw_clarifier_init (BwClarifier *c)
{
  g_return_if_fail (c != NULL);
  memset (c, 0, sizeof *c);
  c->n_clarifiers = 1;
  c->launder = BW_LAUNDER_PERIPHERAL;
}

static gboolean
check_clarifier_geometry (const BwClarifier *c, GError **error)
{
  const double r_tank = c->diameter_m / 2.0;
  const double r_well = c->feed_well_diameter_m / 2.0;

  if (!check_length (c->diameter_m, BW_ ("diameter"), error)
      || !check_length (c->depth_m, BW_ ("depth"), error)
      || !check_count (c->n_clarifiers, MAX_BASINS, BW_ ("clarifiers"), BW_ ("clarifiers in service"), error)
      || !check_optional_length (c->feed_well_diameter_m, BW_ ("feed well diameter"), error)
      || !check_optional_length (c->feed_well_depth_m, BW_ ("feed well depth"), error))
    return FALSE;
  if (c->feed_well_diameter_m >= c->diameter_m)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
                   BW_ ("feed well diameter: %g m is not smaller than the clarifier's diameter (%g m)"),
                   c->feed_well_diameter_m, c->diameter_m);
      return FALSE;
    }
  if (c->feed_well_depth_m > 0.0 && c->feed_well_diameter_m == 0.0)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
                   BW_ ("feed well depth: given for a clarifier without a feed well (give its "
                   "diameter)"));
      return FALSE;
    }
  if (c->feed_well_depth_m >= c->depth_m)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
                   BW_ ("feed well depth: a %g m skirt reaches the floor (side water depth %g m)"),
                   c->feed_well_depth_m, c->depth_m);
      return FALSE;
    }
  switch (c->launder)
    {
    case BW_LAUNDER_PERIPHERAL:
      if (!bw_check_nonnegative (c->launder_inset_m, BW_ ("launder inset"), error))
        return FALSE;
      if (r_tank - c->launder_inset_m <= r_well)
        {
          if (r_well > 0.0)
            g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
                         BW_ ("launder inset: %g m from the wall puts the weir at or inside the "
                              "feed well (tank radius %g m)"), c->launder_inset_m, r_tank);
          else
            g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
                         BW_ ("launder inset: %g m from the wall puts the weir at or past the "
                              "centre (tank radius %g m)"), c->launder_inset_m, r_tank);
          return FALSE;
        }
      break;
    case BW_LAUNDER_INBOARD:
      if (!bw_check_positive (c->launder_radius_m, BW_ ("launder radius"), error))
        return FALSE;
      if (c->launder_radius_m >= r_tank)
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
                       BW_ ("launder radius: %g m puts the launder outside the tank (radius %g m)"),
                       c->launder_radius_m, r_tank);
          return FALSE;
        }
      if (c->launder_radius_m <= r_well)
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_GEOMETRY,
                       BW_ ("launder radius: %g m puts the launder inside the feed well (radius %g m)"),
                       c->launder_radius_m, r_well);
          return FALSE;
        }
      break;
    default:
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, BW_ ("launder: unknown value %d"),
                   (int) c->launder);
      return FALSE;
    }
  return TRUE;
}

/*
 * Per clarifier, q = Q / n (m3/s), diameter D, side water depth H, feed well D_fw (all m):
 *   gross area  A_g = pi D^2 / 4;  net area A = pi (D^2 - D_fw^2) / 4                  m2
 *   overflow rate v0 = q / A (net: water inside the feed well has not yet entered the
 *     settling zone, so its plan area settles nothing; the conservative choice. Many texts
 *     quote q / A_g, reported beside it; common practice, no source)                    m/s
 *   detention t = A_g H / q (the whole tank holds water; a sloped floor's extra volume
 *     is left out, which understates t slightly: conservative)                          s
 *   weir length: peripheral pi (D - 2 inset); inboard ring launder 2 x 2 pi r, both weirs
 *     taken at the launder's radius r (its width neglected)                             m
 *   outflow beneath the feed-well skirt v = q / (pi D_fw (H - h_skirt)), by continuity
 *     through the cylinder between the skirt's lower edge and the floor                 m/s
 */
gboolean
bw_clarifier_evaluate (const BwClarifier *c, double flow_m3_s, BwClarifierResult *out,
                       GError **error)
{
  BwClarifierResult r = { 0 };
  double q;

  g_return_val_if_fail (c != NULL && out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!check_flow (flow_m3_s, error) || !check_clarifier_geometry (c, error))
    return FALSE;

  q = flow_m3_s / c->n_clarifiers;
  r.flow_per_clarifier_m3_s = q;
  r.gross_area_m2 = G_PI * c->diameter_m * c->diameter_m / 4.0;
  r.surface_area_m2 = G_PI * (c->diameter_m * c->diameter_m
                              - c->feed_well_diameter_m * c->feed_well_diameter_m) / 4.0;
  r.volume_m3 = r.gross_area_m2 * c->depth_m;
  r.overflow_rate_m_s = q / r.surface_area_m2;
  r.gross_overflow_rate_m_s = q / r.gross_area_m2;
  r.detention_s = r.volume_m3 / q;
  if (c->launder == BW_LAUNDER_PERIPHERAL)
    r.weir_length_m = G_PI * (c->diameter_m - 2.0 * c->launder_inset_m);
  else
    r.weir_length_m = 2.0 * 2.0 * G_PI * c->launder_radius_m;
  r.weir_loading_m2_s = q / r.weir_length_m;
  if (c->feed_well_depth_m > 0.0)
    {
      r.has_skirt_velocity = TRUE;
      r.skirt_velocity_m_s = q / (G_PI * c->feed_well_diameter_m
                                  * (c->depth_m - c->feed_well_depth_m));
    }
  {
    const double all[] = { r.gross_area_m2, r.surface_area_m2, r.volume_m3, r.overflow_rate_m_s,
                           r.gross_overflow_rate_m_s, r.detention_s, r.weir_length_m,
                           r.weir_loading_m2_s, r.skirt_velocity_m_s };
    if (!check_results_finite (all, G_N_ELEMENTS (all), BW_ ("flow"), error))
      return FALSE;
  }
  *out = r;
  return TRUE;
}

/* --- inclined plate and tube settlers --- */

static gboolean
shape_is_valid (BwSettlerShape shape)
{
  return shape == BW_SETTLER_PLATES || shape == BW_SETTLER_CIRCULAR_TUBES
         || shape == BW_SETTLER_SQUARE_TUBES;
}

/* Yao (1970), "Theoretical study of high-rate sedimentation", J. WPCF 42:218: the critical value
 * S_c of the channel shape (from memory of the paper). */
double
bw_settler_shape_factor (BwSettlerShape shape)
{
  switch (shape)
    {
    case BW_SETTLER_PLATES:
      return 1.0;
    case BW_SETTLER_CIRCULAR_TUBES:
      return 4.0 / 3.0;
    case BW_SETTLER_SQUARE_TUBES:
      return 11.0 / 8.0;
    default:
      return 0.0;
    }
}

const char *
bw_settler_shape_name (BwSettlerShape shape)
{
  switch (shape)
    {
    case BW_SETTLER_PLATES:
      return "plates";
    case BW_SETTLER_CIRCULAR_TUBES:
      return "circular-tubes";
    case BW_SETTLER_SQUARE_TUBES:
      return "square-tubes";
    default:
      return "unknown";
    }
}

gboolean
bw_settler_shape_from_name (const char *name, BwSettlerShape *out)
{
  static const BwSettlerShape all[] = { BW_SETTLER_PLATES, BW_SETTLER_CIRCULAR_TUBES,
                                        BW_SETTLER_SQUARE_TUBES };

  if (name == NULL)
    return FALSE;
  for (gsize i = 0; i < G_N_ELEMENTS (all); i++)
    if (g_ascii_strcasecmp (name, bw_settler_shape_name (all[i])) == 0)
      {
        if (out != NULL)
          *out = all[i];
        return TRUE;
      }
  return FALSE;
}

static gboolean
check_shape (BwSettlerShape shape, GError **error)
{
  if (shape_is_valid (shape))
    return TRUE;
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, BW_ ("shape: unknown value %d"),
               (int) shape);
  return FALSE;
}

/*
 * Yao (1970), J. WPCF 42:218, closed form for laminar flow up an inclined channel:
 *   v_sc = S_c v0 / (sin theta + L cos theta),  L = l / w
 * v0: mean channel velocity (m/s); theta: angle from the horizontal (rad); l: length along the
 * incline (m); w: perpendicular spacing, tube diameter or side (m). Every particle settling at
 * v_sc (m/s) or faster is removed. The entrance-region correction some designers subtract from L
 * is not applied here.
 */
gboolean
bw_yao_critical_velocity (BwSettlerShape shape, double channel_velocity_m_s, double angle_rad,
                          double spacing_m, double length_m, BwYaoResult *out, GError **error)
{
  BwYaoResult r;

  g_return_val_if_fail (out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!check_shape (shape, error)
      || !bw_check_positive (channel_velocity_m_s, BW_ ("channel velocity"), error)
      || !bw_check_range (channel_velocity_m_s, 0.0, 10.0, BW_ ("channel velocity"), "m/s", error)
      || !check_angle (angle_rad, error)
      || !check_length (spacing_m, BW_ ("spacing"), error)
      || !check_length (length_m, BW_ ("length"), error))
    return FALSE;

  r.shape_factor = bw_settler_shape_factor (shape);
  r.relative_length = length_m / spacing_m;
  r.critical_velocity_m_s = r.shape_factor * channel_velocity_m_s
                            / (sin (angle_rad) + r.relative_length * cos (angle_rad));
  {
    const double all[] = { r.relative_length, r.critical_velocity_m_s };
    if (!check_results_finite (all, G_N_ELEMENTS (all), BW_ ("channel velocity"), error))
      return FALSE;
  }
  *out = r;
  return TRUE;
}

/* Hydraulic radius = flow area / wetted perimeter (m). Davis (2010) p. 10-37 takes R_h = d/4 for
 * a 50 mm tube. Between plates of width b at spacing w, closed by the module's side walls:
 * w b / (2 (w + b)), tending to w / 2 as b grows. */
gboolean
bw_settler_hydraulic_radius (BwSettlerShape shape, double spacing_m, double plate_width_m,
                             double *out_m, GError **error)
{
  g_return_val_if_fail (out_m != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!check_shape (shape, error) || !check_length (spacing_m, BW_ ("spacing"), error))
    return FALSE;
  if (shape == BW_SETTLER_PLATES)
    {
      if (!check_optional_length (plate_width_m, BW_ ("plate width"), error))
        return FALSE;
      *out_m = plate_width_m > 0.0
                 ? spacing_m * plate_width_m / (2.0 * (spacing_m + plate_width_m))
                 : spacing_m / 2.0;
    }
  else
    *out_m = spacing_m / 4.0;
  return TRUE;
}

void
bw_settler_init (BwSettler *s, BwSettlerShape shape)
{
  g_return_if_fail (s != NULL);
  memset (s, 0, sizeof *s);
  s->shape = shape;
  s->angle_rad = G_PI / 3.0;
  s->n_basins = 1;
}

/* Cross-section of one channel normal to its axis (m2), and the width (m) of its settling floor
 * seen from above. */
static void
channel_cell (const BwSettler *s, double *area_m2, double *floor_width_m)
{
  switch (s->shape)
    {
    case BW_SETTLER_PLATES:
      *area_m2 = s->spacing_m * s->plate_width_m;
      *floor_width_m = s->plate_width_m;
      break;
    case BW_SETTLER_SQUARE_TUBES:
      *area_m2 = s->spacing_m * s->spacing_m;
      *floor_width_m = s->spacing_m;
      break;
    case BW_SETTLER_CIRCULAR_TUBES:
    default:
      *area_m2 = G_PI * s->spacing_m * s->spacing_m / 4.0;
      *floor_width_m = s->spacing_m;
      break;
    }
}

static gboolean
check_settler (const BwSettler *s, GError **error)
{
  if (!check_shape (s->shape, error) || !check_angle (s->angle_rad, error)
      || !check_length (s->spacing_m, BW_ ("spacing"), error)
      || !check_length (s->length_m, BW_ ("length"), error)
      || !check_count (s->n_basins, MAX_BASINS, BW_ ("basins"), BW_ ("basins in service"), error))
    return FALSE;
  if (s->shape == BW_SETTLER_PLATES)
    {
      if (!check_optional_length (s->plate_width_m, BW_ ("plate width"), error))
        return FALSE;
      if (s->count > 0 && s->plate_width_m == 0.0)
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                       BW_ ("plate width: needed when plates are counted (got 0)"));
          return FALSE;
        }
    }
  if (s->count > MAX_SETTLER_COUNT)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("count: %u is more than the accepted %u"), s->count, MAX_SETTLER_COUNT);
      return FALSE;
    }
  if (s->count == 0)
    {
      if (!bw_check_positive (s->module_plan_area_m2, BW_ ("module plan area"), error)
          || !bw_check_range (s->module_plan_area_m2, 0.0, MAX_AREA_M2, BW_ ("module plan area"), "m2",
                              error))
        return FALSE;
    }
  return TRUE;
}

/*
 * Per basin, q = Q / n (m3/s):
 *  - counted channels (N plates or tubes; each plate and the one above it bound a channel, so N
 *    plates give N channels with one settling floor each, edge effects neglected):
 *      channel area A_c = N a (a = w b, w^2 or pi d^2/4)            m2
 *      projected area A_p = N l b_f cos theta (b_f = b, or w, d)   m2 (WTP Design 4th ed., p. 7.26:
 *      plate area x cos theta)
 *  - module plan area A_m: the channels' total cross-section normal to the incline is
 *      A_c = A_m sin theta (wall thickness and the gaps between circular tubes neglected: each
 *      channel is a cell of side w; Davis 2010 p. 10-37 uses v = Q / (A sin theta));
 *      A_p = A_m L sin theta cos theta (the cells' floors: A_m sin theta / w^2 cells per basin,
 *      each l w cos theta; derived).
 *  v0 = q / A_c; Yao's v_sc from v0; Re = v0 R_h / nu; Fr = v0^2 / (g R_h).
 */
gboolean
bw_settler_evaluate (const BwSettler *s, double flow_m3_s, const BwWater *water,
                     BwSettlerResult *out, GError **error)
{
  BwSettlerResult r = { 0 };
  BwYaoResult yao;
  double q, cos_t, sin_t;

  g_return_val_if_fail (s != NULL && water != NULL && out != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!check_flow (flow_m3_s, error) || !check_settler (s, error) || !check_water (water, error))
    return FALSE;

  q = flow_m3_s / s->n_basins;
  cos_t = cos (s->angle_rad);
  sin_t = sin (s->angle_rad);
  r.flow_per_basin_m3_s = q;
  r.relative_length = s->length_m / s->spacing_m;
  if (s->count > 0)
    {
      double cell_area, floor_width;

      channel_cell (s, &cell_area, &floor_width);
      r.channel_area_m2 = s->count * cell_area;
      r.projected_area_m2 = s->count * s->length_m * floor_width * cos_t;
    }
  else
    {
      r.channel_area_m2 = s->module_plan_area_m2 * sin_t;
      r.projected_area_m2 = s->module_plan_area_m2 * r.relative_length * sin_t * cos_t;
    }
  r.channel_velocity_m_s = q / r.channel_area_m2;
  r.projected_loading_m_s = q / r.projected_area_m2;

  if (!bw_yao_critical_velocity (s->shape, r.channel_velocity_m_s, s->angle_rad, s->spacing_m,
                                 s->length_m, &yao, error))
    {
      /* Only the channel velocity can fail here (the geometry passed already): say why. */
      g_prefix_error (error, BW_ ("flow: %g m3/s per basin is too fast for these channels; "), q);
      return FALSE;
    }
  r.shape_factor = yao.shape_factor;
  r.critical_velocity_m_s = yao.critical_velocity_m_s;
  if (!bw_settler_hydraulic_radius (s->shape, s->spacing_m, s->plate_width_m,
                                    &r.hydraulic_radius_m, error))
    return FALSE;
  r.reynolds = r.channel_velocity_m_s * r.hydraulic_radius_m / water->kinematic_viscosity_m2_s;
  r.froude = r.channel_velocity_m_s * r.channel_velocity_m_s
             / (BW_GRAVITY_M_S2 * r.hydraulic_radius_m);
  if (r.reynolds >= BW_SETTLER_REYNOLDS_MAX)
    r.cautions |= BW_SED_CAUTION_REYNOLDS_HIGH;
  if (r.froude <= BW_BASIN_FROUDE_MIN)
    r.cautions |= BW_SED_CAUTION_FROUDE_LOW;
  {
    const double all[] = { r.channel_area_m2, r.channel_velocity_m_s, r.projected_area_m2,
                           r.projected_loading_m_s, r.critical_velocity_m_s, r.reynolds,
                           r.froude };
    if (!check_results_finite (all, G_N_ELEMENTS (all), BW_ ("flow"), error))
      return FALSE;
  }
  *out = r;
  return TRUE;
}

/* --- inverse solves --- */

static gboolean
check_overflow_target (double v0_m_s, GError **error)
{
  return bw_check_positive (v0_m_s, BW_ ("overflow rate"), error)
         && bw_check_range (v0_m_s, 0.0, 1.0, BW_ ("overflow rate"), "m/s", error);
}

gboolean
bw_basin_area_for_overflow (double flow_m3_s, guint n_basins, double overflow_rate_m_s,
                            double *area_m2, GError **error)
{
  double a;

  g_return_val_if_fail (area_m2 != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!check_flow (flow_m3_s, error)
      || !check_count (n_basins, MAX_BASINS, BW_ ("basins"), BW_ ("basins in service"), error)
      || !check_overflow_target (overflow_rate_m_s, error))
    return FALSE;
  a = flow_m3_s / (n_basins * overflow_rate_m_s);
  if (!check_results_finite (&a, 1, BW_ ("overflow rate"), error))
    return FALSE;
  *area_m2 = a;
  return TRUE;
}

/* A = W L = r W^2, so W = sqrt (A / r) and L = r W. */
gboolean
bw_basin_size_for_overflow (double flow_m3_s, guint n_basins, double overflow_rate_m_s,
                            double length_width_ratio, double *width_m, double *length_m,
                            GError **error)
{
  double a, w;

  g_return_val_if_fail (width_m != NULL && length_m != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!bw_check_positive (length_width_ratio, BW_ ("length/width ratio"), error)
      || !check_plain_range (length_width_ratio, 1.0e-2, 1.0e3, BW_ ("length/width ratio"), error))
    return FALSE;
  if (!bw_basin_area_for_overflow (flow_m3_s, n_basins, overflow_rate_m_s, &a, error))
    return FALSE;
  w = sqrt (a / length_width_ratio);
  *width_m = w;
  *length_m = length_width_ratio * w;
  return TRUE;
}

/* Smallest whole N >= 1 with DEMAND / N <= 1, DEMAND being the load of one unit over its
 * capacity: N = ceil (DEMAND), since N - 1 < DEMAND units would be overloaded. */
static gboolean
smallest_count (double demand, guint max, const char *field, guint *out, GError **error)
{
  if (!(demand <= (double) max))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("%s: the target needs more than %u units"), field, max);
      return FALSE;
    }
  *out = (guint) MAX (1.0, ceil (demand));
  return TRUE;
}

gboolean
bw_basin_count_for_overflow (double flow_m3_s, double area_per_basin_m2, double overflow_rate_m_s,
                             guint *n_basins, GError **error)
{
  g_return_val_if_fail (n_basins != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!check_flow (flow_m3_s, error)
      || !bw_check_positive (area_per_basin_m2, BW_ ("surface area"), error)
      || !bw_check_range (area_per_basin_m2, 0.0, MAX_AREA_M2, BW_ ("surface area"), "m2", error)
      || !check_overflow_target (overflow_rate_m_s, error))
    return FALSE;
  return smallest_count (flow_m3_s / (area_per_basin_m2 * overflow_rate_m_s), MAX_BASINS,
                         BW_ ("overflow rate"), n_basins, error);
}

gboolean
bw_weir_length_for_loading (double flow_m3_s, guint n_basins, double weir_loading_m2_s,
                            double *length_m, GError **error)
{
  double l;

  g_return_val_if_fail (length_m != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!check_flow (flow_m3_s, error)
      || !check_count (n_basins, MAX_BASINS, BW_ ("basins"), BW_ ("basins in service"), error)
      || !bw_check_positive (weir_loading_m2_s, BW_ ("weir loading"), error)
      || !bw_check_range (weir_loading_m2_s, 0.0, 10.0, BW_ ("weir loading"), "m2/s", error))
    return FALSE;
  l = flow_m3_s / (n_basins * weir_loading_m2_s);
  if (!check_results_finite (&l, 1, BW_ ("weir loading"), error))
    return FALSE;
  *length_m = l;
  return TRUE;
}

gboolean
bw_settler_count_for_loading (const BwSettler *s, double flow_m3_s, double loading_m_s,
                              double area_fraction, guint *count, GError **error)
{
  BwSettler counted;
  double cell_area, floor_width, unit_area;

  g_return_val_if_fail (s != NULL && count != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  /* Validate the geometry as a counted settler (one unit): plates need their width. */
  counted = *s;
  counted.count = 1;
  if (!check_flow (flow_m3_s, error) || !check_settler (&counted, error)
      || !bw_check_positive (loading_m_s, BW_ ("loading"), error)
      || !bw_check_range (loading_m_s, 0.0, 1.0, BW_ ("loading"), "m/s", error)
      || !bw_check_positive (area_fraction, BW_ ("area fraction"), error)
      || !check_plain_range (area_fraction, 0.0, 1.0, BW_ ("area fraction"), error))
    return FALSE;
  channel_cell (&counted, &cell_area, &floor_width);
  unit_area = s->length_m * floor_width * cos (s->angle_rad) * area_fraction;
  return smallest_count (flow_m3_s / s->n_basins / (unit_area * loading_m_s), MAX_SETTLER_COUNT,
                         BW_ ("loading"), count, error);
}
