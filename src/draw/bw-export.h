/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-export.h: sketches written to PNG, SVG or PDF files through the one painter. */
#pragma once

#include <glib.h>

#include "draw/bw-chart.h"
#include "draw/bw-sketch.h"
#include "draw/bw-style.h"

G_BEGIN_DECLS

typedef enum
{
  BW_EXPORT_PNG, /* WIDTH x HEIGHT pixels */
  BW_EXPORT_SVG, /* WIDTH x HEIGHT points (1/72 in) */
  BW_EXPORT_PDF, /* one page of WIDTH x HEIGHT points */
  BW_N_EXPORT_FORMATS
} BwExportFormat;

const char *bw_export_format_name (BwExportFormat format); /* "png", "svg", "pdf" */
gboolean bw_export_format_from_name (const char *name, BwExportFormat *out);

/* Paints VIEW of unit U with bw_sketch_paint into PATH in FORMAT. Every failure (a size out of
 * range, an unsupported unit, cairo's own errors, a file that cannot be written) is a GError in
 * BW_DRAW_ERROR; the ones about the file name it. A failed export leaves no file behind. */
gboolean bw_export_sketch (const BwProject *p, const BwProcessUnit *u, BwSketchView view,
                           BwUnitSystem units, const BwStyle *style, BwExportFormat format,
                           const char *path, double width, double height, GError **error);

/* The same for a chart (bw_chart_paint); the size must lie within the sketch limits. */
gboolean bw_export_chart (const BwChart *chart, const BwStyle *style, BwExportFormat format,
                          const char *path, double width, double height, GError **error);

G_END_DECLS
