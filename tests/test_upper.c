/* test_upper.c: exobase, Jeans escape and magnetopause (docs/escape.md, "Upper atmosphere"). */
#include <string.h>

#include "suites.h"
#include "volev/model.h"
#include "volev/units.h"
#include "volev/upper.h"

START_TEST(jeans_hydrogen_earth)
{
    double lambda, m_h = VL_AW_H * VL_AMU;
    double n = 1e11;
    double phi = vl_upper_jeans_flux(n, m_h, 1000.0, 6871e3, VL_M_EARTH, &lambda);
    /* computed [C] from the Jeans formula (Jeans 1925; Chamberlain & Hunten 1987): H at
     * Earth, T_exo = 1000 K, r_exo = 6871 km: escape parameter G M m_H / (k T r) =
     * 3.9861e14 x 1.6735e-27 / (1.380649e-23 x 1000 x 6.871e6) = 7.03; effusion velocity
     * v0 (1 + lambda) e^-lambda / (2 sqrt(pi)), v0 = sqrt(2 k T / m_H) = 4.06 km/s: 8.1 m/s */
    ck_assert_rel(lambda, 7.03, 2e-3);
    ck_assert_rel(phi / n, 8.1, 5e-3);
    /* heavier particles: O's parameter is 16 times larger (m_O/m_H = 15.87) [C] */
    double lo;
    vl_upper_jeans_flux(n, VL_AW_O * VL_AMU, 1000.0, 6871e3, VL_M_EARTH, &lo);
    ck_assert_rel(lo / lambda, VL_AW_O / VL_AW_H, 1e-12);
}
END_TEST

START_TEST(magnetopause_earth)
{
    /* B_eq = 3.1e-5 T, n = 5 cm^-3 protons at 400 km/s: ~10 Earth radii (textbook 10-11) */
    double p_ram = 5e6 * 1.67262192e-27 * 4e5 * 4e5;
    double r = vl_upper_magnetopause_rp(3.1e-5, p_ram);
    ck_assert_msg(r > 9.5 && r < 11.0, "R_mp = %g R_E", r);
    ck_assert_double_eq(vl_upper_magnetopause_rp(0.0, p_ram), 0.0);
}
END_TEST

START_TEST(earth_upper_atmosphere)
{
    vl_status st;
    vl_scenario *sc = vl_scenario_new();
    ck_assert_ptr_nonnull(sc);
    ck_assert(vl_scenario_override(sc, "star.xuv.model=solar_ribas", &st) == VL_OK);
    vl_model *m = vl_model_new(sc, &st);
    ck_assert_msg(m != NULL, "%s", st.msg);
    double y[VL_NSTATE] = {0};
    y[VL_R_WATER] = VL_TO_KG;
    y[VL_R_N2] = 3.887e18; /* present atmospheric N2 [C] */
    y[VL_R_O2] = 1.185e18; /* present atmospheric O2, from memory */
    vl_env e;
    vl_model_env(m, vl_test_work(m), 4.57e9 * VL_YR, y, VL_REGIME_TEMPERATE, &e);
    /* dipole 8.0e22 A m^2 gives B_eq = mu0 M / (4 pi R^3) = 3.09e-5 T [C] */
    ck_assert_rel(e.upper.b_eq_t, 3.09e-5, 5e-3);
    /* present solar wind: magnetopause near 10 R_E (textbook 10-11) */
    ck_assert_msg(e.upper.r_mp_rp > 8.0 && e.upper.r_mp_rp < 12.0, "R_mp = %g", e.upper.r_mp_rp);
    /* polar caps: sin^2 theta = 1/R_mp, both caps 1 - cos theta of the surface, tapered
     * by 1 - r_obs/R_mp (docs/escape.md) [C]; Earth's auroral ovals near 70 deg latitude
     * (textbook) -> a few per cent */
    ck_assert_rel(e.upper.cap_fraction,
                  (1.0 - sqrt(1.0 - 1.0 / e.upper.r_mp_rp)) * (1.0 - sc->planet.obstacle_rp / e.upper.r_mp_rp),
                  1e-12);
    ck_assert(e.upper.cap_fraction > 0.03 && e.upper.cap_fraction < 0.08);
    /* present exobase: ~1000 K (mean solar activity) and a few hundred km (from memory) */
    ck_assert_msg(e.upper.t_exo_k > 900.0 && e.upper.t_exo_k < 1100.0, "T_exo = %g", e.upper.t_exo_k);
    double alt_km = (e.upper.r_exo_m - VL_R_EARTH) * 1e-3;
    ck_assert_msg(alt_km > 300.0 && alt_km < 700.0, "exobase at %g km", alt_km);
    /* the exobase criterion: n sigma H = 1 at the exobase [C] */
    double h = VL_K_BOLTZMANN * e.upper.t_exo_k / (e.upper.m_exo_kg * e.upper.g_exo);
    ck_assert_rel(e.upper.n_exo_m3 * sc->planet.cross_section_m2 * h, 1.0, 1e-12);
    /* an unmagnetised planet has the induced obstacle and no open caps */
    vl_test_model_free(m);
    ck_assert(vl_scenario_override(sc, "planet.dipole_moment_earth=0", &st) == VL_OK);
    m = vl_model_new(sc, &st);
    vl_model_env(m, vl_test_work(m), 4.57e9 * VL_YR, y, VL_REGIME_TEMPERATE, &e);
    ck_assert_double_eq(e.upper.r_mp_rp, sc->planet.obstacle_rp);
    ck_assert_double_eq(e.upper.cap_fraction, 0.0);
    /* CO2 cools the thermosphere (Venus, Mars: a few hundred K) */
    double t_n2 = e.upper.t_exo_k;
    y[VL_R_CO2] = 10.0 * y[VL_R_N2];
    vl_model_env(m, vl_test_work(m), 4.57e9 * VL_YR, y, VL_REGIME_TEMPERATE, &e);
    ck_assert(e.upper.t_exo_k < 0.5 * t_n2);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}
END_TEST

Suite *vl_suite_upper(void)
{
    Suite *s = suite_create("upper");
    TCase *tc = tcase_create("core");
    tcase_add_test(tc, jeans_hydrogen_earth);
    tcase_add_test(tc, magnetopause_earth);
    tcase_add_test(tc, earth_upper_atmosphere);
    suite_add_tcase(s, tc);
    return s;
}
