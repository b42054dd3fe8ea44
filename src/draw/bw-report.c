/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-report.c: the submittal report and the findings report as paginated PDF.
 *
 * A small flow layout: a cursor moves down the page; paragraphs, tables and figures are measured
 * with Pango before they are placed, and a block that does not fit starts a new page (a table
 * repeats its header there). The document is laid out repeatedly until the page numbers it
 * prints (contents, "page N of M") agree with where things landed; only the last pass is kept. */
#include "config.h"

#include "draw/bw-report.h"

#include <cairo-pdf.h>
#include <errno.h>
#include <glib/gi18n-lib.h>
#include <glib/gstdio.h>
#include <math.h>
#include <pango/pangocairo.h>
#include <string.h>
#include <unistd.h>

#include "draw/bw-chart.h"
#include "draw/bw-charts.h"
#include "draw/bw-labels.h"
#include "draw/bw-sketch.h"
#include "draw/bw-style.h"
#include "engine/bw-review.h"

#define CAUTION_TEXT                                                                              \
  N_("These results are a preliminary design aid. They must be checked and verified by a licensed " \
  "professional engineer before they are used for design or construction. Local codes, the "     \
  "design standard in force and the approving authority govern over anything this report states.")

#define FOOTER_CAUTION N_("Preliminary design aid: to be verified by a licensed professional engineer")

/* ------------------------------------------------------------------------------------------ */
/* Paper */

static const char *const paper_names[] = { "a4", "letter" };

const char *
bw_report_paper_name (BwReportPaper paper)
{
  g_return_val_if_fail (paper < BW_N_REPORT_PAPERS, "a4");
  return paper_names[paper];
}

gboolean
bw_report_paper_from_name (const char *name, BwReportPaper *out)
{
  g_return_val_if_fail (out != NULL, FALSE);
  if (name == NULL)
    return FALSE;
  for (int i = 0; i < BW_N_REPORT_PAPERS; i++)
    if (g_ascii_strcasecmp (name, paper_names[i]) == 0)
      {
        *out = (BwReportPaper) i;
        return TRUE;
      }
  return FALSE;
}

void
bw_report_paper_size (BwReportPaper paper, double *width_pt, double *height_pt)
{
  /* ISO 216 A4 is 210 x 297 mm; US letter 8.5 x 11 in. */
  const gboolean a4 = paper != BW_REPORT_PAPER_LETTER;
  if (width_pt)
    *width_pt = a4 ? 210.0 / 25.4 * 72.0 : 612.0;
  if (height_pt)
    *height_pt = a4 ? 297.0 / 25.4 * 72.0 : 792.0;
}

/* ------------------------------------------------------------------------------------------ */
/* The page flow */

typedef struct
{
  char *title;
  int page;
  int level; /* 1 section, 2 subsection */
} TocEntry;

typedef struct
{
  cairo_surface_t *surface;
  cairo_t *cr;
  const BwStyle *style;
  gboolean final;      /* the pass that is kept: outlines are added */
  double pw, ph;       /* page size */
  double x0, x1;       /* text column */
  double top, bottom;  /* body area */
  double y;            /* cursor */
  int page;            /* current page, 1-based; 0 before the first */
  int total;           /* pages in the previous pass (0: unknown) */
  char *running;       /* "project · revision" */
  char *footer_left;
  char *section;       /* running section title */
  GArray *toc;         /* TocEntry, this pass */
  GArray *prev_toc;    /* TocEntry, the previous pass (or NULL) */
  int figure;          /* figure counter */
  GPtrArray *pages;    /* the preview: one recording surface per page (NULL when writing a PDF) */
  cairo_font_options_t *font_options; /* the PDF surface's, for laying out the preview alike */
} Doc;

enum
{
  T_BOLD = 1 << 0,
  T_ITALIC = 1 << 1,
  T_MUTED = 1 << 2,
  T_RIGHT = 1 << 3,
  T_CENTER = 1 << 4,
  T_MONO = 1 << 5,
};

static void
toc_clear (gpointer data)
{
  g_free (((TocEntry *) data)->title);
}

static PangoLayout *
make_layout (Doc *d, const char *text, double size, guint flags, double width)
{
  PangoLayout *layout = pango_cairo_create_layout (d->cr);
  PangoFontDescription *fd = pango_font_description_new ();

  /* The preview measures text with the PDF's font options, so its lines break where the file's do. */
  if (d->font_options)
    pango_cairo_context_set_font_options (pango_layout_get_context (layout), d->font_options);

  pango_font_description_set_family (fd, (flags & T_MONO) ? "DejaVu Sans Mono" : d->style->font_family);
  pango_font_description_set_absolute_size (fd, size * PANGO_SCALE);
  pango_font_description_set_weight (fd, (flags & T_BOLD) ? PANGO_WEIGHT_BOLD : PANGO_WEIGHT_NORMAL);
  pango_font_description_set_style (fd, (flags & T_ITALIC) ? PANGO_STYLE_ITALIC : PANGO_STYLE_NORMAL);
  pango_layout_set_font_description (layout, fd);
  pango_font_description_free (fd);
  if (width > 0)
    {
      pango_layout_set_width (layout, (int) (width * PANGO_SCALE));
      pango_layout_set_wrap (layout, PANGO_WRAP_WORD_CHAR);
    }
  pango_layout_set_alignment (layout, (flags & T_RIGHT) ? PANGO_ALIGN_RIGHT
                                      : (flags & T_CENTER) ? PANGO_ALIGN_CENTER
                                                           : PANGO_ALIGN_LEFT);
  pango_layout_set_text (layout, text ? text : "", -1);
  return layout;
}

static double
text_height (Doc *d, const char *text, double size, guint flags, double width)
{
  PangoLayout *l = make_layout (d, text, size, flags, width);
  int w, h;
  pango_layout_get_size (l, &w, &h);
  g_object_unref (l);
  return (double) h / PANGO_SCALE;
}

static double
text_width (Doc *d, const char *text, double size, guint flags)
{
  PangoLayout *l = make_layout (d, text, size, flags, -1);
  int w, h;
  pango_layout_get_size (l, &w, &h);
  g_object_unref (l);
  return (double) w / PANGO_SCALE;
}

static void
set_rgb (cairo_t *cr, BwRgb c)
{
  cairo_set_source_rgb (cr, c.r, c.g, c.b);
}

/* Draws TEXT with its top left at X, Y; returns its height. */
static double
draw_text (Doc *d, double x, double y, double width, const char *text, double size, guint flags)
{
  PangoLayout *l = make_layout (d, text, size, flags, width);
  int w, h;

  cairo_save (d->cr);
  set_rgb (d->cr, (flags & T_MUTED) ? d->style->ink_muted : d->style->ink);
  cairo_move_to (d->cr, x, y);
  pango_cairo_show_layout (d->cr, l);
  cairo_restore (d->cr);
  pango_layout_get_size (l, &w, &h);
  g_object_unref (l);
  return (double) h / PANGO_SCALE;
}

static void
hrule (Doc *d, double y, double width, BwRgb c)
{
  cairo_save (d->cr);
  set_rgb (d->cr, c);
  cairo_set_line_width (d->cr, width);
  cairo_move_to (d->cr, d->x0, y);
  cairo_line_to (d->cr, d->x1, y);
  cairo_stroke (d->cr);
  cairo_restore (d->cr);
}

/* Starts a new page with its running header and footer. COVER pages carry the footer only. */
static void
doc_page (Doc *d, gboolean cover)
{
  g_autofree char *num = NULL;
  const double ink_y = d->ph - 34;

  if (d->pages != NULL)
    {
      /* The preview: each page is its own recording surface, the page size in points. */
      const cairo_rectangle_t extents = { 0, 0, d->pw, d->ph };
      cairo_surface_t *s = cairo_recording_surface_create (CAIRO_CONTENT_COLOR_ALPHA, &extents);
      cairo_destroy (d->cr);
      d->cr = cairo_create (s);
      d->surface = s;
      g_ptr_array_add (d->pages, s);
    }
  else if (d->page > 0)
    cairo_show_page (d->cr);
  d->page++;
  if (d->total > 0)
    num = g_strdup_printf (_("page %d of %d"), d->page, d->total);
  else
    num = g_strdup_printf (_("page %d of %d"), d->page, d->page);

  if (!cover)
    {
      g_autofree char *left = g_strdup_printf ("%s · %s", d->running, d->section ? d->section : "");
      draw_text (d, d->x0, 30, (d->x1 - d->x0), left, 7.5, T_MUTED);
      hrule (d, 42, 0.5, d->style->ink_muted);
    }
  hrule (d, ink_y - 4, 0.5, d->style->ink_muted);
  draw_text (d, d->x0, ink_y, (d->x1 - d->x0) * 0.62, d->footer_left, 6.5, T_MUTED);
  draw_text (d, d->x0, ink_y, d->x1 - d->x0, num, 7.5, T_BOLD | T_RIGHT);
  draw_text (d, d->x0, ink_y + 9, (d->x1 - d->x0) * 0.7, _(FOOTER_CAUTION), 6.5, T_MUTED | T_ITALIC);
  d->y = d->top;
}

/* Makes room for H points, starting a page when the rest of this one is too short. */
static void
doc_need (Doc *d, double h)
{
  if (d->y + h > d->bottom && d->y > d->top + 1)
    doc_page (d, FALSE);
}

static void
doc_para (Doc *d, const char *text, double size, guint flags)
{
  const double w = d->x1 - d->x0;
  const double h = text_height (d, text, size, flags, w);
  doc_need (d, h);
  d->y += draw_text (d, d->x0, d->y, w, text, size, flags) + size * 0.45;
}

static void
toc_add (Doc *d, const char *title, int level)
{
  TocEntry e = { g_strdup (title), d->page, level };
  g_array_append_val (d->toc, e);
  if (d->final && level == 1)
    {
      /* cairo reads the link's numbers with a decimal point whatever the locale. */
      char xs[G_ASCII_DTOSTR_BUF_SIZE], ys[G_ASCII_DTOSTR_BUF_SIZE];
      g_autofree char *link = g_strdup_printf ("page=%d pos=[%s %s]", d->page,
                                               g_ascii_formatd (xs, sizeof xs, "%g", d->x0),
                                               g_ascii_formatd (ys, sizeof ys, "%g", d->y));
      cairo_pdf_surface_add_outline (d->surface, CAIRO_PDF_OUTLINE_ROOT, title, link, 0);
    }
}

/* A numbered section: always on a new page, in the contents and the running header. */
static void
doc_section (Doc *d, const char *title)
{
  g_free (d->section);
  d->section = g_strdup (title);
  doc_page (d, FALSE);
  toc_add (d, title, 1);
  d->y += draw_text (d, d->x0, d->y, d->x1 - d->x0, title, 16, T_BOLD);
  hrule (d, d->y + 3, 1.2, d->style->ink);
  d->y += 12;
}

/* A subsection heading kept with at least KEEP points of what follows. */
static void
doc_sub (Doc *d, const char *title, gboolean in_toc, double keep)
{
  const double h = text_height (d, title, 11.5, T_BOLD, d->x1 - d->x0);
  doc_need (d, h + keep);
  d->y += 4;
  if (in_toc)
    toc_add (d, title, 2);
  d->y += draw_text (d, d->x0, d->y, d->x1 - d->x0, title, 11.5, T_BOLD) + 4;
}

static void
doc_minor (Doc *d, const char *title, double keep)
{
  const double h = text_height (d, title, 9.5, T_BOLD, d->x1 - d->x0);
  doc_need (d, h + keep);
  d->y += 2;
  d->y += draw_text (d, d->x0, d->y, d->x1 - d->x0, title, 9.5, T_BOLD) + 3;
}

/* --- tables --- */

typedef struct
{
  guint n_cols;
  const double *widths; /* fractions of the column width, summing to 1 */
  const guint *flags;   /* per column (T_RIGHT, T_MONO...), or NULL */
  double size;
  GPtrArray *header;    /* char* */
  GPtrArray *rows;      /* GPtrArray* of char*; a row of one cell spans the table (a group) */
} Table;

static Table *
table_new (guint n_cols, const double *widths, const guint *flags, double size, ...)
{
  Table *t = g_new0 (Table, 1);
  va_list ap;

  t->n_cols = n_cols;
  t->widths = widths;
  t->flags = flags;
  t->size = size;
  t->header = g_ptr_array_new_with_free_func (g_free);
  t->rows = g_ptr_array_new_with_free_func ((GDestroyNotify) g_ptr_array_unref);
  va_start (ap, size);
  for (guint i = 0; i < n_cols; i++)
    g_ptr_array_add (t->header, g_strdup (va_arg (ap, const char *)));
  va_end (ap);
  return t;
}

static void
table_free (Table *t)
{
  g_ptr_array_unref (t->header);
  g_ptr_array_unref (t->rows);
  g_free (t);
}

/* Appends a row of N_COLS cells, taking ownership of each string (NULL is an empty cell). */
static void
table_row_take (Table *t, ...)
{
  GPtrArray *row = g_ptr_array_new_with_free_func (g_free);
  va_list ap;
  va_start (ap, t);
  for (guint i = 0; i < t->n_cols; i++)
    {
      char *s = va_arg (ap, char *);
      g_ptr_array_add (row, s ? s : g_strdup (""));
    }
  va_end (ap);
  g_ptr_array_add (t->rows, row);
}

static void
table_group (Table *t, const char *text)
{
  GPtrArray *row = g_ptr_array_new_with_free_func (g_free);
  g_ptr_array_add (row, g_strdup (text));
  g_ptr_array_add (t->rows, row);
}

#define CELL_PAD 2.6

static double
row_height (Doc *d, const Table *t, GPtrArray *row, gboolean header)
{
  const double tw = d->x1 - d->x0;
  double h = 0;
  if (row->len == 1 && !header)
    return text_height (d, g_ptr_array_index (row, 0), t->size, T_BOLD, tw - 2 * CELL_PAD) + 2 * CELL_PAD;
  for (guint c = 0; c < t->n_cols; c++)
    {
      const guint fl = (header ? T_BOLD : 0) | (t->flags && !header ? t->flags[c] : 0);
      h = MAX (h, text_height (d, g_ptr_array_index (row, c), t->size, fl, t->widths[c] * tw - 2 * CELL_PAD));
    }
  return h + 2 * CELL_PAD;
}

static void
draw_row (Doc *d, const Table *t, GPtrArray *row, gboolean header, double h, gboolean shade)
{
  const double tw = d->x1 - d->x0;
  double x = d->x0;

  if (header || shade || row->len == 1)
    {
      cairo_save (d->cr);
      if (header)
        cairo_set_source_rgb (d->cr, 0.86, 0.89, 0.92);
      else if (row->len == 1)
        cairo_set_source_rgb (d->cr, 0.93, 0.94, 0.95);
      else
        cairo_set_source_rgb (d->cr, 0.965, 0.97, 0.975);
      cairo_rectangle (d->cr, d->x0, d->y, tw, h);
      cairo_fill (d->cr);
      cairo_restore (d->cr);
    }
  if (row->len == 1 && !header)
    draw_text (d, d->x0 + CELL_PAD, d->y + CELL_PAD, tw - 2 * CELL_PAD, g_ptr_array_index (row, 0),
               t->size, T_BOLD);
  else
    for (guint c = 0; c < t->n_cols; c++)
      {
        const double cw = t->widths[c] * tw;
        const guint fl = header ? T_BOLD | (t->flags ? t->flags[c] & (T_RIGHT | T_CENTER) : 0)
                                : (t->flags ? t->flags[c] : 0);
        draw_text (d, x + CELL_PAD, d->y + CELL_PAD, cw - 2 * CELL_PAD, g_ptr_array_index (row, c),
                   t->size, fl);
        x += cw;
      }
  hrule (d, d->y + h, header ? 0.8 : 0.25, header ? d->style->ink : d->style->ink_muted);
}

/* Places table T; when it runs over a page its header is repeated on the next. */
static void
doc_table (Doc *d, const Table *t)
{
  const double hh = row_height (d, t, t->header, TRUE);

  if (t->rows->len == 0)
    return;
  doc_need (d, hh + row_height (d, t, g_ptr_array_index (t->rows, 0), FALSE));
  draw_row (d, t, t->header, TRUE, hh, FALSE);
  d->y += hh;
  for (guint i = 0; i < t->rows->len; i++)
    {
      GPtrArray *row = g_ptr_array_index (t->rows, i);
      const double h = row_height (d, t, row, FALSE);
      if (d->y + h > d->bottom)
        {
          doc_page (d, FALSE);
          draw_row (d, t, t->header, TRUE, hh, FALSE);
          d->y += hh;
        }
      draw_row (d, t, row, FALSE, h, i % 2 == 1);
      d->y += h;
    }
  d->y += 8;
}

/* --- figures --- */

/* Reserves a figure box of the column's width and height H (with a caption under it); returns
 * its top. */
static double
doc_figure_box (Doc *d, double h)
{
  double top;
  doc_need (d, h + 16);
  top = d->y;
  d->y += h;
  return top;
}

static void
doc_caption (Doc *d, const char *text)
{
  g_autofree char *s = g_strdup_printf (_("Figure %d. %s"), ++d->figure, text);
  d->y += 3;
  d->y += draw_text (d, d->x0, d->y, d->x1 - d->x0, s, 8, T_ITALIC | T_MUTED) + 10;
}

static void
frame_box (Doc *d, double top, double h)
{
  cairo_save (d->cr);
  set_rgb (d->cr, d->style->ink_muted);
  cairo_set_line_width (d->cr, 0.4);
  cairo_rectangle (d->cr, d->x0, top, d->x1 - d->x0, h);
  cairo_stroke (d->cr);
  cairo_restore (d->cr);
}

static void
doc_chart (Doc *d, BwChart *chart, double h, const char *caption)
{
  const double top = doc_figure_box (d, h);
  cairo_save (d->cr);
  cairo_translate (d->cr, d->x0, top);
  bw_chart_paint (chart, d->style, d->cr, d->x1 - d->x0, h);
  cairo_restore (d->cr);
  frame_box (d, top, h);
  doc_caption (d, caption);
}

/* ------------------------------------------------------------------------------------------ */
/* Shared pieces */

static char *
fmt (double v, BwQuantityKind kind, BwUnitSystem units)
{
  return bw_label_quantity (v, kind, units);
}

/* A plain number to SIG significant figures, with the reader's decimal separator. */
static char *
number_text (double v, int sig)
{
  g_autofree char *c = bw_format_number (v, sig);

  return bw_label_number (c);
}

static char *
q_fmt (BwQuantity q, double v, BwUnitSystem units)
{
  return bw_label_quantity (v, bw_quantity_info (q)->kind, units);
}

static char *
case_label (const BwResults *r, int i)
{
  if (i < 0 || (guint) i >= r->n_cases)
    return g_strdup ("—");
  return bw_label_load_case (&r->cases[i]);
}

/* "C9 maximum day, coldest, all in service": the case with its number in the design basis. */
static char *
case_ref (const BwResults *r, int i)
{
  g_autofree char *label = NULL;
  if (i < 0 || (guint) i >= r->n_cases)
    return g_strdup ("—");
  label = bw_label_load_case (&r->cases[i]);
  return g_strdup_printf ("C%d %s", i + 1, label);
}

static char *
limit_text (const BwCheck *c, BwUnitSystem units)
{
  g_autofree char *v = NULL;
  if (!c->has_limit)
    return g_strdup ("—");
  v = q_fmt (c->criterion->quantity, c->limit, units);
  return g_strdup_printf ("%s %s%s", c->limit_is_max ? "≤" : "≥", v,
                          c->limit_is_required ? "" : _(" (preferred)"));
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

static const char *
status_text (BwCheckStatus s)
{
  switch (s)
    {
    case BW_CHECK_PASS: return C_("check", "PASS");
    case BW_CHECK_WARN: return C_("check", "WARN");
    case BW_CHECK_FAIL: return C_("check", "FAIL");
    default: return C_("check", "n/a");
    }
}

static const char *
element_id (const BwResults *r, int e)
{
  if (e < 0 || (guint) e >= r->elements->len)
    return "—";
  return ((const BwElementResult *) g_ptr_array_index (r->elements, e))->id;
}

static const char *
nz (const char *s, const char *fallback)
{
  return s && *s ? s : fallback;
}

/* The cover: title block, project identity, a summary line and the caution. */
static void
cover (Doc *d, const BwProject *p, const BwCriteriaSet *set, const char *kind, const char *summary,
       BwUnitSystem units)
{
  static const double kv_w[] = { 0.3, 0.7 };
  const double w = d->x1 - d->x0;
  Table *t = table_new (2, kv_w, NULL, 10, _("Item"), _("Entry"));
  double box_h, y;
  g_autofree char *crit = NULL;

  doc_page (d, TRUE);
  d->y = d->top + 60;
  d->y += draw_text (d, d->x0, d->y, w, kind, 11, T_MUTED | T_BOLD) + 6;
  d->y += draw_text (d, d->x0, d->y, w, nz (p->name, _("Untitled project")), 24, T_BOLD) + 6;
  if (p->description && *p->description)
    d->y += draw_text (d, d->x0, d->y, w, p->description, 10.5, 0) + 6;
  hrule (d, d->y + 4, 1.5, d->style->ink);
  d->y += 20;

  crit = set ? g_strdup_printf ("%s (%s)", nz (set->name, set->id), set->id) : g_strdup ("—");
  table_row_take (t, g_strdup (_("Prepared by")), g_strdup (nz (p->preparer, _("not stated"))));
  table_row_take (t, g_strdup (_("Date")), g_strdup (nz (p->date, _("not stated"))));
  table_row_take (t, g_strdup (_("Revision")), g_strdup (nz (p->revision, _("not stated"))));
  table_row_take (t, g_strdup (_("Criteria set")), g_strdup (crit));
  table_row_take (t, g_strdup (_("Units")), g_strdup (units == BW_UNIT_SYSTEM_US ? _("US customary") : _("SI (metric)")));
  table_row_take (t, g_strdup (_("Produced with")), g_strdup_printf (_("Basinwright %s"), PACKAGE_VERSION));
  doc_table (d, t);
  table_free (t);

  if (summary)
    {
      d->y += 6;
      d->y += draw_text (d, d->x0, d->y, w, summary, 10.5, T_BOLD) + 10;
    }

  /* The caution, boxed. */
  box_h = text_height (d, _(CAUTION_TEXT), 10, 0, w - 28) + 36;
  y = MAX (d->y + 20, d->bottom - box_h - 10);
  cairo_save (d->cr);
  cairo_set_source_rgb (d->cr, 0.99, 0.96, 0.88);
  cairo_rectangle (d->cr, d->x0, y, w, box_h);
  cairo_fill_preserve (d->cr);
  cairo_set_source_rgb (d->cr, 0.62, 0.42, 0.05);
  cairo_set_line_width (d->cr, 1.2);
  cairo_stroke (d->cr);
  cairo_restore (d->cr);
  draw_text (d, d->x0 + 14, y + 10, w - 28, _("Caution"), 10.5, T_BOLD);
  draw_text (d, d->x0 + 14, y + 26, w - 28, _(CAUTION_TEXT), 10, 0);
  d->y = y + box_h;
}

/* The contents page(s), from the previous pass's entries. */
static void
contents (Doc *d)
{
  g_free (d->section);
  d->section = g_strdup (_("Contents"));
  doc_page (d, FALSE);
  d->y += draw_text (d, d->x0, d->y, d->x1 - d->x0, _("Contents"), 16, T_BOLD);
  hrule (d, d->y + 3, 1.2, d->style->ink);
  d->y += 14;
  if (d->prev_toc == NULL)
    return;
  for (guint i = 0; i < d->prev_toc->len; i++)
    {
      const TocEntry *e = &g_array_index (d->prev_toc, TocEntry, i);
      const double size = e->level == 1 ? 10.5 : 9;
      const guint fl = e->level == 1 ? T_BOLD : 0;
      const double indent = e->level == 1 ? 0 : 16;
      g_autofree char *num = g_strdup_printf ("%d", e->page);
      const double nw = text_width (d, num, size, fl);
      const double h = text_height (d, e->title, size, fl, d->x1 - d->x0 - indent - 40);
      double tw;

      doc_need (d, h + 4);
      if (e->level == 1)
        d->y += 5;
      draw_text (d, d->x0 + indent, d->y, d->x1 - d->x0 - indent - 40, e->title, size, fl);
      tw = MIN (text_width (d, e->title, size, fl), d->x1 - d->x0 - indent - 40);
      /* dotted leader */
      cairo_save (d->cr);
      set_rgb (d->cr, d->style->ink_muted);
      cairo_set_line_width (d->cr, 0.6);
      {
        const double dashes[] = { 0.6, 2.4 };
        cairo_set_dash (d->cr, dashes, 2, 0);
      }
      cairo_move_to (d->cr, d->x0 + indent + tw + 4, d->y + h - 3);
      cairo_line_to (d->cr, d->x1 - nw - 4, d->y + h - 3);
      cairo_stroke (d->cr);
      cairo_restore (d->cr);
      draw_text (d, d->x0, d->y, d->x1 - d->x0, num, size, fl | T_RIGHT);
      d->y += h + 2;
    }
}

/* ------------------------------------------------------------------------------------------ */
/* The design report */

typedef struct
{
  const BwProject *p;
  const BwResults *r;
  GArray *checks;
  const BwCriteriaSet *set;
  BwUnitSystem units;
} Report;

static void
design_basis (Doc *d, const Report *rp)
{
  static const double w2[] = { 0.45, 0.55 };
  static const double w3[] = { 0.08, 0.5, 0.42 };
  static const double w4[] = { 0.22, 0.38, 0.2, 0.2 };
  static const guint f2[] = { 0, T_RIGHT };
  static const guint f4[] = { 0, 0, T_CENTER, T_CENTER };
  const BwProject *p = rp->p;
  const BwDesignBasis *b = &p->basis;
  Table *t;

  doc_section (d, _("Design basis"));
  doc_para (d, _("The plant flows, water temperatures and raw-water quality every unit was evaluated "
               "with. The plant flow divides equally among the trains and then among each unit's "
               "units in service."), 9.5, 0);

  doc_sub (d, _("Plant flows"), FALSE, 60);
  t = table_new (2, w2, f2, 9.5, _("Flow"), _("Value"));
  for (int k = 0; k < BW_N_FLOW_KINDS; k++)
    if (b->flows_given & (1u << k))
      table_row_take (t, g_strdup (bw_label_flow_kind (k)), fmt (b->flow_m3_s[k], BW_KIND_FLOW, rp->units));
  doc_table (d, t);
  table_free (t);

  doc_sub (d, _("Water temperatures and raw water"), FALSE, 60);
  t = table_new (2, w2, f2, 9.5, _("Item"), _("Value"));
  table_row_take (t, g_strdup (_("coldest water")), fmt (b->temperature_K[BW_TEMP_COLDEST], BW_KIND_TEMPERATURE, rp->units));
  table_row_take (t, g_strdup (_("warmest water")), fmt (b->temperature_K[BW_TEMP_WARMEST], BW_KIND_TEMPERATURE, rp->units));
  table_row_take (t, g_strdup (_("raw-water turbidity")), fmt (b->turbidity_NTU, BW_KIND_TURBIDITY, rp->units));
  table_row_take (t, g_strdup (_("raw-water alkalinity (as CaCO₃)")), fmt (b->alkalinity_kg_m3, BW_KIND_CONCENTRATION, rp->units));
  table_row_take (t, g_strdup (_("raw-water pH")), number_text (b->ph, 3));
  doc_table (d, t);
  table_free (t);

  doc_sub (d, _("Coagulation chemistry"), FALSE, 60);
  if (!p->chemistry.enabled)
    doc_para (d, _("No coagulant is specified; chemistry quantities are not reported."), 9.5, T_ITALIC);
  else
    {
      const BwChemistryBasis *c = &p->chemistry;
      t = table_new (2, w2, f2, 9.5, _("Item"), _("Value"));
      table_row_take (t, g_strdup (_("coagulant")), g_strdup (bw_label_coagulant (c->kind)));
      table_row_take (t, g_strdup (_("dose, minimum")), fmt (c->dose_min_kg_m3, BW_KIND_CONCENTRATION, rp->units));
      table_row_take (t, g_strdup (_("dose, design")), fmt (c->dose_design_kg_m3, BW_KIND_CONCENTRATION, rp->units));
      table_row_take (t, g_strdup (_("dose, maximum")), fmt (c->dose_max_kg_m3, BW_KIND_CONCENTRATION, rp->units));
      table_row_take (t, g_strdup (_("suspended solids per NTU")), number_text (c->ss_factor, 3));
      if (c->residual_target_kg_m3 > 0)
        table_row_take (t, g_strdup (_("residual alkalinity to keep")),
                        fmt (c->residual_target_kg_m3, BW_KIND_CONCENTRATION, rp->units));
      if (c->jar_test)
        table_row_take (t, g_strdup (_("dose chosen from jar tests")), g_strdup (c->jar_test));
      doc_table (d, t);
      table_free (t);
    }

  doc_sub (d, _("Trains and units"), FALSE, 60);
  t = table_new (4, w4, f4, 9, _("Unit id"), _("Name and kind"), _("In parallel"), _("Standby"));
  for (guint i = 0; i < p->trains->len; i++)
    {
      const BwTrain *tr = g_ptr_array_index (p->trains, i);
      g_autofree char *g = g_strdup_printf (_("Train %s — %s"), tr->id, nz (tr->name, ""));
      table_group (t, g);
      for (guint j = 0; j < tr->units->len; j++)
        {
          const BwProcessUnit *u = g_ptr_array_index (tr->units, j);
          table_row_take (t, g_strdup (u->id),
                          g_strdup_printf ("%s (%s)", nz (u->name, u->id), bw_label_process_type (u->type)),
                          g_strdup_printf ("%u", u->n_parallel), g_strdup_printf ("%u", u->n_standby));
        }
    }
  doc_table (d, t);
  table_free (t);

  doc_sub (d, _("Load cases"), FALSE, 60);
  doc_para (d, _("Every unit is evaluated in each load case below: each flow given, at the coldest and "
               "warmest water, with all units in service and at firm capacity (standby units out of "
               "service). The case numbers are used in the tables that follow."), 9.5, 0);
  t = table_new (3, w3, NULL, 9, _("No."), _("Load case"), _("Id"));
  for (guint i = 0; i < rp->r->n_cases; i++)
    table_row_take (t, g_strdup_printf ("C%u", i + 1), case_label (rp->r, (int) i),
                    bw_load_case_id (&rp->r->cases[i]));
  doc_table (d, t);
  table_free (t);
}

static char *
param_value (const BwParamSpec *s, double v, BwUnitSystem units)
{
  switch (s->type)
    {
    case BW_PARAM_QUANTITY:
      if (s->optional && v == 0)
        return g_strdup (_("not given"));
      return fmt (v, s->kind, units);
    case BW_PARAM_COUNT:
      if (s->optional && v == 0)
        return g_strdup (_("not given"));
      return g_strdup_printf ("%.0f", v);
    case BW_PARAM_CHOICE:
      return g_strdup (nz (bw_label_choice (s, (int) v), "—"));
    default:
      return g_strdup ("—");
    }
}

static void
inputs_table (Doc *d, const Report *rp, const BwProcessUnit *u, gboolean counts)
{
  static const double w[] = { 0.34, 0.2, 0.46 };
  static const guint f[] = { 0, T_RIGHT, T_MUTED };
  guint n;
  const BwParamSpec *specs = bw_params_of (u->type, &n);
  Table *t = table_new (3, w, f, 8.5, _("Parameter"), _("Value"), _("Meaning"));

  if (counts)
    {
      table_row_take (t, g_strdup (_("units in parallel")), g_strdup_printf ("%u", u->n_parallel),
                      g_strdup (_("identical units side by side")));
      table_row_take (t, g_strdup (_("standby units")), g_strdup_printf ("%u", u->n_standby),
                      g_strdup (_("out of service in the firm-capacity cases")));
    }
  for (guint i = 0; i < n; i++)
    table_row_take (t, g_strdup (bw_label_text (specs[i].label)), param_value (&specs[i], u->values[i], rp->units),
                    g_strdup (specs[i].help ? bw_label_text (specs[i].help) : ""));
  doc_table (d, t);
  table_free (t);
}

#define FULL_TABLE_MAX_CASES 5

static void
results_table (Doc *d, const Report *rp, guint ei)
{
  const BwElementResult *e = g_ptr_array_index (rp->r->elements, ei);
  const BwResults *r = rp->r;
  Table *t;

  if (r->n_cases == 0)
    return;
  if (r->n_cases <= FULL_TABLE_MAX_CASES)
    {
      /* quantities x cases */
      double *w = g_new (double, r->n_cases + 1);
      guint *f = g_new0 (guint, r->n_cases + 1);
      w[0] = 0.3;
      for (guint c = 0; c < r->n_cases; c++)
        w[c + 1] = 0.7 / r->n_cases, f[c + 1] = T_RIGHT;
      t = g_new0 (Table, 1);
      t->n_cols = r->n_cases + 1;
      t->widths = w;
      t->flags = f;
      t->size = 8;
      t->header = g_ptr_array_new_with_free_func (g_free);
      t->rows = g_ptr_array_new_with_free_func ((GDestroyNotify) g_ptr_array_unref);
      g_ptr_array_add (t->header, g_strdup (_("Quantity")));
      for (guint c = 0; c < r->n_cases; c++)
        g_ptr_array_add (t->header, case_label (r, (int) c));
      for (guint q = 0; q < BW_N_QUANTITIES; q++)
        {
          GPtrArray *row;
          if (!bw_quantity_set_has (&e->values[0], q))
            continue;
          row = g_ptr_array_new_with_free_func (g_free);
          g_ptr_array_add (row, g_strdup (bw_label_text (bw_quantity_info (q)->label)));
          for (guint c = 0; c < r->n_cases; c++)
            g_ptr_array_add (row, bw_quantity_set_has (&e->values[c], q)
                                      ? q_fmt (q, e->values[c].values[q], rp->units) : g_strdup ("—"));
          g_ptr_array_add (t->rows, row);
        }
      doc_table (d, t);
      table_free (t);
      g_free (w);
      g_free (f);
      return;
    }

  {
    static const double w[] = { 0.24, 0.15, 0.23, 0.15, 0.23 };
    static const guint f[] = { 0, T_RIGHT, T_MUTED, T_RIGHT, T_MUTED };
    t = table_new (5, w, f, 8, _("Quantity"), _("Smallest"), _("in case"), _("Largest"), _("in case"));
    for (guint q = 0; q < BW_N_QUANTITIES; q++)
      {
        const int lo = bw_results_extreme_case (r, ei, q, FALSE);
        const int hi = bw_results_extreme_case (r, ei, q, TRUE);
        if (lo < 0 || hi < 0)
          continue;
        if (e->values[lo].values[q] == e->values[hi].values[q])
          table_row_take (t, g_strdup (bw_label_text (bw_quantity_info (q)->label)), q_fmt (q, e->values[lo].values[q], rp->units),
                          g_strdup (_("the same in every case")), NULL, NULL);
        else
          table_row_take (t, g_strdup (bw_label_text (bw_quantity_info (q)->label)), q_fmt (q, e->values[lo].values[q], rp->units),
                          case_ref (r, lo),
                          q_fmt (q, e->values[hi].values[q], rp->units),
                          case_ref (r, hi));
      }
    doc_table (d, t);
    table_free (t);
  }
}

/* The checks of element EI: the governing value of each criterion. */
static gboolean
governing_table (Doc *d, const Report *rp, guint ei)
{
  static const double w[] = { 0.3, 0.15, 0.2, 0.1, 0.25 };
  static const guint f[] = { 0, T_RIGHT, T_RIGHT, T_BOLD | T_CENTER, T_MUTED };
  Table *t = table_new (5, w, f, 8, _("Criterion"), _("Governing value"), _("Limit"), _("Status"), _("Governing case"));
  gboolean any = FALSE;

  for (guint i = 0; i < rp->checks->len; i++)
    {
      const BwCheck *c = &g_array_index (rp->checks, BwCheck, i);
      if (c->element != (int) ei || c->status == BW_CHECK_NOT_APPLICABLE)
        continue;
      table_row_take (t, g_strdup (c->criterion->title), q_fmt (c->criterion->quantity, c->value, rp->units),
                      limit_text (c, rp->units), g_strdup (status_text (c->status)),
                      case_ref (rp->r, c->governing_case));
      any = TRUE;
    }
  if (any)
    doc_table (d, t);
  table_free (t);
  return any;
}

static void
unit_section (Doc *d, const Report *rp, const BwTrain *tr, const BwProcessUnit *u)
{
  g_autofree char *title = g_strdup_printf (_("Unit %s — %s"), u->id, nz (u->name, ""));
  const double w = d->x1 - d->x0;
  const double fig_h = w * 0.6;

  doc_section (d, title);
  {
    g_autofree char *intro = g_strdup_printf (_("%s of train %s. %u in parallel, %u on standby."),
                                              bw_label_process_type (u->type), tr->id, u->n_parallel,
                                              u->n_standby);
    intro[0] = g_ascii_toupper (intro[0]);
    doc_para (d, intro, 9.5, 0);
  }

  doc_sub (d, _("Inputs"), FALSE, 60);
  inputs_table (d, rp, u, TRUE);
  if (u->stages)
    for (guint s = 0; s < u->stages->len; s++)
      {
        const BwProcessUnit *st = g_ptr_array_index (u->stages, s);
        g_autofree char *h = g_strdup_printf (_("Stage %u: %s (%s, %s)"), s + 1, nz (st->name, st->id), st->id,
                                              bw_label_process_type (st->type));
        doc_minor (d, h, 50);
        inputs_table (d, rp, st, FALSE);
      }

  doc_sub (d, _("Results in every load case"), FALSE, 60);
  if (rp->r->n_cases > FULL_TABLE_MAX_CASES)
    {
      g_autofree char *s = g_strdup_printf (_("For each quantity the smallest and largest value over the %u "
                                            "load cases and the case where each occurs (case numbers as "
                                            "listed in the design basis). Values are per unit in service."),
                                            rp->r->n_cases);
      doc_para (d, s, 8.5, T_MUTED);
    }
  for (guint i = 0; i < rp->r->elements->len; i++)
    {
      const BwElementResult *e = g_ptr_array_index (rp->r->elements, i);
      g_autofree char *h = NULL;
      if (e->unit != u)
        continue;
      h = g_strdup_printf ("%s (%s)", e->label, e->id);
      doc_minor (d, h, 50);
      results_table (d, rp, i);
    }

  doc_sub (d, _("Governing values"), FALSE, 60);
  {
    gboolean any = FALSE;
    for (guint i = 0; i < rp->r->elements->len; i++)
      {
        const BwElementResult *e = g_ptr_array_index (rp->r->elements, i);
        gboolean has = FALSE;
        if (e->unit != u)
          continue;
        for (guint k = 0; k < rp->checks->len && !has; k++)
          {
            const BwCheck *c = &g_array_index (rp->checks, BwCheck, k);
            has = c->element == (int) i && c->status != BW_CHECK_NOT_APPLICABLE;
          }
        if (!has)
          continue;
        {
          g_autofree char *h = g_strdup_printf ("%s (%s)", e->label, e->id);
          doc_minor (d, h, 40);
        }
        any |= governing_table (d, rp, i);
      }
    if (!any)
      doc_para (d, _("No criterion of the set applies to this unit."), 9, T_ITALIC);
  }

  doc_sub (d, _("Drawings"), FALSE, fig_h);
  for (int v = 0; v < BW_N_SKETCH_VIEWS; v++)
    {
      g_autoptr (GError) error = NULL;
      g_autofree char *cap = NULL;
      double top;
      if (!bw_sketch_supports (u->type, v))
        continue;
      top = doc_figure_box (d, fig_h);
      cairo_save (d->cr);
      cairo_translate (d->cr, d->x0, top);
      if (!bw_sketch_paint (rp->p, u, v, rp->units, d->style, d->cr, w, fig_h, &error))
        {
          cairo_restore (d->cr);
          d->y = top;
          cap = g_strdup_printf (_("The %s of %s could not be drawn: %s"), bw_sketch_view_name (v), u->id,
                                 error->message);
          doc_para (d, cap, 9, T_ITALIC);
          continue;
        }
      cairo_restore (d->cr);
      frame_box (d, top, fig_h);
      cap = v == BW_SKETCH_SCHEMATIC
              ? g_strdup_printf (_("Schematic of train %s (not to scale), with the results of the design case."), tr->id)
              : g_strdup_printf (_("%s of %s, to scale."), v == BW_SKETCH_PLAN ? _("Plan") : _("Section"), u->id);
      doc_caption (d, cap);
    }

  /* Charts that apply to this kind of unit. */
  {
    GPtrArray *charts = g_ptr_array_new_with_free_func ((GDestroyNotify) bw_chart_free);
    GPtrArray *caps = g_ptr_array_new_with_free_func (g_free);
    g_autoptr (GError) error = NULL;
    BwChart *c;

#define ADD_CHART(expr, caption)                                                                   \
  do                                                                                               \
    {                                                                                              \
      g_clear_error (&error);                                                                      \
      if ((c = (expr)) != NULL)                                                                    \
        g_ptr_array_add (charts, c), g_ptr_array_add (caps, (caption));                            \
      else                                                                                         \
        g_ptr_array_add (charts, NULL),                                                            \
          g_ptr_array_add (caps, g_strdup_printf (_("Chart not drawn: %s"), error ? error->message : _("no data"))); \
    }                                                                                              \
  while (0)

    switch (u->type)
      {
      case BW_PROCESS_RAPID_MIX:
        ADD_CHART (bw_chart_impeller_power (rp->p, rp->r, rp->checks, u->id, rp->units, &error),
                   g_strdup_printf (_("Impeller power and G against speed for %s."), u->id));
        break;
      case BW_PROCESS_FLOCCULATOR:
        ADD_CHART (bw_chart_floc_taper (rp->p, rp->r, rp->checks, u->id, rp->units, &error),
                   g_strdup_printf (_("Velocity-gradient taper of %s by stage."), u->id));
        for (guint s = 0; u->stages && s < u->stages->len; s++)
          {
            const BwProcessUnit *st = g_ptr_array_index (u->stages, s);
            if (st->type == BW_STAGE_TURBINE)
              ADD_CHART (bw_chart_impeller_power (rp->p, rp->r, rp->checks, st->id, rp->units, &error),
                         g_strdup_printf (_("Impeller power and G against speed for stage %s."), st->id));
          }
        break;
      case BW_PROCESS_RECTANGULAR_BASIN:
      case BW_PROCESS_CIRCULAR_CLARIFIER:
      case BW_PROCESS_PLATE_SETTLER:
        ADD_CHART (bw_chart_settling_curves (rp->p, rp->r, u->id, 0, rp->units, &error),
                   g_strdup_printf (_("Settling velocity against particle size, with the overflow rates of %s."), u->id));
        ADD_CHART (bw_chart_removal_curves (rp->p, rp->r, u->id, rp->units, &error),
                   g_strdup_printf (_("Predicted removal against overflow rate for %s."), u->id));
        if (bw_project_column_test_for (rp->p, u->id) != NULL)
          ADD_CHART (bw_chart_iso_removal (rp->p, rp->r, u->id, rp->units, &error),
                     g_strdup_printf (_("Iso-removal curves of the settling-column test for %s, with "
                                      "its design point and Type II removal."), u->id));
        break;
      default:
        break;
      }
#undef ADD_CHART
    if (charts->len > 0)
      doc_sub (d, _("Charts"), FALSE, fig_h);
    for (guint i = 0; i < charts->len; i++)
      {
        BwChart *ch = g_ptr_array_index (charts, i);
        if (ch == NULL)
          {
            doc_para (d, g_ptr_array_index (caps, i), 9, T_ITALIC);
            continue;
          }
        ch->transparent = TRUE;
        doc_chart (d, ch, fig_h, g_ptr_array_index (caps, i));
      }
    g_ptr_array_unref (charts);
    g_ptr_array_unref (caps);
  }
}

static void
criteria_section (Doc *d, const Report *rp)
{
  static const double w[] = { 0.09, 0.12, 0.18, 0.1, 0.12, 0.16, 0.23 };
  static const guint f[] = { T_BOLD, T_MONO, 0, T_RIGHT, T_RIGHT, T_MUTED, 0 };
  guint counts[4] = { 0 };
  g_autofree char *intro = NULL;
  Table *t;

  doc_section (d, _("Criteria checks"));
  bw_checks_count (rp->checks, counts);
  intro = g_strdup_printf (_("Every criterion of the set “%s” (%s) graded on every unit it applies to, at "
                           "the load case where it fares worst. %u pass, %u warn (outside a preferred "
                           "range), %u fail (outside a required limit), %u not applicable. A citation "
                           "marked “from memory, verify” was recalled rather than read in the document: "
                           "check it against the edition in force."),
                           nz (rp->set->name, rp->set->id), rp->set->id, counts[BW_CHECK_PASS],
                           counts[BW_CHECK_WARN], counts[BW_CHECK_FAIL], counts[BW_CHECK_NOT_APPLICABLE]);
  doc_para (d, intro, 9.5, 0);

  t = table_new (7, w, f, 7.2, _("Status"), _("Element"), _("Criterion"), _("Value"), _("Limit"), _("Governing case"), _("Citation"));
  for (guint i = 0; i < rp->checks->len; i++)
    {
      const BwCheck *c = &g_array_index (rp->checks, BwCheck, i);
      table_row_take (t, g_strdup (status_text (c->status)), g_strdup (element_id (rp->r, c->element)),
                      g_strdup (c->criterion->title),
                      c->status == BW_CHECK_NOT_APPLICABLE ? g_strdup ("—")
                                                           : q_fmt (c->criterion->quantity, c->value, rp->units),
                      limit_text (c, rp->units), case_label (rp->r, c->governing_case),
                      citation_text (c->criterion));
    }
  doc_table (d, t);
  table_free (t);

  for (guint i = 0; i < rp->p->trains->len; i++)
    {
      const BwTrain *tr = g_ptr_array_index (rp->p->trains, i);
      g_autoptr (GError) error = NULL;
      g_autoptr (BwChart) m = bw_chart_check_matrix (rp->p, rp->r, rp->checks, tr->id, &error);
      g_autofree char *cap = g_strdup_printf (_("Outcome of each check of train %s in each load case."), tr->id);
      if (m == NULL)
        continue;
      m->transparent = TRUE;
      doc_chart (d, m, (d->bottom - d->top) * 0.62, cap);
    }
}

typedef struct
{
  const char *what;
  const char *method;
  const char *reference;
} Method;

/* Drawn from docs/manual.md and the engine's comments; the wording is ours. */
static const Method methods[] = {
  { N_("Water density"), N_("Function of temperature for liquid water at 101.325 kPa, 0–40 °C."),
    "Tanaka et al. (2001), Metrologia 38:301" },
  { N_("Water viscosity"), N_("μ = μ0(T)·μ1(T, ρ); kinematic viscosity ν = μ/ρ."),
    "IAPWS R12-08 (2008)" },
  { N_("Relative permittivity"), N_("Empirical fit in temperature (used for zeta potential only)."),
    "Malmberg & Maryott (1956)" },
  { N_("Impeller power"), N_("P = Np·ρ·N³·D⁵ in the turbulent range; library power numbers for fully baffled "
    "tanks (Rushton 5.7; 45° pitched blade 1.27, from memory; hydrofoil 0.30, typical) or a given Np; "
    "impeller Reynolds number ρND²/μ, caution below 10⁴."),
    "Davis (2010); McCabe, Smith & Harriott (from memory)" },
  { N_("Velocity gradient"), N_("G = √(P/(μV)); detention t = V/Q; Camp number Gt; motor power P/η."),
    "Camp & Stein (1943)" },
  { N_("Hydraulic mixer"), N_("G = √(ρ·g·h·Q/(μ·V)) from the head loss."), "Camp & Stein (1943)" },
  { N_("Paddle flocculator"), N_("P = Σ Cd·A·ρ·v_r³/2 over the blades, v_r = k·2πrN (k = 0.75 by default); Cd "
    "from blade length/width."), "Davis (2010), Eq. 6-20 and Table 6-7" },
  { N_("Baffled flocculator"), N_("Manning friction h_f = L(n·v)²/R^(4/3) plus turn losses K·v²/(2g), K = 3.2; "
    "G = √(g·h/(ν·t))."), "Haarhoff (1998), as tabulated by Hendricks (2011)" },
  { N_("Train G"), N_("Reported as Gt/t and as √(ΣP/(μΣV)) over the stages."), "Camp & Stein (1943)" },
  { N_("Discrete settling"), N_("Stokes' law while Re < 0.01; beyond, the force balance Cd·Re² = 4gd³ρ(ρp−ρ)/(3μ²) "
    "with the Clift–Gauvin drag curve (or 24/Re + 3/√Re + 0.34)."), "Clift & Gauvin (1970); Davis (2010)" },
  { N_("Rectangular basin"), N_("Overflow rate Q/(LW), detention, horizontal velocity Q/(WH), weir loading; "
    "Reynolds and Froude numbers on R = WH/(W+2H)."), "Davis (2010), after Kawamura" },
  { N_("Scour"), N_("V = √(8k(s−1)gd/f), k = 0.05 and f = 0.025 by default, against the horizontal velocity."),
    "Camp (1946)" },
  { N_("Circular clarifier"), N_("Overflow rate on the area net of the feed well; detention on the gross area; "
    "weir loading of the launder."), "AWWA/ASCE, Water Treatment Plant Design" },
  { N_("Plate and tube settlers"), N_("Loading on the projected area; critical velocity "
    "v_sc = S·v0/(sin θ + (l/w) cos θ), S = 1, 4/3, 11/8."), "Yao (1970)" },
  { N_("Removal"), N_("Ideal basin min(1, vs/v0); Hazen's 1 − [1 + (vs/v0)/n]^(−n)."), "Camp (1946); Hazen (1904)" },
  { N_("Coagulant chemistry"), N_("Feed = dose × flow; alkalinity consumed from IUPAC atomic weights; dry sludge "
    "as metal hydroxide plus solids removed per NTU."), "Cornwell et al. (1987, from memory)" },
  { N_("Load cases and governing case"), N_("Every flow given × coldest and warmest water × all in service and "
    "firm capacity; a criterion's governing case is the one where it fares worst."), "Basinwright manual" },
};

static void
methods_section (Doc *d)
{
  static const double w[] = { 0.2, 0.52, 0.28 };
  Table *t = table_new (3, w, NULL, 8, _("Quantity"), _("Method"), _("Reference"));

  doc_section (d, _("Methods and references"));
  doc_para (d, _("The correlations the results above were computed with. Full references are listed in "
               "the Basinwright documentation (docs/references.md). Values marked “from memory” were "
               "recalled rather than read and should be verified against the source."), 9.5, 0);
  for (guint i = 0; i < G_N_ELEMENTS (methods); i++)
    table_row_take (t, g_strdup (_(methods[i].what)), g_strdup (_(methods[i].method)),
                    g_strdup (methods[i].reference));
  doc_table (d, t);
  table_free (t);
}

/* ------------------------------------------------------------------------------------------ */
/* Passes and the file */

typedef void (*BodyFunc) (Doc *d, gconstpointer data);

static cairo_status_t
discard_write (void *closure, const unsigned char *data, unsigned int length)
{
  (void) closure, (void) data, (void) length;
  return CAIRO_STATUS_SUCCESS;
}

static void
doc_init (Doc *d, cairo_surface_t *surface, double pw, double ph, const char *running, const char *footer)
{
  memset (d, 0, sizeof *d);
  d->surface = surface;
  d->cr = cairo_create (surface);
  d->style = bw_style_light ();
  d->pw = pw;
  d->ph = ph;
  d->x0 = 56;
  d->x1 = pw - 56;
  d->top = 58;
  d->bottom = ph - 50;
  d->running = g_strdup (running);
  d->footer_left = g_strdup (footer);
  d->toc = g_array_new (FALSE, FALSE, sizeof (TocEntry));
  g_array_set_clear_func (d->toc, toc_clear);
}

static void
doc_clear (Doc *d)
{
  if (d->cr)
    cairo_destroy (d->cr);
  g_free (d->running);
  g_free (d->footer_left);
  g_free (d->section);
  if (d->toc)
    g_array_unref (d->toc);
  if (d->font_options)
    cairo_font_options_destroy (d->font_options);
}

static gboolean
toc_same (GArray *a, GArray *b)
{
  if (a == NULL || b == NULL || a->len != b->len)
    return FALSE;
  for (guint i = 0; i < a->len; i++)
    if (g_array_index (a, TocEntry, i).page != g_array_index (b, TocEntry, i).page)
      return FALSE;
  return TRUE;
}

/* Lays the document out on a PDF surface that writes nowhere until its page numbers settle;
 * returns the last pass's contents (*PREV, owned) and page count (*TOTAL) for the kept pass. */
static void
settle_layout (double pw, double ph, const char *running, const char *footer, BodyFunc body,
               gconstpointer data, GArray **prev_out, int *total_out)
{
  GArray *prev = NULL;
  int total = 0;
  cairo_surface_t *surface;
  Doc d;

  for (int pass = 0; pass < 5; pass++)
    {
      gboolean stable;
      surface = cairo_pdf_surface_create_for_stream (discard_write, NULL, pw, ph);
      doc_init (&d, surface, pw, ph, running, footer);
      d.prev_toc = prev;
      d.total = total;
      body (&d, data);
      stable = toc_same (prev, d.toc) && total == d.page;
      total = d.page;
      if (prev)
        g_array_unref (prev);
      prev = g_steal_pointer (&d.toc);
      doc_clear (&d);
      cairo_surface_destroy (surface);
      if (stable)
        break;
    }
  *prev_out = prev;
  *total_out = total;
}

/* Lays the document out until its page numbers settle, then writes it to PATH atomically. */
static gboolean
write_document (BwReportPaper paper, const char *path, const char *title, const char *author,
                const char *running, const char *footer, BodyFunc body, gconstpointer data, GError **error)
{
  double pw, ph;
  GArray *prev = NULL;
  int total = 0;
  g_autofree char *tmp = NULL;
  cairo_surface_t *surface;
  cairo_status_t st;
  Doc d;
  int fd;

  bw_report_paper_size (paper, &pw, &ph);
  settle_layout (pw, ph, running, footer, body, data, &prev, &total);

  /* The kept pass, into a temporary file beside PATH. */
  tmp = g_strdup_printf ("%s.XXXXXX", path);
  fd = g_mkstemp (tmp);
  if (fd < 0)
    {
      int e = errno;
      g_array_unref (prev);
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_WRITE, _("%s: cannot write: %s"), path, g_strerror (e));
      return FALSE;
    }
  close (fd);
  surface = cairo_pdf_surface_create (tmp, pw, ph);
  cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_TITLE, title);
  if (author && *author)
    cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_AUTHOR, author);
  cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_CREATOR, "Basinwright " PACKAGE_VERSION);
  doc_init (&d, surface, pw, ph, running, footer);
  d.final = TRUE;
  d.prev_toc = prev;
  d.total = total;
  body (&d, data);
  doc_clear (&d);
  cairo_surface_finish (surface);
  st = cairo_surface_status (surface);
  cairo_surface_destroy (surface);
  g_array_unref (prev);
  if (st != CAIRO_STATUS_SUCCESS)
    {
      g_unlink (tmp);
      g_set_error (error, BW_DRAW_ERROR, st == CAIRO_STATUS_WRITE_ERROR ? BW_DRAW_ERROR_WRITE : BW_DRAW_ERROR_CAIRO,
                   _("%s: cannot write: %s"), path, cairo_status_to_string (st));
      return FALSE;
    }
  g_chmod (tmp, 0644);
  if (g_rename (tmp, path) != 0)
    {
      int e = errno;
      g_unlink (tmp);
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_WRITE, _("%s: cannot write: %s"), path, g_strerror (e));
      return FALSE;
    }
  return TRUE;
}

/* The same layout as write_document, its kept pass recorded page by page (the preview). */
static GPtrArray *
render_document (BwReportPaper paper, const char *running, const char *footer, BodyFunc body,
                 gconstpointer data, GError **error)
{
  double pw, ph;
  GArray *prev = NULL;
  int total = 0;
  cairo_surface_t *scratch, *pdf;
  GPtrArray *pages = g_ptr_array_new_with_free_func ((GDestroyNotify) cairo_surface_destroy);
  Doc d;

  bw_report_paper_size (paper, &pw, &ph);
  settle_layout (pw, ph, running, footer, body, data, &prev, &total);

  /* Text is measured with the font options of a PDF surface, as in the file. */
  scratch = cairo_recording_surface_create (CAIRO_CONTENT_COLOR_ALPHA, NULL);
  doc_init (&d, scratch, pw, ph, running, footer);
  pdf = cairo_pdf_surface_create_for_stream (discard_write, NULL, pw, ph);
  d.font_options = cairo_font_options_create ();
  cairo_surface_get_font_options (pdf, d.font_options);
  cairo_surface_destroy (pdf);
  d.pages = pages;
  d.prev_toc = prev;
  d.total = total;
  body (&d, data);
  doc_clear (&d);
  cairo_surface_destroy (scratch);
  g_array_unref (prev);
  for (guint i = 0; i < pages->len; i++)
    {
      const cairo_status_t st = cairo_surface_status (g_ptr_array_index (pages, i));
      if (st != CAIRO_STATUS_SUCCESS)
        {
          g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_CAIRO, _("page %u: cannot be drawn: %s"), i + 1,
                       cairo_status_to_string (st));
          g_ptr_array_unref (pages);
          return NULL;
        }
    }
  return pages;
}

static void
report_body (Doc *d, gconstpointer data)
{
  const Report *rp = data;
  guint counts[4] = { 0 };
  g_autofree char *summary = NULL;

  bw_checks_count (rp->checks, counts);
  summary = g_strdup_printf (_("Criteria: %u pass, %u warn, %u fail, %u not applicable, over %u load cases."),
                             counts[BW_CHECK_PASS], counts[BW_CHECK_WARN], counts[BW_CHECK_FAIL],
                             counts[BW_CHECK_NOT_APPLICABLE], rp->r->n_cases);
  cover (d, rp->p, rp->set, _("Coagulation, flocculation and sedimentation — design calculations"), summary,
         rp->units);
  contents (d);
  design_basis (d, rp);
  for (guint i = 0; i < rp->p->trains->len; i++)
    {
      const BwTrain *tr = g_ptr_array_index (rp->p->trains, i);
      for (guint j = 0; j < tr->units->len; j++)
        unit_section (d, rp, tr, g_ptr_array_index (tr->units, j));
    }
  criteria_section (d, rp);
  methods_section (d);
}

static char *
running_text (const BwProject *p)
{
  return g_strdup_printf (_("%s · rev. %s"), nz (p->name, _("Untitled project")), nz (p->revision, "—"));
}

gboolean
bw_report_write_pdf (const BwProject *p, const BwResults *r, GArray *checks, const BwCriteriaSet *set,
                     BwReportPaper paper, BwUnitSystem units, const char *path, GError **error)
{
  Report rp = { p, r, checks, set, units };
  g_autofree char *running = NULL;
  g_autofree char *footer = NULL;

  g_return_val_if_fail (p != NULL && r != NULL && checks != NULL && set != NULL, FALSE);
  g_return_val_if_fail (path != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);
  if (paper >= BW_N_REPORT_PAPERS)
    {
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_SIZE, _("paper: unknown paper size"));
      return FALSE;
    }
  running = running_text (p);
  footer = g_strdup_printf (_("Basinwright %s · criteria %s"), PACKAGE_VERSION, set->id);
  return write_document (paper, path, nz (p->name, _("Design report")), p->preparer, running, footer,
                         report_body, &rp, error);
}

GPtrArray *
bw_report_render_pages (const BwProject *p, const BwResults *r, GArray *checks,
                        const BwCriteriaSet *set, BwReportPaper paper, BwUnitSystem units,
                        GError **error)
{
  Report rp = { p, r, checks, set, units };
  g_autofree char *running = NULL;
  g_autofree char *footer = NULL;

  g_return_val_if_fail (p != NULL && r != NULL && checks != NULL && set != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);
  if (paper >= BW_N_REPORT_PAPERS)
    {
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_SIZE, _("paper: unknown paper size"));
      return NULL;
    }
  /* The same header and footer text as bw_report_write_pdf: the pages cannot disagree. */
  running = running_text (p);
  footer = g_strdup_printf (_("Basinwright %s · criteria %s"), PACKAGE_VERSION, set->id);
  return render_document (paper, running, footer, report_body, &rp, error);
}

void
bw_report_paint_page (cairo_surface_t *page, cairo_t *cr, double scale)
{
  g_return_if_fail (page != NULL && cr != NULL);
  g_return_if_fail (isfinite (scale) && scale > 0);
  cairo_save (cr);
  cairo_scale (cr, scale, scale);
  cairo_set_source_rgb (cr, 1, 1, 1); /* the paper */
  cairo_paint (cr);
  cairo_set_source_surface (cr, page, 0, 0);
  cairo_paint (cr);
  cairo_restore (cr);
}

/* ------------------------------------------------------------------------------------------ */
/* The findings report */

typedef struct
{
  const BwProject *p;
  const BwResults *r;
  GArray *findings;
  const BwCriteriaSet *set;
  double tolerance;
  BwUnitSystem units;
} Review;

static char *
stated_case (const Review *rv, const BwFinding *f)
{
  g_autofree char *where = case_label (rv->r, f->load_case);
  switch (f->stated->which)
    {
    case BW_STATED_MAXIMUM:
      return f->load_case >= 0 ? g_strdup_printf (_("largest (at %s)"), where) : g_strdup (_("largest"));
    case BW_STATED_MINIMUM:
      return f->load_case >= 0 ? g_strdup_printf (_("smallest (at %s)"), where) : g_strdup (_("smallest"));
    default:
      return bw_label_load_case (&f->stated->load_case);
    }
}

static void
stated_table (Doc *d, const Review *rv, BwFindingKind kind, gboolean with_computed)
{
  static const double w[] = { 0.05, 0.14, 0.14, 0.16, 0.11, 0.11, 0.11, 0.18 };
  static const guint f[] = { T_RIGHT, T_MONO, 0, T_MUTED, T_RIGHT, T_RIGHT, T_RIGHT | T_BOLD, T_ITALIC };
  Table *t = table_new (8, w, f, 7.5, _("Line"), _("Element"), _("Quantity"), _("Case"), _("Stated"), _("Computed"),
                        _("Difference"), _("Reviewer's comment"));

  for (guint i = 0; i < rv->findings->len; i++)
    {
      const BwFinding *fi = &g_array_index (rv->findings, BwFinding, i);
      if (fi->kind != kind)
        continue;
      table_row_take (t, g_strdup_printf ("%u", fi->stated->line), g_strdup (fi->stated->element),
                      g_strdup (bw_label_text (bw_quantity_info (fi->stated->quantity)->label)), stated_case (rv, fi),
                      q_fmt (fi->stated->quantity, fi->stated->value, rv->units),
                      with_computed ? q_fmt (fi->stated->quantity, fi->computed, rv->units) : g_strdup ("—"),
                      with_computed ? bw_label_relative_change (fi->relative_difference) : g_strdup ("—"),
                      g_strdup (fi->stated->comment ? fi->stated->comment : ""));
    }
  if (t->rows->len == 0)
    doc_para (d, _("None."), 9.5, T_ITALIC);
  else
    doc_table (d, t);
  table_free (t);
}

static void
review_body (Doc *d, gconstpointer data)
{
  const Review *rv = data;
  guint n[4] = { 0 }, fails = 0, warns = 0;
  g_autofree char *summary = NULL;
  g_autofree char *intro = NULL;

  for (guint i = 0; i < rv->findings->len; i++)
    {
      const BwFinding *f = &g_array_index (rv->findings, BwFinding, i);
      n[f->kind]++;
      if (f->kind == BW_FINDING_CRITERION)
        fails += f->check->status == BW_CHECK_FAIL, warns += f->check->status == BW_CHECK_WARN;
    }
  summary = g_strdup_printf (_("%u stated values: %u discrepancies, %u agree, %u not computed. "
                             "Criteria findings: %u fail, %u warn."),
                             n[BW_FINDING_DISCREPANCY] + n[BW_FINDING_AGREES] + n[BW_FINDING_NOT_COMPUTED],
                             n[BW_FINDING_DISCREPANCY], n[BW_FINDING_AGREES], n[BW_FINDING_NOT_COMPUTED], fails,
                             warns);
  cover (d, rv->p, rv->set, _("Review of a submittal — findings"), summary, rv->units);

  doc_section (d, _("Discrepancies"));
  intro = g_strdup_printf (_("Values the submittal states that differ from Basinwright's own by more than "
                           "the reviewer's tolerance of %g %% (relative difference = (stated − computed) / "
                           "|computed|). Line numbers refer to the stated-values file, or to the project file "
                           "for values kept in its review record."),
                           rv->tolerance * 100);
  doc_para (d, intro, 9.5, 0);
  stated_table (d, rv, BW_FINDING_DISCREPANCY, TRUE);

  doc_sub (d, _("Stated values not matched"), FALSE, 40);
  doc_para (d, _("Stated values naming an element, quantity or load case that the computed results do "
               "not have."), 9, T_MUTED);
  stated_table (d, rv, BW_FINDING_NOT_COMPUTED, FALSE);

  doc_sub (d, _("Stated values within tolerance"), FALSE, 40);
  stated_table (d, rv, BW_FINDING_AGREES, TRUE);

  doc_section (d, _("Criteria findings"));
  {
    static const double w[] = { 0.09, 0.12, 0.18, 0.1, 0.12, 0.16, 0.23 };
    static const guint f[] = { T_BOLD, T_MONO, 0, T_RIGHT, T_RIGHT, T_MUTED, 0 };
    Table *t = table_new (7, w, f, 7.2, _("Status"), _("Element"), _("Criterion"), _("Value"), _("Limit"), _("Governing case"),
                          _("Clause cited"));
    g_autofree char *ci = g_strdup_printf (_("Every criterion of “%s” (%s) that fails (outside a required "
                                           "limit) or warns (outside a preferred range) in its governing "
                                           "load case."), nz (rv->set->name, rv->set->id), rv->set->id);
    doc_para (d, ci, 9.5, 0);
    for (guint i = 0; i < rv->findings->len; i++)
      {
        const BwFinding *fi = &g_array_index (rv->findings, BwFinding, i);
        const BwCheck *c = fi->check;
        if (fi->kind != BW_FINDING_CRITERION)
          continue;
        table_row_take (t, g_strdup (status_text (c->status)), g_strdup (element_id (rv->r, c->element)),
                        g_strdup (c->criterion->title), q_fmt (c->criterion->quantity, c->value, rv->units),
                        limit_text (c, rv->units), case_label (rv->r, c->governing_case),
                        citation_text (c->criterion));
      }
    if (t->rows->len == 0)
      doc_para (d, _("None: every criterion passes or does not apply."), 9.5, T_ITALIC);
    else
      doc_table (d, t);
    table_free (t);
  }
}

gboolean
bw_review_report_write_pdf (const BwProject *p, const BwResults *r, GArray *findings,
                            const BwCriteriaSet *set, double tolerance, BwReportPaper paper,
                            BwUnitSystem units, const char *path, GError **error)
{
  Review rv = { p, r, findings, set, tolerance, units };
  g_autofree char *running = NULL;
  g_autofree char *footer = NULL;
  g_autofree char *title = NULL;

  g_return_val_if_fail (p != NULL && r != NULL && findings != NULL && set != NULL, FALSE);
  g_return_val_if_fail (path != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);
  if (paper >= BW_N_REPORT_PAPERS)
    {
      g_set_error (error, BW_DRAW_ERROR, BW_DRAW_ERROR_SIZE, _("paper: unknown paper size"));
      return FALSE;
    }
  running = g_strdup_printf (_("%s · review"), nz (p->name, _("Untitled project")));
  {
    g_autofree char *rt = running_text (p);
    g_free (running);
    running = g_strdup_printf (_("%s · review findings"), rt);
  }
  {
    g_autofree char *c_tol = g_strdup_printf ("%g", tolerance * 100);
    g_autofree char *tol = bw_label_number (c_tol);
    footer = g_strdup_printf (_("Basinwright %s · criteria %s · tolerance %s %%"), PACKAGE_VERSION, set->id,
                              tol);
  }
  title = g_strdup_printf (_("Review findings: %s"), nz (p->name, _("project")));
  return write_document (paper, path, title, NULL, running, footer, review_body, &rv, error);
}
