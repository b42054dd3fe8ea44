/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-style.c: the light and dark drawing styles.
 *
 * How the palettes were chosen (our own, checked in tests/draw):
 * - Hues sit on the blue-to-orange axis, with one purple. The common red-green deficiencies
 *   (protan, deutan) keep the blue-yellow opponent channel, so these hues stay apart for them.
 * - The six series colours are spread in CIE L* so that any two differ by at least 10: they stay
 *   distinct for the rarer tritan readers, in greyscale print and on a photocopy, where hue is
 *   lost and only lightness is left. tests/draw checks the spread for both presets.
 * - Sketch roles follow the same idea: water is a pale blue, sludge a pale ochre, structure a
 *   neutral grey, equipment a dark rust; each differs from its neighbours in lightness as well as
 *   hue, and every role is also told apart by shape or a label, never by colour alone. */
#include "config.h"

#include "draw/bw-style.h"

#include <math.h>

#define RGB(hex) \
  { ((hex) >> 16 & 0xff) / 255.0, ((hex) >> 8 & 0xff) / 255.0, ((hex) & 0xff) / 255.0 }

static const BwStyle light = {
  .name = "light",
  .paper = RGB (0xffffff),
  .ink = RGB (0x1c1e22),
  .ink_muted = RGB (0x5d636d),
  .concrete = RGB (0xd6d6d2),
  .water = RGB (0xcfe6f5),
  .water_line = RGB (0x2a6f9e),
  .sludge = RGB (0xe9d2a8),
  .sludge_line = RGB (0x8a5a2b),
  .equipment = RGB (0xb0481a),
  .flow = RGB (0x1d2f6f),
  .scale_bar = RGB (0x1c1e22),
  /* L*: 21.7, 36.3, 49.5, 62.7, 77.9, 89.0 */
  .series = { RGB (0x1d2f6f), RGB (0x7a3b8c), RGB (0xc4531c), RGB (0x4a9de6), RGB (0xeeb84e),
              RGB (0xbfe6f4) },
  .line_outline = 1.6,
  .line_detail = 1.1,
  .line_dimension = 0.75,
  .font_family = "DejaVu Sans",
  .font_size = 10.5,
  .title_size = 14.0,
  .small_size = 8.5,
};

static const BwStyle dark = {
  .name = "dark",
  .paper = RGB (0x16181d),
  .ink = RGB (0xe6e6e6),
  .ink_muted = RGB (0xa0a6b0),
  .concrete = RGB (0x3b3f47),
  .water = RGB (0x1e3a52),
  .water_line = RGB (0x6fb3e8),
  .sludge = RGB (0x5a4426),
  .sludge_line = RGB (0xc9a46a),
  .equipment = RGB (0xf08a4b),
  .flow = RGB (0xa8c8ff),
  .scale_bar = RGB (0xe6e6e6),
  /* Lighter than the paper throughout; L* about 33, 47.5, 59.6, 71.4, 82.3, 95.1 */
  .series = { RGB (0x8c3a14), RGB (0x8458d0), RGB (0x4a94da), RGB (0xe495d4), RGB (0xf5c66a),
              RGB (0xf6f3c8) },
  .line_outline = 1.6,
  .line_detail = 1.1,
  .line_dimension = 0.75,
  .font_family = "DejaVu Sans",
  .font_size = 10.5,
  .title_size = 14.0,
  .small_size = 8.5,
};

const BwStyle *
bw_style_light (void)
{
  return &light;
}

const BwStyle *
bw_style_dark (void)
{
  return &dark;
}

/* sRGB decoding (IEC 61966-2-1), relative luminance Y with the Rec. 709 weights, then CIE L*
 * (CIE 15:2004, with the linear segment below Y = (6/29)^3). */
static double
srgb_linear (double c)
{
  return c <= 0.04045 ? c / 12.92 : pow ((c + 0.055) / 1.055, 2.4);
}

double
bw_rgb_lightness (BwRgb c)
{
  const double y = 0.2126 * srgb_linear (c.r) + 0.7152 * srgb_linear (c.g)
                   + 0.0722 * srgb_linear (c.b);
  const double f = y > 216.0 / 24389.0 ? cbrt (y) : (24389.0 / 27.0 * y + 16.0) / 116.0;
  return 116.0 * f - 16.0;
}
