/* jeans_oxygen.c: Jeans escape of atomic oxygen from the exobase (Jeans 1925;
 * Chamberlain & Hunten 1987): phi = n_O v0/(2 sqrt(pi)) (1 + lambda) e^-lambda at the
 * exobase (upper.c), times (r_exo/R_p)^2 per unit surface. Atomic O is taken to make up
 * the oxygen-bearing share of the exobase: the water-borne share w_O = f_strat plus the
 * O2 and CO2 share of the molecular background (photodissociated above the homopause).
 * Negligible for Earth-like exobases (lambda ~ 100), it matters for hot, light or small
 * planets. Once the upper atmosphere flows out as a whole (env->escape.bulk_hydro,
 * hydrogen_escape.c: hydrogen that dominates it turns hydrodynamic, or O itself falls
 * below the critical escape parameter) the Jeans picture no longer holds and oxygen
 * leaves by drag (oxygen_drag.c): the flux fades out with the same weight. The oxygen comes from atmospheric O2. */
#include <math.h>
#include <stddef.h>

#include "volev/process.h"
#include "volev/units.h"
#include "volev/upper.h"

typedef struct {
    double scale; /* multiplier on the Jeans flux (1 = the formula) */
} params;

static const vl_param table[] = {
    {"flux_multiplier", VL_PT_REAL, "", 1.0, 1.0, 0.0, 1e3, NULL, NULL, offsetof(params, scale),
     "factor on the Jeans flux, for sensitivity studies (1: the formula)", "common practice",
     NULL, 0},
};

static const vl_flux_column columns[] = {
    {"jeans_o_kg_s", "atomic oxygen lost by Jeans escape from the exobase"},
};

enum { O2_TO_SPACE_O };
static const vl_transfer transfers[] = {[O2_TO_SPACE_O] = {VL_R_O2, VL_R_SPACE_O}};

static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const vl_env *env = v->env;
    const vl_planet *pl = v->planet;
    const params *p = pv;
    double w = fmin(fmax(env->f_strat, 0.0), 1.0);
    double mol = env->x[VL_GAS_N2] + env->x[VL_GAS_CO2] + env->x[VL_GAS_O2];
    double o_share = mol > 0.0 ? (env->x[VL_GAS_CO2] + env->x[VL_GAS_O2]) / mol : 0.0;
    double x_o = w + (1.0 - w) * o_share;
    double m_o = VL_AW_O * VL_AMU, ratio = env->upper.r_exo_m / pl->radius_m;
    double phi = ratio * ratio *
                 vl_upper_jeans_flux(x_o * env->upper.n_exo_m3, m_o, env->upper.t_exo_k, env->upper.r_exo_m,
                                     pl->mass_kg, NULL);
    double kinetic = 1.0 - env->escape.bulk_hydro;
    vl_flux_transfer(fx, O2_TO_SPACE_O, kinetic * p->scale * phi * pl->area_m2 * m_o, 0);
}

const vl_process vl_process_jeans_oxygen = {
    .name = "jeans_oxygen",
    .summary = "Jeans escape of atomic oxygen from the exobase",
    .refs = "Jeans 1925; Chamberlain & Hunten 1987",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_TRANSFERS(transfers),
    .default_enabled = 1,
    .rates = rates,
};
