/* climate_balance.c: the column climate's energy balance at one instant
 * (climate_balance.h).
 *
 * Grid values come from the table's pressure nodes around the state, weighted linearly
 * in log pressure (H2 linearly in pressure near zero); the cloud fraction mixes the
 * clear and cloudy columns; the planetary albedo follows from each node's band
 * reflectances, the surface's band albedos at that temperature and the star's band
 * shares (radiation.h). Between grid temperatures every quantity is a cubic Hermite
 * curve with the slopes of the weighted three-point finite difference (non-uniform grid),
 * so it is continuous with its first derivative. */
#include "climate_balance.h"

#include "volev/co2.h"

#include <math.h>

#include "volev/smooth.h"
#include <string.h>

#include "volev/profile.h"
#include "volev/radiation.h"
#include "volev/spectrum.h"
#include "volev/water.h"

#define T_MIN 150.0
#define OVERLAP_K 5.0 /* half-width of the overlap of neighbouring branches, K */
#define T_MAX 3000.0
#define WINDOW 6  /* cells searched around the last root before a whole-range scan */
#define STRIDE 6  /* grid points between the ghost search's coarse samples */

void vl_surface_albedo(const vl_surface *s, double ocean, double t, double a[VL_NBANDS])
{
    double w_melt = vl_smoothstep(t, s->melt_start_k, s->melt_full_k);
    double w_ice = ocean * (1.0 - vl_smoothstep(t, s->ice_cover_k, s->ice_free_k));
    double sea = ocean * (1.0 - s->land_fraction);
    double open = sea * s->ocean + (1.0 - sea) * s->land;
    for (int b = 0; b < VL_NBANDS; b++) {
        double ice = vl_band_edge[b] >= 14300.0 ? s->ice_vis : s->ice_nir;
        double cold = w_ice * ice + (1.0 - w_ice) * open;
        a[b] = w_melt * s->melt + (1.0 - w_melt) * cold;
    }
}

void vl_balance_set(vl_balance *b, const vl_balance_key *key, double g, double split_k)
{
    (void)split_k;
    if (b->valid && memcmp(&b->key, key, sizeof *key) == 0)
        return;
    int same_star = b->valid && b->key.teff_k == key->teff_k;
    b->key = *key;
    for (int d = 0; d < VL_CT_NDIM; d++)
        vl_ct_bracket(d, key->p[d], &b->lo[d], &b->w[d]);
    for (int c = 0; c < 1 << VL_CT_NDIM; c++) {
        double w = 1.0;
        for (int d = 0; d < VL_CT_NDIM; d++)
            w *= c >> d & 1 ? b->w[d] : 1.0 - b->w[d];
        b->wc[c] = w;
    }
    if (!same_star)
        vl_star_band_shares(key->teff_k, b->share);
    memset(b->have, 0, sizeof b->have);
    vl_limits_reset(b, g);
    b->valid = 1;
}

/* How much of a wet planet's ocean is left at t: 1 below the temperature at which it
 * has all evaporated, 0 above, a 10 K smoothstep in between (the surface turns from
 * sea to rock, and the clouds that the ocean feeds go). */
static double ocean_left(vl_balance *b, double t)
{
    if (!b->key.wet)
        return 0.0;
    /* t below the ramp by more than its rounding: the smoothstep is 0 */
    if (vl_limits_cond_above(b, t + 10.0 + 1e-6))
        return 1.0;
    double t_cond = vl_limits_t_cond(b);
    return 1.0 - vl_smoothstep(t, t_cond - 10.0, t_cond);
}

/* The corner values of grid point j (of the two kept, the one made for the same lower
 * corner, else the older one), each part emptied unless it was made for the same lower
 * corner, ocean share and star. */
static vl_corner_values *corners_at(vl_balance *b, int j, double ocean)
{
    int k = b->recent[j];
    if (memcmp(b->corners[j][k].lo, b->lo, sizeof b->lo) != 0) /* the other one, or older */
        k = !k;
    b->recent[j] = (unsigned char)k;
    vl_corner_values *cv = &b->corners[j][k];
    if (memcmp(cv->lo, b->lo, sizeof cv->lo) != 0) {
        memcpy(cv->lo, b->lo, sizeof cv->lo);
        cv->has_point = cv->has_ocean = cv->has_star = 0;
        cv->has_surface = 0;
    }
    if (cv->ocean != ocean) {
        cv->ocean = ocean;
        cv->has_ocean = cv->has_star = 0;
        cv->has_surface = 0;
    }
    if (cv->teff_k != b->key.teff_k) {
        cv->teff_k = b->key.teff_k;
        cv->has_star = 0;
    }
    return cv;
}

/* The node point of corner c at grid point j and its ln f_strat; NULL when out of
 * memory. */
static const vl_column_point *corner_point(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la,
                                           vl_corner_values *cv, int j, int c)
{
    if (cv->has_point >> c & 1)
        return cv->point[c];
    int idx[VL_CT_NDIM];
    for (int d = 0; d < VL_CT_NDIM; d++)
        idx[d] = b->lo[d] + (c >> d & 1);
    const vl_column_point *p = vl_ctable_point(t, la, idx, j);
    if (!p)
        return NULL;
    cv->point[c] = p;
    cv->logf[c] = log(fmax(p->f_strat, 1e-30));
    cv->has_point |= 1u << c;
    return p;
}

/* The OLR and albedo of corner c's point p at grid point j under the ocean share
 * cv->ocean (cloud fraction cf). */
static void corner_values(const vl_balance *b, const vl_surface *s, vl_corner_values *cv,
                          const vl_column_point *p, int j, int c, double cf)
{
    if (!(cv->has_ocean >> c & 1)) {
        cv->olr[c] = (1.0 - cf) * p->olr[0] + cf * p->olr[1];
        if (!s->fixed) {
            if (!cv->has_surface)
                vl_surface_albedo(s, cv->ocean, vl_ct_grid_t(j), cv->a);
            cv->has_surface = 1;
            vl_radiation_band_albedo(&p->sw[0], cv->a, cv->g[c][0]);
            vl_radiation_band_albedo(&p->sw[1], cv->a, cv->g[c][1]);
        }
        cv->has_ocean |= 1u << c;
    }
    if (!(cv->has_star >> c & 1)) {
        cv->alb[c] = s->fixed ? s->fixed_albedo
                              : (1.0 - cf) * vl_radiation_albedo_of(b->share, cv->a, cv->g[c][0]) +
                                    cf * vl_radiation_albedo_of(b->share, cv->a, cv->g[c][1]);
        cv->has_star |= 1u << c;
    }
}

/* Fill grid point j from the nodes around the state: the node points' values weighted
 * in corner order (each value computed as vl_radiation_albedo would, once for as long as
 * corners_at keeps it). */
static void ensure(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s, int j)
{
    if (b->have[j])
        return;
    double ocean = ocean_left(b, vl_ct_grid_t(j)), cf = ocean * s->cloud_fraction;
    vl_corner_values *cv = corners_at(b, j, ocean);
    double olr = 0.0, alb = 0.0, logf = 0.0;
    for (int c = 0; c < VL_BALANCE_CORNERS; c++) {
        double w = b->wc[c];
        if (w == 0.0)
            continue;
        const vl_column_point *p = corner_point(b, t, la, cv, j, c);
        if (!p) {
            b->oom = 1;
            continue;
        }
        corner_values(b, s, cv, p, j, c, cf);
        olr += w * cv->olr[c];
        alb += w * cv->alb[c];
        logf += w * cv->logf[c];
    }
    b->olr[j] = olr;
    b->alb[j] = alb;
    b->logf[j] = logf;
    b->have[j] = 1;
}

/* Grid net flux at j. */
static double net_at(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s, int j)
{
    ensure(b, t, la, s, j);
    return b->key.instellation * (1.0 - b->alb[j]) / 4.0 - b->olr[j];
}

/* Slope of series v at grid point j (weighted three-point difference; one-sided at the
 * ends). */
static double slope(const double *v, int j)
{
    if (j <= 0)
        return (v[1] - v[0]) / (vl_ct_grid_t(1) - vl_ct_grid_t(0));
    if (j >= VL_CT_NT - 1)
        return (v[j] - v[j - 1]) / (vl_ct_grid_t(j) - vl_ct_grid_t(j - 1));
    double h0 = vl_ct_grid_t(j) - vl_ct_grid_t(j - 1), h1 = vl_ct_grid_t(j + 1) - vl_ct_grid_t(j);
    double d0 = (v[j] - v[j - 1]) / h0, d1 = (v[j + 1] - v[j]) / h1;
    return (d0 * h1 + d1 * h0) / (h0 + h1);
}

/* The Hermite coefficients of series v on grid cell j: v[j], slope(v, j), v[j + 1],
 * slope(v, j + 1). */
static void cell_coefficients(const double *v, int j, double c[4])
{
    c[0] = v[j];
    c[1] = slope(v, j);
    c[2] = v[j + 1];
    c[3] = slope(v, j + 1);
}

/* The grid points the Hermite curve on cell j reads (j - 1 to j + 2, those on the grid). */
static void ensure_cell(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                        int j)
{
    for (int k = j - 1; k <= j + 2; k++)
        if (k >= 0 && k < VL_CT_NT)
            ensure(b, t, la, s, k);
}

/* The cubic Hermite basis at temp on the cell [t0, t0 + h] (clamped to it), the two
 * slope terms already times h: the value is hermite_sum(w, c). */
static void hermite_basis(double t0, double h, double temp, double w[4])
{
    double u = (temp - t0) / h;
    u = u < 0.0 ? 0.0 : u > 1.0 ? 1.0 : u;
    w[0] = (1.0 + 2.0 * u) * (1.0 - u) * (1.0 - u);
    w[1] = u * (1.0 - u) * (1.0 - u) * h;
    w[2] = u * u * (3.0 - 2.0 * u);
    w[3] = u * u * (u - 1.0) * h;
}

static double hermite_sum(const double w[4], const double c[4])
{
    return w[0] * c[0] + w[1] * c[1] + w[2] * c[2] + w[3] * c[3];
}

/* Cubic Hermite value of the series sel (0 OLR, 1 albedo, 2 ln f) at temperature temp. */
static double hermite(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                      int sel, double temp)
{
    double x = vl_ct_grid_index(temp);
    int j = (int)x < VL_CT_NT - 1 ? (int)x : VL_CT_NT - 2;
    ensure_cell(b, t, la, s, j);
    const double *v = sel == 0 ? b->olr : sel == 1 ? b->alb : b->logf;
    double t0 = vl_ct_grid_t(j), w[4], c[4];
    hermite_basis(t0, vl_ct_grid_t(j + 1) - t0, temp, w);
    cell_coefficients(v, j, c);
    return hermite_sum(w, c);
}

double vl_balance_olr(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                      double temp)
{
    return hermite(b, t, la, s, 0, temp);
}

double vl_balance_albedo(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                         double temp)
{
    return hermite(b, t, la, s, 1, temp);
}

double vl_balance_logf(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                       double temp)
{
    return hermite(b, t, la, s, 2, temp);
}

double vl_balance_net(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                      double temp)
{
    return b->key.instellation * (1.0 - hermite(b, t, la, s, 1, temp)) / 4.0 -
           hermite(b, t, la, s, 0, temp);
}

/* ------------------------------------------------------------------ roots */

/* Temperature range of branch br. */
static void branch_range(vl_balance *b, int br, double split_k, double *lo, double *hi)
{
    /* neighbouring branches overlap by 2 OVERLAP_K around their boundary (the cold and
     * warm ones around the split, the warm and hot ones around the steam point), so that
     * a root that moves across it keeps its regime until it is clear of the other side
     * (hysteresis: no chattering of freeze and thaw, or of runaway onset and end, where
     * an equilibrium sits on the boundary) */
    *lo = br == VL_BRANCH_WARM  ? split_k - OVERLAP_K
          : br == VL_BRANCH_HOT ? vl_limits_t_hot(b) - OVERLAP_K
                                : vl_limits_t_floor(b);
    *hi = br == VL_BRANCH_COLD   ? split_k + OVERLAP_K
          : br == VL_BRANCH_WARM ? vl_limits_t_hot(b) + OVERLAP_K
                                 : T_MAX;
    *lo = fmax(*lo, vl_limits_t_floor(b));
    if (*hi < *lo)
        *hi = *lo;
}

/* The Hermite curves of OLR and albedo on grid cell j, with everything hermite() reads
 * from the grid and the series computed once (the same grid points ensured). */
typedef struct {
    int j;
    double t0, h;
    double olr[4], alb[4]; /* v[j], slope(v, j), v[j + 1], slope(v, j + 1) */
} cell_curve;

static void cell_curve_of(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                          int j, cell_curve *cc)
{
    ensure_cell(b, t, la, s, j);
    cc->j = j;
    cc->t0 = vl_ct_grid_t(j);
    cc->h = vl_ct_grid_t(j + 1) - cc->t0;
    cell_coefficients(b->olr, j, cc->olr);
    cell_coefficients(b->alb, j, cc->alb);
}

/* vl_balance_net at temp inside cell cc->j: hermite()'s basis and sums, so the same value
 * to the bit, without the grid look-ups. */
static double cell_net(const vl_balance *b, const cell_curve *cc, double temp)
{
    double w[4];
    hermite_basis(cc->t0, cc->h, temp, w);
    return b->key.instellation * (1.0 - hermite_sum(w, cc->alb)) / 4.0 - hermite_sum(w, cc->olr);
}

/* Root of N in grid cell j (N(j) > 0 >= N(j+1)) by bisection on the Hermite curve: 40
 * halvings of the cell (4.5e-12 K on a 5 K cell). The curve's cubic is evaluated from
 * the cell's coefficients (cell_net), about 40 instructions a halving. A Newton or Brent
 * iteration (GSL's fsolvers included) takes fewer evaluations but lands on other last
 * bits of the root, and the bundled histories move far more than that for it
 * (docs/performance.md section 9). */
static double refine(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                     int j)
{
    cell_curve cc;
    cell_curve_of(b, t, la, s, j, &cc);
    double lo = vl_ct_grid_t(j), hi = vl_ct_grid_t(j + 1);
    for (int i = 0; i < 40; i++) {
        double mid = 0.5 * (lo + hi);
        /* mid lies strictly inside cell j, so hermite() would use cell j as well; the
         * check keeps that true by construction, not by argument */
        double n = (int)vl_ct_grid_index(mid) == j ? cell_net(b, &cc, mid)
                                                    : vl_balance_net(b, t, la, s, mid);
        if (n > 0.0)
            lo = mid;
        else
            hi = mid;
    }
    return 0.5 * (lo + hi);
}

/* A branch's range [lo, hi) as the root search reads it: branch_range's (exact), or,
 * for all but the hot branch until a question needs the limits themselves, its
 * definition asked about through vl_limits_cond_above and vl_limits_floor_below (the
 * same answers, mostly without computing the limits). */
typedef struct {
    int br, exact;
    double split_k, lo, hi;
} range;

#define HOT_MIN (VL_STEAM_FLOOR_K + OVERLAP_K) /* the warm branch's hi is at least this
                                                * while t_cond is above the steam floor */

static void range_exact(vl_balance *b, range *rg)
{
    if (!rg->exact)
        branch_range(b, rg->br, rg->split_k, &rg->lo, &rg->hi);
    rg->exact = 1;
}

/* Whether the range is not empty (hi > lo). */
static int range_open(vl_balance *b, range *rg)
{
    if (rg->br == VL_BRANCH_COLD) /* lo = t_floor, hi = split + OVERLAP_K above it */
        return vl_limits_floor_below(b, rg->split_k + OVERLAP_K);
    if (rg->br == VL_BRANCH_ANY) /* lo = t_floor, at most CO2's critical point < T_MAX */
        return 1;
    if (rg->br == VL_BRANCH_WARM && rg->split_k - OVERLAP_K < HOT_MIN &&
        vl_limits_floor_below(b, HOT_MIN) && vl_limits_cond_above(b, VL_STEAM_FLOOR_K))
        return 1; /* lo = max(split - OVERLAP_K, t_floor) < HOT_MIN <= hi */
    range_exact(b, rg);
    return rg->hi > rg->lo;
}

/* Whether r lies in the range: r >= max(lower candidate, t_floor) and r below the upper
 * end (branch_range's hi = max(upper end, lo) adds nothing for an r at or above lo). */
static int in_range(vl_balance *b, range *rg, double r)
{
    if (rg->exact)
        return !(r < rg->lo || r >= rg->hi);
    if (rg->br == VL_BRANCH_WARM && !(r >= rg->split_k - OVERLAP_K))
        return 0;
    if (!vl_limits_floor_below(b, r) && r < vl_limits_t_floor(b))
        return 0;
    if (rg->br == VL_BRANCH_COLD)
        return r < rg->split_k + OVERLAP_K;
    if (rg->br == VL_BRANCH_ANY)
        return r < T_MAX;
    /* r < t_hot + OVERLAP_K: sure if t_hot lies above r - OVERLAP_K by more than the
     * sum's rounding */
    if (vl_limits_hot_above(b, r - OVERLAP_K + 1e-6))
        return 1;
    return r < vl_limits_t_hot(b) + OVERLAP_K;
}

/* 1 and the root if cell j holds a stable crossing whose root lies in the range. */
static int cell_root(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                     int j, range *rg, double *root)
{
    if (j < 0 || j >= VL_CT_NT - 1)
        return 0;
    if (!(net_at(b, t, la, s, j) > 0.0 && net_at(b, t, la, s, j + 1) <= 0.0))
        return 0;
    double r = refine(b, t, la, s, j);
    if (!in_range(b, rg, r))
        return 0;
    *root = r;
    return 1;
}

/* Whole-range scan: every grid cell of the range, each falling sign change narrowed by
 * bisection (cell_root); the root nearest prefer. Every cell, not samples: sampling every
 * STRIDE points missed a stable root whose N > 0 stretch (above an unstable root) fitted
 * between two samples, so whether the branch had a root depended on where the window
 * search had started, that is on the evaluations before: one state's surface
 * temperature alternated between 368.1 and 370.2 K from one right-hand side to the next
 * (the first pass of the ocean's CO2 split found its warm root at 337.6 K, or missed it
 * and took the ghost) and its Newton iterations failed (campaign seed 2 member 107,
 * docs/hardening.md "Stalls"). */
static int scan(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                range *rg, double prefer, double *root)
{
    range_exact(b, rg);
    int j0 = (int)vl_ct_grid_index(rg->lo), j1 = (int)ceil(vl_ct_grid_index(rg->hi));
    int found = 0;
    double best = 0.0;
    for (int j = j0; j < j1; j++) {
        double r;
        if (cell_root(b, t, la, s, j, rg, &r) &&
            (!found || fabs(r - prefer) < fabs(best - prefer))) {
            best = r;
            found = 1;
        }
    }
    if (found)
        *root = best;
    return found;
}

/* Where a branch without history starts looking. */
static double default_start(int br, vl_balance *b, double split_k)
{
    if (br == VL_BRANCH_COLD)
        return fmin(220.0, split_k - 1.0);
    if (br == VL_BRANCH_WARM)
        return vl_limits_cond_above(b, fmax(288.0, split_k + 1.0)) ? fmax(288.0, split_k + 1.0)
                                                                   : split_k;
    if (br == VL_BRANCH_HOT)
        return vl_limits_t_hot(b);
    /* any: the radiative equilibrium of a grey planet with albedo 0.3 */
    return pow(b->key.instellation * 0.7 / (4.0 * 5.670374419e-8), 0.25);
}

int vl_balance_root(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                    int br, double split_k, double *root_k)
{
    range rg = {br, 0, split_k, 0.0, 0.0};
    if (!range_open(b, &rg))
        return 0;
    double start = b->last[br] > 0.0 ? b->last[br] : default_start(br, b, split_k);
    int c0 = (int)vl_ct_grid_index(start);
    for (int d = 0; d <= WINDOW; d++)
        for (int sgn = 0; sgn < (d ? 2 : 1); sgn++) {
            double r;
            if (cell_root(b, t, la, s, sgn ? c0 - d : c0 + d, &rg, &r)) {
                b->last[br] = *root_k = r;
                return 1;
            }
        }
    if (!scan(b, t, la, s, &rg, start, root_k))
        return 0;
    b->last[br] = *root_k;
    return 1;
}

/* Whether grid point j comes closer to a balance than best (-1: none yet), skipping
 * points next to an unstable crossing (N rising through zero): the ghost is the near
 * miss of a vanished stable root, not an unstable equilibrium. */
static int closer(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s, int j,
                  int best, int j0, int j1)
{
    double nj = net_at(b, t, la, s, j);
    double below = j > j0 ? net_at(b, t, la, s, j - 1) : nj;
    double above = j < j1 ? net_at(b, t, la, s, j + 1) : nj;
    if (fmin(below, nj) < 0.0 && fmax(nj, above) > 0.0 && above > below)
        return 0;
    return best < 0 || fabs(nj) < fabs(net_at(b, t, la, s, best));
}

int vl_balance_below_floor(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la,
                           const vl_surface *s)
{
    return vl_balance_net(b, t, la, s, vl_limits_t_floor(b)) < 0.0;
}

double vl_balance_ghost(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                        int br, double split_k)
{
    double lo, hi;
    branch_range(b, br, split_k, &lo, &hi);
    /* colder than any balance: the surface sits at the floor (the low end of both) */
    if ((br == VL_BRANCH_COLD || br == VL_BRANCH_ANY) && vl_balance_below_floor(b, t, la, s))
        return vl_limits_t_floor(b);
    /* hotter than any balance: the surface sits at the grid's top (3000 K; hotter
     * surfaces are outside the column's range, docs/model.md section 3) */
    if ((br == VL_BRANCH_HOT || br == VL_BRANCH_ANY) && hi >= T_MAX &&
        vl_balance_net(b, t, la, s, hi) > 0.0)
        return hi;
    int j0 = (int)ceil(vl_ct_grid_index(lo)), j1 = (int)vl_ct_grid_index(hi);
    if (j1 < j0)
        j1 = j0;
    int best = -1;
    for (int j = j0; j <= j1; j += STRIDE) /* coarse, then around the best sample */
        if (closer(b, t, la, s, j, best, j0, j1))
            best = j;
    if (best < 0)
        best = j0;
    int a = best - STRIDE > j0 ? best - STRIDE : j0, c = best + STRIDE < j1 ? best + STRIDE : j1;
    for (int j = a; j <= c; j++)
        if (closer(b, t, la, s, j, best, j0, j1))
            best = j;
    if (best <= 0 || best >= VL_CT_NT - 1)
        return vl_ct_grid_t(best);
    /* vertex of the parabola through the three points around the closest approach */
    double y0 = net_at(b, t, la, s, best - 1), y1 = net_at(b, t, la, s, best),
           y2 = net_at(b, t, la, s, best + 1);
    double den = y0 - 2.0 * y1 + y2, off = den != 0.0 ? 0.5 * (y0 - y2) / den : 0.0;
    off = off < -1.0 ? -1.0 : off > 1.0 ? 1.0 : off;
    double tb = vl_ct_grid_t(best);
    return tb + off * (off < 0.0 ? tb - vl_ct_grid_t(best - 1) : vl_ct_grid_t(best + 1) - tb);
}
