/* sweep_internal.h: what the files of the sweep module share (not installed;
 * src/ensembles/ only). The module (sweep.h) is split by concern:
 *   sweep.c          vl_sweep_load / vl_sweep_free: the set-up of the members (design
 *                    or catalogue), the sample ages, the sweep hash
 *   sweep_check.c    what the sweep group's settings mean (the loader has read them:
 *                    sweep_spec.h), and the probes of axis keys and candidates
 *   sweep_member.c   the overrides of member i and running one member
 *   sweep_outcome.c  outcome names, a member's outcomes from its run, outcome classes
 *   sweep_format.c   members.csv header and rows, the journal line and its parser */
#ifndef VOLEV_SWEEP_INTERNAL_H
#define VOLEV_SWEEP_INTERNAL_H

#include <stddef.h>

#include "volev/integrate.h"
#include "volev/model.h"
#include "volev/scenario.h"
#include "volev/sweep.h"
#include "volev/sweep_spec.h"

/* What a member's run reported through the sink (sweep_member.c). */
typedef struct vl_sweep_trace {
    const vl_model *m;
    double *t, *w, *o;         /* row ages (s), water (TO), O2 (bar) */
    size_t n, cap;
    double first[VL_NREGIMES]; /* age of first entry into each regime, s (NaN: never) */
    double ocean_lost;         /* first ocean_lost, s (NaN: never) */
    int end_regime;            /* regime at the end, -1 if unknown */
} vl_sweep_trace;

/* ---- sweep_check.c */

/* Fills sw's settings from spec (the sweep group of the scenario file sw->sweep_path as
 * the loader read it) after checking what they mean together: a design or a catalogue,
 * the settings each design takes, what each axis needs (vl_axis_check), no axis twice,
 * the sensitivity outcomes. Messages name the file and the setting's line. */
int vl_sweep_check_spec(vl_sweep *sw, const vl_sweep_spec *spec, vl_status *st);
/* Every candidate of the catalogue loads onto the base scenario (errors at the
 * catalogue's line). */
int vl_sweep_check_candidates(const vl_sweep *sw, vl_status *st);
/* Every axis key takes its typical value on the base scenario (errors at the axis). */
int vl_sweep_check_axes(const vl_sweep *sw, vl_status *st);

/* ---- sweep_outcome.c */

/* The outcomes of member res from its finished run (model m of scenario sc, run
 * statistics s, what the sink caught): fills res->out, res->regime and res->steps; fails
 * st with VL_ERR_NUMERIC if a defined outcome is not finite. */
int vl_sweep_outcomes(const vl_model *m, const vl_scenario *sc, const vl_run_stats *s,
                      const vl_sweep_trace *tr, vl_member *res, vl_status *st);
/* The outcome class of res (enum vl_outcome_class), in the documented precedence. */
int vl_sweep_classify(const vl_sweep *sw, const vl_member *res);

#endif
