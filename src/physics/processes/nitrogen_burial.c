/* nitrogen_burial.c: abiotic fixation of atmospheric N2 (lightning NO, rained out as
 * nitrate and reduced to ammonium in the ocean) and burial of the fixed nitrogen in the
 * crust (crust_nitrogen, a terminal store in this version):
 *   B = eps F_fix (M_N2/M_N2,ref) f_liq,
 * first order in atmospheric N2, with f_liq the ice-free share of the ocean (burial
 * needs an ocean; continuous through freezing). Off by default: the abiotic fixation
 * rate of an anoxic CO2-N2 atmosphere and the buried share are poorly known, and the
 * defaults are upper bounds (docs/cycles.md). */
#include <stddef.h>

#include "volev/process.h"
#include "volev/units.h"

typedef struct {
    double fix_kg_s;    /* F_fix, kg N/s */
    double eps;         /* buried share */
    double ref_n2_kg;   /* M_N2,ref */
} params;

#define R(k, unit, si, d, lo, hi, f, doc, ref) \
    VL_PARAM_ROW(params, VL_PT_REAL, k, unit, si, d, lo, hi, f, doc, ref, NULL)

static const vl_param table[] = {
    R("fixation_tg_yr", "Tg N/yr", 1e9 / VL_YR, 5.0, 0.0, 1e6, fix_kg_s,
      "F_fix: nitrogen fixed abiotically at the reference atmosphere",
      "present lightning NOx source 5 +- 3 Tg N/yr (Schumann & Huntrieser 2007, ACP "
      "7:3823), from memory; an upper bound for anoxic CO2-N2 atmospheres, whose NO yield "
      "is lower (Navarro-Gonzalez et al. 2001, Nature 412:61, from memory)"),
    R("buried_fraction", "", 1.0, 1.0, 0.0, 1.0, eps,
      "eps: share of the fixed nitrogen buried in the crust rather than returned to N2",
      "chosen here: 1, the upper bound (no denitrification on a lifeless planet)"),
    R("reference_n2_kg", "kg", 1.0, 3.887e18, 1.0, 1e25, ref_n2_kg,
      "M_N2,ref: atmospheric N2 at which the fixation is F_fix",
      "present Earth 3.887e18 kg (NSSDC composition x atmospheric mass) [C]"),
};

static const vl_flux_column columns[] = {
    {"n2_burial_kg_s", "nitrogen buried in the crust (abiotic fixation and sedimentation)"},
};

enum { N2_TO_CRUST_N };
static const vl_transfer transfers[] = {[N2_TO_CRUST_N] = {VL_R_N2, VL_R_CRUST_N}};

/* Fixed N2 buried in the crust, first order in atmospheric N2 (with an ocean). */
static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const double *y = v->y;
    const vl_env *env = v->env;
    const params *p = pv;
    if (env->liquid <= 0.0)
        return;
    double n2 = y[VL_R_N2] > 0.0 ? y[VL_R_N2] : 0.0;
    double b = p->eps * p->fix_kg_s * (n2 / p->ref_n2_kg) * env->liquid;
    vl_flux_transfer(fx, N2_TO_CRUST_N, b, 0);
}

const vl_process vl_process_nitrogen_burial = {
    .name = "nitrogen_burial",
    .summary = "abiotic fixation of N2 and burial of the fixed nitrogen in the crust",
    .refs = "Schumann & Huntrieser 2007 (present lightning fixation)",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_TRANSFERS(transfers),
    .default_enabled = 0,
    .rates = rates,
};
