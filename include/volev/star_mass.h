/* star_mass.h: a main-sequence star's luminosity, radius and effective temperature from
 * its mass (docs/model.md, "Star"), for a scenario that gives the mass only. */
#ifndef VOLEV_STAR_MASS_H
#define VOLEV_STAR_MASS_H

/* The mass range of the relations' calibration sample (Eker et al. 2018), M_sun; below
 * it down to VL_STAR_MS_MASS_MIN they are extrapolated (docs/model.md gives how far
 * off they are there for Proxima Centauri and TRAPPIST-1). */
#define VL_STAR_MS_CALIBRATED_MIN 0.179
#define VL_STAR_MS_MASS_MIN 0.08  /* the hydrogen-burning limit, common practice */
#define VL_STAR_MS_RADIUS_MAX 1.5 /* upper end of the mass-radius relation, M_sun */

/* Main-sequence bolometric luminosity, L_sun, of a star of m_msun solar masses
 * (VL_STAR_MS_MASS_MIN <= m <= 7): the piecewise mass-luminosity relation of Eker et
 * al. 2018. NAN outside that range. */
double vl_star_ms_luminosity_lsun(double m_msun);

/* Main-sequence radius, R_sun (VL_STAR_MS_MASS_MIN <= m <= VL_STAR_MS_RADIUS_MAX): the
 * quadratic mass-radius relation of Eker et al. 2018. NAN outside that range. */
double vl_star_ms_radius_rsun(double m_msun);

/* Main-sequence effective temperature, K, from that luminosity and radius by the
 * Stefan-Boltzmann law with the IAU 2015 nominal solar values. NAN where the radius
 * relation does not hold. */
double vl_star_ms_teff_k(double m_msun);

#endif
