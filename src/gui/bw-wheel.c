/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-wheel.c: see bw-wheel.h. GTK 4.8's scrolled window takes vertical wheel events even when
 * it has no vertical scrolling of its own, so a wide table inside a page would stop the page's
 * wheel scrolling wherever the pointer is over the table. */
#include "config.h"

#include "gui/bw-wheel.h"

#include <math.h>

static gboolean
forward_scroll (GtkEventControllerScroll *c, double dx, double dy, gpointer data)
{
  GtkScrolledWindow *page = data;
  GtkAdjustment *adj = gtk_scrolled_window_get_vadjustment (page);
  GdkModifierType mods = gtk_event_controller_get_current_event_state (GTK_EVENT_CONTROLLER (c));
  double size, step, lo, hi, v;

  (void) dx;
  if ((mods & GDK_SHIFT_MASK) || dy == 0.0)
    return FALSE;
  size = gtk_adjustment_get_page_size (adj);
  /* GTK's own wheel step for a page of this height (size^(2/3)), for discrete wheel clicks;
   * a touchpad's smooth deltas are in pixels already. */
  step = gtk_event_controller_scroll_get_unit (c) == GDK_SCROLL_UNIT_WHEEL ? pow (size, 2.0 / 3.0)
                                                                           : 1.0;
  lo = gtk_adjustment_get_lower (adj);
  hi = gtk_adjustment_get_upper (adj) - size;
  v = gtk_adjustment_get_value (adj) + dy * step;
  gtk_adjustment_set_value (adj, CLAMP (v, lo, MAX (lo, hi)));
  return TRUE;
}

void
bw_wheel_forward_vertical (GtkScrolledWindow *sideways, GtkScrolledWindow *page)
{
  GtkEventController *wheel;

  g_return_if_fail (GTK_IS_SCROLLED_WINDOW (sideways));
  g_return_if_fail (GTK_IS_SCROLLED_WINDOW (page));
  wheel = gtk_event_controller_scroll_new (GTK_EVENT_CONTROLLER_SCROLL_VERTICAL);
  /* Capture phase: before the sideways window's own controller takes the event. */
  gtk_event_controller_set_propagation_phase (wheel, GTK_PHASE_CAPTURE);
  g_signal_connect (wheel, "scroll", G_CALLBACK (forward_scroll), page);
  gtk_widget_add_controller (GTK_WIDGET (sideways), wheel);
}
