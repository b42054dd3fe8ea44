/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-locale.c: the gettext domain, and the locale's decimal separator on what people read and
 * type. The engine, the files and the CLI stay in the C locale ('.'); only the workbench's
 * entries and results are localised, here. */
#include "config.h"

#include "gui/bw-locale.h"

#include "draw/bw-labels.h"

#include <glib/gi18n.h>
#include <locale.h>
#include <string.h>

void
bw_locale_init (void)
{
  const char *dir = g_getenv ("BASINWRIGHT_LOCALEDIR");

  setlocale (LC_ALL, "");
  bindtextdomain (GETTEXT_PACKAGE, dir && dir[0] ? dir : LOCALEDIR);
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");
  textdomain (GETTEXT_PACKAGE);
}

const char *
bw_locale_decimal_point (void)
{
  return bw_label_decimal_point ();
}

char *
bw_locale_localize_number (const char *text)
{
  return bw_label_number (text);
}

char *
bw_locale_delocalize_number (const char *text)
{
  const char *dp = bw_locale_decimal_point ();
  const size_t n = strlen (dp);
  GString *s;

  g_return_val_if_fail (text != NULL, NULL);
  if (strcmp (dp, ".") == 0)
    return g_strdup (text);
  s = g_string_sized_new (strlen (text));
  for (const char *p = text; *p;)
    {
      if (strncmp (p, dp, n) == 0 && g_ascii_isdigit (p[n]))
        {
          g_string_append_c (s, '.');
          p += n;
        }
      else
        g_string_append_c (s, *p++);
    }
  return g_string_free (s, FALSE);
}

char *
bw_locale_format (double value_si, BwQuantityKind kind, BwUnitSystem system)
{
  return bw_label_quantity (value_si, kind, system);
}
