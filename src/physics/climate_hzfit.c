/* climate_hzfit.c: the hz_fit climate backend. The regime follows the habitable-zone
 * flux limits of Kopparapu et al. 2013 (ApJ 765:131, erratum ApJ 770:82) and 2014
 * (ApJL 787:L29); the surface temperature comes from a grey energy balance with a
 * calibrated greenhouse term that grows with ln pCO2. */
#include <math.h>
#include <stdlib.h>

#include "climate_internal.h"
#include "volev/reservoir.h"
#include "volev/units.h"
#include "volev/water.h"

/* Validity range of the fits in Teff (both papers); outside it Teff is clamped. */
#define TEFF_MIN_K 2600.0
#define TEFF_MAX_K 7200.0
#define TEFF_REF_K 5780.0

/* Kopparapu et al. 2013 with its erratum: S0, a, b, c, d per enum vl_hz_limit
 * (as agreed by several independent transcriptions, not checked against the papers'
 * tables: [S], docs/model.md). */
static const double k2013[VL_NHZ][5] = {
    [VL_HZ_RECENT_VENUS] = {1.7763, 1.4335e-4, 3.3954e-9, -7.6364e-12, -1.1950e-15},
    [VL_HZ_RUNAWAY] = {1.0385, 1.2456e-4, 1.4612e-8, -7.6345e-12, -1.7511e-15},
    [VL_HZ_MOIST] = {1.0146, 8.1884e-5, 1.9394e-9, -4.3618e-12, -6.8260e-16},
    [VL_HZ_MAX_GREENHOUSE] = {0.3507, 5.9578e-5, 1.6707e-9, -3.0058e-12, -5.1925e-16},
    [VL_HZ_EARLY_MARS] = {0.3207, 5.4471e-5, 1.5275e-9, -2.1709e-12, -3.8282e-16},
};

/* Kopparapu et al. 2014: runaway greenhouse for 0.1, 1 and 5 Earth masses
 * (as agreed by several independent transcriptions, not checked against the papers'
 * tables: [S], docs/model.md). */
static const double k2014_mass[3] = {0.1, 1.0, 5.0};
static const double k2014_runaway[3][5] = {
    {0.99, 1.209e-4, 1.404e-8, -7.418e-12, -1.713e-15},
    {1.107, 1.332e-4, 1.580e-8, -8.308e-12, -1.931e-15},
    {1.188, 1.433e-4, 1.707e-8, -8.968e-12, -2.084e-15},
};

/* What the backend keeps from the scenario. */
typedef struct hzfit {
    vl_climate_params cp;   /* copy of the climate block */
    double mass_mearth;     /* planet mass, Earth masses */
} hzfit;

/* S_eff = S0 + a T + b T^2 + c T^3 + d T^4, T = Teff - 5780 K, Teff clamped to the fit
 * range (Kopparapu et al. 2013, eq. 2). */
static double seff_poly(const double k[5], double teff_k)
{
    double t = fmin(fmax(teff_k, TEFF_MIN_K), TEFF_MAX_K) - TEFF_REF_K;
    return k[0] + t * (k[1] + t * (k[2] + t * (k[3] + t * k[4])));
}

double vl_hz_seff_2013(int limit, double teff_k)
{
    if (limit < 0 || limit >= VL_NHZ)
        return NAN;
    return seff_poly(k2013[limit], teff_k);
}

/* Linear in log10(mass) between neighbouring fits; mass clamped to [0.1, 5]. */
double vl_hz_seff_runaway_2014(double mass_mearth, double teff_k)
{
    double m = fmin(fmax(mass_mearth, k2014_mass[0]), k2014_mass[2]);
    int i = m <= k2014_mass[1] ? 0 : 1;
    double w = log10(m / k2014_mass[i]) / log10(k2014_mass[i + 1] / k2014_mass[i]);
    double s0 = seff_poly(k2014_runaway[i], teff_k);
    double s1 = seff_poly(k2014_runaway[i + 1], teff_k);
    return s0 + w * (s1 - s0);
}

/* Greenhouse warming never negative: g itself above KNEE_K, 0 below -KNEE_K, and between
 * them the quadratic (g + KNEE_K)^2 / (4 KNEE_K), which meets both with the same value and
 * slope (a C1 "soft max" of g and 0, common practice), so the right-hand side stays
 * smooth for the integrator. The linear-in-ln pCO2 fit is calibrated around present
 * Earth; far below its reference pCO2 it would predict a cooling greenhouse (about -56 K
 * at the floor below), which no atmosphere of non-condensing gases produces: an
 * atmosphere transparent in the thermal infrared leaves the surface at the equilibrium
 * temperature. The knee lifts g by at most KNEE_K / 4 and only where |g| < KNEE_K. */
#define KNEE_K 2.0

double vl_hzfit_greenhouse_knee(double g_k)
{
    if (g_k >= KNEE_K)
        return g_k;
    if (g_k <= -KNEE_K)
        return 0.0;
    return (g_k + KNEE_K) * (g_k + KNEE_K) / (4.0 * KNEE_K);
}

/* Equilibrium temperature T_e = [S (1 - A) / (4 sigma) + T_CMB^4]^(1/4): the absorbed
 * stellar flux spread over the sphere (Stefan-Boltzmann) plus the cosmic microwave
 * background every surface also absorbs, so that T_e >= T_CMB however faint the star
 * (T_CMB = VL_T_CMB_K, Fixsen 2009). The background adds T_CMB^4 / (4 T_e^3), 1e-6 K at
 * 255 K. */
double vl_hzfit_equilibrium_temp(double instellation, double bond_albedo)
{
    double t4 = VL_T_CMB_K * VL_T_CMB_K * VL_T_CMB_K * VL_T_CMB_K;
    return pow(instellation * (1.0 - bond_albedo) / (4.0 * VL_SIGMA_SB) + t4, 0.25);
}

/* Temperate energy balance: T = T_e + knee(G0 + (dT_2x / ln 2) ln(pCO2_dry / pCO2_ref)),
 * with T_e the equilibrium temperature above, G0 and dT_2x the calibrated greenhouse and
 * doubling warming, and pCO2_dry = x_CO2,dry M_dry g / area. pCO2_dry is floored at
 * 1e-9 pCO2_ref (a numerical guard of ours, about 30 doublings below the reference) so
 * the logarithm stays finite and continuous as CO2 runs out. Invariant: T >= T_e >=
 * T_CMB > 0 (the greenhouse term is never negative). */
static double balance_temp(const vl_climate_params *cp, const vl_env *env,
                           const vl_dry_air *air)
{
    double te = vl_hzfit_equilibrium_temp(env->instellation, cp->bond_albedo);
    double p_dry = air->mass_kg * env->g / env->area_m2;
    double pco2 = air->mol > 0.0 ? air->co2_mol / air->mol * p_dry : 0.0;
    pco2 = fmax(pco2, 1e-9 * cp->co2_ref_pa);
    double g = cp->greenhouse_ref_k + cp->co2_doubling_k / log(2.0) * log(pco2 / cp->co2_ref_pa);
    return te + vl_hzfit_greenhouse_knee(g);
}

/* Stratospheric total-hydrogen mixing ratio: the cold-trap value of the regime; in a
 * runaway the H2O mole fraction of the whole atmosphere, at least the moist value. */
static double strat_mixing(const vl_climate_params *cp, const vl_env *env,
                           const vl_dry_air *air)
{
    switch (env->regime) {
    case VL_REGIME_MOIST:
        return cp->strat_h2o_moist;
    case VL_REGIME_RUNAWAY: {
        double nv = env->vapour_kg / vl_species_molar_mass(VL_SP_H2O);
        double x = nv + air->mol > 0.0 ? nv / (nv + air->mol) : 0.0;
        return fmax(x, cp->strat_h2o_moist);
    }
    default:
        return cp->strat_h2o_temperate;
    }
}

/* Fill the climate fields of env for the regime in force (climate.h contract).
 * Vapour: all surface water in a runaway or above T_c, else saturation at T_s over the
 * stable phase (ice below the triple point), capped by the water available. */
static void hzfit_eval(const void *state, void *work, double water_kg, vl_env *env)
{
    (void)work; /* nothing to keep between calls */
    const hzfit *h = state;
    const vl_climate_params *cp = &h->cp;
    double teff = env->star.teff_k;
    env->s_runaway = cp->runaway_fit == VL_RUNAWAY_K2013
                         ? vl_hz_seff_2013(VL_HZ_RUNAWAY, teff)
                         : vl_hz_seff_runaway_2014(h->mass_mearth, teff);
    env->s_moist = vl_hz_seff_2013(VL_HZ_MOIST, teff);

    vl_dry_air air;
    vl_climate_dry_air(env, &air);
    env->t_balance_k = balance_temp(cp, env, &air);
    int runaway = env->regime == VL_REGIME_RUNAWAY;
    env->t_surf_k = runaway ? cp->runaway_surface_temp_k : env->t_balance_k;

    vl_climate_partition(water_kg, runaway, &air, env);
    env->liquid = 0.0;
    if (env->regime != VL_REGIME_RUNAWAY && env->regime != VL_REGIME_DRY &&
        env->t_surf_k < VL_WATER_TC_K) /* ice spreads over the 10 K below freezing */
        env->liquid = fmin(1.0, fmax(0.0, (env->t_surf_k - cp->freeze_temp_k + 10.0) / 10.0));
    env->f_strat = strat_mixing(cp, env, &air);
}

/* First match of: dry, runaway, frozen, moist greenhouse, temperate. */
static int hzfit_classify(const void *state, void *work, double water_kg, const vl_env *env)
{
    (void)work;
    const vl_climate_params *cp = &((const hzfit *)state)->cp;
    if (water_kg < cp->dry_threshold_kg)
        return VL_REGIME_DRY;
    if (env->s_eff >= env->s_runaway)
        return VL_REGIME_RUNAWAY;
    if (env->t_balance_k < cp->freeze_temp_k)
        return VL_REGIME_FROZEN;
    if (env->s_eff >= env->s_moist)
        return VL_REGIME_MOIST;
    return VL_REGIME_TEMPERATE;
}

/* Copy the climate block and planet mass; reject a runaway fit it does not know. */
static void *hzfit_create(const vl_scenario *sc, vl_status *st)
{
    int fit = sc->climate.runaway_fit;
    if (fit != VL_RUNAWAY_K2014 && fit != VL_RUNAWAY_K2013) {
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "unknown runaway fit %d", fit);
        return NULL;
    }
    hzfit *h = malloc(sizeof *h);
    if (!h) {
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        return NULL;
    }
    h->cp = sc->climate;
    h->mass_mearth = sc->planet.mass_kg / VL_M_EARTH;
    return h;
}

/* Free the state of hzfit_create; accepts NULL. */
static void hzfit_destroy(void *state) { free(state); }

const vl_climate_backend vl_hzfit_backend = {
    .name = "hz_fit",
    .create = hzfit_create,
    .destroy = hzfit_destroy,
    .eval = hzfit_eval,
    .classify = hzfit_classify,
};
