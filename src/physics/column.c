/* column.c: radiative column (column.h).
 *
 * Troposphere, integrated in ln T from the surface up to the stratosphere temperature:
 *  - wet (saturated): non-dilute moist pseudo-adiabat (Pierrehumbert 2010, Principles of
 *    Planetary Climate, eq. 2.33, from memory), with p_c = p_sat(T), r = (M_w/M_a) p_c/p_a:
 *      d ln p_a / d ln T = (c_pa/R_a) [1 + (c_pc/c_pa + (L/(R_c T) - 1) L/(c_pa T)) r]
 *                                     / [1 + L r / (R_a T)],
 *    which tends to the dry adiabat for r -> 0 and to the Clausius-Clapeyron curve
 *    for a pure steam column (p_a = 0: p = p_sat(T));
 *  - dry: d ln p / d ln T = c_pa / R_a.
 * Stratosphere: isothermal above the tropopause, with the tropopause mixing ratios.
 * Longwave: grey, two-stream without scattering, diffusivity D = 1.66,
 *   dtau = [k_w q_w (p/p0)^n_w + k_c F q_c (p/p0)^n_c] dp / g   (pressure broadening;
 *   n = 1 is the linear Lorentz law, n = 0 none), F = (u_sat/u) ln(1 + u/u_sat) the
 *   band saturation of the pressure-weighted CO2 column u (kg/m^2), plus CO2-CO2
 *   collision-induced absorption k_cia q_c^2 (p/p0) dp/g (density squared),
 *   OLR = sum over layers of sigma T^4 (e^{-D tau_top} - e^{-D tau_bottom})
 *         + sigma T_s^4 e^{-D tau_s}. */
#include "volev/column.h"

#include <math.h>

#include "volev/reservoir.h"
#include "volev/units.h"
#include "volev/water.h"

#define MAX_LEVELS 200
#define STEP_K 4.0 /* target temperature step of the tropospheric integration */

typedef struct {
    double t, pa, pc; /* temperature, non-condensing and vapour pressure, Pa */
} level;

/* d ln p_a / d ln T on the moist pseudo-adiabat (wet; psat = p_sat(t)) or the dry
 * adiabat. */
static double slope(const vl_column_opts *o, const vl_column_air *air, double t, double psat,
                    double pa)
{
    double r_a = VL_R_GAS / air->m_dry;
    double dry = air->cp_dry / r_a;
    if (!o->wet || pa <= 0.0)
        return dry;
    double m_w = vl_species_molar_mass(VL_SP_H2O);
    double r_c = VL_R_GAS / m_w;
    double l = vl_water_latent(t);
    double r = (m_w / air->m_dry) * psat / pa;
    double num = 1.0 + (VL_WATER_CP_VAPOUR / air->cp_dry +
                        (l / (r_c * t) - 1.0) * l / (air->cp_dry * t)) * r;
    return dry * num / (1.0 + l * r / (r_a * t));
}

/* x^n with the common exponents done without pow(). */
static double power(double x, double n)
{
    if (n == 1.0)
        return x;
    if (n == 0.5)
        return sqrt(x);
    if (n == 0.0)
        return 1.0;
    return pow(x, n);
}

/* Band saturation of CO2: the column's CO2 optical depth grows as u_sat ln(1 + u/u_sat)
 * with the pressure-weighted CO2 column u = q p_s (p_s/p0)^n / ((n + 1) g) (kg/m^2;
 * line strength and width enter together, as in the strong-line limit): linear for
 * u << u_sat (weak lines), logarithmic above (opaque band centre, absorbing wings).
 * Returned as the factor on the unsaturated optical depth. */
static double co2_saturation(const vl_column_opts *o, const vl_column_air *air)
{
    double ps = air->p_dry_pa;
    double u = air->q_co2 * ps * power(ps / o->p0, o->n_co2) / ((o->n_co2 + 1.0) * o->g);
    if (o->u_co2_sat <= 0.0 || u <= 0.0)
        return 1.0;
    return o->u_co2_sat / u * log1p(u / o->u_co2_sat);
}

/* Absorption per unit pressure, dtau/dp (1/Pa), of H2O and CO2 at a level; sat is the
 * CO2 band-saturation factor of the column. */
static void kappa(const vl_column_opts *o, const vl_column_air *air, double sat,
                  const level *lv, double *k_w, double *k_c)
{
    double m_w = vl_species_molar_mass(VL_SP_H2O);
    double wet_mass = lv->pc * m_w, dry_mass = lv->pa * air->m_dry;
    double q_w = wet_mass + dry_mass > 0.0 ? wet_mass / (wet_mass + dry_mass) : 0.0;
    double q_c = air->q_co2 * (1.0 - q_w);
    double x = (lv->pa + lv->pc) / o->p0;
    *k_w = o->k_h2o * q_w * power(x, o->n_h2o) / o->g;
    *k_c = (o->k_co2 * sat * q_c * power(x, o->n_co2) + o->k_cia * q_c * q_c * x) / o->g;
}

/* Levels of the troposphere from the surface (index 0) to the tropopause; returns count. */
static int troposphere(const vl_column_opts *o, const vl_column_air *air, double t_s,
                       double t_strat, level *lv)
{
    int n = (int)ceil((t_s - t_strat) / STEP_K);
    if (n < 1)
        n = 1;
    if (n > MAX_LEVELS - 1)
        n = MAX_LEVELS - 1;
    double dx = (log(t_strat) - log(t_s)) / n, x = log(t_s);
    double y = air->p_dry_pa > 0.0 ? log(air->p_dry_pa) : -INFINITY;
    for (int i = 0; i <= n; i++) {
        double t = exp(x);
        lv[i].t = t;
        lv[i].pa = exp(y);
        lv[i].pc = o->wet ? vl_water_psat(t) : 0.0;
        if (i == n || !isfinite(y))
            continue;
        /* midpoint rule in ln T */
        double k1 = slope(o, air, t, lv[i].pc, exp(y));
        double tm = exp(x + 0.5 * dx);
        double k2 = slope(o, air, tm, o->wet ? vl_water_psat(tm) : 0.0, exp(y + 0.5 * dx * k1));
        y += dx * k2;
        x += dx;
    }
    if (!isfinite(y)) /* pure steam: the non-condensing pressure stays 0 */
        for (int i = 0; i <= n; i++) {
            double t = exp(log(t_s) + i * dx);
            lv[i].t = t;
            lv[i].pa = 0.0;
            lv[i].pc = vl_water_psat(t);
        }
    return n + 1;
}

void vl_column_eval_fixed(const vl_column_opts *o, const vl_column_air *air, double t_s,
                          double t_strat, vl_column_out *out)
{
    level lv[MAX_LEVELS];
    double tau_up[MAX_LEVELS]; /* optical depth from the surface up to each level */
    if (t_strat > t_s)
        t_strat = t_s;
    int n = troposphere(o, air, t_s, t_strat, lv);
    tau_up[0] = 0.0;
    double sat = co2_saturation(o, air);
    double kw_prev, kc_prev;
    kappa(o, air, sat, &lv[0], &kw_prev, &kc_prev);
    for (int i = 1; i < n; i++) {
        double kw, kc;
        kappa(o, air, sat, &lv[i], &kw, &kc);
        double dp = (lv[i - 1].pa + lv[i - 1].pc) - (lv[i].pa + lv[i].pc);
        tau_up[i] = tau_up[i - 1] + 0.5 * (kw + kc + kw_prev + kc_prev) * fabs(dp);
        kw_prev = kw;
        kc_prev = kc;
    }
    const level *top = &lv[n - 1];
    double p_trop = top->pa + top->pc;
    /* stratosphere, mixing ratios fixed at the tropopause: the integral of
     * k q (p/p0)^n / g from 0 to p_trop is kappa(p_trop) p_trop / (n + 1); the
     * collision-induced part (n = 1) is taken with the band's exponent (exact for the
     * default n_co2 = 1) */
    double tau_strat = (kw_prev / (o->n_h2o + 1.0) + kc_prev / (o->n_co2 + 1.0)) * p_trop;
    double tau_tot = tau_up[n - 1] + tau_strat;
    const double d = VL_COLUMN_DIFFUSIVITY;
    double ts2 = t_strat * t_strat;
    double olr = VL_SIGMA_SB * ts2 * ts2 * -expm1(-d * tau_strat);
    /* transmission to space from each level; layer source = mean of the level sigma T^4 */
    double tr_above = exp(-d * (tau_tot - tau_up[n - 1]));
    double b_above = lv[n - 1].t * lv[n - 1].t * lv[n - 1].t * lv[n - 1].t;
    for (int i = n - 1; i > 0; i--) {
        double tr = exp(-d * (tau_tot - tau_up[i - 1]));
        double b = lv[i - 1].t * lv[i - 1].t * lv[i - 1].t * lv[i - 1].t;
        olr += 0.5 * VL_SIGMA_SB * (b + b_above) * (tr_above - tr);
        tr_above = tr;
        b_above = b;
    }
    olr += VL_SIGMA_SB * t_s * t_s * t_s * t_s * exp(-d * tau_tot);
    out->olr = olr;
    out->t_strat = t_strat;
    out->p_trop = p_trop;
    out->p_surf = lv[0].pa + lv[0].pc;
    out->f_strat = p_trop > 0.0 ? top->pc / p_trop : 0.0;
    out->tau = tau_tot;
}

void vl_column_eval(const vl_column_opts *o, const vl_column_air *air, double t_s,
                    double olr_guess, vl_column_out *out)
{
    /* default guess: near the grey runaway limit, capped by the surface emission */
    double olr = olr_guess > 0.0 ? olr_guess : fmin(280.0, VL_SIGMA_SB * pow(t_s, 4));
    for (int it = 0; it < 60; it++) {
        double t_strat = pow(olr / (2.0 * VL_SIGMA_SB), 0.25) - o->strat_offset_k;
        if (t_strat < 1.0)
            t_strat = 1.0;
        vl_column_eval_fixed(o, air, t_s, t_strat, out);
        if (fabs(out->olr - olr) < 1e-5 * olr)
            break;
        olr = out->olr;
    }
}
