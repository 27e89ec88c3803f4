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
#define BOOL(k, d, f, doc, ref, needs) \
    {k, VL_PT_BOOL, "", 1.0, d, 0, 1, NULL, NULL, OFF(f), doc, ref, needs, 0}
#define PATH(k, f, doc, needs) \
    {k, VL_PT_PATH, "", 1.0, 0, 0, 0, NULL, "", OFF(f), doc, "", needs, 0}

#define RATIO_ONLY "star.xuv.model=ratio"
#define HZ_ONLY "climate.model=hz_fit"
#define MO_ONLY "planet.interior.magma_ocean.molten_start=true"
#define COLUMN_ONLY "climate.model=column"
#define COOLING_ONLY "escape.radiative_cooling=true"
#define DRAG_ONLY "escape.oxygen_drag=true"

const vl_param vl_core_params[] = {
    /* ---- star ---- */
    REAL("star.mass_msun", "M_sun", VL_M_SUN, 1.0, 0.07, 3.0, star.mass_kg,
         "stellar mass", "IAU 2015 nominal solar mass parameter", NULL),
    REAL("star.teff_k", "K", 1.0, 5772.0, 2600.0, 7200.0, star.teff_k,
         "effective temperature (a table with a teff_k column overrides it); when not given where star.mass_msun is, the main-sequence value of that mass",
         "IAU 2015 Resolution B3 (Sun); from the mass: Eker et al. 2018, MNRAS 479:5491 (mass-luminosity and mass-radius relations, 0.08-1.5 M_sun) with the Stefan-Boltzmann law; bounds: validity of Kopparapu et al. 2013 fits", NULL),
    CHOICE("star.luminosity_model", VL_LUM_CHOICES, VL_LUM_SUN_ANALYTIC, star.luminosity_model,
           "bolometric luminosity history", "Gough 1981 (sun_analytic)", NULL),
    REAL("star.luminosity_lsun", "L_sun", VL_L_SUN, 1.0, 1e-5, 1e3, star.luminosity_w,
         "luminosity: constant value; sun_analytic at present_age_yr; contracting on the main sequence; when not given where star.mass_msun is, the main-sequence value of that mass",
         "IAU 2015 nominal solar luminosity; from the mass: Eker et al. 2018, MNRAS 479:5491 (mass-luminosity relation, 0.08-7 M_sun)",
         "star.luminosity_model=sun_analytic|constant|contracting"),
    REAL("star.present_age_yr", "yr", VL_YR, 4.57e9, 1e6, 2e10, star.present_age_s,
         "sun_analytic: age at which L = luminosity_lsun",
         "Bahcall, Pinsonneault & Wasserburg 1995, Rev. Mod. Phys. 67:781 (solar age 4.57 Gyr), from memory",
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
         "present Sun, ~2e-14 M_sun/yr (Wood 2004, Living Rev. Sol. Phys. 1:2; the solar "
         "value of Wood et al. 2005, ApJ 628:L143), from memory", NULL),
    REAL("star.wind.speed_km_s", "km/s", 1e3, 400.0, 10.0, 5000.0, star.wind_speed_m_s,
         "wind speed at the planet",
         "slow solar wind at 1 au, ~400 km/s (Kivelson & Russell 1995, Introduction to Space "
         "Physics, Cambridge Univ. Press), from memory", NULL),
    REAL("star.wind.reference_age_yr", "yr", VL_YR, 4.57e9, 1e6, 2e10, star.wind_ref_age_s,
         "age at which wind.mass_loss_msun_yr applies",
         "solar age 4.57 Gyr (Bahcall, Pinsonneault & Wasserburg 1995, Rev. Mod. Phys. 67:781), from memory", NULL),
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
    REAL("planet.dipole_moment_earth", "M_earth_dipole", 8.0e22, 1.0, 0.0, 1e4, planet.dipole_am2,
         "magnetic dipole moment in units of Earth's 8.0e22 A m^2 (0: unmagnetised)",
         "Earth's dipole moment, about 8e22 A m^2 through the late 20th century (IGRF; "
         "IGRF-13, Alken et al. 2021, Earth Planets Space 73:49, gives ~7.7e22 for 2020), "
         "from memory", NULL),
    REAL("planet.exobase.reference_temp_k", "K", 1.0, 1000.0, 100.0, 20000.0, planet.t_exo_ref_k,
         "exobase temperature at present Earth's XUV flux without CO2",
         "present Earth's mean thermosphere: exospheric temperature ~1000 K at moderate solar "
         "activity in NRLMSISE-00 (Picone et al. 2002, JGR 107:1468), from memory", NULL),
    REAL("planet.exobase.xuv_exponent", "", 1.0, 0.5, 0.0, 2.0, planet.t_exo_xuv_exp,
         "T_exo ~ (F_XUV / 4.6e-3 W m^-2)^exponent",
         "order of the XUV response of Tian et al. 2008, from memory", NULL),
    REAL("planet.exobase.co2_cooling", "", 1.0, 3.7, 0.0, 100.0, planet.t_exo_co2_cooling,
         "T_exo divided by (1 + c x_CO2): 15-um CO2 cooling of the thermosphere",
         "[C] from Venus's ~300 K dayside exobase (VIRA, Keating et al. 1985, Adv. Space Res. "
         "5(11):117) at 1.9x Earth's XUV, from memory", NULL),
    REAL("planet.exobase.thermosphere_base_pa", "Pa", 1.0, 0.1, 1e-6, 1e3, planet.thermo_base_pa,
         "pressure at the base of the thermosphere, taken as the homopause",
         "Earth's homopause near 100 km, where the pressure is ~0.03-0.1 Pa (U.S. Standard "
         "Atmosphere 1976, NOAA/NASA/USAF), from memory", NULL),
    REAL("planet.exobase.cross_section_m2", "m^2", 1.0, 3e-19, 1e-21, 1e-16, planet.cross_section_m2,
         "collision cross-section in the exobase criterion n sigma H = 1",
         "Chamberlain & Hunten 1987, from memory", NULL),
    REAL("planet.induced_obstacle_rp", "R_planet", 1.0, 1.1, 1.0, 10.0, planet.obstacle_rp,
         "stand-off of the induced magnetosphere of an unmagnetised planet",
         "Venus and Mars ionopause/induced boundary ~1.1-1.5 R, e.g. Mars's magnetic pileup "
         "boundary (Vignes et al. 2000, GRL 27:49, Mars Global Surveyor), from memory", NULL),

    /* ---- interior ---- */
    CHOICE("planet.interior.heat_flow_model", VL_HEAT_CHOICES, VL_HEAT_RADIOGENIC,
           interior.heat_model, "heat flow history: radiogenic decay, exponential or power law",
           "chosen here: the models of docs/cycles.md", NULL),
    REAL("planet.interior.present_heat_flow_tw", "TW", 1e12, 47.0, 0.0, 1e6, interior.heat_flow_w,
         "heat flow at the reference age", "Earth 47 +- 2 TW (Davies & Davies 2010)", NULL),
    REAL("planet.interior.reference_age_yr", "yr", VL_YR, 4.57e9, 1e6, 2e10, interior.ref_age_s,
         "stellar age at which the heat flow is present_heat_flow_tw",
         "present solar age 4.57 Gyr (Bahcall, Pinsonneault & Wasserburg 1995, Rev. Mod. Phys. 67:781), "
         "from memory",
         NULL),
    REAL("planet.interior.efold_gyr", "Gyr", 1e9 * VL_YR, 4.3, 0.1, 1e3, interior.efold_s,
         "exponential: e-folding time of the heat flow",
         "chosen here: heat flow about twice today's 3 Gyr ago (e^(3/4.3) = 2.0); the "
         "radiogenic model with its default shares gives 2.5 [C] (docs/cycles.md)",
         "planet.interior.heat_flow_model=exponential"),
    REAL("planet.interior.power_exponent", "", 1.0, 0.5, 0.0, 5.0, interior.power_exp,
         "power_law: Q ~ (t / t_ref)^-exponent",
         "chosen here: the t^-1/2 of a conductively cooling half-space (Turcotte & "
         "Schubert 2002, Geodynamics, 2nd ed., ch. 4), not a fit to Earth's history",
         "planet.interior.heat_flow_model=power_law"),
    REAL("planet.interior.share_u238", "", 1.0, 0.39, 0.0, 1.0, interior.share[0],
         "radiogenic: present share of the heat from U-238",
         "bulk silicate Earth: U, Th and K of McDonough & Sun 1995 (Chem. Geol. 120:223) "
         "with the heat production per kg of Turcotte & Schubert 2002 (Geodynamics, "
         "Table 4.2) give U-238 0.39, U-235 0.02, Th-232 0.43, K-40 0.17, from memory",
         "planet.interior.heat_flow_model=radiogenic"),
    REAL("planet.interior.share_u235", "", 1.0, 0.02, 0.0, 1.0, interior.share[1],
         "radiogenic: present share of the heat from U-235",
         "bulk silicate Earth: U, Th and K of McDonough & Sun 1995 (Chem. Geol. 120:223) "
         "with the heat production per kg of Turcotte & Schubert 2002 (Geodynamics, "
         "Table 4.2) give U-238 0.39, U-235 0.02, Th-232 0.43, K-40 0.17, from memory",
         "planet.interior.heat_flow_model=radiogenic"),
    REAL("planet.interior.share_th232", "", 1.0, 0.40, 0.0, 1.0, interior.share[2],
         "radiogenic: present share of the heat from Th-232",
         "bulk silicate Earth: U, Th and K of McDonough & Sun 1995 (Chem. Geol. 120:223) "
         "with the heat production per kg of Turcotte & Schubert 2002 (Geodynamics, "
         "Table 4.2) give U-238 0.39, U-235 0.02, Th-232 0.43, K-40 0.17, from memory",
         "planet.interior.heat_flow_model=radiogenic"),
    REAL("planet.interior.share_k40", "", 1.0, 0.19, 0.0, 1.0, interior.share[3],
         "radiogenic: present share of the heat from K-40",
         "bulk silicate Earth: U, Th and K of McDonough & Sun 1995 (Chem. Geol. 120:223) "
         "with the heat production per kg of Turcotte & Schubert 2002 (Geodynamics, "
         "Table 4.2) give U-238 0.39, U-235 0.02, Th-232 0.43, K-40 0.17, from memory",
         "planet.interior.heat_flow_model=radiogenic"),
    CHOICE("planet.interior.tectonics", VL_TECTONICS_CHOICES, VL_TECTONICS_MOBILE,
           interior.tectonics,
           "mobile lid (plate tectonics: subduction, spreading) or stagnant lid (no subduction)",
           "chosen here: the models of docs/cycles.md", NULL),

    /* ---- interior: a molten start (docs/model.md section 5b) ---- */
    BOOL("planet.interior.magma_ocean.molten_start", 0, interior.magma.molten_start,
         "start with a magma ocean: the mantle at start_temp_k, the surface inventory shared "
         "between the melt and the air", "", NULL),
    REAL("planet.interior.magma_ocean.start_temp_k", "K", 1.0, 3000.0, 1700.0, 3000.0,
         interior.magma.start_tp_k, "mantle potential temperature (surface of the adiabat) at the start",
         "post-giant-impact mantles of ~3000-4000 K, Lebrun et al. 2013, JGR Planets 118:1155, from memory",
         MO_ONLY),
    REAL("planet.interior.magma_ocean.density_kg_m3", "kg/m^3", 1.0, 4000.0, 2000.0, 8000.0,
         interior.magma.mantle.rho_kg_m3, "mean density of the silicate mantle (pressure = density x g x depth)",
         "Earth's mantle 3300-5500 kg/m^3 (PREM, Dziewonski & Anderson 1981), from memory", MO_ONLY),
    REAL("planet.interior.magma_ocean.heat_capacity_j_kg_k", "J/(kg K)", 1.0, 1200.0, 500.0, 3000.0,
         interior.magma.mantle.cp_j_kg_k, "heat capacity of the silicate (melt and solid)",
         "1200 J/(kg K), Lebrun et al. 2013, from memory", MO_ONLY),
    REAL("planet.interior.magma_ocean.expansivity_per_k", "1/K", 1.0, 3e-5, 1e-6, 1e-3,
         interior.magma.mantle.alpha_k, "thermal expansivity (slope of the adiabat: d ln T/dp = alpha/(rho c_p))",
         "order of mantle rock and silicate melts, 1-5e-5 1/K; Turcotte & Schubert 2002 "
         "(Geodynamics, 2nd ed.) take 3e-5 for the mantle, from memory", MO_ONLY),
    REAL("planet.interior.magma_ocean.latent_heat_j_kg", "J/kg", 1.0, 4e5, 0.0, 2e6,
         interior.magma.mantle.latent_j_kg, "latent heat of silicate melting",
         "4e5 J/kg, Solomatov 2000 / Lebrun et al. 2013, from memory", MO_ONLY),
    REAL("planet.interior.magma_ocean.rheological_melt_fraction", "", 1.0, 0.4, 0.05, 0.95,
         interior.magma.mantle.phi_rheo, "melt fraction below which the surface behaves as a solid",
         "0.4, Lebrun et al. 2013", MO_ONLY),
    REAL("planet.interior.magma_ocean.core_radius_fraction", "", 1.0, 0.547, 0.0, 0.9,
         interior.magma.mantle.core_radius_frac, "core radius over planet radius",
         "Earth 3480 / 6371 km (PREM, Dziewonski & Anderson 1981, PEPI 25:297)", MO_ONLY),
    REAL("planet.interior.magma_ocean.feo_mass_fraction", "", 1.0, 0.0805, 0.0, 0.5,
         interior.magma.feo_fraction, "FeO mass fraction of the silicate (its oxygen capacity)",
         "bulk silicate Earth 8.05 wt%, McDonough & Sun 1995, Chem. Geol. 120:223", MO_ONLY),

    /* ---- inventory: initial amounts; bar = surface pressure the gas would exert alone ---- */
    REAL("inventory.surface_water_to", "TO", VL_TO_KG, 1.0, 0.0, 1e4, inventory.surface_water_kg,
         "surface water (ocean + vapour)",
         "1 TO = 1.39e21 kg, the terrestrial ocean of Luger & Barnes 2015 (Astrobiology "
         "15:119), from memory", NULL),
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
    REAL("inventory.initial_dh", "", 1.0, 155.76e-6, 0.0, 1.0, inventory.initial_dh,
         "D/H atom ratio of every hydrogen reservoir at the start",
         "VSMOW 155.76e-6 (Hagemann, Nief & Roth 1970), from memory", NULL),
    REAL("inventory.mantle_n2_bar", "bar", VL_BAR, 0.0, 0.0, 1e6, inventory.mantle_n2_pa,
         "mantle nitrogen available to outgassing, as N2-equivalent pressure", "", NULL),

    /* ---- climate ---- */
    CHOICE("climate.model", VL_CLIMATE_CHOICES, VL_CLIMATE_COLUMN, climate.model,
           "climate backend: radiative column, or habitable-zone fits",
           "chosen here: docs/model.md section 3", NULL),
    REAL("climate.bond_albedo", "", 1.0, 0.3, 0.0, 0.95, climate.bond_albedo,
         "planetary Bond albedo (hz_fit; the column climate with climate.column.albedo = \"fixed\")",
         "present Earth, common practice", NULL),
    REAL("climate.greenhouse_ref_k", "K", 1.0, 33.42, 0.0, 500.0, climate.greenhouse_ref_k,
         "greenhouse warming T_s - T_e at the reference CO2",
         "calibration: 288 K for present Earth at 1361 W/m^2, albedo 0.3, 280 ppmv CO2", HZ_ONLY),
    REAL("climate.co2_doubling_k", "K", 1.0, 3.0, 0.0, 10.0, climate.co2_doubling_k,
         "equilibrium warming per doubling of CO2 (water-vapour feedback included)",
         "IPCC 2021 (AR6 WG1, ch. 7, Forster et al. 2021) best estimate 3 K (likely 2.5-4 K), "
         "from memory; IPCC 2013 (AR5 WG1) likely range 1.5-4.5 K", HZ_ONLY),
    REAL("climate.co2_reference_bar", "bar", VL_BAR, 2.837e-4, 1e-9, 1e3, climate.co2_ref_pa,
         "CO2 partial pressure of the calibration state",
         "280 ppmv x 1.01325 bar (pre-industrial), common practice", HZ_ONLY),
    REAL("climate.strat_h2_temperate_ppmv", "ppmv", 1e-6, 7.6, 0.0, 1e6, climate.strat_h2o_temperate,
         "total hydrogen mixing ratio above the cold trap (H2O + 2 CH4 + H2) while temperate or frozen",
         "Catling & Kasting 2017, Atmospheric Evolution on Inhabited and Lifeless Worlds, from memory", HZ_ONLY),
    REAL("climate.strat_h2o_moist", "", 1.0, 3e-3, 1e-6, 1.0, climate.strat_h2o_moist,
         "stratospheric H2O mixing ratio in the moist greenhouse",
         "Kasting 1988, Icarus 74:472 (moist-greenhouse threshold)", HZ_ONLY),
    REAL("climate.runaway_surface_temp_k", "K", 1.0, 1500.0, 400.0, 5000.0, climate.runaway_surface_temp_k,
         "hz_fit: surface temperature of the hot steam state after a runaway (the column climate "
         "computes it)", "order of the post-runaway states of Goldblatt et al. 2013, from memory",
         HZ_ONLY),
    REAL("climate.freeze_temp_k", "K", 1.0, 273.15, 150.0, 300.0, climate.freeze_temp_k,
         "mean surface temperature below which the ocean counts as frozen",
         "melting point of water, common practice", NULL),
    REAL("climate.dry_threshold_to", "TO", VL_TO_KG, 1e-5, 1e-12, 1.0, climate.dry_threshold_kg,
         "surface water below which the planet counts as dry", "common practice", NULL),
    CHOICE("climate.runaway_fit", VL_RUNAWAY_CHOICES, VL_RUNAWAY_K2014, climate.runaway_fit,
           "runaway threshold: Kopparapu 2014 (planet-mass dependent) or 2013 (1 M_earth)",
           "Kopparapu et al. 2014, ApJL 787:L29; 2013, ApJ 765:131", HZ_ONLY),

    REAL("climate.moist_threshold", "", 1.0, 3e-3, 1e-6, 1.0, climate.moist_threshold,
         "stratospheric H2O mixing ratio above which the climate is a moist greenhouse",
         "Kasting 1988, Icarus 74:472 (3e-3); Popp et al. 2016 use 1e-3", COLUMN_ONLY),
    REAL("climate.column.h2o_line_scale", "", 1.0, 0.03, 0.0, 100.0, climate.h2o_line_scale,
         "factor on the tabulated thermal H2O line intensities (below 2000 cm^-1; "
         "src/physics/opacity.c, from memory)",
         "calibration: steam-column OLR limit 282 W/m^2 at 9.81 m/s^2 (Goldblatt et al. 2013, "
         "Nat. Geosci. 6:661); docs/model.md section 3.4", COLUMN_ONLY),
    REAL("climate.column.h2o_nir_line_scale", "", 1.0, 1.0, 0.0, 100.0, climate.h2o_nir_line_scale,
         "factor on the tabulated near-infrared H2O line intensities (from 2000 cm^-1, 5 um)",
         "1: the band intensities tabulated in src/physics/opacity.c, HITRAN band totals (e.g. "
         "HITRAN2016, Gordon et al. 2017, JQSRT 203:3), from memory; not calibrated",
         COLUMN_ONLY),
    REAL("climate.column.co2_line_scale", "", 1.0, 1.0, 0.0, 100.0, climate.co2_line_scale,
         "factor on the tabulated CO2 line intensities",
         "1: the band intensities tabulated in src/physics/opacity.c, HITRAN band totals (e.g. "
         "HITRAN2016, Gordon et al. 2017, JQSRT 203:3), from memory; not calibrated",
         COLUMN_ONLY),
    REAL("climate.column.h2o_continuum_scale", "", 1.0, 1.0, 0.0, 100.0, climate.h2o_cont_scale,
         "factor on the H2O continuum",
         "1: Roberts, Selby & Biberman 1976 (Appl. Opt. 15:2085) in the window", COLUMN_ONLY),
    REAL("climate.column.co2_continuum_scale", "", 1.0, 3.0, 0.0, 1000.0, climate.co2_cont_scale,
         "factor on the CO2-CO2 continuum (collision-induced and far-wing absorption)",
         "calibration: maximum CO2 greenhouse at S_eff 0.3507 (Kopparapu et al. 2013, ApJ "
         "765:131, erratum ApJ 770:82); docs/model.md section 3.4", COLUMN_ONLY),
    REAL("climate.column.cia_scale", "", 1.0, 1.0, 0.0, 100.0, climate.cia_scale,
         "factor on the other collision-induced absorption (N2-N2, H2-H2, H2-N2)",
         "1: the coefficients tabulated in src/physics/opacity.c after Borysow & Frommhold "
         "1986 (N2-N2), Borysow et al. 2001 (H2-H2) and Wordsworth & Pierrehumbert 2013, "
         "Science 339:64 (H2-N2), from memory", COLUMN_ONLY),
    REAL("climate.column.stratosphere_offset_k", "K", 1.0, 14.0, 0.0, 100.0, climate.strat_offset_k,
         "stratosphere and cold trap this much colder than the skin temperature (OLR/2 sigma)^(1/4)",
         "Earth's cold trap near 200 K against a 214 K skin (Kasting 1988 used 200 K), common practice",
         COLUMN_ONLY),
    CHOICE("climate.column.albedo", VL_ALBEDO_CHOICES, VL_ALBEDO_COMPUTED, climate.albedo_mode,
           "planetary albedo: computed by the column, or fixed at climate.bond_albedo (a measured "
           "albedo for clouds the model does not make, e.g. Venus's sulphuric acid)",
           "common practice", COLUMN_ONLY),
    REAL("climate.column.ocean_albedo", "", 1.0, 0.06, 0.0, 1.0, climate.ocean_albedo,
         "albedo of open water", "Payne 1972, J. Atmos. Sci. 29:959, from memory", COLUMN_ONLY),
    REAL("climate.column.land_albedo", "", 1.0, 0.2, 0.0, 1.0, climate.land_albedo,
         "albedo of bare and vegetated land, and of a dry planet's rock",
         "common practice (0.15-0.3)", COLUMN_ONLY),
    REAL("climate.column.land_fraction", "", 1.0, 0.29, 0.0, 1.0, climate.land_fraction,
         "share of a wet planet's surface that is land", "present Earth (29 %), common practice",
         COLUMN_ONLY),
    REAL("climate.column.ice_albedo_visible", "", 1.0, 0.8, 0.0, 1.0, climate.ice_albedo_vis,
         "albedo of snow and ice below 0.7 um", "Shields et al. 2013, Astrobiology 13:715, from memory",
         COLUMN_ONLY),
    REAL("climate.column.ice_albedo_infrared", "", 1.0, 0.4, 0.0, 1.0, climate.ice_albedo_nir,
         "albedo of snow and ice above 0.7 um (lower: ice absorbs the near infrared)",
         "Shields et al. 2013, from memory", COLUMN_ONLY),
    REAL("climate.column.ice_cover_temp_k", "K", 1.0, 240.0, 150.0, 300.0, climate.ice_cover_k,
         "mean surface temperature below which the planet is fully ice-covered",
         "Budyko-Sellers-type ramp, common practice", COLUMN_ONLY),
    REAL("climate.column.ice_free_temp_k", "K", 1.0, 273.0, 150.0, 320.0, climate.ice_free_k,
         "mean surface temperature above which ice no longer raises the albedo",
         "common practice", COLUMN_ONLY),
    REAL("climate.column.melt_albedo", "", 1.0, 0.1, 0.0, 1.0, climate.melt_albedo,
         "albedo of a molten surface",
         "order of magnitude, chosen here: dark basaltic melt, like fresh basalt (~0.1, from "
         "memory); no measured albedo of a molten surface at hand", COLUMN_ONLY),
    REAL("climate.column.melt_start_temp_k", "K", 1.0, 1350.0, 500.0, 3000.0, climate.melt_start_k,
         "surface temperature where melt starts to cover the surface",
         "near the peridotite solidus at 1 bar, ~1400 K (Hirschmann 2000, G3 1:2000GC000070), "
         "from memory", COLUMN_ONLY),
    REAL("climate.column.melt_full_temp_k", "K", 1.0, 1650.0, 500.0, 3000.0, climate.melt_full_k,
         "surface temperature above which the surface is all melt",
         "chosen here: about 40 % of the way from the solidus (melt_start_temp_k) to the "
         "peridotite liquidus, ~2050 K at 1 bar (Katz, Spiegelman & Langmuir 2003, G3 "
         "4:1073), near the rheological transition of Lebrun et al. 2013; from memory",
         COLUMN_ONLY),
    REAL("climate.column.cloud_fraction", "", 1.0, 0.5, 0.0, 1.0, climate.cloud_fraction,
         "share of a wet planet's sky under the cloud layer (0: no clouds)",
         "common practice, below Earth's cloud cover of ~0.66 (ISCCP, Rossow & Schiffer 1999, "
         "Bull. Am. Meteorol. Soc. 80:2261), from memory", COLUMN_ONLY),
    REAL("climate.column.cloud_pressure_ratio", "", 1.0, 0.85, 1e-4, 0.99, climate.cloud_p_ratio,
         "level of the cloud layer: its pressure over the surface pressure",
         "low cloud near 850 hPa, where Earth's most reflective (stratocumulus) decks sit, "
         "common practice", COLUMN_ONLY),
    REAL("climate.column.cloud_optical_depth", "", 1.0, 5.7, 0.0, 1e3, climate.cloud_tau,
         "visible optical depth of the cloud layer (thermal: half of it)",
         "calibration: present Earth 288 K (docs/model.md section 3.4)", COLUMN_ONLY),

    /* ---- escape budget (escape.c, docs/escape.md) ---- */
    BOOL("escape.thermal", 1, escape.thermal,
         "thermal escape of hydrogen (and the oxygen it drags): the least of the diffusion, "
         "Jeans and energy limits; false: no thermal escape, and non-thermal hydrogen is "
         "not held to the diffusion room",
         "Hunten 1973; Chamberlain & Hunten 1987; Watson, Donahue & Walker 1981", NULL),
    REAL("escape.xuv_efficiency", "", 1.0, 0.15, 0.0, 1.0, escape.efficiency,
         "fraction of absorbed XUV energy that drives escape",
         "Lammer et al. 2009, A&A 506:399: 0.1-0.3", NULL),
    REAL("escape.xuv_radius_ratio", "", 1.0, 1.0, 1.0, 10.0, escape.xuv_radius_ratio,
         "radius where XUV is absorbed over planet radius",
         "common practice (1 for rocky planets)", NULL),
    REAL("escape.homopause_temp_k", "K", 1.0, 250.0, 100.0, 3000.0, escape.homopause_temp_k,
         "temperature of the homopause region in the diffusion limit",
         "from memory (gives ~2.5e13 f_T H2 cm^-2 s^-1 for Earth, Catling & Kasting 2017)", NULL),
    BOOL("escape.roche_lobe", 1, escape.roche, "apply the Roche-lobe enhancement 1/K",
         "Erkaev et al. 2007", NULL),
    REAL("escape.critical_lambda", "", 1.0, 2.5, 0.5, 20.0, escape.lambda_crit,
         "escape parameter below which the flow is hydrodynamic",
         "~2-3, e.g. Volkov et al. 2011, from memory", NULL),
    BOOL("escape.radiative_cooling", 0, escape.cooling,
         "reduce the heating efficiency by CO2 and H2O cooling",
         "chosen here: off, an option (docs/escape.md)", NULL),
    REAL("escape.cooling_co2", "", 1.0, 3.7, 0.0, 1e3, escape.cool_co2,
         "c_CO2 in eps / (1 + c_CO2 x_CO2 + c_H2O f_strat)",
         "chosen here: the value of planet.exobase.co2_cooling (Venus's ~300 K dayside "
         "exobase, Keating et al. 1985, Adv. Space Res. 5(11):117, from memory), applied "
         "to the heating efficiency", COOLING_ONLY),
    REAL("escape.cooling_h2o", "", 1.0, 1.0, 0.0, 1e3, escape.cool_h2o,
         "c_H2O in eps / (1 + c_CO2 x_CO2 + c_H2O f_strat)",
         "order of magnitude, chosen here: 1; no calibration at hand", COOLING_ONLY),
    BOOL("escape.oxygen_drag", 1, escape.drag,
         "escaping hydrogen drags oxygen above the crossover flux and shares the energy-"
         "limited mass flux with it",
         "Hunten, Pepin & Walker 1987, Icarus 69:532", NULL),
    REAL("escape.drag_flow_temp_k", "K", 1.0, 400.0, 100.0, 10000.0, escape.drag_temp_k,
         "temperature of the escaping flow in the crossover mass",
         "Hunten, Pepin & Walker 1987; Luger & Barnes 2015 use 400 K, from memory", DRAG_ONLY),

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
         "a new regime is held at least this long (bounds switching back and forth at a regime boundary); events are located by root finding",
         "", NULL),
    INT("run.max_steps", 1000000, 100, 1000000000, run.max_steps,
        "give up after this many accepted integrator steps", ""),
    INT("run.max_rhs_evaluations", 2000000, 1000, 1000000000000, run.max_rhs,
        "work bound: give up after this many right-hand-side evaluations (Jacobians included; exit 4)",
        "chosen here: at least 50 times what any bundled scenario needs "
        "(docs/hardening.md)"),
    REAL("run.max_cpu_s", "s", 1.0, 0.0, 0.0, 1e9, run.max_cpu_s,
         "work bound: give up after this much CPU time of the run's thread (exit 4); 0: no limit",
         "chosen here: off, since CPU time depends on the "
         "machine and results must not", NULL),
};

const size_t vl_core_nparams = sizeof vl_core_params / sizeof vl_core_params[0];
