/* test_isotopes.c: deuterium carried by hydrogen (flux.c) and the fractionation factors
 * of thermal escape (escape.c). */
#include <string.h>

#include <gsl/gsl_errno.h>
#include <gsl/gsl_odeiv2.h>

#include "suites.h"
#include "volev/flux.h"
#include "volev/model.h"
#include "volev/output.h"
#include "volev/schema.h"
#include "volev/units.h"
#include "volev/escape.h"

typedef struct {
    double k;  /* first-order loss rate of the water, 1/s */
    double f;  /* fractionation factor */
} loss;

/* Water escapes to space at k y[WATER] kg/s through the flux API with factor f. */
static int loss_rhs(double t, const double y[], double dydt[], void *pv)
{
    const loss *l = pv;
    (void)t;
    memset(dydt, 0, VL_NRES * sizeof dydt[0]); /* the system below has VL_NRES components */
    static const vl_reaction escape[] = {
        {"2 H2O -> 4 H(space) + 2 O(space)", 3, {VL_R_WATER, VL_R_SPACE_H, VL_R_SPACE_O},
         {-2.0, 4.0, 2.0}}};
    vl_flux fx = {y, dydt, NULL, 0, NULL, 0, escape, 1};
    double mol_s = l->k * y[VL_R_WATER] / (2.0 * vl_species_molar_mass(VL_SP_H2O));
    vl_flux_react_f(&fx, 0, mol_s, -1, l->f);
    return GSL_SUCCESS;
}

START_TEST(rayleigh_distillation)
{
    /* Rayleigh distillation: a reservoir reduced to N/N0 with a constant fractionation
     * factor f keeps R/R0 = (N/N0)^(f - 1) (the Rayleigh distillation law, textbook) */
    double fs[3] = {0.2385, 0.5, 0.8};
    for (int i = 0; i < 3; i++) {
        loss l = {1e-3, fs[i]};
        double y[VL_NSTATE] = {0};
        y[VL_R_WATER] = VL_TO_KG;
        y[VL_R_D_WATER] = VL_TO_KG * vl_reservoir_element_fraction(VL_R_WATER, VL_EL_H) *
                          155.76e-6 * VL_AW_D / VL_AW_H;
        double r0 = vl_output_dh(y, VL_R_WATER);
        gsl_odeiv2_system sys = {loss_rhs, NULL, VL_NRES, &l};
        gsl_odeiv2_driver *d =
            gsl_odeiv2_driver_alloc_y_new(&sys, gsl_odeiv2_step_rk8pd, 1.0, 1e-14, 1e-13);
        double t = 0.0, t1 = log(100.0) / l.k; /* N/N0 = 1/100 */
        ck_assert_int_eq(gsl_odeiv2_driver_apply(d, &t, t1, y), GSL_SUCCESS);
        gsl_odeiv2_driver_free(d);
        double n = y[VL_R_WATER] / VL_TO_KG;
        ck_assert_rel(vl_output_dh(y, VL_R_WATER) / r0, pow(n, fs[i] - 1.0), 1e-6);
        /* deuterium conserved */
        double d0 = VL_TO_KG * vl_reservoir_element_fraction(VL_R_WATER, VL_EL_H) * 155.76e-6 *
                    VL_AW_D / VL_AW_H;
        ck_assert_rel(y[VL_R_D_WATER] + y[VL_R_SPACE_D], d0, 1e-10);
    }
}
END_TEST

START_TEST(fractionation_factors)
{
    double m_h = VL_AW_H * VL_AMU, m_d = VL_AW_D * VL_AMU;
    /* drag (Hunten, Pepin & Walker 1987): (m_c - m_D)/(m_c - m_H) [C] */
    ck_assert_rel(vl_escape_drag_fractionation(16.0 * m_h), (16.0 - VL_AW_D / VL_AW_H) / 15.0, 1e-12);
    ck_assert_double_eq(vl_escape_drag_fractionation(m_d), 0.0);
    ck_assert_double_eq(vl_escape_drag_fractionation(0.5 * (m_h + m_d)), 0.0); /* D left behind */
    ck_assert(vl_escape_drag_fractionation(1e6 * m_h) > 0.999);

    /* thermal escape on present Earth: diffusion-limited, so the factor is
     * (b_HD/b_H2)(m_a - m_HD)/(m_a - m_H2), b ~ mu^-1/2, the carriers below the homopause
     * being H2 and HD (Zahnle & Kasting 1986; Yung et al. 1988, from memory). With an N2
     * background [C]: mu_H2 = 2.016 x 28.014/30.030 = 1.8807, mu_HD = 3.0221 x 28.014 /
     * 31.036 = 2.7278, sqrt(1.8807/2.7278) = 0.8303, (28.014 - 3.0221)/(28.014 - 2.016) =
     * 0.9613: 0.7982, "about 0.8" (issue 16, from memory), where the atomic masses of H and
     * D gave 0.69 */
    ck_assert_rel(vl_escape_diffusion_fractionation(28.014 * VL_AMU, 0.0, 250.0), 0.7982, 2e-4);
    /* a steam upper atmosphere: H and D through atomic O [C]: mu_H = 1.008 x 15.999/17.007
     * = 0.94827, mu_D = 2.0141 x 15.999/18.013 = 1.78889, sqrt(0.53009) = 0.72807,
     * (15.999 - 2.0141)/(15.999 - 1.008) = 0.93289: 0.6792 */
    ck_assert_rel(vl_escape_diffusion_fractionation(28.014 * VL_AMU, 1.0, 250.0), 0.6792, 2e-4);
    /* the factor (m_bg - m_cD) takes it continuously to 0 as the background's mass comes
     * down to HD's (Hunten 1973's mass difference), and it stays 0 below */
    double m_hd = (VL_AW_H + VL_AW_D) * VL_AMU;
    ck_assert(vl_escape_diffusion_fractionation(m_hd * (1.0 + 1e-9), 0.0, 250.0) < 1e-8);
    ck_assert_double_eq(vl_escape_diffusion_fractionation(0.5 * m_hd, 0.0, 250.0), 0.0);

    vl_scenario *sc = vl_test_scenario(NULL, NULL, 0);
    vl_model *m = vl_test_model(sc);
    double y[VL_NSTATE] = {0};
    y[VL_R_WATER] = VL_TO_KG;
    y[VL_R_N2] = 3.887e18;
    y[VL_R_CO2] = 1e17; /* some CO2, most of it in the ocean: temperate, not a snowball */
    vl_env e;
    vl_model_env(m, vl_test_work(m), 4.57e9 * VL_YR, y, VL_REGIME_TEMPERATE, &e);
    ck_assert_int_eq(e.escape.h_limit, VL_HLIM_DIFFUSION);
    /* the N2 value [C] above; a trace of water-borne O and CO2 in the background */
    ck_assert_rel(e.escape.f_dl, 0.7982, 1e-3);
    ck_assert_rel(e.escape.d_frac, e.escape.f_dl, 1e-3);
    /* Jeans: D escapes far less readily than H: per-particle flux ratio at the exobase
     * sqrt(m_H/m_D)(1 + l_D)e^-l_D / ((1 + l_H)e^-l_H), l_D = l_H m_D/m_H (Jeans 1925;
     * Chamberlain & Hunten 1987), times the exobase's D/H over the homopause's, which
     * diffusive separation makes about 0.7 for Earth (issue 16, from memory) */
    double lh = e.escape.lambda_h, ld = lh * VL_AW_D / VL_AW_H;
    double per_particle = sqrt(VL_AW_H / VL_AW_D) * (1 + ld) * exp(-ld) / ((1 + lh) * exp(-lh));
    double separation = e.escape.f_jeans / per_particle;
    ck_assert_msg(separation > 0.6 && separation < 0.8, "separation %g", separation);
    ck_assert(e.escape.f_jeans < 0.1);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(diffusive_separation)
{
    /* D/H at the exobase over the homopause's, isotopes in diffusive equilibrium with
     * their own scale heights H_i = k T/(m_i g) (Chamberlain & Hunten 1987):
     * exp(-dz (m_D - m_H) g/(k T)). A textbook Earth thermosphere: 1000 K, homopause at
     * 100 km, exobase at 500 km (from memory), g = G M_E/(6871 km)^2 = 8.443 m/s^2 [C]:
     * 4e5 m x 1.006 x 1.6605e-27 kg x 8.443 / (1.3806e-23 x 1000) = 0.4086, e^-0.4086 =
     * 0.6645 [C]; about 0.7 (issue 16, from memory) */
    vl_upper u = {0};
    u.t_exo_k = 1000.0;
    u.r_tb_m = VL_R_EARTH + 100e3;
    u.r_exo_m = VL_R_EARTH + 500e3;
    u.g_exo = VL_G_NEWTON * VL_M_EARTH / (u.r_exo_m * u.r_exo_m);
    ck_assert_rel(vl_escape_jeans_separation(&u), 0.6645, 2e-3);
    /* a colder thermosphere separates more: at 500 K the exponent doubles [C], 0.6645^2 */
    u.t_exo_k = 500.0;
    ck_assert_rel(vl_escape_jeans_separation(&u), 0.6645 * 0.6645, 4e-3);
    /* no layer between homopause and exobase: no separation (common practice) */
    u.r_exo_m = u.r_tb_m;
    ck_assert_double_eq(vl_escape_jeans_separation(&u), 1.0);
    u.t_exo_k = 0.0; /* and no NaN from 0/0 */
    ck_assert_double_eq(vl_escape_jeans_separation(&u), 1.0);
}
END_TEST

START_TEST(enrichment_through_escape)
{
    /* a desiccating planet leaves deuterium-rich water behind (Venus: ~100x, Donahue et
     * al. 1982): the dry demo ends enriched more than tenfold, the Earth barely at all */
    vl_scenario *sc = vl_test_scenario("scenarios/demo-dry.cfg", NULL, 0);
    vl_model *m = vl_test_model(sc);
    vl_run_sink sink = {NULL, NULL, NULL};
    vl_run_stats s;
    vl_status st;
    ck_assert_msg(vl_integrate(m, &sink, &s, &st) == VL_OK, "%s", st.msg);
    vl_summary d;
    vl_summary_derive(m, &s, &d);
    double enrich = d.dh_enrichment; /* of the last water once it is exhausted */
    ck_assert_msg(enrich > 10.0, "enrichment %g", enrich);
    /* deuterium conserved over the whole run: the project's conservation criterion,
     * relative residual below 1e-8 (docs/model.md section 1) */
    ck_assert(fabs(s.totals1[VL_EL_D] - s.totals0[VL_EL_D]) < 1e-8 * s.totals0[VL_EL_D]);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

Suite *vl_suite_isotopes(void)
{
    Suite *s = suite_create("isotopes");
    TCase *tc = tcase_create("deuterium");
    tcase_set_timeout(tc, 60);
    tcase_add_test(tc, rayleigh_distillation);
    tcase_add_test(tc, fractionation_factors);
    tcase_add_test(tc, diffusive_separation);
    tcase_add_test(tc, enrichment_through_escape);
    suite_add_tcase(s, tc);
    return s;
}
