/* csv_file.c: a CSV file written through a temporary with the provenance lines
 * (csv_file.h). */
#include "csv_file.h"

#include <errno.h>
#include <string.h>
#include <unistd.h>

#include "volev/output.h"

FILE *vl_cli_csv_begin(const char *path, const vl_scenario *sc, char *tmp, size_t n,
                       vl_status *st)
{
    char hash[17];
    if (vl_output_scenario_hash(sc, hash, st) != VL_OK)
        return NULL;
    snprintf(tmp, n, "%s.tmp", path);
    FILE *f = fopen(tmp, "w");
    if (!f) {
        vl_fail(st, VL_ERR_IO, tmp, 0, "cannot write: %s", strerror(errno));
        return NULL;
    }
    fprintf(f, "# volev %s\n# resolved scenario hash (FNV-1a 64): %s\n", vl_version(), hash);
    return f;
}

int vl_cli_csv_commit(FILE *f, const char *tmp, const char *path, vl_status *st)
{
    if ((ferror(f) | fclose(f)) || rename(tmp, path) != 0) {
        unlink(tmp);
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot write: %s", strerror(errno));
    }
    return VL_OK;
}
