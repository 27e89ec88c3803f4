/* photochemical_escape.c: hot atoms from dissociative recombination (O; C, N), scaled
 * from the present Mars with the Lillis et al. 2017 law and the share of recombination
 * atoms faster than escape (nonthermal.c); no magnetic shielding (the escaping atoms
 * are neutral). Hot carbon leaves its oxygen behind as O2. */
#include "nonthermal.h"
#include "volev/units.h"

static const vl_param table[] = {
    ROW("o_ref_per_s", "s^-1", 1.0, 4.3e25, 0.0, 1e35, ref[EL_O],
        "hot O escape at the reference planet and drivers",
        "Mars photochemical O 4.3e25 s^-1 (Lillis et al. 2017, MAVEN)"),
    ROW("c_ref_per_s", "s^-1", 1.0, 1e24, 0.0, 1e35, ref[EL_C],
        "hot C escape at the reference (its oxygen stays as O2)",
        "from memory, unverified: model estimates for present Mars of order 1e24 s^-1 "
        "(e.g. Fox & Bakalian 2001, JGR 106, photochemical escape of atomic carbon)"),
    ROW("n_ref_per_s", "s^-1", 1.0, 1e24, 0.0, 1e35, ref[EL_N],
        "hot N escape at the reference (from N2)",
        "from memory, unverified: photochemical N escape at present Mars of order 1e24 "
        "s^-1 (Fox 1993, JGR 98:3297; it sets Mars's 15N enrichment)"),
    MARS_RADIUS_ROW,
    MARS_XUV_ROW,
    MARS_WIND_ROW,
    MARS_VESC_ROW,
    ROW("xuv_exponent", "", 1.0, 2.6, 0.0, 10.0, xuv_exp, "a in (F_XUV/F_ref)^a",
        "Lillis et al. 2017: escape ~ CO2 photoionisation frequency^(2.6 +- 0.6)"),
    ROW("wind_exponent", "", 1.0, 0.0, 0.0, 10.0, wind_exp, "b in (p_sw/p_ref)^b",
        "chosen here: 0, recombination is driven by photoionisation, not by the wind"),
    ROW("energy_spread_ev", "eV", EV, 0.2, 0.01, 5.0, spread_j,
        "width of the logistic step that smooths each recombination channel's energy",
        "[C] lab-frame spread 2 sqrt(E kT_i) ~ 0.4 eV for T_i ~ 300 K (Mars's lower "
        "ionosphere, Viking: Hanson, Sanatani & Zuccaro 1977, JGR 82:4351, from memory)"),
    PHOTON_ROW,
};

static const vl_flux_column columns[] = {
    {"photochem_o_kg_s", "hot oxygen atoms from dissociative recombination escaping"},
    {"photochem_c_kg_s", "hot carbon atoms escaping (their oxygen stays as O2)"},
    {"photochem_n_kg_s", "hot nitrogen atoms escaping"},
};
/* Column of each element (EL_O, EL_H, EL_C, EL_N; -1: none). */
static const int column_of[NEL] = {0, -1, 1, 2};

static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const vl_nonthermal_params *p = pv;
    double q[NEL];
    double k = vl_nonthermal_drive(p, v->planet, v->env) *
               vl_nonthermal_dr_gravity(p, v->planet, v->env);
    vl_nonthermal_demand(p, v, k, 1.0, q);
    vl_nonthermal_apply(q, column_of, 1, 1.0, fx);
}

const vl_process vl_process_photochemical_escape = {
    .name = "photochemical_escape",
    .summary = "hot atoms from dissociative recombination, scaled from present Mars",
    .refs = "Lillis et al. 2017; Kella et al. 1997",
    VL_PROCESS_TABLES(table, vl_nonthermal_params, columns),
    VL_NONTHERMAL_FLUXES,
    .default_enabled = 1,
    .rates = rates,
};
