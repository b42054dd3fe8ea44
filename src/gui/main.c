/* SPDX-License-Identifier: GPL-3.0-or-later */
/* main.c: starts the Basinwright workbench. */
#include "config.h"

#include "gui/bw-application.h"
#include "gui/bw-locale.h"

int
main (int argc, char *argv[])
{
  g_autoptr (BwApplication) app = NULL;

  /* Before any widget: the locale from the environment and our translations. */
  bw_locale_init ();
  bw_application_choose_renderer ();
  app = bw_application_new ();
  g_set_application_name ("Basinwright");
  return g_application_run (G_APPLICATION (app), argc, argv);
}
