/* hydrogen_escape.c: hydrogen escape as the lesser of the diffusion limit and the
 * energy limit. Its prepare hook sets the upper-atmosphere escape budget that
 * oxygen_drag and photolysis refine; its rates remove the hydrogen that escapes.
 *
 * Diffusion limit (Hunten 1973, J. Atmos. Sci. 30:1481):
 *   phi_H2 = b f_T g (m_bg - m_H2) / (k T)   [H2 molecules m^-2 s^-1],
 *   b(H2-air) = 1.89e19 (T/293 K)^0.75 cm^-1 s^-1 (Marrero & Mason 1972, CRC table),
 *   f_T = f_strat + x_H2 (total hydrogen mixing ratio above the homopause, H2 units).
 * Energy limit (Watson, Donahue & Walker 1981, Icarus 48:150; Erkaev et al. 2007,
 * A&A 472:329): Mdot = eps pi R_XUV^2 R_p F_XUV / (G M_p K),
 *   K = 1 - 3/(2 xi) + 1/(2 xi^3), xi = R_Roche / R_XUV, R_Roche = a (M_p / 3 M_*)^(1/3). */
#include <math.h>
#include <stddef.h>

#include "volev/model.h"
#include "volev/units.h"

typedef struct {
    double efficiency;       /* heating efficiency eps */
    double xuv_radius_ratio; /* R_XUV / R_p */
    double homopause_temp_k; /* temperature in the diffusion coefficient and scale heights */
    int roche;               /* apply the Roche-lobe factor K */
} params;

#define P(k, type, unit, si, d, lo, hi, f, doc, ref)                                  \
    {k, type, unit, si, d, lo, hi, NULL, NULL, offsetof(params, f), doc, ref, NULL, 0}

static const vl_param table[] = {
    P("xuv_efficiency", VL_PT_REAL, "", 1.0, 0.15, 0.0, 1.0, efficiency,
      "fraction of absorbed XUV energy that drives escape",
      "Lammer et al. 2009, A&A 506:399: 0.1-0.3"),
    P("xuv_radius_ratio", VL_PT_REAL, "", 1.0, 1.0, 1.0, 10.0, xuv_radius_ratio,
      "radius where XUV is absorbed over planet radius", "common practice (1 for rocky planets)"),
    P("homopause_temp_k", VL_PT_REAL, "K", 1.0, 250.0, 100.0, 3000.0, homopause_temp_k,
      "temperature of the homopause region in the diffusion limit",
      "from memory (gives ~2.5e13 f_T H2 cm^-2 s^-1 for Earth, Catling & Kasting 2017)"),
    P("roche_lobe", VL_PT_BOOL, "", 1.0, 1.0, 0.0, 1.0, roche,
      "apply the Roche-lobe enhancement 1/K", "Erkaev et al. 2007"),
};

static const char *const columns[] = {"h_escape_h2_kg_s"};

/* b(H2-air), m^-1 s^-1 (Marrero & Mason 1972 via the CRC diffusion table). */
static double b_h2_air(double t_k) { return 1.89e21 * pow(t_k / 293.0, 0.75); }

/* Roche-lobe factor K of Erkaev et al. 2007 eq. 17, floored at 0.01 where the lobe
 * would lie inside R_XUV (the formula is not valid there). */
static double roche_factor(const params *p, const vl_model *m)
{
    const vl_scenario *sc = m->sc;
    double r_roche = sc->planet.orbit_m * cbrt(sc->planet.mass_kg / (3.0 * sc->star.mass_kg));
    double xi = r_roche / (p->xuv_radius_ratio * sc->planet.radius_m);
    double k = 1.0 - 1.5 / xi + 0.5 / (xi * xi * xi);
    return k < 0.01 ? 0.01 : k;
}

static void prepare(const void *pv, const vl_model *m, const double *y, vl_env *env)
{
    const params *p = pv;
    (void)y;
    const vl_scenario *sc = m->sc;
    double m_h = VL_AW_H * VL_AMU, m_h2 = 2.0 * m_h;
    double r_xuv = p->xuv_radius_ratio * sc->planet.radius_m;
    double k = p->roche ? roche_factor(p, m) : 1.0;
    double mdot = p->efficiency * VL_PI * r_xuv * r_xuv * sc->planet.radius_m * env->f_xuv /
                  (VL_G_NEWTON * sc->planet.mass_kg * k);
    env->esc_mass_flux = mdot / m->area_m2;

    double f_t = env->f_strat + env->x[VL_GAS_H2];
    double dm = env->m_background_kg - m_h2;
    double t = p->homopause_temp_k;
    env->esc_h_diffusion = dm > 0.0 ? 2.0 * b_h2_air(t) * f_t * env->g * dm / (VL_K_BOLTZMANN * t)
                                    : HUGE_VAL;
    double h_el = env->esc_mass_flux / m_h;
    env->esc_energy_limited = h_el < env->esc_h_diffusion;
    env->esc_h_flux = env->esc_energy_limited ? h_el : env->esc_h_diffusion;
    env->esc_o_flux = 0.0;
    env->esc_water_share = f_t > 0.0 ? env->f_strat / f_t : 0.0;
}

/* Hydrogen leaves the H2 reservoir at the H2-borne share of the budget; the
 * water-borne share is carried off by photolysis (photolysis.c). */
static void rates(const void *pv, const vl_model *m, const double *y, const vl_env *env,
                  vl_flux *fx)
{
    (void)pv;
    (void)y;
    double atoms = (1.0 - env->esc_water_share) * env->esc_h_flux * m->area_m2;
    vl_flux_move(fx, VL_R_H2, VL_R_SPACE_H, atoms * VL_AW_H * 1e-3 / VL_AVOGADRO, 0);
}

const vl_process vl_process_hydrogen_escape = {
    .name = "hydrogen_escape",
    .summary = "hydrogen escape: min(diffusion limit, energy limit with Roche-lobe factor)",
    .refs = "Hunten 1973; Watson, Donahue & Walker 1981; Erkaev et al. 2007",
    VL_PROCESS_TABLES(table, params, columns),
    .default_enabled = 1,
    .prepare = prepare,
    .rates = rates,
};
