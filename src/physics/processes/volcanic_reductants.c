/* volcanic_reductants.c: the reducing power of volcanic gases. A magma degassing at the
 * oxygen fugacity of its mantle source, fO2 = FMQ + delta (log units; the scenario's
 * mantle redox state), releases H2 beside its H2O and CO beside its CO2 in the ratios of
 * the equilibria H2 + 1/2 O2 = H2O and CO + 1/2 O2 = CO2 at the eruption temperature
 * (redox.h; Holland 1984, The Chemical Evolution of the Atmosphere and Oceans; Kasting,
 * Eggler & Raeburn 1993, J. Geol. 101:245):
 *   R = (H2/H2O) F_H2O + (CO/CO2) F_CO2        mol H2-equivalents per second,
 * F the volcanic H2O and CO2 fluxes (recycled water included: all the water that passes
 * through the melts), scaled by (Q/Q0)^m and, under a stagnant lid, by a factor (not
 * by outgassing's separate stagnant-lid exponent: the volcanic rates are not one shared
 * stage yet, docs/model.md section 4), and by the planet's mass. CO counts as
 * H2 through the water-gas shift CO + H2O -> CO2 + H2 that photochemistry completes
 * (no CO reservoir is tracked). The mantle that gave the reductant keeps the oxygen:
 *   H2O (surface) -> H2 (air) + O (oxidised rock),
 * balanced in the element ledger; the H2 then escapes or is oxidised by the air's O2
 * (h2_oxidation): the supply-limited volcanic sink of abiotic O2. docs/model.md
 * section 4. */
#include <math.h>
#include <stddef.h>

#include "scaling.h"
#include "volev/process.h"
#include "volev/redox.h"
#include "volev/units.h"

typedef struct {
    double h2o_mol_s, co2_mol_s; /* volcanic fluxes at the reference heat flow, per Earth mass */
    double exponent;             /* F ~ (Q/Q0)^m */
    double stagnant_factor;      /* stagnant lid: f_sl of the mobile-lid flux */
    double delta_fmq;            /* mantle fO2 over FMQ, log10 units */
    double temp_k;               /* eruption temperature */
    double pressure_bar;         /* degassing pressure */
} params;

#define TMOL_YR (1e12 / VL_YR)
#define STAGNANT "planet.interior.tectonics=stagnant_lid"
#define R(k, unit, si, d, lo, hi, f, doc, ref, needs) \
    VL_PARAM_ROW(params, VL_PT_REAL, k, unit, si, d, lo, hi, f, doc, ref, needs)

static const vl_param table[] = {
    R("h2o_tmol_yr", "Tmol/yr", TMOL_YR, 20.0, 0.0, 1e6, h2o_mol_s,
      "volcanic H2O flux (recycled water included) at the reference heat flow, per Earth mass",
      "order of Earth's volcanic water, ~1e13-1e14 mol/yr (Holland 1984; Catling & Kasting "
      "2017, Atmospheric Evolution on Inhabited and Lifeless Worlds), from memory", NULL),
    R("co2_tmol_yr", "Tmol/yr", TMOL_YR, 5.9, 0.0, 1e6, co2_mol_s,
      "volcanic CO2 flux (arc return included) at the reference heat flow, per Earth mass",
      "all volcanoes 5.9 Tmol/yr, Gerlach 2011, Eos 92:201", NULL),
    R("heat_flow_exponent", "", 1.0, 1.0, 0.0, 3.0, exponent,
      "m in F ~ (Q/Q0)^m", "as outgassing (Lehmer et al. 2020: m = 1-2)", NULL),
    R("stagnant_lid_factor", "", 1.0, 0.1, 0.0, 1.0, stagnant_factor,
      "volcanic flux under a stagnant lid over the mobile-lid flux", "as outgassing: a stagnant lid processes an order "
      "of magnitude less mantle (Tosi et al. 2017, A&A 605:A71), from memory",
      STAGNANT),
    R("mantle_delta_fmq", "log10", 1.0, 0.0, -6.0, 4.0, delta_fmq,
      "oxygen fugacity of the melts' mantle source relative to the FMQ buffer",
      "Earth's upper mantle near FMQ (Frost & McCammon 2008, Annu. Rev. Earth Planet. Sci. "
      "36:389, from memory); a Mars-like mantle near FMQ-1 to IW", NULL),
    R("eruption_temp_k", "K", 1.0, 1473.0, 1000.0, 2000.0, temp_k,
      "temperature at which the volcanic gases equilibrate", "basaltic eruptions ~1200 °C, common practice",
      NULL),
    R("degassing_pressure_bar", "bar", 1.0, 1.0, 1e-3, 1e4, pressure_bar,
      "pressure of the last equilibration (in the FMQ buffer's pressure term)",
      "subaerial eruptions, common practice", NULL),
};

static const vl_flux_column columns[] = {
    {"volcanic_h2_kg_s", "H2 (and CO as H2) released by volcanic gases at the mantle's fO2"},
};

enum { REDUCE };
static const vl_reaction reactions[] = {
    [REDUCE] = {"H2O -> H2 + O(oxidised rock)", 3, {VL_R_WATER, VL_R_H2, VL_R_OX_ROCK},
                {-1.0, 1.0, 1.0}},
};

static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const params *p = pv;
    const vl_planet *pl = v->planet;
    double s = vl_scaling_activity(pl, v->env, p->exponent, p->exponent) * pl->mass_kg /
               VL_M_EARTH * vl_scaling_lid(pl, p->stagnant_factor);
    double h2_per_h2o, co_per_co2;
    vl_redox_volcanic_ratios(p->temp_k, p->pressure_bar, p->delta_fmq, &h2_per_h2o, &co_per_co2);
    double mol_s = s * (h2_per_h2o * p->h2o_mol_s + co_per_co2 * p->co2_mol_s);
    if (mol_s > 0.0 && isfinite(mol_s))
        vl_flux_add_column(fx, 0, vl_flux_react(fx, REDUCE, mol_s, -1) *
                                      vl_species_molar_mass(VL_SP_H2));
}

const vl_process vl_process_volcanic_reductants = {
    .name = "volcanic_reductants",
    .summary = "H2 and CO of volcanic gases at the mantle's oxygen fugacity (ΔFMQ)",
    .refs = "Holland 1984; Kasting, Eggler & Raeburn 1993; Frost 1991",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_REACTIONS(reactions),
    .default_enabled = 1,
    .rates = rates,
};
