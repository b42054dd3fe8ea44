/* SPDX-License-Identifier: GPL-3.0-or-later */
/* bw-labels.h: the engine's readable labels (marked N_() there, kept English) in the reader's
 * language, for the workbench and the report pages. Ids, file keywords and CLI output never go
 * through these. */
#pragma once

#include <glib.h>

#include "engine/bw-chemistry.h"
#include "engine/bw-criteria.h"
#include "engine/bw-params.h"
#include "engine/bw-project.h"
#include "engine/bw-quantity.h"
#include "engine/bw-units.h"

G_BEGIN_DECLS

/* A label from one of the engine's tables (parameter label or help, quantity label, element
 * label), translated. Borrowed: the catalogue's string, or LABEL itself. */
const char *bw_label_text (const char *label);
/* The readable label of TYPE ("rapid-mix tank"), translated. */
const char *bw_label_process_type (BwProcessType type);
/* Choice INDEX of SPEC as a person reads it; the file keyword itself is not changed. */
const char *bw_label_choice (const BwParamSpec *spec, int index);
/* "pass", "warn", "fail", "n/a", translated (context "check"). */
const char *bw_label_check_status (BwCheckStatus status);
const char *bw_label_flow_kind (BwFlowKind kind);
const char *bw_label_temp_kind (BwTempKind kind);
/* "all in service" or "firm capacity", translated. */
const char *bw_label_service_state (BwServiceState state);
/* "maximum day, coldest, firm capacity", composed in the reader's language. A new string. */
char *bw_label_load_case (const BwLoadCase *c);

/* "alum, Al₂(SO₄)₃·nH₂O", "ferric chloride, FeCl₃", ...: a coagulant product, translated.
 * Borrowed. */
const char *bw_label_coagulant (BwCoagulantKind kind);

/* The decimal separator of the current LC_NUMERIC locale ("." in C, "," in es_ES). Borrowed. */
const char *bw_label_decimal_point (void);
/* TEXT as the engine formats numbers (a '.' decimal point) with every '.' that sits between two
 * digits replaced by the locale's separator, for reading: "1.5 m" is "1,5 m" in es_ES. The CLI
 * runs with LC_NUMERIC "C", so its drawings keep the point. A new string. */
char *bw_label_number (const char *text);
/* bw_units_format of VALUE_SI in SYSTEM, with the locale's separator as above. A new string. */
char *bw_label_quantity (double value_si, BwQuantityKind kind, BwUnitSystem system);
/* A relative difference REL (0.05 = 5 %) as a signed percentage to 0.1 %, "+4.8 %", with the
 * locale's separator; one that rounds to zero is written unsigned, "0.0 %". A new string. */
char *bw_label_relative_change (double rel);

G_END_DECLS
