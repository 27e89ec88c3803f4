/* params_core.c: the core parameter table (star, planet, inventory, climate, run).
 * Each row: key, type, unit, to_si, default, bounds, choices, default path, offset,
 * doc, reference, needs, required. Defaults are in file units. */
#include <stddef.h>

#include "volev/params.h"
#include "volev/scenario.h"
#include "volev/status.h"
#include "volev/units.h"

#define OFF(field) offsetof(vl_scenario, field)
#define REAL(k, u, si, d, lo, hi, f, doc, ref, needs) \
    {k, VL_PT_REAL, u, si, d, lo, hi, NULL, NULL, OFF(f), doc, ref, needs, 0}
#define INT(k, d, lo, hi, f, doc, ref) \
    {k, VL_PT_INT, "", 1.0, d, lo, hi, NULL, NULL, OFF(f), doc, ref, NULL, 0}
#define CHOICE(k, ch, d, f, doc, ref, needs) \
    {k, VL_PT_CHOICE, "", 1.0, d, 0, 0, ch, NULL, OFF(f), doc, ref, needs, 0}
#define PATH(k, f, doc, needs) \
    {k, VL_PT_PATH, "", 1.0, 0, 0, 0, NULL, "", OFF(f), doc, "", needs, 0}

#define RATIO_ONLY "star.xuv.model=ratio"

const vl_param vl_core_params[] = {
    /* ---- star ---- */
    REAL("star.mass_msun", "M_sun", VL_M_SUN, 1.0, 0.07, 3.0, star.mass_kg,
         "stellar mass", "IAU 2015 nominal solar mass parameter", NULL),
    REAL("star.teff_k", "K", 1.0, 5772.0, 2600.0, 7200.0, star.teff_k,
         "effective temperature (a table with a teff_k column overrides it)",
         "IAU 2015 Resolution B3 (Sun); bounds: validity of Kopparapu et al. 2013 fits", NULL),
    CHOICE("star.luminosity_model", VL_LUM_CHOICES, VL_LUM_SUN_ANALYTIC, star.luminosity_model,
           "bolometric luminosity history", "Gough 1981 (sun_analytic)", NULL),
    REAL("star.luminosity_lsun", "L_sun", VL_L_SUN, 1.0, 1e-5, 1e3, star.luminosity_w,
         "luminosity: constant value; sun_analytic at present_age_yr; contracting on the main sequence",
         "IAU 2015 nominal solar luminosity",
         "star.luminosity_model=sun_analytic|constant|contracting"),
    REAL("star.present_age_yr", "yr", VL_YR, 4.57e9, 1e6, 2e10, star.present_age_s,
         "sun_analytic: age at which L = luminosity_lsun",
         "Bahcall, Pinsonneault & Wasserburg 1995 (solar age 4.57 Gyr), from memory",
         "star.luminosity_model=sun_analytic"),
    REAL("star.contraction_end_yr", "yr", VL_YR, 1e9, 1e5, 1e11, star.contraction_end_s,
         "contracting: arrival on the main sequence (L ~ t^-2/3 before)",
         "Hayashi-track scaling, textbook; M dwarfs reach the main sequence after ~0.1-2 Gyr (Baraffe et al. 2015), from memory",
         "star.luminosity_model=contracting"),
    PATH("star.track_file", star.track_file,
         "table: CSV with columns age_yr, luminosity_lsun and optional teff_k, xuv_lsun (which then replaces star.xuv.*)",
         "star.luminosity_model=table"),
    CHOICE("star.xuv.model", VL_XUV_CHOICES, VL_XUV_RATIO, star.xuv_model,
           "XUV history: saturated ratio with power-law decay, or the solar fit of Ribas et al. 2005",
           "Jackson, Davis & Wheatley 2012; Ribas et al. 2005", NULL),
    REAL("star.xuv.saturation_ratio", "", 1.0, 1e-3, 1e-7, 0.1, star.xuv_sat_ratio,
         "L_XUV / L_bol while saturated",
         "Luger & Barnes 2015 (M dwarfs), from memory; Jackson et al. 2012: 10^-4.3 to 10^-3.1",
         RATIO_ONLY),
    REAL("star.xuv.saturation_end_yr", "yr", VL_YR, 1e8, 1e5, 1e11, star.xuv_sat_end_s,
         "end of XUV saturation",
         "Jackson, Davis & Wheatley 2012: 10^7.8-10^8.3 yr", RATIO_ONLY),
    REAL("star.xuv.decay_exponent", "", 1.0, 1.23, 0.0, 5.0, star.xuv_decay_exp,
         "beta in L_XUV/L_bol = ratio (t/t_sat)^-beta after saturation",
         "Ribas et al. 2005", RATIO_ONLY),
    REAL("star.lyman_alpha_1au_cm2_s", "cm^-2 s^-1", 1e4, 3.0e11, 0.0, 1e16, star.lya_photon_flux,
         "present H2O-dissociating (Lyman-alpha) photon flux at 1 au; scaled with the XUV history",
         "Tobiska et al. 1997 (quiet Sun)", NULL),
    REAL("star.wind.mass_loss_msun_yr", "M_sun/yr", VL_M_SUN / VL_YR, 2e-14, 0.0, 1e-8,
         star.wind_mdot_kg_s, "wind mass-loss rate at wind.reference_age_yr",
         "present Sun, from memory", NULL),
    REAL("star.wind.speed_km_s", "km/s", 1e3, 400.0, 10.0, 5000.0, star.wind_speed_m_s,
         "wind speed at the planet", "present slow solar wind, from memory", NULL),
    REAL("star.wind.reference_age_yr", "yr", VL_YR, 4.57e9, 1e6, 2e10, star.wind_ref_age_s,
         "age at which wind.mass_loss_msun_yr applies", "solar age, from memory", NULL),
    REAL("star.wind.decay_exponent", "", 1.0, 2.33, 0.0, 5.0, star.wind_decay_exp,
         "Mdot ~ t^-exponent", "Wood et al. 2005, ApJ 628:L143, from memory", NULL),

    /* ---- planet ---- */
    REAL("planet.mass_mearth", "M_earth", VL_M_EARTH, 1.0, 0.01, 20.0, planet.mass_kg,
         "planet mass", "NASA NSSDC Earth fact sheet", NULL),
    REAL("planet.radius_rearth", "R_earth", VL_R_EARTH, 1.0, 0.1, 4.0, planet.radius_m,
         "planet mean radius", "NASA NSSDC Earth fact sheet", NULL),
    REAL("planet.orbit_au", "au", VL_AU, 1.0, 0.005, 100.0, planet.orbit_m,
         "orbital semi-major axis", "IAU 2012 B2", NULL),
    REAL("planet.eccentricity", "", 1.0, 0.0, 0.0, 0.99, planet.eccentricity,
         "orbital eccentricity (orbit-averaged flux L / (4 pi a^2 sqrt(1-e^2)))",
         "common practice", NULL),

    /* ---- inventory: initial amounts; bar = surface pressure the gas would exert alone ---- */
    REAL("inventory.surface_water_to", "TO", VL_TO_KG, 1.0, 0.0, 1e4, inventory.surface_water_kg,
         "surface water (ocean + vapour)", "1 TO = 1.39e21 kg, from memory", NULL),
    REAL("inventory.mantle_water_to", "TO", VL_TO_KG, 0.0, 0.0, 1e4, inventory.mantle_water_kg,
         "water in the mantle available to outgassing", "", NULL),
    REAL("inventory.co2_bar", "bar", VL_BAR, 0.0, 0.0, 1e5, inventory.co2_pa,
         "atmospheric CO2", "", NULL),
    REAL("inventory.n2_bar", "bar", VL_BAR, 0.0, 0.0, 1e5, inventory.n2_pa,
         "atmospheric N2", "", NULL),
    REAL("inventory.o2_bar", "bar", VL_BAR, 0.0, 0.0, 1e5, inventory.o2_pa,
         "atmospheric O2", "", NULL),
    REAL("inventory.h2_bar", "bar", VL_BAR, 0.0, 0.0, 1e5, inventory.h2_pa,
         "atmospheric H2", "", NULL),
    REAL("inventory.carbonate_co2_bar", "bar", VL_BAR, 0.0, 0.0, 1e5, inventory.carbonate_pa,
         "carbonate rock, as CO2-equivalent pressure", "", NULL),
    REAL("inventory.mantle_co2_bar", "bar", VL_BAR, 0.0, 0.0, 1e6, inventory.mantle_co2_pa,
         "mantle carbon available to outgassing, as CO2-equivalent pressure", "", NULL),
    REAL("inventory.mantle_n2_bar", "bar", VL_BAR, 0.0, 0.0, 1e6, inventory.mantle_n2_pa,
         "mantle nitrogen available to outgassing, as N2-equivalent pressure", "", NULL),

    /* ---- climate ---- */
    CHOICE("climate.model", VL_CLIMATE_CHOICES, VL_CLIMATE_HZ_FIT, climate.model,
           "climate backend", "Kopparapu et al. 2013, 2014 (hz_fit)", NULL),
    REAL("climate.bond_albedo", "", 1.0, 0.3, 0.0, 0.95, climate.bond_albedo,
         "planetary Bond albedo", "present Earth, common practice", NULL),
    REAL("climate.greenhouse_ref_k", "K", 1.0, 33.42, 0.0, 500.0, climate.greenhouse_ref_k,
         "greenhouse warming T_s - T_e at the reference CO2",
         "calibration: 288 K for present Earth at 1361 W/m^2, albedo 0.3, 280 ppmv CO2", NULL),
    REAL("climate.co2_doubling_k", "K", 1.0, 3.0, 0.0, 10.0, climate.co2_doubling_k,
         "equilibrium warming per doubling of CO2 (water-vapour feedback included)",
         "IPCC AR6 WG1 best estimate 3 K (likely 2.5-4 K), from memory; AR5 likely range 1.5-4.5 K", NULL),
    REAL("climate.co2_reference_bar", "bar", VL_BAR, 2.837e-4, 1e-9, 1e3, climate.co2_ref_pa,
         "CO2 partial pressure of the calibration state",
         "280 ppmv x 1.01325 bar (pre-industrial), common practice", NULL),
    REAL("climate.strat_h2_temperate_ppmv", "ppmv", 1e-6, 7.6, 0.0, 1e6, climate.strat_h2o_temperate,
         "total hydrogen mixing ratio above the cold trap (H2O + 2 CH4 + H2) while temperate or frozen",
         "Catling & Kasting 2017, Atmospheric Evolution on Inhabited and Lifeless Worlds, from memory", NULL),
    REAL("climate.strat_h2o_moist", "", 1.0, 3e-3, 1e-6, 1.0, climate.strat_h2o_moist,
         "stratospheric H2O mixing ratio in the moist greenhouse",
         "Kasting 1988, Icarus 74:472 (moist-greenhouse threshold)", NULL),
    REAL("climate.runaway_surface_temp_k", "K", 1.0, 1500.0, 400.0, 5000.0, climate.runaway_surface_temp_k,
         "surface temperature of the hot steam state after a runaway",
         "order of the post-runaway states of Goldblatt et al. 2013, from memory", NULL),
    REAL("climate.freeze_temp_k", "K", 1.0, 273.15, 150.0, 300.0, climate.freeze_temp_k,
         "mean surface temperature below which the ocean counts as frozen",
         "melting point of water, common practice", NULL),
    REAL("climate.dry_threshold_to", "TO", VL_TO_KG, 1e-5, 1e-12, 1.0, climate.dry_threshold_kg,
         "surface water below which the planet counts as dry", "common practice", NULL),
    CHOICE("climate.runaway_fit", VL_RUNAWAY_CHOICES, VL_RUNAWAY_K2014, climate.runaway_fit,
           "runaway threshold: Kopparapu 2014 (planet-mass dependent) or 2013 (1 M_earth)",
           "Kopparapu et al. 2014, ApJL 787:L29; 2013, ApJ 765:131", "climate.model=hz_fit"),

    /* ---- run ---- */
    REAL("run.start_yr", "yr", VL_YR, 1e7, 1e3, 1e11, run.start_s,
         "stellar age at the start", "", NULL),
    REAL("run.end_yr", "yr", VL_YR, 4.57e9, 1e3, 1e11, run.end_s,
         "stellar age at the end", "", NULL),
    REAL("run.rel_tolerance", "", 1.0, 1e-7, 1e-12, 1e-2, run.rel_tol,
         "integrator relative tolerance", "common practice", NULL),
    REAL("run.abs_tolerance_kg", "kg", 1.0, 1e3, 1e-6, 1e15, run.abs_tol_kg,
         "integrator absolute tolerance for every reservoir", "common practice", NULL),
    INT("run.log_points", 200, 0, 100000, run.log_points,
        "output rows spaced logarithmically in stellar age", ""),
    INT("run.linear_points", 100, 0, 100000, run.linear_points,
        "output rows spaced linearly in stellar age", ""),
    REAL("run.event_tolerance_yr", "yr", VL_YR, 1.0, 1e-6, 1e9, run.event_tol_s,
         "events are located to within this time", "", NULL),
    INT("run.max_steps", 1000000, 100, 1000000000, run.max_steps,
        "give up after this many accepted integrator steps", ""),
};

const size_t vl_core_nparams = sizeof vl_core_params / sizeof vl_core_params[0];
