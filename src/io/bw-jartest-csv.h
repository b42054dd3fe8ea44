/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-jartest-csv.h: reading jar-test sheets from CSV. */
#pragma once

#include <glib.h>

#include "engine/bw-jartest.h"

G_BEGIN_DECLS

/* Reads a jar-test CSV: comma-separated, '.' as the decimal point, a header row naming each
 * column with its unit in parentheses, in any order: "dose (mg/L)", "turbidity (NTU)", "pH",
 * "zeta (mV)", "mobility (µm·cm/(V·s))" (ASCII "um*cm/(V*s)" too). Dose and turbidity are
 * required; blank lines and lines starting with '#' are skipped. A malformed row is an error
 * naming NAME and its line. The series is prepared (checked and sorted). */
gboolean bw_jartest_read_csv (const char *data, gsize len, const char *name, BwJarSeries *out,
                              GError **error);
gboolean bw_jartest_load_csv (const char *path, BwJarSeries *out, GError **error);

G_END_DECLS
