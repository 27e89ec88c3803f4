/* ocean.h: the CO2 held by a liquid ocean. The surface CO2 reservoir (VL_R_CO2,
 * "surface_co2") is the exchangeable carbon of atmosphere and ocean together; this
 * module splits it, at equilibrium, into a gas part and dissolved inorganic carbon
 * (Henry's law and a carbonate-compensated carbonate system). Equations and sources:
 * docs/cycles.md, section "Ocean-atmosphere partition". */
#ifndef VOLEV_OCEAN_H
#define VOLEV_OCEAN_H

/* Ocean volume per kg of surface water, m^3/kg (1000 kg/m^3, common practice). */
#define VL_OCEAN_DENSITY_KG_M3 1000.0

/* Henry's constant of CO2 in water, mol m^-3 Pa^-1 at 298.15 K, and its temperature
 * coefficient d ln H / d(1/T), K (Sander compilation). */
#define VL_OCEAN_HENRY_298 3.3e-4
#define VL_OCEAN_HENRY_DT_K 2400.0
#define VL_OCEAN_HENRY_REF_K 298.15

/* Carbonate system, simplified for time scales beyond ~10 kyr: carbonate compensation
 * holds the carbonate ion near calcite saturation, so with [CO3--] fixed the
 * equilibria K1 = h [HCO3-]/[CO2*] and K2 = h [CO3--]/[HCO3-] give
 * [HCO3-] = sqrt(K1 [CO3--] [CO2*] / K2), i.e. bicarbonate grows as sqrt(pCO2). Anchored
 * to the present ocean: DIC = c + (D0 - c0) sqrt(c / c0), with c = [CO2*] = H(T) pCO2
 * and c0 = H(T0) pCO2_0; the carbonate ion itself (a tenth of today's DIC) is folded into
 * the square-root term, so the law is exact at the reference and vanishes with pCO2. The
 * buffer factor d ln pCO2 / d ln DIC is ~2 at low pCO2 and falls to 1 at several bar,
 * where dissolved CO2 dominates. Reference state: DIC D0 = 2.3e-3 mol/kg ([C]:
 * exchangeable carbon of air and ocean ~3.3e18 mol, from memory, less ~5e16 mol in the
 * air (280 ppmv of 1.77e20 mol of dry air), over one 1.39e21 kg ocean; measured
 * whole-ocean mean ~2.25e-3 mol/kg, from memory) at
 * pCO2_0 = 2.837e-4 bar (280 ppmv x 1.01325 bar, the climate and weathering
 * references) and T0 = 288 K (present mean surface temperature, common practice). */
#define VL_OCEAN_DIC_REF_MOL_KG 2.3e-3
#define VL_OCEAN_PCO2_REF_PA 28.37
#define VL_OCEAN_T_REF_K 288.0

/* Temperature of the first partition pass, before the climate has given the surface
 * temperature: 288 K (present Earth mean surface temperature, common practice). */
#define VL_OCEAN_FIRST_PASS_K 288.0

/* The dry air the CO2 mixes into: everything but CO2 and water vapour. */
typedef struct vl_ocean_air {
    double other_kg;    /* N2 + O2 + H2, kg */
    double other_mol;   /* their amount, mol */
    double pa_per_kg;   /* thin-shell pressure per kg of gas, g / area, Pa/kg */
} vl_ocean_air;

/* 1 if the regime has a (liquid or ice-covered) ocean that holds carbon: frozen,
 * temperate, moist greenhouse; 0 in the dry and runaway regimes. */
int vl_ocean_holds_carbon(int regime);

/* Henry's constant of CO2, mol m^-3 Pa^-1: H(T) = H298 exp(2400 K (1/T - 1/298.15 K))
 * (Sander compilation). */
double vl_ocean_henry(double t_k);

/* Dissolved inorganic carbon, mol/m^3, in equilibrium with a CO2 partial pressure
 * p_co2_pa (>= 0) at t_k (the carbonate-compensated law above). */
double vl_ocean_dic(double p_co2_pa, double t_k);

/* The atmospheric part, kg, of surface_kg of exchangeable CO2 over an ocean of
 * ocean_m3 at t_k; the rest, surface_kg minus the result, is dissolved. The CO2
 * partial pressure is its mole fraction in the dry air times the dry-air pressure.
 * Continuous and increasing in surface_kg; equals surface_kg when ocean_m3 is 0 and 0
 * when surface_kg <= 0. */
double vl_ocean_atm_co2(double surface_kg, double ocean_m3, double t_k,
                        const vl_ocean_air *air);

#endif
