/* test_rock_oxidation.c: the supply-limited O2 sink of rock eroded on land (docs/model.md
 * section 4): the present-Earth rate against the published magnitude, the O2
 * limitation, no uptake without O2 or land or in a magma ocean, land-fraction and
 * tectonic scaling, on by default with oxygen_sink off. */
#include <string.h>

#include "o2_sink_support.h"
#include "suites.h"
#include "volev/model.h"
#include "volev/units.h"

#define NAME "rock_oxidation"
START_TEST(present_earth)
{
    vl_scenario *sc;
    vl_model *m = vl_o2_model(NAME, NULL, 0, &sc);
    double y[VL_NSTATE], dydt[VL_NSTATE];
    vl_env env;
    vl_o2_earth_state(y);
    vl_o2_earth_env(m, y, &env);
    double f = vl_o2_uptake(m, NAME, y, &env, dydt);
    /* published magnitude: the O2 consumed today by weathering sulfides and ferrous iron
     * is of order 1e12 mol/yr (pyrite ~0.5-1.5 and Fe2+ ~0.3-0.6 Tmol O2/yr in the O2
     * budgets of Holland 2002, GCA 66:3811, and Lasaga & Ohmoto 2002, GCA 66:361; from
     * memory, not checked): within an order of magnitude */
    ck_assert(f > 1e12 / 10.0 && f < 1e12 * 10.0);
    /* [C] from the defaults' published inputs: 20 Gt/yr eroded (Milliman & Syvitski 1992)
     * x (5.04 % FeO (Rudnick & Gao 2003) x 0.2 / (4 x 71.844 g/mol) + 300 ppm S x 15/8 /
     * 32.06 g/mol) = 20e12 x (0.035076 + 0.017545) = 1.05242e12 mol O2/yr of supply; x
     * 21227.6 / (21227.6 + 210) = 0.990204 (p_half 2.1e-3 bar = 210 Pa) -> 1.04211e12 */
    ck_assert_rel(f, 1.04211e12, 1e-4);
    /* it moves atmospheric O2 into oxidised rock, nothing else */
    ck_assert_rel(dydt[VL_R_OX_ROCK], f * vl_species_molar_mass(VL_SP_O2) / VL_YR, 1e-12);
    ck_assert_double_eq(dydt[VL_R_O2], -dydt[VL_R_OX_ROCK]);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(oxygen_limited)
{
    vl_scenario *sc;
    vl_model *m = vl_o2_model(NAME, NULL, 0, &sc);
    double y[VL_NSTATE], dydt[VL_NSTATE];
    vl_env env;
    vl_o2_earth_state(y);
    vl_o2_earth_env(m, y, &env);
    /* ample O2 (1e6 p_half): the rock's supply, to 1e-6 [C] (present_earth's arithmetic) */
    env.p_pa[VL_GAS_O2] = 2.1e-3 * VL_BAR * 1e6;
    double supply = vl_o2_uptake(m, NAME, y, &env, dydt);
    ck_assert_rel(supply, 1.05242e12, 1e-4);
    /* at p_half = 2.1e-3 bar (1 % of present, default) half of it, by definition */
    env.p_pa[VL_GAS_O2] = 2.1e-3 * VL_BAR;
    ck_assert_rel(vl_o2_uptake(m, NAME, y, &env, dydt) / supply, 0.5, 2e-6);
    /* never above the supply, growing with pO2 */
    double low = 0.0;
    for (double p = 1e-3; p < 1e7; p *= 10.0) {
        env.p_pa[VL_GAS_O2] = p;
        double f = vl_o2_uptake(m, NAME, y, &env, dydt);
        ck_assert(f > low && f <= supply);
        low = f;
    }
    /* no O2 in the air: nothing taken up */
    env.p_pa[VL_GAS_O2] = 0.0;
    ck_assert_double_eq(vl_o2_uptake(m, NAME, y, &env, dydt), 0.0);
    /* an empty O2 reservoir: the depletion ramp stops the outflow (flux.h) */
    env.p_pa[VL_GAS_O2] = VL_O2_P_NOW;
    y[VL_R_O2] = 0.0;
    ck_assert_double_eq(vl_o2_uptake(m, NAME, y, &env, dydt), 0.0);
    ck_assert_double_eq(dydt[VL_R_O2], 0.0);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

/* Erosion is proportional to the land area: half the land, half the sink; none without. */
START_TEST(scales_with_land)
{
    const char *half[] = {"processes." NAME ".land_fraction=0.145"};
    const char *none[] = {"processes." NAME ".land_fraction=0"};
    vl_scenario *sa, *sb, *sc;
    vl_model *ma = vl_o2_model(NAME, NULL, 0, &sa), *mb = vl_o2_model(NAME, half, 1, &sb);
    vl_model *mc = vl_o2_model(NAME, none, 1, &sc);
    double y[VL_NSTATE], dydt[VL_NSTATE];
    vl_env env;
    vl_o2_earth_state(y);
    vl_o2_earth_env(ma, y, &env);
    double full = vl_o2_uptake(ma, NAME, y, &env, dydt);
    ck_assert(full > 0.0);
    /* 0.145 / 0.29 = 0.5 [C] */
    ck_assert_rel(vl_o2_uptake(mb, NAME, y, &env, dydt) / full, 0.5, 1e-12);
    ck_assert_double_eq(vl_o2_uptake(mc, NAME, y, &env, dydt), 0.0);
    vl_test_model_free(ma);
    vl_test_model_free(mb);
    vl_test_model_free(mc);
    vl_scenario_free(sa);
    vl_scenario_free(sb);
    vl_scenario_free(sc);
}
END_TEST

/* Nothing in a magma ocean (no solid land) or without liquid water; uplift follows the heat flow and the lid. */
START_TEST(magma_and_tectonics)
{
    const char *stag[] = {"planet.interior.tectonics=stagnant_lid"};
    vl_scenario *sa, *sb;
    vl_model *ma = vl_o2_model(NAME, NULL, 0, &sa), *mb = vl_o2_model(NAME, stag, 1, &sb);
    double y[VL_NSTATE], dydt[VL_NSTATE];
    vl_env env;
    vl_o2_earth_state(y);
    vl_o2_earth_env(ma, y, &env);
    env.heat_flow_rel = 1.7;
    double mobile = vl_o2_uptake(ma, NAME, y, &env, dydt);
    /* default m = 1: erosion proportional to the heat flow (common practice) [C] */
    env.heat_flow_rel = 1.0;
    ck_assert_rel(mobile / vl_o2_uptake(ma, NAME, y, &env, dydt), 1.7, 1e-12);
    env.heat_flow_rel = 1.7;
    /* default f_sl = 0.1: a stagnant lid processes an order of magnitude less mantle
     * (Tosi et al. 2017, A&A 605:A71, from memory) */
    ck_assert_rel(vl_o2_uptake(mb, NAME, y, &env, dydt) / mobile, 0.1, 1e-12);
    env.regime = VL_REGIME_MAGMA;
    ck_assert_double_eq(vl_o2_uptake(ma, NAME, y, &env, dydt), 0.0);
    /* no running water, no erosion (common practice): nothing on a frozen planet, half
     * with half the ocean ice-free */
    env.regime = VL_REGIME_FROZEN;
    env.liquid = 0.0;
    ck_assert_double_eq(vl_o2_uptake(ma, NAME, y, &env, dydt), 0.0);
    env.regime = VL_REGIME_TEMPERATE;
    env.liquid = 1.0;
    double open = vl_o2_uptake(ma, NAME, y, &env, dydt);
    env.liquid = 0.5;
    ck_assert_rel(vl_o2_uptake(ma, NAME, y, &env, dydt) / open, 0.5, 1e-12);
    vl_test_model_free(ma);
    vl_test_model_free(mb);
    vl_scenario_free(sa);
    vl_scenario_free(sb);
}
END_TEST

/* The supply-limited sinks are on by default and the first-order oxygen_sink off
 * (docs/model.md section 4). */
START_TEST(on_by_default)
{
    vl_scenario *sc = vl_test_scenario(NULL, NULL, 0);
    int k = vl_process_find(NAME), first_order = vl_process_find("oxygen_sink");
    ck_assert_int_ge(k, 0);
    ck_assert_int_ge(first_order, 0);
    ck_assert_int_eq(sc->proc[k].enabled, 1);
    ck_assert_int_eq(sc->proc[first_order].enabled, 0);
    vl_scenario_free(sc);
}
END_TEST

Suite *vl_suite_rock_oxidation(void)
{
    Suite *s = suite_create("rock_oxidation");
    TCase *t = tcase_create("laws");
    tcase_add_test(t, present_earth);
    tcase_add_test(t, oxygen_limited);
    tcase_add_test(t, scales_with_land);
    tcase_add_test(t, magma_and_tectonics);
    tcase_add_test(t, on_by_default);
    suite_add_tcase(s, t);
    return s;
}
