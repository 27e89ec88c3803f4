/* climate_table.h: the column climate's table (climate_table.c), private to
 * src/physics. A table holds the column points (column.h) of one parameter set on a
 * grid of surface temperature and of the four gas amounts that enter the column (water
 * inventory, CO2, the N2-like background, H2, each as the pressure the gas would exert
 * alone), computed lazily, point by point, when a run first needs them. Tables are
 * shared: every model with the same parameter set (the members of a sweep, on any
 * thread) uses one table, so that a point is computed once per process. */
#ifndef VOLEV_CLIMATE_TABLE_H
#define VOLEV_CLIMATE_TABLE_H

#include <stdint.h>

#include "volev/column.h"

/* Surface temperature grid: 150-400 K in 5 K steps, to 1000 K in 20 K, to 3000 K in
 * 50 K steps. */
#define VL_CT_NT 121
double vl_ct_grid_t(int j);
/* Fractional grid index of t, clamped to the grid. */
double vl_ct_grid_index(double t_k);

/* Pressure grids (log10 Pa, 3 per decade): water inventory 1e-1..1e10 Pa, CO2 and the
 * background 1e-3..1e9 Pa; H2: 0, then 1e1..1e9 Pa at 2 per decade. */
enum { VL_CT_WATER, VL_CT_CO2, VL_CT_BG, VL_CT_H2, VL_CT_NDIM };
extern const int vl_ct_size[VL_CT_NDIM];
/* Pressure (Pa) of grid index i along dimension d. */
double vl_ct_grid_p(int d, int i);
/* The two grid indices around p along d and the weight of the upper one (continuous in
 * p, linear in log p, linear in p between H2's 0 and its first point). */
void vl_ct_bracket(int d, double p_pa, int *lo, double *w_hi);

typedef struct vl_ctable vl_ctable;
typedef struct vl_ct_node vl_ct_node;

/* The shared table of opts (made, or found among the live ones). NULL when out of
 * memory. Release with vl_ctable_release. */
vl_ctable *vl_ctable_get(const vl_column_opts *opts);
void vl_ctable_release(vl_ctable *t);

/* A run's lookaside of node pointers (lock-free hits). */
#define VL_CT_LOOKASIDE 64
typedef struct vl_ct_lookaside {
    int key[VL_CT_LOOKASIDE][VL_CT_NDIM];
    vl_ct_node *node[VL_CT_LOOKASIDE];
    long points;               /* points this run computed */
    double build_s;            /* wall time spent on them */
} vl_ct_lookaside;

/* The point at node idx and temperature index j (computed now if needed); NULL when
 * out of memory. */
const vl_column_point *vl_ctable_point(vl_ctable *t, vl_ct_lookaside *la,
                                       const int idx[VL_CT_NDIM], int j);

/* A 64-bit hash of everything that enters the table (for caches kept on disk). */
uint64_t vl_ctable_key(const vl_ctable *t);

#endif
