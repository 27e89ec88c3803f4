/* upper.c: upper atmosphere and magnetosphere (upper.h).
 *
 * Exobase temperature: T_exo = max(T_skin, T_ref (F_XUV/F_ref)^b / (1 + c x_CO2)).
 * Thermosphere: isothermal lower atmosphere at the stratosphere temperature up to the
 * thermosphere base p_tb (the homopause), isothermal at T_exo above; the exobase is
 * where the column above equals one mean free path, N = 1/sigma: with scale heights
 * H = kT/(m g), z_tb = H_low ln(p_s/p_tb) and z_exo = z_tb + H_exo ln(N_tb sigma),
 * N_tb = p_tb/(m g) (flat geometry within each layer; the exobase radius sets the
 * escape parameter). Magnetopause: Chapman-Ferraro R_mp/R_p = [2 B_eq^2/(mu0 rho v^2)]^(1/6),
 * B_eq = mu0 M/(4 pi R_p^3); an unmagnetised planet (or a field too weak to hold the
 * wind off the ionosphere) has an induced obstacle at planet.induced_obstacle_rp.
 * Polar caps: dipole field lines from r_mp reach the surface at colatitude theta with
 * sin^2 theta = R_p/R_mp; both caps cover 1 - cos theta of the surface, tapered by
 * (1 - r_obs/R_mp) so that the open area vanishes continuously when the field can no
 * longer hold the wind above the induced obstacle r_obs. */
#include "volev/upper.h"

#include <math.h>

#include "volev/reservoir.h"
#include "volev/units.h"

double vl_upper_magnetopause_rp(double b_eq_t, double p_ram_pa)
{
    if (b_eq_t <= 0.0 || p_ram_pa <= 0.0)
        return 0.0;
    return pow(2.0 * b_eq_t * b_eq_t / (VL_MU0 * p_ram_pa), 1.0 / 6.0);
}

double vl_upper_jeans_flux(double n_m3, double m_kg, double t_k, double r_m, double mp_kg,
                           double *lambda_out)
{
    double lambda = VL_G_NEWTON * mp_kg * m_kg / (VL_K_BOLTZMANN * t_k * r_m);
    double v0 = sqrt(2.0 * VL_K_BOLTZMANN * t_k / m_kg);
    if (lambda_out)
        *lambda_out = lambda;
    return n_m3 * v0 / (2.0 * sqrt(VL_PI)) * (1.0 + lambda) * exp(-lambda);
}

void vl_upper_eval(const vl_planet_params *pl, vl_env *env)
{
    vl_upper *u = &env->upper;
    double rp = pl->radius_m;
    u->f_xuv_rel = env->f_xuv / VL_F_XUV_EARTH;

    /* exobase temperature, never below the (grey) skin temperature */
    double t_skin = pow(fmax(env->instellation, 0.0) / (8.0 * VL_SIGMA_SB), 0.25);
    double t_exo = pl->t_exo_ref_k * pow(fmax(u->f_xuv_rel, 0.0), pl->t_exo_xuv_exp) /
                   (1.0 + pl->t_exo_co2_cooling * env->x[VL_GAS_CO2]);
    u->t_exo_k = fmax(t_exo, t_skin);

    /* thermosphere base and exobase heights */
    double m = env->m_background_kg, g = env->g;
    double t_low = fmax(t_skin, 1.0);
    double p_s = env->p_surf_pa;
    double z_tb = p_s > pl->thermo_base_pa
                      ? VL_K_BOLTZMANN * t_low / (m * g) * log(p_s / pl->thermo_base_pa)
                      : 0.0;
    double p_tb = fmin(p_s, pl->thermo_base_pa);
    double n_col_tb = p_tb / (m * g);
    double h_exo = VL_K_BOLTZMANN * u->t_exo_k / (m * g);
    double z_exo = z_tb + (n_col_tb * pl->cross_section_m2 > 1.0
                               ? h_exo * log(n_col_tb * pl->cross_section_m2)
                               : 0.0);
    u->r_tb_m = rp + z_tb;
    u->n_tb_m3 = p_tb / (VL_K_BOLTZMANN * t_low);
    u->r_exo_m = rp + z_exo;
    u->m_exo_kg = m;
    u->g_exo = VL_G_NEWTON * pl->mass_kg / (u->r_exo_m * u->r_exo_m);
    u->n_exo_m3 = u->g_exo * m / (VL_K_BOLTZMANN * u->t_exo_k * pl->cross_section_m2);

    /* magnetosphere */
    u->b_eq_t = VL_MU0 * pl->dipole_am2 / (4.0 * VL_PI * rp * rp * rp);
    double r_mp = vl_upper_magnetopause_rp(u->b_eq_t, env->wind_pressure_pa);
    u->r_mp_rp = fmax(r_mp, pl->obstacle_rp);
    u->cap_fraction = r_mp > pl->obstacle_rp ? (1.0 - sqrt(1.0 - 1.0 / r_mp)) *
                                                     (1.0 - pl->obstacle_rp / r_mp)
                                               : 0.0;
}
