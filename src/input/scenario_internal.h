/* scenario_internal.h: what the files of the scenario loader share (not installed;
 * src/input/ only). The loader is one module in several files:
 *   scenario.c           life cycle: defaults, load, parse, free
 *   scenario_index.c     the global parameter index by full key, suggestions, messages
 *   scenario_value.c     typed values: one libconfig setting read and stored with its
 *                        type, bounds and choices (every input of a scenario file)
 *   scenario_prescan.c   the lexical pre-scan of the text before libconfig parses it
 *   scenario_names.c     what the pre-scan sees of the structure: groups, lists and
 *                        arrays open, setting names (full keys, repeats) and the limits
 *   scenario_read.c      the file walk: text -> libconfig -> settings -> rows
 *   sweep_spec.c         the top-level `sweep` group -> vl_sweep_spec
 *   scenario_override.c  --set KEY=VALUE
 *   scenario_star.c      a star's luminosity and Teff from its mass where not given
 *   scenario_advice.c    warnings for a scenario that is probably not meant
 *   scenario_check.c     table sanity and the cross-checks (required, needs, consistency)
 *   scenario_write.c     the resolved-scenario writer and the `validate` listing */
#ifndef VOLEV_SCENARIO_INTERNAL_H
#define VOLEV_SCENARIO_INTERNAL_H

#include <libconfig.h>
#include <stddef.h>

#include "volev/params.h"
#include "volev/scenario.h"
#include "volev/status.h"

#define VL_SCENARIO_KEY_MAX 512

/* Where a value came from, for messages: a line of the scenario file, or a --set. */
typedef struct vl_where {
    const char *file;    /* scenario file; NULL for an override */
    int line;            /* 0 if unknown */
    const char *set_key; /* override: the key as typed (messages begin "--set KEY: ") */
} vl_where;

/* Where one typed value goes: its table row, its storage (double, long, int or
 * char[VL_PATH_MAX] after the row's type), its full key for messages and, for a REAL
 * row of the scenario, where the value in file units is kept (NULL otherwise). */
typedef struct vl_slot {
    const vl_param *p;
    void *at;
    const char *key;
    double *file_value;
} vl_slot;

/* What the file walk needs besides the scenario. */
typedef struct vl_loader {
    vl_scenario *sc;
    vl_status *st;
    const char *path;       /* the scenario file, as given (or the label of a text) */
    char dir[VL_PATH_MAX];  /* its folder, absolute: relative paths resolve against it */
} vl_loader;

/* ---- scenario_index.c */

/* Fills st with an input error located at w; returns VL_ERR_INPUT. */
int vl_scenario_fail_at(vl_status *st, const vl_where *w, const char *fmt, ...)
    __attribute__((format(printf, 3, 4)));
/* " " before a row's unit, or "" for a dimensionless row; the unit or "". */
const char *vl_scenario_unit_sep(const vl_param *p);
const char *vl_scenario_unit(const vl_param *p);
/* The '|' list as "a, b or c" (joiner "or") or "a, b, c" (joiner ","). */
void vl_scenario_list_text(const char *list, const char *joiner, char *buf, size_t n);
/* The full key of parameter i ("" out of range); the table's largest parameter count. */
const char *vl_scenario_key(size_t i);
#define VL_SCENARIO_CACHE_MAX 2048
#define VL_SCENARIO_CACHE_KEY 128
/* Row i, its full key copied into key. */
const vl_param *vl_scenario_param_key(size_t i, char *key, size_t n);
/* Address of row i's stored value in sc; *pp receives the row. */
void *vl_scenario_slot(const vl_scenario *sc, size_t i, const vl_param **pp);
/* The slot of row i of sc (for the typed readers of scenario_value.c). */
vl_slot vl_scenario_row_slot(vl_scenario *sc, size_t i);
/* Global index of the row whose full key is key, or -1. */
long vl_scenario_find_key(const char *key);
/* 1 if path is a group: the full key of some row continues it with a dot. */
int vl_scenario_is_group(const char *path);
/* " (did you mean 'X'?)" for the closest known key (group != 0: group) within
 * max(2, len/4) edits; "" if there is none. */
void vl_scenario_suggest(const char *name, int group, char *out, size_t n);
/* The same among the count settings of one group (the sweep group's): name is
 * "PREFIXNAME", the names are compared without the prefix. */
void vl_scenario_suggest_among(const char *name, const char *prefix, const char *const *names,
                               size_t count, char *out, size_t n);
/* Records where row i's value came from. */
void vl_scenario_mark(vl_scenario *sc, size_t i, int origin, int line);

/* ---- scenario_value.c */

/* Stores a value (given in file units for a real) after its checks: finite and within
 * bounds, a whole number within bounds, one of the choices, a non-empty path made
 * absolute against dir. Messages name t->key and the place w. */
int vl_scenario_assign_real(const vl_slot *t, double v, const vl_where *w, vl_status *st);
int vl_scenario_assign_int(const vl_slot *t, long v, const vl_where *w, vl_status *st);
int vl_scenario_assign_choice(const vl_slot *t, const char *name, const vl_where *w,
                              vl_status *st);
int vl_scenario_assign_path(const vl_slot *t, const char *text, const char *dir,
                            const vl_where *w, vl_status *st);
/* Stores the row's default. */
void vl_scenario_store_default(const vl_slot *t);
/* Reads one libconfig setting (a single value of the row's type) into t. */
int vl_scenario_read_value(const config_setting_t *s, const vl_slot *t, const char *dir,
                           const vl_where *w, vl_status *st);
/* Reads a quoted text of 1 to n - 1 bytes into buf; what names what it must be
 * ("a scenario key"). */
int vl_scenario_read_text(const config_setting_t *s, const char *key, const char *what,
                          char *buf, size_t n, const vl_where *w, vl_status *st);
/* How a libconfig setting type reads in a message ("an integer", "a group" ...). */
const char *vl_scenario_type_word(int type);
/* Joins dir and a relative path (dropping leading "./"); absolute paths are kept.
 * Returns nonzero if the result does not fit in n bytes. */
int vl_scenario_join_path(const char *dir, const char *rel, char *out, size_t n);
/* The current working directory into buf, or an I/O error. */
int vl_scenario_current_dir(char *buf, size_t n, vl_status *st);

/* ---- scenario_names.c */

/* One open group, list or array (or the root) as the pre-scan sees it. */
typedef struct vl_scope {
    char open;        /* '{', '(' or '['; '\0' for the root */
    int line;         /* where it was opened */
    size_t id;        /* unique per scope: a setting name may appear once per scope */
    size_t count;     /* settings (group, root) or elements (list, array) so far */
    size_t key_len;   /* length of its full key in vl_names.key */
} vl_scope;

/* A setting name seen, for the repeat check: its scope, text (in the scanned text) and
 * line. */
typedef struct vl_name_seen {
    size_t scope;
    const char *name;
    size_t len;
    int line;
} vl_name_seen;

/* The structure of a scenario's text as the pre-scan walks it: the scopes open, the full
 * key of the innermost and of the last setting named, the names seen per scope. Every
 * check here is linear in the text (a hash of the names), so a hostile file costs no more
 * than its size before libconfig, whose repeat check is quadratic in a group's size,
 * sees it. */
typedef struct vl_names {
    const char *path;                    /* the scenario, for messages */
    vl_status *st;
    vl_scope scope[VL_SCENARIO_DEPTH_MAX + 1];
    size_t depth;                        /* scopes open besides the root */
    size_t next_id;
    char key[VL_SCENARIO_KEY_MAX];       /* full key of the innermost scope ("" at the root) */
    char setting[VL_SCENARIO_KEY_MAX];   /* full key of the last setting named */
    vl_name_seen *seen;                  /* open-addressing hash; NULL before the first name */
    size_t cap, used;
} vl_names;

void vl_names_init(vl_names *n, const char *path, vl_status *st);
void vl_names_free(vl_names *n);
/* 1 if the innermost scope is a list or an array (its elements have no names). */
int vl_names_in_list(const vl_names *n);
/* A name followed by '=' or ':' in a group or at the root, at line: counted against
 * VL_SCENARIO_GROUP_MAX, refused if its scope has it already (naming both lines) or if
 * its full key is too long; n->setting becomes its full key. */
int vl_names_setting(vl_names *n, const char *name, size_t len, int line);
/* A value starting inside a list or array: counted against VL_SCENARIO_LIST_MAX. */
int vl_names_element(vl_names *n, int line);
/* A bracket opened at line (value: right after a setting's '=' or ':'), refused beyond
 * VL_SCENARIO_DEPTH_MAX; a bracket closed, refused when it closes nothing or another
 * kind. */
int vl_names_open(vl_names *n, char open, int line, int value);
int vl_names_close(vl_names *n, char close, int line);
/* The end of the text: refused while a bracket is open (at the innermost one's line). */
int vl_names_end(vl_names *n);

/* ---- scenario_prescan.c */

/* Refuses len bytes of text holding a NUL or control byte (binary data). */
int vl_scenario_check_bytes(const char *text, size_t len, const char *path, vl_status *st);
/* Lexical pass over len bytes of text for what libconfig would refuse with a vague message
 * or accept but mishandle: an empty text, an unterminated string or comment, a bracket
 * never closed, nesting, group and list sizes beyond the limits, a repeated setting,
 * hexadecimal or underflowing numbers, oversized integers, directives. Returns the text
 * for libconfig, NUL-terminated (a new allocation, with integers beyond 32 bits given the
 * L suffix libconfig needs, and a string literal where the grammar allows none defused),
 * or NULL with st filled. */
char *vl_scenario_prescan(const char *text, size_t len, const char *path, vl_status *st);

/* ---- scenario_read.c */

/* Parses len bytes of scenario text and walks every setting in it; relative paths
 * resolve against dir; messages name sc->path. */
int vl_scenario_read_memory(vl_scenario *sc, const char *text, size_t len, const char *dir,
                            vl_status *st);
/* The file at sc->path, relative paths in it resolved against its folder. */
int vl_scenario_read_file(vl_scenario *sc, vl_status *st);

/* ---- sweep_spec.c */

/* Reads the top-level setting `sweep` (line: its line) into a new sc->sweep. */
int vl_sweep_spec_read(vl_loader *ld, const config_setting_t *g, int line);

/* ---- scenario_check.c */

/* Checks every parameter table once per process (rows well formed, keys unique);
 * a failure is a bug: VL_ERR_INTERNAL. */
int vl_scenario_check_tables(vl_status *st);
/* Every check that needs the complete scenario: required keys, needs clauses,
 * consistency, the process hooks. */
int vl_scenario_cross_check(vl_scenario *sc, vl_status *st);
/* Fills st with an input error about row i, located where its value came from (file
 * line or --set); returns VL_ERR_INPUT. */
int vl_scenario_fail_param(const vl_scenario *sc, size_t i, vl_status *st, const char *fmt, ...)
    __attribute__((format(printf, 4, 5)));
/* Adds a warning to sc->warnings (the CLI prints them); beyond VL_SCENARIO_WARNINGS the
 * last says how many more there were. */
void vl_scenario_warn(vl_scenario *sc, const char *fmt, ...) __attribute__((format(printf, 2, 3)));
/* The state of a CHOICE or BOOL row as written in a file. */
void vl_scenario_state_text(const vl_scenario *sc, size_t i, char *buf, size_t n);
/* 1 if row i has no needs clause or its condition holds in sc; fills the text of the
 * controlling key, its state and the needed values for messages. */
int vl_scenario_needs_hold(const vl_scenario *sc, size_t i, char *other, size_t on,
                           char *state, size_t sn, const char **values);

/* ---- scenario_advice.c */

/* Warnings into sc->warnings for a scenario that loads but is probably not meant: no
 * volatiles in the mantle (not even set to 0) while outgassing is on. */
void vl_scenario_advise(vl_scenario *sc);

/* ---- scenario_star.c */

/* The star's luminosity and effective temperature from its mass where the scenario does
 * not give them at the mass's level or later (file over default, --set or catalogue
 * row over file), marked VL_FROM_MASS; warnings into sc->warnings where given values
 * disagree with the main sequence. An input error when a needed value cannot be
 * derived. */
int vl_scenario_derive_star(vl_scenario *sc, vl_status *st);

#endif
