/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-project-xml.c: project and criteria files: loading, round trips, hostile input, and
 * atomic saving. */
#include "config.h"

#include <glib/gstdio.h>
#include <math.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include "bw-test.h"
#include "engine/bw-error.h"
#include "engine/bw-evaluate.h"
#include "io/bw-criteria-xml.h"
#include "io/bw-project-xml.h"
#include "io/bw-xml.h"

static char *tmpdir;

static void
setup (void)
{
  tmpdir = g_dir_make_tmp ("bw-io-XXXXXX", NULL);
  ck_assert_ptr_nonnull (tmpdir);
}

static void
teardown (void)
{
  g_autoptr (GDir) d = g_dir_open (tmpdir, 0, NULL);
  const char *n;
  while (d && (n = g_dir_read_name (d)))
    {
      g_autofree char *p = g_build_filename (tmpdir, n, NULL);
      g_chmod (p, 0600);
      g_unlink (p);
    }
  g_chmod (tmpdir, 0700);
  g_rmdir (tmpdir);
  g_clear_pointer (&tmpdir, g_free);
}

static char *
example (const char *name)
{
  return g_build_filename (g_getenv ("BW_SOURCE_ROOT"), "data", "examples", name, NULL);
}

START_TEST (test_project_load_demo)
{
  g_autofree char *path = example ("marrowby-demo.bwproj");
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) p = bw_project_load (path, &error);
  BwProcessUnit *u;

  ck_assert_msg (p != NULL, "%s", error ? error->message : "");
  ck_assert_str_eq (p->name, "Alder Creek WTP, Marrowby (demo)");
  ck_assert_uint_eq (p->trains->len, 3);
  /* 4 flows x 2 temperatures x 2 service states (north-rm has a standby): 16 cases. */
  ck_assert_uint_eq (p->cases->len, 16);
  /* Units typed in other units are held in SI: 2 degC, 170 rpm, 50 mm, 3 m/h. */
  bw_assert_rel (p->basis.temperature_K[BW_TEMP_COLDEST], 275.15, 1e-12);
  u = bw_project_find_unit (p, "north-rm", NULL);
  ck_assert_ptr_nonnull (u);
  bw_assert_rel (bw_process_unit_get (u, "speed"), 170.0 / 60.0, 1e-12);
  ck_assert_uint_eq (u->n_parallel, 2);
  ck_assert_uint_eq (u->n_standby, 1);
  u = bw_project_find_unit (p, "east-sed", NULL);
  bw_assert_rel (bw_process_unit_get (u, "spacing"), 0.05, 1e-12);
  bw_assert_rel (bw_process_unit_get (u, "angle"), G_PI / 3, 1e-12);
  u = bw_project_find_unit (p, "south-floc-2", NULL);
  ck_assert_ptr_nonnull (u);
  ck_assert_int_eq (u->type, BW_STAGE_BAFFLED);
  bw_assert_rel (p->basis.alkalinity_kg_m3, 0.065, 1e-12); /* 65 mg/L as CaCO3 */
  /* The chemistry and the jar test it came from. */
  ck_assert (p->chemistry.enabled);
  ck_assert_int_eq (p->chemistry.kind, BW_COAGULANT_ALUM);
  bw_assert_rel (p->chemistry.dose_design_kg_m3, 0.030, 1e-12);
  bw_assert_rel (p->chemistry.residual_target_kg_m3, 0.020, 1e-12);
  ck_assert_str_eq (p->chemistry.jar_test, "jt-2026-11");
  /* The liquid stock, sludge and target, typed in % and kg/m3: 48.5 % = 0.485, 1 % = 0.01
   * (definition of the percent). */
  bw_assert_rel (p->chemistry.stock_fraction, 0.485, 1e-12);
  bw_assert_rel (p->chemistry.stock_density_kg_m3, 1330, 1e-12);
  ck_assert_int_eq (p->chemistry.alkali, BW_ALKALI_LIME);
  bw_assert_rel (p->chemistry.sludge_solids_fraction, 0.01, 1e-12);
  bw_assert_rel (p->chemistry.target_NTU, 2.0, 1e-12);
  ck_assert_uint_eq (p->jar_tests->len, 1);
  {
    const BwJarTestRecord *jt = g_ptr_array_index (p->jar_tests, 0);
    ck_assert_uint_eq (jt->series.n_jars, 6);
    ck_assert (jt->series.has_ph && jt->series.has_zeta && !jt->series.has_mobility);
    bw_assert_rel (jt->temperature_K, 285.15, 1e-12);
  }
}
END_TEST

START_TEST (test_project_roundtrip_examples)
{
  const char *names[] = { "marrowby-demo.bwproj", "marrowby-noncompliant.bwproj" };

  for (guint i = 0; i < G_N_ELEMENTS (names); i++)
    {
      g_autofree char *path = example (names[i]);
      g_autofree char *saved = g_build_filename (tmpdir, names[i], NULL);
      g_autoptr (GError) error = NULL;
      g_autoptr (BwProject) a = bw_project_load (path, &error);
      g_autoptr (BwProject) b = NULL;
      g_autoptr (BwProject) c = NULL;
      g_autofree char *x1 = NULL;
      g_autofree char *x2 = NULL;

      ck_assert_msg (a != NULL, "%s", error ? error->message : "");
      ck_assert_msg (bw_project_save (a, saved, &error), "%s", error ? error->message : "");
      b = bw_project_load (saved, &error);
      ck_assert_msg (b != NULL, "%s", error ? error->message : "");
      ck_assert_msg (bw_project_equal (a, b), "%s changed in a load-save-load round trip", names[i]);
      /* And the text is stable: saving the reloaded model writes the same bytes. */
      x1 = bw_project_to_xml (a);
      x2 = bw_project_to_xml (b);
      ck_assert_str_eq (x1, x2);
      c = bw_project_copy (b);
      ck_assert (bw_project_equal (b, c));
    }
}
END_TEST

START_TEST (test_project_chemistry_defaults_and_roundtrip)
{
  /* The non-compliant example was written before the stock, alkali, sludge-solids and target
   * elements: it loads with them not given (0) and lime. */
  g_autofree char *path = example ("marrowby-noncompliant.bwproj");
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) a = bw_project_load (path, &error);
  g_autoptr (BwProject) b = NULL;
  g_autoptr (BwProject) c = NULL;
  g_autofree char *x1 = NULL;
  g_autofree char *x2 = NULL;
  g_autofree char *x3 = NULL;
  g_autofree char *text = NULL;

  ck_assert_msg (a != NULL, "%s", error ? error->message : "");
  ck_assert (g_file_get_contents (path, &text, NULL, NULL));
  ck_assert (strstr (text, "<stock-strength") == NULL && strstr (text, "<target-turbidity") == NULL);
  ck_assert (a->chemistry.enabled);
  ck_assert (a->chemistry.stock_fraction == 0 && a->chemistry.stock_density_kg_m3 == 0);
  ck_assert (a->chemistry.sludge_solids_fraction == 0 && a->chemistry.target_NTU == 0);
  ck_assert_int_eq (a->chemistry.alkali, BW_ALKALI_LIME);
  /* Nothing not given is written. */
  x1 = bw_project_to_xml (a);
  ck_assert_msg (strstr (x1, "<stock-strength") == NULL && strstr (x1, "<stock-density") == NULL
                 && strstr (x1, "<sludge-solids") == NULL && strstr (x1, "<target-turbidity") == NULL,
                 "%s", x1);
  ck_assert (strstr (x1, "<alkali>lime</alkali>") != NULL);

  /* Every new field set, soda ash chosen: the model and the text round-trip exactly. The inputs
   * are our own, picked for long binary expansions; the check is equality with themselves. */
  a->chemistry.stock_fraction = 0.1 + 0.2;
  a->chemistry.stock_density_kg_m3 = 1500.0 / 3.0 * 3.1;
  a->chemistry.alkali = BW_ALKALI_SODA_ASH;
  a->chemistry.sludge_solids_fraction = 0.0123456789012345;
  a->chemistry.target_NTU = 1.0 / 3.0;
  ck_assert (bw_project_validate (a, NULL));
  g_clear_pointer (&x1, g_free);
  x1 = bw_project_to_xml (a);
  ck_assert (strstr (x1, "<alkali>soda-ash</alkali>") != NULL);
  b = bw_project_load_memory (x1, strlen (x1), "chem.bwproj", &error);
  ck_assert_msg (b != NULL, "%s", error ? error->message : "");
  ck_assert (bw_project_equal (a, b));
  ck_assert (b->chemistry.stock_fraction == 0.1 + 0.2);
  ck_assert (b->chemistry.target_NTU == 1.0 / 3.0);
  x2 = bw_project_to_xml (b);
  ck_assert_str_eq (x1, x2);
  c = bw_project_copy (b);
  ck_assert (bw_project_equal (b, c));
  /* equal notices each new field. */
  c->chemistry.alkali = BW_ALKALI_LIME;
  ck_assert (!bw_project_equal (b, c));
  c->chemistry.alkali = BW_ALKALI_SODA_ASH;
  c->chemistry.target_NTU = 0;
  ck_assert (!bw_project_equal (b, c));
  c->chemistry.target_NTU = b->chemistry.target_NTU;
  c->chemistry.stock_density_kg_m3 += 1e-9;
  ck_assert (!bw_project_equal (b, c));
  c->chemistry.stock_density_kg_m3 = b->chemistry.stock_density_kg_m3;
  c->chemistry.sludge_solids_fraction = 0;
  ck_assert (!bw_project_equal (b, c));
  c->chemistry.sludge_solids_fraction = b->chemistry.sludge_solids_fraction;
  ck_assert (bw_project_equal (b, c));

  /* Emptied again, they are left out again. */
  b->chemistry.stock_fraction = 0;
  b->chemistry.target_NTU = 0;
  x3 = bw_project_to_xml (b);
  ck_assert (strstr (x3, "<stock-strength") == NULL && strstr (x3, "<target-turbidity") == NULL);
  ck_assert (strstr (x3, "<stock-density") != NULL);
}
END_TEST

START_TEST (test_project_chemistry_validate)
{
  /* The same rules hold for a model edited in memory; each error names its field. */
  g_autofree char *path = example ("marrowby-demo.bwproj");
  g_autoptr (BwProject) p = bw_project_load (path, NULL);
  const struct { double *slot; double bad; const char *field; } cases[] = {
    { &p->chemistry.stock_fraction, 1.2, "stock solution strength" },
    { &p->chemistry.stock_fraction, -0.1, "stock solution strength" },
    { &p->chemistry.stock_fraction, NAN, "stock solution strength" },
    { &p->chemistry.stock_density_kg_m3, 100, "stock solution density" },
    { &p->chemistry.stock_density_kg_m3, INFINITY, "stock solution density" },
    { &p->chemistry.sludge_solids_fraction, 0.7, "sludge solids content" },
    { &p->chemistry.target_NTU, -1, "target settled turbidity" },
  };

  ck_assert_ptr_nonnull (p);
  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autoptr (GError) error = NULL;
      const double keep = *cases[i].slot;
      *cases[i].slot = cases[i].bad;
      ck_assert_msg (!bw_project_validate (p, &error), "case %u accepted", i);
      ck_assert_msg (g_str_has_prefix (error->message, cases[i].field), "case %u: %s", i,
                     error->message);
      *cases[i].slot = keep;
    }
  p->chemistry.alkali = (BwAlkaliKind) 7;
  {
    g_autoptr (GError) error = NULL;
    ck_assert (!bw_project_validate (p, &error));
    ck_assert_msg (g_str_has_prefix (error->message, "alkali supplement"), "%s", error->message);
  }
  p->chemistry.alkali = BW_ALKALI_SODA_ASH;
  ck_assert (bw_project_validate (p, NULL));
}
END_TEST

START_TEST (test_project_equal_notices_changes)
{
  g_autofree char *path = example ("marrowby-demo.bwproj");
  g_autoptr (BwProject) a = bw_project_load (path, NULL);
  g_autoptr (BwProject) b = bw_project_copy (a);
  BwProcessUnit *u = bw_project_find_unit (b, "north-sed", NULL);

  ck_assert (bw_project_equal (a, b));
  ck_assert (bw_process_unit_set (u, "length", 56.000001, NULL));
  ck_assert (!bw_project_equal (a, b));
}
END_TEST

START_TEST (test_project_foreign_elements_kept)
{
  g_autofree char *path = example ("marrowby-demo.bwproj");
  g_autofree char *text = NULL;
  g_autofree char *xml = NULL;
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) p = NULL;
  g_autoptr (BwProject) q = NULL;
  GString *s;

  ck_assert (g_file_get_contents (path, &text, NULL, NULL));
  s = g_string_new (text);
  /* An element from a newer tool, in its own namespace, at project and unit level. */
  g_string_replace (s, "</project>",
                    "<x:survey xmlns:x=\"urn:example:later\" site=\"A\"><x:pt n=\"1\"/></x:survey>\n</project>", 1);
  g_string_replace (s, "<value param=\"inlet\">perforated-baffle</value>",
                    "<value param=\"inlet\">perforated-baffle</value><y:tag xmlns:y=\"urn:example:y\">keep</y:tag>", 1);
  p = bw_project_load_memory (s->str, s->len, "foreign.bwproj", &error);
  g_string_free (s, TRUE);
  ck_assert_msg (p != NULL, "%s", error ? error->message : "");
  ck_assert_uint_eq (p->foreign->len, 1);
  ck_assert_uint_eq (bw_project_find_unit (p, "north-sed", NULL)->foreign->len, 1);
  xml = bw_project_to_xml (p);
  ck_assert_ptr_nonnull (strstr (xml, "urn:example:later"));
  ck_assert_ptr_nonnull (strstr (xml, ">keep</y:tag>"));
  q = bw_project_load_memory (xml, strlen (xml), "again.bwproj", &error);
  ck_assert_msg (q != NULL, "%s", error ? error->message : "");
  ck_assert (bw_project_equal (p, q));
}
END_TEST

typedef struct
{
  const char *name;
  const char *find;    /* replaced in the demo text ... */
  const char *replace; /* ... by this */
  int code;
  const char *needle;  /* the message must say this */
} HostileCase;

static const HostileCase hostile[] = {
  { "billion laughs", "<?xml version=\"1.0\" encoding=\"UTF-8\"?>",
    "<?xml version=\"1.0\"?><!DOCTYPE project [<!ENTITY a \"aaaaaaaaaa\"><!ENTITY b \"&a;&a;&a;&a;&a;&a;&a;&a;&a;&a;\">]>",
    BW_IO_ERROR_UNSAFE, "not allowed" },
  { "external entity", "<?xml version=\"1.0\" encoding=\"UTF-8\"?>",
    "<?xml version=\"1.0\"?><!DOCTYPE project [<!ENTITY x SYSTEM \"file:///etc/passwd\">]>",
    BW_IO_ERROR_UNSAFE, "not allowed" },
  { "external DTD", "<?xml version=\"1.0\" encoding=\"UTF-8\"?>",
    "<?xml version=\"1.0\"?><!DOCTYPE project SYSTEM \"http://example.invalid/x.dtd\">",
    BW_IO_ERROR_UNSAFE, "not allowed" },
  { "entity reference without declaration", "<name>Alder Creek", "<name>&foo;Alder Creek",
    BW_IO_ERROR_MALFORMED, ":" },
  { "truncated", "</project>", "", BW_IO_ERROR_MALFORMED, "marrowby" },
  { "wrong root", "<project xmlns=\"urn:x-basinwright:project:1\"", "<plant xmlns=\"urn:x-basinwright:project:1\"",
    BW_IO_ERROR_MALFORMED, ":" },
  { "text for a number", "<value param=\"width\" unit=\"m\">1.1</value>",
    "<value param=\"width\" unit=\"m\">wide</value>", BW_IO_ERROR_INVALID, "not a finite number" },
  { "negative length", "<value param=\"length\" unit=\"m\">56</value>",
    "<value param=\"length\" unit=\"m\">-56</value>", BW_IO_ERROR_INVALID, "length" },
  { "zero depth", "<value param=\"side-water-depth\" unit=\"m\">4</value>",
    "<value param=\"side-water-depth\" unit=\"m\">0</value>", BW_IO_ERROR_INVALID, "side water depth" },
  { "NaN", "<value param=\"width\" unit=\"m\">1.1</value>", "<value param=\"width\" unit=\"m\">NaN</value>",
    BW_IO_ERROR_INVALID, ":" },
  { "wrong unit kind", "<value param=\"width\" unit=\"m\">1.1</value>",
    "<value param=\"width\" unit=\"kg\">1.1</value>", BW_IO_ERROR_INVALID, "unit of mass" },
  { "unknown parameter", "<value param=\"width\" unit=\"m\">1.1</value>",
    "<value param=\"colour\" unit=\"m\">1.1</value>", BW_IO_ERROR_INVALID, "no parameter 'colour'" },
  { "unknown element of ours", "<criteria set=\"textbook-ranges\"/>",
    "<criteria set=\"textbook-ranges\"/><weather/>", BW_IO_ERROR_INVALID, ":" },
  { "newer format", "format-version=\"1\"", "format-version=\"7\"", BW_IO_ERROR_VERSION, "newer" },
  { "unknown unit type", "type=\"inline-mixer\"", "type=\"vortex-thing\"", BW_IO_ERROR_INVALID,
    "vortex-thing" },
  { "standby equals parallel", "parallel=\"2\" standby=\"1\"", "parallel=\"2\" standby=\"2\"",
    BW_IO_ERROR_INVALID, "leaves none in service" },
  { "flows out of order", "<flow case=\"peak-hour\" unit=\"m3/s\">0.45</flow>",
    "<flow case=\"peak-hour\" unit=\"m3/s\">0.30</flow>", BW_IO_ERROR_INVALID, "peak hour flow" },
  { "temperature out of range", "<temperature case=\"warmest\" unit=\"degC\">24</temperature>",
    "<temperature case=\"warmest\" unit=\"degC\">55</temperature>", BW_IO_ERROR_INVALID, "warmest temperature" },
  { "duplicate unit id", "id=\"south-mix\"", "id=\"north-rm\"", BW_IO_ERROR_INVALID, "used twice" },
  { "bad choice", "<value param=\"launder\">peripheral</value>", "<value param=\"launder\">sideways</value>",
    BW_IO_ERROR_INVALID, "sideways" },
  { "NUL byte", "<revision>A</revision>", "<revision>A\0</revision>", BW_IO_ERROR_MALFORMED, "NUL" },
  { "not UTF-8", "<revision>A</revision>", "<revision>\xff\xfe</revision>", BW_IO_ERROR_MALFORMED, "UTF-8" },
  { "doses out of order", "<dose case=\"minimum\" unit=\"mg/L\">15</dose>",
    "<dose case=\"minimum\" unit=\"mg/L\">35</dose>", BW_IO_ERROR_INVALID, "minimum <= design" },
  { "a dose missing", "<dose case=\"maximum\" unit=\"mg/L\">45</dose>", "", BW_IO_ERROR_INVALID,
    "all needed" },
  { "zeta on some jars only", "<jar dose=\"0.030\" turbidity=\"1.9\" ph=\"6.9\" zeta=\"-0.006\"/>",
    "<jar dose=\"0.030\" turbidity=\"1.9\" ph=\"6.9\"/>", BW_IO_ERROR_INVALID, "some jars only" },
  { "jar test not held", "jar-test=\"jt-2026-11\"", "jar-test=\"jt-missing\"", BW_IO_ERROR_INVALID,
    "does not hold" },
  { "two jars at one dose", "<jar dose=\"0.020\"", "<jar dose=\"0.010\"", BW_IO_ERROR_INVALID,
    "two jars" },
  { "a blade beyond the wall", "<value param=\"blade-radius-1\" unit=\"m\">1.3</value>",
    "<value param=\"blade-radius-1\" unit=\"m\">1.9</value>", -1, "blade radius" },
};

START_TEST (test_project_hostile)
{
  const HostileCase *h = &hostile[_i];
  g_autofree char *path = example ("marrowby-demo.bwproj");
  g_autofree char *text = NULL;
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) p = NULL;
  GString *s;
  gsize len;

  ck_assert (g_file_get_contents (path, &text, NULL, NULL));
  ck_assert_msg (strstr (text, h->find) != NULL, "fixture text '%s' not in the demo", h->find);
  s = g_string_new (text);
  if (strcmp (h->name, "NUL byte") == 0)
    {
      /* g_string_replace stops at the NUL; put it in by hand. */
      char *at = strstr (s->str, h->find) + strlen ("<revision>A");
      g_string_insert_len (s, at - s->str, "\0", 1);
    }
  else
    g_string_replace (s, h->find, h->replace, 1);
  len = s->len;
  p = bw_project_load_memory (s->str, len, "marrowby-hostile.bwproj", &error);
  g_string_free (s, TRUE);
  if (h->code >= 0)
    {
      ck_assert_msg (p == NULL, "%s: loaded", h->name);
      bw_assert_error (error, BW_IO_ERROR, h->code, h->needle);
      ck_assert_msg (g_str_has_prefix (error->message, "marrowby-hostile.bwproj"),
                     "%s: the message does not name the file: %s", h->name, error->message);
    }
  else
    {
      /* Loads (the parameter is in range on its own), but the model refuses the geometry. */
      g_autoptr (BwResults) r = NULL;
      ck_assert_msg (p != NULL, "%s: %s", h->name, error ? error->message : "");
      r = bw_project_evaluate (p, &error);
      ck_assert_ptr_null (r);
      ck_assert_msg (error && strstr (error->message, h->needle), "%s: %s", h->name,
                     error ? error->message : "no error");
    }
}
END_TEST

/* --- the review record and settling-column tests --- */

START_TEST (test_project_review_roundtrip)
{
  /* Comments are text a reviewer types: leading and trailing blanks, tabs, CR LF line ends,
   * markup characters and non-ASCII letters must all come back byte for byte. */
  static const char *const comments[] = {
    "  Sheet S-2 <rev. B> & \"C\": 'check'\t\r\nsecond line, ünïcödé  ",
    "   ",
    "",
    "\r",
  };
  g_autofree char *path = example ("marrowby-demo.bwproj");
  g_autofree char *saved = g_build_filename (tmpdir, "review.bwproj", NULL);
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) a = bw_project_load (path, &error);
  g_autoptr (BwProject) b = NULL;
  g_autoptr (BwProject) c = NULL;
  g_autofree char *xml = NULL;

  ck_assert_msg (a != NULL, "%s", error ? error->message : "");
  /* A project without a review record writes none. */
  ck_assert_uint_eq (a->stated->len, 0);
  ck_assert (a->review_tolerance == BW_REVIEW_TOLERANCE_DEFAULT);
  xml = bw_project_to_xml (a);
  ck_assert_ptr_null (strstr (xml, "<review"));
  a->review_tolerance = 0.035;
  for (guint i = 0; i < G_N_ELEMENTS (comments); i++)
    {
      BwStated *st = g_new0 (BwStated, 1);
      st->element = g_strdup (i % 2 ? "north-rm" : "north-sed");
      st->quantity = i % 2 ? BW_Q_G : BW_Q_OVERFLOW_RATE;
      st->which = i == 0 ? BW_STATED_CASE : i == 1 ? BW_STATED_MAXIMUM : BW_STATED_MINIMUM;
      ck_assert (bw_load_case_parse_id ("peak-hour/warmest/firm", &st->load_case));
      st->value = 1.0 / 3.0 + i; /* not a short decimal: the 17 digits must carry it */
      st->comment = g_strdup (comments[i]);
      g_ptr_array_add (a->stated, st);
    }
  {
    /* And one without a comment. */
    BwStated *st = bw_stated_copy (g_ptr_array_index (a->stated, 0));
    g_clear_pointer (&st->comment, g_free);
    g_ptr_array_add (a->stated, st);
  }
  ck_assert_msg (bw_project_save (a, saved, &error), "%s", error ? error->message : "");
  b = bw_project_load (saved, &error);
  ck_assert_msg (b != NULL, "%s", error ? error->message : "");
  ck_assert_msg (bw_project_equal (a, b), "the review record changed in a round trip");
  ck_assert_uint_eq (b->stated->len, G_N_ELEMENTS (comments) + 1);
  for (guint i = 0; i < G_N_ELEMENTS (comments); i++)
    {
      const BwStated *st = g_ptr_array_index (b->stated, i);
      ck_assert_str_eq (st->comment, comments[i]);
      ck_assert (st->value == 1.0 / 3.0 + i);
      ck_assert_uint_gt (st->line, 0); /* where it stands in the file, for messages */
    }
  ck_assert_ptr_null (((BwStated *) g_ptr_array_index (b->stated, G_N_ELEMENTS (comments)))->comment);
  ck_assert (((BwStated *) g_ptr_array_index (b->stated, 0))->load_case.flow == BW_FLOW_PEAK_HOUR);
  ck_assert (b->review_tolerance == 0.035);
  /* Copy and equality see the record: a changed comment or tolerance is a different model. */
  c = bw_project_copy (b);
  ck_assert (bw_project_equal (b, c));
  g_free (((BwStated *) g_ptr_array_index (c->stated, 2))->comment);
  ((BwStated *) g_ptr_array_index (c->stated, 2))->comment = g_strdup ("x");
  ck_assert (!bw_project_equal (b, c));
  g_clear_pointer (&c, bw_project_free);
  c = bw_project_copy (b);
  c->review_tolerance = 0.05;
  ck_assert (!bw_project_equal (b, c));
}
END_TEST

START_TEST (test_project_column_test_roundtrip)
{
  g_autofree char *path = example ("marrowby-demo.bwproj");
  g_autofree char *saved = g_build_filename (tmpdir, "column.bwproj", NULL);
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) a = bw_project_load (path, &error);
  g_autoptr (BwProject) b = NULL;
  g_autoptr (BwProject) c = NULL;
  const BwColumnTestRecord *r;
  BwColumnTestRecord *k;
  BwSettlingColumn col;

  ck_assert_msg (a != NULL, "%s", error ? error->message : "");
  /* The demo's invented column test, as typed in data/examples/marrowby-demo.bwproj. */
  ck_assert_uint_eq (a->column_tests->len, 1);
  r = bw_project_column_test_for (a, "north-sed");
  ck_assert_ptr_nonnull (r);
  ck_assert_ptr_null (bw_project_column_test_for (a, "south-sed"));
  ck_assert_str_eq (r->id, "ct-2026-11");
  ck_assert_uint_eq (r->n_depths, 5);
  ck_assert_uint_eq (r->n_times, 7);
  bw_assert_rel (r->time_s[6], 7200.0, 1e-15); /* 120 min */
  bw_assert_rel (r->depth_m[4], 3.0, 1e-15);
  bw_assert_rel (r->reading[4][6], 0.74, 1e-15);
  bw_assert_rel (r->initial_kg_m3, 0.042, 1e-12); /* 42 mg/L */
  ck_assert (bw_column_test_record_column (r, &col, &error));
  bw_assert_rel (col.removal[0][0], 0.38, 1e-15);

  /* A second test read as concentrations: R = 1 - C/C0 (derived). */
  k = bw_column_test_record_new ("ct-conc", NULL);
  k->kind = BW_COLUMN_READING_CONCENTRATION;
  k->initial_kg_m3 = 0.05;
  k->n_depths = 2;
  k->n_times = 3;
  k->depth_m[0] = 1.0 / 3.0;
  k->depth_m[1] = 2.0;
  k->time_s[0] = 300;
  k->time_s[1] = 900;
  k->time_s[2] = 1800;
  for (guint j = 0; j < 2; j++)
    for (guint t = 0; t < 3; t++)
      k->reading[j][t] = 0.05 - 0.01 * (t + 1) + 0.004 * j;
  g_ptr_array_add (a->column_tests, k);
  ck_assert_msg (bw_column_test_record_column (k, &col, &error), "%s", error ? error->message : "");
  bw_assert_rel (col.removal[1][0], 1.0 - 0.044 / 0.05, 1e-12); /* derived: 0.12 */
  ck_assert_msg (bw_project_save (a, saved, &error), "%s", error ? error->message : "");
  b = bw_project_load (saved, &error);
  ck_assert_msg (b != NULL, "%s", error ? error->message : "");
  ck_assert_msg (bw_project_equal (a, b), "a column test changed in a round trip");
  ck_assert_uint_eq (((BwColumnTestRecord *) g_ptr_array_index (b->column_tests, 1))->units->len, 0);
  c = bw_project_copy (b);
  ck_assert (bw_project_equal (b, c));
  ((BwColumnTestRecord *) g_ptr_array_index (c->column_tests, 0))->reading[2][3] += 1e-9;
  ck_assert (!bw_project_equal (b, c));
}
END_TEST

typedef struct
{
  const char *file;    /* an example ... */
  const char *find;    /* ... in which this text ... */
  const char *replace; /* ... is replaced by this */
  int code;
  const char *needle;  /* the message must say this */
} RecordCase;

#define DEMO "marrowby-demo.bwproj"
#define NONC "marrowby-noncompliant.bwproj"
static const RecordCase bad_records[] = {
  { NONC, "<tolerance>0.02</tolerance>", "<tolerance>0</tolerance>", BW_IO_ERROR_INVALID, "review tolerance" },
  { NONC, "<tolerance>0.02</tolerance>", "<tolerance>1.5</tolerance>", BW_IO_ERROR_INVALID, "review tolerance" },
  { NONC, "<tolerance>0.02</tolerance>", "<tolerance>NaN</tolerance>", BW_IO_ERROR_INVALID, "review tolerance" },
  { NONC, "quantity=\"side_water_depth\"", "quantity=\"depth_of_water\"", BW_IO_ERROR_INVALID,
    "quantity: 'depth_of_water'" },
  { NONC, "quantity=\"G\" case=\"max\"", "quantity=\"G\" case=\"largest\"", BW_IO_ERROR_INVALID,
    "case: 'largest'" },
  { NONC, "<value unit=\"1/s\">1000</value>", "<value unit=\"1/s\">lots</value>", BW_IO_ERROR_INVALID,
    "not a finite number" },
  { NONC, "<value unit=\"1/s\">1000</value>", "<value unit=\"1/s\">1e999</value>", BW_IO_ERROR_INVALID,
    "stated value north-rm G" },
  { NONC, "<value unit=\"m\">3.0</value>", "<value unit=\"kg\">3.0</value>", BW_IO_ERROR_INVALID,
    "unit of mass" },
  { NONC, "<value unit=\"1/s\">1000</value>", "", BW_IO_ERROR_INVALID, ":" }, /* schema: value missing */
  { NONC, "element=\"north-rm\" quantity=\"G\"", "element=\"\" quantity=\"G\"", BW_IO_ERROR_INVALID,
    "element: empty" },
  { NONC, "Agrees with the calculation sheet.", "Agrees\x01", BW_IO_ERROR_MALFORMED, ":" },
  { DEMO, "<port depth=\"1.2\">0.24 0.42 0.55 0.66 0.73 0.81 0.86</port>",
    "<port depth=\"1.2\">0.24 0.42 0.55 0.66 0.73 0.81</port>", BW_IO_ERROR_INVALID,
    "6 readings where the test has 7 sampling times" },
  { DEMO, "<port depth=\"1.2\">0.24", "<port depth=\"1.2\">1.24", BW_IO_ERROR_INVALID,
    "column test ct-2026-11: removal: 1.24" },
  { DEMO, "0.55 0.66 0.73 0.81 0.86", "0.55 0.36 0.73 0.81 0.86", BW_IO_ERROR_INVALID, "cannot fall with time" },
  { DEMO, "<port depth=\"1.8\">", "<port depth=\"1.1\">", BW_IO_ERROR_INVALID, "from the surface down" },
  { DEMO, "<port depth=\"1.8\">", "<port depth=\"-1.8\">", BW_IO_ERROR_INVALID, "depths" },
  { DEMO, "10 20 30 45 60 90 120", "10 20 30 45 60 90 NaN", BW_IO_ERROR_INVALID, ":" },
  { DEMO, "10 20 30 45 60 90 120", "10 20 30 30 60 90 120", BW_IO_ERROR_INVALID, "times: reading 4" },
  { DEMO, "<times unit=\"min\">", "<times unit=\"m\">", BW_IO_ERROR_INVALID, "column test ct-2026-11: times" },
  /* An id of no unit (a basin removed since) is kept and applies to nothing. */
  { DEMO, "applies-to=\"north-sed\"", "applies-to=\"north-sed west-sed\"", -1, "" },
  { DEMO, "applies-to=\"north-sed\"", "applies-to=\"north-sed west-sed!\"", BW_IO_ERROR_INVALID, ":" },
  { DEMO, "applies-to=\"north-sed\"", "applies-to=\"north-floc\"", BW_IO_ERROR_INVALID,
    "not a settling basin" },
  { DEMO, "applies-to=\"north-sed\"", "applies-to=\"east-sed\"", BW_IO_ERROR_INVALID,
    "'east-sed' is a" }, /* a plate settler has no side water depth for the design point */
  { DEMO, "readings=\"removal\"", "readings=\"turbidity\"", BW_IO_ERROR_INVALID, ":" }, /* schema */
  { DEMO, "<initial-concentration unit=\"mg/L\">42</initial-concentration>", "", -1, "" }, /* optional */
  { DEMO, "readings=\"removal\"", "readings=\"concentration\"", BW_IO_ERROR_INVALID,
    "mg/L at depth 0.6 m and 10 min is not between 0 and the initial 42 mg/L" },
  /* The chemistry's optional inputs: absent is "not given", present must be valid. */
  { DEMO, "<stock-strength unit=\"%\">48.5</stock-strength>", "", -1, "" },
  { DEMO, "<stock-strength unit=\"%\">48.5</stock-strength>",
    "<stock-strength unit=\"%\">0</stock-strength>", BW_IO_ERROR_INVALID,
    "stock solution strength: must be above zero when given (got 0)" },
  { DEMO, "<stock-strength unit=\"%\">48.5</stock-strength>",
    "<stock-strength unit=\"%\">148.5</stock-strength>", BW_IO_ERROR_INVALID,
    "stock solution strength: 1.485 g/g is outside the valid range" },
  { DEMO, "<stock-strength unit=\"%\">48.5</stock-strength>",
    "<stock-strength unit=\"%\">about half</stock-strength>", BW_IO_ERROR_INVALID, ":" }, /* schema */
  { DEMO, "<stock-density unit=\"kg/m3\">1330</stock-density>",
    "<stock-density unit=\"m\">1330</stock-density>", BW_IO_ERROR_INVALID, "stock solution density" },
  { DEMO, "<stock-density unit=\"kg/m3\">1330</stock-density>",
    "<stock-density unit=\"kg/m3\">13300</stock-density>", BW_IO_ERROR_INVALID,
    "stock solution density: 13300 kg/m³ is outside the valid range 500 to 3000" },
  { DEMO, "<stock-density unit=\"kg/m3\">1330</stock-density>",
    "<stock-density unit=\"kg/m3\">-1330</stock-density>", BW_IO_ERROR_INVALID,
    "stock solution density: must be above zero" },
  { DEMO, "<sludge-solids unit=\"%\">1</sludge-solids>", "<sludge-solids unit=\"%\">80</sludge-solids>",
    BW_IO_ERROR_INVALID, "sludge solids content: 0.8 g/g is outside the valid range" },
  { DEMO, "<sludge-solids unit=\"%\">1</sludge-solids>", "<sludge-solids unit=\"%\">1e999</sludge-solids>",
    BW_IO_ERROR_INVALID, "sludge solids content" },
  { DEMO, "<target-turbidity unit=\"NTU\">2</target-turbidity>",
    "<target-turbidity unit=\"NTU\">-2</target-turbidity>", BW_IO_ERROR_INVALID,
    "target settled turbidity: must be above zero" },
  { DEMO, "<target-turbidity unit=\"NTU\">2</target-turbidity>",
    "<target-turbidity unit=\"mg/L\">2</target-turbidity>", BW_IO_ERROR_INVALID,
    "target settled turbidity" },
  { DEMO, "<alkali>lime</alkali>", "<alkali>chalk</alkali>", BW_IO_ERROR_INVALID, ":" }, /* schema */
  { DEMO, "<alkali>lime</alkali>", "<alkali>soda-ash</alkali>", -1, "" },
};

START_TEST (test_project_bad_records)
{
  const RecordCase *h = &bad_records[_i];
  g_autofree char *path = example (h->file);
  g_autofree char *text = NULL;
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) p = NULL;
  GString *s;

  ck_assert (g_file_get_contents (path, &text, NULL, NULL));
  ck_assert_msg (strstr (text, h->find) != NULL, "fixture text '%s' not in %s", h->find, h->file);
  s = g_string_new (text);
  g_string_replace (s, h->find, h->replace, 1);
  p = bw_project_load_memory (s->str, s->len, "marrowby-record.bwproj", &error);
  g_string_free (s, TRUE);
  if (h->code < 0)
    {
      ck_assert_msg (p != NULL, "case %d: %s", _i, error ? error->message : "");
      return;
    }
  ck_assert_msg (p == NULL, "case %d (%s): loaded", _i, h->replace);
  bw_assert_error (error, BW_IO_ERROR, h->code, h->needle);
  ck_assert_msg (g_str_has_prefix (error->message, "marrowby-record.bwproj"),
                 "case %d: the message does not name the file: %s", _i, error->message);
}
END_TEST

START_TEST (test_project_validate_records)
{
  /* The same rules hold for a model edited in memory, before any save. */
  g_autofree char *path = example ("marrowby-demo.bwproj");
  g_autoptr (BwProject) p = bw_project_load (path, NULL);
  g_autoptr (GError) error = NULL;
  BwStated *st = g_new0 (BwStated, 1);

  ck_assert_ptr_nonnull (p);
  p->review_tolerance = 1.0; /* 100 % is the top of the range, and accepted */
  ck_assert (bw_project_validate (p, NULL));
  st->element = g_strdup ("north-sed");
  st->quantity = BW_Q_OVERFLOW_RATE;
  st->which = BW_STATED_MAXIMUM;
  st->value = INFINITY;
  g_ptr_array_add (p->stated, st);
  ck_assert (!bw_project_validate (p, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "stated value 1 (north-sed overflow_rate)");
  g_clear_error (&error);
  st->value = 0.001;
  st->comment = g_strdup ("bell\a");
  ck_assert (!bw_project_validate (p, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "comment: holds the control character 0x07");
  g_clear_error (&error);
  g_free (st->comment);
  st->comment = g_strdup ("fine\ttab");
  ck_assert (bw_project_validate (p, NULL));
  /* A column test id given twice. */
  g_ptr_array_add (p->column_tests, bw_column_test_record_copy (g_ptr_array_index (p->column_tests, 0)));
  ck_assert (!bw_project_validate (p, &error));
  bw_assert_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, "column test id: 'ct-2026-11'");
}
END_TEST

START_TEST (test_project_size_limit)
{
  const gsize n = BW_XML_MAX_BYTES + 10;
  g_autofree char *big = g_malloc (n);
  g_autoptr (GError) error = NULL;

  memset (big, ' ', n);
  ck_assert_ptr_null (bw_project_load_memory (big, n, "big.bwproj", &error));
  bw_assert_error (error, BW_IO_ERROR, BW_IO_ERROR_TOO_LARGE, "limit");
}
END_TEST

START_TEST (test_save_atomic_keeps_old_file)
{
  g_autofree char *path = example ("marrowby-demo.bwproj");
  g_autofree char *target = g_build_filename (tmpdir, "plant.bwproj", NULL);
  g_autofree char *before = NULL;
  g_autofree char *after = NULL;
  g_autoptr (GError) error = NULL;
  g_autoptr (BwProject) p = bw_project_load (path, NULL);
  g_autoptr (GDir) d = NULL;
  const char *n;
  guint files = 0;

  ck_assert (bw_project_save (p, target, &error));
  ck_assert (g_file_get_contents (target, &before, NULL, NULL));
  /* An invalid model is refused before anything is written. */
  ((BwProcessUnit *) bw_project_find_unit (p, "north-rm", NULL))->n_standby = 5;
  ck_assert (!bw_project_save (p, target, &error));
  bw_assert_error (error, BW_IO_ERROR, BW_IO_ERROR_INVALID, "not saved");
  g_clear_error (&error);
  ((BwProcessUnit *) bw_project_find_unit (p, "north-rm", NULL))->n_standby = 1;
  /* A folder that cannot be written: the error says so, the old file stays as it was. */
  if (geteuid () != 0) /* root ignores permissions */
    {
      ck_assert (g_chmod (tmpdir, 0500) == 0);
      ck_assert (!bw_project_save (p, target, &error));
      bw_assert_error (error, BW_IO_ERROR, BW_IO_ERROR_WRITE, "untouched");
      g_clear_error (&error);
      ck_assert (g_chmod (tmpdir, 0700) == 0);
    }
  ck_assert (!bw_project_save (p, "/nonexistent-dir-bw/plant.bwproj", &error));
  bw_assert_error (error, BW_IO_ERROR, BW_IO_ERROR_WRITE, "cannot write");
  ck_assert (g_file_get_contents (target, &after, NULL, NULL));
  ck_assert_str_eq (before, after);
  /* No temporary file is left behind. */
  d = g_dir_open (tmpdir, 0, NULL);
  while ((n = g_dir_read_name (d)))
    files++;
  ck_assert_uint_eq (files, 1);
}
END_TEST

START_TEST (test_criteria_shipped_sets)
{
  g_autoptr (GPtrArray) skipped = NULL;
  g_autoptr (GPtrArray) sets = bw_criteria_find_all (&skipped);
  gboolean textbook = FALSE, rsww = FALSE;

  ck_assert_uint_eq (skipped->len, 0);
  for (guint i = 0; i < sets->len; i++)
    {
      const BwCriteriaSet *s = g_ptr_array_index (sets, i);
      textbook |= g_strcmp0 (s->id, "textbook-ranges") == 0;
      rsww |= g_strcmp0 (s->id, "recommended-standards-2018") == 0;
      ck_assert_uint_gt (s->criteria->len, 5);
      for (guint k = 0; k < s->criteria->len; k++)
        {
          const BwCriterion *c = g_ptr_array_index (s->criteria, k);
          ck_assert_ptr_nonnull (c->document);
          ck_assert_ptr_nonnull (c->clause);
          /* Every limit recalled from memory says so to the reader. */
          if (g_strcmp0 (s->id, "recommended-standards-2018") == 0)
            {
              ck_assert_int_eq (c->provenance, BW_PROVENANCE_MEMORY);
              g_autofree char *lower = c->note ? g_ascii_strdown (c->note, -1) : NULL;
              ck_assert_msg (lower && strstr (lower, "from memory"), "%s lacks the caution", c->id);
            }
        }
    }
  ck_assert (textbook && rsww);
}
END_TEST

START_TEST (test_criteria_units_converted)
{
  g_autoptr (GError) error = NULL;
  g_autoptr (BwCriteriaSet) s = bw_criteria_set_open ("recommended-standards-2018", &error);
  const BwCriterion *c;

  ck_assert_msg (s != NULL, "%s", error ? error->message : "");
  /* 20 000 gpd/ft = 248.387 m3/(d m) (docs/references.md, exact conversion). */
  c = bw_criteria_set_find (s, "rsww-sed-weir");
  bw_assert_rel (c->required.max * 86400, 248.387, 2e-6);
  /* 0.5 ft/min = 0.00254 m/s exactly. */
  c = bw_criteria_set_find (s, "rsww-sed-velocity");
  bw_assert_rel (c->required.max, 0.00254, 1e-12);
  /* 30 min = 1800 s. */
  c = bw_criteria_set_find (s, "rsww-floc-detention");
  bw_assert_rel (c->required.min, 1800, 1e-12);
}
END_TEST

START_TEST (test_criteria_bad_files)
{
  const struct { const char *text; int code; const char *needle; } cases[] = {
    { "<criteria-set xmlns=\"urn:x-basinwright:criteria:1\" format-version=\"1\" id=\"x\"><name>x</name>"
      "<criterion id=\"a\" quantity=\"G\" applies-to=\"rapid-mix\"><required min=\"10\" max=\"5\"/>"
      "<citation document=\"d\" provenance=\"seen\"/></criterion></criteria-set>",
      BW_IO_ERROR_INVALID, "above its maximum" },
    { "<criteria-set xmlns=\"urn:x-basinwright:criteria:1\" format-version=\"1\" id=\"x\"><name>x</name>"
      "<criterion id=\"a\" quantity=\"colour\" applies-to=\"rapid-mix\"><required min=\"1\"/>"
      "<citation document=\"d\" provenance=\"seen\"/></criterion></criteria-set>",
      BW_IO_ERROR_INVALID, "not a quantity" },
    { "<criteria-set xmlns=\"urn:x-basinwright:criteria:1\" format-version=\"1\" id=\"x\"><name>x</name>"
      "<criterion id=\"a\" quantity=\"G\" applies-to=\"rapid-mix\"><required min=\"1\" unit=\"gpm\"/>"
      "<citation document=\"d\" provenance=\"seen\"/></criterion></criteria-set>",
      BW_IO_ERROR_INVALID, "unit of flow" },
    { "<criteria-set xmlns=\"urn:x-basinwright:criteria:1\" format-version=\"1\" id=\"x\"><name>x</name>"
      "<criterion id=\"a\" quantity=\"G\" applies-to=\"rapid-mix\"><required min=\"1\"/>"
      "</criterion></criteria-set>",
      BW_IO_ERROR_INVALID, ":" }, /* no citation: the schema refuses it */
    { "<criteria-set xmlns=\"urn:x-basinwright:criteria:1\" format-version=\"1\" id=\"x\"><name>x</name>"
      "<criterion id=\"a\" quantity=\"G\" applies-to=\"rapid-mix\"><required min=\"1\"/>"
      "<cases flows=\"someday\"/><citation document=\"d\" provenance=\"seen\"/></criterion></criteria-set>",
      BW_IO_ERROR_INVALID, "someday" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autofree char *p = g_build_filename (tmpdir, "c.xml", NULL);
      g_autoptr (GError) error = NULL;
      ck_assert (g_file_set_contents (p, cases[i].text, -1, NULL));
      ck_assert_ptr_null (bw_criteria_set_load (p, &error));
      bw_assert_error (error, BW_IO_ERROR, cases[i].code, cases[i].needle);
    }
}
END_TEST

/* A test program runs from its build tree, so the source tree's data/ stands in for the
 * installed one; $BW_DATADIR comes before both. (That an installed copy ignores the checkout is
 * shown by build-aux/test-install.) */
START_TEST (test_data_find_order)
{
  g_autofree char *from_source = NULL;
  g_autofree char *from_env = NULL;
  g_autofree char *fake = g_build_filename (tmpdir, "criteria.rng", NULL);
  g_autofree char *expected = g_build_filename (BW_SOURCE_DATADIR, "criteria.rng", NULL);
  g_autofree char *old = g_strdup (g_getenv ("BW_DATADIR"));

  ck_assert (bw_running_uninstalled ());
  g_unsetenv ("BW_DATADIR");
  from_source = bw_data_find ("criteria.rng");
  ck_assert_str_eq (from_source, expected);
  ck_assert_ptr_null (bw_data_find ("no-such-file.rng"));

  ck_assert (g_file_set_contents (fake, "<grammar/>", -1, NULL));
  g_setenv ("BW_DATADIR", tmpdir, TRUE);
  from_env = bw_data_find ("criteria.rng");
  if (old)
    g_setenv ("BW_DATADIR", old, TRUE);
  else
    g_unsetenv ("BW_DATADIR");
  ck_assert_str_eq (from_env, fake);
}
END_TEST

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("project-xml");
  TCase *tc = tcase_create ("project");

  tcase_add_checked_fixture (tc, setup, teardown);
  tcase_add_test (tc, test_project_load_demo);
  tcase_add_test (tc, test_project_roundtrip_examples);
  tcase_add_test (tc, test_project_chemistry_defaults_and_roundtrip);
  tcase_add_test (tc, test_project_chemistry_validate);
  tcase_add_test (tc, test_project_equal_notices_changes);
  tcase_add_test (tc, test_project_foreign_elements_kept);
  tcase_add_loop_test (tc, test_project_hostile, 0, G_N_ELEMENTS (hostile));
  tcase_add_test (tc, test_project_review_roundtrip);
  tcase_add_test (tc, test_project_column_test_roundtrip);
  tcase_add_loop_test (tc, test_project_bad_records, 0, G_N_ELEMENTS (bad_records));
  tcase_add_test (tc, test_project_validate_records);
  tcase_add_test (tc, test_project_size_limit);
  tcase_add_test (tc, test_save_atomic_keeps_old_file);
  tcase_add_test (tc, test_data_find_order);
  suite_add_tcase (s, tc);

  tc = tcase_create ("criteria");
  tcase_add_checked_fixture (tc, setup, teardown);
  tcase_add_test (tc, test_criteria_shipped_sets);
  tcase_add_test (tc, test_criteria_units_converted);
  tcase_add_test (tc, test_criteria_bad_files);
  suite_add_tcase (s, tc);
  return s;
}
