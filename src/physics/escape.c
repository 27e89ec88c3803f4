/* escape.c: the escape-budget stage (escape.h).
 *
 * Diffusion limit (Hunten 1973, J. Atmos. Sci. 30:1481), through the actual background:
 *   phi_H = 2 f_T / (1 + 2 w_O f_T) b g (m_bg - m_c) / (k T)   [H atoms m^-2 s^-1],
 *   f_T = f_strat + x_H2 (total hydrogen above the homopause, H2 units, a mole fraction of
 *   all the molecules). The background is the molecular gases (N2, CO2, O2; mean mass
 *   m_mol) and, above the cold trap, the O of dissociated water with share w_O = f_strat
 *   (a steam upper atmosphere is atomic O); m_bg = (1 - w_O) m_mol + w_O m_O, the carrier
 *   H2 in the molecular part and H in the O part, m_c = (1 - w_O) m_H2 + w_O m_H, and
 *   Blanc's law for the mixture 1/b = (1 - w_O)/b(H2-air) + w_O/b(H-O), with b(H2-air) =
 *   1.89e19 (T/293 K)^0.75 cm^-1 s^-1 (Marrero & Mason 1972, CRC table) and b(H-O) =
 *   4.8e17 T^0.75 cm^-1 s^-1 (Zahnle & Kasting 1986, from memory).
 *   Hunten's factor f/(1 + f) (f the carrier's ratio to the heavy background) is the
 *   carrier's mole fraction among all particles. f_T already is a mole fraction, so the
 *   molecular part needs no factor; dissociating the water-borne share w_O adds
 *   2 w_O f_T particles (H2O -> 2 H + O) per molecule, hence 1/(1 + 2 w_O f_T): in a
 *   steam upper atmosphere (w_O = f_T = 1) the H atoms are f/(1 + f) = 2/3 of the
 *   particles (f = H/O = 2), not 2.
 * Jeans limit (Jeans 1925; Chamberlain & Hunten 1987): the Jeans flux of H from an
 *   exobase density in diffusive equilibrium above the homopause,
 *   n_H = 2 f_T n_tb exp(-(r_exo - r_tb)/H_H), H_H = k T_exo/(m_H g_exo), times
 *   (r_exo/R_p)^2 per unit surface. Below the critical escape parameter lambda_c the flow
 *   turns hydrodynamic: the exobase cap blends smoothly (over lambda_c -+ 0.5) from
 *   min(Jeans, energy limit) to the energy limit.
 * Deuterium (docs/escape.md): diffusion limit f_dl = (b_D/b_H)(m_bg - m_cD)/(m_bg - m_cH)
 *   with the carriers HD/H2 (molecular part) and D/H (atomic part), b ~ mu^-1/2 (Zahnle &
 *   Kasting 1986; Yung et al. 1988, from memory); Jeans limit f_J = the per-particle
 *   Jeans flux ratio at the exobase times the diffusive separation between homopause and
 *   exobase, exp(-(r_exo - r_tb)(m_D - m_H) g_exo/(k T_exo)).
 * Energy limit (Watson, Donahue & Walker 1981, Icarus 48:150; Erkaev et al. 2007,
 *   A&A 472:329): Mdot = eps pi R_XUV^2 R_p F_XUV / (G M_p K),
 *   K = 1 - 3/(2 xi) + 1/(2 xi^3), xi = R_Roche / R_XUV, R_Roche = a (M_p / 3 M_*)^(1/3);
 *   optionally eps / (1 + c_CO2 x_CO2 + c_H2O f_strat) for radiative cooling by CO2 and
 *   H2O (the form of the exobase cooling in upper.c; coefficients from memory).
 * Oxygen drag (Hunten, Pepin & Walker 1987, Icarus 69:532). With crossover mass
 *   m_c = m_H + k T F_H / (b g X_H), oxygen escapes only if m_c > m_O:
 *   F_O = F_H (X_O/X_H)(m_c - m_O)/(m_c - m_H) = (X_O/X_H) F_H - X_O Phi,
 *   Phi = b g (m_O - m_H) / (k T), crossover flux F_ref = X_H Phi.
 *   Above F_ref the energy-limited mass flux F_m = m_H F_H + m_O F_O is shared:
 *   F_H = (F_m + m_O X_O Phi) / (m_H + m_O X_O / X_H).
 *   X_H = 2/3, X_O = 1/3 for the products of water photolysis; b = b(H-O). Below F_ref no
 *   O escapes and photolytic O2 accumulates. */
#include "volev/escape.h"

#include <math.h>
#include <string.h>

#include "volev/units.h"
#include "volev/upper.h"

#define X_H (2.0 / 3.0)
#define X_O (1.0 / 3.0)

/* b(H2-air), m^-1 s^-1 (Marrero & Mason 1972 via the CRC diffusion table). */
static double b_h2_air(double t_k) { return 1.89e21 * pow(t_k / 293.0, 0.75); }

/* b(H-O), m^-1 s^-1 (Zahnle & Kasting 1986, from memory). */
static double b_h_o(double t_k) { return 4.8e19 * pow(t_k, 0.75); }

/* Roche-lobe factor K of Erkaev et al. 2007 eq. 17, floored at 0.01 where the lobe
 * would lie inside R_XUV (the formula is not valid there). */
static double roche_factor(const vl_escape_params *p, const vl_planet *pl)
{
    double r_roche = pl->orbit_m * cbrt(pl->mass_kg / (3.0 * pl->star_mass_kg));
    double xi = r_roche / (p->xuv_radius_ratio * pl->radius_m);
    double k = 1.0 - 1.5 / xi + 0.5 / (xi * xi * xi);
    return k < 0.01 ? 0.01 : k;
}

/* Energy-limited mass flux per unit surface, kg m^-2 s^-1 (see file comment). */
static double energy_limit(const vl_escape_params *p, const vl_planet *pl, const vl_env *env)
{
    double r_xuv = p->xuv_radius_ratio * pl->radius_m;
    double k = p->roche ? roche_factor(p, pl) : 1.0;
    double eps = p->efficiency;
    if (p->cooling)
        eps /= 1.0 + p->cool_co2 * env->x[VL_GAS_CO2] + p->cool_h2o * env->f_strat;
    double mdot = eps * VL_PI * r_xuv * r_xuv * pl->radius_m * env->f_xuv /
                  (VL_G_NEWTON * pl->mass_kg * k);
    return mdot / pl->area_m2;
}

/* Hydrogen's carriers at the homopause and the background they diffuse through (see
 * file comment): the dissociated water's share w, the background's mean mass m_bg, the
 * carriers' mean mass m_c and their diffusion coefficient b (Blanc's law), cm^-1 s^-1. */
typedef struct {
    double w, m_bg, m_c, b;
} carriers;

static carriers hydrogen_carriers(double m_mol_kg, double w_o, double t_k)
{
    double m_h = VL_AW_H * VL_AMU, m_o = VL_AW_O * VL_AMU;
    carriers c;
    c.w = fmin(fmax(w_o, 0.0), 1.0);
    c.m_bg = (1.0 - c.w) * m_mol_kg + c.w * m_o;
    c.m_c = (1.0 - c.w) * 2.0 * m_h + c.w * m_h;
    c.b = 1.0 / ((1.0 - c.w) / b_h2_air(t_k) + c.w / b_h_o(t_k));
    return c;
}

/* Diffusion-limited H flux through the actual background (see file comment). */
static double diffusion_limit(const vl_escape_params *p, const vl_env *env, double f_t)
{
    double t = p->homopause_temp_k;
    carriers c = hydrogen_carriers(env->m_background_kg, env->f_strat, t);
    double dm = c.m_bg - c.m_c;
    /* H atoms (in carriers) per particle: the molecular f_T, diluted by the particles the
     * dissociated water-borne share adds (see file comment) */
    double x_h = 2.0 * f_t / (1.0 + 2.0 * c.w * f_t);
    return dm > 0.0 ? x_h * c.b * env->g * dm / (VL_K_BOLTZMANN * t) : HUGE_VAL;
}

/* Binary diffusion coefficient of a carrier of mass m_kg through a background whose
 * coefficient for a carrier of mass m_ref_kg is b_ref: b ~ mu^-1/2 at fixed collision
 * cross section (from memory), mu the reduced mass with the background m_bg_kg. */
static double b_isotope(double b_ref, double m_ref_kg, double m_kg, double m_bg_kg)
{
    double mu_ref = m_ref_kg * m_bg_kg / (m_ref_kg + m_bg_kg);
    double mu = m_kg * m_bg_kg / (m_kg + m_bg_kg);
    return b_ref * sqrt(mu_ref / mu);
}

double vl_escape_diffusion_fractionation(double m_mol_kg, double w_o, double t_k)
{
    double m_h = VL_AW_H * VL_AMU, m_d = VL_AW_D * VL_AMU, m_o = VL_AW_O * VL_AMU;
    double m_hd = m_h + m_d;
    carriers h = hydrogen_carriers(m_mol_kg, w_o, t_k);
    double w = h.w, m_cd = (1.0 - w) * m_hd + w * m_d;
    if (!(h.m_bg > m_cd))
        return 0.0; /* D's carrier no lighter than the background: it stays (continuous) */
    double b_d = 1.0 / ((1.0 - w) / b_isotope(b_h2_air(t_k), 2.0 * m_h, m_hd, m_mol_kg) +
                        w / b_isotope(b_h_o(t_k), m_h, m_d, m_o));
    double f = (b_d / h.b) * (h.m_bg - m_cd) / (h.m_bg - h.m_c);
    return f > 1.0 ? 1.0 : f;
}

double vl_escape_jeans_separation(const vl_upper *u)
{
    double dr = fmax(u->r_exo_m - u->r_tb_m, 0.0);
    double x = dr * (VL_AW_D - VL_AW_H) * VL_AMU * u->g_exo / (VL_K_BOLTZMANN * u->t_exo_k);
    return x > 0.0 ? exp(-x) : 1.0; /* also 1 for 0/0 (no thermosphere, no temperature) */
}

/* Deuterium fractionation of Jeans escape: the Jeans flux per particle of D over H at
 * the exobase, sqrt(m_H/m_D) (1 + l_D) e^-l_D / ((1 + l_H) e^-l_H), l_D = l_H m_D/m_H,
 * times the exobase's D/H over the homopause's (vl_escape_jeans_separation). */
static double jeans_fractionation(double lambda_h, double separation)
{
    double r = VL_AW_D / VL_AW_H, ld = lambda_h * r;
    return sqrt(1.0 / r) * (1.0 + ld) / (1.0 + lambda_h) * exp(lambda_h - ld) * separation;
}

/* Hydrodynamic weight at escape parameter lambda: 0 above lambda_c + 0.5, 1 below
 * lambda_c - 0.5, a smoothstep between (continuous with its derivative). */
static double hydro_weight(double lambda, double lambda_c)
{
    double u = lambda - (lambda_c - 0.5);
    u = u < 0.0 ? 0.0 : u > 1.0 ? 1.0 : u;
    return 1.0 - u * u * (3.0 - 2.0 * u);
}

/* Jeans-limited H flux per unit surface, the escape parameter and the hydrodynamic
 * weights of hydrogen and of the bulk upper atmosphere. */
static void jeans_limit(const vl_escape_params *p, const vl_planet *pl, vl_env *env, double f_t)
{
    const vl_upper *u = &env->upper;
    vl_escape *e = &env->escape;
    double m_h = VL_AW_H * VL_AMU, rp = pl->radius_m;
    double h_h = VL_K_BOLTZMANN * u->t_exo_k / (m_h * u->g_exo);
    double n_h = 2.0 * f_t * u->n_tb_m3 * exp(-(u->r_exo_m - u->r_tb_m) / h_h);
    double ratio = u->r_exo_m / rp;
    e->h_jeans = ratio * ratio * vl_upper_jeans_flux(n_h, m_h, u->t_exo_k, u->r_exo_m,
                                                     pl->mass_kg, &e->lambda_h);
    e->hydro = hydro_weight(e->lambda_h, p->lambda_crit);
    /* the bulk flow: hydrogen's hydrodynamic weight counts in proportion to its share of
     * the atoms above the homopause, s_H = 2 f_T / (1 + f_T); atomic O (the heavy
     * product of dissociated CO2, O2 and H2O) has its own escape parameter */
    double f = fmin(fmax(f_t, 0.0), 1.0), s_h = 2.0 * f / (1.0 + f);
    double w_o = hydro_weight(e->lambda_h * VL_AW_O / VL_AW_H, p->lambda_crit);
    e->bulk_hydro = 1.0 - (1.0 - s_h * e->hydro) * (1.0 - w_o);
}

void vl_escape_limits(const vl_escape_params *p, const vl_planet *pl, vl_env *env)
{
    vl_escape *e = &env->escape;
    e->mass_flux = energy_limit(p, pl, env);
    double f_t = env->f_strat + env->x[VL_GAS_H2];
    e->h_diffusion = diffusion_limit(p, env, f_t);
    jeans_limit(p, pl, env, f_t);
    e->f_dl = vl_escape_diffusion_fractionation(env->m_background_kg, env->f_strat,
                                                p->homopause_temp_k);
    e->f_jeans = jeans_fractionation(e->lambda_h, vl_escape_jeans_separation(&env->upper));
    e->water_share = f_t > 0.0 ? env->f_strat / f_t : 0.0;
}

/* Energy-limited budget with drag (see file comment). */
static void share_with_drag(const vl_escape_params *p, vl_env *env)
{
    vl_escape *e = &env->escape;
    double m_h = VL_AW_H * VL_AMU, m_o = VL_AW_O * VL_AMU, t = p->drag_temp_k;
    double phi = b_h_o(t) * env->g * (m_o - m_h) / (VL_K_BOLTZMANN * t);
    double h_el = e->mass_flux / m_h;
    if (h_el > X_H * phi)
        h_el = (e->mass_flux + m_o * X_O * phi) / (m_h + m_o * X_O / X_H);
    vl_escape_h_flux(e, h_el);
    /* crossover mass of the escaping flow and its deuterium fractionation */
    double m_c = m_h + VL_K_BOLTZMANN * t * e->h_flux / (b_h_o(t) * env->g * X_H);
    vl_escape_d_fractionation(e, h_el, vl_escape_drag_fractionation(m_c));
    double f_o = (X_O / X_H) * e->h_flux - X_O * phi;
    e->o_flux = f_o > 0.0 ? f_o : 0.0;
}

void vl_escape_share(const vl_escape_params *p, vl_env *env)
{
    vl_escape *e = &env->escape;
    if (p->drag) {
        share_with_drag(p, env);
        return;
    }
    /* without drag every energy-limited atom is hydrogen and carries D with it */
    double h_el = e->mass_flux / (VL_AW_H * VL_AMU);
    vl_escape_h_flux(e, h_el);
    vl_escape_d_fractionation(e, h_el, 1.0);
    e->o_flux = 0.0;
}

void vl_escape_eval(const vl_escape_params *p, const vl_planet *pl, vl_env *env)
{
    memset(&env->escape, 0, sizeof env->escape);
    if (!p->thermal)
        return;
    vl_escape_limits(p, pl, env);
    vl_escape_share(p, env);
}

void vl_escape_h_flux(vl_escape *e, double h_el)
{
    double jeans = fmin(e->h_jeans, h_el);
    double cap = (1.0 - e->hydro) * jeans + e->hydro * h_el;
    if (e->h_diffusion <= cap) {
        e->h_flux = e->h_diffusion;
        e->h_limit = VL_HLIM_DIFFUSION;
    } else {
        e->h_flux = cap;
        e->h_limit = e->hydro < 0.5 && e->h_jeans < h_el ? VL_HLIM_JEANS : VL_HLIM_ENERGY;
    }
}

double vl_escape_drag_fractionation(double m_c_kg)
{
    double m_h = VL_AW_H * VL_AMU, m_d = VL_AW_D * VL_AMU;
    if (!(m_c_kg > m_h))
        return 1.0;
    double f = (m_c_kg - m_d) / (m_c_kg - m_h);
    return f < 0.0 ? 0.0 : f > 1.0 ? 1.0 : f;
}

/* Weight of a when the smaller of a and b binds: 1/(1 + (a/b)^8), smooth. */
static double smaller_weight(double a, double b)
{
    if (!(a > 0.0))
        return 1.0;
    if (!(b > 0.0) || !isfinite(a))
        return 0.0;
    if (!isfinite(b))
        return 1.0;
    double x = 8.0 * (log(a) - log(b));
    return x > 700.0 ? 0.0 : 1.0 / (1.0 + exp(x));
}

void vl_escape_d_fractionation(vl_escape *e, double h_el, double f_el)
{
    double s_j = smaller_weight(e->h_jeans, h_el);
    double f_kin = s_j * e->f_jeans + (1.0 - s_j) * f_el;
    double f_cap = (1.0 - e->hydro) * f_kin + e->hydro * f_el;
    double jeans = fmin(e->h_jeans, h_el);
    double cap = (1.0 - e->hydro) * jeans + e->hydro * h_el;
    double s_d = smaller_weight(e->h_diffusion, cap);
    e->d_frac = s_d * e->f_dl + (1.0 - s_d) * f_cap;
}

double vl_escape_softmin(double a, double b)
{
    if (!(a > 0.0) || !(b > 0.0))
        return 0.0;
    double lo = fmin(a, b), hi = fmax(a, b), r = lo / hi;
    return lo / sqrt(sqrt(1.0 + r * r * r * r));
}

double vl_escape_h_room_factor(const vl_escape_params *p, const vl_planet *pl,
                               const vl_escape *e, double demand)
{
    if (!p->thermal || !isfinite(e->h_diffusion))
        return 1.0;
    double room = fmax(e->h_diffusion - e->h_flux, 0.0) * pl->area_m2;
    return demand > 0.0 ? vl_escape_softmin(demand, room) / demand : 0.0;
}
