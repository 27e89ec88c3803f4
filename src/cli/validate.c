/* validate.c: `volev validate SCENARIO [--set KEY=VALUE]...`: load, check, build the
 * model (reads star tables), and list every resolved parameter with unit and origin. */
#include <stdio.h>

#include "args.h"
#include "cli.h"
#include "volev/model.h"
#include "volev/sweep.h"

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
    if (m && sc->sweep_line) { /* the sweep group is part of the file: check it too */
        vl_sweep *sw = vl_sweep_load(a.scenario, &st);
        if (sw)
            printf("# sweep: %ld members (volev sweep %s)\n", sw->members, a.scenario);
        vl_sweep_free(sw);
    }
    if (m && st.code == VL_OK) {
        vl_scenario_print(sc, stdout);
        printf("# %s: valid\n", a.scenario);
    }
    return vl_cli_finish(&a, sc, m, &st);
}
