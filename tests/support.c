/* support.c: helpers for tests that run the built program in a temporary folder
 * (test_cli.c, test_compare.c, test_sweep.c). Declared in suites.h. */
#define _GNU_SOURCE
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <sys/wait.h>

#include "suites.h"
#include "volev/climate.h"
#include "volev/integrate.h"
#include "volev/model.h"

/* DIR/REL into path (of size n); fails the test if it does not fit. */
static void path_of(char *path, size_t n, const char *dir, const char *rel)
{
    int len = snprintf(path, n, "%s/%s", dir, rel);
    ck_assert_msg(len >= 0 && (size_t)len < n, "path %s/%s too long", dir, rel);
}

void vl_test_tmp_make(char *dir, size_t n, const char *tag)
{
    int len = snprintf(dir, n, "/tmp/%s-XXXXXX", tag);
    ck_assert_msg(len >= 0 && (size_t)len < n, "temporary folder name for %s too long", tag);
    ck_assert_ptr_nonnull(mkdtemp(dir));
}

void vl_test_tmp_remove(const char *dir)
{
    char cmd[4352];
    int len = snprintf(cmd, sizeof cmd, "rm -rf '%s'", dir);
    ck_assert(len >= 0 && (size_t)len < sizeof cmd);
    ck_assert_int_eq(system(cmd), 0);
}

int vl_test_sh(const char *dir, const char *fmt, ...)
{
    char args[8192], cmd[12288];
    va_list ap;
    va_start(ap, fmt);
    int len = vsnprintf(args, sizeof args, fmt, ap);
    va_end(ap);
    ck_assert_msg(len >= 0 && (size_t)len < sizeof args, "command too long: %s", args);
    len = snprintf(cmd, sizeof cmd, "cd '%s' && %s >out.txt 2>err.txt", dir, args);
    ck_assert_msg(len >= 0 && (size_t)len < sizeof cmd, "command too long: %s", cmd);
    int rc = system(cmd);
    ck_assert(rc != -1 && WIFEXITED(rc));
    return WEXITSTATUS(rc);
}

int vl_test_have_gnuplot(void) { return system("command -v gnuplot >/dev/null 2>&1") == 0; }

char *vl_test_slurp(const char *dir, const char *rel, long *size)
{
    char path[4096];
    path_of(path, sizeof path, dir, rel);
    FILE *f = fopen(path, "rb");
    if (!f)
        return NULL;
    fseek(f, 0, SEEK_END);
    long n = ftell(f);
    fseek(f, 0, SEEK_SET);
    char *buf = malloc((size_t)n + 1);
    ck_assert_ptr_nonnull(buf);
    ck_assert_int_eq(fread(buf, 1, (size_t)n, f), (size_t)n);
    buf[n] = '\0';
    fclose(f);
    if (size)
        *size = n;
    return buf;
}

int vl_test_exists(const char *dir, const char *rel)
{
    char path[4096];
    struct stat sb;
    path_of(path, sizeof path, dir, rel);
    return stat(path, &sb) == 0;
}

void vl_test_write(const char *dir, const char *rel, const char *text)
{
    char path[4096];
    path_of(path, sizeof path, dir, rel);
    FILE *f = fopen(path, "w");
    ck_assert_msg(f != NULL, "cannot write %s", path);
    fputs(text, f);
    fclose(f);
}

void vl_test_file_contains(const char *dir, const char *rel, const char *needle)
{
    char *s = vl_test_slurp(dir, rel, NULL);
    ck_assert_msg(s != NULL, "missing %s", rel);
    ck_assert_msg(strstr(s, needle) != NULL, "%s '%.600s' lacks '%s'", rel, s, needle);
    free(s);
}

/* Workspaces made for tests: one per model or bare climate, freed with its owner. */
#define MAX_TEST_WORKS 64
static struct {
    const void *owner;
    void *work;
    int climate; /* 1: a vl_climate_work of a bare climate; 0: a vl_work of a model */
} works[MAX_TEST_WORKS];

static void *find_work(const void *owner)
{
    for (int i = 0; i < MAX_TEST_WORKS; i++)
        if (works[i].owner == owner)
            return works[i].work;
    return NULL;
}

static void keep_work(const void *owner, void *work, int climate)
{
    for (int i = 0; i < MAX_TEST_WORKS; i++)
        if (!works[i].owner) {
            works[i].owner = owner;
            works[i].work = work;
            works[i].climate = climate;
            return;
        }
    ck_abort_msg("more than %d test workspaces", MAX_TEST_WORKS);
}

static void drop_work(const void *owner)
{
    for (int i = 0; i < MAX_TEST_WORKS; i++)
        if (works[i].owner == owner) {
            if (works[i].climate)
                vl_climate_work_free(works[i].work);
            else
                vl_work_free(works[i].work);
            works[i].owner = NULL;
            works[i].work = NULL;
        }
}

vl_work *vl_test_work(const vl_model *m)
{
    vl_work *w = find_work(m);
    if (!w) {
        vl_status st;
        vl_status_clear(&st);
        w = vl_work_new(m, &st);
        ck_assert_msg(w != NULL, "vl_work_new: %s", st.msg);
        keep_work(m, w, 0);
    }
    return w;
}

void vl_test_model_free(vl_model *m)
{
    drop_work(m);
    vl_model_free(m);
}

vl_climate_work *vl_test_climate_work(const vl_climate *c)
{
    vl_climate_work *w = find_work(c);
    if (!w) {
        vl_status st;
        vl_status_clear(&st);
        w = vl_climate_work_new(c, &st);
        ck_assert_msg(w != NULL, "vl_climate_work_new: %s", st.msg);
        keep_work(c, w, 1);
    }
    return w;
}

void vl_test_climate_free(vl_climate *c)
{
    drop_work(c);
    vl_climate_free(c);
}

/* Process p with parameters params alone at (y, env) (see vl_test_process_rates). */
static void rates_alone(const vl_model *m, const vl_process *p, const void *params,
                        const double *y, const vl_env *env, double *dydt, double *cols)
{
    memset(dydt, 0, VL_NSTATE * sizeof dydt[0]);
    memset(cols, 0, p->ncolumns * sizeof cols[0]);
    vl_flux fx = {y, dydt, cols, 0, p->transfers, p->ntransfers, p->reactions, p->nreactions};
    vl_view v = {y, &m->planet, env};
    p->rates(params, &v, &fx);
}

const vl_process *vl_test_process_rates(const vl_model *m, const char *name, const double *y,
                                        const vl_env *env, double *dydt, double *cols)
{
    for (size_t i = 0; i < m->nproc; i++)
        if (strcmp(m->proc[i]->name, name) == 0) {
            rates_alone(m, m->proc[i], m->params[i], y, env, dydt, cols);
            return m->proc[i];
        }
    /* not in the model (switched off): the registry's, with the scenario's parameters */
    int k = vl_process_find(name);
    ck_assert_msg(k >= 0, "no process %s", name);
    rates_alone(m, vl_processes[k], m->sc->proc[k].params, y, env, dydt, cols);
    return vl_processes[k];
}

size_t vl_test_column(const vl_model *m, const char *name)
{
    for (size_t c = 0; c < m->ncolumns; c++)
        if (strcmp(m->col_name[c], name) == 0)
            return c;
    ck_abort_msg("no column %s", name);
    return 0;
}

static int keep_env(void *ctx, double t, const double *y, const double *dydt, const vl_env *env,
                    const double *columns, vl_status *st)
{
    (void)t, (void)y, (void)dydt, (void)columns, (void)st;
    *(vl_env *)ctx = *env;
    return VL_OK;
}

void vl_test_final_env(const char *rel, const char *const *sets, size_t n, vl_env *last,
                       double *y_final)
{
    vl_scenario *sc = vl_test_scenario(rel, sets, n);
    vl_model *m = vl_test_model(sc);
    vl_run_sink sink = {last, keep_env, NULL};
    vl_run_stats s;
    vl_status st;
    ck_assert_msg(vl_integrate(m, &sink, &s, &st) == VL_OK, "%s: %s", rel, st.msg);
    if (y_final)
        memcpy(y_final, s.y_final, sizeof s.y_final);
    vl_test_model_free(m);
    vl_scenario_free(sc);
}

double vl_test_summary_row(const char *text, const char *name)
{
    char key[96];
    snprintf(key, sizeof key, "\n%s,", name);
    const char *p = strstr(text, key);
    ck_assert_msg(p != NULL, "no row %s", name);
    return strtod(p + strlen(key), NULL);
}

double vl_test_summary_value(const char *dir, const char *rel, const char *name)
{
    char *text = vl_test_slurp(dir, rel, NULL);
    ck_assert_msg(text != NULL, "missing %s", rel);
    double v = vl_test_summary_row(text, name);
    free(text);
    return v;
}
