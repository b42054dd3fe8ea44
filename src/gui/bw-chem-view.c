/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-chem-view.c: the chemistry page. The fields show the project's chemistry basis; a typed
 * value becomes one snapshot edit of a modified copy (undoable, validated by the window); a
 * refused one is flagged in place with the reason. Feed, alkalinity and sludge come from
 * bw_dosing_evaluate, the per-unit figures from the window's results, the chart from the draw
 * layer's bw_chart_jartest. */
#include "config.h"

#include "gui/bw-chem-view.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

#include "draw/bw-chart-jartest.h"
#include "draw/bw-labels.h"
#include "draw/bw-charts.h"
#include "draw/bw-style.h"
#include "engine/bw-chemistry.h"
#include "engine/bw-edit.h"
#include "engine/bw-error.h"
#include "engine/bw-water.h"
#include "gui/bw-locale.h"
#include "gui/bw-wheel.h"
#include "io/bw-jartest-csv.h"

/* PACl strength put in when the coagulant is switched to PACl and none was set: 10.5 % Al2O3 and
 * a basicity of 0.5, typical of commercial products (common practice, no source); the fields show
 * them at once for the designer to replace with the supplier's figures. */
#define PACL_TYPICAL_AL2O3 0.105
#define PACL_TYPICAL_BASICITY 0.5

typedef enum
{
  CF_ENABLED,
  CF_KIND,
  CF_HYDRATE,
  CF_AL2O3,
  CF_BASICITY,
  CF_DOSE_MIN,
  CF_DOSE_DESIGN,
  CF_DOSE_MAX,
  CF_SS,
  CF_RESIDUAL,
  CF_ALKALI,
  CF_STOCK_STRENGTH,
  CF_STOCK_DENSITY,
  CF_SLUDGE_SOLIDS,
  N_CF
} ChemFieldId;

typedef struct
{
  const char *id;
  const char *label;     /* also the field name in error messages */
  BwQuantityKind kind;
  const char *unit_note; /* shown after the entry when the kind has no unit of its own */
  const char *help;
  const char *edit_label;
  gboolean optional;     /* empty means not given (held as 0) */
} ChemFieldInfo;

static const ChemFieldInfo cf_info[N_CF] = {
  [CF_ENABLED] = { "enabled", N_("Dose a coagulant"), BW_KIND_NUMBER, NULL,
                   N_("The rapid mix receives the coagulant and the basins collect its sludge"),
                   N_("Switch coagulant dosing") },
  [CF_KIND] = { "kind", N_("coagulant"), BW_KIND_NUMBER, NULL, N_("The coagulant product dosed"),
                N_("Set the coagulant") },
  [CF_HYDRATE] = { "hydrate", N_("alum hydrate waters"), BW_KIND_NUMBER, N_("H₂O per Al₂(SO₄)₃"),
                   N_("n in Al₂(SO₄)₃·nH₂O: 14 for the usual commercial alum, 0 to 18"),
                   N_("Set the alum hydrate") },
  [CF_AL2O3] = { "al2o3", N_("PACl Al₂O₃ content"), BW_KIND_FRACTION, NULL,
                 N_("Mass fraction of Al₂O₃ in the PACl solution as supplied"),
                 N_("Set the PACl strength") },
  [CF_BASICITY] = { "basicity", N_("PACl basicity"), BW_KIND_FRACTION, NULL,
                    N_("OH / 3 Al of the PACl, 0 to 100 %"), N_("Set the PACl basicity") },
  [CF_DOSE_MIN] = { "dose:minimum", N_("minimum dose"), BW_KIND_CONCENTRATION, NULL,
                    N_("The least dose the feed system must meter"),
                    N_("Set the coagulant dose range") },
  [CF_DOSE_DESIGN] = { "dose:design", N_("design dose"), BW_KIND_CONCENTRATION, NULL,
                       N_("The dose the sludge is figured at"), N_("Set the coagulant dose range") },
  [CF_DOSE_MAX] = { "dose:maximum", N_("maximum dose"), BW_KIND_CONCENTRATION, NULL,
                    N_("The dose the feed and the alkalinity are figured at"),
                    N_("Set the coagulant dose range") },
  [CF_SS] = { "ss-factor", N_("turbidity to solids factor"), BW_KIND_NUMBER, N_("mg/L per NTU"),
              N_("Suspended solids removed per NTU of raw turbidity, 0 to 10 (often 1 to 2)"),
              N_("Set the turbidity to solids factor") },
  [CF_RESIDUAL] = { "residual-target", N_("residual alkalinity target"), BW_KIND_CONCENTRATION,
                    N_("as CaCO₃"),
                    N_("Alkalinity as CaCO₃ to keep after coagulation; 0 for none"),
                    N_("Set the residual alkalinity target") },
  [CF_ALKALI] = { "alkali", N_("alkali supplement"), BW_KIND_NUMBER, NULL,
                  N_("What is fed when the residual alkalinity would fall below the target"),
                  N_("Set the alkali supplement") },
  [CF_STOCK_STRENGTH] = { "stock-strength", N_("stock solution strength"), BW_KIND_FRACTION,
                          N_("as the product dosed"),
                          N_("Mass fraction of the coagulant product in the liquid stock as "
                             "delivered (liquid alum is often near 48 %); empty for dry feed only"),
                          N_("Set the stock solution strength"), TRUE },
  [CF_STOCK_DENSITY] = { "stock-density", N_("stock solution density"), BW_KIND_DENSITY, NULL,
                         N_("Density of the liquid stock, from the supplier's data sheet; empty "
                            "for none"),
                         N_("Set the stock solution density"), TRUE },
  [CF_SLUDGE_SOLIDS] = { "sludge-solids", N_("sludge solids content"), BW_KIND_FRACTION, NULL,
                         N_("Dry solids in the settled sludge as withdrawn, mass fraction (often "
                            "0.5 to 2 %); empty for none"),
                         N_("Set the sludge solids content"), TRUE },
};

/* Alkali supplements in dropdown order (BwAlkaliKind). */
static const char *const alkali_labels[BW_N_ALKALIS] = { N_("lime, Ca(OH)₂"),
                                                         N_("soda ash, Na₂CO₃") };

/* Coagulant kinds a project takes, in dropdown order (bw_project_coagulant refuses the rest). */
static const BwCoagulantKind kinds[] = { BW_COAGULANT_ALUM, BW_COAGULANT_FERRIC_CHLORIDE,
                                         BW_COAGULANT_FERRIC_SULFATE, BW_COAGULANT_PACL };

typedef struct
{
  BwChemView *view;
  ChemFieldId which;
  GtkWidget *label;
  GtkWidget *widget;
  GtkWidget *unit_label;
  GtkWidget *error_label;
  gboolean flagged;
} ChemField;

struct _BwChemView
{
  GtkBox parent_instance;
  gboolean stale;            /* the project changed while the page was out of sight */

  /* Template widgets */
  GtkLabel *caution_label;
  GtkGrid *basis_grid;
  GtkLabel *edit_error_label;
  GtkGrid *results_grid;
  GtkLabel *results_note;
  GtkListBox *jar_list;
  GtkButton *import_button;
  GtkButton *remove_button;
  GtkLabel *jar_error_label;
  GtkWidget *record_box;
  GtkGrid *jars_grid;
  GtkLabel *fit_label;
  GtkLabel *target_label;
  GtkEntry *target_entry;
  GtkLabel *target_error_label;
  GtkButton *use_button;
  GtkDrawingArea *chart_area;
  GtkScrolledWindow *scroller;
  GtkScrolledWindow *results_scroller;

  /* Borrowed: the window owns this page */
  BwWindow *window;

  /* Owned */
  ChemField fields[N_CF];
  char *selected_id;   /* jar-test record shown */
  gboolean target_flagged;
  gboolean updating;
  guint paints;
  GtkFileChooserNative *chooser;
};

G_DEFINE_FINAL_TYPE (BwChemView, bw_chem_view, GTK_TYPE_BOX)

static void refresh (BwChemView *self);
static void target_refresh (BwChemView *self);
static void target_unflag (BwChemView *self);

/* --- helpers --- */

static const BwProject *
project (BwChemView *self)
{
  return bw_window_get_project (self->window);
}

/* Formatted for reading; never shows a non-finite value. */
static char *
fmt (double si, BwQuantityKind kind, BwChemView *self)
{
  if (!isfinite (si))
    return g_strdup ("—");
  return bw_locale_format (si, kind, bw_window_get_unit_system (self->window));
}

static double *
cf_slot (BwChemistryBasis *c, ChemFieldId which)
{
  switch (which)
    {
    case CF_HYDRATE: return &c->hydrate_waters;
    case CF_AL2O3: return &c->al2o3_fraction;
    case CF_BASICITY: return &c->basicity;
    case CF_DOSE_MIN: return &c->dose_min_kg_m3;
    case CF_DOSE_DESIGN: return &c->dose_design_kg_m3;
    case CF_DOSE_MAX: return &c->dose_max_kg_m3;
    case CF_SS: return &c->ss_factor;
    case CF_RESIDUAL: return &c->residual_target_kg_m3;
    case CF_STOCK_STRENGTH: return &c->stock_fraction;
    case CF_STOCK_DENSITY: return &c->stock_density_kg_m3;
    case CF_SLUDGE_SOLIDS: return &c->sludge_solids_fraction;
    default: return NULL;
    }
}

static ChemField *
field_by_id (BwChemView *self, const char *id)
{
  for (guint i = 0; i < N_CF; i++)
    if (g_strcmp0 (cf_info[i].id, id) == 0)
      return &self->fields[i];
  return NULL;
}

static void
flag_widget (GtkWidget *w, GtkWidget *err, const char *message)
{
  gtk_widget_add_css_class (w, "error");
  gtk_widget_set_tooltip_text (w, message);
  gtk_accessible_update_state (GTK_ACCESSIBLE (w), GTK_ACCESSIBLE_STATE_INVALID,
                               GTK_ACCESSIBLE_INVALID_TRUE, -1);
  gtk_accessible_update_property (GTK_ACCESSIBLE (w), GTK_ACCESSIBLE_PROPERTY_DESCRIPTION,
                                  message, -1);
  gtk_label_set_text (GTK_LABEL (err), message);
  gtk_widget_set_visible (err, TRUE);
}

static void
unflag_widget (GtkWidget *w, GtkWidget *err, const char *help)
{
  gtk_widget_remove_css_class (w, "error");
  gtk_widget_set_tooltip_text (w, help);
  gtk_accessible_reset_state (GTK_ACCESSIBLE (w), GTK_ACCESSIBLE_STATE_INVALID);
  gtk_accessible_reset_property (GTK_ACCESSIBLE (w), GTK_ACCESSIBLE_PROPERTY_DESCRIPTION);
  gtk_widget_set_visible (err, FALSE);
}

static void
field_flag (ChemField *f, const char *message)
{
  f->flagged = TRUE;
  flag_widget (f->widget, f->error_label, message);
}

static void
field_unflag (ChemField *f)
{
  f->flagged = FALSE;
  unflag_widget (f->widget, f->error_label, _(cf_info[f->which].help));
}

/* The project's target settled turbidity as the engine takes it: < 0 for none. */
static double
target_of (BwChemView *self)
{
  const double t = project (self)->chemistry.target_NTU;
  return t > 0 ? t : -1;
}

static char *
field_text (ChemField *f)
{
  BwChemistryBasis c = project (f->view)->chemistry;
  double *v = cf_slot (&c, f->which);

  if (v == NULL || (cf_info[f->which].optional && *v == 0))
    return g_strdup ("");
  if (cf_info[f->which].kind == BW_KIND_NUMBER)
    {
      g_autofree char *plain = bw_format_number (*v, 4);
      return bw_locale_localize_number (plain);
    }
  return fmt (*v, cf_info[f->which].kind, f->view);
}

/* Swaps in COPY (owned) as one undoable edit; on refusal shows the reason at F (or the page). */
static gboolean
apply_copy (BwChemView *self, BwProject *copy, const char *label, ChemField *f, GError **error)
{
  g_autoptr (GError) local = NULL;
  BwEdit *edit = bw_edit_snapshot (copy, label, NULL);
  gboolean ok;

  bw_project_free (copy);
  ok = bw_window_do_edit (self->window, edit, &local);
  if (!ok)
    {
      const char *msg = local ? local->message : _("the edit was not accepted");
      if (f)
        field_flag (f, msg);
      else
        {
          gtk_label_set_text (self->edit_error_label, msg);
          gtk_widget_set_visible (GTK_WIDGET (self->edit_error_label), TRUE);
        }
      if (error)
        *error = g_steal_pointer (&local);
      return FALSE;
    }
  if (f)
    field_unflag (f);
  gtk_widget_set_visible (GTK_WIDGET (self->edit_error_label), FALSE);
  return TRUE; /* ::project-changed has refreshed the page */
}

/* --- the chemistry fields --- */

static void
entry_commit (ChemField *f)
{
  BwChemView *self = f->view;
  const ChemFieldInfo *info = &cf_info[f->which];
  g_autofree char *now = NULL;
  g_autofree char *text = NULL;
  g_autofree char *plain = NULL; /* TEXT with the locale's decimal comma read as a point */
  g_autoptr (GError) error = NULL;
  const BwUnit *du;
  BwProject *copy;
  double v;

  if (self->updating)
    return;
  text = g_strstrip (g_strdup (gtk_editable_get_text (GTK_EDITABLE (f->widget))));
  now = field_text (f);
  if (g_strcmp0 (text, now) == 0)
    {
      if (f->flagged)
        field_unflag (f);
      return;
    }
  if (text[0] == '\0' && !info->optional)
    {
      g_autofree char *msg = g_strdup_printf (_("%s: a value is needed"), _(info->label));
      field_flag (f, msg);
      return;
    }
  du = info->kind == BW_KIND_NUMBER ? NULL
                                    : bw_units_display_unit (info->kind,
                                                             bw_window_get_unit_system (self->window));
  if (text[0] == '\0')
    v = 0; /* an optional input left empty: not given */
  else if (!bw_units_parse (plain = bw_locale_delocalize_number (text), info->kind, du ? du->ascii : NULL,
                            _(info->label), &v, &error))
    {
      field_flag (f, error->message);
      return;
    }
  else if (info->optional && v == 0)
    {
      /* 0 is how the model holds "not given": say so rather than take it silently. */
      g_autofree char *msg = g_strdup_printf (_("%s: must be above zero; leave it empty for "
                                                "none"), _(info->label));
      field_flag (f, msg);
      return;
    }
  copy = bw_project_copy (project (self));
  *cf_slot (&copy->chemistry, f->which) = v;
  apply_copy (self, copy, _(info->edit_label), f, NULL);
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
enabled_toggled (GtkCheckButton *b, gpointer data)
{
  ChemField *f = data;
  BwChemView *self = f->view;
  BwProject *copy;

  if (self->updating)
    return;
  copy = bw_project_copy (project (self));
  copy->chemistry.enabled = gtk_check_button_get_active (b);
  apply_copy (self, copy, _(cf_info[CF_ENABLED].edit_label), f, NULL);
}

static void
kind_changed (GtkDropDown *dd, GParamSpec *pspec, gpointer data)
{
  ChemField *f = data;
  BwChemView *self = f->view;
  const guint i = gtk_drop_down_get_selected (dd);
  BwProject *copy;

  (void) pspec;
  if (self->updating || i >= G_N_ELEMENTS (kinds))
    return;
  copy = bw_project_copy (project (self));
  copy->chemistry.kind = kinds[i];
  if (kinds[i] == BW_COAGULANT_PACL && !(copy->chemistry.al2o3_fraction > 0))
    {
      copy->chemistry.al2o3_fraction = PACL_TYPICAL_AL2O3;
      copy->chemistry.basicity = PACL_TYPICAL_BASICITY;
    }
  apply_copy (self, copy, _(cf_info[CF_KIND].edit_label), f, NULL);
}

static void
alkali_changed (GtkDropDown *dd, GParamSpec *pspec, gpointer data)
{
  ChemField *f = data;
  BwChemView *self = f->view;
  const guint i = gtk_drop_down_get_selected (dd);
  BwProject *copy;

  (void) pspec;
  if (self->updating || i >= BW_N_ALKALIS)
    return;
  copy = bw_project_copy (project (self));
  copy->chemistry.alkali = (BwAlkaliKind) i;
  apply_copy (self, copy, _(cf_info[CF_ALKALI].edit_label), f, NULL);
}

static int
attach_field (BwChemView *self, int row, ChemFieldId which)
{
  ChemField *f = &self->fields[which];
  const ChemFieldInfo *info = &cf_info[which];
  g_autofree char *acc = NULL;

  f->view = self;
  f->which = which;
  if (which == CF_ENABLED)
    {
      f->widget = gtk_check_button_new_with_label (_(info->label));
      f->label = gtk_label_new ("");
      g_signal_connect (f->widget, "toggled", G_CALLBACK (enabled_toggled), f);
    }
  else if (which == CF_KIND)
    {
      const char *labels[G_N_ELEMENTS (kinds) + 1];
      for (guint i = 0; i < G_N_ELEMENTS (kinds); i++)
        labels[i] = bw_label_coagulant (kinds[i]);
      labels[G_N_ELEMENTS (kinds)] = NULL;
      f->widget = gtk_drop_down_new_from_strings (labels);
      f->label = gtk_label_new (_(info->label));
      g_signal_connect (f->widget, "notify::selected", G_CALLBACK (kind_changed), f);
    }
  else if (which == CF_ALKALI)
    {
      const char *labels[BW_N_ALKALIS + 1];
      for (guint i = 0; i < BW_N_ALKALIS; i++)
        labels[i] = _(alkali_labels[i]);
      labels[BW_N_ALKALIS] = NULL;
      f->widget = gtk_drop_down_new_from_strings (labels);
      f->label = gtk_label_new (_(info->label));
      g_signal_connect (f->widget, "notify::selected", G_CALLBACK (alkali_changed), f);
    }
  else
    {
      GtkEventController *focus = gtk_event_controller_focus_new ();
      f->widget = gtk_entry_new ();
      f->label = gtk_label_new (_(info->label));
      gtk_editable_set_width_chars (GTK_EDITABLE (f->widget), 10);
      g_signal_connect (f->widget, "activate", G_CALLBACK (entry_activate), f);
      g_signal_connect (focus, "leave", G_CALLBACK (entry_leave), f);
      gtk_widget_add_controller (f->widget, focus);
    }
  f->unit_label = gtk_label_new ("");
  f->error_label = gtk_label_new ("");
  gtk_label_set_xalign (GTK_LABEL (f->label), 0);
  gtk_label_set_xalign (GTK_LABEL (f->unit_label), 0);
  gtk_label_set_xalign (GTK_LABEL (f->error_label), 0);
  gtk_label_set_wrap (GTK_LABEL (f->error_label), TRUE);
  gtk_widget_add_css_class (f->error_label, "bw-field-error");
  gtk_widget_set_visible (f->error_label, FALSE);
  gtk_widget_set_tooltip_text (f->widget, _(info->help));
  gtk_widget_set_hexpand (f->widget, FALSE);
  acc = g_strdup (_(info->label));
  gtk_accessible_update_property (GTK_ACCESSIBLE (f->widget), GTK_ACCESSIBLE_PROPERTY_LABEL, acc, -1);
  gtk_grid_attach (self->basis_grid, f->label, 0, row, 1, 1);
  gtk_grid_attach (self->basis_grid, f->widget, 1, row, 1, 1);
  gtk_grid_attach (self->basis_grid, f->unit_label, 2, row, 1, 1);
  gtk_grid_attach (self->basis_grid, f->error_label, 1, row + 1, 2, 1);
  return row + 2;
}

static void
field_refresh (ChemField *f)
{
  BwChemView *self = f->view;
  const BwChemistryBasis *c = &project (self)->chemistry;
  const ChemFieldInfo *info = &cf_info[f->which];
  gboolean shown = TRUE;

  switch (f->which)
    {
    case CF_ENABLED:
      gtk_check_button_set_active (GTK_CHECK_BUTTON (f->widget), c->enabled);
      break;
    case CF_KIND:
      for (guint i = 0; i < G_N_ELEMENTS (kinds); i++)
        if (kinds[i] == c->kind)
          gtk_drop_down_set_selected (GTK_DROP_DOWN (f->widget), i);
      break;
    case CF_ALKALI:
      gtk_drop_down_set_selected (GTK_DROP_DOWN (f->widget), (guint) c->alkali);
      break;
    default:
      if (f->which == CF_HYDRATE)
        shown = c->kind == BW_COAGULANT_ALUM;
      else if (f->which == CF_AL2O3 || f->which == CF_BASICITY)
        shown = c->kind == BW_COAGULANT_PACL;
      if (!f->flagged)
        {
          g_autofree char *text = field_text (f);
          if (g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (f->widget)), text) != 0)
            gtk_editable_set_text (GTK_EDITABLE (f->widget), text);
        }
      {
        const BwUnit *du = info->kind == BW_KIND_NUMBER
                             ? NULL
                             : bw_units_display_unit (info->kind,
                                                      bw_window_get_unit_system (self->window));
        g_autofree char *unit = g_strdup_printf ("%s%s%s", du ? du->symbol : "",
                                                 du && info->unit_note ? " " : "",
                                                 info->unit_note ? _(info->unit_note) : "");
        g_autofree char *ph = du && info->optional
                                ? g_strdup_printf (_("none, or a number (%s)"), du->symbol)
                              : du ? g_strdup_printf (_("number, unit optional (%s)"), du->symbol)
                                   : g_strdup (_("a number"));
        gtk_label_set_text (GTK_LABEL (f->unit_label), unit);
        gtk_entry_set_placeholder_text (GTK_ENTRY (f->widget), ph);
      }
      break;
    }
  gtk_widget_set_visible (f->label, shown);
  gtk_widget_set_visible (f->widget, shown);
  gtk_widget_set_visible (f->unit_label, shown);
  if (!shown)
    gtk_widget_set_visible (f->error_label, FALSE);
}

/* --- results --- */

static void
grid_clear (GtkGrid *grid)
{
  GtkWidget *child;

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (grid))))
    gtk_grid_remove (grid, child);
}

static GtkWidget *
cell (GtkGrid *grid, int col, int row, const char *text, gboolean head)
{
  GtkWidget *l = gtk_label_new (text);

  gtk_label_set_xalign (GTK_LABEL (l), col == 0 ? 0 : 1);
  gtk_label_set_selectable (GTK_LABEL (l), !head);
  if (head)
    {
      /* Headings wrap, so the tables (nine columns by plant flow) fit the page at 1024 px. */
      gtk_widget_add_css_class (l, "bw-col-head");
      gtk_label_set_wrap (GTK_LABEL (l), TRUE);
      gtk_label_set_max_width_chars (GTK_LABEL (l), 10);
      gtk_label_set_justify (GTK_LABEL (l), col == 0 ? GTK_JUSTIFY_LEFT : GTK_JUSTIFY_RIGHT);
      gtk_widget_set_valign (l, GTK_ALIGN_END);
    }
  gtk_grid_attach (grid, l, col, row, 1, 1);
  return l;
}

static void
cell_q (GtkGrid *grid, int col, int row, double si, BwQuantityKind kind, BwChemView *self)
{
  g_autofree char *c = fmt (si, kind, self);
  g_autofree char *t = bw_locale_localize_number (c); /* read, not typed: the locale's comma */
  cell (grid, col, row, t, FALSE);
}

/* A flow read in the unit a feed pump or a sludge line is rated in: SI_UNIT (L/h, m³/d) or, in
 * US units, US_UNIT (gph, gpd); never a non-finite value. */
static char *
fmt_flow_in (double si, const char *si_unit, const char *us_unit, BwChemView *self)
{
  const gboolean us = bw_window_get_unit_system (self->window) == BW_UNIT_SYSTEM_US;
  const BwUnit *u = bw_unit_lookup (us ? us_unit : si_unit, BW_KIND_FLOW, "flow", NULL);
  g_autofree char *n = NULL;

  if (!isfinite (si) || u == NULL)
    return g_strdup ("—");
  n = bw_format_number (bw_unit_from_si (u, si), 4);
  return g_strdup_printf ("%s %s", n, u->symbol);
}

static void
cell_flow_in (GtkGrid *grid, int col, int row, double si, const char *si_unit,
              const char *us_unit, BwChemView *self)
{
  g_autofree char *c = fmt_flow_in (si, si_unit, us_unit, self);
  g_autofree char *t = bw_locale_localize_number (c);
  cell (grid, col, row, t, FALSE);
}

/* The chosen alkali's dose and feed in a dosing result. */
static double
alkali_kg_m3 (const BwChemistryBasis *c, const BwDosingResult *d)
{
  return c->alkali == BW_ALKALI_SODA_ASH ? d->soda_ash_kg_m3 : d->lime_kg_m3;
}

static double
alkali_kg_s (const BwChemistryBasis *c, const BwDosingResult *d)
{
  return c->alkali == BW_ALKALI_SODA_ASH ? d->soda_ash_kg_s : d->lime_kg_s;
}

static gboolean
dosing (BwChemView *self, const BwCoagulant *co, double dose, double flow, BwDosingResult *out)
{
  const BwProject *p = project (self);
  BwDosing d;

  bw_dosing_init (&d, dose, flow);
  d.raw_alkalinity_kg_m3 = p->basis.alkalinity_kg_m3;
  d.residual_target_kg_m3 = p->chemistry.residual_target_kg_m3;
  d.turbidity_NTU = p->basis.turbidity_NTU;
  d.ss_factor = p->chemistry.ss_factor;
  if (p->chemistry.stock_fraction > 0 && p->chemistry.stock_density_kg_m3 > 0)
    {
      d.solution_fraction = p->chemistry.stock_fraction;
      d.solution_density_kg_m3 = p->chemistry.stock_density_kg_m3;
    }
  if (p->chemistry.sludge_solids_fraction > 0)
    d.solids_fraction = p->chemistry.sludge_solids_fraction;
  return bw_dosing_evaluate (co, &d, out, NULL);
}

static void
results_rebuild (BwChemView *self)
{
  const BwProject *p = project (self);
  const BwChemistryBasis *c = &p->chemistry;
  const BwResults *r = bw_window_get_results (self->window);
  GtkGrid *g = self->results_grid;
  g_autoptr (GError) error = NULL;
  g_autoptr (GString) note = g_string_new (NULL);
  const double doses[] = { c->dose_min_kg_m3, c->dose_design_kg_m3, c->dose_max_kg_m3 };
  const char *dose_names[] = { N_("minimum"), N_("design"), N_("maximum") };
  BwCoagulant co;
  int row = 0;

  grid_clear (g);
  if (!c->enabled)
    {
      gtk_label_set_text (self->results_note,
                          _("No coagulant is dosed: switch on “Dose a coagulant” to see the feed, "
                            "the alkalinity and the sludge."));
      return;
    }
  if (!bw_project_coagulant (p, &co, &error))
    {
      gtk_label_set_text (self->results_note, error->message);
      return;
    }

  /* By dose: what a litre of water gives up and needs. */
  cell (g, 0, row, _("Dose"), TRUE);
  cell (g, 1, row, "", TRUE);
  cell (g, 2, row, _("Alkalinity consumed"), TRUE);
  cell (g, 3, row, _("Residual alkalinity"), TRUE);
  cell (g, 4, row, c->alkali == BW_ALKALI_SODA_ASH ? _("Soda ash Na₂CO₃ to keep the target")
                                                    : _("Lime Ca(OH)₂ to keep the target"), TRUE);
  row++;
  for (guint k = 0; k < 3; k++)
    {
      BwDosingResult d;
      cell (g, 0, row, _(dose_names[k]), FALSE);
      cell_q (g, 1, row, doses[k], BW_KIND_CONCENTRATION, self);
      if (dosing (self, &co, doses[k], 1.0, &d))
        {
          cell_q (g, 2, row, d.alkalinity_consumed_kg_m3, BW_KIND_CONCENTRATION, self);
          if (d.has_residual)
            cell_q (g, 3, row, d.residual_alkalinity_kg_m3, BW_KIND_CONCENTRATION, self);
          else
            cell (g, 3, row, _("raw alkalinity not given"), FALSE);
          cell_q (g, 4, row, alkali_kg_m3 (c, &d), BW_KIND_CONCENTRATION, self);
          if (k == 2 && (d.cautions & BW_CHEM_CAUTION_ALKALINITY_EXHAUSTED))
            g_string_append (note, _("Caution: the maximum dose consumes more alkalinity than the "
                                     "raw water holds; the pH will collapse without the alkali "
                                     "supplement. "));
          else if (k == 2 && (d.cautions & BW_CHEM_CAUTION_LOW_RESIDUAL))
            g_string_append (note, _("Caution: at the maximum dose the residual alkalinity falls "
                                     "below the target and the pH will drop; feed the alkali "
                                     "shown. "));
        }
      row++;
    }

  /* By plant flow. */
  row++;
  cell (g, 0, row, _("Plant flow"), TRUE);
  cell (g, 1, row, "", TRUE);
  cell (g, 2, row, _("Dry feed, minimum dose"), TRUE);
  cell (g, 3, row, _("design dose"), TRUE);
  cell (g, 4, row, _("maximum dose"), TRUE);
  cell (g, 5, row, _("Liquid feed, maximum dose"), TRUE);
  cell (g, 6, row, c->alkali == BW_ALKALI_SODA_ASH ? _("Soda ash at maximum dose")
                                                    : _("Lime at maximum dose"), TRUE);
  cell (g, 7, row, _("Dry sludge, design dose"), TRUE);
  cell (g, 8, row, _("Sludge volume, design dose"), TRUE);
  row++;
  for (int fk = 0; fk < BW_N_FLOW_KINDS; fk++)
    {
      const double q = p->basis.flow_m3_s[fk];
      BwDosingResult d[3];
      gboolean ok = TRUE;
      if (!((p->basis.flows_given >> fk) & 1))
        continue;
      for (guint k = 0; k < 3; k++)
        ok = ok && dosing (self, &co, doses[k], q, &d[k]);
      cell (g, 0, row, bw_label_flow_kind ((BwFlowKind) fk), FALSE);
      cell_q (g, 1, row, q, BW_KIND_FLOW, self);
      if (ok)
        {
          for (guint k = 0; k < 3; k++)
            cell_q (g, 2 + (int) k, row, d[k].feed_kg_s, BW_KIND_MASS_FLOW, self);
          if (d[2].solution_m3_s > 0)
            cell_flow_in (g, 5, row, d[2].solution_m3_s, "L/h", "gph", self);
          cell_q (g, 6, row, alkali_kg_s (c, &d[2]), BW_KIND_MASS_FLOW, self);
          if (d[1].has_sludge)
            cell_q (g, 7, row, d[1].sludge_kg_s, BW_KIND_MASS_FLOW, self);
          if (d[1].has_sludge_volume)
            cell_flow_in (g, 8, row, d[1].sludge_m3_s, "m3/d", "gpd", self);
        }
      row++;
    }

  /* What the other units receive, from the project's results. */
  if (r)
    {
      const int dc = bw_charts_design_case (r, BW_TEMP_COLDEST);
      row++;
      cell (g, 0, row, _("Unit (design flow, per unit)"), TRUE);
      cell (g, 1, row, "", TRUE);
      cell (g, 2, row, _("Coagulant feed, maximum dose"), TRUE);
      cell (g, 3, row, _("Residual alkalinity"), TRUE);
      cell (g, 4, row, _("Dry sludge, design dose"), TRUE);
      cell (g, 5, row, _("Liquid feed, maximum dose"), TRUE);
      cell (g, 6, row, _("Sludge volume, design dose"), TRUE);
      row++;
      for (guint i = 0; dc >= 0 && i < r->elements->len; i++)
        {
          const BwElementResult *e = g_ptr_array_index (r->elements, i);
          const BwQuantitySet *s = &e->values[dc];
          gboolean feed = bw_quantity_set_has (s, BW_Q_COAGULANT_FEED);
          gboolean sludge = bw_quantity_set_has (s, BW_Q_SLUDGE);
          if (!feed && !sludge)
            continue;
          cell (g, 0, row, e->unit->name ? e->unit->name : e->id, FALSE);
          cell (g, 1, row, e->id, FALSE);
          if (feed)
            cell_q (g, 2, row, s->values[BW_Q_COAGULANT_FEED], BW_KIND_MASS_FLOW, self);
          if (bw_quantity_set_has (s, BW_Q_RESIDUAL_ALKALINITY))
            cell_q (g, 3, row, s->values[BW_Q_RESIDUAL_ALKALINITY], BW_KIND_CONCENTRATION, self);
          if (sludge)
            cell_q (g, 4, row, s->values[BW_Q_SLUDGE], BW_KIND_MASS_FLOW, self);
          if (bw_quantity_set_has (s, BW_Q_COAGULANT_SOLUTION))
            cell_flow_in (g, 5, row, s->values[BW_Q_COAGULANT_SOLUTION], "L/h", "gph", self);
          if (bw_quantity_set_has (s, BW_Q_SLUDGE_VOLUME))
            cell_flow_in (g, 6, row, s->values[BW_Q_SLUDGE_VOLUME], "m3/d", "gpd", self);
          row++;
        }
    }
  {
    g_autofree char *alk = fmt (p->basis.alkalinity_kg_m3, BW_KIND_CONCENTRATION, self);
    g_autofree char *tu = fmt (p->basis.turbidity_NTU, BW_KIND_TURBIDITY, self);
    g_string_append_printf (note, _("Raw water (design basis page): alkalinity %s as CaCO₃, "
                                    "turbidity %s. Alkalinity and alkali are per litre of water "
                                    "treated."), alk, tu);
    if (!(c->stock_fraction > 0 && c->stock_density_kg_m3 > 0))
      g_string_append (note, _(" The liquid feed is shown once the stock solution strength and "
                               "density are both given."));
    if (!(c->sludge_solids_fraction > 0))
      g_string_append (note, _(" The sludge volume is shown once the sludge solids content is "
                               "given."));
    else
      g_string_append (note, _(" The sludge volume takes a dry-solids specific gravity of 1.4."));
  }
  gtk_label_set_text (self->results_note, note->str);
}

/* --- jar tests --- */

static const BwJarTestRecord *
selected_record (BwChemView *self)
{
  return bw_chart_jartest_find_record (project (self), self->selected_id);
}

/* The engine's analysis of record R (prepared copy, zeta from mobility at its temperature). */
static gboolean
analyse (const BwJarTestRecord *r, double target, BwJarSeries *s, BwJarResult *res, GError **error)
{
  *s = r->series;
  if (!bw_jar_series_prepare (s, error))
    return FALSE;
  if (s->has_mobility && !s->has_zeta)
    {
      BwWater w;
      if (!bw_water_properties (r->temperature_K, &w, error)
          || !bw_jar_series_zeta_from_mobility (s, BW_ZETA_SMOLUCHOWSKI, 0, 0, &w, error))
        return FALSE;
    }
  return bw_jar_analyse (s, target, BW_ZETA_DESTABILISED_DEFAULT_V, res, error);
}

static void
jar_row_selected (GtkListBox *box, GtkListBoxRow *row, gpointer data)
{
  BwChemView *self = data;

  (void) box;
  if (self->updating)
    return;
  g_free (self->selected_id);
  self->selected_id = row ? g_strdup (g_object_get_data (G_OBJECT (row), "bw-id")) : NULL;
  gtk_widget_set_visible (GTK_WIDGET (self->jar_error_label), FALSE);
  refresh (self);
}

static void
jar_list_rebuild (BwChemView *self)
{
  const BwProject *p = project (self);
  GtkWidget *child;
  GtkListBoxRow *select = NULL;

  self->updating = TRUE;
  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->jar_list))))
    gtk_list_box_remove (self->jar_list, child);
  if (selected_record (self) == NULL)
    {
      g_free (self->selected_id);
      self->selected_id = NULL;
      if (p->jar_tests->len > 0)
        {
          const BwJarTestRecord *want = bw_chart_jartest_find_record (p, p->chemistry.jar_test);
          if (want == NULL)
            want = g_ptr_array_index (p->jar_tests, 0);
          self->selected_id = g_strdup (want->id);
        }
    }
  for (guint i = 0; i < p->jar_tests->len; i++)
    {
      const BwJarTestRecord *r = g_ptr_array_index (p->jar_tests, i);
      g_autofree char *text = g_strdup_printf (
          _("%s (%s) · %u jars%s"), r->name && *r->name ? r->name : r->id, r->id, r->series.n_jars,
          g_strcmp0 (p->chemistry.jar_test, r->id) == 0 ? _(" · the dose was chosen from it") : "");
      GtkWidget *label = gtk_label_new (text);
      GtkWidget *row = gtk_list_box_row_new ();
      gtk_label_set_xalign (GTK_LABEL (label), 0);
      gtk_label_set_wrap (GTK_LABEL (label), TRUE);
      gtk_list_box_row_set_child (GTK_LIST_BOX_ROW (row), label);
      gtk_accessible_update_property (GTK_ACCESSIBLE (row), GTK_ACCESSIBLE_PROPERTY_LABEL, text, -1);
      g_object_set_data_full (G_OBJECT (row), "bw-id", g_strdup (r->id), g_free);
      gtk_list_box_append (self->jar_list, row);
      if (g_strcmp0 (r->id, self->selected_id) == 0)
        select = GTK_LIST_BOX_ROW (row);
    }
  if (p->jar_tests->len == 0)
    {
      GtkWidget *label = gtk_label_new (_("No jar tests yet: import a sheet (CSV)."));
      GtkWidget *row = gtk_list_box_row_new ();
      gtk_list_box_row_set_child (GTK_LIST_BOX_ROW (row), label);
      gtk_list_box_row_set_selectable (GTK_LIST_BOX_ROW (row), FALSE);
      gtk_list_box_row_set_activatable (GTK_LIST_BOX_ROW (row), FALSE);
      gtk_list_box_append (self->jar_list, row);
    }
  gtk_list_box_select_row (self->jar_list, select);
  self->updating = FALSE;
}

static void
record_rebuild (BwChemView *self)
{
  const BwJarTestRecord *r = selected_record (self);
  const BwUnitSystem us = bw_window_get_unit_system (self->window);
  GtkGrid *g = self->jars_grid;
  g_autoptr (GError) error = NULL;
  BwJarSeries s;
  BwJarResult res;
  int row = 0;

  gtk_widget_set_visible (self->record_box, r != NULL);
  gtk_widget_set_sensitive (GTK_WIDGET (self->remove_button), r != NULL);
  grid_clear (g);
  if (r == NULL)
    return;
  if (!analyse (r, target_of (self), &s, &res, &error))
    {
      gtk_label_set_text (self->fit_label, error->message);
      gtk_widget_set_sensitive (GTK_WIDGET (self->use_button), FALSE);
      gtk_widget_queue_draw (GTK_WIDGET (self->chart_area));
      return;
    }
  cell (g, 0, row, _("Jar"), TRUE);
  cell (g, 1, row, _("Dose"), TRUE);
  cell (g, 2, row, _("Settled turbidity"), TRUE);
  if (s.has_ph)
    cell (g, 3, row, _("pH"), TRUE);
  if (s.has_zeta)
    cell (g, 4, row, s.has_mobility ? _("ζ (from mobility)") : _("ζ potential"), TRUE);
  row++;
  for (guint i = 0; i < s.n_jars; i++, row++)
    {
      g_autofree char *n = g_strdup_printf ("%u", i + 1);
      cell (g, 0, row, n, FALSE);
      cell_q (g, 1, row, s.jars[i].dose_kg_m3, BW_KIND_CONCENTRATION, self);
      cell_q (g, 2, row, s.jars[i].turbidity_NTU, BW_KIND_TURBIDITY, self);
      if (s.has_ph)
        {
          g_autofree char *c_ph = bw_format_number (s.jars[i].ph, 3);
          g_autofree char *ph = bw_locale_localize_number (c_ph);
          cell (g, 3, row, ph, FALSE);
        }
      if (s.has_zeta)
        cell_q (g, 4, row, s.jars[i].zeta_V, BW_KIND_POTENTIAL, self);
    }
  {
    g_autoptr (GString) t = g_string_new (NULL);
    g_autofree char *od = bw_units_format (res.optimum_dose_kg_m3, BW_KIND_CONCENTRATION, us);
    g_autofree char *ot = bw_units_format (res.optimum_turbidity_NTU, BW_KIND_TURBIDITY, us);
    g_autofree char *temp = bw_units_format (r->temperature_K, BW_KIND_TEMPERATURE, us);
    g_string_append_printf (t, _("Tested at %s.\nOptimum (least settled turbidity): %s, %s."),
                            temp, od, ot);
    if (target_of (self) > 0)
      {
        g_autofree char *tt = bw_units_format (target_of (self), BW_KIND_TURBIDITY, us);
        if (res.has_target)
          {
            g_autofree char *td = bw_units_format (res.target_dose_kg_m3, BW_KIND_CONCENTRATION, us);
            g_string_append_printf (t, _("\nLeast dose reaching %s: %s."), tt, td);
          }
        else
          g_string_append_printf (t, _("\nNo dose tested reaches %s."), tt);
      }
    if (s.has_zeta)
      {
        g_autofree char *lim = bw_units_format (BW_ZETA_DESTABILISED_DEFAULT_V, BW_KIND_POTENTIAL, us);
        if (res.has_window)
          {
            g_autofree char *lo = bw_units_format (res.window_low_kg_m3, BW_KIND_CONCENTRATION, us);
            g_autofree char *hi = bw_units_format (res.window_high_kg_m3, BW_KIND_CONCENTRATION, us);
            g_string_append_printf (t, _("\nDestabilised (|ζ| ≤ %s): %s to %s."), lim, lo, hi);
          }
        else
          g_string_append_printf (t, _("\nNo jar has |ζ| within %s."), lim);
      }
    {
      g_autofree char *shown = bw_locale_localize_number (t->str);
      gtk_label_set_text (self->fit_label, shown);
    }
  }
  gtk_widget_set_sensitive (GTK_WIDGET (self->use_button), TRUE);
  gtk_widget_queue_draw (GTK_WIDGET (self->chart_area));
}

static void
refresh (BwChemView *self)
{
  self->updating = TRUE;
  for (guint i = 0; i < N_CF; i++)
    field_refresh (&self->fields[i]);
  target_refresh (self);
  self->updating = FALSE;
  results_rebuild (self);
  jar_list_rebuild (self);
  record_rebuild (self);
}

static void
project_changed (BwWindow *w, gboolean structure, gpointer data)
{
  BwChemView *self = data;

  (void) w;
  (void) structure;
  /* An undo or an open replaces what a refused entry was refused against. */
  for (guint i = 0; i < N_CF; i++)
    if (self->fields[i].flagged && self->fields[i].widget)
      field_unflag (&self->fields[i]);
  if (self->target_flagged)
    target_unflag (self);
  /* Out of sight, the tables wait (an edit elsewhere stays quick); they are rebuilt when shown. */
  if (!gtk_widget_get_mapped (GTK_WIDGET (self)))
    {
      self->stale = TRUE;
      return;
    }
  refresh (self);
}

static void
view_mapped (GtkWidget *widget, gpointer data)
{
  BwChemView *self = data;

  (void) widget;
  if (self->stale)
    {
      self->stale = FALSE;
      refresh (self);
    }
}

/* A unique record id from a file name: "jt-" and its stem, letters, digits and '-' only. */
static char *
record_id_for (const BwProject *p, const char *path)
{
  g_autofree char *base = g_path_get_basename (path);
  g_autoptr (GString) id = g_string_new ("jt-");
  char *dot = strrchr (base, '.');
  g_autofree char *try = NULL;

  if (dot)
    *dot = '\0';
  for (const char *c = base; *c; c++)
    g_string_append_c (id, g_ascii_isalnum (*c) ? g_ascii_tolower (*c) : '-');
  try = g_strdup (id->str);
  for (guint n = 2; bw_chart_jartest_find_record (p, try); n++)
    {
      g_free (try);
      try = g_strdup_printf ("%s-%u", id->str, n);
    }
  return g_steal_pointer (&try);
}

gboolean
bw_chem_view_import_path (BwChemView *self, const char *path, GError **error)
{
  g_autoptr (GError) local = NULL;
  BwJarTestRecord *rec;
  BwProject *copy;
  g_autofree char *id = NULL;
  g_autofree char *name = NULL;
  BwJarSeries s;

  g_return_val_if_fail (BW_IS_CHEM_VIEW (self) && path != NULL, FALSE);
  if (!bw_jartest_load_csv (path, &s, &local))
    {
      gtk_label_set_text (self->jar_error_label, local->message);
      gtk_widget_set_visible (GTK_WIDGET (self->jar_error_label), TRUE);
      g_propagate_error (error, g_steal_pointer (&local));
      return FALSE;
    }
  id = record_id_for (project (self), path);
  name = g_path_get_basename (path);
  rec = bw_jar_test_record_new (id, name);
  rec->series = s;
  copy = bw_project_copy (project (self));
  g_ptr_array_add (copy->jar_tests, rec);
  g_free (self->selected_id);
  self->selected_id = g_strdup (id);
  gtk_widget_set_visible (GTK_WIDGET (self->jar_error_label), FALSE);
  if (!apply_copy (self, copy, _("Import a jar test"), NULL, &local))
    {
      gtk_label_set_text (self->jar_error_label, local->message);
      gtk_widget_set_visible (GTK_WIDGET (self->jar_error_label), TRUE);
      g_propagate_error (error, g_steal_pointer (&local));
      return FALSE;
    }
  return TRUE;
}

static void
chooser_response (GtkNativeDialog *d, int response, gpointer data)
{
  BwChemView *self = data;

  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr (GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (d));
      g_autofree char *path = file ? g_file_get_path (file) : NULL;
      if (path)
        bw_chem_view_import_path (self, path, NULL);
    }
  g_clear_object (&self->chooser);
}

static void
import_clicked (GtkButton *b, gpointer data)
{
  BwChemView *self = data;
  GtkFileFilter *filter;

  (void) b;
  if (self->chooser)
    return;
  self->chooser = gtk_file_chooser_native_new (_("Import a jar-test sheet"),
                                               GTK_WINDOW (self->window),
                                               GTK_FILE_CHOOSER_ACTION_OPEN, _("_Import"),
                                               _("_Cancel"));
  filter = gtk_file_filter_new ();
  gtk_file_filter_set_name (filter, _("Jar-test sheets (CSV)"));
  gtk_file_filter_add_pattern (filter, "*.csv");
  gtk_file_filter_add_mime_type (filter, "text/csv");
  gtk_file_chooser_add_filter (GTK_FILE_CHOOSER (self->chooser), filter);
  g_object_unref (filter);
  g_signal_connect (self->chooser, "response", G_CALLBACK (chooser_response), self);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (self->chooser));
}

static void
remove_clicked (GtkButton *b, gpointer data)
{
  BwChemView *self = data;
  const BwJarTestRecord *r = selected_record (self);
  BwProject *copy;

  (void) b;
  if (r == NULL)
    return;
  copy = bw_project_copy (project (self));
  for (guint i = 0; i < copy->jar_tests->len; i++)
    if (g_strcmp0 (((BwJarTestRecord *) g_ptr_array_index (copy->jar_tests, i))->id, r->id) == 0)
      {
        g_ptr_array_remove_index (copy->jar_tests, i);
        break;
      }
  /* The dose no longer points at a record the project holds. */
  if (g_strcmp0 (copy->chemistry.jar_test, self->selected_id) == 0)
    g_clear_pointer (&copy->chemistry.jar_test, g_free);
  g_clear_pointer (&self->selected_id, g_free);
  apply_copy (self, copy, _("Remove a jar test"), NULL, NULL);
}

gboolean
bw_chem_view_use_dose (BwChemView *self, GError **error)
{
  const BwJarTestRecord *r;
  BwJarSeries s;
  BwJarResult res;
  BwProject *copy;
  BwChemistryBasis *c;
  double design, lo, hi;

  g_return_val_if_fail (BW_IS_CHEM_VIEW (self), FALSE);
  r = selected_record (self);
  if (r == NULL)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   _("jar test: none is selected"));
      return FALSE;
    }
  if (!analyse (r, target_of (self), &s, &res, error))
    return FALSE;
  copy = bw_project_copy (project (self));
  c = &copy->chemistry;
  design = res.has_target ? res.target_dose_kg_m3 : res.optimum_dose_kg_m3;
  lo = res.has_window ? res.window_low_kg_m3 : (c->enabled ? c->dose_min_kg_m3 : design);
  hi = res.has_window ? res.window_high_kg_m3 : (c->enabled ? c->dose_max_kg_m3 : design);
  c->enabled = TRUE;
  c->dose_design_kg_m3 = design;
  c->dose_min_kg_m3 = MIN (lo, design);
  c->dose_max_kg_m3 = MAX (hi, design);
  g_free (c->jar_test);
  c->jar_test = g_strdup (r->id);
  return apply_copy (self, copy, _("Use the jar-test dose"), NULL, error);
}

static void
use_clicked (GtkButton *b, gpointer data)
{
  (void) b;
  bw_chem_view_use_dose (data, NULL);
}

#define TARGET_HELP N_("The settled turbidity the dose must reach, NTU, for the chart and “Use " \
                            "this dose”; saved with the project, empty for none")

/* The target entry's text for the project's target: empty for none. */
static char *
target_text (BwChemView *self)
{
  const double t = project (self)->chemistry.target_NTU;
  g_autofree char *c = t > 0 ? bw_format_number (t, 4) : g_strdup ("");

  return bw_locale_localize_number (c);
}

static void
target_refresh (BwChemView *self)
{
  g_autofree char *text = target_text (self);

  if (!self->target_flagged
      && g_strcmp0 (gtk_editable_get_text (GTK_EDITABLE (self->target_entry)), text) != 0)
    gtk_editable_set_text (GTK_EDITABLE (self->target_entry), text);
}

static void
target_flag (BwChemView *self, const char *message)
{
  self->target_flagged = TRUE;
  flag_widget (GTK_WIDGET (self->target_entry), GTK_WIDGET (self->target_error_label), message);
}

static void
target_unflag (BwChemView *self)
{
  self->target_flagged = FALSE;
  unflag_widget (GTK_WIDGET (self->target_entry), GTK_WIDGET (self->target_error_label),
                 _(TARGET_HELP));
}

/* A typed target becomes one snapshot edit of the project (undoable, validated by the window). */
static void
target_commit (BwChemView *self)
{
  GtkEditable *entry = GTK_EDITABLE (self->target_entry);
  g_autofree char *text = g_strstrip (g_strdup (gtk_editable_get_text (entry)));
  g_autofree char *now = NULL;
  g_autoptr (GError) error = NULL;
  BwProject *copy;
  BwEdit *edit;
  double v = 0;

  if (self->updating)
    return;
  now = target_text (self);
  if (g_strcmp0 (text, now) == 0)
    {
      if (self->target_flagged)
        target_unflag (self);
      return;
    }
  if (text[0] != '\0')
    {
      g_autofree char *plain = bw_locale_delocalize_number (text);
      if (!bw_units_parse (plain, BW_KIND_TURBIDITY, "NTU", _("target settled turbidity"), &v,
                           &error))
        {
          target_flag (self, error->message);
          return;
        }
      if (!(v > 0))
        {
          g_autofree char *msg = g_strdup_printf (_("target settled turbidity: must be above zero "
                                                    "(got %s); leave it empty for none"), text);
          target_flag (self, msg);
          return;
        }
    }
  copy = bw_project_copy (project (self));
  copy->chemistry.target_NTU = v;
  edit = bw_edit_snapshot (copy, _("Set the target settled turbidity"), NULL);
  bw_project_free (copy);
  if (!bw_window_do_edit (self->window, edit, &error))
    {
      target_flag (self, error ? error->message : _("the edit was not accepted"));
      return;
    }
  target_unflag (self); /* ::project-changed has refreshed the page */
}

static void
target_activate (GtkEntry *e, gpointer data)
{
  (void) e;
  target_commit (data);
}

static void
target_leave (GtkEventControllerFocus *c, gpointer data)
{
  (void) c;
  target_commit (data);
}

/* --- the chart --- */

gboolean
bw_chem_view_paint_chart (BwChemView *self, cairo_t *cr, int width, int height, gboolean dark,
                          GError **error)
{
  const BwJarTestRecord *r;
  BwJarChartOptions o;
  g_autoptr (BwChart) chart = NULL;

  g_return_val_if_fail (BW_IS_CHEM_VIEW (self) && cr != NULL, FALSE);
  r = selected_record (self);
  if (r == NULL)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, _("jar test: none is selected"));
      return FALSE;
    }
  bw_jar_chart_options_init (&o);
  bw_jar_chart_options_from_project (&o, project (self));
  o.target_NTU = target_of (self);
  chart = bw_chart_jartest (r, &o, bw_window_get_unit_system (self->window), error);
  if (chart == NULL)
    return FALSE;
  bw_chart_paint (chart, dark ? bw_style_dark () : bw_style_light (), cr, width, height);
  return cairo_status (cr) == CAIRO_STATUS_SUCCESS;
}

static void
chart_draw (GtkDrawingArea *area, cairo_t *cr, int width, int height, gpointer data)
{
  BwChemView *self = data;
  g_autoptr (GError) error = NULL;
  GdkRGBA fg;
  gboolean dark;

  G_GNUC_BEGIN_IGNORE_DEPRECATIONS
  gtk_style_context_get_color (gtk_widget_get_style_context (GTK_WIDGET (area)), &fg);
  G_GNUC_END_IGNORE_DEPRECATIONS
  /* Light text on screen means dark paper (the sketch page decides the same way). */
  dark = 0.299 * fg.red + 0.587 * fg.green + 0.114 * fg.blue > 0.5;
  self->paints++;
  if (width < 40 || height < 40)
    return;
  if (!bw_chem_view_paint_chart (self, cr, width, height, dark, &error))
    {
      const BwStyle *st = dark ? bw_style_dark () : bw_style_light ();
      cairo_set_source_rgb (cr, st->paper.r, st->paper.g, st->paper.b);
      cairo_paint (cr);
      cairo_set_source_rgb (cr, st->ink_muted.r, st->ink_muted.g, st->ink_muted.b);
      cairo_move_to (cr, 16, 28);
      cairo_show_text (cr, error ? error->message : "");
    }
}

/* --- the widget --- */

static void
bw_chem_view_dispose (GObject *object)
{
  BwChemView *self = BW_CHEM_VIEW (object);

  if (self->chooser)
    {
      gtk_native_dialog_destroy (GTK_NATIVE_DIALOG (self->chooser));
      g_clear_object (&self->chooser);
    }
  /* The list emits ::row-selected as its rows go: nothing of the page is left to show it. */
  if (self->jar_list)
    g_signal_handlers_disconnect_by_data (self->jar_list, self);
  gtk_widget_dispose_template (GTK_WIDGET (self), BW_TYPE_CHEM_VIEW);
  G_OBJECT_CLASS (bw_chem_view_parent_class)->dispose (object);
}

static void
bw_chem_view_finalize (GObject *object)
{
  BwChemView *self = BW_CHEM_VIEW (object);

  g_free (self->selected_id);
  G_OBJECT_CLASS (bw_chem_view_parent_class)->finalize (object);
}

static void
bw_chem_view_class_init (BwChemViewClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = bw_chem_view_dispose;
  object_class->finalize = bw_chem_view_finalize;
  gtk_widget_class_set_template_from_resource (widget_class,
                                               "/org/basinwright/Workbench/bw-chem-view.ui");
  gtk_widget_class_bind_template_child (widget_class, BwChemView, caution_label);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, basis_grid);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, edit_error_label);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, results_grid);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, results_note);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, jar_list);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, import_button);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, remove_button);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, jar_error_label);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, record_box);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, jars_grid);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, fit_label);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, target_label);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, target_entry);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, target_error_label);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, use_button);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, chart_area);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, scroller);
  gtk_widget_class_bind_template_child (widget_class, BwChemView, results_scroller);
}

static void
bw_chem_view_init (BwChemView *self)
{
  GtkEventController *focus;
  int row = 0;

  gtk_widget_init_template (GTK_WIDGET (self));
  gtk_label_set_text (self->caution_label, _(BW_CAUTION_TEXT));
  /* The wheel over the sideways-scrolling tables moves the page, as it does anywhere else on
   * it; Shift+wheel scrolls the tables. */
  bw_wheel_forward_vertical (self->results_scroller, self->scroller);
  for (guint i = 0; i < N_CF; i++)
    row = attach_field (self, row, (ChemFieldId) i);

  gtk_accessible_update_property (GTK_ACCESSIBLE (self->jar_list), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Jar tests of the project"), -1);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->import_button),
                                  GTK_ACCESSIBLE_PROPERTY_LABEL, _("Import a jar-test sheet"), -1);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->remove_button),
                                  GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Remove the selected jar test"), -1);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->use_button), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Use this dose: set the dose range from the jar test"), -1);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->target_entry),
                                  GTK_ACCESSIBLE_PROPERTY_LABEL, _("Target settled turbidity"),
                                  -1);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->chart_area), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Chart: settled turbidity and zeta potential against dose, "
                                    "with the chosen dose"), -1);
  gtk_accessible_update_property (GTK_ACCESSIBLE (self->results_grid),
                                  GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Feed, alkalinity and sludge at the design flows"), -1);

  g_signal_connect (self->jar_list, "row-selected", G_CALLBACK (jar_row_selected), self);
  g_signal_connect (self->import_button, "clicked", G_CALLBACK (import_clicked), self);
  g_signal_connect (self->remove_button, "clicked", G_CALLBACK (remove_clicked), self);
  g_signal_connect (self->use_button, "clicked", G_CALLBACK (use_clicked), self);
  g_signal_connect (self->target_entry, "activate", G_CALLBACK (target_activate), self);
  focus = gtk_event_controller_focus_new ();
  g_signal_connect (focus, "leave", G_CALLBACK (target_leave), self);
  gtk_widget_add_controller (GTK_WIDGET (self->target_entry), focus);
  gtk_drawing_area_set_draw_func (self->chart_area, chart_draw, self, NULL);
}

GtkWidget *
bw_chem_view_new (BwWindow *window)
{
  BwChemView *self;

  g_return_val_if_fail (BW_IS_WINDOW (window), NULL);
  self = g_object_new (BW_TYPE_CHEM_VIEW, NULL);
  self->window = window;
  g_signal_connect_object (window, "project-changed", G_CALLBACK (project_changed), self, 0);
  g_signal_connect (self, "map", G_CALLBACK (view_mapped), self);
  refresh (self);
  return GTK_WIDGET (self);
}

GtkWidget *
bw_chem_view_get_field_widget (BwChemView *self, const char *field_id)
{
  ChemField *f;

  g_return_val_if_fail (BW_IS_CHEM_VIEW (self), NULL);
  if (g_strcmp0 (field_id, "target") == 0)
    return GTK_WIDGET (self->target_entry);
  f = field_by_id (self, field_id);
  return f ? f->widget : NULL;
}

GtkWidget *
bw_chem_view_get_field_error (BwChemView *self, const char *field_id)
{
  ChemField *f;

  g_return_val_if_fail (BW_IS_CHEM_VIEW (self), NULL);
  if (g_strcmp0 (field_id, "target") == 0)
    return GTK_WIDGET (self->target_error_label);
  f = field_by_id (self, field_id);
  return f ? f->error_label : NULL;
}

gboolean
bw_chem_view_select_jar_test (BwChemView *self, const char *id)
{
  g_return_val_if_fail (BW_IS_CHEM_VIEW (self), FALSE);
  if (bw_chart_jartest_find_record (project (self), id) == NULL)
    return FALSE;
  g_free (self->selected_id);
  self->selected_id = g_strdup (id);
  refresh (self);
  return TRUE;
}

const char *
bw_chem_view_get_selected_jar_test (BwChemView *self)
{
  g_return_val_if_fail (BW_IS_CHEM_VIEW (self), NULL);
  return self->selected_id;
}

GtkWidget *
bw_chem_view_get_widget (BwChemView *self, const char *name)
{
  g_return_val_if_fail (BW_IS_CHEM_VIEW (self), NULL);
  if (g_strcmp0 (name, "import") == 0)
    return GTK_WIDGET (self->import_button);
  if (g_strcmp0 (name, "remove") == 0)
    return GTK_WIDGET (self->remove_button);
  if (g_strcmp0 (name, "use") == 0)
    return GTK_WIDGET (self->use_button);
  if (g_strcmp0 (name, "chart") == 0)
    return GTK_WIDGET (self->chart_area);
  if (g_strcmp0 (name, "jar-list") == 0)
    return GTK_WIDGET (self->jar_list);
  if (g_strcmp0 (name, "results") == 0)
    return GTK_WIDGET (self->results_grid);
  return NULL;
}

guint
bw_chem_view_get_paint_count (BwChemView *self)
{
  g_return_val_if_fail (BW_IS_CHEM_VIEW (self), 0);
  return self->paints;
}

char *
bw_chem_view_dup_results_text (BwChemView *self)
{
  GString *s = g_string_new (NULL);
  int last_row = -1;

  g_return_val_if_fail (BW_IS_CHEM_VIEW (self), NULL);
  /* Children in attach order: the grid gives each its row. */
  for (GtkWidget *c = gtk_widget_get_first_child (GTK_WIDGET (self->results_grid)); c;
       c = gtk_widget_get_next_sibling (c))
    {
      int col, row, w, h;
      gtk_grid_query_child (self->results_grid, c, &col, &row, &w, &h);
      if (last_row >= 0)
        g_string_append_c (s, row != last_row ? '\n' : '\t');
      g_string_append (s, gtk_label_get_text (GTK_LABEL (c)));
      last_row = row;
    }
  g_string_append_c (s, '\n');
  return g_string_free (s, FALSE);
}
