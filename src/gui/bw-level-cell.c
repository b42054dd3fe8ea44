/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-level-cell.c: see bw-level-cell.h. */
#include "config.h"

#include "gui/bw-level-cell.h"

struct _BwLevelCell
{
  GtkWidget parent_instance;
  GtkWidget *child;
};

G_DEFINE_FINAL_TYPE (BwLevelCell, bw_level_cell, GTK_TYPE_WIDGET)

static GtkSizeRequestMode
level_request_mode (GtkWidget *widget)
{
  (void) widget;
  return GTK_SIZE_REQUEST_CONSTANT_SIZE;
}

static void
level_measure (GtkWidget *widget, GtkOrientation orientation, int for_size, int *minimum,
               int *natural, int *minimum_baseline, int *natural_baseline)
{
  BwLevelCell *self = BW_LEVEL_CELL (widget);
  int wmin = 0, wnat = 0;

  (void) for_size;
  *minimum = *natural = 0;
  *minimum_baseline = *natural_baseline = -1;
  if (self->child == NULL || !gtk_widget_get_visible (self->child))
    return;
  gtk_widget_measure (self->child, GTK_ORIENTATION_HORIZONTAL, -1, &wmin, &wnat, NULL, NULL);
  (void) wmin;
  /* Never narrower than the child's natural width: squeezed (a scrolled window gives its child
   * only its minimum width), a wrapping label would take more lines than the height reported. */
  if (orientation == GTK_ORIENTATION_HORIZONTAL)
    *minimum = *natural = wnat;
  else
    gtk_widget_measure (self->child, GTK_ORIENTATION_VERTICAL, wnat, minimum, natural, NULL, NULL);
}

static void
level_size_allocate (GtkWidget *widget, int width, int height, int baseline)
{
  BwLevelCell *self = BW_LEVEL_CELL (widget);

  (void) baseline;
  if (self->child && gtk_widget_get_visible (self->child))
    gtk_widget_allocate (self->child, width, height, -1, NULL);
}

static void
level_dispose (GObject *object)
{
  BwLevelCell *self = BW_LEVEL_CELL (object);

  g_clear_pointer (&self->child, gtk_widget_unparent);
  G_OBJECT_CLASS (bw_level_cell_parent_class)->dispose (object);
}

static void
bw_level_cell_class_init (BwLevelCellClass *klass)
{
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  G_OBJECT_CLASS (klass)->dispose = level_dispose;
  widget_class->get_request_mode = level_request_mode;
  widget_class->measure = level_measure;
  widget_class->size_allocate = level_size_allocate;
}

static void
bw_level_cell_init (BwLevelCell *self)
{
  (void) self;
}

GtkWidget *
bw_level_cell_new (GtkWidget *child)
{
  BwLevelCell *self = g_object_new (BW_TYPE_LEVEL_CELL, NULL);

  g_return_val_if_fail (GTK_IS_WIDGET (child), GTK_WIDGET (self));
  self->child = child;
  gtk_widget_set_parent (child, GTK_WIDGET (self));
  return GTK_WIDGET (self);
}

GtkWidget *
bw_level_cell_get_child (BwLevelCell *self)
{
  g_return_val_if_fail (BW_IS_LEVEL_CELL (self), NULL);
  return self->child;
}
