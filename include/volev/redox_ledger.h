/* redox_ledger.h: the redox ledger in oxygen equivalents (docs/model.md section 1).
 *
 * Every atom carries a redox weight relative to H2O, CO2 and N2 as the neutral
 * reference, in moles of O-equivalent: H -1/2, O +1, C -2, N 0, and D 0 (deuterium is a
 * tracer on top of masses whose hydrogen already counts all of it: weighting it again
 * would count its hydrogen twice). So H2O, CO2, N2 and carbonate weigh 0, H2 -1 per
 * molecule, O2 +2, the oxygen of oxidised rock +1. The weights are linear in the
 * elements, so the redox content summed over all reservoirs is conserved exactly
 * whenever every element is: every process conserves it by construction.
 *
 * The reservoirs fall into three pools: the surface (air and ocean), space, and rock
 * (crust, mantle and the impactors' undelivered volatiles). The surface's content is
 * its free oxidant (positive) or reductant (negative), in kg of O-equivalent. */
#ifndef VOLEV_REDOX_LEDGER_H
#define VOLEV_REDOX_LEDGER_H

#include "volev/process.h"
#include "volev/reservoir.h"

enum vl_redox_pool { VL_POOL_SURFACE, VL_POOL_SPACE, VL_POOL_ROCK, VL_NPOOLS };

/* Redox weight of one atom of element el, mol O-equivalent. */
double vl_redox_element_weight(int el);
/* Redox weight of one formula unit of species s, mol O-equivalent. */
double vl_redox_species_weight(int s);
/* Redox content per kg of reservoir r, kg O-equivalent per kg. */
double vl_redox_weight_kg(int r);
/* The pool of reservoir r (enum vl_redox_pool); -1 for an index that is no reservoir. */
int vl_redox_pool(int r);
const char *vl_redox_pool_name(int pool);

/* The ledger of one state: each pool's redox content, and the gross scale of its round-off,
 * the sum over every reservoir of |content| (pools whose reservoirs cancel, e.g. escaped
 * carbon against escaped oxygen, hold little but carry the round-off of large terms). */
typedef struct vl_redox_state {
    double pool[VL_NPOOLS];    /* kg O-equivalent */
    double gross;              /* sum over reservoirs of |weight x mass|, kg O-equivalent */
} vl_redox_state;

/* The ledger of state y (VL_NRES masses). */
void vl_redox_pools(const double *y, vl_redox_state *out);
/* The surface's rate of change of redox content for the tendencies dydt (VL_NRES),
 * kg O-equivalent/s: positive when the surface gains oxidant. */
double vl_redox_surface_rate(const double *dydt);
/* 1 if a transfer or reaction p declares changes the surface's redox content by a
 * nonzero amount per unit of mass moved (it may then be an oxidant source or sink of
 * the surface), 0 otherwise. */
int vl_redox_touches_surface(const vl_process *p);

/* |x| over the gross scale of the two states (start->gross + end->gross), or |x| when
 * that is 0 (then every reservoir weighs 0 at both ends). */
double vl_redox_relative(double x, const vl_redox_state *start, const vl_redox_state *end);
/* The closure of the ledger between two states: |sum of the pools' changes|, relative
 * (vl_redox_relative); round-off only when every element is conserved. */
double vl_redox_residual(const vl_redox_state *start, const vl_redox_state *end);

#endif
