/* test_star.c: stellar tracks, XUV, Lyman-alpha, wind and track files (src/physics/star.c).
 * Tags: [C] computed from the stated formula; [V] read in the cited source. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "suites.h"
#include "volev/star.h"
#include "volev/units.h"

#define GYR (1.0e9 * VL_YR)
#define MYR (1.0e6 * VL_YR)

/* The present Sun with the scenario defaults of src/input/params_core.c. */
static vl_star_params sun_params(void)
{
    vl_star_params p;
    memset(&p, 0, sizeof p);
    p.mass_kg = VL_M_SUN;
    p.teff_k = 5772.0;
    p.luminosity_model = VL_LUM_SUN_ANALYTIC;
    p.luminosity_w = VL_L_SUN;
    p.present_age_s = 4.57 * GYR;
    p.contraction_end_s = 1.0 * GYR;
    p.xuv_model = VL_XUV_SOLAR_RIBAS;
    p.xuv_sat_ratio = 1e-3;
    p.xuv_sat_end_s = 0.1 * GYR;
    p.xuv_decay_exp = 1.23;
    p.lya_photon_flux = 3.0e15;           /* 3.0e11 cm^-2 s^-1 (Tobiska et al. 1997) */
    p.wind_mdot_kg_s = 2e-14 * VL_M_SUN / VL_YR;
    p.wind_speed_m_s = 4.0e5;
    p.wind_ref_age_s = 4.57 * GYR;
    p.wind_decay_exp = 2.33;
    return p;
}

/* Build a star and evaluate it at t_s; the run covers [t0_s, t1_s]. */
static vl_star_state eval_at(const vl_star_params *p, double t0_s, double t1_s, double t_s)
{
    vl_status st;
    vl_status_clear(&st);
    vl_star *s = vl_star_new(p, t0_s, t1_s, &st);
    ck_assert_msg(s != NULL, "vl_star_new: %s", st.msg);
    vl_star_state out;
    vl_star_eval(s, t_s, &out);
    vl_star_free(s);
    return out;
}

/* Write text to a fresh temporary file; path receives its name. */
static void write_temp(char path[64], const char *text)
{
    snprintf(path, 64, "%s", "/tmp/volev_track_XXXXXX");
    int fd = mkstemp(path);
    ck_assert_int_ge(fd, 0);
    FILE *f = fdopen(fd, "w");
    ck_assert_ptr_nonnull(f);
    fputs(text, f);
    ck_assert_int_eq(fclose(f), 0);
}

/* A table star from text for a run over [t0_yr, t1_yr]; the file is removed after. */
static vl_star *table_star(const char *text, double t0_yr, double t1_yr, vl_status *st,
                           char path[64])
{
    write_temp(path, text);
    vl_star_params p = sun_params();
    p.luminosity_model = VL_LUM_TABLE;
    p.xuv_model = VL_XUV_RATIO;
    snprintf(p.track_file, sizeof p.track_file, "%s", path);
    vl_status_clear(st);
    vl_star *s = vl_star_new(&p, t0_yr * VL_YR, t1_yr * VL_YR, st);
    unlink(path);
    return s;
}

/* The track must be rejected with code, line and a message containing want. */
static void expect_table_error(const char *text, double t0_yr, double t1_yr, int code,
                               int line, const char *want)
{
    vl_status st;
    char path[64];
    vl_star *s = table_star(text, t0_yr, t1_yr, &st, path);
    ck_assert_msg(s == NULL, "accepted a bad track:\n%s", text);
    ck_assert_int_eq(st.code, code);
    ck_assert_int_eq(st.line, line);
    ck_assert_str_eq(st.file, path);
    ck_assert_msg(strstr(st.msg, want) != NULL, "message '%s' lacks '%s'", st.msg, want);
}

START_TEST(test_gough)
{
    double now = 4.57 * GYR;
    /* Gough 1981, Sol. Phys. 74:21: L(0)/L_now = 1/1.4 = 0.714 [C] ("about 70 %" [V]) */
    ck_assert_rel(vl_star_gough_ratio(0.0, now), 0.714, 1e-3);
    ck_assert_rel(vl_star_gough_ratio(0.0, now), 1.0 / 1.4, 1e-14);
    /* Gough 1981: one Gyr after today 1/(1 - 0.4/4.57) = 1.096 [C] */
    ck_assert_rel(vl_star_gough_ratio(now + GYR, now), 1.096, 1e-3);
    /* Gough 1981: L(t_now) = L_now by construction [C] */
    vl_star_params p = sun_params();
    ck_assert_rel(eval_at(&p, 1e7 * VL_YR, now, now).l_bol_w, VL_L_SUN, 1e-14);
    /* Gough 1981 at 1 Gyr with L_now = 2.385 W: 2.385/(1 + 0.4 (1 - 1/4.57)) [C] */
    p.luminosity_w = 2.385;
    ck_assert_rel(eval_at(&p, 1e7 * VL_YR, now, GYR).l_bol_w,
                  2.385 / (1.0 + 0.4 * (1.0 - 1.0 / 4.57)), 1e-14);
}
END_TEST

START_TEST(test_gough_range)
{
    vl_star_params p = sun_params();
    vl_status st;
    vl_status_clear(&st);
    /* Gough 1981: the denominator vanishes at 3.5 t_now = 16.0 Gyr [C]: refused */
    ck_assert_ptr_null(vl_star_new(&p, 1e7 * VL_YR, 16.0 * GYR, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, "sun_analytic"));
    vl_star *s = vl_star_new(&p, 1e7 * VL_YR, 15.9 * GYR, &st);
    ck_assert_ptr_nonnull(s);
    vl_star_free(s);
    /* ages must satisfy 0 < start <= end */
    vl_status_clear(&st);
    ck_assert_ptr_null(vl_star_new(&p, 0.0, GYR, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    vl_status_clear(&st);
    ck_assert_ptr_null(vl_star_new(&p, 2.0 * GYR, GYR, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
}
END_TEST

START_TEST(test_ribas)
{
    /* Ribas et al. 2005, ApJ 622:680: 29.7 x 4.56^-1.23 = 4.6 erg cm^-2 s^-1 today [C],
     * 1 erg cm^-2 s^-1 = 1e-3 W/m^2 */
    ck_assert_rel(vl_star_ribas_flux_1au(4.56 * GYR), 4.6e-3, 0.01);
    /* Ribas et al. 2005: 100-1000 x present for the young Sun [V] */
    double young = vl_star_ribas_flux_1au(0.05 * GYR) / vl_star_ribas_flux_1au(4.56 * GYR);
    ck_assert_msg(young >= 100.0 && young <= 1000.0, "young/present = %g", young);
    /* Ribas et al. 2005: held at its 0.1 Gyr value, 29.7 x 0.1^-1.23 = 504.4 erg [C] */
    ck_assert_rel(vl_star_ribas_flux_1au(0.01 * GYR), 0.5044, 1e-4);
    ck_assert_rel(vl_star_ribas_flux_1au(0.1 * GYR), 0.5044, 1e-4);
    /* solar_ribas model: L_XUV = F(1 au) 4 pi au^2 [C] */
    vl_star_params p = sun_params();
    double t = 2.385 * GYR;
    ck_assert_rel(eval_at(&p, 1e7 * VL_YR, 4.57 * GYR, t).l_xuv_w,
                  vl_star_ribas_flux_1au(t) * 4.0 * VL_PI * VL_AU * VL_AU, 1e-14);
}
END_TEST

START_TEST(test_xuv_ratio)
{
    vl_star_params p = sun_params();
    p.luminosity_model = VL_LUM_CONSTANT;
    p.luminosity_w = 0.0123 * VL_L_SUN;
    p.xuv_model = VL_XUV_RATIO;
    p.xuv_sat_end_s = GYR;
    double t0 = 1e6 * VL_YR, t1 = 10.0 * GYR;
    /* Luger & Barnes 2015 form: L_XUV = f_sat L_bol while saturated [C] */
    ck_assert_rel(eval_at(&p, t0, t1, 0.5 * GYR).l_xuv_w, 1e-3 * 0.0123 * VL_L_SUN, 1e-14);
    ck_assert_rel(eval_at(&p, t0, t1, GYR).l_xuv_w, 1e-3 * 0.0123 * VL_L_SUN, 1e-14);
    /* Luger & Barnes 2015 form: after saturation f_sat L_bol (t/t_sat)^-1.23;
     * 4^-1.23 = 0.18175 [C] */
    ck_assert_rel(eval_at(&p, t0, t1, 4.0 * GYR).l_xuv_w, 1e-3 * 0.0123 * VL_L_SUN * 0.18175,
                  1e-4);
    /* the same just after saturation: 1.5^-1.23 = 0.607306 [C] */
    ck_assert_rel(eval_at(&p, t0, t1, 1.5 * GYR).l_xuv_w, 1e-3 * 0.0123 * VL_L_SUN * 0.607306,
                  1e-5);
}
END_TEST

START_TEST(test_lya)
{
    vl_star_params p = sun_params();
    double now = 4.57 * GYR;
    /* normalisation: the present Sun (Ribas at 4.57 Gyr) gives the scenario's 1-au flux [C] */
    ck_assert_rel(eval_at(&p, 1e7 * VL_YR, now, now).lya_flux_1au, 3.0e15, 1e-13);
    /* assumption in star.c: photon flux scales with L_XUV; at 0.05 Gyr the Ribas flux is
     * 29.7 x 0.1^-1.23 / (29.7 x 4.57^-1.23) = 504.378 / 4.58205 = 110.077 x today's [C] */
    vl_star_state young = eval_at(&p, 1e7 * VL_YR, now, 0.05 * GYR);
    ck_assert_rel(young.lya_flux_1au / 3.0e15, 110.0771, 1e-6);
    /* ratio model, dim star: flux ratio = L_XUV / L_XUV,sun,now [C] */
    p.luminosity_model = VL_LUM_CONSTANT;
    p.luminosity_w = 0.01 * VL_L_SUN;
    p.xuv_model = VL_XUV_RATIO;
    vl_star_state m = eval_at(&p, 1e7 * VL_YR, now, 0.05 * GYR);
    double l_xuv_sun = vl_star_ribas_flux_1au(now) * 4.0 * VL_PI * VL_AU * VL_AU;
    ck_assert_rel(m.lya_flux_1au, 3.0e15 * 1e-3 * 0.01 * VL_L_SUN / l_xuv_sun, 1e-13);
}
END_TEST

START_TEST(test_contracting)
{
    vl_star_params p = sun_params();
    p.luminosity_model = VL_LUM_CONTRACTING;
    p.luminosity_w = 1.2e-3 * VL_L_SUN;
    p.teff_k = 2650.0;
    double t0 = 1e6 * VL_YR, t1 = 8.0 * GYR;
    vl_star_state a = eval_at(&p, t0, t1, 10.0 * MYR);
    vl_star_state b = eval_at(&p, t0, t1, 80.0 * MYR);
    /* Hayashi-track scaling L ~ t^-2/3 (textbook): L(10 Myr)/L(80 Myr) = 8^(2/3) = 4 [C] */
    ck_assert_rel(a.l_bol_w / b.l_bol_w, 4.0, 1e-13);
    /* the same: L(10 Myr) = L_ms (0.01)^(-2/3) = 21.544 L_ms with t_ms = 1 Gyr [C] */
    ck_assert_rel(a.l_bol_w, 21.544347 * 1.2e-3 * VL_L_SUN, 1e-7);
    /* constant on the main sequence [C] */
    ck_assert_rel(eval_at(&p, t0, t1, 2.0 * GYR).l_bol_w, 1.2e-3 * VL_L_SUN, 1e-15);
    /* Teff held at the scenario value while contracting (textbook: nearly constant) */
    ck_assert_rel(a.teff_k, 2650.0, 1e-15);
}
END_TEST

START_TEST(test_wind_and_orbit)
{
    vl_star_params p = sun_params();
    double mdot = 2e-14 * VL_M_SUN / VL_YR;
    /* wind at the reference age equals the scenario value [C] */
    ck_assert_rel(eval_at(&p, 1e7 * VL_YR, 9.0 * GYR, 4.57 * GYR).wind_mdot_kg_s, mdot, 1e-14);
    /* Wood et al. 2005: Mdot ~ t^-2.33; at twice the age 2^-2.33 = 0.198884 [C] */
    vl_star_state s = eval_at(&p, 1e7 * VL_YR, 9.14 * GYR, 9.14 * GYR);
    ck_assert_rel(s.wind_mdot_kg_s, mdot * 0.19888412, 1e-7);
    ck_assert_rel(s.wind_speed_m_s, 4.0e5, 1e-15);
    /* IAU 2015 L_sun over 4 pi au^2 = 1361.17 W/m^2 [C]; solar constant 1361 (common practice) */
    ck_assert_rel(vl_star_orbit_flux(VL_L_SUN, VL_AU, 0.0), 1361.1665, 1e-7);
    ck_assert_rel(vl_star_orbit_flux(VL_L_SUN, VL_AU, 0.0), VL_S_EARTH, 2e-4);
    /* orbit average divides by sqrt(1 - e^2) = 0.8 at e = 0.6 [C] */
    ck_assert_rel(vl_star_orbit_flux(VL_L_SUN, VL_AU, 0.6), 1361.1665 / 0.8, 1e-7);
}
END_TEST

START_TEST(test_non_table_ignores_file)
{
    /* vl_star_new must not touch files for a non-table model */
    vl_star_params p = sun_params();
    p.luminosity_model = VL_LUM_CONSTANT;
    snprintf(p.track_file, sizeof p.track_file, "%s", "/nonexistent/volev/track.csv");
    vl_status st;
    vl_status_clear(&st);
    vl_star *s = vl_star_new(&p, 1e7 * VL_YR, GYR, &st);
    ck_assert_ptr_nonnull(s);
    vl_star_free(s);
    vl_star_free(NULL);
}
END_TEST

static const char *const good_track =
    "# a test track; columns in a shuffled order\r\n"
    "\n"
    " luminosity_lsun , age_yr,teff_k,xuv_lsun\r\n"
    "0.5,1e6,3000,5e-4\n"
    "   # comment between rows\n"
    "0.2,1e7,2900,2.1e-4\n"
    "0.05,1e8,2800,4e-5\n"
    "\n"
    "0.02,1e9,2750,3e-6\n"
    "0.019,1e10,2700,1e-7\n";

START_TEST(test_table_nodes)
{
    vl_status st;
    char path[64];
    vl_star *s = table_star(good_track, 1e6, 1e10, &st, path);
    ck_assert_msg(s != NULL, "%s", st.msg);
    static const double age[] = {1e6, 1e7, 1e8, 1e9, 1e10};
    static const double lum[] = {0.5, 0.2, 0.05, 0.02, 0.019};
    static const double teff[] = {3000, 2900, 2800, 2750, 2700};
    static const double xuv[] = {5e-4, 2.1e-4, 4e-5, 3e-6, 1e-7};
    for (int i = 0; i < 5; i++) {
        vl_star_state o;
        vl_star_eval(s, age[i] * VL_YR, &o);
        /* track values at the nodes (interpolation passes through them) [C] */
        ck_assert_rel(o.l_bol_w, lum[i] * VL_L_SUN, 1e-12);
        ck_assert_rel(o.teff_k, teff[i], 1e-12);
        ck_assert_rel(o.l_xuv_w, xuv[i] * VL_L_SUN, 1e-12);
    }
    /* Steffen 1990: monotone between nodes, no overshoot [C] */
    for (int i = 0; i < 4; i++)
        for (double f = 1.1; f < 10.0; f *= 1.7) {
            vl_star_state o;
            vl_star_eval(s, age[i] * f * VL_YR, &o);
            ck_assert(o.l_bol_w < lum[i] * VL_L_SUN && o.l_bol_w > lum[i + 1] * VL_L_SUN);
            ck_assert(o.teff_k < teff[i] && o.teff_k > teff[i + 1]);
        }
    /* never extrapolated: NaN outside the track [C] */
    vl_star_state o;
    vl_star_eval(s, 0.9e6 * VL_YR, &o);
    ck_assert(isnan(o.l_bol_w) && isnan(o.teff_k) && isnan(o.l_xuv_w));
    vl_star_eval(s, 1.01e10 * VL_YR, &o);
    ck_assert(isnan(o.l_bol_w));
    vl_star_free(s);
}
END_TEST

START_TEST(test_table_loglog)
{
    vl_status st;
    char path[64];
    vl_star *s = table_star("age_yr,luminosity_lsun\n1e8,2.0\n1e9,0.5\n", 1e8, 1e9, &st, path);
    ck_assert_msg(s != NULL, "%s", st.msg);
    vl_star_state o;
    vl_star_eval(s, sqrt(1e8 * 1e9) * VL_YR, &o);
    /* log-log line: at the geometric mean age L = sqrt(2.0 x 0.5) = 1 L_sun [C] */
    ck_assert_rel(o.l_bol_w, VL_L_SUN, 1e-12);
    /* no teff_k column: the scenario Teff [C] */
    ck_assert_rel(o.teff_k, 5772.0, 1e-15);
    /* no xuv_lsun column: the ratio model, f_sat (t/t_sat)^-1.23 with t/t_sat = 3.1623 [C] */
    ck_assert_rel(o.l_xuv_w, 1e-3 * VL_L_SUN * pow(sqrt(10.0), -1.23), 1e-12);
    vl_star_free(s);
}
END_TEST

START_TEST(test_table_errors)
{
    /* each bad track is refused with its line (0 for whole-file problems) */
    expect_table_error("age_yr,luminosity_lsun\n1e6,1\n1e8,1\n1e7,1\n", 1e6, 1e7,
                       VL_ERR_INPUT, 4, "not greater");
    expect_table_error("age_yr,luminosity_lsun\n1e6,1\n1e6,1\n", 1e6, 1e6,
                       VL_ERR_INPUT, 3, "not greater");
    expect_table_error("# header follows\nage_yr,teff_k\n1e6,3000\n1e8,3000\n", 1e6, 1e7,
                       VL_ERR_INPUT, 2, "missing column 'luminosity_lsun'");
    expect_table_error("luminosity_lsun\n1\n2\n", 1e6, 1e7,
                       VL_ERR_INPUT, 1, "missing column 'age_yr'");
    expect_table_error("age_yr,luminosity_lsun,radius\n1e6,1,1\n1e8,1,1\n", 1e6, 1e7,
                       VL_ERR_INPUT, 1, "unknown column 'radius'");
    expect_table_error("age_yr,luminosity_lsun,age_yr\n1e6,1,1\n1e8,1,1\n", 1e6, 1e7,
                       VL_ERR_INPUT, 1, "twice");
    expect_table_error("age_yr,luminosity_lsun\n\n1e6,1\n", 1e6, 1e6,
                       VL_ERR_INPUT, 0, "at least 2");
    expect_table_error("# nothing but a comment\n\n", 1e6, 1e7, VL_ERR_INPUT, 0, "no header");
    expect_table_error("age_yr,luminosity_lsun\n1e7,1\n1e9,1\n", 1e6, 4.57e9,
                       VL_ERR_INPUT, 0, "run needs 1e+06-4.57e+09 yr");
    expect_table_error("age_yr,luminosity_lsun\n1e7,1\n1e9,1\n", 1e7, 4.57e9,
                       VL_ERR_INPUT, 0, "covers ages 1e+07-1e+09 yr");
    expect_table_error("age_yr,luminosity_lsun\n1e6,1\n1e9,1\n", 1e6, 1.001e9,
                       VL_ERR_INPUT, 0, "run needs 1e+06-1.001e+09 yr");
    expect_table_error("age_yr,luminosity_lsun\n1e6,1\n1e8,abc\n", 1e6, 1e7,
                       VL_ERR_INPUT, 3, "not a number");
    expect_table_error("age_yr,luminosity_lsun\n1e6,1\n1e8,2.5x\n", 1e6, 1e7,
                       VL_ERR_INPUT, 3, "not a number");
    expect_table_error("age_yr,luminosity_lsun\n1e6,\n1e8,1\n", 1e6, 1e7,
                       VL_ERR_INPUT, 2, "not a number");
    expect_table_error("age_yr,luminosity_lsun\n1e6,1,3\n1e8,1\n", 1e6, 1e7,
                       VL_ERR_INPUT, 2, "3 fields");
    expect_table_error("age_yr,luminosity_lsun\n1e6,1\n1e8\n", 1e6, 1e7,
                       VL_ERR_INPUT, 3, "1 fields");
    expect_table_error("age_yr,luminosity_lsun\n1e6,1\n1e8,0\n", 1e6, 1e7,
                       VL_ERR_INPUT, 3, "positive");
    expect_table_error("age_yr,luminosity_lsun\n-1e6,1\n1e8,1\n", 1e6, 1e7,
                       VL_ERR_INPUT, 2, "positive");
    expect_table_error("age_yr,luminosity_lsun\n1e6,nan\n1e8,1\n", 1e6, 1e7,
                       VL_ERR_INPUT, 2, "not finite");
    expect_table_error("age_yr,luminosity_lsun\n1e6,1\n1e8,inf\n", 1e6, 1e7,
                       VL_ERR_INPUT, 3, "not finite");
    expect_table_error("age_yr,luminosity_lsun\n1e6,1\n1e999,1\n", 1e6, 1e7,
                       VL_ERR_INPUT, 3, "not finite");
    expect_table_error("age_yr,luminosity_lsun\n1e6,1\n1e8,1e300\n", 1e6, 1e7,
                       VL_ERR_INPUT, 3, "not finite");

    /* a missing file is an I/O error naming the file */
    vl_star_params p = sun_params();
    p.luminosity_model = VL_LUM_TABLE;
    snprintf(p.track_file, sizeof p.track_file, "%s", "/nonexistent/volev/track.csv");
    vl_status st;
    vl_status_clear(&st);
    ck_assert_ptr_null(vl_star_new(&p, 1e7 * VL_YR, GYR, &st));
    ck_assert_int_eq(st.code, VL_ERR_IO);
    ck_assert_str_eq(st.file, "/nonexistent/volev/track.csv");
    /* a table model without a file */
    p.track_file[0] = '\0';
    vl_status_clear(&st);
    ck_assert_ptr_null(vl_star_new(&p, 1e7 * VL_YR, GYR, &st));
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
}
END_TEST

Suite *vl_suite_star(void)
{
    Suite *s = suite_create("star");
    TCase *tc = tcase_create("star");
    tcase_add_test(tc, test_gough);
    tcase_add_test(tc, test_gough_range);
    tcase_add_test(tc, test_ribas);
    tcase_add_test(tc, test_xuv_ratio);
    tcase_add_test(tc, test_lya);
    tcase_add_test(tc, test_contracting);
    tcase_add_test(tc, test_wind_and_orbit);
    tcase_add_test(tc, test_non_table_ignores_file);
    tcase_add_test(tc, test_table_nodes);
    tcase_add_test(tc, test_table_loglog);
    tcase_add_test(tc, test_table_errors);
    suite_add_tcase(s, tc);
    return s;
}
