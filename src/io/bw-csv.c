/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-csv.c: CSV export of results and checks, and reading a submittal's stated values. */
#include "config.h"

#include "io/bw-csv.h"

#include <errno.h>
#include <glib/gstdio.h>
#include <math.h>
#include <stdarg.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"
#include "io/bw-xml.h"

static void
cell (GString *s, const char *text, gboolean first)
{
  if (!first)
    g_string_append_c (s, ',');
  if (text == NULL)
    return;
  if (strpbrk (text, ",\"\r\n"))
    {
      g_string_append_c (s, '"');
      for (const char *p = text; *p; p++)
        {
          if (*p == '"')
            g_string_append_c (s, '"');
          g_string_append_c (s, *p);
        }
      g_string_append_c (s, '"');
    }
  else
    g_string_append (s, text);
}

static void
num (GString *s, double v)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE];
  g_string_append_c (s, ',');
  g_string_append (s, g_ascii_formatd (buf, sizeof buf, "%.10g", v));
}

static char *
header_of (BwQuantity q)
{
  const BwQuantityInfo *info = bw_quantity_info (q);
  const BwUnit *u = bw_units_si_unit (info->kind);
  return u->ascii[0] ? g_strdup_printf ("%s (%s)", info->name, u->ascii) : g_strdup (info->name);
}

static void
results_rows (GString *s, const BwResults *r, guint from, guint to, guint64 used)
{
  cell (s, "element", TRUE);
  cell (s, "type", FALSE);
  cell (s, "case", FALSE);
  for (int q = 0; q < BW_N_QUANTITIES; q++)
    if ((used >> q) & 1)
      {
        g_autofree char *h = header_of ((BwQuantity) q);
        cell (s, h, FALSE);
      }
  g_string_append (s, "\r\n");
  for (guint e = from; e < to; e++)
    {
      const BwElementResult *el = g_ptr_array_index (r->elements, e);
      for (guint c = 0; c < r->n_cases; c++)
        {
          g_autofree char *cid = bw_load_case_id (&r->cases[c]);
          cell (s, el->id, TRUE);
          cell (s, bw_element_type_name (el->type), FALSE);
          cell (s, cid, FALSE);
          for (int q = 0; q < BW_N_QUANTITIES; q++)
            if ((used >> q) & 1)
              {
                if (bw_quantity_set_has (&el->values[c], (BwQuantity) q))
                  num (s, el->values[c].values[q]);
                else
                  cell (s, "", FALSE);
              }
          g_string_append (s, "\r\n");
        }
    }
}

static guint64
used_quantities (const BwResults *r, guint from, guint to)
{
  guint64 used = 0;
  for (guint e = from; e < to; e++)
    for (guint c = 0; c < r->n_cases; c++)
      used |= ((BwElementResult *) g_ptr_array_index (r->elements, e))->values[c].present;
  return used;
}

static gboolean
write_file (const char *dir, const char *name, GString *s, GError **error)
{
  g_autofree char *path = g_build_filename (dir, name, NULL);
  return bw_write_atomic (path, s->str, s->len, error);
}

gboolean
bw_export_csv (const BwProject *p, const BwResults *r, GArray *checks, const char *dir, GError **error)
{
  g_autoptr (GString) s = g_string_new (NULL);

  g_return_val_if_fail (p != NULL && r != NULL && dir != NULL, FALSE);
  if (g_mkdir_with_parents (dir, 0755) != 0)
    {
      const int saved = errno;
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_WRITE, BW_ ("%s: cannot create the folder: %s"), dir,
                   g_strerror (saved));
      return FALSE;
    }
  results_rows (s, r, 0, r->elements->len, used_quantities (r, 0, r->elements->len));
  if (!write_file (dir, "results.csv", s, error))
    return FALSE;
  for (guint e = 0; e < r->elements->len; e++)
    {
      const BwElementResult *el = g_ptr_array_index (r->elements, e);
      g_autofree char *name = NULL;
      g_string_truncate (s, 0);
      results_rows (s, r, e, e + 1, used_quantities (r, e, e + 1));
      /* Ids are [A-Za-z0-9-_./]; a slash would leave the folder, so it becomes '_'. */
      name = g_strdup_printf ("results-%s.csv", el->id);
      g_strdelimit (name, "/", '_');
      if (!write_file (dir, name, s, error))
        return FALSE;
    }
  if (checks)
    {
      g_string_truncate (s, 0);
      g_string_append (s, "criterion,title,quantity,element,status,value,limit,unit,limit_type,"
                          "limit_level,governing_case,document,edition,clause,provenance\r\n");
      for (guint i = 0; i < checks->len; i++)
        {
          const BwCheck *ck = &g_array_index (checks, BwCheck, i);
          const BwCriterion *c = ck->criterion;
          const BwUnit *u = bw_units_si_unit (bw_quantity_info (c->quantity)->kind);
          g_autofree char *cid = ck->governing_case >= 0 ? bw_load_case_id (&r->cases[ck->governing_case]) : NULL;
          cell (s, c->id, TRUE);
          cell (s, c->title, FALSE);
          cell (s, bw_quantity_name (c->quantity), FALSE);
          cell (s, ck->element >= 0 ? ((BwElementResult *) g_ptr_array_index (r->elements, ck->element))->id : "", FALSE);
          cell (s, ck->status == BW_CHECK_NOT_APPLICABLE ? "not_applicable" : bw_check_status_name (ck->status), FALSE);
          if (ck->governing_case >= 0)
            num (s, ck->value);
          else
            cell (s, "", FALSE);
          if (ck->has_limit)
            num (s, ck->limit);
          else
            cell (s, "", FALSE);
          cell (s, u->ascii, FALSE);
          cell (s, ck->has_limit ? (ck->limit_is_max ? "max" : "min") : "", FALSE);
          cell (s, ck->has_limit ? (ck->limit_is_required ? "required" : "preferred") : "", FALSE);
          cell (s, cid, FALSE);
          cell (s, c->document, FALSE);
          cell (s, c->edition, FALSE);
          cell (s, c->clause, FALSE);
          cell (s, c->provenance == BW_PROVENANCE_SEEN ? "seen" : "memory", FALSE);
          g_string_append (s, "\r\n");
        }
      if (!write_file (dir, "checks.csv", s, error))
        return FALSE;
    }
  return TRUE;
}

/* Splits one CSV record (RFC 4180 quotes, no embedded newlines) into cells. */
static GPtrArray *
split_record (const char *line, gboolean *ok)
{
  GPtrArray *cells = g_ptr_array_new_with_free_func (g_free);
  GString *cur = g_string_new (NULL);
  gboolean quoted = FALSE;

  *ok = TRUE;
  for (const char *p = line;; p++)
    {
      if (quoted)
        {
          if (*p == '\0')
            {
              *ok = FALSE;
              break;
            }
          if (*p == '"' && p[1] == '"')
            g_string_append_c (cur, '"'), p++;
          else if (*p == '"')
            quoted = FALSE;
          else
            g_string_append_c (cur, *p);
          continue;
        }
      if (*p == '"' && cur->len == 0)
        quoted = TRUE;
      else if (*p == ',' || *p == '\0')
        {
          g_ptr_array_add (cells, g_strstrip (g_strdup (cur->str)));
          g_string_truncate (cur, 0);
          if (*p == '\0')
            break;
        }
      else
        g_string_append_c (cur, *p);
    }
  g_string_free (cur, TRUE);
  return cells;
}

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

GPtrArray *
bw_stated_read_csv (const char *data, gsize len, const char *name, GError **error)
{
  g_autoptr (GPtrArray) out = g_ptr_array_new_with_free_func ((GDestroyNotify) bw_stated_free);
  g_autofree char *text = NULL;
  g_auto (GStrv) lines = NULL;
  int col[6] = { -1, -1, -1, -1, -1, -1 };
  const char *const names[6] = { "element", "quantity", "case", "value", "unit", "comment" };
  gboolean header = FALSE;
  guint ncols = 0;

  g_return_val_if_fail (data != NULL, NULL);
  if (len > 16 * 1024 * 1024 || memchr (data, '\0', len) || !g_utf8_validate (data, (gssize) len, NULL))
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_MALFORMED, BW_ ("%s: not a UTF-8 text file under 16 MiB"),
                   name);
      return NULL;
    }
  text = g_strndup (data, len);
  lines = g_strsplit (text, "\n", -1);
  for (guint li = 0; lines[li]; li++)
    {
      const guint line = li + 1;
      char *l = g_strstrip (lines[li]);
      g_autoptr (GPtrArray) cells = NULL;
      gboolean ok;

      if (l[0] == '\0' || l[0] == '#')
        continue;
      cells = split_record (l, &ok);
      if (!ok)
        return fail (error, name, line, BW_ ("an unclosed quote")), NULL;
      if (!header)
        {
          for (guint c = 0; c < cells->len; c++)
            {
              int k = -1;
              for (int n = 0; n < 6; n++)
                if (g_ascii_strcasecmp (g_ptr_array_index (cells, c), names[n]) == 0)
                  k = n;
              if (k < 0)
                return fail (error, name, line, BW_ ("column %u: '%s' is not element, quantity, case, value, "
                             "unit or comment"), c + 1, (const char *) g_ptr_array_index (cells, c)), NULL;
              col[k] = (int) c;
            }
          for (int n = 0; n < 5; n++)
            if (col[n] < 0)
              return fail (error, name, line, BW_ ("the header has no %s column"), names[n]), NULL;
          ncols = cells->len;
          header = TRUE;
          continue;
        }
      if (cells->len != ncols)
        return fail (error, name, line, BW_ ("%u values where the header has %u columns"), cells->len, ncols), NULL;
      {
        g_autoptr (GError) local = NULL;
        BwStated *s = g_new0 (BwStated, 1);
        const char *qname = g_ptr_array_index (cells, col[1]);
        const char *cas = g_ptr_array_index (cells, col[2]);
        const char *vtext = g_ptr_array_index (cells, col[3]);
        const char *utext = g_ptr_array_index (cells, col[4]);
        const BwUnit *unit;
        char *end = NULL;
        double v;

        g_ptr_array_add (out, s);
        s->line = line;
        s->element = g_strdup (g_ptr_array_index (cells, col[0]));
        if (col[5] >= 0 && *(const char *) g_ptr_array_index (cells, col[5]))
          s->comment = g_strdup (g_ptr_array_index (cells, col[5]));
        if (s->element[0] == '\0')
          return fail (error, name, line, BW_ ("element: empty")), NULL;
        if (!bw_quantity_from_name (qname, &s->quantity))
          return fail (error, name, line, BW_ ("quantity: '%s' is not one Basinwright computes"), qname), NULL;
        if (g_ascii_strcasecmp (cas, "max") == 0)
          s->which = BW_STATED_MAXIMUM;
        else if (g_ascii_strcasecmp (cas, "min") == 0)
          s->which = BW_STATED_MINIMUM;
        else if (bw_load_case_parse_id (cas, &s->load_case))
          s->which = BW_STATED_CASE;
        else
          return fail (error, name, line, BW_ ("case: '%s' is not max, min or a case such as "
                       "maximum-day/coldest/all-in-service"), cas), NULL;
        v = g_ascii_strtod (vtext, &end);
        if (*vtext == '\0' || end == vtext || *end != '\0' || !isfinite (v))
          return fail (error, name, line, BW_ ("value: '%s' is not a number"), vtext), NULL;
        unit = *utext ? bw_unit_lookup (utext, bw_quantity_info (s->quantity)->kind, "unit", &local)
                      : bw_units_si_unit (bw_quantity_info (s->quantity)->kind);
        if (unit == NULL)
          return fail (error, name, line, BW_ ("%s"), local->message), NULL;
        s->value = bw_unit_to_si (unit, v);
        if (!isfinite (s->value))
          return fail (error, name, line, BW_ ("value: '%s' is too large"), vtext), NULL;
      }
    }
  if (!header)
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_INVALID, BW_ ("%s: no header row"), name);
      return NULL;
    }
  return g_steal_pointer (&out);
}

GPtrArray *
bw_stated_load_csv (const char *path, GError **error)
{
  g_autofree char *data = NULL;
  gsize len = 0;
  g_autoptr (GError) local = NULL;

  if (!g_file_get_contents (path, &data, &len, &local))
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_READ, BW_ ("%s"), local->message);
      return NULL;
    }
  return bw_stated_read_csv (data, len, path, error);
}
