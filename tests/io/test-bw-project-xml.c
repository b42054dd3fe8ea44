/* SPDX-License-Identifier: GPL-3.0-or-later */
/* test-bw-project-xml.c: project and criteria files: loading, round trips, hostile input, and
 * atomic saving. */
#include "config.h"

#include <glib/gstdio.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include "bw-test.h"
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

Suite *
bw_test_suite (void)
{
  Suite *s = suite_create ("project-xml");
  TCase *tc = tcase_create ("project");

  tcase_add_checked_fixture (tc, setup, teardown);
  tcase_add_test (tc, test_project_load_demo);
  tcase_add_test (tc, test_project_roundtrip_examples);
  tcase_add_test (tc, test_project_equal_notices_changes);
  tcase_add_test (tc, test_project_foreign_elements_kept);
  tcase_add_loop_test (tc, test_project_hostile, 0, G_N_ELEMENTS (hostile));
  tcase_add_test (tc, test_project_size_limit);
  tcase_add_test (tc, test_save_atomic_keeps_old_file);
  suite_add_tcase (s, tc);

  tc = tcase_create ("criteria");
  tcase_add_checked_fixture (tc, setup, teardown);
  tcase_add_test (tc, test_criteria_shipped_sets);
  tcase_add_test (tc, test_criteria_units_converted);
  tcase_add_test (tc, test_criteria_bad_files);
  suite_add_tcase (s, tc);
  return s;
}
