/* sweep_journal.c: what `volev sweep` knows of finished members (sweep_internal.h): a
 * compact record per member, and the journal DIR/sweep.journal -- every finished member
 * appended at once with exact numbers, read back by a rerun of the same command so that
 * only the missing members run. */
#include <errno.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include "sweep_internal.h"

/* Copies m into its record, unless the member is kept already. */
void vl_cli_sweep_keep(vl_cli_sweep_ctx *c, const vl_member *m)
{
    vl_cli_record *r = &c->rec[m->index];
    if (r->have)
        return;
    r->have = 1;
    r->status = m->status;
    r->regime = m->regime;
    r->cls = m->cls;
    r->steps = m->steps;
    memcpy(r->out, m->out, sizeof r->out);
    memcpy(r->water, m->water_to, sizeof r->water);
    memcpy(r->o2, m->o2_bar, sizeof r->o2);
    r->reason = m->status != 0 && m->reason[0] ? strdup(m->reason) : NULL;
    c->done++;
}

/* Record i as a vl_member (its reason only for a failed member). */
void vl_cli_sweep_unpack(const vl_cli_sweep_ctx *c, long i, vl_member *m)
{
    const vl_cli_record *r = &c->rec[i];
    memset(m, 0, sizeof *m);
    m->index = i;
    m->status = r->status;
    m->regime = r->regime;
    m->cls = r->cls;
    m->steps = r->steps;
    memcpy(m->out, r->out, sizeof r->out);
    memcpy(m->water_to, r->water, sizeof r->water);
    memcpy(m->o2_bar, r->o2, sizeof r->o2);
    if (r->reason)
        snprintf(m->reason, sizeof m->reason, "%s", r->reason);
}

/* Rank 0: a finished member's journal line into the journal and the records. */
void vl_cli_sweep_take_line(vl_cli_sweep_ctx *c, const char *line)
{
    vl_member m;
    if (vl_sweep_journal_parse(line, &m) != 0 || m.index >= c->sw->members)
        return;
    if (c->rec[m.index].have)
        return;
    if (!c->io_error && (fputs(line, c->journal) < 0 || fflush(c->journal) != 0)) {
        c->io_error = 1;
        snprintf(c->io_msg, sizeof c->io_msg, "%s/%s: cannot append: %s", c->dir, VL_CLI_JOURNAL,
                 strerror(errno));
    }
    vl_cli_sweep_keep(c, &m);
    vl_cli_sweep_progress(c, 0);
}

/* ------------------------------------------------------------------ resume */

/* The members of an interrupted sweep's journal at path (the same hash on its first
 * line, else an error: another sweep's journal is never mixed in); the journal is
 * truncated after the last complete line. A missing journal is a fresh start. */
static int read_journal(vl_cli_sweep_ctx *c, const char *path, vl_status *st)
{
    FILE *f = fopen(path, "r+");
    if (!f)
        return errno == ENOENT ? VL_OK
                               : vl_fail(st, VL_ERR_IO, path, 0, "cannot open: %s", strerror(errno));
    char *line = NULL;
    size_t cap = 0;
    ssize_t len;
    long good_end = 0, lineno = 0;
    int rc = VL_OK;
    while ((len = getline(&line, &cap, f)) > 0) {
        lineno++;
        if (lineno == 1) {
            char want[128];
            snprintf(want, sizeof want, "%s%s\n", VL_CLI_JOURNAL_TAG, c->sw->hash);
            if (strcmp(line, want) != 0) {
                rc = vl_fail(st, VL_ERR_INPUT, path, 1,
                             "this folder holds an interrupted sweep with other settings (or "
                             "another volev version); remove it or choose another -o");
                break;
            }
            good_end = ftell(f);
            continue;
        }
        vl_member m;
        if (vl_sweep_journal_parse(line, &m) != 0 || m.index >= c->sw->members)
            break; /* cut short by the interruption: drop it and what follows */
        vl_cli_sweep_keep(c, &m);
        good_end = ftell(f);
    }
    free(line);
    if (rc == VL_OK && lineno == 0)
        good_end = 0;
    if (rc == VL_OK && ftruncate(fileno(f), good_end) != 0)
        rc = vl_fail(st, VL_ERR_IO, path, 0, "cannot truncate: %s", strerror(errno));
    fclose(f);
    return rc;
}

/* The hash recorded in a finished members.csv (its second line), or "". */
static void finished_hash(const char *path, char out[17])
{
    out[0] = '\0';
    FILE *f = fopen(path, "r");
    if (!f)
        return;
    char line[512];
    for (int k = 0; k < 4 && fgets(line, sizeof line, f); k++) {
        const char *h = strstr(line, "sweep hash ");
        if (h && line[0] == '#') {
            snprintf(out, 17, "%.16s", h + 11);
            break;
        }
    }
    fclose(f);
}

/* Rank 0: output folder, earlier state. Returns VL_OK to go on, -1 if already finished. */
int vl_cli_sweep_prepare_dir(vl_cli_sweep_ctx *c, vl_status *st)
{
    char path[1200];
    if (mkdir(c->dir, 0777) != 0 && errno != EEXIST)
        return vl_fail(st, VL_ERR_IO, c->dir, 0, "cannot create folder: %s", strerror(errno));
    struct stat sb;
    if (stat(c->dir, &sb) != 0 || !S_ISDIR(sb.st_mode))
        return vl_fail(st, VL_ERR_IO, c->dir, 0, "not a folder");
    snprintf(path, sizeof path, "%s/members.csv", c->dir);
    if (access(path, F_OK) == 0) {
        char h[17];
        finished_hash(path, h);
        if (strcmp(h, c->sw->hash) == 0)
            return -1;
        return vl_fail(st, VL_ERR_IO, c->dir, 0,
                       "holds the results of another sweep; remove it or choose another -o");
    }
    snprintf(path, sizeof path, "%s/%s", c->dir, VL_CLI_JOURNAL);
    int rc = read_journal(c, path, st);
    if (rc)
        return rc;
    c->journal = fopen(path, "a");
    if (!c->journal)
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot write: %s", strerror(errno));
    if (ftell(c->journal) == 0 &&
        (fprintf(c->journal, "%s%s\n", VL_CLI_JOURNAL_TAG, c->sw->hash) < 0 || fflush(c->journal) != 0))
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot write: %s", strerror(errno));
    return VL_OK;
}
