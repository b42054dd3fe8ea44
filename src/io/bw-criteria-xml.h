/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-criteria-xml.h: reading criteria-set files and finding the shipped and user sets. */
#pragma once

#include <glib.h>

#include "engine/bw-criteria.h"

G_BEGIN_DECLS

#define BW_CRITERIA_NS "urn:x-basinwright:criteria:1"
#define BW_CRITERIA_FORMAT_VERSION 1

/* Reads and validates a criteria-set file. Limits may be written in any unit of the quantity's
 * kind (unit attribute); they are held in SI. */
BwCriteriaSet *bw_criteria_set_load (const char *path, GError **error);

/* The folders searched for sets, in order: $BW_CRITERIA_PATH (colon-separated), the user's
 * ($XDG_DATA_HOME/basinwright/criteria), then the shipped data/criteria. */
GPtrArray *bw_criteria_search_dirs (void);

/* Every readable set in the search folders (a set id found twice: the first wins, the later one
 * is listed in SKIPPED as "path: reason"). Unreadable files are listed in SKIPPED too. */
GPtrArray *bw_criteria_find_all (GPtrArray **skipped);

/* A set by id (searched as above) or by file path (when NAME_OR_PATH names a file). */
BwCriteriaSet *bw_criteria_set_open (const char *name_or_path, GError **error);

G_END_DECLS
