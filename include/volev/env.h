/* env.h: the environment at one instant, as the stages of one right-hand-side
 * evaluation compute it before any process runs, in a fixed order: star and orbit,
 * interior heat flow, atmosphere from the reservoirs, climate, upper atmosphere
 * (vl_upper), escape budget (vl_escape). Each stage writes only its own fields and
 * reads those of the stages before it; processes receive the result read-only, so no
 * process can change what another sees and the order of the process registry cannot
 * change any result. */
#ifndef VOLEV_ENV_H
#define VOLEV_ENV_H

#include "volev/star.h"

/* Climate regimes; the integer is written in the output `regime` column. */
enum vl_regime {
    VL_REGIME_DRY = 0,       /* less surface water than climate.dry_threshold_to */
    VL_REGIME_FROZEN = 1,    /* mean surface temperature below freezing */
    VL_REGIME_TEMPERATE = 2, /* liquid ocean, cold-trapped stratosphere */
    VL_REGIME_MOIST = 3,     /* moist greenhouse: wet stratosphere */
    VL_REGIME_RUNAWAY = 4,   /* runaway greenhouse: all water in the atmosphere */
    VL_REGIME_MAGMA = 5,     /* magma ocean: a molten surface (melt above the rheological transition) */
    VL_NREGIMES
};

/* What limits thermal hydrogen escape (output column h_escape_limit). */
enum vl_h_limit { VL_HLIM_DIFFUSION = 0, VL_HLIM_JEANS = 1, VL_HLIM_ENERGY = 2 };

/* Atmospheric gases (index into p_pa and x). */
enum vl_gas { VL_GAS_H2O, VL_GAS_CO2, VL_GAS_N2, VL_GAS_O2, VL_GAS_H2, VL_NGASES };

/* The upper atmosphere and magnetosphere (upper.c; equations in docs/escape.md). */
typedef struct vl_upper {
    double f_xuv_rel;         /* f_xuv over present Earth's 4.6e-3 W/m^2 (Ribas et al. 2005) */
    double t_exo_k;           /* exobase temperature, K */
    double r_tb_m;            /* radius of the thermosphere base (homopause), m */
    double r_exo_m;           /* exobase radius, m */
    double n_exo_m3;          /* total number density at the exobase, m^-3 */
    double n_tb_m3;           /* total number density at the thermosphere base, m^-3 */
    double m_exo_kg;          /* mean mass of the thermosphere's particles, kg */
    double g_exo;             /* gravity at the exobase, m/s^2 */
    double b_eq_t;            /* equatorial surface field of the dipole, T (0: none) */
    double r_mp_rp;           /* magnetopause (or induced obstacle) stand-off, planet radii */
    double cap_fraction;      /* surface share of the open polar caps (dipole mapping of r_mp) */
} vl_upper;

/* The escape budget shared by several processes (escape.c; docs/escape.md): thermal
 * hydrogen escape and the oxygen it drags, and the room the diffusion limit leaves for
 * non-thermal hydrogen. All zero (the room factor 1) when escape.thermal is off. */
typedef struct vl_escape {
    double mass_flux;         /* energy-limited mass flux, kg m^-2 s^-1 (surface-area normalised) */
    double h_diffusion;       /* diffusion-limited H flux, atoms m^-2 s^-1 */
    double h_flux;            /* H escape flux the budget allows, atoms m^-2 s^-1 */
    double o_flux;            /* O escape flux dragged with it, atoms m^-2 s^-1 */
    double water_share;       /* fraction of the homopause hydrogen carried by H2O */
    double h_jeans;           /* Jeans-limited H flux (exobase density in diffusive equilibrium), atoms m^-2 s^-1 of surface */
    double hydro;             /* weight 0..1 of the hydrodynamic regime (escape parameter below critical) */
    double lambda_h;          /* Jeans escape parameter of H at the exobase */
    double bulk_hydro;        /* weight 0..1 of the whole upper atmosphere flowing out as a
                                 fluid: hydrodynamic H that dominates it, or heavy atoms
                                 (O) below their own critical escape parameter */
    int h_limit;              /* what limits hydrogen escape: enum vl_h_limit */
    double f_dl;              /* D fractionation factor of diffusion-limited escape */
    double f_jeans;           /* D fractionation factor of Jeans escape */
    double d_frac;            /* D fractionation factor of thermal hydrogen escape (blended) */
    double nt_h_factor;       /* share of the non-thermal H demand (processes' h_demand)
                                 that fits the room the diffusion limit leaves */
} vl_escape;

/* The magma ocean (the melt stage, src/engine/melt_stage.c; docs/model.md section 5b).
 * All zero for a mantle that was never molten. */
typedef struct vl_melt {
    double tp_k;              /* mantle potential temperature (the state's), K */
    double melt_kg;           /* melt in the mantle */
    double mantle_kg;         /* the silicate mantle */
    double depth_m;           /* magma-ocean depth: down to the rheological transition */
    double frac_surface;      /* melt fraction at the surface */
    double open;              /* 0..1: share of the melt that exchanges with the air (1 well
                                 above the rheological transition at the surface, 0 at it) */
    double x_water, x_co2;    /* mass fractions dissolved in the open melt */
    double water_kg, co2_kg;  /* dissolved in the open melt (parts of surface_water and
                                 surface_co2) */
    double heat_capacity_j_k; /* of the mantle, latent heat of its melting included */
    double dmelt_dtp;         /* kg/K: melt gained per kelvin of T_p */
    double heat_w;            /* interior (radiogenic) heating */
    double dtp_dt;            /* K/s: the mantle's heating (cooling) while the surface is molten */
    double dmelt_dt;          /* kg/s: growth of the melt */
    double fe3_ratio;         /* Fe3+/total Fe the oxygen taken by the melt gives the mantle */
    double feo_fraction;      /* FeO mass fraction of the silicate (the scenario's) */
} vl_melt;

typedef struct vl_env {
    double t_s;               /* stellar age, s */
    vl_star_state star;       /* star at t_s */
    double instellation;      /* orbit-averaged bolometric flux at the planet, W/m^2 */
    double s_eff;             /* instellation / VL_S_EARTH */
    double f_xuv;             /* orbit-averaged XUV flux at the planet, W/m^2 */
    double lya_flux;          /* H2O-dissociating photons at the planet, m^-2 s^-1 */
    double wind_pressure_pa;  /* stellar wind ram pressure at the planet, Pa */

    double heat_flow_rel;     /* interior heat flow over its reference-age value */
    double g;                 /* surface gravity, m/s^2 */
    double area_m2;           /* planet surface area, m^2 */

    double mass_kg[VL_NGASES];/* atmospheric mass of each gas (H2O: the vapour), kg */
    double p_pa[VL_NGASES];   /* surface partial pressures x_i * p_surf, Pa */
    double x[VL_NGASES];      /* mole fractions in the whole atmosphere */
    double p_surf_pa;         /* total surface pressure, thin shell: sum(M_i) g / area, Pa */
    double m_mean_kg;         /* mean molecular mass of the atmosphere, kg */
    double m_background_kg;   /* mean molecular mass of the non-hydrogen gases (N2, CO2, O2; H2O if none), kg */
    double vapour_kg;         /* surface water held as vapour, kg */
    double ocean_kg;          /* surface water held as liquid or ice, kg */

    int regime;               /* enum vl_regime in force */
    double t_surf_k;          /* surface temperature, K */
    double t_balance_k;       /* temperature from the temperate energy balance, K (all regimes) */
    double f_strat;           /* stratospheric total-hydrogen mixing ratio (H2O + H2) */
    double s_runaway;         /* runaway-greenhouse threshold, in units of VL_S_EARTH */
    double s_moist;           /* moist-greenhouse threshold, in units of VL_S_EARTH */
    double liquid;            /* ice-free fraction of the ocean (0 without a liquid ocean) */
    double net_flux_w_m2;     /* absorbed starlight less OLR at a molten surface (the magma
                                 ocean's cooling; the column climate, regime magma_ocean
                                 only: 0 otherwise) */
    vl_melt melt;             /* the magma ocean (melt stage) */

    vl_upper upper;           /* upper-atmosphere stage (upper.c) */
    vl_escape escape;         /* escape-budget stage (escape.c) */
} vl_env;

#endif
