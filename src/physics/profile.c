/* profile.c: the column's temperature and composition (profile.h).
 *
 * Levels are fixed in log pressure from the surface to p_top = min(1e-2 Pa, 1e-5 p_s),
 * stretched so that they are closer near the surface (LEVEL_STRETCH).
 * Between levels the state is carried upward in ln p with midpoint (RK2) substeps:
 *  - unsaturated: the dry adiabat of the mixture, d ln T / d ln p = R / (M c_p), vapour
 *    included as a non-condensing gas (this holds above water's critical point too);
 *  - saturated with water: the non-dilute moist pseudo-adiabat (Pierrehumbert 2010,
 *    Principles of Planetary Climate, eq. 2.33), with p_c = p_sat(T), p_a = p - p_c,
 *    r = (M_w/M_a) p_c/p_a and S = d ln p_a / d ln T =
 *      (c_pa/R_a) [1 + (c_pc/c_pa + (L/(R_c T) - 1) L/(c_pa T)) r] / [1 + L r/(R_a T)],
 *    so d ln T / d ln p = 1 / [(p_a/p) S + (p_c/p) L/(R_c T)]; in a pure steam column
 *    this is the Clausius-Clapeyron curve. The latent heat blends sublimation into
 *    vaporisation over 272.16-274.16 K so the slope has no step at the triple point;
 *  - CO2 condenses where its partial pressure exceeds saturation (co2.h): the
 *    temperature is held on its saturation curve (the limit of a CO2 pseudo-adiabat,
 *    as in Kasting 1991, Icarus 94:1), its mixing ratio unchanged (documented);
 *  - the stratosphere, once the temperature reaches t_strat, is isothermal with the
 *    water mixing ratio of the tropopause (the cold trap). */
#include "volev/profile.h"

#include <math.h>
#include <string.h>

#include "climate_internal.h"
#include "volev/co2.h"
#include "volev/column.h"
#include "volev/reservoir.h"
#include "volev/units.h"
#include "volev/water.h"

#define SUBSTEPS 4
#define P_TOP_PA 1e-2
/* Levels at ln p = ln p_s + (ln p_top - ln p_s) (k/(n-1))^LEVEL_STRETCH: closer together
 * near the surface, where the troposphere emits, than in the stratosphere. */
#ifndef LEVEL_STRETCH
#define LEVEL_STRETCH 1.6
#endif

static const int gas_species[VL_NGASES] = {VL_SP_H2O, VL_SP_CO2, VL_SP_N2, VL_SP_O2, VL_SP_H2};
static const double gas_cp[VL_NGASES] = {VL_WATER_CP_VAPOUR, VL_CP_CO2, VL_CP_N2, VL_CP_O2,
                                         VL_CP_H2};

double vl_profile_vapour(const vl_column_gases *gs, double g, double t_s)
{
    if (!(gs->water > 0.0))
        return 0.0;
    if (t_s >= VL_WATER_TC_K)
        return gs->water;
    vl_dry_air air;
    air.mass_kg = gs->co2 + gs->bg + gs->h2;
    air.co2_mol = gs->co2 / vl_species_molar_mass(VL_SP_CO2);
    air.mol = air.co2_mol + gs->bg / vl_species_molar_mass(VL_SP_N2) +
              gs->h2 / vl_species_molar_mass(VL_SP_H2);
    return vl_climate_saturated_vapour(vl_water_psat(t_s), g, 1.0, &air, gs->water);
}

/* Latent heat of water, J/kg, with sublimation blended into vaporisation over 2 K
 * around the triple point (smoothstep; the mixed-phase range, common practice). */
static double latent(double t)
{
    double u = (t - (VL_WATER_TTRIPLE_K - 1.0)) / 2.0;
    u = u < 0.0 ? 0.0 : u > 1.0 ? 1.0 : u;
    double w_ice = 1.0 - u * u * (3.0 - 2.0 * u);
    return vl_water_latent_vap(t < VL_WATER_TTRIPLE_K ? VL_WATER_TTRIPLE_K : t) + 3.337e5 * w_ice;
}

/* What is carried up the column. */
typedef struct {
    double lnp, t;
    double x_v;                 /* water mole fraction */
    double dry[VL_NGASES];      /* composition of the dry part (sums to 1, no H2O) */
    int strat;                  /* above the tropopause */
    double t_strat;
} state;

/* Mean molar mass and c_p (per kg) of the dry part. */
static void dry_props(const state *s, double *m, double *cp)
{
    double mm = 0.0, c = 0.0;
    for (int i = 1; i < VL_NGASES; i++)
        mm += s->dry[i] * vl_species_molar_mass(gas_species[i]);
    for (int i = 1; i < VL_NGASES; i++)
        c += s->dry[i] * vl_species_molar_mass(gas_species[i]) / mm * gas_cp[i];
    *m = mm > 0.0 ? mm : vl_species_molar_mass(VL_SP_N2);
    *cp = mm > 0.0 ? c : VL_CP_N2;
}

static int saturated(const state *s, double p, double t)
{
    return t < VL_WATER_TC_K && s->x_v > 0.0 && s->x_v * p >= vl_water_psat(t);
}

/* d ln T / d ln p at (ln p, t). */
static double lapse(const state *s, double lnp, double t)
{
    if (s->strat)
        return 0.0;
    double p = exp(lnp), m_a, cp_a;
    dry_props(s, &m_a, &cp_a);
    double m_w = vl_species_molar_mass(VL_SP_H2O);
    if (!saturated(s, p, t)) {
        double x_v = s->x_v, m = x_v * m_w + (1.0 - x_v) * m_a;
        double cp = (x_v * m_w * VL_WATER_CP_VAPOUR + (1.0 - x_v) * m_a * cp_a) / m;
        return VL_R_GAS / (m * cp);
    }
    double pc = vl_water_psat(t), pa = p - pc, l = latent(t);
    double r_a = VL_R_GAS / m_a, r_c = VL_R_GAS / m_w, cc = l / (r_c * t);
    if (!(pa > 0.0))
        return 1.0 / cc;
    double r = (m_w / m_a) * pc / pa;
    double sl = cp_a / r_a * (1.0 + (VL_WATER_CP_VAPOUR / cp_a + (cc - 1.0) * l / (cp_a * t)) * r) /
                (1.0 + l * r / (r_a * t));
    return 1.0 / ((pa / p) * sl + (pc / p) * cc);
}

/* After a substep: saturation, CO2 condensation and the tropopause. */
static void settle(state *s)
{
    double p = exp(s->lnp);
    if (!s->strat && saturated(s, p, s->t))
        s->x_v = vl_water_psat(s->t) / p;
    double p_co2 = (1.0 - s->x_v) * s->dry[1] * p;
    if (p_co2 > 0.0 && vl_co2_psat(s->t) < p_co2)
        s->t = vl_co2_tsat(p_co2);
    if (!s->strat && s->t <= s->t_strat) {
        s->t = s->t_strat;
        s->strat = 1;
    }
}

/* Carry s up to ln p = lnp1. */
static void climb(state *s, double lnp1)
{
    double h = (lnp1 - s->lnp) / SUBSTEPS;
    for (int k = 0; k < SUBSTEPS; k++) {
        double k1 = lapse(s, s->lnp, s->t);
        double tm = s->t * exp(0.5 * h * k1);
        double k2 = lapse(s, s->lnp + 0.5 * h, tm);
        s->t *= exp(h * k2);
        s->lnp += h;
        settle(s);
    }
}

static void record(const state *s, vl_profile *out, int k)
{
    out->p[k] = exp(s->lnp);
    out->t[k] = s->t;
    double mm = 0.0;
    for (int i = 0; i < VL_NGASES; i++) {
        out->x[k][i] = i == 0 ? s->x_v : (1.0 - s->x_v) * s->dry[i];
        mm += out->x[k][i] * vl_species_molar_mass(gas_species[i]);
    }
    out->m_mean[k] = mm;
}

/* The surface state: dry composition, vapour and pressure. */
static void surface(const vl_column_gases *gs, double g, double t_s, state *s, vl_profile *out)
{
    double n_c = gs->co2 / vl_species_molar_mass(VL_SP_CO2);
    double n_b = gs->bg / vl_species_molar_mass(VL_SP_N2);
    double n_h = gs->h2 / vl_species_molar_mass(VL_SP_H2);
    double n_d = n_c + n_b + n_h;
    memset(s->dry, 0, sizeof s->dry);
    if (n_d > 0.0) {
        s->dry[1] = n_c / n_d;
        s->dry[2] = n_b / n_d;
        s->dry[4] = n_h / n_d;
    } else {
        s->dry[2] = 1.0; /* no dry gas: composition of a trace of N2 */
    }
    out->vapour = vl_profile_vapour(gs, g, t_s);
    double n_v = out->vapour / vl_species_molar_mass(VL_SP_H2O);
    s->x_v = n_v + n_d > 0.0 ? n_v / (n_v + n_d) : 0.0;
    out->p_surf = (gs->co2 + gs->bg + gs->h2 + out->vapour) * g;
    out->saturated_surface = t_s < VL_WATER_TC_K && out->vapour < gs->water;
    s->t = t_s;
    s->strat = 0;
}

void vl_profile_build(const vl_column_gases *gs, double g, double t_s, double t_strat,
                      vl_profile *out)
{
    state s;
    surface(gs, g, t_s, &s, out);
    s.t_strat = t_strat < t_s ? t_strat : t_s;
    double ps = out->p_surf > 1e-30 ? out->p_surf : 1e-30;
    double ptop = fmin(P_TOP_PA, 1e-5 * ps);
    int n = VL_PROFILE_LEVELS;
    s.lnp = log(ps);
    if (s.t <= s.t_strat)
        s.strat = 1;
    record(&s, out, 0);
    out->p_trop = ps;
    for (int k = 1; k < n; k++) {
        int was_strat = s.strat;
        climb(&s, log(ps) + (log(ptop) - log(ps)) * pow((double)k / (n - 1), LEVEL_STRETCH));
        if (s.strat && !was_strat)
            out->p_trop = exp(s.lnp);
        record(&s, out, k);
    }
    out->n = n;
    out->t_strat = s.t_strat;
    out->f_strat = s.x_v;
    if (!s.strat)
        out->p_trop = out->p[n - 1];
}
