/* climate_limits.c: the temperatures that bound a balance's branches (climate_balance.h),
 * computed when first read, and the questions about them that a bound settles without
 * computing them.
 *
 * Each limit is a bisection of 50-60 steps on a monotonic function of temperature (the
 * vapour the air holds, the saturation pressure of water or CO2). Most evaluations only
 * need to know on which side of a limit some temperature lies, far from it: one
 * evaluation of the function at that temperature, with a margin of 1e-3 of its value
 * (far above its rounding, and above the small steps where the saturation curves change
 * formula at the triple points), settles it, and the answer is the one the bisection's
 * own result would give. When the margin does not settle it the limit is computed. */
#include <math.h>

#include "climate_balance.h"
#include "volev/co2.h"
#include "volev/profile.h"
#include "volev/water.h"

#define T_MIN 150.0
#define MARGIN 1e-3  /* relative, of the function probed */
#define NUDGE 1e-6   /* K between the temperature asked about and the one probed */
#define REACH 100.0  /* K above the one asked about tried first (covers later questions) */

enum { KNOW_COND = 1, KNOW_HOT = 2, KNOW_FLOOR = 4 };

/* The water vapour the air of key holds over the surface at t (kg/m^2), and the whole
 * inventory. */
static double vapour_at(const vl_balance_key *k, double g, double t, double *water)
{
    vl_column_gases gs = {k->p[VL_CT_CO2] / g, k->p[VL_CT_BG] / g, k->p[VL_CT_H2] / g,
                          k->p[VL_CT_WATER] / g};
    *water = gs.water;
    return vl_profile_vapour(&gs, g, t);
}

/* Where the surface water has all gone into the air: the saturated vapour reaches the
 * inventory (bisection), at most the critical point; T_MIN at least. */
static double condensation_limit(const vl_balance_key *k, double g)
{
    double lo = T_MIN, hi = VL_WATER_TC_K, water;
    if (!(vapour_at(k, g, hi, &water) >= water * (1.0 - 1e-12)))
        return hi;
    if (vapour_at(k, g, lo, &water) >= water * (1.0 - 1e-12))
        return lo;
    for (int i = 0; i < 50; i++) {
        double mid = 0.5 * (lo + hi);
        if (vapour_at(k, g, mid, &water) >= water * (1.0 - 1e-12))
            hi = mid;
        else
            lo = mid;
    }
    return hi;
}

/* The steam point: where p_sat(T) equals the dry gases' pressure (bisection; the
 * critical point at most). */
static double steam_point(const vl_balance_key *k)
{
    double p_dry = k->p[VL_CT_CO2] + k->p[VL_CT_BG] + k->p[VL_CT_H2];
    double lo = T_MIN, hi = VL_WATER_TC_K;
    if (vl_water_psat(hi * (1.0 - 1e-12)) <= p_dry)
        return hi;
    for (int i = 0; i < 50; i++) {
        double mid = 0.5 * (lo + hi);
        if (vl_water_psat(mid) < p_dry)
            lo = mid;
        else
            hi = mid;
    }
    return hi;
}

void vl_limits_reset(vl_balance *b, double g)
{
    b->g = g;
    b->known = 0;
    b->cond_above = -INFINITY;
    b->floor_below = INFINITY;
    b->hot_above = -INFINITY;
}

double vl_limits_t_cond(vl_balance *b)
{
    if (!(b->known & KNOW_COND)) {
        b->t_cond = condensation_limit(&b->key, b->g);
        b->known |= KNOW_COND;
    }
    return b->t_cond;
}

double vl_limits_t_hot(vl_balance *b)
{
    if (!(b->known & KNOW_HOT)) {
        b->t_hot = fmin(fmax(steam_point(&b->key), VL_STEAM_FLOOR_K), vl_limits_t_cond(b));
        b->known |= KNOW_HOT;
    }
    return b->t_hot;
}

/* 1 if CO2's saturation pressure exceeds p (0 < p < the critical pressure) by the margin
 * at x - NUDGE (x - NUDGE above vl_co2_tsat's lower end, 20 K): vl_co2_tsat's bisection
 * then keeps its upper end at every step at or above that temperature, so its result
 * lies below x (below VL_CO2_TC_K if x is above that). */
static int co2_frost_below(double p, double x)
{
    return p < VL_CO2_PC_PA && x - NUDGE > 20.0 && vl_co2_psat(x - NUDGE) > p * (1.0 + MARGIN);
}

double vl_limits_t_floor(vl_balance *b)
{
    if (!(b->known & KNOW_FLOOR)) {
        double p = b->key.p[VL_CT_CO2];
        /* a surface colder than CO2's frost point at its partial pressure would take the
         * air's CO2 as ice: the surface is held there by the latent heat (atmospheric
         * collapse itself is not modelled; docs/model.md section 3) */
        b->t_floor = p > 0.0 && !co2_frost_below(p, T_MIN) ? fmax(T_MIN, vl_co2_tsat(p)) : T_MIN;
        b->known |= KNOW_FLOOR;
    }
    return b->t_floor;
}

/* 1 if the air holds less than the inventory, by the margin, at t (T_MIN <= t < the
 * critical point): condensation_limit then ends above t (every step at or above t keeps
 * its lower end, the result is one of the steps above or the critical point). */
static int vapour_short(const vl_balance *b, double t)
{
    if (!(t >= T_MIN && t < VL_WATER_TC_K))
        return 0;
    double water, v = vapour_at(&b->key, b->g, t, &water);
    return v < water * (1.0 - 1e-12) * (1.0 - MARGIN);
}

int vl_limits_cond_above(vl_balance *b, double x)
{
    if (b->known & KNOW_COND)
        return b->t_cond > x;
    if (x < T_MIN || x <= b->cond_above) /* the limit is T_MIN at least */
        return 1;
    for (int k = 0; k < 2; k++) {
        double t = k == 0 ? x + REACH : x + NUDGE;
        if (vapour_short(b, t)) {
            b->cond_above = t;
            return 1;
        }
    }
    return vl_limits_t_cond(b) > x;
}

int vl_limits_floor_below(vl_balance *b, double x)
{
    double p = b->key.p[VL_CT_CO2];
    if (b->known & KNOW_FLOOR || !(p > 0.0) || p >= VL_CO2_PC_PA || !(x > T_MIN + NUDGE))
        return vl_limits_t_floor(b) < x; /* the cheap cases, or no room for a probe */
    if (x >= b->floor_below)
        return 1;
    if (co2_frost_below(p, x)) {
        b->floor_below = x;
        return 1;
    }
    return vl_limits_t_floor(b) < x;
}

/* 1 if water's saturation pressure at t (T_MIN <= t < the critical point) lies below the
 * dry gases' pressure by the margin: steam_point then ends above t (as vapour_short). */
static int steam_short(const vl_balance *b, double t)
{
    const vl_balance_key *k = &b->key;
    double p_dry = k->p[VL_CT_CO2] + k->p[VL_CT_BG] + k->p[VL_CT_H2];
    return t >= T_MIN && t < VL_WATER_TC_K && vl_water_psat(t) < p_dry * (1.0 - MARGIN);
}

int vl_limits_hot_above(vl_balance *b, double x)
{
    if (b->known & KNOW_HOT)
        return b->t_hot > x;
    if (x <= b->hot_above)
        return 1;
    /* t_hot = min(max(steam point, VL_STEAM_FLOOR_K), t_cond) lies above t when both do */
    for (int k = 0; k < 2; k++) {
        double t = k == 0 ? x + REACH : x + NUDGE;
        if ((t < VL_STEAM_FLOOR_K || steam_short(b, t)) && vl_limits_cond_above(b, t)) {
            b->hot_above = t;
            return 1;
        }
    }
    return vl_limits_t_hot(b) > x;
}
