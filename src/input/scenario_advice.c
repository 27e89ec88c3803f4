/* scenario_advice.c: warnings for a scenario that loads but is probably not what its
 * author meant (docs/model.md section 5): a planet whose mantle holds no volatiles
 * while outgassing is on, so the carbon and nitrogen cycles can only run down. */
#include <string.h>

#include "scenario_internal.h"
#include "volev/process.h"

/* 1 when the process called name is enabled in sc. */
static int enabled(const vl_scenario *sc, const char *name)
{
    for (size_t k = 0; k < vl_nprocesses; k++)
        if (strcmp(vl_processes[k]->name, name) == 0)
            return sc->proc[k].enabled;
    return 0;
}

void vl_scenario_advise(vl_scenario *sc)
{
    long co2 = vl_scenario_find_key("inventory.mantle_co2_bar");
    long n2 = vl_scenario_find_key("inventory.mantle_n2_bar");
    if (co2 < 0 || n2 < 0 || !enabled(sc, "outgassing"))
        return;
    if (sc->origin[co2] == VL_FROM_DEFAULT && sc->origin[n2] == VL_FROM_DEFAULT &&
        sc->inventory.mantle_co2_pa == 0.0 && sc->inventory.mantle_n2_pa == 0.0)
        vl_scenario_warn(sc, "inventory.mantle_co2_bar and inventory.mantle_n2_bar are not set "
                             "(0 bar): outgassing has nothing to release, so the carbon and "
                             "nitrogen cycles can only run down (scenarios/earth.cfg gives "
                             "1000 and 4.5 bar); set them, or 0 to mean it");
}
