/* model.c: builds a model from a scenario and assembles the right-hand side:
 * star -> atmosphere -> climate -> prepare hooks -> process rates (model.h). */
#include "volev/model.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "volev/interior.h"
#include "volev/ocean.h"
#include "volev/units.h"
#include "volev/upper.h"

/* A track with an xuv_lsun column replaces star.xuv.*: setting those keys is an error,
 * not a silent no-op. */
static int check_xuv_source(const vl_scenario *sc, const vl_star *star, vl_status *st)
{
    if (!vl_star_xuv_from_track(star))
        return VL_OK;
    for (size_t i = 0; i < vl_param_count(); i++) {
        const vl_param *p;
        void *base;
        const char *prefix;
        vl_param_at(sc, i, &p, &base, &prefix);
        if (prefix[0] == '\0' && strncmp(p->key, "star.xuv.", 9) == 0 &&
            sc->origin[i] != VL_FROM_DEFAULT)
            return vl_fail(st, VL_ERR_INPUT, sc->origin[i] == VL_FROM_FILE ? sc->path : NULL,
                           sc->line[i],
                           "%s is not used: the XUV history comes from the xuv_lsun column of %s",
                           p->key, sc->star.track_file);
    }
    return VL_OK;
}

/* m->sum_order: the enabled processes' registry indices in the order of their names
 * (insertion sort: a few tens of entries). */
static void sort_by_name(const vl_scenario *sc, vl_model *m)
{
    size_t n = 0;
    for (size_t i = 0; i < vl_nprocesses; i++)
        if (sc->proc[i].enabled)
            m->sum_order[n++] = i;
    for (size_t i = 1; i < n; i++)
        for (size_t j = i; j > 0 && strcmp(vl_processes[m->sum_order[j - 1]]->name,
                                           vl_processes[m->sum_order[j]]->name) > 0; j--) {
            size_t t = m->sum_order[j];
            m->sum_order[j] = m->sum_order[j - 1];
            m->sum_order[j - 1] = t;
        }
    m->nenabled = n;
}

vl_model *vl_model_new(const vl_scenario *sc, vl_status *st)
{
    vl_model *m = calloc(1, sizeof *m);
    if (!m) {
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        return NULL;
    }
    m->sc = sc;
    m->g = VL_G_NEWTON * sc->planet.mass_kg / (sc->planet.radius_m * sc->planet.radius_m);
    m->area_m2 = 4.0 * VL_PI * sc->planet.radius_m * sc->planet.radius_m;
    m->pa_per_kg = m->g / m->area_m2;
    m->star = vl_star_new(&sc->star, sc->run.start_s, sc->run.end_s, st);
    if (!m->star || check_xuv_source(sc, m->star, st) != VL_OK)
        goto fail;
    m->climate = vl_climate_new(sc, st);
    if (!m->climate)
        goto fail;
    size_t n = 0;
    for (size_t i = 0; i < vl_nprocesses; i++)
        if (sc->proc[i].enabled)
            n += vl_processes[i]->ncolumns;
    m->ncolumns = n;
    m->col_base = calloc(vl_nprocesses, sizeof *m->col_base);
    m->col_name = calloc(n ? n : 1, sizeof *m->col_name);
    m->col_proc = calloc(n ? n : 1, sizeof *m->col_proc);
    m->sum_order = calloc(vl_nprocesses, sizeof *m->sum_order);
    if (!m->col_base || !m->col_name || !m->col_proc || !m->sum_order) {
        vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        goto fail;
    }
    n = 0;
    for (size_t i = 0; i < vl_nprocesses; i++) {
        m->col_base[i] = n;
        if (!sc->proc[i].enabled)
            continue;
        for (size_t c = 0; c < vl_processes[i]->ncolumns; c++, n++) {
            m->col_name[n] = vl_processes[i]->columns[c];
            m->col_proc[n] = i;
        }
    }
    sort_by_name(sc, m);
    return m;
fail:
    vl_model_free(m);
    return NULL;
}

void vl_model_free(vl_model *m)
{
    if (!m)
        return;
    vl_star_free(m->star);
    vl_climate_free(m->climate);
    free(m->col_base);
    free(m->col_name);
    free(m->col_proc);
    free(m->sum_order);
    free(m);
}

void vl_model_initial_state(const vl_model *m, double y[VL_NRES])
{
    const vl_inventory_params *in = &m->sc->inventory;
    double kg_per_pa = 1.0 / m->pa_per_kg;
    memset(y, 0, VL_NRES * sizeof y[0]);
    y[VL_R_WATER] = in->surface_water_kg;
    y[VL_R_MANTLE_WATER] = in->mantle_water_kg;
    y[VL_R_CO2] = in->co2_pa * kg_per_pa;
    y[VL_R_N2] = in->n2_pa * kg_per_pa;
    y[VL_R_O2] = in->o2_pa * kg_per_pa;
    y[VL_R_H2] = in->h2_pa * kg_per_pa;
    y[VL_R_CARBONATE] = in->carbonate_pa * kg_per_pa;
    y[VL_R_MANTLE_C] = in->mantle_co2_pa * kg_per_pa;
    y[VL_R_MANTLE_N] = in->mantle_n2_pa * kg_per_pa;
    for (size_t i = 0; i < vl_nprocesses; i++)
        if (m->sc->proc[i].enabled && vl_processes[i]->initial)
            vl_processes[i]->initial(m->sc->proc[i].params, m, y);
    /* deuterium at the initial D/H in every hydrogen reservoir: kg D = kg H x R m_D/m_H */
    for (int r = 0; r < VL_NRES; r++) {
        int d = vl_reservoir_deuterium(r);
        if (d >= 0)
            y[d] = y[r] * vl_reservoir_element_fraction(r, VL_EL_H) * in->initial_dh *
                   VL_AW_D / VL_AW_H;
    }
}

static double pos(double v) { return v > 0.0 ? v : 0.0; }

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
    env->p_surf_pa = mass * m->pa_per_kg;
    for (int i = 0; i < VL_NGASES; i++) {
        env->x[i] = moles > 0.0 ? mol[i] / moles : 0.0;
        env->p_pa[i] = env->x[i] * env->p_surf_pa;
    }
    double m_h2o = vl_species_molar_mass(VL_SP_H2O) / VL_AVOGADRO;
    env->m_mean_kg = moles > 0.0 ? mass / moles / VL_AVOGADRO : m_h2o;
    env->m_background_kg = bg_mol > 0.0 ? bg_mass / bg_mol / VL_AVOGADRO : m_h2o;
}

/* The atmospheric part of the surface CO2 over an ocean (ocean.h), in two passes: at
 * VL_OCEAN_FIRST_PASS_K, then at the surface temperature the climate gives for that
 * first split (not below the freezing point: an ice-covered ocean stays at it). The
 * climate is then evaluated again by the caller. Continuous in y for a fixed regime. */
/* vl_ocean_atm_co2 through the model's cache entry for this pass (0 or 1). */
static double cached_atm_co2(const vl_model *cm, int pass, double surface, double ocean_m3,
                             double t_k, const vl_ocean_air *air)
{
    vl_model *m = (vl_model *)cm; /* the cache is per model */
    double key[5] = {surface, ocean_m3, t_k, air->other_kg, air->other_mol};
    if (m->ocean_cache[pass].valid && memcmp(key, m->ocean_cache[pass].key, sizeof key) == 0)
        return m->ocean_cache[pass].atm_kg;
    double atm = vl_ocean_atm_co2(surface, ocean_m3, t_k, air);
    memcpy(m->ocean_cache[pass].key, key, sizeof key);
    m->ocean_cache[pass].atm_kg = atm;
    m->ocean_cache[pass].valid = 1;
    return atm;
}

static void split_surface_co2(const vl_model *m, const double *y, vl_env *env)
{
    double surface = pos(y[VL_R_CO2]), water = pos(y[VL_R_WATER]);
    double ocean_m3 = water / VL_OCEAN_DENSITY_KG_M3;
    vl_ocean_air air = {0.0, 0.0, m->pa_per_kg};
    static const int others[3][2] = {
        {VL_GAS_N2, VL_SP_N2}, {VL_GAS_O2, VL_SP_O2}, {VL_GAS_H2, VL_SP_H2}};
    for (int i = 0; i < 3; i++) {
        air.other_kg += env->mass_kg[others[i][0]];
        air.other_mol += env->mass_kg[others[i][0]] / vl_species_molar_mass(others[i][1]);
    }
    env->mass_kg[VL_GAS_CO2] = cached_atm_co2(m, 0, surface, ocean_m3, VL_OCEAN_FIRST_PASS_K, &air);
    vl_climate_eval(m->climate, water, env);
    double t_ocean = fmax(env->t_surf_k, m->sc->climate.freeze_temp_k);
    env->mass_kg[VL_GAS_CO2] = cached_atm_co2(m, 1, surface, ocean_m3, t_ocean, &air);
}

void vl_model_env(const vl_model *m, double t_s, const double *y, int regime, vl_env *env)
{
    const vl_scenario *sc = m->sc;
    double a = sc->planet.orbit_m, e = sc->planet.eccentricity;
    memset(env, 0, sizeof *env);
    env->t_s = t_s;
    vl_star_eval(m->star, t_s, &env->star);
    env->instellation = vl_star_orbit_flux(env->star.l_bol_w, a, e);
    env->s_eff = env->instellation / VL_S_EARTH;
    env->f_xuv = vl_star_orbit_flux(env->star.l_xuv_w, a, e);
    env->lya_flux = env->star.lya_flux_1au * (VL_AU / a) * (VL_AU / a) / sqrt(1.0 - e * e);
    env->wind_pressure_pa =
        env->star.wind_mdot_kg_s * env->star.wind_speed_m_s / (4.0 * VL_PI * a * a);
    env->heat_flow_rel = vl_interior_heat_flow_rel(&sc->interior, t_s);
    env->g = m->g;
    env->area_m2 = m->area_m2;
    env->mass_kg[VL_GAS_CO2] = pos(y[VL_R_CO2]);
    env->mass_kg[VL_GAS_N2] = pos(y[VL_R_N2]);
    env->mass_kg[VL_GAS_O2] = pos(y[VL_R_O2]);
    env->mass_kg[VL_GAS_H2] = pos(y[VL_R_H2]);
    env->regime = regime;
    if (vl_ocean_holds_carbon(regime) && y[VL_R_WATER] > 0.0)
        split_surface_co2(m, y, env);
    vl_climate_eval(m->climate, pos(y[VL_R_WATER]), env);
    finish_atmosphere(m, env);
    vl_upper_eval(sc, env);
    for (size_t i = 0; i < vl_nprocesses; i++)
        if (sc->proc[i].enabled && vl_processes[i]->prepare)
            vl_processes[i]->prepare(sc->proc[i].params, m, y, env);
}

void vl_model_rhs(const vl_model *m, double t_s, const double *y, int regime, double *dydt,
                  double *columns, vl_env *env)
{
    vl_env local;
    vl_env *e = env ? env : &local;
    vl_model_env(m, t_s, y, regime, e);
    if (columns)
        memset(columns, 0, m->ncolumns * sizeof columns[0]);
    /* each process's tendencies go to a row of its own, added up in name order */
    double rows[VL_MAX_PROCESSES][VL_NRES];
    for (size_t k = 0; k < m->nenabled; k++) {
        size_t i = m->sum_order[k];
        memset(rows[k], 0, sizeof rows[k]);
        vl_flux fx = {y, rows[k], columns, m->col_base[i]};
        vl_processes[i]->rates(m->sc->proc[i].params, m, y, e, &fx);
    }
    for (int r = 0; r < VL_NRES; r++) {
        double s = 0.0;
        for (size_t k = 0; k < m->nenabled; k++)
            s += rows[k][r];
        dydt[r] = s;
    }
}
