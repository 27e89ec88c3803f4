/* test_campaign.c: the extreme-scenario campaign's findings kept as regressions (issue
 * 18; scripts/campaign.sh, docs/hardening.md "Extreme-scenario campaign"). First the
 * deuterium flow-back of the flux ledger (src/engine/flux.c) on hand-made states, then
 * every member listed in tests/data/campaign/regressions.txt run through the program:
 * each must finish (exit 0) with every conservation residual at most 1e-8 and no
 * reservoir below zero by more than 1000 of its tolerances, the limits the issue sets.
 * Conservation and non-negativity are the expectations (common practice), not outputs of
 * the code. */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "suites.h"
#include "volev/flux.h"
#include "volev/invariants.h"
#include "volev/reservoir.h"

static char tmp[256];

/* ---- the deuterium flow-back ----------------------------------------------------- */

/* Sum of the deuterium companions' and space D's tendencies. */
static double d_net(const double *dydt)
{
    return dydt[VL_R_D_WATER] + dydt[VL_R_D_MANTLE_WATER] + dydt[VL_R_D_H2] +
           dydt[VL_R_D_IMPACT_WATER] + dydt[VL_R_SPACE_D];
}

START_TEST(deuterium_below_zero_flows_back)
{
    double y[VL_NSTATE] = {0}, dydt[VL_NSTATE] = {0};
    static const vl_transfer h2_out[] = {{VL_R_H2, VL_R_SPACE_H}};
    vl_flux fx = {y, dydt, NULL, 0, h2_out, 1, NULL, 0};
    y[VL_R_H2] = 1e12;
    y[VL_R_D_H2] = -1e4;  /* an overshoot below zero */
    y[VL_R_SPACE_D] = 1e9; /* the D that left with the hydrogen */
    vl_flux_transfer_f(&fx, 0, 10.0, -1, 0.5);
    /* the dip shrinks (D comes back from space), and no deuterium is made or lost */
    ck_assert(dydt[VL_R_D_H2] > 0.0);
    ck_assert(dydt[VL_R_SPACE_D] < 0.0);
    ck_assert(fabs(d_net(dydt)) <= 1e-12 * fabs(dydt[VL_R_SPACE_D]));
    /* at the hydrogen's own relative rate times the fractionation: dD/dt = -f r / m_H2 D */
    ck_assert_rel(dydt[VL_R_D_H2], 0.5 * 10.0 / 1e12 * 1e4, 1e-12);
    /* where the hydrogen went holds no deuterium: nothing flows back, nothing goes below
     * zero there in turn */
    memset(dydt, 0, sizeof dydt);
    y[VL_R_SPACE_D] = 0.0;
    vl_flux_transfer_f(&fx, 0, 10.0, -1, 0.5);
    ck_assert_double_eq(dydt[VL_R_D_H2], 0.0);
    ck_assert_double_eq(dydt[VL_R_SPACE_D], 0.0);
}
END_TEST

/* D outflow of the H2 -> space transfer at 10 kg/s with the H2 at m_h2 and its D at d. */
static double d_outflow(double m_h2, double d)
{
    double y[VL_NSTATE] = {0}, dydt[VL_NSTATE] = {0};
    static const vl_transfer h2_out[] = {{VL_R_H2, VL_R_SPACE_H}};
    vl_flux fx = {y, dydt, NULL, 0, h2_out, 1, NULL, 0};
    y[VL_R_H2] = m_h2;
    y[VL_R_D_H2] = d;
    y[VL_R_SPACE_D] = 1e9;
    vl_flux_transfer_f(&fx, 0, 10.0, -1, 1.0);
    ck_assert(fabs(d_net(dydt)) <= 1e-12 * fabs(dydt[VL_R_SPACE_D]) + 1e-300);
    return dydt[VL_R_SPACE_D];
}

START_TEST(deuterium_follows_an_emptied_carrier)
{
    /* The carrier emptied (or overshot below zero by the integrator): its deuterium still
     * leaves, continuously in the carrier's mass across zero, so no D is stranded in a
     * reservoir without hydrogen (common practice: a flux continuous in the state). */
    double above = d_outflow(1e-9, 3e3), at = d_outflow(0.0, 3e3), below = d_outflow(-50.0, 3e3);
    ck_assert(above > 0.0);
    ck_assert_rel(at, above, 1e-9);
    ck_assert_rel(below, above, 1e-9);
    /* and a dip of that deuterium comes back the same way */
    ck_assert(d_outflow(-50.0, -3e3) < 0.0);
}
END_TEST

START_TEST(reaction_flow_back_limited_by_products)
{
    double y[VL_NSTATE] = {0}, dydt[VL_NSTATE] = {0};
    /* water photolysis, 2 H2O -> 2 H2 + O2 (balanced: vl_reaction_check) */
    static const vl_reaction photolysis[] = {
        {"2 H2O -> 2 H2 + O2", 3, {VL_R_WATER, VL_R_H2, VL_R_O2}, {-2.0, 2.0, 1.0}}};
    char why[128];
    ck_assert_int_eq(vl_reaction_check(&photolysis[0], why, sizeof why), 0);
    vl_flux fx = {y, dydt, NULL, 0, NULL, 0, photolysis, 1};
    y[VL_R_WATER] = 1e15;
    y[VL_R_H2] = 1e12;
    y[VL_R_D_WATER] = -1e6; /* a dip of the water's deuterium */
    y[VL_R_D_H2] = 4e6;     /* more than the dip: the whole flow-back is available */
    vl_flux_react(&fx, 0, 1.0, -1);
    ck_assert(dydt[VL_R_D_WATER] > 0.0);
    ck_assert_double_eq_tol(dydt[VL_R_D_H2], -dydt[VL_R_D_WATER], 1e-20);
    double full = dydt[VL_R_D_WATER];
    /* the H2's deuterium a quarter of the dip: x (2 - x) = 0.4375 of it flows back */
    memset(dydt, 0, sizeof dydt);
    y[VL_R_D_H2] = 2.5e5;
    vl_flux_react(&fx, 0, 1.0, -1);
    ck_assert_rel(dydt[VL_R_D_WATER], 0.4375 * full, 1e-12);
    ck_assert_double_eq_tol(dydt[VL_R_D_H2], -dydt[VL_R_D_WATER], 1e-20);
}
END_TEST

/* ---- the campaign's members ------------------------------------------------------- */

/* Runs one "SEED-MEMBER | why | overrides" line and checks its outcome. */
static void run_member(char *line)
{
    char *bar1 = strchr(line, '|'), *bar2 = bar1 ? strchr(bar1 + 1, '|') : NULL;
    ck_assert_msg(bar2 != NULL, "malformed line: %s", line);
    *bar1 = '\0';
    char sets[4096] = "";
    size_t used = 0;
    for (char *tok = strtok(bar2 + 1, " \n"); tok; tok = strtok(NULL, " \n")) {
        int n = snprintf(sets + used, sizeof sets - used, " --set '%s'", tok);
        ck_assert(n > 0 && (size_t)n < sizeof sets - used);
        used += (size_t)n;
    }
    vl_test_sh(tmp, "rm -rf out");
    int rc = vl_test_sh(tmp, "'%s' run '%s/scenarios/demo.cfg' -o out%s", vl_test_bin(),
                        vl_test_top(), sets);
    char *err = rc ? vl_test_slurp(tmp, "err.txt", NULL) : NULL;
    ck_assert_msg(rc == 0, "member %s: exit %d: %s", line, rc, err ? err : "");
    for (int el = 0; el < VL_NELEMENTS; el++) {
        char name[32];
        snprintf(name, sizeof name, "residual_%s", vl_element_name(el));
        double r = vl_test_summary_value(tmp, "out/summary.csv", name);
        ck_assert_msg(r <= VL_RESIDUAL_LIMIT, "member %s: %s = %g", line, name, r);
    }
    double dip = vl_test_summary_value(tmp, "out/summary.csv", "reservoir_overshoot_tolerances");
    ck_assert_msg(dip <= VL_DIP_TOLERANCES, "member %s: overshoot %g tolerances", line, dip);
}

START_TEST(members_that_once_failed)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-campaign");
    char path[600];
    snprintf(path, sizeof path, "%s/tests/data/campaign/regressions.txt", vl_test_top());
    FILE *f = fopen(path, "r");
    ck_assert_msg(f != NULL, "cannot read %s", path);
    char line[4096];
    int members = 0;
    while (fgets(line, sizeof line, f)) {
        if (line[0] == '#' || line[0] == '\n')
            continue;
        run_member(line);
        members++;
    }
    fclose(f);
    ck_assert_int_gt(members, 0);
    vl_test_tmp_remove(tmp);
}
END_TEST

Suite *vl_suite_campaign(void)
{
    Suite *s = suite_create("campaign");
    TCase *fl = tcase_create("flow_back");
    tcase_add_test(fl, deuterium_below_zero_flows_back);
    tcase_add_test(fl, reaction_flow_back_limited_by_products);
    tcase_add_test(fl, deuterium_follows_an_emptied_carrier);
    suite_add_tcase(s, fl);
    TCase *mb = tcase_create("members");
    tcase_set_timeout(mb, 600);
    tcase_add_test(mb, members_that_once_failed);
    suite_add_tcase(s, mb);
    return s;
}
