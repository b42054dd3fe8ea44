/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-units.c: the unit table, parsing of typed values into SI, and formatting for reading. */
#include "config.h"

#include "engine/bw-units.h"

#include <errno.h>
#include <math.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"

/* Exact definitions, NIST SP 811 (2008) Appendix B and the 1959 international yard and pound. */
#define FT      0.3048                      /* m */
#define INCH    0.0254                      /* m */
#define YD      0.9144                      /* m */
#define GAL     3.785411784e-3              /* US liquid gallon, m3 (231 in3) */
#define LB      0.45359237                  /* pound (avoirdupois), kg */
#define LBF     4.4482216152605             /* pound-force, N (lb x 9.80665 m/s2) */
#define MINUTE  60.0                        /* s */
#define HOUR    3600.0                      /* s */
#define DAY     86400.0                     /* s */
#define FT2     (FT * FT)                   /* m2 */
#define FT3     (FT * FT * FT)              /* m3 */
#define HP      (550.0 * FT * LBF)          /* mechanical horsepower, 550 ft lbf/s = 745.6998716 W */

typedef struct
{
  BwUnit unit;
  const char *aliases; /* '|'-separated spellings, already normalised (see normalise_unit) */
} UnitDef;

#define U(sym, ascii, kind, factor, offset, aliases) \
  { { sym, ascii, kind, factor, offset }, aliases }

static const UnitDef unit_table[] = {
  /* length */
  U ("m", "m", BW_KIND_LENGTH, 1.0, 0.0, "m|metre|meter|metres|meters"),
  U ("mm", "mm", BW_KIND_LENGTH, 1e-3, 0.0, "mm"),
  U ("cm", "cm", BW_KIND_LENGTH, 1e-2, 0.0, "cm"),
  U ("km", "km", BW_KIND_LENGTH, 1e3, 0.0, "km"),
  U ("µm", "um", BW_KIND_LENGTH, 1e-6, 0.0, "um|micron|microns|micrometre|micrometer"),
  U ("nm", "nm", BW_KIND_LENGTH, 1e-9, 0.0, "nm"),
  U ("ft", "ft", BW_KIND_LENGTH, FT, 0.0, "ft|foot|feet|'"),
  U ("in", "in", BW_KIND_LENGTH, INCH, 0.0, "in|inch|inches|\""),
  U ("yd", "yd", BW_KIND_LENGTH, YD, 0.0, "yd|yard|yards"),
  /* area */
  U ("m²", "m2", BW_KIND_AREA, 1.0, 0.0, "m2|sqm"),
  U ("mm²", "mm2", BW_KIND_AREA, 1e-6, 0.0, "mm2"),
  U ("cm²", "cm2", BW_KIND_AREA, 1e-4, 0.0, "cm2"),
  U ("km²", "km2", BW_KIND_AREA, 1e6, 0.0, "km2"),
  U ("ha", "ha", BW_KIND_AREA, 1e4, 0.0, "ha|hectare|hectares"),
  U ("ft²", "ft2", BW_KIND_AREA, FT2, 0.0, "ft2|sqft|sq ft|sf"),
  U ("in²", "in2", BW_KIND_AREA, INCH * INCH, 0.0, "in2|sqin"),
  U ("acre", "acre", BW_KIND_AREA, 43560.0 * FT2, 0.0, "acre|acres|ac"),
  /* volume */
  U ("m³", "m3", BW_KIND_VOLUME, 1.0, 0.0, "m3|cum"),
  U ("L", "L", BW_KIND_VOLUME, 1e-3, 0.0, "L|l|litre|liter|litres|liters"),
  U ("mL", "mL", BW_KIND_VOLUME, 1e-6, 0.0, "mL"),
  U ("ML", "ML", BW_KIND_VOLUME, 1e3, 0.0, "ML|megalitre|megaliter"),
  U ("gal", "gal", BW_KIND_VOLUME, GAL, 0.0, "gal|gallon|gallons|USgal"),
  U ("kgal", "kgal", BW_KIND_VOLUME, 1e3 * GAL, 0.0, "kgal"),
  U ("Mgal", "Mgal", BW_KIND_VOLUME, 1e6 * GAL, 0.0, "Mgal|MG"),
  U ("ft³", "ft3", BW_KIND_VOLUME, FT3, 0.0, "ft3|cuft|cf"),
  U ("yd³", "yd3", BW_KIND_VOLUME, YD * YD * YD, 0.0, "yd3|cuyd"),
  /* flow */
  U ("m³/s", "m3/s", BW_KIND_FLOW, 1.0, 0.0, "m3/s|cumec"),
  U ("m³/min", "m3/min", BW_KIND_FLOW, 1.0 / MINUTE, 0.0, "m3/min"),
  U ("m³/h", "m3/h", BW_KIND_FLOW, 1.0 / HOUR, 0.0, "m3/h|m3/hr"),
  U ("m³/d", "m3/d", BW_KIND_FLOW, 1.0 / DAY, 0.0, "m3/d|m3/day"),
  U ("L/s", "L/s", BW_KIND_FLOW, 1e-3, 0.0, "L/s|l/s|Lps"),
  U ("L/min", "L/min", BW_KIND_FLOW, 1e-3 / MINUTE, 0.0, "L/min|l/min|Lpm"),
  U ("L/h", "L/h", BW_KIND_FLOW, 1e-3 / HOUR, 0.0, "L/h|l/h|L/hr|l/hr"),
  U ("ML/d", "ML/d", BW_KIND_FLOW, 1e3 / DAY, 0.0, "ML/d|MLD|ML/day"),
  U ("gpm", "gpm", BW_KIND_FLOW, GAL / MINUTE, 0.0, "gpm|gal/min"),
  U ("gph", "gph", BW_KIND_FLOW, GAL / HOUR, 0.0, "gph|gal/h|gal/hr"),
  U ("gpd", "gpd", BW_KIND_FLOW, GAL / DAY, 0.0, "gpd|gal/d|gal/day"),
  U ("MGD", "MGD", BW_KIND_FLOW, 1e6 * GAL / DAY, 0.0, "MGD|mgd|Mgal/d|Mgal/day"),
  U ("ft³/s", "cfs", BW_KIND_FLOW, FT3, 0.0, "cfs|ft3/s|ft3/sec"),
  U ("ft³/min", "cfm", BW_KIND_FLOW, FT3 / MINUTE, 0.0, "cfm|ft3/min"),
  /* velocity (also accepted for surface loading) */
  U ("m/s", "m/s", BW_KIND_VELOCITY, 1.0, 0.0, "m/s|m/sec"),
  U ("m/min", "m/min", BW_KIND_VELOCITY, 1.0 / MINUTE, 0.0, "m/min"),
  U ("m/h", "m/h", BW_KIND_VELOCITY, 1.0 / HOUR, 0.0, "m/h|m/hr|m3/m2/h|m3/(m2*h)|m3/m2*h|m3/m2/hr"),
  U ("m/d", "m/d", BW_KIND_VELOCITY, 1.0 / DAY, 0.0, "m/d|m/day|m3/m2/d|m3/(m2*d)|m3/m2*d|m3/m2/day"),
  U ("cm/s", "cm/s", BW_KIND_VELOCITY, 1e-2, 0.0, "cm/s"),
  U ("mm/s", "mm/s", BW_KIND_VELOCITY, 1e-3, 0.0, "mm/s"),
  U ("ft/s", "ft/s", BW_KIND_VELOCITY, FT, 0.0, "ft/s|fps|ft/sec"),
  U ("ft/min", "ft/min", BW_KIND_VELOCITY, FT / MINUTE, 0.0, "ft/min|fpm"),
  U ("ft/h", "ft/h", BW_KIND_VELOCITY, FT / HOUR, 0.0, "ft/h|ft/hr"),
  U ("ft/d", "ft/d", BW_KIND_VELOCITY, FT / DAY, 0.0, "ft/d|ft/day"),
  /* surface loading */
  U ("m³/(m²·s)", "m3/(m2*s)", BW_KIND_SURFACE_LOADING, 1.0, 0.0, "m3/(m2*s)|m3/m2/s|m3/m2*s"),
  U ("gpm/ft²", "gpm/ft2", BW_KIND_SURFACE_LOADING, GAL / MINUTE / FT2, 0.0,
     "gpm/ft2|gpm/sqft|gal/min/ft2|gal/(min*ft2)|gal/ft2/min"),
  U ("gpd/ft²", "gpd/ft2", BW_KIND_SURFACE_LOADING, GAL / DAY / FT2, 0.0,
     "gpd/ft2|gpd/sqft|gal/d/ft2|gal/day/ft2|gal/(d*ft2)|gal/ft2/d|gal/ft2/day"),
  /* weir loading */
  U ("m³/(m·s)", "m3/(m*s)", BW_KIND_WEIR_LOADING, 1.0, 0.0, "m3/(m*s)|m3/m/s|m3/m*s|m2/s"),
  U ("m³/(m·h)", "m3/(m*h)", BW_KIND_WEIR_LOADING, 1.0 / HOUR, 0.0, "m3/(m*h)|m3/m/h|m3/m*h|m2/h"),
  U ("m³/(m·d)", "m3/(m*d)", BW_KIND_WEIR_LOADING, 1.0 / DAY, 0.0, "m3/(m*d)|m3/m/d|m3/m*d|m2/d|m3/m/day"),
  U ("L/(m·s)", "L/(m*s)", BW_KIND_WEIR_LOADING, 1e-3, 0.0, "L/(m*s)|L/m/s|L/s/m|L/(s*m)|l/s/m|l/m/s"),
  U ("gpd/ft", "gpd/ft", BW_KIND_WEIR_LOADING, GAL / DAY / FT, 0.0,
     "gpd/ft|gal/d/ft|gal/day/ft|gal/(d*ft)|gal/ft/d|gal/ft/day"),
  U ("gpm/ft", "gpm/ft", BW_KIND_WEIR_LOADING, GAL / MINUTE / FT, 0.0, "gpm/ft|gal/min/ft|gal/(min*ft)"),
  /* time */
  U ("s", "s", BW_KIND_TIME, 1.0, 0.0, "s|sec|secs|second|seconds"),
  U ("ms", "ms", BW_KIND_TIME, 1e-3, 0.0, "ms"),
  U ("min", "min", BW_KIND_TIME, MINUTE, 0.0, "min|mins|minute|minutes"),
  U ("h", "h", BW_KIND_TIME, HOUR, 0.0, "h|hr|hrs|hour|hours"),
  U ("d", "d", BW_KIND_TIME, DAY, 0.0, "d|day|days"),
  /* power */
  U ("W", "W", BW_KIND_POWER, 1.0, 0.0, "W|watt|watts"),
  U ("kW", "kW", BW_KIND_POWER, 1e3, 0.0, "kW"),
  U ("MW", "MW", BW_KIND_POWER, 1e6, 0.0, "MW"),
  U ("hp", "hp", BW_KIND_POWER, HP, 0.0, "hp|bhp"),
  U ("ft·lbf/s", "ft*lbf/s", BW_KIND_POWER, FT * LBF, 0.0, "ft*lbf/s|ft*lb/s|ftlbf/s"),
  /* temperature: K = value * factor + offset */
  U ("°C", "degC", BW_KIND_TEMPERATURE, 1.0, 273.15, "degC|C|celsius"),
  U ("°F", "degF", BW_KIND_TEMPERATURE, 5.0 / 9.0, 459.67 * 5.0 / 9.0, "degF|F|fahrenheit"),
  U ("K", "K", BW_KIND_TEMPERATURE, 1.0, 0.0, "K|kelvin"),
  /* density (also accepted for concentration) */
  U ("kg/m³", "kg/m3", BW_KIND_DENSITY, 1.0, 0.0, "kg/m3"),
  U ("g/cm³", "g/cm3", BW_KIND_DENSITY, 1e3, 0.0, "g/cm3|g/cc|g/mL|kg/L|kg/l|g/ml"),
  U ("lb/ft³", "lb/ft3", BW_KIND_DENSITY, LB / FT3, 0.0, "lb/ft3|lb/cuft|pcf"),
  U ("lb/gal", "lb/gal", BW_KIND_DENSITY, LB / GAL, 0.0, "lb/gal"),
  /* concentration */
  U ("mg/L", "mg/L", BW_KIND_CONCENTRATION, 1e-3, 0.0, "mg/L|mg/l|g/m3"),
  U ("µg/L", "ug/L", BW_KIND_CONCENTRATION, 1e-6, 0.0, "ug/L|ug/l|mg/m3"),
  U ("g/L", "g/L", BW_KIND_CONCENTRATION, 1.0, 0.0, "g/L|g/l"),
  U ("lb/Mgal", "lb/Mgal", BW_KIND_CONCENTRATION, LB / (1e6 * GAL), 0.0, "lb/Mgal|lb/MG"),
  /* dynamic viscosity */
  U ("Pa·s", "Pa*s", BW_KIND_DYNAMIC_VISCOSITY, 1.0, 0.0, "Pa*s|Pa.s|Pas|N*s/m2|kg/(m*s)|kg/m/s"),
  U ("mPa·s", "mPa*s", BW_KIND_DYNAMIC_VISCOSITY, 1e-3, 0.0, "mPa*s|mPa.s|mPas|cP|cp|centipoise"),
  U ("P", "P", BW_KIND_DYNAMIC_VISCOSITY, 0.1, 0.0, "P|poise"),
  U ("lbf·s/ft²", "lbf*s/ft2", BW_KIND_DYNAMIC_VISCOSITY, LBF / FT2, 0.0, "lbf*s/ft2|lb*s/ft2"),
  U ("lb/(ft·s)", "lb/(ft*s)", BW_KIND_DYNAMIC_VISCOSITY, LB / FT, 0.0, "lb/(ft*s)|lb/ft/s"),
  /* kinematic viscosity */
  U ("m²/s", "m2/s", BW_KIND_KINEMATIC_VISCOSITY, 1.0, 0.0, "m2/s"),
  U ("mm²/s", "mm2/s", BW_KIND_KINEMATIC_VISCOSITY, 1e-6, 0.0, "mm2/s|cSt|cst|centistokes"),
  U ("St", "St", BW_KIND_KINEMATIC_VISCOSITY, 1e-4, 0.0, "St|stokes|cm2/s"),
  U ("ft²/s", "ft2/s", BW_KIND_KINEMATIC_VISCOSITY, FT2, 0.0, "ft2/s"),
  /* rotational speed, SI inside as revolutions per second */
  U ("rpm", "rpm", BW_KIND_ROTATIONAL_SPEED, 1.0 / 60.0, 0.0, "rpm|r/min|rev/min"),
  U ("rps", "rps", BW_KIND_ROTATIONAL_SPEED, 1.0, 0.0, "rps|r/s|rev/s"),
  U ("rad/s", "rad/s", BW_KIND_ROTATIONAL_SPEED, 1.0 / (2.0 * G_PI), 0.0, "rad/s"),
  /* angle */
  U ("°", "deg", BW_KIND_ANGLE, G_PI / 180.0, 0.0, "deg|degree|degrees"),
  U ("rad", "rad", BW_KIND_ANGLE, 1.0, 0.0, "rad|radian|radians"),
  /* mass */
  U ("kg", "kg", BW_KIND_MASS, 1.0, 0.0, "kg"),
  U ("g", "g", BW_KIND_MASS, 1e-3, 0.0, "g|gram|grams"),
  U ("mg", "mg", BW_KIND_MASS, 1e-6, 0.0, "mg"),
  U ("t", "t", BW_KIND_MASS, 1e3, 0.0, "t|tonne|tonnes"),
  U ("lb", "lb", BW_KIND_MASS, LB, 0.0, "lb|lbs|pound|pounds"),
  U ("ton", "ton", BW_KIND_MASS, 2000.0 * LB, 0.0, "ton|tons|shortton"),
  /* mass flow */
  U ("kg/s", "kg/s", BW_KIND_MASS_FLOW, 1.0, 0.0, "kg/s"),
  U ("kg/h", "kg/h", BW_KIND_MASS_FLOW, 1.0 / HOUR, 0.0, "kg/h|kg/hr"),
  U ("kg/d", "kg/d", BW_KIND_MASS_FLOW, 1.0 / DAY, 0.0, "kg/d|kg/day"),
  U ("t/d", "t/d", BW_KIND_MASS_FLOW, 1e3 / DAY, 0.0, "t/d|t/day"),
  U ("g/s", "g/s", BW_KIND_MASS_FLOW, 1e-3, 0.0, "g/s"),
  U ("lb/h", "lb/h", BW_KIND_MASS_FLOW, LB / HOUR, 0.0, "lb/h|lb/hr"),
  U ("lb/d", "lb/d", BW_KIND_MASS_FLOW, LB / DAY, 0.0, "lb/d|lb/day|ppd"),
  /* rate (velocity gradient) */
  U ("s⁻¹", "1/s", BW_KIND_RATE, 1.0, 0.0, "1/s|/s|s-1|persecond"),
  U ("min⁻¹", "1/min", BW_KIND_RATE, 1.0 / MINUTE, 0.0, "1/min|/min|min-1"),
  /* fraction */
  U ("%", "%", BW_KIND_FRACTION, 0.01, 0.0, "%|percent|pct"),
  /* electrophoretic mobility */
  U ("m²/(V·s)", "m2/(V*s)", BW_KIND_MOBILITY, 1.0, 0.0, "m2/(V*s)|m2/V/s|m2/V*s"),
  U ("µm·cm/(V·s)", "um*cm/(V*s)", BW_KIND_MOBILITY, 1e-8, 0.0,
     "um*cm/(V*s)|um*cm/V/s|um*cm/V*s|umcm/Vs|umcm/(Vs)|um/s/(V/cm)|(um/s)/(V/cm)"),
  /* potential */
  U ("V", "V", BW_KIND_POTENTIAL, 1.0, 0.0, "V|volt|volts"),
  U ("mV", "mV", BW_KIND_POTENTIAL, 1e-3, 0.0, "mV"),
  /* molar concentration */
  U ("mol/m³", "mol/m3", BW_KIND_MOLAR_CONCENTRATION, 1.0, 0.0, "mol/m3|mmol/L|mmol/l|mM"),
  U ("mol/L", "mol/L", BW_KIND_MOLAR_CONCENTRATION, 1e3, 0.0, "mol/L|mol/l|M"),
  U ("µmol/L", "umol/L", BW_KIND_MOLAR_CONCENTRATION, 1e-3, 0.0, "umol/L|umol/l|uM"),
  /* turbidity */
  U ("NTU", "NTU", BW_KIND_TURBIDITY, 1.0, 0.0, "NTU|ntu|FNU"),
};

/* SI unit of each kind: the first table row with factor 1 and offset 0 for that kind. Kinds that
 * have no such row (temperature: K is listed) are found the same way. */
static const char *const kind_names[BW_N_KINDS] = {
  [BW_KIND_LENGTH] = BW_N_("length"),
  [BW_KIND_AREA] = BW_N_("area"),
  [BW_KIND_VOLUME] = BW_N_("volume"),
  [BW_KIND_FLOW] = BW_N_("flow"),
  [BW_KIND_VELOCITY] = BW_N_("velocity"),
  [BW_KIND_SURFACE_LOADING] = BW_N_("surface loading"),
  [BW_KIND_WEIR_LOADING] = BW_N_("weir loading"),
  [BW_KIND_TIME] = BW_N_("time"),
  [BW_KIND_POWER] = BW_N_("power"),
  [BW_KIND_TEMPERATURE] = BW_N_("temperature"),
  [BW_KIND_DENSITY] = BW_N_("density"),
  [BW_KIND_DYNAMIC_VISCOSITY] = BW_N_("dynamic viscosity"),
  [BW_KIND_KINEMATIC_VISCOSITY] = BW_N_("kinematic viscosity"),
  [BW_KIND_CONCENTRATION] = BW_N_("concentration"),
  [BW_KIND_ROTATIONAL_SPEED] = BW_N_("rotational speed"),
  [BW_KIND_ANGLE] = BW_N_("angle"),
  [BW_KIND_HEAD] = BW_N_("head"),
  [BW_KIND_MASS] = BW_N_("mass"),
  [BW_KIND_MASS_FLOW] = BW_N_("mass flow"),
  [BW_KIND_RATE] = BW_N_("rate"),
  [BW_KIND_FRACTION] = BW_N_("fraction"),
  [BW_KIND_MOBILITY] = BW_N_("electrophoretic mobility"),
  [BW_KIND_POTENTIAL] = BW_N_("electric potential"),
  [BW_KIND_MOLAR_CONCENTRATION] = BW_N_("molar concentration"),
  [BW_KIND_TURBIDITY] = BW_N_("turbidity"),
  [BW_KIND_NUMBER] = BW_N_("number"),
};
/* The same names with their article, for messages ("a length is wanted"). */
static const char *const kind_names_a[BW_N_KINDS] = {
  [BW_KIND_LENGTH] = BW_N_("a length"),
  [BW_KIND_AREA] = BW_N_("an area"),
  [BW_KIND_VOLUME] = BW_N_("a volume"),
  [BW_KIND_FLOW] = BW_N_("a flow"),
  [BW_KIND_VELOCITY] = BW_N_("a velocity"),
  [BW_KIND_SURFACE_LOADING] = BW_N_("a surface loading"),
  [BW_KIND_WEIR_LOADING] = BW_N_("a weir loading"),
  [BW_KIND_TIME] = BW_N_("a time"),
  [BW_KIND_POWER] = BW_N_("a power"),
  [BW_KIND_TEMPERATURE] = BW_N_("a temperature"),
  [BW_KIND_DENSITY] = BW_N_("a density"),
  [BW_KIND_DYNAMIC_VISCOSITY] = BW_N_("a dynamic viscosity"),
  [BW_KIND_KINEMATIC_VISCOSITY] = BW_N_("a kinematic viscosity"),
  [BW_KIND_CONCENTRATION] = BW_N_("a concentration"),
  [BW_KIND_ROTATIONAL_SPEED] = BW_N_("a rotational speed"),
  [BW_KIND_ANGLE] = BW_N_("an angle"),
  [BW_KIND_HEAD] = BW_N_("a head"),
  [BW_KIND_MASS] = BW_N_("a mass"),
  [BW_KIND_MASS_FLOW] = BW_N_("a mass flow"),
  [BW_KIND_RATE] = BW_N_("a rate"),
  [BW_KIND_FRACTION] = BW_N_("a fraction"),
  [BW_KIND_MOBILITY] = BW_N_("an electrophoretic mobility"),
  [BW_KIND_POTENTIAL] = BW_N_("an electric potential"),
  [BW_KIND_MOLAR_CONCENTRATION] = BW_N_("a molar concentration"),
  [BW_KIND_TURBIDITY] = BW_N_("a turbidity"),
  [BW_KIND_NUMBER] = BW_N_("a number"),
};

/* Display units: [kind][system] by ASCII spelling. */
static const char *const display_ascii[BW_N_KINDS][2] = {
  [BW_KIND_LENGTH] = { "m", "ft" },
  [BW_KIND_AREA] = { "m2", "ft2" },
  [BW_KIND_VOLUME] = { "m3", "gal" },
  [BW_KIND_FLOW] = { "m3/s", "MGD" },
  [BW_KIND_VELOCITY] = { "m/s", "ft/s" },
  [BW_KIND_SURFACE_LOADING] = { "m/h", "gpm/ft2" },
  [BW_KIND_WEIR_LOADING] = { "m3/(m*d)", "gpd/ft" },
  [BW_KIND_TIME] = { "s", "s" },
  [BW_KIND_POWER] = { "W", "hp" },
  [BW_KIND_TEMPERATURE] = { "degC", "degF" },
  [BW_KIND_DENSITY] = { "kg/m3", "lb/ft3" },
  [BW_KIND_DYNAMIC_VISCOSITY] = { "mPa*s", "lbf*s/ft2" },
  [BW_KIND_KINEMATIC_VISCOSITY] = { "mm2/s", "ft2/s" },
  [BW_KIND_CONCENTRATION] = { "mg/L", "mg/L" },
  [BW_KIND_ROTATIONAL_SPEED] = { "rpm", "rpm" },
  [BW_KIND_ANGLE] = { "deg", "deg" },
  [BW_KIND_HEAD] = { "m", "ft" },
  [BW_KIND_MASS] = { "kg", "lb" },
  [BW_KIND_MASS_FLOW] = { "kg/d", "lb/d" },
  [BW_KIND_RATE] = { "1/s", "1/s" },
  [BW_KIND_FRACTION] = { "%", "%" },
  [BW_KIND_MOBILITY] = { "um*cm/(V*s)", "um*cm/(V*s)" },
  [BW_KIND_POTENTIAL] = { "mV", "mV" },
  [BW_KIND_MOLAR_CONCENTRATION] = { "mol/m3", "mol/m3" },
  [BW_KIND_TURBIDITY] = { "NTU", "NTU" },
  [BW_KIND_NUMBER] = { NULL, NULL },
};

/* SI units by ASCII spelling; the head and surface-loading kinds borrow their family's unit. */
static const char *const si_ascii[BW_N_KINDS] = {
  [BW_KIND_LENGTH] = "m",
  [BW_KIND_AREA] = "m2",
  [BW_KIND_VOLUME] = "m3",
  [BW_KIND_FLOW] = "m3/s",
  [BW_KIND_VELOCITY] = "m/s",
  [BW_KIND_SURFACE_LOADING] = "m/s",
  [BW_KIND_WEIR_LOADING] = "m3/(m*s)",
  [BW_KIND_TIME] = "s",
  [BW_KIND_POWER] = "W",
  [BW_KIND_TEMPERATURE] = "K",
  [BW_KIND_DENSITY] = "kg/m3",
  [BW_KIND_DYNAMIC_VISCOSITY] = "Pa*s",
  [BW_KIND_KINEMATIC_VISCOSITY] = "m2/s",
  [BW_KIND_CONCENTRATION] = "kg/m3",
  [BW_KIND_ROTATIONAL_SPEED] = "rps",
  [BW_KIND_ANGLE] = "rad",
  [BW_KIND_HEAD] = "m",
  [BW_KIND_MASS] = "kg",
  [BW_KIND_MASS_FLOW] = "kg/s",
  [BW_KIND_RATE] = "1/s",
  [BW_KIND_FRACTION] = NULL, /* the plain number; see bw_units_si_unit */
  [BW_KIND_MOBILITY] = "m2/(V*s)",
  [BW_KIND_POTENTIAL] = "V",
  [BW_KIND_MOLAR_CONCENTRATION] = "mol/m3",
  [BW_KIND_TURBIDITY] = "NTU",
  [BW_KIND_NUMBER] = NULL,
};

/* The unit of a plain number: no symbol. */
static const BwUnit fraction_unit = { "", "", BW_KIND_FRACTION, 1.0, 0.0 };
static const BwUnit number_unit = { "", "", BW_KIND_NUMBER, 1.0, 0.0 };

const char *
bw_quantity_kind_name (BwQuantityKind kind)
{
  g_return_val_if_fail (kind < BW_N_KINDS, "unknown");
  return kind_names[kind];
}

/* Same dimension, used the same way (common practice, no source). */
static BwQuantityKind
kind_family (BwQuantityKind kind)
{
  switch (kind)
    {
    case BW_KIND_HEAD:
      return BW_KIND_LENGTH;
    case BW_KIND_SURFACE_LOADING:
      return BW_KIND_VELOCITY;
    case BW_KIND_CONCENTRATION:
      return BW_KIND_DENSITY;
    default:
      return kind;
    }
}

gboolean
bw_quantity_kind_compatible (BwQuantityKind wanted, BwQuantityKind unit_kind)
{
  return kind_family (wanted) == kind_family (unit_kind);
}

guint
bw_units_count (void)
{
  return G_N_ELEMENTS (unit_table);
}

const BwUnit *
bw_units_nth (guint index)
{
  g_return_val_if_fail (index < G_N_ELEMENTS (unit_table), NULL);
  return &unit_table[index].unit;
}

/* Rewrites a typed unit into the table's spelling: drops white space and '^', turns micro signs
 * into 'u', superscript digits into digits, the degree sign into "deg", middle dots and
 * multiplication signs into '*', and a Unicode minus into '-'. */
static char *
normalise_unit (const char *text)
{
  GString *s = g_string_sized_new (strlen (text) + 8);
  const char *p = text;

  while (*p)
    {
      const guchar c = (guchar) *p;
      if (c == ' ' || c == '\t')
        {
          /* White space joins nothing: it is dropped next to an operator or after a degree sign
           * ("m3 / s", "deg C"), and otherwise kept, so "m m" stays unknown, not "mm". */
          const char *next = p;
          while (*next == ' ' || *next == '\t')
            next++;
          if (s->len > 0 && *next != '\0' && !strchr ("/*()^", s->str[s->len - 1])
              && !strchr ("/*()^", *next) && !g_str_has_suffix (s->str, "deg")
              && !g_str_has_prefix (next, "\xc2\xb7") && !g_str_has_prefix (next, "\xe2\x8b\x85"))
            g_string_append_c (s, ' ');
          p = next;
        }
      else if (c == '^')
        p++;
      else if (g_str_has_prefix (p, "\xc2\xb5") || g_str_has_prefix (p, "\xce\xbc")) /* µ μ */
        g_string_append_c (s, 'u'), p += 2;
      else if (g_str_has_prefix (p, "\xc2\xb2")) /* ² */
        g_string_append_c (s, '2'), p += 2;
      else if (g_str_has_prefix (p, "\xc2\xb3")) /* ³ */
        g_string_append_c (s, '3'), p += 2;
      else if (g_str_has_prefix (p, "\xc2\xb9")) /* ¹ */
        g_string_append_c (s, '1'), p += 2;
      else if (g_str_has_prefix (p, "\xe2\x81\xbb")) /* superscript minus */
        g_string_append_c (s, '-'), p += 3;
      else if (g_str_has_prefix (p, "\xe2\x88\x92")) /* minus sign */
        g_string_append_c (s, '-'), p += 3;
      else if (g_str_has_prefix (p, "\xc2\xb0") || g_str_has_prefix (p, "\xc2\xba")) /* ° º */
        g_string_append (s, "deg"), p += 2;
      else if (g_str_has_prefix (p, "\xc2\xb7") || g_str_has_prefix (p, "\xe2\x8b\x85")
               || g_str_has_prefix (p, "\xc3\x97")) /* · ⋅ × */
        g_string_append_c (s, '*'), p += g_str_has_prefix (p, "\xe2\x8b\x85") ? 3 : 2;
      else if (g_str_has_prefix (p, "\xe2\x84\x83")) /* ℃ */
        g_string_append (s, "degC"), p += 3;
      else if (g_str_has_prefix (p, "\xe2\x84\x89")) /* ℉ */
        g_string_append (s, "degF"), p += 3;
      else
        g_string_append_c (s, *p++);
    }
  return g_string_free (s, FALSE);
}

/* Compares N bytes ignoring ASCII case, except that 'm' and 'M' must agree: milli and mega differ
 * by a factor of 10^9, so "mw" is never taken for MW nor "ml/d" for ML/d. */
static gboolean
same_ignoring_case (const char *a, const char *b, size_t n)
{
  for (size_t i = 0; i < n; i++)
    {
      if ((a[i] == 'm' || a[i] == 'M' || b[i] == 'm' || b[i] == 'M') && a[i] != b[i])
        return FALSE;
      if (g_ascii_tolower (a[i]) != g_ascii_tolower (b[i]))
        return FALSE;
    }
  return TRUE;
}

/* Does the '|'-separated list ALIASES hold NAME, exactly or ignoring ASCII case? */
static gboolean
aliases_match (const char *aliases, const char *name, gboolean ignore_case)
{
  const size_t n = strlen (name);
  const char *p = aliases;

  while (*p)
    {
      const char *bar = strchr (p, '|');
      const size_t len = bar ? (size_t) (bar - p) : strlen (p);
      if (len == n && (ignore_case ? same_ignoring_case (p, name, n) : strncmp (p, name, n) == 0))
        return TRUE;
      if (!bar)
        break;
      p = bar + 1;
    }
  return FALSE;
}

/* Finds the unit spelled NAME among units compatible with KIND (or all units when ANY_KIND).
 * Sets *AMBIGUOUS when a case-insensitive match is not unique. */
static const UnitDef *
find_unit (const char *name, BwQuantityKind kind, gboolean any_kind, gboolean *ambiguous)
{
  const UnitDef *found = NULL;
  guint nfound = 0;

  *ambiguous = FALSE;
  for (guint i = 0; i < G_N_ELEMENTS (unit_table); i++)
    {
      const UnitDef *d = &unit_table[i];
      if (!any_kind && !bw_quantity_kind_compatible (kind, d->unit.kind))
        continue;
      if (aliases_match (d->aliases, name, FALSE))
        return d;
    }
  for (guint i = 0; i < G_N_ELEMENTS (unit_table); i++)
    {
      const UnitDef *d = &unit_table[i];
      if (!any_kind && !bw_quantity_kind_compatible (kind, d->unit.kind))
        continue;
      if (aliases_match (d->aliases, name, TRUE))
        {
          if (found == NULL)
            found = d;
          nfound++;
        }
    }
  if (nfound > 1)
    {
      *ambiguous = TRUE;
      return NULL;
    }
  return found;
}

/* A few units of KIND, for "use e.g. ..." hints. */
static char *
unit_examples (BwQuantityKind kind)
{
  GString *s = g_string_new (NULL);
  guint n = 0;

  for (guint i = 0; i < G_N_ELEMENTS (unit_table) && n < 5; i++)
    if (bw_quantity_kind_compatible (kind, unit_table[i].unit.kind))
      {
        g_string_append_printf (s, "%s%s", n ? ", " : "", unit_table[i].unit.ascii);
        n++;
      }
  return g_string_free (s, FALSE);
}

const BwUnit *
bw_unit_lookup (const char *spelling, BwQuantityKind kind, const char *field, GError **error)
{
  g_autofree char *name = NULL;
  const UnitDef *d;
  gboolean ambiguous;

  g_return_val_if_fail (spelling != NULL, NULL);
  g_return_val_if_fail (kind < BW_N_KINDS, NULL);
  if (field == NULL)
    field = BW_("value");

  if (!g_utf8_validate (spelling, -1, NULL))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_("%s: the unit is not valid UTF-8 text"), field);
      return NULL;
    }
  name = normalise_unit (spelling);
  if (kind == BW_KIND_FRACTION && name[0] == '\0')
    return &fraction_unit;
  if (kind == BW_KIND_NUMBER && name[0] == '\0')
    return &number_unit;

  d = find_unit (name, kind, FALSE, &ambiguous);
  if (d)
    return &d->unit;
  if (ambiguous)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_UNKNOWN_UNIT,
                   BW_("%s: the unit '%s' is ambiguous; mind upper and lower case"), field, spelling);
      return NULL;
    }
  if (kind == BW_KIND_NUMBER)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_WRONG_KIND,
                   BW_("%s: a plain number is wanted, without a unit ('%s')"), field, spelling);
      return NULL;
    }
  d = find_unit (name, kind, TRUE, &ambiguous);
  if (d)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_WRONG_KIND,
                   BW_("%s: '%s' is a unit of %s, but %s is wanted"), field, spelling,
                   BW_(kind_names[d->unit.kind]), BW_(kind_names_a[kind]));
      return NULL;
    }
  {
    g_autofree char *examples = unit_examples (kind);
    g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_UNKNOWN_UNIT,
                 BW_("%s: unknown unit '%s' (for %s use e.g. %s)"), field, spelling,
                 BW_(kind_names_a[kind]), examples);
  }
  return NULL;
}

double
bw_unit_to_si (const BwUnit *unit, double value)
{
  g_return_val_if_fail (unit != NULL, value);
  return value * unit->factor + unit->offset;
}

double
bw_unit_from_si (const BwUnit *unit, double value_si)
{
  g_return_val_if_fail (unit != NULL, value_si);
  return (value_si - unit->offset) / unit->factor;
}

static const BwUnit *
unit_by_ascii (const char *ascii)
{
  for (guint i = 0; i < G_N_ELEMENTS (unit_table); i++)
    if (strcmp (unit_table[i].unit.ascii, ascii) == 0)
      return &unit_table[i].unit;
  g_assert_not_reached ();
  return NULL;
}

const BwUnit *
bw_units_si_unit (BwQuantityKind kind)
{
  g_return_val_if_fail (kind < BW_N_KINDS, NULL);
  if (si_ascii[kind] == NULL)
    return kind == BW_KIND_NUMBER ? &number_unit : &fraction_unit;
  return unit_by_ascii (si_ascii[kind]);
}

const BwUnit *
bw_units_display_unit (BwQuantityKind kind, BwUnitSystem system)
{
  g_return_val_if_fail (kind < BW_N_KINDS, NULL);
  g_return_val_if_fail (system == BW_UNIT_SYSTEM_SI || system == BW_UNIT_SYSTEM_US, NULL);
  if (display_ascii[kind][system] == NULL)
    return bw_units_si_unit (kind);
  return unit_by_ascii (display_ascii[kind][system]);
}

gboolean
bw_units_parse (const char *text, BwQuantityKind kind, const char *bare_unit, const char *field,
                double *out_si, GError **error)
{
  const char *p;
  char *end = NULL;
  double value, si;
  const BwUnit *unit;

  g_return_val_if_fail (kind < BW_N_KINDS, FALSE);
  g_return_val_if_fail (out_si != NULL, FALSE);
  if (field == NULL)
    field = BW_("value");

  if (text == NULL)
    text = "";
  p = text;
  while (g_ascii_isspace (*p))
    p++;
  if (*p == '\0')
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, BW_("%s: no value given"), field);
      return FALSE;
    }

  /* g_ascii_strtod also reads hexadecimal, "nan" and "inf"; a person never means hex here. */
  {
    const char *q = (*p == '+' || *p == '-') ? p + 1 : p;
    if (q[0] == '0' && (q[1] == 'x' || q[1] == 'X'))
      {
        g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                     BW_("%s: '%s' is not a decimal number"), field, text);
        return FALSE;
      }
    if (!g_ascii_isdigit (*q) && *q != '.')
      {
        if (g_ascii_strncasecmp (q, "nan", 3) == 0 || g_ascii_strncasecmp (q, "inf", 3) == 0)
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE,
                       BW_("%s: '%s' is not a finite number"), field, text);
        else
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                       BW_("%s: '%s' does not start with a number"), field, text);
        return FALSE;
      }
  }

  errno = 0;
  value = g_ascii_strtod (p, &end);
  if (end == p)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_("%s: '%s' does not start with a number"), field, text);
      return FALSE;
    }
  if (errno == ERANGE && (value == 0.0 || fabs (value) < 1e-300))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_("%s: '%s' is too small to represent"), field, text);
      return FALSE;
    }
  if (errno == ERANGE || !isfinite (value))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE,
                   BW_("%s: '%s' is too large a number"), field, text);
      return FALSE;
    }

  p = end;
  while (g_ascii_isspace (*p))
    p++;
  if (*p == ',' && g_ascii_isdigit (p[1]))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_("%s: '%s': use '.' as the decimal point"), field, text);
      return FALSE;
    }

  if (*p == '\0')
    {
      if (bare_unit == NULL)
        unit = bw_units_si_unit (kind);
      else if ((unit = bw_unit_lookup (bare_unit, kind, field, error)) == NULL)
        return FALSE;
    }
  else
    {
      g_autofree char *suffix = g_strchomp (g_strdup (p));
      if ((unit = bw_unit_lookup (suffix, kind, field, error)) == NULL)
        return FALSE;
    }

  si = bw_unit_to_si (unit, value);
  if (!isfinite (si))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE,
                   BW_("%s: '%s' is too large a number"), field, text);
      return FALSE;
    }
  *out_si = si;
  return TRUE;
}

char *
bw_format_number (double value, int sig)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE];
  char fmt[16];
  double a = fabs (value);
  int decimals;

  if (sig < 1)
    sig = 1;
  if (!isfinite (value))
    return g_strdup ("—"); /* never shown by design; a visible dash rather than "nan" */
  if (a == 0.0)
    return g_strdup ("0");
  if (a >= 1e9 || a < 1e-4)
    {
      g_snprintf (fmt, sizeof fmt, "%%.%de", sig - 1);
      return g_strdup (g_ascii_formatd (buf, sizeof buf, fmt, value));
    }
  decimals = sig - 1 - (int) floor (log10 (a));
  if (decimals < 0)
    decimals = 0;
  g_snprintf (fmt, sizeof fmt, "%%.%df", decimals);
  g_ascii_formatd (buf, sizeof buf, fmt, value);
  if (strcmp (buf, "-0") == 0 || (buf[0] == '-' && strspn (buf + 1, "0.") == strlen (buf + 1)))
    memmove (buf, buf + 1, strlen (buf)); /* no "-0.000" */
  return g_strdup (buf);
}

const BwUnit *
bw_units_reading_unit (double value_si, BwQuantityKind kind, BwUnitSystem system)
{
  const BwUnit *unit;

  g_return_val_if_fail (kind < BW_N_KINDS, NULL);
  unit = bw_units_display_unit (kind, system);
  if (kind == BW_KIND_TIME)
    {
      const double a = fabs (value_si);
      unit = unit_by_ascii (a < 120.0 ? "s" : a < 2.0 * HOUR ? "min" : "h");
    }
  else if (kind == BW_KIND_POWER && system == BW_UNIT_SYSTEM_SI && fabs (value_si) >= 1e4)
    unit = unit_by_ascii ("kW");
  else if (kind == BW_KIND_FLOW && value_si != 0.0 && fabs (value_si) < 1e-4)
    /* A chemical feed (a dosing pump's flow, below 0.36 m³/h) reads in L/h or gal/h, not as
     * 2.558e-06 m³/s (common practice, no source). */
    unit = unit_by_ascii (system == BW_UNIT_SYSTEM_SI ? "L/h" : "gph");
  else if (kind == BW_KIND_LENGTH && value_si != 0.0)
    {
      /* Particle sizes and plate spacings read better in µm, mm or inches. */
      const double a = fabs (value_si);
      if (system == BW_UNIT_SYSTEM_SI)
        unit = unit_by_ascii (a < 1e-3 ? "um" : a < 0.1 ? "mm" : "m");
      else
        unit = unit_by_ascii (a < 1e-4 ? "um" : a < FT ? "in" : "ft");
    }
  return unit;
}

char *
bw_units_format_in (double value_si, const BwUnit *unit)
{
  g_autofree char *num = NULL;

  g_return_val_if_fail (unit != NULL, NULL);
  num = bw_format_number (bw_unit_from_si (unit, value_si), 4);
  if (unit->symbol[0] == '\0')
    return g_steal_pointer (&num);
  if (strcmp (unit->symbol, "°") == 0 || strcmp (unit->symbol, "%") == 0)
    return g_strconcat (num, unit->symbol, NULL);
  return g_strconcat (num, " ", unit->symbol, NULL);
}

char *
bw_units_format (double value_si, BwQuantityKind kind, BwUnitSystem system)
{
  g_return_val_if_fail (kind < BW_N_KINDS, NULL);
  return bw_units_format_in (value_si, bw_units_reading_unit (value_si, kind, system));
}

gboolean
bw_unit_system_from_name (const char *name, BwUnitSystem *out)
{
  g_return_val_if_fail (out != NULL, FALSE);
  if (name == NULL)
    return FALSE;
  if (g_ascii_strcasecmp (name, "si") == 0 || g_ascii_strcasecmp (name, "metric") == 0)
    *out = BW_UNIT_SYSTEM_SI;
  else if (g_ascii_strcasecmp (name, "us") == 0 || g_ascii_strcasecmp (name, "usc") == 0)
    *out = BW_UNIT_SYSTEM_US;
  else
    return FALSE;
  return TRUE;
}
