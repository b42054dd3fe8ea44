/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-application.h: the Basinwright application: process lifetime, app.* actions, preferences. */
#pragma once

#include <glib/gi18n.h>
#include <gtk/gtk.h>

#include "draw/bw-report.h"
#include "engine/bw-units.h"

G_BEGIN_DECLS

#define BW_TYPE_APPLICATION (bw_application_get_type ())
G_DECLARE_FINAL_TYPE (BwApplication, bw_application, BW, APPLICATION, GtkApplication)

#define BW_APPLICATION_ID "org.basinwright.Workbench"

/* The caution every window and the About dialog show: marked for translation, shown through
 * _(BW_CAUTION_TEXT). */
#define BW_CAUTION_TEXT                                                                          \
  N_ ("Preliminary design aid. Every result must be checked and verified by a licensed "         \
      "professional engineer before it is used for design or construction; local codes, the "    \
      "design standard in force and the approving authority govern.")

BwApplication *bw_application_new (void);

/* The unit system entries are shown in (app.unit-system: "si" or "us"). */
BwUnitSystem bw_application_get_unit_system (BwApplication *self);
void bw_application_set_unit_system (BwApplication *self, BwUnitSystem system);

/* The preferences (GSettings org.basinwright.Basinwright; NULL when its schema is not found,
 * and then the getters below keep the session's choice). */
GSettings *bw_application_get_settings (BwApplication *self);
/* The criteria set a new project starts with: the last one chosen in any window. */
char *bw_application_dup_last_criteria (BwApplication *self);
void bw_application_remember_criteria (BwApplication *self, const char *criteria);
/* The paper size of submittal reports. */
BwReportPaper bw_application_get_paper (BwApplication *self);
void bw_application_set_paper (BwApplication *self, BwReportPaper paper);

/* Where autosaves go: $XDG_STATE_HOME/basinwright/autosave, else the user cache dir. */
char *bw_application_dup_autosave_dir (void);

/* The demo project shipped with Basinwright (source tree or installed data). */
char *bw_application_dup_demo_path (void);

/* Without a GPU (no render node under /dev/dri), GTK's OpenGL renderer runs in software
 * (llvmpipe) and paints the window about ten times slower than its cairo renderer: then, and
 * only when the user has not chosen one (GSK_RENDERER), the workbench asks for cairo. Call
 * before GTK starts. Returns TRUE when it chose cairo. */
gboolean bw_application_choose_renderer (void);

G_END_DECLS
