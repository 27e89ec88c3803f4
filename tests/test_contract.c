/* test_contract.c: the process contract (process.h). The order in which processes are
 * listed changes no result, bit for bit; a process that declares a transfer or a
 * reaction that does not conserve every element is refused when the model is built; a
 * process that moves mass along an undeclared row stops the program. */
#include <signal.h>
#include <stdlib.h>
#include <string.h>

#include "suites.h"
#include "volev/integrate.h"
#include "volev/model.h"
#include "volev/units.h"

/* What a run hands its sink, kept in memory: per row the age, state and the process
 * columns by name (the model's column order follows its process list). */
#define MAX_ROWS 2048
typedef struct {
    const vl_model *m;
    size_t nrows;
    double t[MAX_ROWS];
    double y[MAX_ROWS][VL_NSTATE];
    double cols[MAX_ROWS][VL_MAX_COLUMNS];
    char events[8192];
} record;

static int keep_row(void *ctx, double t, const double *y, const double *dydt, const vl_env *env,
                    const double *columns, vl_status *st)
{
    record *r = ctx;
    (void)dydt;
    (void)env;
    (void)st;
    ck_assert_uint_lt(r->nrows, MAX_ROWS);
    r->t[r->nrows] = t;
    memcpy(r->y[r->nrows], y, sizeof r->y[0]);
    memcpy(r->cols[r->nrows], columns, r->m->ncolumns * sizeof columns[0]);
    r->nrows++;
    return VL_OK;
}

static int keep_event(void *ctx, double t, const char *name, const char *detail, vl_status *st)
{
    record *r = ctx;
    (void)st;
    size_t n = strlen(r->events);
    snprintf(r->events + n, sizeof r->events - n, "%.17g %s %s\n", t, name, detail);
    return VL_OK;
}

/* Run m into r; the final state into y_final. */
static void run(const vl_model *m, record *r, double y_final[VL_NSTATE])
{
    vl_status st;
    vl_run_stats s;
    memset(r, 0, sizeof *r);
    r->m = m;
    vl_run_sink sink = {r, keep_row, keep_event};
    ck_assert_msg(vl_integrate(m, &sink, &s, &st) == VL_OK, "%s", st.msg);
    memcpy(y_final, s.y_final, sizeof s.y_final);
}

/* Column index of name in m, or -1. */
static int column_of(const vl_model *m, const char *name)
{
    for (size_t c = 0; c < m->ncolumns; c++)
        if (strcmp(m->col_name[c], name) == 0)
            return (int)c;
    return -1;
}

/* The scenario's enabled processes in a permutation drawn from seed (a fixed LCG, so
 * the test is reproducible), with their parameter blocks. */
static size_t shuffled(const vl_scenario *sc, unsigned seed, const vl_process **procs,
                       const void **params)
{
    size_t n = 0;
    for (size_t i = 0; i < vl_nprocesses; i++)
        if (sc->proc[i].enabled) {
            procs[n] = vl_processes[i];
            params[n++] = sc->proc[i].params;
        }
    unsigned x = seed;
    for (size_t i = n; i > 1; i--) { /* Fisher-Yates */
        x = x * 1103515245u + 12345u;
        size_t j = (x >> 8) % i;
        const vl_process *tp = procs[i - 1];
        const void *tq = params[i - 1];
        procs[i - 1] = procs[j];
        params[i - 1] = params[j];
        procs[j] = tp;
        params[j] = tq;
    }
    return n;
}

/* A young M-dwarf planet (the wet demo, shortened) with an Earth-like dipole: thermal
 * escape with oxygen drag, every non-thermal channel, both hydrogen demands sharing the
 * diffusion room, and the carbon and nitrogen cycles all act. 500 Myr: its steam upper
 * atmosphere is diffusion-limited (no room for non-thermal hydrogen) until ~420 Myr. */
static vl_scenario *busy_scenario(void)
{
    const char *sets[] = {"run.end_yr=5e8", "run.log_points=60", "run.linear_points=20",
                          "planet.dipole_moment_earth=1"};
    return vl_test_scenario("scenarios/demo.cfg", sets, 4);
}

START_TEST(registry_order_changes_nothing)
{
    vl_scenario *sc = busy_scenario();
    vl_model *ref = vl_test_model(sc);
    static record a, b;
    double ya[VL_NSTATE], yb[VL_NSTATE];
    run(ref, &a, ya);
    ck_assert_uint_gt(a.nrows, 50);
    for (unsigned seed = 1; seed <= 3; seed++) {
        const vl_process *procs[VL_MAX_PROCESSES];
        const void *params[VL_MAX_PROCESSES];
        size_t n = shuffled(sc, seed * 2385u, procs, params);
        vl_status st;
        vl_model *m = vl_model_new_with(sc, procs, params, n, &st);
        ck_assert_msg(m != NULL, "%s", st.msg);
        ck_assert_str_ne(m->proc[0]->name, ref->proc[0]->name); /* really reordered */
        run(m, &b, yb);
        /* identical to the last bit: rows, states, events, every column by name */
        ck_assert_uint_eq(a.nrows, b.nrows);
        ck_assert_int_eq(memcmp(ya, yb, sizeof ya), 0);
        ck_assert_str_eq(a.events, b.events);
        ck_assert_int_eq(memcmp(a.t, b.t, a.nrows * sizeof a.t[0]), 0);
        ck_assert_int_eq(memcmp(a.y, b.y, a.nrows * sizeof a.y[0]), 0);
        for (size_t c = 0; c < ref->ncolumns; c++) {
            int k = column_of(m, ref->col_name[c]);
            ck_assert_int_ge(k, 0);
            for (size_t i = 0; i < a.nrows; i++)
                ck_assert_msg(memcmp(&a.cols[i][c], &b.cols[i][k], sizeof(double)) == 0,
                              "column %s row %zu: %.17g vs %.17g", ref->col_name[c], i,
                              a.cols[i][c], b.cols[i][k]);
        }
        vl_model_free(m);
    }
    /* the run exercised what the order could have coupled: drag, non-thermal hydrogen
     * sharing the room */
    int drag = column_of(ref, "o_drag_from_o2_kg_s"), pick = column_of(ref, "pickup_h_kg_s");
    int polar = column_of(ref, "polar_h_kg_s");
    double most[3] = {0, 0, 0};
    for (size_t i = 0; i < a.nrows; i++) {
        most[0] = fmax(most[0], a.cols[i][drag] + a.cols[i][column_of(ref, "photolysis_o_dragged_kg_s")]);
        most[1] = fmax(most[1], a.cols[i][pick]);
        most[2] = fmax(most[2], a.cols[i][polar]);
    }
    ck_assert_msg(most[0] > 0.0 && most[1] > 0.0 && most[2] > 0.0,
                  "drag %g, pickup H %g, polar H %g", most[0], most[1], most[2]);
    vl_test_model_free(ref);
    vl_scenario_free(sc);
}
END_TEST

/* A process that only moves mass; its declarations are the test's. */
static void idle_rates(const void *params, const vl_view *v, vl_flux *fx)
{
    (void)params;
    (void)v;
    vl_flux_transfer(fx, 0, 1.0, -1);
}

static const vl_flux_column no_columns[] = {{"idle_kg_s", "nothing (a test process)"}};
static const vl_transfer water_to_space_h[] = {{VL_R_WATER, VL_R_SPACE_H}};
static const vl_transfer o2_to_rock[] = {{VL_R_O2, VL_R_OX_ROCK}};
/* 2 H2O -> 2 H2 + 2 O2 has one O2 too many */
static const vl_reaction too_much_o2[] = {
    {"2 H2O -> 2 H2 + 2 O2", 3, {VL_R_WATER, VL_R_H2, VL_R_O2}, {-2.0, 2.0, 2.0}}};

/* Build a model with p alone; returns the status code and the message in st. */
static int build_with(const vl_process *p, vl_status *st)
{
    vl_scenario *sc = vl_test_scenario(NULL, NULL, 0);
    const vl_process *procs[] = {p};
    vl_status_clear(st);
    vl_model *m = vl_model_new_with(sc, procs, NULL, 1, st);
    vl_model_free(m);
    vl_scenario_free(sc);
    return m ? VL_OK : st->code;
}

START_TEST(unbalanced_declarations_refused)
{
    vl_status st;
    vl_process p = {.name = "leaky", .columns = no_columns, .ncolumns = 1, .rates = idle_rates};
    /* a balanced transfer is accepted */
    p.transfers = o2_to_rock;
    p.ntransfers = 1;
    ck_assert_int_eq(build_with(&p, &st), VL_OK);
    /* water and atomic H differ in make-up: refused, naming process and reservoirs */
    p.transfers = water_to_space_h;
    ck_assert_int_eq(build_with(&p, &st), VL_ERR_INTERNAL);
    ck_assert_ptr_nonnull(strstr(st.msg, "process 'leaky'"));
    ck_assert_ptr_nonnull(strstr(st.msg, "surface_water -> space_h"));
    /* an unbalanced reaction: refused, naming the element */
    p.transfers = o2_to_rock;
    p.reactions = too_much_o2;
    p.nreactions = 1;
    ck_assert_int_eq(build_with(&p, &st), VL_ERR_INTERNAL);
    ck_assert_ptr_nonnull(strstr(st.msg, "process 'leaky'"));
    ck_assert_ptr_nonnull(strstr(st.msg, "does not balance O"));
    /* every registered process passes */
    for (size_t i = 0; i < vl_nprocesses; i++)
        ck_assert_msg(vl_process_check_declarations(vl_processes[i], &st) == VL_OK, "%s",
                      st.msg);
}
END_TEST

/* Moving along a row the process did not declare is a programming error: abort. */
START_TEST(undeclared_row_aborts)
{
    double y[VL_NSTATE] = {0}, dydt[VL_NSTATE] = {0};
    y[VL_R_O2] = 1e18;
    vl_flux fx = {y, dydt, NULL, 0, o2_to_rock, 1, NULL, 0};
    vl_flux_transfer(&fx, 1, 1.0, -1);
}
END_TEST

Suite *vl_suite_contract(void)
{
    Suite *s = suite_create("contract");
    TCase *tc = tcase_create("core");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, registry_order_changes_nothing);
    tcase_add_test(tc, unbalanced_declarations_refused);
    tcase_add_test_raise_signal(tc, undeclared_row_aborts, SIGABRT);
    suite_add_tcase(s, tc);
    return s;
}
