/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-error.h: the engine's error domain and its codes. */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

#define BW_ENGINE_ERROR (bw_engine_error_quark ())

typedef enum
{
  BW_ENGINE_ERROR_INVALID,       /* malformed text: empty, not a number, trailing garbage */
  BW_ENGINE_ERROR_UNKNOWN_UNIT,  /* a unit symbol we do not know */
  BW_ENGINE_ERROR_WRONG_KIND,    /* a known unit of another quantity kind (10 kg for a length) */
  BW_ENGINE_ERROR_NOT_FINITE,    /* NaN, infinity, or a value that overflows */
  BW_ENGINE_ERROR_OUT_OF_RANGE,  /* finite but outside the model's valid domain */
  BW_ENGINE_ERROR_GEOMETRY,      /* impossible geometry (a blade beyond the wall, ...) */
  BW_ENGINE_ERROR_NO_CONVERGENCE /* an iterative solver failed to converge */
} BwEngineError;

GQuark bw_engine_error_quark (void);

/* Returns TRUE when VALUE is finite; otherwise sets ERROR naming FIELD and returns FALSE. */
gboolean bw_check_finite (double value, const char *field, GError **error);

/* Range checks used by every model. FIELD names the input in the message, UNIT_LABEL is appended
 * to the limits for the reader (e.g. "m"). */
gboolean bw_check_positive (double value, const char *field, GError **error);
gboolean bw_check_nonnegative (double value, const char *field, GError **error);
gboolean bw_check_range (double value, double lo, double hi, const char *field,
                         const char *unit_label, GError **error);

/* Refuses a result that overflowed, naming the input FIELD that drove it there; WHAT names the
 * result ("power"). */
gboolean bw_check_result (double value, const char *field, const char *what, GError **error);

G_END_DECLS
