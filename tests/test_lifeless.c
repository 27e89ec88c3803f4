/* test_lifeless.c: the supply-limited redox sinks of a lifeless planet (volcanic_reductants,
 * h2_oxidation; docs/model.md section 4): a lifeless Earth keeps the Archean O2 limit,
 * and each sink stops when what it draws on runs out. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "suites.h"
#include "volev/integrate.h"
#include "volev/model.h"
#include "volev/units.h"

START_TEST(archean_o2_limit)
{
    /* A lifeless Earth (scenarios/earth.cfg, no biology) with its mantle at the FMQ buffer
     * and the supply-limited sinks instead of the first-order one, under the Archean Sun
     * (to 2.0 Gyr of stellar age, ~2.6 Ga): O2 stays below 1e-6 of the present
     * atmospheric level, the limit set by the mass-independent fractionation of sulfur
     * (Pavlov & Kasting 2002, Astrobiology 2:27; from memory). PAL: 0.2095 x 1.01325 bar
     * (common practice). */
    static const char *const sets[] = {
        "run.end_yr=2.0e9", "processes.volcanic_reductants.enabled=true",
        "processes.volcanic_reductants.mantle_delta_fmq=0", "processes.h2_oxidation.enabled=true",
        "processes.oxygen_sink.enabled=false"};
    vl_env last;
    vl_test_final_env("scenarios/earth.cfg", sets, 5, &last, NULL);
    double pal = 0.2095 * 1.01325 * VL_BAR;
    ck_assert_msg(last.p_pa[VL_GAS_O2] < 1e-6 * pal, "O2 %g PAL", last.p_pa[VL_GAS_O2] / pal);
    /* and the H2 the volcanoes supply builds up to the order the prebiotic-atmosphere
     * models find, 1e-4-1e-2 (Kasting 1993, Science 259:920; Tian et al. 2005, Science
     * 308:1014; from memory) */
    ck_assert_msg(last.x[VL_GAS_H2] > 1e-5 && last.x[VL_GAS_H2] < 1e-2, "x_H2 %g", last.x[VL_GAS_H2]);
}
END_TEST

START_TEST(sinks_stop_without_supply)
{
    /* supply-limited: H2 is not oxidised without O2, nor O2 without H2, and the volcanic
     * reductant, drawn from the surface water it reduces, stops with it (common practice:
     * no reaction runs on an exhausted reactant) */
    static const char *const sets[] = {"processes.volcanic_reductants.enabled=true",
                                       "processes.h2_oxidation.enabled=true"};
    vl_scenario *sc = vl_test_scenario("scenarios/earth.cfg", sets, 2);
    vl_model *m = vl_test_model(sc);
    double y[VL_NSTATE] = {0}, dydt[VL_NSTATE], cols[8];
    vl_env env;
    y[VL_R_N2] = 3.9e18;
    y[VL_R_H2] = 1e15;
    vl_model_env(m, vl_test_work(m), 4.57e9 * VL_YR, y, VL_REGIME_DRY, &env);
    vl_test_process_rates(m, "h2_oxidation", y, &env, dydt, cols);
    ck_assert(cols[0] == 0.0 && dydt[VL_R_H2] == 0.0);
    y[VL_R_H2] = 0.0;
    y[VL_R_O2] = 1e15;
    vl_test_process_rates(m, "h2_oxidation", y, &env, dydt, cols);
    ck_assert(cols[0] == 0.0 && dydt[VL_R_O2] == 0.0);
    vl_test_process_rates(m, "volcanic_reductants", y, &env, dydt, cols); /* no water */
    ck_assert(cols[0] == 0.0 && dydt[VL_R_H2] == 0.0);
    y[VL_R_WATER] = VL_TO_KG;
    vl_test_process_rates(m, "volcanic_reductants", y, &env, dydt, cols);
    ck_assert(cols[0] > 0.0 && dydt[VL_R_H2] > 0.0);
    /* with O2 and H2 both present the oxidation runs at about n_H2 / tau */
    y[VL_R_H2] = 1e15;
    vl_test_process_rates(m, "h2_oxidation", y, &env, dydt, cols);
    ck_assert(cols[0] > 0.0 && dydt[VL_R_O2] < 0.0);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

Suite *vl_suite_lifeless(void)
{
    Suite *s = suite_create("lifeless");
    TCase *tc = tcase_create("redox");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, archean_o2_limit);
    tcase_add_test(tc, sinks_stop_without_supply);
    suite_add_tcase(s, tc);
    return s;
}
