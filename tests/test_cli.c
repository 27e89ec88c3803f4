/* test_cli.c: the volev program as a user meets it: exit codes, messages, output
 * files, reproducibility. Runs build/volev ($VOLEV_BIN) through the shell. */
#define _GNU_SOURCE
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <sys/wait.h>
#include <unistd.h>

#include "suites.h"

static char tmpdir[256];

static void make_tmp(void)
{
    snprintf(tmpdir, sizeof tmpdir, "/tmp/volev-cli-XXXXXX");
    ck_assert_ptr_nonnull(mkdtemp(tmpdir));
}

static void remove_tmp(void)
{
    char cmd[512];
    snprintf(cmd, sizeof cmd, "rm -rf '%s'", tmpdir);
    ck_assert_int_eq(system(cmd), 0);
}

/* Run "volev ARGS" in tmpdir; capture stderr and stdout into files; return exit code. */
static int volev(const char *args)
{
    char cmd[8192];
    snprintf(cmd, sizeof cmd, "cd '%s' && '%s' %s >out.txt 2>err.txt", tmpdir, vl_test_bin(), args);
    int rc = system(cmd);
    ck_assert(rc != -1 && WIFEXITED(rc));
    return WEXITSTATUS(rc);
}

static char *slurp(const char *name)
{
    char path[512];
    snprintf(path, sizeof path, "%s/%s", tmpdir, name);
    FILE *f = fopen(path, "rb");
    if (!f)
        return NULL;
    fseek(f, 0, SEEK_END);
    long n = ftell(f);
    fseek(f, 0, SEEK_SET);
    char *buf = malloc((size_t)n + 1);
    ck_assert_ptr_nonnull(buf);
    ck_assert_int_eq(fread(buf, 1, (size_t)n, f), (size_t)n);
    buf[n] = '\0';
    fclose(f);
    return buf;
}

static void write_file(const char *name, const char *text)
{
    char path[512];
    snprintf(path, sizeof path, "%s/%s", tmpdir, name);
    FILE *f = fopen(path, "w");
    ck_assert_ptr_nonnull(f);
    fputs(text, f);
    fclose(f);
}

static int exists(const char *name)
{
    char path[512];
    struct stat sb;
    snprintf(path, sizeof path, "%s/%s", tmpdir, name);
    return stat(path, &sb) == 0;
}

static void assert_err_contains(const char *needle)
{
    char *err = slurp("err.txt");
    ck_assert_ptr_nonnull(err);
    ck_assert_msg(strstr(err, needle) != NULL, "stderr '%s' lacks '%s'", err, needle);
    free(err);
}

/* A fast scenario: present Earth for 100 Myr. */
static const char *quick =
    "planet: { mass_mearth = 1.0; radius_rearth = 1.0; orbit_au = 1.0; };\n"
    "inventory: { surface_water_to = 1.0; n2_bar = 0.78; co2_bar = 3e-4; mantle_co2_bar = 100.0; };\n"
    "run: { start_yr = 4.0e9; end_yr = 4.1e9; log_points = 20; linear_points = 20; };\n";

START_TEST(version_help_usage)
{
    make_tmp();
    ck_assert_int_eq(volev("--version"), 0);
    char *out = slurp("out.txt");
    ck_assert_ptr_nonnull(strstr(out, "volev 0."));
    free(out);
    ck_assert_int_eq(volev("--help"), 0);
    out = slurp("out.txt");
    ck_assert_ptr_nonnull(strstr(out, "exit codes"));
    free(out);
    ck_assert_int_eq(volev(""), 2);
    ck_assert_int_eq(volev("frobnicate"), 2);
    assert_err_contains("unknown command 'frobnicate'");
    ck_assert_int_eq(volev("run"), 2);
    ck_assert_int_eq(volev("run a.cfg b.cfg"), 2);
    ck_assert_int_eq(volev("run a.cfg --set"), 2);
    ck_assert_int_eq(volev("run a.cfg --bogus"), 2);
    ck_assert_int_eq(volev("plot"), 2);
    ck_assert_int_eq(volev("plot x --format gif"), 2);
    ck_assert_int_eq(volev("processes extra"), 2);
    remove_tmp();
}
END_TEST

START_TEST(bad_input_leaves_nothing)
{
    make_tmp();
    write_file("typo.cfg", "planet: {\n  mass_mearth = 1.0;\n  radius_rearht = 1.0;\n};\n");
    ck_assert_int_eq(volev("run typo.cfg -o out"), 3);
    assert_err_contains("typo.cfg:3:");
    assert_err_contains("radius_rearth");
    ck_assert(!exists("out"));
    ck_assert(!exists("typo"));
    write_file("range.cfg", "planet: { mass_mearth = -2.0; };\n");
    ck_assert_int_eq(volev("run range.cfg"), 3);
    assert_err_contains("range.cfg:1:");
    ck_assert(!exists("range"));
    ck_assert_int_eq(volev("run missing.cfg"), 5);
    assert_err_contains("missing.cfg");
    write_file("quick.cfg", quick);
    ck_assert_int_eq(volev("run quick.cfg --set planet.orbit_au=abc -o out"), 3);
    assert_err_contains("planet.orbit_au");
    ck_assert(!exists("out"));
    ck_assert_int_eq(volev("run quick.cfg --set run.end_yr=1e3 -o out"), 3);
    ck_assert(!exists("out"));
    /* a track with an XUV column makes star.xuv.* meaningless: setting it is an error */
    write_file("track.csv", "age_yr,luminosity_lsun,xuv_lsun\n1e6,1.02,1.1e-3\n2e9,0.93,1.3e-6\n");
    write_file("xuv.cfg", "star: { luminosity_model = \"table\"; track_file = \"track.csv\";\n"
                          "  xuv: { saturation_ratio = 2e-3; }; };\nrun: { end_yr = 1e9; };\n");
    ck_assert_int_eq(volev("run xuv.cfg -o out"), 3);
    assert_err_contains("xuv.cfg:2: star.xuv.saturation_ratio is not used");
    ck_assert(!exists("out"));
    remove_tmp();
}
END_TEST

START_TEST(run_writes_and_reproduces)
{
    make_tmp();
    write_file("quick.cfg", quick);
    ck_assert_int_eq(volev("run quick.cfg -o a"), 0);
    ck_assert_int_eq(volev("run quick.cfg -o b"), 0);
    static const char *const files[] = {"series.csv", "events.csv", "summary.csv",
                                        "scenario.resolved.cfg"};
    for (int i = 0; i < 4; i++) {
        char a[64];
        snprintf(a, sizeof a, "a/%s", files[i]);
        ck_assert_msg(exists(a), "missing %s", a);
    }
    /* two runs are byte-identical */
    char *sa = slurp("a/series.csv"), *sb = slurp("b/series.csv");
    ck_assert_str_eq(sa, sb);
    char *ea = slurp("a/events.csv"), *eb = slurp("b/events.csv");
    ck_assert_str_eq(ea, eb);
    ck_assert_ptr_nonnull(strstr(sa, "time_yr,regime,surface_temp_k,surface_water_to"));
    ck_assert_ptr_nonnull(strstr(sa, "# volev "));
    ck_assert_ptr_nonnull(strstr(sa, "# resolved scenario hash"));
    /* the resolved scenario reproduces the run byte for byte */
    ck_assert_int_eq(volev("run a/scenario.resolved.cfg -o c"), 0);
    char *sc = slurp("c/series.csv");
    ck_assert_str_eq(sa, sc); /* hash line included: the resolved scenario resolves to itself */
    char *sum = slurp("a/summary.csv");
    ck_assert_ptr_nonnull(strstr(sum, "residual_H,"));
    ck_assert_ptr_nonnull(strstr(sum, "rhs_evaluations,"));
    /* default folder named after the scenario, never overwriting */
    ck_assert_int_eq(volev("run quick.cfg"), 0);
    ck_assert(exists("quick/series.csv"));
    ck_assert_int_eq(volev("run quick.cfg"), 0);
    ck_assert(exists("quick.1/series.csv"));
    free(sa), free(sb), free(ea), free(eb), free(sc), free(sum);
    remove_tmp();
}
END_TEST

START_TEST(validate_and_processes)
{
    make_tmp();
    write_file("quick.cfg", quick);
    ck_assert_int_eq(volev("validate quick.cfg --set planet.eccentricity=0.25"), 0);
    char *out = slurp("out.txt");
    ck_assert_ptr_nonnull(strstr(out, "planet.orbit_au"));
    ck_assert_ptr_nonnull(strstr(out, "star.teff_k"));
    ck_assert_ptr_nonnull(strstr(out, "default"));
    ck_assert_ptr_nonnull(strstr(out, "quick.cfg:1"));
    ck_assert_ptr_nonnull(strstr(out, "--set"));
    ck_assert_ptr_nonnull(strstr(out, "processes.weathering.co2_exponent"));
    free(out);
    ck_assert(!exists("quick"));
    ck_assert_int_eq(volev("processes"), 0);
    out = slurp("out.txt");
    static const char *const names[] = {"hydrogen_escape", "oxygen_drag", "photolysis",
                                        "oxygen_sink", "outgassing", "weathering"};
    for (int i = 0; i < 6; i++)
        ck_assert_msg(strstr(out, names[i]) != NULL, "processes lacks %s", names[i]);
    ck_assert_ptr_nonnull(strstr(out, "Walker"));
    free(out);
    remove_tmp();
}
END_TEST

START_TEST(balance_curves)
{
    make_tmp();
    write_file("quick.cfg", quick);
    ck_assert_int_eq(volev("balance quick.cfg --age-yr 4.05e9 -o b"), 0);
    char *csv = slurp("b/balance.csv");
    ck_assert_ptr_nonnull(csv);
    ck_assert_ptr_nonnull(strstr(csv, "surface_temp_k,olr_w_m2,absorbed_w_m2,net_w_m2,albedo,strat_h2o"));
    ck_assert_ptr_nonnull(strstr(csv, "# stable equilibria (K):"));
    ck_assert_ptr_nonnull(strstr(csv, "# runaway threshold s_eff"));
    free(csv);
    /* outside the run's ages, and with a climate that has no OLR curve */
    ck_assert_int_eq(volev("balance quick.cfg --age-yr 1e6 -o c"), 2);
    ck_assert_int_eq(volev("balance quick.cfg --age-yr abc"), 2);
    ck_assert_int_eq(volev("balance quick.cfg --set climate.model=hz_fit -o d"), 3);
    assert_err_contains("balance needs climate.model");
    ck_assert(!exists("d/balance.csv"));
    if (system("command -v gnuplot >/dev/null 2>&1") == 0) {
        char plots[1024];
        snprintf(plots, sizeof plots, "%s/plots", vl_test_top());
        setenv("VOLEV_PLOTS_DIR", plots, 1);
        ck_assert_int_eq(volev("plot b --format svg"), 0);
        char *svg = slurp("b/balance.svg");
        ck_assert_ptr_nonnull(svg);
        ck_assert_ptr_nonnull(strstr(svg, "<svg")); /* SVG root element (W3C SVG 1.1) */
        free(svg);
    }
    remove_tmp();
}
END_TEST

/* docs/parameters.md is generated from the tables by `make docs`; it must be current. */
START_TEST(parameter_reference_current)
{
    make_tmp();
    ck_assert_int_eq(volev("processes"), 0);
    char *out = slurp("out.txt");
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
    remove_tmp();
}
END_TEST

START_TEST(plot_renders_png)
{
    if (system("command -v gnuplot >/dev/null 2>&1") != 0)
        return; /* gnuplot is installed by make deps and .ci/run; without it plot exits 6 */
    make_tmp();
    write_file("quick.cfg", quick);
    ck_assert_int_eq(volev("run quick.cfg -o a"), 0);
    char plots[1024];
    snprintf(plots, sizeof plots, "%s/plots", vl_test_top());
    setenv("VOLEV_PLOTS_DIR", plots, 1);
    ck_assert_int_eq(volev("plot a"), 0);
    char *png = slurp("a/history.png");
    ck_assert_ptr_nonnull(png);
    /* PNG signature (ISO/IEC 15948): 89 50 4E 47 0D 0A 1A 0A */
    ck_assert_int_eq(memcmp(png, "\x89PNG\r\n\x1a\n", 8), 0);
    free(png);
    ck_assert_int_eq(volev("plot nowhere"), 5);
    remove_tmp();
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
    tcase_add_test(tc, validate_and_processes);
    tcase_add_test(tc, balance_curves);
    tcase_add_test(tc, parameter_reference_current);
    tcase_add_test(tc, plot_renders_png);
    suite_add_tcase(s, tc);
    return s;
}
