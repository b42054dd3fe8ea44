/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-cli-args.c: parsing a subcommand's options, help text and error reporting. */
#include "config.h"

#include <errno.h>
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <string.h>

#include "cli/bw-cli.h"
#include "engine/bw-error.h"

int
bw_cli_usage_error (const char *command, const char *format, ...)
{
  va_list ap;
  g_autofree char *msg = NULL;

  va_start (ap, format);
  msg = g_strdup_vprintf (format, ap);
  va_end (ap);
  /* One line only: fold any newline an embedded message may carry. */
  g_strdelimit (msg, "\r\n", ' ');
  if (command)
    fprintf (stderr, "basinwright-cli %s: %s\n", command, msg);
  else
    fprintf (stderr, "basinwright-cli: %s\n", msg);
  return BW_CLI_EXIT_USAGE;
}

static const BwOptSpec *
find_spec (const BwCliCommand *cmd, const char *name, guint *index)
{
  for (guint i = 0; i < cmd->n_specs; i++)
    if (strcmp (cmd->specs[i].name, name) == 0)
      {
        *index = i;
        return &cmd->specs[i];
      }
  return NULL;
}

static const char *
bare_unit_label (const BwOptSpec *s)
{
  if (s->bare_unit)
    {
      const BwUnit *u = bw_unit_lookup (s->bare_unit, s->kind, NULL, NULL);
      return u ? u->symbol : s->bare_unit;
    }
  return bw_units_si_unit (s->kind)->symbol;
}

static void
print_help (const BwCliCommand *cmd)
{
  GString *s = g_string_new (NULL);

  g_string_append_printf (s, "Usage: basinwright-cli %s", cmd->name);
  if (cmd->usage_tail)
    g_string_append_printf (s, " %s", cmd->usage_tail);
  for (guint i = 0; i < cmd->n_specs; i++)
    {
      const BwOptSpec *o = &cmd->specs[i];
      if (o->type == BW_OPT_FLAG)
        g_string_append_printf (s, o->required ? " --%s" : " [--%s]", o->name);
      else
        g_string_append_printf (s, o->required ? " --%s %s" : " [--%s %s]", o->name,
                                o->metavar ? o->metavar : "VALUE");
    }
  g_string_append (s, " [--json] [--units si|us]\n\n");
  g_string_append_printf (s, "%s\n\nOptions:\n", cmd->summary);
  for (guint i = 0; i < cmd->n_specs; i++)
    {
      const BwOptSpec *o = &cmd->specs[i];
      g_autofree char *left = o->type == BW_OPT_FLAG
                                  ? g_strdup_printf ("--%s", o->name)
                                  : g_strdup_printf ("--%s %s", o->name, o->metavar ? o->metavar : "VALUE");
      g_string_append_printf (s, "  %-26s %s", left, o->help);
      if (o->type == BW_OPT_QUANTITY)
        g_string_append_printf (s, " (%s; a bare number is in %s)", bw_quantity_kind_name (o->kind),
                                bare_unit_label (o));
      else if (o->type == BW_OPT_CHOICE)
        g_string_append_printf (s, " (one of: %s)", o->choices);
      g_string_append (s, o->required ? "" : " [optional]");
      g_string_append_c (s, '\n');
    }
  g_string_append_printf (s, "  %-26s %s\n", "--json", "print one JSON object, values in SI units");
  g_string_append_printf (s, "  %-26s %s\n", "--units si|us",
                          "unit system of the readable table (default si)");
  g_string_append_printf (s, "  %-26s %s\n", "--help", "show this help");
  g_string_append (s, "\nValues take a unit suffix with or without a space: 50um, '50 µm', 12C, 54F,\n"
                      "10MGD, 0.44m3/s, 700gpm, 1.5m/h, 1200gpd/ft2, 3hp, 75rpm, 60deg.\n");
  if (cmd->notes)
    g_string_append_printf (s, "\n%s\n", cmd->notes);
  g_string_append (s, "\nResults are a preliminary design aid: verify them with a licensed professional\n"
                      "engineer; local codes and the approving authority govern.\n");
  fputs (s->str, stdout);
  g_string_free (s, TRUE);
}

static gboolean
parse_value (const BwCliCommand *cmd, const BwOptSpec *spec, const char *text, BwOptValue *val)
{
  g_autoptr (GError) error = NULL;
  g_autofree char *field = g_strdup_printf ("--%s", spec->name);

  switch (spec->type)
    {
    case BW_OPT_QUANTITY:
      if (!bw_units_parse (text, spec->kind, spec->bare_unit, field, &val->value, &error))
        {
          bw_cli_usage_error (cmd->name, "%s", error->message);
          return FALSE;
        }
      break;
    case BW_OPT_NUMBER:
      {
        /* A plain number: the unit parser with the dimensionless kind refuses any suffix. */
        if (!bw_units_parse (text, BW_KIND_NUMBER, NULL, field, &val->value, &error))
          {
            bw_cli_usage_error (cmd->name, "%s", error->message);
            return FALSE;
          }
        break;
      }
    case BW_OPT_INT:
      {
        char *end = NULL;
        gint64 v;
        errno = 0;
        v = g_ascii_strtoll (text, &end, 10);
        while (end && g_ascii_isspace (*end))
          end++;
        if (end == text || *text == '\0' || (end && *end != '\0') || errno == ERANGE
            || v < G_MININT32 || v > G_MAXINT32)
          {
            bw_cli_usage_error (cmd->name, "%s: '%s' is not a whole number", field, text);
            return FALSE;
          }
        val->value = (double) v;
        break;
      }
    case BW_OPT_CHOICE:
      {
        g_auto (GStrv) choices = g_strsplit (spec->choices, "|", -1);
        if (!g_strv_contains ((const char *const *) choices, text))
          {
            bw_cli_usage_error (cmd->name, "%s: '%s' is not one of %s", field, text, spec->choices);
            return FALSE;
          }
        break;
      }
    case BW_OPT_STRING:
      if (*text == '\0')
        {
          bw_cli_usage_error (cmd->name, "%s: an empty value is not allowed", field);
          return FALSE;
        }
      break;
    default:
      g_assert_not_reached ();
    }
  g_free (val->text);
  val->text = g_strdup (text);
  val->given = TRUE;
  return TRUE;
}

gboolean
bw_cli_parse (const BwCliCommand *cmd, int argc, char **argv, BwCliArgs *out, int *exit_code)
{
  g_autoptr (GPtrArray) positional = g_ptr_array_new_with_free_func (g_free);
  /* Raw text per option, joined when a unit follows as its own word: --temp 12 °C */
  g_autoptr (GPtrArray) raw = g_ptr_array_new_with_free_func (g_free);
  int last_opt = -1;

  memset (out, 0, sizeof *out);
  out->command = cmd->name;
  out->specs = cmd->specs;
  out->n_specs = cmd->n_specs;
  out->values = g_new0 (BwOptValue, cmd->n_specs > 0 ? cmd->n_specs : 1);
  out->units = BW_UNIT_SYSTEM_SI;
  g_ptr_array_set_size (raw, (guint) cmd->n_specs);
  *exit_code = BW_CLI_EXIT_USAGE;

  for (int i = 1; i < argc; i++)
    if (!g_utf8_validate (argv[i], -1, NULL))
      {
        bw_cli_usage_error (cmd->name, "argument %d%s%s is not valid UTF-8 text", i,
                            i > 1 && g_str_has_prefix (argv[i - 1], "--") ? " after " : "",
                            i > 1 && g_str_has_prefix (argv[i - 1], "--") ? argv[i - 1] : "");
        return FALSE;
      }

  for (int i = 1; i < argc; i++)
    {
      const char *a = argv[i];
      if (g_str_has_prefix (a, "--") && a[2] != '\0' && !g_ascii_isdigit (a[2]))
        {
          g_autofree char *name = g_strdup (a + 2);
          char *eq = strchr (name, '=');
          const char *inline_value = NULL;
          const BwOptSpec *spec;
          guint idx = 0;

          if (eq)
            {
              *eq = '\0';
              inline_value = eq + 1;
            }
          last_opt = -1;
          if (strcmp (name, "help") == 0)
            {
              print_help (cmd);
              *exit_code = BW_CLI_EXIT_OK;
              return FALSE;
            }
          if (strcmp (name, "json") == 0)
            {
              if (inline_value)
                {
                  bw_cli_usage_error (cmd->name, "--json takes no value");
                  return FALSE;
                }
              out->json = TRUE;
              continue;
            }
          if (strcmp (name, "units") == 0)
            {
              const char *v = inline_value ? inline_value : (i + 1 < argc ? argv[++i] : NULL);
              if (v == NULL || !bw_unit_system_from_name (v, &out->units))
                {
                  bw_cli_usage_error (cmd->name, "--units: '%s' is not one of si|us", v ? v : "");
                  return FALSE;
                }
              continue;
            }
          spec = find_spec (cmd, name, &idx);
          if (spec == NULL)
            {
              bw_cli_usage_error (cmd->name, "unknown option --%s (see basinwright-cli %s --help)",
                                  name, cmd->name);
              return FALSE;
            }
          if (spec->type == BW_OPT_FLAG)
            {
              if (inline_value)
                {
                  bw_cli_usage_error (cmd->name, "--%s takes no value", name);
                  return FALSE;
                }
              out->values[idx].given = TRUE;
              continue;
            }
          if (g_ptr_array_index (raw, idx) != NULL)
            {
              bw_cli_usage_error (cmd->name, "--%s is given more than once", name);
              return FALSE;
            }
          if (!inline_value)
            {
              if (i + 1 >= argc)
                {
                  bw_cli_usage_error (cmd->name, "--%s needs a value", name);
                  return FALSE;
                }
              inline_value = argv[++i];
            }
          g_ptr_array_index (raw, idx) = g_strdup (inline_value);
          last_opt = (int) idx;
        }
      else if (cmd->max_positional == 0 && last_opt >= 0 && cmd->specs[last_opt].type == BW_OPT_QUANTITY)
        {
          /* "--temp 12 °C": the unit came as a word of its own. */
          char *joined = g_strconcat (g_ptr_array_index (raw, (guint) last_opt), " ", a, NULL);
          g_free (g_ptr_array_index (raw, (guint) last_opt));
          g_ptr_array_index (raw, (guint) last_opt) = joined;
          last_opt = -1;
        }
      else
        {
          last_opt = -1;
          if (positional->len >= cmd->max_positional)
            {
              bw_cli_usage_error (cmd->name, "unexpected argument '%s'", a);
              return FALSE;
            }
          g_ptr_array_add (positional, g_strdup (a));
        }
    }

  for (guint i = 0; i < cmd->n_specs; i++)
    {
      const char *text = g_ptr_array_index (raw, i);
      if (cmd->specs[i].type == BW_OPT_FLAG)
        {
          if (cmd->specs[i].required && !out->values[i].given)
            {
              bw_cli_usage_error (cmd->name, "--%s is required", cmd->specs[i].name);
              return FALSE;
            }
          continue;
        }
      if (text == NULL)
        {
          if (cmd->specs[i].required)
            {
              bw_cli_usage_error (cmd->name, "--%s is required", cmd->specs[i].name);
              return FALSE;
            }
          continue;
        }
      if (!parse_value (cmd, &cmd->specs[i], text, &out->values[i]))
        return FALSE;
    }
  if (positional->len < cmd->min_positional)
    {
      bw_cli_usage_error (cmd->name, "missing %s", cmd->usage_tail ? cmd->usage_tail : "argument");
      return FALSE;
    }
  g_ptr_array_add (positional, NULL);
  out->positional = (char **) g_ptr_array_steal (positional, NULL);
  *exit_code = BW_CLI_EXIT_OK;
  return TRUE;
}

void
bw_cli_args_clear (BwCliArgs *args)
{
  if (args->values)
    for (guint i = 0; i < args->n_specs; i++)
      g_free (args->values[i].text);
  g_clear_pointer (&args->values, g_free);
  g_clear_pointer (&args->positional, g_strfreev);
}

const BwOptValue *
bw_cli_get (const BwCliArgs *args, const char *name)
{
  for (guint i = 0; i < args->n_specs; i++)
    if (strcmp (args->specs[i].name, name) == 0)
      return &args->values[i];
  g_error ("bw_cli_get: no option --%s in %s", name, args->command);
  return NULL;
}

double
bw_cli_get_double (const BwCliArgs *args, const char *name, double fallback)
{
  const BwOptValue *v = bw_cli_get (args, name);
  return v->given ? v->value : fallback;
}

int
bw_cli_fail (const BwCliArgs *args, const GError *error)
{
  const char *msg = error->message;

  /* An engine message "diameter: ..." becomes "--diameter: ..." when an option carries that
   * engine field name. */
  for (guint i = 0; i < args->n_specs; i++)
    {
      const char *field = args->specs[i].field;
      size_t n = field ? strlen (field) : 0;
      if (n > 0 && strncmp (msg, field, n) == 0 && msg[n] == ':')
        {
          if (strcmp (field, args->specs[i].name) == 0)
            return bw_cli_usage_error (args->command, "--%s", msg);
          return bw_cli_usage_error (args->command, "--%s (%s)%s", args->specs[i].name, field,
                                     msg + n);
        }
    }
  return bw_cli_usage_error (args->command, "%s", msg);
}

gboolean
bw_cli_project_and_output (const BwCliArgs *args, const char **project, const char **output)
{
  const BwOptValue *ov = bw_cli_get (args, "output");

  *project = NULL;
  *output = NULL;
  for (guint i = 0; args->positional[i]; i++)
    {
      const char *a = args->positional[i];
      if (strcmp (a, "-o") == 0)
        {
          if (args->positional[i + 1] == NULL)
            return bw_cli_usage_error (args->command, "-o needs a value"), FALSE;
          if (*output != NULL || ov->given)
            return bw_cli_usage_error (args->command, "-o is given more than once"), FALSE;
          *output = args->positional[++i];
        }
      else if (*project == NULL)
        *project = a;
      else
        return bw_cli_usage_error (args->command, "unexpected argument '%s'", a), FALSE;
    }
  if (ov->given)
    *output = ov->text;
  if (*project == NULL)
    return bw_cli_usage_error (args->command, "missing PROJECT"), FALSE;
  return TRUE;
}
