/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-jartest-csv.c: reading jar-test sheets from CSV. */
#include "config.h"

#include "io/bw-jartest-csv.h"

#include <math.h>
#include <stdarg.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"
#include "engine/bw-units.h"
#include "io/bw-xml.h"

typedef enum { COL_DOSE, COL_TURBIDITY, COL_PH, COL_ZETA, COL_MOBILITY, N_COLS } Column;

static const struct
{
  const char *name;
  BwQuantityKind kind;
} columns[N_COLS] = {
  { "dose", BW_KIND_CONCENTRATION },
  { "turbidity", BW_KIND_TURBIDITY },
  { "ph", BW_KIND_NUMBER },
  { "zeta", BW_KIND_POTENTIAL },
  { "mobility", BW_KIND_MOBILITY },
};

static gboolean
fail (GError **error, const char *name, guint line, const char *fmt, ...) G_GNUC_PRINTF (4, 5);

static gboolean
fail (GError **error, const char *name, guint line, const char *fmt, ...)
{
  va_list ap;
  g_autofree char *msg = NULL;

  va_start (ap, fmt);
  msg = g_strdup_vprintf (fmt, ap);
  va_end (ap);
  g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_INVALID, BW_ ("%s:%u: %s"), name, line, msg);
  return FALSE;
}

gboolean
bw_jartest_read_csv (const char *data, gsize len, const char *name, BwJarSeries *out,
                     GError **error)
{
  g_autofree char *text = NULL;
  g_auto (GStrv) lines = NULL;
  int col_of[N_COLS] = { -1, -1, -1, -1, -1 };
  const BwUnit *unit_of[N_COLS] = { NULL };
  guint ncols = 0, line_no = 0;
  gboolean header = FALSE;
  BwJarSeries s = { 0 };
  g_autoptr (GError) local = NULL;

  g_return_val_if_fail (data != NULL && out != NULL, FALSE);
  if (name == NULL)
    name = "(jar test)";
  if (len > 4 * 1024 * 1024)
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_TOO_LARGE, BW_ ("%s: over the 4 MiB limit for a sheet"), name);
      return FALSE;
    }
  if (memchr (data, '\0', len) || !g_utf8_validate (data, (gssize) len, NULL))
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_MALFORMED, BW_ ("%s: not UTF-8 text"), name);
      return FALSE;
    }
  text = g_strndup (data, len);
  lines = g_strsplit (text, "\n", -1);
  for (guint li = 0; lines[li]; li++)
    {
      g_auto (GStrv) cells = NULL;
      char *l = g_strstrip (lines[li]);
      guint n;

      line_no = li + 1;
      if (l[0] == '\0' || l[0] == '#')
        continue;
      cells = g_strsplit (l, ",", -1);
      n = g_strv_length (cells);
      if (!header)
        {
          /* "dose (mg/L)": a column name and its unit in parentheses. */
          for (guint c = 0; c < n; c++)
            {
              char *cell = g_strstrip (cells[c]);
              char *paren = strchr (cell, '(');
              g_autofree char *cname = NULL;
              g_autofree char *uname = NULL;
              int which = -1;
              if (paren)
                {
                  char *close = strrchr (cell, ')');
                  if (close == NULL || close < paren)
                    return fail (error, name, line_no, BW_ ("column %u: '%s' has an unclosed unit"), c + 1, cell);
                  uname = g_strstrip (g_strndup (paren + 1, (gsize) (close - paren - 1)));
                  cname = g_strstrip (g_strndup (cell, (gsize) (paren - cell)));
                }
              else
                cname = g_strdup (cell);
              for (int k = 0; k < N_COLS; k++)
                if (g_ascii_strcasecmp (cname, columns[k].name) == 0)
                  which = k;
              if (which < 0)
                return fail (error, name, line_no,
                             BW_ ("column %u: '%s' is not dose, turbidity, pH, zeta or mobility"), c + 1, cname);
              if (col_of[which] >= 0)
                return fail (error, name, line_no, BW_ ("column %u: %s is given twice"), c + 1, cname);
              col_of[which] = (int) c;
              if (which == COL_PH)
                {
                  if (uname && *uname)
                    return fail (error, name, line_no, BW_ ("column %u: pH takes no unit"), c + 1);
                  unit_of[which] = bw_units_si_unit (BW_KIND_NUMBER);
                }
              else
                {
                  if (uname == NULL || *uname == '\0')
                    return fail (error, name, line_no, BW_ ("column %u: %s needs its unit, e.g. \"%s (%s)\""),
                                 c + 1, cname, cname,
                                 bw_units_display_unit (columns[which].kind, BW_UNIT_SYSTEM_SI)->ascii);
                  unit_of[which] = bw_unit_lookup (uname, columns[which].kind, cname, &local);
                  if (unit_of[which] == NULL)
                    return fail (error, name, line_no, BW_ ("column %u: %s"), c + 1, local->message);
                }
            }
          if (col_of[COL_DOSE] < 0 || col_of[COL_TURBIDITY] < 0)
            return fail (error, name, line_no, BW_ ("the header needs a dose and a turbidity column"));
          if (col_of[COL_ZETA] >= 0 && col_of[COL_MOBILITY] >= 0)
            return fail (error, name, line_no, BW_ ("give zeta or mobility, not both"));
          ncols = n;
          header = TRUE;
          continue;
        }
      if (n != ncols)
        return fail (error, name, line_no, BW_ ("%u values where the header has %u columns"), n, ncols);
      if (s.n_jars >= BW_JAR_MAX)
        return fail (error, name, line_no, BW_ ("more than %d jars"), BW_JAR_MAX);
      for (int k = 0; k < N_COLS; k++)
        {
          char *cell, *end = NULL;
          double v;
          BwJar *j = &s.jars[s.n_jars];
          if (col_of[k] < 0)
            continue;
          cell = g_strstrip (cells[col_of[k]]);
          v = g_ascii_strtod (cell, &end);
          if (*cell == '\0' || end == cell || *end != '\0' || !isfinite (v))
            return fail (error, name, line_no, BW_ ("%s: '%s' is not a number"), columns[k].name, cell);
          v = bw_unit_to_si (unit_of[k], v);
          switch ((Column) k)
            {
            case COL_DOSE: j->dose_kg_m3 = v; break;
            case COL_TURBIDITY: j->turbidity_NTU = v; break;
            case COL_PH: j->ph = v; break;
            case COL_ZETA: j->zeta_V = v; break;
            case COL_MOBILITY: j->mobility_m2_V_s = v; break;
            default: break;
            }
        }
      s.n_jars++;
    }
  if (!header)
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_INVALID, BW_ ("%s: no header row"), name);
      return FALSE;
    }
  s.has_ph = col_of[COL_PH] >= 0;
  s.has_zeta = col_of[COL_ZETA] >= 0;
  s.has_mobility = col_of[COL_MOBILITY] >= 0;
  if (!bw_jar_series_prepare (&s, &local))
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_INVALID, BW_ ("%s: %s"), name, local->message);
      return FALSE;
    }
  *out = s;
  return TRUE;
}

gboolean
bw_jartest_load_csv (const char *path, BwJarSeries *out, GError **error)
{
  g_autofree char *data = NULL;
  gsize len = 0;
  g_autoptr (GError) local = NULL;

  if (!g_file_get_contents (path, &data, &len, &local))
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_READ, BW_ ("%s"), local->message);
      return FALSE;
    }
  return bw_jartest_read_csv (data, len, path, out, error);
}
