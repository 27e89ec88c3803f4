/* test_impacts.c: impact erosion and volatile delivery (src/physics/processes/impacts.c) against
 * the tangent-plane law of Schlichting, Sari & Yalinewich 2015 (Icarus 247:81), the
 * analytic rate history N(t) = N0 exp(-(t - t0)/tau) + N_bg, and the element ledger. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "suites.h"
#include "volev/integrate.h"
#include "volev/model.h"
#include "volev/units.h"

/* High-entropy settings (file units) used throughout. */
#define EARLY_PER_MYR 3.85
#define DECAY_MYR 117.3
#define REF_AGE_YR 2.3e8
#define BG_PER_MYR 0.0217
#define WATER_KG 2.385e15
#define CO2_KG 6.17e14
#define N2_KG 1.93e13
#define START_YR 3.1e7
#define END_YR 4.57e9

/* N(t) of the settings above, impacts per second. */
static double rate_per_s(double t_s, double early, double bg)
{
    double tau = DECAY_MYR * 1e6 * VL_YR, t0 = REF_AGE_YR * VL_YR;
    return (early * exp(-(t_s - t0) / tau) + bg) / (1e6 * VL_YR);
}

/* Apply "key=value" with a printf format to sc. */
static void set(vl_scenario *sc, const char *fmt, double v)
{
    char buf[256];
    vl_status st;
    snprintf(buf, sizeof buf, fmt, v);
    ck_assert_msg(vl_scenario_override(sc, buf, &st) == VL_OK, "%s: %s", buf, st.msg);
}

/* A scenario with impacts on at the settings above; alone (others off) if alone. */
static vl_scenario *scenario(int alone, int delivery, double bg)
{
    vl_scenario *sc = vl_scenario_new();
    ck_assert_ptr_nonnull(sc);
    vl_status st;
    ck_assert(vl_scenario_override(sc, "processes.impacts.enabled=true", &st) == VL_OK);
    set(sc, "processes.impacts.early_rate_per_myr=%.17g", EARLY_PER_MYR);
    set(sc, "processes.impacts.decay_myr=%.17g", DECAY_MYR);
    set(sc, "processes.impacts.reference_age_yr=%.17g", REF_AGE_YR);
    set(sc, "processes.impacts.background_rate_per_myr=%.17g", bg);
    set(sc, "run.start_yr=%.17g", START_YR);
    set(sc, "run.end_yr=%.17g", END_YR);
    if (delivery) {
        ck_assert(vl_scenario_override(sc, "processes.impacts.delivery=true", &st) == VL_OK);
        set(sc, "processes.impacts.water_per_impact_kg=%.17g", WATER_KG);
        set(sc, "processes.impacts.co2_per_impact_kg=%.17g", CO2_KG);
        set(sc, "processes.impacts.n2_per_impact_kg=%.17g", N2_KG);
    }
    int k = vl_process_find("impacts");
    ck_assert_int_ge(k, 0);
    if (alone)
        for (size_t i = 0; i < vl_nprocesses; i++)
            sc->proc[i].enabled = (int)i == k;
    return sc;
}

/* Every gas and water well above its depletion band (kg, high-entropy). */
static void gassy_state(const vl_model *m, double y[VL_NSTATE])
{
    memset(y, 0, VL_NSTATE * sizeof y[0]);
    y[VL_R_WATER] = 1.3729 * VL_TO_KG;
    y[VL_R_CO2] = 0.0417 * VL_BAR / m->planet.pa_per_kg;
    /* present atmospheric N2 [C]: 5.148e18 kg of air (total atmospheric mass, from
     * memory) x 0.7808 (N2 by volume, NSSDC) x 28.013/28.965 = 3.887e18 kg */
    y[VL_R_N2] = 3.887e18;
    y[VL_R_O2] = 1.19e18;
    y[VL_R_H2] = 2.17e16;
    y[VL_R_IMPACT_WATER] = 4.41e18;
    y[VL_R_IMPACT_CO2] = 1.07e18;
    y[VL_R_IMPACT_N2] = 3.3e16;
}

/* Tangent-plane fraction h/(2R) of an env (Schlichting et al. 2015), computed here. */
static double fraction(const vl_model *m, const vl_env *e)
{
    return VL_K_BOLTZMANN * e->t_surf_k / (e->m_mean_kg * e->g) / (2.0 * m->sc->planet.radius_m);
}

START_TEST(tangent_plane_earth)
{
    vl_scenario *sc = scenario(1, 0, BG_PER_MYR);
    set(sc, "planet.radius_rearth=%.17g", 1.0);
    vl_model *m = vl_test_model(sc);
    double y[VL_NSTATE], dydt[VL_NSTATE] = {0}, *cols = calloc(m->ncolumns, sizeof *cols);
    gassy_state(m, y);
    double t = 1.7e9 * VL_YR;
    vl_env env;
    vl_model_env(m, vl_test_work(m), t, y, VL_REGIME_TEMPERATE, &env);
    /* an atmosphere whose scale height kT/(mg) is 8 km exactly */
    env.m_mean_kg = 28.97 * VL_AMU;
    env.t_surf_k = 8.0e3 * env.m_mean_kg * env.g / VL_K_BOLTZMANN;
    vl_test_process_rates(m, "impacts", y, &env, dydt, cols + vl_test_column(m, "impact_co2_kg_s"));
    double n = rate_per_s(t, EARLY_PER_MYR, BG_PER_MYR);
    double x = cols[vl_test_column(m, "impact_n2_kg_s")] / (n * y[VL_R_N2]);
    /* Schlichting, Sari & Yalinewich 2015: tangent-plane loss h/(2R); Earth, h = 8 km:
     * 8/(2 x 6371) = 6.3e-4 per impact [C] */
    ck_assert_rel(x, 6.3e-4, 5e-3);
    ck_assert_rel(x, 8.0 / (2.0 * 6371.0), 1e-12);
    /* a scale height beyond 2R: one impact cannot remove more than the whole atmosphere */
    env.t_surf_k *= 1e4;
    vl_test_process_rates(m, "impacts", y, &env, dydt, cols + vl_test_column(m, "impact_co2_kg_s"));
    ck_assert_rel(cols[vl_test_column(m, "impact_n2_kg_s")], n * y[VL_R_N2], 1e-12);
    free(cols);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(erosion_of_each_gas)
{
    vl_scenario *sc = scenario(1, 0, BG_PER_MYR);
    vl_model *m = vl_test_model(sc);
    double y[VL_NSTATE], dydt[VL_NSTATE], *cols = calloc(m->ncolumns, sizeof *cols);
    gassy_state(m, y);
    double t = 3.9e8 * VL_YR;
    vl_env env;
    vl_model_rhs(m, vl_test_work(m), t, y, VL_REGIME_RUNAWAY, dydt, cols, &env);
    ck_assert(env.vapour_kg > 0.0);
    /* erosion of gas i = N(t) X M_i, X = h/(2R) (Schlichting et al. 2015) */
    double loss = rate_per_s(t, EARLY_PER_MYR, BG_PER_MYR) * fraction(m, &env);
    double co2 = cols[vl_test_column(m, "impact_co2_kg_s")], n2 = cols[vl_test_column(m, "impact_n2_kg_s")];
    double o2 = cols[vl_test_column(m, "impact_o2_kg_s")], h2 = cols[vl_test_column(m, "impact_h2_kg_s")];
    double h2o = cols[vl_test_column(m, "impact_h2o_kg_s")];
    ck_assert_rel(co2, loss * y[VL_R_CO2], 1e-12);
    ck_assert_rel(n2, loss * y[VL_R_N2], 1e-12);
    ck_assert_rel(o2, loss * y[VL_R_O2], 1e-12);
    ck_assert_rel(h2, loss * y[VL_R_H2], 1e-12);
    ck_assert_rel(h2o, loss * env.vapour_kg, 1e-12);
    /* delivery off: nothing delivered, the pools untouched */
    ck_assert_double_eq(cols[vl_test_column(m, "delivered_h2o_kg_s")], 0.0);
    ck_assert_double_eq(dydt[VL_R_IMPACT_WATER], 0.0);
    /* into space by stoichiometry: CO2 -> C + 2 O, H2O -> 2 H + O (IUPAC atomic weights) */
    ck_assert_rel(dydt[VL_R_SPACE_C], co2 * 12.011 / 44.009, 1e-12);
    ck_assert_rel(dydt[VL_R_SPACE_N], n2, 1e-12);
    ck_assert_rel(dydt[VL_R_SPACE_H], h2 + h2o * 2.016 / 18.015, 1e-12);
    ck_assert_rel(dydt[VL_R_SPACE_O], o2 + co2 * 31.998 / 44.009 + h2o * 15.999 / 18.015, 1e-12);
    ck_assert_rel(-dydt[VL_R_WATER], h2o, 1e-12);
    free(cols);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

/* N(t) recovered from the N2 column: column / (X M_N2). */
static double rate_seen(const vl_model *m, double t, const double *y)
{
    double dydt[VL_NSTATE], *cols = calloc(m->ncolumns, sizeof *cols);
    vl_env env;
    vl_model_rhs(m, vl_test_work(m), t, y, VL_REGIME_TEMPERATE, dydt, cols, &env);
    double n = cols[vl_test_column(m, "impact_n2_kg_s")] / (fraction(m, &env) * y[VL_R_N2]);
    free(cols);
    return n;
}

START_TEST(rate_decays_with_efold)
{
    double tau = DECAY_MYR * 1e6 * VL_YR, t0 = REF_AGE_YR * VL_YR, myr = 1e6 * VL_YR;
    vl_scenario *sc = scenario(1, 0, 0.0);
    vl_model *m = vl_test_model(sc);
    double y[VL_NSTATE];
    gassy_state(m, y);
    double t1 = 1.37e8 * VL_YR;
    /* no background: N(t1 + tau) / N(t1) = 1/e (exponential decline, e-folding time tau) */
    ck_assert_rel(rate_seen(m, t1 + tau, y) / rate_seen(m, t1, y), exp(-1.0), 1e-12);
    ck_assert_rel(rate_seen(m, t1 + 3.0 * tau, y) / rate_seen(m, t1, y), exp(-3.0), 1e-12);
    /* at the reference age the rate is early_rate_per_myr */
    ck_assert_rel(rate_seen(m, t0, y) * myr, EARLY_PER_MYR, 1e-12);
    vl_test_model_free(m);
    vl_scenario_free(sc);
    sc = scenario(1, 0, BG_PER_MYR);
    m = vl_test_model(sc);
    /* with the background: N(t0) = N0 + N_bg, and N - N_bg still e-folds in tau */
    ck_assert_rel(rate_seen(m, t0, y) * myr, EARLY_PER_MYR + BG_PER_MYR, 1e-12);
    double a = rate_seen(m, t1, y) * myr - BG_PER_MYR;
    double b = rate_seen(m, t1 + tau, y) * myr - BG_PER_MYR;
    ck_assert_rel(b / a, exp(-1.0), 1e-9);
    /* long after the early flux: the background alone (e^-37 of N0 left, [C]) */
    ck_assert_rel(rate_seen(m, t0 + 37.0 * tau, y) * myr, BG_PER_MYR, 1e-12);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

/* Composite Simpson quadrature of N(t) over [a, b] with n (even) intervals. */
static double simpson_impacts(double a, double b, int n)
{
    double h = (b - a) / n;
    double s = rate_per_s(a, EARLY_PER_MYR, BG_PER_MYR) + rate_per_s(b, EARLY_PER_MYR, BG_PER_MYR);
    for (int i = 1; i < n; i++)
        s += (i % 2 ? 4.0 : 2.0) * rate_per_s(a + i * h, EARLY_PER_MYR, BG_PER_MYR);
    return s * h / 3.0;
}

START_TEST(pools_hold_the_integral)
{
    vl_scenario *sc = scenario(0, 1, BG_PER_MYR);
    vl_model *m = vl_test_model(sc);
    double y[VL_NSTATE];
    vl_model_initial_state(m, y);
    /* the pools hold what the population delivers over the run: N(t) integrated from
     * run start to end (Simpson, 2e5 intervals: error ~ (h/tau)^4 ~ 1e-11 [C]) times
     * the mass per impact */
    double n = simpson_impacts(START_YR * VL_YR, END_YR * VL_YR, 200000);
    ck_assert_rel(y[VL_R_IMPACT_WATER], n * WATER_KG, 1e-9);
    ck_assert_rel(y[VL_R_IMPACT_CO2], n * CO2_KG, 1e-9);
    ck_assert_rel(y[VL_R_IMPACT_N2], n * N2_KG, 1e-9);
    /* the quadrature against the integral by hand, in Myr:
     * N0 tau e^{(t0-a)/tau} (1 - e^{-(b-a)/tau}) + N_bg (b-a) */
    double tau = DECAY_MYR, a = START_YR / 1e6, b = END_YR / 1e6, t0 = REF_AGE_YR / 1e6;
    double by_hand = EARLY_PER_MYR * tau * exp((t0 - a) / tau) * (1.0 - exp(-(b - a) / tau)) +
                     BG_PER_MYR * (b - a);
    ck_assert_rel(n, by_hand, 1e-9);
    vl_test_model_free(m);
    vl_scenario_free(sc);
    /* delivery off: the pools stay empty */
    sc = scenario(0, 0, BG_PER_MYR);
    m = vl_test_model(sc);
    vl_model_initial_state(m, y);
    ck_assert_double_eq(y[VL_R_IMPACT_WATER], 0.0);
    ck_assert_double_eq(y[VL_R_IMPACT_CO2], 0.0);
    ck_assert_double_eq(y[VL_R_IMPACT_N2], 0.0);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(delivery_moves_from_pools)
{
    vl_scenario *sc = scenario(1, 1, BG_PER_MYR);
    vl_model *m = vl_test_model(sc);
    double y[VL_NSTATE], dydt[VL_NSTATE], *cols = calloc(m->ncolumns, sizeof *cols);
    gassy_state(m, y);
    double t = 2.9e8 * VL_YR, n = rate_per_s(t, EARLY_PER_MYR, BG_PER_MYR);
    vl_model_rhs(m, vl_test_work(m), t, y, VL_REGIME_TEMPERATE, dydt, cols, NULL);
    /* each impact delivers the set masses: delivery rate = N(t) x mass per impact */
    double w = cols[vl_test_column(m, "delivered_h2o_kg_s")], c = cols[vl_test_column(m, "delivered_co2_kg_s")];
    double nn = cols[vl_test_column(m, "delivered_n2_kg_s")];
    ck_assert_rel(w, n * WATER_KG, 1e-12);
    ck_assert_rel(c, n * CO2_KG, 1e-12);
    ck_assert_rel(nn, n * N2_KG, 1e-12);
    /* drawn from the pools, into the surface and atmospheric reservoirs (less erosion) */
    ck_assert_rel(-dydt[VL_R_IMPACT_WATER], w, 1e-12);
    ck_assert_rel(-dydt[VL_R_IMPACT_CO2], c, 1e-12);
    ck_assert_rel(-dydt[VL_R_IMPACT_N2], nn, 1e-12);
    ck_assert_rel(dydt[VL_R_WATER], w - cols[vl_test_column(m, "impact_h2o_kg_s")], 1e-12);
    ck_assert_rel(dydt[VL_R_CO2], c - cols[vl_test_column(m, "impact_co2_kg_s")], 1e-12);
    ck_assert_rel(dydt[VL_R_N2], nn - cols[vl_test_column(m, "impact_n2_kg_s")], 1e-12);
    /* an empty pool delivers nothing (depletion ramp, flux.h) */
    y[VL_R_IMPACT_WATER] = 0.0;
    vl_model_rhs(m, vl_test_work(m), t, y, VL_REGIME_TEMPERATE, dydt, cols, NULL);
    ck_assert_double_eq(cols[vl_test_column(m, "delivered_h2o_kg_s")], 0.0);
    free(cols);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

/* Relative element imbalance of dydt: |sum| / sum(|terms|) (as in test_ledger.c). */
static double imbalance(const double *dydt, int el)
{
    double net = 0.0, gross = 0.0;
    for (int r = 0; r < VL_NRES; r++) {
        double v = dydt[r] * vl_reservoir_element_fraction(r, el);
        net += v;
        gross += fabs(v);
    }
    return gross > 0.0 ? fabs(net) / gross : 0.0;
}

START_TEST(conserves_with_delivery)
{
    for (int alone = 1; alone >= 0; alone--) {
        vl_scenario *sc = scenario(alone, 1, BG_PER_MYR);
        vl_model *m = vl_test_model(sc);
        double y[VL_NSTATE], dydt[VL_NSTATE];
        gassy_state(m, y);
        for (int regime = 0; regime < VL_NREGIMES; regime++) {
            vl_model_rhs(m, vl_test_work(m), 1.9e8 * VL_YR, y, regime, dydt, NULL, NULL);
            ck_assert(dydt[VL_R_IMPACT_WATER] < 0.0 && dydt[VL_R_SPACE_C] > 0.0);
            for (int el = 0; el < VL_NELEMENTS; el++)
                /* conservation by construction: round-off only (common practice: 1e-12) */
                ck_assert_msg(imbalance(dydt, el) < 1e-12, "%s, regime %d: %s imbalance %g",
                              alone ? "impacts alone" : "all processes", regime,
                              vl_element_name(el), imbalance(dydt, el));
        }
        vl_test_model_free(m);
        vl_scenario_free(sc);
    }
}
END_TEST

START_TEST(earth_run_with_delivery)
{
    vl_status st;
    const char *sets[] = {"processes.impacts.enabled=true", "processes.impacts.delivery=true"};
    vl_scenario *sc = vl_test_scenario("scenarios/earth.cfg", sets, 2);
    vl_model *m = vl_test_model(sc);
    double y0[VL_NSTATE];
    vl_model_initial_state(m, y0);
    ck_assert(y0[VL_R_IMPACT_WATER] > 0.0 && y0[VL_R_IMPACT_CO2] > 0.0 && y0[VL_R_IMPACT_N2] > 0.0);
    vl_run_sink sink = {NULL, NULL, NULL};
    vl_run_stats s;
    ck_assert_msg(vl_integrate(m, &sink, &s, &st) == VL_OK, "%s", st.msg);
    for (int el = 0; el < VL_NELEMENTS; el++)
        /* conservation criterion (docs/model.md 1): every element's relative residual < 1e-8 */
        ck_assert_msg(fabs(s.totals1[el] - s.totals0[el]) / s.totals0[el] < 1e-8, "%s residual %g",
                      vl_element_name(el), fabs(s.totals1[el] - s.totals0[el]) / s.totals0[el]);
    /* the pools end (near) empty: the ramp leaves at most one depletion band (flux.h), the
     * integrator an error of order run.rel_tolerance = 1e-7 of the content; 1e-5 */
    static const int pool[] = {VL_R_IMPACT_WATER, VL_R_IMPACT_CO2, VL_R_IMPACT_N2};
    static const char *const col[] = {"delivered_h2o_kg_s", "delivered_co2_kg_s",
                                      "delivered_n2_kg_s"};
    for (int i = 0; i < 3; i++) {
        ck_assert_msg(fabs(s.y_final[pool[i]]) < 1e-5 * y0[pool[i]], "%s ends at %g of %g kg",
                      vl_reservoir_name(pool[i]), s.y_final[pool[i]], y0[pool[i]]);
        /* what left the pool arrived: the delivered column's time integral (trapezoid
         * over accepted steps, 1e-2) equals the pool's initial content */
        ck_assert_rel(s.channel_kg[vl_test_column(m, col[i])], y0[pool[i]], 1e-2);
    }
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

/* Load earth.cfg with overrides; expect failure with needle in the message. */
static void refused(const char *const *sets, size_t n, const char *needle)
{
    char path[4096];
    vl_status st;
    snprintf(path, sizeof path, "%s/scenarios/earth.cfg", vl_test_top());
    vl_scenario *sc = vl_scenario_load(path, sets, n, &st);
    ck_assert_msg(sc == NULL, "loaded, expected an error about '%s'", needle);
    ck_assert_msg(strstr(st.msg, needle) != NULL, "message '%s' lacks '%s'", st.msg, needle);
}

START_TEST(check_refuses_bad_settings)
{
    const char *nothing[] = {"processes.impacts.enabled=true", "processes.impacts.delivery=true",
                             "processes.impacts.water_per_impact_kg=0",
                             "processes.impacts.co2_per_impact_kg=0",
                             "processes.impacts.n2_per_impact_kg=0"};
    refused(nothing, 5, "every *_per_impact_kg is 0");
    const char *tiny[] = {"processes.impacts.enabled=true", "processes.impacts.delivery=true",
                          "processes.impacts.n2_per_impact_kg=1e-3"};
    refused(tiny, 3, "depletion band");
    const char *early[] = {"processes.impacts.enabled=true", "processes.impacts.decay_myr=1",
                           "processes.impacts.reference_age_yr=1e9"};
    refused(early, 3, "e-folding times");
    const char *unused[] = {"processes.impacts.enabled=true",
                            "processes.impacts.water_per_impact_kg=5e15"};
    refused(unused, 2, "delivery");
}
END_TEST

Suite *vl_suite_impacts(void)
{
    Suite *s = suite_create("impacts");
    TCase *tc = tcase_create("core");
    tcase_add_test(tc, tangent_plane_earth);
    tcase_add_test(tc, erosion_of_each_gas);
    tcase_add_test(tc, rate_decays_with_efold);
    tcase_add_test(tc, pools_hold_the_integral);
    tcase_add_test(tc, delivery_moves_from_pools);
    tcase_add_test(tc, conserves_with_delivery);
    tcase_add_test(tc, earth_run_with_delivery);
    tcase_add_test(tc, check_refuses_bad_settings);
    suite_add_tcase(s, tc);
    return s;
}
