/* test_input_limits.c: the limits and the uniform checks of every input reader
 * (docs/hardening.md, "Input limits"): the decimal number reader shared by the scenario,
 * --set, tracks and catalogues (include/volev/number.h); the bounded, escaped excerpts
 * messages quote (include/volev/text.h); the scenario's size, nesting, group and list
 * limits, empty text, repeated keys, the byte-order mark, unclosed brackets and strings;
 * files that are not regular files; the planet's density. No timings here: the cost of
 * large inputs is measured by bench/input.sh (docs/performance.md). Expected values come
 * from the texts and limits written beside them in this file, and from IEEE 754
 * binary64 (the smallest normal double 2^-1022 = 2.2250738585072014e-308, the largest
 * 1.7976931348623157e308). */
#define _GNU_SOURCE
#include <float.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include "suites.h"
#include "volev/catalogue.h"
#include "volev/csv.h"
#include "volev/number.h"
#include "volev/scenario.h"
#include "volev/text.h"
#include "volev/track.h"

#define LABEL "lim.cfg"

/* A minimal valid scenario body (invented numbers). */
#define VALID "climate = { model = \"hz_fit\"; };\n"

/* text (len bytes) must be refused as bad input at line, needle in the message. */
static void refused_n(const char *text, size_t len, int line, const char *needle)
{
    vl_status st;
    vl_scenario *sc = vl_scenario_parse(text, len, LABEL, &st);
    ck_assert_msg(sc == NULL, "accepted, expected: %s", needle);
    ck_assert_msg(st.code == VL_ERR_INPUT && st.line == line && strstr(st.msg, needle),
                  "got code %d line %d '%s'; expected line %d '%s'", st.code, st.line, st.msg,
                  line, needle);
}

static void refused(const char *text, int line, const char *needle)
{
    refused_n(text, strlen(text), line, needle);
}

/* text must load; returns the scenario. */
static vl_scenario *accepted(const char *text)
{
    vl_status st;
    vl_scenario *sc = vl_scenario_parse(text, strlen(text), LABEL, &st);
    ck_assert_msg(sc != NULL, "%s:%d: %s", st.file, st.line, st.msg);
    return sc;
}

/* ---------------------------------------------------------------- numbers */

START_TEST(test_number_reader)
{
    double v;
    /* decimal forms: the value strtod gives the same text */
    const char *ok[] = {"0", "-0.5", "+3.", ".25E+2", "1e5", "6.02214076e23", "0e-999",
                        "2.2250738585072014e-308", "1.7976931348623157e308"};
    for (size_t i = 0; i < sizeof ok / sizeof ok[0]; i++) {
        ck_assert_int_eq(vl_number_parse_str(ok[i], &v), VL_NUMBER_OK);
        ck_assert_double_eq(v, strtod(ok[i], NULL));
    }
    ck_assert_double_eq(v, DBL_MAX);
    /* what strtod would take but the reader refuses, each for its own reason */
    ck_assert_int_eq(vl_number_parse_str("0x1p0", &v), VL_NUMBER_HEX);
    ck_assert_int_eq(vl_number_parse_str("-0X10", &v), VL_NUMBER_HEX);
    ck_assert_int_eq(vl_number_parse_str("nan", &v), VL_NUMBER_WORD);
    ck_assert(isnan(v));
    ck_assert_int_eq(vl_number_parse_str("-Infinity", &v), VL_NUMBER_WORD);
    ck_assert(isinf(v) && v < 0);
    ck_assert_int_eq(vl_number_parse_str("1e400", &v), VL_NUMBER_OVERFLOW);
    ck_assert(isinf(v) && v > 0);
    ck_assert_int_eq(vl_number_parse_str("1e-400", &v), VL_NUMBER_UNDERFLOW);
    ck_assert_int_eq(vl_number_parse_str("-2.5e-320", &v), VL_NUMBER_UNDERFLOW); /* subnormal */
    ck_assert_int_eq(vl_number_parse_str("2.2250738585072e-308", &v), VL_NUMBER_UNDERFLOW);
    const char *syntax[] = {"", " 1", "1 ", "1e", ".", "+", "1.2.3", "e5", "--1", "1,5", "1L"};
    for (size_t i = 0; i < sizeof syntax / sizeof syntax[0]; i++)
        ck_assert_msg(vl_number_parse_str(syntax[i], &v) == VL_NUMBER_SYNTAX, "'%s'", syntax[i]);
    /* a number longer than the reader's stack buffer */
    char longer[400];
    memset(longer, '1', 300);
    memcpy(longer + 300, "e-290", 6);
    ck_assert_int_eq(vl_number_parse_str(longer, &v), VL_NUMBER_OK);
    ck_assert_double_eq(v, strtod(longer, NULL));
}
END_TEST

/* The same refusals through every reader of numbers. */
START_TEST(test_numbers_every_reader)
{
    /* scenario file */
    refused(VALID "inventory = {\n  co2_bar = 1e-400;\n};\n", 3,
            "inventory.co2_bar = 1e-400 underflows");
    refused(VALID "planet = { orbit_au = 0x1p0; };\n", 2,
            "planet.orbit_au = 0x1p0 is not a number (hexadecimal");
    refused(VALID "planet = { orbit_au = 0x10; };\n", 2, "hexadecimal");
    /* --set */
    vl_scenario *sc = accepted(VALID);
    vl_status st;
    ck_assert_int_eq(vl_scenario_override(sc, "inventory.co2_bar=1e-400", &st), VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, "--set inventory.co2_bar: '1e-400' underflows"));
    ck_assert_int_eq(vl_scenario_override(sc, "planet.orbit_au=0x1p0", &st), VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, "'0x1p0' is not a number (hexadecimal"));
    ck_assert_int_eq(vl_scenario_override(sc, "run.log_points=0x10", &st), VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, "'0x10' is not a whole number"));
    ck_assert_int_eq(vl_scenario_override(sc, "inventory.co2_bar=0e-400", &st), VL_OK);
    ck_assert_double_eq(sc->inventory.co2_pa, 0.0);
    vl_scenario_free(sc);
    /* star track */
    static const char track_under[] = "age_yr,luminosity_lsun\n1e6,1e-400\n1e9,1\n";
    ck_assert_ptr_null(vl_star_track_parse(track_under, sizeof track_under - 1, "t.csv", &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_int_eq(st.line, 2);
    ck_assert_ptr_nonnull(strstr(st.msg, "luminosity_lsun: '1e-400' underflows"));
    static const char track_hex[] = "age_yr,luminosity_lsun\n0x1p20,1\n1e9,1\n";
    ck_assert_ptr_null(vl_star_track_parse(track_hex, sizeof track_hex - 1, "t.csv", &st));
    ck_assert_ptr_nonnull(strstr(st.msg, "age_yr: '0x1p20' is not a number (hexadecimal"));
    /* catalogue */
    static const char cat[] = "name,co2_bar\nA,1e-400\n";
    ck_assert_ptr_null(vl_catalogue_parse(cat, sizeof cat - 1, "c.csv", &st));
    ck_assert_int_eq(st.line, 2);
    ck_assert_ptr_nonnull(strstr(st.msg, "column 'co2_bar': '1e-400' underflows"));
}
END_TEST

/* ---------------------------------------------------------------- excerpts */

START_TEST(test_excerpt)
{
    char buf[VL_EXCERPT_SIZE];
    ck_assert_str_eq(vl_text_excerpt_str("planet.orbit_au", buf, sizeof buf), "planet.orbit_au");
    /* control characters, a backslash and bytes that are not UTF-8 are escaped; a
     * well-formed character (U+00E9, two bytes) is kept */
    ck_assert_str_eq(vl_text_excerpt_str("a\nb\t\\\xFF\xC3\xA9", buf, sizeof buf),
                     "a\\nb\\t\\\\\\xFF\xC3\xA9");
    /* cut after VL_EXCERPT_CHARS characters, with the length */
    char big[1000];
    memset(big, 'x', sizeof big - 1);
    big[sizeof big - 1] = '\0';
    vl_text_excerpt_str(big, buf, sizeof buf);
    ck_assert_uint_eq(strspn(buf, "x"), VL_EXCERPT_CHARS);
    ck_assert_str_eq(buf + VL_EXCERPT_CHARS, "... (999 bytes)");
    /* characters, not bytes, are counted: 70 two-byte characters give 60 */
    char wide[141];
    for (int i = 0; i < 70; i++)
        memcpy(wide + 2 * i, "\xC3\xA9", 2);
    wide[140] = '\0';
    vl_text_excerpt_str(wide, buf, sizeof buf);
    ck_assert_ptr_nonnull(strstr(buf, "... (140 bytes)"));
    ck_assert_uint_eq((size_t)(strstr(buf, "...") - buf), 2 * VL_EXCERPT_CHARS);
    /* every byte escaped still fits VL_EXCERPT_SIZE; a small buffer is never overrun */
    memset(big, '\x01', sizeof big - 1);
    vl_text_excerpt_str(big, buf, sizeof buf);
    ck_assert_uint_eq(strlen(buf), 4 * VL_EXCERPT_CHARS + strlen("... (999 bytes)"));
    char tiny[8];
    ck_assert_uint_lt(strlen(vl_text_excerpt_str(big, tiny, sizeof tiny)), sizeof tiny);
}
END_TEST

/* A message about a huge or ill-formed value quotes a bounded excerpt of it. */
START_TEST(test_messages_bounded)
{
    size_t n = 100000;
    char *text = malloc(n + 64);
    ck_assert_ptr_nonnull(text);
    int head = snprintf(text, n + 64, "climate = { model = \"");
    memset(text + head, 'y', n);
    memcpy(text + head + n, "\xFF\"; };\n", 8);
    vl_status st;
    ck_assert_ptr_null(vl_scenario_parse(text, strlen(text), LABEL, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_uint_lt(strlen(st.msg), 200);
    ck_assert_ptr_nonnull(strstr(st.msg, "... (100001 bytes)"));
    int fault;
    ck_assert_uint_eq(vl_text_scan(st.msg, strlen(st.msg), &fault), strlen(st.msg));
    vl_scenario *sc = accepted(VALID);
    memcpy(text, "planet.orbit_au=\xFF\xFE", 18);
    memset(text + 18, '7', n);
    text[18 + n] = '\0';
    ck_assert_int_eq(vl_scenario_override(sc, text, &st), VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, "value longer than"));
    text[18 + 100] = '\0';
    ck_assert_int_eq(vl_scenario_override(sc, text, &st), VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, "'\\xFF\\xFE7777"));
    ck_assert_ptr_nonnull(strstr(st.msg, "(102 bytes)' is not a number"));
    vl_scenario_free(sc);
    free(text);
    /* names the sweep group quotes later (axis keys, outcomes) are printable ASCII */
    refused(VALID "sweep = { design = \"grid\";\n axes = ( { key = \"planet.orbit\xFF" "au\"; "
            "spacing = \"linear\"; from = 1.0; to = 1.1; points = 2; } ); };\n", 3,
            "sweep.axes.key: \"planet.orbit\\xFFau\" is not a scenario key");
}
END_TEST

/* ---------------------------------------------------------------- scenario structure */

START_TEST(test_empty)
{
    refused_n("", 0, 0, "the scenario is empty");
    refused(" \n\t\n", 0, "the scenario is empty");
    refused("# only\n// comments\n/* here */\n", 0, "the scenario is empty");
    vl_status st;
    ck_assert_ptr_null(vl_scenario_parse(NULL, 0, NULL, &st));
    ck_assert_ptr_nonnull(strstr(st.msg, "the scenario is empty"));
}
END_TEST

START_TEST(test_unclosed)
{
    refused(VALID "planet = {\n  orbit_au = 1.0;\n", 2, "'{' is never closed");
    refused(VALID "sweep = { water_to = [1.0,\n 2.0; };\n", 3,
            "'}' does not close the '[' of line 2 (expected ']')");
}
END_TEST

START_TEST(test_brackets_and_strings)
{
    refused(VALID "star = {\n  luminosity_model = \"constant;\n};\n", 3,
            "unterminated string: the '\"' on this line is never closed");
    refused(VALID "/* a comment\n never closed\n", 2, "unterminated comment");
    refused(VALID "planet = {\n  orbit_au = 1.0;\n);\n", 4,
            "')' does not close the '{' of line 2 (expected '}')");
    refused(VALID "};\n", 2, "'}' closes nothing");
    /* brackets inside strings and comments are not brackets */
    vl_scenario *sc = accepted("# { ( [\n" VALID "/* } */ star = { luminosity_model = "
                               "\"constant\"; };\n");
    vl_scenario_free(sc);
}
END_TEST

/* Nesting deeper than VL_SCENARIO_DEPTH_MAX is refused at the bracket that goes too deep;
 * at the limit the text reaches libconfig (and fails there as an unknown key). */
START_TEST(test_depth)
{
    char text[512];
    for (int depth = VL_SCENARIO_DEPTH_MAX; depth <= VL_SCENARIO_DEPTH_MAX + 1; depth++) {
        size_t n = (size_t)snprintf(text, sizeof text, VALID "\nx = ");
        for (int k = 0; k < depth; k++)
            text[n++] = '(';
        text[n++] = '1';
        for (int k = 0; k < depth; k++)
            text[n++] = ')';
        memcpy(text + n, ";\n", 3);
        if (depth > VL_SCENARIO_DEPTH_MAX)
            refused(text, 3, "nested too deep (more than 16 levels");
        else
            refused(text, 3, "unknown key 'x'");
    }
}
END_TEST

/* VL_SCENARIO_GROUP_MAX settings in a group reach the walk (unknown keys); one more is
 * refused by the pre-scan at the line of the extra setting. */
START_TEST(test_group_size)
{
    size_t cap = 64 * (VL_SCENARIO_GROUP_MAX + 8);
    char *text = malloc(cap);
    ck_assert_ptr_nonnull(text);
    for (int extra = 0; extra <= 1; extra++) {
        size_t n = (size_t)snprintf(text, cap, VALID "planet = {\n");
        for (int k = 0; k < VL_SCENARIO_GROUP_MAX + extra; k++)
            n += (size_t)snprintf(text + n, cap - n, "  k%d = 1;\n", k);
        snprintf(text + n, cap - n, "};\n");
        if (extra)
            refused(text, 3 + VL_SCENARIO_GROUP_MAX, "group 'planet' holds more than 256 settings");
        else
            refused(text, 3, "unknown key 'planet.k0'");
    }
    free(text);
}
END_TEST

START_TEST(test_list_size)
{
    size_t cap = 3 * (VL_SCENARIO_LIST_MAX + 8) + 128;
    char *text = malloc(cap);
    ck_assert_ptr_nonnull(text);
    for (int extra = 0; extra <= 1; extra++) {
        size_t n = (size_t)snprintf(text, cap, VALID "sweep = { water_to = [");
        for (int k = 0; k < VL_SCENARIO_LIST_MAX + extra; k++)
            n += (size_t)snprintf(text + n, cap - n, "%s1", k ? "," : "");
        snprintf(text + n, cap - n, "]; };\n");
        if (extra)
            refused(text, 2, "'sweep.water_to' holds more than 65536 elements");
        else /* past the pre-scan: the sweep group's own limit speaks */
            refused(text, 2, "sweep.water_to: 1 to");
    }
    free(text);
}
END_TEST

START_TEST(test_repeated_keys)
{
    refused(VALID "planet = {\n  orbit_au = 1.0;\n  orbit_au = 2.0;\n};\n", 4,
            "'planet.orbit_au' is given twice, on lines 3 and 4: keep one");
    refused(VALID "run = { log_points = 5; };\nrun = { linear_points = 5; };\n", 3,
            "'run' is given twice, on lines 2 and 3");
    refused(VALID "sweep = {\n axes = ( { key = \"planet.orbit_au\";\n key = \"x\"; } );\n};\n",
            4, "'sweep.axes[1].key' is given twice, on lines 3 and 4");
    /* the same name in different groups, or in different elements of a list, is fine */
    vl_scenario *sc = accepted(VALID "star = { mass_msun = 1.0; };\nplanet = { mass_mearth = "
                               "1.0; };\nprocesses = { weathering = { enabled = true; };\n"
                               "outgassing = { enabled = true; }; };\n");
    vl_scenario_free(sc);
}
END_TEST

START_TEST(test_key_length)
{
    char text[1200];
    char name[700];
    memset(name, 'a', 600);
    name[600] = '\0';
    snprintf(text, sizeof text, VALID "planet = { %s = 1; };\n", name);
    refused(text, 2, "unknown key 'planet.aaaa");
    refused(text, 2, "(600 bytes)': a full key is at most 511 bytes");
    vl_scenario *sc = accepted(VALID);
    vl_status st;
    snprintf(text, sizeof text, "planet.%s=1", name);
    ck_assert_int_eq(vl_scenario_override(sc, text, &st), VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, "unknown key 'planet.aaaa"));
    ck_assert_uint_lt(strlen(st.msg), 400);
    vl_scenario_free(sc);
}
END_TEST

/* Integers beyond 32 bits are read whole (libconfig alone would wrap them). */
START_TEST(test_wide_integers)
{
    refused(VALID "run = { max_steps = 4294967396; };\n", 2,
            "run.max_steps = 4294967396 is out of bounds");
    refused(VALID "run = { max_steps = 99999999999999999999L; };\n", 2,
            "run.max_steps = 99999999999999999999 is out of bounds [100, 1000000000]");
    vl_scenario *sc = accepted(VALID "run = { max_steps = 100000L; };\n");
    ck_assert_int_eq(sc->run.max_steps, 100000);
    vl_scenario_free(sc);
}
END_TEST

/* ---------------------------------------------------------------- the byte-order mark */

START_TEST(test_bom_everywhere)
{
    static const char plain[] = VALID "planet = { orbit_au = 0.9; };\n";
    char text[256];
    snprintf(text, sizeof text, "\xEF\xBB\xBF%s", plain);
    vl_scenario *a = accepted(plain), *b = accepted(text);
    ck_assert_double_eq(a->planet.orbit_m, b->planet.orbit_m);
    vl_scenario_free(a);
    vl_scenario_free(b);
    vl_status st;
    static const char track[] = "\xEF\xBB\xBF" "age_yr,luminosity_lsun\n1e6,1\n1e10,1\n";
    vl_star_track *t = vl_star_track_parse(track, sizeof track - 1, "t.csv", &st);
    ck_assert_msg(t != NULL, "%s", st.msg);
    vl_star_track_free(t);
    static const char cat[] = "\xEF\xBB\xBF" "name,orbit_au\nA,1\n";
    vl_catalogue *c = vl_catalogue_parse(cat, sizeof cat - 1, "c.csv", &st);
    ck_assert_msg(c != NULL, "%s", st.msg);
    vl_catalogue_free(c);
}
END_TEST

/* ---------------------------------------------------------------- sizes and kinds of file */

/* A text of exactly VL_SCENARIO_SIZE_MAX bytes is read; one byte more is refused, from
 * memory and from a file. */
START_TEST(test_scenario_size)
{
    size_t n = VL_SCENARIO_SIZE_MAX;
    char *text = malloc(n + 2);
    ck_assert_ptr_nonnull(text);
    size_t head = strlen(VALID);
    memcpy(text, VALID, head);
    memset(text + head, '#', n - head - 1);
    text[n - 1] = '\n';
    vl_status st;
    vl_scenario *sc = vl_scenario_parse(text, n, LABEL, &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    vl_scenario_free(sc);
    text[n] = '\n';
    refused_n(text, n + 1, 0, "larger than the limit of 1048576 bytes");
    char dir[256], path[512];
    vl_test_tmp_make(dir, sizeof dir, "volev-limits");
    snprintf(path, sizeof path, "%s/big.cfg", dir);
    FILE *f = fopen(path, "wb");
    ck_assert_ptr_nonnull(f);
    ck_assert_uint_eq(fwrite(text, 1, n + 1, f), n + 1);
    fclose(f);
    ck_assert_ptr_null(vl_scenario_load(path, NULL, 0, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, "larger than the limit of 1048576 bytes"));
    vl_test_tmp_remove(dir);
    free(text);
}
END_TEST

/* Devices, folders and FIFOs are refused before anything is read (a FIFO with no writer
 * would block, /dev/zero never ends), as bad input. */
START_TEST(test_not_regular)
{
    vl_status st;
    ck_assert_ptr_null(vl_scenario_load("/dev/zero", NULL, 0, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_str_eq(st.msg, "cannot read the scenario: it is a character device, not a "
                             "regular file");
    ck_assert_ptr_null(vl_star_track_read("/dev/zero", &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, "it is a character device"));
    ck_assert_ptr_null(vl_catalogue_read("/dev/zero", &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    char dir[256], path[512];
    vl_test_tmp_make(dir, sizeof dir, "volev-limits");
    ck_assert_ptr_null(vl_scenario_load(dir, NULL, 0, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, "it is a folder"));
    snprintf(path, sizeof path, "%s/fifo.cfg", dir);
    ck_assert_int_eq(mkfifo(path, 0600), 0);
    ck_assert_ptr_null(vl_scenario_load(path, NULL, 0, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, "it is a FIFO (named pipe)"));
    /* a missing file stays an I/O error */
    snprintf(path, sizeof path, "%s/none.cfg", dir);
    ck_assert_ptr_null(vl_scenario_load(path, NULL, 0, &st));
    ck_assert_int_eq(st.code, VL_ERR_IO);
    vl_test_tmp_remove(dir);
}
END_TEST

START_TEST(test_track_size)
{
    size_t n = VL_TRACK_SIZE_MAX + 1;
    char *text = malloc(n);
    ck_assert_ptr_nonnull(text);
    memset(text, '#', n);
    vl_status st;
    ck_assert_ptr_null(vl_star_track_parse(text, n, "t.csv", &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, "larger than the limit of 16777216 bytes"));
    free(text);
}
END_TEST

/* The command line: `volev run /dev/zero` and a track file /dev/zero end at once with
 * status 3 (bad input) and one message line, leaving no output folder. The test's own
 * timeout bounds "at once": reading /dev/zero never ends. */
START_TEST(test_cli_devices)
{
    char dir[256];
    vl_test_tmp_make(dir, sizeof dir, "volev-limits");
    ck_assert_int_eq(vl_test_sh(dir, "'%s' run /dev/zero -o out", vl_test_bin()), 3);
    vl_test_file_contains(dir, "err.txt", "volev: /dev/zero: cannot read the scenario: it is a "
                                          "character device, not a regular file");
    ck_assert(!vl_test_exists(dir, "out"));
    vl_test_write(dir, "t.cfg", VALID "star = { luminosity_model = \"table\"; track_file = "
                                "\"/dev/zero\"; };\nrun = { start_yr = 1e7; end_yr = 1e9; };\n");
    ck_assert_int_eq(vl_test_sh(dir, "'%s' run t.cfg -o out", vl_test_bin()), 3);
    vl_test_file_contains(dir, "err.txt", "/dev/zero: cannot read star track: it is a character "
                                          "device, not a regular file");
    ck_assert(!vl_test_exists(dir, "out"));
    vl_test_tmp_remove(dir);
}
END_TEST

/* ---------------------------------------------------------------- cross-checks */

/* Mean density rho = 3 M / (4 pi R^3) with Earth's 5.513 g/cm^3 (IAU 2015 nominal mass
 * parameter and radius, units.h): 1 M_earth in 0.5 R_earth is 8 x 5.513 = 44.1 g/cm^3,
 * above the 40 g/cm^3 bound; in 0.6 R_earth it is 25.5 g/cm^3, below it. */
START_TEST(test_density)
{
    refused(VALID "planet = {\n  mass_mearth = 20.0;\n  radius_rearth = 0.1;\n};\n", 4,
            "mean density of 1.1e+05 g/cm^3, above 40 g/cm^3");
    refused(VALID "planet = { mass_mearth = 1.0; radius_rearth = 0.5; };\n", 2,
            "density of 44.1 g/cm^3");
    vl_scenario *sc = accepted(VALID "planet = { mass_mearth = 1.0; radius_rearth = 0.6; };\n");
    vl_scenario_free(sc);
}
END_TEST

Suite *vl_suite_input_limits(void)
{
    Suite *s = suite_create("input_limits");
    TCase *tc = tcase_create("core");
    tcase_set_timeout(tc, 60);
    tcase_add_test(tc, test_number_reader);
    tcase_add_test(tc, test_numbers_every_reader);
    tcase_add_test(tc, test_excerpt);
    tcase_add_test(tc, test_messages_bounded);
    tcase_add_test(tc, test_empty);
    tcase_add_test(tc, test_unclosed);
    tcase_add_test(tc, test_brackets_and_strings);
    tcase_add_test(tc, test_depth);
    tcase_add_test(tc, test_group_size);
    tcase_add_test(tc, test_list_size);
    tcase_add_test(tc, test_repeated_keys);
    tcase_add_test(tc, test_key_length);
    tcase_add_test(tc, test_wide_integers);
    tcase_add_test(tc, test_bom_everywhere);
    tcase_add_test(tc, test_scenario_size);
    tcase_add_test(tc, test_not_regular);
    tcase_add_test(tc, test_track_size);
    tcase_add_test(tc, test_cli_devices);
    tcase_add_test(tc, test_density);
    suite_add_tcase(s, tc);
    return s;
}
