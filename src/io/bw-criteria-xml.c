/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-criteria-xml.c: reading criteria-set files and finding the shipped and user sets. */
#include "config.h"

#include "io/bw-criteria-xml.h"

#include <math.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"
#include "engine/bw-units.h"
#include "io/bw-xml.h"

static gboolean
read_limits (xmlNode *node, BwQuantity q, BwLimits *out, const char *path, const char *id,
             GError **error)
{
  g_autofree char *unit_name = bw_xml_prop (node, "unit");
  const char *attrs[] = { "min", "max" };
  const BwQuantityInfo *info = bw_quantity_info (q);
  const BwUnit *unit;
  g_autoptr (GError) local = NULL;

  if (unit_name)
    {
      g_autofree char *field = g_strdup_printf ("%s:%ld: criterion %s", path, bw_xml_line (node), id);
      unit = bw_unit_lookup (unit_name, info->kind, field, &local);
      if (unit == NULL)
        {
          g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_INVALID, BW_ ("%s"), local->message);
          return FALSE;
        }
    }
  else
    unit = bw_units_si_unit (info->kind);

  for (int i = 0; i < 2; i++)
    {
      g_autofree char *text = bw_xml_prop (node, attrs[i]);
      char *end = NULL;
      double v;
      if (text == NULL)
        continue;
      v = g_ascii_strtod (text, &end);
      if (end == text || *end != '\0' || !isfinite (v))
        {
          g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_INVALID,
                       BW_ ("%s:%ld: criterion %s: %s='%s' is not a finite number"), path,
                       bw_xml_line (node), id, attrs[i], text);
          return FALSE;
        }
      v = bw_unit_to_si (unit, v);
      if (i == 0)
        out->has_min = TRUE, out->min = v;
      else
        out->has_max = TRUE, out->max = v;
    }
  return TRUE;
}

/* "maximum-day peak-hour" -> a bit mask; unknown words are errors. */
static gboolean
read_mask (xmlNode *node, const char *attr, gboolean (*lookup) (const char *, int *), guint *out,
           const char *path, const char *id, GError **error)
{
  g_autofree char *text = bw_xml_prop (node, attr);
  g_auto (GStrv) words = NULL;

  *out = 0;
  if (text == NULL)
    return TRUE;
  words = g_strsplit_set (text, " \t\n", -1);
  for (int i = 0; words[i]; i++)
    {
      int v;
      if (words[i][0] == '\0')
        continue;
      if (strcmp (words[i], "all") == 0)
        {
          *out = 0;
          return TRUE;
        }
      if (!lookup (words[i], &v))
        {
          g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_INVALID,
                       BW_ ("%s:%ld: criterion %s: '%s' is not a known value of %s"), path,
                       bw_xml_line (node), id, words[i], attr);
          return FALSE;
        }
      *out |= 1u << v;
    }
  return TRUE;
}

static gboolean lookup_flow (const char *s, int *v) { BwFlowKind k; if (!bw_flow_kind_from_name (s, &k)) return FALSE; *v = (int) k; return TRUE; }
static gboolean lookup_temp (const char *s, int *v) { BwTempKind k; if (!bw_temp_kind_from_name (s, &k)) return FALSE; *v = (int) k; return TRUE; }
static gboolean lookup_service (const char *s, int *v) { BwServiceState k; if (!bw_service_state_from_name (s, &k)) return FALSE; *v = (int) k; return TRUE; }
static gboolean lookup_element (const char *s, int *v) { BwElementType k; if (!bw_element_type_from_name (s, &k)) return FALSE; *v = (int) k; return TRUE; }

static char *
element_text (xmlNode *node)
{
  xmlChar *t = xmlNodeGetContent (node);
  char *s = g_strstrip (g_strdup (t ? (const char *) t : ""));
  xmlFree (t);
  return s;
}

static BwCriterion *
read_criterion (xmlNode *node, const char *path, GError **error)
{
  g_autoptr (BwCriterion) c = bw_criterion_new ();
  g_autofree char *quantity = bw_xml_prop (node, "quantity");

  c->id = bw_xml_prop (node, "id");
  if (!bw_quantity_from_name (quantity, &c->quantity))
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_INVALID,
                   BW_ ("%s:%ld: criterion %s: '%s' is not a quantity Basinwright reports"), path,
                   bw_xml_line (node), c->id, quantity ? quantity : "");
      return NULL;
    }
  if (!read_mask (node, "applies-to", lookup_element, &c->applies_to, path, c->id, error))
    return NULL;

  for (xmlNode *k = node->children; k; k = k->next)
    {
      if (k->type != XML_ELEMENT_NODE)
        continue;
      if (bw_xml_is (k, BW_CRITERIA_NS, "title"))
        c->title = element_text (k);
      else if (bw_xml_is (k, BW_CRITERIA_NS, "required"))
        {
          if (!read_limits (k, c->quantity, &c->required, path, c->id, error))
            return NULL;
        }
      else if (bw_xml_is (k, BW_CRITERIA_NS, "preferred"))
        {
          if (!read_limits (k, c->quantity, &c->preferred, path, c->id, error))
            return NULL;
        }
      else if (bw_xml_is (k, BW_CRITERIA_NS, "cases"))
        {
          if (!read_mask (k, "flows", lookup_flow, &c->cases.flows, path, c->id, error)
              || !read_mask (k, "temperatures", lookup_temp, &c->cases.temps, path, c->id, error)
              || !read_mask (k, "service", lookup_service, &c->cases.services, path, c->id, error))
            return NULL;
        }
      else if (bw_xml_is (k, BW_CRITERIA_NS, "citation"))
        {
          g_autofree char *prov = bw_xml_prop (k, "provenance");
          c->document = bw_xml_prop (k, "document");
          c->edition = bw_xml_prop (k, "edition");
          c->clause = bw_xml_prop (k, "clause");
          c->provenance = g_strcmp0 (prov, "seen") == 0 ? BW_PROVENANCE_SEEN : BW_PROVENANCE_MEMORY;
        }
      else if (bw_xml_is (k, BW_CRITERIA_NS, "note"))
        c->note = element_text (k);
    }
  if (c->title == NULL)
    c->title = g_strdup (bw_quantity_info (c->quantity)->label);
  return g_steal_pointer (&c);
}

BwCriteriaSet *
bw_criteria_set_load (const char *path, GError **error)
{
  g_autofree char *schema = bw_data_find ("criteria.rng");
  xmlDoc *doc;
  xmlNode *root;
  g_autoptr (BwCriteriaSet) set = NULL;
  g_autofree char *version = NULL;
  g_autofree char *id = NULL;

  g_return_val_if_fail (path != NULL, NULL);
  if (schema == NULL)
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_READ,
                   BW_ ("criteria.rng: the schema is not installed (set BW_DATADIR)"));
      return NULL;
    }
  doc = bw_xml_read_file (path, error);
  if (doc == NULL)
    return NULL;
  root = xmlDocGetRootElement (doc);
  version = root ? bw_xml_prop (root, "format-version") : NULL;
  if (root && bw_xml_is (root, BW_CRITERIA_NS, "criteria-set") && version
      && g_ascii_strtoll (version, NULL, 10) > BW_CRITERIA_FORMAT_VERSION)
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_VERSION,
                   BW_ ("%s: written in criteria format %s; this Basinwright reads format %d"), path,
                   version, BW_CRITERIA_FORMAT_VERSION);
      xmlFreeDoc (doc);
      return NULL;
    }
  if (!bw_xml_validate (doc, schema, path, error))
    {
      xmlFreeDoc (doc);
      return NULL;
    }
  id = bw_xml_prop (root, "id");
  set = bw_criteria_set_new (id, id);
  set->origin = g_strdup (path);
  for (xmlNode *k = root->children; k; k = k->next)
    {
      if (bw_xml_is (k, BW_CRITERIA_NS, "name"))
        {
          g_free (set->name);
          set->name = element_text (k);
        }
      else if (bw_xml_is (k, BW_CRITERIA_NS, "description"))
        set->description = element_text (k);
      else if (bw_xml_is (k, BW_CRITERIA_NS, "criterion"))
        {
          const long line = bw_xml_line (k);
          g_autoptr (GError) local = NULL;
          BwCriterion *c = read_criterion (k, path, error);
          if (c == NULL)
            {
              xmlFreeDoc (doc);
              return NULL;
            }
          if (!bw_criteria_set_add (set, c, &local))
            {
              g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_INVALID, BW_ ("%s:%ld: %s"), path, line,
                           local->message);
              xmlFreeDoc (doc);
              return NULL;
            }
        }
    }
  xmlFreeDoc (doc);
  return g_steal_pointer (&set);
}

GPtrArray *
bw_criteria_search_dirs (void)
{
  GPtrArray *dirs = g_ptr_array_new_with_free_func (g_free);
  const char *env = g_getenv ("BW_CRITERIA_PATH");
  g_autofree char *shipped = bw_data_find ("criteria");

  if (env && *env)
    {
      g_auto (GStrv) parts = g_strsplit (env, G_SEARCHPATH_SEPARATOR_S, -1);
      for (int i = 0; parts[i]; i++)
        if (*parts[i])
          g_ptr_array_add (dirs, g_strdup (parts[i]));
    }
  g_ptr_array_add (dirs, g_build_filename (g_get_user_data_dir (), "basinwright", "criteria", NULL));
  if (shipped)
    g_ptr_array_add (dirs, g_steal_pointer (&shipped));
  return dirs;
}

static gint
compare_strings (gconstpointer a, gconstpointer b)
{
  return strcmp (*(const char *const *) a, *(const char *const *) b);
}

GPtrArray *
bw_criteria_find_all (GPtrArray **skipped)
{
  g_autoptr (GPtrArray) dirs = bw_criteria_search_dirs ();
  GPtrArray *sets = g_ptr_array_new_with_free_func ((GDestroyNotify) bw_criteria_set_free);
  GPtrArray *skip = g_ptr_array_new_with_free_func (g_free);

  for (guint d = 0; d < dirs->len; d++)
    {
      g_autoptr (GDir) dir = g_dir_open (g_ptr_array_index (dirs, d), 0, NULL);
      g_autoptr (GPtrArray) names = g_ptr_array_new_with_free_func (g_free);
      const char *name;
      if (dir == NULL)
        continue;
      while ((name = g_dir_read_name (dir)))
        if (g_str_has_suffix (name, ".xml"))
          g_ptr_array_add (names, g_strdup (name));
      g_ptr_array_sort (names, compare_strings);
      for (guint i = 0; i < names->len; i++)
        {
          g_autofree char *path = g_build_filename (g_ptr_array_index (dirs, d),
                                                    g_ptr_array_index (names, i), NULL);
          g_autoptr (GError) error = NULL;
          BwCriteriaSet *set = bw_criteria_set_load (path, &error);
          gboolean dup = FALSE;
          if (set == NULL)
            {
              g_ptr_array_add (skip, g_strdup (error->message));
              continue;
            }
          for (guint k = 0; k < sets->len && !dup; k++)
            dup = g_strcmp0 (((BwCriteriaSet *) g_ptr_array_index (sets, k))->id, set->id) == 0;
          if (dup)
            {
              g_ptr_array_add (skip, g_strdup_printf ("%s: set id %s is already taken by an earlier "
                                                      "folder", path, set->id));
              bw_criteria_set_free (set);
              continue;
            }
          g_ptr_array_add (sets, set);
        }
    }
  if (skipped)
    *skipped = skip;
  else
    g_ptr_array_unref (skip);
  return sets;
}

BwCriteriaSet *
bw_criteria_set_open (const char *name_or_path, GError **error)
{
  g_autoptr (GPtrArray) sets = NULL;

  g_return_val_if_fail (name_or_path != NULL, NULL);
  if (strchr (name_or_path, '/') || g_str_has_suffix (name_or_path, ".xml"))
    return bw_criteria_set_load (name_or_path, error);
  sets = bw_criteria_find_all (NULL);
  for (guint i = 0; i < sets->len; i++)
    {
      BwCriteriaSet *s = g_ptr_array_index (sets, i);
      if (g_strcmp0 (s->id, name_or_path) == 0)
        return g_ptr_array_steal_index (sets, i);
    }
  g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_READ,
               BW_ ("no criteria set named '%s' (basinwright-cli criteria --list shows them)"), name_or_path);
  return NULL;
}
