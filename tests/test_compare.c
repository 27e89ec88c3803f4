/* test_compare.c: `volev compare` as a user meets it. Two short runs of the demo
 * candidate (wet and dry) are compared; every expected number is read from the runs'
 * own summary.csv and events.csv, never written into the test. Runs build/volev
 * ($VOLEV_BIN) through the shell, like test_cli.c. */
#define _GNU_SOURCE
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "compare_support.h"
#include "suites.h"
#include "volev/climate.h"
#include "volev/reservoir.h"
#include "volev/units.h"

/* The value of column col in the last data row of the series.csv file, as written. */
static void last_series(const char *file, const char *col, char *out, size_t n)
{
    char *text = vl_test_slurp(cmp_tmpdir, file, NULL);
    ck_assert_ptr_nonnull(text);
    char **l = cmp_lines_of(text);
    size_t h = 0, last = 0;
    while (l[h] && l[h][0] == '#')
        h++;
    ck_assert_ptr_nonnull(l[h]);
    for (size_t i = h + 1; l[i]; i++)
        if (l[i][0] && l[i][0] != '#')
            last = i;
    ck_assert_uint_gt(last, h);
    char *hf[256], *rf[256];
    size_t nh = cmp_fields(l[h], ',', hf, 256), nr = cmp_fields(l[last], ',', rf, 256);
    ck_assert_uint_eq(nh, nr);
    size_t c = 0;
    while (c < nh && strcmp(hf[c], col) != 0)
        c++;
    ck_assert_msg(c < nh, "%s has no column %s", file, col);
    snprintf(out, n, "%s", rf[c]);
    free(l);
    free(text);
}

START_TEST(table_csv_and_figure)
{
    vl_test_tmp_make(cmp_tmpdir, sizeof cmp_tmpdir, "volev-compare");
    cmp_make_runs();
    int gp = vl_test_have_gnuplot();
    int rc = cmp_volev("compare wet dry -o cmp");
    ck_assert_int_eq(rc, gp ? 0 : 6);
    char *out = vl_test_slurp(cmp_tmpdir, "out.txt", NULL);
    ck_assert_ptr_nonnull(out);
    /* labels default to the folders' base names */
    ck_assert_ptr_nonnull(strstr(out, "A: wet (wet)"));
    ck_assert_ptr_nonnull(strstr(out, "B: dry (dry)"));

    size_t nw, nd, new_, ned;
    cmp_srow *sw = cmp_read_summary("wet/summary.csv", &nw);
    cmp_srow *sd = cmp_read_summary("dry/summary.csv", &nd);
    cmp_erow *ew = cmp_read_events("wet/events.csv", &new_);
    cmp_erow *ed = cmp_read_events("dry/events.csv", &ned);

    /* final water of each run: the final_surface_water_to row (TO) of its summary.csv */
    const char *wa = cmp_summary_value(sw, nw, "final_surface_water_to", "TO");
    const char *wb = cmp_summary_value(sd, nd, "final_surface_water_to", "TO");
    ck_assert_ptr_nonnull(wa);
    ck_assert_ptr_nonnull(wb);
    char cells[8][128];
    ck_assert_int_eq(cmp_table_row(out, "final_surface_water_to", "TO", cells, 8), 6);
    ck_assert_str_eq(cells[2], wa);
    ck_assert_str_eq(cells[3], wb);
    /* B-A from the same two summary values; no B/A: the dry run ends without surface
     * water (a ratio with 0 means nothing, docs/figures.md) */
    cmp_assert_close_text(cells[4], strtod(wb, NULL) - strtod(wa, NULL));
    ck_assert(strtod(wb, NULL) * VL_TO_KG < vl_reservoir_floor(VL_R_WATER)); /* below its floor: none */
    ck_assert_str_eq(cells[5], "\xe2\x80\x94");
    /* B/A where both runs keep the quantity: water lost to space */
    const char *la_ = cmp_summary_value(sw, nw, "water_lost_to_space", "TO");
    const char *lb_ = cmp_summary_value(sd, nd, "water_lost_to_space", "TO");
    ck_assert_int_eq(cmp_table_row(out, "water_lost_to_space", "TO", cells, 8), 6);
    cmp_assert_close_text(cells[5], strtod(lb_, NULL) / strtod(la_, NULL));

    /* ocean_lost: the dry run's first one from its events.csv; the wet run's from its
     * own events.csv, or "never" when it has none */
    const char *la = cmp_first_event(ew, new_, "ocean_lost");
    const char *lb = cmp_first_event(ed, ned, "ocean_lost");
    ck_assert_msg(lb != NULL, "the dry demo run logged no ocean_lost event");
    ck_assert_int_eq(cmp_table_row(out, "ocean_lost", NULL, cells, 8), 3);
    ck_assert_str_eq(cells[1], la ? la : "never");
    ck_assert_str_eq(cells[2], lb);
    /* every event kind of either run has its row */
    for (size_t i = 0; i < new_ + ned; i++) {
        const cmp_erow *e = i < new_ ? &ew[i] : &ed[i - new_];
        ck_assert_msg(cmp_table_row(out, e->kind, NULL, cells, 8) == 3, "no row for event %s",
                      e->kind);
    }
    free(out);

    if (!gp) { /* gnuplot missing: the command failed and left nothing */
        ck_assert(!vl_test_exists(cmp_tmpdir, "cmp"));
        free(sw), free(sd), free(ew), free(ed);
        vl_test_tmp_remove(cmp_tmpdir);
        return;
    }

    /* compare.csv: every row against the two summary.csv and events.csv files */
    char *csv = vl_test_slurp(cmp_tmpdir, "cmp/compare.csv", NULL);
    ck_assert_ptr_nonnull(csv);
    char **l = cmp_lines_of(csv);
    size_t i = 0;
    while (l[i] && l[i][0] == '#')
        i++;
    ck_assert_ptr_nonnull(l[i]);
    ck_assert_str_eq(l[i], "quantity,unit,a,b,difference,ratio,group");
    size_t nsum = 0, nev = 0, nfinal = 0;
    char fw[64], fd[64];
    for (i++; l[i]; i++) {
        char *f[8];
        ck_assert_msg(cmp_fields(l[i], ',', f, 8) == 7, "compare.csv row '%s'", l[i]);
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
            a = cmp_first_event(ew, new_, f[0] + 6);
            b = cmp_first_event(ed, ned, f[0] + 6);
            nev++;
        } else {
            a = cmp_summary_value(sw, nw, f[0], f[1]);
            b = cmp_summary_value(sd, nd, f[0], f[1]);
            nsum++;
        }
        ck_assert_msg(a || b, "compare.csv row %s (%s) is in neither run", f[0], f[1]);
        ck_assert_str_eq(f[2], a ? a : "");
        ck_assert_str_eq(f[3], b ? b : "");
        if (a && b) {
            double va = strtod(a, NULL), vb = strtod(b, NULL);
            cmp_assert_close_text(f[4], vb - va);
            /* a ratio, where given, is b / a; never with a zero (docs/figures.md) */
            if (f[5][0])
                cmp_assert_close_text(f[5], vb / va);
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
        uq += cmp_summary_value(sw, nw, sd[j].name, sd[j].unit) == NULL;
    for (size_t j = 0; j < ned; j++)
        ue += cmp_first_event(ew, new_, ed[j].kind) == NULL;
    ck_assert_uint_eq(nsum, uq);
    ck_assert_uint_eq(nfinal, 3); /* regime, surface temperature and pressure */
    ck_assert_uint_eq(nev, ue);
    free(l);
    free(csv);

    /* the figure: a PNG (its 8-byte signature), and no temporary file left */
    long size = 0;
    char *png = vl_test_slurp(cmp_tmpdir, "cmp/compare.png", &size);
    ck_assert_ptr_nonnull(png);
    ck_assert_int_gt(size, 8);
    ck_assert(memcmp(png, "\x89PNG\r\n\x1a\n", 8) == 0);
    free(png);
    static const char *const names[] = {"compare.csv", "compare.png"};
    cmp_assert_only("cmp", names, 2);

    free(sw), free(sd), free(ew), free(ed);
    vl_test_tmp_remove(cmp_tmpdir);
}
END_TEST

START_TEST(formats_and_labels)
{
    vl_test_tmp_make(cmp_tmpdir, sizeof cmp_tmpdir, "volev-compare");
    cmp_make_runs();
    if (!vl_test_have_gnuplot()) {
        ck_assert_int_eq(cmp_volev("compare wet dry --format pdf -o pdf"), 6);
        ck_assert(!vl_test_exists(cmp_tmpdir, "pdf"));
        vl_test_tmp_remove(cmp_tmpdir);
        return;
    }
    ck_assert_int_eq(cmp_volev("compare wet dry --labels Wet,Dry --format pdf -o pdf"), 0);
    vl_test_file_contains(cmp_tmpdir, "out.txt", "A: Wet (wet)");
    vl_test_file_contains(cmp_tmpdir, "out.txt", "B: Dry (dry)");
    vl_test_file_contains(cmp_tmpdir, "pdf/compare.csv", "# a = Wet: run folder wet");
    long size = 0;
    char *s = vl_test_slurp(cmp_tmpdir, "pdf/compare.pdf", &size);
    ck_assert_ptr_nonnull(s);
    ck_assert_int_gt(size, 4);
    ck_assert(memcmp(s, "%PDF", 4) == 0);
    free(s);
    static const char *const pdf[] = {"compare.csv", "compare.pdf"};
    cmp_assert_only("pdf", pdf, 2);

    /* a quote and a semicolon in a label reach the figure intact */
    ck_assert_int_eq(cmp_volev("compare wet dry --labels \"it's wet;,Dry\" -f svg -o svg"), 0);
    s = vl_test_slurp(cmp_tmpdir, "svg/compare.svg", NULL);
    ck_assert_ptr_nonnull(s);
    ck_assert_ptr_nonnull(strstr(s, "<svg"));
    ck_assert_ptr_nonnull(strstr(s, "it's wet;"));
    free(s);
    static const char *const svg[] = {"compare.csv", "compare.svg"};
    cmp_assert_only("svg", svg, 2);
    vl_test_tmp_remove(cmp_tmpdir);
}
END_TEST


/* A fresh copy of the wet run as "bad". */
static void copy_wet(void)
{
    ck_assert_int_eq(vl_test_sh(cmp_tmpdir, "rm -rf bad && cp -R wet bad"), 0);
}

START_TEST(errors_leave_nothing)
{
    vl_test_tmp_make(cmp_tmpdir, sizeof cmp_tmpdir, "volev-compare");
    cmp_make_runs();
    char want[256];

    /* command line */
    ck_assert_int_eq(cmp_volev("compare"), 2);
    ck_assert_int_eq(cmp_volev("compare wet"), 2);
    ck_assert_int_eq(cmp_volev("compare wet dry wet dry --labels a,b,c"), 2);
    vl_test_file_contains(cmp_tmpdir, "err.txt", "expected 4 names");
    ck_assert_int_eq(cmp_volev("compare wet dry --format gif"), 2);
    ck_assert_int_eq(cmp_volev("compare wet dry --labels justone"), 2);
    ck_assert_int_eq(cmp_volev("compare wet dry --bogus"), 2);

    /* a missing folder: I/O error naming it, no output folder made */
    ck_assert_int_eq(cmp_volev("compare wet no-such-run -o cmp"), 5);
    vl_test_file_contains(cmp_tmpdir, "err.txt", "no-such-run");
    ck_assert(!vl_test_exists(cmp_tmpdir, "cmp"));

    /* a folder without events.csv */
    copy_wet();
    ck_assert_int_eq(vl_test_sh(cmp_tmpdir, "rm bad/events.csv"), 0);
    ck_assert_int_eq(cmp_volev("compare wet bad -o cmp"), 5);
    vl_test_file_contains(cmp_tmpdir, "err.txt", "bad/events.csv");
    ck_assert(!vl_test_exists(cmp_tmpdir, "cmp"));

    /* a folder without series.csv: the table needs its last row (the final state) */
    copy_wet();
    ck_assert_int_eq(vl_test_sh(cmp_tmpdir, "rm bad/series.csv"), 0);
    ck_assert_int_eq(cmp_volev("compare wet bad"), 5);
    vl_test_file_contains(cmp_tmpdir, "err.txt", "bad/series.csv");

    /* a garbled row of summary.csv: bad input data, named by file and line */
    copy_wet();
    int n = cmp_line_starting("bad/summary.csv", "final_co2,");
    cmp_replace_line("bad/summary.csv", n, "final_co2;7.6e-05;bar");
    ck_assert_int_eq(cmp_volev("compare wet bad -o cmp"), 3);
    snprintf(want, sizeof want,
             "bad/summary.csv:%d: 1 fields, but the header on line %d has 3 (name,value,unit)",
             n, cmp_line_starting("bad/summary.csv", "name,value,unit"));
    vl_test_file_contains(cmp_tmpdir, "err.txt", want);
    ck_assert(!vl_test_exists(cmp_tmpdir, "cmp"));
    ck_assert(!vl_test_exists(cmp_tmpdir, "cmp/compare.csv"));

    /* a value that is not a number */
    copy_wet();
    cmp_replace_line("bad/summary.csv", n, "final_co2,7.6e-0x5,bar");
    ck_assert_int_eq(cmp_volev("compare bad dry -o cmp"), 3);
    snprintf(want, sizeof want, "bad/summary.csv:%d: value '7.6e-0x5' of final_co2 is not a number",
             n);
    vl_test_file_contains(cmp_tmpdir, "err.txt", want);
    ck_assert(!vl_test_exists(cmp_tmpdir, "cmp"));

    /* an empty value is a quantity without one (docs/columns.md), not an error: shown
     * empty, with no difference or ratio (issue 19: a dry run's final_dh_water) */
    copy_wet();
    cmp_replace_line("bad/summary.csv", n, "final_co2,,bar");
    ck_assert_int_eq(cmp_volev("compare wet bad"), 0);
    char *table = vl_test_slurp(cmp_tmpdir, "out.txt", NULL);
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
    int h = cmp_line_starting("bad/summary.csv", "name,value,unit");
    cmp_replace_line("bad/summary.csv", h, "key,number");
    ck_assert_int_eq(cmp_volev("compare wet bad"), 3);
    snprintf(want, sizeof want, "bad/summary.csv:%d: not a volev run summary", h);
    vl_test_file_contains(cmp_tmpdir, "err.txt", want);

    /* a garbled event time */
    copy_wet();
    int e = cmp_line_starting("bad/events.csv", "time_yr,event,detail") + 1;
    cmp_replace_line("bad/events.csv", e, "soon,start,runaway");
    ck_assert_int_eq(cmp_volev("compare wet bad"), 3);
    snprintf(want, sizeof want, "bad/events.csv:%d: time_yr 'soon' is not a number", e);
    vl_test_file_contains(cmp_tmpdir, "err.txt", want);

    /* a column the figure needs is missing: named with its file before gnuplot runs;
     * the table alone needs only the final-state columns of series.csv */
    copy_wet();
    int hs = cmp_line_starting("bad/series.csv", "time_yr,");
    char *text = vl_test_slurp(cmp_tmpdir, "bad/series.csv", NULL);
    char **sl = cmp_lines_of(text);
    char *col = strstr(sl[hs - 1], ",p_o2_bar,");
    ck_assert_ptr_nonnull(col);
    char header[8192];
    snprintf(header, sizeof header, "%.*s,p_o2,%s", (int)(col - sl[hs - 1]), sl[hs - 1],
             col + strlen(",p_o2_bar,"));
    free(sl);
    free(text);
    cmp_replace_line("bad/series.csv", hs, header);
    ck_assert_int_eq(cmp_volev("compare wet bad -o cmp"), 3);
    vl_test_file_contains(cmp_tmpdir, "err.txt", "bad/series.csv");
    vl_test_file_contains(cmp_tmpdir, "err.txt", "column 'p_o2_bar'");
    ck_assert(!vl_test_exists(cmp_tmpdir, "cmp"));
    ck_assert_int_eq(cmp_volev("compare wet bad"), 0);

    /* gnuplot missing: exit 6, and neither compare.csv nor temporary files remain (a
     * folder made for the output is removed, an existing one left empty) */
    ck_assert_int_eq(cmp_volev_env("PATH=/nonexistent", "compare wet dry -o cmp"), 6);
    vl_test_file_contains(cmp_tmpdir, "err.txt", "gnuplot");
    ck_assert(!vl_test_exists(cmp_tmpdir, "cmp"));
    ck_assert_int_eq(vl_test_sh(cmp_tmpdir, "mkdir keep"), 0);
    ck_assert_int_eq(cmp_volev_env("PATH=/nonexistent", "compare wet dry -o keep"), 6);
    cmp_assert_only("keep", NULL, 0);
    vl_test_tmp_remove(cmp_tmpdir);
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
