/* test_escape.c: hydrogen escape, oxygen drag and photolysis against values computed
 * from the published laws (Hunten 1973; Watson, Donahue & Walker 1981; Hunten, Pepin &
 * Walker 1987) and the measured present-Earth loss (Catling & Zahnle 2009). */
#include <stdlib.h>
#include <string.h>

#include "suites.h"
#include "volev/model.h"
#include "volev/units.h"
#include "volev/escape.h"

typedef struct {
    vl_scenario *sc;
    vl_model *m;
    vl_env env;
    double y[VL_NSTATE];
} fixture;

/* Present Earth: 1 M_earth, 1 R_earth, 1 bar N2 atmosphere, one ocean, defaults otherwise. */
static void setup_earth(fixture *f, const char *const *sets, size_t nsets)
{
    f->sc = vl_test_scenario(NULL, sets, nsets);
    f->m = vl_test_model(f->sc);
    memset(f->y, 0, sizeof f->y);
    f->y[VL_R_WATER] = VL_TO_KG;
    /* present atmospheric N2 [C]: 5.148e18 kg of air (total atmospheric mass, from
     * memory) x 0.7808 (N2 by volume, NSSDC) x 28.013/28.965 = 3.887e18 kg */
    f->y[VL_R_N2] = 3.887e18;
    /* some CO2 (280 ppmv of the air is 2.2e15 kg [C]; the ocean takes most of what is
     * given here): a temperate Earth, not the snowball an Earth without CO2 becomes */
    f->y[VL_R_CO2] = 1e17;
    vl_model_env(f->m, vl_test_work(f->m), 4.57e9 * VL_YR, f->y, VL_REGIME_TEMPERATE, &f->env);
}

static void teardown(fixture *f)
{
    vl_test_model_free(f->m);
    vl_scenario_free(f->sc);
}

/* The escape stage's limits at f->env, and the energy limit given to hydrogen alone
 * (no oxygen drag), into f->env.escape. */
static void budget_without_drag(fixture *f)
{
    vl_escape_params p = f->sc->escape;
    p.drag = 0;
    vl_escape_eval(&p, &f->m->planet, &f->env);
}

START_TEST(energy_limited_earth)
{
    fixture f;
    const char *sets[] = {"escape.roche_lobe=false"};
    setup_earth(&f, sets, 1);
    f.env.f_xuv = 4.6e-3; /* Ribas et al. 2005: 4.6 erg cm^-2 s^-1 today at 1 au */
    budget_without_drag(&f);
    /* computed [C] from the energy-limited formula (Watson, Donahue & Walker 1981, Icarus
     * 48:150): Earth today, eps = 0.15, F = 4.6e-3 W/m^2, no Roche factor:
     * eps pi R^3 F / (G M) = 0.15 pi (6.371e6 m)^3 4.6e-3 / 3.9861e14 = 1.41e3 kg/s */
    ck_assert_rel(f.env.escape.mass_flux * f.m->planet.area_m2, 1.41e3, 5e-3);
    /* far above the diffusion limit, so hydrogen escape, the least of its limits
     * (docs/escape.md), is diffusion-limited */
    ck_assert_int_eq(f.env.escape.h_limit, VL_HLIM_DIFFUSION);
    teardown(&f);
}
END_TEST

START_TEST(roche_factor_raises_loss)
{
    fixture f;
    const char *sets[] = {"planet.orbit_au=0.0213", "star.mass_msun=0.12"};
    setup_earth(&f, sets, 2);
    f.env.f_xuv = 4.6e-3;
    budget_without_drag(&f);
    double with_k = f.env.escape.mass_flux;
    teardown(&f);
    const char *sets2[] = {"planet.orbit_au=0.0213", "star.mass_msun=0.12",
                           "escape.roche_lobe=false"};
    setup_earth(&f, sets2, 3);
    f.env.f_xuv = 4.6e-3;
    budget_without_drag(&f);
    /* Erkaev et al. 2007 eq. 17: xi = a (Mp/3M*)^(1/3)/Rp, K = 1 - 3/(2xi) + 1/(2xi^3) [C] */
    double xi = 0.0213 * VL_AU * cbrt(VL_M_EARTH / (3.0 * 0.12 * VL_M_SUN)) / VL_R_EARTH;
    double k = 1.0 - 1.5 / xi + 0.5 / (xi * xi * xi);
    ck_assert_rel(with_k, f.env.escape.mass_flux / k, 1e-12);
    ck_assert(k < 0.9);
    teardown(&f);
}
END_TEST

START_TEST(diffusion_limit_earth)
{
    fixture f;
    setup_earth(&f, NULL, 0);
    f.env.f_strat = 7.6e-6; /* total hydrogen above the cold trap, Catling & Kasting 2017 */
    budget_without_drag(&f);
    double m_h = VL_AW_H * VL_AMU;
    double kg_s = f.env.escape.h_diffusion * f.m->planet.area_m2 * m_h;
    /* Catling & Zahnle 2009, Sci. Am. 300(5):36: present Earth loses ~3 kg/s of hydrogen */
    ck_assert_msg(kg_s > 2.0 && kg_s < 4.5, "diffusion-limited H loss %g kg/s", kg_s);
    /* Catling & Kasting 2017 (from memory): phi = 2.5e13 f_T H2 cm^-2 s^-1, f_T = 7.6 ppmv */
    double ck = 2.0 * 2.5e17 * 7.6e-6 * f.m->planet.area_m2 * m_h;
    ck_assert_rel(kg_s, ck, 0.2);
    teardown(&f);
}
END_TEST

START_TEST(diffusion_limit_saturates)
{
    fixture f;
    setup_earth(&f, NULL, 0);
    double m_n2 = vl_species_molar_mass(VL_SP_N2) / VL_AVOGADRO;
    /* as many H2 molecules as N2 (x_H2 = 1/2, f = H2/N2 = 1), no water-borne O: Hunten
     * 1973's limit for a non-trace gas, b f/(1 + f)/H_a (1 - m_H2/m_a), in the present-
     * Earth form 2.5e13 f/(1 + f) H2 cm^-2 s^-1 (Catling & Kasting 2017, from memory),
     * half what the trace-gas form 2.5e13 f gives; twice that in H atoms */
    f.env.f_strat = 1e-12;
    f.env.x[VL_GAS_H2] = 0.5;
    f.env.m_background_kg = m_n2;
    budget_without_drag(&f);
    double half = f.env.escape.h_diffusion;
    ck_assert_rel(half, 2.0 * 2.5e17 * 1.0 / (1.0 + 1.0), 0.2);
    /* f_T is already the mole fraction x = f/(1 + f): a further 1/(1 + x) would make it
     * 2/3 of this, outside the 20 %; nearly pure H2 (x = 0.99, f = 99) gets within 1 %
     * of the saturated flux 2.5e13 f/(1 + f) -> 2.5e13 per H2, never above it */
    f.env.x[VL_GAS_H2] = 0.99;
    budget_without_drag(&f);
    ck_assert_rel(f.env.escape.h_diffusion, 2.0 * half * 0.99, 1e-9);
    ck_assert(f.env.escape.h_diffusion < 2.0 * half);
    teardown(&f);
}
END_TEST

START_TEST(crossover_flux_earth)
{
    fixture f;
    setup_earth(&f, NULL, 0);
    double m_h = VL_AW_H * VL_AMU, m_o = VL_AW_O * VL_AMU;
    /* computed [C] from the crossover flux of Hunten, Pepin & Walker 1987 (Icarus 69:532),
     * F_ref = X_H b g (m_O - m_H) / (k T): Earth, 400 K, X_H = 2/3, b(H-O) = 4.8e17 x
     * 400^0.75 cm^-1 s^-1 (Zahnle & Kasting 1986, from memory), g = 982 cm s^-2:
     * 2/3 x 4.29e19 x 982 x (15.999 - 1.008) 1.6605e-24 g / (1.380649e-16 x 400) erg
     * = 1.27e13 cm^-2 s^-1 */
    double f_ref = 1.27e17;
    f.env.escape.h_diffusion = HUGE_VAL;
    f.env.escape.h_jeans = HUGE_VAL; /* test the drag law alone: no exobase cap */
    f.env.escape.hydro = 0.0;
    f.env.escape.mass_flux = 0.99 * f_ref * m_h;
    vl_escape_share(&f.sc->escape, &f.env);
    ck_assert_double_eq(f.env.escape.o_flux, 0.0);
    f.env.escape.mass_flux = 1.01 * f_ref * m_h;
    vl_escape_share(&f.sc->escape, &f.env);
    ck_assert(f.env.escape.o_flux > 0.0);
    /* far above the crossover: the shared mass flux is conserved, and O/H tends to
     * X_O/X_H = 1/2 (water photolysis products) */
    f.env.escape.mass_flux = 1e4 * f_ref * m_h;
    vl_escape_share(&f.sc->escape, &f.env);
    ck_assert_rel(m_h * f.env.escape.h_flux + m_o * f.env.escape.o_flux, f.env.escape.mass_flux, 1e-12);
    ck_assert_rel(f.env.escape.o_flux / f.env.escape.h_flux, 0.5, 1e-3);
    teardown(&f);
}
END_TEST

START_TEST(photolysis_follows_escape)
{
    /* the water's other redox processes off: photolysis alone turns water into escaping
     * hydrogen and O2 */
    static const char *const sets[] = {"processes.photochemical_h2.enabled=false",
                                       "processes.volcanic_reductants.enabled=false"};
    fixture f;
    setup_earth(&f, sets, 2);
    double dydt[VL_NSTATE];
    vl_env env;
    vl_model_rhs(f.m, vl_test_work(f.m), 4.57e9 * VL_YR, f.y, VL_REGIME_TEMPERATE, dydt, NULL, &env);
    /* all homopause hydrogen is water-borne here: water is lost at 18.015/2.016 times
     * the H escape rate (stoichiometry of 2 H2O -> 4 H + O2), H escape equals the
     * diffusion limit, and O2 is left behind at 31.998/4.032 times the H rate */
    double h_rate = dydt[VL_R_SPACE_H];
    ck_assert_rel(h_rate, env.escape.h_diffusion * f.m->planet.area_m2 * VL_AW_H * VL_AMU, 1e-9);
    ck_assert_rel(-dydt[VL_R_WATER], h_rate * 18.015 / 2.016, 1e-9);
    ck_assert_double_eq(dydt[VL_R_H2], 0.0);
    /* plus the oxygen of the CO2 lost to space as C + 2 O (nonthermal.c) */
    double o_of_co2 = dydt[VL_R_SPACE_C] * 2.0 * 15.999 / 12.011;
    ck_assert_rel(dydt[VL_R_O2] + dydt[VL_R_SPACE_O] + dydt[VL_R_OX_ROCK] - o_of_co2, h_rate * 31.998 / 4.032, 1e-9);
    teardown(&f);
}
END_TEST

START_TEST(photon_limit_caps)
{
    fixture f;
    const char *sets[] = {"processes.photolysis.photon_limited=true",
                          "processes.photolysis.photon_efficiency=1e-12"};
    setup_earth(&f, sets, 2);
    double dydt[VL_NSTATE], cols[2];
    vl_env env;
    vl_model_env(f.m, vl_test_work(f.m), 4.57e9 * VL_YR, f.y, VL_REGIME_TEMPERATE, &env);
    vl_test_process_rates(f.m, "photolysis", f.y, &env, dydt, cols);
    /* cap = eta F_photon A / 4 molecules/s (Luger & Barnes 2015's photon limit; one
     * incident photon per dissociation at efficiency eta) */
    double cap_mol = 1e-12 * env.lya_flux * f.m->planet.area_m2 / 4.0 / VL_AVOGADRO;
    ck_assert_rel(cols[0], cap_mol * vl_species_molar_mass(VL_SP_H2O), 1e-12);
    teardown(&f);
}
END_TEST

START_TEST(diffusion_through_background)
{
    fixture f;
    setup_earth(&f, NULL, 0);
    double m_n2 = vl_species_molar_mass(VL_SP_N2) / VL_AVOGADRO;
    double m_co2 = vl_species_molar_mass(VL_SP_CO2) / VL_AVOGADRO;
    f.env.f_strat = 1e-12; /* a molecular background: no water-borne O */
    f.env.m_background_kg = m_n2;
    budget_without_drag(&f);
    double in_n2 = f.env.escape.h_diffusion;
    f.env.m_background_kg = m_co2;
    budget_without_drag(&f);
    /* Hunten 1973: phi ~ (m_a - m_H2); CO2 against N2: (44.009 - 2.016)/(28.014 - 2.016) [C] */
    ck_assert_rel(f.env.escape.h_diffusion / in_n2, (44.009 - 2.016) / (28.014 - 2.016), 1e-9);
    (void)m_co2;
    /* a steam upper atmosphere (f_strat = 1): atomic H through atomic O, b(H-O) =
     * 4.8e17 T^0.75 cm^-1 s^-1 (Zahnle & Kasting 1986, from memory), 250 K [C]; water
     * dissociated into 2 H + O makes H a major gas, H/O = f = 2, whose mole fraction is
     * f/(1 + f) = 2/3 (Hunten 1973's 1/(1 + f) for a non-trace gas). This expectation was
     * 2 (two H atoms per molecule of steam, the trace-gas formula) before issue 16 */
    f.env.f_strat = 1.0;
    budget_without_drag(&f);
    double b = 4.8e19 * pow(250.0, 0.75);
    double want = 2.0 / 3.0 * b * f.env.g * (VL_AW_O - VL_AW_H) * VL_AMU / (VL_K_BOLTZMANN * 250.0);
    ck_assert_rel(f.env.escape.h_diffusion, want, 1e-9);
    teardown(&f);
}
END_TEST

START_TEST(jeans_and_hydrodynamic_limits)
{
    fixture f;
    setup_earth(&f, NULL, 0);
    f.env.f_strat = 7.6e-6;
    f.env.f_xuv = 4.6e-3;
    /* a cold exobase: the Jeans limit binds (lambda ~ 23) */
    f.env.upper.t_exo_k = 300.0;
    budget_without_drag(&f);
    ck_assert_int_eq(f.env.escape.h_limit, VL_HLIM_JEANS);
    ck_assert_double_eq(f.env.escape.h_flux, f.env.escape.h_jeans);
    ck_assert(f.env.escape.lambda_h > 20.0);
    /* the escape parameter scales as 1/T_exo (Jeans formula) [C] */
    double l300 = f.env.escape.lambda_h;
    f.env.upper.t_exo_k = 600.0;
    budget_without_drag(&f);
    ck_assert_rel(f.env.escape.lambda_h, 0.5 * l300, 1e-12);
    /* across the critical parameter (2.5) the hydrodynamic weight passes 1/2 continuously */
    double lc = 2.5, t_c = 300.0 * l300 / lc;
    f.env.upper.t_exo_k = t_c * (1.0 - 1e-9);
    budget_without_drag(&f);
    ck_assert_rel(f.env.escape.hydro, 0.5, 1e-6);
    f.env.upper.t_exo_k = t_c * (1.0 + 1e-9);
    budget_without_drag(&f);
    ck_assert_rel(f.env.escape.hydro, 0.5, 1e-6);
    /* hydrogen is a trace here (f_T = 7.6e-6) and O is far from its own critical
     * parameter (lambda_O = 16 lambda_H = 40): the bulk stays kinetic, the weight is
     * s_H w_H = 2 f_T/(1 + f_T) x 0.5 (escape.c) [C] */
    ck_assert_rel(f.env.escape.bulk_hydro, 7.6e-6 / (1.0 + 7.6e-6), 1e-5);
    /* the cap blends min(Jeans, energy) into the energy limit with that weight */
    vl_env e = f.env;
    e.escape.h_diffusion = HUGE_VAL;
    e.escape.h_jeans = 2.385e10;
    e.escape.hydro = 0.25;
    vl_escape_h_flux(&e.escape, 1.7e14);
    ck_assert_rel(e.escape.h_flux, 0.75 * 2.385e10 + 0.25 * 1.7e14, 1e-12);
    /* deep in the hydrodynamic regime, with water-rich diffusion: energy-limited */
    f.env.f_strat = 1.0;
    f.env.upper.t_exo_k = 20.0 * t_c;
    budget_without_drag(&f);
    ck_assert_double_eq(f.env.escape.hydro, 1.0);
    /* a steam upper atmosphere (f_T = 1: all atoms H or O) flows out as a whole */
    ck_assert_double_eq(f.env.escape.bulk_hydro, 1.0);
    ck_assert_int_eq(f.env.escape.h_limit, VL_HLIM_ENERGY);
    ck_assert_rel(f.env.escape.h_flux, f.env.escape.mass_flux / (VL_AW_H * VL_AMU), 1e-12);
    teardown(&f);
}
END_TEST

START_TEST(radiative_cooling_option)
{
    fixture f;
    const char *sets[] = {"escape.radiative_cooling=true",
                          "escape.cooling_co2=3.7"};
    setup_earth(&f, sets, 2);
    f.env.f_xuv = 4.6e-3;
    f.env.f_strat = 0.0;
    f.env.x[VL_GAS_CO2] = 0.0;
    budget_without_drag(&f);
    double base = f.env.escape.mass_flux;
    f.env.x[VL_GAS_CO2] = 0.965; /* Venus-like */
    budget_without_drag(&f);
    /* eps / (1 + c_CO2 x_CO2) (docs/escape.md) [C] */
    ck_assert_rel(f.env.escape.mass_flux, base / (1.0 + 3.7 * 0.965), 1e-12);
    teardown(&f);
}
END_TEST

START_TEST(oxygen_jeans)
{
    fixture f;
    setup_earth(&f, NULL, 0);
    f.y[VL_R_O2] = 1.2e18;
    double dydt[VL_NSTATE], *cols = calloc(f.m->ncolumns, sizeof *cols);
    int k = -1;
    for (size_t i = 0; i < f.m->ncolumns; i++)
        if (strcmp(f.m->col_name[i], "jeans_o_kg_s") == 0)
            k = (int)i;
    ck_assert_int_ge(k, 0);
    vl_env e;
    vl_model_rhs(f.m, vl_test_work(f.m), 4.57e9 * VL_YR, f.y, VL_REGIME_TEMPERATE, dydt, cols, &e);
    /* Earth today: lambda_O ~ 16 lambda_H ~ 110: O Jeans loss negligible (< 1 g/s) */
    ck_assert(cols[k] >= 0.0 && cols[k] < 1e-3);
    free(cols);
    teardown(&f);
}
END_TEST

Suite *vl_suite_escape(void)
{
    Suite *s = suite_create("escape");
    TCase *tc = tcase_create("core");
    tcase_add_test(tc, energy_limited_earth);
    tcase_add_test(tc, roche_factor_raises_loss);
    tcase_add_test(tc, diffusion_limit_earth);
    tcase_add_test(tc, diffusion_limit_saturates);
    tcase_add_test(tc, crossover_flux_earth);
    tcase_add_test(tc, photolysis_follows_escape);
    tcase_add_test(tc, photon_limit_caps);
    tcase_add_test(tc, diffusion_through_background);
    tcase_add_test(tc, jeans_and_hydrodynamic_limits);
    tcase_add_test(tc, radiative_cooling_option);
    tcase_add_test(tc, oxygen_jeans);
    suite_add_tcase(s, tc);
    return s;
}
