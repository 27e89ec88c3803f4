/* test_extreme.c: scenarios at the edges of what the tool accepts (hardening issue):
 * 1e-6 and 1000 TO of water, 0.1 and 10 Earth masses, 0.01 and 10 au, eccentricity
 * 0.9, a 10-Gyr run around a late M dwarf -- around the Earth reference and the invented
 * demo planet. Each must complete, or stop with a clear message and no output; a
 * completed run's series.csv, events.csv and summary.csv must hold no NaN, no infinity
 * and no negative number (but in the signed quantities of the redox ledger). The
 * expectations are the issue's, not results. */
#include <ctype.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "suites.h"
#include "volev/status.h"

static char tmp[256];

/* The quantities of the redox ledger are signed by definition (oxidant > 0, reductant
 * < 0: docs/model.md section 1): the series columns surface_oxidant_kg and
 * redox_<process>_kg_s, and the summary rows redox_* and total_redox_*. */
static int signed_name(const char *name, size_t len)
{
    static const char *const prefixes[] = {"redox_", "total_redox_", "surface_oxidant_kg,"};
    char buf[128];
    snprintf(buf, sizeof buf, "%.*s,", (int)len, name);
    for (size_t i = 0; i < sizeof prefixes / sizeof prefixes[0]; i++)
        if (strncmp(buf, prefixes[i], strlen(prefixes[i])) == 0)
            return 1;
    return 0;
}

/* The name of field i of the CSV line at head (its first line), as a pointer and length. */
static const char *field_at(const char *head, size_t i, size_t *len)
{
    for (; i > 0 && head; i--) {
        head = strpbrk(head, ",\n");
        head = head && *head == ',' ? head + 1 : NULL;
    }
    *len = head ? strcspn(head, ",\n") : 0;
    return head;
}

/* Whether field i of the data line p is a signed redox quantity: its column's header
 * name, or (summary.csv's name,value,unit rows) the row's name. */
static int signed_field(const char *head, const char *p, size_t i)
{
    size_t len;
    const char *h = field_at(head, i, &len);
    return (h && signed_name(h, len)) || signed_name(p, strcspn(p, ",\n"));
}

/* Whether the text of one field (lowered in place) is NaN, infinite, or a negative
 * number where negative_ok is 0. */
static int bad_field(char *buf, int negative_ok)
{
    char *end;
    double v = strtod(buf, &end);
    int numeric = end != buf && *end == '\0';
    for (char *c = buf; *c; c++)
        *c = (char)tolower((unsigned char)*c);
    return (numeric && (!isfinite(v) || (v < 0.0 && !negative_ok))) || strcmp(buf, "nan") == 0 ||
           strcmp(buf, "inf") == 0 || strcmp(buf, "-nan") == 0;
}

/* Every field of every data line of text that reads as a number is finite and >= 0
 * (a signed redox quantity may be negative); also no literal nan/inf anywhere. Returns
 * a description of the first offender. */
static const char *scan(const char *text, char *why, size_t n)
{
    const char *p = text, *head = NULL;
    int line = 0;
    while (*p) {
        line++;
        const char *nl = strchr(p, '\n');
        size_t len = nl ? (size_t)(nl - p) : strlen(p), i = 0;
        if (*p != '#' && !head)
            head = p;
        if (*p != '#') {
            const char *f = p;
            while (f < p + len) {
                size_t flen = strcspn(f, ",\n");
                if (flen > (size_t)(p + len - f))
                    flen = (size_t)(p + len - f);
                char buf[128];
                size_t k = flen < sizeof buf - 1 ? flen : sizeof buf - 1;
                memcpy(buf, f, k);
                buf[k] = '\0';
                if (bad_field(buf, signed_field(head, p, i))) {
                    snprintf(why, n, "line %d: field '%s'", line, buf);
                    return why;
                }
                f += flen + 1;
                i++;
            }
        }
        if (!nl)
            break;
        p = nl + 1;
    }
    return NULL;
}

static void check_case(const char *scenario, const char *sets, const char *what)
{
    int rc = vl_test_sh(tmp, "'%s' run '%s/scenarios/%s' -o out %s", vl_test_bin(),
                        vl_test_top(), scenario, sets);
    if (rc != VL_OK) {
        /* allowed: a clear stop (integration failed) with nothing written */
        char *e = vl_test_slurp(tmp, "err.txt", NULL);
        ck_assert_msg(rc == VL_ERR_NUMERIC, "%s: exit %d: %s", what, rc, e ? e : "");
        ck_assert_msg(e && strncmp(e, "volev: ", 7) == 0 && strchr(e, '\n') == e + strlen(e) - 1,
                      "%s: unclear message '%s'", what, e ? e : "");
        ck_assert_msg(!vl_test_exists(tmp, "out"), "%s: output left behind", what);
        free(e);
        return;
    }
    static const char *const files[] = {"out/series.csv", "out/events.csv", "out/summary.csv"};
    for (int k = 0; k < 3; k++) {
        char *t = vl_test_slurp(tmp, files[k], NULL);
        ck_assert_msg(t != NULL, "%s: %s missing", what, files[k]);
        char why[256];
        const char *bad = scan(t, why, sizeof why);
        ck_assert_msg(bad == NULL, "%s: %s %s", what, files[k], bad ? bad : "");
        free(t);
    }
    ck_assert_int_eq(vl_test_sh(tmp, "rm -rf out"), 0);
}

START_TEST(edges_of_the_inputs)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-extreme");
    static const char *const base[] = {"earth.cfg", "demo.cfg"};
    static const char *const sets[] = {
        "--set inventory.surface_water_to=1e-6",
        "--set inventory.surface_water_to=1000",
        "--set planet.mass_mearth=0.1 --set planet.radius_rearth=0.5",
        "--set planet.mass_mearth=10 --set planet.radius_rearth=1.8",
        "--set planet.orbit_au=0.01",
        "--set planet.orbit_au=10",
        "--set planet.eccentricity=0.9",
    };
    for (int b = 0; b < 2; b++)
        for (size_t s = 0; s < sizeof sets / sizeof sets[0]; s++) {
            char what[256];
            snprintf(what, sizeof what, "%s %s", base[b], sets[s]);
            check_case(base[b], sets[s], what);
        }
    /* 10 Gyr around a late M dwarf (M8-like: 0.09 M_sun, 2600 K, 5e-4 L_sun on the main
     * sequence after 2 Gyr of contraction; invented values of the right order) */
    check_case("demo.cfg",
               "--set star.mass_msun=0.09 --set star.teff_k=2600 --set star.luminosity_lsun=5e-4 "
               "--set star.contraction_end_yr=2e9 --set planet.orbit_au=0.022 "
               "--set run.end_yr=1e10",
               "late M dwarf, 10 Gyr");
    vl_test_tmp_remove(tmp);
}
END_TEST

Suite *vl_suite_extreme(void)
{
    Suite *s = suite_create("extreme");
    TCase *tc = tcase_create("scenarios");
    tcase_set_timeout(tc, 300);
    tcase_add_test(tc, edges_of_the_inputs);
    suite_add_tcase(s, tc);
    return s;
}
