/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-autosize.c: grid search of one unit's design space. The grids use construction increments
 * (common practice, no source: 0.5 m on basin width, 2 m on length, 0.25 m on depth, 5 rpm on
 * rapid-mix speed, ...); every candidate is evaluated with the same unit models as the project,
 * in every enabled load case, against every required criterion that applies. */
#include "config.h"

#include "engine/bw-autosize.h"

#include <math.h>
#include <string.h>

#include "engine/bw-error.h"
#include "engine/bw-i18n.h"
#include "engine/bw-water.h"

typedef struct
{
  const char *param;
  double lo, hi, step;
} Dim;

typedef struct
{
  const BwCriterion *c;
  gboolean stage; /* applies to the stages, not the unit */
} Rule;

/* Everything a candidate evaluation needs, computed once. */
typedef struct
{
  const BwProject *p;
  const BwProcessUnit *orig;
  guint n_cases;
  BwLoadCase cases[64];
  BwWater water[64];
  double plant_share[64]; /* train flow in each case, m3/s */
  Rule rules[64];
  guint n_rules;
  BwElementType type;
  BwObjective objective;
} Ctx;

const char *
bw_objective_name (BwObjective o)
{
  return o == BW_OBJECTIVE_VOLUME ? "volume" : o == BW_OBJECTIVE_FOOTPRINT ? "footprint" : "power";
}

gboolean
bw_objective_from_name (const char *name, BwObjective *out)
{
  for (int i = 0; i < 3; i++)
    if (g_strcmp0 (name, bw_objective_name ((BwObjective) i)) == 0)
      {
        *out = (BwObjective) i;
        return TRUE;
      }
  return FALSE;
}

void
bw_autosize_result_clear (BwAutosizeResult *r)
{
  g_clear_pointer (&r->searched, g_free);
}

static double
relative_margin (const BwLimits *l, double v)
{
  double m = G_MAXDOUBLE;
  if (l->has_min)
    m = MIN (m, (v - l->min) / MAX (fabs (l->min), 1e-300));
  if (l->has_max)
    m = MIN (m, (l->max - v) / MAX (fabs (l->max), 1e-300));
  return m;
}

/* Checks one evaluated set against the rules for that level; updates the worst margins. Returns
 * FALSE at the first failed required limit. */
static gboolean
grade (const Ctx *x, const BwQuantitySet *s, gboolean stage_level, const BwLoadCase *lc,
       double *margins)
{
  for (guint i = 0; i < x->n_rules; i++)
    {
      const BwCriterion *c = x->rules[i].c;
      double v, m;
      if (x->rules[i].stage != stage_level || !bw_quantity_set_has (s, c->quantity)
          || !bw_case_filter_matches (&c->cases, lc->flow, lc->temp, lc->service))
        continue;
      v = s->values[c->quantity];
      m = relative_margin (&c->required, v);
      if (m < 0)
        return FALSE;
      margins[i] = MIN (margins[i], m);
    }
  return TRUE;
}

static double
footprint (const BwProcessUnit *u)
{
  const double *v = u->values;
  switch (u->type)
    {
    case BW_PROCESS_RECTANGULAR_BASIN:
      return v[bw_param_index (u->type, "length")] * v[bw_param_index (u->type, "width")];
    case BW_PROCESS_CIRCULAR_CLARIFIER:
      {
        const double d = v[bw_param_index (u->type, "diameter")];
        return G_PI * d * d / 4;
      }
    case BW_PROCESS_RAPID_MIX:
      {
        const double w = v[bw_param_index (u->type, "width")];
        return v[bw_param_index (u->type, "shape")] == 0 ? w * w : G_PI * w * w / 4;
      }
    case BW_PROCESS_PLATE_SETTLER:
      /* The strip each plate or tube row takes in plan: spacing / sin(angle) x width. */
      return v[bw_param_index (u->type, "count")] * v[bw_param_index (u->type, "spacing")]
             / sin (v[bw_param_index (u->type, "angle")]) * v[bw_param_index (u->type, "plate-width")];
    default:
      return 0;
    }
}

/* The band of impeller to tank diameter, D/T, a rapid-mix design may have: turbine impellers in
 * back-mix tanks are sized from about a fifth to a half of the tank (common practice, no source;
 * the standard Rushton geometry is D/T = 1/3, from memory). Outside it the power-number
 * correlations do not hold and the tank does not mix as one volume, so the search does not offer
 * an impeller nearly as wide as its tank. Dimensionless. */
#define RAPID_MIX_DT_MIN 0.2
#define RAPID_MIX_DT_MAX 0.5

static gboolean
in_proportion (const BwProcessUnit *u)
{
  if (u->type == BW_PROCESS_RAPID_MIX)
    {
      /* width: the side of a square tank or the diameter of a round one, m */
      const double t = u->values[bw_param_index (u->type, "width")];
      const double d = u->values[bw_param_index (u->type, "impeller-diameter")];
      return d >= RAPID_MIX_DT_MIN * t - 1e-9 && d <= RAPID_MIX_DT_MAX * t + 1e-9;
    }
  return TRUE;
}

/* Evaluates unit U (a modified copy) in every case. On a pass, fills CAND's objective and margins. */
static gboolean
try_candidate (const Ctx *x, const BwProcessUnit *u, BwCandidate *cand, guint64 *evals)
{
  double margins[64];
  double vol = 0, power = 0;
  const guint running_all = u->n_parallel;
  const guint running_firm = u->n_parallel > u->n_standby ? u->n_parallel - u->n_standby : 1;

  if (!in_proportion (u))
    return FALSE;
  for (guint i = 0; i < x->n_rules; i++)
    margins[i] = G_MAXDOUBLE;
  for (guint c = 0; c < x->n_cases; c++)
    {
      const BwLoadCase *lc = &x->cases[c];
      const double q = x->plant_share[c] / (lc->service == BW_SERVICE_FIRM ? running_firm : running_all);
      BwQuantitySet s = { 0 };
      BwQuantitySet stages[8];
      BwQuantitySet *sp[8];
      for (guint i = 0; i < 8; i++)
        {
          stages[i].present = 0;
          sp[i] = &stages[i];
        }
      (*evals)++;
      if (!bw_evaluate_unit_case (u, q, &x->water[c], &s, sp, NULL, NULL))
        return FALSE; /* the models refuse this geometry: not a design */
      if (!grade (x, &s, FALSE, lc, margins))
        return FALSE;
      for (guint i = 0; i < u->stages->len; i++)
        if (!grade (x, &stages[i], TRUE, lc, margins))
          return FALSE;
      if (bw_quantity_set_has (&s, BW_Q_VOLUME))
        vol = s.values[BW_Q_VOLUME];
      if (bw_quantity_set_has (&s, BW_Q_POWER))
        power = MAX (power, s.values[BW_Q_POWER]);
    }
  cand->n_parallel = u->n_parallel;
  memcpy (cand->values, u->values, sizeof cand->values);
  cand->n_stages = MIN (u->stages->len, 8u);
  for (guint i = 0; i < cand->n_stages; i++)
    memcpy (cand->stage_values[i], ((BwProcessUnit *) g_ptr_array_index (u->stages, i))->values,
            sizeof cand->stage_values[i]);
  cand->volume_m3 = vol * u->n_parallel;
  if (x->objective == BW_OBJECTIVE_VOLUME)
    cand->objective = cand->volume_m3;
  else if (x->objective == BW_OBJECTIVE_FOOTPRINT)
    {
      double area = footprint (u);
      if (u->type == BW_PROCESS_FLOCCULATOR)
        {
          /* width x the stages' lengths (the volume over the depth, baffled stages included). */
          area = vol / u->values[bw_param_index (u->type, "water-depth")];
        }
      cand->objective = area * u->n_parallel;
    }
  else
    cand->objective = power * u->n_parallel;
  cand->n_margins = 0;
  for (guint i = 0; i < x->n_rules && cand->n_margins < BW_AUTOSIZE_MAX_MARGINS; i++)
    if (margins[i] < G_MAXDOUBLE)
      {
        cand->margin_criteria[cand->n_margins] = x->rules[i].c;
        cand->margins[cand->n_margins++] = margins[i];
      }
  return TRUE;
}

static gboolean
better (const BwCandidate *a, const BwCandidate *b)
{
  const double tol = 1e-9 * MAX (fabs (a->objective), fabs (b->objective));
  if (fabs (a->objective - b->objective) > tol)
    return a->objective < b->objective;
  return a->volume_m3 < b->volume_m3;
}

/* Keeps the BW_AUTOSIZE_BEST best, in order. */
static void
keep (BwAutosizeResult *r, const BwCandidate *c)
{
  guint at = r->n_best;
  while (at > 0 && better (c, &r->best[at - 1]))
    at--;
  if (at >= BW_AUTOSIZE_BEST)
    return;
  if (r->n_best < BW_AUTOSIZE_BEST)
    r->n_best++;
  memmove (&r->best[at + 1], &r->best[at], (r->n_best - 1 - at) * sizeof (BwCandidate));
  r->best[at] = *c;
}

static guint
dim_steps (const Dim *d)
{
  return (guint) floor ((d->hi - d->lo) / d->step + 1e-9) + 1;
}

static void
describe (GString *s, BwProcessType type, const Dim *dims, guint n, gboolean count)
{
  for (guint i = 0; i < n; i++)
    {
      const int k = bw_param_index (type, dims[i].param);
      const BwParamSpec *spec = &bw_params_of (type, NULL)[k];
      const BwUnit *u = bw_units_display_unit (spec->kind, BW_UNIT_SYSTEM_SI);
      g_autofree char *lo = bw_format_number (bw_unit_from_si (u, dims[i].lo), 3);
      g_autofree char *hi = bw_format_number (bw_unit_from_si (u, dims[i].hi), 3);
      g_autofree char *st = bw_format_number (spec->kind == BW_KIND_TEMPERATURE ? dims[i].step
                                                                                 : bw_unit_from_si (u, dims[i].step), 3);
      if (s->len)
        g_string_append (s, BW_ (", "));
      /* TRANSLATORS: a searched range: "impeller speed 20.0-400 rpm by 5.00 rpm" */
      g_string_append_printf (s, BW_ ("%s %s-%s %s by %s %s"), BW_ (spec->label), lo, hi, u->symbol, st,
                              u->symbol);
    }
  if (count)
    g_string_append (s, BW_ (", units in parallel"));
}

/* Odometer over DIMS (and optionally the parallel count) on a copy of the unit. */
static gboolean
grid_search (const Ctx *x, BwProcessUnit *work, const Dim *dims, guint n_dims, guint par_lo,
             guint par_hi, BwAutosizeProgress progress, gpointer user_data, BwAutosizeResult *out,
             GError **error)
{
  guint idx[8] = { 0 }, steps[8];
  int pidx[8];
  guint64 total = (guint64) (par_hi - par_lo + 1), done = 0;

  for (guint i = 0; i < n_dims; i++)
    {
      steps[i] = dim_steps (&dims[i]);
      pidx[i] = bw_param_index (work->type, dims[i].param);
      g_assert (pidx[i] >= 0);
      total *= steps[i];
    }
  for (guint par = par_lo; par <= par_hi; par++)
    {
      work->n_parallel = par;
      memset (idx, 0, sizeof idx);
      for (;;)
        {
          BwCandidate cand;
          gboolean valid = TRUE;
          for (guint i = 0; i < n_dims; i++)
            {
              const BwParamSpec *spec = &bw_params_of (work->type, NULL)[pidx[i]];
              const double v = dims[i].lo + idx[i] * dims[i].step;
              work->values[pidx[i]] = v;
              valid = valid && bw_param_check (spec, v, NULL);
            }
          out->candidates++;
          if (valid && try_candidate (x, work, &cand, &out->evaluations))
            {
              out->passing++;
              keep (out, &cand);
            }
          done++;
          if (progress && (done & 0x3fff) == 0 && !progress ((double) done / total, user_data))
            {
              g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, BW_ ("autosize: cancelled"));
              return FALSE;
            }
          /* advance */
          {
            guint i = 0;
            while (i < n_dims && ++idx[i] >= steps[i])
              idx[i++] = 0;
            if (i == n_dims)
              break;
          }
        }
    }
  return TRUE;
}

static void
compile_rules (Ctx *x, const BwCriteriaSet *set, gboolean with_stages)
{
  x->n_rules = 0;
  for (guint i = 0; i < set->criteria->len && x->n_rules < G_N_ELEMENTS (x->rules); i++)
    {
      const BwCriterion *c = g_ptr_array_index (set->criteria, i);
      if (!c->required.has_min && !c->required.has_max)
        continue;
      if ((c->applies_to >> x->type) & 1)
        x->rules[x->n_rules++] = (Rule) { c, FALSE };
      else if (with_stages && ((c->applies_to >> BW_ELEMENT_FLOCCULATOR_STAGE) & 1))
        x->rules[x->n_rules++] = (Rule) { c, TRUE };
    }
}

/* Flocculators: each stage's own grid decides its G (and the stage criteria), independent of the
 * others; the train's criteria (detention, Gt) are then checked on the combinations of each stage's
 * three best settings. */
static gboolean
search_flocculator (Ctx *x, BwProcessUnit *work, BwAutosizeProgress progress, gpointer user_data,
                    BwAutosizeResult *out, GError **error)
{
  const guint ns = MIN (work->stages->len, 8u);
#define G_BINS 8
#define T_BINS 4
#define BINS (G_BINS * T_BINS)
  double best_vals[8][BINS][BW_MAX_PARAMS];
  guint n_best[8] = { 0 };
  GString *desc = g_string_new (NULL);
  const double width = work->values[bw_param_index (work->type, "width")];
  guint bin_case = 0;

  /* Settings are binned at the maximum-day flow (the design point) when there is such a case. */
  for (guint c = 0; c < x->n_cases; c++)
    if (x->cases[c].flow == BW_FLOW_MAXIMUM_DAY)
      {
        bin_case = c;
        break;
      }

  for (guint s = 0; s < ns; s++)
    {
      BwProcessUnit *st = g_ptr_array_index (work->stages, s);
      /* The stage's passing settings, binned by their G (log scale, 5-100 1/s) and detention (log
       * scale, 1-60 min) so that the train can be assembled from a spread of intensities and times;
       * the cheapest setting of each bin is kept. */
      double bin_obj[BINS];
      double bin_vals[BINS][BW_MAX_PARAMS];
      gboolean bin_used[BINS] = { FALSE };
      Dim dims[2];
      guint nd = 0, steps[2], idx[2] = { 0, 0 };
      int pidx[2];
      double orig[BW_MAX_PARAMS];

      memcpy (orig, st->values, sizeof orig);
      if (st->type == BW_STAGE_PADDLE)
        {
          dims[nd++] = (Dim) { "speed", 0.5 / 60, 10.0 / 60, 0.1 / 60 };
          dims[nd++] = (Dim) { "blade-length", 0.5, MAX (0.5, width / MAX (1.0, st->values[bw_param_index (st->type, "wheels")])), 0.1 };
        }
      else if (st->type == BW_STAGE_TURBINE)
        {
          dims[nd++] = (Dim) { "speed", 5.0 / 60, 120.0 / 60, 1.0 / 60 };
          dims[nd++] = (Dim) { "impeller-diameter", 0.5, 4.0, 0.1 };
        }
      else
        {
          dims[nd++] = (Dim) { "spacing", 0.10, 1.50, 0.01 };
          dims[nd++] = (Dim) { "passes", 2, 60, 1 };
        }
      if (s)
        g_string_append (desc, BW_ ("; "));
      g_string_append_printf (desc, BW_ ("stage %u: "), s + 1);
      {
        GString *d2 = g_string_new (NULL);
        describe (d2, st->type, dims, nd, FALSE);
        g_string_append (desc, d2->str);
        g_string_free (d2, TRUE);
      }
      for (guint i = 0; i < nd; i++)
        {
          steps[i] = dim_steps (&dims[i]);
          pidx[i] = bw_param_index (st->type, dims[i].param);
        }
      for (;;)
        {
          gboolean valid = TRUE;
          BwCandidate cand;
          for (guint i = 0; i < nd; i++)
            {
              const double v = dims[i].lo + idx[i] * dims[i].step;
              st->values[pidx[i]] = v;
              valid = valid && bw_param_check (&bw_params_of (st->type, NULL)[pidx[i]], v, NULL);
            }
          out->candidates++;
          /* Only the stage rules matter here: the train rules come after the combination. */
          if (valid)
            {
              Ctx sx = *x;
              guint k = 0;
              for (guint i = 0; i < x->n_rules; i++)
                if (x->rules[i].stage)
                  sx.rules[k++] = x->rules[i];
              sx.n_rules = k;
              sx.objective = BW_OBJECTIVE_POWER;
              if (try_candidate (&sx, work, &cand, &out->evaluations))
                {
                  /* The stage's own power (or volume) decides within a bin. */
                  double pw = 0, g = 0, t = 0;
                  BwQuantitySet s0 = { 0 };
                  BwQuantitySet stg[8];
                  BwQuantitySet *sp[8];
                  for (guint i = 0; i < 8; i++)
                    stg[i].present = 0, sp[i] = &stg[i];
                  if (bw_evaluate_unit_case (work, x->plant_share[bin_case] / MAX (1u, work->n_parallel),
                                             &x->water[bin_case], &s0, sp, NULL, NULL))
                    {
                      pw = x->objective == BW_OBJECTIVE_POWER ? stg[s].values[BW_Q_POWER]
                                                              : stg[s].values[BW_Q_VOLUME];
                      g = stg[s].values[BW_Q_G];
                      t = stg[s].values[BW_Q_DETENTION];
                    }
                  if (g > 0 && t > 0)
                    {
                      int bg = (int) floor (log (g / 5.0) / log (100.0 / 5.0) * G_BINS);
                      int bt = (int) floor (log (t / 60.0) / log (60.0) * T_BINS);
                      int b;
                      /* Bin indices, not values: no data is changed. */
                      bg = CLAMP (bg, 0, G_BINS - 1);
                      bt = CLAMP (bt, 0, T_BINS - 1);
                      b = bg * T_BINS + bt;
                      if (!bin_used[b] || pw < bin_obj[b])
                        {
                          bin_used[b] = TRUE;
                          bin_obj[b] = pw;
                          memcpy (bin_vals[b], st->values, sizeof bin_vals[b]);
                        }
                    }
                }
            }
          {
            guint i = 0;
            while (i < nd && ++idx[i] >= steps[i])
              idx[i++] = 0;
            if (i == nd)
              break;
          }
        }
      memcpy (st->values, orig, sizeof orig);
      for (guint b = 0; b < BINS; b++)
        if (bin_used[b])
          memcpy (best_vals[s][n_best[s]++], bin_vals[b], sizeof bin_vals[b]);
      if (n_best[s] == 0)
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                       BW_ ("%s: no setting of stage %u passes the stage criteria in every load case"),
                       work->id, s + 1);
          g_string_free (desc, TRUE);
          return FALSE;
        }
      if (progress && !progress ((double) (s + 1) / (ns + 1), user_data))
        {
          g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, BW_ ("autosize: cancelled"));
          g_string_free (desc, TRUE);
          return FALSE;
        }
    }
  /* Combinations of the per-stage bests, checked against every rule; with many stages each list is
   * thinned (every other bin) until there are at most 20 000 combinations. */
  for (;;)
    {
      double combos = 1;
      guint widest = 0;
      for (guint s = 0; s < ns; s++)
        {
          combos *= n_best[s];
          if (n_best[s] > n_best[widest])
            widest = s;
        }
      if (combos <= 20000 || n_best[widest] <= 1)
        break;
      for (guint b = 0; 2 * b < n_best[widest]; b++)
        memcpy (best_vals[widest][b], best_vals[widest][2 * b], sizeof best_vals[widest][b]);
      n_best[widest] = (n_best[widest] + 1) / 2;
    }
  {
    guint choice[8] = { 0 };
    for (;;)
      {
        BwCandidate cand;
        for (guint s = 0; s < ns; s++)
          memcpy (((BwProcessUnit *) g_ptr_array_index (work->stages, s))->values,
                  best_vals[s][choice[s]], sizeof best_vals[s][0]);
        out->candidates++;
        if (try_candidate (x, work, &cand, &out->evaluations))
          {
            out->passing++;
            keep (out, &cand);
          }
        {
          guint i = 0;
          while (i < ns && ++choice[i] >= n_best[i])
            choice[i++] = 0;
          if (i == ns)
            break;
        }
      }
  }
  out->searched = g_string_free (desc, FALSE);
  return TRUE;
}

gboolean
bw_autosize (const BwProject *p, const char *unit_id, const BwCriteriaSet *set, BwObjective objective,
             BwAutosizeProgress progress, gpointer user_data, BwAutosizeResult *out, GError **error)
{
  Ctx x = { 0 };
  BwProcessUnit *orig;
  g_autoptr (BwProcessUnit) work = NULL;
  GString *desc;
  gboolean ok = FALSE;
  guint par_lo, par_hi = 8;

  g_return_val_if_fail (p != NULL && unit_id != NULL && set != NULL && out != NULL, FALSE);
  memset (out, 0, sizeof *out);
  out->objective = objective;
  if (!bw_project_validate (p, error))
    return FALSE;
  orig = bw_project_find_unit (p, unit_id, NULL);
  if (orig == NULL || bw_process_type_is_stage (orig->type))
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID,
                   BW_ ("unit: '%s' is not a unit of the project%s"), unit_id,
                   orig ? BW_ (" (a stage is sized with its flocculator)") : "");
      return FALSE;
    }
  x.p = p;
  x.orig = orig;
  x.objective = objective;
  bw_unit_element_type (orig, &x.type);
  for (guint i = 0; i < p->cases->len && x.n_cases < G_N_ELEMENTS (x.cases); i++)
    {
      const BwLoadCase *lc = &g_array_index (p->cases, BwLoadCase, i);
      if (!lc->enabled)
        continue;
      x.cases[x.n_cases] = *lc;
      if (!bw_water_properties (p->basis.temperature_K[lc->temp], &x.water[x.n_cases], error))
        return FALSE;
      x.plant_share[x.n_cases] = p->basis.flow_m3_s[lc->flow] / MAX (1u, p->trains->len);
      x.n_cases++;
    }
  compile_rules (&x, set, orig->type == BW_PROCESS_FLOCCULATOR);
  work = bw_process_unit_copy (orig);
  par_lo = MAX (1u, orig->n_standby + 1);
  desc = g_string_new (NULL);

  switch (orig->type)
    {
    case BW_PROCESS_RECTANGULAR_BASIN:
      {
        const Dim d[] = { { "width", 2.0, 20.0, 0.5 }, { "length", 10.0, 150.0, 2.0 },
                          { "side-water-depth", 3.0, 5.5, 0.25 } };
        describe (desc, orig->type, d, G_N_ELEMENTS (d), TRUE);
        ok = grid_search (&x, work, d, G_N_ELEMENTS (d), par_lo, par_hi, progress, user_data, out, error);
        break;
      }
    case BW_PROCESS_CIRCULAR_CLARIFIER:
      {
        const Dim d[] = { { "diameter", 6.0, 60.0, 1.0 }, { "side-water-depth", 3.0, 5.5, 0.25 } };
        describe (desc, orig->type, d, G_N_ELEMENTS (d), TRUE);
        ok = grid_search (&x, work, d, G_N_ELEMENTS (d), par_lo, par_hi, progress, user_data, out, error);
        break;
      }
    case BW_PROCESS_PLATE_SETTLER:
      {
        const Dim d[] = { { "angle", 45 * G_PI / 180, 60 * G_PI / 180, 5 * G_PI / 180 },
                          { "spacing", 0.025, 0.10, 0.005 }, { "length", 0.6, 2.4, 0.1 },
                          { "count", 50, 3000, 50 } };
        describe (desc, orig->type, d, G_N_ELEMENTS (d), FALSE);
        ok = grid_search (&x, work, d, G_N_ELEMENTS (d), orig->n_parallel, orig->n_parallel, progress,
                          user_data, out, error);
        break;
      }
    case BW_PROCESS_RAPID_MIX:
      {
        const Dim d[] = { { "width", 0.5, 3.0, 0.1 }, { "impeller-diameter", 0.1, 1.5, 0.05 },
                          { "speed", 20.0 / 60, 400.0 / 60, 5.0 / 60 } };
        describe (desc, orig->type, d, G_N_ELEMENTS (d), FALSE);
        g_string_append_printf (desc, BW_ (", with the impeller %g to %g times the tank width"),
                                RAPID_MIX_DT_MIN, RAPID_MIX_DT_MAX);
        ok = grid_search (&x, work, d, G_N_ELEMENTS (d), orig->n_parallel, orig->n_parallel, progress,
                          user_data, out, error);
        break;
      }
    case BW_PROCESS_INLINE_MIXER:
      {
        const Dim d[] = { { "headloss", 0.05, 2.0, 0.01 }, { "volume", 0.05, 5.0, 0.05 } };
        describe (desc, orig->type, d, G_N_ELEMENTS (d), FALSE);
        ok = grid_search (&x, work, d, G_N_ELEMENTS (d), orig->n_parallel, orig->n_parallel, progress,
                          user_data, out, error);
        break;
      }
    case BW_PROCESS_FLOCCULATOR:
      g_string_free (desc, TRUE);
      desc = NULL;
      ok = search_flocculator (&x, work, progress, user_data, out, error);
      break;
    default:
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, BW_ ("unit: cannot size a %s"),
                   BW_ (bw_process_type_label (orig->type)));
      break;
    }
  if (desc)
    out->searched = g_string_free (desc, FALSE);
  if (ok && out->n_best == 0)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_OUT_OF_RANGE,
                   BW_ ("%s: no design in the searched space (%s) passes every required criterion"),
                   unit_id, out->searched ? out->searched : "");
      ok = FALSE;
    }
  return ok;
}

gboolean
bw_autosize_apply (BwProject *p, const char *unit_id, const BwCandidate *c, GError **error)
{
  BwProcessUnit *u = bw_project_find_unit (p, unit_id, NULL);

  if (u == NULL)
    {
      g_set_error (error, BW_ENGINE_ERROR, BW_ENGINE_ERROR_INVALID, BW_ ("unit: no '%s' in the project"), unit_id);
      return FALSE;
    }
  u->n_parallel = c->n_parallel;
  memcpy (u->values, c->values, sizeof u->values);
  for (guint i = 0; i < c->n_stages && i < u->stages->len; i++)
    memcpy (((BwProcessUnit *) g_ptr_array_index (u->stages, i))->values, c->stage_values[i],
            sizeof c->stage_values[i]);
  return TRUE;
}
