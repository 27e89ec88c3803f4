/* sweep_outcome.c: what a member's run came to (sweep.h, docs/ensembles.md): the names
 * and units of the outcomes, the outcomes of one finished run, and the outcome class. */
#include <math.h>

#include "sweep_internal.h"
#include "volev/climate.h"
#include "volev/output.h"
#include "volev/units.h"

const char *const vl_outcome_name[VL_NOUT] = {
    "final_water_to", "water_lost_to",  "o2_bar",         "co2_bar",
    "surface_temp_k", "surface_pressure_bar", "dh_enrichment", "runaway_time_yr",
    "moist_time_yr",  "desiccation_yr", "first_runaway_yr", "first_moist_yr",
    "first_freeze_yr"};
const char *const vl_outcome_unit[VL_NOUT] = {"TO", "TO", "bar", "bar", "K", "bar", "ratio",
                                              "yr", "yr", "yr", "yr", "yr", "yr"};
const char *const vl_class_name[VL_NCLASS] = {"failed", "steam", "o2_rich", "desiccated",
                                              "frozen", "ocean_kept"};

/* The outcomes of a member from its run: the one place where they are computed.
 *
 * NOTE for whoever moves these to a shared run-summary module: the quantities below
 * (final water, water lost as escaped hydrogen, O2, CO2, surface temperature and
 * pressure, D/H enrichment, time in and first entry into each regime, the age of the
 * first ocean_lost event) are derived from the run's final state y_final, its
 * statistics and the events the sink caught (tr). They are meant to be read from that
 * module later; until then this function computes them, and each formula must stay as
 * it is (members.csv, ensemble_summary.csv and the journals of interrupted sweeps are
 * compared byte for byte). */
int vl_sweep_outcomes(const vl_model *m, const vl_scenario *sc, const vl_run_stats *s,
                      const vl_sweep_trace *tr, vl_member *res, vl_status *st)
{
    const double *y = s->y_final;
    double pa = m->pa_per_kg / VL_BAR;
    double h_per_water = 2.0 * VL_AW_H * 1e-3 / vl_species_molar_mass(VL_SP_H2O);
    vl_env env;
    res->regime = tr->end_regime;
    vl_model_env(m, sc->run.end_s, y, res->regime >= 0 ? res->regime : VL_REGIME_TEMPERATE, &env);
    res->steps = s->steps;
    res->out[VL_OUT_WATER] = fmax(y[VL_R_WATER], 0.0) / VL_TO_KG;
    res->out[VL_OUT_WATER_LOST] = y[VL_R_SPACE_H] / h_per_water / VL_TO_KG;
    res->out[VL_OUT_O2] = fmax(y[VL_R_O2], 0.0) * pa;
    res->out[VL_OUT_CO2] = env.mass_kg[VL_GAS_CO2] * pa;
    res->out[VL_OUT_TEMP] = env.t_surf_k;
    res->out[VL_OUT_PRESSURE] = env.p_surf_pa / VL_BAR;
    res->out[VL_OUT_DH] = sc->inventory.initial_dh > 0.0
                              ? vl_output_dh(y, VL_R_WATER) / sc->inventory.initial_dh
                              : NAN;
    res->out[VL_OUT_RUNAWAY_TIME] = s->time_in_regime_s[VL_REGIME_RUNAWAY] / VL_YR;
    res->out[VL_OUT_MOIST_TIME] = s->time_in_regime_s[VL_REGIME_MOIST] / VL_YR;
    res->out[VL_OUT_DESICCATION] = tr->ocean_lost / VL_YR;
    res->out[VL_OUT_FIRST_RUNAWAY] = tr->first[VL_REGIME_RUNAWAY] / VL_YR;
    res->out[VL_OUT_FIRST_MOIST] = tr->first[VL_REGIME_MOIST] / VL_YR;
    res->out[VL_OUT_FIRST_FREEZE] = tr->first[VL_REGIME_FROZEN] / VL_YR;
    int rc = VL_OK;
    for (int o = 0; o < VL_NOUT; o++) /* defined outcomes must be finite */
        if (isinf(res->out[o]))
            rc = vl_fail(st, VL_ERR_NUMERIC, NULL, 0, "outcome %s is not finite",
                         vl_outcome_name[o]);
    return rc;
}

/* The first class that applies, in the order of enum vl_outcome_class. */
int vl_sweep_classify(const vl_sweep *sw, const vl_member *res)
{
    if (res->status != VL_OK)
        return VL_CLASS_FAILED;
    if (res->regime == VL_REGIME_RUNAWAY || res->regime == VL_REGIME_MOIST)
        return VL_CLASS_STEAM;
    if (res->out[VL_OUT_O2] >= sw->o2_rich_bar)
        return VL_CLASS_O2_RICH;
    if (res->regime == VL_REGIME_DRY)
        return VL_CLASS_DESICCATED;
    if (res->regime == VL_REGIME_FROZEN)
        return VL_CLASS_FROZEN;
    return VL_CLASS_OCEAN_KEPT;
}
