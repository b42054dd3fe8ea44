/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-project.h: a plant: design basis, trains of process units, and load cases. */
#pragma once

#include <glib.h>

#include "engine/bw-chemistry.h"
#include "engine/bw-criteria.h"
#include "engine/bw-jartest.h"
#include "engine/bw-params.h"
#include "engine/bw-removal.h"

G_BEGIN_DECLS

typedef struct _BwProcessUnit BwProcessUnit;

/* One process unit of a train (or one stage of a flocculator). */
struct _BwProcessUnit
{
  char *id;                      /* unique in the project: "rm-1", "floc-1/stage-2" for stages */
  char *name;                    /* "Rapid mix" */
  BwProcessType type;
  guint n_parallel;              /* identical units side by side (1 for stages) */
  guint n_standby;               /* of those, how many may be out of service (firm capacity) */
  double values[BW_MAX_PARAMS];  /* indexed like bw_params_of (type) */
  GPtrArray *stages;             /* BwProcessUnit*, a flocculator's stages in flow order */
  GPtrArray *foreign;            /* char*: XML of unknown elements kept from a newer file */
};

typedef struct
{
  char *id;
  char *name;
  GPtrArray *units; /* BwProcessUnit*, in flow order */
} BwTrain;

typedef struct
{
  double flow_m3_s[BW_N_FLOW_KINDS]; /* plant flows */
  guint flows_given;                 /* 1 << BwFlowKind for those set */
  double temperature_K[BW_N_TEMP_KINDS];
  double turbidity_NTU;
  double alkalinity_kg_m3;           /* as CaCO3 */
  double ph;
} BwDesignBasis;

/* The alkali fed to keep the residual alkalinity target. */
typedef enum
{
  BW_ALKALI_LIME,     /* hydrated lime, Ca(OH)2 */
  BW_ALKALI_SODA_ASH, /* soda ash, Na2CO3 */
  BW_N_ALKALIS
} BwAlkaliKind;

const char *bw_alkali_kind_name (BwAlkaliKind k); /* "lime", "soda-ash" (file keywords) */
gboolean bw_alkali_kind_from_name (const char *name, BwAlkaliKind *out);

/* The coagulant and its dose range, which the rapid mix receives and whose sludge the settling
 * units collect. The optional fields hold 0 when not given. */
typedef struct
{
  gboolean enabled;
  BwCoagulantKind kind;         /* alum, ferric-chloride, ferric-sulfate or pacl */
  double hydrate_waters;        /* alum only */
  double al2o3_fraction;        /* PACl only */
  double basicity;              /* PACl only */
  double dose_min_kg_m3;
  double dose_design_kg_m3;
  double dose_max_kg_m3;
  double ss_factor;             /* mg/L of suspended solids per NTU */
  double residual_target_kg_m3; /* alkalinity as CaCO3 to keep; 0 for none */
  char *jar_test;               /* id of the jar-test series the dose was chosen from, or NULL */
  double stock_fraction;        /* liquid stock strength, g product per g solution; 0: dry feed */
  double stock_density_kg_m3;   /* liquid stock density; 0 for none */
  BwAlkaliKind alkali;          /* fed when the residual falls below the target (lime default) */
  double sludge_solids_fraction; /* settled sludge solids content, g/g, for its volume; 0: none */
  double target_NTU;            /* settled turbidity the jar-test dose must reach; 0 for none */
} BwChemistryBasis;

/* A jar-test series kept with the project. */
typedef struct
{
  char *id;
  char *name;
  double temperature_K;
  BwJarSeries series;
} BwJarTestRecord;

typedef struct
{
  BwFlowKind flow;
  BwTempKind temp;
  BwServiceState service;
  gboolean enabled;
} BwLoadCase;

/* Which value of a quantity a submittal states: in one load case, or the governing extreme. */
typedef enum
{
  BW_STATED_CASE,    /* in the load case CASE */
  BW_STATED_MAXIMUM, /* the largest over the load cases */
  BW_STATED_MINIMUM, /* the smallest over the load cases */
} BwStatedWhich;

/* One value a submittal states, with the reviewer's comment on it; read from a stated-values CSV
 * or kept in the project's review record. */
typedef struct
{
  char *element;       /* unit or stage id */
  BwQuantity quantity;
  BwStatedWhich which;
  BwLoadCase load_case; /* for BW_STATED_CASE */
  double value;         /* SI */
  char *comment;        /* the reviewer's note, or NULL */
  guint line;           /* where it was read, for messages (0 if not from a file) */
} BwStated;

/* The review tolerance of a new project, the same as the CLI's default (1 %). */
#define BW_REVIEW_TOLERANCE_DEFAULT 0.01

BwStated *bw_stated_copy (const BwStated *s);
void bw_stated_free (BwStated *s);

/* What a settling-column test recorded at each port and time. */
typedef enum
{
  BW_COLUMN_READING_REMOVAL,       /* fraction removed R = 1 - C / C0, 0-1 */
  BW_COLUMN_READING_CONCENTRATION, /* suspended solids C (kg/m³); needs C0 */
} BwColumnReadingKind;

/* A settling-column test (Type II, flocculent settling) kept with the project. */
typedef struct
{
  char *id;
  char *name;
  double initial_kg_m3;          /* C0, kg/m³; 0 when not given */
  BwColumnReadingKind kind;
  guint n_depths;                /* ports, 1 to BW_COLUMN_MAX_DEPTHS */
  guint n_times;                 /* sampling times, 1 to BW_COLUMN_MAX_TIMES */
  double depth_m[BW_COLUMN_MAX_DEPTHS]; /* m below the surface, increasing */
  double time_s[BW_COLUMN_MAX_TIMES];   /* s, increasing */
  double reading[BW_COLUMN_MAX_DEPTHS][BW_COLUMN_MAX_TIMES]; /* [port][time], by KIND (SI) */
  GPtrArray *units;              /* char*: ids of the settling units it applies to (may be empty) */
} BwColumnTestRecord;

BwColumnTestRecord *bw_column_test_record_new (const char *id, const char *name);
BwColumnTestRecord *bw_column_test_record_copy (const BwColumnTestRecord *r);
void bw_column_test_record_free (BwColumnTestRecord *r);
gboolean bw_column_test_record_equal (const BwColumnTestRecord *a, const BwColumnTestRecord *b);

/* The removal grid of R (concentrations turned into 1 - C / C0), checked by
 * bw_settling_column_check; errors start with "column test ID: ". */
gboolean bw_column_test_record_column (const BwColumnTestRecord *r, BwSettlingColumn *out,
                                       GError **error);

typedef struct
{
  char *name;
  char *preparer;
  char *revision;
  char *date;        /* as the preparer writes it; not parsed */
  char *description;
  char *criteria;    /* criteria-set id (or path) the project is checked against */
  BwDesignBasis basis;
  BwChemistryBasis chemistry;
  GPtrArray *jar_tests; /* BwJarTestRecord* */
  GPtrArray *column_tests; /* BwColumnTestRecord*, owned, never NULL */
  GPtrArray *stated;    /* BwStated*: the review record's stated values, owned, never NULL */
  double review_tolerance; /* relative fraction flagged as a discrepancy, (0, 1]; default 0.01 */
  GPtrArray *trains; /* BwTrain* */
  GArray *cases;     /* BwLoadCase */
  GPtrArray *foreign;/* char*: XML of unknown top-level elements kept from a newer file */
} BwProject;

BwProject *bw_project_new (void);
void bw_project_free (BwProject *p);
BwProject *bw_project_copy (const BwProject *p);

/* The coagulant of P's chemistry basis (fails for an incoherent one, naming the field). */
gboolean bw_project_coagulant (const BwProject *p, BwCoagulant *out, GError **error);

BwJarTestRecord *bw_jar_test_record_new (const char *id, const char *name);
void bw_jar_test_record_free (BwJarTestRecord *r);

/* The first column test that applies to the unit UNIT_ID, or NULL. */
const BwColumnTestRecord *bw_project_column_test_for (const BwProject *p, const char *unit_id);

BwTrain *bw_train_new (const char *id, const char *name);
void bw_train_free (BwTrain *t);

/* A unit of TYPE with every parameter at its default. */
BwProcessUnit *bw_process_unit_new (BwProcessType type, const char *id, const char *name);
void bw_process_unit_free (BwProcessUnit *u);
BwProcessUnit *bw_process_unit_copy (const BwProcessUnit *u);

/* Parameter access by id; set checks the value (the error names the parameter). */
gboolean bw_process_unit_set (BwProcessUnit *u, const char *param_id, double value, GError **error);
double bw_process_unit_get (const BwProcessUnit *u, const char *param_id);

/* Plant flow through one unit of U in SERVICE: the train's share divided over the units in
 * service. */
double bw_project_unit_flow (const BwProject *p, const BwProcessUnit *u, BwFlowKind flow,
                             BwServiceState service);

/* Replaces the load cases with every combination of the given flows, both temperatures, and
 * (when any unit has a standby) both service states. */
void bw_project_generate_cases (BwProject *p);

/* "maximum-day, coldest, firm" and its id "maximum-day/coldest/firm". */
char *bw_load_case_label (const BwLoadCase *c);
char *bw_load_case_id (const BwLoadCase *c);
gboolean bw_load_case_parse_id (const char *id, BwLoadCase *out);

/* Checks everything a file or an edit can get wrong: unique ids, standby < parallel, every
 * parameter in range, flows ordered and positive, temperatures in 0-40 degC and ordered. */
gboolean bw_project_validate (const BwProject *p, GError **error);

/* Finds a unit (or stage) by id; NULL if none. */
BwProcessUnit *bw_project_find_unit (const BwProject *p, const char *id, BwTrain **train);

/* TRUE when A and B hold the same model (every field, value for value). */
gboolean bw_project_equal (const BwProject *a, const BwProject *b);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (BwProject, bw_project_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (BwProcessUnit, bw_process_unit_free)

G_END_DECLS
