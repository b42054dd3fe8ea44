/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-xml.h: safe XML loading, RELAX NG validation, atomic writes and data-file lookup. */
#pragma once

#include <glib.h>
#include <libxml/tree.h>

G_BEGIN_DECLS

#define BW_IO_ERROR (bw_io_error_quark ())

typedef enum
{
  BW_IO_ERROR_READ,      /* the file cannot be read */
  BW_IO_ERROR_TOO_LARGE, /* over the size limit */
  BW_IO_ERROR_UNSAFE,    /* a DTD, entity declaration or external reference */
  BW_IO_ERROR_MALFORMED, /* not well-formed XML, or not valid UTF-8 */
  BW_IO_ERROR_INVALID,   /* well-formed, but against the schema or the model's rules */
  BW_IO_ERROR_VERSION,   /* written by a newer format version */
  BW_IO_ERROR_WRITE,     /* the file cannot be written; the old file is untouched */
} BwIoError;

GQuark bw_io_error_quark (void);

/* Largest XML file read, bytes. A 50-train plant is well under 1 MiB. */
#define BW_XML_MAX_BYTES (16 * 1024 * 1024)

/* Reads PATH and parses it without network access, DTDs or entity declarations (refused before
 * parsing), libxml2's own messages suppressed. Errors name PATH and the line. */
xmlDoc *bw_xml_read_file (const char *path, GError **error);
/* The same for a buffer; NAME stands for the file in messages. */
xmlDoc *bw_xml_read_memory (const char *data, gsize len, const char *name, GError **error);

/* Validates DOC against the RELAX NG schema at SCHEMA_PATH; the first problem, with its line,
 * becomes the error. NAME stands for the document in messages. */
gboolean bw_xml_validate (xmlDoc *doc, const char *schema_path, const char *name, GError **error);

/* TRUE when the running program is the one in the build tree it was compiled in (a developer's
 * run or a test), FALSE for an installed copy: only then do the source tree's data/ and docs/
 * stand in for the installed ones, so an install never reads the checkout it was built from. */
gboolean bw_running_uninstalled (void);

/* Finds a shipped data file (e.g. "basinwright-project.rng" or "criteria"): $BW_DATADIR, then,
 * for a program run from its build tree, the source tree's data/, then the installed data
 * directory. Returns NULL when none exists. */
char *bw_data_find (const char *relative);

/* Writes DATA to PATH atomically: a temporary file in the same folder, fsync, rename, fsync of
 * the folder. On any failure the old file is untouched and the temporary file removed. */
gboolean bw_write_atomic (const char *path, const char *data, gsize len, GError **error);

/* Helpers for readers: an attribute's value (NULL if absent), the element's line. */
char *bw_xml_prop (xmlNode *node, const char *name);
long bw_xml_line (xmlNode *node);
gboolean bw_xml_is (xmlNode *node, const char *ns, const char *name);

G_END_DECLS
