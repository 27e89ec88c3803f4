/* test_magma.c: the magma-ocean module (src/physics/magma.c) against published values;
 * each check names its source. [C] marks a value computed by hand from the published
 * formula or from standard atomic weights (written out beside it). */
#include <math.h>

#include "suites.h"
#include "volev/magma.h"
#include "volev/units.h"

#define GPA 1e9

/* The example parameters of magma.h (rho 4000, cp 1200, alpha 3e-5, L 4e5, phi 0.4 after
 * Lebrun et al. 2013, core 0.55 of Earth's radius) with the given alpha. */
static vl_magma_params earth_params(double alpha)
{
    return (vl_magma_params){4000.0, 1200.0, alpha, 4e5, 0.4, 0.55};
}

#define G_EARTH 9.81

static vl_magma_state earth_at(const vl_magma_params *mp, double tp)
{
    vl_magma_state s;
    ck_assert_int_eq(vl_magma_state_at(mp, tp, VL_R_EARTH, G_EARTH, &s), 0);
    return s;
}

START_TEST(melting_curves_reproduce_fits)
{
    /* Hirschmann 2000 (G3 1, 2000GC000070), fit T = -5.104 P^2 + 132.899 P + 1120.661 degC:
     * [C] 1120.661 degC = 1393.81 K at 0 GPa, 1473.42 degC = 1746.57 K at 3 GPa */
    ck_assert_rel(vl_magma_solidus_k(0.0), 1393.81, 1e-5);
    ck_assert_rel(vl_magma_solidus_k(3.0 * GPA), 1746.57, 1e-5);
    /* Andrault et al. 2011 (EPSL 304:251), fit 2045 K (P/92 GPa + 1)^(1/1.3) (from memory):
     * [C] 2460.4 K at 25 GPa, 4096.5 K at 135 GPa */
    ck_assert_rel(vl_magma_solidus_k(25.0 * GPA), 2460.4, 1e-4);
    ck_assert_rel(vl_magma_solidus_k(135.0 * GPA), 4096.5, 1e-4);
    /* measured solidus at the core-mantle boundary (135 GPa): 4150 +- 150 K (Andrault et al.
     * 2011) and 4180 +- 150 K (Fiquet et al. 2010, Science 329:1516), both from memory */
    double t_cmb = vl_magma_solidus_k(135.0 * GPA);
    ck_assert_msg(fabs(t_cmb - 4150.0) <= 150.0 && fabs(t_cmb - 4180.0) <= 150.0, "%g K", t_cmb);
    /* Katz, Spiegelman & Langmuir 2003 (G3 4:1073), liquidus 1780 + 45 P - 2 P^2 degC (from
     * memory): [C] 2053.15 K at 0 GPa, 1897 degC = 2170.15 K at 3 GPa */
    ck_assert_rel(vl_magma_liquidus_k(0.0), 2053.15, 1e-5);
    ck_assert_rel(vl_magma_liquidus_k(3.0 * GPA), 2170.15, 1e-5);
    /* Fiquet et al. 2010, fit 1940 K (P/29 GPa + 1)^(1/1.9) (from memory): [C] 3500.4 K at
     * 60 GPa, 4828.7 K at 135 GPa; above both measured solidi there */
    ck_assert_rel(vl_magma_liquidus_k(60.0 * GPA), 3500.4, 1e-4);
    ck_assert_rel(vl_magma_liquidus_k(135.0 * GPA), 4828.7, 1e-4);
    ck_assert(vl_magma_liquidus_k(135.0 * GPA) > 4180.0 + 150.0);
}
END_TEST

START_TEST(melting_curves_join)
{
    /* By definition the liquidus lies above the solidus, and peridotite melts at higher
     * temperatures under higher pressures up to the core-mantle boundary (Fiquet et al.
     * 2010; Andrault et al. 2011, from memory): every 0.05 GPa from 0 to 140 GPa */
    double prev_s = 0.0, prev_l = 0.0;
    for (int i = 0; i <= 2800; i++) {
        double p = 0.05 * i * GPA, ts = vl_magma_solidus_k(p), tl = vl_magma_liquidus_k(p);
        ck_assert_msg(tl > ts, "liquidus %g <= solidus %g at %g GPa", tl, ts, p / GPA);
        ck_assert_msg(ts > prev_s && tl > prev_l, "not rising at %g GPa", p / GPA);
        prev_s = ts, prev_l = tl;
    }
    /* the joins are continuous with a continuous slope at the window's ends, 8 and 14 GPa
     * (common practice: one-sided differences over 1e-4 GPa agree within 0.5 %) */
    double (*f[2])(double) = {vl_magma_solidus_k, vl_magma_liquidus_k};
    double ends[2] = {8.0 * GPA, 14.0 * GPA}, h = 1e-4 * GPA;
    for (int c = 0; c < 2; c++)
        for (int e = 0; e < 2; e++) {
            double p = ends[e], left = (f[c](p) - f[c](p - h)) / h, right = (f[c](p + h) - f[c](p)) / h;
            ck_assert_rel(left, right, 5e-3);
            ck_assert_rel(f[c](p - 1e-6 * GPA), f[c](p + 1e-6 * GPA), 1e-7);
        }
}
END_TEST

/* T'/T of the curve at p (finite difference). */
static double log_slope(double (*f)(double), double p)
{
    double h = 1e-5 * GPA;
    return (log(f(p + h)) - log(f(p - h))) / (2.0 * h);
}

START_TEST(log_slope_monotone_between_breaks)
{
    /* src/physics/magma.c finds every crossing of the adiabat with a melting curve by
     * assuming T'/T monotone between its breakpoints (the join window's ends and the
     * extrema inside it: [C] 9.3647, 11.9419, 13.1789, 13.6118 GPa). Checked every 0.01
     * GPa from 0.01 to 200 GPa, the breakpoints' neighbourhoods (2e-3 GPa) excepted. */
    static const double brk[] = {0.0, 8.0, 9.36467402085705, 11.9419219846878,
                                 13.1788947371064, 13.6117837097243, 14.0, 200.0};
    double (*f[2])(double) = {vl_magma_solidus_k, vl_magma_liquidus_k};
    for (int c = 0; c < 2; c++)
        for (int j = 1; j < (int)(sizeof brk / sizeof brk[0]); j++) {
            double lo = fmax(brk[j - 1] + 2e-3, 0.01), hi = brk[j] - 2e-3;
            double prev = log_slope(f[c], lo * GPA);
            int sign = 0;
            for (double p = lo + 0.01; p <= hi; p += 0.01) {
                double s = log_slope(f[c], p * GPA);
                int sg = s > prev ? 1 : -1;
                ck_assert_msg(sign == 0 || sg == sign, "curve %d: T'/T turns at %g GPa", c, p);
                sign = sg;
                prev = s;
            }
        }
}
END_TEST

START_TEST(solubilities)
{
    /* H2O in basaltic melt: ~3 wt% at 100 MPa and ~1 wt% at 25 MPa (Dixon, Stolper &
     * Holloway 1995, J. Petrol. 36:1607, MORB at 1200 degC; from memory), within 25 % */
    ck_assert_rel(vl_magma_h2o_solubility(1e8), 0.03, 0.25);
    ck_assert_rel(vl_magma_h2o_solubility(2.5e7), 0.01, 0.25);
    /* CO2 in basaltic melt: ~0.5 ppm per bar at low pressure, i.e. ~250 ppm at 500 bar and
     * ~500 ppm at 1 kbar (Stolper & Holloway 1988, EPSL 87:397; Pan et al. 1991; from
     * memory), within 25 % */
    ck_assert_rel(vl_magma_co2_solubility(5e7), 250e-6, 0.25);
    ck_assert_rel(vl_magma_co2_solubility(1e8), 500e-6, 0.25);
    /* N2, Libourel et al. 2003 (GCA 67:4123, from memory): under oxidising conditions
     * physical solubility ~2.2e-9 mol N2 per g and atm ([C] x 28.013 g/mol = 6.2e-8 per atm,
     * 6.1e-8 per bar) at 1 and 100 bar N2, fO2 1e-8 bar; within 5 % */
    ck_assert_rel(vl_magma_n2_solubility(1e5, 1e-8), 6.1e-8, 0.05);
    ck_assert_rel(vl_magma_n2_solubility(1e7, 1e-8), 6.1e-6, 0.05);
    /* the chemical (nitride) term takes over below ~IW-1.5 at 1425 degC, fO2 ~1e-11 bar
     * (IW ~1e-9.5 bar there; from memory): at 1 bar N2 it is less than the physical term at
     * 1e-10 bar and more than ten times it at 1e-13 bar */
    double phys = vl_magma_n2_solubility(1e5, 0.0);
    ck_assert(vl_magma_n2_solubility(1e5, 1e-10) < 2.0 * phys);
    ck_assert(vl_magma_n2_solubility(1e5, 1e-13) > 11.0 * phys);
    /* nothing dissolves without gas (definition) */
    ck_assert_double_eq(vl_magma_h2o_solubility(0.0), 0.0);
    ck_assert_double_eq(vl_magma_co2_solubility(-1.0), 0.0);
    ck_assert_double_eq(vl_magma_n2_solubility(0.0, 1e-12), 0.0);
}
END_TEST

START_TEST(adiabat_gradient)
{
    /* upper-mantle adiabatic gradient ~0.3-0.5 K/km below a 1600 K potential temperature
     * (Turcotte & Schubert 2014, Geodynamics, section 4.28; from memory) */
    vl_magma_params mp = earth_params(3e-5);
    double dz = 1e3, dp = mp.rho_kg_m3 * G_EARTH * dz;
    double grad = vl_magma_adiabat_k(&mp, 1600.0, dp) - vl_magma_adiabat_k(&mp, 1600.0, 0.0);
    ck_assert_msg(grad > 0.3 && grad < 0.5, "%g K/km", grad);
    ck_assert_double_eq(vl_magma_adiabat_k(&mp, 1600.0, 0.0), 1600.0); /* tp is the surface value */
}
END_TEST

START_TEST(mantle_mass)
{
    /* Earth's mantle ~4.0e24 kg (common practice, from memory), within 20 %, for a mean
     * density of 4000 and 4500 kg/m^3 with the core at 0.55 of the radius */
    for (double rho = 4000.0; rho <= 4500.0; rho += 500.0) {
        vl_magma_params mp = earth_params(3e-5);
        mp.rho_kg_m3 = rho;
        vl_magma_state s = earth_at(&mp, 2000.0);
        ck_assert_rel(s.mantle_kg, 4.0e24, 0.2);
    }
}
END_TEST

START_TEST(molten_and_frozen)
{
    vl_magma_params mp = earth_params(3e-5);
    double thickness = 0.45 * VL_R_EARTH;
    /* a 3000-4000 K potential temperature lies above the peridotite liquidus all through
     * the mantle: a whole-mantle magma ocean (Lebrun et al. 2013 and Elkins-Tanton 2008
     * start fully molten at such temperatures; from memory) */
    for (double tp = 3000.0; tp <= 4000.0; tp += 250.0) {
        vl_magma_state s = earth_at(&mp, tp);
        ck_assert_rel(s.depth_m, thickness, 1e-9);
        ck_assert_rel(s.melt_kg, s.mantle_kg, 1e-9);
        ck_assert_double_eq(s.melt_frac_surface, 1.0);
    }
    /* at 1600 K, 200 K above the 1-atm solidus (1393.8 K, Hirschmann 2000), the surface is
     * below the rheological transition (Lebrun et al. 2013: phi 0.4): no magma ocean, and
     * less than 1 % of the mantle molten; below the 1-atm solidus nothing melts (the
     * adiabat, ~10 K/GPa, rises slower than the solidus, 133 K/GPa at 0 GPa) */
    vl_magma_state s = earth_at(&mp, 1600.0);
    ck_assert_double_eq(s.depth_m, 0.0);
    ck_assert_msg(s.melt_kg < 0.01 * s.mantle_kg && s.melt_kg > 0.0, "%g kg", s.melt_kg);
    s = earth_at(&mp, 1380.0);
    ck_assert_double_eq(s.melt_kg, 0.0);
    ck_assert_double_eq(s.melt_frac_surface, 0.0);
}
END_TEST

START_TEST(monotone_in_tp)
{
    /* more heat, more melt (thermodynamics): depth, melt and its derivative never
     * decrease / fall below 0 from 1300 to 4000 K every 2.5 K */
    vl_magma_params mp = earth_params(3e-5);
    vl_magma_state prev = earth_at(&mp, 1300.0);
    for (double tp = 1302.5; tp <= 4000.0; tp += 2.5) {
        vl_magma_state s = earth_at(&mp, tp);
        ck_assert_msg(s.depth_m >= prev.depth_m && s.melt_kg >= prev.melt_kg,
                      "tp %g: depth %g < %g or melt %g < %g", tp, s.depth_m, prev.depth_m,
                      s.melt_kg, prev.melt_kg);
        ck_assert(s.dmelt_dtp_kg_k >= 0.0);
        prev = s;
    }
}
END_TEST

START_TEST(derivative_and_continuity)
{
    vl_magma_params mp = earth_params(3e-5);
    /* dmelt_dtp is the derivative of melt_kg (calculus: a centred difference over +-1e-3 K
     * agrees within 1e-5), where the surface, the base and the middle melt */
    static const double tps[] = {1450.0, 1700.0, 1880.0, 1950.0, 2080.0, 2150.0, 2300.0, 2400.0};
    for (unsigned i = 0; i < sizeof tps / sizeof tps[0]; i++) {
        vl_magma_state a = earth_at(&mp, tps[i] - 1e-3), b = earth_at(&mp, tps[i] + 1e-3);
        vl_magma_state s = earth_at(&mp, tps[i]);
        ck_assert_rel(s.dmelt_dtp_kg_k, (b.melt_kg - a.melt_kg) / 2e-3, 1e-5);
    }
    /* continuous in tp (the integrator needs it): from 1300 to 3000 K every 0.25 K, a step
     * of 1e-6 K changes it by less than 1e-4 of its largest value (a missed or spurious
     * piece would jump by ~1e-2) */
    double top = 0.0, worst = 0.0, at = 0.0;
    for (double tp = 1300.0; tp <= 3000.0; tp += 0.25) {
        vl_magma_state a = earth_at(&mp, tp), b = earth_at(&mp, tp + 1e-6);
        top = fmax(top, a.dmelt_dtp_kg_k);
        if (fabs(b.dmelt_dtp_kg_k - a.dmelt_dtp_kg_k) > worst)
            worst = fabs(b.dmelt_dtp_kg_k - a.dmelt_dtp_kg_k), at = tp;
    }
    ck_assert_msg(worst < 1e-4 * top, "jump %g of %g at %g K", worst, top, at);
}
END_TEST

START_TEST(latent_heat_budget)
{
    /* energy conservation (common practice): the latent part of the heat capacity,
     * integrated from a solid (1300 K) to a fully molten mantle (2600 K), is the latent
     * heat of the whole mantle; trapezoids of 0.25 K, within 1e-4 */
    vl_magma_params mp = earth_params(3e-5);
    double sum = 0.0, h = 0.25, mantle = 0.0;
    for (double tp = 1300.0; tp < 2600.0 - 0.5 * h; tp += h) {
        vl_magma_state a = earth_at(&mp, tp), b = earth_at(&mp, tp + h);
        double la = a.heat_capacity_j_k - a.mantle_kg * mp.cp_j_kg_k * a.adiabat_factor;
        double lb = b.heat_capacity_j_k - b.mantle_kg * mp.cp_j_kg_k * b.adiabat_factor;
        sum += 0.5 * h * (la + lb);
        mantle = a.mantle_kg;
    }
    ck_assert_rel(sum, mp.latent_j_kg * mantle, 1e-4);
}
END_TEST

/* Melt mass and the first depth where the melt fraction falls below phi, by brute force:
 * n shells of equal thickness, midpoint rule, from the public local melt fraction. */
static void brute(const vl_magma_params *mp, double tp, double r, double g, int n,
                  double *melt, double *depth)
{
    double h = r * (1.0 - mp->core_radius_frac), dz = h / n;
    *melt = 0.0;
    *depth = -1.0;
    for (int i = 0; i < n; i++) {
        double z = (i + 0.5) * dz, rr = r - z;
        double x = vl_magma_melt_frac(mp, tp, mp->rho_kg_m3 * g * z);
        *melt += 4.0 * VL_PI * rr * rr * dz * mp->rho_kg_m3 * x;
        if (*depth < 0.0 && x < mp->phi_rheo)
            *depth = i * dz;
    }
    if (vl_magma_melt_frac(mp, tp, 0.0) < mp->phi_rheo)
        *depth = 0.0;
    if (*depth < 0.0)
        *depth = h;
}

START_TEST(brute_force_agrees)
{
    /* an independent integration (common practice: 40000 shells, midpoint rule) agrees
     * within 2e-6 of the mantle in melt and within two shells in depth, for three
     * expansivities, an Earth and a larger planet (1.5 R_E, 15 m/s^2) */
    static const double alphas[] = {1.5e-5, 3e-5, 5e-5};
    static const double planet[2][2] = {{VL_R_EARTH, G_EARTH}, {1.5 * VL_R_EARTH, 15.0}};
    for (int a = 0; a < 3; a++)
        for (int q = 0; q < 2; q++)
            for (double tp = 1350.0; tp <= 3200.0; tp += 37.0) {
                vl_magma_params mp = earth_params(alphas[a]);
                vl_magma_state s;
                double melt, depth, n = 40000;
                ck_assert_int_eq(vl_magma_state_at(&mp, tp, planet[q][0], planet[q][1], &s), 0);
                brute(&mp, tp, planet[q][0], planet[q][1], (int)n, &melt, &depth);
                ck_assert_msg(fabs(s.melt_kg - melt) <= 2e-6 * s.mantle_kg,
                              "alpha %g planet %d tp %g: melt %g vs %g", alphas[a], q, tp, s.melt_kg, melt);
                double dz = planet[q][0] * 0.45 / n;
                ck_assert_msg(fabs(s.depth_m - depth) <= 2.0 * dz,
                              "alpha %g planet %d tp %g: depth %g vs %g", alphas[a], q, tp, s.depth_m, depth);
            }
}
END_TEST

START_TEST(grazing_crossings)
{
    /* where the adiabat (alpha 3e-5) grazes the solidus at 12-14 GPa, around the extrema of
     * the solidus' T'/T, it crosses it three times within ~1 K of tp (2086.3-2086.6 K):
     * every 0.05 K there, the melt agrees with the brute-force integration within 1e-6 of
     * the mantle and dmelt_dtp with its centred difference over +-0.01 K within 1e-3
     * (common practice; a missed pair of crossings costs ~2e-5 and ~9 %) */
    vl_magma_params mp = earth_params(3e-5);
    for (double tp = 2086.2; tp <= 2086.7; tp += 0.05) {
        vl_magma_state s = earth_at(&mp, tp);
        double m, ma, mb, depth;
        brute(&mp, tp, VL_R_EARTH, G_EARTH, 40000, &m, &depth);
        brute(&mp, tp - 0.01, VL_R_EARTH, G_EARTH, 40000, &ma, &depth);
        brute(&mp, tp + 0.01, VL_R_EARTH, G_EARTH, 40000, &mb, &depth);
        ck_assert_msg(fabs(s.melt_kg - m) <= 1e-6 * s.mantle_kg, "tp %g: %g vs %g", tp, s.melt_kg, m);
        ck_assert_rel(s.dmelt_dtp_kg_k, (mb - ma) / 0.02, 1e-3);
    }
}
END_TEST

START_TEST(invalid_input)
{
    /* the promise of magma.h: -1 and a zeroed state on invalid input */
    vl_magma_params mp = earth_params(3e-5), bad;
    vl_magma_state s;
    ck_assert_int_eq(vl_magma_state_at(&mp, NAN, VL_R_EARTH, G_EARTH, &s), -1);
    ck_assert_double_eq(s.mantle_kg, 0.0);
    ck_assert_int_eq(vl_magma_state_at(&mp, 2000.0, -1.0, G_EARTH, &s), -1);
    ck_assert_int_eq(vl_magma_state_at(&mp, 2000.0, VL_R_EARTH, INFINITY, &s), -1);
    ck_assert_int_eq(vl_magma_state_at(NULL, 2000.0, VL_R_EARTH, G_EARTH, &s), -1);
    ck_assert_int_eq(vl_magma_state_at(&mp, 2000.0, VL_R_EARTH, G_EARTH, NULL), -1);
    bad = mp, bad.phi_rheo = 1.0;
    ck_assert_int_eq(vl_magma_state_at(&bad, 2000.0, VL_R_EARTH, G_EARTH, &s), -1);
    bad = mp, bad.core_radius_frac = 1.0;
    ck_assert_int_eq(vl_magma_state_at(&bad, 2000.0, VL_R_EARTH, G_EARTH, &s), -1);
    bad = mp, bad.alpha_k = 0.0;
    ck_assert_int_eq(vl_magma_state_at(&bad, 2000.0, VL_R_EARTH, G_EARTH, &s), -1);
    bad = mp, bad.latent_j_kg = -1.0;
    ck_assert_int_eq(vl_magma_state_at(&bad, 2000.0, VL_R_EARTH, G_EARTH, &s), -1);
    bad = mp, bad.core_radius_frac = 0.0; /* a planet without a core is valid */
    ck_assert_int_eq(vl_magma_state_at(&bad, 2000.0, VL_R_EARTH, G_EARTH, &s), 0);
}
END_TEST

START_TEST(iron_oxidation)
{
    /* [C] stoichiometry with IUPAC 2021 atomic weights: 8.05 wt% FeO (bulk silicate Earth,
     * McDonough & Sun 1995) is 0.0805 / 71.844 g/mol = 1.1205e-3 mol per g; half as many O,
     * x 15.999 g/mol = 8.963e-3 kg O per kg of melt */
    ck_assert_rel(vl_magma_o_capacity(VL_MAGMA_X_FEO_BSE), 8.963e-3, 1e-3);
    double melt = 1e22, cap = 8.963e-3 * melt;
    /* no oxygen taken: all iron ferrous; at capacity: all ferric (definition) */
    ck_assert_double_eq(vl_magma_fe3_ratio(0.0, melt, VL_MAGMA_X_FEO_BSE), 0.0);
    ck_assert_rel(vl_magma_fe3_ratio(cap, melt, VL_MAGMA_X_FEO_BSE), 1.0, 1e-3);
    ck_assert_double_eq(vl_magma_fe3_ratio(2.0 * cap, melt, VL_MAGMA_X_FEO_BSE), 1.0);
}
END_TEST

Suite *vl_suite_magma(void)
{
    Suite *s = suite_create("magma");
    TCase *tc = tcase_create("core");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, melting_curves_reproduce_fits);
    tcase_add_test(tc, melting_curves_join);
    tcase_add_test(tc, log_slope_monotone_between_breaks);
    tcase_add_test(tc, solubilities);
    tcase_add_test(tc, adiabat_gradient);
    tcase_add_test(tc, mantle_mass);
    tcase_add_test(tc, molten_and_frozen);
    tcase_add_test(tc, monotone_in_tp);
    tcase_add_test(tc, derivative_and_continuity);
    tcase_add_test(tc, latent_heat_budget);
    tcase_add_test(tc, brute_force_agrees);
    tcase_add_test(tc, grazing_crossings);
    tcase_add_test(tc, invalid_input);
    tcase_add_test(tc, iron_oxidation);
    suite_add_tcase(s, tc);
    return s;
}
