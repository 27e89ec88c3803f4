/* params.h: declarative parameter tables. One table row per scenario key drives
 * loading, bounds checking, defaults, `volev validate`, `volev processes`, the
 * resolved scenario writer and the generated parameter reference in docs/. */
#ifndef VOLEV_PARAMS_H
#define VOLEV_PARAMS_H

#include <stddef.h>

enum vl_ptype {
    VL_PT_REAL,   /* stored as double, in SI after multiplying by to_si */
    VL_PT_INT,    /* stored as long; whole number in the file */
    VL_PT_BOOL,   /* stored as int 0/1 */
    VL_PT_CHOICE, /* stored as int: index into choices */
    VL_PT_PATH    /* stored as char[VL_PATH_MAX]; relative paths resolve against the scenario's folder */
};

typedef struct vl_param {
    const char *key;     /* dotted path; in a process table relative to "processes.<name>." */
    int type;            /* enum vl_ptype */
    const char *unit;    /* unit as written in the file ("" dimensionless) */
    double to_si;        /* file value * to_si = stored SI value (REAL only; 1 otherwise) */
    double def;          /* default in file units (REAL, INT, BOOL, CHOICE index) */
    double lo, hi;       /* inclusive bounds in file units (REAL, INT) */
    const char *choices; /* CHOICE: names separated by '|', e.g. "a|b|c" */
    const char *def_str; /* PATH: default ("" = unset) */
    size_t offset;       /* byte offset of the stored value in its block */
    const char *doc;     /* one line: what it means */
    const char *ref;     /* reference for the default, or "common practice" / "from memory" / "invented (demo)" */
    const char *needs;   /* NULL, or "other.key=choice": the key is only meaningful then; setting it otherwise is an error */
    int required;        /* 1: the file must set it (no default) */
} vl_param;

/* A row of a parameter table whose values live in the struct `block` (a process's
 * parameter struct): the one place that knows the vl_param layout. */
#define VL_PARAM_ROW(block, ptype, key, unit, to_si, def, lo, hi, field, doc, ref, needs)  \
    {key, ptype, unit, to_si, def, lo, hi, NULL, NULL, offsetof(block, field), doc, ref, needs, 0}

/* Where a resolved value came from. */
/* VL_FROM_MASS: a star's luminosity or effective temperature derived from its mass
 * (src/input/scenario_star.c); not given, so never "unused". */
enum vl_origin { VL_FROM_DEFAULT = 0, VL_FROM_FILE = 1, VL_FROM_OVERRIDE = 2, VL_FROM_MASS = 3 };

/* Choice helpers: index of name in a '|' list or -1; name of index i (static buffer-free). */
int vl_choice_index(const char *choices, const char *name);
/* Copy choice i of choices into buf (size n); returns buf. */
char *vl_choice_name(const char *choices, int i, char *buf, size_t n);

/* Edit distance, for "did you mean" suggestions. */
size_t vl_edit_distance(const char *a, const char *b);

#endif
