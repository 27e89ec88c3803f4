/* path_name.h: the short name of a file or folder for labels and titles (path_name.c). */
#ifndef VOLEV_CLI_PATH_NAME_H
#define VOLEV_CLI_PATH_NAME_H

#include <stddef.h>

/* The last component of path, trailing '/' removed and, when suffix is not NULL and
 * ends it, that suffix too ("runs/wet/" -> "wet"; "scenarios/demo.cfg" with ".cfg" ->
 * "demo"). */
void vl_cli_path_name(const char *path, const char *suffix, char *out, size_t n);

#endif
