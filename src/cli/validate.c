/* validate.c: `volev validate SCENARIO [--set KEY=VALUE]...`: load, check, build the
 * model (reads star tables), and list every resolved parameter with unit and origin. */
#include <stdio.h>

#include "args.h"
#include "cli.h"
#include "volev/model.h"

int vl_cli_validate(int argc, char **argv)
{
    vl_cli_args a;
    vl_status st;
    vl_scenario *sc;
    vl_model *m;
    if (vl_cli_start(argc, argv, 0, &a, &sc, &m, &st)) {
        vl_cli_args_free(&a);
        return VL_ERR_USAGE;
    }
    if (m) {
        vl_scenario_print(sc, stdout);
        printf("# %s: valid\n", a.scenario);
    }
    return vl_cli_finish(&a, sc, m, &st);
}
