/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-xml.c: safe XML loading, RELAX NG validation, atomic writes and data-file lookup. */
#include "config.h"

#include "io/bw-xml.h"

#include <errno.h>
#include <fcntl.h>
#include <glib/gstdio.h>
#include <libxml/parser.h>
#include <libxml/relaxng.h>
#include <libxml/xmlerror.h>
#include <string.h>
#include <unistd.h>

#include "engine/bw-i18n.h"

G_DEFINE_QUARK (bw-io-error-quark, bw_io_error)

/* libxml2 keeps one global error handler; ours stays silent and lets each context report. */
static void
quiet_generic (void *ctx, const char *msg, ...)
{
  (void) ctx;
  (void) msg;
}

static void
quiet_structured (void *ctx, xmlErrorPtr err)
{
  (void) ctx;
  (void) err;
}

static void
silence_libxml (void)
{
  static gsize once = 0;
  if (g_once_init_enter (&once))
    {
      xmlInitParser ();
      g_once_init_leave (&once, 1);
    }
  /* Per thread in libxml2; set every time (cheap). */
  xmlSetGenericErrorFunc (NULL, quiet_generic);
  xmlSetStructuredErrorFunc (NULL, quiet_structured);
}

/* Refuses what could make a parser reach outside the file or expand without bound: any document
 * type declaration (and so any entity declaration), checked on the raw bytes before parsing. */
static gboolean
check_safe (const char *data, gsize len, const char *name, GError **error)
{
  static const char *const forbidden[] = { "<!DOCTYPE", "<!ENTITY", "<!doctype", "<!entity" };

  for (guint i = 0; i < G_N_ELEMENTS (forbidden); i++)
    {
      const char *hit = g_strstr_len (data, (gssize) len, forbidden[i]);
      if (hit)
        {
          long line = 1;
          for (const char *p = data; p < hit; p++)
            line += *p == '\n';
          g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_UNSAFE,
                       BW_ ("%s:%ld: document type and entity declarations are not allowed"), name, line);
          return FALSE;
        }
    }
  if (memchr (data, '\0', len) != NULL)
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_MALFORMED, BW_ ("%s: the file holds a NUL byte; it is not text"),
                   name);
      return FALSE;
    }
  return TRUE;
}

xmlDoc *
bw_xml_read_memory (const char *data, gsize len, const char *name, GError **error)
{
  xmlParserCtxt *ctxt;
  xmlDoc *doc;
  const int options = XML_PARSE_NONET | XML_PARSE_NOERROR | XML_PARSE_NOWARNING
                      | XML_PARSE_NOCDATA | XML_PARSE_NOBLANKS;

  g_return_val_if_fail (data != NULL, NULL);
  if (name == NULL)
    name = "(buffer)";
  if (len > BW_XML_MAX_BYTES)
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_TOO_LARGE,
                   BW_ ("%s: %lu bytes is over the %d MiB limit for a file"), name, (unsigned long) len,
                   BW_XML_MAX_BYTES / (1024 * 1024));
      return NULL;
    }
  if (!check_safe (data, len, name, error))
    return NULL;
  if (!g_utf8_validate (data, (gssize) len, NULL))
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_MALFORMED, BW_ ("%s: the file is not valid UTF-8 text"),
                   name);
      return NULL;
    }

  silence_libxml ();
  ctxt = xmlNewParserCtxt ();
  if (ctxt == NULL)
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_READ, BW_ ("%s: out of memory"), name);
      return NULL;
    }
  doc = xmlCtxtReadMemory (ctxt, data, (int) len, name, "UTF-8", options);
  if (doc == NULL || !ctxt->wellFormed)
    {
      const xmlError *e = xmlCtxtGetLastError (ctxt);
      g_autofree char *msg = g_strchomp (g_strdup (e && e->message ? e->message : "not well-formed XML"));
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_MALFORMED, BW_ ("%s:%d: %s"), name, e ? e->line : 0, msg);
      if (doc)
        xmlFreeDoc (doc);
      xmlFreeParserCtxt (ctxt);
      return NULL;
    }
  xmlFreeParserCtxt (ctxt);
  if (doc->intSubset != NULL || doc->extSubset != NULL)
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_UNSAFE,
                   BW_ ("%s: document type declarations are not allowed"), name);
      xmlFreeDoc (doc);
      return NULL;
    }
  return doc;
}

xmlDoc *
bw_xml_read_file (const char *path, GError **error)
{
  g_autofree char *data = NULL;
  gsize len = 0;
  GStatBuf st;
  g_autoptr (GError) local = NULL;

  g_return_val_if_fail (path != NULL, NULL);
  if (g_stat (path, &st) == 0 && st.st_size > BW_XML_MAX_BYTES)
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_TOO_LARGE,
                   BW_ ("%s: %lld bytes is over the %d MiB limit for a file"), path,
                   (long long) st.st_size, BW_XML_MAX_BYTES / (1024 * 1024));
      return NULL;
    }
  if (!g_file_get_contents (path, &data, &len, &local))
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_READ, BW_ ("%s"), local->message);
      return NULL;
    }
  return bw_xml_read_memory (data, len, path, error);
}

typedef struct
{
  GString *first;
} ValidationErrors;

static void
collect_rng_error (void *user_data, xmlErrorPtr e)
{
  ValidationErrors *v = user_data;
  if (v->first->len == 0 && e != NULL)
    {
      g_autofree char *msg = g_strchomp (g_strdup (e->message ? e->message : "invalid"));
      g_string_printf (v->first, "%d: %s", e->line, msg);
    }
}

gboolean
bw_xml_validate (xmlDoc *doc, const char *schema_path, const char *name, GError **error)
{
  xmlRelaxNGParserCtxt *pctxt;
  xmlRelaxNG *schema;
  xmlRelaxNGValidCtxt *vctxt;
  ValidationErrors v = { g_string_new (NULL) };
  int rc;

  g_return_val_if_fail (doc != NULL && schema_path != NULL, FALSE);
  silence_libxml ();
  pctxt = xmlRelaxNGNewParserCtxt (schema_path);
  xmlRelaxNGSetParserStructuredErrors (pctxt, collect_rng_error, &v);
  schema = xmlRelaxNGParse (pctxt);
  xmlRelaxNGFreeParserCtxt (pctxt);
  if (schema == NULL)
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_READ, BW_ ("%s: the schema cannot be read (%s)"),
                   schema_path, v.first->str);
      g_string_free (v.first, TRUE);
      return FALSE;
    }
  g_string_truncate (v.first, 0);
  vctxt = xmlRelaxNGNewValidCtxt (schema);
  xmlRelaxNGSetValidStructuredErrors (vctxt, collect_rng_error, &v);
  rc = xmlRelaxNGValidateDoc (vctxt, doc);
  xmlRelaxNGFreeValidCtxt (vctxt);
  xmlRelaxNGFree (schema);
  if (rc != 0)
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_INVALID, BW_ ("%s:%s"), name ? name : "(document)",
                   v.first->len ? v.first->str : " does not match the schema");
      g_string_free (v.first, TRUE);
      return FALSE;
    }
  g_string_free (v.first, TRUE);
  return TRUE;
}

gboolean
bw_running_uninstalled (void)
{
  static gsize once = 0;
  static gboolean uninstalled = FALSE;

  if (g_once_init_enter (&once))
    {
      /* Linux names the running program's file here; elsewhere (no /proc) the program counts
       * as installed, which is the safe side: it then reads only the installed data. */
      g_autofree char *exe = g_file_read_link ("/proc/self/exe", NULL);
      gsize n = strlen (BW_BUILD_ROOT);
      uninstalled = exe != NULL && strncmp (exe, BW_BUILD_ROOT, n) == 0 && exe[n] == G_DIR_SEPARATOR;
      g_once_init_leave (&once, 1);
    }
  return uninstalled;
}

char *
bw_data_find (const char *relative)
{
  const char *env = g_getenv ("BW_DATADIR");
  const char *const dirs[] = { env, bw_running_uninstalled () ? BW_SOURCE_DATADIR : NULL, BW_DATADIR };

  for (guint i = 0; i < G_N_ELEMENTS (dirs); i++)
    {
      g_autofree char *p = NULL;
      if (dirs[i] == NULL || dirs[i][0] == '\0')
        continue;
      p = g_build_filename (dirs[i], relative, NULL);
      if (g_file_test (p, G_FILE_TEST_EXISTS))
        return g_steal_pointer (&p);
    }
  return NULL;
}

gboolean
bw_write_atomic (const char *path, const char *data, gsize len, GError **error)
{
  g_autofree char *dir = NULL;
  g_autofree char *base = NULL;
  g_autofree char *tmpl = NULL;
  int fd, dfd, saved;
  gsize done = 0;

  g_return_val_if_fail (path != NULL && data != NULL, FALSE);
  dir = g_path_get_dirname (path);
  base = g_path_get_basename (path);
  /* The rename below needs only the folder's permission, so without this check a file whose
   * write permission was taken away would be replaced all the same (GIO's g_file_replace
   * refuses it too). ENOENT: a new file, or a missing folder that mkstemp reports. */
  if (g_access (path, W_OK) != 0 && errno != ENOENT)
    {
      saved = errno;
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_WRITE,
                   BW_ ("%s: the file cannot be overwritten (%s); it is untouched"), path,
                   g_strerror (saved));
      return FALSE;
    }
  tmpl = g_strdup_printf ("%s/.%s.XXXXXX", dir, base);
  fd = g_mkstemp_full (tmpl, O_WRONLY | O_CLOEXEC, 0644);
  if (fd < 0)
    {
      saved = errno;
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_WRITE, BW_ ("%s: cannot write in %s: %s"), path, dir,
                   g_strerror (saved));
      return FALSE;
    }
  while (done < len)
    {
      const ssize_t n = write (fd, data + done, len - done);
      if (n < 0 && errno == EINTR)
        continue;
      if (n <= 0)
        goto fail;
      done += (gsize) n;
    }
  if (fsync (fd) != 0)
    goto fail;
  if (close (fd) != 0)
    {
      fd = -1;
      goto fail;
    }
  fd = -1;
  if (g_rename (tmpl, path) != 0)
    goto fail;
  /* Make the rename itself durable. */
  dfd = open (dir, O_RDONLY | O_DIRECTORY | O_CLOEXEC);
  if (dfd >= 0)
    {
      fsync (dfd);
      close (dfd);
    }
  return TRUE;

fail:
  saved = errno;
  if (fd >= 0)
    close (fd);
  g_unlink (tmpl);
  g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_WRITE,
               BW_ ("%s: the file could not be saved (%s); the previous version is untouched"), path,
               g_strerror (saved ? saved : EIO));
  return FALSE;
}

char *
bw_xml_prop (xmlNode *node, const char *name)
{
  xmlChar *v = xmlGetNoNsProp (node, (const xmlChar *) name);
  char *s;

  if (v == NULL)
    return NULL;
  s = g_strdup ((const char *) v);
  xmlFree (v);
  return s;
}

long
bw_xml_line (xmlNode *node)
{
  return node ? xmlGetLineNo (node) : 0;
}

gboolean
bw_xml_is (xmlNode *node, const char *ns, const char *name)
{
  return node && node->type == XML_ELEMENT_NODE && node->ns
         && g_strcmp0 ((const char *) node->ns->href, ns) == 0
         && strcmp ((const char *) node->name, name) == 0;
}
