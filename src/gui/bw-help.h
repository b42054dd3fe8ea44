/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-help.h: the in-app manual: docs/manual.md read from local files and shown at a topic. */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

/* Where the manual is read from: $BASINWRIGHT_DOCDIR/manual.md, else the source tree's docs/
 * (an uninstalled build), else the installed copy (datadir/doc/basinwright). NULL with ERROR
 * naming the places tried when none is readable. */
char *bw_help_find_manual (GError **error);

/* The manual heading a page of the window is explained under: "unit" -> "unit page", ...: the
 * first heading of the manual that contains the words (case ignored); alternatives are
 * separated by '|', best first. NULL when the page has no topic (the manual opens at the top). */
const char *bw_help_topic_for_page (const char *page_name);

/* Opens (or raises) the help window of PARENT at the heading matching TOPIC (NULL: the top).
 * A manual that cannot be found is reported in the help window itself, with the places tried. */
GtkWindow *bw_help_show (GtkWindow *parent, const char *topic);

/* For tests: the heading the help window is showing, or NULL. */
const char *bw_help_get_current_heading (GtkWindow *help);

G_END_DECLS
