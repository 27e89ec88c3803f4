/* test_cli.c: the volev program as a user meets it: exit codes, messages, output
 * files, reproducibility. Runs build/volev ($VOLEV_BIN) through the shell. */
#define _GNU_SOURCE
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "suites.h"

static char tmpdir[256];

/* Run "volev ARGS" in tmpdir; stdout and stderr into out.txt and err.txt; the exit code. */
static int volev(const char *args)
{
    return vl_test_sh(tmpdir, "'%s' %s", vl_test_bin(), args);
}

/* A fast scenario: present Earth for 100 Myr. */
static const char *quick =
    "planet: { mass_mearth = 1.0; radius_rearth = 1.0; orbit_au = 1.0; };\n"
    "inventory: { surface_water_to = 1.0; n2_bar = 0.78; co2_bar = 3e-4; mantle_co2_bar = 100.0; };\n"
    "run: { start_yr = 4.0e9; end_yr = 4.1e9; log_points = 20; linear_points = 20; };\n";

START_TEST(version_help_usage)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-cli");
    ck_assert_int_eq(volev("--version"), 0);
    char *out = vl_test_slurp(tmpdir, "out.txt", NULL);
    ck_assert_ptr_nonnull(strstr(out, "volev 0."));
    free(out);
    ck_assert_int_eq(volev("--help"), 0);
    out = vl_test_slurp(tmpdir, "out.txt", NULL);
    ck_assert_ptr_nonnull(strstr(out, "exit codes"));
    free(out);
    ck_assert_int_eq(volev(""), 2);
    ck_assert_int_eq(volev("frobnicate"), 2);
    vl_test_file_contains(tmpdir, "err.txt", "unknown command 'frobnicate'");
    ck_assert_int_eq(volev("run"), 2);
    ck_assert_int_eq(volev("run a.cfg b.cfg"), 2);
    ck_assert_int_eq(volev("run a.cfg --set"), 2);
    ck_assert_int_eq(volev("run a.cfg --bogus"), 2);
    ck_assert_int_eq(volev("plot"), 2);
    ck_assert_int_eq(volev("plot x --format gif"), 2);
    ck_assert_int_eq(volev("processes extra"), 2);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

START_TEST(bad_input_leaves_nothing)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-cli");
    vl_test_write(tmpdir, "typo.cfg",
                  "planet: {\n  mass_mearth = 1.0;\n  radius_rearht = 1.0;\n};\n");
    ck_assert_int_eq(volev("run typo.cfg -o out"), 3);
    vl_test_file_contains(tmpdir, "err.txt", "typo.cfg:3:");
    vl_test_file_contains(tmpdir, "err.txt", "radius_rearth");
    ck_assert(!vl_test_exists(tmpdir, "out"));
    ck_assert(!vl_test_exists(tmpdir, "typo"));
    vl_test_write(tmpdir, "range.cfg", "planet: { mass_mearth = -2.0; };\n");
    ck_assert_int_eq(volev("run range.cfg"), 3);
    vl_test_file_contains(tmpdir, "err.txt", "range.cfg:1:");
    ck_assert(!vl_test_exists(tmpdir, "range"));
    ck_assert_int_eq(volev("run missing.cfg"), 5);
    vl_test_file_contains(tmpdir, "err.txt", "missing.cfg");
    vl_test_write(tmpdir, "quick.cfg", quick);
    ck_assert_int_eq(volev("run quick.cfg --set planet.orbit_au=abc -o out"), 3);
    vl_test_file_contains(tmpdir, "err.txt", "planet.orbit_au");
    ck_assert(!vl_test_exists(tmpdir, "out"));
    ck_assert_int_eq(volev("run quick.cfg --set run.end_yr=1e3 -o out"), 3);
    ck_assert(!vl_test_exists(tmpdir, "out"));
    /* a track with an XUV column makes star.xuv.* meaningless: setting it is an error */
    vl_test_write(tmpdir, "track.csv",
                  "age_yr,luminosity_lsun,xuv_lsun\n1e6,1.02,1.1e-3\n2e9,0.93,1.3e-6\n");
    vl_test_write(tmpdir, "xuv.cfg",
                  "star: { luminosity_model = \"table\"; track_file = \"track.csv\";\n"
                  "  xuv: { saturation_ratio = 2e-3; }; };\nrun: { end_yr = 1e9; };\n");
    ck_assert_int_eq(volev("run xuv.cfg -o out"), 3);
    vl_test_file_contains(tmpdir, "err.txt", "xuv.cfg:2: star.xuv.saturation_ratio is not used");
    ck_assert(!vl_test_exists(tmpdir, "out"));
    vl_test_tmp_remove(tmpdir);
}
END_TEST

START_TEST(run_writes_and_reproduces)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-cli");
    vl_test_write(tmpdir, "quick.cfg", quick);
    ck_assert_int_eq(volev("run quick.cfg -o a"), 0);
    ck_assert_int_eq(volev("run quick.cfg -o b"), 0);
    static const char *const files[] = {"series.csv", "events.csv", "summary.csv",
                                        "scenario.resolved.cfg"};
    for (int i = 0; i < 4; i++) {
        char a[64];
        snprintf(a, sizeof a, "a/%s", files[i]);
        ck_assert_msg(vl_test_exists(tmpdir, a), "missing %s", a);
    }
    /* two runs are byte-identical */
    char *sa = vl_test_slurp(tmpdir, "a/series.csv", NULL);
    char *sb = vl_test_slurp(tmpdir, "b/series.csv", NULL);
    ck_assert_str_eq(sa, sb);
    char *ea = vl_test_slurp(tmpdir, "a/events.csv", NULL);
    char *eb = vl_test_slurp(tmpdir, "b/events.csv", NULL);
    ck_assert_str_eq(ea, eb);
    ck_assert_ptr_nonnull(strstr(sa, "time_yr,regime,surface_temp_k,surface_water_to"));
    ck_assert_ptr_nonnull(strstr(sa, "# volev "));
    ck_assert_ptr_nonnull(strstr(sa, "# resolved scenario hash"));
    /* the resolved scenario reproduces the run byte for byte */
    ck_assert_int_eq(volev("run a/scenario.resolved.cfg -o c"), 0);
    char *sc = vl_test_slurp(tmpdir, "c/series.csv", NULL);
    ck_assert_str_eq(sa, sc); /* hash line included: the resolved scenario resolves to itself */
    char *sum = vl_test_slurp(tmpdir, "a/summary.csv", NULL);
    ck_assert_ptr_nonnull(strstr(sum, "residual_H,"));
    ck_assert_ptr_nonnull(strstr(sum, "rhs_evaluations,"));
    /* default folder named after the scenario, never overwriting */
    ck_assert_int_eq(volev("run quick.cfg"), 0);
    ck_assert(vl_test_exists(tmpdir, "quick/series.csv"));
    ck_assert_int_eq(volev("run quick.cfg"), 0);
    ck_assert(vl_test_exists(tmpdir, "quick.1/series.csv"));
    free(sa), free(sb), free(ea), free(eb), free(sc), free(sum);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

/* The end-of-run report says what summary.csv holds, readably (issue 19, item 5):
 * Venus loses its water, so its report says "none", not a round-off number. */
START_TEST(run_report_readable)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-cli");
    char args[1024];
    snprintf(args, sizeof args, "run '%s/scenarios/venus.cfg' -o v", vl_test_top());
    ck_assert_int_eq(volev(args), 0);
    char *out = vl_test_slurp(tmpdir, "out.txt", NULL);
    char *sum = vl_test_slurp(tmpdir, "v/summary.csv", NULL);
    ck_assert(out && sum);
    ck_assert_msg(strncmp(out, "end at 4.57 Gyr: ", 17) == 0, "%s", out); /* venus.cfg's end */
    ck_assert_double_eq(vl_test_summary_row(sum, "final_surface_water"), 0.0);
    ck_assert_ptr_nonnull(strstr(out, "\nwater: none at the surface"));
    char lost[64];
    snprintf(lost, sizeof lost, "%.3g TO lost to space",
             vl_test_summary_row(sum, "water_lost_to_space"));
    ck_assert_msg(strstr(out, lost) != NULL, "no '%s' in %s", lost, out);
    ck_assert(strstr(sum, "\nfirst_ocean_lost,") != NULL);
    ck_assert_ptr_nonnull(strstr(out, "ocean_lost at "));
    ck_assert_ptr_nonnull(strstr(out, "\noutput: v\n"));
    ck_assert_ptr_null(strstr(out, "e-1")); /* no 1e-194-like numbers */
    free(out);
    free(sum);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

/* The column cols of the last (last != 0) or first data row of series.csv text. */
static double series_cell(const char *text, const char *col, int last)
{
    const char *h = text;
    while (*h == '#')
        h = strchr(h, '\n') + 1;
    int k = 0, want = -1;
    for (const char *p = h; *p && *p != '\n'; k++) {
        size_t len = strcspn(p, ",\n");
        if (len == strlen(col) && strncmp(p, col, len) == 0)
            want = k;
        p += len + (p[len] == ',');
    }
    ck_assert_msg(want >= 0, "no column %s", col);
    const char *row = strchr(h, '\n') + 1;
    if (last) {
        const char *end = text + strlen(text) - 1; /* the final newline */
        for (row = end; row > text && row[-1] != '\n'; row--)
            ;
    }
    for (int j = 0; j < want; j++)
        row = strchr(row, ',') + 1;
    return strtod(row, NULL);
}

/* The final state in input units starts a new run where the last one ended: each
 * reservoir the inventory describes comes back to 1e-9 (issue 19: restart; the
 * conversions are the inputs' own, so this checks the round trip, not a value) */
START_TEST(final_inventory_restarts)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-cli");
    char args[4096];
    snprintf(args, sizeof args, "run '%s/scenarios/earth.cfg' -o a", vl_test_top());
    ck_assert_int_eq(volev(args), 0);
    char *sum = vl_test_slurp(tmpdir, "a/summary.csv", NULL);
    static const char *const keys[] = {"surface_water_to", "co2_bar", "n2_bar", "o2_bar",
                                       "h2_bar", "carbonate_co2_bar", "mantle_co2_bar",
                                       "mantle_n2_bar", "mantle_water_to"};
    int len = snprintf(args, sizeof args,
                       "run '%s/scenarios/earth.cfg' -o b --set run.start_yr=4.57e9 "
                       "--set run.end_yr=4.6e9",
                       vl_test_top());
    for (size_t k = 0; k < sizeof keys / sizeof keys[0]; k++) {
        char name[64];
        snprintf(name, sizeof name, "final_inventory.%s", keys[k]);
        len += snprintf(args + len, sizeof args - (size_t)len, " --set inventory.%s=%.17g",
                        keys[k], vl_test_summary_row(sum, name));
    }
    ck_assert_int_eq(volev(args), 0);
    char *a = vl_test_slurp(tmpdir, "a/series.csv", NULL), *b = vl_test_slurp(tmpdir, "b/series.csv", NULL);
    static const char *const cols[] = {"surface_water_kg", "surface_co2_kg", "atm_n2_kg",
                                       "carbonate_rock_kg", "mantle_carbon_kg",
                                       "mantle_nitrogen_kg"};
    for (size_t k = 0; k < sizeof cols / sizeof cols[0]; k++) {
        double end = series_cell(a, cols[k], 1), start = series_cell(b, cols[k], 0);
        ck_assert_msg(fabs(start - end) <= 1e-9 * fabs(end), "%s: %.17g then %.17g", cols[k],
                      end, start);
    }
    free(a), free(b), free(sum);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

START_TEST(validate_and_processes)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-cli");
    vl_test_write(tmpdir, "quick.cfg", quick);
    ck_assert_int_eq(volev("validate quick.cfg --set planet.eccentricity=0.25"), 0);
    char *out = vl_test_slurp(tmpdir, "out.txt", NULL);
    ck_assert_ptr_nonnull(strstr(out, "planet.orbit_au"));
    ck_assert_ptr_nonnull(strstr(out, "star.teff_k"));
    ck_assert_ptr_nonnull(strstr(out, "default"));
    ck_assert_ptr_nonnull(strstr(out, "quick.cfg:1"));
    ck_assert_ptr_nonnull(strstr(out, "--set"));
    ck_assert_ptr_nonnull(strstr(out, "processes.weathering.co2_exponent"));
    free(out);
    ck_assert(!vl_test_exists(tmpdir, "quick"));
    /* derived quantities: present Earth receives S_eff 1 (1361 W/m^2, Kopp & Lean 2011,
     * GRL 38:L01706, from memory) and sits in the conservative habitable zone, 0.99-1.70 au
     * (Kopparapu et al. 2013);
     * Venus today lies inside its recent-Venus edge (S_eff 1.91 > 1.78, same paper) */
    char args[1024];
    snprintf(args, sizeof args, "validate '%s/scenarios/earth.cfg'", vl_test_top());
    ck_assert_int_eq(volev(args), 0);
    out = vl_test_slurp(tmpdir, "out.txt", NULL);
    const char *end = strstr(out, "\n# end (");
    ck_assert_ptr_nonnull(end);
    ck_assert_ptr_nonnull(strstr(end, "S_eff 1: in the conservative habitable zone"));
    free(out);
    snprintf(args, sizeof args, "validate '%s/scenarios/venus.cfg'", vl_test_top());
    ck_assert_int_eq(volev(args), 0);
    out = vl_test_slurp(tmpdir, "out.txt", NULL);
    end = strstr(out, "\n# end (");
    ck_assert_ptr_nonnull(end);
    ck_assert_ptr_nonnull(strstr(end, "inside the optimistic inner edge"));
    free(out);
    ck_assert_int_eq(volev("processes"), 0);
    out = vl_test_slurp(tmpdir, "out.txt", NULL);
    static const char *const names[] = {"hydrogen_escape", "oxygen_drag", "photolysis",
                                        "oxygen_sink", "outgassing", "weathering"};
    for (int i = 0; i < 6; i++)
        ck_assert_msg(strstr(out, names[i]) != NULL, "processes lacks %s", names[i]);
    ck_assert_ptr_nonnull(strstr(out, "Walker"));
    free(out);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

START_TEST(balance_curves)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-cli");
    vl_test_write(tmpdir, "quick.cfg", quick);
    ck_assert_int_eq(volev("balance quick.cfg --age-yr 4.05e9 -o b"), 0);
    char *csv = vl_test_slurp(tmpdir, "b/balance.csv", NULL);
    ck_assert_ptr_nonnull(csv);
    ck_assert_ptr_nonnull(strstr(csv, "surface_temp_k,olr_w_m2,absorbed_w_m2,net_w_m2,albedo,strat_h2o"));
    ck_assert_ptr_nonnull(strstr(csv, "# stable equilibria (K):"));
    ck_assert_ptr_nonnull(strstr(csv, "# runaway threshold s_eff"));
    free(csv);
    /* outside the run's ages, and with a climate that has no OLR curve */
    ck_assert_int_eq(volev("balance quick.cfg --age-yr 1e6 -o c"), 2);
    ck_assert_int_eq(volev("balance quick.cfg --age-yr abc"), 2);
    ck_assert_int_eq(volev("balance quick.cfg --set climate.model=hz_fit -o d"), 3);
    vl_test_file_contains(tmpdir, "err.txt", "balance needs climate.model");
    ck_assert(!vl_test_exists(tmpdir, "d/balance.csv"));
    if (vl_test_have_gnuplot()) {
        char plots[1024];
        snprintf(plots, sizeof plots, "%s/plots", vl_test_top());
        setenv("VOLEV_PLOTS_DIR", plots, 1);
        ck_assert_int_eq(volev("plot b --format svg"), 0);
        char *svg = vl_test_slurp(tmpdir, "b/balance.svg", NULL);
        ck_assert_ptr_nonnull(svg);
        ck_assert_ptr_nonnull(strstr(svg, "<svg")); /* SVG root element (W3C SVG 1.1) */
        free(svg);
    }
    vl_test_tmp_remove(tmpdir);
}
END_TEST

/* docs/parameters.md is generated from the tables by `make docs`; it must be current. */
START_TEST(parameter_reference_current)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-cli");
    ck_assert_int_eq(volev("processes"), 0);
    char *out = vl_test_slurp(tmpdir, "out.txt", NULL);
    char path[1024];
    snprintf(path, sizeof path, "%s/docs/parameters.md", vl_test_top());
    FILE *f = fopen(path, "rb");
    ck_assert_msg(f != NULL, "missing %s", path);
    static char doc[1 << 20];
    size_t n = fread(doc, 1, sizeof doc - 1, f);
    doc[n] = '\0';
    fclose(f);
    char *start = strstr(doc, "```\n");
    ck_assert_ptr_nonnull(start);
    start += 4;
    char *end = strstr(start, "```");
    ck_assert_ptr_nonnull(end);
    *end = '\0';
    ck_assert_msg(strcmp(start, out) == 0, "docs/parameters.md is stale: run 'make docs'");
    free(out);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

START_TEST(plot_renders_png)
{
    if (!vl_test_have_gnuplot())
        return; /* gnuplot is installed by make deps and .ci/run; without it plot exits 6 */
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-cli");
    vl_test_write(tmpdir, "quick.cfg", quick);
    ck_assert_int_eq(volev("run quick.cfg -o a"), 0);
    char plots[1024];
    snprintf(plots, sizeof plots, "%s/plots", vl_test_top());
    setenv("VOLEV_PLOTS_DIR", plots, 1);
    ck_assert_int_eq(volev("plot a"), 0);
    char *png = vl_test_slurp(tmpdir, "a/history.png", NULL);
    ck_assert_ptr_nonnull(png);
    /* PNG signature (ISO/IEC 15948): 89 50 4E 47 0D 0A 1A 0A */
    ck_assert_int_eq(memcmp(png, "\x89PNG\r\n\x1a\n", 8), 0);
    free(png);
    ck_assert_int_eq(volev("plot nowhere"), 5);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

Suite *vl_suite_cli(void)
{
    Suite *s = suite_create("cli");
    TCase *tc = tcase_create("program");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, version_help_usage);
    tcase_add_test(tc, bad_input_leaves_nothing);
    tcase_add_test(tc, run_writes_and_reproduces);
    tcase_add_test(tc, run_report_readable);
    tcase_add_test(tc, final_inventory_restarts);
    tcase_add_test(tc, validate_and_processes);
    tcase_add_test(tc, balance_curves);
    tcase_add_test(tc, parameter_reference_current);
    tcase_add_test(tc, plot_renders_png);
    suite_add_tcase(s, tc);
    return s;
}
