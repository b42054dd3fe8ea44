/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-project-xml.c: reading and writing .bwproj project files (format 1, docs/file-format.md). */
#include "config.h"

#include "io/bw-project-xml.h"

#include <glib/gstdio.h>
#include <libxml/xmlsave.h>
#include <stdarg.h>
#include <math.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"
#include "engine/bw-units.h"
#include "io/bw-xml.h"

#define NS BW_PROJECT_NS

static char *
text_of (xmlNode *node)
{
  xmlChar *t = xmlNodeGetContent (node);
  char *s = g_strstrip (g_strdup (t ? (const char *) t : ""));
  xmlFree (t);
  return s;
}

/* Serialises a foreign element so it can be written back unchanged. */
static char *
dump_node (xmlDoc *doc, xmlNode *node)
{
  xmlBuffer *buf = xmlBufferCreate ();
  char *s;

  xmlNodeDump (buf, doc, node, 0, 0);
  s = g_strdup ((const char *) xmlBufferContent (buf));
  xmlBufferFree (buf);
  return s;
}

static gboolean
is_foreign (xmlNode *node)
{
  return node->type == XML_ELEMENT_NODE && (node->ns == NULL || g_strcmp0 ((const char *) node->ns->href, NS) != 0);
}

static gboolean
fail (GError **error, const char *path, xmlNode *node, const char *fmt, ...) G_GNUC_PRINTF (4, 5);

static gboolean
fail (GError **error, const char *path, xmlNode *node, const char *fmt, ...)
{
  va_list ap;
  g_autofree char *msg = NULL;

  va_start (ap, fmt);
  msg = g_strdup_vprintf (fmt, ap);
  va_end (ap);
  g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_INVALID, BW_ ("%s:%ld: %s"), path, bw_xml_line (node), msg);
  return FALSE;
}

/* A number with an optional unit attribute of KIND, into SI. */
static gboolean
read_quantity (xmlNode *node, BwQuantityKind kind, const char *what, double *out, const char *path,
               GError **error)
{
  g_autofree char *text = text_of (node);
  g_autofree char *unit_name = bw_xml_prop (node, "unit");
  const BwUnit *unit;
  g_autoptr (GError) local = NULL;
  char *end = NULL;
  double v;

  v = g_ascii_strtod (text, &end);
  if (end == text || *end != '\0' || !isfinite (v))
    return fail (error, path, node, BW_ ("%s: '%s' is not a finite number"), what, text);
  if (unit_name)
    {
      unit = bw_unit_lookup (unit_name, kind, what, &local);
      if (unit == NULL)
        return fail (error, path, node, BW_ ("%s"), local->message);
    }
  else
    unit = bw_units_si_unit (kind);
  *out = bw_unit_to_si (unit, v);
  if (!isfinite (*out))
    return fail (error, path, node, BW_ ("%s: '%s' is too large"), what, text);
  return TRUE;
}

static gboolean
read_values (xmlDoc *doc, xmlNode *parent, BwProcessUnit *u, const char *path, GError **error)
{
  for (xmlNode *k = parent->children; k; k = k->next)
    {
      if (k->type != XML_ELEMENT_NODE)
        continue;
      if (is_foreign (k))
        {
          g_ptr_array_add (u->foreign, dump_node (doc, k));
          continue;
        }
      if (bw_xml_is (k, NS, "value"))
        {
          g_autofree char *param = bw_xml_prop (k, "param");
          const int i = bw_param_index (u->type, param);
          const BwParamSpec *spec;
          g_autoptr (GError) local = NULL;
          double v = 0;

          if (i < 0)
            return fail (error, path, k, BW_ ("%s: a %s has no parameter '%s'"), u->id,
                         bw_process_type_label (u->type), param);
          spec = &bw_params_of (u->type, NULL)[i];
          if (spec->type == BW_PARAM_CHOICE)
            {
              g_autofree char *text = text_of (k);
              int idx;
              if (!bw_param_choice_index (spec, text, &idx))
                {
                  g_autofree char *choices = bw_param_choices_joined (spec);
                  return fail (error, path, k, BW_ ("%s: %s: '%s' is not one of %s"), u->id, spec->label,
                               text, choices);
                }
              v = idx;
            }
          else if (!read_quantity (k, spec->kind, spec->label, &v, path, error))
            return FALSE;
          if (!bw_process_unit_set (u, param, v, &local))
            return fail (error, path, k, BW_ ("%s: %s"), u->id, local->message);
        }
    }
  return TRUE;
}

static gboolean
read_count_attr (xmlNode *node, const char *name, guint *out, const char *path, GError **error)
{
  g_autofree char *text = bw_xml_prop (node, name);
  char *end = NULL;
  gint64 v;

  if (text == NULL)
    return TRUE;
  v = g_ascii_strtoll (text, &end, 10);
  if (end == text || *end != '\0' || v < 0 || v > 1000)
    return fail (error, path, node, BW_ ("%s='%s' is not a whole number from 0 to 1000"), name, text);
  *out = (guint) v;
  return TRUE;
}

static BwProcessUnit *
read_unit (xmlDoc *doc, xmlNode *node, gboolean is_stage, const char *path, GError **error)
{
  g_autofree char *type_name = bw_xml_prop (node, "type");
  g_autofree char *id = bw_xml_prop (node, "id");
  g_autofree char *name = bw_xml_prop (node, "name");
  g_autoptr (BwProcessUnit) u = NULL;
  BwProcessType type;

  if (!bw_process_type_from_name (type_name, &type) || bw_process_type_is_stage (type) != is_stage)
    {
      fail (error, path, node, BW_ ("%s: '%s' is not a kind of %s Basinwright knows"), id, type_name,
            is_stage ? BW_ ("flocculator stage") : BW_ ("unit"));
      return NULL;
    }
  u = bw_process_unit_new (type, id, name);
  if (!read_count_attr (node, "parallel", &u->n_parallel, path, error)
      || !read_count_attr (node, "standby", &u->n_standby, path, error))
    return NULL;
  if (!read_values (doc, node, u, path, error))
    return NULL;
  for (xmlNode *k = node->children; k; k = k->next)
    if (bw_xml_is (k, NS, "stage"))
      {
        BwProcessUnit *s = read_unit (doc, k, TRUE, path, error);
        if (s == NULL)
          return NULL;
        g_ptr_array_add (u->stages, s);
      }
  return g_steal_pointer (&u);
}

static gboolean
read_basis (xmlNode *node, BwProject *p, const char *path, GError **error)
{
  guint temps = 0;

  for (xmlNode *k = node->children; k; k = k->next)
    {
      if (bw_xml_is (k, NS, "flow"))
        {
          g_autofree char *c = bw_xml_prop (k, "case");
          BwFlowKind f;
          if (!bw_flow_kind_from_name (c, &f))
            return fail (error, path, k, BW_ ("flow: '%s' is not a flow case"), c);
          if ((p->basis.flows_given >> f) & 1)
            return fail (error, path, k, BW_ ("%s flow: given twice"), bw_flow_kind_label (f));
          if (!read_quantity (k, BW_KIND_FLOW, "flow", &p->basis.flow_m3_s[f], path, error))
            return FALSE;
          p->basis.flows_given |= 1u << f;
        }
      else if (bw_xml_is (k, NS, "temperature"))
        {
          g_autofree char *c = bw_xml_prop (k, "case");
          BwTempKind t;
          if (!bw_temp_kind_from_name (c, &t))
            return fail (error, path, k, BW_ ("temperature: '%s' is not a temperature case"), c);
          if ((temps >> t) & 1)
            return fail (error, path, k, BW_ ("%s temperature: given twice"), c);
          if (!read_quantity (k, BW_KIND_TEMPERATURE, "temperature", &p->basis.temperature_K[t],
                              path, error))
            return FALSE;
          temps |= 1u << t;
        }
      else if (bw_xml_is (k, NS, "raw-water"))
        for (xmlNode *w = k->children; w; w = w->next)
          {
            if (bw_xml_is (w, NS, "turbidity")
                && !read_quantity (w, BW_KIND_TURBIDITY, "turbidity", &p->basis.turbidity_NTU, path, error))
              return FALSE;
            if (bw_xml_is (w, NS, "alkalinity")
                && !read_quantity (w, BW_KIND_CONCENTRATION, "alkalinity", &p->basis.alkalinity_kg_m3,
                                   path, error))
              return FALSE;
            if (bw_xml_is (w, NS, "ph") && !read_quantity (w, BW_KIND_NUMBER, "pH", &p->basis.ph, path, error))
              return FALSE;
          }
    }
  if (temps != 3)
    return fail (error, path, node, BW_ ("design basis: both the coldest and the warmest temperature are needed"));
  return TRUE;
}

/* An optional chemistry input: present means given, so it must be above zero (0 is the model's
 * "not given"). */
static gboolean
read_positive (xmlNode *node, BwQuantityKind kind, const char *what, double *out, const char *path,
               GError **error)
{
  if (!read_quantity (node, kind, what, out, path, error))
    return FALSE;
  if (!(*out > 0))
    {
      g_autofree char *text = text_of (node);
      return fail (error, path, node, BW_ ("%s: must be above zero when given (got %s)"), what, text);
    }
  return TRUE;
}

static gboolean
read_chemistry (xmlNode *node, BwProject *p, const char *path, GError **error)
{
  BwChemistryBasis *c = &p->chemistry;
  g_autofree char *kind = bw_xml_prop (node, "coagulant");
  guint doses = 0;

  c->enabled = TRUE;
  c->jar_test = bw_xml_prop (node, "jar-test");
  if (!bw_coagulant_kind_from_name (kind, &c->kind))
    return fail (error, path, node, BW_ ("chemistry: '%s' is not a coagulant"), kind);
  for (xmlNode *k = node->children; k; k = k->next)
    {
      if (bw_xml_is (k, NS, "hydrate")
          && !read_quantity (k, BW_KIND_NUMBER, "hydrate", &c->hydrate_waters, path, error))
        return FALSE;
      if (bw_xml_is (k, NS, "al2o3")
          && !read_quantity (k, BW_KIND_FRACTION, "Al2O3 content", &c->al2o3_fraction, path, error))
        return FALSE;
      if (bw_xml_is (k, NS, "basicity")
          && !read_quantity (k, BW_KIND_FRACTION, "basicity", &c->basicity, path, error))
        return FALSE;
      if (bw_xml_is (k, NS, "ss-factor")
          && !read_quantity (k, BW_KIND_NUMBER, "suspended solids factor", &c->ss_factor, path, error))
        return FALSE;
      if (bw_xml_is (k, NS, "residual-alkalinity")
          && !read_quantity (k, BW_KIND_CONCENTRATION, "residual alkalinity", &c->residual_target_kg_m3,
                             path, error))
        return FALSE;
      if (bw_xml_is (k, NS, "stock-strength")
          && !read_positive (k, BW_KIND_FRACTION, "stock solution strength", &c->stock_fraction,
                             path, error))
        return FALSE;
      if (bw_xml_is (k, NS, "stock-density")
          && !read_positive (k, BW_KIND_DENSITY, "stock solution density",
                             &c->stock_density_kg_m3, path, error))
        return FALSE;
      if (bw_xml_is (k, NS, "sludge-solids")
          && !read_positive (k, BW_KIND_FRACTION, "sludge solids content",
                             &c->sludge_solids_fraction, path, error))
        return FALSE;
      if (bw_xml_is (k, NS, "target-turbidity")
          && !read_positive (k, BW_KIND_TURBIDITY, "target settled turbidity", &c->target_NTU, path,
                             error))
        return FALSE;
      if (bw_xml_is (k, NS, "alkali"))
        {
          g_autofree char *text = text_of (k);
          if (!bw_alkali_kind_from_name (text, &c->alkali))
            return fail (error, path, k, BW_ ("alkali supplement: '%s' is not lime or soda-ash"), text);
        }
      if (bw_xml_is (k, NS, "dose"))
        {
          g_autofree char *which = bw_xml_prop (k, "case");
          double *slot = g_strcmp0 (which, "minimum") == 0 ? &c->dose_min_kg_m3
                         : g_strcmp0 (which, "design") == 0 ? &c->dose_design_kg_m3 : &c->dose_max_kg_m3;
          if (!read_quantity (k, BW_KIND_CONCENTRATION, "dose", slot, path, error))
            return FALSE;
          doses |= g_strcmp0 (which, "minimum") == 0 ? 1 : g_strcmp0 (which, "design") == 0 ? 2 : 4;
        }
    }
  if (doses != 7)
    return fail (error, path, node, BW_ ("chemistry: the minimum, design and maximum doses are all needed"));
  return TRUE;
}

static gboolean
read_number_attr (xmlNode *node, const char *name, double *out, gboolean *present, const char *path,
                  GError **error)
{
  g_autofree char *text = bw_xml_prop (node, name);
  char *end = NULL;

  *present = text != NULL;
  if (text == NULL)
    return TRUE;
  *out = g_ascii_strtod (text, &end);
  if (end == text || *end != '\0' || !isfinite (*out))
    return fail (error, path, node, BW_ ("jar: %s='%s' is not a finite number"), name, text);
  return TRUE;
}

static gboolean
read_jar_test (xmlNode *node, BwProject *p, const char *path, GError **error)
{
  g_autofree char *id = bw_xml_prop (node, "id");
  g_autofree char *name = bw_xml_prop (node, "name");
  BwJarTestRecord *r = bw_jar_test_record_new (id, name);
  guint with_ph = 0, with_zeta = 0, with_mob = 0;

  g_ptr_array_add (p->jar_tests, r);
  for (xmlNode *k = node->children; k; k = k->next)
    {
      if (bw_xml_is (k, NS, "temperature")
          && !read_quantity (k, BW_KIND_TEMPERATURE, "jar-test temperature", &r->temperature_K, path, error))
        return FALSE;
      if (bw_xml_is (k, NS, "jar"))
        {
          BwJar *j;
          gboolean has = FALSE, d1, d2;
          if (r->series.n_jars >= BW_JAR_MAX)
            return fail (error, path, k, BW_ ("jar test %s: more than %d jars"), id, BW_JAR_MAX);
          j = &r->series.jars[r->series.n_jars++];
          if (!read_number_attr (k, "dose", &j->dose_kg_m3, &d1, path, error)
              || !read_number_attr (k, "turbidity", &j->turbidity_NTU, &d2, path, error)
              || !read_number_attr (k, "ph", &j->ph, &has, path, error))
            return FALSE;
          with_ph += has;
          if (!read_number_attr (k, "zeta", &j->zeta_V, &has, path, error))
            return FALSE;
          with_zeta += has;
          if (!read_number_attr (k, "mobility", &j->mobility_m2_V_s, &has, path, error))
            return FALSE;
          with_mob += has;
        }
    }
  /* A column is either on every jar or on none. */
  if ((with_ph && with_ph != r->series.n_jars) || (with_zeta && with_zeta != r->series.n_jars)
      || (with_mob && with_mob != r->series.n_jars))
    return fail (error, path, node, BW_ ("jar test %s: pH, zeta or mobility is given for some jars only"), id);
  r->series.has_ph = with_ph > 0;
  r->series.has_zeta = with_zeta > 0;
  r->series.has_mobility = with_mob > 0;
  return TRUE;
}

/* The reviewer's record: the tolerance and the stated values with their comments. */
static gboolean
read_review (xmlNode *node, BwProject *p, const char *path, GError **error)
{
  for (xmlNode *k = node->children; k; k = k->next)
    {
      if (bw_xml_is (k, NS, "tolerance"))
        {
          if (!read_quantity (k, BW_KIND_FRACTION, "review tolerance", &p->review_tolerance, path, error))
            return FALSE;
        }
      else if (bw_xml_is (k, NS, "stated"))
        {
          g_autofree char *qname = bw_xml_prop (k, "quantity");
          g_autofree char *cas = bw_xml_prop (k, "case");
          BwStated *st = g_new0 (BwStated, 1);
          gboolean have_value = FALSE;

          g_ptr_array_add (p->stated, st);
          st->line = (guint) MAX (0, bw_xml_line (k));
          st->element = bw_xml_prop (k, "element");
          if (st->element == NULL || st->element[0] == '\0')
            return fail (error, path, k, BW_ ("stated value: element: empty"));
          if (!bw_quantity_from_name (qname, &st->quantity))
            return fail (error, path, k, BW_ ("stated value %s: quantity: '%s' is not one Basinwright computes"),
                         st->element, qname);
          if (g_strcmp0 (cas, "max") == 0)
            st->which = BW_STATED_MAXIMUM;
          else if (g_strcmp0 (cas, "min") == 0)
            st->which = BW_STATED_MINIMUM;
          else if (bw_load_case_parse_id (cas, &st->load_case))
            st->which = BW_STATED_CASE;
          else
            return fail (error, path, k, BW_ ("stated value %s: case: '%s' is not max, min or a load case "
                         "such as maximum-day/coldest/all-in-service"), st->element, cas);
          for (xmlNode *v = k->children; v; v = v->next)
            if (bw_xml_is (v, NS, "value"))
              {
                g_autofree char *what = g_strdup_printf ("stated value %s %s", st->element, qname);
                if (!read_quantity (v, bw_quantity_info (st->quantity)->kind, what, &st->value, path,
                                    error))
                  return FALSE;
                have_value = TRUE;
              }
            else if (bw_xml_is (v, NS, "comment"))
              {
                /* Kept exactly as typed: not stripped. */
                xmlChar *t = xmlNodeGetContent (v);
                g_free (st->comment);
                st->comment = g_strdup (t ? (const char *) t : "");
                xmlFree (t);
              }
          if (!have_value)
            return fail (error, path, k, BW_ ("stated value %s %s: value: missing"), st->element, qname);
        }
    }
  return TRUE;
}

/* A list of finite numbers separated by white space, at most MAX of them. */
static gboolean
read_number_list (xmlNode *node, const char *what, double *out, guint max, guint *n,
                  const char *path, GError **error)
{
  g_autofree char *text = text_of (node);
  g_auto (GStrv) words = g_strsplit_set (text, " \t\r\n", -1);

  *n = 0;
  for (guint i = 0; words[i]; i++)
    {
      char *end = NULL;
      double v;
      if (words[i][0] == '\0')
        continue;
      if (*n >= max)
        return fail (error, path, node, BW_ ("%s: more than %u values"), what, max);
      v = g_ascii_strtod (words[i], &end);
      if (end == words[i] || *end != '\0' || !isfinite (v))
        return fail (error, path, node, BW_ ("%s: '%s' is not a finite number"), what, words[i]);
      out[(*n)++] = v;
    }
  return TRUE;
}

static gboolean
read_column_test (xmlNode *node, BwProject *p, const char *path, GError **error)
{
  g_autofree char *id = bw_xml_prop (node, "id");
  g_autofree char *name = bw_xml_prop (node, "name");
  g_autofree char *kind = bw_xml_prop (node, "readings");
  g_autofree char *applies = bw_xml_prop (node, "applies-to");
  BwColumnTestRecord *r = bw_column_test_record_new (id, name);
  gboolean have_times = FALSE;

  g_ptr_array_add (p->column_tests, r);
  if (kind == NULL || g_strcmp0 (kind, "removal") == 0)
    r->kind = BW_COLUMN_READING_REMOVAL;
  else if (g_strcmp0 (kind, "concentration") == 0)
    r->kind = BW_COLUMN_READING_CONCENTRATION;
  else
    return fail (error, path, node, BW_ ("column test %s: readings: '%s' is not removal or concentration"),
                 id, kind);
  if (applies)
    {
      g_auto (GStrv) ids = g_strsplit_set (applies, " \t\r\n", -1);
      for (guint i = 0; ids[i]; i++)
        if (ids[i][0])
          g_ptr_array_add (r->units, g_strdup (ids[i]));
    }
  for (xmlNode *k = node->children; k; k = k->next)
    {
      if (bw_xml_is (k, NS, "initial-concentration"))
        {
          if (!read_quantity (k, BW_KIND_CONCENTRATION, "initial concentration", &r->initial_kg_m3,
                              path, error))
            return FALSE;
        }
      else if (bw_xml_is (k, NS, "times"))
        {
          g_autofree char *unit_name = bw_xml_prop (k, "unit");
          const BwUnit *unit = bw_units_si_unit (BW_KIND_TIME);
          g_autoptr (GError) local = NULL;
          g_autofree char *what = g_strdup_printf ("column test %s: times", id);
          if (unit_name && (unit = bw_unit_lookup (unit_name, BW_KIND_TIME, what, &local)) == NULL)
            return fail (error, path, k, BW_ ("%s"), local->message);
          if (!read_number_list (k, what, r->time_s, BW_COLUMN_MAX_TIMES, &r->n_times, path, error))
            return FALSE;
          for (guint i = 0; i < r->n_times; i++)
            r->time_s[i] = bw_unit_to_si (unit, r->time_s[i]);
          have_times = TRUE;
        }
    }
  if (!have_times)
    return fail (error, path, node, BW_ ("column test %s: times: missing"), id);
  for (xmlNode *k = node->children; k; k = k->next)
    if (bw_xml_is (k, NS, "port"))
      {
        g_autofree char *depth = bw_xml_prop (k, "depth");
        g_autofree char *what = g_strdup_printf ("column test %s: port at %s m", id, depth);
        char *end = NULL;
        double d;
        guint n = 0;
        if (r->n_depths >= BW_COLUMN_MAX_DEPTHS)
          return fail (error, path, k, BW_ ("column test %s: more than %d ports"), id, BW_COLUMN_MAX_DEPTHS);
        d = depth ? g_ascii_strtod (depth, &end) : 0;
        if (depth == NULL || end == depth || *end != '\0' || !isfinite (d))
          return fail (error, path, k, BW_ ("column test %s: port: depth='%s' is not a finite number"), id,
                       depth ? depth : "");
        if (!read_number_list (k, what, r->reading[r->n_depths], BW_COLUMN_MAX_TIMES, &n, path, error))
          return FALSE;
        if (n != r->n_times)
          return fail (error, path, k, BW_ ("%s: %u readings where the test has %u sampling times"), what, n,
                       r->n_times);
        r->depth_m[r->n_depths++] = d;
      }
  return TRUE;
}

static BwProject *
read_project (xmlDoc *doc, const char *path, GError **error)
{
  xmlNode *root = xmlDocGetRootElement (doc);
  g_autoptr (BwProject) p = bw_project_new ();
  gboolean have_cases = FALSE;

  for (xmlNode *k = root->children; k; k = k->next)
    {
      if (k->type != XML_ELEMENT_NODE)
        continue;
      if (is_foreign (k))
        g_ptr_array_add (p->foreign, dump_node (doc, k));
      else if (bw_xml_is (k, NS, "info"))
        {
          for (xmlNode *i = k->children; i; i = i->next)
            {
              char **slot = bw_xml_is (i, NS, "name") ? &p->name
                            : bw_xml_is (i, NS, "preparer") ? &p->preparer
                            : bw_xml_is (i, NS, "revision") ? &p->revision
                            : bw_xml_is (i, NS, "date") ? &p->date
                            : bw_xml_is (i, NS, "description") ? &p->description : NULL;
              if (slot)
                {
                  /* Text a person types: a description may run long, the rest are one line. */
                  const gsize limit = slot == &p->description ? 65536 : 1024;
                  g_free (*slot);
                  *slot = text_of (i);
                  if (strlen (*slot) > limit)
                    {
                      fail (error, path, i, BW_ ("%s: longer than %lu characters"),
                            (const char *) i->name, (unsigned long) limit);
                      return NULL;
                    }
                }
            }
        }
      else if (bw_xml_is (k, NS, "criteria"))
        p->criteria = bw_xml_prop (k, "set");
      else if (bw_xml_is (k, NS, "design-basis"))
        {
          if (!read_basis (k, p, path, error))
            return NULL;
        }
      else if (bw_xml_is (k, NS, "chemistry"))
        {
          if (!read_chemistry (k, p, path, error))
            return NULL;
        }
      else if (bw_xml_is (k, NS, "jar-test"))
        {
          if (!read_jar_test (k, p, path, error))
            return NULL;
        }
      else if (bw_xml_is (k, NS, "column-test"))
        {
          if (!read_column_test (k, p, path, error))
            return NULL;
        }
      else if (bw_xml_is (k, NS, "review"))
        {
          if (!read_review (k, p, path, error))
            return NULL;
        }
      else if (bw_xml_is (k, NS, "load-cases"))
        {
          have_cases = TRUE;
          for (xmlNode *c = k->children; c; c = c->next)
            if (bw_xml_is (c, NS, "case"))
              {
                g_autofree char *f = bw_xml_prop (c, "flow");
                g_autofree char *t = bw_xml_prop (c, "temperature");
                g_autofree char *s = bw_xml_prop (c, "service");
                g_autofree char *en = bw_xml_prop (c, "enabled");
                BwLoadCase lc = { 0 };
                if (!bw_flow_kind_from_name (f, &lc.flow) || !bw_temp_kind_from_name (t, &lc.temp)
                    || !bw_service_state_from_name (s, &lc.service))
                  {
                    fail (error, path, c, BW_ ("load case: unknown flow, temperature or service"));
                    return NULL;
                  }
                lc.enabled = en == NULL || strcmp (en, "true") == 0 || strcmp (en, "1") == 0;
                g_array_append_val (p->cases, lc);
              }
        }
      else if (bw_xml_is (k, NS, "train"))
        {
          g_autofree char *id = bw_xml_prop (k, "id");
          g_autofree char *name = bw_xml_prop (k, "name");
          BwTrain *t = bw_train_new (id, name);
          g_ptr_array_add (p->trains, t);
          for (xmlNode *u = k->children; u; u = u->next)
            if (bw_xml_is (u, NS, "unit"))
              {
                BwProcessUnit *pu = read_unit (doc, u, FALSE, path, error);
                if (pu == NULL)
                  return NULL;
                g_ptr_array_add (t->units, pu);
              }
        }
    }
  if (!have_cases)
    bw_project_generate_cases (p);
  return g_steal_pointer (&p);
}

BwProject *
bw_project_load_memory (const char *data, gsize len, const char *name, GError **error)
{
  g_autofree char *schema = bw_data_find ("basinwright-project.rng");
  xmlDoc *doc;
  xmlNode *root;
  g_autofree char *version = NULL;
  BwProject *p;
  g_autoptr (GError) local = NULL;

  if (schema == NULL)
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_READ,
                   BW_ ("basinwright-project.rng: the schema is not installed (set BW_DATADIR)"));
      return NULL;
    }
  doc = bw_xml_read_memory (data, len, name, error);
  if (doc == NULL)
    return NULL;
  root = xmlDocGetRootElement (doc);
  if (!bw_xml_is (root, NS, "project"))
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_INVALID,
                   BW_ ("%s:%ld: not a Basinwright project (the root element is not <project> in %s)"),
                   name, bw_xml_line (root), NS);
      xmlFreeDoc (doc);
      return NULL;
    }
  version = bw_xml_prop (root, "format-version");
  if (version && g_ascii_strtoll (version, NULL, 10) > BW_PROJECT_FORMAT_VERSION)
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_VERSION,
                   BW_ ("%s: written in project format %s by a newer Basinwright; this one reads format %d"),
                   name, version, BW_PROJECT_FORMAT_VERSION);
      xmlFreeDoc (doc);
      return NULL;
    }
  if (!bw_xml_validate (doc, schema, name, error))
    {
      xmlFreeDoc (doc);
      return NULL;
    }
  p = read_project (doc, name, error);
  xmlFreeDoc (doc);
  if (p && !bw_project_validate (p, &local))
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_INVALID, BW_ ("%s: %s"), name, local->message);
      bw_project_free (p);
      return NULL;
    }
  return p;
}

BwProject *
bw_project_load (const char *path, GError **error)
{
  g_autofree char *data = NULL;
  gsize len = 0;
  GStatBuf st;
  g_autoptr (GError) local = NULL;

  g_return_val_if_fail (path != NULL, NULL);
  if (g_stat (path, &st) == 0 && st.st_size > BW_XML_MAX_BYTES)
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_TOO_LARGE, BW_ ("%s: over the %d MiB limit"), path,
                   BW_XML_MAX_BYTES / (1024 * 1024));
      return NULL;
    }
  if (!g_file_get_contents (path, &data, &len, &local))
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_READ, BW_ ("%s"), local->message);
      return NULL;
    }
  return bw_project_load_memory (data, len, path, error);
}

/* --- writing --- */

static void
esc (GString *s, const char *text)
{
  g_autofree char *e = g_markup_escape_text (text ? text : "", -1);
  g_string_append (s, e);
}

static void
number (GString *s, double v)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE];
  /* %.17g round-trips every double exactly. */
  g_string_append (s, g_ascii_formatd (buf, sizeof buf, "%.17g", v));
}

static void
write_quantity (GString *s, const char *indent, const char *elem, const char *attrs, double v,
                BwQuantityKind kind)
{
  const BwUnit *u = bw_units_si_unit (kind);

  g_string_append_printf (s, "%s<%s%s", indent, elem, attrs ? attrs : "");
  if (u->ascii[0])
    {
      g_string_append (s, " unit=\"");
      esc (s, u->ascii);
      g_string_append_c (s, '"');
    }
  g_string_append_c (s, '>');
  number (s, v);
  g_string_append_printf (s, "</%s>\n", elem);
}

static void
write_unit (GString *s, const BwProcessUnit *u, gboolean stage, const char *indent)
{
  guint n;
  const BwParamSpec *specs = bw_params_of (u->type, &n);
  g_autofree char *inner = g_strconcat (indent, "  ", NULL);

  g_string_append_printf (s, "%s<%s type=\"%s\" id=\"", indent, stage ? "stage" : "unit",
                          bw_process_type_name (u->type));
  esc (s, u->id);
  g_string_append (s, "\" name=\"");
  esc (s, u->name);
  g_string_append_c (s, '"');
  if (!stage)
    g_string_append_printf (s, " parallel=\"%u\" standby=\"%u\"", u->n_parallel, u->n_standby);
  g_string_append (s, ">\n");
  for (guint i = 0; i < n; i++)
    {
      g_autofree char *attrs = g_strdup_printf (" param=\"%s\"", specs[i].id);
      if (specs[i].optional && u->values[i] == 0.0)
        continue;
      if (specs[i].type == BW_PARAM_CHOICE)
        g_string_append_printf (s, "%s<value%s>%s</value>\n", inner, attrs,
                                bw_param_choice_name (&specs[i], (int) u->values[i]));
      else
        write_quantity (s, inner, "value", attrs, u->values[i], specs[i].kind);
    }
  for (guint i = 0; i < u->stages->len; i++)
    write_unit (s, g_ptr_array_index (u->stages, i), TRUE, inner);
  for (guint i = 0; i < u->foreign->len; i++)
    g_string_append_printf (s, "%s%s\n", inner, (const char *) g_ptr_array_index (u->foreign, i));
  g_string_append_printf (s, "%s</%s>\n", indent, stage ? "stage" : "unit");
}

/* Element text kept exact: a carriage return is written as a reference, or XML's end-of-line
 * handling would turn it into a line feed. */
static void
esc_exact (GString *s, const char *text)
{
  g_auto (GStrv) parts = g_strsplit (text ? text : "", "\r", -1);
  for (guint i = 0; parts[i]; i++)
    {
      if (i > 0)
        g_string_append (s, "&#13;");
      esc (s, parts[i]);
    }
}

static void
write_column_test (GString *s, const BwColumnTestRecord *r)
{
  g_string_append (s, "  <column-test id=\"");
  esc (s, r->id);
  g_string_append_c (s, '"');
  if (r->name)
    {
      g_string_append (s, " name=\"");
      esc (s, r->name);
      g_string_append_c (s, '"');
    }
  g_string_append_printf (s, " readings=\"%s\"",
                          r->kind == BW_COLUMN_READING_CONCENTRATION ? "concentration" : "removal");
  if (r->units->len > 0)
    {
      g_string_append (s, " applies-to=\"");
      for (guint i = 0; i < r->units->len; i++)
        {
          if (i > 0)
            g_string_append_c (s, ' ');
          esc (s, g_ptr_array_index (r->units, i));
        }
      g_string_append_c (s, '"');
    }
  g_string_append (s, ">\n");
  if (r->initial_kg_m3 > 0)
    write_quantity (s, "    ", "initial-concentration", NULL, r->initial_kg_m3, BW_KIND_CONCENTRATION);
  g_string_append (s, "    <times unit=\"s\">");
  for (guint k = 0; k < r->n_times; k++)
    {
      if (k > 0)
        g_string_append_c (s, ' ');
      number (s, r->time_s[k]);
    }
  g_string_append (s, "</times>\n");
  for (guint j = 0; j < r->n_depths; j++)
    {
      g_string_append (s, "    <port depth=\"");
      number (s, r->depth_m[j]);
      g_string_append (s, "\">");
      for (guint k = 0; k < r->n_times; k++)
        {
          if (k > 0)
            g_string_append_c (s, ' ');
          number (s, r->reading[j][k]);
        }
      g_string_append (s, "</port>\n");
    }
  g_string_append (s, "  </column-test>\n");
}

static void
write_review (GString *s, const BwProject *p)
{
  if (p->stated->len == 0 && p->review_tolerance == BW_REVIEW_TOLERANCE_DEFAULT)
    return;
  g_string_append (s, "  <review>\n");
  write_quantity (s, "    ", "tolerance", NULL, p->review_tolerance, BW_KIND_FRACTION);
  for (guint i = 0; i < p->stated->len; i++)
    {
      const BwStated *st = g_ptr_array_index (p->stated, i);
      g_autofree char *cas = st->which == BW_STATED_MAXIMUM ? g_strdup ("max")
                             : st->which == BW_STATED_MINIMUM ? g_strdup ("min")
                             : bw_load_case_id (&st->load_case);
      g_string_append (s, "    <stated element=\"");
      esc (s, st->element);
      g_string_append_printf (s, "\" quantity=\"%s\" case=\"%s\">\n", bw_quantity_name (st->quantity),
                              cas);
      write_quantity (s, "      ", "value", NULL, st->value, bw_quantity_info (st->quantity)->kind);
      if (st->comment)
        {
          g_string_append (s, "      <comment>");
          esc_exact (s, st->comment);
          g_string_append (s, "</comment>\n");
        }
      g_string_append (s, "    </stated>\n");
    }
  g_string_append (s, "  </review>\n");
}

char *
bw_project_to_xml (const BwProject *p)
{
  GString *s = g_string_new ("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n");
  const struct { const char *tag; const char *value; } info[] = {
    { "name", p->name }, { "preparer", p->preparer }, { "revision", p->revision },
    { "date", p->date }, { "description", p->description },
  };

  g_string_append_printf (s, "<project xmlns=\"%s\" format-version=\"%d\">\n", NS,
                          BW_PROJECT_FORMAT_VERSION);
  g_string_append (s, "  <info>\n");
  for (guint i = 0; i < G_N_ELEMENTS (info); i++)
    if (info[i].value || i == 0)
      {
        g_string_append_printf (s, "    <%s>", info[i].tag);
        esc (s, info[i].value);
        g_string_append_printf (s, "</%s>\n", info[i].tag);
      }
  g_string_append (s, "  </info>\n");
  if (p->criteria)
    {
      g_string_append (s, "  <criteria set=\"");
      esc (s, p->criteria);
      g_string_append (s, "\"/>\n");
    }
  g_string_append (s, "  <design-basis>\n");
  for (int f = 0; f < BW_N_FLOW_KINDS; f++)
    if ((p->basis.flows_given >> f) & 1)
      {
        g_autofree char *attrs = g_strdup_printf (" case=\"%s\"", bw_flow_kind_name ((BwFlowKind) f));
        write_quantity (s, "    ", "flow", attrs, p->basis.flow_m3_s[f], BW_KIND_FLOW);
      }
  for (int t = 0; t < BW_N_TEMP_KINDS; t++)
    {
      g_autofree char *attrs = g_strdup_printf (" case=\"%s\"", bw_temp_kind_name ((BwTempKind) t));
      write_quantity (s, "    ", "temperature", attrs, p->basis.temperature_K[t], BW_KIND_TEMPERATURE);
    }
  g_string_append (s, "    <raw-water>\n");
  write_quantity (s, "      ", "turbidity", NULL, p->basis.turbidity_NTU, BW_KIND_TURBIDITY);
  write_quantity (s, "      ", "alkalinity", " as=\"CaCO3\"", p->basis.alkalinity_kg_m3,
                  BW_KIND_CONCENTRATION);
  write_quantity (s, "      ", "ph", NULL, p->basis.ph, BW_KIND_NUMBER);
  g_string_append (s, "    </raw-water>\n  </design-basis>\n");
  if (p->chemistry.enabled)
    {
      const BwChemistryBasis *c = &p->chemistry;
      const char *which[] = { "minimum", "design", "maximum" };
      const double doses[] = { c->dose_min_kg_m3, c->dose_design_kg_m3, c->dose_max_kg_m3 };
      g_string_append_printf (s, "  <chemistry coagulant=\"%s\"", bw_coagulant_kind_name (c->kind));
      if (c->jar_test)
        {
          g_string_append (s, " jar-test=\"");
          esc (s, c->jar_test);
          g_string_append_c (s, '"');
        }
      g_string_append (s, ">\n");
      if (c->kind == BW_COAGULANT_ALUM)
        write_quantity (s, "    ", "hydrate", NULL, c->hydrate_waters, BW_KIND_NUMBER);
      if (c->kind == BW_COAGULANT_PACL)
        {
          write_quantity (s, "    ", "al2o3", NULL, c->al2o3_fraction, BW_KIND_NUMBER);
          write_quantity (s, "    ", "basicity", NULL, c->basicity, BW_KIND_NUMBER);
        }
      for (int i = 0; i < 3; i++)
        {
          g_autofree char *attrs = g_strdup_printf (" case=\"%s\"", which[i]);
          write_quantity (s, "    ", "dose", attrs, doses[i], BW_KIND_CONCENTRATION);
        }
      write_quantity (s, "    ", "ss-factor", NULL, c->ss_factor, BW_KIND_NUMBER);
      write_quantity (s, "    ", "residual-alkalinity", " as=\"CaCO3\"", c->residual_target_kg_m3,
                      BW_KIND_CONCENTRATION);
      g_string_append_printf (s, "    <alkali>%s</alkali>\n", bw_alkali_kind_name (c->alkali));
      if (c->stock_fraction > 0)
        write_quantity (s, "    ", "stock-strength", NULL, c->stock_fraction, BW_KIND_FRACTION);
      if (c->stock_density_kg_m3 > 0)
        write_quantity (s, "    ", "stock-density", NULL, c->stock_density_kg_m3, BW_KIND_DENSITY);
      if (c->sludge_solids_fraction > 0)
        write_quantity (s, "    ", "sludge-solids", NULL, c->sludge_solids_fraction,
                        BW_KIND_FRACTION);
      if (c->target_NTU > 0)
        write_quantity (s, "    ", "target-turbidity", NULL, c->target_NTU, BW_KIND_TURBIDITY);
      g_string_append (s, "  </chemistry>\n");
    }
  for (guint i = 0; i < p->jar_tests->len; i++)
    {
      const BwJarTestRecord *r = g_ptr_array_index (p->jar_tests, i);
      g_string_append (s, "  <jar-test id=\"");
      esc (s, r->id);
      g_string_append (s, "\" name=\"");
      esc (s, r->name);
      g_string_append (s, "\">\n");
      write_quantity (s, "    ", "temperature", NULL, r->temperature_K, BW_KIND_TEMPERATURE);
      for (guint k = 0; k < r->series.n_jars; k++)
        {
          const BwJar *j = &r->series.jars[k];
          g_string_append (s, "    <jar dose=\"");
          number (s, j->dose_kg_m3);
          g_string_append (s, "\" turbidity=\"");
          number (s, j->turbidity_NTU);
          g_string_append_c (s, '"');
          if (r->series.has_ph)
            {
              g_string_append (s, " ph=\"");
              number (s, j->ph);
              g_string_append_c (s, '"');
            }
          if (r->series.has_zeta)
            {
              g_string_append (s, " zeta=\"");
              number (s, j->zeta_V);
              g_string_append_c (s, '"');
            }
          if (r->series.has_mobility)
            {
              g_string_append (s, " mobility=\"");
              number (s, j->mobility_m2_V_s);
              g_string_append_c (s, '"');
            }
          g_string_append (s, "/>\n");
        }
      g_string_append (s, "  </jar-test>\n");
    }
  for (guint i = 0; i < p->column_tests->len; i++)
    write_column_test (s, g_ptr_array_index (p->column_tests, i));
  g_string_append (s, "  <load-cases>\n");
  for (guint i = 0; i < p->cases->len; i++)
    {
      const BwLoadCase *c = &g_array_index (p->cases, BwLoadCase, i);
      g_string_append_printf (s, "    <case flow=\"%s\" temperature=\"%s\" service=\"%s\" enabled=\"%s\"/>\n",
                              bw_flow_kind_name (c->flow), bw_temp_kind_name (c->temp),
                              bw_service_state_name (c->service), c->enabled ? "true" : "false");
    }
  g_string_append (s, "  </load-cases>\n");
  for (guint i = 0; i < p->trains->len; i++)
    {
      const BwTrain *t = g_ptr_array_index (p->trains, i);
      g_string_append (s, "  <train id=\"");
      esc (s, t->id);
      g_string_append (s, "\" name=\"");
      esc (s, t->name);
      g_string_append (s, "\">\n");
      for (guint k = 0; k < t->units->len; k++)
        write_unit (s, g_ptr_array_index (t->units, k), FALSE, "    ");
      g_string_append (s, "  </train>\n");
    }
  write_review (s, p);
  for (guint i = 0; i < p->foreign->len; i++)
    g_string_append_printf (s, "  %s\n", (const char *) g_ptr_array_index (p->foreign, i));
  g_string_append (s, "</project>\n");
  return g_string_free (s, FALSE);
}

gboolean
bw_project_save (const BwProject *p, const char *path, GError **error)
{
  g_autofree char *xml = NULL;
  g_autoptr (GError) local = NULL;

  g_return_val_if_fail (p != NULL && path != NULL, FALSE);
  if (!bw_project_validate (p, &local))
    {
      g_set_error (error, BW_IO_ERROR, BW_IO_ERROR_INVALID, BW_ ("%s: not saved: %s"), path, local->message);
      return FALSE;
    }
  xml = bw_project_to_xml (p);
  return bw_write_atomic (path, xml, strlen (xml), error);
}
