/* test_crust_oxidation.c: the supply-limited O2 sink of fresh oceanic crust altered by
 * seawater (docs/model.md section 4): the present-Earth rate against the published
 * magnitude, the heat-flow and tectonic scaling, the O2 limitation, no uptake without
 * O2 or an open ocean, per-area scaling, on by default. */
#include <string.h>

#include "o2_sink_support.h"
#include "suites.h"
#include "volev/model.h"
#include "volev/units.h"

#define NAME "crust_oxidation"
START_TEST(present_earth)
{
    vl_scenario *sc;
    vl_model *m = vl_o2_model(NAME, NULL, 0, &sc);
    double y[VL_NSTATE], dydt[VL_NSTATE];
    vl_env env;
    vl_o2_earth_state(y);
    vl_o2_earth_env(m, y, &env);
    double f = vl_o2_uptake(m, NAME, y, &env, dydt);
    /* [C] from the defaults: 3.4e6 m^2/yr x 500 m x 2900 kg/m^3 x 0.10 FeO x 0.3 oxidised
     * = 1.479e11 kg FeO/yr; / 71.844 g/mol = 2.0586e12 mol FeO/yr; / 4 = 5.1466e11 mol
     * O2/yr of supply; x pO2/(pO2 + p_half) = 21227.6/(21227.6 + 2100) = 0.90998
     * -> 4.6833e11 mol O2/yr */
    ck_assert_rel(f, 4.6833e11, 1e-4);
    /* published magnitude: ferrous iron oxidised in the upper ocean crust ~1.7e12 mol
     * Fe/yr (Bach & Edwards 2003, GCA 67:3871, from memory), i.e. ~4e11 mol O2/yr at 4 Fe
     * per O2: the same order (a factor of 3 either way) */
    ck_assert(f > 4.25e11 / 3.0 && f < 4.25e11 * 3.0);
    /* it moves atmospheric O2 into oxidised rock, nothing else */
    ck_assert_rel(dydt[VL_R_OX_ROCK], f * vl_species_molar_mass(VL_SP_O2) / VL_YR, 1e-12);
    ck_assert_double_eq(dydt[VL_R_O2], -dydt[VL_R_OX_ROCK]);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(heat_flow_scaling)
{
    const char *sq[] = {"processes." NAME ".heat_flow_exponent=2"};
    vl_scenario *sa, *sb;
    vl_model *ma = vl_o2_model(NAME, NULL, 0, &sa), *mb = vl_o2_model(NAME, sq, 1, &sb);
    double y[VL_NSTATE], dydt[VL_NSTATE];
    vl_env env;
    vl_o2_earth_state(y);
    vl_o2_earth_env(ma, y, &env);
    double f1 = vl_o2_uptake(ma, NAME, y, &env, dydt), g1 = vl_o2_uptake(mb, NAME, y, &env, dydt);
    ck_assert(f1 > 0.0);
    /* at the reference heat flow the exponent does not matter (P = P0) [C] */
    ck_assert_rel(g1, f1, 1e-12);
    env.heat_flow_rel = 2.385;
    /* default m = 1: production proportional to the heat flow, as seafloor_weathering's
     * spreading (from memory) [C] */
    ck_assert_rel(vl_o2_uptake(ma, NAME, y, &env, dydt) / f1, 2.385, 1e-12);
    /* m = 2: half-space cooling, Q ~ sqrt(plate creation rate) (Turcotte & Schubert 2002,
     * from memory): 2.385^2 = 5.688 [C] */
    ck_assert_rel(vl_o2_uptake(mb, NAME, y, &env, dydt) / f1, 5.688225, 1e-9);
    /* a dead interior makes no crust */
    env.heat_flow_rel = 0.0;
    ck_assert_double_eq(vl_o2_uptake(ma, NAME, y, &env, dydt), 0.0);
    vl_test_model_free(ma);
    vl_test_model_free(mb);
    vl_scenario_free(sa);
    vl_scenario_free(sb);
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
    /* ample O2 (1e6 p_half): the crust's supply, to 1e-6 [C] */
    env.p_pa[VL_GAS_O2] = 0.021 * VL_BAR * 1e6;
    double supply = vl_o2_uptake(m, NAME, y, &env, dydt);
    /* [C] supply without the O2 limit: 5.1466e11 mol O2/yr (present_earth's arithmetic) */
    ck_assert_rel(supply, 5.1466e11, 1e-4);
    /* at p_half = 0.021 bar (default) half of it, by the definition of p_half */
    env.p_pa[VL_GAS_O2] = 0.021 * VL_BAR;
    ck_assert_rel(vl_o2_uptake(m, NAME, y, &env, dydt) / supply, 0.5, 2e-6);
    /* the uptake never exceeds the supply, and grows with pO2 (from memory: an anoxic
     * deep ocean cannot oxidise the crust with O2) */
    double low = 0.0;
    for (double p = 1e-3; p < 1e7; p *= 10.0) {
        env.p_pa[VL_GAS_O2] = p;
        double f = vl_o2_uptake(m, NAME, y, &env, dydt);
        ck_assert(f > low && f <= supply);
        low = f;
    }
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(no_oxygen_no_ocean)
{
    vl_scenario *sc;
    vl_model *m = vl_o2_model(NAME, NULL, 0, &sc);
    double y[VL_NSTATE], dydt[VL_NSTATE];
    vl_env env;
    vl_o2_earth_state(y);
    vl_o2_earth_env(m, y, &env);
    /* no O2 in the air: nothing to take up */
    env.p_pa[VL_GAS_O2] = 0.0;
    ck_assert_double_eq(vl_o2_uptake(m, NAME, y, &env, dydt), 0.0);
    /* an empty O2 reservoir: the depletion ramp stops the outflow (flux.h) */
    env.p_pa[VL_GAS_O2] = VL_O2_P_NOW;
    y[VL_R_O2] = 0.0;
    ck_assert_double_eq(vl_o2_uptake(m, NAME, y, &env, dydt), 0.0);
    ck_assert_double_eq(dydt[VL_R_O2], 0.0);
    /* no open ocean (frozen over, or none): no seawater alteration with dissolved O2 */
    y[VL_R_O2] = 1.2e18;
    env.liquid = 0.0;
    ck_assert_double_eq(vl_o2_uptake(m, NAME, y, &env, dydt), 0.0);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(stagnant_lid)
{
    const char *stag[] = {"planet.interior.tectonics=stagnant_lid"};
    const char *stag3[] = {"planet.interior.tectonics=stagnant_lid",
                           "processes." NAME ".stagnant_lid_factor=0.03"};
    vl_scenario *sa, *sb, *sc;
    vl_model *ma = vl_o2_model(NAME, NULL, 0, &sa), *mb = vl_o2_model(NAME, stag, 1, &sb);
    vl_model *mc = vl_o2_model(NAME, stag3, 2, &sc);
    double y[VL_NSTATE], dydt[VL_NSTATE];
    vl_env env;
    vl_o2_earth_state(y);
    vl_o2_earth_env(ma, y, &env);
    env.heat_flow_rel = 1.7;
    double mobile = vl_o2_uptake(ma, NAME, y, &env, dydt);
    ck_assert(mobile > 0.0);
    /* default f_sl = 0.1: a stagnant lid processes an order of magnitude less mantle
     * (Tosi et al. 2017, A&A 605:A71, from memory) */
    ck_assert_rel(vl_o2_uptake(mb, NAME, y, &env, dydt) / mobile, 0.1, 1e-12);
    ck_assert_rel(vl_o2_uptake(mc, NAME, y, &env, dydt) / mobile, 0.03, 1e-12);
    vl_test_model_free(ma);
    vl_test_model_free(mb);
    vl_test_model_free(mc);
    vl_scenario_free(sa);
    vl_scenario_free(sb);
    vl_scenario_free(sc);
}
END_TEST

/* Crust production per unit area unless switched to absolute, like seafloor_weathering:
 * a planet of 0.8 Earth radii gets (0.8)^2 = 0.64 of it [C]. */
START_TEST(scales_with_area)
{
    const char *small[] = {"planet.mass_mearth=0.5", "planet.radius_rearth=0.8"};
    const char *absolute[] = {"planet.mass_mearth=0.5", "planet.radius_rearth=0.8",
                              "processes." NAME ".scale_by_surface_area=false"};
    vl_scenario *sa, *sb;
    vl_model *ma = vl_o2_model(NAME, small, 2, &sa), *mb = vl_o2_model(NAME, absolute, 3, &sb);
    double y[VL_NSTATE], dydt[VL_NSTATE];
    vl_env env;
    vl_o2_earth_state(y);
    vl_o2_earth_env(ma, y, &env);
    double a = vl_o2_uptake(ma, NAME, y, &env, dydt), b = vl_o2_uptake(mb, NAME, y, &env, dydt);
    ck_assert(b > 0.0);
    ck_assert_rel(a / b, 0.64, 1e-12);
    /* the absolute rate is the Earth rate of present_earth [C] */
    ck_assert_rel(b, 4.6833e11, 1e-4);
    vl_test_model_free(ma);
    vl_test_model_free(mb);
    vl_scenario_free(sa);
    vl_scenario_free(sb);
}
END_TEST

/* A supply-limited sink of the issue: on by default (docs/model.md section 4). */
START_TEST(on_by_default)
{
    vl_scenario *sc = vl_test_scenario(NULL, NULL, 0);
    int k = vl_process_find(NAME);
    ck_assert_int_ge(k, 0);
    ck_assert_int_eq(sc->proc[k].enabled, 1);
    vl_scenario_free(sc);
}
END_TEST

Suite *vl_suite_crust_oxidation(void)
{
    Suite *s = suite_create("crust_oxidation");
    TCase *t = tcase_create("laws");
    tcase_add_test(t, present_earth);
    tcase_add_test(t, heat_flow_scaling);
    tcase_add_test(t, oxygen_limited);
    tcase_add_test(t, no_oxygen_no_ocean);
    tcase_add_test(t, stagnant_lid);
    tcase_add_test(t, scales_with_area);
    tcase_add_test(t, on_by_default);
    suite_add_tcase(s, t);
    return s;
}
