/* nonthermal.h: what the four non-thermal escape processes share (ion_pickup.c,
 * sputtering.c, photochemical_escape.c, polar_outflow.c; the scaling law in
 * nonthermal.c): one parameter block, the rows common to their tables, the drivers and
 * the one way they all remove atoms. Private to src/physics/processes. */
#ifndef VOLEV_PROCESSES_NONTHERMAL_H
#define VOLEV_PROCESSES_NONTHERMAL_H

#include <stddef.h>

#include "volev/process.h"

enum { EL_O, EL_H, EL_C, EL_N, NEL };

/* One parameter block for the four processes; each table sets the fields it uses. */
typedef struct vl_nonthermal_params {
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
} vl_nonthermal_params;

#define EV 1.602176634e-19 /* J, exact (SI 2019) */
#define EV 1.602176634e-19 /* J, exact (SI 2019) */
#define ROW(k, unit, si, d, lo, hi, f, doc, ref) \
    VL_PARAM_ROW(vl_nonthermal_params, VL_PT_REAL, k, unit, si, d, lo, hi, f, doc, ref, NULL)
#define H_CAP_ROW                                                                        \
    {"h_within_diffusion_limit", VL_PT_BOOL, "", 1.0, 1.0, 0.0, 1.0, NULL, NULL,         \
     offsetof(vl_nonthermal_params, h_capped),                                                         \
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
        "order of magnitude, chosen here: the photon-number mean of the solar EUV is of "\
        "order 20 eV (from memory); a guard, inactive at the reference")

/* Mars as the reference planet (pickup, sputtering, photochemical escape). */
#define MARS_RADIUS_ROW                                                                  \
    ROW("reference_radius_km", "km", 1e3, 3389.5, 100.0, 1e5, radius_m,                  \
        "radius of the reference planet (rates scale with surface area)",               \
        "Mars mean radius 3389.5 km (IAU WGCCRE, Archinal et al. 2011, Celest. Mech. "  \
        "Dyn. Astron. 109:101; NASA NSSDC Mars fact sheet), from memory")
#define MARS_XUV_ROW                                                                     \
    ROW("reference_xuv_erg_cm2_s", "erg cm^-2 s^-1", 1e-3, 1.9806, 1e-6, 1e8, xuv_w_m2,  \
        "XUV flux (1-1200 A) at the reference planet",                                   \
        "[C] present Sun 4.6 erg cm^-2 s^-1 at 1 au (Ribas et al. 2005) / 1.524^2")
#define MARS_WIND_ROW                                                                    \
    ROW("reference_wind_npa", "nPa", 1e-9, 0.7717, 1e-6, 1e10, wind_pa,                  \
        "stellar wind ram pressure at the reference planet",                             \
        "[C] present solar wind 2e-14 M_sun/yr at 400 km/s (the star.wind defaults: "    \
        "Wood 2004; Kivelson & Russell 1995, from memory): 1.792 nPa at 1 au / "       \
        "1.524^2")
#define MARS_VESC_ROW                                                                    \
    ROW("reference_escape_speed_km_s", "km/s", 1e3, 4.885, 0.1, 100.0, v_esc_ref,        \
        "escape speed at the reference planet's exobase",                               \
        "[C] sqrt(2 G M/r) for Mars (6.417e23 kg, NASA NSSDC Mars fact sheet) at 200 "  \
        "km, Mars's exobase altitude as commonly taken (common practice)")


/* The transfers and reactions every non-thermal process declares (vl_nonthermal_apply
 * uses them): O from O2, N from N2, H from water (2 H2O -> 4 H(space) + O2), and C from
 * CO2, as a whole ion or molecule (CO2 -> C(space) + 2 O(space)) or as a hot C atom
 * whose oxygen stays (CO2 -> C(space) + O2). */
enum { NT_O2_OUT, NT_N2_OUT };
enum { NT_WATER_TO_H, NT_CO2_TO_SPACE, NT_CO2_KEEP_O };
extern const vl_transfer vl_nonthermal_transfers[2];
extern const vl_reaction vl_nonthermal_reactions[3];
#define VL_NONTHERMAL_FLUXES                                                             \
    VL_PROCESS_TRANSFERS(vl_nonthermal_transfers), VL_PROCESS_REACTIONS(vl_nonthermal_reactions)

/* (A/A_ref)(F/F_ref)^a (p/p_ref)^b, faded out with the bulk hydrodynamic weight. */
double vl_nonthermal_drive(const vl_nonthermal_params *p, const vl_planet *pl, const vl_env *env);
/* (v_ref/v_esc)^(2 s): a power of the escape-energy ratio. */
double vl_nonthermal_gravity_power(const vl_nonthermal_params *p, const vl_planet *pl,
                                   const vl_env *env);
/* Photochemical gravity factor: fast recombination share here over the reference's. */
double vl_nonthermal_dr_gravity(const vl_nonthermal_params *p, const vl_planet *pl,
                                const vl_env *env);
/* Exposure of the exosphere to the wind, (r_obs/r_mp)^k. */
double vl_nonthermal_exposure(const vl_nonthermal_params *p, const vl_planet *pl,
                              const vl_env *env);
/* Open-cap area over the reference's (polar outflow). */
double vl_nonthermal_polar_factor(const vl_nonthermal_params *p, const vl_planet *pl,
                                  const vl_env *env);
/* Scale q so that their sum stays within the ionising photons absorbed over share of
 * the disc (a smooth guard). */
void vl_nonthermal_photon_guard(const vl_nonthermal_params *p, const vl_planet *pl,
                                const vl_env *env, double share, double q[NEL]);
/* q = the reference rates p->ref times k, kept within the photon guard over share of
 * the disc: the demand of a channel with driver factor k. */
void vl_nonthermal_demand(const vl_nonthermal_params *p, const vl_view *v, double k,
                          double share, double q[NEL]);
/* The hydrogen of demand q that counts against the diffusion room (0 when p does not
 * hold its hydrogen to it). */
double vl_nonthermal_h_demand(const vl_nonthermal_params *p, const double q[NEL]);
/* Apply demand q, its hydrogen scaled by the escape stage's room factor when p holds it
 * to the room, through the declared fluxes (vl_nonthermal_apply, p's fractionation). */
void vl_nonthermal_apply_capped(const vl_nonthermal_params *p, const vl_view *v, double q[NEL],
                                const int map[NEL], vl_flux *fx);

/* Remove q particles/s of each element through the declared fluxes; map gives each
 * element's column (-1: none); keep_o: carbon leaves as a hot atom whose O stays. */
void vl_nonthermal_apply(const double q[NEL], const int map[NEL], int keep_o, double f_d,
                         vl_flux *fx);

#endif
