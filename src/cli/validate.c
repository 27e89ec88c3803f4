/* validate.c: `volev validate SCENARIO [--set KEY=VALUE]...`: load, check, build the
 * model (reads star tables), list every resolved parameter with unit and origin, then
 * the instellation and habitable-zone position at the run's start and end. */
#include <stdio.h>

#include "args.h"
#include "cli.h"
#include "volev/climate.h"
#include "volev/model.h"
#include "volev/star.h"
#include "volev/units.h"
#include "volev/sweep.h"

/* Where S_eff sits against the Kopparapu et al. 2013 edges at teff_k. */
static const char *zone(double s, double teff_k)
{
    if (s > vl_hz_seff_2013(VL_HZ_RECENT_VENUS, teff_k))
        return "inside the optimistic inner edge (recent Venus): too hot";
    if (s > vl_hz_seff_2013(VL_HZ_MOIST, teff_k))
        return "between recent Venus and the moist greenhouse (optimistic zone only)";
    if (s >= vl_hz_seff_2013(VL_HZ_MAX_GREENHOUSE, teff_k))
        return "in the conservative habitable zone (moist to maximum greenhouse)";
    if (s >= vl_hz_seff_2013(VL_HZ_EARLY_MARS, teff_k))
        return "between the maximum greenhouse and early Mars (optimistic zone only)";
    return "beyond the optimistic outer edge (early Mars): too cold";
}

/* The instellation, S_eff and habitable-zone position at the run's start and end. */
static void print_derived(const vl_model *m)
{
    const vl_scenario *sc = m->sc;
    const double ages[2] = {sc->run.start_s, sc->run.end_s};
    const char *when[2] = {"start", "end"};
    for (int k = 0; k < 2; k++) {
        vl_star_state ss;
        vl_star_eval(m->star, ages[k], &ss);
        double f = vl_star_orbit_flux(ss.l_bol_w, sc->planet.orbit_m, sc->planet.eccentricity);
        printf("# %s (%.4g yr): star %.4g L_sun, Teff %.0f K; instellation %.5g W/m^2, S_eff "
               "%.4g: %s (Kopparapu et al. 2013)\n",
               when[k], ages[k] / VL_YR, ss.l_bol_w / VL_L_SUN, ss.teff_k, f, f / VL_S_EARTH,
               zone(f / VL_S_EARTH, ss.teff_k));
    }
}

int vl_cli_validate(int argc, char **argv)
{
    vl_cli_args a;
    vl_status st;
    vl_scenario *sc;
    vl_model *m;
    if (vl_cli_start(argc, argv, 0, &a, &sc, &m, &st)) {
        vl_cli_args_free(&a);
        return VL_ERR_USAGE;
    }
    if (m && sc->sweep_line) { /* the sweep group is part of the file: check it too */
        vl_sweep *sw = vl_sweep_load(a.scenario, &st);
        if (sw)
            printf("# sweep: %ld members (volev sweep %s)\n", sw->members, a.scenario);
        vl_sweep_free(sw);
    }
    if (m && st.code == VL_OK) {
        vl_scenario_print(sc, stdout);
        print_derived(m);
        printf("# %s: valid\n", a.scenario);
    }
    return vl_cli_finish(&a, sc, m, &st);
}
