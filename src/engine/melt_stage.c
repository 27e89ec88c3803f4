/* melt_stage.c: the magma-ocean stage of one evaluation (model_internal.h;
 * docs/model.md section 5b).
 *
 * The mantle is 0-D: its potential temperature T_p (a state component) fixes through
 * magma.h the adiabat, the melt fraction at every depth, the melt mass and the depth of
 * the magma ocean. While the melt fraction at the surface exceeds the rheological
 * transition the surface is molten (regime magma_ocean) at T_p, and
 *   C_eff dT_p/dt = A (S (1 - A_b)/4 - OLR(T_p)) + Q_radiogenic,
 * C_eff the mantle's heat capacity with the latent heat of the melt it gains or loses
 * per kelvin (Lebrun et al. 2013, JGR Planets 118:1155; Hamano et al. 2013, Nature
 * 497:607), the net flux from the climate's column at T_p. Otherwise T_p is constant.
 *
 * Volatiles: the surface_water and surface_co2 reservoirs are shared between the air
 * and the "open" melt, the melt that convects up to the surface; at every evaluation
 * they are split so that the melt holds its solubility at the partial pressure (each
 * gas's own column weight M g / A, the usual 0-D simplification), conserving each
 * reservoir by construction. The open share falls smoothly from 1 to 0 as the surface
 * melt fraction falls to the rheological transition: what the melt held has then all
 * been released, so the solidification event starts from an atmosphere holding
 * everything but what the crystals took (the magma_freezing process). */
#include <math.h>

#include "volev/smooth.h"

#include "model_internal.h"
#include "volev/magma.h"

/* Width in surface melt fraction over which the melt stops exchanging with the air. */
#define OPEN_WIDTH 0.05

static double pos(double v) { return v > 0.0 ? v : 0.0; }

/* The air's part of total_kg of a volatile shared with melt_kg of open melt that
 * dissolves solubility(p) per kg at the partial pressure p = M pa_per_kg: the root of
 * M + s(M pa_per_kg) melt - total, which rises monotonically in M (bisection to the
 * last bit, a fixed number of halvings: deterministic and continuous in the inputs). */
static double air_share(double total, double melt, double pa_per_kg, double (*solubility)(double))
{
    if (!(total > 0.0) || !(melt > 0.0))
        return pos(total);
    double lo = 0.0, hi = total;
    for (int i = 0; i < 64; i++) {
        double mid = 0.5 * (lo + hi);
        if (mid + solubility(mid * pa_per_kg) * melt < total)
            lo = mid;
        else
            hi = mid;
    }
    return 0.5 * (lo + hi);
}

void vl_melt_stage_state(const vl_model *m, const double *y, vl_env *env)
{
    const vl_magma_ocean_params *mo = &m->sc->interior.magma;
    vl_melt *ml = &env->melt;
    double tp = y[VL_S_MANTLE_TP];
    if (!mo->molten_start || !(tp > 0.0))
        return;
    vl_magma_state s;
    if (vl_magma_state_at(&mo->mantle, tp, m->planet.radius_m, m->planet.g, &s) != 0)
        return; /* invalid parameters only, which the scenario's bounds exclude */
    ml->tp_k = tp;
    ml->melt_kg = s.melt_kg;
    ml->mantle_kg = s.mantle_kg;
    ml->depth_m = s.depth_m;
    ml->frac_surface = s.melt_frac_surface;
    ml->dmelt_dtp = s.dmelt_dtp_kg_k;
    ml->heat_capacity_j_k = s.heat_capacity_j_k;
    double phi_r = mo->mantle.phi_rheo;
    ml->open = vl_smoothstep(s.melt_frac_surface, phi_r, phi_r + OPEN_WIDTH);
    double open_melt = ml->open * s.melt_kg, pa = m->planet.pa_per_kg;
    double water = pos(y[VL_R_WATER]), co2 = pos(y[VL_R_CO2]);
    double air_w = air_share(water, open_melt, pa, vl_magma_h2o_solubility);
    double air_c = air_share(co2, open_melt, pa, vl_magma_co2_solubility);
    ml->water_kg = water - air_w;
    ml->co2_kg = co2 - air_c;
    ml->x_water = vl_magma_h2o_solubility(air_w * pa);
    ml->x_co2 = vl_magma_co2_solubility(air_c * pa);
    ml->heat_w = m->sc->interior.heat_flow_w * env->heat_flow_rel;
    ml->feo_fraction = mo->feo_fraction;
    ml->fe3_ratio = vl_magma_fe3_ratio(pos(y[VL_R_MELT_O]), s.mantle_kg, mo->feo_fraction);
}

void vl_melt_stage_heat(vl_env *env)
{
    vl_melt *ml = &env->melt;
    if (env->regime != VL_REGIME_MAGMA || !(ml->heat_capacity_j_k > 0.0))
        return;
    ml->dtp_dt = (env->net_flux_w_m2 * env->area_m2 + ml->heat_w) / ml->heat_capacity_j_k;
    ml->dmelt_dt = ml->dmelt_dtp * ml->dtp_dt;
}

int vl_melt_molten(const vl_model *m, const vl_env *env)
{
    return env->melt.tp_k > 0.0 && env->melt.frac_surface > m->sc->interior.magma.mantle.phi_rheo;
}
