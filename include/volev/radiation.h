/* radiation.h: radiative transfer through a column (profile.h) in the spectral bands of
 * spectrum.h with the absorption of opacity.h: the outgoing longwave radiation
 * (thermal emission, two-stream without scattering) and, for starlight, the band
 * reflectance and transmission of the atmosphere (two-stream with Rayleigh scattering),
 * so that the planetary albedo follows for any surface albedo and stellar spectrum;
 * each for the clear column and for the column with a cloud layer. Equations:
 * docs/model.md section 3.2. */
#ifndef VOLEV_RADIATION_H
#define VOLEV_RADIATION_H

#include "volev/opacity.h"
#include "volev/profile.h"

/* Diffusivity factor of the two-stream approximation (Elsasser 1942; common practice). */
#define VL_DIFFUSIVITY 1.66

/* Bands that carry starlight: from 1100 cm^-1 (a 2600 K star has under 1 % of its flux
 * below). */
#define VL_SW_FIRST 10
#define VL_NSW (VL_NBANDS - VL_SW_FIRST)

/* A cloud layer: at pressure p_ratio times the surface pressure, conservative
 * scattering of optical depth tau_sw (asymmetry 0.85, delta-scaled: tau_sw (1 - 0.85)
 * acts as isotropic scattering, common practice), absorbing in the thermal bands with
 * tau_lw (grey). */
typedef struct vl_cloud {
    double p_ratio;
    double tau_sw;
    double tau_lw;
} vl_cloud;

/* Per band of starlight (index b - VL_SW_FIRST), for illumination from above, averaged
 * over the g intervals: reflectance over a black surface, the square of the
 * transmission to the surface, and the reflectance of the atmosphere seen from the
 * surface; the planetary albedo over a surface of band albedo a is r + t2 a / (1 - a rs). */
typedef struct vl_starlight {
    double r[VL_NSW], t2[VL_NSW], rs[VL_NSW];
} vl_starlight;

typedef struct vl_radiation_out {
    double olr[2];             /* outgoing longwave radiation, W/m^2: clear, cloudy */
    vl_starlight sw[2];        /* clear, cloudy */
} vl_radiation_out;

/* Thermal emission of the surface (emissivity 1) at pr->t[0] and of the atmosphere to
 * space through the clear column, W/m^2. */
double vl_radiation_olr(const vl_opacity_scales *s, const vl_profile *pr, double g);
/* The same in band b alone, W/m^2 (the spectrum of the OLR). */
double vl_radiation_band_olr(const vl_opacity_scales *s, const vl_profile *pr, double g, int b);

/* Both parts for the profile pr, clear and with the cloud cl (cloudy = clear when cl is
 * NULL). */
void vl_radiation_eval(const vl_opacity_scales *s, const vl_profile *pr, double g,
                       const vl_cloud *cl, vl_radiation_out *out);

/* The planetary albedo of sl for a stellar spectrum with band shares share[] (all
 * VL_NBANDS, sum 1) and a surface of band albedos a[] (VL_NBANDS). */
double vl_radiation_albedo(const vl_starlight *sl, const double share[VL_NBANDS],
                           const double a[VL_NBANDS]);

/* The two halves of vl_radiation_albedo, for callers that keep the first while the
 * star changes: the albedo of sl over a surface of band albedos a[] in each band from
 * VL_SW_FIRST on (g[VL_NSW]); and the albedo for band shares share[] from a[] and g[]
 * (bit for bit what vl_radiation_albedo gives). */
void vl_radiation_band_albedo(const vl_starlight *sl, const double a[VL_NBANDS],
                              double g[VL_NSW]);
double vl_radiation_albedo_of(const double share[VL_NBANDS], const double a[VL_NBANDS],
                              const double g[VL_NSW]);

#endif
