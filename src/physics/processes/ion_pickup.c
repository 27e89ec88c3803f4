/* ion_pickup.c: ions picked up by the stellar wind (O+, H+, CO2+, N+), scaled from the
 * present Mars (nonthermal.c: Q = Q_ref (A/A_ref)(F_XUV/F_ref)^a (p_sw/p_ref)^b
 * (v_ref/v_esc)^(2s) (r_obs/r_mp)^k (1 - w_hydro), within the photon guard). Its
 * hydrogen counts against the room the diffusion limit leaves above thermal escape
 * (declared as h_demand; the escape stage returns the share that fits). */
#include "nonthermal.h"
#include "volev/units.h"

static const vl_param table[] = {
    ROW("o_ref_per_s", "s^-1", 1.0, 2e24, 0.0, 1e35, ref[EL_O],
        "O+ escape at the reference planet and drivers",
        "Mars O+ ion escape ~2e24 s^-1 (Dong et al. 2015, MAVEN)"),
    ROW("h_ref_per_s", "s^-1", 1.0, 5.26e24, 0.0, 1e35, ref[EL_H],
        "H+ escape at the reference planet and drivers",
        "[C] 2e24 x (7.1e24 / 2.7e24): the H+/O+ ratio at Venus (Fedorov et al. 2011)"),
    ROW("c_ref_per_s", "s^-1", 1.0, 4e23, 0.0, 1e35, ref[EL_C],
        "CO2+ escape at the reference (each takes one C and two O to space)",
        "[C] 0.2 x 2e24: CO2+/O+ escape ratio ~0.2 at Mars (Carlsson et al. 2006, Mars "
        "Express), from memory"),
    ROW("n_ref_per_s", "s^-1", 1.0, 0.0, 0.0, 1e35, ref[EL_N],
        "N+ escape at the reference (from N2)",
        "chosen here: 0, no verified present-day N+ escape rate at hand; set it to study N "
        "loss"),
    MARS_RADIUS_ROW,
    MARS_XUV_ROW,
    MARS_WIND_ROW,
    MARS_VESC_ROW,
    ROW("xuv_exponent", "", 1.0, 1.0, 0.0, 10.0, xuv_exp,
        "a in (F_XUV/F_ref)^a",
        "chosen here: linear in the photoionisation rate of the exosphere beyond the obstacle"),
    ROW("wind_exponent", "", 1.0, 0.5, 0.0, 10.0, wind_exp,
        "b in (p_sw/p_ref)^b",
        "from memory: Mars ion escape rose a few-fold during solar-wind pressure pulses "
        "(Edberg et al. 2010)"),
    ROW("escape_energy_exponent", "", 1.0, 2.0, 0.0, 10.0, gravity_exp,
        "s in (v_ref/v_esc)^(2 s), a power of the escape-energy ratio",
        "[C] calibration: the Mars reference then gives Venus's O+ 2.7e24 s^-1 (Fedorov et "
        "al. 2011) within 20 %"),
    ROW("shielding_exponent", "", 1.0, 2.0, 0.0, 10.0, shield_exp,
        "k in the exposure (r_obs/r_mp)^k of an intrinsic magnetosphere",
        "chosen here (invented): no published calibration; k = 2 gives 1.2e-2 at Earth's 10 R_E"),
    PHOTON_ROW,
    H_CAP_ROW,
    DFRAC_ROW,
};

static const vl_flux_column columns[] = {
    {"pickup_o_kg_s", "oxygen lost as ions picked up by the stellar wind (with the O of CO2+ ions)"},
    {"pickup_h_kg_s", "hydrogen lost as ions picked up by the stellar wind (from water)"},
    {"pickup_c_kg_s", "carbon lost as CO2+ ions picked up by the stellar wind"},
    {"pickup_n_kg_s", "nitrogen lost as ions picked up by the stellar wind"},
};
/* Column of each element (EL_O, EL_H, EL_C, EL_N). */
static const int column_of[NEL] = {0, 1, 2, 3};

/* Demand, particles/s per element, before the hydrogen room. */
static void demand(const vl_nonthermal_params *p, const vl_view *v, double q[NEL])
{
    double k = vl_nonthermal_drive(p, v->planet, v->env) *
               vl_nonthermal_gravity_power(p, v->planet, v->env) *
               vl_nonthermal_exposure(p, v->planet, v->env);
    vl_nonthermal_demand(p, v, k, 1.0, q);
}

static double h_demand(const void *pv, const vl_view *v)
{
    double q[NEL];
    demand(pv, v, q);
    return vl_nonthermal_h_demand(pv, q);
}

static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    double q[NEL];
    demand(pv, v, q);
    vl_nonthermal_apply_capped(pv, v, q, column_of, fx);
}

const vl_process vl_process_ion_pickup = {
    .name = "ion_pickup",
    .summary = "ions picked up by the stellar wind, scaled from present Mars; shielded by a dipole",
    .refs = "Dong et al. 2015; Fedorov et al. 2011; Carlsson et al. 2006",
    VL_PROCESS_TABLES(table, vl_nonthermal_params, columns),
    VL_NONTHERMAL_FLUXES,
    .default_enabled = 1,
    .h_demand = h_demand,
    .rates = rates,
};
