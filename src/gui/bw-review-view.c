/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-review-view.c: the review page. The findings come from bw_review over the window's own
 * results and checks; the compare view from bw_project_diff. Stated values, comments and the
 * tolerance live in the project and change only through undoable edits. */
#include "config.h"

#include "gui/bw-review-view.h"
#include "gui/bw-locale.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

#include "draw/bw-labels.h"
#include "draw/bw-report.h"
#include "engine/bw-edit.h"
#include "engine/bw-review.h"
#include "io/bw-csv.h"
#include "io/bw-project-xml.h"

struct _BwReviewView
{
  GtkBox parent_instance;

  /* Template widgets */
  GtkStack *view_stack;
  GtkButton *import_button;
  GtkEntry *tolerance_entry;
  GtkDropDown *paper_dropdown;
  GtkButton *export_button;
  GtkLabel *tolerance_error;
  GtkLabel *summary_label;
  GtkLabel *findings_note;
  GtkListBox *findings_list;
  GtkButton *compare_button;
  GtkToggleButton *swap_toggle;
  GtkLabel *compare_label;
  GtkListBox *compare_list;

  /* Owned references */
  BwWindow *window;         /* weak pointer */
  GArray *findings;         /* BwFinding, borrowing the window's project and checks; NULL when stale */
  guint refresh_source;
  gboolean stale;           /* the project changed while the page was out of sight */
  char *other_path;         /* the revision compared with */
  BwProject *other;
  BwResults *other_results; /* NULL when it does not evaluate */
  char *other_error;
  gboolean results_open;    /* the compare view's results section is expanded (built) */
};

G_DEFINE_FINAL_TYPE (BwReviewView, bw_review_view, GTK_TYPE_BOX)

/* --- helpers --- */

static void
clear_list (GtkListBox *list)
{
  GtkWidget *child;

  while ((child = gtk_widget_get_first_child (GTK_WIDGET (list))) != NULL)
    gtk_list_box_remove (list, child);
}

/* A label of WIDTH_CHARS characters (0: it takes the room left, ellipsized) appended to BOX. */
static GtkWidget *
cell (GtkBox *box, const char *text, int width_chars, gboolean right)
{
  GtkWidget *l = gtk_label_new (text);

  gtk_label_set_xalign (GTK_LABEL (l), right ? 1.0f : 0.0f);
  gtk_label_set_ellipsize (GTK_LABEL (l), PANGO_ELLIPSIZE_END);
  if (width_chars > 0)
    {
      gtk_label_set_width_chars (GTK_LABEL (l), width_chars);
      gtk_label_set_max_width_chars (GTK_LABEL (l), width_chars);
    }
  else
    {
      gtk_label_set_width_chars (GTK_LABEL (l), 6);
      /* natural up to a criterion's whole title, so the row gives it its free room first */
      gtk_label_set_max_width_chars (GTK_LABEL (l), 40);
      gtk_widget_set_hexpand (l, TRUE);
    }
  gtk_widget_set_tooltip_text (l, text);
  gtk_box_append (box, l);
  return l;
}

static GtkBox *
hbox (GtkBox *parent)
{
  GtkWidget *b = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 10);

  gtk_box_append (parent, b);
  return GTK_BOX (b);
}

static const char *
kind_text (const BwFinding *f)
{
  switch (f->kind)
    {
    case BW_FINDING_DISCREPANCY: return _("Discrepancy");
    case BW_FINDING_AGREES: return _("Agrees");
    case BW_FINDING_NOT_COMPUTED: return _("Not computed");
    default: return f->check && f->check->status == BW_CHECK_FAIL ? _("Criterion fails") : _("Criterion warns");
    }
}

/* The status colour of a finding, from the window's own status classes. */
static const char *
kind_status_class (const BwFinding *f)
{
  switch (f->kind)
    {
    case BW_FINDING_DISCREPANCY: return "bw-status-fail";
    case BW_FINDING_AGREES: return "bw-status-pass";
    case BW_FINDING_NOT_COMPUTED: return "bw-status-na";
    default: return f->check && f->check->status == BW_CHECK_FAIL ? "bw-status-fail" : "bw-status-warn";
    }
}

static char *
case_text (const BwResults *r, int i)
{
  if (r == NULL || i < 0 || (guint) i >= r->n_cases)
    return g_strdup ("—");
  return bw_label_load_case (&r->cases[i]);
}

static const char *
element_id (const BwResults *r, int e)
{
  if (r == NULL || e < 0 || (guint) e >= r->elements->len)
    return "—";
  return ((const BwElementResult *) g_ptr_array_index (r->elements, e))->id;
}

static char *
stated_case_text (const BwResults *r, const BwFinding *f)
{
  g_autofree char *at = case_text (r, f->load_case);

  switch (f->stated->which)
    {
    case BW_STATED_MAXIMUM:
      return f->load_case >= 0 ? g_strdup_printf (_("largest (at %s)"), at) : g_strdup (_("largest"));
    case BW_STATED_MINIMUM:
      return f->load_case >= 0 ? g_strdup_printf (_("smallest (at %s)"), at) : g_strdup (_("smallest"));
    default:
      return bw_label_load_case (&f->stated->load_case);
    }
}

static char *
citation_text (const BwCriterion *c)
{
  GString *s = g_string_new (c->document ? c->document : "");

  if (c->edition && *c->edition)
    g_string_append_printf (s, ", %s", c->edition);
  if (c->clause && *c->clause)
    g_string_append_printf (s, ", %s", c->clause);
  if (c->provenance == BW_PROVENANCE_MEMORY)
    g_string_append (s, _(" — from memory, verify"));
  return g_string_free (s, FALSE);
}

static double
window_tolerance (BwReviewView *self)
{
  const double t = bw_window_get_project (self->window)->review_tolerance;
  return t > 0 && t <= 1 ? t : BW_REVIEW_TOLERANCE_DEFAULT;
}

static void
set_note (GtkLabel *label, const char *text, gboolean error)
{
  gtk_label_set_text (label, text ? text : "");
  gtk_widget_set_visible (GTK_WIDGET (label), text && *text);
  if (error)
    gtk_widget_add_css_class (GTK_WIDGET (label), "error");
  else
    gtk_widget_remove_css_class (GTK_WIDGET (label), "error");
}

/* --- edits --- */

static gboolean
edit_project (BwReviewView *self, BwProject *copy, const char *label, GError **error)
{
  return bw_window_do_edit (self->window, bw_edit_snapshot (copy, label, NULL), error);
}

static void
comment_commit (GtkEntry *entry, BwReviewView *self)
{
  const guint index = GPOINTER_TO_UINT (g_object_get_data (G_OBJECT (entry), "bw-stated")) - 1;
  const BwProject *p;
  const char *text = gtk_editable_get_text (GTK_EDITABLE (entry));
  const BwStated *s;
  g_autoptr (BwProject) copy = NULL;
  g_autoptr (GError) error = NULL;
  BwStated *cs;

  /* Not while the page or the window is being torn down: that is no edit of the person's. */
  if (self->window == NULL || !gtk_widget_get_mapped (GTK_WIDGET (entry))
      || gtk_widget_in_destruction (GTK_WIDGET (self->window)))
    return;
  p = bw_window_get_project (self->window);
  if (index >= p->stated->len)
    return;
  s = g_ptr_array_index (p->stated, index);
  if (g_strcmp0 (s->comment ? s->comment : "", text) == 0)
    return;
  copy = bw_project_copy (p);
  cs = g_ptr_array_index (copy->stated, index);
  g_free (cs->comment);
  cs->comment = *text ? g_strdup (text) : NULL;
  if (!edit_project (self, copy, _("Comment on a finding"), &error))
    set_note (self->findings_note, error->message, TRUE);
}

static void
comment_focus_leave (GtkEventControllerFocus *c, gpointer data)
{
  comment_commit (GTK_ENTRY (gtk_event_controller_get_widget (GTK_EVENT_CONTROLLER (c))), data);
}

static gboolean
parse_tolerance (const char *text, double *out, GError **error)
{
  double v;

  g_autofree char *plain = bw_locale_delocalize_number (text);

  if (!bw_units_parse (plain, BW_KIND_FRACTION, "%", _("tolerance"), &v, error))
    return FALSE;
  if (!(v > 0) || v > 1)
    {
      g_autofree char *c_got = g_strdup_printf ("%g %%", v * 100);
      g_autofree char *got = bw_locale_localize_number (c_got);
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_INVALID_ARGUMENT,
                   _("tolerance: must be greater than 0 %% and at most 100 %% (got %s)"), got);
      return FALSE;
    }
  *out = v;
  return TRUE;
}

static void
tolerance_apply (BwReviewView *self)
{
  const char *text = gtk_editable_get_text (GTK_EDITABLE (self->tolerance_entry));
  g_autoptr (GError) error = NULL;
  double v;

  if (self->window == NULL)
    return;
  if (!parse_tolerance (text, &v, &error))
    {
      gtk_widget_add_css_class (GTK_WIDGET (self->tolerance_entry), "error");
      gtk_widget_set_tooltip_text (GTK_WIDGET (self->tolerance_entry), error->message);
      set_note (self->tolerance_error, error->message, TRUE);
      return;
    }
  gtk_widget_remove_css_class (GTK_WIDGET (self->tolerance_entry), "error");
  gtk_widget_set_tooltip_text (GTK_WIDGET (self->tolerance_entry),
                               _("Relative difference above which a stated value is a discrepancy, in % "
                                 "(Enter applies)"));
  set_note (self->tolerance_error, NULL, TRUE);
  if (fabs (v - window_tolerance (self)) > 1e-12 * v)
    {
      g_autoptr (BwProject) copy = bw_project_copy (bw_window_get_project (self->window));
      copy->review_tolerance = v;
      if (!edit_project (self, copy, _("Review tolerance"), &error))
        set_note (self->tolerance_error, error->message, TRUE);
    }
}

static void
tolerance_focus_leave (GtkEventControllerFocus *c, gpointer data)
{
  BwReviewView *self = data;

  (void) c;
  if (self->window && gtk_widget_get_mapped (GTK_WIDGET (self))
      && !gtk_widget_in_destruction (GTK_WIDGET (self->window)))
    tolerance_apply (self);
}

gboolean
bw_review_view_import_path (BwReviewView *self, const char *path, GError **error)
{
  g_autoptr (GPtrArray) stated = NULL;
  g_autoptr (BwProject) copy = NULL;
  GError *local = NULL;

  g_return_val_if_fail (BW_IS_REVIEW_VIEW (self) && path != NULL, FALSE);
  g_return_val_if_fail (self->window != NULL, FALSE);
  stated = bw_stated_load_csv (path, &local);
  if (stated == NULL)
    {
      set_note (self->findings_note, local->message, TRUE);
      g_propagate_error (error, local);
      return FALSE;
    }
  copy = bw_project_copy (bw_window_get_project (self->window));
  g_ptr_array_unref (copy->stated);
  copy->stated = g_steal_pointer (&stated);
  if (!edit_project (self, copy, _("Import stated values"), &local))
    {
      set_note (self->findings_note, local->message, TRUE);
      g_propagate_error (error, local);
      return FALSE;
    }
  {
    g_autofree char *base = g_path_get_basename (path);
    g_autofree char *msg = g_strdup_printf (g_dngettext (NULL, "Imported %u stated value from %s.",
                                                         "Imported %u stated values from %s.",
                                                         copy->stated->len),
                                            bw_window_get_project (self->window)->stated->len, base);
    set_note (self->findings_note, msg, FALSE);
  }
  return TRUE;
}

/* --- the findings list --- */

static void
finding_activated (GtkListBox *list, GtkListBoxRow *row, gpointer data)
{
  BwReviewView *self = data;
  const char *id = g_object_get_data (G_OBJECT (row), "bw-id");

  (void) list;
  if (self->window && id && !bw_window_select_unit (self->window, id))
    {
      g_autofree char *msg = g_strdup_printf (_("%s: there is no such unit or stage in this project."), id);
      set_note (self->findings_note, msg, TRUE);
    }
}

static GtkWidget *
finding_row (BwReviewView *self, const BwResults *r, const BwFinding *f, guint stated_index)
{
  GtkWidget *row = gtk_list_box_row_new ();
  GtkBox *box = GTK_BOX (gtk_box_new (GTK_ORIENTATION_VERTICAL, 2));
  GtkBox *top = hbox (box), *bottom = hbox (box);
  GtkWidget *badge;
  const BwUnitSystem units = bw_window_get_unit_system (self->window);
  const char *element;
  g_autofree char *accessible = NULL;

  gtk_widget_set_margin_start (GTK_WIDGET (box), 6);
  gtk_widget_set_margin_end (GTK_WIDGET (box), 6);
  gtk_widget_set_margin_top (GTK_WIDGET (box), 4);
  gtk_widget_set_margin_bottom (GTK_WIDGET (box), 4);
  badge = cell (top, kind_text (f), 15, FALSE);
  gtk_label_set_xalign (GTK_LABEL (badge), 0.5f);
  gtk_widget_add_css_class (badge, "bw-status");
  gtk_widget_add_css_class (badge, kind_status_class (f));
  {
    g_autofree char *cls = g_strdup_printf ("bw-finding-%s", bw_finding_kind_name (f->kind));
    gtk_widget_add_css_class (row, cls);
  }
  g_object_set_data (G_OBJECT (row), "bw-kind", GINT_TO_POINTER (f->kind + 1));

  if (f->stated)
    {
      const BwQuantityInfo *info = bw_quantity_info (f->stated->quantity);
      g_autofree char *sv = bw_locale_format (f->stated->value, info->kind, units);
      g_autofree char *cv = f->kind != BW_FINDING_NOT_COMPUTED ? bw_locale_format (f->computed, info->kind, units)
                                                                : g_strdup ("—");
      g_autofree char *dv = f->kind != BW_FINDING_NOT_COMPUTED ? bw_label_relative_change (f->relative_difference)
                                                                : g_strdup ("—");
      g_autofree char *ct = stated_case_text (r, f);
      g_autofree char *line = f->stated->line ? g_strdup_printf (_("line %u · %s"), f->stated->line, ct)
                                              : g_strdup (ct);
      g_autofree char *st = g_strdup_printf (_("stated %s"), sv);
      g_autofree char *cp = g_strdup_printf (_("computed %s"), cv);
      GtkWidget *entry = gtk_entry_new ();
      GtkEventController *focus = gtk_event_controller_focus_new ();
      g_autofree char *entry_name = NULL;

      element = f->stated->element;
      cell (top, element, 12, FALSE);
      cell (top, bw_label_text (info->label), 0, FALSE);
      cell (top, st, 16, TRUE);
      cell (top, cp, 18, TRUE);
      cell (top, dv, 7, TRUE);
      gtk_widget_add_css_class (cell (bottom, line, 0, FALSE), "dim-label");
      gtk_editable_set_text (GTK_EDITABLE (entry), f->stated->comment ? f->stated->comment : "");
      gtk_entry_set_placeholder_text (GTK_ENTRY (entry), _("Reviewer's comment"));
      gtk_widget_set_hexpand (entry, TRUE);
      entry_name = g_strdup_printf (_("Comment on %s, %s"), element, bw_label_text (info->label));
      gtk_accessible_update_property (GTK_ACCESSIBLE (entry), GTK_ACCESSIBLE_PROPERTY_LABEL, entry_name, -1);
      gtk_widget_set_tooltip_text (entry, _("The reviewer's comment on this stated value (Enter keeps it; it "
                                            "is saved in the project)"));
      g_object_set_data (G_OBJECT (entry), "bw-stated", GUINT_TO_POINTER (stated_index + 1));
      g_signal_connect (entry, "activate", G_CALLBACK (comment_commit), self);
      g_signal_connect (focus, "leave", G_CALLBACK (comment_focus_leave), self);
      gtk_widget_add_controller (entry, focus);
      gtk_box_append (bottom, entry);
      g_object_set_data (G_OBJECT (row), "bw-stated", GUINT_TO_POINTER (stated_index + 1));
      g_object_set_data (G_OBJECT (row), "bw-comment", entry);
      accessible = g_strdup_printf ("%s: %s %s, %s, %s, %s", kind_text (f), element,
                                    bw_label_text (info->label), st, cp, dv);
    }
  else
    {
      const BwCheck *c = f->check;
      const BwQuantityKind qk = bw_quantity_info (c->criterion->quantity)->kind;
      g_autofree char *value = bw_locale_format (c->value, qk, units);
      g_autofree char *limit = NULL;
      g_autofree char *cite = citation_text (c->criterion);
      g_autofree char *ct = case_text (r, c->governing_case);
      g_autofree char *line = NULL;

      if (c->has_limit)
        {
          g_autofree char *lv = bw_locale_format (c->limit, qk, units);
          limit = g_strdup_printf ("%s %s%s", c->limit_is_max ? "≤" : "≥", lv,
                                   c->limit_is_required ? "" : _(" (preferred)"));
        }
      else
        limit = g_strdup ("—");
      element = element_id (r, c->element);
      line = g_strdup_printf (_("%s · clause: %s"), ct, cite);
      cell (top, element, 12, FALSE);
      cell (top, c->criterion->title, 0, FALSE);
      cell (top, value, 13, TRUE);
      cell (top, limit, 22, TRUE);
      gtk_widget_add_css_class (cell (bottom, line, 0, FALSE), "dim-label");
      accessible = g_strdup_printf ("%s: %s %s, %s, limit %s; %s", kind_text (f), element, c->criterion->title,
                                    value, limit, cite);
    }
  if (element && strcmp (element, "—") != 0)
    g_object_set_data_full (G_OBJECT (row), "bw-id", g_strdup (element), g_free);
  gtk_accessible_update_property (GTK_ACCESSIBLE (row), GTK_ACCESSIBLE_PROPERTY_LABEL, accessible, -1);
  gtk_list_box_row_set_child (GTK_LIST_BOX_ROW (row), GTK_WIDGET (box));
  return row;
}

static void
findings_rebuild (BwReviewView *self)
{
  const BwProject *p = bw_window_get_project (self->window);
  const BwResults *r = bw_window_get_results (self->window);
  GArray *checks = bw_window_get_checks (self->window);
  const double tol = window_tolerance (self);
  guint n[4] = { 0 }, focus_index = 0, cursor = 0;
  GtkRoot *root = gtk_widget_get_root (GTK_WIDGET (self));
  GtkWidget *focus = root ? gtk_root_get_focus (root) : NULL;
  g_autofree char *summary = NULL;

  /* A comment entry that had the focus gets it back after the rebuild. */
  for (GtkWidget *w = focus; w; w = gtk_widget_get_parent (w))
    if (GTK_IS_ENTRY (w) && g_object_get_data (G_OBJECT (w), "bw-stated"))
      {
        focus_index = GPOINTER_TO_UINT (g_object_get_data (G_OBJECT (w), "bw-stated"));
        cursor = (guint) gtk_editable_get_position (GTK_EDITABLE (w));
        break;
      }
  clear_list (self->findings_list);
  g_clear_pointer (&self->findings, g_array_unref);
  if (gtk_widget_has_css_class (GTK_WIDGET (self->tolerance_entry), "error") == FALSE)
    {
      g_autofree char *c_t = bw_format_number (tol * 100, 4);
      g_autofree char *t = bw_locale_localize_number (c_t);
      gtk_editable_set_text (GTK_EDITABLE (self->tolerance_entry), t);
    }
  if (r == NULL)
    {
      gtk_label_set_text (self->summary_label, _("The project does not evaluate: fix its inputs to review it."));
      gtk_widget_set_sensitive (GTK_WIDGET (self->export_button), FALSE);
      return;
    }
  self->findings = bw_review (r, p->stated, checks, tol);
  for (guint i = 0; i < self->findings->len; i++)
    {
      const BwFinding *f = &g_array_index (self->findings, BwFinding, i);
      GtkWidget *row = finding_row (self, r, f, i);
      n[f->kind]++;
      gtk_list_box_append (self->findings_list, row);
      if (f->stated && focus_index == i + 1)
        {
          GtkWidget *e = g_object_get_data (G_OBJECT (row), "bw-comment");
          gtk_widget_grab_focus (e);
          gtk_editable_set_position (GTK_EDITABLE (e), (int) cursor);
        }
    }
  if (p->stated->len == 0)
    summary = g_strdup_printf (_("No stated values yet: import a submittal's CSV. %u criteria findings."),
                               n[BW_FINDING_CRITERION]);
  else
    summary = g_strdup_printf (_("%u discrepancies, %u agree, %u not computed, %u criteria findings "
                                 "(tolerance %s %%)."),
                               n[BW_FINDING_DISCREPANCY], n[BW_FINDING_AGREES], n[BW_FINDING_NOT_COMPUTED],
                               n[BW_FINDING_CRITERION], gtk_editable_get_text (GTK_EDITABLE (self->tolerance_entry)));
  gtk_label_set_text (self->summary_label, summary);
  gtk_widget_set_sensitive (GTK_WIDGET (self->export_button), bw_window_get_criteria (self->window) != NULL);
}

/* --- the compare view --- */

/* The quantity kind of a numeric change, to show it in the window's units; FALSE for a text. The
 * engine records the kind with each change; a plain number among the inputs (a count, pH) is shown
 * as the engine wrote it. */
static gboolean
change_kind (const BwChange *c, BwQuantityKind *out)
{
  if (c->kind == BW_CHANGE_CHECK || !c->numeric)
    return FALSE;
  if (c->kind == BW_CHANGE_INPUT && c->quantity_kind == BW_KIND_NUMBER)
    return FALSE;
  *out = c->quantity_kind;
  return TRUE;
}

static char *
change_value (const BwChange *c, gboolean new_side, gboolean numeric, BwQuantityKind kind, BwUnitSystem units)
{
  const gboolean has = new_side ? c->has_new : c->has_old;

  if (!has)
    return g_strdup ("—");
  if (numeric)
    return bw_locale_format (new_side ? c->new_value : c->old_value, kind, units);
  return g_strdup (new_side ? c->new_text : c->old_text);
}

static GtkWidget *
group_row (const char *title)
{
  GtkWidget *row = gtk_list_box_row_new ();
  GtkWidget *l = gtk_label_new (title);

  gtk_label_set_xalign (GTK_LABEL (l), 0);
  gtk_widget_add_css_class (l, "heading");
  gtk_widget_set_margin_top (l, 8);
  gtk_widget_set_margin_bottom (l, 2);
  gtk_list_box_row_set_child (GTK_LIST_BOX_ROW (row), l);
  gtk_list_box_row_set_activatable (GTK_LIST_BOX_ROW (row), FALSE);
  return row;
}

/* |relative change| of a numeric change, for ordering: the larger first; -1 for a text (after
 * every number), and a change from or to zero counts as the largest. */
static double
change_size (const BwChange *c)
{
  if (!c->numeric || !c->has_old || !c->has_new)
    return -1.0;
  if (c->old_value == 0.0)
    return c->new_value == 0.0 ? 0.0 : G_MAXDOUBLE;
  return fabs (c->new_value - c->old_value) / fabs (c->old_value);
}

typedef struct
{
  const BwChange *c;
  guint index; /* the engine's order, to keep the sort stable */
} Ranked;

/* Project-level changes first, then by unit in the engine's order of first mention; in a unit,
 * the largest relative change first, texts last. */
static int
ranked_cmp (gconstpointer pa, gconstpointer pb, gpointer data)
{
  const Ranked *a = pa, *b = pb;
  GHashTable *unit_rank = data;
  const guint ua = a->c->unit_id ? GPOINTER_TO_UINT (g_hash_table_lookup (unit_rank, a->c->unit_id)) : 0;
  const guint ub = b->c->unit_id ? GPOINTER_TO_UINT (g_hash_table_lookup (unit_rank, b->c->unit_id)) : 0;
  double sa, sb;

  if (ua != ub)
    return ua < ub ? -1 : 1;
  sa = change_size (a->c);
  sb = change_size (b->c);
  if (sa != sb)
    return sa > sb ? -1 : 1;
  return a->index < b->index ? -1 : a->index > b->index;
}

static GtkWidget *
change_row (const BwChange *c, BwUnitSystem units)
{
  BwQuantityKind qk = BW_KIND_NUMBER;
  const gboolean numeric = change_kind (c, &qk);
  g_autofree char *ov = change_value (c, FALSE, numeric, qk, units);
  g_autofree char *nv = change_value (c, TRUE, numeric, qk, units);
  g_autofree char *acc = NULL;
  GtkWidget *row = gtk_list_box_row_new ();
  GtkBox *g = GTK_BOX (gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 10));

  gtk_widget_set_margin_start (GTK_WIDGET (g), 24);
  gtk_widget_set_margin_end (GTK_WIDGET (g), 6);
  cell (g, c->where, 30, FALSE);
  cell (g, c->what, 0, FALSE);
  cell (g, ov, 16, TRUE);
  cell (g, "→", 1, FALSE);
  cell (g, nv, 16, FALSE);
  gtk_list_box_row_set_child (GTK_LIST_BOX_ROW (row), GTK_WIDGET (g));
  g_object_set_data (G_OBJECT (row), "bw-change-kind", GINT_TO_POINTER (c->kind + 1));
  g_object_set_data_full (G_OBJECT (row), "bw-where", g_strdup (c->where), g_free);
  g_object_set_data_full (G_OBJECT (row), "bw-what", g_strdup (c->what), g_free);
  g_object_set_data_full (G_OBJECT (row), "bw-old", g_strdup (ov), g_free);
  g_object_set_data_full (G_OBJECT (row), "bw-new", g_strdup (nv), g_free);
  g_object_set_data_full (G_OBJECT (row), "bw-unit", g_strdup (c->unit_id), g_free);
  acc = g_strdup_printf ("%s, %s: %s to %s", c->where, c->what, ov, nv);
  gtk_accessible_update_property (GTK_ACCESSIBLE (row), GTK_ACCESSIBLE_PROPERTY_LABEL, acc, -1);
  return row;
}

static void compare_rebuild (BwReviewView *self);

static void
results_expanded (GtkExpander *e, GParamSpec *pspec, gpointer data)
{
  BwReviewView *self = data;

  (void) pspec;
  if (gtk_expander_get_expanded (e) == self->results_open)
    return;
  self->results_open = gtk_expander_get_expanded (e);
  /* The list is rebuilt, this expander with it (GObject holds it through its own notify). */
  compare_rebuild (self);
}

/* One section: its heading with the count, then a heading per unit (or for the plant) and the
 * unit's changes, largest first. The results section is an expander, collapsed until asked
 * for; its rows are built only then. */
static void
compare_section (BwReviewView *self, GPtrArray *changes, BwChangeKind kind, GHashTable *unit_rank,
                 BwUnitSystem units)
{
  g_autoptr (GArray) ranked = g_array_new (FALSE, FALSE, sizeof (Ranked));
  g_autofree char *title = NULL;
  const char *last_unit = "";
  GtkWidget *head;

  for (guint i = 0; i < changes->len; i++)
    {
      const BwChange *c = g_ptr_array_index (changes, i);
      if (c->kind == kind)
        g_array_append_val (ranked, ((Ranked) { c, i }));
    }
  switch (kind)
    {
    case BW_CHANGE_CHECK:
      title = g_strdup_printf (ngettext ("%u check outcome changed", "%u check outcomes changed", ranked->len),
                               ranked->len);
      break;
    case BW_CHANGE_INPUT:
      title = g_strdup_printf (ngettext ("%u input changed", "%u inputs changed", ranked->len), ranked->len);
      break;
    default:
      title = g_strdup_printf (ngettext ("%u result changed", "%u results changed", ranked->len), ranked->len);
      break;
    }
  if (kind == BW_CHANGE_RESULT && ranked->len > 0)
    {
      GtkWidget *ex = gtk_expander_new (title);
      head = gtk_list_box_row_new ();
      gtk_expander_set_expanded (GTK_EXPANDER (ex), self->results_open);
      gtk_widget_add_css_class (gtk_expander_get_label_widget (GTK_EXPANDER (ex)), "heading");
      gtk_widget_set_margin_top (ex, 8);
      gtk_widget_set_tooltip_text (ex, _("The computed results that moved with the inputs: shown on request"));
      g_signal_connect (ex, "notify::expanded", G_CALLBACK (results_expanded), self);
      gtk_list_box_row_set_child (GTK_LIST_BOX_ROW (head), ex);
      gtk_list_box_row_set_activatable (GTK_LIST_BOX_ROW (head), FALSE);
      g_object_set_data (G_OBJECT (head), "bw-results-expander", ex);
      gtk_list_box_append (self->compare_list, head);
      if (!self->results_open)
        return;
    }
  else
    gtk_list_box_append (self->compare_list, group_row (title));
  g_array_sort_with_data (ranked, ranked_cmp, unit_rank);
  for (guint i = 0; i < ranked->len; i++)
    {
      const BwChange *c = g_array_index (ranked, Ranked, i).c;
      if (g_strcmp0 (c->unit_id, last_unit) != 0)
        {
          guint n = 0;
          g_autofree char *group = NULL;
          GtkWidget *row, *l;
          for (guint k = i; k < ranked->len && g_strcmp0 (g_array_index (ranked, Ranked, k).c->unit_id, c->unit_id) == 0; k++)
            n++;
          /* TRANSLATORS: a unit's id, its kind and its count of changes: "north-sed, rectangular basin: 3 changes" */
          group = c->unit_id ? g_strdup_printf (ngettext ("%s, %s: %u change", "%s, %s: %u changes", n), c->unit_id,
                                                bw_label_process_type (c->unit_type), n)
                             : g_strdup_printf (ngettext ("The plant (design basis, chemistry): %u change",
                                                          "The plant (design basis, chemistry): %u changes", n), n);
          row = gtk_list_box_row_new ();
          l = gtk_label_new (group);
          gtk_label_set_xalign (GTK_LABEL (l), 0);
          gtk_widget_set_margin_start (l, 12);
          gtk_widget_set_margin_top (l, 4);
          gtk_widget_add_css_class (l, "dim-label");
          gtk_list_box_row_set_child (GTK_LIST_BOX_ROW (row), l);
          gtk_list_box_row_set_activatable (GTK_LIST_BOX_ROW (row), FALSE);
          g_object_set_data_full (G_OBJECT (row), "bw-unit-heading", g_strdup (c->unit_id ? c->unit_id : ""), g_free);
          gtk_list_box_append (self->compare_list, row);
          last_unit = c->unit_id;
        }
      gtk_list_box_append (self->compare_list, change_row (c, units));
    }
}

static void
compare_rebuild (BwReviewView *self)
{
  const BwProject *mine = bw_window_get_project (self->window);
  const BwResults *my_r = bw_window_get_results (self->window);
  GArray *my_c = bw_window_get_checks (self->window);
  const BwCriteriaSet *set = bw_window_get_criteria (self->window);
  const gboolean swap = gtk_toggle_button_get_active (self->swap_toggle);
  const BwUnitSystem units = bw_window_get_unit_system (self->window);
  static const BwChangeKind order[] = { BW_CHANGE_CHECK, BW_CHANGE_INPUT, BW_CHANGE_RESULT };
  g_autoptr (GArray) other_c = NULL;
  g_autoptr (GPtrArray) changes = NULL;
  g_autoptr (GHashTable) unit_rank = NULL;
  const BwProject *a, *b;
  guint counts[3] = { 0 };
  g_autofree char *base = NULL;
  g_autofree char *msg = NULL;

  clear_list (self->compare_list);
  gtk_widget_set_sensitive (GTK_WIDGET (self->swap_toggle), self->other != NULL);
  if (self->other == NULL)
    {
      set_note (self->compare_label, self->other_error ? self->other_error
                                                        : _("Choose another revision of the project to compare "
                                                            "this one with."),
                self->other_error != NULL);
      return;
    }
  if (self->other_results && set)
    other_c = bw_check_results (self->other_results, set);
  a = swap ? mine : self->other;
  b = swap ? self->other : mine;
  changes = swap ? bw_project_diff (a, b, my_r, self->other_results, my_c, other_c)
                 : bw_project_diff (a, b, self->other_results, my_r, other_c, my_c);
  /* Units in the order the engine first names them (the plant's order), the plant first. */
  unit_rank = g_hash_table_new (g_str_hash, g_str_equal);
  for (guint i = 0; i < changes->len; i++)
    {
      const BwChange *c = g_ptr_array_index (changes, i);
      counts[c->kind]++;
      if (c->unit_id && !g_hash_table_contains (unit_rank, c->unit_id))
        g_hash_table_insert (unit_rank, c->unit_id, GUINT_TO_POINTER (g_hash_table_size (unit_rank) + 1));
    }
  base = g_path_get_basename (self->other_path);
  msg = g_strdup_printf (swap ? _("Old: this window's project; new: %s. %u inputs, %u results and %u check "
                                  "outcomes changed%s.")
                              : _("Old: %s; new: this window's project. %u inputs, %u results and %u check "
                                  "outcomes changed%s."),
                         base, counts[0], counts[1], counts[2],
                         self->other_results == NULL ? _(" (the other revision does not evaluate: inputs only)")
                         : set ? _(", both checked against this window's criteria set") : "");
  set_note (self->compare_label, msg, FALSE);
  for (guint k = 0; k < G_N_ELEMENTS (order); k++)
    compare_section (self, changes, order[k], unit_rank, units);
}

gboolean
bw_review_view_compare_with (BwReviewView *self, const char *path, GError **error)
{
  GError *local = NULL;
  BwProject *p;

  g_return_val_if_fail (BW_IS_REVIEW_VIEW (self) && path != NULL, FALSE);
  g_clear_pointer (&self->other, bw_project_free);
  g_clear_pointer (&self->other_results, bw_results_free);
  g_clear_pointer (&self->other_error, g_free);
  g_free (self->other_path);
  self->other_path = g_strdup (path);
  self->results_open = FALSE; /* another revision: its results start collapsed */
  p = bw_project_load (path, &local);
  if (p == NULL)
    {
      self->other_error = g_strdup (local->message);
      g_propagate_error (error, local);
      if (self->window)
        compare_rebuild (self);
      return FALSE;
    }
  self->other = p;
  self->other_results = bw_project_evaluate (p, NULL); /* NULL: compared on inputs only, and said so */
  if (self->window)
    compare_rebuild (self);
  return TRUE;
}

/* --- refresh --- */

void
bw_review_view_refresh (BwReviewView *self)
{
  g_return_if_fail (BW_IS_REVIEW_VIEW (self));
  g_clear_handle_id (&self->refresh_source, g_source_remove);
  if (self->window == NULL)
    return;
  findings_rebuild (self);
  compare_rebuild (self);
}

static gboolean
refresh_idle (gpointer data)
{
  BwReviewView *self = data;

  self->refresh_source = 0;
  /* Out of sight, the findings wait (an edit elsewhere stays quick); shown, they are rebuilt. */
  if (!gtk_widget_get_mapped (GTK_WIDGET (self)))
    {
      self->stale = TRUE;
      return G_SOURCE_REMOVE;
    }
  self->stale = FALSE;
  bw_review_view_refresh (self);
  return G_SOURCE_REMOVE;
}

static void
view_mapped (GtkWidget *widget, gpointer data)
{
  BwReviewView *self = data;

  (void) widget;
  if (self->stale && self->refresh_source == 0)
    self->refresh_source = g_idle_add (refresh_idle, self);
}

static void
project_changed (BwWindow *window, gboolean structure, gpointer data)
{
  BwReviewView *self = data;

  (void) window;
  (void) structure;
  /* The findings borrow the old project and checks: drop them now, rebuild when idle (so an
   * entry whose edit caused this is not destroyed inside its own handler). */
  g_clear_pointer (&self->findings, g_array_unref);
  if (self->refresh_source == 0)
    self->refresh_source = g_idle_add (refresh_idle, self);
}

/* --- files --- */

static BwReportPaper
paper (BwReviewView *self)
{
  return gtk_drop_down_get_selected (self->paper_dropdown) == 1 ? BW_REPORT_PAPER_LETTER : BW_REPORT_PAPER_A4;
}

gboolean
bw_review_view_export_findings_to (BwReviewView *self, const char *path, GError **error)
{
  const BwResults *r;
  const BwCriteriaSet *set;

  g_return_val_if_fail (BW_IS_REVIEW_VIEW (self) && path != NULL, FALSE);
  g_return_val_if_fail (self->window != NULL, FALSE);
  if (self->refresh_source)
    bw_review_view_refresh (self);
  r = bw_window_get_results (self->window);
  set = bw_window_get_criteria (self->window);
  if (r == NULL || set == NULL || self->findings == NULL)
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_FAILED, "%s",
                   r == NULL ? _("The project does not evaluate: there are no findings to report.")
                             : _("The findings report needs a criteria set: choose one on the design basis page."));
      return FALSE;
    }
  return bw_review_report_write_pdf (bw_window_get_project (self->window), r, self->findings, set,
                                     window_tolerance (self), paper (self), bw_window_get_unit_system (self->window),
                                     path, error);
}

typedef enum { CHOOSE_IMPORT, CHOOSE_EXPORT, CHOOSE_COMPARE } ChooseKind;

static void
chooser_response (GtkNativeDialog *dialog, int response, gpointer data)
{
  BwReviewView *self = data;
  const ChooseKind kind = GPOINTER_TO_INT (g_object_get_data (G_OBJECT (dialog), "bw-kind"));

  if (response == GTK_RESPONSE_ACCEPT && self->window)
    {
      g_autoptr (GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      g_autofree char *path = file ? g_file_get_path (file) : NULL;
      g_autoptr (GError) error = NULL;
      if (path == NULL)
        set_note (kind == CHOOSE_COMPARE ? self->compare_label : self->findings_note,
                  _("The chosen place is not a local file."), TRUE);
      else if (kind == CHOOSE_IMPORT)
        bw_review_view_import_path (self, path, NULL);
      else if (kind == CHOOSE_COMPARE)
        bw_review_view_compare_with (self, path, NULL);
      else
        {
          g_autofree char *msg = NULL;
          if (!g_str_has_suffix (path, ".pdf"))
            {
              char *with = g_strconcat (path, ".pdf", NULL);
              g_free (path);
              path = with;
            }
          if (bw_review_view_export_findings_to (self, path, &error))
            msg = g_strdup_printf (_("Wrote the findings report to %s."), path);
          else
            msg = g_strdup_printf (_("Findings report not written: %s"), error->message);
          set_note (self->findings_note, msg, error != NULL);
        }
    }
  gtk_native_dialog_destroy (dialog);
  g_object_unref (dialog);
  g_object_unref (self);
}

static void
choose (BwReviewView *self, ChooseKind kind)
{
  static const char *const titles[] = { N_("Import Stated Values"), N_("Export the Findings Report"),
                                        N_("Compare With Another Revision") };
  static const char *const accept[] = { N_("_Import"), N_("_Export"), N_("_Compare") };
  static const char *const filter_names[] = { N_("Stated values (*.csv)"), N_("PDF documents (*.pdf)"),
                                              N_("Basinwright projects (*.bwproj)") };
  static const char *const suffixes[] = { "csv", "pdf", "bwproj" };
  GtkRoot *root = gtk_widget_get_root (GTK_WIDGET (self));
  GtkFileChooserNative *d = gtk_file_chooser_native_new (_(titles[kind]), GTK_IS_WINDOW (root) ? GTK_WINDOW (root) : NULL,
                                                         kind == CHOOSE_EXPORT ? GTK_FILE_CHOOSER_ACTION_SAVE
                                                                               : GTK_FILE_CHOOSER_ACTION_OPEN,
                                                         _(accept[kind]), _("_Cancel"));
  g_autoptr (GtkFileFilter) filter = gtk_file_filter_new ();

  gtk_file_filter_set_name (filter, _(filter_names[kind]));
  gtk_file_filter_add_suffix (filter, suffixes[kind]);
  gtk_file_chooser_add_filter (GTK_FILE_CHOOSER (d), filter);
  if (kind == CHOOSE_EXPORT)
    gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (d), "review-findings.pdf");
  g_object_set_data (G_OBJECT (d), "bw-kind", GINT_TO_POINTER (kind));
  g_signal_connect (d, "response", G_CALLBACK (chooser_response), g_object_ref (self));
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (d));
}

static void
import_clicked (BwReviewView *self)
{
  choose (self, CHOOSE_IMPORT);
}

static void
export_clicked (BwReviewView *self)
{
  choose (self, CHOOSE_EXPORT);
}

static void
compare_clicked (BwReviewView *self)
{
  choose (self, CHOOSE_COMPARE);
}

static void
swap_toggled (BwReviewView *self)
{
  if (self->window)
    compare_rebuild (self);
}

/* --- accessors --- */

GtkWidget *
bw_review_view_get_findings_list (BwReviewView *self)
{
  g_return_val_if_fail (BW_IS_REVIEW_VIEW (self), NULL);
  return GTK_WIDGET (self->findings_list);
}

GtkWidget *
bw_review_view_get_compare_list (BwReviewView *self)
{
  g_return_val_if_fail (BW_IS_REVIEW_VIEW (self), NULL);
  return GTK_WIDGET (self->compare_list);
}

GtkWidget *
bw_review_view_get_tolerance_entry (BwReviewView *self)
{
  g_return_val_if_fail (BW_IS_REVIEW_VIEW (self), NULL);
  return GTK_WIDGET (self->tolerance_entry);
}

const char *
bw_review_view_get_summary (BwReviewView *self)
{
  g_return_val_if_fail (BW_IS_REVIEW_VIEW (self), NULL);
  return gtk_label_get_text (self->summary_label);
}

const char *
bw_review_view_get_findings_note (BwReviewView *self)
{
  g_return_val_if_fail (BW_IS_REVIEW_VIEW (self), NULL);
  return gtk_label_get_text (self->findings_note);
}

const char *
bw_review_view_get_compare_note (BwReviewView *self)
{
  g_return_val_if_fail (BW_IS_REVIEW_VIEW (self), NULL);
  return gtk_label_get_text (self->compare_label);
}

void
bw_review_view_show (BwReviewView *self, const char *name)
{
  g_return_if_fail (BW_IS_REVIEW_VIEW (self));
  gtk_stack_set_visible_child_name (self->view_stack, name);
}

/* --- GObject --- */

static void
bw_review_view_dispose (GObject *object)
{
  BwReviewView *self = BW_REVIEW_VIEW (object);

  g_clear_handle_id (&self->refresh_source, g_source_remove);
  if (self->window)
    {
      g_signal_handlers_disconnect_by_data (self->window, self);
      g_object_remove_weak_pointer (G_OBJECT (self->window), (gpointer *) &self->window);
      self->window = NULL;
    }
  g_clear_pointer (&self->findings, g_array_unref);
  gtk_widget_dispose_template (GTK_WIDGET (self), BW_TYPE_REVIEW_VIEW);
  G_OBJECT_CLASS (bw_review_view_parent_class)->dispose (object);
}

static void
bw_review_view_finalize (GObject *object)
{
  BwReviewView *self = BW_REVIEW_VIEW (object);

  g_clear_pointer (&self->other, bw_project_free);
  g_clear_pointer (&self->other_results, bw_results_free);
  g_free (self->other_path);
  g_free (self->other_error);
  G_OBJECT_CLASS (bw_review_view_parent_class)->finalize (object);
}

static void
bw_review_view_class_init (BwReviewViewClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = bw_review_view_dispose;
  object_class->finalize = bw_review_view_finalize;
  gtk_widget_class_set_template_from_resource (widget_class, "/org/basinwright/Workbench/bw-review-view.ui");
#define BIND(name) gtk_widget_class_bind_template_child (widget_class, BwReviewView, name)
  BIND (view_stack);
  BIND (import_button);
  BIND (tolerance_entry);
  BIND (paper_dropdown);
  BIND (export_button);
  BIND (tolerance_error);
  BIND (summary_label);
  BIND (findings_note);
  BIND (findings_list);
  BIND (compare_button);
  BIND (swap_toggle);
  BIND (compare_label);
  BIND (compare_list);
#undef BIND
}

static void
bw_review_view_init (BwReviewView *self)
{
  GtkEventController *focus = gtk_event_controller_focus_new ();

  gtk_widget_init_template (GTK_WIDGET (self));
  g_signal_connect_swapped (self->import_button, "clicked", G_CALLBACK (import_clicked), self);
  g_signal_connect_swapped (self->export_button, "clicked", G_CALLBACK (export_clicked), self);
  g_signal_connect_swapped (self->compare_button, "clicked", G_CALLBACK (compare_clicked), self);
  g_signal_connect_swapped (self->swap_toggle, "toggled", G_CALLBACK (swap_toggled), self);
  g_signal_connect_swapped (self->tolerance_entry, "activate", G_CALLBACK (tolerance_apply), self);
  g_signal_connect (focus, "leave", G_CALLBACK (tolerance_focus_leave), self);
  gtk_widget_add_controller (GTK_WIDGET (self->tolerance_entry), focus);
  g_signal_connect (self->findings_list, "row-activated", G_CALLBACK (finding_activated), self);
  set_note (self->findings_note, NULL, FALSE);
}

GtkWidget *
bw_review_view_new (BwWindow *window)
{
  BwReviewView *self;

  g_return_val_if_fail (BW_IS_WINDOW (window), NULL);
  self = g_object_new (BW_TYPE_REVIEW_VIEW, NULL);
  self->window = window;
  g_object_add_weak_pointer (G_OBJECT (window), (gpointer *) &self->window);
  g_signal_connect (window, "project-changed", G_CALLBACK (project_changed), self);
  g_signal_connect (self, "map", G_CALLBACK (view_mapped), self);
  self->refresh_source = g_idle_add (refresh_idle, self);
  return GTK_WIDGET (self);
}
