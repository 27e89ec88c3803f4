/* test_scenario.c: scenario loading, validation errors, overrides and the parameter
 * helpers (the resolved writer and the listings: test_scenario_write.c). Scenario files are written into a fresh temporary folder
 * per test case. */
#include <dirent.h>
#include <limits.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "scenario_support.h"
#include "suites.h"
#include "volev/process.h"
#include "volev/scenario.h"
#include "volev/units.h"
#include "volev/units.h"

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
    vl_scenario *sc = vl_scen_load_text("# a planet\n"
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
    size_t orbit = vl_scen_index_of("planet.orbit_au");
    ck_assert_int_eq(sc->origin[orbit], VL_FROM_FILE);
    ck_assert_int_eq(sc->line[orbit], 3);
    ck_assert_int_eq(sc->origin[vl_scen_index_of("planet.radius_rearth")], VL_FROM_DEFAULT);
    int w = vl_process_find("weathering");
    ck_assert_int_ge(w, 0);
    ck_assert_int_eq(sc->proc[w].enabled, 0);
    ck_assert_int_eq(sc->line[vl_scen_index_of("processes.weathering.enabled")], 6);
    ck_assert_str_eq(sc->name, "x");
    ck_assert_str_eq(sc->path, vl_scen_cfg_path);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(name_without_extension)
{
    vl_status st;
    vl_scenario *sc = vl_scenario_load(vl_scen_write_named("red.dwarf.cfg", "run = { end_yr = 5e9; };\n"),
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
    snprintf(path, sizeof path, "%s/absent.cfg", vl_scen_tmp_dir);
    ck_assert_ptr_null(vl_scenario_load(path, NULL, 0, &st));
    ck_assert_int_eq(st.code, VL_ERR_IO);
    ck_assert_str_eq(st.file, path);
}
END_TEST

START_TEST(track_file_resolves_against_folder)
{
    vl_status st;
    vl_scenario *sc = vl_scen_load_text("star = {\n  luminosity_model = \"table\";\n"
                                "  track_file = \"./tracks/m4.csv\";\n};\n",
                                &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    char want[2048];
    snprintf(want, sizeof want, "%s/tracks/m4.csv", vl_scen_tmp_dir);
    ck_assert_str_eq(sc->star.track_file, want);
    ck_assert_int_eq(sc->star.luminosity_model, VL_LUM_TABLE);
    vl_scenario_free(sc);
    sc = vl_scen_load_text("star = { luminosity_model = \"table\"; track_file = \"/data/t.csv\"; };\n", &st);
    ck_assert_ptr_nonnull(sc);
    ck_assert_str_eq(sc->star.track_file, "/data/t.csv");
    vl_scenario_free(sc);
}
END_TEST

START_TEST(int64_literals)
{
    vl_status st;
    vl_scenario *sc = vl_scen_load_text("run = { end_yr = 8000000000L; max_steps = 3000000L; };\n", &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    ck_assert_double_eq(sc->run.end_s, 8e9 * VL_YR);
    ck_assert_int_eq(sc->run.max_steps, 3000000);
    vl_scenario_free(sc);
}
END_TEST

/* ---------------------------------------------------------------- bad input */

START_TEST(syntax_error)
{
    vl_scen_expect_error("planet = {\n  orbit_au = 1.52;\n  mass_mearth 1.0;\n};\n", 3, "syntax", NULL);
    /* a group never closed: named at its opening line, not at the end of the file */
    vl_scen_expect_error("planet = {\n  orbit_au = 1.52;\n\n", 1, "'{' is never closed", NULL);
}
END_TEST

START_TEST(unknown_key_suggests)
{
    vl_scen_expect_error("planet = {\n  orbit_au = 1.52;\n  radius_rearht = 1.1;\n};\n", 3,
                 "unknown key 'planet.radius_rearht'", "did you mean 'planet.radius_rearth'?");
    /* the right name in the wrong group */
    vl_scen_expect_error("star = {\n  orbit_au = 0.05;\n};\n", 2, "star.orbit_au",
                 "did you mean 'planet.orbit_au'?");
    /* nothing close: no suggestion */
    vl_scen_expect_error("run = { banana_split = 3; };\n", 1, "run.banana_split", NULL);
    vl_status st;
    ck_assert_ptr_null(vl_scen_load_text("run = { banana_split = 3; };\n", &st));
    ck_assert_ptr_null(strstr(st.msg, "did you mean"));
}
END_TEST

START_TEST(unknown_group)
{
    vl_scen_expect_error("\nplanett = {\n  orbit_au = 1.0;\n};\n", 2, "unknown group 'planett'",
                 "did you mean 'planet'?");
    vl_scen_expect_error("star = {\n  xvu = { model = \"ratio\"; };\n};\n", 2, "star.xvu",
                 "did you mean 'star.xuv'?");
    vl_scen_expect_error("top_level_value = 1;\n", 1, "unknown key 'top_level_value'", NULL);
    /* short names still get a suggestion two edits away */
    vl_scen_expect_error("plnaet = { orbit_au = 1.0; };\n", 1, "plnaet", "did you mean 'planet'?");
}
END_TEST

START_TEST(unknown_process)
{
    vl_scen_expect_error("processes = {\n  weatherin = { enabled = false; };\n};\n", 2,
                 "processes.weatherin", "did you mean 'processes.weathering'?");
    vl_scen_expect_error("processes = {\n\n  volcano_of_doom = { enabled = true; };\n};\n", 3,
                 "unknown process 'processes.volcano_of_doom'", "weathering");
    /* the enclosing group is no suggestion */
    vl_scen_expect_error("processes = {\n  xy = { enabled = true; };\n};\n", 2,
                 "unknown process 'processes.xy' (known processes: ", NULL);
    vl_scen_expect_error("star = {\n  xy = { model = \"ratio\"; };\n};\n", 2,
                 "unknown group 'star.xy'", NULL);
    vl_status st;
    ck_assert_ptr_null(vl_scen_load_text("star = {\n  xy = { model = \"ratio\"; };\n};\n", &st));
    ck_assert_ptr_null(strstr(st.msg, "did you mean 'star'"));
    vl_scen_expect_error("processes = {\n  weathering = { enabeld = false; };\n};\n", 2,
                 "processes.weathering.enabeld", "did you mean 'processes.weathering.enabled'?");
}
END_TEST

START_TEST(wrong_types)
{
    vl_scen_expect_error("planet = {\n  mass_mearth = \"1.0\";\n};\n", 2, "planet.mass_mearth",
                 "must be a number");
    vl_scen_expect_error("star = { luminosity_model = 2; };\n", 1, "star.luminosity_model",
                 "quoted name");
    vl_scen_expect_error("run = {\n  log_points = 2.5;\n};\n", 2, "run.log_points", "whole number");
    vl_scen_expect_error("run = {\n  log_points = 200.0;\n};\n", 2, "run.log_points", "whole number");
    vl_scen_expect_error("processes = { weathering = { enabled = 1; }; };\n", 1,
                 "processes.weathering.enabled", "true or false");
    vl_scen_expect_error("planet = { orbit_au = true; };\n", 1, "planet.orbit_au", "must be a number");
    vl_scen_expect_error("star = { luminosity_model = \"table\"; track_file = 3; };\n", 1,
                 "star.track_file", "file path");
    vl_scen_expect_error("star = { luminosity_model = \"table\"; track_file = \"\"; };\n", 1,
                 "star.track_file", "empty");
}
END_TEST

START_TEST(groups_and_values_swapped)
{
    vl_scen_expect_error("planet = 3;\n", 1, "'planet' is a group", NULL);
    vl_scen_expect_error("processes = {\n  weathering = false;\n};\n", 2, "processes.weathering",
                 "enabled");
    vl_scen_expect_error("planet = {\n  mass_mearth = { a = 1; };\n};\n", 2, "planet.mass_mearth",
                 "not a group");
    vl_scen_expect_error("planet = {\n  orbit_au = [1.0, 2.0];\n};\n", 2, "planet.orbit_au",
                 "not an array");
    vl_scen_expect_error("planet = {\n  orbit_au = (1.0);\n};\n", 2, "planet.orbit_au", "not a list");
}
END_TEST

START_TEST(out_of_bounds)
{
    vl_scen_expect_error("planet = {\n  mass_mearth = -1;\n};\n", 2,
                 "planet.mass_mearth = -1 is out of bounds [0.01, 20] M_earth", NULL);
    vl_scen_expect_error("run = { log_points = 100001; };\n", 1, "run.log_points = 100001",
                 "out of bounds");
    /* 1e400 overflows to infinity when the file is read */
    vl_scen_expect_error("planet = {\n  orbit_au = 1e400;\n};\n", 2, "planet.orbit_au", "finite");
}
END_TEST

START_TEST(oversized_integers)
{
    /* libconfig 1.5 would wrap these to 32 bits without a word: a setting's value is read
     * whole (a real row takes it as the real it is; a count row sees its true size) */
    vl_status st;
    vl_scenario *sc = vl_scen_load_text("run = {\n  end_yr = 4570000000;\n};\n", &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    ck_assert_double_eq(sc->run.end_s, 4570000000.0 * VL_YR); /* as the loader stores it */
    vl_scenario_free(sc);
    /* beyond 64 bits: still the real it is (libconfig would saturate it at 9.2e18) */
    vl_scen_expect_error("run = { end_yr = 99999999999999999999; };\n", 1,
                         "run.end_yr = 1e+20 is out of bounds", NULL);
    vl_scen_expect_error("run = { log_points = 4294967297; };\n", 1,
                         "run.log_points = 4294967297 is out of bounds", NULL);
    vl_scen_expect_error("run = { max_steps = -99999999999999999999L; };\n", 1,
                         "run.max_steps = -99999999999999999999 is out of bounds", NULL);
    /* in an array (one type for every element) it is refused with advice */
    vl_scen_expect_error("sweep = { water_to = [1, 4294967297]; };\n", 1, "4294967297",
                         "32 bits");
    vl_scen_expect_error("# \"quoted 9999999999 in a comment\"\nrun = { max_steps = \"x\"; };\n", 2,
                 "run.max_steps", "whole number");
}
END_TEST

START_TEST(include_rejected)
{
    vl_scen_expect_error("planet = { orbit_au = 1.0; };\n@include \"other.cfg\"\n", 2, "@include", NULL);
}
END_TEST

START_TEST(bad_choice)
{
    vl_scen_expect_error("star = {\n  luminosity_model = \"constnat\";\n};\n", 2,
                 "star.luminosity_model = \"constnat\"", "sun_analytic, constant, table, contracting");
}
END_TEST

START_TEST(needs_violation)
{
    vl_scen_expect_error("star = {\n  luminosity_model = \"constant\";\n  track_file = \"t.csv\";\n};\n", 3,
                 "star.track_file is only used when star.luminosity_model is table",
                 "(it is constant)");
    vl_scen_expect_error("star = {\n  contraction_end_yr = 2e8;\n};\n", 2, "star.contraction_end_yr",
                 "(it is sun_analytic)");
    vl_scen_expect_error("processes = { photolysis = {\n  photon_efficiency = 0.5;\n}; };\n", 2,
                 "processes.photolysis.photon_efficiency",
                 "processes.photolysis.photon_limited is true (it is false)");
    vl_status st;
    vl_scenario *sc = vl_scen_load_text("processes = { photolysis = {\n  photon_limited = true;\n"
                                "  photon_efficiency = 0.5;\n}; };\n",
                                &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    vl_scenario_free(sc);
}
END_TEST

/* A scenario written from scratch that leaves the mantle empty while outgassing is on is
 * warned about (issue 19: its carbon cycle has nothing to outgas); 0 set on purpose, or
 * outgassing off, is not. */
START_TEST(empty_mantle_warned)
{
    vl_status st;
    vl_scenario *sc = vl_scen_load_text("inventory = { co2_bar = 1.0; };\n", &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    ck_assert_int_eq(sc->nwarnings, 1);
    ck_assert_ptr_nonnull(strstr(sc->warnings[0], "inventory.mantle_co2_bar"));
    vl_scenario_free(sc);
    sc = vl_scen_load_text("inventory = { mantle_co2_bar = 0.0; mantle_n2_bar = 0.0; };\n", &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    ck_assert_int_eq(sc->nwarnings, 0);
    vl_scenario_free(sc);
    sc = vl_scen_load_text("processes = { outgassing = { enabled = false; }; };\n", &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    ck_assert_int_eq(sc->nwarnings, 0);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(needs_checked_after_overrides)
{
    vl_status st;
    const char *ov[] = {"star.luminosity_model=constant"};
    const char *path = vl_scen_write_cfg("star = {\n  luminosity_model = \"table\";\n"
                                 "  track_file = \"t.csv\";\n};\n");
    /* switching the model from the command line leaves the file's track_file unused: a
     * warning naming it, its line and the switch, not a refusal (issue 19, item 8) */
    vl_scenario *sw = vl_scenario_load(path, ov, 1, &st);
    ck_assert_msg(sw != NULL, "%s", st.msg);
    ck_assert_int_eq(sw->star.luminosity_model, VL_LUM_CONSTANT);
    ck_assert_int_ge(sw->nwarnings, 1); /* the empty mantle is warned about too */
    ck_assert_ptr_nonnull(strstr(sw->warnings[0], "star.track_file (line 3) is not used"));
    ck_assert_ptr_nonnull(strstr(sw->warnings[0], "star.luminosity_model constant"));
    vl_scenario_free(sw);
    /* and an override can make a file value meaningful */
    const char *ov2[] = {"star.luminosity_model=\"contracting\""};
    vl_scenario *sc = vl_scenario_load(vl_scen_write_cfg("star = {\n  contraction_end_yr = 2.385e8;\n};\n"),
                                       ov2, 1, &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    ck_assert_double_eq(sc->star.contraction_end_s, 2.385e8 * VL_YR);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(end_before_start)
{
    vl_scen_expect_error("run = {\n  start_yr = 2e9;\n  end_yr = 1e9;\n};\n", 3, "run.end_yr", "run.start_yr");
    vl_scen_expect_error("run = {\n  end_yr = 1e7;\n};\n", 2, "must be later", NULL);
}
END_TEST

START_TEST(table_without_track)
{
    vl_scen_expect_error("\nstar = { luminosity_model = \"table\"; };\n", 2, "star.track_file",
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
    vl_scenario *sc = vl_scenario_load(vl_scen_write_cfg("planet = { orbit_au = 1.52; };\n"), ov, 5, &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    ck_assert_double_eq(sc->planet.orbit_m, 0.7 * VL_AU);
    size_t orbit = vl_scen_index_of("planet.orbit_au");
    ck_assert_int_eq(sc->origin[orbit], VL_FROM_OVERRIDE);
    ck_assert_int_eq(sc->line[orbit], 0);
    ck_assert_int_eq(sc->proc[vl_process_find("weathering")].enabled, 0);
    ck_assert_int_eq(sc->origin[vl_scen_index_of("processes.weathering.enabled")], VL_FROM_OVERRIDE);
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
    vl_scen_expect_override_error("planet.orbt_au=1.0", "did you mean 'planet.orbit_au'?");
    vl_scen_expect_override_error("planet.orbit_au=abc", "'abc' is not a number");
    vl_scen_expect_override_error("planet.orbit_au=1.0x", "not a number");
    vl_scen_expect_override_error("planet.orbit_au=", "not a number");
    vl_scen_expect_override_error("planet.orbit_au=500", "out of bounds");
    vl_scen_expect_override_error("planet.orbit_au=nan", "finite");
    vl_scen_expect_override_error("run.log_points=2.5", "whole number");
    vl_scen_expect_override_error("processes.weathering.enabled=maybe", "true or false");
    vl_scen_expect_override_error("star.luminosity_model=bright", "not one of");
    vl_scen_expect_override_error("planet", "KEY=VALUE");
    vl_scen_expect_override_error("planet=3", "is a group");
    vl_scen_expect_override_error("star.contraction_end_yr=2e8", "only used when star.luminosity_model");
    vl_scen_expect_override_error("run.end_yr=1e4", "run.end_yr");
}
END_TEST

/* ---------------------------------------------------------------- writing */

/* What fn writes for sc, as a new NUL-terminated string. */
Suite *vl_suite_scenario(void)
{
    Suite *s = suite_create("scenario");
    TCase *helpers = tcase_create("helpers");
    tcase_add_test(helpers, edit_distance_values);
    tcase_add_test(helpers, empty_mantle_warned);
    tcase_add_test(helpers, choice_helpers);
    tcase_add_test(helpers, global_index);
    tcase_add_test(helpers, defaults_filled);
    suite_add_tcase(s, helpers);

    TCase *load = tcase_create("load");
    tcase_add_unchecked_fixture(load, vl_scen_make_dir, vl_scen_remove_dir);
    tcase_add_test(load, minimal_file_and_si);
    tcase_add_test(load, name_without_extension);
    tcase_add_test(load, missing_file);
    tcase_add_test(load, track_file_resolves_against_folder);
    tcase_add_test(load, int64_literals);
    suite_add_tcase(s, load);

    TCase *bad = tcase_create("bad input");
    tcase_add_unchecked_fixture(bad, vl_scen_make_dir, vl_scen_remove_dir);
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
    tcase_add_unchecked_fixture(ov, vl_scen_make_dir, vl_scen_remove_dir);
    tcase_add_test(ov, overrides_apply);
    tcase_add_test(ov, override_path_uses_current_folder);
    tcase_add_test(ov, override_errors);
    suite_add_tcase(s, ov);

    return s;
}
