/* test_column.c: the radiative column and the column climate backend against published
 * limits and values computed from the grey column; each check names its source. */
#include <stdio.h>
#include <string.h>

#include "suites.h"
#include "volev/column.h"
#include "volev/model.h"
#include "volev/units.h"
#include "volev/water.h"

/* Column options from the scenario defaults, at gravity g. */
static vl_column_opts default_opts(double g)
{
    vl_scenario *sc = vl_scenario_new();
    ck_assert_ptr_nonnull(sc);
    const vl_climate_params *cp = &sc->climate;
    vl_column_opts o = {.g = g, .k_h2o = cp->k_h2o, .k_co2 = cp->k_co2, .p0 = cp->p0_pa,
                        .n_h2o = cp->n_h2o, .n_co2 = cp->n_co2, .u_co2_sat = cp->u_co2_sat,
                        .k_cia = cp->k_cia, .strat_offset_k = cp->strat_offset_k, .wet = 1};
    vl_scenario_free(sc);
    return o;
}

/* 1 bar of N2 (pressure alone) with CO2 at mole fraction x_co2 relative to the N2. */
static vl_column_air n2_air(double x_co2)
{
    double mc = vl_species_molar_mass(VL_SP_CO2), mn = vl_species_molar_mass(VL_SP_N2);
    double pn = VL_BAR, pc = pn * x_co2 / (1.0 - x_co2) * mc / mn;
    vl_column_air a;
    a.p_dry_pa = pn + pc;
    a.q_co2 = pc / a.p_dry_pa;
    a.m_dry = a.p_dry_pa / (pc / mc + pn / mn);
    a.cp_dry = a.q_co2 * VL_CP_CO2 + (1.0 - a.q_co2) * VL_CP_N2;
    return a;
}

START_TEST(latent_heat)
{
    /* IAPWS-95 steam tables: 2256.5 kJ/kg at 373.124 K (from memory); Watson form within 2 % */
    ck_assert_rel(vl_water_latent_vap(373.124), 2256.5e3, 0.02);
    /* IAPWS-95: 2500.9 kJ/kg at the triple point (from memory) */
    ck_assert_rel(vl_water_latent_vap(273.16), 2500.9e3, 1e-3);
    /* no latent heat at and above the critical point (textbook) */
    ck_assert_double_eq(vl_water_latent_vap(VL_WATER_TC_K), 0.0);
    ck_assert(vl_water_latent(260.0) > vl_water_latent(274.0)); /* sublimation > vaporisation */
}
END_TEST

START_TEST(steam_limit_and_gravity)
{
    vl_column_air steam = {0.0, vl_species_molar_mass(VL_SP_N2), VL_CP_N2, 0.0};
    vl_column_out out;
    double olr[3], g[3] = {3.7, 9.81, 20.0};
    for (int i = 0; i < 3; i++) {
        vl_column_opts o = default_opts(g[i]);
        vl_column_eval(&o, &steam, 420.0, 0.0, &out);
        olr[i] = out.olr;
        /* the plateau: OLR barely changes between 380 and 460 K surface temperature */
        vl_column_out a, b;
        vl_column_eval(&o, &steam, 380.0, 0.0, &a);
        vl_column_eval(&o, &steam, 460.0, 0.0, &b);
        ck_assert_rel(a.olr, b.olr, 0.01);
    }
    /* Goldblatt et al. 2013, Nat. Geosci. 6:661: 282 W/m^2 at Earth gravity, +-10 % */
    ck_assert_rel(olr[1], 282.0, 0.10);
    /* the limit rises with gravity (Pierrehumbert 2010): the emission level sits near
     * p = g / (D k_w), deeper and warmer at higher g [C] */
    ck_assert(olr[0] < olr[1] && olr[1] < olr[2]);
}
END_TEST

START_TEST(unbroadened_grey_limit)
{
    /* computed [C] from the grey two-stream steam column: k_w = 0.01 m^2/kg, no
     * broadening, D = 1.66, saturated (Wagner & Pruss 1993, J. Phys. Chem. Ref. Data
     * 22:783, the liquid curve throughout): OLR = integral over x of sigma T_sat(p)^4 e^-x,
     * x = D k_w p / g: plateau ~290 W/m^2 at 9.81 m/s^2,
     * 240 at 3.7 and 335 at 20 (emission level p = g / (D k_w)); 3 % */
    vl_column_air steam = {0.0, vl_species_molar_mass(VL_SP_N2), VL_CP_N2, 0.0};
    double g[3] = {3.7, 9.81, 20.0}, want[3] = {240.0, 290.0, 335.0};
    for (int i = 0; i < 3; i++) {
        vl_column_opts o = {.g = g[i], .k_h2o = 0.01, .p0 = VL_BAR, .wet = 1};
        vl_column_out out;
        vl_column_eval(&o, &steam, 400.0, 0.0, &out);
        ck_assert_rel(out.olr, want[i], 0.03);
    }
}
END_TEST

START_TEST(cold_trap_opens)
{
    vl_column_opts o = default_opts(9.81);
    vl_column_air air = n2_air(280e-6);
    vl_column_out a, b;
    vl_column_eval(&o, &air, 288.0, 0.0, &a);
    vl_column_eval(&o, &air, 350.0, 0.0, &b);
    /* Kasting 1988; Kasting, Chen & Kopparapu 2015: orders of magnitude between 288 and 350 K */
    ck_assert_msg(b.f_strat > 100.0 * a.f_strat, "f_strat %g -> %g", a.f_strat, b.f_strat);
    /* crossing of 3e-3 (Kasting 1988) within 320-360 K */
    double cross = 0.0;
    for (double t = 300.0; t <= 380.0; t += 0.5) {
        vl_column_out c;
        vl_column_eval(&o, &air, t, 0.0, &c);
        if (c.f_strat >= 3e-3) {
            cross = t;
            break;
        }
    }
    ck_assert_msg(cross >= 320.0 && cross <= 360.0, "crossing at %g K", cross);
}
END_TEST

/* Backend fixture: a Sun-like star of constant luminosity at 1 au, 1 bar N2, CO2 at
 * x_co2, one ocean; the instellation is scaled to s_eff. */
typedef struct {
    vl_scenario *sc;
    vl_model *m;
    double y[VL_NRES];
    double co2_air_kg;  /* the CO2 the air holds (x_co2); y[VL_R_CO2] adds the ocean's */
} planet;

static void make_planet(planet *p, double x_co2, const char *extra)
{
    const char *sets[] = {"star.luminosity_model=constant", "star.teff_k=5772", extra};
    p->sc = vl_test_scenario(NULL, sets, extra ? 3u : 2u);
    p->m = vl_test_model(p->sc);
    memset(p->y, 0, sizeof p->y);
    double mc = vl_species_molar_mass(VL_SP_CO2), mn = vl_species_molar_mass(VL_SP_N2);
    p->y[VL_R_N2] = VL_BAR / p->m->planet.pa_per_kg;
    p->y[VL_R_CO2] = p->y[VL_R_N2] * x_co2 / (1.0 - x_co2) * mc / mn;
    p->y[VL_R_WATER] = VL_TO_KG;
    p->co2_air_kg = p->y[VL_R_CO2];
}

static void free_planet(planet *p)
{
    vl_test_model_free(p->m);
    vl_scenario_free(p->sc);
}

/* env at instellation s_eff (units of 1361 W/m^2) in regime. */
static void env_at(planet *p, double s_eff, int regime, vl_env *env)
{
    /* VL_R_CO2 is the CO2 of air and ocean together (ocean.h): find, by bisection in
     * log, the amount whose atmospheric part in this regime is co2_air_kg */
    double want = p->co2_air_kg, lo = log(want), hi = log(want) + log(1e4);
    for (int i = 0; i < 60; i++) {
        p->y[VL_R_CO2] = exp(0.5 * (lo + hi));
        vl_model_env(p->m, vl_test_work(p->m), 4.57e9 * VL_YR, p->y, regime, env);
        *(env->mass_kg[VL_GAS_CO2] < want ? &lo : &hi) = log(p->y[VL_R_CO2]);
    }
    p->y[VL_R_CO2] = exp(hi);
    vl_model_env(p->m, vl_test_work(p->m), 4.57e9 * VL_YR, p->y, regime, env);
    env->instellation = s_eff * VL_S_EARTH;
    env->s_eff = s_eff;
    vl_climate_eval(p->m->climate, vl_test_climate_work(p->m->climate), p->y[VL_R_WATER], env);
}

START_TEST(present_earth_and_doubling)
{
    planet p;
    vl_env e1, e2;
    make_planet(&p, 280e-6, NULL);
    env_at(&p, 1.0, VL_REGIME_TEMPERATE, &e1);
    /* calibration target (docs/model.md): present Earth 288 +- 2 K at 1361 W/m^2,
     * 280 ppmv CO2, 1 bar N2 */
    ck_assert_msg(fabs(e1.t_surf_k - 288.0) < 2.0, "T = %g", e1.t_surf_k);
    ck_assert_int_eq(vl_climate_classify(p.m->climate, vl_test_climate_work(p.m->climate), p.y[VL_R_WATER], &e1), VL_REGIME_TEMPERATE);
    free_planet(&p);
    make_planet(&p, 560e-6, NULL);
    env_at(&p, 1.0, VL_REGIME_TEMPERATE, &e2);
    double ecs = e2.t_surf_k - e1.t_surf_k;
    /* IPCC AR5 WG1: equilibrium climate sensitivity likely 1.5-4.5 K */
    ck_assert_msg(ecs >= 1.5 && ecs <= 4.5, "ECS = %g K", ecs);
    free_planet(&p);
}
END_TEST

START_TEST(runaway_threshold)
{
    planet p;
    vl_env e;
    make_planet(&p, 280e-6, NULL);
    env_at(&p, 1.0, VL_REGIME_TEMPERATE, &e);
    /* Kopparapu et al. 2013; Leconte et al. 2013 (375 W/m^2 = 1.10 S_earth): 1.0-1.15 */
    ck_assert_msg(e.s_runaway >= 1.0 && e.s_runaway <= 1.15, "S_runaway = %g", e.s_runaway);
    env_at(&p, 0.98 * e.s_runaway, VL_REGIME_TEMPERATE, &e);
    ck_assert_int_ne(vl_climate_classify(p.m->climate, vl_test_climate_work(p.m->climate), p.y[VL_R_WATER], &e), VL_REGIME_RUNAWAY);
    env_at(&p, 1.02 * e.s_runaway, VL_REGIME_TEMPERATE, &e);
    ck_assert_int_eq(vl_climate_classify(p.m->climate, vl_test_climate_work(p.m->climate), p.y[VL_R_WATER], &e), VL_REGIME_RUNAWAY);
    /* cooler stars: lower Rayleigh albedo, lower threshold (Kopparapu et al. 2013) */
    double sun = e.s_runaway;
    free_planet(&p);
    make_planet(&p, 280e-6, "star.teff_k=3300");
    env_at(&p, 1.0, VL_REGIME_TEMPERATE, &e);
    ck_assert(e.s_runaway < 0.95 * sun);
    free_planet(&p);
}
END_TEST

START_TEST(moist_greenhouse_between)
{
    planet p;
    vl_env e;
    make_planet(&p, 280e-6, NULL);
    env_at(&p, 1.0, VL_REGIME_TEMPERATE, &e);
    /* the moist greenhouse lies between today and the runaway (Kasting 1988) */
    ck_assert(e.s_moist > 1.0 && e.s_moist < e.s_runaway);
    env_at(&p, 0.5 * (e.s_moist + e.s_runaway), VL_REGIME_TEMPERATE, &e);
    ck_assert_int_eq(vl_climate_classify(p.m->climate, vl_test_climate_work(p.m->climate), p.y[VL_R_WATER], &e), VL_REGIME_MOIST);
    ck_assert(e.f_strat >= 3e-3);
    free_planet(&p);
}
END_TEST

START_TEST(ice_albedo_hysteresis)
{
    planet p;
    vl_env e;
    make_planet(&p, 280e-6, NULL);
    /* at 0.95 of today's flux both a snowball and a temperate Earth are equilibria
     * (ice-albedo bistability: Budyko 1969; Sellers 1969): each regime keeps its branch */
    env_at(&p, 0.95, VL_REGIME_FROZEN, &e);
    ck_assert_msg(e.t_surf_k < 250.0, "frozen branch at %g K", e.t_surf_k);
    ck_assert_int_eq(vl_climate_classify(p.m->climate, vl_test_climate_work(p.m->climate), p.y[VL_R_WATER], &e), VL_REGIME_FROZEN);
    ck_assert(e.liquid < 0.05); /* nearly ice-covered: the bottom of the ice ramp */
    env_at(&p, 0.95, VL_REGIME_TEMPERATE, &e);
    ck_assert_msg(e.t_surf_k > 273.15, "warm branch at %g K", e.t_surf_k);
    ck_assert_int_eq(vl_climate_classify(p.m->climate, vl_test_climate_work(p.m->climate), p.y[VL_R_WATER], &e), VL_REGIME_TEMPERATE);
    /* brighter: the frozen branch vanishes (thaw) */
    env_at(&p, 1.0, VL_REGIME_FROZEN, &e);
    ck_assert_int_eq(vl_climate_classify(p.m->climate, vl_test_climate_work(p.m->climate), p.y[VL_R_WATER], &e), VL_REGIME_TEMPERATE);
    /* dimmer: the temperate branch vanishes (freeze) */
    env_at(&p, 0.85, VL_REGIME_TEMPERATE, &e);
    ck_assert_int_eq(vl_climate_classify(p.m->climate, vl_test_climate_work(p.m->climate), p.y[VL_R_WATER], &e), VL_REGIME_FROZEN);
    /* just past the saddle-node the temperature stays continuous within the regime (the
     * branch's ghost), so the integrator can locate the event */
    vl_env a, b;
    env_at(&p, 0.9001, VL_REGIME_TEMPERATE, &a);
    env_at(&p, 0.8999, VL_REGIME_TEMPERATE, &b);
    ck_assert(fabs(a.t_surf_k - b.t_surf_k) < 1.0);
    free_planet(&p);
}
END_TEST

START_TEST(table_matches_column)
{
    /* the tabulated climate reproduces a direct column solution of the energy balance */
    planet p;
    vl_env e;
    make_planet(&p, 2.385e-3, NULL);
    env_at(&p, 0.97, VL_REGIME_TEMPERATE, &e);
    /* in 273-288 K the albedo is the temperate 0.3 (ice free, no steam) */
    ck_assert_msg(e.t_surf_k > 273.0 && e.t_surf_k < 288.0, "T = %g", e.t_surf_k);
    vl_column_opts o = default_opts(p.m->planet.g);
    double mc = vl_species_molar_mass(VL_SP_CO2), mn = vl_species_molar_mass(VL_SP_N2);
    vl_column_air a;
    double pc = e.mass_kg[VL_GAS_CO2] * p.m->planet.pa_per_kg, pn = p.y[VL_R_N2] * p.m->planet.pa_per_kg;
    a.p_dry_pa = pc + pn;
    a.q_co2 = pc / a.p_dry_pa;
    a.m_dry = a.p_dry_pa / (pc / mc + pn / mn);
    a.cp_dry = a.q_co2 * VL_CP_CO2 + (1.0 - a.q_co2) * VL_CP_N2;
    vl_column_out out;
    vl_column_eval(&o, &a, e.t_surf_k, 0.0, &out);
    /* absorbed equals emitted at the tabulated root: interpolation error below 0.5 % */
    ck_assert_rel(out.olr, e.instellation * (1.0 - 0.3) / 4.0, 5e-3);
    ck_assert_rel(out.f_strat, e.f_strat, 0.05);
    free_planet(&p);
}
END_TEST

Suite *vl_suite_column(void)
{
    Suite *s = suite_create("column");
    TCase *tc = tcase_create("core");
    tcase_set_timeout(tc, 60);
    tcase_add_test(tc, latent_heat);
    tcase_add_test(tc, steam_limit_and_gravity);
    tcase_add_test(tc, unbroadened_grey_limit);
    tcase_add_test(tc, cold_trap_opens);
    tcase_add_test(tc, present_earth_and_doubling);
    tcase_add_test(tc, runaway_threshold);
    tcase_add_test(tc, moist_greenhouse_between);
    tcase_add_test(tc, ice_albedo_hysteresis);
    tcase_add_test(tc, table_matches_column);
    suite_add_tcase(s, tc);
    return s;
}
