/* climate.c: the climate interface (climate.h): picks the backend named by
 * climate.model and holds what backends share, the dry-air sums and the
 * saturated ocean/vapour partition. */
#include "volev/climate.h"

#include <math.h>
#include <stdlib.h>

#include "climate_internal.h"
#include "volev/reservoir.h"
#include "volev/water.h"

/* Backends indexed by enum vl_climate_model. */
static const vl_climate_backend *const backends[] = {
    [VL_CLIMATE_COLUMN] = &vl_column_backend,
    [VL_CLIMATE_HZ_FIT] = &vl_hzfit_backend,
};
#define NBACKENDS (sizeof backends / sizeof backends[0])

struct vl_climate {
    const vl_climate_backend *backend;  /* borrowed constant table */
    void *state;                        /* owned through backend->destroy */
};

/* Species of each atmospheric gas (enum vl_gas -> enum vl_species). */
static const int gas_species[VL_NGASES] = {
    [VL_GAS_H2O] = VL_SP_H2O, [VL_GAS_CO2] = VL_SP_CO2, [VL_GAS_N2] = VL_SP_N2,
    [VL_GAS_O2] = VL_SP_O2,   [VL_GAS_H2] = VL_SP_H2,
};

static const char *const regime_names[VL_NREGIMES] = {
    [VL_REGIME_DRY] = "dry",
    [VL_REGIME_FROZEN] = "frozen",
    [VL_REGIME_TEMPERATE] = "temperate",
    [VL_REGIME_MOIST] = "moist_greenhouse",
    [VL_REGIME_RUNAWAY] = "runaway",
    [VL_REGIME_MAGMA] = "magma_ocean",
};

vl_climate *vl_climate_new(const vl_scenario *sc, vl_status *st)
{
    int m = sc->climate.model;
    if (m < 0 || (size_t)m >= NBACKENDS || !backends[m]) {
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "unknown climate model %d", m);
        return NULL;
    }
    vl_climate *c = malloc(sizeof *c);
    if (!c) {
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        return NULL;
    }
    c->backend = backends[m];
    c->state = c->backend->create(sc, st);
    if (!c->state) {
        free(c);
        return NULL;
    }
    return c;
}

void vl_climate_free(vl_climate *c)
{
    if (!c)
        return;
    c->backend->destroy(c->state);
    free(c);
}

struct vl_climate_work {
    const vl_climate_backend *backend;  /* borrowed: the backend that made it */
    void *work;                         /* owned through backend->work_free (may be NULL) */
};

vl_climate_work *vl_climate_work_new(const vl_climate *c, vl_status *st)
{
    vl_climate_work *w = calloc(1, sizeof *w);
    if (w) {
        w->backend = c->backend;
        if (c->backend->work_new && !(w->work = c->backend->work_new(c->state))) {
            free(w);
            w = NULL;
        }
    }
    if (!w)
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    return w;
}

void vl_climate_work_free(vl_climate_work *w)
{
    if (!w)
        return;
    if (w->backend->work_free)
        w->backend->work_free(w->work);
    free(w);
}

void vl_climate_eval(const vl_climate *c, vl_climate_work *w, double water_kg, vl_env *env)
{
    c->backend->eval(c->state, w->work, water_kg, env);
}

int vl_climate_classify(const vl_climate *c, vl_climate_work *w, double water_kg,
                        const vl_env *env)
{
    return c->backend->classify(c->state, w->work, water_kg, env);
}

size_t vl_climate_curve(const vl_climate *c, vl_climate_work *w, const vl_env *env, int wet,
                        const double *t_k, size_t n, vl_curve *out)
{
    return c->backend->curve ? c->backend->curve(c->state, w->work, env, wet, t_k, n, out) : 0;
}

void vl_climate_work_stats(const vl_climate_work *w, long *nodes, double *build_s)
{
    *nodes = 0;
    *build_s = 0.0;
    if (w->backend->stats)
        w->backend->stats(w->work, nodes, build_s);
}

/* The regime's output name, or "invalid" for a number outside enum vl_regime. */
const char *vl_regime_name(int regime)
{
    if (regime < 0 || regime >= VL_NREGIMES)
        return "invalid";
    return regime_names[regime];
}

void vl_climate_dry_air(const vl_env *env, vl_dry_air *air)
{
    air->mass_kg = air->mol = air->co2_mol = 0.0;
    for (int g = 0; g < VL_NGASES; g++) {
        if (g == VL_GAS_H2O)
            continue;
        double mol = env->mass_kg[g] / vl_species_molar_mass(gas_species[g]);
        air->mass_kg += env->mass_kg[g];
        air->mol += mol;
        if (g == VL_GAS_CO2)
            air->co2_mol = mol;
    }
}

/* Thin shell: p_v = x_v (M_v + M_d) g / A with x_v = n_v / (n_v + n_d). Setting p_v = p_sat
 * and P = p_sat A / g gives M_v^2 + (M_d - P) M_v - P n_d m_w = 0, whose positive root is
 * taken in the cancellation-free form for either sign of M_d - P (M_v = P when M_d = 0). */
double vl_climate_saturated_vapour(double p_sat_pa, double g, double area_m2,
                                   const vl_dry_air *air, double water_kg)
{
    double p = p_sat_pa * area_m2 / g;
    double b = air->mass_kg - p;
    double c = p * air->mol * vl_species_molar_mass(VL_SP_H2O);
    double d = sqrt(b * b + 4.0 * c);
    double mv = b > 0.0 ? 2.0 * c / (b + d) : 0.5 * (d - b);
    return isnan(mv) ? mv : fmin(mv, water_kg); /* fmin would turn a NaN into all the water */
}

void vl_climate_partition(double water_kg, int all_vapour, const vl_dry_air *air, vl_env *env)
{
    double water = fmax(water_kg, 0.0);
    env->vapour_kg = all_vapour || env->t_surf_k >= VL_WATER_TC_K
                         ? water
                         : vl_climate_saturated_vapour(vl_water_psat(env->t_surf_k), env->g,
                                                       env->area_m2, air, water);
    env->ocean_kg = water - env->vapour_kg;
    env->mass_kg[VL_GAS_H2O] = env->vapour_kg;
}
