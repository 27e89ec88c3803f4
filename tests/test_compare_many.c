/* test_compare_many.c: `volev compare` of more than two runs, its table by topic, and
 * no ratio where a value is numerically zero (docs/figures.md, "The table of volev
 * compare"). Every expected value is read from the runs' own files or from the
 * library's reservoir table, never written into the test. */
#define _GNU_SOURCE
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "compare_support.h"
#include "suites.h"
#include "volev/reservoir.h"
#include "volev/units.h"

/* Line number (0-based) of the first line of text starting with prefix, or -1. */
static int line_of(const char *text, const char *prefix)
{
    char *copy = strdup(text);
    ck_assert_ptr_nonnull(copy);
    char **l = cmp_lines_of(copy);
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
    char **l = cmp_lines_of(copy);
    size_t n = 0;
    for (size_t i = 0; l[i] && n == 0; i++)
        if (strncmp(l[i], name, strlen(name)) == 0 && l[i][strlen(name)] == ',')
            n = cmp_fields(l[i], ',', f, max);
    free(l);
    *keep = copy;
    return n;
}

/* Four runs (wet, dry and a copy of each): the table by topic, science before the
 * numerics; each run's value; compare.csv with one column per run and the ratios to the
 * first; a 13th folder refused. */
START_TEST(many_runs_by_topic)
{
    vl_test_tmp_make(cmp_tmpdir, sizeof cmp_tmpdir, "volev-compare");
    cmp_make_runs();
    ck_assert_int_eq(vl_test_sh(cmp_tmpdir, "cp -R wet wet2 && cp -R dry dry2"), 0);
    int gp = vl_test_have_gnuplot();
    ck_assert_int_eq(cmp_volev("compare wet dry wet2 dry2 -o cmp4"), gp ? 0 : 6);
    char *out = vl_test_slurp(cmp_tmpdir, "out.txt", NULL);
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
    cmp_srow *sw = cmp_read_summary("wet/summary.csv", &nw);
    cmp_srow *sd = cmp_read_summary("dry/summary.csv", &nd);
    const char *wa = cmp_summary_value(sw, nw, "final_surface_water_to", "TO");
    const char *wb = cmp_summary_value(sd, nd, "final_surface_water_to", "TO");
    char cells[8][128];
    ck_assert_int_eq(cmp_table_row(out, "final_surface_water_to", "TO", cells, 8), 6);
    ck_assert_str_eq(cells[2], wa);
    ck_assert_str_eq(cells[3], wb);
    ck_assert_str_eq(cells[4], wa);
    ck_assert_str_eq(cells[5], wb);
    free(out);

    if (gp) {
        char *csv = vl_test_slurp(cmp_tmpdir, "cmp4/compare.csv", NULL);
        ck_assert_ptr_nonnull(csv);
        ck_assert_ptr_nonnull(strstr(csv, "# c = wet2: run folder wet2"));
        ck_assert_ptr_nonnull(
            strstr(csv, "\nquantity,unit,a,b,c,d,ratio_b,ratio_c,ratio_d,group\n"));
        char *f[12], *keep;
        /* the dry runs end without surface water (0 TO): no ratio to them; the copy of
         * the wet run has the very same value, ratio 1 */
        ck_assert(strtod(wb, NULL) * VL_TO_KG < vl_reservoir_floor(VL_R_WATER)); /* below its floor: none */
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
        char **l = cmp_lines_of(copy);
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
        cmp_assert_only("cmp4", names, 2);
    }

    /* three runs make a table too; thirteen are refused before anything is read */
    ck_assert_int_eq(cmp_volev("compare wet dry wet2"), 0);
    vl_test_file_contains(cmp_tmpdir, "out.txt", "C: wet2 (wet2)");
    ck_assert_int_eq(cmp_volev("compare wet dry wet2 dry2 a b c d e f g h i -o big"), 2);
    vl_test_file_contains(cmp_tmpdir, "err.txt", "more than 12 folders ('i' is one too many)");
    ck_assert(!vl_test_exists(cmp_tmpdir, "big"));
    free(sw), free(sd);
    vl_test_tmp_remove(cmp_tmpdir);
}
END_TEST

/* Set the value of summary row name in FILE to value. */
static void set_summary(const char *file, const char *name, const char *unit, const char *value)
{
    char prefix[160], text[200];
    snprintf(prefix, sizeof prefix, "%s,", name);
    snprintf(text, sizeof text, "%s,%s,%s", name, value, unit);
    cmp_replace_line(file, cmp_line_starting(file, prefix), text);
}

/* Values that are numerically zero get no ratio: a subnormal number left of a quantity
 * that decayed to nothing, and a reservoir's mass below its depletion floor (with the
 * quantities derived from that reservoir); values above the floor do. */
START_TEST(no_ratio_of_numerical_zeros)
{
    vl_test_tmp_make(cmp_tmpdir, sizeof cmp_tmpdir, "volev-compare");
    cmp_make_runs();
    ck_assert_int_eq(vl_test_sh(cmp_tmpdir, "cp -R wet low && cp -R wet high"), 0);
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

    ck_assert_int_eq(cmp_volev("compare wet low"), 0);
    char *out = vl_test_slurp(cmp_tmpdir, "out.txt", NULL);
    ck_assert_ptr_nonnull(out);
    char cells[8][128];
    static const char *const none[][2] = {{"final_atm_o2", "kg"},
                                          {"final_o2", "bar"},
                                          {"final_atm_h2", "kg"},
                                          {"total_photochem_o", "kg"}};
    for (size_t i = 0; i < sizeof none / sizeof none[0]; i++) {
        ck_assert_int_eq(cmp_table_row(out, none[i][0], none[i][1], cells, 8), 6);
        ck_assert_msg(strcmp(cells[5], "\xe2\x80\x94") == 0, "%s: ratio '%s' of a numerical zero",
                      none[i][0], cells[5]);
        ck_assert_msg(strcmp(cells[4], "\xe2\x80\x94") != 0, "%s: no difference", none[i][0]);
    }
    /* a value the runs share keeps its ratio */
    ck_assert_int_eq(cmp_table_row(out, "final_co2", "bar", cells, 8), 6);
    ck_assert_str_eq(cells[5], "1");
    free(out);

    /* above the floor: a ratio, b / a of the two values as written */
    ck_assert_int_eq(cmp_volev("compare wet high"), 0);
    out = vl_test_slurp(cmp_tmpdir, "out.txt", NULL);
    ck_assert_int_eq(cmp_table_row(out, "final_atm_h2", "kg", cells, 8), 6);
    cmp_assert_close_text(cells[5], strtod(cells[3], NULL) / strtod(cells[2], NULL));
    free(out);
    vl_test_tmp_remove(cmp_tmpdir);
}
END_TEST

Suite *vl_suite_compare_many(void)
{
    Suite *s = suite_create("compare_many");
    TCase *tc = tcase_create("compare_many");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, many_runs_by_topic);
    tcase_add_test(tc, no_ratio_of_numerical_zeros);
    suite_add_tcase(s, tc);
    return s;
}
