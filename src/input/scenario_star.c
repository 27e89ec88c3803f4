/* scenario_star.c: a star known by its mass (docs/model.md, "Star"). Where a scenario
 * gives star.mass_msun but not the luminosity or the effective temperature at the same
 * level or a later one (the file over the defaults; a --set or a catalogue row over the
 * file), they follow from the mass by the main-sequence relations of star_mass.h, so
 * `--set star.mass_msun=1` on an M-dwarf scenario gives a Sun-like star and a catalogue
 * row with a mass and no luminosity gets its own. Values given where the mass is given
 * are kept, with a warning when they are far from the main sequence (a young, evolved or
 * mistyped star). A scenario that gives no mass keeps the solar defaults. */
#include <math.h>
#include <stdio.h>

#include "scenario_internal.h"
#include "volev/star_mass.h"
#include "volev/units.h"

/* Warn beyond a factor of 3 in luminosity (about three times the 0.1-0.2 dex scatter of
 * the mass-luminosity relation, Eker et al. 2018) and 15 % in Teff: far enough that
 * every main-sequence star in the relations' sample is quiet. Common practice. */
#define L_RATIO_WARN 3.0
#define TEFF_FRACTION_WARN 0.15

/* Row i set to v (file units) as derived from the mass. */
static void set_derived(vl_scenario *sc, size_t i, double v)
{
    const vl_param *p;
    double *slot = vl_scenario_slot(sc, i, &p);
    *slot = v * p->to_si;
    sc->file_value[i] = v;
    vl_scenario_mark(sc, i, VL_FROM_MASS, 0);
}

/* 1 when row i's needs clause holds (the value is used at all). */
static int used(const vl_scenario *sc, size_t i)
{
    char other[VL_SCENARIO_KEY_MAX], state[128];
    const char *values;
    return vl_scenario_needs_hold(sc, i, other, sizeof other, state, sizeof state, &values);
}

/* The luminosity: derived, or checked against the main sequence. */
static int luminosity(vl_scenario *sc, size_t mass, size_t lum, vl_status *st)
{
    double m = sc->file_value[mass], l_ms = vl_star_ms_luminosity_lsun(m);
    if (!used(sc, lum))
        return VL_OK;
    if (sc->origin[lum] < sc->origin[mass]) {
        if (!isfinite(l_ms))
            return vl_scenario_fail_param(sc, mass, st,
                                          "star.mass_msun = %g is outside %g-7 M_sun, where the "
                                          "main-sequence relation sets the luminosity: give "
                                          "star.luminosity_lsun", m, VL_STAR_MS_MASS_MIN);
        set_derived(sc, lum, l_ms);
        return VL_OK;
    }
    double l = sc->file_value[lum];
    if (isfinite(l_ms) && (l > L_RATIO_WARN * l_ms || l < l_ms / L_RATIO_WARN))
        vl_scenario_warn(sc, "star.luminosity_lsun = %g is %.3g times the main-sequence luminosity of a "
                 "%g M_sun star (Eker et al. 2018): right for a young or evolved star, else "
                 "check it", l, l / l_ms, m);
    return VL_OK;
}

/* The effective temperature: derived, or checked against the main sequence. */
static int teff(vl_scenario *sc, size_t mass, size_t tk, vl_status *st)
{
    double m = sc->file_value[mass], t_ms = vl_star_ms_teff_k(m);
    if (sc->origin[tk] < sc->origin[mass]) {
        const vl_param *p;
        vl_scenario_slot(sc, tk, &p);
        if (!isfinite(t_ms))
            return vl_scenario_fail_param(sc, mass, st,
                                          "star.mass_msun = %g is outside %g-%g M_sun, where the "
                                          "main-sequence relations set the effective "
                                          "temperature: give star.teff_k", m,
                                          VL_STAR_MS_MASS_MIN, VL_STAR_MS_RADIUS_MAX);
        if (t_ms < p->lo || t_ms > p->hi)
            return vl_scenario_fail_param(sc, mass, st,
                                          "star.mass_msun = %g gives a main-sequence effective "
                                          "temperature of %.0f K, outside star.teff_k's bounds "
                                          "[%g, %g] K: give star.teff_k", m, t_ms, p->lo, p->hi);
        set_derived(sc, tk, t_ms);
        return VL_OK;
    }
    double t = sc->file_value[tk];
    if (isfinite(t_ms) && fabs(t / t_ms - 1.0) > TEFF_FRACTION_WARN)
        vl_scenario_warn(sc, "star.teff_k = %g K differs from the main-sequence %.0f K of a %g M_sun star "
                 "(Eker et al. 2018) by more than 15 %%: check it", t, t_ms, m);
    return VL_OK;
}

int vl_scenario_derive_star(vl_scenario *sc, vl_status *st)
{
    size_t mass = (size_t)vl_scenario_find_key("star.mass_msun");
    size_t lum = (size_t)vl_scenario_find_key("star.luminosity_lsun");
    size_t tk = (size_t)vl_scenario_find_key("star.teff_k");
    if (sc->origin[mass] == VL_FROM_DEFAULT)
        return VL_OK;
    int rc = luminosity(sc, mass, lum, st);
    return rc ? rc : teff(sc, mass, tk, st);
}
