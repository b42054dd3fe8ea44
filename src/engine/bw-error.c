/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-error.c: the engine's error domain and shared input checks. */
#include "config.h"

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"

#include <math.h>

G_DEFINE_QUARK (bw-engine-error-quark, bw_engine_error)

gboolean
bw_check_finite (double value, const char *field, GError **error)
{
  if (isfinite (value))
    return TRUE;
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_NOT_FINITE,
               BW_("%s: the value is not a finite number"), field);
  return FALSE;
}

gboolean
bw_check_result (double value, const char *field, const char *what, GError **error)
{
  if (isfinite (value))
    return TRUE;
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
               BW_("%s: the value is too large: the %s would not be a finite number"), field, what);
  return FALSE;
}

gboolean
bw_check_positive (double value, const char *field, GError **error)
{
  if (!bw_check_finite (value, field, error))
    return FALSE;
  if (value > 0.0)
    return TRUE;
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
               BW_("%s: must be greater than zero (got %g)"), field, value);
  return FALSE;
}

gboolean
bw_check_nonnegative (double value, const char *field, GError **error)
{
  if (!bw_check_finite (value, field, error))
    return FALSE;
  if (value >= 0.0)
    return TRUE;
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
               BW_("%s: must not be negative (got %g)"), field, value);
  return FALSE;
}

gboolean
bw_check_range (double value, double lo, double hi, const char *field, const char *unit_label,
                GError **error)
{
  if (!bw_check_finite (value, field, error))
    return FALSE;
  if (value >= lo && value <= hi)
    return TRUE;
  g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
               BW_("%s: %g %s is outside the valid range %g to %g %s"), field, value,
               unit_label ? unit_label : "", lo, hi, unit_label ? unit_label : "");
  return FALSE;
}
