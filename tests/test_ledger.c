/* test_ledger.c: conservation is structural. Every registered process, alone and all
 * together, conserves H, C, N and O in its tendencies; reactions balance; outflows
 * stop at an empty reservoir. */
#include <stdlib.h>
#include <string.h>

#include "suites.h"
#include "volev/flux.h"
#include "volev/integrate.h"
#include "volev/model.h"
#include "volev/units.h"

/* A state with every reservoir filled with high-entropy amounts (kg). */
static void busy_state(const vl_model *m, double y[VL_NSTATE])
{
    for (int r = 0; r < VL_NRES; r++)
        y[r] = 1.0e18 * (1.0 + 0.2385 * r);
    y[VL_R_WATER] = 1.3729 * VL_TO_KG;
    y[VL_R_H2] = 2.17e16;
    y[VL_R_CO2] = 0.0417 * VL_BAR / m->planet.pa_per_kg;
    y[VL_S_MANTLE_TP] = 2000.0; /* a partly molten mantle where the scenario starts molten */
}

/* Relative element imbalance of dydt: |sum| / sum(|terms|). */
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

/* Evaluate the RHS with only process `only` enabled (-1: all) in regime. */
static void rhs_with(vl_scenario *sc, int only, int regime, double dydt[VL_NSTATE], double *gross)
{
    vl_status st;
    for (size_t i = 0; i < vl_nprocesses; i++)
        sc->proc[i].enabled = only < 0 || (size_t)only == i;
    vl_model *m = vl_model_new(sc, &st);
    ck_assert_msg(m != NULL, "%s", st.msg);
    double y[VL_NSTATE];
    busy_state(m, y);
    vl_model_rhs(m, vl_test_work(m), 3.1e9 * VL_YR, y, regime, dydt, NULL, NULL);
    *gross = 0.0;
    for (int r = 0; r < VL_NRES; r++)
        *gross += fabs(dydt[r]);
    vl_test_model_free(m);
}

START_TEST(each_process_conserves)
{
    vl_scenario *sc = vl_scenario_new();
    ck_assert_ptr_nonnull(sc);
    sc->star.xuv_sat_ratio = 0.05; /* strong XUV: escape above the crossover flux, so oxygen drag acts */
    for (int only = -1; only < (int)vl_nprocesses; only++)
        for (int regime = 0; regime < VL_NREGIMES; regime++) {
            double dydt[VL_NSTATE], gross;
            rhs_with(sc, only, regime, dydt, &gross);
            for (int el = 0; el < VL_NELEMENTS; el++)
                /* conservation by construction: round-off only (common practice: 1e-12) */
                ck_assert_msg(imbalance(dydt, el) < 1e-12, "process %s regime %d: %s imbalance %g",
                              only < 0 ? "all" : vl_processes[only]->name, regime,
                              vl_element_name(el), imbalance(dydt, el));
        }
    vl_scenario_free(sc);
}
END_TEST

/* Every process must move mass (its own output columns) in some regime with all
 * processes on, or the conservation test above would pass vacuously for it. */
START_TEST(each_process_moves_mass)
{
    /* strong XUV (hydrodynamic, drag) and weak XUV (kinetic exobase) */
    static const double xuv[2] = {0.05, 1e-5};
    double best[VL_MAX_COLUMNS] = {0};
    size_t ncol = 0;
    const size_t *col_proc = NULL;
    vl_model *keep = NULL;
    vl_scenario *sc_keep = NULL;
    for (int v = 0; v < 2; v++) {
        vl_scenario *sc = vl_scenario_new();
        vl_status st;
        sc->star.xuv_sat_ratio = xuv[v];
        sc->interior.magma.molten_start = 1; /* the magma-ocean processes need a melt */
        for (size_t i = 0; i < vl_nprocesses; i++) /* off-by-default processes too */
            sc->proc[i].enabled = 1;
        vl_model *m = vl_model_new(sc, &st);
        ck_assert_msg(m != NULL, "%s", st.msg);
        double y[VL_NSTATE], dydt[VL_NSTATE], cols[VL_MAX_COLUMNS];
        busy_state(m, y);
        for (int regime = 0; regime < VL_NREGIMES; regime++) {
            vl_model_rhs(m, vl_test_work(m), 3.1e9 * VL_YR, y, regime, dydt, cols, NULL);
            for (size_t c = 0; c < m->ncolumns; c++)
                if (fabs(cols[c]) > best[c])
                    best[c] = fabs(cols[c]);
        }
        ncol = m->nflux; /* the processes' own mass fluxes, not the redox columns */
        col_proc = m->col_proc;
        vl_test_model_free(keep);
        vl_scenario_free(sc_keep);
        keep = m;
        sc_keep = sc;
    }
    for (size_t p = 0; p < vl_nprocesses; p++) {
        double moved = 0.0;
        for (size_t c = 0; c < ncol; c++)
            if (col_proc[c] == p)
                moved += best[c];
        ck_assert_msg(moved > 0.0, "process %s moved no mass in any regime", vl_processes[p]->name);
    }
    vl_test_model_free(keep);
    vl_scenario_free(sc_keep);
}
END_TEST

START_TEST(reactions_balance)
{
    char why[256];
    vl_reaction good = {"2 H2O -> 2 H2 + O2", 3, {VL_R_WATER, VL_R_H2, VL_R_O2}, {-2, 2, 1}};
    vl_reaction bad = {"H2O -> H2 + O2", 3, {VL_R_WATER, VL_R_H2, VL_R_O2}, {-1, 1, 1}};
    ck_assert_int_eq(vl_reaction_check(&good, why, sizeof why), 0);
    ck_assert_int_ne(vl_reaction_check(&bad, why, sizeof why), 0);
    ck_assert_ptr_nonnull(strstr(why, "O"));
    ck_assert_int_eq(vl_move_check(VL_R_H2, VL_R_SPACE_H), 0);
    ck_assert_int_eq(vl_move_check(VL_R_O2, VL_R_OX_ROCK), 0);
    ck_assert_int_ne(vl_move_check(VL_R_WATER, VL_R_SPACE_H), 0);
}
END_TEST

START_TEST(molar_masses)
{
    /* IUPAC 2021 abridged standard atomic weights: H2O 18.015, CO2 44.009 g/mol */
    ck_assert_rel(vl_species_molar_mass(VL_SP_H2O), 18.015e-3, 1e-12);
    ck_assert_rel(vl_species_molar_mass(VL_SP_CO2), 44.009e-3, 1e-12);
    /* hydrogen in one terrestrial ocean [C], IUPAC 2021 atomic weights:
     * 1.39e21 kg x 2.016/18.015 = 1.555e20 kg */
    ck_assert_rel(VL_TO_KG * vl_reservoir_element_fraction(VL_R_WATER, VL_EL_H), 1.555e20, 2e-3);
}
END_TEST

START_TEST(ramp_stops_outflow)
{
    double y[VL_NSTATE] = {0}, dydt[VL_NSTATE] = {0};
    static const vl_transfer o2_out[] = {{VL_R_O2, VL_R_SPACE_O}};
    vl_flux fx = {y, dydt, NULL, 0, o2_out, 1, NULL, 0};
    y[VL_R_O2] = 0.0;
    ck_assert_double_eq(vl_flux_transfer(&fx, 0, 5.3, -1), 0.0);
    /* a small demand (x drain time below the floor): the band is the floor; at a quarter
     * of it the ramp is x (2 - x) = 0.4375 (flux.h) [C] */
    double small = 1e-4; /* kg/s: 1e-4 x 1e6 s = 100 kg < 1e3 kg floor */
    y[VL_R_O2] = 0.25 * vl_reservoir_floor(VL_R_O2);
    ck_assert_double_eq_tol(vl_flux_transfer(&fx, 0, small, -1), 0.4375 * small,
                            1e-18);
    y[VL_R_O2] = 7.0 * vl_reservoir_floor(VL_R_O2);
    ck_assert_double_eq(vl_flux_transfer(&fx, 0, small, -1), small);
    ck_assert_double_eq_tol(dydt[VL_R_O2], -1.4375 * small, 1e-18);
    ck_assert_double_eq_tol(dydt[VL_R_SPACE_O], 1.4375 * small, 1e-18);
    /* a large demand on a small store: the band is demand x drain time, so the store
     * empties over ~VL_DRAIN_TIME_S, at 2 m / tau when m is far inside the band [C] */
    memset(dydt, 0, VL_NSTATE * sizeof dydt[0]);
    y[VL_R_O2] = 1e3;
    double out = vl_flux_transfer(&fx, 0, 1e5, -1);
    double x = 1e3 / (1e5 * VL_DRAIN_TIME_S);
    ck_assert_rel(out, 1e5 * x * (2.0 - x), 1e-12);
    ck_assert_rel(out, 2.0 * 1e3 / VL_DRAIN_TIME_S, 1e-6);
}
END_TEST

START_TEST(reversal_takes_only_what_is_there)
{
    /* A source the integrator carried below zero reverses its outflows (the ramp's 2 x,
     * flux.h); the reversed flow draws on the destination and so is ramped by it in turn:
     * it never takes from an empty reservoir (non-negativity of a mass, common practice;
     * the negative escape flux of campaign member 29, issue 18, took 1.2e6 kg out of a
     * space_o that never held any). */
    double y[VL_NSTATE] = {0}, dydt[VL_NSTATE] = {0};
    static const vl_transfer o2_out[] = {{VL_R_O2, VL_R_SPACE_O}};
    vl_flux fx = {y, dydt, NULL, 0, o2_out, 1, NULL, 0};
    const double demand = 7.0, band = demand * VL_DRAIN_TIME_S; /* kg/s; kg */
    y[VL_R_O2] = -2.2e7;
    y[VL_R_SPACE_O] = 0.0;
    ck_assert_double_eq(vl_flux_transfer(&fx, 0, demand, -1), 0.0);
    ck_assert_double_eq(dydt[VL_R_SPACE_O], 0.0);
    /* a destination that holds plenty gives the whole restoring flow, demand x 2 x with
     * x = m / band: -2 x 2.2e7 kg / 1e6 s = -44 kg/s [C] */
    y[VL_R_SPACE_O] = 1e12;
    double back = vl_flux_transfer(&fx, 0, demand, -1);
    ck_assert_rel(back, demand * 2.0 * (-2.2e7 / band), 1e-12);
    ck_assert_rel(dydt[VL_R_O2], 44.0, 1e-12);
    ck_assert_rel(dydt[VL_R_SPACE_O], -44.0, 1e-12);
    /* one inside its own band (here its floor is below the 44 kg/s x 1e6 s band) gives
     * its ramp's share, x (2 - x) at a quarter of the band = 0.4375 [C] */
    y[VL_R_SPACE_O] = 0.25 * 44.0 * VL_DRAIN_TIME_S;
    ck_assert_rel(vl_flux_transfer(&fx, 0, demand, -1), -44.0 * 0.4375, 1e-12);
    /* a demand of the wrong sign is a process's error, not a ramp's reversal: it is left
     * as it is, for the invariant guard to see (tests/test_invariants.c) */
    y[VL_R_O2] = 1e12;
    y[VL_R_SPACE_O] = 0.0;
    ck_assert_double_eq(vl_flux_transfer(&fx, 0, -demand, -1), -demand);
    /* a reaction run backwards by a reactant below zero takes from its products as far
     * as they hold: 2 H2 + O2 -> 2 H2O with the O2 below zero and no water gives none */
    static const vl_reaction ox[] = {
        {"2 H2 + O2 -> 2 H2O", 3, {VL_R_H2, VL_R_O2, VL_R_WATER}, {-2.0, -1.0, 2.0}}};
    memset(dydt, 0, VL_NSTATE * sizeof dydt[0]);
    vl_flux rx = {y, dydt, NULL, 0, NULL, 0, ox, 1};
    y[VL_R_H2] = 1e12;
    y[VL_R_O2] = -2.2e7;
    y[VL_R_WATER] = 0.0;
    ck_assert_double_eq(vl_flux_react(&rx, 0, 1.0, -1), 0.0);
    y[VL_R_WATER] = 1e20; /* an ocean gives the O2 back: the reaction runs backwards */
    ck_assert(vl_flux_react(&rx, 0, 1.0, -1) < 0.0);
    ck_assert(dydt[VL_R_O2] > 0.0 && dydt[VL_R_WATER] < 0.0);
}
END_TEST

Suite *vl_suite_ledger(void)
{
    Suite *s = suite_create("ledger");
    TCase *tc = tcase_create("core");
    tcase_add_test(tc, each_process_conserves);
    tcase_add_test(tc, each_process_moves_mass);
    tcase_add_test(tc, reactions_balance);
    tcase_add_test(tc, molar_masses);
    tcase_add_test(tc, ramp_stops_outflow);
    tcase_add_test(tc, reversal_takes_only_what_is_there);
    suite_add_tcase(s, tc);
    return s;
}
