/* scenario_names.c: the structure of a scenario's text as the pre-scan walks it
 * (scenario_internal.h): the groups, lists and arrays open and their limits, the full key
 * of every setting, and the check that no setting is given twice in one group. Names are
 * kept in an open-addressing hash keyed by (scope, name), so the checks cost O(1) per
 * setting; libconfig's own repeat check walks the whole group for every setting added
 * (quadratic), which is why the group size is bounded before it runs. */
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "scenario_internal.h"
#include "volev/text.h"

void vl_names_init(vl_names *n, const char *path, vl_status *st)
{
    memset(n, 0, sizeof *n);
    n->path = path;
    n->st = st;
    n->next_id = 1; /* the root is scope 0 */
}

void vl_names_free(vl_names *n)
{
    free(n->seen);
    n->seen = NULL;
}

int vl_names_in_list(const vl_names *n)
{
    char open = n->scope[n->depth].open;
    return open == '(' || open == '[';
}

/* ------------------------------------------------------------------ the name hash */

/* FNV-1a of the scope number and the name. */
static uint64_t name_hash(size_t scope, const char *name, size_t len)
{
    uint64_t h = 1469598103934665603ULL;
    for (size_t k = 0; k < sizeof scope; k++, scope >>= 8)
        h = (h ^ (scope & 0xFF)) * 1099511628211ULL;
    for (size_t k = 0; k < len; k++)
        h = (h ^ (unsigned char)name[k]) * 1099511628211ULL;
    return h;
}

/* The slot of (scope, name) in a table of cap slots (a power of two): the entry holding it,
 * or the free slot where it belongs. */
static vl_name_seen *slot_of(vl_name_seen *t, size_t cap, size_t scope, const char *name,
                             size_t len)
{
    size_t i = (size_t)name_hash(scope, name, len) & (cap - 1);
    while (t[i].name &&
           !(t[i].scope == scope && t[i].len == len && memcmp(t[i].name, name, len) == 0))
        i = (i + 1) & (cap - 1);
    return &t[i];
}

/* Room for one more name: the table is kept at most half full. */
static int reserve(vl_names *n)
{
    if (2 * (n->used + 1) <= n->cap)
        return VL_OK;
    size_t cap = n->cap ? 2 * n->cap : 64;
    vl_name_seen *t = calloc(cap, sizeof *t);
    if (!t)
        return vl_fail(n->st, VL_ERR_INTERNAL, n->path, 0, "out of memory reading the scenario");
    for (size_t i = 0; i < n->cap; i++)
        if (n->seen[i].name)
            *slot_of(t, cap, n->seen[i].scope, n->seen[i].name, n->seen[i].len) = n->seen[i];
    free(n->seen);
    n->seen = t;
    n->cap = cap;
    return VL_OK;
}

/* ------------------------------------------------------------------ settings */

/* The full key of the innermost scope followed by suffix (".name" or "[k]") into out; 0 if
 * it does not fit in VL_SCENARIO_KEY_MAX bytes. */
static int extend_key(const vl_names *n, const char *sep, const char *name, size_t len,
                      char *out)
{
    size_t base = strlen(n->key), need = base + strlen(sep) + len;
    if (need >= VL_SCENARIO_KEY_MAX)
        return 0;
    memcpy(out, n->key, base);
    memcpy(out + base, sep, strlen(sep));
    if (len > 0) /* an unnamed scope passes no name (NULL, 0): memcpy may not see NULL */
        memcpy(out + base + strlen(sep), name, len);
    out[need] = '\0';
    return 1;
}

/* A key too long for any parameter: refused with an excerpt of it. */
static int key_too_long(const vl_names *n, const char *name, size_t len, int line)
{
    char shown[VL_EXCERPT_SIZE];
    vl_text_excerpt(name, len, shown, sizeof shown);
    return vl_fail(n->st, VL_ERR_INPUT, n->path, line,
                   "unknown key '%s%s%s': a full key is at most %d bytes", n->key,
                   n->key[0] ? "." : "", shown, VL_SCENARIO_KEY_MAX - 1);
}

int vl_names_setting(vl_names *n, const char *name, size_t len, int line)
{
    vl_scope *sc = &n->scope[n->depth];
    if (!extend_key(n, n->key[0] ? "." : "", name, len, n->setting))
        return key_too_long(n, name, len, line);
    if (++sc->count > VL_SCENARIO_GROUP_MAX)
        return vl_fail(n->st, VL_ERR_INPUT, n->path, line,
                       "%s%s%s holds more than %d settings (the limit of a group; no group "
                       "of parameters comes close)", n->key[0] ? "group '" : "the top level",
                       n->key, n->key[0] ? "'" : "", VL_SCENARIO_GROUP_MAX);
    int rc = reserve(n);
    if (rc)
        return rc;
    vl_name_seen *e = slot_of(n->seen, n->cap, sc->id, name, len);
    if (e->name && e->line == line)
        return vl_fail(n->st, VL_ERR_INPUT, n->path, line, "'%s' is given twice on this line: "
                       "keep one", n->setting);
    if (e->name)
        return vl_fail(n->st, VL_ERR_INPUT, n->path, line,
                       "'%s' is given twice, on lines %d and %d: keep one", n->setting, e->line,
                       line);
    *e = (vl_name_seen){sc->id, name, len, line};
    n->used++;
    return VL_OK;
}

int vl_names_element(vl_names *n, int line)
{
    if (++n->scope[n->depth].count <= VL_SCENARIO_LIST_MAX)
        return VL_OK;
    return vl_fail(n->st, VL_ERR_INPUT, n->path, line,
                   "'%s' holds more than %d elements (the limit of a list or array)", n->key,
                   VL_SCENARIO_LIST_MAX);
}

/* ------------------------------------------------------------------ brackets */

/* The bracket that closes open. */
static char closer(char open) { return open == '{' ? '}' : open == '(' ? ')' : ']'; }

int vl_names_open(vl_names *n, char open, int line, int value)
{
    if (n->depth == VL_SCENARIO_DEPTH_MAX)
        return vl_fail(n->st, VL_ERR_INPUT, n->path, line,
                       "groups, lists and arrays nested too deep (more than %d levels; the "
                       "parameters need 3)", VL_SCENARIO_DEPTH_MAX);
    char key[VL_SCENARIO_KEY_MAX], index[32];
    snprintf(key, sizeof key, "%s", n->key);
    if (value) {
        snprintf(key, sizeof key, "%s", n->setting);
    } else if (vl_names_in_list(n)) { /* an element of a list: named by its place, from 1 */
        snprintf(index, sizeof index, "%zu", n->scope[n->depth].count);
        if (!extend_key(n, "[", index, strlen(index), key) || strlen(key) + 2 > sizeof key)
            return key_too_long(n, index, strlen(index), line);
        strcat(key, "]");
    }
    n->depth++;
    n->scope[n->depth] = (vl_scope){open, line, n->next_id++, 0, strlen(key)};
    memcpy(n->key, key, strlen(key) + 1);
    return VL_OK;
}

int vl_names_close(vl_names *n, char close, int line)
{
    if (n->depth == 0)
        return vl_fail(n->st, VL_ERR_INPUT, n->path, line, "'%c' closes nothing: no '%c' is open",
                       close, close == '}' ? '{' : close == ')' ? '(' : '[');
    vl_scope *sc = &n->scope[n->depth];
    if (closer(sc->open) != close)
        return vl_fail(n->st, VL_ERR_INPUT, n->path, line,
                       "'%c' does not close the '%c' of line %d (expected '%c')", close, sc->open,
                       sc->line, closer(sc->open));
    n->depth--;
    n->key[n->scope[n->depth].key_len] = '\0';
    return VL_OK;
}

int vl_names_end(vl_names *n)
{
    if (n->depth == 0)
        return VL_OK;
    const vl_scope *sc = &n->scope[n->depth];
    return vl_fail(n->st, VL_ERR_INPUT, n->path, sc->line, "'%c' is never closed (no '%c' after it)",
                   sc->open, closer(sc->open));
}
