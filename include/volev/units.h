/* units.h: physical constants and unit conversions, each with its source.
 * Inside the library everything is SI (kg, m, s, K, Pa, W); conversions to the
 * trade units used in scenario files and output columns happen only at the edges. */
#ifndef VOLEV_UNITS_H
#define VOLEV_UNITS_H

/* CODATA 2018 recommended values (Tiesinga et al. 2021, Rev. Mod. Phys. 93:025010). */
#define VL_G_NEWTON 6.67430e-11        /* m^3 kg^-1 s^-2 */
#define VL_K_BOLTZMANN 1.380649e-23    /* J/K, exact (SI 2019) */
#define VL_SIGMA_SB 5.670374419e-8     /* W m^-2 K^-4 */
#define VL_AMU 1.66053906660e-27       /* kg, atomic mass constant */
#define VL_AVOGADRO 6.02214076e23      /* mol^-1, exact (SI 2019) */
#define VL_R_GAS (VL_K_BOLTZMANN * VL_AVOGADRO) /* J mol^-1 K^-1 */
#define VL_MU0 1.25663706212e-6        /* N A^-2, vacuum permeability */

/* IAU 2015 Resolution B3 nominal solar values (Prsa et al. 2016, AJ 152:41). */
#define VL_L_SUN 3.828e26              /* W */
#define VL_R_SUN 6.957e8               /* m */
#define VL_GM_SUN 1.3271244e20         /* m^3 s^-2 */
#define VL_M_SUN (VL_GM_SUN / VL_G_NEWTON) /* kg */
#define VL_TEFF_SUN 5772.0             /* K */

/* IAU 2012 Resolution B2: astronomical unit, exact. */
#define VL_AU 1.495978707e11           /* m */

/* Julian year (IAU): 365.25 d of 86400 s. */
#define VL_YR 3.15576e7                /* s */

/* Earth reference values: NASA NSSDC Earth fact sheet (mass, mean radius). */
#define VL_M_EARTH 5.9722e24           /* kg */
#define VL_R_EARTH 6.371e6             /* m */
/* Present solar constant, 1361 W/m^2 (common practice; Kopp & Lean 2011, GRL 38:L01706). */
#define VL_S_EARTH 1361.0              /* W/m^2 */

/* One terrestrial ocean (TO) of water, the escape-literature convention
 * (from memory; compiled ocean-mass estimates are 1.347-1.40e21 kg). */
#define VL_TO_KG 1.39e21               /* kg */

#define VL_BAR 1.0e5                   /* Pa */

/* Temperature of the cosmic microwave background today, 2.72548 +- 0.00057 K (Fixsen 2009,
 * ApJ 707:916): the coldest a surface in radiative equilibrium can be. */
#define VL_T_CMB_K 2.72548             /* K */

#define VL_PI 3.14159265358979323846

/* Standard atomic weights, abridged (IUPAC CIAAW 2021), in g/mol == u. */
#define VL_AW_H 1.008
#define VL_AW_C 12.011
#define VL_AW_N 14.007
#define VL_AW_O 15.999
/* Deuterium atomic mass (CODATA 2018: 2.014101778 u). */
#define VL_AW_D 2.014101778

#endif
