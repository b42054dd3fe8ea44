/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-axis.c: nice ticks, world <-> page mapping and tick labels for chart axes.
 *
 * Our own rules (no source: common charting practice):
 * - Linear steps are 1, 2 or 5 x 10^k. Of the steps next to (span / (target - 1)), the one whose
 *   tick count, after widening the range to whole steps, is nearest the target wins, never more
 *   than target + 2 ticks; a tie goes to the larger step.
 * - Ticks are computed as i x m x 10^k from the integer i (divided by 10^-k for k < 0), never by
 *   repeated addition, so 0.1 + 0.2 style drift cannot creep into labels or the range.
 * - Log axes widen to whole decades; when too many decades, every s-th decade (s a 1-2-5 number,
 *   or 3) carries a major tick, counted from the lowest decade.
 */
#include "config.h"

#include "engine/bw-axis.h"

#include <math.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"

/* Slack when snapping a value to a whole number of steps or decades: far below any tick
 * spacing one would draw, far above the rounding of a double. */
#define SNAP 1e-9

/* 10^k exactly for the powers a double holds exactly, else pow. */
static double
pow10i (int k)
{
  static const double exact[] = { 1e0,  1e1,  1e2,  1e3,  1e4,  1e5,  1e6,  1e7,
                                  1e8,  1e9,  1e10, 1e11, 1e12, 1e13, 1e14, 1e15,
                                  1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22 };
  if (k >= 0 && k <= 22)
    return exact[k];
  return pow (10.0, k);
}

/* i x m x 10^k, rounded once. */
static double
tick_value (double i, double m, int k)
{
  return k >= 0 ? i * m * pow10i (k) : (i * m) / pow10i (-k);
}

static gboolean
check_target (guint target, GError **error)
{
  if (target < 2 || target > BW_AXIS_MAX_TARGET)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("target ticks: must be 2 to %d (got %u)"), BW_AXIS_MAX_TARGET, target);
      return FALSE;
    }
  return TRUE;
}

double
bw_axis_nice_step (double raw_step, int *exponent)
{
  static const double mant[] = { 1.0, 2.0, 5.0, 10.0 };
  int k;
  guint i;

  g_return_val_if_fail (isfinite (raw_step) && raw_step > 0, 1.0);

  k = (int) floor (log10 (raw_step));
  /* log10 may land a hair off for exact powers: step back if 10^k already exceeds the raw step. */
  if (tick_value (1, 1, k) > raw_step * (1 + SNAP))
    k--;
  for (i = 0; i < G_N_ELEMENTS (mant); i++)
    {
      double s = tick_value (1, mant[i], k);
      if (s >= raw_step * (1 - SNAP))
        {
          if (i == 3)
            {
              k++;
              s = tick_value (1, 1, k);
            }
          if (exponent)
            *exponent = k;
          return s;
        }
    }
  g_assert_not_reached ();
  return 1.0;
}

/* The 1-2-5 step with mantissa index IDX (0, 1, 2 = 1, 2, 5) and exponent K, moved by DELTA
 * places along the sequence. */
static void
step_shift (int idx, int k, int delta, int *out_idx, int *out_k)
{
  int pos = k * 3 + idx + delta;
  int kk = (int) floor (pos / 3.0);

  *out_k = kk;
  *out_idx = pos - kk * 3;
}

static const double step_mantissa[] = { 1.0, 2.0, 5.0 };

static void
fill_linear_labels (BwAxis *a)
{
  double mag = MAX (fabs (a->lo), fabs (a->hi));
  int le = 0;

  /* Engineering factor when plain digits would be long: below 0.001 or from 100 000 up. */
  if (mag > 0 && (mag < 1e-3 || mag >= 1e5))
    le = 3 * (int) floor (floor (log10 (mag) + SNAP) / 3.0);
  a->label_exponent = le;
  a->decimals = MAX (0, le - a->step_exponent);
}

static void
fill_linear_minor (BwAxis *a, int idx, int k)
{
  /* Fifths of a 1 or 5 step, quarters of a 2 step. */
  const int parts = idx == 1 ? 4 : 5;
  double i_lo, i_hi, i;
  double m = step_mantissa[idx];

  a->n_minor = 0;
  i_lo = ceil (a->lo / a->step * parts - SNAP);
  i_hi = floor (a->hi / a->step * parts + SNAP);
  for (i = i_lo; i <= i_hi && a->n_minor < BW_AXIS_MAX_TICKS; i++)
    {
      if (fmod (fabs (i), parts) == 0)
        continue;
      /* i / parts steps: i x m x 10^k / parts */
      a->minor[a->n_minor++] = tick_value (i, m, k) / parts;
    }
}

/* Ticks of step (IDX, K) over lo..hi: widened to whole steps when WIDEN. Returns the count. */
static double
linear_count (double lo, double hi, int idx, int k, gboolean widen)
{
  const double s = tick_value (1, step_mantissa[idx], k);
  if (widen)
    return ceil (hi / s - SNAP) - floor (lo / s + SNAP) + 1;
  return floor (hi / s + SNAP) - ceil (lo / s - SNAP) + 1;
}

static gboolean
linear_axis (double lo, double hi, guint target, gboolean widen, BwAxis *out)
{
  int k0, idx0, best_idx = -1, best_k = 0, d;
  double best_n = 0;
  double s0 = bw_axis_nice_step ((hi - lo) / (target - 1), &k0);
  double i_lo, i_hi, i;
  double m;

  {
    double mm = s0 / tick_value (1, 1, k0);
    idx0 = mm < 1.5 ? 0 : mm < 3.5 ? 1 : 2;
  }
  /* The nice step above the raw one gives at most target + 1 ticks; look one place finer and two
   * coarser for a count nearer the target. */
  for (d = -1; d <= 2; d++)
    {
      int idx, k;
      double n, dist, best_dist;
      step_shift (idx0, k0, d, &idx, &k);
      n = linear_count (lo, hi, idx, k, widen);
      if (n > target + 2 || n < 2)
        continue;
      dist = fabs (n - target);
      best_dist = fabs (best_n - target);
      if (best_idx < 0 || dist < best_dist || (dist == best_dist && n < best_n))
        {
          best_idx = idx;
          best_k = k;
          best_n = n;
        }
    }
  if (best_idx < 0)
    return FALSE;

  m = step_mantissa[best_idx];
  memset (out, 0, sizeof *out);
  out->scale = BW_AXIS_LINEAR;
  out->step = tick_value (1, m, best_k);
  out->step_exponent = best_k;
  if (widen)
    {
      i_lo = floor (lo / out->step + SNAP);
      i_hi = ceil (hi / out->step - SNAP);
      out->lo = tick_value (i_lo, m, best_k);
      out->hi = tick_value (i_hi, m, best_k);
    }
  else
    {
      i_lo = ceil (lo / out->step - SNAP);
      i_hi = floor (hi / out->step + SNAP);
      out->lo = lo;
      out->hi = hi;
    }
  for (i = i_lo; i <= i_hi && out->n_major < BW_AXIS_MAX_TICKS; i++)
    {
      double v = tick_value (i, m, best_k);
      out->major[out->n_major++] = v == 0 ? 0.0 : v; /* no -0 */
    }
  fill_linear_labels (out);
  fill_linear_minor (out, best_idx, best_k);
  return TRUE;
}

static gboolean
check_pair (double a, double b, GError **error)
{
  if (!bw_check_finite (a, BW_ ("axis minimum"), error) || !bw_check_finite (b, BW_ ("axis maximum"), error))
    return FALSE;
  return TRUE;
}

gboolean
bw_axis_linear (double data_min, double data_max, guint target_ticks, gboolean include_zero,
                BwAxis *out, GError **error)
{
  double lo, hi;

  g_return_val_if_fail (out != NULL, FALSE);
  if (!check_pair (data_min, data_max, error) || !check_target (target_ticks, error))
    return FALSE;
  lo = MIN (data_min, data_max);
  hi = MAX (data_min, data_max);
  if (include_zero)
    {
      lo = MIN (lo, 0.0);
      hi = MAX (hi, 0.0);
    }
  if (hi - lo <= fabs (hi) * 1e-12 || hi - lo < 1e-300)
    {
      /* Degenerate: open the range around the value. */
      double v = 0.5 * (lo + hi);
      double half = v == 0 ? 1.0 : 0.1 * fabs (v);
      lo = v - half;
      hi = v + half;
      if (include_zero)
        {
          lo = MIN (lo, 0.0);
          hi = MAX (hi, 0.0);
        }
    }
  if (!isfinite (hi - lo))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("axis range: too wide for a linear axis (%g to %g)"), lo, hi);
      return FALSE;
    }
  if (!linear_axis (lo, hi, target_ticks, TRUE, out))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("axis range: no tick step fits %g to %g"), lo, hi);
      return FALSE;
    }
  return TRUE;
}

/* Log ticks over LO..HI: a major on every STEP-th decade counted from decade E_FIRST (the lowest
 * decade inside the range), minor ticks on the other decades and, when STEP is 1, on the
 * multiples MINOR asks for. */
static void
log_fill (BwAxis *a, double lo, double hi, int e_first, int step, BwLogMinor minor)
{
  const double plain_lo = 1e-3 * (1 - SNAP), plain_hi = 1e4 * (1 + SNAP);
  const int e_from = (int) floor (log10 (lo) + SNAP);
  const int e_to = (int) ceil (log10 (hi) - SNAP);
  int e, m;

  a->n_major = a->n_minor = 0;
  for (e = e_from; e <= e_to; e++)
    for (m = 1; m <= 9; m++)
      {
        double v = tick_value (1, m, e);
        if (v < lo * (1 - SNAP) || v > hi * (1 + SNAP))
          continue;
        if (m == 1 && (e - e_first) % step == 0)
          {
            if (a->n_major < BW_AXIS_MAX_TICKS)
              a->major[a->n_major++] = v;
          }
        else if (m == 1 || (step == 1 && (minor == BW_LOG_MINOR_ALL
                                          || (minor == BW_LOG_MINOR_2_5 && (m == 2 || m == 5)))))
          {
            if (a->n_minor < BW_AXIS_MAX_TICKS)
              a->minor[a->n_minor++] = v;
          }
      }
  a->log_powers = FALSE;
  for (guint i = 0; i < a->n_major; i++)
    if (a->major[i] < plain_lo || a->major[i] > plain_hi)
      a->log_powers = TRUE;
}

/* The smallest decade step from 1, 2, 3, 5, 10, 20, ... giving at most TARGET + 2 majors over
 * N_DEC decades (anchored at the lowest), the range widened to a whole number of steps. */
static int
log_step (int n_dec, guint target)
{
  static const int steps[] = { 1, 2, 3, 5, 10, 20, 50 };
  guint i;

  for (i = 0; i < G_N_ELEMENTS (steps); i++)
    {
      int s = steps[i];
      int n = (n_dec + s - 1) / s + 1;
      if (n <= (int) target + 2)
        return s;
    }
  return steps[G_N_ELEMENTS (steps) - 1];
}

static gboolean
check_log_pair (double a, double b, GError **error)
{
  if (!check_pair (a, b, error))
    return FALSE;
  if (a <= 0 || b <= 0)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("axis range: a log axis needs values above zero (got %g to %g)"), a, b);
      return FALSE;
    }
  return TRUE;
}

gboolean
bw_axis_log (double data_min, double data_max, guint target_ticks, BwLogMinor minor,
             BwAxis *out, GError **error)
{
  double lo, hi;
  int e_lo, e_hi, step;

  g_return_val_if_fail (out != NULL, FALSE);
  if (!check_log_pair (data_min, data_max, error) || !check_target (target_ticks, error))
    return FALSE;
  lo = MIN (data_min, data_max);
  hi = MAX (data_min, data_max);
  e_lo = (int) floor (log10 (lo) + SNAP);
  e_hi = (int) ceil (log10 (hi) - SNAP);
  if (e_hi <= e_lo)
    e_hi = e_lo + 1;
  if (e_hi - e_lo > BW_AXIS_LOG_MAX_DECADES)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("axis range: more than %d decades (%g to %g)"), BW_AXIS_LOG_MAX_DECADES, lo,
                   hi);
      return FALSE;
    }
  step = log_step (e_hi - e_lo, target_ticks);
  e_hi = e_lo + ((e_hi - e_lo + step - 1) / step) * step;

  memset (out, 0, sizeof *out);
  out->scale = BW_AXIS_LOG;
  out->lo = pow10i (e_lo);
  out->hi = pow10i (e_hi);
  out->step = step;
  log_fill (out, out->lo, out->hi, e_lo, step, minor);
  return TRUE;
}

gboolean
bw_axis_fixed (BwAxisScale scale, double lo, double hi, guint target_ticks, BwLogMinor minor,
               BwAxis *out, GError **error)
{
  g_return_val_if_fail (out != NULL, FALSE);
  if (!check_pair (lo, hi, error) || !check_target (target_ticks, error))
    return FALSE;
  if (!(lo < hi))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("axis range: minimum must be below maximum (got %g to %g)"), lo, hi);
      return FALSE;
    }
  if (scale == BW_AXIS_LINEAR)
    {
      if (!linear_axis (lo, hi, target_ticks, FALSE, out))
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                       BW_ ("axis range: no tick step fits %g to %g"), lo, hi);
          return FALSE;
        }
      return TRUE;
    }
  else
    {
      int e_lo, e_hi;
      if (!check_log_pair (lo, hi, error))
        return FALSE;
      e_lo = (int) ceil (log10 (lo) - SNAP);
      e_hi = (int) floor (log10 (hi) + SNAP);
      if (log10 (hi) - log10 (lo) > BW_AXIS_LOG_MAX_DECADES)
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                       BW_ ("axis range: more than %d decades (%g to %g)"), BW_AXIS_LOG_MAX_DECADES,
                       lo, hi);
          return FALSE;
        }
      memset (out, 0, sizeof *out);
      out->scale = BW_AXIS_LOG;
      out->lo = lo;
      out->hi = hi;
      out->step = log_step (MAX (e_hi - e_lo, 0), target_ticks);
      log_fill (out, lo, hi, e_lo, (int) out->step, minor);
      return TRUE;
    }
}

double
bw_axis_to_page (const BwAxis *axis, double value, double page_lo, double page_hi)
{
  double t;

  g_return_val_if_fail (axis != NULL, page_lo);
  if (axis->scale == BW_AXIS_LOG)
    {
      if (!(value > 0) || !isfinite (value))
        return page_lo - 1e6 * (page_hi - page_lo);
      t = (log10 (value) - log10 (axis->lo)) / (log10 (axis->hi) - log10 (axis->lo));
    }
  else
    {
      if (!isfinite (value))
        return value > 0 ? page_hi + 1e6 * (page_hi - page_lo) : page_lo - 1e6 * (page_hi - page_lo);
      t = (value - axis->lo) / (axis->hi - axis->lo);
    }
  return page_lo + t * (page_hi - page_lo);
}

double
bw_axis_from_page (const BwAxis *axis, double page, double page_lo, double page_hi)
{
  double t;

  g_return_val_if_fail (axis != NULL && page_hi != page_lo, 0.0);
  t = (page - page_lo) / (page_hi - page_lo);
  if (axis->scale == BW_AXIS_LOG)
    {
      double l = log10 (axis->lo) + t * (log10 (axis->hi) - log10 (axis->lo));
      /* Keep far-off pages finite. */
      return pow (10.0, CLAMP (l, -300.0, 300.0));
    }
  return axis->lo + t * (axis->hi - axis->lo);
}

gboolean
bw_axis_contains (const BwAxis *axis, double value)
{
  g_return_val_if_fail (axis != NULL, FALSE);
  if (!isfinite (value))
    return FALSE;
  if (axis->scale == BW_AXIS_LOG)
    {
      double l, a, b;
      if (value <= 0)
        return FALSE;
      l = log10 (value);
      a = log10 (axis->lo);
      b = log10 (axis->hi);
      return l >= a - SNAP * (b - a) && l <= b + SNAP * (b - a);
    }
  return value >= axis->lo - SNAP * (axis->hi - axis->lo)
         && value <= axis->hi + SNAP * (axis->hi - axis->lo);
}

static const char *const superscript[] = { "⁰", "¹", "²", "³", "⁴", "⁵", "⁶", "⁷", "⁸", "⁹" };

char *
bw_format_power_of_ten (int k)
{
  GString *s = g_string_new ("10");
  char digits[16];
  char *p;

  if (k < 0)
    g_string_append (s, "⁻");
  g_snprintf (digits, sizeof digits, "%d", ABS (k));
  for (p = digits; *p; p++)
    g_string_append (s, superscript[*p - '0']);
  return g_string_free (s, FALSE);
}

/* "%.*f" with a real minus sign and no "-0". */
static char *
format_fixed (double v, int decimals)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE + 32];
  double half_unit = 0.5 * pow (10.0, -decimals);

  if (fabs (v) < half_unit)
    v = 0.0;
  {
    /* g_ascii_formatd keeps the locale out: always a dot. */
    g_autofree char *fmt = g_strdup_printf ("%%.%df", CLAMP (decimals, 0, 30));
    g_ascii_formatd (buf, sizeof buf, fmt, fabs (v));
  }
  return v < 0 ? g_strconcat ("−", buf, NULL) : g_strdup (buf);
}

char *
bw_axis_format_tick (const BwAxis *axis, double value)
{
  g_return_val_if_fail (axis != NULL, NULL);
  if (!isfinite (value))
    return g_strdup ("?");
  if (axis->scale == BW_AXIS_LINEAR)
    return format_fixed (axis->label_exponent >= 0 ? value / pow10i (axis->label_exponent)
                                                   : value * pow10i (-axis->label_exponent),
                         axis->decimals);
  if (value <= 0)
    return g_strdup ("0");
  {
    int k = (int) floor (log10 (value) + SNAP);
    double m = value / pow10i (k);
    int mi = (int) lround (m);
    gboolean whole = fabs (m - mi) < 1e-6;

    if (!axis->log_powers)
      return format_fixed (value, whole ? MAX (0, -k) : MAX (0, -k) + 2);
    {
      g_autofree char *p = bw_format_power_of_ten (k);
      if (whole && mi == 1)
        return g_strdup (p);
      if (whole)
        return g_strdup_printf ("%d×%s", mi, p);
      {
        g_autofree char *ms = format_fixed (m, 2);
        return g_strdup_printf ("%s×%s", ms, p);
      }
    }
  }
}

char *
bw_axis_format_factor (const BwAxis *axis)
{
  g_return_val_if_fail (axis != NULL, NULL);
  if (axis->scale != BW_AXIS_LINEAR || axis->label_exponent == 0)
    return NULL;
  {
    g_autofree char *p = bw_format_power_of_ten (axis->label_exponent);
    return g_strconcat ("×", p, NULL);
  }
}
