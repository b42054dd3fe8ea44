/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-csv.h: CSV export of results and checks, and reading a submittal's stated values. */
#pragma once

#include <glib.h>

#include "engine/bw-review.h"

G_BEGIN_DECLS

/* Writes into DIR (created if missing): results.csv (every element in every load case, one column
 * per quantity, SI units in the headers), results-<id>.csv for each element, and checks.csv (when
 * CHECKS is given). RFC 4180 quoting, '.' decimal point, UTF-8. Each file is written atomically. */
gboolean bw_export_csv (const BwProject *p, const BwResults *r, GArray *checks, const char *dir,
                        GError **error);

/* Reads stated values: a header "element,quantity,case,value,unit[,comment]" (any column order;
 * comment optional), then one row per value. CASE is a load-case id
 * ("maximum-day/coldest/firm"), "max" or "min" (the governing extreme). VALUE is in UNIT (any
 * spelling of a unit of the quantity's kind; empty for a plain number). Returns BwStated*. */
GPtrArray *bw_stated_read_csv (const char *data, gsize len, const char *name, GError **error);
GPtrArray *bw_stated_load_csv (const char *path, GError **error);

G_END_DECLS
