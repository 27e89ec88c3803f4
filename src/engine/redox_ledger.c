/* redox_ledger.c: redox weights, pools and the surface's redox budget (redox_ledger.h). */
#include "volev/redox_ledger.h"

#include <math.h>
#include <pthread.h>

#include "volev/units.h"

/* mol O-equivalent per atom, in the order of enum vl_element (H, C, N, O, D): the
 * oxidation state of H (+1), C (+4 in CO2), N (0 in N2) and O (-2) relative to H2O, CO2
 * and N2, over the two electrons one O atom takes (common practice). D: 0, a tracer
 * (redox_ledger.h). */
static const double element_weight[VL_NELEMENTS] = {-0.5, -2.0, 0.0, 1.0, 0.0};

double vl_redox_element_weight(int el) { return element_weight[el]; }

double vl_redox_species_weight(int s)
{
    double w = 0.0;
    for (int el = 0; el < VL_NELEMENTS; el++)
        w += element_weight[el] * vl_species_atoms(s, el);
    return w;
}

double vl_redox_weight_kg(int r)
{
    int s = vl_reservoir_species(r);
    return vl_redox_species_weight(s) * VL_AW_O * 1e-3 / vl_species_molar_mass(s);
}

/* Every reservoir named, no default: a new reservoir does not compile cleanly (-Wswitch)
 * until it is given a pool, and the redox ledger test fails on -1. */
int vl_redox_pool(int r)
{
    switch ((enum vl_reservoir)r) {
    case VL_R_WATER: case VL_R_CO2: case VL_R_N2: case VL_R_H2: case VL_R_O2:
    case VL_R_D_WATER: case VL_R_D_H2:
        return VL_POOL_SURFACE;
    case VL_R_SPACE_H: case VL_R_SPACE_C: case VL_R_SPACE_N: case VL_R_SPACE_O:
    case VL_R_SPACE_D:
        return VL_POOL_SPACE;
    case VL_R_MANTLE_WATER: case VL_R_CARBONATE: case VL_R_MANTLE_C: case VL_R_MANTLE_N:
    case VL_R_OX_ROCK: case VL_R_MELT_O: case VL_R_IMPACT_WATER: case VL_R_IMPACT_CO2:
    case VL_R_IMPACT_N2: case VL_R_CRUST_N: case VL_R_D_MANTLE_WATER:
    case VL_R_D_IMPACT_WATER:
        return VL_POOL_ROCK;
    case VL_NRES:
        break;
    }
    return -1;
}

const char *vl_redox_pool_name(int pool)
{
    static const char *const name[VL_NPOOLS] = {"surface", "space", "rock"};
    return pool >= 0 && pool < VL_NPOOLS ? name[pool] : "?";
}

void vl_redox_pools(const double *y, vl_redox_state *out)
{
    for (int p = 0; p < VL_NPOOLS; p++)
        out->pool[p] = 0.0;
    out->gross = 0.0;
    for (int r = 0; r < VL_NRES; r++) {
        double v = y[r] * vl_redox_weight_kg(r);
        out->pool[vl_redox_pool(r)] += v;
        out->gross += fabs(v);
    }
}

/* The surface reservoirs with a nonzero redox weight (H2O, CO2, N2 and deuterium weigh
 * nothing: their terms add exact zeros), in state order, with their weights; built once
 * per process. */
static int surface_n, surface_r[VL_NRES];
static double surface_w[VL_NRES];
static pthread_once_t surface_once = PTHREAD_ONCE_INIT;

static void surface_terms(void)
{
    for (int r = 0; r < VL_NRES; r++)
        if (vl_redox_pool(r) == VL_POOL_SURFACE && vl_redox_weight_kg(r) != 0.0) {
            surface_r[surface_n] = r;
            surface_w[surface_n++] = vl_redox_weight_kg(r);
        }
}

double vl_redox_surface_rate(const double *dydt)
{
    pthread_once(&surface_once, surface_terms);
    double s = 0.0;
    for (int k = 0; k < surface_n; k++)
        s += dydt[surface_r[k]] * surface_w[k];
    return s;
}

/* mol O-equivalent the surface gains per mole of reaction k's extent, against the
 * gross weight moved: nonzero beyond round-off means the reaction can change it. */
static int reaction_touches(const vl_reaction *k)
{
    double net = 0.0, gross = 0.0;
    for (int i = 0; i < k->n; i++) {
        double w = k->nu[i] * vl_redox_species_weight(vl_reservoir_species(k->res[i]));
        gross += fabs(w);
        if (vl_redox_pool(k->res[i]) == VL_POOL_SURFACE)
            net += w;
    }
    return fabs(net) > 1e-12 * gross;
}

int vl_redox_touches_surface(const vl_process *p)
{
    for (size_t k = 0; k < p->ntransfers; k++) {
        int from = p->transfers[k].from, to = p->transfers[k].to;
        int in_from = vl_redox_pool(from) == VL_POOL_SURFACE;
        int in_to = vl_redox_pool(to) == VL_POOL_SURFACE;
        if (in_from != in_to && vl_redox_weight_kg(from) != 0.0)
            return 1;
    }
    for (size_t k = 0; k < p->nreactions; k++)
        if (reaction_touches(&p->reactions[k]))
            return 1;
    return 0;
}

double vl_redox_relative(double x, const vl_redox_state *start, const vl_redox_state *end)
{
    double gross = start->gross + end->gross;
    return gross > 0.0 ? fabs(x) / gross : fabs(x);
}

double vl_redox_residual(const vl_redox_state *start, const vl_redox_state *end)
{
    double net = 0.0;
    for (int p = 0; p < VL_NPOOLS; p++)
        net += end->pool[p] - start->pool[p];
    return vl_redox_relative(net, start, end);
}
