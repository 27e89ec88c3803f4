/* processes.c: `volev processes`: the parameter reference of every group and process. */
#include <stdio.h>

#include "cli.h"
#include "volev/scenario.h"

int vl_cli_processes(int argc, char **argv)
{
    if (argc > 1)
        return vl_cli_usage_error(argv[0], "takes no arguments (got '%s')", argv[1]);
    vl_params_print_reference(stdout);
    return VL_OK;
}
