/* processes.c: `volev processes`: the parameter reference of every group and process;
 * with --sources, the audit of their sources (docs/sources.md). */
#include <stdio.h>
#include <string.h>

#include "cli.h"
#include "volev/scenario.h"

int vl_cli_processes(int argc, char **argv)
{
    int sources = argc > 1 && strcmp(argv[1], "--sources") == 0;
    if (argc > 1 + sources)
        return vl_cli_usage_error(argv[0], "unexpected argument '%s'", argv[1 + sources]);
    if (sources)
        vl_params_print_sources(stdout);
    else
        vl_params_print_reference(stdout);
    return VL_OK;
}
