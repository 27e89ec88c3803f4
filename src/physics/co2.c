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
        s += a[i] * pow(v, t[i]);
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
        s += a[i] * pow(v, t[i]);
    return VL_CO2_PT_PA * exp(VL_CO2_TT_K / t_k * s);
}

double vl_co2_psat(double t_k)
{
    if (t_k > VL_CO2_TC_K)
        return INFINITY;
    return t_k < VL_CO2_TT_K ? over_solid(t_k) : over_liquid(t_k);
}

double vl_co2_tsat(double p_pa)
{
    if (p_pa >= VL_CO2_PC_PA)
        return VL_CO2_TC_K;
    double lo = 20.0, hi = VL_CO2_TC_K; /* psat rises monotonically with T */
    if (!(p_pa > vl_co2_psat(lo)))
        return lo;
    for (int i = 0; i < 60; i++) {
        double mid = 0.5 * (lo + hi);
        if (vl_co2_psat(mid) < p_pa)
            lo = mid;
        else
            hi = mid;
    }
    return 0.5 * (lo + hi);
}
