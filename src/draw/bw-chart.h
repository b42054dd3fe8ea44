/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-chart.h: one chart painter for every surface: x-y charts (lines, markers, bars, shaded bands,
 * reference lines, notes, a legend placed clear of the data) and status matrices, plus the
 * hit-test that works in the same coordinates. Plain data in; no toolkit types. */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "draw/bw-style.h"
#include "engine/bw-axis.h"
#include "engine/bw-criteria.h"

G_BEGIN_DECLS

typedef enum
{
  BW_CHART_XY,
  BW_CHART_MATRIX, /* rows x columns of pass / warn / fail / n/a cells */
} BwChartKind;

typedef enum
{
  BW_MARKER_NONE,
  BW_MARKER_CIRCLE,
  BW_MARKER_SQUARE,
  BW_MARKER_TRIANGLE,
  BW_MARKER_DIAMOND,
  BW_MARKER_CROSS,
} BwMarker;

typedef enum
{
  BW_DASH_SOLID,
  BW_DASH_DASHED,
  BW_DASH_DOTTED,
} BwDash;

typedef enum
{
  BW_SERIES_LINE, /* points, joined when LINE is set, with markers when MARKER is set */
  BW_SERIES_BARS, /* one bar per point from the axis base (0, or the range's low end) */
} BwSeriesKind;

/* The colour of a series, band or rule: one of the style's series colours, or its ink. */
#define BW_CHART_INK ((guint) -1)
#define BW_CHART_MUTED ((guint) -2)

/* One axis as the builder describes it. Values are in the display unit already (the builder
 * converts from SI at this edge); UNIT is that unit's symbol, shown after the title. */
typedef struct
{
  BwAxisScale scale;
  char *title;           /* "Particle diameter" */
  char *unit;            /* "mm", or NULL for a plain number */
  gboolean fixed;        /* MIN..MAX as given, ticks inside; else from the data */
  double min, max;
  gboolean include_zero; /* linear, from the data: reach 0 */
  BwLogMinor log_minor;
  GPtrArray *categories; /* char*: a categorical axis, category i centred on value i; or NULL */
} BwChartAxis;

typedef struct
{
  char *label;      /* legend text; NULL keeps the series out of the legend */
  BwSeriesKind kind;
  guint colour;     /* index into style->series (mod BW_STYLE_N_SERIES), or BW_CHART_INK */
  BwMarker marker;
  BwDash dash;
  gboolean line;    /* join the points */
  gboolean y2;      /* plotted against the secondary y axis */
  GArray *x, *y;    /* double, display units; non-finite points (and <= 0 on log) are gaps */
} BwChartSeries;

/* A shaded band across the plot: VERTICAL spans x FROM..TO over the full height; otherwise y
 * FROM..TO over the full width. */
typedef struct
{
  gboolean vertical;
  double from, to;
  char *label;     /* written inside the band at its top (vertical) or left (horizontal) */
  guint colour;
  gboolean y2;
} BwChartBand;

/* A reference line: VERTICAL at x = VALUE, else horizontal at y = VALUE, with a label. */
typedef struct
{
  gboolean vertical;
  double value;
  char *label;
  guint colour;
  BwDash dash;
  gboolean y2;
  gboolean label_start; /* label at the left (horizontal) or bottom (vertical) end */
  gboolean label_below; /* horizontal: label under the line, not over it */
} BwChartRule;

/* A note at a data point: a small ring on the point and the text beside it. */
typedef struct
{
  double x, y;
  char *text;
  gboolean y2;
  gboolean ring;
} BwChartNote;

typedef struct
{
  guint n_rows, n_cols;
  GPtrArray *row_labels;   /* char*, n_rows */
  GPtrArray *row_groups;   /* char*, n_rows: a heading drawn when it changes (may be NULL);
                            * "long|short", the short form for compact layouts */
  GPtrArray *col_levels;   /* GPtrArray* of char*, each n_cols: header rows, top first; equal
                            * neighbours merge into one spanning heading */
  BwCheckStatus *cells;    /* n_rows x n_cols, row-major */
} BwChartMatrix;

typedef struct
{
  BwChartKind kind;
  char *title;
  char *subtitle;    /* second line under the title, or NULL */
  char *footnote;    /* small text at the bottom left, or NULL */
  BwChartAxis x, y, y2;
  gboolean has_y2;
  gboolean show_legend;
  gboolean transparent; /* leave the paper unpainted (for a report page that has its own) */
  GPtrArray *series; /* BwChartSeries* */
  GPtrArray *bands;  /* BwChartBand* */
  GPtrArray *rules;  /* BwChartRule* */
  GPtrArray *notes;  /* BwChartNote* */
  BwChartMatrix matrix;
} BwChart;

BwChart *bw_chart_new (BwChartKind kind, const char *title);
void bw_chart_free (BwChart *chart);

void bw_chart_axis_set (BwChartAxis *axis, BwAxisScale scale, const char *title, const char *unit);
void bw_chart_axis_add_category (BwChartAxis *axis, const char *label);

BwChartSeries *bw_chart_add_series (BwChart *chart, const char *label, BwSeriesKind kind,
                                    guint colour, BwMarker marker, BwDash dash, gboolean line);
void bw_chart_series_add (BwChartSeries *series, double x, double y);
BwChartBand *bw_chart_add_band (BwChart *chart, gboolean vertical, double from, double to,
                                const char *label, guint colour);
BwChartRule *bw_chart_add_rule (BwChart *chart, gboolean vertical, double value,
                                const char *label, guint colour, BwDash dash);
BwChartNote *bw_chart_add_note (BwChart *chart, double x, double y, const char *text);

/* A matrix chart's shape: every cell starts BW_CHECK_NOT_APPLICABLE. */
void bw_chart_matrix_init (BwChart *chart, guint n_rows, guint n_cols);
void bw_chart_matrix_set (BwChart *chart, guint row, guint col, BwCheckStatus status);

/* --- layout: where things land, in the painter's coordinates --- */

typedef struct
{
  double x, y, width, height;
} BwRect;

typedef struct
{
  double scale;          /* the style's lengths are multiplied by this for the canvas */
  BwRect plot;           /* x-y: the data area; matrix: the cell grid */
  BwAxis x, y, y2;       /* the resolved axes (x-y) */
  gboolean has_y2;
  gboolean has_legend;
  BwRect legend;         /* the legend box (inside or outside the plot) */
  gboolean legend_clear; /* the legend covers no data */
  double cell_width, cell_height; /* matrix */
  guint rows_shown;      /* matrix: rows that fit (the rest are summarised in a note) */
  gboolean compact_rows; /* matrix: no heading rows; each label starts with its group's short
                          * name (the last '|' alternative of the group label) */
} BwChartFrame;

/* Lays CHART out on a WIDTH x HEIGHT canvas (page units), measuring text with CR's font setup
 * (CR may be NULL: a scratch image context is used). FALSE when the chart cannot be laid out
 * (no data, or a canvas too small for anything). */
gboolean bw_chart_layout (const BwChart *chart, const BwStyle *style, cairo_t *cr, double width,
                          double height, BwChartFrame *out);

/* World (display-unit) point to page coordinates through FRAME. */
void bw_chart_frame_to_page (const BwChartFrame *frame, gboolean y2, double x, double y,
                             double *out_px, double *out_py);

/* The painter: everything inside 0..WIDTH x 0..HEIGHT, wrapped in cairo_save/restore. */
void bw_chart_paint (const BwChart *chart, const BwStyle *style, cairo_t *cr, double width,
                     double height);

typedef enum
{
  BW_CHART_PICK_NONE,
  BW_CHART_PICK_POINT,  /* a data point: series, index */
  BW_CHART_PICK_PLOT,   /* inside the plot, no point near: world x, y */
  BW_CHART_PICK_CELL,   /* matrix: row, col */
} BwChartPickKind;

typedef struct
{
  BwChartPickKind kind;
  guint series, index;
  guint row, col;
  double x, y;          /* world coordinates (x-y charts) */
} BwChartPick;

/* What lies under page point PX, PY of CHART painted on WIDTH x HEIGHT: the nearest data point
 * within a few (scaled) pixels, else the plot position, else a matrix cell. */
gboolean bw_chart_pick (const BwChart *chart, const BwStyle *style, double width, double height,
                        double px, double py, BwChartPick *out);

/* --- a private extension of BwStyle for charts ---
 * BwStyle has no grid, band or check-status colours; they are derived from it here so that every
 * chart follows the preset (light or dark) it is given. */
typedef struct
{
  BwRgb grid;       /* major grid lines */
  BwRgb grid_minor; /* minor grid lines */
  BwRgb pass, warn, fail, not_applicable; /* matrix cells (each also has its own glyph) */
} BwChartColours;

void bw_chart_colours (const BwStyle *style, BwChartColours *out);

/* The colour of INDEX as painted (style series colour, ink or muted ink). */
BwRgb bw_chart_colour (const BwStyle *style, guint index);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (BwChart, bw_chart_free)

G_END_DECLS
