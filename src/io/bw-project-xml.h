/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-project-xml.h: reading and writing .bwproj project files. */
#pragma once

#include <glib.h>

#include "engine/bw-project.h"

G_BEGIN_DECLS

#define BW_PROJECT_NS "urn:x-basinwright:project:1"
#define BW_PROJECT_FORMAT_VERSION 1

/* Reads, validates against data/basinwright-project.rng, and checks the model. Errors name the
 * file and, where there is one, the line. Elements of other namespaces are kept. */
BwProject *bw_project_load (const char *path, GError **error);
BwProject *bw_project_load_memory (const char *data, gsize len, const char *name, GError **error);

/* The project as XML text (format 1, SI values with their units, every double exact). */
char *bw_project_to_xml (const BwProject *p);

/* Validates P and writes it atomically; on failure the old file is untouched. */
gboolean bw_project_save (const BwProject *p, const char *path, GError **error);

G_END_DECLS
