/* validate.c: `volev validate SCENARIO [--set KEY=VALUE]...`: load, check, build the
 * model (reads star tables), and list every resolved parameter with unit and origin. */
#include <stdio.h>

#include "args.h"
#include "cli.h"
#include "volev/model.h"

int vl_cli_validate(int argc, char **argv)
{
    vl_cli_args a;
    int rc = vl_cli_parse_args(argc, argv, 0, &a);
    if (rc) {
        vl_cli_args_free(&a);
        return rc;
    }
    vl_status st;
    vl_scenario *sc;
    vl_model *m;
    vl_cli_load(&a, &sc, &m, &st);
    if (m) {
        vl_scenario_print(sc, stdout);
        printf("# %s: valid\n", a.scenario);
    }
    rc = st.code == VL_OK ? VL_OK : vl_cli_report(&st);
    vl_model_free(m);
    vl_scenario_free(sc);
    vl_cli_args_free(&a);
    return rc;
}
