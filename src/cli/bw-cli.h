/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-cli.h: option parsing, output (readable tables and JSON) and exit codes of basinwright-cli. */
#pragma once

#include <glib.h>

#include "engine/bw-units.h"

G_BEGIN_DECLS

enum
{
  BW_CLI_EXIT_OK = 0,
  BW_CLI_EXIT_CHECK_FAILED = 1, /* check/review found a failing required criterion */
  BW_CLI_EXIT_USAGE = 2,        /* usage or input error */
};

typedef enum
{
  BW_OPT_QUANTITY, /* a number with an optional unit suffix, parsed into SI */
  BW_OPT_NUMBER,   /* a plain finite number */
  BW_OPT_INT,      /* a whole number */
  BW_OPT_CHOICE,   /* one word out of CHOICES ('|'-separated) */
  BW_OPT_STRING,   /* free text (a path, a name) */
  BW_OPT_FLAG,     /* takes no value: given or not */
} BwOptType;

typedef struct
{
  const char *name;      /* long option without dashes: "temp" */
  BwOptType type;
  BwQuantityKind kind;   /* for BW_OPT_QUANTITY */
  const char *bare_unit; /* unit of a bare number, for BW_OPT_QUANTITY; NULL = SI */
  const char *choices;   /* for BW_OPT_CHOICE */
  gboolean required;
  const char *metavar;   /* "T" */
  const char *help;      /* one line */
  const char *field;     /* the engine's name for it in error messages ("temperature"), or NULL */
} BwOptSpec;

typedef struct
{
  gboolean given;
  double value;   /* SI value (quantity), number or int */
  char *text;     /* the text as typed; choices and strings */
} BwOptValue;

typedef struct _BwCliArgs BwCliArgs;

/* Common options of every subcommand: --json, --units si|us, --help. */
struct _BwCliArgs
{
  const char *command;       /* "settle" */
  const BwOptSpec *specs;
  guint n_specs;
  BwOptValue *values;        /* one per spec */
  char **positional;         /* NULL-terminated */
  gboolean json;
  BwUnitSystem units;
};

typedef struct
{
  const char *name;
  const char *summary;
  const char *usage_tail; /* positional arguments, e.g. "PROJECT"; NULL for none */
  guint min_positional, max_positional;
  const BwOptSpec *specs;
  guint n_specs;
  int (*run) (BwCliArgs *args);
  const char *notes; /* extra help paragraph, or NULL */
} BwCliCommand;

/* Parses ARGV (argv[0] is the subcommand name). On --help prints help and returns FALSE with
 * *EXIT_CODE 0; on a usage or input error prints one line to stderr and returns FALSE with
 * *EXIT_CODE 2. */
gboolean bw_cli_parse (const BwCliCommand *cmd, int argc, char **argv, BwCliArgs *out,
                       int *exit_code);
void bw_cli_args_clear (BwCliArgs *args);

const BwOptValue *bw_cli_get (const BwCliArgs *args, const char *name);
double bw_cli_get_double (const BwCliArgs *args, const char *name, double fallback);

/* Reports ERROR (an engine or io error) as one stderr line, naming the option when the message
 * starts with an option's engine field name. Returns BW_CLI_EXIT_USAGE. */
int bw_cli_fail (const BwCliArgs *args, const GError *error);
/* Prints "basinwright-cli COMMAND: MESSAGE" to stderr; returns BW_CLI_EXIT_USAGE. */
int bw_cli_usage_error (const char *command, const char *format, ...) G_GNUC_PRINTF (2, 3);

/* JSON output: an object written key by key, numbers always finite. */
typedef struct _BwJson BwJson;
BwJson *bw_json_new (void);
void bw_json_number (BwJson *j, const char *key, double value);
void bw_json_int (BwJson *j, const char *key, gint64 value);
void bw_json_string (BwJson *j, const char *key, const char *value);
void bw_json_bool (BwJson *j, const char *key, gboolean value);
void bw_json_begin_object (BwJson *j, const char *key); /* key NULL inside an array */
void bw_json_end_object (BwJson *j);
void bw_json_begin_array (BwJson *j, const char *key);
void bw_json_end_array (BwJson *j);
void bw_json_array_number (BwJson *j, double value);
/* Prints the document and a newline on stdout and frees J. */
void bw_json_print_free (BwJson *j);

/* Readable output: a two-column table of quantity and value. */
typedef struct _BwTable BwTable;
BwTable *bw_table_new (const char *title);
void bw_table_quantity (BwTable *t, const char *label, double value_si, BwQuantityKind kind,
                        BwUnitSystem system);
void bw_table_text (BwTable *t, const char *label, const char *text);
void bw_table_number (BwTable *t, const char *label, double value, int sig);
void bw_table_print_free (BwTable *t);

/* For commands that take "PROJECT -o FILE": the option parser hands "-o FILE" over as positional
 * words; this picks out the project and the output (from -o or the command's --output option,
 * which it must have). OUTPUT is NULL when neither is given. On a usage error it prints one line
 * and returns FALSE. */
gboolean bw_cli_project_and_output (const BwCliArgs *args, const char **project, const char **output);

/* TRUE once a run tried to print a value that is not finite; the output was withheld and main
 * exits with BW_CLI_EXIT_USAGE. */
gboolean bw_cli_output_failed (void);

/* TEXT padded with spaces to WIDTH characters (not bytes: "m³" is two characters). */
char *bw_cli_pad (const char *text, int width);

/* Every subcommand, for the dispatcher and the help text. */
extern const BwCliCommand bw_cli_cmd_water;
extern const BwCliCommand bw_cli_cmd_settle;
extern const BwCliCommand bw_cli_cmd_gvalue;
extern const BwCliCommand bw_cli_cmd_impeller;
extern const BwCliCommand bw_cli_cmd_paddle;
extern const BwCliCommand bw_cli_cmd_baffled;
extern const BwCliCommand bw_cli_cmd_flocmodel;
extern const BwCliCommand bw_cli_cmd_basin;
extern const BwCliCommand bw_cli_cmd_scour;
extern const BwCliCommand bw_cli_cmd_plates;
extern const BwCliCommand bw_cli_cmd_removal;
extern const BwCliCommand bw_cli_cmd_compute;
extern const BwCliCommand bw_cli_cmd_check;
extern const BwCliCommand bw_cli_cmd_criteria;
extern const BwCliCommand bw_cli_cmd_coagulant;
extern const BwCliCommand bw_cli_cmd_zeta;
extern const BwCliCommand bw_cli_cmd_jartest;
extern const BwCliCommand bw_cli_cmd_export;
extern const BwCliCommand bw_cli_cmd_review;
extern const BwCliCommand bw_cli_cmd_diff;
extern const BwCliCommand bw_cli_cmd_autosize;
extern const BwCliCommand bw_cli_cmd_render;
extern const BwCliCommand bw_cli_cmd_report;

G_END_DECLS
