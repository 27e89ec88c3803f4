/* test_active.c: what the integrator's active components rest on (src/engine/active.c,
 * docs/model.md section 6): a reservoir that is empty and that no enabled process
 * declares as the destination of a transfer or a product of a reaction (with deuterium
 * companions) has a tendency of exactly zero, and so does the mantle's temperature of a
 * mantle that is not molten; checked over every regime at random states of the bundled
 * scenarios, with impacts and their delivery on and off. An exact-zero property of the
 * model (common practice: a sparsity pattern must hold exactly to be exploited). */
#include <math.h>
#include <stdint.h>
#include <string.h>

#include "suites.h"
#include "volev/model.h"
#include "volev/process.h"

static void mark(unsigned char *dest, int r)
{
    dest[r] = 1;
    int d = vl_reservoir_deuterium(r);
    if (d >= 0)
        dest[d] = 1;
}

/* The reservoirs some enabled process of m may add mass to, from the declarations. */
static void destinations(const vl_model *m, unsigned char *dest)
{
    memset(dest, 0, VL_NSTATE);
    for (size_t i = 0; i < m->nproc; i++) {
        const vl_process *p = m->proc[i];
        for (size_t k = 0; k < p->ntransfers; k++)
            mark(dest, p->transfers[k].to);
        for (size_t k = 0; k < p->nreactions; k++)
            for (int q = 0; q < p->reactions[k].n; q++)
                if (p->reactions[k].nu[q] > 0.0)
                    mark(dest, p->reactions[k].res[q]);
    }
}

static double uniform(uint64_t *s)
{
    *s ^= *s << 13;
    *s ^= *s >> 7;
    *s ^= *s << 17;
    return (double)(*s >> 11) * 0x1.0p-53;
}

/* At 8 random states around the start of rel (each non-zero component times 10^U(-0.5, 0.5),
 * the zero ones left zero) under every regime: the zero non-destinations stay put. */
static void check_scenario(const char *rel, const char *const *sets, size_t n, int *fixed)
{
    vl_scenario *sc = vl_test_scenario(rel, sets, n);
    vl_model *m = vl_test_model(sc);
    unsigned char dest[VL_NSTATE];
    destinations(m, dest);
    double y0[VL_NSTATE], y[VL_NSTATE], f[VL_NSTATE];
    vl_model_initial_state(m, y0);
    uint64_t seed = 0x9E3779B97F4A7C15ULL;
    for (int trial = 0; trial < 8; trial++) {
        for (int j = 0; j < VL_NSTATE; j++)
            y[j] = y0[j] * pow(10.0, uniform(&seed) - 0.5);
        if (y[VL_S_MANTLE_TP] > 0.0) /* a temperature: within its physical range */
            y[VL_S_MANTLE_TP] = 1500.0 + 2000.0 * uniform(&seed);
        double t = m->sc->run.start_s + uniform(&seed) * (m->sc->run.end_s - m->sc->run.start_s);
        for (int regime = 0; regime < VL_NREGIMES; regime++) {
            vl_model_rhs(m, vl_test_work(m), t, y, regime, f, NULL, NULL);
            for (int j = 0; j < VL_NRES; j++)
                if (y0[j] == 0.0 && !dest[j]) {
                    ck_assert_msg(f[j] == 0.0, "%s: %s changes at %g kg/s (regime %d)", rel,
                                  vl_reservoir_name(j), f[j], regime);
                    *fixed += trial == 0 && regime == 0;
                }
            if (y0[VL_S_MANTLE_TP] == 0.0)
                ck_assert_msg(f[VL_S_MANTLE_TP] == 0.0, "%s: the mantle temperature changes", rel);
        }
    }
    vl_test_model_free(m);
    vl_scenario_free(sc);
}

START_TEST(zero_stays_zero)
{
    static const char *const files[] = {"scenarios/earth.cfg", "scenarios/venus.cfg",
                                        "scenarios/mars.cfg", "scenarios/demo.cfg",
                                        "scenarios/demo-dry.cfg"};
    static const char *const impacts[] = {"processes.impacts.enabled=true"};
    static const char *const delivery[] = {"processes.impacts.enabled=true",
                                           "processes.impacts.delivery=true"};
    int fixed = 0;
    for (size_t i = 0; i < sizeof files / sizeof files[0]; i++)
        check_scenario(files[i], NULL, 0, &fixed);
    check_scenario("scenarios/earth.cfg", impacts, 1, &fixed);
    int before = fixed;
    check_scenario("scenarios/earth.cfg", delivery, 2, &fixed);
    /* the impactor stores are left out unless delivery fills them: the check saw them */
    ck_assert_int_gt(before, 5 * 5);
    ck_assert_int_lt(fixed - before, 5);
}
END_TEST

Suite *vl_suite_active(void)
{
    Suite *s = suite_create("active");
    TCase *tc = tcase_create("core");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, zero_stays_zero);
    suite_add_tcase(s, tc);
    return s;
}
