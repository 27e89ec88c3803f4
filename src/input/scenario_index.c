/* scenario_index.c: the global parameter index of params.c by full dotted key (cached),
 * "did you mean" suggestions, and the loader's message helpers (scenario_internal.h). */
#include <pthread.h>
#include <stdarg.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "scenario_internal.h"
#include "volev/text.h"

/* ------------------------------------------------------------------ messages */

int vl_scenario_fail_at(vl_status *st, const vl_where *w, const char *fmt, ...)
{
    char msg[VL_MSG_MAX];
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(msg, sizeof msg, fmt, ap);
    va_end(ap);
    if (w->set_key)
        return vl_fail(st, VL_ERR_INPUT, "", 0, "--set %s: %s", w->set_key, msg);
    return vl_fail(st, VL_ERR_INPUT, w->file, w->line, "%s", msg);
}

/* " " when the row has a unit, else "". */
const char *vl_scenario_unit_sep(const vl_param *p) { return p->unit && p->unit[0] ? " " : ""; }

/* The row's unit, or "". */
const char *vl_scenario_unit(const vl_param *p) { return p->unit ? p->unit : ""; }

/* The '|' list as "a, b or c" (joiner "or") or "a, b, c" (joiner ","). */
void vl_scenario_list_text(const char *list, const char *joiner, char *buf, size_t n)
{
    char name[128];
    int count = 0;
    while (vl_choice_name(list, count, name, sizeof name)[0])
        count++;
    buf[0] = '\0';
    for (int i = 0; i < count; i++) {
        size_t len = strlen(buf);
        const char *sep = i == 0 ? "" : (i == count - 1 && joiner[0] != ',') ? " or " : ", ";
        snprintf(buf + len, n - len, "%s%s", sep, vl_choice_name(list, i, name, sizeof name));
    }
}

/* ------------------------------------------------------------------ the index */

/* Full keys of every parameter, built once (the tables are constant): lookups by key
 * run on every load and every resolved-scenario write. by_key lists the rows in the
 * byte order of their keys and groups every group's full name (a proper prefix of some
 * key that ends before a dot) in the same order, so that a lookup is a binary search
 * (O(log n)) rather than a pass over every row. */
static char key_cache[VL_SCENARIO_CACHE_MAX][VL_SCENARIO_CACHE_KEY];
static size_t key_cache_n;
static size_t by_key[VL_SCENARIO_CACHE_MAX];
typedef struct group_name {
    const char *text; /* a key of key_cache ... */
    size_t len;       /* ... cut before the dot at this length */
} group_name;
static group_name *groups; /* NULL if out of memory: then no path is a group */
static size_t ngroups;
static pthread_once_t key_cache_once = PTHREAD_ONCE_INIT;

static int cmp_rows(const void *a, const void *b)
{
    return strcmp(key_cache[*(const size_t *)a], key_cache[*(const size_t *)b]);
}

/* Byte order of two group names (as strcmp on the cut texts). */
static int cmp_groups(const void *a, const void *b)
{
    const group_name *x = a, *y = b;
    size_t m = x->len < y->len ? x->len : y->len;
    int c = memcmp(x->text, y->text, m);
    return c ? c : (x->len > y->len) - (x->len < y->len);
}

/* Every group name of every key into groups[], sorted, without repeats. */
static void build_groups(void)
{
    size_t n = 0;
    for (size_t i = 0; i < key_cache_n; i++)
        for (const char *dot = strchr(key_cache[i], '.'); dot; dot = strchr(dot + 1, '.'))
            n++;
    groups = malloc((n ? n : 1) * sizeof *groups);
    if (!groups)
        return;
    n = 0;
    for (size_t i = 0; i < key_cache_n; i++)
        for (const char *dot = strchr(key_cache[i], '.'); dot; dot = strchr(dot + 1, '.'))
            groups[n++] = (group_name){key_cache[i], (size_t)(dot - key_cache[i])};
    qsort(groups, n, sizeof *groups, cmp_groups);
    ngroups = 0;
    for (size_t k = 0; k < n; k++)
        if (ngroups == 0 || cmp_groups(&groups[ngroups - 1], &groups[k]) != 0)
            groups[ngroups++] = groups[k];
}

static void build_key_cache(void)
{
    size_t n = vl_param_count();
    key_cache_n = n < VL_SCENARIO_CACHE_MAX ? n : VL_SCENARIO_CACHE_MAX;
    for (size_t i = 0; i < key_cache_n; i++) {
        const vl_param *p;
        void *base;
        const char *prefix;
        vl_param_at(NULL, i, &p, &base, &prefix);
        snprintf(key_cache[i], VL_SCENARIO_CACHE_KEY, "%s%s", prefix, p->key);
        by_key[i] = i;
    }
    qsort(by_key, key_cache_n, sizeof *by_key, cmp_rows);
    build_groups();
}

/* The full key of parameter i (cached). */
const char *vl_scenario_key(size_t i)
{
    pthread_once(&key_cache_once, build_key_cache);
    return i < key_cache_n ? key_cache[i] : "";
}

/* Row i, its full key copied into key. */
const vl_param *vl_scenario_param_key(size_t i, char *key, size_t n)
{
    const vl_param *p;
    void *base;
    const char *prefix;
    vl_param_at(NULL, i, &p, &base, &prefix);
    snprintf(key, n, "%s", vl_scenario_key(i));
    return p;
}

/* Address of the stored value of row i in sc; *pp receives the row. */
void *vl_scenario_slot(const vl_scenario *sc, size_t i, const vl_param **pp)
{
    void *base;
    const char *prefix;
    vl_param_at(sc, i, pp, &base, &prefix);
    return (char *)base + (*pp)->offset;
}

/* Row i's slot: storage, full key, and the file-unit copy of a real. */
vl_slot vl_scenario_row_slot(vl_scenario *sc, size_t i)
{
    vl_slot t;
    t.at = vl_scenario_slot(sc, i, &t.p);
    t.key = vl_scenario_key(i);
    t.file_value = t.p->type == VL_PT_REAL ? &sc->file_value[i] : NULL;
    return t;
}

/* Global index of the row whose full key is key, or -1 (binary search of by_key). */
long vl_scenario_find_key(const char *key)
{
    pthread_once(&key_cache_once, build_key_cache);
    size_t lo = 0, hi = key_cache_n;
    while (lo < hi) {
        size_t mid = lo + (hi - lo) / 2;
        int c = strcmp(key, key_cache[by_key[mid]]);
        if (c == 0)
            return (long)by_key[mid];
        if (c < 0)
            hi = mid;
        else
            lo = mid + 1;
    }
    return -1;
}

/* 1 if path is a group: the full key of some row continues it with a dot (binary search
 * of the group names). */
int vl_scenario_is_group(const char *path)
{
    pthread_once(&key_cache_once, build_key_cache);
    group_name g = {path, strlen(path)};
    return groups && bsearch(&g, groups, ngroups, sizeof *groups, cmp_groups) != NULL;
}

int vl_scenario_check_key(const char *key, char *msg, size_t n)
{
    char shown[VL_EXCERPT_SIZE], hint[VL_SCENARIO_KEY_MAX + 32] = "";
    if (vl_scenario_find_key(key) >= 0)
        return 1;
    vl_text_excerpt_str(key, shown, sizeof shown);
    if (vl_scenario_is_group(key)) {
        snprintf(msg, n, "'%s' is a group, not a parameter", shown);
        return 0;
    }
    if (strlen(key) < VL_SCENARIO_KEY_MAX)
        vl_scenario_suggest(key, 0, hint, sizeof hint);
    snprintf(msg, n, "unknown key '%s'%s", shown, hint);
    return 0;
}

/* Records where row i's value came from. */
void vl_scenario_mark(vl_scenario *sc, size_t i, int origin, int line)
{
    sc->origin[i] = (unsigned char)origin;
    sc->line[i] = line;
}

/* ------------------------------------------------------------------ suggestions */

/* The most edits a suggestion for name may be away: max(2, len/4). */
static size_t edit_limit(const char *name)
{
    size_t limit = strlen(name) / 4;
    return limit < 2 ? 2 : limit;
}

/* Keeps cand in best if it is closer to name than anything so far and within limit. */
static void consider(const char *name, const char *cand, size_t limit, size_t *best_d,
                     char *best, size_t n)
{
    size_t d = vl_edit_distance(name, cand);
    if (d <= limit && d < *best_d) {
        *best_d = d;
        snprintf(best, n, "%s", cand);
    }
}

/* " (did you mean 'BEST'?)" into out, or "" when best is empty or name itself. */
static void did_you_mean(const char *name, const char *best, char *out, size_t n)
{
    if (best[0] && strcmp(best, name) != 0)
        snprintf(out, n, " (did you mean '%s'?)", best);
    else
        out[0] = '\0';
}

/* A key in another group with the same last component as name, into out ("" if none). */
static void same_leaf(const char *name, char *out, size_t n)
{
    const char *leaf = strrchr(name, '.');
    leaf = leaf ? leaf + 1 : name;
    for (size_t i = 0, count = vl_param_count(); i < count; i++) {
        const char *key = vl_scenario_key(i), *kl = strrchr(key, '.');
        if (kl && strcmp(kl + 1, leaf) == 0) {
            snprintf(out, n, "%s", key);
            return;
        }
    }
}

/* The closest group to name among the groups of key (never the group holding name). */
static void consider_groups(const char *name, char *key, size_t limit, size_t *best_d,
                            char *best, size_t n)
{
    for (char *dot = strchr(key, '.'); dot; dot = strchr(dot + 1, '.')) {
        size_t len = (size_t)(dot - key);
        if (strncmp(name, key, len) == 0 && name[len] == '.')
            continue; /* the group that holds name: never the intended one */
        *dot = '\0';
        consider(name, key, limit, best_d, best, n);
        *dot = '.';
    }
}

void vl_scenario_suggest(const char *name, int group, char *out, size_t n)
{
    size_t limit = edit_limit(name), best_d = SIZE_MAX;
    char best[VL_SCENARIO_KEY_MAX] = "", key[VL_SCENARIO_KEY_MAX];
    for (size_t i = 0, count = vl_param_count(); i < count; i++) {
        snprintf(key, sizeof key, "%s", vl_scenario_key(i));
        if (group)
            consider_groups(name, key, limit, &best_d, best, sizeof best);
        else
            consider(name, key, limit, &best_d, best, sizeof best);
    }
    if (!best[0] && !group)
        same_leaf(name, best, sizeof best);
    did_you_mean(name, best, out, n);
}

/* The names share the prefix: they are compared without it (and the limit is that of
 * the name without it), so a long prefix does not widen the search. */
void vl_scenario_suggest_among(const char *name, const char *prefix, const char *const *names,
                               size_t count, char *out, size_t n)
{
    size_t plen = strlen(prefix), best_d = SIZE_MAX;
    const char *leaf = strncmp(name, prefix, plen) == 0 ? name + plen : name;
    size_t limit = edit_limit(leaf);
    char best[VL_SCENARIO_KEY_MAX] = "", key[VL_SCENARIO_KEY_MAX];
    for (size_t k = 0; k < count; k++)
        consider(leaf, names[k], limit, &best_d, best, sizeof best);
    snprintf(key, sizeof key, "%s%s", best[0] ? prefix : "", best);
    did_you_mean(name, key, out, n);
}
