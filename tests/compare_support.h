/* compare_support.h: what the tests of `volev compare` share (test_compare.c,
 * test_compare_many.c): running build/volev in a temporary folder, reading its CSV
 * outputs and its printed table, and making the two short runs they compare. */
#ifndef VOLEV_TESTS_COMPARE_SUPPORT_H
#define VOLEV_TESTS_COMPARE_SUPPORT_H

#include <stddef.h>

/* The temporary folder every call runs in (vl_test_tmp_make). */
extern char cmp_tmpdir[256];

/* A data row (name,value,unit) of a summary.csv, read into malloc'd arrays. */
typedef struct cmp_srow {
    char name[128], value[64], unit[32];
} cmp_srow;

/* Event kinds of an events.csv with the time of their first row, as written there. */
typedef struct cmp_erow {
    char kind[64], time[64];
} cmp_erow;

/* Run "ENV volev ARGS" in cmp_tmpdir (ENV: variable assignments or ""); stdout and stderr
 * go to out.txt and err.txt; returns the exit code. */
int cmp_volev_env(const char *env, const char *args);
/* The same without variables. */
int cmp_volev(const char *args);

/* Nothing in DIR but the listed names (no temporary files left). */
void cmp_assert_only(const char *dir, const char *const *names, size_t n);

/* The lines of text (modified in place), NULL-terminated, malloc'd array. */
char **cmp_lines_of(char *text);

/* Split s at sep (each occurrence, or runs of blanks when sep is ' ') into at most max
 * fields; returns the count. */
size_t cmp_fields(char *s, char sep, char **f, size_t max);
/* The rows of the summary.csv FILE (its header checked), malloc'd; *n rows. */
cmp_srow *cmp_read_summary(const char *file, size_t *n);
/* The value of row name (unit), as written, or NULL. */
const char *cmp_summary_value(const cmp_srow *rows, size_t n, const char *name,
                              const char *unit);
/* The event kinds of the events.csv FILE with their first times, malloc'd; *n kinds. */
cmp_erow *cmp_read_events(const char *file, size_t *n);
/* The time of kind's first row, as written, or NULL. */
const char *cmp_first_event(const cmp_erow *rows, size_t n, const char *kind);

/* The whitespace-separated cells of the first line of stdout whose first cell is c0
 * (and second c1, unless NULL); returns the count, 0 if no such line. */
size_t cmp_table_row(const char *out, const char *c0, const char *c1, char (*cells)[128],
                     size_t max);

/* Two short histories of the demo candidate, to 1 Gyr: "wet" (demo.cfg) and "dry"
 * (demo-dry.cfg), each well under a second. */
void cmp_make_runs(void);

/* |a - b| small against their size (both printed with 10 significant digits). */
void cmp_assert_close_text(const char *got, double expected);

/* Line number (1-based) of the first line of FILE starting with prefix. */
int cmp_line_starting(const char *file, const char *prefix);

/* Replace line n (1-based) of FILE by text. */
void cmp_replace_line(const char *file, int n, const char *text);

#endif
