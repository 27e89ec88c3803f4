/* ocean.c: equilibrium split of the exchangeable CO2 between atmosphere and ocean
 * (ocean.h). Dissolved inorganic carbon per m^3 of ocean,
 *   DIC(p) = kh p + ks sqrt(p),   kh = H(T),   ks = (D0 - c0) sqrt(H(T) / c0),
 * (Henry's law, Sander compilation; bicarbonate at calcite saturation, ocean.h), and
 * the CO2 in a dry atmosphere at partial pressure p, n_atm(p), are both increasing in p,
 * so total(p) = n_atm(p) + V DIC(p) = N has one root, found by bracketed false position
 * in ln p. Concentrations inside are mol/m^3 (mol/kg times the density). */
#include "volev/ocean.h"

#include <math.h>

#include "volev/env.h"
#include "volev/reservoir.h"

typedef struct {
    double kh, ks;           /* DIC = kh p + ks sqrt(p): mol m^-3 Pa^-1, mol m^-3 Pa^-1/2 */
    double ocean_m3;
    const vl_ocean_air *air;
} problem;

/* The two coefficients of DIC(p) at t_k. */
static void coefficients(double t_k, problem *p)
{
    double rho = VL_OCEAN_DENSITY_KG_M3;
    double c0 = vl_ocean_henry(VL_OCEAN_T_REF_K) * VL_OCEAN_PCO2_REF_PA;
    p->kh = vl_ocean_henry(t_k);
    p->ks = (VL_OCEAN_DIC_REF_MOL_KG * rho - c0) * sqrt(p->kh / c0);
}

static double dic(const problem *p, double p_pa)
{
    return p->kh * p_pa + p->ks * sqrt(p_pa);
}

/* Moles of CO2 in a dry atmosphere whose CO2 partial pressure is p_pa: from
 * p = n (M_o + mu n) (g/A) / (n_o + n), i.e. mu n^2 + (M_o - P) n - P n_o = 0 with
 * P = p A / g, positive root in the cancellation-free form. */
static double atm_mol(double p_pa, const vl_ocean_air *air)
{
    double mu = vl_species_molar_mass(VL_SP_CO2);
    double big_p = p_pa / air->pa_per_kg;
    double b = air->other_kg - big_p, c = big_p * air->other_mol;
    double d = sqrt(b * b + 4.0 * mu * c);
    return b > 0.0 ? 2.0 * c / (b + d) : (d - b) / (2.0 * mu);
}

/* The CO2 partial pressure of n mol of CO2 in the dry air (inverse of atm_mol). */
static double atm_pa(double n, const vl_ocean_air *air)
{
    double mu = vl_species_molar_mass(VL_SP_CO2);
    return n * (air->other_kg + mu * n) * air->pa_per_kg / (air->other_mol + n);
}

/* Moles of exchangeable carbon, atmosphere + ocean, at partial pressure p_pa. */
static double total(const problem *p, double p_pa)
{
    return atm_mol(p_pa, p->air) + p->ocean_m3 * dic(p, p_pa);
}

/* The partial pressure at which each of the three carbon pools alone would hold n mol;
 * the smallest of them. */
static double pool_bound(const problem *p, double n)
{
    double by_atm = atm_pa(n, p->air);
    double by_gas = n / (p->ocean_m3 * p->kh);
    double r = n / (p->ocean_m3 * p->ks);
    return fmin(by_atm, fmin(by_gas, r * r));
}

/* Partial pressure at which total = n (> 0). The root lies in [b(n/3), b(n)] with b the
 * pool bound (each pool is increasing and at most n/3 below, one of them n above); false
 * position with the Illinois modification (Dowell & Jarratt 1971, BIT 11:168) in ln p to
 * a bracket of 1e-14 relative. */
static double solve_pa(const problem *p, double n)
{
    double lo = log(pool_bound(p, n / 3.0)), hi = log(pool_bound(p, n));
    double flo = total(p, exp(lo)) - n, fhi = total(p, exp(hi)) - n;
    if (flo >= 0.0)
        return exp(lo);
    if (fhi <= 0.0)
        return exp(hi);
    int side = 0;
    for (int it = 0; it < 200 && hi - lo > 1e-14 * fmax(1.0, fabs(hi)); it++) {
        double u = (lo * fhi - hi * flo) / (fhi - flo);
        if (!(u > lo && u < hi))
            u = 0.5 * (lo + hi);
        double fu = total(p, exp(u)) - n;
        if (fu < 0.0) {
            lo = u;
            flo = fu;
            if (side < 0)
                fhi *= 0.5;
            side = -1;
        } else if (fu > 0.0) {
            hi = u;
            fhi = fu;
            if (side > 0)
                flo *= 0.5;
            side = 1;
        } else {
            return exp(u);
        }
    }
    return exp(0.5 * (lo + hi));
}

int vl_ocean_holds_carbon(int regime)
{
    return regime == VL_REGIME_FROZEN || regime == VL_REGIME_TEMPERATE ||
           regime == VL_REGIME_MOIST;
}

double vl_ocean_henry(double t_k)
{
    return VL_OCEAN_HENRY_298 * exp(VL_OCEAN_HENRY_DT_K * (1.0 / t_k - 1.0 / VL_OCEAN_HENRY_REF_K));
}

double vl_ocean_dic(double p_co2_pa, double t_k)
{
    problem p;
    coefficients(t_k, &p);
    return p_co2_pa > 0.0 ? dic(&p, p_co2_pa) : 0.0;
}

double vl_ocean_atm_co2(double surface_kg, double ocean_m3, double t_k, const vl_ocean_air *air)
{
    if (!(surface_kg > 0.0))
        return 0.0;
    if (!(ocean_m3 > 0.0))
        return surface_kg;
    double mu = vl_species_molar_mass(VL_SP_CO2);
    problem p = {0.0, 0.0, ocean_m3, air};
    coefficients(t_k, &p);
    double atm = atm_mol(solve_pa(&p, surface_kg / mu), air) * mu;
    return atm < surface_kg ? atm : surface_kg;
}
