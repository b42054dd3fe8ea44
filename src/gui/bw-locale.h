/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-locale.h: translations and numbers in the user's locale, at the edge of the workbench. */
#pragma once

#include <glib.h>

#include "engine/bw-units.h"

G_BEGIN_DECLS

/* Sets the locale from the environment and binds the 'basinwright' gettext domain (UTF-8) to
 * $BASINWRIGHT_LOCALEDIR when set (an uninstalled run or a test: BUILD/po), else to the
 * installed locale directory. Call once, before any window is built. */
void bw_locale_init (void);

/* The locale's decimal separator ("." in C, "," in es_ES). Borrowed, valid until setlocale. */
const char *bw_locale_decimal_point (void);

/* TEXT as formatted by the engine (C locale: '.' decimal point) with every decimal point that
 * sits between two digits replaced by the locale's separator. A new string. */
char *bw_locale_localize_number (const char *text);
/* What a person typed, made readable by the engine's parser: in a locale whose separator is not
 * '.', each separator followed by a digit becomes '.' ("1,5 m" -> "1.5 m"); a '.' is left as it
 * is, so "1.5 m" reads the same. In the C locale the text is returned unchanged. A new string. */
char *bw_locale_delocalize_number (const char *text);

/* bw_units_format of VALUE_SI, localised as above. */
char *bw_locale_format (double value_si, BwQuantityKind kind, BwUnitSystem system);

G_END_DECLS
