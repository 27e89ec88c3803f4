/* test_sweep_spec.c: the `sweep` group of a scenario as the scenario loader reads it
 * (sweep_spec.h, docs/ensembles.md): values, lines and defaults in the spec; FILE:LINE
 * messages with suggestions from vl_scenario_parse and vl_scenario_load; and the
 * sweep's checks of what the settings mean together (vl_sweep_load). Every expected
 * value is written in the test's own scenario text, or is a default documented in
 * docs/ensembles.md. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "suites.h"
#include "volev/design.h"
#include "volev/scenario.h"
#include "volev/sweep.h"
#include "volev/sweep_spec.h"

#define TEXT(s) s, strlen(s)

static char tmp[256];

/* Parses text (label "s.cfg"); fails the test with the message on error. */
static vl_scenario *parse(const char *text)
{
    vl_status st;
    vl_scenario *sc = vl_scenario_parse(TEXT(text), "s.cfg", &st);
    ck_assert_msg(sc != NULL, "%s:%d: %s", st.file, st.line, st.msg);
    return sc;
}

/* Parsing text fails with VL_ERR_INPUT at line of "s.cfg", the message holding want
 * and (unless NULL) want2. */
static void expect_parse_error(const char *text, int line, const char *want, const char *want2)
{
    vl_status st;
    vl_scenario *sc = vl_scenario_parse(TEXT(text), "s.cfg", &st);
    ck_assert_msg(sc == NULL, "accepted: %s", text);
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_str_eq(st.file, "s.cfg");
    ck_assert_msg(st.line == line, "line %d, expected %d (%s)", st.line, line, st.msg);
    ck_assert_msg(strstr(st.msg, want) != NULL, "message '%s' lacks '%s'", st.msg, want);
    if (want2)
        ck_assert_msg(strstr(st.msg, want2) != NULL, "message '%s' lacks '%s'", st.msg, want2);
}

/* ---------------------------------------------------------------- reading */

START_TEST(values_lines_and_defaults)
{
    static const char text[] =
        "# a grid over two axes\n"                                                     /* 1 */
        "sweep = {\n"                                                                  /* 2 */
        "  design = \"grid\";\n"                                                       /* 3 */
        "  axes = (\n"                                                                 /* 4 */
        "    { key = \"planet.orbit_au\"; spacing = \"log\"; from = 0.5; to = 2; points = 5; },\n"
        "    { key = \"inventory.surface_water_to\";\n"                                /* 6 */
        "      spacing = \"linear\"; from = 0.1; to = 1.0; points = 3; }\n"            /* 7 */
        "  );\n"                                                                       /* 8 */
        "  o2_rich_bar = 0.5;\n"                                                       /* 9 */
        "};\n";
    vl_scenario *sc = parse(text);
    const vl_sweep_spec *sp = sc->sweep;
    ck_assert_ptr_nonnull(sp);
    ck_assert_int_eq(sc->sweep_line, 2);
    ck_assert_int_eq(sp->line, 2);
    ck_assert_int_eq(sp->design, VL_DESIGN_GRID);
    ck_assert_int_eq(sp->at[VL_SPEC_DESIGN], 3);
    ck_assert_int_eq(sp->at[VL_SPEC_AXES], 4);
    ck_assert_int_eq(sp->at[VL_SPEC_O2_RICH_BAR], 9);
    ck_assert_int_eq(sp->at[VL_SPEC_SEED], 0);
    ck_assert_int_eq(sp->at[VL_SPEC_CATALOGUE], 0);
    ck_assert_uint_eq(sp->naxes, 2);
    const vl_sweep_axis_spec *a = &sp->axes[0], *b = &sp->axes[1];
    ck_assert_str_eq(a->key, "planet.orbit_au");
    ck_assert_int_eq(a->line, 5);
    ck_assert_int_eq(a->spacing, VL_SPACING_LOG);
    ck_assert_double_eq(a->from, 0.5);
    ck_assert_double_eq(a->to, 2.0); /* an integer where a number belongs */
    ck_assert_int_eq(a->points, 5);
    ck_assert_int_eq(a->at[VL_SPEC_AX_POINTS], 5);
    ck_assert_int_eq(a->at[VL_SPEC_AX_DISTRIBUTION], 0);
    ck_assert_str_eq(b->key, "inventory.surface_water_to");
    ck_assert_int_eq(b->line, 6);
    ck_assert_int_eq(b->at[VL_SPEC_AX_KEY], 6);
    ck_assert_int_eq(b->at[VL_SPEC_AX_SPACING], 7);
    ck_assert_int_eq(b->spacing, VL_SPACING_LINEAR);
    ck_assert_double_eq(b->from, 0.1);
    ck_assert_int_eq(b->points, 3);
    ck_assert_double_eq(sp->o2_rich_bar, 0.5);
    /* defaults of settings not written: docs/ensembles.md, the sweep group's table */
    ck_assert_int_eq(sp->seed, 1);
    ck_assert_int_eq(sp->bootstrap, 200);
    ck_assert_double_eq(sp->confidence, 0.95);
    vl_scenario_free(sc);
    /* no sweep group: no spec */
    sc = parse("planet = { orbit_au = 1.0; };\n");
    ck_assert_ptr_null(sc->sweep);
    ck_assert_int_eq(sc->sweep_line, 0);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(lists_and_paths)
{
    static const char cat[] = "sweep = {\n"
                              "  catalogue = \"./sub/cands.csv\";\n"
                              "  water_to = [1.0, 1e-4, 0.0];\n"
                              "};\n";
    char cwd[4096], want[4200];
    ck_assert_ptr_nonnull(getcwd(cwd, sizeof cwd));
    vl_scenario *sc = parse(cat);
    const vl_sweep_spec *sp = sc->sweep;
    /* in memory: relative to the current folder, like star.track_file */
    snprintf(want, sizeof want, "%s/sub/cands.csv", cwd);
    ck_assert_str_eq(sp->catalogue, want);
    ck_assert_int_eq(sp->at[VL_SPEC_CATALOGUE], 2);
    ck_assert_uint_eq(sp->nwater, 3);
    ck_assert_double_eq(sp->water_to[0], 1.0);
    ck_assert_double_eq(sp->water_to[1], 1e-4);
    ck_assert_double_eq(sp->water_to[2], 0.0);
    vl_scenario_free(sc);
    /* from a file: relative to the scenario's folder */
    vl_test_tmp_make(tmp, sizeof tmp, "volev-spec");
    vl_test_write(tmp, "c.cfg", cat);
    char path[600];
    vl_status st;
    snprintf(path, sizeof path, "%s/c.cfg", tmp);
    sc = vl_scenario_load(path, NULL, 0, &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    snprintf(want, sizeof want, "%s/sub/cands.csv", tmp);
    ck_assert_str_eq(sc->sweep->catalogue, want);
    vl_scenario_free(sc);
    vl_test_tmp_remove(tmp);
    /* outcome names are kept as written: the sweep knows the outcomes */
    sc = parse("sweep = { sensitivity = [\"o2_bar\", \"no_such_outcome\"]; };\n");
    ck_assert_uint_eq(sc->sweep->nsens, 2);
    ck_assert_str_eq(sc->sweep->sensitivity[0], "o2_bar");
    ck_assert_str_eq(sc->sweep->sensitivity[1], "no_such_outcome");
    vl_scenario_free(sc);
}
END_TEST

/* ---------------------------------------------------------------- reading errors */

START_TEST(unknown_settings_suggest)
{
    /* inside an axis */
    expect_parse_error("sweep = {\n  design = \"grid\";\n  axes = ( { key = \"planet.orbit_au\";\n"
                       "    spacng = \"log\"; } );\n};\n",
                       4, "unknown key 'sweep.axes.spacng'", "did you mean 'sweep.axes.spacing'?");
    expect_parse_error("sweep = { axes = ( { key = \"a.b\"; distibution = \"normal\"; } ); };\n", 1,
                       "unknown key 'sweep.axes.distibution'",
                       "did you mean 'sweep.axes.distribution'?");
    /* nothing close: the settings an axis takes */
    expect_parse_error("sweep = { axes = ( { key = \"a.b\"; colour = 1; } ); };\n", 1,
                       "unknown key 'sweep.axes.colour'",
                       "(an axis takes: key, spacing, from, to, points, distribution, low, high, "
                       "mean, sd)");
    /* in the group */
    expect_parse_error("\nsweep = { desing = \"grid\"; };\n", 2, "unknown key 'sweep.desing'",
                       "did you mean 'sweep.design'?");
    expect_parse_error("sweep = { bananas = 3; };\n", 1, "unknown key 'sweep.bananas'",
                       "(the sweep group takes: design, members, seed, axes, catalogue, "
                       "water_to, sensitivity, bootstrap, confidence, o2_rich_bar)");
    expect_parse_error("sweep = { extra = { a = 1; }; };\n", 1, "unknown group 'sweep.extra'", NULL);
    /* the group's own name */
    expect_parse_error("swep = { design = \"grid\"; };\n", 1, "unknown group 'swep'",
                       "did you mean 'sweep'?");
    vl_status st;
    ck_assert_ptr_null(vl_scenario_parse(TEXT("sweep = { bananas = 3; };\n"), "s.cfg", &st));
    ck_assert_ptr_null(strstr(st.msg, "did you mean"));
}
END_TEST

START_TEST(types_bounds_and_choices)
{
    expect_parse_error("sweep = 3;\n", 1, "'sweep' must be a group", NULL);
    expect_parse_error("sweep = {\n  members = \"ten\";\n};\n", 2,
                       "sweep.members must be a whole number, not a string", NULL);
    expect_parse_error("sweep = { members = 10.5; };\n", 1,
                       "sweep.members must be a whole number written without a decimal point", NULL);
    expect_parse_error("sweep = { members = 0; };\n", 1,
                       "sweep.members = 0 is out of bounds [1, 100000000]", NULL);
    expect_parse_error("sweep = { bootstrap = 100001; };\n", 1,
                       "sweep.bootstrap = 100001 is out of bounds [0, 100000]", NULL);
    expect_parse_error("sweep = { seed = 4294967296L; };\n", 1,
                       "sweep.seed = 4294967296 is out of bounds [0, 4294967295]", NULL);
    expect_parse_error("sweep = { confidence = 1.5; };\n", 1,
                       "sweep.confidence = 1.5 is out of bounds [0, 1]", NULL);
    expect_parse_error("sweep = { design = { }; };\n", 1,
                       "sweep.design must be a single value, not a group", NULL);
    expect_parse_error("sweep = {\n\n  design = \"cube\";\n};\n", 3,
                       "sweep.design = \"cube\" is not one of: grid, random, latin_hypercube, "
                       "sobol, saltelli",
                       NULL);
    expect_parse_error("sweep = { axes = ( { key = \"a.b\"; distribution = \"gauss\"; } ); };\n", 1,
                       "sweep.axes.distribution = \"gauss\" is not one of: uniform, log_uniform, "
                       "normal, truncated_normal",
                       NULL);
    expect_parse_error("sweep = { axes = ( { key = \"a.b\"; spacing = 2; } ); };\n", 1,
                       "sweep.axes.spacing must be a quoted name: linear or log; not an integer",
                       NULL);
    expect_parse_error("sweep = { axes = ( { key = \"a.b\";\n from = 1e400; } ); };\n", 2,
                       "sweep.axes.from = inf is not a finite number", NULL);
    expect_parse_error("sweep = { axes = ( { key = \"a.b\"; sd = \"wide\"; } ); };\n", 1,
                       "sweep.axes.sd must be a number, not a string", NULL);
    expect_parse_error("sweep = { catalogue = \"\"; };\n", 1,
                       "sweep.catalogue must name a file, not be empty", NULL);
}
END_TEST

START_TEST(lists_errors)
{
    expect_parse_error("sweep = { axes = { key = \"a.b\"; }; };\n", 1,
                       "sweep.axes must be a list of axis groups", "not a group");
    expect_parse_error("sweep = {\n  axes = ( { key = \"a.b\"; },\n    1.0 );\n};\n", 3,
                       "sweep.axes: each axis is a group", "not a real number");
    expect_parse_error("sweep = { axes = ( { key = \"\"; } ); };\n", 1,
                       "sweep.axes.key must name a scenario key, not be empty", NULL);
    expect_parse_error("sweep = { axes = ( { key = 3; } ); };\n", 1,
                       "sweep.axes.key must be a scenario key in double quotes, not an integer",
                       NULL);
    char text[8192] = "sweep = { axes = ( { key = \"";
    memset(text + strlen(text), 'k', 200);
    strcat(text, "\"; } ); };\n");
    expect_parse_error(text, 1, "sweep.axes.key:", "is longer than 127 bytes");
    /* VL_SWEEP_AXES_MAX = 40 axes at most (the Sobol generator's dimension) */
    snprintf(text, sizeof text, "sweep = { axes = (");
    for (int k = 0; k < 41; k++)
        snprintf(text + strlen(text), sizeof text - strlen(text), "%s{ key = \"a.k%d\"; }",
                 k ? ", " : "", k);
    strcat(text, "); };\n");
    expect_parse_error(text, 1, "sweep.axes: at most 40 axes (got 41)", NULL);
    expect_parse_error("sweep = {\n  water_to = [1.0,\n    -1.0];\n};\n", 3,
                       "sweep.water_to = -1 is out of bounds [0, inf] TO", NULL);
    expect_parse_error("sweep = { water_to = []; };\n", 1,
                       "sweep.water_to: 1 to 64 amounts in TO (got 0)", NULL);
    expect_parse_error("sweep = { water_to = 1.0; };\n", 1,
                       "sweep.water_to must be a list [ ... ] of amounts in TO, not a real number",
                       NULL);
    expect_parse_error("sweep = { water_to = ( 1.0, \"wet\" ); };\n", 1,
                       "sweep.water_to must be a number in TO, not a string", NULL);
    expect_parse_error("sweep = { sensitivity = [1]; };\n", 1,
                       "sweep.sensitivity must be an outcome name in double quotes, not an integer",
                       NULL);
}
END_TEST

/* A file names itself and the line in a message (vl_scenario_load, not only parse). */
START_TEST(file_messages)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-spec");
    vl_test_write(tmp, "f.cfg", "run = { end_yr = 5e9; };\nsweep = {\n  axes = ( { key = \"a.b\";"
                                " points = -2; } );\n};\n");
    char path[600];
    vl_status st;
    snprintf(path, sizeof path, "%s/f.cfg", tmp);
    ck_assert_ptr_null(vl_scenario_load(path, NULL, 0, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_str_eq(st.file, path);
    ck_assert_int_eq(st.line, 3);
    ck_assert_str_eq(st.msg, "sweep.axes.points = -2 is out of bounds [1, 100000000]");
    vl_test_tmp_remove(tmp);
}
END_TEST

/* ---------------------------------------------------------------- meaning */

/* vl_sweep_load of a scenario holding group fails with VL_ERR_INPUT at line with want. */
static void expect_sweep_error(const char *group, int line, const char *want)
{
    char path[600], text[4096];
    vl_status st;
    snprintf(text, sizeof text, "run = { start_yr = 4.0e9; end_yr = 4.01e9; };\n%s", group);
    vl_test_write(tmp, "m.cfg", text);
    snprintf(path, sizeof path, "%s/m.cfg", tmp);
    vl_sweep *sw = vl_sweep_load(path, &st);
    ck_assert_msg(sw == NULL, "accepted: %s", group);
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_str_eq(st.file, path);
    ck_assert_msg(st.line == line, "line %d, expected %d (%s)", st.line, line, st.msg);
    ck_assert_msg(strstr(st.msg, want) != NULL, "message '%s' lacks '%s'", st.msg, want);
}

START_TEST(meaning_checked_by_the_sweep)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-spec");
    /* the text's line 1 is the run group: the sweep group starts on line 2 */
    expect_sweep_error("sweep = {\n  design = \"grid\";\n  axes = ( { key = \"planet.orbit_au\";\n"
                       "    distribution = \"uniform\"; } );\n};\n",
                       5, "axis 'planet.orbit_au': distribution has no meaning for a grid axis");
    expect_sweep_error("sweep = {\n  design = \"random\"; members = 4;\n  axes = ( { key = "
                       "\"planet.orbit_au\"; distribution = \"uniform\"; low = 1.0; high = 2.0;\n"
                       "    points = 3; } );\n};\n",
                       5, "points has no meaning for a sampled axis (design \"random\")");
    expect_sweep_error("sweep = {\n  design = \"grid\";\n  axes = ( { key = \"planet.orbit_au\"; "
                       "spacing = \"linear\"; from = 1.0; to = 2.0; } );\n};\n",
                       4, "grid axis 'planet.orbit_au' needs points");
    expect_sweep_error("sweep = {\n  design = \"saltelli\"; members = 4;\n  confidence = 1.0;\n"
                       "  axes = ( { key = \"planet.orbit_au\"; distribution = \"uniform\"; low = "
                       "1.0; high = 2.0; } );\n};\n",
                       4, "sweep.confidence = 1: expected 0 < c < 1");
    expect_sweep_error("sweep = {\n  catalogue = \"c.csv\";\n  o2_rich_bar = 0.0;\n};\n", 4,
                       "sweep.o2_rich_bar must be positive");
    expect_sweep_error("sweep = {\n  design = \"saltelli\"; members = 4;\n  sensitivity = "
                       "[\"o2_bar\", \"o2_bar\"];\n  axes = ( { key = \"planet.orbit_au\"; "
                       "distribution = \"uniform\"; low = 1.0; high = 2.0; } );\n};\n",
                       4, "sweep.sensitivity: 'o2_bar' twice");
    expect_sweep_error("sweep = {\n  design = \"saltelli\"; members = 4;\n  sensitivity = "
                       "[\"water\"];\n  axes = ( { key = \"planet.orbit_au\"; "
                       "distribution = \"uniform\"; low = 1.0; high = 2.0; } );\n};\n",
                       4, "sweep.sensitivity: unknown outcome 'water' (outcomes: final_water_to, "
                          "water_lost_to, o2_bar");
    expect_sweep_error("sweep = {\n  catalogue = \"c.csv\";\n  design = \"grid\";\n};\n", 4,
                       "a catalogue sweep takes no design or axes");
    expect_sweep_error("sweep = {\n  design = \"grid\";\n  axes = ( );\n};\n", 4,
                       "sweep: needs axes");
    expect_sweep_error("sweep = {\n  design = \"sobol\";\n  members = 8;\n  bootstrap = 10;\n"
                       "  axes = ( { key = \"planet.orbit_au\"; distribution = \"uniform\"; low = "
                       "1.0; high = 2.0; } );\n};\n",
                       5, "sweep.bootstrap has no meaning for this design");
    vl_test_tmp_remove(tmp);
}
END_TEST

/* A valid group: the members the sweep builds from the spec. */
START_TEST(sweep_from_spec)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-spec");
    vl_test_write(tmp, "ok.cfg",
                  "run = { start_yr = 4.0e9; end_yr = 4.01e9; };\n"
                  "sweep = {\n  design = \"grid\";\n"
                  "  axes = ( { key = \"planet.orbit_au\"; spacing = \"linear\"; from = 0.9; "
                  "to = 1.1; points = 3; },\n"
                  "    { key = \"inventory.surface_water_to\"; spacing = \"log\"; from = 0.01; "
                  "to = 1.0; points = 2; } );\n};\n");
    char path[600];
    vl_status st;
    snprintf(path, sizeof path, "%s/ok.cfg", tmp);
    vl_sweep *sw = vl_sweep_load(path, &st);
    ck_assert_msg(sw != NULL, "%s:%d: %s", st.file, st.line, st.msg);
    /* 3 x 2 grid points, last axis fastest (docs/ensembles.md) */
    ck_assert_int_eq(sw->members, 6);
    ck_assert_uint_eq(sw->k, 2);
    ck_assert_int_eq(sw->line, 2);
    ck_assert_int_eq(sw->axes[1].line, 5);
    ck_assert_double_eq(sw->x[0], 0.9);
    ck_assert_double_eq(sw->x[1], 0.01);
    ck_assert_rel(sw->x[2 * 2 + 0], 1.0, 1e-12); /* member 2: the middle of [0.9, 1.1] */
    ck_assert_double_eq(sw->x[2 * 2 + 1], 0.01);
    ck_assert_double_eq(sw->x[5 * 2 + 0], 1.1);   /* end points exact */
    ck_assert_double_eq(sw->x[5 * 2 + 1], 1.0);
    char **ov;
    size_t n;
    ck_assert_int_eq(vl_sweep_overrides(sw, 1, &ov, &n, &st), VL_OK);
    ck_assert_uint_eq(n, 2);
    ck_assert_str_eq(ov[0], "planet.orbit_au=0.90000000000000002");
    ck_assert_str_eq(ov[1], "inventory.surface_water_to=1");
    vl_sweep_free_overrides(ov, n);
    vl_sweep_free(sw);
    vl_test_tmp_remove(tmp);
}
END_TEST

/* The hash of catalogue-cat.csv with the scenario cat.cfg in tmp, written with csv. */
static void catalogue_hash(const char *csv, char out[17])
{
    vl_test_write(tmp, "cat.csv", csv);
    vl_test_write(tmp, "cat.cfg",
                  "run = { start_yr = 4.0e9; end_yr = 4.01e9; };\n"
                  "sweep = { catalogue = \"cat.csv\"; };\n");
    char path[600];
    vl_status st;
    snprintf(path, sizeof path, "%s/cat.cfg", tmp);
    vl_sweep *sw = vl_sweep_load(path, &st);
    ck_assert_msg(sw != NULL, "%s:%d: %s", st.file, st.line, st.msg);
    memcpy(out, sw->hash, 17);
    vl_sweep_free(sw);
}

/* The sweep hash (the resume check, docs/ensembles.md) follows the candidates the sweep
 * runs: a changed cell or name makes another sweep; a comment or spacing does not. */
START_TEST(catalogue_hash_follows_content)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-sweep-spec");
    char a[17], b[17], c[17], d[17];
    catalogue_hash("name,orbit_au\nA,1.0\nB,2.0\n", a);
    catalogue_hash("# a comment\nname, orbit_au\nA, 1.0\n\nB,2.0\n", b);
    catalogue_hash("name,orbit_au\nA,1.0\nB,2.5\n", c);
    catalogue_hash("name,orbit_au\nA,1.0\nC,2.0\n", d);
    ck_assert_str_eq(a, b);
    ck_assert_str_ne(a, c);
    ck_assert_str_ne(a, d);
    vl_test_tmp_remove(tmp);
}
END_TEST

Suite *vl_suite_sweep_spec(void)
{
    Suite *s = suite_create("sweep_spec");
    TCase *rd = tcase_create("reading");
    tcase_add_test(rd, values_lines_and_defaults);
    tcase_add_test(rd, lists_and_paths);
    tcase_add_test(rd, unknown_settings_suggest);
    tcase_add_test(rd, types_bounds_and_choices);
    tcase_add_test(rd, lists_errors);
    tcase_add_test(rd, file_messages);
    suite_add_tcase(s, rd);
    TCase *mn = tcase_create("meaning");
    tcase_set_timeout(mn, 60);
    tcase_add_test(mn, meaning_checked_by_the_sweep);
    tcase_add_test(mn, sweep_from_spec);
    tcase_add_test(mn, catalogue_hash_follows_content);
    suite_add_tcase(s, mn);
    return s;
}
