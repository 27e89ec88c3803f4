/* test_scenario.c: scenario loading, validation errors, overrides, the resolved writer
 * and the parameter helpers. Scenario files are written into a fresh temporary folder
 * per test case. */
#include <dirent.h>
#include <limits.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "suites.h"
#include "volev/process.h"
#include "volev/scenario.h"
#include "volev/units.h"

static char tmp_dir[512];
static char cfg_path[1024];

/* A fresh temporary folder per test case (removed even when a test fails). */
static void make_dir(void)
{
    const char *base = getenv("TMPDIR");
    snprintf(tmp_dir, sizeof tmp_dir, "%s/vl_scenario_XXXXXX", base && base[0] ? base : "/tmp");
    ck_assert_ptr_nonnull(mkdtemp(tmp_dir));
}

/* Removes the temporary folder and the files in it. */
static void remove_dir(void)
{
    DIR *d = opendir(tmp_dir);
    if (!d)
        return;
    char path[2048];
    for (struct dirent *e; (e = readdir(d)) != NULL;) {
        if (strcmp(e->d_name, ".") == 0 || strcmp(e->d_name, "..") == 0)
            continue;
        snprintf(path, sizeof path, "%s/%s", tmp_dir, e->d_name);
        unlink(path);
    }
    closedir(d);
    rmdir(tmp_dir);
}

/* Writes text to tmp_dir/name and returns the path (static buffer). */
static const char *write_named(const char *name, const char *text)
{
    snprintf(cfg_path, sizeof cfg_path, "%s/%s", tmp_dir, name);
    FILE *f = fopen(cfg_path, "w");
    ck_assert_ptr_nonnull(f);
    fputs(text, f);
    ck_assert_int_eq(fclose(f), 0);
    return cfg_path;
}

static const char *write_cfg(const char *text) { return write_named("x.cfg", text); }

static vl_scenario *load_text(const char *text, vl_status *st)
{
    return vl_scenario_load(write_cfg(text), NULL, 0, st);
}

/* Global index of a full key; fails the test if there is none. */
static size_t index_of(const char *key)
{
    char full[512];
    for (size_t i = 0; i < vl_param_count(); i++) {
        const vl_param *p;
        void *base;
        const char *prefix;
        vl_param_at(NULL, i, &p, &base, &prefix);
        snprintf(full, sizeof full, "%s%s", prefix, p->key);
        if (strcmp(full, key) == 0)
            return i;
    }
    ck_abort_msg("no parameter %s", key);
    return 0;
}

/* Loading text fails with VL_ERR_INPUT at line, naming the file, and the message
 * contains each of the (up to two) needles. */
static void expect_error(const char *text, int line, const char *needle, const char *needle2)
{
    vl_status st;
    vl_scenario *sc = load_text(text, &st);
    ck_assert_ptr_null(sc);
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_msg(st.line == line, "line %d, expected %d (%s)", st.line, line, st.msg);
    ck_assert_str_eq(st.file, cfg_path);
    ck_assert_msg(strstr(st.msg, needle), "message '%s' lacks '%s'", st.msg, needle);
    if (needle2)
        ck_assert_msg(strstr(st.msg, needle2), "message '%s' lacks '%s'", st.msg, needle2);
}

/* Applying the override to a valid file fails with a --set message containing needle. */
static void expect_override_error(const char *assignment, const char *needle)
{
    vl_status st;
    const char *ov[] = {assignment};
    vl_scenario *sc = vl_scenario_load(write_cfg("planet = { orbit_au = 1.52; };\n"), ov, 1, &st);
    ck_assert_ptr_null(sc);
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_str_eq(st.file, "");
    ck_assert_int_eq(st.line, 0);
    ck_assert_msg(strncmp(st.msg, "--set ", 6) == 0, "message '%s' lacks --set", st.msg);
    ck_assert_msg(strstr(st.msg, needle), "message '%s' lacks '%s'", st.msg, needle);
}

/* Every stored value of a and b is identical, bit for bit. */
static void assert_same_values(const vl_scenario *a, const vl_scenario *b)
{
    char key[512];
    for (size_t i = 0; i < vl_param_count(); i++) {
        const vl_param *p;
        void *ba, *bb;
        const char *prefix;
        vl_param_at(a, i, &p, &ba, &prefix);
        vl_param_at(b, i, &p, &bb, &prefix);
        snprintf(key, sizeof key, "%s%s", prefix, p->key);
        const char *va = (const char *)ba + p->offset, *vb = (const char *)bb + p->offset;
        size_t size = p->type == VL_PT_REAL ? sizeof(double)
                      : p->type == VL_PT_INT ? sizeof(long)
                      : p->type == VL_PT_PATH ? strlen(va) + 1
                                              : sizeof(int);
        ck_assert_msg(memcmp(va, vb, size) == 0, "%s differs after the round trip", key);
    }
}

/* Writes sc resolved into tmp_dir/resolved.cfg and loads it back. */
static vl_scenario *round_trip(const vl_scenario *sc)
{
    vl_status st;
    char path[1024];
    snprintf(path, sizeof path, "%s/resolved.cfg", tmp_dir);
    FILE *f = fopen(path, "w");
    ck_assert_ptr_nonnull(f);
    ck_assert_int_eq(vl_scenario_write_resolved(sc, f, &st), VL_OK);
    ck_assert_int_eq(fclose(f), 0);
    vl_scenario *back = vl_scenario_load(path, NULL, 0, &st);
    ck_assert_msg(back != NULL, "resolved file does not load: %s:%d: %s", st.file, st.line, st.msg);
    return back;
}

/* ---------------------------------------------------------------- helpers */

START_TEST(edit_distance_values)
{
    /* Levenshtein textbook examples, common practice */
    ck_assert_uint_eq(vl_edit_distance("kitten", "sitting"), 3);
    ck_assert_uint_eq(vl_edit_distance("flaw", "lawn"), 2);
    ck_assert_uint_eq(vl_edit_distance("", "abc"), 3);
    ck_assert_uint_eq(vl_edit_distance("abc", ""), 3);
    ck_assert_uint_eq(vl_edit_distance("orbit_au", "orbit_au"), 0);
    ck_assert_uint_eq(vl_edit_distance("planet.radius_rearht", "planet.radius_rearth"), 2);
}
END_TEST

START_TEST(choice_helpers)
{
    char buf[32];
    ck_assert_int_eq(vl_choice_index(VL_LUM_CHOICES, "table"), VL_LUM_TABLE);
    ck_assert_int_eq(vl_choice_index(VL_LUM_CHOICES, "sun_analytic"), VL_LUM_SUN_ANALYTIC);
    ck_assert_int_eq(vl_choice_index(VL_LUM_CHOICES, "contracting"), VL_LUM_CONTRACTING);
    ck_assert_int_eq(vl_choice_index(VL_LUM_CHOICES, "tab"), -1);
    ck_assert_int_eq(vl_choice_index(VL_LUM_CHOICES, "tables"), -1);
    ck_assert_str_eq(vl_choice_name(VL_LUM_CHOICES, VL_LUM_CONSTANT, buf, sizeof buf), "constant");
    ck_assert_str_eq(vl_choice_name(VL_LUM_CHOICES, 3, buf, sizeof buf), "contracting");
    ck_assert_str_eq(vl_choice_name(VL_LUM_CHOICES, 4, buf, sizeof buf), "");
    ck_assert_str_eq(vl_choice_name(VL_LUM_CHOICES, 3, buf, 5), "cont");
}
END_TEST

START_TEST(global_index)
{
    size_t n = vl_core_nparams;
    for (size_t k = 0; k < vl_nprocesses; k++)
        n += 1 + vl_processes[k]->nparams;
    ck_assert_uint_eq(vl_param_count(), n);
    vl_scenario *sc = vl_scenario_new();
    ck_assert_ptr_nonnull(sc);
    const vl_param *p;
    void *base;
    const char *prefix;
    vl_param_at(sc, 0, &p, &base, &prefix);
    ck_assert_ptr_eq(p, &vl_core_params[0]);
    ck_assert_ptr_eq(base, sc);
    ck_assert_str_eq(prefix, "");
    ck_assert_uint_ge(vl_nprocesses, 1);
    vl_param_at(sc, vl_core_nparams, &p, &base, &prefix);
    ck_assert_str_eq(p->key, "enabled");
    ck_assert_int_eq(p->type, VL_PT_BOOL);
    ck_assert_ptr_eq((char *)base + p->offset, &sc->proc[0].enabled);
    char want[256];
    snprintf(want, sizeof want, "processes.%s.", vl_processes[0]->name);
    ck_assert_str_eq(prefix, want);
    if (vl_processes[0]->nparams > 0) {
        vl_param_at(sc, vl_core_nparams + 1, &p, &base, &prefix);
        ck_assert_ptr_eq(p, &vl_processes[0]->params[0]);
        ck_assert_ptr_eq(base, sc->proc[0].params);
    }
    vl_param_at(sc, n, &p, &base, &prefix);
    ck_assert_ptr_null(p);
    vl_scenario_free(sc);
    vl_scenario_free(NULL);
}
END_TEST

/* ---------------------------------------------------------------- loading */

START_TEST(defaults_filled)
{
    vl_scenario *sc = vl_scenario_new();
    ck_assert_ptr_nonnull(sc);
    ck_assert_double_eq(sc->star.mass_kg, 1.0 * VL_M_SUN);
    ck_assert_double_eq(sc->planet.radius_m, 1.0 * VL_R_EARTH);
    ck_assert_double_eq(sc->climate.freeze_temp_k, 273.15);
    ck_assert_int_eq(sc->star.luminosity_model, VL_LUM_SUN_ANALYTIC);
    ck_assert_int_eq(sc->run.log_points, 200);
    ck_assert_str_eq(sc->star.track_file, "");
    for (size_t k = 0; k < vl_nprocesses; k++)
        ck_assert_int_eq(sc->proc[k].enabled, vl_processes[k]->default_enabled);
    for (size_t i = 0; i < vl_param_count(); i++) {
        ck_assert_int_eq(sc->origin[i], VL_FROM_DEFAULT);
        ck_assert_int_eq(sc->line[i], 0);
    }
    vl_scenario_free(sc);
}
END_TEST

START_TEST(minimal_file_and_si)
{
    vl_status st;
    vl_scenario *sc = load_text("# a planet\n"
                                "planet = {\n"
                                "    orbit_au = 1.52;\n"
                                "    mass_mearth = 2;\n"
                                "};\n"
                                "processes = { weathering = { enabled = false; }; };\n",
                                &st);
    ck_assert_msg(sc != NULL, "%s:%d: %s", st.file, st.line, st.msg);
    /* IAU 2012 B2: au = 1.495978707e11 m exact */
    ck_assert_double_eq(sc->planet.orbit_m, 1.52 * VL_AU);
    ck_assert_double_eq_tol(sc->planet.orbit_m, 2.273887634640e11, 1.0);
    /* an integer literal is accepted for a real; NASA NSSDC: M_earth = 5.9722e24 kg */
    ck_assert_double_eq(sc->planet.mass_kg, 2.0 * 5.9722e24);
    ck_assert_double_eq(sc->planet.radius_m, VL_R_EARTH); /* default */
    ck_assert_double_eq(sc->run.end_s, 4.57e9 * VL_YR);
    size_t orbit = index_of("planet.orbit_au");
    ck_assert_int_eq(sc->origin[orbit], VL_FROM_FILE);
    ck_assert_int_eq(sc->line[orbit], 3);
    ck_assert_int_eq(sc->origin[index_of("planet.radius_rearth")], VL_FROM_DEFAULT);
    int w = vl_process_find("weathering");
    ck_assert_int_ge(w, 0);
    ck_assert_int_eq(sc->proc[w].enabled, 0);
    ck_assert_int_eq(sc->line[index_of("processes.weathering.enabled")], 6);
    ck_assert_str_eq(sc->name, "x");
    ck_assert_str_eq(sc->path, cfg_path);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(name_without_extension)
{
    vl_status st;
    vl_scenario *sc = vl_scenario_load(write_named("red.dwarf.cfg", "run = { end_yr = 5e9; };\n"),
                                       NULL, 0, &st);
    ck_assert_ptr_nonnull(sc);
    ck_assert_str_eq(sc->name, "red.dwarf");
    vl_scenario_free(sc);
}
END_TEST

START_TEST(missing_file)
{
    vl_status st;
    char path[1024];
    snprintf(path, sizeof path, "%s/absent.cfg", tmp_dir);
    ck_assert_ptr_null(vl_scenario_load(path, NULL, 0, &st));
    ck_assert_int_eq(st.code, VL_ERR_IO);
    ck_assert_str_eq(st.file, path);
}
END_TEST

START_TEST(track_file_resolves_against_folder)
{
    vl_status st;
    vl_scenario *sc = load_text("star = {\n  luminosity_model = \"table\";\n"
                                "  track_file = \"./tracks/m4.csv\";\n};\n",
                                &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    char want[2048];
    snprintf(want, sizeof want, "%s/tracks/m4.csv", tmp_dir);
    ck_assert_str_eq(sc->star.track_file, want);
    ck_assert_int_eq(sc->star.luminosity_model, VL_LUM_TABLE);
    vl_scenario_free(sc);
    sc = load_text("star = { luminosity_model = \"table\"; track_file = \"/data/t.csv\"; };\n", &st);
    ck_assert_ptr_nonnull(sc);
    ck_assert_str_eq(sc->star.track_file, "/data/t.csv");
    vl_scenario_free(sc);
}
END_TEST

START_TEST(int64_literals)
{
    vl_status st;
    vl_scenario *sc = load_text("run = { end_yr = 8000000000L; max_steps = 3000000L; };\n", &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    ck_assert_double_eq(sc->run.end_s, 8e9 * VL_YR);
    ck_assert_int_eq(sc->run.max_steps, 3000000);
    vl_scenario_free(sc);
}
END_TEST

/* ---------------------------------------------------------------- bad input */

START_TEST(syntax_error)
{
    expect_error("planet = {\n  orbit_au = 1.52;\n  mass_mearth 1.0;\n};\n", 3, "syntax", NULL);
    expect_error("planet = {\n  orbit_au = 1.52;\n\n", 4, "syntax", NULL);
}
END_TEST

START_TEST(unknown_key_suggests)
{
    expect_error("planet = {\n  orbit_au = 1.52;\n  radius_rearht = 1.1;\n};\n", 3,
                 "unknown key 'planet.radius_rearht'", "did you mean 'planet.radius_rearth'?");
    /* the right name in the wrong group */
    expect_error("star = {\n  orbit_au = 0.05;\n};\n", 2, "star.orbit_au",
                 "did you mean 'planet.orbit_au'?");
    /* nothing close: no suggestion */
    expect_error("run = { banana_split = 3; };\n", 1, "run.banana_split", NULL);
    vl_status st;
    ck_assert_ptr_null(load_text("run = { banana_split = 3; };\n", &st));
    ck_assert_ptr_null(strstr(st.msg, "did you mean"));
}
END_TEST

START_TEST(unknown_group)
{
    expect_error("\nplanett = {\n  orbit_au = 1.0;\n};\n", 2, "unknown group 'planett'",
                 "did you mean 'planet'?");
    expect_error("star = {\n  xvu = { model = \"ratio\"; };\n};\n", 2, "star.xvu",
                 "did you mean 'star.xuv'?");
    expect_error("top_level_value = 1;\n", 1, "unknown key 'top_level_value'", NULL);
    /* short names still get a suggestion two edits away */
    expect_error("plnaet = { orbit_au = 1.0; };\n", 1, "plnaet", "did you mean 'planet'?");
}
END_TEST

START_TEST(unknown_process)
{
    expect_error("processes = {\n  weatherin = { enabled = false; };\n};\n", 2,
                 "processes.weatherin", "did you mean 'processes.weathering'?");
    expect_error("processes = {\n\n  volcano_of_doom = { enabled = true; };\n};\n", 3,
                 "unknown process 'processes.volcano_of_doom'", "weathering");
    /* the enclosing group is no suggestion */
    expect_error("processes = {\n  xy = { enabled = true; };\n};\n", 2,
                 "unknown process 'processes.xy' (known processes: ", NULL);
    expect_error("star = {\n  xy = { model = \"ratio\"; };\n};\n", 2,
                 "unknown group 'star.xy'", NULL);
    vl_status st;
    ck_assert_ptr_null(load_text("star = {\n  xy = { model = \"ratio\"; };\n};\n", &st));
    ck_assert_ptr_null(strstr(st.msg, "did you mean 'star'"));
    expect_error("processes = {\n  weathering = { enabeld = false; };\n};\n", 2,
                 "processes.weathering.enabeld", "did you mean 'processes.weathering.enabled'?");
}
END_TEST

START_TEST(wrong_types)
{
    expect_error("planet = {\n  mass_mearth = \"1.0\";\n};\n", 2, "planet.mass_mearth",
                 "must be a number");
    expect_error("star = { luminosity_model = 2; };\n", 1, "star.luminosity_model",
                 "quoted name");
    expect_error("run = {\n  log_points = 2.5;\n};\n", 2, "run.log_points", "whole number");
    expect_error("run = {\n  log_points = 200.0;\n};\n", 2, "run.log_points", "whole number");
    expect_error("processes = { weathering = { enabled = 1; }; };\n", 1,
                 "processes.weathering.enabled", "true or false");
    expect_error("planet = { orbit_au = true; };\n", 1, "planet.orbit_au", "must be a number");
    expect_error("star = { luminosity_model = \"table\"; track_file = 3; };\n", 1,
                 "star.track_file", "file path");
    expect_error("star = { luminosity_model = \"table\"; track_file = \"\"; };\n", 1,
                 "star.track_file", "empty");
}
END_TEST

START_TEST(groups_and_values_swapped)
{
    expect_error("planet = 3;\n", 1, "'planet' is a group", NULL);
    expect_error("processes = {\n  weathering = false;\n};\n", 2, "processes.weathering",
                 "enabled");
    expect_error("planet = {\n  mass_mearth = { a = 1; };\n};\n", 2, "planet.mass_mearth",
                 "not a group");
    expect_error("planet = {\n  orbit_au = [1.0, 2.0];\n};\n", 2, "planet.orbit_au",
                 "not an array");
    expect_error("planet = {\n  orbit_au = (1.0);\n};\n", 2, "planet.orbit_au", "not a list");
}
END_TEST

START_TEST(out_of_bounds)
{
    expect_error("planet = {\n  mass_mearth = -1;\n};\n", 2,
                 "planet.mass_mearth = -1 is out of bounds [0.01, 20] M_earth", NULL);
    expect_error("run = { log_points = 100001; };\n", 1, "run.log_points = 100001",
                 "out of bounds");
    /* 1e400 overflows to infinity when the file is read */
    expect_error("planet = {\n  orbit_au = 1e400;\n};\n", 2, "planet.orbit_au", "finite");
}
END_TEST

START_TEST(oversized_integers)
{
    /* libconfig 1.5 would wrap these to 32 bits without a word */
    expect_error("run = {\n  end_yr = 4570000000;\n};\n", 2, "4570000000", "32 bits");
    expect_error("# \"quoted 9999999999 in a comment\"\nrun = { max_steps = \"x\"; };\n", 2,
                 "run.max_steps", "whole number");
}
END_TEST

START_TEST(include_rejected)
{
    expect_error("planet = { orbit_au = 1.0; };\n@include \"other.cfg\"\n", 2, "@include", NULL);
}
END_TEST

START_TEST(bad_choice)
{
    expect_error("star = {\n  luminosity_model = \"constnat\";\n};\n", 2,
                 "star.luminosity_model = \"constnat\"", "sun_analytic, constant, table, contracting");
}
END_TEST

START_TEST(needs_violation)
{
    expect_error("star = {\n  luminosity_model = \"constant\";\n  track_file = \"t.csv\";\n};\n", 3,
                 "star.track_file is only used when star.luminosity_model is table",
                 "(it is constant)");
    expect_error("star = {\n  contraction_end_yr = 2e8;\n};\n", 2, "star.contraction_end_yr",
                 "(it is sun_analytic)");
    expect_error("processes = { photolysis = {\n  photon_efficiency = 0.5;\n}; };\n", 2,
                 "processes.photolysis.photon_efficiency",
                 "processes.photolysis.photon_limited is true (it is false)");
    vl_status st;
    vl_scenario *sc = load_text("processes = { photolysis = {\n  photon_limited = true;\n"
                                "  photon_efficiency = 0.5;\n}; };\n",
                                &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(needs_checked_after_overrides)
{
    vl_status st;
    const char *ov[] = {"star.luminosity_model=constant"};
    const char *path = write_cfg("star = {\n  luminosity_model = \"table\";\n"
                                 "  track_file = \"t.csv\";\n};\n");
    ck_assert_ptr_null(vl_scenario_load(path, ov, 1, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_int_eq(st.line, 3);
    ck_assert_ptr_nonnull(strstr(st.msg, "(it is constant)"));
    /* and an override can make a file value meaningful */
    const char *ov2[] = {"star.luminosity_model=\"contracting\""};
    vl_scenario *sc = vl_scenario_load(write_cfg("star = {\n  contraction_end_yr = 2.385e8;\n};\n"),
                                       ov2, 1, &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    ck_assert_double_eq(sc->star.contraction_end_s, 2.385e8 * VL_YR);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(end_before_start)
{
    expect_error("run = {\n  start_yr = 2e9;\n  end_yr = 1e9;\n};\n", 3, "run.end_yr", "run.start_yr");
    expect_error("run = {\n  end_yr = 1e7;\n};\n", 2, "must be later", NULL);
}
END_TEST

START_TEST(table_without_track)
{
    expect_error("\nstar = { luminosity_model = \"table\"; };\n", 2, "star.track_file",
                 "star.luminosity_model");
}
END_TEST

/* ---------------------------------------------------------------- overrides */

START_TEST(overrides_apply)
{
    vl_status st;
    const char *ov[] = {"planet.orbit_au=0.7", " processes.weathering.enabled = false ",
                        "star.luminosity_model=\"constant\"", "star.luminosity_lsun=2.385e-3",
                        "run.log_points=17"};
    vl_scenario *sc = vl_scenario_load(write_cfg("planet = { orbit_au = 1.52; };\n"), ov, 5, &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    ck_assert_double_eq(sc->planet.orbit_m, 0.7 * VL_AU);
    size_t orbit = index_of("planet.orbit_au");
    ck_assert_int_eq(sc->origin[orbit], VL_FROM_OVERRIDE);
    ck_assert_int_eq(sc->line[orbit], 0);
    ck_assert_int_eq(sc->proc[vl_process_find("weathering")].enabled, 0);
    ck_assert_int_eq(sc->origin[index_of("processes.weathering.enabled")], VL_FROM_OVERRIDE);
    ck_assert_int_eq(sc->star.luminosity_model, VL_LUM_CONSTANT);
    ck_assert_double_eq(sc->star.luminosity_w, 2.385e-3 * VL_L_SUN);
    ck_assert_int_eq(sc->run.log_points, 17);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(override_path_uses_current_folder)
{
    vl_status st;
    vl_scenario *sc = vl_scenario_new();
    ck_assert_ptr_nonnull(sc);
    ck_assert_int_eq(vl_scenario_override(sc, "star.track_file=\"m dwarf.csv\"", &st), VL_OK);
    char cwd[1024], want[2048];
    ck_assert_ptr_nonnull(getcwd(cwd, sizeof cwd));
    snprintf(want, sizeof want, "%s/m dwarf.csv", cwd);
    ck_assert_str_eq(sc->star.track_file, want);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(override_errors)
{
    expect_override_error("planet.orbt_au=1.0", "did you mean 'planet.orbit_au'?");
    expect_override_error("planet.orbit_au=abc", "'abc' is not a number");
    expect_override_error("planet.orbit_au=1.0x", "not a number");
    expect_override_error("planet.orbit_au=", "not a number");
    expect_override_error("planet.orbit_au=500", "out of bounds");
    expect_override_error("planet.orbit_au=nan", "finite");
    expect_override_error("run.log_points=2.5", "whole number");
    expect_override_error("processes.weathering.enabled=maybe", "true or false");
    expect_override_error("star.luminosity_model=bright", "not one of");
    expect_override_error("planet", "KEY=VALUE");
    expect_override_error("planet=3", "is a group");
    expect_override_error("star.contraction_end_yr=2e8", "only used when star.luminosity_model");
    expect_override_error("run.end_yr=1e4", "run.end_yr");
}
END_TEST

/* ---------------------------------------------------------------- writing */

/* What fn writes for sc, as a new NUL-terminated string. */
static char *captured(void (*fn)(const vl_scenario *, FILE *), const vl_scenario *sc)
{
    FILE *f = tmpfile();
    ck_assert_ptr_nonnull(f);
    fn(sc, f);
    long len = ftell(f);
    ck_assert_int_ge(len, 0);
    rewind(f);
    char *text = malloc((size_t)len + 1);
    ck_assert_ptr_nonnull(text);
    ck_assert_uint_eq(fread(text, 1, (size_t)len, f), (size_t)len);
    text[len] = '\0';
    fclose(f);
    return text;
}

static void write_resolved_ok(const vl_scenario *sc, FILE *f)
{
    vl_status st;
    ck_assert_int_eq(vl_scenario_write_resolved(sc, f, &st), VL_OK);
}

static void print_reference(const vl_scenario *sc, FILE *f)
{
    (void)sc;
    vl_params_print_reference(f);
}

/* Values that naive printing does not reproduce; -0.0 must keep its sign. */
static const char entropic[] =
    "star = {\n"
    "  mass_msun = 0.30000000000000004;\n"
    "  teff_k = 3385.7;\n"
    "  luminosity_model = \"table\";\n"
    "  track_file = \"tracks/we\\\"ird\\\\name\\tx.csv\";\n"
    "  xuv = { saturation_ratio = 2.385e-4; decay_exponent = 1.1111111111111112; };\n"
    "  lyman_alpha_1au_cm2_s = 2.385e11;\n"
    "  wind = { mass_loss_msun_yr = 2.0000000000000004e-14; speed_km_s = 437; };\n"
    "};\n"
    "planet = { mass_mearth = 2.385; radius_rearth = 1.2345678901234567; orbit_au = 0.122;\n"
    "           eccentricity = 0.1; };\n"
    "inventory = { surface_water_to = 3.3333333333333335; co2_bar = -0.0; n2_bar = 0.7808;\n"
    "              mantle_water_to = 1e-300; };\n"
    "climate = { model = \"hz_fit\"; bond_albedo = 0.30000000000000004; co2_reference_bar = 2.837e-4; };\n"
    "run = { start_yr = 3e6; end_yr = 8.7654321e9; log_points = 317; rel_tolerance = 1e-9; };\n"
    "processes = {\n"
    "  weathering = { enabled = false; land_fraction = 0.1234567; };\n"
    "  photolysis = { photon_limited = true; photon_efficiency = 0.7071067811865476; };\n"
    "};\n";

START_TEST(resolved_round_trip)
{
    vl_status st;
    vl_scenario *sc = load_text(entropic, &st);
    ck_assert_msg(sc != NULL, "%s:%d: %s", st.file, st.line, st.msg);
    ck_assert_double_eq(sc->planet.eccentricity, 0.1);
    ck_assert_double_eq(sc->star.mass_kg, (0.1 + 0.2) * VL_M_SUN);
    ck_assert_int_eq(signbit(sc->inventory.co2_pa), 1);
    ck_assert_ptr_nonnull(strstr(sc->star.track_file, "we\"ird\\name\tx.csv"));
    vl_scenario *back = round_trip(sc);
    assert_same_values(sc, back);
    ck_assert_int_eq(signbit(back->inventory.co2_pa), 1);
    /* written as given, although 0.122 * au / au = 0.12199999999999998 */
    char *text = captured(write_resolved_ok, back);
    ck_assert_msg(strstr(text, " orbit_au = 0.122;\n"), "%s", text);
    ck_assert_ptr_nonnull(strstr(text, " mass_msun = 0.30000000000000004;\n"));
    ck_assert_ptr_nonnull(strstr(text, " co2_bar = -0.0;\n"));
    free(text);
    vl_scenario_free(back);
    vl_scenario_free(sc);
}
END_TEST

/* Every real without a condition, set to an awkward value inside its bounds. */
START_TEST(resolved_round_trip_every_real)
{
    size_t n = vl_param_count();
    char (*text)[128] = calloc(n, sizeof *text);
    const char **ov = calloc(n, sizeof *ov);
    ck_assert_ptr_nonnull(text);
    ck_assert_ptr_nonnull(ov);
    size_t count = 0;
    for (size_t i = 0; i < n; i++) {
        const vl_param *p;
        void *base;
        const char *prefix;
        vl_param_at(NULL, i, &p, &base, &prefix);
        if (p->type != VL_PT_REAL || p->needs || strncmp(p->key, "run.", 4) == 0)
            continue;
        double frac = fmod(0.1 + 0.7071067811865476 * (double)(i + 1), 1.0);
        snprintf(text[count], sizeof text[count], "%s%s=%.17g", prefix, p->key,
                 p->lo + frac * (p->hi - p->lo));
        ov[count] = text[count];
        count++;
    }
    vl_status st;
    vl_scenario *sc = vl_scenario_load(write_cfg("run = { end_yr = 2.385e9; };\n"), ov, count, &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    vl_scenario *back = round_trip(sc);
    assert_same_values(sc, back);
    vl_scenario_free(back);
    vl_scenario_free(sc);
    free(ov);
    free(text);
}
END_TEST

/* SI values stored by code other than the loader still round-trip. */
START_TEST(resolved_round_trip_si_edit)
{
    vl_scenario *sc = vl_scenario_new();
    ck_assert_ptr_nonnull(sc);
    snprintf(sc->path, sizeof sc->path, "%s/made.cfg", tmp_dir);
    sc->planet.orbit_m = 2.385 * VL_AU;
    sc->inventory.co2_pa = (0.1 + 0.2) * VL_BAR;
    vl_scenario *back = round_trip(sc);
    assert_same_values(sc, back);
    ck_assert_double_eq(back->planet.orbit_m, 2.385 * VL_AU);
    vl_scenario_free(back);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(resolved_layout)
{
    vl_scenario *sc = vl_scenario_new();
    ck_assert_ptr_nonnull(sc);
    char *text = captured(write_resolved_ok, sc);
    ck_assert_msg(strncmp(text, "# resolved scenario written by volev\n", 37) == 0, "%s", text);
    ck_assert_ptr_nonnull(strstr(text, "\nstar = {\n"));
    ck_assert_ptr_nonnull(strstr(text, "    xuv = {\n        model = \"ratio\";\n"));
    ck_assert_ptr_nonnull(strstr(text, "    orbit_au = 1.0;\n"));
    ck_assert_ptr_nonnull(strstr(text, "    weathering = {\n        enabled = true;\n"));
    /* a key whose condition does not hold is shown but commented out */
    ck_assert_ptr_nonnull(strstr(text, "# contraction_end_yr = "));
    /* the core groups appear once each */
    const char *star = strstr(text, "\nstar = {");
    ck_assert_ptr_null(strstr(star + 1, "\nstar = {"));
    free(text);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(validate_listing)
{
    vl_status st;
    const char *ov[] = {"planet.mass_mearth=2.385"};
    vl_scenario *sc = vl_scenario_load(write_cfg("planet = {\n  orbit_au = 1.52;\n};\n"), ov, 1, &st);
    ck_assert_ptr_nonnull(sc);
    char *text = captured(vl_scenario_print, sc);
    char from[2048];
    snprintf(from, sizeof from, "[%s:2]\n", cfg_path);
    const char *line = strstr(text, "\nplanet.orbit_au ");
    ck_assert_ptr_nonnull(line);
    const char *eol = strchr(line + 1, '\n');
    ck_assert_msg(strncmp(eol - strlen(from) + 1, from, strlen(from)) == 0, "%.*s",
                  (int)(eol - line), line);
    ck_assert_ptr_nonnull(strstr(line, " = 1.52 au "));
    ck_assert_ptr_nonnull(strstr(text, "2.385 M_earth"));
    ck_assert_ptr_nonnull(strstr(text, "[--set]"));
    ck_assert_ptr_nonnull(strstr(text, "[default]"));
    ck_assert_ptr_nonnull(strstr(text, "\nplanet.orbit_au "));
    ck_assert_ptr_nonnull(strstr(text, "processes.weathering.enabled"));
    /* one line per parameter */
    size_t lines = 0;
    for (const char *c = text; *c; c++)
        lines += *c == '\n';
    ck_assert_uint_eq(lines, vl_param_count());
    free(text);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(reference_listing)
{
    char *text = captured(print_reference, NULL);
    for (size_t k = 0; k < vl_nprocesses; k++) {
        const vl_process *proc = vl_processes[k];
        char want[256];
        snprintf(want, sizeof want, "process %s (", proc->name);
        ck_assert_msg(strstr(text, want), "reference lacks %s", proc->name);
        for (size_t c = 0; c < proc->ncolumns; c++)
            ck_assert_ptr_nonnull(strstr(text, proc->columns[c].name));
    }
    ck_assert_ptr_nonnull(strstr(text, "planet.orbit_au"));
    ck_assert_ptr_nonnull(strstr(text, "IAU 2012 B2"));
    ck_assert_ptr_nonnull(strstr(text, "only when processes.photolysis.photon_limited=true"));
    ck_assert_ptr_nonnull(strstr(text, "one of sun_analytic|constant|table|contracting"));
    free(text);
}
END_TEST

Suite *vl_suite_scenario(void)
{
    Suite *s = suite_create("scenario");
    TCase *helpers = tcase_create("helpers");
    tcase_add_test(helpers, edit_distance_values);
    tcase_add_test(helpers, choice_helpers);
    tcase_add_test(helpers, global_index);
    tcase_add_test(helpers, defaults_filled);
    suite_add_tcase(s, helpers);

    TCase *load = tcase_create("load");
    tcase_add_unchecked_fixture(load, make_dir, remove_dir);
    tcase_add_test(load, minimal_file_and_si);
    tcase_add_test(load, name_without_extension);
    tcase_add_test(load, missing_file);
    tcase_add_test(load, track_file_resolves_against_folder);
    tcase_add_test(load, int64_literals);
    suite_add_tcase(s, load);

    TCase *bad = tcase_create("bad input");
    tcase_add_unchecked_fixture(bad, make_dir, remove_dir);
    tcase_add_test(bad, syntax_error);
    tcase_add_test(bad, unknown_key_suggests);
    tcase_add_test(bad, unknown_group);
    tcase_add_test(bad, unknown_process);
    tcase_add_test(bad, wrong_types);
    tcase_add_test(bad, groups_and_values_swapped);
    tcase_add_test(bad, out_of_bounds);
    tcase_add_test(bad, oversized_integers);
    tcase_add_test(bad, include_rejected);
    tcase_add_test(bad, bad_choice);
    tcase_add_test(bad, needs_violation);
    tcase_add_test(bad, needs_checked_after_overrides);
    tcase_add_test(bad, end_before_start);
    tcase_add_test(bad, table_without_track);
    suite_add_tcase(s, bad);

    TCase *ov = tcase_create("overrides");
    tcase_add_unchecked_fixture(ov, make_dir, remove_dir);
    tcase_add_test(ov, overrides_apply);
    tcase_add_test(ov, override_path_uses_current_folder);
    tcase_add_test(ov, override_errors);
    suite_add_tcase(s, ov);

    TCase *out = tcase_create("output");
    tcase_add_unchecked_fixture(out, make_dir, remove_dir);
    tcase_add_test(out, resolved_round_trip);
    tcase_add_test(out, resolved_round_trip_every_real);
    tcase_add_test(out, resolved_round_trip_si_edit);
    tcase_add_test(out, resolved_layout);
    tcase_add_test(out, validate_listing);
    tcase_add_test(out, reference_listing);
    suite_add_tcase(s, out);
    return s;
}
