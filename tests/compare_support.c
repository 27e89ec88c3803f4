/* compare_support.c: the helpers of the compare tests (compare_support.h). */
#define _GNU_SOURCE
#include <dirent.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "compare_support.h"
#include "suites.h"

char cmp_tmpdir[256];

/* Run "ENV volev ARGS" in cmp_tmpdir (ENV: variable assignments or ""); stdout and stderr
 * go to out.txt and err.txt; returns the exit code. */
int cmp_volev_env(const char *env, const char *args)
{
    return vl_test_sh(cmp_tmpdir, "%s '%s' %s", env, vl_test_bin(), args);
}

int cmp_volev(const char *args) { return cmp_volev_env("", args); }

/* Nothing in DIR but the listed names (no temporary files left). */
void cmp_assert_only(const char *dir, const char *const *names, size_t n)
{
    char path[512];
    snprintf(path, sizeof path, "%s/%s", cmp_tmpdir, dir);
    DIR *d = opendir(path);
    ck_assert_ptr_nonnull(d);
    struct dirent *e;
    while ((e = readdir(d))) {
        if (strcmp(e->d_name, ".") == 0 || strcmp(e->d_name, "..") == 0)
            continue;
        size_t i = 0;
        while (i < n && strcmp(e->d_name, names[i]) != 0)
            i++;
        ck_assert_msg(i < n, "unexpected file %s/%s", dir, e->d_name);
    }
    closedir(d);
}

/* The lines of text (modified in place), NULL-terminated, malloc'd array. */
char **cmp_lines_of(char *text)
{
    size_t n = 1;
    for (const char *p = text; *p; p++)
        n += *p == '\n';
    char **l = calloc(n + 1, sizeof *l);
    ck_assert_ptr_nonnull(l);
    size_t k = 0;
    for (char *s = text; s && *s;) {
        char *nl = strchr(s, '\n');
        if (nl)
            *nl = '\0';
        l[k++] = s;
        s = nl ? nl + 1 : NULL;
    }
    return l;
}

/* Split s at sep (each occurrence, or runs of blanks when sep is ' ') into at most max
 * fields; returns the count. */
size_t cmp_fields(char *s, char sep, char **f, size_t max)
{
    size_t n = 0;
    if (sep == ' ') {
        for (char *t = strtok(s, " \t"); t && n < max; t = strtok(NULL, " \t"))
            f[n++] = t;
        return n;
    }
    for (;;) {
        char *c = strchr(s, sep);
        if (n < max)
            f[n++] = s;
        if (!c)
            break;
        *c = '\0';
        s = c + 1;
    }
    return n;
}


cmp_srow *cmp_read_summary(const char *file, size_t *n)
{
    char *text = vl_test_slurp(cmp_tmpdir, file, NULL);
    ck_assert_ptr_nonnull(text);
    char **l = cmp_lines_of(text);
    cmp_srow *rows = NULL;
    size_t k = 0, cap = 0;
    int header = 0;
    for (size_t i = 0; l[i]; i++) {
        if (l[i][0] == '#')
            continue;
        if (!header) {
            ck_assert_str_eq(l[i], "name,value,unit");
            header = 1;
            continue;
        }
        char *f[4];
        ck_assert_int_eq(cmp_fields(l[i], ',', f, 4), 3);
        if (k == cap) {
            cap = cap ? 2 * cap : 64;
            rows = realloc(rows, cap * sizeof *rows);
            ck_assert_ptr_nonnull(rows);
        }
        snprintf(rows[k].name, sizeof rows[k].name, "%s", f[0]);
        snprintf(rows[k].value, sizeof rows[k].value, "%s", f[1]);
        snprintf(rows[k].unit, sizeof rows[k].unit, "%s", f[2]);
        k++;
    }
    free(l);
    free(text);
    *n = k;
    return rows;
}

const char *cmp_summary_value(const cmp_srow *rows, size_t n, const char *name,
                              const char *unit)
{
    for (size_t i = 0; i < n; i++)
        if (strcmp(rows[i].name, name) == 0 && strcmp(rows[i].unit, unit) == 0)
            return rows[i].value;
    return NULL;
}


cmp_erow *cmp_read_events(const char *file, size_t *n)
{
    char *text = vl_test_slurp(cmp_tmpdir, file, NULL);
    ck_assert_ptr_nonnull(text);
    char **l = cmp_lines_of(text);
    cmp_erow *rows = calloc(64, sizeof *rows);
    ck_assert_ptr_nonnull(rows);
    size_t k = 0;
    int header = 0;
    for (size_t i = 0; l[i]; i++) {
        if (l[i][0] == '#')
            continue;
        if (!header) {
            ck_assert_str_eq(l[i], "time_yr,event,detail");
            header = 1;
            continue;
        }
        char *f[3];
        ck_assert_int_ge(cmp_fields(l[i], ',', f, 3), 2);
        size_t j = 0;
        while (j < k && strcmp(rows[j].kind, f[1]) != 0)
            j++;
        if (j == k && k < 64) {
            snprintf(rows[k].kind, sizeof rows[k].kind, "%s", f[1]);
            snprintf(rows[k].time, sizeof rows[k].time, "%s", f[0]);
            k++;
        }
    }
    free(l);
    free(text);
    *n = k;
    return rows;
}

const char *cmp_first_event(const cmp_erow *rows, size_t n, const char *kind)
{
    for (size_t i = 0; i < n; i++)
        if (strcmp(rows[i].kind, kind) == 0)
            return rows[i].time;
    return NULL;
}

/* The whitespace-separated cells of the first line of stdout whose first cell is c0
 * (and second c1, unless NULL); returns the count, 0 if no such line. */
size_t cmp_table_row(const char *out, const char *c0, const char *c1, char (*cells)[128],
                     size_t max)
{
    char *text = strdup(out);
    ck_assert_ptr_nonnull(text);
    char **l = cmp_lines_of(text);
    size_t n = 0;
    for (size_t i = 0; l[i] && n == 0; i++) {
        char *f[16];
        size_t k = cmp_fields(l[i], ' ', f, 16);
        if (k >= 2 && strcmp(f[0], c0) == 0 && (!c1 || strcmp(f[1], c1) == 0)) {
            for (n = 0; n < k && n < max; n++)
                snprintf(cells[n], sizeof cells[n], "%s", f[n]);
        }
    }
    free(l);
    free(text);
    return n;
}


/* Two short histories of the demo candidate, to 1 Gyr: "wet" (demo.cfg) and "dry"
 * (demo-dry.cfg), each well under a second. */
void cmp_make_runs(void)
{
    char args[4096];
    snprintf(args, sizeof args, "run '%s/scenarios/demo.cfg' --set run.end_yr=1e9 -o wet",
             vl_test_top());
    ck_assert_int_eq(cmp_volev(args), 0);
    snprintf(args, sizeof args, "run '%s/scenarios/demo-dry.cfg' --set run.end_yr=1e9 -o dry",
             vl_test_top());
    ck_assert_int_eq(cmp_volev(args), 0);
}

/* |a - b| small against their size (both printed with 10 significant digits). */
void cmp_assert_close_text(const char *got, double expected)
{
    char *end;
    double v = strtod(got, &end);
    ck_assert_msg(*got && *end == '\0', "'%s' is not a number", got);
    ck_assert_msg(fabs(v - expected) <= 1e-9 * fabs(expected) + 1e-300,
                  "'%s' differs from %.12g", got, expected);
}

/* Line number (1-based) of the first line of FILE starting with prefix. */
int cmp_line_starting(const char *file, const char *prefix)
{
    char *text = vl_test_slurp(cmp_tmpdir, file, NULL);
    ck_assert_ptr_nonnull(text);
    char **l = cmp_lines_of(text);
    int found = 0;
    for (int i = 0; l[i] && !found; i++)
        if (strncmp(l[i], prefix, strlen(prefix)) == 0)
            found = i + 1;
    free(l);
    free(text);
    ck_assert_msg(found > 0, "%s has no line starting '%s'", file, prefix);
    return found;
}

/* Replace line n (1-based) of FILE by text. */
void cmp_replace_line(const char *file, int n, const char *text)
{
    char *old = vl_test_slurp(cmp_tmpdir, file, NULL);
    ck_assert_ptr_nonnull(old);
    char **l = cmp_lines_of(old);
    char path[512];
    snprintf(path, sizeof path, "%s/%s", cmp_tmpdir, file);
    FILE *f = fopen(path, "w");
    ck_assert_ptr_nonnull(f);
    for (int i = 0; l[i]; i++)
        fprintf(f, "%s\n", i + 1 == n ? text : l[i]);
    fclose(f);
    free(l);
    free(old);
}