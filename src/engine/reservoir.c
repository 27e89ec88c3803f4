/* reservoir.c: species make-up and reservoir layout (reservoir.h). */
#include "volev/reservoir.h"

#include <math.h>

#include "volev/units.h"

static const struct {
    const char *name;
    int atoms[VL_NELEMENTS];
} species[VL_NSPECIES] = {
#define VL_X(id, name, h, c, n, o, d) {name, {h, c, n, o, d}},
    VL_SPECIES(VL_X)
#undef VL_X
};

static const struct {
    const char *name;
    int species;
    double floor_kg;
    const char *meaning;
} reservoirs[VL_NRES] = {
#define VL_X(id, name, sp, fl, meaning) {name, sp, fl, meaning},
    VL_RESERVOIRS(VL_X)
#undef VL_X
};

/* Element order matches enum vl_element. */
static const double atomic_weight[VL_NELEMENTS] = {VL_AW_H, VL_AW_C, VL_AW_N, VL_AW_O, VL_AW_D};
static const char *const element_name[VL_NELEMENTS] = {"H", "C", "N", "O", "D"};

/* Molar masses, kg/mol, as constant expressions of the atomic weights. */
static const double molar_mass[VL_NSPECIES] = {
#define VL_X(id, name, h, c, n, o, d)                                                        \
    (h * VL_AW_H + c * VL_AW_C + n * VL_AW_N + o * VL_AW_O + d * VL_AW_D) * 1e-3,
    VL_SPECIES(VL_X)
#undef VL_X
};

double vl_species_molar_mass(int s) { return molar_mass[s]; }

int vl_species_atoms(int s, int el) { return species[s].atoms[el]; }
const char *vl_species_name(int s) { return species[s].name; }
const char *vl_reservoir_name(int r) { return reservoirs[r].name; }
const char *vl_reservoir_meaning(int r) { return reservoirs[r].meaning; }
int vl_reservoir_species(int r) { return reservoirs[r].species; }
double vl_reservoir_floor(int r) { return reservoirs[r].floor_kg; }
const char *vl_element_name(int el) { return element_name[el]; }

double vl_reservoir_element_fraction(int r, int el)
{
    int s = reservoirs[r].species;
    return species[s].atoms[el] * atomic_weight[el] * 1e-3 / vl_species_molar_mass(s);
}

int vl_reservoir_deuterium(int r)
{
    switch (r) {
    case VL_R_WATER:
        return VL_R_D_WATER;
    case VL_R_MANTLE_WATER:
        return VL_R_D_MANTLE_WATER;
    case VL_R_H2:
        return VL_R_D_H2;
    case VL_R_IMPACT_WATER:
        return VL_R_D_IMPACT_WATER;
    case VL_R_SPACE_H:
        return VL_R_SPACE_D;
    default:
        return -1;
    }
}

double vl_reservoir_deuterium_kg(int r, double kg, double dh)
{
    return kg * vl_reservoir_element_fraction(r, VL_EL_H) * dh * VL_AW_D / VL_AW_H;
}

double vl_reservoir_dh(const double *y, int r)
{
    int d = vl_reservoir_deuterium(r);
    if (d >= 0 && y[r] < vl_reservoir_floor(r))
        return NAN;
    double h_mol = fmax(y[r], 0.0) * vl_reservoir_element_fraction(r, VL_EL_H) / (VL_AW_H * 1e-3);
    if (d < 0 || !(h_mol > 0.0))
        return 0.0;
    return fmax(y[d], 0.0) / (VL_AW_D * 1e-3) / h_mol;
}
