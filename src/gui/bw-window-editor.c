/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-window-editor.c: the unit editor (generated from the parameter tables) and the design-basis
 * page. Every widget shows the model; typed values become edits; refused ones are flagged. */
#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "engine/bw-edit.h"
#include "draw/bw-labels.h"
#include "engine/bw-error.h"
#include "gui/bw-locale.h"
#include "gui/bw-window-private.h"

static const char *const raw_ids[] = { "raw:turbidity", "raw:alkalinity", "raw:ph" };
static const char *const raw_labels[] = { N_("turbidity"), N_("alkalinity (as CaCO₃)"), N_("pH") };
static const BwQuantityKind raw_kinds[] = { BW_KIND_TURBIDITY, BW_KIND_CONCENTRATION, BW_KIND_NUMBER };

void
_bw_field_free (BwField *f)
{
  if (f == NULL)
    return;
  if (f->widget)
    {
      g_autoptr (GListModel) controllers = gtk_widget_observe_controllers (f->widget);
      g_signal_handlers_disconnect_by_data (f->widget, f);
      for (guint i = 0; i < g_list_model_get_n_items (controllers); i++)
        {
          g_autoptr (GObject) c = g_list_model_get_item (controllers, i);
          g_signal_handlers_disconnect_by_data (c, f);
        }
      g_object_remove_weak_pointer (G_OBJECT (f->widget), (gpointer *) &f->widget);
    }
  if (f->error_label)
    g_object_remove_weak_pointer (G_OBJECT (f->error_label), (gpointer *) &f->error_label);
  g_free (f->id);
  g_free (f->unit_id);
  g_free (f);
}

BwField *
_bw_window_find_field (BwWindow *self, const char *id)
{
  GPtrArray *lists[] = { self->fields, self->basis_fields };

  for (guint k = 0; k < G_N_ELEMENTS (lists); k++)
    for (guint i = 0; i < lists[k]->len; i++)
      {
        BwField *f = g_ptr_array_index (lists[k], i);
        if (g_strcmp0 (f->id, id) == 0)
          return f;
      }
  return NULL;
}

GtkWidget *
bw_window_get_field_widget (BwWindow *self, const char *field_id)
{
  BwField *f;

  g_return_val_if_fail (BW_IS_WINDOW (self), NULL);
  if (g_strcmp0 (field_id, "parallel") == 0)
    return GTK_WIDGET (self->parallel_spin);
  if (g_strcmp0 (field_id, "standby") == 0)
    return GTK_WIDGET (self->standby_spin);
  if (g_strcmp0 (field_id, "sketch-area") == 0)
    return GTK_WIDGET (self->sketch_area);
  if (g_strcmp0 (field_id, "sketch-view") == 0)
    return _bw_window_sketch_view_dropdown (self);
  if (g_strcmp0 (field_id, "every-case") == 0)
    return GTK_WIDGET (self->every_case_toggle);
  if (g_strcmp0 (field_id, "criteria") == 0)
    return GTK_WIDGET (self->criteria_dropdown);
  if (g_str_has_prefix (field_id, "case:"))
    {
      guint64 n;
      guint i = 0;
      if (!g_ascii_string_to_unsigned (field_id + 5, 10, 0, G_MAXUINT, &n, NULL))
        return NULL;
      for (GtkWidget *row = gtk_widget_get_first_child (GTK_WIDGET (self->cases_list)); row;
           row = gtk_widget_get_next_sibling (row), i++)
        if (i == n)
          return gtk_list_box_row_get_child (GTK_LIST_BOX_ROW (row));
      return NULL;
    }
  f = _bw_window_find_field (self, field_id);
  return f ? f->widget : NULL;
}

GtkWidget *
bw_window_get_field_error (BwWindow *self, const char *field_id)
{
  BwField *f;

  g_return_val_if_fail (BW_IS_WINDOW (self), NULL);
  f = _bw_window_find_field (self, field_id);
  return f ? f->error_label : NULL;
}

/* --- one field: the model's value as text, and text back into an edit --- */

static BwProcessUnit *
field_unit (BwField *f)
{
  return f->unit_id ? bw_project_find_unit (f->window->project, f->unit_id, NULL) : NULL;
}

static const BwParamSpec *
field_spec (BwField *f)
{
  BwProcessUnit *u = field_unit (f);
  return u ? &bw_params_of (u->type, NULL)[f->param_index] : NULL;
}

static char *
format_quantity (BwField *f, double v)
{
  return bw_locale_format (v, f->qkind, f->window->units);
}

/* The text an entry shows for the model as it is. */
static char *
field_text (BwField *f)
{
  const BwProject *p = f->window->project;
  BwProcessUnit *u;

  switch (f->kind)
    {
    case BW_FIELD_PARAM:
      u = field_unit (f);
      if (u == NULL)
        return g_strdup ("");
      if (f->optional && u->values[f->param_index] == 0.0)
        return g_strdup ("");
      return format_quantity (f, u->values[f->param_index]);
    case BW_FIELD_UNIT_NAME:
      u = field_unit (f);
      return g_strdup (u && u->name ? u->name : "");
    case BW_FIELD_PROJECT_NAME:
      return g_strdup (p->name ? p->name : "");
    case BW_FIELD_FLOW:
      if (!((p->basis.flows_given >> f->sub) & 1))
        return g_strdup ("");
      return format_quantity (f, p->basis.flow_m3_s[f->sub]);
    case BW_FIELD_TEMPERATURE:
      return format_quantity (f, p->basis.temperature_K[f->sub]);
    case BW_FIELD_RAW_WATER:
      return format_quantity (f, f->sub == BW_RAW_TURBIDITY    ? p->basis.turbidity_NTU
                                 : f->sub == BW_RAW_ALKALINITY ? p->basis.alkalinity_kg_m3
                                                               : p->basis.ph);
    default:
      g_assert_not_reached ();
      return NULL;
    }
}

static const char *
field_label (BwField *f)
{
  const BwParamSpec *spec;

  switch (f->kind)
    {
    case BW_FIELD_PARAM:
      spec = field_spec (f);
      return spec ? bw_label_text (spec->label) : f->id;
    case BW_FIELD_FLOW:
      return bw_label_flow_kind ((BwFlowKind) f->sub);
    case BW_FIELD_TEMPERATURE:
      return bw_label_temp_kind ((BwTempKind) f->sub);
    case BW_FIELD_RAW_WATER:
      return _(raw_labels[f->sub]);
    default:
      return _("name");
    }
}

/* Parses TEXT for a quantity field. Empty text is "not given" where that is allowed. */
static gboolean
parse_quantity (BwField *f, const char *text, double *out, gboolean *given, GError **error)
{
  const BwUnit *du = bw_units_display_unit (f->qkind, f->window->units);
  g_autofree char *field = NULL;
  g_autofree char *stripped = g_strstrip (g_strdup (text));

  *given = TRUE;
  if (stripped[0] == '\0')
    {
      if (f->optional)
        {
          *given = FALSE;
          *out = 0.0;
          return TRUE;
        }
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, _("%s: a value is needed"),
                   field_label (f));
      return FALSE;
    }
  field = g_strdup (field_label (f));
  {
    /* The locale's decimal comma ("1,5 m") becomes the engine's point first. */
    g_autofree char *c_text = bw_locale_delocalize_number (stripped);
    return bw_units_parse (c_text, f->qkind, du ? du->ascii : NULL, field, out, error);
  }
}

static BwEdit *
field_make_edit (BwField *f, const char *text, GError **error)
{
  double v = 0.0;
  gboolean given = TRUE;

  switch (f->kind)
    {
    case BW_FIELD_UNIT_NAME:
      {
        g_autofree char *name = g_strstrip (g_strdup (text));
        if (name[0] == '\0')
          {
            g_set_error_literal (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, _("name: a unit needs a name"));
            return NULL;
          }
        return bw_edit_rename_unit (f->unit_id, name);
      }
    case BW_FIELD_PROJECT_NAME:
      {
        g_autofree char *name = g_strstrip (g_strdup (text));
        if (name[0] == '\0')
          {
            g_set_error_literal (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                                 _("project name: it cannot be empty"));
            return NULL;
          }
        return bw_edit_set_project_name (name);
      }
    default:
      break;
    }
  if (!parse_quantity (f, text, &v, &given, error))
    return NULL;
  switch (f->kind)
    {
    case BW_FIELD_PARAM:
      {
        const BwParamSpec *spec = field_spec (f);
        return spec ? bw_edit_set_param (f->unit_id, spec->id, v) : NULL;
      }
    case BW_FIELD_FLOW:
      return bw_edit_set_flow ((BwFlowKind) f->sub, given, v);
    case BW_FIELD_TEMPERATURE:
      return bw_edit_set_temperature ((BwTempKind) f->sub, v);
    case BW_FIELD_RAW_WATER:
      return bw_edit_set_raw_water ((BwRawWaterField) f->sub, v);
    default:
      g_assert_not_reached ();
      return NULL;
    }
}

static void
field_flag (BwField *f, const char *message)
{
  f->flagged = TRUE;
  if (f->widget)
    {
      gtk_widget_add_css_class (f->widget, "error");
      gtk_widget_set_tooltip_text (f->widget, message);
      gtk_accessible_update_state (GTK_ACCESSIBLE (f->widget), GTK_ACCESSIBLE_STATE_INVALID,
                                   GTK_ACCESSIBLE_INVALID_TRUE, -1);
      gtk_accessible_update_property (GTK_ACCESSIBLE (f->widget), GTK_ACCESSIBLE_PROPERTY_DESCRIPTION,
                                      message, -1);
    }
  if (f->error_label)
    {
      /* Under the reason, what the results on screen are for: the model keeps its last value. */
      g_autofree char *kept = GTK_IS_ENTRY (f->widget) ? field_text (f) : NULL;
      g_autofree char *note = NULL;
      g_autofree char *shown = NULL;
      if (kept && kept[0])
        note = g_strdup_printf (_("Not applied: the results are for %s."), kept);
      else if (kept)
        note = g_strdup (_("Not applied: the results are for no value given."));
      shown = note ? g_strdup_printf ("%s\n%s", message, note) : g_strdup (message);
      gtk_label_set_text (GTK_LABEL (f->error_label), shown);
      gtk_widget_set_visible (f->error_label, TRUE);
    }
}

static void
field_unflag (BwField *f)
{
  f->flagged = FALSE;
  if (f->widget)
    {
      const BwParamSpec *spec = f->kind == BW_FIELD_PARAM ? field_spec (f) : NULL;
      gtk_widget_remove_css_class (f->widget, "error");
      gtk_widget_set_tooltip_text (f->widget, spec ? bw_label_text (spec->help) : NULL);
      gtk_accessible_reset_state (GTK_ACCESSIBLE (f->widget), GTK_ACCESSIBLE_STATE_INVALID);
      gtk_accessible_reset_property (GTK_ACCESSIBLE (f->widget), GTK_ACCESSIBLE_PROPERTY_DESCRIPTION);
    }
  if (f->error_label)
    gtk_widget_set_visible (f->error_label, FALSE);
}

/* Shows the model's value in the widget (unless the field holds a refused entry). */
static void
field_refresh (BwField *f, gboolean force)
{
  BwWindow *self = f->window;
  BwProcessUnit *u;

  if (f->widget == NULL || (f->flagged && !force))
    return;
  if (force)
    field_unflag (f);
  self->updating = TRUE;
  if (GTK_IS_ENTRY (f->widget))
    {
      g_autofree char *text = field_text (f);
      if (g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (f->widget)), text) != 0)
        gtk_editable_set_text (GTK_EDITABLE (f->widget), text);
    }
  else if (GTK_IS_DROP_DOWN (f->widget) && (u = field_unit (f)))
    gtk_drop_down_set_selected (GTK_DROP_DOWN (f->widget), (guint) u->values[f->param_index]);
  else if (GTK_IS_SPIN_BUTTON (f->widget) && (u = field_unit (f)))
    gtk_spin_button_set_value (GTK_SPIN_BUTTON (f->widget), u->values[f->param_index]);
  self->updating = FALSE;
}

gboolean
_bw_window_entry_has_typing (BwWindow *self, GtkWidget *focus)
{
  GtkWidget *entry = focus ? gtk_widget_get_ancestor (focus, GTK_TYPE_ENTRY) : NULL;
  GPtrArray *lists[] = { self->fields, self->basis_fields };

  if (entry == NULL)
    return FALSE;
  for (guint l = 0; l < G_N_ELEMENTS (lists); l++)
    for (guint i = 0; lists[l] && i < lists[l]->len; i++)
      {
        BwField *f = g_ptr_array_index (lists[l], i);
        if (f->widget == entry)
          {
            g_autofree char *model = field_text (f);
            return g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (entry)), model) != 0;
          }
      }
  return FALSE;
}

/* Makes the edit; on refusal flags the field with the engine's reason. */
static void
field_apply (BwField *f, BwEdit *edit, GError *parse_error)
{
  BwWindow *self = f->window;
  g_autoptr (GError) error = parse_error;

  if (edit == NULL || !bw_window_do_edit (self, edit, &error))
    {
      field_flag (f, error ? error->message : _("not accepted"));
      return;
    }
  field_refresh (f, TRUE);
}

static void
entry_commit (BwField *f)
{
  BwWindow *self = f->window;
  const char *text;
  g_autofree char *now = NULL;
  GError *error = NULL;
  BwEdit *edit;

  if (self->updating || f->widget == NULL)
    return;
  text = gtk_editable_get_text (GTK_EDITABLE (f->widget));
  now = field_text (f);
  if (g_strcmp0 (text, now) == 0)
    {
      if (f->flagged)
        field_unflag (f); /* typed back to the model's value */
      return;
    }
  edit = field_make_edit (f, text, &error);
  field_apply (f, edit, error);
}

static void
entry_activate (GtkEntry *entry, gpointer data)
{
  (void) entry;
  entry_commit (data);
}

static void
entry_leave (GtkEventControllerFocus *c, gpointer data)
{
  (void) c;
  entry_commit (data);
}

static void
dropdown_changed (GtkDropDown *dd, GParamSpec *pspec, gpointer data)
{
  BwField *f = data;
  const BwParamSpec *spec = field_spec (f);

  (void) pspec;
  if (f->window->updating || spec == NULL)
    return;
  field_apply (f, bw_edit_set_param (f->unit_id, spec->id, (double) gtk_drop_down_get_selected (dd)), NULL);
}

static void
spin_changed (GtkSpinButton *spin, gpointer data)
{
  BwField *f = data;
  const BwParamSpec *spec = field_spec (f);

  if (f->window->updating || spec == NULL)
    return;
  field_apply (f, bw_edit_set_param (f->unit_id, spec->id, gtk_spin_button_get_value (spin)), NULL);
}

static BwField *
field_new (BwWindow *self, GPtrArray *list, BwFieldKind kind, const char *id, const char *unit_id)
{
  BwField *f = g_new0 (BwField, 1);

  f->window = self;
  f->kind = kind;
  f->id = g_strdup (id);
  f->unit_id = g_strdup (unit_id);
  f->qkind = BW_KIND_NUMBER;
  g_ptr_array_add (list, f);
  return f;
}

/* Adds LABEL and the field's widget at ROW of GRID, and a hidden error label below. */
static int
attach_field (GtkGrid *grid, int row, BwField *f, const char *label, const char *help)
{
  GtkWidget *l = gtk_label_new (label);
  GtkWidget *err = gtk_label_new ("");
  g_autofree char *acc = g_strdup (label);

  gtk_label_set_xalign (GTK_LABEL (l), 0);
  gtk_label_set_wrap (GTK_LABEL (l), TRUE);
  gtk_label_set_width_chars (GTK_LABEL (l), 12);
  gtk_label_set_max_width_chars (GTK_LABEL (l), 18);
  gtk_widget_set_tooltip_text (l, help);
  gtk_widget_set_hexpand (f->widget, TRUE);
  gtk_widget_set_tooltip_text (f->widget, help);
  gtk_accessible_update_property (GTK_ACCESSIBLE (f->widget), GTK_ACCESSIBLE_PROPERTY_LABEL, acc, -1);
  gtk_accessible_update_relation (GTK_ACCESSIBLE (f->widget), GTK_ACCESSIBLE_RELATION_LABELLED_BY, l, NULL, -1);
  gtk_grid_attach (grid, l, 0, row, 1, 1);
  gtk_grid_attach (grid, f->widget, 1, row, 1, 1);
  gtk_label_set_xalign (GTK_LABEL (err), 0);
  gtk_label_set_wrap (GTK_LABEL (err), TRUE);
  gtk_widget_add_css_class (err, "bw-field-error");
  gtk_widget_set_visible (err, FALSE);
  gtk_grid_attach (grid, err, 1, row + 1, 1, 1);
  f->error_label = err;
  g_object_add_weak_pointer (G_OBJECT (f->widget), (gpointer *) &f->widget);
  g_object_add_weak_pointer (G_OBJECT (err), (gpointer *) &f->error_label);
  return row + 2;
}

static void
make_entry (BwField *f, const char *placeholder)
{
  GtkEventController *focus = gtk_event_controller_focus_new ();

  f->widget = gtk_entry_new ();
  gtk_entry_set_placeholder_text (GTK_ENTRY (f->widget), placeholder);
  gtk_editable_set_width_chars (GTK_EDITABLE (f->widget), 9);
  g_signal_connect (f->widget, "activate", G_CALLBACK (entry_activate), f);
  g_signal_connect (focus, "leave", G_CALLBACK (entry_leave), f);
  gtk_widget_add_controller (f->widget, focus);
}

static int
section (GtkGrid *grid, int row, const char *title)
{
  GtkWidget *l = gtk_label_new (title);

  gtk_label_set_xalign (GTK_LABEL (l), 0);
  gtk_label_set_wrap (GTK_LABEL (l), TRUE);
  gtk_widget_add_css_class (l, "bw-section");
  gtk_grid_attach (grid, l, 0, row, 2, 1);
  return row + 1;
}

static void
grid_clear (GtkGrid *grid)
{
  GtkWidget *child;

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (grid))))
    gtk_grid_remove (grid, child);
}

static char *
placeholder_for (BwQuantityKind kind, BwUnitSystem units, gboolean optional)
{
  const BwUnit *du = bw_units_display_unit (kind, units);

  if (optional)
    return g_strdup (_("not given"));
  if (du == NULL || du->symbol[0] == '\0')
    return g_strdup (_("a number"));
  return g_strdup_printf (_("number, unit optional (%s)"), du->symbol);
}

/* --- the unit editor --- */

void
_bw_window_build_editor (BwWindow *self)
{
  GtkGrid *g = self->editor_grid;
  BwProcessUnit *u = NULL, *parent = NULL;
  BwTrain *train = NULL;
  const BwParamSpec *specs;
  guint n;
  int row = 0;
  BwField *f;

  self->updating = TRUE;
  grid_clear (g);
  g_ptr_array_set_size (self->fields, 0);
  self->updating = FALSE;
  g_clear_pointer (&self->editor_id, g_free);
  self->editor_type = -1;
  if (self->selected_id)
    u = bw_project_find_unit (self->project, self->selected_id, &train);
  if (u == NULL)
    {
      const char *heading = _("Select a unit or stage in the navigator");
      for (guint i = 0; self->selected_train && i < self->project->trains->len; i++)
        {
          BwTrain *t = g_ptr_array_index (self->project->trains, i);
          if (g_strcmp0 (t->id, self->selected_train) == 0)
            heading = t->name ? t->name : t->id;
        }
      gtk_label_set_text (self->unit_heading, heading);
      gtk_label_set_text (self->unit_type_label,
                          self->selected_train ? _("A train: add units to it with the + button (or Insert).")
                                               : "");
      return;
    }
  self->editor_id = g_strdup (u->id);
  self->editor_type = (int) u->type;
  for (guint k = 0; train && k < train->units->len; k++)
    {
      BwProcessUnit *x = g_ptr_array_index (train->units, k);
      for (guint s = 0; s < x->stages->len; s++)
        if (g_ptr_array_index (x->stages, s) == u)
          parent = x;
    }
  gtk_label_set_text (self->unit_heading, u->name ? u->name : u->id);
  {
    /* TRANSLATORS: "<kind> of <flocculator> · id <id>" and "<kind> in <train> · id <id>" */
    g_autofree char *t = parent ? g_strdup_printf (_("%s of %s · id %s"), bw_label_process_type (u->type),
                                                   parent->name ? parent->name : parent->id, u->id)
                                : g_strdup_printf (_("%s in %s · id %s"), bw_label_process_type (u->type),
                                                   train->name ? train->name : train->id, u->id);
    gtk_label_set_text (self->unit_type_label, t);
  }

  f = field_new (self, self->fields, BW_FIELD_UNIT_NAME, "name", u->id);
  make_entry (f, _("name"));
  row = attach_field (g, row, f, _("name"), _("the name shown in the navigator, reports and checks"));
  row = section (g, row, _("Parameters · type a value with any unit (60 ft, 12 in, 170 rpm)"));
  specs = bw_params_of (u->type, &n);
  for (guint i = 0; i < n; i++)
    {
      const BwParamSpec *sp = &specs[i];
      f = field_new (self, self->fields, BW_FIELD_PARAM, sp->id, u->id);
      f->param_index = (int) i;
      f->qkind = sp->kind;
      f->optional = sp->optional;
      switch (sp->type)
        {
        case BW_PARAM_QUANTITY:
          {
            g_autofree char *ph = placeholder_for (sp->kind, self->units, sp->optional);
            make_entry (f, ph);
            break;
          }
        case BW_PARAM_CHOICE:
          {
            /* The choices as a person reads them; the selected index is what is stored. */
            g_autoptr (GPtrArray) shown = g_ptr_array_new ();
            for (int c = 0; sp->choices[c]; c++)
              g_ptr_array_add (shown, (gpointer) bw_label_choice (sp, c));
            g_ptr_array_add (shown, NULL);
            f->widget = gtk_drop_down_new_from_strings ((const char *const *) shown->pdata);
          }
          g_signal_connect (f->widget, "notify::selected", G_CALLBACK (dropdown_changed), f);
          break;
        case BW_PARAM_COUNT:
          f->widget = gtk_spin_button_new_with_range (sp->min, sp->max, 1);
          gtk_spin_button_set_numeric (GTK_SPIN_BUTTON (f->widget), TRUE);
          g_signal_connect (f->widget, "value-changed", G_CALLBACK (spin_changed), f);
          break;
        default:
          g_assert_not_reached ();
        }
      {
        const char *sl = bw_label_text (sp->label);
        g_autofree char *label = sp->optional ? g_strdup_printf (_("%s (optional)"), sl) : g_strdup (sl);
        row = attach_field (g, row, f, label, bw_label_text (sp->help));
      }
    }
  if (u->type == BW_PROCESS_FLOCCULATOR)
    {
      GtkWidget *l = gtk_label_new (_("Its stages are listed under it in the navigator: select one to edit "
                                      "it, or add one with the + button."));
      gtk_label_set_wrap (GTK_LABEL (l), TRUE);
      gtk_label_set_xalign (GTK_LABEL (l), 0);
      gtk_widget_add_css_class (l, "dim-label");
      gtk_widget_set_margin_top (l, 8);
      gtk_grid_attach (g, l, 0, row, 2, 1);
    }
  for (guint i = 0; i < self->fields->len; i++)
    field_refresh (g_ptr_array_index (self->fields, i), TRUE);
}

void
_bw_window_refresh_editor (BwWindow *self)
{
  BwProcessUnit *u = self->selected_id ? bw_project_find_unit (self->project, self->selected_id, NULL) : NULL;

  /* A different unit (or one that went away): rebuild; otherwise show the model's values. */
  if ((u == NULL) != (self->editor_id == NULL) || (u && (g_strcmp0 (u->id, self->editor_id) != 0
                                                         || (int) u->type != self->editor_type)))
    {
      _bw_window_build_editor (self);
      return;
    }
  if (u)
    gtk_label_set_text (self->unit_heading, u->name ? u->name : u->id);
  for (guint i = 0; i < self->fields->len; i++)
    {
      BwField *f = g_ptr_array_index (self->fields, i);
      if (f->kind == BW_FIELD_PARAM && f->widget && GTK_IS_ENTRY (f->widget))
        {
          g_autofree char *ph = placeholder_for (f->qkind, self->units, f->optional);
          gtk_entry_set_placeholder_text (GTK_ENTRY (f->widget), ph);
        }
      field_refresh (f, FALSE);
    }
}

/* --- the design basis page --- */

static void
case_toggled (GtkCheckButton *b, gpointer data)
{
  BwWindow *self = data;
  guint index = GPOINTER_TO_UINT (g_object_get_data (G_OBJECT (b), "bw-case"));
  g_autoptr (GError) error = NULL;

  if (self->updating)
    return;
  if (!bw_window_do_edit (self, bw_edit_set_case_enabled (index, gtk_check_button_get_active (b)), &error))
    {
      self->updating = TRUE;
      gtk_check_button_set_active (b, !gtk_check_button_get_active (b));
      self->updating = FALSE;
      gtk_widget_add_css_class (GTK_WIDGET (b), "error");
      gtk_widget_set_tooltip_text (GTK_WIDGET (b), error->message);
      _bw_window_set_status (self, error->message);
    }
}

static void
cases_refresh (BwWindow *self)
{
  const GArray *cases = self->project->cases;
  GtkWidget *row;
  guint i = 0;

  if (self->n_case_rows != cases->len)
    {
      GtkWidget *child;
      while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->cases_list))))
        gtk_list_box_remove (self->cases_list, child);
      for (guint k = 0; k < cases->len; k++)
        {
          GtkWidget *b = gtk_check_button_new ();
          g_object_set_data (G_OBJECT (b), "bw-case", GUINT_TO_POINTER (k));
          g_signal_connect (b, "toggled", G_CALLBACK (case_toggled), self);
          gtk_widget_set_margin_start (b, 6);
          gtk_list_box_append (self->cases_list, b);
        }
      self->n_case_rows = cases->len;
    }
  self->updating = TRUE;
  for (row = gtk_widget_get_first_child (GTK_WIDGET (self->cases_list)); row && i < cases->len;
       row = gtk_widget_get_next_sibling (row), i++)
    {
      GtkWidget *b = gtk_list_box_row_get_child (GTK_LIST_BOX_ROW (row));
      const BwLoadCase *c = &g_array_index (cases, BwLoadCase, i);
      g_autofree char *label = bw_label_load_case (c);
      /* Only what changed: after an edit elsewhere the cases are as they were, and resetting
       * each label and style would re-measure and restyle the whole list. */
      if (g_strcmp0 (gtk_check_button_get_label (GTK_CHECK_BUTTON (b)), label) != 0)
        gtk_check_button_set_label (GTK_CHECK_BUTTON (b), label);
      if (gtk_check_button_get_active (GTK_CHECK_BUTTON (b)) != c->enabled)
        gtk_check_button_set_active (GTK_CHECK_BUTTON (b), c->enabled);
      _bw_widget_class_exclusive (b, NULL, (const char *const[]) { "error" }, 1);
      _bw_widget_tooltip_update (b, NULL);
    }
  self->updating = FALSE;
}

static void
criteria_changed (GtkDropDown *dd, GParamSpec *pspec, gpointer data)
{
  BwWindow *self = data;
  guint sel = gtk_drop_down_get_selected (dd);
  g_autoptr (GError) error = NULL;
  const BwCriteriaSet *set;

  (void) pspec;
  if (self->updating || sel >= self->criteria_sets->len)
    return;
  set = g_ptr_array_index (self->criteria_sets, sel);
  if (g_strcmp0 (set->id, self->project->criteria) == 0)
    return;
  if (!bw_window_do_edit (self, bw_edit_set_criteria (set->id), &error))
    _bw_window_set_status (self, error->message);
  else if (BW_IS_APPLICATION (gtk_window_get_application (GTK_WINDOW (self))))
    bw_application_remember_criteria (BW_APPLICATION (gtk_window_get_application (GTK_WINDOW (self))),
                                      set->id);
}

static void
criteria_refresh (BwWindow *self)
{
  g_autoptr (GtkStringList) list = gtk_string_list_new (NULL);
  guint selected = GTK_INVALID_LIST_POSITION;
  const char *want = self->project->criteria ? self->project->criteria : "textbook-ranges";
  GListModel *now = gtk_drop_down_get_model (self->criteria_dropdown);
  gboolean same = now != NULL;

  for (guint i = 0; i < self->criteria_sets->len; i++)
    {
      const BwCriteriaSet *s = g_ptr_array_index (self->criteria_sets, i);
      g_autofree char *label = g_strdup_printf ("%s (%s)", s->name, s->id);
      gtk_string_list_append (list, label);
      if (g_strcmp0 (s->id, want) == 0 || g_strcmp0 (s->origin, want) == 0)
        selected = i;
    }
  if (selected == GTK_INVALID_LIST_POSITION)
    {
      g_autofree char *label = g_strdup_printf (_("%s (not among the sets found)"), want);
      gtk_string_list_append (list, label);
      selected = self->criteria_sets->len;
    }
  /* Replace the model only when its entries differ: this runs inside the dropdown's own
   * notify::selected when the choice was made there. */
  if (same && g_list_model_get_n_items (now) == g_list_model_get_n_items (G_LIST_MODEL (list)))
    {
      for (guint i = 0; same && i < g_list_model_get_n_items (now); i++)
        same = g_strcmp0 (gtk_string_list_get_string (GTK_STRING_LIST (now), i),
                          gtk_string_list_get_string (list, i)) == 0;
    }
  else
    same = FALSE;
  self->updating = TRUE;
  if (!same)
    gtk_drop_down_set_model (self->criteria_dropdown, G_LIST_MODEL (list));
  if (gtk_drop_down_get_selected (self->criteria_dropdown) != selected)
    gtk_drop_down_set_selected (self->criteria_dropdown, selected);
  self->updating = FALSE;
  if (self->criteria)
    {
      const char *d = self->criteria->description;
      const gboolean stop = d && g_str_has_suffix (d, ".");
      const guint nc = self->criteria->criteria->len;
      g_autofree char *count = g_strdup_printf (ngettext ("%u criterion", "%u criteria", nc), nc);
      /* TRANSLATORS: "<N criteria>[: <description>]. Limits are ..." */
      g_autofree char *note = g_strdup_printf (_("%s%s%s%s Limits are only as good as their "
                                                 "citation: check the edition in force."),
                                               count, d ? ": " : "", d ? d : "", stop ? "" : ".");
      _bw_label_update (self->criteria_note, note);
    }
  else
    _bw_label_update (self->criteria_note, self->criteria_error ? self->criteria_error : "");
}

void
_bw_window_build_basis (BwWindow *self)
{
  GtkGrid *g = self->basis_grid;
  BwField *f;
  int row = 0;

  self->updating = TRUE;
  grid_clear (g);
  g_ptr_array_set_size (self->basis_fields, 0);
  self->updating = FALSE;

  row = section (g, row, _("Project"));
  f = field_new (self, self->basis_fields, BW_FIELD_PROJECT_NAME, "project-name", NULL);
  make_entry (f, _("project name"));
  row = attach_field (g, row, f, _("project name"), _("the plant's name, shown in the title and reports"));

  row = section (g, row, _("Plant flows (split equally among the trains)"));
  for (int k = 0; k < BW_N_FLOW_KINDS; k++)
    {
      g_autofree char *id = g_strdup_printf ("flow:%s", bw_flow_kind_name ((BwFlowKind) k));
      g_autofree char *ph = NULL;
      f = field_new (self, self->basis_fields, BW_FIELD_FLOW, id, NULL);
      f->sub = (guint) k;
      f->qkind = BW_KIND_FLOW;
      f->optional = k != BW_FLOW_MAXIMUM_DAY;
      ph = placeholder_for (BW_KIND_FLOW, self->units, f->optional);
      make_entry (f, ph);
      row = attach_field (g, row, f, bw_label_flow_kind ((BwFlowKind) k),
                          k == BW_FLOW_MAXIMUM_DAY ? _("required: the plant's maximum-day flow")
                                                   : _("optional; leave empty when not given"));
    }
  row = section (g, row, _("Water temperatures"));
  for (int k = 0; k < BW_N_TEMP_KINDS; k++)
    {
      g_autofree char *id = g_strdup_printf ("temperature:%s", bw_temp_kind_name ((BwTempKind) k));
      g_autofree char *ph = placeholder_for (BW_KIND_TEMPERATURE, self->units, FALSE);
      f = field_new (self, self->basis_fields, BW_FIELD_TEMPERATURE, id, NULL);
      f->sub = (guint) k;
      f->qkind = BW_KIND_TEMPERATURE;
      make_entry (f, ph);
      row = attach_field (g, row, f, bw_label_temp_kind ((BwTempKind) k),
                          _("cold water is more viscous: it governs many criteria"));
    }
  row = section (g, row, _("Raw water"));
  for (guint k = 0; k < G_N_ELEMENTS (raw_ids); k++)
    {
      g_autofree char *ph = placeholder_for (raw_kinds[k], self->units, FALSE);
      f = field_new (self, self->basis_fields, BW_FIELD_RAW_WATER, raw_ids[k], NULL);
      f->sub = k;
      f->qkind = raw_kinds[k];
      make_entry (f, ph);
      row = attach_field (g, row, f, _(raw_labels[k]), NULL);
    }
  self->n_case_rows = G_MAXUINT;
  g_signal_handlers_disconnect_by_func (self->criteria_dropdown, criteria_changed, self);
  g_signal_connect (self->criteria_dropdown, "notify::selected", G_CALLBACK (criteria_changed), self);
  for (guint i = 0; i < self->basis_fields->len; i++)
    field_refresh (g_ptr_array_index (self->basis_fields, i), TRUE);
  cases_refresh (self);
  criteria_refresh (self);
}

void
_bw_window_refresh_basis (BwWindow *self)
{
  for (guint i = 0; i < self->basis_fields->len; i++)
    field_refresh (g_ptr_array_index (self->basis_fields, i), FALSE);
  cases_refresh (self);
  criteria_refresh (self);
}
