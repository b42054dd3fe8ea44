/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-units.h: quantity kinds, unit definitions, parsing typed values into SI and formatting them. */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* What a number measures. The SI unit the engine stores each kind in is given beside it. */
typedef enum
{
  BW_KIND_LENGTH,              /* m */
  BW_KIND_AREA,                /* m2 */
  BW_KIND_VOLUME,              /* m3 */
  BW_KIND_FLOW,                /* m3/s */
  BW_KIND_VELOCITY,            /* m/s */
  BW_KIND_SURFACE_LOADING,     /* m3/(m2 s) = m/s */
  BW_KIND_WEIR_LOADING,        /* m3/(m s) = m2/s */
  BW_KIND_TIME,                /* s */
  BW_KIND_POWER,               /* W */
  BW_KIND_TEMPERATURE,         /* K */
  BW_KIND_DENSITY,             /* kg/m3 */
  BW_KIND_DYNAMIC_VISCOSITY,   /* Pa s */
  BW_KIND_KINEMATIC_VISCOSITY, /* m2/s */
  BW_KIND_CONCENTRATION,       /* kg/m3 (mass per volume of water) */
  BW_KIND_ROTATIONAL_SPEED,    /* 1/s, revolutions per second */
  BW_KIND_ANGLE,               /* rad */
  BW_KIND_HEAD,                /* m of water column */
  BW_KIND_MASS,                /* kg */
  BW_KIND_MASS_FLOW,           /* kg/s */
  BW_KIND_RATE,                /* 1/s (velocity gradient G) */
  BW_KIND_FRACTION,            /* 1 (a plain ratio; % accepted) */
  BW_KIND_MOBILITY,            /* m2/(V s), electrophoretic mobility */
  BW_KIND_POTENTIAL,           /* V */
  BW_KIND_MOLAR_CONCENTRATION, /* mol/m3 */
  BW_KIND_TURBIDITY,           /* NTU (not an SI quantity; kept in NTU) */
  BW_KIND_NUMBER,              /* a plain dimensionless number (Re, Gt, a ratio); no unit */
  BW_N_KINDS
} BwQuantityKind;

typedef enum
{
  BW_UNIT_SYSTEM_SI,
  BW_UNIT_SYSTEM_US, /* US customary */
} BwUnitSystem;

/* One unit: SI value = value * factor + offset. */
typedef struct
{
  const char *symbol;  /* display symbol, UTF-8 (e.g. "m³/s") */
  const char *ascii;   /* ASCII spelling accepted on input and used in CSV headers (e.g. "m3/s") */
  BwQuantityKind kind; /* the kind it was defined for */
  double factor;
  double offset;
} BwUnit;

const char *bw_quantity_kind_name (BwQuantityKind kind); /* "length", "flow", ... */

/* TRUE when a unit defined for kind UNIT_KIND may express a value of kind WANTED (same kind, or
 * the same dimension used the same way: velocity and surface loading, length and head, density
 * and concentration). */
gboolean bw_quantity_kind_compatible (BwQuantityKind wanted, BwQuantityKind unit_kind);

/* Looks up a unit for kind KIND by any accepted spelling (case-exact first, then case-insensitive
 * when that is unambiguous). Returns NULL with an error naming FIELD when the spelling is unknown,
 * ambiguous, or belongs to another kind. */
const BwUnit *bw_unit_lookup (const char *spelling, BwQuantityKind kind, const char *field,
                              GError **error);

/* Parses TEXT, a number with an optional unit suffix ("10 MGD", "50um", "12 °C", "55F"), into the
 * SI value of kind KIND. A bare number is taken in BARE_UNIT (a spelling of a unit of KIND; NULL
 * means the SI unit). FIELD names the input in every error message. */
gboolean bw_units_parse (const char *text, BwQuantityKind kind, const char *bare_unit,
                         const char *field, double *out_si, GError **error);

double bw_unit_to_si (const BwUnit *unit, double value);
double bw_unit_from_si (const BwUnit *unit, double value_si);

/* The SI unit of KIND (factor 1, offset 0). */
const BwUnit *bw_units_si_unit (BwQuantityKind kind);

/* The unit a person reads KIND in, in SYSTEM. */
const BwUnit *bw_units_display_unit (BwQuantityKind kind, BwUnitSystem system);

/* Formats SI_VALUE of KIND for reading in SYSTEM: "12.35 m", "2.118 gpm/ft²". Time adapts to
 * seconds, minutes or hours; lengths to µm, mm or m (µm, in or ft). Four significant figures; integers of five or more digits in full. */
char *bw_units_format (double value_si, BwQuantityKind kind, BwUnitSystem system);

/* The unit bw_units_format reads VALUE_SI of KIND in (minutes for 300 s, mm for 0.05 m, ...). */
const BwUnit *bw_units_reading_unit (double value_si, BwQuantityKind kind, BwUnitSystem system);

/* VALUE_SI in UNIT, four significant figures, with the unit's symbol: "89.36 min". For a row of
 * values read in one unit (the unit bw_units_reading_unit gives for the largest of them). */
char *bw_units_format_in (double value_si, const BwUnit *unit);

/* Formats VALUE (already in the display unit) with SIG significant figures and no unit. */
char *bw_format_number (double value, int sig);

/* Every unit in the table, for documentation and cross-checks. */
guint bw_units_count (void);
const BwUnit *bw_units_nth (guint index);

gboolean bw_unit_system_from_name (const char *name, BwUnitSystem *out); /* "si", "us" */

G_END_DECLS
