/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-level-cell.h: a table cell whose height does not depend on the width it is offered. */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

#define BW_TYPE_LEVEL_CELL (bw_level_cell_get_type ())
G_DECLARE_FINAL_TYPE (BwLevelCell, bw_level_cell, BW, LEVEL_CELL, GtkWidget)

/* Holds CHILD, measured at its own natural width whatever width is offered, and never given
 * less than that width. Two grids whose
 * rows share a vertical GtkSizeGroup of such cells keep their rows level: a size group asks
 * every member for its height at one grid's column width, so a wrapping label in the other
 * grid would otherwise answer for a width it never gets. */
GtkWidget *bw_level_cell_new (GtkWidget *child);
GtkWidget *bw_level_cell_get_child (BwLevelCell *self);

G_END_DECLS
