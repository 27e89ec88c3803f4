/* planet.h: the constants of one run that processes and stages may read: the planet,
 * its orbit, its star's mass, its tectonic mode and the run's span. Derived once from
 * the scenario when the model is built; never changed afterwards. */
#ifndef VOLEV_PLANET_H
#define VOLEV_PLANET_H

#include "volev/scenario.h"

typedef struct vl_planet {
    double mass_kg;            /* planet mass */
    double radius_m;           /* planet radius */
    double g;                  /* surface gravity G M / R^2, m/s^2 */
    double area_m2;            /* surface area 4 pi R^2 */
    double pa_per_kg;          /* thin-shell surface pressure per kg of atmosphere, g / area */
    double orbit_m;            /* semi-major axis */
    double eccentricity;
    double star_mass_kg;       /* mass of the host star */
    double obstacle_rp;        /* induced-magnetosphere obstacle, planet radii */
    int tectonics;             /* enum vl_tectonics */
    double run_start_s;        /* stellar age at the start of the run */
    double run_end_s;          /* stellar age at its end */
    double initial_dh;         /* D/H atom ratio of the initial inventory */
} vl_planet;

/* The constants of sc. */
void vl_planet_from_scenario(const vl_scenario *sc, vl_planet *pl);

#endif
