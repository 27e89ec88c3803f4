/* redox.c: oxygen buffers and the H2/H2O, CO/CO2 equilibria of volcanic gases (redox.h).
 *
 * Buffers: log fO2 = A/T + B + C (P - 1)/T (T in K, P in bar), the form and coefficients
 * of Frost 1991 (Rev. Mineral. 25:1, table 1).
 *
 * Equilibrium constants: log K = -dG(T) / (R T ln 10) with dG the Gibbs energy of the
 * reaction at 1 bar. dG is tabulated at three temperatures from the NIST-JANAF tables
 * (Chase 1998, J. Phys. Chem. Ref. Data Monograph 9) and joined by
 * dG(T) = a + b T + c T ln T, exact at the three nodes; this is the Gibbs energy of a
 * reaction whose heat capacity change is constant (-c), so it also extrapolates sensibly
 * a little beyond the nodes. Between the nodes it reproduces other JANAF entries to
 * ~0.05 kJ/mol (tests/test_redox.c). */
#include "volev/redox.h"

#include <math.h>

#include "volev/units.h"

/* A buffer's Frost 1991 coefficients. */
typedef struct {
    double a, b, c;
} buffer;

/* FMQ in the beta-quartz field (above 573 degC) and IW; Frost 1991, table 1 (from memory). */
static const buffer fmq = {-25096.3, 8.735, 0.110};
static const buffer iw = {-27489.0, 6.702, 0.055};

/* Temperatures (K) of the Gibbs energy nodes. */
static const double node_t[3] = {1000.0, 1500.0, 2000.0};

/* Gibbs energies of formation, kJ/mol, at node_t: NIST-JANAF (Chase 1998), from memory;
 * their log Kf columns (10.060, 5.725, 3.540 for H2O) agree to 0.001. */
static const double dgf_h2o[3] = {-192.590, -164.376, -135.528};
static const double dgf_co[3] = {-200.275, -243.740, -286.034};
static const double dgf_co2[3] = {-395.886, -396.288, -396.333};

/* Whether t_k is a usable temperature: finite and positive. */
static int valid_t(double t_k)
{
    return isfinite(t_k) && t_k > 0.0;
}

/* log10 fO2 of buffer bf at t_k and p_bar; NAN on invalid input (redox.h). */
static double buffer_log_fo2(const buffer *bf, double t_k, double p_bar)
{
    if (!valid_t(t_k) || !isfinite(p_bar) || p_bar < 0.0)
        return NAN;
    return bf->a / t_k + bf->b + bf->c * (p_bar - 1.0) / t_k;
}

double vl_redox_log_fo2_fmq(double t_k, double p_bar)
{
    return buffer_log_fo2(&fmq, t_k, p_bar);
}

double vl_redox_log_fo2_iw(double t_k, double p_bar)
{
    return buffer_log_fo2(&iw, t_k, p_bar);
}

/* dG (J/mol) at t_k of a + b T + c T ln T through (node_t[i], dg_kj[i] kJ/mol): with
 * f(T) = T ln T, c follows from the second divided differences of dG and f (the linear
 * part a + b T has none), then b and a from the first node and its divided difference. */
static double gibbs_at(const double dg_kj[3], double t_k)
{
    const double *t = node_t;
    double f[3], g[3];
    for (int i = 0; i < 3; i++) {
        f[i] = t[i] * log(t[i]);
        g[i] = 1e3 * dg_kj[i];
    }
    double g01 = (g[1] - g[0]) / (t[1] - t[0]), g12 = (g[2] - g[1]) / (t[2] - t[1]);
    double f01 = (f[1] - f[0]) / (t[1] - t[0]), f12 = (f[2] - f[1]) / (t[2] - t[1]);
    double c = (g12 - g01) / (f12 - f01);
    double b = g01 - c * f01;
    double a = g[0] - b * t[0] - c * f[0];
    return a + b * t_k + c * t_k * log(t_k);
}

/* log10 K of a reaction of Gibbs energy nodes dg_kj at t_k; NAN on invalid t_k. */
static double log_k(const double dg_kj[3], double t_k)
{
    if (!valid_t(t_k))
        return NAN;
    return -gibbs_at(dg_kj, t_k) / (VL_R_GAS * t_k * log(10.0));
}

double vl_redox_log_k_h2o(double t_k)
{
    return log_k(dgf_h2o, t_k);
}

double vl_redox_log_k_co2(double t_k)
{
    double dg[3];
    for (int i = 0; i < 3; i++)
        dg[i] = dgf_co2[i] - dgf_co[i];
    return log_k(dg, t_k);
}

/* Ratio reduced/oxidised = 10^-(log K + log fO2 / 2) at equilibrium; NAN propagates. */
static double reduced_ratio(double log_k_t, double log_fo2)
{
    if (!isfinite(log_fo2) || !isfinite(log_k_t))
        return NAN;
    return pow(10.0, -(log_k_t + 0.5 * log_fo2));
}

double vl_redox_h2_per_h2o(double t_k, double log_fo2)
{
    return reduced_ratio(vl_redox_log_k_h2o(t_k), log_fo2);
}

double vl_redox_co_per_co2(double t_k, double log_fo2)
{
    return reduced_ratio(vl_redox_log_k_co2(t_k), log_fo2);
}

/* log fO2 = -2 (log K + log ratio), from H2/H2O = 1 / (K fO2^1/2). */
double vl_redox_log_fo2_of_h2_per_h2o(double t_k, double h2_per_h2o)
{
    double lk = vl_redox_log_k_h2o(t_k);
    if (!isfinite(lk) || !isfinite(h2_per_h2o) || !(h2_per_h2o > 0.0))
        return NAN;
    return -2.0 * (lk + log10(h2_per_h2o));
}

void vl_redox_volcanic_ratios(double t_k, double p_bar, double delta_fmq, double *h2_per_h2o,
                              double *co_per_co2)
{
    double lf = vl_redox_log_fo2_fmq(t_k, p_bar) + delta_fmq; /* NAN if any is invalid */
    if (!isfinite(lf))
        lf = NAN;
    if (h2_per_h2o)
        *h2_per_h2o = vl_redox_h2_per_h2o(t_k, lf);
    if (co_per_co2)
        *co_per_co2 = vl_redox_co_per_co2(t_k, lf);
}
