/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-cli.c: basinwright-cli, the scriptable face of the sizing engine: dispatch to subcommands. */
#include "config.h"

#include <glib.h>
#include <libintl.h>
#include <locale.h>
#include <stdio.h>
#include <string.h>

#include "cli/bw-cli.h"

static const BwCliCommand *const commands[] = {
  &bw_cli_cmd_water,
  &bw_cli_cmd_settle,
  &bw_cli_cmd_gvalue,
  &bw_cli_cmd_impeller,
  &bw_cli_cmd_paddle,
  &bw_cli_cmd_baffled,
  &bw_cli_cmd_flocmodel,
  &bw_cli_cmd_basin,
  &bw_cli_cmd_scour,
  &bw_cli_cmd_plates,
  &bw_cli_cmd_removal,
  &bw_cli_cmd_compute,
  &bw_cli_cmd_check,
  &bw_cli_cmd_criteria,
  &bw_cli_cmd_coagulant,
  &bw_cli_cmd_zeta,
  &bw_cli_cmd_jartest,
  &bw_cli_cmd_export,
  &bw_cli_cmd_review,
  &bw_cli_cmd_diff,
  &bw_cli_cmd_autosize,
  &bw_cli_cmd_render,
  &bw_cli_cmd_report,
};

static void
print_usage (FILE *to)
{
  fprintf (to, "Usage: basinwright-cli COMMAND [OPTIONS]\n"
               "       basinwright-cli COMMAND --help\n"
               "       basinwright-cli --version\n\n"
               "Sizing calculations for coagulation, flocculation and sedimentation.\n\n"
               "Commands:\n");
  for (guint i = 0; i < G_N_ELEMENTS (commands); i++)
    fprintf (to, "  %-10s %s\n", commands[i]->name, commands[i]->summary);
  fprintf (to, "\nExit status: 0 success, 1 a check found a failing required criterion, 2 a usage\n"
               "or input error (one line on stderr names the option and the reason).\n\n"
               "Results are a preliminary design aid: verify them with a licensed professional\n"
               "engineer; local codes and the approving authority govern.\n");
}

int
main (int argc, char **argv)
{
  BwCliArgs args;
  int code;
  const char *localedir = g_getenv ("BASINWRIGHT_LOCALEDIR");

  /* The locale's character set for the terminal; but the command line's output is a contract
   * (shared/CLI-CONTRACT.md): its words, keys, messages and numbers stay English with a decimal
   * point whatever the locale, so scripts and reviewers read the same text. The catalogue is
   * bound as the workbench binds it, so that English is the locale's choice here, not the
   * accident of a catalogue not found (tests/cli/test-cli-locale.py holds it to that). */
  setlocale (LC_ALL, "");
  setlocale (LC_MESSAGES, "C");
  setlocale (LC_NUMERIC, "C");
  bindtextdomain (GETTEXT_PACKAGE, localedir && localedir[0] ? localedir : LOCALEDIR);
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");

  if (argc < 2)
    {
      print_usage (stderr);
      return BW_CLI_EXIT_USAGE;
    }
  if (strcmp (argv[1], "--help") == 0 || strcmp (argv[1], "-h") == 0 || strcmp (argv[1], "help") == 0)
    {
      print_usage (stdout);
      return BW_CLI_EXIT_OK;
    }
  if (strcmp (argv[1], "--version") == 0)
    {
      printf ("basinwright-cli %s\n", PACKAGE_VERSION);
      return BW_CLI_EXIT_OK;
    }
  for (guint i = 0; i < G_N_ELEMENTS (commands); i++)
    if (strcmp (argv[1], commands[i]->name) == 0)
      {
        if (!bw_cli_parse (commands[i], argc - 1, argv + 1, &args, &code))
          {
            bw_cli_args_clear (&args);
            return code;
          }
        code = commands[i]->run (&args);
        bw_cli_args_clear (&args);
        fflush (stdout);
        return bw_cli_output_failed () ? BW_CLI_EXIT_USAGE : code;
      }
  return bw_cli_usage_error (NULL, "unknown command '%s' (see basinwright-cli --help)", argv[1]);
}
