/* nitrogen_regassing.c: nitrogen carried into the mantle at subduction zones, as
 * ammonium in marine sediments and altered oceanic crust. The nitrogen fixed into them
 * comes from the atmosphere, so the flux is taken first order in atmospheric N2 and
 * proportional to the seafloor subducted per unit of planet area:
 *   F = F_ref (Q/Q_ref)^n (R_earth/R_p) (M_N2/M_N2,ref) f_liq,
 * (ridge length ~ R_p as in mantle_water.c, over area ~ R_p^2), with f_liq the ice-free
 * share of the ocean (sediments and altered crust need an ocean; the rate fades
 * continuously as it freezes). Stagnant lid: no subduction, F = 0. The reference rate
 * defaults to the default N2 outgassing (steady state today); subduction-zone budgets
 * suggest a net ingassing Earth (docs/cycles.md). */
#include <math.h>
#include <stddef.h>

#include "volev/process.h"
#include "volev/units.h"

typedef struct {
    double ref_mol_s;   /* F_ref, N2 */
    double ref_n2_kg;   /* M_N2,ref */
    double spread_exp;  /* n */
} params;

#define R(k, unit, si, d, lo, hi, f, doc, ref) \
    VL_PARAM_ROW(params, VL_PT_REAL, k, unit, si, d, lo, hi, f, doc, ref, NULL)

static const vl_param table[] = {
    R("reference_rate_tmol_yr", "Tmol/yr", 1e12 / VL_YR, 1e-3, 0.0, 1e6, ref_mol_s,
      "F_ref: N2 carried into the mantle on an Earth-sized planet at the reference heat flow "
      "and atmosphere",
      "equal to the default N2 outgassing (steady state today), common practice; "
      "subduction-zone budgets put it near 1e-2 Tmol N2/yr (net ingassing; review: Johnson "
      "& Goldblatt 2015, Earth-Sci. Rev. 148:150), from memory"),
    R("reference_n2_kg", "kg", 1.0, 3.887e18, 1.0, 1e25, ref_n2_kg,
      "M_N2,ref: atmospheric N2 at which F = F_ref",
      "present Earth 3.887e18 kg (NSSDC composition x atmospheric mass) [C]"),
    R("spreading_exponent", "", 1.0, 1.0, 0.0, 3.0, spread_exp,
      "n: subduction rate ~ (Q/Q_ref)^n with Q the interior heat flow",
      "1 (spreading ~ heat flow), common practice; Lehmer et al. 2020 take outgassing "
      "~ Q^m with m = 1-2"),
};

static const vl_flux_column columns[] = {
    {"n2_regassing_kg_s", "nitrogen carried into the mantle by subduction"},
};

enum { N2_TO_MANTLE_N };
static const vl_transfer transfers[] = {[N2_TO_MANTLE_N] = {VL_R_N2, VL_R_MANTLE_N}};

/* N2 subducted into the mantle, first order in atmospheric N2 (mobile lid, with an ocean). */
static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const double *y = v->y;
    const vl_env *env = v->env;
    const vl_planet *pl = v->planet;
    const params *p = pv;
    if (pl->tectonics != VL_TECTONICS_MOBILE || env->liquid <= 0.0)
        return;
    double q = env->heat_flow_rel > 0.0 ? env->heat_flow_rel : 0.0;
    double n2 = y[VL_R_N2] > 0.0 ? y[VL_R_N2] : 0.0;
    double f = p->ref_mol_s * vl_species_molar_mass(VL_SP_N2) * pow(q, p->spread_exp) *
               (VL_R_EARTH / pl->radius_m) * (n2 / p->ref_n2_kg) * env->liquid;
    vl_flux_transfer(fx, N2_TO_MANTLE_N, f, 0);
}

const vl_process vl_process_nitrogen_regassing = {
    .name = "nitrogen_regassing",
    .summary = "atmospheric nitrogen subducted into the mantle with sediments and altered "
               "crust, first order in N2",
    .refs = "Johnson & Goldblatt 2015 (budget context)",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_TRANSFERS(transfers),
    .default_enabled = 1,
    .rates = rates,
};
