/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-window-sketch.c: the drawing page: the selected unit's sketches and charts through the same
 * painters as the files, with zoom, pan and export. */
#include "config.h"

#include <cairo-pdf.h>
#include <cairo-svg.h>
#include <errno.h>
#include <glib/gi18n.h>
#include <glib/gstdio.h>
#include <gtk/gtk.h>
#include <math.h>
#include <pango/pangocairo.h>

#include "draw/bw-charts.h"
#include "draw/bw-chart.h"
#include "draw/bw-export.h"
#include "draw/bw-labels.h"
#include "draw/bw-sketch.h"
#include "draw/bw-style.h"
#include "gui/bw-window-private.h"

typedef enum
{
  VIEW_PLAN,
  VIEW_SECTION,
  VIEW_SCHEMATIC,
  VIEW_TAPER,
  VIEW_SETTLING,
  VIEW_REMOVAL,
  VIEW_ISO_REMOVAL,
  VIEW_POWER,
  VIEW_MATRIX,
  N_VIEWS
} ViewKind;

static const char *const view_labels[N_VIEWS + 1] = {
  N_("Plan"), N_("Section"), N_("Train schematic"), N_("Chart: G and Gt by stage"),
  N_("Chart: settling velocity"), N_("Chart: removal"), N_("Chart: iso-removal (column test)"),
  N_("Chart: impeller power"),
  N_("Chart: checks by load case"), NULL,
};

typedef struct
{
  GtkDropDown *view;
  double zoom;
  double pan_x, pan_y;
  double drag_x0, drag_y0;
} SketchState;

static SketchState *
state_of (BwWindow *self)
{
  return g_object_get_data (G_OBJECT (self->sketch_area), "bw-sketch-state");
}

/* The selected unit or stage (a stage's flocculator for whole-unit charts). */
static BwProcessUnit *
selected (BwWindow *self, BwProcessUnit **parent)
{
  BwProcessUnit *u = self->selected_id ? bw_project_find_unit (self->project, self->selected_id, NULL) : NULL;

  *parent = NULL;
  if (u && bw_process_type_is_stage (u->type))
    for (guint i = 0; i < self->project->trains->len && *parent == NULL; i++)
      {
        const BwTrain *t = g_ptr_array_index (self->project->trains, i);
        for (guint k = 0; k < t->units->len; k++)
          {
            BwProcessUnit *f = g_ptr_array_index (t->units, k);
            for (guint s = 0; s < f->stages->len; s++)
              if (g_ptr_array_index (f->stages, s) == u)
                *parent = f;
          }
      }
  return u;
}

/* Light or dark paper from the theme's text colour (GTK 4.8: the style context). */
static const BwStyle *
style_for (GtkWidget *w)
{
  GdkRGBA fg;

  G_GNUC_BEGIN_IGNORE_DEPRECATIONS
  gtk_style_context_get_color (gtk_widget_get_style_context (w), &fg);
  G_GNUC_END_IGNORE_DEPRECATIONS
  return 0.299 * fg.red + 0.587 * fg.green + 0.114 * fg.blue > 0.5 ? bw_style_dark () : bw_style_light ();
}

static BwChart *
build_chart (BwWindow *self, ViewKind view, BwProcessUnit *u, BwProcessUnit *parent, GError **error)
{
  const BwProcessUnit *whole = parent ? parent : u;

  if (self->results == NULL)
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_FAILED, "%s", _("The project does not evaluate."));
      return NULL;
    }
  switch (view)
    {
    case VIEW_TAPER:
      return bw_chart_floc_taper (self->project, self->results, self->checks, whole->id, self->units, error);
    case VIEW_SETTLING:
      return bw_chart_settling_curves (self->project, self->results, whole->id, 0, self->units, error);
    case VIEW_REMOVAL:
      return bw_chart_removal_curves (self->project, self->results, whole->id, self->units, error);
    case VIEW_ISO_REMOVAL:
      return bw_chart_iso_removal (self->project, self->results, whole->id, self->units, error);
    case VIEW_POWER:
      return bw_chart_impeller_power (self->project, self->results, self->checks, u->id, self->units, error);
    case VIEW_MATRIX:
      if (self->checks == NULL)
        {
          g_set_error (error, G_IO_ERROR, G_IO_ERROR_FAILED, "%s", _("No criteria set is chosen."));
          return NULL;
        }
      return bw_chart_check_matrix (self->project, self->results, self->checks, NULL, error);
    default:
      return NULL;
    }
}

/* Paints the current view on CR at WIDTH x HEIGHT (the page box); the error says why not. */
static gboolean
paint_view (BwWindow *self, cairo_t *cr, double width, double height, const BwStyle *style,
            GError **error)
{
  SketchState *st = state_of (self);
  const ViewKind view = (ViewKind) gtk_drop_down_get_selected (st->view);
  BwProcessUnit *parent = NULL, *u = selected (self, &parent);

  if (u == NULL)
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_FAILED, "%s", _("Select a unit in the list to draw it."));
      return FALSE;
    }
  if (view <= VIEW_SCHEMATIC)
    {
      const char *names[] = { "plan", "section", "schematic" };
      BwSketchView sv;
      if (!bw_sketch_view_from_name (names[view], &sv) || !bw_sketch_supports (u->type, sv))
        {
          g_set_error (error, G_IO_ERROR, G_IO_ERROR_FAILED,
                       _("There is no %s view of a %s."), _(view_labels[view]),
                       bw_label_process_type (u->type));
          return FALSE;
        }
      return bw_sketch_paint (self->project, u, sv, self->units, style, cr, width, height, error);
    }
  {
    g_autoptr (BwChart) chart = build_chart (self, view, u, parent, error);
    if (chart == NULL)
      return FALSE;
    bw_chart_paint (chart, style, cr, width, height);
    return TRUE;
  }
}

static void
sketch_draw (GtkDrawingArea *area, cairo_t *cr, int width, int height, gpointer data)
{
  BwWindow *self = data;
  SketchState *st = state_of (self);
  const BwStyle *style = style_for (GTK_WIDGET (area));
  g_autoptr (GError) error = NULL;
  const double w = MAX (BW_SKETCH_MIN_SIDE, width * st->zoom), h = MAX (BW_SKETCH_MIN_SIDE, height * st->zoom);

  cairo_save (cr);
  cairo_set_source_rgb (cr, style->paper.r, style->paper.g, style->paper.b);
  cairo_paint (cr);
  /* Zoom about the page's centre, then the pan. */
  cairo_translate (cr, (width - w) / 2 + st->pan_x, (height - h) / 2 + st->pan_y);
  if (!paint_view (self, cr, w, h, style, &error))
    {
      /* Say why there is nothing to draw, in the middle of the page. */
      PangoLayout *layout = gtk_widget_create_pango_layout (GTK_WIDGET (area),
                                                            error ? error->message : "");
      int tw, th;
      cairo_restore (cr);
      cairo_save (cr);
      pango_layout_set_width (layout, (int) (MAX (100, width - 40) * PANGO_SCALE));
      pango_layout_set_alignment (layout, PANGO_ALIGN_CENTER);
      pango_layout_get_pixel_size (layout, &tw, &th);
      cairo_set_source_rgb (cr, style->ink_muted.r, style->ink_muted.g, style->ink_muted.b);
      cairo_move_to (cr, 20, (height - th) / 2.0);
      pango_cairo_show_layout (cr, layout);
      g_object_unref (layout);
      cairo_restore (cr);
      return;
    }
  cairo_restore (cr);
}

static void
set_zoom (BwWindow *self, double zoom)
{
  SketchState *st = state_of (self);

  st->zoom = CLAMP (zoom, 0.25, 8.0); /* a view setting, not a design value */
  gtk_widget_queue_draw (GTK_WIDGET (self->sketch_area));
}

static void
zoom_in (GtkButton *b, gpointer data)
{
  (void) b;
  set_zoom (data, state_of (data)->zoom * 1.25);
}

static void
zoom_out (GtkButton *b, gpointer data)
{
  (void) b;
  set_zoom (data, state_of (data)->zoom / 1.25);
}

static void
zoom_fit (GtkButton *b, gpointer data)
{
  SketchState *st = state_of (data);

  (void) b;
  st->pan_x = st->pan_y = 0;
  set_zoom (data, 1.0);
}

static gboolean
on_scroll (GtkEventControllerScroll *c, double dx, double dy, gpointer data)
{
  (void) c;
  (void) dx;
  set_zoom (data, state_of (data)->zoom * (dy < 0 ? 1.1 : 1 / 1.1));
  return TRUE;
}

static void
drag_begin (GtkGestureDrag *g, double x, double y, gpointer data)
{
  SketchState *st = state_of (data);

  (void) g;
  (void) x;
  (void) y;
  st->drag_x0 = st->pan_x;
  st->drag_y0 = st->pan_y;
}

static void
drag_update (GtkGestureDrag *g, double dx, double dy, gpointer data)
{
  SketchState *st = state_of (data);

  (void) g;
  st->pan_x = st->drag_x0 + dx;
  st->pan_y = st->drag_y0 + dy;
  gtk_widget_queue_draw (GTK_WIDGET (((BwWindow *) data)->sketch_area));
}

GtkWidget *
_bw_window_sketch_view_dropdown (BwWindow *self)
{
  return GTK_WIDGET (state_of (self)->view);
}

/* The train schematic is a navigator too: a click on a unit's block selects that unit. */
gboolean
_bw_window_sketch_select_at (BwWindow *self, double x, double y)
{
  SketchState *st = state_of (self);
  GtkWidget *area = GTK_WIDGET (self->sketch_area);
  const double width = gtk_widget_get_width (area), height = gtk_widget_get_height (area);
  const double w = MAX (BW_SKETCH_MIN_SIDE, width * st->zoom), h = MAX (BW_SKETCH_MIN_SIDE, height * st->zoom);
  BwProcessUnit *parent = NULL, *u = selected (self, &parent);
  BwSketchGeometry g;
  BwTrain *train = NULL;
  int i;

  if (u == NULL || gtk_drop_down_get_selected (st->view) != VIEW_SCHEMATIC)
    return FALSE;
  if (!bw_sketch_layout (self->project, u, BW_SKETCH_SCHEMATIC, self->units, style_for (area), w, h, &g, NULL))
    return FALSE;
  bw_project_find_unit (self->project, u->id, &train);
  if (train == NULL)
    return FALSE;
  /* the same transform as sketch_draw: centred, then panned */
  i = bw_sketch_schematic_block_at (&g, train->units->len, x - ((width - w) / 2 + st->pan_x),
                                    y - ((height - h) / 2 + st->pan_y));
  if (i < 0)
    return FALSE;
  return bw_window_select_unit (self, ((BwProcessUnit *) g_ptr_array_index (train->units, i))->id);
}

static void
sketch_clicked (GtkGestureClick *click, int n_press, double x, double y, gpointer data)
{
  (void) click;
  if (n_press == 1)
    _bw_window_sketch_select_at (data, x, y);
}

static void
view_changed (GObject *o, GParamSpec *p, gpointer data)
{
  (void) o;
  (void) p;
  zoom_fit (NULL, data);
}

/* Export of the current view through the same painter, to the format the file name says. */
static void
export_response (GtkNativeDialog *dialog, int response, gpointer data)
{
  BwWindow *self = data;

  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr (GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      g_autofree char *path = g_file_get_path (file);
      g_autoptr (GError) error = NULL;
      const double w = 1600, h = 1000;
      cairo_surface_t *s = NULL;
      gboolean ok;
      g_autofree char *tmp = g_strconcat (path, ".part", NULL);

      if (g_str_has_suffix (path, ".pdf"))
        s = cairo_pdf_surface_create (tmp, w * 0.6, h * 0.6);
      else if (g_str_has_suffix (path, ".svg"))
        s = cairo_svg_surface_create (tmp, w, h);
      else
        s = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, (int) w, (int) h);
      {
        cairo_t *cr = cairo_create (s);
        const BwStyle *style = bw_style_light (); /* files are for paper */
        cairo_set_source_rgb (cr, style->paper.r, style->paper.g, style->paper.b);
        cairo_paint (cr);
        ok = paint_view (self, cr, g_str_has_suffix (path, ".pdf") ? w * 0.6 : w,
                         g_str_has_suffix (path, ".pdf") ? h * 0.6 : h, style, &error);
        cairo_destroy (cr);
      }
      if (ok && cairo_surface_get_type (s) == CAIRO_SURFACE_TYPE_IMAGE)
        ok = cairo_surface_write_to_png (s, tmp) == CAIRO_STATUS_SUCCESS;
      cairo_surface_finish (s);
      ok = ok && cairo_surface_status (s) == CAIRO_STATUS_SUCCESS;
      cairo_surface_destroy (s);
      if (ok && g_rename (tmp, path) == 0)
        {
          g_autofree char *msg = g_strdup_printf (_("Exported %s"), path);
          _bw_window_set_status (self, msg);
        }
      else
        {
          g_autofree char *msg = g_strdup_printf (_("%s: not exported (%s)"), path,
                                                  error ? error->message : g_strerror (errno));
          g_unlink (tmp);
          _bw_window_set_status (self, msg);
        }
    }
  g_object_unref (dialog);
}

static void
export_clicked (GtkButton *b, gpointer data)
{
  BwWindow *self = data;
  GtkFileChooserNative *d = gtk_file_chooser_native_new (_("Export the view"), GTK_WINDOW (self),
                                                         GTK_FILE_CHOOSER_ACTION_SAVE, _("_Export"),
                                                         _("_Cancel"));
  (void) b;
  gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (d), "view.png");
  g_signal_connect (d, "response", G_CALLBACK (export_response), self);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (d));
}

static GtkWidget *
tool_button (const char *icon, const char *tip, GCallback cb, BwWindow *self)
{
  GtkWidget *b = gtk_button_new_from_icon_name (icon);

  gtk_widget_set_tooltip_text (b, tip);
  gtk_accessible_update_property (GTK_ACCESSIBLE (b), GTK_ACCESSIBLE_PROPERTY_LABEL, tip, -1);
  g_signal_connect (b, "clicked", cb, self);
  return b;
}

void
_bw_window_sketch_init (BwWindow *self)
{
  SketchState *st = g_new0 (SketchState, 1);
  GtkWidget *area = GTK_WIDGET (self->sketch_area);
  GtkWidget *overlay = gtk_widget_get_parent (area);
  GtkWidget *page = gtk_box_new (GTK_ORIENTATION_VERTICAL, 6);
  GtkWidget *bar = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 6);
  GtkStringList *views = gtk_string_list_new (NULL);
  GtkEventController *scroll;
  GtkGesture *drag;

  st->zoom = 1.0;
  g_object_set_data_full (G_OBJECT (area), "bw-sketch-state", st, g_free);
  for (int i = 0; i < N_VIEWS; i++)
    gtk_string_list_append (views, _(view_labels[i]));
  st->view = GTK_DROP_DOWN (gtk_drop_down_new (G_LIST_MODEL (views), NULL));
  gtk_accessible_update_property (GTK_ACCESSIBLE (st->view), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("View to draw"), -1);
  g_signal_connect (st->view, "notify::selected", G_CALLBACK (view_changed), self);
  gtk_box_append (GTK_BOX (bar), GTK_WIDGET (st->view));
  gtk_box_append (GTK_BOX (bar), tool_button ("zoom-out-symbolic", _("Zoom out"), G_CALLBACK (zoom_out), self));
  gtk_box_append (GTK_BOX (bar), tool_button ("zoom-fit-best-symbolic", _("Fit the page"), G_CALLBACK (zoom_fit), self));
  gtk_box_append (GTK_BOX (bar), tool_button ("zoom-in-symbolic", _("Zoom in"), G_CALLBACK (zoom_in), self));
  gtk_box_append (GTK_BOX (bar), tool_button ("document-save-as-symbolic",
                                              _("Export the view as PNG, SVG or PDF (by the file name)"),
                                              G_CALLBACK (export_clicked), self));

  /* The page from the template was an overlay with a placeholder note: reuse the overlay for
   * messages ("select a unit", "no such view") over the drawing. */
  {
    GtkWidget *child = gtk_widget_get_first_child (overlay);
    while (child)
      {
        GtkWidget *next = gtk_widget_get_next_sibling (child);
        if (child != area)
          gtk_overlay_remove_overlay (GTK_OVERLAY (overlay), child);
        child = next;
      }
  }
  g_object_ref (overlay);
  {
    GtkWidget *holder = gtk_widget_get_parent (overlay);
    GtkStackPage *sp = GTK_IS_STACK (holder) ? gtk_stack_get_page (GTK_STACK (holder), overlay) : NULL;
    const char *name = sp ? gtk_stack_page_get_name (sp) : NULL;
    const char *title = sp ? gtk_stack_page_get_title (sp) : NULL;
    g_autofree char *n = g_strdup (name);
    g_autofree char *t = g_strdup (title);
    if (sp)
      {
        gtk_stack_remove (GTK_STACK (holder), overlay);
        gtk_box_append (GTK_BOX (page), bar);
        gtk_box_append (GTK_BOX (page), overlay);
        gtk_widget_set_vexpand (overlay, TRUE);
        gtk_stack_add_titled (GTK_STACK (holder), page, n, t);
      }
  }
  g_object_unref (overlay);

  scroll = gtk_event_controller_scroll_new (GTK_EVENT_CONTROLLER_SCROLL_VERTICAL);
  g_signal_connect (scroll, "scroll", G_CALLBACK (on_scroll), self);
  gtk_widget_add_controller (area, scroll);
  drag = gtk_gesture_drag_new ();
  g_signal_connect (drag, "drag-begin", G_CALLBACK (drag_begin), self);
  g_signal_connect (drag, "drag-update", G_CALLBACK (drag_update), self);
  gtk_widget_add_controller (area, GTK_EVENT_CONTROLLER (drag));
  {
    GtkGesture *click = gtk_gesture_click_new ();
    g_signal_connect (click, "released", G_CALLBACK (sketch_clicked), self);
    gtk_widget_add_controller (area, GTK_EVENT_CONTROLLER (click));
  }
  gtk_drawing_area_set_draw_func (self->sketch_area, sketch_draw, self, NULL);
}
