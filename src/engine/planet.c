/* planet.c: the constants of a run from its scenario (planet.h). */
#include "volev/planet.h"

#include "volev/units.h"

void vl_planet_from_scenario(const vl_scenario *sc, vl_planet *pl)
{
    double r = sc->planet.radius_m;
    pl->mass_kg = sc->planet.mass_kg;
    pl->radius_m = r;
    pl->g = VL_G_NEWTON * sc->planet.mass_kg / (r * r);
    pl->area_m2 = 4.0 * VL_PI * r * r;
    pl->pa_per_kg = pl->g / pl->area_m2;
    pl->orbit_m = sc->planet.orbit_m;
    pl->eccentricity = sc->planet.eccentricity;
    pl->star_mass_kg = sc->star.mass_kg;
    pl->obstacle_rp = sc->planet.obstacle_rp;
    pl->tectonics = sc->interior.tectonics;
    pl->run_start_s = sc->run.start_s;
    pl->run_end_s = sc->run.end_s;
    pl->initial_dh = sc->inventory.initial_dh;
}
