/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-axis.h: chart axis geometry: nice tick values on linear and logarithmic axes, the mapping
 * between a world value and a page coordinate, and tick label text. Pure numbers, no drawing. */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* Most ticks of either kind one axis carries. A linear axis has at most target + 2 major ticks;
 * a log axis over the widest accepted range (BW_AXIS_LOG_MAX_DECADES) stays well below this. */
#define BW_AXIS_MAX_TICKS 256
#define BW_AXIS_MAX_TARGET 20
#define BW_AXIS_LOG_MAX_DECADES 60

typedef enum
{
  BW_AXIS_LINEAR,
  BW_AXIS_LOG, /* base 10 */
} BwAxisScale;

/* Minor ticks of a log axis within each decade that carries a major tick. */
typedef enum
{
  BW_LOG_MINOR_NONE,
  BW_LOG_MINOR_2_5,  /* at 2 and 5 times the decade */
  BW_LOG_MINOR_ALL,  /* at 2, 3, ... 9 times the decade */
} BwLogMinor;

typedef struct
{
  BwAxisScale scale;
  double lo, hi;       /* the axis range, world units, lo < hi; covers the data */
  double step;         /* linear: the major step (1, 2 or 5 x 10^k); log: decades per major tick */
  int step_exponent;   /* linear: k of the step; log: 0 */
  int decimals;        /* linear: decimals of every label (after label_exponent is taken out) */
  int label_exponent;  /* linear: labels show value / 10^label_exponent (a multiple of 3, or 0);
                        * the axis title then carries the factor (bw_axis_format_factor) */
  gboolean log_powers; /* log: every label as a power of ten, because some major decade lies
                        * outside 0.001 .. 10000 (so one axis never mixes "0.001" and "10⁻⁴") */
  guint n_major;
  double major[BW_AXIS_MAX_TICKS];  /* strictly increasing, within [lo, hi] */
  guint n_minor;
  double minor[BW_AXIS_MAX_TICKS];  /* strictly increasing, within [lo, hi], none on a major */
} BwAxis;

/* The 1-2-5 step nearest above RAW_STEP (> 0, finite): the smallest m x 10^k >= RAW_STEP with
 * m in {1, 2, 5}. Returns the step and, in EXPONENT (may be NULL), k. */
double bw_axis_nice_step (double raw_step, int *exponent);

/*
 * A linear axis over DATA_MIN..DATA_MAX (finite; either order) with about TARGET_TICKS major
 * ticks (2..BW_AXIS_MAX_TARGET; never more than target + 2) on a 1-2-5 step. The range is
 * widened to whole steps, so the first and last tick are lo and hi. INCLUDE_ZERO stretches the
 * range to reach 0. A degenerate range (min == max) is opened around the value: +-1 around 0,
 * else +-10 % of the value's magnitude. Minor ticks split each step into fifths (steps of 1 and
 * 5 x 10^k) or quarters (2 x 10^k).
 */
gboolean bw_axis_linear (double data_min, double data_max, guint target_ticks,
                         gboolean include_zero, BwAxis *out, GError **error);

/*
 * A base-10 log axis over DATA_MIN..DATA_MAX (both > 0, finite; either order), widened to whole
 * decades. Majors fall on decades; when there are more decades than TARGET_TICKS allows
 * (2..BW_AXIS_MAX_TARGET), every 2nd, 3rd or 5th... decade carries a major and the others become
 * minor ticks (MINOR is then not used). Otherwise MINOR says which minor ticks each decade gets.
 * A degenerate range is opened to the decade around the value.
 */
gboolean bw_axis_log (double data_min, double data_max, guint target_ticks, BwLogMinor minor,
                      BwAxis *out, GError **error);

/* A fixed axis LO..HI (lo < hi, both > 0 for log) with the ticks bw_axis_linear/_log would place
 * inside it, for a caller that wants a given range (0..1 for a fraction). */
gboolean bw_axis_fixed (BwAxisScale scale, double lo, double hi, guint target_ticks,
                        BwLogMinor minor, BwAxis *out, GError **error);

/* World VALUE to a page coordinate, where the axis's lo lands on PAGE_LO and hi on PAGE_HI (either
 * may be the larger: a y axis usually runs upward on a page whose y runs down). Values outside the
 * range extrapolate. On a log axis a value <= 0 maps to PAGE_LO extended far outside the range
 * (a finite number: callers clip it), never to NaN. */
double bw_axis_to_page (const BwAxis *axis, double value, double page_lo, double page_hi);

/* The inverse: the world value at page coordinate PAGE. PAGE_LO must differ from PAGE_HI. */
double bw_axis_from_page (const BwAxis *axis, double page, double page_lo, double page_hi);

/* TRUE when VALUE lies within the axis range (a tolerance of 1e-9 of the span). */
gboolean bw_axis_contains (const BwAxis *axis, double value);

/* Label text of VALUE on AXIS (UTF-8, newly allocated). Linear: value / 10^label_exponent with the
 * axis's decimals, so every label has the same number of decimals; a real minus sign (U+2212); no
 * "-0". Log: plain digits ("0.001", "5", "10000") when every major decade lies within 0.001 ..
 * 10000, else every value as 10 with a superscript power ("10⁻⁷", "10⁰") or "m×10ᵏ". */
char *bw_axis_format_tick (const BwAxis *axis, double value);

/* The factor the labels of AXIS leave out, for the axis title: "×10³", "×10⁻⁶"; NULL when none. */
char *bw_axis_format_factor (const BwAxis *axis);

/* 10 raised to K written with superscript digits: "10⁻⁷", "10³", "10⁰". */
char *bw_format_power_of_ten (int k);

G_END_DECLS
