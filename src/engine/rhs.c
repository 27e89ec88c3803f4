/* rhs.c: one evaluation of the model (model.h): the stages in their fixed order, then
 * every process into its own tendency row, then the rows added up in name order. */
#include <math.h>
#include <string.h>

#include "model_internal.h"
#include "volev/escape.h"
#include "volev/interior.h"
#include "volev/ocean.h"
#include "volev/redox_ledger.h"
#include "volev/units.h"
#include "volev/upper.h"

static double pos(double v) { return v > 0.0 ? v : 0.0; }

/* Star stage: luminosity, XUV, Lyman alpha and wind at t, and their fluxes at the orbit. */
static void star_stage(const vl_model *m, double t_s, vl_env *env)
{
    double a = m->planet.orbit_m, e = m->planet.eccentricity;
    env->t_s = t_s;
    vl_star_eval(m->star, t_s, &env->star);
    env->instellation = vl_star_orbit_flux(env->star.l_bol_w, a, e);
    env->s_eff = env->instellation / VL_S_EARTH;
    env->f_xuv = vl_star_orbit_flux(env->star.l_xuv_w, a, e);
    env->lya_flux = env->star.lya_flux_1au * (VL_AU / a) * (VL_AU / a) / sqrt(1.0 - e * e);
    env->wind_pressure_pa =
        env->star.wind_mdot_kg_s * env->star.wind_speed_m_s / (4.0 * VL_PI * a * a);
}

/* Mole fractions, partial pressures and mean masses from the gas masses. */
static void finish_atmosphere(const vl_model *m, vl_env *env)
{
    static const int species[VL_NGASES] = {VL_SP_H2O, VL_SP_CO2, VL_SP_N2, VL_SP_O2, VL_SP_H2};
    double mol[VL_NGASES], mass = 0.0, moles = 0.0, bg_mass = 0.0, bg_mol = 0.0;
    for (int i = 0; i < VL_NGASES; i++) {
        mol[i] = env->mass_kg[i] / vl_species_molar_mass(species[i]);
        mass += env->mass_kg[i];
        moles += mol[i];
        if (i == VL_GAS_CO2 || i == VL_GAS_N2 || i == VL_GAS_O2) {
            bg_mass += env->mass_kg[i];
            bg_mol += mol[i];
        }
    }
    env->p_surf_pa = mass * m->planet.pa_per_kg;
    for (int i = 0; i < VL_NGASES; i++) {
        env->x[i] = moles > 0.0 ? mol[i] / moles : 0.0;
        env->p_pa[i] = env->x[i] * env->p_surf_pa;
    }
    double m_h2o = vl_species_molar_mass(VL_SP_H2O) / VL_AVOGADRO;
    env->m_mean_kg = moles > 0.0 ? mass / moles / VL_AVOGADRO : m_h2o;
    env->m_background_kg = bg_mol > 0.0 ? bg_mass / bg_mol / VL_AVOGADRO : m_h2o;
}

/* vl_ocean_atm_co2 through the workspace's cache entry for this pass (0 or 1). */
static double cached_atm_co2(vl_work *w, int pass, double surface, double ocean_m3, double t_k,
                             const vl_ocean_air *air)
{
    vl_ocean_cache *c = &w->ocean[pass];
    double key[5] = {surface, ocean_m3, t_k, air->other_kg, air->other_mol};
    if (c->valid && memcmp(key, c->key, sizeof key) == 0)
        return c->atm_kg;
    double atm = vl_ocean_atm_co2(surface, ocean_m3, t_k, air);
    memcpy(c->key, key, sizeof key);
    c->atm_kg = atm;
    c->valid = 1;
    return atm;
}

/* The atmospheric part of the surface CO2 over an ocean (ocean.h), in two passes: at
 * VL_OCEAN_FIRST_PASS_K, then at the surface temperature the climate gives for that
 * first split (not below the freezing point: an ice-covered ocean stays at it). The
 * climate is then evaluated again by the caller. Continuous in y for a fixed regime. */
static void split_surface_co2(const vl_model *m, vl_work *w, const double *y, vl_env *env)
{
    double surface = pos(y[VL_R_CO2]) - env->melt.co2_kg;
    double water = pos(y[VL_R_WATER]) - env->melt.water_kg;
    double ocean_m3 = water / VL_OCEAN_DENSITY_KG_M3;
    vl_ocean_air air = {0.0, 0.0, m->planet.pa_per_kg};
    static const int others[3][2] = {
        {VL_GAS_N2, VL_SP_N2}, {VL_GAS_O2, VL_SP_O2}, {VL_GAS_H2, VL_SP_H2}};
    for (int i = 0; i < 3; i++) {
        air.other_kg += env->mass_kg[others[i][0]];
        air.other_mol += env->mass_kg[others[i][0]] / vl_species_molar_mass(others[i][1]);
    }
    env->mass_kg[VL_GAS_CO2] = cached_atm_co2(w, 0, surface, ocean_m3, VL_OCEAN_FIRST_PASS_K, &air);
    vl_climate_eval(m->climate, w->climate, water, env);
    double t_ocean = fmax(env->t_surf_k, m->sc->climate.freeze_temp_k);
    env->mass_kg[VL_GAS_CO2] = cached_atm_co2(w, 1, surface, ocean_m3, t_ocean, &air);
}

double vl_model_h_room_factor(const vl_model *m, const double *y, const vl_env *env)
{
    vl_view v = {y, &m->planet, env};
    double demand = 0.0;
    for (size_t k = 0; k < m->nproc; k++) {
        size_t i = m->sum_order[k];
        if (m->proc[i]->h_demand)
            demand += m->proc[i]->h_demand(m->params[i], &v);
    }
    return vl_escape_h_room_factor(&m->sc->escape, &m->planet, &env->escape, demand);
}

/* Escape stage: the thermal budget, then the share of the processes' non-thermal
 * hydrogen demands (added up in name order) that fits the diffusion room. */
static void escape_stage(const vl_model *m, const double *y, vl_env *env)
{
    vl_escape_eval(&m->sc->escape, &m->planet, env);
    env->escape.nt_h_factor = vl_model_h_room_factor(m, y, env);
}

void vl_model_env(const vl_model *m, vl_work *w, double t_s, const double *y, int regime,
                  vl_env *env)
{
    const vl_scenario *sc = m->sc;
    memset(env, 0, sizeof *env);
    star_stage(m, t_s, env);
    env->heat_flow_rel = vl_interior_heat_flow_rel(&sc->interior, t_s);
    env->g = m->planet.g;
    env->area_m2 = m->planet.area_m2;
    vl_melt_stage_state(m, y, env);
    env->mass_kg[VL_GAS_CO2] = pos(y[VL_R_CO2]) - env->melt.co2_kg;
    env->mass_kg[VL_GAS_N2] = pos(y[VL_R_N2]);
    env->mass_kg[VL_GAS_O2] = pos(y[VL_R_O2]);
    env->mass_kg[VL_GAS_H2] = pos(y[VL_R_H2]);
    env->regime = regime;
    if (vl_ocean_holds_carbon(regime) && y[VL_R_WATER] > 0.0)
        split_surface_co2(m, w, y, env);
    vl_climate_eval(m->climate, w->climate, pos(y[VL_R_WATER]) - env->melt.water_kg, env);
    vl_melt_stage_heat(env);
    finish_atmosphere(m, env);
    vl_upper_eval(&sc->planet, env);
    escape_stage(m, y, env);
}

void vl_model_rhs(const vl_model *m, vl_work *w, double t_s, const double *y, int regime,
                  double *dydt, double *columns, vl_env *env)
{
    vl_env local;
    vl_env *e = env ? env : &local;
    vl_model_env(m, w, t_s, y, regime, e);
    if (columns)
        memset(columns, 0, m->ncolumns * sizeof columns[0]);
    vl_view v = {y, &m->planet, e};
    for (size_t i = 0; i < m->nproc; i++) {
        const vl_process *p = m->proc[i];
        memset(w->rows[i], 0, sizeof w->rows[i]);
        vl_flux fx = {y,        w->rows[i],    columns,      m->col_base[i],
                      p->transfers, p->ntransfers, p->reactions, p->nreactions};
        p->rates(m->params[i], &v, &fx);
    }
    /* the rows added up in name order; a process that cannot write r adds an exact +0,
     * which changes no sum (a sum that starts at +0 is never -0), so it is skipped */
    for (int r = 0; r < VL_NRES; r++) {
        double s = 0.0;
        const size_t *who = w->touch + (size_t)r * m->nproc;
        for (size_t k = 0; k < w->ntouch[r]; k++)
            s += w->rows[who[k]][r];
        dydt[r] = s;
    }
    dydt[VL_S_MANTLE_TP] = e->melt.dtp_dt;
    if (columns) /* each redox column: its process's row seen by the surface */
        for (size_t c = m->nflux; c < m->ncolumns; c++)
            columns[c] = vl_redox_surface_rate(w->rows[m->col_proc[c]]);
}

int vl_model_classify(const vl_model *m, vl_work *w, const double *y, const vl_env *env)
{
    if (vl_melt_molten(m, env))
        return VL_REGIME_MAGMA;
    double water = pos(y[VL_R_WATER]) - env->melt.water_kg;
    return vl_climate_classify(m->climate, w->climate, water, env);
}
