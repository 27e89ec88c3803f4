/* catalogue.c: the planet-catalogue reader (catalogue.h; format in docs/catalogue.md).
 * One candidate per CSV row; each value column maps to a scenario key. The CSV reader
 * (csv.h, with double quotes) checks the lines, the quoting and the field counts; the
 * header and the cells are checked here; whether a full key exists and whether a value
 * is within its bounds is left to the scenario loader, which receives the cells as
 * overrides. */
#include "volev/catalogue.h"

#include <errno.h>
#include <math.h>
#include <stdarg.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "volev/csv.h"
#include "volev/number.h"
#include "volev/params.h"
#include "volev/scenario.h"
#include "volev/text.h"

/* Short column names and the scenario keys they stand for; their values are numbers. */
static const struct {
    const char *name;
    const char *key;
} short_names[] = {
    {"star_mass_msun", "star.mass_msun"},
    {"star_teff_k", "star.teff_k"},
    {"star_luminosity_lsun", "star.luminosity_lsun"},
    {"star_age_yr", "star.present_age_yr"},
    {"planet_mass_mearth", "planet.mass_mearth"},
    {"planet_radius_rearth", "planet.radius_rearth"},
    {"orbit_au", "planet.orbit_au"},
    {"eccentricity", "planet.eccentricity"},
    {"dipole_moment_earth", "planet.dipole_moment_earth"},
    {"water_to", "inventory.surface_water_to"},
    {"co2_bar", "inventory.co2_bar"},
    {"n2_bar", "inventory.n2_bar"},
};
#define NSHORT (sizeof short_names / sizeof short_names[0])

#define NAME_COLUMN "name"

/* The CSV reader's settings for catalogues: double quotes, the catalogue's line limit. */
static const vl_csv_options catalogue_csv = {VL_CSV_QUOTES, 0, VL_CATALOGUE_LINE_MAX, 0,
                                             "catalogue", "CSV text"};

/* Reader state: the header once read, the catalogue being filled, the name index. */
typedef struct parser {
    const char *path;         /* file name in messages (may be NULL) */
    int line;                 /* line of the record being read */
    int header_line;          /* line of the header, 0 before it */
    size_t name_field;        /* field index of the name column */
    unsigned char *numeric;   /* per value column: 1 if its cells must be numbers */
    vl_catalogue *cat;        /* being filled; owned until handed back */
    size_t cap;               /* rows allocated in cat */
    size_t *slot;             /* open-addressing index of names: row + 1, 0 = free */
    size_t nslot;             /* size of slot, a power of two (0 before the first row) */
} parser;

/* ---------------------------------------------------------------- messages */

/* Records an input error at the current line (printf-style message). */
__attribute__((format(printf, 3, 4)))
static int fail(const parser *p, vl_status *st, const char *fmt, ...)
{
    char msg[VL_MSG_MAX];
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(msg, sizeof msg, fmt, ap);
    va_end(ap);
    return vl_fail(st, VL_ERR_INPUT, p->path, p->line, "%s", msg);
}

static int out_of_memory(vl_status *st)
{
    return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
}

/* The bounded, escaped excerpt of s that messages quote (text.h). */
static const char *shown(const char *s, char *buf, size_t n)
{
    return vl_text_excerpt_str(s, buf, n);
}

/* ---------------------------------------------------------------- value checks */

/* A whole-field finite decimal number (number.h: no "nan", "inf", hexadecimal, spaces,
 * trailing text or underflow). */
static int is_number(const char *s)
{
    double v;
    return vl_number_parse_str(s, &v) == VL_NUMBER_OK;
}

/* A bare word [A-Za-z_][A-Za-z0-9_]* that does not read as a non-finite number ("nan", "inf"). */
static int is_word(const char *s)
{
    static const char alpha[] = "abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ_";
    if (!*s || !strchr(alpha, *s))
        return 0;
    for (const char *q = s; *q; q++)
        if (!strchr(alpha, *q) && !(*q >= '0' && *q <= '9'))
            return 0;
    char *end;
    double v = strtod(s, &end);
    return !(end != s && *end == '\0' && !isfinite(v));
}

/* A plausible scenario key: letters, digits, '_' and '.', no empty part between dots. */
static int is_key(const char *s)
{
    if (s[0] == '.' || s[strlen(s) - 1] == '.' || strstr(s, ".."))
        return 0;
    for (const char *q = s; *q; q++)
        if (!(*q == '_' || *q == '.' || (*q >= '0' && *q <= '9') || (*q >= 'a' && *q <= 'z') ||
              (*q >= 'A' && *q <= 'Z')))
            return 0;
    return 1;
}

/* ---------------------------------------------------------------- columns */

const char *vl_catalogue_short_key(const char *name)
{
    for (size_t i = 0; i < NSHORT; i++)
        if (strcmp(name, short_names[i].name) == 0)
            return short_names[i].key;
    return NULL;
}

/* 1 if key is the key of a short name (its cells are numbers whichever way it is written). */
static int numeric_key(const char *key)
{
    for (size_t i = 0; i < NSHORT; i++)
        if (strcmp(key, short_names[i].key) == 0)
            return 1;
    return 0;
}

/* The only scenario key whose last part is name, into buf; 0 if none or several. */
static int unique_leaf(const char *name, char *buf, size_t n)
{
    char key[512];
    int found = 0;
    for (size_t i = 0, count = vl_param_count(); i < count; i++) {
        const vl_param *p;
        void *base;
        const char *prefix;
        vl_param_at(NULL, i, &p, &base, &prefix);
        if (!p)
            continue;
        snprintf(key, sizeof key, "%s%s", prefix, p->key);
        const char *leaf = strrchr(key, '.');
        if (strcmp(leaf ? leaf + 1 : key, name) != 0)
            continue;
        if (found++)
            return 0;
        snprintf(buf, n, "%s", key);
    }
    return found == 1;
}

/* The error for a header name that is neither a short name, nor 'name', nor dotted:
 * the accepted short names, and the full key it is the last part of or the closest
 * short name. */
static int unknown_column(const parser *p, const char *f, vl_status *st)
{
    char hint[600], full[512], list[512], fs[VL_EXCERPT_SIZE];
    size_t used = (size_t)snprintf(list, sizeof list, "%s", NAME_COLUMN);
    const char *best = NAME_COLUMN;
    size_t best_d = vl_edit_distance(f, NAME_COLUMN);
    for (size_t i = 0; i < NSHORT; i++) {
        used += (size_t)snprintf(list + used, sizeof list - used, ", %s", short_names[i].name);
        size_t d = vl_edit_distance(f, short_names[i].name);
        if (d < best_d)
            best_d = d, best = short_names[i].name;
    }
    size_t limit = strlen(f) / 3 > 2 ? strlen(f) / 3 : 2;
    if (unique_leaf(f, full, sizeof full))
        snprintf(hint, sizeof hint, " (did you mean the full key '%s'?)", full);
    else if (best_d <= limit)
        snprintf(hint, sizeof hint, " (did you mean '%s'?)", best);
    else
        snprintf(hint, sizeof hint, " (closest short name: '%s')", best);
    return fail(p, st, "unknown column '%s'%s; columns are %s, or a full scenario key with "
                "dots such as escape.xuv_efficiency",
                shown(f, fs, sizeof fs), hint, list);
}

/* Reads the header: at most VL_CATALOGUE_COLS_MAX columns, one 'name', every other a
 * short name or a plausible full key, no scenario key twice. */
static int read_header(parser *p, const vl_csv_record *rec, vl_status *st)
{
    size_t n = rec->n;
    char fs[VL_EXCERPT_SIZE], fs2[VL_EXCERPT_SIZE];
    if (n > VL_CATALOGUE_COLS_MAX)
        return fail(p, st, "the header has %zu columns; at most %d are allowed (name included)",
                    n, VL_CATALOGUE_COLS_MAX);
    vl_catalogue *c = p->cat;
    c->ncols = n; /* room for n value columns while the name column is not found */
    c->keys = calloc(n, sizeof *c->keys);
    c->headers = calloc(n, sizeof *c->headers);
    p->numeric = calloc(n, 1);
    if (!c->keys || !c->headers || !p->numeric)
        return out_of_memory(st);
    int have_name = 0;
    for (size_t k = 0, col = 0; k < n; k++) {
        const char *f = rec->field[k], *key = f;
        if (!*f)
            return fail(p, st, "header field %zu is empty: every column needs a name", k + 1);
        if (strlen(f) > VL_CATALOGUE_FIELD_MAX)
            return fail(p, st, "header field %zu is longer than %d bytes", k + 1,
                        VL_CATALOGUE_FIELD_MAX);
        if (strcmp(f, NAME_COLUMN) == 0) {
            if (have_name)
                return fail(p, st, "column '" NAME_COLUMN "' appears twice");
            have_name = 1;
            p->name_field = k;
            continue;
        }
        if (strchr(f, '.')) {
            if (!is_key(f))
                return fail(p, st, "column '%s': not a scenario key (letters, digits, '_' and "
                            "'.', no empty part between dots)", shown(f, fs, sizeof fs));
        } else if (!(key = vl_catalogue_short_key(f))) {
            return unknown_column(p, f, st);
        }
        for (size_t j = 0; j < col; j++) {
            if (strcmp(c->keys[j], key) != 0)
                continue;
            if (strcmp(c->headers[j], f) == 0)
                return fail(p, st, "column '%s' appears twice", shown(f, fs, sizeof fs));
            return fail(p, st, "columns '%s' and '%s' both set %s",
                        shown(c->headers[j], fs2, sizeof fs2), shown(f, fs, sizeof fs), key);
        }
        p->numeric[col] = (unsigned char)numeric_key(key);
        if (!(c->headers[col] = strdup(f)) || !(c->keys[col] = strdup(key)))
            return out_of_memory(st);
        col++;
    }
    if (!have_name)
        return fail(p, st, "the header has no '" NAME_COLUMN "' column (each candidate needs "
                    "a name)");
    c->ncols = n - 1;
    p->header_line = p->line;
    p->cat->header_line = p->line;
    return VL_OK;
}

/* ---------------------------------------------------------------- rows */

/* FNV-1a, 64 bit (Fowler, Noll, Vo; public-domain description). */
static uint64_t hash_name(const char *s)
{
    uint64_t h = 14695981039346656037u;
    for (; *s; s++)
        h = (h ^ (unsigned char)*s) * 1099511628211u;
    return h;
}

/* The index slot holding name, or the free slot where it would go. */
static size_t *name_slot(const parser *p, const char *name)
{
    size_t mask = p->nslot - 1, i = (size_t)hash_name(name) & mask;
    while (p->slot[i] && strcmp(p->cat->names[p->slot[i] - 1], name) != 0)
        i = (i + 1) & mask;
    return &p->slot[i];
}

/* Keeps the name index at most half full. */
static int index_grow(parser *p, vl_status *st)
{
    if (2 * (p->cat->nrows + 1) <= p->nslot)
        return VL_OK;
    size_t *old = p->slot, nold = p->nslot;
    p->nslot = nold ? 2 * nold : 64;
    p->slot = calloc(p->nslot, sizeof *p->slot);
    if (!p->slot) {
        p->slot = old;
        p->nslot = nold;
        return out_of_memory(st);
    }
    for (size_t i = 0; i < nold; i++)
        if (old[i])
            *name_slot(p, p->cat->names[old[i] - 1]) = old[i];
    free(old);
    return VL_OK;
}

/* Makes room for one more row in names, cells and lines. */
static int rows_grow(parser *p, vl_status *st)
{
    vl_catalogue *c = p->cat;
    if (c->nrows < p->cap)
        return VL_OK;
    size_t cap = p->cap ? 2 * p->cap : 16;
    char **names = realloc(c->names, cap * sizeof *names);
    if (names)
        c->names = names;
    char ***cells = realloc(c->cells, cap * sizeof *cells);
    if (cells)
        c->cells = cells;
    int *lines = realloc(c->lines, cap * sizeof *lines);
    if (lines)
        c->lines = lines;
    if (!names || !cells || !lines)
        return out_of_memory(st);
    p->cap = cap;
    return VL_OK;
}

/* One cell: empty, or a number (short-name and mapped columns), or a number or bare
 * word (other full keys), at most VL_CATALOGUE_FIELD_MAX bytes. */
static int check_cell(const parser *p, size_t col, const char *f, vl_status *st)
{
    char fs[VL_EXCERPT_SIZE];
    const char *h = p->cat->headers[col];
    if (strlen(f) > VL_CATALOGUE_FIELD_MAX)
        return fail(p, st, "column '%s': value longer than %d bytes", h, VL_CATALOGUE_FIELD_MAX);
    if (!*f || is_number(f))
        return VL_OK;
    double v;
    int kind = vl_number_parse_str(f, &v);
    if (kind == VL_NUMBER_HEX || kind == VL_NUMBER_UNDERFLOW)
        return fail(p, st, "column '%s': '%s' %s", h, shown(f, fs, sizeof fs),
                    vl_number_why(kind));
    if (p->numeric[col])
        return fail(p, st, "column '%s': expected a finite number, got '%s'", h,
                    shown(f, fs, sizeof fs));
    if (is_word(f))
        return VL_OK;
    return fail(p, st, "column '%s': expected a finite number or a bare word (letters, digits "
                "and '_', not starting with a digit), got '%s'", h, shown(f, fs, sizeof fs));
}

/* Reads one candidate (the CSV reader has checked that it has as many fields as the
 * header): a new non-empty name, valid cells; stores the name and the non-empty cells in
 * one allocation. */
static int read_row(parser *p, const vl_csv_record *rec, vl_status *st)
{
    vl_catalogue *c = p->cat;
    char fs[VL_EXCERPT_SIZE];
    size_t n = rec->n;
    char *const *field = rec->field;
    if (c->nrows >= VL_CATALOGUE_ROWS_MAX)
        return fail(p, st, "more than %d candidates; split the catalogue",
                    VL_CATALOGUE_ROWS_MAX);
    const char *name = field[p->name_field];
    if (!*name)
        return fail(p, st, "column '" NAME_COLUMN "': empty candidate name");
    if (strlen(name) > VL_CATALOGUE_FIELD_MAX)
        return fail(p, st, "column '" NAME_COLUMN "': name longer than %d bytes",
                    VL_CATALOGUE_FIELD_MAX);
    int rc = index_grow(p, st);
    if (rc)
        return rc;
    size_t *slot = name_slot(p, name);
    if (*slot)
        return fail(p, st, "candidate '%s' appears twice: on line %d and on line %d",
                    shown(name, fs, sizeof fs), c->lines[*slot - 1], p->line);
    size_t size = c->ncols * sizeof(char *) + strlen(name) + 1;
    for (size_t k = 0, col = 0; k < n; k++) {
        if (k == p->name_field)
            continue;
        if ((rc = check_cell(p, col++, field[k], st)))
            return rc;
        if (*field[k])
            size += strlen(field[k]) + 1;
    }
    if ((rc = rows_grow(p, st)))
        return rc;
    char **block = malloc(size);
    if (!block)
        return out_of_memory(st);
    char *text = (char *)(block + c->ncols);
    for (size_t k = 0, col = 0; k < n; k++) {
        if (k == p->name_field)
            continue;
        const char *f = field[k];
        block[col++] = *f ? text : NULL;
        if (*f)
            text = stpcpy(text, f) + 1;
    }
    strcpy(text, name);
    c->cells[c->nrows] = block;
    c->names[c->nrows] = text;
    c->lines[c->nrows] = p->line;
    c->nrows++;
    *slot = c->nrows;
    return VL_OK;
}

/* ---------------------------------------------------------------- records */

/* The CSV reader's callback: the header, then one candidate per row; comments skipped. */
static int take_record(void *ctx, const vl_csv_record *rec, vl_status *st)
{
    parser *p = ctx;
    p->line = rec->line;
    if (rec->kind == VL_CSV_HEADER)
        return read_header(p, rec, st);
    if (rec->kind == VL_CSV_ROW)
        return read_row(p, rec, st);
    return VL_OK;
}

/* After the last line: a header and at least one candidate. */
static int finish(const parser *p, vl_status *st)
{
    if (!p->header_line)
        return vl_fail(st, VL_ERR_INPUT, p->path, 0,
                       "no header line: the catalogue is empty or holds only blank and comment "
                       "lines");
    if (p->cat->nrows == 0)
        return vl_fail(st, VL_ERR_INPUT, p->path, p->header_line,
                       "no candidates: the header is not followed by any row");
    return VL_OK;
}

/* ---------------------------------------------------------------- public */

void vl_catalogue_free(vl_catalogue *c)
{
    if (!c)
        return;
    for (size_t i = 0; i < c->ncols; i++) {
        if (c->keys)
            free(c->keys[i]);
        if (c->headers)
            free(c->headers[i]);
    }
    for (size_t r = 0; r < c->nrows; r++)
        free(c->cells[r]);
    free(c->keys);
    free(c->headers);
    free(c->cells);
    free(c->names);
    free(c->lines);
    free(c);
}

/* Runs the reader over a file (from_file: path) or a buffer (text, len, labelled path);
 * hands back the catalogue or NULL. */
static vl_catalogue *run(const char *path, int from_file, const char *text, size_t len,
                         vl_status *st)
{
    vl_status_clear(st);
    parser p = {.path = path};
    p.cat = calloc(1, sizeof *p.cat);
    int rc = p.cat ? VL_OK : out_of_memory(st);
    if (rc == VL_OK && from_file)
        rc = vl_csv_scan(path, &catalogue_csv, take_record, &p, st);
    else if (rc == VL_OK)
        rc = vl_csv_scan_buffer(text, len, path, &catalogue_csv, take_record, &p, st);
    if (rc == VL_OK)
        rc = finish(&p, st);
    free(p.slot);
    free(p.numeric);
    if (rc) {
        vl_catalogue_free(p.cat);
        return NULL;
    }
    return p.cat;
}

vl_catalogue *vl_catalogue_parse(const char *text, size_t len, const char *label, vl_status *st)
{
    if (!text && len > 0) {
        vl_fail(st, VL_ERR_INTERNAL, label, 0, "vl_catalogue_parse: no text");
        return NULL;
    }
    return run(label, 0, text, len, st);
}

vl_catalogue *vl_catalogue_read(const char *path, vl_status *st)
{
    return run(path, 1, NULL, 0, st);
}

size_t vl_catalogue_overrides(const vl_catalogue *c, size_t r, char **out)
{
    if (!c || r >= c->nrows)
        return 0;
    size_t n = 0;
    for (size_t col = 0; col < c->ncols; col++) {
        const char *v = c->cells[r][col];
        if (!v)
            continue;
        size_t size = strlen(c->keys[col]) + strlen(v) + 2;
        if (!(out[n] = malloc(size))) {
            while (n > 0)
                free(out[--n]);
            return SIZE_MAX;
        }
        snprintf(out[n++], size, "%s=%s", c->keys[col], v);
    }
    return n;
}
