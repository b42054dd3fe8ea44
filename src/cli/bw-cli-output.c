/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-cli-output.c: JSON documents and readable tables for basinwright-cli. */
#include "config.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

#include "cli/bw-cli.h"

/* Set when a value about to be printed is not finite. The document is then withheld: the
 * contract allows no NaN, infinity or null in place of a number. */
static gboolean output_failed;

gboolean
bw_cli_output_failed (void)
{
  return output_failed;
}

static void
refuse_output (void)
{
  static gboolean reported;

  if (!reported)
    fprintf (stderr, "basinwright-cli: a result is not a finite number: the inputs lie beyond the "
                     "models' range\n");
  reported = TRUE;
  output_failed = TRUE;
}

struct _BwJson
{
  GString *s;
  GArray *first; /* per nesting level: is the next member the first? */
};

BwJson *
bw_json_new (void)
{
  BwJson *j = g_new0 (BwJson, 1);
  gboolean t = TRUE;

  j->s = g_string_new ("{");
  j->first = g_array_new (FALSE, FALSE, sizeof (gboolean));
  g_array_append_val (j->first, t);
  return j;
}

static void
json_escape (GString *s, const char *text)
{
  g_string_append_c (s, '"');
  for (const char *p = text; *p; p++)
    {
      const guchar c = (guchar) *p;
      switch (c)
        {
        case '"': g_string_append (s, "\\\""); break;
        case '\\': g_string_append (s, "\\\\"); break;
        case '\n': g_string_append (s, "\\n"); break;
        case '\r': g_string_append (s, "\\r"); break;
        case '\t': g_string_append (s, "\\t"); break;
        default:
          if (c < 0x20)
            g_string_append_printf (s, "\\u%04x", c);
          else
            g_string_append_c (s, (char) c);
        }
    }
  g_string_append_c (s, '"');
}

static void
json_member (BwJson *j, const char *key)
{
  gboolean *first = &g_array_index (j->first, gboolean, j->first->len - 1);

  if (!*first)
    g_string_append_c (j->s, ',');
  *first = FALSE;
  if (key)
    {
      json_escape (j->s, key);
      g_string_append_c (j->s, ':');
    }
}

static void
json_append_number (GString *s, double value)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE];

  /* The engine never returns a non-finite value; should one slip through, JSON gets null rather
   * than an invalid token. */
  if (!isfinite (value))
    {
      output_failed = TRUE;
      g_string_append (s, "null");
      return;
    }
  g_string_append (s, g_ascii_formatd (buf, sizeof buf, "%.12g", value));
}

void
bw_json_number (BwJson *j, const char *key, double value)
{
  json_member (j, key);
  json_append_number (j->s, value);
}

void
bw_json_array_number (BwJson *j, double value)
{
  bw_json_number (j, NULL, value);
}

void
bw_json_int (BwJson *j, const char *key, gint64 value)
{
  json_member (j, key);
  g_string_append_printf (j->s, "%" G_GINT64_FORMAT, value);
}

void
bw_json_string (BwJson *j, const char *key, const char *value)
{
  json_member (j, key);
  if (value == NULL)
    g_string_append (j->s, "null");
  else
    json_escape (j->s, value);
}

void
bw_json_bool (BwJson *j, const char *key, gboolean value)
{
  json_member (j, key);
  g_string_append (j->s, value ? "true" : "false");
}

static void
json_open (BwJson *j, const char *key, char bracket)
{
  gboolean t = TRUE;

  json_member (j, key);
  g_string_append_c (j->s, bracket);
  g_array_append_val (j->first, t);
}

static void
json_close (BwJson *j, char bracket)
{
  g_assert (j->first->len > 1);
  g_array_set_size (j->first, j->first->len - 1);
  g_string_append_c (j->s, bracket);
}

void bw_json_begin_object (BwJson *j, const char *key) { json_open (j, key, '{'); }
void bw_json_end_object (BwJson *j) { json_close (j, '}'); }
void bw_json_begin_array (BwJson *j, const char *key) { json_open (j, key, '['); }
void bw_json_end_array (BwJson *j) { json_close (j, ']'); }

void
bw_json_print_free (BwJson *j)
{
  g_assert (j->first->len == 1);
  g_string_append (j->s, "}\n");
  if (output_failed)
    refuse_output ();
  else
    fputs (j->s->str, stdout);
  g_string_free (j->s, TRUE);
  g_array_free (j->first, TRUE);
  g_free (j);
}

char *
bw_cli_pad (const char *text, int width)
{
  const glong n = g_utf8_strlen (text ? text : "", -1);
  GString *s = g_string_new (text);

  for (glong i = n; i < width; i++)
    g_string_append_c (s, ' ');
  return g_string_free (s, FALSE);
}

/* --- readable tables --- */

struct _BwTable
{
  char *title;
  GPtrArray *labels;
  GPtrArray *values;
};

BwTable *
bw_table_new (const char *title)
{
  BwTable *t = g_new0 (BwTable, 1);

  t->title = g_strdup (title);
  t->labels = g_ptr_array_new_with_free_func (g_free);
  t->values = g_ptr_array_new_with_free_func (g_free);
  return t;
}

void
bw_table_text (BwTable *t, const char *label, const char *text)
{
  g_ptr_array_add (t->labels, g_strdup (label));
  g_ptr_array_add (t->values, g_strdup (text));
}

void
bw_table_quantity (BwTable *t, const char *label, double value_si, BwQuantityKind kind,
                   BwUnitSystem system)
{
  if (!isfinite (value_si))
    output_failed = TRUE;
  g_ptr_array_add (t->labels, g_strdup (label));
  g_ptr_array_add (t->values, bw_units_format (value_si, kind, system));
}

void
bw_table_number (BwTable *t, const char *label, double value, int sig)
{
  if (!isfinite (value))
    output_failed = TRUE;
  g_ptr_array_add (t->labels, g_strdup (label));
  g_ptr_array_add (t->values, bw_format_number (value, sig));
}

void
bw_table_print_free (BwTable *t)
{
  glong width = 0;

  for (guint i = 0; i < t->labels->len; i++)
    width = MAX (width, g_utf8_strlen (g_ptr_array_index (t->labels, i), -1));
  if (output_failed)
    {
      refuse_output ();
      g_ptr_array_set_size (t->labels, 0);
      g_ptr_array_set_size (t->values, 0);
    }
  else if (t->title)
    printf ("%s\n", t->title);
  for (guint i = 0; i < t->labels->len; i++)
    {
      const char *label = g_ptr_array_index (t->labels, i);
      const glong pad = width - g_utf8_strlen (label, -1);
      printf ("  %s%*s  %s\n", label, (int) pad, "", (const char *) g_ptr_array_index (t->values, i));
    }
  g_ptr_array_unref (t->labels);
  g_ptr_array_unref (t->values);
  g_free (t->title);
  g_free (t);
}
