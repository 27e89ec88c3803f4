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
 *  - where air rising on the dry adiabat becomes supersaturated, condensation at
 *    constant pressure warms it until it is just saturated (saturation adjustment:
 *    c_p dT = L dq, common practice of cloud models): in a dilute column it removes the
 *    excess vapour at almost constant temperature, in a steam column it puts the
 *    temperature back on the saturation curve; on the moist adiabat (whose lapse rate
 *    holds the latent heat) the vapour is simply what saturation allows;
 *  - a surface above water's critical point under more water than the critical
 *    pressure: if the adiabat from the surface reaches the critical temperature while
 *    the water's partial pressure still exceeds the critical pressure, the water there
 *    is a compressed liquid, an ocean on top of the hot supercritical layer; the
 *    radiating column is then that of an ocean at the critical temperature under its
 *    saturated steam (vl_profile_build);
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
    int moist;                  /* the last substep followed the moist adiabat */
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

/* Saturated within a relative 1e-9: a state put on the saturation curve (adjust, or
 * x_v = p_sat/p) must stay saturated despite rounding, or the next substep would leave
 * the curve on the dry adiabat and the column would flip between the two. */
static int saturated(const state *s, double p, double t)
{
    return t < VL_WATER_TC_K && s->x_v > 0.0 && s->x_v * p >= vl_water_psat(t) * (1.0 - 1e-9);
}

/* d ln p_sat / d ln T of water at t (centred difference, one-sided at the critical
 * point; the latent-heat blend near the triple point is the ice-liquid switch of
 * vl_water_psat, smoothed the same way). */
static double saturation_slope(double t)
{
    const double e = 1e-4;
    double hi = fmin(t * (1.0 + e), VL_WATER_TC_K), lo = hi - 2.0 * e * t;
    double cc = (log(vl_water_psat(hi)) - log(vl_water_psat(lo))) / log(hi / lo);
    /* blend: at the triple point the curve's slope jumps (sublimation to vaporisation) */
    double u = (t - (VL_WATER_TTRIPLE_K - 1.0)) / 2.0;
    if (u > 0.0 && u < 1.0) {
        double w_ice = 1.0 - u * u * (3.0 - 2.0 * u);
        double m_w = vl_species_molar_mass(VL_SP_H2O);
        cc = latent(t) / (VL_R_GAS / m_w * t) * w_ice + cc * (1.0 - w_ice);
    }
    return cc;
}

/* d ln T / d ln p at (ln p, t). */
static double lapse(const state *s, double lnp, double t)
{
    if (s->strat)
        return 0.0;
    double p = exp(lnp), m_a, cp_a;
    dry_props(s, &m_a, &cp_a);
    double m_w = vl_species_molar_mass(VL_SP_H2O);
    /* the branch is that of the substep's start (settle): deciding it at the RK2
     * midpoint would let a subsaturated column ride the moist adiabat, never reaching
     * saturation; a dry substep that overshoots is put back by the adjustment */
    if (!s->moist || !(t < VL_WATER_TC_K)) {
        double x_v = s->x_v, m = x_v * m_w + (1.0 - x_v) * m_a;
        double cp = (x_v * m_w * VL_WATER_CP_VAPOUR + (1.0 - x_v) * m_a * cp_a) / m;
        return VL_R_GAS / (m * cp);
    }
    /* L / (R_c T) is the slope d ln p_sat / d ln T of the saturation curve itself (the
     * ideal-gas Clausius-Clapeyron relation fails near the critical point, where the
     * Watson latent heat vanishes but the curve stays steep): the effective latent heat
     * keeps a steam column exactly on vl_water_psat */
    double pc = vl_water_psat(t), pa = p - pc, cc = saturation_slope(t);
    double r_a = VL_R_GAS / m_a, r_c = VL_R_GAS / m_w, l = cc * r_c * t;
    if (!(pa > 0.0))
        return 1.0 / cc;
    double r = (m_w / m_a) * pc / pa;
    double sl = cp_a / r_a * (1.0 + (VL_WATER_CP_VAPOUR / cp_a + (cc - 1.0) * l / (cp_a * t)) * r) /
                (1.0 + l * r / (r_a * t));
    return 1.0 / ((pa / p) * sl + (pc / p) * cc);
}

/* Water's mass fraction at mole fraction x_v over a dry part of molar mass m_a. */
static double mass_fraction(double x_v, double m_a)
{
    double m_w = vl_species_molar_mass(VL_SP_H2O);
    return x_v * m_w / (x_v * m_w + (1.0 - x_v) * m_a);
}

/* Saturation adjustment at pressure p: the temperature t' >= t at which the heat of the
 * condensed water, L (q - q_sat(t')), has warmed the air by c_p (t' - t); the water
 * left is saturated at t'. Bisection (the heat balance rises monotonically in t'),
 * bracketed by t and the saturation temperature of the water's partial pressure, or
 * the critical temperature when that exceeds the critical pressure. */
static void adjust(state *s, double p)
{
    double m_a, cp_a;
    dry_props(s, &m_a, &cp_a);
    double q = mass_fraction(s->x_v, m_a);
    double cp = q * VL_WATER_CP_VAPOUR + (1.0 - q) * cp_a, l = latent(s->t);
    double lo = s->t, hi = VL_WATER_TC_K * (1.0 - 1e-9);
    if (s->x_v * p < VL_WATER_PC_PA)
        hi = fmin(hi, vl_water_tsat(s->x_v * p));
    for (int i = 0; i < 50 && hi - lo > 1e-6 * hi; i++) {
        double t = 0.5 * (lo + hi);
        double qs = mass_fraction(fmin(vl_water_psat(t) / p, s->x_v), m_a);
        if (cp * (t - s->t) < l * (q - qs))
            lo = t;
        else
            hi = t;
    }
    s->t = lo;
    s->x_v = fmin(vl_water_psat(lo) / p, s->x_v);
}

/* After a substep: saturation, CO2 condensation and the tropopause. */
static void settle(state *s)
{
    double p = exp(s->lnp);
    /* on the moist adiabat the latent heat is in the lapse rate: the water left is
     * what saturation allows; arriving from the dry adiabat, the overshoot is condensed
     * with its heat */
    int sat = !s->strat && saturated(s, p, s->t);
    if (sat && s->moist)
        s->x_v = vl_water_psat(s->t) / p;
    else if (sat)
        adjust(s, p);
    s->moist = sat;
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
    s->moist = out->saturated_surface;
}

/* Whether the adiabat from a surface above the critical temperature, whose air holds
 * water at more than the critical pressure, reaches the critical temperature while the
 * water's partial pressure still exceeds the critical pressure (a liquid envelope). */
static int liquid_envelope(const state *s0, double p_s)
{
    if (s0->t < VL_WATER_TC_K || s0->x_v * p_s < VL_WATER_PC_PA)
        return 0;
    state s = *s0;
    s.lnp = log(p_s);
    while (s.t > VL_WATER_TC_K && s.x_v * exp(s.lnp) > VL_WATER_PC_PA) {
        double h = -0.05, k1 = lapse(&s, s.lnp, s.t);
        double k2 = lapse(&s, s.lnp + 0.5 * h, s.t * exp(0.5 * h * k1));
        s.t *= exp(h * k2);
        s.lnp += h;
    }
    return s.t <= VL_WATER_TC_K;
}

void vl_profile_build(const vl_column_gases *gs, double g, double t_s, double t_strat,
                      vl_profile *out)
{
    state s;
    surface(gs, g, t_s, &s, out);
    if (liquid_envelope(&s, out->p_surf)) {
        /* radiatively an ocean at the critical temperature under saturated steam; the
         * surface's own pressure and vapour are kept for the caller */
        double p_true = out->p_surf, vapour = out->vapour;
        vl_column_gases ocean = *gs;
        ocean.water = HUGE_VAL;
        vl_profile_build(&ocean, g, VL_WATER_TC_K * (1.0 - 1e-9), t_strat, out);
        out->p_surf = p_true;
        out->vapour = vapour;
        out->saturated_surface = 0;
        return;
    }
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
