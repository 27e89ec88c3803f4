/* test_carbon.c: the carbon cycle (docs/cycles.md): outgassing with the heat flow
 * and the tectonic mode, the continental and seafloor weathering laws, carbonate
 * recycling, the ocean-atmosphere partition of the surface CO2, and present Earth's
 * relaxation after a perturbation; each check names its source. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "suites.h"
#include "volev/integrate.h"
#include "volev/interior.h"
#include "volev/model.h"
#include "volev/ocean.h"
#include "volev/output.h"
#include "volev/units.h"

#define TMOL_YR (1e12 / VL_YR)
#define T_NOW (4.57e9 * VL_YR)

static double mu_co2(void) { return vl_species_molar_mass(VL_SP_CO2); }

/* Defaults with the overrides sets[0..n). */
/* Only the named processes stay enabled (NULL-terminated list). */
static void only(vl_scenario *sc, const char *const *names)
{
    for (size_t i = 0; i < vl_nprocesses; i++) {
        sc->proc[i].enabled = 0;
        for (const char *const *n = names; *n; n++)
            if (strcmp(vl_processes[i]->name, *n) == 0)
                sc->proc[i].enabled = 1;
    }
}

/* Present Earth: one ocean, atmospheric N2 3.887e18 kg ([C]: 5.148e18 kg of air, total
 * atmospheric mass from memory, x 0.7808 N2 by volume, NSSDC, x 28.013/28.965) and
 * co2_mol of surface CO2. */
static void earth_state(double co2_mol, double y[VL_NSTATE])
{
    memset(y, 0, VL_NSTATE * sizeof y[0]);
    y[VL_R_WATER] = VL_TO_KG;
    y[VL_R_N2] = 3.887e18;
    y[VL_R_CO2] = co2_mol * mu_co2();
}

/* Column col (kg/s) of process name alone at (y, env). */
static double rate_of(const vl_model *m, const char *name, const double *y, const vl_env *env,
                      int col)
{
    double dydt[VL_NSTATE], cols[8];
    vl_test_process_rates(m, name, y, env, dydt, cols);
    return cols[col];
}

/* An env for the rate laws: present Earth at the reference state of the weathering laws
 * (280 ppmv x 1.01325 bar, 288 K, ice-free, present heat flow). */
static void reference_env(const vl_model *m, const double *y, vl_env *env)
{
    vl_model_env(m, vl_test_work(m), T_NOW, y, VL_REGIME_TEMPERATE, env);
    env->p_pa[VL_GAS_CO2] = 28.37;
    env->t_surf_k = 288.0;
    env->liquid = 1.0;
    env->heat_flow_rel = 1.0;
}

START_TEST(continental_kinetic_law)
{
    const char *sets[] = {"processes.weathering.supply_limit_tmol_yr=1e9",
                          "processes.weathering.co2_exponent=0.2385",
                          "processes.weathering.temp_efold_k=17.3"};
    vl_scenario *sc = vl_test_scenario(NULL, sets, 3);
    vl_model *m = vl_test_model(sc);
    double y[VL_NSTATE];
    vl_env env;
    earth_state(3.3e18, y);
    reference_env(m, y, &env);
    double w0 = rate_of(m, "weathering", y, &env, 0);
    /* the reference state draws down reference_rate_tmol_yr (default 4.4) exactly */
    ck_assert_rel(w0, 4.4 * TMOL_YR * mu_co2(), 1e-12);
    /* Walker, Hays & Kasting 1981 form: doubling pCO2 at fixed T multiplies the kinetic
     * rate by 2^beta [C]; supply limit 1e9 Tmol/yr: departure ~ W/(2 W_max) < 1e-8 */
    env.p_pa[VL_GAS_CO2] *= 2.0;
    ck_assert_rel(rate_of(m, "weathering", y, &env, 0) / w0, pow(2.0, 0.2385), 1e-8);
    /* warming by Te at fixed pCO2 multiplies it by e (same form) [C] */
    env.p_pa[VL_GAS_CO2] = 28.37;
    env.t_surf_k = 288.0 + 17.3;
    ck_assert_rel(rate_of(m, "weathering", y, &env, 0) / w0, exp(1.0), 1e-8);
    /* no liquid water, no weathering */
    env.liquid = 0.0;
    ck_assert_double_eq(rate_of(m, "weathering", y, &env, 0), 0.0);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

/* The reference rates are per Earth mass (outgassing) and per Earth surface (weathering,
 * seafloor weathering) unless switched to absolute (docs/cycles.md): a planet of 0.5
 * Earth masses and 0.8 Earth radii gets 0.5x and 0.64x of them. */
START_TEST(rates_scale_with_planet)
{
    const char *small[] = {"planet.mass_mearth=0.5", "planet.radius_rearth=0.8"};
    const char *absolute[] = {"planet.mass_mearth=0.5", "planet.radius_rearth=0.8",
                              "processes.outgassing.scale_by_planet_mass=false",
                              "processes.weathering.scale_by_surface_area=false",
                              "processes.seafloor_weathering.scale_by_surface_area=false"};
    vl_scenario *sa = vl_test_scenario(NULL, small, 2);
    vl_scenario *sb = vl_test_scenario(NULL, absolute, 5);
    vl_model *ma = vl_test_model(sa), *mb = vl_test_model(sb);
    double y[VL_NSTATE];
    vl_env ea, eb;
    earth_state(3.3e18, y);
    y[VL_R_MANTLE_C] = 1e22; /* a source for outgassing */
    reference_env(ma, y, &ea);
    reference_env(mb, y, &eb);
    const char *names[] = {"outgassing", "weathering", "seafloor_weathering"};
    const double want[] = {0.5, 0.64, 0.64}; /* M_p/M_E; (R_p/R_E)^2 [C] */
    for (int i = 0; i < 3; i++) {
        double a = rate_of(ma, names[i], y, &ea, 0), b = rate_of(mb, names[i], y, &eb, 0);
        ck_assert_msg(b > 0.0, "%s", names[i]);
        ck_assert_rel(a / b, want[i], 1e-12);
    }
    /* absolute rates at the reference state are the table's: weathering 4.4 Tmol/yr */
    ck_assert_rel(rate_of(mb, "weathering", y, &eb, 0), 4.4 * TMOL_YR * mu_co2(), 1e-12);
    vl_test_model_free(ma);
    vl_test_model_free(mb);
    vl_scenario_free(sa);
    vl_scenario_free(sb);
}
END_TEST

START_TEST(continental_runoff_and_supply)
{
    const char *sets[] = {"processes.weathering.runoff=true"};
    vl_scenario *sc = vl_test_scenario(NULL, sets, 1);
    vl_model *m = vl_test_model(sc);
    double y[VL_NSTATE];
    vl_env env;
    earth_state(3.3e18, y);
    reference_env(m, y, &env);
    double w0 = rate_of(m, "weathering", y, &env, 0);
    double wmax = 59.0 * TMOL_YR * mu_co2(); /* default supply limit */
    /* runoff factor (1 + 0.038 dT)^0.65 (Berner & Kothavala 2001, from memory) on top of
     * exp(dT/Te), Te = 13.7 K: the kinetic rate at +7.3 K, through the supply limit
     * W = W_max (1 - exp(-W_kin/W_max)) [C] */
    double kin0 = -wmax * log1p(-w0 / wmax);
    double kin = kin0 * exp(7.3 / 13.7) * pow(1.0 + 0.038 * 7.3, 0.65);
    env.t_surf_k = 288.0 + 7.3;
    ck_assert_rel(rate_of(m, "weathering", y, &env, 0), wmax * -expm1(-kin / wmax), 1e-12);
    /* the runoff factor vanishes below T0 - 1/RUN = 261.7 K (and stays 0) */
    env.t_surf_k = 250.0;
    ck_assert_double_eq(rate_of(m, "weathering", y, &env, 0), 0.0);
    /* a hot surface: the supply of fresh rock caps the drawdown (Foley 2015) */
    env.t_surf_k = 420.0;
    double w = rate_of(m, "weathering", y, &env, 0);
    ck_assert(w <= wmax && w > 0.999 * wmax);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(seafloor_law)
{
    const char *sets[] = {"processes.seafloor_weathering.supply_limit_factor=1e9"};
    vl_scenario *sc = vl_test_scenario(NULL, sets, 1);
    vl_model *m = vl_test_model(sc);
    double y[VL_NSTATE];
    vl_env env;
    earth_state(3.3e18, y);
    reference_env(m, y, &env);
    const char *p = "seafloor_weathering";
    double f0 = rate_of(m, p, y, &env, 0);
    /* the reference state: F0 = 1.5 Tmol/yr (default) */
    ck_assert_rel(f0, 1.5 * TMOL_YR * mu_co2(), 1e-12);
    /* pCO2 power alpha = 0.23 (Krissansen-Totton & Catling 2017, from memory) [C] */
    env.p_pa[VL_GAS_CO2] *= 2.0;
    ck_assert_rel(rate_of(m, p, y, &env, 0) / f0, pow(2.0, 0.23), 1e-8);
    /* Arrhenius: Ea = 53 kJ/mol, within 41-65 kJ/mol (Brady & Gislason 1997, GCA 61:965);
     * 288 -> 301.7 K multiplies the rate by exp(-Ea/R (1/301.7 - 1/288)) [C] */
    env.p_pa[VL_GAS_CO2] = 28.37;
    env.t_surf_k = 301.7;
    ck_assert_rel(rate_of(m, p, y, &env, 0) / f0,
                  exp(-53e3 / VL_R_GAS * (1.0 / 301.7 - 1.0 / 288.0)), 1e-8);
    /* spreading ~ heat flow: proportional to Q/Q0, supply limit included [C] */
    env.t_surf_k = 288.0;
    env.heat_flow_rel = 2.385;
    ck_assert_rel(rate_of(m, p, y, &env, 0) / f0, 2.385, 1e-12);
    /* ice-covered ocean: none */
    env.liquid = 0.0;
    ck_assert_double_eq(rate_of(m, p, y, &env, 0), 0.0);
    vl_test_model_free(m);
    vl_scenario_free(sc);
    /* no spreading under a stagnant lid */
    const char *stag[] = {"planet.interior.tectonics=stagnant_lid"};
    sc = vl_test_scenario(NULL, stag, 1);
    m = vl_test_model(sc);
    reference_env(m, y, &env);
    ck_assert_double_eq(rate_of(m, p, y, &env, 0), 0.0);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(outgassing_heat_flow_and_lid)
{
    const char *sets[] = {"processes.outgassing.heat_flow_exponent=1.5"};
    vl_scenario *sc = vl_test_scenario(NULL, sets, 1);
    vl_model *m = vl_test_model(sc);
    double y[VL_NSTATE];
    vl_env env;
    earth_state(3.3e18, y);
    y[VL_R_MANTLE_C] = 5.2e21;
    y[VL_R_MANTLE_N] = 2.3e19;
    /* env carries the interior's heat flow history (interior.c) */
    double t = 2.9e9 * VL_YR;
    vl_model_env(m, vl_test_work(m), t, y, VL_REGIME_TEMPERATE, &env);
    double q = vl_interior_heat_flow_rel(&sc->interior, t);
    ck_assert_double_eq(env.heat_flow_rel, q);
    ck_assert(q > 1.2);
    /* mobile lid: V = V0 (Q/Q0)^m (Lehmer et al. 2020), V0 = 2.0 Tmol/yr CO2 (default) */
    double v0 = 2.0 * TMOL_YR * mu_co2();
    ck_assert_rel(rate_of(m, "outgassing", y, &env, 0), v0 * pow(q, 1.5), 1e-12);
    ck_assert_rel(rate_of(m, "outgassing", y, &env, 1),
                  1e-3 * TMOL_YR * vl_species_molar_mass(VL_SP_N2) * pow(q, 1.5), 1e-12);
    vl_test_model_free(m);
    vl_scenario_free(sc);
    /* stagnant lid: f_sl V0 (Q/Q0)^m_sl, defaults 0.1 and 2 (docs/cycles.md) */
    const char *stag[] = {"planet.interior.tectonics=stagnant_lid"};
    sc = vl_test_scenario(NULL, stag, 1);
    m = vl_test_model(sc);
    vl_model_env(m, vl_test_work(m), t, y, VL_REGIME_TEMPERATE, &env);
    ck_assert_rel(rate_of(m, "outgassing", y, &env, 0), 0.1 * v0 * q * q, 1e-12);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(recycling_split)
{
    vl_scenario *sc = vl_test_scenario(NULL, NULL, 0);
    vl_model *m = vl_test_model(sc);
    double y[VL_NSTATE];
    vl_env env;
    earth_state(3.3e18, y);
    /* ~63 bar CO2-equivalent on Earth [C]: ~7.5e21 mol of crustal carbonate (from memory)
     * x 0.044009 kg/mol = 3.3e20 kg; x 9.82 m/s^2 / 5.101e14 m^2 = 6.3e6 Pa */
    y[VL_R_CARBONATE] = 3.29e20;
    reference_env(m, y, &env);
    env.heat_flow_rel = 1.37;
    /* S = (Q/Q0) M / tau, tau = 1.7 Gyr; f = 0.3 to the mantle, the rest back (defaults) */
    double s = 1.37 * y[VL_R_CARBONATE] / (1.7e9 * VL_YR);
    ck_assert_rel(rate_of(m, "carbonate_recycling", y, &env, 0), 0.3 * s, 1e-12);
    ck_assert_rel(rate_of(m, "carbonate_recycling", y, &env, 1), 0.7 * s, 1e-12);
    vl_test_model_free(m);
    vl_scenario_free(sc);
    const char *stag[] = {"planet.interior.tectonics=stagnant_lid"};
    sc = vl_test_scenario(NULL, stag, 1);
    m = vl_test_model(sc);
    /* stagnant lid: no subduction (docs/cycles.md) */
    ck_assert_double_eq(rate_of(m, "carbonate_recycling", y, &env, 0), 0.0);
    ck_assert_double_eq(rate_of(m, "carbonate_recycling", y, &env, 1), 0.0);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

/* Without an ocean the sinks stop and the surface CO2 (all of it in the air) grows at
 * the outgassing rate. */
START_TEST(dry_planet_grows_at_outgassing)
{
    static const char *const carbon[] = {"outgassing", "weathering", "seafloor_weathering",
                                         "carbonate_recycling", NULL};
    const char *sets[] = {"inventory.surface_water_to=0", "inventory.co2_bar=0.0417",
                          "inventory.mantle_co2_bar=1000", "climate.model=hz_fit",
                          "run.start_yr=4.0e9", "run.end_yr=4.01e9", "run.rel_tolerance=1e-10"};
    vl_scenario *sc = vl_test_scenario(NULL, sets, 7);
    only(sc, carbon);
    vl_model *m = vl_test_model(sc);
    double y[VL_NSTATE], dydt[VL_NSTATE], cols[16];
    vl_model_initial_state(m, y);
    double t = 4.0e9 * VL_YR;
    vl_env env;
    vl_model_rhs(m, vl_test_work(m), t, y, VL_REGIME_DRY, dydt, cols, &env);
    double v = 2.0 * TMOL_YR * mu_co2() * vl_interior_heat_flow_rel(&sc->interior, t);
    /* dCO2/dt = V (outgassing only; weathering needs liquid water) */
    ck_assert_rel(dydt[VL_R_CO2], v, 1e-9);
    ck_assert_double_eq(env.mass_kg[VL_GAS_CO2], y[VL_R_CO2]);
    for (size_t c = 0; c < m->ncolumns; c++)
        if (strstr(m->col_name[c], "weathering") || strstr(m->col_name[c], "seafloor"))
            ck_assert_double_eq(cols[c], 0.0);
    /* over 10 Myr the gain is the integral of V (Simpson over the heat flow history [C]);
     * run at rel_tolerance 1e-10, so the global integration error stays below 1e-6 */
    vl_status st;
    vl_run_stats stats;
    vl_run_sink sink = {NULL, NULL, NULL};
    ck_assert_msg(vl_integrate(m, &sink, &stats, &st) == VL_OK, "%s", st.msg);
    double t1 = 4.01e9 * VL_YR, sum = 0.0;
    int n = 100;
    for (int i = 0; i <= n; i++) {
        double w = (i == 0 || i == n) ? 1.0 : (i % 2 ? 4.0 : 2.0);
        sum += w * vl_interior_heat_flow_rel(&sc->interior, t + (t1 - t) * i / n);
    }
    double gain = 2.0 * TMOL_YR * mu_co2() * sum * (t1 - t) / (3.0 * n);
    ck_assert_rel(stats.y_final[VL_R_CO2] - y[VL_R_CO2], gain, 1e-6);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(henry_and_dic)
{
    /* Sander compilation: H(298.15 K) = 3.3e-4 mol m^-3 Pa^-1, d ln H / d(1/T) = 2400 K;
     * H(273.15)/H(298.15) = exp(2400 (1/273.15 - 1/298.15)) = 2.089 [C] */
    ck_assert_rel(vl_ocean_henry(298.15), 3.3e-4, 1e-12);
    double r = vl_ocean_henry(273.15) / vl_ocean_henry(298.15);
    ck_assert_rel(r, exp(2400.0 * (1.0 / 273.15 - 1.0 / 298.15)), 1e-12);
    ck_assert(r > 2.08 && r < 2.10);
    /* the anchor: 2.3e-3 mol/kg DIC at 280 ppmv and 288 K (ocean.h) */
    ck_assert_rel(vl_ocean_dic(28.37, 288.0), 2.3, 1e-12);
    /* bicarbonate ~ sqrt(pCO2): four times the pCO2 doubles the bicarbonate part [C] */
    double c0 = vl_ocean_henry(288.0) * 28.37;
    ck_assert_rel(vl_ocean_dic(4.0 * 28.37, 288.0), 4.0 * c0 + 2.0 * (2.3 - c0), 1e-12);
    /* a warmer ocean holds less */
    ck_assert(vl_ocean_dic(1e5, 330.0) < vl_ocean_dic(1e5, 288.0));
    ck_assert_double_eq(vl_ocean_dic(0.0, 288.0), 0.0);
}
END_TEST

/* Share of the surface CO2 in the air for co2_mol of surface CO2 on present Earth. */
static double air_share(const vl_model *m, double co2_mol, int regime, vl_env *env)
{
    double y[VL_NSTATE];
    earth_state(co2_mol, y);
    vl_model_env(m, vl_test_work(m), T_NOW, y, regime, env);
    return env->mass_kg[VL_GAS_CO2] / y[VL_R_CO2];
}

START_TEST(partition_earth_and_dense)
{
    const char *sets[] = {"climate.model=hz_fit"};
    vl_scenario *sc = vl_test_scenario(NULL, sets, 1);
    vl_model *m = vl_test_model(sc);
    vl_env env;
    /* exchangeable carbon ~3.3e18 mol (from memory), of which the atmosphere holds
     * ~5e16 mol (280 ppmv x 1.77e20 mol of dry air [C]): most in the ocean */
    double share = air_share(m, 3.3e18, VL_REGIME_TEMPERATE, &env);
    ck_assert_msg(share < 0.1, "air share %g at 280 ppmv", share);
    double atm_mol = env.mass_kg[VL_GAS_CO2] / mu_co2();
    ck_assert_msg(atm_mol > 3.5e16 && atm_mol < 7e16, "atmosphere %g mol", atm_mol);
    /* at several bar most carbon is in the atmosphere (Henry's law, Sander compilation:
     * dissolved CO2 grows as pCO2, bicarbonate only as sqrt(pCO2); docs/cycles.md 6):
     * 5 bar of surface CO2 (as pressure alone) */
    double five_bar = 5.0 * VL_BAR / m->planet.pa_per_kg / mu_co2();
    share = air_share(m, five_bar, VL_REGIME_TEMPERATE, &env);
    ck_assert_msg(share > 0.5 && share < 1.0, "air share %g at 5 bar", share);
    /* frozen: the ocean under the ice still holds carbon; moist greenhouse: ocean too */
    ck_assert(air_share(m, 3.3e18, VL_REGIME_FROZEN, &env) < 0.1);
    ck_assert(air_share(m, 3.3e18, VL_REGIME_MOIST, &env) < 1.0);
    /* no ocean in the dry and runaway regimes: everything in the air */
    ck_assert_double_eq(air_share(m, 3.3e18, VL_REGIME_RUNAWAY, &env), 1.0);
    ck_assert_double_eq(air_share(m, 3.3e18, VL_REGIME_DRY, &env), 1.0);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

/* The split is continuous and increasing in the surface CO2: one-sided differences at
 * two step sizes agree (a noisy root would not), and the air's share of an increment is
 * between 0 and 1. */
START_TEST(partition_is_smooth)
{
    vl_ocean_air air = {3.887e18, 3.887e18 / vl_species_molar_mass(VL_SP_N2),
                        9.82 / (4.0 * VL_PI * VL_R_EARTH * VL_R_EARTH)};
    double v = VL_TO_KG / VL_OCEAN_DENSITY_KG_M3;
    static const double totals_kg[] = {1.4e17, 4.417e18, 2.385e20, 3.7e15};
    for (size_t i = 0; i < sizeof totals_kg / sizeof totals_kg[0]; i++) {
        double n = totals_kg[i], a = vl_ocean_atm_co2(n, v, 291.3, &air);
        double d1 = (vl_ocean_atm_co2(n * (1 + 1e-5), v, 291.3, &air) - a) / (1e-5 * n);
        double d2 = (vl_ocean_atm_co2(n * (1 + 1e-7), v, 291.3, &air) - a) / (1e-7 * n);
        ck_assert_msg(d1 > 0.0 && d1 < 1.0, "d atm/d total = %g", d1);
        /* forward differences: agree to the curvature term, ~1e-5 relative */
        ck_assert_rel(d2, d1, 1e-3);
    }
    ck_assert_double_eq(vl_ocean_atm_co2(0.0, v, 291.3, &air), 0.0);
    ck_assert_double_eq(vl_ocean_atm_co2(2.385e17, 0.0, 291.3, &air), 2.385e17);
}
END_TEST

/* ---- histories ---- */

#define MAX_ROWS 4096
typedef struct {
    long n;
    double t[MAX_ROWS], co2[MAX_ROWS];
    vl_env last;
} trace;

static int trace_row(void *ctx, double t, const double *y, const double *dydt,
                     const vl_env *env, const double *columns, vl_status *st)
{
    trace *c = ctx;
    (void)dydt, (void)columns, (void)st;
    if (c->n < MAX_ROWS) {
        c->t[c->n] = t;
        c->co2[c->n++] = y[VL_R_CO2];
    }
    c->last = *env;
    return VL_OK;
}

static int trace_event(void *ctx, double t, const char *name, const char *detail, vl_status *st)
{
    (void)ctx, (void)t, (void)name, (void)detail, (void)st;
    return VL_OK;
}

/* Run scenarios/earth.cfg with overrides; fills the trace and the stats. */
static void run_earth(const char *const *sets, size_t n, trace *tr, vl_run_stats *stats,
                      vl_scenario **sc_out, vl_model **m_out)
{
    vl_status st;
    vl_scenario *sc = vl_test_scenario("scenarios/earth.cfg", sets, n);
    vl_model *m = vl_test_model(sc);
    memset(tr, 0, sizeof *tr);
    vl_run_sink sink = {tr, trace_row, trace_event};
    ck_assert_msg(vl_integrate(m, &sink, stats, &st) == VL_OK, "%s", st.msg);
    for (int el = 0; el < VL_NELEMENTS; el++) {
        double t0 = stats->totals0[el];
        /* conservation criterion (docs/model.md 1): every element's relative residual < 1e-8 */
        if (t0 > 0.0)
            ck_assert_msg(fabs(stats->totals1[el] - t0) / t0 < 1e-8, "%s residual %g",
                          vl_element_name(el), fabs(stats->totals1[el] - t0) / t0);
    }
    *sc_out = sc;
    *m_out = m;
}

START_TEST(earth_history_carbon)
{
    static trace hist, base, pert;
    vl_run_stats s;
    vl_scenario *sc;
    vl_model *m;
    run_earth(NULL, 0, &hist, &s, &sc, &m); /* every default process on: conserves to 1e-8 */
    double bar = m->planet.pa_per_kg / VL_BAR, y_now[VL_NSTATE];
    memcpy(y_now, s.y_final, sizeof y_now);
    /* today: 288 K (hz_fit calibration, docs/model.md) and a few hundred ppmv */
    ck_assert_msg(fabs(hist.last.t_surf_k - 288.0) < 2.0, "T = %g", hist.last.t_surf_k);
    double ppm = hist.last.x[VL_GAS_CO2] * 1e6;
    ck_assert_msg(ppm > 140.0 && ppm < 560.0, "CO2 %g ppmv", ppm);
    /* most of the exchangeable carbon in the ocean (~3.3e18 mol, from memory, of which
     * ~5e16 in the air: 280 ppmv x 1.77e20 mol of dry air [C]) */
    ck_assert(hist.last.mass_kg[VL_GAS_CO2] < 0.1 * y_now[VL_R_CO2]);
    ck_assert_rel(y_now[VL_R_CO2] / mu_co2(), 3.3e18, 0.3);
    /* crustal carbonate ~63 bar CO2-equivalent [C] (~7.5e21 mol, from memory, as CO2:
     * 3.3e20 kg x 9.82 m/s^2 / 5.101e14 m^2): within 2x */
    double carb = y_now[VL_R_CARBONATE] * bar;
    ck_assert_msg(carb > 31.5 && carb < 126.0, "carbonate %g bar", carb);
    ck_assert(y_now[VL_R_MANTLE_C] > 0.0);
    vl_test_model_free(m);
    vl_scenario_free(sc);

    /* Perturbation around today: from 4.5 Gyr with today's carbon (baseline) and with the
     * surface CO2 doubled; the difference decays with the e-folding time of the
     * carbonate-silicate feedback. */
    char co2[64], co2x2[64], carbonate[64], mantle[64];
    snprintf(co2, sizeof co2, "inventory.co2_bar=%.17g", y_now[VL_R_CO2] * bar);
    snprintf(co2x2, sizeof co2x2, "inventory.co2_bar=%.17g", 2.0 * y_now[VL_R_CO2] * bar);
    snprintf(carbonate, sizeof carbonate, "inventory.carbonate_co2_bar=%.17g",
             y_now[VL_R_CARBONATE] * bar);
    snprintf(mantle, sizeof mantle, "inventory.mantle_co2_bar=%.17g", y_now[VL_R_MANTLE_C] * bar);
    const char *sets[] = {"run.start_yr=4.5e9", "run.linear_points=1400", "run.log_points=0",
                          carbonate, mantle, co2};
    run_earth(sets, 6, &base, &s, &sc, &m);
    /* quasi-steady state at the end: continental + seafloor weathering balance the
     * outgassing (mantle + arc return); the net tendency is small against the fluxes */
    double dydt[VL_NSTATE], cols[VL_MAX_COLUMNS];
    vl_model_rhs(m, vl_test_work(m), sc->run.end_s, s.y_final, base.last.regime, dydt, cols, NULL);
    double sinks = cols[vl_test_column(m, "weathering_co2_kg_s")] + cols[vl_test_column(m, "seafloor_co2_kg_s")];
    double sources = cols[vl_test_column(m, "outgas_co2_kg_s")] +
                     cols[vl_test_column(m, "recycled_to_surface_kg_s")];
    ck_assert_rel(sinks, sources, 1e-2);
    ck_assert_msg(fabs(dydt[VL_R_CO2]) < 1e-2 * sinks, "net %g of %g kg/s", dydt[VL_R_CO2], sinks);
    vl_test_model_free(m);
    vl_scenario_free(sc);
    sets[5] = co2x2;
    run_earth(sets, 6, &pert, &s, &sc, &m);
    ck_assert_int_eq(pert.n, base.n);
    double d0 = pert.co2[0] - base.co2[0], tau = -1.0;
    ck_assert(d0 > 0.0);
    for (long i = 1; i < base.n && tau < 0.0; i++) {
        ck_assert_double_eq(pert.t[i], base.t[i]);
        double a = (pert.co2[i - 1] - base.co2[i - 1]) / d0, b = (pert.co2[i] - base.co2[i]) / d0;
        if (b < exp(-1.0)) /* log-linear between the rows */
            tau = base.t[i - 1] +
                  (base.t[i] - base.t[i - 1]) * (-1.0 - log(a)) / (log(b) - log(a)) - base.t[0];
    }
    /* [C]: exchangeable carbon ~3.3e18 mol (from memory) over 6-7 Tmol/yr, about the
     * present volcanic supply of 5.9 Tmol/yr (Gerlach 2011): 3.3e18 / 6.5e12 per yr
     * = 0.5 Myr; asserted 0.1-2 Myr */
    ck_assert_msg(tau > 0.1e6 * VL_YR && tau < 2e6 * VL_YR, "e-folding %g Myr", tau / VL_YR / 1e6);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

/* The output's ocean_co2_kg column: the dissolved part of surface_co2_kg. */
START_TEST(ocean_column_written)
{
    char dir[64];
    snprintf(dir, sizeof dir, "/tmp/volev_carbon_XXXXXX");
    ck_assert_ptr_nonnull(mkdtemp(dir));
    char path[4096], run_dir[128];
    vl_status st;
    snprintf(run_dir, sizeof run_dir, "%s/run", dir);
    const char *sets[] = {"run.start_yr=4.56e9", "inventory.co2_bar=0.0274",
                          "inventory.carbonate_co2_bar=80", "inventory.mantle_co2_bar=920"};
    vl_scenario *sc = vl_test_scenario("scenarios/earth.cfg", sets, 4);
    vl_model *m = vl_test_model(sc);
    vl_output *o = vl_output_open(run_dir, m, &st);
    ck_assert_msg(o != NULL, "%s", st.msg);
    vl_run_sink sink = vl_output_sink(o);
    vl_run_stats stats;
    ck_assert_msg(vl_integrate(m, &sink, &stats, &st) == VL_OK, "%s", st.msg);
    ck_assert_msg(vl_output_commit(o, &stats, &st) == VL_OK, "%s", st.msg);
    snprintf(path, sizeof path, "%s/series.csv", run_dir);
    FILE *f = fopen(path, "r");
    ck_assert_ptr_nonnull(f);
    static char line[65536], header[65536];
    header[0] = '\0';
    while (fgets(line, sizeof line, f))
        if (line[0] != '#' && header[0] == '\0')
            memcpy(header, line, sizeof line);
    fclose(f);
    /* the last row, column by column */
    int k_ocean = -1, k_surface = -1, k = 0;
    for (char *tok = strtok(header, ",\n"); tok; tok = strtok(NULL, ",\n"), k++) {
        if (strcmp(tok, "ocean_co2_kg") == 0)
            k_ocean = k;
        if (strcmp(tok, "surface_co2_kg") == 0)
            k_surface = k;
        ck_assert_str_ne(tok, "atm_co2_kg");
    }
    ck_assert(k_ocean >= 0 && k_surface >= 0);
    double ocean = 0.0, surface = 0.0;
    k = 0;
    for (char *tok = strtok(line, ",\n"); tok; tok = strtok(NULL, ",\n"), k++) {
        if (k == k_ocean)
            ocean = strtod(tok, NULL);
        if (k == k_surface)
            surface = strtod(tok, NULL);
    }
    /* present Earth: the ocean holds more than 90 % (~3.3e18 mol of exchangeable carbon,
     * from memory, of which ~5e16 mol in the air: 280 ppmv x 1.77e20 mol [C]) */
    ck_assert_msg(ocean > 0.9 * surface && ocean < surface, "ocean %g of %g kg", ocean, surface);
    vl_test_model_free(m);
    vl_scenario_free(sc);
    static const char *const files[] = {"series.csv", "events.csv", "summary.csv",
                                        "scenario.resolved.cfg"};
    for (size_t i = 0; i < 4; i++) {
        snprintf(path, sizeof path, "%s/%s", run_dir, files[i]);
        unlink(path);
    }
    rmdir(run_dir);
    rmdir(dir);
}
END_TEST

Suite *vl_suite_carbon(void)
{
    Suite *s = suite_create("carbon");
    TCase *laws = tcase_create("laws");
    tcase_add_test(laws, continental_kinetic_law);
    tcase_add_test(laws, continental_runoff_and_supply);
    tcase_add_test(laws, seafloor_law);
    tcase_add_test(laws, rates_scale_with_planet);
    tcase_add_test(laws, outgassing_heat_flow_and_lid);
    tcase_add_test(laws, recycling_split);
    tcase_add_test(laws, henry_and_dic);
    tcase_add_test(laws, partition_earth_and_dense);
    tcase_add_test(laws, partition_is_smooth);
    suite_add_tcase(s, laws);
    TCase *runs = tcase_create("histories");
    tcase_set_timeout(runs, 120);
    tcase_add_test(runs, dry_planet_grows_at_outgassing);
    tcase_add_test(runs, earth_history_carbon);
    tcase_add_test(runs, ocean_column_written);
    suite_add_tcase(s, runs);
    return s;
}
