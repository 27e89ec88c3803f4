/* magma.h: a 0-D magma ocean: melting curves of peridotite, the mantle's adiabat, how
 * much of the mantle is molten at a potential temperature, the solubility of H2O, CO2
 * and N2 in the melt, and how much oxygen the melt's iron can take. Pure functions, no
 * state; SI units (Pa, K, kg, m) unless a name says otherwise. Equations, sources and
 * validity ranges: docs/model.md section 5b. */
#ifndef VOLEV_MAGMA_H
#define VOLEV_MAGMA_H

/* Parameters of a 0-D magma ocean (scenario-independent struct; the caller fills it). */
typedef struct vl_magma_params {
    double rho_kg_m3;        /* mantle density, e.g. 4000 */
    double cp_j_kg_k;        /* silicate heat capacity, e.g. 1200 */
    double alpha_k;          /* thermal expansivity, 1/K, e.g. 3e-5 */
    double latent_j_kg;      /* latent heat of silicate melting, e.g. 4e5 */
    double phi_rheo;         /* rheological transition melt fraction, 0.4 (Lebrun et al. 2013) */
    double core_radius_frac; /* core radius / planet radius, e.g. 0.55 for Earth */
} vl_magma_params;

/* Peridotite solidus, K, at pressure p_pa (>= 0; negative pressures count as 0):
 * Hirschmann 2000 below 8 GPa, Andrault et al. 2011 above 14 GPa, a C1 blend between. */
double vl_magma_solidus_k(double p_pa);

/* Peridotite liquidus, K: Katz et al. 2003 below 8 GPa, the Simon fit of Fiquet et al.
 * 2010 above 14 GPa, the same C1 blend between. Above the solidus at every pressure. */
double vl_magma_liquidus_k(double p_pa);

/* Temperature at pressure p on the adiabat of potential temperature tp_k (surface value):
 * tp exp(alpha p / (rho cp)) (d ln T / dp = alpha / (rho cp), constant). */
double vl_magma_adiabat_k(const vl_magma_params *mp, double tp_k, double p_pa);

/* Local melt fraction on the adiabat of tp_k at pressure p_pa:
 * (T - T_sol) / (T_liq - T_sol) clamped to [0, 1]. */
double vl_magma_melt_frac(const vl_magma_params *mp, double tp_k, double p_pa);

typedef struct vl_magma_state {
    double melt_frac_surface;  /* melt fraction at the surface (0..1) */
    double depth_m;            /* depth of the magma ocean: down to where the adiabat's melt
                                * fraction first falls to phi_rheo (0 if the surface is below
                                * it; the whole mantle if it never does). Continuous in tp
                                * while the melt fraction falls with depth; where a steep
                                * adiabat melts the base first it jumps to the whole mantle
                                * when the solid layer between closes (Earth, magma.h's
                                * example values: at tp ~2216 K) */
    double melt_kg;            /* mass of melt in the mantle: integral of the local melt
                                * fraction over the mantle shell (spherical, r^2 weighting) */
    double dmelt_dtp_kg_k;     /* d melt_kg / d tp_k (latent-heat term of the heat balance);
                                * continuous in tp */
    double mantle_kg;          /* mass of the silicate mantle shell between core and surface */
    double heat_capacity_j_k;  /* effective heat capacity of the mantle:
                                * mantle_kg cp (mean adiabat factor) + latent dmelt_dtp */
    /* added fields */
    double adiabat_factor;     /* mass-weighted mean of exp(alpha p / (rho cp)) over the
                                * mantle: d(mean T)/d tp */
    double p_base_pa;          /* pressure at the magma ocean's base (at depth_m) */
    double p_cmb_pa;           /* pressure at the core-mantle boundary, rho g (R - R_core) */
    double deep_melt_kg;       /* the part of melt_kg below depth_m: the mush under the
                                * rheological front and any basal melt under a solid layer
                                * (all of melt_kg when depth_m is 0, none when it is the
                                * whole mantle) */
} vl_magma_state;

/* The mantle at potential temperature tp_k of a planet of radius r_m and surface gravity
 * g. Pressure p = rho g depth with g constant through the mantle (a simplification: g in
 * Earth's mantle stays within ~10 % of its surface value, common practice). Returns 0, or
 * -1 on invalid input: any value non-finite; tp_k, r_m, g, rho, cp, alpha <= 0; latent
 * < 0; phi_rheo outside (0, 1); core_radius_frac outside [0, 1). On -1 out is zeroed. */
int vl_magma_state_at(const vl_magma_params *mp, double tp_k, double r_m, double g,
                      vl_magma_state *out);

/* Solubilities: mass fraction of the volatile dissolved in the melt at its partial
 * pressure (Pa); 0 at p <= 0. */
/* H2O: 6.8e-8 p^0.7, p in Pa (Carroll & Holloway 1994 and Papale 1997 as fitted by Lebrun
 * et al. 2013, JGR Planets 118:1155; 0.11 wt% at 10 bar, 2.7 wt% at 1 kbar). */
double vl_magma_h2o_solubility(double p_h2o_pa);
/* CO2: 4.4e-12 p, p in Pa (Pan et al. 1991, GCA 55:1587; 0.44 ppm per bar). */
double vl_magma_co2_solubility(double p_co2_pa);
/* N2: 6.11e-8 p + 5.97e-16 fO2^-3/4 p^1/2, p and fO2 in bar (Libourel et al. 2003, GCA
 * 67:4123: physical dissolution of N2 plus chemical dissolution as nitride under
 * reducing conditions). fo2_bar <= 0 or non-finite: the physical term alone. */
double vl_magma_n2_solubility(double p_n2_pa, double fo2_bar);

/* Partition coefficients solid/melt (from memory): D_H2O 0.01 (Hirschmann et al. 2006,
 * as used by Lebrun et al. 2013), D_CO2 2e-3 (Elkins-Tanton 2008, EPSL 271:181). */
#define VL_MAGMA_D_H2O 0.01
#define VL_MAGMA_D_CO2 2e-3

/* Standard atomic weight of iron, g/mol (IUPAC CIAAW 2021). */
#define VL_MAGMA_AW_FE 55.845
/* FeO mass fraction of the bulk silicate Earth (McDonough & Sun 1995, Chem. Geol.
 * 120:223). */
#define VL_MAGMA_X_FEO_BSE 0.0805

/* Iron oxidation capacity: kg of O one kg of melt with FeO mass fraction x_feo (all iron
 * as FeO) can take by 2 FeO + 1/2 O2 -> Fe2O3 (all its iron to Fe3+); 0 for x_feo <= 0. */
double vl_magma_o_capacity(double x_feo);
/* Fe3+/total Fe after o_kg of O has been taken by melt_kg of melt, in [0, 1] (1 at or
 * beyond the capacity; 0 when o_kg <= 0, melt_kg <= 0 or x_feo <= 0). */
double vl_magma_fe3_ratio(double o_kg, double melt_kg, double x_feo);

#endif
