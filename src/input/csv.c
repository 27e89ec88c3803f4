/* csv.c: the CSV reader (csv.h): lines from a file (through a bounded line buffer) or a
 * memory buffer; each line checked as text, classified (blank, comment, header, row),
 * split into fields and handed to a callback. The table functions are one such callback.
 * A file is opened without blocking and refused unless it is a regular file, so a FIFO or
 * a device never stalls or floods the reader. */
#include "volev/csv.h"

#include <errno.h>
#include <fcntl.h>
#include <limits.h>
#include <stdarg.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include "volev/text.h"

#define LABEL_MAX 320      /* "column '<header>'" and the like */
#define SHOWN_HEADER 80    /* bytes of a header quoted in a field-count message */

/* State of one scan. */
typedef struct reader {
    const char *file;          /* name in messages (may be NULL) */
    unsigned flags;            /* enum vl_csv_flag */
    size_t size_max, line_max;
    const char *noun, *what;   /* for messages, defaults filled in */
    vl_csv_fn fn;
    void *ctx;
    int line;                  /* current 1-based line */
    int header_line;           /* 0 before the header */
    size_t ncols;              /* header fields */
    char **header;             /* header fields (one allocation with their text) */
    char shown[SHOWN_HEADER + 4]; /* the header joined, for field-count messages */
    char *scratch;             /* decoded fields of the current line */
    size_t scratch_cap;
    char **field;              /* fields of the current line */
    size_t nfield, field_cap;
    int stop;                  /* the callback asked to stop */
} reader;

/* ---------------------------------------------------------------- messages */

/* Records an input error at the current line (printf-style message). */
__attribute__((format(printf, 3, 4)))
static int fail(const reader *r, vl_status *st, const char *fmt, ...)
{
    char msg[VL_MSG_MAX];
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(msg, sizeof msg, fmt, ap);
    va_end(ap);
    return vl_fail(st, VL_ERR_INPUT, r->file, r->line, "%s", msg);
}

static int out_of_memory(vl_status *st)
{
    return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
}

static int fail_long(const reader *r, vl_status *st)
{
    return fail(r, st, "line longer than %zu bytes", r->line_max);
}

/* The input of size bytes is over the limit. */
static int fail_size(const reader *r, uintmax_t size, vl_status *st)
{
    return vl_fail(st, VL_ERR_INPUT, r->file, 0,
                   "%s of %ju bytes is larger than the limit of %zu bytes", r->noun, size,
                   r->size_max);
}

char *vl_csv_join(char *const *field, size_t nfield, char *buf, size_t n)
{
    size_t used = 0;
    buf[0] = '\0';
    for (size_t k = 0; k < nfield && used < n; k++)
        used += (size_t)snprintf(buf + used, n - used, "%s%s", k ? "," : "", field[k]);
    if (used >= n && n >= 4) {
        size_t cut = n - 4;
        while (cut > 0 && ((unsigned char)buf[cut] & 0xC0) == 0x80)
            cut--; /* not inside a UTF-8 character */
        memcpy(buf + cut, "...", 4);
    }
    return buf;
}

/* How messages call field k of the current line: by its header once there is one. */
static const char *field_label(const reader *r, size_t k, char *buf, size_t n)
{
    if (!r->header_line)
        snprintf(buf, n, "header field %zu", k + 1);
    else if (k < r->ncols)
        snprintf(buf, n, "column '%s'", r->header[k]);
    else
        snprintf(buf, n, "field %zu (the header has %zu)", k + 1, r->ncols);
    return buf;
}

/* The line s[0..len) (line end removed) is UTF-8 text: no NUL, no control character but
 * TAB. */
static int check_text(const reader *r, const char *s, size_t len, vl_status *st)
{
    int fault;
    size_t i = vl_text_scan(s, len, &fault);
    unsigned char c = i < len ? (unsigned char)s[i] : 0;
    switch (fault) {
    case VL_TEXT_OK:
        return VL_OK;
    case VL_TEXT_NUL:
        return fail(r, st, "NUL byte at byte %zu of the line: binary data, not %s", i + 1,
                    r->what);
    case VL_TEXT_CONTROL:
        if (c == '\r')
            return fail(r, st, "carriage return at byte %zu of the line (only CRLF line ends "
                        "are accepted)", i + 1);
        return fail(r, st, "binary data, not %s: control character 0x%02X at byte %zu of the "
                    "line", r->what, c, i + 1);
    default:
        return fail(r, st, "binary data, not %s: byte 0x%02X at byte %zu of the line is not "
                    "UTF-8 text", r->what, c, i + 1);
    }
}

/* ---------------------------------------------------------------- fields */

static int is_blank(char ch) { return ch == ' ' || ch == '\t'; }

/* Room for the decoded fields of a line of n bytes: they never need more than n + 1. */
static int reserve_scratch(reader *r, size_t n, vl_status *st)
{
    if (n + 1 <= r->scratch_cap)
        return VL_OK;
    size_t cap = r->scratch_cap ? r->scratch_cap : 256;
    while (cap < n + 1)
        cap *= 2;
    char *p = realloc(r->scratch, cap);
    if (!p)
        return out_of_memory(st);
    r->scratch = p;
    r->scratch_cap = cap;
    return VL_OK;
}

/* Appends field f to the current line's list. */
static int push_field(reader *r, char *f, vl_status *st)
{
    if (r->nfield == r->field_cap) {
        size_t cap = r->field_cap ? 2 * r->field_cap : 16;
        char **p = realloc(r->field, cap * sizeof *p);
        if (!p)
            return out_of_memory(st);
        r->field = p;
        r->field_cap = cap;
    }
    r->field[r->nfield++] = f;
    return VL_OK;
}

/* Copies s[0..len) without its surrounding blanks to *o (s may be *o itself) as a field;
 * advances *o past it. */
static int put_trimmed(reader *r, const char *s, size_t len, char **o, vl_status *st)
{
    while (len > 0 && is_blank(*s))
        s++, len--;
    while (len > 0 && is_blank(s[len - 1]))
        len--;
    char *f = *o;
    memmove(f, s, len); /* a quoted field is trimmed in place */
    f[len] = '\0';
    *o = f + len + 1;
    return push_field(r, f, st);
}

/* Splits s[0..len) at every comma; with VL_CSV_REST a row's last column takes the rest. */
static int split_plain(reader *r, const char *s, size_t len, vl_status *st)
{
    char *o = r->scratch;
    int rest = (r->flags & VL_CSV_REST) && r->header_line;
    for (size_t i = 0;;) {
        const char *comma = memchr(s + i, ',', len - i);
        if (rest && r->nfield + 1 == r->ncols)
            comma = NULL;
        size_t end = comma ? (size_t)(comma - s) : len;
        int rc = put_trimmed(r, s + i, end - i, &o, st);
        if (rc || !comma)
            return rc;
        i = end + 1;
    }
}

/* Decodes the quoted field that starts at s[*i] (a '"') into *o, up to the comma after
 * it or the end; "" inside stands for '"'. */
static int quoted_field(reader *r, const char *s, size_t len, size_t *i, char **o,
                        vl_status *st)
{
    char lab[LABEL_MAX], *start = *o, *out = *o;
    size_t k = r->nfield, j = *i + 1;
    for (;; j++) {
        if (j >= len)
            return fail(r, st, "%s: unterminated quote (a quoted field must end with '\"' on "
                        "the same line)", field_label(r, k, lab, sizeof lab));
        if (s[j] == '"' && j + 1 < len && s[j + 1] == '"')
            *out++ = s[j++];
        else if (s[j] == '"')
            break;
        else
            *out++ = s[j];
    }
    for (j++; j < len && is_blank(s[j]); j++)
        ;
    if (j < len && s[j] != ',')
        return fail(r, st, "%s: text after the closing quote",
                    field_label(r, k, lab, sizeof lab));
    *i = j;
    return put_trimmed(r, start, (size_t)(out - start), o, st);
}

/* Splits s[0..len) into fields with RFC 4180 double quotes (one line per record). */
static int split_quoted(reader *r, const char *s, size_t len, vl_status *st)
{
    char lab[LABEL_MAX], *o = r->scratch;
    for (size_t i = 0;; i++) {
        while (i < len && is_blank(s[i]))
            i++;
        int rc;
        if (i < len && s[i] == '"') {
            rc = quoted_field(r, s, len, &i, &o, st);
        } else {
            size_t start = i;
            for (; i < len && s[i] != ','; i++)
                if (s[i] == '"')
                    return fail(r, st, "%s: '\"' inside an unquoted field (quote the whole "
                                "field and double the quotes inside)",
                                field_label(r, r->nfield, lab, sizeof lab));
            rc = put_trimmed(r, s + start, i - start, &o, st);
        }
        if (rc || i >= len)
            return rc;
    }
}

/* ---------------------------------------------------------------- records */

/* Keeps a copy of the current line's fields as the header. */
static int keep_header(reader *r, vl_status *st)
{
    size_t size = r->nfield * sizeof(char *);
    for (size_t k = 0; k < r->nfield; k++)
        size += strlen(r->field[k]) + 1;
    char **h = malloc(size);
    if (!h)
        return out_of_memory(st);
    char *text = (char *)(h + r->nfield);
    for (size_t k = 0; k < r->nfield; k++) {
        h[k] = text;
        text = stpcpy(text, r->field[k]) + 1;
    }
    r->header = h;
    r->ncols = r->nfield;
    r->header_line = r->line;
    vl_csv_join(h, r->ncols, r->shown, sizeof r->shown);
    return VL_OK;
}

/* A data row has as many fields as the header. */
static int check_count(const reader *r, vl_status *st)
{
    if (r->nfield == r->ncols)
        return VL_OK;
    char hint[SHOWN_HEADER + 16];
    if (r->nfield > r->ncols && (r->flags & VL_CSV_QUOTES))
        snprintf(hint, sizeof hint, " (a name or value containing a comma needs double quotes)");
    else
        snprintf(hint, sizeof hint, " (%s)", r->shown);
    return fail(r, st, "%zu fields, but the header on line %d has %zu%s", r->nfield,
                r->header_line, r->ncols, hint);
}

/* Hands the current fields to the callback as a record of kind k. */
static int deliver(reader *r, vl_csv_kind k, vl_status *st)
{
    vl_csv_record rec = {k, r->file, r->line, r->nfield, r->field, r->ncols, r->header};
    int rc = r->fn(r->ctx, &rec, st);
    if (rc == VL_CSV_STOP) {
        r->stop = 1;
        return VL_OK;
    }
    if (rc != VL_OK && st->code == VL_OK)
        return vl_fail(st, VL_ERR_INTERNAL, r->file, r->line, "CSV callback failed (%d)", rc);
    return rc;
}

/* A comment: the line from its '#' on, as one field. */
static int take_comment(reader *r, const char *s, size_t n, vl_status *st)
{
    memcpy(r->scratch, s, n);
    r->scratch[n] = '\0';
    r->nfield = 0;
    int rc = push_field(r, r->scratch, st);
    return rc ? rc : deliver(r, VL_CSV_COMMENT, st);
}

/* Takes one line (without its '\n', with a CR before it if there was one): its length and
 * bytes checked, a blank line skipped, a comment, the header or a row delivered. */
static int take_line(reader *r, const char *s, size_t n, vl_status *st)
{
    if (r->line == INT_MAX)
        return fail(r, st, "more than %d lines", INT_MAX);
    r->line++;
    if (n > 0 && s[n - 1] == '\r')
        n--;
    if (n > r->line_max)
        return fail_long(r, st);
    if (r->line == 1 && n >= 3 && memcmp(s, "\xEF\xBB\xBF", 3) == 0) {
        s += 3; /* UTF-8 byte-order mark */
        n -= 3;
    }
    int rc = check_text(r, s, n, st);
    size_t i = 0;
    while (i < n && is_blank(s[i]))
        i++;
    if (rc || i == n)
        return rc;
    if ((rc = reserve_scratch(r, n, st)))
        return rc;
    if (s[i] == '#')
        return take_comment(r, s + i, n - i, st);
    r->nfield = 0;
    rc = r->flags & VL_CSV_QUOTES ? split_quoted(r, s, n, st) : split_plain(r, s, n, st);
    if (rc)
        return rc;
    if (!r->header_line)
        return (rc = keep_header(r, st)) ? rc : deliver(r, VL_CSV_HEADER, st);
    return (rc = check_count(r, st)) ? rc : deliver(r, VL_CSV_ROW, st);
}

/* ---------------------------------------------------------------- sources */

/* Splits a memory buffer into lines. */
static int read_buffer(reader *r, const char *text, size_t len, vl_status *st)
{
    int rc = VL_OK;
    for (size_t i = 0; rc == VL_OK && !r->stop && i < len;) {
        const char *nl = memchr(text + i, '\n', len - i);
        size_t seg = nl ? (size_t)(nl - (text + i)) : len - i;
        rc = take_line(r, text + i, seg, st);
        i += seg + 1;
    }
    return rc;
}

/* A line being gathered from a file's chunks. */
typedef struct linebuf {
    char *s;
    size_t n, cap;
} linebuf;

/* Appends s[0..n) to the line; an over-long line fails as soon as it is seen (room is
 * left for a CR before the LF). */
static int line_append(reader *r, linebuf *b, const char *s, size_t n, vl_status *st)
{
    if (b->n + n > r->line_max + 1) {
        if (r->line < INT_MAX)
            r->line++;
        return fail_long(r, st);
    }
    if (b->n + n > b->cap) {
        size_t cap = b->cap ? b->cap : 4096;
        while (cap < b->n + n)
            cap *= 2;
        char *p = realloc(b->s, cap);
        if (!p)
            return out_of_memory(st);
        b->s = p;
        b->cap = cap;
    }
    memcpy(b->s + b->n, s, n);
    b->n += n;
    return VL_OK;
}

/* Takes the lines of one chunk of a file; a line cut by the chunk's end stays in b. */
static int read_chunk(reader *r, linebuf *b, const char *chunk, size_t got, vl_status *st)
{
    int rc = VL_OK;
    for (size_t i = 0; rc == VL_OK && !r->stop && i < got;) {
        const char *nl = memchr(chunk + i, '\n', got - i);
        size_t seg = nl ? (size_t)(nl - (chunk + i)) : got - i;
        rc = line_append(r, b, chunk + i, seg, st);
        i += seg;
        if (rc == VL_OK && nl) {
            rc = take_line(r, b->s, b->n, st);
            b->n = 0;
            i++;
        }
    }
    return rc;
}

/* Reads f chunk by chunk, holding at most one line; counts the bytes against the limit
 * (the file may have grown since it was measured). */
static int read_stream(reader *r, FILE *f, vl_status *st)
{
    enum { CHUNK = 1 << 16 };
    char *chunk = malloc(CHUNK);
    linebuf b = {NULL, 0, 0};
    int rc = chunk ? VL_OK : out_of_memory(st);
    size_t got, total = 0;
    while (rc == VL_OK && !r->stop && (got = fread(chunk, 1, CHUNK, f)) > 0) {
        total += got;
        rc = total > r->size_max ? fail_size(r, total, st) : read_chunk(r, &b, chunk, got, st);
    }
    if (rc == VL_OK && !r->stop && ferror(f))
        rc = vl_fail(st, VL_ERR_IO, r->file, 0, "read error: %s", strerror(errno));
    if (rc == VL_OK && !r->stop && b.n > 0)
        rc = take_line(r, b.s, b.n, st);
    free(chunk);
    free(b.s);
    return rc;
}

/* Opens path for reading if it is a regular file within the size limit; NULL otherwise,
 * st filled. Opened without blocking, so that a FIFO is refused instead of waited on. */
static FILE *open_regular(const reader *r, const char *path, vl_status *st)
{
    int fd = open(path, O_RDONLY | O_NONBLOCK | O_CLOEXEC);
    if (fd < 0) {
        vl_fail(st, VL_ERR_IO, path, 0, "cannot open %s: %s", r->noun, strerror(errno));
        return NULL;
    }
    struct stat sb;
    int flags;
    FILE *f = NULL;
    if (fstat(fd, &sb) != 0 || (flags = fcntl(fd, F_GETFL)) < 0 ||
        fcntl(fd, F_SETFL, flags & ~O_NONBLOCK) != 0)
        vl_fail(st, VL_ERR_IO, path, 0, "cannot read %s: %s", r->noun, strerror(errno));
    else if (!S_ISREG(sb.st_mode)) /* the wrong kind of input, not a failed read */
        vl_fail(st, VL_ERR_INPUT, path, 0, "cannot read %s: it is %s, not a regular file",
                r->noun, vl_text_file_kind(sb.st_mode));
    else if ((uintmax_t)sb.st_size > r->size_max)
        fail_size(r, (uintmax_t)sb.st_size, st);
    else if (!(f = fdopen(fd, "rb")))
        vl_fail(st, VL_ERR_IO, path, 0, "cannot read %s: %s", r->noun, strerror(errno));
    if (!f)
        close(fd);
    return f;
}

/* A reader for the options o (NULL: defaults). */
static reader reader_new(const char *file, const vl_csv_options *o, vl_csv_fn fn, void *ctx)
{
    static const vl_csv_options defaults = {0, 0, 0, 0, NULL, NULL};
    if (!o)
        o = &defaults;
    reader r;
    memset(&r, 0, sizeof r);
    r.file = file;
    r.flags = o->flags;
    r.size_max = o->size_max ? o->size_max : VL_CSV_SIZE_MAX;
    r.line_max = o->line_max ? o->line_max : VL_CSV_LINE_MAX;
    r.noun = o->noun ? o->noun : "CSV file";
    r.what = o->what ? o->what : "CSV text";
    r.fn = fn;
    r.ctx = ctx;
    return r;
}

static void reader_free(reader *r)
{
    free(r->header);
    free(r->scratch);
    free(r->field);
}

int vl_csv_scan(const char *path, const vl_csv_options *o, vl_csv_fn fn, void *ctx,
                vl_status *st)
{
    vl_status_clear(st);
    reader r = reader_new(path, o, fn, ctx);
    FILE *f = open_regular(&r, path, st);
    if (!f)
        return st->code;
    int rc = read_stream(&r, f, st);
    fclose(f);
    reader_free(&r);
    return rc;
}

int vl_csv_scan_buffer(const char *text, size_t len, const char *label,
                       const vl_csv_options *o, vl_csv_fn fn, void *ctx, vl_status *st)
{
    vl_status_clear(st);
    reader r = reader_new(label, o, fn, ctx);
    if (!text && len > 0)
        return vl_fail(st, VL_ERR_INTERNAL, label, 0, "vl_csv_scan_buffer: no text");
    if (len > r.size_max)
        return fail_size(&r, len, st);
    int rc = read_buffer(&r, text, len, st);
    reader_free(&r);
    return rc;
}
