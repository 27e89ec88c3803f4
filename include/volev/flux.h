/* flux.h: the only way a process changes the state. A process declares its transfers
 * (mass moved between reservoirs of identical element make-up) and reactions (fixed,
 * balanced stoichiometry) in its descriptor (process.h); the model refuses a declaration
 * that does not conserve every element when it is built, and the flux functions take
 * the index of a declared row, so conservation of H, D, C, N, O holds by construction.
 * Outflows are ramped to zero inside each source's floor band (reservoir.h), so masses
 * never go negative and the RHS stays continuous. */
#ifndef VOLEV_FLUX_H
#define VOLEV_FLUX_H

#include <stddef.h>
#include "volev/reservoir.h"

#define VL_REACTION_MAX 6

typedef struct vl_reaction {
    const char *name;          /* e.g. "2 H2O -> 2 H2 + O2" */
    int n;                     /* terms used */
    int res[VL_REACTION_MAX];  /* reservoir of each term */
    double nu[VL_REACTION_MAX];/* stoichiometric coefficient: < 0 consumed, > 0 produced */
} vl_reaction;

/* A transfer: mass moved from one reservoir to another of the same make-up. */
typedef struct vl_transfer {
    int from, to;
} vl_transfer;

/* The flux accumulator of the process being evaluated (filled by the model). */
typedef struct vl_flux {
    const double *y;           /* state, kg (borrowed) */
    double *dydt;              /* this process's tendencies, kg/s (borrowed) */
    double *columns;           /* per-process output columns, kg/s, or NULL (borrowed) */
    size_t col_base;           /* first column of the process being evaluated */
    const vl_transfer *transfers; /* the process's declared transfers (borrowed) */
    size_t ntransfers;
    const vl_reaction *reactions; /* its declared reactions (borrowed) */
    size_t nreactions;
} vl_flux;

/* Depletion ramp of reservoir r at mass m, x = m/band: 1 above the band, x (2 - x) inside
 * it, 2 x below zero (negative for a negative mass, which reverses the flow and restores
 * the reservoir to zero); continuous with its first derivative. The band is the
 * reservoir's floor, or demand x VL_DRAIN_TIME_S for a demand (kg/s) that would empty
 * more than the floor in that time (flux.c says why). */
#define VL_DRAIN_TIME_S 1.0e6
double vl_flux_ramp_for(int r, double m_kg, double demand_kg_s);
/* The same for no demand (band = floor). */
double vl_flux_ramp(int r, double m_kg);

/* Move kg_s (>= 0) along the process's declared transfer k. The applied rate (after the
 * ramp) is added to the process's column col (if col >= 0) and returned. A flow the ramp
 * reverses (the source below zero) is ramped in turn by the destination it now draws
 * on, and never draws on an empty one (flux.c, give_back). */
double vl_flux_transfer(vl_flux *fx, int k, double kg_s, int col);

/* The same, with hydrogen carrying deuterium at f_d times the source's D/H (the
 * fractionation factor of an escape process; vl_flux_transfer uses 1). Deuterium moves
 * between the companions of H-bearing reservoirs (vl_reservoir_deuterium). */
double vl_flux_transfer_f(vl_flux *fx, int k, double kg_s, int col, double f_d);

/* Run the process's declared reaction k at extent rate mol_s (>= 0): reservoir i
 * changes by nu_i * M_i * rate. Ramped by every consumed reservoir; run backwards by a
 * ramp (a consumed reservoir below zero), also by every product it then draws on. Column
 * col gets the mass rate of the first term, kg/s. Returns the applied extent rate, mol/s. */
double vl_flux_react(vl_flux *fx, int k, double mol_s, int col);

/* The same with deuterium fractionation f_d (see vl_flux_transfer_f): deuterium leaves
 * each H-bearing reactant with its hydrogen and is shared among the H-bearing products
 * in proportion to their hydrogen. */
double vl_flux_react_f(vl_flux *fx, int k, double mol_s, int col, double f_d);

/* Add kg_s to the process's column col (when columns are recorded): for a column that
 * reports part of a transfer or reaction, e.g. one element of a reaction's products. */
void vl_flux_add_column(vl_flux *fx, int col, double kg_s);

/* 0 if r balances every element to 1e-12 relative; else nonzero with a reason in why. */
int vl_reaction_check(const vl_reaction *r, char *why, size_t n);
/* 0 if a transfer between the two reservoirs conserves every element. */
int vl_move_check(int from, int to);

/* Element inventory of the state: kg of each element over all reservoirs (incl. space). */
void vl_ledger_totals(const double *y, double out[VL_NELEMENTS]);

#endif
