/* invariants.h: the physical-invariant guard of a history (docs/hardening.md, "Physical
 * invariants") and the conservation figures of what the files hold. The integrator
 * checks every accepted step and every output row; a state that breaks an invariant
 * stops the run (VL_ERR_NUMERIC, exit 4) with a message that starts "physical invariant
 * broken at age ... yr:" and names the invariant, so no file is written from it:
 *
 *   - every state component, tendency, flux column, the surface temperature and the
 *     surface pressure are finite;
 *   - the surface temperature is above 0 K, the surface pressure not negative (an
 *     airless planet has 0);
 *   - no reservoir dips below zero by more than VL_DIP_TOLERANCES of its tolerance,
 *     abs_tol_r + rel_tol x the largest mass it has held so far in the run;
 *   - no element's residual (vl_residual) on the state as integrated exceeds
 *     VL_RESIDUAL_LIMIT.
 *
 * The state as written (series.csv, summary.csv) is vl_written_state of the integrated
 * one: each dip set to 0 and the mass of each element this adds taken back from the
 * reservoirs that hold that element alone, in proportion to their content -- a change of
 * the size of the dips, which the dip bound limits, that keeps every element's total.
 * summary.csv's residuals are those of the final state as written, so they equal the
 * integrated ones unless no such reservoir could give the dip back (docs/hardening.md,
 * "Physical invariants").
 */
#ifndef VOLEV_INVARIANTS_H
#define VOLEV_INVARIANTS_H

#include <stddef.h>

#include "volev/env.h"
#include "volev/reservoir.h"
#include "volev/scenario.h"
#include "volev/status.h"

/* A dip below zero deeper than this many tolerances stops the run. CVODE keeps the
 * weighted root-mean-square of its local error below 1, so one component's local error
 * stays below sqrt(n) (5 for the 25 components) times its tolerance; a thousand leaves
 * room for accumulation over a run's steps and still stops a flux that makes mass from
 * nothing (common practice: a margin of orders of magnitude over the local test). */
#define VL_DIP_TOLERANCES 1000.0
/* Largest conservation residual a run may reach (relative, vl_residual). */
#define VL_RESIDUAL_LIMIT 1e-8
/* The denominator of an element's residual is at least this many times the element's
 * resolution (vl_element_resolution): a residual of VL_RESIDUAL_LIMIT is then an error of
 * one absolute tolerance however little of the element the planet holds (none: 0/0
 * otherwise). 1 / VL_RESIDUAL_LIMIT. */
#define VL_RESOLUTION_SCALE 1e8

/* The integrator's absolute tolerance of reservoir r, kg: run.abs_tolerance_kg scaled by
 * the reservoir's depletion floor over 1e3 kg (stepper.c hands CVODE the same). */
double vl_reservoir_abs_tol(const vl_run_params *rp, int r);
/* The smallest mass of element el the integrator resolves, kg: the largest, over the
 * reservoirs holding el, of its absolute tolerance times el's mass fraction in it. */
double vl_element_resolution(const vl_run_params *rp, int el);
/* Element masses of the state as written: every reservoir's mass with a dip below zero
 * counted as 0 (series.csv and summary.csv print it so). */
/* The state as written (w, VL_NSTATE): y with every reservoir below zero set to 0 and
 * the elements that adds taken back, in proportion, from the reservoirs holding each
 * element alone (see above). */
void vl_written_state(const double *y, double *w);
void vl_written_totals(const double *y, double out[VL_NELEMENTS]);
/* The conservation residual of element el between element masses t0 and t1 (kg):
 * |t1 - t0| / max(t0, VL_RESOLUTION_SCALE x vl_element_resolution). */
double vl_residual(const vl_run_params *rp, int el, double t0, double t1);

/* What the guard keeps over one run. */
typedef struct vl_guard {
    vl_run_params rp;
    double held[VL_NRES];          /* largest mass each reservoir has held, kg */
    double raw0[VL_NELEMENTS];     /* element masses at the start, as integrated */
    double written0[VL_NELEMENTS]; /* ... and as written */
    double row_dip_tol;            /* deepest dip below zero in an output row, in units of
                                      the reservoir's tolerance (0: none) */
} vl_guard;

/* Start the guard at the initial state y0. */
void vl_guard_init(vl_guard *g, const vl_run_params *rp, const double *y0);
/* The tolerance of a dip of reservoir r now: abs_tol_r + rel_tol x held_r. */
double vl_guard_dip_tolerance(const vl_guard *g, int r);
/* An accepted step's state (VL_NSTATE components) at age t_s: finite, dips within
 * bounds, residuals as integrated within the limit. VL_OK or VL_ERR_NUMERIC with the message in st. */
int vl_guard_state(vl_guard *g, double t_s, const double *y, vl_status *st);
/* An output row: the state checks of vl_guard_state, and the tendencies (VL_NSTATE),
 * the ncols flux columns (named col_names), the surface temperature and pressure; the
 * row's dips count towards row_dip_tol. */
int vl_guard_row(vl_guard *g, double t_s, const double *y, const double *dydt,
                 const vl_env *env, const double *cols, const char *const *col_names,
                 size_t ncols, vl_status *st);

#endif
