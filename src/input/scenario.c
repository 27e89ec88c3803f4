/* scenario.c: scenario files (libconfig 1.5) -> struct vl_scenario, --set overrides,
 * cross-checks, the resolved-scenario writer and the `validate` listing.
 *
 * Everything is driven by the global parameter index of params.c: a setting is
 * accepted only if its full dotted key names a row there, or a group that some row
 * lives in. Values are checked in file units and stored in SI. The file-unit value of
 * every real is kept too (file_value): the resolved file then shows each real as it was
 * written (v * to_si / to_si is often a neighbour of v) and loads back to the identical
 * SI value. */
#include "volev/scenario.h"

#include <ctype.h>
#include <errno.h>
#include <pthread.h>
#include <libconfig.h>
#include <limits.h>
#include <math.h>
#include <stdarg.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>
#include <unistd.h>

#include "volev/process.h"

#define KEY_MAX 512

/* Where a value came from, for messages: a line of the scenario file, or a --set. */
typedef struct {
    const char *file;    /* scenario file; NULL for an override */
    int line;            /* 0 if unknown */
    const char *set_key; /* override: the key as typed (messages begin "--set KEY: ") */
} where;

/* What the file walk needs besides the scenario. */
typedef struct {
    vl_scenario *sc;
    vl_status *st;
    const char *path;       /* the scenario file, as given */
    char dir[VL_PATH_MAX];  /* its folder, absolute: relative paths resolve against it */
} loader;

/* ------------------------------------------------------------------ messages */

/* Fills st with an input error located at w; returns VL_ERR_INPUT. */
__attribute__((format(printf, 3, 4)))
static int fail_at(vl_status *st, const where *w, const char *fmt, ...)
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

/* " UNIT" or "" for a dimensionless row. */
static const char *unit_sep(const vl_param *p) { return p->unit && p->unit[0] ? " " : ""; }
static const char *unit_of(const vl_param *p) { return p->unit ? p->unit : ""; }

/* The '|' list as "a, b or c" (joiner "or") or "a, b, c" (joiner ","). */
static void list_text(const char *list, const char *joiner, char *buf, size_t n)
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

/* Row i and its full dotted key (written into key). */
/* Full keys of every parameter, built once (the tables are constant): lookups by key
 * run on every load and every resolved-scenario write. */
#define CACHE_MAX 2048
#define CACHE_KEY 128
static char key_cache[CACHE_MAX][CACHE_KEY];
static size_t key_cache_n;
static pthread_once_t key_cache_once = PTHREAD_ONCE_INIT;

static void build_key_cache(void)
{
    size_t n = vl_param_count();
    key_cache_n = n < CACHE_MAX ? n : CACHE_MAX;
    for (size_t i = 0; i < key_cache_n; i++) {
        const vl_param *p;
        void *base;
        const char *prefix;
        vl_param_at(NULL, i, &p, &base, &prefix);
        snprintf(key_cache[i], CACHE_KEY, "%s%s", prefix, p->key);
    }
}

/* The full key of parameter i (cached). */
static const char *cached_key(size_t i)
{
    pthread_once(&key_cache_once, build_key_cache);
    return i < key_cache_n ? key_cache[i] : "";
}

static const vl_param *param_key(size_t i, char *key, size_t n)
{
    const vl_param *p;
    void *base;
    const char *prefix;
    vl_param_at(NULL, i, &p, &base, &prefix);
    snprintf(key, n, "%s", cached_key(i));
    return p;
}

/* Address of the stored value of row i in sc; *pp receives the row. */
static void *slot_of(const vl_scenario *sc, size_t i, const vl_param **pp)
{
    void *base;
    const char *prefix;
    vl_param_at(sc, i, pp, &base, &prefix);
    return (char *)base + (*pp)->offset;
}

/* Global index of the row whose full key is key, or -1. */
static long find_key(const char *key)
{
    size_t n = vl_param_count();
    for (size_t i = 0; i < n; i++)
        if (strcmp(key, cached_key(i)) == 0)
            return (long)i;
    return -1;
}

/* 1 if path is a group: the full key of some row continues it with a dot. */
static int is_group(const char *path)
{
    size_t len = strlen(path), n = vl_param_count();
    for (size_t i = 0; i < n; i++) {
        const char *key = cached_key(i);
        if (strncmp(key, path, len) == 0 && key[len] == '.')
            return 1;
    }
    return 0;
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

/* A key in another group with the same last component as name, into out ("" if none). */
static void same_leaf(const char *name, char *out, size_t n)
{
    const char *leaf = strrchr(name, '.');
    leaf = leaf ? leaf + 1 : name;
    char key[KEY_MAX];
    for (size_t i = 0, count = vl_param_count(); i < count; i++) {
        param_key(i, key, sizeof key);
        const char *kl = strrchr(key, '.');
        if (kl && strcmp(kl + 1, leaf) == 0) {
            snprintf(out, n, "%s", key);
            return;
        }
    }
}

/* " (did you mean 'X'?)" for the closest known key (group != 0: group) within
 * max(2, len/4) edits; "" if there is none. */
static void suggest(const char *name, int group, char *out, size_t n)
{
    size_t limit = strlen(name) / 4, best_d = SIZE_MAX;
    char best[KEY_MAX] = "", key[KEY_MAX];
    if (limit < 2)
        limit = 2;
    for (size_t i = 0, count = vl_param_count(); i < count; i++) {
        param_key(i, key, sizeof key);
        if (!group) {
            consider(name, key, limit, &best_d, best, sizeof best);
            continue;
        }
        for (char *dot = strchr(key, '.'); dot; dot = strchr(dot + 1, '.')) {
            size_t len = (size_t)(dot - key);
            if (strncmp(name, key, len) == 0 && name[len] == '.')
                continue; /* the group that holds name: never the intended one */
            *dot = '\0';
            consider(name, key, limit, &best_d, best, sizeof best);
            *dot = '.';
        }
    }
    if (!best[0] && !group)
        same_leaf(name, best, sizeof best);
    if (best[0] && strcmp(best, name) != 0)
        snprintf(out, n, " (did you mean '%s'?)", best);
    else
        out[0] = '\0';
}

/* ------------------------------------------------------------------ storing values */

/* Records where row i's value came from. */
static void mark(vl_scenario *sc, size_t i, int origin, int line)
{
    sc->origin[i] = (unsigned char)origin;
    sc->line[i] = line;
}

/* Stores a real given in file units after the finiteness and bounds checks. */
static int assign_real(vl_scenario *sc, size_t i, double v, const where *w, vl_status *st)
{
    const vl_param *p;
    double *slot = slot_of(sc, i, &p);
    char key[KEY_MAX];
    param_key(i, key, sizeof key);
    if (!isfinite(v))
        return fail_at(st, w, "%s = %g is not a finite number", key, v);
    if (v < p->lo || v > p->hi)
        return fail_at(st, w, "%s = %.10g is out of bounds [%g, %g]%s%s", key, v, p->lo, p->hi,
                       unit_sep(p), unit_of(p));
    *slot = v * p->to_si;
    sc->file_value[i] = v;
    return VL_OK;
}

/* Stores a whole number after the bounds check. */
static int assign_int(vl_scenario *sc, size_t i, long v, const where *w, vl_status *st)
{
    const vl_param *p;
    long *slot = slot_of(sc, i, &p);
    char key[KEY_MAX];
    param_key(i, key, sizeof key);
    if ((double)v < p->lo || (double)v > p->hi)
        return fail_at(st, w, "%s = %ld is out of bounds [%.0f, %.0f]", key, v, p->lo, p->hi);
    *slot = v;
    return VL_OK;
}

/* Stores a choice given by name; the message lists the valid names. */
static int assign_choice(vl_scenario *sc, size_t i, const char *name, const where *w,
                         vl_status *st)
{
    const vl_param *p;
    int *slot = slot_of(sc, i, &p);
    char key[KEY_MAX], list[512];
    param_key(i, key, sizeof key);
    int k = vl_choice_index(p->choices, name);
    if (k < 0) {
        list_text(p->choices, ",", list, sizeof list);
        return fail_at(st, w, "%s = \"%s\" is not one of: %s", key, name, list);
    }
    *slot = k;
    return VL_OK;
}

/* Joins dir and a relative path (dropping leading "./"); absolute paths are kept. */
static int join_path(const char *dir, const char *rel, char *out, size_t n)
{
    if (rel[0] == '/')
        return snprintf(out, n, "%s", rel) >= (int)n;
    while (rel[0] == '.' && rel[1] == '/')
        rel += 2;
    const char *sep = dir[0] && dir[strlen(dir) - 1] == '/' ? "" : "/";
    return snprintf(out, n, "%s%s%s", dir, sep, rel) >= (int)n;
}

/* Stores a file path, made absolute against dir. */
static int assign_path(vl_scenario *sc, size_t i, const char *text, const char *dir,
                       const where *w, vl_status *st)
{
    const vl_param *p;
    char *slot = slot_of(sc, i, &p);
    char key[KEY_MAX], full[VL_PATH_MAX];
    param_key(i, key, sizeof key);
    if (!text[0])
        return fail_at(st, w, "%s must name a file, not be empty", key);
    if (join_path(dir, text, full, sizeof full))
        return fail_at(st, w, "%s: path longer than %d bytes", key, VL_PATH_MAX - 1);
    memcpy(slot, full, strlen(full) + 1);
    return VL_OK;
}

/* The current working directory into buf, or an I/O error. */
static int current_dir(char *buf, size_t n, vl_status *st)
{
    if (getcwd(buf, n))
        return VL_OK;
    return vl_fail(st, VL_ERR_IO, "", 0, "cannot determine the current folder: %s",
                   strerror(errno));
}

/* ------------------------------------------------------------------ defaults */

/* Stores row i's default. */
static void store_default(vl_scenario *sc, size_t i)
{
    const vl_param *p;
    void *slot = slot_of(sc, i, &p);
    switch (p->type) {
    case VL_PT_REAL:
        *(double *)slot = p->def * p->to_si;
        sc->file_value[i] = p->def;
        break;
    case VL_PT_INT: *(long *)slot = (long)p->def; break;
    case VL_PT_BOOL: *(int *)slot = p->def != 0.0; break;
    case VL_PT_CHOICE: *(int *)slot = (int)p->def; break;
    default: snprintf(slot, VL_PATH_MAX, "%s", p->def_str ? p->def_str : ""); break;
    }
    mark(sc, i, VL_FROM_DEFAULT, 0);
}

/* A scenario holding every default (NULL if out of memory). */
vl_scenario *vl_scenario_new(void)
{
    size_t n = vl_param_count();
    vl_scenario *sc = calloc(1, sizeof *sc);
    if (!sc)
        return NULL;
    sc->proc = calloc(vl_nprocesses ? vl_nprocesses : 1, sizeof *sc->proc);
    sc->origin = calloc(n, sizeof *sc->origin);
    sc->line = calloc(n, sizeof *sc->line);
    sc->file_value = calloc(n, sizeof *sc->file_value);
    int ok = sc->proc && sc->origin && sc->line && sc->file_value;
    for (size_t k = 0; ok && k < vl_nprocesses; k++) {
        size_t size = vl_processes[k]->params_size;
        sc->proc[k].params = calloc(1, size ? size : 1);
        ok = sc->proc[k].params != NULL;
    }
    if (!ok) {
        vl_scenario_free(sc);
        return NULL;
    }
    for (size_t i = 0; i < n; i++)
        store_default(sc, i);
    return sc;
}

/* Frees everything sc owns; accepts NULL. */
void vl_scenario_free(vl_scenario *sc)
{
    if (!sc)
        return;
    for (size_t k = 0; sc->proc && k < vl_nprocesses; k++)
        free(sc->proc[k].params);
    free(sc->proc);
    free(sc->origin);
    free(sc->line);
    free(sc->file_value);
    free(sc);
}

/* ------------------------------------------------------------------ table sanity */

/* Checks a needs clause "other.key=a|b": other is a CHOICE or BOOL row and every value
 * names one of its states. Fills *other with its index. Returns 0 when well formed. */
static int parse_needs(const char *needs, long *other, const char **values)
{
    char key[KEY_MAX];
    const char *eq = strchr(needs, '=');
    if (!eq || (size_t)(eq - needs) >= sizeof key || !eq[1])
        return -1;
    memcpy(key, needs, (size_t)(eq - needs));
    key[eq - needs] = '\0';
    *other = find_key(key);
    *values = eq + 1;
    if (*other < 0)
        return -1;
    const vl_param *q = param_key((size_t)*other, key, sizeof key);
    char name[128];
    for (int k = 0; vl_choice_name(*values, k, name, sizeof name)[0]; k++) {
        int known = q->type == VL_PT_CHOICE ? vl_choice_index(q->choices, name) >= 0
                    : q->type == VL_PT_BOOL ? vl_choice_index("true|false", name) >= 0
                                            : 0;
        if (!known)
            return -1;
    }
    return 0;
}

/* Problems with row p's own definition, or NULL. */
static const char *row_problem(const vl_param *p)
{
    char name[8];
    const char *values;
    long other;
    if (!p->key || !p->key[0] || p->key[0] == '.' || p->key[strlen(p->key) - 1] == '.' ||
        strstr(p->key, ".."))
        return "malformed key";
    if (!p->doc)
        return "no doc";
    switch (p->type) {
    case VL_PT_REAL:
        if (!(isfinite(p->to_si) && p->to_si > 0.0))
            return "to_si is not a positive number";
        /* fall through */
    case VL_PT_INT:
        if (!(p->lo <= p->def && p->def <= p->hi))
            return "default outside its bounds";
        break;
    case VL_PT_BOOL:
        if (p->def != 0.0 && p->def != 1.0)
            return "boolean default is not 0 or 1";
        break;
    case VL_PT_CHOICE:
        if (!p->choices || p->def < 0.0 || p->def != floor(p->def) ||
            !vl_choice_name(p->choices, (int)p->def, name, sizeof name)[0])
            return "choice default is not one of its choices";
        break;
    case VL_PT_PATH: break;
    default: return "unknown type";
    }
    if (p->needs && parse_needs(p->needs, &other, &values))
        return "needs clause does not name a choice or boolean key and its values";
    return NULL;
}

/* Checks every table once: rows well formed, full keys unique and never also a group,
 * process prefixes matching the registry. A failure is a bug: VL_ERR_INTERNAL. */
static int check_tables(vl_status *st)
{
    size_t n = vl_param_count();
    if (n > CACHE_MAX)
        return vl_fail(st, VL_ERR_INTERNAL, "", 0, "more than %d parameters", CACHE_MAX);
    char key[KEY_MAX], other[KEY_MAX];
    for (size_t i = 0; i < n; i++) {
        const vl_param *p = param_key(i, key, sizeof key);
        const char *why = row_problem(p);
        void *base;
        const char *prefix;
        vl_param_at(NULL, i, &p, &base, &prefix);
        if (!why && strlen(prefix) + strlen(p->key) >= CACHE_KEY)
            why = "key too long";
        if (!why && find_key(key) != (long)i)
            why = "key defined twice";
        if (!why && is_group(key))
            why = "key is also a group";
        if (why)
            return vl_fail(st, VL_ERR_INTERNAL, "", 0, "parameter table, %s: %s", key, why);
    }
    for (size_t k = 0, first = vl_core_nparams; k < vl_nprocesses; k++) {
        const vl_param *p;
        void *base;
        const char *prefix;
        vl_param_at(NULL, first, &p, &base, &prefix);
        snprintf(other, sizeof other, "processes.%s.", vl_processes[k]->name);
        if (strcmp(prefix, other) != 0)
            return vl_fail(st, VL_ERR_INTERNAL, "", 0,
                           "process %s: registry and processes.def disagree",
                           vl_processes[k]->name);
        first += 1 + vl_processes[k]->nparams;
    }
    return VL_OK;
}

/* ------------------------------------------------------------------ reading the file */

/* The whole file into a new buffer (NUL-terminated; *len bytes before the terminator,
 * which may include NULs: read_text rejects them). */
static int slurp(const char *path, char **text, size_t *len_out, vl_status *st)
{
    FILE *f = fopen(path, "rb");
    if (!f)
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot open the scenario: %s", strerror(errno));
    size_t len = 0, cap = 4096;
    char *buf = malloc(cap);
    while (buf) {
        len += fread(buf + len, 1, cap - len - 1, f);
        if (len < cap - 1)
            break;
        char *bigger = realloc(buf, cap *= 2);
        if (!bigger)
            free(buf);
        buf = bigger;
    }
    int bad = ferror(f), why = errno;
    fclose(f);
    if (!buf)
        return vl_fail(st, VL_ERR_INTERNAL, path, 0, "out of memory reading the scenario");
    if (bad) {
        free(buf);
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot read the scenario: %s", strerror(why));
    }
    buf[len] = '\0';
    *text = buf;
    *len_out = len;
    return VL_OK;
}

/* Skips a quoted string starting at s (escapes honoured), counting newlines. */
static const char *skip_string(const char *s, int *line)
{
    for (s++; *s && *s != '"'; s++) {
        if (*s == '\\' && s[1])
            s++;
        if (*s == '\n')
            (*line)++;
    }
    return *s ? s + 1 : s;
}

/* Skips a block comment starting at s, counting newlines. */
static const char *skip_block(const char *s, int *line)
{
    for (s += 2; *s && !(s[0] == '*' && s[1] == '/'); s++)
        if (*s == '\n')
            (*line)++;
    return *s ? s + 2 : s;
}

/* A numeric token starting at *s: libconfig 1.5 wraps integers beyond 32 bits written
 * without an L suffix without a word, so they are rejected here. Advances *s. */
static int check_number(const char **s, int line, const char *path, vl_status *st)
{
    const char *t = *s, *c = t + (*t == '+' || *t == '-');
    int hex = c[0] == '0' && (c[1] == 'x' || c[1] == 'X'), real = 0;
    for (; isalnum((unsigned char)*c) || *c == '.' ||
           ((*c == '+' || *c == '-') && !hex && (c[-1] == 'e' || c[-1] == 'E'));
         c++)
        real |= *c == '.' || (!hex && (*c == 'e' || *c == 'E'));
    *s = c;
    if (real || c[-1] == 'L')
        return VL_OK;
    errno = 0;
    long long v = strtoll(t, NULL, hex ? 16 : 10);
    if (errno == 0 && v >= INT_MIN && v <= INT_MAX)
        return VL_OK;
    return vl_fail(st, VL_ERR_INPUT, path, line,
                   "integer %.*s does not fit in 32 bits, which the file format would wrap "
                   "silently; write it as a real number (%.*s.0)",
                   (int)(c - t), t, (int)(c - t), t);
}

/* 1 if the file format's grammar allows a string literal after the token prev (its
 * punctuation character, '"' for a string; '\0' at the start) when the innermost open
 * bracket is open ('\0' at the top level): where a value starts, or another string
 * continues one. */
static int string_allowed(char prev, char open)
{
    return prev == '=' || prev == ':' || prev == '(' || prev == '[' || prev == '"' ||
           (prev == ',' && (open == '(' || open == '['));
}

/* Lexical pass over the text for what libconfig would accept but mishandle silently:
 * oversized integers, and directives (@include: a scenario is one self-contained file).
 * It also defuses a leak of libconfig 1.5: when its parser stops at a string literal
 * that the grammar does not allow there, the string's buffer is lost. Such a string's
 * opening quote is replaced by '`', which starts no token, so the parser stops at the
 * same place with the same "syntax error" and nothing to lose; the scan ends there. */
static int prescan(char *text, const char *path, vl_status *st)
{
    const char *s = text;
    int line = 1;
    char prev = '\0';                 /* last token: punctuation, '"', 'w' word or number */
    size_t depth = 0;                  /* brackets open */
    char *open = malloc(strlen(text) + 1); /* the open brackets, innermost last */
    if (!open)
        return vl_fail(st, VL_ERR_INTERNAL, path, 0, "out of memory reading the scenario");
    int rc = VL_OK;
    while (*s && rc == VL_OK) {
        unsigned char c = (unsigned char)*s;
        if (c == '\n') {
            line++;
            s++;
        } else if (isspace(c)) {
            s++;
        } else if (c == '#' || (c == '/' && s[1] == '/')) {
            s += strcspn(s, "\n");
        } else if (c == '/' && s[1] == '*') {
            s = skip_block(s, &line);
        } else if (c == '"') {
            if (!string_allowed(prev, depth ? open[depth - 1] : '\0')) {
                text[s - text] = '`';
                break;
            }
            s = skip_string(s, &line);
            prev = '"';
        } else if (c == '@') {
            rc = vl_fail(st, VL_ERR_INPUT, path, line,
                         "directives such as @include are not supported: a scenario is one file");
        } else if (isalpha(c) || c == '*' || c == '_') {
            while (isalnum((unsigned char)*s) || *s == '_' || *s == '*' || *s == '-')
                s++;
            prev = 'w';
        } else if (isdigit(c) || ((c == '-' || c == '+' || c == '.') && isdigit((unsigned char)s[1])) ||
                   ((c == '-' || c == '+') && s[1] == '.' && isdigit((unsigned char)s[2]))) {
            rc = check_number(&s, line, path, st);
            prev = 'w';
        } else {
            if (c == '(' || c == '[' || c == '{')
                open[depth++] = (char)c;
            else if ((c == ')' || c == ']' || c == '}') && depth > 0)
                depth--;
            prev = (char)c;
            s++;
        }
    }
    free(open);
    return rc;
}

/* How a libconfig setting type reads in a message. */
static const char *type_word(int t)
{
    switch (t) {
    case CONFIG_TYPE_INT:
    case CONFIG_TYPE_INT64: return "an integer";
    case CONFIG_TYPE_FLOAT: return "a real number";
    case CONFIG_TYPE_STRING: return "a string";
    case CONFIG_TYPE_BOOL: return "true/false";
    case CONFIG_TYPE_GROUP: return "a group";
    case CONFIG_TYPE_ARRAY: return "an array";
    case CONFIG_TYPE_LIST: return "a list";
    default: return "an unknown kind of value";
    }
}

/* A real from a numeric setting; 0 if s is not numeric. */
static int setting_real(const config_setting_t *s, double *v)
{
    switch (config_setting_type(s)) {
    case CONFIG_TYPE_INT: *v = (double)config_setting_get_int(s); return 1;
    case CONFIG_TYPE_INT64: *v = (double)config_setting_get_int64(s); return 1;
    case CONFIG_TYPE_FLOAT: *v = config_setting_get_float(s); return 1;
    default: return 0;
    }
}

/* Reads a REAL or INT row from s. */
static int read_number(loader *ld, const config_setting_t *s, size_t i, const vl_param *p,
                       const char *key, const where *w)
{
    int t = config_setting_type(s);
    double v;
    if (p->type == VL_PT_REAL) {
        if (!setting_real(s, &v))
            return fail_at(ld->st, w, "%s must be a number%s%s, not %s", key,
                           p->unit && p->unit[0] ? " in " : "", unit_of(p), type_word(t));
        return assign_real(ld->sc, i, v, w, ld->st);
    }
    if (t == CONFIG_TYPE_INT)
        return assign_int(ld->sc, i, config_setting_get_int(s), w, ld->st);
    if (t == CONFIG_TYPE_INT64)
        return assign_int(ld->sc, i, (long)config_setting_get_int64(s), w, ld->st);
    if (t == CONFIG_TYPE_FLOAT)
        return fail_at(ld->st, w,
                       "%s must be a whole number written without a decimal point or exponent "
                       "(got %.10g)", key, config_setting_get_float(s));
    return fail_at(ld->st, w, "%s must be a whole number, not %s", key, type_word(t));
}

/* Reads a BOOL, CHOICE or PATH row from s. */
static int read_word(loader *ld, const config_setting_t *s, size_t i, const vl_param *p,
                     const char *key, const where *w)
{
    int t = config_setting_type(s);
    char list[512];
    if (p->type == VL_PT_BOOL) {
        if (t != CONFIG_TYPE_BOOL)
            return fail_at(ld->st, w, "%s must be true or false, not %s", key, type_word(t));
        *(int *)slot_of(ld->sc, i, &p) = config_setting_get_bool(s) != 0;
        return VL_OK;
    }
    if (p->type == VL_PT_CHOICE) {
        if (t == CONFIG_TYPE_STRING)
            return assign_choice(ld->sc, i, config_setting_get_string(s), w, ld->st);
        list_text(p->choices, "or", list, sizeof list);
        return fail_at(ld->st, w, "%s must be a quoted name: %s; not %s", key, list, type_word(t));
    }
    if (t != CONFIG_TYPE_STRING)
        return fail_at(ld->st, w, "%s must be a quoted file path, not %s", key, type_word(t));
    return assign_path(ld->sc, i, config_setting_get_string(s), ld->dir, w, ld->st);
}

/* Reads the setting s into row i and records its line. */
static int read_scalar(loader *ld, const config_setting_t *s, size_t i, int line)
{
    char key[KEY_MAX];
    const vl_param *p = param_key(i, key, sizeof key);
    where w = {ld->path, line, NULL};
    int t = config_setting_type(s), rc;
    if (t == CONFIG_TYPE_GROUP || t == CONFIG_TYPE_ARRAY || t == CONFIG_TYPE_LIST)
        return fail_at(ld->st, &w, "%s must be a single value, not %s", key, type_word(t));
    if (p->type == VL_PT_REAL || p->type == VL_PT_INT)
        rc = read_number(ld, s, i, p, key, &w);
    else
        rc = read_word(ld, s, i, p, key, &w);
    if (rc == VL_OK)
        mark(ld->sc, i, VL_FROM_FILE, line);
    return rc;
}

/* A setting under `processes` that is not a registered process. */
static int unknown_process(loader *ld, const char *full, int line)
{
    char hint[KEY_MAX + 32] = "", names[1024] = "";
    where w = {ld->path, line, NULL};
    suggest(full, 1, hint, sizeof hint);
    if (hint[0])
        return fail_at(ld->st, &w, "unknown process '%s'%s", full, hint);
    for (size_t k = 0; k < vl_nprocesses; k++) {
        size_t len = strlen(names);
        snprintf(names + len, sizeof names - len, "%s%s", k ? ", " : "", vl_processes[k]->name);
    }
    return fail_at(ld->st, &w, "unknown process '%s' (known processes: %s)", full, names);
}

/* A setting that is neither a known key nor a known group. */
static int unknown_setting(loader *ld, const char *full, int group, int line)
{
    char hint[KEY_MAX + 32];
    where w = {ld->path, line, NULL};
    suggest(full, group, hint, sizeof hint);
    return fail_at(ld->st, &w, "unknown %s '%s'%s", group ? "group" : "key", full, hint);
}

/* A single value written where a group belongs. */
static int value_for_group(loader *ld, const char *full, int line)
{
    char sw[KEY_MAX + 16];
    where w = {ld->path, line, NULL};
    snprintf(sw, sizeof sw, "%s.enabled", full);
    if (find_key(sw) >= 0)
        return fail_at(ld->st, &w, "'%s' is a group: switch the process with %s = { enabled = "
                       "true; } (or false)", full, full);
    return fail_at(ld->st, &w, "'%s' is a group: write %s = { ... };", full, full);
}

static int walk_group(loader *ld, const config_setting_t *g, const char *prefix);

/* One setting of the file, with its full key. */
static int visit(loader *ld, const config_setting_t *s, const char *full, const char *prefix)
{
    int line = (int)config_setting_source_line(s);
    int grp = config_setting_is_group(s);
    if (prefix[0] == '\0' && strcmp(full, "sweep") == 0) {
        if (!grp)
            return fail_at(ld->st, &(where){ld->path, line, NULL},
                           "'sweep' must be a group: sweep = { ... };");
        ld->sc->sweep_line = line; /* the ensemble settings: src/ensembles/sweep.c reads them */
        return VL_OK;
    }
    if (is_group(full))
        return grp ? walk_group(ld, s, full) : value_for_group(ld, full, line);
    if (strcmp(prefix, "processes") == 0)
        return unknown_process(ld, full, line);
    long i = find_key(full);
    if (i < 0)
        return unknown_setting(ld, full, grp, line);
    return read_scalar(ld, s, (size_t)i, line);
}

/* Every setting of group g, whose full key is prefix ("" for the root). */
static int walk_group(loader *ld, const config_setting_t *g, const char *prefix)
{
    int n = config_setting_length(g);
    for (int k = 0; k < n; k++) {
        const config_setting_t *s = config_setting_get_elem(g, (unsigned)k);
        const char *name = config_setting_name(s);
        char full[KEY_MAX];
        snprintf(full, sizeof full, "%s%s%s", prefix, prefix[0] ? "." : "", name ? name : "?");
        int rc = visit(ld, s, full, prefix);
        if (rc)
            return rc;
    }
    return VL_OK;
}

/* The absolute folder of path into out. */
static int folder_of(const char *path, char *out, size_t n, vl_status *st)
{
    char cwd[VL_PATH_MAX], dir[VL_PATH_MAX];
    const char *slash = strrchr(path, '/');
    if (!slash)
        return current_dir(out, n, st);
    snprintf(dir, sizeof dir, "%.*s", slash == path ? 1 : (int)(slash - path), path);
    if (dir[0] == '/') {
        snprintf(out, n, "%s", dir);
        return VL_OK;
    }
    int rc = current_dir(cwd, sizeof cwd, st);
    if (rc)
        return rc;
    if (join_path(cwd, strcmp(dir, ".") == 0 ? "" : dir, out, n))
        return vl_fail(st, VL_ERR_INPUT, path, 0, "scenario folder path too long");
    return VL_OK;
}

/* Parses len bytes of scenario text (NUL and control bytes refused: binary data) and
 * walks every setting in it; relative paths resolve against dir; messages name sc->path. */
static int read_text(vl_scenario *sc, const char *text, size_t len, const char *dir,
                     vl_status *st)
{
    loader ld = {sc, st, sc->path, ""};
    snprintf(ld.dir, sizeof ld.dir, "%s", dir);
    int line = 1;
    for (size_t i = 0; i < len; i++) {
        unsigned char c = (unsigned char)text[i];
        if (c == '\n')
            line += line < INT_MAX;
        else if (c == 0)
            return vl_fail(st, VL_ERR_INPUT, sc->path, line,
                           "the scenario contains a NUL byte (binary data, not a text file)");
        else if ((c < 0x20 && !isspace(c)) || c == 0x7F)
            return vl_fail(st, VL_ERR_INPUT, sc->path, line,
                           "binary data, not a text file: control character 0x%02X", c);
    }
    char *copy = malloc(len + 1);
    if (!copy)
        return vl_fail(st, VL_ERR_INTERNAL, sc->path, 0, "out of memory reading the scenario");
    memcpy(copy, text, len);
    copy[len] = '\0';
    int rc = prescan(copy, sc->path, st);
    if (rc) {
        free(copy);
        return rc;
    }
    config_t cfg;
    config_init(&cfg);
    if (!config_read_string(&cfg, copy))
        rc = vl_fail(st, VL_ERR_INPUT, sc->path, config_error_line(&cfg), "%s",
                     config_error_text(&cfg));
    else
        rc = walk_group(&ld, config_root_setting(&cfg), "");
    config_destroy(&cfg);
    free(copy);
    return rc;
}

/* The file at sc->path, relative paths in it resolved against its folder. */
static int read_file(vl_scenario *sc, vl_status *st)
{
    char dir[VL_PATH_MAX], *text = NULL;
    size_t len = 0;
    int rc = folder_of(sc->path, dir, sizeof dir, st);
    if (!rc)
        rc = slurp(sc->path, &text, &len, st);
    if (!rc)
        rc = read_text(sc, text, len, dir, st);
    free(text);
    return rc;
}

/* sc->path as given and sc->name: the file name without folder and extension. */
static int set_identity(vl_scenario *sc, const char *path, vl_status *st)
{
    if (strlen(path) >= sizeof sc->path)
        return vl_fail(st, VL_ERR_INPUT, "", 0, "scenario path longer than %zu bytes",
                       sizeof sc->path - 1);
    snprintf(sc->path, sizeof sc->path, "%s", path);
    const char *base = strrchr(path, '/');
    base = base ? base + 1 : path;
    const char *dot = strrchr(base, '.');
    int len = dot && dot != base ? (int)(dot - base) : (int)strlen(base);
    snprintf(sc->name, sizeof sc->name, "%.*s", len, base);
    return VL_OK;
}

/* ------------------------------------------------------------------ overrides */

/* Copies text without surrounding white space into buf; 0 if it does not fit. */
static int trimmed(const char *text, size_t len, char *buf, size_t n)
{
    while (len && isspace((unsigned char)*text)) {
        text++;
        len--;
    }
    while (len && isspace((unsigned char)text[len - 1]))
        len--;
    if (len >= n)
        return 0;
    memcpy(buf, text, len);
    buf[len] = '\0';
    return 1;
}

/* Drops one pair of surrounding double quotes. */
static char *unquoted(char *v)
{
    size_t len = strlen(v);
    if (len >= 2 && v[0] == '"' && v[len - 1] == '"') {
        v[len - 1] = '\0';
        return v + 1;
    }
    return v;
}

/* Parses an override value for row i and stores it. */
static int assign_text(vl_scenario *sc, size_t i, char *value, const where *w, vl_status *st)
{
    const vl_param *p;
    char *end, cwd[VL_PATH_MAX];
    void *slot = slot_of(sc, i, &p);
    errno = 0;
    switch (p->type) {
    case VL_PT_REAL: {
        double v = strtod(value, &end);
        if (end == value || *end)
            return fail_at(st, w, "'%s' is not a number", value);
        return assign_real(sc, i, v, w, st);
    }
    case VL_PT_INT: {
        long v = strtol(value, &end, 10);
        if (end == value || *end)
            return fail_at(st, w, "'%s' is not a whole number", value);
        if (errno == ERANGE)
            return fail_at(st, w, "'%s' is too large", value);
        return assign_int(sc, i, v, w, st);
    }
    case VL_PT_BOOL:
        if (strcasecmp(value, "true") && strcasecmp(value, "false"))
            return fail_at(st, w, "'%s' is not true or false", value);
        *(int *)slot = strcasecmp(value, "true") == 0;
        return VL_OK;
    case VL_PT_CHOICE: return assign_choice(sc, i, unquoted(value), w, st);
    default: {
        int rc = current_dir(cwd, sizeof cwd, st);
        return rc ? rc : assign_path(sc, i, unquoted(value), cwd, w, st);
    }
    }
}

/* Applies "KEY=VALUE"; relative paths resolve against the current folder, where the
 * command was typed. */
int vl_scenario_override(vl_scenario *sc, const char *assignment, vl_status *st)
{
    char key[KEY_MAX], value[VL_PATH_MAX + 2], hint[KEY_MAX + 32];
    const char *eq = strchr(assignment, '=');
    if (!eq || !trimmed(assignment, (size_t)(eq - assignment), key, sizeof key) || !key[0])
        return vl_fail(st, VL_ERR_INPUT, "", 0, "--set %s: expected KEY=VALUE", assignment);
    where w = {NULL, 0, key};
    if (!trimmed(eq + 1, strlen(eq + 1), value, sizeof value))
        return fail_at(st, &w, "value longer than %d bytes", VL_PATH_MAX);
    long i = find_key(key);
    if (i < 0 && is_group(key))
        return fail_at(st, &w, "'%s' is a group, not a parameter", key);
    if (i < 0) {
        suggest(key, 0, hint, sizeof hint);
        return fail_at(st, &w, "unknown key '%s'%s", key, hint);
    }
    int rc = assign_text(sc, (size_t)i, value, &w, st);
    if (rc == VL_OK)
        mark(sc, (size_t)i, VL_FROM_OVERRIDE, 0);
    return rc;
}

/* ------------------------------------------------------------------ cross-checks */

/* Fails with a message located where row i's value came from. */
__attribute__((format(printf, 4, 5)))
static int fail_param(const vl_scenario *sc, size_t i, vl_status *st, const char *fmt, ...)
{
    char key[KEY_MAX], msg[VL_MSG_MAX];
    param_key(i, key, sizeof key);
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(msg, sizeof msg, fmt, ap);
    va_end(ap);
    where w = {sc->path, sc->line[i], NULL};
    if (sc->origin[i] == VL_FROM_OVERRIDE)
        w = (where){NULL, 0, key};
    return fail_at(st, &w, "%s", msg);
}

/* The state of a CHOICE or BOOL row as written in a file. */
static void state_text(const vl_scenario *sc, size_t i, char *buf, size_t n)
{
    const vl_param *p;
    const int *v = slot_of(sc, i, &p);
    if (p->type == VL_PT_BOOL)
        snprintf(buf, n, "%s", *v ? "true" : "false");
    else
        vl_choice_name(p->choices, *v, buf, n);
}

/* 1 if row i has no needs clause or its condition holds in sc; fills the text of the
 * controlling key and its state for messages. */
static int needs_hold(const vl_scenario *sc, size_t i, char *other, size_t on, char *state,
                      size_t sn, const char **values)
{
    const vl_param *p;
    slot_of(sc, i, &p);
    long j;
    if (!p->needs || parse_needs(p->needs, &j, values))
        return 1;
    param_key((size_t)j, other, on);
    state_text(sc, (size_t)j, state, sn);
    return vl_choice_index(*values, state) >= 0;
}

/* Every row set by the file or an override must be meaningful under its needs clause. */
static int check_needs(const vl_scenario *sc, vl_status *st)
{
    char key[KEY_MAX], other[KEY_MAX], state[128], list[512];
    const char *values;
    for (size_t i = 0, n = vl_param_count(); i < n; i++) {
        if (sc->origin[i] == VL_FROM_DEFAULT ||
            needs_hold(sc, i, other, sizeof other, state, sizeof state, &values))
            continue;
        param_key(i, key, sizeof key);
        list_text(values, "or", list, sizeof list);
        return fail_param(sc, i, st, "%s is only used when %s is %s (it is %s)", key, other,
                          list, state);
    }
    return VL_OK;
}

/* Rows marked required must come from the file or an override. */
static int check_required(const vl_scenario *sc, vl_status *st)
{
    char key[KEY_MAX];
    for (size_t i = 0, n = vl_param_count(); i < n; i++) {
        const vl_param *p = param_key(i, key, sizeof key);
        if (p->required && sc->origin[i] == VL_FROM_DEFAULT)
            return vl_fail(st, VL_ERR_INPUT, sc->path, 0, "%s must be set (%s)", key, p->doc);
    }
    return VL_OK;
}

/* The run ends after it starts; a luminosity table has a file. */
static int check_consistency(const vl_scenario *sc, vl_status *st)
{
    size_t start = (size_t)find_key("run.start_yr"), end = (size_t)find_key("run.end_yr");
    size_t lum = (size_t)find_key("star.luminosity_model");
    if (!(sc->run.end_s > sc->run.start_s)) {
        size_t at = sc->origin[end] != VL_FROM_DEFAULT ? end : start;
        return fail_param(sc, at, st, "run.end_yr = %.10g must be later than run.start_yr = %.10g",
                          sc->file_value[end], sc->file_value[start]);
    }
    if (sc->star.luminosity_model == VL_LUM_TABLE && !sc->star.track_file[0])
        return fail_param(sc, lum, st,
                          "star.luminosity_model is table but star.track_file is not set");
    return VL_OK;
}

/* The check hook of every enabled process. */
static int run_hooks(const vl_scenario *sc, vl_status *st)
{
    for (size_t k = 0; k < vl_nprocesses; k++) {
        const vl_process *proc = vl_processes[k];
        if (!proc->check || !sc->proc[k].enabled || proc->check(sc->proc[k].params, sc, st) == 0)
            continue;
        if (st->code == VL_OK)
            return vl_fail(st, VL_ERR_INTERNAL, sc->path, 0,
                           "process %s rejected the scenario without a message", proc->name);
        if (!st->file[0])
            snprintf(st->file, sizeof st->file, "%s", sc->path);
        return st->code;
    }
    return VL_OK;
}

/* Every check that needs the complete scenario. */
static int cross_check(const vl_scenario *sc, vl_status *st)
{
    int rc = check_required(sc, st);
    if (!rc)
        rc = check_needs(sc, st);
    if (!rc)
        rc = check_consistency(sc, st);
    if (!rc)
        rc = run_hooks(sc, st);
    return rc;
}

/* check_tables once per process (the tables are constant): its result is kept. */
static vl_status tables_status;
static pthread_once_t tables_once = PTHREAD_ONCE_INIT;
static void check_tables_once(void)
{
    vl_status_clear(&tables_status);
    check_tables(&tables_status);
}

/* The table check, a scenario of defaults and its identity (path or label); NULL with
 * st filled on error. */
static vl_scenario *begin(const char *label, vl_status *st)
{
    vl_status_clear(st);
    pthread_once(&tables_once, check_tables_once);
    if (tables_status.code != VL_OK) {
        *st = tables_status;
        return NULL;
    }
    vl_scenario *sc = vl_scenario_new();
    if (!sc) {
        vl_fail(st, VL_ERR_INTERNAL, label, 0, "out of memory");
        return NULL;
    }
    if (set_identity(sc, label, st)) {
        vl_scenario_free(sc);
        return NULL;
    }
    return sc;
}

/* After the text was read with result rc: the overrides in order, then the
 * cross-checks; frees sc and returns NULL on any error. */
static vl_scenario *finish(vl_scenario *sc, int rc, const char *const *overrides,
                           size_t n_overrides, vl_status *st)
{
    for (size_t k = 0; !rc && k < n_overrides; k++)
        rc = vl_scenario_override(sc, overrides[k], st);
    if (!rc)
        rc = cross_check(sc, st);
    if (rc) {
        vl_scenario_free(sc);
        return NULL;
    }
    return sc;
}

/* Defaults, then the file, then the overrides in order, then the cross-checks. */
vl_scenario *vl_scenario_load(const char *path, const char *const *overrides, size_t n_overrides,
                              vl_status *st)
{
    vl_scenario *sc = begin(path, st);
    return sc ? finish(sc, read_file(sc, st), overrides, n_overrides, st) : NULL;
}

/* The same from memory: defaults, the text (relative paths against the current folder),
 * the cross-checks. */
vl_scenario *vl_scenario_parse(const char *text, size_t len, const char *label, vl_status *st)
{
    if (!label)
        label = "(text)";
    if (!text && len > 0) {
        vl_status_clear(st);
        vl_fail(st, VL_ERR_INTERNAL, label, 0, "vl_scenario_parse: no text");
        return NULL;
    }
    vl_scenario *sc = begin(label, st);
    if (!sc)
        return NULL;
    char cwd[VL_PATH_MAX];
    int rc = current_dir(cwd, sizeof cwd, st);
    if (!rc)
        rc = read_text(sc, text ? text : "", len, cwd, st);
    return finish(sc, rc, NULL, 0, st);
}

/* ------------------------------------------------------------------ writing */

static int same_bits(double a, double b) { return memcmp(&a, &b, sizeof a) == 0; }

/* A file-unit value x with x * to_si == si exactly, searched near si / to_si (for SI
 * values stored by code other than the loader); si / to_si if there is none. */
static double preimage(double si, double to_si)
{
    double x0 = si / to_si, up = x0, down = x0;
    for (int k = 0; k < 16; k++) {
        if (same_bits(up * to_si, si))
            return up;
        if (same_bits(down * to_si, si))
            return down;
        up = nextafter(up, HUGE_VAL);
        down = nextafter(down, -HUGE_VAL);
    }
    return x0;
}

/* Row i's real in file units: the value as read when it still matches the stored SI
 * value, else one that maps onto it. */
static double file_real(const vl_scenario *sc, size_t i)
{
    const vl_param *p;
    double si = *(const double *)slot_of(sc, i, &p), x = sc->file_value[i];
    return same_bits(x * p->to_si, si) ? x : preimage(si, p->to_si);
}

/* Row i's real in file units, as text that reads back to the same double (the shortest
 * of %.15g, %.16g, %.17g that does; %.17g always does) and that the file format reads as
 * a real (so "-0" keeps its sign). */
static void real_text(const vl_scenario *sc, size_t i, char *buf, size_t n)
{
    double x = file_real(sc, i);
    for (int digits = 15; digits <= 17; digits++) {
        snprintf(buf, n, "%.*g", digits, x);
        if (same_bits(strtod(buf, NULL), x))
            break;
    }
    if (!strpbrk(buf, ".eEin"))
        strncat(buf, ".0", n - strlen(buf) - 1);
}

/* s as a libconfig string literal. */
static void write_string(FILE *out, const char *s)
{
    fputc('"', out);
    for (; *s; s++) {
        unsigned char c = (unsigned char)*s;
        if (c == '"' || c == '\\')
            fprintf(out, "\\%c", c);
        else if (c == '\n')
            fputs("\\n", out);
        else if (c == '\t')
            fputs("\\t", out);
        else if (c < 0x20 || c == 0x7f)
            fprintf(out, "\\x%02x", c);
        else
            fputc(c, out);
    }
    fputc('"', out);
}

/* Row i's value as it is written in a file (PATH: unquoted). */
static void value_text(const vl_scenario *sc, size_t i, char *buf, size_t n)
{
    const vl_param *p;
    const void *slot = slot_of(sc, i, &p);
    switch (p->type) {
    case VL_PT_REAL: real_text(sc, i, buf, n); break;
    case VL_PT_INT: {
        long v = *(const long *)slot;
        snprintf(buf, n, "%ld%s", v, v < INT_MIN || v > INT_MAX ? "L" : "");
        break;
    }
    case VL_PT_BOOL:
    case VL_PT_CHOICE: state_text(sc, i, buf, n); break;
    default: snprintf(buf, n, "%s", (const char *)slot); break;
    }
}

static void indent(FILE *out, int depth) { fprintf(out, "%*s", 4 * depth, ""); }

/* One `name = value;` line; rows that would not load back (their needs clause does not
 * hold, or an unset path) are written as comments. */
static void write_row(const vl_scenario *sc, FILE *out, size_t i, const char *name, int depth)
{
    const vl_param *p;
    slot_of(sc, i, &p);
    char other[KEY_MAX], state[128], text[VL_PATH_MAX + 32], list[512];
    const char *values;
    int holds = needs_hold(sc, i, other, sizeof other, state, sizeof state, &values);
    value_text(sc, i, text, sizeof text);
    indent(out, depth);
    if (!holds || (p->type == VL_PT_PATH && !text[0]))
        fputs("# ", out);
    fprintf(out, "%s = ", name);
    if (p->type == VL_PT_CHOICE || p->type == VL_PT_PATH)
        write_string(out, text);
    else
        fputs(text, out);
    fputc(';', out);
    if (!holds) {
        list_text(values, "or", list, sizeof list);
        fprintf(out, "  (only used when %s is %s)", other, list);
    } else if (p->type == VL_PT_PATH && !text[0]) {
        fputs("  (not set)", out);
    }
    fputc('\n', out);
}

/* 1 if no row before i has a full key beginning with group. */
static int first_in_group(size_t i, const char *group)
{
    size_t len = strlen(group);
    for (size_t j = 0; j < i; j++)
        if (strncmp(cached_key(j), group, len) == 0)
            return 0;
    return 1;
}

/* Every row under prefix ("" or "a.b."), subgroups nested where they first appear. */
static void write_group(const vl_scenario *sc, FILE *out, const char *prefix, int depth)
{
    char sub[KEY_MAX];
    size_t plen = strlen(prefix);
    for (size_t i = 0, n = vl_param_count(); i < n; i++) {
        const char *key = cached_key(i);
        if (strncmp(key, prefix, plen) != 0)
            continue;
        const char *rest = key + plen, *dot = strchr(rest, '.');
        if (!dot) {
            write_row(sc, out, i, rest, depth);
            continue;
        }
        snprintf(sub, sizeof sub, "%.*s", (int)(dot - key + 1), key);
        if (!first_in_group(i, sub))
            continue;
        if (depth == 0)
            fputc('\n', out);
        indent(out, depth);
        fprintf(out, "%.*s = {\n", (int)(dot - rest), rest);
        write_group(sc, out, sub, depth + 1);
        indent(out, depth);
        fputs("};\n", out);
    }
}

/* The complete resolved scenario; reading it back gives identical values. */
int vl_scenario_write_resolved(const vl_scenario *sc, FILE *out, vl_status *st)
{
    char key[KEY_MAX];
    for (size_t i = 0, n = vl_param_count(); i < n; i++) {
        const vl_param *p;
        const double *v = slot_of(sc, i, &p);
        if (p->type == VL_PT_REAL && !isfinite(*v))
            return vl_fail(st, VL_ERR_INTERNAL, "", 0, "%s is not finite",
                           param_key(i, key, sizeof key) ? key : "?");
    }
    fputs("# resolved scenario written by volev\n", out);
    write_group(sc, out, "", 0);
    if (fflush(out) != 0 || ferror(out))
        return vl_fail(st, VL_ERR_IO, "", 0, "cannot write the resolved scenario: %s",
                       strerror(errno));
    return VL_OK;
}

/* ------------------------------------------------------------------ listing */

/* Where row i came from, as shown by `validate`. */
static void origin_text(const vl_scenario *sc, size_t i, char *buf, size_t n)
{
    char other[KEY_MAX], state[128];
    const char *values;
    if (sc->origin[i] == VL_FROM_FILE)
        snprintf(buf, n, "%s:%d", sc->path, sc->line[i]);
    else if (sc->origin[i] == VL_FROM_OVERRIDE)
        snprintf(buf, n, "--set");
    else if (!needs_hold(sc, i, other, sizeof other, state, sizeof state, &values))
        snprintf(buf, n, "default, unused");
    else
        snprintf(buf, n, "default");
}

/* Row i's value in file units with its unit (reals with 10 digits). */
static void shown_value(const vl_scenario *sc, size_t i, char *buf, size_t n)
{
    const vl_param *p;
    const void *slot = slot_of(sc, i, &p);
    if (p->type == VL_PT_REAL)
        snprintf(buf, n, "%.10g%s%s", file_real(sc, i), unit_sep(p), unit_of(p));
    else if (p->type == VL_PT_PATH && !((const char *)slot)[0])
        snprintf(buf, n, "(not set)");
    else
        value_text(sc, i, buf, n);
}

/* `key = value unit  [origin]`, one line per parameter, columns aligned. */
void vl_scenario_print(const vl_scenario *sc, FILE *out)
{
    char key[KEY_MAX], value[VL_PATH_MAX + 64], from[VL_PATH_MAX + 32];
    size_t n = vl_param_count();
    int wkey = 0, wval = 0;
    for (size_t i = 0; i < n; i++) {
        param_key(i, key, sizeof key);
        int lk = (int)strlen(key);
        shown_value(sc, i, value, sizeof value);
        int lv = (int)strlen(value);
        wkey = lk > wkey ? lk : wkey;
        wval = lv > wval ? lv : wval;
    }
    for (size_t i = 0; i < n; i++) {
        param_key(i, key, sizeof key);
        shown_value(sc, i, value, sizeof value);
        origin_text(sc, i, from, sizeof from);
        fprintf(out, "%-*s = %-*s  [%s]\n", wkey, key, wval, value, from);
    }
}
