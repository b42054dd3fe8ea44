/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-sketch.h: process units drawn to scale (plan and section), with a scale bar and dimensions,
 * and a train drawn as a schematic of blocks carrying the engine's key results. */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "draw/bw-style.h"
#include "engine/bw-project.h"
#include "engine/bw-units.h"

G_BEGIN_DECLS

#define BW_DRAW_ERROR (bw_draw_error_quark ())

typedef enum
{
  BW_DRAW_ERROR_UNSUPPORTED, /* no drawing of this kind of unit in this view (yet) */
  BW_DRAW_ERROR_SIZE,        /* a canvas too small, too large or not finite */
  BW_DRAW_ERROR_GEOMETRY,    /* the unit's inputs cannot be drawn (a zero width) */
  BW_DRAW_ERROR_CAIRO,       /* cairo failed (out of memory, a bad surface) */
  BW_DRAW_ERROR_WRITE,       /* a file could not be written */
} BwDrawError;

GQuark bw_draw_error_quark (void);

typedef enum
{
  BW_SKETCH_PLAN,    /* seen from above */
  BW_SKETCH_SECTION, /* cut vertically along the flow (or through the tank's axis) */
  BW_SKETCH_SCHEMATIC, /* the unit's train as blocks in flow order, with key results; not to scale */
  BW_N_SKETCH_VIEWS
} BwSketchView;

const char *bw_sketch_view_name (BwSketchView view); /* "plan", "section", "schematic" */
gboolean bw_sketch_view_from_name (const char *name, BwSketchView *out);

/* TRUE when VIEW of a unit (or flocculator stage) of TYPE can be drawn. */
gboolean bw_sketch_supports (BwProcessType type, BwSketchView view);

/* The views of TYPE that can be drawn, joined by "|" ("plan|section|schematic"); free it. */
char *bw_sketch_views_of (BwProcessType type);

/* Smallest and largest canvas side a sketch accepts, in page units. */
#define BW_SKETCH_MIN_SIDE 200.0
#define BW_SKETCH_MAX_SIDE 20000.0

/* Where a sketch puts things on the page. World coordinates are metres, x to the right and y up
 * (y is elevation in a section, across the flow in a plan); page coordinates are cairo's, y down.
 * page_x = origin_x + scale * x, page_y = origin_y - scale * y. */
typedef struct
{
  double scale;                  /* page units per metre of the unit drawn */
  double origin_x, origin_y;     /* page position of the world origin */
  double world_x0, world_y0;     /* world box that is drawn to scale, m */
  double world_x1, world_y1;
  double text_size;              /* body text size chosen for this canvas, page units */
  double bar_length_m;           /* the scale bar's labelled length, SI (a round number of
                                    metres, or of feet in US units); 0 for a schematic, which is
                                    not to scale and has no bar */
  char bar_label[32];            /* its label: "10 m", "50 ft" */
  double bar_x, bar_y;           /* top left of the bar's solid band, page units */
  double bar_width, bar_height;  /* the band: bar_width = scale * bar_length_m */
} BwSketchGeometry;

/* Lays out VIEW of unit U of project P on a WIDTH x HEIGHT canvas: the same computation the
 * painter makes, for tests and for hit-testing. U may be a flocculator stage (its compartment
 * alone is drawn, in its flocculator's width and depth). For BW_SKETCH_SCHEMATIC, U names the
 * train drawn (any unit or stage of it); the world box is then the page box (scale 1). */
gboolean bw_sketch_layout (const BwProject *p, const BwProcessUnit *u, BwSketchView view,
                           BwUnitSystem units, const BwStyle *style, double width, double height,
                           BwSketchGeometry *out, GError **error);

/* For a train schematic laid out as G (bw_sketch_layout, BW_SKETCH_SCHEMATIC) of a train of
 * N_UNITS units: the index of the unit whose block holds the page point X, Y (the column of the
 * block within the band the blocks take), or -1 between and outside them. For hit-testing. */
int bw_sketch_schematic_block_at (const BwSketchGeometry *g, guint n_units, double x, double y);

/* Paints VIEW of unit U of project P to scale on CR, filling the WIDTH x HEIGHT page box at
 * CR's current origin: title, the unit, labelled dimensions in UNITS, a scale bar and a note.
 * The schematic evaluates P with bw_project_evaluate and shows the results of the maximum-day
 * case (coldest water, all units in service); P must then validate and evaluate.
 * Nothing is drawn outside the box. CR's state is restored on return. Errors: an unsupported
 * unit or view, a canvas size outside the limits, or CR in an error state. */
gboolean bw_sketch_paint (const BwProject *p, const BwProcessUnit *u, BwSketchView view,
                          BwUnitSystem units, const BwStyle *style, cairo_t *cr, double width,
                          double height, GError **error);

G_END_DECLS
