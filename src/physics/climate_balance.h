/* climate_balance.h: the energy balance of the column climate at one instant
 * (climate_balance.c), private to src/physics. For the atmosphere, the star and the
 * surface of the moment it gives, on the table's surface-temperature grid and lazily,
 * the outgoing radiation, the planetary albedo, the net flux
 * N(T) = S (1 - A(T)) / 4 - OLR(T) and the cold-trap water, interpolated from the
 * table's pressure nodes; between grid temperatures, C1 cubic Hermite curves. Stable
 * equilibria are where N falls through zero. */
#ifndef VOLEV_CLIMATE_BALANCE_H
#define VOLEV_CLIMATE_BALANCE_H

#include "climate_table.h"
#include "volev/env.h"
#include "volev/scenario.h"

/* Surface albedo and clouds: what the balance applies to the table's points. */
typedef struct vl_surface {
    double ocean, land, land_fraction;   /* band-independent albedos, share of land */
    double ice_vis, ice_nir;             /* ice albedo above / below 14 300 cm^-1 (0.7 um) */
    double ice_cover_k, ice_free_k;      /* ice-covered below, ice-free above */
    double melt, melt_start_k, melt_full_k; /* molten surface albedo and its ramp */
    double cloud_fraction;               /* share of the sky under the cloud layer (wet) */
    int fixed;                           /* 1: planetary albedo fixed at fixed_albedo */
    double fixed_albedo;
} vl_surface;

/* What one balance depends on. */
typedef struct vl_balance_key {
    double p[VL_CT_NDIM];      /* water inventory, CO2, background, H2 (pressure alone), Pa */
    double instellation;       /* W/m^2 */
    double teff_k;             /* stellar effective temperature */
    int wet;                   /* 1: the surface holds an ocean (or its ice) and clouds form */
} vl_balance_key;

/* What the node points around a state give at one grid temperature, kept from one
 * balance to the next while what each part depends on is exactly the same (the surface
 * and the table are the model's): the points and their ln f_strat on the lower corner;
 * the surface's band albedos, each point's OLR and band albedos also on the ocean left
 * at that temperature; each point's albedo also on the star's temperature. */
#define VL_BALANCE_CORNERS (1 << VL_CT_NDIM)
typedef struct vl_corner_values {
    int lo[VL_CT_NDIM];
    double ocean, teff_k;
    unsigned has_point, has_ocean, has_star; /* corners (bit c) holding each part */
    int has_surface;
    double a[VL_NBANDS];       /* the surface's band albedos */
    const vl_column_point *point[VL_BALANCE_CORNERS];
    double logf[VL_BALANCE_CORNERS], olr[VL_BALANCE_CORNERS], alb[VL_BALANCE_CORNERS];
    double g[VL_BALANCE_CORNERS][2][VL_NSW]; /* band albedos: clear, cloudy */
} vl_corner_values;

/* A balance: cached values on the grid and the last root of each branch. */
enum { VL_BRANCH_COLD, VL_BRANCH_WARM, VL_BRANCH_HOT, VL_BRANCH_ANY, VL_NBRANCH };
typedef struct vl_balance {
    vl_balance_key key;
    int valid;
    int lo[VL_CT_NDIM];        /* lower corner */
    double w[VL_CT_NDIM];      /* weight of the upper corner */
    double wc[1 << VL_CT_NDIM]; /* weight of corner c (bit d: upper along d) */
    double share[VL_NBANDS];   /* the star's band shares */
    unsigned char have[VL_CT_NT];
    double olr[VL_CT_NT], alb[VL_CT_NT], logf[VL_CT_NT];
    /* the limits, read through vl_limits_* (computed when first needed) */
    double t_cond;             /* where the surface water has all evaporated, K */
    double t_hot;              /* where the hot (runaway) branch begins, K */
    double t_floor;            /* the coldest surface: CO2 frost point or the grid's 150 K */
    double g;                  /* surface gravity, m/s^2 */
    unsigned known;            /* which limits are computed */
    double cond_above;         /* t_cond is known to lie above this (-inf: nothing known) */
    double floor_below;        /* t_floor is known to lie below this (+inf: nothing known) */
    double hot_above;          /* t_hot is known to lie above this (-inf: nothing known) */
    double last[VL_NBRANCH];   /* last root temperature of each branch (0: none yet) */
    int oom;                   /* a point could not be computed */
    /* per grid temperature, across keys: two lower corners (the two passes of the
     * ocean's CO2 split may straddle a node) */
    vl_corner_values corners[VL_CT_NT][2];
    unsigned char recent[VL_CT_NT];        /* which of the two was used last */
} vl_balance;

/* Prepare b for key (keeping cached values when the key is unchanged). */
void vl_balance_set(vl_balance *b, const vl_balance_key *key, double g, double split_k);

/* Interpolated values at temperature t (C1 in t): OLR, albedo, ln f_strat, N. */
double vl_balance_olr(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                      double temp);
double vl_balance_albedo(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                         double temp);
double vl_balance_logf(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                       double temp);
double vl_balance_net(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                      double temp);

/* The stable root of branch br nearest its last one (searched outward from it, then
 * over the branch's whole range); 1 and *root_k if found, else 0. The branch ranges:
 * cold [floor, split + 5 K], warm [split - 5 K, t_hot], hot [t_hot, 3000 K], any:
 * [floor, 3000 K]; the floor is CO2's frost point at its pressure, at least 150 K. */
int vl_balance_root(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                    int br, double split_k, double *root_k);

/* 1 if the balance cools even at its floor: no cold equilibrium, the surface is held
 * there (by the latent heat of CO2 frost, or at the grid's lower end). */
int vl_balance_below_floor(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la,
                           const vl_surface *s);

/* The "ghost" of a vanished root: the floor where the branch cools even there (cold,
 * any), 3000 K where the hot branch heats even there, else where |N| is least next to
 * a falling crossing over the branch's range. */
double vl_balance_ghost(vl_balance *b, vl_ctable *t, vl_ct_lookaside *la, const vl_surface *s,
                        int br, double split_k);

/* Where the runaway branch begins: the steam point, where the saturation vapour pressure
 * reaches the pressure of the dry gases (water becomes the main gas), not below 350 K
 * (where a pure steam column's outgoing radiation reaches its limit) and not above the
 * temperature at which the surface water has all evaporated. */
#define VL_STEAM_FLOOR_K 350.0

/* The limits of balance b (climate_limits.c), computed when first asked for: where its
 * surface water has all evaporated (t_cond), where its hot branch begins (t_hot) and
 * its floor (t_floor); and, as exactly as comparing with them would say, whether
 * t_cond > x, t_hot > x and t_floor < x, settled by a probe where a margin allows. */
void vl_limits_reset(vl_balance *b, double g);
double vl_limits_t_cond(vl_balance *b);
double vl_limits_t_hot(vl_balance *b);
double vl_limits_t_floor(vl_balance *b);
int vl_limits_cond_above(vl_balance *b, double x);
int vl_limits_floor_below(vl_balance *b, double x);
int vl_limits_hot_above(vl_balance *b, double x);

/* Surface band albedos at temperature t; ocean (0..1): how much of a wet planet's ocean
 * is there (0: a dry planet's rock). */
void vl_surface_albedo(const vl_surface *s, double ocean, double t_k, double a[VL_NBANDS]);

#endif
