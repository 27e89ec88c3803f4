/* nonthermal.c: non-thermal escape, four processes sharing one scaling law
 * (docs/escape.md; science.md section 7):
 *   ion_pickup            ions picked up by the stellar wind (O+, H+, CO2+, N+)
 *   sputtering            neutrals knocked out by re-impacting pickup ions (O, CO2, N)
 *   photochemical_escape  hot atoms from dissociative recombination (O; C, N)
 *   polar_outflow         ions leaving along the open field lines of a dipole (O+, H+)
 *
 * Each element's rate, particles/s, is a present-day rate Q_ref measured at a reference
 * planet, scaled per unit surface and by the drivers:
 *   Q = Q_ref (A / A_ref) (F_XUV / F_ref)^a (p_sw / p_ref)^b  G  S  (1 - w_hydro)
 * G: gravity at the exobase against the reference's. Pickup and sputtering:
 *   (v_ref / v_esc)^(2 s) (a power of the escape-energy ratio); photochemical escape:
 *   the share of dissociative-recombination O atoms faster than escape, against the
 *   reference's. S: the magnetic field. Pickup and sputtering: exposure (r_obs / r_mp)^k,
 *   1 for an unmagnetised planet (r_mp is then the induced obstacle r_obs, upper.c).
 *   Polar outflow: the open-cap area against the reference's, times (1 - r_obs/r_mp)
 *   normalised the same way, which takes it continuously to 0 where the magnetopause
 *   comes down to the induced obstacle.
 * w_hydro: the bulk hydrodynamic weight (hydrogen_escape.c): hydrogen's, in proportion to
 *   its share of the upper atmosphere, combined with atomic oxygen's own: once the upper
 *   atmosphere as a whole flows out as a fluid, these exospheric channels fade out.
 * Two guards keep extrapolations physical; both are smooth minima that leave the
 * reference rates unchanged to 1e-10: at most one escaping particle per absorbed
 * ionising photon, and non-thermal hydrogen within the room the diffusion limit leaves
 * above the thermal escape (hydrogen_escape.c), shared by pickup and polar outflow.
 *
 * Sources: O from atmospheric O2; H from water, 2 H2O -> 4 H(space) + O2; N from N2;
 * C from CO2, as a whole ion or molecule (pickup, sputtering: CO2 -> C + 2 O, both to
 * space) or as a hot C atom whose oxygen stays (photochemical: CO2 -> C(space) + O2).
 * Each column is the mass flux of one element through one channel (kg/s), the oxygen
 * carried off with carbon included in the channel's O column. */
#include <math.h>
#include <stddef.h>

#include "registry.h"
#include "volev/model.h"
#include "volev/units.h"

enum { EL_O, EL_H, EL_C, EL_N, NEL };

/* One parameter block for the four processes; each table sets the fields it uses. */
typedef struct {
    double ref[NEL];     /* Q_ref of O, H, C, N at the reference planet, particles/s */
    double radius_m;     /* reference planet radius (A_ref = 4 pi R^2) */
    double xuv_w_m2;     /* F_ref: XUV flux at the reference planet */
    double wind_pa;      /* p_ref: stellar wind ram pressure at the reference planet */
    double xuv_exp;      /* a */
    double wind_exp;     /* b */
    double v_esc_ref;    /* escape speed at the reference's exobase, m/s (not polar) */
    double gravity_exp;  /* s in (v_ref/v_esc)^(2 s) (pickup, sputtering) */
    double shield_exp;   /* k in (r_obs/r_mp)^k (pickup, sputtering) */
    double spread_j;     /* energy spread of recombination atoms, J (photochemical) */
    double mp_ref_rp;    /* reference magnetopause stand-off, planet radii (polar) */
    double photon_j;     /* mean energy of an ionising photon, J */
    int h_capped;        /* hydrogen within the diffusion room (pickup, polar) */
    double f_d;          /* deuterium fractionation factor of the escaping H (pickup, polar) */
} params;

#define EV 1.602176634e-19 /* J, exact (SI 2019) */
#define ROW(k, unit, si, d, lo, hi, f, doc, ref) \
    VL_PARAM_ROW(params, VL_PT_REAL, k, unit, si, d, lo, hi, f, doc, ref, NULL)
#define H_CAP_ROW                                                                        \
    {"h_within_diffusion_limit", VL_PT_BOOL, "", 1.0, 1.0, 0.0, 1.0, NULL, NULL,         \
     offsetof(params, h_capped),                                                         \
     "non-thermal H shares the room the diffusion limit leaves above thermal escape "    \
     "(with hydrogen_escape on)",                                                        \
     "common practice: all escaping H crosses the homopause (Hunten 1973)", NULL, 0}
#define DFRAC_ROW                                                                        \
    ROW("deuterium_fractionation", "", 1.0, 0.15, 0.0, 1.0, f_d,                         \
        "f: escaping D/H over the D/H of the water it comes from (1: no fractionation)", \
        "from memory: f ~ 0.1-0.2 for Venus's non-thermal H escape (charge exchange, "   \
        "ion pickup; Gurwell & Yung 1993, Planet. Space Sci. 41:91; Donahue & Hartle "   \
        "1992)")
#define PHOTON_ROW                                                                       \
    ROW("photon_energy_ev", "eV", EV, 20.0, 1.0, 1000.0, photon_j,                      \
        "mean energy of an ionising XUV photon: at most one escaping particle per "     \
        "absorbed photon",                                                               \
        "from memory (photon-number mean of the solar EUV, order 20 eV); a guard, "     \
        "inactive at the reference")

/* Mars as the reference planet (pickup, sputtering, photochemical escape). */
#define MARS_RADIUS_ROW                                                                  \
    ROW("reference_radius_km", "km", 1e3, 3389.5, 100.0, 1e5, radius_m,                  \
        "radius of the reference planet (rates scale with surface area)",               \
        "Mars mean radius, NASA NSSDC fact sheet (science.md section 9)")
#define MARS_XUV_ROW                                                                     \
    ROW("reference_xuv_erg_cm2_s", "erg cm^-2 s^-1", 1e-3, 1.9806, 1e-6, 1e8, xuv_w_m2,  \
        "XUV flux (1-1200 A) at the reference planet",                                   \
        "[C] present Sun 4.6 erg cm^-2 s^-1 at 1 au (Ribas et al. 2005) / 1.524^2")
#define MARS_WIND_ROW                                                                    \
    ROW("reference_wind_npa", "nPa", 1e-9, 0.7717, 1e-6, 1e10, wind_pa,                  \
        "stellar wind ram pressure at the reference planet",                             \
        "[C] present solar wind 2e-14 M_sun/yr at 400 km/s (star.wind defaults, from "   \
        "memory): 1.792 nPa at 1 au / 1.524^2")
#define MARS_VESC_ROW                                                                    \
    ROW("reference_escape_speed_km_s", "km/s", 1e3, 4.885, 0.1, 100.0, v_esc_ref,        \
        "escape speed at the reference planet's exobase",                               \
        "[C] sqrt(2 G M/r) for Mars (6.417e23 kg) at 200 km (exobase altitude, from "    \
        "memory)")

static const char *const pickup_cols[] = {"pickup_o_kg_s", "pickup_h_kg_s", "pickup_c_kg_s",
                                          "pickup_n_kg_s"};
static const char *const sputter_cols[] = {"sputter_o_kg_s", "sputter_c_kg_s",
                                           "sputter_n_kg_s"};
static const char *const photochem_cols[] = {"photochem_o_kg_s", "photochem_c_kg_s",
                                             "photochem_n_kg_s"};
static const char *const polar_cols[] = {"polar_o_kg_s", "polar_h_kg_s"};

/* Column of each element in each process (-1: the channel has none). */
static const int pickup_map[NEL] = {0, 1, 2, 3};
static const int sputter_map[NEL] = {0, -1, 1, 2};
static const int photochem_map[NEL] = {0, -1, 1, 2};
static const int polar_map[NEL] = {0, 1, -1, -1};

static const vl_param pickup_table[] = {
    ROW("o_ref_per_s", "s^-1", 1.0, 2e24, 0.0, 1e35, ref[EL_O],
        "O+ escape at the reference planet and drivers",
        "Mars O+ ion escape ~2e24 s^-1 (Dong et al. 2015, MAVEN; science.md section 7)"),
    ROW("h_ref_per_s", "s^-1", 1.0, 5.26e24, 0.0, 1e35, ref[EL_H],
        "H+ escape at the reference planet and drivers",
        "[C] 2e24 x (7.1e24 / 2.7e24): the H+/O+ ratio at Venus (Fedorov et al. 2011)"),
    ROW("c_ref_per_s", "s^-1", 1.0, 4e23, 0.0, 1e35, ref[EL_C],
        "CO2+ escape at the reference (each takes one C and two O to space)",
        "[C] 0.2 x 2e24: CO2+/O+ escape ratio ~0.2 at Mars (Carlsson et al. 2006, Mars "
        "Express), from memory"),
    ROW("n_ref_per_s", "s^-1", 1.0, 0.0, 0.0, 1e35, ref[EL_N],
        "N+ escape at the reference (from N2)",
        "0: no verified present-day N+ escape rate at hand; set it to study N loss"),
    MARS_RADIUS_ROW,
    MARS_XUV_ROW,
    MARS_WIND_ROW,
    MARS_VESC_ROW,
    ROW("xuv_exponent", "", 1.0, 1.0, 0.0, 10.0, xuv_exp,
        "a in (F_XUV/F_ref)^a",
        "[C] linear in the photoionisation rate of the exosphere beyond the obstacle"),
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
        "invented: no published calibration; k = 2 gives 1.2e-2 at Earth's 10 R_E"),
    PHOTON_ROW,
    H_CAP_ROW,
    DFRAC_ROW,
};

static const vl_param sputter_table[] = {
    ROW("o_ref_per_s", "s^-1", 1.0, 2e23, 0.0, 1e35, ref[EL_O],
        "sputtered O escape at the reference planet and drivers",
        "[C] 0.1 x Mars O+ pickup 2e24 s^-1: sputtering about a tenth of pickup today "
        "(Luhmann, Johnson & Zhang 1992), from memory"),
    ROW("c_ref_per_s", "s^-1", 1.0, 0.0, 0.0, 1e35, ref[EL_C],
        "sputtered CO2 escape at the reference (one C and two O each)",
        "0: no verified present-day rate at hand; set it to study C loss"),
    ROW("n_ref_per_s", "s^-1", 1.0, 0.0, 0.0, 1e35, ref[EL_N],
        "sputtered N escape at the reference (from N2)",
        "0: no verified present-day rate at hand; set it to study N loss"),
    MARS_RADIUS_ROW,
    MARS_XUV_ROW,
    MARS_WIND_ROW,
    MARS_VESC_ROW,
    ROW("xuv_exponent", "", 1.0, 1.0, 0.0, 10.0, xuv_exp, "a in (F_XUV/F_ref)^a",
        "as ion_pickup: the re-impacting ions are pickup ions (conservative: sputtering "
        "grew faster than pickup into the past in Luhmann et al. 1992, from memory)"),
    ROW("wind_exponent", "", 1.0, 0.5, 0.0, 10.0, wind_exp, "b in (p_sw/p_ref)^b",
        "as ion_pickup"),
    ROW("escape_energy_exponent", "", 1.0, 3.0, 0.0, 10.0, gravity_exp,
        "s in (v_ref/v_esc)^(2 s)",
        "[C] 2 (ion_pickup, the incoming ions) + 1 (escaping share of a sputtered E^-2 "
        "energy tail ~ 1/E_esc, Johnson 1994, from memory)"),
    ROW("shielding_exponent", "", 1.0, 2.0, 0.0, 10.0, shield_exp,
        "k in the exposure (r_obs/r_mp)^k", "as ion_pickup (invented)"),
    PHOTON_ROW,
};

static const vl_param photochem_table[] = {
    ROW("o_ref_per_s", "s^-1", 1.0, 4.3e25, 0.0, 1e35, ref[EL_O],
        "hot O escape at the reference planet and drivers",
        "Mars photochemical O 4.3e25 s^-1 (Lillis et al. 2017, MAVEN; science.md section 7)"),
    ROW("c_ref_per_s", "s^-1", 1.0, 1e24, 0.0, 1e35, ref[EL_C],
        "hot C escape at the reference (its oxygen stays as O2)",
        "from memory, unverified: model estimates for present Mars of order 1e24 s^-1"),
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
        "0: recombination is driven by photoionisation, not by the wind"),
    ROW("energy_spread_ev", "eV", EV, 0.2, 0.01, 5.0, spread_j,
        "width of the logistic step that smooths each recombination channel's energy",
        "[C] lab-frame spread 2 sqrt(E kT_i) ~ 0.4 eV for T_i ~ 300 K (ion temperature, "
        "from memory)"),
    PHOTON_ROW,
};

static const vl_param polar_table[] = {
    ROW("o_ref_per_s", "s^-1", 1.0, 1e25, 0.0, 1e35, ref[EL_O],
        "net O+ loss by polar outflow at the reference planet and drivers",
        "Earth: O+ outflow up to ~1e26 s^-1 in disturbed times, net loss ~10 times smaller "
        "(Seki et al. 2001, science.md section 7): an upper value for the mean"),
    ROW("h_ref_per_s", "s^-1", 1.0, 2.6e25, 0.0, 1e35, ref[EL_H],
        "H+ loss by polar outflow (polar wind) at the reference",
        "[C] polar wind ~1e8 H+ cm^-2 s^-1 (from memory) over Earth's open caps 2.6e17 cm^2"),
    ROW("reference_radius_km", "km", 1e3, 6371.0, 100.0, 1e5, radius_m,
        "radius of the reference planet", "Earth mean radius, NASA NSSDC"),
    ROW("reference_xuv_erg_cm2_s", "erg cm^-2 s^-1", 1e-3, 4.6, 1e-6, 1e8, xuv_w_m2,
        "XUV flux (1-1200 A) at the reference planet",
        "present Sun at 1 au (Ribas et al. 2005) [C]"),
    ROW("reference_wind_npa", "nPa", 1e-9, 1.792, 1e-6, 1e10, wind_pa,
        "stellar wind ram pressure at the reference planet",
        "[C] 2e-14 M_sun/yr at 400 km/s (star.wind defaults, from memory) at 1 au"),
    ROW("reference_magnetopause_rp", "R_planet", 1.0, 10.0, 1.0, 1e3, mp_ref_rp,
        "magnetopause stand-off of the reference planet (sets its open-cap area)",
        "Earth ~10 R_E (textbook 10-11)"),
    ROW("xuv_exponent", "", 1.0, 1.0, 0.0, 10.0, xuv_exp, "a in (F_XUV/F_ref)^a",
        "from memory: O+ outflow rises several-fold over the solar cycle while the EUV "
        "changes two- to three-fold (Yau et al. 1985); 1 is the low end"),
    ROW("wind_exponent", "", 1.0, 0.0, 0.0, 10.0, wind_exp, "b in (p_sw/p_ref)^b",
        "0: the wind acts through the open-cap area (~p^(1/6) for a distant magnetopause); "
        "b = 1 gives of order 1e5 kg/s of O around young M dwarfs (docs/escape.md)"),
    PHOTON_ROW,
    H_CAP_ROW,
    DFRAC_ROW,
};

static const vl_reaction water_to_h = {
    "2 H2O -> 4 H(space) + O2", 3, {VL_R_WATER, VL_R_SPACE_H, VL_R_O2}, {-2.0, 4.0, 1.0}};
static const vl_reaction co2_to_space = {
    "CO2 -> C(space) + 2 O(space)", 3, {VL_R_CO2, VL_R_SPACE_C, VL_R_SPACE_O}, {-1.0, 1.0, 2.0}};
static const vl_reaction co2_keep_o = {
    "CO2 -> C(space) + O2", 3, {VL_R_CO2, VL_R_SPACE_C, VL_R_O2}, {-1.0, 1.0, 1.0}};

/* Dissociative recombination O2+ + e -> O + O from the vibrational ground state: the
 * energy each O atom gets (half the channel's release) and the branching ratio
 * (Kella et al. 1997, from memory). */
static const double dr_energy_ev[4] = {3.495, 2.51, 1.53, 0.415};
static const double dr_branch[4] = {0.22, 0.42, 0.31, 0.05};

/* Smooth minimum of a, b >= 0: min (1 + (min/max)^4)^(-1/4); within 1e-10 of the
 * smaller when it is below 2.5e-3 of the larger; 0 if either is 0 (common practice). */
static double softmin(double a, double b)
{
    if (!(a > 0.0) || !(b > 0.0))
        return 0.0;
    double lo = fmin(a, b), hi = fmax(a, b), r = lo / hi;
    return lo / sqrt(sqrt(1.0 + r * r * r * r));
}

/* Surface, XUV and wind factor (A/A_ref)(F/F_ref)^a (p/p_ref)^b (science.md section 7),
 * faded out with the bulk hydrodynamic weight (hydrogen_escape.c): once the upper
 * atmosphere as a whole flows out as a fluid the exospheric channels are part of that
 * flow. A thin hydrodynamic hydrogen trace in a heavy thermosphere does not count. */
static double drive(const params *p, const vl_model *m, const vl_env *env)
{
    double area_ref = 4.0 * VL_PI * p->radius_m * p->radius_m;
    return (1.0 - env->esc_bulk_hydro) * m->area_m2 / area_ref *
           pow(env->f_xuv / p->xuv_w_m2, p->xuv_exp) *
           pow(env->wind_pressure_pa / p->wind_pa, p->wind_exp);
}

/* Escape speed squared at the exobase, 2 G M / r_exo, m^2/s^2. */
static double v_esc2(const vl_model *m, const vl_env *env)
{
    return 2.0 * VL_G_NEWTON * m->sc->planet.mass_kg / env->r_exo_m;
}

/* (v_ref/v_esc)^(2 s): a power of the escape-energy ratio (any particle mass). */
static double gravity_power(const params *p, const vl_model *m, const vl_env *env)
{
    return pow(p->v_esc_ref * p->v_esc_ref / v_esc2(m, env), p->gravity_exp);
}

/* Share of recombination O atoms with more than the escape energy e_j: each channel
 * smoothed by a logistic step of width spread_j (Kella et al. 1997 channels). */
static double dr_fast_share(double e_j, double spread_j)
{
    double s = 0.0;
    for (int i = 0; i < 4; i++)
        s += dr_branch[i] / (1.0 + exp((e_j - dr_energy_ev[i] * EV) / spread_j));
    return s;
}

/* Photochemical gravity factor: fast share at this exobase over the reference's. */
static double dr_gravity(const params *p, const vl_model *m, const vl_env *env)
{
    double m_o = vl_species_molar_mass(VL_SP_O) / VL_AVOGADRO;
    double e = 0.5 * m_o * v_esc2(m, env), e_ref = 0.5 * m_o * p->v_esc_ref * p->v_esc_ref;
    return dr_fast_share(e, p->spread_j) / dr_fast_share(e_ref, p->spread_j);
}

/* Exposure of the exosphere to the wind, (r_obs/r_mp)^k: 1 without a dipole (upper.c
 * sets r_mp to the induced obstacle r_obs then). */
static double exposure(const params *p, const vl_model *m, const vl_env *env)
{
    return pow(m->sc->planet.obstacle_rp / env->r_mp_rp, p->shield_exp);
}

/* Open-cap share of a dipole with stand-off r (planet radii): 1 - sqrt(1 - 1/r)
 * (dipole field lines, as upper.c). */
static double cap_share(double r) { return 1.0 - sqrt(1.0 - 1.0 / r); }

/* Polar factor: the open-cap area (upper.c: dipole mapping tapered by 1 - r_obs/r_mp,
 * continuous where the magnetopause meets the induced obstacle), over the reference's. */
static double polar_factor(const params *p, const vl_model *m, const vl_env *env)
{
    double r_obs = m->sc->planet.obstacle_rp;
    double ref = cap_share(p->mp_ref_rp) * (1.0 - r_obs / p->mp_ref_rp);
    return env->cap_fraction / ref;
}

/* Scale q (particles/s) so that their sum stays within the ionising photons absorbed
 * over a share of the disc: F pi R^2 share / E_photon (a guard, smooth minimum). */
static void photon_guard(const params *p, const vl_model *m, const vl_env *env, double share,
                         double q[NEL])
{
    double r = m->sc->planet.radius_m;
    double budget = env->f_xuv * VL_PI * r * r * share / p->photon_j;
    double total = q[EL_O] + q[EL_H] + q[EL_C] + q[EL_N];
    double f = total > 0.0 ? softmin(total, budget) / total : 0.0;
    for (int el = 0; el < NEL; el++)
        q[el] *= f;
}

/* Pickup demand, particles/s per element, before the hydrogen room. */
static void pickup_demand(const params *p, const vl_model *m, const vl_env *env, double q[NEL])
{
    double k = drive(p, m, env) * gravity_power(p, m, env) * exposure(p, m, env);
    for (int el = 0; el < NEL; el++)
        q[el] = p->ref[el] * k;
    photon_guard(p, m, env, 1.0, q);
}

/* Polar-outflow demand, particles/s per element, before the hydrogen room. */
static void polar_demand(const params *p, const vl_model *m, const vl_env *env, double q[NEL])
{
    double k = drive(p, m, env) * polar_factor(p, m, env);
    for (int el = 0; el < NEL; el++)
        q[el] = p->ref[el] * k;
    photon_guard(p, m, env, env->cap_fraction, q);
}

/* Capped H demand of process i (registry.h), particles/s (0 if off or uncapped). */
static double capped_h(const vl_model *m, const vl_env *env, int i,
                       void (*demand)(const params *, const vl_model *, const vl_env *, double *))
{
    if (!m->sc->proc[i].enabled)
        return 0.0;
    const params *p = m->sc->proc[i].params;
    if (!p->h_capped)
        return 0.0;
    double q[NEL];
    demand(p, m, env, q);
    return q[EL_H];
}

/* Factor on the capped non-thermal H so that pickup and polar outflow together stay
 * within (diffusion limit - thermal escape) x area, the hydrogen that reaches the
 * homopause but does not leave thermally (Hunten 1973; hydrogen_escape.c). 1 when
 * hydrogen_escape is off (no budget) or the diffusion limit is unbounded. */
static double h_room_factor(const vl_model *m, const vl_env *env)
{
    if (!m->sc->proc[VL_PROC_hydrogen_escape].enabled || !isfinite(env->esc_h_diffusion))
        return 1.0;
    double room = fmax(env->esc_h_diffusion - env->esc_h_flux, 0.0) * m->area_m2;
    double total = capped_h(m, env, VL_PROC_ion_pickup, pickup_demand) +
                   capped_h(m, env, VL_PROC_polar_outflow, polar_demand);
    return total > 0.0 ? softmin(total, room) / total : 0.0;
}

/* Column col of the current process += kg_s (when columns are recorded). */
static void add_column(vl_flux *fx, int col, double kg_s)
{
    if (fx->columns && col >= 0)
        fx->columns[fx->col_base + (size_t)col] += kg_s;
}

/* Remove q particles/s of each element through the flux API; map gives each element's
 * column. Carbon leaves as CO2 -> C + 2 O (whole) or CO2 -> C + O2 (keep_o). Hydrogen
 * carries deuterium at f_d times the water's D/H (issue: non-thermal fractionation is a
 * parameter of each H-removing channel). */
static void apply(const double q[NEL], const int map[NEL], int keep_o, double f_d, vl_flux *fx)
{
    double mm_o = vl_species_molar_mass(VL_SP_O), mm_h = vl_species_molar_mass(VL_SP_H);
    double mm_c = vl_species_molar_mass(VL_SP_C), mm_n = vl_species_molar_mass(VL_SP_N);
    if (map[EL_O] >= 0 && q[EL_O] > 0.0)
        vl_flux_move(fx, VL_R_O2, VL_R_SPACE_O, q[EL_O] / VL_AVOGADRO * mm_o, map[EL_O]);
    if (map[EL_N] >= 0 && q[EL_N] > 0.0)
        vl_flux_move(fx, VL_R_N2, VL_R_SPACE_N, q[EL_N] / VL_AVOGADRO * mm_n, map[EL_N]);
    if (map[EL_H] >= 0 && q[EL_H] > 0.0) {
        double e = vl_flux_react_f(fx, &water_to_h, q[EL_H] / (4.0 * VL_AVOGADRO), -1, f_d);
        add_column(fx, map[EL_H], 4.0 * e * mm_h);
    }
    if (map[EL_C] >= 0 && q[EL_C] > 0.0) {
        double e = vl_flux_react(fx, keep_o ? &co2_keep_o : &co2_to_space,
                                 q[EL_C] / VL_AVOGADRO, -1);
        add_column(fx, map[EL_C], e * mm_c);
        if (!keep_o)
            add_column(fx, map[EL_O], 2.0 * e * mm_o);
    }
}

/* Prepare hook of ion_pickup and polar_outflow: the shared H room factor, once per
 * evaluation (both processes' rates need it). */
static void room_prepare(const void *pv, const vl_model *m, const double *y, vl_env *env)
{
    (void)pv;
    (void)y;
    if (!env->nt_h_factor_set) {
        env->nt_h_factor = h_room_factor(m, env);
        env->nt_h_factor_set = 1;
    }
}

static void pickup_rates(const void *pv, const vl_model *m, const double *y, const vl_env *env,
                         vl_flux *fx)
{
    const params *p = pv;
    (void)y;
    double q[NEL];
    pickup_demand(p, m, env, q);
    if (p->h_capped)
        q[EL_H] *= env->nt_h_factor;
    apply(q, pickup_map, 0, p->f_d, fx);
}

/* Sputtering by re-impacting pickup ions: the pickup law with its own rates and a
 * steeper gravity factor (Luhmann, Johnson & Zhang 1992; Johnson 1994). */
static void sputter_rates(const void *pv, const vl_model *m, const double *y, const vl_env *env,
                          vl_flux *fx)
{
    const params *p = pv;
    (void)y;
    double q[NEL];
    double k = drive(p, m, env) * gravity_power(p, m, env) * exposure(p, m, env);
    for (int el = 0; el < NEL; el++)
        q[el] = p->ref[el] * k;
    photon_guard(p, m, env, 1.0, q);
    apply(q, sputter_map, 0, 1.0, fx);
}

/* Photochemical escape: Lillis et al. 2017 scaling times the recombination gravity
 * factor; no magnetic shielding (the escaping atoms are neutral). */
static void photochem_rates(const void *pv, const vl_model *m, const double *y,
                            const vl_env *env, vl_flux *fx)
{
    const params *p = pv;
    (void)y;
    double q[NEL];
    double k = drive(p, m, env) * dr_gravity(p, m, env);
    for (int el = 0; el < NEL; el++)
        q[el] = p->ref[el] * k;
    photon_guard(p, m, env, 1.0, q);
    apply(q, photochem_map, 1, 1.0, fx);
}

static void polar_rates(const void *pv, const vl_model *m, const double *y, const vl_env *env,
                        vl_flux *fx)
{
    const params *p = pv;
    (void)y;
    double q[NEL];
    polar_demand(p, m, env, q);
    if (p->h_capped)
        q[EL_H] *= env->nt_h_factor;
    apply(q, polar_map, 0, p->f_d, fx);
}

/* The reference magnetopause must stand above the induced obstacle, or the polar
 * factor's normalisation is not positive. */
static int polar_check(const void *pv, const vl_scenario *sc, vl_status *st)
{
    const params *p = pv;
    if (p->mp_ref_rp > sc->planet.obstacle_rp)
        return VL_OK;
    return vl_fail(st, VL_ERR_INPUT, sc->path, 0,
                   "processes.polar_outflow.reference_magnetopause_rp (%g) must exceed "
                   "planet.induced_obstacle_rp (%g)",
                   p->mp_ref_rp, sc->planet.obstacle_rp);
}

const vl_process vl_process_ion_pickup = {
    .name = "ion_pickup",
    .summary = "ions picked up by the stellar wind, scaled from present Mars; shielded by a dipole",
    .refs = "Dong et al. 2015; Fedorov et al. 2011; Carlsson et al. 2006",
    VL_PROCESS_TABLES(pickup_table, params, pickup_cols),
    .default_enabled = 1,
    .prepare = room_prepare,
    .rates = pickup_rates,
};

const vl_process vl_process_sputtering = {
    .name = "sputtering",
    .summary = "atmospheric sputtering by re-impacting pickup ions, a fraction of Mars's pickup",
    .refs = "Luhmann, Johnson & Zhang 1992; Johnson 1994",
    VL_PROCESS_TABLES(sputter_table, params, sputter_cols),
    .default_enabled = 1,
    .rates = sputter_rates,
};

const vl_process vl_process_photochemical_escape = {
    .name = "photochemical_escape",
    .summary = "hot atoms from dissociative recombination, scaled from present Mars",
    .refs = "Lillis et al. 2017; Kella et al. 1997",
    VL_PROCESS_TABLES(photochem_table, params, photochem_cols),
    .default_enabled = 1,
    .rates = photochem_rates,
};

const vl_process vl_process_polar_outflow = {
    .name = "polar_outflow",
    .summary = "ion outflow along the open field lines of a dipole, scaled from present Earth",
    .refs = "Seki et al. 2001",
    VL_PROCESS_TABLES(polar_table, params, polar_cols),
    .default_enabled = 1,
    .check = polar_check,
    .prepare = room_prepare,
    .rates = polar_rates,
};
