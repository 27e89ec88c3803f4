/* test_figures.c: every figure kind of `volev plot` (docs/figures.md) renders from test
 * data in every format, each file non-empty and valid (PNG signature, PDF header, SVG
 * root element); a missing or misnamed input column is an error naming the column, with
 * no figure written; the command line's choices (--list, --kind, -o, --format); the words
 * the figures take from the runs (titles, events, units, axis names). The test
 * data are short runs, an energy balance and a small grid sweep made here with the
 * program itself (tests/data/sweep/grid.cfg: 3 x 2 grid). Needs gnuplot (installed by
 * .ci/run through scripts/deps.sh). */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "suites.h"
#include "volev/status.h"

static char tmp[256];

/* Run data once per test case: two short demo runs, a balance, a grid sweep. */
static void make_data(void)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-figures");
    ck_assert_msg(vl_test_have_gnuplot(), "gnuplot is needed (scripts/deps.sh installs it)");
    const char *top = vl_test_top(), *bin = vl_test_bin();
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' run '%s/scenarios/demo.cfg' -o wet --set run.end_yr=3e8",
                                bin, top),
                     0);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' run '%s/scenarios/demo-dry.cfg' -o dry "
                                     "--set run.end_yr=3e8",
                                bin, top),
                     0);
    /* third and fourth runs of a comparison: copies under other names */
    ck_assert_int_eq(vl_test_sh(tmp, "cp -R wet wet2 && cp -R dry dry2"), 0);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' balance '%s/scenarios/demo.cfg' -o bal", bin, top), 0);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' sweep '%s/tests/data/sweep/grid.cfg' -o map --quiet",
                                bin, top),
                     0);
}

/* The file is non-empty and of its format: PNG signature (ISO/IEC 15948), "%PDF-"
 * (ISO 32000), an <svg root element (W3C SVG 1.1) after an optional XML prolog. */
static void assert_valid(const char *rel, const char *fmt)
{
    long n = 0;
    char *b = vl_test_slurp(tmp, rel, &n);
    ck_assert_msg(b != NULL, "%s was not written", rel);
    ck_assert_msg(n > 100, "%s has only %ld bytes", rel, n);
    if (strcmp(fmt, "png") == 0)
        ck_assert_msg(memcmp(b, "\x89PNG\r\n\x1a\n", 8) == 0, "%s: no PNG signature", rel);
    else if (strcmp(fmt, "pdf") == 0)
        ck_assert_msg(memcmp(b, "%PDF-", 5) == 0, "%s: no PDF header", rel);
    else
        ck_assert_msg(strstr(b, "<svg") != NULL && strstr(b, "</svg>") != NULL,
                      "%s: no svg root element", rel);
    free(b);
}

/* The file rel of tmp does not hold the text needle. */
static void file_lacks(const char *rel, const char *needle)
{
    char *s = vl_test_slurp(tmp, rel, NULL);
    ck_assert_msg(s != NULL, "missing %s", rel);
    ck_assert_msg(strstr(s, needle) == NULL, "%s holds '%s'", rel, needle);
    free(s);
}

/* The words the figures take from the runs (svg keeps text as text; a title or label
 * shown as written is one text element): the history's default title names the
 * scenario, planet and star (the values of scenarios/demo-dry.cfg), not the folder;
 * events are listed in words, events too close to tell apart under one number; the
 * comparison has a lettered regime strip with its key; the balance subtitle is in
 * proper units; the map's axes are in words. */
static void check_words(const char *bin)
{
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot dry -o words-history.svg", bin), 0);
    vl_test_file_contains(tmp, "words-history.svg", ">demo-dry: 1.2 Earth-mass planet at 0.11 au "
                                                    "from a 0.25 solar-mass star (3250 K)<");
    file_lacks("words-history.svg", tmp);
    /* solidified and runaway_onset share a time (events.csv): one entry, both named */
    vl_test_file_contains(tmp, "words-history.svg",
                          "magma ocean solidified, runaway greenhouse began (");
    /* the surface water and, later, its deuterium run out: both listed in words */
    vl_test_file_contains(tmp, "words-history.svg", "surface water used up (");
    vl_test_file_contains(tmp, "words-history.svg", "deuterium of surface water used up (");
    vl_test_file_contains(tmp, "words-history.svg", ">Events:");
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot wet dry -o words-cmp.svg", bin), 0);
    vl_test_file_contains(tmp, "words-cmp.svg", ">(e)<");
    vl_test_file_contains(tmp, "words-cmp.svg", ">magma ocean<");
    vl_test_file_contains(tmp, "words-cmp.svg", ">Runs wet and dry<");
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot bal -o words-bal.svg", bin), 0);
    vl_test_file_contains(tmp, "words-bal.svg", ">Energy balance at a stellar age of 10 Myr<");
    file_lacks("words-bal.svg", "W/m^2");
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot map --kind regime_map -o words-map.svg", bin), 0);
    vl_test_file_contains(tmp, "words-map.svg", ">Initial surface water (TO)<");
    vl_test_file_contains(tmp, "words-map.svg", ">Orbit (au)<");
    file_lacks("words-map.svg", "planet.orbit_au");
}

START_TEST(every_kind_every_format)
{
    make_data();
    const char *bin = vl_test_bin();
    static const char *const fmts[] = {"png", "pdf", "svg"};
    struct {
        const char *args, *kind;
    } cases[] = {
        {"wet", "history"},
        {"bal", "balance"},
        {"wet dry", "comparison"},
        {"wet dry wet2", "comparison"},
        {"wet dry wet2 dry2", "comparison"},
        {"map", "ensemble"},
        {"map", "regime_map"},
        {"map", "water_map"},
    };
    for (size_t c = 0; c < sizeof cases / sizeof cases[0]; c++)
        for (int f = 0; f < 3; f++) {
            char out[128];
            snprintf(out, sizeof out, "fig-%s-%zu.%s", cases[c].kind, c, fmts[f]);
            int rc = vl_test_sh(tmp, "'%s' plot %s --kind %s -o %s", bin, cases[c].args,
                                cases[c].kind, out);
            if (rc != 0) {
                char *e = vl_test_slurp(tmp, "err.txt", NULL);
                ck_abort_msg("%s as %s: exit %d: %s", cases[c].kind, fmts[f], rc, e ? e : "");
            }
            assert_valid(out, fmts[f]);
            vl_test_file_contains(tmp, "out.txt", out);
        }
    /* the four runs' labels, numbered as their rows of the regime strip, all reach the
     * comparison's legend (svg keeps text as text) */
    static const char *const four[] = {">1 wet<", ">2 dry<", ">3 wet2<", ">4 dry2<"};
    for (int k = 0; k < 4; k++)
        vl_test_file_contains(tmp, "fig-comparison-4.svg", four[k]);
    /* without -o: every figure the folder holds, named after its kind, in DIR */
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot map --format svg", bin), 0);
    assert_valid("map/ensemble.svg", "svg");
    assert_valid("map/regime_map.svg", "svg");
    assert_valid("map/water_map.svg", "svg");
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot wet", bin), 0);
    assert_valid("wet/history.png", "png");
    check_words(bin);
    vl_test_tmp_remove(tmp);
}
END_TEST

/* Copy folder src to dst with the header column `col` of file renamed to `to`. */
static void break_column(const char *src, const char *dst, const char *file, const char *col,
                         const char *to)
{
    ck_assert_int_eq(vl_test_sh(tmp, "rm -rf %s && cp -R %s %s", dst, src, dst), 0);
    ck_assert_int_eq(vl_test_sh(tmp, "sed -i '/^[^#]/{s/\\(^\\|,\\)%s\\(,\\|$\\)/\\1%s\\2/;:a;n;ba}' %s/%s",
                                col, to, dst, file),
                     0);
}

START_TEST(missing_columns_named)
{
    make_data();
    const char *bin = vl_test_bin();
    struct {
        const char *src, *file, *col, *kind, *extra;
    } cases[] = {
        {"wet", "series.csv", "p_o2_bar", "history", ""},
        {"wet", "series.csv", "luminosity_lsun", "history", ""},
        {"wet", "series.csv", "n_escape_kg_s", "history", ""},
        {"wet", "series.csv", "regime", "comparison", " dry"},
        {"bal", "balance.csv", "olr_w_m2", "balance", ""},
        {"map", "ensemble_series.csv", "water_to_p50", "ensemble", ""},
        {"map", "ensemble_summary.csv", "fraction", "ensemble", ""},
        {"map", "members.csv", "outcome", "regime_map", ""},
        {"map", "members.csv", "planet.orbit_au", "water_map", ""},
        {"wet", "series.csv", "surface_temp_k", "comparison", " dry"},
    };
    for (size_t c = 0; c < sizeof cases / sizeof cases[0]; c++) {
        break_column(cases[c].src, "broken", cases[c].file, cases[c].col, "misnamed");
        int rc = vl_test_sh(tmp, "'%s' plot broken%s --kind %s -o bad.png", bin, cases[c].extra,
                            cases[c].kind);
        ck_assert_msg(rc == VL_ERR_INPUT, "%s without %s: exit %d", cases[c].kind, cases[c].col, rc);
        char want[256];
        snprintf(want, sizeof want, "no column '%s'", cases[c].col);
        vl_test_file_contains(tmp, "err.txt", want);
        snprintf(want, sizeof want, "broken/%s", cases[c].file);
        vl_test_file_contains(tmp, "err.txt", want);
        ck_assert_msg(!vl_test_exists(tmp, "bad.png"), "%s: a figure was written", cases[c].kind);
    }
    vl_test_tmp_remove(tmp);
}
END_TEST

START_TEST(command_line)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-figures");
    const char *bin = vl_test_bin();
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot --list", bin), 0);
    static const char *const kinds[] = {"history", "balance", "comparison", "ensemble",
                                        "regime_map", "water_map"};
    for (int k = 0; k < 6; k++)
        vl_test_file_contains(tmp, "out.txt", kinds[k]);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot", bin), VL_ERR_USAGE);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot x --format gif", bin), VL_ERR_USAGE);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot x -o a.jpg", bin), VL_ERR_USAGE);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot x -o a.png --format pdf", bin), VL_ERR_USAGE);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot x --kind pie", bin), VL_ERR_USAGE);
    /* a comparison takes at most 12 runs (plots/style.gp holds a colour and dash for
     * each): a 13th folder is refused before anything is read */
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot a b c d e f g h i j k l", bin), VL_ERR_IO);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot a b c d e f g h i j k l m", bin), VL_ERR_USAGE);
    vl_test_file_contains(tmp, "err.txt", "more than 12 folders ('m' is one too many)");
    /* an empty folder: nothing to plot */
    ck_assert_int_eq(vl_test_sh(tmp, "mkdir -p empty"), 0);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot empty", bin), VL_ERR_IO);
    vl_test_file_contains(tmp, "err.txt", "nothing to plot");
    /* a sweep folder holds several figures: -o needs --kind */
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' sweep '%s/tests/data/sweep/grid.cfg' -o map --quiet",
                                bin, vl_test_top()),
                     0);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot map -o one.png", bin), VL_ERR_USAGE);
    vl_test_file_contains(tmp, "err.txt", "--kind");
    /* a map needs a two-axis grid: a sampled sweep has none */
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' sweep '%s/tests/data/sweep/sampled.cfg' -o rnd --quiet",
                                bin, vl_test_top()),
                     0);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' plot rnd --kind regime_map -o m.png", bin),
                     VL_ERR_INPUT);
    vl_test_file_contains(tmp, "err.txt", "two axes");
    vl_test_tmp_remove(tmp);
}
END_TEST

Suite *vl_suite_figures(void)
{
    Suite *s = suite_create("figures");
    TCase *tc = tcase_create("kinds");
    tcase_set_timeout(tc, 240);
    tcase_add_test(tc, every_kind_every_format);
    tcase_add_test(tc, missing_columns_named);
    tcase_add_test(tc, command_line);
    suite_add_tcase(s, tc);
    return s;
}
