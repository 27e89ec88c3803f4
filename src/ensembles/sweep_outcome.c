/* sweep_outcome.c: what a member's run came to (sweep.h, docs/ensembles.md): the names
 * and units of the outcomes, the outcomes of one finished run, and the outcome class. */
#include <math.h>

#include "sweep_internal.h"
#include "volev/climate.h"
#include "volev/schema.h"
#include "volev/units.h"

const char *const vl_outcome_name[VL_NOUT] = {
    "final_water_to", "water_lost_to",  "o2_bar",         "co2_bar",
    "surface_temp_k", "surface_pressure_bar", "dh_enrichment", "runaway_time_yr",
    "moist_time_yr",  "desiccation_yr", "first_runaway_yr", "first_moist_yr",
    "first_freeze_yr", "magma_time_yr"};
const char *const vl_outcome_unit[VL_NOUT] = {"TO", "TO", "bar", "bar", "K", "bar", "ratio",
                                              "yr", "yr", "yr", "yr", "yr", "yr", "yr"};
const char *const vl_class_name[VL_NCLASS] = {"failed", "steam", "o2_rich", "desiccated",
                                              "frozen", "ocean_kept", "molten"};

/* The outcomes of a member from its run: the quantities derived from the final state
 * come from vl_summary_derive (schema.h), as in the run's summary.csv; the regime
 * history from the events the sink caught (tr). */
int vl_sweep_outcomes(const vl_model *m, const vl_scenario *sc, const vl_run_stats *s,
                      const vl_sweep_trace *tr, vl_member *res, vl_status *st)
{
    vl_summary d;
    (void)sc;
    vl_summary_derive(m, s, &d);
    res->regime = tr->end_regime;
    res->steps = s->steps;
    res->out[VL_OUT_WATER] = d.surface_water_to;
    res->out[VL_OUT_WATER_LOST] = d.water_lost_to;
    res->out[VL_OUT_O2] = d.o2_bar;
    res->out[VL_OUT_CO2] = d.co2_bar;
    res->out[VL_OUT_TEMP] = d.surface_temp_k;
    res->out[VL_OUT_PRESSURE] = d.surface_pressure_bar;
    res->out[VL_OUT_DH] = d.dh_enrichment;
    res->out[VL_OUT_RUNAWAY_TIME] = s->time_in_regime_s[VL_REGIME_RUNAWAY] / VL_YR;
    res->out[VL_OUT_MOIST_TIME] = s->time_in_regime_s[VL_REGIME_MOIST] / VL_YR;
    res->out[VL_OUT_DESICCATION] = tr->ocean_lost / VL_YR;
    res->out[VL_OUT_FIRST_RUNAWAY] = tr->first[VL_REGIME_RUNAWAY] / VL_YR;
    res->out[VL_OUT_FIRST_MOIST] = tr->first[VL_REGIME_MOIST] / VL_YR;
    res->out[VL_OUT_FIRST_FREEZE] = tr->first[VL_REGIME_FROZEN] / VL_YR;
    res->out[VL_OUT_MAGMA_TIME] = s->time_in_regime_s[VL_REGIME_MAGMA] / VL_YR;
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
    if (res->regime == VL_REGIME_MAGMA)
        return VL_CLASS_MOLTEN;
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
