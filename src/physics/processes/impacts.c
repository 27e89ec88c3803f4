/* impacts.c: atmospheric erosion by large impacts and optional volatile delivery.
 * Impact rate N(t) = N0 exp(-(t - t0)/tau) + N_bg (impacts per unit time; the exponential
 * form of the lunar cratering chronology, Neukum, Ivanov & Hartmann 2001, Space Sci.
 * Rev. 96:55). Each large impact removes the atmosphere above the tangent plane at the
 * impact site, a fraction X = h/(2R) of every gas, h = k T_s / (m g) the isothermal
 * scale height (Schlichting, Sari & Yalinewich 2015, Icarus 247:81): gas i is lost at
 * N(t) X M_i. CO2 and vapour leave as atoms through balanced reactions
 *   CO2 -> C(space) + 2 O(space)      and      H2O -> 2 H(space) + O(space),
 * N2, O2, H2 by plain transfers to the space reservoirs. With delivery on, every impact
 * also brings fixed masses of water, CO2 and N2 drawn from the impactor_* reservoirs,
 * which the initial hook fills with the integral of N(t) x mass over the run, so the
 * element ledger stays closed; the delivered water's D/H is water_dh_ratio times the
 * inventory's (chondrites near ocean water, comets up to a few times it). */
#include <math.h>
#include <stddef.h>

#include "volev/process.h"
#include "volev/units.h"

typedef struct {
    double early_per_s;  /* N0: large impacts per second at t0, above the background */
    double decay_s;      /* tau: e-folding time of the early flux */
    double ref_age_s;    /* t0: stellar age at which the early term equals N0 */
    double bg_per_s;     /* N_bg: constant background rate */
    int delivery;        /* 1: impacts deliver volatiles */
    double water_kg;     /* water per impact */
    double co2_kg;       /* CO2 per impact */
    double n2_kg;        /* N2 per impact */
    double water_dh_ratio; /* D/H of the delivered water over the inventory's */
} params;

#define PER_MYR (1.0 / (1e6 * VL_YR))
#define R(k, unit, si, d, lo, hi, f, doc, ref, needs) \
    VL_PARAM_ROW(params, VL_PT_REAL, k, unit, si, d, lo, hi, f, doc, ref, needs)
#define NEEDS_DELIVERY "processes.impacts.delivery=true"

static const vl_param table[] = {
    R("early_rate_per_myr", "1/Myr", PER_MYR, 6.4, 0.0, 1e6, early_per_s,
      "N0: large (tangent-plane) impacts per Myr at reference_age_yr, above the background",
      "1.28e4 x background_rate_per_myr: the ratio of the lunar cratering rate 4.47 Gyr ago "
      "to today's, computed from the chronology of Neukum, Ivanov & Hartmann 2001 (its "
      "coefficients from memory); order of magnitude",
      NULL),
    R("decay_myr", "Myr", 1e6 * VL_YR, 144.0, 1.0, 1e5, decay_s,
      "tau: e-folding time of the early impact flux",
      "1/(6.93 per Gyr), the exponential term of the lunar chronology (Neukum, Ivanov & "
      "Hartmann 2001), from memory",
      NULL),
    R("reference_age_yr", "yr", VL_YR, 1.0e8, 0.0, 2e10, ref_age_s,
      "t0: stellar age at which the early term equals early_rate_per_myr",
      "4.47 Gyr ago in the solar system, about the Moon-forming impact ~95 Myr after the "
      "first solids (Jacobson et al. 2014, Nature 508:84), from memory", NULL),
    R("background_rate_per_myr", "1/Myr", PER_MYR, 5.0e-4, 0.0, 1e6, bg_per_s,
      "N_bg: constant background rate of large impacts",
      "impactors >~40 km across on Earth today, about one per 2 Gyr: the ~100 Myr interval of "
      ">=10 km impactors (Chapman & Morrison 1994, Nature 367:33) scaled by a cumulative "
      "size distribution ~D^-2, from memory",
      NULL),
    {"delivery", VL_PT_BOOL, "", 1.0, 0.0, 0.0, 1.0, NULL, NULL, offsetof(params, delivery),
     "impacts also deliver water, CO2 and N2 (from the impactor_* reservoirs)",
     "chosen here: off, the impactor population's volatile content is uncertain by orders of magnitude",
     NULL, 0},
    R("water_per_impact_kg", "kg", 1.0, 1.0e15, 0.0, 1e22, water_kg,
      "water delivered by each impact",
      "1 wt% of a 1e17 kg impactor (the tangent-plane threshold mass for Earth, Schlichting, "
      "Sari & Yalinewich 2015), between ordinary and carbonaceous chondrites (Lodders & "
      "Fegley 1998, The Planetary Scientist's Companion, Oxford Univ. Press), from memory",
      NEEDS_DELIVERY),
    R("co2_per_impact_kg", "kg", 1.0, 7.0e14, 0.0, 1e22, co2_kg,
      "carbon delivered by each impact, as CO2",
      "0.2 wt% C of a 1e17 kg impactor, chondritic order of magnitude (Lodders & Fegley "
      "1998, The Planetary Scientist's Companion), from memory",
      NEEDS_DELIVERY),
    R("n2_per_impact_kg", "kg", 1.0, 1.0e13, 0.0, 1e22, n2_kg,
      "nitrogen delivered by each impact, as N2",
      "100 ppm N of a 1e17 kg impactor, chondritic order of magnitude (Lodders & Fegley "
      "1998, The Planetary Scientist's Companion), from memory",
      NEEDS_DELIVERY),
    R("water_dh_ratio", "", 1.0, 1.0, 0.0, 100.0, water_dh_ratio,
      "D/H of the delivered water over the inventory's (inventory.initial_dh)",
      "1: carbonaceous chondrites near ocean water (VSMOW 1.5576e-4); Jupiter-family "
      "comets 1-3.4x (103P 1.61e-4, Hartogh et al. 2011, Nature 478:218; 67P 5.3e-4, "
      "Altwegg et al. 2015, Science 347:1261952); Oort-cloud comets ~2x, from memory",
      NEEDS_DELIVERY),
};

enum {
    COL_CO2, COL_N2, COL_O2, COL_H2, COL_H2O,
    COL_DEL_H2O, COL_DEL_CO2, COL_DEL_N2
};

static const vl_flux_column columns[] = {
    {"impact_co2_kg_s", "CO2 blown off by impacts"},
    {"impact_n2_kg_s", "N2 blown off by impacts"},
    {"impact_o2_kg_s", "O2 blown off by impacts"},
    {"impact_h2_kg_s", "H2 blown off by impacts"},
    {"impact_h2o_kg_s", "water vapour blown off by impacts"},
    {"delivered_h2o_kg_s", "water delivered by impactors"},
    {"delivered_co2_kg_s", "CO2 delivered by impactors"},
    {"delivered_n2_kg_s", "N2 delivered by impactors"},
};

enum { N2_TO_SPACE_N, O2_TO_SPACE_O, H2_TO_SPACE_H, IMPACT_WATER_TO_WATER, IMPACT_CO2_TO_CO2,
       IMPACT_N2_TO_N2 };
static const vl_transfer transfers[] = {
    [N2_TO_SPACE_N] = {VL_R_N2, VL_R_SPACE_N},
    [O2_TO_SPACE_O] = {VL_R_O2, VL_R_SPACE_O},
    [H2_TO_SPACE_H] = {VL_R_H2, VL_R_SPACE_H},
    [IMPACT_WATER_TO_WATER] = {VL_R_IMPACT_WATER, VL_R_WATER},
    [IMPACT_CO2_TO_CO2] = {VL_R_IMPACT_CO2, VL_R_CO2},
    [IMPACT_N2_TO_N2] = {VL_R_IMPACT_N2, VL_R_N2},
};

enum { CO2_OUT, H2O_OUT };
static const vl_reaction reactions[] = {
    [CO2_OUT] = {"CO2 -> C(space) + 2 O(space)", 3, {VL_R_CO2, VL_R_SPACE_C, VL_R_SPACE_O}, {-1.0, 1.0, 2.0}},
    [H2O_OUT] = {"H2O -> 2 H(space) + O(space)", 3, {VL_R_WATER, VL_R_SPACE_H, VL_R_SPACE_O}, {-1.0, 2.0, 1.0}},
};

/* Largest (t0 - t)/tau accepted at run start: beyond it N(t) is e^200 times N0. */
#define MAX_BACK_EFOLDS 200.0

/* N(t), impacts per second (Neukum, Ivanov & Hartmann 2001 exponential form). */
static double impact_rate(const params *p, double t_s)
{
    return p->early_per_s * exp(-(t_s - p->ref_age_s) / p->decay_s) + p->bg_per_s;
}

/* Number of impacts between ages a <= b: the integral of N(t), analytic. */
static double impacts_between(const params *p, double a_s, double b_s)
{
    double early = p->early_per_s * p->decay_s * exp(-(a_s - p->ref_age_s) / p->decay_s) *
                   -expm1(-(b_s - a_s) / p->decay_s);
    return early + p->bg_per_s * (b_s - a_s);
}

/* Tangent-plane fraction X = h/(2R), within [0, 1] (Schlichting, Sari & Yalinewich 2015).
 * A scale height is positive; a surface temperature at or below 0 K (which no climate
 * should give: the run's invariant guard stops one) would make it negative and run the
 * erosion reactions backwards, building air out of the empty space reservoirs. A NaN
 * passes on for the guard to see. */
static double tangent_fraction(const vl_planet *pl, const vl_env *env)
{
    double h = VL_K_BOLTZMANN * env->t_surf_k / (env->m_mean_kg * env->g);
    double x = h / (2.0 * pl->radius_m);
    return x > 1.0 ? 1.0 : x < 0.0 ? 0.0 : x;
}

/* The rate at run start must be finite; delivery must have something to deliver, and
 * enough that the pools' depletion bands (at most one floor stays undelivered) are
 * negligible. */
static int check(const void *pv, const vl_scenario *sc, vl_status *st)
{
    const params *p = pv;
    double back = (p->ref_age_s - sc->run.start_s) / p->decay_s;
    if (p->early_per_s > 0.0 && back > MAX_BACK_EFOLDS)
        return vl_fail(st, VL_ERR_INPUT, sc->path, 0,
                       "processes.impacts: run.start_yr lies %.4g e-folding times "
                       "(decay_myr) before reference_age_yr; at most %g are accepted",
                       back, MAX_BACK_EFOLDS);
    if (!p->delivery)
        return VL_OK;
    double n = impacts_between(p, sc->run.start_s, sc->run.end_s);
    const struct {
        const char *key;
        double kg;
        int pool;
    } d[] = {{"water_per_impact_kg", p->water_kg, VL_R_IMPACT_WATER},
             {"co2_per_impact_kg", p->co2_kg, VL_R_IMPACT_CO2},
             {"n2_per_impact_kg", p->n2_kg, VL_R_IMPACT_N2}};
    int any = 0;
    for (size_t i = 0; i < sizeof d / sizeof d[0]; i++) {
        if (d[i].kg <= 0.0)
            continue;
        any = 1;
        if (n * d[i].kg < 1e3 * vl_reservoir_floor(d[i].pool))
            return vl_fail(st, VL_ERR_INPUT, sc->path, 0,
                           "processes.impacts: %.4g impacts x %s = %.4g kg over the run, less "
                           "than 1000 times the %s depletion band (%g kg): raise the rates or "
                           "the mass, or turn delivery off",
                           n, d[i].key, n * d[i].kg, vl_reservoir_name(d[i].pool),
                           vl_reservoir_floor(d[i].pool));
    }
    if (!any)
        return vl_fail(st, VL_ERR_INPUT, sc->path, 0,
                       "processes.impacts.delivery is on but every *_per_impact_kg is 0");
    return VL_OK;
}

/* Fill the impactor reservoirs with what the population delivers from run start to end,
 * the water's deuterium at water_dh_ratio times the inventory's D/H. */
static void initial(const void *pv, const vl_planet *pl, double *y)
{
    const params *p = pv;
    if (!p->delivery)
        return;
    double n = impacts_between(p, pl->run_start_s, pl->run_end_s);
    y[VL_R_IMPACT_WATER] += n * p->water_kg;
    y[VL_R_D_IMPACT_WATER] += vl_reservoir_deuterium_kg(VL_R_IMPACT_WATER, n * p->water_kg,
                                                        p->water_dh_ratio * pl->initial_dh);
    y[VL_R_IMPACT_CO2] += n * p->co2_kg;
    y[VL_R_IMPACT_N2] += n * p->n2_kg;
}

/* Erosion N X M_i of every gas to space; delivery N x mass from the impactor pools. */
static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const vl_env *env = v->env;
    const vl_planet *pl = v->planet;
    const params *p = pv;
    double n = impact_rate(p, env->t_s);
    double loss = n * tangent_fraction(pl, env); /* fraction of each gas per second */
    vl_flux_react(fx, CO2_OUT,
                  loss * env->mass_kg[VL_GAS_CO2] / vl_species_molar_mass(VL_SP_CO2), COL_CO2);
    vl_flux_transfer(fx, N2_TO_SPACE_N, loss * env->mass_kg[VL_GAS_N2], COL_N2);
    vl_flux_transfer(fx, O2_TO_SPACE_O, loss * env->mass_kg[VL_GAS_O2], COL_O2);
    vl_flux_transfer(fx, H2_TO_SPACE_H, loss * env->mass_kg[VL_GAS_H2], COL_H2);
    vl_flux_react(fx, H2O_OUT, loss * env->vapour_kg / vl_species_molar_mass(VL_SP_H2O),
                  COL_H2O);
    if (!p->delivery)
        return;
    vl_flux_transfer(fx, IMPACT_WATER_TO_WATER, n * p->water_kg, COL_DEL_H2O);
    vl_flux_transfer(fx, IMPACT_CO2_TO_CO2, n * p->co2_kg, COL_DEL_CO2);
    vl_flux_transfer(fx, IMPACT_N2_TO_N2, n * p->n2_kg, COL_DEL_N2);
}

const vl_process vl_process_impacts = {
    .name = "impacts",
    .summary = "large impacts: tangent-plane erosion of the atmosphere, optional volatile delivery",
    .refs = "Schlichting, Sari & Yalinewich 2015, Icarus 247:81; Neukum, Ivanov & Hartmann "
            "2001, Space Sci. Rev. 96:55 (rate history)",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_TRANSFERS(transfers),
    VL_PROCESS_REACTIONS(reactions),
    .default_enabled = 0,
    .initial = initial,
    .check = check,
    .rates = rates,
};
