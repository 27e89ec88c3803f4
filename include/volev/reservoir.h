/* reservoir.h: the state vector. Every reservoir is a mass in kg of one species;
 * the layout is one X-macro list, so adding a reservoir is one line here. */
#ifndef VOLEV_RESERVOIR_H
#define VOLEV_RESERVOIR_H

/* Elements tracked by the ledger. */
enum vl_element { VL_EL_H, VL_EL_C, VL_EL_N, VL_EL_O, VL_EL_D, VL_NELEMENTS };

/* Species: X(ID, name, nH, nC, nN, nO, nD) -- atoms per formula unit. Deuterium is a
 * tracer of its own: the H-bearing reservoirs hold protium-weighted masses and each has
 * a deuterium companion (vl_reservoir_deuterium). */
#define VL_SPECIES(X)               \
    X(H2O, "H2O", 2, 0, 0, 1, 0)    \
    X(CO2, "CO2", 0, 1, 0, 2, 0)    \
    X(N2, "N2", 0, 0, 2, 0, 0)      \
    X(H2, "H2", 2, 0, 0, 0, 0)      \
    X(O2, "O2", 0, 0, 0, 2, 0)      \
    X(H, "H", 1, 0, 0, 0, 0)        \
    X(C, "C", 0, 1, 0, 0, 0)        \
    X(N, "N", 0, 0, 1, 0, 0)        \
    X(O, "O", 0, 0, 0, 1, 0)        \
    X(D, "D", 0, 0, 0, 0, 1)

enum vl_species {
#define VL_X(id, name, h, c, n, o, d) VL_SP_##id,
    VL_SPECIES(VL_X)
#undef VL_X
    VL_NSPECIES
};

/* Reservoirs: X(ID, name, species, floor_kg, meaning).
 * floor_kg is the depletion band: outflows from a reservoir are ramped linearly to
 * zero as its mass falls below floor_kg, so no mass goes negative and the RHS stays
 * continuous; a reservoir below its floor is "exhausted". Carbon held in rock
 * (carbonate, mantle) is counted as CO2 equivalent. The impactor_* reservoirs hold
 * the volatiles the impactor population has yet to deliver (filled at the start by
 * the impacts process when its delivery is on, 0 otherwise). crust_nitrogen holds
 * nitrogen fixed from the atmosphere and buried (nitrogen_burial). */
#define VL_RESERVOIRS(X)                                                                  \
    X(WATER, "surface_water", VL_SP_H2O, 1.0e9, "surface water: ocean, ice and vapour")       \
    X(MANTLE_WATER, "mantle_water", VL_SP_H2O, 1.0e9, "water held in the mantle")             \
    X(CO2, "surface_co2", VL_SP_CO2, 1.0e6, "CO2 in the air and dissolved in the ocean")      \
    X(CARBONATE, "carbonate_rock", VL_SP_CO2, 1.0e6, "carbonate rock, as CO2")                \
    X(MANTLE_C, "mantle_carbon", VL_SP_CO2, 1.0e6, "carbon held in the mantle, as CO2")       \
    X(N2, "atm_n2", VL_SP_N2, 1.0e6, "atmospheric N2")                                        \
    X(MANTLE_N, "mantle_nitrogen", VL_SP_N2, 1.0e6, "nitrogen held in the mantle, as N2")     \
    X(H2, "atm_h2", VL_SP_H2, 1.0e3, "atmospheric H2")                                        \
    X(O2, "atm_o2", VL_SP_O2, 1.0e3, "atmospheric O2")                                        \
    X(OX_ROCK, "oxidised_rock", VL_SP_O, 1.0e3, "oxygen bound in oxidised rock")              \
    X(MELT_O, "mantle_ferric_oxygen", VL_SP_O, 1.0e3,                                         \
      "oxygen bound in the mantle's ferric iron, taken up while it was molten")               \
    /* space: contiguous (SPACE_H..SPACE_D), read by no process (the Jacobian skips them;  \
     * only a flow reversed into its source below zero sees how much space can give) */  \
    X(SPACE_H, "space_h", VL_SP_H, 1.0e3, "hydrogen lost to space")                           \
    X(SPACE_C, "space_c", VL_SP_C, 1.0e3, "carbon lost to space")                             \
    X(SPACE_N, "space_n", VL_SP_N, 1.0e3, "nitrogen lost to space")                           \
    X(SPACE_O, "space_o", VL_SP_O, 1.0e3, "oxygen lost to space")                             \
    X(SPACE_D, "space_d", VL_SP_D, 1.0, "deuterium lost to space")                            \
    X(IMPACT_WATER, "impactor_water", VL_SP_H2O, 1.0e9, "water impactors have yet to deliver") \
    X(IMPACT_CO2, "impactor_co2", VL_SP_CO2, 1.0e6, "CO2 impactors have yet to deliver")      \
    X(IMPACT_N2, "impactor_n2", VL_SP_N2, 1.0e6, "N2 impactors have yet to deliver")          \
    X(CRUST_N, "crust_nitrogen", VL_SP_N2, 1.0e6, "nitrogen fixed and buried in the crust")   \
    X(D_WATER, "surface_water_d", VL_SP_D, 1.0, "deuterium of the surface water")             \
    X(D_MANTLE_WATER, "mantle_water_d", VL_SP_D, 1.0, "deuterium of the mantle water")        \
    X(D_H2, "atm_h2_d", VL_SP_D, 1.0, "deuterium of atmospheric H2")                          \
    X(D_IMPACT_WATER, "impactor_water_d", VL_SP_D, 1.0, "deuterium of the impactor water")

enum vl_reservoir {
#define VL_X(id, name, sp, fl, meaning) VL_R_##id,
    VL_RESERVOIRS(VL_X)
#undef VL_X
    VL_NRES
};

/* The state is the reservoirs, then the mantle's potential temperature (K): the thermal
 * state of a magma ocean (docs/model.md section 5b), 0 for a run that starts solid and
 * constant once the surface has solidified. Not a mass: outside the element ledger. */
enum { VL_S_MANTLE_TP = VL_NRES, VL_NSTATE };

/* Molar mass of a species, kg/mol, from the standard atomic weights. */
double vl_species_molar_mass(int species);
/* Atoms of element el per formula unit of species. */
int vl_species_atoms(int species, int el);
const char *vl_species_name(int species);

const char *vl_reservoir_name(int r);
const char *vl_reservoir_meaning(int r); /* one line, for the column reference */
int vl_reservoir_species(int r);
double vl_reservoir_floor(int r);       /* kg */
/* Mass fraction of element el in reservoir r (kg element per kg reservoir). */
double vl_reservoir_element_fraction(int r, int el);
const char *vl_element_name(int el);

/* The deuterium companion of an H-bearing reservoir (surface and mantle water, H2,
 * impactor water, space H), or -1. Transfers of hydrogen carry deuterium along
 * (flux.c). */
int vl_reservoir_deuterium(int r);
/* D/H atom ratio of reservoir r in the state y: 0 without hydrogen or a deuterium
 * companion; NAN once r is below its depletion floor (an exhausted reservoir's ratio is
 * numerical noise: undefined). */
double vl_reservoir_dh(const double *y, int r);
/* Deuterium (kg) that goes with kg of reservoir r at D/H atom ratio dh: kg of its
 * hydrogen x dh x m_D / m_H (0 for a reservoir without hydrogen). */
double vl_reservoir_deuterium_kg(int r, double kg, double dh);

#endif
