/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-wheel.h: the mouse wheel over a table that scrolls sideways moves the page it sits on. */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

/* Vertical wheel and touchpad scrolling over SIDEWAYS (a scrolled window that scrolls only
 * across) moves PAGE (a scrolled window it sits in) up and down. Shift+wheel and horizontal
 * scrolling stay with SIDEWAYS. PAGE must outlive SIDEWAYS (it is an ancestor of it). */
void bw_wheel_forward_vertical (GtkScrolledWindow *sideways, GtkScrolledWindow *page);

G_END_DECLS
