/* path_name.c: the short name of a file or folder (path_name.h), shared by the labels
 * of compare and plot and the figure titles. */
#include "path_name.h"

#include <stdio.h>
#include <string.h>


void vl_cli_path_name(const char *path, const char *suffix, char *out, size_t n)
{
    char buf[4200]; /* as long as any folder argument plot keeps */
    snprintf(buf, sizeof buf, "%s", path);
    size_t len = strlen(buf);
    while (len > 1 && buf[len - 1] == '/')
        buf[--len] = '\0';
    size_t sl = suffix ? strlen(suffix) : 0;
    if (sl && len > sl && strcmp(buf + len - sl, suffix) == 0)
        buf[len - sl] = '\0';
    const char *slash = strrchr(buf, '/');
    snprintf(out, n, "%s", slash && slash[1] ? slash + 1 : buf);
}
