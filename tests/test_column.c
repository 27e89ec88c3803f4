/* test_column.c: the radiative column (src/physics/spectrum.c, co2.c, profile.c,
 * opacity.c, radiation.c, column.c) against published values; each check names its
 * source. The climate built on it (the energy balance, thresholds, planets):
 * test_column_climate.c. Which results are calibration targets: docs/model.md 3.4. */
#include <math.h>
#include <string.h>

#include "suites.h"
#include "volev/co2.h"
#include "volev/column.h"
#include "volev/reservoir.h"
#include "volev/scenario.h"
#include "volev/spectrum.h"
#include "volev/units.h"
#include "volev/water.h"

/* Column options of the scenario defaults at gravity g (clouds as configured). */
static vl_column_opts default_opts(double g)
{
    vl_scenario *sc = vl_scenario_new();
    ck_assert_ptr_nonnull(sc);
    const vl_climate_params *cp = &sc->climate;
    vl_column_opts o;
    memset(&o, 0, sizeof o);
    o.g = g;
    o.scales = (vl_opacity_scales){cp->h2o_line_scale, cp->h2o_nir_line_scale, cp->co2_line_scale,
                                   cp->h2o_cont_scale, cp->co2_cont_scale, cp->cia_scale};
    o.strat_offset_k = cp->strat_offset_k;
    o.cloud = (vl_cloud){cp->cloud_p_ratio, cp->cloud_tau, 0.5 * cp->cloud_tau};
    vl_scenario_free(sc);
    return o;
}

/* Clear-sky OLR of a pure steam column at t_s and gravity g over one Earth ocean
 * (1.4e21 kg over Earth's area, ~2.7e6 kg/m^2; all of it in the air once hot enough). */
static double steam_olr(double g, double t_s)
{
    vl_column_opts o = default_opts(g);
    vl_column_gases steam = {0.0, 0.0, 0.0, VL_TO_KG / (4.0 * VL_PI * VL_R_EARTH * VL_R_EARTH)};
    vl_column_point p;
    vl_column_point_eval(&o, &steam, t_s, &p);
    return p.olr[0];
}

/* Gases of pressures alone (Pa) of CO2 and N2 over an ocean at gravity g. */
static vl_column_gases wet_air(double g, double p_co2, double p_n2)
{
    return (vl_column_gases){p_co2 / g, p_n2 / g, 0.0, HUGE_VAL};
}

START_TEST(latent_heat)
{
    /* IAPWS-95 steam tables: 2256.5 kJ/kg at 373.124 K (from memory); Watson form within 2 % */
    ck_assert_rel(vl_water_latent_vap(373.124), 2256.5e3, 0.02);
    /* IAPWS-95: 2500.9 kJ/kg at the triple point (from memory) */
    ck_assert_rel(vl_water_latent_vap(273.16), 2500.9e3, 1e-3);
    /* no latent heat at and above the critical point (textbook) */
    ck_assert_double_eq(vl_water_latent_vap(VL_WATER_TC_K), 0.0);
    ck_assert(vl_water_latent(260.0) > vl_water_latent(274.0)); /* sublimation > vaporisation */
}
END_TEST

START_TEST(co2_saturation)
{
    /* Span & Wagner 1996, J. Phys. Chem. Ref. Data 25:1509, tables 3.1 and 3.2 (from
     * memory): triple point 216.592 K and 0.51795 MPa, critical point 304.1282 K and
     * 7.3773 MPa, within 0.5 % */
    ck_assert_rel(vl_co2_psat(216.592), 0.51795e6, 5e-3);
    ck_assert_rel(vl_co2_psat(304.0), 7.3773e6, 5e-3);
    /* CRC Handbook of Chemistry and Physics: dry ice sublimes at 194.69 K under 1 atm
     * (from memory), within 2 % */
    ck_assert_rel(vl_co2_psat(194.69), 101325.0, 0.02);
    /* Span & Wagner 1996 table 7.1: 3.4851 MPa over the liquid at 273.15 K (from memory), 1 % */
    ck_assert_rel(vl_co2_psat(273.15), 3.4851e6, 0.01);
    /* the inverse (common practice: a round trip within 1 mK) */
    for (double t = 150.0; t < 304.0; t += 7.0)
        ck_assert_msg(fabs(vl_co2_tsat(vl_co2_psat(t)) - t) < 1e-3, "T = %g", t);
    /* and exact to the last nanokelvin, over the solid and the liquid (common practice:
     * the root of a monotonic function lies between points where it is below and above;
     * a halving decided the wrong way ends far from it) */
    for (double p = 1e-3; p < 7e6; p *= 1.7) {
        double t = vl_co2_tsat(p);
        ck_assert_msg(vl_co2_psat(t - 1e-9) < p && vl_co2_psat(t + 1e-9) > p, "p = %g", p);
    }
}
END_TEST

START_TEST(planck_and_rayleigh)
{
    /* the bands tile the spectrum: their Planck fluxes add up to sigma T^4
     * (Stefan-Boltzmann law, textbook) within 0.2 % from 150 K to 3000 K */
    for (double t = 150.0; t <= 3000.0; t *= 1.3) {
        double sum = 0.0;
        for (int b = 0; b < VL_NBANDS; b++)
            sum += vl_planck_band(b, t);
        ck_assert_rel(sum, VL_SIGMA_SB * pow(t, 4.0), 2e-3);
    }
    /* half of a blackbody's flux lies at wavelengths below lambda T = 4110 um K
     * (Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, table 12.1): at 288 K,
     * above 701 cm^-1, so the bands below 700 cm^-1 hold less than half, those below
     * 760 cm^-1 more */
    double below700 = 0.0, below760;
    for (int b = 0; vl_band_edge[b + 1] <= 700.0; b++)
        below700 += vl_planck_share(b, 288.0);
    below760 = below700 + vl_planck_share(6, 288.0);
    ck_assert_msg(below700 < 0.5 && below760 > 0.5, "%g %g", below700, below760);
    /* Bucholtz 1995, Appl. Opt. 34:2765 table: Rayleigh optical depth of the standard
     * atmosphere 0.0973 at 550 nm and 0.1436 at 500 nm (from memory); the band
     * 18000-22000 cm^-1 (455-556 nm) averages sigma over the band: between the two,
     * within 5 % */
    int b = 0;
    while (vl_band_edge[b + 1] <= 18000.0)
        b++;
    double n_col = 101325.0 / 9.80665 / (vl_species_molar_mass(VL_SP_N2) * 0.78 +
                                          vl_species_molar_mass(VL_SP_O2) * 0.21 + 0.01 * 0.039948) * VL_AVOGADRO;
    double tau = vl_rayleigh_air(b) * n_col;
    ck_assert_msg(tau > 0.0973 * 0.95 && tau < 0.1436 * 1.05, "tau = %g", tau);
    /* Sneep & Ubachs 2005, JQSRT 92:293: CO2 scatters about 2.5 times as much per
     * molecule as air (from memory) */
    ck_assert_msg(fabs(vl_rayleigh_ratio(VL_SP_CO2) - 2.5) < 0.3, "ratio %g", vl_rayleigh_ratio(VL_SP_CO2));
}
END_TEST

START_TEST(steam_limit_and_gravity)
{
    /* Goldblatt et al. 2013, Nat. Geosci. 6:661: the steam column's OLR limit is
     * 282 W/m^2 at Earth gravity (a calibration target, docs/model.md 3.4): 282 +- 15
     * over the plateau 400-600 K, which is flat within 5 % */
    double lo = HUGE_VAL, hi = 0.0;
    for (double t = 400.0; t <= 600.0; t += 50.0) {
        double f = steam_olr(9.81, t);
        ck_assert_msg(fabs(f - 282.0) <= 15.0, "OLR(%g K) = %g", t, f);
        lo = fmin(lo, f);
        hi = fmax(hi, f);
    }
    ck_assert_msg(hi < 1.05 * lo, "plateau %g-%g", lo, hi);
    /* the limit rises with gravity (a prediction): Kopparapu et al. 2014, ApJL 787:L29
     * find runaway S_eff 0.99, 1.107, 1.188 for 0.1, 1 and 5 Earth masses, whose surface
     * gravities are about 3.4, 9.81 and 20 m/s^2 for their mass-radius relation
     * R ~ M^0.27 (from memory): the OLR ratios follow within 0.05 */
    double f1 = steam_olr(9.81, 500.0), f01 = steam_olr(3.4, 500.0), f5 = steam_olr(20.0, 500.0);
    ck_assert_msg(fabs(f01 / f1 - 0.99 / 1.107) < 0.05, "0.1 M_E: %g", f01 / f1);
    ck_assert_msg(fabs(f5 / f1 - 1.188 / 1.107) < 0.05, "5 M_E: %g", f5 / f1);
}
END_TEST

START_TEST(hot_end)
{
    /* Goldblatt et al. 2013 (from memory): past roughly 1600-2000 K the surface emits
     * through the near-infrared windows and the steam column's OLR rises above the
     * plateau; by 2500 K well above it (a prediction: nothing was fitted here) */
    double plateau = steam_olr(9.81, 500.0);
    double f1200 = steam_olr(9.81, 1200.0), f2000 = steam_olr(9.81, 2000.0);
    double f2500 = steam_olr(9.81, 2500.0), f3000 = steam_olr(9.81, 3000.0);
    ck_assert_msg(f1200 < 1.3 * plateau, "OLR(1200 K) = %g", f1200);
    ck_assert_msg(f2500 > 1.5 * plateau, "OLR(2500 K) = %g", f2500);
    ck_assert_msg(f2000 < f2500 && f2500 < f3000, "%g %g %g", f2000, f2500, f3000);
}
END_TEST

START_TEST(plateau_is_flat)
{
    /* Goldblatt et al. 2013 (fig. 1, from memory): between the critical point and the
     * opening of the windows the OLR of a 1 TO steam atmosphere with a little air stays
     * at its limit, whatever the surface temperature: the radiating upper column is the
     * saturation curve, fixed by the water, not by the surface. Here: within 1 W/m^2
     * (0.4 %) from 700 to 1500 K every 10 K (a spurious ripple of +-5 W/m^2 would put
     * false stable equilibria on the hot branch). */
    vl_column_opts o = default_opts(9.81);
    vl_column_gases gs = {5e-3, 1.02e4, 0.0, VL_TO_KG / (4.0 * VL_PI * VL_R_EARTH * VL_R_EARTH)};
    double lo = HUGE_VAL, hi = -HUGE_VAL;
    for (double t = 700.0; t <= 1500.0; t += 10.0) {
        vl_column_point p;
        vl_column_point_eval(&o, &gs, t, &p);
        lo = fmin(lo, p.olr[0]);
        hi = fmax(hi, p.olr[0]);
    }
    ck_assert_msg(hi - lo < 1.0, "OLR %g to %g W/m^2", lo, hi);
}
END_TEST

START_TEST(cold_trap_opens)
{
    /* Kasting 1988, Icarus 74:472: the cold trap's water rises by orders of magnitude
     * between 288 and 350 K, crossing 3e-3 in 320-360 K (from memory) */
    vl_column_opts o = default_opts(9.81);
    vl_column_gases air = wet_air(9.81, 28.37, VL_BAR);
    vl_column_point a, b;
    vl_column_point_eval(&o, &air, 288.0, &a);
    vl_column_point_eval(&o, &air, 350.0, &b);
    ck_assert_msg(b.f_strat > 100.0 * a.f_strat, "f_strat %g -> %g", a.f_strat, b.f_strat);
    double cross = 0.0;
    for (double t = 300.0; t <= 380.0 && cross == 0.0; t += 2.0) {
        vl_column_point c;
        vl_column_point_eval(&o, &air, t, &c);
        if (c.f_strat >= 3e-3)
            cross = t;
    }
    ck_assert_msg(cross >= 320.0 && cross <= 360.0, "crossing at %g K", cross);
}
END_TEST

START_TEST(co2_condenses)
{
    /* Kasting 1991, Icarus 94:1: in a thick CO2 atmosphere over a cold surface the
     * upper troposphere follows the CO2 saturation curve (no level colder than CO2's
     * saturation temperature at its partial pressure, some levels on it), which caps
     * the CO2 greenhouse: OLR stops falling past ~10 bar (Kopparapu et al. 2013, fig. 4,
     * from memory: within 10 % from 10 to 30 bar) */
    double g = 9.81;
    vl_column_gases gs = wet_air(g, 8.0 * VL_BAR, VL_BAR);
    vl_profile pr;
    vl_profile_build(&gs, g, 273.0, 160.0, &pr);
    int on_curve = 0;
    for (int i = 0; i < pr.n; i++) {
        double tsat = vl_co2_tsat(pr.x[i][VL_GAS_CO2] * pr.p[i]);
        ck_assert_msg(pr.t[i] >= tsat - 0.5, "level %d: %g K below CO2 saturation %g K", i, pr.t[i], tsat);
        on_curve += pr.t[i] < tsat + 0.5 && pr.t[i] > 165.0;
    }
    ck_assert_msg(on_curve >= 2, "%d levels on the saturation curve", on_curve);
    vl_column_opts o = default_opts(g);
    vl_column_point p10, p30;
    vl_column_gases g10 = wet_air(g, 10.0 * VL_BAR, VL_BAR), g30 = wet_air(g, 30.0 * VL_BAR, VL_BAR);
    vl_column_point_eval(&o, &g10, 273.0, &p10);
    vl_column_point_eval(&o, &g30, 273.0, &p30);
    ck_assert_msg(p30.olr[0] > 0.9 * p10.olr[0], "OLR %g -> %g", p10.olr[0], p30.olr[0]);
}
END_TEST

START_TEST(rayleigh_albedo_and_star)
{
    /* Kopparapu et al. 2013 fig. 3 and Kasting 1991 (from memory): the clear-sky
     * albedo of a planet under thick CO2 rises with the CO2 (Rayleigh scattering, 2.5
     * times air's per molecule) and is lower around cooler stars (less blue light to
     * scatter, more near-infrared absorbed) */
    double g = 9.81;
    vl_column_opts o = default_opts(g);
    o.cloud.tau_sw = o.cloud.tau_lw = 0.0;
    double share_sun[VL_NBANDS], share_m[VL_NBANDS], a[VL_NBANDS];
    vl_star_band_shares(5772.0, share_sun);
    vl_star_band_shares(3300.0, share_m);
    for (int b = 0; b < VL_NBANDS; b++)
        a[b] = 0.2;
    double alb[3], ps[3] = {0.01, 2.0, 10.0};
    for (int i = 0; i < 3; i++) {
        vl_column_gases gs = wet_air(g, ps[i] * VL_BAR, VL_BAR);
        vl_column_point p;
        vl_column_point_eval(&o, &gs, 273.0, &p);
        alb[i] = vl_radiation_albedo(&p.sw[0], share_sun, a);
        if (i == 2) /* an M dwarf's light: darker under the same column */
            ck_assert(vl_radiation_albedo(&p.sw[0], share_m, a) < alb[i] - 0.1);
    }
    ck_assert_msg(alb[0] < alb[1] && alb[1] < alb[2], "%g %g %g", alb[0], alb[1], alb[2]);
    /* 10 bar CO2 over a 0.2 surface: 0.4-0.6 (Kasting 1991 fig. 4: near 0.5, from memory) */
    ck_assert_msg(alb[2] > 0.4 && alb[2] < 0.6, "A(10 bar) = %g", alb[2]);
}
END_TEST

Suite *vl_suite_column(void)
{
    Suite *s = suite_create("column");
    TCase *tc = tcase_create("core");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, latent_heat);
    tcase_add_test(tc, co2_saturation);
    tcase_add_test(tc, planck_and_rayleigh);
    tcase_add_test(tc, steam_limit_and_gravity);
    tcase_add_test(tc, hot_end);
    tcase_add_test(tc, plateau_is_flat);
    tcase_add_test(tc, cold_trap_opens);
    tcase_add_test(tc, co2_condenses);
    tcase_add_test(tc, rayleigh_albedo_and_star);
    suite_add_tcase(s, tc);
    return s;
}
