/* climate_table.c: the shared, lazily filled table of column points (climate_table.h).
 *
 * Concurrency: a table's node map is guarded by the table's mutex; each node's points
 * are atomic pointers, published with release order after the point is complete and
 * read with acquire order, so a finished point is read without locking. Two threads
 * that need the same missing point may both compute it; the first to publish wins and
 * the other's copy is dropped (the computation is deterministic: both are identical). */
#include "climate_table.h"

#include "climate_disk.h"

#include "volev/profile.h"

#include <math.h>
#include <pthread.h>
#include <stdatomic.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

/* ------------------------------------------------------------------ grids */

double vl_ct_grid_t(int j)
{
    if (j <= 50)
        return 150.0 + 5.0 * j;
    if (j <= 80)
        return 400.0 + 20.0 * (j - 50);
    return 1000.0 + 50.0 * (j - 80);
}

double vl_ct_grid_index(double t)
{
    double x = t <= 400.0    ? (t - 150.0) / 5.0
               : t <= 1000.0 ? 50.0 + (t - 400.0) / 20.0
                             : 80.0 + (t - 1000.0) / 50.0;
    return x < 0.0 ? 0.0 : x > VL_CT_NT - 1 ? VL_CT_NT - 1 : x;
}

/* log10 Pa of index 0 and points per decade, per dimension (H2: index 0 is 0 Pa). */
static const double log_p0[VL_CT_NDIM] = {-1.0, -3.0, -3.0, 1.0};
static const double per_decade[VL_CT_NDIM] = {3.0, 3.0, 3.0, 2.0};
const int vl_ct_size[VL_CT_NDIM] = {34, 37, 37, 18};

double vl_ct_grid_p(int d, int i)
{
    if (d == VL_CT_H2)
        return i == 0 ? 0.0 : pow(10.0, log_p0[d] + (i - 1) / per_decade[d]);
    return pow(10.0, log_p0[d] + i / per_decade[d]);
}

void vl_ct_bracket(int d, double p, int *lo, double *w_hi)
{
    int n = vl_ct_size[d];
    double x;
    if (d == VL_CT_H2) {
        double p1 = vl_ct_grid_p(d, 1);
        x = p <= p1 ? fmax(p, 0.0) / p1 : 1.0 + (log10(p) - log_p0[d]) * per_decade[d];
    } else {
        x = (log10(fmax(p, 1e-300)) - log_p0[d]) * per_decade[d];
    }
    x = x < 0.0 ? 0.0 : x > n - 1 ? n - 1 : x;
    int i = (int)x < n - 1 ? (int)x : n - 2;
    *lo = i;
    *w_hi = x - i;
}

/* ------------------------------------------------------------------ tables */

/* A node's water index past the grid: water that never runs out (a saturated surface). */
#define WATER_UNLIMITED (vl_ct_size[VL_CT_WATER])

struct vl_ct_node {
    int idx[VL_CT_NDIM];
    pthread_mutex_t lock;
    _Atomic(vl_column_point *) pt[VL_CT_NT];
    /* per temperature: 0 unknown, 1 the surface keeps water at saturation (the point is
     * that of unlimited water), 2 the inventory is all in the air */
    atomic_uchar saturated[VL_CT_NT];
};

struct vl_ctable {
    vl_column_opts opts;
    uint64_t key;
    pthread_mutex_t lock;      /* guards the node map */
    vl_ct_node **slot;         /* open addressing, power-of-two size */
    size_t nslots, nnodes;
    vl_ctable *next;           /* registry list */
};

static pthread_mutex_t registry_lock = PTHREAD_MUTEX_INITIALIZER;
static vl_ctable *registry;

/* The version of everything that fixes a point besides the options: bumped whenever the
 * column's physics or tabulated coefficients change (so stale disk caches are ignored). */
#define TABLE_VERSION "volev-column-2"

static uint64_t fnv1a(const void *p, size_t n, uint64_t h)
{
    const unsigned char *b = p;
    for (size_t i = 0; i < n; i++) {
        h ^= b[i];
        h *= 1099511628211ULL;
    }
    return h;
}

uint64_t vl_ctable_key(const vl_ctable *t) { return t->key; }

static vl_ctable *table_new(const vl_column_opts *opts)
{
    vl_ctable *t = calloc(1, sizeof *t);
    if (!t)
        return NULL;
    t->opts = *opts;
    t->key = fnv1a(opts, sizeof *opts, fnv1a(TABLE_VERSION, sizeof TABLE_VERSION, 1469598103934665603ULL));
    t->nslots = 256;
    t->slot = calloc(t->nslots, sizeof *t->slot);
    if (!t->slot || pthread_mutex_init(&t->lock, NULL) != 0) {
        free(t->slot);
        free(t);
        return NULL;
    }
    return t;
}

static vl_ct_node *node_at(vl_ctable *t, const int idx[VL_CT_NDIM]);

/* A point read from disk into table ctx (the first copy of a point wins). */
static void adopt(void *ctx, const int idx[VL_CT_NDIM], int j, const vl_column_point *p)
{
    vl_ctable *t = ctx;
    for (int d = 0; d < VL_CT_NDIM; d++)
        if (idx[d] < 0 || idx[d] > vl_ct_size[d] || (idx[d] == vl_ct_size[d] && d != VL_CT_WATER))
            return;
    if (j < 0 || j >= VL_CT_NT)
        return;
    vl_ct_node *nd = node_at(t, idx);
    vl_column_point *copy = nd ? malloc(sizeof *copy) : NULL;
    if (!copy)
        return;
    *copy = *p;
    vl_column_point *none = NULL;
    if (!atomic_compare_exchange_strong(&nd->pt[j], &none, copy))
        free(copy);
}

vl_ctable *vl_ctable_get(const vl_column_opts *opts)
{
    pthread_mutex_lock(&registry_lock);
    vl_ctable *t = registry;
    while (t && memcmp(&t->opts, opts, sizeof *opts) != 0)
        t = t->next;
    if (!t && (t = table_new(opts))) {
        vl_ct_disk_load(t->key, adopt, t);
        t->next = registry;
        registry = t;
    }
    pthread_mutex_unlock(&registry_lock);
    return t;
}

/* Tables stay registered for the life of the process (the members of a sweep come and
 * go; their table stays): releasing a reference does nothing yet. */
void vl_ctable_release(vl_ctable *t) { (void)t; }

static size_t hash_idx(const int idx[VL_CT_NDIM])
{
    return (size_t)fnv1a(idx, VL_CT_NDIM * sizeof idx[0], 1469598103934665603ULL);
}

/* Double the node map (lock held). */
static int grow(vl_ctable *t)
{
    size_t n = t->nslots * 2;
    vl_ct_node **s = calloc(n, sizeof *s);
    if (!s)
        return 0;
    for (size_t i = 0; i < t->nslots; i++)
        if (t->slot[i]) {
            size_t h = hash_idx(t->slot[i]->idx) & (n - 1);
            while (s[h])
                h = (h + 1) & (n - 1);
            s[h] = t->slot[i];
        }
    free(t->slot);
    t->slot = s;
    t->nslots = n;
    return 1;
}

/* The node at idx (made if missing), under the table's lock. */
static vl_ct_node *node_at(vl_ctable *t, const int idx[VL_CT_NDIM])
{
    pthread_mutex_lock(&t->lock);
    size_t h = hash_idx(idx) & (t->nslots - 1);
    while (t->slot[h] && memcmp(t->slot[h]->idx, idx, sizeof t->slot[h]->idx) != 0)
        h = (h + 1) & (t->nslots - 1);
    vl_ct_node *nd = t->slot[h];
    if (!nd && (nd = calloc(1, sizeof *nd)) && pthread_mutex_init(&nd->lock, NULL) == 0) {
        memcpy(nd->idx, idx, sizeof nd->idx);
        t->slot[h] = nd;
        if (++t->nnodes * 2 > t->nslots && !grow(t))
            nd = NULL; /* out of memory: the node stays reachable from the map */
    }
    pthread_mutex_unlock(&t->lock);
    return nd;
}

static vl_ct_node *lookup(vl_ctable *t, vl_ct_lookaside *la, const int idx[VL_CT_NDIM])
{
    size_t h = hash_idx(idx) % VL_CT_LOOKASIDE;
    if (la->node[h] && memcmp(la->key[h], idx, sizeof la->key[h]) == 0)
        return la->node[h];
    vl_ct_node *nd = node_at(t, idx);
    if (nd) {
        memcpy(la->key[h], idx, sizeof la->key[h]);
        la->node[h] = nd;
    }
    return nd;
}

static double seconds(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_MONOTONIC, &ts);
    return (double)ts.tv_sec + 1e-9 * (double)ts.tv_nsec;
}

/* The gases of node idx, kg/m^2 (unlimited water past the water grid). */
static void node_gases(const vl_ctable *t, const int idx[VL_CT_NDIM], vl_column_gases *gs)
{
    const double g = t->opts.g;
    gs->co2 = vl_ct_grid_p(VL_CT_CO2, idx[VL_CT_CO2]) / g;
    gs->bg = vl_ct_grid_p(VL_CT_BG, idx[VL_CT_BG]) / g;
    gs->h2 = vl_ct_grid_p(VL_CT_H2, idx[VL_CT_H2]) / g;
    gs->water = idx[VL_CT_WATER] >= WATER_UNLIMITED ? HUGE_VAL
                                                    : vl_ct_grid_p(VL_CT_WATER, idx[VL_CT_WATER]) / g;
}

/* Whether node nd's surface still holds water at temperature index j (then its column
 * is that of unlimited water: the saturated points are shared by every inventory). */
static int keeps_water(const vl_ctable *t, vl_ct_node *nd, int j)
{
    unsigned char s = atomic_load_explicit(&nd->saturated[j], memory_order_relaxed);
    if (!s) {
        vl_column_gases gs;
        node_gases(t, nd->idx, &gs);
        s = vl_profile_vapour(&gs, t->opts.g, vl_ct_grid_t(j)) < gs.water ? 1 : 2;
        atomic_store_explicit(&nd->saturated[j], s, memory_order_relaxed);
    }
    return s == 1;
}

/* Compute the point of node nd at temperature index j and publish it. */
static vl_column_point *compute(vl_ctable *t, vl_ct_lookaside *la, vl_ct_node *nd, int j)
{
    double t0 = seconds();
    vl_column_point *p = malloc(sizeof *p);
    if (!p)
        return NULL;
    vl_column_gases gs;
    node_gases(t, nd->idx, &gs);
    vl_column_opts o = t->opts;
    if (nd->idx[VL_CT_WATER] < WATER_UNLIMITED) /* the water is all in the air: no ocean feeds clouds */
        o.cloud.tau_sw = 0.0;
    vl_column_point_eval(&o, &gs, vl_ct_grid_t(j), p);
    pthread_mutex_lock(&nd->lock);
    vl_column_point *have = atomic_load_explicit(&nd->pt[j], memory_order_acquire);
    if (have) {
        free(p);
        p = have;
    } else {
        atomic_store_explicit(&nd->pt[j], p, memory_order_release);
        vl_ct_disk_note(t->key, nd->idx, j, p);
    }
    pthread_mutex_unlock(&nd->lock);
    la->points++;
    la->build_s += seconds() - t0;
    return p;
}

const vl_column_point *vl_ctable_point(vl_ctable *t, vl_ct_lookaside *la,
                                       const int idx[VL_CT_NDIM], int j)
{
    vl_ct_node *nd = lookup(t, la, idx);
    if (!nd)
        return NULL;
    if (idx[VL_CT_WATER] < WATER_UNLIMITED && keeps_water(t, nd, j)) {
        int sat[VL_CT_NDIM];
        memcpy(sat, idx, sizeof sat);
        sat[VL_CT_WATER] = WATER_UNLIMITED;
        if (!(nd = lookup(t, la, sat)))
            return NULL;
    }
    vl_column_point *p = atomic_load_explicit(&nd->pt[j], memory_order_acquire);
    return p ? p : compute(t, la, nd, j);
}
