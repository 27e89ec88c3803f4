/* test_scenario_write.c: the resolved-scenario writer (round trips bit for bit, its
 * layout) and the validate and reference listings. Scenario files are written into a
 * fresh temporary folder per test case (scenario_support.h). */
#include <limits.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "scenario_support.h"
#include "suites.h"
#include "volev/process.h"
#include "volev/scenario.h"
#include "volev/units.h"

static char *captured(void (*fn)(const vl_scenario *, FILE *), const vl_scenario *sc)
{
    FILE *f = tmpfile();
    ck_assert_ptr_nonnull(f);
    fn(sc, f);
    long len = ftell(f);
    ck_assert_int_ge(len, 0);
    rewind(f);
    char *text = malloc((size_t)len + 1);
    ck_assert_ptr_nonnull(text);
    ck_assert_uint_eq(fread(text, 1, (size_t)len, f), (size_t)len);
    text[len] = '\0';
    fclose(f);
    return text;
}

static void write_resolved_ok(const vl_scenario *sc, FILE *f)
{
    vl_status st;
    ck_assert_int_eq(vl_scenario_write_resolved(sc, f, &st), VL_OK);
}

static void print_reference(const vl_scenario *sc, FILE *f)
{
    (void)sc;
    vl_params_print_reference(f);
}

/* Values that naive printing does not reproduce; -0.0 is zero and is stored and written as
 * 0.0 (issue 18: a negative zero is no quantity a researcher means; common practice). */
static const char entropic[] =
    "star = {\n"
    "  mass_msun = 0.30000000000000004;\n"
    "  teff_k = 3385.7;\n"
    "  luminosity_model = \"table\";\n"
    "  track_file = \"tracks/we\\\"ird\\\\name\\tx.csv\";\n"
    "  xuv = { saturation_ratio = 2.385e-4; decay_exponent = 1.1111111111111112; };\n"
    "  lyman_alpha_1au_cm2_s = 2.385e11;\n"
    "  wind = { mass_loss_msun_yr = 2.0000000000000004e-14; speed_km_s = 437; };\n"
    "};\n"
    "planet = { mass_mearth = 2.385; radius_rearth = 1.2345678901234567; orbit_au = 0.122;\n"
    "           eccentricity = 0.1; };\n"
    "inventory = { surface_water_to = 3.3333333333333335; co2_bar = -0.0; n2_bar = 0.7808;\n"
    "              mantle_water_to = 1e-300; };\n"
    "climate = { model = \"hz_fit\"; bond_albedo = 0.30000000000000004; co2_reference_bar = 2.837e-4; };\n"
    "run = { start_yr = 3e6; end_yr = 8.7654321e9; log_points = 317; rel_tolerance = 1e-9; };\n"
    "processes = {\n"
    "  weathering = { enabled = false; land_fraction = 0.1234567; };\n"
    "  photolysis = { photon_limited = true; photon_efficiency = 0.7071067811865476; };\n"
    "};\n";

START_TEST(resolved_round_trip)
{
    vl_status st;
    vl_scenario *sc = vl_scen_load_text(entropic, &st);
    ck_assert_msg(sc != NULL, "%s:%d: %s", st.file, st.line, st.msg);
    ck_assert_double_eq(sc->planet.eccentricity, 0.1);
    ck_assert_double_eq(sc->star.mass_kg, (0.1 + 0.2) * VL_M_SUN);
    ck_assert_int_eq(signbit(sc->inventory.co2_pa), 0);
    ck_assert_ptr_nonnull(strstr(sc->star.track_file, "we\"ird\\name\tx.csv"));
    vl_scenario *back = vl_scen_round_trip(sc);
    vl_scen_assert_same_values(sc, back);
    ck_assert_int_eq(signbit(back->inventory.co2_pa), 0);
    /* written as given, although 0.122 * au / au = 0.12199999999999998 */
    char *text = captured(write_resolved_ok, back);
    ck_assert_msg(strstr(text, " orbit_au = 0.122;\n"), "%s", text);
    ck_assert_ptr_nonnull(strstr(text, " mass_msun = 0.30000000000000004;\n"));
    ck_assert_ptr_nonnull(strstr(text, " co2_bar = 0.0;\n"));
    free(text);
    vl_scenario_free(back);
    vl_scenario_free(sc);
}
END_TEST

/* Every real without a condition, set to an awkward value inside its bounds. */
START_TEST(resolved_round_trip_every_real)
{
    size_t n = vl_param_count();
    char (*text)[128] = calloc(n, sizeof *text);
    const char **ov = calloc(n, sizeof *ov);
    ck_assert_ptr_nonnull(text);
    ck_assert_ptr_nonnull(ov);
    size_t count = 0;
    for (size_t i = 0; i < n; i++) {
        const vl_param *p;
        void *base;
        const char *prefix;
        vl_param_at(NULL, i, &p, &base, &prefix);
        if (p->type != VL_PT_REAL || p->needs || strncmp(p->key, "run.", 4) == 0)
            continue;
        double frac = fmod(0.1 + 0.7071067811865476 * (double)(i + 1), 1.0);
        snprintf(text[count], sizeof text[count], "%s%s=%.17g", prefix, p->key,
                 p->lo + frac * (p->hi - p->lo));
        ov[count] = text[count];
        count++;
    }
    vl_status st;
    vl_scenario *sc = vl_scenario_load(vl_scen_write_cfg("run = { end_yr = 2.385e9; };\n"), ov, count, &st);
    ck_assert_msg(sc != NULL, "%s", st.msg);
    vl_scenario *back = vl_scen_round_trip(sc);
    vl_scen_assert_same_values(sc, back);
    vl_scenario_free(back);
    vl_scenario_free(sc);
    free(ov);
    free(text);
}
END_TEST

/* SI values stored by code other than the loader still round-trip. */
START_TEST(resolved_round_trip_si_edit)
{
    vl_scenario *sc = vl_scenario_new();
    ck_assert_ptr_nonnull(sc);
    snprintf(sc->path, sizeof sc->path, "%s/made.cfg", vl_scen_tmp_dir);
    sc->planet.orbit_m = 2.385 * VL_AU;
    sc->inventory.co2_pa = (0.1 + 0.2) * VL_BAR;
    vl_scenario *back = vl_scen_round_trip(sc);
    vl_scen_assert_same_values(sc, back);
    ck_assert_double_eq(back->planet.orbit_m, 2.385 * VL_AU);
    vl_scenario_free(back);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(resolved_layout)
{
    vl_scenario *sc = vl_scenario_new();
    ck_assert_ptr_nonnull(sc);
    char *text = captured(write_resolved_ok, sc);
    ck_assert_msg(strncmp(text, "# resolved scenario written by volev\n", 37) == 0, "%s", text);
    ck_assert_ptr_nonnull(strstr(text, "\nstar = {\n"));
    ck_assert_ptr_nonnull(strstr(text, "    xuv = {\n        model = \"ratio\";\n"));
    ck_assert_ptr_nonnull(strstr(text, "    orbit_au = 1.0;\n"));
    ck_assert_ptr_nonnull(strstr(text, "    weathering = {\n        enabled = true;\n"));
    /* a key whose condition does not hold is shown but commented out */
    ck_assert_ptr_nonnull(strstr(text, "# contraction_end_yr = "));
    /* the core groups appear once each */
    const char *star = strstr(text, "\nstar = {");
    ck_assert_ptr_null(strstr(star + 1, "\nstar = {"));
    free(text);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(validate_listing)
{
    vl_status st;
    const char *ov[] = {"planet.mass_mearth=2.385"};
    vl_scenario *sc = vl_scenario_load(vl_scen_write_cfg("planet = {\n  orbit_au = 1.52;\n};\n"), ov, 1, &st);
    ck_assert_ptr_nonnull(sc);
    char *text = captured(vl_scenario_print, sc);
    char from[2048];
    snprintf(from, sizeof from, "[%s:2]\n", vl_scen_cfg_path);
    const char *line = strstr(text, "\nplanet.orbit_au ");
    ck_assert_ptr_nonnull(line);
    const char *eol = strchr(line + 1, '\n');
    ck_assert_msg(strncmp(eol - strlen(from) + 1, from, strlen(from)) == 0, "%.*s",
                  (int)(eol - line), line);
    ck_assert_ptr_nonnull(strstr(line, " = 1.52 au "));
    ck_assert_ptr_nonnull(strstr(text, "2.385 M_earth"));
    ck_assert_ptr_nonnull(strstr(text, "[--set]"));
    ck_assert_ptr_nonnull(strstr(text, "[default]"));
    ck_assert_ptr_nonnull(strstr(text, "\nplanet.orbit_au "));
    ck_assert_ptr_nonnull(strstr(text, "processes.weathering.enabled"));
    /* one line per parameter */
    size_t lines = 0;
    for (const char *c = text; *c; c++)
        lines += *c == '\n';
    ck_assert_uint_eq(lines, vl_param_count());
    free(text);
    vl_scenario_free(sc);
}
END_TEST

START_TEST(reference_listing)
{
    char *text = captured(print_reference, NULL);
    for (size_t k = 0; k < vl_nprocesses; k++) {
        const vl_process *proc = vl_processes[k];
        char want[256];
        snprintf(want, sizeof want, "process %s (", proc->name);
        ck_assert_msg(strstr(text, want), "reference lacks %s", proc->name);
        for (size_t c = 0; c < proc->ncolumns; c++)
            ck_assert_ptr_nonnull(strstr(text, proc->columns[c].name));
    }
    ck_assert_ptr_nonnull(strstr(text, "planet.orbit_au"));
    ck_assert_ptr_nonnull(strstr(text, "IAU 2012 B2"));
    ck_assert_ptr_nonnull(strstr(text, "only when processes.photolysis.photon_limited=true"));
    ck_assert_ptr_nonnull(strstr(text, "one of sun_analytic|constant|table|contracting"));
    free(text);
}
END_TEST

Suite *vl_suite_scenario_write(void)
{
    Suite *s = suite_create("scenario_write");
    TCase *out = tcase_create("output");
    tcase_add_unchecked_fixture(out, vl_scen_make_dir, vl_scen_remove_dir);
    tcase_add_test(out, resolved_round_trip);
    tcase_add_test(out, resolved_round_trip_every_real);
    tcase_add_test(out, resolved_round_trip_si_edit);
    tcase_add_test(out, resolved_layout);
    tcase_add_test(out, validate_listing);
    tcase_add_test(out, reference_listing);
    suite_add_tcase(s, out);
    return s;
}
