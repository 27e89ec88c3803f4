/* sputtering.c: neutrals knocked out by re-impacting pickup ions (O, CO2, N): the
 * pickup law of nonthermal.c with its own reference rates and a steeper gravity factor
 * (Luhmann, Johnson & Zhang 1992; Johnson 1994). */
#include "nonthermal.h"
#include "volev/units.h"

static const vl_param table[] = {
    ROW("o_ref_per_s", "s^-1", 1.0, 2e23, 0.0, 1e35, ref[EL_O],
        "sputtered O escape at the reference planet and drivers",
        "[C] 0.1 x Mars O+ pickup 2e24 s^-1: sputtering about a tenth of pickup today "
        "(Luhmann, Johnson & Zhang 1992), from memory"),
    ROW("c_ref_per_s", "s^-1", 1.0, 0.0, 0.0, 1e35, ref[EL_C],
        "sputtered CO2 escape at the reference (one C and two O each)",
        "chosen here: 0, no verified present-day rate at hand; set it to study C loss"),
    ROW("n_ref_per_s", "s^-1", 1.0, 0.0, 0.0, 1e35, ref[EL_N],
        "sputtered N escape at the reference (from N2)",
        "chosen here: 0, no verified present-day rate at hand; set it to study N loss"),
    MARS_RADIUS_ROW,
    MARS_XUV_ROW,
    MARS_WIND_ROW,
    MARS_VESC_ROW,
    ROW("xuv_exponent", "", 1.0, 1.0, 0.0, 10.0, xuv_exp, "a in (F_XUV/F_ref)^a",
        "as ion_pickup: the re-impacting ions are pickup ions (conservative: sputtering "
        "grew faster than pickup into the past in Luhmann et al. 1992, from memory)"),
    ROW("wind_exponent", "", 1.0, 0.5, 0.0, 10.0, wind_exp, "b in (p_sw/p_ref)^b",
        "as ion_pickup.wind_exponent (Edberg et al. 2010, from memory)"),
    ROW("escape_energy_exponent", "", 1.0, 3.0, 0.0, 10.0, gravity_exp,
        "s in (v_ref/v_esc)^(2 s)",
        "[C] 2 (ion_pickup, the incoming ions) + 1 (escaping share of a sputtered E^-2 "
        "energy tail ~ 1/E_esc, Johnson 1994, from memory)"),
    ROW("shielding_exponent", "", 1.0, 2.0, 0.0, 10.0, shield_exp,
        "k in the exposure (r_obs/r_mp)^k", "chosen here (invented): as ion_pickup"),
    PHOTON_ROW,
};

static const vl_flux_column columns[] = {
    {"sputter_o_kg_s", "oxygen sputtered off by re-impacting pickup ions (with the O of CO2)"},
    {"sputter_c_kg_s", "carbon sputtered off as CO2 by re-impacting pickup ions"},
    {"sputter_n_kg_s", "nitrogen sputtered off by re-impacting pickup ions"},
};
/* Column of each element (EL_O, EL_H, EL_C, EL_N; -1: none). */
static const int column_of[NEL] = {0, -1, 1, 2};

static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const vl_nonthermal_params *p = pv;
    double q[NEL];
    double k = vl_nonthermal_drive(p, v->planet, v->env) *
               vl_nonthermal_gravity_power(p, v->planet, v->env) *
               vl_nonthermal_exposure(p, v->planet, v->env);
    vl_nonthermal_demand(p, v, k, 1.0, q);
    vl_nonthermal_apply(q, column_of, 0, 1.0, fx);
}

const vl_process vl_process_sputtering = {
    .name = "sputtering",
    .summary = "atmospheric sputtering by re-impacting pickup ions, a fraction of Mars's pickup",
    .refs = "Luhmann, Johnson & Zhang 1992; Johnson 1994",
    VL_PROCESS_TABLES(table, vl_nonthermal_params, columns),
    VL_NONTHERMAL_FLUXES,
    .default_enabled = 1,
    .rates = rates,
};
