/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-labels.c: the engine's readable labels in the reader's language. The engine marks its table
 * strings with N_() and NC_() for the template and stays locale-free; the translating happens
 * here, at the edge where a person reads them. */
#include "config.h"

#include "draw/bw-labels.h"

#include <glib/gi18n-lib.h>
#include <locale.h>
#include <math.h>
#include <string.h>

const char *
bw_label_text (const char *label)
{
  return label && *label ? g_dgettext (GETTEXT_PACKAGE, label) : "";
}

const char *
bw_label_process_type (BwProcessType type)
{
  return bw_label_text (bw_process_type_label (type));
}

const char *
bw_label_choice (const BwParamSpec *spec, int index)
{
  const char *name;

  g_return_val_if_fail (spec != NULL, "");
  name = bw_param_choice_name (spec, index);
  return name ? g_dpgettext2 (GETTEXT_PACKAGE, "choice", name) : "";
}

const char *
bw_label_check_status (BwCheckStatus status)
{
  return g_dpgettext2 (GETTEXT_PACKAGE, "check", bw_check_status_name (status));
}

const char *
bw_label_flow_kind (BwFlowKind kind)
{
  return g_dpgettext2 (GETTEXT_PACKAGE, "flow", bw_flow_kind_label (kind));
}

const char *
bw_label_temp_kind (BwTempKind kind)
{
  switch (kind)
    {
    /* TRANSLATORS: the design temperature of a load case: the coldest water of the year. */
    case BW_TEMP_COLDEST: return C_("temperature", "coldest");
    /* TRANSLATORS: the design temperature of a load case: the warmest water of the year. */
    case BW_TEMP_WARMEST: return C_("temperature", "warmest");
    default: return bw_temp_kind_name (kind);
    }
}

const char *
bw_label_service_state (BwServiceState state)
{
  /* TRANSLATORS: a load case with the standby units out of service. */
  return state == BW_SERVICE_FIRM ? _("firm capacity") : _("all in service");
}

char *
bw_label_load_case (const BwLoadCase *c)
{
  g_return_val_if_fail (c != NULL, g_strdup (""));
  /* TRANSLATORS: a load case: flow, design temperature, service state ("maximum day, coldest,
   * firm capacity"). */
  return g_strdup_printf (_("%s, %s, %s"), bw_label_flow_kind (c->flow),
                          bw_label_temp_kind (c->temp), bw_label_service_state (c->service));
}

const char *
bw_label_decimal_point (void)
{
  const struct lconv *lc = localeconv ();

  return lc && lc->decimal_point && lc->decimal_point[0] ? lc->decimal_point : ".";
}

char *
bw_label_number (const char *text)
{
  const char *dp = bw_label_decimal_point ();
  GString *s;

  g_return_val_if_fail (text != NULL, NULL);
  if (strcmp (dp, ".") == 0)
    return g_strdup (text);
  s = g_string_sized_new (strlen (text) + 4);
  for (const char *p = text; *p; p++)
    {
      if (*p == '.' && p > text && g_ascii_isdigit (p[-1]) && g_ascii_isdigit (p[1]))
        g_string_append (s, dp);
      else
        g_string_append_c (s, *p);
    }
  return g_string_free (s, FALSE);
}

char *
bw_label_quantity (double value_si, BwQuantityKind kind, BwUnitSystem system)
{
  g_autofree char *c = bw_units_format (value_si, kind, system);

  return bw_label_number (c);
}

char *
bw_label_relative_change (double rel)
{
  g_autofree char *t = NULL;

  if (fabs (rel * 100) < 0.05)
    return bw_label_number ("0.0 %");
  t = g_strdup_printf ("%+.1f %%", rel * 100);
  return bw_label_number (t);
}

const char *
bw_label_coagulant (BwCoagulantKind kind)
{
  static const char *const labels[] = {
    [BW_COAGULANT_ALUM] = N_("alum, Al₂(SO₄)₃·nH₂O"),
    [BW_COAGULANT_FERRIC_CHLORIDE] = N_("ferric chloride, FeCl₃"),
    [BW_COAGULANT_FERRIC_SULFATE] = N_("ferric sulfate, Fe₂(SO₄)₃"),
    [BW_COAGULANT_PACL] = N_("polyaluminium chloride (PACl)"),
    [BW_COAGULANT_USER] = N_("user-defined coagulant"),
  };

  if ((guint) kind >= G_N_ELEMENTS (labels) || labels[kind] == NULL)
    return bw_coagulant_kind_name (kind);
  return _(labels[kind]);
}
