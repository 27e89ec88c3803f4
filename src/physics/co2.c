/* co2.c: the saturation curve of CO2 (co2.h). */
#include "volev/co2.h"

#include <math.h>

/* Vapour pressure over the liquid (Span & Wagner 1996, eq. 3.13, coefficients from
 * memory): ln(p/p_c) = (T_c/T) sum a_i (1 - T/T_c)^t_i. */
static double over_liquid(double t_k)
{
    static const double a[4] = {-7.0602087, 1.9391218, -1.6463597, -3.2995634};
    static const double t[4] = {1.0, 1.5, 2.0, 4.0};
    double v = 1.0 - t_k / VL_CO2_TC_K, s = 0.0;
    for (int i = 0; i < 4; i++)
        s += a[i] * (t[i] == 1.0 ? v : pow(v, t[i])); /* pow(v, 1) is v exactly */
    return VL_CO2_PC_PA * exp(VL_CO2_TC_K / t_k * s);
}

/* Sublimation pressure over the solid (Span & Wagner 1996, eq. 3.12, coefficients from
 * memory): ln(p/p_t) = (T_t/T) sum a_i (1 - T/T_t)^t_i. */
static double over_solid(double t_k)
{
    static const double a[3] = {-14.740846, 2.4327015, -5.3061778};
    static const double t[3] = {1.0, 1.9, 2.9};
    double v = 1.0 - t_k / VL_CO2_TT_K, s = 0.0;
    for (int i = 0; i < 3; i++)
        s += a[i] * (t[i] == 1.0 ? v : pow(v, t[i])); /* pow(v, 1) is v exactly */
    return VL_CO2_PT_PA * exp(VL_CO2_TT_K / t_k * s);
}

double vl_co2_psat(double t_k)
{
    if (t_k > VL_CO2_TC_K)
        return INFINITY;
    return t_k < VL_CO2_TT_K ? over_solid(t_k) : over_liquid(t_k);
}

/* Two temperatures a < b close around the root of psat(T) = p_pa (which lies above
 * 20 K and below the critical point), with psat(a) below p_pa and psat(b) above it by a
 * relative 1e-12: secant steps in ln p from a Clausius-Clapeyron estimate (sublimation
 * enthalpy over R about 3150 K, from memory), then checked. 0 if the check fails. The
 * computed psat rises monotonically (its rounding, ~1e-14 relative, is far below the
 * margin; at the triple point the liquid curve starts 2e-5 above the solid one), so
 * every temperature at or below a has psat below p_pa, every one at or above b above. */
static int guide(double p_pa, double *a, double *b)
{
    double lp = log(p_pa);
    double t0 = 1.0 / (1.0 / VL_CO2_TT_K - log(p_pa / VL_CO2_PT_PA) / 3150.0);
    if (!(t0 > 20.0 && t0 < VL_CO2_TC_K))
        return 0;
    double t1 = fmin(t0 + 0.1, 0.5 * (t0 + VL_CO2_TC_K));
    double f0 = log(vl_co2_psat(t0)) - lp, f1 = log(vl_co2_psat(t1)) - lp;
    for (int i = 0; i < 12 && fabs(t1 - t0) > 1e-11 && f1 != f0; i++) {
        double t2 = t1 - f1 * (t1 - t0) / (f1 - f0);
        if (!(t2 > 20.0 && t2 < VL_CO2_TC_K))
            return 0;
        t0 = t1;
        f0 = f1;
        t1 = t2;
        f1 = log(vl_co2_psat(t1)) - lp;
    }
    *a = t1 - 3e-10;
    *b = t1 + 3e-10;
    return *b < VL_CO2_TC_K && vl_co2_psat(*a) < p_pa * (1.0 - 1e-12) &&
           vl_co2_psat(*b) > p_pa * (1.0 + 1e-12);
}

double vl_co2_tsat(double p_pa)
{
    if (p_pa >= VL_CO2_PC_PA)
        return VL_CO2_TC_K;
    double lo = 20.0, hi = VL_CO2_TC_K; /* psat rises monotonically with T */
    if (!(p_pa > vl_co2_psat(lo)))
        return lo;
    /* bisection; a halving whose midpoint lies outside the guide's (a, b) goes the way
     * psat's monotonic rise says without evaluating it, and once lo and hi are adjacent
     * numbers the remaining halvings change nothing (the same result, to the bit, with
     * about 15 evaluations instead of 60) */
    double a = 0.0, b = 0.0;
    int guided = guide(p_pa, &a, &b);
    for (int i = 0; i < 60; i++) {
        double mid = 0.5 * (lo + hi);
        if (mid == lo || mid == hi) /* adjacent: every further halving repeats this one */
            break;
        int below = guided && mid <= a ? 1 : guided && mid >= b ? 0 : vl_co2_psat(mid) < p_pa;
        if (below)
            lo = mid;
        else
            hi = mid;
    }
    return 0.5 * (lo + hi);
}
