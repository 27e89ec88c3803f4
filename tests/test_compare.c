/* test_compare.c: `volev compare` as a user meets it. Two short runs of the demo
 * candidate (wet and dry) are compared; every expected number is read from the runs'
 * own summary.csv and events.csv, never written into the test. Runs build/volev
 * ($VOLEV_BIN) through the shell, like test_cli.c. */
#define _GNU_SOURCE
#include <dirent.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "suites.h"

static char tmpdir[256];

/* Run "ENV volev ARGS" in tmpdir (ENV: variable assignments or ""); stdout and stderr
 * go to out.txt and err.txt; returns the exit code. */
static int volev_env(const char *env, const char *args)
{
    return vl_test_sh(tmpdir, "%s '%s' %s", env, vl_test_bin(), args);
}

static int volev(const char *args) { return volev_env("", args); }

/* Nothing in DIR but the listed names (no temporary files left). */
static void assert_only(const char *dir, const char *const *names, size_t n)
{
    char path[512];
    snprintf(path, sizeof path, "%s/%s", tmpdir, dir);
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
static char **lines_of(char *text)
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
static size_t fields(char *s, char sep, char **f, size_t max)
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

/* A data row (name,value,unit) of a summary.csv, read into malloc'd arrays. */
typedef struct srow {
    char name[128], value[64], unit[32];
} srow;

static srow *read_summary(const char *file, size_t *n)
{
    char *text = vl_test_slurp(tmpdir, file, NULL);
    ck_assert_ptr_nonnull(text);
    char **l = lines_of(text);
    srow *rows = NULL;
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
        ck_assert_int_eq(fields(l[i], ',', f, 4), 3);
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

static const char *summary_value(const srow *rows, size_t n, const char *name, const char *unit)
{
    for (size_t i = 0; i < n; i++)
        if (strcmp(rows[i].name, name) == 0 && strcmp(rows[i].unit, unit) == 0)
            return rows[i].value;
    return NULL;
}

/* Event kinds of an events.csv with the time of their first row, as written there. */
typedef struct erow {
    char kind[64], time[64];
} erow;

static erow *read_events(const char *file, size_t *n)
{
    char *text = vl_test_slurp(tmpdir, file, NULL);
    ck_assert_ptr_nonnull(text);
    char **l = lines_of(text);
    erow *rows = calloc(64, sizeof *rows);
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
        ck_assert_int_ge(fields(l[i], ',', f, 3), 2);
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

static const char *first_event(const erow *rows, size_t n, const char *kind)
{
    for (size_t i = 0; i < n; i++)
        if (strcmp(rows[i].kind, kind) == 0)
            return rows[i].time;
    return NULL;
}

/* The whitespace-separated cells of the first line of stdout whose first cell is c0
 * (and second c1, unless NULL); returns the count, 0 if no such line. */
static size_t table_row(const char *out, const char *c0, const char *c1, char (*cells)[128],
                        size_t max)
{
    char *text = strdup(out);
    ck_assert_ptr_nonnull(text);
    char **l = lines_of(text);
    size_t n = 0;
    for (size_t i = 0; l[i] && n == 0; i++) {
        char *f[16];
        size_t k = fields(l[i], ' ', f, 16);
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
static void make_runs(void)
{
    char args[4096];
    snprintf(args, sizeof args, "run '%s/scenarios/demo.cfg' --set run.end_yr=1e9 -o wet",
             vl_test_top());
    ck_assert_int_eq(volev(args), 0);
    snprintf(args, sizeof args, "run '%s/scenarios/demo-dry.cfg' --set run.end_yr=1e9 -o dry",
             vl_test_top());
    ck_assert_int_eq(volev(args), 0);
}

/* |a - b| small against their size (both printed with 10 significant digits). */
static void assert_close_text(const char *got, double expected)
{
    char *end;
    double v = strtod(got, &end);
    ck_assert_msg(*got && *end == '\0', "'%s' is not a number", got);
    ck_assert_msg(fabs(v - expected) <= 1e-9 * fabs(expected) + 1e-300,
                  "'%s' differs from %.12g", got, expected);
}

START_TEST(table_csv_and_figure)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-compare");
    make_runs();
    int gp = vl_test_have_gnuplot();
    int rc = volev("compare wet dry -o cmp");
    ck_assert_int_eq(rc, gp ? 0 : 6);
    char *out = vl_test_slurp(tmpdir, "out.txt", NULL);
    ck_assert_ptr_nonnull(out);
    /* labels default to the folders' base names */
    ck_assert_ptr_nonnull(strstr(out, "A: wet (wet)"));
    ck_assert_ptr_nonnull(strstr(out, "B: dry (dry)"));

    size_t nw, nd, new_, ned;
    srow *sw = read_summary("wet/summary.csv", &nw), *sd = read_summary("dry/summary.csv", &nd);
    erow *ew = read_events("wet/events.csv", &new_), *ed = read_events("dry/events.csv", &ned);

    /* final water of each run: the final_surface_water_to row (TO) of its summary.csv */
    const char *wa = summary_value(sw, nw, "final_surface_water_to", "TO");
    const char *wb = summary_value(sd, nd, "final_surface_water_to", "TO");
    ck_assert_ptr_nonnull(wa);
    ck_assert_ptr_nonnull(wb);
    char cells[8][128];
    ck_assert_int_eq(table_row(out, "final_surface_water_to", "TO", cells, 8), 6);
    ck_assert_str_eq(cells[2], wa);
    ck_assert_str_eq(cells[3], wb);
    /* B-A and B/A from the same two summary values */
    assert_close_text(cells[4], strtod(wb, NULL) - strtod(wa, NULL));
    assert_close_text(cells[5], strtod(wb, NULL) / strtod(wa, NULL));

    /* ocean_lost: the dry run's first one from its events.csv; the wet run's from its
     * own events.csv, or "never" when it has none */
    const char *la = first_event(ew, new_, "ocean_lost"), *lb = first_event(ed, ned, "ocean_lost");
    ck_assert_msg(lb != NULL, "the dry demo run logged no ocean_lost event");
    ck_assert_int_eq(table_row(out, "ocean_lost", NULL, cells, 8), 3);
    ck_assert_str_eq(cells[1], la ? la : "never");
    ck_assert_str_eq(cells[2], lb);
    /* every event kind of either run has its row */
    for (size_t i = 0; i < new_ + ned; i++) {
        const erow *e = i < new_ ? &ew[i] : &ed[i - new_];
        ck_assert_msg(table_row(out, e->kind, NULL, cells, 8) == 3, "no row for event %s", e->kind);
    }
    free(out);

    if (!gp) { /* gnuplot missing: the command failed and left nothing */
        ck_assert(!vl_test_exists(tmpdir, "cmp"));
        free(sw), free(sd), free(ew), free(ed);
        vl_test_tmp_remove(tmpdir);
        return;
    }

    /* compare.csv: every row against the two summary.csv and events.csv files */
    char *csv = vl_test_slurp(tmpdir, "cmp/compare.csv", NULL);
    ck_assert_ptr_nonnull(csv);
    char **l = lines_of(csv);
    size_t i = 0;
    while (l[i] && l[i][0] == '#')
        i++;
    ck_assert_ptr_nonnull(l[i]);
    ck_assert_str_eq(l[i], "quantity,unit,a,b,difference,ratio");
    size_t nsum = 0, nev = 0;
    for (i++; l[i]; i++) {
        char *f[8];
        ck_assert_msg(fields(l[i], ',', f, 8) == 6, "compare.csv row '%s'", l[i]);
        const char *a, *b;
        if (strncmp(f[0], "event:", 6) == 0) {
            ck_assert_str_eq(f[1], "yr");
            a = first_event(ew, new_, f[0] + 6);
            b = first_event(ed, ned, f[0] + 6);
            nev++;
        } else {
            a = summary_value(sw, nw, f[0], f[1]);
            b = summary_value(sd, nd, f[0], f[1]);
            nsum++;
        }
        ck_assert_msg(a || b, "compare.csv row %s (%s) is in neither run", f[0], f[1]);
        ck_assert_str_eq(f[2], a ? a : "");
        ck_assert_str_eq(f[3], b ? b : "");
        if (a && b) {
            double va = strtod(a, NULL), vb = strtod(b, NULL);
            assert_close_text(f[4], vb - va);
            if (va != 0.0)
                assert_close_text(f[5], vb / va);
            else
                ck_assert_str_eq(f[5], "");
        } else {
            ck_assert_str_eq(f[4], "");
            ck_assert_str_eq(f[5], "");
        }
    }
    /* one row per quantity of either summary, one per event kind of either run */
    size_t uq = nw, ue = new_;
    for (size_t j = 0; j < nd; j++)
        uq += summary_value(sw, nw, sd[j].name, sd[j].unit) == NULL;
    for (size_t j = 0; j < ned; j++)
        ue += first_event(ew, new_, ed[j].kind) == NULL;
    ck_assert_uint_eq(nsum, uq);
    ck_assert_uint_eq(nev, ue);
    free(l);
    free(csv);

    /* the figure: a PNG (its 8-byte signature), and no temporary file left */
    long size = 0;
    char *png = vl_test_slurp(tmpdir, "cmp/compare.png", &size);
    ck_assert_ptr_nonnull(png);
    ck_assert_int_gt(size, 8);
    ck_assert(memcmp(png, "\x89PNG\r\n\x1a\n", 8) == 0);
    free(png);
    static const char *const names[] = {"compare.csv", "compare.png"};
    assert_only("cmp", names, 2);

    free(sw), free(sd), free(ew), free(ed);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

START_TEST(formats_and_labels)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-compare");
    make_runs();
    if (!vl_test_have_gnuplot()) {
        ck_assert_int_eq(volev("compare wet dry --format pdf -o pdf"), 6);
        ck_assert(!vl_test_exists(tmpdir, "pdf"));
        vl_test_tmp_remove(tmpdir);
        return;
    }
    ck_assert_int_eq(volev("compare wet dry --labels Wet,Dry --format pdf -o pdf"), 0);
    vl_test_file_contains(tmpdir, "out.txt", "A: Wet (wet)");
    vl_test_file_contains(tmpdir, "out.txt", "B: Dry (dry)");
    vl_test_file_contains(tmpdir, "pdf/compare.csv", "# a = Wet: run folder wet");
    long size = 0;
    char *s = vl_test_slurp(tmpdir, "pdf/compare.pdf", &size);
    ck_assert_ptr_nonnull(s);
    ck_assert_int_gt(size, 4);
    ck_assert(memcmp(s, "%PDF", 4) == 0);
    free(s);
    static const char *const pdf[] = {"compare.csv", "compare.pdf"};
    assert_only("pdf", pdf, 2);

    /* a quote and a semicolon in a label reach the figure intact */
    ck_assert_int_eq(volev("compare wet dry --labels \"it's wet;,Dry\" -f svg -o svg"), 0);
    s = vl_test_slurp(tmpdir, "svg/compare.svg", NULL);
    ck_assert_ptr_nonnull(s);
    ck_assert_ptr_nonnull(strstr(s, "<svg"));
    ck_assert_ptr_nonnull(strstr(s, "it's wet;"));
    free(s);
    static const char *const svg[] = {"compare.csv", "compare.svg"};
    assert_only("svg", svg, 2);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

/* Line number (1-based) of the first line of FILE starting with prefix. */
static int line_starting(const char *file, const char *prefix)
{
    char *text = vl_test_slurp(tmpdir, file, NULL);
    ck_assert_ptr_nonnull(text);
    char **l = lines_of(text);
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
static void replace_line(const char *file, int n, const char *text)
{
    char *old = vl_test_slurp(tmpdir, file, NULL);
    ck_assert_ptr_nonnull(old);
    char **l = lines_of(old);
    char path[512];
    snprintf(path, sizeof path, "%s/%s", tmpdir, file);
    FILE *f = fopen(path, "w");
    ck_assert_ptr_nonnull(f);
    for (int i = 0; l[i]; i++)
        fprintf(f, "%s\n", i + 1 == n ? text : l[i]);
    fclose(f);
    free(l);
    free(old);
}

/* A fresh copy of the wet run as "bad". */
static void copy_wet(void)
{
    ck_assert_int_eq(vl_test_sh(tmpdir, "rm -rf bad && cp -R wet bad"), 0);
}

START_TEST(errors_leave_nothing)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-compare");
    make_runs();
    char want[256];

    /* command line */
    ck_assert_int_eq(volev("compare"), 2);
    ck_assert_int_eq(volev("compare wet"), 2);
    ck_assert_int_eq(volev("compare wet dry extra"), 2);
    ck_assert_int_eq(volev("compare wet dry --format gif"), 2);
    ck_assert_int_eq(volev("compare wet dry --labels justone"), 2);
    ck_assert_int_eq(volev("compare wet dry --bogus"), 2);

    /* a missing folder: I/O error naming it, no output folder made */
    ck_assert_int_eq(volev("compare wet no-such-run -o cmp"), 5);
    vl_test_file_contains(tmpdir, "err.txt", "no-such-run");
    ck_assert(!vl_test_exists(tmpdir, "cmp"));

    /* a folder without events.csv */
    copy_wet();
    ck_assert_int_eq(vl_test_sh(tmpdir, "rm bad/events.csv"), 0);
    ck_assert_int_eq(volev("compare wet bad -o cmp"), 5);
    vl_test_file_contains(tmpdir, "err.txt", "bad/events.csv");
    ck_assert(!vl_test_exists(tmpdir, "cmp"));

    /* a garbled row of summary.csv: bad input data, named by file and line */
    copy_wet();
    int n = line_starting("bad/summary.csv", "final_co2,");
    replace_line("bad/summary.csv", n, "final_co2;7.6e-05;bar");
    ck_assert_int_eq(volev("compare wet bad -o cmp"), 3);
    snprintf(want, sizeof want,
             "bad/summary.csv:%d: 1 fields, but the header on line %d has 3 (name,value,unit)",
             n, line_starting("bad/summary.csv", "name,value,unit"));
    vl_test_file_contains(tmpdir, "err.txt", want);
    ck_assert(!vl_test_exists(tmpdir, "cmp"));
    ck_assert(!vl_test_exists(tmpdir, "cmp/compare.csv"));

    /* a value that is not a number */
    copy_wet();
    replace_line("bad/summary.csv", n, "final_co2,7.6e-0x5,bar");
    ck_assert_int_eq(volev("compare bad dry -o cmp"), 3);
    snprintf(want, sizeof want, "bad/summary.csv:%d: value '7.6e-0x5' of final_co2 is not a number",
             n);
    vl_test_file_contains(tmpdir, "err.txt", want);
    ck_assert(!vl_test_exists(tmpdir, "cmp"));

    /* an empty value is a quantity without one (docs/columns.md), not an error: shown
     * empty, with no difference or ratio (issue 19: a dry run's final_dh_water) */
    copy_wet();
    replace_line("bad/summary.csv", n, "final_co2,,bar");
    ck_assert_int_eq(volev("compare wet bad"), 0);
    char *table = vl_test_slurp(tmpdir, "out.txt", NULL);
    ck_assert_ptr_nonnull(table);
    const char *row = strstr(table, "\nfinal_co2 ");
    ck_assert_ptr_nonnull(row);
    char line[512];
    snprintf(line, sizeof line, "%.*s", (int)strcspn(row + 1, "\n"), row + 1);
    int dashes = 0; /* "—" for the missing B-A and B/A */
    for (const char *d = line; (d = strstr(d, "\xe2\x80\x94")) != NULL; d += 3)
        dashes++;
    ck_assert_msg(dashes == 2, "%s", line);
    free(table);

    /* not a run's summary: wrong header */
    copy_wet();
    int h = line_starting("bad/summary.csv", "name,value,unit");
    replace_line("bad/summary.csv", h, "key,number");
    ck_assert_int_eq(volev("compare wet bad"), 3);
    snprintf(want, sizeof want, "bad/summary.csv:%d: not a volev run summary", h);
    vl_test_file_contains(tmpdir, "err.txt", want);

    /* a garbled event time */
    copy_wet();
    int e = line_starting("bad/events.csv", "time_yr,event,detail") + 1;
    replace_line("bad/events.csv", e, "soon,start,runaway");
    ck_assert_int_eq(volev("compare wet bad"), 3);
    snprintf(want, sizeof want, "bad/events.csv:%d: time_yr 'soon' is not a number", e);
    vl_test_file_contains(tmpdir, "err.txt", want);

    /* a column the figure needs is missing: named with its file before gnuplot runs;
     * the table alone does not read series.csv */
    copy_wet();
    int hs = line_starting("bad/series.csv", "time_yr,");
    char *text = vl_test_slurp(tmpdir, "bad/series.csv", NULL);
    char **sl = lines_of(text);
    char *col = strstr(sl[hs - 1], ",p_o2_bar,");
    ck_assert_ptr_nonnull(col);
    char header[8192];
    snprintf(header, sizeof header, "%.*s,p_o2,%s", (int)(col - sl[hs - 1]), sl[hs - 1],
             col + strlen(",p_o2_bar,"));
    free(sl);
    free(text);
    replace_line("bad/series.csv", hs, header);
    ck_assert_int_eq(volev("compare wet bad -o cmp"), 3);
    vl_test_file_contains(tmpdir, "err.txt", "bad/series.csv");
    vl_test_file_contains(tmpdir, "err.txt", "column 'p_o2_bar'");
    ck_assert(!vl_test_exists(tmpdir, "cmp"));
    ck_assert_int_eq(volev("compare wet bad"), 0);

    /* gnuplot missing: exit 6, and neither compare.csv nor temporary files remain (a
     * folder made for the output is removed, an existing one left empty) */
    ck_assert_int_eq(volev_env("PATH=/nonexistent", "compare wet dry -o cmp"), 6);
    vl_test_file_contains(tmpdir, "err.txt", "gnuplot");
    ck_assert(!vl_test_exists(tmpdir, "cmp"));
    ck_assert_int_eq(vl_test_sh(tmpdir, "mkdir keep"), 0);
    ck_assert_int_eq(volev_env("PATH=/nonexistent", "compare wet dry -o keep"), 6);
    assert_only("keep", NULL, 0);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

Suite *vl_suite_compare(void)
{
    Suite *s = suite_create("compare");
    TCase *tc = tcase_create("compare");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, table_csv_and_figure);
    tcase_add_test(tc, formats_and_labels);
    tcase_add_test(tc, errors_leave_nothing);
    suite_add_tcase(s, tc);
    return s;
}
