/* csv.h: the one CSV reader behind every CSV input of volev: stellar tracks
 * (src/input/track.c), candidate catalogues (src/input/catalogue.c), and the run outputs
 * read back by `volev compare` and `volev plot`. It never prints; errors come back in a
 * vl_status as FILE:LINE: message.
 *
 * The format, for every caller:
 * - UTF-8 text: a NUL byte, a control character other than TAB (a CR is accepted only
 *   right before the LF) or ill-formed UTF-8 is refused as binary data (text.h). A UTF-8
 *   byte-order mark at the very start is skipped. Line ends are LF or CRLF; the last line
 *   may lack one. One record per line: a line break never belongs to a field.
 * - A line whose first character other than spaces and tabs is '#' is a comment; lines of
 *   only spaces and tabs are blank. Both may come anywhere (before the header or between
 *   rows) and count in line numbers. Comments are handed to the caller, blank lines not.
 * - The first other line is the header, every later one a data row. Fields are separated
 *   by commas; spaces and tabs around a field are removed. A row must have as many fields
 *   as the header ("N fields, but the header on line L has M"); no caller needs rows of
 *   varying length, so there is no switch for them.
 * - With VL_CSV_QUOTES (RFC 4180 quoting, as in the catalogue) a field may be wrapped in
 *   double quotes: then it may hold commas, "" stands for one '"', spaces and tabs just
 *   inside the quotes are removed too, and only spaces and tabs may follow the closing
 *   quote; a '"' in a field that does not start with one is an error. Without it a '"'
 *   is an ordinary character.
 * - With VL_CSV_REST (not with VL_CSV_QUOTES) the last header column of a row takes the
 *   rest of the line, commas included: a free-text column such as events.csv's detail.
 *
 * Limits: a file that is not a regular file (a folder, a device, a FIFO, a socket) is
 * refused before anything is read; so is an input larger than size_max bytes
 * (VL_CSV_SIZE_MAX by default) and a line longer than line_max bytes (VL_CSV_LINE_MAX).
 * Memory: a scan holds one line at a time (at most line_max bytes and its fields); a table
 * holds the input once more, so size_max bounds it. A caller that streams and keeps
 * nothing per row may lift size_max (SIZE_MAX). */
#ifndef VOLEV_CSV_H
#define VOLEV_CSV_H

#include <stddef.h>

#include "volev/status.h"

/* Default largest input, bytes: 256 MiB, room for a million catalogue candidates
 * (VL_CATALOGUE_ROWS_MAX) of about 250 bytes each. */
#define VL_CSV_SIZE_MAX ((size_t)256 << 20)
/* Default longest line, bytes, its line end excluded: 1 MiB. */
#define VL_CSV_LINE_MAX ((size_t)1 << 20)
/* Returned by a record callback: stop reading here; not an error. */
#define VL_CSV_STOP (-1)
/* vl_csv_column: no such column. */
#define VL_CSV_NONE ((size_t)-1)

/* Switches of vl_csv_options.flags. */
enum vl_csv_flag {
    VL_CSV_QUOTES = 1,   /* double-quoted fields (RFC 4180, one line per record) */
    VL_CSV_REST = 2      /* a row's last column takes the rest of the line */
};

/* How a caller reads its files; a zeroed struct (or NULL) gives every default. */
typedef struct vl_csv_options {
    unsigned flags;          /* enum vl_csv_flag */
    size_t size_max;         /* largest input, bytes; 0: VL_CSV_SIZE_MAX, SIZE_MAX: none */
    size_t line_max;         /* longest line, bytes; 0: VL_CSV_LINE_MAX */
    size_t stop_after;       /* tables only: stop after this many data rows; 0: read all */
    const char *noun;        /* "cannot open NOUN: ..."; NULL: "CSV file" */
    const char *what;        /* "binary data, not WHAT: ..."; NULL: "CSV text" */
} vl_csv_options;

/* What a record is. */
typedef enum vl_csv_kind { VL_CSV_COMMENT, VL_CSV_HEADER, VL_CSV_ROW } vl_csv_kind;

/* One record as handed to a scan's callback; valid during the call only. */
typedef struct vl_csv_record {
    vl_csv_kind kind;
    const char *file;        /* the file name or label, for messages (may be NULL) */
    int line;                /* 1-based source line */
    size_t n;                /* fields; a comment has one: its line from the '#' on */
    char *const *field;      /* n NUL-terminated fields, trimmed and unquoted */
    size_t ncols;            /* fields of the header (0 before it) */
    char *const *header;     /* the header's fields (NULL before it) */
} vl_csv_record;

/* Called once per comment, once for the header and once per data row, in file order.
 * Returns VL_OK to go on, VL_CSV_STOP to end the scan successfully, or an error code
 * with st filled (the scan ends and returns it). */
typedef int (*vl_csv_fn)(void *ctx, const vl_csv_record *rec, vl_status *st);

/* Reads the file path record by record, calling fn for each; returns VL_OK or the code of
 * the first error (VL_ERR_IO when it cannot be opened or read, VL_ERR_INPUT when it is not
 * a regular file or for its content or size, VL_ERR_INTERNAL when out of memory), st filled.
 * A file without a header is not an error here: fn is simply never called with one. */
int vl_csv_scan(const char *path, const vl_csv_options *o, vl_csv_fn fn, void *ctx,
                vl_status *st);
/* The same over len bytes in memory (NULs allowed: they are refused as binary data);
 * label names it in messages (may be NULL). */
int vl_csv_scan_buffer(const char *text, size_t len, const char *label,
                       const vl_csv_options *o, vl_csv_fn fn, void *ctx, vl_status *st);

/* A data row of a table: ncols fields. */
typedef struct vl_csv_row {
    int line;                /* source line */
    char **field;            /* the fields; one allocation with their text */
} vl_csv_row;

/* A comment line of a table. */
typedef struct vl_csv_comment {
    int line;                /* source line */
    char *text;              /* the line from its '#' on, line end removed */
} vl_csv_comment;

/* A whole CSV file in memory; release with vl_csv_free only. */
typedef struct vl_csv_table {
    char *file;              /* the file name or label ("" if none) */
    int header_line;         /* line of the header; 0: none (empty or only comments) */
    size_t ncols;            /* header fields */
    char **header;           /* header names as written (trimmed, unquoted) */
    size_t nrows;
    vl_csv_row *rows;
    size_t ncomments;        /* comments before, between and (unless stopped) after rows */
    vl_csv_comment *comments;
    int stopped;             /* 1 if o->stop_after ended the reading early */
} vl_csv_table;

/* Reads path into a table (errors as vl_csv_scan); NULL on error, st filled. */
vl_csv_table *vl_csv_read(const char *path, const vl_csv_options *o, vl_status *st);
/* The same from len bytes in memory; label names it in messages (may be NULL). */
vl_csv_table *vl_csv_parse(const char *text, size_t len, const char *label,
                           const vl_csv_options *o, vl_status *st);
/* Releases t and everything it owns; accepts NULL. */
void vl_csv_free(vl_csv_table *t);

/* Index of the first header column called name (exact match), or VL_CSV_NONE. */
size_t vl_csv_column(const vl_csv_table *t, const char *name);

/* The header fields joined by commas into buf (size n > 0), cut with "..." when longer:
 * for messages that quote a header. Returns buf. */
char *vl_csv_join(char *const *field, size_t nfield, char *buf, size_t n);

#endif
