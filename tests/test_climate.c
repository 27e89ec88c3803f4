/* test_climate.c: water saturation (src/physics/water.c) and the hz_fit climate
 * (src/physics/climate.c, src/physics/climate_hzfit.c).
 * Tags: [C] computed from the stated formula; [V] read in the cited source;
 * [S] agreed by several independent transcriptions of the source, not checked against
 * the original table (legend: docs/model.md). */
#include <math.h>
#include <string.h>

#include "suites.h"
#include "volev/climate.h"
#include "volev/reservoir.h"
#include "volev/units.h"
#include "volev/water.h"

#define EARTH_G (VL_G_NEWTON * VL_M_EARTH / (VL_R_EARTH * VL_R_EARTH))
#define EARTH_AREA (4.0 * VL_PI * VL_R_EARTH * VL_R_EARTH)
#define CO2_REF_PA 28.37            /* 2.837e-4 bar: 280 ppmv x 1.01325 bar (common practice) */

/* An Earth scenario with the climate defaults of src/input/params_core.c. */
static void earth_scenario(vl_scenario *sc)
{
    memset(sc, 0, sizeof *sc);
    sc->planet.mass_kg = VL_M_EARTH;
    sc->planet.radius_m = VL_R_EARTH;
    sc->planet.orbit_m = VL_AU;
    vl_climate_params *c = &sc->climate;
    c->model = VL_CLIMATE_HZ_FIT;
    c->bond_albedo = 0.3;
    c->greenhouse_ref_k = 33.42;
    c->co2_doubling_k = 3.0;
    c->co2_ref_pa = CO2_REF_PA;
    c->strat_h2o_temperate = 7.6e-6;
    c->strat_h2o_moist = 3e-3;
    c->runaway_surface_temp_k = 1500.0;
    c->freeze_temp_k = 273.15;
    c->dry_threshold_kg = 1e-5 * VL_TO_KG;
    c->runaway_fit = VL_RUNAWAY_K2014;
}

static vl_climate *new_climate(const vl_scenario *sc)
{
    vl_status st;
    vl_status_clear(&st);
    vl_climate *c = vl_climate_new(sc, &st);
    ck_assert_msg(c != NULL, "vl_climate_new: %s", st.msg);
    return c;
}

/* Earth-sized env at instellation s (W/m^2) around a 5780 K star, no gases yet. */
static void earth_env(vl_env *env, double s, int regime)
{
    memset(env, 0, sizeof *env);
    env->star.teff_k = 5780.0;
    env->instellation = s;
    env->s_eff = s / VL_S_EARTH;
    env->g = EARTH_G;
    env->area_m2 = EARTH_AREA;
    env->regime = regime;
}

/* Dry air of surface pressure p_pa (thin shell) holding CO2 at mole fraction x_co2, rest N2. */
static void set_air(vl_env *env, double p_pa, double x_co2)
{
    double mc = vl_species_molar_mass(VL_SP_CO2), mn = vl_species_molar_mass(VL_SP_N2);
    double total = p_pa * EARTH_AREA / EARTH_G;
    double w = x_co2 * mc / (x_co2 * mc + (1.0 - x_co2) * mn);
    env->mass_kg[VL_GAS_CO2] = w * total;
    env->mass_kg[VL_GAS_N2] = (1.0 - w) * total;
}

/* Vapour partial pressure x_v (M_v + M_d) g / A after an eval (thin shell). */
static double vapour_pressure(const vl_env *env)
{
    double nv = 0.0, nd = 0.0, m = 0.0;
    static const int sp[VL_NGASES] = {VL_SP_H2O, VL_SP_CO2, VL_SP_N2, VL_SP_O2, VL_SP_H2};
    for (int g = 0; g < VL_NGASES; g++) {
        double n = env->mass_kg[g] / vl_species_molar_mass(sp[g]);
        if (g == VL_GAS_H2O)
            nv = n;
        else
            nd += n;
        m += env->mass_kg[g];
    }
    return nv / (nv + nd) * m * env->g / env->area_m2;
}

START_TEST(test_water_saturation)
{
    /* IAPWS-95 triple point 611.657 Pa at 273.16 K; Wagner & Pruss 1993 gives 611.65707 [C] */
    ck_assert_rel(vl_water_psat_liquid(273.16), 611.657, 2e-7);
    /* ITS-90 normal boiling point 373.124 K; Wagner & Pruss 1993 gives 101323.93 Pa [C] */
    ck_assert_rel(vl_water_psat_liquid(373.124), 101324.0, 1e-6);
    /* Wagner & Pruss 1993 at 298.15 K: 3169.82 Pa [C] (IAPWS tables 3.1699 kPa, from memory) */
    ck_assert_rel(vl_water_psat_liquid(298.15), 3169.82449, 1e-8);
    /* Wagner & Pruss 1993 at T_c: v = 0, p = p_c [C] */
    ck_assert_rel(vl_water_psat_liquid(VL_WATER_TC_K), 22.064e6, 1e-15);
    /* Murphy & Koop 2005 eq. 7 at the triple point matches the liquid line: 611.657069 Pa [C] */
    ck_assert_rel(vl_water_psat_ice(273.16), vl_water_psat_liquid(273.16), 1e-8);
    /* Murphy & Koop 2005 eq. 7 at 200 K: 0.1626914 Pa [C] */
    ck_assert_rel(vl_water_psat_ice(200.0), 0.16269145, 1e-7);
    /* stable phase: ice below 273.16 K, liquid above, none above T_c */
    ck_assert_rel(vl_water_psat(250.0), vl_water_psat_ice(250.0), 1e-15);
    ck_assert_rel(vl_water_psat(273.16), vl_water_psat_liquid(273.16), 1e-15);
    ck_assert_rel(vl_water_psat(500.0), vl_water_psat_liquid(500.0), 1e-15);
    ck_assert(isinf(vl_water_psat(700.0)) && vl_water_psat(700.0) > 0.0);
}
END_TEST

START_TEST(test_hz_2013)
{
    /* Kopparapu et al. 2013 (erratum): S_eff(5780 K) = S0 for each limit [S] */
    ck_assert_rel(vl_hz_seff_2013(VL_HZ_RECENT_VENUS, 5780.0), 1.7763, 0.0);
    ck_assert_rel(vl_hz_seff_2013(VL_HZ_RUNAWAY, 5780.0), 1.0385, 0.0);
    ck_assert_rel(vl_hz_seff_2013(VL_HZ_MOIST, 5780.0), 1.0146, 0.0);
    ck_assert_rel(vl_hz_seff_2013(VL_HZ_MAX_GREENHOUSE, 5780.0), 0.3507, 0.0);
    ck_assert_rel(vl_hz_seff_2013(VL_HZ_EARLY_MARS, 5780.0), 0.3207, 0.0);
    /* Kopparapu et al. 2013 polynomials away from 5780 K, computed [C] from the
     * coefficients of its table with the erratum (ApJ 770:82) [S]: at 3800 K and 7200 K */
    ck_assert_rel(vl_hz_seff_2013(VL_HZ_RECENT_VENUS, 3800.0), 1.54668846, 1e-8);
    ck_assert_rel(vl_hz_seff_2013(VL_HZ_RUNAWAY, 3800.0), 0.88150447, 1e-8);
    ck_assert_rel(vl_hz_seff_2013(VL_HZ_MOIST, 3800.0), 0.88343966, 1e-8);
    ck_assert_rel(vl_hz_seff_2013(VL_HZ_MAX_GREENHOUSE, 3800.0), 0.25463694, 1e-8);
    ck_assert_rel(vl_hz_seff_2013(VL_HZ_EARLY_MARS, 3800.0), 0.22980344, 1e-8);
    ck_assert_rel(vl_hz_seff_2013(VL_HZ_RUNAWAY, 7200.0), 1.21585932, 1e-8);
    ck_assert_rel(vl_hz_seff_2013(VL_HZ_MOIST, 7200.0), 1.11952143, 1e-8);
    /* Kopparapu et al. 2013: valid 2600-7200 K, clamped outside */
    ck_assert_rel(vl_hz_seff_2013(VL_HZ_MOIST, 2000.0), 0.84428205, 1e-8);
    ck_assert_rel(vl_hz_seff_2013(VL_HZ_MOIST, 9000.0), 1.11952143, 1e-8);
    ck_assert(isnan(vl_hz_seff_2013(VL_NHZ, 5780.0)));
    /* Kopparapu et al. 2013: Sun (L = 1 L_sun, 5780 K) moist greenhouse at
     * 1/sqrt(1.0146) = 0.99278 au [C]; published 0.99 au [V] */
    double d = 1.0 / sqrt(vl_hz_seff_2013(VL_HZ_MOIST, 5780.0));
    ck_assert_rel(d, 0.992779, 1e-6);
    ck_assert_rel(d, 0.99, 5e-3);
}
END_TEST

START_TEST(test_hz_2014)
{
    /* Kopparapu et al. 2014: runaway S0 = 0.99, 1.107, 1.188 for 0.1, 1, 5 M_earth [S] */
    ck_assert_rel(vl_hz_seff_runaway_2014(1.0, 5780.0), 1.107, 1e-15);
    ck_assert_rel(vl_hz_seff_runaway_2014(0.1, 5780.0), 0.99, 1e-15);
    ck_assert_rel(vl_hz_seff_runaway_2014(5.0, 5780.0), 1.188, 1e-15);
    /* Kopparapu et al. 2014 fits at 3800 K [C] */
    ck_assert_rel(vl_hz_seff_runaway_2014(0.1, 3800.0), 0.83691382, 1e-8);
    ck_assert_rel(vl_hz_seff_runaway_2014(1.0, 3800.0), 0.94001770, 1e-8);
    ck_assert_rel(vl_hz_seff_runaway_2014(5.0, 3800.0), 1.00877025, 1e-8);
    /* linear in log10 mass: at sqrt(0.1) M_earth the mean (0.99 + 1.107)/2 = 1.0485 [C] */
    ck_assert_rel(vl_hz_seff_runaway_2014(sqrt(0.1), 5780.0), 1.0485, 1e-12);
    /* at sqrt(5) M_earth the mean (1.107 + 1.188)/2 = 1.1475 [C] */
    ck_assert_rel(vl_hz_seff_runaway_2014(sqrt(5.0), 5780.0), 1.1475, 1e-12);
    /* clamped outside [0.1, 5] M_earth */
    ck_assert_rel(vl_hz_seff_runaway_2014(0.02, 5780.0), 0.99, 1e-15);
    ck_assert_rel(vl_hz_seff_runaway_2014(12.0, 5780.0), 1.188, 1e-15);
    /* monotonic in mass at every Teff of the fit range, strictly inside [0.1, 5] */
    for (double teff = 2600.0; teff <= 7200.0; teff += 230.0) {
        double prev = vl_hz_seff_runaway_2014(0.05, teff);
        for (double m = 0.05; m <= 8.0; m *= 1.13) {
            double s = vl_hz_seff_runaway_2014(m, teff);
            if (m > 0.1 && m < 5.0)
                ck_assert_msg(s > prev, "S_eff(%g M_earth, %g K) = %g <= %g", m, teff, s, prev);
            else
                ck_assert(s >= prev);
            prev = s;
        }
    }
}
END_TEST

START_TEST(test_thresholds_in_env)
{
    vl_scenario sc;
    earth_scenario(&sc);
    vl_climate *c = new_climate(&sc);
    vl_env env;
    earth_env(&env, VL_S_EARTH, VL_REGIME_TEMPERATE);
    set_air(&env, 1.01325e5, 280e-6);
    vl_climate_eval(c, vl_test_climate_work(c), VL_TO_KG, &env);
    /* Kopparapu et al. 2014: runaway at 1 M_earth, 5780 K = 1.107 [S] */
    ck_assert_rel(env.s_runaway, 1.107, 1e-15);
    /* Kopparapu et al. 2013: moist greenhouse S0 = 1.0146 [S] */
    ck_assert_rel(env.s_moist, 1.0146, 1e-15);
    vl_test_climate_free(c);

    /* planet mass enters the 2014 threshold: 5 M_earth -> 1.188 [S] */
    sc.planet.mass_kg = 5.0 * VL_M_EARTH;
    c = new_climate(&sc);
    vl_climate_eval(c, vl_test_climate_work(c), VL_TO_KG, &env);
    ck_assert_rel(env.s_runaway, 1.188, 1e-12);
    vl_test_climate_free(c);

    /* runaway_fit = k2013: Kopparapu et al. 2013 runaway S0 = 1.0385, mass-blind [S] */
    sc.climate.runaway_fit = VL_RUNAWAY_K2013;
    c = new_climate(&sc);
    vl_climate_eval(c, vl_test_climate_work(c), VL_TO_KG, &env);
    ck_assert_rel(env.s_runaway, 1.0385, 1e-15);
    vl_test_climate_free(c);
}
END_TEST

START_TEST(test_energy_balance)
{
    vl_scenario sc;
    earth_scenario(&sc);
    vl_climate *c = new_climate(&sc);
    vl_env env;
    earth_env(&env, 1361.0, VL_REGIME_TEMPERATE);
    set_air(&env, 1.01325e5, 280e-6);
    vl_climate_eval(c, vl_test_climate_work(c), VL_TO_KG, &env);
    /* calibration (present Earth at 288 K, docs/model.md 3.5): T_e(1361 W/m^2, A = 0.3) =
     * 254.578 K [C] plus greenhouse_ref 33.42 K at the reference CO2 = 288.0 K */
    ck_assert_msg(fabs(env.t_surf_k - 288.0) <= 0.1, "T_s = %g", env.t_surf_k);
    ck_assert_rel(env.t_surf_k, 254.57814 + 33.42, 1e-6);
    /* temperate regime: T_s is the balance temperature (climate.h contract) */
    ck_assert_rel(env.t_balance_k, env.t_surf_k, 0.0);
    double t1 = env.t_surf_k;

    /* doubled CO2 at fixed N2: +co2_doubling_k = 3 K (IPCC AR6 best estimate, from
     * memory), within 0.01 K as doubling x_CO2 also raises p_dry by 0.03 % [C] */
    env.mass_kg[VL_GAS_CO2] *= 2.0;
    vl_climate_eval(c, vl_test_climate_work(c), VL_TO_KG, &env);
    ck_assert_msg(fabs(env.t_surf_k - t1 - 3.0) < 0.01, "dT = %g", env.t_surf_k - t1);

    /* pure CO2 air: doubling its mass doubles pCO2_dry exactly, +3 K [C] */
    earth_env(&env, 1361.0, VL_REGIME_TEMPERATE);
    env.mass_kg[VL_GAS_CO2] = 2.385 * CO2_REF_PA * EARTH_AREA / EARTH_G;
    vl_climate_eval(c, vl_test_climate_work(c), VL_TO_KG, &env);
    t1 = env.t_surf_k;
    /* ln-law: 254.578 + 33.42 + 3 log2(2.385) = 291.76 K [C] */
    ck_assert_rel(t1, 254.57814 + 33.42 + 3.0 * log2(2.385), 1e-6);
    env.mass_kg[VL_GAS_CO2] *= 2.0;
    vl_climate_eval(c, vl_test_climate_work(c), VL_TO_KG, &env);
    ck_assert_rel(env.t_surf_k - t1, 3.0, 1e-9);
    vl_test_climate_free(c);
}
END_TEST

START_TEST(test_co2_floor)
{
    vl_scenario sc;
    earth_scenario(&sc);
    vl_climate *c = new_climate(&sc);
    vl_env env;
    earth_env(&env, 1361.0, VL_REGIME_TEMPERATE);
    set_air(&env, 1.0e5, 0.0);
    vl_climate_eval(c, vl_test_climate_work(c), 1e19, &env);
    /* at the CO2 floor (1e-9 pCO2_ref) the fit's greenhouse term is 33.42 + 3 log2(1e-9) =
     * -56.3 K [C]; a greenhouse is never negative (issue 18): the surface sits at the
     * equilibrium temperature, 254.578 K for 1361 W/m^2 and A = 0.3 [C] */
    double t_e = 254.57814;
    ck_assert_rel(env.t_balance_k, t_e, 1e-6);
    /* half the floor and twice it: still T_e (continuous, finite) [C] */
    env.mass_kg[VL_GAS_CO2] = 0.5e-9 * CO2_REF_PA * EARTH_AREA / EARTH_G *
                              vl_species_molar_mass(VL_SP_CO2) /
                              vl_species_molar_mass(VL_SP_N2);
    vl_climate_eval(c, vl_test_climate_work(c), 1e19, &env);
    ck_assert_rel(env.t_balance_k, t_e, 1e-6);
    env.mass_kg[VL_GAS_CO2] *= 4.0;
    vl_climate_eval(c, vl_test_climate_work(c), 1e19, &env);
    ck_assert_rel(env.t_balance_k, t_e, 1e-6);
    /* no dry air at all: T_e, not NaN [C] */
    memset(env.mass_kg, 0, sizeof env.mass_kg);
    vl_climate_eval(c, vl_test_climate_work(c), 1e19, &env);
    ck_assert_rel(env.t_balance_k, t_e, 1e-6);
    vl_test_climate_free(c);
}
END_TEST

START_TEST(test_vapour_partition)
{
    vl_scenario sc;
    earth_scenario(&sc);
    vl_climate *c = new_climate(&sc);
    vl_env env;
    earth_env(&env, 1361.0, VL_REGIME_TEMPERATE);
    set_air(&env, 1.0e5, 280e-6);
    double water = 1.385 * VL_TO_KG;
    vl_climate_eval(c, vl_test_climate_work(c), water, &env);
    ck_assert_msg(fabs(env.t_surf_k - 288.0) < 0.2, "T_s = %g", env.t_surf_k);
    /* thin shell, mole-fraction partial pressure x_v p_surf = p_sat(T_s) (docs/model.md 1
     * and 3, "Ocean and vapour") [C] */
    ck_assert_rel(vapour_pressure(&env), vl_water_psat(env.t_surf_k), 1e-9);
    ck_assert_rel(env.mass_kg[VL_GAS_H2O], env.vapour_kg, 0.0);
    ck_assert_rel(env.ocean_kg + env.vapour_kg, water, 1e-15);
    /* p_sat(288 K)/1 bar = 1.7 %: vapour about 0.017 x 0.62 x 5.2e18 kg [C, order] */
    ck_assert(env.vapour_kg > 3e16 && env.vapour_kg < 1e17);
    ck_assert_double_eq(env.liquid, 1.0);
    /* Catling & Kasting 2017 (from memory): 7.6 ppmv total hydrogen above the cold trap */
    ck_assert_rel(env.f_strat, 7.6e-6, 0.0);

    /* pure steam over the ocean: M_v = p_sat A / g [C] */
    memset(env.mass_kg, 0, sizeof env.mass_kg);
    env.instellation = 1361.0;
    vl_climate_eval(c, vl_test_climate_work(c), water, &env);
    ck_assert_rel(env.vapour_kg, vl_water_psat(env.t_surf_k) * EARTH_AREA / EARTH_G, 1e-12);

    /* little water: all of it is vapour, the cap is continuous [C] */
    set_air(&env, 1.0e5, 280e-6);
    vl_climate_eval(c, vl_test_climate_work(c), 2.385e12, &env);
    ck_assert_rel(env.vapour_kg, 2.385e12, 0.0);
    ck_assert_rel(env.ocean_kg, 0.0, 0.0);

    /* frozen: saturation over ice (Murphy & Koop 2005 eq. 7) at T_s < 273.16 K [C] */
    env.instellation = 900.0;
    env.regime = VL_REGIME_FROZEN;
    vl_climate_eval(c, vl_test_climate_work(c), water, &env);
    ck_assert(env.t_surf_k < 273.0);
    ck_assert_rel(vapour_pressure(&env), vl_water_psat_ice(env.t_surf_k), 1e-9);
    ck_assert_double_eq(env.liquid, 0.0);
    ck_assert_rel(env.f_strat, 7.6e-6, 0.0);

    /* moist greenhouse: liquid ocean, wet stratosphere (Kasting 1988: 3e-3) */
    env.instellation = 1.05 * VL_S_EARTH;
    env.regime = VL_REGIME_MOIST;
    vl_climate_eval(c, vl_test_climate_work(c), water, &env);
    ck_assert_double_eq(env.liquid, 1.0);
    ck_assert_rel(env.f_strat, 3e-3, 0.0);
    ck_assert_rel(vapour_pressure(&env), vl_water_psat(env.t_surf_k), 1e-9);

    /* dry: same partition, no liquid flag, temperate stratosphere */
    env.regime = VL_REGIME_DRY;
    vl_climate_eval(c, vl_test_climate_work(c), 1e9, &env);
    ck_assert_rel(env.vapour_kg, 1e9, 0.0);
    ck_assert_double_eq(env.liquid, 0.0);
    ck_assert_rel(env.f_strat, 7.6e-6, 0.0);

    /* T_s = 779 K above T_c = 647.096 K (Wagner & Pruss 1993): no ocean survives even
     * outside a runaway */
    env.regime = VL_REGIME_TEMPERATE;
    env.instellation = 1.0e5;
    vl_climate_eval(c, vl_test_climate_work(c), water, &env);
    ck_assert(env.t_surf_k > VL_WATER_TC_K);
    ck_assert_rel(env.vapour_kg, water, 0.0);
    ck_assert_double_eq(env.liquid, 0.0);
    vl_test_climate_free(c);
}
END_TEST

START_TEST(test_runaway_state)
{
    vl_scenario sc;
    earth_scenario(&sc);
    vl_climate *c = new_climate(&sc);
    vl_env env;
    earth_env(&env, 1.2 * VL_S_EARTH, VL_REGIME_RUNAWAY);
    set_air(&env, 1.0e5, 280e-6);
    double water = VL_TO_KG;
    vl_climate_eval(c, vl_test_climate_work(c), water, &env);
    /* runaway: the hot steam state, all water in the air (docs/model.md 3, "Regimes") */
    ck_assert_rel(env.t_surf_k, 1500.0, 0.0);
    ck_assert_rel(env.vapour_kg, water, 0.0);
    ck_assert_rel(env.ocean_kg, 0.0, 0.0);
    ck_assert_double_eq(env.liquid, 0.0);
    /* the balance is still reported:
     * T_e(1.2 S_earth) + 33.42 + 3 log2(28.0/28.37) = 299.8136 K [C] */
    ck_assert_rel(env.t_balance_k, 299.8136, 1e-6);
    /* f_strat = whole-atmosphere H2O mole fraction n_v / (n_v + n_d) [C] */
    double nv = water / vl_species_molar_mass(VL_SP_H2O);
    double nd = env.mass_kg[VL_GAS_N2] / vl_species_molar_mass(VL_SP_N2) +
                env.mass_kg[VL_GAS_CO2] / vl_species_molar_mass(VL_SP_CO2);
    ck_assert_rel(env.f_strat, nv / (nv + nd), 1e-12);
    ck_assert(env.f_strat > 0.9);
    /* a trace of water: at least the moist-greenhouse value (Kasting 1988: 3e-3) */
    vl_climate_eval(c, vl_test_climate_work(c), 1e15, &env);
    ck_assert_rel(env.f_strat, 3e-3, 0.0);
    vl_test_climate_free(c);
}
END_TEST

/* Classify an env with the given flux, thresholds and balance temperature. */
static int classify(const vl_climate *c, double water, double s_eff, double t_bal)
{
    vl_env env;
    memset(&env, 0, sizeof env);
    env.s_eff = s_eff;
    env.s_runaway = 1.1;
    env.s_moist = 1.0;
    env.t_balance_k = t_bal;
    return vl_climate_classify(c, vl_test_climate_work(c), water, &env);
}

START_TEST(test_classify)
{
    vl_scenario sc;
    earth_scenario(&sc);
    vl_climate *c = new_climate(&sc);
    double dry = 1e-5 * VL_TO_KG;
    /* order: dry, runaway, frozen, moist greenhouse, temperate (docs/model.md 3.5 regimes) */
    ck_assert_int_eq(classify(c, 0.99 * dry, 2.0, 300.0), VL_REGIME_DRY);
    ck_assert_int_eq(classify(c, dry, 2.0, 300.0), VL_REGIME_RUNAWAY);
    ck_assert_int_eq(classify(c, VL_TO_KG, 1.1, 200.0), VL_REGIME_RUNAWAY);
    ck_assert_int_eq(classify(c, VL_TO_KG, 1.09, 200.0), VL_REGIME_FROZEN);
    ck_assert_int_eq(classify(c, VL_TO_KG, 1.05, 273.149), VL_REGIME_FROZEN);
    ck_assert_int_eq(classify(c, VL_TO_KG, 1.05, 273.15), VL_REGIME_MOIST);
    ck_assert_int_eq(classify(c, VL_TO_KG, 1.0, 300.0), VL_REGIME_MOIST);
    ck_assert_int_eq(classify(c, VL_TO_KG, 0.999, 300.0), VL_REGIME_TEMPERATE);
    ck_assert_int_eq(classify(c, VL_TO_KG, 0.5, 273.2), VL_REGIME_TEMPERATE);

    /* whole chain: Earth at 1 au temperate; at 0.9 au (S_eff 1.235 > 1.107) runaway [C] */
    vl_env env;
    earth_env(&env, VL_S_EARTH, VL_REGIME_TEMPERATE);
    set_air(&env, 1.01325e5, 280e-6);
    vl_climate_eval(c, vl_test_climate_work(c), VL_TO_KG, &env);
    ck_assert_int_eq(vl_climate_classify(c, vl_test_climate_work(c), VL_TO_KG, &env), VL_REGIME_TEMPERATE);
    earth_env(&env, VL_S_EARTH / 0.81, VL_REGIME_TEMPERATE);
    set_air(&env, 1.01325e5, 280e-6);
    vl_climate_eval(c, vl_test_climate_work(c), VL_TO_KG, &env);
    ck_assert_int_eq(vl_climate_classify(c, vl_test_climate_work(c), VL_TO_KG, &env), VL_REGIME_RUNAWAY);
    /* Earth at 1.5 au: T_balance 288 - 254.6 (1 - 1/sqrt 1.5) = 241 K, frozen [C] */
    earth_env(&env, VL_S_EARTH / 2.25, VL_REGIME_TEMPERATE);
    set_air(&env, 1.01325e5, 280e-6);
    vl_climate_eval(c, vl_test_climate_work(c), VL_TO_KG, &env);
    ck_assert_int_eq(vl_climate_classify(c, vl_test_climate_work(c), VL_TO_KG, &env), VL_REGIME_FROZEN);
    vl_test_climate_free(c);
}
END_TEST

START_TEST(test_names_and_errors)
{
    ck_assert_str_eq(vl_regime_name(VL_REGIME_DRY), "dry");
    ck_assert_str_eq(vl_regime_name(VL_REGIME_FROZEN), "frozen");
    ck_assert_str_eq(vl_regime_name(VL_REGIME_TEMPERATE), "temperate");
    ck_assert_str_eq(vl_regime_name(VL_REGIME_MOIST), "moist_greenhouse");
    ck_assert_str_eq(vl_regime_name(VL_REGIME_RUNAWAY), "runaway");
    ck_assert_str_eq(vl_regime_name(VL_NREGIMES), "invalid");

    vl_scenario sc;
    earth_scenario(&sc);
    vl_status st;
    vl_status_clear(&st);
    sc.climate.model = 7;
    ck_assert_ptr_null(vl_climate_new(&sc, &st));
    ck_assert_int_eq(st.code, VL_ERR_INTERNAL);
    earth_scenario(&sc);
    sc.climate.runaway_fit = 9;
    vl_status_clear(&st);
    ck_assert_ptr_null(vl_climate_new(&sc, &st));
    ck_assert_int_eq(st.code, VL_ERR_INTERNAL);
    vl_climate_free(NULL);
}
END_TEST

Suite *vl_suite_climate(void)
{
    Suite *s = suite_create("climate");
    TCase *tc = tcase_create("climate");
    tcase_add_test(tc, test_water_saturation);
    tcase_add_test(tc, test_hz_2013);
    tcase_add_test(tc, test_hz_2014);
    tcase_add_test(tc, test_thresholds_in_env);
    tcase_add_test(tc, test_energy_balance);
    tcase_add_test(tc, test_co2_floor);
    tcase_add_test(tc, test_vapour_partition);
    tcase_add_test(tc, test_runaway_state);
    tcase_add_test(tc, test_classify);
    tcase_add_test(tc, test_names_and_errors);
    suite_add_tcase(s, tc);
    return s;
}
