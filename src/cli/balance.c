/* balance.c: `volev balance SCENARIO [--age-yr AGE] [-o DIR] [--set KEY=VALUE]...`:
 * the energy-balance curves (OLR, absorbed flux, albedo, stratospheric water against
 * surface temperature) of the scenario's initial atmosphere around its star at AGE,
 * written to DIR/balance.csv for plots/balance.gp -- the figure that shows where a
 * runaway begins. */
#include <errno.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>

#include "args.h"
#include "cli.h"
#include "csv_file.h"
#include "volev/model.h"
#include "volev/output.h"
#include "volev/units.h"

/* Write the curves and the equilibria they imply (stable: absorbed falls through OLR). */
static int write_curves(const char *path, const vl_model *m, const vl_env *env, int wet,
                        const vl_curve *cv, size_t n, vl_status *st)
{
    char tmp[VL_PATH_MAX + 64];
    FILE *f = vl_cli_csv_begin(path, m->sc, tmp, sizeof tmp, st);
    if (!f)
        return st->code;
    fprintf(f, "# stellar age %.6g yr: instellation %.6g W/m^2 (s_eff %.6g), Teff %.6g K\n",
            env->t_s / VL_YR, env->instellation, env->s_eff, env->star.teff_k);
    fprintf(f, "# dry atmosphere: CO2 %.6g bar, N2 %.6g bar, O2 %.6g bar, H2 %.6g bar (alone); %s\n",
            env->mass_kg[VL_GAS_CO2] * m->planet.pa_per_kg / VL_BAR,
            env->mass_kg[VL_GAS_N2] * m->planet.pa_per_kg / VL_BAR,
            env->mass_kg[VL_GAS_O2] * m->planet.pa_per_kg / VL_BAR,
            env->mass_kg[VL_GAS_H2] * m->planet.pa_per_kg / VL_BAR, wet ? "over an ocean" : "no water");
    fprintf(f, "# runaway threshold s_eff %.6g; moist-greenhouse threshold s_eff %.6g\n",
            cv->s_runaway, cv->s_moist);
    fprintf(f, "# stable equilibria (K):");
    int any = 0;
    for (size_t j = 0; j + 1 < n; j++) {
        double a = cv->absorbed[j] - cv->olr[j], b = cv->absorbed[j + 1] - cv->olr[j + 1];
        if (a > 0.0 && b <= 0.0) {
            fprintf(f, " %.2f", cv->t_k[j] + (cv->t_k[j + 1] - cv->t_k[j]) * a / (a - b));
            any = 1;
        }
    }
    fprintf(f, "%s\n", any ? "" : " none (absorbed exceeds OLR everywhere: runaway)");
    fprintf(f, "surface_temp_k,olr_w_m2,absorbed_w_m2,net_w_m2,albedo,strat_h2o\n");
    for (size_t j = 0; j < n; j++) { /* the output number rule (vl_output_number) */
        vl_output_put(f, "", "%.6g", cv->t_k[j]);
        vl_output_put(f, ",", "%.8g", cv->olr[j]);
        vl_output_put(f, ",", "%.8g", cv->absorbed[j]);
        vl_output_put(f, ",", "%.8g", cv->absorbed[j] - cv->olr[j]);
        vl_output_put(f, ",", "%.6g", cv->albedo[j]);
        vl_output_put(f, ",", "%.6g", cv->f_strat[j]);
        fputc('\n', f);
    }
    return vl_cli_csv_commit(f, tmp, path, st);
}

/* Default folder: NAME-balance, or NAME-balance.1, ... if taken. */
static void default_dir(const vl_scenario *sc, char *buf, size_t n)
{
    struct stat sb;
    snprintf(buf, n, "%s-balance", sc->name);
    for (int k = 1; k < 10000 && stat(buf, &sb) == 0; k++)
        snprintf(buf, n, "%s-balance.%d", sc->name, k);
}

int vl_cli_balance(int argc, char **argv)
{
    double age_yr = 0.0;
    int given;
    if (vl_cli_take_age(&argc, argv, &age_yr, &given))
        return VL_ERR_USAGE;
    vl_cli_args a;
    vl_status st;
    vl_scenario *sc;
    vl_model *m;
    vl_cli_cache_start();
    if (vl_cli_start(argc, argv, 1, &a, &sc, &m, &st)) {
        vl_cli_args_free(&a);
        return VL_ERR_USAGE;
    }
    char dir[VL_PATH_MAX], path[VL_PATH_MAX + 16];
    if (m) {
        const vl_run_params *rp = &sc->run;
        double t = given ? age_yr * VL_YR : rp->start_s;
        if (t < rp->start_s || t > rp->end_s)
            vl_fail(&st, VL_ERR_USAGE, NULL, 0,
                    "balance: --age-yr %.6g is outside the run's ages [%.6g, %.6g] yr", age_yr,
                    rp->start_s / VL_YR, rp->end_s / VL_YR);
        double y[VL_NSTATE];
        vl_model_initial_state(m, y);
        int wet = y[VL_R_WATER] >= sc->climate.dry_threshold_kg;
        vl_env env;
        vl_curve *cv = malloc(sizeof *cv);
        size_t n = 0;
        if (st.code == VL_OK && !cv)
            vl_fail(&st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        vl_work *w = st.code == VL_OK ? vl_work_new(m, &st) : NULL;
        if (st.code == VL_OK) {
            vl_model_env(m, w, t, y, wet ? VL_REGIME_TEMPERATE : VL_REGIME_DRY, &env);
            n = vl_climate_curve(m->climate, vl_work_climate(w), &env, wet, NULL, 0, cv);
            if (n == 0)
                vl_fail(&st, VL_ERR_INPUT, sc->path, 0,
                        "balance needs climate.model = \"column\" (the habitable-zone fits have "
                        "no OLR curve)");
        }
        if (st.code == VL_OK) {
            if (a.out)
                snprintf(dir, sizeof dir, "%s", a.out);
            else
                default_dir(sc, dir, sizeof dir);
            if (mkdir(dir, 0777) != 0 && errno != EEXIST)
                vl_fail(&st, VL_ERR_IO, dir, 0, "cannot create output folder: %s", strerror(errno));
        }
        if (st.code == VL_OK) {
            snprintf(path, sizeof path, "%s/balance.csv", dir);
            if (write_curves(path, m, &env, wet, cv, n, &st) == VL_OK)
                printf("output: %s\n", dir);
        }
        vl_work_free(w);
        free(cv);
    }
    vl_cli_cache_finish();
    return vl_cli_finish(&a, sc, m, &st);
}
