/* star_mass.c: main-sequence luminosity, radius and effective temperature from the mass
 * (star_mass.h).
 *
 * Eker Z. et al. 2018, "Interrelated main-sequence mass-luminosity, mass-radius, and
 * mass-effective temperature relations", MNRAS 479:5491: fits to 509 main-sequence
 * components of detached eclipsing binaries with masses and radii known to 15 % or
 * better. The coefficients below are from memory of its table 4 (mass-luminosity, five
 * segments up to 7 M_sun) and its eq. 6 (mass-radius, 0.179-1.5 M_sun); the checks
 * against measured stars in tests/test_star_mass.c hold them to the published values
 * within the relations' own scatter. */
#include "volev/star_mass.h"

#include <math.h>
#include <stddef.h>

#include "volev/units.h"

/* log10 L = a log10 M + b on (m_lo, m_hi]; the lowest segment also below its range,
 * down to VL_STAR_MS_MASS_MIN. */
static const struct {
    double m_hi, a, b;
} mlr[] = {
    {0.45, 2.028, -0.976}, /* ultra-low mass: 0.179-0.45 M_sun */
    {0.72, 4.572, -0.102}, /* very low mass */
    {1.05, 5.743, -0.007}, /* low mass */
    {2.40, 4.329, 0.010},  /* intermediate mass */
    {7.00, 3.967, 0.093},  /* high mass */
};

#define NSEG (sizeof mlr / sizeof mlr[0])

/* log10 L of segment k at mass m. */
static double segment(size_t k, double m) { return mlr[k].a * log10(m) + mlr[k].b; }

/* The published segments do not meet at their boundaries (at 0.72 M_sun the upper one
 * starts 0.07 dex below where the lower one ends), which would make a heavier star
 * fainter. Within a factor BLEND of each boundary log L is interpolated linearly in
 * log M between the two segments' values at the window's ends, so L rises with M
 * everywhere and is continuous; outside the windows the published fits hold unchanged. */
#define BLEND 1.05

double vl_star_ms_luminosity_lsun(double m_msun)
{
    if (!(m_msun >= VL_STAR_MS_MASS_MIN && m_msun <= mlr[NSEG - 1].m_hi))
        return NAN;
    for (size_t k = 0; k + 1 < NSEG; k++) {
        double lo = mlr[k].m_hi / BLEND, hi = mlr[k].m_hi * BLEND;
        if (m_msun > lo && m_msun < hi) {
            double f = log(m_msun / lo) / log(hi / lo);
            return pow(10.0, (1.0 - f) * segment(k, lo) + f * segment(k + 1, hi));
        }
    }
    size_t k = 0;
    while (m_msun > mlr[k].m_hi)
        k++;
    return pow(10.0, segment(k, m_msun));
}

double vl_star_ms_radius_rsun(double m_msun)
{
    if (!(m_msun >= VL_STAR_MS_MASS_MIN && m_msun <= VL_STAR_MS_RADIUS_MAX))
        return NAN;
    return 0.438 * m_msun * m_msun + 0.479 * m_msun + 0.075;
}

double vl_star_ms_teff_k(double m_msun)
{
    double l_w = vl_star_ms_luminosity_lsun(m_msun) * VL_L_SUN;
    double r_m = vl_star_ms_radius_rsun(m_msun) * VL_R_SUN;
    if (!isfinite(l_w) || !isfinite(r_m))
        return NAN;
    return pow(l_w / (4.0 * VL_PI * r_m * r_m * VL_SIGMA_SB), 0.25);
}
