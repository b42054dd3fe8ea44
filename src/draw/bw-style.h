/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-style.h: colours, line widths and type of every drawing, as plain data (no toolkit types). */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* An sRGB colour, each channel 0..1, opaque. */
typedef struct
{
  double r, g, b;
} BwRgb;

#define BW_STYLE_N_SERIES 6

/* How a drawing looks. Lengths are in page units (points in PDF and SVG, pixels in PNG) for a
 * reference canvas of 800 x 560; a painter scales them with the canvas so one style serves a
 * thumbnail and a poster alike. */
typedef struct
{
  const char *name;          /* "light", "dark" */
  BwRgb paper;               /* background */
  BwRgb ink;                 /* outlines, text, dimension lines */
  BwRgb ink_muted;           /* secondary text, hidden and centre lines */
  BwRgb concrete;            /* structure cut in section or seen in plan */
  BwRgb water;               /* water fill */
  BwRgb water_line;          /* free water surface */
  BwRgb sludge;              /* sludge zone fill */
  BwRgb sludge_line;         /* sludge zone hatching and edge */
  BwRgb equipment;           /* impellers, baffles, weirs and launders */
  BwRgb flow;                /* flow arrows */
  BwRgb scale_bar;           /* the solid band of the scale bar */
  BwRgb series[BW_STYLE_N_SERIES]; /* categorical colours for charts, in order of use */

  double line_outline;       /* structure outlines */
  double line_detail;        /* equipment, hatching, leaders */
  double line_dimension;     /* dimension and extension lines */
  const char *font_family;   /* a fontconfig family name */
  double font_size;          /* body text: labels, dimensions */
  double title_size;         /* the title line */
  double small_size;         /* notes */
} BwStyle;

/* The built-in presets. Both palettes were chosen for readers with colour-vision deficiency; see
 * bw-style.c for how. The returned styles are static: copy one to change it. */
const BwStyle *bw_style_light (void);
const BwStyle *bw_style_dark (void);

/* CIE 1976 lightness L* (0 black .. 100 white) of C, D65 white (IEC 61966-2-1 sRGB decoding,
 * CIE 15 L*). Used to keep the palette's colours apart in lightness. */
double bw_rgb_lightness (BwRgb c);

G_END_DECLS
