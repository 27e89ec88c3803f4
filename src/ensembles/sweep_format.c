/* sweep_format.c: the text forms of a member (sweep.h): its members.csv header and row,
 * and its journal line (exact numbers) with the parser that reads it back on resume. */
#include <errno.h>
#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "volev/climate.h"
#include "volev/output.h"
#include "volev/sweep.h"

/* A growing text buffer; bad after an allocation failure. */
typedef struct {
    char *s;
    size_t n, cap;
    int bad;
} buf_t;

/* Appends printf-style text to b. */
static void put(buf_t *b, const char *fmt, ...) __attribute__((format(printf, 2, 3)));
static void put(buf_t *b, const char *fmt, ...)
{
    if (b->bad)
        return;
    for (;;) {
        va_list ap;
        va_start(ap, fmt);
        int len = vsnprintf(b->s ? b->s + b->n : NULL, b->s ? b->cap - b->n : 0, fmt, ap);
        va_end(ap);
        if (len < 0) {
            b->bad = 1;
            return;
        }
        if (b->s && b->n + (size_t)len < b->cap) {
            b->n += (size_t)len;
            return;
        }
        size_t cap = (b->cap ? 2 * b->cap : 256) + (size_t)len;
        char *s = realloc(b->s, cap);
        if (!s) {
            b->bad = 1;
            return;
        }
        b->s = s;
        b->cap = cap;
    }
}

/* The text of b (the caller frees it), NULL after an allocation failure. */
static char *done(buf_t *b)
{
    if (b->bad || !b->s) {
        free(b->s);
        return NULL;
    }
    return b->s;
}

/* Whether text is one decimal number and nothing else ("-0.5", "1e3"). */
static int is_number(const char *text)
{
    char *end;
    errno = 0;
    (void)strtod(text, &end);
    return end != text && *end == '\0';
}

/* A CSV field: quoted when it holds a comma, quote or line break. Text that a spreadsheet
 * would take for a formula -- starting with '=', '+', '-', '@', a tab or a carriage return
 * -- gets a leading single quote (OWASP, "CSV Injection",
 * https://owasp.org/www-community/attacks/CSV_Injection), unless number_ok and it is a
 * plain number (a catalogue's "-0.5" stays a number). */
static void put_field_as(buf_t *b, const char *text, int number_ok)
{
    const char *lead =
        text[0] && strchr("=+-@\t\r", text[0]) && !(number_ok && is_number(text)) ? "'" : "";
    if (!strpbrk(text, ",\"\r\n")) {
        put(b, "%s%s", lead, text);
        return;
    }
    put(b, "\"%s", lead); /* the quote inside the quoted field */
    for (const char *p = text; *p; p++) {
        if (*p == '"')
            put(b, "\"\"");
        else if (*p == '\n' || *p == '\r')
            put(b, " ");
        else
            put(b, "%c", *p);
    }
    put(b, "\"");
}

/* A text field (a name, a header, a reason): neutralised whenever it starts like a
 * formula. */
static void put_field(buf_t *b, const char *text) { put_field_as(b, text, 0); }

/* ------------------------------------------------------------------ members.csv */

/* member, the member's values (axis keys, or candidate and its cells), status, outcome
 * class, final regime, the outcomes, steps and reason. */
char *vl_sweep_header(const vl_sweep *sw)
{
    buf_t b = {0};
    put(&b, "member");
    if (sw->catalogue_mode) {
        put(&b, ",candidate");
        for (size_t c = 0; c < sw->cat->ncols; c++) {
            put(&b, ",");
            put_field(&b, sw->cat->headers[c]);
        }
        if (sw->nwaters)
            put(&b, ",initial_water_to");
    } else {
        for (size_t a = 0; a < sw->k; a++)
            put(&b, ",%s", sw->axes[a].key);
    }
    put(&b, ",status,outcome,final_regime");
    for (int o = 0; o < VL_NOUT; o++)
        put(&b, ",%s", vl_outcome_name[o]);
    put(&b, ",steps,reason");
    return done(&b);
}

/* ",V" with 10 significant digits, or "," for an undefined (non-finite) value: the
 * number rule of every output file (vl_output_number). */
static void put_num(buf_t *b, double v)
{
    char num[64];
    vl_output_number(num, sizeof num, "%.10g", v);
    put(b, ",%s", num);
}

/* The row of res, in the header's columns. */
char *vl_sweep_row(const vl_sweep *sw, const vl_member *res)
{
    buf_t b = {0};
    long i = res->index;
    put(&b, "%ld", i);
    if (sw->catalogue_mode) {
        size_t per = sw->nwaters ? sw->nwaters : 1;
        size_t row = (size_t)i / per;
        put(&b, ",");
        put_field(&b, sw->cat->names[row]);
        for (size_t c = 0; c < sw->cat->ncols; c++) {
            put(&b, ",");
            if (sw->cat->cells[row][c]) /* a value: a number stays one */
                put_field_as(&b, sw->cat->cells[row][c], 1);
        }
        if (sw->nwaters)
            put_num(&b, sw->waters[(size_t)i % per]);
    } else {
        for (size_t a = 0; a < sw->k; a++)
            put_num(&b, sw->x[(size_t)i * sw->k + a]);
    }
    put(&b, ",%s,%s,%s", res->status == VL_OK ? "ok" : "failed", vl_class_name[res->cls],
        res->regime >= 0 ? vl_regime_name(res->regime) : "");
    for (int o = 0; o < VL_NOUT; o++)
        put_num(&b, res->out[o]);
    put(&b, ",%ld,", res->steps);
    put_field(&b, res->reason);
    return done(&b);
}

/* ------------------------------------------------------------------ the journal */

/* Journal: "index status regime cls steps | out... | water... | o2... | reason\n", numbers
 * %.17g (nan for undefined), tab-separated. */
char *vl_sweep_journal_line(const vl_member *res)
{
    buf_t b = {0};
    put(&b, "%ld\t%d\t%d\t%d\t%ld", res->index, res->status, res->regime, res->cls, res->steps);
    for (int o = 0; o < VL_NOUT; o++)
        put(&b, "\t%.17g", res->out[o]);
    for (int j = 0; j < VL_SWEEP_NT; j++)
        put(&b, "\t%.17g", res->water_to[j]);
    for (int j = 0; j < VL_SWEEP_NT; j++)
        put(&b, "\t%.17g", res->o2_bar[j]);
    put(&b, "\t");
    for (const char *p = res->reason; *p; p++)
        put(&b, "%c", *p == '\t' || *p == '\n' || *p == '\r' ? ' ' : *p);
    put(&b, "\n");
    return done(&b);
}

/* The number after a tab at *p (advanced past it); -1 if there is none. */
static int next_num(const char **p, double *v)
{
    char *end;
    if (**p != '\t')
        return -1;
    (*p)++;
    errno = 0;
    *v = strtod(*p, &end);
    if (end == *p)
        return -1;
    *p = end;
    return 0;
}

/* The five leading fields (index, status, regime, class, steps) into res; the rest of
 * the line, or NULL if they are malformed or out of range. */
static const char *parse_head(const char *line, vl_member *res)
{
    const char *p = line;
    double v[5];
    char *end;
    v[0] = strtod(p, &end);
    if (end == p)
        return NULL;
    p = end;
    for (int f = 1; f < 5; f++)
        if (next_num(&p, &v[f]))
            return NULL;
    res->index = (long)v[0];
    res->status = (int)v[1];
    res->regime = (int)v[2];
    res->cls = (int)v[3];
    res->steps = (long)v[4];
    if (res->index < 0 || res->cls < 0 || res->cls >= VL_NCLASS || res->regime < -1 ||
        res->regime >= VL_NREGIMES)
        return NULL;
    return p;
}

/* n numbers, each after a tab, into v; -1 if one is missing. */
static int next_nums(const char **p, double *v, int n)
{
    for (int k = 0; k < n; k++)
        if (next_num(p, &v[k]))
            return -1;
    return 0;
}

/* The inverse of vl_sweep_journal_line; -1 for a malformed line or one cut short by an
 * interruption (no final newline). */
int vl_sweep_journal_parse(const char *line, vl_member *res)
{
    size_t len = strlen(line);
    if (len == 0 || line[len - 1] != '\n')
        return -1; /* a line cut short by an interruption */
    memset(res, 0, sizeof *res);
    const char *p = parse_head(line, res);
    if (!p || next_nums(&p, res->out, VL_NOUT) || next_nums(&p, res->water_to, VL_SWEEP_NT) ||
        next_nums(&p, res->o2_bar, VL_SWEEP_NT) || *p != '\t')
        return -1;
    p++;
    size_t n = strlen(p) - 1; /* drop the newline */
    if (n >= sizeof res->reason)
        n = sizeof res->reason - 1;
    memcpy(res->reason, p, n);
    res->reason[n] = '\0';
    return 0;
}
