/* o2_sink_support.c: present-Earth fixtures of the O2-sink tests (o2_sink_support.h). */
#include <stdio.h>
#include <string.h>

#include "o2_sink_support.h"
#include "suites.h"
#include "volev/units.h"

void vl_o2_earth_state(double y[VL_NSTATE])
{
    memset(y, 0, VL_NSTATE * sizeof y[0]);
    y[VL_R_WATER] = VL_TO_KG;
    y[VL_R_N2] = 3.887e18;
    y[VL_R_O2] = 1.2e18;
}

vl_model *vl_o2_model(const char *process, const char *const *sets, size_t n,
                      vl_scenario **sc)
{
    char on[128];
    snprintf(on, sizeof on, "processes.%s.enabled=true", process);
    const char *all[8] = {on};
    ck_assert(n < 7);
    for (size_t i = 0; i < n; i++)
        all[i + 1] = sets[i];
    *sc = vl_test_scenario(NULL, all, n + 1);
    return vl_test_model(*sc);
}

void vl_o2_earth_env(const vl_model *m, const double *y, vl_env *env)
{
    vl_model_env(m, vl_test_work(m), VL_O2_T_NOW, y, VL_REGIME_TEMPERATE, env);
    env->heat_flow_rel = 1.0;
    env->p_pa[VL_GAS_O2] = VL_O2_P_NOW;
    env->liquid = 1.0;
}

double vl_o2_uptake(const vl_model *m, const char *process, const double *y, const vl_env *env,
                    double *dydt)
{
    double cols[4];
    vl_test_process_rates(m, process, y, env, dydt, cols);
    return cols[0] / vl_species_molar_mass(VL_SP_O2) * VL_YR;
}
