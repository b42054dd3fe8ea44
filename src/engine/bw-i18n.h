/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-i18n.h: translation of the engine's and io's messages, with GLib alone (no GTK, no
 * gi18n.h's textdomain set-up): the program that shows them binds the domain. The CLI keeps
 * LC_MESSAGES at "C", so its output stays the English of shared/CLI-CONTRACT.md. */
#pragma once

#include <glib.h>

#ifndef GETTEXT_PACKAGE
#error "include config.h first: the messages are looked up in GETTEXT_PACKAGE"
#endif

/* A message, translated when the process's locale asks for it. */
#define BW_(s) g_dgettext (GETTEXT_PACKAGE, s)
/* Marks a message for xgettext that is translated later, with BW_ on the variable. */
#define BW_N_(s) (s)
