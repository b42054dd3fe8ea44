/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-params.c: the parameter tables of every process unit and flocculator stage. Valid ranges
 * are physical or practical bounds (common practice, no source); the design criteria judge the
 * design, these only refuse what is meaningless. */
#include "config.h"

#include "engine/bw-params.h"

#include <math.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"

/* Labels, help texts and choice names are marked for the template only: the engine stays
 * locale-free, and the workbench translates them where it shows them (the choice names are also
 * the file keywords, so only their display is translated, in the context "choice"). */
#define N_(s) (s)
#define NC_(context, s) (s)

#define Q(id, label, kind, def, lo, hi, help) \
  { id, label, BW_PARAM_QUANTITY, kind, def, lo, hi, TRUE, NULL, FALSE, help }
#define QOPT(id, label, kind, lo, hi, help) \
  { id, label, BW_PARAM_QUANTITY, kind, 0.0, lo, hi, TRUE, NULL, TRUE, help }
#define N(id, label, def, lo, hi, help) \
  { id, label, BW_PARAM_COUNT, BW_KIND_NUMBER, def, lo, hi, FALSE, NULL, FALSE, help }
#define CH(...) ((const char *const[]) { __VA_ARGS__, NULL })
#define C(id, label, def, choices, help) \
  { id, label, BW_PARAM_CHOICE, BW_KIND_NUMBER, def, 0, 0, FALSE, choices, FALSE, help }

static const BwParamSpec rapid_mix[] = {
  C ("shape", N_("tank shape"), 0, CH (NC_("choice", "square"), NC_("choice", "cylindrical")),
     N_("plan shape of the tank")),
  Q ("width", N_("width or diameter"), BW_KIND_LENGTH, 1.2, 0, 20,
     N_("inside width (square) or diameter")),
  Q ("liquid-depth", N_("liquid depth"), BW_KIND_LENGTH, 1.4, 0, 20,
     N_("depth of water in the tank")),
  C ("baffles", N_("wall baffles"), 0, CH (NC_("choice", "baffled"), NC_("choice", "unbaffled")),
     N_("baffles stop the swirl that lowers power")),
  C ("impeller", N_("impeller"), 0,
     CH (NC_("choice", "rushton"), NC_("choice", "pitched-blade-45"), NC_("choice", "hydrofoil"),
         NC_("choice", "custom")),
     N_("impeller type; custom takes the power number below")),
  Q ("impeller-diameter", N_("impeller diameter"), BW_KIND_LENGTH, 0.45, 0, 10,
     N_("tip-to-tip diameter")),
  Q ("speed", N_("impeller speed"), BW_KIND_ROTATIONAL_SPEED, 110.0 / 60.0, 0, 100,
     N_("shaft speed")),
  QOPT ("power-number", N_("power number"), BW_KIND_NUMBER, 0, 20,
        N_("turbulent power number; needed for a custom impeller or an unbaffled tank")),
  Q ("drive-efficiency", N_("drive efficiency"), BW_KIND_FRACTION, 0.8, 0, 1,
     N_("motor and gear efficiency: motor power = water power / efficiency")),
};

static const BwParamSpec inline_mixer[] = {
  Q ("headloss", N_("head loss"), BW_KIND_HEAD, 0.3, 0, 50, N_("head lost across the mixer")),
  Q ("volume", N_("mixing volume"), BW_KIND_VOLUME, 0.1, 0, 1000,
     N_("volume over which the energy is spent")),
};

static const BwParamSpec flocculator[] = {
  Q ("width", N_("basin width"), BW_KIND_LENGTH, 12.0, 0, 200, N_("width across the flow")),
  Q ("water-depth", N_("water depth"), BW_KIND_LENGTH, 4.0, 0, 20,
     N_("depth of water in every stage")),
};

static const BwParamSpec paddle_stage[] = {
  Q ("length", N_("stage length"), BW_KIND_LENGTH, 4.0, 0, 100,
     N_("length of the compartment along the flow")),
  C ("shaft", N_("shaft"), 0, CH (NC_("choice", "horizontal"), NC_("choice", "vertical")),
     N_("shaft orientation")),
  N ("wheels", N_("paddle wheels"), 3, 1, 50, N_("paddle wheels on the shaft in this stage")),
  N ("arms", N_("arms per wheel"), 4, 1, 12, N_("arms on each wheel")),
  Q ("blade-radius-1", N_("outer blade radius"), BW_KIND_LENGTH, 1.5, 0, 20,
     N_("shaft to blade centreline; each radius given adds a blade to every arm")),
  QOPT ("blade-radius-2", N_("second blade radius"), BW_KIND_LENGTH, 0, 20,
        N_("shaft to blade centreline")),
  QOPT ("blade-radius-3", N_("third blade radius"), BW_KIND_LENGTH, 0, 20,
        N_("shaft to blade centreline")),
  Q ("blade-length", N_("blade length"), BW_KIND_LENGTH, 2.5, 0, 50, N_("length of a blade")),
  Q ("blade-width", N_("blade width"), BW_KIND_LENGTH, 0.15, 0, 5, N_("width of a blade")),
  Q ("speed", N_("shaft speed"), BW_KIND_ROTATIONAL_SPEED, 3.0 / 60.0, 0, 5,
     N_("rotational speed")),
  Q ("velocity-factor", N_("relative-velocity factor"), BW_KIND_NUMBER, 0.75, 0, 1,
     N_("blade velocity relative to the water / blade velocity")),
  QOPT ("drag-coefficient", N_("drag coefficient"), BW_KIND_NUMBER, 0, 5,
        N_("overrides the value from the blade's length/width ratio")),
};

static const BwParamSpec turbine_stage[] = {
  Q ("length", N_("stage length"), BW_KIND_LENGTH, 4.0, 0, 100,
     N_("length of the compartment along the flow")),
  C ("impeller", N_("impeller"), 2,
     CH (NC_("choice", "rushton"), NC_("choice", "pitched-blade-45"), NC_("choice", "hydrofoil"),
         NC_("choice", "custom")),
     N_("impeller type")),
  C ("baffles", N_("wall baffles"), 0, CH (NC_("choice", "baffled"), NC_("choice", "unbaffled")),
     N_("an unbaffled compartment needs a power number")),
  Q ("impeller-diameter", N_("impeller diameter"), BW_KIND_LENGTH, 2.0, 0, 20,
     N_("tip-to-tip diameter")),
  Q ("speed", N_("impeller speed"), BW_KIND_ROTATIONAL_SPEED, 20.0 / 60.0, 0, 50,
     N_("shaft speed")),
  QOPT ("power-number", N_("power number"), BW_KIND_NUMBER, 0, 20,
        N_("needed for a custom impeller")),
};

static const BwParamSpec baffled_stage[] = {
  C ("style", N_("flow path"), 0,
     CH (NC_("choice", "around-the-end"), NC_("choice", "over-and-under")),
     N_("horizontal or vertical serpentine; each pass spans the basin width")),
  N ("passes", N_("passes"), 12, 2, 500,
     N_("channels in series; the stage is passes x spacing long")),
  Q ("spacing", N_("baffle spacing"), BW_KIND_LENGTH, 0.6, 0, 20,
     N_("clear width of each channel")),
  QOPT ("turn-coefficient", N_("turn loss coefficient"), BW_KIND_NUMBER, 0, 20,
        N_("head loss per turn in velocity heads; empty: the default of the flow path")),
  Q ("manning-n", N_("Manning's n"), BW_KIND_NUMBER, 0.013, 0, 0.1, N_("channel roughness")),
};

static const BwParamSpec rect_basin[] = {
  Q ("length", N_("length"), BW_KIND_LENGTH, 40.0, 0, 500, N_("length along the flow")),
  Q ("width", N_("width"), BW_KIND_LENGTH, 9.0, 0, 100, N_("width across the flow")),
  Q ("side-water-depth", N_("side water depth"), BW_KIND_LENGTH, 4.0, 0, 20,
     N_("depth of water at the wall")),
  QOPT ("weir-length", N_("weir length"), BW_KIND_LENGTH, 0, 10000,
        N_("total length of effluent weir (count both sides of a launder)")),
  C ("inlet", N_("inlet"), 0,
     CH (NC_("choice", "perforated-baffle"), NC_("choice", "inlet-baffle"), NC_("choice", "none")),
     N_("inlet arrangement")),
  Q ("sludge-depth", N_("sludge zone depth"), BW_KIND_LENGTH, 0.5, 0, 10,
     N_("allowance below the settling zone")),
  Q ("particle-diameter", N_("scour particle diameter"), BW_KIND_LENGTH, 100e-6, 0, 0.01,
     N_("design particle for Camp's scour velocity")),
  Q ("particle-sg", N_("scour particle specific gravity"), BW_KIND_NUMBER, 1.25, 1, 10,
     N_("specific gravity of the settled floc or particle")),
  Q ("cohesion", N_("cohesion constant k"), BW_KIND_NUMBER, 0.05, 0, 1, N_("Camp's k, 0.04-0.06")),
  Q ("friction", N_("friction factor f"), BW_KIND_NUMBER, 0.025, 0, 1,
     N_("Darcy-Weisbach f, 0.02-0.03")),
  QOPT ("design-settling-velocity", N_("design settling velocity"), BW_KIND_VELOCITY, 0, 1,
        N_("for the predicted removal of the design particle")),
};

static const BwParamSpec circular[] = {
  Q ("diameter", N_("diameter"), BW_KIND_LENGTH, 30.0, 0, 200, N_("inside diameter")),
  Q ("side-water-depth", N_("side water depth"), BW_KIND_LENGTH, 4.0, 0, 20,
     N_("depth of water at the wall")),
  QOPT ("feed-well-diameter", N_("feed well diameter"), BW_KIND_LENGTH, 0, 100,
        N_("centre feed well")),
  C ("launder", N_("launder"), 0, CH (NC_("choice", "peripheral"), NC_("choice", "inboard")),
     N_("effluent launder position")),
  QOPT ("launder-radius", N_("launder radius"), BW_KIND_LENGTH, 0, 100,
        N_("radius of an inboard launder (weirs on both sides)")),
  Q ("sludge-depth", N_("sludge zone depth"), BW_KIND_LENGTH, 0.5, 0, 10,
     N_("allowance for the sloped floor")),
  QOPT ("design-settling-velocity", N_("design settling velocity"), BW_KIND_VELOCITY, 0, 1,
        N_("for the predicted removal of the design particle")),
};

static const BwParamSpec plate_settler[] = {
  C ("shape", N_("channel shape"), 0,
     CH (NC_("choice", "plates"), NC_("choice", "circular-tubes"), NC_("choice", "square-tubes")),
     N_("plates or tubes")),
  Q ("angle", N_("angle from horizontal"), BW_KIND_ANGLE, G_PI / 3, 0, G_PI / 2, N_("inclination")),
  Q ("spacing", N_("spacing or tube size"), BW_KIND_LENGTH, 0.05, 0, 2,
     N_("perpendicular plate spacing or tube diameter")),
  Q ("length", N_("length along the incline"), BW_KIND_LENGTH, 1.2, 0, 10,
     N_("plate or tube length")),
  Q ("plate-width", N_("plate width"), BW_KIND_LENGTH, 1.5, 0, 10,
     N_("width of a plate or of a tube row")),
  N ("count", N_("plates or tubes"), 100, 1, 1000000, N_("plates (or tube channels) per unit")),
  QOPT ("module-area", N_("module plan area"), BW_KIND_AREA, 0, 100000,
        N_("plan area the modules cover, for the loading on the covered area")),
  QOPT ("design-settling-velocity", N_("design settling velocity"), BW_KIND_VELOCITY, 0, 1,
        N_("for the predicted removal of the design particle")),
};

typedef struct
{
  const char *name;
  const char *label;
  const BwParamSpec *params;
  guint n;
} TypeInfo;

#define T(name, label, table) { name, label, table, G_N_ELEMENTS (table) }

static const TypeInfo types[BW_N_PROCESS_TYPES] = {
  [BW_PROCESS_RAPID_MIX] = T ("rapid-mix", N_("rapid-mix tank"), rapid_mix),
  [BW_PROCESS_INLINE_MIXER] = T ("inline-mixer", N_("in-line mixer"), inline_mixer),
  [BW_PROCESS_FLOCCULATOR] = T ("flocculator", N_("flocculator"), flocculator),
  [BW_PROCESS_RECTANGULAR_BASIN] = T ("rectangular-basin", N_("rectangular settling basin"),
                                      rect_basin),
  [BW_PROCESS_CIRCULAR_CLARIFIER] = T ("circular-clarifier", N_("circular clarifier"), circular),
  [BW_PROCESS_PLATE_SETTLER] = T ("plate-settler", N_("plate or tube settler"), plate_settler),
  [BW_STAGE_PADDLE] = T ("paddle-stage", N_("paddle stage"), paddle_stage),
  [BW_STAGE_TURBINE] = T ("turbine-stage", N_("turbine stage"), turbine_stage),
  [BW_STAGE_BAFFLED] = T ("baffled-stage", N_("baffled-channel stage"), baffled_stage),
};

G_STATIC_ASSERT (G_N_ELEMENTS (paddle_stage) <= BW_MAX_PARAMS);
G_STATIC_ASSERT (G_N_ELEMENTS (rect_basin) <= BW_MAX_PARAMS);

const char *
bw_process_type_name (BwProcessType t)
{
  g_return_val_if_fail (t < BW_N_PROCESS_TYPES, "unknown");
  return types[t].name;
}

const char *
bw_process_type_label (BwProcessType t)
{
  g_return_val_if_fail (t < BW_N_PROCESS_TYPES, "unknown");
  return types[t].label;
}

gboolean
bw_process_type_from_name (const char *name, BwProcessType *out)
{
  if (name == NULL)
    return FALSE;
  for (int i = 0; i < BW_N_PROCESS_TYPES; i++)
    if (strcmp (types[i].name, name) == 0)
      {
        *out = (BwProcessType) i;
        return TRUE;
      }
  return FALSE;
}

gboolean
bw_process_type_is_stage (BwProcessType t)
{
  return t == BW_STAGE_PADDLE || t == BW_STAGE_TURBINE || t == BW_STAGE_BAFFLED;
}

const BwParamSpec *
bw_params_of (BwProcessType type, guint *n)
{
  g_return_val_if_fail (type < BW_N_PROCESS_TYPES, NULL);
  if (n)
    *n = types[type].n;
  return types[type].params;
}

int
bw_param_index (BwProcessType type, const char *id)
{
  g_return_val_if_fail (type < BW_N_PROCESS_TYPES, -1);
  for (guint i = 0; i < types[type].n; i++)
    if (strcmp (types[type].params[i].id, id) == 0)
      return (int) i;
  return -1;
}

const char *
bw_param_choice_name (const BwParamSpec *spec, int index)
{
  g_return_val_if_fail (spec && spec->type == BW_PARAM_CHOICE, NULL);
  for (int i = 0; spec->choices[i]; i++)
    if (i == index)
      return spec->choices[i];
  return NULL;
}

char *
bw_param_choices_joined (const BwParamSpec *spec)
{
  g_return_val_if_fail (spec && spec->type == BW_PARAM_CHOICE, NULL);
  return g_strjoinv ("|", (char **) spec->choices);
}

gboolean
bw_param_choice_index (const BwParamSpec *spec, const char *name, int *out)
{
  g_return_val_if_fail (spec && spec->type == BW_PARAM_CHOICE, FALSE);
  for (int i = 0;; i++)
    {
      const char *c = bw_param_choice_name (spec, i);
      if (c == NULL)
        return FALSE;
      if (g_strcmp0 (c, name) == 0)
        {
          *out = i;
          return TRUE;
        }
    }
}

gboolean
bw_param_check (const BwParamSpec *spec, double value, GError **error)
{
  g_return_val_if_fail (spec != NULL, FALSE);
  if (!bw_check_finite (value, BW_ (spec->label), error))
    return FALSE;
  switch (spec->type)
    {
    case BW_PARAM_CHOICE:
      if (value != floor (value) || bw_param_choice_name (spec, (int) value) == NULL)
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                       BW_ ("%s: not one of the offered choices"), BW_ (spec->label));
          return FALSE;
        }
      return TRUE;
    case BW_PARAM_COUNT:
      if (value != floor (value) || value < spec->min || value > spec->max)
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                       BW_ ("%s: must be a whole number from %g to %g (got %g)"), BW_ (spec->label), spec->min,
                       spec->max, value);
          return FALSE;
        }
      return TRUE;
    case BW_PARAM_QUANTITY:
      if (spec->optional && value == 0.0)
        return TRUE;
      if ((spec->min_exclusive ? value <= spec->min : value < spec->min) || value > spec->max)
        {
          const BwUnit *u = bw_units_si_unit (spec->kind);
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                       BW_ ("%s: %g %s is outside the valid range (%s %g to %g %s)"), BW_ (spec->label), value,
                       u->symbol, spec->min_exclusive ? BW_ ("above") : BW_ ("from"), spec->min, spec->max,
                       u->symbol);
          return FALSE;
        }
      return TRUE;
    default:
      g_assert_not_reached ();
      return FALSE;
    }
}
