/* spectrum.h: the spectral bands of the radiative column, the Planck function over a
 * band, the stellar spectrum's share in each band and Rayleigh scattering. Thermal
 * emission and starlight use the same bands, 0 to 41 000 cm^-1 (0.24 um): hot surfaces
 * (up to 3000 K) emit through the near-infrared windows, and the stars of interest
 * (2600-7200 K) shine mostly between 0.3 and 5 um. Equations and sources:
 * docs/model.md section 3.2. */
#ifndef VOLEV_SPECTRUM_H
#define VOLEV_SPECTRUM_H

#define VL_NBANDS 34

/* Band b spans [vl_band_edge[b], vl_band_edge[b + 1]) in wavenumber, cm^-1. */
extern const double vl_band_edge[VL_NBANDS + 1];

/* Band centre, cm^-1 (the mean of its edges). */
double vl_band_centre(int b);

/* Share of a blackbody's flux sigma T^4 that falls in band b (Planck integral; series
 * of Widger & Woodall 1976, Bull. Am. Meteorol. Soc. 57:1217). */
double vl_planck_share(int b, double t_k);

/* Hemispheric blackbody flux in band b, W/m^2: sigma T^4 vl_planck_share(b, T). */
double vl_planck_band(int b, double t_k);

/* Shares of a star's bolometric flux in each band for a blackbody at teff_k (sum 1). */
void vl_star_band_shares(double teff_k, double share[VL_NBANDS]);

/* Rayleigh scattering cross-section of dry air averaged over band b, m^2 per molecule
 * (Bucholtz 1995, Appl. Opt. 34:2765, fit for lambda > 0.5 um, used at every
 * wavelength). A gas scatters vl_rayleigh_ratio(species) times as much per molecule. */
double vl_rayleigh_air(int b);

/* Rayleigh cross-section per molecule of a species (enum vl_species) over that of air. */
double vl_rayleigh_ratio(int species);

#endif
