/* climate_column.c: the radiative column climate backend.
 *
 * The column (column.h: profile, non-grey radiation, clouds) is tabulated against
 * surface temperature and the gas amounts (climate_table.c: shared, lazily filled); the
 * energy balance N(T) = S (1 - A(T))/4 - OLR(T) of the moment is read from it
 * (climate_balance.c) and its stable roots are the climate's equilibria, on three
 * branches:
 *  - cold: below the middle of the ice-albedo ramp (where equilibria are unstable), the
 *    frozen (snowball) state;
 *  - warm: above it while the surface keeps water (below the temperature at which the
 *    whole inventory is vapour, or the critical point): temperate or moist greenhouse;
 *  - hot: above that, with all the water in the air: the runaway (post-runaway) state,
 *    whose surface temperature follows from the balance like every other.
 * A planet keeps its branch while that branch's root exists (the frozen/warm and
 * warm/hot hysteresis), searched outward from its last position; once it vanishes the
 * "ghost" (least |N|) keeps the temperature continuous until the integrator has located
 * the regime change. A dry planet (less water than climate.dry_threshold_to) takes the
 * stable root nearest its last one over the whole range. */
#include <math.h>

#include "volev/smooth.h"
#include <stdlib.h>
#include <string.h>

#include "climate_balance.h"
#include "climate_internal.h"
#include "volev/reservoir.h"
#include "volev/units.h"
#include "volev/water.h"

typedef struct {
    vl_climate_params cp;
    vl_surface surface;
    double g, area_m2;
    double split_k;            /* cold/warm branch boundary */
    vl_ctable *table;          /* shared, borrowed from the registry */
} column;

typedef struct {
    vl_ct_lookaside la;
    vl_balance bal[2];         /* [wet] */
} column_work;

static int wet_regime(int regime)
{
    return regime == VL_REGIME_FROZEN || regime == VL_REGIME_TEMPERATE ||
           regime == VL_REGIME_MOIST;
}

/* The balance of env's moment for a wet or dry surface (water_kg: the surface water). */
static vl_balance *balance_of(const column *c, column_work *w, int wet, double water_kg,
                              const vl_env *env)
{
    vl_balance_key k;
    memset(&k, 0, sizeof k); /* padding compared by memcmp */
    double per_area = c->g / c->area_m2;
    k.p[VL_CT_WATER] = fmax(water_kg, 0.0) * per_area;
    k.p[VL_CT_CO2] = env->mass_kg[VL_GAS_CO2] * per_area;
    k.p[VL_CT_BG] = (env->mass_kg[VL_GAS_N2] + env->mass_kg[VL_GAS_O2]) * per_area;
    k.p[VL_CT_H2] = env->mass_kg[VL_GAS_H2] * per_area;
    k.instellation = env->instellation;
    k.teff_k = env->star.teff_k;
    k.wet = wet;
    vl_balance *b = &w->bal[wet];
    vl_balance_set(b, &k, c->g, c->split_k);
    return b;
}

static int branch_of(int regime)
{
    switch (regime) {
    case VL_REGIME_FROZEN: return VL_BRANCH_COLD;
    case VL_REGIME_RUNAWAY: return VL_BRANCH_HOT;
    case VL_REGIME_DRY: return VL_BRANCH_ANY;
    default: return VL_BRANCH_WARM;
    }
}

/* The surface temperature of regime's branch: its root, or the ghost once it is gone. */
static double branch_temp(const column *c, column_work *w, vl_balance *b, int regime)
{
    double r;
    int br = branch_of(regime);
    if (vl_balance_root(b, c->table, &w->la, &c->surface, br, c->split_k, &r))
        return r;
    return vl_balance_ghost(b, c->table, &w->la, &c->surface, br, c->split_k);
}

/* Relative width of the knee of vapour_capped (C1 in its arguments; common practice). */
#define CAP_KNEE 0.05

/* The homopause's water mixing ratio f (the table's, for a column saturated wherever it
 * can be) capped by the vapour's share of the column, x_v = n_v / (n_v + n_dry), of the
 * water actually in the air: the stratosphere cannot hold more water per molecule than
 * the whole column does (the cold trap only removes it: a mass balance, common
 * practice). Without the cap a dry planet with a hot surface under a thin atmosphere
 * kept f = 0.99 with no water at all, so its escape stage saw an upper atmosphere of
 * water-borne hydrogen that was not there
 * (docs/model.md section 3, docs/hardening.md "Stalls"). f is returned unchanged while
 * f <= x_v (every planet with the water its stratosphere holds); above, x_v g(f / x_v)
 * with g(u) = u - (u - 1)^2 / (4 k) on [1, 1 + 2k] and 1 + k beyond, k = CAP_KNEE:
 * continuous with its first derivative, never above f nor above (1 + k) x_v, and 0
 * without vapour. */
static double vapour_capped(double f, double vapour_kg, const vl_dry_air *air)
{
    double nv = vapour_kg / vl_species_molar_mass(VL_SP_H2O);
    double x = nv > 0.0 ? nv / (nv + air->mol) : 0.0;
    if (!(x > 0.0))
        return 0.0;
    if (f <= x)
        return f;
    double u = f / x, k = CAP_KNEE;
    return x * (u >= 1.0 + 2.0 * k ? 1.0 + k : u - (u - 1.0) * (u - 1.0) / (4.0 * k));
}

static void column_eval(const void *state, void *work, double water_kg, vl_env *env)
{
    const column *c = state;
    column_work *w = work;
    /* wet: an ocean while the surface keeps water (a runaway's steam ocean too, until it
     * has all evaporated: the balance turns sea into rock at that temperature) */
    int wet = env->regime != VL_REGIME_DRY;
    vl_balance *b = balance_of(c, w, wet, water_kg, env);
    /* a molten surface is at the mantle's potential temperature (the melt stage), within
     * the table's range; its net flux cools the mantle */
    int molten = env->regime == VL_REGIME_MAGMA;
    double t = molten ? fmin(fmax(env->melt.tp_k, vl_ct_grid_t(0)), vl_ct_grid_t(VL_CT_NT - 1))
                      : branch_temp(c, w, b, env->regime);
    if (b->oom) { /* out of memory: a NaN state stops the integrator with a message */
        env->t_surf_k = env->t_balance_k = env->f_strat = NAN;
        return;
    }
    env->t_surf_k = env->t_balance_k = t;
    env->f_strat = exp(vl_balance_logf(b, c->table, &w->la, &c->surface, t));
    if (molten) /* elsewhere the surface sits at (or near) a balance: not needed */
        env->net_flux_w_m2 = vl_balance_net(b, c->table, &w->la, &c->surface, t);
    env->s_runaway = env->s_moist = NAN; /* thresholds: only the balance curves compute them */
    vl_dry_air air;
    vl_climate_dry_air(env, &air);
    vl_climate_partition(water_kg, 0, &air, env); /* saturated, at most all of it */
    env->f_strat = vapour_capped(env->f_strat, env->vapour_kg, &air);
    env->liquid = 0.0;
    if (wet_regime(env->regime) && t < VL_WATER_TC_K) /* the ice-free share of the ocean */
        env->liquid = vl_smoothstep(t, c->cp.ice_cover_k, c->cp.ice_free_k);
}

/* 1 and the root temperature if branch br of balance b has a root. */
static int has_root(const column *c, column_work *w, vl_balance *b, int br, double *r)
{
    return vl_balance_root(b, c->table, &w->la, &c->surface, br, c->split_k, r);
}

/* Warm-branch regime from its root's stratospheric water. */
static int warm_regime(const column *c, column_work *w, vl_balance *b, double r)
{
    double f = exp(vl_balance_logf(b, c->table, &w->la, &c->surface, r));
    return f >= c->cp.moist_threshold ? VL_REGIME_MOIST : VL_REGIME_TEMPERATE;
}

static int column_classify(const void *state, void *work, double water_kg, const vl_env *env)
{
    const column *c = state;
    column_work *w = work;
    if (water_kg < c->cp.dry_threshold_kg)
        return VL_REGIME_DRY;
    vl_balance *wet = balance_of(c, w, 1, water_kg, env);
    double r;
    if (env->regime == VL_REGIME_FROZEN &&
        (has_root(c, w, wet, VL_BRANCH_COLD, &r) ||
         vl_balance_below_floor(wet, c->table, &w->la, &c->surface))) /* held at the floor */
        return VL_REGIME_FROZEN;
    if (env->regime == VL_REGIME_RUNAWAY && has_root(c, w, wet, VL_BRANCH_HOT, &r))
        return VL_REGIME_RUNAWAY;
    if (has_root(c, w, wet, VL_BRANCH_WARM, &r))
        return warm_regime(c, w, wet, r);
    if (has_root(c, w, wet, VL_BRANCH_HOT, &r))
        return VL_REGIME_RUNAWAY;
    if (has_root(c, w, wet, VL_BRANCH_COLD, &r))
        return VL_REGIME_FROZEN;
    /* no equilibrium at all: too hot for any (runaway) or colder than the grid */
    return vl_balance_net(wet, c->table, &w->la, &c->surface, 400.0) > 0.0 ? VL_REGIME_RUNAWAY
                                                                         : VL_REGIME_FROZEN;
}

/* Thresholds in S_eff units over the wet balance's grid: the largest flux with a warm
 * equilibrium (4 OLR/(1 - A) maximised over the warm range) and the flux that puts the
 * warm equilibrium at the moist-greenhouse mixing ratio. */
static void thresholds(const column *c, vl_curve *cv, size_t n, double t_hot)
{
    double s_run = 0.0, s_moist = NAN, thr = c->cp.moist_threshold;
    for (size_t j = 0; j < n; j++) {
        if (cv->t_k[j] < c->split_k || cv->t_k[j] > t_hot)
            continue;
        double s_eq = 4.0 * cv->olr[j] / (1.0 - cv->albedo[j]);
        if (s_eq > s_run)
            s_run = s_eq;
        if (isnan(s_moist) && j > 0 && cv->f_strat[j - 1] < thr && cv->f_strat[j] >= thr)
            s_moist = s_eq;
    }
    cv->s_runaway = s_run / VL_S_EARTH;
    cv->s_moist = isnan(s_moist) ? INFINITY : s_moist / VL_S_EARTH;
}

/* The curves of balance b at t_k[0..n-1] into out (from index 0). */
static void fill_curve(const column *c, column_work *w, vl_balance *b, const vl_env *env,
                       const double *t_k, size_t n, vl_curve *out)
{
    for (size_t i = 0; i < n; i++) {
        double t = t_k[i];
        out->t_k[i] = t;
        out->olr[i] = vl_balance_olr(b, c->table, &w->la, &c->surface, t);
        out->albedo[i] = vl_balance_albedo(b, c->table, &w->la, &c->surface, t);
        out->absorbed[i] = env->instellation * (1.0 - out->albedo[i]) / 4.0;
        out->f_strat[i] = exp(vl_balance_logf(b, c->table, &w->la, &c->surface, t));
    }
}

static size_t column_curve(const void *state, void *work, const vl_env *env, int wet,
                           const double *t_k, size_t n, vl_curve *out)
{
    const column *c = state;
    column_work *w = work;
    double water = env->ocean_kg + env->vapour_kg;
    vl_balance *b = balance_of(c, w, wet, wet ? water : 0.0, env);
    double grid[VL_CT_NT];
    for (int j = 0; j < VL_CT_NT; j++)
        grid[j] = vl_ct_grid_t(j);
    fill_curve(c, w, b, env, grid, VL_CT_NT, out); /* the thresholds come from the grid */
    thresholds(c, out, VL_CT_NT, vl_limits_t_hot(b));
    if (t_k)
        fill_curve(c, w, b, env, t_k, n < VL_CURVE_MAX ? n : VL_CURVE_MAX, out);
    else
        n = VL_CT_NT;
    return b->oom ? 0 : n;
}

static void column_stats(const void *work, long *nodes, double *build_s)
{
    const column_work *w = work;
    *nodes = w->la.points;
    *build_s = w->la.build_s;
}

/* The column options of the scenario. */
static vl_column_opts options(const vl_scenario *sc, double g)
{
    const vl_climate_params *cp = &sc->climate;
    vl_column_opts o;
    memset(&o, 0, sizeof o); /* the table registry compares options with memcmp */
    o.g = g;
    o.scales = (vl_opacity_scales){cp->h2o_line_scale, cp->h2o_nir_line_scale, cp->co2_line_scale,
                                   cp->h2o_cont_scale, cp->co2_cont_scale,
                                   cp->cia_scale};
    o.strat_offset_k = cp->strat_offset_k;
    if (cp->cloud_fraction > 0.0)
        o.cloud = (vl_cloud){cp->cloud_p_ratio, cp->cloud_tau, 0.5 * cp->cloud_tau};
    return o;
}

static vl_surface surface_of(const vl_climate_params *cp)
{
    return (vl_surface){cp->ocean_albedo, cp->land_albedo, cp->land_fraction, cp->ice_albedo_vis,
                        cp->ice_albedo_nir, cp->ice_cover_k, cp->ice_free_k, cp->melt_albedo,
                        cp->melt_start_k, cp->melt_full_k, cp->cloud_fraction,
                        cp->albedo_mode == VL_ALBEDO_FIXED, cp->bond_albedo};
}

static void *column_create(const vl_scenario *sc, vl_status *st)
{
    const vl_climate_params *cp = &sc->climate;
    if (cp->ice_cover_k > cp->ice_free_k || cp->melt_start_k > cp->melt_full_k) {
        vl_fail(st, VL_ERR_INPUT, sc->path, 0,
                "climate.column: ice_cover_temp_k <= ice_free_temp_k and melt_start_temp_k <= "
                "melt_full_temp_k are required");
        return NULL;
    }
    column *c = calloc(1, sizeof *c);
    if (!c) {
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        return NULL;
    }
    c->cp = *cp;
    double r = sc->planet.radius_m;
    c->g = VL_G_NEWTON * sc->planet.mass_kg / (r * r);
    c->area_m2 = 4.0 * VL_PI * r * r;
    c->split_k = 0.5 * (cp->ice_cover_k + cp->ice_free_k);
    c->surface = surface_of(cp);
    vl_column_opts o = options(sc, c->g);
    if (!(c->table = vl_ctable_get(&o))) {
        free(c);
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        return NULL;
    }
    return c;
}

static void column_destroy(void *state)
{
    column *c = state;
    if (c)
        vl_ctable_release(c->table);
    free(c);
}

static void *column_work_new(const void *state)
{
    (void)state;
    return calloc(1, sizeof(column_work));
}

static void column_work_free(void *work) { free(work); }

const vl_climate_backend vl_column_backend = {
    .name = "column",
    .create = column_create,
    .destroy = column_destroy,
    .work_new = column_work_new,
    .work_free = column_work_free,
    .eval = column_eval,
    .classify = column_classify,
    .curve = column_curve,
    .stats = column_stats,
};
