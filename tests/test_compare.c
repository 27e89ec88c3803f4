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
#include "volev/climate.h"
#include "volev/reservoir.h"

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

/* The value of column col in the last data row of the series.csv file, as written. */
static void last_series(const char *file, const char *col, char *out, size_t n)
{
    char *text = vl_test_slurp(tmpdir, file, NULL);
    ck_assert_ptr_nonnull(text);
    char **l = lines_of(text);
    size_t h = 0, last = 0;
    while (l[h] && l[h][0] == '#')
        h++;
    ck_assert_ptr_nonnull(l[h]);
    for (size_t i = h + 1; l[i]; i++)
        if (l[i][0] && l[i][0] != '#')
            last = i;
    ck_assert_uint_gt(last, h);
    char *hf[256], *rf[256];
    size_t nh = fields(l[h], ',', hf, 256), nr = fields(l[last], ',', rf, 256);
    ck_assert_uint_eq(nh, nr);
    size_t c = 0;
    while (c < nh && strcmp(hf[c], col) != 0)
        c++;
    ck_assert_msg(c < nh, "%s has no column %s", file, col);
    snprintf(out, n, "%s", rf[c]);
    free(l);
    free(text);
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
    /* B-A from the same two summary values; no B/A: the dry run ends without surface
     * water (a ratio with 0 means nothing, docs/figures.md) */
    assert_close_text(cells[4], strtod(wb, NULL) - strtod(wa, NULL));
    ck_assert_str_eq(wb, "0");
    ck_assert_str_eq(cells[5], "\xe2\x80\x94");
    /* B/A where both runs keep the quantity: water lost to space */
    const char *la_ = summary_value(sw, nw, "water_lost_to_space", "TO");
    const char *lb_ = summary_value(sd, nd, "water_lost_to_space", "TO");
    ck_assert_int_eq(table_row(out, "water_lost_to_space", "TO", cells, 8), 6);
    assert_close_text(cells[5], strtod(lb_, NULL) / strtod(la_, NULL));

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
    ck_assert_str_eq(l[i], "quantity,unit,a,b,difference,ratio,group");
    size_t nsum = 0, nev = 0, nfinal = 0;
    char fw[64], fd[64];
    for (i++; l[i]; i++) {
        char *f[8];
        ck_assert_msg(fields(l[i], ',', f, 8) == 7, "compare.csv row '%s'", l[i]);
        const char *a, *b;
        if (strncmp(f[0], "final:", 6) == 0) { /* the last row of series.csv */
            last_series("wet/series.csv", f[0] + 6, fw, sizeof fw);
            last_series("dry/series.csv", f[0] + 6, fd, sizeof fd);
            if (strcmp(f[0], "final:regime") == 0) { /* the code's name (docs/columns.md) */
                ck_assert_str_eq(f[1], "name");
                ck_assert_str_eq(f[2], vl_regime_name(atoi(fw)));
                ck_assert_str_eq(f[3], vl_regime_name(atoi(fd)));
                ck_assert_str_eq(f[4], "");
                ck_assert_str_eq(f[5], "");
                nfinal++;
                continue;
            }
            a = fw;
            b = fd;
            nfinal++;
        } else if (strncmp(f[0], "event:", 6) == 0) {
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
            /* a ratio, where given, is b / a; never with a zero (docs/figures.md) */
            if (f[5][0])
                assert_close_text(f[5], vb / va);
            if (va == 0.0 || vb == 0.0)
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
    ck_assert_uint_eq(nfinal, 3); /* regime, surface temperature and pressure */
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
    ck_assert_int_eq(volev("compare wet dry wet dry --labels a,b,c"), 2);
    vl_test_file_contains(tmpdir, "err.txt", "expected 4 names");
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

    /* a folder without series.csv: the table needs its last row (the final state) */
    copy_wet();
    ck_assert_int_eq(vl_test_sh(tmpdir, "rm bad/series.csv"), 0);
    ck_assert_int_eq(volev("compare wet bad"), 5);
    vl_test_file_contains(tmpdir, "err.txt", "bad/series.csv");

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
     * the table alone needs only the final-state columns of series.csv */
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

/* Line number (0-based) of the first line of text starting with prefix, or -1. */
static int line_of(const char *text, const char *prefix)
{
    char *copy = strdup(text);
    ck_assert_ptr_nonnull(copy);
    char **l = lines_of(copy);
    int found = -1;
    for (int i = 0; l[i] && found < 0; i++)
        if (strncmp(l[i], prefix, strlen(prefix)) == 0)
            found = i;
    free(l);
    free(copy);
    return found;
}

/* The fields of the compare.csv row whose first field is name, into f (modified copy
 * in *keep, to free); returns the count, 0 if none. */
static size_t csv_row(const char *csv, const char *name, char **f, size_t max, char **keep)
{
    char *copy = strdup(csv);
    ck_assert_ptr_nonnull(copy);
    char **l = lines_of(copy);
    size_t n = 0;
    for (size_t i = 0; l[i] && n == 0; i++)
        if (strncmp(l[i], name, strlen(name)) == 0 && l[i][strlen(name)] == ',')
            n = fields(l[i], ',', f, max);
    free(l);
    *keep = copy;
    return n;
}

/* Four runs (wet, dry and a copy of each): the table by topic, science before the
 * numerics; each run's value; compare.csv with one column per run and the ratios to the
 * first; a 13th folder refused. */
START_TEST(many_runs_by_topic)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-compare");
    make_runs();
    ck_assert_int_eq(vl_test_sh(tmpdir, "cp -R wet wet2 && cp -R dry dry2"), 0);
    int gp = vl_test_have_gnuplot();
    ck_assert_int_eq(volev("compare wet dry wet2 dry2 -o cmp4"), gp ? 0 : 6);
    char *out = vl_test_slurp(tmpdir, "out.txt", NULL);
    ck_assert_ptr_nonnull(out);
    ck_assert_ptr_nonnull(strstr(out, "C: wet2 (wet2)"));
    ck_assert_ptr_nonnull(strstr(out, "D: dry2 (dry2)"));

    /* topics in their order: every science heading before the numerics heading, and
     * the timing rows below it */
    static const char *const science[] = {"== final state ==", "== water and escape budgets",
                                          "== redox budget", "== isotopes",
                                          "== time in regimes and first events =="};
    int numerics = line_of(out, "== conservation, numerics and cost ==");
    ck_assert_int_ge(numerics, 0);
    int before = -1;
    for (size_t g = 0; g < sizeof science / sizeof science[0]; g++) {
        int at = line_of(out, science[g]);
        ck_assert_msg(at > before && at < numerics, "heading '%s' at line %d", science[g], at);
        before = at;
    }
    ck_assert_int_gt(line_of(out, "wall_time_s "), numerics);
    /* every row of this version's summary.csv has its topic (compare_groups.c) */
    ck_assert_int_lt(line_of(out, "== other quantities =="), 0);
    ck_assert_int_gt(line_of(out, "residual_H "), numerics);
    ck_assert_int_lt(line_of(out, "final_surface_water_to "), line_of(out, "water_lost_to_space "));

    /* each run's value as its summary.csv writes it; no B-A, B/A with four runs */
    size_t nw, nd;
    srow *sw = read_summary("wet/summary.csv", &nw), *sd = read_summary("dry/summary.csv", &nd);
    const char *wa = summary_value(sw, nw, "final_surface_water_to", "TO");
    const char *wb = summary_value(sd, nd, "final_surface_water_to", "TO");
    char cells[8][128];
    ck_assert_int_eq(table_row(out, "final_surface_water_to", "TO", cells, 8), 6);
    ck_assert_str_eq(cells[2], wa);
    ck_assert_str_eq(cells[3], wb);
    ck_assert_str_eq(cells[4], wa);
    ck_assert_str_eq(cells[5], wb);
    free(out);

    if (gp) {
        char *csv = vl_test_slurp(tmpdir, "cmp4/compare.csv", NULL);
        ck_assert_ptr_nonnull(csv);
        ck_assert_ptr_nonnull(strstr(csv, "# c = wet2: run folder wet2"));
        ck_assert_ptr_nonnull(
            strstr(csv, "\nquantity,unit,a,b,c,d,ratio_b,ratio_c,ratio_d,group\n"));
        char *f[12], *keep;
        /* the dry runs end without surface water (0 TO): no ratio to them; the copy of
         * the wet run has the very same value, ratio 1 */
        ck_assert_str_eq(wb, "0");
        ck_assert_uint_eq(csv_row(csv, "final_surface_water_to", f, 12, &keep), 10);
        ck_assert_str_eq(f[6], "");
        ck_assert_str_eq(f[7], "1");
        ck_assert_str_eq(f[8], "");
        ck_assert_str_eq(f[9], "final_state");
        free(keep);
        /* the groups of the rows never go back to an earlier topic */
        static const char *const order[] = {"final_state", "budgets", "redox", "isotopes",
                                            "regimes_events", "other", "numerics"};
        char *copy = strdup(csv);
        char **l = lines_of(copy);
        int last = 0, rows = 0;
        for (size_t i = 0; l[i]; i++) {
            if (l[i][0] == '#' || strncmp(l[i], "quantity,", 9) == 0)
                continue;
            const char *g = strrchr(l[i], ',') + 1;
            int k = 0;
            while (k < 7 && strcmp(g, order[k]) != 0)
                k++;
            ck_assert_msg(k < 7 && k >= last, "row '%s' out of topic order", l[i]);
            last = k;
            rows++;
        }
        ck_assert_int_eq(last, 6);
        ck_assert_int_gt(rows, 50);
        free(l);
        free(copy);
        free(csv);
        static const char *const names[] = {"compare.csv", "compare.png"};
        assert_only("cmp4", names, 2);
    }

    /* three runs make a table too; thirteen are refused before anything is read */
    ck_assert_int_eq(volev("compare wet dry wet2"), 0);
    vl_test_file_contains(tmpdir, "out.txt", "C: wet2 (wet2)");
    ck_assert_int_eq(volev("compare wet dry wet2 dry2 a b c d e f g h i -o big"), 2);
    vl_test_file_contains(tmpdir, "err.txt", "more than 12 folders ('i' is one too many)");
    ck_assert(!vl_test_exists(tmpdir, "big"));
    free(sw), free(sd);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

/* Set the value of summary row name in FILE to value. */
static void set_summary(const char *file, const char *name, const char *unit, const char *value)
{
    char prefix[160], text[200];
    snprintf(prefix, sizeof prefix, "%s,", name);
    snprintf(text, sizeof text, "%s,%s,%s", name, value, unit);
    replace_line(file, line_starting(file, prefix), text);
}

/* Values that are numerically zero get no ratio: a subnormal number left of a quantity
 * that decayed to nothing, and a reservoir's mass below its depletion floor (with the
 * quantities derived from that reservoir); values above the floor do. */
START_TEST(no_ratio_of_numerical_zeros)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-compare");
    make_runs();
    ck_assert_int_eq(vl_test_sh(tmpdir, "cp -R wet low && cp -R wet high"), 0);
    char v[64];
    /* the floors are the reservoirs' depletion bands (include/volev/reservoir.h) */
    double o2_floor = vl_reservoir_floor(VL_R_O2), h2_floor = vl_reservoir_floor(VL_R_H2);
    snprintf(v, sizeof v, "%.10g", 0.5 * o2_floor);
    set_summary("low/summary.csv", "final_atm_o2", "kg", v);
    snprintf(v, sizeof v, "%.10g", 0.5 * h2_floor);
    set_summary("low/summary.csv", "final_atm_h2", "kg", v);
    /* 1.5e-318: subnormal (below DBL_MIN, C11 5.2.4.2.2), as in issue 19 */
    set_summary("low/summary.csv", "total_photochem_o", "kg", "1.5e-318");
    snprintf(v, sizeof v, "%.10g", 2.0 * h2_floor);
    set_summary("high/summary.csv", "final_atm_h2", "kg", v);

    ck_assert_int_eq(volev("compare wet low"), 0);
    char *out = vl_test_slurp(tmpdir, "out.txt", NULL);
    ck_assert_ptr_nonnull(out);
    char cells[8][128];
    static const char *const none[][2] = {{"final_atm_o2", "kg"},
                                          {"o2_accumulated", "bar"},
                                          {"final_atm_h2", "kg"},
                                          {"total_photochem_o", "kg"}};
    for (size_t i = 0; i < sizeof none / sizeof none[0]; i++) {
        ck_assert_int_eq(table_row(out, none[i][0], none[i][1], cells, 8), 6);
        ck_assert_msg(strcmp(cells[5], "\xe2\x80\x94") == 0, "%s: ratio '%s' of a numerical zero",
                      none[i][0], cells[5]);
        ck_assert_msg(strcmp(cells[4], "\xe2\x80\x94") != 0, "%s: no difference", none[i][0]);
    }
    /* a value the runs share keeps its ratio */
    ck_assert_int_eq(table_row(out, "final_co2", "bar", cells, 8), 6);
    ck_assert_str_eq(cells[5], "1");
    free(out);

    /* above the floor: a ratio, b / a of the two values as written */
    ck_assert_int_eq(volev("compare wet high"), 0);
    out = vl_test_slurp(tmpdir, "out.txt", NULL);
    ck_assert_int_eq(table_row(out, "final_atm_h2", "kg", cells, 8), 6);
    assert_close_text(cells[5], strtod(cells[3], NULL) / strtod(cells[2], NULL));
    free(out);
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
    tcase_add_test(tc, many_runs_by_topic);
    tcase_add_test(tc, no_ratio_of_numerical_zeros);
    suite_add_tcase(s, tc);
    return s;
}
