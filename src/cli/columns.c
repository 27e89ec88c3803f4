/* columns.c: `volev columns`: the reference of every output column and summary row. */
#include <stdio.h>

#include "cli.h"
#include "volev/schema.h"

int vl_cli_columns(int argc, char **argv)
{
    if (argc > 1)
        return vl_cli_usage_error(argv[0], "takes no arguments (got '%s')", argv[1]);
    vl_schema_print_reference(stdout);
    return VL_OK;
}
