/* test_run.c: whole histories through the library: conservation, the Earth check,
 * the demo's regimes, events located where the thresholds are crossed. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "suites.h"
#include "volev/integrate.h"
#include "volev/model.h"
#include "volev/output.h"
#include "volev/schema.h"
#include "volev/units.h"
#include "volev/water.h"

typedef struct {
    vl_env last_env;
    double last_t;
    long rows;
    char events[64][32];
    double event_t[64];
    int nevents;
    int want_event_env;     /* set by an event: the next row is at the event time */
    vl_env event_env[64];   /* env of the row written at each event */
    double event_y[64][VL_NSTATE]; /* state of that row */
} capture;

static int row(void *ctx, double t, const double *y, const double *dydt, const vl_env *env,
               const double *columns, vl_status *st)
{
    capture *c = ctx;
    (void)dydt, (void)columns, (void)st;
    ck_assert(t >= c->last_t);
    c->last_t = t;
    c->last_env = *env;
    c->rows++;
    if (c->want_event_env) {
        for (int i = 0; i < c->nevents; i++)
            if (c->event_t[i] == t) {
                c->event_env[i] = *env;
                memcpy(c->event_y[i], y, sizeof c->event_y[i]);
            }
        c->want_event_env = 0;
    }
    return VL_OK;
}

static int event(void *ctx, double t, const char *name, const char *detail, vl_status *st)
{
    capture *c = ctx;
    (void)detail, (void)st;
    if (c->nevents < 64) {
        snprintf(c->events[c->nevents], sizeof c->events[0], "%s", name);
        c->event_t[c->nevents++] = t;
        c->want_event_env = 1;
    }
    return VL_OK;
}

/* Index of the first event called name, or -1. */
static int event_index(const capture *c, const char *name)
{
    for (int i = 0; i < c->nevents; i++)
        if (strcmp(c->events[i], name) == 0)
            return i;
    return -1;
}

static void run_file(const char *rel, const char *const *sets, size_t nsets, capture *c,
                     vl_run_stats *stats, vl_scenario **sc_out, vl_model **m_out)
{
    char path[4096];
    vl_status st;
    snprintf(path, sizeof path, "%s/%s", vl_test_top(), rel);
    vl_scenario *sc = vl_scenario_load(path, sets, nsets, &st);
    ck_assert_msg(sc != NULL, "%s:%d: %s", st.file, st.line, st.msg);
    vl_model *m = vl_model_new(sc, &st);
    ck_assert_msg(m != NULL, "%s", st.msg);
    memset(c, 0, sizeof *c);
    vl_run_sink sink = {c, row, event};
    int rc = vl_integrate(m, &sink, stats, &st);
    ck_assert_msg(rc == VL_OK, "%s", st.msg);
    *sc_out = sc;
    *m_out = m;
}

static void check_conservation(const vl_run_stats *s)
{
    for (int el = 0; el < VL_NELEMENTS; el++) {
        double t0 = s->totals0[el];
        if (t0 <= 0.0)
            continue;
        /* the project's conservation criterion (docs/model.md 1): relative residual of
         * every element below 1e-8 */
        ck_assert_msg(fabs(s->totals1[el] - t0) / t0 < 1e-8, "%s residual %g", vl_element_name(el),
                      fabs(s->totals1[el] - t0) / t0);
    }
}

/* The time integral of the output column called name, kg. */
static double total(const vl_model *m, const vl_run_stats *s, const char *name)
{
    return s->channel_kg[vl_test_column(m, name)];
}

START_TEST(earth_history)
{
    capture c;
    vl_run_stats s;
    vl_scenario *sc;
    vl_model *m;
    run_file("scenarios/earth.cfg", NULL, 0, &c, &s, &sc, &m);
    check_conservation(&s);
    /* A lifeless Earth keeps its ocean. Its hydrogen escape is fed by volcanic H2, of
     * order 1e10 atoms cm^-2 s^-1 on an anoxic early Earth (Kasting 1993, Science
     * 259:920; Tian et al. 2005, Science 308:1014; from memory), not the ~3 kg/s of the
     * real, oxygenated Earth (Catling & Zahnle 2009; tests/test_photochem_h2.c):
     * 1.5e10 cm^-2 s^-1 over 4.5 Gyr removes 0.11 TO [C: x 5.10e18 cm^2 x 1.42e17 s x
     * 1.008/6.022e23 kg/mol x 18.015/2.016 / 1.39e21 kg], so more than 0.85 TO stays */
    ck_assert_msg(s.y_final[VL_R_WATER] > 0.85 * VL_TO_KG, "%g TO",
                  s.y_final[VL_R_WATER] / VL_TO_KG);
    /* 288 K today: the climate's calibration target (docs/model.md 3.4); +-2 K here */
    ck_assert_msg(fabs(c.last_env.t_surf_k - 288.0) < 2.0, "T = %g", c.last_env.t_surf_k);
    /* pre-industrial CO2 280 ppmv (common practice); "a few hundred ppm", within a factor
     * of two */
    double ppm = c.last_env.x[VL_GAS_CO2] * 1e6;
    ck_assert_msg(ppm > 140.0 && ppm < 560.0, "CO2 %g ppmv", ppm);
    ck_assert_int_eq(c.last_env.regime, VL_REGIME_TEMPERATE);
    ck_assert(event_index(&c, "runaway_onset") < 0);
    /* no mass below zero beyond a few absolute tolerances of the integrator (the
     * depletion ramp pulls overshoots back; common practice) */
    ck_assert_msg(s.min_mass_kg > -10.0 * sc->run.abs_tol_kg, "min mass %g kg", s.min_mass_kg);
    ck_assert(c.rows > 250);
    /* the channel budget: the hydrogen of the water photolysed (H/H2O = 2.016/18.015 by
     * mass [C]), the H2 that escapes and the non-thermal H integrate to the hydrogen in
     * space; trapezoid over steps: 1e-2 */
    double h_kg = total(m, &s, "photolysis_h2o_lost_kg_s") * 2.016 / 18.015 +
                  total(m, &s, "h_escape_from_h2_kg_s") + total(m, &s, "pickup_h_kg_s") +
                  total(m, &s, "polar_h_kg_s");
    ck_assert_rel(h_kg, s.y_final[VL_R_SPACE_H], 1e-2);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

/* The demo star contracts: the runaway ends when the instellation falls below the
 * runaway threshold of the column climate, and the event sits where it is crossed. */
START_TEST(demo_runaway_ends_at_threshold)
{
    capture c;
    vl_run_stats s;
    vl_scenario *sc;
    vl_model *m;
    /* started solid: the demo's molten start would replace the runaway by a magma ocean */
    static const char *const solid[] = {"planet.interior.magma_ocean.molten_start=false",
    /* and the first-order O2 sink on: with only the supply-limited sinks the demo keeps
     * thousands of bar of abiotic O2 and its runaway never ends (docs/model.md section 7);
     * this test is about where the end of a runaway is located */
                                        "processes.oxygen_sink.enabled=true"};
    run_file("scenarios/demo.cfg", solid, 2, &c, &s, &sc, &m);
    check_conservation(&s);
    int k = event_index(&c, "runaway_end");
    ck_assert_msg(k >= 0, "no runaway_end event");
    /* the runaway side of the event: the ocean that condenses after it dissolves CO2
     * (docs/cycles.md), which moves the threshold of the row written there */
    vl_env runaway_side;
    vl_model_env(m, vl_test_work(m), c.event_t[k], c.event_y[k], VL_REGIME_RUNAWAY, &runaway_side);
    const vl_env *e = &runaway_side;
    vl_curve *cv = malloc(sizeof *cv);
    ck_assert_ptr_nonnull(cv);
    /* the hot branch: from the steam point, where water's saturation pressure reaches
     * that of the dry gases, up (docs/model.md section 3) */
    double p_dry = 0.0;
    for (int g = 0; g < VL_NGASES; g++)
        p_dry += g == VL_GAS_H2O ? 0.0 : e->mass_kg[g] * m->planet.pa_per_kg;
    double t0 = fmax(350.0, vl_water_tsat(p_dry)), t[VL_CURVE_MAX];
    for (int i = 0; i < VL_CURVE_MAX; i++)
        t[i] = t0 + (3000.0 - t0) * i / (VL_CURVE_MAX - 1);
    size_t n = vl_climate_curve(m->climate, vl_work_climate(vl_test_work(m)), e, 1, t, VL_CURVE_MAX, cv);
    ck_assert(n > 0);
    /* the runaway ends where its hot equilibrium vanishes (a saddle-node, docs/model.md
     * section 3): at the located event the absorbed flux just reaches the outgoing
     * radiation at its closest approach over the hot range, within 1 W/m^2 (the 5 K
     * sampling here; common practice) */
    double closest = -HUGE_VAL, at = 0.0;
    for (size_t i = 0; i < n; i++)
        if (cv->absorbed[i] - cv->olr[i] > closest) {
            closest = cv->absorbed[i] - cv->olr[i];
            at = t[i];
        }
    ck_assert_msg(fabs(closest) < 1.0, "closest approach %g W/m^2 at %g K", closest, at);
    free(cv);
    ck_assert(s.time_in_regime_s[VL_REGIME_RUNAWAY] > 0.0);
    /* the wet demo keeps an ocean, the dry one loses all (docs/model.md section 7) */
    ck_assert(s.y_final[VL_R_WATER] > 1.0 * VL_TO_KG);
    vl_test_model_free(m);
    vl_scenario_free(sc);
    run_file("scenarios/demo-dry.cfg", NULL, 0, &c, &s, &sc, &m);
    check_conservation(&s);
    ck_assert(event_index(&c, "ocean_lost") >= 0);
    ck_assert_int_eq(c.last_env.regime, VL_REGIME_DRY);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

/* Issue 3: with the column climate the Earth still keeps its ocean, and its hydrogen
 * escape today is within a factor of three of ~3 kg/s (Catling & Zahnle 2009). */
START_TEST(earth_with_column_climate)
{
    capture c;
    vl_run_stats s;
    vl_scenario *sc;
    vl_model *m;
    const char *sets[] = {"climate.model=column"};
    run_file("scenarios/earth.cfg", sets, 1, &c, &s, &sc, &m);
    check_conservation(&s);
    ck_assert(s.y_final[VL_R_WATER] > 0.85 * VL_TO_KG); /* as in earth_history */
    /* The lifeless Earth's hydrogen escape today balances the reductant its volcanoes
     * supply (H2, and CO as H2): on an anoxic planet escape is the main sink of the
     * atmosphere's reducing power (Catling & Kasting 2017, Atmospheric Evolution on
     * Inhabited and Lifeless Worlds; common practice), here within 20 %. The real
     * Earth's ~3 kg/s needs its O2: tests/test_photochem_h2.c. */
    double dydt[VL_NSTATE], cols[VL_MAX_COLUMNS];
    vl_model_rhs(m, vl_test_work(m), sc->run.end_s, s.y_final, c.last_env.regime, dydt, cols, NULL);
    double h = dydt[VL_R_SPACE_H];
    double supply_h = cols[vl_test_column(m, "volcanic_h2_kg_s")] * 2.0 * VL_AW_H / 2.016;
    ck_assert_msg(fabs(h / supply_h - 1.0) < 0.2, "H escape today %g kg/s, volcanic H %g kg/s",
                  h, supply_h);
    ck_assert_int_eq(c.last_env.regime, VL_REGIME_TEMPERATE);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

/* A 10 Earth-mass Earth keeps the H2 of its volcanoes (its Jeans escape is slow) and
 * warms until its equilibrium sits on the steam point, the boundary of the warm and hot
 * branches (docs/model.md section 3.3). The branches' overlap there keeps the regime from
 * flipping between runaway and temperate every few hundred thousand years: without it
 * this run logged 335 events by 3.62 Gyr and took minutes; with it 33 to 4.57 Gyr. At a
 * regime boundary a change must not be undone by the next step (common practice:
 * hysteresis); here fewer than 60 events. */
START_TEST(no_chattering_on_the_steam_point)
{
    capture c;
    vl_run_stats s;
    vl_scenario *sc;
    vl_model *m;
    static const char *const sets[] = {"planet.mass_mearth=10", "planet.radius_rearth=1.8",
                                       "run.end_yr=3.9e9"};
    run_file("scenarios/earth.cfg", sets, 3, &c, &s, &sc, &m);
    check_conservation(&s);
    ck_assert_msg(s.events < 60, "%ld events", (long)s.events);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

/* Issue 6: Venus, from the shared starting inventory, loses its water in a runaway and
 * keeps a CO2 atmosphere of tens of bar, with deuterium-enriched residual water. */
START_TEST(venus_divergence)
{
    capture c;
    vl_run_stats s;
    vl_scenario *sc;
    vl_model *m;
    run_file("scenarios/venus.cfg", NULL, 0, &c, &s, &sc, &m);
    check_conservation(&s);
    ck_assert_int_eq(c.last_env.regime, VL_REGIME_DRY);
    /* Venus: ~92 bar, 96.5 % CO2 (NASA NSSDC): "tens of bar or more", CO2-dominated */
    ck_assert_msg(c.last_env.p_pa[VL_GAS_CO2] > 10.0 * VL_BAR, "pCO2 %g Pa",
                  c.last_env.p_pa[VL_GAS_CO2]);
    /* Measured: 96.5 % CO2 and almost no O2 (NSSDC). The model keeps tens of bar of O2,
     * the oxygen of the ocean it lost, since the supply-limited sinks (crust, lava,
     * reduced volcanic gases, escape) take only a few percent of an Earth-like ocean's
     * oxygen: the result of Warren & Kite 2023 (PNAS 120:e2209751120, from memory), who
     * allow an early Venus ocean of at most a few hundred metres on these grounds. A miss
     * of the shared 1-TO inventory, discussed in docs/validation.md; here the model's side
     * of it: more than 1 bar of O2 left. */
    ck_assert_msg(c.last_env.p_pa[VL_GAS_O2] > 1.0 * VL_BAR, "pO2 %g Pa",
                  c.last_env.p_pa[VL_GAS_O2]);
    /* D/H of the residual (or, once exhausted, the last) water: measured ~100x
     * (Donahue et al. 1982), > 10x required */
    vl_summary d;
    vl_summary_derive(m, &s, &d);
    double dh = d.dh_enrichment;
    ck_assert_msg(dh > 10.0, "D/H enrichment %g", dh);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(mars_divergence)
{
    capture c;
    vl_run_stats s;
    vl_scenario *sc;
    vl_model *m;
    run_file("scenarios/mars.cfg", NULL, 0, &c, &s, &sc, &m);
    check_conservation(&s);
    /* Mars today: ~6 mbar (NASA NSSDC). Not reproduced: with the non-grey column a CO2
     * atmosphere cannot warm the young Mars above freezing (maximum CO2 greenhouse near
     * S_eff 0.35, Kopparapu et al. 2013, ApJ 765:131; no warm early Mars from CO2 alone,
     * Forget et al. 2013, Icarus 222:81), so no early weathering draws the starting 9 bar
     * down, and collapse onto polar caps is not modelled (docs/validation.md). Asserted:
     * escape and the late carbonates remove most of the start (9.08 bar, scenarios/mars.cfg). */
    ck_assert_msg(c.last_env.p_surf_pa < 0.5 * 9.08 * VL_BAR, "p_surf %g Pa", c.last_env.p_surf_pa);
    /* no stable surface liquid water: the climate finds no liquid share, frozen or dry */
    ck_assert_msg(c.last_env.liquid <= 0.0, "liquid share %g", c.last_env.liquid);
    ck_assert(c.last_env.regime == VL_REGIME_FROZEN || c.last_env.regime == VL_REGIME_DRY);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

Suite *vl_suite_run(void)
{
    Suite *s = suite_create("run");
    TCase *tc = tcase_create("histories");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, earth_history);
    tcase_add_test(tc, demo_runaway_ends_at_threshold);
    tcase_add_test(tc, earth_with_column_climate);
    tcase_add_test(tc, venus_divergence);
    tcase_add_test(tc, no_chattering_on_the_steam_point);
    tcase_add_test(tc, mars_divergence);
    suite_add_tcase(s, tc);
    return s;
}
