/* csv_table.c: whole CSV files in memory (csv.h): a scan whose callback copies the
 * comments, the header and the rows into a vl_csv_table. */
#include "volev/csv.h"

#include <stdlib.h>
#include <string.h>

static int out_of_memory(vl_status *st)
{
    return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
}

/* A table being filled by the table callback. */
typedef struct builder {
    vl_csv_table *t;
    size_t cap_rows, cap_comments;
    size_t stop_after;
} builder;

/* A copy of the n fields f in one allocation: the pointers, then their text. */
static char **copy_fields(char *const *f, size_t n)
{
    size_t size = n * sizeof(char *);
    for (size_t k = 0; k < n; k++)
        size += strlen(f[k]) + 1;
    char **p = malloc(size ? size : 1);
    if (!p)
        return NULL;
    char *text = (char *)(p + n);
    for (size_t k = 0; k < n; k++) {
        p[k] = text;
        text = stpcpy(text, f[k]) + 1;
    }
    return p;
}

/* Makes room for one more element of size sz in *p (n held, *cap allocated). */
static int grow(void **p, size_t *cap, size_t n, size_t sz)
{
    if (n < *cap)
        return 0;
    size_t c = *cap ? 2 * *cap : 16;
    void *q = realloc(*p, c * sz);
    if (!q)
        return -1;
    *p = q;
    *cap = c;
    return 0;
}

/* The table callback: comments, the header and rows copied into b->t. */
static int table_take(void *ctx, const vl_csv_record *rec, vl_status *st)
{
    builder *b = ctx;
    vl_csv_table *t = b->t;
    if (rec->kind == VL_CSV_COMMENT) {
        if (grow((void **)&t->comments, &b->cap_comments, t->ncomments, sizeof *t->comments))
            return out_of_memory(st);
        vl_csv_comment *c = &t->comments[t->ncomments];
        if (!(c->text = strdup(rec->field[0])))
            return out_of_memory(st);
        c->line = rec->line;
        t->ncomments++;
        return VL_OK;
    }
    char **f = copy_fields(rec->field, rec->n);
    if (!f)
        return out_of_memory(st);
    if (rec->kind == VL_CSV_HEADER) {
        t->header = f;
        t->ncols = rec->n;
        t->header_line = rec->line;
        return VL_OK;
    }
    if (grow((void **)&t->rows, &b->cap_rows, t->nrows, sizeof *t->rows)) {
        free(f);
        return out_of_memory(st);
    }
    t->rows[t->nrows++] = (vl_csv_row){rec->line, f};
    if (b->stop_after && t->nrows == b->stop_after) {
        t->stopped = 1;
        return VL_CSV_STOP;
    }
    return VL_OK;
}

/* Reads a file (path) or a buffer (text, len) into a new table. */
static vl_csv_table *table_read(const char *path, const char *text, size_t len,
                                const char *label, const vl_csv_options *o, vl_status *st)
{
    builder b = {NULL, 0, 0, o ? o->stop_after : 0};
    const char *name = path ? path : label;
    b.t = calloc(1, sizeof *b.t);
    if (!b.t || !(b.t->file = strdup(name ? name : ""))) {
        vl_csv_free(b.t);
        vl_status_clear(st);
        out_of_memory(st);
        return NULL;
    }
    int rc = path ? vl_csv_scan(path, o, table_take, &b, st)
                  : vl_csv_scan_buffer(text, len, label, o, table_take, &b, st);
    if (rc != VL_OK) {
        vl_csv_free(b.t);
        return NULL;
    }
    return b.t;
}

vl_csv_table *vl_csv_read(const char *path, const vl_csv_options *o, vl_status *st)
{
    return table_read(path, NULL, 0, NULL, o, st);
}

vl_csv_table *vl_csv_parse(const char *text, size_t len, const char *label,
                           const vl_csv_options *o, vl_status *st)
{
    return table_read(NULL, text, len, label, o, st);
}

void vl_csv_free(vl_csv_table *t)
{
    if (!t)
        return;
    for (size_t r = 0; r < t->nrows; r++)
        free(t->rows[r].field);
    for (size_t c = 0; c < t->ncomments; c++)
        free(t->comments[c].text);
    free(t->rows);
    free(t->comments);
    free(t->header);
    free(t->file);
    free(t);
}

size_t vl_csv_column(const vl_csv_table *t, const char *name)
{
    for (size_t c = 0; t && c < t->ncols; c++)
        if (strcmp(t->header[c], name) == 0)
            return c;
    return VL_CSV_NONE;
}
