/* test_interior.c: heat flow histories (docs/cycles.md). */
#include "suites.h"
#include "volev/interior.h"
#include "volev/scenario.h"
#include "volev/units.h"

START_TEST(radiogenic_half_lives)
{
    vl_scenario *sc = vl_scenario_new();
    vl_interior_params p = sc->interior;
    double gyr = 1e9 * VL_YR;
    ck_assert_double_eq(vl_interior_heat_flow_rel(&p, p.ref_age_s), 1.0);
    /* one isotope alone doubles one half-life back (decay law); half-lives: U-238 4.468,
     * K-40 1.248 Gyr (common practice) */
    p.share[0] = 1.0, p.share[1] = p.share[2] = p.share[3] = 0.0;
    ck_assert_rel(vl_interior_heat_flow_rel(&p, p.ref_age_s - 4.468 * gyr), 2.0, 1e-12);
    p.share[0] = 0.0, p.share[3] = 2.385; /* shares are normalised */
    ck_assert_rel(vl_interior_heat_flow_rel(&p, p.ref_age_s - 2.0 * 1.248 * gyr), 4.0, 1e-12);
    /* default Earth mix: about 2.5 times today's heat 3 Gyr ago (sum of the four decays
     * with shares 0.39/0.02/0.40/0.19 [C]); "about twice" in the Archean, from memory */
    p = sc->interior;
    double q = vl_interior_heat_flow_rel(&p, p.ref_age_s - 3.0 * gyr);
    ck_assert_rel(q, 0.39 * exp(log(2) * 3 / 4.468) + 0.02 * exp(log(2) * 3 / 0.7038) +
                         0.40 * exp(log(2) * 3 / 14.05) + 0.19 * exp(log(2) * 3 / 1.248),
                  1e-12);
    ck_assert(q > 2.0 && q < 3.0);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(exponential_and_power_law)
{
    vl_scenario *sc = vl_scenario_new();
    vl_interior_params p = sc->interior;
    p.heat_model = VL_HEAT_EXPONENTIAL;
    p.efold_s = 2.385e9 * VL_YR;
    /* e-folding [C] */
    ck_assert_rel(vl_interior_heat_flow_rel(&p, p.ref_age_s - p.efold_s), exp(1.0), 1e-12);
    p.heat_model = VL_HEAT_POWER_LAW;
    p.power_exp = 0.7;
    ck_assert_rel(vl_interior_heat_flow_rel(&p, 0.5 * p.ref_age_s), pow(0.5, -0.7), 1e-12);
    vl_scenario_free(sc);
}
END_TEST

Suite *vl_suite_interior(void)
{
    Suite *s = suite_create("interior");
    TCase *tc = tcase_create("core");
    tcase_add_test(tc, radiogenic_half_lives);
    tcase_add_test(tc, exponential_and_power_law);
    suite_add_tcase(s, tc);
    return s;
}
