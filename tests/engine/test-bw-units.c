/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-units.c: parsing typed values into SI, formatting them, and the unit table. */
#include "config.h"

#include <string.h>

#include "bw-test.h"
#include "engine/bw-error.h"
#include "engine/bw-units.h"

/* Conversion factors below are the exact definitions of NIST SP 811 (2008) Appendix B, or the
 * values docs/references.md lists as exact (seen): 1 MGD = 0.0438126364 m3/s, 1 gpm = 6.30901964e-5 m3/s,
 * 1 gpm/ft2 = 2.44475 m/h, 1 gpd/ft2 = 0.0407458 m/d, 20 000 gpd/ft = 248.387 m3/(d m). The
 * tolerance 1e-12 is round-off only; the rounded published values get the tolerance of their
 * printed digits. */
typedef struct
{
  const char *text;
  BwQuantityKind kind;
  double want_si;
  double rel;
} ParseCase;

static const ParseCase parse_cases[] = {
  { "10 MGD", BW_KIND_FLOW, 0.438126364, 1e-9 },               /* docs/references.md: 1 MGD = 0.0438126364 */
  { "10MGD", BW_KIND_FLOW, 0.438126364, 1e-9 },
  { "0.44 m3/s", BW_KIND_FLOW, 0.44, 1e-12 },
  { "0.44m³/s", BW_KIND_FLOW, 0.44, 1e-12 },
  { "700gpm", BW_KIND_FLOW, 700 * 6.30901964e-5, 1e-9 },       /* 1 gpm = 6.30901964e-5 m3/s */
  { "50um", BW_KIND_LENGTH, 50e-6, 1e-12 },
  { "50 µm", BW_KIND_LENGTH, 50e-6, 1e-12 },                   /* U+00B5 micro sign */
  { "50 μm", BW_KIND_LENGTH, 50e-6, 1e-12 },                   /* U+03BC Greek mu */
  { "0.02mm", BW_KIND_LENGTH, 20e-6, 1e-12 },
  { "12 ft", BW_KIND_LENGTH, 12 * 0.3048, 1e-12 },             /* 1 ft = 0.3048 m exactly */
  { "12 °C", BW_KIND_TEMPERATURE, 285.15, 1e-12 },
  { "12C", BW_KIND_TEMPERATURE, 285.15, 1e-12 },
  { "55F", BW_KIND_TEMPERATURE, 285.9277777777778, 1e-12 },    /* (55 - 32) * 5/9 + 273.15 */
  { "54 °F", BW_KIND_TEMPERATURE, 285.3722222222222, 1e-12 },
  { "283.15K", BW_KIND_TEMPERATURE, 283.15, 1e-12 },
  { "3.5 hp", BW_KIND_POWER, 3.5 * 745.69987158227022, 1e-12 }, /* 550 ft lbf/s */
  { "2.2kW", BW_KIND_POWER, 2200, 1e-12 },
  { "1200 gpd/ft2", BW_KIND_SURFACE_LOADING, 1200 * 0.0407458 / 86400, 1e-6 }, /* printed 6 digits */
  { "1 gpm/ft²", BW_KIND_SURFACE_LOADING, 2.44475 / 3600, 1e-6 },
  { "1.5m/h", BW_KIND_SURFACE_LOADING, 1.5 / 3600, 1e-12 },
  { "40 m3/m2/d", BW_KIND_SURFACE_LOADING, 40.0 / 86400, 1e-12 },
  { "20000 gpd/ft", BW_KIND_WEIR_LOADING, 248.387 / 86400, 2e-6 },
  { "250 m3/(m·d)", BW_KIND_WEIR_LOADING, 250.0 / 86400, 1e-12 },
  { "75 rpm", BW_KIND_ROTATIONAL_SPEED, 1.25, 1e-12 },
  { "60deg", BW_KIND_ANGLE, G_PI / 3, 1e-12 },
  { "60°", BW_KIND_ANGLE, G_PI / 3, 1e-12 },
  { "30m3", BW_KIND_VOLUME, 30, 1e-12 },
  { "10000gal", BW_KIND_VOLUME, 37.85411784, 1e-12 },          /* 1 gal = 3.785411784 L */
  { "35mg/L", BW_KIND_CONCENTRATION, 0.035, 1e-12 },
  { "30s", BW_KIND_TIME, 30, 1e-12 },
  { "20min", BW_KIND_TIME, 1200, 1e-12 },
  { "4h", BW_KIND_TIME, 14400, 1e-12 },
  { "0.5 ft/min", BW_KIND_VELOCITY, 0.00254, 1e-12 },          /* 1 ft/min = 0.00508 m/s */
  { "1.0016 mPa·s", BW_KIND_DYNAMIC_VISCOSITY, 1.0016e-3, 1e-12 },
  { "1 lbf·s/ft2", BW_KIND_DYNAMIC_VISCOSITY, 47.880259, 1e-8 }, /* docs/references.md, 8 digits */
  { "2 µm·cm/(V·s)", BW_KIND_MOBILITY, 2e-8, 1e-12 },
  { "2 um*cm/(V*s)", BW_KIND_MOBILITY, 2e-8, 1e-12 },
  { "0.3 m", BW_KIND_HEAD, 0.3, 1e-12 },                       /* head accepts lengths */
  { "  +7.5e-1 m  ", BW_KIND_LENGTH, 0.75, 1e-12 },
  { "-4 °C", BW_KIND_TEMPERATURE, 269.15, 1e-12 },             /* the parser does not range-check */
  { "25 %", BW_KIND_FRACTION, 0.25, 1e-12 },
  { "10 ML/d", BW_KIND_FLOW, 10e3 / 86400, 1e-12 },
  { "5 mgd", BW_KIND_FLOW, 5 * 0.0438126364, 1e-9 },
  { "5 ml", BW_KIND_VOLUME, 5e-6, 1e-12 },      /* case-folded, but m never becomes M */
  { "5 ML", BW_KIND_VOLUME, 5e3, 1e-12 },
  { "2 m3 / s", BW_KIND_FLOW, 2, 1e-12 },
  { "12 deg C", BW_KIND_TEMPERATURE, 285.15, 1e-12 },
  { "100 sq ft", BW_KIND_AREA, 9.290304, 1e-12 },
};

START_TEST (test_units_parse_examples)
{
  const ParseCase *c = &parse_cases[_i];
  g_autoptr (GError) error = NULL;
  double v = -1;

  ck_assert_msg (bw_units_parse (c->text, c->kind, NULL, "x", &v, &error), "'%s': %s", c->text,
                 error ? error->message : "");
  ck_assert_ptr_null (error);
  bw_assert_rel (v, c->want_si, c->rel);
}
END_TEST

START_TEST (test_units_bare_number)
{
  g_autoptr (GError) error = NULL;
  double v;

  /* A bare number takes the caller's bare unit, or SI when none is named. */
  ck_assert (bw_units_parse ("12", BW_KIND_TEMPERATURE, "degC", "temp", &v, &error));
  bw_assert_rel (v, 285.15, 1e-12);
  ck_assert (bw_units_parse ("75", BW_KIND_ROTATIONAL_SPEED, "rpm", "speed", &v, &error));
  bw_assert_rel (v, 1.25, 1e-12);
  ck_assert (bw_units_parse ("0.0002", BW_KIND_LENGTH, NULL, "diameter", &v, &error));
  bw_assert_rel (v, 2e-4, 1e-12);
  ck_assert (bw_units_parse ("60", BW_KIND_ANGLE, "deg", "angle", &v, &error));
  bw_assert_rel (v, G_PI / 3, 1e-12);
  ck_assert (bw_units_parse ("300", BW_KIND_TEMPERATURE, NULL, "t", &v, &error));
  bw_assert_rel (v, 300, 1e-12); /* SI temperature is the kelvin */
}
END_TEST

typedef struct
{
  const char *text;
  BwQuantityKind kind;
  int code;
  const char *needle;
} ErrorCase;

static const ErrorCase error_cases[] = {
  { "10 kg", BW_KIND_LENGTH, BW_ENGINE_ERROR_WRONG_KIND, "unit of mass" },
  { "10 gpm", BW_KIND_LENGTH, BW_ENGINE_ERROR_WRONG_KIND, "unit of flow" },
  { "3 m/s", BW_KIND_FLOW, BW_ENGINE_ERROR_WRONG_KIND, "velocity" },
  { "12 furlongs", BW_KIND_LENGTH, BW_ENGINE_ERROR_UNKNOWN_UNIT, "unknown unit 'furlongs'" },
  { "", BW_KIND_LENGTH, BW_ENGINE_ERROR_INVALID, "no value" },
  { "   ", BW_KIND_LENGTH, BW_ENGINE_ERROR_INVALID, "no value" },
  { "m", BW_KIND_LENGTH, BW_ENGINE_ERROR_INVALID, "does not start with a number" },
  { "nan", BW_KIND_LENGTH, BW_ENGINE_ERROR_NOT_FINITE, "not a finite" },
  { "-inf m", BW_KIND_LENGTH, BW_ENGINE_ERROR_NOT_FINITE, "not a finite" },
  { "infinity", BW_KIND_FLOW, BW_ENGINE_ERROR_NOT_FINITE, "not a finite" },
  { "1e999", BW_KIND_LENGTH, BW_ENGINE_ERROR_NOT_FINITE, "too large" },
  { "1e308 km", BW_KIND_LENGTH, BW_ENGINE_ERROR_NOT_FINITE, "too large" },  /* overflows in SI */
  { "1e-400 m", BW_KIND_LENGTH, BW_ENGINE_ERROR_OUT_OF_RANGE, "too small" },
  { "0x10 m", BW_KIND_LENGTH, BW_ENGINE_ERROR_INVALID, "not a decimal" },
  { "1,5 m", BW_KIND_LENGTH, BW_ENGINE_ERROR_INVALID, "decimal point" },
  { "5 mw", BW_KIND_POWER, BW_ENGINE_ERROR_UNKNOWN_UNIT, "unknown unit" }, /* never MW */
  { "12 °C extra", BW_KIND_TEMPERATURE, BW_ENGINE_ERROR_UNKNOWN_UNIT, "unknown unit" },
  { "10 m m", BW_KIND_LENGTH, BW_ENGINE_ERROR_UNKNOWN_UNIT, "unknown unit" },
  { "\xff\xfe m", BW_KIND_LENGTH, BW_ENGINE_ERROR_INVALID, "number" },
  { "3 \xff", BW_KIND_LENGTH, BW_ENGINE_ERROR_INVALID, "UTF-8" },
};

START_TEST (test_units_parse_errors)
{
  const ErrorCase *c = &error_cases[_i];
  g_autoptr (GError) error = NULL;
  double v = 42.0;

  ck_assert_msg (!bw_units_parse (c->text, c->kind, NULL, "--width", &v, &error),
                 "'%s' parsed to %g", c->text, v);
  bw_assert_error (error, BW_ENGINE_ERROR, c->code, c->needle);
  /* The message names the field, and a failed parse leaves the output alone. */
  ck_assert_msg (g_str_has_prefix (error->message, "--width:"), "%s", error->message);
  ck_assert (v == 42.0);
}
END_TEST

START_TEST (test_units_roundtrip_every_unit)
{
  /* to_si and from_si are inverses for every unit in the table, and every unit parses by its own
   * display symbol and by its ASCII spelling. */
  for (guint i = 0; i < bw_units_count (); i++)
    {
      const BwUnit *u = bw_units_nth (i);
      g_autoptr (GError) error = NULL;
      g_autofree char *typed = g_strdup_printf ("3.25 %s", u->ascii);
      g_autofree char *typed_sym = g_strdup_printf ("3.25 %s", u->symbol);
      double v1, v2;

      bw_assert_rel (bw_unit_from_si (u, bw_unit_to_si (u, 3.25)), 3.25, 1e-12);
      ck_assert_msg (bw_units_parse (typed, u->kind, NULL, "x", &v1, &error), "%s: %s", typed,
                     error->message);
      ck_assert_msg (bw_units_parse (typed_sym, u->kind, NULL, "x", &v2, &error), "%s: %s",
                     typed_sym, error->message);
      bw_assert_rel (v1, bw_unit_to_si (u, 3.25), 1e-12);
      bw_assert_rel (v2, v1, 1e-12);
    }
}
END_TEST

START_TEST (test_units_no_ambiguous_spelling_within_a_family)
{
  /* No ASCII spelling may name two different units of compatible kinds: the first would silently
   * win. */
  for (guint i = 0; i < bw_units_count (); i++)
    for (guint k = i + 1; k < bw_units_count (); k++)
      {
        const BwUnit *a = bw_units_nth (i), *b = bw_units_nth (k);
        if (bw_quantity_kind_compatible (a->kind, b->kind))
          ck_assert_msg (strcmp (a->ascii, b->ascii) != 0, "duplicate spelling %s", a->ascii);
      }
}
END_TEST

typedef struct
{
  double si;
  BwQuantityKind kind;
  BwUnitSystem system;
  const char *want;
} FormatCase;

static const FormatCase format_cases[] = {
  { 0.438126364, BW_KIND_FLOW, BW_UNIT_SYSTEM_US, "10.00 MGD" },
  { 0.438126364, BW_KIND_FLOW, BW_UNIT_SYSTEM_SI, "0.4381 m³/s" },
  { 12.5, BW_KIND_LENGTH, BW_UNIT_SYSTEM_SI, "12.50 m" },
  { 3.048, BW_KIND_LENGTH, BW_UNIT_SYSTEM_US, "10.00 ft" },
  { 285.15, BW_KIND_TEMPERATURE, BW_UNIT_SYSTEM_SI, "12.00 °C" },
  { 273.15, BW_KIND_TEMPERATURE, BW_UNIT_SYSTEM_US, "32.00 °F" },
  { 1800, BW_KIND_TIME, BW_UNIT_SYSTEM_SI, "30.00 min" },
  { 14400, BW_KIND_TIME, BW_UNIT_SYSTEM_SI, "4.000 h" },
  { 25, BW_KIND_TIME, BW_UNIT_SYSTEM_US, "25.00 s" },
  { 745.69987158227022, BW_KIND_POWER, BW_UNIT_SYSTEM_US, "1.000 hp" },
  { 22000, BW_KIND_POWER, BW_UNIT_SYSTEM_SI, "22.00 kW" },
  { 2.44475 / 3600, BW_KIND_SURFACE_LOADING, BW_UNIT_SYSTEM_US, "1.000 gpm/ft²" },
  { 248.387 / 86400, BW_KIND_WEIR_LOADING, BW_UNIT_SYSTEM_US, "20000 gpd/ft" },
  { G_PI / 3, BW_KIND_ANGLE, BW_UNIT_SYSTEM_SI, "60.00°" },
  { 0.25, BW_KIND_FRACTION, BW_UNIT_SYSTEM_SI, "25.00%" },
  { 0.0, BW_KIND_VELOCITY, BW_UNIT_SYSTEM_SI, "0 m/s" },
  { -1e-7, BW_KIND_LENGTH, BW_UNIT_SYSTEM_SI, "-0.1000 µm" },
  { 2e-4, BW_KIND_LENGTH, BW_UNIT_SYSTEM_SI, "200.0 µm" },
  { 0.05, BW_KIND_LENGTH, BW_UNIT_SYSTEM_SI, "50.00 mm" },
  { 0.0508, BW_KIND_LENGTH, BW_UNIT_SYSTEM_US, "2.000 in" },
  { 1e-3, BW_KIND_VELOCITY, BW_UNIT_SYSTEM_SI, "0.001000 m/s" },
  { 1.25, BW_KIND_ROTATIONAL_SPEED, BW_UNIT_SYSTEM_SI, "75.00 rpm" },
  /* A chemical feed: GNU units gives 9.2088 L/hr and 2.4327076 gal/hr for 2.558e-6 m^3/s. */
  { 2.558e-6, BW_KIND_FLOW, BW_UNIT_SYSTEM_SI, "9.209 L/h" },
  { 2.558e-6, BW_KIND_FLOW, BW_UNIT_SYSTEM_US, "2.433 gph" },
  { 1e-4, BW_KIND_FLOW, BW_UNIT_SYSTEM_SI, "0.0001000 m³/s" },
};

START_TEST (test_units_format)
{
  const FormatCase *c = &format_cases[_i];
  g_autofree char *s = bw_units_format (c->si, c->kind, c->system);

  ck_assert_str_eq (s, c->want);
}
END_TEST

START_TEST (test_units_format_parses_back)
{
  /* What the tool prints, a person can type back in: parse(format(x)) == x to 4 figures. */
  const double values[] = { 1.234e-5, 0.0421, 0.5, 3.75, 42.0, 987.6, 12345.0, 2.5e7 };

  for (int kind = 0; kind < BW_N_KINDS; kind++)
    for (int sys = 0; sys < 2; sys++)
      for (guint i = 0; i < G_N_ELEMENTS (values); i++)
        {
          g_autoptr (GError) error = NULL;
          double si = values[i], back;
          g_autofree char *s = NULL;
          if (kind == BW_KIND_TEMPERATURE)
            si = 273.15 + values[i] / 1000.0;
          s = bw_units_format (si, (BwQuantityKind) kind, (BwUnitSystem) sys);
          ck_assert_msg (bw_units_parse (s, (BwQuantityKind) kind, NULL, "x", &back, &error),
                         "'%s' (%s) does not parse: %s", s,
                         bw_quantity_kind_name ((BwQuantityKind) kind), error->message);
          bw_assert_rel (back, si, kind == BW_KIND_TEMPERATURE ? 2e-4 : 1e-3);
        }
}
END_TEST

START_TEST (test_units_format_number)
{
  const struct { double v; int sig; const char *want; } cases[] = {
    { 1234.5678, 4, "1235" }, { 0.012345, 3, "0.0123" }, { 999.96, 4, "1000.0" },
    { -0.00004, 2, "-4.0e-05" }, { 1e10, 3, "1.00e+10" }, { -0.0001, 1, "-0.0001" },
    { -0.00001, 1, "-1e-05" }, { 123456789.0, 4, "123456789" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autofree char *s = bw_format_number (cases[i].v, cases[i].sig);
      ck_assert_str_eq (s, cases[i].want);
    }
  {
    /* Rounding to zero never shows a minus sign. */
    g_autofree char *s = bw_format_number (-0.0, 4);
    ck_assert_str_eq (s, "0");
  }
}
END_TEST

START_TEST (test_units_lookup_and_systems)
{
  g_autoptr (GError) error = NULL;
  const BwUnit *u;
  BwUnitSystem sys;

  u = bw_unit_lookup ("ft³/s", BW_KIND_FLOW, "q", &error);
  ck_assert_ptr_nonnull (u);
  bw_assert_rel (u->factor, 0.028316846592, 1e-12); /* 1 ft3 = 0.028316846592 m3 exactly */
  ck_assert_ptr_null (bw_unit_lookup ("psi", BW_KIND_FLOW, "q", &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_UNKNOWN_UNIT, "q: unknown unit");
  ck_assert (bw_unit_system_from_name ("US", &sys) && sys == BW_UNIT_SYSTEM_US);
  ck_assert (bw_unit_system_from_name ("si", &sys) && sys == BW_UNIT_SYSTEM_SI);
  ck_assert (!bw_unit_system_from_name ("imperial", &sys));
  for (int k = 0; k < BW_N_KINDS; k++)
    {
      ck_assert (bw_units_si_unit ((BwQuantityKind) k)->factor == 1.0);
      ck_assert (bw_units_si_unit ((BwQuantityKind) k)->offset == 0.0);
      ck_assert_str_ne (bw_quantity_kind_name ((BwQuantityKind) k), "unknown");
    }
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("units");
  TCase *tc = tcase_create ("parse");

  tcase_add_loop_test (tc, test_units_parse_examples, 0, G_N_ELEMENTS (parse_cases));
  tcase_add_test (tc, test_units_bare_number);
  tcase_add_loop_test (tc, test_units_parse_errors, 0, G_N_ELEMENTS (error_cases));
  suite_add_tcase (s, tc);

  tc = tcase_create ("table");
  tcase_add_test (tc, test_units_roundtrip_every_unit);
  tcase_add_test (tc, test_units_no_ambiguous_spelling_within_a_family);
  tcase_add_test (tc, test_units_lookup_and_systems);
  suite_add_tcase (s, tc);

  tc = tcase_create ("format");
  tcase_add_loop_test (tc, test_units_format, 0, G_N_ELEMENTS (format_cases));
  tcase_add_test (tc, test_units_format_parses_back);
  tcase_add_test (tc, test_units_format_number);
  suite_add_tcase (s, tc);
  return s;
}
