/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-export.c: a sketch on a PNG, SVG or PDF surface. The picture is painted into a temporary
 * file beside PATH and renamed over it only when cairo reports success, so a failure never
 * leaves a truncated drawing under the name asked for. */
#include "config.h"

#include "draw/bw-export.h"

#include <cairo-pdf.h>
#include <cairo-svg.h>
#include <errno.h>
#include <glib/gi18n-lib.h>
#include <glib/gstdio.h>
#include <math.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

static const char *const format_names[BW_N_EXPORT_FORMATS] = { "png", "svg", "pdf" };

const char *
bw_export_format_name (BwExportFormat format)
{
  g_return_val_if_fail (format < BW_N_EXPORT_FORMATS, "unknown");
  return format_names[format];
}

gboolean
bw_export_format_from_name (const char *name, BwExportFormat *out)
{
  g_return_val_if_fail (out != NULL, FALSE);
  for (int i = 0; i < BW_N_EXPORT_FORMATS; i++)
    if (g_strcmp0 (name, format_names[i]) == 0)
      {
        *out = (BwExportFormat) i;
        return TRUE;
      }
  return FALSE;
}

static gboolean
cairo_fail (cairo_status_t status, const char *path, GError **error)
{
  g_set_error (error, BW_DRAW_ERROR,
               status == CAIRO_STATUS_WRITE_ERROR ? BW_DRAW_ERROR_WRITE : BW_DRAW_ERROR_CAIRO,
               _ ("%s: cannot write the drawing: %s"), path, cairo_status_to_string (status));
  return FALSE;
}

typedef gboolean (*PaintFn) (gpointer data, cairo_t *cr, double width, double height, GError **error);

/* Paints with PAINT into a temporary file beside PATH and renames it over PATH on success. */
static gboolean
export_with (PaintFn paint, gpointer data, BwExportFormat format, const char *path, double width,
             double height, GError **error)
{
  g_autofree char *tmp = NULL;
  cairo_surface_t *surface = NULL;
  cairo_t *cr;
  cairo_status_t status;
  gboolean ok;
  int fd;

  if (format == BW_EXPORT_PNG && (width != floor (width) || height != floor (height)))
    {
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_SIZE,
                   _ ("size: a PNG needs whole pixels (got %g x %g)"), width, height);
      return FALSE;
    }

  tmp = g_strdup_printf ("%s.XXXXXX", path);
  fd = g_mkstemp (tmp);
  if (fd < 0)
    {
      const int e = errno;
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_WRITE, _ ("%s: cannot write the drawing: %s"),
                   path, g_strerror (e));
      return FALSE;
    }
  close (fd);
  {
    /* mkstemp makes the file private; give it the mode a new file would get. */
    const mode_t mask = umask (0);
    umask (mask);
    g_chmod (tmp, 0666 & ~mask);
  }

  switch (format)
    {
    case BW_EXPORT_PNG:
      surface = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, (int) width, (int) height);
      break;
    case BW_EXPORT_SVG:
      surface = cairo_svg_surface_create (tmp, width, height);
      break;
    case BW_EXPORT_PDF:
      surface = cairo_pdf_surface_create (tmp, width, height);
      break;
    default:
      g_assert_not_reached ();
    }
  status = cairo_surface_status (surface);
  if (status != CAIRO_STATUS_SUCCESS)
    {
      cairo_surface_destroy (surface);
      g_unlink (tmp);
      return cairo_fail (status, path, error);
    }

  cr = cairo_create (surface);
  ok = paint (data, cr, width, height, error);
  cairo_destroy (cr);
  if (ok)
    {
      cairo_surface_flush (surface);
      if (format == BW_EXPORT_PNG)
        status = cairo_surface_write_to_png (surface, tmp);
      cairo_surface_finish (surface);
      if (status == CAIRO_STATUS_SUCCESS)
        status = cairo_surface_status (surface);
    }
  cairo_surface_destroy (surface);
  if (!ok)
    {
      g_unlink (tmp);
      g_prefix_error (error, _ ("%s: "), path);
      return FALSE;
    }
  if (status != CAIRO_STATUS_SUCCESS)
    {
      g_unlink (tmp);
      return cairo_fail (status, path, error);
    }
  if (g_rename (tmp, path) != 0)
    {
      const int e = errno;
      g_unlink (tmp);
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_WRITE, _ ("%s: cannot write the drawing: %s"),
                   path, g_strerror (e));
      return FALSE;
    }
  return TRUE;
}

typedef struct
{
  const BwProject *p;
  const BwProcessUnit *u;
  BwSketchView view;
  BwUnitSystem units;
  const BwStyle *style;
} SketchJob;

static gboolean
paint_sketch (gpointer data, cairo_t *cr, double width, double height, GError **error)
{
  const SketchJob *j = data;
  return bw_sketch_paint (j->p, j->u, j->view, j->units, j->style, cr, width, height, error);
}

typedef struct
{
  const BwChart *chart;
  const BwStyle *style;
} ChartJob;

static gboolean
paint_chart (gpointer data, cairo_t *cr, double width, double height, GError **error)
{
  const ChartJob *j = data;
  (void) error;
  bw_chart_paint (j->chart, j->style, cr, width, height);
  return TRUE;
}

gboolean
bw_export_chart (const BwChart *chart, const BwStyle *style, BwExportFormat format,
                 const char *path, double width, double height, GError **error)
{
  ChartJob j = { chart, style };

  g_return_val_if_fail (chart != NULL && style != NULL && path != NULL, FALSE);
  g_return_val_if_fail (format < BW_N_EXPORT_FORMATS, FALSE);
  if (width < BW_SKETCH_MIN_SIDE || height < BW_SKETCH_MIN_SIDE || width > BW_SKETCH_MAX_SIDE
      || height > BW_SKETCH_MAX_SIDE)
    {
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_SIZE, _ ("size: each side must be %g to %g"),
                   BW_SKETCH_MIN_SIDE, BW_SKETCH_MAX_SIDE);
      return FALSE;
    }
  return export_with (paint_chart, &j, format, path, width, height, error);
}

gboolean
bw_export_sketch (const BwProject *p, const BwProcessUnit *u, BwSketchView view,
                  BwUnitSystem units, const BwStyle *style, BwExportFormat format,
                  const char *path, double width, double height, GError **error)
{
  BwSketchGeometry geometry;
  SketchJob j = { p, u, view, units, style };

  g_return_val_if_fail (p != NULL && u != NULL && style != NULL && path != NULL, FALSE);
  g_return_val_if_fail (format < BW_N_EXPORT_FORMATS, FALSE);

  /* Refuse a bad unit, view or size before touching the file system. */
  if (!bw_sketch_layout (p, u, view, units, style, width, height, &geometry, error))
    return FALSE;
  return export_with (paint_sketch, &j, format, path, width, height, error);
}
