/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-window-private.h: the window's struct and helpers shared by bw-window*.c. */
#pragma once

#include "engine/bw-evaluate.h"
#include "gui/bw-window.h"

G_BEGIN_DECLS

/* What an editable field changes. */
typedef enum
{
  BW_FIELD_PARAM,        /* a parameter of a unit or stage */
  BW_FIELD_UNIT_NAME,
  BW_FIELD_PROJECT_NAME,
  BW_FIELD_FLOW,         /* sub: BwFlowKind */
  BW_FIELD_TEMPERATURE,  /* sub: BwTempKind */
  BW_FIELD_RAW_WATER,    /* sub: BwRawWaterField */
} BwFieldKind;

/* One editable widget bound to one value of the model. The widget shows the model; a typed
 * value becomes an edit, and a refused one is flagged in place with the reason. */
typedef struct
{
  BwWindow *window;
  BwFieldKind kind;
  char *id;             /* "width", "name", "flow:peak-hour", ... (bw_window_get_field_widget) */
  char *unit_id;        /* the unit or stage (params and names) */
  int param_index;
  guint sub;
  BwQuantityKind qkind; /* for text entries of quantities */
  gboolean optional;    /* empty text: not given */
  GtkWidget *widget;    /* GtkEntry, GtkDropDown or GtkSpinButton */
  GtkWidget *error_label;
  gboolean flagged;
} BwField;

struct _BwWindow
{
  GtkApplicationWindow parent_instance;

  /* Template widgets */
  GtkLabel *title_label;
  GtkLabel *caution_label;
  GMenu *recent_menu;
  GtkMenuButton *add_button;
  GtkLabel *subtitle_label;
  GtkRevealer *recovery_revealer;
  GtkLabel *recovery_label;
  GtkListBox *nav_list;
  GtkSpinButton *parallel_spin;
  GtkSpinButton *standby_spin;
  GtkWidget *counts_grid;
  GtkStack *page_stack;
  GtkWidget *page_switcher;
  GtkLabel *unit_heading;
  GtkLabel *unit_type_label;
  GtkGrid *editor_grid;
  GtkLabel *results_heading;
  GtkToggleButton *every_case_toggle;
  /* The results table: the quantity column (results_names) stays put beside the load-case
   * columns (results_grid), which scroll sideways in results_sideways; results_scroller scrolls
   * both up and down. results_rows holds one vertical size group per row, which keeps the two
   * grids' rows the same height. */
  GtkScrolledWindow *results_scroller;
  GtkScrolledWindow *results_sideways;
  GtkGrid *results_names;
  GtkGrid *results_grid;
  GPtrArray *results_rows;
  /* The results table's shape (unit, columns, rows and their checks) when last built, and its
   * labels in the order they were made: an edit that keeps the shape updates them in place. */
  char *results_shape;
  GPtrArray *results_labels;
  GtkLabel *checks_summary;
  GtkListBox *checks_list;
  GtkGrid *basis_grid;
  GtkListBox *cases_list;
  GtkDropDown *criteria_dropdown;
  GtkLabel *criteria_note;
  GtkDrawingArea *sketch_area;
  GtkLabel *status_label;
  GtkLabel *counts_label;

  /* Owned references */
  BwProject *project;
  BwEditStack *stack;
  BwResults *results;       /* of the project as it is now */
  GArray *checks;           /* BwCheck, against criteria */
  BwCriteriaSet *criteria;  /* the set named by the project (NULL when it cannot be found) */
  GPtrArray *criteria_sets; /* BwCriteriaSet*, every set found, for the chooser */
  char *criteria_error;
  char *path;               /* the project's file, or NULL */
  char *selected_id;        /* unit or stage id selected, or NULL */
  char *selected_train;     /* the train of the selection (or the train row selected) */
  GPtrArray *fields;        /* BwField*, the unit editor's */
  GPtrArray *basis_fields;  /* BwField*, the design basis page's */
  char *autosave_path;
  char *recovery_path;      /* an autosave offered for recovery */
  guint autosave_source;
  gboolean autosave_dirty;  /* edits since the last autosave */
  gboolean updating;        /* set while widgets are filled from the model */
  gboolean closing;         /* close confirmed */
  gboolean checks_stale;    /* the check rows wait for the checks page to be shown */
  gboolean checks_forced;   /* build them even so (checks_flush) */
  BwResults *pending;       /* evaluated by the edit check, adopted when the edit is kept */
  char *criteria_id;        /* the id or path self->criteria was opened from */
  guint n_case_rows;
  char *editor_id;          /* the unit the editor was built for */
  int editor_type;          /* its BwProcessType, -1 for none */
  BwUnitSystem units;
};

/* bw-application.c: the file-chooser filter for project files (a new reference). */
GtkFileFilter *_bw_project_file_filter (void);

/* bw-window.c */
void _bw_window_model_changed (BwWindow *self, gboolean structure);
void _bw_window_set_status (BwWindow *self, const char *message);
void _bw_window_update_title (BwWindow *self);
void _bw_window_replace_project (BwWindow *self, BwProject *p, const char *path, gboolean saved);

/* bw-window-editor.c: the unit editor and the design-basis page. */
void _bw_window_build_editor (BwWindow *self);
void _bw_window_refresh_editor (BwWindow *self);
void _bw_window_build_basis (BwWindow *self);
void _bw_window_refresh_basis (BwWindow *self);
BwField *_bw_window_find_field (BwWindow *self, const char *id);
void _bw_field_free (BwField *f);
/* TRUE when FOCUS is (inside) an editor entry whose text is not the model's value: typing not
 * yet applied, which Ctrl+Z undoes before any model edit. */
gboolean _bw_window_entry_has_typing (BwWindow *self, GtkWidget *focus);

/* bw-window-sketch.c: the drawing page (sketches and charts, zoom, pan, export). */
void _bw_window_sketch_init (BwWindow *self);
/* Selects the unit whose block of the train schematic is at X, Y of the drawing area (when the
 * schematic is in view); FALSE when there is none. */
gboolean _bw_window_sketch_select_at (BwWindow *self, double x, double y);
GtkWidget *_bw_window_sketch_view_dropdown (BwWindow *self);

/* bw-window-files.c: save, save as, close prompt, autosave, recovery. */
void _bw_window_files_init (BwWindow *self);
void _bw_window_files_dispose (BwWindow *self);
void _bw_window_save (BwWindow *self);
void _bw_window_save_as (BwWindow *self);
gboolean _bw_window_close_request (GtkWindow *window);
void _bw_window_forget_autosave (BwWindow *self);
void _bw_window_files_class_init (GtkWidgetClass *widget_class);

/* Sets TEXT on LABEL only when it differs, so an unchanged label keeps its layout. */
void _bw_label_update (GtkLabel *label, const char *text);
/* Gives WIDGET the class WANT (or none, for NULL) among the N mutually exclusive CLASSES,
 * adding or removing only what differs (each change restyles the widget). */
void _bw_widget_class_exclusive (GtkWidget *widget, const char *want, const char *const *classes, guint n);
/* Sets TIP (or none) on WIDGET only when it differs. */
void _bw_widget_tooltip_update (GtkWidget *widget, const char *tip);

G_END_DECLS
