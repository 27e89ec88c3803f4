/* water.c: saturation vapour pressure of water over liquid and ice (water.h). */
#include "volev/water.h"

#include <math.h>

/* Wagner & Pruss 1993 (J. Phys. Chem. Ref. Data 22:783), eq. 2.5: coefficients a1..a6
 * of the saturation line, also the IAPWS-95 auxiliary equation. */
static const double wp_a[6] = {-7.85951783, 1.84408259, -11.7866497,
                               22.6807411, -15.9618719, 1.80122502};

/* Saturation pressure over liquid water (Wagner & Pruss 1993, eq. 2.5):
 * ln(p/p_c) = (T_c/T)(a1 v + a2 v^1.5 + a3 v^3 + a4 v^3.5 + a5 v^4 + a6 v^7.5),
 * v = 1 - T/T_c. */
double vl_water_psat_liquid(double t_k)
{
    double v = 1.0 - t_k / VL_WATER_TC_K;
    double rv = sqrt(v);
    double v3 = v * v * v;
    double sum = wp_a[0] * v + wp_a[1] * v * rv + wp_a[2] * v3 + wp_a[3] * v3 * rv +
                 wp_a[4] * v3 * v + wp_a[5] * v3 * v3 * v * rv;
    return VL_WATER_PC_PA * exp(VL_WATER_TC_K / t_k * sum);
}

/* Saturation pressure over hexagonal ice (Murphy & Koop 2005, QJRMS 131:1539, eq. 7):
 * ln(p/Pa) = 9.550426 - 5723.265/T + 3.53068 ln T - 0.00728332 T. */
double vl_water_psat_ice(double t_k)
{
    return exp(9.550426 - 5723.265 / t_k + 3.53068 * log(t_k) - 0.00728332 * t_k);
}

/* Stable condensed phase: ice below the triple point, liquid up to the critical point.
 * At the triple point the two formulas agree to about 2e-9 relative. */
double vl_water_psat(double t_k)
{
    if (isnan(t_k)) /* passed on: the invariant guard names it */
        return t_k;
    if (t_k <= 0.0) /* the limit of the ice curve as T -> 0: no vapour */
        return 0.0;
    if (t_k < VL_WATER_TTRIPLE_K)
        return vl_water_psat_ice(t_k);
    if (t_k <= VL_WATER_TC_K)
        return vl_water_psat_liquid(t_k);
    return INFINITY;
}

double vl_water_tsat(double p_pa)
{
    if (p_pa >= VL_WATER_PC_PA)
        return VL_WATER_TC_K;
    double lo = 110.0, hi = VL_WATER_TC_K;
    if (!(p_pa > vl_water_psat(lo)))
        return lo;
    double lnp = log(p_pa);
    while (hi - lo > 1e-9 * hi) { /* ln psat rises monotonically with T */
        double mid = 0.5 * (lo + hi);
        if (log(vl_water_psat(mid)) < lnp)
            lo = mid;
        else
            hi = mid;
    }
    return 0.5 * (lo + hi);
}

#define L_TRIPLE 2.5009e6 /* J/kg, IAPWS-95 tables at 273.16 K, from memory */
#define L_FUSION 3.337e5  /* J/kg at 273.15 K, common practice */

/* Watson 1943 (Ind. Eng. Chem. 35:398) corresponding-states correlation, exponent 0.38. */
double vl_water_latent_vap(double t_k)
{
    if (t_k >= VL_WATER_TC_K)
        return 0.0;
    return L_TRIPLE * pow((VL_WATER_TC_K - t_k) / (VL_WATER_TC_K - VL_WATER_TTRIPLE_K), 0.38);
}

double vl_water_latent(double t_k)
{
    if (t_k < VL_WATER_TTRIPLE_K)
        return L_TRIPLE + L_FUSION;
    return vl_water_latent_vap(t_k);
}
