/* test_invariants.c: the physical bounds of issue 18 -- hz_fit's greenhouse never
 * negative and its surface never below the equilibrium temperature nor the cosmic
 * microwave background, the impacts' scale height never negative, the physical-invariant
 * guard of the integrator (src/engine/invariants.c), residuals on the written state with
 * a resolution for absent elements, and the work bound (run.max_rhs_evaluations,
 * run.max_cpu_s) in runs and sweeps. Expectations come from the issue and the cited
 * sources, not from the code's own output. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "suites.h"
#include "volev/climate.h"
#include "volev/flux.h"
#include "volev/integrate.h"
#include "volev/invariants.h"
#include "volev/model.h"
#include "volev/units.h"
#include "volev/water.h"

/* ---- hz_fit ---------------------------------------------------------------------- */

START_TEST(test_greenhouse_knee)
{
    /* a greenhouse never cools the surface (issue 18): the term is >= 0 and >= the fit's
     * own value everywhere, equal to it above the knee (so ordinary climates are
     * unchanged), 0 well below; continuous with its slope (a smooth right-hand side for
     * the integrator, common practice) */
    for (double g = -60.0; g <= 60.0; g += 0.0625) {
        double k = vl_hzfit_greenhouse_knee(g);
        ck_assert_msg(k >= 0.0 && k >= g, "knee(%g) = %g", g, k);
        if (g >= 2.0)
            ck_assert_msg(k == g, "knee(%g) = %g changes an ordinary greenhouse", g, k);
        if (g <= -2.0)
            ck_assert_msg(k == 0.0, "knee(%g) = %g", g, k);
    }
    const double h = 1e-7, edges[] = {-2.0, 2.0};
    for (int i = 0; i < 2; i++) {
        double e = edges[i], k0 = vl_hzfit_greenhouse_knee(e);
        double left = (k0 - vl_hzfit_greenhouse_knee(e - h)) / h;
        double right = (vl_hzfit_greenhouse_knee(e + h) - k0) / h;
        ck_assert_msg(fabs(vl_hzfit_greenhouse_knee(e + h) - vl_hzfit_greenhouse_knee(e - h)) <
                          3.0 * h,
                      "knee jumps at %g", e);
        ck_assert_msg(fabs(left - right) < 1e-6, "slope jumps at %g: %g vs %g", e, left, right);
    }
}
END_TEST

START_TEST(test_equilibrium_temperature)
{
    /* Earth: [1361 W/m^2 x (1 - 0.3) / (4 sigma)]^(1/4) = 254.578 K, the textbook 255 K
     * effective temperature (common practice; 1361 W/m^2: Kopp & Lean 2011) [C]; the
     * background adds T_CMB^4 / (4 T_e^3), 8e-7 K */
    ck_assert_rel(vl_hzfit_equilibrium_temp(1361.0, 0.3), 254.57814, 1e-7);
    /* no starlight: the cosmic microwave background, 2.72548 K (Fixsen 2009, ApJ 707:916) */
    ck_assert_rel(vl_hzfit_equilibrium_temp(0.0, 0.3), 2.72548, 1e-12);
    /* the Bond albedo at its bound (0.95) still leaves T_e above the background [C] */
    ck_assert(vl_hzfit_equilibrium_temp(1e-3, 0.95) > 2.72548);
}
END_TEST

START_TEST(test_psat_at_and_below_zero)
{
    /* the vapour curve tends to 0 as T -> 0 K (Murphy & Koop 2005: ln p ~ -5723/T); at or
     * below 0 K (a state the guard stops) no vapour, not an overflow into all the water */
    ck_assert(vl_water_psat(0.0) == 0.0);
    ck_assert(vl_water_psat(-19.2) == 0.0);
    ck_assert(isnan(vl_water_psat(NAN)));
    /* 40 K: 3.4e-53 Pa [C from Murphy & Koop 2005 eq. 7: ln p = 9.550 - 143.08 + 13.02 - 0.29] */
    ck_assert_rel(vl_water_psat(40.0), 3.4e-53, 0.05);
}
END_TEST

/* The environment of a run's first output row. */
typedef struct {
    int rows;
    vl_env first;
    double y0[VL_NSTATE];
} first_row;

static int keep_first(void *ctx, double t, const double *y, const double *dydt,
                      const vl_env *env, const double *columns, vl_status *st)
{
    (void)t, (void)dydt, (void)columns, (void)st;
    first_row *f = ctx;
    if (f->rows++ == 0) {
        f->first = *env;
        memcpy(f->y0, y, sizeof f->y0);
    }
    return VL_OK;
}

START_TEST(test_hzfit_cold_planet)
{
    /* issue 18's reproducer: Earth with hz_fit, no CO2, at 40 au. Before: row 1 at
     * -19.2 K with the whole ocean in the air (268.6 bar). The surface must sit at or
     * above T_e (> T_CMB), the ocean must stay condensed (ice vapour pressure at ~40 K is
     * near 1e-53 Pa, Murphy & Koop 2005) and the air keep earth.cfg's 0.9881 bar of N2 */
    const char *sets[] = {"climate.model=\"hz_fit\"", "inventory.co2_bar=0", "planet.orbit_au=40"};
    vl_scenario *sc = vl_test_scenario("scenarios/earth.cfg", sets, 3);
    vl_model *m = vl_test_model(sc);
    first_row f = {0};
    vl_run_sink sink = {&f, keep_first, NULL};
    vl_run_stats s;
    vl_status st;
    ck_assert_msg(vl_integrate(m, &sink, &s, &st) == VL_OK, "%s", st.msg);
    double t_e = vl_hzfit_equilibrium_temp(f.first.instellation, sc->climate.bond_albedo);
    ck_assert_msg(f.first.t_surf_k >= t_e && t_e > VL_T_CMB_K, "T_s %g, T_e %g",
                  f.first.t_surf_k, t_e);
    ck_assert_rel(f.first.ocean_kg, f.y0[VL_R_WATER], 1e-12);
    ck_assert(f.first.vapour_kg <= 1e-40 * f.y0[VL_R_WATER]);
    ck_assert_rel(f.first.p_surf_pa / VL_BAR, 0.9881, 1e-9);
    /* every row: the surface above T_e's floor and the vapour within the curve */
    ck_assert(s.env_last.t_surf_k > VL_T_CMB_K);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(test_impacts_never_backwards)
{
    /* the tangent-plane fraction X = h / 2R is >= 0 (Schlichting, Sari & Yalinewich
     * 2015): a surface temperature <= 0 K must not make erosion run backwards (issue 18:
     * water made out of the empty space reservoirs) */
    const char *sets[] = {"processes.impacts.enabled=true"};
    vl_scenario *sc = vl_test_scenario("scenarios/earth.cfg", sets, 1);
    vl_model *m = vl_test_model(sc);
    double y[VL_NSTATE], dydt[VL_NSTATE], cols[VL_MAX_COLUMNS];
    vl_model_initial_state(m, y);
    vl_env env;
    vl_model_env(m, vl_test_work(m), sc->run.start_s, y, VL_REGIME_TEMPERATE, &env);
    double temps[] = {-19.2, 0.0};
    for (int i = 0; i < 2; i++) {
        env.t_surf_k = temps[i];
        vl_test_process_rates(m, "impacts", y, &env, dydt, cols);
        for (int r = VL_R_SPACE_H; r <= VL_R_SPACE_D; r++)
            ck_assert_msg(dydt[r] == 0.0, "T %g: %s changes by %g", temps[i],
                          vl_reservoir_name(r), dydt[r]);
        ck_assert(dydt[VL_R_WATER] == 0.0 && dydt[VL_R_CO2] == 0.0);
    }
    env.t_surf_k = 288.0; /* and a real surface still erodes */
    vl_test_process_rates(m, "impacts", y, &env, dydt, cols);
    ck_assert(dydt[VL_R_SPACE_N] > 0.0);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

/* ---- the guard ------------------------------------------------------------------- */

/* Earth's initial state and a guard started on it. */
static void earth_guard(vl_guard *g, double *y, vl_scenario **scp, vl_model **mp)
{
    *scp = vl_test_scenario("scenarios/earth.cfg", NULL, 0);
    *mp = vl_test_model(*scp);
    vl_model_initial_state(*mp, y);
    vl_guard_init(g, &(*scp)->run, y);
}

static void expect_broken(int rc, const vl_status *st, const char *a, const char *b)
{
    ck_assert_int_eq(rc, VL_ERR_NUMERIC);
    ck_assert_msg(strncmp(st->msg, "physical invariant broken at age ", 33) == 0, "%s", st->msg);
    ck_assert_msg(strstr(st->msg, a) && (!b || strstr(st->msg, b)), "'%s' lacks '%s' / '%s'",
                  st->msg, a, b ? b : "");
}

START_TEST(test_guard_state)
{
    vl_guard g;
    double y0[VL_NSTATE], y[VL_NSTATE];
    vl_scenario *sc;
    vl_model *m;
    earth_guard(&g, y0, &sc, &m);
    vl_status st;
    double t = 1e8 * VL_YR;
    memcpy(y, y0, sizeof y);
    ck_assert_int_eq(vl_guard_state(&g, t, y, &st), VL_OK);
    /* a non-finite component is named */
    y[VL_R_O2] = NAN;
    expect_broken(vl_guard_state(&g, t, y, &st), &st, "non-finite", "atm_o2");
    ck_assert_msg(strstr(st.msg, "age 1e+08 yr"), "%s", st.msg);
    /* a dip: within 1000 tolerances passes, beyond stops; atm_o2 starts empty, so its
     * tolerance is the absolute one (1e3 kg x 1e3 / 1e3 at the defaults) */
    double tol = vl_guard_dip_tolerance(&g, VL_R_O2);
    ck_assert_rel(tol, sc->run.abs_tol_kg * vl_reservoir_floor(VL_R_O2) / 1e3, 1e-15);
    memcpy(y, y0, sizeof y);
    y[VL_R_O2] = -999.0 * tol;
    y[VL_R_OX_ROCK] += 999.0 * tol; /* the same oxygen elsewhere: only the dip is wrong */
    ck_assert_int_eq(vl_guard_state(&g, t, y, &st), VL_OK);
    y[VL_R_O2] = -1001.0 * tol;
    y[VL_R_OX_ROCK] = y0[VL_R_OX_ROCK] + 1001.0 * tol;
    expect_broken(vl_guard_state(&g, t, y, &st), &st, "below zero", "atm_o2");
    /* a residual: hydrogen from nothing, 2e-8 of the inventory stops, 0.5e-8 passes */
    double h0 = 0.0;
    for (int r = 0; r < VL_NRES; r++)
        h0 += y0[r] * vl_reservoir_element_fraction(r, VL_EL_H);
    memcpy(y, y0, sizeof y);
    y[VL_R_SPACE_H] += 0.5e-8 * h0;
    ck_assert_int_eq(vl_guard_state(&g, t, y, &st), VL_OK);
    y[VL_R_SPACE_H] = y0[VL_R_SPACE_H] + 2e-8 * h0;
    expect_broken(vl_guard_state(&g, t, y, &st), &st, "conservation residual", "element H");
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(test_guard_row)
{
    vl_guard g;
    double y[VL_NSTATE], dydt[VL_NSTATE] = {0}, cols[VL_MAX_COLUMNS] = {0};
    vl_scenario *sc;
    vl_model *m;
    earth_guard(&g, y, &sc, &m);
    vl_env env;
    vl_model_rhs(m, vl_test_work(m), sc->run.start_s, y, VL_REGIME_TEMPERATE, dydt, cols, &env);
    vl_status st;
    double t = sc->run.start_s;
    const char *const *names = m->col_name;
    ck_assert_int_eq(vl_guard_row(&g, t, y, dydt, &env, cols, names, m->ncolumns, &st), VL_OK);
    /* surface temperature at or below 0 K, or NaN */
    double temps[] = {0.0, -19.2, NAN};
    for (int i = 0; i < 3; i++) {
        vl_env e = env;
        e.t_surf_k = temps[i];
        expect_broken(vl_guard_row(&g, t, y, dydt, &e, cols, names, m->ncolumns, &st), &st,
                      "surface temperature", NULL);
    }
    /* a negative pressure stops; an airless planet (0 Pa) is a real state */
    vl_env e = env;
    e.p_surf_pa = -1.0;
    expect_broken(vl_guard_row(&g, t, y, dydt, &e, cols, names, m->ncolumns, &st), &st,
                  "pressure", NULL);
    e.p_surf_pa = 0.0;
    ck_assert_int_eq(vl_guard_row(&g, t, y, dydt, &e, cols, names, m->ncolumns, &st), VL_OK);
    /* a non-finite tendency or flux column is named */
    double d2[VL_NSTATE];
    memcpy(d2, dydt, sizeof d2);
    d2[VL_R_CO2] = INFINITY;
    expect_broken(vl_guard_row(&g, t, y, d2, &env, cols, names, m->ncolumns, &st), &st,
                  "tendency", "surface_co2");
    double c2[VL_MAX_COLUMNS];
    memcpy(c2, cols, sizeof c2);
    c2[0] = NAN;
    expect_broken(vl_guard_row(&g, t, y, dydt, &env, c2, names, m->ncolumns, &st), &st,
                  "flux column", names[0]);
    /* a row's dip counts, in tolerances, towards reservoir_overshoot_tolerances */
    ck_assert(g.row_dip_tol == 0.0);
    double tol = vl_guard_dip_tolerance(&g, VL_R_H2);
    y[VL_R_H2] = -3.0 * tol;
    ck_assert_int_eq(vl_guard_row(&g, t, y, dydt, &env, cols, names, m->ncolumns, &st), VL_OK);
    ck_assert_rel(g.row_dip_tol, 3.0, 1e-12);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(test_residual_absent_element)
{
    /* an element the planet lacks: 0/0 before; now judged against 1e8 x the element's
     * resolution, so 1 kg of hydrogen out of nowhere is not a 100 % (or a 1 kg) residual
     * but one far below the 1e-8 limit, while one absolute tolerance's worth reaches it */
    vl_scenario *sc = vl_test_scenario("scenarios/earth.cfg", NULL, 0);
    const vl_run_params *rp = &sc->run;
    double res_h = vl_element_resolution(rp, VL_EL_H);
    /* water's tolerance (1e3 kg x 1e9 / 1e3) times hydrogen's mass fraction in water,
     * 2 x 1.008 / 18.015 = 0.1119 (CIAAW 2021 atomic weights) [C] */
    ck_assert_rel(res_h, 1e9 * 2.0 * 1.008 / 18.015, 1e-3);
    ck_assert(vl_residual(rp, VL_EL_H, 0.0, 0.0) == 0.0);
    ck_assert(vl_residual(rp, VL_EL_H, 0.0, 1.0) < 1e-15);
    ck_assert_rel(vl_residual(rp, VL_EL_H, 0.0, res_h), VL_RESIDUAL_LIMIT, 1e-12);
    /* an element that is present keeps the plain relative residual */
    ck_assert_rel(vl_residual(rp, VL_EL_O, 1e21, 1e21 + 1e12), 1e-9, 1e-6);
    /* written totals count dips as 0 */
    double y[VL_NSTATE] = {0}, w[VL_NELEMENTS];
    y[VL_R_O2] = -5.0;
    y[VL_R_WATER] = 18.015;
    vl_written_totals(y, w);
    ck_assert_rel(w[VL_EL_O], 15.999, 1e-3);
    vl_scenario_free(sc);
}
END_TEST

/* A process that builds N2 out of the (empty) escaped nitrogen: the sign error issue 18
 * found in impacts.c (erosion run backwards), kept here as a test double. */
static const vl_transfer back_transfers[] = {{VL_R_N2, VL_R_SPACE_N}};
static void back_rates(const void *p, const vl_view *v, vl_flux *fx)
{
    (void)p, (void)v;
    vl_flux_transfer(fx, 0, -1e6, -1);
}
static const vl_process backwards = {
    .name = "backwards",
    .summary = "test double: N2 out of empty space",
    .refs = "issue 18",
    VL_PROCESS_TRANSFERS(back_transfers),
    .rates = back_rates,
};

/* The state as written (vl_written_state): no reservoir below zero, and every element's
 * total as integrated (conservation: the written residual is the integrated one; common
 * practice for a positivity fix that keeps mass). */
START_TEST(test_written_state_keeps_elements)
{
    double y[VL_NSTATE] = {0}, w[VL_NSTATE];
    y[VL_R_WATER] = -2.0e6;       /* a dip of water: H and O to give back */
    y[VL_R_CO2] = 5.0e18;
    y[VL_R_H2] = 3.0e9;           /* holds H alone */
    y[VL_R_SPACE_H] = 1.0e12;
    y[VL_R_O2] = -4.0e3;          /* a dip of an oxygen-only store */
    y[VL_R_SPACE_O] = 2.0e15;
    y[VL_R_D_WATER] = -10.0;      /* a deuterium dip */
    y[VL_R_SPACE_D] = 1.0e8;
    vl_written_state(y, w);
    double t_y[VL_NELEMENTS], t_w[VL_NELEMENTS];
    vl_ledger_totals(y, t_y);
    vl_ledger_totals(w, t_w);
    for (int r = 0; r < VL_NRES; r++)
        ck_assert_msg(w[r] >= 0.0, "%s = %g", vl_reservoir_name(r), w[r]);
    for (int el = 0; el < VL_NELEMENTS; el++)
        ck_assert_msg(fabs(t_w[el] - t_y[el]) <= 1e-12 * fabs(t_y[el]), "%s: %.17g vs %.17g",
                      vl_element_name(el), t_w[el], t_y[el]);
    /* carbon held only in CO2 (no dip): untouched */
    ck_assert_double_eq(w[VL_R_CO2], y[VL_R_CO2]);
    /* nothing left to give an element back from: the dip is cleared and the total moves
     * by exactly it, which the written residual then shows */
    double z[VL_NSTATE] = {0};
    z[VL_R_N2] = -7.0;
    z[VL_R_WATER] = 1.0e15;
    vl_written_state(z, w);
    ck_assert_double_eq(w[VL_R_N2], 0.0);
    ck_assert_double_eq(w[VL_R_WATER], 1.0e15);
}
END_TEST

START_TEST(test_guard_stops_run)
{
    /* before the guard such a run finished with space_n at -1.4e17 kg printed as 0 and a
     * residual of 1e-15; now it stops naming the invariant and the reservoir */
    vl_scenario *sc = vl_test_scenario("scenarios/earth.cfg", NULL, 0);
    const vl_process *procs[] = {&backwards};
    const void *params[] = {NULL};
    vl_status st;
    vl_model *m = vl_model_new_with(sc, procs, params, 1, &st);
    ck_assert_msg(m != NULL, "%s", st.msg);
    vl_run_stats s;
    first_row f = {0};
    vl_run_sink sink = {&f, keep_first, NULL};
    expect_broken(vl_integrate(m, &sink, &s, &st), &st, "below zero", "space_n");
    vl_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

/* ---- the program ------------------------------------------------------------------ */

static char tmp[256];

static void setup(void) { vl_test_tmp_make(tmp, sizeof tmp, "volev-inv"); }
static void teardown(void) { vl_test_tmp_remove(tmp); }

START_TEST(test_cli_second_reproducer)
{
    /* issue 18: 10 Earth masses around a 0.08 M_sun star, 1000 oceans, no CO2, impacts on,
     * hz_fit, 10 au: 3e18 kg of overshoot and water from nothing before; now a clean run
     * (or, had the physics still been wrong, exit 4 from the guard) */
    int rc = vl_test_sh(
        tmp,
        "'%s' run '%s/scenarios/demo.cfg' -o out --set 'climate.model=\"hz_fit\"' "
        "--set planet.interior.magma_ocean.molten_start=false --set planet.mass_mearth=10 "
        "--set planet.radius_rearth=1.862 --set star.mass_msun=0.08 --set star.teff_k=2600 "
        "--set star.luminosity_lsun=6.96e-4 --set inventory.surface_water_to=1000 "
        "--set inventory.co2_bar=0 --set processes.impacts.enabled=true --set planet.orbit_au=10",
        vl_test_bin(), vl_test_top());
    ck_assert_int_eq(rc, 0);
    static const char *const el[] = {"H", "C", "N", "O", "D"};
    for (int i = 0; i < 5; i++) {
        char name[32];
        snprintf(name, sizeof name, "residual_%s", el[i]);
        ck_assert_msg(vl_test_summary_value(tmp, "out/summary.csv", name) <= VL_RESIDUAL_LIMIT,
                      "%s", name);
    }
    ck_assert(vl_test_summary_value(tmp, "out/summary.csv", "reservoir_overshoot_tolerances") <=
              VL_DIP_TOLERANCES);
    ck_assert(vl_test_summary_value(tmp, "out/summary.csv", "final_space_o") >= 0.0);
}
END_TEST

START_TEST(test_cli_work_bound)
{
    /* exit 4 (volev(1)), the bound named, and no output folder left */
    int rc = vl_test_sh(tmp, "'%s' run '%s/scenarios/earth.cfg' -o out --set "
                             "run.max_rhs_evaluations=1000",
                        vl_test_bin(), vl_test_top());
    ck_assert_int_eq(rc, 4);
    vl_test_file_contains(tmp, "err.txt",
                          "work bound reached: more than run.max_rhs_evaluations = 1000");
    ck_assert(!vl_test_exists(tmp, "out"));
    rc = vl_test_sh(tmp, "'%s' run '%s/scenarios/earth.cfg' -o out --set run.max_cpu_s=1e-6",
                    vl_test_bin(), vl_test_top());
    ck_assert_int_eq(rc, 4);
    vl_test_file_contains(tmp, "err.txt", "more than run.max_cpu_s = 1e-06 s");
    ck_assert(!vl_test_exists(tmp, "out"));
    /* the default bound is no limit for a bundled scenario: Earth completes, far below */
    rc = vl_test_sh(tmp, "'%s' run '%s/scenarios/earth.cfg' -o out", vl_test_bin(), vl_test_top());
    ck_assert_int_eq(rc, 0);
    ck_assert(vl_test_summary_value(tmp, "out/summary.csv", "rhs_evaluations") < 2e6 / 50.0);
}
END_TEST

START_TEST(test_sweep_bounded_member)
{
    /* a sweep member over the work bound is recorded as failed with its reason and the
     * sweep goes on to the others (docs/ensembles.md) */
    char *base = vl_test_slurp(vl_test_top(), "scenarios/earth.cfg", NULL);
    ck_assert_ptr_nonnull(base);
    const char *key = "end_yr = 4.57e9;";
    char *at = strstr(base, key);
    ck_assert_ptr_nonnull(at);
    at += strlen(key);
    char *text = malloc(strlen(base) + 512);
    /* Earth at 1 au needs ~4000 evaluations, at 10 au ~800 (their summary.csv) */
    sprintf(text,
            "%.*s max_rhs_evaluations = 2500;%s\nsweep:\n{\n  design = \"grid\";\n  axes = "
            "( { key = \"planet.orbit_au\"; spacing = \"linear\"; from = 1.0; to = 10.0; "
            "points = 2; } );\n};\n",
            (int)(at - base), base, at);
    vl_test_write(tmp, "s.cfg", text);
    free(text);
    free(base);
    int rc = vl_test_sh(tmp, "'%s' sweep s.cfg -o sw -j 1", vl_test_bin());
    ck_assert_int_eq(rc, 0);
    vl_test_file_contains(tmp, "sw/members.csv", "0,1,failed,failed,");
    vl_test_file_contains(tmp, "sw/members.csv", "work bound reached: more than run.max_rhs_evaluations = 2500");
    vl_test_file_contains(tmp, "sw/members.csv", "1,10,ok,frozen,");
}
END_TEST

Suite *vl_suite_invariants(void)
{
    Suite *s = suite_create("invariants");
    TCase *tc = tcase_create("hz_fit");
    tcase_add_test(tc, test_greenhouse_knee);
    tcase_add_test(tc, test_equilibrium_temperature);
    tcase_add_test(tc, test_psat_at_and_below_zero);
    tcase_add_test(tc, test_hzfit_cold_planet);
    tcase_add_test(tc, test_impacts_never_backwards);
    suite_add_tcase(s, tc);
    tc = tcase_create("guard");
    tcase_add_test(tc, test_guard_state);
    tcase_add_test(tc, test_guard_row);
    tcase_add_test(tc, test_residual_absent_element);
    tcase_add_test(tc, test_guard_stops_run);
    tcase_add_test(tc, test_written_state_keeps_elements);
    suite_add_tcase(s, tc);
    tc = tcase_create("program");
    tcase_add_checked_fixture(tc, setup, teardown);
    tcase_set_timeout(tc, 300);
    tcase_add_test(tc, test_cli_second_reproducer);
    tcase_add_test(tc, test_cli_work_bound);
    tcase_add_test(tc, test_sweep_bounded_member);
    suite_add_tcase(s, tc);
    return s;
}
