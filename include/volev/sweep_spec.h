/* sweep_spec.h: a scenario's top-level `sweep` group as the scenario loader reads it
 * (docs/ensembles.md): plain data, held by the scenario (vl_scenario.sweep).
 *
 * The loader (src/input/sweep_spec.c) reads the group with the machinery of every other
 * input: the pre-scan, the same libconfig parse, values checked for their type, bounds
 * and choice names, unknown settings refused with a suggestion, messages at the file and
 * line. A setting not written keeps its default (at[] says which were written). What
 * the settings mean together -- which design takes which setting, what each axis needs,
 * that the axis keys exist -- is checked by the sweep (vl_sweep_load, sweep.h). */
#ifndef VOLEV_SWEEP_SPEC_H
#define VOLEV_SWEEP_SPEC_H

#include <stddef.h>

#include "volev/status.h"

/* Settings of the group, in the order of docs/ensembles.md (index of at[]). */
enum vl_spec_key {
    VL_SPEC_DESIGN, VL_SPEC_MEMBERS, VL_SPEC_SEED, VL_SPEC_AXES, VL_SPEC_CATALOGUE,
    VL_SPEC_WATER_TO, VL_SPEC_SENSITIVITY, VL_SPEC_BOOTSTRAP, VL_SPEC_CONFIDENCE,
    VL_SPEC_O2_RICH_BAR, VL_SPEC_NKEYS
};
/* Settings of one axis group (index of the axis's at[]). */
enum vl_spec_axis_key {
    VL_SPEC_AX_KEY, VL_SPEC_AX_SPACING, VL_SPEC_AX_FROM, VL_SPEC_AX_TO, VL_SPEC_AX_POINTS,
    VL_SPEC_AX_DISTRIBUTION, VL_SPEC_AX_LOW, VL_SPEC_AX_HIGH, VL_SPEC_AX_MEAN, VL_SPEC_AX_SD,
    VL_SPEC_AX_NKEYS
};

/* Name of setting k in the file ("design", ...; "" out of range). */
const char *vl_sweep_spec_name(int k);
/* Name of axis setting k ("key", "spacing", ...; "" out of range). */
const char *vl_sweep_spec_axis_name(int k);

#define VL_SWEEP_AXES_MAX 40     /* axes (the Sobol generator's dimension limit) */
#define VL_SWEEP_WATERS_MAX 64   /* initial water amounts */
#define VL_SWEEP_SENS_MAX 16     /* names in the sensitivity list */
#define VL_SWEEP_NAME_MAX 64     /* bytes of an outcome name, NUL included */
#define VL_SWEEP_KEY_MAX 128     /* bytes of an axis key, NUL included (= vl_axis.key) */

typedef struct vl_sweep_axis_spec {
    int line;                   /* line of the axis group */
    int at[VL_SPEC_AX_NKEYS];   /* line of each setting; 0: not written */
    char key[VL_SWEEP_KEY_MAX]; /* the scenario key it varies, as written (not empty) */
    int spacing;                /* enum vl_spacing (design.h) */
    double from, to;            /* finite */
    long points;                /* 1 .. VL_DESIGN_MEMBERS_MAX */
    int dist;                   /* enum vl_dist */
    double low, high, mean, sd; /* finite */
} vl_sweep_axis_spec;

typedef struct vl_sweep_spec {
    int line;                   /* line of the group */
    int at[VL_SPEC_NKEYS];      /* line of each setting; 0: not written (default kept) */
    int design;                 /* enum vl_design_kind (design.h) */
    long members;               /* 1 .. VL_DESIGN_MEMBERS_MAX */
    long seed;                  /* 0 .. 4294967295; default 1 */
    vl_sweep_axis_spec axes[VL_SWEEP_AXES_MAX];
    size_t naxes;               /* axes written (0 for an empty list) */
    char catalogue[VL_PATH_MAX];/* CSV of candidates, made absolute against the scenario's
                                   folder (the current folder for vl_scenario_parse) */
    double water_to[VL_SWEEP_WATERS_MAX]; /* initial water amounts, TO: finite, >= 0 */
    size_t nwater;              /* 1 .. VL_SWEEP_WATERS_MAX when written */
    char sensitivity[VL_SWEEP_SENS_MAX][VL_SWEEP_NAME_MAX]; /* outcome names, as written */
    size_t nsens;               /* 1 .. VL_SWEEP_SENS_MAX when written */
    long bootstrap;             /* 0 .. 100000; default 200 */
    double confidence;          /* [0, 1]; default 0.95 (the sweep wants 0 < c < 1) */
    double o2_rich_bar;         /* >= 0, bar; default 0.1 (the sweep wants > 0) */
} vl_sweep_spec;

#endif
