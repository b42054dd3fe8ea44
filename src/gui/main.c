/* SPDX-License-Identifier: GPL-3.0-or-later */
/* main.c: starts the Basinwright workbench. */
#include "config.h"

#include "gui/bw-application.h"

int
main (int argc, char *argv[])
{
  g_autoptr (BwApplication) app = bw_application_new ();

  g_set_application_name ("Basinwright");
  return g_application_run (G_APPLICATION (app), argc, argv);
}
