/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-dump.h: shared bits of the tests/ref dump programs. */
#pragma once

#include "engine/bw-error.h"

/* A stable name for an engine error code, so the Python side does not depend on enum values. */
static inline const char *
bw_dump_error_name (int code)
{
  switch (code)
    {
    case BW_ENGINE_ERROR_INVALID:
      return "INVALID";
    case BW_ENGINE_ERROR_UNKNOWN_UNIT:
      return "UNKNOWN_UNIT";
    case BW_ENGINE_ERROR_WRONG_KIND:
      return "WRONG_KIND";
    case BW_ENGINE_ERROR_NOT_FINITE:
      return "NOT_FINITE";
    case BW_ENGINE_ERROR_OUT_OF_RANGE:
      return "OUT_OF_RANGE";
    case BW_ENGINE_ERROR_GEOMETRY:
      return "GEOMETRY";
    case BW_ENGINE_ERROR_NO_CONVERGENCE:
      return "NO_CONVERGENCE";
    default:
      return "UNKNOWN";
    }
}
