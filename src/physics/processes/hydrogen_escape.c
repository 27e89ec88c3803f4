/* hydrogen_escape.c: thermal hydrogen escape, the least of the diffusion limit, the
 * Jeans limit of the exobase and the energy limit. Its prepare hook sets the
 * upper-atmosphere escape budget that oxygen_drag and photolysis refine; its rates
 * remove the H2-borne share of the escaping hydrogen (photolysis removes the rest).
 *
 * Diffusion limit (Hunten 1973, J. Atmos. Sci. 30:1481), through the actual background:
 *   phi_H = 2 f_T b g (m_bg - m_c) / (k T)   [H atoms m^-2 s^-1],
 *   f_T = f_strat + x_H2 (total hydrogen above the homopause, H2 units). The background is
 *   the molecular gases (N2, CO2, O2; mean mass m_mol) and, above the cold trap, the O of
 *   dissociated water with share w_O = f_strat (a steam upper atmosphere is atomic O);
 *   m_bg = (1 - w_O) m_mol + w_O m_O, the carrier H2 in the molecular part and H in the
 *   O part, m_c = (1 - w_O) m_H2 + w_O m_H, and Blanc's law for the mixture
 *   1/b = (1 - w_O)/b(H2-air) + w_O/b(H-O), with b(H2-air) = 1.89e19 (T/293 K)^0.75
 *   cm^-1 s^-1 (Marrero & Mason 1972, CRC table) and b(H-O) = 4.8e17 T^0.75 cm^-1 s^-1
 *   (Zahnle & Kasting 1986, from memory).
 * Jeans limit (Jeans 1925; Chamberlain & Hunten 1987): the Jeans flux of H from an
 *   exobase density in diffusive equilibrium above the homopause,
 *   n_H = 2 f_T n_tb exp(-(r_exo - r_tb)/H_H), H_H = k T_exo/(m_H g_exo), times
 *   (r_exo/R_p)^2 per unit surface. Below the critical escape parameter lambda_c the flow
 *   turns hydrodynamic: the exobase cap blends smoothly (over lambda_c -+ 0.5) from
 *   min(Jeans, energy limit) to the energy limit.
 * Energy limit (Watson, Donahue & Walker 1981, Icarus 48:150; Erkaev et al. 2007,
 * A&A 472:329): Mdot = eps pi R_XUV^2 R_p F_XUV / (G M_p K),
 *   K = 1 - 3/(2 xi) + 1/(2 xi^3), xi = R_Roche / R_XUV, R_Roche = a (M_p / 3 M_*)^(1/3);
 *   optionally eps / (1 + c_CO2 x_CO2 + c_H2O f_strat) for radiative cooling by CO2 and
 *   H2O (the form of the exobase cooling in upper.c; coefficients from memory). */
#include <math.h>
#include <stddef.h>

#include "volev/model.h"
#include "volev/units.h"
#include "volev/upper.h"

typedef struct {
    double efficiency;       /* heating efficiency eps */
    double xuv_radius_ratio; /* R_XUV / R_p */
    double homopause_temp_k; /* temperature in the diffusion coefficient and scale heights */
    int roche;               /* apply the Roche-lobe factor K */
    double lambda_crit;      /* hydrodynamic below this escape parameter */
    int cooling;             /* reduce eps by CO2 and H2O cooling */
    double cool_co2;         /* c_CO2 */
    double cool_h2o;         /* c_H2O */
} params;

#define P(k, type, unit, si, d, lo, hi, f, doc, ref, needs) \
    VL_PARAM_ROW(params, type, k, unit, si, d, lo, hi, f, doc, ref, needs)
#define COOLING "processes.hydrogen_escape.radiative_cooling=true"

static const vl_param table[] = {
    P("xuv_efficiency", VL_PT_REAL, "", 1.0, 0.15, 0.0, 1.0, efficiency,
      "fraction of absorbed XUV energy that drives escape",
      "Lammer et al. 2009, A&A 506:399: 0.1-0.3", NULL),
    P("xuv_radius_ratio", VL_PT_REAL, "", 1.0, 1.0, 1.0, 10.0, xuv_radius_ratio,
      "radius where XUV is absorbed over planet radius", "common practice (1 for rocky planets)",
      NULL),
    P("homopause_temp_k", VL_PT_REAL, "K", 1.0, 250.0, 100.0, 3000.0, homopause_temp_k,
      "temperature of the homopause region in the diffusion limit",
      "from memory (gives ~2.5e13 f_T H2 cm^-2 s^-1 for Earth, Catling & Kasting 2017)", NULL),
    P("roche_lobe", VL_PT_BOOL, "", 1.0, 1.0, 0.0, 1.0, roche,
      "apply the Roche-lobe enhancement 1/K", "Erkaev et al. 2007", NULL),
    P("critical_lambda", VL_PT_REAL, "", 1.0, 2.5, 0.5, 20.0, lambda_crit,
      "escape parameter below which the flow is hydrodynamic",
      "~2-3, e.g. Volkov et al. 2011, from memory", NULL),
    P("radiative_cooling", VL_PT_BOOL, "", 1.0, 0.0, 0.0, 1.0, cooling,
      "reduce the heating efficiency by CO2 and H2O cooling", "off: documented option", NULL),
    P("cooling_co2", VL_PT_REAL, "", 1.0, 3.7, 0.0, 1e3, cool_co2,
      "c_CO2 in eps / (1 + c_CO2 x_CO2 + c_H2O f_strat)",
      "as planet.exobase.co2_cooling, from memory", COOLING),
    P("cooling_h2o", VL_PT_REAL, "", 1.0, 1.0, 0.0, 1e3, cool_h2o,
      "c_H2O in eps / (1 + c_CO2 x_CO2 + c_H2O f_strat)", "from memory", COOLING),
};

static const char *const columns[] = {"h_escape_h2_kg_s"};

/* b(H2-air), m^-1 s^-1 (Marrero & Mason 1972 via the CRC diffusion table). */
static double b_h2_air(double t_k) { return 1.89e21 * pow(t_k / 293.0, 0.75); }

/* b(H-O), m^-1 s^-1 (Zahnle & Kasting 1986, from memory). */
static double b_h_o(double t_k) { return 4.8e19 * pow(t_k, 0.75); }

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

/* Diffusion-limited H flux through the actual background (see file comment). */
static double diffusion_limit(const params *p, const vl_env *env, double f_t)
{
    double m_h = VL_AW_H * VL_AMU, m_o = VL_AW_O * VL_AMU;
    double w = fmin(fmax(env->f_strat, 0.0), 1.0);
    double t = p->homopause_temp_k;
    double m_bg = (1.0 - w) * env->m_background_kg + w * m_o;
    double m_c = (1.0 - w) * 2.0 * m_h + w * m_h;
    double b = 1.0 / ((1.0 - w) / b_h2_air(t) + w / b_h_o(t));
    double dm = m_bg - m_c;
    return dm > 0.0 ? 2.0 * f_t * b * env->g * dm / (VL_K_BOLTZMANN * t) : HUGE_VAL;
}

/* Deuterium fractionation of diffusion-limited escape (science.md section 8, from
 * memory): f = (b_D/b_H)(m_bg - m_D)/(m_bg - m_H), with b ~ 1/sqrt(reduced mass). */
static double diffusion_fractionation(const vl_env *env)
{
    double m_h = VL_AW_H * VL_AMU, m_d = VL_AW_D * VL_AMU, m_o = VL_AW_O * VL_AMU;
    double w = fmin(fmax(env->f_strat, 0.0), 1.0);
    double m_bg = (1.0 - w) * env->m_background_kg + w * m_o;
    if (!(m_bg > m_d))
        return 1.0;
    double mu_h = m_h * m_bg / (m_h + m_bg), mu_d = m_d * m_bg / (m_d + m_bg);
    return sqrt(mu_h / mu_d) * (m_bg - m_d) / (m_bg - m_h);
}

/* Deuterium fractionation of Jeans escape: the Jeans flux per particle of D over H at
 * the exobase, sqrt(m_H/m_D) (1 + l_D) e^-l_D / ((1 + l_H) e^-l_H), l_D = l_H m_D/m_H. */
static double jeans_fractionation(double lambda_h)
{
    double r = VL_AW_D / VL_AW_H, ld = lambda_h * r;
    return sqrt(1.0 / r) * (1.0 + ld) / (1.0 + lambda_h) * exp(lambda_h - ld);
}

/* Hydrodynamic weight at escape parameter lambda: 0 above lambda_c + 0.5, 1 below
 * lambda_c - 0.5, a smoothstep between (continuous with its derivative). */
static double hydro_weight(double lambda, double lambda_c)
{
    double u = lambda - (lambda_c - 0.5);
    u = u < 0.0 ? 0.0 : u > 1.0 ? 1.0 : u;
    return 1.0 - u * u * (3.0 - 2.0 * u);
}

/* Jeans-limited H flux per unit surface and the escape parameter; sets the
 * hydrodynamic weight. */
static void jeans_limit(const params *p, const vl_model *m, vl_env *env, double f_t)
{
    double m_h = VL_AW_H * VL_AMU, rp = m->sc->planet.radius_m;
    double h_h = VL_K_BOLTZMANN * env->t_exo_k / (m_h * env->g_exo);
    double n_h = 2.0 * f_t * env->n_tb_m3 * exp(-(env->r_exo_m - env->r_tb_m) / h_h);
    double ratio = env->r_exo_m / rp;
    env->esc_h_jeans = ratio * ratio * vl_upper_jeans_flux(n_h, m_h, env->t_exo_k, env->r_exo_m,
                                                           m->sc->planet.mass_kg, &env->lambda_h);
    env->esc_hydro = hydro_weight(env->lambda_h, p->lambda_crit);
    /* the bulk flow: hydrogen's hydrodynamic weight counts in proportion to its share of
     * the atoms above the homopause, s_H = 2 f_T / (1 + f_T); atomic O (the heavy
     * product of dissociated CO2, O2 and H2O) has its own escape parameter */
    double f = fmin(fmax(f_t, 0.0), 1.0), s_h = 2.0 * f / (1.0 + f);
    double w_o = hydro_weight(env->lambda_h * VL_AW_O / VL_AW_H, p->lambda_crit);
    env->esc_bulk_hydro = 1.0 - (1.0 - s_h * env->esc_hydro) * (1.0 - w_o);
}

static void prepare(const void *pv, const vl_model *m, const double *y, vl_env *env)
{
    const params *p = pv;
    (void)y;
    const vl_scenario *sc = m->sc;
    double m_h = VL_AW_H * VL_AMU;
    double r_xuv = p->xuv_radius_ratio * sc->planet.radius_m;
    double k = p->roche ? roche_factor(p, m) : 1.0;
    double eps = p->efficiency;
    if (p->cooling)
        eps /= 1.0 + p->cool_co2 * env->x[VL_GAS_CO2] + p->cool_h2o * env->f_strat;
    double mdot = eps * VL_PI * r_xuv * r_xuv * sc->planet.radius_m * env->f_xuv /
                  (VL_G_NEWTON * sc->planet.mass_kg * k);
    env->esc_mass_flux = mdot / m->area_m2;

    double f_t = env->f_strat + env->x[VL_GAS_H2];
    env->esc_h_diffusion = diffusion_limit(p, env, f_t);
    jeans_limit(p, m, env, f_t);
    vl_upper_h_escape(env, env->esc_mass_flux / m_h);
    env->esc_f_dl = diffusion_fractionation(env);
    env->esc_f_jeans = jeans_fractionation(env->lambda_h);
    /* energy-limited without drag: the flow carries D with H unless oxygen_drag (which
     * knows the crossover mass) refines it */
    vl_upper_d_fractionation(env, env->esc_mass_flux / m_h, 1.0);
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
    vl_flux_move_f(fx, VL_R_H2, VL_R_SPACE_H, atoms * VL_AW_H * 1e-3 / VL_AVOGADRO, 0,
                   env->esc_d_frac);
}

const vl_process vl_process_hydrogen_escape = {
    .name = "hydrogen_escape",
    .summary = "thermal hydrogen escape: least of diffusion, Jeans and energy limits",
    .refs = "Hunten 1973; Chamberlain & Hunten 1987; Watson, Donahue & Walker 1981; "
            "Erkaev et al. 2007",
    VL_PROCESS_TABLES(table, params, columns),
    .default_enabled = 1,
    .prepare = prepare,
    .rates = rates,
};
