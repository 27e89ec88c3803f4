/* test_stalls.c: members of the extreme-scenario campaign (scripts/campaign.sh, seed 1)
 * that the stall watch once stopped (issue 18: "zero stalls"), each reduced to its
 * scenario (scenarios/demo.cfg and the member's overrides). Each must now reach its end
 * age: exit 0, no stall message, and a number of steps of the order the bundled
 * scenarios take (a run locked into a cycle of tiny steps would need billions). The
 * causes and fixes are in docs/hardening.md, "Stalls". */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "suites.h"
#include "volev/status.h"

static char tmp[256];

/* Steps a run may take to its end here: ten times what the bundled scenarios take
 * (2e3-5e3, the cost line of `volev run`); a stalled run takes 5000 steps per 1e-7
 * x 5 of its age, billions to its end. */
#define MAX_STEPS 50000L

/* Run demo.cfg with sets; it must reach its end without a stall. */
static void must_finish(const char *sets, const char *what)
{
    int rc = vl_test_sh(tmp, "'%s' run '%s/scenarios/demo.cfg' -o out %s", vl_test_bin(),
                        vl_test_top(), sets);
    char *err = vl_test_slurp(tmp, "err.txt", NULL);
    ck_assert_msg(rc == VL_OK, "%s: exit %d: %s", what, rc, err ? err : "");
    ck_assert_msg(!err || !strstr(err, "stalled"), "%s: %s", what, err);
    free(err);
    /* the report's cost line: "cost: N steps, ..." */
    char *out = vl_test_slurp(tmp, "out.txt", NULL);
    const char *p = out ? strstr(out, "cost: ") : NULL;
    ck_assert_msg(p != NULL, "%s: no cost line in '%s'", what, out ? out : "");
    long steps = strtol(p + 6, NULL, 10);
    ck_assert_msg(steps > 0 && steps < MAX_STEPS, "%s: %ld steps", what, steps);
    free(out);
    ck_assert_int_eq(vl_test_sh(tmp, "rm -rf out"), 0);
}

/* The habitable-zone fit keeps these fast (no climate tables to build). */
#define M_DWARF_HZFIT                                                                      \
    "--set 'climate.model=\"hz_fit\"' --set processes.impacts.enabled=true "              \
    "--set planet.interior.magma_ocean.molten_start=false "

START_TEST(test_trace_o2_two_step_cycle)
{
    /* Campaign member 3: a cold (131 K) 0.1-Earth-mass planet under 516 bar of CO2 whose
     * atmospheric O2 is drained to a few thousand kg, inside its depletion band
     * (photochemical escape, H2 oxidation). CVODE accepted first Newton iterates judged
     * by a stale convergence rate, and from 3.93 Gyr the O2 alternated between 3.7e3 and
     * 5.3e3 kg at a fixed step of 0.024 yr. Whether a run falls into the cycle depends on
     * its path: since the deuterium change of db35ec4 both members finish; kept as
     * regressions of the cycle (docs/hardening.md, "Stalls"). */
    vl_test_tmp_make(tmp, sizeof tmp, "volev-stalls");
    must_finish(M_DWARF_HZFIT
                "--set star.mass_msun=0.259115 --set star.luminosity_lsun=0.0102982 "
                "--set star.teff_k=3155.87 --set planet.mass_mearth=0.0994539 "
                "--set planet.radius_rearth=0.536238 --set planet.orbit_au=3.50902 "
                "--set inventory.surface_water_to=0.0203958 --set inventory.co2_bar=516.295 "
                "--set inventory.n2_bar=0.0302105 --set escape.xuv_efficiency=0.641177",
                "member 3 (O2 cycle at 3.93 Gyr)");
    /* Campaign member 24: 1000 oceans and 1e4 bar of CO2 on a 0.05-Earth-mass planet of a
     * 0.08 M_sun star; the same cycle at 7.78 Gyr with O2 about one tolerance (1.3e3 kg)
     * below zero, at order 4 and a step of 0.17 yr */
    must_finish(M_DWARF_HZFIT
                "--set star.mass_msun=0.08 --set star.luminosity_lsun=0.000689977 "
                "--set star.teff_k=2600 --set planet.mass_mearth=0.05 "
                "--set planet.radius_rearth=0.445371 --set planet.orbit_au=2.26536 "
                "--set inventory.surface_water_to=1000 --set inventory.co2_bar=10000 "
                "--set inventory.n2_bar=100 --set escape.xuv_efficiency=0.01",
                "member 24 (O2 cycle at 7.78 Gyr)");
    vl_test_tmp_remove(tmp);
}
END_TEST

START_TEST(test_dry_planet_escape_cycle)
{
    /* Campaign member 34, to 3 Gyr: a dry 0.54-Earth-mass planet at 0.005 au from a 0.09
     * M_sun star under 6e-5 Pa of CO2 and O2 (column climate). Its climate handed the
     * escape stage a stratospheric water mixing ratio of 0.99 without any water, the
     * exospheric escape channels were faded to 0.5 % by that phantom hydrogen flow, and
     * from 2.53 Gyr the O2 and CO2 cycled between 1e8 and 2e9 kg every 0.4 yr
     * (src/physics/climate_column.c, vapour_capped). The stratosphere cannot hold more
     * water per molecule than the column (the cold trap only removes it). */
    vl_test_tmp_make(tmp, sizeof tmp, "volev-stalls");
    must_finish("--set star.mass_msun=0.0924004 --set star.luminosity_lsun=0.00096112 "
                "--set star.teff_k=2634.82 --set planet.mass_mearth=0.539976 "
                "--set planet.radius_rearth=0.846722 --set planet.orbit_au=0.005 "
                "--set inventory.surface_water_to=0.0184203 --set inventory.co2_bar=834.545 "
                "--set inventory.n2_bar=0 --set escape.xuv_efficiency=0.108564 "
                "--set 'climate.model=\"column\"' --set processes.impacts.enabled=true "
                "--set planet.interior.magma_ocean.molten_start=false --set run.end_yr=3e9",
                "member 34 to 3 Gyr (escape cycle at 2.53 Gyr)");
    vl_test_tmp_remove(tmp);
}
END_TEST

Suite *vl_suite_stalls(void)
{
    Suite *s = suite_create("stalls");
    TCase *tc = tcase_create("campaign");
    tcase_set_timeout(tc, 300);
    tcase_add_test(tc, test_trace_o2_two_step_cycle);
    tcase_add_test(tc, test_dry_planet_escape_cycle);
    suite_add_tcase(s, tc);
    return s;
}
