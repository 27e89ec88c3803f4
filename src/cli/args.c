/* args.c: the argument grammar shared by run and validate:
 * SCENARIO [-o DIR] [--set KEY=VALUE]... */
#include "args.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "cli.h"
#include "volev/model.h"

/* What the arguments must hold together: a scenario; --replace only with -o. */
static int check_args(const char *cmd, const vl_cli_args *a)
{
    if (!a->scenario)
        return vl_cli_usage_error(cmd, "missing SCENARIO file");
    if (a->replace && !a->out)
        return vl_cli_usage_error(cmd, "--replace needs -o DIR (without it the folder is new)");
    return 0;
}

int vl_cli_parse_args(int argc, char **argv, int allow_out, vl_cli_args *a)
{
    const char *cmd = argv[0];
    memset(a, 0, sizeof *a);
    a->sets = calloc((size_t)argc, sizeof *a->sets);
    if (!a->sets)
        return vl_cli_usage_error(cmd, "out of memory");
    for (int i = 1; i < argc; i++) {
        const char *s = argv[i];
        if (strcmp(s, "--set") == 0 || strcmp(s, "-s") == 0) {
            if (i + 1 >= argc)
                return vl_cli_usage_error(cmd, "%s needs KEY=VALUE", s);
            if (!strchr(argv[i + 1], '=') || argv[i + 1][0] == '=')
                return vl_cli_usage_error(cmd, "%s '%s': expected KEY=VALUE", s, argv[i + 1]);
            a->sets[a->nsets++] = argv[++i];
        } else if (allow_out && (strcmp(s, "-o") == 0 || strcmp(s, "--output") == 0)) {
            if (i + 1 >= argc)
                return vl_cli_usage_error(cmd, "%s needs a folder", s);
            a->out = argv[++i];
        } else if (allow_out == 2 && strcmp(s, "--replace") == 0) {
            a->replace = 1;
        } else if (s[0] == '-' && s[1] != '\0') {
            return vl_cli_usage_error(cmd, "unknown option '%s'", s);
        } else if (a->scenario) {
            return vl_cli_usage_error(cmd, "more than one scenario ('%s' and '%s')", a->scenario, s);
        } else {
            a->scenario = s;
        }
    }
    return check_args(cmd, a);
}

void vl_cli_args_free(vl_cli_args *a) { free(a->sets); }

int vl_cli_start(int argc, char **argv, int allow_out, vl_cli_args *a, vl_scenario **sc,
                 vl_model **m, vl_status *st)
{
    vl_status_clear(st);
    *sc = NULL;
    *m = NULL;
    int rc = vl_cli_parse_args(argc, argv, allow_out, a);
    if (rc)
        return rc;
    *sc = vl_scenario_load(a->scenario, a->sets, a->nsets, st);
    *m = *sc ? vl_model_new(*sc, st) : NULL;
    /* the scenario's warnings, once it is known to be usable (an error stays one line) */
    for (int k = 0; *m && k < (*sc)->nwarnings && k < VL_SCENARIO_WARNINGS; k++)
        fprintf(stderr, "volev: warning: %s: %s\n", a->scenario, (*sc)->warnings[k]);
    return 0;
}

int vl_cli_finish(vl_cli_args *a, vl_scenario *sc, vl_model *m, const vl_status *st)
{
    int rc = st->code == VL_OK ? VL_OK : vl_cli_report(st);
    vl_model_free(m);
    vl_scenario_free(sc);
    vl_cli_args_free(a);
    return rc;
}

/* Parse and remove "--age-yr AGE" from argv; 0, or VL_ERR_USAGE (printed). */
int vl_cli_take_age(int *argc, char **argv, double *age_yr, int *given)
{
    *given = 0;
    for (int i = 1; i < *argc; i++) {
        if (strcmp(argv[i], "--age-yr") != 0)
            continue;
        char *end;
        if (i + 1 >= *argc)
            return vl_cli_usage_error(argv[0], "--age-yr needs a stellar age in years");
        *age_yr = strtod(argv[i + 1], &end);
        if (*end || !(*age_yr > 0.0) || !isfinite(*age_yr))
            return vl_cli_usage_error(argv[0], "--age-yr '%s': expected a positive number of years",
                                      argv[i + 1]);
        *given = 1;
        memmove(&argv[i], &argv[i + 2], (size_t)(*argc - i - 2) * sizeof *argv);
        *argc -= 2;
        i--;
    }
    return 0;
}
