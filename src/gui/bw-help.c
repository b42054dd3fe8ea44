/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-help.c: the in-app manual. The manual is docs/manual.md; this shows it in a text view with
 * its headings as a side list, read from local files only (no browser, no network). The
 * Markdown read is the small subset the manual uses: headings, paragraphs, lists, quotes, fenced
 * code, tables, and inline code, bold and links (shown as their text). */
#include "config.h"

#include "gui/bw-help.h"
#include "io/bw-xml.h"

#include <glib/gi18n.h>
#include <string.h>

#define HELP_KEY "bw-help-window"  /* on the parent: its help window */
#define STATE_KEY "bw-help-state"  /* on the help window: its Help */

char *
bw_help_find_manual (GError **error)
{
  const char *env = g_getenv ("BASINWRIGHT_DOCDIR");
  g_autofree char *source = bw_running_uninstalled ()
                              ? g_build_filename (BW_SOURCE_DATADIR, "..", "docs", "manual.md", NULL)
                              : NULL;
  g_autofree char *installed = g_build_filename (BW_DOCDIR, "manual.md", NULL);
  g_autofree char *from_env = env && env[0] ? g_build_filename (env, "manual.md", NULL) : NULL;
  const char *tried[] = { from_env, source, installed };

  for (guint i = 0; i < G_N_ELEMENTS (tried); i++)
    if (tried[i] && g_file_test (tried[i], G_FILE_TEST_IS_REGULAR))
      return g_strdup (tried[i]);
  if (from_env == NULL && source == NULL)
    g_set_error (error, G_FILE_ERROR, G_FILE_ERROR_NOENT, _("The manual was not found (looked for %s)"),
                 installed);
  else
    g_set_error (error, G_FILE_ERROR, G_FILE_ERROR_NOENT,
                 _("The manual was not found (looked for %s%s%s and %s)"), from_env ? from_env : "",
                 from_env && source ? ", " : "", source ? source : "", installed);
  return NULL;
}

const char *
bw_help_topic_for_page (const char *page_name)
{
  static const struct { const char *page; const char *topic; } topics[] = {
    { "unit", "unit page" },
    { "checks", "checks page" },
    { "basis", "design basis page" },
    { "sketch", "sketch page" },
    { "chemistry", "chemistry page|coagulation chemistry" },
    { "review", "review page|reviewing a submittal" },
  };

  for (guint i = 0; page_name && i < G_N_ELEMENTS (topics); i++)
    if (strcmp (page_name, topics[i].page) == 0)
      return topics[i].topic;
  return NULL;
}

/* --- Markdown into a text buffer --- */

typedef struct
{
  GtkTextBuffer *buffer;
  GPtrArray *headings;   /* char*, the text of each heading, in order */
  GArray *levels;        /* int, 1-3 */
  GString *para;         /* the paragraph being gathered */
  const char *para_tag;  /* "quote" or NULL */
} Md;

static void
insert_tagged (Md *md, const char *text, gssize len, const char *tag, const char *extra)
{
  GtkTextIter end;

  gtk_text_buffer_get_end_iter (md->buffer, &end);
  if (tag && extra)
    gtk_text_buffer_insert_with_tags_by_name (md->buffer, &end, text, len, tag, extra, NULL);
  else if (tag || extra)
    gtk_text_buffer_insert_with_tags_by_name (md->buffer, &end, text, len, tag ? tag : extra, NULL);
  else
    gtk_text_buffer_insert (md->buffer, &end, text, len);
}

/* Inline markup: `code`, **bold**, [text](target) -> text. */
static void
insert_inline (Md *md, const char *s, const char *base_tag)
{
  while (*s)
    {
      const char *tick = strchr (s, '`');
      const char *bold = strstr (s, "**");
      const char *link = strchr (s, '[');
      const char *next = NULL;

      if (tick && (!next || tick < next))
        next = tick;
      if (bold && (!next || bold < next))
        next = bold;
      if (link && (!next || link < next))
        next = link;
      if (next == NULL)
        {
          insert_tagged (md, s, -1, base_tag, NULL);
          return;
        }
      if (next > s)
        insert_tagged (md, s, next - s, base_tag, NULL);
      if (next == tick)
        {
          const char *close = strchr (tick + 1, '`');
          if (close == NULL)
            {
              insert_tagged (md, tick, -1, base_tag, NULL);
              return;
            }
          insert_tagged (md, tick + 1, close - tick - 1, "code", base_tag);
          s = close + 1;
        }
      else if (next == bold)
        {
          const char *close = strstr (bold + 2, "**");
          if (close == NULL)
            {
              insert_tagged (md, bold, -1, base_tag, NULL);
              return;
            }
          {
            g_autofree char *inner = g_strndup (bold + 2, close - bold - 2);
            insert_tagged (md, inner, -1, "bold", base_tag);
          }
          s = close + 2;
        }
      else
        {
          const char *close = strstr (link, "](");
          const char *end = close ? strchr (close + 2, ')') : NULL;
          if (close == NULL || end == NULL || memchr (link, '\n', close - link))
            {
              insert_tagged (md, link, 1, base_tag, NULL);
              s = link + 1;
              continue;
            }
          insert_tagged (md, link + 1, close - link - 1, "link", base_tag);
          s = end + 1;
        }
    }
}

static void
flush_para (Md *md)
{
  if (md->para->len == 0)
    return;
  insert_inline (md, md->para->str, md->para_tag);
  insert_tagged (md, "\n\n", -1, NULL, NULL);
  g_string_truncate (md->para, 0);
  md->para_tag = NULL;
}

static void
add_to_para (Md *md, const char *text, const char *tag)
{
  if (md->para->len > 0 && g_strcmp0 (md->para_tag, tag) != 0)
    flush_para (md);
  md->para_tag = tag;
  if (md->para->len > 0)
    g_string_append_c (md->para, ' ');
  g_string_append (md->para, text);
}

static gboolean
is_table_rule (const char *line)
{
  for (const char *p = line; *p; p++)
    if (!strchr ("|-: ", *p))
      return FALSE;
  return TRUE;
}

static void
render_markdown (Md *md, const char *text)
{
  g_auto (GStrv) lines = g_strsplit (text, "\n", -1);
  gboolean fence = FALSE;

  for (guint i = 0; lines[i]; i++)
    {
      char *line = lines[i];
      gsize n = strlen (line);

      if (n > 0 && line[n - 1] == '\r')
        line[--n] = '\0';
      if (g_str_has_prefix (line, "```"))
        {
          flush_para (md);
          if (fence)
            insert_tagged (md, "\n", -1, NULL, NULL);
          fence = !fence;
          continue;
        }
      if (fence)
        {
          insert_tagged (md, line, -1, "code", "block");
          insert_tagged (md, "\n", -1, "block", NULL);
          continue;
        }
      if (line[0] == '#')
        {
          int level = 0;
          const char *t = line;
          while (*t == '#')
            level++, t++;
          while (*t == ' ')
            t++;
          flush_para (md);
          level = CLAMP (level, 1, 3);
          {
            GtkTextIter end;
            g_autofree char *mark = g_strdup_printf ("heading-%u", md->headings->len);
            char tag[4] = { 'h', (char) ('0' + level), '\0', '\0' };
            gtk_text_buffer_get_end_iter (md->buffer, &end);
            gtk_text_buffer_create_mark (md->buffer, mark, &end, TRUE);
            g_ptr_array_add (md->headings, g_strdup (t));
            g_array_append_val (md->levels, level);
            insert_inline (md, t, tag);
            insert_tagged (md, "\n", -1, NULL, NULL);
          }
          continue;
        }
      if (n == 0)
        {
          flush_para (md);
          continue;
        }
      if (line[0] == '|')
        {
          flush_para (md);
          if (!is_table_rule (line))
            {
              insert_tagged (md, line, -1, "code", "block");
              insert_tagged (md, "\n", -1, "block", NULL);
            }
          if (lines[i + 1] == NULL || lines[i + 1][0] != '|')
            insert_tagged (md, "\n", -1, NULL, NULL);
          continue;
        }
      if (line[0] == '>')
        {
          add_to_para (md, line[1] == ' ' ? line + 2 : line + 1, "quote");
          continue;
        }
      if ((line[0] == '-' || line[0] == '*') && line[1] == ' ')
        {
          flush_para (md);
          md->para_tag = "item";
          g_string_append (md->para, "• ");
          g_string_append (md->para, line + 2);
          /* continuation lines join the item; the item ends at the next item or a blank line */
          while (lines[i + 1] && lines[i + 1][0] == ' ' && g_strstrip (lines[i + 1])[0] != '\0')
            {
              g_string_append_c (md->para, ' ');
              g_string_append (md->para, lines[++i]);
            }
          insert_inline (md, md->para->str, "item");
          insert_tagged (md, "\n", -1, NULL, NULL);
          g_string_truncate (md->para, 0);
          md->para_tag = NULL;
          if (lines[i + 1] == NULL || lines[i + 1][0] == '\0')
            insert_tagged (md, "\n", -1, NULL, NULL);
          continue;
        }
      add_to_para (md, g_strstrip (line), NULL);
    }
  flush_para (md);
}

/* --- the window --- */

typedef struct
{
  GtkTextView *view;
  GtkListBox *list;
  GPtrArray *headings;
  char *current;
  gboolean syncing;
} Help;

static void
help_free (gpointer data)
{
  Help *h = data;

  g_ptr_array_unref (h->headings);
  g_free (h->current);
  g_free (h);
}

static void
scroll_to_heading (Help *h, guint index)
{
  GtkTextBuffer *buffer = gtk_text_view_get_buffer (h->view);
  g_autofree char *name = g_strdup_printf ("heading-%u", index);
  GtkTextMark *mark = gtk_text_buffer_get_mark (buffer, name);

  if (mark == NULL)
    return;
  gtk_text_view_scroll_to_mark (h->view, mark, 0.0, TRUE, 0.0, 0.0);
  g_free (h->current);
  h->current = g_strdup (g_ptr_array_index (h->headings, index));
}

static void
heading_selected (GtkListBox *list, GtkListBoxRow *row, gpointer data)
{
  Help *h = data;

  (void) list;
  if (row == NULL || h->syncing)
    return;
  scroll_to_heading (h, (guint) gtk_list_box_row_get_index (row));
}

/* TOPIC is one or more alternatives separated by '|', best first. */
static int
find_heading (Help *h, const char *topic)
{
  g_auto (GStrv) alternatives = topic ? g_strsplit (topic, "|", -1) : NULL;

  for (guint a = 0; alternatives && alternatives[a]; a++)
    {
      g_autofree char *want = g_utf8_casefold (alternatives[a], -1);
      for (guint i = 0; i < h->headings->len; i++)
        {
          g_autofree char *have = g_utf8_casefold (g_ptr_array_index (h->headings, i), -1);
          if (strstr (have, want))
            return (int) i;
        }
    }
  return -1;
}

static void
help_goto (GtkWindow *win, const char *topic)
{
  Help *h = g_object_get_data (G_OBJECT (win), STATE_KEY);
  int i = find_heading (h, topic);

  if (i < 0)
    i = 0;
  if (h->headings->len == 0)
    return;
  h->syncing = TRUE;
  gtk_list_box_select_row (h->list, gtk_list_box_get_row_at_index (h->list, i));
  h->syncing = FALSE;
  scroll_to_heading (h, (guint) i);
}

static GtkWindow *
help_window_new (GtkWindow *parent)
{
  GtkWindow *win = GTK_WINDOW (gtk_window_new ());
  GtkWidget *paned = gtk_paned_new (GTK_ORIENTATION_HORIZONTAL);
  GtkWidget *side = gtk_scrolled_window_new ();
  GtkWidget *main = gtk_scrolled_window_new ();
  GtkWidget *view = gtk_text_view_new ();
  GtkWidget *list = gtk_list_box_new ();
  GtkTextBuffer *buffer = gtk_text_view_get_buffer (GTK_TEXT_VIEW (view));
  Help *h = g_new0 (Help, 1);
  g_autoptr (GError) error = NULL;
  g_autofree char *path = bw_help_find_manual (&error);
  g_autofree char *text = NULL;
  Md md = { 0 };

  gtk_window_set_title (win, _("Basinwright manual"));
  gtk_window_set_default_size (win, 900, 640);
  if (parent)
    {
      gtk_window_set_transient_for (win, parent);
      gtk_window_set_application (win, gtk_window_get_application (parent));
      gtk_window_set_destroy_with_parent (win, TRUE);
    }
  gtk_window_set_hide_on_close (win, FALSE);

  gtk_text_view_set_editable (GTK_TEXT_VIEW (view), FALSE);
  gtk_text_view_set_cursor_visible (GTK_TEXT_VIEW (view), FALSE);
  gtk_text_view_set_wrap_mode (GTK_TEXT_VIEW (view), GTK_WRAP_WORD_CHAR);
  gtk_text_view_set_left_margin (GTK_TEXT_VIEW (view), 18);
  gtk_text_view_set_right_margin (GTK_TEXT_VIEW (view), 18);
  gtk_text_view_set_top_margin (GTK_TEXT_VIEW (view), 12);
  gtk_text_view_set_bottom_margin (GTK_TEXT_VIEW (view), 12);
  gtk_text_view_set_pixels_below_lines (GTK_TEXT_VIEW (view), 2);
  gtk_text_buffer_create_tag (buffer, "h1", "weight", PANGO_WEIGHT_BOLD, "scale", 1.6,
                              "pixels-below-lines", 8, NULL);
  gtk_text_buffer_create_tag (buffer, "h2", "weight", PANGO_WEIGHT_BOLD, "scale", 1.3,
                              "pixels-above-lines", 10, "pixels-below-lines", 6, NULL);
  gtk_text_buffer_create_tag (buffer, "h3", "weight", PANGO_WEIGHT_BOLD, "scale", 1.1,
                              "pixels-above-lines", 6, "pixels-below-lines", 4, NULL);
  gtk_text_buffer_create_tag (buffer, "bold", "weight", PANGO_WEIGHT_BOLD, NULL);
  gtk_text_buffer_create_tag (buffer, "code", "family", "monospace", NULL);
  gtk_text_buffer_create_tag (buffer, "block", "left-margin", 36, "wrap-mode", GTK_WRAP_NONE, NULL);
  gtk_text_buffer_create_tag (buffer, "quote", "left-margin", 36, "style", PANGO_STYLE_ITALIC, NULL);
  gtk_text_buffer_create_tag (buffer, "item", "left-margin", 30, "indent", -12, NULL);
  gtk_text_buffer_create_tag (buffer, "link", "underline", PANGO_UNDERLINE_SINGLE, NULL);

  md.buffer = buffer;
  md.headings = g_ptr_array_new_with_free_func (g_free);
  md.levels = g_array_new (FALSE, FALSE, sizeof (int));
  md.para = g_string_new (NULL);
  if (path == NULL || !g_file_get_contents (path, &text, NULL, &error) || !g_utf8_validate (text, -1, NULL))
    {
      g_autofree char *msg = g_strdup_printf (_("The manual cannot be shown: %s"),
                                              error ? error->message : _("it is not valid UTF-8"));
      render_markdown (&md, msg);
    }
  else
    render_markdown (&md, text);
  g_string_free (md.para, TRUE);

  for (guint i = 0; i < md.headings->len; i++)
    {
      GtkWidget *label = gtk_label_new (g_ptr_array_index (md.headings, i));
      int level = g_array_index (md.levels, int, i);
      gtk_label_set_xalign (GTK_LABEL (label), 0.0);
      gtk_label_set_ellipsize (GTK_LABEL (label), PANGO_ELLIPSIZE_END);
      gtk_widget_set_margin_start (label, 8 + 14 * (level - 1));
      gtk_widget_set_margin_end (label, 8);
      gtk_widget_set_margin_top (label, 3);
      gtk_widget_set_margin_bottom (label, 3);
      if (level == 1)
        gtk_widget_add_css_class (label, "heading");
      gtk_list_box_append (GTK_LIST_BOX (list), label);
    }
  g_array_unref (md.levels);
  h->headings = md.headings;
  h->view = GTK_TEXT_VIEW (view);
  h->list = GTK_LIST_BOX (list);
  g_object_set_data_full (G_OBJECT (win), STATE_KEY, h, help_free);
  g_signal_connect (list, "row-selected", G_CALLBACK (heading_selected), h);

  gtk_accessible_update_property (GTK_ACCESSIBLE (list), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Manual contents"), -1);
  gtk_accessible_update_property (GTK_ACCESSIBLE (view), GTK_ACCESSIBLE_PROPERTY_LABEL,
                                  _("Manual text"), -1);
  gtk_scrolled_window_set_policy (GTK_SCROLLED_WINDOW (side), GTK_POLICY_NEVER, GTK_POLICY_AUTOMATIC);
  gtk_scrolled_window_set_child (GTK_SCROLLED_WINDOW (side), list);
  gtk_scrolled_window_set_child (GTK_SCROLLED_WINDOW (main), view);
  gtk_widget_set_size_request (side, 220, -1);
  gtk_paned_set_start_child (GTK_PANED (paned), side);
  gtk_paned_set_end_child (GTK_PANED (paned), main);
  gtk_paned_set_shrink_start_child (GTK_PANED (paned), FALSE);
  gtk_paned_set_position (GTK_PANED (paned), 250);
  gtk_window_set_child (win, paned);
  return win;
}

static void
help_destroyed (GtkWindow *parent)
{
  g_object_set_data (G_OBJECT (parent), HELP_KEY, NULL);
}

GtkWindow *
bw_help_show (GtkWindow *parent, const char *topic)
{
  GtkWindow *win = parent ? g_object_get_data (G_OBJECT (parent), HELP_KEY) : NULL;

  if (win == NULL)
    {
      win = help_window_new (parent);
      if (parent)
        {
          g_object_set_data (G_OBJECT (parent), HELP_KEY, win);
          /* forgotten when it closes; the connection ends by itself if the parent goes first */
          g_signal_connect_object (win, "destroy", G_CALLBACK (help_destroyed), parent, G_CONNECT_SWAPPED);
        }
    }
  help_goto (win, topic);
  gtk_window_present (win);
  return win;
}

const char *
bw_help_get_current_heading (GtkWindow *help)
{
  Help *h;

  g_return_val_if_fail (GTK_IS_WINDOW (help), NULL);
  h = g_object_get_data (G_OBJECT (help), STATE_KEY);
  return h ? h->current : NULL;
}
