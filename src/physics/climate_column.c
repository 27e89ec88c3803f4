/* climate_column.c: the radiative column climate backend.
 *
 * The column (column.c) gives, for a surface temperature and a dry atmosphere, the
 * outgoing longwave radiation and the stratospheric water. Per run, these are
 * tabulated against surface temperature on a grid of CO2 and background pressure
 * (nodes filled lazily into the run's workspace, when the run first needs them; the
 * backend's own state is fixed once created and shared); the right-hand side only
 * interpolates. The energy balance N(T) = S (1 - A(T)) / 4 - OLR(T) is then scanned
 * on the temperature grid for its stable roots (N falling through zero), refined on
 * the interpolant:
 *  - a cold root (below the middle of the ice-albedo ramp, where roots are unstable) is
 *    the frozen (snowball) state, a warm root the
 *    temperate or moist-greenhouse state; a planet stays on its branch while that
 *    root exists, so frozen and temperate states show hysteresis;
 *  - without a warm or cold root, absorbed flux exceeds the OLR limit: runaway.
 * Albedo A(T): ice-covered below climate.column.ice_cover_temp_k, blending to the
 * temperate climate.bond_albedo at ice_free_temp_k, then to the (lower) steam albedo
 * as water vapour absorbs more sunlight; all of it scaled by (Teff/5772 K)^exponent,
 * lower around cooler stars (Rayleigh scattering). */
#include <math.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "climate_internal.h"
#include "volev/column.h"
#include "volev/reservoir.h"
#include "volev/units.h"
#include "volev/water.h"

/* Temperature grid: 2.5 K steps from 150 to 400 K (where climates are decided), 10 K
 * steps to 1000 K, 25 K steps to 2500 K (hot dry states). */
#define T_MIN 150.0
#define N_FINE 100  /* 2.5 K intervals, 150..400 K */
#define N_MID 60    /* 10 K intervals, 400..1000 K */
#define N_HOT 60    /* 25 K intervals, 1000..2500 K */
#define NT (N_FINE + N_MID + N_HOT + 1)
#define LOG_P_MIN (-3) /* log10 Pa of the pressure grids */
#define LOG_P_MAX 9
#define PER_DECADE 4
#define NP ((LOG_P_MAX - LOG_P_MIN) * PER_DECADE + 1)

typedef struct {
    float olr[NT];      /* W/m^2 */
    float log_f[NT];    /* ln of the stratospheric H2O mole fraction (wet only) */
} node;

/* The backend's state: fixed once created (shared by every run of the model). */
typedef struct {
    vl_climate_params cp;
    vl_column_opts opts;
    double w_ice[NT];        /* ice weight of the albedo at each grid temperature */
    double w_steam[NT];      /* steam weight */
} column;

/* A run's workspace: the table, filled lazily, and the last balance. */
typedef struct {
    node *nodes[2][NP][NP];  /* [wet][co2][background], filled lazily, owned */
    /* one-entry cache of the last balance: the Jacobian's perturbations of reservoirs
     * that do not touch the atmosphere, and classify after eval, reuse it */
    int cache_valid, cache_wet;
    double cache_key[4];     /* p_co2, p_bg, instellation, Teff */
    struct balance_s *cache;
    long nodes_built;        /* statistics for the benchmark */
    double build_s;          /* wall time spent building nodes */
} column_work;

static double grid_t(int j)
{
    if (j <= N_FINE)
        return T_MIN + 2.5 * j;
    if (j <= N_FINE + N_MID)
        return 400.0 + 10.0 * (j - N_FINE);
    return 1000.0 + 25.0 * (j - N_FINE - N_MID);
}

/* Fractional grid index of temperature t (clamped to the grid). */
static double grid_index(double t)
{
    double x = t <= 400.0    ? (t - T_MIN) / 2.5
               : t <= 1000.0 ? N_FINE + (t - 400.0) / 10.0
                             : N_FINE + N_MID + (t - 1000.0) / 25.0;
    return x < 0.0 ? 0.0 : x > NT - 1 ? NT - 1 : x;
}

static double smoothstep(double x, double lo, double hi)
{
    if (hi <= lo)
        return x >= hi ? 1.0 : 0.0;
    double u = (x - lo) / (hi - lo);
    u = u < 0.0 ? 0.0 : u > 1.0 ? 1.0 : u;
    return u * u * (3.0 - 2.0 * u);
}

/* Planetary albedo from the ice and steam weights at a surface temperature, for a
 * Sun-like star (the caller scales it with Teff; see file comment). */
static double albedo_w(const vl_climate_params *cp, double w_ice, double w_steam)
{
    double warm = cp->bond_albedo + (cp->steam_albedo - cp->bond_albedo) * w_steam;
    return cp->ice_albedo * w_ice + warm * (1.0 - w_ice);
}

/* Pressure at grid index i, Pa. */
static double grid_p(int i) { return pow(10.0, LOG_P_MIN + (double)i / PER_DECADE); }

/* Fractional grid position of pressure p (clamped to the grid). */
static double grid_pos(double p_pa)
{
    double x = (log10(fmax(p_pa, 1e-30)) - LOG_P_MIN) * PER_DECADE;
    return x < 0.0 ? 0.0 : x > NP - 1 ? NP - 1 : x;
}

/* Tabulate one node: OLR and stratospheric water against T for CO2 pressure p_c and
 * background (N2-like) pressure p_b, both thin-shell pressures of the gas alone. */
static node *build_node(const column *c, column_work *w, int wet, int ic, int ib)
{
    node *n = malloc(sizeof *n);
    if (!n)
        return NULL;
    struct timespec w0, w1;
    clock_gettime(CLOCK_MONOTONIC, &w0);
    double pc = grid_p(ic), pb = grid_p(ib);
    double m_co2 = vl_species_molar_mass(VL_SP_CO2), m_n2 = vl_species_molar_mass(VL_SP_N2);
    vl_column_air air;
    air.p_dry_pa = pc + pb;
    air.q_co2 = pc / air.p_dry_pa;
    air.m_dry = air.p_dry_pa / (pc / m_co2 + pb / m_n2);
    air.cp_dry = air.q_co2 * VL_CP_CO2 + (1.0 - air.q_co2) * VL_CP_N2;
    vl_column_opts o = c->opts;
    o.wet = wet;
    double olr = 0.0, log_f = 0.0;
    for (int j = 0; j < NT; j++) {
        /* a wet column exists only below the critical point; above it the steam
         * column's values are held (OLR at its limit, saturated stratosphere) */
        if (!wet || grid_t(j) < VL_WATER_TC_K - 5.0) {
            vl_column_out out;
            vl_column_eval(&o, &air, grid_t(j), olr, &out);
            olr = out.olr;
            log_f = log(fmax(out.f_strat, 1e-30));
        }
        n->olr[j] = (float)olr;
        n->log_f[j] = (float)log_f;
    }
    w->nodes_built++;
    clock_gettime(CLOCK_MONOTONIC, &w1);
    w->build_s += (double)(w1.tv_sec - w0.tv_sec) + 1e-9 * (double)(w1.tv_nsec - w0.tv_nsec);
    return n;
}

/* The node (built on first use into the run's workspace). */
static const node *get_node(const column *c, column_work *w, int wet, int ic, int ib)
{
    if (!w->nodes[wet][ic][ib])
        w->nodes[wet][ic][ib] = build_node(c, w, wet, ic, ib);
    return w->nodes[wet][ic][ib];
}

/* OLR and ln f_strat on the temperature grid for the given pressures (bilinear in
 * log pressure). Returns 0 on allocation failure. */
static int interpolate(const column *c, column_work *w, int wet, double p_co2, double p_bg,
                       double *olr, double *log_f)
{
    double xc = grid_pos(p_co2), xb = grid_pos(p_bg);
    int ic = (int)xc < NP - 1 ? (int)xc : NP - 2, ib = (int)xb < NP - 1 ? (int)xb : NP - 2;
    double fc = xc - ic, fb = xb - ib;
    const node *n00 = get_node(c, w, wet, ic, ib), *n10 = get_node(c, w, wet, ic + 1, ib);
    const node *n01 = get_node(c, w, wet, ic, ib + 1), *n11 = get_node(c, w, wet, ic + 1, ib + 1);
    if (!n00 || !n10 || !n01 || !n11)
        return 0;
    double w00 = (1 - fc) * (1 - fb), w10 = fc * (1 - fb), w01 = (1 - fc) * fb, w11 = fc * fb;
    for (int j = 0; j < NT; j++) {
        olr[j] = w00 * n00->olr[j] + w10 * n10->olr[j] + w01 * n01->olr[j] + w11 * n11->olr[j];
        log_f[j] = w00 * n00->log_f[j] + w10 * n10->log_f[j] + w01 * n01->log_f[j] +
                   w11 * n11->log_f[j];
    }
    return 1;
}

/* The energy balance on the grid for env's star and atmosphere. */
typedef struct balance_s {
    double net[NT];    /* absorbed - OLR, W/m^2 */
    double olr[NT];
    double log_f[NT];
    double alb[NT];
    int cold;          /* grid cell of the lowest stable root below freezing, or -1 */
    int warm;          /* grid cell of the lowest stable root at or above freezing, or -1 */
} balance;

/* Temperature separating the frozen (snowball) branch from the warm one: the middle of
 * the ice-albedo ramp, where the albedo feedback is strongest and equilibria unstable,
 * so that a stable root crossing it is a label change, not a jump. */
static double split_temp(const column *c) { return 0.5 * (c->cp.ice_cover_k + c->cp.ice_free_k); }

static double root_in(const balance *b, int j)
{
    return grid_t(j) + (grid_t(j + 1) - grid_t(j)) * b->net[j] / (b->net[j] - b->net[j + 1]);
}

static void dry_pressures(const vl_env *env, double *p_co2, double *p_bg)
{
    double k = env->g / env->area_m2;
    *p_co2 = env->mass_kg[VL_GAS_CO2] * k;
    *p_bg = (env->mass_kg[VL_GAS_N2] + env->mass_kg[VL_GAS_O2] + env->mass_kg[VL_GAS_H2]) * k;
}

/* The balance at env (wet: over an ocean), into b. */
static void fill_balance(const column *c, column_work *w, int wet, const vl_env *env,
                         double p_co2, double p_bg, balance *b)
{
    if (!interpolate(c, w, wet, p_co2, p_bg, b->olr, b->log_f))
        for (int j = 0; j < NT; j++) /* out of memory: no equilibrium, reported as NaN */
            b->olr[j] = b->log_f[j] = NAN;
    double scale = pow(env->star.teff_k / VL_TEFF_SUN, c->cp.steam_teff_exp);
    b->cold = b->warm = -1;
    for (int j = 0; j < NT; j++) {
        b->alb[j] = wet ? scale * albedo_w(&c->cp, c->w_ice[j], c->w_steam[j]) : c->cp.bond_albedo;
        b->net[j] = env->instellation * (1.0 - b->alb[j]) / 4.0 - b->olr[j];
    }
    for (int j = 0; j + 1 < NT; j++) {
        if (!(b->net[j] > 0.0 && b->net[j + 1] <= 0.0))
            continue;
        if (root_in(b, j) < split_temp(c)) {
            if (b->cold < 0)
                b->cold = j;
        } else if (b->warm < 0) {
            b->warm = j;
        }
    }
}

/* The balance at env, from the one-entry cache when the dry atmosphere, the flux and
 * the star are those of the previous call. NULL only when out of memory. */
static const balance *get_balance(const column *c, column_work *w, int wet, const vl_env *env)
{
    double key[4];
    dry_pressures(env, &key[0], &key[1]);
    key[2] = env->instellation;
    key[3] = env->star.teff_k;
    if (w->cache && w->cache_valid && w->cache_wet == wet && memcmp(key, w->cache_key, sizeof key) == 0)
        return w->cache;
    if (!w->cache && !(w->cache = malloc(sizeof *w->cache)))
        return NULL;
    fill_balance(c, w, wet, env, key[0], key[1], w->cache);
    memcpy(w->cache_key, key, sizeof key);
    w->cache_wet = wet;
    w->cache_valid = 1;
    return w->cache;
}

/* Runaway and moist-greenhouse thresholds in S_eff units: the largest flux with a warm
 * equilibrium, and the flux that puts the warm equilibrium at f_strat = threshold. */
static void thresholds(const column *c, const balance *b, const vl_env *env, vl_env *out)
{
    double s_run = 0.0, s_moist = NAN, thr = log(c->cp.moist_threshold);
    for (int j = 0; j < NT; j++) {
        if (grid_t(j) < split_temp(c))
            continue;
        double s_eq = 4.0 * b->olr[j] / (1.0 - b->alb[j]);
        if (s_eq > s_run)
            s_run = s_eq;
        if (isnan(s_moist) && j > 0 && b->log_f[j - 1] < thr && b->log_f[j] >= thr)
            s_moist = s_eq;
    }
    (void)env;
    out->s_runaway = s_run / VL_S_EARTH;
    out->s_moist = isnan(s_moist) ? INFINITY : s_moist / VL_S_EARTH;
}

/* Interpolate ln f_strat at temperature t on the grid. */
static double log_f_at(const balance *b, double t)
{
    double x = grid_index(t);
    int j = x >= NT - 1 ? NT - 2 : (int)x;
    double u = x - j;
    return b->log_f[j] + u * (b->log_f[j + 1] - b->log_f[j]);
}

/* Surface temperature on the branch of the regime in force: the cold branch (T below
 * freezing) for the frozen regime, the warm branch otherwise. Where the branch's root
 * exists it is returned; once the branch has vanished (past a saddle-node, before the
 * integrator has switched regime) the "ghost" is returned, the temperature where the
 * imbalance comes closest to zero, so that T_s stays continuous within a regime. */
static double branch_temp(const column *c, const balance *b, int regime)
{
    int cold = regime == VL_REGIME_FROZEN;
    int j = cold ? b->cold : b->warm;
    if (j >= 0)
        return root_in(b, j);
    int lo = 0, hi = NT - 1;
    for (int k = 0; k < NT; k++) {
        if (grid_t(k) < split_temp(c))
            lo = cold ? lo : k + 1;
        else if (cold) {
            hi = k;
            break;
        }
    }
    if (lo > hi)
        lo = hi;
    int best = lo;
    for (int k = lo; k <= hi; k++)
        if (fabs(b->net[k]) < fabs(b->net[best]))
            best = k;
    if (best == 0 || best == NT - 1)
        return grid_t(best);
    /* vertex of the parabola through the three points around the closest approach */
    double y0 = b->net[best - 1], y1 = b->net[best], y2 = b->net[best + 1];
    double den = y0 - 2.0 * y1 + y2;
    double off = den != 0.0 ? 0.5 * (y0 - y2) / den : 0.0;
    off = off < -1.0 ? -1.0 : off > 1.0 ? 1.0 : off;
    return grid_t(best) + off * (off < 0.0 ? grid_t(best) - grid_t(best - 1)
                                            : grid_t(best + 1) - grid_t(best));
}

static void column_eval(const void *state, void *work, double water_kg, vl_env *env)
{
    const column *c = state;
    const vl_climate_params *cp = &c->cp;
    int wet = env->regime != VL_REGIME_DRY;
    const balance *b = get_balance(c, work, wet, env);
    if (!b) { /* out of memory: a NaN state stops the integrator with a message */
        env->t_surf_k = env->t_balance_k = env->f_strat = NAN;
        return;
    }
    thresholds(c, b, env, env);
    double t = branch_temp(c, b, env->regime), log_f = log_f_at(b, t);
    env->t_balance_k = t;
    int runaway = env->regime == VL_REGIME_RUNAWAY;
    env->t_surf_k = runaway ? cp->runaway_surface_temp_k : t;

    vl_dry_air air;
    vl_climate_dry_air(env, &air);
    vl_climate_partition(water_kg, runaway, &air, env);
    env->liquid = 0.0;
    if (wet && !runaway && env->t_surf_k < VL_WATER_TC_K) /* the ice-free share of the ocean */
        env->liquid = smoothstep(env->t_surf_k, cp->ice_cover_k, cp->ice_free_k);
    if (runaway) { /* steam throughout: the upper atmosphere has the bulk vapour fraction */
        double mol_v = env->vapour_kg / vl_species_molar_mass(VL_SP_H2O);
        env->f_strat = mol_v + air.mol > 0.0 ? mol_v / (mol_v + air.mol) : 0.0;
    } else {
        env->f_strat = wet ? exp(log_f) : 0.0;
    }
}

static int column_classify(const void *state, void *work, double water_kg, const vl_env *env)
{
    const column *c = state;
    if (water_kg < c->cp.dry_threshold_kg)
        return VL_REGIME_DRY;
    const balance *b = get_balance(c, work, 1, env);
    if (!b)
        return env->regime;
    int warm_ok = b->warm >= 0, cold_ok = b->cold >= 0;
    if (env->regime == VL_REGIME_FROZEN && cold_ok)
        return VL_REGIME_FROZEN;
    if (!warm_ok) /* too hot for any equilibrium, or only the frozen one (or none: colder
                     than the grid) is left */
        return b->net[NT - 1] > 0.0 ? VL_REGIME_RUNAWAY : VL_REGIME_FROZEN;
    double log_f = log_f_at(b, branch_temp(c, b, VL_REGIME_TEMPERATE));
    return exp(log_f) >= c->cp.moist_threshold ? VL_REGIME_MOIST : VL_REGIME_TEMPERATE;
}

static size_t column_curve(const void *state, void *work, const vl_env *env, int wet,
                           vl_curve *out)
{
    const balance *b = get_balance(state, work, wet, env);
    if (!b)
        return 0;
    for (int j = 0; j < NT; j++) {
        out->t_k[j] = grid_t(j);
        out->olr[j] = b->olr[j];
        out->absorbed[j] = b->olr[j] + b->net[j];
        out->albedo[j] = b->alb[j];
        out->f_strat[j] = wet ? exp(b->log_f[j]) : 0.0;
    }
    return NT;
}

static void column_stats(const void *work, long *nodes, double *build_s)
{
    const column_work *w = work;
    *nodes = w->nodes_built;
    *build_s = w->build_s;
}

static void *column_create(const vl_scenario *sc, vl_status *st)
{
    const vl_climate_params *cp = &sc->climate;
    if (cp->ice_cover_k > cp->ice_free_k || cp->steam_start_k > cp->steam_full_k) {
        vl_fail(st, VL_ERR_INPUT, sc->path, 0,
                "climate.column: ice_cover_temp_k <= ice_free_temp_k and steam_start_temp_k <= "
                "steam_full_temp_k are required");
        return NULL;
    }
    column *c = calloc(1, sizeof *c);
    if (!c) {
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        return NULL;
    }
    c->cp = *cp;
    double g = VL_G_NEWTON * sc->planet.mass_kg / (sc->planet.radius_m * sc->planet.radius_m);
    c->opts = (vl_column_opts){.g = g,
                               .k_h2o = cp->k_h2o,
                               .k_co2 = cp->k_co2,
                               .p0 = cp->p0_pa,
                               .n_h2o = cp->n_h2o,
                               .n_co2 = cp->n_co2,
                               .u_co2_sat = cp->u_co2_sat,
                               .k_cia = cp->k_cia,
                               .strat_offset_k = cp->strat_offset_k,
                               .wet = 1};
    for (int j = 0; j < NT; j++) {
        c->w_ice[j] = 1.0 - smoothstep(grid_t(j), cp->ice_cover_k, cp->ice_free_k);
        c->w_steam[j] = smoothstep(grid_t(j), cp->steam_start_k, cp->steam_full_k);
    }
    return c;
}

static void column_destroy(void *state) { free(state); }

static void *column_work_new(const void *state)
{
    (void)state;
    return calloc(1, sizeof(column_work));
}

static void column_work_free(void *work)
{
    column_work *w = work;
    if (!w)
        return;
    for (int wet = 0; wet < 2; wet++)
        for (int i = 0; i < NP; i++)
            for (int k = 0; k < NP; k++)
                free(w->nodes[wet][i][k]);
    free(w->cache);
    free(w);
}

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
