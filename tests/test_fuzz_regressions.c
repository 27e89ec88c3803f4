/* test_fuzz_regressions.c: every fuzz seed (tests/fuzz/corpus/TARGET/) and every fuzz
 * finding kept as a regression (tests/fuzz/regressions/TARGET/) replayed through the
 * same in-memory entry points and steps as the fuzz targets (tests/fuzz/exercise.c): no
 * crash, and a clean error (code and message) or a clean success. Also the in-memory
 * entry points themselves: vl_scenario_parse against vl_scenario_load, and
 * vl_star_track_parse against the track file reader. */
#include <dirent.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "fuzz/exercise.h"
#include "suites.h"
#include "volev/scenario.h"
#include "volev/sweep_spec.h"
#include "volev/star.h"
#include "volev/units.h"

/* A string literal and its length, for the (text, len) entry points. */
#define TEXT(s) s, strlen(s)

typedef const char *(*exercise_fn)(const unsigned char *data, size_t size);

static int by_name(const void *a, const void *b)
{
    return strcmp(*(char *const *)a, *(char *const *)b);
}

/* Replays every file of VOLEV_TOP/rel through fn, from the top of the repository (the
 * seed scenarios name their track relative to it); returns how many there were. */
static size_t replay_dir(const char *rel, exercise_fn fn)
{
    char dir[4096], cwd[4096];
    snprintf(dir, sizeof dir, "%s/%s", vl_test_top(), rel);
    DIR *d = opendir(dir);
    if (!d)
        return 0;
    char **names = NULL;
    size_t n = 0;
    for (struct dirent *e; (e = readdir(d)) != NULL;) {
        if (e->d_name[0] == '.')
            continue;
        names = realloc(names, (n + 1) * sizeof *names);
        ck_assert_ptr_nonnull(names);
        names[n] = strdup(e->d_name);
        ck_assert_ptr_nonnull(names[n]);
        n++;
    }
    closedir(d);
    if (n > 1)
        qsort(names, n, sizeof *names, by_name);
    ck_assert_ptr_nonnull(getcwd(cwd, sizeof cwd));
    ck_assert_int_eq(chdir(vl_test_top()), 0);
    for (size_t i = 0; i < n; i++) {
        long size = 0;
        char *data = vl_test_slurp(dir, names[i], &size);
        ck_assert_msg(data != NULL, "cannot read %s/%s", rel, names[i]);
        const char *why = fn((const unsigned char *)data, (size_t)size);
        ck_assert_msg(why == NULL, "%s/%s: %s", rel, names[i], why);
        free(data);
        free(names[i]);
    }
    free(names);
    ck_assert_int_eq(chdir(cwd), 0);
    return n;
}

/* The seeds (at least one) and the regressions of a target. */
static void replay_target(const char *target, exercise_fn fn)
{
    char rel[256];
    snprintf(rel, sizeof rel, "tests/fuzz/corpus/%s", target);
    size_t seeds = replay_dir(rel, fn);
    ck_assert_msg(seeds > 0, "no seeds in %s/%s", vl_test_top(), rel);
    snprintf(rel, sizeof rel, "tests/fuzz/regressions/%s", target);
    replay_dir(rel, fn);
}

START_TEST(replay_scenario) { replay_target("scenario", vl_fuzz_scenario); }
END_TEST

START_TEST(replay_track) { replay_target("track", vl_fuzz_track); }
END_TEST

START_TEST(replay_catalogue) { replay_target("catalogue", vl_fuzz_catalogue); }
END_TEST

/* ---------------------------------------------------------------- entry points */

/* Every stored value of a equals that of b. */
static void assert_same(const vl_scenario *a, const vl_scenario *b)
{
    for (size_t i = 0, n = vl_param_count(); i < n; i++) {
        const vl_param *p;
        void *ba, *bb;
        const char *prefix;
        vl_param_at(a, i, &p, &ba, &prefix);
        vl_param_at(b, i, &p, &bb, &prefix);
        size_t size = p->type == VL_PT_REAL ? sizeof(double)
                      : p->type == VL_PT_INT ? sizeof(long)
                      : p->type == VL_PT_PATH ? strlen((const char *)ba) + 1
                                              : sizeof(int);
        ck_assert_msg(memcmp((char *)ba + p->offset, (char *)bb + p->offset, size) == 0,
                      "%s%s differs", prefix, p->key);
        ck_assert_int_eq(a->origin[i], b->origin[i]);
        ck_assert_int_eq(a->line[i], b->line[i]);
    }
}

START_TEST(scenario_parse_like_load)
{
    static const char *const files[] = {"scenarios/earth.cfg", "scenarios/demo.cfg",
                                        "tests/data/mars_today.cfg", "tests/data/sweep/grid.cfg"};
    for (size_t k = 0; k < sizeof files / sizeof files[0]; k++) {
        char path[4096];
        long size;
        vl_status st;
        snprintf(path, sizeof path, "%s/%s", vl_test_top(), files[k]);
        char *text = vl_test_slurp(vl_test_top(), files[k], &size);
        ck_assert_ptr_nonnull(text);
        vl_scenario *parsed = vl_scenario_parse(text, (size_t)size, path, &st);
        ck_assert_msg(parsed != NULL, "%s:%d: %s", st.file, st.line, st.msg);
        vl_scenario *loaded = vl_scenario_load(path, NULL, 0, &st);
        ck_assert_msg(loaded != NULL, "%s:%d: %s", st.file, st.line, st.msg);
        assert_same(parsed, loaded);
        ck_assert_str_eq(parsed->path, loaded->path);
        ck_assert_str_eq(parsed->name, loaded->name);
        ck_assert_int_eq(parsed->sweep_line, loaded->sweep_line);
        /* the sweep group read the same way (both zero-filled; no catalogue path here,
         * which would resolve against different folders) */
        ck_assert_int_eq(parsed->sweep == NULL, loaded->sweep == NULL);
        if (parsed->sweep)
            ck_assert(memcmp(parsed->sweep, loaded->sweep, sizeof *parsed->sweep) == 0);
        vl_scenario_free(parsed);
        vl_scenario_free(loaded);
        free(text);
    }
}
END_TEST

/* Parsing text fails with VL_ERR_INPUT at line, naming label, with want in the message. */
static void expect_parse_error(const char *text, size_t len, const char *label, int line,
                               const char *want)
{
    vl_status st;
    vl_scenario *sc = vl_scenario_parse(text, len, label, &st);
    ck_assert_msg(sc == NULL, "accepted: %s", text);
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_str_eq(st.file, label ? label : "(text)");
    ck_assert_int_eq(st.line, line);
    ck_assert_msg(strstr(st.msg, want) != NULL, "message '%s' lacks '%s'", st.msg, want);
}

START_TEST(scenario_parse_errors)
{
    static const char nul[] = "star = { teff_k = 5000.0; };\nplanet = {\0};\n";
    expect_parse_error(nul, sizeof nul - 1, "nul.cfg", 2, "NUL byte");
    expect_parse_error(TEXT("# x\n\n\x12\xe8@'"), "junk.cfg", 3, "binary data");
    expect_parse_error(TEXT("run = { start_yr = -1.0; };"), "neg.cfg", 1, "out of bounds");
    expect_parse_error(TEXT("\n\nstar = { tef_k = 5000.0; };"), NULL, 3, "star.teff_k");
    /* a string literal where the format allows none: libconfig's own syntax error, at
     * its line (the string is defused before libconfig sees it) */
    expect_parse_error(TEXT("star = { teff_k = 5000.0 \"K\"; };"), "s.cfg", 1, "syntax error");
    expect_parse_error(TEXT("# x\n\"star\" = 1;"), "s.cfg", 2, "syntax error");
    expect_parse_error(TEXT("star = { teff_k = 5000.0, \"K\" };"), "s.cfg", 1, "syntax error");
    expect_parse_error(TEXT("\"\""), "s.cfg", 1, "syntax error");
    /* the length is what counts: the text after it is not read */
    vl_status st;
    vl_scenario *sc = vl_scenario_parse("star = { teff_k = 5000.0; }; junk", 28, "len.cfg", &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    ck_assert_double_eq(sc->star.teff_k, 5000.0);
    ck_assert_str_eq(sc->name, "len");
    vl_scenario_free(sc);
    /* nothing at all, or only blanks and comments, is refused: it would run on defaults */
    expect_parse_error(NULL, 0, NULL, 0, "the scenario is empty");
    expect_parse_error(TEXT(" \n\t# a comment\n/* another */\n// and one more\n"), "c.cfg", 0,
                       "the scenario is empty");
}
END_TEST

START_TEST(scenario_parse_paths_from_cwd)
{
    static const char text[] = "star = { luminosity_model = \"table\"; track_file = \"./t/m.csv\"; };\n";
    char cwd[4096], want[4200];
    vl_status st;
    ck_assert_ptr_nonnull(getcwd(cwd, sizeof cwd));
    vl_scenario *sc = vl_scenario_parse(text, sizeof text - 1, "some/where/x.cfg", &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    snprintf(want, sizeof want, "%s/t/m.csv", cwd);
    ck_assert_str_eq(sc->star.track_file, want);
    ck_assert_str_eq(sc->path, "some/where/x.cfg");
    ck_assert_str_eq(sc->name, "x");
    vl_scenario_free(sc);
}
END_TEST

static const char track_text[] =
    "# invented\n"
    "age_yr,luminosity_lsun,teff_k\r\n"
    "1e6,0.08,3300\n"
    "1e8,0.01,3250\n"
    "1e10,0.011,3260";

START_TEST(track_parse_like_read)
{
    vl_status st;
    vl_star_track *t = vl_star_track_parse(track_text, sizeof track_text - 1, "m.csv", &st);
    ck_assert_msg(t != NULL, "%s", st.msg);
    ck_assert_uint_eq(vl_star_track_rows(t), 3);
    double first, last;
    vl_star_track_span(t, &first, &last);
    ck_assert_double_eq(first, 1e6 * VL_YR);
    ck_assert_double_eq(last, 1e10 * VL_YR);
    vl_scenario *defaults = vl_scenario_new();
    ck_assert_ptr_nonnull(defaults);
    /* a run over exactly the track's ages is covered; the track is the star's now */
    vl_star *s = vl_star_new_track(&defaults->star, t, first, last, &st);
    ck_assert_msg(s != NULL, "%s", st.msg);
    vl_star_state o;
    vl_star_eval(s, 1e8 * VL_YR, &o);
    ck_assert_rel(o.l_bol_w, 0.01 * VL_L_SUN, 1e-12);
    ck_assert_rel(o.teff_k, 3250.0, 1e-12);
    vl_star_free(s);

    /* the file reader gives the same star, through vl_star_new */
    char dir[256];
    vl_test_tmp_make(dir, sizeof dir, "vl_fuzz_track");
    vl_test_write(dir, "m.csv", track_text);
    vl_star_params p = defaults->star;
    p.luminosity_model = VL_LUM_TABLE;
    snprintf(p.track_file, sizeof p.track_file, "%s/m.csv", dir);
    s = vl_star_new(&p, first, last, &st);
    ck_assert_msg(s != NULL, "%s", st.msg);
    vl_star_state f;
    vl_star_eval(s, 1e8 * VL_YR, &f);
    ck_assert(memcmp(&o, &f, sizeof o) == 0);
    vl_star_free(s);
    /* a run longer than the track: refused, naming the file */
    vl_status_clear(&st);
    ck_assert_ptr_null(vl_star_new(&p, first, 1.1 * last, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_str_eq(st.file, p.track_file);
    ck_assert_ptr_nonnull(strstr(st.msg, "covers ages"));
    /* a missing file is an I/O error */
    snprintf(p.track_file, sizeof p.track_file, "%s/none.csv", dir);
    vl_status_clear(&st);
    ck_assert_ptr_null(vl_star_track_read(p.track_file, &st));
    ck_assert_int_eq(st.code, VL_ERR_IO);
    ck_assert_str_eq(st.file, p.track_file);
    vl_test_tmp_remove(dir);
    vl_scenario_free(defaults);
}
END_TEST

/* Parsing a track fails with VL_ERR_INPUT at line, naming label, with want in the message. */
static void expect_track_error(const char *text, size_t len, int line, const char *want)
{
    vl_status st;
    vl_star_track *t = vl_star_track_parse(text, len, "bad.csv", &st);
    ck_assert_msg(t == NULL, "accepted: %s", text);
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_str_eq(st.file, "bad.csv");
    ck_assert_int_eq(st.line, line);
    ck_assert_msg(strstr(st.msg, want) != NULL, "message '%s' lacks '%s'", st.msg, want);
}

START_TEST(track_parse_errors)
{
    static const char nul[] = "age_yr,luminosity_lsun\n1e6,1\n1e8,1\0\n";
    expect_track_error(nul, sizeof nul - 1, 3, "NUL byte");
    expect_track_error("age_yr,luminosity_lsun\n1e6,1\n1e8,1", 30, 3, "1 fields");
    expect_track_error(TEXT("age_yr,luminosity_lsun\n1e6,1\n"), 0, "at least 2");
    expect_track_error(TEXT(""), 0, "no header");
    expect_track_error(TEXT("age_yr,luminosity_lsun\n1e8,1\n1e6,1\n"), 3, "not greater");
    /* binary data, and values beyond what anything derived from them survives */
    expect_track_error(TEXT("\x89PNG\r\n\x1a\n"), 1, "binary data, not a track CSV");
    expect_track_error(TEXT("age_yr,luminosity_lsun\n1e6,1\x01\n"), 2, "control character 0x01");
    expect_track_error(TEXT("age_yr,luminosity_lsun\n1e6,1e6\n1e8,1\n"), 2,
                       "luminosity_lsun = 1e+06 is outside [1e-05, 1000]");
    expect_track_error(TEXT("age_yr,luminosity_lsun,teff_k\n1e6,1,3000\n1e8,1,1e300\n"), 3,
                       "teff_k = 1e+300 is outside");
    expect_track_error(TEXT("age_yr,xuv_lsun,luminosity_lsun\n1e6,2,1\n1e8,1e-3,1\n"), 2,
                       "xuv_lsun = 2 exceeds luminosity_lsun = 1");
    vl_status st;
    vl_star_track *t = vl_star_track_parse(track_text, sizeof track_text - 1, NULL, &st);
    ck_assert_ptr_nonnull(t);
    vl_star_track_free(t);
    vl_star_track_free(NULL);
}
END_TEST

Suite *vl_suite_fuzz_regressions(void)
{
    Suite *s = suite_create("fuzz_regressions");
    TCase *replay = tcase_create("replay");
    tcase_add_test(replay, replay_scenario);
    tcase_add_test(replay, replay_track);
    tcase_add_test(replay, replay_catalogue);
    suite_add_tcase(s, replay);
    TCase *entry = tcase_create("entry points");
    tcase_add_test(entry, scenario_parse_like_load);
    tcase_add_test(entry, scenario_parse_errors);
    tcase_add_test(entry, scenario_parse_paths_from_cwd);
    tcase_add_test(entry, track_parse_like_read);
    tcase_add_test(entry, track_parse_errors);
    suite_add_tcase(s, entry);
    return s;
}
