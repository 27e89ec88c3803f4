/* test_catalogue.c: the planet-catalogue reader (src/input/catalogue.c, docs/catalogue.md):
 * a valid catalogue with every feature of the format, the override strings, loading
 * every candidate of tests/data/catalogue/candidates.csv onto scenarios/earth.cfg, and
 * one malformed input per error, each read both from memory and from a file. All
 * expected numbers come from this file or from the data files named beside them. */
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "suites.h"
#include "volev/star_mass.h"
#include "volev/catalogue.h"
#include "volev/params.h"
#include "volev/scenario.h"
#include "volev/units.h"

#define LABEL "mem.csv"

/* The content of tests/data/catalogue/features.csv (CRLF line ends, a byte-order mark,
 * comments, quotes, empty cells, a full-key column, no final line end). */
static const char features[] =
    "\xEF\xBB\xBF# Catalogue features for tests/test_catalogue.c (values invented for the test;\r\n"
    "# this CRLF file must parse like the text in test_features there)\r\n"
    "\r\n"
    "  # an indented comment\r\n"
    "name, orbit_au ,co2_bar,\"water_to\",planet.interior.tectonics\r\n"
    "Alpha,1.2,10,,stagnant_lid\r\n"
    "\"Beta, the second\",\" 0.8 \",,\"2.5\",\r\n"
    "\t# a comment between rows\r\n"
    "   \"Gamma \"\"G\"\"\"  , 1e-1 , -0 , 3 , mobile_lid \r\n"
    "Delta,,,,";

/* Path of a file under the source tree (static buffer). */
static const char *top_path(const char *rel)
{
    static char path[4096];
    snprintf(path, sizeof path, "%s/%s", vl_test_top(), rel);
    return path;
}

/* Writes len bytes to a new temporary file; its path goes into path (size n). */
static void write_temp(const char *text, size_t len, char *path, size_t n)
{
    const char *base = getenv("TMPDIR");
    snprintf(path, n, "%s/vl_catalogue_XXXXXX", base && base[0] ? base : "/tmp");
    int fd = mkstemp(path);
    ck_assert_int_ge(fd, 0);
    FILE *f = fdopen(fd, "wb");
    ck_assert_ptr_nonnull(f);
    ck_assert_uint_eq(fwrite(text, 1, len, f), len);
    ck_assert_int_eq(fclose(f), 0);
}

/* The catalogue of text read from memory and from a file must both fail with code at
 * line, naming their file, with needle in the message. */
static void expect_fail_n(const char *text, size_t len, int code, int line, const char *needle)
{
    vl_status st;
    vl_catalogue *c = vl_catalogue_parse(text, len, LABEL, &st);
    ck_assert_msg(c == NULL, "accepted (memory), expected: %s", needle);
    ck_assert_msg(st.code == code && st.line == line && strstr(st.msg, needle),
                  "memory: got code %d line %d '%s'; expected code %d line %d '%s'", st.code,
                  st.line, st.msg, code, line, needle);
    ck_assert_str_eq(st.file, LABEL);

    char path[1024];
    write_temp(text, len, path, sizeof path);
    c = vl_catalogue_read(path, &st);
    unlink(path);
    ck_assert_msg(c == NULL, "accepted (file), expected: %s", needle);
    ck_assert_msg(st.code == code && st.line == line && strstr(st.msg, needle),
                  "file: got code %d line %d '%s'; expected code %d line %d '%s'", st.code,
                  st.line, st.msg, code, line, needle);
    ck_assert_str_eq(st.file, path);
}

static void expect_fail(const char *text, int line, const char *needle)
{
    expect_fail_n(text, strlen(text), VL_ERR_INPUT, line, needle);
}

/* text must parse from memory and from a file; returns the memory catalogue. */
static vl_catalogue *expect_ok_n(const char *text, size_t len)
{
    vl_status st;
    char path[1024];
    write_temp(text, len, path, sizeof path);
    vl_catalogue *f = vl_catalogue_read(path, &st);
    unlink(path);
    ck_assert_msg(f != NULL, "file: %d: %s", st.line, st.msg);
    vl_catalogue_free(f);
    vl_catalogue *c = vl_catalogue_parse(text, len, LABEL, &st);
    ck_assert_msg(c != NULL, "memory: %d: %s", st.line, st.msg);
    return c;
}

static vl_catalogue *expect_ok(const char *text) { return expect_ok_n(text, strlen(text)); }

/* Two catalogues hold the same columns, names, cells and lines. */
static void assert_same(const vl_catalogue *a, const vl_catalogue *b)
{
    ck_assert_uint_eq(a->ncols, b->ncols);
    ck_assert_uint_eq(a->nrows, b->nrows);
    for (size_t c = 0; c < a->ncols; c++) {
        ck_assert_str_eq(a->keys[c], b->keys[c]);
        ck_assert_str_eq(a->headers[c], b->headers[c]);
    }
    for (size_t r = 0; r < a->nrows; r++) {
        ck_assert_str_eq(a->names[r], b->names[r]);
        ck_assert_int_eq(a->lines[r], b->lines[r]);
        for (size_t c = 0; c < a->ncols; c++) {
            if (!a->cells[r][c])
                ck_assert_ptr_null(b->cells[r][c]);
            else
                ck_assert_str_eq(a->cells[r][c], b->cells[r][c]);
        }
    }
}

/* ---------------------------------------------------------------- valid input */

START_TEST(test_features)
{
    vl_catalogue *c = expect_ok(features);
    /* Expected values: the text `features` above. */
    ck_assert_uint_eq(c->ncols, 4);
    const char *keys[] = {"planet.orbit_au", "inventory.co2_bar", "inventory.surface_water_to",
                          "planet.interior.tectonics"};
    const char *headers[] = {"orbit_au", "co2_bar", "water_to", "planet.interior.tectonics"};
    for (size_t k = 0; k < 4; k++) {
        ck_assert_str_eq(c->keys[k], keys[k]);
        ck_assert_str_eq(c->headers[k], headers[k]);
    }
    ck_assert_uint_eq(c->nrows, 4);
    const char *names[] = {"Alpha", "Beta, the second", "Gamma \"G\"", "Delta"};
    const int lines[] = {6, 7, 9, 10};
    const char *cells[4][4] = {
        {"1.2", "10", NULL, "stagnant_lid"},
        {"0.8", NULL, "2.5", NULL},
        {"1e-1", "-0", "3", "mobile_lid"},
        {NULL, NULL, NULL, NULL},
    };
    for (size_t r = 0; r < 4; r++) {
        ck_assert_str_eq(c->names[r], names[r]);
        ck_assert_int_eq(c->lines[r], lines[r]);
        for (size_t k = 0; k < 4; k++) {
            if (cells[r][k])
                ck_assert_str_eq(c->cells[r][k], cells[r][k]);
            else
                ck_assert_ptr_null(c->cells[r][k]);
        }
    }

    /* The same text as a CRLF file in tests/data/catalogue/. */
    vl_status st;
    vl_catalogue *f = vl_catalogue_read(top_path("tests/data/catalogue/features.csv"), &st);
    ck_assert_msg(f != NULL, "%s:%d: %s", st.file, st.line, st.msg);
    assert_same(c, f);
    vl_catalogue_free(f);
    vl_catalogue_free(c);
}
END_TEST

START_TEST(test_name_anywhere)
{
    /* The name column last, LF line ends, UTF-8 names, a final line end (this file). */
    vl_catalogue *c = expect_ok("orbit_au , n2_bar,name\n"
                                "0.7,0.5,\xC3\x86r\xC3\xB8 b\n"
                                ",,\xE2\x9C\x93\n");
    ck_assert_uint_eq(c->ncols, 2);
    ck_assert_str_eq(c->keys[0], "planet.orbit_au");
    ck_assert_str_eq(c->keys[1], "inventory.n2_bar");
    ck_assert_uint_eq(c->nrows, 2);
    ck_assert_str_eq(c->names[0], "\xC3\x86r\xC3\xB8 b");
    ck_assert_str_eq(c->names[1], "\xE2\x9C\x93");
    ck_assert_str_eq(c->cells[0][0], "0.7");
    ck_assert_str_eq(c->cells[0][1], "0.5");
    ck_assert_ptr_null(c->cells[1][0]);
    ck_assert_int_eq(c->lines[1], 3);
    vl_catalogue_free(c);

    /* Only a name column: candidates that run the base scenario unchanged. */
    c = expect_ok("name\nA\nB\n");
    ck_assert_uint_eq(c->ncols, 0);
    ck_assert_uint_eq(c->nrows, 2);
    char *out[1];
    ck_assert_uint_eq(vl_catalogue_overrides(c, 1, out), 0);
    vl_catalogue_free(c);
    vl_catalogue_free(NULL);
}
END_TEST

START_TEST(test_short_keys)
{
    /* The mapping of the brief, restated in docs/catalogue.md. */
    const char *pairs[][2] = {
        {"star_mass_msun", "star.mass_msun"},
        {"star_teff_k", "star.teff_k"},
        {"star_luminosity_lsun", "star.luminosity_lsun"},
        {"star_age_yr", "star.present_age_yr"},
        {"planet_mass_mearth", "planet.mass_mearth"},
        {"planet_radius_rearth", "planet.radius_rearth"},
        {"orbit_au", "planet.orbit_au"},
        {"eccentricity", "planet.eccentricity"},
        {"dipole_moment_earth", "planet.dipole_moment_earth"},
        {"water_to", "inventory.surface_water_to"},
        {"co2_bar", "inventory.co2_bar"},
        {"n2_bar", "inventory.n2_bar"},
    };
    for (size_t i = 0; i < sizeof pairs / sizeof pairs[0]; i++)
        ck_assert_str_eq(vl_catalogue_short_key(pairs[i][0]), pairs[i][1]);
    ck_assert_ptr_null(vl_catalogue_short_key("name"));
    ck_assert_ptr_null(vl_catalogue_short_key("planet.orbit_au"));
}
END_TEST

START_TEST(test_overrides)
{
    vl_catalogue *c = expect_ok(features);
    char *out[4];
    /* Expected strings: row Alpha of `features` above. */
    size_t n = vl_catalogue_overrides(c, 0, out);
    ck_assert_uint_eq(n, 3);
    ck_assert_str_eq(out[0], "planet.orbit_au=1.2");
    ck_assert_str_eq(out[1], "inventory.co2_bar=10");
    ck_assert_str_eq(out[2], "planet.interior.tectonics=stagnant_lid");
    for (size_t i = 0; i < n; i++)
        free(out[i]);
    n = vl_catalogue_overrides(c, 2, out);
    ck_assert_uint_eq(n, 4);
    ck_assert_str_eq(out[0], "planet.orbit_au=1e-1");
    ck_assert_str_eq(out[1], "inventory.co2_bar=-0");
    ck_assert_str_eq(out[2], "inventory.surface_water_to=3");
    ck_assert_str_eq(out[3], "planet.interior.tectonics=mobile_lid");
    for (size_t i = 0; i < n; i++)
        free(out[i]);
    ck_assert_uint_eq(vl_catalogue_overrides(c, 3, out), 0);  /* Delta: every cell empty */
    ck_assert_uint_eq(vl_catalogue_overrides(c, 4, out), 0);  /* out of range */
    ck_assert_uint_eq(vl_catalogue_overrides(NULL, 0, out), 0);
    vl_catalogue_free(c);
}
END_TEST

/* Every candidate of candidates.csv loads onto earth.cfg; set cells take the file's
 * values, empty cells keep earth.cfg's. */
/* The global index of a core parameter. */
static size_t core_index(const char *key)
{
    for (size_t i = 0; i < vl_param_count(); i++) {
        const vl_param *p;
        void *base;
        const char *prefix;
        vl_param_at(NULL, i, &p, &base, &prefix);
        if (!prefix[0] && strcmp(p->key, key) == 0)
            return i;
    }
    ck_abort_msg("no parameter %s", key);
    return 0;
}

START_TEST(test_load_candidates)
{
    vl_status st;
    vl_catalogue *c = vl_catalogue_read(top_path("tests/data/catalogue/candidates.csv"), &st);
    ck_assert_msg(c != NULL, "%s:%d: %s", st.file, st.line, st.msg);
    ck_assert_uint_eq(c->nrows, 3);
    ck_assert_uint_eq(c->ncols, 14);
    ck_assert_str_eq(c->names[1], "Invented 2, dry");
    ck_assert_int_eq(c->lines[0], 5);
    ck_assert_int_eq(c->lines[2], 9);
    char earth[4096];
    snprintf(earth, sizeof earth, "%s", top_path("scenarios/earth.cfg"));
    vl_scenario *base = vl_scenario_load(earth, NULL, 0, &st);
    ck_assert_msg(base != NULL, "%s:%d: %s", st.file, st.line, st.msg);
    vl_scenario *sc[3];
    for (size_t r = 0; r < c->nrows; r++) {
        char *out[14];
        size_t n = vl_catalogue_overrides(c, r, out);
        ck_assert_uint_ne(n, SIZE_MAX);
        sc[r] = vl_scenario_load(earth, (const char *const *)out, n, &st);
        ck_assert_msg(sc[r] != NULL, "candidate %s: %s", c->names[r], st.msg);
        for (size_t i = 0; i < n; i++)
            free(out[i]);
    }
    /* Invented-1, every cell set (values: tests/data/catalogue/candidates.csv). */
    ck_assert_rel(sc[0]->star.mass_kg, 0.9 * VL_M_SUN, 1e-15);
    ck_assert_rel(sc[0]->star.teff_k, 5400.0, 1e-15);
    ck_assert_rel(sc[0]->star.luminosity_w, 0.8 * VL_L_SUN, 1e-15);
    ck_assert_rel(sc[0]->star.present_age_s, 5.0e9 * VL_YR, 1e-15);
    ck_assert_rel(sc[0]->planet.orbit_m, 0.85 * VL_AU, 1e-15);
    ck_assert_rel(sc[0]->planet.eccentricity, 0.02, 1e-15);
    ck_assert_rel(sc[0]->planet.mass_kg, 1.5 * VL_M_EARTH, 1e-15);
    ck_assert_rel(sc[0]->planet.radius_m, 1.12 * VL_R_EARTH, 1e-15);
    ck_assert_rel(sc[0]->planet.dipole_am2, 0.5 * 8.0e22, 1e-15); /* 8e22 A m^2 per unit: params_core.c */
    ck_assert_rel(sc[0]->inventory.surface_water_kg, 2.0 * VL_TO_KG, 1e-15);
    ck_assert_rel(sc[0]->inventory.co2_pa, 30.0 * VL_BAR, 1e-15);
    ck_assert_rel(sc[0]->inventory.n2_pa, 1.2 * VL_BAR, 1e-15);
    ck_assert_int_eq(sc[0]->interior.tectonics, VL_TECTONICS_STAGNANT);
    /* Invented 2, dry: some cells set, the others earth.cfg's (candidates.csv). */
    ck_assert_rel(sc[1]->planet.orbit_m, 1.3 * VL_AU, 1e-15);
    ck_assert_rel(sc[1]->planet.mass_kg, 0.6 * VL_M_EARTH, 1e-15);
    ck_assert_rel(sc[1]->inventory.surface_water_kg, 0.1 * VL_TO_KG, 1e-15);
    ck_assert(sc[1]->planet.dipole_am2 == 0.0);
    ck_assert(sc[1]->planet.eccentricity == base->planet.eccentricity);
    ck_assert(sc[1]->inventory.co2_pa == base->inventory.co2_pa);
    /* a row that gives a star's mass but no luminosity gets its star's own, as --set does
     * (issue 19: not the base scenario's Sun): the main-sequence value for 1.1 M_sun */
    ck_assert_rel(sc[1]->star.luminosity_w, vl_star_ms_luminosity_lsun(1.1) * VL_L_SUN, 1e-15);
    ck_assert_int_eq(sc[1]->origin[core_index("star.luminosity_lsun")], VL_FROM_MASS);
    ck_assert_rel(sc[1]->star.teff_k, 6000.0, 1e-15); /* given in the row: kept */
    ck_assert_int_eq(sc[1]->interior.tectonics, VL_TECTONICS_MOBILE);
    /* Invented-3: no cell set, earth.cfg unchanged. */
    ck_assert(sc[2]->planet.orbit_m == base->planet.orbit_m);
    ck_assert(sc[2]->star.mass_kg == base->star.mass_kg);
    ck_assert(sc[2]->inventory.surface_water_kg == base->inventory.surface_water_kg);
    for (size_t r = 0; r < 3; r++)
        vl_scenario_free(sc[r]);
    vl_scenario_free(base);
    vl_catalogue_free(c);
}
END_TEST

/* ---------------------------------------------------------------- malformed input */

START_TEST(test_empty)
{
    /* Line numbers and messages: src/input/catalogue.c, finish(). */
    expect_fail("", 0, "no header line");
    expect_fail("# only a comment\n\n   \n\t# another\n", 0, "no header line");
    expect_fail("# header only\nname,orbit_au\r\n# and a comment\n\n", 2, "no candidates");
}
END_TEST

START_TEST(test_name_column)
{
    expect_fail("orbit_au,co2_bar\n1,2\n", 1, "the header has no 'name' column");
    expect_fail("name,orbit_au,name\nA,1,A\n", 1, "column 'name' appears twice");
    expect_fail("name,co2_bar\n,1\n", 2, "column 'name': empty candidate name");
    expect_fail("name,co2_bar\nA,1\n\"  \",2\n", 3, "column 'name': empty candidate name");
    expect_fail("name,co2_bar\nA,1\nB,2\n# comment\nA,3\n", 5,
                "candidate 'A' appears twice: on line 2 and on line 5");
}
END_TEST

START_TEST(test_header_names)
{
    expect_fail("name,,co2_bar\n", 1, "header field 2 is empty");
    expect_fail("name,orbt_au\nA,1\n", 1, "unknown column 'orbt_au' (did you mean 'orbit_au'?)");
    expect_fail("name,Orbit_AU\nA,1\n", 1,
                "columns are name, star_mass_msun, star_teff_k, star_luminosity_lsun, "
                "star_age_yr, planet_mass_mearth, planet_radius_rearth, orbit_au, "
                "eccentricity, dipole_moment_earth, water_to, co2_bar, n2_bar, or a full "
                "scenario key");
    expect_fail("Name,orbit_au\nA,1\n", 1, "unknown column 'Name' (did you mean 'name'?)");
    expect_fail("name,tectonics\nA,mobile_lid\n", 1,
                "did you mean the full key 'planet.interior.tectonics'?");
    expect_fail("name,qqqqqqqqqqqqqqqqqqqqqqqq\n", 1, "(closest short name: '");
    expect_fail("name,planet..orbit_au\n", 1, "column 'planet..orbit_au': not a scenario key");
    expect_fail("name,.planet\n", 1, "column '.planet': not a scenario key");
    expect_fail("name,planet.\n", 1, "column 'planet.': not a scenario key");
    expect_fail("name,planet.orbit-au\n", 1, "column 'planet.orbit-au': not a scenario key");
    expect_fail("name,co2_bar,n2_bar,co2_bar\n", 1, "column 'co2_bar' appears twice");
    expect_fail("name,orbit_au,planet.orbit_au\n", 1,
                "columns 'orbit_au' and 'planet.orbit_au' both set planet.orbit_au");
    expect_fail("name, \"processes.x.y\" ,processes.x.y\n", 1,
                "column 'processes.x.y' appears twice");
}
END_TEST

START_TEST(test_numbers)
{
    vl_status st;
    /* The exact message of the brief. */
    ck_assert_ptr_null(vl_catalogue_parse("name,orbit_au\nA,1\nB,abc\n", 23, LABEL, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_int_eq(st.line, 3);
    ck_assert_str_eq(st.msg, "column 'orbit_au': expected a finite number, got 'abc'");
    /* Values that strtod would take, in part or whole, but the format refuses. */
    const char *bad[] = {"nan", "NaN", "inf", "-Infinity", "1.5x", "1e999",
                         "-1e400", "1 2", "\"1,5\"", "--1", ".", "+", "1e", "e5", "1.2.3"};
    for (size_t i = 0; i < sizeof bad / sizeof bad[0]; i++) {
        char text[128], needle[128];
        snprintf(text, sizeof text, "name,co2_bar\nA,%s\n", bad[i]);
        const char *shown = strcmp(bad[i], "\"1,5\"") == 0 ? "1,5" : bad[i];
        snprintf(needle, sizeof needle, "column 'co2_bar': expected a finite number, got '%s'",
                 shown);
        expect_fail(text, 2, needle);
    }
    /* A full key that a short name stands for takes numbers only. */
    expect_fail("name,planet.orbit_au\nA,near\n", 2,
                "column 'planet.orbit_au': expected a finite number, got 'near'");
    /* Hexadecimal and underflow are named as such (number.h), as in every reader. */
    expect_fail("name,co2_bar\nA,0x1p3\n", 2, "column 'co2_bar': '0x1p3' is not a number "
                "(hexadecimal is not accepted");
    expect_fail("name,co2_bar\nA,0X10\n", 2, "column 'co2_bar': '0X10' is not a number "
                "(hexadecimal");
    expect_fail("name,co2_bar\nA,1e-400\n", 2, "column 'co2_bar': '1e-400' underflows");
    expect_fail("name,co2_bar\nA,-2.5e-320\n", 2, "column 'co2_bar': '-2.5e-320' underflows");
    /* Accepted forms (this file); zero written with any exponent is zero, not underflow. */
    vl_catalogue *c = expect_ok("name,co2_bar\nA,-0.5\nB,+3.\nC,.25E+2\nD,0e-400\n");
    ck_assert_str_eq(c->cells[2][0], ".25E+2");
    vl_catalogue_free(c);
}
END_TEST

START_TEST(test_words)
{
    const char *bad[] = {"stagnant lid", "stagnant-lid", "9lives", "nan", "INF", "a.b",
                         "\"x\"\"y\""};
    const char *shown[] = {"stagnant lid", "stagnant-lid", "9lives", "nan", "INF", "a.b",
                           "x\"y"};
    for (size_t i = 0; i < sizeof bad / sizeof bad[0]; i++) {
        char text[128], needle[160];
        snprintf(text, sizeof text, "name,planet.interior.tectonics\nA,mobile_lid\nB,%s\n",
                 bad[i]);
        snprintf(needle, sizeof needle,
                 "column 'planet.interior.tectonics': expected a finite number or a bare "
                 "word (letters, digits and '_', not starting with a digit), got '%s'",
                 shown[i]);
        expect_fail(text, 3, needle);
    }
    vl_catalogue *c = expect_ok("name,processes.impacts.enabled,processes.x.y\n"
                                "A,false,_Z9\nB,\"true\",-2e3\n");
    ck_assert_str_eq(c->cells[0][1], "_Z9");
    ck_assert_str_eq(c->cells[1][0], "true");
    vl_catalogue_free(c);
}
END_TEST

START_TEST(test_fields_and_quotes)
{
    expect_fail("name,orbit_au,co2_bar\nA,1,2\nB,1\n", 3,
                "2 fields, but the header on line 1 has 3");
    expect_fail("name,orbit_au\nA, B,1\n", 2,
                "3 fields, but the header on line 1 has 2 (a name or value containing a comma "
                "needs double quotes)");
    expect_fail("name,orbit_au\n\"A,1\n", 2, "column 'name': unterminated quote");
    expect_fail("name,orbit_au\nA,\"1\"\"\n", 2, "column 'orbit_au': unterminated quote");
    expect_fail("name,\"orbit_au\n", 1, "header field 2: unterminated quote");
    expect_fail("name,orbit_au\nA,1,\"2\n", 2, "field 3 (the header has 2): unterminated quote");
    expect_fail("name\n\"A\"x\n", 2, "column 'name': text after the closing quote");
    expect_fail("name\nA\"b\"\n", 2, "column 'name': '\"' inside an unquoted field");
}
END_TEST

START_TEST(test_binary)
{
    expect_fail_n("name\nA\0B\n", 9, VL_ERR_INPUT, 2, "NUL byte at byte 2 of the line");
    expect_fail_n("\0\0\0\0", 4, VL_ERR_INPUT, 1, "NUL byte at byte 1 of the line");
    expect_fail("name\nA\x01\n", 2, "control character 0x01 at byte 2 of the line");
    expect_fail("# comment \x1b[31m\nname\nA\n", 1, "control character 0x1B at byte 11");
    expect_fail("name\nA\x7f\n", 2, "control character 0x7F");
    expect_fail("name\nA\rB\n", 2, "carriage return at byte 2 of the line");
    expect_fail("name\nA\xFF\n", 2, "byte 0xFF at byte 2 of the line is not UTF-8 text");
    expect_fail("name\nA\xC0\xAF\n", 2, "byte 0xC0 at byte 2");          /* overlong '/' */
    expect_fail("name\nA\xED\xA0\x80\n", 2, "byte 0xED at byte 2");      /* surrogate */
    expect_fail("name\nA\xE2\x82", 2, "byte 0xE2 at byte 2");            /* cut short */
    expect_fail("name\nA\xF4\x90\x80\x80\n", 2, "byte 0xF4 at byte 2");  /* above U+10FFFF */
    expect_fail("\xEF\xBB\xBF\xEF\xBB\xBFname\nA\n", 1, "unknown column");  /* BOM once only */
}
END_TEST

/* A catalogue whose second line is a comment of len bytes (and a line end). */
static char *long_comment(size_t len, const char *end)
{
    const char *head = "name\n", *tail = "A\n";
    char *t = malloc(strlen(head) + len + strlen(end) + strlen(tail) + 1);
    ck_assert_ptr_nonnull(t);
    strcpy(t, head);
    memset(t + strlen(head), 'x', len);
    t[strlen(head)] = '#';
    strcpy(t + strlen(head) + len, end);
    strcat(t, tail);
    return t;
}

START_TEST(test_limits_line)
{
    /* 65536 bytes: VL_CATALOGUE_LINE_MAX (the brief's 64 KiB). */
    char *t = long_comment(65536, "\n");
    vl_catalogue_free(expect_ok(t));
    free(t);
    t = long_comment(65536, "\r\n");
    vl_catalogue_free(expect_ok(t));
    free(t);
    t = long_comment(65537, "\n");
    expect_fail(t, 2, "line longer than 65536 bytes");
    free(t);
    t = long_comment(200000, "\r\n");
    expect_fail(t, 2, "line longer than 65536 bytes");
    free(t);
    /* Fields: at most 255 bytes (VL_CATALOGUE_FIELD_MAX). */
    char text[1024], field[300];
    memset(field, 'n', 256);
    field[256] = '\0';
    snprintf(text, sizeof text, "name\n%s\n", field);
    expect_fail(text, 2, "column 'name': name longer than 255 bytes");
    snprintf(text, sizeof text, "name,%s\n", field);
    expect_fail(text, 1, "header field 2 is longer than 255 bytes");
    memset(field, '0', 256);
    field[0] = '1';
    snprintf(text, sizeof text, "name,co2_bar\nA,%s\n", field);
    expect_fail(text, 2, "column 'co2_bar': value longer than 255 bytes");
    field[255] = '\0';
    snprintf(text, sizeof text, "name,co2_bar\nA,%s\n", field);
    vl_catalogue_free(expect_ok(text));
}
END_TEST

/* A header of the name and n full-key columns, and one row. */
static char *wide(size_t n)
{
    char *t = malloc(32 * (n + 2));
    ck_assert_ptr_nonnull(t);
    size_t used = (size_t)sprintf(t, "name");
    for (size_t i = 0; i < n; i++)
        used += (size_t)sprintf(t + used, ",p.k%zu", i);
    used += (size_t)sprintf(t + used, "\nA");
    for (size_t i = 0; i < n; i++)
        used += (size_t)sprintf(t + used, ",%zu", i);
    strcpy(t + used, "\n");
    return t;
}

START_TEST(test_limits_columns)
{
    /* At most 256 columns, the name included (VL_CATALOGUE_COLS_MAX). */
    char *t = wide(255);
    vl_catalogue *c = expect_ok(t);
    ck_assert_uint_eq(c->ncols, 255);
    ck_assert_str_eq(c->cells[0][254], "254");
    vl_catalogue_free(c);
    free(t);
    t = wide(256);
    expect_fail(t, 1, "the header has 257 columns; at most 256 are allowed");
    free(t);
}
END_TEST

/* "name\n" and n rows "c<i>". */
static char *tall(size_t n, size_t *len)
{
    char *t = malloc(16 * (n + 1));
    ck_assert_ptr_nonnull(t);
    size_t used = (size_t)sprintf(t, "name\n");
    for (size_t i = 0; i < n; i++)
        used += (size_t)sprintf(t + used, "c%zu\n", i);
    *len = used;
    return t;
}

START_TEST(test_limits_rows)
{
    /* At most 1,000,000 candidates (VL_CATALOGUE_ROWS_MAX). */
    size_t len;
    char *t = tall(1000000, &len);
    vl_status st;
    vl_catalogue *c = vl_catalogue_parse(t, len, LABEL, &st);
    ck_assert_msg(c != NULL, "%d: %s", st.line, st.msg);
    ck_assert_uint_eq(c->nrows, 1000000);
    ck_assert_str_eq(c->names[999999], "c999999");
    ck_assert_int_eq(c->lines[999999], 1000001);
    vl_catalogue_free(c);
    free(t);
    t = tall(1000001, &len);
    expect_fail_n(t, len, VL_ERR_INPUT, 1000002, "more than 1000000 candidates");
    free(t);
}
END_TEST

START_TEST(test_files)
{
    vl_status st;
    const char *bad = top_path("tests/data/catalogue/bad_value.csv");
    ck_assert_ptr_null(vl_catalogue_read(bad, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_int_eq(st.line, 4); /* tests/data/catalogue/bad_value.csv */
    ck_assert_str_eq(st.file, bad);
    ck_assert_str_eq(st.msg, "column 'orbit_au': expected a finite number, got 'abc'");

    const char *missing = top_path("tests/data/catalogue/no_such_file.csv");
    ck_assert_ptr_null(vl_catalogue_read(missing, &st));
    ck_assert_int_eq(st.code, VL_ERR_IO);
    ck_assert_int_eq(st.line, 0);
    ck_assert_ptr_nonnull(strstr(st.msg, "cannot open catalogue"));

    const char *dir = top_path("tests/data/catalogue");
    ck_assert_ptr_null(vl_catalogue_read(dir, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT); /* the wrong kind of file: bad input */
    ck_assert_int_eq(st.line, 0);
    ck_assert_str_eq(st.file, dir);
    ck_assert_str_eq(st.msg, "cannot read catalogue: it is a folder, not a regular file");

    ck_assert_ptr_null(vl_catalogue_parse(NULL, 0, NULL, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_str_eq(st.file, "");
}
END_TEST

Suite *vl_suite_catalogue(void)
{
    Suite *s = suite_create("catalogue");
    TCase *tc = tcase_create("core");
    tcase_add_test(tc, test_features);
    tcase_add_test(tc, test_name_anywhere);
    tcase_add_test(tc, test_short_keys);
    tcase_add_test(tc, test_overrides);
    tcase_add_test(tc, test_load_candidates);
    tcase_add_test(tc, test_empty);
    tcase_add_test(tc, test_name_column);
    tcase_add_test(tc, test_header_names);
    tcase_add_test(tc, test_numbers);
    tcase_add_test(tc, test_words);
    tcase_add_test(tc, test_fields_and_quotes);
    tcase_add_test(tc, test_binary);
    tcase_add_test(tc, test_limits_line);
    tcase_add_test(tc, test_limits_columns);
    tcase_add_test(tc, test_limits_rows);
    tcase_add_test(tc, test_files);
    suite_add_tcase(s, tc);
    return s;
}
