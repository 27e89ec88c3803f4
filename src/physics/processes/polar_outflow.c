/* polar_outflow.c: ions leaving along the open field lines of a dipole (O+, H+),
 * scaled from the present Earth by the open-cap area (nonthermal.c). Its hydrogen
 * counts against the room the diffusion limit leaves above thermal escape (declared as
 * h_demand; the escape stage returns the share that fits). */
#include "nonthermal.h"
#include "volev/units.h"

static const vl_param table[] = {
    ROW("o_ref_per_s", "s^-1", 1.0, 1e25, 0.0, 1e35, ref[EL_O],
        "net O+ loss by polar outflow at the reference planet and drivers",
        "Earth: O+ outflow up to ~1e26 s^-1 in disturbed times, net loss ~10 times smaller "
        "(Seki et al. 2001): an upper value for the mean"),
    ROW("h_ref_per_s", "s^-1", 1.0, 2.6e25, 0.0, 1e35, ref[EL_H],
        "H+ loss by polar outflow (polar wind) at the reference",
        "[C] polar wind ~1e8 H+ cm^-2 s^-1 (Schunk & Nagy 2009, Ionospheres, 2nd ed., "
        "Cambridge Univ. Press, from memory) over Earth's open caps 2.6e17 cm^2"),
    ROW("reference_radius_km", "km", 1e3, 6371.0, 100.0, 1e5, radius_m,
        "radius of the reference planet", "Earth mean radius, NASA NSSDC"),
    ROW("reference_xuv_erg_cm2_s", "erg cm^-2 s^-1", 1e-3, 4.6, 1e-6, 1e8, xuv_w_m2,
        "XUV flux (1-1200 A) at the reference planet",
        "present Sun at 1 au (Ribas et al. 2005) [C]"),
    ROW("reference_wind_npa", "nPa", 1e-9, 1.792, 1e-6, 1e10, wind_pa,
        "stellar wind ram pressure at the reference planet",
        "[C] 2e-14 M_sun/yr at 400 km/s (the star.wind defaults: Wood 2004; Kivelson & "
        "Russell 1995, from memory) at 1 au"),
    ROW("reference_magnetopause_rp", "R_planet", 1.0, 10.0, 1.0, 1e3, mp_ref_rp,
        "magnetopause stand-off of the reference planet (sets its open-cap area)",
        "Earth ~10 R_E (textbook 10-11 R_E: Kivelson & Russell 1995, Introduction to Space "
        "Physics, Cambridge Univ. Press), from memory"),
    ROW("xuv_exponent", "", 1.0, 1.0, 0.0, 10.0, xuv_exp, "a in (F_XUV/F_ref)^a",
        "from memory: O+ outflow rises several-fold over the solar cycle while the EUV "
        "changes two- to three-fold (Yau et al. 1985); 1 is the low end"),
    ROW("wind_exponent", "", 1.0, 0.0, 0.0, 10.0, wind_exp, "b in (p_sw/p_ref)^b",
        "chosen here: 0, the wind acts through the open-cap area (~p^(1/6) for a distant magnetopause); "
        "b = 1 gives of order 1e5 kg/s of O around young M dwarfs (docs/escape.md)"),
    PHOTON_ROW,
    H_CAP_ROW,
    DFRAC_ROW,
};

static const vl_flux_column columns[] = {
    {"polar_o_kg_s", "oxygen ions lost along open polar field lines"},
    {"polar_h_kg_s", "hydrogen ions lost along open polar field lines (from water)"},
};
/* Column of each element (EL_O, EL_H, EL_C, EL_N; -1: none). */
static const int column_of[NEL] = {0, 1, -1, -1};

/* Demand, particles/s per element, before the hydrogen room. */
static void demand(const vl_nonthermal_params *p, const vl_view *v, double q[NEL])
{
    double k = vl_nonthermal_drive(p, v->planet, v->env) *
               vl_nonthermal_polar_factor(p, v->planet, v->env);
    vl_nonthermal_demand(p, v, k, v->env->upper.cap_fraction, q);
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

/* The reference magnetopause must stand above the induced obstacle, or the polar
 * factor's normalisation is not positive. */
static int check(const void *pv, const vl_scenario *sc, vl_status *st)
{
    const vl_nonthermal_params *p = pv;
    if (p->mp_ref_rp > sc->planet.obstacle_rp)
        return VL_OK;
    return vl_fail(st, VL_ERR_INPUT, sc->path, 0,
                   "processes.polar_outflow.reference_magnetopause_rp (%g) must exceed "
                   "planet.induced_obstacle_rp (%g)",
                   p->mp_ref_rp, sc->planet.obstacle_rp);
}

const vl_process vl_process_polar_outflow = {
    .name = "polar_outflow",
    .summary = "ion outflow along the open field lines of a dipole, scaled from present Earth",
    .refs = "Seki et al. 2001",
    VL_PROCESS_TABLES(table, vl_nonthermal_params, columns),
    VL_NONTHERMAL_FLUXES,
    .default_enabled = 1,
    .check = check,
    .h_demand = h_demand,
    .rates = rates,
};
