/* spectrum.c: bands, Planck integrals, stellar band shares, Rayleigh scattering
 * (spectrum.h). */
#include "volev/spectrum.h"

#include <math.h>

#include "volev/reservoir.h"
#include "volev/units.h"

/* Edges chosen to separate the absorbers' bands from the windows: the H2O rotation band
 * (0-500), the CO2 15 um band (580-760, centre 630-700), the 8-12 um window (820-1200),
 * H2O 6.3 um (1350-1850), CO2 4.3 um (2200-2400), the 4 um window (2400-2600), H2O+CO2
 * 2.7 um (3250-4000), the near-infrared windows at 2.2, 1.6, 1.25 and 1.0 um between
 * the H2O bands at 1.87, 1.38, 1.13 and 0.94 um, then the visible and near ultraviolet
 * where Rayleigh scattering dominates (common practice of band models). */
const double vl_band_edge[VL_NBANDS + 1] = {
    0,    200,  350,  500,   580,   630,   700,   760,   820,   980,   1100,  1200,
    1350, 1500, 1850, 2050,  2200,  2400,  2600,  3250,  4000,  4600,  5700,  6900,
    7600, 8600, 9400, 10600, 11500, 14500, 18000, 22000, 26000, 33000, 41000};

/* Second radiation constant hc/k, cm K (CODATA 2018). */
#define C2_CM_K 1.438776877

double vl_band_centre(int b) { return 0.5 * (vl_band_edge[b] + vl_band_edge[b + 1]); }

/* Share of sigma T^4 emitted above x = c2 nu / T (Widger & Woodall 1976): for x >= 2
 * the series (15/pi^4) sum_n e^{-nx}/n (x^3 + 3x^2/n + 6x/n^2 + 6/n^3); below, one minus
 * the power series (15/pi^4) x^3 (1/3 - x/8 + x^2/60 - x^4/5040 + x^6/272160 -
 * x^8/13305600) of the share below x. */
static double share_above(double x)
{
    const double c = 15.0 / (VL_PI * VL_PI * VL_PI * VL_PI);
    if (x <= 0.0)
        return 1.0;
    if (x < 2.0) {
        double x2 = x * x;
        double below = c * x * x2 *
                       (1.0 / 3.0 - x / 8.0 + x2 / 60.0 - x2 * x2 / 5040.0 +
                        x2 * x2 * x2 / 272160.0 - x2 * x2 * x2 * x2 / 13305600.0);
        return 1.0 - below;
    }
    double s = 0.0;
    int terms = 2 + (int)(40.0 / x);
    for (int n = 1; n <= terms; n++) {
        double dn = n;
        s += exp(-dn * x) / dn * (x * x * x + 3.0 * x * x / dn + 6.0 * x / (dn * dn) + 6.0 / (dn * dn * dn));
    }
    return c * s;
}

double vl_planck_share(int b, double t_k)
{
    double lo = share_above(C2_CM_K * vl_band_edge[b] / t_k);
    double hi = share_above(C2_CM_K * vl_band_edge[b + 1] / t_k);
    double s = lo - hi;
    return s > 0.0 ? s : 0.0;
}

double vl_planck_band(int b, double t_k)
{
    double t2 = t_k * t_k;
    return VL_SIGMA_SB * t2 * t2 * vl_planck_share(b, t_k);
}

void vl_star_band_shares(double teff_k, double share[VL_NBANDS])
{
    double sum = 0.0;
    for (int b = 0; b < VL_NBANDS; b++)
        sum += share[b] = vl_planck_share(b, teff_k);
    for (int b = 0; b < VL_NBANDS && sum > 0.0; b++)
        share[b] /= sum;
}

/* Rayleigh cross-section of air at wavelength lam_um, cm^2 (Bucholtz 1995, Appl. Opt.
 * 34:2765, eq. 8 with the coefficients of its Table 3, from memory):
 * sigma = A lam^-(B + C lam + D / lam). */
static double bucholtz_cm2(double lam_um)
{
    if (lam_um < 0.5)
        return 4.01061e-28 * pow(lam_um, -(3.99668 + 1.10298e-3 * lam_um + 2.71393e-2 / lam_um));
    return 3.01577e-28 * pow(lam_um, -(3.55212 + 1.35579 * lam_um + 0.11563 / lam_um));
}

double vl_rayleigh_air(int b)
{
    /* mean over the band by Simpson's rule on 8 intervals in wavenumber */
    double lo = vl_band_edge[b] > 1.0 ? vl_band_edge[b] : 1.0, hi = vl_band_edge[b + 1];
    double h = (hi - lo) / 8.0, s = 0.0;
    for (int i = 0; i <= 8; i++) {
        double nu = lo + i * h, w = (i == 0 || i == 8) ? 1.0 : (i % 2 ? 4.0 : 2.0);
        s += w * bucholtz_cm2(1e4 / nu);
    }
    return s * h / 3.0 / (hi - lo) * 1e-4;
}

/* Per-molecule Rayleigh cross-sections relative to air: the squares of the ratios of
 * mean polarisabilities (CRC Handbook, from memory: air 1.71, N2 1.74, O2 1.58, H2O 1.45,
 * H2 0.80 A^3), and 2.5 for CO2, whose scattering per molecule is about 2.5 times air's
 * (Kopparapu et al. 2013, from memory). Atoms and D count as H2 (never in the column). */
double vl_rayleigh_ratio(int species)
{
    switch (species) {
    case VL_SP_N2: return 1.035;
    case VL_SP_O2: return 0.854;
    case VL_SP_CO2: return 2.5;
    case VL_SP_H2O: return 0.719;
    default: return 0.219;
    }
}
