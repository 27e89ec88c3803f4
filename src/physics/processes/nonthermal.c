/* nonthermal.c: the scaling law shared by four non-thermal escape processes
 * (docs/escape.md):
 *   ion_pickup            ions picked up by the stellar wind (O+, H+, CO2+, N+)
 *   sputtering            neutrals knocked out by re-impacting pickup ions (O, CO2, N)
 *   photochemical_escape  hot atoms from dissociative recombination (O; C, N)
 *   polar_outflow         ions leaving along the open field lines of a dipole (O+, H+)
 *
 * Each element's rate, particles/s, is a present-day rate Q_ref measured at a reference
 * planet, scaled per unit surface and by the drivers:
 *   Q = Q_ref (A / A_ref) (F_XUV / F_ref)^a (p_sw / p_ref)^b  G  S  (1 - w_hydro)
 * G: gravity at the exobase against the reference's. Pickup and sputtering:
 *   (v_ref / v_esc)^(2 s) (a power of the escape-energy ratio); photochemical escape:
 *   the share of dissociative-recombination O atoms faster than escape, against the
 *   reference's. S: the magnetic field. Pickup and sputtering: exposure (r_obs / r_mp)^k,
 *   1 for an unmagnetised planet (r_mp is then the induced obstacle r_obs, upper.c).
 *   Polar outflow: the open-cap area against the reference's, times (1 - r_obs/r_mp)
 *   normalised the same way, which takes it continuously to 0 where the magnetopause
 *   comes down to the induced obstacle.
 * w_hydro: the bulk hydrodynamic weight (escape.c): hydrogen's, in proportion to
 *   its share of the upper atmosphere, combined with atomic oxygen's own: once the upper
 *   atmosphere as a whole flows out as a fluid, these exospheric channels fade out.
 * Two guards keep extrapolations physical; both are smooth minima that leave the
 * reference rates unchanged to 1e-10: at most one escaping particle per absorbed
 * ionising photon, and non-thermal hydrogen within the room the diffusion limit leaves
 * above the thermal escape (escape.c), shared by pickup and polar outflow.
 *
 * Sources: O from atmospheric O2; H from water, 2 H2O -> 4 H(space) + O2; N from N2;
 * C from CO2, as a whole ion or molecule (pickup, sputtering: CO2 -> C + 2 O, both to
 * space) or as a hot C atom whose oxygen stays (photochemical: CO2 -> C(space) + O2).
 * Each column is the mass flux of one element through one channel (kg/s), the oxygen
 * carried off with carbon included in the channel's O column. */
#include "nonthermal.h"

#include <math.h>

#include "volev/escape.h"
#include "volev/units.h"

const vl_transfer vl_nonthermal_transfers[2] = {
    [NT_O2_OUT] = {VL_R_O2, VL_R_SPACE_O},
    [NT_N2_OUT] = {VL_R_N2, VL_R_SPACE_N},
};

const vl_reaction vl_nonthermal_reactions[3] = {
    [NT_WATER_TO_H] = {"2 H2O -> 4 H(space) + O2", 3, {VL_R_WATER, VL_R_SPACE_H, VL_R_O2},
                       {-2.0, 4.0, 1.0}},
    [NT_CO2_TO_SPACE] = {"CO2 -> C(space) + 2 O(space)", 3,
                         {VL_R_CO2, VL_R_SPACE_C, VL_R_SPACE_O}, {-1.0, 1.0, 2.0}},
    [NT_CO2_KEEP_O] = {"CO2 -> C(space) + O2", 3, {VL_R_CO2, VL_R_SPACE_C, VL_R_O2},
                       {-1.0, 1.0, 1.0}},
};

/* Dissociative recombination O2+ + e -> O + O from the vibrational ground state: the
 * energy each O atom gets (half the channel's release) and the branching ratio
 * (Kella et al. 1997, from memory). */
static const double dr_energy_ev[4] = {3.495, 2.51, 1.53, 0.415};
static const double dr_branch[4] = {0.22, 0.42, 0.31, 0.05};

/* Surface, XUV and wind factor (A/A_ref)(F/F_ref)^a (p/p_ref)^b,
 * faded out with the bulk hydrodynamic weight (escape.c): once the upper
 * atmosphere as a whole flows out as a fluid the exospheric channels are part of that
 * flow. A thin hydrodynamic hydrogen trace in a heavy thermosphere does not count. */
double vl_nonthermal_drive(const vl_nonthermal_params *p, const vl_planet *pl, const vl_env *env)
{
    double area_ref = 4.0 * VL_PI * p->radius_m * p->radius_m;
    return (1.0 - env->escape.bulk_hydro) * pl->area_m2 / area_ref *
           pow(env->f_xuv / p->xuv_w_m2, p->xuv_exp) *
           pow(env->wind_pressure_pa / p->wind_pa, p->wind_exp);
}

/* Escape speed squared at the exobase, 2 G M / r_exo, m^2/s^2. */
static double v_esc2(const vl_planet *pl, const vl_env *env)
{
    return 2.0 * VL_G_NEWTON * pl->mass_kg / env->upper.r_exo_m;
}

/* (v_ref/v_esc)^(2 s): a power of the escape-energy ratio (any particle mass). */
double vl_nonthermal_gravity_power(const vl_nonthermal_params *p, const vl_planet *pl, const vl_env *env)
{
    return pow(p->v_esc_ref * p->v_esc_ref / v_esc2(pl, env), p->gravity_exp);
}

/* Share of recombination O atoms with more than the escape energy e_j: each channel
 * smoothed by a logistic step of width spread_j (Kella et al. 1997 channels). */
static double dr_fast_share(double e_j, double spread_j)
{
    double s = 0.0;
    for (int i = 0; i < 4; i++)
        s += dr_branch[i] / (1.0 + exp((e_j - dr_energy_ev[i] * EV) / spread_j));
    return s;
}

/* Photochemical gravity factor: fast share at this exobase over the reference's. */
double vl_nonthermal_dr_gravity(const vl_nonthermal_params *p, const vl_planet *pl, const vl_env *env)
{
    double m_o = vl_species_molar_mass(VL_SP_O) / VL_AVOGADRO;
    double e = 0.5 * m_o * v_esc2(pl, env), e_ref = 0.5 * m_o * p->v_esc_ref * p->v_esc_ref;
    return dr_fast_share(e, p->spread_j) / dr_fast_share(e_ref, p->spread_j);
}

/* Exposure of the exosphere to the wind, (r_obs/r_mp)^k: 1 without a dipole (upper.c
 * sets r_mp to the induced obstacle r_obs then). */
double vl_nonthermal_exposure(const vl_nonthermal_params *p, const vl_planet *pl, const vl_env *env)
{
    return pow(pl->obstacle_rp / env->upper.r_mp_rp, p->shield_exp);
}

/* Open-cap share of a dipole with stand-off r (planet radii): 1 - sqrt(1 - 1/r)
 * (dipole field lines, as upper.c). */
static double cap_share(double r) { return 1.0 - sqrt(1.0 - 1.0 / r); }

/* Polar factor: the open-cap area (upper.c: dipole mapping tapered by 1 - r_obs/r_mp,
 * continuous where the magnetopause meets the induced obstacle), over the reference's. */
double vl_nonthermal_polar_factor(const vl_nonthermal_params *p, const vl_planet *pl, const vl_env *env)
{
    double r_obs = pl->obstacle_rp;
    double ref = cap_share(p->mp_ref_rp) * (1.0 - r_obs / p->mp_ref_rp);
    return env->upper.cap_fraction / ref;
}

/* Scale q (particles/s) so that their sum stays within the ionising photons absorbed
 * over a share of the disc: F pi R^2 share / E_photon (a guard, smooth minimum). */
void vl_nonthermal_photon_guard(const vl_nonthermal_params *p, const vl_planet *pl, const vl_env *env, double share,
                         double q[NEL])
{
    double r = pl->radius_m;
    double budget = env->f_xuv * VL_PI * r * r * share / p->photon_j;
    double total = q[EL_O] + q[EL_H] + q[EL_C] + q[EL_N];
    double f = total > 0.0 ? vl_escape_softmin(total, budget) / total : 0.0;
    for (int el = 0; el < NEL; el++)
        q[el] *= f;
}

/* Remove q particles/s of each element through the flux API; map gives each element's
 * column. Carbon leaves as CO2 -> C + 2 O (whole) or CO2 -> C + O2 (keep_o). Hydrogen
 * carries deuterium at f_d times the water's D/H (issue: non-thermal fractionation is a
 * parameter of each H-removing channel). */
void vl_nonthermal_apply(const double q[NEL], const int map[NEL], int keep_o, double f_d, vl_flux *fx)
{
    double mm_o = vl_species_molar_mass(VL_SP_O), mm_h = vl_species_molar_mass(VL_SP_H);
    double mm_c = vl_species_molar_mass(VL_SP_C), mm_n = vl_species_molar_mass(VL_SP_N);
    if (map[EL_O] >= 0 && q[EL_O] > 0.0)
        vl_flux_transfer(fx, NT_O2_OUT, q[EL_O] / VL_AVOGADRO * mm_o, map[EL_O]);
    if (map[EL_N] >= 0 && q[EL_N] > 0.0)
        vl_flux_transfer(fx, NT_N2_OUT, q[EL_N] / VL_AVOGADRO * mm_n, map[EL_N]);
    if (map[EL_H] >= 0 && q[EL_H] > 0.0) {
        double e = vl_flux_react_f(fx, NT_WATER_TO_H, q[EL_H] / (4.0 * VL_AVOGADRO), -1, f_d);
        vl_flux_add_column(fx, map[EL_H], 4.0 * e * mm_h);
    }
    if (map[EL_C] >= 0 && q[EL_C] > 0.0) {
        double e = vl_flux_react(fx, keep_o ? NT_CO2_KEEP_O : NT_CO2_TO_SPACE,
                                 q[EL_C] / VL_AVOGADRO, -1);
        vl_flux_add_column(fx, map[EL_C], e * mm_c);
        if (!keep_o)
            vl_flux_add_column(fx, map[EL_O], 2.0 * e * mm_o);
    }
}


void vl_nonthermal_demand(const vl_nonthermal_params *p, const vl_view *v, double k,
                          double share, double q[NEL])
{
    for (int el = 0; el < NEL; el++)
        q[el] = p->ref[el] * k;
    vl_nonthermal_photon_guard(p, v->planet, v->env, share, q);
}

double vl_nonthermal_h_demand(const vl_nonthermal_params *p, const double q[NEL])
{
    return p->h_capped ? q[EL_H] : 0.0;
}

void vl_nonthermal_apply_capped(const vl_nonthermal_params *p, const vl_view *v, double q[NEL],
                                const int map[NEL], vl_flux *fx)
{
    if (p->h_capped)
        q[EL_H] *= v->env->escape.nt_h_factor;
    vl_nonthermal_apply(q, map, 0, p->f_d, fx);
}
