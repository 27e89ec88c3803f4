/* test_hz.c: `volev hz` (src/cli/hz.c; issue 19): the habitable-zone edges of the Sun
 * today against the published fits and distances, the column's outer edge against its
 * calibration target, the planet-mass runaway, and the command's refusals. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "suites.h"

static char tmp[256];

/* Field col (0-based) of the row of hz.csv whose first field is edge, as a number. */
static double hz_value(const char *csv, const char *edge, int col)
{
    char key[96];
    snprintf(key, sizeof key, "\n%s,", edge);
    const char *p = strstr(csv, key);
    ck_assert_msg(p != NULL, "no edge %s in hz.csv", edge);
    p += 1;
    for (int k = 0; k < col; k++) {
        p = strchr(p, ',');
        ck_assert_ptr_nonnull(p);
        p++;
    }
    return strtod(p, NULL);
}

START_TEST(sun_today)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-hz");
    int rc = vl_test_sh(tmp, "'%s' hz '%s/scenarios/earth.cfg' -o h", vl_test_bin(),
                        vl_test_top());
    ck_assert_int_eq(rc, 0);
    char *csv = vl_test_slurp(tmp, "h/hz.csv", NULL);
    ck_assert_ptr_nonnull(csv);
    /* Kopparapu et al. 2013, ApJ 765:131, erratum ApJ 770:82, table 3, the Sun (Teff
     * 5780 K; earth.cfg's is 5772 K, hence 0.5 %): recent Venus 1.7763, runaway 1.0385,
     * moist 1.0146, maximum greenhouse 0.3507, early Mars 0.3207 */
    ck_assert_rel(hz_value(csv, "recent_venus", 1), 1.7763, 5e-3);
    ck_assert_rel(hz_value(csv, "runaway_greenhouse", 1), 1.0385, 5e-3);
    ck_assert_rel(hz_value(csv, "moist_greenhouse", 1), 1.0146, 5e-3);
    ck_assert_rel(hz_value(csv, "maximum_greenhouse", 1), 0.3507, 5e-3);
    ck_assert_rel(hz_value(csv, "early_mars", 1), 0.3207, 5e-3);
    /* their conservative zone for the Sun: 0.99-1.70 au (same paper, abstract) */
    ck_assert(fabs(hz_value(csv, "moist_greenhouse", 2) - 0.99) < 0.01);
    ck_assert(fabs(hz_value(csv, "maximum_greenhouse", 2) - 1.70) < 0.02);
    /* Kopparapu et al. 2014, ApJL 787:L29, table 1: runaway 1.107 for 1 Earth mass */
    ck_assert_rel(hz_value(csv, "runaway_greenhouse_planet_mass", 1), 1.107, 5e-3);
    /* the column's outer edge: its calibration target, 0.3507 near 8 bar (docs/model.md
     * 3.4), found by the search over CO2 within the 1 % the calibration met */
    ck_assert_rel(hz_value(csv, "column_maximum_greenhouse", 1), 0.3507, 0.01);
    double p = hz_value(csv, "column_maximum_greenhouse", 3);
    ck_assert_msg(p > 3.0 && p < 20.0, "optimum CO2 %g bar", p); /* ~8 bar, same target */
    /* the column's runaway lies in the published 1.03-1.12 (docs/model.md 3.4) or just
     * below it with the starting 63 bar of CO2 that earth.cfg begins with */
    double run = hz_value(csv, "column_runaway_greenhouse", 1);
    ck_assert_msg(run > 0.95 && run < 1.12, "column runaway %g", run);
    free(csv);
    vl_test_tmp_remove(tmp);
}
END_TEST

START_TEST(heavier_planet_and_refusals)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-hz");
    /* a 5 Earth-mass planet: runaway at 1.188 (Kopparapu et al. 2014, table 1); the fits'
     * climate has no column edges */
    int rc = vl_test_sh(tmp,
                        "'%s' hz '%s/scenarios/earth.cfg' -o h --set planet.mass_mearth=5 "
                        "--set planet.radius_rearth=1.5 --set 'climate.model=\"hz_fit\"'",
                        vl_test_bin(), vl_test_top());
    ck_assert_int_eq(rc, 0);
    char *csv = vl_test_slurp(tmp, "h/hz.csv", NULL);
    ck_assert_ptr_nonnull(csv);
    ck_assert_rel(hz_value(csv, "runaway_greenhouse_planet_mass", 1), 1.188, 5e-3);
    ck_assert_ptr_null(strstr(csv, "column_"));
    free(csv);
    /* an age outside the run: a usage error */
    rc = vl_test_sh(tmp, "'%s' hz '%s/scenarios/earth.cfg' --age-yr 1e12", vl_test_bin(),
                    vl_test_top());
    ck_assert_int_eq(rc, 2);
    char *err = vl_test_slurp(tmp, "err.txt", NULL);
    ck_assert_ptr_nonnull(strstr(err, "outside the run's ages"));
    free(err);
    vl_test_tmp_remove(tmp);
}
END_TEST

Suite *vl_suite_hz(void)
{
    Suite *s = suite_create("hz");
    TCase *tc = tcase_create("edges");
    tcase_set_timeout(tc, 300);
    tcase_add_test(tc, sun_today);
    tcase_add_test(tc, heavier_planet_and_refusals);
    suite_add_tcase(s, tc);
    return s;
}
