/* sweep.h: ensembles of one base scenario (docs/ensembles.md).
 *
 * The scenario's top-level `sweep` group (read by the scenario loader into a
 * vl_sweep_spec, sweep_spec.h; its meaning checked here) describes the members: a design over axes (grid, random, Latin hypercube, Sobol,
 * Saltelli) or a catalogue of candidate planets, each optionally at several initial
 * water amounts. Member i is the base scenario plus "KEY=VALUE" overrides, so any member
 * can be rerun alone with `volev run SCENARIO --set KEY=VALUE ...`. Running a member
 * gives its outcomes, its outcome class and its water and O2 histories sampled on a
 * common age grid. Files, threads, ranks and resuming belong to the command line
 * (src/cli/sweep*.c). */
#ifndef VOLEV_SWEEP_H
#define VOLEV_SWEEP_H

#include <stddef.h>

#include "volev/catalogue.h"
#include "volev/design.h"
#include "volev/status.h"

/* Ages at which every member's water and O2 are sampled (log-spaced over the base run). */
#define VL_SWEEP_NT 64

/* Outcomes of a member, in members.csv order. */
enum vl_outcome {
    VL_OUT_WATER,          /* final surface water, TO */
    VL_OUT_WATER_LOST,     /* water lost to space (escaped H as water), TO */
    VL_OUT_O2,             /* O2 left in the atmosphere, bar */
    VL_OUT_CO2,            /* CO2 in the air at the end, bar */
    VL_OUT_TEMP,           /* surface temperature at the end, K */
    VL_OUT_PRESSURE,       /* surface pressure at the end, bar */
    VL_OUT_DH,             /* D/H of the surface water over the initial D/H */
    VL_OUT_RUNAWAY_TIME,   /* time spent in the runaway greenhouse, yr */
    VL_OUT_MOIST_TIME,     /* time spent in the moist greenhouse, yr */
    VL_OUT_DESICCATION,    /* age of the first ocean_lost event, yr (none: NaN) */
    VL_OUT_FIRST_RUNAWAY,  /* age the planet first was in runaway, yr (none: NaN) */
    VL_OUT_FIRST_MOIST,    /* age it first was in the moist greenhouse, yr */
    VL_OUT_FIRST_FREEZE,   /* age it first was frozen, yr */
    VL_OUT_MAGMA_TIME,     /* time with a magma ocean, yr */
    VL_NOUT
};
extern const char *const vl_outcome_name[VL_NOUT];
extern const char *const vl_outcome_unit[VL_NOUT];

/* Outcome classes (docs/ensembles.md), decided in this order of precedence. */
enum vl_outcome_class {
    VL_CLASS_FAILED,       /* the member could not be loaded or integrated */
    VL_CLASS_STEAM,        /* ends in a runaway or moist greenhouse */
    VL_CLASS_O2_RICH,      /* ends with at least sweep.o2_rich_bar of O2 */
    VL_CLASS_DESICCATED,   /* ends dry */
    VL_CLASS_FROZEN,       /* ends frozen */
    VL_CLASS_OCEAN_KEPT,   /* ends temperate with a liquid ocean */
    VL_CLASS_MOLTEN,       /* ends with a magma ocean (checked right after failed) */
    VL_NCLASS
};
extern const char *const vl_class_name[VL_NCLASS];

typedef struct vl_sweep {
    char path[1024];         /* base scenario, as given */
    char sweep_path[1024];   /* file holding the sweep group (the base scenario) */
    int line;                /* line of the sweep group */
    int members_line;        /* line of sweep.members (0 if absent) */
    int catalogue_mode;      /* members from a catalogue instead of a design */
    int design;              /* enum vl_design_kind (design mode) */
    long n;                  /* sweep.members: samples (saltelli: base samples) */
    unsigned long seed;      /* sweep.seed */
    vl_axis *axes;           /* design axes */
    size_t k;
    double *x;               /* members x k design values */
    vl_catalogue *cat;       /* catalogue mode */
    char cat_path[1024];     /* its path, resolved against the scenario folder */
    double *waters;          /* sweep.water_to: initial water amounts per candidate, TO */
    size_t nwaters;          /* 0: the base scenario's / the catalogue's water */
    int sens[VL_NOUT];       /* outcomes for the Sobol indices (saltelli) */
    size_t nsens;
    long bootstrap;          /* bootstrap resamples for the Sobol intervals */
    double confidence;       /* their level */
    double o2_rich_bar;      /* threshold of the o2_rich class */
    long members;            /* total members */
    double t_grid_s[VL_SWEEP_NT]; /* sample ages, s */
    char hash[17];           /* FNV-1a of version, resolved base, sweep settings, catalogue */
} vl_sweep;

/* Loads the scenario at path with its sweep group (vl_scenario_load reads the group),
 * checks what the settings mean (messages with file and line), generates the design or
 * reads the catalogue, and tries every axis key and candidate on the base scenario.
 * The names of designs, spacings and distributions are VL_DESIGN_CHOICES,
 * VL_SPACING_CHOICES and VL_DIST_CHOICES (design.h). NULL on error. */
vl_sweep *vl_sweep_load(const char *path, vl_status *st);
void vl_sweep_free(vl_sweep *sw); /* accepts NULL */

/* The "KEY=VALUE" overrides of member i (0 <= i < members): *out is a malloc'd array of
 * malloc'd strings (free with vl_sweep_free_overrides), *n its length. */
int vl_sweep_overrides(const vl_sweep *sw, long i, char ***out, size_t *n, vl_status *st);
void vl_sweep_free_overrides(char **ov, size_t n);

typedef struct vl_member {
    long index;
    int status;              /* VL_OK, or the error code that stopped the member */
    int regime;              /* final regime (enum vl_regime), -1 if failed */
    int cls;                 /* enum vl_outcome_class */
    long steps;              /* accepted integrator steps */
    double out[VL_NOUT];     /* outcomes (NaN where undefined) */
    double water_to[VL_SWEEP_NT]; /* surface water at the sample ages (NaN outside the run) */
    double o2_bar[VL_SWEEP_NT];   /* O2 at the sample ages */
    char reason[1200];       /* failed: the message, "FILE:LINE: text" */
} vl_member;

/* Runs member i and fills res; never fails as a whole: a member that cannot be loaded
 * or integrated is recorded with its status and reason. */
void vl_sweep_run_member(const vl_sweep *sw, long i, vl_member *res);

/* members.csv: header line and the row of member res (no newline), malloc'd. */
char *vl_sweep_header(const vl_sweep *sw);
char *vl_sweep_row(const vl_sweep *sw, const vl_member *res);

/* Journal line of res (exact: %.17g, ends with '\n') and its inverse (0 on success;
 * -1 if the line is malformed or truncated). */
char *vl_sweep_journal_line(const vl_member *res);
int vl_sweep_journal_parse(const char *line, vl_member *res);

#endif
